"""A member's first page: the whole span (capacities, bands and demand along the member),
each station's governing band from the readings, and where to measure next."""

from __future__ import annotations

from reportlab.platypus import KeepTogether, Paragraph, Spacer

from core.assess.results import MemberResult
from core.bands.run import MemberBands
from core.names import readable
from core.report.page import PageInfo, Tracked
from core.report.spanplot import MAX_PANELS, span_plot
from core.report.styles import Styles, esc
from core.report.tables import caption, grid


def member_governing(m: MemberResult) -> tuple[str, str] | None:
    """(station, limit state key) of the member's worst rated governing limit state."""
    best = None
    for s in m.stations:
        g = s.governing
        if g is None or g.rating is None:
            continue
        if best is None or g.rating.badness < best[0]:
            best = (g.rating.badness, s.station, g.key)
    return None if best is None else (best[1], best[2])


def span_section(
    st: Styles,
    m: MemberResult,
    mb: MemberBands | None,
    system: str,
    width: float,
    info: PageInfo,
    sym: str,
) -> list:
    """The span plot, the table of bands and the advice."""
    gov = member_governing(m)
    out: list = [Paragraph("The whole span", st.h2)]
    words = ""
    if gov is not None:
        sr = next(s for s in m.stations if s.station == gov[0])
        ls = sr.limit_state(gov[1])
        words = (
            f" The member is governed by <b>{esc(readable(ls.name))}</b> at station "
            f"<b>{esc(gov[0])}</b> ({esc(sym)} {ls.rating.value:.3f}; bold panel title, dotted "
            "red line)."
        )
    out.append(Tracked(span_plot(m, mb, system, width, gov=gov), "span-plot", info))
    out.append(
        Paragraph(
            f"Factored capacities along the member, as-built and as-found, with the band from "
            f"the readings (5 % to 95 %), and the factored demand; the {MAX_PANELS} limit "
            "states with the worst measure at two stations or more (every one is in the "
            "tables)." + words,
            st.caption,
        )
    )
    if mb is None:
        return out
    rows = []
    for sb in mb.stations:
        key = sb.governing
        b = sb.band(key, "m") if key else None
        if key is None or b is None:
            continue
        p = "" if b.p_beyond is None else f"{b.p_beyond:.3f}"
        rows.append(
            [
                sb.station,
                readable(sb.names[key]),
                f"{b.value:.3f}",
                f"{b.p5:.3f}",
                f"{b.p95:.3f}",
                p,
                sb.sentence(key).split(": ", 1)[-1],
            ]
        )
    if rows:
        beyond = f"P({sym} < 1)" if sym == "RF" else f"P({sym} > 1)"
        key0 = next(iter(mb.stations[0].bands.values())).method
        method = {"first_order": "first order", "monte_carlo": "Monte Carlo"}[key0]
        block = [
            Spacer(1, 4),
            caption(
                st,
                f"Governing limit state of each station with its band from the readings "
                f"({method}; an aid, not a reliability rating; see the assumptions)",
                system,
            ),
            grid(
                st,
                ["station", "governing limit state", sym, "5 %", "95 %", beyond, "readings"],
                rows,
                [width * x for x in (0.08, 0.33, 0.08, 0.08, 0.08, 0.11, 0.24)],
                numeric=(2, 3, 4, 5),
            ),
        ]
        out.append(KeepTogether(block))
    advice = [Paragraph(f"{i}. {esc(readable(a))}", st.body) for i, a in enumerate(mb.advice, 1)]
    if not advice:
        advice = [Paragraph("Nothing to narrow: the readings settle the bands.", st.body)]
    out.append(
        KeepTogether(
            [
                Paragraph("Where to measure next", st.h3),
                *advice,
            ]
        )
    )
    return out
