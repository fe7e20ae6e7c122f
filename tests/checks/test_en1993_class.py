"""EN 1993-1-1 Table 5.2 class limits and the EN 1993-1-5 4.4 effective web, by hand.

Sources: EN 1993-1-1:2005 Table 5.2 (sheets 1 and 2); EN 1993-1-5:2006 4.4(2) Eq. 4.2, 4.3,
Table 4.1 (k_sigma, be1 = 0.4 beff, be2 = 0.6 beff for psi < 0), 4.4(3) (all from memory);
the effective section's properties by the parallel-axis theorem over its rectangles (common
practice, no source needed).
"""

import math

import pytest

from core.checks.en1993_class import (
    effective_web,
    k_sigma_internal,
    outstand_class,
    rho_internal,
    rho_outstand,
    web_class,
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
