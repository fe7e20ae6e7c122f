"""Lateral-torsional buckling of a discretely braced compression flange: AASHTO LRFD Bridge
Design Specifications 6.10.8.2.3, with the moment gradient factor Cb.

Edition followed: 9th ed. (2020); equation numbers as recalled (from memory):

- Lp = 1.0 rt sqrt(E/Fyc) (6.10.8.2.3-4); Lr = pi rt sqrt(E/Fyr) (6.10.8.2.3-5)
- Lb <= Lp: Fnc = Rb Rh Fyc (6.10.8.2.3-1)
- Lp < Lb <= Lr: Fnc = Cb [1 - (1 - Fyr/(Rh Fyc)) (Lb - Lp)/(Lr - Lp)] Rb Rh Fyc
  <= Rb Rh Fyc (6.10.8.2.3-2)
- Lb > Lr: Fnc = Fcr = Cb Rb pi² E / (Lb/rt)² <= Rb Rh Fyc (6.10.8.2.3-3, -8)
- Cb = 1.0 where fmid/f2 > 1 or f2 = 0 (6.10.8.2.3-6); otherwise
  Cb = 1.75 - 1.05 (f1/f2) + 0.3 (f1/f2)² <= 2.3 (6.10.8.2.3-7), with f2 the largest
  compressive stress in the flange at either brace point, fmid the stress at mid-length,
  f0 the stress at the other brace point and f1 = 2 fmid - f2 >= f0 (6.10.8.2.3-11).
  The exception that takes f1 = f0 for a concave moment diagram (6.10.8.2.3-10) can only
  raise Cb, so it is not used (conservative).
- rt: 6.10.8.2.3-9 for a plate flange; for a riveted flange the radius of gyration of the
  flange plus one third of the web depth in compression (C6.10.8.2.3; see
  :mod:`core.checks.compression_zone`).
- Mn = Fnc Sxc (noncomposite section); phi_f = 1.00 (6.5.4.2).

For a through girder whose compression flange is held only by U-frames, the unbraced length
is the effective length of the flange as a column on elastic supports (the method AASHTO
LRFD 6.14.2.9 prescribes for the top chords of half-through trusses; from memory), from
:mod:`core.checks.elastic_support`; Cb = 1 then.
"""

from __future__ import annotations

import math
from collections.abc import Sequence

from core.checks._inputs import Number, internal, length, modulus
from core.checks.aashto_flange import PHI_F, flange_inputs
from core.checks.elastic_support import critical_load
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.checks.sources import AASHTO_LRFD, factor, member_length
from core.errors import InputError

CB_MAX = 2.3


def _ref(clause: str) -> str:
    return AASHTO_LRFD.ref(clause)


def _f(x: Number, name: str, where: str) -> float:
    return internal(x, "stress", name, where=where, low=-1e6, high=1e6)


def moment_gradient_Cb(
    f_a: Number, f_mid: Number, f_b: Number, *, where: str = ""
) -> tuple[float, tuple[CheckValue, ...]]:
    """Cb of 6.10.8.2.3-6/-7 from the flange stresses at the two brace points and mid-length.

    Args:
        f_a, f_b: stresses in the flange considered at the brace points, MPa, compression
            positive (for a prismatic segment, moments with the same sign rule will do).
        f_mid: stress at the middle of the unbraced length, MPa, compression positive.
        where: place for messages.

    Returns:
        ``(Cb, working)``.

    Raises:
        InputError: a value that is not a finite stress.
    """
    a, m, b = _f(f_a, "f_a", where), _f(f_mid, "f_mid", where), _f(f_b, "f_b", where)
    f2, f0 = (a, b) if a >= b else (b, a)
    src = _ref("6.10.8.2.3")
    if f2 <= 0.0:
        vals = (CheckValue("f2", 0.0, "stress", "no compression at either brace point", src),)
        return 1.0, (*vals, CheckValue("Cb", 1.0, "dimensionless", "f2 = 0", _ref("6.10.8.2.3-6")))
    f1 = max(2.0 * m - f2, f0)
    vals = (
        CheckValue("f2", f2, "stress", "largest compressive stress at a brace point", src),
        CheckValue("fmid", m, "stress", "stress at mid-length", src),
        CheckValue("f0", f0, "stress", "stress at the other brace point", src),
        CheckValue("f1", f1, "stress", "2 fmid - f2, not less than f0", _ref("6.10.8.2.3-11")),
    )
    if m / f2 > 1.0:
        return 1.0, (
            *vals,
            CheckValue("Cb", 1.0, "dimensionless", "fmid/f2 > 1", _ref("6.10.8.2.3-6")),
        )
    r = f1 / f2
    Cb = min(1.75 - 1.05 * r + 0.3 * r * r, CB_MAX)
    return Cb, (
        *vals,
        CheckValue(
            "Cb", Cb, "dimensionless", "moment gradient modifier (<= 2.3)", _ref("6.10.8.2.3-7")
        ),
    )


def lateral_torsional_buckling(
    *,
    Fyc: Number,
    Fyw: Number,
    E: Number,
    rt: Number,
    Lb: Number,
    Sxc: Number,
    Cb: float = 1.0,
    Rb: float = 1.0,
    Rh: float = 1.0,
    Fyt: Number | None = None,
    Sxt: Number | None = None,
    phi_f: float = PHI_F,
    where: str = "",
) -> CapacityResult:
    """Lateral-torsional buckling resistance Mn = Fnc Sxc (6.10.8.2.3), a moment result.

    Args:
        Fyc: compression flange yield strength, MPa. Fyw: web yield strength, MPa.
        E: modulus, MPa. rt: effective radius of gyration for LTB, mm.
        Lb: unbraced length, mm. Sxc: elastic modulus to the compression flange, mm³.
        Cb: moment gradient modifier (:func:`moment_gradient_Cb`), 1.0 to 2.3.
        Rb: web load-shedding factor. Rh: hybrid factor (1).
        Fyt, Sxt: tension flange yield strength (MPa) and modulus (mm³), for Fyr.
        phi_f: default :data:`~core.checks.aashto_flange.PHI_F`. where: place for messages.

    Raises:
        InputError: values out of range (Cb outside 1.0 to 2.3).
    """
    Fyc, Fyw, E, Rb, Rh, Sxc, Fyr = flange_inputs(Fyc, Fyw, E, Rb, Rh, Fyt, Sxc, Sxt, where)
    rt = length(rt, "rt", where=where)
    Lb = internal(Lb, "length", "Lb", where=where, low=0.0, high=1e6, low_inclusive=True)
    Cb = internal(Cb, "dimensionless", "Cb", where=where, low=1.0, high=CB_MAX, low_inclusive=True)
    ph = factor(phi_f, "phi_f", high=1.0, where=where)
    Lp = rt * math.sqrt(E / Fyc)
    Lr = math.pi * rt * math.sqrt(E / Fyr)
    if Lr <= Lp:
        raise InputError(f"Lr = {Lr:g} mm is not above Lp = {Lp:g} mm (check Fyr)", where=where)
    cap = Rb * Rh * Fyc
    notes: list[str] = []
    if Lb <= Lp:
        Fnc, eq = cap, "6.10.8.2.3-1"
        notes.append("Lb <= Lp: the flange reaches its yield plateau")
    elif Lb <= Lr:
        raw = Cb * (1.0 - (1.0 - Fyr / (Rh * Fyc)) * (Lb - Lp) / (Lr - Lp)) * cap
        Fnc, eq = min(raw, cap), "6.10.8.2.3-2"
        notes.append("Lp < Lb <= Lr: inelastic lateral-torsional buckling")
        if raw > cap:
            notes.append(f"Cb = {Cb:.3g} lifts Fnc to the cap Rb Rh Fyc")
    else:
        Fcr = Cb * Rb * math.pi**2 * E / (Lb / rt) ** 2
        Fnc, eq = min(Fcr, cap), "6.10.8.2.3-3"
        notes.append("Lb > Lr: elastic lateral-torsional buckling (Fcr, 6.10.8.2.3-8)")
        if Fcr > cap:
            notes.append(f"Cb = {Cb:.3g} lifts Fcr to the cap Rb Rh Fyc")
    vals = [
        CheckValue("Fyc", Fyc, "stress", "compression flange yield strength", ENGINEER),
        CheckValue("Fyr", Fyr, "stress", "stress at onset of yielding", _ref("6.10.8.2.2")),
        CheckValue(
            "rt", rt, "length", "effective radius of gyration for LTB", _ref("6.10.8.2.3-9")
        ),
        CheckValue("Lb", Lb, "length", "unbraced length", ENGINEER),
        CheckValue("Lp", Lp, "length", "limiting length, yield plateau", _ref("6.10.8.2.3-4")),
        CheckValue("Lr", Lr, "length", "limiting length, inelastic buckling", _ref("6.10.8.2.3-5")),
        CheckValue("Cb", Cb, "dimensionless", "moment gradient modifier", _ref("6.10.8.2.3-7")),
        CheckValue("Rb", Rb, "dimensionless", "web load-shedding factor", _ref("6.10.1.10.2")),
        CheckValue("Fnc", Fnc, "stress", "nominal flexural resistance of the flange", _ref(eq)),
        CheckValue(
            "Sxc",
            Sxc,
            "section_modulus",
            "elastic modulus to the compression flange",
            "section engine",
        ),
    ]
    return AASHTO_LRFD.result(
        "lateral-torsional buckling", f"6.10.8.2.3, Eq. {eq}", Fnc * Sxc, ph, "moment", vals, notes
    )


def u_frame_unbraced_length(
    *,
    E: Number,
    I_chord: Number,
    span: Number,
    frames: Sequence[tuple[float, float]],
    where: str = "",
) -> tuple[float, tuple[CheckValue, ...]]:
    """Unbraced length of a compression flange held by U-frames: the effective length
    Le = pi sqrt(E I / Ncr) of the flange (with one third of the web in compression) as a
    column on elastic lateral supports, pinned at the bearings (the method of AASHTO LRFD
    6.14.2.9 for half-through truss chords, applied to the through girder; from memory).
    Use it as Lb with Cb = 1.0.

    Args:
        E: modulus, MPa. I_chord: lateral moment of inertia of the flange plus one third
            of the web in compression, mm⁴ (``CompressionFlange.Iy_rt``).
        span: length between bearings, mm.
        frames: ``(position from a bearing, mm; U-frame stiffness Cd, N/mm)`` per frame.
        where: place for messages.

    Returns:
        ``(Lb, working)``.

    Raises:
        InputError: values out of range or a frame outside the span.
    """
    E = modulus(E, where=where)
    I = internal(I_chord, "inertia", "I_chord", where=where, low=0.0, high=1e15)
    col = critical_load(
        EI=E * I, L=member_length(span, "span", where=where), springs=frames, where=where
    )
    src = _ref("6.14.2.9 (by analogy: compression chord on elastic lateral supports)")
    return col.Le, col.values(src)
