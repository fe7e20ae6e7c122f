"""``asfound report FILE -o OUT.pdf`` or ``asfound report DIR -o OUTDIR``: condition reports.

A single survey that fails validation writes no PDF and exits 2 with the list of errors. The
output is checked first (:mod:`core.outputs`): never the input, a field store, a survey file
or a section description; an earlier asfound PDF is replaced, any other file only with
``--force``. For
a folder, every survey file (``*.json``) and field store in it is reported in turn with a
progress bar on stderr and one summary line per survey on stdout; a bad file never stops
the rest, and the exit status is 1 when any survey failed (they are listed at the end).
The surveys of a folder are reported side by side in worker processes (``--jobs N``,
default: every core; ``--jobs 1`` reports them one after the other in this process); a
survey whose worker dies (out of memory, killed) is tried once more alone and, if it dies
again, reported as failed like any other bad file.
``--quiet`` leaves out the progress and the lines of the surveys that went well.
"""

from __future__ import annotations

import argparse
import multiprocessing
import os
import signal
import sys
from concurrent.futures import Future, ProcessPoolExecutor, as_completed
from concurrent.futures.process import BrokenProcessPool
from pathlib import Path

from core import CAUTION
from core.bands.cli import add_band_arguments
from core.choices import add_arguments
from core.console import Steps, Voice
from core.errors import AsfoundError
from core.outputs import check_output_folder
from core.survey import is_store_file


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser(
        "report",
        help="write the PDF condition report of a survey (or of every survey in a folder)",
        description="Write the PDF condition report of a survey file or field store, or of "
        "every survey in a folder. " + CAUTION,
    )
    p.add_argument("input", metavar="FILE|DIR", help="survey file, field store or folder")
    p.add_argument(
        "-o",
        "--output",
        metavar="OUT",
        help="PDF to write (folder input: the folder for the PDFs); default: the input's "
        "name with .pdf in the current folder (folder input: ./reports)",
    )
    p.add_argument(
        "--force",
        action="store_true",
        help="replace an existing file that asfound did not write (an earlier asfound "
        "report is replaced without it; an input, a field store or a survey file never is)",
    )
    p.add_argument("--units", choices=("si", "us"), help="unit system (default: the survey's)")
    p.add_argument(
        "--jobs",
        type=_jobs,
        metavar="N",
        help="folder input: surveys reported side by side in N processes (default: every "
        "core; 1: one after the other)",
    )
    add_band_arguments(p)
    add_arguments(p)
    p.set_defaults(func=handler)


def _jobs(text: str) -> int:
    try:
        n = int(text)
    except ValueError:
        raise argparse.ArgumentTypeError(f"{text!r} is not a whole number") from None
    if not 1 <= n <= 256:
        raise argparse.ArgumentTypeError(f"{n} is outside the allowed range (1 to 256)")
    return n


def survey_files(folder: Path) -> list[Path]:
    """Survey files (``*.json``) and field stores in ``folder``, sorted by name."""
    out = []
    for p in sorted(folder.iterdir()):
        if not p.is_file() or p.name.startswith("."):
            continue
        if p.name.endswith(("-wal", "-shm", "-journal")):
            continue
        if p.suffix.lower() == ".json" or is_store_file(p):
            out.append(p)
    return out


def _outputs(files: list[Path], outdir: Path) -> dict[Path, Path]:
    """A PDF path per input, distinct even when two inputs share a stem."""
    stems: dict[str, int] = {}
    for f in files:
        stems[f.stem] = stems.get(f.stem, 0) + 1
    return {
        f: outdir / (f"{f.stem}.pdf" if stems[f.stem] == 1 else f"{f.stem}-{f.suffix[1:]}.pdf")
        for f in files
    }


def report_one(f: Path, out: Path, units: str | None, args: argparse.Namespace) -> tuple:
    """Report one survey of a folder: ("ok", summary) or ("failed", the error); never
    raises (it runs in a worker process; one bad file never stops the rest)."""
    from core.report import build_report

    try:
        rep = build_report(f, out, units=units, args=args, force=getattr(args, "force", False))
    except Exception as e:  # one bad file never stops the rest
        return "failed", f"{type(e).__name__}: {str(e).strip()}"
    return "ok", f"{rep.level.label}, {rep.pages} pages -> {rep.path}"


def _said(f: Path, result: tuple, voice: Voice) -> None:
    kind, text = result
    if kind == "ok":
        if not voice.quiet:
            print(f"ok      {f.name}: {text}", flush=True)
        return
    print(f"FAILED  {f.name}: {text}", flush=True)
    print(f"        no report written for {f.name}", flush=True)


def _worker_start() -> None:
    """Workers leave Ctrl-C to the parent, which stops the whole run (see :func:`_stop`)."""
    signal.signal(signal.SIGINT, signal.SIG_IGN)


def _pool(jobs: int) -> ProcessPoolExecutor:
    methods = multiprocessing.get_all_start_methods()
    ctx = multiprocessing.get_context("fork" if "fork" in methods else None)
    return ProcessPoolExecutor(max_workers=jobs, mp_context=ctx, initializer=_worker_start)


def _stop(pool: ProcessPoolExecutor) -> None:
    """Ctrl-C: no further survey starts and the workers end now. A report being written is
    only a temporary file beside its target (atomic output), so nothing half-written stays."""
    procs = list((getattr(pool, "_processes", None) or {}).values())
    pool.shutdown(wait=False, cancel_futures=True)
    for proc in procs:
        proc.terminate()


def _in_pool(
    files: list[Path], outs: dict[Path, Path], units, args, jobs: int, bar: Steps, voice: Voice
) -> dict:
    """Every survey's result, reported in ``jobs`` worker processes (the bar moves as each
    ends); a survey whose worker died is tried once more alone."""
    results: dict[Path, tuple] = {}
    retry: list[Path] = []
    with _pool(jobs) as pool:
        futures: dict[Future, Path] = {
            pool.submit(report_one, f, outs[f], units, args): f for f in files
        }
        try:
            for fut in as_completed(futures):
                f = futures[fut]
                try:
                    results[f] = fut.result()
                except BrokenProcessPool:
                    retry.append(f)
                    continue
                bar.step(len(results) - 1, f.name)
                _said(f, results[f], voice)
        except KeyboardInterrupt:
            _stop(pool)
            raise
    for f in sorted(retry):
        with _pool(1) as alone:
            try:
                results[f] = alone.submit(report_one, f, outs[f], units, args).result()
            except BrokenProcessPool as e:
                results[f] = ("failed", f"the worker process reporting it stopped ({e})")
        bar.step(len(results) - 1, f.name)
        _said(f, results[f], voice)
    return results


def run_folder(folder: Path, outdir: Path, units: str | None, args: argparse.Namespace) -> int:
    files = survey_files(folder)
    if not files:
        print(
            f"asfound: error: {folder}: no survey files (*.json) or field stores", file=sys.stderr
        )
        return 2
    check_output_folder(outdir, [folder])
    outdir.mkdir(parents=True, exist_ok=True)
    outs = _outputs(files, outdir)
    voice = Voice.of(args)
    bar = Steps(len(files), voice)
    jobs = min(getattr(args, "jobs", None) or os.cpu_count() or 1, len(files))
    if jobs > 1:
        results = _in_pool(files, outs, units, args, jobs, bar, voice)
    else:
        results = {}
        for i, f in enumerate(files):
            bar.step(i, f.name)
            results[f] = report_one(f, outs[f], units, args)
            _said(f, results[f], voice)
    bar.done()
    failed = [f.name for f in files if results[f][0] != "ok"]
    if failed:
        names = ", ".join(failed)
        print(f"asfound: {len(failed)} of {len(files)} survey(s) failed: {names}", file=sys.stderr)
        return 1
    return 0


def handler(args: argparse.Namespace) -> int:
    from core.report import build_report

    src = Path(args.input)
    if src.is_dir():
        out = Path(args.output) if args.output else Path("reports")
        return run_folder(src, out, args.units, args)
    out = Path(args.output) if args.output else Path(src.stem + ".pdf")
    if out.is_dir():
        out = out / (src.stem + ".pdf")
    try:
        rep = build_report(
            src, out, units=args.units, args=args, force=getattr(args, "force", False)
        )
    except AsfoundError as e:
        print(f"asfound: error: {e}", file=sys.stderr)
        print(f"asfound: no report written ({out} untouched)", file=sys.stderr)
        return 2
    if not Voice.of(args).quiet:
        print(f"{src}: {rep.level.label}; {rep.pages} pages -> {rep.path}")
        print(CAUTION, file=sys.stderr)
    return 0
