"""Web shear where the loss is local: a loss band, a perforation, or thinning at one station.

Two resistances, the lower governs and both are reported:

(a) the cut-average shear stress tau = V Q / (I t) at the most stressed cut of the as-found
    section reaching the family's shear yield stress tau_y: V_el = tau_y / max(Q / (I t)).
    EN 1993-1-1:2005 6.2.6(4)-(5) states this elastic criterion (tau_Ed = V_Ed S / (I t) <=
    fy / (sqrt(3) gamma_M0)); the AASHTO and AISC families use their own shear yield stresses
    (0.58 Fyw, AASHTO LRFD 6.10.9.2; 0.6 Fy, AISC 360-22 G2.1). First yield at the thinnest
    cut, without redistribution: conservative. Not applicable where the loss splits the
    section (a perforated web): VQ/It does not describe shear across a cut-through web.
(b) plastic shear of the net vertical section of the web: V_pl,net = tau_y A_v,net, with
    A_v,net the remaining web area over the depth used for shear at the station (bands at
    their thickness, perforations removed). EN 1993-1-1 6.2.6(2) (Vpl = Av fy / sqrt(3)),
    AASHTO LRFD 6.10.9.2 (Vp = 0.58 Fyw D tw) and AISC 360-22 G2.1 (0.6 Fy Aw) on the net area.

Buckling of the panel is the panel check's, with the panel-representative thickness.
"""

from __future__ import annotations

from core.checks._inputs import internal, stress
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.errors import InputError

METHOD = "tau = VQ/(I t) (mechanics of beams) at the thinnest cut"


def local_web_shear(
    *,
    tau_y: float,
    tau_y_words: str,
    tau_y_source: str,
    phi: float,
    tau_per_V: float | None,
    cut_height: float | None,
    A_v_net: float,
    standard: str,
    edition: str,
    clause: str,
    where: str = "",
) -> CapacityResult:
    """Local web shear resistance: the lower of (a) and (b) of the module docstring.

    Args:
        tau_y: shear yield stress of the family, MPa (0.58 Fyw, 0.6 Fy or fy / sqrt(3)).
        tau_y_words, tau_y_source: how tau_y was found and its clause.
        phi: resistance factor (1 / gamma_M0 for EN).
        tau_per_V: max Q / (I t) of the as-found section, 1/mm² (the peak cut-average
            stress for V = 1 N); None where VQ/It is not applicable (split section).
        cut_height: height of that cut, mm (reported only).
        A_v_net: net web area over the depth used for shear, mm² (> 0).
        standard, edition, clause: the family's names for the result.

    Raises:
        InputError: a value out of range, or neither (a) nor (b) available.
    """
    ty = stress(tau_y, "tau_y", where=where)
    phi = internal(phi, "dimensionless", "phi", where=where, low=0.0, high=1.5)
    A = internal(A_v_net, "area", "A_v,net", where=where, low=0.0, high=1e9, low_inclusive=True)
    vals = [CheckValue("tau_y", ty, "stress", tau_y_words, tau_y_source)]
    modes = []
    if tau_per_V is not None:
        if not tau_per_V > 0.0:
            raise InputError(f"max Q/(I t) = {tau_per_V!r} must be positive", where=where)
        V_el = ty / tau_per_V
        vals.append(
            CheckValue(
                "V_el",
                V_el,
                "force",
                "tau_y / max Q/(I t): first yield at the thinnest cut",
                METHOD,
            )
        )
        if cut_height is not None:
            vals.append(CheckValue("y_cut", cut_height, "length", "height of that cut", METHOD))
        modes.append((V_el, "cut-average shear at the thinnest cut"))
    V_pl = ty * A
    vals.append(CheckValue("A_v,net", A, "area", "net web area over the shear depth", ENGINEER))
    vals.append(CheckValue("V_pl,net", V_pl, "force", "tau_y A_v,net", clause))
    modes.append((V_pl, "plastic shear of the net vertical section"))
    Rn, gov = min(modes, key=lambda m: m[0])
    notes = [f"governing: {gov}"]
    if tau_per_V is None:
        notes.append("VQ/It not applicable (the section is split): only the net plastic shear")
    return CapacityResult(
        limit_state="local web shear",
        standard=standard,
        edition=edition,
        clause=clause,
        Rn=Rn,
        phi=phi,
        kind="force",
        values=tuple(vals),
        notes=tuple(notes),
    )
