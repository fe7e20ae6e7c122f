"""EN 1993-1-5 Section 6 resistance to transverse forces: hand calculations from the clause.

Source: EN 1993-1-5:2006 6.1 to 6.5, Eq. 6.1 to 6.13 and Figure 6.1 (from memory); EN 1993-2
Table 6.1 gamma_M1 = 1.10 (from memory); hand calculation from the clause.
fyw = fyf = 355 MPa, E = 210 000 MPa, bf = 400, tf = 20 mm unless stated.
"""

import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.checks.en1993_patch import transverse_force_resistance
from core.errors import InputError

KW = {"fyw": 355, "bf": 400, "tf": 20, "m2_rule": "clause"}
ZERO = {**KW, "m2_rule": "zero"}


def test_type_a_between_stiffeners():
    # hw = 1200, tw = 10, ss = 200, a = 1500: kF = 6 + 2 (0.8)² = 7.28;
    # Fcr = 0.9 * 7.28 * 210000 * 1000 / 1200 = 1 146 600 N (6.5); m1 = 40; m2 = 0.02 * 60² = 72
    # l_y = 200 + 2 * 20 (1 + sqrt(112)) = 663.320 mm (6.10); lambda_F = 1.433078 (6.4);
    # chi_F = 0.5 / 1.433078 = 0.348899 (6.3); L_eff = 231.432; F = 355 * 231.432 * 10 = 821 584 N
    r = transverse_force_resistance(hw=1200, tw=10, ss=200, a=1500, load_type="a", **KW)
    assert r.value("kF").value == pytest.approx(7.28)
    assert r.value("Fcr").value == pytest.approx(1_146_600.0)
    assert r.value("l_y").value == pytest.approx(663.3202, rel=1e-6)
    assert r.value("chi_F").value == pytest.approx(0.3488994, rel=1e-6)
    assert r.Rn == pytest.approx(821_583.6, rel=1e-6)
    assert r.Rr == pytest.approx(821_583.6 / 1.10, rel=1e-6)  # F_Rd with gamma_M1 = 1.10


def test_type_b():
    # kF = 3.5 + 2 (0.8)² = 4.78; Fcr = 752 850 N; l_y as type a; lambda_F = 1.768567;
    # chi_F = 0.282715; F = 665 733 N
    r = transverse_force_resistance(hw=1200, tw=10, ss=200, a=1500, load_type="b", **KW)
    assert r.value("kF").value == pytest.approx(4.78)
    assert r.Rn == pytest.approx(665_732.9, rel=1e-6)


def test_type_c_at_an_unstiffened_girder_end():
    # ss = 150, c = 50: kF = 2 + 6 * 200/1200 = 3.0; Fcr = 472 500 N;
    # le = 3 * 210000 * 100 / (2 * 355 * 1200) = 73.944 <= ss + c (6.13)
    # (6.11): 73.944 + 20 sqrt(20 + 3.6972² + 72) = 279.535; (6.12): 73.944 + 20 sqrt(112)
    # = 285.60 -> l_y = 279.535; lambda_F = 1.449209; chi_F = 0.345016; F = 342 375.7 N
    r = transverse_force_resistance(hw=1200, tw=10, ss=150, c=50, load_type="c", **KW)
    assert r.value("kF").value == pytest.approx(3.0)
    assert r.value("le").value == pytest.approx(73.9437, rel=1e-5)
    assert r.value("l_y").value == pytest.approx(279.5347, rel=1e-6)
    assert "Eq. 6.11" in r.value("l_y").source
    assert r.Rn == pytest.approx(342_375.7, rel=1e-6)


def test_stocky_web_m2_zero_and_chi_one():
    # hw = 600, tw = 30, ss = 100, no stiffeners: kF = 6, Fcr = 51.03e6 N, m1 = 13.333;
    # with m2 = 18: l_y = 363.90, lambda_F = 0.2756 <= 0.5 -> m2 = 0 (6.9):
    # l_y = 100 + 40 (1 + sqrt(13.333)) = 286.059; chi_F = 1; F = 355 * 286.059 * 30 = 3 046 532 N
    r = transverse_force_resistance(hw=600, tw=30, ss=100, load_type="a", **KW)
    assert r.value("m2").value == 0.0
    assert r.value("chi_F").value == 1.0
    assert r.Rn == pytest.approx(3_046_532.1, rel=1e-6)


def test_l_y_not_beyond_the_stiffener_spacing():
    # a = 500: kF = 6 + 2 * 2.4² = 17.52; l_y = 200 + ... = 863 > a -> 500 (6.10)
    r = transverse_force_resistance(hw=1200, tw=10, ss=400, a=500, load_type="a", **KW)
    assert r.value("l_y").value == 500.0
    assert r.Rn == pytest.approx(1_106_563.9, rel=1e-6)


def test_default_m2_zero_is_below_the_clause():
    # m2 = 0 (our conservative default): l_y = 200 + 40 (1 + sqrt(40)) = 492.982;
    # lambda_F = sqrt(492.982 * 10 * 355 / 1146600) = 1.235446; chi_F = 0.404712;
    # F = 355 * 0.404712 * 492.982 * 10 = 708 281 N, below the clause's 821 584 N
    r = transverse_force_resistance(hw=1200, tw=10, ss=200, a=1500, load_type="a", **ZERO)
    assert r.value("m2").value == 0.0
    assert r.Rn == pytest.approx(708_281.3, rel=1e-6)
    assert r.value("F (Eq. 6.9 as written)").value == pytest.approx(821_583.6, rel=1e-6)
    assert any("step at lambda_F = 0.5" in n for n in r.notes)


def test_the_clause_steps_at_lambda_F_one_half():
    # EN 1993-1-5:2006 Eq. 6.9 as written: at tw = 25.25 mm lambda_F > 0.5 (m2 counted),
    # at 25.26 mm lambda_F <= 0.5 (m2 = 0): the thicker web rates lower (hand calculation
    # from the clause: 4.615 MN against 2.683 MN); the default rule has no step there
    kw = {"hw": 1200, "ss": 100, "a": 1500, "load_type": "a"}
    thin = transverse_force_resistance(tw=25.25, **kw, **KW).Rn
    thick = transverse_force_resistance(tw=25.26, **kw, **KW).Rn
    assert thick < 0.6 * thin
    d_thin = transverse_force_resistance(tw=25.25, **kw, **ZERO).Rn
    d_thick = transverse_force_resistance(tw=25.26, **kw, **ZERO).Rn
    assert d_thin <= d_thick <= thick * (1 + 1e-12)


def test_bad_input():
    with pytest.raises(InputError, match="load_type = 'd'"):
        transverse_force_resistance(hw=1200, tw=10, ss=150, load_type="d", **KW)
    with pytest.raises(InputError, match="m2_rule = 'half'"):
        transverse_force_resistance(hw=1200, tw=10, ss=150, **{**KW, "m2_rule": "half"})
    with pytest.raises(InputError, match="tw = -1"):
        transverse_force_resistance(hw=1200, tw=-1, ss=150, **KW)


@given(st.floats(2, 30), st.floats(2, 30), st.sampled_from(["a", "b", "c"]), st.floats(0, 600))
def test_more_web_loss_never_raises_F_Rd(t1, t2, kind, ss):
    # a property the check must have (no source needed)
    lo, hi = sorted((t1, t2))
    # with the default m2 rule (the clause's own step at lambda_F = 0.5 breaks it)
    kw = {"hw": 1200, "ss": ss, "a": 1500, "c": 30, "load_type": kind, **ZERO}
    weak = transverse_force_resistance(tw=lo, **kw).Rn
    assert weak <= transverse_force_resistance(tw=hi, **kw).Rn * (1 + 1e-12)
