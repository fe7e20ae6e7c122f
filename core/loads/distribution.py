"""Share of a lane, track or vehicle carried by one girder.

The lever rule (statics of a deck simply supported between two girders; AASHTO LRFD
4.6.2.2 names it for two-girder spans, from memory): a load at distance e from the girder,
measured towards the other girder at spacing S, gives the girder (S - e) / S of it (more than
1 for a load on an overhang, e < 0; nothing for a load beyond the other girder). The lane's
or track's loads are given as fractions (two wheel lines of half each; two rails with the
EN 1991-2 6.3.5 wheel load ratio 1.25 : 1, i.e. 1.25/2.25 and 1/2.25), times a multiple
presence factor where the family has one (AASHTO LRFD 3.6.1.1.2: 1.20 for one loaded lane,
from memory).
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

from core.errors import InputError


@dataclass(frozen=True)
class LeverRule:
    """The working of a lever-rule distribution factor.

    Attributes:
        S: girder spacing, mm. loads: (e, fraction) per load, e in mm from the girder.
        m: multiple presence factor (1.0 where the family has none).
        g: the resulting share of one lane / track carried by the girder.
    """

    S: float
    loads: tuple[tuple[float, float], ...]
    m: float
    g: float

    def words(self, unit: str = "mm", scale: float = 1.0) -> str:
        terms = " + ".join(
            f"{f:.4g} x ({self.S / scale:.4g} - {e / scale:.4g}) / {self.S / scale:.4g}"
            for e, f in self.loads
        )
        return f"lever rule: g = {self.m:g} x [{terms}] = {self.g:.4g}"


def lever_rule(S: float, loads: Sequence[tuple[float, float]], m: float = 1.0) -> LeverRule:
    """Distribution factor of one girder by the lever rule.

    Args:
        S: spacing of the two girders, mm (> 0).
        loads: (e, fraction): each load's distance from this girder towards the other (mm;
            negative on an overhang beyond this girder) and its fraction of the lane / track.
        m: multiple presence factor (0 < m <= 2).

    Raises:
        InputError: S not positive, no loads, fractions outside (0, 1], m outside (0, 2].
    """
    if not (math.isfinite(S) and S > 0.0):
        raise InputError(f"girder spacing S = {S!r} mm must be positive")
    if not loads:
        raise InputError("the lever rule needs at least one load")
    if not 0.0 < m <= 2.0:
        raise InputError(f"multiple presence factor m = {m!r} is outside (0, 2]")
    g = 0.0
    for e, f in loads:
        if not (math.isfinite(e) and 0.0 < f <= 1.0):
            raise InputError(f"lever rule load (e = {e!r} mm, fraction {f!r}) is out of range")
        if e <= S:
            g += f * (S - e) / S
    return LeverRule(S, tuple((float(e), float(f)) for e, f in loads), float(m), m * g)
