"""Findings of survey validation: errors, warnings and notes, as plain objects.

Validation never stops at the first finding; it returns every :class:`Problem` it sees,
each naming the value, the allowed range and the place (member, station, part, reading).
Errors make a survey unusable for assessment; warnings and notes are shown to the
engineer and kept in the report.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Literal

from core.errors import InputError

Level = Literal["error", "warning", "note"]
LEVELS: tuple[Level, ...] = ("error", "warning", "note")


@dataclass(frozen=True)
class Problem:
    """One finding: ``level`` ("error", "warning" or "note"), ``message`` and ``where``."""

    level: Level
    message: str
    where: str = ""

    def __post_init__(self) -> None:
        if self.level not in LEVELS:
            raise ValueError(f"level {self.level!r} is not one of {LEVELS}")

    def __str__(self) -> str:
        return (
            f"{self.level}: {self.where}: {self.message}"
            if self.where
            else (f"{self.level}: {self.message}")
        )


def errors(problems: list[Problem] | tuple[Problem, ...]) -> list[Problem]:
    """The error-level findings of ``problems``."""
    return [p for p in problems if p.level == "error"]


def raise_errors(problems: list[Problem] | tuple[Problem, ...], what: str = "input") -> None:
    """Raise :class:`InputError` listing every error-level finding (warnings are ignored)."""
    errs = errors(problems)
    if len(errs) == 1:
        raise InputError(errs[0].message, where=errs[0].where)
    if errs:
        lines = "; ".join(f"{p.where}: {p.message}" if p.where else p.message for p in errs)
        raise InputError(f"{len(errs)} error(s) in the {what}: {lines}")
