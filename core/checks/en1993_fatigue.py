"""Fatigue of riveted details: EN 1993-1-9:2005 with EN 1993-2:2006 Section 9.

As recalled (from memory; the engineer confirms every default):

- Riveted details are not among the detail categories of EN 1993-1-9 Tables 8.1 to 8.10.
  For riveted members and shear splices of existing bridges, detail category 71 is used
  (the value recommended for the assessment of existing riveted bridges; **from memory**,
  not a value printed in EN 1993-1-9): Delta sigma_C = 71 MPa at 2 x 10^6 cycles.
- 7.1, Figure 7.1 (Eq. 7.1, 7.2): N_R = 2 x 10^6 (Delta sigma_C / Delta sigma)³ down to the
  constant amplitude fatigue limit Delta sigma_D = (2/5)^(1/3) Delta sigma_C at 5 x 10^6;
  N_R = 5 x 10^6 (Delta sigma_D / Delta sigma)^5 down to the cut-off
  Delta sigma_L = (5/100)^(1/5) Delta sigma_D at 10^8; below it no damage.
- Table 3.1: gamma_Mf = 1.00 / 1.15 (damage tolerant, low / high consequence) and
  1.15 / 1.35 (safe life); default 1.35 (safe life, high consequence: the conservative one).
  gamma_Ff = 1.0 (EN 1993-2 9.3(1)).
- 8(2), Eq. 8.2, with EN 1993-2 9.5.1: gamma_Ff Delta sigma_E,2 <= Delta sigma_C / gamma_Mf,
  Delta sigma_E,2 the damage equivalent stress range at 2 x 10^6 cycles from the fatigue load
  model (EN 1993-2 9.5.2 roads, 9.5.3 railways: lambda factors and Phi2; the load model's job).
- Annex A: Palmgren-Miner damage D = sum n_i / N_Ri of a stress range spectrum.

Infinite life: no stress range above the constant amplitude fatigue limit,
gamma_Ff Delta sigma_max <= Delta sigma_D / gamma_Mf (a range below it propagates no crack;
with any range above it, every range above the cut-off counts, as Figure 7.1 has it).
Remaining life: the yearly spectrum repeated, 1/D_year - age.
"""

from __future__ import annotations

import math
from collections.abc import Sequence

from core.checks._inputs import Number, internal
from core.checks.fatigue import FatigueResult, fatigue_result
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.checks.sources import EN_1993_1_9, EN_1993_2, factor
from core.errors import InputError

#: detail category of riveted details in existing bridges, MPa (from memory: not in EN 1993-1-9)
DELTA_SIGMA_C_RIVETED = 71.0
#: partial factor for fatigue strength, safe life, high consequence, Table 3.1 (from memory)
GAMMA_MF = 1.35
#: partial factor for fatigue loads, EN 1993-2 9.3(1) (from memory)
GAMMA_FF = 1.0
N_C, N_D, N_L = 2.0e6, 5.0e6, 1.0e8

CATEGORY_SOURCE = (
    "detail category 71 for riveted details (from memory; not in EN 1993-1-9 Tables 8.1-8.10)"
)


def limits(delta_sigma_c: float) -> tuple[float, float]:
    """``(Delta sigma_D, Delta sigma_L)`` of Figure 7.1, MPa."""
    d = (N_C / N_D) ** (1.0 / 3.0) * delta_sigma_c
    return d, (N_D / N_L) ** (1.0 / 5.0) * d


def endurance(delta_sigma: float, delta_sigma_c: float) -> float:
    """Cycles to failure N_R at a (design) stress range, ``math.inf`` below the cut-off."""
    d, cut = limits(delta_sigma_c)
    if delta_sigma >= d:
        return N_C * (delta_sigma_c / delta_sigma) ** 3
    if delta_sigma >= cut:
        return N_D * (d / delta_sigma) ** 5
    return math.inf


def _factors(gamma_Mf, gamma_Ff, delta_sigma_c, where):
    gMf = factor(gamma_Mf, "gamma_Mf", low=0.5, where=where)
    gFf = factor(gamma_Ff, "gamma_Ff", low=0.5, where=where)
    dsc = internal(delta_sigma_c, "stress", "Delta sigma_C", where=where, low=0.0, high=300.0)
    src_c = CATEGORY_SOURCE if dsc == DELTA_SIGMA_C_RIVETED else ENGINEER
    vals = [
        CheckValue("Delta sigma_C", dsc, "stress", "detail category (at 2 x 10^6 cycles)", src_c),
        CheckValue(
            "gamma_Mf",
            gMf,
            "dimensionless",
            "partial factor, fatigue strength",
            EN_1993_1_9.ref("Table 3.1") if gMf == GAMMA_MF else ENGINEER,
        ),
        CheckValue(
            "gamma_Ff",
            gFf,
            "dimensionless",
            "partial factor, fatigue loads",
            EN_1993_2.ref("9.3(1)") if gFf == GAMMA_FF else ENGINEER,
        ),
    ]
    return gMf, gFf, dsc, vals


def damage_equivalent_check(
    *,
    delta_sigma_E2: Number,
    delta_sigma_c: float = DELTA_SIGMA_C_RIVETED,
    gamma_Mf: float = GAMMA_MF,
    gamma_Ff: float = GAMMA_FF,
    where: str = "",
) -> CapacityResult:
    """gamma_Ff Delta sigma_E,2 <= Delta sigma_C / gamma_Mf (EN 1993-1-9 8(2), Eq. 8.2;
    EN 1993-2 9.5.1): ``Rn`` = Delta sigma_C, ``phi`` = 1/gamma_Mf; the demand
    gamma_Ff Delta sigma_E,2 is among the values.

    Raises:
        InputError: values out of range.
    """
    gMf, gFf, dsc, vals = _factors(gamma_Mf, gamma_Ff, delta_sigma_c, where)
    dse = internal(
        delta_sigma_E2,
        "stress",
        "Delta sigma_E,2",
        where=where,
        low=0.0,
        high=2000.0,
        low_inclusive=True,
    )
    vals += [
        CheckValue(
            "Delta sigma_E,2", dse, "stress", "damage equivalent stress range at 2 x 10^6", ENGINEER
        ),
        CheckValue(
            "gamma_Ff Delta sigma_E,2",
            gFf * dse,
            "stress",
            "design stress range",
            EN_1993_1_9.ref("8(2), Eq. 8.2"),
        ),
        CheckValue(
            "utilisation",
            gFf * dse * gMf / dsc,
            "dimensionless",
            "gamma_Ff Delta sigma_E,2 gamma_Mf / Delta sigma_C",
            EN_1993_1_9.ref("8(2)"),
        ),
    ]
    return EN_1993_1_9.result(
        "fatigue (riveted detail)",
        "8(2), Eq. 8.2, with EN 1993-2 9.5.1",
        dsc,
        1.0 / gMf,
        "stress",
        vals,
        [CATEGORY_SOURCE],
    )


def remaining_life(
    *,
    spectrum: Sequence[tuple[float, float]],
    age: Number,
    delta_sigma_c: float = DELTA_SIGMA_C_RIVETED,
    gamma_Mf: float = GAMMA_MF,
    gamma_Ff: float = GAMMA_FF,
    where: str = "",
) -> FatigueResult:
    """Infinite-life check and Miner's remaining life of a riveted detail (EN 1993-1-9).

    Args:
        spectrum: ``(stress range, MPa; cycles a year)`` at the detail.
        age: years in service so far. delta_sigma_c: detail category, MPa (default 71).
        gamma_Mf, gamma_Ff: partial factors (defaults 1.35 and 1.0). where: place.

    Raises:
        InputError: an empty spectrum or values out of range.
    """
    gMf, gFf, dsc, vals = _factors(gamma_Mf, gamma_Ff, delta_sigma_c, where)
    yrs = internal(age, "time", "age", where=where, low=0.0, high=500.0, low_inclusive=True)
    if not spectrum:
        raise InputError("the stress range spectrum is empty", where=where)
    if len(spectrum) > 10_000:
        raise InputError(f"{len(spectrum)} spectrum rows: at most 10000", where=where)
    rows = []
    for i, row in enumerate(spectrum):
        try:
            ds, n = row
        except (TypeError, ValueError):
            raise InputError(
                f"spectrum row {i}: {row!r} is not a (range, cycles) pair", where=where
            ) from None
        ds = internal(
            ds,
            "stress",
            f"spectrum row {i} range",
            where=where,
            low=0.0,
            high=2000.0,
            low_inclusive=True,
        )
        n = internal(
            n,
            "dimensionless",
            f"spectrum row {i} cycles a year",
            where=where,
            low=0.0,
            high=1e12,
            low_inclusive=True,
        )
        rows.append((ds, n))
    d, cut = limits(dsc)
    ds_max = max(ds for ds, _ in rows)
    design_max = gFf * gMf * ds_max
    vals += [
        CheckValue(
            "Delta sigma_D",
            d,
            "stress",
            "constant amplitude fatigue limit at 5 x 10^6",
            EN_1993_1_9.ref("7.1, Figure 7.1"),
        ),
        CheckValue(
            "Delta sigma_L",
            cut,
            "stress",
            "cut-off limit at 10^8",
            EN_1993_1_9.ref("7.1, Figure 7.1"),
        ),
        CheckValue(
            "Delta sigma_max", ds_max, "stress", "largest stress range of the spectrum", ENGINEER
        ),
        CheckValue(
            "gamma_Ff gamma_Mf Delta sigma_max",
            design_max,
            "stress",
            "design value of the largest range",
            EN_1993_1_9.ref("8"),
        ),
    ]
    notes = [CATEGORY_SOURCE]
    if design_max <= d:
        notes.append("infinite life: no stress range above Delta sigma_D / gamma_Mf")
        return _result(dsc, gMf, vals, notes, True, None, None)
    D_year = sum(n / endurance(gFf * gMf * ds, dsc) for ds, n in rows)
    total = 1.0 / D_year
    vals += [
        CheckValue(
            "D per year",
            D_year,
            "dimensionless",
            "Miner damage sum of one year's spectrum",
            EN_1993_1_9.ref("Annex A"),
        ),
        CheckValue("life", total, "time", "total fatigue life 1/D", EN_1993_1_9.ref("Annex A")),
        CheckValue("age", yrs, "time", "years in service", ENGINEER),
        CheckValue(
            "life - age", total - yrs, "time", "remaining fatigue life", EN_1993_1_9.ref("Annex A")
        ),
    ]
    notes.append("finite life: Palmgren-Miner over the curve of Figure 7.1")
    if total <= yrs:
        notes.append("the estimated fatigue life is spent: engineer to review")
    return _result(dsc, gMf, vals, notes, False, total, total - yrs)


def _result(dsc, gMf, vals, notes, infinite, total, rem) -> FatigueResult:
    clause = f"7.1 and Annex A, detail category {dsc:g}"
    Rn = limits(dsc)[0] / gMf
    return fatigue_result(EN_1993_1_9, clause, Rn, vals, notes, infinite, total, rem)
