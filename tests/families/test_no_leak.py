"""One assessment follows one standard family: no clause, factor source or symbol of another
family appears in the assess JSON, the assess table or the report text (design notes 13 of
the project; a property that must hold, no source).

Each family lists the words that identify its documents and symbols (``Family.tokens``). A
family may point to a document outside the three families (AISC 360 to ASCE/SEI 7 for its load
combination); such a document is marked ``pointer`` in the family and is no token of another
family. The samples' own words (names, notes) hold no family's token, so nothing is excused.
"""

from __future__ import annotations

import contextlib
import io
import re

import pytest
from pypdf import PdfReader

from core.assess import AssessOptions
from core.cli import main
from core.families import FAMILY_KEYS, build_family
from core.report import build_report
from tests.assess.helpers import SAMPLES, sample_doc, survey

FILES = ("deck-girder-si.json", "through-girder-us.json")


def tokens(key: str) -> tuple[str, ...]:
    return build_family(key, AssessOptions(), survey(sample_doc(FILES[0]))).tokens


def pattern(tok: str) -> re.Pattern:
    """The token where a word starts (tokens may be prefixes: "gamma_M", "EN 199", "6A.")."""
    left = r"(?<![A-Za-z0-9_])" if tok[0].isalnum() else ""
    return re.compile(left + re.escape(tok))


def leaks(text: str, family: str) -> list[str]:
    """Every token of another family found in ``text``, with its context."""
    out = []
    for other in FAMILY_KEYS:
        if other == family:
            continue
        for tok in tokens(other):
            m = pattern(tok).search(text)
            if m:
                ctx = text[max(0, m.start() - 60) : m.end() + 60].replace("\n", " ")
                out.append(f"{other} token {tok!r} in the {family} output: ...{ctx}...")
    return out


def test_the_check_finds_a_leak():
    assert leaks("shear per AASHTO LRFD 6.10.9", "en1993")
    assert leaks("gamma_M1 = 1.10", "aashto") and leaks("D/C 0.5", "en1993")
    assert not leaks("gamma_M1 = 1.10 (EN 1993-2)", "en1993")


def run_cli(*argv: str) -> str:
    buf = io.StringIO()
    with contextlib.redirect_stdout(buf):
        assert main(list(argv)) == 0
    return buf.getvalue()


@pytest.fixture(scope="module")
def reports(tmp_path_factory):
    out = {}
    d = tmp_path_factory.mktemp("leak")
    for name in FILES:
        for fam in FAMILY_KEYS:
            pdf = d / f"{name}.{fam}.pdf"
            build_report(SAMPLES / name, pdf, standard=fam)
            out[(name, fam)] = " ".join((p.extract_text() or "") for p in PdfReader(str(pdf)).pages)
    return out


@pytest.mark.parametrize("name", FILES)
@pytest.mark.parametrize("family", FAMILY_KEYS)
def test_assess_table_and_json_follow_one_family(name, family):
    path = str(SAMPLES / name)
    table = run_cli("assess", path, "--standard", family)
    js = run_cli("assess", path, "--standard", family, "--json")
    assert leaks(table, family) == []
    assert leaks(js, family) == []
    # and the family's own words are there, with the girder limit states (issue 11)
    assert any(pattern(t).search(table) for t in tokens(family))
    for words in ("lateral-torsional buckling", "stiffener bearing", "flexure ("):
        assert words in table, words


@pytest.mark.parametrize("name", FILES)
@pytest.mark.parametrize("family", FAMILY_KEYS)
def test_report_follows_one_family(reports, name, family):
    text = reports[(name, family)]
    assert leaks(text, family) == []


def test_the_pointer_is_marked():
    # AISC points to ASCE/SEI 7 for its load combination: marked as a pointer in the family,
    # and said so on the assumptions page
    fam = build_family("aisc", AssessOptions(), survey(sample_doc(FILES[1])))
    asce = [d for d in fam.documents if "ASCE" in d.title]
    assert asce and all(d.pointer for d in asce)
    assert all(not d.pointer for d in fam.documents if "AISC" in d.title)
