"""Parts of a built-up cross-section: plates and angles, as frozen, validated objects.

Coordinates: x across the member (mm), y up (mm), in the plane of the cross-section.
Each part knows its nominal outline and how it thins: loss removes material from the
exposed faces and keeps the faying face (the face bolted or riveted against another part).
"""

from __future__ import annotations

import itertools
import math
from dataclasses import dataclass
from typing import Literal

from core.errors import GeometryError

Orientation = Literal["horizontal", "vertical"]
KeptFace = Literal["centre", "low", "high"]
AngleLeg = Literal["h", "v"]

_MAX_DIM = 20_000.0  # mm; anything larger in a cross-section is a unit slip or a typo


def check_length(value: float, name: str, where: str, *, allow_zero: bool = False) -> float:
    """Validate a length in mm: finite, positive (or zero if allowed), below 20 m.

    Raises:
        GeometryError: naming the value, the allowed range and ``where``.
    """
    try:
        v = float(value)
    except (TypeError, ValueError):
        raise GeometryError(f"{name} = {value!r} is not a number", where=where) from None
    low_ok = v >= 0.0 if allow_zero else v > 0.0
    if not math.isfinite(v) or not low_ok or v > _MAX_DIM:
        rng = "0" if allow_zero else "greater than 0"
        raise GeometryError(
            f"{name} = {value!r} mm is outside the allowed range ({rng} to {_MAX_DIM:g} mm)",
            where=where,
        )
    return v


def check_coord(value: float, name: str, where: str) -> float:
    """Validate a coordinate in mm: finite and within +/- 20 m."""
    try:
        v = float(value)
    except (TypeError, ValueError):
        raise GeometryError(f"{name} = {value!r} is not a number", where=where) from None
    if not math.isfinite(v) or abs(v) > _MAX_DIM:
        raise GeometryError(
            f"{name} = {value!r} mm is outside the allowed range (-{_MAX_DIM:g} to {_MAX_DIM:g} mm)",
            where=where,
        )
    return v


@dataclass(frozen=True)
class Plate:
    """A flat plate seen in cross-section as a rectangle.

    Attributes:
        id: unique part id within the section (e.g. ``"web"``, ``"cover_top_1"``).
        b: plate width in the section plane, mm (for a web: its depth).
        t: nominal thickness, mm.
        x, y: lower-left corner of the rectangle, mm.
        orientation: ``"horizontal"`` (width along x, thickness along y) or ``"vertical"``.
        kept_face: which face stays put when the plate thins: ``"centre"`` (both faces
            exposed, thins symmetrically), ``"low"`` (face at smaller coordinate across the
            thickness is faying and kept) or ``"high"``.
        role: free label used by templates (``"web"``, ``"cover"``, ``"plate"``).
    """

    id: str
    b: float
    t: float
    x: float
    y: float
    orientation: Orientation = "horizontal"
    kept_face: KeptFace = "centre"
    role: str = "plate"

    def __post_init__(self) -> None:
        w = f"part {self.id!r}"
        if not isinstance(self.id, str) or not self.id.strip():
            raise GeometryError(f"part id {self.id!r} must be a non-empty string")
        object.__setattr__(self, "b", check_length(self.b, "width b", w))
        object.__setattr__(self, "t", check_length(self.t, "thickness t", w))
        object.__setattr__(self, "x", check_coord(self.x, "x", w))
        object.__setattr__(self, "y", check_coord(self.y, "y", w))
        if self.orientation not in ("horizontal", "vertical"):
            raise GeometryError(
                f"orientation {self.orientation!r} is not 'horizontal' or 'vertical'", where=w
            )
        if self.kept_face not in ("centre", "low", "high"):
            raise GeometryError(
                f"kept_face {self.kept_face!r} is not 'centre', 'low' or 'high'", where=w
            )

    @property
    def kind(self) -> str:
        return "plate"

    @property
    def bounds(self) -> tuple[float, float, float, float]:
        """(xmin, ymin, xmax, ymax) of the nominal rectangle, mm."""
        if self.orientation == "horizontal":
            return (self.x, self.y, self.x + self.b, self.y + self.t)
        return (self.x, self.y, self.x + self.t, self.y + self.b)

    @property
    def long_range(self) -> tuple[float, float]:
        """Extent along the plate's width direction (x if horizontal, y if vertical), mm."""
        if self.orientation == "horizontal":
            return (self.x, self.x + self.b)
        return (self.y, self.y + self.b)

    def thickness_range(self, t_remaining: float) -> tuple[float, float]:
        """Extent across the thickness after thinning to ``t_remaining`` (mm), kept face honoured."""
        lo = self.y if self.orientation == "horizontal" else self.x
        hi = lo + self.t
        if self.kept_face == "low":
            return (lo, lo + t_remaining)
        if self.kept_face == "high":
            return (hi - t_remaining, hi)
        mid = 0.5 * (lo + hi)
        return (mid - 0.5 * t_remaining, mid + 0.5 * t_remaining)

    def rect(self, t_remaining: float, lo: float | None = None, hi: float | None = None):
        """Rectangle (xmin, ymin, xmax, ymax) of the plate thinned to ``t_remaining`` over the
        width range [lo, hi] (default: the whole width)."""
        a, b = self.long_range
        lo = a if lo is None else lo
        hi = b if hi is None else hi
        c0, c1 = self.thickness_range(t_remaining)
        if self.orientation == "horizontal":
            return (lo, c0, hi, c1)
        return (c0, lo, c1, hi)


@dataclass(frozen=True)
class Angle:
    """An equal or unequal leg angle with sharp corners (no fillet or toe radii).

    Attributes:
        id: unique part id.
        b_h: length of the horizontal leg (along x), mm, measured from the heel.
        b_v: length of the vertical leg (along y), mm, measured from the heel.
        t: nominal leg thickness, mm.
        x, y: the heel (outer corner), mm.
        dir_x: +1 if the horizontal leg runs from the heel towards +x, -1 towards -x.
        dir_y: +1 if the vertical leg runs from the heel towards +y, -1 towards -y.
        role: free label used by templates (``"flange_angle"``).

    Thinning keeps the backs of both legs (the faces through the heel, which are the faying
    faces against the web and the cover plates in a riveted girder) and removes the inner faces.
    """

    id: str
    b_h: float
    b_v: float
    t: float
    x: float
    y: float
    dir_x: int = 1
    dir_y: int = 1
    role: str = "angle"

    def __post_init__(self) -> None:
        w = f"part {self.id!r}"
        if not isinstance(self.id, str) or not self.id.strip():
            raise GeometryError(f"part id {self.id!r} must be a non-empty string")
        object.__setattr__(self, "b_h", check_length(self.b_h, "horizontal leg b_h", w))
        object.__setattr__(self, "b_v", check_length(self.b_v, "vertical leg b_v", w))
        object.__setattr__(self, "t", check_length(self.t, "thickness t", w))
        object.__setattr__(self, "x", check_coord(self.x, "heel x", w))
        object.__setattr__(self, "y", check_coord(self.y, "heel y", w))
        if self.dir_x not in (1, -1) or self.dir_y not in (1, -1):
            raise GeometryError(
                f"dir_x = {self.dir_x!r} and dir_y = {self.dir_y!r} must each be +1 or -1", where=w
            )
        if self.t >= min(self.b_h, self.b_v):
            raise GeometryError(
                f"thickness t = {self.t:g} mm must be less than both legs "
                f"({self.b_h:g} mm, {self.b_v:g} mm)",
                where=w,
            )

    @property
    def kind(self) -> str:
        return "angle"

    @property
    def bounds(self) -> tuple[float, float, float, float]:
        x1 = self.x + self.dir_x * self.b_h
        y1 = self.y + self.dir_y * self.b_v
        return (min(self.x, x1), min(self.y, y1), max(self.x, x1), max(self.y, y1))

    def leg_rects(self, t_h: float, t_v: float):
        """Two disjoint rectangles (xmin, ymin, xmax, ymax): the horizontal leg (full length,
        thickness ``t_h``) and the vertical leg beyond it (thickness ``t_v``)."""
        sx, sy = self.dir_x, self.dir_y
        hx0, hx1 = sorted((self.x, self.x + sx * self.b_h))
        hy0, hy1 = sorted((self.y, self.y + sy * t_h))
        vx0, vx1 = sorted((self.x, self.x + sx * t_v))
        vy0, vy1 = sorted((self.y + sy * t_h, self.y + sy * self.b_v))
        return (hx0, hy0, hx1, hy1), (vx0, vy0, vx1, vy1)

    def leg_range(self, leg: str) -> tuple[float, float]:
        """Where a loss band may lie on a leg, in section coordinates (mm): x along the
        horizontal leg, heights y along the vertical one, from beyond the other leg's
        nominal thickness (the corner, which both legs share, is not banded) to the toe."""
        if leg == "h":
            a, b = self.x + self.dir_x * self.t, self.x + self.dir_x * self.b_h
        else:
            a, b = self.y + self.dir_y * self.t, self.y + self.dir_y * self.b_v
        return (min(a, b), max(a, b))

    def banded_rects(self, t_h: float, t_v: float, bands, where: str = ""):
        """The legs' rectangles with loss bands (``bands``: ``(leg, lo, hi, t)`` in mm,
        ``lo``/``hi`` section coordinates within :meth:`leg_range` of the leg). The backs of
        the legs keep their place (as for uniform thinning); a leg's thickness in a band is
        the least of its own and the bands' there; a band of t = 0 cuts the leg through.

        Raises:
            GeometryError: a band outside its leg's range, or on an unknown leg.
        """
        cuts: dict[str, list[tuple[float, float, float]]] = {"h": [], "v": []}
        for leg, lo, hi, t in bands:
            if leg not in cuts:
                raise GeometryError(
                    f"a loss band on angle {self.id!r} needs its leg 'h' or 'v', not {leg!r}",
                    where=where,
                )
            a, b = self.leg_range(leg)
            if lo < a - 1e-6 or hi > b + 1e-6:
                raise GeometryError(
                    f"loss band {lo:g} to {hi:g} mm lies outside the {_LEG_WORDS[leg]} of "
                    f"angle {self.id!r} ({a:g} to {b:g} mm, beyond the other leg's thickness)",
                    where=where,
                )
            cuts[leg].append((max(lo, a), min(hi, b), t))
        sx, sy = self.dir_x, self.dir_y
        out = []
        for leg, t_leg in (("h", t_h), ("v", t_v)):
            if leg == "h":
                a, b = sorted((self.x, self.x + sx * self.b_h))
            else:
                a, b = sorted((self.y + sy * t_h, self.y + sy * self.b_v))
            edges = sorted({a, b, *(c for lo, hi, _ in cuts[leg] for c in (lo, hi) if a < c < b)})
            for s0, s1 in itertools.pairwise(edges):
                mid = 0.5 * (s0 + s1)
                t = min([t_leg, *(tb for lo, hi, tb in cuts[leg] if lo <= mid <= hi)])
                if t <= 0.0:
                    continue
                if leg == "h":
                    y0, y1 = sorted((self.y, self.y + sy * t))
                    out.append((s0, y0, s1, y1))
                else:
                    x0, x1 = sorted((self.x, self.x + sx * t))
                    out.append((x0, s0, x1, s1))
        return tuple(out)


Part = Plate | Angle

_LEG_WORDS = {"h": "horizontal leg", "v": "vertical leg"}
