"""A long fuzz run on demand, with the figures printed as a table.

    python -m tests.fuzz.run --cases 3000 [--kind survey|section|store|all] [--seed N]

Every case runs in the worker process with the per-case time limit of the test suite; the
run never stops at a failure: it counts the outcomes (ok, refused with an asfound error,
crash, hang), groups the crashes by kind and place with one example each, and prints the
table.
"""

from __future__ import annotations

import argparse
import collections
import time

from hypothesis import HealthCheck, Phase, given, settings
from hypothesis import seed as hseed

from tests.fuzz.cases import CASE_LIMIT_S, KINDS, describe, job, strategy
from tests.fuzz.worker import Tally, Worker


def _origin(detail: str) -> str:
    """The last asfound source line of a traceback (file:line), or the last line of all."""
    lines = [x.strip() for x in detail.splitlines() if x.strip().startswith("File ")]
    ours = [x for x in lines if "/core/" in x] or lines
    if not ours:
        return "?"
    f = ours[-1].split('"')[1].split("/core/")[-1]
    return f"{f}:{ours[-1].split('line ')[1].split(',')[0]}"


def run(kind: str, n: int, seed: int | None, worker: Worker):
    tally = Tally()
    crash_kinds: collections.Counter = collections.Counter()
    examples: dict[str, tuple[str, str]] = {}

    @settings(
        max_examples=n,
        deadline=None,
        database=None,
        phases=(Phase.generate,),
        suppress_health_check=list(HealthCheck),
        derandomize=seed is None,
    )
    @given(strategy(kind))
    def one(case):
        files, commands = job(case)
        out = worker.run(files, commands)
        label = describe(case)
        tally.add(out, label)
        if out.kind == "crash":
            last = out.detail.strip().splitlines()[-1] if out.detail.strip() else "?"
            key = last.split(":")[0] + " @ " + _origin(out.detail)
            crash_kinds[key] += 1
            examples.setdefault(key, (label, out.detail))

    if seed is not None:
        one = hseed(seed)(one)
    one()
    return tally, crash_kinds, examples


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--cases", type=int, default=500, help="cases per kind of input")
    ap.add_argument("--kind", choices=(*KINDS, "all"), default="all")
    ap.add_argument("--seed", type=int, help="random seed (default: derandomized)")
    ap.add_argument("--show", type=int, default=3, help="traceback lines per crash kind")
    args = ap.parse_args()
    kinds = KINDS if args.kind == "all" else (args.kind,)
    rows = []
    with Worker(CASE_LIMIT_S) as worker:
        for kind in kinds:
            t0 = time.monotonic()
            tally, crash_kinds, examples = run(kind, args.cases, args.seed, worker)
            rows.append((kind, tally, time.monotonic() - t0))
            for text, k in crash_kinds.most_common():
                print(f"  {kind} crash x{k}: {text}")
                case, detail = examples[text]
                print(f"    case: {case[:600]}")
                print("    " + "\n    ".join(detail.strip().splitlines()[-args.show * 2 :]))
            hangs = [c for c, d in tally.failures if d.startswith("no answer")]
            for case in hangs[:5]:
                print(f"  {kind} hang: {case[:600]}")
            print(f"  {kind} slowest ({tally.slowest:.2f} s): {tally.slowest_case[:600]}")
    print(
        f"\n{'input':8} {'cases':>6} {'ok':>6} {'refused':>8} {'crash':>6} {'hang':>5} "
        f"{'slowest s':>10} {'wall s':>8}"
    )
    for kind, t, wall in rows:
        c = t.counts
        print(
            f"{kind:8} {t.total:6d} {c.get('ok', 0):6d} {c.get('refused', 0):8d} "
            f"{c.get('crash', 0):6d} {c.get('hang', 0):5d} {t.slowest:10.2f} {wall:8.0f}"
        )
    print(f"time limit per case: {CASE_LIMIT_S:g} s; seed: {args.seed or 'derandomized'}")


if __name__ == "__main__":
    main()
