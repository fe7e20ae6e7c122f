"""From a section definition and a station's loss to the pieces of material that remain.

The parts of a riveted or bolted built-up section are plates and angles, so every piece of
remaining material is an axis-aligned rectangle: a plate thinned to its measured thickness
(faying face kept), a band of a plate thinned further, the two legs of an angle, each cut by
perforations (through holes at the station) and, in the net section, by rivet holes. The
pieces are disjoint, so properties add up over them without a polygon union; shapely is used
only to check that parts do not overlap and to tell whether the remaining material holds
together in one piece.
"""

from __future__ import annotations

import itertools
from dataclasses import dataclass
from functools import lru_cache

import numpy as np
import shapely

from core.definition import SectionDefinition, StationLoss
from core.errors import GeometryError
from core.parts import Angle, Plate

#: coordinates are snapped to this grid (mm) so that touching parts built from
#: floating-point sums neither overlap by an ulp nor leave 1-ulp gaps
GRID = 1e-9
#: tolerance (mm) on thickness above nominal and on ranges given in a loss
TOL = 1e-6
#: overlap area (mm^2) above which two parts are said to overlap
OVERLAP_AREA = 1e-3


@dataclass(frozen=True)
class Pieces:
    """Disjoint rectangles of remaining material.

    Attributes:
        rects: array (n, 4) of ``xmin, ymin, xmax, ymax`` in mm.
        owner: array (n,) of indices into ``part_ids``.
        part_ids: ids of the parts, in definition order.
    """

    rects: np.ndarray
    owner: np.ndarray
    part_ids: tuple[str, ...]
    cuts: np.ndarray | None = None
    cut_owner: np.ndarray | None = None

    def __post_init__(self) -> None:
        if self.rects.ndim != 2 or self.rects.shape[1] != 4:
            raise GeometryError("pieces must be an (n, 4) array of rectangles")
        if len(self.owner) != len(self.rects):
            raise GeometryError("each piece needs exactly one owner")
        if (self.cuts is None) != (self.cut_owner is None):
            raise GeometryError("cuts and their owners go together")

    @property
    def has_cuts(self) -> bool:
        """True when rivet-hole cuts are kept apart from the material (a net section)."""
        return self.cuts is not None and len(self.cuts) > 0

    def of(self, part_id: str) -> np.ndarray:
        """Rectangles of one part."""
        i = self.part_ids.index(part_id)
        return self.rects[self.owner == i]

    def components(self) -> list[tuple[str, ...]]:
        """Connected groups of parts (each group as its part ids), largest area first.

        Two pieces are connected when they overlap or share an edge of positive length;
        pieces that meet only at a corner point are not (no shear passes through a point).
        """
        n = len(self.rects)
        if n == 0:
            return []
        if self.has_cuts:
            raise GeometryError("connectivity is defined for the gross section only")
        r = self.rects
        ox = np.minimum(r[:, None, 2], r[None, :, 2]) - np.maximum(r[:, None, 0], r[None, :, 0])
        oy = np.minimum(r[:, None, 3], r[None, :, 3]) - np.maximum(r[:, None, 1], r[None, :, 1])
        tol = 1e-6
        adj = ((ox > tol) & (oy >= -tol)) | ((oy > tol) & (ox >= -tol))
        parent = list(range(n))

        def root(k: int) -> int:
            while parent[k] != k:
                parent[k] = parent[parent[k]]
                k = parent[k]
            return k

        ii, jj = np.nonzero(np.triu(adj, 1))
        for a, b in zip(ii.tolist(), jj.tolist(), strict=True):
            ra, rb = root(a), root(b)
            if ra != rb:
                parent[max(ra, rb)] = min(ra, rb)
        label = np.array([root(k) for k in range(n)])
        area = (r[:, 2] - r[:, 0]) * (r[:, 3] - r[:, 1])
        groups = []
        for lab in np.unique(label):
            sel = label == lab
            ids = {self.part_ids[o] for o in self.owner[sel]}
            groups.append((float(area[sel].sum()), tuple(p for p in self.part_ids if p in ids)))
        groups.sort(key=lambda g: -g[0])
        return [g for _, g in groups]

    def outlines(self) -> dict[str, object]:
        """Per part, the shapely (Multi)Polygon of its remaining material, for drawing."""
        out = {}
        for i, pid in enumerate(self.part_ids):
            sel = self.owner == i
            if sel.any():
                boxes = shapely.box(*self.rects[sel].T)
                out[pid] = shapely.set_precision(shapely.union_all(boxes), 1e-6)
        return out


def _snap(v: np.ndarray | float) -> np.ndarray:
    return np.round(np.asarray(v, dtype=float) / GRID) * GRID


@lru_cache(maxsize=64)
def _layout(defn: SectionDefinition) -> dict[str, tuple[list, list]]:
    """Check that no two parts overlap and find, for each plate, where each of its two faces
    is covered by another part (contact intervals along the plate's width, mm).

    Raises:
        GeometryError: naming both overlapping parts and the overlap area in mm^2.
    """
    rects, owner = [], []
    for i, p in enumerate(defn.parts):
        for r in _nominal_rects(p):
            rects.append(r)
            owner.append(i)
    r = _snap(np.array(rects))
    owner_a = np.array(owner)
    x0 = np.maximum(r[:, None, 0], r[None, :, 0])
    y0 = np.maximum(r[:, None, 1], r[None, :, 1])
    x1 = np.minimum(r[:, None, 2], r[None, :, 2])
    y1 = np.minimum(r[:, None, 3], r[None, :, 3])
    area = np.clip(x1 - x0, 0, None) * np.clip(y1 - y0, 0, None)
    same = owner_a[:, None] == owner_a[None, :]
    area[same] = 0.0
    i, j = np.nonzero(np.triu(area > OVERLAP_AREA))
    if len(i):
        a, b = defn.parts[owner_a[i[0]]], defn.parts[owner_a[j[0]]]
        raise GeometryError(
            f"parts {a.id!r} and {b.id!r} overlap by {area[i[0], j[0]]:.4g} mm² "
            "(parts may touch but not overlap)",
            where=defn.name,
        )
    contacts: dict[str, tuple[list, list]] = {}
    for k, p in enumerate(defn.parts):
        if not isinstance(p, Plate):
            continue
        others = r[owner_a != k]
        (px0, py0, px1, py1) = _snap(np.array(p.bounds))
        if p.orientation == "horizontal":
            face_lo = np.abs(others[:, 3] - py0) <= TOL
            face_hi = np.abs(others[:, 1] - py1) <= TOL
            span = np.stack([np.maximum(others[:, 0], px0), np.minimum(others[:, 2], px1)], 1)
        else:
            face_lo = np.abs(others[:, 2] - px0) <= TOL
            face_hi = np.abs(others[:, 0] - px1) <= TOL
            span = np.stack([np.maximum(others[:, 1], py0), np.minimum(others[:, 3], py1)], 1)
        real = span[:, 1] - span[:, 0] > TOL
        contacts[p.id] = (
            [tuple(s) for s in span[face_lo & real]],
            [tuple(s) for s in span[face_hi & real]],
        )
    return contacts


def check_overlaps(defn: SectionDefinition) -> None:
    """Raise :class:`GeometryError` if any two parts of the as-built section overlap."""
    _layout(defn)


def _nominal_rects(p: Plate | Angle) -> list[tuple[float, float, float, float]]:
    if isinstance(p, Plate):
        return [p.rect(p.t)]
    return list(p.leg_rects(p.t, p.t))


def _covered(intervals: list, mid: float) -> bool:
    return any(lo <= mid <= hi for lo, hi in intervals)


def _face_share(p: Plate) -> tuple[float, float]:
    """Share of a thickness loss taken by the low and the high face."""
    return {"centre": (0.5, 0.5), "low": (0.0, 1.0), "high": (1.0, 0.0)}[p.kept_face]


def _plate_rects(
    p: Plate, t_base: float, loss: StationLoss, contacts: tuple[list, list], where: str
) -> list[tuple[float, float, float, float]]:
    """Rectangles of a plate with its loss applied.

    A uniform remaining thickness (a gauge reading) thins only the faces that are exposed:
    where another part lies against a face (a faying surface, e.g. the web gripped between
    the flange angles) that face keeps its place. Loss bands are explicit measurements and
    thin the plate over their range whatever lies against it; perforations remove it.
    """
    a, b = p.long_range
    w = f"{where} / part {p.id!r}"
    cuts = {a, b}
    bands = []
    perfs = []
    for band in loss.bands:
        if band.part != p.id:
            continue
        if band.lo < a - TOL or band.hi > b + TOL:
            raise GeometryError(
                f"loss band {band.lo:g} to {band.hi:g} mm lies outside the plate "
                f"({a:g} to {b:g} mm)",
                where=w,
            )
        if band.t > p.t + TOL:
            raise GeometryError(
                f"loss band remaining thickness {band.t:g} mm is above the nominal "
                f"{p.t:g} mm (allowed 0 to {p.t:g} mm)",
                where=w,
            )
        lo, hi = max(band.lo, a), min(band.hi, b)
        bands.append((lo, hi, band.t))
        cuts.update((lo, hi))
    for perf in loss.perforations:
        if perf.part != p.id:
            continue
        if perf.lo < a - TOL or perf.hi > b + TOL:
            raise GeometryError(
                f"perforation {perf.lo:g} to {perf.hi:g} mm lies outside the plate "
                f"({a:g} to {b:g} mm)",
                where=w,
            )
        lo, hi = max(perf.lo, a), min(perf.hi, b)
        perfs.append((lo, hi))
        cuts.update((lo, hi))
    lo_c, hi_c = contacts
    if t_base < p.t:
        for lo, hi in (*lo_c, *hi_c):
            cuts.update((lo, hi))
    s_lo, s_hi = _face_share(p)
    c_lo = p.y if p.orientation == "horizontal" else p.x
    c_hi = c_lo + p.t
    out = []
    for lo, hi in itertools.pairwise(sorted(cuts)):
        if hi - lo <= TOL:
            continue
        mid = 0.5 * (lo + hi)
        if any(plo <= mid <= phi for plo, phi in perfs):
            continue
        d = p.t - t_base
        loss_lo = 0.0 if _covered(lo_c, mid) else s_lo * d
        loss_hi = 0.0 if _covered(hi_c, mid) else s_hi * d
        for blo, bhi, bt in bands:
            if blo <= mid <= bhi:
                loss_lo = max(loss_lo, s_lo * (p.t - bt))
                loss_hi = max(loss_hi, s_hi * (p.t - bt))
        t0, t1 = c_lo + loss_lo, c_hi - loss_hi
        if t1 - t0 <= TOL:
            continue
        if p.orientation == "horizontal":
            out.append((lo, t0, hi, t1))
        else:
            out.append((t0, lo, t1, hi))
    return out


def build_pieces(
    defn: SectionDefinition, loss: StationLoss | None = None, *, net: bool = False
) -> Pieces:
    """The remaining material of ``defn`` with ``loss`` applied (as-built if ``loss`` is None).

    Args:
        defn: the as-built section (mm).
        loss: remaining thicknesses, loss bands and perforations at the station (mm).
        net: deduct the rivet holes of every rivet line (net section for flexure and
            tension). Without holes the section serves shear stress and shear flow.

    Raises:
        GeometryError: unknown part ids, thickness above nominal, a loss that removes a
            whole part, bands or perforations outside their plate, bands on angles.
    """
    loss = loss if loss is not None else StationLoss()
    where = loss.where or defn.name
    contacts = _layout(defn)
    known = {p.id: p for p in defn.parts}
    for kind, items in (
        ("remaining thickness", loss.thickness),
        ("loss band", loss.bands),
        ("perforation", loss.perforations),
    ):
        for it in items:
            if it.part not in known:
                raise GeometryError(
                    f"{kind} names unknown part {it.part!r}; known parts: {list(known)}",
                    where=where,
                )
            if kind != "remaining thickness" and not isinstance(known[it.part], Plate):
                raise GeometryError(
                    f"a {kind} can be given on a plate only; {it.part!r} is an angle "
                    "(give the angle leg's remaining thickness instead)",
                    where=where,
                )
    t_of: dict[tuple[str, str | None], float] = {}
    for th in loss.thickness:
        p = known[th.part]
        if th.leg is not None and not isinstance(p, Angle):
            raise GeometryError(
                f"leg {th.leg!r} given for plate {p.id!r}; legs apply to angles only", where=where
            )
        if th.t > p.t + TOL:
            raise GeometryError(
                f"remaining thickness {th.t:g} mm is above the nominal {p.t:g} mm "
                f"(allowed: greater than 0 up to {p.t:g} mm)",
                where=f"{where} / part {p.id!r}",
            )
        t_of[(th.part, th.leg)] = min(th.t, p.t)

    rects: list[tuple[float, float, float, float]] = []
    owner: list[int] = []
    for i, p in enumerate(defn.parts):
        if isinstance(p, Plate):
            t_base = t_of.get((p.id, None), p.t)
            prs = _plate_rects(p, t_base, loss, contacts[p.id], where)
            if not prs:
                raise GeometryError(
                    "the loss removes the whole part (no material remains)",
                    where=f"{where} / part {p.id!r}",
                )
            rects.extend(prs)
            owner.extend([i] * len(prs))
        else:
            t_all = t_of.get((p.id, None), p.t)
            t_h = t_of.get((p.id, "h"), t_all)
            t_v = t_of.get((p.id, "v"), t_all)
            for r in p.leg_rects(t_h, t_v):
                rects.append(r)
                owner.append(i)
    arr = _snap(np.array(rects, dtype=float))
    own = np.array(owner, dtype=np.intp)
    keep = (arr[:, 2] - arr[:, 0] > GRID) & (arr[:, 3] - arr[:, 1] > GRID)
    gross = Pieces(arr[keep], own[keep], tuple(p.id for p in defn.parts))
    return net_pieces(defn, gross) if net else gross


def net_pieces(defn: SectionDefinition, gross: Pieces, *, exact: bool = False) -> Pieces:
    """The net section: ``gross`` with the rivet holes of every line deducted.

    The material each hole removes is the intersection of the hole's rectangle with the
    pieces of the parts it pierces. When no two such cuts overlap, they are kept apart as
    negative areas (fast, and exact for every property); otherwise, or with ``exact``, the
    pieces themselves are cut into smaller rectangles.
    """
    if not defn.rivet_lines:
        return gross
    holes = hole_rects(defn)
    ids = [p.id for p in defn.parts]
    pierce = np.zeros((len(holes), len(ids)), dtype=bool)
    for j, line in enumerate(defn.rivet_lines):
        pierce[j, [ids.index(pid) for pid in line.parts]] = True
    r = gross.rects
    x0 = np.maximum(r[:, None, 0], holes[None, :, 0])
    y0 = np.maximum(r[:, None, 1], holes[None, :, 1])
    x1 = np.minimum(r[:, None, 2], holes[None, :, 2])
    y1 = np.minimum(r[:, None, 3], holes[None, :, 3])
    hit = (x1 - x0 > GRID) & (y1 - y0 > GRID) & pierce[:, gross.owner].T
    i, j = np.nonzero(hit)
    cuts = np.stack([x0[i, j], y0[i, j], x1[i, j], y1[i, j]], axis=1)
    if not exact and len(cuts) > 1:
        ox = np.minimum(cuts[:, None, 2], cuts[None, :, 2]) - np.maximum(
            cuts[:, None, 0], cuts[None, :, 0]
        )
        oy = np.minimum(cuts[:, None, 3], cuts[None, :, 3]) - np.maximum(
            cuts[:, None, 1], cuts[None, :, 1]
        )
        both = (ox > GRID) & (oy > GRID)
        np.fill_diagonal(both, False)
        exact = bool(both.any())
    if exact:
        rects, owner = _deduct_holes(defn, gross.rects, gross.owner)
        keep = (rects[:, 2] - rects[:, 0] > GRID) & (rects[:, 3] - rects[:, 1] > GRID)
        return Pieces(rects[keep], owner[keep], gross.part_ids)
    return Pieces(gross.rects, gross.owner, gross.part_ids, cuts, gross.owner[i])


def hole_rects(defn: SectionDefinition) -> np.ndarray:
    """Rectangles (n, 4) swept by the rivet holes of every line, through its parts (mm)."""
    out = []
    idx = {p.id: p for p in defn.parts}
    for line in defn.rivet_lines:
        b = np.array([idx[pid].bounds for pid in line.parts])
        r = 0.5 * line.d_hole
        if line.axis == "horizontal":
            out.append((b[:, 0].min(), line.position - r, b[:, 2].max(), line.position + r))
        else:
            out.append((line.position - r, b[:, 1].min(), line.position + r, b[:, 3].max()))
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
