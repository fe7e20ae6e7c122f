"""Compression flange local buckling, web load shedding and web bend-buckling: AASHTO LRFD
Bridge Design Specifications 6.10.8.2.2, 6.10.1.10.2 and 6.10.1.9.1.

Edition followed: 9th ed. (2020); equation numbers as recalled (from memory):

- 6.10.8.2.2  lambda_f = bfc / (2 tfc) (-3); lambda_pf = 0.38 sqrt(E/Fyc) (-4);
  lambda_rf = 0.56 sqrt(E/Fyr) (-5); lambda_f <= lambda_pf: Fnc = Rb Rh Fyc (-1); else
  Fnc = [1 - (1 - Fyr/(Rh Fyc)) (lambda_f - lambda_pf)/(lambda_rf - lambda_pf)] Rb Rh Fyc (-2).
  Fyr = the smaller of 0.7 Fyc, Rh Fyt Sxt/Sxc and Fyw, but not less than 0.5 Fyc.
- 6.10.1.10.2  Rb = 1 where 2 Dc/tw <= lambda_rw = 5.7 sqrt(E/Fyc) (-4); otherwise
  Rb = 1 - awc/(1200 + 300 awc) (2 Dc/tw - lambda_rw) <= 1 (-3), awc = 2 Dc tw/(bfc tfc) (-5).
- 6.10.1.9.1  Fcrw = 0.9 E k / (D/tw)² <= min(Rh Fyc, Fyw/0.7) (-1), k = 9/(Dc/D)² (-2).
- phi_f = 1.00 (6.5.4.2).

A riveted compression flange has several outstanding elements: the flange angles'
horizontal legs and the cover plates' edges beyond the outer rivet lines. The plate-flange
rule is applied to each outstand with lambda = b/t (b the outstand, t its measured
thickness), and the most slender governs (our application of 6.10.8.2.2 to a built-up
flange: stated as an assumption). Beyond lambda_rf the clause has no branch (6.10.2.2 keeps
new flanges stockier); there Fnc = Rb Rh Fyr (lambda_rf/lambda)², an elastic decay from the
clause's end point (common practice, no source; lower than the straight line continued),
and the result asks the engineer to review. Cover plate widths between rivet lines
(internal elements) are compared with 1.40 sqrt(E/Fyc) (6.9.4.2.1, plates supported on two
edges; from memory) and noted when beyond it.
"""

from __future__ import annotations

import math
from collections.abc import Sequence

from core.checks._inputs import Number, internal, length, modulus, stress
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.checks.riveted_flange import FlangeElement, plate_flange
from core.checks.sources import AASHTO_LRFD, factor
from core.errors import InputError

#: resistance factor for flexure, 6.5.4.2 (from memory)
PHI_F = 1.00
#: internal element limit 1.40 sqrt(E/Fy), 6.9.4.2.1 (from memory)
K_INTERNAL = 1.40

__all__ = [
    "K_INTERNAL",
    "PHI_F",
    "FlangeElement",
    "flange_inputs",
    "flange_local_buckling",
    "plate_flange",
    "web_bend_buckling",
    "web_load_shedding",
    "yield_onset",
]


def _ref(clause: str) -> str:
    return AASHTO_LRFD.ref(clause)


def yield_onset(
    Fyc: float,
    Fyw: float,
    Rh: float = 1.0,
    Fyt: float | None = None,
    Sxt_over_Sxc: float | None = None,
) -> float:
    """Fyr = min(0.7 Fyc, Rh Fyt Sxt/Sxc, Fyw) >= 0.5 Fyc, MPa (6.10.8.2.2)."""
    cands = [0.7 * Fyc, Fyw]
    if Sxt_over_Sxc is not None:
        cands.append(Rh * (Fyc if Fyt is None else Fyt) * Sxt_over_Sxc)
    return max(min(cands), 0.5 * Fyc)


def flange_inputs(
    Fyc: Number,
    Fyw: Number,
    E: Number,
    Rb: float,
    Rh: float,
    Fyt: Number | None,
    Sxc: Number,
    Sxt: Number | None,
    where: str,
) -> tuple[float, float, float, float, float, float, float]:
    """Checked ``(Fyc, Fyw, E, Rb, Rh, Sxc, Fyr)`` of a compression flange check.

    Raises:
        InputError: a value out of range.
    """
    Fyc = stress(Fyc, "Fyc", where=where)
    Fyw = stress(Fyw, "Fyw", where=where)
    E = modulus(E, where=where)
    Rb = internal(Rb, "dimensionless", "Rb", where=where, low=0.0, high=1.0)
    Rh = internal(Rh, "dimensionless", "Rh", where=where, low=0.0, high=1.0)
    Fyt_ = None if Fyt is None else stress(Fyt, "Fyt", where=where)
    Sxc = internal(Sxc, "section_modulus", "Sxc", where=where, low=0.0, high=1e12)
    Sxt_ = (
        None
        if Sxt is None
        else internal(Sxt, "section_modulus", "Sxt", where=where, low=0.0, high=1e12)
    )
    Fyr = yield_onset(Fyc, Fyw, Rh, Fyt_, None if Sxt_ is None else Sxt_ / Sxc)
    return Fyc, Fyw, E, Rb, Rh, Sxc, Fyr


def flange_local_buckling(
    elements: Sequence[FlangeElement],
    *,
    Fyc: Number,
    Fyw: Number,
    E: Number,
    Sxc: Number,
    Rb: float = 1.0,
    Rh: float = 1.0,
    Fyt: Number | None = None,
    Sxt: Number | None = None,
    phi_f: float = PHI_F,
    where: str = "",
) -> CapacityResult:
    """Flange local buckling resistance Mn = Fnc Sxc of a compression flange (6.10.8.2.2).

    Args:
        elements: the flange's plate elements (:func:`plate_flange` for a plate flange).
        Fyc: compression flange yield strength, MPa. Fyw: web yield strength, MPa.
        E: modulus, MPa. Sxc: elastic modulus to the compression flange, mm³.
        Rb: web load-shedding factor (:func:`web_load_shedding`). Rh: hybrid factor (1).
        Fyt, Sxt: tension flange yield strength (MPa) and modulus (mm³), for Fyr.
        phi_f: default :data:`PHI_F`. where: place for messages.

    Raises:
        InputError: values out of range, or no outstanding element.
    """
    Fyc, Fyw, E, Rb, Rh, Sxc, Fyr = flange_inputs(Fyc, Fyw, E, Rb, Rh, Fyt, Sxc, Sxt, where)
    ph = factor(phi_f, "phi_f", high=1.0, where=where)
    outs = [e for e in elements if e.kind == "outstand"]
    if not outs:
        raise InputError(
            "flange local buckling needs at least one outstanding element", where=where
        )
    lam_pf = 0.38 * math.sqrt(E / Fyc)
    lam_rf = 0.56 * math.sqrt(E / Fyr)
    gov = max(outs, key=lambda e: e.slenderness)
    lam = gov.slenderness
    cap = Rb * Rh * Fyc
    notes = [f"governing element: {gov.name} (b/t = {lam:.4g})"]
    if lam <= lam_pf:
        Fnc, eq = cap, "6.10.8.2.2-1"
        notes.append("compact flange: lambda_f <= lambda_pf")
    elif lam <= lam_rf:
        Fnc = (1.0 - (1.0 - Fyr / (Rh * Fyc)) * (lam - lam_pf) / (lam_rf - lam_pf)) * cap
        eq = "6.10.8.2.2-2"
        notes.append("non-compact flange: lambda_pf < lambda_f <= lambda_rf")
    else:
        Fnc, eq = Rb * Rh * Fyr * (lam_rf / lam) ** 2, "6.10.8.2.2-2 end point"
        notes.append(
            f"lambda_f = {lam:.4g} > lambda_rf = {lam_rf:.4g}: beyond the clause's range; "
            "Fnc = Rb Rh Fyr (lambda_rf/lambda_f)² (common practice, no source): engineer to review"
        )
    vals = [
        CheckValue("Fyc", Fyc, "stress", "compression flange yield strength", ENGINEER),
        CheckValue(
            "Fyr",
            Fyr,
            "stress",
            "compression flange stress at onset of yielding",
            _ref("6.10.8.2.2"),
        ),
    ]
    for e in elements:
        vals.append(
            CheckValue(
                f"b/t {e.name}",
                e.slenderness,
                "dimensionless",
                f"{e.kind} slenderness (as found)",
                ENGINEER,
            )
        )
    vals += [
        CheckValue(
            "lambda_f",
            lam,
            "dimensionless",
            "slenderness of the governing outstand",
            _ref("6.10.8.2.2-3"),
        ),
        CheckValue(
            "lambda_pf",
            lam_pf,
            "dimensionless",
            "compact limit 0.38 sqrt(E/Fyc)",
            _ref("6.10.8.2.2-4"),
        ),
        CheckValue(
            "lambda_rf",
            lam_rf,
            "dimensionless",
            "non-compact limit 0.56 sqrt(E/Fyr)",
            _ref("6.10.8.2.2-5"),
        ),
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
    limit = K_INTERNAL * math.sqrt(E / Fyc)
    for e in elements:
        if e.kind == "internal" and e.slenderness > limit:
            notes.append(
                f"{e.name}: b/t = {e.slenderness:.4g} exceeds {K_INTERNAL:g} sqrt(E/Fyc) = "
                f"{limit:.4g} (6.9.4.2.1, from memory): engineer to review"
            )
    return AASHTO_LRFD.result(
        "flange local buckling", f"6.10.8.2.2, Eq. {eq}", Fnc * Sxc, ph, "moment", vals, notes
    )


def web_load_shedding(
    *, Dc: Number, tw: Number, Afc: Number, E: Number, Fyc: Number, where: str = ""
) -> tuple[float, tuple[CheckValue, ...]]:
    """Web load-shedding factor Rb (6.10.1.10.2) and its working.

    Args:
        Dc: web depth in compression, mm. tw: web thickness (as found), mm.
        Afc: compression flange area (bfc tfc; for a riveted flange the area of its parts), mm².
        E: modulus, MPa. Fyc: compression flange yield strength, MPa.

    Raises:
        InputError: values out of range.
    """
    Dc = length(Dc, "Dc", where=where)
    tw = length(tw, "tw", where=where)
    Afc = internal(Afc, "area", "Afc", where=where, low=0.0, high=1e9)
    E = modulus(E, where=where)
    Fyc = stress(Fyc, "Fyc", where=where)
    lam_rw = 5.7 * math.sqrt(E / Fyc)
    awc = 2.0 * Dc * tw / Afc
    slender = 2.0 * Dc / tw
    if slender <= lam_rw:
        Rb, eq = 1.0, "6.10.1.10.2 (2Dc/tw <= lambda_rw)"
    else:
        Rb, eq = min(1.0 - awc / (1200.0 + 300.0 * awc) * (slender - lam_rw), 1.0), "6.10.1.10.2-3"
    vals = (
        CheckValue(
            "2Dc/tw",
            slender,
            "dimensionless",
            "web slenderness in compression",
            _ref("6.10.1.10.2"),
        ),
        CheckValue("lambda_rw", lam_rw, "dimensionless", "5.7 sqrt(E/Fyc)", _ref("6.10.1.10.2-4")),
        CheckValue("awc", awc, "dimensionless", "2 Dc tw / (bfc tfc)", _ref("6.10.1.10.2-5")),
        CheckValue("Rb", max(Rb, 0.0), "dimensionless", "web load-shedding factor", _ref(eq)),
    )
    return max(Rb, 0.0), vals


def web_bend_buckling(
    *,
    D: Number,
    Dc: Number,
    tw: Number,
    E: Number,
    Fyc: Number,
    Fyw: Number,
    Rh: float = 1.0,
    where: str = "",
) -> CapacityResult:
    """Nominal web bend-buckling resistance Fcrw, MPa (6.10.1.9.1), a stress result.

    Args:
        D: web depth, mm. Dc: web depth in compression, mm. tw: web thickness, mm.
        E: modulus, MPa. Fyc, Fyw: compression flange and web yield strengths, MPa.
        Rh: hybrid factor (1). where: place for messages.

    Raises:
        InputError: values out of range, or Dc larger than D.
    """
    D = length(D, "D", where=where)
    Dc = length(Dc, "Dc", where=where)
    tw = length(tw, "tw", where=where)
    E = modulus(E, where=where)
    Fyc = stress(Fyc, "Fyc", where=where)
    Fyw = stress(Fyw, "Fyw", where=where)
    Rh = internal(Rh, "dimensionless", "Rh", where=where, low=0.0, high=1.0)
    if Dc > D:
        raise InputError(f"Dc = {Dc:g} mm exceeds the web depth D = {D:g} mm", where=where)
    k = 9.0 / (Dc / D) ** 2
    raw = 0.9 * E * k / (D / tw) ** 2
    cap = min(Rh * Fyc, Fyw / 0.7)
    vals = [
        CheckValue("D/tw", D / tw, "dimensionless", "web slenderness", _ref("6.10.1.9.1")),
        CheckValue(
            "k", k, "dimensionless", "bend-buckling coefficient 9/(Dc/D)²", _ref("6.10.1.9.1-2")
        ),
        CheckValue(
            "0.9 E k/(D/tw)²", raw, "stress", "elastic bend-buckling stress", _ref("6.10.1.9.1-1")
        ),
        CheckValue("min(Rh Fyc, Fyw/0.7)", cap, "stress", "upper limit", _ref("6.10.1.9.1-1")),
    ]
    notes = [
        "a limit on the compression flange stress for constructibility and service (6.10.3.2, 6.10.4.2)"
    ]
    return AASHTO_LRFD.result(
        "web bend-buckling",
        "6.10.1.9.1, Eq. 6.10.1.9.1-1",
        min(raw, cap),
        1.0,
        "stress",
        vals,
        notes,
    )
