"""The whole span at a glance (vector drawing): for each limit state along the member, the
factored capacity as-built and as-found with its band from the readings (5 % to 95 %), and
the factored demand; the member's governing station and limit state marked.

One small panel per limit state (its own unit); each curve has its colour, dash and marker
and is named in the legend under the panels (never colour alone).
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

from reportlab.graphics.shapes import Circle, Drawing, Line, Polygon, PolyLine, Rect, String
from reportlab.lib import colors

from core.assess.results import MemberResult
from core.bands.run import MemberBands
from core.names import readable
from core.report.fmt import tick
from core.report.styles import ACCENT, INK, MUTED, PERF, RULE, SANS, SANS_BOLD, STEEL_DARK, text
from core.report.tauplot import ticks
from core.units import display_unit, from_internal, symbol

BAND_FILL = colors.Color(0.17, 0.37, 0.54, alpha=0.18)
#: most panels drawn (the limit states with the worst measure first)
MAX_PANELS = 6


@dataclass(frozen=True)
class Series:
    """One limit state along the member, in display units: per station x, as-built and
    as-found capacity, the band's 5 % and 95 % values (None: no band) and the demand."""

    key: str
    name: str
    unit: str
    x: tuple[float, ...]
    built: tuple[float | None, ...]
    found: tuple[float | None, ...]
    lo: tuple[float | None, ...]
    hi: tuple[float | None, ...]
    demand: tuple[float | None, ...]
    worst: float  # the worst measure's badness over the member (lower is worse)


def member_series(m: MemberResult, mb: MemberBands | None, system: str) -> list[Series]:
    """The limit states found at two stations or more (not the components of a least), the
    worst first."""
    P = display_unit("position", system)
    by_station = {s.station: s for s in (mb.stations if mb else ())}
    keys: dict[str, list] = {}
    for s in m.stations:
        for ls in s.limit_states:
            if ls.part_of is None and ls.C_found is not None:
                keys.setdefault(ls.key, []).append((s, ls))
    out = []
    for key, items in keys.items():
        if len(items) < 2:
            continue
        kind = items[0][1].kind
        u = display_unit(kind, system)

        def c(v, kind=kind, u=u):
            return None if v is None else from_internal(v, kind, u)

        lo, hi, worst = [], [], float("inf")
        for s, ls in items:
            sb = by_station.get(s.station)
            b = sb.band(key, "C") if sb else None
            lo.append(c(b.p5) if b else None)
            hi.append(c(b.p95) if b else None)
            if ls.rating is not None:
                worst = min(worst, ls.rating.badness)
        out.append(
            Series(
                key,
                readable(items[0][1].name),
                symbol(u),
                tuple(from_internal(s.x, "position", P) for s, _ in items),
                tuple(c(ls.C_built) for _, ls in items),
                tuple(c(ls.C_found) for _, ls in items),
                tuple(lo),
                tuple(hi),
                tuple(c(ls.demand) for _, ls in items),
                worst,
            )
        )
    out.sort(key=lambda s: s.worst)
    return out


def _pts(xs: Sequence[float], ys: Sequence[float | None], X, Y) -> list[float]:
    return [p for x, y in zip(xs, ys, strict=True) if y is not None for p in (X(x), Y(y))]


def _panel(d: Drawing, s: Series, x0: float, y0: float, w: float, h: float,
           span: float, gov_x: float | None, governs: bool) -> None:  # fmt: skip
    left, right, bottom, top = x0 + 30, x0 + w - 6, y0 + 14, y0 + h - 14
    vals = [v for seq in (s.built, s.found, s.lo, s.hi, s.demand) for v in seq if v is not None]
    vmax = max(vals) if vals else 1.0
    vmin = min(0.0, min(vals)) if vals else 0.0
    vmax = vmax * 1.05 if vmax > 0 else 1.0

    def X(v: float) -> float:
        return left + (right - left) * v / (span or 1.0)

    def Y(v: float) -> float:
        return bottom + (top - bottom) * (min(max(v, vmin), vmax) - vmin) / ((vmax - vmin) or 1.0)

    title = s.name if len(s.name) <= 44 else s.name[:43] + "…"
    d.add(String(x0 + 2, y0 + h - 8, text(f"{title} ({s.unit})"),
                 fontName=SANS_BOLD if governs else SANS, fontSize=6.2, fillColor=INK))  # fmt: skip
    d.add(Rect(left, bottom, right - left, top - bottom, fillColor=None, strokeColor=RULE))
    for v in ticks(vmin, vmax, 3):
        d.add(Line(left, Y(v), right, Y(v), strokeColor=RULE, strokeWidth=0.3))
        d.add(String(left - 2, Y(v) - 2, tick(v), fontName=SANS, fontSize=5.2, textAnchor="end"))
    for v in ticks(0.0, span, 4):
        d.add(String(X(v), bottom - 7, f"{v:g}", fontName=SANS, fontSize=5.2, textAnchor="middle"))
    if gov_x is not None:
        d.add(Line(X(gov_x), bottom, X(gov_x), top, strokeColor=PERF, strokeWidth=0.5,
                   strokeDashArray=[1, 1.5]))  # fmt: skip
    # the band: a closed polygon over the stations that have one
    band = [(x, a, b) for x, a, b in zip(s.x, s.lo, s.hi, strict=True) if a is not None]
    if len(band) >= 2:
        poly = [p for x, a, _ in band for p in (X(x), Y(a))]
        poly += [p for x, _, b in reversed(band) for p in (X(x), Y(b))]
        d.add(Polygon(poly, fillColor=BAND_FILL, strokeColor=None))
    for x, a, b in band:
        d.add(Line(X(x), Y(a), X(x), Y(b), strokeColor=ACCENT, strokeWidth=0.6))
    built = _pts(s.x, s.built, X, Y)
    if len(built) >= 4:
        d.add(PolyLine(built, strokeColor=MUTED, strokeWidth=0.7, strokeDashArray=[3, 1.5]))
    found = _pts(s.x, s.found, X, Y)
    if len(found) >= 4:
        d.add(PolyLine(found, strokeColor=ACCENT, strokeWidth=0.9))
    for i in range(0, len(found), 2):
        d.add(Circle(found[i], found[i + 1], 1.4, fillColor=ACCENT, strokeColor=None))
    dem = _pts(s.x, s.demand, X, Y)
    if len(dem) >= 4:
        d.add(PolyLine(dem, strokeColor=PERF, strokeWidth=0.8, strokeDashArray=[1, 1.2]))
    for i in range(0, len(dem), 2):
        r = 1.5
        d.add(Rect(dem[i] - r, dem[i + 1] - r, 2 * r, 2 * r, fillColor=PERF, strokeColor=None))
    if governs and gov_x is not None:
        at_end = X(gov_x) > right - 30
        lx = X(gov_x) - 2 if at_end else X(gov_x) + 2
        d.add(Rect(lx - 25 if at_end else lx - 0.5, top - 7, 25.5, 6.5,
                   fillColor=colors.white, strokeColor=None))  # fmt: skip
        d.add(String(lx, top - 6, "governs", fontName=SANS_BOLD, fontSize=5.5, fillColor=PERF,
                     textAnchor="end" if at_end else "start"))  # fmt: skip


def span_plot(
    m: MemberResult,
    mb: MemberBands | None,
    system: str,
    width: float,
    *,
    gov: tuple[str, str] | None = None,
) -> Drawing:
    """The panels of the member's limit states (at most :data:`MAX_PANELS`, the worst
    first) in a ``width`` wide drawing. ``gov``: (station, limit state key) governing."""
    series = member_series(m, mb, system)[:MAX_PANELS]
    P = display_unit("position", system)
    span = from_internal(m.span, "position", P)
    ncol = 3 if width >= 420 else 2
    rows = max(1, (len(series) + ncol - 1) // ncol)
    ph, legend = 92.0, 22.0
    d = Drawing(width, rows * ph + legend)
    gx = None
    if gov is not None:
        st = next((s for s in m.stations if s.station == gov[0]), None)
        gx = None if st is None else from_internal(st.x, "position", P)
    pw = width / ncol
    for i, s in enumerate(series):
        r, c = divmod(i, ncol)
        _panel(d, s, c * pw, legend + (rows - 1 - r) * ph, pw, ph, span, gx,
               gov is not None and s.key == gov[1])  # fmt: skip
    # legend
    y = 5.0
    items = [
        ("as-built capacity", MUTED, [3, 1.5], None),
        ("as-found capacity", ACCENT, None, "circle"),
        ("band from the readings, 5 % to 95 %", BAND_FILL, None, "box"),
        ("factored demand", PERF, [1, 1.2], "square"),
        ("governing station", PERF, [1, 1.5], None),
    ]
    x = 2.0
    for label, colour, dash, mark in items:
        if mark == "box":
            d.add(Rect(x, y - 1, 12, 6, fillColor=colour, strokeColor=ACCENT, strokeWidth=0.3))
        else:
            d.add(Line(x, y + 2, x + 12, y + 2, strokeColor=colour, strokeWidth=0.9,
                       strokeDashArray=dash))  # fmt: skip
            if mark == "circle":
                d.add(Circle(x + 6, y + 2, 1.4, fillColor=colour, strokeColor=None))
            elif mark == "square":
                d.add(Rect(x + 4.5, y + 0.5, 3, 3, fillColor=colour, strokeColor=None))
        d.add(String(x + 15, y, text(label), fontName=SANS, fontSize=5.8, fillColor=INK))
        x += 15 + len(label) * 3.0 + 10
    d.add(String(2, y + 9, text(f"position along the member ({symbol(P)}) on every panel"),
                 fontName=SANS, fontSize=5.8, fillColor=STEEL_DARK))  # fmt: skip
    return d
