"""One line of plain text in a table cell, without a Paragraph's cost.

A report of 1,000 stations has about a quarter of a million table cells, nearly all one
short line (a number, a label). As a Paragraph each one parses its text as markup, breaks
it into lines and draws it through a text object, three to five times per cell as the table
is measured, split across pages and drawn: most of the time of a long report. A
:class:`CellLine` measures its text once and draws it at the place a Paragraph of the same
style would (the baseline one font size below the top, the style's alignment, indents and
colour), so the page looks the same. Text that may need more than one line, or whose
spaces a Paragraph would collapse, stays a Paragraph (:func:`plain_cell` decides).
"""

from __future__ import annotations

from xml.sax.saxutils import escape

from reportlab import rl_config
from reportlab.lib.enums import TA_CENTER, TA_LEFT, TA_RIGHT
from reportlab.lib.styles import ParagraphStyle
from reportlab.pdfbase.pdfmetrics import getAscent, stringWidth
from reportlab.platypus import Flowable, Paragraph


class CellLine(Flowable):
    """``s`` on one line in ``style`` (font, size, leading, colour, alignment, indents).

    Its height is one leading (none for an empty text, as a Paragraph's); given less width
    than the text needs it hands over to a Paragraph of the same text, so nothing is ever
    drawn past its cell."""

    def __init__(self, s: str, style: ParagraphStyle) -> None:
        super().__init__()
        self.s, self.style = s, style
        self.text_width = stringWidth(s, style.fontName, style.fontSize) if s else 0.0
        self._para: Paragraph | None = None

    def wrap(self, availWidth: float, availHeight: float) -> tuple[float, float]:
        st = self.style
        room = availWidth - st.leftIndent - st.rightIndent - st.firstLineIndent
        if self.text_width > room + 1e-8 or st.alignment not in (TA_LEFT, TA_RIGHT, TA_CENTER):
            self._para = self._para or CellParagraph(escape(self.s), st)
            self.width, self.height = self._para.wrap(availWidth, availHeight)
            return self.width, self.height
        self._para = None
        self.width = availWidth
        self.height = st.leading if self.s else 0.0
        return self.width, self.height

    def split(self, availWidth: float, availHeight: float) -> list:
        return []

    def draw(self) -> None:
        if self._para is not None:
            self._para.drawOn(self.canv, 0, 0)
            return
        if not self.s:
            return
        st, c = self.style, self.canv
        left = st.leftIndent + st.firstLineIndent
        spare = self.width - left - st.rightIndent - self.text_width
        x = left + {TA_LEFT: 0.0, TA_CENTER: spare / 2, TA_RIGHT: spare}[st.alignment]
        if rl_config.paraFontSizeHeightOffset:
            y = self.height - st.fontSize
        else:
            y = self.height - getAscent(st.fontName, st.fontSize)
        # drawOn has saved the canvas state around draw (and restores it after)
        c.setFillColor(st.textColor)
        c.setFont(st.fontName, st.fontSize, st.leading)
        c.drawString(x, y, self.s)


class CellParagraph(Paragraph):
    """A Paragraph in a table cell: laid out once per width. A table measures its cells
    when it is sized, split at a page end and drawn; a Paragraph's lines depend on its
    width alone, so the lines found for a width serve again for it."""

    def wrap(self, availWidth: float, availHeight: float) -> tuple[float, float]:
        memo = getattr(self, "_wrapped", None)
        if memo is not None and memo[0] == availWidth:
            self.width, self.height, self.blPara = memo[1], memo[2], memo[3]
            return memo[1], memo[2]
        w, h = super().wrap(availWidth, availHeight)
        if getattr(self, "blPara", None) is not None:
            self._wrapped = (availWidth, w, h, self.blPara)
        return w, h


def plain_cell(s: str, style: ParagraphStyle, width: float) -> CellLine | None:
    """A :class:`CellLine` of ``s`` when it is sure to fit on one line of a cell ``width``
    pt wide (3 pt padding each side) and a Paragraph would print it as it is (no leading,
    trailing or repeated spaces, no line break); else None (use a Paragraph)."""
    if s != " ".join(s.split()):
        return None
    line = CellLine(s, style)
    room = width - 6.0 - style.leftIndent - style.rightIndent - style.firstLineIndent
    return line if line.text_width <= room else None
