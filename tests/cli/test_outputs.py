"""No output over an input, a field store or a file of another kind, for every command.

Each refusal exits 2 with one error line that names the output and the input, and leaves
every file as it was. An earlier output of the same kind is replaced (an asfound PDF by a
new report, an export by a new export of the same survey); any other file only with
--force; a store or a survey file never. Outputs get the umask's mode and are written
atomically. (Rules of core.outputs; the cases are those of issue 9.)
"""

from __future__ import annotations

import json
import os
import sqlite3
import stat
import time
from pathlib import Path

import pytest

from core.cli import main
from core.errors import OutputError
from core.outputs import (
    STALE_TEMPORARY_S,
    atomic_output,
    check_output,
    identify,
    sweep_stale_temporaries,
)
from core.survey import FieldStore, export_survey, import_survey
from tests.survey.helpers import SAMPLES, document, write

SECTION = SAMPLES / "section-demo-si.json"


@pytest.fixture
def survey(tmp_path) -> Path:
    """A small valid survey file (invented values)."""
    return write(tmp_path / "in.json", document())


@pytest.fixture
def store(tmp_path, survey) -> Path:
    return import_survey(survey, tmp_path / "field.asf", who="test")


def _refused(capsys, argv: list[str], *untouched: Path, names: tuple[str, ...] = ()) -> str:
    before = {p: p.read_bytes() for p in untouched}
    assert main(argv) == 2
    err = capsys.readouterr().err
    assert "refusing to write" in err and "nothing was written" in err, err
    for n in names:
        assert n in err, (n, err)
    for p, data in before.items():
        assert p.read_bytes() == data, f"{p} was changed"
    return err


def _no_temporaries(folder: Path) -> None:
    assert [p.name for p in folder.iterdir() if p.name.endswith(".tmp")] == []


# ------------------------------------------------------------------------------ report
def test_report_over_its_input_is_refused(tmp_path, survey, capsys):
    err = _refused(capsys, ["report", str(survey), "-o", str(survey)], survey, names=(str(survey),))
    assert "it is the input" in err
    other = tmp_path / "sub" / ".." / "in.json"  # the same file by another spelling
    (tmp_path / "sub").mkdir()
    _refused(capsys, ["report", str(survey), "-o", str(other)], survey)
    _no_temporaries(tmp_path)


def test_report_over_a_hard_link_or_symlink_of_its_input_is_refused(tmp_path, survey, capsys):
    link = tmp_path / "same.pdf"
    os.link(survey, link)
    _refused(capsys, ["report", str(survey), "-o", str(link)], survey, names=(str(link),))
    sym = tmp_path / "sym.pdf"
    sym.symlink_to(survey)
    _refused(capsys, ["report", str(survey), "-o", str(sym)], survey)


def test_report_over_a_store_its_journal_or_a_survey_file_is_refused_even_with_force(
    tmp_path, survey, store, capsys
):
    other = write(tmp_path / "other.json", document())
    for out in (store, other, SECTION):
        for force in ([], ["--force"]):
            _refused(capsys, ["report", str(survey), "-o", str(out), *force], out, survey)
    err = _refused(capsys, ["report", str(store), "-o", f"{store}-wal"], store)
    assert "journal file of the input store" in err


def test_report_of_a_store_named_like_its_default_output_is_refused(tmp_path, store, capsys):
    named = tmp_path / "field.pdf"  # a store with a .pdf name: the default output is itself
    os.replace(store, named)
    cwd = os.getcwd()
    os.chdir(tmp_path)
    try:
        _refused(capsys, ["report", "field.pdf"], named)
    finally:
        os.chdir(cwd)


def test_report_replaces_an_earlier_report_and_a_foreign_file_only_with_force(
    tmp_path, survey, capsys
):
    out = tmp_path / "r.pdf"
    assert main(["report", str(survey), "-o", str(out)]) == 0
    assert identify(out).kind == "asfound-pdf"
    inode = out.stat().st_ino
    assert main(["report", str(survey), "-o", str(out)]) == 0  # an earlier report: replaced
    assert identify(out).kind == "asfound-pdf"
    assert out.stat().st_ino != inode  # a new file renamed into place, not rewritten
    notes = tmp_path / "notes.txt"
    notes.write_text("the inspector's own notes", encoding="utf-8")
    err = _refused(capsys, ["report", str(survey), "-o", str(notes)], notes)
    assert "add --force to replace it" in err
    assert main(["report", str(survey), "-o", str(notes), "--force"]) == 0
    assert notes.read_bytes().startswith(b"%PDF-")
    _no_temporaries(tmp_path)


def test_report_folder_refuses_a_file_as_its_folder_and_a_store_in_it(
    tmp_path, survey, store, capsys
):
    src = tmp_path / "surveys"
    src.mkdir()
    write(src / "g.json", document())
    _refused(capsys, ["report", str(src), "-o", str(survey)], survey, names=(str(survey),))
    outdir = tmp_path / "pdfs"
    outdir.mkdir()
    trap = outdir / "g.pdf"  # a store where the report of g.json would go
    os.replace(store, trap)
    before = trap.read_bytes()
    assert main(["report", str(src), "-o", str(outdir), "--force"]) == 1
    cap = capsys.readouterr()
    assert "FAILED  g.json" in cap.out and "it is a field store" in cap.out
    assert trap.read_bytes() == before


# ------------------------------------------------------------------------------ export
def test_export_over_its_store_or_another_store_is_refused(tmp_path, survey, store, capsys):
    err = _refused(capsys, ["export", str(store), "-o", str(store)], store, names=(str(store),))
    assert "it is the input" in err
    other = import_survey(survey, tmp_path / "other.asf")
    _refused(capsys, ["export", str(store), "-o", str(other), "--force"], other, store)
    _refused(capsys, ["export", str(store), "-o", f"{store}-shm"], store)
    link = tmp_path / "hard.json"
    os.link(store, link)
    _refused(capsys, ["export", str(store), "-o", str(link)], store)
    with FieldStore.open(store) as s:  # the store is whole
        assert s.to_survey().survey.id == "T-1"
    with pytest.raises(OutputError, match="it is the input"), FieldStore.open(store) as s:
        export_survey(s, store)


def test_export_replaces_an_earlier_export_of_the_same_survey_only(tmp_path, store, capsys):
    out = tmp_path / "out.json"
    assert main(["export", str(store), "-o", str(out)]) == 0
    assert main(["export", str(store), "-o", str(out)]) == 0  # same survey id: replaced
    theirs = tmp_path / "theirs.json"
    write(theirs, document() | {"survey": {"id": "OTHER-7", "year_built": 1900}})
    for force in ([], ["--force"]):
        err = _refused(capsys, ["export", str(store), "-o", str(theirs), *force], theirs)
        assert "survey 'OTHER-7'" in err and "never replaced by another" in err
    damaged = tmp_path / "damaged.json"
    damaged.write_text('{"format": "asfound.survey", "version": 1, "survey": {"id"', "utf-8")
    _refused(capsys, ["export", str(store), "-o", str(damaged), "--force"], damaged)
    foreign = tmp_path / "list.json"
    foreign.write_text('{"shopping": ["bolts"]}', encoding="utf-8")
    _refused(capsys, ["export", str(store), "-o", str(foreign)], foreign)
    assert main(["export", str(store), "-o", str(foreign), "--force"]) == 0
    assert json.loads(foreign.read_text(encoding="utf-8"))["survey"]["id"] == "T-1"


# ------------------------------------------------------------------------------ import
def test_import_never_replaces_anything(tmp_path, survey, store, capsys):
    err = _refused(capsys, ["import", str(survey), "-o", str(survey)], survey)
    assert "it is the input" in err
    _refused(capsys, ["import", str(survey), "-o", str(store)], store, names=(str(store),))
    notes = tmp_path / "notes.txt"
    notes.write_text("keep me", encoding="utf-8")
    err = _refused(capsys, ["import", str(survey), "-o", str(notes)], notes)
    assert "a new store never replaces a file" in err
    sym = tmp_path / "sym.asf"
    sym.symlink_to(survey)
    _refused(capsys, ["import", str(survey), "-o", str(sym)], survey)
    _no_temporaries(tmp_path)


# ------------------------------------------------------------------------------ modes
@pytest.mark.parametrize("umask", [0o022, 0o077, 0o002])
def test_outputs_get_the_umask_mode_not_0600(tmp_path, survey, umask):
    old = os.umask(umask)
    try:
        store = tmp_path / "s.asf"
        assert main(["import", str(survey), "-o", str(store)]) == 0
        out = tmp_path / "e.json"
        assert main(["export", str(store), "-o", str(out)]) == 0
        pdf = tmp_path / "r.pdf"
        assert build_pdf(survey, pdf) == 0
    finally:
        os.umask(old)
    want = 0o666 & ~umask
    for p in (store, out, pdf):
        assert stat.S_IMODE(p.stat().st_mode) == want, (p.name, oct(p.stat().st_mode), oct(want))


def build_pdf(survey: Path, pdf: Path) -> int:
    return main(["report", str(survey), "-o", str(pdf)])


# ------------------------------------------------------------------------------ the writer
def test_atomic_output_keeps_the_old_file_when_the_writer_fails(tmp_path):
    out = tmp_path / "out.pdf"
    out.write_bytes(b"old")
    with pytest.raises(RuntimeError), atomic_output(out) as tmp:
        tmp.write_bytes(b"half of the new")
        raise RuntimeError("the build failed")
    assert out.read_bytes() == b"old"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["out.pdf"]


def test_a_new_store_is_never_linked_over_a_file_that_appeared(tmp_path):
    out = tmp_path / "new.asf"
    with (
        pytest.raises(OutputError, match="appeared meanwhile"),
        atomic_output(out, replace=False) as tmp,
    ):
        tmp.write_bytes(b"new store")
        out.write_bytes(b"somebody else's")
    assert out.read_bytes() == b"somebody else's"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["new.asf"]


def test_identify_reads_content_not_names(tmp_path, store):
    pdf_named = tmp_path / "looks.pdf"
    pdf_named.write_bytes(store.read_bytes())
    assert identify(pdf_named).kind == "store"
    conn = sqlite3.connect(store)  # an open writer keeps a -wal file beside the store
    conn.execute("PRAGMA journal_mode=WAL")
    conn.execute("CREATE TABLE IF NOT EXISTS t(x)")
    wal = Path(f"{store}-wal")
    try:
        assert wal.exists()
        assert identify(wal).kind == "store-companion"
    finally:
        conn.close()
    assert identify(tmp_path / "absent.pdf") is None
    assert identify(tmp_path).kind == "folder"
    with pytest.raises(OutputError, match="it is a folder"):
        check_output(tmp_path, [], "pdf", force=True)


def test_an_output_that_cannot_be_written_is_an_asfound_error(tmp_path, survey, capsys):
    blocker = tmp_path / "plain.txt"
    blocker.write_text("a file where a folder is wanted", encoding="utf-8")
    assert main(["report", str(survey), "-o", str(blocker / "r.pdf")]) == 2
    err = capsys.readouterr().err
    assert f"cannot write {blocker / 'r.pdf'}" in err
    assert blocker.read_text(encoding="utf-8") == "a file where a folder is wanted"


def test_a_killed_writers_old_temporaries_are_swept_at_the_next_write_and_nothing_else(tmp_path):
    """A writer killed mid-write leaves ``.<name>.<hex>.tmp`` (and SQLite companions) beside
    the target; the next write of that target removes those older than a day, never a
    fresh one (a writer may still be at work), nor another output's or a foreign file."""
    out = tmp_path / "s.sqlite"
    old = time.time() - STALE_TEMPORARY_S - 60
    stale = [tmp_path / ".s.sqlite.0123456789ab.tmp", tmp_path / ".s.sqlite.0123456789ab.tmp-wal"]
    kept = [
        tmp_path / ".s.sqlite.fedcba987654.tmp",  # fresh: a writer may be at work
        tmp_path / ".t.sqlite.0123456789ab.tmp",  # another output's
        tmp_path / ".s.sqlite.notatemporary.tmp",  # not a name atomic_output makes
        tmp_path / "s.sqlite.0123456789ab.tmp",  # not hidden
    ]
    for p in stale + kept:
        p.write_bytes(b"x")
    for p in stale + kept[1:]:
        os.utime(p, (old, old))
    with atomic_output(out) as tmp:
        tmp.write_bytes(b"new")
    assert out.read_bytes() == b"new"
    assert not any(p.exists() for p in stale)
    assert all(p.exists() for p in kept)
    assert sweep_stale_temporaries(out) == 0
