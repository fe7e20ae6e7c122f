"""The engineer's choices on the command line, the same for ``asfound assess`` and
``asfound report``: flags, an options file (``--options FILE``, format ``asfound.options``),
and the survey's own ``survey.options``; merged key by key (flags win over the file, the file
over the survey)."""

from __future__ import annotations

import argparse
from typing import Any

from core.assess.options import (
    CONDITIONS,
    DEPTH_BASES,
    FAMILY_KEYS,
    LEVELS,
    LIVE_LOADS,
    AssessOptions,
    merged,
    options_from_dict,
    read_options_file,
)
from core.errors import InputError
from core.survey.model import STRUCTURE_TYPES, Survey


def add_arguments(p: argparse.ArgumentParser) -> None:
    """The choice flags (every one optional; unset flags leave the file's or survey's)."""
    p.add_argument(
        "--standard", choices=FAMILY_KEYS, help="standard family (default: the survey's)"
    )
    p.add_argument(
        "--options", metavar="FILE", help="options file (asfound.options) with the choices"
    )
    p.add_argument("--depth", choices=DEPTH_BASES, help="web depth for shear (default: clear)")
    p.add_argument("--thickness", choices=("mean", "minimum"), help="reading statistic for A, I, Q")
    p.add_argument("--loose-counts", action="store_true", help="count loose rivets as effective")
    p.add_argument("--condition", choices=CONDITIONS, help="member condition (condition factor)")
    p.add_argument(
        "--rating-level",
        choices=LEVELS,
        dest="rating_level",
        help="rating level, not a flag level (default: inventory)",
    )
    # the earlier name, kept hidden so that old scripts run; it clashed with the flag levels
    p.add_argument("--level", choices=LEVELS, dest="rating_level", help=argparse.SUPPRESS)
    p.add_argument("--structure-type", choices=STRUCTURE_TYPES, help="for the system factor")
    p.add_argument(
        "--live-load", choices=LIVE_LOADS, help="live load model (default: the family's)"
    )
    p.add_argument(
        "--distribution", type=float, metavar="G", help="distribution factor, all members"
    )
    p.add_argument(
        "--factor",
        action="append",
        default=[],
        metavar="SYMBOL=VALUE",
        help="set a factor of the family (e.g. gamma_M1=1.0); repeatable",
    )


def _cli(args: argparse.Namespace) -> dict[str, Any]:
    out: dict[str, Any] = {}
    for flag, key in (
        ("standard", "standard"),
        ("depth", "depth_basis"),
        ("thickness", "thickness_policy"),
        ("condition", "condition"),
        ("rating_level", "level"),
        ("structure_type", "structure_type"),
        ("live_load", "live_load"),
        ("distribution", "distribution"),
    ):
        v = getattr(args, flag, None)
        if v is not None:
            out[key] = v
    if getattr(args, "loose_counts", False):
        out["effective_states"] = ("sound", "loose")
    facs = {}
    for item in getattr(args, "factor", []) or []:
        sym, sep, val = item.partition("=")
        try:
            facs[sym.strip()] = float(val)
        except ValueError:
            raise InputError(f"--factor {item!r} is not SYMBOL=NUMBER") from None
        if not sep or not sym.strip():
            raise InputError(f"--factor {item!r} is not SYMBOL=NUMBER")
    if facs:
        out["factors"] = facs
    return out


def options_for(args: argparse.Namespace, survey: Survey) -> AssessOptions:
    """The merged choices: the survey's options, then the options file, then the flags.

    Raises:
        InputError / SchemaError: a bad option anywhere, naming where it came from.
    """
    layers = [survey.survey.options or {}]
    path = getattr(args, "options", None)
    if path:
        layers.append(read_options_file(path))
    layers.append(_cli(args))
    return options_from_dict(merged(*layers), "options (survey, file and command line)")
