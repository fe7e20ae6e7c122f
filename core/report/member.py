"""The pages of one member: rivet line map, governing stations in detail, tables by station,
readings and flags."""

from __future__ import annotations

from reportlab.platypus import CondPageBreak, KeepTogether, Paragraph, Spacer, Table, TableStyle

from core.assess.results import MemberResult, StationResult
from core.bands.run import MemberBands
from core.glossary import RIVET_STATES
from core.report import findings, rating
from core.report.bandpages import span_section
from core.report.drawing import flange_windows, section_drawing
from core.report.fmt import position, position_label, ratio, rf, system_name, with_unit
from core.report.girderpages import fatigue_lives, girder_ends, stiffener_tables
from core.report.page import PageInfo, Tracked
from core.report.rivetmap import LETTER, ineffective_rows, rivet_map
from core.report.styles import LOSS, PERF, STEEL, Styles, esc, level_markup
from core.report.tables import (
    capacity_tables,
    caption,
    grid,
    properties_by_station,
    station_limits,
    station_properties,
)
from core.report.tauplot import tau_plot
from core.survey import Member
from core.units import to_internal

#: most stations drawn in detail per member
MAX_DETAIL = 3
#: unit shear for the stress plot when the station has no factored shear demand
UNIT_SHEAR = {"si": (100.0, "kN"), "us": (100.0, "kip")}


def governing_stations(m: MemberResult, n: int = MAX_DETAIL) -> list[StationResult]:
    """The 1 to ``n`` stations with the worst level, then the lowest ratio."""

    def low_ratio(s: StationResult) -> float:
        r = [ls.ratio for ls in s.limit_states if ls.ratio is not None]
        return min(r) if r else float("inf")

    ranked = sorted(m.stations, key=lambda s: (-s.level, low_ratio(s), s.x))
    return sorted(ranked[:n], key=lambda s: s.x)


def shear_for_plot(s: StationResult, system: str) -> tuple[float, str]:
    """V (N) for the stress plot and the words saying which it is."""
    if s.V_demand is not None and s.V_demand > 0:
        return s.V_demand, f"factored shear demand V = {with_unit(s.V_demand, 'force', system)}"
    v, u = UNIT_SHEAR[system]
    V = to_internal(v, u, "force")
    return V, f"unit shear V = {with_unit(V, 'force', system)} (no loads given at the station)"


def _legend(st: Styles) -> Paragraph:
    def sw(c, label):
        return f'<font color="#{c.hexval()[2:]}">■</font> {label}'

    return Paragraph(
        "Legend: "
        + " · ".join(
            [
                sw(STEEL, "steel remaining"),
                sw(LOSS, "section loss (inside the thin as-built outline)"),
                "□ rivet hole, with its centre line",
                f'<font color="#{PERF.hexval()[2:]}">P</font> perforation',
            ]
        ),
        st.small,
    )


def station_sheet(
    st: Styles, s: StationResult, system: str, width: float, info: PageInfo, sym: str = "RF"
) -> list:
    """Drawings, stress plot, properties and limit states of one governing station."""
    gov = s.governing
    head = (
        f"Station {esc(s.station)} · x = {position(s.x, system)} {position_label(system)} · "
        f"{s.panel} panel · {level_markup(s.level)}"
    )
    if gov is not None:
        head += f" · governing: {esc(gov.name)} (ratio {ratio(gov.ratio)}, {sym} {rf(gov.measure)})"
    V, v_words = shear_for_plot(s, system)
    h1 = 215.0
    w_sec = width * 0.2
    w_tau = width - 2 * w_sec
    a = Tracked(
        section_drawing(s.built, None, system, w_sec, h1, title="as-built"), "section-built", info
    )
    b = Tracked(
        section_drawing(s.built, s.found, system, w_sec, h1, title="as-found"),
        "section-found",
        info,
    )
    c = Tracked(
        tau_plot(s.built, s.found, V, system, w_tau, h1, title="shear stress over the depth"),
        "tau",
        info,
    )
    row1 = Table([[a, b, c]], colWidths=[w_sec, w_sec, w_tau])
    row1.setStyle(
        TableStyle([("LEFTPADDING", (0, 0), (-1, -1), 0), ("RIGHTPADDING", (0, 0), (-1, -1), 0)])
    )
    parts = [Paragraph(head, st.h3), row1]
    wins = flange_windows(s.built)
    if wins:
        wd = width / len(wins)
        cells = [
            Tracked(
                section_drawing(
                    s.built,
                    s.found,
                    system,
                    wd,
                    125,
                    title=f"{name} flange, as-found, enlarged",
                    window=win,
                ),
                f"detail-{name}",
                info,
            )
            for name, win in wins
        ]
        row2 = Table([cells], colWidths=[wd] * len(wins))
        row2.setStyle(
            TableStyle(
                [("LEFTPADDING", (0, 0), (-1, -1), 0), ("RIGHTPADDING", (0, 0), (-1, -1), 0)]
            )
        )
        parts.append(row2)
    parts.append(_legend(st))
    parts.append(
        Paragraph(
            f"Stresses for the {esc(v_words)}; τ = VQ/(I t) on the gross section (rivet holes "
            "filled), both sides of every width change drawn, so the steps are the jumps. "
            + (
                esc(s.found.finding[:1].upper() + s.found.finding[1:]) + "."
                if not s.found.shear_applicable
                else ""
            ),
            st.caption,
        )
    )
    half = width / 2 - 4
    tables = Table(
        [
            [
                [
                    caption(st, "Section properties", system),
                    station_properties(st, s, system, V, half),
                ],
                [
                    caption(st, "Limit states, factored capacities", system),
                    station_limits(st, s, system, half, sym),
                ],
            ]
        ],
        colWidths=[width / 2, width / 2],
    )
    tables.setStyle(
        TableStyle(
            [
                ("VALIGN", (0, 0), (-1, -1), "TOP"),
                ("LEFTPADDING", (0, 0), (-1, -1), 0),
                ("RIGHTPADDING", (0, 0), (-1, -1), 4),
            ]
        )
    )
    return [KeepTogether(parts), Spacer(1, 4), tables]


def member_pages(
    st: Styles,
    m: MemberResult,
    member: Member,
    problems,
    source: str,
    system: str,
    width: float,
    info: PageInfo,
    family=None,
    bands: MemberBands | None = None,
) -> list:
    """Every flowable of one member's part of the report (``bands``: the member's bands
    from the readings, shown with the span plot on its first page)."""
    measure = family.measure if family is not None else None
    sym = measure.symbol if measure is not None else "RF"
    out = [
        Paragraph(f"Member {esc(m.member)}" + (f" · {esc(m.label)}" if m.label else ""), st.h1),
        Paragraph(
            f"Span {with_unit(m.span, 'length', system)} "
            f"({position(m.span, system)} {position_label(system)}), {len(m.stations)} "
            f"station(s), {len(m.lines)} rivet line(s). Worst level: {level_markup(m.level)}. "
            f"Figures and tables in {system_name(system)}.",
            st.body,
        ),
    ]
    out += span_section(st, m, bands, system, width, info, sym)
    gov = governing_stations(m)
    if gov:
        out.append(CondPageBreak(600))
        out.append(
            Paragraph(f"Governing station(s): {', '.join(esc(s.station) for s in gov)}", st.h2)
        )
        out.append(
            Paragraph(
                f"The {len(gov)} station(s) with the worst flag level and the lowest capacity "
                "ratio are drawn here; every station is in the tables that follow.",
                st.caption,
            )
        )
        for i, s in enumerate(gov):
            if i:
                out.append(CondPageBreak(560))
            out += station_sheet(st, s, system, width, info, sym)
            out.append(Spacer(1, 8))
    out += girder_ends(st, m, system, width, info, sym)
    if any(ln.positions for ln in m.lines):
        block = [
            Paragraph("Rivet lines along the member", st.h2),
            Tracked(rivet_map(m, system, width), "rivet-map", info),
            Paragraph(
                "One row per rivet line; a mark per rivet, the same marks as on the tablet. "
                + "; ".join(
                    f"{t.name}: {t.shape}" + (f", {t.letter}" if k != "sound" else "")
                    for k, t in RIVET_STATES.items()
                )
                + ". Neighbouring letters are merged with a count (M2 = two missing).",
                st.caption,
            ),
        ]
        out.append(KeepTogether(block))
        rows = ineffective_rows(m, system)
        if rows:
            pu = position_label(system)
            out.append(
                caption(st, f"Rivets not effective, positions along the member ({pu})", system)
            )
            h = ["rivet line", *(f"{t} {RIVET_STATES[k].name}" for k, t in LETTER.items())]
            h.append(f"longest gap ({pu})")
            out.append(grid(st, h, rows, [width * x for x in (0.28, 0.2, 0.2, 0.18, 0.14)], (4,)))
    if m.stations:
        out.append(CondPageBreak(200))
        out.append(Paragraph("Section properties by station", st.h2))
        out.append(caption(st, "Gross section as-found against as-built", system))
        out.append(properties_by_station(st, m, system, width))
        out.append(CondPageBreak(120))
        out.append(
            Paragraph(
                f"Capacities, ratios and {measure.name if measure else 'rating factors'} by station",
                st.h2,
            )
        )
        out += capacity_tables(st, m, system, width, measure)
        out += fatigue_lives(st, m, system, width)
        out += stiffener_tables(st, m, system, width)
        out += rating.summary(st, m, system, width, measure)
        out += rating.envelopes(st, m, system, width)
        out.append(CondPageBreak(150))
        out.append(Paragraph("Readings", st.h2))
        notes = {s.id: s.notes for s in member.stations}
        out += findings.readings(st, m, system, width, notes)
        out += findings.as_read(st, member)
    out += findings.validation(st, problems, m, source)
    out.append(CondPageBreak(150))
    out.append(Paragraph("Flags", st.h2))
    out += findings.flags(st, m, system, width)
    return out
