"""Transverse stiffeners in plan, their measured end loss, and their sections by the engine.

A stiffener is seen in a horizontal cut through it: x runs along the girder, y across the
web (y = 0 is the web's mid-plane), mm. It is a pair (or one) of plates standing out from
the web faces, or of angles riveted to the web, one or two per face (two: outstanding
legs back to back), with or without fillers between the connected legs and the web (a
riveted stiffener is set out by fillers as thick as the flange angles' vertical legs).

The section that a check needs (stiffener elements, optionally with a strip of web) is built
as a :class:`core.definition.SectionDefinition` of plates and angles and its properties come
from the exact section engine (:func:`core.section.analyse`), so a measured thickness thins
the exposed faces and keeps the faying ones, as it does for a girder section.

How the measured loss of the bottom end enters (:class:`EndLoss`): the readings over the
bottom ``height`` (remaining thickness of the projecting elements and of the connected
legs, and width lost at their toes) give the as-found end section. The bearing check uses
it where it acts, at the end. The column check uses it **over the whole column length**: a
prismatic column on the weakest section. This is conservative (the elastic critical load
of a column never falls when its section grows anywhere, and the squash load is the weakest
section's in any case), and it is what we do when the loss covers only the bottom part;
the report states it (common practice, no source).

Fillers position the angles (the outstanding legs stand further out) but carry no load by
default: they are seldom fitted to bear at the ends. The engineer may count them.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import Literal

from core.checks._inputs import Number, internal, length
from core.definition import PartThickness, SectionDefinition, StationLoss
from core.errors import InputError
from core.parts import Angle, Part, Plate
from core.properties import SectionProperties
from core.section import analyse

StiffenerKind = Literal["plates", "angles"]
STIFFENER_KINDS: tuple[str, ...] = ("plates", "angles")
LOSS_OVER_LENGTH = (
    "end loss applied over the whole column length: prismatic column on the weakest "
    "(as-found end) section, conservative (common practice, no source)"
)


def _count(value: int, name: str, where: str) -> int:
    if isinstance(value, bool) or value not in (1, 2):
        raise InputError(f"{name} = {value!r} is outside the allowed values (1 or 2)", where=where)
    return int(value)


@dataclass(frozen=True)
class Stiffener:
    """A transverse stiffener, as built (mm).

    Attributes:
        kind: ``"plates"`` or ``"angles"``.
        b: projecting width: a plate's width out from the web face, or an angle's
            outstanding leg measured from its heel.
        t: thickness of the plates or of the angle legs.
        b_conn: an angle's connected leg (against the web or the filler); angles only.
        per_side: angles on each face of the web, 1 or 2 (two: back to back); plates: 1.
        sides: faces of the web carrying the stiffener: 2 (a pair) or 1.
        t_fill: filler between an angle's connected leg and the web; angles only.
        fillers_carry_load: count the fillers in the section (default no).
        name: label for messages and drawings.

    Raises:
        InputError: a dimension out of range or inconsistent (legs not longer than the
            thickness, a filler or connected leg given for plates).
    """

    kind: StiffenerKind
    b: float
    t: float
    b_conn: float = 0.0
    per_side: int = 1
    sides: int = 2
    t_fill: float = 0.0
    fillers_carry_load: bool = False
    name: str = "stiffener"

    def __post_init__(self) -> None:
        w = f"stiffener {self.name!r}"
        if self.kind not in STIFFENER_KINDS:
            raise InputError(f"kind = {self.kind!r} is not one of {list(STIFFENER_KINDS)}", where=w)
        object.__setattr__(self, "b", length(self.b, "b", where=w))
        object.__setattr__(self, "t", length(self.t, "t", where=w))
        object.__setattr__(self, "per_side", _count(self.per_side, "per_side", w))
        object.__setattr__(self, "sides", _count(self.sides, "sides", w))
        tf = internal(
            self.t_fill, "length", "t_fill", where=w, low=0.0, high=200.0, low_inclusive=True
        )
        object.__setattr__(self, "t_fill", tf)
        if self.kind == "plates":
            if self.b_conn or self.t_fill or self.per_side != 1:
                raise InputError(
                    "a plate stiffener has no connected leg, filler or second plate per face "
                    f"(b_conn = {self.b_conn!r}, t_fill = {self.t_fill!r}, per_side = "
                    f"{self.per_side!r}); give kind = 'angles' for angles",
                    where=w,
                )
            if self.t >= self.b:
                raise InputError(
                    f"t = {self.t:g} mm must be less than the projecting width b = {self.b:g} mm",
                    where=w,
                )
        else:
            object.__setattr__(self, "b_conn", length(self.b_conn, "b_conn", where=w))
            if self.t >= min(self.b, self.b_conn):
                raise InputError(
                    f"t = {self.t:g} mm must be less than both legs (b = {self.b:g} mm, "
                    f"b_conn = {self.b_conn:g} mm)",
                    where=w,
                )

    @property
    def n_projecting(self) -> int:
        """Number of projecting elements (plates or outstanding legs)."""
        return self.per_side * self.sides

    def back(self, tw: float) -> float:
        """Distance from the web's mid-plane to the back of the stiffener (its face against
        the web or the filler), mm."""
        return tw / 2.0 + self.t_fill


@dataclass(frozen=True)
class EndLoss:
    """Measured loss of a stiffener's bottom (bearing) end (mm).

    Attributes:
        height: height above the bearing that the readings cover (the report shows it;
            the checks apply the loss as described in the module docstring).
        t: remaining thickness of the projecting elements (``None``: as built).
        t_conn: remaining thickness of the angles' connected legs (``None``: as built).
        b_lost: width lost at the toe of each projecting element.
        where: place for messages (member / support / stiffener).

    Raises:
        InputError: a value out of range.
    """

    height: float
    t: float | None = None
    t_conn: float | None = None
    b_lost: float = 0.0
    where: str = field(default="", compare=False)

    def __post_init__(self) -> None:
        w = self.where or "stiffener end loss"
        object.__setattr__(self, "height", length(self.height, "height", where=w))
        if self.t is not None:
            object.__setattr__(self, "t", length(self.t, "t", where=w))
        if self.t_conn is not None:
            object.__setattr__(self, "t_conn", length(self.t_conn, "t_conn", where=w))
        bl = internal(
            self.b_lost, "length", "b_lost", where=w, low=0.0, high=2000.0, low_inclusive=True
        )
        object.__setattr__(self, "b_lost", bl)


@dataclass(frozen=True)
class Remaining:
    """What remains of the projecting elements and connected legs (mm)."""

    b: float
    t: float
    t_conn: float


def remaining(st: Stiffener, loss: EndLoss | None = None) -> Remaining:
    """The as-found projecting width and thicknesses of ``st`` with ``loss``.

    Raises:
        InputError: a remaining thickness above the nominal, or a loss that removes the
            whole projecting element.
    """
    if loss is None:
        return Remaining(st.b, st.t, st.t)
    w = loss.where or f"stiffener {st.name!r}"
    t = st.t if loss.t is None else loss.t
    tc = st.t if loss.t_conn is None else loss.t_conn
    for name, v in (("t", t), ("t_conn", tc)):
        if v > st.t * (1.0 + 1e-9):
            raise InputError(
                f"remaining thickness {name} = {v:g} mm is above the nominal {st.t:g} mm "
                f"(allowed: greater than 0 up to {st.t:g} mm)",
                where=w,
            )
    if loss.t_conn is not None and st.kind == "plates":
        raise InputError("t_conn applies to angle stiffeners only", where=w)
    b = st.b - loss.b_lost
    least = st.t if st.kind == "angles" else 0.0
    if b <= least:
        raise InputError(
            f"b_lost = {loss.b_lost:g} mm leaves {b:g} mm of the {st.b:g} mm projecting "
            f"element (it must leave more than {least:g} mm): the element is gone",
            where=w,
        )
    return Remaining(b, min(t, st.t), min(tc, st.t))


@dataclass(frozen=True)
class StiffenerSection:
    """The engine's section of a stiffener (with a web strip, if any), in plan.

    Attributes:
        definition: the parts (x along the girder, y across the web), as found.
        loss: the remaining thicknesses applied by the engine.
        props: the engine's exact properties (Ix about the centroidal axis parallel to the
            web is the one a stiffener buckles about).
        strip: length of web strip counted, mm. tw: its thickness, mm.
        kept: the projecting width counted, mm (less than the remaining one when a
            width-thickness limit trims it).
    """

    definition: SectionDefinition
    loss: StationLoss
    props: SectionProperties
    strip: float
    tw: float
    kept: Remaining

    @property
    def A(self) -> float:
        """Area, mm²."""
        return self.props.A

    def I_about(self, y0: float) -> float:
        """Moment of inertia about the line y = y0 parallel to the web, mm⁴."""
        p = self.props
        return p.Ix + p.A * (p.yc - y0) ** 2

    @property
    def I_web(self) -> float:
        """About the web's mid-plane, mm⁴."""
        return self.I_about(0.0)

    @property
    def r_web(self) -> float:
        """Radius of gyration about the web's mid-plane, mm."""
        return math.sqrt(self.I_web / self.A)

    @property
    def r(self) -> float:
        """Radius of gyration about the centroidal axis parallel to the web, mm."""
        return self.props.rx


def _parts(st: Stiffener, tw: float, b: float, strip: float) -> list[Part]:
    back = st.back(tw)
    parts: list[Part] = []
    sides = (1, -1) if st.sides == 2 else (1,)
    for sign in sides:
        tag = "a" if sign > 0 else "b"
        if st.kind == "plates":
            y = back if sign > 0 else -back - b
            parts.append(
                Plate(f"plate_{tag}", b, st.t, -st.t / 2.0, y, "vertical", role="stiffener")
            )
            continue
        for k in range(st.per_side):
            dir_x = 1 if k == 0 else -1
            parts.append(
                Angle(
                    f"angle_{tag}{k + 1}",
                    st.b_conn,
                    b,
                    st.t,
                    0.0,
                    sign * back,
                    dir_x,
                    sign,
                    role="stiffener",
                )
            )
        if st.t_fill > 0.0 and st.fillers_carry_load:
            x0 = -st.b_conn if st.per_side == 2 else 0.0
            y = tw / 2.0 if sign > 0 else -tw / 2.0 - st.t_fill
            width = st.b_conn * st.per_side
            parts.append(
                Plate(f"filler_{tag}", width, st.t_fill, x0, y, "horizontal", role="filler")
            )
    if strip > 0.0:
        parts.append(
            Plate("web_strip", strip, tw, -strip / 2.0, -tw / 2.0, "horizontal", role="web")
        )
    return parts


def stiffener_section(
    st: Stiffener,
    *,
    tw: Number,
    strip: Number = 0.0,
    loss: EndLoss | None = None,
    b_max: Number | None = None,
    where: str = "",
) -> StiffenerSection:
    """The section of ``st`` with ``loss``, plus a web strip of length ``strip``.

    Args:
        st: the stiffener as built.
        tw: web thickness (as found where the loss is), mm.
        strip: length of the web strip counted with the stiffener, mm (0: none).
        loss: the measured end loss (``None``: as built).
        b_max: largest projecting width to count, mm (a width-thickness limit); the
            outstanding part beyond it is left out.
        where: place for messages.

    Raises:
        InputError: values out of range, or a loss that removes an element.
    """
    w = where or f"stiffener {st.name!r}"
    tw = length(tw, "tw", where=w)
    strip = internal(strip, "length", "strip", where=w, low=0.0, high=20_000.0, low_inclusive=True)
    rem = remaining(st, loss)
    b = rem.b
    if b_max is not None:
        b = min(b, length(b_max, "b_max", where=w))
        if st.kind == "angles" and b <= st.t:
            b = st.t * (1.0 + 1e-6)  # the heel alone: nothing of the outstanding leg counts
    parts = _parts(st, tw, b, strip)
    thick: list[PartThickness] = []
    for p in parts:
        if p.role != "stiffener":
            continue
        if isinstance(p, Angle):
            if rem.t_conn < st.t:
                thick.append(PartThickness(p.id, rem.t_conn, "h"))
            if rem.t < st.t:
                thick.append(PartThickness(p.id, rem.t, "v"))
        elif rem.t < st.t:
            thick.append(PartThickness(p.id, rem.t))
    defn = SectionDefinition(tuple(parts), name=f"stiffener {st.name!r}")
    sl = StationLoss(tuple(thick), where=w)
    props = analyse(defn, sl).gross.props
    return StiffenerSection(defn, sl, props, strip, tw, Remaining(b, rem.t, rem.t_conn))


@dataclass(frozen=True)
class BearingArea:
    """Bearing area of the projecting elements at the stiffener's end (mm, mm²).

    Attributes:
        Apn: total bearing area. width: bearing width of one element. t: its thickness.
        n: number of elements. clip: width left out at the inner end of each element.
        flange_limited: the flange edge cut the bearing width.
    """

    Apn: float
    width: float
    t: float
    n: int
    clip: float
    flange_limited: bool


def bearing_area(
    st: Stiffener,
    *,
    tw: Number,
    loss: EndLoss | None = None,
    bf: Number | None = None,
    clip: Number = 0.0,
    where: str = "",
) -> BearingArea:
    """Area of the projecting elements in bearing at the stiffener's end, as found.

    Each projecting element bears from its inner end (the web face for a plate; beyond the
    connected leg, i.e. the heel plus the leg thickness, for an angle) plus ``clip``, out
    to its toe (after ``b_lost``) but not beyond the flange edge ``bf/2`` from the web's
    mid-plane. The connected legs are not counted (conservative: only projecting elements
    bear in the standards' wording).

    Args:
        st: the stiffener. tw: web thickness, mm. loss: the end loss.
        bf: width of the flange the stiffener bears on, mm (``None``: no limit).
        clip: width of the corner clip at each element's inner end, mm.
        where: place for messages.

    Raises:
        InputError: values out of range.
    """
    w = where or f"stiffener {st.name!r}"
    tw = length(tw, "tw", where=w)
    clip = internal(clip, "length", "clip", where=w, low=0.0, high=2000.0, low_inclusive=True)
    rem = remaining(st, loss)
    back = st.back(tw)
    outer = back + rem.b
    limited = False
    if bf is not None:
        half = length(bf, "bf", where=w) / 2.0
        if half < outer:
            outer, limited = half, True
    inner = back + (st.t if st.kind == "angles" else 0.0) + clip
    width = max(outer - inner, 0.0)
    return BearingArea(
        width * rem.t * st.n_projecting, width, rem.t, st.n_projecting, clip, limited
    )


def one_side(st: Stiffener) -> Stiffener:
    """The elements on one face of the web only (for a torsional check of one outstand)."""
    return Stiffener(
        st.kind, st.b, st.t, st.b_conn, st.per_side, 1, st.t_fill, st.fillers_carry_load, st.name
    )
