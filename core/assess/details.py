"""A member's girder details as the engine takes them (mm, N): stiffeners with their
measured end loss, supports, the bracing of each flange and the web panels between the
stiffeners. Built once per member (:func:`member_details`).

How a stiffener's readings become its loss (:class:`core.checks.stiffener_section.EndLoss`):
the readings over the whole stiffener give the remaining thickness of its projecting elements
and of its connected legs (mean or least of the readings, as the thickness basis of the
assessment says; capped at nominal); each loss band its own thickness (entered, or from its
readings) and the width lost at the toes. The bearing check takes the loss at the bottom end
(the whole-stiffener readings and the bands that start at the bottom), the column check the
weakest of all over the whole length (as :mod:`core.checks.stiffener_section` describes).
"""

from __future__ import annotations

import itertools
import statistics
from dataclasses import dataclass, field

from core.checks.stiffener_section import EndLoss
from core.checks.stiffener_section import Stiffener as EngineStiffener
from core.errors import InputError
from core.errors import where as join
from core.survey.details import FlangeBracing, Stiffener, Support
from core.survey.model import Member
from core.units import to_internal

#: a band that starts within this height of the bottom end acts at the bearing (mm)
AT_BOTTOM = 1.0


@dataclass(frozen=True)
class StiffenerData:
    """One stiffener in mm, with its loss.

    Attributes:
        record: the survey's record. x: position along the member. engine: the
        stiffener as built. clip: corner clip. bearing_loss, column_loss: the measured
        loss at the bottom end and the weakest over its length (None: as built).
        loss_words: what the loss is, in words (the survey's length unit). warnings:
        readings capped at nominal. bands: (lo, hi) of each loss band above the bottom
        end, mm. whole: the whole-stiffener readings show loss.
    """

    record: Stiffener
    x: float
    engine: EngineStiffener
    clip: float
    bearing_loss: EndLoss | None
    column_loss: EndLoss | None
    loss_words: str
    warnings: tuple[str, ...] = ()
    bands: tuple[tuple[float, float], ...] = ()
    whole: bool = False

    @property
    def id(self) -> str:
        return self.record.id

    @property
    def role(self) -> str:
        return self.record.role


@dataclass(frozen=True)
class SupportData:
    """A support in mm: position, bearing length N, the girder beyond the bearing's centre,
    and its bearing stiffener (None: none recorded over it)."""

    id: str
    x: float
    N: float
    overhang: float
    stiffener: StiffenerData | None
    stiffener_words: str


@dataclass(frozen=True)
class Frames:
    """U-frames of a flange: positions (mm from the first support) and, per frame, the
    entered spring stiffness Cd (N/mm) or the data to compute it."""

    x: tuple[float, ...]
    Cd: float | None
    vertical: StiffenerData | None
    Iv: float | None
    hv: float | None
    Iq: float | None
    bq: float | None
    Cj: float | None


@dataclass(frozen=True)
class BracingData:
    """The bracing of one flange: kind, brace points (mm, sorted, the supports included),
    U-frames, whether it was recorded, and in words."""

    kind: str
    points: tuple[float, ...]
    frames: Frames | None
    recorded: bool
    words: str

    def segment(self, x: float) -> tuple[float, float]:
        """The unbraced segment (a, b) that holds x (mm)."""
        pts = self.points
        for a, b in itertools.pairwise(pts):
            if a - 1e-6 <= x <= b + 1e-6:
                return a, b
        return pts[0], pts[-1]


@dataclass(frozen=True)
class MemberDetails:
    """Everything of a member's girder details, once per member (mm)."""

    stiffeners: tuple[StiffenerData, ...]
    supports: tuple[SupportData, ...]
    top: BracingData
    bottom: BracingData
    span_a: float
    span_b: float
    ADTT_SL: float | None
    recorded_stiffeners: bool
    warnings: tuple[str, ...] = field(default=())

    @property
    def intermediate(self) -> tuple[StiffenerData, ...]:
        return tuple(s for s in self.stiffeners if s.role == "intermediate")

    def bracing(self, compression: str) -> BracingData:
        return self.top if compression == "top" else self.bottom

    def stiffener(self, ident: str) -> StiffenerData | None:
        return next((s for s in self.stiffeners if s.id == ident), None)


def _stat(
    vals: list[float], policy: str, nominal: float, what: str, warn: list[str]
) -> float | None:
    """The least or the mean of readings ``vals`` (mm), each capped at ``nominal`` first (a
    reading above nominal never raises the mean: the conservative reading of a slip)."""
    if not vals:
        return None
    over = [v for v in vals if v > nominal * (1.0 + 1e-9)]
    if over:
        warn.append(
            f"{what}: {len(over)} reading(s) above the nominal {nominal:.4g} mm (largest "
            f"{max(over):.4g} mm), each capped at nominal"
        )
    capped = [min(v, nominal) for v in vals]
    return min(capped) if policy == "minimum" else statistics.fmean(capped)


def _capped(t: float | None, nominal: float, what: str, warn: list[str]) -> float | None:
    if t is not None and t > nominal * (1.0 + 1e-9):
        warn.append(f"{what} {t:.4g} mm is above the nominal {nominal:.4g} mm: capped at nominal")
        return nominal
    return t


def stiffener_data(member: Member, rec: Stiffener, policy: str, height_all: float) -> StiffenerData:
    """One stiffener record in mm with its loss (``height_all``: the height the
    whole-stiffener readings stand for, mm).

    Raises:
        InputError / UnitError: dimensions or readings that cannot be used (with the place).
    """
    w = member.place(None, f"stiffener {rec.id!r}")
    lu = member.length_unit
    f = to_internal(1.0, lu, "length", where=w)
    if rec.kind == "angles" and rec.b_conn is None:
        raise InputError("an angle stiffener needs its connected leg b_conn", where=w)
    eng = EngineStiffener(
        rec.kind,
        rec.b * f,
        rec.t * f,
        (rec.b_conn or 0.0) * f if rec.kind == "angles" else 0.0,
        rec.per_side,
        rec.sides,
        rec.t_fill * f,
        rec.fillers_carry_load,
        rec.id,
    )
    warn: list[str] = []
    bands = {b.id: b for b in rec.bands}
    groups: dict[tuple[str, str | None], list[float]] = {}
    for r in rec.readings:
        if r.band is not None and r.band not in bands:
            raise InputError(
                f"reading {r.id!r} names band {r.band!r}; the stiffener's bands: {sorted(bands)}",
                where=w,
            )
        groups.setdefault((r.element, r.band), []).append(
            to_internal(r.value, r.unit, "length", where=join(w, f"reading {r.id!r}"))
        )
    t_nom = eng.t
    tp = _stat(groups.get(("projecting", None), []), policy, t_nom, "projecting t", warn)
    tc = _stat(groups.get(("connected", None), []), policy, t_nom, "connected t", warn)
    if tc is not None and rec.kind == "plates":
        raise InputError("readings of connected legs apply to angle stiffeners only", where=w)
    words = []

    def u(v: float) -> str:
        return f"{v / f:.3g} {lu}"

    if tp is not None or tc is not None:
        words.append(
            "whole stiffener: "
            + ", ".join(f"{n} {u(v)}" for n, v in (("t", tp), ("t_conn", tc)) if v is not None)
        )
    cands = []  # (lo, hi, t, t_conn, b_lost)
    for b in rec.bands:
        wb = join(w, f"band {b.id!r}")
        if not b.hi > b.lo:
            raise InputError(f"hi = {b.hi:g} {lu} must be above lo = {b.lo:g} {lu}", where=wb)
        bt = (
            b.t * f
            if b.t is not None
            else _stat(
                groups.get(("projecting", b.id), []), policy, t_nom, f"band {b.id!r} t", warn
            )
        )
        bc = (
            b.t_conn * f
            if b.t_conn is not None
            else _stat(
                groups.get(("connected", b.id), []), policy, t_nom, f"band {b.id!r} t_conn", warn
            )
        )
        bt = _capped(bt, t_nom, f"band {b.id!r} t", warn)
        bc = _capped(bc, t_nom, f"band {b.id!r} t_conn", warn)
        if bc is not None and rec.kind == "plates":
            raise InputError("t_conn applies to angle stiffeners only", where=wb)
        cands.append((b.lo * f, b.hi * f, bt, bc, b.b_lost * f))
        parts = [f"{b.lo:g} to {b.hi:g} {lu} above the bottom"]
        parts += [f"{n} {u(v)}" for n, v in (("t", bt), ("t_conn", bc)) if v is not None]
        if b.b_lost:
            parts.append(f"{b.b_lost:g} {lu} lost at the toes")
        words.append(f"band {b.id}: " + ", ".join(parts))

    def loss(sel: list[tuple]) -> EndLoss | None:
        ts = [tp] + [c[2] for c in sel]
        tcs = [tc] + [c[3] for c in sel]
        ts_ = [t for t in ts if t is not None]
        tcs_ = [t for t in tcs if t is not None]
        bl = max([c[4] for c in sel], default=0.0)
        if not ts_ and not tcs_ and bl == 0.0:
            return None
        height = max([c[1] for c in sel], default=0.0) or height_all
        if tp is not None:
            height = max(height, height_all)
        return EndLoss(
            height,
            min(ts_) if ts_ else None,
            min(tcs_) if tcs_ else None,
            bl,
            where=w,
        )

    bottom = [c for c in cands if c[0] <= AT_BOTTOM]
    return StiffenerData(
        rec,
        to_internal(rec.position, member.position_unit, "length", where=w),
        eng,
        rec.clip * f,
        loss(bottom),
        loss(cands),
        "; ".join(words) or "no readings: as built",
        tuple(warn),
        tuple((c[0], c[1]) for c in cands),
        any(t is not None and t < t_nom for t in (tp, tc)),
    )


def _named(by_id: dict[str, StiffenerData], ident: str, what: str, w: str) -> StiffenerData:
    """The stiffener ``ident`` of the member.

    Raises:
        InputError: no such stiffener (the message lists the member's).
    """
    st = by_id.get(ident)
    if st is None:
        raise InputError(
            f"{what} {ident!r} is not a stiffener of the member; known: {sorted(by_id)}",
            where=w,
        )
    return st


def _q(q, kind: str, w: str) -> float | None:
    return None if q is None else q.to(kind, w)


def _bracing(
    member: Member,
    fb: FlangeBracing | None,
    name: str,
    a: float,
    b: float,
    stiffeners: dict[str, StiffenerData],
) -> BracingData:
    w = member.place(None, "bracing", name)
    pu = member.position_unit
    ends = (a, b)
    if fb is None or fb.kind == "none":
        return BracingData(
            "none",
            ends,
            None,
            fb is not None,
            "held laterally at the supports only"
            + ("" if fb is not None else " (bracing not recorded: the conservative reading)"),
        )
    if fb.kind == "continuous":
        return BracingData("continuous", ends, None, True, "continuously braced (a deck)")
    if fb.kind == "discrete":
        pts = sorted({to_internal(p, pu, "length", where=w) for p in fb.points} | set(ends))
        pts = [p for p in pts if a - 1e-6 <= p <= b + 1e-6]
        return BracingData(
            "discrete",
            tuple(pts),
            None,
            True,
            f"{len(pts) - 2} brace point(s) between the supports",
        )
    uf = fb.u_frames
    if uf is None:
        raise InputError("bracing kind 'u_frames' needs its u_frames data", where=w)
    wf = join(w, "u_frames")
    xs = tuple(sorted(to_internal(p, pu, "length", where=wf) - a for p in uf.positions))
    vert = None if uf.vertical is None else _named(stiffeners, uf.vertical, "vertical", wf)
    fr = Frames(
        xs,
        _q(uf.Cd, "force_per_length", join(wf, "Cd")),
        vert,
        _q(uf.Iv, "inertia", join(wf, "Iv")),
        _q(uf.hv, "length", join(wf, "hv")),
        _q(uf.Iq, "inertia", join(wf, "Iq")),
        _q(uf.bq, "length", join(wf, "bq")),
        _q(uf.Cj, "moment", join(wf, "Cj")),
    )
    if fr.Cd is None and (
        fr.hv is None or fr.Iq is None or fr.bq is None or (fr.Iv is None and vert is None)
    ):
        raise InputError(
            "U-frames need their stiffness Cd, or hv, Iq, bq and the vertical (a stiffener "
            "id or Iv)",
            where=wf,
        )
    return BracingData("u_frames", ends, fr, True, f"{len(xs)} U-frame(s) between the supports")


def member_details(member: Member, span: float, policy: str, D_web: float) -> MemberDetails:
    """The girder details of ``member`` (span in mm; ``policy`` the thickness basis;
    ``D_web`` the web depth, the height whole-stiffener readings stand for).

    Raises:
        InputError / UnitError: a record that cannot be used, with its place.
    """
    stiff = tuple(stiffener_data(member, r, policy, D_web) for r in member.stiffeners)
    by_id = {s.id: s for s in stiff}
    if len(by_id) != len(stiff):
        raise InputError("duplicate stiffener ids", where=member.place())
    sups = []
    for s in member.supports:
        sups.append(_support(member, s, by_id, D_web))
    sups.sort(key=lambda s: s.x)
    a, b = (sups[0].x, sups[-1].x) if len(sups) >= 2 else (0.0, span)
    br = member.bracing
    warn = [f"stiffener {s.id!r}: {x}" for s in stiff for x in s.warnings]
    return MemberDetails(
        stiff,
        tuple(sups),
        _bracing(member, br.top if br else None, "top", a, b, by_id),
        _bracing(member, br.bottom if br else None, "bottom", a, b, by_id),
        a,
        b,
        member.fatigue.ADTT_SL if member.fatigue else None,
        bool(stiff),
        tuple(warn),
    )


def _support(
    member: Member, s: Support, by_id: dict[str, StiffenerData], D_web: float
) -> SupportData:
    w = member.place(None, f"support {s.id!r}")
    x = to_internal(s.position, member.position_unit, "length", where=w)
    N = s.N.to("length", join(w, "N"))
    if N < 0.0:
        raise InputError(f"bearing length N = {s.N.value:g} {s.N.unit} must be 0 or more", where=w)
    over = s.overhang.to("length", join(w, "overhang")) if s.overhang else 0.0
    if over < 0.0:
        raise InputError("the overhang must be 0 or more", where=w)
    if s.stiffener is not None:
        st = _named(by_id, s.stiffener, "stiffener", w)
        words = f"stiffener {st.id!r} (recorded over the support)"
    else:
        near = [t for t in by_id.values() if t.role == "bearing" and abs(t.x - x) <= D_web]
        st = min(near, key=lambda t: abs(t.x - x)) if near else None
        words = (
            f"stiffener {st.id!r} (the bearing stiffener nearest the support)"
            if st
            else "no bearing stiffener recorded over the support"
        )
    return SupportData(s.id, x, N, over, st, words)


@dataclass(frozen=True)
class Panel:
    """A web panel between two stiffeners that bound it (mm), its kind for the shear
    clauses (``unstiffened``, ``interior`` (tension field allowed) or ``end``), and why."""

    a: float
    b: float
    kind: str
    words: str

    @property
    def do(self) -> float | None:
        return None if self.kind == "unstiffened" else self.b - self.a


def boundaries(details: MemberDetails, span: float, do: float | None) -> list[float]:
    """Positions of the stiffeners that may bound a panel (mm), with the member's ends: the
    recorded stiffeners, else the spacing ``do`` (None: the ends only)."""
    if details.recorded_stiffeners:
        xs = {0.0, span} | {s.x for s in details.stiffeners}
    elif do is not None:
        n = max(int(span / do + 1e-9), 1)
        xs = {0.0, span} | {k * do for k in range(1, n) if k * do < span - 1e-6}
    else:
        xs = {0.0, span}
    return sorted(x for x in xs if -1e-6 <= x <= span + 1e-6)
