"""What the engineer chooses for an assessment: the standard family, the rating level, the
depth and thickness bases, the load model, the distribution factor and any factor value.

The same choices come from three places, merged as plain dicts (a later one wins key by key):
the survey's own ``survey.options`` (version 2 documents), an options file
(``asfound.options``, read by both ``asfound assess`` and ``asfound report``), and the
command line. :func:`options_from_dict` checks a dict and builds :class:`AssessOptions`.
"""

from __future__ import annotations

import json
import math
from collections.abc import Mapping
from dataclasses import dataclass, field, fields
from pathlib import Path
from typing import Any, Literal

from core.checks.flags import FlagThresholds
from core.errors import InputError, SchemaError

DepthBasis = Literal["clear", "web", "rivet_lines"]
DEPTH_BASES: tuple[str, ...] = ("clear", "web", "rivet_lines")
RIVET_STATES = ("sound", "loose", "missing", "headless")
FAMILY_KEYS: tuple[str, ...] = ("aashto", "aisc", "en1993")
CONDITIONS: tuple[str, ...] = ("good", "fair", "poor")
LEVELS: tuple[str, ...] = ("inventory", "operating", "legal", "permit")
LIVE_LOADS: tuple[str, ...] = ("hl93", "vehicles", "lm71", "lm1", "station", "none")
OPTIONS_FORMAT = "asfound.options"
OPTIONS_VERSION = 1


@dataclass(frozen=True)
class AssessOptions:
    """Choices of the engineer for one assessment (every one has a default).

    Attributes:
        standard: family key (``"aashto"``, ``"aisc"``, ``"en1993"``); ``None`` takes the
            survey's.
        depth_basis: web depth for shear: ``"clear"`` (between the flange angles' toes, the
            default), ``"web"`` (web plate depth) or ``"rivet_lines"`` (between the
            web-to-flange rivet lines); ``None`` takes the family's default (clear).
        thickness_policy: ``"mean"`` (default) or ``"minimum"`` reading for A, I and Q.
        effective_states: rivet states counted as effective (default only sound rivets).
        gap_window: half-width (mm) of the stretch of a rivet line around a station whose
            longest effective gap governs there; ``None`` takes the web depth.
        condition: member condition for the condition factor (AASHTO); ``None`` takes the
            member's recorded condition.
        level: rating level (AASHTO): ``"inventory"``, ``"operating"``, ``"legal"``,
            ``"permit"``.
        structure_type: structure type for the system factor (AASHTO); ``None`` takes the
            member's record.
        live_load: the live load model (``"hl93"``, ``"vehicles"``, ``"lm71"``, ``"lm1"``,
            ``"station"`` for the station loads only, ``"none"``); ``None``: the family's
            default for the structure's use.
        distribution: share of one lane / track / vehicle carried by the girder, for every
            member (``None``: each member's record).
        factors: factor values by the family's symbol (``{"gamma_M1": 1.0}``); each replaces
            the family default and is reported as the engineer's input.
        thresholds: flag thresholds.

    Raises:
        InputError: an unknown family, basis, policy, state, level or model.
    """

    standard: str | None = None
    depth_basis: DepthBasis | None = None
    thickness_policy: Literal["mean", "minimum"] = "mean"
    effective_states: tuple[str, ...] = ("sound",)
    gap_window: float | None = None
    condition: str | None = None
    level: str = "inventory"
    structure_type: str | None = None
    live_load: str | None = None
    distribution: float | None = None
    factors: Mapping[str, float] = field(default_factory=dict)
    thresholds: FlagThresholds = field(default_factory=FlagThresholds)

    def __post_init__(self) -> None:
        _one_of(self.standard, FAMILY_KEYS, "standard family", allow_none=True)
        _one_of(self.depth_basis, DEPTH_BASES, "depth basis", allow_none=True)
        _one_of(self.thickness_policy, ("mean", "minimum"), "thickness policy")
        _one_of(self.condition, CONDITIONS, "condition", allow_none=True)
        _one_of(self.level, LEVELS, "rating level")
        _one_of(self.live_load, LIVE_LOADS, "live load model", allow_none=True)
        object.__setattr__(self, "effective_states", tuple(self.effective_states))
        bad = [s for s in self.effective_states if s not in RIVET_STATES]
        if bad or not self.effective_states:
            raise InputError(
                f"effective rivet states {list(self.effective_states)} must be a non-empty "
                f"subset of {list(RIVET_STATES)}"
            )
        if self.gap_window is not None and not (0.0 < float(self.gap_window) < 1e6):
            raise InputError(f"gap window {self.gap_window!r} mm is outside (0, 1e6) mm")
        if self.distribution is not None:
            g = self.distribution
            if isinstance(g, bool) or not isinstance(g, int | float) or not 0.0 < g <= 4.0:
                raise InputError(f"distribution factor {g!r} is outside (0, 4]")
        facs = dict(self.factors)
        for k, v in facs.items():
            if not isinstance(k, str) or isinstance(v, bool) or not isinstance(v, int | float):
                raise InputError(f"factor {k!r} = {v!r}: give a factor symbol and a number")
            if not math.isfinite(v):
                raise InputError(f"factor {k} = {v!r} is not finite")
        object.__setattr__(self, "factors", facs)


def _one_of(v: Any, allowed: tuple[str, ...], what: str, *, allow_none: bool = False) -> None:
    if v is None and allow_none:
        return
    if v not in allowed:
        raise InputError(f"{what} {v!r} is not one of {list(allowed)}")


_KEYS = {f.name for f in fields(AssessOptions)}
#: names of an option in files (the left one is read as the right one): the rating level is
#: ``rating_level`` (a flag level is another thing); ``level`` is still read from older files
ALIASES = {"rating_level": "level"}


def canonical(d: Mapping[str, Any] | None, where: str = "") -> dict[str, Any]:
    """``d`` with each option under the one name the code uses (``rating_level`` -> ``level``).

    Raises:
        InputError: both names of one option given.
    """
    out = dict(d or {})
    for new, old in ALIASES.items():
        if new in out:
            if old in out:
                raise InputError(
                    f"options {new!r} and {old!r} are one option; give one", where=where
                )
            out[old] = out.pop(new)
    return out


def options_from_dict(d: Mapping[str, Any], where: str = "") -> AssessOptions:
    """Options from a plain dict (an options file's ``options``, ``survey.options``, or the
    command line's), every key checked.

    Raises:
        InputError: an unknown key (the message lists the known ones) or a bad value, with
            ``where`` the place it came from.
    """
    if not isinstance(d, Mapping):
        raise InputError(f"options must be an object, not {type(d).__name__}", where=where)
    d = canonical(d, where)
    unknown = sorted(set(d) - _KEYS)
    if unknown:
        known = sorted((_KEYS - set(ALIASES.values())) | set(ALIASES))
        raise InputError(f"unknown option(s) {unknown}; known: {known}", where=where)
    kw = dict(d)
    if "thresholds" in kw and not isinstance(kw["thresholds"], FlagThresholds):
        th = kw["thresholds"]
        if not isinstance(th, Mapping):
            raise InputError("thresholds must be an object of numbers", where=where)
        try:
            kw["thresholds"] = FlagThresholds(**th)
        except TypeError as e:
            raise InputError(f"thresholds: {e}", where=where) from None
    if "effective_states" in kw:
        kw["effective_states"] = tuple(kw["effective_states"])
    if "factors" in kw and not isinstance(kw["factors"], Mapping):
        raise InputError("factors must be an object {symbol: number}", where=where)
    try:
        return AssessOptions(**kw)
    except InputError as e:
        raise InputError(str(e), where=where) from None


def merged(*layers: Mapping[str, Any] | None) -> dict[str, Any]:
    """Layers of choices merged key by key, later ones winning; ``factors`` and
    ``thresholds`` merge symbol by symbol."""
    out: dict[str, Any] = {}
    for layer in layers:
        for k, v in canonical(layer).items():
            if k in ("factors", "thresholds") and isinstance(v, Mapping):
                out[k] = {**out.get(k, {}), **v}
            else:
                out[k] = v
    return out


def read_options_file(path: str | Path) -> dict[str, Any]:
    """The ``options`` object of an options file (``asfound.options`` version 1).

    Raises:
        SchemaError: unreadable, not JSON, not an options file or a newer version;
        InputError: an unknown option or a bad value (named, with the file).
    """
    p = Path(path)
    try:
        doc = json.loads(p.read_text(encoding="utf-8"))
    except FileNotFoundError:
        raise InputError("options file not found", where=str(p)) from None
    except (OSError, UnicodeDecodeError, ValueError) as e:
        raise SchemaError(f"cannot read the options file: {e}", where=str(p)) from None
    if not isinstance(doc, dict) or doc.get("format") != OPTIONS_FORMAT:
        raise SchemaError(f"not an asfound options file (format {OPTIONS_FORMAT!r})", where=str(p))
    ver = doc.get("version")
    if ver != OPTIONS_VERSION:
        raise SchemaError(
            f"options file version {ver!r}; this asfound reads version {OPTIONS_VERSION}",
            where=str(p),
        )
    opts = doc.get("options", {})
    options_from_dict(opts, str(p))  # checks every key now, with the file named
    return dict(opts)
