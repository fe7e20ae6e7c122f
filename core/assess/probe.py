"""What a station's assessment hands to a caller that evaluates it again with other
thicknesses (the capacity bands, :mod:`core.bands`): the context, the results, the
readings statistics and a function that rates the limit states of another context with the
same loads and factors."""

from __future__ import annotations

from collections.abc import Callable, Sequence
from dataclasses import dataclass
from typing import Any

from core.assess.results import LimitState
from core.families.context import StationContext
from core.survey.readings import RegionStats


@dataclass(frozen=True)
class StationRun:
    """One assessed station, ready to be evaluated again.

    Attributes:
        member, station: the survey's member and station (model objects).
        ctx: the context its limit states were found with. states: those, rated.
        stats: the statistics of its part regions (mm). policy: the thickness basis.
        web_readings: per station of the member, (x, whole-web readings), mm.
        t_web_nominal: the web's nominal thickness, mm. panel: the as-found web panel.
        same_panel: the stations in that panel. rerate: the limit states of another
            context, rated with this station's loads and factors.
    """

    member: Any
    station: Any
    ctx: StationContext
    states: tuple[LimitState, ...]
    stats: tuple[RegionStats, ...]
    policy: str
    web_readings: dict[str, tuple[float, list[float]]]
    t_web_nominal: float
    panel: Any
    same_panel: Sequence[str]
    rerate: Callable[[StationContext], list[LimitState]]
