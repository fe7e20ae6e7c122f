"""The assessment at the engine's speed (run on demand: ``python -m benchmarks.bench_speed``).

Every figure is the median of repeats on this machine, wall time, with the CPU time of the
same runs beside it (on a shared machine the CPU time says more about our code; the wall
time is what a user waits). "first" is the first call in a new process with the modules
already imported (no cache of a run before it: section definitions, unit factors, schema
validators are all built afresh); "warm" the median of later calls in one process. The
floor is the part no Python bookkeeping can remove: for a load, parsing the JSON text; for
an assessment, the section engine alone (as-built and as-found analysis of every station).

Rows: 40-station assessment (target < 50 ms); 4,000-station survey file load (< 2 s) and
assessment (< 4 s); the PDF of 40 stations (< 2 s) and of 1,000 stations (< 30 s); a folder
of 50 surveys reported with ``--jobs 2`` against ``--jobs 1`` (>= 1.8x). ``--quick`` leaves
out the rows that take minutes (4,000-station assessment, 1,000-station PDF, the folder);
``--assess`` runs the two assessment rows alone. The column "/target" is the measured time
(the worse of first and warm) over the target: below 1 meets it.
"""

from __future__ import annotations

import json
import os
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

from benchmarks.common import spread_survey

ROOT = Path(__file__).resolve().parents[1]

#: what one measurement does, in a process of its own (argv: kind, n, repeats, folder)
_CHILD = r"""
import json, sys, time
from pathlib import Path
kind, n, repeats, folder = sys.argv[1], int(sys.argv[2]), int(sys.argv[3]), Path(sys.argv[4])
src = folder / f"survey-{n}.json"
from core.assess import assess
from core.report import build_report
from core.section import analyse
from core.survey import load_survey
import core.survey.validate  # noqa: F401  (imports done before the first call is timed)

def timed(fn):
    t, c = time.perf_counter(), time.process_time()
    fn()
    return time.perf_counter() - t, time.process_time() - c

if kind == "load":
    fn = lambda: load_survey(src)
    floor = lambda: json.loads(src.read_text(encoding="utf-8"))
elif kind == "assess":
    survey, probs = load_survey(src)
    fn = lambda: assess(survey, None, tuple(probs))
    m = survey.members[0]
    def floor():
        d = m.definition()
        analyse(d)
        for st in m.stations:
            analyse(d, st.loss(m))
else:
    fn = lambda: build_report(src, folder / f"out-{n}.pdf")
    floor = None
out = {"first": timed(fn), "warm": [timed(fn) for _ in range(repeats)]}
if floor is not None:
    out["floor"] = [timed(floor) for _ in range(max(repeats, 1))]
print(json.dumps(out))
"""


def _child(kind: str, n: int, repeats: int, folder: Path) -> dict:
    env = {**os.environ, "PYTHONPATH": str(ROOT)}
    r = subprocess.run(
        [sys.executable, "-c", _CHILD, kind, str(n), str(repeats), str(folder)],
        capture_output=True,
        text=True,
        env=env,
        cwd=ROOT,
        check=True,
    )
    return json.loads(r.stdout.strip().splitlines()[-1])


def _med(pairs: list) -> tuple[float, float]:
    return statistics.median(p[0] for p in pairs), statistics.median(p[1] for p in pairs)


def _fmt(wall: float, cpu: float) -> str:
    return f"{wall:.3g} s ({cpu:.3g})" if wall >= 0.1 else f"{wall * 1e3:.3g} ms ({cpu * 1e3:.3g})"


def measure(kind: str, n: int, folder: Path, procs: int, repeats: int) -> dict:
    """First-call figures of ``procs`` new processes and the warm figures of all of them."""
    runs = [_child(kind, n, repeats, folder) for _ in range(procs)]
    first = _med([r["first"] for r in runs])
    warm = _med([w for r in runs for w in r["warm"]]) if repeats else None
    floor = _med([w for r in runs for w in r.get("floor", [])]) if "floor" in runs[0] else None
    return {"first": first, "warm": warm, "floor": floor}


def folder_speedup(folder: Path, n_surveys: int = 50) -> tuple[float, float]:
    """Wall time of ``asfound report DIR`` over ``n_surveys`` copies of the SI sample with
    ``--jobs 1`` and with ``--jobs 2`` (one run each; s)."""
    src = folder / "batch"
    src.mkdir(exist_ok=True)
    text = (ROOT / "survey_samples" / "deck-girder-si.json").read_bytes()
    for i in range(n_surveys):
        (src / f"s{i:02d}.json").write_bytes(text)
    out = []
    for jobs in (1, 2):
        t = time.perf_counter()
        subprocess.run(
            [sys.executable, "-m", "core", "report", str(src), "-o", str(folder / f"pdf{jobs}"),
             "--jobs", str(jobs)],
            capture_output=True, cwd=ROOT, env={**os.environ, "PYTHONPATH": str(ROOT)},
        )  # fmt: skip
        out.append(time.perf_counter() - t)
    return out[0], out[1]


def run(quick: bool = False, only: str | None = None) -> str:
    rows = []
    with tempfile.TemporaryDirectory() as d:
        folder = Path(d)
        for n in (40, 1000, 4000):
            (folder / f"survey-{n}.json").write_text(json.dumps(spread_survey(n)))
        plan = [
            ("assessment, 40 stations", "assess", 40, 3, 5, 0.05),
            ("survey file load, 4,000 stations", "load", 4000, 3, 2, 2.0),
            ("PDF, 40 stations (file to PDF)", "report", 40, 2, 2, 2.0),
        ]
        if not quick or only is not None:
            plan += [
                ("assessment, 4,000 stations", "assess", 4000, 1, 0, 4.0),
                ("PDF, 1,000 stations (file to PDF)", "report", 1000, 1, 0, 30.0),
            ]
        if only is not None:
            plan = [p for p in plan if p[1] == only]
        for what, kind, n, procs, repeats, target in plan:
            r = measure(kind, n, folder, procs, repeats)
            first, warm, floor = r["first"], r["warm"], r["floor"]
            best = warm or first
            ratio = f"{best[0] / floor[0]:.0f}x" if floor else "-"
            rows.append(
                (
                    what,
                    _fmt(*first),
                    _fmt(*warm) if warm else "-",
                    _fmt(*floor) if floor else "-",
                    ratio,
                    f"< {target:g} s",
                    f"{max(first[0], best[0]) / target:.2f}",
                    "yes" if first[0] < target and best[0] < target else "no",
                )
            )
        if not quick and only is None:
            one, two = folder_speedup(folder)
            rows.append(
                (
                    "folder of 50 surveys, --jobs 2 vs --jobs 1",
                    f"{one:.1f} s / {two:.1f} s",
                    "-",
                    "-",
                    f"{one / two:.2f}x",
                    ">= 1.8x",
                    f"{1.8 / (one / two):.2f}",
                    "yes" if one / two >= 1.8 else "no",
                )
            )
    head = (
        "what",
        "first (cpu)",
        "warm (cpu)",
        "floor (cpu)",
        "/floor",
        "target",
        "/target",
        "met",
    )
    w = [max(len(str(r[i])) for r in [head, *rows]) for i in range(len(head))]
    lines = ["  ".join(str(c).ljust(w[i]) for i, c in enumerate(r)).rstrip() for r in [head, *rows]]
    lines.insert(1, "  ".join("-" * x for x in w))
    load = os.getloadavg()
    lines.append(
        f"machine: {os.cpu_count()} cores, load average {load[0]:.2f} {load[1]:.2f} {load[2]:.2f}"
    )
    return "\n".join(lines)


if __name__ == "__main__":
    print(run(quick="--quick" in sys.argv, only="assess" if "--assess" in sys.argv else None))
