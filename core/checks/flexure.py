"""Flexure in the AASHTO family: flange yield and the tension flange at its holes.

AASHTO LRFD Bridge Design Specifications, 9th edition (2020), from memory:

- 6.10.8.1.1 / 6.10.8.3: the flange stress limit of a noncomposite I-section is
  Fn = Rb Rh Fyf for the compression flange (its yield plateau; local and lateral-torsional
  buckling, 6.10.8.2.2 and 6.10.8.2.3, are :mod:`core.checks.aashto_flange` and
  :mod:`core.checks.aashto_ltb`, and the family takes the least), and Fn = Rh Fyt for the
  tension flange. As moments: Mn = Fn S of each flange's fibre, on the gross section (first
  yield).
- Rh = 1.0 for a homogeneous section (6.10.1.10.1); Rb, the web load-shedding factor
  (6.10.1.10.2), from :func:`core.checks.aashto_flange.web_load_shedding`.
- 6.10.1.8 (net section fracture of a tension flange at holes): ft <= 0.84 (An/Ag) Fu <= Fyt,
  ft the stress on the gross area of the tension flange; it does not govern once
  An/Ag >= Fyt / (0.84 Fu).
- phi_f = 1.00 (6.5.4.2).
"""

from __future__ import annotations

from core.checks._inputs import Number, internal, stress
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.errors import InputError

AASHTO = "AASHTO LRFD Bridge Design Specifications"
AASHTO_EDITION = "9th edition (2020)"
MEMORY = " (from memory)"


def _src(clause: str) -> str:
    return f"AASHTO LRFD {AASHTO_EDITION}, {clause}{MEMORY}"


def _modulus(x: Number, name: str, where: str) -> float:
    return internal(x, "section_modulus", name, where=where, low=0.0, high=1e12)


def flange_yield(
    *,
    Fyc: Number,
    Fyt: Number,
    S_c: Number,
    S_t: Number,
    Rb: float = 1.0,
    Rh: float = 1.0,
    phi_f: float,
    extra: tuple[CheckValue, ...] = (),
    where: str = "",
) -> CapacityResult:
    """Nominal flexural resistance from the flange stress limits Fnc = Rb Rh Fyc and
    Fnt = Rh Fyt (6.10.8.1.1 / 6.10.8.3), as moments Fn S on the gross section.

    Args:
        Fyc, Fyt: yield strengths of the compression and tension flanges, MPa.
        S_c, S_t: elastic section moduli to the compression and tension fibres, mm³.
        Rb, Rh: factors of 6.10.1.10 (Rb: :func:`core.checks.aashto_flange.web_load_shedding`).
        phi_f: resistance factor for flexure (the family's, 1.00).
        extra: values of the working computed elsewhere (Rb's), listed first.

    Raises:
        InputError: a value not positive or out of range.
    """
    Fyc = stress(Fyc, "Fyc", where=where)
    Fyt = stress(Fyt, "Fyt", where=where)
    Sc, St = _modulus(S_c, "S_c", where), _modulus(S_t, "S_t", where)
    Rb = internal(Rb, "dimensionless", "Rb", where=where, low=0.0, high=1.0, low_inclusive=True)
    Rh = internal(Rh, "dimensionless", "Rh", where=where, low=0.0, high=1.0)
    phi = internal(phi_f, "dimensionless", "phi_f", where=where, low=0.0, high=1.0)
    Mc, Mt = Rb * Rh * Fyc * Sc, Rh * Fyt * St
    vals = (
        *extra,
        CheckValue("Fyc", Fyc, "stress", "yield strength, compression flange", ENGINEER),
        CheckValue("Fyt", Fyt, "stress", "yield strength, tension flange", ENGINEER),
        CheckValue("Rh", Rh, "dimensionless", "hybrid factor (homogeneous)", _src("6.10.1.10.1")),
        CheckValue("S_c", Sc, "section_modulus", "elastic modulus, compression fibre", ENGINEER),
        CheckValue("S_t", St, "section_modulus", "elastic modulus, tension fibre", ENGINEER),
        CheckValue("Mn,c", Mc, "moment", "Rb Rh Fyc S_c", _src("6.10.8.1.1")),
        CheckValue("Mn,t", Mt, "moment", "Rh Fyt S_t", _src("6.10.8.3")),
        CheckValue("phi_f", phi, "dimensionless", "resistance factor, flexure", _src("6.5.4.2")),
    )
    which = "compression" if Mc <= Mt else "tension"
    return CapacityResult(
        limit_state="flexure, flange yield",
        standard=AASHTO,
        edition=AASHTO_EDITION,
        clause="6.10.8.1.1 and 6.10.8.3, Fn = Rb Rh Fyf, on the gross section" + MEMORY,
        Rn=min(Mc, Mt),
        phi=phi,
        kind="moment",
        values=vals,
        notes=(f"the {which} flange governs",),
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
    src = _src("6.10.1.8-1")
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
        clause="6.10.1.8, Eq. 6.10.1.8-1" + MEMORY,
        Rn=limit,
        phi=1.0,
        kind="stress",
        values=tuple(vals),
        notes=tuple(notes),
    )
