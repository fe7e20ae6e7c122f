"""Loss applied to one plate: the rectangles that remain of it at a station.

A uniform remaining thickness (a gauge reading) thins only the exposed faces; where another
part lies against a face (a faying surface) that face keeps its place. Loss bands thin the
plate over their range as measured; perforations remove it.
"""

from __future__ import annotations

import itertools

from core.errors import GeometryError
from core.grid import TOL
from core.parts import Plate


def _covered(intervals: list, mid: float) -> bool:
    # a plain loop: several times faster than any() over a generator for a few intervals
    for lo, hi in intervals:  # noqa: SIM110
        if lo <= mid <= hi:
            return True
    return False


def _face_share(p: Plate) -> tuple[float, float]:
    """Share of a thickness loss taken by the low and the high face."""
    return {"centre": (0.5, 0.5), "low": (0.0, 1.0), "high": (1.0, 0.0)}[p.kept_face]


def plate_rects(
    p: Plate,
    t_base: float,
    bands_of: tuple | list,
    perfs_of: tuple | list,
    contacts: tuple[list, list],
    where: str,
) -> list[tuple[float, float, float, float]]:
    """Rectangles of a plate with its loss applied (``bands_of`` and ``perfs_of``: the loss
    bands and perforations of this plate, in the order given).

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
    for band in bands_of:
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
    for perf in perfs_of:
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
    horizontal = p.orientation == "horizontal"
    c_lo = p.y if horizontal else p.x
    c_hi = c_lo + p.t
    d = p.t - t_base
    gauge_lo, gauge_hi = s_lo * d, s_hi * d  # loss of each exposed face from the gauge reading
    band_loss = [(blo, bhi, s_lo * (p.t - bt), s_hi * (p.t - bt)) for blo, bhi, bt in bands]
    out = []
    for lo, hi in itertools.pairwise(sorted(cuts)):
        if hi - lo <= TOL:
            continue
        mid = 0.5 * (lo + hi)
        if perfs and _covered(perfs, mid):
            continue
        # a face lying against another part keeps its place (no need to look when the
        # gauge removes nothing: the loss is 0 either way)
        loss_lo = 0.0 if gauge_lo and _covered(lo_c, mid) else gauge_lo
        loss_hi = 0.0 if gauge_hi and _covered(hi_c, mid) else gauge_hi
        for blo, bhi, b_lo, b_hi in band_loss:
            if blo <= mid <= bhi:
                loss_lo = max(loss_lo, b_lo)
                loss_hi = max(loss_hi, b_hi)
        t0, t1 = c_lo + loss_lo, c_hi - loss_hi
        if t1 - t0 <= TOL:
            continue
        if horizontal:
            out.append((lo, t0, hi, t1))
        else:
            out.append((t0, lo, t1, hi))
    return out
