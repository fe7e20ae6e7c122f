"""Benchmark of the capacity bands (run on demand: ``python -m benchmarks.bench_bands``):
one 40-station member of the invented SI sample, the assessment and the first-order bands of
every station and limit state (one thinning run of the engine per part region read), target
< 1 s median (issue 16); the engine evaluations counted. The Monte Carlo option is timed
once on the same member for comparison (no target)."""

from __future__ import annotations

import time

from benchmarks.common import median_seconds, spread_survey, table
from core.assess import assess
from core.bands import BandOptions, assess_with_bands
from core.survey.model import Survey


def run() -> str:
    s = Survey.model_validate(spread_survey(40))
    assert len(s.members[0].stations) == 40
    _, b = assess_with_bands(s)
    regions = sum(len(x.sigmas) for x in b.members[0].stations)
    t_plain = median_seconds(lambda: assess(s), repeat=5, min_time=0.2)
    t = median_seconds(lambda: assess_with_bands(s), repeat=5, min_time=0.2)
    cpu = []
    for _ in range(5):
        c0 = time.process_time()
        assess_with_bands(s)
        cpu.append(time.process_time() - c0)
    t_cpu = sorted(cpu)[len(cpu) // 2]
    mc = BandOptions(method="monte_carlo", samples=100)
    t0 = time.perf_counter()
    _, bm = assess_with_bands(s, band_opts=mc)
    t_mc = time.perf_counter() - t0
    rows = [
        ("assessment alone, 40 stations (for reference)", f"{t_plain:.3f} s", "-", "-"),
        (
            f"assessment + first-order bands, 40 stations ({b.runs} engine evaluations: one "
            f"per region read, {regions} regions; the assessment's 40 runs reused)",
            f"{t:.3f} s",
            "< 1 s",
            "yes" if t < 1.0 else "no",
        ),
        (
            "the same, CPU time of this process (less sensitive to the other load)",
            f"{t_cpu:.3f} s",
            "< 1 s",
            "yes" if t_cpu < 1.0 else "no",
        ),
        (
            "bands alone (difference), per engine evaluation",
            f"{(t - t_plain) / max(b.runs, 1) * 1e3:.2f} ms",
            "-",
            "-",
        ),
        (
            f"assessment + Monte Carlo, {mc.samples} draws per station ({bm.runs} evaluations, once)",
            f"{t_mc:.2f} s",
            "-",
            "-",
        ),
    ]
    return table(rows)


if __name__ == "__main__":
    print(run())
