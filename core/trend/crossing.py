"""When a limit state's measure crosses 1 and the engineer's flag thresholds.

The measure is the family's (rating factor RF, higher is better; demand / capacity or
utilisation, lower is better). Its targets are 1 and the three flag thresholds of
:class:`core.checks.flags.FlagThresholds` (``rf_*`` for a rating factor, ``util_*`` for the
others), each named by the level it starts. The engine is run at steps ``dt`` years after
the latest survey; between two steps the measure is interpolated linearly (stated in the
report with the step).
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

from core.checks.flags import FlagThresholds, Level
from core.trend.errors import TrendError

#: statuses of a crossing
ALREADY, CROSSES, BEYOND, ENDED = "already", "crosses", "beyond horizon", "projection ended"


@dataclass(frozen=True)
class Target:
    """A value of the measure to watch for and what it means in words."""

    value: float
    label: str

    def __post_init__(self) -> None:
        if not math.isfinite(self.value):
            raise TrendError(f"target {self.value!r} is not finite")


def targets(symbol: str, th: FlagThresholds) -> tuple[Target, ...]:
    """1 and the flag thresholds of a measure, mildest first (equal values merged)."""
    rf = symbol == "RF"
    if rf:
        raw = [
            (th.rf_watch, Level.WATCH.label),
            (1.0, f"{symbol} = 1"),
            (th.rf_review, Level.REVIEW.label),
            (th.rf_urgent, Level.URGENT.label),
        ]
    else:
        raw = [
            (th.util_watch, Level.WATCH.label),
            (th.util_review, Level.REVIEW.label),
            (1.0, f"{symbol} = 1"),
            (th.util_urgent, Level.URGENT.label),
        ]
    merged: dict[float, list[str]] = {}
    for v, lab in raw:
        merged.setdefault(float(v), []).append(lab)
    order = sorted(merged, reverse=rf)
    return tuple(Target(v, " / ".join(merged[v])) for v in order)


def first_crossing(
    dts: Sequence[float],
    values: Sequence[float | None],
    target: float,
    higher_is_better: bool,
    *,
    ended: bool = False,
) -> tuple[str, float | None]:
    """The status and the years after the latest survey when ``values`` first pass
    ``target`` (linear between steps).

    Args:
        dts: rising years after the latest survey, the first 0. values: the measure at each
            (None: not rated there, which ends the series).
        ended: the projection stopped after the last step (a region lost, the engine
            refused the section) before the horizon.

    Returns:
        ("already", 0.0), ("crosses", dt), ("beyond horizon", None) or
        ("projection ended", dt of the last step with a value).
    """
    if len(dts) != len(values) or not dts:
        raise TrendError("a crossing needs one value per step")

    def worse(v: float) -> bool:
        # as the flags grade (core.checks.flags._grade): RF below, utilisation at or above
        return v < target if higher_is_better else v >= target

    prev_t, prev_v = None, None
    for t, v in zip(dts, values, strict=True):
        if v is None:
            return (ENDED, prev_t) if prev_t is not None else (ENDED, None)
        if worse(v):
            if prev_v is None:
                return ALREADY, 0.0
            frac = (target - prev_v) / (v - prev_v) if v != prev_v else 1.0
            return CROSSES, prev_t + min(max(frac, 0.0), 1.0) * (t - prev_t)
        prev_t, prev_v = t, v
    return (ENDED, prev_t) if ended else (BEYOND, None)


@dataclass(frozen=True)
class Crossing:
    """When one target is crossed: central ``status``/``dt``, and the band from the fast
    (``dt_early``) and slow (``dt_late``) rates (None: not within the projection)."""

    target: Target
    status: str
    dt: float | None
    dt_early: float | None = None
    dt_late: float | None = None
    status_early: str = ""
    status_late: str = ""

    def __post_init__(self) -> None:
        if self.status not in (ALREADY, CROSSES, BEYOND, ENDED):
            raise TrendError(f"unknown crossing status {self.status!r}")
