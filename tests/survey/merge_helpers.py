"""Two devices' stores from one common start, for the merge tests (invented values only)."""

from __future__ import annotations

import shutil
import sqlite3
from pathlib import Path

from core.errors import InputError
from core.survey.store import FieldStore

from .helpers import document, header

DEVICES = ("tablet-aa", "tablet-bb")
WHO = ("ann", "bob")


def common_start(folder: Path) -> tuple[Path, Path]:
    """A store with one member and station S1 (readings r1 to r3), and a copy of it."""
    a, b = folder / "a.asf", folder / "b.asf"
    s = FieldStore.create(a, header(), device=DEVICES[0])
    s.add_member(document()["members"][0], "office")
    s.close()
    shutil.copy(a, b)
    return a, b


def apply(store: FieldStore, who: str, op: tuple) -> None:
    """One entry on a device: add, change, withdraw a reading; a note; a station; undo.
    An entry the store refuses (a reading already withdrawn) changes nothing."""
    kind, *arg = op
    try:
        if kind == "add":
            store.add_reading("G1", "S1", {"part": "web", "value": arg[0], "unit": "mm"}, who)
        elif kind == "change":
            store.update_reading("G1", "S1", f"r{arg[0]}", {"value": arg[1]}, who)
        elif kind == "delete":
            store.delete_reading("G1", "S1", f"r{arg[0]}", who)
        elif kind == "note":
            store.set_note("G1", "S1", arg[0], who)
        elif kind == "station":
            store.add_station("G1", {"id": f"S{arg[0]}", "position": 1.0 + arg[0]}, who)
        elif kind == "undo":
            store.undo_last(who)
    except InputError:
        pass


def dump(path: Path) -> tuple[list, list, dict]:
    """Entries (by uid), history rows and meta of a store file, read-only."""
    conn = sqlite3.connect(f"file:{path}?mode=ro", uri=True)
    try:
        ents = conn.execute(
            "SELECT uid, kind, member, station, id, seq, data, deleted FROM entity ORDER BY uid"
        ).fetchall()
        hist = conn.execute("SELECT * FROM history ORDER BY id").fetchall()
        meta = dict(conn.execute("SELECT key, value FROM meta").fetchall())
    finally:
        conn.close()
    return ents, hist, meta


def conflicts(path: Path) -> list[tuple]:
    conn = sqlite3.connect(f"file:{path}?mode=ro", uri=True)
    try:
        return conn.execute(
            "SELECT what, kind, member, station, entity, field, uid, kept, other, kept_at,"
            " kept_device, other_at, other_device FROM conflict ORDER BY id"
        ).fetchall()
    finally:
        conn.close()
