"""The result of a fatigue check of one detail: infinite life, or the estimated lives.

Shared by :mod:`core.checks.aashto_fatigue` and :mod:`core.checks.en1993_fatigue`; each
cites only its own family.
"""

from __future__ import annotations

import math
from collections.abc import Iterable
from dataclasses import dataclass
from typing import TYPE_CHECKING

if TYPE_CHECKING:
    from core.checks.sources import Document

from core.checks.results import CapacityResult, CheckValue
from core.errors import InputError


@dataclass(frozen=True)
class FatigueResult(CapacityResult):
    """Fatigue of one detail.

    ``Rn`` is the stress range the detail takes for an infinite life (MPa; for EN 1993 the
    constant amplitude fatigue limit over gamma_Mf), ``kind`` is ``"stress"``.

    Adds:
        infinite_life: the stress ranges stay below the infinite-life limit.
        total_life: estimated total fatigue life, years (``None`` with infinite life).
        remaining_life: total life less the age, years (may be negative: the estimated
            life is spent; ``None`` with infinite life).
    """

    infinite_life: bool = False
    total_life: float | None = None
    remaining_life: float | None = None

    def __post_init__(self) -> None:
        super().__post_init__()
        for name in ("total_life", "remaining_life"):
            v = getattr(self, name)
            if v is not None and not math.isfinite(float(v)):
                raise InputError(f"{self.limit_state}: {name} = {v!r} must be finite or None")
        if self.infinite_life and (self.total_life is not None or self.remaining_life is not None):
            raise InputError(f"{self.limit_state}: an infinite life has no total or remaining life")


def fatigue_result(
    doc: Document,
    clause: str,
    Rn: float,
    values: Iterable[CheckValue],
    notes: Iterable[str],
    infinite: bool,
    total: float | None,
    remaining: float | None,
) -> FatigueResult:
    """A :class:`FatigueResult` of a riveted detail citing ``doc`` (clause from memory)."""
    return FatigueResult(
        limit_state="fatigue (riveted detail)",
        standard=doc.name,
        edition=doc.edition,
        clause=f"{clause} (from memory)",
        Rn=Rn,
        phi=1.0,
        kind="stress",
        values=tuple(values),
        notes=tuple(notes),
        infinite_life=infinite,
        total_life=total,
        remaining_life=remaining,
    )
