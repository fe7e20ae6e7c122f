"""Put repeat surveys of one structure in one series.

Surveys are matched by their ``structure`` (the same name, ignoring case and repeated
spaces), members by id, stations by position along the member within a tolerance (50 mm by
default), and part regions by part id and region (``None``, an angle's leg ``"h"``/``"v"``,
or a loss band's id). Each survey's date is the latest of its ``survey.dates``; dates must
rise strictly in the order the surveys are given.

The thickness of a part region at a date is the value the assessment uses for A, I and Q
(:func:`core.survey.readings.station_stats`: the mean of the readings by default, or the
minimum, capped at nominal; a band given by its thickness ``t`` takes that, capped).
"""

from __future__ import annotations

import datetime as dt
import itertools
from collections.abc import Sequence
from dataclasses import dataclass
from pathlib import Path

from core.errors import where as join
from core.survey.model import Member, Station, Survey
from core.survey.readings import station_stats
from core.trend.errors import TrendError
from core.units import to_internal

#: default tolerance on station positions, mm (common practice, no source)
TOLERANCE_MM = 50.0

Key = tuple[str, str | None]


def decimal_year(d: dt.date) -> float:
    """``d`` as a decimal year (the middle of its day): 2025-07-02 is about 2025.5."""
    start = dt.date(d.year, 1, 1).toordinal()
    days = dt.date(d.year + 1, 1, 1).toordinal() - start
    return d.year + (d.toordinal() - start + 0.5) / days


def survey_date(survey: Survey, file: str) -> dt.date:
    """The date of a survey: the latest of ``survey.dates`` (ISO dates, a time may follow).

    Raises:
        TrendError: no date, or a date that is not an ISO date, naming the file.
    """
    raw = survey.survey.dates
    if not raw:
        raise TrendError(
            "the survey has no date (survey.dates is empty); a trend needs the date of "
            "every survey",
            where=file,
        )
    out = []
    for s in raw:
        try:
            out.append(dt.date.fromisoformat(str(s).strip()[:10]))
        except ValueError:
            raise TrendError(
                f"survey date {s!r} is not an ISO date (YYYY-MM-DD)", where=file
            ) from None
    return max(out)


def _norm(s: str) -> str:
    return " ".join(s.split()).casefold()


@dataclass(frozen=True)
class RegionSeries:
    """One part region at one station through the surveys.

    Attributes:
        member, station: ids in the latest survey. part, region: the part id and region.
        t_nominal: nominal thickness, mm.
        years: decimal years of the surveys where the region was read (rising).
        t: the thickness used by the assessment at each of those years, mm.
        is_band: the region is a loss band (its ``t`` or its readings).
    """

    member: str
    station: str
    part: str
    region: str | None
    t_nominal: float
    years: tuple[float, ...]
    t: tuple[float, ...]
    is_band: bool = False

    def __post_init__(self) -> None:
        if len(self.years) != len(self.t) or not self.years:
            raise TrendError("a region series needs one thickness per year", where=self.name)
        if any(b <= a for a, b in itertools.pairwise(self.years)):
            raise TrendError(f"years {self.years} do not rise", where=self.name)
        if not self.t_nominal > 0 or any(not v >= 0 for v in self.t):
            raise TrendError(
                "the nominal thickness must be > 0 mm and every thickness >= 0 mm (0: a "
                "band fully lost)",
                where=self.name,
            )

    @property
    def key(self) -> Key:
        return (self.part, self.region)

    @property
    def name(self) -> str:
        reg = f" / region {self.region!r}" if self.region else ""
        return f"member {self.member!r} / station {self.station!r} / part {self.part!r}{reg}"

    @property
    def label(self) -> str:
        """Part and region in short words: ``web``, ``angle_bl leg h``, ``web band b1``."""
        if self.region is None:
            return self.part
        if self.region in ("h", "v") and not self.is_band:
            return f"{self.part} leg {self.region}"
        return f"{self.part} band {self.region}"


@dataclass(frozen=True)
class StationMatch:
    """A station of the latest survey and the station matched to it in every survey.

    ``ids[k]`` and ``x[k]`` (mm) are the id and position in survey ``k``.
    """

    member: str
    station: str
    ids: tuple[str, ...]
    x: tuple[float, ...]


@dataclass(frozen=True)
class Series:
    """Surveys of one structure in date order, matched.

    Attributes:
        files: the files as given. surveys: the validated surveys. dates: their dates.
        years: the dates as decimal years. structure: the structure's name (latest survey).
        stations: the matched stations of the members common to every survey.
        regions: every part region read in the latest survey at a matched station.
        notes: what was left out, in words.
        tolerance: the station position tolerance used, mm.
    """

    files: tuple[str, ...]
    surveys: tuple[Survey, ...]
    dates: tuple[dt.date, ...]
    years: tuple[float, ...]
    structure: str
    stations: tuple[StationMatch, ...]
    regions: tuple[RegionSeries, ...]
    notes: tuple[str, ...] = ()
    tolerance: float = TOLERANCE_MM

    @property
    def latest(self) -> Survey:
        return self.surveys[-1]


def region_thickness(station: Station, member: Member, policy: str = "mean") -> dict[Key, float]:
    """Thickness (mm) of every part region read at ``station``, as the assessment uses it.

    Raises:
        InputError / GeometryError / UnitError: readings that cannot be used.
    """
    out: dict[Key, float] = {}
    for s in station_stats(station, member, policy):
        out[(s.part, s.region)] = s.t_used
    defn = None
    for b in station.bands:
        if b.t is not None:
            defn = defn or member.definition()
            t = to_internal(b.t, member.length_unit, "length", where=member.place(station.id))
            out[(b.part, b.id)] = min(t, defn.part(b.part).t)
    return out


def _check_order(files: Sequence[str], dates: Sequence[dt.date]) -> None:
    for k in range(1, len(dates)):
        if dates[k] == dates[k - 1]:
            raise TrendError(
                f"surveys {files[k - 1]} and {files[k]} have the same date {dates[k]}; "
                "a trend needs surveys made at different dates"
            )
        if dates[k] < dates[k - 1]:
            raise TrendError(
                f"dates out of order: {files[k - 1]} is dated {dates[k - 1]} and the next "
                f"survey {files[k]} {dates[k]}; give the surveys oldest first"
            )


def _match_station(
    st: Station, x: float, member: Member, file: str, tol: float, latest_file: str
) -> Station:
    best, best_dx = None, float("inf")
    for other in member.stations:
        d = abs(other.position_mm(member) - x)
        if d < best_dx:
            best, best_dx = other, d
    if best is None or best_dx > tol:
        near = (
            f"the nearest is station {best.id!r}, {best_dx:.0f} mm away"
            if best is not None
            else "the member has no stations"
        )
        raise TrendError(
            f"station {st.id!r} of {latest_file} at {x:.0f} mm along the member has no "
            f"station within {tol:g} mm in this survey ({near}); give a larger tolerance "
            "or correct the positions",
            where=join(file, f"member {member.id!r}", f"station {st.id!r}"),
        )
    return best


def match_surveys(
    files: Sequence[str | Path],
    surveys: Sequence[Survey],
    *,
    tolerance: float = TOLERANCE_MM,
    policy: str = "mean",
) -> Series:
    """Match surveys given oldest first (see the module docstring).

    Args:
        files: the files the surveys came from (for messages).
        surveys: the validated surveys, oldest first, at least two.
        tolerance: largest distance between matched station positions, mm (> 0).
        policy: "mean" or "minimum", the thickness statistic of the assessment.

    Raises:
        TrendError: fewer than two surveys, a missing date, dates out of order or equal,
        different structures, no member common to all, a station without a match, two
        stations matched to one, or a part whose nominal thickness differs.
    """
    names = tuple(str(f) for f in files)
    if len(surveys) != len(names) or len(surveys) < 2:
        raise TrendError(f"a trend needs two or more surveys ({len(surveys)} given)")
    if not tolerance > 0 or tolerance == float("inf"):
        raise TrendError(f"station tolerance {tolerance!r} mm must be a finite number > 0")
    dates = tuple(survey_date(s, f) for s, f in zip(surveys, names, strict=True))
    _check_order(names, dates)
    structure = surveys[-1].survey.structure
    for s, f in zip(surveys, names, strict=True):
        if not s.survey.structure.strip():
            raise TrendError(
                "the survey does not name its structure (survey.structure is empty); "
                "surveys are matched by structure",
                where=f,
            )
        if _norm(s.survey.structure) != _norm(structure):
            raise TrendError(
                f"different structures: {s.survey.structure!r} here, {structure!r} in "
                f"{names[-1]}; a trend compares surveys of one structure",
                where=f,
            )
    latest = surveys[-1]
    notes: list[str] = []
    common = [m for m in latest.members if all(_has(s, m.id) for s in surveys[:-1])]
    for m in latest.members:
        if m not in common:
            missing = [f for s, f in zip(surveys, names, strict=True) if not _has(s, m.id)]
            notes.append(f"member {m.id!r} is not in {', '.join(missing)}: not trended")
    if not common:
        raise TrendError(
            f"no member id is in every survey (the latest, {names[-1]}, has "
            f"{[m.id for m in latest.members]})"
        )
    years = tuple(decimal_year(d) for d in dates)
    stations: list[StationMatch] = []
    regions: list[RegionSeries] = []
    for m in common:
        members = [s.member(m.id) for s in surveys]
        for st in m.stations:
            x = st.position_mm(m)
            matched: list[Station] = []
            for s_k, f, mk in zip(surveys[:-1], names[:-1], members[:-1], strict=True):
                del s_k
                matched.append(_match_station(st, x, mk, f, tolerance, names[-1]))
            matched.append(st)
            stations.append(
                StationMatch(
                    m.id,
                    st.id,
                    tuple(o.id for o in matched),
                    tuple(o.position_mm(mk) for o, mk in zip(matched, members, strict=True)),
                )
            )
            regions += _regions(m.id, st, matched, members, names, years, policy, notes)
        _check_unique(stations, m.id, names)
    return Series(
        names,
        tuple(surveys),
        dates,
        years,
        structure,
        tuple(stations),
        tuple(regions),
        tuple(notes),
        tolerance,
    )


def _has(s: Survey, member_id: str) -> bool:
    return any(m.id == member_id for m in s.members)


def _check_unique(stations: list[StationMatch], member: str, names: tuple[str, ...]) -> None:
    for k, f in enumerate(names[:-1]):
        seen: dict[str, str] = {}
        for sm in stations:
            if sm.member != member:
                continue
            other = seen.get(sm.ids[k])
            if other is not None:
                raise TrendError(
                    f"stations {other!r} and {sm.station!r} of {names[-1]} both match "
                    f"station {sm.ids[k]!r} here; give a smaller tolerance",
                    where=join(f, f"member {member!r}", f"station {sm.ids[k]!r}"),
                )
            seen[sm.ids[k]] = sm.station


def _regions(
    member_id: str,
    st: Station,
    matched: list[Station],
    members: list[Member],
    names: tuple[str, ...],
    years: tuple[float, ...],
    policy: str,
    notes: list[str],
) -> list[RegionSeries]:
    per = [region_thickness(o, mk, policy) for o, mk in zip(matched, members, strict=True)]
    defs = [mk.definition() for mk in members]
    latest_bands = {b.id for b in st.bands}
    out = []
    for key in per[-1]:
        part, region = key
        nominal = defs[-1].part(part).t
        ys, ts = [], []
        for k, t in enumerate(per):
            if key not in t:
                continue
            nk = defs[k].part(part).t
            if abs(nk - nominal) > 1e-6 * nominal:
                raise TrendError(
                    f"part {part!r} is {nk:.4g} mm thick as built here but {nominal:.4g} mm "
                    f"in {names[-1]}; the surveys describe different sections",
                    where=join(names[k], f"member {member_id!r}", f"station {matched[k].id!r}"),
                )
            ys.append(years[k])
            ts.append(t[key])
        rs = RegionSeries(
            member_id, st.id, part, region, nominal, tuple(ys), tuple(ts), region in latest_bands
        )
        out.append(rs)
    for k, t in enumerate(per[:-1]):
        for key in t:
            if key not in per[-1]:
                reg = f" / region {key[1]!r}" if key[1] else ""
                notes.append(
                    f"member {member_id!r} / station {st.id!r} / part {key[0]!r}{reg}: read in "
                    f"{names[k]} but not in the latest survey; not trended"
                )
    return out
