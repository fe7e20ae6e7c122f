"""The cover: identity of the survey, the overall flag level, the summary per member and the
cautions."""

from __future__ import annotations

import datetime as _dt

from reportlab.lib import colors
from reportlab.platypus import Paragraph, Spacer, Table, TableStyle

from core import CAUTION, __version__
from core.assess.results import Assessment, MemberResult, StationResult
from core.checks.flags import Level
from core.glossary import OVERALL_LEVEL
from core.names import annotated
from core.report.fmt import position, position_label, ratio, rf, system_name
from core.report.source import Source
from core.report.styles import (
    INK,
    LEVEL_COLOUR,
    Styles,
    cell_text,
    esc,
    level_markup,
)
from core.report.tables import caption, grid
from core.survey import Survey

CAUTIONS = (
    "The results in this report are an aid to a licensed professional engineer, who must "
    "review them.",
    "Defer to local codes and to the owner's procedures wherever they differ from the methods "
    "and defaults used here.",
    "This report is not, by itself, a load rating or a posting decision.",
)


def worst_station(m: MemberResult) -> StationResult | None:
    """The station with the highest flag level, then the lowest governing RF or ratio."""
    if not m.stations:
        return None
    return min(m.stations, key=lambda s: (-s.level, _gov_value(s)))


def _gov_value(s: StationResult) -> float:
    g = s.governing
    if g is None:
        return float("inf")
    if g.rating is not None:
        return g.rating.badness
    return g.ratio if g.ratio is not None else float("inf")


def lowest(m: MemberResult, attr: str) -> tuple[float | None, str]:
    """Lowest ratio over the member (``attr="ratio"``), or the worst rating
    (``attr="rating"``: lowest RF, highest D/C or U), and where ("S1, web shear")."""
    best: tuple[float | None, str] = (None, "")
    key = None
    for s in m.stations:
        for ls in s.limit_states:
            if attr == "rating":
                if ls.rating is None:
                    continue
                v, k = ls.rating.value, ls.rating.badness
            else:
                v = getattr(ls, attr)
                if v is None:
                    continue
                k = v
            if key is None or k < key:
                best, key = (v, f"{s.station}, {annotated(ls.name)}"), k
    return best


def level_sentence(level: Level) -> str:
    """What the overall flag level says, in one sentence."""
    return {
        Level.OK: "Every check is within the thresholds set for this survey.",
        Level.WATCH: "Some results call for keeping watch at the next inspection.",
        Level.REVIEW: "Some results are for the engineer to review before any decision.",
        Level.URGENT: "Some results need immediate attention by the engineer.",
    }[level]


def cautions(st: Styles, width: float) -> Table:
    body = [Paragraph("Cautions", st.h2)]
    body += [Paragraph("• " + esc(c), st.caution) for c in CAUTIONS]
    body.append(Spacer(1, 3))
    body.append(Paragraph(esc(CAUTION), st.small))
    t = Table([[body]], colWidths=[width])
    t.setStyle(
        TableStyle(
            [
                ("BOX", (0, 0), (-1, -1), 1.2, INK),
                ("BACKGROUND", (0, 0), (-1, -1), colors.HexColor("#fbf6ee")),
                ("LEFTPADDING", (0, 0), (-1, -1), 8),
                ("RIGHTPADDING", (0, 0), (-1, -1), 8),
                ("TOPPADDING", (0, 0), (-1, -1), 4),
                ("BOTTOMPADDING", (0, 0), (-1, -1), 6),
            ]
        )
    )
    return t


def cover(
    st: Styles, survey: Survey, a: Assessment, src: Source, system: str, width: float
) -> list:
    h = survey.survey
    fam = a.family
    out = [
        Paragraph("Condition report", st.subtitle),
        Paragraph(esc(a.title), st.title),
        Paragraph(esc(h.structure) if h.structure else "", st.subtitle),
    ]
    members = "; ".join(f"{m.id} ({m.label})" if m.label else m.id for m in survey.members)
    info = [
        ("Survey", h.id),
        ("Structure", h.structure),
        ("Location", h.location),
        ("Owner's reference", h.owner_ref),
        ("Member(s)", members),
        ("Inspection date(s)", ", ".join(h.dates)),
        ("Inspector", h.inspector),
        ("Year built", "" if h.year_built is None else str(h.year_built)),
        ("Standard family", fam.name),
        (
            "Documents",
            "; ".join(
                d.label + (" (the family points to it)" if d.pointer else "") for d in fam.documents
            ),
        ),
        ("Measure", f"{fam.measure.name} {fam.measure.symbol}"),
        ("Unit system", system_name(system)),
        (
            "Input",
            f"{src.name} ({'field store' if src.is_store else 'survey file'}), "
            f"SHA-256 {src.checksum}",
        ),
        ("Produced", f"{_dt.date.today().isoformat()} by asfound {__version__}"),
    ]
    rows = [[Paragraph(esc(k), st.head), cell_text(v, st.cell, width * 0.78)] for k, v in info if v]
    t = Table(rows, colWidths=[width * 0.22, width * 0.78], hAlign="LEFT")
    t.setStyle(
        TableStyle(
            [
                ("VALIGN", (0, 0), (-1, -1), "TOP"),
                ("TOPPADDING", (0, 0), (-1, -1), 1.5),
                ("BOTTOMPADDING", (0, 0), (-1, -1), 1.5),
                ("LEFTPADDING", (0, 0), (-1, -1), 0),
            ]
        )
    )
    out += [t, Spacer(1, 10)]
    # the overall flag level
    lv = a.level
    n = sum(1 for f in a.all_flags() if f.level == lv)
    v = Table(
        [
            [Paragraph(esc(OVERALL_LEVEL.capitalize()), st.head)],
            [Paragraph(level_markup(lv), st.overall)],
            [
                Paragraph(
                    f"{esc(level_sentence(lv))} {n} flag(s) at this level; the worst "
                    f"level of all flags decides the {OVERALL_LEVEL}.",
                    st.body,
                )
            ],
        ],
        colWidths=[width],
    )
    v.setStyle(
        TableStyle(
            [
                ("BOX", (0, 0), (-1, -1), 1.5, LEVEL_COLOUR[lv]),
                ("LEFTPADDING", (0, 0), (-1, -1), 8),
                ("TOPPADDING", (0, 0), (-1, 0), 5),
            ]
        )
    )
    out += [v, Spacer(1, 10)]
    out += summary(st, a, system, width)
    if a.flags:
        out.append(Spacer(1, 4))
        out += [
            Paragraph(
                f"{level_markup(f.level, bold=False)} {esc(f.detail)}",
                st.small,
            )
            for f in a.flags
        ]
    out += [Spacer(1, 10), cautions(st, width)]
    return out


def summary(st: Styles, a: Assessment, system: str, width: float) -> list:
    """Per member: worst station, its governing limit state, lowest ratio, lowest RF."""
    pu = position_label(system)
    ms = a.family.measure
    worst_words = f"{'lowest' if ms.higher_is_better else 'highest'} {ms.symbol}"
    rows = []
    for m in a.members:
        ws = worst_station(m)
        gov = ws.governing if ws else None
        lr, lr_at = lowest(m, "ratio")
        lf, lf_at = lowest(m, "rating")
        rows.append(
            [
                m.member,
                f"{ws.station} (x = {position(ws.x, system)} {pu})" if ws else "–",
                annotated(gov.name) if gov else "–",
                ratio(lr),
                rf(lf),
                level_markup(m.level, bold=False),
            ]
        )
        rows.append(["", "", "", lr_at, lf_at, ""])
    h = ["member", "worst station", "governing limit state", "lowest ratio", worst_words, "level"]
    w = [0.1, 0.18, 0.2, 0.16, 0.16, 0.2]
    return [
        caption(st, "Summary per member (ratio = as-found / as-built factored capacity)", system),
        grid(st, h, rows, [width * x for x in w], (3, 4)),
    ]
