"""Demo data is invented and says so (the user's rule 4): every sample names its scenario as
invented, and each field that names a structure, place, owner or person is marked invented.
(Which real names were replaced is in the history; a test cannot list every real name.)"""

from __future__ import annotations

import json
from pathlib import Path

import pytest

SAMPLES = Path(__file__).resolve().parents[2] / "survey_samples"
IDENTITY = ("structure", "location", "owner_ref", "inspector")


@pytest.mark.parametrize(
    "path", sorted(SAMPLES.rglob("*.json")), ids=lambda p: str(p.relative_to(SAMPLES))
)
def test_every_sample_says_it_is_invented(path):
    doc = json.loads(path.read_text(encoding="utf-8"))
    assert "invented" in doc.get("note", "").lower()
    survey = doc.get("survey")
    if survey is None:  # a section description: its name says it
        assert "invented" in doc["name"].lower()
        return
    for key in IDENTITY:
        assert "(invented" in survey[key], (key, survey[key])
