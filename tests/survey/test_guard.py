"""The reading guard (core/survey/guard.py): which values are held before they are stored.

The limits are our own rule (20 % to 100 % of nominal, a factor of ten, the modified
z-score above 3.5 of Iglewicz and Hoaglin 1993, from memory); the checks here are worked by
hand from those definitions.
"""

from __future__ import annotations

import json

import jsonschema
import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.survey import export_survey, load_survey
from core.survey.guard import as_read_text, hold_reasons
from core.survey.store import FieldStore
from core.survey.validate import schema

from .helpers import header, member


def codes(holds):
    return [h.code for h in holds]


def test_a_tenfold_value_is_held_with_what_was_probably_meant():
    holds = hold_reasons(120.0, "mm", 12.0, [12.1, 11.9, 12.0])
    assert codes(holds) == ["above_nominal", "slip"]
    assert "above the nominal 12 mm (1000 %)" in holds[0].message
    assert "did you mean 12 mm?" in holds[1].message


def test_a_tenth_is_held_below_the_plausible_range():
    holds = hold_reasons(0.95, "mm", 9.5)
    assert codes(holds) == ["below_range", "slip"]
    assert "10 % of the nominal 9.5 mm (below 20 %)" in holds[0].message
    assert "did you mean 9.5 mm?" in holds[1].message


def test_us_units_and_a_unit_slip():
    # 9.5 typed on a 3/8 in web of a survey in inches: 9.5 mm is 0.374 in, which fits
    holds = hold_reasons(9.5, "in", 0.375 * 25.4)
    assert codes(holds) == ["above_nominal", "slip"]
    assert "it fits as 9.5 mm (typed in mm?)" in holds[1].message
    assert hold_reasons(0.33, "in", 0.375 * 25.4) == []


def test_the_modified_z_score_by_hand():
    others = [8.0, 8.2, 8.4, 8.6, 8.8]  # median 8.4, MAD = median(0.4, 0.2, 0, 0.2, 0.4) = 0.2
    # the MAD is floored at 5 % of the median = 0.42 mm; z = 0.6745 (x - 8.4) / 0.42
    limit = 8.4 - 3.5 * 0.42 / 0.6745  # 6.2205... mm
    assert hold_reasons(limit + 0.01, "mm", 10.0, others) == []
    (h,) = hold_reasons(limit - 0.01, "mm", 10.0, others)
    assert h.code == "outlier" and "modified z-score -3.5" in h.message
    # a spread-out region: MAD 1.0 mm, so 4.9 mm is z = 0.6745 * -3.5 = -2.4: kept
    assert hold_reasons(4.9, "mm", 12.0, [7.4, 8.4, 9.4, 10.4, 6.4]) == []
    # with fewer than three other readings only a factor of ten counts
    assert hold_reasons(5.0, "mm", 10.0, [9.0, 9.2]) == []
    assert codes(hold_reasons(0.9, "mm", 10.0, [9.0, 9.2])) == ["below_range", "slip"]


@given(ratio=st.floats(0.2, 1.0), n=st.integers(0, 6))
def test_a_value_in_range_among_equal_readings_is_never_held(ratio, n):
    t = 10.0
    assert hold_reasons(ratio * t, "mm", t, [ratio * t] * n) == []


def test_a_value_stored_as_read_keeps_its_reasons_in_the_record(tmp_path):
    s = FieldStore.create(tmp_path / "g.asf", header(), device="tablet-A")
    s.add_member(member(), "ann")
    s.add_station("G1", {"id": "S1", "position": 1.0}, "ann")
    why = as_read_text(hold_reasons(12.4, "mm", 10.0))
    s.add_reading(
        "G1", "S1", {"part": "web", "value": 12.4, "unit": "mm", "stored_as_read": why}, "ann"
    )
    s.add_reading("G1", "S1", {"part": "web", "value": 8.4, "unit": "mm"}, "ann")
    out = export_survey(s, tmp_path / "g.json")
    s.close()
    doc = json.loads(out.read_text(encoding="utf-8"))
    jsonschema.validate(doc, schema())
    r1, r2 = doc["members"][0]["stations"][0]["readings"]
    assert r1["stored_as_read"] == why and "above the nominal 10 mm" in why
    assert "stored_as_read" not in r2  # optional: absent when not held
    survey, _ = load_survey(out)
    assert survey.members[0].stations[0].readings[0].stored_as_read == why


def test_bad_nominal_is_refused():
    with pytest.raises(ValueError, match="nominal thickness"):
        hold_reasons(5.0, "mm", 0.0)
