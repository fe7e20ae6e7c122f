"""Web panels between transverse stiffeners, as-built and as-found, and whether each may
count tension-field action (the family's requirements of its intermediate stiffeners with
their measured loss).

Rules (asfound's reading of the families' clauses; the clauses are the family's):

- The panels' bounds are the recorded stiffeners (bearing and intermediate) and the member's
  ends; without stiffener records, the spacing ``do`` (stiffeners assumed present but their
  sizes unknown: the panel counts as stiffened, and no tension field is counted, said so).
- An intermediate stiffener that fails the family's requirement for a stiffened panel
  (:mod:`core.checks.intermediate_stiffener`) does not bound a panel: its two panels become
  one (one pass; the stiffeners beside it are checked with their own panels).
- A panel bounded by the member's ends only is unstiffened; a panel at an end is an end
  panel (no tension field); an interior panel counts tension field only where both of its
  stiffeners meet the family's tension-field requirement, else it is checked as without
  (the ``end`` resistance of the clause), and the panel's words say why.
- The stiffener's check takes the web thickness of the stations in its two panels (mean or
  least of their whole-web readings by the thickness basis; nominal without readings) and
  the larger of the two panels as its spacing.
"""

from __future__ import annotations

import itertools
import statistics
from collections.abc import Callable
from dataclasses import dataclass

from core.assess.details import MemberDetails, Panel, StiffenerData, boundaries
from core.checks.intermediate_stiffener import PanelStiffening

#: ``check(stiffener, loss, tw, do, state)`` -> the family's requirement of one stiffener
StiffenerCheck = Callable[[StiffenerData, object, float, float, str], PanelStiffening]


@dataclass(frozen=True)
class StiffenerResult:
    """The family's check of one intermediate stiffener in one state."""

    stiffener: StiffenerData
    state: str
    tw: float
    do: float
    result: PanelStiffening


@dataclass(frozen=True)
class PanelLayout:
    """The panels as-built and as-found, and the checks of the intermediate stiffeners."""

    built: tuple[Panel, ...]
    found: tuple[Panel, ...]
    checks: tuple[StiffenerResult, ...]
    tension_field: bool = True

    def at(self, x: float, state: str) -> Panel:
        panels = self.built if state == "built" else self.found
        for p in panels:
            if p.a - 1e-6 <= x < p.b - 1e-6:
                return p
        return panels[-1]


def _mean_tw(readings, a: float, b: float, t_nom: float, policy: str) -> float:
    vals = [min(v, t_nom) for xs, vs in readings.values() if a - 1e-6 <= xs <= b + 1e-6 for v in vs]
    if not vals:
        return t_nom
    return min(vals) if policy == "minimum" else statistics.fmean(vals)  # each capped


def layout(
    details: MemberDetails,
    span: float,
    do: float | None,
    readings: dict[str, tuple[float, list[float]]],
    t_nom: float,
    policy: str,
    check: StiffenerCheck | None,
) -> PanelLayout:
    """The panels of a member as-built and as-found (mm).

    ``readings`` are the whole-web readings per station (position, values);
    ``check`` the family's requirement of an intermediate stiffener (None: not checked);
    a check whose attribute ``tension_field`` is False belongs to a family whose shear
    clause has no tension field (its stiffeners only bound the panels).
    """
    tfa = getattr(check, "tension_field", True)
    xs = boundaries(details, span, do)
    at = {round(s.x, 6): s for s in details.stiffeners}
    checks: list[StiffenerResult] = []
    out = {}
    for state in ("built", "found"):
        keep = [xs[0]]
        flags: dict[float, PanelStiffening | None] = {}
        for i in range(1, len(xs) - 1):
            x = xs[i]
            st = at.get(round(x, 6))
            if st is None or st.role == "bearing" or check is None:
                keep.append(x)
                flags[x] = None
                continue
            a, b = xs[i - 1], xs[i + 1]
            tw = t_nom if state == "built" else _mean_tw(readings, a, b, t_nom, policy)
            d = max(x - a, b - x)
            loss = None if state == "built" else st.column_loss
            r = check(st, loss, tw, d, state)
            checks.append(StiffenerResult(st, state, tw, d, r))
            if r.stiffened:
                keep.append(x)
                flags[x] = r
        keep.append(xs[-1])
        out[state] = tuple(_panels(keep, flags, span, details, at, tfa))
    return PanelLayout(out["built"], out["found"], tuple(checks), tfa)


def _panels(keep, flags, span, details: MemberDetails, at, tfa: bool) -> list[Panel]:
    out = []
    for a, b in itertools.pairwise(keep):
        if len(keep) == 2:
            out.append(Panel(a, b, "unstiffened", "no intermediate stiffener bounds the panel"))
            continue
        if a <= 1e-6 or b >= span - 1e-6:
            out.append(Panel(a, b, "end", "end panel: no tension field" if tfa else "end panel"))
            continue
        if not tfa:
            out.append(Panel(a, b, "interior", "bounded by two stiffeners that qualify"))
            continue
        why = []
        for x in (a, b):
            r = flags.get(x)
            st = at.get(round(x, 6))
            if st is None:
                why.append(
                    f"stiffener at {x / 1000:.4g} m: sizes not recorded (only the spacing do)"
                )
            elif r is not None and not r.tension_field:
                why.append(f"stiffener {st.id!r}: " + "; ".join(r.reasons))
        if why:
            out.append(Panel(a, b, "end", "no tension field: " + "; ".join(why)))
        else:
            out.append(Panel(a, b, "interior", "tension field counted: both stiffeners qualify"))
    return out
