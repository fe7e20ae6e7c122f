"""Sentences for the entries of a change: what an undo will revert, what a row of the entry
list holds (formatting only, no kivy, no engineering)."""

from __future__ import annotations

from typing import Any

from fieldapp.names import line_name, part_name, place_name

GIRDER_WORDS = {
    "D": "web depth",
    "tw": "web thickness",
    "angle_h": "angle horizontal leg",
    "angle_v": "angle vertical leg",
    "angle_t": "angle thickness",
    "covers_top": "top covers",
    "covers_bottom": "bottom covers",
    "rivet_d": "rivet diameter",
    "pitch_web": "web rivet pitch",
    "pitch_cover": "cover rivet pitch",
}


def num(v: Any) -> str:
    return f"{v:g}" if isinstance(v, int | float) else str(v)


def reading(r: dict, station: str = "") -> str:
    """ "reading r14 = 9.5 mm on web at S2"."""
    at = f" at {station}" if station else ""
    return (
        f"reading {r.get('id', '?')} = {num(r.get('value'))} {r.get('unit', '')} on "
        f"{place_name(r.get('part', '?'), r.get('region'))}{at}"
    )


def cut(kind: str, b: dict, unit: str, station: str = "") -> str:
    """ "loss band b1 on web, 250 to 400 mm (t 6 mm) at S2"; "perforation p1 in web, ..."."""
    at = f" at {station}" if station else ""
    t = f" (t {num(b['t'])} {unit})" if kind == "band" and b.get("t") is not None else ""
    word, prep = ("loss band", "on") if kind == "band" else ("perforation", "in")
    on = place_name(b.get("part", "?"), b["leg"]) if b.get("leg") else part_name(b.get("part", "?"))
    return f"{word} {b.get('id', '?')} {prep} {on}, {num(b.get('lo'))} to {num(b.get('hi'))} {unit}{t}{at}"


def _rivet_change(old: list, new: list, pu: str) -> str:
    def states(lines):
        return {
            (ln["line"], s["position"]): s["state"]
            for ln in lines or []
            for s in ln.get("states", [])
        }

    before, after = states(old), states(new)
    diff = [k for k in after if before.get(k) != after[k]]
    if len(diff) != 1:
        return "the rivet states"
    line, pos = diff[0]
    was = before.get(diff[0], "as the run")
    return f"rivet {line_name(line)} at {num(pos)} {pu}: {was} -> {after[diff[0]]}"


def _girder_change(old: dict, new: dict, unit: str) -> str:
    g0, g1 = (old or {}).get("girder") or {}, (new or {}).get("girder") or {}
    words = [
        f"{GIRDER_WORDS.get(k, k)} {num(g0.get(k, '-'))} -> {num(g1.get(k, '-'))}"
        + (f" {unit}" if not isinstance(g1.get(k), list) else "")
        for k in sorted(set(g0) | set(g1))
        if g0.get(k) != g1.get(k)
    ]
    return ", ".join(words) if words else "the section"


def row(h, length_unit: str, position_unit: str) -> str:
    """One history row of a change in words (see :func:`change`)."""
    station = h.station
    if h.kind == "reading":
        data = h.new if h.action == "add" else h.old
        if h.action == "update":
            return (
                f"the correction of reading {h.entity} at {station} ({h.field} "
                f"{num(h.old)} -> {num(h.new)})"
            )
        what = reading(data or {"id": h.entity}, station)
        return what if h.action == "add" else f"the withdrawal of {what}"
    if h.kind in ("band", "perforation"):
        data = (h.new if h.action == "add" else h.old) or {"id": h.entity}
        what = cut(h.kind, data, length_unit, station)
        return what if h.action == "add" else f"the withdrawal of {what}"
    if h.kind == "station":
        if h.action == "add":
            return f"station {h.entity} at {num((h.new or {}).get('position'))} {position_unit}"
        if h.action == "delete":
            return f"the removal of station {h.entity}"
        if h.field == "notes":
            return f"the note at {h.entity}"
        if h.field == "photos":
            return f"the photo list at {h.entity}"
        return f"the {h.field} of station {h.entity} ({num(h.old)} -> {num(h.new)})"
    if h.kind == "member":
        if h.action == "add":
            return f"member {h.entity}"
        if h.action == "delete":
            return f"the removal of member {h.entity}"
        if h.field == "rivets":
            return f"{_rivet_change(h.old, h.new, position_unit)} on {h.entity}"
        if h.field == "section":
            return f"the section of {h.entity}: {_girder_change(h.old, h.new, length_unit)}"
        return f"the {h.field.replace('_', ' ')} of member {h.entity}{_was(h)}"
    if h.field == "*":
        return "the survey set up"
    return f"the {h.field.replace('_', ' ')} of the survey{_was(h)}"


def _was(h) -> str:
    """`` (old -> new)`` for a value in words or numbers (a label, a year), else ""."""

    def plain(v):
        if v is None:
            return "-"
        if isinstance(v, dict) and set(v) == {"value", "unit"}:
            return f"{num(v['value'])} {v['unit']}"
        return num(v) if isinstance(v, (int, float, str)) else None

    old, new = plain(h.old), plain(h.new)
    return f" ({old} -> {new})" if old is not None and new is not None else ""


def change(rows, length_unit: str, position_unit: str) -> str:
    """A change (its history rows) in words: the first row and how many more there are."""
    if not rows:
        return "nothing"
    head = row(rows[0], length_unit, position_unit)
    n = len({(h.kind, h.entity) for h in rows}) - 1
    return head if n <= 0 else f"{head} and {n} more entr{'y' if n == 1 else 'ies'}"
