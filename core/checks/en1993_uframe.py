"""Lateral-torsional buckling of a U-frame girder's compression chord: EN 1993-2:2006 6.3.4.2,
with the chord as a column on elastic supports (Annex D.2.4) and chi_LT of EN 1993-1-1 6.3.2.2.

As recalled (from memory):

- 6.3.4.2(1): the lateral buckling of the compression chord of a half-through (U-frame)
  girder may be checked by taking the chord as a column on elastic lateral supports at the
  U-frames; the chord is the compression flange plus one third of the compressed web.
- the slenderness lambda_LT = sqrt(A_chord fy / Ncrit), Ncrit the chord's elastic critical
  force on its supports (Annex D.2.4 gives it for regular frames; here it is found exactly,
  for the actual frame positions and stiffnesses, by :func:`core.checks.elastic_support.critical_load`),
  and chi_LT from EN 1993-1-1 6.3.2.2 (curve d for a riveted section, "other
  cross-sections" of Table 6.4).
- Mb,Rd = chi_LT Wy fy / gamma_M1, gamma_M1 = 1.10 (EN 1993-2 Table 6.1).
- U-frame stiffness Cd from :func:`core.checks.elastic_support.u_frame_stiffness` (the
  expression of Annex D.2.4, or entered by the engineer).

The chord's ends are taken as held laterally at the bearings (end frames much stiffer than
the intermediate ones, as D.2.4 asks); the report states it.
"""

from __future__ import annotations

import math
from collections.abc import Sequence

from core.checks._inputs import Number, internal, modulus, stress
from core.checks.elastic_support import SpringColumn, critical_load
from core.checks.en1993_buckling import E_STEEL, GAMMA_M1, GAMMA_SOURCE, alpha_of, chi
from core.checks.en1993_ltb import CURVE_RIVETED
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.checks.sources import EN_1993_1_1, EN_1993_2, factor, member_length


def compression_chord(
    *,
    A_chord: Number,
    I_chord: Number,
    fy: Number,
    Wy: Number,
    span: Number,
    frames: Sequence[tuple[float, float]],
    E: Number = E_STEEL,
    curve: str = CURVE_RIVETED,
    gamma_M1: float = GAMMA_M1,
    column: SpringColumn | None = None,
    where: str = "",
) -> CapacityResult:
    """Buckling resistance moment of a U-frame girder from its compression chord (6.3.4.2).

    Args:
        A_chord: area of the chord (compression flange plus one third of the compressed
            web), mm². I_chord: its moment of inertia for lateral bending, mm⁴.
        fy: yield strength, MPa. Wy: the girder's section modulus for its class, mm³.
        span: length between the bearings (chord held laterally there), mm.
        frames: ``(position, Cd)`` of each intermediate U-frame: mm from one bearing, N/mm.
        E: modulus, MPa. curve: LTB curve (default d). gamma_M1: default 1.10.
        column: the chord's critical force on these frames when already found (the same
            chord and frames: a member's stations share it); None: found here.
        where: place for messages.

    Raises:
        InputError: values out of range or a frame outside the span.
    """
    A = internal(A_chord, "area", "A_chord", where=where, low=0.0, high=1e9)
    I = internal(I_chord, "inertia", "I_chord", where=where, low=0.0, high=1e15)
    fy = stress(fy, "fy", where=where)
    Wy = internal(Wy, "section_modulus", "Wy", where=where, low=0.0, high=1e12)
    L = member_length(span, "span", where=where)
    E_ = modulus(E, where=where)
    gM1 = factor(gamma_M1, "gamma_M1", low=0.5, where=where)
    col = column or critical_load(EI=E_ * I, L=L, springs=frames, where=where)
    lam = math.sqrt(A * fy / col.Ncr)
    alpha = alpha_of(curve, where=where)
    x, phi = chi(lam, alpha)
    src = EN_1993_2.ref("6.3.4.2 and Annex D.2.4")
    vals = [
        CheckValue(
            "A_chord",
            A,
            "area",
            "compression flange plus 1/3 of the compressed web",
            "section engine",
        ),
        CheckValue("I_chord", I, "inertia", "chord inertia for lateral bending", "section engine"),
        CheckValue("span", L, "length", "chord length between bearings (held laterally)", ENGINEER),
        CheckValue("n_frames", len(frames), "dimensionless", "intermediate U-frames", ENGINEER),
    ]
    if frames:
        cds = [float(c) for _, c in frames]
        vals.append(
            CheckValue("Cd,min", min(cds), "force_per_length", "least U-frame stiffness", ENGINEER)
        )
    vals += list(col.values(src))
    vals += [
        CheckValue("lambda_LT", lam, "dimensionless", "sqrt(A_chord fy / Ncrit)", src),
        CheckValue(
            "alpha_LT",
            alpha,
            "dimensionless",
            f"imperfection factor, curve {curve}",
            EN_1993_1_1.ref("Table 6.3, 6.4"),
        ),
        CheckValue(
            "Phi_LT",
            phi,
            "dimensionless",
            "0.5 [1 + alpha_LT (lambda_LT - 0.2) + lambda_LT²]",
            EN_1993_1_1.ref("6.3.2.2"),
        ),
        CheckValue(
            "chi_LT", x, "dimensionless", "reduction factor", EN_1993_1_1.ref("6.3.2.2, Eq. 6.56")
        ),
        CheckValue("Wy", Wy, "section_modulus", "section modulus for the class", ENGINEER),
        CheckValue(
            "gamma_M1",
            gM1,
            "dimensionless",
            "partial factor",
            GAMMA_SOURCE if gM1 == GAMMA_M1 else ENGINEER,
        ),
    ]
    notes = [
        "chord held laterally at the bearings (end frames stiffer than the intermediate ones)",
        f"Ncrit by finite elements on the {len(frames)} frames as placed",
    ]
    return EN_1993_2.result(
        "lateral-torsional buckling (U-frame chord)",
        "6.3.4.2 with EN 1993-1-1 6.3.2.2",
        x * Wy * fy,
        1.0 / gM1,
        "moment",
        vals,
        notes,
    )
