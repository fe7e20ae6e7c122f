"""Assessment: every station of every member, as-built against as-found, per standard.

Public API::

    from core.assess import assess, AssessOptions
    result = assess(survey, AssessOptions(standard="aashto"))
"""

from core.assess.options import AssessOptions
from core.assess.results import (
    Assessment,
    Assumption,
    LimitState,
    LineSummary,
    MemberResult,
    StationResult,
)
from core.assess.run import assess

__all__ = [
    "AssessOptions",
    "Assessment",
    "Assumption",
    "LimitState",
    "LineSummary",
    "MemberResult",
    "StationResult",
    "assess",
]
