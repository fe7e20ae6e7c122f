"""Readings to thickness per part region: statistics checked by hand calculation."""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from core.errors import InputError
from core.survey.model import Survey
from core.survey.readings import (
    COV_LIMIT,
    plausibility,
    region_stats,
    station_stats,
    stats_as,
)

from .helpers import document, reading


def test_statistics_against_hand_calculation():
    # hand calculation: values 8.0, 9.0, 10.0 mm
    #   mean = 27 / 3 = 9.0; minimum = 8.0
    #   sample variance (n - 1) = (1 + 0 + 1) / 2 = 1.0, s = 1.0; COV = 1.0 / 9.0 = 0.1111
    s = region_stats([8.0, 9.0, 10.0], 10.0, part="web")
    assert s.n == 3
    assert s.t_mean == pytest.approx(9.0, rel=1e-12)
    assert s.t_min == 8.0
    assert s.cov == pytest.approx(1.0 / 9.0, rel=1e-12)
    assert s.t_used == pytest.approx(9.0)  # mean by default
    assert s.t_local == 8.0
    # COV 11.1 % > 10 %: the note (practice borrowed from API 579-1 Part 4) is raised
    assert any("API 579-1 Part 4" in p.message and p.level == "note" for p in s.notes)


def test_statistics_second_hand_calculation_uses_sample_std():
    # hand calculation: 7.2, 7.6, 7.4, 7.8 mm: mean 7.5; deviations -0.3, 0.1, -0.1, 0.3
    #   sum of squares 0.20; sample variance 0.20 / 3 = 0.066667, s = 0.258199
    #   COV = 0.258199 / 7.5 = 0.034427 (the population std would give 0.029814)
    s = region_stats([7.2, 7.6, 7.4, 7.8], 10.0, part="web")
    assert s.t_mean == pytest.approx(7.5, rel=1e-12)
    assert s.cov == pytest.approx(0.034427, rel=1e-4)
    assert not any(p.level == "note" for p in s.notes)  # below 10 %, 4 readings


def test_policy_minimum_and_cap_at_nominal():
    s = region_stats([9.5, 10.4, 10.2], 10.0, part="web", policy="minimum")
    assert s.t_used == 9.5
    # two readings above nominal count as nominal in the value used, reading by reading:
    # (9.5 + 10 + 10) / 3 = 9.8333 (by hand), not the mean as read 10.033 capped to 10
    m = region_stats([9.5, 10.4, 10.2], 10.0, part="web")
    assert m.t_mean == pytest.approx(30.1 / 3)
    assert m.t_used == pytest.approx(29.5 / 3, rel=1e-12)
    assert stats_as([m], "minimum")[0].t_used == 9.5
    assert stats_as(stats_as([m], "minimum"), "mean")[0].t_used == m.t_used


@given(
    vals=st.lists(st.floats(min_value=1.0, max_value=30.0), min_size=1, max_size=12),
    nominal=st.floats(min_value=2.0, max_value=25.0),
)
def test_a_reading_above_nominal_never_raises_the_value_used(vals, nominal):
    """Properties of the rule of core.survey.readings: the value used is at most the mean as
    read and at most nominal; a reading above nominal counts exactly as one at nominal;
    with no reading above nominal it is the plain mean."""
    s = region_stats(vals, nominal, part="web")
    assert s.t_used <= min(s.t_mean, nominal) * (1 + 1e-12)
    above = region_stats([*vals, nominal * 1.5], nominal, part="web")
    at = region_stats([*vals, nominal], nominal, part="web")
    assert above.t_used == at.t_used  # a reading above nominal counts as nominal
    if max(vals) <= nominal:
        assert s.t_used == s.t_mean


def test_too_few_readings_note_and_single_reading():
    s = region_stats([8.0], 10.0, part="web")
    assert s.cov is None
    # fewer than 3 readings: common practice, no source
    assert any("only 1 reading" in p.message for p in s.notes)


@pytest.mark.parametrize("bad", [0.0, -1.0, math.nan, math.inf])
def test_region_stats_refuses_unusable_values(bad):
    with pytest.raises(InputError, match="outside the allowed range"):
        region_stats([8.0, bad], 10.0, part="web", where="member 'G1'")


def test_unknown_policy_refused():
    with pytest.raises(InputError, match="'mean' or 'minimum'"):
        region_stats([8.0], 10.0, part="web", policy="median")


def test_unit_slip_inches_entered_as_mm():
    w = plausibility(0.4, "mm", 10.0, "reading 'r1'")
    assert len(w) == 1 and w[0].level == "warning"
    assert "inches entered as mm" in w[0].message and w[0].where == "reading 'r1'"


def test_unit_slip_mm_entered_as_inches():
    # nominal 1/2 in = 12.7 mm; 12 "in" is 305 mm, but 12 mm fits the nominal
    w = plausibility(12, "in", 12.7, "reading 'r2'")
    assert len(w) == 1 and "millimetres entered as in" in w[0].message


def test_above_nominal_warning_names_value_and_nominal():
    w = plausibility(0.55, "in", 12.7, "x")
    assert len(w) == 1
    assert "0.55 in is above the nominal thickness 0.5 in" in w[0].message
    assert "measurement or drawing error" in w[0].message


def test_plausible_reading_gives_no_warning():
    assert plausibility(8.7, "mm", 10.0) == []


@settings(max_examples=60, deadline=None)
@given(st.lists(st.floats(min_value=0.5, max_value=30.0), min_size=1, max_size=12))
def test_invariants_min_mean_used(vals):
    s = region_stats(vals, 20.0, part="p")
    assert s.t_min <= s.t_mean + 1e-9
    assert s.t_used <= 20.0 and s.t_local <= s.t_used + 1e-9
    if s.cov is not None:
        assert s.cov >= 0.0
    assert (s.cov is not None and s.cov > COV_LIMIT) == any(
        "API 579-1" in p.message for p in s.notes
    )


def _station_doc():
    readings = [
        reading("r1", 8.0),
        reading("r2", 9.0),
        reading("r3", 10.0),
        reading("r4", 10.0, part="angle_bl", region="h"),
        reading("r5", 11.0, part="angle_bl", region="h"),
        reading("r6", 11.0, part="angle_bl"),
        reading("r7", 4.0, region="b1"),
        reading("r8", 5.0, region="b1"),
    ]
    st_ = {
        "id": "S1",
        "position": 0.3,
        "readings": readings,
        "bands": [{"id": "b1", "part": "web", "lo": 150, "hi": 230}],
        "perforations": [{"id": "p1", "part": "web", "lo": 170, "hi": 190}],
    }
    return Survey.model_validate(document([st_]))


def test_station_loss_maps_regions_legs_and_bands():
    s = _station_doc()
    m = s.members[0]
    loss = m.station("S1").loss(m)
    th = {(t.part, t.leg): t.t for t in loss.thickness}
    # web: mean of 8, 9, 10 = 9.0; angle_bl h: mean 10.5; the v leg takes the whole-angle 11 mm,
    # capped at the nominal 12 mm (no cap needed here)
    assert th == {("web", None): 9.0, ("angle_bl", "h"): 10.5, ("angle_bl", "v"): 11.0}
    (band,) = loss.bands
    assert (band.part, band.lo, band.hi, band.t) == ("web", 150.0, 230.0, 4.5)
    (perf,) = loss.perforations
    assert (perf.lo, perf.hi) == (170.0, 190.0)
    loss_min = m.station("S1").loss(m, policy="minimum")
    assert {(t.part, t.leg): t.t for t in loss_min.thickness}[("web", None)] == 8.0


def test_station_stats_in_inches_convert_to_mm():
    doc = document([{"id": "S1", "position": 0.3, "readings": [reading("r1", 0.375, unit="in")]}])
    s = Survey.model_validate(doc)
    (rs,) = station_stats(s.members[0].stations[0], s.members[0])
    assert rs.t_mean == pytest.approx(0.375 * 25.4)  # 1 in = 25.4 mm exactly
