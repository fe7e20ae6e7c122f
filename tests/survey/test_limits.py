"""Bounded work on any survey: sizes checked before expansion, physical ranges, no hang.

The cases are those of issue 9 (a rivet run with a pitch of 1e-9 mm, a run end scaled by a
million, huge numbers, nasty units) plus every limit of core.limits. Each file runs through
validate, assess and report in a worker process with a time limit, so a regression shows as
a failed test, not a stuck suite. The limits are our own (common practice, no source):
they are named in the errors and in docs/survey-format.md.
"""

from __future__ import annotations

import copy
import json

import pytest

from core import limits
from core.errors import InputError
from core.survey import check_document
from core.survey.model import RivetLineStates, Survey
from core.survey.validate import schema
from tests.fuzz.cases import SURVEY_COMMANDS
from tests.fuzz.worker import Worker

from .helpers import document, reading

#: seconds a refused file may take through validate, assess and report (a valid small
#: survey takes about 2 s; a refused one well under 1 s)
LIMIT_S = 20.0


@pytest.fixture(scope="module")
def worker():
    with Worker(LIMIT_S) as w:
        yield w


def _errors(doc: dict) -> list[str]:
    _model, probs = check_document(doc, "t.json")
    return [str(p) for p in probs if p.level == "error"]


def _run_refused(worker: Worker, doc: dict) -> None:
    out = worker.run({"in.json": json.dumps(doc).encode()}, SURVEY_COMMANDS)
    assert out.kind == "refused", (out.kind, out.seconds, out.detail)
    assert out.exits == (1, 2, 2, 2, 2, 2)  # validate lists the errors; the others refuse


def _run(doc: dict, rivets: list[dict]) -> dict:
    d = copy.deepcopy(doc)
    d["members"][0]["rivets"] = rivets
    return d


@pytest.mark.parametrize(
    ("run", "count"),
    [
        ({"start": 0.05, "end": 11.95, "pitch": 1e-12}, "11,900,000,000,000"),  # 1e-9 mm
        ({"start": 0.05, "end": 11.95, "pitch": 1e-9}, "11,900,000,000"),  # 1e-6 mm
        ({"start": 0.05, "end": 11.95e6, "pitch": 0.1}, "119,500,000"),  # end x 1e6
        ({"start": -1.7e308, "end": 1.7e308, "pitch": 0.1}, "too many"),  # inf rivets
    ],
)
def test_a_huge_rivet_run_is_refused_before_any_rivet_is_made(worker, run, count):
    doc = _run(document(), [{"line": "web_bottom", "run": run, "states": []}])
    errs = _errors(doc)
    assert any(
        f"gives {count} rivets, more than the limit of 10,000 rivets on one line" in e
        and "member 'G1' / rivet line 'web_bottom' / run" in e
        for e in errs
    ), errs
    _run_refused(worker, doc)


def test_rivets_per_line_and_per_member_count_the_run_and_the_states():
    states = [{"position": 0.001 * k, "state": "missing"} for k in range(200)]
    ok = RivetLineStates.model_validate(
        {"line": "web_top", "run": {"start": 0.0, "end": 9.79, "pitch": 0.001}, "states": states}
    )
    assert ok.count() == 9791 + 200 <= limits.MAX_RIVETS_PER_LINE
    assert len(ok.expanded()) == 9791  # the states fall on run rivets and replace them
    many = {"start": 0.0, "end": 11.99, "pitch": 0.0015}  # 7,994 rivets per line
    lines = ["web_top", "web_bottom", "cover_top_l", "cover_top_r", "cover_bottom_l"]
    doc = _run(document(), [{"line": x, "run": many, "states": []} for x in lines])
    assert _errors(doc) == []  # 5 x 7,994 = 39,970 rivets: within 40,000 per member
    doc["members"][0]["rivets"].append({"line": "cover_bottom_r", "run": many, "states": []})
    errs = _errors(doc)
    assert any(
        "47,964 rivets on the member's lines is more than the limit of 40,000" in e for e in errs
    ), errs


def test_a_survey_beyond_the_limits_is_still_read_whole_and_only_refused_by_validation():
    """The model (what a field store is read into) keeps everything; only validation
    refuses: a store that grew beyond a limit stays readable and exportable, never lost."""
    doc = document()
    st = doc["members"][0]["stations"][0]
    st["readings"] = [reading(f"r{i}", 8.0) for i in range(limits.MAX_READINGS + 1)]
    st["notes"] = "n" * (limits.MAX_TEXT + 1)
    doc["members"][0]["rivets"] = [
        {"line": "web_top", "run": {"start": 0.0, "end": 11.0, "pitch": 1e-6}, "states": []}
    ]
    model = Survey.model_validate(doc)
    assert len(model.members[0].stations[0].readings) == limits.MAX_READINGS + 1
    with pytest.raises(InputError, match="more than the limit of 10,000 rivets on one line"):
        model.members[0].rivet_states("web_top")  # never expanded, whatever the caller
    errs = _errors(doc)
    assert len(errs) == 3, errs


def test_expanding_many_listed_states_is_fast():
    """20,000 listed states against a run: n log n, not n² (each state finds its rivet)."""
    run = {"start": 0.0, "end": 9.998, "pitch": 0.002}
    states = [{"position": 0.002 * k + 1e-6, "state": "loose"} for k in range(0, 4999, 1)]
    rl = RivetLineStates.model_validate({"line": "web_top", "run": run, "states": states})
    out = rl.expanded()
    assert len(out) == 5000
    assert sum(1 for _p, s in out if s == "loose") == 4999


@pytest.mark.parametrize(
    ("path", "n", "limit", "what"),
    [
        (("members",), limits.MAX_MEMBERS + 1, limits.MAX_MEMBERS, "items"),
        (("members", 0, "stations"), limits.MAX_STATIONS + 1, limits.MAX_STATIONS, "items"),
        (
            ("members", 0, "stations", 0, "readings"),
            limits.MAX_READINGS + 1,
            limits.MAX_READINGS,
            "items",
        ),
    ],
)
def test_too_many_members_stations_or_readings_are_refused_with_the_limit(
    worker, path, n, limit, what
):
    doc = document()
    node = doc
    for step in path[:-1]:
        node = node[step]
    proto = node[path[-1]][0]
    items = []
    for i in range(n):
        item = copy.deepcopy(proto)
        item["id"] = f"x{i}"
        if path[-1] == "stations":
            item["position"] = 0.01 * i
            item["readings"] = []  # the count is refused, not the content: keep the file small
        items.append(item)
    node[path[-1]] = items
    errs = _errors(doc)
    assert any(f"{n:,} {what} is more than the limit of {limit:,}" in e for e in errs), errs[:3]
    assert all(len(e) < 600 for e in errs)  # the list itself is never printed
    _run_refused(worker, doc)


def test_stations_of_a_whole_survey_are_bounded(monkeypatch):
    # the check reads the limit when it runs: a lower limit keeps the document small
    monkeypatch.setattr(limits, "MAX_STATIONS_PER_SURVEY", 2_000)
    doc = document()
    proto = doc["members"][0]
    doc["members"] = []
    for j in range(5):  # 5 x 401 = 2,005 stations
        m = copy.deepcopy(proto)
        m["id"] = f"G{j}"
        st = m["stations"][0]
        m["stations"] = [dict(st, id=f"S{i}", position=0.02 * i) for i in range(401)]
        doc["members"].append(m)
    errs = _errors(doc)
    assert any("2,005 stations in one survey is more than the limit of 2,000" in e for e in errs)


def test_long_text_beyond_the_limit_is_refused_and_at_the_limit_kept():
    doc = document()
    doc["members"][0]["stations"][0]["notes"] = "n" * limits.MAX_TEXT
    assert _errors(doc) == []
    doc["members"][0]["stations"][0]["notes"] += "!"
    errs = _errors(doc)
    assert errs == [
        "error: t.json / member 'G1' / station 'S1' / notes: 20,001 characters is more than "
        "the limit of 20,000"
    ]


@pytest.mark.parametrize(
    ("where", "value", "expect"),
    [
        (("girder", "tw"), 0.001, "tw = 0.001 mm is outside the allowed range (0.01 to 1e+06 mm)"),
        (("girder", "D"), 2e9, "D = 2e+09 mm is outside the allowed range (0.01 to 1e+06 mm)"),
        (("girder", "pitch_web"), 1e-9, "pitch_web = 1e-09 mm is outside the allowed range"),
        (("girder", "covers_top"), [[0]], "expected a list of 2 numbers, found [0]"),
        (("girder", "angle_bottom"), [], "expected a list of 3 numbers, found []"),
        (("girder", "D"), 10**400, "is too large a number"),
    ],
)
def test_section_values_outside_physical_ranges_are_refused_with_value_range_place(
    where, value, expect
):
    doc = document()
    doc["members"][0]["section"][where[0]][where[1]] = value
    errs = _errors(doc)
    assert any(expect in e and f"member 'G1' / girder / {where[1]}" in e for e in errs), errs


@pytest.mark.parametrize(
    ("effect", "value", "unit", "expect"),
    [
        ("V", 2e9, "N", "V = 2e+09 N is outside -1e+09 to 1e+09 N"),
        ("V", 1.5e6, "kN", "V = 1.5e+09 N is outside -1e+09 to 1e+09 N"),
        ("M", 2e13, "N*mm", "M = 2e+13 N mm is outside -1e+13 to 1e+13 N mm"),
    ],
)
def test_loads_outside_physical_ranges_are_refused(effect, value, unit, expect):
    doc = document()
    st = doc["members"][0]["stations"][0]
    st["loads"] = {"LL_IM": {effect: {"value": value, "unit": unit}}}
    errs = _errors(doc)
    assert any(expect in e and "station 'S1' / loads / LL_IM" in e for e in errs), errs


def test_uniform_load_and_run_pitch_ranges():
    doc = document()
    doc["members"][0]["simple_span"] = {"dc": {"value": -5, "unit": "kN/m"}}
    doc["members"][0]["rivets"] = [
        {"line": "web_top", "run": {"start": 0.0, "end": 0.00002, "pitch": 5e-6}, "states": []}
    ]
    errs = _errors(doc)
    assert any("dc = -5 N/mm is outside 0 to 1e+06 N/mm" in e for e in errs), errs
    assert any("run pitch = 0.005 mm is outside 0.01 to 1e+06 mm" in e for e in errs), errs


@pytest.mark.parametrize(
    ("unit", "expect"),
    [
        ("10**10**10*mm", "holds a number"),  # pint would evaluate it for ever
        ("mm**1000", "holds a number"),
        ("1/0", "holds a number"),
        ("kN/0", "holds a number"),
        ("m" * 65, "65 characters is more than the limit of 64"),
        ("mm/s", "is not a length unit"),
    ],
)
def test_nasty_units_are_unit_errors_quickly(worker, unit, expect):
    doc = document(
        stations=[{"id": "S1", "position": 0.3, "readings": [reading("r1", 8, unit=unit)]}]
    )
    errs = _errors(doc)
    assert any(expect in e and "reading 'r1'" in e for e in errs), errs
    _run_refused(worker, doc)


def test_huge_integers_and_tiny_readings_are_errors(worker):
    doc = document(
        stations=[
            {
                "id": "S1",
                "position": 0.3,
                "readings": [reading("r1", 10**400), reading("r2", 0.001), reading("r3", 8.0)],
            }
        ]
    )
    errs = _errors(doc)
    assert any("reading 'r1' / value: Input should be a valid number" in e for e in errs), errs
    assert any("thickness 0.001 mm is outside the allowed range (0.01 to 500 mm" in e for e in errs)
    _run_refused(worker, doc)


def test_schema_bounds_equal_the_limits():
    """The published schema and core.limits say the same numbers."""
    d = schema()["$defs"]
    assert schema()["properties"]["members"]["maxItems"] == limits.MAX_MEMBERS
    assert d["member"]["properties"]["stations"]["maxItems"] == limits.MAX_STATIONS
    assert d["member"]["properties"]["rivets"]["maxItems"] == limits.MAX_RIVET_LINES
    assert d["station"]["properties"]["readings"]["maxItems"] == limits.MAX_READINGS
    assert d["station"]["properties"]["bands"]["maxItems"] == limits.MAX_CUTS
    assert d["station"]["properties"]["perforations"]["maxItems"] == limits.MAX_CUTS
    assert d["station"]["properties"]["photos"]["maxItems"] == limits.MAX_LIST
    assert d["station"]["properties"]["notes"]["maxLength"] == limits.MAX_TEXT
    assert d["rivet_line_states"]["properties"]["states"]["maxItems"] == limits.MAX_RIVETS_PER_LINE
    assert d["vehicle"]["properties"]["axles"]["maxItems"] == limits.MAX_AXLES
    assert d["section"]["properties"]["parts"]["maxItems"] == limits.MAX_PARTS
    assert d["reading"]["properties"]["id"]["maxLength"] == limits.MAX_ID
