"""Every input path is fuzzed: any file gives a result or an asfound error, within a time limit.

Mutated sample surveys (validate, assess, report), mutated and random section descriptions
(``asfound section``) and damaged field stores (validate, assess, report, export) run case by
case in a worker process (:mod:`tests.fuzz.worker`): a case passes when every command ends
with its result or with an :class:`core.errors.AsfoundError` (exit status 2); any other
exception is a crash, and no answer within :data:`tests.fuzz.cases.CASE_LIMIT_S` a hang.

The suite runs a fixed (derandomized) set of cases in well under a minute; ``pytest -m slow``
runs a longer random one; ``python -m tests.fuzz.run --cases N`` prints the figures of a run
of any length. A property that must hold (common practice, no source): asfound never fails
with an error that is not its own, and never works without bound.
"""

from __future__ import annotations

import os

import pytest
from hypothesis import HealthCheck, Phase, given, settings

from tests.fuzz.cases import CASE_LIMIT_S, describe, job, strategy
from tests.fuzz.worker import Worker

#: cases per kind in the suite, and in the slow run
QUICK = {"survey": 16, "section": 100, "store": 6}
LONG = {"survey": 400, "section": 1500, "store": 150}


@pytest.fixture(scope="module")
def worker():
    with Worker(CASE_LIMIT_S) as w:
        yield w


def _check(worker: Worker, case: tuple) -> None:
    files, commands = job(case)
    out = worker.run(files, commands)
    assert out.kind in ("ok", "refused"), (
        f"{out.kind} after {out.seconds:.1f} s (limit {CASE_LIMIT_S:g} s) on\n"
        f"{describe(case)}\n{out.detail}"
    )


def _fuzz(kind: str, n: int, quick: bool):
    @settings(
        max_examples=n,
        deadline=None,
        derandomize=quick,
        database=None,
        phases=(Phase.explicit, Phase.generate),
        suppress_health_check=list(HealthCheck),
    )
    @given(case=strategy(kind))
    def run(worker, case):
        _check(worker, case)

    return run


test_survey_files_give_a_result_or_an_asfound_error = _fuzz("survey", QUICK["survey"], True)
test_section_files_give_a_result_or_an_asfound_error = _fuzz("section", QUICK["section"], True)
test_field_stores_give_a_result_or_an_asfound_error = _fuzz("store", QUICK["store"], True)

test_long_survey_fuzz = pytest.mark.slow(_fuzz("survey", LONG["survey"], False))
test_long_section_fuzz = pytest.mark.slow(_fuzz("section", LONG["section"], False))
test_long_store_fuzz = pytest.mark.slow(_fuzz("store", LONG["store"], False))


@pytest.mark.skipif(not hasattr(os, "mkfifo"), reason="needs named pipes")
def test_worker_reports_a_hang_and_recovers(tmp_path):
    """The harness itself: a case that never ends (reading a named pipe nobody writes to)
    is reported as a hang within the limit, and the next case runs in a new worker."""
    fifo = tmp_path / "never.json"
    os.mkfifo(fifo)
    with Worker(timeout=3.0) as w:
        out = w.run({}, [["validate", str(fifo)]])
        assert out.kind == "hang" and 3.0 <= out.seconds < 20.0
        w.timeout = (
            60.0  # the new worker's first case loads the schema: no race with a busy machine
        )
        out = w.run({"in.json": b"{}"}, [["validate", "{dir}/in.json"]])
        assert (out.kind, out.exits) == ("ok", (1,))  # not a survey: listed, exit 1
