"""The member's rating summary per load case and its live load envelopes per station."""

from __future__ import annotations

from reportlab.platypus import CondPageBreak, Paragraph

from core.assess.results import MemberResult
from core.names import annotated
from core.report.fmt import position, position_label, rf, unit_label, value
from core.report.styles import MUTED, Styles
from core.report.tables import caption, grid


def summary(st: Styles, m: MemberResult, system: str, width: float, measure) -> list:
    """Per load case, the worst value of the family's measure of each limit state over the
    member (the worst first), where it occurs, and what follows from the worst (a posting load
    for a legal vehicle, the reserve)."""
    if not m.summary:
        return []
    name = measure.name if measure is not None else "measure"
    rows, last, rules = [], None, []
    for r in m.summary:
        first = r.case != last
        if first and rows:
            rules.append(len(rows) + 1)
        rows.append(
            [
                r.case if first else "",
                r.factor if first else "",
                f"{r.symbol} {rf(r.value)}",
                r.station,
                annotated(r.limit_state),
                r.consequence or ("–" if first else ""),
            ]
        )
        last = r.case
    h = ["load case", "factor", "worst", "station", "limit state", "consequence"]
    w = [0.22, 0.1, 0.1, 0.08, 0.2, 0.3]
    extra = tuple(("LINEABOVE", (0, r), (-1, r), 0.7, MUTED) for r in rules)
    posting = any(r.consequence.startswith(("posting", "RF")) for r in m.summary)
    return [
        CondPageBreak(120),
        Paragraph(f"Rating summary: {name} per load case", st.h2),
        caption(
            st,
            f"Per load case the worst {name} of each limit state over every station, the worst "
            "first; the consequence follows from the worst",
            system,
        ),
        grid(st, h, rows, [width * x for x in w], (2,), extra=extra),
        Paragraph(
            "Where the loads stand for each value is in the limit state's working and in the "
            "envelopes below."
            + (
                " A posting load is arithmetic for the owner's decision, not a posting "
                "decision by itself."
                if posting
                else ""
            ),
            st.small,
        ),
    ]


def envelopes(st: Styles, m: MemberResult, system: str, width: float) -> list:
    """Live load envelope per station and case: moment and shear (distribution included),
    with the load position that gives each."""
    if not m.envelopes:
        return []
    mu, fu, pu = unit_label("moment", system), unit_label("force", system), position_label(system)
    rows = []
    last = None
    for e in m.envelopes:
        first = e.station != last
        rows.append(
            [
                e.station if first else "",
                position(e.x, system) if first else "",
                e.case,
                value(e.M, "moment", system),
                value(e.V, "force", system),
                e.M_at or "–",
                e.V_at or "–",
            ]
        )
        last = e.station
    h = ["station", f"x ({pu})", "case", f"M ({mu})", f"V ({fu})", "M: loads at", "V: loads at"]
    w = [0.07, 0.06, 0.11, 0.08, 0.08, 0.3, 0.3]
    return [
        CondPageBreak(150),
        Paragraph("Live load envelopes", st.h2),
        caption(
            st,
            "Unfactored live load effects with dynamic allowance and the distribution factor: "
            "sagging moment and the shear of the dead-load sense, each with its load position",
            system,
        ),
        grid(st, h, rows, [width * x for x in w], (3, 4)),
    ]
