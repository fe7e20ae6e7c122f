"""AISC 360-22 flexure of built-up I-members by flange yielding (F4.1 / F4.4 with
Rpc = Rpt = 1.0; F5.1 with Rpg, Eq. F5-6; F5.4) and holes in the tension flange (F13.1,
Eq. F13-1); from memory; hand calculations from the clauses."""

import math

import pytest

from core.checks.aisc_flange_yield import flange_yielding, tension_flange_holes


def test_slender_web_F5_Rpg():
    # Fy = 250, E = 200 000: lambda_r = 5.70 sqrt(800) = 161.22; hc/tw = 1800/10 = 180 > 161.22
    # aw = 1800 * 10 / 10 000 = 1.8; Rpg = 1 - 1.8/(1200 + 540) (180 - 161.22) = 0.98057
    r = flange_yielding(
        Fy=250, E=200_000, S_xc=2e7, S_xt=2.2e7, hc=1800, tw=10, Afc=10_000, phi_b=0.9
    )
    Rpg = 1 - 1.8 / 1740 * (180 - 5.7 * math.sqrt(800))
    assert r.value("Rpg").value == pytest.approx(Rpg) and Rpg == pytest.approx(0.98057, abs=1e-5)
    assert r.Rn == pytest.approx(Rpg * 250 * 2e7) and r.phi == 0.9
    assert "F5" in r.clause


def test_web_not_slender_F4():
    # hc/tw = 1200/10 = 120 < 161.22: Mn = min(Fy Sxc, Fy Sxt) with Rpc = Rpt = 1.0
    r = flange_yielding(
        Fy=250, E=200_000, S_xc=2e7, S_xt=1.8e7, hc=1200, tw=10, Afc=10_000, phi_b=0.9
    )
    assert r.Rn == pytest.approx(250 * 1.8e7) and "F4" in r.clause


def test_holes_F13_1():
    # Fy/Fu = 250/400 = 0.625 <= 0.8 -> Yt = 1.0; Fu Afn = 400 * 5000 = 2.0e6 <
    # Yt Fy Afg = 2.5e6: Mn = Fu Afn / Afg Sxt = 400 * 0.5 * 1e7 = 2.0e9 N*mm
    r = tension_flange_holes(Afn=5000, Afg=10_000, Fy=250, Fu=400, S_xt=1e7, phi_b=0.9)
    assert r.Rn == pytest.approx(2.0e9)
    # Afn = 9000: 3.6e6 >= 2.5e6, the holes do not govern: Fy Sxt
    assert tension_flange_holes(
        Afn=9000, Afg=10_000, Fy=250, Fu=400, S_xt=1e7, phi_b=0.9
    ).Rn == pytest.approx(2.5e9)
    # Fy/Fu = 350/400 = 0.875 > 0.8 -> Yt = 1.1
    assert (
        tension_flange_holes(Afn=9000, Afg=10_000, Fy=350, Fu=400, S_xt=1e7, phi_b=0.9)
        .value("Yt")
        .value
        == 1.1
    )
