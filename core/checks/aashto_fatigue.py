"""Fatigue of riveted details: AASHTO LRFD 6.6.1.2 (Category D) and the remaining fatigue life
of the AASHTO Manual for Bridge Evaluation, Section 7.

As recalled (from memory; the engineer confirms every default):

- LRFD 9th ed. Table 6.6.1.2.3-1: base metal at the net section of riveted connections and
  riveted members: Category D.
- Table 6.6.1.2.5-1: Category D detail constant A = 22.0 x 10^8 ksi³ (7.21 x 10^11 MPa³);
  Table 6.6.1.2.5-3: constant-amplitude fatigue threshold (Delta F)TH = 7.0 ksi (48.3 MPa).
- 6.6.1.2.5-2: nominal fatigue resistance for finite life (Delta F)n = (A/N)^(1/3).
- Table 6.6.1.2.5-2: stress range cycles per truck passage n: simple-span girders 1.0 for
  spans over 40 ft (12.2 m), 2.0 for shorter spans.
- MBE 3rd ed. 7.2.2: effective stress range (Delta f)eff = Rs Delta f, Delta f the stress
  range at the detail from the fatigue truck (with its dynamic allowance), Rs the partial
  load factor of Table 7.2.2.1-1 (1.0 by default: engineer's input).
- MBE 7.2.4: infinite life when (Delta f)max = 2.0 (Delta f)eff <= (Delta F)TH.
- MBE 7.2.5.1-1: finite total life Y = Rr A / (365 n (ADTT)SL [(Delta f)eff]³) years,
  (ADTT)SL the single-lane average daily truck traffic over the life, Rr the resistance
  factor of Table 7.2.5.2-1: 1.0 for the minimum expected life (the default here; the
  evaluation and mean lives take the table's larger factors, the engineer's input).
- remaining life = Y - age (MBE 7.2.5; traffic taken as constant at the average given).

The result's ``Rn`` is (Delta F)TH / 2.0, the largest effective stress range with an
infinite life, to compare with (Delta f)eff.
"""

from __future__ import annotations

from dataclasses import dataclass

from core.checks._inputs import Number, internal
from core.checks.fatigue import FatigueResult, fatigue_result
from core.checks.results import ENGINEER, CheckValue
from core.checks.sources import AASHTO_LRFD, AASHTO_MBE, member_length
from core.units import to_internal


@dataclass(frozen=True)
class Category:
    """A detail category: detail constant A (MPa³) and threshold (MPa)."""

    name: str
    A: float
    threshold: float
    source: str


#: Category D, riveted details (LRFD Tables 6.6.1.2.3-1, 6.6.1.2.5-1, 6.6.1.2.5-3; from memory)
CATEGORY_D = Category(
    "D",
    A=22.0e8 * to_internal(1.0, "ksi", "stress") ** 3,
    threshold=to_internal(7.0, "ksi", "stress"),
    source=AASHTO_LRFD.ref("Tables 6.6.1.2.5-1 and 6.6.1.2.5-3, Category D"),
)
#: Rr for the minimum expected life, MBE Table 7.2.5.2-1 (from memory)
RR_MINIMUM = 1.0
#: ratio of the largest to the effective stress range, MBE 7.2.4 (from memory)
MAX_TO_EFFECTIVE = 2.0
#: span below which a simple-span girder sees 2 cycles per truck, Table 6.6.1.2.5-2 (from memory)
SHORT_SPAN = to_internal(40.0, "ft", "length")


def cycles_per_truck(span: Number, *, where: str = "") -> float:
    """n for a simple-span girder: 1.0 above 40 ft (12.2 m), 2.0 at or below
    (LRFD Table 6.6.1.2.5-2; from memory)."""
    return 1.0 if member_length(span, "span", where=where) > SHORT_SPAN else 2.0


def nominal_resistance(N: Number, category: Category = CATEGORY_D, *, where: str = "") -> float:
    """(Delta F)n = (A/N)^(1/3), MPa, for N cycles (LRFD 6.6.1.2.5-2)."""
    n = internal(N, "dimensionless", "N", where=where, low=0.0, high=1e15)
    return (category.A / n) ** (1.0 / 3.0)


def remaining_life(
    *,
    delta_f: Number,
    ADTT_SL: Number,
    age: Number,
    n: float = 1.0,
    Rs: float = 1.0,
    Rr: float = RR_MINIMUM,
    category: Category = CATEGORY_D,
    where: str = "",
) -> FatigueResult:
    """Infinite-life check and finite fatigue life of a riveted detail (MBE Section 7).

    Args:
        delta_f: stress range at the detail from one passage of the fatigue truck, MPa.
        ADTT_SL: single-lane average daily truck traffic over the life, trucks a day.
        age: years in service so far. n: stress range cycles per truck passage.
        Rs: partial load factor on the stress range (MBE Table 7.2.2.1-1).
        Rr: resistance factor for the life sought (MBE Table 7.2.5.2-1; 1.0 minimum life).
        category: the detail category (default Category D, riveted).
        where: place for messages.

    Raises:
        InputError: values out of range.
    """
    df = internal(
        delta_f, "stress", "delta_f", where=where, low=0.0, high=2000.0, low_inclusive=True
    )
    adtt = internal(ADTT_SL, "dimensionless", "ADTT_SL", where=where, low=0.0, high=1e6)
    yrs = internal(age, "time", "age", where=where, low=0.0, high=500.0, low_inclusive=True)
    n_ = internal(n, "dimensionless", "n", where=where, low=0.0, high=20.0)
    Rs_ = internal(Rs, "dimensionless", "Rs", where=where, low=0.0, high=3.0)
    Rr_ = internal(Rr, "dimensionless", "Rr", where=where, low=0.0, high=5.0)
    eff = Rs_ * df
    dmax = MAX_TO_EFFECTIVE * eff
    mbe = AASHTO_MBE.ref
    vals = [
        CheckValue("Delta f", df, "stress", "stress range from the fatigue truck", ENGINEER),
        CheckValue(
            "Rs",
            Rs_,
            "dimensionless",
            "partial load factor on the stress range",
            mbe("Table 7.2.2.1-1"),
        ),
        CheckValue(
            "(Delta f)eff", eff, "stress", "effective stress range Rs Delta f", mbe("7.2.2")
        ),
        CheckValue("(Delta f)max", dmax, "stress", "2.0 (Delta f)eff", mbe("7.2.4")),
        CheckValue(
            "(Delta F)TH",
            category.threshold,
            "stress",
            f"threshold, Category {category.name}",
            category.source,
        ),
        CheckValue(
            "A",
            category.A,
            "dimensionless",
            f"detail constant, MPa³, Category {category.name}",
            category.source,
        ),
    ]
    notes = [f"Category {category.name} (riveted details, LRFD Table 6.6.1.2.3-1; from memory)"]
    if dmax <= category.threshold:
        notes.append("infinite life: (Delta f)max <= (Delta F)TH (MBE 7.2.4)")
        return _result(category, vals, notes, True, None, None)
    Y = Rr_ * category.A / (365.0 * n_ * adtt * eff**3)
    vals += [
        CheckValue(
            "n",
            n_,
            "dimensionless",
            "stress range cycles per truck",
            AASHTO_LRFD.ref("Table 6.6.1.2.5-2"),
        ),
        CheckValue(
            "(ADTT)SL",
            adtt,
            "dimensionless",
            "single-lane trucks a day, average over the life",
            ENGINEER,
        ),
        CheckValue(
            "Rr",
            Rr_,
            "dimensionless",
            "resistance factor for the life sought",
            mbe("Table 7.2.5.2-1"),
        ),
        CheckValue("Y", Y, "time", "total fatigue life", mbe("7.2.5.1-1")),
        CheckValue("age", yrs, "time", "years in service", ENGINEER),
        CheckValue("Y - age", Y - yrs, "time", "remaining fatigue life", mbe("7.2.5")),
    ]
    what = "minimum" if Rr_ == RR_MINIMUM else "engineer's"
    notes.append(f"finite life: (Delta f)max > (Delta F)TH; Rr = {Rr_:g} ({what} life)")
    if yrs >= Y:
        notes.append("the estimated fatigue life is spent: engineer to review")
    return _result(category, vals, notes, False, Y, Y - yrs)


def _result(category, vals, notes, infinite, total, rem) -> FatigueResult:
    clause = f"Section 7, 7.2.4 and 7.2.5.1, with LRFD 6.6.1.2.5, Category {category.name}"
    Rn = category.threshold / MAX_TO_EFFECTIVE
    return fatigue_result(AASHTO_MBE, clause, Rn, vals, notes, infinite, total, rem)
