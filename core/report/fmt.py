"""Numbers and units as the report prints them.

Every displayed quantity is converted by :func:`core.units.show`; large SI section
constants are printed in powers of ten of their unit (``10⁶ mm⁴``) so that columns stay
readable. Positions along a member are printed in metres or feet
(:func:`core.units.from_internal`). Tests format the engine's numbers with these same
functions to find them in the PDF text.
"""

from __future__ import annotations

import math
import re

from core.units import from_internal, show, symbol

#: (system, kind) -> power of ten the displayed value is divided by
_SCALE = {
    ("si", "inertia"): 6,
    ("si", "section_modulus"): 3,
    ("si", "first_moment"): 3,
}
_SUPER = str.maketrans("0123456789-", "⁰¹²³⁴⁵⁶⁷⁸⁹⁻")
POSITION_UNIT = {"si": "m", "us": "ft"}
DASH = "–"


def num(v: float | None, digits: int = 4) -> str:
    """``v`` rounded to ``digits`` significant digits, thousands grouped, no exponent."""
    if v is None:
        return DASH
    v = float(v)
    if not math.isfinite(v):
        return "n/a"
    if v == 0.0:
        return "0"
    v = float(f"{v:.{digits - 1}e}")  # rounded to the significant digits first
    mag = math.floor(math.log10(abs(v)))
    if mag >= digits - 1:
        r = round(v, -(mag - digits + 1))
        return f"{r:,.0f}"
    decimals = digits - 1 - mag
    s = f"{v:,.{decimals}f}"
    if float(s.replace(",", "")) == 0.0:
        return "0"
    return s


def tick(v: float) -> str:
    """An axis tick label: three significant digits, trailing zeros dropped."""
    s = num(v, 3)
    return s.rstrip("0").rstrip(".") if "." in s else s


def ratio(v: float | None) -> str:
    """A capacity ratio as-found / as-built: three decimals."""
    if v is None:
        return DASH
    return "n/a" if not math.isfinite(v) else f"{v:.3f}"


def rf(v: float | None) -> str:
    """A rating factor: three significant digits."""
    return num(v, 3)


def pct(v: float | None) -> str:
    """A percentage to one decimal."""
    return DASH if v is None else f"{v:.1f}"


def unit_label(kind: str, system: str) -> str:
    """Printable display unit of ``kind`` in ``system``, with its power of ten if scaled."""
    sym = show(1.0, kind, system).symbol
    p = _SCALE.get((system, kind))
    return f"10{str(p).translate(_SUPER)} {sym}" if p else sym


def value(v: float | None, kind: str, system: str, digits: int = 4) -> str:
    """An internal value of ``kind`` converted for display (number only; unit in the header)."""
    if v is None:
        return DASH
    if kind == "dimensionless":
        return num(v, digits)
    shown = show(v, kind, system).value
    p = _SCALE.get((system, kind))
    return num(shown / 10**p if p else shown, digits)


def with_unit(v: float | None, kind: str, system: str, digits: int = 4) -> str:
    """A value followed by its unit (for running text)."""
    if v is None:
        return DASH
    u = unit_label(kind, system)
    return f"{value(v, kind, system, digits)} {u}".rstrip()


def position(x_mm: float, system: str) -> str:
    """A position along a member, in metres (SI, to the millimetre) or feet (US, to the
    hundredth), trailing zeros dropped."""
    u = POSITION_UNIT[system]
    v = from_internal(x_mm, "length", u)
    s = f"{v:,.{3 if system == 'si' else 2}f}".rstrip("0").rstrip(".")
    return "0" if s in ("", "-0") else s


def position_label(system: str) -> str:
    return symbol(POSITION_UNIT[system])


def system_name(system: str) -> str:
    return "SI units" if system == "si" else "US customary units"


#: SI quantities that engine prose (reasons, notes, choice values) may carry: symbol -> (kind,
#: factor from the printed number to the internal unit)
_PROSE_UNITS = {
    "mm²": ("area", 1.0),
    "mm": ("length", 1.0),
    "MPa": ("stress", 1.0),
    "kN": ("force", 1e3),
}
_PROSE = re.compile(r"(?<![\w.])(-?\d[\d,]*(?:\.\d+)?(?:[eE][+-]?\d+)?) ?(mm²|mm|MPa|kN)(?![\w²])")

_LABELLED = re.compile(r"(-?\d+(?:\.\d+)?(?:[eE][+-]?\d+)?): (.*), (mm²|mm|MPa|kN)", re.S)


def prose(text: str, system: str) -> str:
    """Free text from the engine with its SI quantities shown in ``system``'s units.

    The checks and the assumptions word their reasons in the internal units ("projecting
    width 127 mm > 16 tp = 91.44 mm"); a US customary report prints each such quantity in
    its display unit ("5 in > 16 tp = 3.6 in"), so that one page never mixes the two
    systems. SI text is returned unchanged; numbers without a unit (clause numbers,
    factors) are never touched."""
    if system == "si" or not text:
        return text

    def one(m: re.Match) -> str:
        if text[m.start() - 1 : m.start()] == "(" and text[m.end() : m.end() + 1] == ")":
            return m.group(0)  # already the SI twin of a quantity printed in US units
        kind, k = _PROSE_UNITS[m.group(2)]
        shown = show(float(m.group(1).replace(",", "")) * k, kind, system)
        return f"{num(shown.value, 3)} {shown.symbol}"

    labelled = _LABELLED.fullmatch(text)  # "124.1: nominal shear stress of ..., MPa"
    if labelled and labelled.group(3) in _PROSE_UNITS:
        kind, k = _PROSE_UNITS[labelled.group(3)]
        shown = show(float(labelled.group(1)) * k, kind, system)
        return f"{num(shown.value, 3)}: {labelled.group(2)}, {shown.symbol}"
    return _PROSE.sub(one, text)
