"""Synthetic repeat surveys for the trend tests: a sample survey with every reading shifted.

The sample surveys are invented demo data; here they only carry a known, synthetic loss
history (every reading thicker by a known amount at an earlier date), so the trend must give
back the rate that was put in.
"""

from __future__ import annotations

import copy
import json
from pathlib import Path

from core.units import from_internal

ROOT = Path(__file__).resolve().parents[2]
SAMPLES = ROOT / "survey_samples"
SI = SAMPLES / "deck-girder-si.json"
US = SAMPLES / "through-girder-us.json"
US_EARLIER = SAMPLES / "earlier" / "through-girder-us-2019.json"


def doc(path: Path = SI) -> dict:
    return json.loads(path.read_text(encoding="utf-8"))


def shifted(base: dict, date: str, add_mm: float, ident: str | None = None) -> dict:
    """``base`` dated ``date`` with every reading ``add_mm`` thicker (mm; negative thins)."""
    d = copy.deepcopy(base)
    d["survey"]["dates"] = [date]
    d["survey"]["id"] = ident or f"{d['survey']['id']}-{date}"
    for m in d["members"]:
        for s in m["stations"]:
            for r in s["readings"]:
                r["value"] = r["value"] + from_internal(add_mm, "length", r["unit"])
    return d


def write(tmp: Path, name: str, d: dict) -> Path:
    p = tmp / name
    p.write_text(json.dumps(d, indent=1), encoding="utf-8")
    return p
