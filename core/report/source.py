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
    """

    path: str
    name: str
    checksum: str
    is_store: bool
    history: tuple[HistoryEntry, ...] = ()


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
    if store:
        with FieldStore.open(p) as fs, store_content(p):
            history = tuple(fs.history())
    return survey, list(problems), Source(str(path), p.name, checksum(data), store, history)
