"""``asfound assess``: the bands under one new JSON key and in a text section; the choice
flags and their errors."""

from __future__ import annotations

import contextlib
import io
import json

from core.cli import main
from tests.assess.helpers import SAMPLES


def run(*argv: str) -> tuple[int, str, str]:
    so, se = io.StringIO(), io.StringIO()
    with contextlib.redirect_stdout(so), contextlib.redirect_stderr(se):
        rc = main(list(argv))
    return rc, so.getvalue(), se.getvalue()


def test_json_has_one_bands_key_with_every_station():
    rc, out, _ = run("assess", "--json", str(SAMPLES / "through-girder-us.json"))
    assert rc == 0
    doc = json.loads(out)
    b = doc["bands"]
    assert b["method"] == "first_order" and b["engine_evaluations"] > 0
    assert any("not a reliability rating" in x["value"] for x in b["assumptions"])
    m = b["members"][0]
    assert [s["station"] for s in m["stations"]] == [
        s["station"] for s in doc["members"][0]["stations"]
    ]
    assert len(m["advice"]) == 3 and m["advice"][0].startswith("3 more readings on the ")
    for s in m["stations"]:
        for ls in s["limit_states"]:
            c = ls["capacity"]
            if c is not None:
                assert c["p5"] <= c["value"] <= c["p95"] and c["unit"]
            if ls["measure"] is not None:
                assert ls["measure"]["beyond"] == "P(RF < 1)"
                assert 0.0 <= ls["measure"]["p_beyond"] <= 1.0


def test_text_section_and_monte_carlo_flag():
    rc, out, _ = run(
        "assess",
        "--band-method",
        "monte_carlo",
        "--band-samples",
        "20",
        str(SAMPLES / "deck-girder-si.json"),
    )
    assert rc == 0
    assert "capacity bands from the readings (Monte Carlo; an aid, not a reliability" in out
    assert "Where to measure next:\n  1. 3 more readings on the " in out
    assert "P(U > 1)" in out


def test_bad_samples_are_refused_with_the_range():
    rc, _, err = run("assess", "--band-samples", "5", str(SAMPLES / "deck-girder-si.json"))
    assert rc != 0 and "samples 5 is outside 20 to 100000" in err


def test_an_instruments_tolerance_from_the_command_line():
    """A zero tolerance for the sample's gauge leaves the readings' scatter only: every
    region's sigma is its standard error alone (smaller than with the default)."""
    f = str(SAMPLES / "deck-girder-si.json")
    _, out, _ = run("assess", "--json", f)
    _, out0, _ = run("assess", "--json", "--band-tolerance", "ultrasonic gauge=0", f)
    a = json.loads(out)["bands"]["members"][0]["stations"][0]["regions"]
    b = json.loads(out0)["bands"]["members"][0]["stations"][0]["regions"]
    assert all(y["tolerance"]["value"] == 0.0 for y in b)
    assert all(y["sigma"]["value"] < x["sigma"]["value"] for x, y in zip(a, b, strict=True))
    rc, _, err = run("assess", "--band-tolerance", "caliper", f)
    assert rc != 0 and "is not INSTRUMENT=MM" in err
    rc, _, err = run("assess", "--band-tolerance", "caliper=9", f)
    assert rc != 0 and "outside 0 to 5 mm" in err
