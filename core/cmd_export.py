"""``asfound export STORE -o FILE``: a field store to a survey file (asfound.survey JSON)."""

from __future__ import annotations

import argparse

from core.survey.document import export_survey


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser(
        "export",
        help="write a field store to a survey file",
        description="Write the survey held in a field store to a survey file "
        "(asfound.survey JSON, version 1), through a temporary file and a rename. The "
        "output is never the store itself, another store, a section description or the "
        "file of another survey; an earlier export of the same survey is replaced.",
    )
    p.add_argument("store", metavar="STORE", help="field store (.sqlite)")
    p.add_argument("-o", "--output", required=True, metavar="FILE", help="survey JSON file")
    p.add_argument(
        "--force",
        action="store_true",
        help="replace an existing file that asfound did not write (never a store or a survey file)",
    )
    p.set_defaults(func=handler)


def handler(args: argparse.Namespace) -> int:
    out = export_survey(args.store, args.output, force=args.force)
    print(f"exported {args.store} to {out}")
    return 0
