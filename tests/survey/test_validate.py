"""Validation lists every problem with its place (design notes section 11)."""

from __future__ import annotations

import json

import pytest

from core.survey.document import check_file
from core.survey.model import Survey
from core.survey.validate import check_document

from .helpers import MISTAKES, SI_SAMPLE, US_SAMPLE, document, reading


def _msgs(probs, level="error"):
    return [f"{p.where}: {p.message}" for p in probs if p.level == level]


@pytest.mark.parametrize("path", [SI_SAMPLE, US_SAMPLE])
def test_samples_validate_without_errors(path):
    model, probs = check_file(path)
    assert model is not None
    assert _msgs(probs) == []
    doc = json.loads(path.read_text(encoding="utf-8"))
    assert "invented" in doc["note"].lower()


def test_samples_have_the_promised_content():
    for path, lines in ((SI_SAMPLE, 6), (US_SAMPLE, 6)):
        model, _ = check_file(path)
        m = model.members[0]
        assert 6 <= len(m.stations) <= 10
        assert any(s.perforations for s in m.stations)
        assert any(s.bands for s in m.stations)
        states = {st for r in m.rivets for _, st in r.expanded()}
        assert {"missing", "loose"} <= states
        assert len(m.rivets) == lines
    # version 2: the SI sample is a railway girder (LM71 data, lever rule), the US sample a
    # highway through girder (lever rule, one legal vehicle), both with dead loads
    si, _ = check_file(SI_SAMPLE)
    assert si.version == 2 and si.survey.use == "railway"
    g1 = si.members[0]
    assert g1.simple_span is not None and g1.live_load.lever_rule is not None
    assert g1.live_load.alpha == 1.0 and g1.live_load.track == "standard"
    us, _ = check_file(US_SAMPLE)
    ng = us.members[0]
    assert us.survey.use == "highway" and ng.structure_type == "riveted_two_girder"
    assert [v.kind for v in ng.live_load.vehicles] == ["legal"]
    assert len(ng.live_load.vehicles[0].axles) == 3


def test_mistakes_file_lists_every_mistake():
    _model, probs = check_file(MISTAKES)
    errs = _msgs(probs)
    warns = _msgs(probs, "warning")
    expected_errors = [
        ("station 'S1' / reading 'r1'", "-8.2 mm is outside the allowed range"),  # negative
        ("station 'S1' / reading 'r2' / value", "'n/a' is not of type 'number'"),  # text
        ("station 'S1' / reading 'r3'", "unknown part id 'web_plate'"),
        ("rivet line 'web_bottom'", "rivet at 19.2 m is beyond the member (0 to 18 m)"),
        ("station 'S1' / perforation 'p9'", "perforation outside its plate: 1600 to 1640 mm"),
        ("station 'S3' / position", "station position 19.5 m is outside the member (0 to 18 m)"),
        ("station 'S3' / reading 'r1'", "thickness 0 mm is outside the allowed range"),  # zero
    ]
    for place, text in expected_errors:
        assert any(place in e and text in e for e in errs), (place, text, errs)
    assert len(errs) == len(expected_errors)
    assert any("station 'S2' / reading 'r1'" in w and "inches entered as mm" in w for w in warns)
    assert any(
        "station 'S2' / reading 'r2'" in w and "11.6 mm is above the nominal thickness 10 mm" in w
        for w in warns
    )


def _check(doc):
    return check_document(doc, "file.json")


def test_nan_thickness_is_an_error_with_place():
    doc = document()
    doc["members"][0]["stations"][0]["readings"][0]["value"] = float("nan")
    _m, probs = _check(doc)
    assert any("reading 'r1'" in e and "finite" in e for e in _msgs(probs))


def test_absurd_thickness_is_an_error():
    doc = document()
    doc["members"][0]["stations"][0]["readings"][0]["value"] = 800
    _m, probs = _check(doc)
    assert any("800 mm is outside the allowed range" in e and "500 mm" in e for e in _msgs(probs))


def test_band_removing_the_whole_part_is_an_error():
    # web from y = 0 to 1200 mm (web_recess 0): a band with t = 0 over the full depth
    st = {
        "id": "S1",
        "position": 1.0,
        "bands": [{"id": "b1", "part": "web", "lo": 0, "hi": 1200, "t": 0}],
    }
    _m, probs = _check(document([st]))
    assert any("removes the whole part 'web'" in e for e in _msgs(probs))


def test_perforation_through_the_whole_plate_is_an_error():
    st = {
        "id": "S1",
        "position": 1.0,
        "perforations": [{"id": "p1", "part": "web", "lo": 0, "hi": 1200}],
    }
    _m, probs = _check(document([st]))
    assert any("removes the whole part 'web'" in e for e in _msgs(probs))


def test_band_on_an_angle_needs_its_leg_and_band_without_thickness_are_errors():
    st = {
        "id": "S1",
        "position": 1.0,
        "bands": [
            {"id": "b1", "part": "angle_bl", "lo": 0, "hi": 50, "t": 5},
            {"id": "b2", "part": "web", "lo": 150, "hi": 230},
            {"id": "b3", "part": "web", "lo": 150, "hi": 230, "t": 5, "leg": "v"},
        ],
        "perforations": [{"id": "p1", "part": "angle_bl", "lo": 0, "hi": 50}],
    }
    errs = _msgs(_check(dict(document([st]), version=2))[1])  # legs of bands: version 2
    assert any("band 'b1'" in e and "names its leg, 'h' (horizontal) or 'v'" in e for e in errs)
    assert any("band 'b2'" in e and "neither a thickness t nor readings" in e for e in errs)
    assert any("band 'b3'" in e and "legs are of angles" in e for e in errs)
    assert any("perforation 'p1'" in e and "must lie on a plate" in e for e in errs)


def test_band_on_an_angle_leg_must_lie_beyond_the_corner():
    """A leg band lies between the other leg's thickness and the toe (section coordinates);
    one at the toe of a bottom angle's vertical leg is accepted."""
    doc = document([{"id": "S1", "position": 1.0}])
    m = Survey.model_validate(doc).members[0]
    a = m.definition().part("angle_bl")
    lo, hi = a.leg_range("v")
    f = 1.0 if m.length_unit == "mm" else 25.4
    ok = {"id": "b1", "part": "angle_bl", "leg": "v", "lo": (hi - 40) / f, "hi": hi / f, "t": 3}
    bad = dict(ok, id="b2", lo=(lo - 5) / f)
    doc = dict(document([{"id": "S1", "position": 1.0, "bands": [ok, bad]}]), version=2)
    errs = _msgs(_check(doc)[1])
    assert not any("band 'b1'" in e for e in errs), errs
    assert any("band 'b2'" in e and "band outside its leg" in e for e in errs)


def test_region_errors():
    st = {
        "id": "S1",
        "position": 1.0,
        "readings": [reading("r1", 8.0, region="h"), reading("r2", 8.0, region="zz")],
    }
    errs = _msgs(_check(document([st]))[1])
    assert any("reading 'r1'" in e and "angle leg, but part 'web' is a plate" in e for e in errs)
    assert any(
        "reading 'r2'" in e and "region 'zz' is not 'h', 'v' nor a band id" in e for e in errs
    )


def test_wrong_unit_kind_and_unknown_unit():
    st = {
        "id": "S1",
        "position": 1.0,
        "readings": [reading("r1", 8, unit="kN"), reading("r2", 8, unit="furlongz")],
    }
    errs = _msgs(_check(document([st]))[1])
    assert any("reading 'r1'" in e and "not a length unit" in e for e in errs)
    assert any("reading 'r2'" in e and "unknown unit 'furlongz'" in e for e in errs)


def test_duplicate_ids_and_unknown_rivet_line():
    doc = document()
    st = doc["members"][0]["stations"][0]
    st["readings"].append(reading("r1", 8.3))
    doc["members"][0]["rivets"] = [{"line": "web_middle", "states": []}]
    errs = _msgs(_check(doc)[1])
    assert any("duplicate reading ids ['r1']" in e for e in errs)
    assert any("unknown rivet line 'web_middle'" in e for e in errs)


def test_material_out_of_range_and_missing_material_warning():
    doc = document()
    doc["survey"]["material"] = {"Fy": {"value": 30, "unit": "MPa"}}
    errs = _msgs(_check(doc)[1])
    assert any("Fy = 30 MPa is outside 100 to 1000 MPa" in e for e in errs)
    doc["survey"].pop("material")
    doc["survey"]["year_built"] = None
    warns = _msgs(_check(doc)[1], "warning")
    assert any("neither material nor year built" in w for w in warns)


def test_newer_version_and_wrong_format():
    doc = document()
    doc["version"] = 3
    m, probs = _check(doc)
    assert m is None and "version 3 is newer than this asfound reads" in probs[0].message
    m, probs = _check({"format": "something.else"})
    assert m is None and "not an asfound survey" in probs[0].message


def test_markup_characters_are_kept_literally():
    doc = document()
    doc["members"][0]["stations"][0]["notes"] = "<b>rust</b> & 'pack' \"scale\" {x} \\n"
    doc["survey"]["structure"] = "Bridge <No. 4> & Co"
    model, probs = _check(doc)
    assert _msgs(probs) == []
    assert model.members[0].stations[0].notes == "<b>rust</b> & 'pack' \"scale\" {x} \\n"
    assert model.survey.structure == "Bridge <No. 4> & Co"
