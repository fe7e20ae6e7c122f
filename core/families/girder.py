"""What the families' girder limit states share: the compression flange of a station, the
unbraced segment and its moment diagram, the U-frame chord (once per member), the web at
the knife line, the flange at a bearing, the least of the flexural limit states, and the
limit state rows of a girder end and of fatigue.

Conventions (asfound's, stated on the assumptions page):

- The compression flange is the top one in sagging, the bottom one in hogging: the sign of
  the dead load moment at the station (:attr:`StationContext.compression`).
- Brace points: the supports always, plus the recorded bracing of the compression flange;
  not recorded: held at the supports only (conservative).
- The moment diagram of a segment is the family's factored design moment envelope at its
  ends, quarter points and middle (the envelope's values at the segment's ends are never
  below a single load position's, so the moment gradient factor comes out low:
  conservative). Without member loads (station loads only) the factor is 1.0.
- U-frames: the chord's elastic critical force is found once per member and state, as-built
  with the nominal chord and as-found with the weakest station's chord over the whole
  length (conservative).
- The web at the knife line: the least of the station's whole-web readings and of the loss
  bands of the web's lower half (where a bottom bearing loads it); a perforation there
  means the web at the bearing cannot be counted on.
"""

from __future__ import annotations

from collections.abc import Callable, Sequence
from functools import partial

from core.assess.details import BracingData, StiffenerData, SupportData
from core.assess.results import LimitState
from core.checks import web_bearing
from core.checks.compression_zone import CompressionFlange, compression_flange
from core.checks.elastic_support import SpringColumn, critical_load, u_frame_stiffness
from core.checks.flags import Flag, Level
from core.checks.results import CapacityResult
from core.checks.stiffener_section import stiffener_section
from core.errors import AsfoundError, InputError
from core.families.context import StationContext, capped, part_thickness
from core.parts import Angle, Plate


def state_of(ctx: StationContext, label: str):
    return ctx.built if label == "built" else ctx.found


def _flange(ctx: StationContext, section, where: str) -> CompressionFlange:
    """The compression flange of a section for the station's sense of bending, the web's
    depth in compression ending at the angles' toes."""
    return compression_flange(
        section.gross,
        y_limit=ctx.web.y_toes[1] if ctx.compression == "top" else ctx.web.y_toes[0],
        compression=ctx.compression,
        web=ctx.web.web_id,
        flange_parts=ctx.compression_parts,
        tension_parts=ctx.tension_parts,
        where=where,
    )


def flange_of(ctx: StationContext, label: str) -> CompressionFlange:
    """The compression flange of the station in state ``label`` (cached per station; the
    as-built one, the same at every station of the member, once per member and sense)."""
    key = ("cf", "" if label == "built" else ctx.station, label, ctx.compression)
    if key not in ctx.cache:
        w = f"{ctx.where} / compression flange ({label})"
        ctx.cache[key] = _flange(ctx, state_of(ctx, label), w)
    return ctx.cache[key]


def bracing(ctx: StationContext) -> BracingData | None:
    return None if ctx.setup is None else ctx.setup.details.bracing(ctx.compression)


def segment(ctx: StationContext) -> tuple[float, float, str]:
    """The unbraced segment (a, b) holding the station, mm, and its words."""
    br = bracing(ctx)
    if br is None:
        return 0.0, ctx.span, "held at the member's ends only (no details)"
    a, b = br.segment(ctx.x)
    return a, b, br.words


def segment_moments(ctx: StationContext, a: float, b: float, n: int = 4) -> list[float] | None:
    """Design moments (N mm, magnitudes) at n + 1 equal points of the segment a..b, or None
    without member loads."""
    if ctx.setup is None:
        return None
    out = []
    for i in range(n + 1):
        m = ctx.setup.moment(a + (b - a) * i / n)
        if m is None:
            return None
        out.append(abs(m))
    return out


def frame_springs(ctx: StationContext, label: str) -> tuple[tuple[float, float], ...]:
    """(position from the first support, Cd) of each U-frame of the compression flange."""
    br = bracing(ctx)
    fr = br.frames if br is not None else None
    if fr is None:
        return ()
    if fr.Cd is not None:
        return tuple((x, fr.Cd) for x in fr.x)
    Iv = fr.Iv
    if Iv is None:
        st: StiffenerData = fr.vertical  # type: ignore[assignment]
        loss = None if label == "built" else st.column_loss
        Iv = stiffener_section(st.engine, tw=ctx.tw_nominal, loss=loss).props.Ix
    Cd, _ = u_frame_stiffness(
        E=ctx.material.E, Iv=Iv, hv=fr.hv, Iq=fr.Iq, bq=fr.bq, Cj=fr.Cj, where=ctx.where
    )
    return tuple((x, Cd) for x in fr.x)


def weakest_chord(ctx: StationContext, label: str) -> tuple[CompressionFlange, str]:
    """The chord for the U-frame check: as built, or the as-found station with the least
    lateral inertia of the chord (once per member)."""
    key = ("chord", label, ctx.compression)
    if key in ctx.cache:
        return ctx.cache[key]
    if label == "built" or ctx.setup is None or not ctx.setup.found:
        sections = {ctx.station: state_of(ctx, label)}
    else:
        sections = dict(ctx.setup.found)
    best = None
    for sid, st in sections.items():
        cf = _flange(ctx, st, f"{ctx.where} / U-frame chord")
        if best is None or cf.Iy_rt < best[0].Iy_rt:
            best = (cf, sid)
    assert best is not None
    ctx.cache[key] = best
    return best


def chord_column(ctx: StationContext, label: str) -> tuple[SpringColumn, CompressionFlange, str]:
    """The chord's elastic critical force on the U-frames, once per member and state."""
    key = ("uframe", label, ctx.compression)
    if key not in ctx.cache:
        cf, sid = weakest_chord(ctx, label)
        d = ctx.setup.details if ctx.setup else None
        L = (d.span_b - d.span_a) if d else ctx.span
        col = critical_load(
            EI=ctx.material.E * cf.Iy_rt,
            L=L,
            springs=frame_springs(ctx, label),
            where=f"{ctx.where} / U-frames",
        )
        ctx.cache[key] = (col, cf, sid)
    return ctx.cache[key]


def chord_words(sid: str, label: str) -> str:
    if label == "built":
        return "the nominal chord"
    return f"the weakest as-found chord of the member (station {sid}) over the whole length"


def knife_line(ctx: StationContext) -> tuple[float, str, bool]:
    """(tw, words, perforated) of the web where a bottom bearing loads it (mm)."""
    web = ctx.web.web_id
    lo = ctx.web.y_toes[0]
    hi = 0.5 * (ctx.web.y_toes[0] + ctx.web.y_toes[1])
    loss = ctx.loss_local
    tw = part_thickness(loss, ctx.defn, web)
    words = f"least whole-web reading {tw:.3g} mm"
    for b in loss.bands:
        if b.part == web and b.hi > lo and b.lo < hi and b.t < tw:
            tw = b.t
            words = f"loss band {b.lo:.0f} to {b.hi:.0f} mm above the section's base, {b.t:.3g} mm"
    perf = any(p.part == web and p.hi > lo and p.lo < hi for p in loss.perforations)
    if perf:
        words += "; perforated"
    return tw, words, perf


def bottom_flange(ctx: StationContext, label: str) -> tuple[float, float]:
    """(bf, tf) of the bottom flange a bearing loads, mm: its widest part, and the stack of
    its horizontal material (cover plates and the angles' horizontal legs) at the
    thickness of the state."""
    loss = None if label == "built" else ctx.loss_local
    bf, tf_plates, tf_leg = 0.0, 0.0, 0.0
    for pid in ctx.web.bottom_parts:
        p = ctx.defn.part(pid)
        x0, _, x1, _ = p.bounds
        bf = max(bf, x1 - x0)
        if isinstance(p, Plate) and p.orientation == "horizontal":
            tf_plates += p.t if loss is None else part_thickness(loss, ctx.defn, pid)
        elif isinstance(p, Angle):
            t = p.t if loss is None else part_thickness(loss, ctx.defn, pid, "h")
            tf_leg = max(tf_leg, t)
    return bf, tf_plates + tf_leg


def least_flexure(
    ctx: StationContext, done: Sequence[LimitState], keys: Sequence[str], family_words: str
) -> list[LimitState]:
    """The flexural resistance as the least of the flexural limit states ``keys`` found at
    the station (each then marked ``part_of="flexure"``): the rating uses this one."""
    parts = [ls for ls in done if ls.key in keys and ls.C_found is not None]
    if not parts:
        return []
    gf = min(parts, key=lambda ls: ls.R_effect if ls.R_effect is not None else ls.C_found)
    gb = min((ls for ls in parts if ls.C_built is not None), key=lambda ls: ls.C_built, default=gf)
    listing = ", ".join(ls.name for ls in parts)
    note = (
        f"least of the flexural limit states ({family_words}: {listing}): {gf.name} "
        "governs as found" + ("" if gb is gf else f", {gb.name} as built")
    )
    ls = LimitState(
        "flexure",
        f"flexure ({gf.name} governs)",
        "moment",
        gb.built,
        gf.found,
        gb.C_built,
        gf.C_found,
        note=note,
        effect="M",
        flexural=True,
        R_effect=gf.R_effect,
        least_of=tuple(p.key for p in parts),
    )
    return [capped(ls)]


EndCheck = Callable[[], CapacityResult]


def end_state(
    ctx: StationContext,
    sup: SupportData,
    key: str,
    name: str,
    built: EndCheck,
    found: EndCheck,
    note: str,
    *,
    axial: bool = False,
    gone: str = "",
) -> LimitState:
    """A girder end limit state at support ``sup``: the two results, the rating against the
    support reaction. ``found`` raising an input error of the measured loss (an element
    gone) gives no as-found resistance (0, said so) rather than stopping the assessment."""
    b = built()
    flags: tuple[Flag, ...] = ()
    try:
        f = found()
        Cf = f.Rr
    except AsfoundError as e:
        f, Cf = None, 0.0
        note = f"{note}; as found: {gone or str(e)}: no resistance counted"
        flags = (
            Flag(
                Level.URGENT,
                f"{ctx.where} / {name}",
                f"{Level.URGENT.label}: {gone or str(e)}: no resistance counted",
            ),
        )
    eff = ctx.setup.support_effects.get(sup.id) if ctx.setup else None
    ls = LimitState(
        f"{key}:{sup.id}",
        name,
        "force",
        b,
        f,
        b.Rr,
        Cf,
        note=note,
        effect="V",
        flexural=axial,
        R_effect=Cf,
        at=eff,
        flags=flags,
    )
    return capped(ls)


def web_at_bearing(
    ctx: StationContext,
    sup: SupportData,
    family: str,
    phi_y: float,
    phi_c: float,
    had_stiffener: bool,
) -> list[LimitState]:
    """Web local yielding and crippling (``family`` "aashto" or "aisc" of
    :mod:`core.checks.web_bearing`) at a bearing without an effective stiffener, on the web
    at the knife line; k and tf are the bottom flange's horizontal material (conservative)."""
    m = ctx.material
    w = f"{ctx.where} / support {sup.id}"
    tw_k, tw_words, perf = knife_line(ctx)
    why = (
        "the bearing stiffener is not effective as found"
        if had_stiffener
        else "no bearing stiffener recorded"
    )
    note = (
        f"{why}; web at the knife line: {tw_words}; N = {sup.N:.4g} mm; k and tf: the bottom "
        "flange's horizontal material (conservative)"
    )

    def run(key: str, label: str) -> CapacityResult:
        if label == "found" and perf:
            raise InputError("the web at the bearing is perforated", where=w)
        tw = ctx.tw_nominal if label == "built" else tw_k
        _, tf = bottom_flange(ctx, label)
        kw = dict(
            Fyw=m.Fy,
            tw=tw,
            N=sup.N,
            d=ctx.web.d_overall,
            x=sup.overhang,
            family=family,
            where=f"{w} / {key} ({label})",
        )
        if key == "web_yielding":
            return web_bearing.web_local_yielding(k=tf, phi=phi_y, **kw)
        return web_bearing.web_crippling(E=m.E, tf=tf, phi=phi_c, **kw)

    return [
        end_state(
            ctx,
            sup,
            key,
            f"{name} (support {sup.id})",
            partial(run, key, "built"),
            partial(run, key, "found"),
            note,
            gone="the web at the bearing is perforated" if perf else "",
        )
        for key, name in (
            ("web_yielding", "web local yielding"),
            ("web_crippling", "web crippling"),
        )
    ]


StiffenerCheck = Callable[[StationContext, StiffenerData, object, float, str], CapacityResult]
WebCheck = Callable[[StationContext, SupportData, bool], list[LimitState]]


def girder_ends(
    ctx: StationContext, bearing: StiffenerCheck, column: StiffenerCheck, web: WebCheck
) -> list[LimitState]:
    """The girder end limit states of the supports the station takes: the bearing stiffener
    in bearing and as a column (``bearing``, ``column``: the family's clauses, called with
    the stiffener, its loss, the web thickness and the place), and where no stiffener is
    recorded or it is not effective as found (no bearing resistance left), the family's web
    checks (``web``)."""
    out: list[LimitState] = []
    tw_k, _, _ = knife_line(ctx)
    for sup in ctx.supports:
        st = sup.stiffener
        effective = False
        if st is not None:
            w = f"{ctx.where} / support {sup.id} / stiffener {st.id}"
            note = f"{sup.stiffener_words}; end loss: {st.loss_words}"
            b, c = (
                end_state(
                    ctx,
                    sup,
                    key,
                    f"stiffener {what}: {st.id} at support {sup.id}",
                    partial(fn, ctx, st, None, ctx.tw_nominal, f"{w} {what}"),
                    partial(fn, ctx, st, loss, tw_k, f"{w} {what} (as found)"),
                    note,
                    axial=axial,
                    gone=gone,
                )
                for key, what, fn, loss, axial, gone in (
                    (
                        "stiffener_bearing",
                        "bearing",
                        bearing,
                        st.bearing_loss,
                        False,
                        f"the bottom end of stiffener {st.id} is lost",
                    ),
                    (
                        "stiffener_column",
                        "column",
                        column,
                        st.column_loss,
                        True,
                        f"stiffener {st.id} is lost",
                    ),
                )
            )
            out += [b, c]
            effective = bool(b.C_found and b.C_found > 0.0)
        if not effective:
            out += web(ctx, sup, st is not None)
    return out
