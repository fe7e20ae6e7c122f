"""EN 1993-1-5 Section 5 web shear: hand calculations from the clauses, branch by branch.

Source: EN 1993-1-5:2006, 5.2 (Eq. 5.1, 5.2), 5.3 (Eq. 5.3, 5.5, 5.6), Table 5.1, Annex A.1
and A.3 (clause numbers from memory); hand calculation from the clause. fyw = 355 MPa,
t = 10 mm, eta = 1.2 (5.1(2) recommended for S355), gamma_M1 = 1.0 unless stated: the
clause takes both as the family's parameters (the EN 1993 family passes gamma_M1 = 1.10 and
eta = 1.0 for early steel; tests/families check that).
"""

import functools
import math

import pytest

from core.checks import en1993_shear
from core.checks.en1993_shear import chi_w_for, k_tau_for
from core.errors import InputError

FY = 355.0
web_shear = functools.partial(en1993_shear.web_shear, eta=1.2, gamma_M1=1.0)


def test_k_tau_annex_A3():
    # A.3: a/hw >= 1: 5.34 + 4 (hw/a)²; a/hw < 1: 4 + 5.34 (hw/a)²; no stiffeners 5.34
    assert k_tau_for(None) == 5.34
    assert k_tau_for(1.0) == pytest.approx(9.34)
    assert k_tau_for(2.0) == pytest.approx(6.34)
    assert k_tau_for(0.5) == pytest.approx(25.36)


def test_chi_w_equal_eta_stocky_web():
    # hw = 400: sigma_E = 190000 (10/400)² = 118.75 MPa, tau_cr = 5.34 * 118.75 = 634.1 MPa
    # lambda_w = 0.76 sqrt(355 / 634.1) = 0.56864 < 0.83/1.2 = 0.6917 -> chi_w = eta = 1.2
    # Vbw,Rd = 1.2 * 355 * 400 * 10 / sqrt(3) = 983 805 N (equals the Eq. 5.1 cap)
    for post in ("rigid", "non-rigid"):
        r = web_shear(fyw=FY, hw=400, t=10, end_post=post)
        assert r.value("sigma_E").value == pytest.approx(118.75)
        assert r.value("lambda_w").value == pytest.approx(0.568644, rel=1e-5)
        assert r.value("chi_w").value == 1.2
        assert r.Vn == pytest.approx(983_804.9, rel=1e-6)


def test_chi_w_middle_branch_same_for_both_end_posts():
    # hw = 700: lambda_w = 0.76 sqrt(355 / (5.34 * 190000/4900)) = 0.995127
    # 0.6917 <= 0.9951 < 1.08 -> chi_w = 0.83 / 0.995127 = 0.834065 (rigid and non-rigid)
    # Vbw = 0.834065 * 355 * 700 * 10 / sqrt(3) = 1 196 645 N
    for post in ("rigid", "non-rigid"):
        r = web_shear(fyw=FY, hw=700, t=10, end_post=post)
        assert r.value("chi_w").value == pytest.approx(0.834065, rel=1e-5)
        assert r.Vn == pytest.approx(0.834065 * 1_434_715.4, rel=1e-5)


def test_chi_w_slender_rigid_and_non_rigid():
    # hw = 1500: lambda_w = 0.76 sqrt(355 / (5.34 * 190000/22500)) = 2.132414
    # rigid: 1.37 / (0.7 + 2.132414) = 0.483686; non-rigid: 0.83 / 2.132414 = 0.389230
    # fyw hw t / sqrt(3) = 3 074 390 N
    rigid = web_shear(fyw=FY, hw=1500, t=10, end_post="rigid")
    non = web_shear(fyw=FY, hw=1500, t=10, end_post="non-rigid")
    assert rigid.value("chi_w").value == pytest.approx(0.483686, rel=1e-5)
    assert non.value("chi_w").value == pytest.approx(0.389230, rel=1e-5)
    assert rigid.Vn == pytest.approx(0.483686 * 3_074_390.2, rel=1e-5)
    assert non.Vn == pytest.approx(0.389230 * 3_074_390.2, rel=1e-5)
    assert rigid.tension_field and not non.tension_field


def test_lambda_w_agrees_with_eq_5_5_and_5_6():
    # Eq. 5.5 (stiffeners at supports only): lambda_w = hw / (86.4 t eps), eps = sqrt(235/fy)
    # = 1500 / (86.4 * 10 * 0.813616) = 2.13382; Eq. 5.6: hw / (37.4 t eps sqrt(k_tau))
    # with k_tau = 9.34: 1.61297. Rounded constants of the standard: agree within 0.1 %.
    eps = math.sqrt(235.0 / FY)
    r = web_shear(fyw=FY, hw=1500, t=10)
    assert r.value("lambda_w").value == pytest.approx(1500 / (86.4 * 10 * eps), rel=1e-3)
    s = web_shear(fyw=FY, hw=1500, t=10, panel="interior", a=1500)
    assert s.value("k_tau").value == pytest.approx(9.34)
    lam56 = 1500 / (37.4 * 10 * eps * math.sqrt(9.34))
    assert s.value("lambda_w").value == pytest.approx(lam56, rel=1e-3)


def test_stiffened_panels_both_aspect_forms():
    # a = 1500 = hw: k_tau = 9.34, lambda_w = 1.612385; rigid chi_w = 1.37/2.312385 = 0.592462
    r = web_shear(fyw=FY, hw=1500, t=10, panel="interior", a=1500, end_post="rigid")
    assert r.value("chi_w").value == pytest.approx(0.592462, rel=1e-5)
    # a = 750: a/hw = 0.5 -> k_tau = 4 + 5.34 * 4 = 25.36, lambda_w = 0.978515
    # -> middle branch chi_w = 0.83 / 0.978515 = 0.848224
    r = web_shear(fyw=FY, hw=1500, t=10, panel="end", a=750)
    assert r.value("k_tau").value == pytest.approx(25.36)
    assert r.value("chi_w").value == pytest.approx(0.848224, rel=1e-5)


def test_eta_one():
    # eta = 1.0 (above S460, or steel of unknown grade): threshold 0.83/eta = 0.83
    # hw = 500: lambda_w = 0.76 sqrt(500 / (5.34*190000/2500)) = 0.843570 -> chi_w = 0.983913
    r = web_shear(fyw=500, hw=500, t=10, eta=1.0)
    assert r.value("eta").value == 1.0
    assert r.value("chi_w").value == pytest.approx(0.83 / 0.843570, rel=1e-5)
    # hw = 480: lambda_w = 0.80983 < 0.83 -> chi_w = eta = 1.0
    assert web_shear(fyw=500, hw=480, t=10, eta=1.0).value("chi_w").value == 1.0


def test_chi_w_for_boundaries():
    # Table 5.1 boundaries with eta = 1.2
    assert chi_w_for(0.83 / 1.2 - 1e-9, 1.2, "rigid")[0] == 1.2
    assert chi_w_for(1.08, 1.2, "rigid")[0] == pytest.approx(1.37 / 1.78)
    assert chi_w_for(1.08, 1.2, "non-rigid")[0] == pytest.approx(0.83 / 1.08)


def test_gamma_M1_and_flange_contribution():
    # gamma_M1 = 1.10 for bridges (EN 1993-2 Table 6.1, from memory): phi = 1/1.1
    r = web_shear(fyw=FY, hw=1500, t=10, gamma_M1=1.1)
    assert r.phi == pytest.approx(1 / 1.1)
    assert r.Vr == pytest.approx(r.Vn / 1.1)
    d = web_shear(fyw=FY, hw=1500, t=10)
    assert any("flange contribution Vbf,Rd (5.4) not counted" in n for n in d.notes)
    # Eq. 5.1: Vb,Rd = Vbw,Rd + Vbf,Rd, capped at eta fyw hw t / (sqrt(3) gamma_M1)
    non = web_shear(fyw=FY, hw=1500, t=10, gamma_M1=1.1)
    w = web_shear(fyw=FY, hw=1500, t=10, gamma_M1=1.1, Vbf_Rd=100_000.0)
    assert w.Vr == pytest.approx(non.Vr + 100_000.0)
    cap = 1.2 * FY * 1500 * 10 / math.sqrt(3) / 1.1
    assert web_shear(fyw=FY, hw=1500, t=10, gamma_M1=1.1, Vbf_Rd=5e6).Vr == pytest.approx(cap)


def test_bad_input():
    with pytest.raises(InputError, match=r"a \(transverse stiffener spacing"):
        web_shear(fyw=FY, hw=1500, t=10, panel="interior")
    with pytest.raises(InputError, match="end_post = 'stiff'"):
        web_shear(fyw=FY, hw=1500, t=10, end_post="stiff")
