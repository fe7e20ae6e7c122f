"""The engineer's choices: the same for assess and report, from the survey, one options file
or the command line (later layers win key by key). Properties of our own interface."""

from __future__ import annotations

import contextlib
import io
import json

import pytest
from pypdf import PdfReader

from core.assess.options import merged, options_from_dict
from core.cli import main
from core.errors import InputError
from tests.assess.helpers import SAMPLES

US = str(SAMPLES / "through-girder-us.json")


def run(*argv: str) -> str:
    buf = io.StringIO()
    with contextlib.redirect_stdout(buf):
        assert main(list(argv)) == 0
    return buf.getvalue()


def options_file(tmp_path, **opts) -> str:
    p = tmp_path / "choices.json"
    p.write_text(json.dumps({"format": "asfound.options", "version": 1, "options": opts}))
    return str(p)


def test_assess_and_report_read_the_same_options_file(tmp_path):
    f = options_file(tmp_path, level="legal", condition="good", factors={"gLL": 1.45})
    doc = json.loads(run("assess", US, "--options", f, "--json"))
    fac = {x["symbol"]: x for x in doc["family"]["factors"]}
    assert fac["gLL"]["value"] == 1.45 and fac["gLL"]["source"].startswith("engineer's input")
    mf = {x["symbol"]: x["value"] for x in doc["members"][0]["factors"]}
    assert mf["phi_c"] == 1.00  # condition good from the file
    worst = min(
        ls["rating_factor"]
        for s in doc["members"][0]["stations"]
        for ls in s["limit_states"]
        if ls["rating_factor"] is not None
    )
    out = tmp_path / "r.pdf"
    run("report", US, "-o", str(out), "--options", f)
    text = " ".join(" ".join((p.extract_text() or "").split()) for p in PdfReader(str(out)).pages)
    assert "factor gLL 1.45" in text and "legal" in text
    assert f"{worst:.3g}" in text  # the same worst rating factor in the report


def test_flags_win_over_the_file_and_the_file_over_the_survey(tmp_path):
    f = options_file(tmp_path, rating_level="legal", depth_basis="web")
    doc = json.loads(run("assess", US, "--options", f, "--rating-level", "operating", "--json"))
    fac = {x["symbol"]: x["value"] for x in doc["family"]["factors"]}
    assert fac["gLL"] == 1.35  # operating from the flag
    assert doc["family"]["depth_basis"] == "web"  # from the file
    old = json.loads(run("assess", US, "--options", f, "--level", "operating", "--json"))
    assert old["family"] == doc["family"]  # the earlier name --level still works, hidden
    layers = merged({"level": "legal", "factors": {"gDC": 1.3}}, {"factors": {"gDW": 1.25}})
    assert layers == {"level": "legal", "factors": {"gDC": 1.3, "gDW": 1.25}}


def test_bad_options_are_named(tmp_path, capsys):
    f = options_file(tmp_path, level="super")
    assert main(["assess", US, "--options", f]) == 2
    err = capsys.readouterr().err
    assert "choices.json" in err and "rating level 'super'" in err
    with pytest.raises(InputError, match=r"unknown option\(s\) \['colour'\]"):
        options_from_dict({"colour": "red"})
    assert main(["assess", US, "--factor", "gamma_M1=1.0"]) == 2
    assert "'gamma_M1' is not a factor of the AASHTO family" in capsys.readouterr().err
