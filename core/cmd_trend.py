"""``asfound trend SURVEY SURVEY... [-o OUT.pdf] [--json]``: repeat surveys of one structure,
oldest first: loss rates per part region and the years when each limit state's measure
crosses 1 and the engineer's thresholds, projected by the assessment engine.

Nothing is written when a survey cannot be matched (the error names the file, member and
station). The PDF's path is checked first (:mod:`core.outputs`: never an input, a store or
a survey file) and written atomically; without ``-o`` the trend is printed (``--json``:
machine-readable)."""

from __future__ import annotations

import argparse
import json
import sys
from pathlib import Path

from core import CAUTION
from core.choices import add_arguments, options_for
from core.errors import InputError
from core.textable import render
from core.units import Q_, display_unit, from_internal, symbol, to_internal


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser(
        "trend",
        help="loss rates and the years left, from repeat surveys of one structure",
        description="Loss rates per part region from two or more surveys of one structure "
        "(oldest first), and the year each limit state's measure crosses 1 and the flag "
        "thresholds, by assessing projected surveys. " + CAUTION,
    )
    p.add_argument("surveys", nargs="+", metavar="SURVEY", help="survey files, oldest first")
    p.add_argument("-o", "--output", metavar="OUT.pdf", help="write the trend report (PDF)")
    p.add_argument("--json", action="store_true", help="machine-readable output on stdout")
    p.add_argument(
        "--model",
        choices=("linear", "power"),
        default="linear",
        help="corrosion model: linear (default) or power law d = A t^B",
    )
    p.add_argument(
        "--exponent",
        type=float,
        default=None,
        metavar="B",
        help="power law exponent (default 0.5; about 0.3 to 0.8 in atmospheric corrosion "
        "studies, from memory)",
    )
    p.add_argument(
        "--since",
        type=float,
        metavar="YEAR",
        help="the year corrosion began, for the power law and for the rate of a region "
        "read in the latest survey only (default: the year built)",
    )
    p.add_argument(
        "--tolerance",
        default="50 mm",
        metavar="LENGTH",
        help="largest distance between matched stations (default '50 mm'; '2 in' works)",
    )
    p.add_argument("--horizon", type=float, default=50.0, help="years ahead (default 50)")
    p.add_argument("--step", type=float, default=5.0, help="years between engine runs (default 5)")
    p.add_argument("--units", choices=("si", "us"), help="unit system (default: the latest's)")
    p.add_argument(
        "--force",
        action="store_true",
        help="replace an existing file that asfound did not write (never an input)",
    )
    add_arguments(p)
    p.set_defaults(func=run)


def tolerance_mm(text: str) -> float:
    """A length given as '50 mm', '2 in' or a bare number of mm.

    Raises:
        InputError: not a positive length.
    """
    try:
        v = float(text)
    except ValueError:
        try:
            q = Q_(text)
            v = to_internal(float(q.magnitude), str(q.units), "length", where="--tolerance")
        except InputError:
            raise
        except Exception:
            raise InputError(f"--tolerance {text!r} is not a length such as '50 mm'") from None
    if not (v > 0 and v != float("inf")):
        raise InputError(f"--tolerance {text!r} must be a length > 0")
    return v


def run(args: argparse.Namespace) -> int:
    from core.survey import load_survey
    from core.trend import TrendError, trend
    from core.trend.export import trend_dict

    if len(args.surveys) < 2:
        raise TrendError(f"a trend needs two or more surveys ({len(args.surveys)} given)")
    if args.exponent is not None and args.model != "power":
        raise InputError("--exponent applies to --model power only")
    out = None
    if args.output:
        from core.outputs import check_output

        out = check_output(args.output, args.surveys, "pdf", force=args.force)
    surveys = [load_survey(p)[0] for p in args.surveys]
    kw = {"B": args.exponent} if args.exponent is not None else {}
    r = trend(
        args.surveys,
        options_for(args, surveys[-1]),
        model=args.model,
        since=args.since,
        tolerance=tolerance_mm(args.tolerance),
        horizon=args.horizon,
        step_years=args.step,
        surveys=surveys,
        **kw,
    )
    system = args.units or surveys[-1].survey.unit_system
    if out is not None:
        from core.report.trend import write_trend_report

        pages = write_trend_report(r, out, system, force=args.force)
        print(f"trend of {len(surveys)} surveys: {pages} pages -> {out}")
        print(CAUTION, file=sys.stderr)
        return 0
    if args.json:
        json.dump(trend_dict(r), sys.stdout, indent=2, ensure_ascii=False)
        sys.stdout.write("\n")
        return 0
    _print(r, system)
    return 0


def _print(r, system: str) -> None:
    from core.trend.export import crossing_words, method_statement, model_statement

    s = r.series
    L = display_unit("length", system)
    print(f"Trend: {s.structure}  ({len(s.surveys)} surveys)")
    for f, sv, d in zip(s.files, s.surveys, s.dates, strict=True):
        print(f"  {d.isoformat()}  {sv.survey.id}  {Path(f).name}")
    print(f"family: {r.family}   measure: {r.measure} {r.symbol}")
    print(model_statement(r))
    for line in method_statement(r):
        print("  " + line)
    print(f"CAUTION: {CAUTION}")
    rows = []
    for rs, rt in zip(s.regions, r.rates, strict=True):
        rows.append(
            (
                rs.member,
                rs.station,
                rs.label,
                " / ".join(f"{from_internal(t, 'length', L):.3f}" for t in rs.t),
                from_internal(rt.r, "length", L) if rt.has_rate else None,
                None if rt.se is None else from_internal(rt.se, "length", L),
                rt.method,
                from_internal(r.projected_t(rs, r.horizon), "length", L),
            )
        )
    u = symbol(L)
    print()
    print(
        render(
            (
                "member",
                "station",
                "part region",
                f"t at the dates {u}",
                f"rate {u}/yr",
                "SE",
                "from",
                f"t in {r.horizon:g} yr",
            ),
            rows,
            "Loss rate per part region",
        )
    )
    rows = []
    for t in r.tracked:
        cr = [crossing_words(r, c) for c in t.crossings]
        rows.append(
            (
                t.member,
                t.station,
                t.name,
                " / ".join("-" if v is None else f"{v:.3f}" for v in t.at_dates),
                *cr,
            )
        )
    print()
    print(
        render(
            (
                "member",
                "station",
                "limit state",
                f"{r.symbol} at the dates",
                *(f"year {x.label} ({x.value:g})" for x in r.targets),
            ),
            rows,
            f"When the {r.measure} crosses 1 and the flag thresholds",
        )
    )
    if r.notes:
        print("\nNotes:")
        for n in r.notes:
            print(f"  {n}")
