"""Timing helpers for the benchmarks: median of repeats, printed as a table."""

from __future__ import annotations

import statistics
import time
from collections.abc import Callable


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
