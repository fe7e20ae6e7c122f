"""Rivets in the AASHTO family: the bridge evaluation manual's rivet shear, LRFD bearing.

- Shear: Rn = m Ab Fnv per rivet (Ab nominal body area), with Fnv from the rivet table of the
  AASHTO Manual for Bridge Evaluation, 3rd edition (2018), 6A.6.12.5.1 and Table
  6A.6.12.5.1-1, for rivets of unknown grade by the year the structure was built; phi = 0.80
  (6A.6.12.5.1). All from memory. The table's values are not recalled with certainty: the
  defaults here are the **lowest** values recalled (18 ksi for rivets driven before 1936 or
  of unknown origin, 27 ksi from 1936, ASTM A141 / A502 Grade 1), conservative; the
  engineer confirms them against the manual (or enters Fnv).
- Bearing on each ply: AASHTO LRFD 9th edition (2020) 6.13.2.9 for standard holes:
  Rn = 2.4 d t Fu where the clear distance between holes and to the end is at least 2.0 d,
  else Rn = 1.2 Lc t Fu; phi_bb = 0.80 (6.5.4.2). From memory.
"""

from __future__ import annotations

from collections.abc import Sequence

from core.checks._inputs import Number, internal, stress
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.checks.rivets import Ply, body_shear, governing, prepared, share_notes
from core.units import to_internal

STANDARD = "AASHTO Manual for Bridge Evaluation / AASHTO LRFD Bridge Design Specifications"
EDITION = "3rd edition (2018) / 9th edition (2020)"
MBE_RIVETS = "AASHTO MBE 3rd ed. (2018), 6A.6.12.5.1, Table 6A.6.12.5.1-1 (from memory)"
BEARING = "AASHTO LRFD 9th ed. (2020), 6.13.2.9 (from memory)"
PHI_RIVET = 0.80
PHI_BEARING = 0.80


def rivet_Fnv(year_built: int | None) -> tuple[float, str]:
    """Nominal rivet shear stress (MPa) for rivets of unknown grade, by year built.

    Returns:
        (Fnv, source words). Before 1936 or year unknown: 18 ksi; from 1936: 27 ksi (the
        lowest values recalled of the manual's table; from memory, conservative).
    """
    if year_built is None or year_built < 1936:
        why = "year built unknown" if year_built is None else f"built {year_built}, before 1936"
        return to_internal(18.0, "ksi", "stress"), (
            f"18 ksi, rivets driven before 1936 or of unknown origin ({why}); {MBE_RIVETS}; "
            "lowest value recalled, conservative: engineer to confirm"
        )
    return to_internal(27.0, "ksi", "stress"), (
        f"27 ksi, rivets from 1936 (ASTM A141 / A502 Grade 1; built {year_built}); "
        f"{MBE_RIVETS}; lowest value recalled, conservative: engineer to confirm"
    )


def rivet_resistance(
    *,
    d: Number,
    d0: Number | None,
    m: int,
    pitch: Number,
    plies: Sequence[Ply],
    Fnv: Number,
    Fnv_source: str = ENGINEER,
    phi: float = PHI_RIVET,
    phi_bb: float = PHI_BEARING,
    where: str = "",
) -> CapacityResult:
    """Factored resistance of one rivet: the least of shear and bearing on each ply.

    Args:
        d: nominal rivet diameter, mm; d0: hole diameter, mm; m: shear planes;
        pitch: nominal rivet spacing along the line, mm (clear distance Lc = pitch - d0).
        plies: the plies with their measured thickness, Fu and share of the rivet force.
        Fnv: nominal shear stress of the rivet, MPa (see :func:`rivet_Fnv`).
        phi: resistance factor for rivets in shear; phi_bb: for bearing.

    Raises:
        InputError: a value out of range (named), m not 1 to 4, no plies.
    """
    g, plies = prepared(d, d0, m, pitch, plies, where)
    F = stress(Fnv, "Fnv", where=where, high=1000.0)
    phi = internal(phi, "dimensionless", "phi", where=where, low=0.0, high=1.0)
    phi_bb = internal(phi_bb, "dimensionless", "phi_bb", where=where, low=0.0, high=1.0)
    vals, shear = body_shear(g, F, Fnv_source, phi, MBE_RIVETS)
    modes = [shear]
    Lc = g.pitch - g.d0
    for p in plies:
        if Lc >= 2.0 * g.d:
            Rb, how = 2.4 * g.d * p.t * p.Fu, "2.4 d t Fu"
        else:
            Rb, how = 1.2 * Lc * p.t * p.Fu, "1.2 Lc t Fu (clear distance below 2d)"
        Rb /= p.share
        vals.append(
            CheckValue(
                f"Rn,bearing {p.name}",
                Rb,
                "force",
                f"bearing {how} / share {p.share:g} on {p.name} (t = {p.t:.3g} mm)",
                BEARING,
            )
        )
        modes.append((phi_bb * Rb, Rb, phi_bb, f"bearing on {p.name}"))
    vals.append(
        CheckValue("phi_bb", phi_bb, "dimensionless", "resistance factor, bearing", BEARING)
    )
    return governing(
        modes,
        values=vals,
        notes=share_notes(g, plies),
        standard=STANDARD,
        edition=EDITION,
        clause="MBE 6A.6.12.5.1 (rivet shear, phi 0.80); LRFD 6.13.2.9 (bearing) (from memory)",
    )
