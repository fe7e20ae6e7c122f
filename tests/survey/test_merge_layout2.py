"""Two copies of one store split at layout 2 (before devices and uids were recorded), worked
on apart, then migrated and merged: shared entries are one entry, entries made apart are
not mixed.

The rule is our own (:mod:`core.survey.migrations`: the uid of an entry made before layout
3 comes from the history row that made it, else from its content); no outside source
applies. The stores are built row by row as layout 2 wrote them (invented values only).
"""

from __future__ import annotations

import json
import shutil
import sqlite3

import pytest

from core.survey.merge import merge_stores
from core.survey.migrations import V2_SCHEMA, migrated_uid
from core.survey.store import FieldStore

from .helpers import header, member
from .merge_helpers import DEVICES

CREATED = "2024-05-06T07:08:09.000+00:00"


def _reading(rid: str, value: float) -> dict:
    return {"id": rid, "part": "web", "region": None, "value": value, "unit": "mm"}


class V2:
    """A layout 2 store written row by row, as layout 2 did."""

    def __init__(self, path):
        self.conn = sqlite3.connect(path)

    def close(self) -> None:
        self.conn.commit()
        self.conn.close()

    def _change(self) -> int:
        return self.conn.execute("SELECT COALESCE(MAX(change), 0) + 1 FROM history").fetchone()[0]

    def add(self, kind, mem, station, data, at, who, *, history=True) -> None:
        seq = self.conn.execute("SELECT COALESCE(MAX(seq), 0) + 1 FROM entity").fetchone()[0]
        self.conn.execute(
            "INSERT INTO entity(kind, member, station, id, seq, data) VALUES (?, ?, ?, ?, ?, ?)",
            (kind, mem, station, data["id"], seq, json.dumps(data)),
        )
        if history:
            self.conn.execute(
                "INSERT INTO history(change, at, who, action, kind, member, station, entity,"
                " field, new) VALUES (?, ?, ?, 'add', ?, ?, ?, ?, '*', ?)",
                (self._change(), at, who, kind, mem, station, data["id"], json.dumps(data)),
            )

    def update(self, rid: str, value: float, at: str, who: str) -> None:
        (text,) = self.conn.execute(
            "SELECT data FROM entity WHERE kind = 'reading' AND id = ?", (rid,)
        ).fetchone()
        data = json.loads(text)
        old, data["value"] = data["value"], value
        self.conn.execute(
            "UPDATE entity SET data = ? WHERE kind = 'reading' AND id = ?", (json.dumps(data), rid)
        )
        self.conn.execute(
            "INSERT INTO history(change, at, who, action, kind, member, station, entity, field,"
            " old, new) VALUES (?, ?, ?, 'update', 'reading', 'G1', 'S1', ?, 'value', ?, ?)",
            (self._change(), at, who, rid, json.dumps(old), json.dumps(value)),
        )


def _start(tmp_path, *, unrecorded: bool = False):
    """A layout 2 store (member G1, station S1, readings r1 and r2; with ``unrecorded`` a
    reading r5 whose add row is not in the history) and a copy of it."""
    a, b = tmp_path / "a.asf", tmp_path / "b.asf"
    conn = sqlite3.connect(a)
    conn.executescript(V2_SCHEMA)
    conn.executemany(
        "INSERT INTO meta VALUES (?, ?)",
        [("format", "asfound.store"), ("created", CREATED), ("survey", json.dumps(header()))],
    )
    conn.execute("PRAGMA user_version = 2")
    conn.commit()
    conn.close()
    s = V2(a)
    s.add("member", "G1", "", member(), "2024-05-06T07:08:10", "ann")
    s.add("station", "G1", "", {"id": "S1", "position": 0.3}, "2024-05-06T07:09:00", "ann")
    s.add("reading", "G1", "S1", _reading("r1", 8.1), "2024-05-06T07:10:00", "ann")
    s.add("reading", "G1", "S1", _reading("r2", 8.4), "2024-05-06T07:10:00", "ann")
    if unrecorded:
        s.add("reading", "G1", "S1", _reading("r5", 9.0), "", "", history=False)
    s.close()
    shutil.copy(a, b)
    return a, b


def _apart(a, b) -> None:
    """Work on each copy before layout 3: both make a reading r3, each changes another."""
    s = V2(a)
    s.add("reading", "G1", "S1", _reading("r3", 7.0), "2024-06-01T10:00:00", "ann")
    s.update("r1", 8.0, "2024-06-01T10:05:00", "ann")
    s.close()
    s = V2(b)
    s.add("reading", "G1", "S1", _reading("r3", 7.4), "2024-06-02T09:00:00", "bob")
    s.update("r2", 8.3, "2024-06-02T09:05:00", "bob")
    s.close()


def _uids(path) -> dict:
    conn = sqlite3.connect(path)
    try:
        return {
            (k, i): (u, json.loads(d).get("value"))
            for k, i, u, d in conn.execute("SELECT kind, id, uid, data FROM entity")
        }
    finally:
        conn.close()


def _readings(path) -> dict:
    with FieldStore.open(path, device="office-x") as s:
        return {r.id: r.value for r in s.to_survey().members[0].stations[0].readings}


@pytest.mark.parametrize("migrated", [False, True])
def test_shared_entries_agree_and_entries_made_apart_are_both_kept(tmp_path, migrated):
    a, b = _start(tmp_path)
    _apart(a, b)
    if migrated:  # each device opened its copy with this asfound: layout 2 to 4 there
        for p, dev in ((a, DEVICES[0]), (b, DEVICES[1])):
            FieldStore.open(p, device=dev).close()
        ua, ub = _uids(a), _uids(b)
        for key in (("member", "G1"), ("station", "S1"), ("reading", "r1"), ("reading", "r2")):
            assert ua[key][0] == ub[key][0], key  # shared before the split: one uid
        assert ua[("reading", "r3")][0] != ub[("reading", "r3")][0]  # made apart: two
    ab = merge_stores(a, b, tmp_path / "ab.asf")
    ba = merge_stores(b, a, tmp_path / "ba.asf")
    for res in (ab, ba):
        # r1 and r2 are one entry each with the one change made to it; B's r3 (made
        # later) is renamed r4; nothing is mixed, nothing lost
        assert _readings(res.output) == {"r1": 8.0, "r2": 8.3, "r3": 7.0, "r4": 7.4}
        assert [(c.what, c.entity, c.kept, c.other) for c in res.conflicts] == [
            ("renamed", "r3", "r3", "r4")
        ]
        assert (res.only_a, res.only_b, res.both) == (1, 1, 4)


def test_an_entry_without_its_add_row_is_decided_by_content(tmp_path):
    # alike in both copies: one entry
    a, b = _start(tmp_path, unrecorded=True)
    FieldStore.open(a, device=DEVICES[0]).close()
    FieldStore.open(b, device=DEVICES[1]).close()
    assert _uids(a)[("reading", "r5")][0] == _uids(b)[("reading", "r5")][0]
    res = merge_stores(a, b, tmp_path / "c.asf")
    assert _readings(res.output)["r5"] == 9.0 and res.conflicts == ()
    # changed on one copy before layout 3: the copies cannot tell one entry changed from
    # two made apart, so both are kept and the clash is listed (never mixed)
    sub = tmp_path / "changed"
    sub.mkdir()
    a, b = _start(sub, unrecorded=True)
    s = V2(a)
    s.update("r5", 8.8, "2024-06-01T10:00:00", "ann")
    s.close()
    res = merge_stores(a, b, a.parent / "c.asf")
    values = _readings(res.output)
    assert sorted(v for k, v in values.items() if k not in ("r1", "r2")) == [8.8, 9.0]
    assert [(c.what, c.entity) for c in res.conflicts] == [("renamed", "r5")]


# ------------------------------------------- one copy migrated by the earlier uid rule
def _old_rule(path) -> None:
    """Give the entries of a store made before layout 3 the uids asfound gave them before
    the uid hashed the ``add`` row (creation time and key only), as a copy migrated by that
    asfound holds them."""
    conn = sqlite3.connect(path)
    try:
        for k, m, s, i in conn.execute("SELECT kind, member, station, id FROM entity").fetchall():
            conn.execute(
                "UPDATE entity SET uid = ? WHERE kind = ? AND member = ? AND station = ?"
                " AND id = ?",
                (migrated_uid(CREATED, k, m, s, i), k, m, s, i),
            )
        conn.commit()
    finally:
        conn.close()


def _history(path) -> list[tuple]:
    """History rows without their numbers and the migrations' own rows."""
    conn = sqlite3.connect(path)
    try:
        return sorted(
            conn.execute(
                "SELECT at, who, action, kind, entity, field, old, new FROM history"
                " WHERE action != 'migrate'"
            ).fetchall()
        )
    finally:
        conn.close()


@pytest.mark.parametrize("b_on_disk", [False, True])
def test_a_copy_migrated_by_the_earlier_rule_merges_without_doubling(tmp_path, b_on_disk):
    a, b = _start(tmp_path)
    _apart(a, b)
    FieldStore.open(a, device=DEVICES[0]).close()
    _old_rule(a)
    if b_on_disk:  # else b is still at layout 2 and the merge migrates it in memory
        FieldStore.open(b, device=DEVICES[1]).close()
    ua = _uids(a)
    assert ua[("reading", "r1")][0] == migrated_uid(CREATED, "reading", "G1", "S1", "r1")
    if b_on_disk:
        assert _uids(b)[("reading", "r1")][0] != ua[("reading", "r1")][0]  # two rules
    before = {p: p.read_bytes() for p in (a, b)}
    ab = merge_stores(a, b, tmp_path / "ab.asf")
    ba = merge_stores(b, a, tmp_path / "ba.asf")
    assert {p: p.read_bytes() for p in (a, b)} == before  # the inputs are untouched
    for res in (ab, ba):
        # the shared entries are one each; only the two r3 made apart are both kept
        assert _readings(res.output) == {"r1": 8.0, "r2": 8.3, "r3": 7.0, "r4": 7.4}
        assert [(c.what, c.entity, c.kept, c.other) for c in res.conflicts] == [
            ("renamed", "r3", "r3", "r4")
        ]
        assert (res.only_a, res.only_b, res.both) == (1, 1, 4)
    assert sorted(_uids(ab.output).items()) == sorted(_uids(ba.output).items())
    assert _history(ab.output) == _history(ba.output)
    # merging the result with either input again doubles nothing
    again = merge_stores(ab.output, a, tmp_path / "again.asf")
    assert _readings(again.output) == _readings(ab.output)
    assert [c.what for c in again.conflicts] == []


@pytest.mark.parametrize(
    "b_add",
    [("2024-06-01T10:00:01", "ann"), ("2024-06-01T10:00:00", "bob")],
    ids=["other-time", "other-person"],
)
def test_entries_alike_in_key_and_value_but_made_apart_are_not_collapsed(tmp_path, b_add):
    # both copies made r3 = 7.0 mm after the split; one second apart or by two people:
    # two entries, whatever the uid rule of either copy
    a, b = _start(tmp_path)
    s = V2(a)
    s.add("reading", "G1", "S1", _reading("r3", 7.0), "2024-06-01T10:00:00", "ann")
    s.close()
    s = V2(b)
    s.add("reading", "G1", "S1", _reading("r3", 7.0), *b_add)
    s.close()
    FieldStore.open(a, device=DEVICES[0]).close()
    _old_rule(a)
    for res in (
        merge_stores(a, b, tmp_path / "ab.asf"),
        merge_stores(b, a, tmp_path / "ba.asf"),
    ):
        assert _readings(res.output) == {"r1": 8.1, "r2": 8.4, "r3": 7.0, "r4": 7.0}
        assert [(c.what, c.entity, c.other) for c in res.conflicts] == [("renamed", "r3", "r4")]


def test_entries_made_alike_in_every_respect_are_one(tmp_path):
    # the same add row (time, person, content) in both copies after the split: nothing
    # tells them apart, and one entry is what was made
    a, b = _start(tmp_path)
    for p in (a, b):
        s = V2(p)
        s.add("reading", "G1", "S1", _reading("r3", 7.0), "2024-06-01T10:00:00", "ann")
        s.close()
    FieldStore.open(a, device=DEVICES[0]).close()
    _old_rule(a)
    res = merge_stores(a, b, tmp_path / "ab.asf")
    assert _readings(res.output) == {"r1": 8.1, "r2": 8.4, "r3": 7.0}
    assert res.conflicts == ()


def test_an_entry_without_its_add_row_under_two_rules_is_decided_by_content(tmp_path):
    # alike in both copies: one entry, though one copy has the earlier rule's uid
    a, b = _start(tmp_path, unrecorded=True)
    FieldStore.open(a, device=DEVICES[0]).close()
    _old_rule(a)
    res = merge_stores(b, a, tmp_path / "c.asf")
    assert _readings(res.output) == {"r1": 8.1, "r2": 8.4, "r5": 9.0} and res.conflicts == ()
    # changed on one copy (no add row to tell one entry from two): both kept, listed
    sub = tmp_path / "changed"
    sub.mkdir()
    a, b = _start(sub, unrecorded=True)
    s = V2(b)
    s.update("r5", 8.8, "2024-06-01T10:00:00", "bob")
    s.close()
    FieldStore.open(a, device=DEVICES[0]).close()
    _old_rule(a)
    for res in (merge_stores(a, b, sub / "ab.asf"), merge_stores(b, a, sub / "ba.asf")):
        values = _readings(res.output)
        assert sorted(v for k, v in values.items() if k not in ("r1", "r2")) == [8.8, 9.0]
        assert [(c.what, c.entity) for c in res.conflicts] == [("renamed", "r5")]
