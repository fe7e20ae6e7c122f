"""Bearing stiffeners: AASHTO LRFD Bridge Design Specifications, Article 6.10.11.2.

Edition followed: 9th ed. (2020); equation numbers as recalled (from memory):

- 6.10.11.2.2-1  projecting width bt <= 0.48 tp sqrt(E/Fys)
- 6.10.11.2.3-1/-2  bearing: (Rsb)r = phi_b (Rsb)n, (Rsb)n = 1.4 Apn Fys, Apn the area of the
  projecting elements outside the web-to-flange fillet (for a riveted girder: beyond the
  connected legs and any clip) and not beyond the flange edge
- 6.10.11.2.4a  axial resistance per 6.9.2.1 with Fys, the radius of gyration about the
  mid-thickness of the web and an effective length 0.75 D
- 6.10.11.2.4b  effective section: stiffeners welded to the web with a central strip of web
  not more than 9 tw each side; stiffeners bolted (here: riveted or bolted) to the web, the
  stiffener elements only
- 6.9.4.1.1-1/-2  Pn = 0.658^(Po/Pe) Po for Pe/Po >= 0.44, else 0.877 Pe; Po = Q Fys Ag with
  Q = 1 (the projecting width limit above holds, or the width beyond it is left out)
- 6.9.4.1.2-1  Pe = pi² E Ag / (K l / rs)²
- 6.5.4.2  phi_b = 1.00 (bearing on milled surfaces), phi_c = 0.95 (axial compression)

Where the measured thickness breaks the projecting width limit, the width beyond the limit
is left out of the column section (conservative; common practice, no source) and the result
says so. The bottom end's loss enters as :mod:`core.checks.stiffener_section` describes.
"""

from __future__ import annotations

import math
from typing import Literal

from core.checks._inputs import Number, length, modulus, stress
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.checks.sources import AASHTO_LRFD, choice, factor
from core.checks.stiffener_section import (
    LOSS_OVER_LENGTH,
    EndLoss,
    Stiffener,
    bearing_area,
    remaining,
    stiffener_section,
)

Connection = Literal["riveted", "welded"]

#: resistance factor for bearing on milled surfaces, 6.5.4.2 (from memory)
PHI_B = 1.00
#: resistance factor for axial compression of steel, 6.5.4.2 (from memory)
PHI_C = 0.95
#: effective length factor of the stiffener column, K l = 0.75 D, 6.10.11.2.4a (from memory)
K_STIFFENER = 0.75
#: web strip each side of a welded stiffener, in web thicknesses, 6.10.11.2.4b (from memory)
STRIP_TW = 9.0


def _ref(clause: str) -> str:
    return AASHTO_LRFD.ref(clause)


def width_limit(tp: float, E: float, Fys: float) -> float:
    """Largest projecting width 0.48 tp sqrt(E/Fys), mm (6.10.11.2.2-1)."""
    return 0.48 * tp * math.sqrt(E / Fys)


def bearing_resistance(
    st: Stiffener,
    *,
    Fys: Number,
    tw: Number,
    bf: Number | None = None,
    clip: Number = 0.0,
    loss: EndLoss | None = None,
    phi_b: float = PHI_B,
    where: str = "",
) -> CapacityResult:
    """Bearing resistance of a bearing stiffener's end, (Rsb)n = 1.4 Apn Fys (6.10.11.2.3).

    Args:
        st: the stiffener as built. Fys: its yield strength, MPa. tw: web thickness, mm.
        bf: width of the bottom flange it bears on, mm (limits the bearing width).
        clip: corner clip at the inner end of each projecting element, mm.
        loss: measured loss of the bottom end (``None``: as built).
        phi_b: resistance factor (default :data:`PHI_B`).
        where: place for messages.

    Raises:
        InputError: values out of range or a loss that removes an element.
    """
    w = where or f"stiffener {st.name!r}"
    Fys = stress(Fys, "Fys", where=w)
    phi = factor(phi_b, "phi_b", high=1.0, where=w)
    ba = bearing_area(st, tw=tw, loss=loss, bf=bf, clip=clip, where=w)
    Rn = 1.4 * ba.Apn * Fys
    vals = [
        CheckValue("Fys", Fys, "stress", "yield strength of the stiffener", ENGINEER),
        CheckValue(
            "t", ba.t, "length", "thickness of each projecting element (as found)", ENGINEER
        ),
        CheckValue(
            "b_bear",
            ba.width,
            "length",
            "bearing width of each projecting element",
            _ref("6.10.11.2.3"),
        ),
        CheckValue("n", ba.n, "dimensionless", "projecting elements in bearing", ENGINEER),
        CheckValue(
            "Apn", ba.Apn, "area", "bearing area of the projecting elements", _ref("6.10.11.2.3")
        ),
    ]
    notes = [
        "connected legs not counted in bearing (projecting elements only)",
        f"phi_b = {phi:g}" + (" (6.5.4.2, from memory)" if phi == PHI_B else " (engineer's input)"),
    ]
    if ba.flange_limited:
        notes.append("bearing width cut at the flange edge (not beyond the edge of the flange)")
    if ba.clip:
        notes.append(f"clip of {ba.clip:g} mm left out at each element's inner end")
    if ba.Apn == 0.0:
        notes.append("no projecting element reaches the bearing: no bearing resistance")
    if loss is not None:
        notes.append(f"as found: end loss over the bottom {loss.height:g} mm")
    return AASHTO_LRFD.result(
        "bearing stiffener bearing", "6.10.11.2.3, Eq. 6.10.11.2.3-2", Rn, phi, "force", vals, notes
    )


def axial_resistance(
    st: Stiffener,
    *,
    Fys: Number,
    E: Number,
    D: Number,
    tw: Number,
    connection: Connection = "riveted",
    loss: EndLoss | None = None,
    strip_available: Number | None = None,
    phi_c: float = PHI_C,
    where: str = "",
) -> CapacityResult:
    """Axial resistance of a bearing stiffener as a column (6.10.11.2.4 with 6.9.4.1).

    Args:
        st: the stiffener as built. Fys: its yield strength, MPa. E: modulus, MPa.
        D: web depth, mm (K l = 0.75 D). tw: web thickness where the loss is, mm.
        connection: ``"riveted"`` (riveted or bolted: stiffener elements only) or
            ``"welded"`` (with a central web strip of 9 tw each side).
        loss: measured loss of the bottom end (``None``: as built).
        strip_available: web length available for the strip, mm (at a girder end the
            web may stop short of 18 tw plus the stiffener); ``None``: not limited.
        phi_c: resistance factor (default :data:`PHI_C`).
        where: place for messages.

    Raises:
        InputError: values out of range or a loss that removes an element.
    """
    w = where or f"stiffener {st.name!r}"
    choice(connection, ("riveted", "welded"), "connection", where=w)
    Fys = stress(Fys, "Fys", where=w)
    E = modulus(E, where=w)
    D = length(D, "D", where=w)
    tw = length(tw, "tw", where=w)
    phi = factor(phi_c, "phi_c", high=1.0, where=w)
    rem = remaining(st, loss)
    lim = width_limit(rem.t, E, Fys)
    notes: list[str] = []
    strip = 0.0
    if connection == "welded":
        footprint = st.t * st.per_side
        strip = 2.0 * STRIP_TW * tw + footprint
        if strip_available is not None:
            strip = min(strip, length(strip_available, "strip_available", where=w))
        notes.append(f"web strip {strip:g} mm (9 tw each side of the stiffener, 6.10.11.2.4b)")
    else:
        notes.append(
            "stiffener riveted or bolted to the web: the stiffener elements only, no web strip "
            "(6.10.11.2.4b, from memory)"
        )
    b_max = None
    if rem.b > lim:
        b_max = lim
        notes.append(
            f"projecting width {rem.b:.4g} mm exceeds 0.48 tp sqrt(E/Fys) = {lim:.4g} mm "
            "(6.10.11.2.2-1): the requirement is not met; the width beyond the limit is left "
            "out of the column section (conservative, common practice, no source): engineer to review"
        )
    sec = stiffener_section(st, tw=tw, strip=strip, loss=loss, b_max=b_max, where=w)
    Ag, rs = sec.A, sec.r_web
    Kl = K_STIFFENER * D
    slender = Kl / rs
    Po = Fys * Ag  # Q = 1
    Pe = math.pi**2 * E * Ag / slender**2
    ratio = Pe / Po
    if ratio >= 0.44:
        Pn, eq = 0.658 ** (Po / Pe) * Po, "6.9.4.1.1-1"
    else:
        Pn, eq = 0.877 * Pe, "6.9.4.1.1-2"
    if slender > 120.0:
        notes.append(
            f"K l / rs = {slender:.4g} exceeds 120 (6.9.3, from memory): engineer to review"
        )
    if loss is not None:
        notes.append(LOSS_OVER_LENGTH + f"; readings over the bottom {loss.height:g} mm")
    notes.append(
        f"phi_c = {phi:g}" + (" (6.5.4.2, from memory)" if phi == PHI_C else " (engineer's input)")
    )
    vals = [
        CheckValue("Fys", Fys, "stress", "yield strength of the stiffener", ENGINEER),
        CheckValue("E", E, "stress", "modulus of elasticity", ENGINEER),
        CheckValue("bt", rem.b, "length", "projecting width (as found)", ENGINEER),
        CheckValue(
            "tp", rem.t, "length", "thickness of the projecting element (as found)", ENGINEER
        ),
        CheckValue(
            "0.48 tp sqrt(E/Fys)", lim, "length", "largest projecting width", _ref("6.10.11.2.2-1")
        ),
        CheckValue("strip", strip, "length", "web strip counted", _ref("6.10.11.2.4b")),
        CheckValue("Ag", Ag, "area", "area of the effective column section", "section engine"),
        CheckValue(
            "I",
            sec.I_web,
            "inertia",
            "moment of inertia about the web mid-thickness",
            "section engine",
        ),
        CheckValue(
            "rs",
            rs,
            "length",
            "radius of gyration about the web mid-thickness",
            _ref("6.10.11.2.4a"),
        ),
        CheckValue("K l", Kl, "length", "effective length 0.75 D", _ref("6.10.11.2.4a")),
        CheckValue("K l / rs", slender, "dimensionless", "slenderness", _ref("6.9.4.1.2")),
        CheckValue(
            "Po",
            Po,
            "force",
            "equivalent nominal yield resistance Q Fys Ag, Q = 1",
            _ref("6.9.4.1.1"),
        ),
        CheckValue("Pe", Pe, "force", "elastic critical buckling resistance", _ref("6.9.4.1.2-1")),
        CheckValue(
            "Pe/Po", ratio, "dimensionless", "branch: 0.44 and above inelastic", _ref("6.9.4.1.1")
        ),
    ]
    return AASHTO_LRFD.result(
        "bearing stiffener as a column",
        f"6.10.11.2.4 with 6.9.4.1.1, Eq. {eq}",
        Pn,
        phi,
        "force",
        vals,
        notes,
    )
