"""One vocabulary from tablet to report (issue 15): the glossary is the one source of names,
shapes and colours, and no user-facing string names one of its things differently.

The forbidden words are the glossary's own list (``core.glossary.FORBIDDEN``): words that
the app, the command line and the report once used for the same things. The scans read the
kv layouts, the app's string constants, the command line's output and help for the samples
and the text of a sample report. (Consistency of our own words: common practice, no source.)
"""

from __future__ import annotations

import ast
import contextlib
import io
import json
import re
from pathlib import Path

import pytest
from pypdf import PdfReader

from core.checks.flags import Level
from core.cli import build_parser, main
from core.glossary import (
    FORBIDDEN,
    LEGS,
    LEVELS,
    LIMIT_STATES,
    PART_KINDS,
    RIVET_STATES,
    forbidden_in,
    snake,
)

ROOT = Path(__file__).resolve().parents[2]
SAMPLES = ROOT / "survey_samples"
SURVEYS = ("deck-girder-si.json", "through-girder-us.json")
FAMILIES = ("aashto", "aisc", "en1993")
KIVY_DEJAVU = "kivy/data/fonts/DejaVuSans.ttf"


def run_cli(*argv: str) -> tuple[int, str]:
    buf = io.StringIO()
    with contextlib.redirect_stdout(buf):
        code = main(list(argv))
    return code, buf.getvalue()


def _where(found: list[tuple[str, str, str]], place: str) -> list[str]:
    return [f"{place}: {words!r} (say: {instead})" for words, _rule, instead in found]


# ----------------------------------------------------------------------------- the glossary
def test_every_term_has_one_name_and_a_description():
    groups = (LEVELS, tuple(RIVET_STATES.values()), tuple(LIMIT_STATES.values()))
    groups += (tuple(PART_KINDS.values()), tuple(LEGS.values()))
    for group in groups:
        names = [t.name for t in group]
        assert len(set(names)) == len(names), names
        assert all(t.description and t.description[0].islower() for t in group)


def test_levels_and_rivet_states_have_distinct_shapes_and_colours():
    marks = [*LEVELS, *RIVET_STATES.values()]
    shapes = [t.shape for t in marks]
    glyphs = [t.glyph for t in marks]
    assert len(set(shapes)) == len(shapes) and len(set(glyphs)) == len(glyphs)  # no shared shape
    assert (
        len({t.colour for t in LEVELS}) == 4 and len({t.colour for t in RIVET_STATES.values()}) == 4
    )
    assert [t.letter for t in RIVET_STATES.values()] == ["S", "L", "M", "H"]
    assert [t.name for t in LEVELS] == [lv.label for lv in Level]  # the flags speak the glossary


def test_the_shapes_are_in_the_face_that_draws_them():
    """The glyphs exist in DejaVu Sans, which kivy ships and the report embeds."""
    import kivy
    from reportlab.pdfbase.ttfonts import TTFontFile

    face = TTFontFile(str(Path(kivy.__file__).parents[1] / KIVY_DEJAVU))
    for t in [*LEVELS, *RIVET_STATES.values()]:
        assert ord(t.glyph) in face.charToGlyph, t


def test_the_report_and_the_app_draw_the_glossary_shapes():
    from reportlab.graphics.shapes import Circle, Rect, Wedge

    from core.report.rivetmap import _mark
    from core.report.styles import LEVEL_COLOUR, LEVEL_MARK, RIVET_COLOUR
    from fieldapp import theme

    drawn = {k: {type(g) for g in _mark(k, 0, 0)} for k in RIVET_STATES}
    assert drawn == {
        "sound": {Circle},
        "loose": {Circle, Wedge},
        "missing": {Circle},
        "headless": {Rect},
    }
    assert _mark("missing", 0, 0)[0].fillColor != RIVET_COLOUR["missing"]  # open, not filled
    for k, t in RIVET_STATES.items():
        assert theme.RIVET_LOOK[k][0] == t.letter and theme.RIVET_LOOK[k][2] == t.shape
        assert RIVET_COLOUR[k].hexval()[2:] == t.colour[1:]
    for lv in Level:
        assert LEVEL_MARK[lv] == LEVELS[lv].glyph
        assert LEVEL_COLOUR[lv].hexval()[2:] == LEVELS[lv].colour[1:]


def test_forbidden_words_are_found():
    assert forbidden_in("Hole") and forbidden_in("the verdict") and forbidden_in("[WATCH] x")
    assert (
        forbidden_in("Angle leg, on web")
        and forbidden_in("angle, flat leg")
        and forbidden_in("asfound assess --level legal")
    )
    assert not forbidden_in("the rivet hole") and not forbidden_in("the whole member")
    assert not forbidden_in("tension flange at holes") and not forbidden_in("bearing on web")
    assert not forbidden_in("tension flange at holes") and not forbidden_in("--rating-level")


# ----------------------------------------------------------------------------- the JSON
@pytest.mark.parametrize("name", SURVEYS)
@pytest.mark.parametrize("family", FAMILIES)
def test_limit_state_keys_are_their_printed_names(name, family):
    code, out = run_cli("assess", str(SAMPLES / name), "--standard", family, "--json")
    assert code == 0
    doc = json.loads(out)
    levels = {t.name for t in LEVELS}
    assert doc["level"] in levels
    for m in doc["members"]:
        for s in m["stations"]:
            assert s["level"] in levels
            for ls in s["limit_states"]:
                base = ls["key"].split(":")[0]
                term = LIMIT_STATES[base]
                assert base == snake(term.name)
                assert ls["name"].startswith(term.name), (ls["key"], ls["name"])


# ----------------------------------------------------------------------------- user-facing text
def _kv_texts() -> list[tuple[str, str]]:
    out = []
    for p in sorted((ROOT / "fieldapp").rglob("*.kv")):
        for i, line in enumerate(p.read_text(encoding="utf-8").splitlines(), 1):
            m = re.match(r"\s*text:\s*(.+)$", line)
            if m:
                out.append((f"{p.name}:{i}", m.group(1)))
    return out


def _app_strings() -> list[tuple[str, str]]:
    """String constants of the app's modules (not docstrings, not bare identifiers)."""
    out = []
    for p in sorted((ROOT / "fieldapp").rglob("*.py")):
        tree = ast.parse(p.read_text(encoding="utf-8"))
        docs = set()
        for node in ast.walk(tree):
            body = getattr(node, "body", None)
            first = body[0] if isinstance(body, list) and body else None
            if isinstance(first, ast.Expr) and isinstance(first.value, ast.Constant):
                docs.add(id(first.value))
        for node in ast.walk(tree):
            if isinstance(node, ast.Constant) and isinstance(node.value, str):
                v = node.value
                if id(node) in docs or re.fullmatch(r"[a-z_0-9]*", v):
                    continue
                out.append((f"{p.name}:{node.lineno}", v))
    return out


def test_the_app_layouts_and_strings_use_the_glossary_words():
    bad = []
    for place, text in [*_kv_texts(), *_app_strings()]:
        bad += _where(forbidden_in(text), place)
    assert bad == []


def test_the_command_line_output_and_help_use_the_glossary_words():
    bad = []
    for name in SURVEYS:
        for family in FAMILIES:
            _code, out = run_cli("assess", str(SAMPLES / name), "--standard", family, "--verbose")
            bad += _where(forbidden_in(out), f"assess {name} {family}")
    _code, out = run_cli("section", str(SAMPLES / "section-demo-si.json"))
    bad += _where(forbidden_in(out), "section")
    _code, out = run_cli("validate", str(SAMPLES / "mistakes.json"))
    bad += _where(forbidden_in(out), "validate")
    earlier = SAMPLES / "earlier" / "through-girder-us-2019.json"
    code, out = run_cli("trend", str(earlier), str(SAMPLES / SURVEYS[1]), "--step", "25")
    assert code == 0, out
    bad += _where(forbidden_in(out), "trend")
    parser = build_parser()
    sub = next(a for a in parser._actions if a.dest == "command")
    for cmd, p in sub.choices.items():
        bad += _where(forbidden_in(p.format_help()), f"asfound {cmd} --help")
    assert bad == []


def test_the_report_uses_the_glossary_words(tmp_path):
    from core.report import build_report

    pdf = tmp_path / "r.pdf"
    build_report(SAMPLES / "deck-girder-si.json", pdf)
    text = " ".join((p.extract_text() or "") for p in PdfReader(str(pdf)).pages)
    text = re.sub(r"\s+", " ", text)
    assert forbidden_in(text) == []
    for t in RIVET_STATES.values():  # the legend of the rivet map names every state
        assert t.name in text
    assert "overall flag level" in text.lower()


def test_the_docs_use_the_glossary_words():
    bad = []
    for p in (ROOT / "README.md", ROOT / "docs" / "survey-format.md"):
        bad += _where(forbidden_in(p.read_text(encoding="utf-8")), p.name)
    assert bad == [], FORBIDDEN
