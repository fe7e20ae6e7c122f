"""What a fuzz case runs: the inputs, the commands, and the time limit per case.

Three kinds of input, each a hypothesis strategy of cases and a function that turns a case
into the files and the commands the worker runs:

* ``survey``: a sample survey file, mutated (:mod:`tests.fuzz.mutate`); validate, assess
  (table and JSON), report, import into a new store and export it again, and the trend from
  the invented earlier survey of the through girder to it (JSON, one projection step);
* ``section``: the sample section description, mutated, or a random one
  (:mod:`tests.fuzz.sections`); ``asfound section`` in both unit systems and as JSON;
* ``store``: a field store of the SI sample with an entry mutated or its bytes damaged
  (:mod:`tests.fuzz.stores`); validate, report (which assesses), export, and merge with
  the undamaged store (the same survey: a copy of one start).
"""

from __future__ import annotations

import json
from functools import lru_cache
from pathlib import Path

from hypothesis import strategies as st

ROOT = Path(__file__).resolve().parents[2]
SAMPLES = ROOT / "survey_samples"
#: the survey samples the mutations start from (the valid ones twice as often)
SURVEY_SAMPLES = (
    "deck-girder-si.json",
    "through-girder-us.json",
    "deck-girder-si.json",
    "through-girder-us.json",
    "mistakes.json",
)
SECTION_SAMPLE = "section-demo-si.json"

#: seconds one case (all its commands) may take before it counts as a hang; a valid sample
#: takes about 2 s for validate, assess and report on a quiet 2-core machine, and the
#: largest case the mutations make (about 100 stations) about 12 s
CASE_LIMIT_S = 45.0

SURVEY_COMMANDS = [
    ["validate", "{dir}/in.json"],
    ["assess", "{dir}/in.json"],
    ["assess", "{dir}/in.json", "--json"],
    ["report", "{dir}/in.json", "-o", "{dir}/out.pdf"],
    ["import", "{dir}/in.json", "-o", "{dir}/new.asf"],
    ["export", "{dir}/new.asf", "-o", "{dir}/out.json"],
]
#: the trend from the invented earlier survey of the through girder to the case's survey
TREND_COMMANDS = [
    [
        "trend",
        str(SAMPLES / "earlier" / "through-girder-us-2019.json"),
        "{dir}/in.json",
        "--json",
        "--horizon",
        "10",
        "--step",
        "10",
    ],
]
SECTION_COMMANDS = [
    ["section", "{dir}/in.json"],
    ["section", "{dir}/in.json", "--json", "--units", "us"],
]
STORE_COMMANDS = [
    ["validate", "{dir}/in.asf"],
    ["report", "{dir}/in.asf", "-o", "{dir}/out.pdf"],
    ["export", "{dir}/in.asf", "-o", "{dir}/out.json"],
    ["merge", "{dir}/in.asf", "{dir}/base.asf", "-o", "{dir}/merged.asf"],
]
KINDS = ("survey", "section", "store")


@lru_cache(maxsize=8)
def sample(name: str) -> dict:
    return json.loads((SAMPLES / name).read_text(encoding="utf-8"))


def strategy(kind: str) -> st.SearchStrategy:
    """The cases of one kind of input."""
    from tests.fuzz.mutate import cases
    from tests.fuzz.sections import section_docs
    from tests.fuzz.stores import store_cases

    if kind == "survey":
        return st.tuples(st.just("survey"), st.sampled_from(SURVEY_SAMPLES), cases())
    if kind == "section":
        return st.one_of(
            st.tuples(st.just("section"), st.just(SECTION_SAMPLE), cases()),
            st.tuples(st.just("section"), st.just("random"), section_docs()),
        )
    return st.tuples(st.just("store"), st.just("deck-girder-si.json"), store_cases())


def job(case: tuple) -> tuple[dict[str, bytes], list[list[str]]]:
    """The files and the commands of a case drawn from :func:`strategy`."""
    from tests.fuzz.mutate import apply
    from tests.fuzz.stores import mutate_store, sample_store

    kind, name, arg = case
    if kind == "survey":
        return {"in.json": apply(sample(name), arg)}, SURVEY_COMMANDS + TREND_COMMANDS
    if kind == "section":
        data = arg if name == "random" else apply(sample(name), arg)
        return {"in.json": data}, SECTION_COMMANDS
    row, muts, damage = arg
    files = {"in.asf": mutate_store(sample_store(), row, muts, damage), "base.asf": sample_store()}
    return files, STORE_COMMANDS


def describe(case: tuple) -> str:
    """A case in words short enough for a failure message (it can be replayed from it)."""
    kind, name, arg = case
    text = f"{kind} {name}: {arg!r}"
    return text if len(text) < 3000 else text[:3000] + " ..."
