"""``asfound assess FILE``: as-built against as-found at every station of a survey, under one
standard family (named, with every factor it used)."""

from __future__ import annotations

import json
import sys

from rich.text import Text

from core import CAUTION
from core.assess import assess
from core.assess.detailsout import girder_tables
from core.assess.export import assessment_dict
from core.choices import add_arguments, options_for
from core.console import Voice, emit, level_style, make_console, table
from core.glossary import OVERALL_LEVEL
from core.names import readable
from core.survey import load_survey
from core.units import display_unit, from_internal, symbol


def register(sub) -> None:
    p = sub.add_parser(
        "assess",
        help="as-built against as-found capacity, ratios, rating factors and flags",
        description="Assess every station of a survey (file or field store). " + CAUTION,
    )
    p.add_argument("file", help="survey file (JSON, asfound.survey) or field store")
    p.add_argument("--json", action="store_true", help="machine-readable output")
    p.add_argument("--units", choices=("si", "us"), help="unit system of the output")
    add_arguments(p)
    p.set_defaults(func=run)


#: the mark in the "governs" column of a limit state that does not apply at a station
_NOT_APPLICABLE = "n/a"


def _not_applicable(ls) -> bool:
    """A limit state with no as-found value because it does not apply at the station
    (its note says why, e.g. the section falls into pieces)."""
    return ls.C_found is None and ls.note.startswith("not applicable")


def _conv(v: float | None, kind: str, unit: str) -> float | None:
    return None if v is None else from_internal(v, kind, unit)


def _factors(a) -> str:
    f = a.family
    rows = [(x.symbol, f"{x.value:.4g}", x.description, x.source) for x in f.factors.values()]
    for m in a.members:
        rows += [
            (f"{m.member}: {x.symbol}", f"{x.value:.4g}", x.description, x.source)
            for x in m.factors
        ]
    return table(
        ("factor", "value", "what", "source"), rows, "Factors of the family (every one used)"
    )


def _flag_line(con, f, indent: str = "  ") -> None:
    """One flag: its level once (in the level's colour on a terminal), subject, sentence."""
    emit(
        con,
        Text.assemble(
            indent,
            (f.label, level_style(f.label)),
            f" · {readable(f.subject)}: {readable(f.detail)}",
        ),
    )


def run(args) -> int:
    survey, problems = load_survey(args.file)
    a = assess(survey, options_for(args, survey), tuple(problems))
    system = args.units or a.unit_system
    if args.json:
        json.dump(assessment_dict(a, system), sys.stdout, indent=2, ensure_ascii=False)
        sys.stdout.write("\n")
        return 0
    con, voice = make_console(), Voice.of(args)

    def print(x: object = "") -> None:  # every line through the one console
        emit(con, x)

    fam = a.family
    ms = fam.measure
    print(f"{a.title}  (survey {a.survey_id})")
    print(f"family: {fam.name}")
    print(
        Text.assemble(
            f"measure: {ms.name} {ms.symbol}   units: {system.upper()}   {OVERALL_LEVEL}: ",
            (a.level.label, level_style(a.level.label)),
        )
    )
    print(f"CAUTION: {CAUTION}")
    print()
    print(_factors(a))
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
                        readable(ls.name),
                        _conv(ls.C_built, ls.kind, u),
                        _conv(ls.C_found, ls.kind, u),
                        ls.ratio,
                        ls.measure,
                        symbol(u),
                        "<"
                        if s.governing is ls
                        else (_NOT_APPLICABLE if _not_applicable(ls) else ""),
                    )
                )
            rows.append((s.station, None, OVERALL_LEVEL, None, None, None, None, "", s.level.label))
        print(
            table(
                (
                    "station",
                    f"x {symbol(P)}",
                    "limit state",
                    "as-built",
                    "as-found",
                    "ratio",
                    ms.symbol,
                    "unit",
                    "governs",
                ),
                rows,
                f"Member {m.member} {m.label}: factored capacities ({system.upper()} units)",
                {8: "level"},
            )
        )
        if any(_not_applicable(ls) for s in m.stations for ls in s.limit_states):
            print(
                f"{_NOT_APPLICABLE}: the limit state does not apply at that station as found; "
                "the report and --json give the reason"
            )
        if m.summary:
            print()
            print(
                table(
                    ("case", "factor", "measure", "at", "limit state", "consequence"),
                    [
                        (
                            r.case,
                            r.factor,
                            f"{r.symbol} {r.value:.3f}",
                            r.station,
                            r.limit_state,
                            r.consequence,
                        )
                        for r in m.summary
                    ],
                    f"Member {m.member}: rating summary ({ms.name})",
                )
            )
        for text in girder_tables(m, system):
            print()
            print(text)
        least = 0 if voice.verbose else 2  # --verbose: every flag, else from "engineer to review"
        worst = [f for s in m.stations for f in s.flags if f.level >= least] + [
            f for f in m.flags if f.level >= least
        ]
        if worst:
            print("\nFlags:" if voice.verbose else "\nFlags for review:")
            for f in worst:
                _flag_line(con, f)
    if a.flags:
        print("\nSurvey flags:")
        for f in a.flags:
            _flag_line(con, f)
    if problems and not voice.quiet:
        print("\nSurvey notes and warnings:")
        for p in problems:
            print(f"  {p}")
    if not voice.quiet:
        print(
            "\nEvery assumption with its source: asfound assess --json, or the report's "
            "assumptions page."
        )
    return 0
