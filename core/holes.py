"""Rivet holes in the plane of the section: the rectangles they sweep, the cuts they make
in the pieces of remaining material, and when such cuts can overlap.

A hole passes through the whole thickness of every part its line pierces, so in the
cross-section it is a rectangle across those parts; the net section deducts its intersection
with each pierced piece.
"""

from __future__ import annotations

import numpy as np

from core.definition import SectionDefinition
from core.grid import GRID
from core.grid import snap as _snap
from core.parts import Angle, Plate


def _cuts_overlap(cuts: np.ndarray) -> bool:
    """True when two of the rectangles ``cuts`` (n, 4) overlap (by more than GRID each way)."""
    ox = np.minimum(cuts[:, None, 2], cuts[None, :, 2]) - np.maximum(
        cuts[:, None, 0], cuts[None, :, 0]
    )
    oy = np.minimum(cuts[:, None, 3], cuts[None, :, 3]) - np.maximum(
        cuts[:, None, 1], cuts[None, :, 1]
    )
    both = (ox > GRID) & (oy > GRID)
    np.fill_diagonal(both, False)
    return bool(both.any())


def _part_boxes(p: Plate | Angle) -> list[tuple[float, float, float, float]]:
    """Rectangles that hold every piece of ``p`` whatever the loss, written with the same
    floating-point expressions as the pieces (so that the snapped pieces lie inside the
    snapped boxes exactly): the nominal plate; for an angle, its horizontal leg and its
    vertical leg taken down to the heel (a thinned horizontal leg lets the vertical leg's
    piece reach into the nominal horizontal leg)."""
    if isinstance(p, Plate):
        a, b = p.long_range
        c_lo = p.y if p.orientation == "horizontal" else p.x
        c_hi = c_lo + p.t
        return [(a, c_lo, b, c_hi) if p.orientation == "horizontal" else (c_lo, a, c_hi, b)]
    (hx0, hy0, hx1, hy1), (vx0, vy0, vx1, vy1) = p.leg_rects(p.t, p.t)
    return [(hx0, hy0, hx1, hy1), (vx0, min(hy0, vy0), vx1, max(hy1, vy1))]


def _pair_overlap(r: np.ndarray) -> np.ndarray:
    """Overlap (2, n, n) along x and along y of every pair of rectangles ``r`` (n, 4);
    negative for a gap."""
    rt = np.ascontiguousarray(r.T)  # contiguous columns broadcast much faster
    return np.minimum(rt[2:, :, None], rt[2:, None, :]) - np.maximum(
        rt[:2, :, None], rt[:2, None, :]
    )


def _cuts_may_overlap(defn: SectionDefinition, holes: np.ndarray, pierce_t: np.ndarray) -> bool:
    """False when no two hole cuts of a net section of ``defn`` can overlap, for any loss.

    A cut is a piece intersected with a hole, and every piece lies inside one of its part's
    boxes (:func:`_part_boxes`). Pieces of one part never overlap each other (plate
    segments follow one another along the width; an angle's two legs meet along a line).
    So two cuts can overlap only (a) on pieces of two parts whose boxes overlap, or (b) on
    one piece cut by two holes whose common area meets a box of a part that both lines pass
    through. When neither can happen, the overlap check of each station is skipped;
    otherwise it runs. Overlaps are tested with half the snapping grid, a stricter test
    than the one on the cuts themselves.
    """
    if len(holes) < 2:
        return False
    boxes, box_owner = [], []
    for k, p in enumerate(defn.parts):
        for bx in _part_boxes(p):
            boxes.append(bx)
            box_owner.append(k)
    bx = _snap(np.array(boxes, dtype=float))
    own = np.array(box_owner)
    half = 0.5 * GRID
    if ((_pair_overlap(bx) > half).all(axis=0) & (own[:, None] != own[None, :])).any():
        return True
    j1, j2 = np.nonzero(np.triu((_pair_overlap(holes) > half).all(axis=0), 1))
    if len(j1) == 0:
        return False
    # common area of each pair of holes that meet, against each box: (pairs, boxes, 2)
    lo = np.maximum(holes[j1, :2], holes[j2, :2])
    hi = np.minimum(holes[j1, 2:], holes[j2, 2:])
    inner = np.minimum(bx[None, :, 2:], hi[:, None, :]) - np.maximum(
        bx[None, :, :2], lo[:, None, :]
    )
    both = (pierce_t[own][:, j1] & pierce_t[own][:, j2]).T
    return bool(((inner > half).all(axis=2) & both).any())


def hole_rects(defn: SectionDefinition) -> np.ndarray:
    """Rectangles (n, 4) swept by the rivet holes of every line, through its parts (mm)."""
    return _hole_rects(defn)


def _hole_rects(defn: SectionDefinition) -> np.ndarray:
    out = []
    idx = {p.id: p for p in defn.parts}
    for line in defn.rivet_lines:
        b = [idx[pid].bounds for pid in line.parts]
        r = 0.5 * line.d_hole
        if line.axis == "horizontal":
            out.append(
                (
                    min(v[0] for v in b),
                    line.position - r,
                    max(v[2] for v in b),
                    line.position + r,
                )
            )
        else:
            out.append(
                (
                    line.position - r,
                    min(v[1] for v in b),
                    line.position + r,
                    max(v[3] for v in b),
                )
            )
    return _snap(np.array(out, dtype=float).reshape(-1, 4))


def _deduct_holes(
    defn: SectionDefinition, rects: np.ndarray, owner: np.ndarray
) -> tuple[np.ndarray, np.ndarray]:
    """Subtract each line's hole rectangle from the pieces of the parts it pierces."""
    holes = hole_rects(defn)
    ids = [p.id for p in defn.parts]
    for line, h in zip(defn.rivet_lines, holes, strict=True):
        pierced = np.isin(owner, [ids.index(pid) for pid in line.parts])
        hit = (
            pierced
            & (rects[:, 0] < h[2])
            & (rects[:, 2] > h[0])
            & (rects[:, 1] < h[3])
            & (rects[:, 3] > h[1])
        )
        if not hit.any():
            continue
        new_r, new_o = [rects[~hit]], [owner[~hit]]
        for r, o in zip(rects[hit], owner[hit], strict=True):
            parts = _rect_minus(r, h)
            if parts:
                new_r.append(np.array(parts))
                new_o.append(np.full(len(parts), o))
        rects = np.concatenate(new_r)
        owner = np.concatenate(new_o)
    return rects, owner


def _rect_minus(r: np.ndarray, h: np.ndarray) -> list[tuple[float, float, float, float]]:
    """Rectangle r minus rectangle h, as up to four disjoint rectangles."""
    x0, y0, x1, y1 = r
    hx0, hy0, hx1, hy1 = max(h[0], x0), max(h[1], y0), min(h[2], x1), min(h[3], y1)
    out = []
    if hy0 > y0:
        out.append((x0, y0, x1, hy0))
    if hy1 < y1:
        out.append((x0, hy1, x1, y1))
    if hx0 > x0:
        out.append((x0, hy0, hx0, hy1))
    if hx1 < x1:
        out.append((hx1, hy0, x1, hy1))
    return out
