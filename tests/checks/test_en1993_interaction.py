"""EN 1993-1-5:2006 5.4 (flange contribution to shear, Eq. 5.8) and 7.1 (bending and shear,
Eq. 7.1), from memory: hand calculations from the clauses."""

import math

import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.checks.en1993_interaction import bending_shear, flange_contribution
from core.errors import InputError

EPS355 = math.sqrt(235.0 / 355.0)  # 0.813616


def test_flange_contribution_eq_5_8():
    # bf = 300, tf = 20, fyf = fyw = 355, t = 10, hw = 1500, a = 1500, gamma_M1 = 1.1:
    # bf <= t + 30 eps tf = 10 + 30 * 0.813616 * 20 = 498.2 -> 300 kept
    # c = 1500 (0.25 + 1.6 * 300 * 20² * 355 / (10 * 1500² * 355)) = 1500 * 0.2585333
    #   = 387.80 mm; Vbf,Rd = 300 * 400 * 355 / (387.80 * 1.1) = 99 864 N (M_Ed = 0)
    kw = dict(bf=300, tf=20, fyf=355, t=10, hw=1500, fyw=355, a=1500, eps=EPS355, gamma_M1=1.1)
    c = 1500 * (0.25 + 1.6 * 300 * 400 / (10 * 1500**2))
    r0 = flange_contribution(M_Ed=0.0, Mf_Rd=2e9, **kw)
    assert r0.values[2].value == pytest.approx(c) and c == pytest.approx(387.8, abs=0.01)
    assert r0.Vbf_Rd == pytest.approx(300 * 400 * 355 / (c * 1.1), rel=1e-12)
    assert r0.Vbf_Rd == pytest.approx(99_864, rel=1e-4)
    # M_Ed = Mf,Rd / 2: times (1 - 0.25) = 0.75
    assert flange_contribution(M_Ed=1e9, Mf_Rd=2e9, **kw).Vbf_Rd == pytest.approx(0.75 * r0.Vbf_Rd)
    # M_Ed >= Mf,Rd: nothing
    assert flange_contribution(M_Ed=2e9, Mf_Rd=2e9, **kw).Vbf_Rd == 0.0


def test_flange_width_limited_to_15_eps_tf_each_side():
    # bf = 800 > t + 30 eps tf = 498.17 mm: the limited width enters
    r = flange_contribution(
        bf=800,
        tf=20,
        fyf=355,
        t=10,
        hw=1500,
        fyw=355,
        a=1500,
        eps=EPS355,
        M_Ed=0,
        Mf_Rd=1e9,
        gamma_M1=1.1,
    )
    assert r.values[0].value == pytest.approx(10 + 30 * EPS355 * 20)


def test_interaction_eq_7_1():
    # Mpl,Rd = 1000 kN*m, Mf,Rd = 600, Vbw,Rd = 1000 kN (hand calculation):
    # eta3 = 0.8: M_Rd = 1000 - 400 (2 * 0.8 - 1)² = 856 kN*m, and Eq. 7.1 holds with equality:
    # 856/1000 + (1 - 0.6) * 0.36 = 1.000
    it = bending_shear(V_Ed=800e3, Vbw_Rd=1000e3, Mpl_Rd=1000e6, Mf_Rd=600e6)
    assert it.M_Rd == pytest.approx(856e6) and it.eta3 == pytest.approx(0.8)
    assert it.M_Rd / 1000e6 + (1 - 0.6) * (2 * 0.8 - 1) ** 2 == pytest.approx(1.0)
    # eta3 <= 0.5: no interaction; eta3 > 1: the flanges alone
    assert bending_shear(V_Ed=400e3, Vbw_Rd=1000e3, Mpl_Rd=1000e6, Mf_Rd=600e6).M_Rd == 1000e6
    assert bending_shear(V_Ed=1200e3, Vbw_Rd=1000e3, Mpl_Rd=1000e6, Mf_Rd=600e6).M_Rd == 600e6
    with pytest.raises(InputError, match="Mf,Rd <= Mpl,Rd"):
        bending_shear(V_Ed=1.0, Vbw_Rd=1.0, Mpl_Rd=1.0, Mf_Rd=2.0)


@given(st.floats(0, 2.0), st.floats(0, 2.0), st.floats(0.1, 1.0))
def test_more_shear_never_raises_the_moment_resistance(e1, e2, mf):
    # property of Eq. 7.1: M_Rd(V) does not increase with V and stays within [Mf, Mpl]
    lo, hi = sorted((e1, e2))
    a = bending_shear(V_Ed=lo * 1e6, Vbw_Rd=1e6, Mpl_Rd=1e9, Mf_Rd=mf * 1e9)
    b = bending_shear(V_Ed=hi * 1e6, Vbw_Rd=1e6, Mpl_Rd=1e9, Mf_Rd=mf * 1e9)
    assert b.M_Rd <= a.M_Rd * (1 + 1e-12)
    assert mf * 1e9 * (1 - 1e-12) <= b.M_Rd <= 1e9
