"""The reading guard: a thickness reading that is probably a slip is held before it is stored.

A held value is not stored until the inspector chooses: "store as read" (the reading is
stored with the guard's reasons in ``Reading.stored_as_read``, shown in the report) or "fix".
A value is held when (the rule is ours; each limit says where it comes from):

* **above nominal**: more than the nominal thickness. Corrosion only removes steel; a value
  above nominal is a misreading, a drawing error or a slip (120 typed for 12.0), and the
  value used would be capped at nominal, hiding any loss (common practice, no source).
* **below the plausible range**: less than :data:`LOW` = 20 % of nominal. Possible on a
  badly wasted plate, so it must be confirmed rather than refused (the issue's figure;
  common practice, no source).
* **a slipped decimal point or unit**: the value is out of range but ten times more or less,
  or the value in the other of mm / in, would be in range (common practice, no source).
* **far from the part's other readings**: with at least :data:`MIN_OTHERS` other readings in
  the same part region, the modified z-score 0.6745 (x - median) / MAD exceeds
  :data:`Z_LIMIT` = 3.5 (Iglewicz and Hoaglin, "How to Detect and Handle Outliers", ASQC
  1993; from memory), where MAD is the median absolute deviation of the other readings,
  taken at least :data:`MAD_FLOOR_MM` (the ultrasonic gauge's tolerance, about 0.1 mm, see
  the design notes: common practice, no source) or :data:`MAD_FLOOR_SHARE` = 5 % of their
  median (so that a few equal readings do not hold every later one; common practice, no
  source); or, with one or two other readings, a factor of ten or more from their median.

No kivy here: the field app asks :func:`hold_reasons` and shows the answer.
"""

from __future__ import annotations

import statistics
from collections.abc import Sequence
from dataclasses import dataclass

from core.errors import InputError
from core.units import from_internal, to_internal

LOW = 0.20  # common practice, no source (the figure)
HIGH = 1.00  # above nominal: corrosion only removes steel
Z_LIMIT = 3.5  # Iglewicz and Hoaglin (1993), from memory
Z_FACTOR = 0.6745  # the 0.75 quantile of the standard normal distribution
MIN_OTHERS = 3  # a median absolute deviation needs a few values; common practice, no source
MAD_FLOOR_MM = 0.1  # ultrasonic gauge tolerance; common practice, no source
MAD_FLOOR_SHARE = 0.05  # of the median of the other readings; common practice, no source
TEN = 10.0  # a slipped decimal point


@dataclass(frozen=True)
class Hold:
    """One reason to hold a reading: ``code`` (``above_nominal``, ``below_range``,
    ``slip``, ``outlier``) and the sentence shown to the inspector."""

    code: str
    message: str


def _fmt(v: float) -> str:
    return f"{v:.4g}"


def hold_reasons(
    value: float, unit: str, t_nominal: float, others: Sequence[float] = (), where: str = ""
) -> list[Hold]:
    """Why a reading ``value`` (in ``unit``) on a region of nominal thickness ``t_nominal``
    (mm) should be confirmed before it is stored; ``others`` are the region's other readings
    (mm). Empty when the value looks right.

    Raises:
        UnitError: ``unit`` is not a length; InputError: ``t_nominal`` not positive.
    """
    if not t_nominal > 0.0:
        raise InputError(f"nominal thickness {t_nominal!r} mm must be positive", where=where)
    v = to_internal(value, unit, "length", where=where)
    nom = from_internal(t_nominal, "length", unit)
    r = v / t_nominal
    out: list[Hold] = []
    if r > HIGH:
        out.append(
            Hold(
                "above_nominal",
                f"{_fmt(value)} {unit} is above the nominal {_fmt(nom)} {unit} ({100 * r:.0f} %)",
            )
        )
    elif r < LOW:
        out.append(
            Hold(
                "below_range",
                f"{_fmt(value)} {unit} is {100 * r:.0f} % of the nominal {_fmt(nom)} {unit} "
                f"(below {100 * LOW:.0f} %)",
            )
        )
    if out:
        slip = _slip(value, unit, v, t_nominal)
        return [*out, Hold("slip", slip)] if slip else out
    return _outlier(value, unit, v, others)


def _slip(value: float, unit: str, v: float, t_nominal: float) -> str:
    """A guess at what was meant when the value is out of range, or ''."""
    for factor in (1 / TEN, TEN):
        if LOW <= v * factor / t_nominal <= HIGH:
            return f"did you mean {_fmt(value * factor)} {unit}?"
    for alt in ("mm", "in"):
        if alt == unit:
            continue
        a = to_internal(value, alt, "length")
        if a != v and LOW <= a / t_nominal <= HIGH:
            return f"it fits as {_fmt(value)} {alt} (typed in {alt}?)"
    return ""


def _outlier(value: float, unit: str, v: float, others: Sequence[float]) -> list[Hold]:
    if not others:
        return []
    med = statistics.median(others)
    shown = f"{_fmt(from_internal(med, 'length', unit))} {unit}"
    n = len(others)
    if v >= TEN * med or v <= med / TEN:
        return [
            Hold(
                "outlier",
                f"{_fmt(value)} {unit} is ten times or more from the other readings here "
                f"(median {shown})",
            )
        ]
    if n < MIN_OTHERS:
        return []
    mad = statistics.median(abs(x - med) for x in others)
    mad = max(mad, MAD_FLOOR_MM, MAD_FLOOR_SHARE * med)
    z = Z_FACTOR * (v - med) / mad
    if abs(z) <= Z_LIMIT:
        return []
    return [
        Hold(
            "outlier",
            f"{_fmt(value)} {unit} is far from the other {n} readings here (median {shown}, "
            f"modified z-score {z:+.1f})",
        )
    ]


def as_read_text(holds: Sequence[Hold]) -> str:
    """What a reading stored as read keeps in ``Reading.stored_as_read``."""
    return "; ".join(h.message for h in holds)
