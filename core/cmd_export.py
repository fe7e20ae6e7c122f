"""``asfound export STORE -o FILE``: a field store to a survey file (asfound.survey JSON)."""

from __future__ import annotations

import argparse

from core.survey.document import export_survey


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser(
        "export",
        help="write a field store to a survey file",
        description="Write the survey held in a field store to a survey file "
        "(asfound.survey JSON, version 1), through a temporary file and a rename.",
    )
    p.add_argument("store", metavar="STORE", help="field store file")
    p.add_argument("-o", "--output", required=True, metavar="FILE", help="survey JSON file")
    p.set_defaults(func=handler)


def handler(args: argparse.Namespace) -> int:
    out = export_survey(args.store, args.output)
    print(f"exported {args.store} to {out}")
    return 0
