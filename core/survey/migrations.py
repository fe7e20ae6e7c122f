"""Layouts of the field store and the migrations between them (PRAGMA user_version).

Version 1 (first field trials) kept a reading's value and unit as one text ("9.1 mm"),
deleted rows for good (only the history remembered them) and did not group history rows
into changes. Version 2 keeps value and unit apart as entered, deletes softly (``deleted``
column) and groups the rows of one change (``change`` column) so a change can be undone.
"""

from __future__ import annotations

import json
import sqlite3

from core.errors import StoreError

CURRENT = 2
STORE_FORMAT = "asfound.store"

V1_SCHEMA = """
CREATE TABLE meta(key TEXT PRIMARY KEY, value TEXT NOT NULL);
CREATE TABLE entity(
  kind TEXT NOT NULL, member TEXT NOT NULL, station TEXT NOT NULL, id TEXT NOT NULL,
  seq INTEGER NOT NULL, data TEXT NOT NULL,
  PRIMARY KEY (kind, member, station, id));
CREATE TABLE history(
  id INTEGER PRIMARY KEY AUTOINCREMENT, at TEXT NOT NULL, who TEXT NOT NULL,
  action TEXT NOT NULL, kind TEXT NOT NULL, member TEXT NOT NULL, station TEXT NOT NULL,
  entity TEXT NOT NULL, field TEXT NOT NULL, old TEXT, new TEXT);
"""

V2_SCHEMA = """
CREATE TABLE meta(key TEXT PRIMARY KEY, value TEXT NOT NULL);
CREATE TABLE entity(
  kind TEXT NOT NULL, member TEXT NOT NULL, station TEXT NOT NULL, id TEXT NOT NULL,
  seq INTEGER NOT NULL, data TEXT NOT NULL, deleted INTEGER NOT NULL DEFAULT 0,
  PRIMARY KEY (kind, member, station, id));
CREATE TABLE history(
  id INTEGER PRIMARY KEY AUTOINCREMENT, change INTEGER NOT NULL, at TEXT NOT NULL,
  who TEXT NOT NULL, action TEXT NOT NULL, kind TEXT NOT NULL, member TEXT NOT NULL,
  station TEXT NOT NULL, entity TEXT NOT NULL, field TEXT NOT NULL, old TEXT, new TEXT,
  undone INTEGER NOT NULL DEFAULT 0);
CREATE INDEX history_change ON history(change);
"""


def split_value(text: str) -> tuple[float, str]:
    """Split a version 1 reading text such as ``"9.1 mm"`` into (9.1, "mm")."""
    parts = str(text).strip().split(None, 1)
    try:
        return float(parts[0]), (parts[1].strip() if len(parts) > 1 else "mm")
    except (ValueError, IndexError):
        raise StoreError(f"version 1 reading value {text!r} is not 'number unit'") from None


def _v1_to_v2(conn: sqlite3.Connection, at: str) -> None:
    conn.execute("ALTER TABLE entity ADD COLUMN deleted INTEGER NOT NULL DEFAULT 0")
    conn.execute("ALTER TABLE history RENAME TO history_v1")
    for stmt in V2_SCHEMA.split(";"):
        if "CREATE TABLE history" in stmt or "CREATE INDEX" in stmt:
            conn.execute(stmt)
    conn.execute(
        "INSERT INTO history(id, change, at, who, action, kind, member, station, entity, field,"
        " old, new) SELECT id, id, at, who, action, kind, member, station, entity, field, old,"
        " new FROM history_v1 ORDER BY id"
    )
    conn.execute("DROP TABLE history_v1")
    rows = conn.execute(
        "SELECT member, station, id, data FROM entity WHERE kind = 'reading'"
    ).fetchall()
    for member, station, rid, data in rows:
        d = json.loads(data)
        if isinstance(d.get("value"), str):
            v, unit = split_value(d["value"])
            d["value"], d["unit"] = v, unit
            conn.execute(
                "UPDATE entity SET data = ? WHERE kind = 'reading' AND member = ? AND station = ?"
                " AND id = ?",
                (json.dumps(d), member, station, rid),
            )
    nxt = conn.execute("SELECT COALESCE(MAX(id), 0) + 1 FROM history").fetchone()[0]
    conn.execute(
        "INSERT INTO history(change, at, who, action, kind, member, station, entity, field, old,"
        " new) VALUES (?, ?, 'asfound', 'migrate', 'store', '', '', '', 'user_version', '1', '2')",
        (nxt, at),
    )


MIGRATIONS = {1: _v1_to_v2}


def migrate(conn: sqlite3.Connection, version: int, at: str) -> None:
    """Bring an open store from ``version`` to :data:`CURRENT` inside one transaction.

    Raises:
        StoreError: the version is unknown or newer than this asfound.
    """
    if version > CURRENT:
        raise StoreError(
            f"store layout version {version} is newer than this asfound reads (1 to {CURRENT})"
        )
    if version < 1:
        raise StoreError(f"store layout version {version} is not an asfound store layout")
    conn.execute("BEGIN IMMEDIATE")
    try:
        for v in range(version, CURRENT):
            MIGRATIONS[v](conn, at)
            conn.execute(f"PRAGMA user_version = {v + 1}")
        conn.execute("COMMIT")
    except BaseException:
        conn.execute("ROLLBACK")
        raise
