"""The effect of a train at many placements, every axle at once (``influence._values``), is
the axle-by-axle sum to the last bit, and the envelopes of many stations at once
(``envelope_many``, ``envelope_variable_many``) are those of each station alone (properties
of our own code; the references below are the loops they replaced)."""

from __future__ import annotations

import numpy as np
from hypothesis import given, settings
from hypothesis import strategies as st

from core.loads.influence import (
    Extreme,
    Placement,
    Train,
    _antiderivative,
    _integral,
    _Rows,
    _symmetric,
    _values,
    envelope_many,
    envelope_variable_many,
    favourable_region,
)


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
    rows = _Rows(
        np.array([[x]]), np.array([t.offsets]), np.array([[0.0]]), np.array([[L]]),
        np.array([[1234.5]]), t,
    )  # fmt: skip
    got = _values(effect, L, rows, f[None, :], heading, side)[0]
    want = _reference(effect, L, x, t, f, heading, side, fav)
    assert np.array_equal(got, want)
    assert np.array_equal(np.signbit(got), np.signbit(want))


def _one_value(effect, L, x, t, firsts, heading, side, fav):
    return _reference(effect, L, x, t, firsts, heading, side, fav)


def _envelope_alone(effect, L, x, t):
    """The envelope of one station as it was computed before the stations were batched."""
    sign = -1.0 if effect == "V-" else 1.0
    best = Extreme(0.0, None)
    marks = (0.0, x, L)
    lo, hi = favourable_region(effect, L, x)
    fav = (lo, hi, _integral(effect, L, x, lo, hi)) if t.q_around > 0.0 else (lo, hi, 0.0)
    sides = (1,) if effect == "M" else (1, -1)
    for heading in (1,) if _symmetric(t) else (1, -1):
        edges = (-t.gap_before, t.length + t.gap_after) if t.q_around > 0.0 else ()
        cands = np.unique([b - heading * o for b in marks for o in (*t.offsets, *edges)])
        pieces = cands
        if t.q_around > 0.0 and len(cands) > 1:
            a, b = cands[:-1], cands[1:]
            w = b - a
            xs = [a + f * w for f in (0.25, 0.5, 0.75)]
            y0, y1, y2 = (_one_value(effect, L, x, t, c, heading, 1, fav) for c in xs)
            curv = y0 - 2.0 * y1 + y2
            ok = (w > 1e-9) & (np.abs(curv) > 1e-12 * (np.abs(y1) + 1.0))
            c = xs[1] - 0.25 * w * (y2 - y0) / np.where(ok, 2.0 * curv, 1.0)
            ok &= (c > a) & (c < b)
            pieces = np.concatenate([cands, c[ok]])
        for side in sides:
            vals = sign * _one_value(effect, L, x, t, pieces, heading, side, fav)
            k = int(np.argmax(vals))
            v = float(vals[k])
            if v > sign * best.value + 1e-9 * (abs(best.value) + 1.0):
                best = Extreme(sign * v, Placement(float(pieces[k]), heading))
    return best


@settings(max_examples=150, deadline=None)
@given(
    trains,
    st.floats(2_000.0, 60_000.0),
    st.lists(st.floats(0.0, 1.0), min_size=1, max_size=12),
    st.sampled_from(["M", "V+", "V-"]),
)
def test_many_stations_at_once_equal_each_alone(t, L, fracs, effect):
    xs = [L * f for f in (*fracs, 0.0, 1.0, 0.5)]
    got = envelope_many(effect, L, xs, t)
    assert got == [_envelope_alone(effect, L, x, t) for x in xs]


@settings(max_examples=60, deadline=None)
@given(
    st.floats(5_000.0, 60_000.0),
    st.lists(st.floats(0.0, 1.0), min_size=1, max_size=8),
    st.sampled_from(["M", "V+", "V-"]),
)
def test_variable_spacing_at_once_equal_each_alone(L, fracs, effect):
    """The design truck's variable rear spacing: every candidate spacing of each station
    solved alone (the loop it replaced) gives the same envelope."""
    P, offs, low, high = (35.6e3, 142.3e3, 142.3e3), (0.0, 4267.2, 8534.4), 4267.2, 9144.0
    xs = [L * f for f in fracs]
    got = envelope_variable_many(effect, L, xs, P, offs, 2, low, high)
    sign = -1.0 if effect == "V-" else 1.0
    for x, g in zip(xs, got, strict=True):
        cands = {low, high}
        for b1 in (0.0, x, L):
            for b2 in (0.0, x, L):
                for f in offs[:2]:
                    s = (b2 - b1) + f - offs[1]
                    if low <= s <= high:
                        cands.add(s)
        best = Extreme(0.0, None)
        for s in sorted(cands):
            e = _envelope_alone(effect, L, x, Train(P, (0.0, offs[1], offs[1] + s)))
            if e.at is not None and sign * e.value > sign * best.value + 1e-9 * (
                abs(best.value) + 1
            ):
                best = Extreme(e.value, Placement(e.at.first, e.at.heading, s))
        assert g == best
