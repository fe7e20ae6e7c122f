"""Names the inspector reads: parts, regions and rivet lines in words, not ids (no kivy).

Files and the store keep the ids (``angle_tl``, ``cover_bottom_1``, ``web_bottom``); the
screens show "top-left angle", "bottom cover 1", "web rivets, bottom". A part or line that is
not from the girder template shows its id with spaces for underscores.
"""

from __future__ import annotations

import re

_CORNER = {"tl": "top-left", "tr": "top-right", "bl": "bottom-left", "br": "bottom-right"}
_SIDE = {"l": "left", "r": "right"}
LEG_NAMES = {"h": "flat leg", "v": "upright leg"}


def part_name(part_id: str) -> str:
    """A part in words: ``angle_tl`` -> "top-left angle", ``cover_top_2`` -> "top cover 2"."""
    m = re.fullmatch(r"angle_(tl|tr|bl|br)", part_id)
    if m:
        return f"{_CORNER[m.group(1)]} angle"
    m = re.fullmatch(r"cover_(top|bottom)_(\d+)", part_id)
    if m:
        return f"{m.group(1)} cover {m.group(2)}"
    return part_id.replace("_", " ")


def region_name(region: str | None) -> str:
    """A region of a part in words: whole part, a leg of an angle, or a band."""
    if not region:
        return "whole part"
    return LEG_NAMES.get(region, f"band {region}")


def place_name(part_id: str, region: str | None) -> str:
    """A part region in words: "web", "top-left angle, flat leg", "web band b1"."""
    if not region:
        return part_name(part_id)
    if region in LEG_NAMES:
        return f"{part_name(part_id)}, {LEG_NAMES[region]}"
    return f"{part_name(part_id)} band {region}"


def line_name(line_id: str) -> str:
    """A rivet line in words: ``web_bottom`` -> "web, bottom", ``cover_top_l`` -> "top
    cover, left"."""
    m = re.fullmatch(r"web_(top|bottom)", line_id)
    if m:
        return f"web, {m.group(1)}"
    m = re.fullmatch(r"cover_(top|bottom)_(l|r)", line_id)
    if m:
        return f"{m.group(1)} cover, {_SIDE[m.group(2)]}"
    return line_id.replace("_", " ")


_IDS = re.compile(r"\b(angle_(?:tl|tr|bl|br)|cover_(?:top|bottom)_\d+)\b")
_LINES = re.compile(r"\brivet line (\w+)")
_LINE_IDS = re.compile(r"\b(web_(?:top|bottom)|cover_(?:top|bottom)_[lr])\b")


def readable(text: str) -> str:
    """core's sentence with the girder template's part and rivet line ids in words
    ("rivet line web_bottom" -> "rivets web, bottom", "angle_bl" -> "bottom-left angle")."""
    text = _LINES.sub(lambda m: f"rivets {line_name(m.group(1))}", text)
    text = _LINE_IDS.sub(lambda m: line_name(m.group(1)), text)
    return _IDS.sub(lambda m: part_name(m.group(1)), text)
