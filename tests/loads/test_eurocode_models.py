"""EN 1991-2 Load Model 71, its dynamic factor and Load Model 1, against the formulas.

Sources (EN 1991-2:2003, from memory): 6.3.2(2) LM71 = four 250 kN axles at 1.6 m and
q_vk = 80 kN/m beyond 0.8 m from the outer axles, applied wherever unfavourable; 6.3.2(3)
classification factor alpha in {0.75, ..., 1.46}; 6.4.5.2 Eq. (6.4)
Phi2 = 1.44 / (sqrt(L_phi) - 0.2) + 0.82, 1.00 <= Phi2 <= 1.67, Eq. (6.5)
Phi3 = 2.16 / (sqrt(L_phi) - 0.2) + 0.73, 1.00 <= Phi3 <= 2.00 (L_phi in m); 4.3.2 Table 4.2
LM1: tandem axles 300 / 200 / 100 kN, uniform 9 / 2.5 kN/m², lanes 3 m wide. The closed forms
are statics of a simply supported beam (hand calculation). The lever rule is statics.
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from core.errors import InputError
from core.loads.distribution import lever_rule
from core.loads.models import LM1, LM71, phi_dynamic

KNM = 1e6  # N*mm per kN*m
KN = 1e3


def lm71_brute(L: float, x: float, step: float = 0.01) -> tuple[float, float, float]:
    """Sweep of LM71 (kN, m) by statics: axles at 1.6 m, 80 kN/m on the unfavourable part
    of the influence line outside [first - 0.8, last + 0.8], as many small point loads."""
    n = round(L / 0.002)
    a = (np.arange(n) + 0.5) * (L / n)
    w = 80.0 * L / n

    def il(pos, side=1):
        M = np.where(pos <= x, pos * (L - x) / L, x * (L - pos) / L)
        at = np.isclose(pos, x, rtol=0.0, atol=1e-9)
        V = np.where((pos < x) & ~at | (at & (side < 0)), -pos / L, (L - pos) / L)
        on = (pos >= -1e-9) & (pos <= L + 1e-9)
        return np.where(on, M, 0.0), np.where(on, V, 0.0)

    Ma, Va = il(a)
    best = [0.0, 0.0, 0.0]
    for c in np.arange(-6.0, L + 1.0, step):
        axles = c + np.array([0.0, 1.6, 3.2, 4.8])
        out = (a < c - 0.8) | (a > c + 5.6)
        for side in (1, -1):
            Mx, Vx = il(axles, side)
            M = 250 * Mx.sum() + w * Ma[out].sum()
            Vp = 250 * Vx.sum() + w * Va[out & (Va > 0)].sum()
            Vn = 250 * Vx.sum() + w * Va[out & (Va < 0)].sum()
            best = [max(best[0], M), max(best[1], Vp), min(best[2], Vn)]
    return tuple(best)


def test_lm71_midspan_moment_closed_form():
    # mid-span x = L/2 (hand calculation): the axles' sum of ordinates is largest, L - 3.2 m,
    # whenever the station lies between the 2nd and 3rd axle; the 80 kN/m then covers most
    # of the influence line when an inner axle stands on the station, leaving the gap
    # [x - 4.0, x + 2.4] whose influence area is 1.6 L - 5.44 m²:
    # M = 250 (L - 3.2) + 80 (L²/8 - 1.6 L + 5.44) kN*m; L = 18 m gives 5071.2 kN*m
    L = 18.0
    closed = 250.0 * (L - 3.2) + 80.0 * (L**2 / 8.0 - 1.6 * L + 5.44)
    assert closed == pytest.approx(5071.2)
    env = LM71(alpha=1.0, maintenance="careful", L_phi=1e9).envelope(L * 1000, L * 500)
    # L_phi huge makes Phi2 = 1.00 (its lower bound), so the value is LM71 itself
    assert env.M.value / KNM == pytest.approx(closed, rel=1e-9)
    # the symmetric placement (axles at +-0.8 and +-2.4 m) gives less: 5045.6 kN*m
    assert env.M.value / KNM > 250.0 * (L - 3.2) + 80.0 * (L**2 / 8.0 - 1.6 * L + 5.12)


@pytest.mark.parametrize("L,frac", [(12.0, 0.25), (18.0, 0.1), (18.0, 0.4), (7.0, 0.0)])
def test_lm71_matches_sweep(L, frac):
    x = frac * L
    env = LM71(alpha=1.0, maintenance="careful", L_phi=1e9).envelope(L * 1000, x * 1000)
    M, Vp, Vn = lm71_brute(L, x)
    # the sweep's step (1 cm) and strips (2 mm) bound its error well below 0.1 %
    assert env.M.value / KNM == pytest.approx(M, rel=1e-3)
    assert env.V_pos.value / KN == pytest.approx(Vp, rel=1e-3)
    if Vn < -1.0:
        assert env.V_neg.value / KN == pytest.approx(Vn, rel=1e-3)
    # and never below the sweep by more than its own resolution (the engine is exact)
    assert env.M.value / KNM >= M * (1 - 1e-6)


@pytest.mark.parametrize("Lphi", [2.0, 4.0, 9.0, 18.0, 40.0, 120.0, 400.0])
def test_phi2_phi3_formulas(Lphi):
    r = math.sqrt(Lphi) - 0.2
    phi2 = min(max(1.44 / r + 0.82, 1.0), 1.67)
    phi3 = min(max(2.16 / r + 0.73, 1.0), 2.0)
    assert phi_dynamic(Lphi * 1000, "careful") == (pytest.approx(phi2, rel=1e-12), "Phi2")
    assert phi_dynamic(Lphi * 1000, "standard") == (pytest.approx(phi3, rel=1e-12), "Phi3")


def test_phi_values_and_limits():
    # L_phi = 18 m: Phi2 = 1.44/4.0426 + 0.82 = 1.1762, Phi3 = 2.16/4.0426 + 0.73 = 1.2643
    assert phi_dynamic(18_000, "careful")[0] == pytest.approx(1.1762, abs=1e-4)
    assert phi_dynamic(18_000, "standard")[0] == pytest.approx(1.2643, abs=1e-4)
    assert phi_dynamic(1_000, "careful")[0] == 1.67 and phi_dynamic(1_000, "standard")[0] == 2.0
    assert phi_dynamic(400_000, "careful")[0] == 1.0


def test_lm71_alpha_and_phi_multiply():
    L = 18_000.0
    base = LM71(1.0, "careful", L_phi=1e9).envelope(L, 9_000).M.value
    env = LM71(1.21, "standard").envelope(L, 9_000)
    Phi3 = 2.16 / (math.sqrt(18.0) - 0.2) + 0.73
    assert env.M.value == pytest.approx(1.21 * Phi3 * base, rel=1e-12)
    with pytest.raises(InputError, match=r"alpha = 1\.6"):
        LM71(1.6)


def test_lm1_lane_one_midspan():
    # lane 1: two 300 kN axles 1.2 m apart, one at mid-span: 300 (L/4 + (L/2 - 1.2)/2);
    # 27 kN/m over the span: 27 L^2 / 8 (hand calculation, L = 20 m)
    L = 20.0
    ts = 300.0 * (L / 4 + (L / 2 - 1.2) / 2)
    udl = 9.0 * 3.0 * L**2 / 8
    env = LM1().envelope(L * 1000, L * 500)
    assert env.M.value / KNM == pytest.approx(ts + udl, rel=1e-9)
    two = LM1(lane_shares=(0.6, 0.3)).envelope(L * 1000, L * 500)
    exp = (0.6 * 300 + 0.3 * 200) / 300 * ts + (0.6 * 27 + 0.3 * 7.5) * L**2 / 8
    assert two.M.value / KNM == pytest.approx(exp, rel=1e-9)


def test_lever_rule_two_girders():
    # girders 6.0 m apart; wheel lines (half a lane each) 0.6 m and 2.4 m from the girder;
    # g = m [0.5 (6 - 0.6)/6 + 0.5 (6 - 2.4)/6] = 1.2 x 0.75 = 0.90 (statics by hand)
    r = lever_rule(6000.0, [(600.0, 0.5), (2400.0, 0.5)], m=1.2)
    assert r.g == pytest.approx(0.90)
    # a load beyond the other girder gives nothing; one on the overhang more than its share
    assert lever_rule(6000.0, [(7000.0, 1.0)]).g == 0.0
    assert lever_rule(6000.0, [(-600.0, 1.0)]).g == pytest.approx(1.1)
    assert "lever rule" in r.words()


@settings(max_examples=30, deadline=None)
@given(st.floats(3.0, 60.0), st.floats(0.0, 1.0), st.floats(1.0, 1.3))
def test_heavier_model_never_less(L, frac, k):
    # property: scaling the loads (alpha) scales every envelope value
    a = LM71(1.0, "careful").envelope(L * 1000, frac * L * 1000)
    b = LM71(min(1.0 * k, 1.46), "careful").envelope(L * 1000, frac * L * 1000)
    assert b.M.value >= a.M.value * (1 - 1e-12)
    assert b.V_pos.value >= a.V_pos.value * (1 - 1e-12)
