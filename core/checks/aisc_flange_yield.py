"""Flexure in the AISC family: flange yielding of a built-up I-member and holes in the
tension flange. AISC 360-22, from memory:

- Web slenderness (Table B4.1b): hc/tw against lambda_r = 5.70 sqrt(E/Fy); for built-up
  riveted or bolted sections hc is twice the distance from the centroid to the nearest line
  of fasteners at the compression flange.
- F4 (webs not slender): compression flange yielding Mn = Rpc Myc (F4-1) and tension flange
  yielding Mn = Rpt Myt (F4-15); the plastification factors Rpc, Rpt >= 1 are taken as 1.0
  here (conservative, no credit for plastification).
- F5 (slender webs): compression flange yielding Mn = Rpg Fy Sxc (F5-1) with
  Rpg = 1 - aw / (1200 + 300 aw) (hc/tw - 5.70 sqrt(E/Fy)) <= 1.0 (F5-6), aw = hc tw /
  (bfc tfc) <= 10 (F4-12); tension flange yielding Mn = Fy Sxt (F5-10).
- Lateral-torsional buckling and compression flange local buckling (F4.2, F4.3, F5.2, F5.3)
  are part 2 of the family and not checked here: this is an upper bound.
- F13.1: with holes in the tension flange, where Fu Afn < Yt Fy Afg,
  Mn = Fu Afn / Afg Sxt (F13-1); Yt = 1.0 for Fy/Fu <= 0.8, else 1.1.
- phi_b = 0.90 (F1).
"""

from __future__ import annotations

import math

from core.checks._inputs import Number, internal, length, modulus, stress
from core.checks.flexure import net_area_ratio
from core.checks.results import ENGINEER, CapacityResult, CheckValue

STANDARD = "AISC 360-22 Specification for Structural Steel Buildings"
EDITION = "2022"


def _src(clause: str) -> str:
    return f"AISC 360-22 {clause} (from memory)"


def _sm(x: Number, name: str, where: str) -> float:
    return internal(x, "section_modulus", name, where=where, low=0.0, high=1e12)


def flange_yielding(
    *,
    Fy: Number,
    E: Number,
    S_xc: Number,
    S_xt: Number,
    hc: Number,
    tw: Number,
    Afc: Number,
    phi_b: float,
    where: str = "",
) -> CapacityResult:
    """Nominal flexural strength from compression and tension flange yielding (F4 / F5).

    Args:
        Fy: yield stress, MPa; E: modulus, MPa. S_xc, S_xt: elastic moduli to the
            compression and tension fibres, mm³. hc: twice the distance from the centroid to
            the compression flange's nearest fastener line, mm. tw: web thickness, mm.
        Afc: area of the compression flange (bfc tfc), mm². phi_b: resistance factor.

    Raises:
        InputError: a value out of range.
    """
    Fy = stress(Fy, "Fy", where=where)
    E = modulus(E, where=where)
    Sc, St = _sm(S_xc, "S_xc", where), _sm(S_xt, "S_xt", where)
    hc = internal(hc, "length", "hc", where=where, low=0.0, high=20_000.0, low_inclusive=True)
    tw = length(tw, "tw", where=where)
    Afc = internal(Afc, "area", "Afc", where=where, low=0.0, high=1e8)
    phi = internal(phi_b, "dimensionless", "phi_b", where=where, low=0.0, high=1.0)
    lam_r = 5.70 * math.sqrt(E / Fy)
    slender = hc / tw > lam_r
    vals = [
        CheckValue("Fy", Fy, "stress", "specified minimum yield stress", ENGINEER),
        CheckValue("hc/tw", hc / tw, "dimensionless", "web slenderness", _src("Table B4.1b")),
        CheckValue("lambda_r", lam_r, "dimensionless", "5.70 sqrt(E/Fy)", _src("Table B4.1b")),
        CheckValue("S_xc", Sc, "section_modulus", "elastic modulus, compression fibre", ENGINEER),
        CheckValue("S_xt", St, "section_modulus", "elastic modulus, tension fibre", ENGINEER),
    ]
    notes = []
    if slender:
        aw = min(hc * tw / Afc, 10.0)
        Rpg = min(1.0 - aw / (1200.0 + 300.0 * aw) * (hc / tw - lam_r), 1.0)
        Rpg = max(Rpg, 0.0)
        Mc, Mt = Rpg * Fy * Sc, Fy * St
        vals += [
            CheckValue("aw", aw, "dimensionless", "hc tw / (bfc tfc) <= 10", _src("F4-12")),
            CheckValue("Rpg", Rpg, "dimensionless", "bending strength reduction", _src("F5-6")),
            CheckValue("Mn,c", Mc, "moment", "Rpg Fy Sxc", _src("F5-1")),
            CheckValue("Mn,t", Mt, "moment", "Fy Sxt", _src("F5-10")),
        ]
        clause = "F5.1 and F5.4, Eq. F5-1 and F5-10, flange yielding"
    else:
        Mc, Mt = Fy * Sc, Fy * St
        vals += [
            CheckValue("Mn,c", Mc, "moment", "Rpc Myc with Rpc = 1.0", _src("F4-1")),
            CheckValue("Mn,t", Mt, "moment", "Rpt Myt with Rpt = 1.0", _src("F4-15")),
        ]
        clause = "F4.1 and F4.4, Eq. F4-1 and F4-15 with Rpc = Rpt = 1.0, flange yielding"
        notes.append("plastification factors Rpc, Rpt >= 1 taken as 1.0 (conservative)")
    vals.append(CheckValue("phi_b", phi, "dimensionless", "resistance factor", _src("F1")))
    notes.append(
        "lateral-torsional and compression flange local buckling not checked here: an upper bound"
    )
    return CapacityResult(
        limit_state="flexure, flange yielding",
        standard=STANDARD,
        edition=EDITION,
        clause=clause + " (from memory)",
        Rn=min(Mc, Mt),
        phi=phi,
        kind="moment",
        values=tuple(vals),
        notes=tuple(notes),
    )


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
