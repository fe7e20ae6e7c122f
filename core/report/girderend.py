"""The girder end drawn to scale: an elevation of the member's end at one support (web,
flanges, the bearing stiffener with its measured loss tinted, the bearing length under the
bottom flange, the overhang), and the bearing stiffener's plan section through its loss as
found over its as-built outline.

Material is steel grey, measured loss the rust tint, as in the section drawings
(:mod:`core.report.drawing`); every drawing has its scale bar.
"""

from __future__ import annotations

from reportlab.graphics.shapes import Drawing, Line, Rect, String
from reportlab.lib import colors

from core.assess.details import StiffenerData, SupportData
from core.assess.inputs import WebGeometry
from core.checks.stiffener_section import stiffener_section
from core.definition import SectionDefinition
from core.parts import Angle, Plate
from core.report.drawing import _Map, _scale_bar, section_drawing
from core.report.fmt import num
from core.report.styles import INK, LOSS, MUTED, SANS, STEEL, STEEL_DARK, drawing_title, text
from core.section import analyse
from core.units import show

#: the whole stiffener's measured thinning (lighter than a loss band)
LOSS_LIGHT = colors.HexColor("#f4d3b4")


def _label(x: float, y: float, s: str, anchor: str = "start", size: float = 6, colour=INK):
    return String(x, y, text(s), fontName=SANS, fontSize=size, fillColor=colour, textAnchor=anchor)


def _box(m: _Map, x0: float, y0: float, x1: float, y1: float, **style) -> Rect:
    """A rectangle from section coordinates (mm) x0..x1, y0..y1 in the drawing's points."""
    return Rect(m.x(x0), m.y(y0), m.x(x1) - m.x(x0), m.y(y1) - m.y(y0), **style)


def _len(mm: float, system: str) -> str:
    v = show(mm, "length", system)
    return f"{num(v.value, 3)} {v.symbol}"


def _levels(defn: SectionDefinition, web: WebGeometry) -> tuple[float, float, float, float]:
    """(bottom of the section, top of the bottom flange's horizontal material, bottom of
    the top flange's horizontal material, top of the section), mm."""
    ys = [b for p in defn.parts for b in (p.bounds[1], p.bounds[3])]
    lo, hi = min(ys), max(ys)

    def horizontal_top(ids) -> float:
        out = lo
        for i in ids:
            p = defn.part(i)
            if isinstance(p, Angle):
                out = max(out, min(p.y, p.y + p.dir_y * p.t) + p.t)
            elif isinstance(p, Plate) and p.orientation == "horizontal":
                out = max(out, p.bounds[3])
        return out

    def horizontal_bottom(ids) -> float:
        out = hi
        for i in ids:
            p = defn.part(i)
            if isinstance(p, Angle):
                out = min(out, max(p.y, p.y + p.dir_y * p.t) - p.t)
            elif isinstance(p, Plate) and p.orientation == "horizontal":
                out = min(out, p.bounds[1])
        return out

    return lo, horizontal_top(web.bottom_parts), horizontal_bottom(web.top_parts), hi


def elevation(
    sup: SupportData,
    defn: SectionDefinition,
    web: WebGeometry,
    span: float,
    system: str,
    width: float,
    height: float,
    knife: tuple[float, float] | None = None,
) -> Drawing:
    """The girder's end at ``sup`` in elevation (x along the member, mm; y the section's
    heights), looking at the web; ``knife`` the height range of a web loss band there."""
    d = Drawing(width, height)
    d.add(drawing_title(width, height, f"girder end at support {sup.id}, elevation"))
    y0, yb, yt, y1 = _levels(defn, web)
    depth = y1 - y0
    left_end = sup.x <= 0.5 * span
    end = sup.x - sup.overhang if left_end else sup.x + sup.overhang
    reach = max(1.3 * depth, sup.N + 2.0 * sup.overhang + 0.6 * depth)
    x_in = end + reach if left_end else end - reach
    wx0, wx1 = sorted((end, x_in))
    bear_h = max(0.06 * depth, 25.0)
    m = _Map(
        (wx0 - 0.05 * reach, y0 - 2.6 * bear_h, wx1, y1 + 0.05 * depth),
        (34, 24, width - 8, height - 22),
    )
    # web, flanges
    d.add(_box(m, wx0, yb, wx1, yt, fillColor=STEEL, strokeColor=STEEL_DARK, strokeWidth=0.4))
    for a, b in ((y0, yb), (yt, y1)):
        d.add(_box(m, wx0, a, wx1, b, fillColor=STEEL_DARK, strokeColor=INK, strokeWidth=0.4))
    if knife is not None:
        lo, hi = knife
        d.add(_box(m, wx0, lo, wx1, hi, fillColor=LOSS, strokeColor=None))
        far = (m.x(wx1) - 2, "end") if left_end else (m.x(wx0) + 2, "start")
        d.add(_label(far[0], m.y(hi) + 1.5, "web loss band", far[1], 5.5))
    # bearing
    b0, b1 = sup.x - sup.N / 2.0, sup.x + sup.N / 2.0
    d.add(_box(m, b0, y0 - bear_h, b1, y0, fillColor=MUTED, strokeColor=INK, strokeWidth=0.5))
    dy = m.y(y0 - 1.9 * bear_h)
    d.add(Line(m.x(b0), dy, m.x(b1), dy, strokeColor=INK, strokeWidth=0.4))
    for xx in (b0, b1):
        d.add(Line(m.x(xx), dy - 2, m.x(xx), dy + 2, strokeColor=INK, strokeWidth=0.4))
    d.add(
        _label(
            m.x(b1) + 3 if left_end else m.x(b0) - 3,
            dy - 2,
            f"N = {_len(sup.N, system)}",
            "start" if left_end else "end",
        )
    )
    # overhang: girder end to the bearing's centre
    if sup.overhang > 0:
        oy = m.y(y1 + 0.02 * depth) + 3
        d.add(Line(m.x(end), oy, m.x(sup.x), oy, strokeColor=INK, strokeWidth=0.4))
        d.add(
            _label(
                0.5 * (m.x(end) + m.x(sup.x)),
                oy + 2,
                f"{_len(sup.overhang, system)}",
                "middle",
                5.5,
            )
        )
    d.add(
        Line(
            m.x(sup.x),
            m.y(y0 - 2.3 * bear_h),
            m.x(sup.x),
            m.y(y1),
            strokeColor=INK,
            strokeWidth=0.3,
            strokeDashArray=[4, 1.5, 1, 1.5],
        )
    )
    st = sup.stiffener
    if st is not None:
        e = st.engine
        foot = (e.b_conn * e.per_side) if e.kind == "angles" else e.t
        s0, s1 = st.x - foot / 2.0, st.x + foot / 2.0
        d.add(_box(m, s0, yb, s1, yt, fillColor=None, strokeColor=INK, strokeWidth=0.8))
        if st.whole:
            d.add(_box(m, s0, yb, s1, yt, fillColor=LOSS_LIGHT, strokeColor=INK, strokeWidth=0.8))
        lx = m.x(s1) + 3 if left_end else m.x(s0) - 3
        anchor = "start" if left_end else "end"
        for lo, hi in st.bands:
            a, b = yb + min(lo, yt - yb), yb + min(hi, yt - yb)
            d.add(_box(m, s0, a, s1, b, fillColor=LOSS, strokeColor=INK, strokeWidth=0.8))
            words = f"loss band {_len(lo, system)} to {_len(hi, system)}"
            d.add(_label(lx, m.y(b) + 1.5, words, anchor, 5.5))
        d.add(_label(lx, m.y(0.5 * (yb + yt)), f"stiffener {st.id}", anchor))
    else:
        d.add(_label(m.x(sup.x) + 3, m.y(0.5 * (yb + yt)), "no bearing stiffener recorded"))
    for g in _scale_bar(m, 6, 6, 0.25 * (width - 40), system):
        d.add(g)
    return d


def stiffener_plan(
    st: StiffenerData, tw: float, system: str, width: float, height: float
) -> Drawing | None:
    """The bearing stiffener's plan section at its bottom end as found (with the as-built
    outline), or None when it has no recorded loss."""
    if st.column_loss is None:
        return None
    e = st.engine
    strip = 3.0 * ((e.b_conn * e.per_side) if e.kind == "angles" else e.t)
    try:
        b = stiffener_section(e, tw=tw, strip=strip)
        f = stiffener_section(e, tw=tw, strip=strip, loss=st.bearing_loss or st.column_loss)
    except ValueError:
        return None
    built = analyse(b.definition, b.loss)
    found = analyse(f.definition, f.loss)
    return section_drawing(
        built, found, system, width, height, title=f"stiffener {st.id} in plan, bottom end as found"
    )
