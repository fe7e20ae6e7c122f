"""``asfound assess FILE``: as-built against as-found at every station of a survey."""

from __future__ import annotations

import json
import sys

from core import CAUTION
from core.assess import AssessOptions, assess
from core.assess.export import assessment_dict
from core.checks import STANDARDS
from core.checks.rating import RatingFactors
from core.survey import load_survey
from core.textable import render
from core.units import display_unit, from_internal, symbol


def register(sub) -> None:
    p = sub.add_parser(
        "assess",
        help="as-built against as-found capacity, ratios, rating factors and flags",
        description="Assess every station of a survey (file or field store). " + CAUTION,
    )
    p.add_argument("file", help="survey file (JSON, asfound.survey) or field store")
    p.add_argument("--json", action="store_true", help="machine-readable output")
    p.add_argument(
        "--standard",
        choices=sorted(STANDARDS),
        help="standard for web shear (default: the survey's)",
    )
    p.add_argument("--units", choices=("si", "us"), help="unit system of the output")
    p.add_argument(
        "--depth",
        choices=("auto", "web", "rivet_lines"),
        default="auto",
        help="web depth used for shear (default: auto)",
    )
    p.add_argument(
        "--thickness",
        choices=("mean", "minimum"),
        default="mean",
        help="reading statistic used for A, I, Q (default: mean)",
    )
    p.add_argument(
        "--loose-counts",
        action="store_true",
        help="count loose rivets as effective (default: only sound rivets count)",
    )
    p.add_argument(
        "--condition",
        choices=("good", "fair", "poor"),
        default="good",
        help="member condition for the rating's condition factor",
    )
    p.add_argument(
        "--level",
        choices=("inventory", "operating"),
        default="inventory",
        help="rating level (live load factor)",
    )
    p.set_defaults(func=run)


def options_from(args) -> AssessOptions:
    """Assessment options from the command line arguments."""
    return AssessOptions(
        standard=args.standard,
        depth_basis=args.depth,
        thickness_policy=args.thickness,
        effective_states=("sound", "loose") if args.loose_counts else ("sound",),
        rating=RatingFactors(level=args.level, condition=args.condition),
    )


def _conv(v: float | None, kind: str, unit: str) -> float | None:
    return None if v is None else from_internal(v, kind, unit)


def run(args) -> int:
    survey, problems = load_survey(args.file)
    a = assess(survey, options_from(args), tuple(problems))
    system = args.units or a.unit_system
    if args.json:
        json.dump(assessment_dict(a, system), sys.stdout, indent=2, ensure_ascii=False)
        sys.stdout.write("\n")
        return 0
    print(f"{a.title}  (survey {a.survey_id})")
    print(f"standard: {a.standard_title}   units: {system.upper()}   verdict: {a.level.label}")
    print(f"CAUTION: {CAUTION}")
    for m in a.members:
        print()
        P = display_unit("position", system)
        rows = []
        for s in m.stations:
            for ls in s.limit_states:
                u = display_unit(ls.kind, system)
                rows.append(
                    (
                        s.station,
                        from_internal(s.x, "position", P),
                        ls.name,
                        _conv(ls.C_built, ls.kind, u),
                        _conv(ls.C_found, ls.kind, u),
                        ls.ratio,
                        ls.RF,
                        symbol(u),
                        "<" if s.governing is ls else "",
                    )
                )
            rows.append((s.station, None, "verdict", None, None, None, None, "", s.level.label))
        print(
            render(
                (
                    "station",
                    f"x {symbol(P)}",
                    "limit state",
                    "as-built",
                    "as-found",
                    "ratio",
                    "RF",
                    "unit",
                    "governs",
                ),
                rows,
                f"Member {m.member} {m.label}: factored capacities phi Rn ({system.upper()} units)",
            )
        )
        worst = [f for s in m.stations for f in s.flags if f.level >= 2] + [
            f for f in m.flags if f.level >= 2
        ]
        if worst:
            print("\nFlags for review:")
            for f in worst:
                print(f"  [{f.level.label}] {f.subject}: {f.message}")
    if problems:
        print("\nSurvey notes and warnings:")
        for p in problems:
            print(f"  {p}")
    return 0
