"""Rivet lines along a member: local gaps between effective rivets, and the plies of a rivet
at a station (measured thickness, share of the rivet force, edge distance)."""

from __future__ import annotations

import bisect
from collections import Counter

from core.assess.results import LineSummary
from core.checks.rivets import Ply, line_gaps
from core.definition import RivetLine, SectionDefinition, StationLoss
from core.parts import Angle, Part
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


def edge_distance(part: Part, line: RivetLine) -> float | None:
    """Distance from the rivet line to the ply's free edge across the force (mm): along the
    plate's width for a plate, to the toe of the pierced leg for an angle (the heel side runs
    into the other leg); None when the line does not lie within the part."""
    pos = line.position
    if isinstance(part, Angle):
        if line.axis == "horizontal":
            toe = part.y + part.dir_y * part.b_v
        else:
            toe = part.x + part.dir_x * part.b_h
        e = abs(toe - pos)
    else:
        lo, hi = part.long_range
        e = min(pos - lo, hi - pos)
    return e if e > 0.0 else None


#: the bearing thickness of a ply cut through at the rivet line (a band of t = 0): nothing, in
#: effect (a ply of zero thickness is not a ply the rivet checks accept)
CUT_PLY = 1e-3


def plies(
    defn: SectionDefinition, line: RivetLine, loss: StationLoss | None, Fu: float
) -> list[Ply]:
    """The plies of a rivet of ``line`` with their thickness at the station (mm).

    Thickness: the station's remaining thickness of the part (or leg) if given, else nominal;
    the least of it and of any loss band across the line on that part (or leg).
    In double shear the middle ply (the web) bears the whole rivet force and each outer ply
    half of it; in single shear every ply bears all of it. Edge distance: see
    :func:`edge_distance`.
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
        # a loss band across the line (on this plate, or on the pierced leg) is the ply there
        for b in loss.bands if loss is not None else ():
            on = b.part == pid and b.leg == (leg if isinstance(part, Angle) else None)
            if on and b.lo <= line.position <= b.hi:
                t = min(t, max(b.t, CUT_PLY))
        share = 1.0
        if line.shear_planes == 2 and n == 3 and k != 1:
            share = 0.5
        out.append(Ply(pid, t, Fu, share, edge_distance(part, line)))
    return out
