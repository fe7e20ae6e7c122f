"""From the regions' thickness spreads to a band on every quantity of an evaluation.

``evaluate(deltas)`` gives the quantities (capacities, measures) with each region's
thickness moved by ``deltas[region]`` mm; it is the engine itself (see
:mod:`core.bands.station`), so nothing here knows a clause.

* **First order** (the delta method, any probability text): var(Q) = sum_r (dQ/dt_r
  sigma_r)^2 with independent regions, dQ/dt_r by a one-sided finite difference of the
  engine (thinning by a small step, which stays valid where a value is capped at nominal);
  the 5 % and 95 % values and the probability beyond 1 by the normal approximation
  Q ~ N(Q(mean), var(Q)).
* **Monte Carlo**: independent normal thicknesses (numpy ``default_rng`` with a fixed
  seed), the 5 % and 95 % sample quantiles and the fraction beyond 1.
"""

from __future__ import annotations

import math
from collections.abc import Callable, Hashable, Mapping
from dataclasses import dataclass, field

import numpy as np

from core.bands.options import STEP_MM, Z95
from core.errors import AsfoundError, InputError

Evaluate = Callable[[Mapping[Hashable, float]], Mapping[str, float]]


def normal_cdf(z: float) -> float:
    """Phi(z) of the standard normal distribution."""
    return 0.5 * (1.0 + math.erf(z / math.sqrt(2.0)))


def beyond_one(value: float, sd: float, higher_is_better: bool) -> float:
    """P(Q < 1) (``higher_is_better``: a rating factor) or P(Q > 1) (a utilisation) of
    Q ~ N(value, sd^2); a step at 1 when sd = 0."""
    if sd <= 0.0:
        bad = value < 1.0 if higher_is_better else value > 1.0
        return 1.0 if bad else 0.0
    p_below = normal_cdf((1.0 - value) / sd)
    return p_below if higher_is_better else 1.0 - p_below


@dataclass(frozen=True)
class Band:
    """The band of one quantity (unit of the quantity: N, N mm, or dimensionless).

    Attributes:
        quantity: its name. value: today's value (from the mean thicknesses).
        sd: its standard deviation. p5, p95: the 5 % and 95 % values.
        p_beyond: P(RF < 1) or P(utilisation > 1) for a measure, else None.
        method: ``"first_order"`` or ``"monte_carlo"``.
        grads: dQ/dt per region (unit of Q per mm; first order only).
        samples: the evaluations behind it (Monte Carlo), failed: samples the engine refused.
    """

    quantity: str
    value: float
    sd: float
    p5: float
    p95: float
    p_beyond: float | None
    method: str
    grads: Mapping[Hashable, float] = field(default_factory=dict)
    samples: int = 0
    failed: int = 0

    def __post_init__(self) -> None:
        for name in ("value", "sd", "p5", "p95"):
            if not math.isfinite(getattr(self, name)):
                raise InputError(f"{name} of the band is not finite", where=self.quantity)
        if self.sd < 0.0 or self.p5 > self.p95:
            raise InputError("the band is not ordered (sd >= 0, p5 <= p95)", where=self.quantity)

    @property
    def width(self) -> float:
        return self.p95 - self.p5

    def straddles(self, threshold: float = 1.0) -> bool:
        """True where the band holds the threshold inside it (not settled by the readings)."""
        return self.p5 < threshold < self.p95


def first_order(
    evaluate: Evaluate,
    sigmas: Mapping[Hashable, float],
    higher: Mapping[str, bool | None],
    step: float = STEP_MM,
    base: Mapping[str, float] | None = None,
) -> tuple[dict[str, Band], int]:
    """Bands of every quantity of ``evaluate`` by the delta method; ``higher[q]`` says
    whether a measure's good side is up (True), down (False), or that q is no measure
    (None). Only regions with sigma > 0 are moved (one evaluation each). Returns the bands
    and the number of engine evaluations (``base`` given: that one is not counted)."""
    runs = 0
    if base is None:
        base, runs = evaluate({}), 1
    grads: dict[str, dict[Hashable, float]] = {q: {} for q in base}
    for r, s in sigmas.items():
        if s <= 0.0:
            continue
        moved = evaluate({r: -step})
        runs += 1
        for q, v0 in base.items():
            v = moved.get(q)
            g = 0.0 if v is None or not math.isfinite(v) else (v0 - v) / step
            grads[q][r] = g
    out = {}
    for q, v0 in base.items():
        var = sum((g * sigmas[r]) ** 2 for r, g in grads[q].items())
        sd = math.sqrt(var)
        h = higher.get(q)
        out[q] = Band(
            q,
            v0,
            sd,
            v0 - Z95 * sd,
            v0 + Z95 * sd,
            None if h is None else beyond_one(v0, sd, h),
            "first_order",
            grads[q],
        )
    return out, runs


def monte_carlo(
    evaluate: Evaluate,
    sigmas: Mapping[Hashable, float],
    higher: Mapping[str, bool | None],
    samples: int,
    seed: int,
    base: Mapping[str, float] | None = None,
) -> tuple[dict[str, Band], int]:
    """Bands of every quantity of ``evaluate`` from ``samples`` independent normal draws of
    the thicknesses (numpy ``default_rng(seed)``: the same bands every run). A draw the
    engine refuses (an :class:`AsfoundError`) is counted as failed and left out. Returns the
    bands and the number of engine evaluations."""
    runs = 0
    if base is None:
        base, runs = evaluate({}), 1
    keys = [r for r, s in sigmas.items() if s > 0.0]
    rng = np.random.default_rng(seed)
    draws = rng.standard_normal((samples, len(keys))) * np.array([sigmas[r] for r in keys])
    got: dict[str, list[float]] = {q: [] for q in base}
    failed = 0
    for row in draws if keys else ():
        runs += 1
        try:
            vals = evaluate(dict(zip(keys, row.tolist(), strict=True)))
        except AsfoundError:
            failed += 1
            continue
        for q in base:
            v = vals.get(q)
            if v is not None and math.isfinite(v):
                got[q].append(v)
    out = {}
    for q, v0 in base.items():
        xs = np.asarray(got[q])
        h = higher.get(q)
        if xs.size < 2:
            out[q] = Band(q, v0, 0.0, v0, v0, None if h is None else beyond_one(v0, 0.0, h),
                          "monte_carlo", samples=int(xs.size), failed=failed)  # fmt: skip
            continue
        lo, hi = np.quantile(xs, [0.05, 0.95])
        p = None
        if h is not None:
            p = float(np.mean(xs < 1.0)) if h else float(np.mean(xs > 1.0))
        out[q] = Band(q, v0, float(np.std(xs, ddof=1)), float(lo), float(hi), p,
                      "monte_carlo", samples=int(xs.size), failed=failed)  # fmt: skip
    return out, runs
