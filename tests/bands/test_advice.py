"""The ranking of where to measure next (properties; common practice, no source)."""

from __future__ import annotations

import math

import pytest

from core.bands.advice import rank_regions
from core.bands.propagate import Band
from core.bands.run import StationBands, member_advice
from core.bands.sigma import RegionSigma


def sig(part: str, n: int, s: float, tol: float = 0.1) -> RegionSigma:
    return RegionSigma(part, None, n, 8.0, tol, "ultrasonic", s, False, tol / 2, s / math.sqrt(n))


def test_narrowing_by_hand():
    """One region, gradient g: var = g^2 (0.05^2 + s^2 / n); with 3 more readings
    var' = g^2 (0.05^2 + s^2 / (n + 3)); the band narrows by 1 - sqrt(var' / var).
    s = 0.4, n = 3: var ~ 0.0025 + 0.05333 = 0.05583, var' = 0.0025 + 0.02667 = 0.02917,
    narrowing = 1 - sqrt(0.5224) = 0.2772 (by hand)."""
    (r,) = rank_regions("S1", {("web", None): 123.0}, [sig("web", 3, 0.4)], 3)
    assert r.share == pytest.approx(1.0)
    assert r.narrowing == pytest.approx(0.2772, abs=1e-4)


def test_the_region_with_the_larger_term_ranks_first_and_a_flat_one_last():
    sigmas = [sig("a", 3, 0.1), sig("b", 3, 0.5), sig("c", 3, 0.5)]
    grads = {("a", None): 10.0, ("b", None): 10.0, ("c", None): 0.0}
    ranked = rank_regions("S1", grads, sigmas, 3)
    assert [r.part for r in ranked] == ["b", "a", "c"]
    assert sum(r.share for r in ranked) == pytest.approx(1.0)
    assert ranked[-1].narrowing == 0.0


def _station(sid: str, p5: float, p95: float, narrowing: float) -> StationBands:
    b = Band("v|m", (p5 + p95) / 2, (p95 - p5) / 3.29, p5, p95, 0.5, "first_order")
    ranks = rank_regions(sid, {("web", None): 1.0}, [sig("web", 3, 0.3)], 3)
    assert ranks[0].narrowing > 0.0
    return StationBands("G1", sid, 0.0, (), {"v|m": b}, {"v": "web shear"}, {"v": "force"},
                        {"v": "RF"}, "v", ranks, 2)  # fmt: skip


def test_an_unsettled_station_comes_first():
    """A station whose band holds 1 is advised before a wider band that is settled."""
    settled = _station("S1", 1.5, 2.5, 0.3)
    unsettled = _station("S2", 0.99, 1.01, 0.3)
    top = member_advice((settled, unsettled))
    assert [r.station for r in top] == ["S2", "S1"]
