"""AISC 360-22 Chapter G web shear: hand calculations from the clauses, branch by branch.

Source: AISC 360-22 Specification for Structural Steel Buildings, G1, G2.1 (G2-1, G2-3,
G2-4, G2-5) and G2.2 (G2-6 to G2-11), equation numbers from memory; hand calculation from
the clause. No published worked example is used: none is recalled reliably enough.
E = 200 000 MPa, Fy = 345 MPa unless stated.
"""

import functools

import pytest

from core.checks import aisc_shear
from core.checks.aisc_shear import Cv2_for, kv_for
from core.errors import InputError

# the clause takes the resistance factor from the family: phi_v = 0.90 (AISC 360-22 G1, from memory), the AISC family's
web_shear = functools.partial(aisc_shear.web_shear, phi_v=0.9)

E, FY = 200_000.0, 345.0
BIG = {"bfc": 400.0, "tfc": 25.0, "bft": 400.0, "tft": 25.0}
SMALL = {"bfc": 200.0, "tfc": 12.0, "bft": 200.0, "tft": 12.0}


def test_kv():
    # G2.1(b)(2): 5.34 without stiffeners or a/h > 3; else 5 + 5/(a/h)²
    assert kv_for(None) == 5.34
    assert kv_for(3.5) == 5.34
    assert kv_for(1.0) == 10.0
    assert kv_for(2.0) == 6.25
    assert kv_for(3.0) == pytest.approx(5.0 + 5.0 / 9.0)


def test_Cv1_equal_one():
    # kv = 5.34: 1.10 sqrt(5.34 * 200000 / 345) = 61.20 >= h/tw = 50 -> Cv1 = 1 (G2-3)
    # G2-1: Vn = 0.6 * 345 * (540 * 10) * 1 = 1 117 800 N; phi_v = 0.90 (G1)
    r = web_shear(Fy=FY, E=E, h=500, tw=10, d=540)
    assert r.value("Cv1").value == 1.0
    assert r.value("Aw").value == 5400.0
    assert r.Vn == pytest.approx(1_117_800.0, rel=1e-12)
    assert r.phi_v == 0.9 and r.Vr == pytest.approx(0.9 * 1_117_800.0)


def test_Cv1_below_one():
    # h/tw = 100 > 61.202 -> G2-4: Cv1 = 61.2024 / 100 = 0.612024
    # Vn = 0.6 * 345 * (1040 * 10) * 0.612024 = 1 317 566 N
    r = web_shear(Fy=FY, E=E, h=1000, tw=10, d=1040)
    assert r.value("Cv1").value == pytest.approx(0.612024, rel=1e-5)
    assert r.Vn == pytest.approx(1_317_566.2, rel=1e-6)


def test_Aw_defaults_to_h_tw_with_a_note():
    r = web_shear(Fy=FY, E=E, h=500, tw=10)
    assert r.value("Aw").value == 5000.0
    assert any("Aw = h tw" in n for n in r.notes)


def test_Cv2_branches():
    # kv = 10: 1.10 sqrt(kv E/Fy) = 83.75, 1.37 sqrt(kv E/Fy) = 104.31
    assert Cv2_for(80.0, 10.0, E, FY) == (1.0, "G2-9")
    c, eq = Cv2_for(100.0, 10.0, E, FY)  # G2-10: 83.7526 / 100
    assert eq == "G2-10" and c == pytest.approx(0.837526, rel=1e-5)
    c, eq = Cv2_for(125.0, 10.0, E, FY)  # G2-11: 1.51 * 10 * 200000 / (125² * 345)
    assert eq == "G2-11" and c == pytest.approx(0.560232, rel=1e-5)


def test_tension_field_G2_7():
    # a/h = 1, kv = 10, h/tw = 125, Cv2 = 0.560232, Aw = 1550 * 12 = 18 600 mm²
    # 2Aw/(Afc+Aft) = 37200/20000 = 1.86 <= 2.5, h/bf = 3.75 <= 6 -> G2-7:
    # Vn = 0.6*345*18600 [0.560232 + 0.439768 / (1.15 sqrt 2)] = 3 198 109 N
    r = web_shear(Fy=FY, E=E, h=1500, tw=12, d=1550, panel="interior", a=1500, **BIG)
    assert r.value("2Aw/(Afc+Aft)").value == pytest.approx(1.86)
    assert r.Vn == pytest.approx(3_198_109.0, rel=1e-6)
    assert r.tension_field and "G2-7" in r.clause


def test_tension_field_G2_8_when_proportions_fail():
    # flanges 200x12: 2Aw/(Afc+Aft) = 37200/4800 = 7.75 > 2.5 and h/bf = 7.5 > 6 -> G2-8:
    # Vn = 0.6*345*18600 [0.560232 + 0.439768 / (1.15 (1 + sqrt 2))] = 2 766 870 N,
    # larger than G2.1 with Cv1 = 83.7526/125: 0.6*345*18600*0.670021 = 2 579 713 N
    r = web_shear(Fy=FY, E=E, h=1500, tw=12, d=1550, panel="interior", a=1500, **SMALL)
    assert r.Vn == pytest.approx(2_766_869.5, rel=1e-6)
    assert "G2-8" in r.clause


def test_h_over_bf_limit_alone_switches_to_G2_8():
    # flanges 240x50: 2Aw/(Afc+Aft) = 37200/24000 = 1.55 <= 2.5 but h/bf = 6.25 > 6.0
    fl = {"bfc": 240.0, "tfc": 50.0, "bft": 240.0, "tft": 50.0}
    r = web_shear(Fy=FY, E=E, h=1500, tw=12, d=1550, panel="interior", a=1500, **fl)
    assert r.Vn == pytest.approx(2_766_869.5, rel=1e-6)


def test_no_tension_field_when_asked_and_limits_fail():
    # reduced_tension_field=False: G2.1 only, Vn = 2 579 713 N (see above)
    r = web_shear(
        Fy=FY,
        E=E,
        h=1500,
        tw=12,
        d=1550,
        panel="interior",
        a=1500,
        reduced_tension_field=False,
        **SMALL,
    )
    assert r.Vn == pytest.approx(2_579_713.1, rel=1e-6)
    assert not r.tension_field


def test_G2_1_used_when_larger_than_G2_8():
    # Fy = 250, h = 3000, tw = 10 (h/tw = 300), a/h = 3 -> kv = 5.5556
    # Cv1 = 1.10 sqrt(5.5556*200000/250)/300 = 0.244444; Vn(G2.1) = 0.6*250*30000*Cv1 = 1 100 000
    # Cv2 = 1.51 kv E/(300² * 250) = 0.074568; G2-8 factor = 0.205157 < Cv1 -> G2.1 governs
    fl = {"bfc": 300.0, "tfc": 20.0, "bft": 300.0, "tft": 20.0}
    r = web_shear(Fy=250, E=E, h=3000, tw=10, panel="interior", a=9000, **fl)
    assert r.Vn == pytest.approx(1_100_000.0, rel=1e-9)
    assert not r.tension_field


def test_G2_6_stocky_interior_web():
    # h/tw = 50 <= 1.10 sqrt(kv E/Fy): Vn = 0.6 Fy Aw (G2-6), no flange data needed
    r = web_shear(Fy=FY, E=E, h=500, tw=10, d=540, panel="interior", a=500)
    assert r.Vn == pytest.approx(0.6 * 345 * 5400)


def test_end_panel_no_tension_field():
    # end panel: G2.1 with kv = 10, Cv1 = 83.7526/125 = 0.670021; Aw = 18600
    r = web_shear(Fy=FY, E=E, h=1500, tw=12, d=1550, panel="end", a=1500)
    assert r.Vn == pytest.approx(2_579_713.1, rel=1e-6)
    assert not r.tension_field


def test_interior_panel_wider_than_3h_has_no_tension_field():
    r = web_shear(Fy=FY, E=E, h=1000, tw=10, d=1040, panel="interior", a=3500, **BIG)
    assert r.value("kv").value == 5.34
    assert r.Vn == pytest.approx(1_317_566.2, rel=1e-6)


def test_missing_a_and_flanges():
    with pytest.raises(InputError, match=r"a \(clear distance"):
        web_shear(Fy=FY, E=E, h=1500, tw=12, panel="interior")
    with pytest.raises(InputError, match="bfc, tfc, bft, tft"):
        web_shear(Fy=FY, E=E, h=1500, tw=12, panel="interior", a=1500)
