"""Inputs of the report: survey text with markup characters, surveys that fail validation
(no PDF, a clear error), field stores (edit history), and a folder with a bad file."""

from __future__ import annotations

import json
import os

import pytest

from core.cli import main
from core.cmd_report import report_one
from core.errors import SchemaError
from core.report import build_report
from core.survey import import_survey

from .helpers import MISTAKES, SI_SAMPLE, pdf_pages

TITLE = '<Girder & "Span" 3>'
NOTE = "Pack rust <b>not bold</b> & scale > 5 mm; <font size=40>"


@pytest.fixture(scope="module")
def markup(tmp_path_factory):
    d = tmp_path_factory.mktemp("markup")
    doc = json.loads(SI_SAMPLE.read_text(encoding="utf-8"))
    doc["survey"]["title"] = TITLE
    doc["members"][0]["stations"][0]["notes"] = NOTE
    src = d / "markup.json"
    src.write_text(json.dumps(doc), encoding="utf-8")
    rep = build_report(src, d / "markup.pdf")
    return rep, pdf_pages(rep.path)


def test_title_with_markup_characters_prints_literally(markup):
    _rep, pages = markup
    assert TITLE in pages[0]
    for text in pages:  # the footer of every page
        assert TITLE in text


def test_station_note_with_markup_prints_literally(markup):
    _, pages = markup
    assert NOTE in " ".join(pages)


def test_survey_failing_validation_writes_no_pdf(tmp_path):
    out = tmp_path / "m.pdf"
    with pytest.raises(SchemaError, match="7 error"):
        build_report(MISTAKES, out)
    assert not out.exists()
    assert list(tmp_path.iterdir()) == []  # no temporary file left either


def test_failing_survey_on_the_command_line_exits_2(tmp_path, capsys):
    out = tmp_path / "m.pdf"
    older = b"%PDF-1.4\n<< /Author (asfound 0.1.0) >>\nan older report\n"
    out.write_bytes(older)  # recognised as an earlier report, so it may be replaced
    assert main(["report", str(MISTAKES), "-o", str(out)]) == 2
    err = capsys.readouterr().err
    assert "unknown part id 'web_plate'" in err and "no report written" in err
    assert out.read_bytes() == older  # never replaced by a partial PDF


def test_folder_continues_past_bad_files_and_names_them(tmp_path, capsys):
    src = tmp_path / "in"
    src.mkdir()
    (src / "a-good.json").write_bytes(SI_SAMPLE.read_bytes())
    (src / "b-bad.json").write_bytes(MISTAKES.read_bytes())
    (src / "c-truncated.json").write_text('{"format": "asfound.survey", "vers', encoding="utf-8")
    import_survey(SI_SAMPLE, src / "d-store.db", who="test inspector")
    out = tmp_path / "out"
    assert main(["report", str(src), "-o", str(out)]) == 1
    cap = capsys.readouterr()
    assert "[" in cap.err and "4/4" in cap.err  # the progress bar reached the end
    assert "b-bad.json" in cap.err and "c-truncated.json" in cap.err
    assert "a-good.json" not in cap.err.split("failed:")[-1]
    assert sorted(p.name for p in out.iterdir()) == ["a-good.pdf", "d-store.pdf"]
    ok = [ln for ln in cap.out.splitlines() if ln.startswith("ok")]
    assert len(ok) == 2 and all("needs immediate attention" in ln for ln in ok)
    text = " ".join(pdf_pages(out / "d-store.pdf"))
    assert "Edit history" in text and "Field store d-store.db" in text
    assert "test inspector" in text


def test_a_merged_store_lists_the_merge_decisions(tmp_path):
    """A store merged from two devices (``asfound merge``): the history section flags
    each decision of the merge for the engineer's review."""
    import shutil

    from core.survey import FieldStore
    from core.survey.merge import merge_stores
    from tests.survey.helpers import document, write

    a, b = tmp_path / "a.asf", tmp_path / "b.asf"
    import_survey(write(tmp_path / "small.json", document()), a, who="office")
    shutil.copy(a, b)
    m = None
    for path, dev, who, v in ((a, "tablet-aa", "ann", 1.0), (b, "tablet-bb", "bob", 2.0)):
        with FieldStore.open(path, device=dev) as s:
            m = s.to_survey().members[0]
            st = m.stations[0]
            s.set_note(m.id, st.id, f"checked twice ({v:g})", who)
    merged = merge_stores(a, b, tmp_path / "c.asf").output
    rep = build_report(merged, tmp_path / "c.pdf")
    text = " ".join(pdf_pages(rep.path))
    assert "merged from two devices' stores: 1 decision(s) of the merge to review" in text
    assert f"value at {m.id} / station {m.stations[0].id} / notes: both devices changed it" in text


def test_folder_in_worker_processes_gives_what_one_process_gives(tmp_path, capsys):
    """--jobs 2 writes the same reports and summary lines as --jobs 1, in the same order
    (the folder's)."""
    src = tmp_path / "in"
    src.mkdir()
    (src / "a.json").write_bytes(SI_SAMPLE.read_bytes())
    (src / "b-bad.json").write_bytes(MISTAKES.read_bytes())
    (src / "c.json").write_bytes(SI_SAMPLE.read_bytes())
    said = {}
    for jobs in ("1", "2"):
        out = tmp_path / f"out{jobs}"
        assert main(["report", str(src), "-o", str(out), "--jobs", jobs]) == 1
        cap = capsys.readouterr()
        said[jobs] = cap.out.replace(str(out), "OUT").splitlines()
        assert "3/3" in cap.err and "1 of 3 survey(s) failed: b-bad.json" in cap.err
        assert sorted(p.name for p in out.iterdir()) == ["a.pdf", "c.pdf"]
    assert said["1"] == said["2"]


def _dies_on_b(f, out, units, args):
    """A worker that dies (exits at once) on the survey named b*, else reports it."""
    if f.name.startswith("b"):
        os._exit(3)
    return report_one(f, out, units, args)


def test_a_worker_that_dies_fails_only_its_survey(tmp_path, capsys, monkeypatch):
    """A survey whose worker process dies is tried again alone, then reported as failed;
    the others are reported."""
    import core.cmd_report as cmd

    monkeypatch.setattr(cmd, "report_one", _dies_on_b)
    src = tmp_path / "in"
    src.mkdir()
    for name in ("a.json", "b.json", "c.json"):
        (src / name).write_bytes(SI_SAMPLE.read_bytes())
    out = tmp_path / "out"
    assert main(["report", str(src), "-o", str(out), "--jobs", "2"]) == 1
    cap = capsys.readouterr()
    assert "FAILED  b.json: the worker process reporting it stopped" in cap.out
    assert "1 of 3 survey(s) failed: b.json" in cap.err
    assert sorted(p.name for p in out.iterdir()) == ["a.pdf", "c.pdf"]
    said = [line.split()[1] for line in cap.out.splitlines() if not line.startswith(" ")]
    assert said == ["a.json:", "b.json:", "c.json:"]  # the folder's order


def test_jobs_must_be_a_whole_number_in_range(capsys):
    for bad in ("0", "x", "1000"):
        with pytest.raises(SystemExit):
            main(["report", "anything", "--jobs", bad])
        assert "--jobs" in capsys.readouterr().err


def test_ctrl_c_stops_a_folder_run_in_worker_processes(tmp_path):
    """Ctrl-C (SIGINT) during ``report DIR --jobs 2`` stops the run: exit 130 (README's
    exit codes) and the surveys not yet reported are not reported behind the user's back."""
    import signal
    import subprocess
    import sys
    from pathlib import Path

    src = tmp_path / "in"
    src.mkdir()
    n = 10
    for i in range(n):
        (src / f"s{i:02d}.json").write_bytes(SI_SAMPLE.read_bytes())
    out = tmp_path / "out"
    root = Path(__file__).resolve().parents[2]
    child = subprocess.Popen(
        [sys.executable, "-m", "core", "report", str(src), "-o", str(out), "--jobs", "2"],
        stdout=subprocess.PIPE,
        stderr=subprocess.DEVNULL,
        cwd=root,
        env=dict(os.environ, PYTHONPATH=str(root)),
    )
    assert child.stdout.readline().startswith(b"ok")  # the pool is running
    child.send_signal(signal.SIGINT)
    assert child.wait(timeout=120) == 130
    written = list(out.glob("*.pdf"))
    assert 1 <= len(written) < n
    for p in written:
        assert p.read_bytes()[:5] == b"%PDF-"
