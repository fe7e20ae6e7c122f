"""The choices of a band calculation (all thicknesses in mm)."""

from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass, field
from types import MappingProxyType

from core.errors import InputError

#: instrument tolerances, mm (common practice, no source)
TOLERANCE_MM: Mapping[str, float] = MappingProxyType({"ultrasonic": 0.1, "caliper": 0.05})
#: the tolerance taken as this many standard deviations (a +-2 sigma bound, about 95 %
#: coverage of a normal error; an assumption, common practice, no source)
TOLERANCE_SIGMAS = 2.0
#: coefficient of variation assumed where one reading backs a region (common practice,
#: no source; the issue's ordinary range of corroded plates is 5 to 20 %)
COV_SINGLE = 0.10
#: finite-difference step on a region's thickness, mm (thinning)
STEP_MM = 0.01
#: more readings assumed by the advice
MORE_READINGS = 3
#: normal quantile of the 5 % and 95 % values
Z95 = 1.6448536269514722


@dataclass(frozen=True)
class BandOptions:
    """How the bands are found.

    Attributes:
        method: ``"first_order"`` (finite differences through the engine, normal
            approximation) or ``"monte_carlo"`` (samples through the engine).
        samples: Monte Carlo samples per station (>= 20). seed: of numpy's default_rng.
        tolerance_mm: instrument tolerance by instrument name (mm, >= 0); a reading's
            ``instrument`` text is matched by name (case-insensitive), then by kind
            ("calip" -> caliper, anything else -> ultrasonic).
        default_instrument: the kind of a reading with no instrument recorded.
        cov_single: the coefficient of variation of a region with one reading (0 to 1).
        tolerance_sigmas: how many standard deviations the tolerance is (> 0).
        more: the readings the advice assumes are added (>= 1).

    Raises:
        InputError: a value outside its range (named with the range).
    """

    method: str = "first_order"
    samples: int = 400
    seed: int = 20260
    tolerance_mm: Mapping[str, float] = field(default_factory=lambda: dict(TOLERANCE_MM))
    default_instrument: str = "ultrasonic"
    cov_single: float = COV_SINGLE
    tolerance_sigmas: float = TOLERANCE_SIGMAS
    more: int = MORE_READINGS

    def __post_init__(self) -> None:
        w = "band options"
        if self.method not in ("first_order", "monte_carlo"):
            raise InputError(
                f"method {self.method!r} is not 'first_order' or 'monte_carlo'", where=w
            )
        if not 20 <= self.samples <= 100_000:
            raise InputError(f"samples {self.samples} is outside 20 to 100000", where=w)
        for k, v in self.tolerance_mm.items():
            if not (math.isfinite(v) and 0.0 <= v <= 5.0):
                raise InputError(f"tolerance {v!r} mm of {k!r} is outside 0 to 5 mm", where=w)
        if self.default_instrument.lower() not in {k.lower() for k in self.tolerance_mm}:
            raise InputError(
                f"default instrument {self.default_instrument!r} has no tolerance "
                f"(known: {sorted(self.tolerance_mm)})",
                where=w,
            )
        if not (math.isfinite(self.cov_single) and 0.0 <= self.cov_single <= 1.0):
            raise InputError(f"cov_single {self.cov_single!r} is outside 0 to 1", where=w)
        if not (math.isfinite(self.tolerance_sigmas) and self.tolerance_sigmas > 0.0):
            raise InputError(f"tolerance_sigmas {self.tolerance_sigmas!r} is not > 0", where=w)
        if not 1 <= self.more <= 100:
            raise InputError(f"more readings {self.more} is outside 1 to 100", where=w)
        object.__setattr__(self, "tolerance_mm", MappingProxyType(dict(self.tolerance_mm)))

    def tolerance_of(self, instrument: str) -> tuple[float, str]:
        """(tolerance mm, the name it was found under) of a reading's instrument text."""
        low = {k.lower(): (v, k) for k, v in self.tolerance_mm.items()}
        text = instrument.strip().lower()
        if text in low:
            return low[text]
        if text and ("calip" in text or "callip" in text) and "caliper" in low:
            return low["caliper"]
        if text and "ultras" in text and "ultrasonic" in low:
            return low["ultrasonic"]
        return low[self.default_instrument.lower()]
