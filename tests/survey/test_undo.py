"""Undo per person and per device: two handles (two devices) on one store file.

The rules under test are our own (core/survey/undo.py): undo reverts the last change of the
same person on the same device, never another's, and is refused with a reason when somebody
else has changed what it would revert. Properties, no outside source needed.
"""

from __future__ import annotations

import contextlib
import json
import sqlite3

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from core.errors import InputError, StoreError
from core.survey import UndoRefusedError
from core.survey.migrations import DEVICE_BEFORE_V3, V2_SCHEMA, made_by, migrated_uid
from core.survey.store import FieldStore

from .helpers import header, member

WEB = {"part": "web", "unit": "mm"}


def two_devices(path):
    """One store file set up in the office, and two handles on it: tablet A and tablet B."""
    with FieldStore.create(path, header(), who="eve", device="office") as o:
        o.add_member(member(), "eve")
        o.add_station("G1", {"id": "S1", "position": 0.5}, "eve")
    return FieldStore.open(path, device="tablet-A"), FieldStore.open(path, device="tablet-B")


def readings(store):
    return {r.id: r.value for r in store.station("G1", "S1").readings}


@pytest.fixture
def pair(tmp_path):
    a, b = two_devices(tmp_path / "two.asf")
    yield a, b
    a.close()
    b.close()


def test_undo_on_a_never_touches_b_entry(pair):
    a, b = pair
    a.add_reading("G1", "S1", {**WEB, "value": 8.0}, "ann")  # r1 on A
    b.add_reading("G1", "S1", {**WEB, "value": 7.0}, "bob")  # r2 on B, the newest change
    undone = a.undo_last("ann")
    assert [(h.entity, h.who, h.device) for h in undone] == [("r1", "ann", "tablet-A")]
    assert readings(a) == readings(b) == {"r2": 7.0}
    # ann has nothing else to undo on A; the office's set-up is not hers
    assert a.undo_last("ann") == [] and a.undo_last("eve") == []
    assert readings(b) == {"r2": 7.0} and [m.id for m in b.to_survey().members] == ["G1"]
    assert [h.entity for h in b.undo_last("bob")] == ["r2"]  # bob undoes his own
    assert b.undo_last("bob") == [] and readings(a) == {}


def test_the_same_person_on_another_device_is_someone_else(pair):
    a, b = pair
    a.add_reading("G1", "S1", {**WEB, "value": 8.0}, "ann")
    assert b.undo_last("ann") == []  # ann on B: her change on A is not B's to undo
    assert readings(a) == {"r1": 8.0}


def test_undo_refused_when_someone_else_changed_it_since(pair):
    a, b = pair
    a.add_reading("G1", "S1", {**WEB, "value": 8.0}, "ann")
    b.update_reading("G1", "S1", "r1", {"value": 8.4}, "bob")
    history = len(a.history())
    plan = a.undo_plan("ann")
    assert not plan.possible and "changed since by bob on device tablet-B" in plan.refused
    with pytest.raises(UndoRefusedError, match="their work is never undone"):
        a.undo_last("ann")
    assert readings(a) == {"r1": 8.4} and len(a.history()) == history  # nothing changed
    b.undo_last("bob")  # once bob takes his change back, ann's undo is possible again
    assert a.undo_plan("ann").possible
    a.undo_last("ann")
    assert readings(a) == {}


def test_undo_of_a_station_is_refused_when_another_read_there(pair):
    a, b = pair
    a.add_station("G1", {"id": "S2", "position": 3.0}, "ann")
    b.add_reading("G1", "S2", {**WEB, "value": 9.0}, "bob")
    with pytest.raises(UndoRefusedError, match="reading r1 at G1 / S2 was changed since by bob"):
        a.undo_last("ann")
    assert [s.id for s in a.to_survey().members[0].stations] == ["S1", "S2"]


def test_every_undo_is_a_change_of_its_own(pair):
    a, b = pair
    saved = a.add_reading("G1", "S1", {**WEB, "value": 8.0}, "ann")
    add = next(h for h in a.history() if h.entity == saved.id)
    a.undo_last("ann")
    rows = [h for h in b.history() if h.entity == saved.id]
    assert [(h.action, h.who, h.device, h.undone) for h in rows] == [
        ("add", "ann", "tablet-A", True),
        ("undo", "ann", "tablet-A", False),
    ]
    assert rows[1].change > add.change and rows[1].undoes == add.change
    assert (rows[1].old, rows[1].new) == (add.new, None)


def test_plan_says_what_undo_will_do_and_changes_nothing(pair):
    a, _b = pair
    a.add_reading("G1", "S1", {**WEB, "value": 9.5}, "ann")
    before = (a.history(), readings(a))
    plan = a.undo_plan("ann")
    assert plan.possible and [(h.action, h.entity, h.new["value"]) for h in plan.rows] == [
        ("add", "r1", 9.5)
    ]
    assert (a.history(), readings(a)) == before
    assert a.undo_last("ann", change=plan.change) == list(plan.rows)
    with pytest.raises(UndoRefusedError, match="nothing was undone"):
        a.undo_last("ann", change=plan.change)  # that change is gone: the next one is older


def test_undo_never_removes_the_last_member(tmp_path):
    s = FieldStore.create(tmp_path / "one.asf", header(), who="ann", device="tablet-A")
    s.add_member(member(), "ann")
    plan = s.undo_plan("ann")
    assert not plan.possible and "last member of the survey ('G1')" in plan.refused
    with pytest.raises(UndoRefusedError):
        s.undo_last("ann")
    assert [m.id for m in s.to_survey().members] == ["G1"]
    s.close()


def test_withdrawal_never_leaves_a_band_without_thickness(pair):
    a, _b = pair
    a.add_band("G1", "S1", {"id": "b1", "part": "web", "lo": 100, "hi": 200}, "ann")
    a.add_reading("G1", "S1", {**WEB, "region": "b1", "value": 6.2}, "ann")
    with pytest.raises(InputError, match="neither a thickness t nor readings"):
        a.delete_reading("G1", "S1", "r1", "ann")  # the band's only reading
    with pytest.raises(InputError, match="region 'b1' is not 'h', 'v' nor a band id"):
        a.delete_band("G1", "S1", "b1", "ann")  # a reading is still on it
    assert readings(a) == {"r1": 6.2} and [b.id for b in a.station("G1", "S1").bands] == ["b1"]
    with a.batch("ann"):  # the band with its readings, as one change: valid, and undoable
        a.delete_reading("G1", "S1", "r1", "ann")
        a.delete_band("G1", "S1", "b1", "ann")
    assert readings(a) == {} and a.station("G1", "S1").bands == []
    a.undo_last("ann")
    assert readings(a) == {"r1": 6.2} and [b.id for b in a.station("G1", "S1").bands] == ["b1"]
    # undo of the reading itself would leave the band without a thickness: refused too
    with pytest.raises(UndoRefusedError, match=r"left with an error: .* neither a thickness t"):
        a.undo_last("ann")
    assert readings(a) == {"r1": 6.2}


def test_undo_inside_a_batch_is_refused(pair):
    a, _b = pair
    with pytest.raises(StoreError, match="inside a batch"), a.batch("ann"):
        a.undo_last("ann")


# ------------------------------------------------------------------ property
_steps = st.lists(
    st.tuples(st.sampled_from("AB"), st.sampled_from(["add", "fix", "undo"]), st.integers(0, 9)),
    min_size=1,
    max_size=14,
)


@settings(
    max_examples=25, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture]
)
@given(steps=_steps)
def test_an_undo_changes_only_its_own_persons_entries(tmp_path_factory, steps):
    """Random entries, corrections and undos on two devices: each undo leaves every entry
    last written by the other device exactly as it was, and the store stays valid."""
    a, b = two_devices(tmp_path_factory.mktemp("prop") / "p.asf")
    handles, who = {"A": a, "B": b}, {"A": "ann", "B": "bob"}
    try:
        for dev, op, k in steps:
            h = handles[dev]
            live = h.station("G1", "S1").readings
            if op == "add":
                h.add_reading("G1", "S1", {**WEB, "value": 6.0 + k / 10}, who[dev])
            elif op == "fix" and live:
                r = live[k % len(live)]
                h.update_reading("G1", "S1", r.id, {"value": 5.0 + k / 10}, who[dev])
            elif op == "undo":
                other = "B" if dev == "A" else "A"
                theirs = _last_written_by(h, handles[other].device)
                with contextlib.suppress(UndoRefusedError):
                    h.undo_last(who[dev], keep_last_member=True)
                # (an undone correction may give an entry back its value from the other
                # device: entries can join, never leave or change)
                assert theirs.items() <= _last_written_by(h, handles[other].device).items()
        doc = a.to_survey().document()
        assert json.loads(json.dumps(doc)) == b.to_survey().document()
    finally:
        a.close()
        b.close()


def _last_written_by(store, device):
    """Live readings whose last live write was made on ``device``: id -> value."""
    last: dict[str, str] = {}
    for h in store.history():
        if h.kind == "reading" and h.action in ("add", "update") and not h.undone:
            last[h.entity] = h.device
    now = readings(store)
    return {rid: now[rid] for rid, dev in last.items() if dev == device and rid in now}


# ------------------------------------------------------------------ migration v2 -> v3
def _v2_store(path):
    conn = sqlite3.connect(path)
    conn.executescript(V2_SCHEMA)
    m = member()
    conn.executemany(
        "INSERT INTO meta VALUES (?, ?)",
        [
            ("format", "asfound.store"),
            ("created", "2024-05-06T07:08:09.000+00:00"),
            ("survey", json.dumps(header())),
            ("note", json.dumps("invented")),
        ],
    )
    conn.execute(
        "INSERT INTO entity(kind, member, station, id, seq, data) VALUES (?, ?, ?, ?, ?, ?)",
        ("member", "G1", "", "G1", 1, json.dumps(m)),
    )
    conn.execute(
        "INSERT INTO history(change, at, who, action, kind, member, station, entity, field, new)"
        " VALUES (1, '2024-05-06T07:08:10', 'ann', 'add', 'member', 'G1', '', 'G1', '*', ?)",
        (json.dumps(m),),
    )
    conn.execute("PRAGMA user_version = 2")
    conn.commit()
    conn.close()


def test_migration_v2_to_v3_keeps_everything_and_states_the_device(tmp_path):
    p, q = tmp_path / "a.asf", tmp_path / "copy.asf"
    _v2_store(p)
    q.write_bytes(p.read_bytes())
    with FieldStore.open(p, device="tablet-A") as s:
        hist = s.history()
        assert hist[0].device == DEVICE_BEFORE_V3 and hist[0].who == "ann"
        steps = [(h.device, h.old, h.new) for h in hist if h.action == "migrate"]
        assert steps == [("tablet-A", 2, 3), ("tablet-A", 3, 4)]
        assert s.undo_last("ann") == []  # made before devices were recorded: nobody's
        assert [m.id for m in s.to_survey().members] == ["G1"]
        s.add_station("G1", {"id": "S1", "position": 1.0}, "ann")  # works as layout 3
    uids = []
    for path, dev in ((p, "tablet-A"), (q, "tablet-B")):
        with FieldStore.open(path, device=dev):
            pass
        conn = sqlite3.connect(path)
        uids.append(dict(conn.execute("SELECT id, uid FROM entity ORDER BY seq").fetchall()))
        conn.close()
    # entries that existed before: the same uid in both copies; new ones: unique
    assert (
        uids[0]["G1"]
        == uids[1]["G1"]
        == migrated_uid(
            "2024-05-06T07:08:09.000+00:00",
            "member",
            "G1",
            "",
            "G1",
            made_by("2024-05-06T07:08:10", "ann", json.dumps(member())),
        )
    )
    assert len(uids[0]["S1"]) == 32 and uids[0]["S1"] != uids[0]["G1"]
    assert (tmp_path / "a.asf.v2.bak").exists()


def test_a_store_refuses_a_bad_device_id(tmp_path):
    with pytest.raises(InputError, match="device id 'tablet A!'"):
        FieldStore.create(tmp_path / "x.asf", header(), device="tablet A!")
    assert not (tmp_path / "x.asf").exists()


def test_formerly_reaches_own_earlier_names_never_another_person(tmp_path):
    """A person whose name was corrected undoes their entries made under the earlier name
    (``formerly``), on this device only; another person's entries stay out of reach even
    when they are the newest."""
    with FieldStore.create(tmp_path / "s.asf", header(), who="eve", device="tab-a") as s:
        s.add_member(member(), "eve")
        s.add_station("G1", {"id": "S1", "position": 0.5}, "eve")
        mine = s.add_reading("G1", "S1", {**WEB, "value": 8.0}, "Ann Smyth (AS)")
        s.add_reading("G1", "S1", {**WEB, "value": 7.0}, "Bo Lund (BL)")  # another person
        # under the corrected name nothing is found, with the earlier one it is hers
        assert s.undo_plan("Ann Smith (AS)").change is None
        plan = s.undo_plan("Ann Smith (AS)", formerly=("Ann Smyth (AS)",))
        assert plan.possible and plan.rows[0].entity == mine.id
        rows = s.undo_last("Ann Smith (AS)", formerly=("Ann Smyth (AS)",))
        assert [r.entity for r in rows] == [mine.id]
        left = s.to_survey().members[0].stations[0].readings
        assert [r.value for r in left] == [7.0]  # Bo's reading untouched
        assert s.history()[-1].who == "Ann Smith (AS)"  # the undo is under today's name
        # nothing more of hers: Bo's entry is never offered to her
        assert s.undo_last("Ann Smith (AS)", formerly=("Ann Smyth (AS)",)) == []
        assert s.undo_plan("Bo Lund (BL)").possible


def test_formerly_does_not_cross_devices(tmp_path):
    path = tmp_path / "s.asf"
    with FieldStore.create(path, header(), who="eve", device="tab-a") as a:
        a.add_member(member(), "eve")
        a.add_station("G1", {"id": "S1", "position": 0.5}, "eve")
    with FieldStore.open(path, device="tab-b") as b:
        b.add_reading("G1", "S1", {**WEB, "value": 8.0}, "Ann Smyth (AS)")
    with FieldStore.open(path, device="tab-a") as a:
        assert a.undo_plan("Ann Smith (AS)", formerly=("Ann Smyth (AS)",)).change is None
