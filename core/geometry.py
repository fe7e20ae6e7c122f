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

from dataclasses import dataclass
from functools import lru_cache

import numpy as np
import shapely

from core.definition import SectionDefinition, StationLoss
from core.errors import GeometryError
from core.grid import GRID, TOL
from core.grid import snap as _snap
from core.holes import (
    _cuts_may_overlap,
    _cuts_overlap,
    _deduct_holes,
    _hole_rects,
    _pair_overlap,
    hole_rects,
)
from core.parts import Angle, Plate
from core.plateloss import plate_rects

__all__ = [
    "GRID",
    "OVERLAP_AREA",
    "TOL",
    "Pieces",
    "build_pieces",
    "check_overlaps",
    "hole_rects",
    "net_pieces",
]

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
        o = _pair_overlap(r)  # o[0], o[1]: along x and along y
        tol = 1e-6
        pos, touch = o > tol, o >= -tol
        adj = (pos[0] & touch[1]) | (pos[1] & touch[0])
        label = _component_labels(adj)
        if label is None:  # one piece of material
            present = set(self.owner.tolist())
            return [tuple(p for k, p in enumerate(self.part_ids) if k in present)]
        label = np.array(label)
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


def _component_labels(adj: np.ndarray) -> list[int] | None:
    """Connected components of the graph with the symmetric, reflexive adjacency ``adj``
    (n, n): None when all nodes form one component, else each node's label, the smallest
    node index of its component (a flood fill from each node not yet reached, in order)."""
    n = len(adj)
    ii, jj = np.nonzero(adj)  # row by row, so node k's neighbours are jj[start[k]:start[k+1]]
    start = ii.searchsorted(np.arange(n + 1)).tolist()
    nb = jj.tolist()
    label = [-1] * n
    for first in range(n):
        if label[first] >= 0:
            continue
        label[first] = first
        stack = [first]
        while stack:
            k = stack.pop()
            for m in nb[start[k] : start[k + 1]]:
                if label[m] < 0:
                    label[m] = first
                    stack.append(m)
        if first == 0 and label.count(0) == n:
            return None
    return label


#: key under which the per-definition plan is kept in a definition's ``__dict__`` (and in
#: the ``__dict__`` of the pieces built with it)
_PLAN_KEY = "_asfound_section_plan"
#: key set in the ``__dict__`` of net pieces whose cuts each lie inside a piece
CUTS_WITHIN_PIECES = "_asfound_cuts_within_pieces"


class _Plan:
    """What every station of one definition shares, worked out once per definition.

    Kept in the frozen definition's ``__dict__`` (it has no slots), so it lives and dies with
    the definition and never leaks between definitions; it is built only for a definition
    whose parts do not overlap (an overlap raises every time). Arrays are read-only.

    Attributes:
        part_ids: ids of the parts, in definition order.
        known: part by id.
        contacts: per plate id, the contact intervals on its low and high face (mm).
        nominal: per part index, the rectangles with no loss (as :func:`build_pieces` makes them).
        holes: rectangles (n, 4) swept by the rivet holes of each line (mm).
        holes_t: the same, transposed (4, n).
        pierce_t: (n_parts, n_lines) True where a line passes through a part.
        cuts_may_overlap: False when no two hole cuts of any net section of this definition
            can overlap (see :func:`_cuts_may_overlap`), so the check is skipped.
        tiny_angles: True when an angle has a leg length, thickness or leg length beyond
            the thickness of 2 TOL or less, so that a leg might snap to nothing.
    """

    __slots__ = (
        "contacts",
        "cuts_may_overlap",
        "holes",
        "holes_t",
        "known",
        "nominal",
        "part_ids",
        "pierce_t",
        "tiny_angles",
    )

    def __init__(self, defn: SectionDefinition) -> None:
        self.part_ids = tuple(p.id for p in defn.parts)
        self.known = {p.id: p for p in defn.parts}
        self.contacts = _layout(defn)
        self.nominal = [
            plate_rects(p, p.t, (), (), self.contacts[p.id], defn.name)
            if isinstance(p, Plate)
            else list(p.leg_rects(p.t, p.t))
            for p in defn.parts
        ]
        self.holes = _hole_rects(defn)
        self.holes.flags.writeable = False
        self.holes_t = np.ascontiguousarray(self.holes.T)
        self.holes_t.flags.writeable = False
        index = {pid: k for k, pid in enumerate(self.part_ids)}
        pierce = np.zeros((len(self.part_ids), len(defn.rivet_lines)), dtype=bool)
        for j, line in enumerate(defn.rivet_lines):
            pierce[[index[pid] for pid in line.parts], j] = True
        pierce.flags.writeable = False
        self.pierce_t = pierce
        self.cuts_may_overlap = _cuts_may_overlap(defn, self.holes, pierce)
        self.tiny_angles = any(
            min(p.b_h, p.b_v - p.t, p.t) <= 2.0 * TOL for p in defn.parts if isinstance(p, Angle)
        )

    def __reduce__(self):
        # derived data: a pickled or copied definition carries no plan and builds its own
        return (_no_plan, ())


def _no_plan() -> None:
    return None


def _plan(defn: SectionDefinition) -> _Plan:
    """The plan of ``defn``, built on first use (raises :class:`GeometryError` on overlaps),
    kept on the instance so that later stations look it up without hashing."""
    plan = defn.__dict__.get(_PLAN_KEY)
    if plan is None:
        plan = _shared_plan(defn)
        defn.__dict__[_PLAN_KEY] = plan
    return plan


@lru_cache(maxsize=64)
def _shared_plan(defn: SectionDefinition) -> _Plan:
    """Plans by equality: a new instance equal to a recent one (a definition rebuilt from
    the same file) shares that one's plan. Errors are not cached: they raise every time."""
    return _Plan(defn)


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
    # contiguous columns broadcast much faster than strided ones
    cx0, cy0, cx1, cy1 = np.ascontiguousarray(r.T)
    x0 = np.maximum(cx0[:, None], cx0[None, :])
    y0 = np.maximum(cy0[:, None], cy0[None, :])
    x1 = np.minimum(cx1[:, None], cx1[None, :])
    y1 = np.minimum(cy1[:, None], cy1[None, :])
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
    # plain Python from here: a dozen parts, where numpy's per-call cost would dominate
    rl = r.tolist()
    plates = [(k, p) for k, p in enumerate(defn.parts) if isinstance(p, Plate)]
    bounds = _snap(np.array([p.bounds for _, p in plates], dtype=float).reshape(-1, 4)).tolist()
    contacts: dict[str, tuple[list, list]] = {}
    for (k, p), (px0, py0, px1, py1) in zip(plates, bounds, strict=True):
        horizontal = p.orientation == "horizontal"
        on_lo, on_hi = [], []
        for (x0, y0, x1, y1), o in zip(rl, owner, strict=True):
            if o == k:
                continue
            if horizontal:
                s0, s1 = max(x0, px0), min(x1, px1)
                lo_face, hi_face = abs(y1 - py0) <= TOL, abs(y0 - py1) <= TOL
            else:
                s0, s1 = max(y0, py0), min(y1, py1)
                lo_face, hi_face = abs(x1 - px0) <= TOL, abs(x0 - px1) <= TOL
            if s1 - s0 > TOL:
                if lo_face:
                    on_lo.append((s0, s1))
                if hi_face:
                    on_hi.append((s0, s1))
        contacts[p.id] = (on_lo, on_hi)
    return contacts


def check_overlaps(defn: SectionDefinition) -> None:
    """Raise :class:`GeometryError` if any two parts of the as-built section overlap."""
    _plan(defn)


def _nominal_rects(p: Plate | Angle) -> list[tuple[float, float, float, float]]:
    if isinstance(p, Plate):
        return [p.rect(p.t)]
    return list(p.leg_rects(p.t, p.t))


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
        GeometryError: overlapping parts, unknown part ids, thickness above nominal, a loss
            that removes a whole part, bands or perforations outside their plate or leg,
            perforations on angles.
    """
    loss = loss if loss is not None else StationLoss()
    where = loss.where or defn.name
    plan = _plan(defn)
    known = plan.known
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
            if kind == "perforation" and not isinstance(known[it.part], Plate):
                raise GeometryError(
                    f"a perforation can be given on a plate only; {it.part!r} is an angle "
                    "(a leg cut through is a loss band of t = 0 on that leg)",
                    where=where,
                )
            if kind == "loss band" and isinstance(known[it.part], Plate) != (it.leg is None):
                raise GeometryError(
                    f"a loss band on plate {it.part!r} has no leg"
                    if isinstance(known[it.part], Plate)
                    else f"a loss band on angle {it.part!r} needs its leg ('h' or 'v')",
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
    bands_of: dict[str, list] = {}
    for band in loss.bands:
        bands_of.setdefault(band.part, []).append(band)
    perfs_of: dict[str, list] = {}
    for perf in loss.perforations:
        perfs_of.setdefault(perf.part, []).append(perf)

    rects: list[tuple[float, float, float, float]] = []
    owner: list[int] = []
    # plate pieces are longer and thicker than TOL before snapping (see plate_rects) and
    # snapping moves a coordinate by less than GRID, so none can vanish; an angle leg can
    # only when the definition or the loss makes a dimension tiny
    may_vanish = plan.tiny_angles
    for i, p in enumerate(defn.parts):
        pid = p.id
        if isinstance(p, Plate):
            t_base = t_of.get((pid, None), p.t)
            if t_base == p.t and pid not in bands_of and pid not in perfs_of:
                prs = plan.nominal[i]  # no loss on this plate: the rectangles of the plan
            else:
                prs = plate_rects(
                    p,
                    t_base,
                    bands_of.get(pid, ()),
                    perfs_of.get(pid, ()),
                    plan.contacts[pid],
                    where,
                )
            if not prs:
                raise GeometryError(
                    "the loss removes the whole part (no material remains)",
                    where=f"{where} / part {pid!r}",
                )
        else:
            t_all = t_of.get((pid, None), p.t)
            t_h = t_of.get((pid, "h"), t_all)
            t_v = t_of.get((pid, "v"), t_all)
            cuts = bands_of.get(pid, ())
            if t_h == p.t and t_v == p.t and not cuts:
                prs = plan.nominal[i]
            elif not cuts:
                prs = p.leg_rects(t_h, t_v)
                may_vanish = may_vanish or min(t_h, t_v) <= 2.0 * TOL
            else:
                for b in cuts:
                    if b.t > p.t + TOL:
                        raise GeometryError(
                            f"loss band remaining thickness {b.t:g} mm is above the nominal "
                            f"{p.t:g} mm (allowed: 0 up to {p.t:g} mm)",
                            where=f"{where} / part {pid!r}",
                        )
                bands = [(b.leg, b.lo, b.hi, min(b.t, p.t)) for b in cuts]
                prs = p.banded_rects(t_h, t_v, bands, f"{where} / part {pid!r}")
                may_vanish = True  # a thin band or leg may leave a sliver (dropped below)
                if not prs:
                    raise GeometryError(
                        "the loss removes the whole part (no material remains)",
                        where=f"{where} / part {pid!r}",
                    )
        rects.extend(prs)
        owner.extend([i] * len(prs))
    # one flat list converts to an array several times faster than a list of tuples
    arr = _snap(np.array([v for r in rects for v in r], dtype=float).reshape(-1, 4))
    own = np.array(owner, dtype=np.intp)
    if may_vanish:
        keep = (arr[:, 2] - arr[:, 0] > GRID) & (arr[:, 3] - arr[:, 1] > GRID)
        if not keep.all():
            arr, own = arr[keep], own[keep]
    gross = Pieces(arr, own, plan.part_ids)
    # mark the pieces as this plan's, which the shortcuts of net_pieces rely on
    gross.__dict__[_PLAN_KEY] = plan
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
    plan = _plan(defn)
    r = gross.rects
    # candidate (piece, hole) pairs: the hole's line passes through the piece's part; in
    # row-major order, so the cuts come piece by piece, hole by hole
    i, j = np.nonzero(plan.pierce_t[gross.owner])
    # in columns (4, pairs): whole-row operations are much cheaper than on (pairs, 4)
    rc = np.ascontiguousarray(r.T).take(i, axis=1)
    hc = plan.holes_t.take(j, axis=1)
    c = np.empty_like(rc)
    np.maximum(rc[:2], hc[:2], out=c[:2])
    np.minimum(rc[2:], hc[2:], out=c[2:])
    size = c[2:] - c[:2]
    hit = (size[0] > GRID) & (size[1] > GRID)
    i, cuts = i[hit], np.ascontiguousarray(c[:, hit].T)
    # pieces built by build_pieces for this definition need the check only when the
    # definition allows overlapping cuts; any other pieces always get it
    check = plan.cuts_may_overlap or gross.__dict__.get(_PLAN_KEY) is not plan
    if not exact and len(cuts) > 1 and check:
        exact = _cuts_overlap(cuts)
    if exact:
        rects, owner = _deduct_holes(defn, gross.rects, gross.owner)
        keep = (rects[:, 2] - rects[:, 0] > GRID) & (rects[:, 3] - rects[:, 1] > GRID)
        return Pieces(rects[keep], owner[keep], gross.part_ids)
    net = Pieces(gross.rects, gross.owner, gross.part_ids, cuts, gross.owner.take(i))
    net.__dict__[CUTS_WITHIN_PIECES] = True  # each cut is a piece intersected with a hole
    return net
