"""Damaged field stores for the fuzz: a sample imported into a store, then either its bytes
damaged (truncated, bytes changed) or one of its entries' JSON mutated in place."""

from __future__ import annotations

import json
import sqlite3
import tempfile
from functools import lru_cache
from pathlib import Path

from hypothesis import strategies as st

from tests.fuzz.cases import SAMPLES
from tests.fuzz.mutate import Mutation, apply, cases


@lru_cache(maxsize=1)
def sample_store() -> bytes:
    """The bytes of a field store holding the SI sample survey."""
    from core.survey import import_survey

    with tempfile.TemporaryDirectory() as tmp:
        dst = Path(tmp) / "sample.asf"
        import_survey(SAMPLES / "deck-girder-si.json", dst, who="fuzz")
        return dst.read_bytes()


def mutate_store(data: bytes, row: int, muts: list[Mutation], damage: Mutation | None) -> bytes:
    """The store ``data`` with entry number ``row`` (modulo the entries) mutated, then its
    bytes damaged when ``damage`` is given."""
    with tempfile.TemporaryDirectory() as tmp:
        path = Path(tmp) / "s.asf"
        path.write_bytes(data)
        conn = sqlite3.connect(path)
        rows = conn.execute("SELECT rowid, data FROM entity ORDER BY rowid").fetchall()
        meta = conn.execute("SELECT key, value FROM meta WHERE key = 'survey'").fetchall()
        targets = [("entity", r[0], r[1]) for r in rows] + [("meta", k, v) for k, v in meta]
        table, key, text = targets[row % len(targets)]
        new = apply(json.loads(text), muts).decode("utf-8", "replace") if muts else text
        if table == "entity":
            conn.execute("UPDATE entity SET data = ? WHERE rowid = ?", (new, key))
        else:
            conn.execute("UPDATE meta SET value = ? WHERE key = ?", (new, key))
        conn.commit()
        conn.execute("PRAGMA journal_mode=DELETE")
        conn.close()
        out = path.read_bytes()
    if damage is not None:
        out = apply_bytes(out, damage)
    return out


def apply_bytes(data: bytes, m: Mutation) -> bytes:
    """A truncation or one changed byte of ``data`` (see :func:`tests.fuzz.mutate.text_damage`)."""
    if m.op == "truncate":
        return data[: m.pick % max(len(data), 1)]
    i = m.pick % len(data)
    return data[:i] + bytes([m.arg]) + data[i + 1 :]


def store_cases() -> st.SearchStrategy[tuple[int, list[Mutation], Mutation | None]]:
    """(entry index, mutations of that entry's JSON, damage to the bytes or None)."""
    from tests.fuzz.mutate import text_damage

    return st.tuples(
        st.integers(0, 2**16),
        cases(),
        st.sampled_from((False, False, True)).flatmap(
            lambda hit: text_damage() if hit else st.none()
        ),
    )
