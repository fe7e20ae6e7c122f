"""The command line: asfound validate, import and export."""

from __future__ import annotations

import json

from core.cli import main

from .helpers import MISTAKES, SI_SAMPLE, US_SAMPLE


def test_validate_lists_every_problem_and_fails_on_errors(capsys):
    assert main(["validate", str(MISTAKES)]) == 1
    out = capsys.readouterr().out
    assert out.count("error: ") == 7
    for text in (
        "'n/a' is not of type 'number'",
        "unknown part id 'web_plate'",
        "beyond the member",
        "perforation outside its plate",
        "station position 19.5 m is outside the member",
        "unit slip",
        "above the nominal thickness",
    ):
        assert text in out
    assert "7 error(s), 2 warning(s)" in out


def test_validate_errors_only(capsys):
    assert main(["validate", "--errors-only", str(MISTAKES)]) == 1
    out = capsys.readouterr().out
    assert "warning: " not in out and out.count("error: ") == 7


def test_import_export_and_validate_a_store(tmp_path, capsys):
    store = tmp_path / "tc.asf"
    out = tmp_path / "tc.json"
    assert main(["import", str(US_SAMPLE), "-o", str(store), "--who", "office"]) == 0
    assert main(["validate", str(store)]) == 0
    assert main(["export", str(store), "-o", str(out)]) == 0
    assert json.loads(out.read_text()) == json.loads(US_SAMPLE.read_text())
    assert "0 error(s)" in capsys.readouterr().out


def test_import_of_a_file_with_errors_fails_cleanly(tmp_path, capsys):
    store = tmp_path / "m.asf"
    assert main(["import", str(MISTAKES), "-o", str(store)]) == 2
    err = capsys.readouterr().err
    assert "asfound: error:" in err and "unknown part id 'web_plate'" in err
    assert not store.exists()


def test_export_of_a_missing_store_fails_cleanly(tmp_path, capsys):
    assert main(["export", str(tmp_path / "none.asf"), "-o", str(tmp_path / "x.json")]) == 2
    assert "no such field store" in capsys.readouterr().err
    assert main(["validate", str(SI_SAMPLE)]) == 0
