"""Entries of two stores that are one entry under two uids, matched before a merge.

An entry made before layout 3 got its uid when its store was migrated. asfound before
this rule hashed only the store's creation time and the entry's key; asfound now also
hashes the history row that made it (:mod:`core.survey.migrations`). A copy migrated by
the earlier asfound and a copy migrated now thus give one shared entry two uids, and
the merge, matching by uid, would keep it twice (the second renamed).

The rule: an entry of store A and an entry of store B with different uids, neither uid
in the other store, the same key (kind, member, station, id) and the same latest ``add``
row in their histories (its time, person, device and content, the content compared as
JSON values) are one entry. Both copies hold that row unchanged (history rows are never
rewritten), and two entries made apart do not share it: made apart on two devices they
differ in time, person or device; made on one device by one person at one instant with
one content they are indistinguishable and one entry is the right answer. The entry
takes the smaller of the two uids in both stores, so ``merge(A, B)`` and ``merge(B, A)``
decide alike. An entry with no ``add`` row in either history (a store whose history
began after it) is matched by the rule the migration itself uses then: the same content
and withdrawn flag in both copies is one entry; else both are kept and the clash listed.
An entry with an ``add`` row in one history only is never matched: nothing is collapsed
on a guess.
"""

from __future__ import annotations

import json

from core.survey.mergeside import Change, Side


def _made(changes: list[Change]) -> dict[tuple, tuple]:
    """The latest ``add`` row of each entry key: (time, person, device, content)."""
    out: dict[tuple, tuple] = {}
    for c in changes:
        for r in c.rows:
            if r.action == "add" and r.kind != "survey":
                content = json.loads(r.new) if r.new is not None else None
                out[r.target()] = (r.at, r.who, r.device, json.dumps(content, sort_keys=True))
    return out


def _reuid(side: Side, old: str, new: str) -> None:
    entities = {}
    for u, e in side.entities.items():
        entities[new if u == old else u] = e._replace(uid=new) if u == old else e
    side.entities = entities
    side.conflicts = [(*r[:7], new, *r[8:]) if r[7] == old else r for r in side.conflicts]


def match_by_add(sa: Side, sb: Side) -> list[tuple[str, str, str]]:
    """Give one uid to each entry that ``sa`` and ``sb`` hold under two (see the module
    docstring); ``sa`` and ``sb`` are changed. Returns (kept uid, dropped uid, entry
    key as text) for each match, in key order."""
    made_a, made_b = _made(sa.changes), _made(sb.changes)
    by_key_b = {e.key(): e for e in sb.entities.values()}
    pairs = []
    for ea in sa.entities.values():
        eb = by_key_b.get(ea.key())
        if eb is None or eb.uid == ea.uid or ea.uid in sb.entities or eb.uid in sa.entities:
            continue
        row_a, row_b = made_a.get(ea.key()), made_b.get(eb.key())
        if row_a is None and row_b is None:
            same = (ea.data, ea.deleted) == (eb.data, eb.deleted)
        else:
            same = row_a == row_b
        if same:
            pairs.append((ea.key(), ea.uid, eb.uid))
    out = []
    for key, ua, ub in sorted(pairs):
        keep = min(ua, ub)
        _reuid(sa, ua, keep)
        _reuid(sb, ub, keep)
        out.append((keep, max(ua, ub), "/".join(key)))
    return out


__all__ = ["match_by_add"]
