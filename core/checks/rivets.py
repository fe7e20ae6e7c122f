"""Rivets: resistance of one rivet, the force each rivet carries, and the gaps in a line.

- Shear: Rn = m Ab Fnv, Ab = pi d²/4 (nominal body area), m shear planes.
- Bearing on each pierced ply: Rn = 2.4 d t Fu on the measured thickness (AASHTO LRFD
  6.13.2.9, standard holes; from memory). A ply that bears only part of the rivet force
  (an outer ply of a double-shear rivet bears half) is given its ``share``; the default
  share 1.0 is conservative.
- Rivets of unknown grade: ASTM A502 Grade 1, Fnv = 25 ksi (172 MPa), Fnt = 45 ksi
  (310 MPa), phi = 0.75 (AISC 360-22 Appendix 5, Table A-5.3.1, from memory).
- Force per rivet from the shear flow q: F = q gap / n_lines, gap the longest distance
  between consecutive effective rivets of a line. Where the rivets at an end of a line are
  lost, the last effective rivet serves the uncovered end stretch too: use
  :attr:`LineGaps.governing_length` (the larger of the longest gap and the longest stretch
  served by one rivet) as the gap.
"""

from __future__ import annotations

import itertools
import math
from collections.abc import Iterable, Sequence
from dataclasses import dataclass
from typing import Literal

from core.checks._inputs import Number, internal, length, stress
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.errors import InputError
from core.units import to_internal

RivetState = Literal["sound", "loose", "missing", "headless"]
RIVET_STATES: tuple[str, ...] = ("sound", "loose", "missing", "headless")
A502_SOURCE = "AISC 360-22 Appendix 5, Table A-5.3.1 (from memory)"
BEARING_SOURCE = "AASHTO LRFD 6.13.2.9, Rn = 2.4 d t Fu (from memory)"


@dataclass(frozen=True)
class RivetMaterial:
    """Rivet steel: nominal shear and tension stresses (MPa) and the resistance factor."""

    name: str
    Fnv: float
    Fnt: float
    phi: float = 0.75
    source: str = ENGINEER

    def __post_init__(self) -> None:
        w = f"rivet material {self.name!r}"
        object.__setattr__(self, "Fnv", stress(self.Fnv, "Fnv", where=w, high=1000.0))
        object.__setattr__(self, "Fnt", stress(self.Fnt, "Fnt", where=w, high=1500.0))
        phi = internal(self.phi, "dimensionless", "phi", where=w, low=0.0, high=1.0)
        object.__setattr__(self, "phi", phi)


#: default for rivets of unknown grade
A502_GRADE_1 = RivetMaterial(
    "ASTM A502 Grade 1",
    Fnv=to_internal(25.0, "ksi", "stress"),
    Fnt=to_internal(45.0, "ksi", "stress"),
    phi=0.75,
    source=A502_SOURCE,
)


@dataclass(frozen=True)
class Ply:
    """A plate the rivet passes through: measured thickness t (mm), Fu (MPa), force share."""

    name: str
    t: float
    Fu: float
    share: float = 1.0

    def __post_init__(self) -> None:
        w = f"ply {self.name!r}"
        object.__setattr__(self, "t", length(self.t, "t", where=w))
        object.__setattr__(self, "Fu", stress(self.Fu, "Fu", where=w))
        s = internal(self.share, "dimensionless", "share", where=w, low=0.0, high=1.0)
        object.__setattr__(self, "share", s)


def rivet_resistance(
    *,
    d: Number,
    m: int,
    plies: Sequence[Ply],
    material: RivetMaterial = A502_GRADE_1,
    phi_bearing: float = 0.75,
    where: str = "",
) -> CapacityResult:
    """Resistance of one rivet: the smaller of shear and bearing on each ply (factored).

    Args:
        d: nominal rivet diameter, mm. m: number of shear planes (1 to 4).
        plies: the plies the rivet passes through, with measured thickness.
        material: rivet steel (default ASTM A502 Grade 1).
        phi_bearing: resistance factor for bearing (default 0.75, AISC 360-22 J3;
            AASHTO LRFD 6.5.4.2 gives 0.80 for bearing on material; from memory).
        where: location for error messages.

    Returns:
        A :class:`CapacityResult` whose ``Rn`` and ``phi`` are those of the governing
        mode; all modes appear in ``values``.

    Raises:
        InputError: d out of range, m not 1 to 4, no plies, or a ply out of range.
    """
    d = length(d, "d", where=where)
    if isinstance(m, bool) or not isinstance(m, int) or not 1 <= m <= 4:
        raise InputError(
            f"m = {m!r} shear planes is outside the allowed range (1 to 4)", where=where
        )
    plies = tuple(plies)
    if not plies:
        raise InputError("at least one ply is needed for the bearing check", where=where)
    phi_b = internal(phi_bearing, "dimensionless", "phi_bearing", where=where, low=0.0, high=1.0)
    Ab = math.pi * d**2 / 4.0
    Rv = m * Ab * material.Fnv
    vals = [
        CheckValue("d", d, "length", "nominal rivet diameter", ENGINEER),
        CheckValue("m", m, "dimensionless", "shear planes", ENGINEER),
        CheckValue("Ab", Ab, "area", "nominal body area pi d²/4", "AISC 360-22 J3.7"),
        CheckValue(
            "Fnv", material.Fnv, "stress", f"nominal shear stress, {material.name}", material.source
        ),
        CheckValue("Rn,shear", Rv, "force", "shear m Ab Fnv", "AISC 360-22 J3.7"),
    ]
    modes: list[tuple[float, float, str]] = [(material.phi * Rv, Rv, "shear")]
    for p in plies:
        Rb = 2.4 * d * p.t * p.Fu / p.share
        vals.append(
            CheckValue(
                f"Rn,bearing {p.name}",
                Rb,
                "force",
                f"bearing 2.4 d t Fu / share on {p.name} (t = {p.t:g} mm)",
                BEARING_SOURCE,
            )
        )
        modes.append((phi_b * Rb, Rb, f"bearing on {p.name}"))
    _, Rn, gov = min(modes, key=lambda x: x[0])
    phi = material.phi if gov == "shear" else phi_b
    notes = [f"governing: {gov}", f"rivet material {material.name} ({material.source})"]
    if all(p.share == 1.0 for p in plies) and m > 1:
        notes.append("each ply assumed to bear the whole rivet force (conservative)")
    return CapacityResult(
        limit_state=f"rivet ({gov})",
        standard="AISC 360-22 / AASHTO LRFD",
        edition="2022 / 9th edition (2020)",
        clause="Appendix 5 Table A-5.3.1; J3.7; AASHTO 6.13.2.9 (from memory)",
        Rn=Rn,
        phi=phi,
        kind="force",
        values=tuple(vals),
        notes=tuple(notes),
    )


def rivet_force(q: Number, gap: Number, n_lines: int = 1, *, where: str = "") -> CheckValue:
    """Force on one rivet, F = q gap / n_lines, N.

    Args:
        q: shear flow across the interface, N/mm (>= 0; give the magnitude).
        gap: longest distance between consecutive effective rivets, mm.
        n_lines: number of rivet lines sharing the shear flow (1 to 8).

    Raises:
        InputError: q negative, gap not positive, or n_lines outside 1 to 8.
    """
    qv = internal(q, "force_per_length", "q", where=where, low=0.0, low_inclusive=True)
    g = length(gap, "gap", where=where)
    if isinstance(n_lines, bool) or not isinstance(n_lines, int) or not 1 <= n_lines <= 8:
        raise InputError(
            f"n_lines = {n_lines!r} is outside the allowed range (1 to 8)", where=where
        )
    return CheckValue(
        "F",
        qv * g / n_lines,
        "force",
        "force per rivet q gap / n_lines",
        "mechanics of built-up beams (q = VQ/I), common practice",
    )


@dataclass(frozen=True)
class LineGaps:
    """The effective rivets of one line and the longest gap between them.

    Attributes:
        positions: all rivet positions along the member, sorted, mm.
        states: the state of each, in the same order.
        effective: the states counted as effective.
        effective_positions: positions of the effective rivets.
        longest_gap: the longest distance between consecutive effective rivets, mm, or
            ``None`` when fewer than two rivets are effective (no load path).
        gap_from, gap_to: where the longest gap starts and ends, mm (``None`` likewise).
        n_ineffective: how many rivets do not count.
        longest_tributary: the longest stretch of the line served by one effective rivet
            (from half-way to its effective neighbour, or from the line's first / last
            rivet position when the rivets beyond it are ineffective), mm, or ``None``.

    ``longest_gap`` alone can shrink when an end rivet of the line is lost (the gap it
    closed disappears while an uncovered end stretch appears); :attr:`governing_length`,
    the larger of the two, never does, and bounds the length each rivet serves.
    """

    positions: tuple[float, ...]
    states: tuple[str, ...]
    effective: tuple[str, ...]
    effective_positions: tuple[float, ...]
    longest_gap: float | None
    gap_from: float | None
    gap_to: float | None
    n_ineffective: int
    longest_tributary: float | None = None

    @property
    def governing_length(self) -> float | None:
        """max(longest_gap, longest_tributary), mm: the length to multiply q by for the
        force on the most loaded rivet (``None``: no effective load path)."""
        if self.longest_gap is None or self.longest_tributary is None:
            return None
        return max(self.longest_gap, self.longest_tributary)

    @property
    def has_load_path(self) -> bool:
        return self.longest_gap is not None

    @property
    def finding(self) -> str:
        """A sentence for the report."""
        if self.longest_gap is None:
            return (
                f"no effective load path: {len(self.effective_positions)} effective "
                f"rivet(s) of {len(self.positions)}"
            )
        return (
            f"{self.n_ineffective} of {len(self.positions)} rivets not effective; longest "
            f"gap {self.longest_gap:g} mm from {self.gap_from:g} to {self.gap_to:g} mm"
        )


def line_gaps(
    positions: Iterable[Number],
    states: Iterable[str],
    *,
    effective: Iterable[str] = ("sound",),
    where: str = "",
) -> LineGaps:
    """Effective rivets along a line and the longest gap between consecutive ones.

    Args:
        positions: position of each rivet along the member, mm (any order, no repeats).
        states: state of each rivet: ``"sound"``, ``"loose"``, ``"missing"``, ``"headless"``.
        effective: which states count as effective (default only ``"sound"``; the engineer
            may count ``"loose"`` as effective).
        where: location for error messages.

    Raises:
        InputError: lengths differ, an unknown state, a repeated or invalid position.
    """
    pos = [
        internal(
            p,
            "length",
            f"rivet position {i}",
            where=where,
            low=0.0,
            high=500_000.0,
            low_inclusive=True,
        )
        for i, p in enumerate(positions)
    ]
    st = list(states)
    eff = tuple(effective)
    if len(pos) != len(st):
        raise InputError(f"{len(pos)} positions but {len(st)} states", where=where)
    for s in (*st, *eff):
        if s not in RIVET_STATES:
            raise InputError(f"unknown rivet state {s!r}; known: {list(RIVET_STATES)}", where=where)
    pairs = sorted(zip(pos, st, strict=True))
    for (p1, _), (p2, _) in itertools.pairwise(pairs):
        if p1 == p2:
            raise InputError(f"two rivets at the same position {p1:g} mm", where=where)
    eff_pos = [p for p, s in pairs if s in eff]
    best: tuple[float, float, float] | None = None
    for p1, p2 in itertools.pairwise(eff_pos):
        if best is None or p2 - p1 > best[0]:
            best = (p2 - p1, p1, p2)
    return LineGaps(
        positions=tuple(p for p, _ in pairs),
        states=tuple(s for _, s in pairs),
        effective=eff,
        effective_positions=tuple(eff_pos),
        longest_gap=None if best is None else best[0],
        gap_from=None if best is None else best[1],
        gap_to=None if best is None else best[2],
        n_ineffective=len(pairs) - len(eff_pos),
        longest_tributary=None if best is None else _longest_tributary(eff_pos, pairs),
    )


def _longest_tributary(eff: list[float], pairs: list[tuple[float, str]]) -> float:
    """Largest stretch of the line [first rivet, last rivet] served by one effective rivet."""
    start, end = pairs[0][0], pairs[-1][0]
    edges = [start, *((a + b) / 2.0 for a, b in itertools.pairwise(eff)), end]
    return max(b - a for a, b in itertools.pairwise(edges))


def shear_flow_resistance(Rr: Number, gaps: LineGaps, n_lines: int = 1) -> CheckValue:
    """Shear flow the line can carry, q_r = n_lines Rr / governing length, N/mm.

    Zero when the line has no effective load path (fewer than two effective rivets).

    Raises:
        InputError: Rr negative or n_lines outside 1 to 8.
    """
    r = internal(Rr, "force", "Rr", low=0.0, low_inclusive=True)
    if isinstance(n_lines, bool) or not isinstance(n_lines, int) or not 1 <= n_lines <= 8:
        raise InputError(f"n_lines = {n_lines!r} is outside the allowed range (1 to 8)")
    src = "mechanics of built-up beams (q = VQ/I), common practice"
    L = gaps.governing_length
    if L is None:
        return CheckValue("q_r", 0.0, "force_per_length", "no effective load path", src)
    return CheckValue(
        "q_r",
        n_lines * r / L,
        "force_per_length",
        "shear flow resistance n_lines Rr / governing length",
        src,
    )
