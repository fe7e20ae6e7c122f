"""Results of an assessment, carrying units, descriptions and sources for generated tables."""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import Any

from core.checks.flags import Flag, Level, worst
from core.checks.results import CapacityResult
from core.families.measures import Rating
from core.section import StationSection
from core.survey.readings import RegionStats


@dataclass(frozen=True)
class Assumption:
    """One value the assessment used, with its source (standard and clause, "from memory",
    "engineer's input" or "common practice, no source")."""

    item: str
    value: str
    source: str


@dataclass(frozen=True)
class LimitState:
    """One limit state at one station: capacity as-built, as-found, their ratio, rating.

    Attributes:
        key: stable identifier (``"web_shear"``, ``"flexure"``, ``"rivets:web_bottom"``).
        name: in words. kind: quantity kind of the capacities (``"force"``, ``"moment"``).
        built, found: the check results (None when not applicable).
        C_built, C_found: factored capacities phi Rn in the internal unit of ``kind``.
        demand: factored load effect at the station when loads are given (unit of ``kind``).
        rating: the family's measure (rating factor, demand / capacity or utilisation).
        note: why a value is missing or what was assumed here.
        effect: the load effect the limit state resists, ``"M"`` or ``"V"`` (None: none).
        flexural: True where the family's system factor applies (flexural and axial effects).
        R_effect: as-found factored resistance in the unit of ``effect`` (N or N*mm), for
            the rating (None: not rated).
        per_effect: capacity unit per unit of the effect (1; Q/I in 1/mm for a rivet line,
            whose shear flow is q = V Q / I), to give the demand in the capacity's unit.
        at: the load effects this limit state is rated with where they are not the
            station's (a girder end: the effects at its support, whose shear is the
            reaction). None: the station's.
        part_of: the key of the limit state this one is a component of (the flexural limit
            states of the least flexure): shown and flagged with its rating, but the
            member's summary and the station's governing limit state take the whole.
        least_of: the keys of the components of a least (the flexure).
        flags: findings of the limit state itself (an element gone, a fatigue life), with
            the number that drove each.
        extra: plain data of the limit state for the JSON (fatigue lives, panels).
    """

    key: str
    name: str
    kind: str
    built: CapacityResult | None
    found: CapacityResult | None
    C_built: float | None
    C_found: float | None
    demand: float | None = None
    rating: Rating | None = None
    note: str = ""
    effect: str | None = None
    flexural: bool = False
    R_effect: float | None = None
    per_effect: float = 1.0
    at: Any = None
    part_of: str | None = None
    least_of: tuple[str, ...] = ()
    flags: tuple[Flag, ...] = ()
    extra: Mapping[str, Any] = field(default_factory=dict)

    @property
    def ratio(self) -> float | None:
        """as-found / as-built factored capacity."""
        if self.C_built is None or self.C_found is None or self.C_built <= 0:
            return None
        return self.C_found / self.C_built

    @property
    def RF(self) -> float | None:
        """The rating factor (None unless the family's measure is the rating factor)."""
        if self.rating is None or self.rating.symbol != "RF":
            return None
        return self.rating.value

    @property
    def measure(self) -> float | None:
        """The family's measure at this station (RF, D/C or U), None when not rated."""
        return None if self.rating is None else self.rating.value

    @property
    def reference(self) -> str | None:
        res = self.found or self.built
        return None if res is None else res.reference


@dataclass(frozen=True)
class StationResult:
    """Everything assessed at one station."""

    member: str
    station: str
    x: float
    built: StationSection
    found: StationSection
    stats: tuple[RegionStats, ...]
    part_loss: dict[str, float]
    limit_states: tuple[LimitState, ...]
    flags: tuple[Flag, ...]
    panel: str
    D_used: float
    tw_found: float
    V_demand: float | None = None
    notes: tuple[str, ...] = ()

    @property
    def level(self) -> Level:
        return worst(self.flags)

    def limit_state(self, key: str) -> LimitState:
        for ls in self.limit_states:
            if ls.key == key:
                return ls
        raise KeyError(f"{key!r} not among {[x.key for x in self.limit_states]}")

    @property
    def governing(self) -> LimitState | None:
        """The limit state with the worst rating (lowest RF, highest D/C or utilisation),
        else the lowest capacity ratio."""
        whole = [ls for ls in self.limit_states if ls.part_of is None]
        rated = [ls for ls in whole if ls.rating is not None]
        if rated:
            return min(rated, key=lambda ls: ls.rating.badness)
        ratioed = [ls for ls in whole if ls.ratio is not None]
        return min(ratioed, key=lambda ls: ls.ratio) if ratioed else None


@dataclass(frozen=True)
class LineSummary:
    """A rivet line along the whole member: how many rivets are not effective, and the
    longest gap between effective ones."""

    line: str
    n_rivets: int
    n_ineffective: int
    longest_gap: float | None
    gap_from: float | None
    gap_to: float | None
    pitch: float
    counts: dict[str, int]
    positions: tuple[float, ...] = ()
    states: tuple[str, ...] = ()


@dataclass(frozen=True)
class SummaryRow:
    """One row of a member's rating summary: a load case (level and load), its measure's
    worst value, where it occurs, and a consequence (e.g. a posting load) in words."""

    case: str
    load: str
    factor: str
    symbol: str
    value: float | None
    station: str
    limit_state: str
    consequence: str = ""


@dataclass(frozen=True)
class EnvelopeRow:
    """The live load envelope of one case at one station (N, N*mm) with the placements."""

    station: str
    x: float
    case: str
    M: float
    V: float
    M_at: str
    V_at: str


@dataclass(frozen=True)
class MemberResult:
    member: str
    label: str
    span: float
    stations: tuple[StationResult, ...]
    lines: tuple[LineSummary, ...]
    flags: tuple[Flag, ...]
    summary: tuple[SummaryRow, ...] = ()
    envelopes: tuple[EnvelopeRow, ...] = ()
    factors: tuple = ()
    details: Any = None
    panels: Any = None

    @property
    def level(self) -> Level:
        return worst([*self.flags, *(f for s in self.stations for f in s.flags)])


@dataclass(frozen=True)
class Assessment:
    """The whole assessment of a survey under one standard family.

    ``family`` is the :class:`core.families.base.Family` followed; ``standard`` its key and
    ``standard_title`` its name; ``flags`` are findings about the whole survey (assumed steel).
    """

    survey_id: str
    title: str
    standard: str
    standard_title: str
    unit_system: str
    members: tuple[MemberResult, ...]
    assumptions: tuple[Assumption, ...]
    problems: tuple = field(default=())
    family: object = None
    flags: tuple[Flag, ...] = ()

    @property
    def level(self) -> Level:
        return max([*(m.level for m in self.members), worst(self.flags)], default=Level.OK)

    def all_flags(self) -> list[Flag]:
        out: list[Flag] = list(self.flags)
        for m in self.members:
            out += m.flags
            for s in m.stations:
                out += s.flags
        return out
