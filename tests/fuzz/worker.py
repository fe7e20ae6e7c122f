"""Run one fuzz case in a worker process, so that a hang is caught by a timeout.

A :class:`Worker` keeps one child process alive (it imports asfound once) and hands it one
case at a time over a pipe. The child runs the case's commands through the real command line
(:func:`core.cli.main`, output discarded) and answers with the outcome:

* ``ok``: every command ran; ``refused``: a command stopped with an asfound error
  (:class:`core.errors.AsfoundError`, exit status 2);
* ``crash``: any other exception (its traceback is kept);
* ``hang``: no answer within the time limit (the child is killed and a new one started).

The child's address space is capped (:data:`MEMORY_BYTES`) so that an unbounded expansion
ends as a ``MemoryError`` crash instead of filling the machine.
"""

from __future__ import annotations

import contextlib
import io
import multiprocessing as mp
import os
import tempfile
import time
import traceback
from dataclasses import dataclass, field
from pathlib import Path

#: address space of the worker process (bytes)
MEMORY_BYTES = 3 * 1024**3


@dataclass(frozen=True)
class Outcome:
    """What one case gave: its kind, the seconds it took, and the detail."""

    kind: str  # "ok", "refused", "crash" or "hang"
    seconds: float
    detail: str = ""
    exits: tuple[int, ...] = ()


@dataclass
class Tally:
    """Counts of outcomes over a fuzz run, with the slowest case's time."""

    counts: dict[str, int] = field(default_factory=dict)
    slowest: float = 0.0
    slowest_case: str = ""
    failures: list[tuple[str, str]] = field(default_factory=list)

    def add(self, out: Outcome, case: str) -> None:
        self.counts[out.kind] = self.counts.get(out.kind, 0) + 1
        if out.seconds >= self.slowest:
            self.slowest, self.slowest_case = out.seconds, case
        if out.kind in ("crash", "hang"):
            self.failures.append((case, out.detail))

    @property
    def total(self) -> int:
        return sum(self.counts.values())


def _run_commands(folder: Path, files: dict[str, bytes], commands: list[list[str]]) -> list[int]:
    from core.cli import main

    for name, data in files.items():
        (folder / name).write_bytes(data)
    exits = []
    sink = io.StringIO()
    for argv in commands:
        sink.seek(0)
        sink.truncate()
        with contextlib.redirect_stdout(sink), contextlib.redirect_stderr(sink):
            rc = main([a.replace("{dir}", str(folder)) for a in argv])
        exits.append(rc)
    return exits


def _serve(conn) -> None:
    try:
        import resource

        resource.setrlimit(resource.RLIMIT_AS, (MEMORY_BYTES, MEMORY_BYTES))
    except (ImportError, ValueError, OSError):
        pass
    import core.cli  # noqa: F401  (import once, before the first case is timed)

    conn.send("ready")
    while True:
        try:
            job = conn.recv()
        except EOFError:
            return
        files, commands = job
        t0 = time.perf_counter()
        with tempfile.TemporaryDirectory(prefix="asfound-fuzz-") as tmp:
            try:
                exits = _run_commands(Path(tmp), files, commands)
                kind = "refused" if any(rc == 2 for rc in exits) else "ok"
                conn.send(Outcome(kind, time.perf_counter() - t0, "", tuple(exits)))
            except BaseException as e:  # anything that is not asfound's own error
                detail = "".join(traceback.format_exception(e))[-4000:]
                conn.send(Outcome("crash", time.perf_counter() - t0, detail))


class Worker:
    """One child process that runs cases; restarted after a hang or a dead child."""

    def __init__(self, timeout: float) -> None:
        self.timeout = timeout
        self._ctx = mp.get_context("spawn")
        self._proc = None
        self._conn = None

    def _start(self) -> None:
        parent, child = self._ctx.Pipe()
        env_path = os.environ.get("PYTHONPATH", "")
        root = str(Path(__file__).resolve().parents[2])
        if root not in env_path.split(os.pathsep):
            os.environ["PYTHONPATH"] = os.pathsep.join(p for p in (root, env_path) if p)
        self._proc = self._ctx.Process(target=_serve, args=(child,), daemon=True)
        self._proc.start()
        child.close()
        self._conn = parent
        if not parent.poll(120) or parent.recv() != "ready":
            raise RuntimeError("the fuzz worker did not start")

    def stop(self) -> None:
        if self._proc is not None and self._proc.pid is not None:
            self._proc.kill()
            self._proc.join(10)
        if self._conn is not None:
            self._conn.close()
        self._proc = self._conn = None

    def run(self, files: dict[str, bytes], commands: list[list[str]]) -> Outcome:
        """Run ``commands`` (argument lists; ``{dir}`` is the case's folder) on ``files``."""
        if self._proc is None or not self._proc.is_alive():
            self._start()
        t0 = time.perf_counter()
        self._conn.send((files, commands))
        if not self._conn.poll(self.timeout):
            self.stop()
            return Outcome("hang", time.perf_counter() - t0, f"no answer in {self.timeout:g} s")
        try:
            return self._conn.recv()
        except EOFError:
            code = self._proc.exitcode if self._proc else None
            self.stop()
            return Outcome("crash", time.perf_counter() - t0, f"worker died (exit {code})")

    def __enter__(self) -> Worker:
        return self

    def __exit__(self, *exc: object) -> None:
        self.stop()
