"""The trend of repeat surveys: rates per part region, the measure of every limit state at
each survey date and projected by the real engine, and the years its thresholds are crossed.
"""

from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from dataclasses import dataclass, replace
from pathlib import Path

from core.assess import AssessOptions, assess, options_from_dict
from core.survey import load_survey
from core.survey.model import Survey
from core.trend.crossing import Crossing, Target, first_crossing, targets
from core.trend.errors import TrendError
from core.trend.match import TOLERANCE_MM, Key, RegionSeries, Series, match_surveys
from core.trend.project import Step, projected_survey, step, values_of
from core.trend.rates import (
    B_DEFAULT,
    MODELS,
    Rate,
    Scenario,
    fit_linear,
    fit_power,
    rate_since_built,
)

HORIZON = 50.0  # years ahead, default (asfound's choice)
STEP = 5.0  # years between engine runs, default (asfound's choice)
MAX_STEPS = 100


@dataclass(frozen=True)
class Tracked:
    """One rated limit state at one station through time.

    Attributes:
        member, station (id in the latest survey), key, name: the limit state.
        symbol: the measure's symbol (RF, D/C, U). higher_is_better: True for RF.
        at_dates: the measure assessed at each survey date (None: not rated there).
        projected: the measure at each projection step (central rates).
        crossings: one per target (1 and the flag thresholds).
        ended: why the central projection of this limit state ends before the horizon.
        fast, slow: the measure at each step with every rate one standard error faster and
            slower (empty without a band).
    """

    member: str
    station: str
    key: str
    name: str
    symbol: str
    higher_is_better: bool
    at_dates: tuple[float | None, ...]
    projected: tuple[float | None, ...]
    crossings: tuple[Crossing, ...]
    ended: str = ""
    fast: tuple[float | None, ...] = ()
    slow: tuple[float | None, ...] = ()

    def crossing(self, target: float) -> Crossing:
        for c in self.crossings:
            if math.isclose(c.target.value, target):
                return c
        raise KeyError(target)


@dataclass(frozen=True)
class TrendResult:
    """Everything ``asfound trend`` reports.

    Attributes:
        series: the matched surveys. model: "linear" or "power"; B, y0: the power law's
            exponent and start year (None for linear).
        rates: the rate of each region of ``series.regions`` (same order).
        dts: projection steps, years after the latest survey (the first 0).
        steps: the engine's results per scenario ("central", and "fast" / "slow" when a
            rate has a standard error).
        tracked: every rated limit state (components of the least flexure left out: the
            flexure itself is tracked).
        family, measure: the family followed and its measure's name.
        targets: the targets of the measure. horizon, step: years.
        notes: what was left out or assumed, in words.
    """

    series: Series
    model: str
    B: float | None
    y0: float | None
    rates: tuple[Rate, ...]
    dts: tuple[float, ...]
    steps: Mapping[str, tuple[Step, ...]]
    tracked: tuple[Tracked, ...]
    family: str
    measure: str
    symbol: str
    targets: tuple[Target, ...]
    horizon: float
    step: float
    options: AssessOptions
    notes: tuple[str, ...] = ()

    @property
    def y_last(self) -> float:
        return self.series.years[-1]

    def rate_of(self, rs: RegionSeries) -> Rate:
        return self.rates[self.series.regions.index(rs)]

    def projected_t(self, rs: RegionSeries, dt: float, scenario: Scenario = "central") -> float:
        """Projected thickness of a region ``dt`` years after the latest survey, mm (>= 0)."""
        return max(rs.t[-1] - self.rate_of(rs).loss(dt, scenario), 0.0)


def _grid(horizon: float, step_years: float) -> tuple[float, ...]:
    if not (math.isfinite(horizon) and 0 < horizon <= 200):
        raise TrendError(f"horizon {horizon!r} years must be in (0, 200]")
    if not (math.isfinite(step_years) and 0.25 <= step_years <= horizon):
        raise TrendError(f"step {step_years!r} years must be from 0.25 to the horizon")
    n = math.ceil(horizon / step_years - 1e-9)
    if n > MAX_STEPS:
        raise TrendError(
            f"{n} steps of {step_years:g} years to {horizon:g} years; at most {MAX_STEPS}"
        )
    return tuple(min(k * step_years, horizon) for k in range(n + 1))


def fit(
    rs: RegionSeries, model: str, *, y0: float | None, B: float, built: float | None = None
) -> Rate:
    """The rate of one region under ``model`` (see :mod:`core.trend.rates`); a region read
    in one survey only takes the rate of its loss since ``built`` (the year corrosion
    began, None: unknown, no rate)."""
    if len(rs.years) < 2:
        return rate_since_built(
            rs.years[-1], rs.t[-1], rs.t_nominal, y0=built, model=model, B=B, where=rs.name
        )
    if model == "linear":
        return fit_linear(rs.years, rs.t, where=rs.name)
    if y0 is None:
        raise TrendError("the power law needs the year corrosion began (the year built)")
    return fit_power(rs.years, rs.t, rs.t_nominal, y0=y0, B=B, where=rs.name)


def trend(
    paths: Sequence[str | Path],
    options: AssessOptions | None = None,
    *,
    model: str = "linear",
    B: float = B_DEFAULT,
    since: float | None = None,
    tolerance: float = TOLERANCE_MM,
    horizon: float = HORIZON,
    step_years: float = STEP,
    surveys: Sequence[Survey] | None = None,
) -> TrendResult:
    """Rates and projections of repeat surveys given oldest first.

    Args:
        paths: the survey files (or field stores), oldest first.
        options: the engineer's choices (None: the latest survey's own); the latest
            survey's family when none is named; the same for every survey.
        model: "linear" or "power". B: the power law's exponent.
        since: the year corrosion began, for the power law and for the rate of a region
            read in the latest survey only (None: the year built).
        tolerance: station position tolerance, mm. horizon, step_years: years.
        surveys: the surveys already loaded from ``paths`` (None: loaded here).

    Raises:
        TrendError: surveys that cannot be matched (see :func:`match_surveys`), a bad
        model, horizon or step; SchemaError: a survey fails validation.
    """
    if model not in MODELS:
        raise TrendError(f"corrosion model {model!r} is not one of {MODELS}")
    dts = _grid(horizon, step_years)
    names = [str(p) for p in paths]
    if surveys is None:
        if len(names) < 2:
            raise TrendError(f"a trend needs two or more surveys ({len(names)} given)")
        surveys = [load_survey(p)[0] for p in names]
    latest = surveys[-1]
    if options is None:
        options = options_from_dict(latest.survey.options or {}, f"{names[-1]} / options")
    if options.standard is None:
        options = replace(options, standard=latest.survey.standard)
    series = match_surveys(names, surveys, tolerance=tolerance, policy=options.thickness_policy)
    y0 = None
    if model == "power":
        y0 = float(since) if since is not None else latest.survey.year_built
        if y0 is None:
            raise TrendError(
                "the power law counts years from when corrosion began: the latest survey "
                "has no year built; give --since YEAR",
                where=names[-1],
            )
    built = float(since) if since is not None else latest.survey.year_built
    rates = tuple(fit(rs, model, y0=y0, B=B, built=built) for rs in series.regions)
    notes = list(series.notes) + _rate_notes(series.regions, rates)
    by_key = {
        (rs.member, rs.station, rs.key): r for rs, r in zip(series.regions, rates, strict=True)
    }
    a_last = assess(latest, options)
    at_dates = []
    for k, s in enumerate(surveys[:-1]):
        ids = {(sm.member, sm.ids[k]): sm.station for sm in series.stations}
        at_dates.append(values_of(assess(s, options), ids))
    at_dates.append(values_of(a_last))
    scen: list[Scenario] = ["central"]
    if any(r.has_band for r in rates):
        scen += ["fast", "slow"]
    steps = {sc: _run(latest, series, by_key, options, dts, sc, at_dates[-1]) for sc in scen}
    fam = a_last.family
    ms = fam.measure  # type: ignore[union-attr]
    tg = targets(ms.symbol, options.thresholds)
    tracked = _tracked(a_last, series, at_dates, steps, dts, tg, ms)
    return TrendResult(
        series,
        model,
        B if model == "power" else None,
        y0,
        rates,
        dts,
        steps,
        tracked,
        fam.name,  # type: ignore[union-attr]
        ms.name,
        ms.symbol,
        tg,
        horizon,
        step_years,
        options,
        tuple(notes),
    )


def _rate_notes(regions: Sequence[RegionSeries], rates: Sequence[Rate]) -> list[str]:
    """A note per region read in the latest survey only: its rate from the loss since
    built, or that it has no rate (held as found, its station's projection optimistic)."""
    out = []
    for rs, rt in zip(regions, rates, strict=True):
        if len(rs.years) >= 2:
            continue
        if rt.has_rate:
            out.append(f"{rs.name}: read in the latest survey only; {rt.note}")
        else:
            out.append(
                f"NO RATE: {rs.name}: {rt.note}; the projected results at station "
                f"{rs.station!r} take no further loss there. Give the year built (or "
                "--since YEAR) for a rate from the loss since built."
            )
    return out


def _run(
    latest: Survey,
    series: Series,
    rates: Mapping[tuple[str, str, Key], Rate],
    options: AssessOptions,
    dts: tuple[float, ...],
    scenario: Scenario,
    at_zero: Mapping,
) -> tuple[Step, ...]:
    out = [Step(0.0, at_zero)]
    for dt in dts[1:]:
        if all(r.loss(dt, scenario) <= 0.0 for r in rates.values()):
            # no further loss anywhere: the survey as found (a region found lost still ends
            # its station's own results)
            _proj, lost = projected_survey(
                latest, series.regions, rates, dt, scenario, options.thickness_policy
            )
            out.append(Step(dt, at_zero, "", lost))
            continue
        s = step(latest, series.regions, rates, options, dt, scenario)
        out.append(s)
        if s.end:
            break
    return tuple(out)


def _series(steps: tuple[Step, ...], key) -> tuple[list[float], list[float | None], str]:
    """Steps, measures and why the series ends early ("" when it runs to the horizon)."""
    dts, vals = [], []
    why = steps[-1].end
    for s in steps:
        if s.end:
            break
        dts.append(s.dt)
        gone = s.lost.get((key[0], key[1]))
        if gone:
            vals.append(None)
            return dts, vals, f"{gone}, {s.dt:g} years after the latest survey"
        v = s.values.get(key)
        vals.append(None if v is None else v[0])
    return dts, vals, why


def _tracked(a_last, series, at_dates, steps, dts, tg, ms) -> tuple[Tracked, ...]:
    keep = {(sm.member, sm.station) for sm in series.stations}
    out = []
    for m in a_last.members:
        for s in m.stations:
            if (m.member, s.station) not in keep:
                continue
            for ls in s.limit_states:
                if ls.part_of is not None or ls.measure is None:
                    continue
                key = (m.member, s.station, ls.key)
                cdts, cvals, cend = _series(steps["central"], key)
                crossings = []
                for t in tg:
                    st, dt = first_crossing(
                        cdts, cvals, t.value, ms.higher_is_better, ended=bool(cend)
                    )
                    band: dict[str, tuple[str, float | None]] = {}
                    for sc in ("fast", "slow"):
                        if sc in steps:
                            d2, v2, e2 = _series(steps[sc], key)
                            band[sc] = first_crossing(
                                d2, v2, t.value, ms.higher_is_better, ended=bool(e2)
                            )
                    fast, slow = band.get("fast", ("", None)), band.get("slow", ("", None))
                    crossings.append(Crossing(t, st, dt, fast[1], slow[1], fast[0], slow[0]))
                pad = (None,) * len(dts)
                proj = (tuple(cvals) + pad)[: len(dts)]
                bands = {
                    sc: (tuple(_series(steps[sc], key)[1]) + pad)[: len(dts)]
                    for sc in ("fast", "slow")
                    if sc in steps
                }
                out.append(
                    Tracked(
                        m.member,
                        s.station,
                        ls.key,
                        ls.name,
                        ms.symbol,
                        ms.higher_is_better,
                        tuple((d.get(key) or (None, None))[0] for d in at_dates),
                        proj,
                        tuple(crossings),
                        cend,
                        bands.get("fast", ()),
                        bands.get("slow", ()),
                    )
                )
    return tuple(out)
