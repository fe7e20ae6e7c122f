"""Property (hypothesis) of matching one entry held under two uids (our own rule, no
outside source applies; :mod:`core.survey.mergematch`): random entries on two devices from
one common start; the entries of the start are then given other uids in one copy, as a
copy migrated by an earlier uid rule holds them. The merge must come out as if the uids
had agreed: the same entries, values, history and conflicts, in either order."""

from __future__ import annotations

import hashlib
import sqlite3
import tempfile
from pathlib import Path

from hypothesis import given, settings
from hypothesis import strategies as st

from core.survey.merge import merge_stores

from .merge_helpers import conflicts, dump
from .test_merge_props import _run, steps


def _reuid(path: Path, which: list[bool], shared: list[str]) -> None:
    conn = sqlite3.connect(path)
    try:
        for uid, pick in zip(shared, which, strict=False):
            if pick:
                other = hashlib.sha256(f"earlier rule {uid}".encode()).hexdigest()[:32]
                conn.execute("UPDATE entity SET uid = ? WHERE uid = ?", (other, uid))
        conn.commit()
    finally:
        conn.close()


def _plain(path: Path) -> tuple:
    """Entries without their uids, history, conflicts without uids."""
    ents, hist, _ = dump(path)
    return (
        sorted(e[1:] for e in ents),
        hist,
        [c[:6] + c[7:] for c in conflicts(path)],
    )


@settings(max_examples=12, deadline=None)
@given(steps, st.lists(st.booleans(), min_size=1, max_size=8), st.booleans())
def test_one_entry_under_two_uids_merges_as_if_they_agreed(plan, which, side_a):
    with tempfile.TemporaryDirectory() as tmp:
        folder = Path(tmp)
        a, b = _run(folder, plan)
        ref = merge_stores(a, b, folder / "ref.asf", device="office").output
        ea, eb = dump(a)[0], dump(b)[0]
        shared = sorted({e[0] for e in ea} & {e[0] for e in eb})
        _reuid(a if side_a else b, which, shared)
        ab = merge_stores(a, b, folder / "ab.asf", device="office")
        ba = merge_stores(b, a, folder / "ba.asf", device="office")
        want = _plain(ref)
        for res in (ab, ba):
            got = _plain(res.output)
            assert got[0] == want[0]  # no entry doubled, none lost, same values
            assert got[1] == want[1]  # every history row, once, in the same order
            assert got[2] == want[2]  # no new conflict, none renamed
        assert dump(ab.output)[:2] == dump(ba.output)[:2]
        assert conflicts(ab.output) == conflicts(ba.output)
