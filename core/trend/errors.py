"""The error of repeat surveys that cannot be compared."""

from __future__ import annotations

from core.errors import InputError


class TrendError(InputError):
    """Surveys that cannot be put in one series: different structures, dates missing, out
    of order or equal, a station or part that cannot be matched, nominal thicknesses that
    differ. The message names the file, member and station."""
