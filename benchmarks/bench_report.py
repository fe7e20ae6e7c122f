"""Benchmark of the condition report (run on demand: ``python -m benchmarks.bench_report``).

Measures, as the median of repeats on this machine, the PDF of one member with 40 stations
(with drawings of the governing stations, the rivet line map and every table): the time from
the survey file to the written PDF (target < 5 s) and the size of the PDF (target < 5 MB).
The 40-station survey is built from the invented SI sample: its member's stations are copied
and spread along the span.
"""

from __future__ import annotations

import json
import tempfile
from pathlib import Path

from benchmarks.common import median_seconds, spread_survey, table
from core.report import build_report

SAMPLE = Path(__file__).resolve().parents[1] / "survey_samples" / "deck-girder-si.json"


def survey_40_stations(path: Path, n: int = 40) -> Path:
    """The SI sample with its member's stations copied to ``n`` stations spread evenly
    along the span (:func:`benchmarks.common.spread_survey`), written to ``path``."""
    path.write_text(json.dumps(spread_survey(n, SAMPLE)), encoding="utf-8")
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
