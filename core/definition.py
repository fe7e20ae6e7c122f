"""What a cross-section is made of: parts, rivet lines, and the loss measured at a station.

These frozen objects are the vocabulary shared by the engine, the survey record, the
interchange file and the app. The as-built section of a station is its
:class:`SectionDefinition` alone; the as-found section is the same definition plus a
:class:`StationLoss`.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Literal

from core.errors import GeometryError
from core.parts import Angle, AngleLeg, Part, Plate, check_coord, check_length

RivetAxis = Literal["horizontal", "vertical"]


@dataclass(frozen=True)
class RivetLine:
    """A line of rivets (or bolts) running along the member.

    Attributes:
        id: unique id of the line (e.g. ``"top_web"``).
        axis: direction of the rivet shanks in the section: ``"horizontal"`` (through the
            vertical angle legs and the web) or ``"vertical"`` (through horizontal angle legs
            and cover plates).
        position: the gauge: y of a horizontal line, x of a vertical line, mm.
        d: nominal rivet (shank) diameter, mm.
        d_hole: hole diameter deducted in the net section, mm (>= d).
        pitch: nominal spacing of the rivets along the member, mm.
        parts: ids of the parts the rivets pass through.
        shear_planes: number of shear planes m of each rivet (1 single, 2 double shear).
        outside: ids of the parts whose load the line transfers into the rest of the section
            (the parts beyond the interface: flange angles and cover plates for the
            web-to-angle line; cover plates for the cover-to-angle lines).
        n_lines: number of identical lines that share the interface shear flow (2 for the
            two vertical lines through a flange).
    """

    id: str
    axis: RivetAxis
    position: float
    d: float
    d_hole: float
    pitch: float
    parts: tuple[str, ...]
    shear_planes: int = 1
    outside: tuple[str, ...] = ()
    n_lines: int = 1

    def __post_init__(self) -> None:
        w = f"rivet line {self.id!r}"
        if not isinstance(self.id, str) or not self.id.strip():
            raise GeometryError(f"rivet line id {self.id!r} must be a non-empty string")
        if self.axis not in ("horizontal", "vertical"):
            raise GeometryError(f"axis {self.axis!r} is not 'horizontal' or 'vertical'", where=w)
        object.__setattr__(self, "position", check_coord(self.position, "position", w))
        object.__setattr__(self, "d", check_length(self.d, "rivet diameter d", w))
        object.__setattr__(self, "d_hole", check_length(self.d_hole, "hole diameter", w))
        object.__setattr__(self, "pitch", check_length(self.pitch, "pitch", w))
        object.__setattr__(self, "parts", tuple(self.parts))
        object.__setattr__(self, "outside", tuple(self.outside))
        if self.d_hole < self.d:
            raise GeometryError(
                f"hole diameter {self.d_hole:g} mm is smaller than the rivet diameter {self.d:g} mm",
                where=w,
            )
        if not self.parts:
            raise GeometryError("a rivet line must pass through at least one part", where=w)
        if self.shear_planes not in (1, 2, 3, 4):
            raise GeometryError(
                f"shear_planes = {self.shear_planes!r} is outside the allowed range (1 to 4)",
                where=w,
            )
        if not isinstance(self.n_lines, int) or not 1 <= self.n_lines <= 8:
            raise GeometryError(
                f"n_lines = {self.n_lines!r} is outside the allowed range (1 to 8)", where=w
            )


@dataclass(frozen=True)
class SectionDefinition:
    """The as-built cross-section: parts and rivet lines, all dimensions in mm."""

    parts: tuple[Part, ...]
    rivet_lines: tuple[RivetLine, ...] = ()
    name: str = "section"

    def __post_init__(self) -> None:
        object.__setattr__(self, "parts", tuple(self.parts))
        object.__setattr__(self, "rivet_lines", tuple(self.rivet_lines))
        if not self.parts:
            raise GeometryError("a section needs at least one part", where=self.name)
        ids = [p.id for p in self.parts]
        dup = sorted({i for i in ids if ids.count(i) > 1})
        if dup:
            raise GeometryError(f"duplicate part ids {dup}", where=self.name)
        lids = [r.id for r in self.rivet_lines]
        dup = sorted({i for i in lids if lids.count(i) > 1})
        if dup:
            raise GeometryError(f"duplicate rivet line ids {dup}", where=self.name)
        known = set(ids)
        for r in self.rivet_lines:
            unknown = [p for p in (*r.parts, *r.outside) if p not in known]
            if unknown:
                raise GeometryError(
                    f"rivet line {r.id!r} names unknown parts {unknown}; known parts: {ids}",
                    where=self.name,
                )

    def part(self, part_id: str) -> Part:
        """The part with id ``part_id``.

        Raises:
            GeometryError: no such part (the message lists the known ids).
        """
        for p in self.parts:
            if p.id == part_id:
                return p
        raise GeometryError(
            f"unknown part id {part_id!r}; known parts: {[p.id for p in self.parts]}",
            where=self.name,
        )

    def rivet_line(self, line_id: str) -> RivetLine:
        for r in self.rivet_lines:
            if r.id == line_id:
                return r
        raise GeometryError(
            f"unknown rivet line {line_id!r}; known: {[r.id for r in self.rivet_lines]}",
            where=self.name,
        )


@dataclass(frozen=True)
class PartThickness:
    """Remaining thickness of a whole part (or one leg of an angle), mm."""

    part: str
    t: float
    leg: AngleLeg | None = None

    def __post_init__(self) -> None:
        w = f"part {self.part!r}"
        object.__setattr__(self, "t", check_length(self.t, "remaining thickness", w))
        if self.leg not in (None, "h", "v"):
            raise GeometryError(f"leg {self.leg!r} is not 'h', 'v' or absent", where=w)


@dataclass(frozen=True)
class LossBand:
    """A band of a plate, or of one leg of an angle, thinned to ``t`` (mm) between ``lo``
    and ``hi`` (mm).

    ``lo`` and ``hi`` are section coordinates along the plate's width: heights (y) for a
    vertical plate such as a web, x for a horizontal plate; on an angle (``leg`` "h" or
    "v"), x along the horizontal leg and heights y along the vertical one, beyond the other
    leg's thickness (knife-edge loss at the toes, pack rust along a leg). ``t = 0`` cuts the
    plate or leg through.
    """

    part: str
    lo: float
    hi: float
    t: float
    leg: AngleLeg | None = None

    def __post_init__(self) -> None:
        w = f"loss band on part {self.part!r}"
        object.__setattr__(self, "lo", check_coord(self.lo, "lower edge lo", w))
        object.__setattr__(self, "hi", check_coord(self.hi, "upper edge hi", w))
        object.__setattr__(
            self, "t", check_length(self.t, "remaining thickness", w, allow_zero=True)
        )
        if not self.hi > self.lo:
            raise GeometryError(
                f"upper edge hi = {self.hi:g} mm must be above lower edge lo = {self.lo:g} mm",
                where=w,
            )
        if self.leg not in (None, "h", "v"):
            raise GeometryError(f"leg {self.leg!r} is not 'h', 'v' or absent", where=w)


@dataclass(frozen=True)
class Perforation:
    """A hole through a plate between ``lo`` and ``hi`` (mm) along its width at this station."""

    part: str
    lo: float
    hi: float

    def __post_init__(self) -> None:
        w = f"perforation on part {self.part!r}"
        object.__setattr__(self, "lo", check_coord(self.lo, "lower edge lo", w))
        object.__setattr__(self, "hi", check_coord(self.hi, "upper edge hi", w))
        if not self.hi > self.lo:
            raise GeometryError(
                f"upper edge hi = {self.hi:g} mm must be above lower edge lo = {self.lo:g} mm",
                where=w,
            )


@dataclass(frozen=True)
class StationLoss:
    """Section loss measured at one station. Empty means the as-built section."""

    thickness: tuple[PartThickness, ...] = ()
    bands: tuple[LossBand, ...] = ()
    perforations: tuple[Perforation, ...] = ()
    where: str = field(default="", compare=False)

    def __post_init__(self) -> None:
        object.__setattr__(self, "thickness", tuple(self.thickness))
        object.__setattr__(self, "bands", tuple(self.bands))
        object.__setattr__(self, "perforations", tuple(self.perforations))

    @property
    def is_empty(self) -> bool:
        return not (self.thickness or self.bands or self.perforations)


def riveted_girder(
    *,
    D: float,
    tw: float,
    angle_h: float,
    angle_v: float,
    angle_t: float,
    covers_top: tuple[tuple[float, float], ...] = (),
    covers_bottom: tuple[tuple[float, float], ...] | None = None,
    web_recess: float = 0.0,
    angle_bottom: tuple[float, float, float] | None = None,
    rivet_d: float | None = None,
    rivet_hole: float | None = None,
    pitch_web: float = 100.0,
    pitch_cover: float = 100.0,
    gauge_web: float | None = None,
    gauge_cover: float | None = None,
    name: str = "riveted plate girder",
) -> SectionDefinition:
    """Template of the common riveted plate girder: web plate, four flange angles, and
    0..n cover plates per flange (any of them different top and bottom).

    All arguments in mm. The web plate (depth ``D``, thickness ``tw``) is centred on x = 0
    and its bottom edge sits ``web_recess`` above the backs of the bottom angles (y = 0 is
    the back of the bottom angles). Cover plates are listed from the angles outwards as
    ``(width, thickness)``. ``angle_bottom`` gives ``(h, v, t)`` of the bottom angles when
    they differ from the top ones. Rivet lines are added when ``rivet_d`` is given: one
    horizontal line through each pair of angles and the web (double shear), and, where the
    flange has cover plates, two vertical lines through the horizontal legs and the covers.

    Raises:
        GeometryError: inconsistent dimensions (e.g. a recess larger than the angle leg).
    """
    covers_bottom = covers_top if covers_bottom is None else covers_bottom
    bh, bv, bt = angle_bottom if angle_bottom is not None else (angle_h, angle_v, angle_t)
    web_recess = check_length(web_recess, "web recess", name, allow_zero=True)
    if web_recess >= min(angle_v, bv):
        raise GeometryError(
            f"web recess {web_recess:g} mm must be less than the vertical angle legs", where=name
        )
    y_top = D + 2.0 * web_recess  # back of the top angles
    parts: list[Part] = [
        Plate("web", D, tw, -tw / 2.0, web_recess, "vertical", "centre", role="web")
    ]
    half = tw / 2.0
    parts += [
        Angle("angle_tl", angle_h, angle_v, angle_t, -half, y_top, -1, -1, role="flange_angle"),
        Angle("angle_tr", angle_h, angle_v, angle_t, half, y_top, 1, -1, role="flange_angle"),
        Angle("angle_bl", bh, bv, bt, -half, 0.0, -1, 1, role="flange_angle"),
        Angle("angle_br", bh, bv, bt, half, 0.0, 1, 1, role="flange_angle"),
    ]
    y = y_top
    top_ids = []
    for i, (w, t) in enumerate(covers_top, start=1):
        pid = f"cover_top_{i}"
        parts.append(Plate(pid, w, t, -w / 2.0, y, "horizontal", "low", role="cover"))
        top_ids.append(pid)
        y += t
    y = 0.0
    bot_ids = []
    for i, (w, t) in enumerate(covers_bottom, start=1):
        pid = f"cover_bottom_{i}"
        y -= t
        parts.append(Plate(pid, w, t, -w / 2.0, y, "horizontal", "high", role="cover"))
        bot_ids.append(pid)
    lines: list[RivetLine] = []
    if rivet_d is not None:
        dh = rivet_hole if rivet_hole is not None else rivet_d + 1.6
        gw_top = gauge_web if gauge_web is not None else 0.55 * angle_v
        gw_bot = gauge_web if gauge_web is not None else 0.55 * bv
        lines.append(
            RivetLine(
                "web_top",
                "horizontal",
                y_top - gw_top,
                rivet_d,
                dh,
                pitch_web,
                ("angle_tl", "web", "angle_tr"),
                2,
                ("angle_tl", "angle_tr", *top_ids),
                1,
            )
        )
        lines.append(
            RivetLine(
                "web_bottom",
                "horizontal",
                gw_bot,
                rivet_d,
                dh,
                pitch_web,
                ("angle_bl", "web", "angle_br"),
                2,
                ("angle_bl", "angle_br", *bot_ids),
                1,
            )
        )
        for ids, ang, leg, lab in (
            (top_ids, ("angle_tl", "angle_tr"), angle_h, "top"),
            (bot_ids, ("angle_bl", "angle_br"), bh, "bottom"),
        ):
            if not ids:
                continue
            g = gauge_cover if gauge_cover is not None else half + 0.55 * leg
            for side, a in ((-1, ang[0]), (1, ang[1])):
                lines.append(
                    RivetLine(
                        f"cover_{lab}_{'l' if side < 0 else 'r'}",
                        "vertical",
                        side * g,
                        rivet_d,
                        dh,
                        pitch_cover,
                        (a, *ids),
                        1,
                        tuple(ids),
                        2,
                    )
                )
    return SectionDefinition(tuple(parts), tuple(lines), name)
