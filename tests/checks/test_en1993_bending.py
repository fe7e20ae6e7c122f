"""EN 1993 bending: cross-section class (EN 1993-1-1:2005 Table 5.2), effective widths
(EN 1993-1-5:2006 4.4, Tables 4.1 and 4.2), Mc,Rd (EN 1993-1-1 6.2.5) and holes in the tension
flange (6.2.5(4), Eq. 6.16); from memory; hand calculations from the clauses."""

import math

import pytest

from core.checks.en1993_bending import (
    bending_resistance,
    epsilon,
    k_sigma_internal,
    outstand_class,
    rho_internal,
    rho_outstand,
    tension_flange_holes,
    web_class,
    web_ineffective_zone,
    web_limits,
)
from core.errors import InputError


def test_epsilon_and_outstand_limits():
    # eps = sqrt(235/fy): 1.0 for S235, 0.8136 for S355; outstand c/t limits 9, 10, 14 eps
    assert epsilon(235) == 1.0 and epsilon(355) == pytest.approx(0.813616, rel=1e-6)
    assert [outstand_class(r, 1.0) for r in (9.0, 9.5, 13.9, 14.1)] == [1, 2, 3, 4]


def test_web_limits_pure_bending_and_bending_with_compression():
    # psi = -1, alpha = 0.5: 72 eps, 83 eps, 124 eps (62 eps (1 - psi) sqrt(-psi) = 124 eps)
    assert web_limits(1.0, 0.5, -1.0) == pytest.approx((72.0, 83.0, 124.0))
    # alpha = 0.6: 396 / (13 * 0.6 - 1) = 58.24, 456 / 6.8 = 67.06; psi = -0.5: 42 / 0.505 = 83.17
    l1, l2, l3 = web_limits(1.0, 0.6, -0.5)
    assert (l1, l2, l3) == pytest.approx((396 / 6.8, 456 / 6.8, 42 / 0.505))
    assert web_class(120.0, 1.0, 0.5, -1.0) == 3 and web_class(130.0, 1.0, 0.5, -1.0) == 4


def test_k_sigma_table_4_1():
    # 4.0 at psi = 1; 8.2/1.55 at 0.5; 7.81 at 0; 7.81 + 3.145 + 2.445 at -0.5; 23.9 at -1;
    # 5.98 * 9 at -2
    assert k_sigma_internal(1.0) == 4.0
    assert k_sigma_internal(0.5) == pytest.approx(8.2 / 1.55)
    assert k_sigma_internal(0.0) == pytest.approx(7.81)
    assert k_sigma_internal(-0.5) == pytest.approx(7.81 + 6.29 * 0.5 + 9.78 * 0.25)
    assert k_sigma_internal(-1.0) == 23.9
    assert k_sigma_internal(-2.0) == pytest.approx(5.98 * 9)
    with pytest.raises(InputError, match="psi"):
        k_sigma_internal(-3.5)


def test_rho_internal_and_outstand():
    # internal, psi = -1: lambda_p <= 0.5 + sqrt(0.14) = 0.87417 -> 1; at 1.2:
    # (1.2 - 0.11) / 1.44 = 0.75694; outstand at 1.0: (1 - 0.188) / 1 = 0.812
    assert rho_internal(0.87, -1.0) == 1.0
    assert rho_internal(1.2, -1.0) == pytest.approx(1.09 / 1.44)
    assert rho_outstand(0.7) == 1.0 and rho_outstand(1.0) == pytest.approx(0.812)


def test_web_zone_in_pure_bending():
    # web 0..1500 mm, t = 10, NA at 750, eps = 1 (S235): psi = -1, k = 23.9,
    # lambda_p = 150 / (28.4 sqrt(23.9)) = 1.08037, rho = (1.08037 - 0.11)/1.08037² = 0.83137,
    # b_c = 750, b_eff = 623.5, b_e1 = 249.4 at the top, b_e2 = 374.1 from the NA:
    # ineffective from 1124.1 to 1250.6 mm (height b_c - b_eff = 126.5 mm)
    z = web_ineffective_zone(y_top=1500, y_bot=0, y_na=750, t=10, eps=1.0)
    lam = 150 / (28.4 * math.sqrt(23.9))
    rho = (lam - 0.11) / lam**2
    assert z.lambda_p == pytest.approx(lam) and z.rho == pytest.approx(rho)
    assert z.lo == pytest.approx(750 + 0.6 * rho * 750)
    assert z.hi == pytest.approx(1500 - 0.4 * rho * 750)
    assert z.height == pytest.approx(750 * (1 - rho))
    assert z.rho == pytest.approx(0.83137, abs=1e-5)


def test_bending_resistance_by_class():
    # Mc,Rd = W fy / gamma_M0 with Wpl (class 1, 2), Wel,min (3), Weff,min (4)
    kw = dict(W_pl=1.2e7, W_el_min=1.0e7, W_eff_min=0.9e7, fy=235, gamma_M0=1.0)
    assert bending_resistance(section_class=2, **kw).Rr == pytest.approx(1.2e7 * 235)
    assert bending_resistance(section_class=3, **kw).Rr == pytest.approx(1.0e7 * 235)
    r4 = bending_resistance(section_class=4, **kw)
    assert r4.Rr == pytest.approx(0.9e7 * 235) and "4.4" in r4.clause
    assert bending_resistance(section_class=3, **{**kw, "gamma_M0": 1.1}).phi == pytest.approx(
        1 / 1.1
    )


def test_tension_flange_eq_6_16():
    # Af = 10 000, Af,net = 8 000, fu = 360, fy = 235, gamma_M2 = 1.25:
    # 0.9 * 0.8 * 360 / 1.25 = 207.36 MPa < 235 -> holes govern: W_t * 207.36
    r = tension_flange_holes(
        Af_net=8000, Af=10000, fy=235, fu=360, W_t=1e7, gamma_M0=1.0, gamma_M2=1.25
    )
    assert r.Rr == pytest.approx(1e7 * 207.36)
    assert "not met" in r.notes[0]
    ok = tension_flange_holes(
        Af_net=9500, Af=10000, fy=235, fu=360, W_t=1e7, gamma_M0=1.0, gamma_M2=1.25
    )
    # 0.9 * 0.95 * 360 / 1.25 = 246.24 >= 235: the holes may be ignored
    assert ok.Rr == pytest.approx(1e7 * 235) and "met" in ok.notes[0]
