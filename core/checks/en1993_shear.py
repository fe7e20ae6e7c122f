"""Web shear buckling resistance: EN 1993-1-5:2006 Section 5 (plated structural elements).

- 5.2(1): Vb,Rd = Vbw,Rd + Vbf,Rd <= eta fyw hw t / (sqrt(3) gamma_M1)   (5.1)
- 5.2(1): Vbw,Rd = chi_w fyw hw t / (sqrt(3) gamma_M1)                   (5.2)
- 5.3(3): lambda_w = 0.76 sqrt(fyw / tau_cr)                              (5.3)
- 5.3(1): tau_cr = k_tau sigma_E
- Annex A.1: sigma_E = pi² E t² / (12 (1 - nu²) b²) = 190 000 (t/b)² MPa (E = 210 000 MPa,
  nu = 0.3; the 190 000 is used as the standard writes it, whatever E the caller uses)
- Annex A.3: k_tau = 5.34 + 4.00 (hw/a)² for a/hw >= 1; 4.00 + 5.34 (hw/a)² for a/hw < 1
  (no longitudinal stiffeners, k_tau,sl = 0); no intermediate stiffeners: k_tau = 5.34
- Table 5.1: chi_w = eta for lambda_w < 0.83/eta; 0.83/lambda_w up to 1.08; beyond 1.08:
  1.37/(0.7 + lambda_w) with a rigid end post, 0.83/lambda_w with a non-rigid end post.
- 5.1(2) Note: eta = 1.20 for steel grades up to S460 (recommended value; the National Annex
  may differ); the family passes eta = 1.0 for steel of unknown or early grade.
- gamma_M1 is the family's partial factor (1.10 for bridges, EN 1993-2 Table 6.1); the caller
  always gives it.
- The flange contribution Vbf,Rd (5.4) is computed by :mod:`core.checks.en1993_interaction`
  and given here as ``Vbf_Rd`` (0 when not counted).

Clause numbers from memory.
"""

from __future__ import annotations

import math
from typing import Literal

from core.checks._inputs import Number, internal, length, modulus, stress
from core.checks.aashto_shear import PANELS, Panel
from core.checks.results import ENGINEER, CheckValue, ShearResult
from core.errors import InputError

EndPost = Literal["rigid", "non-rigid"]

STANDARD = "EN 1993-1-5 Design of steel structures: plated structural elements"
EDITION = "2006"
SIGMA_E_COEF = 190_000.0  # MPa, Annex A.1


def _src(clause: str) -> str:
    return f"EN 1993-1-5 {clause} (from memory)"


def k_tau_for(a_over_hw: float | None) -> float:
    """Shear buckling coefficient k_tau, Annex A.3, without longitudinal stiffeners."""
    if a_over_hw is None:
        return 5.34
    if a_over_hw >= 1.0:
        return 5.34 + 4.00 / a_over_hw**2
    return 4.00 + 5.34 / a_over_hw**2


def chi_w_for(lambda_w: float, eta: float, end_post: EndPost) -> tuple[float, str]:
    """Contribution factor chi_w of Table 5.1: ``(chi_w, which branch)``."""
    if lambda_w < 0.83 / eta:
        return eta, "Table 5.1, lambda_w < 0.83/eta"
    if lambda_w < 1.08:
        return 0.83 / lambda_w, "Table 5.1, 0.83/eta <= lambda_w < 1.08"
    if end_post == "rigid":
        return 1.37 / (0.7 + lambda_w), "Table 5.1, lambda_w >= 1.08, rigid end post"
    return 0.83 / lambda_w, "Table 5.1, lambda_w >= 1.08, non-rigid end post"


def web_shear(
    *,
    fyw: Number,
    hw: Number,
    t: Number,
    panel: Panel = "unstiffened",
    a: Number | None = None,
    eta: float,
    gamma_M1: float,
    end_post: EndPost = "non-rigid",
    Vbf_Rd: float = 0.0,
    Vbf_values: tuple[CheckValue, ...] = (),
    E: Number | None = None,
    where: str = "",
) -> ShearResult:
    """Shear buckling resistance of the web, Vbw,Rd, per EN 1993-1-5 5.2 and 5.3.

    Args:
        fyw: web yield strength, MPa. hw: web depth, mm. t: web thickness, mm.
        panel: ``"unstiffened"`` (stiffeners at supports only), ``"interior"`` or ``"end"``.
        a: spacing of the transverse stiffeners, mm; required unless unstiffened.
        end_post: ``"rigid"`` or ``"non-rigid"`` (Table 5.1; default non-rigid,
            the lower chi_w). For an interior panel the engineer may choose ``"rigid"``
            where the adjacent panels anchor the tension field.
        eta: factor of 5.1(2) (1.0 to 1.2; the family's choice).
        gamma_M1: partial factor (the family's).
        Vbf_Rd: design flange contribution of 5.4, N (0: not counted); Vbf_values its working.
        E: accepted for a common call signature and only reported; sigma_E uses the
            standard's 190 000 MPa.
        where: location for error messages.

    Raises:
        InputError: a value out of range, unknown panel or end post, or ``a`` missing.
    """
    if panel not in PANELS:
        raise InputError(f"panel = {panel!r} is not one of {list(PANELS)}", where=where)
    if end_post not in ("rigid", "non-rigid"):
        raise InputError(f"end_post = {end_post!r} is not 'rigid' or 'non-rigid'", where=where)
    fyw = stress(fyw, "fyw", where=where)
    hw = length(hw, "hw", where=where)
    t = length(t, "t", where=where)
    gM1 = internal(gamma_M1, "dimensionless", "gamma_M1", where=where, low=0.0, high=2.0)
    notes: list[str] = []
    eta = internal(eta, "dimensionless", "eta", where=where, low=1.0, high=1.2, low_inclusive=True)
    Vbf = internal(Vbf_Rd, "force", "Vbf,Rd", where=where, low=0.0, high=1e12, low_inclusive=True)
    vals = [
        CheckValue("fyw", fyw, "stress", "yield strength of the web", ENGINEER),
        CheckValue("hw", hw, "length", "web depth used", ENGINEER),
        CheckValue("t", t, "length", "web thickness", ENGINEER),
        CheckValue("hw/t", hw / t, "dimensionless", "web slenderness", _src("5.1")),
    ]
    if E is not None:
        vals.append(
            CheckValue("E", modulus(E, where=where), "stress", "modulus (reported only)", ENGINEER)
        )
    ratio = None
    if panel != "unstiffened":
        if a is None:
            raise InputError(
                f"a (transverse stiffener spacing, mm) is required for a {panel!r} panel",
                where=where,
            )
        a = length(a, "a", where=where)
        ratio = a / hw
        vals.append(CheckValue("a", a, "length", "transverse stiffener spacing", ENGINEER))
        vals.append(
            CheckValue("a/hw", ratio, "dimensionless", "panel aspect ratio", _src("Annex A.3"))
        )
    k_tau = k_tau_for(ratio)
    sigma_E = SIGMA_E_COEF * (t / hw) ** 2
    tau_cr = k_tau * sigma_E
    lambda_w = 0.76 * math.sqrt(fyw / tau_cr)
    chi_w, branch = chi_w_for(lambda_w, eta, end_post)
    Vbw = chi_w * fyw * hw * t / math.sqrt(3.0)
    cap = eta * fyw * hw * t / math.sqrt(3.0)
    vals += [
        CheckValue(
            "k_tau", k_tau, "dimensionless", "shear buckling coefficient", _src("Annex A.3")
        ),
        CheckValue("sigma_E", sigma_E, "stress", "Euler stress 190 000 (t/hw)²", _src("Annex A.1")),
        CheckValue("tau_cr", tau_cr, "stress", "elastic critical shear stress", _src("5.3(1)")),
        CheckValue("lambda_w", lambda_w, "dimensionless", "slenderness parameter", _src("5.3(3)")),
        CheckValue("eta", eta, "dimensionless", "shear area factor", _src("5.1(2)")),
        CheckValue("chi_w", chi_w, "dimensionless", "web contribution factor", _src(branch)),
        CheckValue("gamma_M1", gM1, "dimensionless", "partial factor", "EN 1993-2 Table 6.1"),
        CheckValue("Vbw,Rd", Vbw / gM1, "force", "web contribution", _src("5.2, Eq. 5.2")),
        CheckValue(
            "eta fyw hw t/(sqrt(3) gamma_M1)",
            cap / gM1,
            "force",
            "upper limit",
            _src("5.2(1), Eq. 5.1"),
        ),
    ]
    vals += list(Vbf_values)
    vals.append(
        CheckValue("Vbf,Rd", Vbf, "force", "flange contribution (5.4)", _src("5.4, Eq. 5.8"))
    )
    Vn = min(Vbw + Vbf * gM1, cap)
    notes += [
        "sigma_E = 190 000 (t/hw)² MPa is pi² E/(12(1 - nu²)) with E = 210 000 MPa, nu = 0.3 "
        "(Annex A.1)",
        f"gamma_M1 = {gM1:g} (the family's partial factor)",
        "flange contribution Vbf,Rd (5.4) counted"
        if Vbf > 0
        else "flange contribution Vbf,Rd (5.4) not counted",
        f"end post taken as {end_post} (Table 5.1)",
        f"hw = {hw:g} mm used as the web depth (engineer's assumption)",
    ]
    return ShearResult(
        limit_state="web shear",
        standard=STANDARD,
        edition=EDITION,
        clause="5.2, Eq. 5.1 and 5.2 with Table 5.1"
        + (" and 5.4" if Vbf > 0 else "")
        + " (from memory)",
        Rn=Vn,
        phi=1.0 / gM1,
        kind="force",
        values=tuple(vals),
        notes=tuple(notes),
        panel=panel,
        tension_field=end_post == "rigid" and lambda_w >= 1.08,
        depth_used=hw,
    )
