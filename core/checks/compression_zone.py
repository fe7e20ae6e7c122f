"""The compression flange of a girder section, as the buckling checks see it, by the engine.

From the exact section of one station (:class:`core.section.Section`, gross: rivet holes are
filled) this module takes what lateral-torsional and local buckling need, built from the
remaining material itself rather than from the formulas for a plate flange, so a riveted
flange (angles and cover plates) and its measured loss enter as they are:

- ``Dc``: depth of the web in compression, from the elastic neutral axis to ``y_limit``, the
  height where the web's unsupported depth ends at the compression flange (the caller's
  stated choice: for a riveted girder the toes of the flange angles' vertical legs, the
  web-to-flange rivet line, or the web plate edge).
- ``rt``: radius of gyration about the vertical axis of the compression flange plus one third
  of the web depth in compression: all material beyond yc + 2 Dc / 3. This is the definition
  behind AASHTO LRFD 6.10.8.2.3-9 (C6.10.8.2.3) and the one AISC 360-22 F4.2 gives for
  flanges with cover plates (from memory); for a plate flange it gives the formula's value
  plus the web strip's own small lateral inertia.
- ``Afc``, ``bfc``, ``Iyc`` (and the tension flange's ``Ift``): over the flange parts (by
  default every part other than the web whose centroid lies on that side of the neutral
  axis).
- ``Sxc``, ``Sxt``: elastic moduli to the extreme compression and tension fibres.
- ``J``, ``Iw``, ``beta_x``: from :mod:`core.checks.thinwalled`.

Hogging (bottom flange in compression) is the mirror image: ``compression="bottom"``.
Units mm.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np

from core.checks._inputs import internal
from core.checks.sources import choice
from core.checks.thinwalled import Warping, warping
from core.errors import GeometryError
from core.section import Section


@dataclass(frozen=True)
class CompressionFlange:
    """Buckling properties of one station's section for one sense of bending (mm).

    Attributes:
        compression: ``"top"`` or ``"bottom"``.
        yc: elastic neutral axis height. y_limit: end of the web depth in compression.
        Dc: web depth in compression. y_cut: yc +/- 2 Dc/3.
        A_rt, Iy_rt: area and lateral inertia of the material beyond y_cut. rt: their radius.
        Afc, bfc, Iyc: compression flange parts' area, width and lateral inertia.
        Aft, bft, Iyt: the same for the tension flange parts.
        Ix, Iy: of the whole section. Sxc, Sxt: moduli to the compression / tension fibres.
        h0: distance between the centroids of the two flanges' parts.
        thin: torsion and warping constants of the whole section.
        flange_parts, tension_parts: the parts counted in each flange.
    """

    compression: str
    yc: float
    y_limit: float
    Dc: float
    y_cut: float
    A_rt: float
    Iy_rt: float
    rt: float
    Afc: float
    bfc: float
    Iyc: float
    Aft: float
    bft: float
    Iyt: float
    Ix: float
    Iy: float
    Sxc: float
    Sxt: float
    h0: float
    thin: Warping
    flange_parts: tuple[str, ...]
    tension_parts: tuple[str, ...]

    @property
    def tfc(self) -> float:
        """Equivalent thickness of the compression flange Afc / bfc, mm."""
        return self.Afc / self.bfc


def _lateral(r: np.ndarray, x0: float) -> tuple[float, float, float]:
    """Area, first moment about y = 0 and inertia about x = x0 of rectangles."""
    w, h = r[:, 2] - r[:, 0], r[:, 3] - r[:, 1]
    A = w * h
    Iy = h * ((r[:, 2] - x0) ** 3 - (r[:, 0] - x0) ** 3) / 3.0
    return float(A.sum()), float(np.sum(A * (r[:, 1] + r[:, 3]) / 2.0)), float(Iy.sum())


def compression_flange(
    section: Section,
    *,
    y_limit: float,
    compression: str = "top",
    web: str = "web",
    flange_parts: Sequence[str] | None = None,
    tension_parts: Sequence[str] | None = None,
    where: str = "",
) -> CompressionFlange:
    """Buckling properties of ``section`` for bending with ``compression`` flange.

    Args:
        section: the station's gross section (rivet holes filled), as found or as built.
        y_limit: height where the web depth in compression ends (mm; see module).
        compression: ``"top"`` (sagging) or ``"bottom"`` (hogging).
        web: id of the web part. flange_parts, tension_parts: the parts of each flange
            (default: the non-web parts whose centroid lies on that side).
        where: place for messages.

    Raises:
        GeometryError: ``y_limit`` on the tension side of the neutral axis, no flange
            parts, or a section not symmetric about the web's mid-plane.
        InputError: unknown compression side or a non-finite ``y_limit``.
    """
    choice(compression, ("top", "bottom"), "compression", where=where)
    y_limit = internal(y_limit, "position", "y_limit", where=where, low=-1e6, high=1e6)
    pieces = section.pieces
    p = section.props
    rects, owner, ids = pieces.rects, pieces.owner, pieces.part_ids
    s = 1.0 if compression == "top" else -1.0
    Dc = s * (y_limit - p.yc)
    if Dc <= 0.0:
        raise GeometryError(
            f"y_limit = {y_limit:g} mm lies on the tension side of the neutral axis "
            f"(yc = {p.yc:g} mm) for {compression} flange compression",
            where=where,
        )
    x0 = p.xc
    y_cut = p.yc + s * 2.0 * Dc / 3.0
    lo = np.where(s > 0, np.maximum(rects[:, 1], y_cut), rects[:, 1])
    hi = np.where(s > 0, rects[:, 3], np.minimum(rects[:, 3], y_cut))
    keep = hi - lo > 0.0
    clipped = np.column_stack([rects[:, 0], lo, rects[:, 2], hi])[keep]
    A_rt, _, Iy_rt = _lateral(clipped, x0)
    cent = {}
    for i, pid in enumerate(ids):
        a, m, _ = _lateral(rects[owner == i], x0)
        if a > 0.0:
            cent[pid] = m / a

    def side(given: Sequence[str] | None, sign: float) -> tuple[str, ...]:
        if given is not None:
            unknown = [g for g in given if g not in ids]
            if unknown:
                raise GeometryError(
                    f"unknown flange parts {unknown}; known: {list(ids)}", where=where
                )
            return tuple(given)
        return tuple(pid for pid, yv in cent.items() if pid != web and sign * (yv - p.yc) > 0.0)

    fc, ft = side(flange_parts, s), side(tension_parts, -s)
    if not fc or not ft:
        raise GeometryError(
            "the section needs parts in both flanges (besides the web)", where=where
        )

    def flange(names: tuple[str, ...]) -> tuple[float, float, float, float]:
        sel = np.isin(owner, [ids.index(n) for n in names])
        r = rects[sel]
        A, Sx, Iy = _lateral(r, x0)
        return A, float(r[:, 2].max() - r[:, 0].min()), Iy, Sx / A

    Afc, bfc, Iyc, yfc = flange(fc)
    Aft, bft, Iyt, yft = flange(ft)
    thin = warping(rects, x0=x0, compression=compression)
    top_fibre, bot_fibre = p.S_top, p.S_bot
    Sxc, Sxt = (top_fibre, bot_fibre) if s > 0 else (bot_fibre, top_fibre)
    return CompressionFlange(
        compression=compression,
        yc=p.yc,
        y_limit=y_limit,
        Dc=Dc,
        y_cut=y_cut,
        A_rt=A_rt,
        Iy_rt=Iy_rt,
        rt=math.sqrt(Iy_rt / A_rt),
        Afc=Afc,
        bfc=bfc,
        Iyc=Iyc,
        Aft=Aft,
        bft=bft,
        Iyt=Iyt,
        Ix=p.Ix,
        Iy=p.Iy,
        Sxc=Sxc,
        Sxt=Sxt,
        h0=abs(yfc - yft),
        thin=thin,
        flange_parts=fc,
        tension_parts=ft,
    )
