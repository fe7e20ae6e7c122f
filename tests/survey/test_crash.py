"""Crash safety for real: a writer process killed with SIGKILL loses no saved entry."""

from __future__ import annotations

import os
import random
import signal
import sqlite3
import subprocess
import sys
import time

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


@pytest.mark.skipif(not hasattr(signal, "SIGKILL"), reason="needs SIGKILL")
def test_sigkill_never_loses_a_saved_entry(tmp_path):
    path = tmp_path / "crash.asf"
    s = FieldStore.create(path, header())
    s.add_member(document()["members"][0], "setup")
    s.close()
    rng = random.Random(7)
    reported: list[str] = []
    env = dict(os.environ, PYTHONPATH=str(ROOT))
    t0 = time.monotonic()
    rounds = 0
    while rounds < 3 or (rounds < ROUNDS and time.monotonic() - t0 < BUDGET_S):
        rounds += 1
        child = subprocess.Popen(
            [sys.executable, "-c", WRITER, str(path)],
            stdout=subprocess.PIPE,
            stderr=subprocess.PIPE,
            env=env,
        )
        first = child.stdout.readline()  # the child is writing
        if not first:  # the writer could not start: show why
            child.kill()
            pytest.fail(f"round {rounds}: writer gave no entry: {child.communicate()[1].decode()}")
        time.sleep(rng.uniform(0.0, 0.25))
        child.send_signal(signal.SIGKILL)
        out, _ = child.communicate()
        lines = (first + out).decode().split("\n")
        done = [x for x in lines[:-1] if x]  # the last piece may be cut mid-line
        reported += done
        with FieldStore.open(path) as st:  # opens only if the integrity check is ok
            ids = {r.id for r in st.to_survey().members[0].stations[0].readings}
        missing = [i for i in reported if i not in ids]
        assert missing == [], f"round {rounds}: entries reported saved but lost: {missing}"
    conn = sqlite3.connect(path)
    assert conn.execute("PRAGMA integrity_check").fetchone()[0] == "ok"
    conn.close()
    assert len(reported) >= rounds >= 3
