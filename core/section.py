"""One station's sections: as-built or as-found, gross (for shear) and net (for flexure).

Shear stress, Q and shear flow use the section without rivet holes (the holes are filled by
rivets; a net section with holes through flange and web falls apart into pieces in the plane,
where VQ/It means nothing). Flexure and tension use the net section with holes deducted.
A shear section that the loss splits into pieces (a web perforation, a band worn through)
gives a finding instead of numbers.
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import cached_property

import numpy as np

from core.definition import SectionDefinition, StationLoss
from core.errors import GeometryError
from core.geometry import Pieces, build_pieces, check_overlaps, net_pieces
from core.properties import (
    Edges,
    SectionProperties,
    gross_and_net_properties,
    pieces_part_areas,
    pieces_properties_and_width,
)
from core.shear import ShearProfile, WidthProfile, shear_flow


@dataclass(frozen=True)
class Section:
    """Remaining material of one section and its exact properties (mm)."""

    pieces: Pieces
    edges: Edges
    props: SectionProperties
    width: WidthProfile

    @classmethod
    def from_pieces(cls, pieces: Pieces) -> Section:
        """The section of ``pieces`` (mm).

        Raises:
            GeometryError: the pieces have no area.
        """
        if len(pieces.rects) == 0:
            raise GeometryError("the section has no material (area is zero)")
        props, width = pieces_properties_and_width(pieces)
        return cls(pieces, Edges.deferred(pieces), props, width)

    @classmethod
    def gross_and_net(cls, gross: Pieces, net: Pieces) -> tuple[Section, Section]:
        """``from_pieces`` of a gross section and of its net section, sharing the sums over
        the gross rectangles when the net section keeps them (hole cuts apart).

        Raises:
            GeometryError: the pieces have no area.
        """
        if len(gross.rects) == 0:
            raise GeometryError("the section has no material (area is zero)")
        (gp, gw), (npr, nw) = gross_and_net_properties(gross, net)
        return (
            cls(gross, Edges.deferred(gross), gp, gw),
            cls(net, Edges.deferred(net), npr, nw),
        )

    @cached_property
    def profile(self) -> ShearProfile:
        """tau = V Q / (I t) through the depth of this section."""
        return ShearProfile(self.width, self.props.Ix)

    @cached_property
    def _part_sums(self) -> tuple[np.ndarray, np.ndarray]:
        """Per part: area (mm^2) and first moment about y = 0 (mm^3)."""
        return pieces_part_areas(self.pieces)

    @cached_property
    def part_area(self) -> dict[str, float]:
        """Remaining area of each part, mm^2."""
        A, _ = self._part_sums
        return dict(zip(self.pieces.part_ids, map(float, A), strict=True))

    def Q_of(self, part_ids) -> float:
        """First moment (mm^3) of the given parts about this section's neutral axis."""
        A, Sx = self._part_sums
        idx = [self.pieces.part_ids.index(p) for p in part_ids]
        return float(np.sum(Sx[idx]) - self.props.yc * np.sum(A[idx]))


@dataclass(frozen=True)
class StationSection:
    """The gross and net sections of a station in one state (as-built or as-found).

    Attributes:
        definition: the as-built definition.
        loss: the loss applied (empty for as-built).
        gross: section without rivet holes (shear stress, Q, shear flow).
        net: section with the rivet holes deducted (flexure, tension).
        components: connected groups of parts of the gross section.
    """

    definition: SectionDefinition
    loss: StationLoss
    gross: Section
    net: Section
    components: tuple[tuple[str, ...], ...]

    @property
    def shear_applicable(self) -> bool:
        """True when the gross section holds together in one piece."""
        return len(self.components) == 1

    @property
    def finding(self) -> str:
        """Why VQ/It is not applicable (empty when it is)."""
        if self.shear_applicable:
            return ""
        perforated = sorted({p.part for p in self.loss.perforations})
        worn = sorted({b.part for b in self.loss.bands if b.t == 0.0})
        cut = perforated + [p for p in worn if p not in perforated]
        what = (
            f"part(s) {', '.join(repr(c) for c in cut)} cut through"
            + (" (perforated)" if perforated else " (worn through)")
            if cut
            else "the loss splits the section"
        )
        groups = "; ".join("+".join(g) for g in self.components)
        return (
            f"not applicable: {what}; the section falls into {len(self.components)} "
            f"separate pieces ({groups}), so VQ/It does not describe shear across it"
        )

    def shear_flow(self, line_id: str, V: float) -> float:
        """Magnitude of the shear flow q = V Q_out / I (N/mm) across one interface (all its lines).

        Args:
            line_id: a rivet line of the definition; its ``outside`` parts define Q_out.
            V: shear force, N.

        Raises:
            GeometryError: unknown line, a line without ``outside`` parts, or a section
                that is not in one piece.
        """
        line = self.definition.rivet_line(line_id)
        if not line.outside:
            raise GeometryError(
                f"rivet line {line_id!r} names no parts outside its interface", where=self.where
            )
        if not self.shear_applicable:
            raise GeometryError(self.finding, where=self.where)
        return abs(shear_flow(V, self.gross.Q_of(line.outside), self.gross.props.Ix))

    @property
    def where(self) -> str:
        return self.loss.where or self.definition.name


def analyse(defn: SectionDefinition, loss: StationLoss | None = None) -> StationSection:
    """Build the gross and net sections of ``defn`` with ``loss`` applied.

    Args:
        defn: the as-built section definition (mm).
        loss: the station's loss (mm); ``None`` or empty gives the as-built section.

    Raises:
        GeometryError: overlapping parts, invalid loss (see :func:`core.geometry.build_pieces`).
    """
    loss = loss if loss is not None else StationLoss()
    check_overlaps(defn)
    gp = build_pieces(defn, loss)
    comps = tuple(gp.components())
    if defn.rivet_lines:
        gross, net = Section.gross_and_net(gp, net_pieces(defn, gp))
    else:
        gross = net = Section.from_pieces(gp)
    return StationSection(defn, loss, gross, net, comps)
