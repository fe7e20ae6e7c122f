"""The effect of a train at many placements, every axle at once (``influence._values``), is
the axle-by-axle sum to the last bit (a property of our own code; the reference below is the
axle-by-axle loop it replaced)."""

from __future__ import annotations

import numpy as np
from hypothesis import given, settings
from hypothesis import strategies as st

from core.loads.influence import Train, _antiderivative, _values


def _reference(effect, L, x, t, firsts, heading, side, fav):
    tol = 1e-9 * L
    v = np.zeros_like(firsts)
    for p, o in zip(t.P, t.offsets, strict=True):
        a = firsts + heading * o
        a = np.where(np.abs(a - x) <= tol, x, a)
        on = (a >= -tol) & (a <= L + tol)
        if effect == "M":
            eta = np.where(a <= x, a * (L - x) / L, x * (L - a) / L)
        else:
            left = (a < x) | ((a == x) & (side < 0))
            eta = np.where(left, -a / L, (L - a) / L)
        v += p * np.where(on, eta, 0.0)
    if t.q_around > 0.0:
        lo, hi, whole = fav
        a = firsts - heading * t.gap_before
        b = firsts + heading * (t.length + t.gap_after)
        a, b = np.minimum(a, b), np.maximum(a, b)
        a, b = np.maximum(a, lo), np.minimum(b, hi)
        inside = np.where(
            b > a, _antiderivative(effect, L, x, b) - _antiderivative(effect, L, x, a), 0.0
        )
        v += t.q_around * (whole - inside)
    return v


trains = st.builds(
    lambda P, gaps, q: Train(
        tuple(P),
        tuple(float(c) for c in np.cumsum([0.0, *gaps[: len(P) - 1]])),
        q_around=q,
        gap_before=800.0 if q else 0.0,
        gap_after=800.0 if q else 0.0,
    ),
    st.lists(st.floats(1e3, 5e5), min_size=1, max_size=6),
    st.lists(st.floats(500.0, 10_000.0), min_size=5, max_size=5),
    st.sampled_from([0.0, 80.0]),
)


@settings(max_examples=300, deadline=None)
@given(
    trains,
    st.floats(2_000.0, 60_000.0),
    st.floats(0.0, 1.0),
    st.sampled_from(["M", "V+", "V-"]),
    st.sampled_from([1, -1]),
    st.sampled_from([1, -1]),
    st.lists(st.floats(-70_000.0, 130_000.0), min_size=1, max_size=40),
)
def test_rows_at_once_equal_the_axle_loop(t, L, frac, effect, heading, side, firsts):
    x = L * frac
    f = np.array(sorted([*firsts, x, 0.0, L, x - t.offsets[-1]]))
    fav = (0.0, L, 1234.5)
    got = _values(effect, L, x, t, f, heading, side, fav)
    want = _reference(effect, L, x, t, f, heading, side, fav)
    assert np.array_equal(got, want)
    assert np.array_equal(np.signbit(got), np.signbit(want))
