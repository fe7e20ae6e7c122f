"""A column on discrete elastic lateral supports (the U-frame chord) and the U-frame's
stiffness, against closed forms of elastic stability.

Sources: Timoshenko and Gere, Theory of Elastic Stability, 2nd ed. (1961), Art. 2.1 (Euler),
Art. 2.9 (a bar with an intermediate elastic support: a mid-length spring of 16 pi² EI/L³
forces the second mode 4 pi² EI/L²; from memory), Art. 2.10 (bars on an elastic foundation,
Ncr -> 2 sqrt(c EI) for a long bar; from memory); the Rayleigh quotient of the first Euler
mode for a weak spring (an upper bound; common practice, no source); frame mechanics for the
U-frame (cantilever hv³/(3EI) and a beam bent by equal end moments, rotation M b/(2EI);
common practice, no source).
"""

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from core.checks.elastic_support import critical_load, u_frame_stiffness
from core.errors import InputError

EI, L = 1.0e12, 10_000.0
EULER = math.pi**2 * EI / L**2


def test_euler_without_springs():
    c = critical_load(EI=EI, L=L)
    assert c.Ncr == pytest.approx(EULER, rel=1e-5)
    assert c.Le == pytest.approx(L, rel=1e-5)
    assert c.engesser is None


def test_mid_length_spring_threshold_gives_the_second_mode():
    k = 16 * math.pi**2 * EI / L**3
    for f in (1.0, 1.5, 10.0):
        c = critical_load(EI=EI, L=L, springs=[(L / 2, f * k)])
        assert c.Ncr == pytest.approx(4 * EULER, rel=1e-4)
        assert c.Le == pytest.approx(L / 2, rel=1e-4)
    half = critical_load(EI=EI, L=L, springs=[(L / 2, 0.5 * k)])
    assert EULER < half.Ncr < 4 * EULER


def test_weak_spring_close_to_rayleigh_and_below_it():
    # Rayleigh with sin(pi x/L): N = EULER + 2 k L / pi²
    k = 0.01 * 16 * math.pi**2 * EI / L**3
    c = critical_load(EI=EI, L=L, springs=[(L / 2, k)])
    rayleigh = EULER + 2 * k * L / math.pi**2
    assert c.Ncr <= rayleigh * (1 + 1e-9)
    assert c.Ncr == pytest.approx(rayleigh, rel=1e-4)


def test_many_close_springs_approach_engesser():
    # 99 springs of 200 N/mm at 500 mm on a 50 m bar: c = 0.4 N/mm², 2 sqrt(c EI) = 1 264 911 N
    springs = [(500.0 * i, 200.0) for i in range(1, 100)]
    c = critical_load(EI=EI, L=50_000, springs=springs)
    assert c.engesser == pytest.approx(2 * math.sqrt(0.4 * EI))
    assert c.Ncr == pytest.approx(c.engesser, rel=0.01)


def test_u_frame_stiffness_by_hand():
    # E = 200000, Iv = 2e7, hv = 1500, Iq = 4e8, bq = 5000:
    # 3 E Iv / hv³ = 3 * 2e5 * 2e7 / 3.375e9 = 3555.56 N/mm;
    # 2 E Iq / (hv² bq) = 2 * 2e5 * 4e8 / (2.25e6 * 5000) = 14 222.2 N/mm;
    # in series: Cd = 1 / (1/3555.56 + 1/14222.2) = 2844.44 N/mm
    Cd, vals = u_frame_stiffness(E=200_000, Iv=2e7, hv=1500, Iq=4e8, bq=5000)
    assert Cd == pytest.approx(2844.444, rel=1e-6)
    assert vals[-1].symbol == "Cd" and vals[-1].kind == "force_per_length"
    # a joint of 1e10 N mm/rad adds 1e10 / 1500² = 4444.4 N/mm in series -> 1734.2 N/mm
    Cd_j, _ = u_frame_stiffness(E=200_000, Iv=2e7, hv=1500, Iq=4e8, bq=5000, Cj=1e10)
    assert Cd_j == pytest.approx(1 / (1 / 2844.444 + 1 / 4444.444), rel=1e-6)


def test_many_stiff_springs_buckling_between_them():
    # 99 near-rigid springs at 500 mm: the bar buckles between them, Ncr -> pi² EI / 500²
    c = critical_load(EI=EI, L=50_000, springs=[(500.0 * i, 1e9) for i in range(1, 100)])
    assert c.Ncr == pytest.approx(math.pi**2 * EI / 500**2, rel=1e-3)


def test_bad_springs():
    with pytest.raises(InputError, match="not inside the span"):
        critical_load(EI=EI, L=L, springs=[(L, 10.0)])
    with pytest.raises(InputError, match="two springs at 5000"):
        critical_load(EI=EI, L=L, springs=[(5000, 10.0), (5000, 20.0)])
    with pytest.raises(InputError, match="not a"):
        critical_load(EI=EI, L=L, springs=[(5000,)])
    with pytest.raises(InputError, match="at most 100"):
        critical_load(EI=EI, L=L, springs=[(10.0 * i, 1.0) for i in range(1, 102)])


@settings(max_examples=30, deadline=None)
@given(st.lists(st.floats(0, 1e5), min_size=3, max_size=3), st.floats(0.0, 3.0))
def test_stiffer_springs_never_lower_Ncr(ks, extra):
    # a property of the eigenvalue problem (no source needed)
    pos = [2500.0, 5000.0, 7500.0]
    soft = critical_load(EI=EI, L=L, springs=list(zip(pos, ks, strict=True)))
    stiff = critical_load(
        EI=EI, L=L, springs=[(p, k * (1 + extra) + 1.0) for p, k in zip(pos, ks, strict=True)]
    )
    assert stiff.Ncr >= soft.Ncr * (1 - 1e-7)  # two-mesh extrapolation: round-off
    assert EULER * (1 - 1e-6) <= soft.Ncr <= 16 * EULER * (1 + 1e-5)
