"""The plate elements of a compression flange, as the local buckling checks see them.

A plate flange has one outstand, bfc/2. A riveted flange has several, each with its own
measured thickness, taken from the section definition and the station's loss:

- each flange angle's horizontal leg: an outstand of its full length from the heel (the
  rule for angle legs, AISC 360-22 B4.1a; from memory), conservative where a cover plate
  riveted to it shortens its free part;
- each cover plate: an outstand on each side from its edge to the nearest rivet line
  through it (B4.1a for plates: from the free edge to the first row of fasteners; from
  memory), or to the web face where no line passes through it (conservative); and the width
  between its rivet lines as an internal element;
- thickness: the plate's (or leg's) remaining thickness, and the thinnest loss band that
  overlaps the element.

The same elements serve every family; each family's check says which limits apply.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Literal

from core.checks._inputs import Number, length
from core.checks.sources import choice
from core.definition import SectionDefinition, StationLoss
from core.errors import GeometryError
from core.parts import Angle, Plate

ElementKind = Literal["outstand", "internal"]


@dataclass(frozen=True)
class FlangeElement:
    """One plate element of a compression flange (mm).

    Attributes:
        name: label (``"angle_tl horizontal leg"``, ``"cover_top_1 outstand left"``).
        b: its width: an outstand from its supported edge (web, heel or rivet line) to the
            free edge; an internal element between its rivet lines.
        t: its thickness (as found).
        kind: ``"outstand"`` or ``"internal"``.

    Raises:
        InputError: a width or thickness out of range, or an unknown kind.
    """

    name: str
    b: float
    t: float
    kind: ElementKind = "outstand"

    def __post_init__(self) -> None:
        w = f"flange element {self.name!r}"
        object.__setattr__(self, "b", length(self.b, "b", where=w))
        object.__setattr__(self, "t", length(self.t, "t", where=w))
        choice(self.kind, ("outstand", "internal"), "kind", where=w)

    @property
    def slenderness(self) -> float:
        return self.b / self.t


def plate_flange(bfc: Number, tfc: Number, name: str = "flange") -> tuple[FlangeElement]:
    """The single outstand bfc/2 of a plate flange (lambda_f = bfc / (2 tfc))."""
    return (FlangeElement(f"{name} outstand", length(bfc, "bfc") / 2.0, length(tfc, "tfc")),)


def _thickness(
    loss: StationLoss, part: str, nominal: float, leg: str | None, lo: float, hi: float
) -> float:
    t = nominal
    for th in loss.thickness:
        if th.part == part and th.leg in (None, leg):
            t = min(t, th.t)
    for band in loss.bands:
        if band.part == part and band.hi > lo and band.lo < hi:
            t = min(t, band.t)
    return t


def flange_elements(
    defn: SectionDefinition,
    loss: StationLoss | None = None,
    *,
    compression: str = "top",
    web: str = "web",
) -> tuple[FlangeElement, ...]:
    """The compression flange's plate elements of a riveted girder, as found.

    Args:
        defn: the girder section (angles and horizontal cover plates around a vertical web).
        loss: the station's loss (``None``: as built).
        compression: ``"top"`` or ``"bottom"``. web: id of the web part.

    Raises:
        GeometryError: no web part, or no flange angle or cover plate on that side.
        InputError: unknown compression side.
    """
    choice(compression, ("top", "bottom"), "compression")
    loss = loss if loss is not None else StationLoss()
    w = defn.part(web)
    if not isinstance(w, Plate) or w.orientation != "vertical":
        raise GeometryError(f"part {web!r} is not a vertical web plate", where=defn.name)
    x0, y_lo, x1, y_hi = w.bounds
    mid, xc, half_tw = 0.5 * (y_lo + y_hi), 0.5 * (x0 + x1), 0.5 * (x1 - x0)
    s = 1.0 if compression == "top" else -1.0
    out: list[FlangeElement] = []
    for p in defn.parts:
        if p.id == web:
            continue
        b = p.bounds
        if s * (0.5 * (b[1] + b[3]) - mid) <= 0.0:
            continue
        if isinstance(p, Angle):
            t = _thickness(loss, p.id, p.t, "h", -1e9, 1e9)
            out.append(FlangeElement(f"{p.id} horizontal leg", p.b_h, t))
        elif isinstance(p, Plate) and p.orientation == "horizontal":
            lines = sorted(
                r.position for r in defn.rivet_lines if r.axis == "vertical" and p.id in r.parts
            )
            left, right = lines[0] if lines else xc - half_tw, lines[-1] if lines else xc + half_tw
            a, z = p.x, p.x + p.b
            for side, lo, hi in (("left", a, left), ("right", right, z)):
                if hi - lo > 0.0:
                    t = _thickness(loss, p.id, p.t, None, lo, hi)
                    out.append(FlangeElement(f"{p.id} outstand {side}", hi - lo, t))
            if len(lines) >= 2 and right - left > 0.0:
                t = _thickness(loss, p.id, p.t, None, left, right)
                out.append(
                    FlangeElement(f"{p.id} between rivet lines", right - left, t, "internal")
                )
    if not out:
        raise GeometryError(
            f"no flange angle or cover plate in the {compression} flange", where=defn.name
        )
    return tuple(out)
