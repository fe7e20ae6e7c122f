"""``asfound import FILE -o STORE``: a survey file into a new field store.

The whole file is checked first; a file with errors is refused and nothing is written.
The new store is built beside its final name and linked into place when complete; an
existing file (a store or anything else) is never replaced.
"""

from __future__ import annotations

import argparse

from core.survey.document import import_survey, load_survey


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser(
        "import",
        help="read a survey file into a new field store",
        description="Read a survey file (asfound.survey JSON) into a new field store. "
        "A file with errors is refused; the output must not exist (an existing store "
        "or any other file is never replaced).",
    )
    p.add_argument("file", metavar="FILE", help="survey JSON file")
    p.add_argument(
        "-o",
        "--output",
        required=True,
        metavar="STORE",
        help="new field store (.sqlite by convention)",
    )
    p.add_argument("--who", default="import", help="name recorded in the edit history")
    p.set_defaults(func=handler)


def handler(args: argparse.Namespace) -> int:
    _survey, probs = load_survey(args.file)
    out = import_survey(args.file, args.output, who=args.who)
    for p in probs:
        print(p)
    print(f"imported {args.file} into {out} ({len(probs)} warning(s) and note(s))")
    return 0
