"""Benchmark of a whole assessment (run on demand: ``python -m benchmarks.bench_assess``):
one 40-station member, both states, all checks (target < 0.5 s median)."""

from __future__ import annotations

import copy
import json
from pathlib import Path

from benchmarks.common import median_seconds, table
from core.assess import assess
from core.survey.model import Survey

SAMPLE = Path(__file__).resolve().parents[1] / "survey_samples" / "deck-girder-si.json"


def forty_stations() -> Survey:
    """The invented SI sample's first member with its stations repeated to 40, spread along
    the span."""
    doc = json.loads(SAMPLE.read_text(encoding="utf-8"))
    m = doc["members"][0]
    doc["members"] = [m]
    span = m["span"]["value"]
    base = m["stations"]
    out = []
    for k in range(40):
        s = copy.deepcopy(base[k % len(base)])
        s["id"] = f"S{k + 1:02d}"
        s["position"] = round(span * (k + 0.5) / 40, 4)
        out.append(s)
    m["stations"] = out
    return Survey.model_validate(doc)


def run() -> str:
    s = forty_stations()
    assert len(s.members[0].stations) == 40
    t = median_seconds(lambda: assess(s), repeat=7, min_time=0.2)
    return table(
        [
            (
                "whole assessment, 40 stations, both states, all checks",
                f"{t:.3f} s",
                "< 0.5 s",
                "yes" if t < 0.5 else "no",
            )
        ]
    )


if __name__ == "__main__":
    print(run())
