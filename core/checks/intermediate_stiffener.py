"""Intermediate transverse stiffeners: may the web panel beside them be counted as stiffened,
and may it count tension-field (post-buckling) action, with their measured sizes?

One function per family; each cites only its own document (equation numbers from memory):

- AASHTO LRFD 9th ed. (2020), 6.10.11.1: projecting width bt >= 2.0 in. + D/30 (50.8 mm +
  D/30) (6.10.11.1.2-1) and 16 tp >= bt >= bf/4 (6.10.11.1.2-2); moment of inertia
  It >= It1 = b tw³ J, J = 2.5 (D/do)² - 2.0 >= 0.5, b the smaller of do and D
  (6.10.11.1.3-1, -3), about the web's mid-plane for a pair, about the stiffener's face on
  the web for one; for tension-field action also It >= It2 = D⁴ rho_t^1.3 / 40 (Fyw/E)^1.5
  (6.10.11.1.3-2), rho_t = max(Fyw/Fcrs, 1) (-4), Fcrs = 0.31 E / (bt/tp)² <= Fys (-5).
  The clause scales It2 by the panel's shear ratio rho_w; rho_w = 1 is taken (the
  requirement for any demand up to the resistance with tension field: conservative).
- AISC 360-22 G2.3: (b/t)st <= 0.56 sqrt(E/Fyst) (G2-12); Ist >= Ist2 + (Ist1 - Ist2) rho_w
  (G2-13), Ist1 = h⁴ rho_st^1.3 / 40 (Fyw/E)^1.5 (G2-14), Ist2 = [2.5/(a/h)² - 2] b tw³ >=
  0.5 b tw³, rho_st = max(Fyw/Fyst, 1); rho_w = 1 as above (and never below Ist2).
- EN 1993-1-5:2006 9.3.3 and 9.2.1(8): a rigid intermediate stiffener has
  Ist >= 1.5 hw³ t³ / a² for a/hw < sqrt(2) (Eq. 9.6), Ist >= 0.75 hw t³ otherwise (9.7),
  Ist of the stiffener with 15 epsilon t of web each side; and It/Ip >= 5.3 fy/E (9.3). A
  panel bounded by rigid stiffeners takes k_tau with its own a (Annex A.3), the
  post-critical resistance of Section 5 with it; otherwise the panel runs to the next rigid
  stiffener. The axial force a stiffener takes from the tension field (9.3.3(3)) needs the
  shear demand: checked in the assessment, not here.

The measured loss (the smallest remaining thickness and any width lost at the toes) applies
to the whole stiffener: its inertia is that of its weakest section (conservative).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from core.checks._inputs import Number, length, modulus, stress
from core.checks.en1993_buckling import E_STEEL, epsilon
from core.checks.en1993_stiffener import STRIP_EPS_T, torsion_ratio
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.checks.sources import AASHTO_LRFD, AISC_360, EN_1993_1_5
from core.checks.stiffener_section import EndLoss, Stiffener, remaining, stiffener_section

AASHTO_MIN_WIDTH = 50.8  # mm: 2.0 in. of 6.10.11.1.2-1 (from memory)


@dataclass(frozen=True)
class PanelStiffening(CapacityResult):
    """Adequacy of an intermediate stiffener for the panel beside it.

    ``Rn`` is the stiffener's moment of inertia (mm⁴, as found); the required ones are among
    the values.

    Adds:
        stiffened: the stiffener bounds the panel (shear buckling with its spacing).
        tension_field: the panel may count tension-field (post-buckling) action.
        reasons: why not, when either is False (empty when both hold).
    """

    stiffened: bool = False
    tension_field: bool = False
    reasons: tuple[str, ...] = ()


def _result(doc, clause, It, vals, notes, stiffened, tfa, reasons) -> PanelStiffening:
    return PanelStiffening(
        limit_state="intermediate stiffener",
        standard=doc.name,
        edition=doc.edition,
        clause=f"{clause} (from memory)",
        Rn=It,
        phi=1.0,
        kind="inertia",
        values=tuple(vals),
        notes=tuple(notes),
        stiffened=stiffened,
        tension_field=tfa,
        reasons=tuple(reasons),
    )


def _axis(st: Stiffener, tw: float) -> tuple[float, str]:
    if st.sides == 2:
        return 0.0, "about the web's mid-plane (stiffener pair)"
    return st.back(tw), "about the stiffener's face on the web (one-sided)"


def aashto(
    st: Stiffener,
    *,
    Fyw: Number,
    Fys: Number,
    E: Number,
    D: Number,
    tw: Number,
    do: Number,
    bf: Number,
    loss: EndLoss | None = None,
    where: str = "",
) -> PanelStiffening:
    """AASHTO LRFD 6.10.11.1 requirements of an intermediate stiffener, as found.

    Args:
        st: the stiffener. Fyw, Fys: web and stiffener yield strengths, MPa. E: modulus, MPa.
        D: web depth, mm. tw: web thickness (as found), mm. do: stiffener spacing, mm
            (the larger of the two panels beside it). bf: widest compression flange, mm.
        loss: measured loss of the stiffener. where: place for messages.

    Raises:
        InputError: values out of range.
    """
    w = where or f"stiffener {st.name!r}"
    Fyw, Fys, E = stress(Fyw, "Fyw", where=w), stress(Fys, "Fys", where=w), modulus(E, where=w)
    D, tw, do, bf = (
        length(v, n, where=w) for v, n in ((D, "D"), (tw, "tw"), (do, "do"), (bf, "bf"))
    )
    rem = remaining(st, loss)
    bt, tp = rem.b, rem.t
    y0, axis = _axis(st, tw)
    It = stiffener_section(st, tw=tw, loss=loss, where=w).I_about(y0)
    b = min(do, D)
    J = max(2.5 * (D / do) ** 2 - 2.0, 0.5)
    It1 = b * tw**3 * J
    Fcrs = min(0.31 * E / (bt / tp) ** 2, Fys)
    rho_t = max(Fyw / Fcrs, 1.0)
    It2 = D**4 * rho_t**1.3 / 40.0 * (Fyw / E) ** 1.5
    need_w = AASHTO_MIN_WIDTH + D / 30.0
    ref = AASHTO_LRFD.ref
    vals = [
        CheckValue("bt", bt, "length", "projecting width (as found)", ENGINEER),
        CheckValue("tp", tp, "length", "projecting element thickness (as found)", ENGINEER),
        CheckValue(
            "2.0 in. + D/30", need_w, "length", "least projecting width", ref("6.10.11.1.2-1")
        ),
        CheckValue("16 tp", 16.0 * tp, "length", "largest projecting width", ref("6.10.11.1.2-2")),
        CheckValue("bf/4", bf / 4.0, "length", "least projecting width", ref("6.10.11.1.2-2")),
        CheckValue("It", It, "inertia", f"stiffener moment of inertia {axis}", "section engine"),
        CheckValue("J", J, "dimensionless", "2.5 (D/do)² - 2.0 >= 0.5", ref("6.10.11.1.3-3")),
        CheckValue("It1", It1, "inertia", "b tw³ J: for shear buckling", ref("6.10.11.1.3-1")),
        CheckValue(
            "Fcrs",
            Fcrs,
            "stress",
            "local buckling stress 0.31 E/(bt/tp)² <= Fys",
            ref("6.10.11.1.3-5"),
        ),
        CheckValue("rho_t", rho_t, "dimensionless", "max(Fyw/Fcrs, 1)", ref("6.10.11.1.3-4")),
        CheckValue(
            "It2",
            It2,
            "inertia",
            "D⁴ rho_t^1.3/40 (Fyw/E)^1.5: for tension field",
            ref("6.10.11.1.3-2"),
        ),
    ]
    reasons: list[str] = []
    if bt < need_w:
        reasons.append(
            f"projecting width {bt:.4g} mm < 2.0 in. + D/30 = {need_w:.4g} mm (6.10.11.1.2-1)"
        )
    if bt > 16.0 * tp:
        reasons.append(f"projecting width {bt:.4g} mm > 16 tp = {16 * tp:.4g} mm (6.10.11.1.2-2)")
    if bt < bf / 4.0:
        reasons.append(f"projecting width {bt:.4g} mm < bf/4 = {bf / 4:.4g} mm (6.10.11.1.2-2)")
    if It < It1:
        reasons.append(f"It = {It:.4g} mm⁴ < It1 = {It1:.4g} mm⁴ (6.10.11.1.3-1)")
    stiffened = not reasons
    if do > 3.0 * D:
        stiffened = False
        reasons.append(f"do = {do:g} mm > 3 D: the web is not stiffened (6.10.9.1)")
    tfa = stiffened and It >= It2
    if stiffened and not tfa:
        reasons.append(
            f"It = {It:.4g} mm⁴ < It2 = {It2:.4g} mm⁴ (6.10.11.1.3-2, rho_w = 1): no tension field"
        )
    notes = ["rho_w = 1 taken in the tension-field requirement (conservative)"]
    if loss is not None:
        notes.append("measured loss applied to the whole stiffener (weakest section)")
    return _result(
        AASHTO_LRFD, "6.10.11.1.2 and 6.10.11.1.3", It, vals, notes, stiffened, tfa, reasons
    )


def aisc(
    st: Stiffener,
    *,
    Fyw: Number,
    Fyst: Number,
    E: Number,
    h: Number,
    tw: Number,
    a: Number,
    loss: EndLoss | None = None,
    where: str = "",
) -> PanelStiffening:
    """AISC 360-22 G2.3 requirements of an intermediate stiffener, as found.

    Args:
        st: the stiffener. Fyw, Fyst: web and stiffener yield strengths, MPa.
        E: modulus, MPa. h: web depth (between fastener lines), mm. tw: web thickness, mm.
        a: stiffener spacing (the larger panel beside it), mm. loss: measured loss.
        where: place for messages.

    Raises:
        InputError: values out of range.
    """
    w = where or f"stiffener {st.name!r}"
    Fyw, Fyst, E = stress(Fyw, "Fyw", where=w), stress(Fyst, "Fyst", where=w), modulus(E, where=w)
    h, tw, a = (length(v, n, where=w) for v, n in ((h, "h"), (tw, "tw"), (a, "a")))
    rem = remaining(st, loss)
    y0, axis = _axis(st, tw)
    Ist = stiffener_section(st, tw=tw, loss=loss, where=w).I_about(y0)
    lim = 0.56 * math.sqrt(E / Fyst)
    b = min(a, h)
    Ist2 = max(2.5 / (a / h) ** 2 - 2.0, 0.5) * b * tw**3
    rho_st = max(Fyw / Fyst, 1.0)
    Ist1 = h**4 * rho_st**1.3 / 40.0 * (Fyw / E) ** 1.5
    need_tfa = max(Ist1, Ist2)
    ref = AISC_360.ref
    vals = [
        CheckValue(
            "(b/t)st",
            rem.b / rem.t,
            "dimensionless",
            "stiffener width-thickness (as found)",
            ENGINEER,
        ),
        CheckValue("0.56 sqrt(E/Fyst)", lim, "dimensionless", "limit", ref("G2-12")),
        CheckValue("Ist", Ist, "inertia", f"stiffener moment of inertia {axis}", "section engine"),
        CheckValue(
            "Ist2",
            Ist2,
            "inertia",
            "[2.5/(a/h)² - 2] b tw³ >= 0.5 b tw³: shear buckling",
            ref("G2.3"),
        ),
        CheckValue("rho_st", rho_st, "dimensionless", "max(Fyw/Fyst, 1)", ref("G2.3")),
        CheckValue(
            "Ist1", Ist1, "inertia", "h⁴ rho_st^1.3/40 (Fyw/E)^1.5: post-buckling", ref("G2-14")
        ),
    ]
    reasons: list[str] = []
    if rem.b / rem.t > lim:
        reasons.append(f"(b/t)st = {rem.b / rem.t:.4g} > 0.56 sqrt(E/Fyst) = {lim:.4g} (G2-12)")
    if Ist < Ist2:
        reasons.append(f"Ist = {Ist:.4g} mm⁴ < Ist2 = {Ist2:.4g} mm⁴ (G2.3)")
    stiffened = not reasons
    if a / h > 3.0:
        stiffened = False
        reasons.append(f"a/h = {a / h:.3g} > 3.0: kv = 5.34, no tension field (G2.1, G2.2)")
    tfa = stiffened and Ist >= need_tfa
    if stiffened and not tfa:
        reasons.append(
            f"Ist = {Ist:.4g} mm⁴ < {need_tfa:.4g} mm⁴ (G2-13 with rho_w = 1): no tension field"
        )
    notes = ["rho_w = 1 taken in G2-13 (conservative)"]
    return _result(AISC_360, "G2.3, Eq. G2-12 to G2-14", Ist, vals, notes, stiffened, tfa, reasons)


def en1993(
    st: Stiffener,
    *,
    fy: Number,
    fyw: Number | None = None,
    hw: Number,
    tw: Number,
    a: Number,
    E: Number = E_STEEL,
    loss: EndLoss | None = None,
    where: str = "",
) -> PanelStiffening:
    """EN 1993-1-5 9.3.3 and 9.2.1(8) requirements of an intermediate stiffener, as found.

    Args:
        st: the stiffener. fy: its yield strength, MPa. fyw: web yield strength for
            epsilon, MPa (default fy). hw: web depth, mm. tw: web thickness, mm.
        a: stiffener spacing (the larger panel beside it), mm. E: modulus, MPa.
        loss: measured loss. where: place for messages.

    Raises:
        InputError: values out of range.
    """
    w = where or f"stiffener {st.name!r}"
    fy = stress(fy, "fy", where=w)
    fyw_ = fy if fyw is None else stress(fyw, "fyw", where=w)
    E = modulus(E, where=w)
    hw, tw, a = (length(v, n, where=w) for v, n in ((hw, "hw"), (tw, "tw"), (a, "a")))
    rem = remaining(st, loss)
    strip = 2.0 * STRIP_EPS_T * epsilon(fyw_) * tw + st.t * st.per_side
    sec = stiffener_section(st, tw=tw, strip=strip, loss=loss, where=w)
    Ist = sec.props.Ix
    if a / hw < math.sqrt(2.0):
        need, eq = 1.5 * hw**3 * tw**3 / a**2, "9.3.3(3), Eq. 9.6"
    else:
        need, eq = 0.75 * hw * tw**3, "9.3.3(3), Eq. 9.7"
    ratio = torsion_ratio(st, tw=tw, loss=loss, b=rem.b)
    limit = 5.3 * fy / E
    ref = EN_1993_1_5.ref
    vals = [
        CheckValue("strip", strip, "length", "web strip 15 epsilon t each side", ref("9.1(2)")),
        CheckValue(
            "Ist",
            Ist,
            "inertia",
            "stiffener with web strip, centroidal axis parallel to the web",
            "section engine",
        ),
        CheckValue("Ist,min", need, "inertia", "least Ist of a rigid stiffener", ref(eq)),
        CheckValue(
            "It/Ip",
            ratio,
            "dimensionless",
            "torsional ratio of one outstand (as found)",
            ref("9.2.1(8)"),
        ),
        CheckValue("5.3 fy/E", limit, "dimensionless", "least It/Ip", ref("9.2.1(8), Eq. 9.3")),
    ]
    reasons: list[str] = []
    if Ist < need:
        reasons.append(f"Ist = {Ist:.4g} mm⁴ < {need:.4g} mm⁴ ({eq}): not a rigid stiffener")
    if ratio < limit:
        reasons.append(
            f"It/Ip = {ratio:.3g} < 5.3 fy/E = {limit:.3g} (9.2.1(8)): torsional buckling"
        )
    ok = not reasons
    notes = [
        "a rigid stiffener bounds the panel: k_tau with its spacing (Annex A.3) and the "
        "post-critical resistance of Section 5 with it",
        "the stiffener's axial force from the tension field (9.3.3(3)) needs the shear demand",
    ]
    return _result(EN_1993_1_5, "9.3.3 and 9.2.1(8)", Ist, vals, notes, ok, ok, reasons)
