"""One input of a merge: a field store read without changing it, and renames within it.

A store is read through an SQLite read-only connection (``mode=ro``) and copied into
memory, where a store of an older layout is brought to the current one (the input file
is never migrated, backed up or written); the rows the migration would add to the
history are left out. SQLite may leave an empty -wal and -shm beside an input it read
(its own companions, which the next program to open the store reuses); they are left
alone, since removing them under a program that has the store open could lose its work.
"""

from __future__ import annotations

import datetime as _dt
import functools
import json
import sqlite3
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any, NamedTuple
from urllib.parse import quote

from core.errors import InputError, StoreError
from core.survey.migrations import CURRENT, checked_layout, migrate

_MAGIC = b"SQLite format 3\x00"


class MergeError(InputError):
    """Two stores that cannot be merged (different surveys, the same file twice)."""


@functools.lru_cache(maxsize=65536)
def utc_key(at: str) -> str:
    """The time ``at`` of a history row as a key that sorts as the instants do: ISO 8601
    (an offset or ``Z``, fractional seconds; without an offset it is UTC, as asfound always
    wrote it) turned to UTC and written with a fixed width, ``2026-05-06T05:08:09.123000``.

    Raises:
        ValueError: ``at`` is not an ISO 8601 date and time.
    """
    if not isinstance(at, str):
        raise ValueError(f"{at!r} is not a text")
    t = _dt.datetime.fromisoformat(at.strip())
    if t.tzinfo is not None:
        t = t.astimezone(_dt.UTC).replace(tzinfo=None)
    return f"{t.year:04d}{t:-%m-%dT%H:%M:%S.%f}"


class HRow(NamedTuple):
    """One history row (``old`` / ``new`` as stored: JSON text or None)."""

    id: int
    change: int
    at: str
    who: str
    device: str
    action: str
    kind: str
    member: str
    station: str
    entity: str
    field: str
    old: str | None
    new: str | None
    undone: int
    undoes: int | None

    def body(self) -> tuple:
        """What the row says, without its numbers (the same in every copy)."""
        return self[2:13]

    def target(self) -> tuple[str, str, str, str]:
        """The entry the row is about (the survey header is one entry whatever its id)."""
        if self.kind == "survey":
            return ("survey", "", "", "")
        return (self.kind, self.member, self.station, self.entity)


class ERow(NamedTuple):
    """One entry row (``data`` parsed)."""

    kind: str
    member: str
    station: str
    id: str
    seq: int
    data: dict
    deleted: int
    uid: str

    def key(self) -> tuple[str, str, str, str]:
        return (self.kind, self.member, self.station, self.id)


@dataclass
class Change:
    """The rows of one change of one store, oldest first."""

    number: int
    rows: list[HRow]
    _cache: dict = field(default_factory=dict, repr=False, compare=False)

    def key(self) -> tuple:
        """The identity of a change in any copy: its device, person and rows' content."""
        if "key" not in self._cache:
            first = self.rows[0]
            self._cache["key"] = (first.device, first.who, tuple(r.body() for r in self.rows))
        return self._cache["key"]

    def order(self) -> tuple:
        """Where the change goes in a merged history: by time (UTC, :func:`utc_key`), then
        device id, then the person and the content (the same whichever store is read
        first)."""
        if "order" not in self._cache:
            first = self.rows[0]
            body = json.dumps(self.key()[2])
            self._cache["order"] = (utc_key(first.at), first.device, first.who, body)
        return self._cache["order"]

    def set_rows(self, rows: list[HRow]) -> None:
        self.rows = rows
        self._cache.clear()

    def same(self, other: Change) -> bool:
        return self.number == other.number and [(r.id, r.body(), r.undoes) for r in self.rows] == [
            (r.id, r.body(), r.undoes) for r in other.rows
        ]


@dataclass
class Side:
    """A store as read for a merge: its meta values, entries by uid, changes, conflicts."""

    path: Path
    version: int
    meta: dict[str, str]
    entities: dict[str, ERow]
    changes: list[Change]
    conflicts: list[tuple] = field(default_factory=list)

    def name(self) -> str:
        return str(self.path)


def _ro_uri(p: Path) -> str:
    return f"file:{quote(str(p.resolve()))}?mode=ro"


def read_side(path: str | Path, timeout: float = 2.0) -> Side:
    """Read the store at ``path`` for a merge, without changing it.

    Raises:
        StoreError: missing, not a store, damaged, of a newer layout, or locked.
    """
    p = Path(path)
    if not p.is_file():
        raise StoreError(f"{p}: no such field store")
    try:
        with p.open("rb") as f:
            head = f.read(16)
    except OSError as e:
        raise StoreError(f"{p}: cannot be read ({e.strerror or e})") from None
    if head != _MAGIC:
        raise StoreError(f"{p}: not an asfound field store (not an SQLite database file)")
    mem = sqlite3.connect(":memory:", isolation_level=None)
    try:
        src = sqlite3.connect(_ro_uri(p), uri=True, timeout=timeout, isolation_level=None)
        try:
            src.backup(mem)
        finally:
            src.close()
        return _read(mem, p)
    except sqlite3.Error as e:
        msg = str(e)
        if "locked" in msg or "busy" in msg:
            raise StoreError(f"{p}: the store is locked by another program ({msg})") from None
        raise StoreError(f"{p}: the store is damaged or not an asfound store ({msg})") from None
    except (ValueError, TypeError, KeyError, OverflowError, RecursionError) as e:
        raise StoreError(f"{p}: the store's content is damaged ({type(e).__name__}: {e})") from None
    finally:
        mem.close()


def _read(conn: sqlite3.Connection, p: Path) -> Side:
    ver = checked_layout(conn, p)
    if ver < CURRENT:
        last = conn.execute("SELECT COALESCE(MAX(id), 0) FROM history").fetchone()[0]
        migrate(conn, ver, "", "merge")
        conn.execute("DELETE FROM history WHERE id > ?", (last,))  # the migration's own rows
    meta = dict(conn.execute("SELECT key, value FROM meta").fetchall())
    for key in ("origin", "survey", "created"):
        if not isinstance(meta.get(key), str):
            raise StoreError(f"{p}: missing {key!r} in the store")
    if not isinstance(json.loads(meta["survey"]), dict):
        raise StoreError(f"{p}: the survey header in the store is damaged")
    entities: dict[str, ERow] = {}
    for r in conn.execute(
        "SELECT kind, member, station, id, seq, data, deleted, uid FROM entity ORDER BY seq"
    ):
        data = json.loads(r[5])
        if not isinstance(data, dict):
            raise StoreError(f"{p}: the {r[0]} entry {r[3]!r} is damaged (not an object)")
        entities[r[7]] = ERow(*r[:5], data, int(r[6]), r[7])
    changes: list[Change] = []
    for r in conn.execute(
        "SELECT id, change, at, who, device, action, kind, member, station, entity, field,"
        " old, new, undone, undoes FROM history ORDER BY id"
    ):
        row = HRow(*r)
        try:
            utc_key(row.at)
        except ValueError:
            raise StoreError(
                f"{p}: history row {row.id} (change {row.change}, {row.action} of "
                f"{row.kind} {row.entity!r}): its time {row.at!r} is not an ISO 8601 date "
                "and time such as 2026-05-06T07:08:09.123+00:00"
            ) from None
        for text in (row.old, row.new):
            if text is not None:
                json.loads(text)  # a damaged value is refused here, not written on
        if changes and changes[-1].number == row.change:
            changes[-1].rows.append(row)
        else:
            changes.append(Change(row.change, [row]))
    conflicts = [
        tuple(r)
        for r in conn.execute(
            "SELECT merged, what, kind, member, station, entity, field, uid, kept, other,"
            " kept_at, kept_device, other_at, other_device, note FROM conflict ORDER BY id"
        )
    ]
    return Side(p, ver, meta, entities, changes, conflicts)


@dataclass(frozen=True)
class Conflict:
    """One decision of a merge. ``what``: "value", "renamed" or "withdrawn"; ``kept`` and
    ``other`` the values (JSON text) or ids; the times and devices of both sides."""

    what: str
    kind: str
    member: str
    station: str
    entity: str
    field: str
    uid: str
    kept: str | None
    other: str | None
    kept_at: str
    kept_device: str
    other_at: str
    other_device: str
    note: str

    def line(self) -> str:
        place = " / ".join(
            x
            for x in (
                self.member and f"member {self.member}",
                self.station and f"station {self.station}",
                f"{self.kind} {self.entity}".strip(),
                self.field if self.what == "value" else "",
            )
            if x
        )
        return f"{self.what}: {place}: {self.note}"


@dataclass
class Plan:
    """What a merge decided: the entries, the header, the history, the conflicts, the
    number of changes of the common start, and the counts of :class:`MergeResult`."""

    entities: list[ERow]
    header: dict
    changes: list[Change]
    conflicts: list[Conflict]
    prefix: int
    counts: tuple[int, int, int, int, int]


# --------------------------------------------------------------------- renames in a side
def _load(text: str | None) -> Any:
    return None if text is None else json.loads(text)


def _dump(value: Any) -> str | None:
    return None if value is None else json.dumps(value)


def rename(side: Side, uid: str, new_id: str, changes: list[Change]) -> None:
    """Give the entry ``uid`` of ``side`` the display id ``new_id``: the entry, its own
    entries (a member's stations and their entries; a station's readings, bands and
    perforations), the readings on a renamed band (their region), and the rows of
    ``changes`` that name any of them."""
    e = side.entities[uid]
    old = e.id
    side.entities[uid] = e._replace(id=new_id, data={**e.data, "id": new_id})
    for u, x in list(side.entities.items()):
        if u == uid:
            continue
        if e.kind == "member" and x.member == old:
            side.entities[u] = x._replace(member=new_id)
        elif e.kind == "station" and (x.member, x.station) == (e.member, old):
            side.entities[u] = x._replace(station=new_id)
        elif e.kind == "band" and _on_band(x, e, old):
            side.entities[u] = x._replace(data={**x.data, "region": new_id})
    for c in changes:
        rows = [_renamed_row(r, e, old, new_id) for r in c.rows]
        if rows != c.rows:
            c.set_rows(rows)


def _on_band(x: ERow, band: ERow, old: str) -> bool:
    return (x.kind, x.member, x.station) == ("reading", band.member, band.station) and (
        x.data.get("region") == old
    )


def _renamed_row(r: HRow, e: ERow, old: str, new: str) -> HRow:
    if e.kind == "member":
        if r.member != old:
            return r
        r = r._replace(member=new)
        if r.kind == "member":
            r = r._replace(entity=new, old=_with_id(r.old, new), new=_with_id(r.new, new))
        return r
    if (r.member, r.station) == (e.member, old) and e.kind == "station":
        return r._replace(station=new)
    if (r.kind, r.member, r.station, r.entity) == e._replace(id=old).key():
        return r._replace(entity=new, old=_with_id(r.old, new), new=_with_id(r.new, new))
    if e.kind == "band" and (r.kind, r.member, r.station) == ("reading", e.member, e.station):
        return r._replace(
            old=_region(r.old, r.field, old, new), new=_region(r.new, r.field, old, new)
        )
    return r


def _with_id(text: str | None, new: str) -> str | None:
    v = _load(text)
    if isinstance(v, dict) and "id" in v:
        return _dump({**v, "id": new})
    return text


def _region(text: str | None, fld: str, old: str, new: str) -> str | None:
    v = _load(text)
    if fld == "region" and v == old:
        return _dump(new)
    if fld == "*" and isinstance(v, dict) and v.get("region") == old:
        return _dump({**v, "region": new})
    return text
