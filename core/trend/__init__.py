"""Repeat surveys of one structure: loss rates per part region and the years left.

Pure computation, no output: :func:`core.trend.run.trend` matches the surveys
(:mod:`match`), fits a rate of loss to every part region (:mod:`rates`), and re-runs the real
assessment engine on projected surveys (:mod:`project`) to find the year each limit state's
measure crosses 1 and the engineer's flag thresholds (:mod:`crossing`).

Public API::

    from core.trend import trend, TrendError
    result = trend(["2019.json", "2025.json"], model="linear")
"""

from core.trend.errors import TrendError
from core.trend.run import TrendResult, trend

__all__ = ["TrendError", "TrendResult", "trend"]
