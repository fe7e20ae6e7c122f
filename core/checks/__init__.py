"""Capacity checks, one module per clause or topic, pure functions on scalars in internal
units (N, mm, MPa; strings with units accepted). Each takes its resistance or partial
factors as parameters: the standard family (:mod:`core.families`) hands them over.

- web shear: ``aashto_shear`` (LRFD 6.10.9), ``aisc_shear`` (360-22 G2), ``en1993_shear``
  (1-5 5.2-5.3) with ``en1993_interaction`` (1-5 5.4 and 7.1); local loss ``web_local_shear``
- flexure: ``flexure`` (LRFD 6.10.8, 6.10.1.8), ``aisc_flange_yield`` (F4 / F5, F13.1),
  ``en1993_bending`` (1-1 5.5, 6.2.5; 1-5 4.4)
- rivets: ``rivets`` (plies, gaps), ``aashto_rivets``, ``aisc_rivets``, ``en1993_rivets``
- ``material`` (steel by year built), ``flags``, ``results``
"""

from core.checks.aashto_shear import PANELS, Panel
from core.checks.results import CapacityResult, CheckValue, ShearResult

__all__ = ["PANELS", "CapacityResult", "CheckValue", "Panel", "ShearResult"]
