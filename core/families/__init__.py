"""Standard families: one assessment follows one (clauses, factors, load model, measure).

Public API::

    from core.families import FAMILIES, build_family
    family = build_family("en1993", options, survey)
    family.factor("gamma_M1")          # 1.10 (EN 1993-2 Table 6.1, from memory)

:data:`FAMILIES` maps each key to its title and builder; :func:`build_family` returns the
frozen :class:`core.families.base.Family` the checks are handed.
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass

from core.errors import InputError
from core.families.base import Document, Factor, Family, LimitStateSpec


@dataclass(frozen=True)
class FamilyEntry:
    key: str
    title: str
    build: Callable


def _entries() -> dict[str, FamilyEntry]:
    from core.families import aashto, aisc, en1993

    return {
        "aashto": FamilyEntry("aashto", "AASHTO LRFD and MBE (LRFR)", aashto.build),
        "aisc": FamilyEntry("aisc", "AISC 360-22 with Appendix 5", aisc.build),
        "en1993": FamilyEntry(
            "en1993", "EN 1993 with EN 1993-2, EN 1991-2, EN 1990 A2", en1993.build
        ),
    }


FAMILY_KEYS: tuple[str, ...] = ("aashto", "aisc", "en1993")


def build_family(key: str, options, survey) -> Family:
    """The family ``key`` configured with the engineer's ``options`` for ``survey``.

    Raises:
        InputError: an unknown family (the message lists the known ones), or a factor the
            family does not have / a value out of its range.
    """
    entries = _entries()
    if key not in entries:
        raise InputError(f"unknown standard family {key!r}; known: {sorted(entries)}")
    return entries[key].build(options, survey)


__all__ = ["FAMILY_KEYS", "Document", "Factor", "Family", "LimitStateSpec", "build_family"]
