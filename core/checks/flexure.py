"""Flexure: yield moment from the elastic section moduli, and net section of a tension flange.

- My = Fy S at the top and at the bottom fibre; the smaller governs (first yield, elastic
  beam theory). As-built and as-found are two calls with the two sets of moduli.
- Tension flange at holes, AASHTO LRFD 6.10.1.8 (net section fracture, from memory):
  ft <= 0.84 (An/Ag) Fu <= Fyt, with ft the stress on the gross area of the tension flange
  from factored loads. Fracture does not govern once An/Ag >= Fyt / (0.84 Fu).
- phi_f = 1.00 (AASHTO LRFD 6.5.4.2, from memory).
"""

from __future__ import annotations

from core.checks._inputs import Number, internal, stress
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.errors import InputError

AASHTO = "AASHTO LRFD Bridge Design Specifications"
AASHTO_EDITION = "9th edition (2020)"
PHI_F = 1.00


def _modulus(x: Number, name: str, where: str) -> float:
    return internal(x, "section_modulus", name, where=where, low=0.0, high=1e12)


def yield_moment(*, Fy: Number, S_top: Number, S_bottom: Number, where: str = "") -> CapacityResult:
    """Yield moment My = Fy min(S_top, S_bottom).

    Args:
        Fy: yield strength, MPa (for a hybrid section give the flange that yields first).
        S_top, S_bottom: elastic section moduli to the top and bottom fibres, mm³.
        where: location for error messages.

    Returns:
        A result of kind ``"moment"`` (N·mm) with My,top, My,bottom and the governing fibre.

    Raises:
        InputError: a value not positive or out of range.
    """
    Fy = stress(Fy, "Fy", where=where)
    St = _modulus(S_top, "S_top", where)
    Sb = _modulus(S_bottom, "S_bottom", where)
    Mt, Mb = Fy * St, Fy * Sb
    fibre = "top" if Mt <= Mb else "bottom"
    mech = "elastic beam theory, first yield (common practice)"
    vals = (
        CheckValue("Fy", Fy, "stress", "yield strength", ENGINEER),
        CheckValue("S_top", St, "section_modulus", "elastic section modulus, top fibre", mech),
        CheckValue("S_bottom", Sb, "section_modulus", "elastic section modulus, bottom", mech),
        CheckValue("My,top", Mt, "moment", "yield moment, top fibre Fy S_top", mech),
        CheckValue("My,bottom", Mb, "moment", "yield moment, bottom fibre Fy S_bottom", mech),
    )
    return CapacityResult(
        limit_state="yield moment",
        standard=AASHTO,
        edition=AASHTO_EDITION,
        clause="My = Fy S (first yield); phi_f per 6.5.4.2 (from memory)",
        Rn=min(Mt, Mb),
        phi=PHI_F,
        kind="moment",
        values=vals,
        notes=(f"the {fibre} fibre yields first",),
    )


def net_area_ratio(An: Number, Ag: Number, *, where: str = "") -> float:
    """An/Ag of a flange at a line of holes, in (0, 1].

    Raises:
        InputError: An or Ag not positive, or An > Ag.
    """
    an = internal(An, "area", "An", where=where, low=0.0, high=1e9)
    ag = internal(Ag, "area", "Ag", where=where, low=0.0, high=1e9)
    if an > ag * (1.0 + 1e-12):
        raise InputError(
            f"net area An = {an:g} mm² exceeds gross area Ag = {ag:g} mm²", where=where
        )
    return min(an / ag, 1.0)


def tension_flange_net_section(
    *,
    An: Number,
    Ag: Number,
    Fu: Number,
    Fyt: Number,
    ft: Number | None = None,
    where: str = "",
) -> CapacityResult:
    """Limit on the gross-area stress of a tension flange at holes, AASHTO LRFD 6.10.1.8.

    Args:
        An: net area of the tension flange at the holes, mm². Ag: gross area, mm².
        Fu: tensile strength, MPa. Fyt: yield strength of the tension flange, MPa.
        ft: stress on the gross area from factored loads, MPa (optional; reported with its
            ratio to the limit).
        where: location for error messages.

    Returns:
        A result of kind ``"stress"`` whose ``Rn`` is min(0.84 (An/Ag) Fu, Fyt).

    Raises:
        InputError: values out of range, An > Ag, or Fu < Fyt.
    """
    ratio = net_area_ratio(An, Ag, where=where)
    Fu = stress(Fu, "Fu", where=where)
    Fyt = stress(Fyt, "Fyt", where=where)
    if Fu < Fyt:
        raise InputError(f"Fu = {Fu:g} MPa is below Fyt = {Fyt:g} MPa", where=where)
    src = "AASHTO LRFD 6.10.1.8-1 (from memory)"
    frac = 0.84 * ratio * Fu
    vals = [
        CheckValue("An/Ag", ratio, "dimensionless", "net to gross area of the tension flange", src),
        CheckValue("Fu", Fu, "stress", "tensile strength", ENGINEER),
        CheckValue("Fyt", Fyt, "stress", "yield strength of the tension flange", ENGINEER),
        CheckValue("0.84 (An/Ag) Fu", frac, "stress", "net section fracture limit", src),
        CheckValue(
            "Fyt/(0.84 Fu)",
            Fyt / (0.84 * Fu),
            "dimensionless",
            "An/Ag above which fracture does not govern",
            src,
        ),
    ]
    limit = min(frac, Fyt)
    notes = ["net section fracture governs" if frac < Fyt else "yield governs (Fyt)"]
    if ft is not None:
        f = internal(ft, "stress", "ft", where=where, low=0.0, high=2000.0, low_inclusive=True)
        vals.append(CheckValue("ft", f, "stress", "gross-area stress, factored loads", ENGINEER))
        vals.append(CheckValue("ft/limit", f / limit, "dimensionless", "demand / limit", src))
    return CapacityResult(
        limit_state="tension flange at holes",
        standard=AASHTO,
        edition=AASHTO_EDITION,
        clause="6.10.1.8, Eq. 6.10.1.8-1 (from memory)",
        Rn=limit,
        phi=1.0,
        kind="stress",
        values=tuple(vals),
        notes=tuple(notes),
    )
