"""Capacity bands: how sure the as-found capacities and ratings are, given the readings.

Each part region's as-found thickness has a standard deviation from the instrument's
tolerance and the standard error of its readings' mean (:mod:`core.bands.sigma`); the
station's limit states are evaluated again through the engine with the thicknesses moved
(:mod:`core.bands.station`) and the spread propagated to every capacity and measure
(:mod:`core.bands.propagate`: first order by finite differences, or Monte Carlo with a
fixed seed); :mod:`core.bands.advice` ranks where more readings would narrow the band most.
:func:`core.bands.run.assess_with_bands` runs it all with one assessment.

The band is an aid to judge whether a result is settled by the readings; it is not a
reliability rating (no model, load or material uncertainty is in it).
"""

from core.bands.options import BandOptions
from core.bands.propagate import Band
from core.bands.run import MemberBands, StationBands, SurveyBands, assess_with_bands

__all__ = [
    "Band",
    "BandOptions",
    "MemberBands",
    "StationBands",
    "SurveyBands",
    "assess_with_bands",
]
