"""Shared helpers of the report tests: sample paths and PDF text."""

from __future__ import annotations

import re
from pathlib import Path

from pypdf import PdfReader

ROOT = Path(__file__).resolve().parents[2]
SI_SAMPLE = ROOT / "survey_samples" / "deck-girder-si.json"
US_SAMPLE = ROOT / "survey_samples" / "through-girder-us.json"
MISTAKES = ROOT / "survey_samples" / "mistakes.json"


def flat(s: str) -> str:
    """Whitespace runs (line breaks of wrapped cells included) as single spaces."""
    return re.sub(r"\s+", " ", s).strip()


def pdf_pages(path: Path) -> list[str]:
    """The text of every page, whitespace flattened."""
    return [flat(p.extract_text() or "") for p in PdfReader(str(path)).pages]
