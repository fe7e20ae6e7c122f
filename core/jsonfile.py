"""Reading a JSON input file (survey file, section description): bounded and strict.

The file is at most :data:`core.limits.MAX_FILE_BYTES` long, UTF-8, valid JSON without NaN
or infinity, and not nested deeper than Python's parser can follow; anything else is a
:class:`SchemaError` that names the file.
"""

from __future__ import annotations

import json
from pathlib import Path
from typing import Any

from core import limits
from core.errors import InputError, SchemaError


def _refuse_constant(what: str):
    def refuse(name: str) -> Any:
        raise ValueError(f"{name} is not a number a {what} may hold (JSON has no {name})")

    return refuse


def read_json(path: str | Path, what: str = "file") -> Any:
    """Parse a JSON input file (no checks of its content).

    Raises:
        InputError: file not found; SchemaError: too large, unreadable, not UTF-8, not
        valid JSON, NaN or infinity, or nested too deeply.
    """
    p = Path(path)
    try:
        with p.open("rb") as f:
            data = f.read(limits.MAX_FILE_BYTES + 1)
    except FileNotFoundError:
        raise InputError("file not found", where=str(p)) from None
    except OSError as e:
        raise SchemaError(f"cannot read the {what}: {e}", where=str(p)) from None
    if len(data) > limits.MAX_FILE_BYTES:
        raise SchemaError(
            f"the {what} is larger than the limit of {limits.MAX_FILE_BYTES:,} bytes",
            where=str(p),
        )
    try:
        text = data.decode("utf-8")
    except UnicodeDecodeError as e:
        raise SchemaError(f"cannot read the {what}: not UTF-8 text ({e})", where=str(p)) from None
    try:
        return json.loads(text, parse_constant=_refuse_constant(what))
    except json.JSONDecodeError as e:
        raise SchemaError(
            f"not valid JSON (line {e.lineno}, column {e.colno}: {e.msg}); truncated or damaged?",
            where=str(p),
        ) from None
    except RecursionError:
        raise SchemaError("nested too deeply to be read", where=str(p)) from None
    except ValueError as e:
        raise SchemaError(str(e), where=str(p)) from None
