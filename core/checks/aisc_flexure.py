"""Flexure of built-up I-shaped members bent about the major axis: AISC 360-22 F1, F4 and F5
(compression flange yielding, lateral-torsional buckling, compression flange local buckling).

Equation numbers as recalled from the 2016 and 2022 editions (from memory):

- F1-1  Cb = 12.5 Mmax / (2.5 Mmax + 3 MA + 4 MB + 3 MC) (absolute values, quarter points)
- Table B4.1b  web: lambda = hc/tw; lambda_rw = 5.70 sqrt(E/Fy); lambda_pw = 3.76 sqrt(E/Fy)
  (doubly symmetric) or (hc/hp) sqrt(E/Fy) / (0.54 Mp/My - 0.09)² <= lambda_rw (case 16);
  flange outstands of built-up sections: lambda_pf = 0.38 sqrt(E/Fy),
  lambda_rf = 0.95 sqrt(kc E/FL), kc = 4/sqrt(h/tw) within 0.35 to 0.76 (case 11)
- F4.4 / F5.4 tension flange yielding where Sxt < Sxc: Mn = Rpt Myt (F4-15), Rpt like Rpc
  with Myt (F4-16a/b), 1.0 where Iyc/Iy <= 0.23 (F4-17); Mn = Fy Sxt (F5-10).
- F4 (compact or noncompact web): FL = 0.7 Fy if Sxt/Sxc >= 0.7, else Fy Sxt/Sxc >= 0.5 Fy
  (F4-6a/b); Rpc = Mp/Myc (compact web) or the linear transition (F4-9a/b) when
  Iyc/Iy > 0.23, else 1.0 (F4-10); Mp = Fy Zx <= 1.6 Fy Sx; aw = hc tw/(bfc tfc) (F4-12).
  CFY Mn = Rpc Myc (F4-1). LTB: Lp = 1.1 rt sqrt(E/Fy) (F4-7);
  Lr = 1.95 rt (E/FL) sqrt(J/(Sxc h0) + sqrt((J/(Sxc h0))² + 6.76 (FL/E)²)) (F4-8);
  Mn = Cb [Rpc Myc - (Rpc Myc - FL Sxc)(Lb - Lp)/(Lr - Lp)] <= Rpc Myc (F4-2);
  Mn = Fcr Sxc <= Rpc Myc (F4-3), Fcr = Cb pi² E/(Lb/rt)² sqrt(1 + 0.078 J/(Sxc h0)(Lb/rt)²)
  (F4-5), J = 0 when Iyc/Iy <= 0.23. FLB: Mn = Rpc Myc - (Rpc Myc - FL Sxc)(lambda -
  lambda_pf)/(lambda_rf - lambda_pf) (F4-13); slender flange 0.9 E kc Sxc / lambda² (F4-14).
- F5 (slender web): Rpg = 1 - aw/(1200 + 300 aw)(hc/tw - 5.7 sqrt(E/Fy)) <= 1 (F5-6),
  aw <= 10. CFY Mn = Rpg Fy Sxc (F5-1). LTB: Mn = Rpg Fcr Sxc (F5-2), Lr = pi rt
  sqrt(E/(0.7 Fy)) (F5-5), Fcr = Cb [Fy - 0.3 Fy (Lb - Lp)/(Lr - Lp)] <= Fy (F5-3),
  Fcr = Cb pi² E/(Lb/rt)² <= Fy (F5-4). FLB: Mn = Rpg Fcr Sxc (F5-7),
  Fcr = Fy - 0.3 Fy (lambda - lambda_pf)/(lambda_rf - lambda_pf) (F5-8), 0.9 E kc/lambda² (F5-9).
- phi_b = 0.90 (F1).

For built-up riveted sections, h and hc are measured to the fastener lines (B4.1b, from
memory): the caller states them. rt for a flange with angles and cover plates is that of the
flange components plus one third of the web in compression (F4.2; see
:mod:`core.checks.compression_zone`). The riveted flange's outstands are checked one by one,
the most slender governing (:class:`core.checks.aashto_flange.FlangeElement` serves both).
Flange yielding (F4.1 / F4.4, F5.1 / F5.4) is :func:`flange_yielding`; holes in the
tension flange (F13.1) are :mod:`core.checks.aisc_holes`.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

from core.checks._inputs import Number, internal, length, modulus, stress
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.checks.riveted_flange import FlangeElement
from core.checks.sources import AISC_360, factor
from core.errors import InputError

#: resistance factor for flexure, F1 (from memory)
PHI_B = 0.90


def _ref(clause: str) -> str:
    return AISC_360.ref(clause)


def Cb_quarter_points(
    M_max: Number, M_A: Number, M_B: Number, M_C: Number, *, where: str = ""
) -> tuple[float, tuple[CheckValue, ...]]:
    """Cb = 12.5 Mmax / (2.5 Mmax + 3 MA + 4 MB + 3 MC) (F1-1), absolute moments (N mm) at
    the segment's maximum and its quarter, mid and three-quarter points.

    Raises:
        InputError: a moment that is not finite, or Mmax below one of the others.
    """
    m = [
        abs(internal(v, "moment", n, where=where, low=-1e15, high=1e15))
        for v, n in ((M_max, "M_max"), (M_A, "M_A"), (M_B, "M_B"), (M_C, "M_C"))
    ]
    if m[0] <= 0.0 or max(m[1:]) > m[0] * (1.0 + 1e-12):
        raise InputError(
            f"M_max = {m[0]:g} N·mm must be the largest of the moments {m}", where=where
        )
    Cb = 12.5 * m[0] / (2.5 * m[0] + 3.0 * m[1] + 4.0 * m[2] + 3.0 * m[3])
    vals = (
        *tuple(
            CheckValue(s, v, "moment", d, _ref("F1"))
            for s, v, d in zip(
                ("Mmax", "MA", "MB", "MC"),
                m,
                ("largest", "quarter point", "mid point", "three-quarter point"),
                strict=True,
            )
        ),
        CheckValue("Cb", Cb, "dimensionless", "lateral-torsional buckling modifier", _ref("F1-1")),
    )
    return Cb, vals


@dataclass(frozen=True)
class BuiltUpI:
    """A built-up I-section for F4 / F5, as found (N, mm, MPa).

    Attributes:
        Fy: yield strength. E: modulus. Sxc, Sxt: elastic moduli to the compression and
        tension fibres. Zx: plastic modulus. rt: effective radius of gyration for LTB.
        J: torsion constant. h0: distance between flange centroids. h: web depth between
        fastener lines. hc: twice the centroid-to-compression-fastener-line distance.
        hp: twice the plastic-neutral-axis-to-compression-fastener-line distance.
        tw: web thickness. Afc: compression flange area. Iyc, Iy: compression flange's and
        whole section's minor-axis inertia.
    """

    Fy: float
    E: float
    Sxc: float
    Sxt: float
    Zx: float
    rt: float
    J: float
    h0: float
    h: float
    hc: float
    hp: float
    tw: float
    Afc: float
    Iyc: float
    Iy: float
    where: str = ""

    def __post_init__(self) -> None:
        w = self.where
        object.__setattr__(self, "Fy", stress(self.Fy, "Fy", where=w))
        object.__setattr__(self, "E", modulus(self.E, where=w))
        for n in ("Sxc", "Sxt", "Zx"):
            object.__setattr__(
                self,
                n,
                internal(getattr(self, n), "section_modulus", n, where=w, low=0.0, high=1e12),
            )
        for n in ("rt", "h0", "h", "hc", "hp", "tw"):
            object.__setattr__(self, n, length(getattr(self, n), n, where=w))
        object.__setattr__(
            self,
            "J",
            internal(self.J, "inertia", "J", where=w, low=0.0, high=1e14, low_inclusive=True),
        )
        object.__setattr__(
            self, "Afc", internal(self.Afc, "area", "Afc", where=w, low=0.0, high=1e9)
        )
        for n in ("Iyc", "Iy"):
            object.__setattr__(
                self, n, internal(getattr(self, n), "inertia", n, where=w, low=0.0, high=1e14)
            )
        if self.Iyc > self.Iy * (1.0 + 1e-9):
            raise InputError(f"Iyc = {self.Iyc:g} mm⁴ exceeds Iy = {self.Iy:g} mm⁴", where=w)

    @property
    def lam_w(self) -> float:
        return self.hc / self.tw

    @property
    def lam_rw(self) -> float:
        return 5.70 * math.sqrt(self.E / self.Fy)

    @property
    def Mp(self) -> float:
        return min(self.Fy * self.Zx, 1.6 * self.Fy * min(self.Sxc, self.Sxt))

    @property
    def lam_pw(self) -> float:
        My = self.Fy * min(self.Sxc, self.Sxt)
        raw = (self.hc / self.hp) * math.sqrt(self.E / self.Fy) / (0.54 * self.Mp / My - 0.09) ** 2
        return min(raw, self.lam_rw)

    @property
    def slender_web(self) -> bool:
        return self.lam_w > self.lam_rw

    @property
    def FL(self) -> float:
        r = self.Sxt / self.Sxc
        return 0.7 * self.Fy if r >= 0.7 else max(self.Fy * r, 0.5 * self.Fy)

    @property
    def aw(self) -> float:
        return min(self.hc * self.tw / self.Afc, 10.0)

    @property
    def Rpc(self) -> float:
        if self.Iyc / self.Iy <= 0.23:
            return 1.0
        mp = self.Mp / (self.Fy * self.Sxc)
        if self.lam_w <= self.lam_pw:
            return mp
        t = (self.lam_w - self.lam_pw) / (self.lam_rw - self.lam_pw)
        return min(mp - (mp - 1.0) * t, mp)

    @property
    def Rpt(self) -> float:
        """Web plastification factor for tension flange yielding (F4-16a/b; 1.0 where
        Iyc/Iy <= 0.23, F4-17; from memory)."""
        if self.Iyc / self.Iy <= 0.23:
            return 1.0
        mp = self.Mp / (self.Fy * self.Sxt)
        if self.lam_w <= self.lam_pw:
            return mp
        t = (self.lam_w - self.lam_pw) / (self.lam_rw - self.lam_pw)
        return min(mp - (mp - 1.0) * t, mp)

    @property
    def Rpg(self) -> float:
        a = self.aw
        return min(1.0 - a / (1200.0 + 300.0 * a) * (self.lam_w - self.lam_rw), 1.0)

    @property
    def kc(self) -> float:
        return min(max(4.0 / math.sqrt(self.h / self.tw), 0.35), 0.76)

    def web_values(self) -> list[CheckValue]:
        v = [
            CheckValue(
                "hc/tw", self.lam_w, "dimensionless", "web slenderness", _ref("Table B4.1b")
            ),
            CheckValue(
                "lambda_rw", self.lam_rw, "dimensionless", "5.70 sqrt(E/Fy)", _ref("Table B4.1b")
            ),
        ]
        if self.slender_web:
            v.append(
                CheckValue("aw", self.aw, "dimensionless", "hc tw / (bfc tfc) <= 10", _ref("F4-12"))
            )
            v.append(
                CheckValue(
                    "Rpg",
                    self.Rpg,
                    "dimensionless",
                    "bending strength reduction factor",
                    _ref("F5-6"),
                )
            )
        else:
            v.append(
                CheckValue(
                    "lambda_pw",
                    self.lam_pw,
                    "dimensionless",
                    "compact web limit",
                    _ref("Table B4.1b"),
                )
            )
            v.append(
                CheckValue(
                    "Iyc/Iy",
                    self.Iyc / self.Iy,
                    "dimensionless",
                    "flange inertia ratio",
                    _ref("F4.2"),
                )
            )
            v.append(
                CheckValue(
                    "Rpc",
                    self.Rpc,
                    "dimensionless",
                    "web plastification factor",
                    _ref("F4-9, F4-10"),
                )
            )
            v.append(
                CheckValue(
                    "FL",
                    self.FL,
                    "stress",
                    "nominal flange stress at onset of yielding",
                    _ref("F4-6"),
                )
            )
        return v


def flange_yielding(sec: BuiltUpI, *, phi_b: float = PHI_B) -> CapacityResult:
    """Nominal flexural strength for compression and tension flange yielding: F4.1 and F4.4
    (Mn = Rpc Myc, F4-1; Rpt Myt, F4-15) or F5.1 and F5.4 (Rpg Fy Sxc, F5-1; Fy Sxt, F5-10).
    Tension flange yielding applies only where Sxt < Sxc (F4.4, F5.4).

    Raises:
        InputError: phi_b out of range.
    """
    ph = factor(phi_b, "phi_b", high=1.0, where=sec.where)
    vals = sec.web_values()
    Fy = sec.Fy
    if sec.slender_web:
        Mc, eq_c = sec.Rpg * Fy * sec.Sxc, "F5-1"
        Mt, eq_t = Fy * sec.Sxt, "F5-10"
        clause, notes = "F5.1 and F5.4", ["slender web: F5"]
    else:
        Mc, eq_c = sec.Rpc * Fy * sec.Sxc, "F4-1"
        Mt, eq_t = sec.Rpt * Fy * sec.Sxt, "F4-15"
        vals.append(
            CheckValue(
                "Rpt",
                sec.Rpt,
                "dimensionless",
                "web plastification factor, tension",
                _ref("F4-16, F4-17"),
            )
        )
        clause, notes = "F4.1 and F4.4", ["compact or noncompact web: F4"]
    tfy = sec.Sxt < sec.Sxc
    vals.append(CheckValue("Mn,c", Mc, "moment", "compression flange yielding", _ref(eq_c)))
    if tfy:
        vals.append(CheckValue("Mn,t", Mt, "moment", "tension flange yielding", _ref(eq_t)))
        notes.append(
            "tension flange yielding governs" if Mt < Mc else "compression flange yielding governs"
        )
    else:
        notes.append("Sxt >= Sxc: tension flange yielding does not apply (F4.4, F5.4)")
    Mn = min(Mc, Mt) if tfy else Mc
    eq = eq_t if tfy and Mt < Mc else eq_c
    return AISC_360.result("flange yielding", f"{clause}, Eq. {eq}", Mn, ph, "moment", vals, notes)


def lateral_torsional_buckling(
    sec: BuiltUpI, *, Lb: Number, Cb: float = 1.0, phi_b: float = PHI_B
) -> CapacityResult:
    """Nominal flexural strength for lateral-torsional buckling (F4.2 or F5.2; the smaller of
    it and compression flange yielding).

    Args:
        sec: the section. Lb: unbraced length, mm. Cb: modifier (:func:`Cb_quarter_points`).
        phi_b: default :data:`PHI_B`.

    Raises:
        InputError: values out of range.
    """
    w = sec.where
    Lb = internal(Lb, "length", "Lb", where=w, low=0.0, high=1e6, low_inclusive=True)
    Cb = internal(Cb, "dimensionless", "Cb", where=w, low=1.0, high=3.0, low_inclusive=True)
    ph = factor(phi_b, "phi_b", high=1.0, where=w)
    E, Fy, rt = sec.E, sec.Fy, sec.rt
    Lp = 1.1 * rt * math.sqrt(E / Fy)
    vals = sec.web_values()
    notes: list[str] = []
    if sec.slender_web:
        cap = Fy
        Lr = math.pi * rt * math.sqrt(E / (0.7 * Fy))
        if Lb <= Lp:
            Fcr, eq = Fy, "F5-1"
        elif Lb <= Lr:
            Fcr, eq = min(Cb * (Fy - 0.3 * Fy * (Lb - Lp) / (Lr - Lp)), cap), "F5-3"
        else:
            Fcr, eq = min(Cb * math.pi**2 * E / (Lb / rt) ** 2, cap), "F5-4"
        Mn = sec.Rpg * Fcr * sec.Sxc
        vals.append(CheckValue("Fcr", Fcr, "stress", "critical stress", _ref(eq)))
        clause = f"F5.2, Eq. F5-2 with {eq}"
        notes.append("slender web: F5")
    else:
        J = sec.J if sec.Iyc / sec.Iy > 0.23 else 0.0
        FL, Sxc, h0 = sec.FL, sec.Sxc, sec.h0
        q = J / (Sxc * h0)
        Lr = 1.95 * rt * (E / FL) * math.sqrt(q + math.sqrt(q * q + 6.76 * (FL / E) ** 2))
        cap = sec.Rpc * Fy * Sxc
        if Lb <= Lp:
            Mn, eq = cap, "F4-1"
        elif Lb <= Lr:
            Mn, eq = min(Cb * (cap - (cap - FL * Sxc) * (Lb - Lp) / (Lr - Lp)), cap), "F4-2"
        else:
            Fcr = Cb * math.pi**2 * E / (Lb / rt) ** 2 * math.sqrt(1.0 + 0.078 * q * (Lb / rt) ** 2)
            Mn, eq = min(Fcr * Sxc, cap), "F4-3"
            vals.append(CheckValue("Fcr", Fcr, "stress", "critical stress", _ref("F4-5")))
        vals.append(
            CheckValue("J", J, "inertia", "torsion constant (0 when Iyc/Iy <= 0.23)", _ref("F4.2"))
        )
        clause = f"F4.2, Eq. {eq}"
        notes.append("compact or noncompact web: F4")
    vals += [
        CheckValue("rt", rt, "length", "effective radius of gyration for LTB", _ref("F4.2")),
        CheckValue("Lb", Lb, "length", "unbraced length", ENGINEER),
        CheckValue("Lp", Lp, "length", "limiting length 1.1 rt sqrt(E/Fy)", _ref("F4-7")),
        CheckValue(
            "Lr",
            Lr,
            "length",
            "limiting length, inelastic buckling",
            _ref("F5-5" if sec.slender_web else "F4-8"),
        ),
        CheckValue("Cb", Cb, "dimensionless", "modifier", _ref("F1-1")),
    ]
    branch = (
        "Lb <= Lp: no lateral-torsional buckling"
        if Lb <= Lp
        else ("Lp < Lb <= Lr: inelastic" if Lb <= Lr else "Lb > Lr: elastic")
    )
    notes.append(branch)
    return AISC_360.result("lateral-torsional buckling", clause, Mn, ph, "moment", vals, notes)


def flange_local_buckling(
    sec: BuiltUpI, elements: Sequence[FlangeElement], *, phi_b: float = PHI_B
) -> CapacityResult:
    """Nominal flexural strength for compression flange local buckling (F4.3 or F5.3).

    Args:
        sec: the section. elements: the compression flange's plate elements; the most
            slender outstand governs. phi_b: default :data:`PHI_B`.

    Raises:
        InputError: no outstanding element, or values out of range.
    """
    w = sec.where
    ph = factor(phi_b, "phi_b", high=1.0, where=w)
    outs = [e for e in elements if e.kind == "outstand"]
    if not outs:
        raise InputError("flange local buckling needs at least one outstanding element", where=w)
    gov = max(outs, key=lambda e: e.slenderness)
    lam, E, Fy, kc = gov.slenderness, sec.E, sec.Fy, sec.kc
    FL = 0.7 * Fy if sec.slender_web else sec.FL
    lam_pf = 0.38 * math.sqrt(E / Fy)
    lam_rf = 0.95 * math.sqrt(kc * E / FL)
    vals = sec.web_values() + [
        CheckValue(
            f"b/t {e.name}",
            e.slenderness,
            "dimensionless",
            f"{e.kind} slenderness (as found)",
            ENGINEER,
        )
        for e in elements
    ]
    vals += [
        CheckValue(
            "lambda", lam, "dimensionless", f"governing outstand: {gov.name}", _ref("Table B4.1b")
        ),
        CheckValue("kc", kc, "dimensionless", "4/sqrt(h/tw), 0.35 to 0.76", _ref("Table B4.1b")),
        CheckValue("lambda_pf", lam_pf, "dimensionless", "0.38 sqrt(E/Fy)", _ref("Table B4.1b")),
        CheckValue("lambda_rf", lam_rf, "dimensionless", "0.95 sqrt(kc E/FL)", _ref("Table B4.1b")),
    ]
    if lam <= lam_pf:
        kind = "compact flange: no flange local buckling"
    elif lam <= lam_rf:
        kind = "noncompact flange"
    else:
        kind = "slender flange"
    if sec.slender_web:
        if lam <= lam_pf:
            Fcr, eq = Fy, "F5-1"
        elif lam <= lam_rf:
            Fcr, eq = Fy - 0.3 * Fy * (lam - lam_pf) / (lam_rf - lam_pf), "F5-8"
        else:
            Fcr, eq = 0.9 * E * kc / lam**2, "F5-9"
        Mn = sec.Rpg * Fcr * sec.Sxc
        vals.append(CheckValue("Fcr", Fcr, "stress", "critical stress", _ref(eq)))
        clause = f"F5.3, Eq. F5-7 with {eq}"
    else:
        cap = sec.Rpc * Fy * sec.Sxc
        if lam <= lam_pf:
            Mn, eq = cap, "F4-1"
        elif lam <= lam_rf:
            Mn, eq = cap - (cap - FL * sec.Sxc) * (lam - lam_pf) / (lam_rf - lam_pf), "F4-13"
        else:
            Mn, eq = 0.9 * E * kc * sec.Sxc / lam**2, "F4-14"
        clause = f"F4.3, Eq. {eq}"
    notes = [kind, "slender web: F5" if sec.slender_web else "compact or noncompact web: F4"]
    return AISC_360.result("flange local buckling", clause, Mn, ph, "moment", vals, notes)
