"""``asfound merge STORE_A STORE_B -o STORE_C``: two devices' stores of one survey into one.

Every entry and every history row of both stores is kept; where both devices changed one
value, the later change is current and the pair is listed (the rule is in
:mod:`core.survey.merge`). The inputs are only read; the output is a new store, written
beside its final name and linked into place when complete: an existing file is never
replaced.
"""

from __future__ import annotations

import argparse

from core.survey.merge import merge_stores

#: conflicts printed in full (the rest are counted; all are in the output's conflict table)
SHOWN = 50


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser(
        "merge",
        help="merge two devices' field stores of one survey into a new store",
        description="Merge two field stores of the same survey (copies of one store, "
        "worked on two devices) into a new store. Nothing is lost: both histories are "
        "kept; where both devices changed one value the later change is current and the "
        "conflict is listed; entries both devices made with one id are both kept, the later "
        "one renamed. The inputs are never changed; the output must not exist.",
    )
    p.add_argument("a", metavar="STORE_A", help="field store of one device")
    p.add_argument("b", metavar="STORE_B", help="field store of the other device")
    p.add_argument("-o", "--output", required=True, metavar="STORE_C", help="new field store")
    p.set_defaults(func=handler)


def handler(args: argparse.Namespace) -> int:
    res = merge_stores(args.a, args.b, args.output)
    for c in res.conflicts[:SHOWN]:
        print(c.line())
    if len(res.conflicts) > SHOWN:
        print(f"... and {len(res.conflicts) - SHOWN} more (all are in the new store)")
    print(
        f"merged {args.a} and {args.b} into {res.output}: {res.both} entries in both, "
        f"{res.only_a} only in {args.a}, {res.only_b} only in {args.b}; "
        f"{res.changes_a} + {res.changes_b} changes since the common start; "
        f"{len(res.conflicts)} conflict(s)"
    )
    if res.errors:
        print(
            f"the merged survey has {len(res.errors)} error(s) to correct "
            f"(asfound validate {res.output} lists them):"
        )
        for e in res.errors[:SHOWN]:
            print(f"  {e}")
    return 0
