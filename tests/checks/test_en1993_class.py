"""EN 1993-1-1 Table 5.2 class limits and the EN 1993-1-5 4.4 effective web, by hand.

Sources: EN 1993-1-1:2005 Table 5.2 (sheets 1 and 2); EN 1993-1-5:2006 4.4(2) Eq. 4.2, 4.3,
Table 4.1 (k_sigma, be1 = 0.4 beff, be2 = 0.6 beff for psi < 0), 4.4(3) (all from memory);
the effective section's properties by the parallel-axis theorem over its rectangles (common
practice, no source needed).
"""

import math

import pytest

from core.checks.en1993_buckling import epsilon
from core.checks.en1993_class import (
    effective_web,
    k_sigma_internal,
    outstand_class,
    rho_internal,
    rho_outstand,
    web_class,
    web_zone,
)
from core.definition import SectionDefinition
from core.errors import InputError
from core.parts import Plate

# welded girder: flanges 400 x 25, web 2000 x 8 (y = 25 to 2025)
GIRDER = SectionDefinition(
    (
        Plate("bot", 400, 25, -200, 0),
        Plate("web", 2000, 8, -4, 25, "vertical", role="web"),
        Plate("top", 400, 25, -200, 2025),
    )
)


def test_outstand_class_limits():
    # fy = 235 (eps = 1): 9, 10, 14
    assert outstand_class(90, 10, 235)[0] == 1
    assert outstand_class(100, 10, 235)[0] == 2
    assert outstand_class(140, 10, 235)[0] == 3
    assert outstand_class(141, 10, 235)[0] == 4
    # fy = 355: 14 eps = 11.39; a corroded leg 150 x 12 (c/t = 12.5) is class 4
    assert outstand_class(150, 12, 355)[0] == 4


def test_web_class_in_bending():
    # pure bending: 72, 83, 124 eps (eps = 1)
    assert web_class(720, 10, 235)[0] == 1
    assert web_class(830, 10, 235)[0] == 2
    assert web_class(1240, 10, 235)[0] == 3
    assert web_class(1250, 10, 235)[0] == 4
    # psi = -0.5: class 3 limit 42 / (0.67 - 0.165) = 83.17 eps
    _, vals = web_class(800, 10, 235, psi=-0.5, alpha=0.6)
    assert vals[3].value == pytest.approx(42 / 0.505, rel=1e-9)


def test_k_sigma_and_rho():
    # Table 4.1: 4.0, 7.81, 23.9 at psi = 1, 0, -1; Eq. 4.2 and 4.3
    assert k_sigma_internal(1.0) == 4.0
    assert k_sigma_internal(0.0) == pytest.approx(7.81)
    assert k_sigma_internal(-1.0) == 23.9
    assert k_sigma_internal(-1.0 - 1e-12) == 23.9
    assert rho_internal(0.6, 1.0) == 1.0  # 0.5 + sqrt(0.085 - 0.055) = 0.673
    assert rho_internal(1.0, 1.0) == pytest.approx(1.0 - 0.22)
    assert rho_outstand(0.7) == 1.0
    assert rho_outstand(1.0) == pytest.approx(0.812)


def test_effective_web_against_a_hand_calculation():
    # fy = 355: eps = 0.813616; b = 2000, t = 8, psi = -1 (symmetric), k_sigma = 23.9:
    # lambda_p = 250 / (28.4 * 0.813616 * sqrt(23.9)) = 2.213110; rho = (2.213110 - 0.11)
    # / 2.213110² = 0.429394; bc = 1000, beff = 429.394, be1 = 171.758, be2 = 257.636;
    # hole from 1025 + 257.636 = 1282.636 to 2025 - 171.758 = 1853.242 mm.
    # effective section by rectangles: A = 31 435.15 mm², yc = 946.157, I = 2.41726e10 mm⁴,
    # Weff,c = I / (2050 - 946.157) = 21 898 586 mm³, Weff,t = I / 946.157 = 25 548 182 mm³
    e = effective_web(GIRDER, None, fy=355, tw=8, y_edges=(25, 2025))
    assert e.psi == pytest.approx(-1.0)
    assert e.lam_p == pytest.approx(2.2131098, rel=1e-6)
    assert e.rho == pytest.approx(0.4293941, rel=1e-6)
    assert e.hole == pytest.approx((1282.6364, 1853.2424), rel=1e-6)
    assert pytest.approx(31_435.152, rel=1e-6) == e.props.A
    assert e.props.Ix == pytest.approx(2.41725966e10, rel=1e-6)
    assert e.Weff_c == pytest.approx(21_898_586.0, rel=1e-6)
    assert e.Weff_t == pytest.approx(25_548_182.5, rel=1e-6)


def test_fully_effective_web_has_no_hole():
    e = effective_web(GIRDER, None, fy=235, tw=30, y_edges=(25, 2025))
    assert e.rho == 1.0 and e.hole is None
    assert math.isclose(e.Weff_c, e.props.S_top)


def test_bad_edges():
    with pytest.raises(InputError, match="not within the web"):
        effective_web(GIRDER, None, fy=355, tw=8, y_edges=(1500, 2025))


def test_epsilon_and_outstand_limits_between_the_classes():
    # eps = sqrt(235/fy): 1.0 for S235, 0.8136 for S355; outstand c/t limits 9, 10, 14 eps
    assert epsilon(235) == 1.0 and epsilon(355) == pytest.approx(0.813616, rel=1e-6)
    assert [outstand_class(c, 10, 235)[0] for c in (90, 95, 139, 141)] == [1, 2, 3, 4]


def test_web_limits_in_bending_with_compression():
    # alpha = 0.6: 396 / (13 * 0.6 - 1) = 58.24 eps, 456 / 6.8 = 67.06 eps (Table 5.2 sheet 1)
    _, vals = web_class(800, 10, 235, psi=-0.5, alpha=0.6)
    limits = {v.symbol: v.value for v in vals}
    assert limits["class 1 limit"] == pytest.approx(396 / 6.8)
    assert limits["class 2 limit"] == pytest.approx(456 / 6.8)
    # alpha <= 0.5: 36 eps / alpha and 41.5 eps / alpha; psi <= -1: 62 eps (1 - psi) sqrt(-psi)
    _, vals = web_class(800, 10, 235, psi=-2.0, alpha=0.4)
    limits = {v.symbol: v.value for v in vals}
    assert limits["class 1 limit"] == pytest.approx(36 / 0.4)
    assert limits["class 2 limit"] == pytest.approx(41.5 / 0.4)
    assert limits["class 3 limit"] == pytest.approx(62 * 3 * math.sqrt(2))
    assert web_class(1200, 10, 235)[0] == 3 and web_class(1300, 10, 235)[0] == 4


def test_k_sigma_between_the_table_points():
    # Table 4.1: 8.2 / (1.05 + psi) at 0.5; 7.81 - 6.29 psi + 9.78 psi² at -0.5;
    # 5.98 (1 - psi)² at -2; outside -3 to 1 an error
    assert k_sigma_internal(0.5) == pytest.approx(8.2 / 1.55)
    assert k_sigma_internal(-0.5) == pytest.approx(7.81 + 6.29 * 0.5 + 9.78 * 0.25)
    assert k_sigma_internal(-2.0) == pytest.approx(5.98 * 9)
    with pytest.raises(InputError, match="psi"):
        k_sigma_internal(-3.5)
    # Eq. 4.2 at psi = -1: lambda_p <= 0.5 + sqrt(0.14) = 0.87417 -> 1; at 1.2:
    # (1.2 - 0.11) / 1.44
    assert rho_internal(0.87, -1.0) == 1.0
    assert rho_internal(1.2, -1.0) == pytest.approx(1.09 / 1.44)


def test_web_zone_in_pure_bending():
    # web 0..1500 mm, t = 10, NA at 750, eps = 1 (S235): psi = -1, k = 23.9,
    # lambda_p = 150 / (28.4 sqrt(23.9)) = 1.08037, rho = (1.08037 - 0.11)/1.08037² = 0.83137,
    # b_c = 750, b_eff = 623.5, b_e1 = 249.4 at the top, b_e2 = 374.1 from the NA:
    # ineffective from 1124.1 to 1250.6 mm (height b_c - b_eff = 126.5 mm)
    z = web_zone(y_edges=(0, 1500), y_na=750, tw=10, eps=1.0)
    lam = 150 / (28.4 * math.sqrt(23.9))
    rho = (lam - 0.11) / lam**2
    assert z.lam_p == pytest.approx(lam) and z.rho == pytest.approx(rho)
    assert z.hole == pytest.approx((750 + 0.6 * rho * 750, 1500 - 0.4 * rho * 750))
    assert z.height == pytest.approx(750 * (1 - rho))
    assert z.rho == pytest.approx(0.83137, abs=1e-5)
    # hogging: the mirror image about the neutral axis
    h = web_zone(y_edges=(0, 1500), y_na=750, tw=10, eps=1.0, compression="bottom")
    assert h.hole == pytest.approx((1500 - z.hole[1], 1500 - z.hole[0]))
