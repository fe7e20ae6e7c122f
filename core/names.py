"""Parts, regions and rivet lines in words, from their ids (the one source for app and report).

Files, the store and the JSON keep the ids (``angle_tl``, ``cover_bottom_1``, ``web_bottom``);
people read "top-left flange angle", "bottom cover plate 1", "bottom line through the web".
The words come from :mod:`core.glossary` (part kinds, legs). A part or line that is not from
the girder template shows its id with spaces for underscores.
"""

from __future__ import annotations

import re

from core.glossary import LEGS, PART_KINDS

_CORNER = {"tl": "top-left", "tr": "top-right", "bl": "bottom-left", "br": "bottom-right"}
_SIDE = {"l": "left", "r": "right"}

#: the legs of an angle by region id ("h", "v") in words
LEG_NAMES = {k: t.name for k, t in LEGS.items()}


def part_name(part_id: str) -> str:
    """A part in words: ``angle_tl`` -> "top-left flange angle", ``cover_top_2`` -> "top
    cover plate 2"."""
    m = re.fullmatch(r"angle_(tl|tr|bl|br)", part_id)
    if m:
        return f"{_CORNER[m.group(1)]} {PART_KINDS['flange_angle'].name}"
    m = re.fullmatch(r"cover_(top|bottom)_(\d+)", part_id)
    if m:
        return f"{m.group(1)} {PART_KINDS['cover_plate'].name} {m.group(2)}"
    return part_id.replace("_", " ")


def region_name(region: str | None) -> str:
    """A region of a part in words: whole part, a leg of an angle, or a band."""
    if not region:
        return "whole part"
    return LEG_NAMES.get(region, f"band {region}")


def place_name(part_id: str, region: str | None) -> str:
    """A part region in words: "web", "top-left flange angle, horizontal leg", "web band b1"."""
    if not region:
        return part_name(part_id)
    if region in LEG_NAMES:
        return f"{part_name(part_id)}, {LEG_NAMES[region]}"
    return f"{part_name(part_id)} band {region}"


def line_name(line_id: str) -> str:
    """A rivet line in words: ``web_bottom`` -> "bottom line through the web",
    ``cover_top_l`` -> "left line through the top cover"."""
    m = re.fullmatch(r"web_(top|bottom)", line_id)
    if m:
        return f"{m.group(1)} line through the web"
    m = re.fullmatch(r"cover_(top|bottom)_(l|r)", line_id)
    if m:
        return f"{_SIDE[m.group(2)]} line through the {m.group(1)} cover"
    return line_id.replace("_", " ")


def labelled(item_id: str) -> str:
    """An id with its words beside it, for tables: "angle_tl (top-left flange angle)"; an id
    that has no words of its own is returned as it is."""
    words = line_name(item_id)
    if words == item_id.replace("_", " "):
        words = part_name(item_id)
    return item_id if words == item_id.replace("_", " ") else f"{item_id} ({words})"


_LINE = r"web_(?:top|bottom)|cover_(?:top|bottom)_[lr]"
_PART = r"angle_(?:tl|tr|bl|br)|cover_(?:top|bottom)_\d+"
_LINES = re.compile(rf"\b(?:rivet )?lines? '?({_LINE})'?(?![\w'])")
_PARTS = re.compile(rf"\bpart '?({_PART}|web)'?(?![\w'])")
_LINE_IDS = re.compile(rf"\b({_LINE})\b")
_IDS = re.compile(rf"\b({_PART})\b")


def readable(text: str) -> str:
    """A sentence of core's with the girder template's part and rivet line ids in words
    ("rivet line 'web_bottom'" -> "bottom line through the web", "part 'angle_bl'" ->
    "bottom-left flange angle")."""
    text = _LINES.sub(lambda m: line_name(m.group(1)), text)
    text = _PARTS.sub(lambda m: part_name(m.group(1)), text)
    text = _LINE_IDS.sub(lambda m: line_name(m.group(1)), text)
    text = _PAIR.sub(r"left and right lines through the \1 cover", text)
    return _IDS.sub(lambda m: part_name(m.group(1)), text)


# the two lines of one cover plate, named together
_PAIR = re.compile(r"left line through the (top|bottom) cover \+ right line through the \1 cover")


def annotated(text: str) -> str:
    """A sentence with each girder template id followed by its words, for the report
    ("rivets, line web_bottom" -> "rivets, line web_bottom (bottom line through the web)");
    the ids stay, so that the report can be read against the survey file."""
    text = _QUOTED_LINE.sub(lambda m: f"{m.group(0)} ({line_name(m.group(1))})", text)
    text = _QUOTED_PART.sub(lambda m: f"{m.group(0)} ({part_name(m.group(1))})", text)
    text = _BARE_LINE.sub(lambda m: f"{m.group(1)} ({line_name(m.group(1))})", text)
    return _BARE_PART.sub(lambda m: f"{m.group(1)} ({part_name(m.group(1))})", text)


# an id in quotes gets its words after the closing quote; a bare id right after it
_QUOTED_LINE = re.compile(rf"'({_LINE})'")
_QUOTED_PART = re.compile(rf"'({_PART})'")
_BARE_LINE = re.compile(rf"(?<!')\b({_LINE})\b(?!')")
_BARE_PART = re.compile(rf"(?<!')\b({_PART})\b(?!')")
