"""What is left to measure or confirm: a checklist for the inspector, "not measured" in the report.

Each item names a member, a station where it has one, the thing in words, how many readings
it has against how many are expected, and what the assessment does meanwhile (the
consequence), so that an inspector can work down the list on site and an engineer can see
in the report what the numbers rest on.

Items, in the order a checklist shows them (our own names for their kinds):

* ``unread_station``: a station with no thickness reading at all; its as-found section is the
  as-built one.
* ``unread_part``: a part (or an angle's leg) with no reading over the whole of it at a
  station; it is taken at its nominal thickness there (no loss counted).
* ``few_readings``: a part region with fewer readings than
  :data:`core.survey.readings.MIN_READINGS` (common practice, no source).
* ``typed_band``: a loss band whose remaining thickness was entered as one value with no
  readings behind it.
* ``unwalked_line``: a rivet line of the section with no rivet states recorded; it is taken
  at its nominal pitch with every rivet sound.
* ``unread_stiffener``: a bearing stiffener with neither readings nor loss bands; it is
  taken as built in the girder end checks.
* ``end_without_station``: a support with no station within one web depth; its girder end
  is not checked (the rule of :func:`core.assess.run.attach_supports`).
* ``defaulted``: a value of the member or the survey that the assessment assumed because it
  was not given: the steel, the dead and live loads, the supports, the bracing of the top
  flange.

The list reads the record only; it never runs the assessment, so it is cheap enough to
refresh after every entry.
"""

from __future__ import annotations

from collections.abc import Iterator
from dataclasses import dataclass

from core.assess.inputs import web_geometry
from core.errors import AsfoundError, InputError
from core.errors import where as join
from core.families.liveload import NOT_RECORDED
from core.families.material import resolve_material
from core.names import line_name, part_name, place_name
from core.parts import Angle
from core.survey.model import Member, Station, Survey
from core.survey.readings import MIN_READINGS
from core.units import to_internal

KINDS: tuple[str, ...] = (
    "unread_station",
    "unread_part",
    "few_readings",
    "typed_band",
    "unwalked_line",
    "unread_stiffener",
    "end_without_station",
    "defaulted",
)

#: the checklist's headings of each kind, in words
KIND_WORDS = {
    "unread_station": "station not read",
    "unread_part": "part not read",
    "few_readings": "too few readings",
    "typed_band": "band thickness typed, not read",
    "unwalked_line": "rivet line not walked",
    "unread_stiffener": "bearing stiffener not read",
    "end_without_station": "girder end without a station",
    "defaulted": "assumed, not given",
}

_NOMINAL = "taken at its nominal thickness: no loss counted (unconservative if it has corroded)"


@dataclass(frozen=True)
class ToMeasure:
    """One thing left to measure or confirm.

    Attributes:
        kind: one of :data:`KINDS`.
        member: the member id. station: the station id, or None for the member as a whole.
        subject: what, in words ("web", "top-left flange angle, vertical leg", "steel").
        have, want: readings there are and readings expected (None where no count applies).
        consequence: what the assessment does meanwhile, in words.
        place: ``member 'G1' / station 'S2' / part 'web'`` (ids, as in error messages).
        part, region: the part and region ids where the item is about one.
    """

    kind: str
    member: str
    station: str | None
    subject: str
    consequence: str
    place: str
    have: int | None = None
    want: int | None = None
    part: str | None = None
    region: str | None = None

    def __post_init__(self) -> None:
        if self.kind not in KINDS:
            raise InputError(f"kind {self.kind!r} is not one of {KINDS}", where=self.place)
        if self.have is not None and (self.want is None or not 0 <= self.have < self.want):
            raise InputError(
                f"have = {self.have!r} readings must be 0 or more and below want = {self.want!r}",
                where=self.place,
            )

    @property
    def words(self) -> str:
        """The item in one line: "web: 2 readings, 3 expected"."""
        count = "" if self.have is None else f": {self.have} reading(s), {self.want} expected"
        return f"{KIND_WORDS[self.kind]}: {self.subject}{count} ({self.consequence})"


@dataclass(frozen=True)
class Checklist:
    """Every item of a survey, member by member, stations in position order."""

    items: tuple[ToMeasure, ...]

    def __post_init__(self) -> None:
        object.__setattr__(self, "items", tuple(self.items))

    def __len__(self) -> int:
        return len(self.items)

    def __iter__(self) -> Iterator[ToMeasure]:
        return iter(self.items)

    def of(
        self, member: str, station: str | None = None, *, whole: bool = False
    ) -> list[ToMeasure]:
        """The items of ``member``: of one ``station``, or (``whole``) every item of it."""
        return [i for i in self.items if i.member == member and (whole or i.station == station)]

    def counts(self) -> dict[str, int]:
        """How many items of each kind (kinds with none are left out)."""
        out: dict[str, int] = {}
        for i in self.items:
            out[i.kind] = out.get(i.kind, 0) + 1
        return out


def left_to_measure(survey: Survey, standard: str | None = None) -> Checklist:
    """What is left to measure or confirm in ``survey`` (see the module docstring).

    ``standard``: the family the assessment follows (default: the survey's); it decides
    what a missing steel grade defaults to.

    Raises:
        AsfoundError: a member whose section cannot be built, or a value in a wrong unit
            (the same errors as the assessment, with their place).
    """
    family = standard or survey.survey.standard
    steel = _steel(survey, family)
    items: list[ToMeasure] = []
    for m in survey.members:
        items += _member(m)
        if steel:
            items.append(
                ToMeasure(
                    "defaulted",
                    m.id,
                    None,
                    "steel (material or year built)",
                    steel,
                    join(m.place(), "survey material"),
                )
            )
    return Checklist(tuple(items))


def _position(member: Member, st: Station) -> float:
    return to_internal(st.position, member.position_unit, "length", where=member.place(st.id))


def _member(m: Member) -> list[ToMeasure]:
    defn = m.definition()
    out: list[ToMeasure] = []
    for st in sorted(m.stations, key=lambda s: _position(m, s)):
        out += _station(m, st, defn)
    walked = {r.line for r in m.rivets}
    for line in defn.rivet_lines:
        if line.id not in walked:
            out.append(
                ToMeasure(
                    "unwalked_line",
                    m.id,
                    None,
                    line_name(line.id),
                    "taken at its nominal pitch with every rivet sound",
                    m.place(None, f"line {line.id!r}"),
                )
            )
    for s in m.stiffeners:
        if s.role == "bearing" and not s.readings and not s.bands:
            out.append(
                ToMeasure(
                    "unread_stiffener",
                    m.id,
                    None,
                    f"bearing stiffener {s.id}",
                    "taken as built in the girder end checks",
                    m.place(None, f"stiffener {s.id!r}"),
                    0,
                    MIN_READINGS,
                )
            )
    out += _ends(m, defn)
    out += _member_defaults(m)
    return out


def for_station(m: Member, st: Station) -> list[ToMeasure]:
    """The items of one station alone (what the station screen marks), in checklist order.

    Raises:
        AsfoundError: the member's section cannot be built (with its place).
    """
    return _station(m, st, m.definition())


def _station(m: Member, st: Station, defn) -> list[ToMeasure]:
    place = m.place(st.id)
    if not st.readings:
        return [
            ToMeasure(
                "unread_station",
                m.id,
                st.id,
                f"station {st.id}",
                "its as-found section is the as-built one",
                place,
                0,
                MIN_READINGS,
            )
        ]
    groups: dict[tuple[str, str | None], int] = {}
    for r in st.readings:
        groups[(r.part, r.region)] = groups.get((r.part, r.region), 0) + 1
    out: list[ToMeasure] = []
    for part in defn.parts:
        if (part.id, None) in groups:
            continue
        if isinstance(part, Angle):
            legs = [g for g in ("h", "v") if (part.id, g) not in groups]
            if len(legs) == 1:
                out.append(
                    ToMeasure(
                        "unread_part",
                        m.id,
                        st.id,
                        place_name(part.id, legs[0]),
                        _NOMINAL,
                        join(place, f"part {part.id!r}", f"region {legs[0]!r}"),
                        0,
                        MIN_READINGS,
                        part.id,
                        legs[0],
                    )
                )
                continue
            if not legs:
                continue
        banded = any(k[0] == part.id for k in groups)
        out.append(
            ToMeasure(
                "unread_part",
                m.id,
                st.id,
                part_name(part.id) + (" outside its bands" if banded else ""),
                _NOMINAL,
                join(place, f"part {part.id!r}"),
                0,
                MIN_READINGS,
                part.id,
            )
        )
    for (part, region), n in groups.items():
        if n < MIN_READINGS:
            out.append(
                ToMeasure(
                    "few_readings",
                    m.id,
                    st.id,
                    place_name(part, region),
                    "its mean is uncertain; the statistics carry a note",
                    join(place, f"part {part!r}", f"region {region!r}" if region else ""),
                    n,
                    MIN_READINGS,
                    part,
                    region,
                )
            )
    for b in st.bands:
        if b.t is not None and (b.part, b.id) not in groups:
            out.append(
                ToMeasure(
                    "typed_band",
                    m.id,
                    st.id,
                    place_name(b.part, b.id),
                    "its typed thickness is used as one value with no scatter",
                    join(place, f"band {b.id!r}"),
                    0,
                    MIN_READINGS,
                    b.part,
                    b.id,
                )
            )
    return out


def _ends(m: Member, defn) -> list[ToMeasure]:
    if not m.supports:
        return [
            ToMeasure(
                "defaulted",
                m.id,
                None,
                "supports",
                "none recorded: the girder ends (bearing stiffeners, web yielding and "
                "crippling at the bearings) are not checked",
                m.place(None, "supports"),
            )
        ]
    depth = web_geometry(defn).D_web
    xs = [_position(m, st) for st in m.stations]
    out = []
    for s in m.supports:
        w = m.place(None, f"support {s.id!r}")
        x = to_internal(s.position, m.position_unit, "length", where=w)
        if not any(abs(x_st - x) <= depth for x_st in xs):
            out.append(
                ToMeasure(
                    "end_without_station",
                    m.id,
                    None,
                    f"support {s.id} at {s.position:g} {m.position_unit}",
                    f"no station within one web depth ({depth:.0f} mm): its girder end is not "
                    "checked (measure the web and the stiffener at the bearing)",
                    w,
                )
            )
    return out


def _member_defaults(m: Member) -> list[ToMeasure]:
    out = []
    w = m.place()
    if m.simple_span is None and not any(s.loads and s.loads.DC for s in m.stations):
        out.append(
            ToMeasure(
                "defaulted",
                m.id,
                None,
                "dead load",
                "none given: taken as zero, which is not conservative (the girder's own "
                "weight acts at least)",
                w,
            )
        )
    ll = m.live_load
    if (ll is None or (ll.distribution is None and ll.lever_rule is None)) and not any(
        s.loads and s.loads.LL_IM for s in m.stations
    ):
        out.append(
            ToMeasure(
                "defaulted",
                m.id,
                None,
                "live load distribution factor g",
                NOT_RECORDED,
                join(w, "live_load"),
            )
        )
    top = m.bracing.top if m.bracing is not None else None
    if top is None:
        out.append(
            ToMeasure(
                "defaulted",
                m.id,
                None,
                "bracing of the top flange",
                "not recorded: held laterally at the supports only (conservative)",
                join(w, "bracing"),
            )
        )
    return out


def _steel(survey: Survey, family: str) -> str:
    """The assumed steel in words, or "" when the survey gives it (or gives it wrongly:
    validation and the assessment report that, not this list)."""
    try:
        _, choices, assumed = resolve_material(survey, family)
    except AsfoundError:
        return ""
    return "; ".join(f"{c.item}: {c.value} ({c.source})" for c in choices) if assumed else ""
