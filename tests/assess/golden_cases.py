"""The outputs kept as golden copies: what the command line prints for the invented samples.

Each case is a command line run in-process (``core.cli.main``); its stdout and stderr are
kept with the sample's folder replaced by ``<samples>`` so the copies do not depend on where
the repository is checked out. ``python -m tests.assess.golden_cases`` writes the copies (only
to be run on purpose, when a change of results is intended and reviewed); the test
``test_golden`` compares every output to its copy: the text outside numbers character by
character, every number to 12 significant digits (the last bits depend on the machine).
"""

from __future__ import annotations

import contextlib
import io
import json
from pathlib import Path

from core.cli import main
from core.survey import load_survey

ROOT = Path(__file__).resolve().parents[2]
SAMPLES = ROOT / "survey_samples"
GOLDEN = Path(__file__).resolve().parent / "golden"

SURVEYS = ("deck-girder-si", "through-girder-us")
STANDARDS = ("aashto", "aisc", "en1993")


def cases() -> dict[str, list[str]]:
    """Golden file name -> the command line (paths relative to the samples folder)."""
    out: dict[str, list[str]] = {}
    for s in SURVEYS:
        for std in STANDARDS:
            out[f"assess-{s}-{std}.json"] = ["assess", "--json", "--standard", std, f"{s}.json"]
        out[f"assess-{s}-minimum-us.json"] = [
            "assess", "--json", "--thickness", "minimum", "--units", "us", f"{s}.json",
        ]  # fmt: skip
        out[f"assess-{s}-options.json"] = [
            "assess", "--json", "--depth", "web", "--loose-counts", "--condition", "poor",
            "--live-load", "none", f"{s}.json",
        ]  # fmt: skip
        out[f"assess-{s}.txt"] = ["assess", f"{s}.json"]
    for s in (*SURVEYS, "mistakes", "section-demo-si"):
        out[f"validate-{s}.txt"] = ["validate", f"{s}.json"]
    out["assess-mistakes.txt"] = ["assess", "mistakes.json"]
    return out


def run_case(argv: list[str]) -> str:
    """stdout, stderr and exit code of one command line, with the samples folder masked."""
    args = [str(SAMPLES / a) if a.endswith(".json") else a for a in argv]
    so, se = io.StringIO(), io.StringIO()
    with contextlib.redirect_stdout(so), contextlib.redirect_stderr(se):
        rc = main(args)
    text = f"exit {rc}\n--- stdout\n{so.getvalue()}--- stderr\n{se.getvalue()}"
    return text.replace(str(SAMPLES), "<samples>")


def readings_table(name: str, policy: str = "mean") -> str:
    """Every region's statistics of a sample at full precision (COV to 12 digits, the report
    prints 3) and its notes, one line per region."""
    from core.survey.readings import station_stats

    survey, _ = load_survey(SAMPLES / f"{name}.json")
    lines = []
    for m in survey.members:
        for s in m.stations:
            for r in station_stats(s, m, policy):
                cov = "-" if r.cov is None else f"{r.cov:.12g}"
                lines.append(
                    f"{m.id} {s.id} {r.part} {r.region} n={r.n} nom={r.t_nominal!r} "
                    f"min={r.t_min!r} mean={r.t_mean!r} cov={cov} used={r.t_used!r} "
                    f"local={r.t_local!r} ids={','.join(r.reading_ids)}"
                )
                lines += [f"    {p.level}: {p.message} @ {p.where}" for p in r.notes]
    return "\n".join(lines).replace(str(SAMPLES), "<samples>") + "\n"


def outputs() -> dict[str, str]:
    """Every golden file name with the text the current code produces."""
    out = {name: run_case(argv) for name, argv in cases().items()}
    for s in SURVEYS:
        for policy in ("mean", "minimum"):
            out[f"readings-{s}-{policy}.txt"] = readings_table(s, policy)
    return out


def write() -> None:
    """Write every golden copy (on purpose only)."""
    GOLDEN.mkdir(exist_ok=True)
    for name, text in outputs().items():
        if name.endswith(".json"):
            json.loads(text.split("--- stdout\n", 1)[1].split("--- stderr\n", 1)[0])
        (GOLDEN / name).write_text(text, encoding="utf-8")


if __name__ == "__main__":
    write()
