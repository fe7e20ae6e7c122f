"""LRFR rating factor and simple-span load effects.

Sources: rating equation RF = (C - gDC DC - gDW DW)/(gLL (LL+IM)), C = phi_c phi_s phi Rn,
phi_c phi_s >= 0.85, factors 1.25 / 1.50 / 1.75 / 1.35, condition factors 1.00 / 0.95 /
0.85: AASHTO Manual for Bridge Evaluation (from memory); hand calculation. Influence lines
of a simply supported beam (mechanics of materials): M = Pab/L, V = Pb/L; closed forms.
"""

import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.checks.rating import RatingFactors, _effects, rating_factor, simple_span_effects
from core.errors import InputError

KN = 1000.0


def test_inventory_rating_factor():
    # RF = (1000 - 1.25*200 - 1.50*50) / (1.75*300) = 675 / 525 = 1.285714
    r = rating_factor(phi=1.0, Rn=1000 * KN, DC=200 * KN, DW=50 * KN, LL_IM=300 * KN)
    assert pytest.approx(1.285714, rel=1e-6) == r.RF
    assert pytest.approx(1000 * KN) == r.C


def test_operating_and_condition_factors():
    op = RatingFactors(level="operating")
    # 675 / (1.35 * 300) = 1.666667
    r = rating_factor(phi=1.0, Rn=1000 * KN, DC=200 * KN, DW=50 * KN, LL_IM=300 * KN, factors=op)
    assert pytest.approx(1.666667, rel=1e-6) == r.RF
    fair = RatingFactors(condition="fair")
    # C = 0.95 * 1000 = 950: (950 - 325) / 525 = 1.190476
    r = rating_factor(phi=1.0, Rn=1000 * KN, DC=200 * KN, DW=50 * KN, LL_IM=300 * KN, factors=fair)
    assert pytest.approx(1.190476, rel=1e-6) == r.RF


def test_phi_c_phi_s_floor():
    # poor 0.85 * system 0.90 = 0.765 < 0.85 -> 0.85: C = 850; RF = (850 - 325)/525 = 1.0
    f = RatingFactors(condition="poor", phi_s=0.9)
    assert f.phi_cs == 0.85
    r = rating_factor(phi=1.0, Rn=1000 * KN, DC=200 * KN, DW=50 * KN, LL_IM=300 * KN, factors=f)
    assert pytest.approx(1.0) == r.RF
    assert any("floor" in n for n in r.notes)


def test_wrong_signs_named():
    with pytest.raises(InputError, match="load effect DC = -5"):
        rating_factor(phi=1.0, Rn=1000, DC=-5, LL_IM=300)
    with pytest.raises(InputError, match="load effect DW = -1"):
        rating_factor(phi=1.0, Rn=1000, DC=5, DW=-1, LL_IM=300)
    with pytest.raises(InputError, match=r"load effect LL\+IM = 0 .* greater than 0"):
        rating_factor(phi=1.0, Rn=1000, DC=5, LL_IM=0)
    with pytest.raises(InputError, match="condition 'bad'"):
        RatingFactors(condition="bad")
    with pytest.raises(InputError, match=r"phi_s = 1\.5"):
        RatingFactors(phi_s=1.5)


def test_single_axle_midspan_and_quarter_point():
    # midspan: M = PL/4 = 100 kN * 10 m / 4 = 250 kN·m; V = +/- P/2
    e = simple_span_effects(L=10_000, x=5_000, axles=[100 * KN])
    assert e.M_live == pytest.approx(2.5e8)
    assert e.V_live_pos == pytest.approx(50 * KN) and e.V_live_neg == pytest.approx(-50 * KN)
    # x = L/4: M = P x (L - x)/L = 3PL/16 = 187.5 kN·m; V+ = P(L - x)/L = 75 kN; V- = -25 kN
    # dead w = 10 N/mm: M = w x (L - x)/2 = 93.75 kN·m; V = w (L/2 - x) = 25 kN
    e = simple_span_effects(L=10_000, x=2_500, axles=[100 * KN], w=10.0, IM=0.33)
    assert e.M_live == pytest.approx(1.875e8)
    assert e.V_live_pos == pytest.approx(75 * KN) and e.V_live_neg == pytest.approx(-25 * KN)
    assert e.M_dead == pytest.approx(9.375e7) and e.V_dead == pytest.approx(25 * KN)
    assert e.V_live == pytest.approx(75 * KN)
    assert e.V_live_im == pytest.approx(1.33 * 75 * KN)  # IM = 0.33, AASHTO LRFD 3.6.2.1


def test_two_axles_midspan_moment():
    # two equal axles P, spacing s <= L/2, one at midspan: M = PL/4 + P (L/2 - s)/2
    e = simple_span_effects(L=10_000, x=5_000, axles=[100 * KN, 100 * KN], spacings=[2_000])
    assert e.M_live == pytest.approx(100 * KN * 10_000 / 4 + 100 * KN * 3_000 / 2)
    # V at a support: both axles on, lead at the support: P + P (L - s)/L = 180 kN
    e = simple_span_effects(L=10_000, x=0, axles=[100 * KN, 100 * KN], spacings=[2_000])
    assert e.V_live_pos == pytest.approx(180 * KN) and e.M_live == 0.0


def test_bad_span_input():
    with pytest.raises(InputError, match="x = 12000"):
        simple_span_effects(L=10_000, x=12_000, axles=[1.0])
    with pytest.raises(InputError, match="2 axles need 1 spacings, got 0"):
        simple_span_effects(L=10_000, x=5_000, axles=[1.0, 2.0])


@given(
    st.lists(st.floats(10e3, 200e3), min_size=1, max_size=4),
    st.lists(st.floats(500, 5_000), min_size=3, max_size=3),
    st.floats(0, 1),
    st.floats(-20_000, 30_000),
)
def test_envelope_bounds_every_placement(axles, spacings, xf, shift):
    # property: the envelope (axles at breakpoints) is at least any other placement
    L, x = 12_000.0, 12_000.0 * xf
    sp = spacings[: len(axles) - 1]
    e = simple_span_effects(L=L, x=x, axles=axles, spacings=sp)
    offs = [0.0]
    for s in sp:
        offs.append(offs[-1] + s)
    for d in (1.0, -1.0):
        loads = [(shift + d * o, p) for o, p in zip(offs, axles, strict=True)]
        m, vr, vl = _effects(L, x, loads)
        assert m <= e.M_live * (1 + 1e-9) + 1e-6
        assert max(vr, vl) <= e.V_live_pos * (1 + 1e-9) + 1e-6
        assert min(vr, vl) >= e.V_live_neg * (1 + 1e-9) - 1e-6


@given(st.floats(100e3, 5e6), st.floats(1.0, 2.0))
def test_rf_monotone_in_capacity(Rn, factor):
    # property: more capacity never lowers the rating factor
    a = rating_factor(phi=0.9, Rn=Rn, DC=50e3, DW=10e3, LL_IM=100e3)
    b = rating_factor(phi=0.9, Rn=Rn * factor, DC=50e3, DW=10e3, LL_IM=100e3)
    assert b.RF >= a.RF
