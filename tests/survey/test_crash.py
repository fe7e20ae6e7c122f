"""Crash safety for real: a writer process killed with SIGKILL loses no saved entry."""

from __future__ import annotations

import os
import random
import signal
import sqlite3
import subprocess
import sys
import time
from pathlib import Path

import pytest

from core.survey.store import FieldStore

from .helpers import ROOT, document, header

WRITER = """
import sys
from core.survey.store import FieldStore
store = FieldStore.open(sys.argv[1])
n = 0
while True:
    n += 1
    saved = store.add_reading("G1", "S1", {"part": "web", "value": 8.0 + (n % 7) / 10,
                                           "unit": "mm"}, "writer")
    print(saved.id, flush=True)
"""

ROUNDS = 10
BUDGET_S = 25.0


def killed_child(script: str, path, rng: random.Random, rounds: int) -> list[str]:
    """Run ``script`` on the store at ``path`` in a child process, SIGKILL it at a random
    moment once it has written, and return the lines it printed in full."""
    child = subprocess.Popen(
        [sys.executable, "-c", script, str(path)],
        stdout=subprocess.PIPE,
        stderr=subprocess.PIPE,
        env=dict(os.environ, PYTHONPATH=str(ROOT)),
    )
    first = child.stdout.readline()  # the child is writing
    if not first:  # the child could not start: show why
        child.kill()
        pytest.fail(f"round {rounds}: the child gave nothing: {child.communicate()[1].decode()}")
    time.sleep(rng.uniform(0.0, 0.25))
    child.send_signal(signal.SIGKILL)
    out, _ = child.communicate()
    lines = (first + out).decode().split("\n")
    return [x for x in lines[:-1] if x]  # the last piece may be cut mid-line


@pytest.mark.skipif(not hasattr(signal, "SIGKILL"), reason="needs SIGKILL")
def test_sigkill_never_loses_a_saved_entry(tmp_path):
    path = tmp_path / "crash.asf"
    s = FieldStore.create(path, header())
    s.add_member(document()["members"][0], "setup")
    s.close()
    rng = random.Random(7)
    reported: list[str] = []
    t0 = time.monotonic()
    rounds = 0
    while rounds < 3 or (rounds < ROUNDS and time.monotonic() - t0 < BUDGET_S):
        rounds += 1
        reported += killed_child(WRITER, path, rng, rounds)
        with FieldStore.open(path) as st:  # opens only if the integrity check is ok
            ids = {r.id for r in st.to_survey().members[0].stations[0].readings}
        missing = [i for i in reported if i not in ids]
        assert missing == [], f"round {rounds}: entries reported saved but lost: {missing}"
    conn = sqlite3.connect(path)
    assert conn.execute("PRAGMA integrity_check").fetchone()[0] == "ok"
    conn.close()
    print(f"store SIGKILL: {rounds} rounds, {len(reported)} acknowledged, none lost")
    assert len(reported) >= rounds >= 3


UNDOER = """
import sys
from core.survey.store import FieldStore
store = FieldStore.open(sys.argv[1], device="tablet-K")
n = 0
while True:
    n += 1
    saved = store.add_reading("G1", "S1", {"part": "web", "value": 8.0 + (n % 7) / 10,
                                           "unit": "mm"}, "kim")
    print("add", saved.id, flush=True)
    if n % 2 == 0:
        rows = store.undo_last("kim")
        print("undo", rows[0].entity, flush=True)
"""


def check_undo_consistency(path, station: str = "S1") -> set[str]:
    """The history and the entries agree: every undone change has exactly one undo change
    that names it, and the live readings are the added ones not undone (at every station).
    Returns the ids of the live readings at ``station`` of the first member."""
    with FieldStore.open(path, device="checker") as st:
        hist = st.history()
        survey = st.to_survey()
    live = {(m.id, s.id, r.id) for m in survey.members for s in m.stations for r in s.readings}
    undone = {h.change for h in hist if h.undone}
    undos: dict[int, set[int]] = {}
    for h in hist:
        if h.action == "undo":
            undos.setdefault(h.undoes, set()).add(h.change)
    assert set(undos) == undone and all(len(v) == 1 for v in undos.values())
    added = {
        (h.member, h.station, h.entity)
        for h in hist
        if h.kind == "reading" and h.action == "add" and not h.undone
    }
    assert live == added
    first = survey.members[0].id
    return {rid for m, s, rid in live if (m, s) == (first, station)}


@pytest.mark.skipif(not hasattr(signal, "SIGKILL"), reason="needs SIGKILL")
def test_sigkill_during_undo_keeps_the_store_consistent(tmp_path):
    path = tmp_path / "undo.asf"
    s = FieldStore.create(path, header(), device="office")
    s.add_member(document()["members"][0], "setup")
    s.close()
    rng = random.Random(11)
    added: set[str] = set()
    undone: set[str] = set()
    t0, rounds = time.monotonic(), 0
    while rounds < 3 or (rounds < ROUNDS and time.monotonic() - t0 < BUDGET_S):
        rounds += 1
        for line in killed_child(UNDOER, path, rng, rounds):
            op, rid = line.split()
            (added if op == "add" else undone).add(rid)
        live = check_undo_consistency(path)
        # every acknowledged entry is there unless its undo was acknowledged; at most one
        # more (the undo cut short by the kill) may already be reverted
        assert live.isdisjoint(undone), f"round {rounds}: acknowledged undo not kept"
        assert len((added - undone) - live) <= 1, f"round {rounds}: entries lost"
        # the next round starts from what is there: an unacknowledged undo counts as done
        undone |= (added - undone) - live
    print(f"store undo SIGKILL: {rounds} rounds, {len(added)} acknowledged, {len(undone)} undone")
    assert rounds >= 3 and undone and added - undone


IMPORTER = """
import sys
from core.survey import import_survey
print("start", flush=True)
import_survey(sys.argv[1], sys.argv[2], who="office")
print("done", flush=True)
"""

#: rounds of the import kill test (ASFOUND_CRASH_ROUNDS runs a longer one by hand)
IMPORT_ROUNDS = int(os.environ.get("ASFOUND_CRASH_ROUNDS", "8"))
IMPORT_BUDGET_S = float(os.environ.get("ASFOUND_CRASH_BUDGET_S", "20"))


def _digest(path) -> str:
    import hashlib

    return hashlib.sha256(path.read_bytes()).hexdigest()


@pytest.mark.skipif(not hasattr(signal, "SIGKILL"), reason="needs SIGKILL")
def test_sigkill_during_import_leaves_the_old_store_alone_and_the_new_one_absent_or_whole(
    tmp_path,
):
    """``asfound import`` killed at a random moment while it builds a new store beside an
    existing one: the existing store keeps its bytes, the new one is absent or complete."""
    from core.survey import import_survey, load_survey

    sample = ROOT / "survey_samples" / "deck-girder-si.json"
    want = load_survey(sample)[0].document()
    old = tmp_path / "field.asf"
    import_survey(sample, old, who="field")
    old_digest = _digest(old)
    env = dict(os.environ, PYTHONPATH=str(ROOT))

    def start(new):
        child = subprocess.Popen(
            [sys.executable, "-c", IMPORTER, str(sample), str(new)],
            stdout=subprocess.PIPE,
            stderr=subprocess.PIPE,
            env=env,
        )
        if child.stdout.readline() != b"start\n":
            child.kill()
            pytest.fail(f"the importer did not start: {child.communicate()[1]!r}")
        return child

    child = start(tmp_path / "timed.asf")
    t = time.monotonic()  # how long one import takes here, now (the machine may be busy)
    assert child.communicate()[0] == b"done\n"
    took = time.monotonic() - t
    rng = random.Random(11)
    t0 = time.monotonic()
    rounds, absent, whole = 0, 0, 0
    while rounds < 3 or (rounds < IMPORT_ROUNDS and time.monotonic() - t0 < IMPORT_BUDGET_S):
        rounds += 1
        new = tmp_path / f"new-{rounds}.asf"
        child = start(new)
        time.sleep(rng.uniform(0.0, 1.25 * took))  # mostly mid-build, sometimes after
        child.send_signal(signal.SIGKILL)
        child.communicate()
        assert _digest(old) == old_digest, f"round {rounds}: the existing store changed"
        if new.exists():
            with FieldStore.open(new) as st:  # opens only if the integrity check is ok
                assert st.to_survey().document() == want, f"round {rounds}: partial store"
            whole += 1
        else:
            absent += 1
        assert not Path(f"{new}-wal").exists() or new.exists()
    with FieldStore.open(old) as st:
        assert st.to_survey().document() == want
    assert rounds == absent + whole >= 3
    left = len(list(tmp_path.glob(".new-*.tmp")))
    print(f"import kill: {rounds} rounds, {absent} absent, {whole} complete, {left} temporaries")
