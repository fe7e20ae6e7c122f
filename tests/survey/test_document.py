"""The interchange file: lossless round trip, refused files change nothing."""

from __future__ import annotations

import json

import jsonschema
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from core.errors import OutputError, SchemaError
from core.survey.document import export_document, export_survey, import_survey, load_survey
from core.survey.model import Survey
from core.survey.store import FieldStore
from core.survey.validate import SCHEMA_PATH, check_document, schema

from .helpers import MISTAKES, SI_SAMPLE, US_SAMPLE, document, write


def test_schema_is_a_valid_draft_2020_12_schema():
    s = json.loads(SCHEMA_PATH.read_text(encoding="utf-8"))
    assert s["$schema"] == "https://json-schema.org/draft/2020-12/schema"
    jsonschema.Draft202012Validator.check_schema(s)


@pytest.mark.parametrize("path", [SI_SAMPLE, US_SAMPLE])
def test_samples_round_trip_exactly(tmp_path, path):
    survey, _ = load_survey(path)
    jsonschema.validate(json.loads(path.read_text(encoding="utf-8")), schema())
    first = tmp_path / "first.json"
    export_survey(survey, first)
    import_survey(first, tmp_path / "s.asf")
    second = tmp_path / "second.json"
    export_survey(tmp_path / "s.asf", second)
    assert first.read_bytes() == second.read_bytes()
    assert json.loads(first.read_text()) == json.loads(path.read_text())  # the sample itself
    assert sorted(x.name for x in tmp_path.iterdir()) == ["first.json", "s.asf", "second.json"]


def _refused(tmp_path, src, text):
    dst = tmp_path / "new.asf"
    with pytest.raises(SchemaError) as ei:
        import_survey(src, dst)
    assert text in str(ei.value)
    assert not dst.exists()
    assert [x.name for x in tmp_path.iterdir()] == [src.name]  # no temporary files left
    return str(ei.value)


def test_malformed_json_is_refused(tmp_path):
    src = tmp_path / "bad.json"
    src.write_text('{"format": "asfound.survey", "version": 1,, }', encoding="utf-8")
    _refused(tmp_path, src, "not valid JSON (line 1, column 43")


def test_truncated_file_is_refused(tmp_path):
    src = tmp_path / "cut.json"
    text = SI_SAMPLE.read_text(encoding="utf-8")
    src.write_text(text[: len(text) // 2], encoding="utf-8")
    _refused(tmp_path, src, "truncated or damaged?")


def test_newer_version_is_refused(tmp_path):
    doc = document()
    doc["version"] = 3
    msg = _refused(tmp_path, write(tmp_path / "v3.json", doc), "version 3 is newer")
    assert "update asfound" in msg


def test_unknown_part_id_is_refused(tmp_path):
    doc = document()
    doc["members"][0]["stations"][0]["readings"][1]["part"] = "angle_xx"
    msg = _refused(tmp_path, write(tmp_path / "u.json", doc), "unknown part id 'angle_xx'")
    assert "member 'G1' / station 'S1' / reading 'r2'" in msg


def test_nan_token_is_refused(tmp_path):
    src = tmp_path / "nan.json"
    src.write_text(json.dumps(document()).replace("8.1", "NaN"), encoding="utf-8")
    _refused(tmp_path, src, "NaN is not a number a survey file may hold")


def test_mistakes_file_is_refused_listing_every_error(tmp_path):
    dst = tmp_path / "m.asf"
    with pytest.raises(SchemaError) as ei:
        import_survey(MISTAKES, dst)
    assert "7 error(s)" in str(ei.value) and not dst.exists()


def test_existing_store_is_never_overwritten(tmp_path):
    src = write(tmp_path / "ok.json", document())
    dst = tmp_path / "s.asf"
    import_survey(src, dst)
    before = dst.read_bytes()
    with pytest.raises(OutputError, match="a new store never replaces a file"):
        import_survey(src, dst)
    assert dst.read_bytes() == before


def test_imported_store_records_history_and_validates(tmp_path):
    dst = import_survey(write(tmp_path / "ok.json", document()), tmp_path / "s.asf", who="office")
    with FieldStore.open(dst) as s:
        h = s.history()
        assert {e.who for e in h} == {"office"}
        assert {e.kind for e in h if e.action == "add"} == {"member", "station", "reading"}
        assert len({e.change for e in h if e.action == "add"}) == 1  # one transaction
        # the import is one change that can be reverted (the last member only when asked)
        assert s.undo_last("office", keep_last_member=False) != []


# ---------------------------------------------------------------- property: round trip
_text = st.text(
    alphabet=st.characters(blacklist_categories=("Cs",), blacklist_characters="\x00"), max_size=12
)


@st.composite
def surveys(draw):
    us = draw(st.booleans())
    lu, pu, f = ("in", "ft", 1 / 25.4) if us else ("mm", "m", 1.0)
    D = draw(st.floats(600, 2400)) * f
    tw = draw(st.floats(8, 16)) * f
    leg = draw(st.floats(90, 200)) * f
    at = draw(st.floats(8, 0.5 * leg / f)) * f
    covers = draw(st.lists(st.tuples(st.floats(250, 450), st.floats(8, 20)), max_size=2))
    covers = [[w * f, t * f] for w, t in covers]
    span = draw(st.floats(4, 40))
    sec = {
        "girder": {
            "D": D,
            "tw": tw,
            "angle_h": leg,
            "angle_v": leg,
            "angle_t": at,
            "covers_top": covers,
            "rivet_d": 22 * f,
        },
        "parts": [],
        "rivet_lines": [],
    }
    nominal = {"web": tw} | {a: at for a in ("angle_tl", "angle_tr", "angle_bl", "angle_br")}
    nominal |= {f"cover_top_{i}": c[1] for i, c in enumerate(covers, start=1)}
    nominal |= {f"cover_bottom_{i}": c[1] for i, c in enumerate(covers, start=1)}
    stations = []
    for k in range(draw(st.integers(0, 3))):
        readings, bands, perfs = [], [], []
        if draw(st.booleans()):
            lo = draw(st.floats(0.01, 0.4)) * D
            bands.append(
                {
                    "id": "b1",
                    "part": "web",
                    "lo": lo,
                    "hi": lo + 0.1 * D,
                    "t": draw(st.one_of(st.none(), st.floats(0.1, 0.9))) and tw * 0.5,
                }
            )
            if bands[0]["t"] is None:
                readings.append(
                    {"id": "rb", "part": "web", "region": "b1", "value": tw * 0.4, "unit": lu}
                )
        if draw(st.booleans()):
            lo = draw(st.floats(0.1, 0.8)) * D
            perfs.append(
                {"id": "p1", "part": "web", "lo": lo, "hi": lo + 0.05 * D, "note": draw(_text)}
            )
        for j in range(draw(st.integers(0, 5))):
            part = draw(st.sampled_from(sorted(nominal)))
            region = draw(st.sampled_from([None, "h", "v"])) if part.startswith("angle") else None
            readings.append(
                {
                    "id": f"r{j}",
                    "part": part,
                    "region": region,
                    "location": draw(_text),
                    "value": nominal[part] * draw(st.floats(0.3, 1.0)),
                    "unit": lu,
                    "instrument": draw(_text),
                    "face": draw(_text),
                    "time": "2025-05-01T10:00:00",
                    "who": draw(_text),
                }
            )
        stations.append(
            {
                "id": f"S{k}",
                "position": draw(st.floats(0, span)),
                "readings": readings,
                "bands": bands,
                "perforations": perfs,
                "notes": draw(_text),
                "photos": draw(st.lists(_text, max_size=2)),
            }
        )
    rivets = [
        {
            "line": "web_bottom",
            "run": {"start": 0.1, "end": span - 0.1, "pitch": 0.5},
            "states": [
                {"position": draw(st.floats(0, span)), "state": s}
                for s in draw(
                    st.lists(st.sampled_from(["sound", "loose", "missing", "headless"]), max_size=3)
                )
            ],
        }
    ]
    return {
        "format": "asfound.survey",
        "version": 1,
        "note": draw(_text),
        "survey": {
            "id": "H-" + draw(st.text("ABC123", min_size=1, max_size=4)),
            "title": draw(_text),
            "structure": draw(_text),
            "inspector": draw(_text),
            "unit_system": "us" if us else "si",
            "year_built": draw(st.integers(1880, 1960)),
            "length_unit": lu,
            "position_unit": pu,
        },
        "members": [
            {
                "id": "M1",
                "label": draw(_text),
                "span": {"value": span, "unit": pu},
                "section": sec,
                "rivets": rivets,
                "stations": stations,
            }
        ],
    }


@settings(
    max_examples=30, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture]
)
@given(surveys())
def test_round_trip_is_lossless(tmp_path_factory, doc):
    d = tmp_path_factory.mktemp("rt")
    model, probs = check_document(doc)
    assert model is not None and [p for p in probs if p.level == "error"] == []
    first = export_document(model)
    jsonschema.validate(json.loads(first), schema())
    src = d / "a.json"
    src.write_text(first, encoding="utf-8")
    import_survey(src, d / "s.asf")
    export_survey(d / "s.asf", d / "b.json")
    assert (d / "b.json").read_text(encoding="utf-8") == first
    assert Survey.model_validate(json.loads(first)).document() == model.document()
