"""Rates of loss of one part region over the survey dates, and the loss still to come.

Two models of corrosion loss over time:

* ``linear`` (default): t(y) = a + b y fitted by least squares to the thicknesses at the
  survey dates; the loss rate is r = -b (mm/year). With three or more surveys its standard
  error is SE(b) = sqrt(SSE / (n - 2) / Sxx) (ordinary least squares; any statistics
  text). From two surveys the fit is the difference quotient (t1 - t2) / (y2 - y1), which
  has no standard error: the result says so.
* ``power``: the loss depth d = t_nominal - t grows as d = A tau^B with tau the years since
  corrosion began (the year built unless given), the form used in atmospheric
  corrosion-loss studies, where B is typically about 0.3 to 0.8 (from memory; the
  engineer chooses it, 0.5 by default). With B fixed, A is the least squares fit through
  the origin, A = sum(d tau^B) / sum(tau^2B), with SE(A) = sqrt(SSE / (n - 1) /
  sum(tau^2B)).

A region read in the latest survey only has no rate of its own. It is not held as found
(that would project no loss, which is optimistic): when the year corrosion began is known
(the year built, or the engineer's ``--since``), its rate is the loss since then,
r = (t_nominal - t) / (y - y0) (linear) or A = (t_nominal - t) / (y - y0)^B (power law),
with no standard error; when it is not known the region has no rate ("no rate"), is held
as found, and says so.

Projections start from the thickness found at the latest survey and add the model's loss
from then on (so the projection at the latest date is the survey itself). A fit that shows
thickening (a negative loss rate, which is measurement scatter) projects no further loss,
with a note. The band is the rate plus and minus one standard error.
"""

from __future__ import annotations

import itertools
import math
from collections.abc import Sequence
from dataclasses import dataclass
from typing import Literal

from core.trend.errors import TrendError

Model = Literal["linear", "power"]
MODELS: tuple[str, ...] = ("linear", "power")
Scenario = Literal["central", "fast", "slow"]
#: default exponent of the power law (from memory: about 0.3 to 0.8 in atmospheric
#: corrosion-loss studies; the engineer's choice)
B_DEFAULT = 0.5
B_RANGE = (0.3, 0.8)
#: methods that give no rate (no further loss is projected)
NO_RATE = ("one survey", "no rate")
SINCE_BUILT = "loss since built"


@dataclass(frozen=True)
class Rate:
    """The fitted loss of one part region.

    Attributes:
        model: "linear" or "power". method: "least squares", "difference quotient"
            (two surveys, linear), "loss since built" (one survey: the loss from nominal
            over the years since corrosion began) or "no rate" (one survey and no year
            built: no further loss projected, flagged).
        n: number of surveys in the fit. y_last: decimal year of the latest one.
        r: loss rate at the latest survey, mm/year (> 0 is thinning; as fitted).
        se: its standard error, mm/year (None without one).
        A, se_A: power law coefficient (mm / year^B) and its standard error.
        B: power law exponent. y0: the year corrosion began (power law).
        note: what the reader should know (thickening, no standard error).
    """

    model: str
    method: str
    n: int
    y_last: float
    r: float
    se: float | None = None
    A: float | None = None
    se_A: float | None = None
    B: float | None = None
    y0: float | None = None
    note: str = ""

    def __post_init__(self) -> None:
        if self.model not in MODELS:
            raise TrendError(f"corrosion model {self.model!r} is not one of {MODELS}")
        for name in ("r", "se", "A", "se_A", "B", "y0", "y_last"):
            v = getattr(self, name)
            if v is not None and not math.isfinite(v):
                raise TrendError(f"{name} = {v!r} is not finite")
        power = self.model == "power" and self.method not in NO_RATE
        if power and (
            self.A is None or self.B is None or self.y0 is None or self.y0 >= self.y_last
        ):
            raise TrendError("a power law needs A, B and a start year before the survey")

    @property
    def has_rate(self) -> bool:
        """False when the region has no rate (no further loss is projected for it)."""
        return self.method not in NO_RATE

    @property
    def has_band(self) -> bool:
        """True when a standard error gives a band."""
        return bool(self.se_A if self.model == "power" else self.se)

    def loss(self, years: float, scenario: Scenario = "central") -> float:
        """Further loss (mm, >= 0) ``years`` after the latest survey.

        ``scenario``: "central" the fit, "fast" one standard error faster, "slow" one
        standard error slower (never below no further loss).
        """
        if years < 0 or not math.isfinite(years):
            raise TrendError(f"years ahead {years!r} must be a finite number >= 0")
        if not self.has_rate:
            return 0.0
        k = {"central": 0.0, "fast": 1.0, "slow": -1.0}[scenario]
        if self.model == "linear":
            r = self.r + k * (self.se or 0.0)
            return max(r, 0.0) * years
        A = max(self.A + k * (self.se_A or 0.0), 0.0)  # type: ignore[operator]
        tau = self.y_last - self.y0  # type: ignore[operator]
        return A * ((tau + years) ** self.B - tau**self.B)  # type: ignore[operator]


def _check(years: Sequence[float], t: Sequence[float], where: str) -> None:
    if len(years) != len(t):
        raise TrendError(f"{len(years)} years but {len(t)} thicknesses", where=where)
    for y, v in zip(years, t, strict=True):
        if not (math.isfinite(y) and math.isfinite(v)):
            raise TrendError(f"year {y!r} or thickness {v!r} mm is not finite", where=where)
    if any(b <= a for a, b in itertools.pairwise(years)):
        raise TrendError(f"years {tuple(years)} must rise strictly", where=where)


def fit_linear(years: Sequence[float], t: Sequence[float], *, where: str = "") -> Rate:
    """The linear model fitted to thicknesses ``t`` (mm) at decimal ``years``.

    Raises:
        TrendError: lengths differ, a value is not finite, or the years do not rise.
    """
    _check(years, t, where)
    n = len(years)
    if n < 2:
        return Rate("linear", "one survey", n, years[-1] if n else 0.0, 0.0, note="one date")
    if n == 2:
        r = (t[0] - t[1]) / (years[1] - years[0])
        rate = Rate(
            "linear",
            "difference quotient",
            2,
            years[-1],
            r,
            note="two surveys: the difference over the interval, no standard error",
        )
        return _thickening(rate)
    ybar = math.fsum(years) / n
    # differences from the first thickness: exactly zero when nothing changed
    dt = [v - t[0] for v in t]
    Sxx = math.fsum((y - ybar) ** 2 for y in years)
    Sxy = math.fsum((y - ybar) * d for y, d in zip(years, dt, strict=True))
    b = Sxy / Sxx
    dbar = math.fsum(dt) / n
    sse = math.fsum((d - dbar - b * (y - ybar)) ** 2 for y, d in zip(years, dt, strict=True))
    se = math.sqrt(max(sse, 0.0) / (n - 2) / Sxx)
    return _thickening(Rate("linear", "least squares", n, years[-1], -b + 0.0, se))


def fit_power(
    years: Sequence[float],
    t: Sequence[float],
    t_nominal: float,
    *,
    y0: float,
    B: float = B_DEFAULT,
    where: str = "",
) -> Rate:
    """The power law d = A (y - y0)^B fitted with ``B`` fixed (see the module docstring).

    Args:
        years: decimal years of the surveys. t: thicknesses there, mm.
        t_nominal: as-built thickness, mm. y0: the year corrosion began (year built).
        B: the exponent (0 < B <= 1.5).

    Raises:
        TrendError: bad values, ``y0`` not before the first survey, ``B`` out of range.
    """
    _check(years, t, where)
    if not (math.isfinite(B) and 0.0 < B <= 1.5):
        raise TrendError(f"power law exponent B = {B!r} must be in (0, 1.5]", where=where)
    if not math.isfinite(y0) or (years and y0 >= years[0]):
        raise TrendError(
            f"the year corrosion began ({y0!r}) must come before the first survey", where=where
        )
    n = len(years)
    if n < 2:
        return Rate("power", "one survey", n, years[-1] if n else 0.0, 0.0, B=B, y0=y0)
    x = [(y - y0) ** B for y in years]
    d = [max(t_nominal - v, 0.0) for v in t]
    sxx = math.fsum(v * v for v in x)
    A = math.fsum(a * b for a, b in zip(x, d, strict=True)) / sxx
    sse = math.fsum((di - A * xi) ** 2 for xi, di in zip(x, d, strict=True))
    se_A = math.sqrt(sse / (n - 1) / sxx)
    tau = years[-1] - y0
    r = A * B * tau ** (B - 1.0)
    se = se_A * B * tau ** (B - 1.0)
    note = "" if n > 2 else "two surveys: the standard error has one degree of freedom"
    return _thickening(
        Rate("power", "least squares", n, years[-1], r, se, A, se_A, B, y0, note=note)
    )


def _thickening(rate: Rate) -> Rate:
    if rate.r >= 0:
        return rate
    from dataclasses import replace

    msg = "the fit shows thickening (measurement scatter): no further loss is projected"
    return replace(rate, note=f"{rate.note}; {msg}" if rate.note else msg)


def rate_since_built(
    y: float,
    t: float,
    t_nominal: float,
    *,
    y0: float | None,
    model: str = "linear",
    B: float = B_DEFAULT,
    where: str = "",
) -> Rate:
    """The rate of a region read in one survey only (see the module docstring).

    Args:
        y: decimal year of that survey. t: the thickness found there, mm.
        t_nominal: as-built thickness, mm. y0: the year corrosion began (the year built;
            None: not known, the region has no rate). model, B: as :func:`fit_power`.

    Raises:
        TrendError: a value that is not finite, or a bad model or exponent.
    """
    if not all(math.isfinite(v) for v in (y, t, t_nominal)):
        raise TrendError(f"year {y!r} or thickness {t!r} mm is not finite", where=where)
    if model not in MODELS:
        raise TrendError(f"corrosion model {model!r} is not one of {MODELS}")
    if y0 is None or not math.isfinite(y0) or y0 >= y:
        why = (
            "the year built is not known"
            if y0 is None
            else f"the year corrosion began ({y0!r}) is not before the survey ({y:.1f})"
        )
        return Rate(
            model,
            "no rate",
            1,
            y,
            0.0,
            B=B if model == "power" else None,
            note=f"read in the latest survey only and {why}: no rate; held as found "
            "(no further loss projected, which may be optimistic)",
        )
    d = max(t_nominal - t, 0.0)
    tau = y - y0
    note = (
        f"rate from the loss since built: one survey, {d:.3g} mm lost from nominal over "
        f"{tau:.1f} years since {y0:g}; no standard error"
    )
    if model == "linear":
        return Rate("linear", SINCE_BUILT, 1, y, d / tau, note=note)
    if not (math.isfinite(B) and 0.0 < B <= 1.5):
        raise TrendError(f"power law exponent B = {B!r} must be in (0, 1.5]", where=where)
    A = d / tau**B
    return Rate("power", SINCE_BUILT, 1, y, A * B * tau ** (B - 1.0), None, A, None, B, y0, note)
