"""Names the inspector reads: re-exported from :mod:`core.names`, the one source of the words
for parts, regions and rivet lines (the report uses the same)."""

from __future__ import annotations

from core.names import LEG_NAMES, labelled, line_name, part_name, place_name, readable, region_name

__all__ = [
    "LEG_NAMES",
    "labelled",
    "line_name",
    "part_name",
    "place_name",
    "readable",
    "region_name",
]
