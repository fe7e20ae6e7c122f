"""Torsion and warping of built-up sections made of rectangles (the engine's pieces).

The lateral-torsional buckling checks need, beyond A and I, the St Venant torsion constant J,
the warping constant Iw (Cw), the shear centre and the monosymmetry constant beta_x of the
remaining material. They are computed here from the rectangles of the section engine
(:class:`core.geometry.Pieces`), exactly for the integrals and with the usual thin-walled
idealisation for the rest:

- J: each rectangle taken alone, J = b t³ [1/3 - 0.21 (t/b)(1 - t⁴/(12 b⁴))] (Roark's
  Formulas for Stress and Strain, 7th ed., Table 10.1 case 4; from memory). Plates riveted
  together are taken as separate (they act partly as one): the sum is conservative. A plate
  split into several rectangles along its length (at a loss band) counts an end correction
  per rectangle: more conservative still.
- Shear centre and Iw of a section symmetric about the vertical line x = x0 (an I-girder):
  the sectorial coordinate about the shear centre is w = (x - x0)(y - ys) for material on
  horizontal elements and on the web line (thin-walled theory of the I-section, e.g.
  Timoshenko and Gere 1961, Art. 5.10; from memory), so ys = int x² y dA / int x² dA and
  Iw = int x² (y - ys)² dA. For flanges alone this is the familiar
  Iw = Ifc Ift hs² / (Ifc + Ift); the angles' vertical legs, near x = x0, add little.
- beta_x = 2 y0 - (1/Ix) int y (x² + y²) dA, y from the centroid and positive towards the
  compression flange, y0 the shear centre from the centroid: positive when the larger
  flange is in compression (the sign convention of Kitipornchai and Trahair 1980 and of the
  AISC 360 Commentary to F4; Galambos writes the same with y positive downwards).
  z_j of the ENV 1993-1-1 Annex F formula is beta_x / 2.

All integrals over a rectangle [x0, x1] x [y0, y1] separate into a product of one-dimensional
polynomial integrals, so they are exact. Units: mm.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from core.checks.sources import choice
from core.errors import GeometryError


def _rects(rects: np.ndarray) -> np.ndarray:
    r = np.asarray(rects, dtype=float).reshape(-1, 4)
    if len(r) == 0:
        raise GeometryError("no material: a section needs at least one rectangle")
    w, h = r[:, 2] - r[:, 0], r[:, 3] - r[:, 1]
    if not (np.all(np.isfinite(r)) and np.all(w > 0) and np.all(h > 0)):
        raise GeometryError("rectangles must be finite with positive width and height")
    return r


def torsion_constant(rects: np.ndarray) -> float:
    """St Venant torsion constant J (mm⁴) of rectangles taken one by one (Roark; see module).

    Raises:
        GeometryError: no rectangles, or one without positive size.
    """
    r = _rects(rects)
    w, h = r[:, 2] - r[:, 0], r[:, 3] - r[:, 1]
    b, t = np.maximum(w, h), np.minimum(w, h)
    q = t / b
    return float(np.sum(b * t**3 * (1.0 / 3.0 - 0.21 * q * (1.0 - q**4 / 12.0))))


@dataclass(frozen=True)
class Warping:
    """Torsion and warping constants of a section symmetric about x = x0 (mm units).

    Attributes:
        A: area. yc: centroid height. Ix: about the horizontal centroidal axis.
        Iy: about the vertical axis x = x0 (the weak axis of an I).
        ys: shear centre height. y0: ys - yc, positive towards the compression flange.
        Iw: warping constant (mm⁶). J: torsion constant. beta_x: monosymmetry constant.
        compression: ``"top"`` or ``"bottom"``, the flange the signs refer to.
    """

    A: float
    yc: float
    Ix: float
    Iy: float
    ys: float
    y0: float
    Iw: float
    J: float
    beta_x: float
    compression: str


def warping(rects: np.ndarray, *, x0: float = 0.0, compression: str = "top") -> Warping:
    """J, shear centre, Iw and beta_x of rectangles symmetric about x = x0 (see module).

    Args:
        rects: (n, 4) rectangles xmin, ymin, xmax, ymax in mm (the engine's pieces).
        x0: the vertical axis of symmetry (the web's mid-plane), mm.
        compression: ``"top"`` (sagging) or ``"bottom"`` (hogging): which flange is in
            compression, for the signs of y0 and beta_x.

    Raises:
        GeometryError: no rectangles, or material not symmetric about x = x0 (first
            moment about it above 1e-6 of A times the width).
        InputError: ``compression`` not "top" or "bottom".
    """
    choice(compression, ("top", "bottom"), "compression")
    r = _rects(rects).copy()
    if compression == "bottom":  # mirror: y positive towards the compression flange
        r[:, [1, 3]] = -r[:, [3, 1]]
    xa, xb = r[:, 0] - x0, r[:, 2] - x0
    w, h = xb - xa, r[:, 3] - r[:, 1]
    A_i = w * h
    A = float(A_i.sum())
    width = float(xb.max() - xa.min())
    if abs(float(np.sum(h * (xb**2 - xa**2) / 2.0))) > 1e-6 * A * width:
        raise GeometryError(f"the section is not symmetric about x = {x0:g} mm")
    yc = float(np.sum(A_i * (r[:, 1] + r[:, 3]) / 2.0) / A)
    ya, yb = r[:, 1] - yc, r[:, 3] - yc
    x2 = (xb**3 - xa**3) / 3.0  # int x² dx
    Ix = float(np.sum(w * (yb**3 - ya**3) / 3.0))
    Iy = float(np.sum(x2 * h))
    y0 = float(np.sum(x2 * (yb**2 - ya**2) / 2.0) / Iy)
    Iw = float(np.sum(x2 * ((yb - y0) ** 3 - (ya - y0) ** 3) / 3.0))
    wagner = float(np.sum(x2 * (yb**2 - ya**2) / 2.0 + w * (yb**4 - ya**4) / 4.0))
    beta_x = 2.0 * y0 - wagner / Ix
    ys = yc + y0 if compression == "top" else -(yc + y0)
    yc_out = yc if compression == "top" else -yc
    return Warping(
        A=A,
        yc=yc_out,
        Ix=Ix,
        Iy=Iy,
        ys=ys,
        y0=y0,
        Iw=max(Iw, 0.0),
        J=torsion_constant(rects),
        beta_x=beta_x,
        compression=compression,
    )


def kitipornchai_trahair_beta_x(hs: float, Iyc: float, Iy: float, Ix: float) -> float:
    """Approximation beta_x = 0.9 hs (2 Iyc/Iy - 1)(1 - (Iy/Ix)²), mm (Kitipornchai and
    Trahair 1980, as quoted in the AISC 360 Commentary to F4; from memory)."""
    if not (hs > 0 and Iyc > 0 and Iy > 0 and Ix > 0) or not math.isfinite(hs + Iyc + Iy + Ix):
        raise GeometryError("hs, Iyc, Iy and Ix must be positive and finite")
    return 0.9 * hs * (2.0 * Iyc / Iy - 1.0) * (1.0 - (Iy / Ix) ** 2)
