"""The input of a report: its bytes' checksum, its kind (file or field store) and history."""

from __future__ import annotations

import hashlib
from dataclasses import dataclass
from pathlib import Path

from core.errors import InputError
from core.survey import FieldStore, HistoryEntry, Problem, Survey, is_store_file, load_survey
from core.survey.document import store_content


@dataclass(frozen=True)
class Source:
    """Where a survey came from.

    Attributes:
        path: the input as given. name: its file name.
        checksum: SHA-256 of the input's bytes, first 16 hex digits.
        is_store: True for a field store (SQLite), False for a survey file.
        history: the store's edit history, oldest first (empty for a file).
        conflicts: what merges of the store decided, one line each (see
            :mod:`core.survey.merge`), for the engineer's review.
    """

    path: str
    name: str
    checksum: str
    is_store: bool
    history: tuple[HistoryEntry, ...] = ()
    conflicts: tuple[str, ...] = ()


def checksum(data: bytes) -> str:
    """First 16 hex digits of the SHA-256 of ``data``."""
    return hashlib.sha256(data).hexdigest()[:16]


def read_source(path: str | Path) -> tuple[Survey, list[Problem], Source]:
    """Load and validate a survey file or field store, with its checksum and history.

    Raises:
        InputError: the file does not exist; SchemaError / StoreError: it cannot be read or
        fails validation (nothing is written).
    """
    p = Path(path)
    if not p.is_file():
        raise InputError("file not found", where=str(p))
    data = p.read_bytes()
    store = is_store_file(p)
    survey, problems = load_survey(p)
    history: tuple[HistoryEntry, ...] = ()
    merged: tuple[str, ...] = ()
    if store:
        with FieldStore.open(p) as fs, store_content(p):
            history = tuple(fs.history())
            merged = tuple(conflict_line(c) for c in fs.conflicts())
    src = Source(str(path), p.name, checksum(data), store, history, merged)
    return survey, list(problems), src


def conflict_line(c: dict) -> str:
    """One decision of a merge in words (merge time, what, where, the note)."""
    place = " / ".join(x for x in (c["member"], c["station"], f"{c['kind']} {c['entity']}") if x)
    if c["what"] == "value":
        place += f" / {c['field']}"
    return f"{c['merged']}: {c['what']} at {place.strip()}: {c['note']}"
