"""The survey record: a survey, its members, stations and readings (pydantic v2 models).

The models mirror the interchange document (``asfound.survey`` version 2) one to one, so
``Survey.model_validate(doc).model_dump(mode="json")`` gives the document back. A version 1
document is upgraded on the way in (:mod:`core.survey.docversions`). Values are
kept **as entered**, each with its unit; the engine objects (mm, N, MPa) come only from the
accessors :meth:`Member.definition` and :meth:`Station.loss`.

Units of the document:
    ``survey.length_unit`` (e.g. "mm" or "in"): the cross-section, loss bands, perforations.
    ``survey.position_unit`` (e.g. "m" or "ft"): positions along a member (stations, rivets).
    Readings, span, stiffener spacing, material and loads carry their own units.
"""

from __future__ import annotations

import bisect
import math
from typing import Any, Literal, get_args

from pydantic import (
    BaseModel,
    ConfigDict,
    Field,
    PrivateAttr,
    model_serializer,
    model_validator,
)

from core import limits
from core.definition import SectionDefinition, StationLoss
from core.errors import InputError
from core.errors import where as join
from core.sectionfile import built_definition
from core.survey import docversions
from core.units import to_internal

FORMAT = "asfound.survey"
VERSION = 2

RivetStateName = Literal["sound", "loose", "missing", "headless"]
RIVET_STATES: tuple[str, ...] = ("sound", "loose", "missing", "headless")
Policy = Literal["mean", "minimum"]


class _Model(BaseModel):
    model_config = ConfigDict(extra="forbid", allow_inf_nan=False, validate_assignment=True)


class Quantity(_Model):
    """A number with the unit it was entered in."""

    value: float
    unit: str = Field(min_length=1)

    def to(self, kind: str, where: str = "") -> float:
        """The value in the internal unit of ``kind`` (see :data:`core.units.INTERNAL`).

        Raises:
            UnitError: unknown unit or a unit of the wrong kind.
        """
        return to_internal(self.value, self.unit, kind, where=where)


class Material(_Model):
    """Steel properties given by the engineer: yield Fy, tensile Fu, modulus E."""

    Fy: Quantity
    Fu: Quantity | None = None
    E: Quantity | None = None


class Effect(_Model):
    """A load effect at a station: shear V and bending moment M (either may be absent)."""

    V: Quantity | None = None
    M: Quantity | None = None


class StationLoads(_Model):
    """Unfactored load effects at a station: dead load of components (DC), of wearing
    surface and utilities (DW), and live load with dynamic allowance (LL_IM)."""

    DC: Effect | None = None
    DW: Effect | None = None
    LL_IM: Effect | None = None


class Axle(_Model):
    """One axle of a load train: its load and its distance from the previous axle."""

    load: Quantity
    spacing: Quantity


class SimpleSpan(_Model):
    """Uniform dead loads on a simply supported member (force per length) when no station
    effects are given: ``dc`` components (self-weight included), ``dw`` wearing surface and
    utilities. The live load is the member's ``live_load`` (version 1 kept an axle train
    here; it is moved there on reading)."""

    dc: Quantity
    dw: Quantity | None = None


# --- version 2: loads and the structure's system --------------------------------------
Use = Literal["highway", "railway", "building", "industrial"]
USES: tuple[str, ...] = ("highway", "railway", "building", "industrial")
Condition = Literal["good", "fair", "poor"]
VehicleKind = Literal["legal", "permit", "crane", "other"]
#: structure types for the system factor (our keys; each family names their rows)
StructureType = Literal[
    "welded_two_girder",
    "riveted_two_girder",
    "eyebar_truss",
    "three_girder",
    "four_girder",
    "multi_girder",
    "floorbeam",
    "stringer",
]
STRUCTURE_TYPES: tuple[str, ...] = get_args(StructureType)


class Vehicle(_Model):
    """A vehicle given by the engineer: a legal or permit truck, a crane or another axle
    train; ``axles`` from the front (the first spacing is ignored), ``im`` the dynamic
    allowance as a fraction (0.33 for 33 %)."""

    name: str = Field(min_length=1)
    kind: VehicleKind = "other"
    axles: list[Axle] = Field(min_length=1)
    im: float = Field(ge=0.0, le=1.0)


class LeverLoad(_Model):
    """A load of one lane or track for the lever rule: its distance from this girder towards
    the other (negative on an overhang) and its fraction of the lane or track."""

    offset: Quantity
    fraction: float = Field(gt=0.0, le=1.0)


class LeverRule(_Model):
    """The lever rule for a two-girder span: spacing of the girders, the loads of one lane
    or track, and the multiple presence factor (1.0 where the family has none)."""

    spacing: Quantity
    loads: list[LeverLoad] = Field(min_length=1)
    multiple_presence: float = Field(default=1.0, gt=0.0, le=2.0)


class LiveLoad(_Model):
    """Live load data of a member: the share of one lane / track / vehicle it carries
    (``distribution`` with ``distribution_basis``, or ``lever_rule`` to compute it), the
    engineer's ``vehicles``, and the data of EN 1991-2 Load Model 71 (``alpha``, ``track``
    maintenance ``careful`` or ``standard``, determinant length ``L_phi``) and Load Model 1
    (``lane_shares``: the member's share of each notional lane, lane 1 first)."""

    distribution: float | None = Field(default=None, gt=0.0, le=4.0)
    distribution_basis: str = ""
    lever_rule: LeverRule | None = None
    vehicles: list[Vehicle] = Field(default_factory=list)
    alpha: float | None = Field(default=None, ge=0.75, le=1.46)
    track: Literal["careful", "standard"] | None = None
    L_phi: Quantity | None = None
    lane_shares: list[float] | None = Field(default=None, min_length=1, max_length=6)


class RivetRun(_Model):
    """Rivets at a regular ``pitch`` from ``start`` to ``end`` (position unit), all ``state``.

    A run has at most :data:`core.limits.MAX_RIVETS_PER_LINE` rivets, counted from its
    numbers before any rivet is made (:meth:`count`; validation reports a longer run).
    """

    start: float
    end: float
    pitch: float = Field(gt=0.0)
    state: RivetStateName = "sound"

    def count(self) -> int:
        """How many rivets the run puts on the line (0 when ``end`` is before ``start``).

        Raises:
            InputError: more than :data:`core.limits.MAX_RIVETS_PER_LINE`.
        """
        n = (self.end - self.start) / self.pitch  # may be inf for extreme numbers
        if not math.isfinite(n) or n + 1e-9 >= limits.MAX_RIVETS_PER_LINE:
            many = f"{math.floor(n + 1e-9) + 1:,}" if math.isfinite(n) else "too many"
            raise InputError(
                f"the run from {self.start:g} to {self.end:g} at pitch {self.pitch:g} gives "
                f"{many} rivets, more than the limit of {limits.MAX_RIVETS_PER_LINE:,} "
                "rivets on one line"
            )
        return max(math.floor(n + 1e-9), -1) + 1


class RivetAt(_Model):
    """The state of the rivet at ``position`` (position unit) along the member."""

    position: float
    state: RivetStateName


class RivetLineStates(_Model):
    """Rivet states along one rivet line of the section: a run plus exceptions, or a list."""

    line: str = Field(min_length=1)
    run: RivetRun | None = None
    states: list[RivetAt] = Field(default_factory=list)

    def count(self) -> int:
        """Rivets of the run plus listed states (an upper bound of the line's rivets).

        Raises:
            InputError: more than :data:`core.limits.MAX_RIVETS_PER_LINE`.
        """
        n = (self.run.count() if self.run is not None else 0) + len(self.states)
        return limits.count(
            n,
            limits.MAX_RIVETS_PER_LINE,
            "rivets on one line (the run's and the listed states together)",
        )

    def expanded(self) -> list[tuple[float, str]]:
        """Every rivet as (position, state), sorted, in the position unit; an exception at
        the position of a run rivet (within 1 % of the pitch) replaces it.

        Raises:
            InputError: more rivets than :data:`core.limits.MAX_RIVETS_PER_LINE` (checked
            before any is made).
        """
        self.count()
        out: dict[float, str] = {}
        tol = 1e-9
        r, last = self.run, -1
        if r is not None:
            last = r.count() - 1
            for k in range(last + 1):
                out[round(r.start + k * r.pitch, 9)] = r.state
            tol = 0.01 * r.pitch
        extra: list[float] = []  # sorted positions of listed states that are not run rivets
        for s in self.states:
            hit = None
            q = (s.position - r.start) / r.pitch if r is not None and last >= 0 else math.nan
            if math.isfinite(q):  # the nearest rivet of the run
                p = round(r.start + min(max(round(q), 0), last) * r.pitch, 9)
                hit = p if abs(p - s.position) <= tol else None
            if hit is None:
                i = bisect.bisect_left(extra, s.position - tol)
                if i < len(extra) and abs(extra[i] - s.position) <= tol:
                    hit = extra[i]
                else:
                    bisect.insort(extra, s.position)
                    hit = s.position
            out[hit] = s.state
        return sorted(out.items())


class Reading(_Model):
    """One thickness reading on a part.

    ``region`` is ``None`` for the whole part, ``"h"``/``"v"`` for one leg of an angle, or
    the id of a loss band at the same station. ``location`` says where on the part (free
    text), ``face`` which side it was taken from, ``time`` an ISO date-time.
    ``stored_as_read`` is empty, or the reasons the entry check held the value for (it looked
    like a slip, see :mod:`core.survey.guard`) when the inspector chose to store it as read.
    """

    id: str = Field(min_length=1)
    part: str = Field(min_length=1)
    region: str | None = None
    location: str = ""
    value: float
    unit: str = Field(min_length=1)
    instrument: str = ""
    face: str = ""
    time: str = ""
    who: str = ""
    stored_as_read: str = ""

    @model_serializer(mode="wrap")
    def _optional_fields(self, handler) -> dict[str, Any]:
        """``stored_as_read`` is written only when set (older documents stay as they are)."""
        out = handler(self)
        if not out.get("stored_as_read"):
            out.pop("stored_as_read", None)
        return out

    def mm(self, where: str = "") -> float:
        """The reading in mm (raises UnitError for a unit that is not a length)."""
        return to_internal(self.value, self.unit, "length", where=where)


class Band(_Model):
    """A loss band on a plate, or on one ``leg`` ("h" or "v") of an angle, from ``lo`` to
    ``hi`` (length unit, section coordinates: heights for a web or a vertical leg, x across
    the member for a horizontal plate or leg). Its remaining thickness is ``t`` (length
    unit) or, when ``t`` is absent, the readings whose region is this band's id."""

    id: str = Field(min_length=1)
    part: str = Field(min_length=1)
    lo: float
    hi: float
    t: float | None = None
    # written only when given: a band on a plate reads as it did before angles had bands
    leg: Literal["h", "v"] | None = Field(default=None, exclude_if=lambda v: v is None)
    note: str = ""


class Perforation(_Model):
    """A hole through a plate from ``lo`` to ``hi`` (length unit) along its width."""

    id: str = Field(min_length=1)
    part: str = Field(min_length=1)
    lo: float
    hi: float
    note: str = ""


class Station(_Model):
    """A place along a member where the section was measured."""

    id: str = Field(min_length=1)
    position: float
    loads: StationLoads | None = None
    readings: list[Reading] = Field(default_factory=list)
    bands: list[Band] = Field(default_factory=list)
    perforations: list[Perforation] = Field(default_factory=list)
    notes: str = ""
    photos: list[str] = Field(default_factory=list)

    def position_mm(self, member: Member) -> float:
        """Position along the member in mm."""
        return to_internal(
            self.position, member.position_unit, "length", where=member.place(self.id)
        )

    def loss(self, member: Member, policy: Policy = "mean") -> StationLoss:
        """The section loss at this station (mm) for the engine.

        Thickness per part region comes from the readings (``policy`` "mean" by default or
        "minimum", capped at nominal, see :mod:`core.survey.readings`), plus bands and
        perforations converted to mm.

        Raises:
            InputError / UnitError / GeometryError: readings that cannot be used.
        """
        from core.survey.readings import station_loss

        return station_loss(self, member, policy)


class Member(_Model):
    """A built-up member: its as-built section (a ``core.sectionfile`` section object in
    the survey's length unit), span, stiffener spacing ``do`` (None = unstiffened),
    rivet states per line, optional simple-span dead loads and live load data, its
    condition (for the condition factor) and structure type (for the system factor), and
    its stations; its girder details (stiffeners, supports, bracing, fatigue traffic) are
    :mod:`core.survey.details`."""

    id: str = Field(min_length=1)
    label: str = ""
    span: Quantity
    do: Quantity | None = None
    section: dict[str, Any]
    rivets: list[RivetLineStates] = Field(default_factory=list)
    simple_span: SimpleSpan | None = None
    live_load: LiveLoad | None = None
    condition: Condition | None = None
    structure_type: StructureType | None = None
    stiffeners: list[Stiffener] = Field(default_factory=list, max_length=1000)
    supports: list[Support] = Field(default_factory=list, max_length=20)
    bracing: Bracing | None = None
    fatigue: FatigueData | None = None
    stations: list[Station] = Field(default_factory=list)

    @model_validator(mode="before")
    @classmethod
    def _from_version_1(cls, data: Any) -> Any:
        """A member written by version 1 (an axle train in ``simple_span``) is upgraded."""
        return docversions.upgrade_member(data) if isinstance(data, dict) else data

    _length_unit: str = PrivateAttr(default="mm")
    _position_unit: str = PrivateAttr(default="m")

    @property
    def length_unit(self) -> str:
        return self._length_unit

    @property
    def position_unit(self) -> str:
        return self._position_unit

    def place(self, station: str | None = None, *more: str) -> str:
        """A place string: ``member 'G1' / station 'S2' / ...``."""
        return join(f"member {self.id!r}", f"station {station!r}" if station else None, *more)

    def definition(self) -> SectionDefinition:
        """The as-built section in mm (via :func:`core.sectionfile.definition_from_dict`).

        Raises:
            SchemaError / GeometryError / UnitError: the section object is not valid.
        """
        sec = dict(self.section)
        sec.setdefault("name", self.label or self.id)
        return built_definition(sec, self._length_unit, self.place())

    def span_mm(self) -> float:
        return self.span.to("length", self.place() + " / span")

    def do_mm(self) -> float | None:
        """Stiffener spacing in mm, or None when the web is unstiffened."""
        return None if self.do is None else self.do.to("length", self.place() + " / do")

    def station(self, station_id: str) -> Station:
        for s in self.stations:
            if s.id == station_id:
                return s
        raise KeyError(station_id)

    def rivet_states(self, line: str) -> list[tuple[float, str]]:
        """Every rivet of ``line`` as (position in mm, state), sorted by position."""
        out: list[tuple[float, str]] = []
        for r in self.rivets:
            if r.line == line:
                out += [(to_internal(p, self._position_unit, "length"), s) for p, s in r.expanded()]
        return sorted(out)


class SurveyHeader(_Model):
    """Who, what, where and when, plus the engineer's choices for the whole survey: the
    standard family, material or year built, what the structure carries (``use``) and the
    assessment ``options`` (the same keys as an options file, see
    :mod:`core.assess.options`)."""

    id: str = Field(min_length=1)
    title: str = ""
    structure: str = ""
    location: str = ""
    owner_ref: str = ""
    inspector: str = ""
    dates: list[str] = Field(default_factory=list)
    unit_system: Literal["si", "us"] = "si"
    standard: Literal["aashto", "aisc", "en1993"] = "aashto"
    material: Material | None = None
    year_built: int | None = None
    length_unit: str = "mm"
    position_unit: str = "m"
    use: Use | None = None
    options: dict[str, Any] | None = None


class Survey(_Model):
    """The whole survey document (format ``asfound.survey``, version 2)."""

    format: Literal["asfound.survey"] = FORMAT
    version: Literal[2] = VERSION
    note: str = ""
    survey: SurveyHeader
    members: list[Member] = Field(default_factory=list)

    @model_validator(mode="before")
    @classmethod
    def _from_version_1(cls, data: Any) -> Any:
        """A version 1 document is upgraded to version 2 (:func:`docversions.upgrade`)."""
        if isinstance(data, dict) and data.get("version") == 1:
            return docversions.upgrade(data)
        return data

    def model_post_init(self, __context: Any) -> None:
        for m in self.members:
            m._length_unit = self.survey.length_unit
            m._position_unit = self.survey.position_unit

    def member(self, member_id: str) -> Member:
        for m in self.members:
            if m.id == member_id:
                return m
        raise KeyError(member_id)

    def document(self) -> dict[str, Any]:
        """The interchange document (plain JSON types)."""
        return self.model_dump(mode="json")


# the girder details use this module's base classes; imported last, then resolved
from core.survey.details import Bracing, FatigueData, Stiffener, Support  # noqa: E402

Member.model_rebuild()
Survey.model_rebuild()
