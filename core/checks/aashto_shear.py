"""Web shear resistance: AASHTO LRFD Bridge Design Specifications, Article 6.10.9.

Edition followed: 9th edition (2020). Equation numbers are as recalled (from memory):

- 6.10.9.2-1  unstiffened web: Vn = Vcr = C Vp, with k = 5
- 6.10.9.2-2  Vp = 0.58 Fyw D tw
- 6.10.9.3.2-1  proportion check 2 D tw / (bfc tfc + bft tft) <= 2.5
- 6.10.9.3.2-2  interior panel, proportions met: Vn = Vp [C + 0.87 (1 - C) / sqrt(1 + (do/D)²)]
- 6.10.9.3.2-4/-5/-6  C = 1 / 1.12 sqrt(Ek/Fyw)/(D/tw) / 1.57 (Ek/Fyw)/(D/tw)²
- 6.10.9.3.2-7  k = 5 + 5/(do/D)²
- 6.10.9.3.2-8  interior panel, proportions not met:
  Vn = Vp [C + 0.87 (1 - C) / (sqrt(1 + (do/D)²) + do/D)]
- 6.10.9.3.3-1  end panel: Vn = Vcr = C Vp

A web is stiffened only where do <= 3D (6.10.9.1); a wider panel is checked as unstiffened.
phi_v is the family's (1.00, 6.5.4.2, from memory). All inputs in N, mm, MPa (or strings with units).
"""

from __future__ import annotations

import math
from typing import Literal

from core.checks._inputs import Number, flanges, internal, length, modulus, stress
from core.checks.results import ENGINEER, CheckValue, ShearResult
from core.errors import InputError

Panel = Literal["unstiffened", "interior", "end"]
PANELS: tuple[str, ...] = ("unstiffened", "interior", "end")

STANDARD = "AASHTO LRFD Bridge Design Specifications"
EDITION = "9th edition (2020)"
_MEM = " (equation number from memory)"


def _art(clause: str) -> str:
    return f"AASHTO LRFD {EDITION}, {clause}"


def _eq(eq: str) -> str:
    return f"AASHTO LRFD {EDITION}, Eq. {eq}{_MEM}"


def shear_ratio_C(D: float, tw: float, k: float, E: float, Fyw: float) -> tuple[float, str]:
    """Ratio C of shear buckling resistance to shear yield strength, 6.10.9.3.2-4/-5/-6.

    Args:
        D: web depth, mm. tw: web thickness, mm. k: shear buckling coefficient.
        E: modulus, MPa. Fyw: web yield strength, MPa.

    Returns:
        ``(C, equation)``.
    """
    slender = D / tw
    root = math.sqrt(E * k / Fyw)
    if slender <= 1.12 * root:
        return 1.0, "6.10.9.3.2-4"
    if slender <= 1.40 * root:
        return 1.12 * root / slender, "6.10.9.3.2-5"
    return 1.57 / slender**2 * (E * k / Fyw), "6.10.9.3.2-6"


def web_shear(
    *,
    Fyw: Number,
    E: Number,
    D: Number,
    tw: Number,
    panel: Panel = "unstiffened",
    do: Number | None = None,
    bfc: Number | None = None,
    tfc: Number | None = None,
    bft: Number | None = None,
    tft: Number | None = None,
    phi_v: float,
    where: str = "",
) -> ShearResult:
    """Nominal shear resistance of a web panel per AASHTO LRFD 6.10.9.

    Args:
        Fyw: web yield strength, MPa. E: modulus of elasticity, MPa.
        D: web depth, mm (for a riveted girder: the web plate depth or the distance
            between rivet lines, the caller's assumption). tw: web thickness, mm.
        panel: ``"unstiffened"``, ``"interior"`` (stiffened, tension field) or ``"end"``.
        do: transverse stiffener spacing, mm; required for ``"interior"`` and ``"end"``.
        bfc, tfc, bft, tft: compression / tension flange width and thickness, mm;
            required for ``"interior"`` (proportion check 6.10.9.3.2-1).
        phi_v: resistance factor for shear (the family's).
        where: location for error messages.

    Raises:
        InputError: a value out of range, an unknown panel kind, ``do`` missing for a
            stiffened panel, or flange dimensions missing for an interior panel.
    """
    if panel not in PANELS:
        raise InputError(f"panel = {panel!r} is not one of {list(PANELS)}", where=where)
    Fyw = stress(Fyw, "Fyw", where=where)
    E = modulus(E, where=where)
    D = length(D, "D", where=where)
    tw = length(tw, "tw", where=where)
    phi_v = internal(phi_v, "dimensionless", "phi_v", where=where, low=0.0, high=1.0)
    src = STANDARD
    notes: list[str] = []
    vals: list[CheckValue] = [
        CheckValue("Fyw", Fyw, "stress", "specified minimum yield strength of the web", ENGINEER),
        CheckValue("E", E, "stress", "modulus of elasticity", ENGINEER),
        CheckValue("D", D, "length", "web depth used in the check", ENGINEER),
        CheckValue("tw", tw, "length", "web thickness", ENGINEER),
        CheckValue("D/tw", D / tw, "dimensionless", "web slenderness", _art("6.10.9")),
    ]
    Vp = 0.58 * Fyw * D * tw
    vals.append(CheckValue("Vp", Vp, "force", "plastic shear force", _eq("6.10.9.2-2")))

    kind = panel
    ratio = None
    if panel != "unstiffened":
        if do is None:
            raise InputError(
                f"do (transverse stiffener spacing, mm) is required for a {panel!r} panel",
                where=where,
            )
        do = length(do, "do", where=where)
        ratio = do / D
        vals.append(CheckValue("do", do, "length", "transverse stiffener spacing", ENGINEER))
        vals.append(
            CheckValue("do/D", ratio, "dimensionless", "panel aspect ratio", _art("6.10.9"))
        )
        if do > 3.0 * D:
            notes.append(
                f"do/D = {ratio:.3g} > 3: the web is not stiffened for shear (6.10.9.1); "
                "checked as an unstiffened web"
            )
            kind = "unstiffened"
        elif panel == "end" and do > 1.5 * D:
            notes.append(
                f"end panel do/D = {ratio:.3g} exceeds the 1.5 limit on end-panel stiffener "
                "spacing (6.10.9.3.3, from memory): engineer to review"
            )

    if kind == "unstiffened":
        k, k_src = 5.0, _art("6.10.9.2 (k = 5 for unstiffened webs)")
    else:
        assert ratio is not None
        k, k_src = 5.0 + 5.0 / ratio**2, _eq("6.10.9.3.2-7")
    vals.append(CheckValue("k", k, "dimensionless", "shear buckling coefficient", k_src))
    C, c_eq = shear_ratio_C(D, tw, k, E, Fyw)
    vals.append(
        CheckValue(
            "1.12 sqrt(Ek/Fyw)",
            1.12 * math.sqrt(E * k / Fyw),
            "dimensionless",
            "limit of D/tw for C = 1",
            _eq("6.10.9.3.2-4"),
        )
    )
    vals.append(
        CheckValue(
            "1.40 sqrt(Ek/Fyw)",
            1.40 * math.sqrt(E * k / Fyw),
            "dimensionless",
            "limit of D/tw for inelastic buckling",
            _eq("6.10.9.3.2-5"),
        )
    )
    vals.append(
        CheckValue("C", C, "dimensionless", "shear buckling / shear yield ratio", _eq(c_eq))
    )

    tension_field = False
    if kind == "unstiffened":
        Vn, clause = C * Vp, "6.10.9.2-1"
    elif kind == "end":
        Vn, clause = C * Vp, "6.10.9.3.3-1"
        notes.append("end panel: no tension field action (6.10.9.3.3)")
    else:
        assert ratio is not None
        f = flanges(
            bfc,
            tfc,
            bft,
            tft,
            needed_for="the interior-panel proportion check 6.10.9.3.2-1",
            where=where,
        )
        prop = 2.0 * D * tw / (f["bfc"] * f["tfc"] + f["bft"] * f["tft"])
        vals.append(
            CheckValue(
                "2Dtw/(bfc tfc + bft tft)",
                prop,
                "dimensionless",
                "web-to-flange area proportion (limit 2.5)",
                _eq("6.10.9.3.2-1"),
            )
        )
        root = math.sqrt(1.0 + ratio**2)
        if prop <= 2.5:
            Vn, clause = Vp * (C + 0.87 * (1.0 - C) / root), "6.10.9.3.2-2"
        else:
            Vn, clause = Vp * (C + 0.87 * (1.0 - C) / (root + ratio)), "6.10.9.3.2-8"
            notes.append(
                f"2Dtw/(bfc tfc + bft tft) = {prop:.3g} > 2.5: reduced tension field "
                "(6.10.9.3.2-8, from memory)"
            )
        tension_field = C < 1.0
    limit = {"unstiffened": 150.0, "interior": 300.0, "end": 300.0}[kind]
    if D / tw > limit:
        notes.append(
            f"D/tw = {D / tw:.4g} exceeds {limit:g}, the proportion limit for this web "
            "(6.10.2.1, from memory): engineer to review"
        )
    notes.append(f"phi_v = {phi_v:g} (6.5.4.2, from memory)")
    notes.append(f"D = {D:g} mm used as the web depth (engineer's assumption)")
    return ShearResult(
        limit_state="web shear",
        standard=src,
        edition=EDITION,
        clause=f"Article 6.10.9, Eq. {clause}" + _MEM,
        Rn=Vn,
        phi=phi_v,
        kind="force",
        values=tuple(vals),
        notes=tuple(notes),
        panel=panel,
        tension_field=tension_field,
        depth_used=D,
    )
