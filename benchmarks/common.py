"""Timing helpers for the benchmarks: median of repeats, printed as a table."""

from __future__ import annotations

import copy
import json
import statistics
import time
from collections.abc import Callable
from pathlib import Path


def median_seconds(fn: Callable[[], object], *, repeat: int = 15, min_time: float = 0.05) -> float:
    """Median wall time of one call of ``fn`` (s), over ``repeat`` batches of calls."""
    fn()
    n = 1
    while True:
        t = time.perf_counter()
        for _ in range(n):
            fn()
        if time.perf_counter() - t >= min_time or n >= 1 << 16:
            break
        n *= 2
    samples = []
    for _ in range(repeat):
        t = time.perf_counter()
        for _ in range(n):
            fn()
        samples.append((time.perf_counter() - t) / n)
    return statistics.median(samples)


def table(rows: list[tuple[str, str, str, str]]) -> str:
    """Rows of (what, measured, target, verdict) as a plain table."""
    head = ("what", "measured", "target", "met")
    w = [max(len(r[i]) for r in [head, *rows]) for i in range(4)]
    line = lambda r: "  ".join(c.ljust(w[i]) for i, c in enumerate(r)).rstrip()  # noqa: E731
    return "\n".join([line(head), "  ".join("-" * x for x in w), *map(line, rows)])


SAMPLE = Path(__file__).resolve().parents[1] / "survey_samples" / "deck-girder-si.json"


def spread_survey(n: int, sample: Path = SAMPLE) -> dict:
    """The sample survey document with its first member's stations copied to ``n`` stations
    spread evenly along the span (ids S0001...; positions in the sample's position unit)."""
    doc = json.loads(sample.read_text(encoding="utf-8"))
    m = doc["members"][0]
    doc["members"] = [m]
    span = float(m["span"]["value"])
    base = m["stations"]
    out = []
    for i in range(n):
        st = copy.deepcopy(base[i % len(base)])
        st["id"] = f"S{i + 1:04d}"
        st["position"] = round(span * (i + 0.5) / n, 4)
        out.append(st)
    m["stations"] = out
    return doc
