"""AASHTO LRFD 6.10.9 web shear: hand calculations from the clause, branch by branch.

Source of every expected value: AASHTO LRFD Bridge Design Specifications, 9th ed. (2020),
Article 6.10.9 (equation numbers from memory); hand calculation from the clause.
E = 200 000 MPa and Fyw = 345 MPa throughout unless stated.
"""

import functools
import math

import pytest

from core.checks import aashto_shear
from core.checks.aashto_shear import shear_ratio_C
from core.errors import InputError

# the clause takes the resistance factor from the family: phi_v = 1.00 (AASHTO LRFD 6.5.4.2, from memory), the AASHTO family's
web_shear = functools.partial(aashto_shear.web_shear, phi_v=1.0)

E, FY = 200_000.0, 345.0
BIG = {"bfc": 400.0, "tfc": 25.0, "bft": 400.0, "tft": 25.0}  # 2 D tw / sum = 1.8 for 1500x12
SMALL = {"bfc": 200.0, "tfc": 12.0, "bft": 200.0, "tft": 12.0}  # 2 D tw / sum = 7.5


def test_Vp_and_C_equal_one_stocky_unstiffened_web():
    # 6.10.9.2-2: Vp = 0.58 * 345 * 500 * 10 = 1 000 500 N
    # k = 5; 1.12 sqrt(E k / Fyw) = 1.12 * 53.838 = 60.30 >= D/tw = 50, so C = 1 (6.10.9.3.2-4)
    r = web_shear(Fyw=FY, E=E, D=500, tw=10)
    assert r.value("Vp").value == pytest.approx(1_000_500.0, rel=1e-12)
    assert r.value("k").value == 5.0
    assert r.value("C").value == 1.0
    assert r.Vn == pytest.approx(1_000_500.0, rel=1e-12)
    assert r.phi_v == 1.0  # 6.5.4.2 (from memory)
    assert r.Vr == r.Vn


def test_C_inelastic_branch():
    # D/tw = 70 lies between 60.30 and 1.40 * 53.838 = 75.37 -> 6.10.9.3.2-5:
    # C = 1.12 * 53.838 / 70 = 0.861411; Vp = 0.58 * 345 * 700 * 10 = 1 400 700 N
    r = web_shear(Fyw=FY, E=E, D=700, tw=10)
    assert r.value("C").value == pytest.approx(0.861411, rel=1e-5)
    assert r.Vn == pytest.approx(0.861411 * 1_400_700.0, rel=1e-5)
    assert "6.10.9.3.2-5" in r.value("C").source


def test_C_elastic_branch():
    # D/tw = 100 > 75.37 -> 6.10.9.3.2-6: C = 1.57 / 100² * (200000 * 5 / 345) = 0.455072
    r = web_shear(Fyw=FY, E=E, D=1000, tw=10)
    assert r.value("C").value == pytest.approx(0.455072, rel=1e-5)
    assert r.Vn == pytest.approx(0.455072 * 2_001_000.0, rel=1e-5)


def test_branch_limits_are_continuous():
    # at D/tw = 1.12 sqrt(Ek/Fyw) the -4 and -5 forms both give 1; at 1.40 sqrt(Ek/Fyw)
    # the -5 form gives 0.8 and the -6 form 1.57 / 1.96 = 0.801 (hand calculation)
    root = math.sqrt(E * 5 / FY)
    assert shear_ratio_C(1.12 * root, 1.0, 5, E, FY)[0] == pytest.approx(1.0)
    assert shear_ratio_C(1.40 * root, 1.0, 5, E, FY)[0] == pytest.approx(0.8)
    assert shear_ratio_C(1.40 * root * 1.000001, 1.0, 5, E, FY)[0] == pytest.approx(
        1.57 / 1.96, rel=1e-5
    )


def test_interior_panel_tension_field_proportions_met():
    # do/D = 1 -> k = 5 + 5/1 = 10 (6.10.9.3.2-7); D/tw = 125 > 1.40 sqrt(E*10/345) = 106.6
    # C = 1.57/125² * (200000*10/345) = 0.582493; Vp = 0.58*345*1500*12 = 3 601 800 N
    # 2 D tw / (bfc tfc + bft tft) = 36000 / 20000 = 1.8 <= 2.5 -> 6.10.9.3.2-2:
    # Vn = 3 601 800 [0.582493 + 0.87 (1 - 0.582493) / sqrt(2)] = 3 023 121 N
    r = web_shear(Fyw=FY, E=E, D=1500, tw=12, panel="interior", do=1500, **BIG)
    assert r.value("k").value == pytest.approx(10.0)
    assert r.value("2Dtw/(bfc tfc + bft tft)").value == pytest.approx(1.8)
    assert r.Vn == pytest.approx(3_023_121.0, rel=1e-6)
    assert r.tension_field
    assert "6.10.9.3.2-2" in r.clause


def test_interior_panel_proportions_not_met_uses_do_over_D_in_denominator():
    # flanges 200x12: 36000 / 4800 = 7.5 > 2.5 -> 6.10.9.3.2-8
    # do/D = 1: Vn = 3 601 800 [0.582493 + 0.87 (0.417507) / (sqrt(2) + 1)] = 2 639 932 N
    r = web_shear(Fyw=FY, E=E, D=1500, tw=12, panel="interior", do=1500, **SMALL)
    assert r.Vn == pytest.approx(2_639_932.4, rel=1e-6)
    assert "6.10.9.3.2-8" in r.clause


def test_reduced_tension_field_with_do_over_D_two():
    # do = 3000, D = 1500: do/D = 2, k = 5 + 5/4 = 6.25, C = 1.57/125² (200000*6.25/345)
    # = 0.364058; denominator sqrt(1 + 4) + 2 = 4.23607 (do/D inside the denominator):
    # Vn = 3 601 800 [0.364058 + 0.87 (0.635942) / 4.23607] = 1 781 692 N.
    # Without the do/D term the result would be 2 202 456 N (hand calculation).
    r = web_shear(Fyw=FY, E=E, D=1500, tw=12, panel="interior", do=3000, **SMALL)
    assert r.value("C").value == pytest.approx(0.364058, rel=1e-5)
    assert r.Vn == pytest.approx(1_781_692.3, rel=1e-6)
    assert r.Vn != pytest.approx(2_202_456.2, rel=1e-3)


def test_end_panel_has_no_tension_field():
    # 6.10.9.3.3-1: Vn = C Vp = 0.582493 * 3 601 800 = 2 098 022 N
    r = web_shear(Fyw=FY, E=E, D=1500, tw=12, panel="end", do=1500)
    assert r.Vn == pytest.approx(2_098_022.4, rel=1e-6)
    assert not r.tension_field
    assert "6.10.9.3.3-1" in r.clause
    interior = web_shear(Fyw=FY, E=E, D=1500, tw=12, panel="interior", do=1500, **BIG)
    assert r.Vn < interior.Vn


def test_end_panel_wider_than_one_and_a_half_D_is_noted():
    # 6.10.9.3.3: end-panel stiffener spacing limited to 1.5 D (from memory)
    r = web_shear(Fyw=FY, E=E, D=1500, tw=12, panel="end", do=2400)
    assert any("1.5" in n for n in r.notes)


def test_panel_wider_than_3D_is_unstiffened():
    # 6.10.9.1: a web is stiffened only where do <= 3D; otherwise k = 5 and Vn = C Vp
    r = web_shear(Fyw=FY, E=E, D=1000, tw=10, panel="interior", do=3500, **BIG)
    assert r.value("k").value == 5.0
    assert r.Vn == pytest.approx(0.455072 * 2_001_000.0, rel=1e-5)
    assert not r.tension_field


def test_units_at_the_edges():
    # 50 ksi = 344.738 MPa, 29000 ksi = 199 948 MPa, 20 in = 508 mm, 0.5 in = 12.7 mm
    r = web_shear(Fyw="50 ksi", E="29000 ksi", D="20 in", tw="0.5 in")
    # Vp = 0.58 Fyw D tw = 0.58 * 50 * 20 * 0.5 = 290 kip = 1 289 976 N; D/tw = 40 -> C = 1
    assert r.Vn == pytest.approx(290.0 * 4448.2216, rel=1e-6)


def test_missing_do_for_stiffened_panel():
    with pytest.raises(InputError, match=r"do \(transverse stiffener spacing"):
        web_shear(Fyw=FY, E=E, D=1500, tw=12, panel="interior", **BIG)
    with pytest.raises(InputError, match="'end' panel"):
        web_shear(Fyw=FY, E=E, D=1500, tw=12, panel="end")


def test_missing_flanges_for_interior_panel_named():
    with pytest.raises(InputError, match="bft, tft"):
        web_shear(Fyw=FY, E=E, D=1500, tw=12, panel="interior", do=1500, bfc=400, tfc=25)


def test_bad_values_named():
    with pytest.raises(InputError, match="tw = -3"):
        web_shear(Fyw=FY, E=E, D=1500, tw=-3)
    with pytest.raises(InputError, match="panel = 'middle'"):
        web_shear(Fyw=FY, E=E, D=1500, tw=12, panel="middle")
    with pytest.raises(InputError, match="E = 29000"):
        web_shear(Fyw=FY, E=29000, D=1500, tw=12)


def test_rows_are_table_ready():
    r = web_shear(Fyw=FY, E=E, D=1500, tw=12, panel="interior", do=1500, **BIG)
    rows = list(r.rows())
    assert rows[-1][0] == "phi Rn" and rows[-1][2] == pytest.approx(r.Vr)
    assert all(len(row) == 5 and isinstance(row[2], float) for row in rows)
    assert {row[3] for row in rows} <= {"force", "stress", "length", "dimensionless"}
