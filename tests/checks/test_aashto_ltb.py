"""AASHTO LRFD 6.10.8.2.3 lateral-torsional buckling and Cb: hand calculations from the clause.

Source of every expected value: AASHTO LRFD Bridge Design Specifications, 9th ed. (2020),
6.10.8.2.3 (equation numbers from memory); hand calculation from the clause.
Fyc = Fyw = 345 MPa, E = 200 000 MPa, rt = 100 mm, Sxc = 1e7 mm³, Rb = Rh = 1 unless stated:
Lp = 1.0 rt sqrt(E/Fyc) = 100 * 24.07717 = 2407.717 mm (6.10.8.2.3-4);
Fyr = min(0.7 * 345, 345) = 241.5 MPa >= 0.5 Fyc (6.10.8.2.2);
Lr = pi rt sqrt(E/Fyr) = pi * 100 * 28.77767 = 9040.788 mm (6.10.8.2.3-5).
"""

import math

import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.checks.aashto_ltb import (
    lateral_torsional_buckling,
    moment_gradient_Cb,
    u_frame_unbraced_length,
)
from core.errors import InputError

KW = {"Fyc": 345, "Fyw": 345, "E": 200_000, "rt": 100, "Sxc": 1.0e7}


def test_limiting_lengths():
    r = lateral_torsional_buckling(Lb=1000, **KW)
    assert r.value("Lp").value == pytest.approx(2407.717, rel=1e-6)
    assert r.value("Fyr").value == pytest.approx(241.5)
    assert r.value("Lr").value == pytest.approx(9040.788, rel=1e-6)


def test_Lb_at_most_Lp_yield_plateau():
    # 6.10.8.2.3-1: Fnc = Rb Rh Fyc = 345 MPa; Mn = 345 * 1e7 = 3.45e9 N mm
    r = lateral_torsional_buckling(Lb=2000, **KW)
    assert r.value("Fnc").value == pytest.approx(345.0)
    assert r.Rn == pytest.approx(3.45e9)
    assert r.kind == "moment" and r.phi == 1.0  # phi_f = 1.00 (6.5.4.2, from memory)
    assert "6.10.8.2.3-1" in r.clause


def test_inelastic_branch():
    # Lb = 6000: (Lb - Lp)/(Lr - Lp) = 3592.283 / 6633.071 = 0.541572
    # Fnc = 1.0 [1 - (1 - 241.5/345) 0.541572] 345 = [1 - 0.3 * 0.541572] 345 = 288.947 MPa
    r = lateral_torsional_buckling(Lb=6000, **KW)
    assert r.value("Fnc").value == pytest.approx(288.9473, rel=1e-6)
    assert "6.10.8.2.3-2" in r.clause


def test_elastic_branch():
    # Lb = 12000 > Lr: Fcr = Cb Rb pi² E / (Lb/rt)² = pi² * 200000 / 120² = 137.0778 MPa
    r = lateral_torsional_buckling(Lb=12000, **KW)
    assert r.value("Fnc").value == pytest.approx(137.0778, rel=1e-6)
    assert "6.10.8.2.3-3" in r.clause
    # with Cb = 1.5: 205.6168 MPa, still below the cap 345 MPa
    assert lateral_torsional_buckling(Lb=12000, Cb=1.5, **KW).value("Fnc").value == pytest.approx(
        205.6168, rel=1e-6
    )


def test_Cb_above_one_is_capped_at_the_plateau():
    # inelastic Lb = 6000 with Cb = 1.3: 1.3 * 288.947 = 375.63 > Rb Rh Fyc = 345 -> 345
    r = lateral_torsional_buckling(Lb=6000, Cb=1.3, **KW)
    assert r.value("Fnc").value == pytest.approx(345.0)
    assert any("cap" in n for n in r.notes)
    # elastic Lb = 9100 with Cb = 2.3: 2.3 pi² E/(91)² = 548.3 > 345 -> 345
    assert lateral_torsional_buckling(Lb=9100, Cb=2.3, **KW).value("Fnc").value == 345.0


def test_Rb_scales_the_plateau():
    # 6.10.8.2.3-1 with Rb = 0.94: Fnc = 0.94 * 345 = 324.3 MPa
    r = lateral_torsional_buckling(Lb=2000, Rb=0.94, **KW)
    assert r.value("Fnc").value == pytest.approx(324.3)


def test_Fyr_from_a_weak_web_and_the_tension_flange():
    # Fyr = min(0.7 Fyc, Rh Fyt Sxt/Sxc, Fyw) >= 0.5 Fyc (6.10.8.2.2):
    # Fyw = 200 -> 200; Sxt/Sxc = 0.6 with Fyt = 345 -> 207 -> min 200; Fyw = 150 -> 0.5 Fyc
    assert lateral_torsional_buckling(Lb=6000, **{**KW, "Fyw": 200}).value(
        "Fyr"
    ).value == pytest.approx(200.0)
    r = lateral_torsional_buckling(Lb=6000, Fyt=345, Sxt=0.6e7, **KW)
    assert r.value("Fyr").value == pytest.approx(207.0)
    assert lateral_torsional_buckling(Lb=6000, **{**KW, "Fyw": 150}).value(
        "Fyr"
    ).value == pytest.approx(172.5)


@pytest.mark.parametrize(
    ("f_a", "f_mid", "f_b", "Cb"),
    [
        # uniform moment: f1 = f2 -> 1.75 - 1.05 + 0.3 = 1.0
        (100, 100, 100, 1.0),
        # linear to zero: f1 = max(2*50 - 100, 0) = 0 -> 1.75
        (100, 50, 0, 1.75),
        # linear 100 to 50: f1 = 50, r = 0.5 -> 1.75 - 0.525 + 0.075 = 1.30
        (50, 75, 100, 1.30),
        # curved: fmid = 90 above the chord: f1 = 2*90 - 100 = 80 > f0 = 50, r = 0.8 -> 1.102
        (100, 90, 50, 1.102),
        # reverse curvature 100 to -100: f1 = -100, r = -1 -> 3.1, capped at 2.3 (6.10.8.2.3-7)
        (100, 0, -100, 2.3),
        # fmid / f2 > 1 -> 1.0 (6.10.8.2.3-6)
        (100, 120, 80, 1.0),
        # no compression at either brace point: f2 = 0 -> 1.0
        (-50, 20, -10, 1.0),
    ],
)
def test_Cb(f_a, f_mid, f_b, Cb):
    # 6.10.8.2.3-6, -7, -11 (from memory); hand calculation in each row's comment
    got, vals = moment_gradient_Cb(f_a, f_mid, f_b)
    assert got == pytest.approx(Cb, rel=1e-9)
    assert vals[-1].symbol == "Cb"


def test_bad_input():
    with pytest.raises(InputError, match=r"Cb = 2\.5"):
        lateral_torsional_buckling(Lb=6000, Cb=2.5, **KW)
    with pytest.raises(InputError, match="rt = -1"):
        lateral_torsional_buckling(Lb=6000, **{**KW, "rt": -1})
    with pytest.raises(InputError, match="f_mid"):
        moment_gradient_Cb(1, float("nan"), 1)


def test_u_frame_unbraced_length_without_frames_is_the_span():
    # no intermediate frames: Ncr = pi² EI / L², so Le = L (Euler; Timoshenko & Gere Art. 2.1)
    Lb, vals = u_frame_unbraced_length(E=200_000, I_chord=5e7, span=20_000, frames=())
    assert Lb == pytest.approx(20_000, rel=1e-5)
    assert any("6.14.2.9" in v.source for v in vals)


def test_u_frame_unbraced_length_shortens_with_stiff_frames():
    # one frame at mid-span with k >= 16 pi² EI / L³ forces the second mode: Le = L/2
    EI = 200_000 * 5e7
    k = 20 * math.pi**2 * EI / 20_000**3
    Lb, _ = u_frame_unbraced_length(E=200_000, I_chord=5e7, span=20_000, frames=[(10_000, k)])
    assert Lb == pytest.approx(10_000, rel=1e-4)


@given(st.floats(100, 40_000), st.floats(100, 40_000), st.floats(1.0, 2.3), st.floats(30, 300))
def test_longer_unbraced_length_never_raises_the_resistance(L1, L2, Cb, rt):
    # a property of 6.10.8.2.3 (no source needed): Fnc is non-increasing in Lb
    lo, hi = sorted((L1, L2))
    kw = {**KW, "rt": rt, "Cb": Cb}
    assert lateral_torsional_buckling(Lb=hi, **kw).Rn <= lateral_torsional_buckling(
        Lb=lo, **kw
    ).Rn * (1 + 1e-12)
