"""Rivet lines along a member: local gaps between effective rivets, and the shear force a
line can transfer at a station, V = q_r I / Q_out with q_r = n_lines phi Rn / gap."""

from __future__ import annotations

import bisect
from collections import Counter

from core.assess.results import LineSummary
from core.checks.results import CapacityResult
from core.checks.rivets import A502_GRADE_1, Ply, line_gaps, rivet_resistance
from core.definition import RivetLine, SectionDefinition, StationLoss
from core.parts import Angle
from core.survey.model import Member


def summarise_line(member: Member, line: RivetLine, effective: tuple[str, ...]) -> LineSummary:
    """States of one line along the member; the nominal pitch with all rivets sound when the
    survey records no states for the line."""
    rivets = member.rivet_states(line.id)
    if not rivets:
        return LineSummary(line.id, 0, 0, line.pitch, None, None, line.pitch, {})
    pos = [p for p, _ in rivets]
    states = [s for _, s in rivets]
    g = line_gaps(pos, states, effective=effective, where=member.place(None, f"line {line.id!r}"))
    return LineSummary(
        line.id,
        len(pos),
        g.n_ineffective,
        g.longest_gap,
        g.gap_from,
        g.gap_to,
        line.pitch,
        dict(Counter(states)),
        tuple(g.positions),
        tuple(g.states),
    )


def local_gap(
    summary: LineSummary, effective: tuple[str, ...], x: float, window: float, span: float
) -> tuple[float | None, str]:
    """Longest distance between effective rivets (or from a member end to the first
    effective rivet) over the stretch [x - window, x + window]; (gap mm, explanation).

    With no recorded states, the nominal pitch. None when no effective rivet is left.
    """
    if not summary.positions:
        return summary.pitch, "no rivet states recorded: nominal pitch, all rivets sound"
    eff = [p for p, s in zip(summary.positions, summary.states, strict=True) if s in effective]
    if not eff:
        return None, "no effective rivet on the line"
    bounds = [0.0, *eff, span]
    lo, hi = x - window, x + window
    best, where = 0.0, ""
    i0 = max(bisect.bisect_left(bounds, lo) - 1, 0)
    for a, b in zip(bounds[i0:], bounds[i0 + 1 :], strict=False):
        if a > hi:
            break
        if b < lo:
            continue
        gap = b - a  # an end stretch is carried by the first effective rivet alone
        if gap > best:
            best, where = gap, f"{a:.0f} to {b:.0f} mm"
    return best, f"longest effective gap near the station, {where}"


def plies(
    defn: SectionDefinition, line: RivetLine, loss: StationLoss | None, Fu: float
) -> list[Ply]:
    """The plies of a rivet of ``line`` with their thickness at the station (mm).

    Thickness: the station's remaining thickness of the part (or leg) if given, else nominal.
    In double shear the middle ply (the web) bears the whole rivet force and each outer ply
    half of it; in single shear every ply bears all of it.
    """
    t_of: dict[tuple[str, str | None], float] = {}
    if loss is not None:
        for th in loss.thickness:
            t_of[(th.part, th.leg)] = th.t
    leg = "v" if line.axis == "horizontal" else "h"
    out = []
    n = len(line.parts)
    for k, pid in enumerate(line.parts):
        part = defn.part(pid)
        if isinstance(part, Angle):
            t = t_of.get((pid, leg), t_of.get((pid, None), part.t))
        else:
            t = t_of.get((pid, None), part.t)
        share = 1.0
        if line.shear_planes == 2 and n == 3 and k != 1:
            share = 0.5
        out.append(Ply(pid, t, Fu, share))
    return out


def rivet_capacity(
    defn: SectionDefinition, line: RivetLine, loss: StationLoss | None, Fu: float, where: str
) -> CapacityResult:
    """Resistance of one rivet of ``line`` (shear and bearing on the plies at the station)."""
    return rivet_resistance(
        d=line.d,
        m=line.shear_planes,
        plies=plies(defn, line, loss, Fu),
        material=A502_GRADE_1,
        where=where,
    )
