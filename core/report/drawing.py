"""Cross-section drawings to scale: as-built, and as-found over the as-built outline.

Material is filled steel grey; in an as-found drawing the as-built parts are first filled
with the loss tint and the remaining material is drawn over them, so whatever the loss took
shows tinted inside the thin as-built outline. Rivet holes are white with a centre line;
perforations are outlined in dark red and lettered "P". Every drawing carries a scale bar
in the report's length unit and its scale on the printed page.
"""

from __future__ import annotations

import math

import numpy as np
import shapely
from reportlab.graphics.shapes import Drawing, Group, Line, PolyLine, Rect, String

from core.geometry import hole_rects
from core.parts import Plate
from core.report.fmt import num
from core.report.styles import (
    HOLE,
    INK,
    LOSS,
    MUTED,
    PERF,
    SANS,
    SANS_BOLD,
    STEEL,
    STEEL_DARK,
    drawing_title,
)
from core.section import StationSection
from core.units import show

PT_MM = 25.4 / 72.0  # paper millimetres per point


def nice(x: float) -> float:
    """The largest of 1, 2, 5 x 10^k not above ``x`` (x > 0)."""
    k = math.floor(math.log10(x))
    for m in (5, 2, 1):
        if m * 10**k <= x:
            return m * 10**k
    return 10**k


def section_bounds(st: StationSection) -> tuple[float, float, float, float]:
    r = st.gross.pieces.rects
    return (float(r[:, 0].min()), float(r[:, 1].min()), float(r[:, 2].max()), float(r[:, 3].max()))


def hole_cuts(st: StationSection) -> np.ndarray:
    """Rectangles of material each rivet hole passes through (mm), clipped to the parts."""
    defn = st.definition
    if not defn.rivet_lines:
        return np.zeros((0, 4))
    holes = hole_rects(defn)
    ids = [p.id for p in defn.parts]
    pc = st.gross.pieces
    out = []
    for line, h in zip(defn.rivet_lines, holes, strict=True):
        sel = np.isin(pc.owner, [ids.index(p) for p in line.parts])
        r = pc.rects[sel]
        x0, y0 = np.maximum(r[:, 0], h[0]), np.maximum(r[:, 1], h[1])
        x1, y1 = np.minimum(r[:, 2], h[2]), np.minimum(r[:, 3], h[3])
        ok = (x1 - x0 > 1e-6) & (y1 - y0 > 1e-6)
        out.append(np.stack([x0[ok], y0[ok], x1[ok], y1[ok]], axis=1))
    return np.concatenate(out) if out else np.zeros((0, 4))


def perforation_rects(st: StationSection) -> list[tuple[float, float, float, float]]:
    """Section rectangles of the perforations through plates (mm)."""
    out = []
    for p in st.loss.perforations:
        part = st.definition.part(p.part)
        if isinstance(part, Plate):
            out.append(part.rect(part.t, p.lo, p.hi))
    return out


class _Map:
    """mm of the section window -> points of the drawing."""

    def __init__(self, window, box) -> None:
        wx0, wy0, wx1, wy1 = window
        bx0, by0, bx1, by1 = box
        self.s = min((bx1 - bx0) / (wx1 - wx0), (by1 - by0) / (wy1 - wy0))
        # centre the window in the box
        self.ox = bx0 + 0.5 * ((bx1 - bx0) - self.s * (wx1 - wx0)) - self.s * wx0
        self.oy = by0 + 0.5 * ((by1 - by0) - self.s * (wy1 - wy0)) - self.s * wy0
        self.window = window

    def x(self, v):
        return self.ox + self.s * v

    def y(self, v):
        return self.oy + self.s * v

    def rects(self, r: np.ndarray, **style) -> list[Rect]:
        wx0, wy0, wx1, wy1 = self.window
        r = np.asarray(r, dtype=float).reshape(-1, 4)
        c = np.column_stack(
            [
                np.clip(r[:, 0], wx0, wx1),
                np.clip(r[:, 1], wy0, wy1),
                np.clip(r[:, 2], wx0, wx1),
                np.clip(r[:, 3], wy0, wy1),
            ]
        )
        out = []
        for x0, y0, x1, y1 in c:
            if x1 - x0 > 0 and y1 - y0 > 0:
                w, h = max(self.s * (x1 - x0), 0.15), max(self.s * (y1 - y0), 0.15)
                out.append(Rect(self.x(x0), self.y(y0), w, h, **style))
        return out


def _outline(m: _Map, st: StationSection, width: float) -> list:
    """Thin outline of every part of the section, clipped to the window."""
    box = shapely.box(*m.window)
    out = []
    for poly in st.gross.pieces.outlines().values():
        g = shapely.intersection(poly, box)
        for p in getattr(g, "geoms", [g]):
            if p.is_empty or p.geom_type != "Polygon":
                continue
            for ring in [p.exterior, *p.interiors]:
                pts = []
                for x, y in ring.coords:
                    pts += [m.x(x), m.y(y)]
                out.append(PolyLine(pts, strokeColor=INK, strokeWidth=width, fillColor=None))
    return out


def _scale_bar(m: _Map, x: float, y: float, room: float, system: str) -> list:
    f = show(1.0, "length", system)
    length = nice(room / m.s * f.value)
    w = length / f.value * m.s
    out = [
        Rect(x, y, w / 2, 2.2, fillColor=INK, strokeColor=INK, strokeWidth=0.4),
        Rect(x + w / 2, y, w / 2, 2.2, fillColor=HOLE, strokeColor=INK, strokeWidth=0.4),
        String(x, y + 4, "0", fontName=SANS, fontSize=6, fillColor=INK, textAnchor="middle"),
        String(
            x + w,
            y + 4,
            f"{num(length, 3)} {f.symbol}",
            fontName=SANS,
            fontSize=6,
            fillColor=INK,
            textAnchor="middle",
        ),
    ]
    ratio = 1.0 / (m.s * PT_MM)
    out.append(
        String(
            x + w + 14,
            y,
            f"≈ 1:{num(ratio, 2)} printed",
            fontName=SANS,
            fontSize=5.5,
            fillColor=MUTED,
        )
    )
    return out


def _rotated(x: float, y: float, s: str, size: float = 6) -> Group:
    g = Group(String(0, 0, s, fontName=SANS, fontSize=size, fillColor=INK, textAnchor="middle"))
    g.transform = (0, 1, -1, 0, x, y)
    return g


def _dimensions(m: _Map, bounds, system: str) -> list:
    x0, y0, x1, y1 = bounds
    out = []
    dx = m.x(x0) - 9
    out += [
        Line(dx, m.y(y0), dx, m.y(y1), strokeColor=INK, strokeWidth=0.4),
        Line(dx - 2, m.y(y0), dx + 2, m.y(y0), strokeColor=INK, strokeWidth=0.4),
        Line(dx - 2, m.y(y1), dx + 2, m.y(y1), strokeColor=INK, strokeWidth=0.4),
    ]
    d = show(y1 - y0, "length", system)
    out.append(_rotated(dx - 2.5, 0.5 * (m.y(y0) + m.y(y1)), f"{num(d.value, 4)} {d.symbol}"))
    dy = m.y(y1) + 6
    out += [
        Line(m.x(x0), dy, m.x(x1), dy, strokeColor=INK, strokeWidth=0.4),
        Line(m.x(x0), dy - 2, m.x(x0), dy + 2, strokeColor=INK, strokeWidth=0.4),
        Line(m.x(x1), dy - 2, m.x(x1), dy + 2, strokeColor=INK, strokeWidth=0.4),
    ]
    b = show(x1 - x0, "length", system)
    out.append(
        String(
            0.5 * (m.x(x0) + m.x(x1)),
            dy + 2.5,
            f"{num(b.value, 4)} {b.symbol}",
            fontName=SANS,
            fontSize=6,
            fillColor=INK,
            textAnchor="middle",
        )
    )
    return out


def section_drawing(
    built: StationSection,
    found: StationSection | None,
    system: str,
    width: float,
    height: float,
    *,
    title: str = "",
    window: tuple[float, float, float, float] | None = None,
) -> Drawing:
    """One cross-section drawn to scale in a ``width`` x ``height`` point box.

    Args:
        built: the as-built station section (outline, and the material when ``found`` is None).
        found: the as-found section, or None for the as-built drawing.
        system: "si" or "us" (scale bar and dimensions).
        title: caption drawn above the section.
        window: the part of the section to draw (mm); None draws all of it with its
            overall dimensions.
    """
    d = Drawing(width, height)
    bounds = section_bounds(built)
    detail = window is not None
    win = window or bounds
    top_room = 22 if title else 8
    box = (
        4 if detail else 20,
        22,
        width - 4,
        height - top_room - (0 if detail else 10),
    )
    m = _Map(win, box)
    if title:
        d.add(drawing_title(width, height, title))
    shown = found or built
    if found is not None:
        for r in m.rects(built.gross.pieces.rects, fillColor=LOSS, strokeColor=None):
            d.add(r)
    for r in m.rects(shown.gross.pieces.rects, fillColor=STEEL, strokeColor=None):
        d.add(r)
    for r in m.rects(hole_cuts(shown), fillColor=HOLE, strokeColor=STEEL_DARK, strokeWidth=0.3):
        d.add(r)
    for ln in built.definition.rivet_lines:
        cut = hole_cuts_line(shown, ln.id)
        if cut is None:
            continue
        x0, y0, x1, y1 = cut
        style = {"strokeColor": INK, "strokeWidth": 0.3, "strokeDashArray": [3, 1, 0.6, 1]}
        a0, a1 = (x0, x1) if ln.axis == "horizontal" else (y0, y1)
        w0, w1 = (win[0], win[2]) if ln.axis == "horizontal" else (win[1], win[3])
        c0, c1 = max(a0, w0), min(a1, w1)
        k = (win[1], win[3]) if ln.axis == "horizontal" else (win[0], win[2])
        if c1 <= c0 or not k[0] <= ln.position <= k[1]:
            continue
        ext = 2.0 / m.s  # 2 pt beyond the material, inside the window
        c0, c1 = max(c0 - ext, w0), min(c1 + ext, w1)
        if ln.axis == "horizontal":
            yy = m.y(ln.position)
            d.add(Line(m.x(c0), yy, m.x(c1), yy, **style))
        else:
            xx = m.x(ln.position)
            d.add(Line(xx, m.y(c0), xx, m.y(c1), **style))
    for g in _outline(m, built, 0.45 if found is not None else 0.3):
        d.add(g)
    if found is not None:
        for pr in perforation_rects(found):
            for r in m.rects(np.array([pr]), fillColor=None, strokeColor=PERF, strokeWidth=1.0):
                d.add(r)
                d.add(
                    String(
                        r.x + r.width + 2,
                        r.y + r.height / 2 - 2,
                        "P",
                        fontName=SANS_BOLD,
                        fontSize=6.5,
                        fillColor=PERF,
                    )
                )
    if not detail:
        for g in _dimensions(m, bounds, system):
            d.add(g)
    for g in _scale_bar(m, 6, 6, 0.3 * (box[2] - box[0]), system):
        d.add(g)
    return d


def hole_cuts_line(st: StationSection, line_id: str):
    """Extent (mm) of the material one rivet line passes through, or None."""
    defn = st.definition
    ids = [ln.id for ln in defn.rivet_lines]
    if line_id not in ids:
        return None
    line = defn.rivet_lines[ids.index(line_id)]
    b = np.array([defn.part(p).bounds for p in line.parts])
    h = hole_rects(defn)[ids.index(line_id)]
    if line.axis == "horizontal":
        sel = (b[:, 1] <= h[3]) & (b[:, 3] >= h[1])
    else:
        sel = (b[:, 0] <= h[2]) & (b[:, 2] >= h[0])
    if not sel.any():
        return None
    b = b[sel]
    return (b[:, 0].min(), b[:, 1].min(), b[:, 2].max(), b[:, 3].max())


def flange_windows(st: StationSection) -> list[tuple[str, tuple[float, float, float, float]]]:
    """Detail windows (mm) over the top and bottom flanges: the parts other than the deepest
    plate (the web), extended a little into the web. Empty when there is no such flange."""
    defn = st.definition
    _, y0, _, y1 = section_bounds(st)
    depth = y1 - y0
    web = max(defn.parts, key=lambda p: p.bounds[3] - p.bounds[1])
    others = [p.bounds for p in defn.parts if p is not web]
    mid = 0.5 * (y0 + y1)
    out = []
    for name, sel in (
        ("top", [b for b in others if 0.5 * (b[1] + b[3]) > mid]),
        ("bottom", [b for b in others if 0.5 * (b[1] + b[3]) <= mid]),
    ):
        if not sel:
            continue
        lo, hi = min(b[1] for b in sel), max(b[3] for b in sel)
        if hi - lo > 0.6 * depth:
            continue
        ext = 0.45 * (hi - lo)
        lo, hi = (lo - ext, hi + 2) if name == "top" else (lo - 2, hi + ext)
        bx0, bx1 = min(b[0] for b in sel), max(b[2] for b in sel)
        pad = 0.03 * (bx1 - bx0)
        out.append((name, (bx0 - pad, max(lo, y0 - 2), bx1 + pad, min(hi, y1 + 2))))
    return out
