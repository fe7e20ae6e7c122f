"""Bearing stiffeners: AISC 360-22 Specification for Structural Steel Buildings, J7 and J10.8.

Equation numbers as recalled from the 2016 and 2022 editions (from memory):

- J7(a), J7-1  bearing of the ends of fitted bearing stiffeners: Rn = 1.8 Fy Apb, phi = 0.75
- J10.8  bearing stiffeners as columns per J4.4, with Lc = 0.75 h and a cross-section of the
  stiffeners plus a strip of web 25 tw wide at interior stiffeners, 12 tw at member ends;
  the stiffeners' width-thickness ratio b/t <= 0.56 sqrt(E/Fy)
- J4.4  Lc/r <= 25: Pn = Fy Ag (J4-6); Lc/r > 25: Chapter E, phi = 0.90
- E3  Fe = pi² E / (Lc/r)² (E3-4); Lc/r <= 4.71 sqrt(E/Fy): Fcr = 0.658^(Fy/Fe) Fy (E3-2);
  otherwise Fcr = 0.877 Fe (E3-3); Pn = Fcr Ag (E3-1); phi_c = 0.90 (E1)

The radius of gyration is taken about the centroidal axis parallel to the web (for a pair
of stiffeners, the web's mid-plane). Where the measured thickness breaks the width-thickness
limit, the width beyond it is left out of the column section (conservative; common practice,
no source). The bottom end's loss enters as :mod:`core.checks.stiffener_section` describes.
"""

from __future__ import annotations

import math
from typing import Literal

from core.checks._inputs import Number, length, modulus, stress
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.checks.sources import AISC_360, choice, factor
from core.checks.stiffener_section import (
    LOSS_OVER_LENGTH,
    EndLoss,
    Stiffener,
    bearing_area,
    remaining,
    stiffener_section,
)

Position = Literal["end", "interior"]

#: resistance factor for bearing on fitted stiffener ends, J7 (from memory)
PHI_BEARING = 0.75
#: resistance factor for compression, J4.4 and E1 (from memory)
PHI_C = 0.90
#: effective length Lc = 0.75 h, J10.8 (from memory)
K_STIFFENER = 0.75
#: web strip width in web thicknesses, J10.8 (from memory)
STRIP_TW: dict[str, float] = {"interior": 25.0, "end": 12.0}


def _ref(clause: str) -> str:
    return AISC_360.ref(clause)


def bearing_resistance(
    st: Stiffener,
    *,
    Fy: Number,
    tw: Number,
    bf: Number | None = None,
    clip: Number = 0.0,
    loss: EndLoss | None = None,
    phi: float = PHI_BEARING,
    where: str = "",
) -> CapacityResult:
    """Bearing strength of a fitted bearing stiffener's end, Rn = 1.8 Fy Apb (J7-1).

    Args:
        st: the stiffener. Fy: its yield strength, MPa. tw: web thickness, mm.
        bf: width of the flange it bears on, mm. clip: corner clip of each element, mm.
        loss: measured loss of the bottom end. phi: default :data:`PHI_BEARING`.
        where: place for messages.

    Raises:
        InputError: values out of range or a loss that removes an element.
    """
    w = where or f"stiffener {st.name!r}"
    Fy = stress(Fy, "Fy", where=w)
    ph = factor(phi, "phi", high=1.0, where=w)
    ba = bearing_area(st, tw=tw, loss=loss, bf=bf, clip=clip, where=w)
    vals = [
        CheckValue("Fy", Fy, "stress", "yield strength of the stiffener", ENGINEER),
        CheckValue(
            "b_bear", ba.width, "length", "bearing width of each projecting element", _ref("J7")
        ),
        CheckValue(
            "t", ba.t, "length", "thickness of each projecting element (as found)", ENGINEER
        ),
        CheckValue("Apb", ba.Apn, "area", "projected area in bearing", _ref("J7")),
    ]
    notes = ["projecting elements only (clip and connected legs left out)"]
    if ba.flange_limited:
        notes.append("bearing width cut at the flange edge")
    if loss is not None:
        notes.append(f"as found: end loss over the bottom {loss.height:g} mm")
    return AISC_360.result(
        "bearing stiffener bearing", "J7(a), Eq. J7-1", 1.8 * Fy * ba.Apn, ph, "force", vals, notes
    )


def column_stress(slender: float, Fy: float, E: float) -> tuple[float, float, str]:
    """``(Fcr, Fe, equation)`` of J4.4 and E3 for a slenderness Lc/r."""
    Fe = math.pi**2 * E / slender**2
    if slender <= 25.0:
        return Fy, Fe, "J4-6"
    if slender <= 4.71 * math.sqrt(E / Fy):
        return 0.658 ** (Fy / Fe) * Fy, Fe, "E3-2"
    return 0.877 * Fe, Fe, "E3-3"


def axial_strength(
    st: Stiffener,
    *,
    Fy: Number,
    E: Number,
    h: Number,
    tw: Number,
    position: Position = "end",
    loss: EndLoss | None = None,
    strip_available: Number | None = None,
    phi_c: float = PHI_C,
    where: str = "",
) -> CapacityResult:
    """Compressive strength of a bearing stiffener as a column (J10.8 with J4.4 and E3).

    Args:
        st: the stiffener. Fy: its yield strength, MPa. E: modulus, MPa.
        h: web depth for Lc = 0.75 h, mm. tw: web thickness where the loss is, mm.
        position: ``"end"`` (strip 12 tw) or ``"interior"`` (25 tw).
        loss: measured loss of the bottom end. strip_available: web length available for
            the strip, mm. phi_c: default :data:`PHI_C`. where: place for messages.

    Raises:
        InputError: values out of range or a loss that removes an element.
    """
    w = where or f"stiffener {st.name!r}"
    choice(position, tuple(STRIP_TW), "position", where=w)
    Fy = stress(Fy, "Fy", where=w)
    E = modulus(E, where=w)
    h = length(h, "h", where=w)
    tw = length(tw, "tw", where=w)
    ph = factor(phi_c, "phi_c", high=1.0, where=w)
    rem = remaining(st, loss)
    lim = 0.56 * rem.t * math.sqrt(E / Fy)
    strip = STRIP_TW[position] * tw
    if strip_available is not None:
        strip = min(strip, length(strip_available, "strip_available", where=w))
    notes = [f"web strip {strip:g} mm ({STRIP_TW[position]:g} tw, {position} stiffener, J10.8)"]
    b_max = None
    if rem.b > lim:
        b_max = lim
        notes.append(
            f"b/t = {rem.b / rem.t:.4g} exceeds 0.56 sqrt(E/Fy) = {lim / rem.t:.4g} (J10.8): the "
            "width beyond the limit is left out (conservative, common practice, no source): "
            "engineer to review"
        )
    sec = stiffener_section(st, tw=tw, strip=strip, loss=loss, b_max=b_max, where=w)
    Lc = K_STIFFENER * h
    r = sec.r
    slender = Lc / r
    Fcr, Fe, eq = column_stress(slender, Fy, E)
    if loss is not None:
        notes.append(LOSS_OVER_LENGTH + f"; readings over the bottom {loss.height:g} mm")
    vals = [
        CheckValue("Fy", Fy, "stress", "yield strength of the stiffener", ENGINEER),
        CheckValue(
            "b/t", rem.b / rem.t, "dimensionless", "width-thickness ratio (as found)", _ref("J10.8")
        ),
        CheckValue("0.56 sqrt(E/Fy)", lim / rem.t, "dimensionless", "limit of b/t", _ref("J10.8")),
        CheckValue("Ag", sec.A, "area", "stiffeners plus web strip", "section engine"),
        CheckValue(
            "r", r, "length", "radius of gyration, axis parallel to the web", "section engine"
        ),
        CheckValue("Lc", Lc, "length", "effective length 0.75 h", _ref("J10.8")),
        CheckValue("Lc/r", slender, "dimensionless", "slenderness", _ref("J4.4")),
        CheckValue("Fe", Fe, "stress", "elastic buckling stress", _ref("E3-4")),
        CheckValue("Fcr", Fcr, "stress", "critical stress", _ref(eq)),
    ]
    return AISC_360.result(
        "bearing stiffener as a column",
        f"J10.8 with J4.4 and E3, Eq. {eq}",
        Fcr * sec.A,
        ph,
        "force",
        vals,
        notes,
    )
