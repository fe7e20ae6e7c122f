"""``asfound report DIR`` in worker processes: the order of the summary lines, a worker
that dies or raises, and the default number of workers (the cores this process may use).

The surveys here are not reported: :func:`core.cmd_report.report_one` is replaced by a
stand-in (inherited by the forked workers) that says which process ran it, dies, raises
or waits, so each test checks the pool's handling alone and runs in a second or two.
Properties that must hold, common practice, no source.
"""

from __future__ import annotations

import os
import time

import pytest

import core.cmd_report as cmd
from core.cli import main

#: made by the survey named *-last when it ends (a dot file: never taken for a survey)
MARKER = ".z-ended"


def _stand_in(f, out, units, args):
    """What a worker does with the survey ``f``, by the last word of its name: -dies exits
    the process at once, -raises raises SystemExit out of the worker, -slow waits until
    -last has ended (and half a second more, so that the result of -last is on its way to
    the parent first), -brief takes a tenth of a second, the others end at once. Returns
    ("ok", the worker's process id)."""
    word = f.stem.rsplit("-", 1)[-1]
    if word == "dies":
        os._exit(3)
    if word == "raises":
        raise SystemExit(5)
    if word == "slow":
        deadline = time.monotonic() + 60
        while not (f.parent / MARKER).exists() and time.monotonic() < deadline:
            time.sleep(0.01)
        time.sleep(0.5)
    if word == "brief":
        time.sleep(0.1)  # long enough for the parent to see a death among them
    if word == "last":
        (f.parent / MARKER).touch()
    return "ok", f"pid {os.getpid()}"


def _folder(tmp_path, names):
    src = tmp_path / "in"
    src.mkdir()
    for name in names:
        (src / name).write_text("{}", encoding="utf-8")
    return src


def _said(out: str) -> list[str]:
    """The survey named by each summary line, in the order printed."""
    return [line.split()[1].rstrip(":") for line in out.splitlines() if not line.startswith(" ")]


def test_summary_lines_come_in_the_folders_order(tmp_path, capsys, monkeypatch):
    """The first survey ends last (it waits for the last one), yet its line comes first;
    the bar still counts every survey."""
    monkeypatch.setattr(cmd, "report_one", _stand_in)
    names = ["a-slow.json", "b.json", "c.json", "z-last.json"]
    src = _folder(tmp_path, names)
    assert main(["report", str(src), "-o", str(tmp_path / "out"), "--jobs", "2"]) == 0
    cap = capsys.readouterr()
    assert _said(cap.out) == names
    assert "[4/4]" in cap.err


def test_a_dead_worker_fails_its_survey_and_the_rest_go_on_side_by_side(
    tmp_path, capsys, monkeypatch
):
    """A worker that dies (os._exit) fails only its survey, with a clear line; only the
    surveys in hand when it died are tried again alone (each in a pool of one); every
    other survey is still reported side by side in a pool of two (the first, or a new one
    when the death was seen before they ended)."""
    monkeypatch.setattr(cmd, "report_one", _stand_in)
    sizes = []
    real_pool = cmd._pool

    def counted(jobs):
        sizes.append(jobs)
        return real_pool(jobs)

    monkeypatch.setattr(cmd, "_pool", counted)
    names = ["b-dies.json"] + [f"s{i}-brief.json" for i in range(8)]
    src = _folder(tmp_path, names)
    assert main(["report", str(src), "-o", str(tmp_path / "out"), "--jobs", "2"]) == 1
    cap = capsys.readouterr()
    assert _said(cap.out) == names
    assert "FAILED  b-dies.json: the worker process reporting it stopped" in cap.out
    assert cap.out.count("ok      s") == 8
    assert "1 of 9 survey(s) failed: b-dies.json" in cap.err
    # the suspects alone (at most the two in hand), never the rest of the folder one by one
    assert sizes[0] == 2 and sizes.count(1) <= 2, sizes


def test_an_error_raised_out_of_a_worker_fails_only_its_survey(tmp_path, capsys, monkeypatch):
    """SystemExit raised in a worker (not an Exception, so not the survey's own error)
    comes back to the parent through its future: it fails that survey, not the run."""
    monkeypatch.setattr(cmd, "report_one", _stand_in)
    names = ["a.json", "b-raises.json", "c.json"]
    src = _folder(tmp_path, names)
    assert main(["report", str(src), "-o", str(tmp_path / "out"), "--jobs", "2"]) == 1
    cap = capsys.readouterr()
    assert _said(cap.out) == names
    assert "FAILED  b-raises.json: the worker process reporting it failed (SystemExit" in cap.out
    assert "1 of 3 survey(s) failed: b-raises.json" in cap.err


def _no_process_cpu_count(monkeypatch):
    monkeypatch.delattr(os, "process_cpu_count", raising=False)


def test_the_default_job_count_follows_cpu_affinity(monkeypatch):
    """The default is the number of cores this process may run on (a scheduler, a
    container or taskset may give it fewer than the machine has)."""
    _no_process_cpu_count(monkeypatch)
    monkeypatch.setattr(os, "cpu_count", lambda: 8)
    monkeypatch.setattr(os, "sched_getaffinity", lambda pid: {0, 3, 5}, raising=False)
    assert cmd.default_jobs() == 3
    monkeypatch.setattr(os, "process_cpu_count", lambda: 2, raising=False)  # Python 3.13+
    assert cmd.default_jobs() == 2
    _no_process_cpu_count(monkeypatch)
    monkeypatch.delattr(os, "sched_getaffinity", raising=False)  # not on this system
    assert cmd.default_jobs() == 8
    monkeypatch.setattr(os, "cpu_count", lambda: None)  # the machine cannot tell
    assert cmd.default_jobs() == 1


@pytest.mark.parametrize(("cores", "jobs"), [({0}, None), ({0, 1, 2}, 3)])
def test_a_folder_run_uses_the_cores_it_may_run_on(tmp_path, capsys, monkeypatch, cores, jobs):
    """With one core allowed of eight the folder is reported in this process (no pool);
    with three, in a pool of three."""
    _no_process_cpu_count(monkeypatch)
    monkeypatch.setattr(os, "cpu_count", lambda: 8)
    monkeypatch.setattr(os, "sched_getaffinity", lambda pid: cores, raising=False)
    monkeypatch.setattr(cmd, "report_one", _stand_in)
    pools = []

    def in_pool(files, outs, units, args, n, bar, voice):
        pools.append(n)
        return {f: ("ok", "") for f in files}

    monkeypatch.setattr(cmd, "_in_pool", in_pool)
    src = _folder(tmp_path, [f"s{i}.json" for i in range(5)])
    assert main(["report", str(src), "-o", str(tmp_path / "out")]) == 0
    assert pools == ([] if jobs is None else [jobs])
    capsys.readouterr()


@pytest.mark.parametrize(
    ("bad", "why"),
    [("0", "outside the allowed range (1 to 256)"), ("x", "not a whole number"), ("1e3", "")],
)
def test_jobs_is_checked_with_a_clear_error(capsys, bad, why):
    with pytest.raises(SystemExit) as e:
        main(["report", "anything", "--jobs", bad])
    assert e.value.code == 2
    err = capsys.readouterr().err
    assert "argument --jobs" in err and bad in err and why in err
