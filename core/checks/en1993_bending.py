"""Bending in the EN 1993 family: cross-section class, effective widths and Mc,Rd.

From memory of EN 1993-1-1:2005 and EN 1993-1-5:2006:

- epsilon = sqrt(235 / fy) (EN 1993-1-1 Table 5.2).
- Table 5.2, outstand flange in compression: c/t <= 9 eps (class 1), 10 eps (2), 14 eps (3).
- Table 5.2, internal part in bending and compression (the web), alpha the compressed share
  of c at full plasticity and psi = sigma_2 / sigma_1 elastically:
  class 1: 396 eps / (13 alpha - 1) for alpha > 0.5, 36 eps / alpha otherwise;
  class 2: 456 eps / (13 alpha - 1), 41.5 eps / alpha;
  class 3: 42 eps / (0.67 + 0.33 psi) for psi > -1, 62 eps (1 - psi) sqrt(-psi) for psi <= -1.
- EN 1993-1-5 4.4: internal element rho = 1 for lambda_p <= 0.5 + sqrt(0.085 - 0.055 psi),
  else rho = (lambda_p - 0.055 (3 + psi)) / lambda_p² <= 1; outstand rho = 1 for
  lambda_p <= 0.748, else (lambda_p - 0.188) / lambda_p² <= 1;
  lambda_p = (c/t) / (28.4 eps sqrt(k_sigma)); Table 4.1 k_sigma (internal): 4.0 at psi = 1,
  8.2 / (1.05 + psi) for 1 > psi > 0, 7.81 - 6.29 psi + 9.78 psi² for 0 >= psi > -1,
  23.9 at psi = -1, 5.98 (1 - psi)² for -1 > psi > -3; Table 4.2 outstand in uniform
  compression k_sigma = 0.43. Table 4.1 distribution (psi < 0): b_c = c / (1 - psi),
  b_eff = rho b_c, b_e1 = 0.4 b_eff at the compressed edge, b_e2 = 0.6 b_eff towards the
  neutral axis; (1 > psi >= 0): b_eff = rho c, b_e1 = 2 b_eff / (5 - psi), b_e2 = b_eff - b_e1.
- EN 1993-1-1 6.2.5: Mc,Rd = Wpl fy / gamma_M0 (class 1, 2), Wel,min fy / gamma_M0 (class 3),
  Weff,min fy / gamma_M0 (class 4).
- EN 1993-1-1 6.2.5(4): holes in the tension flange may be ignored where
  Af,net 0.9 fu / gamma_M2 >= Af fy / gamma_M0 (6.16); otherwise a reduced flange is used:
  here the gross-area stress of the tension flange is limited to 0.9 (Af,net / Af) fu / gamma_M2.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from core.checks._inputs import Number, internal, stress
from core.checks.flexure import net_area_ratio
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.errors import InputError

STANDARD = "EN 1993-1-1 / EN 1993-1-5 Design of steel structures"
EDITION = "2005 / 2006"


def _src(clause: str) -> str:
    return f"{clause} (from memory)"


def epsilon(fy: float) -> float:
    """eps = sqrt(235 / fy), fy in MPa."""
    return math.sqrt(235.0 / fy)


def outstand_class(c_t: float, eps: float) -> int:
    """Class of an outstand flange in compression (Table 5.2, rolled/riveted outstand)."""
    for cls, lim in ((1, 9.0), (2, 10.0), (3, 14.0)):
        if c_t <= lim * eps:
            return cls
    return 4


def web_limits(eps: float, alpha: float, psi: float) -> tuple[float, float, float]:
    """c/t limits of classes 1, 2, 3 of an internal part in bending and compression."""
    alpha = min(max(alpha, 1e-6), 1.0)
    if alpha > 0.5:
        l1, l2 = 396.0 * eps / (13.0 * alpha - 1.0), 456.0 * eps / (13.0 * alpha - 1.0)
    else:
        l1, l2 = 36.0 * eps / alpha, 41.5 * eps / alpha
    if psi > -1.0:
        l3 = 42.0 * eps / (0.67 + 0.33 * psi)
    else:
        l3 = 62.0 * eps * (1.0 - psi) * math.sqrt(-psi)
    return l1, l2, l3


def web_class(c_t: float, eps: float, alpha: float, psi: float) -> int:
    """Class of the web (internal part in bending and compression, Table 5.2)."""
    for cls, lim in zip((1, 2, 3), web_limits(eps, alpha, psi), strict=True):
        if c_t <= lim:
            return cls
    return 4


def k_sigma_internal(psi: float) -> float:
    """Buckling factor of an internal element, EN 1993-1-5 Table 4.1.

    Raises:
        InputError: psi outside (-3, 1].
    """
    if not -3.0 < psi <= 1.0 + 1e-12:
        raise InputError(f"stress ratio psi = {psi:.4g} is outside (-3, 1] (Table 4.1)")
    if psi >= 1.0:
        return 4.0
    if psi > 0.0:
        return 8.2 / (1.05 + psi)
    if psi > -1.0:
        return 7.81 - 6.29 * psi + 9.78 * psi**2
    if psi == -1.0:
        return 23.9
    return 5.98 * (1.0 - psi) ** 2


def rho_internal(lambda_p: float, psi: float) -> float:
    """Reduction factor of an internal compression element (EN 1993-1-5 4.4(2))."""
    if lambda_p <= 0.5 + math.sqrt(max(0.085 - 0.055 * psi, 0.0)):
        return 1.0
    return min((lambda_p - 0.055 * (3.0 + psi)) / lambda_p**2, 1.0)


def rho_outstand(lambda_p: float) -> float:
    """Reduction factor of an outstand compression element (EN 1993-1-5 4.4(2))."""
    if lambda_p <= 0.748:
        return 1.0
    return min((lambda_p - 0.188) / lambda_p**2, 1.0)


def lambda_p(c_t: float, eps: float, k_sigma: float) -> float:
    """Plate slenderness (c/t) / (28.4 eps sqrt(k_sigma)) (EN 1993-1-5 4.4(2))."""
    return c_t / (28.4 * eps * math.sqrt(k_sigma))


@dataclass(frozen=True)
class WebZone:
    """The ineffective zone of a web in bending (heights in mm), with its working."""

    rho: float
    k_sigma: float
    lambda_p: float
    b_eff: float
    lo: float
    hi: float

    @property
    def height(self) -> float:
        return max(self.hi - self.lo, 0.0)


def web_ineffective_zone(
    *, y_top: float, y_bot: float, y_na: float, t: float, eps: float
) -> WebZone:
    """Ineffective zone of the compressed part of a web between heights ``y_bot`` and
    ``y_top`` (mm), compressed at the top, with the elastic neutral axis at ``y_na`` (Table 4.1).

    Raises:
        InputError: the web is not compressed at its top edge or psi is outside (-3, 1].
    """
    c = y_top - y_bot
    if not (c > 0.0 and t > 0.0):
        raise InputError(f"web depth c = {c:g} mm and thickness t = {t:g} mm must be positive")
    s1 = y_top - y_na  # compression at the top edge (> 0)
    if s1 <= 0.0:
        raise InputError("the web is not compressed at its top edge (neutral axis above it)")
    psi = (y_bot - y_na) / s1
    k = k_sigma_internal(psi)
    lam = lambda_p(c / t, eps, k)
    rho = rho_internal(lam, psi)
    if psi < 0.0:
        bc = c / (1.0 - psi)
        beff = rho * bc
        be1, be2 = 0.4 * beff, 0.6 * beff
        lo, hi = y_na + be2, y_top - be1
    else:
        beff = rho * c
        be1 = 2.0 * beff / (5.0 - psi)
        be2 = beff - be1
        lo, hi = y_bot + be2, y_top - be1
    return WebZone(rho, k, lam, beff, lo, max(hi, lo))


def bending_resistance(
    *,
    section_class: int,
    W_pl: float,
    W_el_min: float,
    W_eff_min: float | None,
    fy: Number,
    gamma_M0: float,
    working: tuple[CheckValue, ...] = (),
    notes: tuple[str, ...] = (),
    where: str = "",
) -> CapacityResult:
    """Mc,Rd of EN 1993-1-1 6.2.5 for the section class (1 to 4), as a CapacityResult with
    phi = 1 / gamma_M0.

    Raises:
        InputError: an unknown class, a class 4 section without W_eff_min, a value out of range.
    """
    fy = stress(fy, "fy", where=where)
    gM0 = internal(gamma_M0, "dimensionless", "gamma_M0", where=where, low=0.5, high=2.0)
    if section_class not in (1, 2, 3, 4):
        raise InputError(f"section class {section_class!r} is not 1 to 4", where=where)
    if section_class <= 2:
        W, name, what = W_pl, "Wpl", "plastic section modulus (class 1 or 2)"
    elif section_class == 3:
        W, name, what = W_el_min, "Wel,min", "least elastic section modulus (class 3)"
    else:
        if W_eff_min is None:
            raise InputError("a class 4 section needs its effective modulus Weff,min", where=where)
        W, name, what = W_eff_min, "Weff,min", "least effective section modulus (class 4)"
    src = _src("EN 1993-1-1 6.2.5")
    vals = (
        *working,
        CheckValue("fy", fy, "stress", "yield strength", ENGINEER),
        CheckValue(
            "class",
            section_class,
            "dimensionless",
            "cross-section class",
            _src("EN 1993-1-1 5.5, Table 5.2"),
        ),
        CheckValue(name, W, "section_modulus", what, src),
        CheckValue("gamma_M0", gM0, "dimensionless", "partial factor", "EN 1993-2 Table 6.1"),
    )
    return CapacityResult(
        limit_state="bending resistance",
        standard=STANDARD,
        edition=EDITION,
        clause=f"EN 1993-1-1 6.2.5, Eq. 6.13-6.15, class {section_class}"
        + (" with EN 1993-1-5 4.4 effective widths" if section_class == 4 else "")
        + " (from memory)",
        Rn=W * fy,
        phi=1.0 / gM0,
        kind="moment",
        values=vals,
        notes=notes,
    )


def tension_flange_holes(
    *,
    Af_net: Number,
    Af: Number,
    fy: Number,
    fu: Number,
    W_t: Number,
    gamma_M0: float,
    gamma_M2: float,
    where: str = "",
) -> CapacityResult:
    """Bending resistance limited by the holes of the tension flange (6.2.5(4), Eq. 6.16)
    as a moment of the tension fibre: W_t min(fy / gamma_M0, 0.9 (Af,net / Af) fu / gamma_M2).
    The returned phi is 1 (the partial factors are inside Rn).

    Raises:
        InputError: values out of range or Af,net > Af.
    """
    ratio = net_area_ratio(Af_net, Af, where=where)
    fy = stress(fy, "fy", where=where)
    fu = stress(fu, "fu", where=where)
    Wt = internal(W_t, "section_modulus", "W_t", where=where, low=0.0, high=1e12)
    gM0 = internal(gamma_M0, "dimensionless", "gamma_M0", where=where, low=0.5, high=2.0)
    gM2 = internal(gamma_M2, "dimensionless", "gamma_M2", where=where, low=0.5, high=2.0)
    net = 0.9 * ratio * fu / gM2
    ok = net >= fy / gM0
    src = _src("EN 1993-1-1 6.2.5(4), Eq. 6.16")
    vals = (
        CheckValue("Af,net/Af", ratio, "dimensionless", "net to gross tension flange area", src),
        CheckValue("0.9 (Af,net/Af) fu/gamma_M2", net, "stress", "net section limit", src),
        CheckValue("fy/gamma_M0", fy / gM0, "stress", "yield limit", src),
        CheckValue("W_t", Wt, "section_modulus", "elastic modulus, tension fibre", ENGINEER),
        CheckValue("gamma_M2", gM2, "dimensionless", "partial factor", "EN 1993-2 Table 6.1"),
    )
    return CapacityResult(
        limit_state="tension flange at holes",
        standard=STANDARD,
        edition=EDITION,
        clause="EN 1993-1-1 6.2.5(4), Eq. 6.16 (from memory)",
        Rn=Wt * min(net, fy / gM0),
        phi=1.0,
        kind="moment",
        values=vals,
        notes=(
            "Eq. 6.16 met: the holes may be ignored"
            if ok
            else "Eq. 6.16 not met: the gross-area stress of the tension flange is limited to "
            "0.9 (Af,net/Af) fu / gamma_M2 (asfound's reading of the reduced flange area)",
        ),
    )
