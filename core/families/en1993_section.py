"""EN 1993 bending at a station: the cross-section class with the thickness found, the
effective section of a class 4 section (EN 1993-1-5 4.4), and the tension flange at holes.

The compression flange is the top one in sagging, the bottom one in hogging (the sign of
the moment at the station; ``compression``). Its outstands are the cover plates
and the horizontal angle legs beyond the outer rivet line (c from the line to the free edge;
a horizontal angle leg without a line through it counts its whole length, conservative).
The web's c is the web depth of the chosen basis. Class 4 parts lose the ineffective widths
of Tables 4.1 / 4.2: the tips of the outstands, and a band of the compressed web placed from
the stress ratio psi of the section with effective flanges and the gross web (4.4(3)); the
effective properties then come from the remaining rectangles (one step, no iteration).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from core.checks.en1993_bending import bending_resistance
from core.checks.en1993_buckling import epsilon
from core.checks.en1993_class import (
    k_sigma_internal,
    outstand_class,
    plate_slenderness,
    rho_outstand,
    web_class,
    web_zone,
)
from core.checks.results import CapacityResult, CheckValue
from core.families.context import StationContext, flange_area, part_thickness
from core.parts import Angle, Plate
from core.section import StationSection

SRC_52 = "EN 1993-1-1:2005 Table 5.2 (from memory)"
SRC_44 = "EN 1993-1-5:2006 4.4, Tables 4.1 and 4.2 (from memory)"


def rect_props(r: np.ndarray) -> tuple[float, float, float, float, float]:
    """(A, yc, Ix, y_bot, y_top) of disjoint rectangles (n, 4) xmin, ymin, xmax, ymax (mm)."""
    w, h = r[:, 2] - r[:, 0], r[:, 3] - r[:, 1]
    a = w * h
    A = float(a.sum())
    ym = 0.5 * (r[:, 1] + r[:, 3])
    yc = float((a * ym).sum() / A)
    Ix = float((w * h**3 / 12.0 + a * (ym - yc) ** 2).sum())
    return A, yc, Ix, float(r[:, 1].min()), float(r[:, 3].max())


def remove_box(r: np.ndarray, box: tuple[float, float, float, float]) -> np.ndarray:
    """Rectangles ``r`` minus an axis-aligned box (x0, y0, x1, y1): each rectangle that meets
    the box leaves up to four pieces (below, above, left, right of it)."""
    x0, y0, x1, y1 = box
    out = []
    for a0, b0, a1, b1 in r:
        if a1 <= x0 or a0 >= x1 or b1 <= y0 or b0 >= y1:
            out.append((a0, b0, a1, b1))
            continue
        if b0 < y0:
            out.append((a0, b0, a1, y0))
        if b1 > y1:
            out.append((a0, y1, a1, b1))
        lo, hi = max(b0, y0), min(b1, y1)
        if a0 < x0:
            out.append((a0, lo, x0, hi))
        if a1 > x1:
            out.append((x1, lo, a1, hi))
    return np.asarray(out, dtype=float).reshape(-1, 4)


@dataclass(frozen=True)
class Outstand:
    part: str
    c: float
    t: float
    box_side: int  # +1: the free edge is at larger x, -1 smaller x
    edge: float
    y: tuple[float, float]


def _cls(c: float, t: float, fy: float) -> int:
    return outstand_class(c, t, fy)[0]


def outstands(ctx: StationContext, st: StationSection, compression: str = "top") -> list[Outstand]:
    """The compression flange's outstands with their c and thickness at the station."""
    defn = ctx.defn
    vlines = [ln for ln in defn.rivet_lines if ln.axis == "vertical"]
    out = []
    parts = ctx.web.top_parts if compression == "top" else ctx.web.bottom_parts
    for pid in parts:
        p = defn.part(pid)
        through = [ln.position for ln in vlines if pid in ln.parts]
        r = st.gross.pieces.of(pid)
        if len(r) == 0:
            continue
        if isinstance(p, Plate) and p.orientation == "horizontal":
            x0, x1 = p.long_range
            t = part_thickness(st.loss, defn, pid)
            for side, edge in ((-1, x0), (1, x1)):
                near = [x for x in through if (x - 0.5 * (x0 + x1)) * side > 0]
                root = max(near, key=lambda x: x * side) if near else 0.5 * (x0 + x1)
                out.append(
                    Outstand(pid, abs(edge - root), t, side, edge, (p.bounds[1], p.bounds[3]))
                )
        elif isinstance(p, Angle):
            t = part_thickness(st.loss, defn, pid, "h")
            toe = p.x + p.dir_x * p.b_h
            root = min(through, key=lambda x: abs(toe - x)) if through else p.x
            ys = sorted((p.y, p.y + p.dir_y * t))
            out.append(Outstand(pid, abs(toe - root), t, p.dir_x, toe, (ys[0], ys[1])))
    return out


def bending(
    ctx: StationContext, st: StationSection, tw: float, label: str, compression: str = "top"
) -> CapacityResult:
    """Mc,Rd of one state (as-built or as-found) with its class and working; ``compression``
    the flange in compression (``"top"`` sagging, ``"bottom"`` hogging)."""
    fy = ctx.material.Fy
    eps = epsilon(fy)
    p = st.gross.props
    lo, hi = ctx.y_depth
    vals: list[CheckValue] = [CheckValue("epsilon", eps, "dimensionless", "sqrt(235/fy)", SRC_52)]
    # flange outstands
    cls_f, worst = 1, None
    for o in outstands(ctx, st, compression):
        k = _cls(o.c, o.t, fy)
        if worst is None or o.c / o.t > worst.c / worst.t:
            worst = o
        cls_f = max(cls_f, k)
    if worst is not None:
        vals.append(
            CheckValue(
                "c/t flange",
                worst.c / worst.t,
                "dimensionless",
                f"largest outstand, {worst.part} (limits 9, 10, 14 eps)",
                SRC_52,
            )
        )
    # web: compressed edge first
    c = hi - lo
    comp, tens = (hi, lo) if compression == "top" else (lo, hi)
    sgn = 1.0 if compression == "top" else -1.0
    psi = (tens - p.yc) / (comp - p.yc) if sgn * (comp - p.yc) > 0 else 1.0
    psi = min(max(psi, -3.0), 1.0)
    alpha = min(max(abs(comp - p.y_pna) / c, 1e-6), 1.0)
    cls_w = web_class(c, tw, fy, psi=psi, alpha=alpha)[0]
    vals += [
        CheckValue("c/t web", c / tw, "dimensionless", f"web, c = {ctx.depth_words}", SRC_52),
        CheckValue("psi", psi, "dimensionless", "stress ratio of the web edges (elastic)", SRC_52),
        CheckValue("alpha", alpha, "dimensionless", "compressed share of c (plastic)", SRC_52),
        CheckValue("class flange", cls_f, "dimensionless", "compression flange outstands", SRC_52),
        CheckValue("class web", cls_w, "dimensionless", "web in bending", SRC_52),
    ]
    cls = max(cls_f, cls_w)
    W_eff = None
    notes = [f"class {cls} (flange {cls_f}, web {cls_w}) with the thickness {label}"]
    if cls == 4:
        W_eff, more, words = effective_modulus(ctx, st, tw, eps, compression)
        vals += more
        notes.append(words)
    return bending_resistance(
        section_class=cls,
        W_pl=p.Zx,
        W_el_min=min(p.S_top, p.S_bot),
        W_eff_min=W_eff,
        fy=fy,
        gamma_M0=ctx.f("gamma_M0"),
        working=tuple(vals),
        notes=tuple(notes),
        where=f"{ctx.where} / bending ({label})",
    )


def effective_modulus(
    ctx: StationContext, st: StationSection, tw: float, eps: float, compression: str = "top"
) -> tuple[float, list[CheckValue], str]:
    """Weff,min of a class 4 section and the working (EN 1993-1-5 4.4)."""
    r = st.gross.pieces.rects.copy()
    vals: list[CheckValue] = []
    words = []
    fy = ctx.material.Fy
    for o in outstands(ctx, st, compression):
        if _cls(o.c, o.t, fy) < 4:
            continue
        lam = plate_slenderness(o.c, o.t, eps, 0.43)
        rho = rho_outstand(lam)
        cut = (1.0 - rho) * o.c
        if cut <= 0.0:
            continue
        x0, x1 = sorted((o.edge, o.edge - o.box_side * cut))
        r = remove_box(r, (x0, o.y[0], x1, o.y[1]))
        vals.append(
            CheckValue(
                f"rho {o.part}", rho, "dimensionless", "outstand reduction, k_sigma 0.43", SRC_44
            )
        )
        words.append(f"{o.part} outstand: {cut:.3g} mm of its tip not effective")
    _, yc, _, _, _ = rect_props(r)
    lo, hi = ctx.y_depth
    wr = st.gross.pieces.of(ctx.web.web_id)
    wx0, wx1 = float(wr[:, 0].min()), float(wr[:, 2].max())
    if lo < yc < hi:
        z = web_zone(y_edges=(lo, hi), y_na=yc, tw=tw, eps=eps, compression=compression)
        vals += [
            CheckValue(
                "k_sigma web",
                k_sigma_internal(z.psi),
                "dimensionless",
                "buckling factor, Table 4.1",
                SRC_44,
            ),
            CheckValue(
                "lambda_p web", z.lam_p, "dimensionless", "plate slenderness of the web", SRC_44
            ),
            CheckValue("rho web", z.rho, "dimensionless", "web reduction factor", SRC_44),
        ]
        if z.hole is not None and z.height > 0.0:
            r = remove_box(r, (wx0, z.hole[0], wx1, z.hole[1]))
            words.append(f"web not effective from {z.hole[0]:.0f} to {z.hole[1]:.0f} mm")
    _A, yc, Ix, yb, yt = rect_props(r)
    W = min(Ix / (yt - yc), Ix / (yc - yb))
    vals.append(
        CheckValue("Weff,min", W, "section_modulus", "least effective section modulus", SRC_44)
    )
    return (
        W,
        vals,
        "effective section (EN 1993-1-5 4.4): " + ("; ".join(words) or "fully effective"),
    )


def flange_plate(
    ctx: StationContext, st: StationSection, ids: tuple[str, ...]
) -> tuple[float, float]:
    """(bf, tf) of a built-up flange for 5.4: bf the widest horizontal plate or pair of angle
    legs, tf = sqrt(sum b_i t_i² / bf) over the horizontal plates and angle legs, i.e. the
    plates resisting as separate plates without composite action (asfound's conservative
    reading for a riveted flange; engineer to review)."""
    bf, btt = 0.0, 0.0
    for pid in ids:
        p = ctx.defn.part(pid)
        if isinstance(p, Plate) and p.orientation == "horizontal":
            t = part_thickness(st.loss, ctx.defn, pid)
            bf, btt = max(bf, p.b), btt + p.b * t**2
        elif isinstance(p, Angle):
            t = part_thickness(st.loss, ctx.defn, pid, "h")
            bf, btt = max(bf, 2.0 * p.b_h + ctx.tw_nominal), btt + p.b_h * t**2
    return (bf, (btt / bf) ** 0.5) if bf > 0 else (0.0, 0.0)


def flanges_moment(ctx: StationContext, st: StationSection) -> tuple[float, float]:
    """(Mf,Rd in N*mm, the smaller flange area mm²): plastic moment of the flanges alone,
    the smaller flange's area times fy times the distance between the flange centroids."""
    top, bot = ctx.web.top_parts, ctx.web.bottom_parts
    At, Ab = flange_area(st, top), flange_area(st, bot)
    g = st.gross
    yt = g.Q_of(top) / At + g.props.yc
    yb = g.Q_of(bot) / Ab + g.props.yc
    A = min(At, Ab)
    return A * ctx.material.Fy * (yt - yb) / ctx.f("gamma_M0"), A
