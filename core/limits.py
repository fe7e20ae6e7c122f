"""Bounds on what an input may hold: sizes checked before any expansion, physical ranges.

A survey file, a field store entry or a section description that goes beyond one of these
is refused with the value, the limit and the place; nothing is expanded or computed first.
The limits are far beyond any real riveted or bolted member (a 100 m girder with rivets at
75 mm pitch has 1,334 rivets on a line) and small enough that the work of validating,
assessing and reporting a survey stays bounded (seconds, not hours). They are published in
``docs/survey-format.md`` and, where a JSON Schema can say them, in
``core/schema/survey-1.schema.json`` (a test keeps the two equal).

Physical ranges (internal units mm, N, MPa): common practice, no source; chosen wide enough
for any member a field inspection meets and narrow enough to catch unit slips and typing
errors by orders of magnitude.
"""

from __future__ import annotations

import math

from core.errors import InputError

# ---------------------------------------------------------------- counts (checked before use)
#: members in one survey
MAX_MEMBERS = 100
#: stations along one member
MAX_STATIONS = 5_000
#: stations in one survey, all members together (a report of this many takes minutes)
MAX_STATIONS_PER_SURVEY = 20_000
#: thickness readings at one station
MAX_READINGS = 500
#: loss bands, and perforations, at one station (each)
MAX_CUTS = 100
#: rivets on one rivet line (a run's rivets and the listed states together)
MAX_RIVETS_PER_LINE = 10_000
#: rivets on one member, all lines together (the report draws each: about 4 s per 10,000)
MAX_RIVETS_PER_MEMBER = 40_000
#: rivet lines with recorded states on one member
MAX_RIVET_LINES = 64
#: parts of one cross-section
MAX_PARTS = 100
#: axles of one load train
MAX_AXLES = 100
#: inspection dates, and photos of one station (each)
MAX_LIST = 1_000
#: characters of an id (member, station, reading, part, rivet line)
MAX_ID = 200
#: characters of a free text (notes, names, titles, locations)
MAX_TEXT = 20_000
#: bytes of an input file (survey file or section description)
MAX_FILE_BYTES = 32 * 1024 * 1024

# ---------------------------------------------------------------- physical ranges
#: shortest length: below any gauge's resolution (mm)
MIN_LENGTH_MM = 0.01
#: longest length or largest coordinate: 1 km (mm)
MAX_LENGTH_MM = 1_000_000.0
#: largest force (shear, axle load): 1e9 N (one million kN)
MAX_FORCE_N = 1e9
#: largest bending moment: 1e13 N mm (1e7 kN m; a hundred times the largest girders')
MAX_MOMENT_NMM = 1e13
#: largest force per length (a uniform load): 1e6 N/mm (1e6 kN/m)
MAX_FORCE_PER_LENGTH = 1e6


def count(n: int, limit: int, what: str, where: str = "") -> int:
    """``n`` when it is within ``limit``.

    Raises:
        InputError: ``n`` is above ``limit`` (the message names both and ``what``).
    """
    if n > limit:
        raise InputError(f"{n:,} {what} is more than the limit of {limit:,}", where=where)
    return n


def size(v: float, name: str, where: str = "", *, allow_zero: bool = False) -> float:
    """A length in mm (a size: thickness, width, pitch, span) within the physical range.

    Raises:
        InputError: not finite, below :data:`MIN_LENGTH_MM` (zero only if allowed) or
        above :data:`MAX_LENGTH_MM`.
    """
    ok = math.isfinite(v) and ((allow_zero and v == 0.0) or MIN_LENGTH_MM <= v <= MAX_LENGTH_MM)
    if not ok:
        low = "0 or " if allow_zero else ""
        raise InputError(
            f"{name} = {v:g} mm is outside the allowed range ({low}{MIN_LENGTH_MM:g} to "
            f"{MAX_LENGTH_MM:g} mm)",
            where=where,
        )
    return v


def coord(v: float, name: str, where: str = "") -> float:
    """A coordinate or position in mm within +/- :data:`MAX_LENGTH_MM`.

    Raises:
        InputError: not finite or beyond the range.
    """
    if not (math.isfinite(v) and abs(v) <= MAX_LENGTH_MM):
        raise InputError(
            f"{name} = {v:g} mm is outside the allowed range (-{MAX_LENGTH_MM:g} to "
            f"{MAX_LENGTH_MM:g} mm)",
            where=where,
        )
    return v


def within(v: float, lo: float, hi: float, name: str, unit: str, where: str = "") -> float:
    """``v`` when it is finite and within ``lo`` to ``hi`` (in ``unit``, for the message).

    Raises:
        InputError: naming the value, the range and ``where``.
    """
    if not (math.isfinite(v) and lo <= v <= hi):
        raise InputError(
            f"{name} = {v:g} {unit} is outside the allowed range ({lo:g} to {hi:g} {unit})",
            where=where,
        )
    return v
