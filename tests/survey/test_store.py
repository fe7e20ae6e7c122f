"""The field store: entries, history, soft deletes, undo, validation on entry."""

from __future__ import annotations

import threading

import pytest

from core.errors import InputError, StoreError
from core.survey.store import FieldStore

from .helpers import header, member


@pytest.fixture
def store(tmp_path):
    s = FieldStore.create(tmp_path / "s.asf", header(), note="invented")
    s.add_member(member(), "ann")
    s.add_station("G1", {"id": "S1", "position": 0.5}, "ann")
    yield s
    s.close()


def test_create_never_overwrites(tmp_path):
    p = tmp_path / "x.asf"
    p.write_bytes(b"precious")
    with pytest.raises(StoreError, match="never overwritten"):
        FieldStore.create(p, header())
    assert p.read_bytes() == b"precious"


def test_entries_and_auto_ids(store):
    a = store.add_reading("G1", "S1", {"part": "web", "value": 8.2, "unit": "mm"}, "ann")
    b = store.add_reading("G1", "S1", {"part": "web", "value": 8.4, "unit": "mm"}, "ann")
    assert (a.id, b.id) == ("r1", "r2")
    r = store.to_survey().members[0].stations[0].readings
    assert [x.value for x in r] == [8.2, 8.4]
    assert r[0].who == "ann" and r[0].time  # defaults: the person entering, now


def test_warnings_are_returned_not_raised(store):
    saved = store.add_reading("G1", "S1", {"part": "web", "value": 0.38, "unit": "mm"}, "ann")
    assert saved.id == "r1"
    assert len(saved.warnings) == 1 and "unit slip" in saved.warnings[0].message
    assert store.to_survey().members[0].stations[0].readings[0].value == 0.38  # kept as entered


@pytest.mark.parametrize(
    ("entry", "text"),
    [
        ({"part": "webb", "value": 8, "unit": "mm"}, "unknown part id 'webb'; known parts: ['web'"),
        ({"part": "web", "value": -2, "unit": "mm"}, "-2 mm is outside the allowed range"),
        ({"part": "web", "value": 0, "unit": "mm"}, "0 mm is outside the allowed range"),
        ({"part": "web", "value": float("nan"), "unit": "mm"}, "finite number"),
        ({"part": "web", "value": "abc", "unit": "mm"}, "valid number"),
        ({"part": "web", "value": 9, "unit": "kip"}, "not a length unit"),
    ],
)
def test_bad_reading_refused_with_place(store, entry, text):
    with pytest.raises(InputError) as ei:
        store.add_reading("G1", "S1", entry, "ann")
    assert text in str(ei.value)
    assert "member 'G1' / station 'S1'" in str(ei.value)
    assert store.to_survey().members[0].stations[0].readings == []


def test_unknown_member_and_station_ids(store):
    with pytest.raises(InputError, match="unknown station id 'S9'"):
        store.add_reading("G1", "S9", {"part": "web", "value": 8, "unit": "mm"}, "ann")
    with pytest.raises(InputError, match="unknown member id 'G7'"):
        store.add_station("G7", {"id": "S2", "position": 1.0}, "ann")


def test_station_outside_member_and_rivet_beyond_member(store):
    with pytest.raises(
        InputError, match=r"station position 12.5 m is outside the member \(0 to 12 m\)"
    ):
        store.add_station("G1", {"id": "S2", "position": 12.5}, "ann")
    with pytest.raises(InputError, match=r"rivet at 12.4 m is beyond the member \(0 to 12 m\)"):
        store.set_rivet_state("G1", "web_bottom", 12.4, "missing", "ann")
    with pytest.raises(InputError, match="rivet state 'gone'"):
        store.set_rivet_state("G1", "web_bottom", 1.0, "gone", "ann")


def test_perforation_outside_its_plate(store):
    with pytest.raises(
        InputError, match=r"perforation outside its plate: 1190 to 1250 mm .*0 to 1200 mm"
    ):
        store.add_perforation("G1", "S1", {"part": "web", "lo": 1190, "hi": 1250}, "ann")


def test_update_keeps_history_and_delete_is_soft(store):
    store.add_reading("G1", "S1", {"part": "web", "value": 0.33, "unit": "mm"}, "ann")
    store.update_reading("G1", "S1", "r1", {"value": 0.33, "unit": "in"}, "bob")
    store.delete_reading("G1", "S1", "r1", "cy")
    h = [e for e in store.history() if e.kind == "reading"]
    assert [(e.action, e.field, e.old, e.new, e.who) for e in h[1:]] == [
        ("update", "unit", "mm", "in", "bob"),
        ("delete", "*", h[0].new | {"unit": "in"}, None, "cy"),
    ]
    assert store.to_survey().members[0].stations[0].readings == []
    # ids are never reused, even of deleted entries
    with pytest.raises(InputError, match="already used by a deleted entry"):
        store.add_reading("G1", "S1", {"id": "r1", "part": "web", "value": 8, "unit": "mm"}, "ann")
    assert (
        store.add_reading("G1", "S1", {"part": "web", "value": 8, "unit": "mm"}, "ann").id == "r2"
    )


def test_undo_last_reverts_and_records(store):
    store.add_reading("G1", "S1", {"part": "web", "value": 8.0, "unit": "mm"}, "ann")
    store.update_reading("G1", "S1", "r1", {"value": 7.5}, "ann")
    store.set_note("G1", "S1", "pack rust <heavy> & scale", "ann")
    assert store.to_survey().members[0].stations[0].notes == "pack rust <heavy> & scale"
    assert store.undo_last("bob") == []  # bob made none of these: nothing of his to undo
    undone = store.undo_last("ann")
    assert [(e.field, e.old, e.new) for e in undone] == [("notes", "", "pack rust <heavy> & scale")]
    assert store.to_survey().members[0].stations[0].notes == ""
    store.undo_last("ann")
    assert store.to_survey().members[0].stations[0].readings[0].value == 8.0
    store.undo_last("ann")
    assert store.to_survey().members[0].stations[0].readings == []
    undo_rows = [e for e in store.history() if e.action == "undo"]
    assert len(undo_rows) == 3 and all(e.who == "ann" for e in undo_rows)
    assert all(e.device == store.device for e in undo_rows)
    store.delete_station("G1", "S1", "ann")
    store.undo_last("ann")  # undo a delete: the station is back
    assert [s.id for s in store.to_survey().members[0].stations] == ["S1"]


def test_set_rivet_state_matches_the_run_and_undoes(store):
    run = {"line": "web_bottom", "run": {"start": 0.05, "end": 11.95, "pitch": 0.1}, "states": []}
    store.update_member("G1", {"rivets": [run]}, "ann")
    store.set_rivet_state("G1", "web_bottom", 0.2496, "missing", "ann")  # the rivet at 0.25 m
    store.set_rivet_state("G1", "web_bottom", 0.25, "loose", "ann")
    m = store.to_survey().members[0]
    states = dict(m.rivets[0].expanded())
    assert states[0.25] == "loose" and len(states) == 120
    assert m.rivet_states("web_bottom")[2] == (pytest.approx(250.0), "loose")
    store.undo_last("ann")
    assert dict(store.to_survey().members[0].rivets[0].expanded())[0.25] == "missing"


def test_header_update_and_undo(store):
    store.update_header({"inspector": "R. Vantongeren (invented)", "standard": "aisc"}, "ann")
    assert store.header()["standard"] == "aisc"
    store.undo_last("ann")
    assert store.header()["standard"] == "aashto" and store.header()["inspector"] == ""
    with pytest.raises(InputError, match="standard"):
        store.update_header({"standard": "bs5400"}, "ann")


def test_one_writer_thread_and_a_reader(store):
    errors: list[BaseException] = []

    def writer():
        try:
            for _ in range(40):
                store.add_reading("G1", "S1", {"part": "web", "value": 8.0, "unit": "mm"}, "w")
        except BaseException as e:  # pragma: no cover - reported below
            errors.append(e)

    t = threading.Thread(target=writer)
    t.start()
    while t.is_alive():
        store.to_survey()
        store.history()
    t.join()
    assert errors == []
    assert len(store.to_survey().members[0].stations[0].readings) == 40


@pytest.mark.parametrize(
    "changes, text",
    [
        ({"year_built": 18}, r"year_built.*18.*1800"),
        ({"year_built": 3025}, r"year_built.*3025"),
        ({"material": {"Fy": {"value": -5, "unit": "MPa"}}}, r"Fy.*-5.*100"),
        ({"material": {"Fy": {"value": 5000, "unit": "MPa"}}}, r"Fy.*5000.*1000"),
        (
            {
                "material": {
                    "Fy": {"value": 250, "unit": "MPa"},
                    "Fu": {"value": 100, "unit": "MPa"},
                }
            },
            r"Fu.*100",
        ),
    ],
)
def test_header_values_out_of_range_are_refused_and_nothing_changes(store, changes, text):
    """The header is checked on entry as a file's would be (core.survey.validate ranges,
    our own limits), so the store never holds a steel the assessment refuses."""
    before = store.header()
    with pytest.raises(InputError, match=text):
        store.update_header(changes, "ann")
    assert store.header() == before
    store.update_header({"year_built": 1898}, "ann")
    assert store.header()["year_built"] == 1898


def test_delete_member_is_soft_its_id_stays_used_and_undo_brings_it_back(store):
    store.add_member(member(id="G2"), "ann")
    store.add_station("G2", {"id": "S1", "position": 0.25}, "ann")
    store.delete_member("G2", "ann")
    assert [m.id for m in store.to_survey().members] == ["G1"]
    assert store.used_member_ids() == {"G1", "G2"}  # a withdrawn id is never given again
    with pytest.raises(InputError):
        store.add_member(member(id="G2"), "ann")
    store.undo_last("ann")
    back = store.to_survey().member("G2")
    assert [s.id for s in back.stations] == ["S1"]
