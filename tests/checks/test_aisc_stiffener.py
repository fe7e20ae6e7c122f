"""AISC 360-22 J7 and J10.8 bearing stiffeners: hand calculations from the clauses.

Source: AISC 360-22 Specification for Structural Steel Buildings, J7 (J7-1), J10.8, J4.4
(J4-6) and E3 (E3-2, E3-3, E3-4) (equation numbers from memory); hand calculation.
Fy = 250 MPa, E = 200 000 MPa.
"""

import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.checks.aisc_stiffener import axial_strength, bearing_resistance
from core.checks.stiffener_section import EndLoss, Stiffener
from core.errors import InputError

PLATES = Stiffener("plates", b=150, t=16)
SMALL = Stiffener("plates", b=60, t=10)


def test_bearing_J7():
    # Apb = 150 * 16 * 2 = 4800 mm²; Rn = 1.8 * 250 * 4800 = 2.16e6 N; phi = 0.75
    r = bearing_resistance(PLATES, Fy=250, tw=10)
    assert r.Rn == pytest.approx(2.16e6) and r.phi == 0.75
    # as found t = 12: 1.8 * 250 * 3600 = 1.62e6
    assert bearing_resistance(PLATES, Fy=250, tw=10, loss=EndLoss(100, t=12)).Rn == pytest.approx(
        1.62e6
    )


def test_short_column_J4_6():
    # end stiffener: strip 12 tw = 120 mm; Ag = 4800 + 1200 = 6000 mm²;
    # I = 39 720 000 + 120 * 10³/12 = 39 730 000; r = 81.3736; Lc = 1125; Lc/r = 13.83 <= 25
    # -> Pn = Fy Ag = 1.5e6 N (J4-6)
    r = axial_strength(PLATES, Fy=250, E=200_000, h=1500, tw=10)
    assert r.value("Ag").value == pytest.approx(6000.0)
    assert r.value("r").value == pytest.approx(81.37363, rel=1e-6)
    assert r.Rn == pytest.approx(1.5e6) and r.phi == 0.90
    # interior: strip 25 tw = 250 mm -> Ag = 7300 mm²
    assert axial_strength(PLATES, Fy=250, E=200_000, h=1500, tw=10, position="interior").value(
        "Ag"
    ).value == pytest.approx(7300.0)


def test_inelastic_E3_2_and_elastic_E3_3():
    # plates 60 x 10 with 120 mm strip: Ag = 2400, I = 1 830 000 + 10 000 = 1 840 000,
    # r = 27.68875. h = 3000: Lc/r = 81.2605 <= 4.71 sqrt(E/Fy) = 133.2:
    # Fe = pi² E / 81.2605² = 298.931; Fcr = 0.658^(250/298.931) * 250 = 176.165 MPa
    r = axial_strength(SMALL, Fy=250, E=200_000, h=3000, tw=10)
    assert r.value("Fe").value == pytest.approx(298.9312, rel=1e-6)
    assert r.Rn == pytest.approx(176.16515 * 2400, rel=1e-6)
    assert "E3-2" in r.clause
    # h = 6000: Lc/r = 162.521 -> Fe = 74.7328; Fcr = 0.877 Fe = 65.5407 MPa (E3-3)
    r = axial_strength(SMALL, Fy=250, E=200_000, h=6000, tw=10)
    assert r.Rn == pytest.approx(65.54067 * 2400, rel=1e-6)
    assert "E3-3" in r.clause


def test_bad_position():
    with pytest.raises(InputError, match="position = 'middle'"):
        axial_strength(PLATES, Fy=250, E=200_000, h=1500, tw=10, position="middle")


@given(st.floats(3, 16), st.floats(3, 16), st.floats(500, 8000))
def test_more_loss_never_raises_strength(t1, t2, h):
    # a property the checks must have (no source needed)
    lo, hi = sorted((t1, t2))
    kw = {"Fy": 250, "E": 200_000, "h": h, "tw": 10}
    weak = axial_strength(PLATES, loss=EndLoss(100, t=lo), **kw).Rn
    assert weak <= axial_strength(PLATES, loss=EndLoss(100, t=hi), **kw).Rn * (1 + 1e-12)
    kw = {"Fy": 250, "tw": 10}
    weak = bearing_resistance(PLATES, loss=EndLoss(100, t=lo), **kw).Rn
    assert weak <= bearing_resistance(PLATES, loss=EndLoss(100, t=hi), **kw).Rn
