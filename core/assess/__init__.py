"""Assessment: every station of every member, as-built against as-found, under one standard
family (its limit states, factors, load model and rating measure).

Public API::

    from core.assess import assess, AssessOptions
    result = assess(survey, AssessOptions(standard="aashto"))
"""

from core.assess.options import AssessOptions, merged, options_from_dict, read_options_file
from core.assess.results import (
    Assessment,
    Assumption,
    EnvelopeRow,
    LimitState,
    LineSummary,
    MemberResult,
    StationResult,
    SummaryRow,
)
from core.assess.run import assess

__all__ = [
    "AssessOptions",
    "Assessment",
    "Assumption",
    "EnvelopeRow",
    "LimitState",
    "LineSummary",
    "MemberResult",
    "StationResult",
    "SummaryRow",
    "assess",
    "merged",
    "options_from_dict",
    "read_options_file",
]
