"""Web local yielding and web crippling at a bearing or concentrated load, on the measured
web thickness: AASHTO LRFD Appendix D6.5 and AISC 360-22 J10.2 / J10.3.

The two families print the same formulas (the bridge appendix takes them from the building
specification) with their own resistance factors and equation numbers; ``family`` picks
which is cited. Equation numbers as recalled (from memory):

Web local yielding (AASHTO D6.5.2; AISC J10.2):
- load at more than d from the member end: Rn = (5 k + N) Fyw tw (D6.5.2-2; J10-2)
- at d or less (a girder end): Rn = (2.5 k + N) Fyw tw (D6.5.2-3; J10-3)
- phi_b = 1.00 (AASHTO 6.5.4.2); phi = 1.00 (AISC J10.2)

Web crippling (AASHTO D6.5.3; AISC J10.3, Qf = 1 for I-shaped members):
- at d/2 or more from the end: Rn = 0.80 tw² [1 + 3 (N/d)(tw/tf)^1.5] sqrt(E Fyw tf / tw)
  (D6.5.3-2; J10-4)
- nearer than d/2, N/d <= 0.2: Rn = 0.40 tw² [1 + 3 (N/d)(tw/tf)^1.5] sqrt(E Fyw tf / tw)
  (D6.5.3-3; J10-5a)
- nearer than d/2, N/d > 0.2: Rn = 0.40 tw² [1 + (4 N/d - 0.2)(tw/tf)^1.5] sqrt(E Fyw tf / tw)
  (D6.5.3-4; J10-5b)
- phi_w = 0.80 (AASHTO 6.5.4.2); phi = 0.75 (AISC J10.3)

Symbols: tw web thickness (as found at the knife line, where the web thins above the flange
angles), N (AISC lb) bearing length, d overall depth, tf flange thickness, k distance from the
outer face of the flange to the web toe of the fillet. For a riveted girder k and tf are the
caller's stated choice (e.g. the flange's horizontal material only: conservative).
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Literal

from core.checks._inputs import Number, internal, length, modulus, stress
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.checks.sources import AASHTO_LRFD, AISC_360, Document, choice, factor

Family = Literal["aashto", "aisc"]


@dataclass(frozen=True)
class _Clauses:
    doc: Document
    yielding: str
    crippling: str
    eq_yield: tuple[str, str]  # (interior, end)
    eq_cripple: tuple[str, str, str]  # (interior, end N/d <= 0.2, end N/d > 0.2)
    phi_yield: float
    phi_cripple: float
    N: str


#: each family's clauses and default resistance factors (from memory)
CLAUSES: dict[str, _Clauses] = {
    "aashto": _Clauses(
        AASHTO_LRFD,
        "Appendix D6.5.2",
        "Appendix D6.5.3",
        ("D6.5.2-2", "D6.5.2-3"),
        ("D6.5.3-2", "D6.5.3-3", "D6.5.3-4"),
        1.00,
        0.80,
        "N",
    ),
    "aisc": _Clauses(
        AISC_360,
        "J10.2",
        "J10.3",
        ("J10-2", "J10-3"),
        ("J10-4", "J10-5a", "J10-5b"),
        1.00,
        0.75,
        "lb",
    ),
}
#: default resistance factors: AASHTO phi_b 1.00 and phi_w 0.80 (6.5.4.2), AISC 1.00 and 0.75
PHI_YIELD = {k: c.phi_yield for k, c in CLAUSES.items()}
PHI_CRIPPLING = {k: c.phi_cripple for k, c in CLAUSES.items()}


def _family(family: str, where: str) -> _Clauses:
    return CLAUSES[choice(family, tuple(CLAUSES), "family", where=where)]


def _x(x: Number, where: str) -> float:
    return internal(x, "length", "x", where=where, low=0.0, high=1e6, low_inclusive=True)


def web_local_yielding(
    *,
    Fyw: Number,
    tw: Number,
    k: Number,
    N: Number,
    d: Number,
    x: Number = 0.0,
    family: Family = "aashto",
    phi: float | None = None,
    where: str = "",
) -> CapacityResult:
    """Web local yielding at a bearing: Rn = (5k + N) Fyw tw, or (2.5k + N) Fyw tw at an end.

    Args:
        Fyw: web yield strength, MPa. tw: web thickness (as found), mm.
        k: outer face of the flange to the web toe of the fillet, mm.
        N: bearing length, mm. d: overall depth, mm.
        x: distance from the member end to the bearing, mm (0: at the end).
        family: ``"aashto"`` (Appendix D6.5.2) or ``"aisc"`` (J10.2).
        phi: resistance factor (``None``: the family's default).
        where: place for messages.

    Raises:
        InputError: values out of range or an unknown family.
    """
    c = _family(family, where)
    Fyw = stress(Fyw, "Fyw", where=where)
    tw = length(tw, "tw", where=where)
    k = length(k, "k", where=where)
    N = internal(N, "length", c.N, where=where, low=0.0, high=20_000.0, low_inclusive=True)
    d = length(d, "d", where=where)
    x = _x(x, where)
    ph = factor(c.phi_yield if phi is None else phi, "phi", high=1.0, where=where)
    end = x <= d
    mult, eq = (2.5, c.eq_yield[1]) if end else (5.0, c.eq_yield[0])
    Rn = (mult * k + N) * Fyw * tw
    vals = [
        CheckValue("Fyw", Fyw, "stress", "web yield strength", ENGINEER),
        CheckValue("tw", tw, "length", "web thickness (as found)", ENGINEER),
        CheckValue("k", k, "length", "flange face to the web toe of the fillet", ENGINEER),
        CheckValue(c.N, N, "length", "bearing length", ENGINEER),
        CheckValue("d", d, "length", "overall depth", ENGINEER),
        CheckValue("x", x, "length", "distance from the member end", ENGINEER),
        CheckValue(
            f"{mult:g}k + {c.N}", mult * k + N, "length", "length of web yielding", c.doc.ref(eq)
        ),
    ]
    where_txt = "at the end (x <= d)" if end else "away from the end (x > d)"
    notes = [f"bearing {where_txt}: Eq. {eq}", f"phi = {ph:g}"]
    return c.doc.result(
        "web local yielding", f"{c.yielding}, Eq. {eq}", Rn, ph, "force", vals, notes
    )


def web_crippling(
    *,
    Fyw: Number,
    E: Number,
    tw: Number,
    tf: Number,
    N: Number,
    d: Number,
    x: Number = 0.0,
    family: Family = "aashto",
    phi: float | None = None,
    where: str = "",
) -> CapacityResult:
    """Web crippling at a bearing (see the module docstring for the three branches).

    Args:
        Fyw: web yield strength, MPa. E: modulus, MPa. tw: web thickness (as found), mm.
        tf: flange thickness, mm. N: bearing length, mm. d: overall depth, mm.
        x: distance from the member end to the bearing, mm (0: at the end).
        family: ``"aashto"`` (Appendix D6.5.3) or ``"aisc"`` (J10.3, Qf = 1).
        phi: resistance factor (``None``: the family's default).
        where: place for messages.

    Raises:
        InputError: values out of range or an unknown family.
    """
    c = _family(family, where)
    Fyw = stress(Fyw, "Fyw", where=where)
    E = modulus(E, where=where)
    tw = length(tw, "tw", where=where)
    tf = length(tf, "tf", where=where)
    N = internal(N, "length", c.N, where=where, low=0.0, high=20_000.0, low_inclusive=True)
    d = length(d, "d", where=where)
    x = _x(x, where)
    ph = factor(c.phi_cripple if phi is None else phi, "phi", high=1.0, where=where)
    Nd = N / d
    ratio = (tw / tf) ** 1.5
    root = math.sqrt(E * Fyw * tf / tw)
    if x >= d / 2.0:
        coef, bracket, eq = 0.80, 1.0 + 3.0 * Nd * ratio, c.eq_cripple[0]
        branch = "x >= d/2"
    elif Nd <= 0.2:
        coef, bracket, eq = 0.40, 1.0 + 3.0 * Nd * ratio, c.eq_cripple[1]
        branch = f"x < d/2, {c.N}/d <= 0.2"
    else:
        coef, bracket, eq = 0.40, 1.0 + (4.0 * Nd - 0.2) * ratio, c.eq_cripple[2]
        branch = f"x < d/2, {c.N}/d > 0.2"
    Rn = coef * tw**2 * bracket * root
    vals = [
        CheckValue("Fyw", Fyw, "stress", "web yield strength", ENGINEER),
        CheckValue("E", E, "stress", "modulus of elasticity", ENGINEER),
        CheckValue("tw", tw, "length", "web thickness (as found)", ENGINEER),
        CheckValue("tf", tf, "length", "flange thickness", ENGINEER),
        CheckValue(c.N, N, "length", "bearing length", ENGINEER),
        CheckValue("d", d, "length", "overall depth", ENGINEER),
        CheckValue(f"{c.N}/d", Nd, "dimensionless", "bearing length over depth", c.doc.ref(eq)),
        CheckValue(
            "(tw/tf)^1.5", ratio, "dimensionless", "web to flange thickness term", c.doc.ref(eq)
        ),
        CheckValue("sqrt(E Fyw tf/tw)", root, "stress", "stiffness-strength term", c.doc.ref(eq)),
    ]
    notes = [f"{branch}: Eq. {eq}", f"phi = {ph:g}"]
    if family == "aisc":
        notes.append("Qf = 1.0 (I-shaped member, J10.3)")
    return c.doc.result("web crippling", f"{c.crippling}, Eq. {eq}", Rn, ph, "force", vals, notes)
