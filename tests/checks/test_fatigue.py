"""Fatigue of riveted details: AASHTO Category D with the MBE remaining life, and EN 1993-1-9
detail category 71 with Miner's rule. Hand calculations from the clauses.

Sources (all from memory): AASHTO LRFD 9th ed. Tables 6.6.1.2.3-1 (riveted: Category D),
6.6.1.2.5-1 (A = 22.0e8 ksi³), 6.6.1.2.5-3 ((Delta F)TH = 7.0 ksi), 6.6.1.2.5-2 (n),
Eq. 6.6.1.2.5-2; AASHTO MBE 3rd ed. 7.2.4 ((Delta f)max = 2.0 (Delta f)eff) and 7.2.5.1-1
(Y = Rr A / (365 n ADTT (Delta f)eff³)); EN 1993-1-9:2005 7.1 Figure 7.1, Table 3.1,
8(2) Eq. 8.2, Annex A; detail category 71 for riveted details (not in EN 1993-1-9's tables);
1 ksi = 6.894757 MPa (exact definition of the psi; NIST SP 811).
"""

import math

import pytest

from core.checks import aashto_fatigue, en1993_fatigue
from core.errors import InputError


def test_category_D_constants_in_SI():
    # 22.0e8 ksi³ * 6.894757³ = 7.2107e11 MPa³ (the SI table's 7.21e11); 7.0 ksi = 48.263 MPa
    D = aashto_fatigue.CATEGORY_D
    assert pytest.approx(7.2107e11, rel=1e-4) == D.A
    assert D.threshold == pytest.approx(48.263, rel=1e-4)
    # (Delta F)n at 2e6 cycles = (A/N)^(1/3) = 71.17 MPa: close to EN detail category 71
    assert aashto_fatigue.nominal_resistance(2e6) == pytest.approx(71.1732, rel=1e-5)


def test_cycles_per_truck():
    # simple-span girders: 1.0 above 40 ft, 2.0 at or below (Table 6.6.1.2.5-2)
    assert aashto_fatigue.cycles_per_truck("75 ft") == 1.0
    assert aashto_fatigue.cycles_per_truck("30 ft") == 2.0


def test_mbe_infinite_life():
    # (Delta f)max = 2.0 * 20 = 40 <= 48.26 MPa: infinite life (MBE 7.2.4)
    r = aashto_fatigue.remaining_life(delta_f=20, ADTT_SL=1000, age=90)
    assert r.infinite_life and r.total_life is None and r.remaining_life is None
    assert r.Rn == pytest.approx(48.263 / 2, rel=1e-4)


def test_mbe_finite_and_spent_life():
    # Delta f = 30: (Delta f)max = 60 > 48.26; Y = 1.0 * 7.21074e11 / (365 * 1 * 1000 * 30³)
    # = 73.17 years; at 90 years of age the remaining life is -16.83 years: spent
    r = aashto_fatigue.remaining_life(delta_f=30, ADTT_SL=1000, age=90)
    assert not r.infinite_life
    assert r.total_life == pytest.approx(73.1683, rel=1e-5)
    assert r.remaining_life == pytest.approx(73.1683 - 90, rel=1e-5)
    assert r.value("Y").kind == "time"
    assert any("spent" in n for n in r.notes)
    # an evaluation-life factor Rr (the engineer's, from MBE Table 7.2.5.2-1) scales Y
    assert aashto_fatigue.remaining_life(
        delta_f=30, ADTT_SL=1000, age=90, Rr=1.6
    ).total_life == pytest.approx(1.6 * 73.1683, rel=1e-5)


def test_en_curve_limits():
    # Delta sigma_D = (2/5)^(1/3) 71 = 52.313; Delta sigma_L = (5/100)^(1/5) 52.313 = 28.735
    d, cut = en1993_fatigue.limits(71.0)
    assert d == pytest.approx(52.3132, rel=1e-5)
    assert cut == pytest.approx(28.7346, rel=1e-5)
    assert en1993_fatigue.endurance(71.0, 71.0) == pytest.approx(2e6)
    assert en1993_fatigue.endurance(d, 71.0) == pytest.approx(5e6)
    assert en1993_fatigue.endurance(cut, 71.0) == pytest.approx(1e8, rel=1e-9)
    assert math.isinf(en1993_fatigue.endurance(cut * 0.99, 71.0))


def test_en_infinite_and_miner_life():
    # gamma_Mf = 1.35: 1.35 * 30 = 40.5 <= 52.31: infinite life
    r = en1993_fatigue.remaining_life(spectrum=[(30, 1e6)], age=80)
    assert r.infinite_life
    # (50 MPa, 2e5 a year) and (30 MPa, 1e6 a year): design ranges 67.5 and 40.5 MPa;
    # N1 = 2e6 (71/67.5)³ = 2 327 522; N2 = 5e6 (52.313/40.5)^5 = 17 978 493;
    # D = 2e5/N1 + 1e6/N2 = 0.141550 a year -> life 7.0646 years
    r = en1993_fatigue.remaining_life(spectrum=[(50, 2e5), (30, 1e6)], age=80)
    assert r.value("D per year").value == pytest.approx(0.1415503, rel=1e-6)
    assert r.total_life == pytest.approx(7.064625, rel=1e-6)
    assert r.remaining_life == pytest.approx(7.064625 - 80, rel=1e-6)
    assert "from memory" in r.value("Delta sigma_C").source


def test_en_damage_equivalent_check():
    # gamma_Ff Delta sigma_E,2 = 40 <= 71 / 1.35 = 52.59; utilisation 40 * 1.35 / 71 = 0.76056
    r = en1993_fatigue.damage_equivalent_check(delta_sigma_E2=40)
    assert r.Rr == pytest.approx(71 / 1.35)
    assert r.value("utilisation").value == pytest.approx(0.760563, rel=1e-6)


def test_bad_input():
    with pytest.raises(InputError, match="spectrum is empty"):
        en1993_fatigue.remaining_life(spectrum=[], age=10)
    with pytest.raises(InputError, match="row 0"):
        en1993_fatigue.remaining_life(spectrum=[(30,)], age=10)
    with pytest.raises(InputError, match="ADTT_SL = 0"):
        aashto_fatigue.remaining_life(delta_f=30, ADTT_SL=0, age=10)


def test_a_larger_stress_range_never_lengthens_the_life():
    # a property of both S-N rules (no source needed)
    lives = [
        aashto_fatigue.remaining_life(delta_f=d, ADTT_SL=500, age=0).total_life
        for d in (25, 30, 40, 60)
    ]
    assert lives == sorted(lives, reverse=True)
    lives = [
        en1993_fatigue.remaining_life(spectrum=[(d, 1e6)], age=0).total_life
        for d in (40, 50, 70, 100)
    ]
    assert lives == sorted(lives, reverse=True)
