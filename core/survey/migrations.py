"""Layouts of the field store and the migrations between them (PRAGMA user_version).

Version 1 (first field trials) kept a reading's value and unit as one text ("9.1 mm"),
deleted rows for good (only the history remembered them) and did not group history rows
into changes. Version 2 keeps value and unit apart as entered, deletes softly (``deleted``
column) and groups the rows of one change (``change`` column) so a change can be undone.
Version 3 records on which device each change was made (``history.device``; rows written
before it get :data:`DEVICE_BEFORE_V3`, so no device can undo them), which change an undo
reverted (``history.undoes``), and gives every entry an id unique across devices
(``entity.uid``: 32 hex digits, random for new entries), for a later merge of two devices'
stores.

An entry made before layout 3 gets a uid that is a hash of the store's creation time, the
entry's key (kind, member, station, id) and the history row that made it (the latest
``add`` row of that key: its time, person and content), or, where the history has no such
row, the entry's content and withdrawn flag at migration. The rule, and why: two copies of
one store split before layout 3 and migrated apart must agree on the entries they shared,
and both copies hold the same ``add`` row of such an entry (history rows are never
rewritten), so they give it the same uid, whatever either device changed in it later (its
changes come to the merge as changes of one entry). Entries made apart on the two devices
after the split, before layout 3, can share a key (both made reading ``r4``; the device
was not recorded then), but not the time, person and content of the row that made them:
they get two uids and the merge keeps both (the later one renamed, listed). Without an
``add`` row the copies cannot tell a shared entry from two made apart; content decides:
alike, one entry; not alike (changed apart, or made apart), both are kept and the clash is
listed, so nothing is mixed or lost.
"""

from __future__ import annotations

import hashlib
import json
import sqlite3

from core.errors import StoreError

CURRENT = 4
STORE_FORMAT = "asfound.store"
#: the device of every history row written before layout 3 (no device can undo those)
DEVICE_BEFORE_V3 = "unknown-before-layout-3"

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

V3_SCHEMA = """
CREATE TABLE meta(key TEXT PRIMARY KEY, value TEXT NOT NULL);
CREATE TABLE entity(
  kind TEXT NOT NULL, member TEXT NOT NULL, station TEXT NOT NULL, id TEXT NOT NULL,
  seq INTEGER NOT NULL, data TEXT NOT NULL, deleted INTEGER NOT NULL DEFAULT 0,
  uid TEXT NOT NULL UNIQUE,
  PRIMARY KEY (kind, member, station, id));
CREATE TABLE history(
  id INTEGER PRIMARY KEY AUTOINCREMENT, change INTEGER NOT NULL, at TEXT NOT NULL,
  who TEXT NOT NULL, device TEXT NOT NULL, action TEXT NOT NULL, kind TEXT NOT NULL,
  member TEXT NOT NULL, station TEXT NOT NULL, entity TEXT NOT NULL, field TEXT NOT NULL,
  old TEXT, new TEXT, undone INTEGER NOT NULL DEFAULT 0, undoes INTEGER);
CREATE INDEX history_change ON history(change);
CREATE INDEX history_author ON history(who, device, undone, change);
"""

#: what layout 4 adds to layout 3
V4_CONFLICT = """
CREATE TABLE conflict(
  id INTEGER PRIMARY KEY AUTOINCREMENT, merged TEXT NOT NULL, what TEXT NOT NULL,
  kind TEXT NOT NULL, member TEXT NOT NULL, station TEXT NOT NULL, entity TEXT NOT NULL,
  field TEXT NOT NULL, uid TEXT NOT NULL, kept TEXT, other TEXT, kept_at TEXT NOT NULL,
  kept_device TEXT NOT NULL, other_at TEXT NOT NULL, other_device TEXT NOT NULL,
  note TEXT NOT NULL)
"""

V4_SCHEMA = V3_SCHEMA + V4_CONFLICT + ";\n"


def split_value(text: str) -> tuple[float, str]:
    """Split a version 1 reading text such as ``"9.1 mm"`` into (9.1, "mm")."""
    parts = str(text).strip().split(None, 1)
    try:
        return float(parts[0]), (parts[1].strip() if len(parts) > 1 else "mm")
    except (ValueError, IndexError):
        raise StoreError(f"version 1 reading value {text!r} is not 'number unit'") from None


def _statements(schema: str, *starts: str) -> list[str]:
    return [x for x in schema.split(";") if x.strip() and x.strip().startswith(starts)]


def _v1_to_v2(conn: sqlite3.Connection, at: str, device: str) -> None:
    conn.execute("ALTER TABLE entity ADD COLUMN deleted INTEGER NOT NULL DEFAULT 0")
    conn.execute("ALTER TABLE history RENAME TO history_v1")
    for stmt in _statements(V2_SCHEMA, "CREATE TABLE history", "CREATE INDEX"):
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


def migrated_uid(
    created: str, kind: str, member: str, station: str, ident: str, made: str = ""
) -> str:
    """The uid of an entry that existed before layout 3 (see the module docstring):
    ``made`` is :func:`made_by` of the history row that made it, or its content."""
    parts = (created, kind, member, station, ident, *((made,) if made else ()))
    return hashlib.sha256("\x1f".join(parts).encode("utf-8")).hexdigest()[:32]


def made_by(at: object, who: object, new: object) -> str:
    """What identifies the row that made an entry in every copy of a store."""
    return "\x1f".join(("add", str(at), str(who), str(new)))


def _made(conn: sqlite3.Connection, table: str) -> dict[tuple, str]:
    """The latest ``add`` row of each entry key in the history ``table``."""
    out: dict[tuple, str] = {}
    for kind, member, station, entity, at, who, new in conn.execute(
        f"SELECT kind, member, station, entity, at, who, new FROM {table}"
        " WHERE action = 'add' ORDER BY id"
    ):
        out[(kind, member, station, entity)] = made_by(at, who, new)
    return out


def _content(data: object, deleted: object) -> str:
    return "\x1f".join(("content", str(data), str(deleted)))


def _v2_to_v3(conn: sqlite3.Connection, at: str, device: str) -> None:
    row = conn.execute("SELECT value FROM meta WHERE key = 'created'").fetchone()
    created = row[0] if row else ""
    conn.execute("ALTER TABLE entity RENAME TO entity_v2")
    conn.execute("ALTER TABLE history RENAME TO history_v2")
    conn.execute("DROP INDEX IF EXISTS history_change")
    for stmt in _statements(
        V3_SCHEMA, "CREATE TABLE entity", "CREATE TABLE history", "CREATE INDEX"
    ):
        conn.execute(stmt)
    rows = conn.execute(
        "SELECT kind, member, station, id, seq, data, deleted FROM entity_v2 ORDER BY seq"
    ).fetchall()
    made = _made(conn, "history_v2")
    conn.executemany(
        "INSERT INTO entity(kind, member, station, id, seq, data, deleted, uid)"
        " VALUES (?, ?, ?, ?, ?, ?, ?, ?)",
        [
            (*r, migrated_uid(created, *r[:4], made.get(tuple(r[:4])) or _content(r[5], r[6])))
            for r in rows
        ],
    )
    conn.execute(
        "INSERT INTO history(id, change, at, who, device, action, kind, member, station, entity,"
        " field, old, new, undone) SELECT id, change, at, who, ?, action, kind, member, station,"
        " entity, field, old, new, undone FROM history_v2 ORDER BY id",
        (DEVICE_BEFORE_V3,),
    )
    conn.execute("DROP TABLE entity_v2")
    conn.execute("DROP TABLE history_v2")
    nxt = conn.execute("SELECT COALESCE(MAX(change), 0) + 1 FROM history").fetchone()[0]
    conn.execute(
        "INSERT INTO history(change, at, who, device, action, kind, member, station, entity,"
        " field, old, new) VALUES (?, ?, 'asfound', ?, 'migrate', 'store', '', '', '',"
        " 'user_version', '2', '3')",
        (nxt, at, device),
    )


def migrated_origin(created: str) -> str:
    """The identity of a store made before layout 4 (the same in every copy of it)."""
    return hashlib.sha256(f"origin\x1f{created}".encode()).hexdigest()[:32]


def _v3_to_v4(conn: sqlite3.Connection, at: str, device: str) -> None:
    row = conn.execute("SELECT value FROM meta WHERE key = 'created'").fetchone()
    conn.execute(
        "INSERT OR IGNORE INTO meta(key, value) VALUES ('origin', ?)",
        (migrated_origin(row[0] if row else ""),),
    )
    conn.execute(V4_CONFLICT)
    nxt = conn.execute("SELECT COALESCE(MAX(change), 0) + 1 FROM history").fetchone()[0]
    conn.execute(
        "INSERT INTO history(change, at, who, device, action, kind, member, station, entity,"
        " field, old, new) VALUES (?, ?, 'asfound', ?, 'migrate', 'store', '', '', '',"
        " 'user_version', '3', '4')",
        (nxt, at, device),
    )


MIGRATIONS = {1: _v1_to_v2, 2: _v2_to_v3, 3: _v3_to_v4}


def migrate(conn: sqlite3.Connection, version: int, at: str, device: str) -> None:
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
            MIGRATIONS[v](conn, at, device)
            conn.execute(f"PRAGMA user_version = {v + 1}")
        conn.execute("COMMIT")
    except BaseException:
        conn.execute("ROLLBACK")
        raise


def checked_layout(conn: sqlite3.Connection, where: object) -> int:
    """The store layout version of an open database, after checking that it is whole
    (SQLite's integrity check), an asfound field store, and not newer than this asfound.

    Raises:
        StoreError: damaged, not a field store, or a newer layout (``where`` names the file).
    """
    res = [r[0] for r in conn.execute("PRAGMA integrity_check").fetchall()]
    if res != ["ok"]:
        raise StoreError(f"{where}: the store is damaged (integrity check: {'; '.join(res[:5])})")
    has_meta = conn.execute(
        "SELECT 1 FROM sqlite_master WHERE type = 'table' AND name = 'meta'"
    ).fetchone()
    fmt = (
        conn.execute("SELECT value FROM meta WHERE key = 'format'").fetchone() if has_meta else None
    )
    if fmt is None or fmt[0] != STORE_FORMAT:
        raise StoreError(f"{where}: an SQLite database, but not an asfound field store")
    ver = conn.execute("PRAGMA user_version").fetchone()[0]
    if ver > CURRENT:
        raise StoreError(
            f"{where}: store layout version {ver} is newer than this asfound reads "
            f"(1 to {CURRENT}); update asfound"
        )
    return ver
