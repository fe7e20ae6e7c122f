"""Input coercion and range checks shared by the capacity checks.

Every number a check accepts may be a plain number in the internal unit of its kind
(N, mm, MPa), a string with a unit (``"36 ksi"``, ``"0.5 in"``) or a pint quantity; it
is converted once, here, through :mod:`core.units`.
"""

from __future__ import annotations

import math
from typing import Any

import pint

from core.errors import InputError, UnitError
from core.units import INTERNAL, Q_, to_internal

Number = float | int | str | Any  # plain number (internal unit), "36 ksi", or a pint Quantity


def internal(
    x: Number,
    kind: str,
    name: str,
    *,
    where: str = "",
    low: float | None = None,
    high: float | None = None,
    low_inclusive: bool = False,
) -> float:
    """Convert ``x`` to the internal unit of ``kind`` and check ``low < x <= high``.

    Args:
        x: a number in the internal unit of ``kind``, a string such as ``"36 ksi"``, or a
            pint quantity.
        kind: a key of :data:`core.units.INTERNAL`.
        name: the symbol shown in error messages (``"tw"``, ``"Fyw"``).
        where: location for error messages.
        low, high: allowed range in internal units (``None``: unbounded).
        low_inclusive: allow ``x == low``.

    Raises:
        UnitError: a unit of the wrong kind or an unknown unit.
        InputError: not a finite number, or outside the allowed range.
    """
    unit = INTERNAL[kind]
    if isinstance(x, bool):
        raise InputError(f"{name} = {x!r} is not a number", where=where)
    if isinstance(x, str):
        try:
            q = Q_(x.strip())
        except Exception:  # pint's parser raises assorted error types on garbage text
            raise UnitError(f"{name} = {x!r} is not a number with a unit", where=where) from None
        if not isinstance(q, pint.Quantity):
            q = Q_(float(q), unit)
        elif q.dimensionless and kind != "dimensionless":
            q = Q_(q.magnitude, unit)
        v = to_internal(q.magnitude, str(q.units), kind, where=where)
    elif isinstance(x, pint.Quantity):
        v = to_internal(x.magnitude, str(x.units), kind, where=where)
    else:
        try:
            v = float(x)
        except (TypeError, ValueError):
            raise InputError(f"{name} = {x!r} is not a number", where=where) from None
    if not math.isfinite(v):
        raise InputError(f"{name} = {x!r} is not a finite number", where=where)
    below = low is not None and (v < low if low_inclusive else v <= low)
    above = high is not None and v > high
    if below or above:
        lo = "-inf" if low is None else f"{low:g}"
        hi = "inf" if high is None else f"{high:g}"
        br = "[" if low_inclusive else "("
        sym = "" if unit == "dimensionless" else f" {unit}"
        raise InputError(
            f"{name} = {v:g}{sym} is outside the allowed range {br}{lo}, {hi}]{sym}", where=where
        )
    return v


def length(x: Number, name: str, *, where: str = "") -> float:
    """A positive length in mm, at most 20 m."""
    return internal(x, "length", name, where=where, low=0.0, high=20_000.0)


def stress(x: Number, name: str, *, where: str = "", high: float = 2_000.0) -> float:
    """A positive stress in MPa (default upper bound 2000 MPa)."""
    return internal(x, "stress", name, where=where, low=0.0, high=high)


def modulus(x: Number, name: str = "E", *, where: str = "") -> float:
    """Young's modulus of steel in MPa, 150 000 to 220 000 MPa."""
    return internal(
        x, "stress", name, where=where, low=150_000.0, high=220_000.0, low_inclusive=True
    )


def flanges(
    bfc: Number | None,
    tfc: Number | None,
    bft: Number | None,
    tft: Number | None,
    *,
    needed_for: str,
    where: str = "",
) -> dict[str, float]:
    """Flange widths and thicknesses (mm) that a tension-field check needs.

    Raises:
        InputError: naming every missing one and the clause that needs it, or a value
            out of range.
    """
    given = {"bfc": bfc, "tfc": tfc, "bft": bft, "tft": tft}
    missing = [n for n, v in given.items() if v is None]
    if missing:
        raise InputError(
            f"{', '.join(missing)} (flange width / thickness, mm) required for {needed_for}",
            where=where,
        )
    return {n: length(v, n, where=where) for n, v in given.items()}
