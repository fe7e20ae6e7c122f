"""Intermediate stiffeners: may the panel count as stiffened, and count tension-field action,
with the stiffeners' measured sizes? Hand calculations from each family's clauses.

Sources: AASHTO LRFD 9th ed. (2020) 6.10.11.1.2-1, -2 and 6.10.11.1.3-1 to -5; AISC 360-22
G2.3 (G2-12 to G2-14); EN 1993-1-5:2006 9.3.3 (Eq. 9.6, 9.7), 9.2.1(8) (Eq. 9.3) and the
15 epsilon t strip of 9.1(2); Roark's rectangle J (7th ed., Table 10.1); all from memory;
hand calculation. A pair of plates 120 x 10 on a web 1500 x 10, panels 1500 long.
"""

import pytest

from core.checks import intermediate_stiffener as ist
from core.checks.stiffener_section import EndLoss, Stiffener

PAIR = Stiffener("plates", b=120, t=10)
A = {"Fyw": 345, "Fys": 345, "E": 200_000, "D": 1500, "tw": 10, "do": 1500, "bf": 400}


def test_aashto_as_built_counts_tension_field():
    # width: 50.8 + 1500/30 = 100.8 <= 120 <= 16 * 10 = 160, and >= bf/4 = 100 (6.10.11.1.2)
    # It = 10 (250³ - 10³)/12 = 13 020 000 mm⁴ (pair, about the web mid-plane)
    # J = 2.5 (1)² - 2 = 0.5 -> It1 = 1500 * 10³ * 0.5 = 750 000 (6.10.11.1.3-1, -3)
    # Fcrs = 0.31 E / 12² = 430.6 -> Fys = 345; rho_t = 1;
    # It2 = 1500⁴ / 40 (345/200000)^1.5 = 9 067 524 mm⁴ (6.10.11.1.3-2)
    r = ist.aashto(PAIR, **A)
    assert r.Rn == pytest.approx(13_020_000.0)
    assert r.value("It1").value == pytest.approx(750_000.0)
    assert r.value("It2").value == pytest.approx(9_067_523.6, rel=1e-6)
    assert r.stiffened and r.tension_field and r.reasons == ()
    assert r.kind == "inertia"


def test_aashto_loss_removes_the_tension_field_then_the_stiffening():
    # t = 8: 16 tp = 128 >= 120; It = 8 * 15 624 000 / 12 = 10 416 000 >= It1;
    # Fcrs = 0.31 E / 15² = 275.56 < Fys -> rho_t = 345/275.56 = 1.252016;
    # It2 = 9 067 524 * 1.252016^1.3 = 12 144 555 > It: stiffened, no tension field
    r = ist.aashto(PAIR, loss=EndLoss(300, t=8), **A)
    assert r.value("rho_t").value == pytest.approx(1.2520161, rel=1e-6)
    assert r.value("It2").value == pytest.approx(12_144_555, rel=1e-6)
    assert r.stiffened and not r.tension_field
    assert "It2" in r.reasons[0]
    # t = 6: 16 tp = 96 < 120 (6.10.11.1.2-2): not a stiffener for the panel at all
    r = ist.aashto(PAIR, loss=EndLoss(300, t=6), **A)
    assert not r.stiffened and not r.tension_field
    assert any("16 tp" in s for s in r.reasons)


def test_aashto_panel_longer_than_3D():
    r = ist.aashto(PAIR, **{**A, "do": 5000})
    assert not r.stiffened and any("3 D" in s for s in r.reasons)


def test_aisc():
    # (b/t) = 12 <= 0.56 sqrt(E/Fy) = 13.483; Ist2 = max(2.5 - 2, 0.5) * 1500 * 1000 = 750 000;
    # Ist1 = 1500⁴/40 (345/200000)^1.5 = 9 067 524 (rho_st = 1) <= 13 020 000: tension field
    kw = {"Fyw": 345, "Fyst": 345, "E": 200_000, "h": 1500, "tw": 10, "a": 1500}
    r = ist.aisc(PAIR, **kw)
    assert r.value("Ist2").value == pytest.approx(750_000.0)
    assert r.value("Ist1").value == pytest.approx(9_067_523.6, rel=1e-6)
    assert r.stiffened and r.tension_field
    # t = 8: b/t = 15 > 13.483 (G2-12)
    r = ist.aisc(PAIR, loss=EndLoss(300, t=8), **kw)
    assert not r.stiffened and "G2-12" in r.reasons[0]


def test_en1993_rigid_stiffener_and_torsional_buckling():
    # fy = 235 (eps = 1): strip 30 * 10 + 10 = 310; Ist = 13 020 000 + 310 * 10³/12 = 13 045 833
    # a/hw = 1 < sqrt(2): Ist,min = 1.5 * 1500³ * 10³ / 1500² = 2 250 000 (Eq. 9.6)
    # It = 120 * 10³ (1/3 - 0.21/12 (1 - (1/12)⁴/12)) = 37 900.0; Ip = 10 * 120³/12 + 1200 * 60²
    # + 120 * 10³/12 = 5 770 000; It/Ip = 0.0065685 >= 5.3 * 235/210000 = 0.0059310 (Eq. 9.3)
    kw = {"hw": 1500, "tw": 10, "a": 1500}
    r = ist.en1993(PAIR, fy=235, **kw)
    assert r.Rn == pytest.approx(13_045_833.33, rel=1e-9)
    assert r.value("Ist,min").value == pytest.approx(2_250_000.0)
    assert r.value("It/Ip").value == pytest.approx(0.00656846, rel=1e-5)
    assert r.stiffened and r.tension_field
    # fy = 355: 5.3 * 355/210000 = 0.0089595 > 0.0065685: torsional buckling, not rigid
    r = ist.en1993(PAIR, fy=355, **kw)
    assert not r.stiffened and "9.2.1(8)" in r.reasons[-1]
    # a = 3000: a/hw = 2 >= sqrt(2): Ist,min = 0.75 * 1500 * 10³ = 1 125 000 (Eq. 9.7)
    assert ist.en1993(PAIR, fy=235, **{**kw, "a": 3000}).value("Ist,min").value == pytest.approx(
        1_125_000.0
    )
