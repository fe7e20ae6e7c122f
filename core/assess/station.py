"""One station: its context for the family's limit states, the ratings, and the flags."""

from __future__ import annotations

import statistics
from collections.abc import Mapping, Sequence
from dataclasses import replace

from core.assess.details import Panel
from core.assess.effects import LiveCase, StationEffects
from core.assess.options import AssessOptions
from core.assess.results import LimitState
from core.checks.flags import Flag, flag_capacity_ratio, flag_not_applicable, flag_section_loss
from core.families.base import Factor, Family
from core.families.context import StationContext
from core.section import StationSection
from core.survey.model import Member

KIND_OF = {"M": "moment", "V": "force"}


def web_readings(member: Member, web_id: str) -> dict[str, tuple[float, list[float]]]:
    """Per station: its position (mm) and its whole-web readings (mm)."""
    out = {}
    for st in member.stations:
        w = member.place(st.id)
        vals = [r.mm(w) for r in st.readings if r.part == web_id and r.region is None]
        out[st.id] = (st.position_mm(member), vals)
    return out


def panel_thickness(
    station_id: str,
    readings: dict[str, tuple[float, list[float]]],
    t_nominal: float,
    panel: Panel | None,
    policy: str,
    same: Sequence[str] = (),
) -> tuple[float, str]:
    """The panel-representative web thickness as-found (mm) and why: the mean (or, with the
    minimum thickness policy, the least) of the whole-web readings of every station in the
    same panel between stiffeners (``panel``, as found); for an unstiffened web, of this
    station only. Readings of loss bands are local and left to the local check. Capped at
    nominal. ``readings`` is :func:`web_readings` of the member; ``same`` the stations in
    the panel."""
    _, own = readings[station_id]
    if panel is None or panel.kind == "unstiffened":
        vals, where = own, "this station (unstiffened web)"
    else:
        same = list(same) or [station_id]
        vals = [v for sid in same for v in readings[sid][1]]
        where = (
            f"the panel {panel.a / 1000.0:.4g} to {panel.b / 1000.0:.4g} m "
            f"(station(s) {', '.join(same)})"
        )
    if not vals:
        return t_nominal, "nominal: no web reading in " + where
    over = sum(1 for v in vals if v > t_nominal)
    vals = [min(v, t_nominal) for v in vals]  # each reading capped: none raises the mean
    t = min(vals) if policy == "minimum" else statistics.fmean(vals)
    word = "least" if policy == "minimum" else "mean"
    return t, f"{word} of {len(vals)} web reading(s) in {where}" + (
        f", {over} above nominal capped at nominal" if over else ""
    )


def design_effects(
    family: Family, effects: StationEffects | None, keys: list[str]
) -> dict[str, float]:
    """The family's design effects at the station: for M and V, the largest factored effect
    over the design cases (empty when there are none)."""
    if effects is None or not keys:
        return {}
    out = {}
    for e in ("M", "V"):
        DC, DW = effects.dead(e)
        vals = [
            family.measure.design(DC, DW, effects.live_value(k, e))
            for k in keys
            if k in effects.live
        ]
        if vals:
            out[e] = max(vals)
    return out


def rate(
    ls: LimitState,
    measure,
    effects: StationEffects | None,
    keys: list[str],
    cases: Mapping[str, LiveCase],
    member: Mapping[str, Factor],
    where: str,
):
    """The worst rating of a limit state over the load cases ``keys`` (None: not rated); a
    limit state with effects of its own (``ls.at``: a girder end's support) is rated with
    those."""
    if ls.at is not None:
        effects = ls.at
    if effects is None or ls.effect is None or ls.R_effect is None:
        return None
    best = None
    DC, DW = effects.dead(ls.effect)
    for k in keys:
        LL = effects.live_value(k, ls.effect)
        if LL <= 0.0:
            continue
        c = cases.get(k)
        load = (c.title if c else "station live load") + f" ({effects.placement(k, ls.effect)})"
        r = measure.rate(
            capacity=ls.R_effect,
            kind=KIND_OF[ls.effect],
            flexural=ls.flexural,
            DC=DC,
            DW=DW,
            LL=LL,
            load=load,
            member=member,
            where=where,
        )
        if best is None or r.badness < best.badness:
            best = r
    return best


def rated(ls: LimitState, r) -> LimitState:
    """``ls`` with its rating and the factored demand in the unit of its capacities (for a
    rivet line the shear flow q = V Q / I, from V and the line's V = q_r I / Q)."""
    if r is None:
        return ls
    return replace(ls, rating=r, demand=r.demand * ls.per_effect)


def checks(ctx: StationContext) -> list[LimitState]:
    """Every limit state of the family at the station, in the family's order; the
    components of a least (the flexure) marked ``part_of`` it."""
    done: list[LimitState] = []
    for spec in ctx.family.limit_states:
        done += spec.check(ctx, tuple(done))
    least = next((ls for ls in done if ls.least_of), None)
    if least is None:
        return done
    return [replace(ls, part_of=least.key) if ls.key in least.least_of else ls for ls in done]


def part_loss_percent(built: StationSection, found: StationSection) -> dict[str, float]:
    """Section loss of each part: 100 (1 - A as-found / A as-built) on the gross section."""
    out = {}
    for pid, a in built.gross.part_area.items():
        out[pid] = 100.0 * (1.0 - found.gross.part_area.get(pid, 0.0) / a) if a > 0 else 0.0
    return out


def station_flags(
    ctx: StationContext, states: list[LimitState], part_loss: dict[str, float], opts: AssessOptions
) -> list[Flag]:
    """Flags of a station: section loss per part, capacity ratio and the family's measure
    per limit state, and any check that cannot be made."""
    th = opts.thresholds
    flags = []
    for pid, pct in part_loss.items():
        if pct > 0.05:
            flags.append(flag_section_loss(f"{ctx.where} / part {pid!r}", min(pct, 100.0), th))
    if not ctx.found.shear_applicable:
        reason = ctx.found.finding.removeprefix("not applicable: ")
        flags.append(flag_not_applicable(f"{ctx.where} / shear stress VQ/It", reason))
    for ls in states:
        subj = f"{ctx.where} / {ls.name}"
        if ls.ratio is not None and not ls.least_of:
            flags.append(flag_capacity_ratio(subj, ls.ratio, th))
        if ls.rating is not None:
            flags.append(ctx.family.measure.flag(subj, ls.rating, th))
        flags += ls.flags
    return flags
