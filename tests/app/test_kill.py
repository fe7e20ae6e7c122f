"""A killed app loses nothing it acknowledged: the app runs in its own process (offscreen),
enters readings through the pad's path (test hook), and is killed with SIGKILL mid-way."""

from __future__ import annotations

import os
import signal
import subprocess
import sys
import time

import pytest

from core.survey import FieldStore, import_survey
from fieldapp.main import headless_env
from tests.app.conftest import ROOT, SAMPLES

pytestmark = pytest.mark.gui


def test_sigkill_mid_entry_keeps_every_acknowledged_reading(tmp_path):
    store = tmp_path / "surveys" / "deck.sqlite"
    store.parent.mkdir()
    import_survey(SAMPLES / "deck-girder-si.json", store)
    with FieldStore.open(store) as s:
        before = {r.id for r in s.station("G1", "S1").readings}
    proc = subprocess.Popen(
        [sys.executable, "-m", "fieldapp", "--dir", str(store.parent), "--survey", str(store)],
        env=headless_env(tmp_path, ASFOUND_FIELD_FEED="200"),
        stdout=subprocess.PIPE,
        stderr=subprocess.DEVNULL,
        text=True,
        cwd=ROOT,
    )
    acked: list[str] = []
    end = time.monotonic() + 40
    try:
        for line in proc.stdout:
            if line.startswith("ack "):
                acked.append(line.split()[1])
            if len(acked) >= 6 or time.monotonic() > end:
                break
    finally:
        os.kill(proc.pid, signal.SIGKILL)
        proc.wait(timeout=10)
    assert proc.returncode == -signal.SIGKILL
    assert len(acked) >= 6, "the app did not acknowledge readings in time"
    with FieldStore.open(store) as s:
        after = {r.id for r in s.station("G1", "S1").readings}
    assert set(acked) <= after
    assert set(acked).isdisjoint(before)
