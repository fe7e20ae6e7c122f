"""Writing a merged store (see :mod:`core.survey.merge`): the new file in one transaction,
then checked by opening it as a store and reading it as a survey."""

from __future__ import annotations

import json
import sqlite3
from pathlib import Path

from core.survey.mergeside import Conflict, Plan, Side
from core.survey.migrations import CURRENT, V4_SCHEMA
from core.survey.model import Survey


def write_plan(tmp: Path, sa: Side, sb: Side, plan: Plan, at: str, device: str) -> None:
    """Write the merged store decided in ``plan`` to the new file ``tmp`` in one transaction
    (``at``, ``device``: when and where the merge was made, kept in ``meta.merged``)."""
    conn = sqlite3.connect(str(tmp), isolation_level=None)
    try:
        conn.execute("PRAGMA journal_mode=WAL")
        conn.execute("PRAGMA synchronous=FULL")
        conn.execute("BEGIN IMMEDIATE")
        for stmt in V4_SCHEMA.split(";"):
            if stmt.strip():
                conn.execute(stmt)
        meta = {
            **{k: v for k, v in sorted(sb.meta.items())},
            **{k: v for k, v in sorted(sa.meta.items())},
        }
        meta["note"] = min(sa.meta.get("note", '""'), sb.meta.get("note", '""'))
        meta["created"] = min(sa.meta["created"], sb.meta["created"])
        meta["survey"] = json.dumps(plan.header)
        meta["merged"] = json.dumps({"at": at, "device": device, "conflicts": len(plan.conflicts)})
        conn.executemany("INSERT INTO meta(key, value) VALUES (?, ?)", sorted(meta.items()))
        conn.executemany(
            "INSERT INTO entity(kind, member, station, id, seq, data, deleted, uid)"
            " VALUES (?, ?, ?, ?, ?, ?, ?, ?)",
            [(*e[:5], json.dumps(e.data), e.deleted, e.uid) for e in plan.entities],
        )
        conn.executemany(
            "INSERT INTO history(id, change, at, who, device, action, kind, member, station,"
            " entity, field, old, new, undone, undoes) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?,"
            " ?, ?, ?, ?)",
            _history_rows(sa, sb, plan),
        )
        earlier = list(dict.fromkeys(sa.conflicts + sb.conflicts))
        now = [
            (at, *(getattr(c, f) for f in Conflict.__dataclass_fields__)) for c in plan.conflicts
        ]
        conn.executemany(
            "INSERT INTO conflict(merged, what, kind, member, station, entity, field, uid, kept,"
            " other, kept_at, kept_device, other_at, other_device, note) VALUES (?, ?, ?, ?, ?,"
            " ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)",
            sorted(earlier, key=lambda r: tuple(map(str, r))) + now,
        )
        conn.execute(f"PRAGMA user_version = {CURRENT}")
        conn.execute("COMMIT")
    finally:
        conn.close()


def _history_rows(sa: Side, sb: Side, plan: Plan) -> list[tuple]:
    """Every history row: the common start as it was, then the merged changes renumbered
    (an undo names the new number of the change it reverted; undone when either store
    says so)."""
    n = plan.prefix
    start_undone = {r.id for s in (sa, sb) for c in s.changes[:n] for r in c.rows if r.undone}
    rows: list[tuple] = []
    for c in sa.changes[:n]:
        rows += [(*r[:13], int(r.id in start_undone), r.undoes) for r in c.rows]
    last_change = sa.changes[n - 1].number if n else 0
    last_id = max((r[0] for r in rows), default=0)
    number: dict[tuple[str, int], int] = {}
    keys_to_new: dict[tuple, int] = {}
    for k, c in enumerate(plan.changes[n:], start=1):
        keys_to_new[c.key()] = last_change + k
    for s, tag in ((sa, "a"), (sb, "b")):
        for c in s.changes[n:]:
            number[(tag, c.number)] = keys_to_new.get(c.key(), 0)
    undone_keys = {c.key() for s in (sa, sb) for c in s.changes[n:] if c.rows[0].undone}
    in_a = {id(c) for c in sa.changes}
    side_of = {c.key(): ("a" if id(c) in in_a else "b") for c in plan.changes[n:]}
    for c in plan.changes[n:]:
        new_c = keys_to_new[c.key()]
        tag = side_of[c.key()]
        for r in c.rows:
            last_id += 1
            undoes = r.undoes
            if undoes is not None and undoes > last_change:
                undoes = number.get((tag, undoes), undoes)
            rows.append((last_id, new_c, *r[2:13], int(c.key() in undone_keys), undoes))
    # a change of the common start undone later on one device is undone in the merge
    return rows


def verify(tmp: Path) -> tuple[str, ...]:
    """Check the new store: it opens as a store and reads as a survey (else nothing is
    written). Returns the errors of meaning the merged survey has (entries of the two
    devices that do not agree, for the inspector to correct; the store is kept)."""
    from core.survey.document import store_content
    from core.survey.problems import errors
    from core.survey.store import FieldStore
    from core.survey.validate import check_document

    with FieldStore.open(tmp, device="merge-check") as st, store_content(tmp):
        doc = st.to_survey().document()
        Survey.model_validate(doc)
        return tuple(str(e) for e in errors(check_document(doc, str(tmp))[1]))
