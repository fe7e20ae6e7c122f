"""EN 1993 member buckling: the reduction factor chi, epsilon, and the bridge partial factors.

- EN 1993-1-1:2005 6.3.1.2(1): chi = 1 / (Phi + sqrt(Phi² - lambda²)) <= 1 (6.49),
  Phi = 0.5 [1 + alpha (lambda - 0.2) + lambda²]; Table 6.1 imperfection factors
  a0 0.13, a 0.21, b 0.34, c 0.49, d 0.76.
- 6.3.2.2(1) lateral-torsional buckling, general case: the same form with alpha_LT
  (Table 6.3, the same numbers for curves a to d) and lambda_LT,0 = 0.2.
- epsilon = sqrt(235 / fy), fy in MPa (Table 5.2).
- Partial factors for bridges, EN 1993-2:2006 6.1 Table 6.1 recommended values (the National
  Annex may differ): gamma_M0 = 1.00, gamma_M1 = 1.10; EN 1993-1-9 Table 3.1 for fatigue.

Clause numbers and values from memory.
"""

from __future__ import annotations

import math

from core.checks.sources import EN_1993_2, choice
from core.errors import InputError

#: imperfection factors, EN 1993-1-1 Table 6.1 (and Table 6.3 for LTB; from memory)
ALPHA: dict[str, float] = {"a0": 0.13, "a": 0.21, "b": 0.34, "c": 0.49, "d": 0.76}
#: partial factor for cross-section resistance, bridges, EN 1993-2 Table 6.1 (from memory)
GAMMA_M0 = 1.00
#: partial factor for member instability, bridges, EN 1993-2 Table 6.1 (from memory)
GAMMA_M1 = 1.10
#: modulus of elasticity, EN 1993-1-1 3.2.6 (from memory)
E_STEEL = 210_000.0
#: shear modulus G = E / (2 (1 + nu)) = 81 000 MPa, EN 1993-1-1 3.2.6 (from memory)
G_STEEL = 81_000.0

GAMMA_SOURCE = EN_1993_2.ref("6.1, Table 6.1 (recommended value; the National Annex may differ)")


def epsilon(fy: float) -> float:
    """epsilon = sqrt(235 / fy), fy in MPa (EN 1993-1-1 Table 5.2)."""
    if not fy > 0.0 or not math.isfinite(fy):
        raise InputError(f"fy = {fy!r} MPa must be a positive finite number")
    return math.sqrt(235.0 / fy)


def alpha_of(curve: str, *, where: str = "") -> float:
    """Imperfection factor of buckling curve ``curve`` (Table 6.1).

    Raises:
        InputError: unknown curve.
    """
    return ALPHA[choice(curve, tuple(ALPHA), "buckling curve", where=where)]


def chi(lam: float, alpha: float, lam0: float = 0.2) -> tuple[float, float]:
    """``(chi, Phi)`` of EN 1993-1-1 6.3.1.2 (and 6.3.2.2 with lam0 = 0.2), chi <= 1."""
    if not lam >= 0.0 or not math.isfinite(lam):
        raise InputError(f"non-dimensional slenderness {lam!r} must be finite and >= 0")
    phi = 0.5 * (1.0 + alpha * (lam - lam0) + lam * lam)
    value = 1.0 / (phi + math.sqrt(max(phi * phi - lam * lam, 0.0)))
    return min(value, 1.0), phi
