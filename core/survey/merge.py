"""Merge two field stores of one survey made on two devices into a new store.

The rule:

* Two stores are of one survey when they have the same identity (``meta.origin``, made
  when the store was created and kept by every copy, see :mod:`core.survey.migrations`).
  Their common start is the longest run of changes, from the first, that both histories
  hold alike; a change made later is the same change in both when its device, person and
  rows are alike (a store merged before and merged again).
* Entries are matched by their uid, never by display id; an entry made before layout 3
  that two copies migrated by two rules hold under two uids is first given one
  (:mod:`core.survey.mergematch`: same key and same ``add`` row). An entry only one store has
  comes through unchanged. When both devices made an entry with the same display id
  (both made station ``S4``), both are kept; the later one (see below) is renamed: a
  reading, band or perforation to the next free number of its prefix (``r4`` to ``r7``),
  a station or member to ``<id>-2`` (``-3``, ...); its entries and history go with it.
* For an entry both stores have, each field (and whether it is withdrawn) is taken from
  the store whose changes after the common start touched it; when both did and the
  values differ, the value of the later change is current: later by time (each row's
  ISO 8601 time read as an instant in UTC; a malformed one refuses the store), ties by
  device id, then person and content, so ``merge(A, B)`` and ``merge(B, A)`` are the same
  store. Both values stay in the history and the pair is listed as a conflict. If taking
  fields from both would make an entry that is not valid by itself (a band whose start
  passes its end), the whole entry of the later change is taken.
* Every history row of both stores is kept with its person, device and time: the common
  start as it was, then the changes made after it, in the order above, numbered after it.
* What the merge decided is listed in the output's ``conflict`` table (``value``: both
  changed one value; ``renamed``: both made one display id; ``withdrawn``: one withdrew
  an entry the other changed or added to) and returned.

The inputs are read without being changed (:mod:`core.survey.mergeside`); the output is a
new store written through :func:`core.outputs.atomic_output` (absent or whole; an existing
file is never replaced).
"""

from __future__ import annotations

import datetime as _dt
import json
import re
import sqlite3
from dataclasses import dataclass
from pathlib import Path

from pydantic import ValidationError

from core.errors import AsfoundError, InputError, StoreError
from core.outputs import atomic_output, check_output, same_file
from core.survey.device import check_device, short, this_device
from core.survey.mergematch import match_by_add
from core.survey.mergeside import (
    Change,
    Conflict,
    ERow,
    HRow,
    MergeError,
    Plan,
    Side,
    read_side,
    rename,
)
from core.survey.mergewrite import verify, write_plan
from core.survey.model import Band, Perforation, Reading, Station

_MISSING = object()
_PARENT = {"member": 0, "station": 1}
_NUMBERED = re.compile(r"^(.*?)(\d+)$")


@dataclass(frozen=True)
class MergeResult:
    """What a merge wrote: the output, the conflicts, how many entries came from where,
    how many changes each store made after the common start, and the errors of meaning of
    the merged survey (the store is written all the same: nothing is lost)."""

    output: Path
    conflicts: tuple[Conflict, ...]
    only_a: int
    only_b: int
    both: int
    changes_a: int
    changes_b: int
    errors: tuple[str, ...] = ()


def merge_stores(
    a: str | Path, b: str | Path, out: str | Path, *, device: str | None = None
) -> MergeResult:
    """Merge the stores ``a`` and ``b`` (see the module docstring) into the new store ``out``.

    Raises:
        MergeError: the same store twice, or stores of different surveys; StoreError: an
        input is missing, not a store, damaged or of a newer layout; OutputError: ``out``
        is an input or exists. Nothing is written in any of these cases.
    """
    pa, pb = Path(a), Path(b)
    if same_file(pa, pb):
        raise MergeError(f"{pa} and {pb} are the same store; give the two devices' stores")
    dst = check_output(out, [pa, pb], "store")
    dev = check_device(device) if device is not None else this_device()
    sa, sb = read_side(pa), read_side(pb)
    if sa.meta["origin"] != sb.meta["origin"]:
        raise MergeError(
            f"{pa} (survey {_survey_id(sa)!r}, store made {sa.meta['created']}) and {pb} "
            f"(survey {_survey_id(sb)!r}, store made {sb.meta['created']}) are stores of "
            "different surveys: only copies of one store can be merged"
        )
    at = _dt.datetime.now(_dt.UTC).isoformat(timespec="milliseconds")
    try:
        plan = plan_merge(sa, sb)
        with atomic_output(dst, replace=False) as tmp:
            write_plan(tmp, sa, sb, plan, at, dev)
            problems = verify(tmp)
    except AsfoundError:
        raise
    except (
        ValueError,
        TypeError,
        KeyError,
        AttributeError,
        IndexError,
        OverflowError,
        RecursionError,
        sqlite3.Error,
    ) as e:
        detail = " ".join(str(e).split())[:300]
        raise StoreError(
            f"{pa} and {pb}: their content cannot be merged ({type(e).__name__}: {detail}); "
            "nothing was written"
        ) from None
    return MergeResult(dst, tuple(plan.conflicts), *plan.counts, problems)


def _survey_id(s: Side) -> str:
    return str(json.loads(s.meta["survey"]).get("id", ""))


# ------------------------------------------------------------------------- the plan
def plan_merge(sa: Side, sb: Side) -> Plan:
    """Decide the merged entries, header, history and conflicts of two read stores
    (``sa`` and ``sb`` are changed: renames are made in them)."""
    match_by_add(sa, sb)
    n = 0
    while n < min(len(sa.changes), len(sb.changes)) and sa.changes[n].same(sb.changes[n]):
        n += 1
    post_a, post_b = sa.changes[n:], sb.changes[n:]
    conflicts: list[Conflict] = []
    _carry_renames(sa, sb, post_a, post_b, conflicts)
    _rename_clashes(sa, sb, post_a, post_b, conflicts)
    keys_a = {c.key() for c in post_a}
    keys_b = {c.key() for c in post_b}
    own_a = [c for c in post_a if c.key() not in keys_b]
    own_b = [c for c in post_b if c.key() not in keys_a]
    shared = [c for c in post_a if c.key() in keys_b]
    merged = sorted(own_a + own_b + shared, key=Change.order)
    touch_a, touch_b = _touches(own_a), _touches(own_b)
    entities: list[ERow] = []
    both = 0
    for uid in sorted(set(sa.entities) | set(sb.entities)):
        ea, eb = sa.entities.get(uid), sb.entities.get(uid)
        if ea is None or eb is None:
            entities.append(ea or eb)  # type: ignore[arg-type]
            continue
        both += 1
        entities.append(_merge_entry(ea, eb, touch_a, touch_b, conflicts))
    header = _merge_fields(
        ("survey", "", "", ""),
        json.loads(sa.meta["survey"]),
        json.loads(sb.meta["survey"]),
        touch_a,
        touch_b,
        conflicts,
        ("survey", "", "", str(json.loads(sa.meta["survey"]).get("id", "")), "", "survey"),
    )
    _withdrawn(entities, own_a, own_b, touch_a, touch_b, conflicts)
    entities = _sequence(entities, sa, n, merged)
    counts = (
        len(set(sa.entities) - set(sb.entities)),
        len(set(sb.entities) - set(sa.entities)),
        both,
        len(own_a),
        len(own_b),
    )
    return Plan(entities, header, sa.changes[:n] + merged, conflicts, n, counts)


def _carry_renames(
    sa: Side, sb: Side, post_a: list[Change], post_b: list[Change], conflicts: list[Conflict]
) -> None:
    """An entry both stores have under two ids: the id an earlier merge gave it (its latest
    rename in either store's conflict table), else the smaller id (parents first). Where
    that id is taken in the renamed store by another entry (made there after the earlier
    merge), that entry moves out of the way first, to a fresh id (listed), so that no two
    entries of one store ever share an id and their history rows stay their own."""
    latest: dict[str, str] = {}
    for r in sorted(sa.conflicts + sb.conflicts, key=lambda r: tuple(map(str, r))):
        if r[1] == "renamed":
            latest[r[7]] = r[9]
    for level in ("member", "station", "entry"):
        for uid in sorted(set(sa.entities) & set(sb.entities)):
            ea, eb = sa.entities[uid], sb.entities[uid]
            lvl = ea.kind if ea.kind in _PARENT else "entry"
            if lvl != level or ea.id == eb.id:
                continue
            new = latest.get(uid) if latest.get(uid) in (ea.id, eb.id) else min(ea.id, eb.id)
            side, post, e = (sa, post_a, ea) if ea.id != new else (sb, post_b, eb)
            kept = sb.entities[uid] if side is sa else sa.entities[uid]
            for o in list(side.entities.values()):
                if o.uid != uid and o.key() == e._replace(id=new).key():
                    _move_aside(sa, sb, side, post, o, kept, conflicts)
            rename(side, uid, new, post)


def _move_aside(sa: Side, sb: Side, side: Side, post, e: ERow, kept: ERow, conflicts) -> None:
    """Give entry ``e`` of ``side`` a fresh id: ``kept`` (the other store's) holds its id."""
    used = {
        x.id
        for s in (sa, sb)
        for x in s.entities.values()
        if (x.kind, x.member, x.station) == e.key()[:3]
    }
    new = _fresh(e.kind, e.id, used)
    t = _added(post).get(e.key(), ((), "", ""))
    rename(side, e.uid, new, post)
    conflicts.append(
        Conflict(
            "renamed", e.kind, e.member, e.station, e.id, "id", e.uid, kept.id, new,
            "", "", str(t[1]), str(t[2]),
            f"{e.kind} {e.id!r} was made on one device after an earlier merge had given "
            f"that id to another entry; it is now {new!r}",
        )
    )  # fmt: skip


def _touches(changes: list[Change]) -> dict[tuple, tuple[tuple, str]]:
    """For each (entry, field) and each entry (field None) touched by ``changes``: the order
    of the latest change that touched it, and its time and device."""
    out: dict[tuple, tuple[tuple, str]] = {}
    for c in changes:
        o = c.order()
        for r in c.rows:
            for key in ((*r.target(), r.field), (*r.target(), None)):
                if key not in out or out[key][0] < o:
                    out[key] = (o, f"{r.at} {r.device}")
    return out


def _fresh(kind: str, ident: str, used: set[str]) -> str:
    if kind in _PARENT:
        k = 2
        while f"{ident}-{k}" in used:
            k += 1
        return f"{ident}-{k}"
    m = _NUMBERED.match(ident)
    prefix, k = (m.group(1), int(m.group(2)) + 1) if m else (f"{ident}-", 2)
    while f"{prefix}{k}" in used:
        k += 1
    return f"{prefix}{k}"


def _added(post: list[Change]) -> dict[tuple, tuple[tuple, str, str]]:
    """The order, time (as written) and device of the change that added each entry (by
    its place and id)."""
    out: dict[tuple, tuple[tuple, str, str]] = {}
    for c in post:
        for r in c.rows:
            if r.action == "add":
                out.setdefault(r.target(), (c.order(), c.rows[0].at, c.rows[0].device))
    return out


def _rename_clashes(
    sa: Side, sb: Side, post_a: list[Change], post_b: list[Change], conflicts: list[Conflict]
) -> None:
    """Rename the later of two entries made with one display id on two devices."""
    for level in ("member", "station", "entry"):
        pairs = []
        by_key_b = {e.key(): e for e in sb.entities.values()}
        for e in list(sa.entities.values()):
            lvl = e.kind if e.kind in _PARENT else "entry"
            o = by_key_b.get(e.key())
            if lvl == level and o is not None and o.uid != e.uid:
                pairs.append((e, o))
        added_a, added_b = _added(post_a), _added(post_b)
        for ea, eb in sorted(pairs, key=lambda p: p[0].key()):
            # (order, time, device) of the change that made each; not made after the
            # common start: last, by uid
            ta = (*added_a.get(ea.key(), (("\uffff", ea.uid), "\uffff", ea.uid)), ea.uid)
            tb = (*added_b.get(eb.key(), (("\uffff", eb.uid), "\uffff", eb.uid)), eb.uid)
            if (ta[0], ta[3]) <= (tb[0], tb[3]):
                side, post, e, t, k_e, kt = sb, post_b, eb, tb, ea, ta
            else:
                side, post, e, t, k_e, kt = sa, post_a, ea, ta, eb, tb
            used = {
                x.id
                for s in (sa, sb)
                for x in s.entities.values()
                if (x.kind, x.member, x.station) == e.key()[:3]
            }
            new = _fresh(e.kind, e.id, used)
            rename(side, e.uid, new, post)
            conflicts.append(
                Conflict(
                    "renamed", e.kind, e.member, e.station, e.id, "id", e.uid, k_e.id, new,
                    kt[1], kt[2], t[1], t[2],
                    f"both devices made {e.kind} {e.id!r}; the one made later on device "
                    f"{short(t[2])} ({t[1]}) is now {new!r}",
                )
            )  # fmt: skip


def _merge_fields(key, da, db, touch_a, touch_b, conflicts, place) -> dict:
    out: dict = {}
    names = list(da) if set(da) == set(db) else sorted(set(da) | set(db))
    for f in names:
        va, vb = da.get(f, _MISSING), db.get(f, _MISSING)
        if va == vb:
            out[f] = va
            continue
        v = _pick(key, f, va, vb, touch_a, touch_b, conflicts, place)
        if v is not _MISSING:
            out[f] = v
    return out


def _pick(key, f, va, vb, touch_a, touch_b, conflicts, place):
    """The value of field ``f`` of entry ``key`` when the two stores differ."""
    ta, tb = touch_a.get((*key, f)), touch_b.get((*key, f))
    if ta is not None and tb is None:
        return va
    if tb is not None and ta is None:
        return vb
    if ta is None and tb is None:  # not in either history: the same choice either way
        ja, jb = _text(va), _text(vb)
        win, lose = (va, vb) if (ja or "") <= (jb or "") else (vb, va)
        ta = tb = (("",), " ")
        note = "the stores differ without a change in either history"
    else:
        win, lose = (va, vb) if ta[0] > tb[0] else (vb, va)
        note = "both devices changed it; the later change is current, both are in the history"
    (wt, lt) = (ta, tb) if win is va else (tb, ta)
    kind, member, station, entity, _, _ = place
    conflicts.append(
        Conflict(
            "value", kind, member, station, entity, f, place[4], _text(win), _text(lose),
            *wt[1].split(" ", 1), *lt[1].split(" ", 1), note,
        )
    )  # fmt: skip
    return win


def _text(v) -> str | None:
    return None if v is _MISSING else json.dumps(v)


def _merge_entry(ea: ERow, eb: ERow, touch_a, touch_b, conflicts) -> ERow:
    key = ea.key()
    place = (*key, ea.uid, ea.kind)
    if ea.key() != eb.key():  # cannot happen after the renames; keep one choice
        eb = eb._replace(kind=ea.kind, member=ea.member, station=ea.station, id=ea.id)
    found: list[Conflict] = []
    data = _merge_fields(key, ea.data, eb.data, touch_a, touch_b, found, place)
    if data not in (ea.data, eb.data) and not _valid(ea.kind, data):
        ta, tb = touch_a.get((*key, None)), touch_b.get((*key, None))
        if ta is None and tb is None:  # neither history: the same choice in either order
            data = min(ea.data, eb.data, key=lambda d: json.dumps(d, sort_keys=True))
        else:
            data = ea.data if (ta and (tb is None or ta[0] > tb[0])) else eb.data
        found = [
            c.__class__(**{**c.__dict__, "note": c.note + "; taken whole from the later change"})
            for c in found
        ]
    conflicts.extend(found)
    deleted = ea.deleted
    if ea.deleted != eb.deleted:
        deleted = _pick(key, "*", ea.deleted, eb.deleted, touch_a, touch_b, conflicts, place)
    return ea._replace(data=data, deleted=int(deleted))


def _valid(kind: str, data: dict) -> bool:
    cls = {"reading": Reading, "band": Band, "perforation": Perforation, "station": Station}
    try:
        if kind in cls:
            cls[kind].model_validate(data)
        return True
    except (ValidationError, InputError, ValueError, TypeError):
        return False


def _withdrawn(entities, own_a, own_b, touch_a, touch_b, conflicts) -> None:
    """List every withdrawn entry that the other device changed or added to afterwards."""
    adds = {"a": _targets(own_a), "b": _targets(own_b)}
    for e in entities:
        if not e.deleted:
            continue
        for mine, other, o_name in ((touch_a, touch_b, "b"), (touch_b, touch_a, "a")):
            hit = mine.get((*e.key(), "*"))
            if hit is None or other.get((*e.key(), "*")) is not None:
                continue  # not withdrawn here, or both devices acted on its withdrawal
            later = other.get((*e.key(), None))
            under = [t for t in adds[o_name] if _is_under(t, e)]
            if later is None and not under:
                continue
            what = "changed it" if later else f"added {len(under)} entr(ies) under it"
            o_at = later[1] if later else " "
            conflicts.append(
                Conflict(
                    "withdrawn", *e.key(), "*", e.uid, None, None, *hit[1].split(" ", 1),
                    *o_at.split(" ", 1),
                    f"withdrawn on device {short(hit[1].split(' ', 1)[1])}; the other device "
                    f"{what}: it stays withdrawn and everything is kept in the store",
                )
            )  # fmt: skip


def _targets(changes: list[Change]) -> list[tuple]:
    return [r.target() for c in changes for r in c.rows if r.action == "add"]


def _is_under(t: tuple, e: ERow) -> bool:
    if e.kind == "member":
        return t[0] != "member" and t[1] == e.id
    if e.kind == "station":
        return t[1] == e.member and t[2] == e.id
    return False


def _sequence(entities: list[ERow], sa: Side, n: int, merged: list[Change]) -> list[ERow]:
    """The entries in the order they were made: those of the common start keep their
    place, the others follow in the merged order of the changes that added them."""
    start = {r.target() for c in sa.changes[:n] for r in c.rows if r.action == "add"}
    top = max((e.seq for e in entities if e.key() in start), default=0)
    pos = {}
    for i, c in enumerate(merged):
        for j, r in enumerate(c.rows):
            if r.action == "add":
                pos.setdefault(r.target(), (i, j))
    early = [e for e in entities if e.key() in start or e.key() not in pos]
    first = sorted(early, key=lambda e: e.seq)
    rest = sorted((e for e in entities if e.key() not in start and e.key() in pos),
                  key=lambda e: pos[e.key()])  # fmt: skip
    out = [e if e.key() in start else e._replace(seq=top + 1 + k) for k, e in enumerate(first)]
    top = max((e.seq for e in out), default=0)
    return out + [e._replace(seq=top + 1 + k) for k, e in enumerate(rest)]


__all__ = ["Conflict", "ERow", "HRow", "MergeError", "MergeResult", "merge_stores", "plan_merge"]
