"""The merge orders changes by their times read as instants in UTC, not as text.

The times follow ISO 8601 (offsets, ``Z``, fractional seconds; Python's
``datetime.fromisoformat`` as the reference reader); the merge rule (the later change of
one value is current) is our own (:mod:`core.survey.merge`).
"""

from __future__ import annotations

import hashlib
import sqlite3

import pytest

from core.errors import StoreError
from core.survey.merge import merge_stores
from core.survey.mergeside import utc_key
from core.survey.store import FieldStore

from .merge_helpers import DEVICES, common_start


def _changed(tmp_path, at_a: str, at_b: str):
    """Both devices change r1 (A to 8.0, B to 8.2); their rows then get the times given."""
    a, b = common_start(tmp_path)
    for path, dev, who, v, at in (
        (a, DEVICES[0], "ann", 8.0, at_a),
        (b, DEVICES[1], "bob", 8.2, at_b),
    ):
        with FieldStore.open(path, device=dev) as s:
            s.update_reading("G1", "S1", "r1", {"value": v}, who)
        conn = sqlite3.connect(path)
        conn.execute("UPDATE history SET at = ? WHERE action = 'update'", (at,))
        conn.commit()
        conn.close()
    return a, b


def _r1(path) -> float:
    with FieldStore.open(path, device="office-x") as s:
        st = s.to_survey().members[0].stations[0]
        return next(r.value for r in st.readings if r.id == "r1")


@pytest.mark.parametrize(
    ("at_a", "at_b", "current"),
    [
        # A 10:00 at +02:00 is 08:00 UTC, before B's 09:00 UTC (as text A sorts later)
        ("2026-01-01T10:00:00+02:00", "2026-01-01T09:00:00Z", 8.2),
        # 09:00:00.9 is after 09:00:00 (as text '.' sorts before 'Z')
        ("2026-01-01T09:00:00.900+00:00", "2026-01-01T09:00:00Z", 8.0),
        # -05:00: 04:30 local is 09:30 UTC, after 09:00 UTC
        ("2026-01-01T04:30:00-05:00", "2026-01-01T09:00:00.000+00:00", 8.0),
        # no offset: UTC, as asfound always wrote it
        ("2026-01-01T08:59:59", "2026-01-01T09:00:00+00:00", 8.2),
    ],
)
def test_the_later_instant_is_current_in_either_order(tmp_path, at_a, at_b, current):
    a, b = _changed(tmp_path, at_a, at_b)
    ab = merge_stores(a, b, tmp_path / "ab.asf")
    ba = merge_stores(b, a, tmp_path / "ba.asf")
    assert _r1(ab.output) == _r1(ba.output) == current
    (c,) = [x for x in ab.conflicts if x.what == "value" and x.field == "value"]
    assert {c.kept_at, c.other_at} == {at_a, at_b}  # the times as written are listed
    assert c.kept == str(current)


def test_utc_key_sorts_as_the_instants():
    keys = [
        utc_key("2026-01-01T09:00:00Z"),
        utc_key("2026-01-01T10:00:00.5+01:00"),  # 09:00:00.5 UTC
        utc_key("2026-01-01T09:00:01"),
        utc_key("2025-12-31T23:30:00-10:00"),  # 09:30 UTC on 1 January
    ]
    assert keys == sorted(keys)
    assert keys[0] == "2026-01-01T09:00:00.000000"
    assert utc_key("2026-01-01T10:00:00+01:00") == keys[0]


def _digest(p) -> str:
    return hashlib.sha256(p.read_bytes()).hexdigest()


@pytest.mark.parametrize("bad", ["yesterday", "2026-13-01T00:00:00Z", "", "01/02/2026 10:00"])
def test_a_malformed_time_refuses_the_store_naming_it_and_the_row(tmp_path, bad):
    a, b = _changed(tmp_path, "2026-01-01T09:00:00Z", "2026-01-01T10:00:00Z")
    conn = sqlite3.connect(b)
    (row,) = conn.execute("SELECT id FROM history WHERE action = 'update'").fetchone()
    conn.execute("UPDATE history SET at = ? WHERE id = ?", (bad, row))
    conn.commit()
    conn.close()
    before = (_digest(a), _digest(b))
    out = tmp_path / "c.asf"
    with pytest.raises(StoreError, match=rf"b\.asf: history row {row} .*time {bad!r}"):
        merge_stores(a, b, out)
    assert not out.exists() and (_digest(a), _digest(b)) == before
