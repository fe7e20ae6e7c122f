"""Small builders shared by the survey tests (invented values only)."""

from __future__ import annotations

import copy
import json
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
SAMPLES = ROOT / "survey_samples"
SI_SAMPLE = SAMPLES / "deck-girder-si.json"
US_SAMPLE = SAMPLES / "through-girder-us.json"
MISTAKES = SAMPLES / "mistakes.json"

#: a riveted girder in mm: web 1200 x 10 from y = 0, angles 150x150x12, one cover each flange
GIRDER = {
    "girder": {
        "D": 1200,
        "tw": 10,
        "angle_h": 150,
        "angle_v": 150,
        "angle_t": 12,
        "covers_top": [[360, 12]],
        "rivet_d": 22,
        "pitch_web": 100,
        "pitch_cover": 100,
    },
    "parts": [],
    "rivet_lines": [],
}


def header(**kw) -> dict:
    h = {"id": "T-1", "title": "test survey (invented)", "year_built": 1912}
    h.update(kw)
    return h


def member(**kw) -> dict:
    m = {"id": "G1", "span": {"value": 12.0, "unit": "m"}, "section": copy.deepcopy(GIRDER)}
    m.update(kw)
    return m


def reading(rid: str, value, part: str = "web", unit: str = "mm", region=None) -> dict:
    return {"id": rid, "part": part, "region": region, "value": value, "unit": unit}


def document(stations: list[dict] | None = None, **member_kw) -> dict:
    """A small valid survey document with one member."""
    m = member(**member_kw)
    m["stations"] = (
        stations
        if stations is not None
        else [
            {
                "id": "S1",
                "position": 0.3,
                "readings": [reading("r1", 8.1), reading("r2", 8.4), reading("r3", 7.9)],
            }
        ]
    )
    return {"format": "asfound.survey", "version": 1, "survey": header(), "members": [m]}


def write(path: Path, doc) -> Path:
    path.write_text(json.dumps(doc), encoding="utf-8")
    return path
