"""A killed app loses nothing it acknowledged: the app runs in its own process (offscreen),
enters readings through the pad's path (test hook), and is killed with SIGKILL mid-way; and
the same while it undoes every second reading through its own Undo (question and answer)."""

from __future__ import annotations

import os
import random
import signal
import subprocess
import sys
import time

import pytest

from core.survey import FieldStore, import_survey
from fieldapp.main import headless_env
from tests.app.conftest import ROOT, SAMPLES
from tests.survey.test_crash import check_undo_consistency

pytestmark = pytest.mark.gui

ROUNDS = 3
BUDGET_S = 40.0


def run_app(tmp_path, store, lines_wanted, **env):
    """Start the app on ``store``, read its lines until enough are acknowledged, SIGKILL."""
    proc = subprocess.Popen(
        [sys.executable, "-m", "fieldapp", "--dir", str(store.parent), "--survey", str(store)],
        env=headless_env(tmp_path, **env),
        stdout=subprocess.PIPE,
        stderr=subprocess.DEVNULL,
        text=True,
        cwd=ROOT,
    )
    out: list[str] = []
    end = time.monotonic() + 40
    try:
        for line in proc.stdout:
            out.append(line.strip())
            if sum(x.startswith("ack ") for x in out) >= lines_wanted or time.monotonic() > end:
                break
    finally:
        os.kill(proc.pid, signal.SIGKILL)
        proc.wait(timeout=10)
    assert proc.returncode == -signal.SIGKILL
    return out


def live(store):
    with FieldStore.open(store, device="checker") as s:
        return {r.id for r in s.station("G1", "S1").readings}


def test_sigkill_mid_entry_keeps_every_acknowledged_reading(tmp_path):
    store = tmp_path / "surveys" / "deck.sqlite"
    store.parent.mkdir()
    import_survey(SAMPLES / "deck-girder-si.json", store)
    before = live(store)
    out = run_app(tmp_path, store, 6, ASFOUND_FIELD_FEED="200")
    acked = [x.split()[1] for x in out if x.startswith("ack ")]
    assert len(acked) >= 6, "the app did not acknowledge readings in time"
    after = live(store)
    assert set(acked) <= after
    assert set(acked).isdisjoint(before) and before <= after


def test_sigkill_during_the_apps_undo_keeps_the_store_consistent(tmp_path):
    store = tmp_path / "surveys" / "deck.sqlite"
    store.parent.mkdir()
    import_survey(SAMPLES / "deck-girder-si.json", store)
    before = live(store)
    rng = random.Random(5)
    acked: set[str] = set()
    undone: set[str] = set()
    t0, rounds = time.monotonic(), 0
    while rounds < 2 or (rounds < ROUNDS and time.monotonic() - t0 < BUDGET_S):
        rounds += 1
        want = rng.randint(3, 9)  # the kill lands anywhere in the entry, undo, entry cycle
        out = run_app(tmp_path, store, want, ASFOUND_FIELD_FEED="200", ASFOUND_FIELD_UNDO="1")
        acked |= {x.split()[1] for x in out if x.startswith("ack ")}
        undone |= {x.split()[1] for x in out if x.startswith("undone ")}
        now = check_undo_consistency(store)  # history and entries agree
        assert before <= now, f"round {rounds}: an entry of the sample was lost"
        assert now.isdisjoint(undone), f"round {rounds}: an acknowledged undo was lost"
        # every acknowledged entry is there unless undone; at most the one undo that the
        # kill cut short (stored but not yet acknowledged) may have reverted one more
        missing = (acked - undone) - now
        assert len(missing) <= 1, f"round {rounds}: acknowledged entries lost: {missing}"
        undone |= missing
    print(f"app undo SIGKILL: {rounds} rounds, {len(acked)} acknowledged, {len(undone)} undone")
    assert undone, "the app never undid a reading"
    assert acked - undone, "no acknowledged reading was left"
