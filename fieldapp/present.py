"""Text for the screens from core's results: formatting only, no engineering (no kivy).

Numbers are core's, converted to the survey's display units by :func:`core.units.show`.
"""

from __future__ import annotations

from dataclasses import dataclass

from core.assess import LimitState, StationResult
from core.assess.tomeasure import for_station
from core.checks.flags import Flag, Level
from core.errors import AsfoundError
from core.glossary import level as level_term
from core.units import show
from fieldapp.names import readable
from fieldapp.theme import MARK_FONT

DASH = "-"


def esc(text: str) -> str:
    """Text shown literally in a kivy label with markup on (kivy's escape_markup, no kivy)."""
    return text.replace("&", "&amp;").replace("[", "&bl;").replace("]", "&br;")


def level_mark(level: Level) -> str:
    """Label markup of a level's shape (the glossary's glyph, the report's too) in its face."""
    return f"[font={MARK_FONT}]{level_term(level).glyph}[/font]"


@dataclass(frozen=True)
class Row:
    """One limit state as text: name, as-built, as-found, ratio, the family's measure (RF,
    D/C or U; kept in ``rf``), note."""

    key: str
    name: str
    built: str
    found: str
    ratio: str
    rf: str
    note: str


def capacity(value: float | None, kind: str, system: str) -> str:
    """A capacity in the display unit of ``system`` (or a dash when absent)."""
    if value is None:
        return DASH
    s = show(value, kind, system)
    return f"{s.value:,.0f} {s.symbol}" if abs(s.value) >= 100 else f"{s.value:.3g} {s.symbol}"


def ratio_text(value: float | None) -> str:
    return DASH if value is None else f"{value:.3f}"


def rf_text(value: float | None) -> str:
    return DASH if value is None else f"{value:.2f}"


def row(ls: LimitState, system: str) -> Row:
    found = capacity(ls.C_found, ls.kind, system)
    if ls.C_found is None and "not applicable" in ls.note:
        found = "n/a (note)"
    return Row(
        ls.key,
        readable(ls.name),
        capacity(ls.C_built, ls.kind, system),
        found,
        ratio_text(ls.ratio),
        rf_text(ls.measure),
        readable(ls.note) if ls.C_found is None else "",
    )


def rows(sr: StationResult, system: str) -> list[Row]:
    return [row(ls, system) for ls in sr.limit_states]


def grouped_notes(rs: list[Row]) -> list[str]:
    """The notes of the rows without an as-found value, each note once with its rows."""
    by_note: dict[str, list[str]] = {}
    for r in rs:
        if r.note:
            by_note.setdefault(r.note, []).append(r.name)
    return [f"{', '.join(names)}: {note}" for note, names in by_note.items()]


def worst_flag(sr: StationResult) -> Flag | None:
    """The flag of the highest level at the station (the first such one)."""
    if not sr.flags:
        return None
    top = max(f.level for f in sr.flags)
    return next(f for f in sr.flags if f.level == top)


def flag_line(flag: Flag | None) -> str:
    """Label markup: the level once (shape and words), what the flag is about, core's sentence."""
    if flag is None:
        return "no flags"
    about = readable(flag.subject.split(" / ")[-1])
    return (
        f"{level_mark(flag.level)} {esc(flag.label)} · {esc(about)}: {esc(readable(flag.detail))}"
    )


def flag_head(flag: Flag | None) -> str:
    """Label markup: the level (shape and words) and what the worst flag is about (its
    sentence is on Results)."""
    if flag is None:
        return "no flags"
    about = readable(flag.subject.split(" / ")[-1])
    return f"{level_mark(flag.level)} {esc(flag.label)}: {esc(about)}"


def big(value: float) -> str:
    """A large number without exponent notation (the app's font has no superscript 6)."""
    if abs(value) >= 1e6:
        return f"{value / 1e6:,.1f} million"
    return f"{value:,.4g}" if abs(value) < 1000 else f"{value:,.0f}"


def governing_line(sr: StationResult) -> str:
    """The governing limit state in one line: name, ratio and RF."""
    g = sr.governing
    if g is None:
        return "no limit state could be evaluated"
    rf = f", {g.rating.symbol} {rf_text(g.measure)}" if g.rating is not None else ""
    return f"governs: {readable(g.name)}, ratio {ratio_text(g.ratio)}{rf}"


def loss_text(sr: StationResult, part: str) -> str:
    """Section loss of one part at the station, per cent (core's part_loss)."""
    v = sr.part_loss.get(part)
    return "" if v is None or v < 0.5 else f"-{v:.0f}%"


def length(value_mm: float, system: str) -> str:
    s = show(value_mm, "length", system)
    return f"{s.value:.4g} {s.symbol}"


def left_here(member, station, most: int = 3) -> str:
    """What is left to measure at a station in one sentence (the first ``most`` items of
    :func:`core.assess.tomeasure.for_station`; "" once nothing is left), e.g. "Left to
    measure here: top cover plate 2 (not read), web (2 of 3 readings)."""
    try:
        items = for_station(member, station)
    except AsfoundError:
        return ""  # the station screen says what is wrong with the record elsewhere
    if not items:
        return "Every part here has its readings."
    words = []
    for i in items[:most]:
        if i.kind == "unread_station":
            words.append("no part read yet")
        elif i.kind == "unread_part":
            words.append(f"{i.subject} (not read)")
        elif i.kind == "few_readings":
            words.append(f"{i.subject} ({i.have} of {i.want} readings)")
        else:
            words.append(f"{i.subject} (thickness typed, not read)")
    more = f", and {len(items) - most} more" if len(items) > most else ""
    return "Left to measure here: " + ", ".join(words) + more + "."
