"""The sagging moment alone (``moment``) is the moment of the whole envelope, to the last bit
(a property of our own code: fatigue asks for the moment only)."""

from __future__ import annotations

from hypothesis import given
from hypothesis import strategies as st

from core.loads.models import LM71, AxleTrain

KN, M = 1000.0, 1000.0


@given(st.floats(3_000.0, 80_000.0), st.floats(0.0, 1.0))
def test_lm71_moment_is_the_envelopes(L: float, frac: float) -> None:
    x = L * frac
    for m in (LM71(1.0, "careful"), LM71(1.21, "standard")):
        assert m.moment(L, x) == m.envelope(L, x).M.value


@given(st.floats(3_000.0, 80_000.0), st.floats(0.0, 1.0))
def test_axle_train_moment_is_the_envelopes(L: float, frac: float) -> None:
    t = AxleTrain("t", "other", (35 * KN, 145 * KN, 145 * KN), (0.0, 4.3 * M, 13.3 * M), 0.15)
    x = L * frac
    assert t.moment(L, x) == t.envelope(L, x).M.value
