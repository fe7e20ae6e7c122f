"""A part region read in the latest survey only (its rate from the loss since built, or no
rate, flagged), and a band found fully lost (t = 0) held while the rest of the trend goes on.

The surveys are a sample survey (invented demo data) with synthetic changes put in by hand;
the expected numbers are worked by hand beside each check.
"""

from __future__ import annotations

import pytest

from core.survey.model import Survey
from core.trend import trend
from core.trend.export import method_statement, trend_dict
from core.trend.project import T_FLOOR, projected_survey
from core.trend.rates import SINCE_BUILT, rate_since_built
from tests.trend.helpers import doc, shifted

DATES = ("2015-09-17", "2025-09-17")
#: 2025-09-17 is day 260 of 365: 2025 + 259.5 / 365 = 2025.710959 (decimal_year)
Y_LAST = 2025 + 259.5 / 365


def test_rate_since_built_by_hand():
    # nominal 10.0 mm, found 8.0 mm in 2025.5, built 1995: 2.0 mm over 30.5 years
    r = rate_since_built(2025.5, 8.0, 10.0, y0=1995.0)
    assert r.method == SINCE_BUILT and r.has_rate and r.n == 1
    assert r.r == pytest.approx(2.0 / 30.5, rel=1e-12)  # 0.065574 mm/year
    assert r.se is None and not r.has_band
    assert r.loss(10.0) == pytest.approx(0.655738, rel=1e-5)
    assert "rate from the loss since built" in r.note
    # power law, B = 0.5: A = 2.0 / sqrt(30.5) = 0.362143 mm/year^0.5; ten years on the
    # further loss is A (sqrt(40.5) - sqrt(30.5)) = 0.362143 (6.363961 - 5.522681) = 0.304665
    p = rate_since_built(2025.5, 8.0, 10.0, y0=1995.0, model="power", B=0.5)
    assert p.method == SINCE_BUILT
    assert p.A is not None and round(p.A, 6) == 0.362143
    assert p.loss(10.0) == pytest.approx(0.304665, rel=1e-5)
    # found at nominal: no loss since built, rate zero (not a missing rate)
    z = rate_since_built(2025.5, 10.0, 10.0, y0=1995.0)
    assert z.has_rate and z.r == 0.0 and z.loss(20.0) == 0.0


def test_no_year_built_means_no_rate_and_says_so():
    r = rate_since_built(2025.5, 8.0, 10.0, y0=None)
    assert r.method == "no rate" and not r.has_rate and r.loss(30.0) == 0.0
    assert "year built is not known" in r.note and "optimistic" in r.note
    late = rate_since_built(2025.5, 8.0, 10.0, y0=2026.0)  # built after the survey
    assert not late.has_rate and "not before the survey" in late.note


def _pair(new_band: dict, *, year_built=1910, earlier_band: dict | None = None):
    base = shifted(doc(), DATES[-1], -1.5)
    out = []
    for k, date in enumerate(DATES):
        d = shifted(base, date, 1.0 if k == 0 else 0.0)
        d["survey"]["year_built"] = year_built
        band = new_band if k == 1 else earlier_band
        if band is not None:
            d["members"][0]["stations"][2]["bands"].append(dict(band))
        out.append(Survey.model_validate(d))
    return out


def _region(r, part, region):
    return next(
        (rs, rt)
        for rs, rt in zip(r.series.regions, r.rates, strict=True)
        if (rs.station, rs.part, rs.region) == ("S3", part, region)
    )


PIT = {"id": "pit", "part": "web", "lo": 300.0, "hi": 340.0, "t": 6.0}


def test_region_read_only_in_the_latest_survey_takes_the_loss_since_built():
    surveys = _pair(PIT)
    r = trend(["a.json", "b.json"], surveys=surveys, horizon=20.0, step_years=5.0)
    rs, rt = _region(r, "web", "pit")
    assert rs.years == (pytest.approx(Y_LAST),)
    # web 10 mm as built, band found at 6.0 mm, built 1910: 4.0 mm over 115.710959 years
    assert rt.method == SINCE_BUILT
    assert rt.r == pytest.approx(4.0 / 115.710959, rel=1e-6)  # 0.034569 mm/year
    assert r.projected_t(rs, 20.0) == pytest.approx(6.0 - 20 * 0.0345690, rel=1e-5)
    j = trend_dict(r)
    row = next(x for x in j["regions"] if (x["station"], x["region"]) == ("S3", "pit"))
    assert row["has_rate"] and row["method"] == SINCE_BUILT
    assert row["rate_mm_per_year"] == pytest.approx(0.034569, rel=1e-4)
    assert j["regions_without_rate"] == []
    assert any("rate from the loss since built" in n for n in r.notes)
    assert any("loss since built" in s for s in method_statement(r))
    # the projection thins the band: 5 years on its t is 6.0 - 5 (0.034569) = 5.827155 mm
    proj, _lost = projected_survey(surveys[-1], r.series.regions, _by_key(r), 5.0)
    band = next(b for b in proj.members[0].stations[2].bands if b.id == "pit")
    assert band.t == pytest.approx(5.827155, rel=1e-5)


def test_no_year_built_gives_no_rate_flagged_in_json_and_notes():
    surveys = _pair(PIT, year_built=None)
    r = trend(["a.json", "b.json"], surveys=surveys, horizon=20.0, step_years=5.0)
    rs, rt = _region(r, "web", "pit")
    assert not rt.has_rate and rt.method == "no rate"
    assert r.projected_t(rs, 20.0) == 6.0  # held as found, and said so
    j = trend_dict(r)
    row = next(x for x in j["regions"] if (x["station"], x["region"]) == ("S3", "pit"))
    assert row["has_rate"] is False and row["rate_mm_per_year"] is None
    assert j["regions_without_rate"] == [
        {"member": "G1", "station": "S3", "part": "web", "region": "pit"}
    ]
    flagged = [n for n in j["notes"] if n.startswith("NO RATE")]
    assert len(flagged) == 1 and "'S3'" in flagged[0] and "optimistic" in flagged[0]
    # every region read at both dates keeps its own fitted rate
    others = [rt for rs, rt in zip(r.series.regions, r.rates, strict=True) if len(rs.years) == 2]
    assert others and all(rt.method == "difference quotient" for rt in others)


def _by_key(r):
    pairs = zip(r.series.regions, r.rates, strict=True)
    return {(rs.member, rs.station, rs.key): rt for rs, rt in pairs}


def test_a_band_found_fully_lost_is_held_and_the_rest_goes_on():
    gone = {"id": "gone", "part": "web", "lo": 300.0, "hi": 340.0, "t": 0.0}
    surveys = _pair(gone, earlier_band={**gone, "t": 3.0})
    r = trend(["a.json", "b.json"], surveys=surveys, horizon=20.0, step_years=5.0)
    rs, rt = _region(r, "web", "gone")
    assert rs.t == (3.0, 0.0)
    assert rt.r == pytest.approx(0.3, rel=1e-9)  # 3.0 mm over the ten years, by hand
    # projected: held as found (0 mm, never raised to the floor), the station's own
    # results end at the first step with the reason; the other stations go on
    proj, lost = projected_survey(surveys[-1], r.series.regions, _by_key(r), 5.0)
    band = next(b for b in proj.members[0].stations[2].bands if b.id == "gone")
    assert band.t == 0.0 < T_FLOOR
    assert "found at 0 mm" in lost[("G1", "S3")] and list(lost) == [("G1", "S3")]
    s3 = [t for t in r.tracked if t.station == "S3"]
    assert s3 and all(t.projected[0] is not None for t in s3)  # as found, assessed
    assert all(t.projected[1] is None and "lost" in t.ended for t in s3)
    rest = [t for t in r.tracked if t.station != "S3"]
    going = [t for t in rest if t.projected[0] is not None]
    assert going and all(t.projected[1] is not None for t in going)  # 5 years on


def test_the_report_shows_no_rate_where_a_region_has_none(tmp_path):
    """The PDF's rate table says "no rate" for such a region, never a 0.0000 that reads as
    "no further loss" (checked in the page text with pdftotext)."""
    import shutil
    import subprocess

    from core.report.trend import write_trend_report

    surveys = _pair(PIT, year_built=None)
    r = trend(["a.json", "b.json"], surveys=surveys, horizon=20.0, step_years=5.0)
    out = tmp_path / "t.pdf"
    write_trend_report(r, out, "si")
    if shutil.which("pdftotext") is None:
        return
    text = subprocess.run(["pdftotext", "-layout", str(out), "-"], capture_output=True, text=True)
    line = next(ln for ln in text.stdout.splitlines() if ln.startswith("S3") and "band pit" in ln)
    assert "no rate" in line and "0.0000" not in line and "0.000 " not in line, line
