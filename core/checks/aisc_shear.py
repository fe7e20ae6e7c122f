"""Web shear strength: AISC 360-22 Specification for Structural Steel Buildings, Chapter G.

- G2.1: Vn = 0.6 Fy Aw Cv1 (G2-1), Aw = d tw; kv = 5.34 without transverse stiffeners or
  where a/h > 3.0, else kv = 5 + 5/(a/h)² (G2-5); Cv1 = 1.0 for h/tw <= 1.10 sqrt(kv E/Fy)
  (G2-3), else Cv1 = 1.10 sqrt(kv E/Fy)/(h/tw) (G2-4).
- G2.2 (tension field action, interior panels with a/h <= 3.0 bounded by flanges and
  stiffeners): h/tw <= 1.10 sqrt(kv E/Fy): Vn = 0.6 Fy Aw (G2-6); otherwise, when
  2Aw/(Afc + Aft) <= 2.5, h/bfc <= 6.0 and h/bft <= 6.0:
  Vn = 0.6 Fy Aw [Cv2 + (1 - Cv2)/(1.15 sqrt(1 + (a/h)²))] (G2-7); otherwise
  Vn = 0.6 Fy Aw [Cv2 + (1 - Cv2)/(1.15 (a/h + sqrt(1 + (a/h)²)))] (G2-8).
  Cv2 = 1 / 1.10 sqrt(kv E/Fy)/(h/tw) / 1.51 kv E/((h/tw)² Fy) with the limits
  1.10 and 1.37 sqrt(kv E/Fy) (G2-9/-10/-11).
- phi_v = 0.90 (G1), given by the family. The phi_v = 1.00 of G2.1(a) for rolled I-shapes with
  h/tw <= 2.24 sqrt(E/Fy) is not used: built-up riveted webs are not rolled shapes.

Equation numbers and the G2-8 branch are as recalled from the 2016/2022 editions
(from memory). For built-up riveted or bolted sections h is the distance between the
fastener lines: the caller decides it and the report shows it.
"""

from __future__ import annotations

import math

from core.checks._inputs import Number, flanges, internal, length, modulus, stress
from core.checks.aashto_shear import PANELS, Panel
from core.checks.results import ENGINEER, CheckValue, ShearResult
from core.errors import InputError

STANDARD = "AISC 360-22 Specification for Structural Steel Buildings"
EDITION = "2022"


def _src(eq: str) -> str:
    return f"AISC 360-22 {eq} (from memory)"


def kv_for(a_over_h: float | None) -> float:
    """Web plate shear buckling coefficient kv (G2.1(b)(2)); ``None``: no stiffeners."""
    if a_over_h is None or a_over_h > 3.0:
        return 5.34
    return 5.0 + 5.0 / a_over_h**2


def Cv1_for(h_tw: float, kv: float, E: float, Fy: float) -> tuple[float, str]:
    """Web shear strength coefficient Cv1 (G2-3 / G2-4): ``(Cv1, equation)``."""
    lim = 1.10 * math.sqrt(kv * E / Fy)
    if h_tw <= lim:
        return 1.0, "G2-3"
    return lim / h_tw, "G2-4"


def Cv2_for(h_tw: float, kv: float, E: float, Fy: float) -> tuple[float, str]:
    """Web shear buckling coefficient Cv2 (G2-9 / G2-10 / G2-11): ``(Cv2, equation)``."""
    root = math.sqrt(kv * E / Fy)
    if h_tw <= 1.10 * root:
        return 1.0, "G2-9"
    if h_tw <= 1.37 * root:
        return 1.10 * root / h_tw, "G2-10"
    return 1.51 * kv * E / (h_tw**2 * Fy), "G2-11"


def web_shear(
    *,
    Fy: Number,
    E: Number,
    h: Number,
    tw: Number,
    d: Number | None = None,
    panel: Panel = "unstiffened",
    a: Number | None = None,
    bfc: Number | None = None,
    tfc: Number | None = None,
    bft: Number | None = None,
    tft: Number | None = None,
    reduced_tension_field: bool = True,
    phi_v: float,
    where: str = "",
) -> ShearResult:
    """Nominal shear strength of a web panel per AISC 360-22 G2.1 and G2.2.

    Args:
        Fy: web yield stress, MPa. E: modulus, MPa.
        h: clear web depth, mm (riveted: distance between fastener lines).
        tw: web thickness, mm.
        d: overall depth for Aw = d tw, mm; if omitted, Aw = h tw (conservative; noted).
        panel: ``"unstiffened"``, ``"interior"`` or ``"end"``.
        a: clear distance between transverse stiffeners, mm; required unless unstiffened.
        bfc, tfc, bft, tft: flange widths and thicknesses, mm; required for tension field
            action in an interior panel (G2.2 limits).
        reduced_tension_field: when the G2.2 proportion limits are not met, use G2-8
            (``True``) or no tension field at all (``False``).
        phi_v: resistance factor (the family's, 0.90 of G1).
        where: location for error messages.

    Raises:
        InputError: a value out of range, an unknown panel, ``a`` missing for a stiffened
            panel, or flange dimensions missing for an interior panel.
    """
    if panel not in PANELS:
        raise InputError(f"panel = {panel!r} is not one of {list(PANELS)}", where=where)
    Fy = stress(Fy, "Fy", where=where)
    E = modulus(E, where=where)
    h = length(h, "h", where=where)
    tw = length(tw, "tw", where=where)
    phi_v = internal(phi_v, "dimensionless", "phi_v", where=where, low=0.0, high=1.0)
    notes: list[str] = []
    if d is None:
        d = h
        notes.append("overall depth d not given: Aw = h tw used (conservative)")
    else:
        d = length(d, "d", where=where)
    h_tw = h / tw
    Aw = d * tw
    vals = [
        CheckValue("Fy", Fy, "stress", "specified minimum yield stress of the web", ENGINEER),
        CheckValue("E", E, "stress", "modulus of elasticity", ENGINEER),
        CheckValue("h", h, "length", "web depth used (between fastener lines)", ENGINEER),
        CheckValue("tw", tw, "length", "web thickness", ENGINEER),
        CheckValue("h/tw", h_tw, "dimensionless", "web slenderness", "AISC 360-22 G2.1"),
        CheckValue("Aw", Aw, "area", "web area d tw", "AISC 360-22 G2.1"),
    ]
    ratio = None
    if panel != "unstiffened":
        if a is None:
            raise InputError(
                f"a (clear distance between transverse stiffeners, mm) is required for a "
                f"{panel!r} panel",
                where=where,
            )
        a = length(a, "a", where=where)
        ratio = a / h
        vals.append(CheckValue("a", a, "length", "transverse stiffener spacing", ENGINEER))
        vals.append(
            CheckValue("a/h", ratio, "dimensionless", "panel aspect ratio", "AISC 360-22 G2.1")
        )
        if ratio > 3.0:
            notes.append(f"a/h = {ratio:.3g} > 3.0: kv = 5.34 and no tension field (G2.1, G2.2)")
    kv = kv_for(ratio)
    kv_src = "AISC 360-22 G2.1(b)(2)" if ratio is None or ratio > 3.0 else _src("G2-5")
    vals.append(
        CheckValue("kv", kv, "dimensionless", "web plate shear buckling coefficient", kv_src)
    )
    lim = 1.10 * math.sqrt(kv * E / Fy)
    vals.append(CheckValue("1.10 sqrt(kv E/Fy)", lim, "dimensionless", "h/tw limit", _src("G2-3")))
    Cv1, cv1_eq = Cv1_for(h_tw, kv, E, Fy)
    vals.append(
        CheckValue("Cv1", Cv1, "dimensionless", "web shear strength coefficient", _src(cv1_eq))
    )
    Vn = 0.6 * Fy * Aw * Cv1
    clause = "G2.1, Eq. G2-1"
    tension_field = False

    if panel == "end":
        notes.append("end panel: no tension field action (G2.2 applies to interior panels)")
    if panel == "interior" and ratio is not None and ratio <= 3.0:
        if h_tw <= lim:
            Vn, clause = 0.6 * Fy * Aw, "G2.2, Eq. G2-6"
        else:
            f = flanges(
                bfc,
                tfc,
                bft,
                tft,
                needed_for="the tension field limits of AISC 360-22 G2.2",
                where=where,
            )
            Cv2, cv2_eq = Cv2_for(h_tw, kv, E, Fy)
            prop = 2.0 * Aw / (f["bfc"] * f["tfc"] + f["bft"] * f["tft"])
            vals += [
                CheckValue(
                    "1.37 sqrt(kv E/Fy)",
                    1.37 * lim / 1.10,
                    "dimensionless",
                    "h/tw limit",
                    _src("G2-10"),
                ),
                CheckValue(
                    "Cv2", Cv2, "dimensionless", "web shear buckling coefficient", _src(cv2_eq)
                ),
                CheckValue("2Aw/(Afc+Aft)", prop, "dimensionless", "limit 2.5", _src("G2.2")),
                CheckValue("h/bfc", h / f["bfc"], "dimensionless", "limit 6.0", _src("G2.2")),
                CheckValue("h/bft", h / f["bft"], "dimensionless", "limit 6.0", _src("G2.2")),
            ]
            root = math.sqrt(1.0 + ratio**2)
            met = prop <= 2.5 and h / f["bfc"] <= 6.0 and h / f["bft"] <= 6.0
            Vtf: float | None = None
            if met:
                Vtf, eq = 0.6 * Fy * Aw * (Cv2 + (1.0 - Cv2) / (1.15 * root)), "G2.2, Eq. G2-7"
            elif reduced_tension_field:
                Vtf = 0.6 * Fy * Aw * (Cv2 + (1.0 - Cv2) / (1.15 * (ratio + root)))
                eq = "G2.2, Eq. G2-8"
                notes.append("G2.2 proportion limits not met: reduced tension field (G2-8)")
            else:
                notes.append("G2.2 proportion limits not met: no tension field counted")
            if Vtf is not None:
                if Vtf >= Vn:
                    Vn, clause, tension_field = Vtf, eq, True
                else:
                    notes.append(f"G2.1 (no tension field) exceeds {eq}; the larger, G2.1, is used")
    notes.append(f"phi_v = {phi_v:g} (G1); the 1.00 of G2.1(a) for rolled I-shapes is not applied")
    notes.append(f"h = {h:g} mm used as the web depth (engineer's assumption)")
    return ShearResult(
        limit_state="web shear",
        standard=STANDARD,
        edition=EDITION,
        clause=clause + " (from memory)",
        Rn=Vn,
        phi=phi_v,
        kind="force",
        values=tuple(vals),
        notes=tuple(notes),
        panel=panel,
        tension_field=tension_field,
        depth_used=h,
    )
