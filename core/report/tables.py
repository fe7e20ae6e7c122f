"""Tables of properties, capacities, ratios and rating factors, generated from the results.

Every number is converted for display by :mod:`core.report.fmt`; each header names its
unit and each caption the unit system.
"""

from __future__ import annotations

from collections.abc import Iterable

from reportlab.platypus import Flowable, LongTable, Paragraph, Table

from core.assess.results import LimitState, MemberResult, StationResult
from core.checks.flags import Level, worst
from core.names import annotated
from core.report.cells import CellParagraph
from core.report.fmt import (
    DASH,
    pct,
    position,
    position_label,
    ratio,
    rf,
    system_name,
    unit_label,
    value,
)
from core.report.longrows import BLOCK, LongRows
from core.report.styles import (
    BAND,
    MUTED,
    Markup,
    Styles,
    cell_text,
    esc,
    level_markup,
    make_table_style,
)

#: the gross-section properties shown for a governing station, in this order
PROPS = ("A", "yc", "Ix", "Iy", "S_top", "S_bot", "Zx", "y_pna", "rx", "ry")
PROP_NAMES = {
    "A": "A, area",
    "yc": "ȳ, neutral axis height",
    "Ix": "Ix",
    "Iy": "Iy",
    "S_top": "S top fibre",
    "S_bot": "S bottom fibre",
    "Zx": "Zx, plastic modulus",
    "y_pna": "plastic neutral axis height",
    "rx": "rx",
    "ry": "ry",
}


def caption(st: Styles, what: str, system: str) -> Paragraph:
    return Paragraph(f"{esc(what)} · {system_name(system)}", st.caption)


def grid(
    st: Styles,
    header: list[str],
    rows: list[list],
    widths: list[float],
    numeric: Iterable[int] = (),
    extra: tuple = (),
) -> Table | LongRows:
    """A table of one-line cells and Paragraphs; the ``numeric`` columns are right-aligned
    numbers. A table of many rows is a :class:`LongRows` (laid out a page at a time)."""
    num_cols = set(numeric)

    def cell(v, j, head=False):
        if isinstance(v, Flowable):
            return v
        style = (
            (st.head_num if head else st.cell_num)
            if j in num_cols
            else st.head
            if head
            else st.cell
        )
        if isinstance(v, Markup):
            return CellParagraph(v, style)
        return cell_text(v, style, widths[j])

    head = [cell(h, j, True) for j, h in enumerate(header)]
    body = [[cell(v, j) for j, v in enumerate(r)] for r in rows]
    if len(body) > BLOCK:  # laid out a page at a time (see core.report.longrows)
        return LongRows(head, body, widths, make_table_style(*extra).getCommands())
    t = LongTable([head, *body], colWidths=widths, repeatRows=1, hAlign="LEFT")
    t.setStyle(make_table_style(*extra))
    return t


def limit_level(sr: StationResult, ls: LimitState) -> Level:
    """Worst flag of a station about one limit state."""
    return worst(f for f in sr.flags if f.subject.endswith(f"/ {ls.name}"))


def station_properties(st: Styles, sr: StationResult, system: str, V: float, width: float):
    """As-built, as-found and ratio of the section properties at one station."""
    rows = []
    b, f = sr.built.gross.props, sr.found.gross.props
    meta = type(b).META

    def add(label, kind, vb, vf, digits=4):
        r = None if vb in (None, 0) or vf is None else vf / vb
        u = unit_label(kind, system)
        rows.append(
            [
                f"{label} ({u})" if u else label,
                value(vb, kind, system, digits),
                value(vf, kind, system, digits),
                ratio(r),
            ]
        )

    for k in PROPS:
        add(PROP_NAMES[k], meta[k][0], getattr(b, k), getattr(f, k))
    nb, nf = sr.built.net.props, sr.found.net.props
    add("A net (holes out)", "area", nb.A, nf.A)
    add("Ix net", "inertia", nb.Ix, nf.Ix)
    add("S bottom net", "section_modulus", nb.S_bot, nf.S_bot)
    tb = sr.built.gross.profile.tau_max(V)[0]
    tf = sr.found.gross.profile.tau_max(V)[0] if sr.found.shear_applicable else None
    add("τmax = VQ/(I t)", "stress", tb, tf)
    add("web thickness for shear", "length", sr.built.definition.part(_web(sr)).t, sr.tw_found)
    w = [width * 0.46, width * 0.2, width * 0.2, width * 0.14]
    return grid(st, ["property (unit)", "as-built", "as-found", "ratio"], rows, w, range(1, 4))


def _web(sr: StationResult) -> str:
    parts = sr.built.definition.parts
    return max(parts, key=lambda p: p.bounds[3] - p.bounds[1]).id


def station_limits(st: Styles, sr: StationResult, system: str, width: float, sym: str = "RF"):
    """The limit states of one station: factored capacities, ratio, the family's measure."""
    rows = []
    for ls in sr.limit_states:
        u = unit_label(ls.kind, system)
        rows.append(
            [
                f"{ls.name} ({u})",
                value(ls.C_built, ls.kind, system),
                value(ls.C_found, ls.kind, system),
                ratio(ls.ratio),
                rf(ls.measure),
            ]
        )
    w = [width * 0.37, width * 0.17, width * 0.17, width * 0.13, width * 0.16]
    h = ["limit state (unit)", "factored as-built", "factored as-found", "ratio", sym]
    return grid(st, h, rows, w, range(1, 5))


def properties_by_station(st: Styles, m: MemberResult, system: str, width: float):
    """One row per station: area, Ix, S, web thickness and tau max as-found with ratios."""
    if not m.stations:
        return None
    pu = position_label(system)
    h = [
        "station",
        f"x ({pu})",
        f"A ({unit_label('area', system)})",
        "A ratio",
        f"Ix ({unit_label('inertia', system)})",
        "Ix ratio",
        f"S bottom ({unit_label('section_modulus', system)})",
        "S ratio",
        f"tw ({unit_label('length', system)})",
        "worst part loss %",
    ]
    b = m.stations[0].built.gross.props
    rows = [
        [
            "as-built",
            DASH,
            value(b.A, "area", system),
            ratio(1.0),
            value(b.Ix, "inertia", system),
            ratio(1.0),
            value(b.S_bot, "section_modulus", system),
            ratio(1.0),
            value(m.stations[0].built.definition.part(_web(m.stations[0])).t, "length", system),
            pct(0.0),
        ]
    ]
    for s in m.stations:
        f = s.found.gross.props
        loss = max(s.part_loss.values(), default=0.0)
        rows.append(
            [
                s.station,
                position(s.x, system),
                value(f.A, "area", system),
                ratio(f.A / b.A),
                value(f.Ix, "inertia", system),
                ratio(f.Ix / b.Ix),
                value(f.S_bot, "section_modulus", system),
                ratio(f.S_bot / b.S_bot),
                value(s.tw_found, "length", system),
                pct(loss),
            ]
        )
    w = [0.1, 0.08, 0.1, 0.08, 0.12, 0.08, 0.13, 0.08, 0.1, 0.13]
    return grid(
        st,
        h,
        rows,
        [width * x for x in w],
        range(1, 10),
        extra=(("BACKGROUND", (0, 1), (-1, 1), BAND),),
    )


def capacity_tables(st: Styles, m: MemberResult, system: str, width: float, measure=None) -> list:
    """One table per kind (forces, shear flows, moments): capacity as-built and as-found,
    ratio, factored demand, the family's measure and level of every limit state at every
    station."""
    sym = measure.symbol if measure is not None else "RF"
    mname = measure.name if measure is not None else "rating factor"
    out = []
    pu = position_label(system)
    for kind, title in (
        ("force", "Web shear (the panel and the local check) and the girder ends"),
        ("force_per_length", "Rivet lines: shear flow resistance against the factored shear flow"),
        (
            "moment",
            "Flexure: each flexural limit state and the least of them, the one rated for flexure",
        ),
        (
            "stress",
            "Fatigue of the riveted detail: the infinite-life limit against the design stress "
            "range (not rated; its life below)",
        ),
    ):
        u = unit_label(kind, system)
        rows, rules = [], []
        for s in m.stations:
            first = True
            for ls in s.limit_states:
                if ls.kind != kind:
                    continue
                if first and rows:
                    rules.append(len(rows) + 1)
                rows.append(
                    [
                        s.station if first else "",
                        position(s.x, system) if first else "",
                        annotated(ls.name),
                        value(ls.C_built, kind, system),
                        value(ls.C_found, kind, system),
                        ratio(ls.ratio),
                        value(ls.demand, kind, system),
                        rf(ls.measure),
                        level_markup(limit_level(s, ls), bold=False)
                        if ls.C_found is not None
                        else "not applicable (see flags)",
                    ]
                )
                first = False
        if not rows:
            continue
        h = [
            "station",
            f"x ({pu})",
            "limit state",
            f"factored as-built ({u})",
            f"factored as-found ({u})",
            "ratio",
            f"factored demand ({u})",
            sym,
            "level",
        ]
        w = [0.07, 0.06, 0.19, 0.1, 0.1, 0.07, 0.1, 0.07, 0.24]
        extra = tuple(("LINEABOVE", (0, r), (-1, r), 0.7, MUTED) for r in rules)
        out.append(
            caption(
                st,
                f"{title}; factored capacities, ratio as-found / as-built, "
                f"{mname} {sym} (– where no loads are given)",
                system,
            )
        )
        out.append(grid(st, h, rows, [width * x for x in w], range(3, 8), extra=extra))
    return out
