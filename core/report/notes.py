"""The assumptions page (every assumption with its source, and the clauses the checks used),
the edit history summary, and the review block for the licensed engineer."""

from __future__ import annotations

import json
from collections import Counter

from reportlab.lib.units import mm
from reportlab.platypus import KeepTogether, Paragraph, Spacer, Table

from core import CAUTION
from core.assess.results import Assessment
from core.report.fmt import prose
from core.report.source import Source
from core.report.styles import INK, RULE, Styles, esc, make_table_style, text
from core.report.tables import caption, grid
from core.survey.device import short

#: how many of the newest history entries are listed
HISTORY_ROWS = 15
#: how many decisions of a merge are listed (the newest)
MERGE_ROWS = 12
#: how many corrections, withdrawals and undos of entries are listed (the newest)
CORRECTION_ROWS = 60
#: the kinds of entry the inspector corrects (old values shown in their own table)
CORRECTABLE = ("reading", "band", "perforation", "station")


def check_sources(a: Assessment) -> list[tuple[str, str]]:
    """(limit state, reference) of every check result of the assessment, each once, and the
    sources of the measure's factors."""
    seen: dict[tuple[str, str], None] = {}
    for m in a.members:
        for s in m.stations:
            for ls in s.limit_states:
                for res in (ls.built, ls.found):
                    if res is not None:
                        seen[(res.limit_state, res.reference)] = None
                if ls.rating is not None:
                    srcs = {v.source for v in ls.rating.values if "from memory" in v.source}
                    for src in sorted(srcs):
                        seen[(ls.rating.measure, src)] = None
    return list(seen)


def assumptions(st: Styles, a: Assessment, system: str, width: float, extra: tuple = ()) -> list:
    """The assumptions page: every assumption of ``a`` and ``extra`` ones (the bands')."""
    out = [Paragraph("Assumptions and sources", st.h1)]
    out.append(
        Paragraph(
            f"Standard family: <b>{esc(a.family.name)}</b>; measure: {esc(a.family.measure.name)} ({esc(a.family.measure.symbol)}). Every factor used is listed below with its source.",
            st.body,
        )
    )
    out.append(
        Paragraph(
            "Every value the assessment used that the engineer should confirm, with its "
            "source: a standard and clause, “from memory” (recalled, to be checked against "
            "the document), “engineer's input”, or “common practice, no source”.",
            st.body,
        )
    )
    rows = [[x.item, prose(x.value, system), x.source] for x in (*a.assumptions, *extra)]
    out.append(caption(st, "Assumptions", system))
    out.append(grid(st, ["item", "value", "source"], rows, [width * x for x in (0.25, 0.47, 0.28)]))
    out.append(Spacer(1, 8))
    out.append(caption(st, f"Clauses of the checks ({a.family.short})", system))
    refs = [[ls, ref] for ls, ref in check_sources(a)]
    out.append(grid(st, ["check", "standard, edition, clause"], refs, [width * 0.3, width * 0.7]))
    return out


def _short(v: object, n: int = 60) -> str:
    if v is None:
        return "–"
    s = v if isinstance(v, str) else json.dumps(v, ensure_ascii=False)
    return s if len(s) <= n else s[: n - 1] + "…"


def history(st: Styles, src: Source, system: str, width: float) -> list:
    out = [Paragraph("Edit history", st.h2)]
    if not src.is_store:
        out.append(
            Paragraph(
                f"The input was a survey file ({esc(src.name)}, SHA-256 {src.checksum}), "
                "not a field store: it carries no edit history.",
                st.body,
            )
        )
        return out
    h = src.history
    if not h:
        out.append(Paragraph("The field store holds no history entries.", st.body))
        return out
    who = Counter(e.who for e in h)
    acts = Counter(e.action for e in h)
    changes = len({e.change for e in h})
    undone = sum(1 for e in h if e.undone)
    out.append(
        Paragraph(
            f"Field store {esc(src.name)} (SHA-256 {src.checksum}): {len(h)} entries in "
            f"{changes} change(s) from {esc(h[0].at)} to {esc(h[-1].at)}; {undone} undone. "
            f"By: {esc(', '.join(f'{k} ({v})' for k, v in who.most_common()))}. "
            f"Actions: {esc(', '.join(f'{k} {v}' for k, v in acts.most_common()))}.",
            st.body,
        )
    )
    if src.conflicts:
        shown = src.conflicts[-MERGE_ROWS:]
        more = f" (the newest {len(shown)})" if len(shown) < len(src.conflicts) else ""
        out.append(
            Paragraph(
                f"This store was merged from two devices' stores: {len(src.conflicts)} "
                f"decision(s) of the merge to review{more} (both values are in the history; "
                "the later change is current):",
                st.body,
            )
        )
        out += [Paragraph(esc(line), st.body) for line in shown]
    fixes = [e for e in h if e.kind in CORRECTABLE and e.action in ("update", "delete", "undo")]
    if fixes:
        shown = fixes[-CORRECTION_ROWS:]
        more = f" (the newest {len(shown)} of {len(fixes)})" if len(shown) < len(fixes) else ""
        out.append(caption(st, f"Corrections, withdrawals and undos of entries{more}", system))
        out.append(_table(st, shown, width))
    tail = h[-HISTORY_ROWS:]
    out.append(caption(st, f"The newest {len(tail)} history entries", system))
    out.append(_table(st, tail, width))
    return out


def _table(st: Styles, entries, width: float):
    rows = []
    for e in entries:
        what = " / ".join(x for x in (e.kind, e.member, e.station, e.entity, e.field) if x)
        rows.append(
            [
                e.at,
                f"{e.who} ({short(e.device)})" if e.device else e.who,
                e.action + (" (undone)" if e.undone else ""),
                what,
                f"{_short(e.old)} → {_short(e.new)}",
            ]
        )
    return grid(
        st,
        ["when", "who (device)", "action", "what", "old → new"],
        rows,
        [width * x for x in (0.17, 0.15, 0.1, 0.2, 0.38)],
    )


def review_block(st: Styles, width: float) -> KeepTogether:
    """Name, licence number, date, signature and the decision boxes for the engineer."""
    box = "☐" if text("☐") == "☐" else "[ ]"
    label = st.head
    rows = [
        [Paragraph("Reviewing engineer", label), "", Paragraph("Licence number", label), ""],
        [Paragraph("Date", label), "", Paragraph("Signature", label), ""],
        [
            Paragraph(f"{box} Accepted as a basis for the owner's decisions", st.body),
            "",
            Paragraph(f"{box} Returned for revision (reasons below)", st.body),
            "",
        ],
        [Paragraph("Remarks", label), "", "", ""],
    ]
    t = Table(
        rows,
        colWidths=[width * 0.18, width * 0.32, width * 0.18, width * 0.32],
        rowHeights=[11 * mm, 14 * mm, 10 * mm, 30 * mm],
    )
    t.setStyle(
        make_table_style(
            ("GRID", (0, 0), (-1, -1), 0.5, INK),
            ("SPAN", (0, 2), (1, 2)),
            ("SPAN", (2, 2), (3, 2)),
            ("SPAN", (1, 3), (3, 3)),
            ("VALIGN", (0, 0), (-1, -1), "MIDDLE"),
            ("LINEBELOW", (0, 0), (-1, -2), 0.5, RULE),
        )
    )
    return KeepTogether(
        [
            Paragraph("Review by the licensed engineer", st.h2),
            Paragraph(esc(CAUTION), st.small),
            Spacer(1, 4),
            t,
        ]
    )
