"""Projected surveys: the latest survey with every part region thinned by the loss its rate
gives ``years`` ahead, assessed by the real engine.

Each region keeps the scatter of its readings: every reading of the region is shifted by
the same amount, so the statistic the assessment uses (mean or minimum, capped at nominal)
falls exactly by the projected loss; a band given by its thickness ``t`` is thinned the
same way. Loss bands and perforations keep the extent found at the latest survey (their
growth is not projected), rivet states and loads are those of the latest survey. Where a
projected reading would fall below :data:`T_FLOOR` the region would be lost: it is held at
that floor, or as found where it was found thinner (a band found at t = 0, fully lost, stays
at 0; the station stays in the projected survey, because its neighbours share results
with it, e.g. the thinnest station of a web panel; taking it out would make them look
better) and the station's own limit states end there, with the reason.
"""

from __future__ import annotations

import copy
from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import Any

from core.assess import Assessment, AssessOptions, assess
from core.errors import AsfoundError
from core.survey.model import Survey
from core.trend.match import Key, RegionSeries
from core.trend.rates import Rate, Scenario
from core.units import from_internal

#: thinnest a projected reading may get before the region counts as lost, mm (common
#: practice, no source: below this a gauge reading means a hole)
T_FLOOR = 0.5

Values = dict[tuple[str, str, str], tuple[float | None, float | None]]


@dataclass(frozen=True)
class Step:
    """The engine's result ``dt`` years after the latest survey in one scenario.

    ``values[(member, station, limit state key)]`` is (measure, capacity ratio); ``end`` is
    why the projection stops here (the engine refused the projected survey), and then
    ``values`` is empty; ``lost[(member, station)]`` why a station's own results end.
    """

    dt: float
    values: Mapping[tuple[str, str, str], tuple[float | None, float | None]]
    end: str = ""
    lost: Mapping[tuple[str, str], str] = field(default_factory=dict)


def values_of(a: Assessment, stations: Mapping[tuple[str, str], str] | None = None) -> Values:
    """(measure, capacity ratio) of every limit state of an assessment, keyed by member,
    station and limit state key; ``stations`` maps (member, station id in this survey) to
    the id in the latest survey (None: the same ids)."""
    out: Values = {}
    for m in a.members:
        for s in m.stations:
            sid = s.station if stations is None else stations.get((m.member, s.station))
            if sid is None:
                continue
            for ls in s.limit_states:
                out[(m.member, sid, ls.key)] = (ls.measure, ls.ratio)
    return out


def _stat(values: list[float], policy: str) -> float:
    return min(values) if policy == "minimum" else sum(values) / len(values)


def projected_survey(
    latest: Survey,
    regions: tuple[RegionSeries, ...],
    rates: Mapping[tuple[str, str, Key], Rate],
    years: float,
    scenario: Scenario = "central",
    policy: str = "mean",
) -> tuple[Survey, dict[tuple[str, str], str]]:
    """The latest survey ``years`` ahead, and the stations where a region would be lost.

    Args:
        latest: the latest survey (not changed).
        regions: the region series (their last thickness is the latest survey's).
        rates: the rate of each region by (member, station, (part, region)).
        years: years after the latest survey (>= 0).
        scenario: "central", "fast" or "slow" (see :meth:`Rate.loss`).
        policy: the assessment's thickness statistic ("mean" or "minimum").

    Returns:
        the projected survey, and a sentence per station with a lost region (held at
        :data:`T_FLOOR` in the projected survey) naming it.
    """
    doc: dict[str, Any] = copy.deepcopy(latest.document())
    lu = latest.survey.length_unit
    members = {m["id"]: m for m in doc["members"]}
    lost: dict[tuple[str, str], str] = {}
    for rs in regions:
        rate = rates[(rs.member, rs.station, rs.key)]
        loss = rate.loss(years, scenario)
        target = rs.t[-1] - loss
        station = next(s for s in members[rs.member]["stations"] if s["id"] == rs.station)
        reads = [
            r for r in station["readings"] if r["part"] == rs.part and r.get("region") == rs.region
        ]
        if reads:
            mm = [r["value"] / from_internal(1.0, "length", r["unit"]) for r in reads]
            shift = target - _stat(mm, policy) if loss > 0.0 else 0.0
            if min(mm) + shift < T_FLOOR:
                lost.setdefault((rs.member, rs.station), _lost(rs, loss, min(mm)))
                shift = min(T_FLOOR - min(mm), 0.0)  # held at the floor, never above as found
            if shift != 0.0:
                for r, v in zip(reads, mm, strict=True):
                    r["value"] = from_internal(v + shift, "length", r["unit"])
        band = next(
            (b for b in station["bands"] if b["id"] == rs.region and b["part"] == rs.part), None
        )
        if band is not None and band.get("t") is not None:  # the band's t governs its readings
            if target < T_FLOOR:
                lost.setdefault((rs.member, rs.station), _lost(rs, loss, rs.t[-1]))
                target = min(T_FLOOR, rs.t[-1])  # held at the floor, never above as found
            if loss > 0.0:
                band["t"] = from_internal(target, "length", lu)
    return Survey.model_validate(doc), lost


def _lost(rs: RegionSeries, loss: float, found: float) -> str:
    if loss > 0.0 and found >= T_FLOOR:
        return (
            f"{rs.name}: a projected reading would fall below {T_FLOOR:g} mm (the region "
            "would be lost)"
        )
    return (
        f"{rs.name}: found at {found:.3g} mm, below {T_FLOOR:g} mm, at the latest survey "
        "(the region is lost; held as found)"
    )


def step(
    latest: Survey,
    regions: tuple[RegionSeries, ...],
    rates: Mapping[tuple[str, str, Key], Rate],
    options: AssessOptions,
    years: float,
    scenario: Scenario,
) -> Step:
    """Assess the projected survey ``years`` ahead (an engine refusal ends the projection)."""
    proj, lost = projected_survey(latest, regions, rates, years, scenario, options.thickness_policy)
    try:
        a = assess(proj, options)
    except AsfoundError as e:
        return Step(years, {}, f"the assessment refused the projected survey: {e}", lost)
    return Step(years, values_of(a), "", lost)
