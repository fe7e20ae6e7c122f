"""Survey builders for the assessment tests (from the invented sample surveys)."""

from __future__ import annotations

import copy
import json
from pathlib import Path

from core.survey.model import Survey

SAMPLES = Path(__file__).resolve().parents[2] / "survey_samples"


def sample_doc(name: str = "deck-girder-si.json") -> dict:
    return json.loads((SAMPLES / name).read_text(encoding="utf-8"))


def survey(doc: dict) -> Survey:
    return Survey.model_validate(copy.deepcopy(doc))


def without_loss(doc: dict) -> dict:
    """The same survey with no readings, bands, perforations or rivet states (stiffeners
    included)."""
    d = copy.deepcopy(doc)
    for m in d["members"]:
        m["rivets"] = []
        for st in m.get("stiffeners", []):
            st["readings"], st["bands"] = [], []
        for s in m["stations"]:
            s["readings"], s["bands"], s["perforations"] = [], [], []
    return d
