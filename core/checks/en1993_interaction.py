"""EN 1993-1-5:2006 5.4 (flange contribution to shear) and 7.1 (bending and shear), from
memory.

- 5.4(1): Vbf,Rd = bf tf² fyf / (c gamma_M1) (1 - (M_Ed / Mf,Rd)²)  (5.8), with
  c = a (0.25 + 1.6 bf tf² fyf / (t hw² fyw)), bf and tf of the flange with the least axial
  resistance, bf not more than 15 eps tf on each side of the web; Mf,Rd = Mf,k / gamma_M0 the
  design plastic moment of the flanges alone. Nothing is counted where M_Ed >= Mf,Rd.
- 7.1(1): for eta3 = V_Ed / Vbw,Rd > 0.5,
  eta1 + (1 - Mf,Rd / Mpl,Rd) (2 eta3 - 1)² <= 1.0 with eta1 = M_Ed / Mpl,Rd, applicable for
  eta1 >= Mf,Rd / Mpl,Rd (below it the flanges alone carry the moment).
  As a moment resistance for a given shear: M_Rd(V) = max(Mf,Rd, Mpl,Rd - (Mpl,Rd - Mf,Rd)
  (2 eta3 - 1)²) for 0.5 < eta3 <= 1, Mpl,Rd for eta3 <= 0.5, Mf,Rd for eta3 > 1 (the shear
  check fails there on its own).
"""

from __future__ import annotations

from dataclasses import dataclass

from core.checks._inputs import internal, length, stress
from core.checks.results import CheckValue
from core.errors import InputError

SRC_54 = "EN 1993-1-5:2006 5.4, Eq. 5.8 (from memory)"
SRC_71 = "EN 1993-1-5:2006 7.1, Eq. 7.1 (from memory)"


@dataclass(frozen=True)
class FlangeContribution:
    """Vbf,Rd (N) with its working."""

    Vbf_Rd: float
    values: tuple[CheckValue, ...]
    note: str


def flange_contribution(
    *,
    bf: float,
    tf: float,
    fyf: float,
    t: float,
    hw: float,
    fyw: float,
    a: float,
    eps: float,
    M_Ed: float,
    Mf_Rd: float,
    gamma_M1: float,
    where: str = "",
) -> FlangeContribution:
    """Flange contribution to the shear resistance (5.4).

    Args:
        bf, tf: width and thickness of the flange with the least axial resistance, mm.
        fyf, fyw: flange and web yield strengths, MPa. t, hw: web thickness and depth, mm.
        a: distance between transverse stiffeners, mm. eps: sqrt(235/fy).
        M_Ed: design bending moment, N*mm (>= 0). Mf_Rd: design plastic moment of the
            flanges alone, N*mm. gamma_M1: partial factor.

    Raises:
        InputError: a value out of range.
    """
    bf, tf, t, hw, a = (
        length(v, n, where=where)
        for v, n in ((bf, "bf"), (tf, "tf"), (t, "t"), (hw, "hw"), (a, "a"))
    )
    fyf, fyw = stress(fyf, "fyf", where=where), stress(fyw, "fyw", where=where)
    gM1 = internal(gamma_M1, "dimensionless", "gamma_M1", where=where, low=0.5, high=2.0)
    if not M_Ed >= 0.0 or not Mf_Rd > 0.0:
        raise InputError(f"M_Ed = {M_Ed:g} must be >= 0 and Mf,Rd = {Mf_Rd:g} > 0", where=where)
    b = min(bf, t + 2.0 * 15.0 * eps * tf)
    c = a * (0.25 + 1.6 * b * tf**2 * fyf / (t * hw**2 * fyw))
    ratio = M_Ed / Mf_Rd
    V = 0.0 if ratio >= 1.0 else b * tf**2 * fyf / (c * gM1) * (1.0 - ratio**2)
    vals = (
        CheckValue("bf", b, "length", "flange width, at most t + 30 eps tf", SRC_54),
        CheckValue("tf", tf, "length", "flange thickness", SRC_54),
        CheckValue("c", c, "length", "a (0.25 + 1.6 bf tf² fyf / (t hw² fyw))", SRC_54),
        CheckValue("M_Ed/Mf,Rd", ratio, "dimensionless", "design moment / flanges' moment", SRC_54),
    )
    note = (
        "M_Ed >= Mf,Rd: no flange contribution"
        if ratio >= 1.0
        else f"flange contribution Vbf,Rd = {V / 1e3:.4g} kN counted"
    )
    return FlangeContribution(V, vals, note)


@dataclass(frozen=True)
class Interaction:
    """M_Rd for the design shear (N*mm), eta3 and the branch taken."""

    M_Rd: float
    eta3: float
    branch: str
    values: tuple[CheckValue, ...]


def bending_shear(*, V_Ed: float, Vbw_Rd: float, Mpl_Rd: float, Mf_Rd: float) -> Interaction:
    """Moment resistance allowed by 7.1 for the design shear V_Ed (N).

    Raises:
        InputError: a resistance not positive, Mf,Rd > Mpl,Rd, or V_Ed negative.
    """
    if not (Vbw_Rd > 0.0 and Mpl_Rd > 0.0 and 0.0 < Mf_Rd <= Mpl_Rd * (1 + 1e-12)):
        raise InputError(
            f"resistances Vbw,Rd = {Vbw_Rd:g} N, Mpl,Rd = {Mpl_Rd:g}, Mf,Rd = {Mf_Rd:g} N*mm "
            "must be positive with Mf,Rd <= Mpl,Rd"
        )
    if V_Ed < 0.0:
        raise InputError(f"V_Ed = {V_Ed:g} N must be a magnitude (>= 0)")
    eta3 = V_Ed / Vbw_Rd
    if eta3 <= 0.5:
        M, branch = Mpl_Rd, "eta3 <= 0.5: no interaction (7.1(1))"
    elif eta3 > 1.0:
        M, branch = Mf_Rd, "eta3 > 1: the flanges alone (the shear check fails on its own)"
    else:
        M = max(Mf_Rd, Mpl_Rd - (Mpl_Rd - Mf_Rd) * (2.0 * eta3 - 1.0) ** 2)
        branch = "0.5 < eta3 <= 1: Eq. 7.1"
    vals = (
        CheckValue("eta3", eta3, "dimensionless", "V_Ed / Vbw,Rd", SRC_71),
        CheckValue("Mpl,Rd", Mpl_Rd, "moment", "plastic moment resistance", SRC_71),
        CheckValue("Mf,Rd", Mf_Rd, "moment", "plastic moment of the flanges alone", SRC_71),
    )
    return Interaction(M, eta3, branch, vals)
