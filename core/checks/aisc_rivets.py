"""Rivets in the AISC family: AISC 360-22 Appendix 5 and Chapter J3 (from memory).

- Shear: Rn = m Ab Fnv, Ab nominal body area (J3.7); rivets of unknown grade taken as
  ASTM A502 Grade 1, Fnv = 25 ksi (172 MPa), phi = 0.75 (Appendix 5, 5.2.6 and its table
  of rivet strengths, Table A-5.3.1 as recalled; from memory).
- Bearing and tearout at the holes (J3.10 in the 2016 numbering; from memory):
  Rn = 1.2 lc t Fu <= 2.4 d t Fu, lc the clear distance to the next hole in the direction of
  the force (pitch - d0), phi = 0.75.
"""

from __future__ import annotations

from collections.abc import Sequence

from core.checks._inputs import Number, internal, stress
from core.checks.results import CapacityResult, CheckValue
from core.checks.rivets import Ply, body_shear, governing, prepared, share_notes
from core.units import to_internal

STANDARD = "AISC 360-22 Specification for Structural Steel Buildings"
EDITION = "2022"
APPENDIX5 = "AISC 360-22 Appendix 5, 5.2.6, Table A-5.3.1 (from memory)"
J3 = "AISC 360-22 J3.7 and J3.10 (from memory)"
PHI = 0.75
FNV_A502_1 = to_internal(25.0, "ksi", "stress")
FNV_SOURCE = f"25 ksi, ASTM A502 Grade 1 for rivets of unknown grade; {APPENDIX5}"


def rivet_resistance(
    *,
    d: Number,
    d0: Number | None,
    m: int,
    pitch: Number,
    plies: Sequence[Ply],
    Fnv: Number = FNV_A502_1,
    Fnv_source: str = FNV_SOURCE,
    phi: float = PHI,
    where: str = "",
) -> CapacityResult:
    """Design strength of one rivet: the least of shear and bearing / tearout on each ply.

    Args:
        d, d0: rivet and hole diameters, mm; m: shear planes; pitch: spacing along the
            line, mm. plies: the plies (measured thickness, Fu, share of the rivet force).
        Fnv: nominal shear stress, MPa (default A502 Grade 1). phi: resistance factor.

    Raises:
        InputError: a value out of range (named), m not 1 to 4, no plies.
    """
    g, plies = prepared(d, d0, m, pitch, plies, where)
    F = stress(Fnv, "Fnv", where=where, high=1000.0)
    phi = internal(phi, "dimensionless", "phi", where=where, low=0.0, high=1.0)
    vals, shear = body_shear(g, F, Fnv_source, phi, J3)
    modes = [shear]
    lc = g.pitch - g.d0
    for p in plies:
        bearing, tear = 2.4 * g.d * p.t * p.Fu, 1.2 * lc * p.t * p.Fu
        Rb, how = (tear, "1.2 lc t Fu") if tear < bearing else (bearing, "2.4 d t Fu")
        Rb /= p.share
        vals.append(
            CheckValue(
                f"Rn,bearing {p.name}",
                Rb,
                "force",
                f"bearing / tearout {how} / share {p.share:g} on {p.name} (t = {p.t:.3g} mm)",
                J3,
            )
        )
        modes.append((phi * Rb, Rb, phi, f"bearing on {p.name}"))
    return governing(
        modes,
        values=vals,
        notes=share_notes(g, plies),
        standard=STANDARD,
        edition=EDITION,
        clause="Appendix 5, 5.2.6; J3.7; J3.10 (from memory)",
    )
