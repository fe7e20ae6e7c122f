"""The report's "Not measured" section of a member: what the assessment rests on without a
reading, and what it assumed instead (from :mod:`core.assess.tomeasure`)."""

from __future__ import annotations

from reportlab.platypus import CondPageBreak, Paragraph

from core.assess.tomeasure import KIND_WORDS, ToMeasure
from core.report.styles import Styles
from core.report.tables import caption, grid


def grouped(items: list[ToMeasure]) -> list[tuple[ToMeasure, list[str]]]:
    """The items with the same kind, subject, counts and consequence brought together, each
    with the stations it holds at, in the order first met (stations in position order)."""
    out: dict[tuple, tuple[ToMeasure, list[str]]] = {}
    for i in items:
        key = (i.kind, i.subject, i.have, i.want, i.consequence)
        _, stations = out.setdefault(key, (i, []))
        if i.station is not None:
            stations.append(i.station)
    return list(out.values())


def _where(stations: list[str], n_stations: int) -> str:
    if not stations:
        return "member"
    if len(stations) == n_stations and n_stations > 1:
        return f"every station ({n_stations})"
    return ", ".join(stations)


def section(st: Styles, items: list[ToMeasure], n_stations: int, system: str, width: float) -> list:
    """The flowables of one member's "Not measured" section (a sentence when nothing is left)."""
    out = [CondPageBreak(150), Paragraph("Not measured", st.h2)]
    if not items:
        out.append(
            Paragraph(
                "Every part of every station has readings, every rivet line was walked and no "
                "value was assumed for want of a record.",
                st.body,
            )
        )
        return out
    out.append(
        Paragraph(
            "What the numbers above rest on without a reading, and what was assumed instead. "
            "A part with no reading at a station is taken at its nominal thickness there, with "
            "no loss counted: that is not conservative where it has corroded.",
            st.body,
        )
    )
    out.append(
        caption(st, "Left to measure or confirm, with what the assessment did meanwhile", system)
    )
    rows = []
    for i, stations in grouped(items):
        count = "" if i.have is None else f"{i.have} of {i.want}"
        rows.append(
            [
                KIND_WORDS[i.kind],
                i.subject,
                _where(stations, n_stations),
                count,
                i.consequence,
            ]
        )
    w = [0.15, 0.22, 0.15, 0.1, 0.38]
    head = ["item", "what", "where", "readings", "meanwhile"]
    out.append(grid(st, head, rows, [width * x for x in w], (3,)))
    return out
