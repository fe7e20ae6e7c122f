"""Units at the edges: one pint registry; internal units are N, mm and MPa.

Input values may be given in any unit pint knows (SI or US customary). They are converted
to the internal unit of their kind once, on entry; display and reports convert back.
"""

from __future__ import annotations

import math
import re
from dataclasses import dataclass
from functools import lru_cache
from typing import Literal

import pint

from core.errors import UnitError

ureg = pint.UnitRegistry()
Q_ = ureg.Quantity

UnitSystem = Literal["si", "us"]

#: internal unit of each quantity kind
INTERNAL: dict[str, str] = {
    "length": "mm",
    "position": "mm",
    "area": "mm**2",
    "first_moment": "mm**3",
    "section_modulus": "mm**3",
    "inertia": "mm**4",
    "warping_constant": "mm**6",
    "force": "N",
    "force_per_length": "N/mm",
    "stress": "MPa",
    "moment": "N*mm",
    "time": "year",
    "dimensionless": "dimensionless",
}

#: display unit of each kind, per unit system
DISPLAY: dict[UnitSystem, dict[str, str]] = {
    "si": {
        "length": "mm",
        "position": "m",
        "area": "mm**2",
        "first_moment": "mm**3",
        "section_modulus": "mm**3",
        "inertia": "mm**4",
        "warping_constant": "mm**6",
        "force": "kN",
        "force_per_length": "N/mm",
        "stress": "MPa",
        "moment": "kN*m",
        "time": "year",
        "dimensionless": "dimensionless",
    },
    "us": {
        "length": "in",
        "position": "ft",
        "area": "in**2",
        "first_moment": "in**3",
        "section_modulus": "in**3",
        "inertia": "in**4",
        "warping_constant": "in**6",
        "force": "kip",
        "force_per_length": "kip/in",
        "stress": "ksi",
        "moment": "kip*ft",
        "time": "year",
        "dimensionless": "dimensionless",
    },
}

#: short printable symbols for display units
SYMBOL: dict[str, str] = {
    "mm": "mm",
    "mm**2": "mm²",
    "mm**3": "mm³",
    "mm**4": "mm⁴",
    "mm**6": "mm⁶",
    "N": "N",
    "kN": "kN",
    "N/mm": "N/mm",
    "MPa": "MPa",
    "N*mm": "N·mm",
    "kN*m": "kN·m",
    "in": "in",
    "in**2": "in²",
    "in**3": "in³",
    "in**4": "in⁴",
    "in**6": "in⁶",
    "kip": "kip",
    "kip/in": "kip/in",
    "ksi": "ksi",
    "kip*ft": "kip·ft",
    "m": "m",
    "ft": "ft",
    "year": "years",
    "dimensionless": "",
}


def to_internal(value: float, unit: str, kind: str, *, where: str = "") -> float:
    """Convert ``value`` given in ``unit`` to the internal unit of ``kind``.

    Args:
        value: the number as entered.
        unit: any unit string pint understands, e.g. ``"in"``, ``"mm"``, ``"ksi"``.
        kind: a key of :data:`INTERNAL` (``"length"``, ``"stress"``, ...).
        where: the place the value came from, for error messages.

    Raises:
        UnitError: unknown unit, a unit of the wrong dimension, or a non-finite value.
    """
    if kind not in INTERNAL:
        raise UnitError(f"unknown quantity kind {kind!r}; known: {sorted(INTERNAL)}", where=where)
    if isinstance(value, bool):
        raise UnitError(f"{value!r} is not a number", where=where)
    try:
        v = float(value)
    except (TypeError, ValueError):
        raise UnitError(f"{value!r} is not a number", where=where) from None
    except OverflowError:
        raise UnitError(f"{_short(value)} is too large a number", where=where) from None
    if not math.isfinite(v):
        raise UnitError(f"{value!r} is not a finite number", where=where)
    out = v * _factor(unit, kind, where)
    if not math.isfinite(out):
        raise UnitError(f"{v:g} {unit} is too large a number in {INTERNAL[kind]}", where=where)
    return out


def _short(value: object, n: int = 30) -> str:
    s = repr(value)
    return s if len(s) <= n else f"{s[:n]}... ({len(s)} characters)"


#: longest unit text read (a unit is a few names, products, quotients and small powers)
MAX_UNIT_TEXT = 64
_SMALL_POWER = re.compile(r"(\*\*|\^)\s*[-+]?\d{1,2}(?![\d.eE*^])")


def _unit_text(unit: object, kind: str, where: str) -> str:
    """The unit text, refused before pint reads it when it is long or holds numbers other
    than small integer powers (pint evaluates numbers, and ``10**10**10`` never ends)."""
    u = str(unit)
    if len(u) > MAX_UNIT_TEXT:
        raise UnitError(f"unit {_short(u)} is longer than {MAX_UNIT_TEXT} characters", where=where)
    if any(c.isdigit() for c in _SMALL_POWER.sub("", u)):
        raise UnitError(
            f"unit {u!r} holds a number; a unit may hold only names and small powers "
            f"such as mm**2 (expected something convertible to {INTERNAL[kind]})",
            where=where,
        )
    return u


@lru_cache(maxsize=512)
def _scale(unit: str, target: str) -> float:
    """Factor from ``unit`` to ``target`` (all quantity kinds here are multiplicative)."""
    return float(Q_(1.0, unit).to(target).magnitude)


@lru_cache(maxsize=1024)
def _known_factor(unit: str, kind: str) -> float:
    """The factor of a unit text already read once (a failure is not kept: the next call
    goes the long way and raises with its place)."""
    return _scale(_unit_text(unit, kind, ""), INTERNAL[kind])


def _factor(unit: str, kind: str, where: str) -> float:
    if type(unit) is str:
        try:
            return _known_factor(unit, kind)
        except Exception:  # the long way below says what is wrong, with the place
            pass
    text = _unit_text(unit, kind, where)
    try:
        return _scale(text, INTERNAL[kind])
    except pint.errors.UndefinedUnitError:
        raise UnitError(f"unknown unit {unit!r}", where=where) from None
    except pint.errors.DimensionalityError:
        raise UnitError(
            f"unit {unit!r} is not a {kind.replace('_', ' ')} unit "
            f"(expected something convertible to {INTERNAL[kind]})",
            where=where,
        ) from None
    except Exception as e:  # pint's parser raises many kinds (ZeroDivisionError for "1/0")
        raise UnitError(
            f"unit {unit!r} cannot be read ({type(e).__name__}: {e})", where=where
        ) from None


def scale(unit: str, target: str) -> float:
    """The factor from ``unit`` to ``target`` (units pint knows; kept once found).

    Raises:
        pint.errors.PintError: unknown units or units of different kinds.
    """
    return _scale(unit, target)


def from_internal(value: float, kind: str, unit: str) -> float:
    """Convert an internal ``value`` of ``kind`` to ``unit``."""
    return value * _scale(INTERNAL[kind], unit)


def display_unit(kind: str, system: UnitSystem) -> str:
    """The display unit of ``kind`` in ``system`` (``"si"`` or ``"us"``)."""
    if system not in DISPLAY:
        raise UnitError(f"unknown unit system {system!r}; allowed: 'si', 'us'")
    return DISPLAY[system][kind]


def symbol(unit: str) -> str:
    """A short printable symbol for ``unit``."""
    return SYMBOL.get(unit, unit)


@dataclass(frozen=True)
class Shown:
    """A value converted for display: number, unit string and printable symbol."""

    value: float
    unit: str

    @property
    def symbol(self) -> str:
        return symbol(self.unit)


def show(value: float, kind: str, system: UnitSystem) -> Shown:
    """Convert an internal value of ``kind`` to the display unit of ``system``."""
    unit = display_unit(kind, system)
    return Shown(from_internal(value, kind, unit), unit)
