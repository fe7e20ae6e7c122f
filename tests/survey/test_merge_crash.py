"""A merge killed with SIGKILL at a random moment: the output is absent or complete, and
the inputs keep their bytes (the style of the import kill test in ``test_crash``)."""

from __future__ import annotations

import hashlib
import os
import random
import signal
import subprocess
import sys
import time

import pytest

from core.survey.merge import merge_stores
from core.survey.store import FieldStore

from .helpers import ROOT
from .merge_helpers import DEVICES, common_start, dump

MERGER = """
import sys
from core.survey.merge import merge_stores
print("start", flush=True)
merge_stores(sys.argv[1], sys.argv[2], sys.argv[3], device="office")
print("done", flush=True)
"""

#: rounds of the kill test (ASFOUND_CRASH_ROUNDS runs a longer one by hand)
ROUNDS = int(os.environ.get("ASFOUND_CRASH_ROUNDS", "5"))
BUDGET_S = float(os.environ.get("ASFOUND_CRASH_BUDGET_S", "10"))


def _digest(path) -> str:
    return hashlib.sha256(path.read_bytes()).hexdigest()


def _inputs(tmp_path):
    a, b = common_start(tmp_path)
    for path, dev, who in ((a, DEVICES[0], "ann"), (b, DEVICES[1], "bob")):
        with FieldStore.open(path, device=dev) as s, s.batch(who):
            for i in range(100):
                s.add_reading(
                    "G1", "S1", {"part": "web", "value": 7 + i % 20 / 10, "unit": "mm"}, who
                )
        with FieldStore.open(path, device=dev) as s:
            s.update_reading("G1", "S1", "r1", {"value": 8.0 if who == "ann" else 8.2}, who)
    return a, b


@pytest.mark.skipif(not hasattr(signal, "SIGKILL"), reason="needs SIGKILL")
def test_sigkill_during_merge_leaves_the_output_absent_or_whole_and_the_inputs_alone(tmp_path):
    a, b = _inputs(tmp_path)
    digests = (_digest(a), _digest(b))
    want = dump(merge_stores(a, b, tmp_path / "reference.asf", device="office").output)[:2]
    env = dict(os.environ, PYTHONPATH=str(ROOT))

    def start(out):
        child = subprocess.Popen(
            [sys.executable, "-c", MERGER, str(a), str(b), str(out)],
            stdout=subprocess.PIPE,
            stderr=subprocess.PIPE,
            env=env,
        )
        if child.stdout.readline() != b"start\n":
            child.kill()
            pytest.fail(f"the merge did not start: {child.communicate()[1]!r}")
        return child

    child = start(tmp_path / "timed.asf")
    t = time.monotonic()  # how long one merge takes here, now (the machine may be busy)
    assert child.communicate()[0] == b"done\n"
    took = time.monotonic() - t
    rng = random.Random(17)
    t0 = time.monotonic()
    rounds, absent, whole = 0, 0, 0
    while rounds < 3 or (rounds < ROUNDS and time.monotonic() - t0 < BUDGET_S):
        rounds += 1
        out = tmp_path / f"merged-{rounds}.asf"
        child = start(out)
        time.sleep(rng.uniform(0.0, 1.25 * took))  # mostly mid-merge, sometimes after
        child.send_signal(signal.SIGKILL)
        child.communicate()
        assert (_digest(a), _digest(b)) == digests, f"round {rounds}: an input changed"
        if out.exists():
            assert dump(out)[:2] == want, f"round {rounds}: a partial merge"
            with FieldStore.open(out) as st:  # opens only if the integrity check is ok
                st.to_survey()
            whole += 1
        else:
            absent += 1
    assert rounds == absent + whole >= 3
    # a later merge still works on the same inputs
    assert dump(merge_stores(a, b, tmp_path / "after.asf").output)[:2][0] == want[0]
    left = len(list(tmp_path.glob(".merged-*.tmp")))
    print(f"merge kill: {rounds} rounds, {absent} absent, {whole} complete, {left} temporaries")
