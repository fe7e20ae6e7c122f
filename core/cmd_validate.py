"""``asfound validate FILE``: list every problem of a survey file or a field store.

Prints each error, warning and note with its place, then a count. Exit status 0 when there
are no errors (warnings allowed), 1 when there are errors, 2 when the file cannot be read.
"""

from __future__ import annotations

import argparse

from core.survey.document import check_file
from core.survey.problems import LEVELS


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser(
        "validate",
        help="list every problem of a survey file or field store",
        description="Check a survey file (asfound.survey JSON) or a field store and list "
        "every error, warning and note with its place. Exit 1 if there are errors.",
    )
    p.add_argument("file", metavar="FILE", help="survey JSON file or field store")
    p.add_argument("--errors-only", action="store_true", help="do not list warnings and notes")
    p.set_defaults(func=handler)


def handler(args: argparse.Namespace) -> int:
    _model, probs = check_file(args.file)
    count = {lv: sum(1 for p in probs if p.level == lv) for lv in LEVELS}
    for p in probs:
        if args.errors_only and p.level != "error":
            continue
        print(p)
    print(
        f"{args.file}: {count['error']} error(s), {count['warning']} warning(s), "
        f"{count['note']} note(s)"
    )
    return 1 if count["error"] else 0
