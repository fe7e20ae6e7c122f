"""AISC 360-22 F1, F4 and F5 for built-up I-members: hand calculations from the clauses.

Source: AISC 360-22 Specification for Structural Steel Buildings, F1-1, Table B4.1b (cases
11, 15, 16), F4-1 to F4-14, F5-1 to F5-9 (equation numbers from memory); hand calculation.
Fy = 345 MPa, E = 200 000 MPa, Sxc = Sxt = 1e7 mm³, Zx = 1.1e7 mm³, rt = 80 mm, J = 1e6 mm⁴,
h0 = 1500, h = hc = hp = 1450 mm, Afc = 8000 mm², Iyc/Iy = 0.5; sqrt(E/Fy) = 24.07717.
"""

import math

import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.checks.aashto_flange import FlangeElement
from core.checks.aisc_flexure import (
    BuiltUpI,
    Cb_quarter_points,
    flange_local_buckling,
    flange_yielding,
    lateral_torsional_buckling,
)
from core.errors import InputError

BASE = {
    "Fy": 345,
    "E": 200_000,
    "Sxc": 1e7,
    "Sxt": 1e7,
    "Zx": 1.1e7,
    "rt": 80,
    "J": 1e6,
    "h0": 1500,
    "h": 1450,
    "hc": 1450,
    "hp": 1450,
    "Afc": 8000,
    "Iyc": 5e7,
    "Iy": 1e8,
}
SLENDER = BuiltUpI(tw=8, **BASE)  # hc/tw = 181.25 > 5.70 sqrt(E/Fy) = 137.24: F5
NONCOMPACT = BuiltUpI(tw=12, **BASE)  # hc/tw = 120.83: F4


def test_Cb_F1_1():
    # uniform moment: 12.5 / (2.5 + 3 + 4 + 3) = 1.0; simple span under uniform load between
    # end restraints: Mmax = MB = 1, MA = MC = 0.75 -> 12.5 / 11 = 1.13636
    assert Cb_quarter_points(1, 1, 1, 1)[0] == pytest.approx(1.0)
    assert Cb_quarter_points(1.0, 0.75, 1.0, 0.75)[0] == pytest.approx(1.136364, rel=1e-6)
    with pytest.raises(InputError, match="must be the largest"):
        Cb_quarter_points(1.0, 2.0, 1.0, 1.0)


def test_F5_web_class_and_Rpg():
    # aw = 1450 * 8 / 8000 = 1.45; Rpg = 1 - 1.45/(1200 + 435) (181.25 - 137.2399) = 0.960970
    assert SLENDER.slender_web and not NONCOMPACT.slender_web
    assert SLENDER.Rpg == pytest.approx(0.9609696, rel=1e-6)


def test_F5_ltb_three_branches():
    # Lp = 1.1 rt sqrt(E/Fy) = 2118.79; Lr = pi rt sqrt(E/(0.7 Fy)) = 7232.63 (F4-7, F5-5)
    r = lateral_torsional_buckling(SLENDER, Lb=2000)
    assert r.value("Lp").value == pytest.approx(2118.791, rel=1e-6)
    assert r.value("Lr").value == pytest.approx(7232.631, rel=1e-6)
    assert r.Rn == pytest.approx(0.9609696 * 345 * 1e7, rel=1e-6)  # F5-1
    # Lb = 5000: Fcr = 345 - 103.5 (5000 - 2118.79)/(7232.63 - 2118.79) = 286.6866 (F5-3)
    r = lateral_torsional_buckling(SLENDER, Lb=5000)
    assert r.value("Fcr").value == pytest.approx(286.6866, rel=1e-6)
    assert r.Rn == pytest.approx(2_754_971_574, rel=1e-6)
    # Lb = 10000: Fcr = pi² E / 125² = 126.3309 (F5-4)
    r = lateral_torsional_buckling(SLENDER, Lb=10_000)
    assert r.Rn == pytest.approx(1_214_001_908, rel=1e-6)
    assert r.phi == 0.90
    # Cb = 1.3 at Lb = 5000: 1.3 * 286.69 > Fy -> capped at Fy
    assert lateral_torsional_buckling(SLENDER, Lb=5000, Cb=1.3).value("Fcr").value == 345.0


def test_F4_noncompact_web_Rpc_and_ltb():
    # lambda_pw = sqrt(E/Fy) / (0.54 * 1.1 - 0.09)² = 94.786; Rpc = 1.1 - 0.1 (120.83 - 94.786)
    # / (137.24 - 94.786) = 1.038646 (F4-9b); FL = 0.7 Fy = 241.5 (F4-6a)
    assert NONCOMPACT.lam_pw == pytest.approx(94.78604, rel=1e-6)
    assert NONCOMPACT.Rpc == pytest.approx(1.0386456, rel=1e-6)
    # Lr (F4-8) = 1.95 * 80 * (200000/241.5) sqrt(6.6667e-5 + sqrt(6.6667e-5² + 6.76 * 0.0012075²))
    # = 7316.08; Lb = 5000: Mn = 3.58333e9 - (3.58333e9 - 2.415e9)(2881.21 / 5197.29)
    # = 2 935 644 406 N mm (F4-2)
    r = lateral_torsional_buckling(NONCOMPACT, Lb=5000)
    assert r.value("Lr").value == pytest.approx(7316.080, rel=1e-6)
    assert r.Rn == pytest.approx(2_935_644_406, rel=1e-6)
    # Lb = 12000: Fcr = pi² E/150² sqrt(1 + 0.078 * 6.6667e-5 * 150²) = 92.7201 (F4-5, F4-3)
    r = lateral_torsional_buckling(NONCOMPACT, Lb=12_000)
    assert r.Rn == pytest.approx(927_200_825, rel=1e-6)
    # Lb <= Lp: Rpc Myc = 3 583 327 326 N mm (F4-1)
    assert lateral_torsional_buckling(NONCOMPACT, Lb=1000).Rn == pytest.approx(
        3_583_327_326, rel=1e-6
    )


def test_flb_F5_and_F4():
    # F5: kc = 4/sqrt(181.25) = 0.297 -> 0.35; lambda_rf = 0.95 sqrt(0.35 E / 241.5) = 16.1739
    # lambda = 12: Fcr = 345 - 103.5 (12 - 9.14932)/(16.1739 - 9.14932) = 303.000 (F5-8)
    leg = (FlangeElement("leg", 120, 10),)
    r = flange_local_buckling(SLENDER, leg)
    assert r.value("kc").value == pytest.approx(0.35)
    assert r.Rn == pytest.approx(2_911_719_030, rel=1e-6)
    # lambda = 20 (slender): Fcr = 0.9 E kc / 400 = 157.5 (F5-9)
    assert flange_local_buckling(SLENDER, (FlangeElement("leg", 200, 10),)).Rn == pytest.approx(
        1_513_527_138, rel=1e-6
    )
    # F4: kc = 4/sqrt(120.83) = 0.363887; lambda_rf = 16.4916; Mn = 3 129 719 670 (F4-13)
    assert flange_local_buckling(NONCOMPACT, leg).Rn == pytest.approx(3_129_719_670, rel=1e-6)
    # slender flange: 0.9 E kc Sxc / 400 = 1 637 491 774 (F4-14)
    assert flange_local_buckling(NONCOMPACT, (FlangeElement("leg", 200, 10),)).Rn == pytest.approx(
        1_637_491_774, rel=1e-6
    )
    # compact (lambda = 8): F4-1
    assert flange_local_buckling(NONCOMPACT, (FlangeElement("leg", 80, 10),)).Rn == pytest.approx(
        3_583_327_326, rel=1e-6
    )


def test_small_compression_flange_drops_J_and_Rpc():
    # Iyc/Iy <= 0.23: Rpc = 1 (F4-10) and J = 0 in F4-5 and F4-8
    sec = BuiltUpI(tw=12, **{**BASE, "Iyc": 2e7})
    assert sec.Rpc == 1.0
    assert lateral_torsional_buckling(sec, Lb=12_000).value("J").value == 0.0


def test_bad_section():
    with pytest.raises(InputError, match="Iyc = 2e"):
        BuiltUpI(tw=12, **{**BASE, "Iyc": 2e8})


@given(
    st.floats(100, 30_000),
    st.floats(100, 30_000),
    st.floats(1.0, 2.3),
    st.sampled_from([8, 12, 20]),
)
def test_longer_unbraced_length_never_raises_strength(L1, L2, Cb, tw):
    # a property of F4.2 and F5.2 (no source needed)
    lo, hi = sorted((L1, L2))
    sec = BuiltUpI(tw=tw, **BASE)
    assert lateral_torsional_buckling(sec, Lb=hi, Cb=Cb).Rn <= lateral_torsional_buckling(
        sec, Lb=lo, Cb=Cb
    ).Rn * (1 + 1e-12)


def test_flange_yielding_F5_with_Rpg():
    # Fy = 250, E = 200 000: lambda_r = 5.70 sqrt(800) = 161.22; hc/tw = 1800/10 = 180
    # aw = 1800 * 10 / 10 000 = 1.8; Rpg = 1 - 1.8/(1200 + 540) (180 - 161.22) = 0.98057
    # (F5-6); Sxt > Sxc: no tension flange yielding (F5.4), Mn = Rpg Fy Sxc (F5-1)
    sec = BuiltUpI(
        Fy=250, E=200_000, Sxc=2e7, Sxt=2.2e7, Zx=2.4e7, rt=80, J=1e6, h0=1850, h=1800,
        hc=1800, hp=1800, tw=10, Afc=10_000, Iyc=5e7, Iy=1e8,
    )  # fmt: skip
    r = flange_yielding(sec, phi_b=0.9)
    Rpg = 1 - 1.8 / 1740 * (180 - 5.7 * math.sqrt(800))
    assert Rpg == pytest.approx(0.98057, abs=1e-5)
    assert r.Rn == pytest.approx(Rpg * 250 * 2e7) and r.phi == 0.9 and "F5-1" in r.clause


def test_flange_yielding_F4_Rpc_and_Rpt():
    # Sxt = 0.9e7 < Sxc = 1e7 (F4.4 applies). Mp = Fy Zx = 345 * 1.1e7 (below 1.6 Fy Sx);
    # lambda_pw = sqrt(E/Fy) / (0.54 * 1.1/0.9 - 0.09)² = 24.07717 / 0.57² = 74.1064;
    # t = (120.833 - 74.1064) / (137.2399 - 74.1064) = 0.740124;
    # Rpc = 1.1 - 0.1 t = 1.025988 (F4-9b); Rpt = 1.22222 - 0.22222 t = 1.057750 (F4-16b);
    # Mn,c = Rpc Fy Sxc = 3.53966e9, Mn,t = Rpt Fy Sxt = 3.28431e9 N mm: tension governs (F4-15)
    sec = BuiltUpI(tw=12, **{**BASE, "Sxt": 0.9e7})
    lam_pw = math.sqrt(200_000 / 345) / 0.57**2
    t = (1450 / 12 - lam_pw) / (5.70 * math.sqrt(200_000 / 345) - lam_pw)
    Rpc, Rpt = 1.1 - 0.1 * t, 1.1 / 0.9 - (1.1 / 0.9 - 1) * t
    assert sec.Rpc == pytest.approx(Rpc) and sec.Rpt == pytest.approx(Rpt)
    assert Rpt == pytest.approx(1.05775, abs=1e-5)
    r = flange_yielding(sec)
    assert r.Rn == pytest.approx(Rpt * 345 * 0.9e7) and "F4-15" in r.clause
    # a small compression flange (Iyc/Iy <= 0.23): Rpt = 1.0 (F4-17)
    small = BuiltUpI(tw=12, **{**BASE, "Sxt": 0.9e7, "Iyc": 2e7})
    assert small.Rpt == 1.0 and flange_yielding(small).Rn == pytest.approx(345 * 0.9e7)
