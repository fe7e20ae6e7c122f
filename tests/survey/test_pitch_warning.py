"""A recorded rivet pitch that disagrees with the drawing's pitch is pointed out
(common practice, no source: the two should agree within the recording precision)."""

from __future__ import annotations

import json
from pathlib import Path

from core.survey import check_document

SAMPLE = Path(__file__).resolve().parents[2] / "survey_samples" / "through-girder-us.json"


def test_pitch_mismatch_is_a_warning() -> None:
    doc = json.loads(SAMPLE.read_text(encoding="utf-8"))
    _, clean = check_document(doc)
    assert not [p for p in clean if "pitch" in p.message]
    doc["members"][0]["section"]["girder"]["pitch_web"] = 4
    _, probs = check_document(doc)
    hits = [p for p in probs if "recorded rivet pitch" in p.message]
    assert {p.level for p in hits} == {"warning"}
    assert any("rivet line 'web_top'" in p.where for p in hits)
    assert "0.5 ft (152.4 mm) differs from the drawing's pitch 101.6 mm" in hits[0].message
