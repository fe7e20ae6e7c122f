"""Rivets: what every family's rivet check shares, the force each rivet carries, and the
gaps between effective rivets along a line.

The resistance of one rivet follows the family (``core.checks.aashto_rivets``,
``core.checks.aisc_rivets``, ``core.checks.en1993_rivets``); here are the plies it passes
through (:class:`Ply`), the choice of the governing mode, and the line geometry.

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

RivetState = Literal["sound", "loose", "missing", "headless"]
RIVET_STATES: tuple[str, ...] = ("sound", "loose", "missing", "headless")


@dataclass(frozen=True)
class Ply:
    """A plate the rivet passes through: measured thickness t (mm), Fu (MPa), the share of
    the rivet force it bears, and its edge distance e2 (mm) perpendicular to the force
    (None when unknown)."""

    name: str
    t: float
    Fu: float
    share: float = 1.0
    e2: float | None = None

    def __post_init__(self) -> None:
        w = f"ply {self.name!r}"
        object.__setattr__(self, "t", length(self.t, "t", where=w))
        object.__setattr__(self, "Fu", stress(self.Fu, "Fu", where=w))
        s = internal(self.share, "dimensionless", "share", where=w, low=0.0, high=1.0)
        object.__setattr__(self, "share", s)
        if self.e2 is not None:
            object.__setattr__(self, "e2", length(self.e2, "e2", where=w))


@dataclass(frozen=True)
class RivetGeometry:
    """Diameters and shear planes of one rivet, checked once for every family.

    Attributes:
        d: nominal rivet (shank) diameter, mm. d0: hole diameter, mm (>= d).
        m: shear planes (1 to 4). pitch: nominal spacing along the line, mm.
    """

    d: float
    d0: float
    m: int
    pitch: float

    @classmethod
    def of(cls, d: Number, d0: Number | None, m: int, pitch: Number, where: str = ""):
        """Validated geometry.

        Raises:
            InputError: a diameter or pitch out of range, d0 < d, m not 1 to 4.
        """
        dv = length(d, "d", where=where)
        d0v = dv if d0 is None else length(d0, "d0", where=where)
        if d0v < dv:
            raise InputError(f"hole diameter d0 = {d0v:g} mm is below d = {dv:g} mm", where=where)
        if isinstance(m, bool) or not isinstance(m, int) or not 1 <= m <= 4:
            raise InputError(
                f"m = {m!r} shear planes is outside the allowed range (1 to 4)", where=where
            )
        return cls(dv, d0v, m, length(pitch, "pitch", where=where))


def check_plies(plies: Sequence[Ply], where: str = "") -> tuple[Ply, ...]:
    """The plies as a tuple (at least one).

    Raises:
        InputError: no plies.
    """
    out = tuple(plies)
    if not out:
        raise InputError("at least one ply is needed for the bearing check", where=where)
    return out


def governing(
    modes: list[tuple[float, float, float, str]],
    *,
    values: list[CheckValue],
    notes: list[str],
    standard: str,
    edition: str,
    clause: str,
) -> CapacityResult:
    """The rivet result of the mode with the least factored resistance.

    Args:
        modes: (phi Rn, Rn, phi, name) of every mode (shear, bearing on each ply).
    """
    _Rr, Rn, phi, gov = min(modes, key=lambda x: x[0])
    return CapacityResult(
        limit_state=f"rivet ({gov})",
        standard=standard,
        edition=edition,
        clause=clause,
        Rn=Rn,
        phi=phi,
        kind="force",
        values=tuple(values),
        notes=(f"governing: {gov}", *notes),
    )


def geometry_values(g: RivetGeometry, area: float, area_words: str, src: str) -> list[CheckValue]:
    """The rows every rivet result starts with."""
    return [
        CheckValue("d", g.d, "length", "nominal rivet diameter", ENGINEER),
        CheckValue("d0", g.d0, "length", "hole diameter", ENGINEER),
        CheckValue("m", g.m, "dimensionless", "shear planes", ENGINEER),
        CheckValue("A", area, "area", area_words, src),
    ]


def circle_area(d: float) -> float:
    """pi d² / 4, mm²."""
    return math.pi * d**2 / 4.0


def prepared(
    d: Number, d0: Number | None, m: int, pitch: Number, plies: Sequence[Ply], where: str
) -> tuple[RivetGeometry, tuple[Ply, ...]]:
    """The validated geometry and plies of one rivet (see :class:`RivetGeometry`)."""
    return RivetGeometry.of(d, d0, m, pitch, where), check_plies(plies, where)


def body_shear(
    g: RivetGeometry, Fnv: float, Fnv_source: str, phi: float, src: str
) -> tuple[list[CheckValue], tuple[float, float, float, str]]:
    """Shear of a rivet on its nominal body area, Rn = m Ab Fnv: the rows and the mode."""
    Ab = circle_area(g.d)
    Rv = g.m * Ab * Fnv
    vals = geometry_values(g, Ab, "nominal body area pi d²/4", src)
    vals += [
        CheckValue("Fnv", Fnv, "stress", "nominal shear stress of the rivet", Fnv_source),
        CheckValue("Rn,shear", Rv, "force", "shear m Ab Fnv", src),
        CheckValue("phi", phi, "dimensionless", "resistance factor, rivets in shear", src),
    ]
    return vals, (phi * Rv, Rv, phi, "shear")


def share_notes(g: RivetGeometry, plies: Sequence[Ply]) -> list[str]:
    """The note when every ply of a multi-plane rivet is taken to bear the whole force."""
    if g.m > 1 and all(p.share == 1.0 for p in plies):
        return ["each ply assumed to bear the whole rivet force (conservative)"]
    return []


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
