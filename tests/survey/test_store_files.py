"""Store files: migration from layout v1, damaged, foreign, newer and locked files."""

from __future__ import annotations

import hashlib
import json
import sqlite3

import pytest

from core.errors import StoreError
from core.survey.migrations import CURRENT, DEVICE_BEFORE_V3, V1_SCHEMA, split_value
from core.survey.model import Survey
from core.survey.store import FieldStore

from .helpers import document, header


def _digest(p):
    return hashlib.sha256(p.read_bytes()).hexdigest()


def _v1_store(path):
    """A store in the version 1 layout, as the first field trials wrote it."""
    doc = Survey.model_validate(document()).document()
    m = dict(doc["members"][0])
    stations = m.pop("stations")
    st = {k: v for k, v in stations[0].items() if k not in ("readings", "bands", "perforations")}
    conn = sqlite3.connect(path)
    conn.executescript(V1_SCHEMA)
    conn.executemany(
        "INSERT INTO meta VALUES (?, ?)",
        [
            ("format", "asfound.store"),
            ("created", "2024-04-02T08:00:00"),
            ("survey", json.dumps(doc["survey"])),
            ("note", json.dumps("invented")),
        ],
    )
    rows = [("member", "G1", "", "G1", m), ("station", "G1", "", "S1", st)]
    for r in stations[0]["readings"]:
        v1 = dict(r)
        v1["value"] = f"{r['value']} {v1.pop('unit')}"  # version 1: one text "9.1 mm"
        rows.append(("reading", "G1", "S1", r["id"], v1))
    for seq, (kind, mem, sta, ident, data) in enumerate(rows, start=1):
        conn.execute(
            "INSERT INTO entity VALUES (?, ?, ?, ?, ?, ?)",
            (kind, mem, sta, ident, seq, json.dumps(data)),
        )
        conn.execute(
            "INSERT INTO history(at, who, action, kind, member, station, entity, field, old, new)"
            " VALUES (?, 'ann', 'add', ?, ?, ?, ?, '*', NULL, ?)",
            (f"2024-04-02T08:{seq:02d}:00", kind, mem, sta, ident, json.dumps(data)),
        )
    conn.execute("PRAGMA user_version = 1")
    conn.commit()
    conn.close()
    return doc


def test_split_value_of_layout_v1():
    assert split_value("9.1 mm") == (9.1, "mm")
    assert split_value("0.375 in") == (0.375, "in")
    with pytest.raises(StoreError, match="not 'number unit'"):
        split_value("mm 9")


def test_migration_from_v1_to_current(tmp_path):
    p = tmp_path / "old.asf"
    doc = _v1_store(p)
    conn = sqlite3.connect(p)
    before = list(conn.iterdump())
    conn.close()
    with FieldStore.open(p) as s:
        # nothing lost, values split as entered
        assert s.to_survey().document() == doc | {"note": "invented"}
        hist = s.history()
        assert [h.change for h in hist[:5]] == [h.id for h in hist[:5]]
        steps = [(h.old, h.new) for h in hist if h.action == "migrate"]
        assert steps == [(1, 2), (2, 3), (3, 4)]
        # rows written before layout 3 say so, and no device can undo them
        assert {h.device for h in hist[:5]} == {DEVICE_BEFORE_V3}
        assert s.undo_last("ann") == []
        # the migrated store works as a current store: soft delete and undo
        s.delete_reading("G1", "S1", "r2", "bob")
        s.undo_last("bob")
        assert len(s.to_survey().members[0].stations[0].readings) == 3
    conn = sqlite3.connect(p)
    assert conn.execute("PRAGMA user_version").fetchone()[0] == CURRENT == 4
    conn.close()
    backup = tmp_path / "old.asf.v1.bak"
    conn = sqlite3.connect(backup)  # the v1 content kept as it was
    assert list(conn.iterdump()) == before
    assert conn.execute("PRAGMA user_version").fetchone()[0] == 1
    conn.close()


def _store_with_entries(path, n=300):
    s = FieldStore.create(path, header())
    s.add_member(document()["members"][0], "ann")
    with s.batch("ann"):
        for i in range(n):
            s.add_reading(
                "G1", "S1", {"part": "web", "value": 8 + (i % 10) / 10, "unit": "mm"}, "a"
            )
    s.close()


@pytest.mark.parametrize("content", [b"", b"not a database at all\n" * 100, b'{"format": 1}'])
def test_not_a_store_is_refused_and_untouched(tmp_path, content):
    p = tmp_path / "x.asf"
    p.write_bytes(content)
    with pytest.raises(StoreError, match="not an asfound field store"):
        FieldStore.open(p)
    assert p.read_bytes() == content


def test_damaged_store_is_refused_and_untouched(tmp_path):
    p = tmp_path / "d.asf"
    _store_with_entries(p)
    data = bytearray(p.read_bytes())
    assert len(data) > 5 * 4096
    data[3 * 4096 : 3 * 4096 + 200] = b"\xa5" * 200  # scribble over a page header
    p.write_bytes(bytes(data))
    before = _digest(p)
    with pytest.raises(StoreError, match="damaged"):
        FieldStore.open(p)
    assert _digest(p) == before


def test_truncated_store_is_refused(tmp_path):
    p = tmp_path / "t.asf"
    _store_with_entries(p)
    data = p.read_bytes()
    p.write_bytes(data[: len(data) // 2])
    before = _digest(p)
    with pytest.raises(StoreError, match="damaged"):
        FieldStore.open(p)
    assert _digest(p) == before


def test_foreign_database_and_newer_layout(tmp_path):
    p = tmp_path / "f.sqlite"
    conn = sqlite3.connect(p)
    conn.execute("CREATE TABLE t(x)")
    conn.commit()
    conn.close()
    with pytest.raises(StoreError, match="not an asfound field store"):
        FieldStore.open(p)
    q = tmp_path / "n.asf"
    FieldStore.create(q, header()).close()
    conn = sqlite3.connect(q)
    conn.execute("PRAGMA user_version = 9")
    conn.commit()
    conn.close()
    with pytest.raises(StoreError, match="version 9 is newer than this asfound reads"):
        FieldStore.open(q)
    with pytest.raises(StoreError, match="no such field store"):
        FieldStore.open(tmp_path / "missing.asf")


def test_locked_store(tmp_path):
    p = tmp_path / "l.asf"
    _store_with_entries(p, 3)
    s = FieldStore.open(p, timeout=0.2)
    other = sqlite3.connect(p, isolation_level=None)
    other.execute("BEGIN EXCLUSIVE")
    try:
        with pytest.raises(StoreError, match="locked by another program"):
            FieldStore.open(p, timeout=0.2)
        with pytest.raises(StoreError, match="locked by another program"):
            s.add_reading("G1", "S1", {"part": "web", "value": 8.5, "unit": "mm"}, "ann")
    finally:
        other.execute("ROLLBACK")
        other.close()
    saved = s.add_reading("G1", "S1", {"part": "web", "value": 8.5, "unit": "mm"}, "ann")
    assert saved.id == "r7"  # 3 + 3 readings before: the refused entry left nothing behind
    assert len(s.to_survey().members[0].stations[0].readings) == 7
    s.close()
