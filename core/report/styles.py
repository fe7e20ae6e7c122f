"""Look of the condition report: page size, fonts, colours, paragraph and table styles.

A sans-serif face with the glyphs engineers' units need (superscripts, Greek letters) is
embedded: DejaVu Sans when the system has it, else the Bitstream Vera face shipped with
reportlab (whose missing glyphs are spelled out by :func:`text`). The palette is our own:
slate ink, one steel blue accent, a rust tint for section loss, and four level colours that
always come with a shape and words (never colour alone).
"""

from __future__ import annotations

import os
from functools import lru_cache
from xml.sax.saxutils import escape

import reportlab
from reportlab.lib import colors
from reportlab.lib.enums import TA_LEFT
from reportlab.lib.pagesizes import A4, LETTER
from reportlab.lib.styles import ParagraphStyle
from reportlab.lib.units import mm
from reportlab.pdfbase import pdfmetrics
from reportlab.pdfbase.ttfonts import TTFont
from reportlab.platypus import Paragraph, TableStyle

from core.checks.flags import Level
from core.glossary import LEVELS, RIVET_STATES
from core.report.cells import CellLine, CellParagraph, plain_cell

SANS, SANS_BOLD, SANS_ITALIC = "AsfSans", "AsfSans-Bold", "AsfSans-Oblique"

_DEJAVU = "/usr/share/fonts/truetype/dejavu"
_VERA = os.path.join(os.path.dirname(reportlab.__file__), "fonts")
_FACES = (
    (
        os.path.join(_DEJAVU, "DejaVuSans.ttf"),
        os.path.join(_DEJAVU, "DejaVuSans-Bold.ttf"),
        os.path.join(_DEJAVU, "DejaVuSans-Oblique.ttf"),
    ),
    (
        os.path.join(_VERA, "Vera.ttf"),
        os.path.join(_VERA, "VeraBd.ttf"),
        os.path.join(_VERA, "VeraIt.ttf"),
    ),
)
#: spelled-out replacements for glyphs the fallback face lacks
_SPELL = {"⁴": "^4", "⁶": "^6", "τ": "tau", "φ": "phi", "✓": "v", "☐": "[ ]", "□": "[ ]"}
_state = {"full": True}


@lru_cache(maxsize=1)
def register_fonts() -> str:
    """Register the report's sans-serif family once; returns the regular font's file."""
    for regular, bold, italic in _FACES:
        if all(os.path.exists(p) for p in (regular, bold, italic)):
            pdfmetrics.registerFont(TTFont(SANS, regular))
            pdfmetrics.registerFont(TTFont(SANS_BOLD, bold))
            pdfmetrics.registerFont(TTFont(SANS_ITALIC, italic))
            pdfmetrics.registerFontFamily(
                SANS, normal=SANS, bold=SANS_BOLD, italic=SANS_ITALIC, boldItalic=SANS_BOLD
            )
            _state["full"] = "DejaVu" in regular
            return regular
    raise RuntimeError("no sans-serif TrueType face found (reportlab's Vera is missing)")


def text(s: object) -> str:
    """Plain text for the canvas: glyphs the embedded face lacks are spelled out."""
    out = str(s)
    if not _state["full"]:
        for a, b in _SPELL.items():
            out = out.replace(a, b)
    return out


def esc(s: object) -> str:
    """Survey text for a Paragraph: printed literally (``<``, ``>``, ``&`` escaped)."""
    return escape(text(s))


#: tallest a table cell of survey text may grow (pt): a table row cannot split across pages,
#: so a longer text is cut, and the cell says how much was left out
MAX_CELL_HEIGHT = 260.0


def cell_text(s: object, style: ParagraphStyle, width: float) -> Paragraph | CellLine:
    """A table cell that prints survey text literally, ``width`` pt wide (padding included):
    one :class:`CellLine` when it fits on a line, else a Paragraph, cut when it would be
    taller than :data:`MAX_CELL_HEIGHT`, never a layout error."""
    raw = text(s)
    line = plain_cell(raw, style, width)
    if line is not None:
        return line
    w = max(width - 6.0, 12.0)
    p = CellParagraph(escape(raw), style)
    rough = len(raw) * 0.6 * style.fontSize / w * style.leading  # height if it all wraps
    if rough < MAX_CELL_HEIGHT / 2:
        return p
    h = p.wrap(w, 1e9)[1]
    n = len(raw)
    while h > MAX_CELL_HEIGHT and n > 0:
        n = int(n * min(0.9, 0.95 * MAX_CELL_HEIGHT / h))
        p = CellParagraph(f"{escape(raw[:n])} <i>[… {len(raw) - n:,} more characters]</i>", style)
        h = p.wrap(w, 1e9)[1]
    return p


def page_size(system: str) -> tuple[float, float]:
    """A4 for SI reports, US Letter for US customary ones."""
    return LETTER if system == "us" else A4


MARGIN = 16 * mm
FOOTER = 14 * mm

# palette (our own)
INK = colors.HexColor("#1f2933")
MUTED = colors.HexColor("#616e7c")
RULE = colors.HexColor("#c5ccd3")
BAND = colors.HexColor("#f1f4f7")
ACCENT = colors.HexColor("#2c5f8a")
STEEL = colors.HexColor("#8d9aa7")
STEEL_DARK = colors.HexColor("#3e4c59")
LOSS = colors.HexColor("#e8a36a")
HOLE = colors.white
PERF = colors.HexColor("#9b2c2c")

#: the glossary's colour of each level (the app's too)
LEVEL_COLOUR = {lv: colors.HexColor(LEVELS[lv].colour) for lv in Level}
#: the glossary's shape of each level, drawn beside its words (never colour alone)
LEVEL_MARK = {lv: LEVELS[lv].glyph for lv in Level}
#: the glossary's colour of each rivet state
RIVET_COLOUR = {k: colors.HexColor(t.colour) for k, t in RIVET_STATES.items()}


class Markup(str):
    """Text that is already Paragraph markup (everything else is escaped)."""


def level_markup(level: Level, bold: bool = True) -> Markup:
    """Paragraph markup of a level: its shape and its words in its colour."""
    c = LEVEL_COLOUR[level].hexval()[2:]
    mark = LEVEL_MARK[level] if _state["full"] else "*"
    body = f'<font color="#{c}">{mark} {escape(level.label)}</font>'
    return Markup(f"<b>{body}</b>" if bold else body)


def _ps(name: str, size: float, **kw) -> ParagraphStyle:
    base = {
        "fontName": SANS,
        "fontSize": size,
        "leading": size * 1.28,
        "textColor": INK,
        "alignment": TA_LEFT,
    }
    base.update(kw)
    return ParagraphStyle(name, **base)


class Styles:
    """Paragraph styles of the report (built after the fonts are registered)."""

    def __init__(self) -> None:
        register_fonts()
        self.title = _ps("title", 20, fontName=SANS_BOLD, leading=25, spaceAfter=4)
        self.subtitle = _ps("subtitle", 12, textColor=MUTED, leading=16, spaceAfter=10)
        self.h1 = _ps("h1", 14, fontName=SANS_BOLD, leading=18, spaceBefore=4, spaceAfter=6)
        self.h2 = _ps(
            "h2", 11, fontName=SANS_BOLD, leading=14, spaceBefore=8, spaceAfter=4, textColor=ACCENT
        )
        self.h3 = _ps("h3", 9.5, fontName=SANS_BOLD, leading=12, spaceBefore=4, spaceAfter=3)
        self.body = _ps("body", 9, spaceAfter=4)
        self.small = _ps("small", 7.5)
        self.caption = _ps("caption", 7.5, fontName=SANS_ITALIC, textColor=MUTED, spaceAfter=2)
        self.cell = _ps("cell", 7.2, leading=8.8)
        self.cell_num = _ps("cell_num", 7.2, leading=8.8, alignment=2)
        self.head = _ps("head", 7.2, leading=8.8, fontName=SANS_BOLD)
        self.head_num = _ps("head_num", 7.2, leading=8.8, fontName=SANS_BOLD, alignment=2)
        self.caution = _ps("caution", 9.5, leading=13, fontName=SANS_BOLD)
        self.overall = _ps("overall", 15, leading=20, fontName=SANS_BOLD)


def table_style(n_head: int = 1, numeric_from: int | None = None, zebra: bool = False) -> list:
    """Light rules: a rule under the header and at the bottom, hairlines between rows."""
    cmds = [
        ("FONT", (0, 0), (-1, -1), SANS, 7.2),
        ("TEXTCOLOR", (0, 0), (-1, -1), INK),
        ("VALIGN", (0, 0), (-1, -1), "TOP"),
        ("TOPPADDING", (0, 0), (-1, -1), 1.6),
        ("BOTTOMPADDING", (0, 0), (-1, -1), 1.6),
        ("LEFTPADDING", (0, 0), (-1, -1), 3),
        ("RIGHTPADDING", (0, 0), (-1, -1), 3),
        ("LINEBELOW", (0, n_head - 1), (-1, n_head - 1), 0.8, INK),
        ("LINEBELOW", (0, n_head), (-1, -2), 0.25, RULE),
        ("LINEBELOW", (0, -1), (-1, -1), 0.8, INK),
        ("FONT", (0, 0), (-1, n_head - 1), SANS_BOLD, 7.2),
    ]
    if numeric_from is not None:
        cmds.append(("ALIGN", (numeric_from, 0), (-1, -1), "RIGHT"))
    if zebra:
        cmds.append(("ROWBACKGROUNDS", (0, n_head), (-1, -1), [colors.white, BAND]))
    return cmds


def make_table_style(*extra: tuple, **kw) -> TableStyle:
    return TableStyle([*table_style(**kw), *extra])


def drawing_title(width: float, height: float, title: str):
    """A figure's title, centred at the top of a reportlab Drawing of that size (pt)."""
    from reportlab.graphics.shapes import String

    return String(
        width / 2,
        height - 9,
        text(title),
        fontName=SANS_BOLD,
        fontSize=7.5,
        fillColor=INK,
        textAnchor="middle",
    )
