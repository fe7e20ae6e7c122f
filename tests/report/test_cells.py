"""One-line table cells (:mod:`core.report.cells`) print where a Paragraph of the same
style prints: same size in the table, same text at the same place on the page. Property
that must hold, common practice, no source (the reference is reportlab's own Paragraph)."""

from __future__ import annotations

import io
from xml.sax.saxutils import escape

import pytest
from hypothesis import given, settings
from hypothesis import strategies as hs
from pypdf import PdfReader
from reportlab.platypus import Paragraph, SimpleDocTemplate, Table

from core.report.cells import CellLine, plain_cell
from core.report.styles import Styles, make_table_style

ST = Styles()
WIDTHS = [90.0, 50.0, 50.0]


def _placed(cells: list[list]) -> list[tuple[str, float, float]]:
    """Each text run of a one-page PDF of a table of ``cells``, with its place (pt)."""
    buf = io.BytesIO()
    t = Table(cells, colWidths=WIDTHS)
    t.setStyle(make_table_style())
    SimpleDocTemplate(buf).build([t])
    out = []

    def seen(text, cm, tm, font, size):
        if text.strip():
            out.append((text, round(tm[4] + cm[4], 2), round(tm[5] + cm[5], 2)))

    PdfReader(buf).pages[0].extract_text(visitor_text=seen)
    return out


TEXTS = ["S0001", "12.75", "A net (holes out) (mm²)", "", "τmax = VQ/(I t)", "1,234.5"]


def test_a_table_of_lines_prints_as_a_table_of_paragraphs():
    styles = [ST.cell, ST.cell_num, ST.head_num]
    rows = [[TEXTS[(i + j) % len(TEXTS)] for j in range(3)] for i in range(12)]
    paras = [[Paragraph(escape(v), styles[j]) for j, v in enumerate(r)] for r in rows]
    lines = [[CellLine(v, styles[j]) for j, v in enumerate(r)] for r in rows]
    want = _placed(paras)
    assert len(want) >= sum(1 for r in rows for v in r if v)  # every text was found
    assert _placed(lines) == want


@settings(max_examples=60, deadline=None)
@given(hs.text(hs.characters(codec="latin-1", exclude_categories=("Cc",)), max_size=40))
def test_a_line_is_used_only_when_it_fits_as_it_is(s):
    line = plain_cell(s, ST.cell, 60.0)
    if line is None:
        return
    assert s == " ".join(s.split())  # a Paragraph would not change its spaces
    p = Paragraph(escape(s), ST.cell)
    assert line.wrap(54.0, 1e6) == pytest.approx(p.wrap(54.0, 1e6))
    assert len(p.blPara.lines) <= 1


def test_a_line_given_too_little_width_becomes_a_paragraph():
    line = CellLine("a long label that cannot fit", ST.cell)
    _, h = line.wrap(30.0, 1e6)
    assert h == pytest.approx(Paragraph("a long label that cannot fit", ST.cell).wrap(30.0, 1e6)[1])
    assert h > ST.cell.leading
