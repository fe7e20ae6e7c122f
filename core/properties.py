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
"""

from __future__ import annotations

import math
from dataclasses import dataclass, fields
from typing import ClassVar

import numpy as np
import shapely

from core.errors import GeometryError
from core.geometry import Pieces
from core.shear import WidthProfile


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
        if pieces.has_cuts:
            c = pieces.cuts
            # a clockwise rectangle: swap the x of its corners
            r = np.concatenate([r, np.stack([c[:, 2], c[:, 1], c[:, 0], c[:, 3]], axis=1)])
            own = np.concatenate([own, pieces.cut_owner])
        X0, Y0, X1, Y1 = r[:, 0], r[:, 1], r[:, 2], r[:, 3]
        xs = np.stack([X0, X1, X1, X0, X1, X1, X0, X0], axis=1)
        ys = np.stack([Y0, Y0, Y1, Y1, Y0, Y1, Y1, Y0], axis=1)
        # columns 0-3: edge start points; 4-7: edge end points
        return cls(
            xs[:, :4].ravel(),
            ys[:, :4].ravel(),
            xs[:, 4:].ravel(),
            ys[:, 4:].ravel(),
            np.repeat(own, 4),
            max(len(pieces.part_ids), 1),
        )

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
    if not A > 0.0 or not math.isfinite(A):
        raise GeometryError(f"the section has no area (A = {A:g} mm²)")
    dx, dy = Sy / A, Sx / A
    Ix = Ixx - A * dy * dy
    Iy = Iyy - A * dx * dx
    Ixy_c = Ixy - A * dx * dy
    xc, yc = xr + dx, yr + dy
    y_top = float(max(e.y0.max(), e.y1.max()))
    y_bot = float(min(e.y0.min(), e.y1.min()))
    prof = WidthProfile.from_edges(e, yc)
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
