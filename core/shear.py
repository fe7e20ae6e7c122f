"""Shear through the depth: cut width t(y), first moment Q(y), tau(y) = V Q / (I t).

Between consecutive vertex heights the horizontal cut width of a polygonal section is linear
in y (no edge starts or ends inside the interval), so Q(y), the area above y and the plastic
neutral axis follow analytically for any number of heights at once. At a height where the
width changes, Q and I are the same on both sides and tau jumps by the inverse ratio of the
widths; such heights are reported with the values just below and just above.

VQ/(I t) gives the average shear stress across the cut (the elementary theory of shear in
beams, e.g. Gere & Goodno, Mechanics of Materials, section 5.8-5.10); it does not give local
peaks at re-entrant corners.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Literal

import numpy as np

Side = Literal["above", "below"]

#: widths closer than this (mm) are treated as equal when listing jumps
WIDTH_TOL = 1e-9


@dataclass(frozen=True)
class WidthProfile:
    """Piecewise linear cut width of a section, in coordinates u = y - yc (mm).

    Attributes:
        yc: the reference height (the elastic neutral axis), mm.
        U: breakpoints u_0 < ... < u_K (mm).
        a, b: per interval k, t(u) = a_k + b_k u on [u_k, u_{k+1}] (mm, -).
        A_above: area above each breakpoint (mm^2), length K + 1.
        M_above: first moment about u = 0 of the area above each breakpoint (mm^3).
    """

    yc: float
    U: np.ndarray
    a: np.ndarray
    b: np.ndarray
    A_above: np.ndarray
    M_above: np.ndarray

    @classmethod
    def from_edges(cls, e, yc: float) -> WidthProfile:
        """Build from :class:`core.properties.Edges` about the height ``yc`` (mm)."""
        y_all = np.concatenate([e.y0, e.y1])
        Y = np.unique(y_all)
        U = Y - yc
        steep = e.y0 != e.y1
        y0, y1, x0, x1 = e.y0[steep], e.y1[steep], e.x0[steep], e.x1[steep]
        s = np.sign(y1 - y0)
        u0 = y0 - yc
        m = (x1 - x0) / (y1 - y0)
        ca = s * (x0 - m * u0)
        cb = s * m
        i_lo = np.searchsorted(Y, np.minimum(y0, y1))
        i_hi = np.searchsorted(Y, np.maximum(y0, y1))
        K = len(Y) - 1
        da = np.bincount(i_lo, ca, K + 1) - np.bincount(i_hi, ca, K + 1)
        db = np.bincount(i_lo, cb, K + 1) - np.bincount(i_hi, cb, K + 1)
        a = np.cumsum(da)[:K]
        b = np.cumsum(db)[:K]
        ul, uh = U[:-1], U[1:]
        area = a * (uh - ul) + 0.5 * b * (uh * uh - ul * ul)
        mom = 0.5 * a * (uh * uh - ul * ul) + b * (uh**3 - ul**3) / 3.0
        A_above = np.concatenate([np.cumsum(area[::-1])[::-1], [0.0]])
        M_above = np.concatenate([np.cumsum(mom[::-1])[::-1], [0.0]])
        return cls(yc, U, a, b, A_above, M_above)

    @classmethod
    def from_rects(
        cls, rects: np.ndarray, yc: float, sign: np.ndarray | None = None
    ) -> WidthProfile:
        """Build from axis-aligned rectangles (n, 4) ``xmin, ymin, xmax, ymax`` (mm) about the
        height ``yc`` (mm); ``sign`` (n,) weighs each rectangle (-1 for a hole cut).

        The same profile as :meth:`from_edges` on the rectangles' edges (same breakpoints,
        widths equal to round-off): a rectangle's vertical edges add its width from its
        bottom to its top, and its horizontal edges add nothing, so b = 0 everywhere.
        """
        t = rects[:, 2] - rects[:, 0]
        return cls.from_columns(rects[:, 1], rects[:, 3], t if sign is None else t * sign, yc)

    @classmethod
    def from_columns(cls, y0: np.ndarray, y1: np.ndarray, t: np.ndarray, yc: float) -> WidthProfile:
        """:meth:`from_rects` given each rectangle's bottom ``y0``, top ``y1`` and (signed)
        width ``t`` (mm), about the height ``yc`` (mm)."""
        ys = np.concatenate([y0, y1])
        s = np.sort(ys)
        first = np.empty(len(s), dtype=bool)
        first[:1] = True
        np.not_equal(s[1:], s[:-1], out=first[1:])
        Y = s[first]  # the distinct heights, as np.unique gives them
        K = len(Y) - 1
        # each rectangle adds its width from the break of its bottom and removes it at its top
        da = np.bincount(Y.searchsorted(ys), np.concatenate([t, -t]), K + 1)
        a = np.add.accumulate(da[:K])
        U = Y - yc
        # area and first moment of each interval, then both summed from the top down;
        # (0.5 u_h^2 - 0.5 u_l^2) a equals 0.5 a (u_h^2 - u_l^2) exactly: halving is exact
        half_sq = 0.5 * U * U
        per = np.empty((2, K + 1))
        per[:, K] = 0.0
        np.multiply(a, U[1:] - U[:-1], out=per[0, :K])
        np.multiply(a, half_sq[1:] - half_sq[:-1], out=per[1, :K])
        above = np.add.accumulate(per[:, ::-1], axis=1)[:, ::-1]
        return cls(yc, U, a, np.zeros(K), above[0], above[1])

    @property
    def y_breaks(self) -> np.ndarray:
        """Heights (mm) where the width may change: every vertex height."""
        return self.U + self.yc

    def _snap(self, u: np.ndarray) -> np.ndarray:
        """Heights within 1e-7 mm of a break height are taken as that height, so that a
        height given as, say, 0.75 in converted to mm finds the break built from it."""
        j = np.clip(np.searchsorted(self.U, u), 1, len(self.U) - 1)
        lo, hi = self.U[j - 1], self.U[j]
        near = np.where(np.abs(u - lo) <= np.abs(hi - u), lo, hi)
        return np.where(np.abs(u - near) <= 1e-7, near, u)

    def _interval(self, u: np.ndarray, side: Side) -> np.ndarray:
        return np.searchsorted(self.U, u, side="right" if side == "above" else "left") - 1

    def width(self, y, side: Side = "above") -> np.ndarray:
        """Cut width t (mm) at heights ``y`` (mm): the limit from ``side``; 0 outside."""
        u = self._snap(np.atleast_1d(np.asarray(y, dtype=float)) - self.yc)
        k = self._interval(u, side)
        ok = (k >= 0) & (k < len(self.a))
        kk = np.clip(k, 0, len(self.a) - 1)
        return np.where(ok, self.a[kk] + self.b[kk] * u, 0.0)

    def above(self, y) -> tuple[np.ndarray, np.ndarray]:
        """Area above y (mm^2) and its first moment about the neutral axis (mm^3) = Q(y)."""
        u = np.atleast_1d(np.asarray(y, dtype=float)) - self.yc
        K = len(self.a)
        k = np.clip(np.searchsorted(self.U, u, side="right") - 1, 0, K - 1)
        uc = np.clip(u, self.U[0], self.U[-1])
        uh = self.U[k + 1]
        a, b = self.a[k], self.b[k]
        area = self.A_above[k + 1] + a * (uh - uc) + 0.5 * b * (uh * uh - uc * uc)
        mom = self.M_above[k + 1] + 0.5 * a * (uh * uh - uc * uc) + b * (uh**3 - uc**3) / 3.0
        return area, mom

    def plastic(self, A: float) -> tuple[float, float]:
        """Plastic neutral axis height (mm) and plastic modulus Zx (mm^3) for total area A.

        The plastic neutral axis halves the area; Zx = integral of |y - y_pna| dA.
        """
        half = 0.5 * A
        K = len(self.a)
        k = int(np.searchsorted(-self.A_above, -half, side="left")) - 1
        k = min(max(k, 0), K - 1)
        A_top = float(self.A_above[k + 1])
        M_top = float(self.M_above[k + 1])
        rem = half - A_top
        uh, ul = float(self.U[k + 1]), float(self.U[k])
        a, b = float(self.a[k]), float(self.b[k])
        t1 = a + b * uh
        disc = max(t1 * t1 - 2.0 * b * rem, 0.0)
        den = t1 + disc**0.5
        w = 2.0 * rem / den if den > 0.0 else 0.0
        u_p = min(max(uh - w, ul), uh)
        area_up = A_top + a * (uh - u_p) + 0.5 * b * (uh * uh - u_p * u_p)
        mom_up = M_top + 0.5 * a * (uh * uh - u_p * u_p) + b * (uh**3 - u_p**3) / 3.0
        m_total = float(self.M_above[0])
        Z = (mom_up - u_p * area_up) + (u_p * (A - area_up) - (m_total - mom_up))
        return u_p + self.yc, Z


@dataclass(frozen=True)
class Jump:
    """A height where the cut width changes, with the values on each side (mm, MPa)."""

    y: float
    t_below: float
    t_above: float
    Q: float
    tau_below: float
    tau_above: float


@dataclass(frozen=True)
class ShearProfile:
    """tau = V Q(y) / (I t(y)) of one section.

    Attributes:
        width: the section's :class:`WidthProfile` about its neutral axis.
        I: moment of inertia about the horizontal centroidal axis, mm^4.
    """

    width: WidthProfile
    I: float

    def Q(self, y) -> np.ndarray:
        """First moment (mm^3) about the neutral axis of the area above ``y`` (mm)."""
        return self.width.above(y)[1]

    def t(self, y, side: Side = "above") -> np.ndarray:
        """Cut width (mm) at ``y`` (mm), the limit from ``side``."""
        return self.width.width(y, side)

    def tau(self, y, V: float, side: Side = "above") -> np.ndarray:
        """Average shear stress (MPa) across the cut at ``y`` (mm) for shear force V (N).

        Where the cut width is zero (outside the section) tau is reported as 0.
        """
        Q = self.Q(y)
        t = self.t(y, side)
        with np.errstate(divide="ignore", invalid="ignore"):
            out = np.where(t > WIDTH_TOL, V * Q / (self.I * np.where(t > 0, t, 1.0)), 0.0)
        return out

    def jumps(self, V: float) -> list[Jump]:
        """Every interior height where the cut width changes, with tau on both sides."""
        y = self.width.y_breaks[1:-1]
        tb, ta = self.t(y, "below"), self.t(y, "above")
        Q = self.Q(y)
        sel = np.abs(tb - ta) > WIDTH_TOL
        out = []
        for yi, b_, a_, q in zip(y[sel], tb[sel], ta[sel], Q[sel], strict=True):
            out.append(
                Jump(
                    float(yi),
                    float(b_),
                    float(a_),
                    float(q),
                    float(V * q / (self.I * b_)) if b_ > WIDTH_TOL else 0.0,
                    float(V * q / (self.I * a_)) if a_ > WIDTH_TOL else 0.0,
                )
            )
        return out

    def curve(self, V: float, n: int = 200) -> tuple[np.ndarray, np.ndarray]:
        """Heights and tau for plotting: ``n`` even heights plus both sides of every break.

        Returns arrays (y in mm, tau in MPa), sorted by height, with two points at each
        height where the width changes so that the jump is drawn.
        """
        Yb = self.width.y_breaks
        ys = np.linspace(Yb[0], Yb[-1], n)
        inner = ys[(ys > Yb[0]) & (ys < Yb[-1]) & ~np.isin(ys, Yb)]
        y = np.concatenate([Yb, Yb, inner])
        side_below = np.concatenate(
            [np.ones(len(Yb), bool), np.zeros(len(Yb), bool), np.zeros(len(inner), bool)]
        )
        order = np.lexsort((~side_below, y))
        y, side_below = y[order], side_below[order]
        tau = np.where(side_below, self.tau(y, V, "below"), self.tau(y, V, "above"))
        return y, tau

    def tau_max(self, V: float) -> tuple[float, float]:
        """Largest |tau| (MPa) and the height (mm) where it occurs.

        Candidates: every break height from both sides and the neutral axis; where the width
        varies linearly inside an interval, 32 points inside it as well.
        """
        w = self.width
        cands = [w.y_breaks, np.array([w.yc])]
        sloped = np.nonzero(np.abs(w.b) > 1e-12)[0]
        for k in sloped:
            cands.append(np.linspace(w.U[k], w.U[k + 1], 34)[1:-1] + w.yc)
        y = np.concatenate(cands)
        ta = np.abs(self.tau(y, V, "above"))
        tb = np.abs(self.tau(y, V, "below"))
        i_a, i_b = int(np.argmax(ta)), int(np.argmax(tb))
        if ta[i_a] >= tb[i_b]:
            return float(ta[i_a]), float(y[i_a])
        return float(tb[i_b]), float(y[i_b])


def shear_flow(V: float, Q_out: float, I: float) -> float:
    """Shear flow q = V Q / I (N/mm) across an interface beyond which lies first moment Q_out.

    Args:
        V: shear force, N. Q_out: first moment of the parts beyond the interface about the
        neutral axis, mm^3. I: moment of inertia, mm^4.
    """
    return V * Q_out / I
