"""Limit state builders every family shares, each taking the family's clause as a function.

- :func:`panel_shear`: the web panel's shear (buckling and yield) with the nominal
  thickness as-built and the panel-representative thickness as-found.
- :func:`local_shear`: the local web shear check of :mod:`core.checks.web_local_shear` at a
  station whose web has loss, as-built and as-found.
- :func:`rivet_groups`: the rivet lines of each interface together. Lines sharing the same
  outside parts (the two cover plate lines of a flange) add their resistances, left plus
  right; a line recorded as standing for ``n_lines`` identical lines counts that many
  (each of k recorded lines of an interface stands for n_lines / k).
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass

from core.assess.results import LimitState
from core.assess.rivetlines import local_gap, plies
from core.checks.results import CapacityResult, ShearResult
from core.checks.web_local_shear import local_web_shear
from core.definition import RivetLine
from core.families.context import StationContext, capped, flange_area, web_area
from core.families.material import resolve_material
from core.section import StationSection

ShearCheck = Callable[[StationSection, float, str], ShearResult]
RivetCheck = Callable[[StationContext, RivetLine, list, str], CapacityResult]
HolesCheck = Callable[[StationSection, float, float, str], tuple[CapacityResult, float]]


def moment_state(
    key: str,
    name: str,
    b: CapacityResult,
    f: CapacityResult,
    note: str,
    C: tuple[float, float] | None = None,
) -> LimitState:
    """A flexural limit state (effect M, system factor applies) from its two results; ``C``
    gives (as-built, as-found) factored moments where they are not the results' phi Rn."""
    Cb, Cf = C if C is not None else (b.Rr, f.Rr)
    ls = LimitState(
        key, name, "moment", b, f, Cb, Cf, note=note, effect="M", flexural=True, R_effect=Cf
    )
    return capped(ls)


def tension_flange(ctx: StationContext, check: HolesCheck, note: str) -> list[LimitState]:
    """The tension flange (the bottom one in sagging) at its holes, as-built and as-found:
    ``check(section, An, Ag, label)`` gives the family's result and its factored moment.
    None where the flange has no holes."""
    out = {}
    ids = ctx.tension_parts
    for label, st in (("built", ctx.built), ("found", ctx.found)):
        # the as-built one is the same at every station of the member (once per sense)
        key = ("tension flange built", ids, ctx.compression) if label == "built" else None
        if key is None or key not in ctx.cache:
            Ag = flange_area(st, ids)
            An = float(sum(st.net.part_area[i] for i in ids))
            got = None
            if Ag > 0 and An < Ag:
                got = check(st, An, Ag, f"{ctx.where} / tension flange ({label})")
            if key is None:
                out[label] = got
            else:
                ctx.cache[key] = out[label] = got
        else:
            out[label] = ctx.cache[key]
        if out[label] is None:
            return []
    (b, Mb), (f, Mf) = out["built"], out["found"]
    return [
        moment_state("tension_flange_at_holes", "tension flange at holes", b, f, note, (Mb, Mf))
    ]


@dataclass(frozen=True)
class RulesBase:
    """What every family's rules share: the material, the design cases, no consequence."""

    key = ""

    def material(self, survey):
        return resolve_material(survey, self.key)

    def design_keys(self, cases: list, opts) -> list[str]:
        return [c.key for c in cases if c.role == "design"]

    def posting(self, value: float, weight: float | None, system: str) -> str:
        return ""

    def flags(self, survey) -> list:
        return []

    def girder_notes(self) -> list:
        """The family's own bases of its girder limit states (``Choice`` rows)."""
        return []

    def stiffener_check(self, defn, web, D: float, material):
        """The family's requirement of an intermediate stiffener,
        ``check(stiffener, loss, tw, do, state) -> PanelStiffening`` (None: none)."""
        return None


def _panel_words(ctx: StationContext) -> str:
    pb, pf = ctx.panel_built, ctx.panel_found
    if pf is None or pf.kind == "unstiffened":
        return ""
    out = f"; panel {pf.a / 1000:.4g} to {pf.b / 1000:.4g} m, {pf.words}"
    if pb is not None and (pb.a, pb.b, pb.kind) != (pf.a, pf.b, pf.kind):
        out += f" (as built: {pb.a / 1000:.4g} to {pb.b / 1000:.4g} m, {pb.words})"
    return out


def panel_shear(ctx: StationContext, check: ShearCheck) -> LimitState:
    """Web panel shear as-built (nominal web) and as-found (panel-representative thickness).

    ``check(section, tw, label)`` runs the family's clause for one state."""
    b = check(ctx.built, ctx.tw_nominal, "built")
    f = check(ctx.found, ctx.tw_panel, "found")
    ls = LimitState(
        "web_shear",
        "web shear",
        "force",
        b,
        f,
        b.Rr,
        f.Rr,
        note=f"D = {ctx.D:.4g} mm ({ctx.depth_words}); as-found tw {ctx.tw_panel:.3g} mm "
        f"({ctx.tw_words})" + _panel_words(ctx),
        effect="V",
        R_effect=f.Rr,
    )
    return capped(ls)


def local_shear(
    ctx: StationContext,
    *,
    tau_y: Callable[[float], float],
    tau_y_words: str,
    tau_y_source: str,
    phi: float,
    standard: str,
    edition: str,
    clause: str,
) -> list[LimitState]:
    """The local check where the web has loss at the station (none elsewhere).

    ``tau_y(Fy)`` is the family's shear yield stress (MPa) for a yield strength Fy."""
    if not ctx.web_has_loss:
        return []
    lo, hi = ctx.y_depth
    out = {}
    for label, st in (("built", ctx.built), ("found", ctx.found)):
        key = ("local web shear built", clause)  # the same at every station of the member
        if label == "built" and key in ctx.cache:
            out[label] = ctx.cache[key]
            continue
        per_V, y = (None, None)
        if st.shear_applicable:
            per_V, y = st.gross.profile.tau_max(1.0)
        out[label] = local_web_shear(
            tau_y=tau_y(ctx.material.Fy),
            tau_y_words=tau_y_words,
            tau_y_source=tau_y_source,
            phi=phi,
            tau_per_V=per_V,
            cut_height=y,
            A_v_net=web_area(st, ctx.web.web_id, lo, hi),
            standard=standard,
            edition=edition,
            clause=clause,
            where=f"{ctx.where} / local web shear ({label})",
        )
        if label == "built":
            ctx.cache[key] = out[label]
    b, f = out["built"], out["found"]
    note = f"net web area over {ctx.depth_words}; " + "; ".join(f.notes)
    if not ctx.found.shear_applicable:
        note += "; web cut through: VQ/It not applicable (flagged for the engineer)"
    ls = LimitState(
        "local_web_shear",
        "local web shear",
        "force",
        b,
        f,
        b.Rr,
        f.Rr,
        note=note,
        effect="V",
        R_effect=f.Rr,
    )
    return [capped(ls)]


def line_rivet(line: RivetLine) -> dict:
    """The rivet of a line as the rivet clauses take it: d, d0, m, pitch."""
    return {"d": line.d, "d0": line.d_hole, "m": line.shear_planes, "pitch": line.pitch}


def _groups(ctx: StationContext) -> list[list[RivetLine]]:
    groups: dict[tuple[str, ...], list[RivetLine]] = {}
    for line in ctx.defn.rivet_lines:
        if line.outside:
            groups.setdefault(tuple(sorted(line.outside)), []).append(line)
    return list(groups.values())


def rivet_groups(ctx: StationContext, check: RivetCheck) -> list[LimitState]:
    """One limit state per interface: the shear flow its rivet lines carry together,
    q_r = sum over the lines of (n_lines / k) phi Rn / gap (N/mm), as-built with the nominal
    pitch and thicknesses, as-found with each line's local longest effective gap and the
    measured plies. The rating uses the shear force the interface can transfer,
    V = q_r I / Q_out, so that the change of I and Q with the loss counts."""
    out = []
    window = ctx.opts.gap_window or ctx.web.D_web
    Fu = ctx.material.Fu
    for group in _groups(ctx):
        k = len(group)
        C_b, C_f, parts, worst = 0.0, 0.0, [], None
        results = {}
        applicable = ctx.found.shear_applicable
        no_path = []
        for line in group:
            w = f"{ctx.where} / rivet line {line.id!r}"
            key = ("rivet as-built", line.id)
            if key not in ctx.cache:
                pb = plies(ctx.defn, line, None, Fu)
                ctx.cache[key] = (check(ctx, line, pb, w), pb)
            rb, pb = ctx.cache[key]
            pf = plies(ctx.defn, line, ctx.loss_local, Fu)
            # plies at their nominal thickness here: the as-built rivet (a pure function)
            rf = rb if pf == pb else check(ctx, line, pf, w)
            share = line.n_lines / k
            C_b += share * rb.Rr / line.pitch
            gap, why = local_gap(
                ctx.lines[line.id], ctx.opts.effective_states, ctx.x, window, ctx.span
            )
            if gap is None or gap <= 0:
                no_path.append(line.id)
                contrib = 0.0
            else:
                contrib = share * rf.Rr / gap
            C_f += contrib
            parts.append(f"{line.id}: {share:g} x {rf.Rr / 1e3:.4g} kN / {gap or 0:.0f} mm ({why})")
            results[line.id] = (rb, rf)
            if worst is None or contrib < worst[0]:
                worst = (contrib, line.id)
        assert worst is not None
        rb, rf = results[worst[1]]
        ids = [ln.id for ln in group]
        name = "rivets, line " + ids[0] if k == 1 else "rivets, lines " + " + ".join(ids)
        note = "shear flow resistance sum of (n/k) phi Rn / gap: " + "; ".join(parts)
        if no_path:
            note += f"; no effective rivet near the station on {', '.join(no_path)}"
        R_V, per = None, 1.0
        if applicable:
            Q = abs(ctx.found.gross.Q_of(group[0].outside))
            if Q > 0:
                per = Q / ctx.found.gross.props.Ix
                R_V = C_f / per
        else:
            note = "not applicable: " + ctx.found.finding.removeprefix("not applicable: ")
        out.append(
            LimitState(
                "rivets:" + "+".join(ids),
                name,
                "force_per_length",
                rb,
                rf,
                C_b,
                C_f if applicable else None,
                note=note,
                effect="V" if R_V is not None else None,
                R_effect=R_V,
                per_effect=per,
            )
        )
    return out
