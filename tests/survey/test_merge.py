"""The merge of two devices' field stores: the rule on worked cases, older layouts, bad input.

The expected results follow our own merge rule (:mod:`core.survey.merge`; no outside
source applies): the later of two changes of one value is current, both are kept.
"""

from __future__ import annotations

import hashlib
import shutil
import sqlite3

import pytest

from core.errors import OutputError, StoreError
from core.survey.merge import MergeError, merge_stores
from core.survey.migrations import migrated_origin
from core.survey.store import FieldStore

from .helpers import header
from .merge_helpers import DEVICES, common_start, conflicts, dump
from .test_undo import _v2_store


def _digest(p) -> str:
    return hashlib.sha256(p.read_bytes()).hexdigest()


def _two(tmp_path):
    a, b = common_start(tmp_path)
    return a, b, FieldStore.open(a, device=DEVICES[0]), FieldStore.open(b, device=DEVICES[1])


def _readings(store, station="S1") -> dict:
    st = next(s for s in store.to_survey().members[0].stations if s.id == station)
    return {r.id: (r.value, r.who) for r in st.readings}


def test_worked_case_later_value_wins_ids_renamed_nothing_lost(tmp_path):
    a, b, sa, sb = _two(tmp_path)
    sa.add_reading("G1", "S1", {"part": "web", "value": 7.5, "unit": "mm"}, "ann")  # r4
    sb.add_reading("G1", "S1", {"part": "web", "value": 7.7, "unit": "mm"}, "bob")  # r4 too
    sa.update_reading("G1", "S1", "r1", {"value": 8.0}, "ann")
    sb.update_reading("G1", "S1", "r1", {"value": 8.2}, "bob")  # later: current
    sa.add_station("G1", {"id": "S4", "position": 2.0}, "ann")
    sb.add_station("G1", {"id": "S4", "position": 3.0}, "bob")  # later: renamed S4-2
    sb.add_reading("G1", "S4", {"part": "web", "value": 7.1, "unit": "mm"}, "bob")
    sa.set_note("G1", "S1", "pack rust at the lower flange", "ann")  # only on A
    sa.close()
    sb.close()
    res = merge_stores(a, b, tmp_path / "c.asf", device="office")
    assert (res.only_a, res.only_b) == (2, 3)
    with FieldStore.open(res.output, device=DEVICES[0]) as c:
        assert _readings(c) == {
            "r1": (8.2, "office"),
            "r2": (8.4, "office"),
            "r3": (7.9, "office"),
            "r4": (7.5, "ann"),
            "r5": (7.7, "bob"),
        }
        survey = c.to_survey()
        st = {s.id: s for s in survey.members[0].stations}
        assert (st["S4"].position, st["S4-2"].position) == (2.0, 3.0)
        assert [r.value for r in st["S4-2"].readings] == [7.1]
        assert st["S1"].notes == "pack rust at the lower flange"
        # both values of r1 are in the history, with their persons and devices
        r1 = [
            (h.who, h.device, h.new) for h in c.history() if h.entity == "r1" and h.field == "value"
        ]
        assert r1 == [("ann", DEVICES[0], 8.0), ("bob", DEVICES[1], 8.2)]
        # the merged store works on: ann's last change on her device can be undone
        assert c.undo_last("ann")[0].field == "notes"
    kinds = sorted((x.what, x.entity, x.kept, x.other) for x in res.conflicts)
    assert kinds == [
        ("renamed", "S4", "S4", "S4-2"),
        ("renamed", "r4", "r4", "r5"),
        ("value", "r1", "8.2", "8.0"),
    ]
    assert len(conflicts(res.output)) == 3  # stored for the report


def test_a_change_of_the_header_on_both_devices_is_a_conflict(tmp_path):
    a, b, sa, sb = _two(tmp_path)
    sa.update_header({"inspector": "A. Field"}, "ann")
    sb.update_header({"inspector": "B. Field", "structure": "Mill Creek (invented)"}, "bob")
    sa.close()
    sb.close()
    res = merge_stores(a, b, tmp_path / "c.asf")
    with FieldStore.open(res.output) as c:
        h = c.header()
    assert (h["inspector"], h["structure"]) == ("B. Field", "Mill Creek (invented)")
    assert [(x.what, x.kind, x.field) for x in res.conflicts] == [("value", "survey", "inspector")]


def test_withdrawn_on_one_device_changed_on_the_other_is_listed(tmp_path):
    a, b, sa, sb = _two(tmp_path)
    sa.delete_station("G1", "S1", "ann")
    sb.add_reading("G1", "S1", {"part": "web", "value": 7.2, "unit": "mm"}, "bob")
    sa.close()
    sb.close()
    res = merge_stores(a, b, tmp_path / "c.asf")
    assert [(x.what, x.entity) for x in res.conflicts] == [("withdrawn", "S1")]
    ents = dump(res.output)[0]
    assert sum(1 for e in ents if e[1] == "reading") == 4  # bob's reading is kept


def test_merging_the_merge_again_with_a_device_that_went_on(tmp_path):
    """A device that kept working on its own store after a merge: merged again, its
    renamed station keeps its new id and nothing is doubled."""
    a, b, sa, sb = _two(tmp_path)
    sa.add_station("G1", {"id": "S4", "position": 2.0}, "ann")
    sb.add_station("G1", {"id": "S4", "position": 3.0}, "bob")
    sa.close()
    c = merge_stores(a, b, tmp_path / "c.asf").output
    sb.add_reading("G1", "S4", {"part": "web", "value": 7.1, "unit": "mm"}, "bob")
    sb.close()
    d = merge_stores(c, b, tmp_path / "d.asf")
    with FieldStore.open(d.output) as s:
        st = {x.id: x for x in s.to_survey().members[0].stations}
        assert sorted(st) == ["S1", "S4", "S4-2"]
        assert [r.value for r in st["S4-2"].readings] == [7.1]
        adds = [h for h in s.history() if h.action == "add" and h.kind == "station"]
        assert len(adds) == 3
    assert [x.what for x in d.conflicts] == []
    assert dump(merge_stores(b, c, tmp_path / "e.asf").output)[:2] == dump(d.output)[:2]


def test_inputs_of_older_layouts_are_read_and_never_migrated(tmp_path):
    a, b = tmp_path / "a.asf", tmp_path / "b.asf"
    _v2_store(a)
    shutil.copy(a, b)
    with FieldStore.open(b, device=DEVICES[1]) as s:  # one device migrated it and went on
        s.add_station("G1", {"id": "S2", "position": 2.0}, "bob")
    before = _digest(a)
    res = merge_stores(a, b, tmp_path / "c.asf")
    assert _digest(a) == before and not (tmp_path / "a.asf.v2.bak").exists()
    with FieldStore.open(res.output) as s:
        assert [x.id for x in s.to_survey().members[0].stations] == ["S2"]


def _as_layout_3(path):
    conn = sqlite3.connect(path)
    conn.execute("DROP TABLE conflict")
    conn.execute("DELETE FROM meta WHERE key = 'origin'")
    conn.execute("PRAGMA user_version = 3")
    conn.commit()
    conn.close()


def test_a_layout_3_store_opens_and_its_copies_keep_one_identity(tmp_path):
    a, b = common_start(tmp_path)
    _as_layout_3(a)
    shutil.copy(a, b)
    origins = []
    for p, dev in ((a, DEVICES[0]), (b, DEVICES[1])):
        with FieldStore.open(p, device=dev) as s:
            assert len(s.to_survey().members[0].stations[0].readings) == 3
            assert [(h.old, h.new) for h in s.history() if h.action == "migrate"] == [(3, 4)]
        origins.append(dump(p)[2]["origin"])
        assert (tmp_path / f"{p.name}.v3.bak").exists()
    created = dump(a)[2]["created"]
    assert origins == [migrated_origin(created)] * 2
    merge_stores(a, b, tmp_path / "c.asf")  # the same survey


# ------------------------------------------------------------------ bad input
def _unchanged(tmp_path, paths, out, err, match):
    before = {p: _digest(p) for p in [*paths, out] if p.exists()}
    with pytest.raises(err, match=match):
        merge_stores(*paths, out)
    assert {p: _digest(p) for p in before} == before  # inputs (and an existing output) kept
    assert out.exists() == (out in before) and not list(tmp_path.glob(".*.tmp"))


def test_stores_of_different_surveys_are_refused(tmp_path):
    a, _b = common_start(tmp_path)
    other = tmp_path / "other.asf"
    FieldStore.create(other, header(id="T-2"), device=DEVICES[1]).close()
    _unchanged(
        tmp_path,
        [a, other],
        tmp_path / "c.asf",
        MergeError,
        r"a\.asf .*'T-1'.*other\.asf .*'T-2'.*different surveys",
    )
    # two stores made apart from one survey file are two surveys too
    again = tmp_path / "again.asf"
    FieldStore.create(again, header(), device=DEVICES[1]).close()
    _unchanged(tmp_path, [a, again], tmp_path / "c.asf", MergeError, "only copies of one store")


def test_not_a_store_newer_layout_same_store_twice_and_existing_output(tmp_path):
    a, b = common_start(tmp_path)
    text = tmp_path / "notes.txt"
    text.write_text("not a store\n")
    _unchanged(
        tmp_path,
        [a, text],
        tmp_path / "c.asf",
        StoreError,
        r"notes\.txt: not an asfound field store",
    )
    _unchanged(
        tmp_path,
        [a, tmp_path / "gone.asf"],
        tmp_path / "c.asf",
        StoreError,
        r"gone\.asf: no such field store",
    )
    conn = sqlite3.connect(b)
    conn.execute("PRAGMA user_version = 9")
    conn.commit()
    conn.close()
    _unchanged(
        tmp_path, [a, b], tmp_path / "c.asf", StoreError, r"b\.asf: store layout version 9 is newer"
    )
    _unchanged(tmp_path, [a, a], tmp_path / "c.asf", MergeError, "are the same store")
    link = tmp_path / "link.asf"
    link.hardlink_to(a)
    _unchanged(tmp_path, [a, link], tmp_path / "c.asf", MergeError, "are the same store")
    b.write_bytes(a.read_bytes())
    _unchanged(tmp_path, [a, b], b, OutputError, "it is the input")
    existing = tmp_path / "existing.txt"
    existing.write_text("keep me\n")
    _unchanged(tmp_path, [a, b], existing, OutputError, "a new store never replaces a file")
    assert existing.read_text() == "keep me\n"


def test_a_damaged_input_is_refused_naming_it(tmp_path):
    a, b = common_start(tmp_path)
    data = bytearray(b.read_bytes())
    data[2 * 4096 : 2 * 4096 + 100] = b"\xa5" * 100
    b.write_bytes(bytes(data))
    _unchanged(tmp_path, [a, b], tmp_path / "c.asf", StoreError, r"b\.asf: .*damaged")


def test_entries_that_disagree_after_the_merge_are_kept_and_named(tmp_path):
    """One device shortens the member, the other adds a station beyond the new end: both
    are kept, and the merge names the error for the inspector to correct."""
    a, b, sa, sb = _two(tmp_path)
    sa.update_member("G1", {"span": {"value": 6.0, "unit": "m"}}, "ann")
    sb.add_station("G1", {"id": "S9", "position": 9.0}, "bob")
    sa.close()
    sb.close()
    res = merge_stores(a, b, tmp_path / "c.asf")
    assert len(res.errors) == 1 and "S9" in res.errors[0] and "outside the member" in res.errors[0]
    with FieldStore.open(res.output) as s:
        assert [x.id for x in s.to_survey().members[0].stations] == ["S1", "S9"]


def test_names_with_uri_characters_and_a_store_open_in_the_app(tmp_path):
    """Inputs named with ``?``, ``#``, ``%`` and spaces, one of them open for writing
    (as the app keeps it) with an entry not yet checkpointed: read as they are, unchanged."""
    folder = tmp_path / "site #2 ?x%20"
    folder.mkdir()
    a, b = common_start(folder)
    live = FieldStore.open(b, device=DEVICES[1])
    try:
        live.add_station("G1", {"id": "S5", "position": 5.0}, "bob")
        before = (_digest(a), _digest(b))
        res = merge_stores(a, b, folder / "c #3.asf")
        assert (_digest(a), _digest(b)) == before
        with FieldStore.open(res.output) as s:
            assert [x.id for x in s.to_survey().members[0].stations] == ["S1", "S5"]
        live.add_station("G1", {"id": "S6", "position": 6.0}, "bob")  # still writable
    finally:
        live.close()


def test_two_bands_with_one_id_keep_their_own_readings(tmp_path):
    """Both devices draw band ``b1`` at S1 and read on it: the later band is renamed and
    the readings on it follow (their region), in the entries and in the history."""
    a, b, sa, sb = _two(tmp_path)
    for s, who, lo, v in ((sa, "ann", 100, 6.2), (sb, "bob", 500, 5.9)):
        with s.batch(who):
            s.add_band("G1", "S1", {"id": "b1", "part": "web", "lo": lo, "hi": lo + 100}, who)
            s.add_reading(
                "G1", "S1", {"part": "web", "region": "b1", "value": v, "unit": "mm"}, who
            )
        s.close()
    res = merge_stores(a, b, tmp_path / "c.asf")
    assert sorted((x.what, x.kind, x.kept, x.other) for x in res.conflicts) == [
        ("renamed", "band", "b1", "b2"),
        ("renamed", "reading", "r4", "r5"),
    ]
    assert res.errors == ()
    with FieldStore.open(res.output) as c:
        st = c.station("G1", "S1")
        assert {x.id: (x.lo, x.hi) for x in st.bands} == {"b1": (100, 200), "b2": (500, 600)}
        assert {x.id: (x.region, x.value) for x in st.readings if x.region} == {
            "r4": ("b1", 6.2),
            "r5": ("b2", 5.9),
        }
        added = {h.entity: h.new for h in c.history() if h.action == "add" and h.kind != "survey"}
        assert added["b2"]["id"] == "b2" and added["r5"]["region"] == "b2"


def test_a_store_with_absurdly_nested_content_is_refused_with_a_store_error(tmp_path):
    """Fuzz finding (review): an entity whose JSON nests deeper than Python's recursion limit
    is refused with asfound's own error naming the file, never a traceback; nothing written."""
    a, b = common_start(tmp_path)
    conn = sqlite3.connect(b)
    deep = "[" * 100_000 + "]" * 100_000
    conn.execute("UPDATE entity SET data = ? WHERE kind = 'reading'", (deep,))
    conn.commit()
    conn.close()
    out = tmp_path / "c.asf"
    with pytest.raises(StoreError, match=r"b\.asf"):
        merge_stores(a, b, out)
    assert not out.exists()
