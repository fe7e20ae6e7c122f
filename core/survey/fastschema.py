"""A quick first pass of the JSON Schema: is the whole document valid, yes or no.

The published schema is checked by ``jsonschema`` (its messages are the ones the user
reads), which costs about 6 ms per station of a survey. A compiled validator
(``jsonschema_rs``, the same draft 2020-12 rules) answers "valid or not" for a whole survey
in a few milliseconds. Only its "valid" is taken: a document it finds invalid, or cannot
read (an integer beyond 64 bits, a lone surrogate in a text), or any failure of its own, goes
through ``jsonschema`` exactly as before, so every message and every place stays the same.
Without ``jsonschema_rs`` installed every document goes the long way.
"""

from __future__ import annotations

from functools import lru_cache
from typing import Any

try:  # a compiled validator, optional: the long way gives the same answers, slower
    import jsonschema_rs
except ImportError:  # pragma: no cover - exercised only where the wheel is missing
    jsonschema_rs = None


@lru_cache(maxsize=4)
def _validator(version: int) -> Any:
    from core.survey.validate import schema

    if jsonschema_rs is None:
        return None
    # the schema has no "format" keyword; formats off, as jsonschema checks none by default
    return jsonschema_rs.Draft202012Validator(schema(version), validate_formats=False)


def known_valid(doc: Any, version: int) -> bool:
    """True only when the compiled validator finds ``doc`` valid against the schema of
    ``version``; False when it finds errors, cannot judge, or is not installed."""
    try:
        v = _validator(version)
        return v is not None and bool(v.is_valid(doc))
    except Exception:  # any doubt: the full check decides
        return False
