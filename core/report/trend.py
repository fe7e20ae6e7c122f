"""The trend report: repeat surveys, the corrosion model, and per member a plot of thickness
and of the family's measure over the years, the years each limit state crosses 1 and the
flag thresholds, and the loss rate of every part region.

The cautions open the report and the footer of every page carries them
(:mod:`core.report.page`). The output is checked first (:mod:`core.outputs`: never an input,
a store or a survey file) and written to a temporary file renamed into place.
"""

from __future__ import annotations

from pathlib import Path

from reportlab.platypus import KeepTogether, PageBreak, Paragraph, Spacer, Table

from core import CAUTION
from core.outputs import atomic_output, check_output
from core.report.fmt import num
from core.report.page import PageInfo, canvas_maker, document
from core.report.source import checksum
from core.report.styles import MARGIN, Markup, Styles, esc, make_table_style, page_size
from core.report.trendplot import Curve, time_plot
from core.trend.crossing import ALREADY, CROSSES
from core.trend.errors import TrendError
from core.trend.export import crossing_words, method_statement, model_statement
from core.trend.run import Tracked, TrendResult
from core.units import display_unit, from_internal, symbol

#: narrowest column of one survey's values in the trend tables, pt (common practice, no source)
MIN_DATE_COL = 24.0


def _head(h: str) -> str:
    """A header cell's markup: survey text escaped, our own markup kept."""
    return h if isinstance(h, Markup) else esc(h)


def _checksum(r: TrendResult) -> str:
    data = b"".join(Path(f).read_bytes() for f in r.series.files if Path(f).is_file())
    return checksum(data)


def _first(t: Tracked, target: float) -> float:
    """Years to the crossing of ``target`` for sorting (already: 0; none: infinity)."""
    c = t.crossing(target)
    if c.status == ALREADY:
        return 0.0
    return c.dt if c.status == CROSSES and c.dt is not None else float("inf")


def _critical(r: TrendResult, member: str) -> tuple[str, str] | None:
    """The station of ``member`` where a limit state is first projected to cross 1 (one
    already below is in the table), else the one with the worst measure; and why, in words."""
    ts = [t for t in r.tracked if t.member == member]
    if not ts:
        return None
    ahead = [t for t in ts if t.crossing(1.0).status == CROSSES]
    if ahead:
        best = min(ahead, key=lambda t: _first(t, 1.0))
        y = r.y_last + (best.crossing(1.0).dt or 0.0)
        why = (
            f"Plotted: station {best.station}, where a limit state ({best.name}) is the "
            f"first of this member projected to reach {r.symbol} = 1, in {y:.1f}."
        )
        return best.station, why
    best = min(ts, key=_badness)
    why = (
        f"Plotted: station {best.station}, with this member's worst {r.symbol} at the latest "
        f"survey ({best.name}); no limit state is projected to cross 1 within the horizon."
    )
    return best.station, why


def _badness(t: Tracked) -> float:
    v = t.at_dates[-1]
    if v is None:
        return float("inf")
    return v if t.higher_is_better else -v


def _points(r: TrendResult, values) -> tuple[tuple[float, float], ...]:
    """(year, value) of the steps with a value, up to the first step without one."""
    out = []
    for dt, v in zip(r.dts, values, strict=False):
        if v is None:
            break
        out.append((r.y_last + dt, v))
    return tuple(out)


def _plots(st: Styles, r: TrendResult, member: str, station: str, system: str, width: float):
    L = display_unit("length", system)
    regions = [rs for rs in r.series.regions if rs.member == member and rs.station == station]
    end = r.y_last + r.horizon
    curves = []
    t_hi = 0.0
    for rs in regions:
        conv = from_internal(1.0, "length", L)
        meas = tuple((y, t * conv) for y, t in zip(rs.years, rs.t, strict=True))
        proj = tuple((r.y_last + dt, r.projected_t(rs, dt) * conv) for dt in r.dts)
        t_hi = max(t_hi, rs.t_nominal * conv, *(v for _y, v in meas))
        edges = ()
        if r.rate_of(rs).has_band:
            edges = tuple(
                tuple((r.y_last + dt, r.projected_t(rs, dt, sc) * conv) for dt in r.dts)
                for sc in ("fast", "slow")
            )
        curves.append(Curve(rs.label, meas, proj, edges))
    x0 = min(r.series.years) - 1
    h = 190.0
    out = [
        time_plot(
            curves,
            width,
            h,
            title=f"Member {member}, station {station}: thickness of each part region",
            ylabel=f"thickness ({symbol(L)})",
            y_range=(0.0, t_hi * 1.05 or 1.0),
            x_range=(x0, end),
            now=r.y_last,
        )
    ]
    ts = [t for t in r.tracked if t.member == member and t.station == station]
    top = max(tg.value for tg in r.targets) * 1.6
    shown, hidden = [], []
    for t in ts:
        latest = t.at_dates[-1]
        if latest is not None and latest <= top:
            shown.append(t)
        else:
            hidden.append(t)
    curves = []
    for t in shown:
        meas = tuple(
            (y, v) for y, v in zip(r.series.years, t.at_dates, strict=True) if v is not None
        )
        proj = _points(r, t.projected)
        edges = tuple(_points(r, e) for e in (t.fast, t.slow) if e)
        curves.append(Curve(t.name, meas, proj, edges))
    out.append(Spacer(1, 4))
    out.append(
        time_plot(
            curves,
            width,
            h,
            title=f"Member {member}, station {station}: {r.measure} {r.symbol} of each limit state",
            ylabel=r.symbol,
            y_range=(0.0, top),
            x_range=(x0, end),
            now=r.y_last,
            lines=[(tg.value, f"{tg.label} ({tg.value:g})") for tg in r.targets],
        )
    )
    words = (
        "Points: as assessed at each survey date; dashed: projected by the engine "
        f"every {r.step:g} years (central rates)"
        + (
            "; dotted: every rate one standard error faster and slower"
            if r.steps.keys() - {"central"}
            else ""
        )
        + ". A curve of the rating ends where its station's projection ends (a region lost)."
    )
    if hidden:
        words += " Not drawn (above the plot's range at the latest survey): " + ", ".join(
            f"{t.name} ({num(t.at_dates[-1], 3)})" for t in hidden
        )
    out.append(Paragraph(esc(words), st.caption))
    return out


def _crossing_table(st: Styles, r: TrendResult, member: str, width: float) -> Table:
    n = len(r.series.surveys)
    head = [
        "station",
        "limit state",
        *(
            Markup(f'{esc(r.symbol)}<br/><font size="6.4">{d.isoformat()}</font>')
            for d in r.series.dates
        ),
        *(f"year: {t.label} ({t.value:g})" for t in r.targets),
    ]
    rows = [[Paragraph(_head(h), st.head) for h in head]]
    for t in r.tracked:
        if t.member != member:
            continue
        rows.append(
            [
                Paragraph(esc(t.station), st.cell),
                Paragraph(esc(t.name), st.cell),
                *(Paragraph(esc(num(v, 3)), st.cell_num) for v in t.at_dates),
                *(Paragraph(esc(crossing_words(r, c)), st.cell) for c in t.crossings),
            ]
        )
    dw = _date_width(width - 38 - 90 - 56 * len(r.targets), n)
    fixed = 38 + dw * n
    rest = width - fixed
    lsw = min(110.0, rest * 0.28)
    cw = (rest - lsw) / len(r.targets)
    widths = [38, lsw, *([dw] * n), *([cw] * len(r.targets))]
    return Table(rows, colWidths=widths, repeatRows=1, style=make_table_style(zebra=True))


def _rate_table(st: Styles, r: TrendResult, member: str, system: str, width: float) -> list:
    """The loss rate table of a member, and a line naming the fit (one column per method
    only when they differ) and any region whose fit shows thickening."""
    L = display_unit("length", system)
    u = symbol(L)
    c = from_internal(1.0, "length", L)
    dig = 3 if system == "us" else 2
    pairs = [
        (rs, rt) for rs, rt in zip(r.series.regions, r.rates, strict=True) if rs.member == member
    ]
    methods = sorted({rt.method for _rs, rt in pairs})
    one = len(methods) == 1
    us = system == "us"
    head = [
        "station",
        "part region",
        *(
            Markup(f't ({esc(u)})<br/><font size="6.4">{d.isoformat()}</font>')
            for d in r.series.dates
        ),
        f"loss rate ({u}/year)",
        *(["the same (mm/year)"] if us else []),
        *([] if one else ["from"]),
        f"t in {r.horizon / 5:g} yr",
        f"t in {r.horizon:g} yr",
    ]
    rows = [[Paragraph(_head(h), st.head) for h in head]]
    thick = []
    for rs, rt in pairs:
        by_year = dict(zip(rs.years, rs.t, strict=True))
        rate = f"{rt.r * c:.{dig + 2}f}" + ("" if rt.se is None else f" ± {rt.se * c:.{dig + 2}f}")
        mm = f"{rt.r:.3f}" + ("" if rt.se is None else f" ± {rt.se:.3f}")
        if not rt.has_rate:  # never a zero that reads as "no loss"
            rate = mm = "no rate"
        if "thickening" in rt.note:
            thick.append(f"{rs.station} {rs.label}")
        far = r.projected_t(rs, r.horizon) * c
        cells = [
            (rs.station, st.cell),
            (rs.label, st.cell),
            *(
                ("–" if y not in by_year else f"{by_year[y] * c:.{dig}f}", st.cell_num)
                for y in r.series.years
            ),
            (rate, st.cell_num),
            *([(mm, st.cell_num)] if us else []),  # corrosion studies give mm/year
            *([] if one else [(rt.method, st.cell)]),
            (f"{r.projected_t(rs, r.horizon / 5) * c:.{dig}f}", st.cell_num),
            ("lost" if far <= 0 else f"{far:.{dig}f}", st.cell_num),
        ]
        rows.append([Paragraph(esc(v), sty) for v, sty in cells])
    n = len(r.series.surveys)
    tail = [*([62] if us else []), *([] if one else [70]), 44, 44]
    dw = _date_width(width - 36 - 84 - sum(tail) - 90, n)
    widths = [36, 0, *([dw] * n), 84, *tail]
    widths[1] = width - sum(widths)
    out: list = [Table(rows, colWidths=widths, repeatRows=1, style=make_table_style(zebra=True))]
    words = f"Every rate of this member: {methods[0]}." if one else ""
    if thick:
        words += (
            " The fit shows thickening (measurement scatter), no further loss projected: "
            + ", ".join(thick)
            + "."
        )
    if words:
        out.append(Paragraph(esc(words.strip()), st.caption))
    return out


def story(r: TrendResult, system: str, width: float) -> list:
    st = Styles()
    s = r.series
    out: list = [
        Paragraph(esc("Trend of repeat surveys"), st.title),
        Paragraph(esc(s.structure), st.subtitle),
        Paragraph(esc(CAUTION), st.caution),
        Spacer(1, 6),
    ]
    rows = [[Paragraph(esc(h), st.head) for h in ("date", "survey", "title", "inspector", "file")]]
    for f, sv, d in zip(s.files, s.surveys, s.dates, strict=True):
        h = sv.survey
        rows.append(
            [
                Paragraph(esc(x), st.cell)
                for x in (d.isoformat(), h.id, h.title, h.inspector, Path(f).name)
            ]
        )
    out.append(
        Table(
            rows,
            colWidths=[52, 70, width * 0.34, width * 0.2, width - 122 - width * 0.54],
            style=make_table_style(),
        )
    )
    out.append(Spacer(1, 6))
    out.append(
        Paragraph(esc(f"Standard family: {r.family}. Measure: {r.measure} ({r.symbol})."), st.body)
    )
    out.append(Paragraph(esc(model_statement(r)), st.body))
    out += [Paragraph("• " + esc(line), st.body) for line in method_statement(r)]
    out.append(
        Paragraph(
            esc(
                "Targets: the measure 1 and the engineer's flag thresholds ("
                + "; ".join(f"{t.label}: {t.value:g}" for t in r.targets)
                + "). 'already': crossed at the latest survey; 'after YEAR': not within the "
                "horizon; 'not before YEAR': the projection of that station ended first."
            ),
            st.body,
        )
    )
    if r.notes:
        out.append(Paragraph("Notes", st.h2))
        out += [Paragraph(esc(n), st.small) for n in r.notes]
    members = list(dict.fromkeys(sm.member for sm in s.stations))
    for m in members:
        out.append(PageBreak())
        label = s.latest.member(m).label
        out.append(Paragraph(esc(f"Member {m} {label}".strip()), st.h1))
        crit = _critical(r, m)
        if crit is not None:
            out.append(Paragraph(esc(crit[1]), st.body))
            out.append(KeepTogether(_plots(st, r, m, crit[0], system, width)))
        out.append(Paragraph(esc(f"When the {r.measure} crosses 1 and the thresholds"), st.h2))
        if any(t.member == m for t in r.tracked):
            out.append(_crossing_table(st, r, m, width))
        else:
            out.append(Paragraph(esc("No limit state of this member is rated."), st.body))
        out.append(Paragraph(esc("Loss rate per part region"), st.h2))
        if any(rs.member == m for rs in s.regions):
            out += _rate_table(st, r, m, system, width)
        else:
            out.append(Paragraph(esc("No part region was read at the matched stations."), st.body))
    return out


def write_trend_report(r: TrendResult, out: str | Path, system: str, *, force: bool = False) -> int:
    """Write the trend report to ``out`` (atomically); returns its page count.

    Raises:
        OutputError: ``out`` is an input, a store, a survey file or (without ``force``) a
        file asfound did not write.
    """
    out = check_output(out, list(r.series.files), "pdf", force=force)
    size = page_size(system)
    s = r.series
    ident = f"trend {s.surveys[0].survey.id} to {s.latest.survey.id}"
    info = PageInfo(ident, s.structure, _checksum(r), r.family)
    with atomic_output(out) as tmp:
        doc = document(str(tmp), size, info)
        doc.build(story(r, system, size[0] - 2 * MARGIN), canvasmaker=canvas_maker(info))
    return info.pages


def _date_width(room: float, n: int) -> float:
    """The width of each of ``n`` survey columns in ``room`` pt: 50, or narrower to fit.

    Raises:
        TrendError: the surveys do not fit the page even at :data:`MIN_DATE_COL`.
    """
    w = min(50.0, room / n)
    if w < MIN_DATE_COL:
        raise TrendError(
            f"{n} surveys do not fit one page's trend table (at most "
            f"{max(2, int(room // MIN_DATE_COL))} here); give fewer surveys, or --json for all"
        )
    return w
