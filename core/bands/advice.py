"""Where to measure next: the part regions ranked by how much more readings would narrow
the band of a station's governing limit state.

With first-order propagation the governing quantity's variance is var = sum_r (g_r
sigma_r)^2 (g_r = dQ/dt_r); region r's share is (g_r sigma_r)^2 / var. With k more readings
of the same scatter its sigma becomes sigma_r' = sqrt(sigma_instr^2 + s^2 / (n + k)) (the
instrument term stays), so var' = var - g_r^2 (sigma_r^2 - sigma_r'^2) and the band (a
multiple of the standard deviation) narrows by 1 - sqrt(var' / var).
"""

from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from dataclasses import dataclass

from core.bands.sigma import RegionSigma
from core.errors import InputError
from core.names import place_name


@dataclass(frozen=True)
class RegionRank:
    """One part region's place in the ranking at a station.

    Attributes:
        station, part, region: where. share: its part of the governing variance (0 to 1).
        narrowing: the fraction by which ``more`` readings would narrow the band (0 to 1).
        sd_gain: the standard deviation of the governing quantity removed (its unit).
        more: the readings assumed added.
    """

    station: str
    part: str
    region: str | None
    share: float
    narrowing: float
    sd_gain: float
    more: int

    def __post_init__(self) -> None:
        for name in ("share", "narrowing"):
            v = getattr(self, name)
            if not (math.isfinite(v) and -1e-9 <= v <= 1.0 + 1e-9):
                raise InputError(f"{name} {v!r} is outside 0 to 1", where=self.station)

    @property
    def place(self) -> str:
        """The part region in words."""
        return place_name(self.part, self.region)

    def advice(self, what: str) -> str:
        """Plain advice: "3 more readings on the web at station S1 would narrow the web shear
        band by about 40 %" (``what``: the band in words)."""
        pct = 100.0 * self.narrowing
        amount = f"about {pct:.0f} %" if pct >= 1.0 else "less than 1 %"
        return (
            f"{self.more} more readings on the {self.place} at station {self.station} would "
            f"narrow the {what} band by {amount}"
        )


def rank_regions(
    station: str,
    grads: Mapping[tuple[str, str | None], float],
    sigmas: Sequence[RegionSigma],
    more: int,
) -> tuple[RegionRank, ...]:
    """The station's regions, the one whose ``more`` readings narrow the band most first
    (ties: the larger share, then reading order). ``grads``: dQ/dt per region of the
    governing quantity (unit of Q per mm)."""
    terms = {s.key: (grads.get(s.key, 0.0) * s.sigma) ** 2 for s in sigmas}
    var = sum(terms.values())
    out = []
    for i, s in enumerate(sigmas):
        g = grads.get(s.key, 0.0)
        if var > 0.0:
            drop = g * g * (s.sigma**2 - s.sigma_with(more) ** 2)
            after = max(var - drop, 0.0)
            narrowing = 1.0 - math.sqrt(after / var)
            share = terms[s.key] / var
            gain = math.sqrt(var) - math.sqrt(after)
        else:
            narrowing = share = gain = 0.0
        out.append((-narrowing, -share, i, RegionRank(station, s.part, s.region, share,
                                                       narrowing, gain, more)))  # fmt: skip
    return tuple(r for *_, r in sorted(out, key=lambda t: t[:3]))
