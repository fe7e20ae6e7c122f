"""A value over the years: measured points at the survey dates, the projection by the
engine after the latest one, and horizontal target lines (vector drawing).

Each curve has its colour, its dash and a marker shape, and is named in the legend below
the plot (never colour alone).
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

from reportlab.graphics.shapes import Circle, Drawing, Line, Polygon, PolyLine, Rect, String
from reportlab.lib import colors
from reportlab.pdfbase.pdfmetrics import stringWidth

from core.report.fmt import tick
from core.report.styles import (
    ACCENT,
    INK,
    LOSS,
    MUTED,
    PERF,
    RULE,
    SANS,
    STEEL_DARK,
    drawing_title,
    text,
)
from core.report.tauplot import ticks

PALETTE = (
    ACCENT,
    PERF,
    STEEL_DARK,
    colors.HexColor("#3b7a57"),
    LOSS,
    colors.HexColor("#6b4c9a"),
    colors.HexColor("#9a7b0a"),
    MUTED,
)
DASHES = (None, [3, 1.5], [1, 1.5], [4, 1.5, 1, 1.5])
MARKS = ("circle", "square", "triangle", "diamond")


@dataclass(frozen=True)
class Curve:
    """One named curve: ``measured`` (year, value) at the survey dates, ``projected``
    (year, value) from the latest survey on, and the band's two edges (thin dotted lines;
    empty without a band)."""

    label: str
    measured: tuple[tuple[float, float], ...]
    projected: tuple[tuple[float, float], ...]
    edges: tuple[tuple[tuple[float, float], ...], ...] = ()


def clip(points: Sequence[tuple[float, float]], lo: float, hi: float) -> list[tuple[float, float]]:
    """``points`` up to where the curve leaves [lo, hi], ending on the edge it crosses
    (a curve that leaves the plot is not drawn along its edge)."""
    out: list[tuple[float, float]] = []
    for x, v in points:
        if lo <= v <= hi:
            out.append((x, v))
            continue
        if out:
            xa, va = out[-1]
            edge = hi if v > hi else lo
            out.append((xa + (edge - va) / (v - va) * (x - xa), edge))
        break
    return out


def _mark(d: Drawing, kind: str, x: float, y: float, colour) -> None:
    r = 2.0
    if kind == "circle":
        d.add(Circle(x, y, r, fillColor=colour, strokeColor=None))
    elif kind == "square":
        d.add(Rect(x - r, y - r, 2 * r, 2 * r, fillColor=colour, strokeColor=None))
    elif kind == "triangle":
        d.add(Polygon([x - r, y - r, x + r, y - r, x, y + r], fillColor=colour, strokeColor=None))
    else:
        d.add(Polygon([x, y - r, x + r, y, x, y + r, x - r, y], fillColor=colour, strokeColor=None))


def time_plot(
    curves: Sequence[Curve],
    width: float,
    height: float,
    *,
    title: str,
    ylabel: str,
    y_range: tuple[float, float],
    x_range: tuple[float, float],
    now: float,
    lines: Sequence[tuple[float, str]] = (),
) -> Drawing:
    """The plot in a ``width`` x ``height`` point box.

    Args:
        curves: the curves (at most eight are told apart; more reuse the styles).
        title, ylabel: the figure's title and the value axis label (with its unit).
        y_range, x_range: the axes' ranges (values outside are drawn at the edge).
        now: the latest survey's year (a vertical rule marks where projection starts).
        lines: horizontal target lines (value, label).
    """
    d = Drawing(width, height)
    ncol = 2 if width < 420 else 3
    legend_rows = (len(curves) + ncol - 1) // ncol
    left, right = 36, width - 10
    bottom = 24 + 9 * legend_rows + 6
    top = height - 20
    y0, y1 = y_range
    x0, x1 = x_range

    def X(v: float) -> float:
        return left + (right - left) * (min(max(v, x0), x1) - x0) / ((x1 - x0) or 1.0)

    def Y(v: float) -> float:
        return bottom + (top - bottom) * (min(max(v, y0), y1) - y0) / ((y1 - y0) or 1.0)

    d.add(drawing_title(width, height, title))
    d.add(Rect(left, bottom, right - left, top - bottom, fillColor=None, strokeColor=RULE))
    for v in ticks(x0, x1, 6):
        d.add(Line(X(v), bottom, X(v), top, strokeColor=RULE, strokeWidth=0.3))
        d.add(String(X(v), bottom - 8, f"{v:g}", fontName=SANS, fontSize=6, textAnchor="middle"))
    for v in ticks(y0, y1, 5):
        d.add(Line(left, Y(v), right, Y(v), strokeColor=RULE, strokeWidth=0.3))
        d.add(String(left - 3, Y(v) - 2, tick(v), fontName=SANS, fontSize=6, textAnchor="end"))
    d.add(String(left, top + 3, text(ylabel), fontName=SANS, fontSize=6, fillColor=MUTED))
    d.add(
        String(
            (left + right) / 2,
            bottom - 16,
            "year",
            fontName=SANS,
            fontSize=6.5,
            textAnchor="middle",
            fillColor=INK,
        )
    )
    d.add(Line(X(now), bottom, X(now), top, strokeColor=MUTED, strokeWidth=0.6))
    d.add(
        String(
            X(now) + 2,
            top - 7,
            "latest survey; projected after",
            fontName=SANS,
            fontSize=5.5,
            fillColor=MUTED,
        )
    )
    later: list = []  # the target labels, drawn over the curves
    for k, (v, lab) in enumerate(lines):
        if not y0 <= v <= y1:
            continue
        d.add(
            Line(left, Y(v), right, Y(v), strokeColor=INK, strokeWidth=0.5, strokeDashArray=[1, 2])
        )
        # labels alternate right and left, so that close thresholds stay readable
        x, anchor = (right - 2, "end") if k % 2 == 0 else (X(now) + 3, "start")
        w = stringWidth(text(lab), SANS, 5.5)
        x0b = x - w - 1 if anchor == "end" else x - 1
        later.append(Rect(x0b, Y(v) + 0.8, w + 2, 6.2, fillColor=colors.white, strokeColor=None))
        later.append(
            String(x, Y(v) + 1.5, text(lab), fontName=SANS, fontSize=5.5, textAnchor=anchor)
        )
    for i, c in enumerate(curves):
        colour = PALETTE[i % len(PALETTE)]
        dash = DASHES[(i // len(PALETTE)) % len(DASHES)]
        mark = MARKS[i % len(MARKS)]
        if len(c.measured) > 1:
            pts = [p for y, v in c.measured for p in (X(y), Y(v))]
            d.add(PolyLine(pts, strokeColor=colour, strokeWidth=0.9, strokeDashArray=dash))
        for y, v in c.measured:
            _mark(d, mark, X(y), Y(v), colour)
        if len(c.projected) > 1:
            pts = [p for y, v in clip(c.projected, y0, y1) for p in (X(y), Y(v))]
            d.add(PolyLine(pts, strokeColor=colour, strokeWidth=0.9, strokeDashArray=[2.5, 1.5]))
        for edge in c.edges:
            if len(edge) > 1:
                pts = [p for y, v in clip(edge, y0, y1) for p in (X(y), Y(v))]
                d.add(
                    PolyLine(pts, strokeColor=colour, strokeWidth=0.4, strokeDashArray=[0.6, 1.2])
                )
        # legend
        row, col = divmod(i, ncol)
        lx = left + col * (right - left) / ncol
        ly = 6 + 9 * (legend_rows - 1 - row)
        d.add(Line(lx, ly + 2, lx + 12, ly + 2, strokeColor=colour, strokeWidth=0.9))
        _mark(d, mark, lx + 6, ly + 2, colour)
        d.add(String(lx + 15, ly, text(c.label)[:48], fontName=SANS, fontSize=5.8, fillColor=INK))
    for shape in later:
        d.add(shape)
    return d
