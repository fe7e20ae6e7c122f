"""AASHTO LRFD 6.10.8.2.2 flange local buckling, 6.10.1.10.2 Rb and 6.10.1.9.1 Fcrw: hand
calculations from the clauses.

Source: AASHTO LRFD Bridge Design Specifications, 9th ed. (2020), 6.10.8.2.2, 6.10.1.10.2,
6.10.1.9.1 (equation numbers from memory); hand calculation from the clause.
Fyc = Fyw = 345 MPa, E = 200 000 MPa, Sxc = 1e7 mm³: lambda_pf = 0.38 sqrt(E/Fyc) = 9.14932;
Fyr = 241.5 MPa; lambda_rf = 0.56 sqrt(E/Fyr) = 16.11552.
"""

import math

import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.checks.aashto_flange import (
    FlangeElement,
    flange_local_buckling,
    plate_flange,
    web_bend_buckling,
    web_load_shedding,
)
from core.errors import InputError

KW = {"Fyc": 345, "Fyw": 345, "E": 200_000, "Sxc": 1.0e7}


def test_compact_plate_flange():
    # bfc = 400, tfc = 25: lambda_f = 400/(2*25) = 8 <= 9.149 -> Fnc = Fyc = 345 (6.10.8.2.2-1)
    r = flange_local_buckling(plate_flange(400, 25), **KW)
    assert r.value("lambda_f").value == pytest.approx(8.0)
    assert r.value("lambda_pf").value == pytest.approx(9.14932, rel=1e-5)
    assert r.value("Fnc").value == pytest.approx(345.0)
    assert r.Rn == pytest.approx(3.45e9)


def test_noncompact_plate_flange():
    # bfc = 480, tfc = 20: lambda_f = 12; (12 - 9.14932)/(16.11552 - 9.14932) = 0.409215
    # Fnc = [1 - 0.3 * 0.409215] 345 = 302.646 MPa (6.10.8.2.2-2)
    r = flange_local_buckling(plate_flange(480, 20), **KW)
    assert r.value("lambda_rf").value == pytest.approx(16.11552, rel=1e-5)
    assert r.value("Fnc").value == pytest.approx(302.6462, rel=1e-6)
    assert "6.10.8.2.2-2" in r.clause


def test_riveted_flange_most_slender_outstand_governs():
    # angle legs 150 x 12.5 (b/t = 12, as found) and a cover outstand 60 x 12 (b/t = 5):
    # the leg governs, Fnc as in the non-compact case above
    els = (
        FlangeElement("angle_tl horizontal leg", 150, 12.5),
        FlangeElement("cover_top_1 outstand", 60, 12),
        FlangeElement("cover_top_1 between rivet lines", 200, 12, "internal"),
    )
    r = flange_local_buckling(els, **KW)
    assert r.value("Fnc").value == pytest.approx(302.6462, rel=1e-6)
    assert "angle_tl" in r.notes[0]


def test_beyond_lambda_rf_is_flagged_and_decays():
    # lambda_f = 20 > 16.11552: Fnc = Fyr (lambda_rf/lambda_f)² = 241.5 * 0.649274 = 156.80
    r = flange_local_buckling((FlangeElement("leg", 200, 10),), **KW)
    assert r.value("Fnc").value == pytest.approx(156.80, rel=1e-4)
    assert any("engineer to review" in n for n in r.notes)


def test_slender_internal_element_is_noted():
    # 1.40 sqrt(E/Fyc) = 33.71; 400/10 = 40 exceeds it (6.9.4.2.1, from memory)
    els = (FlangeElement("leg", 100, 12), FlangeElement("cover", 400, 10, "internal"))
    r = flange_local_buckling(els, **KW)
    assert any("cover" in n and "1.4" in n for n in r.notes)


def test_Rb():
    # Dc = 800, tw = 8, Afc = 400 * 20: 2Dc/tw = 200 > lambda_rw = 5.7 sqrt(E/Fyc) = 137.240
    # awc = 2 * 800 * 8 / 8000 = 1.6; Rb = 1 - 1.6/(1200 + 480) (200 - 137.240) = 0.940228
    Rb, vals = web_load_shedding(Dc=800, tw=8, Afc=8000, E=200_000, Fyc=345)
    assert Rb == pytest.approx(0.9402285, rel=1e-6)
    assert {v.symbol for v in vals} >= {"2Dc/tw", "lambda_rw", "awc", "Rb"}
    # stocky web: 2 * 400 / 8 = 100 <= 137.24 -> Rb = 1
    assert web_load_shedding(Dc=400, tw=8, Afc=8000, E=200_000, Fyc=345)[0] == 1.0


def test_Rb_with_E_200_GPa_and_Fyc_250():
    # Dc = 800, tw = 8, bfc tfc = 10 000 mm², E = 200 000, Fyc = 250:
    # lambda_rw = 5.7 sqrt(800) = 161.22; 2Dc/tw = 200 > lambda_rw
    # a_wc = 2 * 800 * 8 / 10000 = 1.28; Rb = 1 - 1.28/(1200 + 384) (200 - 161.22) = 0.96867
    Rb, _ = web_load_shedding(Dc=800, tw=8, Afc=10_000, E=200_000, Fyc=250)
    lam = 5.7 * math.sqrt(800.0)
    assert Rb == pytest.approx(1 - 1.28 / 1584 * (200 - lam), rel=1e-12)
    assert Rb == pytest.approx(0.96867, abs=1e-5)
    # a stocky web sheds nothing: 2 * 400 / 8 = 100 < 161.2 -> Rb = 1
    assert web_load_shedding(Dc=400, tw=8, Afc=10_000, E=200_000, Fyc=250)[0] == 1.0


def test_Rb_enters_flb():
    r = flange_local_buckling(plate_flange(400, 25), Rb=0.9402285, **KW)
    assert r.value("Fnc").value == pytest.approx(0.9402285 * 345, rel=1e-9)


def test_web_bend_buckling():
    # D = 1600, Dc = 800, tw = 8: k = 9/(0.5)² = 36; Fcrw = 0.9 * 200000 * 36 / 200² = 162 MPa
    # below min(Rh Fyc, Fyw/0.7) = 345 (6.10.1.9.1-1, -2)
    r = web_bend_buckling(D=1600, Dc=800, tw=8, E=200_000, Fyc=345, Fyw=345)
    assert r.Rn == pytest.approx(162.0)
    assert r.kind == "stress"
    # stocky: D/tw = 100 -> 648 MPa, capped at 345
    assert web_bend_buckling(D=1600, Dc=800, tw=16, E=200_000, Fyc=345, Fyw=345).Rn == 345.0


def test_bad_input():
    with pytest.raises(InputError, match="at least one outstanding"):
        flange_local_buckling((FlangeElement("c", 100, 10, "internal"),), **KW)
    with pytest.raises(InputError, match="Dc = 2000"):
        web_bend_buckling(D=1600, Dc=2000, tw=8, E=200_000, Fyc=345, Fyw=345)
    with pytest.raises(InputError, match="kind = 'middle'"):
        FlangeElement("x", 100, 10, "middle")


@given(st.floats(3, 40), st.floats(3, 40))
def test_thinner_flange_never_raises_flb(t1, t2):
    # a property of 6.10.8.2.2 and its extension (no source needed)
    lo, hi = sorted((t1, t2))
    a = flange_local_buckling((FlangeElement("leg", 150, lo),), **KW).Rn
    b = flange_local_buckling((FlangeElement("leg", 150, hi),), **KW).Rn
    assert a <= b * (1 + 1e-12)
