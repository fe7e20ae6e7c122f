"""Lateral-torsional buckling: EN 1993-1-1:2005 6.3.2 (general case, 6.3.2.2), with the
elastic critical moment Mcr of a singly symmetric I-section.

EN 1993-1-1 does not print Mcr. The formula used is the three-factor formula of the
prestandard ENV 1993-1-1:1992 Annex F, Eq. F.2 (as recalled; from memory), which the NCCI
documents for EN 1993-1-1 repeat:

    Mcr = C1 pi² E Iz / (k L)² { sqrt[ (k/kw)² Iw/Iz + (k L)² G It / (pi² E Iz)
                                       + (C2 zg - C3 zj)² ] - (C2 zg - C3 zj) }

with zj = beta_x / 2 (positive when the larger flange is in compression; see
:mod:`core.checks.thinwalled`), zg the height of the load above the shear centre (positive
when above, i.e. destabilising for a top-flange load in sagging), k and kw the effective
length factors for lateral bending and warping (1.0: free to rotate and warp at the brace
points, the conservative default). C1 = 1, C3 = 1 are exact for a uniform moment; for a
linear moment with end moment ratio psi, C1 = 1.88 - 1.40 psi + 0.52 psi² <= 2.70 (ENV
Annex F approximation, from memory). For a doubly symmetric section under uniform moment the
formula reduces to the closed form Mcr = (pi²EIz/L²) sqrt(Iw/Iz + L² G It/(pi² E Iz))
(Timoshenko and Gere, 2nd ed., Art. 6.2; from memory).

Resistance (6.3.2.1, 6.3.2.2; from memory): lambda_LT = sqrt(Wy fy / Mcr) (6.56);
chi_LT from 6.3.2.2 Eq. 6.56 with alpha_LT of Table 6.3 for the curve of Table 6.4: welded
I-sections h/b <= 2: c, h/b > 2: d; other cross-sections (here: riveted built-up): d.
Mb,Rd = chi_LT Wy fy / gamma_M1 (6.55), Wy = Wpl,y (class 1, 2), Wel,y (class 3),
Weff,y (class 4): the caller gives the one that applies. gamma_M1 = 1.10 (EN 1993-2).
"""

from __future__ import annotations

import math

from core.checks._inputs import Number, internal, modulus, stress
from core.checks.en1993_buckling import E_STEEL, G_STEEL, GAMMA_M1, GAMMA_SOURCE, alpha_of, chi
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.checks.sources import EN_1993_1_1, ENV_1993_1_1, factor, member_length
from core.errors import InputError

#: LTB curve of a riveted built-up I-section: "other cross-sections", Table 6.4 (from memory)
CURVE_RIVETED = "d"
C1_MAX = 2.70


def _ref(clause: str) -> str:
    return EN_1993_1_1.ref(clause)


def C1_linear(psi: float) -> float:
    """C1 = 1.88 - 1.40 psi + 0.52 psi² <= 2.70 for a linear moment diagram with end moment
    ratio psi in [-1, 1] (ENV 1993-1-1 Annex F approximation; from memory).

    Raises:
        InputError: psi outside [-1, 1].
    """
    p = internal(psi, "dimensionless", "psi", low=-1.0, high=1.0, low_inclusive=True)
    return min(1.88 - 1.40 * p + 0.52 * p * p, C1_MAX)


def elastic_critical_moment(
    *,
    Iz: Number,
    It: Number,
    Iw: Number,
    L: Number,
    zj: Number = 0.0,
    E: Number = E_STEEL,
    G: Number = G_STEEL,
    C1: float = 1.0,
    C2: float = 0.0,
    C3: float = 1.0,
    zg: Number = 0.0,
    k: float = 1.0,
    kw: float = 1.0,
    where: str = "",
) -> tuple[float, tuple[CheckValue, ...]]:
    """Mcr (N mm) of a singly symmetric I-section by the formula of the module docstring.

    Args:
        Iz: minor axis moment of inertia, mm⁴. It: torsion constant, mm⁴.
        Iw: warping constant, mm⁶. L: length between lateral restraints, mm.
        zj: monosymmetry distance beta_x / 2, mm. E, G: moduli, MPa.
        C1, C2, C3: moment diagram and load level factors. zg: load height above the
        shear centre, mm. k, kw: effective length factors (0.5 to 1.0).
        where: place for messages.

    Returns:
        ``(Mcr, working)``.

    Raises:
        InputError: values out of range.
    """
    Iz = internal(Iz, "inertia", "Iz", where=where, low=0.0, high=1e15)
    It = internal(It, "inertia", "It", where=where, low=0.0, high=1e15, low_inclusive=True)
    Iw = internal(Iw, "warping_constant", "Iw", where=where, low=0.0, high=1e25, low_inclusive=True)
    L = member_length(L, "L", where=where)
    zj = internal(zj, "length", "zj", where=where, low=-1e5, high=1e5)
    zg = internal(zg, "length", "zg", where=where, low=-1e5, high=1e5)
    E = modulus(E, where=where)
    G = internal(G, "stress", "G", where=where, low=50_000.0, high=100_000.0)
    C1 = internal(C1, "dimensionless", "C1", where=where, low=0.5, high=C1_MAX)
    C2 = internal(C2, "dimensionless", "C2", where=where, low=-1.0, high=2.0, low_inclusive=True)
    C3 = internal(C3, "dimensionless", "C3", where=where, low=-2.0, high=3.0)
    k = internal(k, "dimensionless", "k", where=where, low=0.5, high=1.0, low_inclusive=True)
    kw = internal(kw, "dimensionless", "kw", where=where, low=0.5, high=1.0, low_inclusive=True)
    if It == 0.0 and Iw == 0.0:
        raise InputError("It and Iw cannot both be zero (no torsional stiffness)", where=where)
    kL = k * L
    euler = math.pi**2 * E * Iz / kL**2
    b = C2 * zg - C3 * zj
    root = math.sqrt((k / kw) ** 2 * Iw / Iz + kL**2 * G * It / (math.pi**2 * E * Iz) + b * b)
    Mcr = C1 * euler * (root - b)
    src = ENV_1993_1_1.ref("Annex F, Eq. F.2")
    vals = (
        CheckValue("Iz", Iz, "inertia", "minor axis moment of inertia", "section engine"),
        CheckValue("It", It, "inertia", "torsion constant", "section engine"),
        CheckValue("Iw", Iw, "warping_constant", "warping constant", "section engine"),
        CheckValue("L", L, "length", "length between lateral restraints", ENGINEER),
        CheckValue("zj", zj, "length", "monosymmetry term beta_x / 2", src),
        CheckValue("zg", zg, "length", "load height above the shear centre", ENGINEER),
        CheckValue("C1", C1, "dimensionless", "moment diagram factor", src),
        CheckValue("C2", C2, "dimensionless", "load height factor", src),
        CheckValue("C3", C3, "dimensionless", "monosymmetry factor", src),
        CheckValue("k", k, "dimensionless", "lateral bending length factor", src),
        CheckValue("kw", kw, "dimensionless", "warping length factor", src),
        CheckValue("Mcr", Mcr, "moment", "elastic critical moment", src),
    )
    return Mcr, vals


def buckling_resistance(
    *,
    Wy: Number,
    fy: Number,
    Mcr: Number,
    curve: str = CURVE_RIVETED,
    gamma_M1: float = GAMMA_M1,
    mcr_values: tuple[CheckValue, ...] = (),
    where: str = "",
) -> CapacityResult:
    """Design buckling resistance moment Mb,Rd = chi_LT Wy fy / gamma_M1 (6.3.2.1, 6.3.2.2).

    Args:
        Wy: section modulus for the class (Wpl, Wel or Weff to the compression fibre), mm³.
        fy: yield strength, MPa. Mcr: elastic critical moment, N mm
            (:func:`elastic_critical_moment`, or the U-frame chord of
            :mod:`core.checks.en1993_uframe`).
        curve: LTB curve ``"a"`` to ``"d"`` (Table 6.4; default d for riveted sections).
        gamma_M1: default 1.10 (EN 1993-2 Table 6.1). mcr_values: the working of Mcr, to
            print with the result. where: place for messages.

    Raises:
        InputError: values out of range or an unknown curve.
    """
    Wy = internal(Wy, "section_modulus", "Wy", where=where, low=0.0, high=1e12)
    fy = stress(fy, "fy", where=where)
    Mcr = internal(Mcr, "moment", "Mcr", where=where, low=0.0, high=1e16)
    gM1 = factor(gamma_M1, "gamma_M1", low=0.5, where=where)
    alpha = alpha_of(curve, where=where)
    lam = math.sqrt(Wy * fy / Mcr)
    x, phi = chi(lam, alpha)
    vals = (
        *mcr_values,
        CheckValue(
            "Wy", Wy, "section_modulus", "section modulus for the cross-section class", ENGINEER
        ),
        CheckValue("fy", fy, "stress", "yield strength", ENGINEER),
        CheckValue("lambda_LT", lam, "dimensionless", "sqrt(Wy fy / Mcr)", _ref("6.3.2.2(1)")),
        CheckValue(
            "alpha_LT",
            alpha,
            "dimensionless",
            f"imperfection factor, curve {curve}",
            _ref("Table 6.3, Table 6.4"),
        ),
        CheckValue(
            "Phi_LT",
            phi,
            "dimensionless",
            "0.5 [1 + alpha_LT (lambda_LT - 0.2) + lambda_LT²]",
            _ref("6.3.2.2(1)"),
        ),
        CheckValue("chi_LT", x, "dimensionless", "reduction factor", _ref("6.3.2.2(1), Eq. 6.56")),
        CheckValue(
            "gamma_M1",
            gM1,
            "dimensionless",
            "partial factor",
            GAMMA_SOURCE if gM1 == GAMMA_M1 else ENGINEER,
        ),
    )
    notes = [
        f"buckling curve {curve} (Table 6.4"
        + (": other cross-sections, riveted built-up)" if curve == CURVE_RIVETED else ")")
    ]
    if lam <= 0.2:
        notes.append("lambda_LT <= 0.2: no reduction for lateral-torsional buckling (6.3.2.2(4))")
    return EN_1993_1_1.result(
        "lateral-torsional buckling",
        "6.3.2.1 and 6.3.2.2, Eq. 6.55 and 6.56",
        x * Wy * fy,
        1.0 / gM1,
        "moment",
        vals,
        notes,
    )
