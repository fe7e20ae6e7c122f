"""Benchmark of the condition report (run on demand: ``python -m benchmarks.bench_report``).

Measures, as the median of repeats on this machine, the PDF of one member with 40 stations
(with drawings of the governing stations, the rivet line map and every table): the time from
the survey file to the written PDF (target < 5 s) and the size of the PDF (target < 5 MB).
The 40-station survey is built from the invented SI sample: its member's stations are copied
and spread along the span.
"""

from __future__ import annotations

import copy
import json
import tempfile
from pathlib import Path

from benchmarks.common import median_seconds, table
from core.report import build_report

SAMPLE = Path(__file__).resolve().parents[1] / "survey_samples" / "deck-girder-si.json"


def survey_40_stations(path: Path, n: int = 40) -> Path:
    """The SI sample with its first member's stations copied to ``n`` stations spread evenly
    along the span (positions in the sample's position unit, metres)."""
    doc = json.loads(SAMPLE.read_text(encoding="utf-8"))
    m = doc["members"][0]
    span = float(m["span"]["value"])
    base = m["stations"]
    out = []
    for i in range(n):
        st = copy.deepcopy(base[i % len(base)])
        st["id"] = f"S{i + 1:02d}"
        st["position"] = round(span * (i + 0.5) / n, 3)
        out.append(st)
    m["stations"] = out
    path.write_text(json.dumps(doc), encoding="utf-8")
    return path


def run() -> str:
    with tempfile.TemporaryDirectory() as d:
        src = survey_40_stations(Path(d) / "forty.json")
        pdf = Path(d) / "forty.pdf"
        rep = build_report(src, pdf)
        t = median_seconds(lambda: build_report(src, pdf), repeat=3, min_time=0.0)
        size = pdf.stat().st_size / 1e6
    rows = [
        (
            f"PDF, 1 member x 40 stations, {rep.pages} pages (survey file to PDF)",
            f"{t:.2f} s",
            "< 5 s",
            "yes" if t < 5 else "no",
        ),
        ("size of that PDF", f"{size:.2f} MB", "< 5 MB", "yes" if size < 5 else "no"),
    ]
    return table(rows)


if __name__ == "__main__":
    print(run())
