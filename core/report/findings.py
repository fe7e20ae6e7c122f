"""Readings with their statistics and notes, station notes, validation findings and flags."""

from __future__ import annotations

from reportlab.platypus import Paragraph, Spacer

from core.assess.results import MemberResult
from core.checks.flags import Flag, Level
from core.names import annotated
from core.report.fmt import num, position, position_label, unit_label, value
from core.report.styles import Markup, Styles, esc, level_markup
from core.report.tables import caption, grid


def _region(part: str, region: str | None) -> str:
    if region is None:
        return part
    if region in ("h", "v"):
        return f"{part} ({'horizontal' if region == 'h' else 'vertical'} leg)"
    return f"{part}, band {region}"


def readings(
    st: Styles, m: MemberResult, system: str, width: float, station_notes: dict[str, str]
) -> list:
    """Count, minimum, mean, COV, value used and loss per part region of every station; the
    notes on readings are numbered below the table, followed by the inspector's notes."""
    u = unit_label("length", system)
    rows, notes = [], []
    for s in m.stations:
        first = True
        for r in s.stats:
            refs = []
            for p in r.notes:
                notes.append((s.station, _region(r.part, r.region), p))
                refs.append(f"[{len(notes)}]")
            cov = "–" if r.cov is None else num(100.0 * r.cov, 3)
            rows.append(
                [
                    s.station if first else "",
                    _region(r.part, r.region),
                    str(r.n),
                    value(r.t_nominal, "length", system),
                    value(r.t_min, "length", system),
                    value(r.t_mean, "length", system),
                    cov,
                    value(r.t_used, "length", system),
                    num(r.loss_pct, 3),
                    " ".join(refs),
                ]
            )
            first = False
    out = []
    if rows:
        h = [
            "station",
            "part region",
            "n",
            f"t nominal ({u})",
            f"t min ({u})",
            f"t mean ({u})",
            "COV %",
            f"t used ({u})",
            "loss %",
            "notes",
        ]
        w = [0.08, 0.25, 0.05, 0.1, 0.09, 0.09, 0.08, 0.09, 0.08, 0.09]
        out.append(
            caption(
                st,
                "Thickness readings per part region: count n, minimum, mean, coefficient of "
                "variation (sample), thickness used for A, I, Q and its loss against nominal",
                system,
            )
        )
        out.append(grid(st, h, rows, [width * x for x in w], range(2, 9)))
    for i, (sid, reg, p) in enumerate(notes, 1):
        out.append(
            Paragraph(
                f"[{i}] station {esc(sid)}, {esc(reg)} ({esc(p.level)}): {esc(p.message)}",
                st.small,
            )
        )
    texts = [(s.station, s.x, station_notes.get(s.station, "")) for s in m.stations]
    texts = [t for t in texts if t[2].strip()]
    if texts:
        out.append(Spacer(1, 4))
        out.append(Paragraph("Inspector's notes at the stations", st.h3))
        for sid, x, note in texts:
            out.append(
                Paragraph(
                    f"<b>{esc(sid)}</b> (x = {position(x, system)} {position_label(system)}): "
                    f"{esc(note)}",
                    st.small,
                )
            )
    return out


def as_read(st: Styles, member) -> list:
    """The readings the entry check held as probable slips and the inspector stored as read
    (``Reading.stored_as_read``), each with the reasons shown at the time."""
    held = [(s.id, r) for s in member.stations for r in s.readings if r.stored_as_read]
    if not held:
        return []
    out = [Paragraph("Readings stored as read although the entry check held them", st.h3)]
    for sid, r in held:
        out.append(
            Paragraph(
                f"<b>{esc(sid)}</b>, {esc(_region(r.part, r.region))}: reading {esc(r.id)} = "
                f"{esc(f'{r.value:g}')} {esc(r.unit)} ({esc(r.who or 'unknown')}): "
                f"{esc(r.stored_as_read)}",
                st.small,
            )
        )
    return out


def validation(st: Styles, problems, m: MemberResult, source: str) -> list:
    """Warnings and notes of the survey's validation that concern member ``m`` and are not
    already numbered under the readings table."""
    tag = f"member {m.member!r}"
    shown = {p.message for s in m.stations for r in s.stats for p in r.notes}
    sel = [p for p in problems if tag in p.where and p.message not in shown]
    if not sel:
        return []
    out = [Paragraph("Warnings and notes from the survey's validation", st.h3)]
    for p in sel:
        where = p.where
        if source and where.startswith(source + " / "):
            where = where[len(source) + 3 :]
        out.append(Paragraph(f"<b>{esc(p.level)}</b> · {esc(where)}: {esc(p.message)}", st.small))
    return out


def _subject(subject: str, member: str, station: str | None) -> str:
    pre = f"member {member!r} / "
    s = annotated(subject[len(pre) :] if subject.startswith(pre) else subject)
    if station is not None:
        pre = f"station {station!r} / "
        s = s[len(pre) :] if s.startswith(pre) else s
    return s


def finding(f: Flag) -> Markup:
    """The flag's message, its leading level words drawn with the level's shape and colour."""
    label = f.level.label
    if f.message.startswith(label):
        return Markup(level_markup(f.level, bold=False) + esc(f.message[len(label) :]))
    return Markup(level_markup(f.level, bold=False) + " · " + esc(f.message))


def flags(st: Styles, m: MemberResult, system: str, width: float) -> list:
    """Every flag above "within limits" with the number that drove it; a count of the rest."""
    rows = []
    n_ok = 0
    groups = [("member", None, m.flags)] + [(s.station, s.station, s.flags) for s in m.stations]
    for label, sid, fl in groups:
        first = True
        for f in sorted(fl, key=lambda f: -f.level):
            if f.level == Level.OK:
                n_ok += 1
                continue
            rows.append([label if first else "", _subject(f.subject, m.member, sid), finding(f)])
            first = False
    out = [
        caption(
            st,
            "Flags above 'within limits', worst first at each station, each with the number "
            "that drove it and the threshold it crossed",
            system,
        )
    ]
    if rows:
        w = [0.08, 0.22, 0.7]
        out.append(grid(st, ["station", "about", "flag"], rows, [width * x for x in w]))
    else:
        out.append(Paragraph("No flag above 'within limits'.", st.body))
    out.append(
        Paragraph(
            f"{n_ok} further check(s) of this member are within limits and are not listed "
            "here; their numbers are in the tables above.",
            st.small,
        )
    )
    return out
