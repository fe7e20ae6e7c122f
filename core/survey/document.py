"""The interchange file: a JSON document ``asfound.survey`` version 1.

Its JSON Schema (draft 2020-12) is ``core/schema/survey-1.schema.json``; the format is
described in ``docs/survey-format.md``. Export and import check their output path first
(:mod:`core.outputs`: never over an input, a store or another survey). Export writes through
a temporary file and a rename; import checks the whole document first and builds a new store
in a temporary file, linked into place only when complete, so a refused file changes nothing.
"""

from __future__ import annotations

import json
import sqlite3
from collections.abc import Iterator
from contextlib import contextmanager
from pathlib import Path
from typing import Any

from core.errors import AsfoundError, InputError, OutputError, SchemaError, StoreError
from core.gcpause import collector_paused
from core.jsonfile import read_json
from core.outputs import atomic_output, check_output, write_atomic
from core.survey.model import Survey
from core.survey.problems import Problem, errors
from core.survey.store import FieldStore
from core.survey.validate import check_document

_SQLITE_MAGIC = b"SQLite format 3\x00"


def is_store_file(path: str | Path) -> bool:
    """True when ``path`` starts like an SQLite database (a field store)."""
    try:
        with Path(path).open("rb") as f:
            return f.read(16) == _SQLITE_MAGIC
    except OSError:
        return False


def read_document(path: str | Path) -> Any:
    """Parse a survey file as JSON (no checks of its content; see :func:`core.jsonfile.read_json`).

    Raises:
        InputError: file not found; SchemaError: too large, unreadable, not UTF-8, or not
        valid JSON.
    """
    return read_json(path, "survey file")


@contextmanager
def store_content(path: str | Path) -> Iterator[None]:
    """Turn a failure to read a store's entries (damaged JSON in a row, an entry the model
    refuses, text that is not UTF-8) into a :class:`StoreError` naming the store.

    Raises:
        StoreError: for any such failure inside the block.
    """
    try:
        yield
    except AsfoundError:
        raise
    except (ValueError, KeyError, TypeError, AttributeError, sqlite3.Error) as e:
        detail = " ".join(str(e).split())[:400]
        raise StoreError(
            f"{path}: the store's content is damaged and cannot be read as a survey "
            f"({type(e).__name__}: {detail})"
        ) from None


def check_file(path: str | Path) -> tuple[Survey | None, list[Problem]]:
    """Every problem of a survey file or a field store, with the model when it can be built.

    Raises:
        SchemaError / InputError / StoreError: the file cannot be read at all.
    """
    p = Path(path)
    if is_store_file(p):
        with FieldStore.open(p) as store, store_content(p):
            doc = store.to_survey().document()
        return check_document(doc, str(p))
    return check_document(read_document(p), str(p))


def load_survey(path: str | Path) -> tuple[Survey, list[Problem]]:
    """Read a survey file or store; refuse it when it has errors.

    Returns:
        (the survey, its warnings and notes).

    Raises:
        SchemaError: malformed, truncated, newer version, or any error of meaning (the
        message lists every error with its place).
    """
    with collector_paused():
        model, probs = check_file(path)
    errs = errors(probs)
    if errs or model is None:
        lines = "\n  ".join(str(e) for e in errs) or "the survey could not be read"
        raise SchemaError(f"{len(errs)} error(s); the file is refused:\n  {lines}", where=str(path))
    return model, probs


def export_document(survey: Survey) -> str:
    """The document text of ``survey``: UTF-8 JSON, two-space indents, newline at the end."""
    return json.dumps(survey.document(), indent=2, ensure_ascii=False, allow_nan=False) + "\n"


def export_survey(
    source: FieldStore | Survey | str | Path, path: str | Path, *, force: bool = False
) -> Path:
    """Write a survey (a model, an open field store, or its path) to ``path`` atomically.

    The path is checked first (:func:`core.outputs.check_output`): never the store itself,
    another store, another survey's file or a section description; an earlier export of the
    same survey is replaced; any other existing file only with ``force``.

    Raises:
        OutputError: the path is refused or cannot be written; StoreError: the store
        cannot be opened or its content is damaged.
    """
    inputs: list[Path] = []
    if isinstance(source, Survey):
        survey = source
    elif isinstance(source, FieldStore):
        inputs.append(Path(source.path))
        with store_content(source.path):
            survey = source.to_survey()
    else:
        inputs.append(Path(source))
        with FieldStore.open(source) as store, store_content(source):
            survey = store.to_survey()
    out = check_output(path, inputs, "survey", force=force, survey_id=survey.survey.id)
    return write_atomic(out, export_document(survey).encode("utf-8"))


def import_survey(path: str | Path, store_path: str | Path, *, who: str = "import") -> Path:
    """Import a survey file into a **new** store at ``store_path``.

    The whole file is checked first; the store is built in a temporary file next to
    ``store_path`` in one transaction and linked into place when complete, so the new
    store is either absent or whole, and nothing that exists is ever replaced.

    Raises:
        OutputError: ``store_path`` exists or is the input; SchemaError: the file is
        malformed, truncated, of a newer version or has errors of meaning (unknown ids,
        values out of range, ...).
    """
    dst = check_output(store_path, [path], "store")
    survey, _warnings = load_survey(path)
    doc = survey.document()
    try:
        with atomic_output(dst, replace=False) as tmp:
            store = FieldStore.create(tmp, doc["survey"], note=doc.get("note", ""), who=who)
            try:
                with store.batch(who):
                    for m in doc["members"]:
                        store.add_member(m, who)
            finally:
                store.close()
    except OutputError:
        raise
    except InputError as e:
        raise SchemaError(f"the survey could not be stored: {e}", where=str(path)) from None
    return dst
