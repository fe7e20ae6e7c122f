"""The coordinate grid of the section engine (mm).

Coordinates are snapped to :data:`GRID` so that touching parts built from floating-point
sums neither overlap by an ulp nor leave 1-ulp gaps.
"""

from __future__ import annotations

import numpy as np

#: coordinates are snapped to this grid (mm)
GRID = 1e-9
#: tolerance (mm) on thickness above nominal and on ranges given in a loss
TOL = 1e-6


def snap(v: np.ndarray | float) -> np.ndarray:
    """``v`` (mm) rounded to the grid."""
    return np.round(np.asarray(v, dtype=float) / GRID) * GRID
