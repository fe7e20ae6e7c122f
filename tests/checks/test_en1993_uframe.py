"""EN 1993-2 6.3.4.2 U-frame compression chord: hand calculations with Ncrit from closed
forms.

Sources: EN 1993-2:2006 6.3.4.2 and Annex D.2.4, EN 1993-1-1:2005 6.3.2.2 curve d (alpha_LT
0.76), gamma_M1 = 1.10 (EN 1993-2 Table 6.1); all from memory; Ncrit without frames is Euler's
pi² E I / L², with one rigid frame at mid-span the second mode 4 pi² E I / L² (Timoshenko
and Gere, 2nd ed., Arts. 2.1 and 2.9; from memory); hand calculation.
"""

import math

import pytest

from core.checks.en1993_uframe import compression_chord

KW = {"A_chord": 12_000, "I_chord": 8e7, "fy": 355, "Wy": 5e6, "span": 20_000}


def test_no_frames_is_euler():
    # Ncrit = pi² * 210000 * 8e7 / 20000² = 414 523.4 N; lambda_LT = sqrt(12000 * 355 / 414523)
    # = 3.205755; chi_LT (curve d) = 0.0783972; Mb = 0.0783972 * 5e6 * 355 = 139 155 012 N mm
    r = compression_chord(frames=(), **KW)
    assert r.value("Ncr").value == pytest.approx(414_523.38, rel=1e-6)
    assert r.value("lambda_LT").value == pytest.approx(3.2057547, rel=1e-6)
    assert r.Rn == pytest.approx(139_155_012, rel=1e-5)
    assert r.phi == pytest.approx(1 / 1.10)


def test_stiff_mid_span_frame_forces_the_second_mode():
    EI = 210_000 * 8e7
    k = 20 * 16 * math.pi**2 * EI / 20_000**3
    r = compression_chord(frames=[(10_000, k)], **KW)
    assert r.value("Ncr").value == pytest.approx(4 * 414_523.38, rel=1e-5)
    assert r.value("Le").value == pytest.approx(10_000, rel=1e-5)


def test_stiffer_frames_raise_the_resistance():
    soft = compression_chord(frames=[(5000.0 * i, 50.0) for i in (1, 2, 3)], **KW).Rn
    stiff = compression_chord(frames=[(5000.0 * i, 500.0) for i in (1, 2, 3)], **KW).Rn
    assert stiff > soft > compression_chord(frames=(), **KW).Rn


def test_long_spans_and_units():
    # 75 ft = 22 860 mm: Ncrit = pi² * 210000 * 8e7 / 22860² = 317 290 N (Euler)
    r = compression_chord(frames=(), **{**KW, "span": "75 ft"})
    assert r.value("Ncr").value == pytest.approx(math.pi**2 * 210_000 * 8e7 / 22_860**2, rel=1e-6)
