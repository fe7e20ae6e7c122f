"""Rivets in the EN 1993 family: EN 1993-1-8:2005 Table 3.4 (from memory).

- Shear resistance per shear plane: Fv,Rd = 0.6 f_ur A0 / gamma_M2, A0 the area of the rivet
  hole (the driven rivet fills it).
- Bearing: Fb,Rd = k1 alpha_b fu d t / gamma_M2, as for bolts, with
  alpha_b = min(alpha_d, f_ur / fu, 1.0), alpha_d = p1 / (3 d0) - 1/4 for inner rivets in the
  direction of the force (the rivets of a flange line transfer shear flow along the member,
  so every rivet is an inner one there), and k1 = min(2.8 e2 / d0 - 1.7, 2.5) for a line at
  an edge (a single line is both edges' line), e2 the edge distance across the force. The
  nominal diameter d is used for bearing (below d0: conservative).
- gamma_M2 = 1.25 for bridges (EN 1993-2 Table 6.1, from memory).
"""

from __future__ import annotations

from collections.abc import Sequence

from core.checks._inputs import Number, internal, stress
from core.checks.results import CapacityResult, CheckValue
from core.checks.rivets import (
    Ply,
    circle_area,
    geometry_values,
    governing,
    prepared,
    share_notes,
)

STANDARD = "EN 1993-1-8 Design of steel structures: design of joints"
EDITION = "2005"
TABLE = "EN 1993-1-8:2005 Table 3.4 (from memory)"
GAMMA_M2 = 1.25
F_UR_DEFAULT = 330.0
F_UR_SOURCE = (
    "330 MPa for rivet steel of unknown grade: about the least tensile strength of early rivet "
    "steels (from memory), asfound's conservative assumption; engineer to set from records or "
    "tests"
)


def k1_edge(e2: float | None, d0: float) -> tuple[float, str]:
    """k1 of Table 3.4 for a line at an edge: min(2.8 e2/d0 - 1.7, 2.5); e2 unknown: the
    smallest k1 that Table 3.4's minimum edge distance e2 = 1.2 d0 gives (1.66)."""
    if e2 is None:
        return 2.8 * 1.2 - 1.7, "e2 not known: taken as the minimum 1.2 d0 (conservative)"
    return min(2.8 * e2 / d0 - 1.7, 2.5), f"e2 = {e2:.4g} mm"


def rivet_resistance(
    *,
    d: Number,
    d0: Number | None,
    m: int,
    pitch: Number,
    plies: Sequence[Ply],
    f_ur: Number = F_UR_DEFAULT,
    f_ur_source: str = F_UR_SOURCE,
    gamma_M2: float = GAMMA_M2,
    where: str = "",
) -> CapacityResult:
    """Design resistance of one rivet: the least of shear and bearing on each ply.

    Args:
        d, d0: rivet and hole diameters, mm; m: shear planes; pitch: p1, mm.
        plies: the plies (measured thickness t, fu, share of the rivet force, edge distance
            e2 across the force).
        f_ur: ultimate tensile strength of the rivet, MPa. gamma_M2: partial factor.

    Raises:
        InputError: a value out of range (named), m not 1 to 4, no plies, or a value of
            2.8 e2 / d0 - 1.7 that is not positive (edge distance far below the rules).
    """
    g, plies = prepared(d, d0, m, pitch, plies, where)
    fur = stress(f_ur, "f_ur", where=where, high=1500.0)
    gM2 = internal(gamma_M2, "dimensionless", "gamma_M2", where=where, low=0.5, high=2.0)
    A0 = circle_area(g.d0)
    Fv = g.m * 0.6 * fur * A0
    vals = geometry_values(g, A0, "area of the rivet hole A0 = pi d0²/4", TABLE)
    vals += [
        CheckValue("f_ur", fur, "stress", "ultimate tensile strength of the rivet", f_ur_source),
        CheckValue("Fv,Rk", Fv, "force", "shear m x 0.6 f_ur A0", TABLE),
        CheckValue("gamma_M2", gM2, "dimensionless", "partial factor", "EN 1993-2 Table 6.1"),
    ]
    phi = 1.0 / gM2
    modes = [(phi * Fv, Fv, phi, "shear")]
    alpha_d = g.pitch / (3.0 * g.d0) - 0.25
    vals.append(CheckValue("alpha_d", alpha_d, "dimensionless", "p1/(3 d0) - 1/4, inner", TABLE))
    notes = [f"1/gamma_M2 = {phi:.3g} is reported as phi"]
    for p in plies:
        k1, why = k1_edge(p.e2, g.d0)
        alpha_b = min(alpha_d, fur / p.Fu, 1.0)
        if k1 <= 0.0 or alpha_b <= 0.0:
            Fb = 0.0
            notes.append(f"{p.name}: k1 or alpha_b not positive ({why}): no bearing resistance")
        else:
            Fb = k1 * alpha_b * p.Fu * g.d * p.t / p.share
        vals.append(
            CheckValue(
                f"Fb,Rk {p.name}",
                Fb,
                "force",
                f"bearing k1 alpha_b fu d t / share on {p.name}: k1 = {k1:.3g} ({why}), "
                f"alpha_b = {alpha_b:.3g}, t = {p.t:.3g} mm, share {p.share:g}",
                TABLE,
            )
        )
        modes.append((phi * Fb, Fb, phi, f"bearing on {p.name}"))
    notes += share_notes(g, plies)
    return governing(
        modes,
        values=vals,
        notes=notes,
        standard=STANDARD,
        edition=EDITION,
        clause="Table 3.4, rivets (shear) and bearing (from memory)",
    )
