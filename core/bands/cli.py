"""The bands on the command line: the choice flags and the text section of
``asfound assess`` (a table of each station's governing band and the advice)."""

from __future__ import annotations

import argparse
from collections.abc import Iterator

from core.bands.options import TOLERANCE_MM, BandOptions
from core.bands.run import MemberBands
from core.console import table
from core.errors import InputError
from core.names import readable

#: the first words of the title of the bands' table (the golden test leaves the section out)
TITLE = "capacity bands"


def add_band_arguments(p: argparse.ArgumentParser) -> None:
    p.add_argument(
        "--band-method",
        choices=("first_order", "monte_carlo"),
        default="first_order",
        help="how the bands from the readings are found (default: first_order)",
    )
    p.add_argument(
        "--band-samples",
        type=int,
        default=400,
        metavar="N",
        help="Monte Carlo draws per station (20 to 100000; default 400, fixed seed)",
    )

    p.add_argument(
        "--band-tolerance",
        action="append",
        default=[],
        metavar="INSTRUMENT=MM",
        help="tolerance of an instrument (a reading's instrument text, or ultrasonic / "
        "caliper) in mm, e.g. caliper=0.02; may be repeated (defaults: ultrasonic 0.1, "
        "caliper 0.05; common practice, no source)",
    )


def _tolerances(items: list[str]) -> dict[str, float]:
    out = dict(TOLERANCE_MM)
    for item in items:
        name, sep, value = item.partition("=")
        try:
            mm = float(value)
        except ValueError:
            mm = float("nan")
        if not sep or not name.strip() or mm != mm:
            raise InputError(
                f"band tolerance {item!r} is not INSTRUMENT=MM (e.g. caliper=0.02)",
                where="--band-tolerance",
            )
        out[name.strip()] = mm
    return out


def band_options(args: argparse.Namespace) -> BandOptions:
    """The band options of the flags (raises InputError for a value out of range)."""
    return BandOptions(
        method=getattr(args, "band_method", "first_order"),
        samples=getattr(args, "band_samples", 400),
        tolerance_mm=_tolerances(getattr(args, "band_tolerance", [])),
    )


def band_text(mb: MemberBands, system: str) -> Iterator[object]:
    """The member's bands section: one row per station (its governing limit state), then
    where to measure next."""
    rows = []
    for sb in mb.stations:
        key = sb.governing
        b = sb.governing_band
        if key is None or b is None:
            continue
        sym = sb.symbols.get(key)
        if sym is None:
            continue
        p = b.p_beyond
        rows.append(
            (
                sb.station,
                readable(sb.names[key]),
                sym,
                f"{b.value:.3f}",
                f"{b.p5:.3f}",
                f"{b.p95:.3f}",
                "" if p is None else f"{p:.3f}",
                sb.sentence(key).split(": ", 1)[-1],
            )
        )
    if not rows:
        return
    method = "first order" if mb.stations[0].bands and next(
        iter(mb.stations[0].bands.values())).method == "first_order" else "Monte Carlo"  # fmt: skip
    lines = [f"  {i}. {readable(a)}" for i, a in enumerate(mb.advice, 1)]
    sym = rows[0][2]
    beyond = f"P({sym} < 1)" if sym == "RF" else f"P({sym} > 1)"
    yield table(
        ("station", "governing", "measure", "value", "5 %", "95 %", beyond, "readings"),
        rows,
        f"Member {mb.member}: {TITLE} from the readings ({method}; an aid, not a "
        "reliability rating)",
    )
    yield "Where to measure next:\n" + ("\n".join(lines) if lines else "  nothing to narrow")
