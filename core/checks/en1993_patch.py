"""Resistance of the web to transverse forces (a bearing or patch load): EN 1993-1-5:2006
Section 6, on the measured web thickness.

Equations as recalled (from memory):

- 6.2(1), Eq. 6.1: F_Rd = fyw L_eff tw / gamma_M1
- 6.2(2), Eq. 6.2: L_eff = chi_F l_y
- 6.4(1), Figure 6.1: kF = 6 + 2 (hw/a)² (type a: load through one flange, resisted by shear
  in the web on both sides); 3.5 + 2 (hw/a)² (type b: load through one flange and passed
  through the web to the other flange, directly resisted there); 2 + 6 (ss + c)/hw <= 6
  (type c: load through one flange near an unstiffened end, resisted by shear)
- Eq. 6.5: Fcr = 0.9 kF E tw³ / hw
- Eq. 6.4: lambda_F = sqrt(l_y tw fyw / Fcr); Eq. 6.3: chi_F = 0.5 / lambda_F <= 1.0
- Eq. 6.8: m1 = fyf bf / (fyw tw); Eq. 6.9: m2 = 0.02 (hw/tf)² if lambda_F > 0.5, else 0
- Eq. 6.10 (types a, b): l_y = ss + 2 tf (1 + sqrt(m1 + m2)) <= a
- type c: l_y the smaller of Eq. 6.11 le + tf sqrt(m1/2 + (le/tf)² + m2) and Eq. 6.12
  le + tf sqrt(m1 + m2), with Eq. 6.13 le = kF E tw² / (2 fyw hw) <= ss + c
- 6.3(1): ss, the length of stiff bearing (the load spread at 1:1 through solid steel), is not
  taken larger than hw; c is the distance from the end of the stiff bearing to the girder end.
- gamma_M1 = 1.10 (EN 1993-2 Table 6.1, recommended value).

m2 depends on lambda_F, which depends on l_y: l_y is found with m2 first, and again with
m2 = 0 when lambda_F comes out at 0.5 or less (the clause's own order). That rule has a step
at lambda_F = 0.5: a web just slender enough to take m2 shows up to half as much resistance
again as a slightly thicker one (a known shortcoming of the 2006 text), so a corroded web
could rate above its as-built state. By default (``m2_rule="zero"``) m2 is therefore taken
as 0 throughout: never above the clause's value, continuous, and monotonic in tw
(conservative; common practice, no source). ``m2_rule="clause"`` follows the text; both
values are reported. The revision of
EN 1993-1-5 under way changes chi_F; the 2006 text is followed. For a riveted flange, bf and
tf (and fyf) are the caller's stated choice (e.g. the horizontal angle legs and cover plates).
"""

from __future__ import annotations

import math
from typing import Literal

from core.checks._inputs import Number, internal, length, modulus, stress
from core.checks.en1993_buckling import E_STEEL, GAMMA_M1, GAMMA_SOURCE
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.checks.sources import EN_1993_1_5, choice, factor

LoadType = Literal["a", "b", "c"]


def _ref(clause: str) -> str:
    return EN_1993_1_5.ref(clause)


def k_F(load_type: str, hw: float, a: float | None, ss: float, c: float) -> float:
    """Buckling coefficient kF of Figure 6.1 (``a`` None: no transverse stiffeners, hw/a = 0)."""
    r = 0.0 if a is None else hw / a
    if load_type == "a":
        return 6.0 + 2.0 * r * r
    if load_type == "b":
        return 3.5 + 2.0 * r * r
    return min(2.0 + 6.0 * (ss + c) / hw, 6.0)


def _l_y(load_type, ss, tf, m1, m2, a, le) -> tuple[float, str]:
    if load_type in ("a", "b"):
        ly = ss + 2.0 * tf * (1.0 + math.sqrt(m1 + m2))
        if a is not None and ly > a:
            return a, "Eq. 6.10, limited to a"
        return ly, "Eq. 6.10"
    ly11 = le + tf * math.sqrt(m1 / 2.0 + (le / tf) ** 2 + m2)
    ly12 = le + tf * math.sqrt(m1 + m2)
    return (ly11, "Eq. 6.11") if ly11 <= ly12 else (ly12, "Eq. 6.12")


def transverse_force_resistance(
    *,
    fyw: Number,
    hw: Number,
    tw: Number,
    ss: Number,
    bf: Number,
    tf: Number,
    fyf: Number | None = None,
    load_type: LoadType = "c",
    a: Number | None = None,
    c: Number = 0.0,
    E: Number = E_STEEL,
    gamma_M1: float = GAMMA_M1,
    m2_rule: str = "zero",
    where: str = "",
) -> CapacityResult:
    """Design resistance of the web to a transverse force, F_Rd (EN 1993-1-5 Section 6).

    Args:
        fyw: web yield strength, MPa. hw: web depth, mm. tw: web thickness (as found), mm.
        ss: length of stiff bearing, mm (not taken above hw). bf: flange width, mm.
        tf: flange thickness, mm. fyf: flange yield strength, MPa (default fyw).
        load_type: ``"a"``, ``"b"`` or ``"c"`` of Figure 6.1 (``"c"``: a bearing near an
            unstiffened girder end).
        a: spacing of the transverse stiffeners bounding the panel, mm (``None``: none).
        c: distance from the end of the stiff bearing to the girder end, mm (type c).
        E: modulus, MPa (default 210 000). gamma_M1: default 1.10 (EN 1993-2 Table 6.1).
        m2_rule: ``"zero"`` (default, conservative: m2 = 0) or ``"clause"`` (Eq. 6.9 as
            written); see the module docstring.
        where: place for messages.

    Raises:
        InputError: values out of range or an unknown load type.
    """
    choice(load_type, ("a", "b", "c"), "load_type", where=where)
    choice(m2_rule, ("zero", "clause"), "m2_rule", where=where)
    fyw = stress(fyw, "fyw", where=where)
    hw = length(hw, "hw", where=where)
    tw = length(tw, "tw", where=where)
    ss_in = internal(ss, "length", "ss", where=where, low=0.0, high=20_000.0, low_inclusive=True)
    bf = length(bf, "bf", where=where)
    tf = length(tf, "tf", where=where)
    fyf = fyw if fyf is None else stress(fyf, "fyf", where=where)
    a_ = None if a is None else length(a, "a", where=where)
    c_ = internal(c, "length", "c", where=where, low=0.0, high=20_000.0, low_inclusive=True)
    E_ = modulus(E, where=where)
    gM1 = factor(gamma_M1, "gamma_M1", low=0.5, where=where)
    notes: list[str] = []
    ss_ = min(ss_in, hw)
    if ss_in > hw:
        notes.append(f"ss = {ss_in:g} mm taken as hw = {hw:g} mm (6.3(1))")
    kF = k_F(load_type, hw, a_, ss_, c_)
    Fcr = 0.9 * kF * E_ * tw**3 / hw
    m1 = fyf * bf / (fyw * tw)
    m2_full = 0.02 * (hw / tf) ** 2
    le = 0.0
    if load_type == "c":
        le = min(kF * E_ * tw**2 / (2.0 * fyw * hw), ss_ + c_)

    def solve(rule: str) -> tuple[float, str, float, float]:
        m2 = m2_full if rule == "clause" else 0.0
        ly, eq = _l_y(load_type, ss_, tf, m1, m2, a_, le)
        lam = math.sqrt(ly * tw * fyw / Fcr)
        if m2 and lam <= 0.5:
            m2 = 0.0
            ly, eq = _l_y(load_type, ss_, tf, m1, 0.0, a_, le)
            lam = math.sqrt(ly * tw * fyw / Fcr)
        return ly, eq, lam, m2

    ly, ly_eq, lam, m2 = solve(m2_rule)
    ly_c, _, lam_c, _ = solve("clause")
    F_clause = fyw * min(0.5 / lam_c, 1.0) * ly_c * tw
    if m2_rule == "zero":
        notes.append(
            "m2 taken as 0 (Eq. 6.9 has a step at lambda_F = 0.5 that can rate a thinner web "
            "above a thicker one; conservative, common practice, no source)"
        )
    elif m2 == 0.0:
        notes.append("lambda_F <= 0.5 with m2: l_y found again with m2 = 0 (Eq. 6.9)")
    chi_F = min(0.5 / lam, 1.0)
    L_eff = chi_F * ly
    F = fyw * L_eff * tw
    kf_eq = {"a": "Figure 6.1 (a)", "b": "Figure 6.1 (b)", "c": "Figure 6.1 (c)"}[load_type]
    vals = [
        CheckValue("fyw", fyw, "stress", "web yield strength", ENGINEER),
        CheckValue("hw", hw, "length", "web depth", ENGINEER),
        CheckValue("tw", tw, "length", "web thickness (as found)", ENGINEER),
        CheckValue("ss", ss_, "length", "length of stiff bearing", _ref("6.3(1)")),
        CheckValue("bf", bf, "length", "flange width", ENGINEER),
        CheckValue("tf", tf, "length", "flange thickness", ENGINEER),
        CheckValue("kF", kF, "dimensionless", "buckling coefficient", _ref(f"6.4, {kf_eq}")),
        CheckValue("Fcr", Fcr, "force", "critical force 0.9 kF E tw³/hw", _ref("6.4, Eq. 6.5")),
        CheckValue("m1", m1, "dimensionless", "fyf bf / (fyw tw)", _ref("6.5, Eq. 6.8")),
        CheckValue("m2", m2, "dimensionless", "0.02 (hw/tf)², or 0", _ref("6.5, Eq. 6.9")),
        CheckValue(
            "F (Eq. 6.9 as written)",
            F_clause,
            "force",
            "fyw L_eff tw with the clause's m2",
            _ref("6.2, Eq. 6.1"),
        ),
    ]
    if load_type == "c":
        vals.append(
            CheckValue("le", le, "length", "kF E tw²/(2 fyw hw) <= ss + c", _ref("6.5, Eq. 6.13"))
        )
        vals.append(CheckValue("c", c_, "length", "end of stiff bearing to girder end", ENGINEER))
    if a_ is not None:
        vals.append(CheckValue("a", a_, "length", "transverse stiffener spacing", ENGINEER))
    vals += [
        CheckValue("l_y", ly, "length", "effective loaded length", _ref(f"6.5, {ly_eq}")),
        CheckValue(
            "lambda_F",
            lam,
            "dimensionless",
            "slenderness sqrt(l_y tw fyw / Fcr)",
            _ref("6.4, Eq. 6.4"),
        ),
        CheckValue(
            "chi_F",
            chi_F,
            "dimensionless",
            "reduction factor 0.5/lambda_F <= 1",
            _ref("6.4, Eq. 6.3"),
        ),
        CheckValue(
            "L_eff", L_eff, "length", "effective length for resistance", _ref("6.2, Eq. 6.2")
        ),
        CheckValue(
            "gamma_M1",
            gM1,
            "dimensionless",
            "partial factor",
            GAMMA_SOURCE if gM1 == GAMMA_M1 else ENGINEER,
        ),
    ]
    notes.append(f"load type ({load_type}) of Figure 6.1")
    return EN_1993_1_5.result(
        "web resistance to transverse forces",
        "Section 6, Eq. 6.1",
        F,
        1.0 / gM1,
        "force",
        vals,
        notes,
    )
