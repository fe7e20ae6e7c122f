"""Capacity checks: web shear per standard, rivets, flexure, material, rating and flags.

Pure functions on scalars in internal units (N, mm, MPa; strings with units accepted).
:func:`web_shear` gives one call signature over the standards in :data:`STANDARDS`.
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass
from typing import Any

from core.checks import aashto_shear, aisc_shear, en1993_shear
from core.checks._inputs import Number
from core.checks.aashto_shear import PANELS, Panel
from core.checks.results import CapacityResult, CheckValue, ShearResult
from core.errors import InputError

__all__ = [
    "PANELS",
    "STANDARDS",
    "CapacityResult",
    "CheckValue",
    "ShearResult",
    "Standard",
    "web_shear",
]


@dataclass(frozen=True)
class Standard:
    """A design standard the user can pick for web shear."""

    key: str
    title: str
    edition: str
    clause: str
    shear: Callable[..., ShearResult]


def _aashto(*, Fy, E, D, tw, panel, do, bfc, tfc, bft, tft, where="", **kw: Any) -> ShearResult:
    return aashto_shear.web_shear(
        Fyw=Fy,
        E=E,
        D=D,
        tw=tw,
        panel=panel,
        do=do,
        bfc=bfc,
        tfc=tfc,
        bft=bft,
        tft=tft,
        where=where,
        **kw,
    )


def _aisc(*, Fy, E, D, tw, panel, do, bfc, tfc, bft, tft, where="", **kw: Any) -> ShearResult:
    return aisc_shear.web_shear(
        Fy=Fy,
        E=E,
        h=D,
        tw=tw,
        panel=panel,
        a=do,
        bfc=bfc,
        tfc=tfc,
        bft=bft,
        tft=tft,
        where=where,
        **kw,
    )


def _en1993(*, Fy, E, D, tw, panel, do, bfc, tfc, bft, tft, where="", **kw: Any) -> ShearResult:
    return en1993_shear.web_shear(fyw=Fy, E=E, hw=D, t=tw, panel=panel, a=do, where=where, **kw)


#: the standards available for web shear, by key
STANDARDS: dict[str, Standard] = {
    "aashto": Standard(
        "aashto", aashto_shear.STANDARD, aashto_shear.EDITION, "Article 6.10.9", _aashto
    ),
    "aisc": Standard(
        "aisc", aisc_shear.STANDARD, aisc_shear.EDITION, "Chapter G, G2.1 and G2.2", _aisc
    ),
    "en1993": Standard(
        "en1993",
        en1993_shear.STANDARD,
        en1993_shear.EDITION,
        "Section 5, 5.2 and 5.3, Annex A.3",
        _en1993,
    ),
}


def web_shear(
    standard: str,
    *,
    Fy: Number,
    E: Number,
    D: Number,
    tw: Number,
    panel: Panel = "unstiffened",
    do: Number | None = None,
    bfc: Number | None = None,
    tfc: Number | None = None,
    bft: Number | None = None,
    tft: Number | None = None,
    where: str = "",
    **options: Any,
) -> ShearResult:
    """Web shear resistance of one panel per the chosen standard.

    Args:
        standard: a key of :data:`STANDARDS` (``"aashto"``, ``"aisc"``, ``"en1993"``).
        Fy: web yield strength, MPa. E: modulus, MPa.
        D: web depth used by the check, mm (D, h or hw of the standard).
        tw: web thickness, mm. panel: ``"unstiffened"``, ``"interior"`` or ``"end"``.
        do: transverse stiffener spacing, mm (stiffened panels).
        bfc, tfc, bft, tft: flange widths and thicknesses, mm (tension field limits;
            not used by EN 1993-1-5).
        where: location for error messages.
        options: standard-specific keywords: AISC ``d`` (overall depth for Aw),
            ``reduced_tension_field``; EN 1993 ``end_post``, ``eta``, ``gamma_M1``.

    Raises:
        InputError: unknown standard (the message lists the known ones), or any input
            error of the standard's check.
    """
    key = standard.strip().lower() if isinstance(standard, str) else standard
    if key not in STANDARDS:
        raise InputError(
            f"unknown standard {standard!r}; known standards: {sorted(STANDARDS)}", where=where
        )
    return STANDARDS[key].shear(
        Fy=Fy,
        E=E,
        D=D,
        tw=tw,
        panel=panel,
        do=do,
        bfc=bfc,
        tfc=tfc,
        bft=bft,
        tft=tft,
        where=where,
        **options,
    )
