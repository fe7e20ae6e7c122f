"""Bearing stiffeners: EN 1993-1-5:2006 Section 9 (9.1, 9.2.1(8), 9.4), with EN 1993-1-1 6.2.4
and 6.3.1 and the bridge partial factors of EN 1993-2.

Clause and equation numbers as recalled (from memory):

- 9.1(2), Figure 9.1: the effective section of a transverse stiffener is the stiffener with
  a strip of web 15 epsilon t each side (less where the web ends); epsilon of the web.
- 9.2.1(8), Eq. 9.3: torsional buckling of an open stiffener is prevented when
  It / Ip >= 5.3 fy / E (It St Venant constant of the stiffener alone, Ip its polar moment
  about its connection to the web).
- 9.4(2): out-of-plane buckling per EN 1993-1-1 6.3.3 / 6.3.4 (here 6.3.1, axial force alone)
  with buckling curve c and a buckling length l >= 0.75 hw (ends held laterally; larger for
  less restraint). Where the stiffener has cut-outs at the loaded end, the cross-section
  resistance is checked at that end: EN 1993-1-1 6.2.4, Eq. 6.10, Nc,Rd = A fy / gamma_M0.
- EN 1993-1-1 6.3.1.1, Eq. 6.47: Nb,Rd = chi A fy / gamma_M1; lambda = sqrt(A fy / Ncr).
- gamma_M0 = 1.00, gamma_M1 = 1.10 (EN 1993-2 Table 6.1, recommended values).

Where Eq. 9.3 fails with the measured thickness, the outstand is counted only as far as it
meets it (conservative; common practice, no source) and the result says so. The bottom end's
loss enters as :mod:`core.checks.stiffener_section` describes.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from core.checks._inputs import Number, internal, length, modulus, stress
from core.checks.en1993_buckling import (
    E_STEEL,
    GAMMA_M0,
    GAMMA_M1,
    GAMMA_SOURCE,
    alpha_of,
    chi,
    epsilon,
)
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.checks.sources import EN_1993_1_1, EN_1993_1_5, factor
from core.checks.stiffener_section import (
    LOSS_OVER_LENGTH,
    EndLoss,
    Stiffener,
    StiffenerSection,
    one_side,
    remaining,
    stiffener_section,
)
from core.checks.thinwalled import torsion_constant
from core.geometry import build_pieces

#: web strip each side of the stiffener, in epsilon t, 9.1(2) (from memory)
STRIP_EPS_T = 15.0
#: smallest buckling length over hw, 9.4(2) (from memory)
L_OVER_HW = 0.75
#: buckling curve of a transverse stiffener, 9.4(2) (from memory)
CURVE = "c"


def _ref(clause: str) -> str:
    return EN_1993_1_5.ref(clause)


def torsion_ratio(st: Stiffener, *, tw: float, loss: EndLoss | None, b: float) -> float:
    """It / Ip of the elements on one face (9.2.1(8)), Ip about the point where the
    stiffener meets the web (plates) or its heel (angles), with projecting width ``b``."""
    sec = stiffener_section(one_side(st), tw=tw, loss=loss, b_max=b)
    p = sec.props
    y0 = st.back(tw)
    Ip = p.Ix + p.Iy + p.A * ((p.yc - y0) ** 2 + p.xc**2)
    return torsion_constant(build_pieces(sec.definition, sec.loss).rects) / Ip


@dataclass(frozen=True)
class _Effective:
    sec: StiffenerSection
    strip: float
    eps: float
    b: float
    ratio: float
    limit: float
    trimmed: bool


def _effective(
    st: Stiffener,
    fy: float,
    fyw: float,
    tw: float,
    E: float,
    loss: EndLoss | None,
    strip_available: float | None,
    where: str,
) -> _Effective:
    rem = remaining(st, loss)
    eps = epsilon(fyw)
    strip = 2.0 * STRIP_EPS_T * eps * tw + st.t * st.per_side
    if strip_available is not None:
        strip = min(strip, strip_available)
    limit = 5.3 * fy / E
    ratio = torsion_ratio(st, tw=tw, loss=loss, b=rem.b)
    b, trimmed = rem.b, False
    if ratio < limit:
        lo = st.t * 1.0001 if st.kind == "angles" else rem.t * 1e-3
        hi = rem.b
        for _ in range(40):  # It/Ip falls as the outstand grows: bisect on the width
            mid = 0.5 * (lo + hi)
            if torsion_ratio(st, tw=tw, loss=loss, b=mid) >= limit:
                lo = mid
            else:
                hi = mid
        b, trimmed = lo, True
    sec = stiffener_section(st, tw=tw, strip=strip, loss=loss, b_max=b, where=where)
    return _Effective(sec, strip, eps, b, ratio, limit, trimmed)


def _common(
    st: Stiffener,
    fy: Number,
    fyw: Number | None,
    tw: Number,
    E: Number,
    loss: EndLoss | None,
    strip_available: Number | None,
    where: str,
) -> tuple[_Effective, list[CheckValue], list[str], float]:
    w = where or f"stiffener {st.name!r}"
    fy = stress(fy, "fy", where=w)
    fyw = fy if fyw is None else stress(fyw, "fyw", where=w)
    tw = length(tw, "tw", where=w)
    E = modulus(E, where=w)
    avail = None if strip_available is None else length(strip_available, "strip_available", where=w)
    eff = _effective(st, fy, fyw, tw, E, loss, avail, w)
    vals = [
        CheckValue("fy", fy, "stress", "yield strength of the stiffener", ENGINEER),
        CheckValue(
            "epsilon",
            eff.eps,
            "dimensionless",
            "sqrt(235/fyw) of the web",
            EN_1993_1_1.ref("Table 5.2"),
        ),
        CheckValue(
            "strip",
            eff.strip,
            "length",
            "web strip 15 epsilon t each side",
            _ref("9.1(2), Figure 9.1"),
        ),
        CheckValue(
            "It/Ip",
            eff.ratio,
            "dimensionless",
            "torsional ratio of one outstand (as found)",
            _ref("9.2.1(8)"),
        ),
        CheckValue(
            "5.3 fy/E", eff.limit, "dimensionless", "least It/Ip", _ref("9.2.1(8), Eq. 9.3")
        ),
        CheckValue(
            "A", eff.sec.A, "area", "effective section (stiffener and web strip)", "section engine"
        ),
    ]
    notes = [f"web strip {eff.strip:.4g} mm (15 epsilon t each side, 9.1(2))"]
    if eff.trimmed:
        notes.append(
            f"It/Ip = {eff.ratio:.3g} < 5.3 fy/E = {eff.limit:.3g} (9.2.1(8)): the outstand is "
            f"counted to {eff.b:.4g} mm only, where Eq. 9.3 holds (conservative, common "
            "practice, no source): engineer to review"
        )
    if loss is not None:
        notes.append(LOSS_OVER_LENGTH + f"; readings over the bottom {loss.height:g} mm")
    return eff, vals, notes, fy


def end_resistance(
    st: Stiffener,
    *,
    fy: Number,
    tw: Number,
    fyw: Number | None = None,
    E: Number = E_STEEL,
    clip: Number = 0.0,
    loss: EndLoss | None = None,
    strip_available: Number | None = None,
    gamma_M0: float = GAMMA_M0,
    where: str = "",
) -> CapacityResult:
    """Cross-section resistance of the stiffener's loaded end, Nc,Rd = A fy / gamma_M0
    (9.4(2) with EN 1993-1-1 6.2.4, Eq. 6.10), on the as-found end section less the clips.

    Args:
        st: the stiffener. fy: its yield strength, MPa. tw: web thickness, mm.
        fyw: web yield strength for epsilon, MPa (default fy). E: modulus, MPa.
        clip: corner clip (cut-out) at the inner end of each projecting element, mm.
        loss: measured loss of the bottom end. strip_available: web length available, mm.
        gamma_M0: default :data:`~core.checks.en1993_buckling.GAMMA_M0`.
        where: place for messages.

    Raises:
        InputError: values out of range or a loss that removes an element.
    """
    w = where or f"stiffener {st.name!r}"
    gM0 = factor(gamma_M0, "gamma_M0", low=0.5, where=w)
    eff, vals, notes, fy = _common(st, fy, fyw, tw, E, loss, strip_available, w)
    c = internal(clip, "length", "clip", where=w, low=0.0, high=2000.0, low_inclusive=True)
    cut = min(c, eff.b) * eff.sec.kept.t * st.n_projecting
    A_end = max(eff.sec.A - cut, 0.0)
    vals += [
        CheckValue("clip area", cut, "area", "cut-outs at the loaded end", ENGINEER),
        CheckValue("A_end", A_end, "area", "end section", _ref("9.4(2)")),
        CheckValue(
            "gamma_M0",
            gM0,
            "dimensionless",
            "partial factor",
            GAMMA_SOURCE if gM0 == GAMMA_M0 else ENGINEER,
        ),
    ]
    return EN_1993_1_5.result(
        "bearing stiffener end section",
        "9.4(2) with EN 1993-1-1 6.2.4, Eq. 6.10",
        A_end * fy,
        1.0 / gM0,
        "force",
        vals,
        notes,
    )


def buckling_resistance(
    st: Stiffener,
    *,
    fy: Number,
    tw: Number,
    hw: Number,
    fyw: Number | None = None,
    E: Number = E_STEEL,
    l_factor: float = L_OVER_HW,
    loss: EndLoss | None = None,
    strip_available: Number | None = None,
    gamma_M1: float = GAMMA_M1,
    where: str = "",
) -> CapacityResult:
    """Out-of-plane buckling resistance of a bearing stiffener, Nb,Rd = chi A fy / gamma_M1
    (9.4(2) with EN 1993-1-1 6.3.1, curve c).

    Args:
        st: the stiffener. fy: its yield strength, MPa. tw: web thickness, mm.
        hw: web depth, mm. fyw: web yield strength for epsilon, MPa (default fy).
        E: modulus, MPa (default 210 000).
        l_factor: buckling length over hw, at least 0.75 (9.4(2)).
        loss: measured loss of the bottom end. strip_available: web length available, mm.
        gamma_M1: default :data:`~core.checks.en1993_buckling.GAMMA_M1`.
        where: place for messages.

    Raises:
        InputError: values out of range (``l_factor`` below 0.75), or a loss that removes
            an element.
    """
    w = where or f"stiffener {st.name!r}"
    hw = length(hw, "hw", where=w)
    lf = internal(
        l_factor, "dimensionless", "l_factor", where=w, low=L_OVER_HW, high=5.0, low_inclusive=True
    )
    gM1 = factor(gamma_M1, "gamma_M1", low=0.5, where=w)
    E_ = modulus(E, where=w)
    eff, vals, notes, fy = _common(st, fy, fyw, tw, E_, loss, strip_available, w)
    sec = eff.sec
    I = sec.props.Ix  # about the centroidal axis parallel to the web
    l = lf * hw
    Ncr = math.pi**2 * E_ * I / l**2
    lam = math.sqrt(sec.A * fy / Ncr)
    alpha = alpha_of(CURVE)
    x, phi = chi(lam, alpha)
    vals += [
        CheckValue(
            "I", I, "inertia", "about the centroidal axis parallel to the web", "section engine"
        ),
        CheckValue("l", l, "length", "buckling length", _ref("9.4(2)")),
        CheckValue(
            "Ncr", Ncr, "force", "elastic critical force pi² E I / l²", EN_1993_1_1.ref("6.3.1.2")
        ),
        CheckValue(
            "lambda",
            lam,
            "dimensionless",
            "non-dimensional slenderness",
            EN_1993_1_1.ref("6.3.1.2, Eq. 6.50"),
        ),
        CheckValue(
            "alpha",
            alpha,
            "dimensionless",
            "imperfection factor, curve c",
            EN_1993_1_1.ref("Table 6.1"),
        ),
        CheckValue(
            "Phi",
            phi,
            "dimensionless",
            "0.5 [1 + alpha (lambda - 0.2) + lambda²]",
            EN_1993_1_1.ref("6.3.1.2"),
        ),
        CheckValue(
            "chi", x, "dimensionless", "reduction factor", EN_1993_1_1.ref("6.3.1.2, Eq. 6.49")
        ),
        CheckValue(
            "gamma_M1",
            gM1,
            "dimensionless",
            "partial factor",
            GAMMA_SOURCE if gM1 == GAMMA_M1 else ENGINEER,
        ),
    ]
    if lf == L_OVER_HW:
        notes.append("buckling length 0.75 hw: both ends held laterally (9.4(2))")
    return EN_1993_1_5.result(
        "bearing stiffener buckling",
        "9.4(2) with EN 1993-1-1 6.3.1.1, Eq. 6.47, curve c",
        x * sec.A * fy,
        1.0 / gM1,
        "force",
        vals,
        notes,
    )
