"""The rivet line map: one row per rivet line along the member, one mark per rivet.

Every rivet is drawn with the glossary's shape of its state (``core.glossary.RIVET_STATES``,
the same as on the tablet): sound a filled circle, loose a half-filled circle, missing an
open circle (the empty hole), headless a filled square; the rivets that are not sound are
lettered as well (L, M, H) and coloured. Shape and letter carry the state without colour. Each
row names its line by id and in words. The longest gap between effective rivets of each line
is bracketed below its row, the stations are marked along the axis, and a legend is under
every map.
"""

from __future__ import annotations

from reportlab.graphics.shapes import Circle, Drawing, Line, Rect, String, Wedge
from reportlab.lib import colors
from reportlab.pdfbase.pdfmetrics import stringWidth

from core.assess.results import MemberResult
from core.glossary import RIVET_STATES
from core.names import labelled, line_name
from core.report.fmt import position, position_label, tick
from core.report.styles import ACCENT, INK, MUTED, RIVET_COLOUR, RULE, SANS, SANS_BOLD, text
from core.report.tauplot import ticks
from core.units import from_internal

#: the letters of the states that are not sound, in the order of the tables
LETTER = {k: RIVET_STATES[k].letter for k in ("missing", "loose", "headless")}
ROW = 26.0
LABEL_W = 112.0


def _mark(state: str, x: float, y: float, r: float = 2.6) -> list:
    """The glossary's shape of ``state`` centred at (x, y), radius ``r`` points (a sound rivet
    is drawn smaller so that the others stand out)."""
    c = RIVET_COLOUR[state]
    shape = RIVET_STATES[state].shape
    if shape == "filled square":
        h = r * 0.85
        return [Rect(x - h, y - h, 2 * h, 2 * h, fillColor=c, strokeColor=c, strokeWidth=0.5)]
    if shape == "half-filled circle":
        return [
            Circle(x, y, r, fillColor=colors.white, strokeColor=c, strokeWidth=0.9),
            Wedge(x, y, r, 90, 270, fillColor=c, strokeColor=None),
        ]
    if shape == "open circle":
        return [Circle(x, y, r, fillColor=colors.white, strokeColor=c, strokeWidth=0.9)]
    return [Circle(x, y, max(r * 0.4, 0.75), fillColor=c, strokeColor=None)]


def _clusters(items: list[tuple[float, str]], gap: float) -> list[tuple[float, str]]:
    """Letters of marks closer than ``gap`` points merged into one label ("M2 L")."""
    out: list[list] = []
    for x, s in items:
        if out and x - out[-1][1] < gap:
            out[-1][1] = x
            out[-1][2].append(s)
        else:
            out.append([x, x, [s]])
    labels = []
    for x0, x1, states in out:
        parts = []
        for st, letter in LETTER.items():
            n = states.count(st)
            if n:
                parts.append(letter if n == 1 else f"{letter}{n}")
        labels.append((0.5 * (x0 + x1), " ".join(parts)))
    return labels


def _place(labels: list[tuple[float, str]], size: float, rows: int) -> list[tuple[float, int, str]]:
    """Greedy rows so labels do not overlap; labels that fit nowhere go to the last row."""
    ends = [-1e9] * rows
    out = []
    for x, s in labels:
        w = stringWidth(s, SANS_BOLD, size)
        for r in range(rows):
            if x - w / 2 > ends[r] + 2:
                ends[r] = x + w / 2
                out.append((x, r, s))
                break
        else:
            out.append((x, rows - 1, s))
    return out


def rivet_map(member: MemberResult, system: str, width: float) -> Drawing:
    """The map of every rivet line of ``member`` in a drawing ``width`` points wide."""
    lines = [ln for ln in member.lines if ln.positions]
    n = max(len(lines), 1)
    top_room, bottom_room = 30.0, 40.0
    height = top_room + n * ROW + bottom_room
    d = Drawing(width, height)
    x0, x1 = LABEL_W, width - 8
    L = member.span

    def X(v):
        return x0 + (x1 - x0) * v / L

    # stations along the axis
    st_labels = _place([(X(s.x), s.station) for s in member.stations], 6, 2)
    for s in member.stations:
        d.add(
            Line(
                X(s.x),
                bottom_room - 4,
                X(s.x),
                height - top_room + 4,
                strokeColor=ACCENT,
                strokeWidth=0.4,
                strokeDashArray=[2, 2],
            )
        )
    for x, r, s in st_labels:
        d.add(
            String(
                x,
                height - top_room + 8 + 8 * r,
                text(s),
                fontName=SANS_BOLD,
                fontSize=6,
                fillColor=ACCENT,
                textAnchor="middle",
            )
        )
    for i, ln in enumerate(lines):
        y = height - top_room - (i + 0.5) * ROW
        d.add(Line(x0, y, x1, y, strokeColor=RULE, strokeWidth=0.4))
        d.add(String(4, y + 5, text(ln.line), fontName=SANS_BOLD, fontSize=6.5, fillColor=INK))
        words = line_name(ln.line)
        if words != ln.line.replace("_", " "):
            d.add(String(4, y - 1.5, text(words), fontName=SANS, fontSize=5.5, fillColor=INK))
        bad = ln.n_ineffective
        d.add(
            String(
                4,
                y - 8,
                f"{ln.n_rivets} rivets, {bad} not effective",
                fontName=SANS,
                fontSize=5.5,
                fillColor=MUTED,
            )
        )
        flagged = []
        for p, s in zip(ln.positions, ln.states, strict=True):
            for g in _mark(s, X(p), y):
                d.add(g)
            if s in LETTER:
                flagged.append((X(p), s))
        for x, _r, lab in _place(_clusters(flagged, 9.0), 6, 1):
            d.add(
                String(
                    x,
                    y + 4.5,
                    lab,
                    fontName=SANS_BOLD,
                    fontSize=6,
                    fillColor=INK,
                    textAnchor="middle",
                )
            )
        if (
            ln.n_ineffective
            and ln.longest_gap is not None
            and ln.gap_from is not None
            and ln.gap_to is not None
        ):
            a, b = X(ln.gap_from), X(ln.gap_to)
            yb = y - 5
            d.add(Line(a, yb, b, yb, strokeColor=INK, strokeWidth=0.5))
            d.add(Line(a, yb, a, yb + 2, strokeColor=INK, strokeWidth=0.5))
            d.add(Line(b, yb, b, yb + 2, strokeColor=INK, strokeWidth=0.5))
            g = f"longest gap {position(ln.longest_gap, system)} {position_label(system)}"
            half = stringWidth(g, SANS, 5.2) / 2 + 1
            d.add(
                String(
                    min(max((a + b) / 2, x0 + half), x1 - half),
                    yb - 6.5,
                    g,
                    fontName=SANS,
                    fontSize=5.2,
                    fillColor=INK,
                    textAnchor="middle",
                )
            )
    # axis
    ya = bottom_room - 4
    d.add(Line(x0, ya, x1, ya, strokeColor=INK, strokeWidth=0.6))
    u = position_label(system)
    span_u = from_internal(L, "length", u)
    for t in ticks(0.0, span_u, 8):
        xx = x0 + (x1 - x0) * t / span_u
        d.add(Line(xx, ya, xx, ya - 3, strokeColor=INK, strokeWidth=0.5))
        d.add(String(xx, ya - 10, tick(t), fontName=SANS, fontSize=6, textAnchor="middle"))
    d.add(String(4, ya - 10, f"position ({u})", fontName=SANS, fontSize=6, fillColor=MUTED))
    # legend
    ly, lx = 6, x0
    for state, term in RIVET_STATES.items():
        label = term.name if state == "sound" else f"{term.letter} {term.name}"
        for g in _mark(state, lx + 3, ly + 2):
            d.add(g)
        d.add(String(lx + 9, ly, label, fontName=SANS, fontSize=6, fillColor=INK))
        lx += 14 + stringWidth(label, SANS, 6) + 10
    lx += 6
    d.add(Line(lx, ly - 2, lx, ly + 7, strokeColor=ACCENT, strokeWidth=0.5, strokeDashArray=[2, 2]))
    d.add(String(lx + 4, ly, "station", fontName=SANS, fontSize=6, fillColor=INK))
    lx += 40
    d.add(Line(lx, ly + 1, lx + 12, ly + 1, strokeColor=INK, strokeWidth=0.5))
    d.add(Line(lx, ly + 1, lx, ly + 3, strokeColor=INK, strokeWidth=0.5))
    d.add(Line(lx + 12, ly + 1, lx + 12, ly + 3, strokeColor=INK, strokeWidth=0.5))
    d.add(
        String(
            lx + 16,
            ly,
            "longest gap between effective rivets",
            fontName=SANS,
            fontSize=6,
            fillColor=INK,
        )
    )
    return d


def ineffective_rows(member: MemberResult, system: str) -> list[list[str]]:
    """Per rivet line with ineffective rivets: the positions of each state, for a table."""
    rows = []
    for ln in member.lines:
        cells = []
        for state in LETTER:
            xs = [
                position(p, system)
                for p, s in zip(ln.positions, ln.states, strict=True)
                if s == state
            ]
            cells.append(", ".join(xs) if xs else "–")
        if any(c != "–" for c in cells):
            gap = "–" if ln.longest_gap is None else position(ln.longest_gap, system)
            rows.append([labelled(ln.line), *cells, gap])
    return rows
