"""Benchmark of the field app (run on demand: ``python -m benchmarks.bench_app``).

Runs the real app in a subprocess with SDL's offscreen driver (or the display when one is
set) and measures, as the median of repeats on this machine:
- app start to first screen: from starting the process to the first screen shown
  (target < 3 s);
- tap to updated result: from Enter on the pad (a reading typed on the current station of
  the invented deck girder sample) to core's new result handed to the screen (target
  < 100 ms); the store write and core's assessment time are shown too, and the time to the
  first frame drawn with the result (here rendered by Mesa's software GL, llvmpipe, whose
  texture uploads wait for the frame before: a tablet's GPU draws a frame in a few ms).
"""

from __future__ import annotations

import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

from benchmarks.common import table
from fieldapp.main import headless_env

ROOT = Path(__file__).resolve().parents[1]
STARTS = 5
READINGS = 25


def _run(args: list[str], env: dict) -> tuple[float, list[str]]:
    t0 = time.perf_counter()
    proc = subprocess.Popen(
        [sys.executable, "-m", "fieldapp", *args],
        env=env,
        stdout=subprocess.PIPE,
        stderr=subprocess.DEVNULL,
        text=True,
        cwd=ROOT,
    )
    lines, first = [], None
    for line in proc.stdout:
        if first is None and line.startswith("ready"):
            first = time.perf_counter() - t0
        lines.append(line.strip())
    proc.wait(timeout=120)
    if first is None:
        raise RuntimeError(f"the app did not start (exit code {proc.returncode})")
    return first, lines


def main() -> None:
    from core.survey import import_survey

    with tempfile.TemporaryDirectory(prefix="asfound-bench-app-") as t:
        tmp = Path(t)
        folder = tmp / "surveys"
        folder.mkdir()
        starts = [
            _run(["--dir", str(folder)], headless_env(tmp, ASFOUND_FIELD_EXIT="1"))[0]
            for _ in range(STARTS)
        ]
        store = folder / "deck.sqlite"
        import_survey(ROOT / "survey_samples" / "deck-girder-si.json", store)
        env = headless_env(tmp, ASFOUND_FIELD_FEED=str(READINGS), ASFOUND_FIELD_EXIT="1")
        _first, lines = _run(["--dir", str(folder), "--survey", str(store)], env)
    res = [line.split() for line in lines if line.startswith("result ")]
    total = [float(r[1]) for r in res[1:]]  # the first one also warms up caches
    drawn = [float(r[3]) for r in res[1:]]
    entry = [float(r[5]) for r in res[1:]]
    core = [float(r[7]) for r in res[1:]]
    start = statistics.median(starts)
    tap = statistics.median(total)
    rows = [
        ("app start to first screen (median of 5)", f"{start:.2f} s", "< 3 s", _met(start < 3)),
        (
            f"tap to updated result (median of {len(total)})",
            f"{tap:.0f} ms",
            "< 100 ms",
            _met(tap < 100),
        ),
        ("  of which store write (UI thread)", f"{statistics.median(entry):.0f} ms", "", ""),
        ("  of which core.assess (worker thread)", f"{statistics.median(core):.0f} ms", "", ""),
        ("tap to updated result, worst", f"{max(total):.0f} ms", "", ""),
        (
            "tap to first frame drawn with it (software GL)",
            f"{statistics.median(drawn):.0f} ms",
            "",
            "",
        ),
    ]
    print(table(rows))


def _met(ok: bool) -> str:
    return "yes" if ok else "NO"


if __name__ == "__main__":
    main()
