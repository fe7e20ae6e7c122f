"""A member's girder details in the survey record (document version 2): stiffeners with their
readings and loss bands, supports with the bearing length, bracing and fatigue traffic.
Properties of our own format (no source): the samples hold them and pass the schema; each
mistake gets an error naming the value and its place; the field store keeps them with their
history and refuses a bad entry without changing anything; version 1 files open with none.
"""

from __future__ import annotations

import copy
import json

import jsonschema
import pytest

from core.errors import InputError
from core.survey import FieldStore, check_document, load_survey
from core.survey.validate import schema
from tests.survey.helpers import US_SAMPLE, document, header, member, write


def us() -> dict:
    return json.loads(US_SAMPLE.read_text(encoding="utf-8"))


def test_the_samples_record_girder_details_and_pass_the_schema():
    d = us()
    jsonschema.validate(d, schema())
    m = d["members"][0]
    assert {s["role"] for s in m["stiffeners"]} == {"bearing", "intermediate"}
    assert any(s["bands"] for s in m["stiffeners"] if s["role"] == "bearing")
    assert [s["id"] for s in m["supports"]] == ["S", "N"]
    assert m["bracing"]["top"]["kind"] == "u_frames"
    s, probs = load_survey(US_SAMPLE)
    assert not [p for p in probs if p.level == "error"]
    assert s.members[0].stiffeners[0].bands[0].hi == 6.0


def errors_of(doc) -> list:
    _, probs = check_document(doc, "f.json")
    return [p for p in probs if p.level == "error"]


@pytest.mark.parametrize(
    ("change", "words", "place"),
    [
        (lambda m: m["stiffeners"][0]["bands"][0].update(b_lost=9.0), "takes the whole projecting width 5 in", "stiffener 'BS-S' / band 'end'"),
        (lambda m: m["stiffeners"][0]["readings"][0].update(band="x"), "band 'x' is not a band of the stiffener", "reading 's1'"),
        (lambda m: m["stiffeners"][0]["readings"][0].update(unit="kip"), "kip", "reading 's1'"),
        (lambda m: m["stiffeners"][2].update(kind="plates"), "a plate stiffener has no connected leg", "stiffener 'IS1'"),
        (lambda m: m["stiffeners"][2].update(position=90.0), "outside the member (0 to 75 ft)", "stiffener 'IS1' / position"),
        (lambda m: m["stiffeners"][3].update(id="IS1"), "duplicate stiffener ids ['IS1']", "member 'NG'"),
        (lambda m: m["supports"][0].update(stiffener="Q"), "stiffener 'Q' is not a stiffener of the member", "support 'S'"),
        (lambda m: m["supports"][0]["N"].update(unit="kip"), "kip", "support 'S' / N"),
        (lambda m: m["bracing"]["top"]["u_frames"].update(vertical="Q"), "vertical 'Q' is not a stiffener", "bracing / top / u_frames"),
        (lambda m: m["bracing"]["top"]["u_frames"].update(hv=None), "U-frames need their stiffness Cd", "bracing / top / u_frames"),
        (lambda m: m["bracing"]["top"].update(u_frames=None), "needs its u_frames data", "bracing / top"),
    ],
)  # fmt: skip
def test_each_mistake_names_its_value_and_place(change, words, place):
    d = us()
    change(d["members"][0])
    errs = errors_of(d)
    assert any(words in p.message and place in p.where for p in errs), [str(p) for p in errs]


def test_schema_errors_name_the_stiffener():
    d = us()
    d["members"][0]["stiffeners"][1]["t"] = "thick"
    errs = errors_of(d)
    assert any("stiffener 'BS-N'" in p.where for p in errs), [str(p) for p in errs]


def test_a_reading_above_nominal_is_a_warning_and_capped():
    d = us()
    d["members"][0]["stiffeners"][0]["readings"][0]["value"] = 0.70
    _, probs = check_document(d, "f.json")
    assert any(
        p.level == "warning" and "above the nominal thickness 0.625 in" in p.message for p in probs
    )


def test_version_1_files_open_without_girder_details(tmp_path):
    d = document()
    assert d["version"] == 1
    s, probs = load_survey(write(tmp_path / "v1.json", d))
    m = s.members[0]
    assert (m.stiffeners, m.supports, m.bracing, m.fatigue) == ([], [], None, None)
    assert not [p for p in probs if p.level == "error"]


def test_the_field_store_keeps_the_details_with_their_history(tmp_path):
    m = us()["members"][0]
    details = {k: m[k] for k in ("stiffeners", "supports", "bracing", "fatigue")}
    h = header(unit_system="us", length_unit="in", position_unit="ft")
    with FieldStore.create(tmp_path / "s.asf", h) as s:
        base = member(span={"value": 75.0, "unit": "ft"}, section=copy.deepcopy(m["section"]))
        s.add_member(base, "ann")
        s.update_member("G1", details, "bo")
        got = s.to_survey().members[0]
        assert got.stiffeners[1].bands[0].b_lost == 1.0 and got.supports[1].id == "N"
        h = [e for e in s.history() if e.who == "bo"]
        assert h and all(e.kind == "member" for e in h)
        # a bad entry is refused and changes nothing
        bad = copy.deepcopy(details)
        bad["supports"][0]["stiffener"] = "nope"
        with pytest.raises(InputError, match="'nope' is not a stiffener"):
            s.update_member("G1", bad, "bo")
        assert s.to_survey().members[0].supports[0].stiffener == "BS-S"
