"""EN 1993-1-1 6.3.2 lateral-torsional buckling and Mcr: closed forms and hand calculations.

Sources: the elastic critical moment of a doubly symmetric I-beam under uniform moment,
Mcr = (pi² E Iz / L²) sqrt(Iw/Iz + L² G It / (pi² E Iz)) (Timoshenko and Gere, Theory of
Elastic Stability, 2nd ed., Art. 6.2; from memory) with the closed-form section constants
Iz = 2 tf b³/12 + hw tw³/12, It = (2 b tf³ + hw tw³)/3, Iw = tf b³ hs²/24 (thin-walled
theory; common practice); ENV 1993-1-1:1992 Annex F, Eq. F.2 and the C1 approximation for a
linear moment (from memory); EN 1993-1-1:2005 6.3.2.2, Eq. 6.56, Table 6.3 (alpha_LT = 0.76
for curve d; from memory); hand calculation.
"""

import math

import numpy as np
import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.checks.en1993_ltb import C1_linear, buckling_resistance, elastic_critical_moment
from core.checks.thinwalled import warping
from core.errors import InputError

# welded I: flanges 300 x 20, web 960 x 10, hs = 980 mm
B, TF, HW, TW, HS = 300.0, 20.0, 960.0, 10.0, 980.0
RECTS = np.array([[-150, 480, 150, 500], [-150, -500, 150, -480], [-5, -480, 5, 480]], float)


def test_doubly_symmetric_uniform_moment_against_the_closed_form():
    # closed form with Iz = 90.08e6, It = 1.92e6, Iw = 2.1609e13, L = 8000, E = 210000,
    # G = 81000: Mcr = 1 579 603 010 N mm
    Iz = 2 * TF * B**3 / 12 + HW * TW**3 / 12
    It = (2 * B * TF**3 + HW * TW**3) / 3
    Iw = TF * B**3 * HS**2 / 24
    closed = (
        math.pi**2
        * 210_000
        * Iz
        / 8000**2
        * math.sqrt(Iw / Iz + 8000**2 * 81_000 * It / (math.pi**2 * 210_000 * Iz))
    )
    assert closed == pytest.approx(1_579_603_010, rel=1e-9)
    Mcr, vals = elastic_critical_moment(Iz=Iz, It=It, Iw=Iw, L=8000)
    assert Mcr == pytest.approx(closed, rel=1e-12)
    assert vals[-1].symbol == "Mcr"
    # the same beam's constants from the engine's rectangles (Roark J with end corrections,
    # Iw over the flange thickness): within 1.5 % of the closed form
    w = warping(RECTS)
    M_eng, _ = elastic_critical_moment(Iz=w.Iy, It=w.J, Iw=w.Iw, L=8000, zj=w.beta_x / 2)
    assert M_eng == pytest.approx(closed, rel=0.015)


def test_monosymmetry_raises_or_lowers_Mcr():
    # zj > 0 (larger flange in compression) raises Mcr; zj < 0 lowers it (ENV Annex F, F.2)
    kw = {"Iz": 9e7, "It": 2e6, "Iw": 2e13, "L": 8000}
    m0, _ = elastic_critical_moment(**kw)
    up, _ = elastic_critical_moment(zj=300, **kw)
    down, _ = elastic_critical_moment(zj=-300, **kw)
    assert down < m0 < up
    # a load above the shear centre (zg > 0 with C2 > 0) lowers it
    top, _ = elastic_critical_moment(zg=490, C2=0.45, C1=1.13, **kw)
    sc, _ = elastic_critical_moment(C1=1.13, **kw)
    assert top < sc


def test_C1_linear_moment():
    # 1.88 - 1.40 psi + 0.52 psi²: psi = 1 -> 1.00; psi = 0 -> 1.88; psi = -1 -> 3.80 -> 2.70
    assert C1_linear(1.0) == pytest.approx(1.0)
    assert C1_linear(0.0) == pytest.approx(1.88)
    assert C1_linear(-1.0) == pytest.approx(2.70)
    with pytest.raises(InputError, match=r"psi = 1\.5"):
        C1_linear(1.5)


def test_chi_LT_curve_d_hand_calculation():
    # Wy = 5e6, fy = 355, Mcr = 2e9: lambda_LT = sqrt(1.775e9 / 2e9) = 0.942072;
    # Phi_LT = 0.5 [1 + 0.76 (0.742072) + 0.887500] = 1.225737; chi_LT = 0.497534;
    # Mb,Rd = 0.497534 * 1.775e9 / 1.10
    r = buckling_resistance(Wy=5e6, fy=355, Mcr=2e9)
    assert r.value("lambda_LT").value == pytest.approx(0.9420722, rel=1e-6)
    assert r.value("chi_LT").value == pytest.approx(0.4975338, rel=1e-6)
    assert r.Rn == pytest.approx(883_122_543, rel=1e-6)
    assert r.phi == pytest.approx(1 / 1.10)
    # stocky: lambda_LT <= 0.2 -> chi_LT = 1
    assert buckling_resistance(Wy=5e6, fy=355, Mcr=1e12).value("chi_LT").value == 1.0


def test_bad_input():
    with pytest.raises(InputError, match="both be zero"):
        elastic_critical_moment(Iz=9e7, It=0, Iw=0, L=8000)
    with pytest.raises(InputError, match="buckling curve = 'e'"):
        buckling_resistance(Wy=5e6, fy=355, Mcr=2e9, curve="e")


@given(st.floats(500, 40_000), st.floats(500, 40_000), st.floats(-400, 400))
def test_longer_length_never_raises_the_resistance(L1, L2, zj):
    # a property of Mcr and chi_LT (no source needed)
    lo, hi = sorted((L1, L2))
    kw = {"Iz": 9e7, "It": 2e6, "Iw": 2e13, "zj": zj}
    m_lo, _ = elastic_critical_moment(L=lo, **kw)
    m_hi, _ = elastic_critical_moment(L=hi, **kw)
    assert m_hi <= m_lo * (1 + 1e-12)
    assert buckling_resistance(Wy=5e6, fy=355, Mcr=m_hi).Rn <= buckling_resistance(
        Wy=5e6, fy=355, Mcr=m_lo
    ).Rn * (1 + 1e-12)
