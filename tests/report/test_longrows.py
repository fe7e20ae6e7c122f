"""A table of many rows laid out a page at a time (:mod:`core.report.longrows`) prints the
same rows on the same pages as the whole table split by reportlab, and each style command
of the whole table lands on the same rows. Properties that must hold, common practice,
no source (the reference is reportlab's own split of the whole table)."""

from __future__ import annotations

import io

from pypdf import PdfReader
from reportlab.lib import colors
from reportlab.platypus import LongTable, Paragraph, SimpleDocTemplate

from core.report.cells import CellLine
from core.report.longrows import LongRows, _shifted
from core.report.styles import Styles, make_table_style

ST = Styles()
WIDTHS = [60.0, 80.0, 300.0]


def _rows(n: int) -> tuple[list, list]:
    head = [CellLine(h, ST.head) for h in ("station", "value", "note")]
    body = []
    for i in range(n):
        note = "a note long enough to wrap onto a second line of the cell " * (1 + i % 3)
        text = note if i % 7 == 0 else "short"
        body.append(
            [
                CellLine(f"S{i:04d}", ST.cell),
                CellLine(f"{i * 1.5:.1f}", ST.cell_num),
                Paragraph(text, ST.cell),
            ]
        )
    return head, body


def _pages(flowable) -> list[str]:
    buf = io.BytesIO()
    SimpleDocTemplate(buf).build([Paragraph("Title", ST.h1), flowable])
    return [p.extract_text() for p in PdfReader(buf).pages]


def test_the_same_rows_on_the_same_pages_as_the_whole_table():
    style = make_table_style(("BACKGROUND", (0, 5), (-1, 5), colors.yellow)).getCommands()
    head, body = _rows(400)
    whole = LongTable([head, *body], colWidths=WIDTHS, repeatRows=1, style=style)
    want = _pages(whole)
    head, body = _rows(400)
    got = _pages(LongRows(head, body, WIDTHS, style))
    assert len(want) > 5
    assert got == want


def test_a_short_rest_and_a_table_that_fits_at_once():
    for n in (10, 60):
        head, body = _rows(n)
        whole = LongTable([head, *body], colWidths=WIDTHS, repeatRows=1)
        want = _pages(whole)
        head, body = _rows(n)
        assert _pages(LongRows(head, body, WIDTHS, [])) == want


def test_style_commands_move_with_their_rows():
    n = 100  # data rows 1..100 of the whole table; a block of data rows 40:80
    bg = ("BACKGROUND", (0, 45), (-1, 45), "y")
    assert _shifted(bg, 40, 80, n) == ("BACKGROUND", (0, 5), (-1, 5), "y")
    assert _shifted(bg, 0, 40, n) is None
    head = ("FONT", (0, 0), (-1, 0), "bold")
    assert _shifted(head, 40, 80, n) == head
    everything = ("FONT", (0, 0), (-1, -1), "f")
    assert _shifted(everything, 40, 80, n) == ("FONT", (0, 0), (-1, 40), "f")
    last = ("LINEBELOW", (0, -1), (-1, -1), 0.8)
    assert _shifted(last, 40, 80, n) is None  # the table's last row is not in the block
    assert _shifted(last, 80, 100, n) == ("LINEBELOW", (0, 20), (-1, 20), 0.8)
    between = ("LINEBELOW", (0, 1), (-1, -2), 0.25)
    assert _shifted(between, 40, 80, n) == ("LINEBELOW", (0, 1), (-1, 40), 0.25)
    assert _shifted(between, 80, 100, n) == ("LINEBELOW", (0, 1), (-1, 19), 0.25)
