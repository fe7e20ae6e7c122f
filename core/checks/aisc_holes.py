"""Holes in the tension flange in the AISC family (AISC 360-22 F13.1, from memory); flange
yielding, lateral-torsional and flange local buckling are in :mod:`core.checks.aisc_flexure`.

- F13.1: with holes in the tension flange, where Fu Afn < Yt Fy Afg,
  Mn = Fu Afn / Afg Sxt (F13-1); Yt = 1.0 for Fy/Fu <= 0.8, else 1.1.
- phi_b = 0.90 (F1).
"""

from __future__ import annotations

from core.checks._inputs import Number, internal, stress
from core.checks.flexure import net_area_ratio
from core.checks.results import ENGINEER, CapacityResult, CheckValue

STANDARD = "AISC 360-22 Specification for Structural Steel Buildings"
EDITION = "2022"


def _src(clause: str) -> str:
    return f"AISC 360-22 {clause} (from memory)"


def _sm(x: Number, name: str, where: str) -> float:
    return internal(x, "section_modulus", name, where=where, low=0.0, high=1e12)


def tension_flange_holes(
    *,
    Afn: Number,
    Afg: Number,
    Fy: Number,
    Fu: Number,
    S_xt: Number,
    phi_b: float,
    where: str = "",
) -> CapacityResult:
    """Flexural strength limited by holes in the tension flange (F13.1), as a moment.

    Returns:
        Rn = Fu Afn / Afg S_xt where Fu Afn < Yt Fy Afg, else Fy S_xt (holes do not govern).

    Raises:
        InputError: values out of range or Afn > Afg.
    """
    ratio = net_area_ratio(Afn, Afg, where=where)
    Fy = stress(Fy, "Fy", where=where)
    Fu = stress(Fu, "Fu", where=where)
    St = _sm(S_xt, "S_xt", where)
    phi = internal(phi_b, "dimensionless", "phi_b", where=where, low=0.0, high=1.0)
    Yt = 1.0 if Fy / Fu <= 0.8 else 1.1
    governs = Fu * ratio < Yt * Fy
    Rn = Fu * ratio * St if governs else Fy * St
    src = _src("F13.1")
    vals = (
        CheckValue("Afn/Afg", ratio, "dimensionless", "net to gross tension flange area", src),
        CheckValue("Fu", Fu, "stress", "specified minimum tensile strength", ENGINEER),
        CheckValue("Yt", Yt, "dimensionless", "1.0 for Fy/Fu <= 0.8, else 1.1", src),
        CheckValue("S_xt", St, "section_modulus", "elastic modulus, tension fibre", ENGINEER),
        CheckValue("phi_b", phi, "dimensionless", "resistance factor", _src("F1")),
    )
    return CapacityResult(
        limit_state="tension flange at holes",
        standard=STANDARD,
        edition=EDITION,
        clause="F13.1, Eq. F13-1 (from memory)",
        Rn=Rn,
        phi=phi,
        kind="moment",
        values=vals,
        notes=(
            "tensile rupture at the holes governs (F13-1)"
            if governs
            else "Fu Afn >= Yt Fy Afg: the holes do not limit the strength",
        ),
    )
