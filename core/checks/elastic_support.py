"""A compression flange held by U-frames: a column on discrete elastic lateral supports.

The compression flange of a through (half-through) girder is braced laterally only by the
U-frames that the floor beams form with the girders' verticals (the stiffeners at the floor
beams). It buckles as a column (the flange with one third of the web in compression) on
elastic springs. This module gives:

- :func:`u_frame_stiffness`: the spring stiffness Cd (N/mm) of one U-frame: a unit lateral
  force at the top of each vertical deflects it by
  delta = hv³ / (3 E Iv) + hv² bq / (2 E Iq) [+ hv² / Cj],
  the cantilevered vertical plus the rotation of the cross beam bent in single curvature
  by equal end moments (both chords buckling towards or away from each other, the softer
  case), plus a flexible joint if its rotational stiffness Cj is given; the three act as
  springs in series, each reported as its own stiffness. This is frame
  mechanics (common practice); EN 1993-2:2006 Annex D.2.4 gives the same expression (from
  memory).
- :func:`critical_load`: the elastic critical force Ncr of the flange column, pinned (held
  laterally) at the span ends, on springs at the U-frames, by the finite-element eigenvalue
  problem (K + Ks - N Kg) v = 0 with cubic Hermite beam elements (consistent geometric
  stiffness) on two meshes, extrapolated (the error falls as h⁴). The effective length is Le = pi sqrt(EI / Ncr).
  Checks against closed forms (Timoshenko and Gere, Theory of Elastic Stability, 2nd ed.,
  Arts. 2.1, 2.9-2.10; from memory): Euler's pi² EI/L² without springs; a mid-length
  spring of 16 pi² EI / L³ or more forces the second mode 4 pi² EI / L²; many close
  springs approach Engesser's 2 sqrt(c EI) for the continuous medium c = Cd / spacing.

Units: N, mm.
"""

from __future__ import annotations

import itertools
import math
from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np

from core.checks._inputs import Number, internal, length, modulus
from core.checks.results import ENGINEER, CheckValue
from core.checks.sources import TIMOSHENKO_GERE
from core.errors import InputError

#: most U-frames one chord may have (a longer list is an input slip)
MAX_SPRINGS = 100
#: elements of the finer finite-element mesh, about
MAX_ELEMENTS = 200
MECHANICS = (
    "frame mechanics, cantilever verticals on a cross beam in single curvature (common practice)"
)


def u_frame_stiffness(
    *,
    E: Number,
    Iv: Number,
    hv: Number,
    Iq: Number,
    bq: Number,
    Cj: Number | None = None,
    where: str = "",
) -> tuple[float, tuple[CheckValue, ...]]:
    """Lateral spring stiffness Cd of one U-frame at the compression flange, N/mm.

    Args:
        E: modulus, MPa. Iv: the vertical's moment of inertia for bending out of the web
            plane (stiffener with its web strip), mm⁴. hv: from the compression flange's
            centroid to the cross beam's axis, mm. Iq: cross beam (floor beam) moment of
            inertia, mm⁴. bq: spacing of the girders (the cross beam's span), mm.
        Cj: rotational stiffness of the vertical-to-cross-beam joint, N mm/rad (``None``:
            rigid joint).
        where: place for messages.

    Returns:
        ``(Cd, working)``.

    Raises:
        InputError: values out of range.
    """
    E = modulus(E, where=where)
    Iv = internal(Iv, "inertia", "Iv", where=where, low=0.0, high=1e15)
    hv = length(hv, "hv", where=where)
    Iq = internal(Iq, "inertia", "Iq", where=where, low=0.0, high=1e15)
    bq = length(bq, "bq", where=where)
    d_v = hv**3 / (3.0 * E * Iv)
    d_q = hv**2 * bq / (2.0 * E * Iq)
    d_j = 0.0
    if Cj is not None:
        d_j = hv**2 / internal(Cj, "moment", "Cj", where=where, low=0.0, high=1e18)
    Cd = 1.0 / (d_v + d_q + d_j)
    vals = [
        CheckValue(
            "Iv",
            Iv,
            "inertia",
            "vertical (stiffener and web strip), out of the web plane",
            "section engine",
        ),
        CheckValue("hv", hv, "length", "compression flange centroid to cross beam axis", ENGINEER),
        CheckValue("Iq", Iq, "inertia", "cross beam moment of inertia", ENGINEER),
        CheckValue("bq", bq, "length", "girder spacing (cross beam span)", ENGINEER),
        CheckValue(
            "3EIv/hv³", 1.0 / d_v, "force_per_length", "stiffness of the vertical alone", MECHANICS
        ),
        CheckValue(
            "2EIq/(hv² bq)",
            1.0 / d_q,
            "force_per_length",
            "stiffness from the cross beam alone",
            MECHANICS,
        ),
    ]
    if Cj is not None:
        vals.append(
            CheckValue(
                "Cj/hv²", 1.0 / d_j, "force_per_length", "stiffness of the joint alone", MECHANICS
            )
        )
    vals.append(
        CheckValue("Cd", Cd, "force_per_length", "spring stiffness of one U-frame", MECHANICS)
    )
    return Cd, tuple(vals)


@dataclass(frozen=True)
class SpringColumn:
    """Elastic critical force of a column on springs (N, mm).

    Attributes:
        Ncr: the lowest critical force. Le: effective length pi sqrt(EI/Ncr).
        euler: pi² EI / L² without springs. engesser: 2 sqrt(c EI) for the springs smeared
            at their mean spacing (``None`` without springs). n_elements: elements used.
    """

    Ncr: float
    Le: float
    euler: float
    engesser: float | None
    n_elements: int

    def values(self, source: str) -> tuple[CheckValue, ...]:
        """The working as check values, ``source`` naming the clause that uses it."""
        out = [
            CheckValue(
                "N_E",
                self.euler,
                "force",
                "Euler force over the span, no springs",
                TIMOSHENKO_GERE.ref("Art. 2.1"),
            ),
            CheckValue(
                "Ncr",
                self.Ncr,
                "force",
                "critical force on the elastic supports (finite elements)",
                source,
            ),
            CheckValue("Le", self.Le, "length", "effective length pi sqrt(EI/Ncr)", source),
        ]
        if self.engesser is not None:
            out.insert(
                1,
                CheckValue(
                    "2 sqrt(c EI)",
                    self.engesser,
                    "force",
                    "continuous-medium estimate",
                    TIMOSHENKO_GERE.ref("Art. 2.10"),
                ),
            )
        return tuple(out)


def _element(l: float, EI: float) -> tuple[np.ndarray, np.ndarray]:
    k = (
        EI
        / l**3
        * np.array(
            [
                [12, 6 * l, -12, 6 * l],
                [6 * l, 4 * l * l, -6 * l, 2 * l * l],
                [-12, -6 * l, 12, -6 * l],
                [6 * l, 2 * l * l, -6 * l, 4 * l * l],
            ]
        )
    )
    g = (
        1.0
        / (30.0 * l)
        * np.array(
            [
                [36, 3 * l, -36, 3 * l],
                [3 * l, 4 * l * l, -3 * l, -l * l],
                [-36, -3 * l, 36, -3 * l],
                [3 * l, -l * l, -3 * l, 4 * l * l],
            ]
        )
    )
    return k, g


def _bands(stations: list[float], pts: dict[float, float], EI: float, per_bay: int):
    """Band storage (offsets 0..3) of K + Ks and Kg on a mesh of ``per_bay`` elements a bay,
    with the end displacements removed; and the longest element."""
    nodes = [0.0]
    for a, b in itertools.pairwise(stations):
        nodes += [a + (b - a) * (j + 1) / per_bay for j in range(per_bay)]
    x = np.array(nodes)
    ne = len(x) - 1
    ndof = 2 * (ne + 1)
    K = np.zeros((4, ndof))  # K[d, i] = K(i, i + d)
    G = np.zeros((4, ndof))
    for e in range(ne):
        k, g = _element(x[e + 1] - x[e], EI)
        for r in range(4):
            for c in range(r, 4):
                K[c - r, 2 * e + r] += k[r, c]
                G[c - r, 2 * e + r] += g[r, c]
    for xs, c in pts.items():
        K[0, 2 * int(np.argmin(np.abs(x - xs)))] += c
    keep = np.ones(ndof, dtype=bool)
    keep[[0, 2 * ne]] = False  # v = 0 at both ends: drop those rows and columns
    idx = np.flatnonzero(keep)
    pos = -np.ones(ndof, dtype=int)
    pos[idx] = np.arange(len(idx))
    Kr = np.zeros((4, len(idx)))
    Gr = np.zeros((4, len(idx)))
    for d in range(4):
        for i in range(ndof - d):
            a, b = pos[i], pos[i + d]
            if a >= 0 and b >= 0 and b - a < 4:
                Kr[b - a, a] += K[d, i]
                Gr[b - a, a] += G[d, i]
    return Kr, Gr


def _positive_definite(band: list[list[float]], n: int) -> bool:
    """Whether the symmetric band matrix (``band[d][i]`` = A(i, i + d), d <= 3) is positive
    definite: a banded Cholesky factorisation runs through (thread-free, O(n))."""
    w = 3
    L = [[0.0] * (w + 1) for _ in range(n)]  # L[i][k]: entry (i, i - k)
    for i in range(n):
        for j in range(max(0, i - w), i + 1):
            s = band[i - j][j]
            for k in range(max(0, i - w), j):
                s -= L[i][i - k] * L[j][j - k]
            if i == j:
                if not s > 0.0:
                    return False
                L[i][0] = math.sqrt(s)
            else:
                L[i][i - j] = s / L[j][0]
    return True


def _lowest(stations: list[float], pts: dict[float, float], EI: float, per_bay: int) -> float:
    """Lowest N of (K + Ks - N Kg) v = 0: bisection on the positive definiteness of
    K + Ks - N Kg (Sylvester's law of inertia), so repeated roots are found as well."""
    K, G = _bands(stations, pts, EI, per_bay)
    n = K.shape[1]
    Kl, Gl = K.tolist(), G.tolist()

    def pd(N: float) -> bool:
        return _positive_definite(
            [[k - N * g for k, g in zip(Kl[d], Gl[d], strict=True)] for d in range(4)], n
        )

    longest = max(b - a for a, b in itertools.pairwise(stations))
    lo = 0.999 * math.pi**2 * EI / (stations[-1] - stations[0]) ** 2
    hi = 2.0 * math.pi**2 * EI / longest**2
    while pd(hi):  # cannot happen for a fine enough mesh; kept as a guard
        hi *= 2.0
    while hi - lo > 1e-11 * hi:
        mid = 0.5 * (lo + hi)
        if pd(mid):
            lo = mid
        else:
            hi = mid
    return 0.5 * (lo + hi)


def critical_load(
    *,
    EI: Number,
    L: Number,
    springs: Sequence[tuple[float, float]] = (),
    elements_per_bay: int = 8,
    where: str = "",
) -> SpringColumn:
    """Lowest elastic critical force of a pin-ended column on lateral springs.

    Args:
        EI: flexural rigidity for lateral bending, N mm².
        L: length between the end supports (held laterally), mm.
        springs: ``(position from one end, mm; stiffness Cd, N/mm)`` per U-frame, positions
            strictly inside (0, L).
        elements_per_bay: beam elements a bay on the coarser of the two meshes, 4 to 64
            (fewer, down to 2, where many springs would make the finer mesh longer than
            about 400 elements).
        where: place for messages.

    Raises:
        InputError: values out of range, a spring outside the span or two at one point.
    """
    EI = internal(EI, "dimensionless", "EI (N mm²)", where=where, low=0.0, high=1e25)
    L = internal(L, "length", "L", where=where, low=0.0, high=1e6)
    if not isinstance(elements_per_bay, int) or not 4 <= elements_per_bay <= 64:
        raise InputError(f"elements_per_bay = {elements_per_bay!r} is outside 4 to 64", where=where)
    if len(springs) > MAX_SPRINGS:
        raise InputError(f"{len(springs)} springs: at most {MAX_SPRINGS} are allowed", where=where)
    pts: dict[float, float] = {}
    for i, sp in enumerate(springs):
        try:
            x, c = sp
        except (TypeError, ValueError):
            raise InputError(
                f"spring {i}: {sp!r} is not a (position, stiffness) pair", where=where
            ) from None
        x = internal(x, "length", f"spring {i} position", where=where, low=0.0, high=L)
        if x >= L:
            raise InputError(
                f"spring {i} position {x:g} mm is not inside the span (0, {L:g}) mm", where=where
            )
        c = internal(
            c,
            "force_per_length",
            f"spring {i} stiffness",
            where=where,
            low=0.0,
            high=1e12,
            low_inclusive=True,
        )
        if x in pts:
            raise InputError(f"two springs at {x:g} mm", where=where)
        pts[x] = c
    stations = [0.0, *sorted(pts), L]
    bays = len(stations) - 1
    # the dense eigenvalue problem grows as n³: at most about MAX_ELEMENTS elements on the
    # finer mesh; the error of cubic elements falls as h⁴, so two meshes (p and 2p elements
    # a bay) extrapolate it away (Richardson): both are upper bounds, the limit is not
    p = max(2, min(elements_per_bay, MAX_ELEMENTS // (2 * bays)))
    coarse = _lowest(stations, pts, EI, p if bays > 1 else 2 * p)
    fine = _lowest(stations, pts, EI, 2 * p if bays > 1 else 4 * p)
    Ncr = min(fine - (coarse - fine) / 15.0, fine)
    ne = bays * 2 * p if bays > 1 else 4 * p
    euler = math.pi**2 * EI / L**2
    engesser = None
    if pts:
        spacing = L / (len(pts) + 1)
        engesser = 2.0 * math.sqrt(sum(pts.values()) / len(pts) / spacing * EI)
    return SpringColumn(Ncr, math.pi * math.sqrt(EI / Ncr), euler, engesser, ne)
