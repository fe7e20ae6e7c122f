"""Web local yielding and web crippling at a bearing: hand calculations from the clauses.

Sources: AASHTO LRFD 9th ed. (2020) Appendix D6.5.2 (D6.5.2-2, -3) and D6.5.3 (D6.5.3-2,
-3, -4), phi_b = 1.00 and phi_w = 0.80 (6.5.4.2); AISC 360-22 J10.2 (J10-2, J10-3, phi = 1.00)
and J10.3 (J10-4, J10-5a, J10-5b, phi = 0.75, Qf = 1); all from memory; hand calculation.
Fyw = 250 MPa, E = 200 000 MPa, tw = 10, tf = 20, d = 1600 mm.
"""

import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.checks.web_bearing import web_crippling, web_local_yielding
from core.errors import InputError

Y = {"Fyw": 250, "k": 40, "d": 1600}
C = {"Fyw": 250, "E": 200_000, "tf": 20, "d": 1600}


@pytest.mark.parametrize("family", ["aashto", "aisc"])
def test_yielding_at_the_end_and_interior(family):
    # end (x <= d): Rn = (2.5 * 40 + 200) * 250 * 10 = 750 000 N (D6.5.2-3 / J10-3)
    end = web_local_yielding(tw=10, N=200, x=0, family=family, **Y)
    assert end.Rn == pytest.approx(750_000.0)
    assert web_local_yielding(tw=10, N=200, x=1600, family=family, **Y).Rn == pytest.approx(
        750_000.0
    )
    # interior (x > d): Rn = (5 * 40 + 200) * 2500 = 1 000 000 N (D6.5.2-2 / J10-2)
    inner = web_local_yielding(tw=10, N=200, x=5000, family=family, **Y)
    assert inner.Rn == pytest.approx(1_000_000.0)
    assert end.phi == 1.0 and inner.phi == 1.0


def test_yielding_cites_only_its_family():
    a = web_local_yielding(tw=10, N=200, family="aashto", **Y)
    b = web_local_yielding(tw=10, N=200, family="aisc", **Y)
    assert "D6.5.2-3" in a.clause and "AASHTO" in a.standard
    assert "J10-3" in b.clause and "AISC" in b.standard
    assert all("AISC" not in v.source for v in a.values)
    assert all("AASHTO" not in v.source for v in b.values)


def test_crippling_three_branches():
    # (tw/tf)^1.5 = 0.5^1.5 = 0.353553; sqrt(E Fyw tf / tw) = sqrt(1e8) = 10 000 MPa
    # interior, N/d = 0.125: 0.80 * 100 [1 + 3 * 0.125 * 0.353553] 10 000 = 906 066 N
    r = web_crippling(tw=10, N=200, x=800, **C)
    assert r.Rn == pytest.approx(906_066.0, rel=1e-6)
    assert "D6.5.3-2" in r.clause
    # end, N/d = 0.125 <= 0.2: 0.40 * 100 * 1.132583 * 10 000 = 453 033 N (D6.5.3-3)
    r = web_crippling(tw=10, N=200, x=0, **C)
    assert r.Rn == pytest.approx(453_033.0, rel=1e-6)
    assert "D6.5.3-3" in r.clause
    # end, N/d = 0.3 > 0.2: 0.40 * 100 [1 + (1.2 - 0.2) 0.353553] 10 000 = 541 421 N (D6.5.3-4)
    r = web_crippling(tw=10, N=480, x=0, **C)
    assert r.Rn == pytest.approx(541_421.4, rel=1e-6)
    assert "D6.5.3-4" in r.clause
    assert r.phi == 0.80


def test_crippling_branches_meet_at_N_over_d_0_2():
    # 3 (N/d) = 4 (N/d) - 0.2 = 0.6 at N/d = 0.2: both end forms agree
    below = web_crippling(tw=10, N=320 * (1 - 1e-12), **C).Rn
    above = web_crippling(tw=10, N=320 * (1 + 1e-12), **C).Rn
    assert below == pytest.approx(above, rel=1e-9)


def test_aisc_crippling_phi_and_equations():
    r = web_crippling(tw=10, N=480, x=0, family="aisc", **C)
    assert r.Rn == pytest.approx(541_421.4, rel=1e-6) and r.phi == 0.75
    assert "J10-5b" in r.clause
    assert any("Qf = 1.0" in n for n in r.notes)


def test_bad_input():
    with pytest.raises(InputError, match="family = 'en1993'"):
        web_crippling(tw=10, N=200, family="en1993", **C)
    with pytest.raises(InputError, match="tw = 0"):
        web_local_yielding(tw=0, N=200, **Y)
    with pytest.raises(InputError, match="x = -5"):
        web_local_yielding(tw=10, N=200, x=-5, **Y)


@given(
    st.floats(1, 30),
    st.floats(1, 30),
    st.floats(0, 2000),
    st.floats(0, 3000),
    st.sampled_from(["aashto", "aisc"]),
)
def test_more_web_loss_never_raises_yielding_or_crippling(t1, t2, N, x, fam):
    # a property the checks must have (no source needed): a thinner web never resists more
    lo, hi = sorted((t1, t2))
    assert web_local_yielding(tw=lo, N=N, x=x, family=fam, **Y).Rn <= web_local_yielding(
        tw=hi, N=N, x=x, family=fam, **Y
    ).Rn * (1 + 1e-12)
    assert web_crippling(tw=lo, N=N, x=x, family=fam, **C).Rn <= web_crippling(
        tw=hi, N=N, x=x, family=fam, **C
    ).Rn * (1 + 1e-12)
