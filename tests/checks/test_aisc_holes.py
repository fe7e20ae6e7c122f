"""AISC 360-22 holes in the tension flange (F13.1, Eq. F13-1); from memory; hand calculations
from the clause."""

import pytest

from core.checks.aisc_holes import tension_flange_holes


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
