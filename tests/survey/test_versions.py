"""Survey document versions: version 1 files and field stores still open, upgraded to version
2 (the axle train of simple_span becomes a vehicle of the member's live load), and each
version is checked against its own published schema (a property of our own format; no source).
"""

from __future__ import annotations

import copy
import json
import sqlite3

import pytest

from core.errors import SchemaError
from core.survey import FieldStore, check_document, export_document, load_survey
from core.survey.docversions import V1_TRAIN, upgrade, upgrade_member
from core.survey.model import VERSION, Survey
from tests.survey.helpers import document, header, member, write

TRAIN = [
    {"load": {"value": 8, "unit": "kip"}, "spacing": {"value": 0, "unit": "ft"}},
    {"load": {"value": 32, "unit": "kip"}, "spacing": {"value": 14, "unit": "ft"}},
]


def v1_doc() -> dict:
    d = document()
    assert d["version"] == 1
    d["members"][0]["simple_span"] = {
        "dc": {"value": 1.2, "unit": "kip/ft"},
        "axles": copy.deepcopy(TRAIN),
        "im": 0.33,
        "distribution": 0.8,
    }
    return d


def test_version_1_file_opens_as_version_2(tmp_path):
    path = write(tmp_path / "old.json", v1_doc())
    s, probs = load_survey(path)
    assert s.version == VERSION == 2
    m = s.members[0]
    assert m.simple_span.model_dump(exclude_none=True).keys() == {"dc"}
    (v,) = m.live_load.vehicles
    assert v.name == V1_TRAIN and v.kind == "other" and v.im == 0.33 and len(v.axles) == 2
    assert m.live_load.distribution == 0.8
    assert any("a version 1 file, read as version 2" in p.message for p in probs)
    # written back, it is a version 2 document that reads the same
    again = write(tmp_path / "new.json", json.loads(export_document(s)))
    s2, _ = load_survey(again)
    assert json.loads(export_document(s2)) == json.loads(export_document(s))
    assert json.loads(export_document(s2))["version"] == 2


def test_upgrade_leaves_its_argument_and_version_2_alone():
    d = v1_doc()
    before = copy.deepcopy(d)
    up = upgrade(d)
    assert d == before and up["version"] == 2 and "axles" not in up["members"][0]["simple_span"]
    assert upgrade(up) is up  # version 2 unchanged
    assert upgrade_member(up["members"][0]) is up["members"][0]  # idempotent


def test_each_version_against_its_own_schema():
    # a version 2 field in a version 1 file is refused by the version 1 schema ...
    d = v1_doc()
    d["survey"]["use"] = "railway"
    _m, probs = check_document(d)
    assert any("use" in p.message and p.level == "error" for p in probs)
    # ... and a version 1 simple_span in a version 2 file by the version 2 schema
    d = v1_doc()
    d["version"] = 2
    _m, probs = check_document(d)
    assert any(p.level == "error" and "simple_span" in p.where for p in probs)


def test_version_2_fields_validate(tmp_path):
    d = document()
    d["version"] = 2
    d["survey"]["use"] = "highway"
    d["survey"]["options"] = {"level": "legal", "factors": {"gLL": 1.45}}
    d["members"][0].update(
        condition="fair",
        structure_type="riveted_two_girder",
        live_load={
            "lever_rule": {
                "spacing": {"value": 6.0, "unit": "m"},
                "loads": [{"offset": {"value": 0.6, "unit": "m"}, "fraction": 0.5}],
            },
            "vehicles": [{"name": "T", "kind": "legal", "axles": TRAIN, "im": 0.33}],
        },
    )
    s, _ = load_survey(write(tmp_path / "v2.json", d))
    assert s.survey.options["level"] == "legal" and s.members[0].condition == "fair"
    # a bad option is an error with its place
    d["survey"]["options"] = {"level": "super"}
    with pytest.raises(SchemaError, match=r"survey / options / level: 'super' is not one of"):
        load_survey(write(tmp_path / "bad.json", d))
    d["survey"]["options"] = {"factors": {"gLL": 1.45}, "colour": "red"}
    with pytest.raises(SchemaError, match="colour"):
        load_survey(write(tmp_path / "bad2.json", d))


def test_field_store_written_before_version_2_still_opens(tmp_path):
    # a store whose member row holds the version 1 simple_span (as a store written by an
    # earlier asfound does): read back as version 2
    path = tmp_path / "old.store"
    store = FieldStore.create(path, header(), who="t")
    store.add_member(member(), "t")
    store.close()
    con = sqlite3.connect(path)
    data = json.loads(con.execute("SELECT data FROM entity WHERE kind = 'member'").fetchone()[0])
    data["simple_span"] = {
        "dc": {"value": 15, "unit": "kN/m"},
        "axles": TRAIN,
        "im": 0.2,
        "distribution": 1.0,
    }
    data.pop("live_load", None)
    con.execute("UPDATE entity SET data = ? WHERE kind = 'member'", (json.dumps(data),))
    con.commit()
    con.close()
    with FieldStore.open(path) as st:
        s = st.to_survey()
    assert isinstance(s, Survey) and s.version == 2
    assert s.members[0].live_load.vehicles[0].name == V1_TRAIN
    assert s.members[0].live_load.vehicles[0].im == 0.2
