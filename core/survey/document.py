"""The interchange file: a JSON document ``asfound.survey`` version 1.

Its JSON Schema (draft 2020-12) is ``core/schema/survey-1.schema.json``; the format is
described in ``docs/survey-format.md``. Export writes through a temporary file and a rename;
import checks the whole document first and builds a new store in a temporary file, renamed
into place only when complete, so a refused file changes nothing.
"""

from __future__ import annotations

import json
import os
import tempfile
from pathlib import Path
from typing import Any

from core.errors import InputError, SchemaError, StoreError
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
    """Parse a survey file as JSON (no checks of its content).

    Raises:
        InputError: file not found; SchemaError: unreadable, not UTF-8, or not valid JSON.
    """
    p = Path(path)
    try:
        text = p.read_text(encoding="utf-8")
    except FileNotFoundError:
        raise InputError("file not found", where=str(p)) from None
    except (OSError, UnicodeDecodeError) as e:
        raise SchemaError(f"cannot read the file: {e}", where=str(p)) from None
    try:
        return json.loads(text, parse_constant=_no_constant)
    except json.JSONDecodeError as e:
        raise SchemaError(
            f"not valid JSON (line {e.lineno}, column {e.colno}: {e.msg}); truncated or damaged?",
            where=str(p),
        ) from None
    except ValueError as e:
        raise SchemaError(str(e), where=str(p)) from None


def _no_constant(name: str) -> Any:
    raise ValueError(f"{name} is not a number a survey file may hold (JSON has no {name})")


def check_file(path: str | Path) -> tuple[Survey | None, list[Problem]]:
    """Every problem of a survey file or a field store, with the model when it can be built.

    Raises:
        SchemaError / InputError / StoreError: the file cannot be read at all.
    """
    p = Path(path)
    if is_store_file(p):
        with FieldStore.open(p) as store:
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
    model, probs = check_file(path)
    errs = errors(probs)
    if errs or model is None:
        lines = "\n  ".join(str(e) for e in errs) or "the survey could not be read"
        raise SchemaError(f"{len(errs)} error(s); the file is refused:\n  {lines}", where=str(path))
    return model, probs


def export_document(survey: Survey) -> str:
    """The document text of ``survey``: UTF-8 JSON, two-space indents, newline at the end."""
    return json.dumps(survey.document(), indent=2, ensure_ascii=False, allow_nan=False) + "\n"


def export_survey(source: FieldStore | Survey | str | Path, path: str | Path) -> Path:
    """Write a survey (a model, an open store, or a store file) to ``path`` atomically.

    Raises:
        StoreError: the store cannot be opened; OSError: the file cannot be written.
    """
    if isinstance(source, Survey):
        survey = source
    elif isinstance(source, FieldStore):
        survey = source.to_survey()
    else:
        with FieldStore.open(source) as store:
            survey = store.to_survey()
    text = export_document(survey)
    out = Path(path)
    fd, tmp = tempfile.mkstemp(prefix=f".{out.name}.", suffix=".tmp", dir=out.parent or ".")
    try:
        with os.fdopen(fd, "w", encoding="utf-8") as f:
            f.write(text)
            f.flush()
            os.fsync(f.fileno())
        os.replace(tmp, out)
    except BaseException:
        Path(tmp).unlink(missing_ok=True)
        raise
    return out


def import_survey(path: str | Path, store_path: str | Path, *, who: str = "import") -> Path:
    """Import a survey file into a **new** store at ``store_path``.

    The whole file is checked first; the store is built in a temporary file next to
    ``store_path`` in one transaction and renamed into place when complete.

    Raises:
        SchemaError: the file is malformed, truncated, of a newer version or has errors of
        meaning (unknown ids, values out of range, ...); StoreError: ``store_path`` exists.
    """
    dst = Path(store_path)
    if dst.exists():
        raise StoreError(f"{dst}: a file of that name exists; a store is never overwritten")
    survey, _warnings = load_survey(path)
    doc = survey.document()
    fd, tmpname = tempfile.mkstemp(prefix=f".{dst.name}.", suffix=".tmp", dir=dst.parent or ".")
    os.close(fd)
    tmp = Path(tmpname)
    tmp.unlink()
    try:
        store = FieldStore.create(tmp, doc["survey"], note=doc.get("note", ""), who=who)
        try:
            with store.batch(who):
                for m in doc["members"]:
                    store.add_member(m, who)
        finally:
            store.close()
        if dst.exists():
            raise StoreError(f"{dst}: a file of that name appeared meanwhile; not overwritten")
        os.replace(tmp, dst)
    except InputError as e:
        raise SchemaError(f"the survey could not be stored: {e}", where=str(path)) from None
    finally:
        for extra in (tmp, Path(f"{tmp}-wal"), Path(f"{tmp}-shm")):
            extra.unlink(missing_ok=True)
    return dst
