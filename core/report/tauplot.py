"""Shear stress over the depth, tau = V Q / (I t), as-built and as-found on one plot.

Height runs up the plot (as on the section drawing) and tau across. The curves come from
:meth:`core.shear.ShearProfile.curve`, which gives both sides of every width change, so the
jumps at the flange angles and loss bands show as horizontal steps.
"""

from __future__ import annotations

import math

from reportlab.graphics.shapes import Drawing, Line, PolyLine, Rect, String

from core.report.fmt import num, tick
from core.report.styles import (
    ACCENT,
    INK,
    MUTED,
    PERF,
    RULE,
    SANS,
    SANS_BOLD,
    STEEL_DARK,
    drawing_title,
    text,
)
from core.section import StationSection
from core.units import show

N_POINTS = 240


def ticks(lo: float, hi: float, n: int = 5) -> list[float]:
    """About ``n`` round tick values covering [lo, hi]."""
    span = hi - lo
    if span <= 0:
        return [lo]
    raw = span / n
    k = math.floor(math.log10(raw))
    step = min((m * 10**k for m in (1, 2, 2.5, 5, 10) if m * 10**k >= raw), default=10 ** (k + 1))
    first = math.ceil(lo / step - 1e-9) * step
    out = []
    v = first
    while v <= hi + 1e-9 * step:
        out.append(round(v, 10))
        v += step
    return out


def tau_plot(
    built: StationSection,
    found: StationSection,
    V: float,
    system: str,
    width: float,
    height: float,
    *,
    title: str = "",
) -> Drawing:
    """The plot in a ``width`` x ``height`` point box.

    Args:
        V: shear force (N) the stresses are computed for.
        system: "si" or "us" for the axes' units.
    """
    d = Drawing(width, height)
    fs = show(1.0, "stress", system)
    fl = show(1.0, "length", system)
    curves = [("as-built", built, STEEL_DARK, 0.8, [2, 1.5])]
    if found.shear_applicable:
        curves.append(("as-found", found, ACCENT, 1.3, None))
    data = []
    for name, st, colour, lw, dash in curves:
        y, tau = st.gross.profile.curve(V, N_POINTS)
        data.append((name, y * fl.value, tau * fs.value, colour, lw, dash, st))
    ymin = min(float(c[1].min()) for c in data)
    ymax = max(float(c[1].max()) for c in data)
    tmax = max(float(abs(c[2]).max()) for c in data) or 1.0
    left, right, bottom, top = 34, width - 8, 26, height - (20 if title else 8) - 22
    xt = ticks(0.0, tmax * 1.08, 4)
    xhi = max(xt[-1], tmax * 1.08)
    yt = ticks(ymin, ymax, 5)

    def X(v):
        return left + (right - left) * v / xhi

    def Y(v):
        return bottom + (top - bottom) * (v - ymin) / ((ymax - ymin) or 1.0)

    if title:
        d.add(drawing_title(width, height, title))
    d.add(Rect(left, bottom, right - left, top - bottom, fillColor=None, strokeColor=RULE))
    for v in xt:
        d.add(Line(X(v), bottom, X(v), top, strokeColor=RULE, strokeWidth=0.3))
        d.add(String(X(v), bottom - 8, tick(v), fontName=SANS, fontSize=6, textAnchor="middle"))
    for v in yt:
        d.add(Line(left, Y(v), right, Y(v), strokeColor=RULE, strokeWidth=0.3))
        d.add(String(left - 3, Y(v) - 2, tick(v), fontName=SANS, fontSize=6, textAnchor="end"))
    d.add(
        String(
            (left + right) / 2,
            bottom - 17,
            text(f"τ ({fs.symbol})"),
            fontName=SANS,
            fontSize=6.5,
            textAnchor="middle",
            fillColor=INK,
        )
    )
    d.add(String(2, top + 4, f"height ({fl.symbol})", fontName=SANS, fontSize=6, fillColor=MUTED))
    for _name, y, tau, colour, lw, dash, _st in data:
        pts = []
        for yi, ti in zip(y, tau, strict=True):
            pts += [X(abs(ti)), Y(yi)]
        d.add(
            PolyLine(
                pts, strokeColor=colour, strokeWidth=lw, strokeDashArray=dash, strokeLineJoin=1
            )
        )
    # maxima, and the legend above the plot
    ly = top + 14
    lx = left + 40
    for name, _y, _tau, colour, lw, dash, st in data:
        t, yh = st.gross.profile.tau_max(V)
        tv, yv = t * fs.value, yh * fl.value
        d.add(Rect(X(tv) - 1.6, Y(yv) - 1.6, 3.2, 3.2, fillColor=colour, strokeColor=None))
        d.add(
            Line(
                lx,
                ly + 2,
                lx + 14,
                ly + 2,
                strokeColor=colour,
                strokeWidth=lw,
                strokeDashArray=dash,
            )
        )
        d.add(
            String(
                lx + 17,
                ly,
                text(f"{name}: τmax {num(tv, 4)} {fs.symbol} at {num(yv, 4)} {fl.symbol} (■)"),
                fontName=SANS,
                fontSize=6,
                fillColor=INK,
            )
        )
        ly -= 8
    if not found.shear_applicable:
        d.add(
            String(
                lx + 17,
                ly,
                "as-found: not applicable, the section is in pieces (VQ/It)",
                fontName=SANS_BOLD,
                fontSize=6,
                fillColor=PERF,
            )
        )
    return d
