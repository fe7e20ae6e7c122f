"""Cross-section class (EN 1993-1-1:2005 Table 5.2) with the measured thickness, and the
effective web of a class 4 section (EN 1993-1-5:2006 4.4) by the section engine.

As recalled (from memory), epsilon = sqrt(235/fy):

- Table 5.2, outstand flanges in compression: class 1 c/t <= 9 eps, class 2 <= 10 eps,
  class 3 <= 14 eps; beyond: class 4.
- Table 5.2, internal parts in bending and compression (a web): class 1 c/t <= 396 eps /
  (13 alpha - 1) for alpha > 0.5, 36 eps / alpha otherwise; class 2 456 eps / (13 alpha - 1),
  41.5 eps / alpha; class 3 42 eps / (0.67 + 0.33 psi) for psi > -1, 62 eps (1 - psi)
  sqrt(-psi) for psi <= -1 (pure bending, alpha = 0.5, psi = -1: 72, 83, 124 eps).
- EN 1993-1-5 4.4(2): rho = 1 for lambda_p <= 0.5 + sqrt(0.085 - 0.055 psi), else
  rho = (lambda_p - 0.055 (3 + psi)) / lambda_p² <= 1 (Eq. 4.2, internal); outstand:
  rho = 1 for lambda_p <= 0.748, else (lambda_p - 0.188) / lambda_p² <= 1 (Eq. 4.3);
  lambda_p = (b/t) / (28.4 eps sqrt(k_sigma)).
- Table 4.1 (internal): k_sigma = 4.0 (psi = 1), 8.2 / (1.05 + psi) (1 > psi > 0),
  7.81 - 6.29 psi + 9.78 psi² (0 >= psi > -1), 23.9 (psi = -1), 5.98 (1 - psi)²
  (-1 > psi >= -3); effective widths: psi >= 0: be1 = 2 beff / (5 - psi), be2 = beff - be1,
  beff = rho b; psi < 0: beff = rho bc = rho b / (1 - psi), be1 = 0.4 beff (at the
  compressed edge), be2 = 0.6 beff (towards the neutral axis).
- Table 4.2 (outstand, uniform compression): k_sigma = 0.43.
- 4.4(3): the stress ratio of the web may be taken from the gross web with the effective
  flange: here the flanges as they are (a class 4 flange outstand is not reduced here: the
  caller classes the outstands first with :func:`outstand_class` and says so).

For a riveted girder the web's width b is its free depth between the flange angles' toes
(the caller's stated choice, as for shear). The ineffective zone becomes a loss band of zero
thickness in the engine (the faying faces and holes of the rest apply as everywhere), and the
effective section's properties come from the engine.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from core.checks._inputs import Number, internal, length, stress
from core.checks.en1993_buckling import epsilon
from core.checks.results import CheckValue
from core.checks.sources import EN_1993_1_1, EN_1993_1_5, choice
from core.definition import LossBand, SectionDefinition, StationLoss
from core.errors import InputError
from core.properties import SectionProperties
from core.section import analyse


def outstand_class(
    c: Number, t: Number, fy: Number, *, where: str = ""
) -> tuple[int, tuple[CheckValue, ...]]:
    """Class of an outstand flange in uniform compression (Table 5.2), ``(class, working)``.

    Raises:
        InputError: values out of range.
    """
    c, t, fy = (
        length(c, "c", where=where),
        length(t, "t", where=where),
        stress(fy, "fy", where=where),
    )
    eps = epsilon(fy)
    r = c / t
    cls = 1 if r <= 9 * eps else 2 if r <= 10 * eps else 3 if r <= 14 * eps else 4
    src = EN_1993_1_1.ref("Table 5.2 (sheet 2), outstand flange")
    return cls, (
        CheckValue("c/t", r, "dimensionless", "outstand slenderness (as found)", src),
        CheckValue("14 eps", 14 * eps, "dimensionless", "class 3 limit", src),
        CheckValue("class", cls, "dimensionless", "cross-section class of the outstand", src),
    )


def web_class(
    c: Number, t: Number, fy: Number, *, psi: float = -1.0, alpha: float = 0.5, where: str = ""
) -> tuple[int, tuple[CheckValue, ...]]:
    """Class of an internal part in bending and compression (Table 5.2, sheet 1).

    Args:
        c: width (the web's free depth), mm. t: thickness (as found), mm. fy: MPa.
        psi: stress ratio (edge stresses, compression positive; -1 pure bending).
        alpha: compressed share of c at full plasticity (0.5 pure bending).

    Raises:
        InputError: values out of range.
    """
    c, t, fy = (
        length(c, "c", where=where),
        length(t, "t", where=where),
        stress(fy, "fy", where=where),
    )
    psi = internal(psi, "dimensionless", "psi", where=where, low=-3.0, high=1.0, low_inclusive=True)
    alpha = internal(alpha, "dimensionless", "alpha", where=where, low=0.0, high=1.0)
    eps = epsilon(fy)
    r = c / t
    l1 = 396 * eps / (13 * alpha - 1) if alpha > 0.5 else 36 * eps / alpha
    l2 = 456 * eps / (13 * alpha - 1) if alpha > 0.5 else 41.5 * eps / alpha
    l3 = 42 * eps / (0.67 + 0.33 * psi) if psi > -1 else 62 * eps * (1 - psi) * math.sqrt(-psi)
    cls = 1 if r <= l1 else 2 if r <= l2 else 3 if r <= l3 else 4
    src = EN_1993_1_1.ref("Table 5.2 (sheet 1), internal part")
    return cls, (
        CheckValue("c/t", r, "dimensionless", "web slenderness (as found)", src),
        CheckValue("class 1 limit", l1, "dimensionless", "c/t limit, class 1", src),
        CheckValue("class 2 limit", l2, "dimensionless", "c/t limit, class 2", src),
        CheckValue("class 3 limit", l3, "dimensionless", "c/t limit, class 3", src),
        CheckValue("class", cls, "dimensionless", "cross-section class of the web", src),
    )


def k_sigma_internal(psi: float) -> float:
    """Buckling factor of an internal element, Table 4.1 (psi within 1e-9 of -1 is -1: the
    table's 23.9 there, between its two neighbouring formulas)."""
    if abs(psi + 1.0) <= 1e-9:
        return 23.9
    if psi >= 1.0:
        return 4.0
    if psi > 0.0:
        return 8.2 / (1.05 + psi)
    if psi > -1.0:
        return 7.81 - 6.29 * psi + 9.78 * psi * psi
    if psi >= -3.0:
        return 5.98 * (1.0 - psi) ** 2
    raise InputError(f"psi = {psi:g} is outside the range of Table 4.1 (-3 to 1)")


def plate_slenderness(b: float, t: float, eps: float, k_sigma: float) -> float:
    """lambda_p = (b/t) / (28.4 eps sqrt(k_sigma)) (4.4(2))."""
    return (b / t) / (28.4 * eps * math.sqrt(k_sigma))


def rho_internal(lam_p: float, psi: float) -> float:
    """Reduction factor of an internal element, Eq. 4.2."""
    if lam_p <= 0.5 + math.sqrt(0.085 - 0.055 * psi):
        return 1.0
    return min((lam_p - 0.055 * (3.0 + psi)) / lam_p**2, 1.0)


def rho_outstand(lam_p: float) -> float:
    """Reduction factor of an outstand element, Eq. 4.3."""
    if lam_p <= 0.748:
        return 1.0
    return min((lam_p - 0.188) / lam_p**2, 1.0)


@dataclass(frozen=True)
class WebZone:
    """The compressed web's effective widths and its ineffective zone (heights, mm).

    Attributes:
        psi, k_sigma, lam_p, rho: of the web. bc: compressed width. beff, be1, be2:
        effective widths (be1 at the compressed edge). hole: (lo, hi) of the ineffective
        zone, or ``None`` (fully effective).
    """

    psi: float
    k_sigma: float
    lam_p: float
    rho: float
    bc: float
    beff: float
    be1: float
    be2: float
    hole: tuple[float, float] | None

    @property
    def height(self) -> float:
        """Height of the ineffective zone, mm (0 when fully effective)."""
        return 0.0 if self.hole is None else self.hole[1] - self.hole[0]


def web_zone(
    *,
    y_edges: tuple[float, float],
    y_na: float,
    tw: float,
    eps: float,
    compression: str = "top",
    where: str = "",
) -> WebZone:
    """Effective widths of a web in bending between the heights ``y_edges`` (lower, upper),
    with the elastic neutral axis at ``y_na`` and ``compression`` at the top or the bottom
    edge (EN 1993-1-5 4.4(2), Tables 4.1, psi not below -3).

    Raises:
        InputError: the edges not on either side of the neutral axis, or tw not positive.
    """
    choice(compression, ("top", "bottom"), "compression", where=where)
    lo_e, hi_e = y_edges
    if not lo_e < y_na < hi_e:
        raise InputError(
            f"the neutral axis {y_na:g} mm is not within the web's free depth {lo_e:g} to "
            f"{hi_e:g} mm",
            where=where,
        )
    tw = length(tw, "tw", where=where)
    comp_edge, tens_edge = (hi_e, lo_e) if compression == "top" else (lo_e, hi_e)
    b = hi_e - lo_e
    psi = max((tens_edge - y_na) / (comp_edge - y_na), -3.0)
    k = k_sigma_internal(psi)
    lam = plate_slenderness(b, tw, eps, k)
    rho = rho_internal(lam, psi)
    if psi < 0.0:
        bc = b / (1.0 - psi)
        beff = rho * bc
        be1, be2 = 0.4 * beff, 0.6 * beff
    else:
        bc = b
        beff = rho * b
        be1 = 2.0 * beff / (5.0 - psi)
        be2 = beff - be1
    hole = None
    if rho < 1.0:
        s = 1.0 if compression == "top" else -1.0
        a = comp_edge - s * be1
        z = comp_edge - s * (bc - be2)
        hole = (min(a, z), max(a, z))
    return WebZone(psi, k, lam, rho, bc, beff, be1, be2, hole)


@dataclass(frozen=True)
class EffectiveWeb:
    """The effective section of a girder with a class 4 web (mm).

    Attributes:
        props: the effective section's properties (the engine's). zone: the web's
        effective widths and ineffective zone (:class:`WebZone`; its psi, k_sigma, lam_p,
        rho and hole are also read here). Weff_c, Weff_t: moduli to
        the compression and tension fibres. values: the working.
    """

    props: SectionProperties
    zone: WebZone
    Weff_c: float
    Weff_t: float
    values: tuple[CheckValue, ...]

    @property
    def psi(self) -> float:
        return self.zone.psi

    @property
    def lam_p(self) -> float:
        return self.zone.lam_p

    @property
    def rho(self) -> float:
        return self.zone.rho

    @property
    def hole(self) -> tuple[float, float] | None:
        return self.zone.hole


def effective_web(
    defn: SectionDefinition,
    loss: StationLoss | None,
    *,
    fy: Number,
    tw: Number,
    y_edges: tuple[float, float],
    compression: str = "top",
    web: str = "web",
    where: str = "",
) -> EffectiveWeb:
    """The effective section of ``defn`` with ``loss`` for bending with a class 4 web.

    Args:
        defn, loss: the girder section and the station's loss (``None``: as built).
        fy: web yield strength, MPa. tw: the web thickness for its slenderness (as found), mm.
        y_edges: (lower, upper) heights of the web's free depth b, mm (e.g. the toes of the
            flange angles' vertical legs).
        compression: ``"top"`` (sagging) or ``"bottom"``. web: id of the web part.
        where: place for messages.

    Raises:
        InputError: values out of range, or edges not on either side of the neutral axis.
    """
    choice(compression, ("top", "bottom"), "compression", where=where)
    fy = stress(fy, "fy", where=where)
    tw = length(tw, "tw", where=where)
    lo_e, hi_e = (
        internal(v, "position", n, where=where, low=-1e6, high=1e6)
        for v, n in zip(y_edges, ("y_lower", "y_upper"), strict=True)
    )
    if not hi_e > lo_e:
        raise InputError(
            f"web edges {lo_e:g} and {hi_e:g} mm: the upper must be above the lower", where=where
        )
    loss = loss if loss is not None else StationLoss(where=where)
    gross = analyse(defn, loss).gross.props
    yc = gross.yc
    z = web_zone(
        y_edges=(lo_e, hi_e), y_na=yc, tw=tw, eps=epsilon(fy), compression=compression, where=where
    )
    b, hole = hi_e - lo_e, z.hole
    eff_loss = loss
    if hole is not None:
        eff_loss = StationLoss(
            loss.thickness,
            (*loss.bands, LossBand(web, hole[0], hole[1], 0.0)),
            loss.perforations,
            where=loss.where,
        )
    props = analyse(defn, eff_loss).gross.props
    top = props.S_top
    bot = props.S_bot
    Wc, Wt = (top, bot) if compression == "top" else (bot, top)
    ref = EN_1993_1_5.ref
    vals = (
        CheckValue("b", b, "length", "web free depth", "engineer's input"),
        CheckValue("psi", z.psi, "dimensionless", "stress ratio of the web edges", ref("4.4(3)")),
        CheckValue("k_sigma", z.k_sigma, "dimensionless", "buckling factor", ref("Table 4.1")),
        CheckValue(
            "lambda_p", z.lam_p, "dimensionless", "(b/t)/(28.4 eps sqrt(k_sigma))", ref("4.4(2)")
        ),
        CheckValue("rho", z.rho, "dimensionless", "reduction factor", ref("4.4(2), Eq. 4.2")),
        CheckValue("beff", z.beff, "length", "effective compressed width", ref("Table 4.1")),
        CheckValue(
            "be1", z.be1, "length", "effective width at the compressed edge", ref("Table 4.1")
        ),
        CheckValue(
            "be2", z.be2, "length", "effective width towards the neutral axis", ref("Table 4.1")
        ),
        CheckValue(
            "Weff,c",
            Wc,
            "section_modulus",
            "effective modulus, compression fibre",
            "section engine",
        ),
        CheckValue(
            "Weff,t", Wt, "section_modulus", "effective modulus, tension fibre", "section engine"
        ),
    )
    return EffectiveWeb(props, z, Wc, Wt, vals)
