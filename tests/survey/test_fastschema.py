"""The quick schema pass (``core.survey.fastschema``) never calls a document valid that the
full check (``jsonschema``) refuses: on the fuzz mutations of the samples and on chosen edge
cases of JSON numbers and texts, "known valid" implies no schema error. (A property of our
own code: both validators implement JSON Schema draft 2020-12.)"""

from __future__ import annotations

import json

import jsonschema
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from core.survey import fastschema
from core.survey.validate import schema
from tests.fuzz.cases import SURVEY_SAMPLES, sample
from tests.fuzz.mutate import apply, cases

pytestmark = pytest.mark.skipif(fastschema.jsonschema_rs is None, reason="jsonschema_rs absent")


def _agree(doc) -> None:
    ver = doc.get("version") if isinstance(doc, dict) else None
    if not isinstance(ver, int) or isinstance(ver, bool) or ver not in (1, 2):
        return
    full = list(jsonschema.Draft202012Validator(schema(ver)).iter_errors(doc))
    if fastschema.known_valid(doc, ver):
        assert full == [], [e.message for e in full]


def test_the_samples_are_known_valid() -> None:
    for name in SURVEY_SAMPLES:
        doc = sample(name)
        if doc.get("format") == "asfound.survey" and name != "mistakes.json":
            assert fastschema.known_valid(doc, doc["version"])


@settings(max_examples=150, deadline=None, suppress_health_check=list(HealthCheck))
@given(st.sampled_from(SURVEY_SAMPLES), cases())
def test_known_valid_implies_no_schema_error(name: str, muts) -> None:
    text = apply(sample(name), muts)
    try:
        doc = json.loads(text.decode("utf-8"))
    except (UnicodeDecodeError, ValueError, RecursionError):
        return
    _agree(doc)


@pytest.mark.parametrize(
    "path, value",
    [
        (("survey", "year_built"), 1.0),
        (("survey", "year_built"), True),
        (("survey", "year_built"), 2**70),
        (("survey", "year_built"), 1e300),
        (("survey", "title"), "\ud800"),
        (("survey", "title"), "x" * 30_000),
        (("survey", "title"), None),
        (("note",), 3),
        (("members", 0, "stations", 0, "position"), "1"),
        (("members", 0, "stations", 0, "readings", 0, "value"), -0.0),
        (("members", 0, "stations", 0, "readings", 0, "value"), 2**64 + 1),
    ],
)
def test_edge_values(path: tuple, value) -> None:
    doc = sample("deck-girder-si.json")
    node = doc
    for step in path[:-1]:
        node = node[step]
    node[path[-1]] = value
    _agree(doc)
