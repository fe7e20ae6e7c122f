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


def _antiderivative(effect: Effect, L: float, x: float, u: np.ndarray) -> np.ndarray:
    """F(u) = integral from 0 to u of the ordinate (u clipped to [0, L]; the shear's part
    right of the station, its favourable stretch for V+, taken just right of x)."""
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


def _values(
    effect: Effect,
    L: float,
    x: float,
    t: Train,
    firsts: np.ndarray,
    heading: int,
    side: int,
    fav: tuple[float, float, float],
) -> np.ndarray:
    """:func:`_value` for many positions at once (numpy)."""
    tol = 1e-9 * L
    v = np.zeros_like(firsts)
    # every axle at once (one row each): the same elementwise operations as axle by axle,
    # then the rows added in axle order, so the sums are the same to the last bit
    a = firsts[None, :] + heading * np.asarray(t.offsets)[:, None]
    a = np.where(np.abs(a - x) <= tol, x, a)
    on = (a >= -tol) & (a <= L + tol)
    if effect == "M":
        eta = np.where(a <= x, a * (L - x) / L, x * (L - a) / L)
    else:
        left = (a < x) | ((a == x) & (side < 0))
        eta = np.where(left, -a / L, (L - a) / L)
    terms = np.asarray(t.P)[:, None] * np.where(on, eta, 0.0)
    for row in terms:
        v += row
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


def envelope(effect: Effect, L: float, x: float, t: Train) -> Extreme:
    """The largest sagging moment (``"M"``), largest positive shear (``"V+"``) or most negative
    shear (``"V-"``) at ``x`` of a simple span ``L`` under train ``t`` moving in either
    direction, with the placement that gives it.

    Raises:
        InputError: L not positive or x outside [0, L].
    """
    if not L > 0.0 or not 0.0 <= x <= L:
        raise InputError(f"station x = {x:g} mm is outside the span (0 to {L:g} mm)")
    sign = -1.0 if effect == "V-" else 1.0
    best = Extreme(0.0, None)
    marks = (0.0, x, L)
    lo, hi = favourable_region(effect, L, x)
    fav = (lo, hi, _integral(effect, L, x, lo, hi)) if t.q_around > 0.0 else (lo, hi, 0.0)
    sides = (1,) if effect == "M" else (1, -1)  # the moment has no jump at the station
    for heading in (1,) if _symmetric(t) else (1, -1):
        edges = (-t.gap_before, t.length + t.gap_after) if t.q_around > 0.0 else ()
        cands = np.unique([b - heading * o for b in marks for o in (*t.offsets, *edges)])
        pieces = cands
        if t.q_around > 0.0 and len(cands) > 1:
            # vertices of the quadratic pieces between consecutive breakpoints
            a, b = cands[:-1], cands[1:]
            w = b - a
            xs = [a + f * w for f in (0.25, 0.5, 0.75)]
            y0, y1, y2 = (_values(effect, L, x, t, c, heading, 1, fav) for c in xs)
            curv = y0 - 2.0 * y1 + y2
            ok = (w > 1e-9) & (np.abs(curv) > 1e-12 * (np.abs(y1) + 1.0))
            c = xs[1] - 0.25 * w * (y2 - y0) / np.where(ok, 2.0 * curv, 1.0)
            ok &= (c > a) & (c < b)
            pieces = np.concatenate([cands, c[ok]])
        for side in sides:
            vals = sign * _values(effect, L, x, t, pieces, heading, side, fav)
            k = int(np.argmax(vals))
            v = float(vals[k])
            if v > sign * best.value + 1e-9 * (abs(best.value) + 1.0):
                best = Extreme(sign * v, Placement(float(pieces[k]), heading))
    return best


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
    functions). Each candidate spacing is then solved exactly by :func:`envelope`.

    Raises:
        InputError: an index or a spacing range that does not fit the loads.
    """
    if not 0 < variable < len(P) or not 0.0 < low <= high or len(offsets) != len(P):
        raise InputError(f"variable spacing #{variable} in [{low:g}, {high:g}] mm does not fit")
    front = [float(o) for o in offsets[:variable]]
    rear = [float(o) - float(offsets[variable]) for o in offsets[variable:]]
    marks = (0.0, x, L)
    cands = {low, high}
    for b1, b2 in itertools.product(marks, repeat=2):
        for f, r in itertools.product(front, rear):
            s = (b2 - b1) + f - front[-1] - r
            if low <= s <= high:
                cands.add(s)
    sign = -1.0 if effect == "V-" else 1.0
    best = Extreme(0.0, None)
    for s in sorted(cands):
        offs = (*front, *(front[-1] + s + r for r in rear))
        e = envelope(effect, L, x, Train(tuple(P), offs))
        if e.at is not None and sign * e.value > sign * best.value + 1e-9 * (abs(best.value) + 1):
            best = Extreme(e.value, Placement(e.at.first, e.at.heading, s))
    return best
