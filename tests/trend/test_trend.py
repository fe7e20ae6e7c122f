"""The trend of synthetic repeat surveys through the real engine.

The synthetic series is a sample survey (invented demo data) with every reading 1.5 mm
thinner (so that no reading is near nominal, where the cap would hide loss) and thicker by a
known amount at earlier dates: 1.0 mm ten years before, 0.5 mm five years before, a loss of
0.1 mm/year put in by hand.
"""

from __future__ import annotations

from dataclasses import replace

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from core.assess import assess, options_from_dict
from core.survey.model import Survey
from core.trend import trend
from core.trend.crossing import ALREADY, BEYOND, CROSSES
from core.trend.errors import TrendError
from core.trend.project import projected_survey, values_of
from tests.trend.helpers import doc, shifted

THIN = -1.5


def _series(tmp_path, adds=(1.0, 0.5, 0.0), dates=("2015-09-17", "2020-09-17", "2025-09-17")):
    base = shifted(doc(), dates[-1], THIN)
    paths, surveys = [], []
    for k, (add, date) in enumerate(zip(adds, dates, strict=True)):
        d = shifted(base, date, add)
        p = tmp_path / f"s{k}.json"
        import json

        p.write_text(json.dumps(d), encoding="utf-8")
        paths.append(str(p))
        surveys.append(Survey.model_validate(d))
    return paths, surveys


def test_known_linear_rate_and_crossing_year(tmp_path):
    paths, surveys = _series(tmp_path)
    r = trend(paths, surveys=surveys, horizon=20.0, step_years=5.0)
    # 1.0 mm over the ten years: 0.1 mm/year in every region read below nominal at every date
    free = [
        (rs, rt)
        for rs, rt in zip(r.series.regions, r.rates, strict=True)
        if max(rs.t) < rs.t_nominal - 1e-9 and len(rs.t) == 3
    ]
    assert len(free) == len(r.series.regions) > 5
    for rs, rt in free:
        assert rt.method == "least squares"
        assert rt.r == pytest.approx(0.1, rel=2e-3), rs.name  # leap days move the dates
        assert rt.se == pytest.approx(0.0, abs=1e-4)
    # the projection 5 years ahead is the latest survey thinned by 0.5 mm, assessed: build
    # that survey independently and compare every measure
    opts = replace(options_from_dict({}, "test"), standard="en1993")
    thinned = Survey.model_validate(shifted(doc(), "2030-09-17", THIN - 0.5))
    direct = values_of(assess(thinned, opts))
    step5 = r.steps["central"][1]
    assert step5.dt == 5.0
    # (at stations where no region is capped at nominal at any date, so the rate is the
    # same 0.1 mm/year everywhere there)
    free_ids = {id(rs) for rs, _rt in free}
    clean = {
        sm.station
        for sm in r.series.stations
        if all(id(rs) in free_ids for rs in r.series.regions if rs.station == sm.station)
    }
    assert clean
    compared = 0
    for key, (v, _ratio) in step5.values.items():
        if key[1] in clean and v is not None and direct[key][0] is not None:
            assert v == pytest.approx(direct[key][0], rel=1e-3), key
            compared += 1
    assert compared > 5
    # a crossing within the horizon: the engine at the reported year gives the target
    # (within the linear interpolation between runs 5 years apart)
    crossed = [(t, c) for t in r.tracked for c in t.crossings if c.status == CROSSES and c.dt > 0.5]
    assert crossed, "the synthetic series should cross a threshold within 20 years"
    t, c = crossed[0]
    proj, lost = projected_survey(
        surveys[-1],
        r.series.regions,
        dict(
            ((rs.member, rs.station, rs.key), rt)
            for rs, rt in zip(r.series.regions, r.rates, strict=True)
        ),
        c.dt,
    )
    assert not lost
    v = values_of(assess(proj, opts))[(t.member, t.station, t.key)][0]
    assert v == pytest.approx(c.target.value, rel=0.05)
    # the band of an exact line is the line itself
    assert c.dt_early == pytest.approx(c.dt, abs=0.05) and c.dt_late == pytest.approx(
        c.dt, abs=0.05
    )


@given(st.integers(1, 12))
@settings(max_examples=3, deadline=None, suppress_health_check=list(HealthCheck))
def test_property_no_further_loss_no_crossing(tmp_path_factory, gap):
    """Property: a repeat survey with no further loss gives rate 0 everywhere and no
    crossing ahead (a limit state is either already past a target or never reaches it)."""
    tmp = tmp_path_factory.mktemp("same")
    paths, surveys = _series(tmp, adds=(0.0, 0.0), dates=(f"{2025 - gap}-03-01", "2025-09-17"))
    r = trend(paths, surveys=surveys, horizon=30.0, step_years=10.0)
    assert all(rt.r == 0.0 for rt in r.rates)
    assert set(r.steps) == {"central"}
    for t in r.tracked:
        assert all(v == t.at_dates[-1] for v in t.projected)
        for c in t.crossings:
            assert c.status in (ALREADY, BEYOND)


def test_a_region_that_would_be_lost_is_held_at_the_floor(tmp_path):
    """Far ahead a region would thin to nothing: it is held at the floor (its station stays,
    for what its neighbours share with it) and named as lost; no engine run is needed."""
    from core.trend.match import match_surveys
    from core.trend.project import T_FLOOR
    from core.trend.run import fit

    paths, surveys = _series(tmp_path, adds=(1.0, 0.0), dates=("2015-09-17", "2025-09-17"))
    series = match_surveys(paths, surveys)
    rates = {
        (rs.member, rs.station, rs.key): fit(rs, "linear", y0=None, B=0.5) for rs in series.regions
    }
    proj, lost = projected_survey(surveys[-1], series.regions, rates, 200.0)
    assert lost and all("would be lost" in why for why in lost.values())
    m0, m1 = surveys[-1].members[0], proj.members[0]
    assert [s.id for s in m1.stations] == [s.id for s in m0.stations]
    low = min(r.mm() for s in m1.stations for r in s.readings)
    assert low == pytest.approx(T_FLOOR, abs=1e-9)
    # nearer, nothing is lost and every reading is 0.1 mm/year x 5 years thinner
    proj5, lost5 = projected_survey(surveys[-1], series.regions, rates, 5.0)
    assert not lost5
    for s0, s5 in zip(m0.stations, proj5.members[0].stations, strict=True):
        for r0, r5 in zip(s0.readings, s5.readings, strict=True):
            assert r0.mm() - r5.mm() == pytest.approx(0.5, rel=5e-3)


def test_power_law_through_the_engine(tmp_path):
    """The power law with B = 0.5 from the year built (1910 in the sample): A is the least
    squares fit through the origin, A = sum(d tau^B) / sum(tau^2B); the loss ahead follows
    A ((tau + dt)^B - tau^B), and the statement says the exponent range is from memory."""
    from core.trend.export import model_statement

    paths, surveys = _series(tmp_path, adds=(1.0, 0.0), dates=("2015-09-17", "2025-09-17"))
    r = trend(paths, surveys=surveys, model="power", B=0.5, horizon=10.0, step_years=10.0)
    assert r.y0 == 1910 and r.B == 0.5
    rs, rt = r.series.regions[0], r.rates[0]
    tau = [y - 1910 for y in rs.years]
    d = [rs.t_nominal - t for t in rs.t]
    a_fit = (d[0] * tau[0] ** 0.5 + d[1] * tau[1] ** 0.5) / (tau[0] + tau[1])
    fitted = rt.A
    assert fitted == pytest.approx(a_fit, rel=1e-12)
    assert r.projected_t(rs, 10.0) == pytest.approx(
        rs.t[-1] - a_fit * ((tau[1] + 10) ** 0.5 - tau[1] ** 0.5), rel=1e-12
    )
    assert "from memory" in model_statement(r) and "0.3 to 0.8" in model_statement(r)
    assert set(r.steps) == {"central", "fast", "slow"}  # A has a standard error


def test_a_band_given_by_its_thickness_is_thinned_even_with_readings():
    """A loss band with both its thickness t and readings is assessed on t (the survey
    record's rule); its projection must thin t, or the band would project no loss at all
    (an optimistic trend). By hand: 1 mm lost over 10 years is 0.1 mm/year, 0.5 mm in 5."""
    from core.trend.match import RegionSeries
    from core.trend.run import fit
    from core.units import from_internal

    d = doc()
    m = d["members"][0]
    st = next(s for s in m["stations"] if any(b["id"] == "b1" for b in s["bands"]))
    band = next(b for b in st["bands"] if b["id"] == "b1")
    lu = d["survey"]["length_unit"]
    band["t"] = from_internal(6.0, "length", lu)
    latest = Survey.model_validate(d)
    rs = RegionSeries(
        m["id"], st["id"], band["part"], "b1", 12.0, (2015.0, 2025.0), (7.0, 6.0), is_band=True
    )
    rates = {(rs.member, rs.station, rs.key): fit(rs, "linear", y0=None, B=0.5)}
    proj, lost = projected_survey(latest, (rs,), rates, 5.0)
    assert not lost
    got = next(
        b
        for s in proj.document()["members"][0]["stations"]
        if s["id"] == st["id"]
        for b in s["bands"]
        if b["id"] == "b1"
    )
    assert got["t"] / from_internal(1.0, "length", lu) == pytest.approx(6.0 - 0.5, rel=1e-9)


def test_many_surveys_fit_the_report_or_are_refused_clearly(tmp_path):
    """Seven surveys give a report with narrower columns; where they cannot fit the page the
    report is refused with a trend error naming the limit, never reportlab's ValueError
    (review finding; property, no source)."""
    from core.report.trend import _date_width, write_trend_report

    years = [2004 + 3 * k for k in range(7)]
    paths, _ = _series(
        tmp_path, adds=tuple(0.2 * (6 - k) for k in range(7)), dates=[f"{y}-06-01" for y in years]
    )
    res = trend(paths, horizon=10.0, step_years=10.0)
    assert write_trend_report(res, tmp_path / "seven.pdf", "si") >= 1
    assert (tmp_path / "seven.pdf").read_bytes()[:5] == b"%PDF-"
    assert _date_width(300.0, 6) == 50.0 and _date_width(300.0, 10) == 30.0
    with pytest.raises(TrendError, match="at most 12"):
        _date_width(300.0, 13)
