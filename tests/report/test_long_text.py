"""Long survey text in the report: wrapped across pages or cut with a note of how much was
left out, never a layout error, and always printed literally (markup characters included).
(The reportlab LayoutError on long text is one of the crash kinds of issue 9.)"""

from __future__ import annotations

import copy
import json

import pytest

from core import limits
from core.report import build_report
from tests.survey.helpers import document

from .helpers import pdf_pages

NOTE_PIECE = "<b>rust & scale</b> <font size=40> "
NOTE = (NOTE_PIECE * (limits.MAX_TEXT // len(NOTE_PIECE)))[: limits.MAX_TEXT]


def _long_survey() -> dict:
    doc = document()
    doc["survey"]["title"] = "Long <title> & " + "T" * 300 + " end"
    doc["survey"]["location"] = "L" * limits.MAX_TEXT  # one word, no break in it
    doc["survey"]["inspector"] = ("Ann & <Bob> " * 2000)[: limits.MAX_TEXT]
    m = doc["members"][0]
    m["label"] = "girder " * 700
    st = m["stations"][0]
    st["notes"] = NOTE
    st["readings"][0]["location"] = "x" * limits.MAX_TEXT
    states = [{"position": round(0.05 + 0.008 * k, 6), "state": "missing"} for k in range(1400)]
    m["rivets"] = [
        {
            "line": "web_bottom",
            "run": {"start": 0.05, "end": 11.95, "pitch": 0.004},
            "states": states,
        }
    ]
    return doc


@pytest.fixture(scope="module")
def long_report(tmp_path_factory):
    d = tmp_path_factory.mktemp("long")
    src = d / "long.json"
    src.write_text(json.dumps(_long_survey()), encoding="utf-8")
    rep = build_report(src, d / "long.pdf")
    return rep, pdf_pages(rep.path)


def test_long_text_never_breaks_the_layout(long_report):
    rep, pages = long_report
    assert rep.path.exists() and rep.pages == len(pages) >= 4


def test_a_long_note_is_printed_whole_and_literally_across_pages(long_report):
    _rep, pages = long_report
    text = " ".join(pages).replace(" ", "")
    assert NOTE_PIECE.replace(" ", "") * 3 in text  # markup printed as characters
    assert text.count("<b>rust&scale</b>") >= NOTE.count("<b>rust & scale</b>") - 2


def test_table_cells_of_long_text_are_cut_with_a_note(long_report):
    _rep, pages = long_report
    text = " ".join(pages)
    assert "more characters]" in text  # the location on the cover, the missing rivets list
    assert "Ann & <Bob>" in text


def test_a_survey_at_every_text_limit_validates(tmp_path):
    doc = copy.deepcopy(_long_survey())
    from core.survey import check_document

    _model, probs = check_document(doc, "long.json")
    assert [p for p in probs if p.level == "error"] == []
