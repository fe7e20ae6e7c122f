"""Exact section properties by Green's theorem over oriented polygon rings.

For a ring traversed counter-clockwise (holes clockwise), with c_i = x_i y_{i+1} - x_{i+1} y_i:

    A    = 1/2  sum c_i
    Sx   = 1/6  sum (y_i + y_{i+1}) c_i                         (first moment, integral of y dA)
    Sy   = 1/6  sum (x_i + x_{i+1}) c_i
    Ixx  = 1/12 sum (y_i^2 + y_i y_{i+1} + y_{i+1}^2) c_i        (about the origin)
    Iyy  = 1/12 sum (x_i^2 + x_i x_{i+1} + x_{i+1}^2) c_i
    Ixy  = 1/24 sum (x_i y_{i+1} + 2 x_i y_i + 2 x_{i+1} y_{i+1} + x_{i+1} y_i) c_i

These are the standard polygon moment formulas (e.g. Steger, "On the calculation of arbitrary
moments of polygons", 1996). Coordinates are shifted to a reference point near the section
before summing so that the parallel-axis transfer loses no digits.

Sections made of rectangles (every section built from parts) use the same sums evaluated on
the four edges of each rectangle in closed form (:func:`pieces_properties_and_width`): for
[x0, x1] x [y0, y1], with w = x1 - x0 and h = y1 - y0, the four edges give exactly

    A = w h,   Sx = A (y0 + y1) / 2,   Sy = A (x0 + x1) / 2,
    Ixx = A (y0^2 + y0 y1 + y1^2) / 3,   Iyy = A (x0^2 + x0 x1 + x1^2) / 3,
    Ixy = A (x0 + x1) (y0 + y1) / 4,

because the horizontal edges have y_i = y_{i+1} and the vertical ones x_i = x_{i+1}, so each
edge sum collapses to one product (e.g. for Ixx the two vertical edges give
x1 (y1^3 - y0^3) / 3 - x0 (y1^3 - y0^3) / 3 and the horizontal ones nothing). A hole cut
counts with weight -1, which is the clockwise ring of the same rectangle.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, fields
from functools import lru_cache
from typing import ClassVar

import numpy as np
import shapely

from core.errors import GeometryError
from core.geometry import CUTS_WITHIN_PIECES, Pieces
from core.shear import WidthProfile

# columns of (xmin, ymin, xmax, ymax) giving a rectangle's four edges counter-clockwise
# from (xmin, ymin): start x, start y, end x, end y of each edge
_EDGE_COLS = np.array([0, 2, 2, 0, 1, 1, 3, 3, 2, 2, 0, 0, 1, 3, 3, 1])
# the same for a rectangle traversed clockwise (a hole): the x of its corners swapped
_EDGE_COLS_CW = np.array([2, 1, 0, 3])[_EDGE_COLS]


@lru_cache(maxsize=256)
def _edge_index(n: int, m: int) -> tuple[np.ndarray, np.ndarray]:
    """For n rectangles followed by m holes, flattened row by row: the indices (4, 4 (n + m))
    that gather x0, y0, x1, y1 of their edges (four per rectangle, in order), and the index
    of each edge's rectangle."""
    cols = np.concatenate([np.tile(_EDGE_COLS, (n, 1)), np.tile(_EDGE_COLS_CW, (m, 1))])
    idx = (np.arange(n + m)[:, None] * 4 + cols).reshape(n + m, 4, 4).transpose(1, 0, 2)
    idx = np.ascontiguousarray(idx.reshape(4, -1))
    rect = np.repeat(np.arange(n + m), 4)
    idx.flags.writeable = False
    rect.flags.writeable = False
    return idx, rect


@dataclass(frozen=True)
class Edges:
    """Oriented edges of all rings of a section (exteriors CCW, holes CW), in mm.

    ``owner`` gives for each edge the index of the piece's part (for per-part sums).
    """

    x0: np.ndarray
    y0: np.ndarray
    x1: np.ndarray
    y1: np.ndarray
    owner: np.ndarray
    n_parts: int

    @classmethod
    def from_pieces(cls, pieces: Pieces) -> Edges:
        """Edges of the pieces (counter-clockwise) and of the hole cuts (clockwise)."""
        r, own = pieces.rects, pieces.owner
        m = len(pieces.cuts) if pieces.has_cuts else 0
        if m:
            flat = np.concatenate([r.ravel(), pieces.cuts.ravel()])
            own = np.concatenate([own, pieces.cut_owner])
        else:
            flat = r.ravel()
        idx, rect = _edge_index(len(r), m)
        x0, y0, x1, y1 = flat.take(idx)
        return cls(x0, y0, x1, y1, own.take(rect), max(len(pieces.part_ids), 1))

    @classmethod
    def deferred(cls, pieces: Pieces) -> Edges:
        """:meth:`from_pieces`, gathered when a field is first read: a section built from
        pieces takes its properties from the rectangle sums, so its edges are seldom read."""
        return _PiecesEdges(pieces)

    @classmethod
    def from_polygons(cls, polygons: list, owners: list[int] | None = None) -> Edges:
        """Edges of shapely polygons (holes allowed). Rings are oriented here, since GEOS may
        return exterior rings clockwise, and the jump between rings is dropped."""
        owners = list(range(len(polygons))) if owners is None else owners
        parts = []
        for poly, o in zip(polygons, owners, strict=True):
            for g in getattr(poly, "geoms", [poly]):
                g = (
                    shapely.orient_polygons(g)
                    if hasattr(shapely, "orient_polygons")
                    else (shapely.geometry.polygon.orient(g, 1.0))
                )
                for ring in [g.exterior, *g.interiors]:
                    c = np.asarray(ring.coords)[:, :2]
                    parts.append((c[:-1], c[1:], o))
        if not parts:
            raise GeometryError("no polygon given")
        a = np.concatenate([p[0] for p in parts])
        b = np.concatenate([p[1] for p in parts])
        own = np.concatenate([np.full(len(p[0]), p[2]) for p in parts])
        return cls(a[:, 0], a[:, 1], b[:, 0], b[:, 1], own, int(max(owners)) + 1)


_EDGE_FIELDS = frozenset(("x0", "y0", "x1", "y1", "owner", "n_parts"))


class _PiecesEdges(Edges):
    """:class:`Edges` of some pieces, gathered on the first read of any field."""

    def __init__(self, pieces: Pieces | None = None, /, **fields) -> None:
        if fields:  # built field by field (e.g. by dataclasses.replace)
            super().__init__(**fields)
        else:
            object.__setattr__(self, "_pieces", pieces)

    def __getattr__(self, name: str):
        # reached only for attributes not set: the fields, until they are first read
        pieces = self.__dict__.get("_pieces")
        if pieces is None or name not in _EDGE_FIELDS:
            raise AttributeError(name)
        full = Edges.from_pieces(pieces)
        for f in _EDGE_FIELDS:
            object.__setattr__(self, f, getattr(full, f))
        return getattr(full, name)


@dataclass(frozen=True)
class SectionProperties:
    """Geometric properties of a cross-section (mm units).

    Axes: x across, y up. Moments of inertia are about centroidal axes.
    """

    A: float
    xc: float
    yc: float
    Ix: float
    Iy: float
    Ixy: float
    y_top: float
    y_bot: float
    S_top: float
    S_bot: float
    Zx: float
    y_pna: float
    rx: float
    ry: float

    #: (kind, description) per field, for generated tables
    META: ClassVar[dict[str, tuple[str, str]]] = {
        "A": ("area", "area"),
        "xc": ("length", "centroid x"),
        "yc": ("length", "neutral axis height (elastic, from the section datum)"),
        "Ix": ("inertia", "moment of inertia about the horizontal centroidal axis"),
        "Iy": ("inertia", "moment of inertia about the vertical centroidal axis"),
        "Ixy": ("inertia", "product of inertia about the centroidal axes"),
        "y_top": ("length", "height of the top fibre"),
        "y_bot": ("length", "height of the bottom fibre"),
        "S_top": ("section_modulus", "elastic section modulus, top fibre"),
        "S_bot": ("section_modulus", "elastic section modulus, bottom fibre"),
        "Zx": ("section_modulus", "plastic section modulus about the horizontal axis"),
        "y_pna": ("length", "plastic neutral axis height"),
        "rx": ("length", "radius of gyration about the horizontal axis"),
        "ry": ("length", "radius of gyration about the vertical axis"),
    }

    def rows(self):
        """(symbol, description, value, kind) for each property."""
        for f in fields(self):
            kind, desc = self.META[f.name]
            yield f.name, desc, getattr(self, f.name), kind


def _moments(e: Edges, x_ref: float, y_ref: float):
    x0, y0, x1, y1 = e.x0 - x_ref, e.y0 - y_ref, e.x1 - x_ref, e.y1 - y_ref
    c = x0 * y1 - x1 * y0
    A = 0.5 * c
    Sx = (y0 + y1) * c / 6.0
    Sy = (x0 + x1) * c / 6.0
    Ixx = (y0 * y0 + y0 * y1 + y1 * y1) * c / 12.0
    Iyy = (x0 * x0 + x0 * x1 + x1 * x1) * c / 12.0
    Ixy = (x0 * y1 + 2.0 * x0 * y0 + 2.0 * x1 * y1 + x1 * y0) * c / 24.0
    return A, Sx, Sy, Ixx, Iyy, Ixy


def part_areas(e: Edges) -> tuple[np.ndarray, np.ndarray]:
    """Per part: area (mm^2) and first moment about y = 0 (mm^3)."""
    A, Sx, *_ = _moments(e, 0.0, 0.0)
    return (
        np.bincount(e.owner, weights=A, minlength=e.n_parts),
        np.bincount(e.owner, weights=Sx, minlength=e.n_parts),
    )


def pieces_part_areas(pieces: Pieces) -> tuple[np.ndarray, np.ndarray]:
    """Per part: area (mm^2) and first moment about y = 0 (mm^3) of ``pieces``, hole cuts
    negative, by the rectangle sums (A = w h, Sx = A (y0 + y1) / 2): the same as
    ``part_areas(Edges.from_pieces(pieces))`` to round-off."""
    r, own = pieces.rects, pieces.owner
    A = (r[:, 2] - r[:, 0]) * (r[:, 3] - r[:, 1])
    Sx = 0.5 * A * (r[:, 1] + r[:, 3])
    if pieces.has_cuts:
        c = pieces.cuts
        Ac = (c[:, 2] - c[:, 0]) * (c[:, 3] - c[:, 1])
        A = np.concatenate([A, -Ac])
        Sx = np.concatenate([Sx, -0.5 * Ac * (c[:, 1] + c[:, 3])])
        own = np.concatenate([own, pieces.cut_owner])
    n = max(len(pieces.part_ids), 1)
    return np.bincount(own, A, n), np.bincount(own, Sx, n)


def section_properties(e: Edges) -> SectionProperties:
    """A, centroid, Ix, Iy, Ixy, S top/bottom, Zx, radii of gyration of the edges' region.

    Raises:
        GeometryError: the section has no area.
    """
    return properties_and_width(e)[0]


def properties_and_width(e: Edges) -> tuple[SectionProperties, WidthProfile]:
    """The properties and the cut-width profile about the neutral axis, computed together
    (the plastic neutral axis is found on the width profile)."""

    if len(e.x0) == 0:
        raise GeometryError("the section has no material (area is zero)")
    xr = 0.5 * (float(e.x0.min()) + float(e.x0.max()))
    yr = 0.5 * (float(e.y0.min()) + float(e.y0.max()))
    A, Sx, Sy, Ixx, Iyy, Ixy = (float(v.sum()) for v in _moments(e, xr, yr))
    y_top = float(max(e.y0.max(), e.y1.max()))
    y_bot = float(min(e.y0.min(), e.y1.min()))
    return _finish(
        (A, Sx, Sy, Ixx, Iyy, Ixy), xr, yr, y_top, y_bot, lambda yc: WidthProfile.from_edges(e, yc)
    )


def _finish(sums, xr, yr, y_top, y_bot, width_about) -> tuple[SectionProperties, WidthProfile]:
    """Properties from the sums about (xr, yr) (mm): parallel-axis transfer to the centroid,
    section moduli, and the plastic modulus on the width profile ``width_about(yc)``."""
    A, Sx, Sy, Ixx, Iyy, Ixy = sums
    if not A > 0.0 or not math.isfinite(A):
        raise GeometryError(f"the section has no area (A = {A:g} mm²)")
    dx, dy = Sy / A, Sx / A
    Ix = Ixx - A * dy * dy
    Iy = Iyy - A * dx * dx
    Ixy_c = Ixy - A * dx * dy
    xc, yc = xr + dx, yr + dy
    prof = width_about(yc)
    y_pna, Zx = prof.plastic(A)
    props = SectionProperties(
        A=A,
        xc=xc,
        yc=yc,
        Ix=Ix,
        Iy=Iy,
        Ixy=Ixy_c,
        y_top=y_top,
        y_bot=y_bot,
        S_top=Ix / (y_top - yc),
        S_bot=Ix / (yc - y_bot),
        Zx=Zx,
        y_pna=y_pna,
        rx=math.sqrt(Ix / A),
        ry=math.sqrt(Iy / A),
    )
    return props, prof


def pieces_properties_and_width(pieces: Pieces) -> tuple[SectionProperties, WidthProfile]:
    """Properties and width profile of ``pieces`` (rectangles, hole cuts negative), by the
    closed-form rectangle sums of the module docstring: the same as
    ``properties_and_width(Edges.from_pieces(pieces))`` to round-off.

    Raises:
        GeometryError: the section has no area.
    """
    if len(pieces.rects) == 0:
        raise GeometryError("the section has no material (area is zero)")
    if not pieces.has_cuts:
        return _rect_sections(pieces.rects, len(pieces.rects), net=False)[0]
    rows = np.concatenate([pieces.rects, pieces.cuts])
    return _rect_sections(rows, len(pieces.rects), gross=False)[0]


def gross_and_net_properties(
    gross: Pieces, net: Pieces
) -> tuple[tuple[SectionProperties, WidthProfile], tuple[SectionProperties, WidthProfile]]:
    """:func:`pieces_properties_and_width` of a gross section and of its net section, in one
    pass over the rectangles when the net section is the gross one with the hole cuts of
    :func:`core.geometry.net_pieces`.

    Raises:
        GeometryError: a section has no area.
    """
    if len(gross.rects) == 0:
        raise GeometryError("the section has no material (area is zero)")
    if net.rects is gross.rects and net.has_cuts and net.__dict__.get(CUTS_WITHIN_PIECES):
        rows = np.concatenate([gross.rects, net.cuts])
        g, n = _rect_sections(rows, len(gross.rects))
        return g, n
    return pieces_properties_and_width(gross), pieces_properties_and_width(net)


def _rect_sections(
    rows: np.ndarray, n: int, *, gross: bool = True, net: bool = True
) -> list[tuple[SectionProperties, WidthProfile]]:
    """Sections of the rectangles ``rows`` (xmin, ymin, xmax, ymax): the first ``n`` are
    material, the rest hole cuts. ``gross``: the material alone; ``net``: all rows, cuts
    negative. Both share the reference point and the extreme fibres, so when both are asked
    the cuts must lie inside the material (as the cuts of :func:`net_pieces` do)."""
    c = np.ascontiguousarray(rows.T)  # (4, N): whole-row operations are the cheapest
    lo_c = c.min(axis=1).tolist()
    hi_c = c.max(axis=1).tolist()
    xr, yr = 0.5 * (lo_c[0] + hi_c[2]), 0.5 * (lo_c[1] + hi_c[3])
    y_bot, y_top = lo_c[1], hi_c[3]
    d = c - np.array([[xr], [yr], [xr], [yr]])
    lo, hi = d[:2], d[2:]
    # per row of f: x0 + x1, y0 + y1, x0^2 + x0 x1 + x1^2, y0^2 + y0 y1 + y1^2,
    # (x0 + x1)(y0 + y1), 1; each rectangle's area multiplies them in the sums below
    N = len(rows)
    f = np.empty((6, N))
    sm = f[0:2]
    np.add(lo, hi, out=sm)
    q = f[2:4]
    np.multiply(sm, sm, out=q)
    q -= lo * hi  # (lo + hi)^2 - lo hi = lo^2 + lo hi + hi^2
    np.multiply(sm[0], sm[1], out=f[4])
    f[5] = 1.0
    w = hi - lo
    area = w[0] * w[1]
    # row 0: the gross section (material only); row 1: the net section (cuts negative)
    weights = np.ones((2, N))
    weights[0, n:] = 0.0
    weights[1, n:] = -1.0
    sums = ((weights * area) @ f.T).tolist()
    t = c[2] - c[0]
    wanted = []
    if gross:
        wanted.append((0, c[1, :n], c[3, :n], t[:n]))
    if net:
        wanted.append((1, c[1], c[3], t * weights[1]))
    out = []
    for k, y0, y1, tk in wanted:
        # sum of area times: x0 + x1, y0 + y1, x0^2 + x0 x1 + x1^2, ..., (x0 + x1)(y0 + y1), 1
        ax, ay, aqx, aqy, axy, A = sums[k]
        out.append(
            _finish(
                (A, ay / 2.0, ax / 2.0, aqy / 3.0, aqx / 3.0, axy / 4.0),
                xr,
                yr,
                y_top,
                y_bot,
                lambda yc, y0=y0, y1=y1, tk=tk: WidthProfile.from_columns(y0, y1, tk, yc),
            )
        )
    return out
