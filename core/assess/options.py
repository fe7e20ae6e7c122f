"""What the engineer chooses for an assessment: standard, depth basis, policies, factors."""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Literal

from core.checks import STANDARDS
from core.checks.flags import FlagThresholds
from core.checks.rating import RatingFactors
from core.errors import InputError

DepthBasis = Literal["auto", "web", "rivet_lines"]
RIVET_STATES = ("sound", "loose", "missing", "headless")


@dataclass(frozen=True)
class AssessOptions:
    """Choices of the engineer for one assessment (all have defaults).

    Attributes:
        standard: key of :data:`core.checks.STANDARDS`; ``None`` takes the survey's.
        depth_basis: web depth used by the shear check: ``"web"`` (web plate depth),
            ``"rivet_lines"`` (distance between the web-to-flange rivet lines; AISC 360-22
            G2.1 for built-up sections) or ``"auto"`` (rivet lines for AISC, web plate
            depth otherwise).
        thickness_policy: ``"mean"`` (default) or ``"minimum"`` reading for A, I and Q.
        effective_states: rivet states counted as effective (default only sound rivets).
        gap_window: half-width (mm) of the stretch of a rivet line around a station whose
            longest effective gap governs there; ``None`` takes the web depth.
        rating: rating factors (condition, system, load factors).
        thresholds: flag thresholds.

    Raises:
        InputError: unknown standard, basis, policy or rivet state.
    """

    standard: str | None = None
    depth_basis: DepthBasis = "auto"
    thickness_policy: Literal["mean", "minimum"] = "mean"
    effective_states: tuple[str, ...] = ("sound",)
    gap_window: float | None = None
    rating: RatingFactors = field(default_factory=RatingFactors)
    thresholds: FlagThresholds = field(default_factory=FlagThresholds)

    def __post_init__(self) -> None:
        if self.standard is not None and self.standard not in STANDARDS:
            raise InputError(
                f"unknown standard {self.standard!r}; known standards: {sorted(STANDARDS)}"
            )
        if self.depth_basis not in ("auto", "web", "rivet_lines"):
            raise InputError(
                f"depth basis {self.depth_basis!r} is not 'auto', 'web' or 'rivet_lines'"
            )
        if self.thickness_policy not in ("mean", "minimum"):
            raise InputError(
                f"thickness policy {self.thickness_policy!r} is not 'mean' or 'minimum'"
            )
        object.__setattr__(self, "effective_states", tuple(self.effective_states))
        bad = [s for s in self.effective_states if s not in RIVET_STATES]
        if bad or not self.effective_states:
            raise InputError(
                f"effective rivet states {list(self.effective_states)} must be a non-empty "
                f"subset of {list(RIVET_STATES)}"
            )
        if self.gap_window is not None and not (0.0 < float(self.gap_window) < 1e6):
            raise InputError(f"gap window {self.gap_window!r} mm is outside (0, 1e6) mm")
