"""Flags: findings in our own words, graded by thresholds the engineer can change.

Levels, in rising order: "within limits" < "keep watching" < "engineer to review" <
"needs immediate attention". Every flag names the number that drove it and the threshold
it crossed (or the nearest one it did not). The default thresholds are asfound's own
choices (common practice, no source); the engineer sets them per survey.
"""

from __future__ import annotations

import math
from collections.abc import Iterable
from dataclasses import dataclass
from enum import IntEnum

from core.errors import InputError
from core.glossary import LEVELS


class Level(IntEnum):
    """Severity of a flag; compare with < and >."""

    OK = 0
    WATCH = 1
    REVIEW = 2
    URGENT = 3

    @property
    def label(self) -> str:
        return _LABELS[self]


_LABELS = {lv: LEVELS[lv].name for lv in Level}  # the glossary's names


@dataclass(frozen=True)
class FlagThresholds:
    """Thresholds of the flags (asfound defaults, common practice, no source).

    Rising thresholds (worse when larger): section loss % of a part; number of ineffective
    rivets in a line; longest gap / nominal pitch; demand / capacity or utilisation. Falling
    thresholds (worse when smaller): capacity ratio as-found / as-built; rating factor.

    Raises:
        InputError: a threshold not finite or the three levels out of order.
    """

    loss_watch: float = 10.0
    loss_review: float = 25.0
    loss_urgent: float = 50.0
    ratio_watch: float = 0.95
    ratio_review: float = 0.85
    ratio_urgent: float = 0.70
    rf_watch: float = 1.20
    rf_review: float = 1.00
    rf_urgent: float = 0.70
    rivets_watch: float = 1.0
    rivets_review: float = 3.0
    rivets_urgent: float = 6.0
    gap_watch: float = 1.5
    gap_review: float = 2.5
    gap_urgent: float = 4.0
    util_watch: float = 0.75
    util_review: float = 0.90
    util_urgent: float = 1.00

    def __post_init__(self) -> None:
        for name in ("loss", "ratio", "rf", "rivets", "gap", "util"):
            w, r, u = (getattr(self, f"{name}_{lv}") for lv in ("watch", "review", "urgent"))
            for lv, v in (("watch", w), ("review", r), ("urgent", u)):
                if not isinstance(v, int | float) or not math.isfinite(v) or v < 0:
                    raise InputError(f"threshold {name}_{lv} = {v!r} must be a number >= 0")
            rising = name in ("loss", "rivets", "gap", "util")
            ok = w < r < u if rising else w > r > u
            if not ok:
                order = "watch < review < urgent" if rising else "watch > review > urgent"
                raise InputError(
                    f"thresholds {name}: watch {w:g}, review {r:g}, urgent {u:g} must be "
                    f"ordered {order}"
                )


@dataclass(frozen=True)
class Flag:
    """One finding: level, what it is about, a sentence, the number and the threshold."""

    level: Level
    subject: str
    message: str
    value: float | None = None
    threshold: float | None = None

    @property
    def label(self) -> str:
        return self.level.label

    @property
    def detail(self) -> str:
        """The sentence without the level's words in front (for a line that shows the level
        once, by its shape and words)."""
        head = f"{self.level.label}: "
        return self.message[len(head) :] if self.message.startswith(head) else self.message


def _grade(value: float, w: float, r: float, u: float, *, rising: bool) -> tuple[Level, float]:
    """Level of ``value`` and the threshold that decided it."""
    worse = (lambda v, t: v >= t) if rising else (lambda v, t: v < t)
    for lv, t in ((Level.URGENT, u), (Level.REVIEW, r), (Level.WATCH, w)):
        if worse(value, t):
            return lv, t
    return Level.OK, w


def _finite(value: float, name: str, subject: str) -> float:
    try:
        v = float(value)
    except (TypeError, ValueError):
        raise InputError(f"{name} = {value!r} is not a number", where=subject) from None
    if not math.isfinite(v):
        raise InputError(f"{name} = {value!r} is not finite", where=subject)
    return v


def _flag(
    subject: str, what: str, value: float, unit: str, lv: Level, t: float, rising: bool
) -> Flag:
    """A flag whose message names ``value`` and the threshold ``t`` that decided ``lv``."""
    if lv > Level.OK:
        cmp, name = ("at or above" if rising else "below"), lv.label
    else:
        cmp, name = ("below" if rising else "at or above"), Level.WATCH.label
    msg = f"{lv.label}: {what} {value:.3g}{unit} is {cmp} the '{name}' threshold {t:g}{unit}"
    return Flag(lv, subject, msg, value, t)


def flag_section_loss(subject: str, loss_percent: float, th: FlagThresholds | None = None) -> Flag:
    """Flag the section loss of a part, in percent of its nominal area or thickness."""
    th = th or FlagThresholds()
    v = _finite(loss_percent, "section loss %", subject)
    if not 0.0 <= v <= 100.0:
        raise InputError(f"section loss {v:g} % is outside 0 to 100 %", where=subject)
    lv, t = _grade(v, th.loss_watch, th.loss_review, th.loss_urgent, rising=True)
    return _flag(subject, "section loss", v, " %", lv, t, True)


def flag_capacity_ratio(subject: str, ratio: float, th: FlagThresholds | None = None) -> Flag:
    """Flag the ratio of as-found to as-built capacity of one limit state."""
    th = th or FlagThresholds()
    v = _finite(ratio, "capacity ratio", subject)
    if v < 0.0:
        raise InputError(f"capacity ratio {v:g} is negative", where=subject)
    lv, t = _grade(v, th.ratio_watch, th.ratio_review, th.ratio_urgent, rising=False)
    return _flag(subject, "capacity ratio as-found / as-built", v, "", lv, t, False)


def flag_rating_factor(subject: str, rf: float, th: FlagThresholds | None = None) -> Flag:
    """Flag a rating factor (RF below 1.0 is for review by default)."""
    th = th or FlagThresholds()
    v = _finite(rf, "rating factor", subject)
    lv, t = _grade(v, th.rf_watch, th.rf_review, th.rf_urgent, rising=False)
    return _flag(subject, "rating factor", v, "", lv, t, False)


def flag_rivet_line(
    subject: str,
    n_ineffective: int,
    longest_gap: float | None,
    pitch: float,
    th: FlagThresholds | None = None,
) -> list[Flag]:
    """Flags of one rivet line: count of ineffective rivets and longest gap / pitch.

    ``longest_gap=None`` means no effective load path: always "needs immediate attention".
    """
    th = th or FlagThresholds()
    n = _finite(n_ineffective, "ineffective rivets", subject)
    p = _finite(pitch, "pitch", subject)
    if n < 0 or p <= 0:
        raise InputError(
            f"ineffective rivets {n:g} must be >= 0 and pitch {p:g} mm > 0", where=subject
        )
    lv, t = _grade(n, th.rivets_watch, th.rivets_review, th.rivets_urgent, rising=True)
    out = [_flag(subject, "ineffective rivets", n, "", lv, t, True)]
    if longest_gap is None:
        out.append(
            Flag(
                Level.URGENT,
                subject,
                f"{Level.URGENT.label}: fewer than two effective "
                "rivets, no effective load path along the line",
            )
        )
        return out
    g = _finite(longest_gap, "longest gap", subject) / p
    lv, t = _grade(g, th.gap_watch, th.gap_review, th.gap_urgent, rising=True)
    out.append(_flag(subject, "longest gap / pitch", g, "", lv, t, True))
    return out


def flag_utilisation(
    subject: str, value: float, th: FlagThresholds | None = None, what: str = "utilisation"
) -> Flag:
    """Flag a demand / capacity ratio or a utilisation (above 1.0 needs immediate attention
    by default; asfound defaults, common practice, no source)."""
    th = th or FlagThresholds()
    v = _finite(value, what, subject)
    if v > th.util_urgent:
        lv, t = Level.URGENT, th.util_urgent
    elif v > th.util_review:
        lv, t = Level.REVIEW, th.util_review
    else:
        lv, t = (Level.WATCH if v > th.util_watch else Level.OK), th.util_watch
    cmp = "above" if lv > Level.OK else "at or below"
    name = lv.label if lv > Level.OK else Level.WATCH.label
    return Flag(
        lv, subject, f"{lv.label}: {what} {v:.3g} is {cmp} the '{name}' threshold {t:g}", v, t
    )


def flag_not_applicable(subject: str, reason: str) -> Flag:
    """A check that cannot be made (e.g. web perforated): engineer to review."""
    return Flag(Level.REVIEW, subject, f"{Level.REVIEW.label}: not applicable, {reason}")


def worst(flags: Iterable[Flag]) -> Level:
    """The highest level among ``flags`` (``Level.OK`` if none)."""
    return max((f.level for f in flags), default=Level.OK)
