"""Properties of the merge (hypothesis): random entries on two devices from one common start.

Property-based invariants of our own merge rule (no outside source applies): nothing of
either store is lost, the order of the inputs does not matter, a store merged with an
unchanged copy of itself is unchanged, of two changes of one value the later is current,
and a device that went on after a merge merges again without doubling anything.
``ASFOUND_MERGE_EXAMPLES`` sets the examples of the larger tests for a longer run by hand.
"""

from __future__ import annotations

import hashlib
import json
import os
import tempfile
from collections import Counter
from pathlib import Path

from hypothesis import example, given, settings
from hypothesis import strategies as st

from core.survey.merge import merge_stores
from core.survey.store import FieldStore

from .merge_helpers import DEVICES, WHO, apply, common_start, conflicts, dump

values = st.floats(min_value=5.0, max_value=9.5).map(lambda v: round(v, 1))
ops = st.one_of(
    st.tuples(st.just("add"), values),
    st.tuples(st.just("change"), st.integers(1, 5), values),
    st.tuples(st.just("delete"), st.integers(1, 5)),
    st.tuples(st.just("note"), st.sampled_from(["", "pitting", "pack rust", "flaking"])),
    st.tuples(st.just("station"), st.integers(2, 4)),
    st.tuples(st.just("undo")),
)
steps = st.lists(st.tuples(st.integers(0, 1), ops), max_size=12)


def _digest(p: Path) -> str:
    return hashlib.sha256(p.read_bytes()).hexdigest()


def _run(folder: Path, plan) -> tuple[Path, Path]:
    a, b = common_start(folder)
    stores = [FieldStore.open(a, device=DEVICES[0]), FieldStore.open(b, device=DEVICES[1])]
    try:
        for side, op in plan:
            apply(stores[side], WHO[side], op)
    finally:
        for s in stores:
            s.close()
    return a, b


def _what(row) -> tuple:
    """A history row without its numbers and names (names may change by a rename)."""
    return (row[2], row[3], row[4], row[5], row[6], row[10], row[12] is None)


@settings(max_examples=int(os.environ.get("ASFOUND_MERGE_EXAMPLES", "20")), deadline=None)
@given(steps)
def test_merge_keeps_everything_is_symmetric_and_the_later_change_wins(plan):
    with tempfile.TemporaryDirectory() as tmp:
        folder = Path(tmp)
        a, b = _run(folder, plan)
        before = (_digest(a), _digest(b))
        ab, ba = folder / "ab.asf", folder / "ba.asf"
        merge_stores(a, b, ab, device="office")
        merge_stores(b, a, ba, device="office")
        assert (_digest(a), _digest(b)) == before  # the inputs are never changed
        ea, ha, _ = dump(a)
        eb, hb, _ = dump(b)
        ec, hc, meta = dump(ab)
        # merge(A, B) and merge(B, A): the same entries, values and history rows
        assert dump(ba)[:2] == (ec, hc)
        assert conflicts(ba) == conflicts(ab)
        # every entry of both is kept (by uid), and each history row of both is there
        assert {e[0] for e in ec} == {e[0] for e in ea} | {e[0] for e in eb}
        common = 0
        while common < min(len(ha), len(hb)) and ha[common][:13] == hb[common][:13]:
            common += 1
        want = Counter(map(_what, ha)) + Counter(map(_what, hb[common:]))
        assert Counter(map(_what, hc)) == want
        # an entry made on one device only comes through unchanged (but for a rename)
        renamed = {c[6]: c[8] for c in conflicts(ab) if c[0] == "renamed"}
        only = {e[0]: e for e in ea + eb if e[0] not in {x[0] for x in ea} & {x[0] for x in eb}}
        for e in ec:
            if e[0] in only:
                got, was = json.loads(e[6]), json.loads(only[e[0]][6])
                assert {**got, "id": was["id"]} == was
                assert got["id"] == renamed.get(e[0], was["id"])
        # of two changes of one value, the later one is current
        by_uid = {e[0]: json.loads(e[6]) for e in ec}
        for c in conflicts(ab):
            if c[0] == "value" and c[5] != "*" and c[9]:
                assert (c[9], c[10]) >= (c[11], c[12])
                if c[6] in by_uid:
                    assert json.dumps(by_uid[c[6]].get(c[5])) == c[7]
        # the merged store opens, reads as a survey and takes new entries
        with FieldStore.open(ab, device=DEVICES[0]) as s:
            s.to_survey()
            s.add_reading("G1", "S1", {"part": "web", "value": 8.0, "unit": "mm"}, "ann")
        assert json.loads(meta["merged"])["device"] == "office"


@settings(max_examples=10, deadline=None)
@given(steps)
def test_merging_with_an_unchanged_copy_changes_nothing(plan):
    with tempfile.TemporaryDirectory() as tmp:
        folder = Path(tmp)
        a, _b = _run(folder, plan)
        copy = folder / "copy.asf"
        copy.write_bytes(a.read_bytes())
        out = folder / "same.asf"
        res = merge_stores(a, copy, out, device="office")
        assert res.conflicts == () and res.changes_a == res.changes_b == 0
        assert dump(out)[:2] == dump(a)[:2]
        assert conflicts(out) == conflicts(a)


@settings(max_examples=int(os.environ.get("ASFOUND_MERGE_EXAMPLES", "8")), deadline=None)
@given(steps, st.lists(ops, max_size=6))
# found by this test: both devices made r4, the merge renamed B's to r5, B went on and made
# its own r5; merged again, the carried rename must not take B's new r5's id or history
@example([(0, ("add", 5.0)), (1, ("add", 5.0))], [("add", 5.0)])
def test_a_device_that_went_on_after_a_merge_merges_again_without_doubling(plan, more):
    with tempfile.TemporaryDirectory() as tmp:
        folder = Path(tmp)
        a, b = _run(folder, plan)
        c = merge_stores(a, b, folder / "c.asf").output
        before = len(dump(b)[1])
        with FieldStore.open(b, device=DEVICES[1]) as s:
            for op in more:
                apply(s, WHO[1], op)
        eb, hb, _ = dump(b)
        ec, hc, _ = dump(c)
        d = merge_stores(c, b, folder / "d.asf").output
        ed, hd, _ = dump(d)
        assert len(hd) == len(hc) + len(hb) - before  # B's new rows, nothing twice
        assert {e[0] for e in ed} == {e[0] for e in ec} | {e[0] for e in eb}
        assert dump(merge_stores(b, c, folder / "e.asf").output)[:2] == (ed, hd)
