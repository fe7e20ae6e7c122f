"""Bending resistance in the EN 1993 family: Mc,Rd for the cross-section class, and the
tension flange at its holes.

The class (EN 1993-1-1 Table 5.2) and the effective widths of a class 4 section
(EN 1993-1-5 4.4) are in :mod:`core.checks.en1993_class`. From memory of EN 1993-1-1:2005:

- 6.2.5: Mc,Rd = Wpl fy / gamma_M0 (class 1, 2), Wel,min fy / gamma_M0 (class 3),
  Weff,min fy / gamma_M0 (class 4).
- 6.2.5(4): holes in the tension flange may be ignored where
  Af,net 0.9 fu / gamma_M2 >= Af fy / gamma_M0 (6.16); otherwise a reduced flange is used:
  here the gross-area stress of the tension flange is limited to 0.9 (Af,net / Af) fu / gamma_M2.
"""

from __future__ import annotations

from core.checks._inputs import Number, internal, stress
from core.checks.flexure import net_area_ratio
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.errors import InputError

STANDARD = "EN 1993-1-1 / EN 1993-1-5 Design of steel structures"
EDITION = "2005 / 2006"


def _src(clause: str) -> str:
    return f"{clause} (from memory)"


def bending_resistance(
    *,
    section_class: int,
    W_pl: float,
    W_el_min: float,
    W_eff_min: float | None,
    fy: Number,
    gamma_M0: float,
    working: tuple[CheckValue, ...] = (),
    notes: tuple[str, ...] = (),
    where: str = "",
) -> CapacityResult:
    """Mc,Rd of EN 1993-1-1 6.2.5 for the section class (1 to 4), as a CapacityResult with
    phi = 1 / gamma_M0.

    Raises:
        InputError: an unknown class, a class 4 section without W_eff_min, a value out of range.
    """
    fy = stress(fy, "fy", where=where)
    gM0 = internal(gamma_M0, "dimensionless", "gamma_M0", where=where, low=0.5, high=2.0)
    if section_class not in (1, 2, 3, 4):
        raise InputError(f"section class {section_class!r} is not 1 to 4", where=where)
    if section_class <= 2:
        W, name, what = W_pl, "Wpl", "plastic section modulus (class 1 or 2)"
    elif section_class == 3:
        W, name, what = W_el_min, "Wel,min", "least elastic section modulus (class 3)"
    else:
        if W_eff_min is None:
            raise InputError("a class 4 section needs its effective modulus Weff,min", where=where)
        W, name, what = W_eff_min, "Weff,min", "least effective section modulus (class 4)"
    src = _src("EN 1993-1-1 6.2.5")
    vals = (
        *working,
        CheckValue("fy", fy, "stress", "yield strength", ENGINEER),
        CheckValue(
            "class",
            section_class,
            "dimensionless",
            "cross-section class",
            _src("EN 1993-1-1 5.5, Table 5.2"),
        ),
        CheckValue(name, W, "section_modulus", what, src),
        CheckValue("gamma_M0", gM0, "dimensionless", "partial factor", "EN 1993-2 Table 6.1"),
    )
    return CapacityResult(
        limit_state="bending",
        standard=STANDARD,
        edition=EDITION,
        clause=f"EN 1993-1-1 6.2.5, Eq. 6.13-6.15, class {section_class}"
        + (" with EN 1993-1-5 4.4 effective widths" if section_class == 4 else "")
        + " (from memory)",
        Rn=W * fy,
        phi=1.0 / gM0,
        kind="moment",
        values=vals,
        notes=notes,
    )


def tension_flange_holes(
    *,
    Af_net: Number,
    Af: Number,
    fy: Number,
    fu: Number,
    W_t: Number,
    gamma_M0: float,
    gamma_M2: float,
    where: str = "",
) -> CapacityResult:
    """Bending resistance limited by the holes of the tension flange (6.2.5(4), Eq. 6.16)
    as a moment of the tension fibre: W_t min(fy / gamma_M0, 0.9 (Af,net / Af) fu / gamma_M2).
    The returned phi is 1 (the partial factors are inside Rn).

    Raises:
        InputError: values out of range or Af,net > Af.
    """
    ratio = net_area_ratio(Af_net, Af, where=where)
    fy = stress(fy, "fy", where=where)
    fu = stress(fu, "fu", where=where)
    Wt = internal(W_t, "section_modulus", "W_t", where=where, low=0.0, high=1e12)
    gM0 = internal(gamma_M0, "dimensionless", "gamma_M0", where=where, low=0.5, high=2.0)
    gM2 = internal(gamma_M2, "dimensionless", "gamma_M2", where=where, low=0.5, high=2.0)
    net = 0.9 * ratio * fu / gM2
    ok = net >= fy / gM0
    src = _src("EN 1993-1-1 6.2.5(4), Eq. 6.16")
    vals = (
        CheckValue("Af,net/Af", ratio, "dimensionless", "net to gross tension flange area", src),
        CheckValue("0.9 (Af,net/Af) fu/gamma_M2", net, "stress", "net section limit", src),
        CheckValue("fy/gamma_M0", fy / gM0, "stress", "yield limit", src),
        CheckValue("W_t", Wt, "section_modulus", "elastic modulus, tension fibre", ENGINEER),
        CheckValue("gamma_M2", gM2, "dimensionless", "partial factor", "EN 1993-2 Table 6.1"),
    )
    return CapacityResult(
        limit_state="tension flange at holes",
        standard=STANDARD,
        edition=EDITION,
        clause="EN 1993-1-1 6.2.5(4), Eq. 6.16 (from memory)",
        Rn=Wt * min(net, fy / gM0),
        phi=1.0,
        kind="moment",
        values=vals,
        notes=(
            "Eq. 6.16 met: the holes may be ignored"
            if ok
            else "Eq. 6.16 not met: the gross-area stress of the tension flange is limited to "
            "0.9 (Af,net/Af) fu / gamma_M2 (asfound's reading of the reduced flange area)",
        ),
    )
