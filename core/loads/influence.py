"""Influence lines of a simply supported span and the exact envelope of a moving load.

A moving load is a set of point loads at fixed offsets from a reference point (the first
axle), optionally with a uniform load ``q_around`` that lies everywhere on the span where it
is unfavourable except within a gap around the point loads (EN 1991-2 Load Model 71, whose
80 kN/m stops 0.8 m short of the outer axles). Uniform loads that do not move with the train
(a design lane load) are :func:`favourable_area` times their intensity.

Exactness (facts of statics, common practice): the effect of point loads is piecewise linear
in the train's position, with breaks where an axle crosses a support or the station; the
uniform load beside a gap adds a piecewise quadratic. The envelope is therefore found exactly
among the breakpoints (both one-sided values at the station, where the shear jumps) and the
vertices of the quadratic pieces; no position grid is involved.

Units: mm and N (N/mm for uniform loads); moments N*mm.
"""

from __future__ import annotations

import itertools
from collections.abc import Sequence
from dataclasses import dataclass
from typing import Literal

import numpy as np

from core.errors import InputError

Effect = Literal["M", "V+", "V-"]
EFFECTS: tuple[Effect, ...] = ("M", "V+", "V-")


def ordinate(effect: Effect, L: float, x: float, a: float, side: int = 1) -> float:
    """Influence ordinate at load position ``a`` of the moment or shear at station ``x``.

    ``side`` says where a load exactly at the station counts for the shear: +1 just right of
    the station (V = (L - a)/L), -1 just left (V = -a/L). ``"V+"`` and ``"V-"`` share the shear
    influence line; they differ only in the sign kept by :func:`envelope`.
    """
    tol = 1e-9 * L
    if abs(a - x) <= tol:
        a = x  # a load placed on the station (floating-point sums land a hair off)
    elif abs(a) <= tol:
        a = 0.0
    elif abs(a - L) <= tol:
        a = L
    if a < 0.0 or a > L:
        return 0.0
    if effect == "M":
        return a * (L - x) / L if a <= x else x * (L - a) / L
    if a < x or (a == x and side < 0):
        return -a / L
    return (L - a) / L


def _integral(effect: Effect, L: float, x: float, lo: float, hi: float) -> float:
    """Integral of the ordinate over [lo, hi] ∩ [0, L] (exact: trapezoids between breaks)."""
    lo, hi = max(lo, 0.0), min(hi, L)
    if hi <= lo:
        return 0.0
    pts = [lo, *(b for b in (x,) if lo < b < hi), hi]
    total = 0.0
    for a, b in itertools.pairwise(pts):
        mid = 0.5 * (a + b)
        side = 1 if mid >= x else -1
        total += 0.5 * (b - a) * (ordinate(effect, L, x, a, side) + ordinate(effect, L, x, b, side))
    return total


def favourable_region(effect: Effect, L: float, x: float) -> tuple[float, float]:
    """The stretch of the span where a downward load raises the effect's envelope value:
    the whole span for the sagging moment, right of the station for V+, left for V-."""
    if effect == "M":
        return 0.0, L
    return (x, L) if effect == "V+" else (0.0, x)


def favourable_area(effect: Effect, L: float, x: float) -> float:
    """Signed area of the influence line over its favourable stretch (mm² for M, mm for V):
    a uniform load q there gives q times this (e.g. M = q x (L - x) / 2 at x)."""
    lo, hi = favourable_region(effect, L, x)
    return _integral(effect, L, x, lo, hi)


@dataclass(frozen=True)
class Placement:
    """Where the moving load stands for an envelope value.

    Attributes:
        first: position of the first point load (offset 0) from the left support, mm.
        heading: +1 when the offsets run towards the right support, -1 towards the left.
        spacing: the variable spacing used (mm), or None for a fixed train.
    """

    first: float
    heading: int
    spacing: float | None = None

    def words(self, unit: str = "mm", scale: float = 1.0) -> str:
        """e.g. ``first axle at 12.4 m, train heading left, variable spacing 4.27 m``."""
        go = "right" if self.heading > 0 else "left"
        s = f"first axle at {self.first / scale:.4g} {unit} from the left support, heading {go}"
        if self.spacing is not None:
            s += f", variable spacing {self.spacing / scale:.4g} {unit}"
        return s


@dataclass(frozen=True)
class Extreme:
    """One envelope value with the placement that gives it (``None``: no load on the span)."""

    value: float
    at: Placement | None


@dataclass(frozen=True)
class Train:
    """Point loads ``P`` (N) at ``offsets`` (mm, first 0, increasing), plus a uniform load
    ``q_around`` (N/mm) on the unfavourable stretch of the span outside
    [first offset - gap_before, last offset + gap_after].

    Raises:
        InputError: no loads, negative loads, offsets not increasing from 0.
    """

    P: tuple[float, ...]
    offsets: tuple[float, ...]
    q_around: float = 0.0
    gap_before: float = 0.0
    gap_after: float = 0.0

    def __post_init__(self) -> None:
        object.__setattr__(self, "P", tuple(float(p) for p in self.P))
        object.__setattr__(self, "offsets", tuple(float(o) for o in self.offsets))
        if not self.P or len(self.P) != len(self.offsets):
            raise InputError(
                f"a train needs one offset per load ({len(self.P)} loads, "
                f"{len(self.offsets)} offsets)"
            )
        if any(p < 0.0 for p in self.P) or self.q_around < 0.0:
            raise InputError("train loads must be 0 or more (downward)")
        if self.offsets[0] != 0.0 or any(b < a for a, b in itertools.pairwise(self.offsets)):
            raise InputError(f"train offsets {self.offsets} must start at 0 and not decrease")

    @property
    def length(self) -> float:
        return self.offsets[-1]


def _value(
    effect: Effect,
    L: float,
    x: float,
    t: Train,
    first: float,
    heading: int,
    side: int,
    fav: tuple[float, float, float] = (0.0, 0.0, 0.0),
) -> float:
    """The effect of ``t`` standing at ``first``; ``fav`` = (lo, hi, integral) of the
    favourable stretch (only used with a uniform load beside the gap)."""
    v = 0.0
    for p, o in zip(t.P, t.offsets, strict=True):
        v += p * ordinate(effect, L, x, first + heading * o, side)
    if t.q_around > 0.0:
        lo, hi, whole = fav
        a = first - heading * t.gap_before
        b = first + heading * (t.length + t.gap_after)
        if a > b:
            a, b = b, a
        v += t.q_around * (whole - _integral(effect, L, x, max(lo, a), min(hi, b)))
    return v


def _symmetric(t: Train) -> bool:
    """True when the train reads the same from either end (LM71): one heading suffices."""
    n = len(t.P)
    return t.gap_before == t.gap_after and all(
        t.P[i] == t.P[n - 1 - i] and abs(t.offsets[i] + t.offsets[n - 1 - i] - t.length) < 1e-9
        for i in range(n)
    )


def _antiderivative(effect: Effect, L: float, x, u: np.ndarray) -> np.ndarray:
    """F(u) = integral from 0 to u of the ordinate (u clipped to [0, L]; the shear's part
    right of the station, its favourable stretch for V+, taken just right of x). ``x`` is a
    number or an array that broadcasts against ``u`` (one station per row)."""
    u = np.clip(u, 0.0, L)
    if effect == "M":
        left = (L - x) / L * u * u / 2.0
        Fx = (L - x) / L * x * x / 2.0
        right = Fx + x / L * ((L * u - u * u / 2.0) - (L * x - x * x / 2.0))
        return np.where(u <= x, left, right)
    left = -u * u / (2.0 * L)
    Fx = -x * x / (2.0 * L)
    right = Fx + ((L * u - u * u / 2.0) - (L * x - x * x / 2.0)) / L
    return np.where(u <= x, left, right)


@dataclass(frozen=True)
class _Rows:
    """Many (station, train) pairs of one load set at once, one pair per row: stations
    ``x`` (n, 1), axle offsets (n, k), and the favourable stretch (lo, hi, integral),
    each (n, 1). Every row's train has the loads ``P`` and the uniform load of ``t``."""

    x: np.ndarray
    offsets: np.ndarray
    lo: np.ndarray
    hi: np.ndarray
    whole: np.ndarray
    t: Train


def _values(
    effect: Effect, L: float, r: _Rows, firsts: np.ndarray, heading: int, side: int
) -> np.ndarray:
    """The effect of each row's train standing at ``firsts`` (n, c), (n, c) values: the same
    elementwise operations for every row as for one station alone, so each value is the
    same to the last bit whatever else is in the batch."""
    tol = 1e-9 * L
    t = r.t
    v = np.zeros_like(firsts)
    # every axle at once (axis 1): the same elementwise operations as axle by axle, then
    # the axles added in their order, so the sums are the same to the last bit
    x = r.x[:, :, None]
    a = firsts[:, None, :] + heading * r.offsets[:, :, None]
    a = np.where(np.abs(a - x) <= tol, x, a)
    on = (a >= -tol) & (a <= L + tol)
    if effect == "M":
        eta = np.where(a <= x, a * (L - x) / L, x * (L - a) / L)
    else:
        left = (a < x) | ((a == x) & (side < 0))
        eta = np.where(left, -a / L, (L - a) / L)
    terms = np.asarray(t.P)[None, :, None] * np.where(on, eta, 0.0)
    for i in range(terms.shape[1]):
        v += terms[:, i, :]
    if t.q_around > 0.0:
        a = firsts - heading * t.gap_before
        b = firsts + heading * (r.offsets[:, -1:] + t.gap_after)
        a, b = np.minimum(a, b), np.maximum(a, b)
        a, b = np.maximum(a, r.lo), np.minimum(b, r.hi)
        inside = np.where(
            b > a, _antiderivative(effect, L, r.x, b) - _antiderivative(effect, L, r.x, a), 0.0
        )
        v += t.q_around * (r.whole - inside)
    return v


def _check_stations(L: float, xs: Sequence[float]) -> None:
    for x in xs:
        if not L > 0.0 or not 0.0 <= x <= L:
            raise InputError(f"station x = {x:g} mm is outside the span (0 to {L:g} mm)")


def _rows(effect: Effect, L: float, xs: Sequence[float], offs: np.ndarray, t: Train) -> _Rows:
    lo, hi, whole = [], [], []
    for x in xs:
        a, b = favourable_region(effect, L, x)
        lo.append(a)
        hi.append(b)
        whole.append(_integral(effect, L, x, a, b) if t.q_around > 0.0 else 0.0)
    col = lambda v: np.asarray(v, dtype=float).reshape(-1, 1)  # noqa: E731
    return _Rows(col(xs), offs, col(lo), col(hi), col(whole), t)


def _best(effect: Effect, L: float, r: _Rows, headings: tuple[int, ...]):
    """Per row: (value, first, heading, found) of the envelope (see :func:`envelope`)."""
    t = r.t
    n = r.x.shape[0]
    sign = -1.0 if effect == "V-" else 1.0
    best = np.zeros(n)
    first = np.zeros(n)
    head = np.zeros(n, dtype=int)
    found = np.zeros(n, dtype=bool)
    sides = (1,) if effect == "M" else (1, -1)  # the moment has no jump at the station
    marks = (np.zeros((n, 1)), r.x, np.full((n, 1), L))
    for heading in headings:
        shifts = [r.offsets]
        if t.q_around > 0.0:
            shifts.append(np.full((n, 1), -t.gap_before))
            shifts.append(r.offsets[:, -1:] + t.gap_after)
        shift = np.concatenate(shifts, axis=1)
        # every breakpoint of every row, sorted (a repeated one changes no extreme: equal
        # positions give equal values, and the first of equal values is kept)
        cands = np.sort(np.concatenate([b - heading * shift for b in marks], axis=1), axis=1)
        pieces = cands
        if t.q_around > 0.0 and cands.shape[1] > 1:
            # vertices of the quadratic pieces between consecutive breakpoints
            a, b = cands[:, :-1], cands[:, 1:]
            w = b - a
            xs = [a + f * w for f in (0.25, 0.5, 0.75)]
            y0, y1, y2 = (_values(effect, L, r, c, heading, 1) for c in xs)
            curv = y0 - 2.0 * y1 + y2
            ok = (w > 1e-9) & (np.abs(curv) > 1e-12 * (np.abs(y1) + 1.0))
            c = xs[1] - 0.25 * w * (y2 - y0) / np.where(ok, 2.0 * curv, 1.0)
            ok &= (c > a) & (c < b)
            # a vertex that does not count stands on the row's first breakpoint (a repeat)
            pieces = np.concatenate([cands, np.where(ok, c, cands[:, :1])], axis=1)
        for side in sides:
            vals = sign * _values(effect, L, r, pieces, heading, side)
            k = np.argmax(vals, axis=1)
            v = vals[np.arange(n), k]
            up = v > sign * best + 1e-9 * (np.abs(best) + 1.0)
            best = np.where(up, sign * v, best)
            first = np.where(up, pieces[np.arange(n), k], first)
            head = np.where(up, heading, head)
            found |= up
    return best, first, head, found


def envelope_many(effect: Effect, L: float, xs: Sequence[float], t: Train) -> list[Extreme]:
    """:func:`envelope` at every station of ``xs`` at once (numpy over the stations); each
    value the same to the last bit as alone.

    Raises:
        InputError: L not positive or a station outside [0, L].
    """
    _check_stations(L, xs)
    if not len(xs):
        return []
    offs = np.tile(np.asarray(t.offsets, dtype=float), (len(xs), 1))
    r = _rows(effect, L, xs, offs, t)
    best, first, head, found = _best(effect, L, r, (1,) if _symmetric(t) else (1, -1))
    return [
        Extreme(float(v), Placement(float(f), int(h)) if ok else None)
        for v, f, h, ok in zip(
            best.tolist(), first.tolist(), head.tolist(), found.tolist(), strict=True
        )
    ]


def envelope(effect: Effect, L: float, x: float, t: Train) -> Extreme:
    """The largest sagging moment (``"M"``), largest positive shear (``"V+"``) or most negative
    shear (``"V-"``) at ``x`` of a simple span ``L`` under train ``t`` moving in either
    direction, with the placement that gives it.

    Raises:
        InputError: L not positive or x outside [0, L].
    """
    return envelope_many(effect, L, [x], t)[0]


def _spacings(
    L: float, x: float, front: list[float], rear: list[float], low: float, high: float
) -> list[float]:
    """The candidate variable spacings at ``x`` (see :func:`envelope_variable`), ascending."""
    marks = (0.0, x, L)
    cands = {low, high}
    for b1, b2 in itertools.product(marks, repeat=2):
        for f, r in itertools.product(front, rear):
            s = (b2 - b1) + f - front[-1] - r
            if low <= s <= high:
                cands.add(s)
    return sorted(cands)


def envelope_variable_many(
    effect: Effect,
    L: float,
    xs: Sequence[float],
    P: Sequence[float],
    offsets: Sequence[float],
    variable: int,
    low: float,
    high: float,
) -> list[Extreme]:
    """:func:`envelope_variable` at every station of ``xs`` at once: every candidate
    spacing of every station is one row of one batch.

    Raises:
        InputError: an index or a spacing range that does not fit the loads, or a station
            outside the span.
    """
    if not 0 < variable < len(P) or not 0.0 < low <= high or len(offsets) != len(P):
        raise InputError(f"variable spacing #{variable} in [{low:g}, {high:g}] mm does not fit")
    _check_stations(L, xs)
    front = [float(o) for o in offsets[:variable]]
    rear = [float(o) - float(offsets[variable]) for o in offsets[variable:]]
    per = [_spacings(L, x, front, rear, low, high) for x in xs]
    row_x = [x for x, ss in zip(xs, per, strict=True) for _ in ss]
    row_s = [s for ss in per for s in ss]
    if not row_x:
        return []
    offs = np.asarray([(*front, *(front[-1] + s + r for r in rear)) for s in row_s], dtype=float)
    t = Train(tuple(P), tuple(offs[0]))
    sym = np.asarray([_symmetric(Train(tuple(P), tuple(o))) for o in offs])
    best = np.zeros(len(row_x))
    first = np.zeros(len(row_x))
    head = np.zeros(len(row_x), dtype=int)
    found = np.zeros(len(row_x), dtype=bool)
    for flag, headings in ((True, (1,)), (False, (1, -1))):
        idx = np.flatnonzero(sym == flag)
        if len(idx):
            r = _rows(effect, L, [row_x[i] for i in idx], offs[idx], t)
            b, f, h, ok = _best(effect, L, r, headings)
            best[idx], first[idx], head[idx], found[idx] = b, f, h, ok
    sign = -1.0 if effect == "V-" else 1.0
    out = []
    i = 0
    for ss in per:
        e = Extreme(0.0, None)
        for s in ss:
            v = float(best[i])
            if found[i] and sign * v > sign * e.value + 1e-9 * (abs(e.value) + 1):
                e = Extreme(v, Placement(float(first[i]), int(head[i]), s))
            i += 1
        out.append(e)
    return out


def envelope_variable(
    effect: Effect,
    L: float,
    x: float,
    P: Sequence[float],
    offsets: Sequence[float],
    variable: int,
    low: float,
    high: float,
) -> Extreme:
    """Envelope of point loads whose spacing before load ``variable`` (the loads behind it
    keep their spacings among themselves) may take any value in [low, high] mm: the design
    truck's variable rear axle spacing.

    Exact: the effect is piecewise linear in (position, spacing); its extremes lie at the
    bounds of the spacing or where a load of the front group stands on a breakpoint (support
    or station) while a load of the rear group stands on another (facts of piecewise-linear
    functions). Each candidate spacing is then solved exactly as :func:`envelope` does.

    Raises:
        InputError: an index or a spacing range that does not fit the loads.
    """
    return envelope_variable_many(effect, L, [x], P, offsets, variable, low, high)[0]
