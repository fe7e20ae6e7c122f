"""The page template: footer on every page with "page X of Y", the survey's identity and the
checksum of the input; a flowable that records where each figure landed (for checks)."""

from __future__ import annotations

from dataclasses import dataclass, field

from reportlab.pdfbase.pdfmetrics import stringWidth
from reportlab.pdfgen import canvas as rl_canvas
from reportlab.platypus import BaseDocTemplate, Flowable, Frame, PageTemplate

from core import __version__
from core.report.styles import FOOTER, INK, MARGIN, MUTED, RULE, SANS, SANS_BOLD, text


@dataclass
class PageInfo:
    """What the footer prints, and what the build learns (pages, figure boxes)."""

    survey_id: str
    title: str
    checksum: str
    family: str = ""
    pages: int = 0
    #: (kind, page number, (x0, y0, x1, y1) in points from the page's lower left)
    figures: list[tuple[str, int, tuple[float, float, float, float]]] = field(default_factory=list)


def _fit(s: str, font: str, size: float, width: float) -> str:
    """``s`` shortened with an ellipsis to fit ``width`` points."""
    if stringWidth(s, font, size) <= width:
        return s
    while s and stringWidth(s + "…", font, size) > width:
        s = s[:-1]
    return s + "…"


def canvas_maker(info: PageInfo):
    """A canvas class that defers each page until the total page count is known."""

    class NumberedCanvas(rl_canvas.Canvas):
        def __init__(self, *args, **kw):
            super().__init__(*args, **kw)
            self._pages: list[dict] = []
            self.setTitle(f"Condition report {info.survey_id}")
            self.setAuthor(f"asfound {__version__}")
            self.setSubject(text(info.title))

        def showPage(self):
            self._pages.append(dict(self.__dict__))
            self._startPage()

        def save(self):
            total = len(self._pages)
            info.pages = total
            for state in self._pages:
                self.__dict__.update(state)
                self._footer(total)
                super().showPage()
            super().save()

        def _footer(self, total: int) -> None:
            w, _h = self._pagesize
            y = FOOTER - 4
            self.saveState()
            self.setStrokeColor(RULE)
            self.setLineWidth(0.5)
            self.line(MARGIN, FOOTER + 4, w - MARGIN, FOOTER + 4)
            page = f"page {self._pageNumber} of {total}"
            self.setFont(SANS_BOLD, 7.5)
            self.setFillColor(INK)
            self.drawRightString(w - MARGIN, y, page)
            left = f"{info.survey_id} · {text(info.title)}"
            room = w - 2 * MARGIN - stringWidth(page, SANS_BOLD, 7.5) - 20
            self.setFont(SANS, 7.5)
            self.drawString(MARGIN, y, _fit(left, SANS, 7.5, room))
            self.setFillColor(MUTED)
            self.setFont(SANS, 6.5)
            self.drawString(
                MARGIN,
                y - 9,
                f"input SHA-256 {info.checksum} · asfound {__version__} condition report · "
                "an aid to a licensed engineer, not a load rating by itself",
            )
            if info.family:
                self.setFillColor(INK)
                self.drawString(
                    MARGIN,
                    y - 17,
                    _fit(f"standard family: {info.family}", SANS, 6.5, w - 2 * MARGIN),
                )
            self.restoreState()

    return NumberedCanvas


class Tracked(Flowable):
    """Wraps a flowable and records the page and box where it is drawn."""

    def __init__(self, inner: Flowable, kind: str, info: PageInfo) -> None:
        super().__init__()
        self.inner, self.kind, self.info = inner, kind, info

    def wrap(self, aw, ah):
        self.width, self.height = self.inner.wrap(aw, ah)
        return self.width, self.height

    def draw(self):
        c = self.canv
        x0, y0 = c.absolutePosition(0, 0)
        self.info.figures.append(
            (self.kind, c.getPageNumber(), (x0, y0, x0 + self.width, y0 + self.height))
        )
        self.inner.drawOn(c, 0, 0)


def document(path: str, pagesize: tuple[float, float], info: PageInfo) -> BaseDocTemplate:
    """A document with one frame per page inside the margins, above the footer."""
    w, h = pagesize
    doc = BaseDocTemplate(
        path,
        pagesize=pagesize,
        leftMargin=MARGIN,
        rightMargin=MARGIN,
        topMargin=MARGIN,
        bottomMargin=FOOTER + 10,
        title=f"Condition report {info.survey_id}",
        author=f"asfound {__version__}",
    )
    frame = Frame(
        MARGIN,
        FOOTER + 10,
        w - 2 * MARGIN,
        h - MARGIN - FOOTER - 10,
        id="body",
        leftPadding=0,
        rightPadding=0,
        topPadding=0,
        bottomPadding=0,
    )
    doc.addPageTemplates([PageTemplate(id="page", frames=[frame])])
    return doc
