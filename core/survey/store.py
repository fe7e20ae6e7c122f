"""The field store: one SQLite file per survey, safe against a pulled battery.

* WAL journal, ``synchronous=FULL``, one transaction per entry: an entry reported as saved
  survives a killed process.
* Nothing is silently overwritten: every add, update and delete writes rows to the
  ``history`` table (who, on which device, when, entity, field, old value, new value);
  deletes are soft.
* Each handle belongs to one device (:func:`core.survey.device.this_device` unless given).
  :meth:`FieldStore.undo_last` reverts the last change of one person on this handle's
  device, and only when nobody else has changed what it touched since; the undo is a change
  of its own in the history (see :mod:`core.survey.undo`).
* The layout version is ``PRAGMA user_version``; older layouts are migrated on open (after
  a backup copy ``<name>.v<N>.bak``), newer ones refused.
* A file that is not a store, is damaged (fails ``PRAGMA integrity_check``) or is locked by
  another program raises :class:`StoreError` and is never written.

Entries are the objects of the survey document (:mod:`core.survey.model`) as dicts, in
the survey's units, validated on entry (:class:`InputError` for errors; warnings are
returned in :class:`Saved`). One writer thread at a time; calls are serialised by a lock.
"""

from __future__ import annotations

import datetime as _dt
import json
import sqlite3
import threading
import uuid
from collections.abc import Iterator
from contextlib import contextmanager, suppress
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from core.definition import SectionDefinition
from core.errors import InputError, StoreError
from core.survey.device import check_device, this_device
from core.survey.migrations import CURRENT, STORE_FORMAT, V4_SCHEMA, checked_layout, migrate
from core.survey.model import VERSION, Member, Station, Survey, SurveyHeader
from core.survey.problems import Problem
from core.survey.storeops import StoreOps, _validated
from core.survey.undo import UndoOps

_MAGIC = b"SQLite format 3\x00"


@dataclass(frozen=True)
class Saved:
    """The result of an entry: its id and the warnings it raised (already saved)."""

    id: str
    warnings: tuple[Problem, ...] = ()


@dataclass(frozen=True)
class HistoryEntry:
    """One row of the edit history. ``old``/``new`` are the values (None when absent);
    ``device`` the device the change was made on; ``undoes`` the change an undo reverted."""

    id: int
    change: int
    at: str
    who: str
    action: str
    kind: str
    member: str
    station: str
    entity: str
    field: str
    old: Any
    new: Any
    undone: bool
    device: str = ""
    undoes: int | None = None


def _now() -> str:
    return _dt.datetime.now(_dt.UTC).isoformat(timespec="milliseconds")


def _connect(path: Path, timeout: float) -> sqlite3.Connection:
    conn = sqlite3.connect(
        str(path), timeout=timeout, isolation_level=None, check_same_thread=False
    )
    return conn


def _sqlite_error(e: sqlite3.Error, path: Path) -> StoreError:
    msg = str(e)
    if "locked" in msg or "busy" in msg:
        return StoreError(f"{path}: the store is locked by another program ({msg}); close it there")
    return StoreError(f"{path}: the store is damaged or not an asfound store ({msg})")


class FieldStore(StoreOps, UndoOps):
    """An open field store of one device. Create with :meth:`create`, open with :meth:`open`."""

    def __init__(self, conn: sqlite3.Connection, path: Path, device: str) -> None:
        self._conn = conn
        self.path = path
        self.device = device
        self._lock = threading.RLock()
        self._change: int | None = None
        self._defs: dict[str, tuple[str, Member, SectionDefinition]] = {}
        self._who = ""
        self._undoes: int | None = None
        self._checks: dict[tuple[str, str], list] = {}

    # ----------------------------------------------------------------- open / create
    @classmethod
    def create(
        cls,
        path: str | Path,
        survey_header: dict | SurveyHeader,
        *,
        note: str = "",
        who: str = "",
        timeout: float = 2.0,
        device: str | None = None,
    ) -> FieldStore:
        """Create a new store at ``path`` (which must not exist) for a survey header;
        ``device`` (default: this device) is the device of every change made through it.

        Raises:
            StoreError: the file exists or cannot be written; InputError: invalid header or
            device id.
        """
        p = Path(path)
        dev = check_device(device) if device is not None else this_device()
        hdr = (
            survey_header
            if isinstance(survey_header, SurveyHeader)
            else _validated(SurveyHeader, survey_header, "survey header", "survey")
        )
        if p.exists():
            raise StoreError(f"{p}: a file of that name exists; a store is never overwritten")
        conn = None
        try:
            conn = _connect(p, timeout)
            conn.execute("PRAGMA journal_mode=WAL")
            conn.execute("PRAGMA synchronous=FULL")
            conn.execute("BEGIN IMMEDIATE")
            for stmt in V4_SCHEMA.split(";"):
                if stmt.strip():
                    conn.execute(stmt)
            conn.executemany(
                "INSERT INTO meta(key, value) VALUES (?, ?)",
                [
                    ("format", STORE_FORMAT),
                    ("created", _now()),
                    ("origin", uuid.uuid4().hex),
                    ("survey", json.dumps(hdr.model_dump(mode="json"))),
                    ("note", json.dumps(note)),
                ],
            )
            conn.execute(f"PRAGMA user_version = {CURRENT}")
            conn.execute("COMMIT")
        except sqlite3.Error as e:
            if conn is not None:
                with suppress(sqlite3.Error):
                    conn.close()
            for extra in (p, Path(f"{p}-wal"), Path(f"{p}-shm")):
                extra.unlink(missing_ok=True)  # the half-made file is ours: remove it
            raise _sqlite_error(e, p) from None
        store = cls(conn, p, dev)
        with store._txn(who):
            store._history(
                "create", "survey", "", "", hdr.id, "*", None, hdr.model_dump(mode="json")
            )
        return store

    @classmethod
    def open(
        cls, path: str | Path, *, timeout: float = 2.0, device: str | None = None
    ) -> FieldStore:
        """Open an existing store; migrate an older layout; refuse a damaged or locked file.
        ``device`` (default: this device) is the device of every change made through it.

        Raises:
            StoreError: missing, not a store, damaged, newer layout, or locked; InputError:
            an invalid device id.
        """
        p = Path(path)
        dev = check_device(device) if device is not None else this_device()
        if not p.is_file():
            raise StoreError(f"{p}: no such field store")
        with p.open("rb") as f:
            head = f.read(16)
        if head != _MAGIC:
            raise StoreError(f"{p}: not an asfound field store (not an SQLite database file)")
        try:
            conn = _connect(p, timeout)
        except sqlite3.Error as e:
            raise _sqlite_error(e, p) from None
        try:
            ver = checked_layout(conn, p)
            if ver < CURRENT:
                backup = p.with_name(f"{p.name}.v{ver}.bak")
                if not backup.exists():
                    dst = sqlite3.connect(str(backup))
                    conn.backup(dst)
                    dst.close()
            conn.execute("PRAGMA journal_mode=WAL")
            conn.execute("PRAGMA synchronous=FULL")
            if ver < CURRENT:
                migrate(conn, ver, _now(), dev)
            conn.execute("BEGIN IMMEDIATE")
            conn.execute("COMMIT")
        except StoreError:
            conn.close()
            raise
        except sqlite3.Error as e:
            conn.close()
            raise _sqlite_error(e, p) from None
        return cls(conn, p, dev)

    def close(self) -> None:
        """Close the store (every entry is already committed)."""
        with self._lock:
            self._conn.close()

    def __enter__(self) -> FieldStore:
        return self

    def __exit__(self, *exc: object) -> None:
        self.close()

    # ----------------------------------------------------------------- transactions
    @contextmanager
    def _txn(self, who: str) -> Iterator[int]:
        """One transaction and one change id; nested calls join the outer transaction."""
        with self._lock:
            if self._change is not None:
                yield self._change
                return
            try:
                self._conn.execute("BEGIN IMMEDIATE")
                self._change = self._conn.execute(
                    "SELECT COALESCE(MAX(change), 0) + 1 FROM history"
                ).fetchone()[0]
                self._who = who
                yield self._change
                for (member, station), known in self._checks.items():
                    self._check_station(member, station, known)
                self._conn.execute("COMMIT")
            except sqlite3.Error as e:
                self._rollback()
                raise _sqlite_error(e, self.path) from None
            except BaseException:
                self._rollback()
                raise
            finally:
                self._change = None
                self._undoes = None
                self._checks = {}

    def _rollback(self) -> None:
        if self._conn.in_transaction:
            self._conn.execute("ROLLBACK")
        self._defs.clear()

    @contextmanager
    def batch(self, who: str) -> Iterator[None]:
        """Group several entries into one transaction and one change (used by import)."""
        with self._txn(who):
            yield

    def _history(self, action, kind, member, station, entity, field, old, new) -> None:
        self._conn.execute(
            "INSERT INTO history(change, at, who, device, action, kind, member, station, entity,"
            " field, old, new, undoes) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)",
            (
                self._change,
                _now(),
                self._who,
                self.device,
                action,
                kind,
                member,
                station,
                entity,
                field,
                None if old is None else json.dumps(old),
                None if new is None else json.dumps(new),
                self._undoes if action == "undo" else None,
            ),
        )

    # ----------------------------------------------------------------- reading back
    def history(self, since_change: int = 0) -> list[HistoryEntry]:
        """Every history row (of changes from ``since_change`` on), oldest first."""
        with self._lock:
            rows = self._conn.execute(
                "SELECT id, change, at, who, action, kind, member, station, entity, field, old,"
                " new, undone, device, undoes FROM history WHERE change >= ? ORDER BY id",
                (since_change,),
            ).fetchall()
        return [
            HistoryEntry(
                *r[:10],
                None if r[10] is None else json.loads(r[10]),
                None if r[11] is None else json.loads(r[11]),
                bool(r[12]),
                r[13],
                r[14],
            )
            for r in rows
        ]

    def conflicts(self) -> list[dict]:
        """What merges of this store decided (:mod:`core.survey.merge`), oldest first: each
        a dict of ``merged``, ``what`` (value, renamed, withdrawn), ``kind``, ``member``,
        ``station``, ``entity``, ``field``, ``kept``, ``other`` and ``note``."""
        cols = ("merged", "what", "kind", "member", "station", "entity", "field", "kept")
        with self._lock:
            rows = self._conn.execute(
                f"SELECT {', '.join(cols)}, other, note FROM conflict ORDER BY id"
            ).fetchall()
        return [dict(zip((*cols, "other", "note"), r, strict=True)) for r in rows]

    def header(self) -> dict:
        with self._lock:
            return json.loads(self._meta("survey"))

    def _meta(self, key: str) -> str:
        row = self._conn.execute("SELECT value FROM meta WHERE key = ?", (key,)).fetchone()
        if row is None:
            raise StoreError(f"{self.path}: missing {key!r} in the store")
        return row[0]

    def _rows(self, kind: str, member: str = "", station: str | None = None) -> list[dict]:
        q = "SELECT data FROM entity WHERE kind = ? AND deleted = 0"
        args: list[Any] = [kind]
        if kind != "member":
            q += " AND member = ?"
            args.append(member)
        if station is not None:
            q += " AND station = ?"
            args.append(station)
        try:
            return [json.loads(r[0]) for r in self._conn.execute(q + " ORDER BY seq", args)]
        except ValueError as e:
            raise StoreError(f"{self.path}: a {kind} entry is damaged ({e})") from None

    def _with_stations(self, m: dict) -> dict:
        """A member entry with its live stations and their entries (document objects)."""
        stations = []
        for s in self._rows("station", m["id"], ""):
            for kind, key in (
                ("reading", "readings"),
                ("band", "bands"),
                ("perforation", "perforations"),
            ):
                s[key] = self._rows(kind, m["id"], s["id"])
            stations.append(s)
        return {**m, "stations": stations}

    def to_survey(self) -> Survey:
        """The whole survey as a model (entries in the order they were made)."""
        with self._lock:
            members = [self._with_stations(m) for m in self._rows("member")]
            doc = {
                "format": "asfound.survey",
                "version": VERSION,
                "note": json.loads(self._meta("note")),
                "survey": json.loads(self._meta("survey")),
                "members": members,
            }
        return Survey.model_validate(doc)

    def member(self, member_id: str) -> Member:
        """A member (without its stations) as a model, with the survey's units.

        Raises:
            InputError: unknown member id.
        """
        with self._lock:
            return self._member_and_definition(member_id)[0]

    def _member_and_definition(self, member_id: str) -> tuple[Member, SectionDefinition]:
        data = self._get("member", member_id, "", member_id)
        key = json.dumps(data, sort_keys=True) + self._meta("survey")
        hit = self._defs.get(member_id)
        if hit is None or hit[0] != key:
            s = Survey.model_validate(
                {"survey": self.header(), "members": [{**data, "stations": []}]}
            )
            m = s.members[0]
            hit = (key, m, m.definition())
            self._defs[member_id] = hit
        return hit[1], hit[2]

    def station(self, member_id: str, station_id: str) -> Station:
        """A station with its readings, bands and perforations (InputError if unknown)."""
        with self._lock:
            data = self._get("station", member_id, "", station_id)
            for kind in ("band", "perforation", "reading"):
                data[f"{kind}s"] = self._rows(kind, member_id, station_id)
        return Station.model_validate(data)

    def _get(self, kind: str, member: str, station: str, ident: str) -> dict:
        row = self._conn.execute(
            "SELECT data FROM entity WHERE kind = ? AND member = ? AND station = ? AND id = ?"
            " AND deleted = 0",
            (kind, member, station, ident),
        ).fetchone()
        if row is None:
            place = " / ".join(
                x
                for x in (member and f"member {member!r}", station and f"station {station!r}")
                if x
            )
            raise InputError(f"unknown {kind} id {ident!r}", where=place)
        return json.loads(row[0])
