"""The standard deviation of a part region's as-found thickness (mm).

sigma^2 = (tol / k)^2 + s^2 / n, with
    * tol the instrument tolerance (ultrasonic +-0.1 mm, caliper +-0.05 mm by default;
      common practice, no source), taken as k = 2 standard deviations (an assumption,
      common practice, no source) and as systematic: it does not shrink with more
      readings (a gauge's calibration error is shared by its readings; conservative);
    * s the sample standard deviation of the region's readings (divisor n - 1) and n their
      count: s / sqrt(n) is the standard error of the mean (any statistics text);
    * with one reading, s = COV x the reading (a stated default COV, common practice, no
      source).
The same sigma is used under the minimum-thickness policy (the minimum has no simple
standard error; the assumption is printed).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from core.bands.options import BandOptions
from core.errors import InputError
from core.survey.readings import RegionStats


@dataclass(frozen=True)
class RegionSigma:
    """The uncertainty of one part region's thickness (mm).

    Attributes:
        part, region: the part region. n: readings. t: the thickness used (mm).
        tol: the instrument tolerance (mm) and ``instrument`` the name it came from.
        s: the readings' scatter (mm; assumed from the default COV when n = 1).
        s_assumed: True where s is the default COV's. sigma_instr, se: the two terms (mm).
    """

    part: str
    region: str | None
    n: int
    t: float
    tol: float
    instrument: str
    s: float
    s_assumed: bool
    sigma_instr: float
    se: float

    def __post_init__(self) -> None:
        for name in ("tol", "s", "sigma_instr", "se", "t"):
            v = getattr(self, name)
            if not (math.isfinite(v) and v >= 0.0):
                raise InputError(
                    f"{name} {v!r} mm is not finite and >= 0",
                    where=f"part {self.part!r} region {self.region!r}",
                )
        if self.n < 1:
            raise InputError(f"n {self.n} is not >= 1", where=f"part {self.part!r}")

    @property
    def key(self) -> tuple[str, str | None]:
        return (self.part, self.region)

    @property
    def sigma(self) -> float:
        """Standard deviation of the region's thickness, mm."""
        return math.hypot(self.sigma_instr, self.se)

    def sigma_with(self, more: int) -> float:
        """The standard deviation with ``more`` readings of the same scatter, mm."""
        return math.hypot(self.sigma_instr, self.s / math.sqrt(self.n + more))


def region_sigma(
    st: RegionStats, instruments: list[str], opts: BandOptions, *, zero: bool = False
) -> RegionSigma:
    """The :class:`RegionSigma` of a region's statistics ``st`` whose readings were taken
    with ``instruments`` (their instrument texts); the largest tolerance among them counts.
    ``zero``: no uncertainty at all (a band of zero width, for checks)."""
    tols = [opts.tolerance_of(i) for i in instruments] or [opts.tolerance_of("")]
    tol, name = max(tols)
    if st.n >= 2 and st.cov is not None:
        s, assumed = st.cov * st.t_mean, False
    else:
        s, assumed = opts.cov_single * st.t_mean, True
    if zero:
        tol, s = 0.0, 0.0
    return RegionSigma(
        st.part,
        st.region,
        st.n,
        st.t_used,
        tol,
        name,
        s,
        assumed,
        tol / opts.tolerance_sigmas,
        s / math.sqrt(st.n),
    )
