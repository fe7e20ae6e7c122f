"""AASHTO LRFD 6.10.11.2 bearing stiffeners: hand calculations from the clauses.

Source: AASHTO LRFD Bridge Design Specifications, 9th ed. (2020), 6.10.11.2.2, 6.10.11.2.3,
6.10.11.2.4 and 6.9.4.1 (equation numbers from memory); hand calculation from the clause.
Fys = 250 MPa, E = 200 000 MPa unless stated.
"""

import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.checks.aashto_stiffener import axial_resistance, bearing_resistance
from core.checks.stiffener_section import EndLoss, Stiffener

PLATES = Stiffener("plates", b=150, t=16)
SMALL = Stiffener("plates", b=60, t=10)


def test_bearing_as_built_and_as_found():
    # 6.10.11.2.3-2: Apn = 125 * 16 * 2 = 4000 mm² (clip 25 mm); Rn = 1.4 * 4000 * 250 = 1.4e6 N
    r = bearing_resistance(PLATES, Fys=250, tw=10, bf=400, clip=25)
    assert r.Rn == pytest.approx(1.4e6)
    assert r.phi == 1.0  # phi_b (6.5.4.2, from memory)
    # as found: t = 12, 20 mm lost at the toes: width (5 + 130) - 30 = 105;
    # Apn = 105 * 12 * 2 = 2520 mm²; Rn = 1.4 * 2520 * 250 = 882 000 N
    f = bearing_resistance(
        PLATES, Fys=250, tw=10, bf=400, clip=25, loss=EndLoss(150, t=12, b_lost=20)
    )
    assert f.Rn == pytest.approx(882_000.0)
    assert f.value("Apn").value == pytest.approx(2520.0)


def test_column_welded_with_web_strip_inelastic():
    # strip 9 tw each side + 16 = 196 mm; Ag = 6760 mm²; I = 39 736 333 mm⁴; rs = 76.6691 mm
    # K l = 0.75 * 1500 = 1125; K l / rs = 14.6734; Pe = pi² E Ag / 14.6734² = 61.974e6 N
    # Po = 250 * 6760 = 1.69e6 N; Pe/Po = 36.67 >= 0.44:
    # Pn = 0.658^(1/36.67) * 1.69e6 = 1 670 821 N (6.9.4.1.1-1)
    r = axial_resistance(PLATES, Fys=250, E=200_000, D=1500, tw=10, connection="welded")
    assert r.value("strip").value == pytest.approx(196.0)
    assert r.value("Ag").value == pytest.approx(6760.0)
    assert r.value("rs").value == pytest.approx(76.66913, rel=1e-6)
    assert r.Rn == pytest.approx(1_670_820.7, rel=1e-6)
    assert r.phi == 0.95  # phi_c (6.5.4.2, from memory)
    assert "6.9.4.1.1-1" in r.clause


def test_column_riveted_has_no_web_strip_and_elastic_branch():
    # riveted: stiffener elements only (6.10.11.2.4b, from memory): Ag = 2 * 60 * 10 = 1200
    # I = 10 (130³ - 10³)/12 = 1 830 000 mm⁴, rs = 39.0512; D = 8000: K l / rs = 153.644
    # Pe/Po = 0.33447 < 0.44 -> Pn = 0.877 Pe = 87 999.0 N (6.9.4.1.1-2); K l/r > 120 noted
    r = axial_resistance(SMALL, Fys=250, E=200_000, D=8000, tw=10)
    assert r.value("strip").value == 0.0
    assert r.value("Pe/Po").value == pytest.approx(0.334470, rel=1e-5)
    assert r.Rn == pytest.approx(87_999.04, rel=1e-6)
    assert "6.9.4.1.1-2" in r.clause
    assert any("120" in n for n in r.notes)
    # D = 3000: Pe/Po = 2.37845 -> Pn = 0.658^(1/2.37845) * 300 000 = 251 591.5 N
    assert axial_resistance(SMALL, Fys=250, E=200_000, D=3000, tw=10).Rn == pytest.approx(
        251_591.46, rel=1e-6
    )


def test_width_limit_broken_by_loss_trims_the_outstand():
    # as found t = 8: 0.48 tp sqrt(E/Fys) = 0.48 * 8 * 28.2843 = 108.612 mm < 150 mm:
    # the requirement fails (6.10.11.2.2-1) and only 108.612 mm counts: Ag = 2 * 108.612 * 8
    r = axial_resistance(PLATES, Fys=250, E=200_000, D=1500, tw=10, loss=EndLoss(150, t=8))
    assert r.value("0.48 tp sqrt(E/Fys)").value == pytest.approx(108.6116, rel=1e-6)
    assert r.value("Ag").value == pytest.approx(2 * 108.6116 * 8, rel=1e-6)
    assert any("not met" in n for n in r.notes)
    assert any("whole column length" in n for n in r.notes)


def test_strip_limited_by_the_web_end():
    r = axial_resistance(
        PLATES, Fys=250, E=200_000, D=1500, tw=10, connection="welded", strip_available=100
    )
    assert r.value("strip").value == 100.0


losses = st.tuples(st.floats(3, 16), st.floats(0, 90))


@given(losses, losses, st.sampled_from(["riveted", "welded"]), st.floats(600, 4000))
def test_more_stiffener_loss_never_raises_resistance(a, b, conn, D):
    # a property the checks must have (no source needed): more loss (thinner and narrower)
    # never raises bearing or column resistance
    (t1, l1), (t2, l2) = a, b
    more = EndLoss(150, t=min(t1, t2), b_lost=max(l1, l2))
    less = EndLoss(150, t=max(t1, t2), b_lost=min(l1, l2))
    kw = {"Fys": 250, "tw": 10}
    assert bearing_resistance(PLATES, loss=more, **kw).Rn <= bearing_resistance(
        PLATES, loss=less, **kw
    ).Rn * (1 + 1e-12)
    kw = {"Fys": 250, "E": 200_000, "D": D, "tw": 10, "connection": conn}
    assert axial_resistance(PLATES, loss=more, **kw).Rn <= axial_resistance(
        PLATES, loss=less, **kw
    ).Rn * (1 + 1e-12)
