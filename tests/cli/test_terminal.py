"""The command line behaves like the tools engineers already use (issue 15): a closed pipe
ends quietly, colour only on a terminal and never with NO_COLOR (no-color.org), --quiet and
--verbose, documented exit codes. Run as real processes (subprocess, a pseudo-terminal)."""

from __future__ import annotations

import os
import pty
import subprocess
import sys
from pathlib import Path

import pytest

from core.console import EXIT_PIPE

ROOT = Path(__file__).resolve().parents[2]
SAMPLES = ROOT / "survey_samples"
SURVEY = str(SAMPLES / "deck-girder-si.json")
ASFOUND = [sys.executable, "-m", "core"]
ESC = b"\x1b["


def _env(**kw: str) -> dict[str, str]:
    env = {k: v for k, v in os.environ.items() if k not in ("NO_COLOR", "FORCE_COLOR")}
    env.update(kw)
    return env


def _closed_pipe(argv: list[str]) -> subprocess.CompletedProcess:
    """``asfound ... | head -0``: the reader goes away before the first line is written (so
    the write surely fails; a reader that takes a few lines first may leave the rest in the
    pipe's buffer, which then fails or not by chance)."""
    p = subprocess.Popen(
        [*ASFOUND, *argv], cwd=ROOT, stdout=subprocess.PIPE, stderr=subprocess.PIPE, env=_env()
    )
    assert p.stdout is not None and p.stderr is not None
    p.stdout.close()  # what head does after its lines
    err = p.stderr.read()
    p.wait(timeout=120)
    return subprocess.CompletedProcess(p.args, p.returncode, b"", err)


@pytest.mark.parametrize(
    "argv",
    [
        ["section", str(SAMPLES / "section-demo-si.json")],
        ["assess", SURVEY],
        ["assess", SURVEY, "--json"],
    ],
    ids=["section", "assess", "assess-json"],
)
def test_a_closed_pipe_ends_quietly(argv):
    r = _closed_pipe(argv)
    assert b"Traceback" not in r.stderr and b"BrokenPipeError" not in r.stderr, r.stderr
    assert r.stderr == b""
    assert r.returncode == EXIT_PIPE


def _in_terminal(argv: list[str], **env: str) -> bytes:
    """Run in a pseudo-terminal (stdout and stderr are a tty) and return what it showed."""
    pid, fd = pty.fork()
    if pid == 0:  # the child
        os.chdir(ROOT)
        os.execve(sys.executable, [sys.executable, "-m", "core", *argv], _env(**env))
    out = b""
    while True:
        try:
            chunk = os.read(fd, 65536)
        except OSError:
            break
        if not chunk:
            break
        out += chunk
    os.waitpid(pid, 0)
    os.close(fd)
    return out


def test_head_reads_the_first_lines():
    """The shell's own ``| head``: the first lines arrive, nothing is said on stderr."""
    cmd = f"{sys.executable} -m core assess {SURVEY} | head -3"
    r = subprocess.run(cmd, shell=True, cwd=ROOT, capture_output=True, env=_env())
    assert r.returncode == 0 and len(r.stdout.splitlines()) == 3 and r.stderr == b""


def test_colour_on_a_terminal_only_and_never_with_no_color():
    argv = ["assess", SURVEY, "--standard", "aashto"]
    assert ESC in _in_terminal(argv, COLUMNS="200")  # a terminal: the levels in colour
    assert ESC not in _in_terminal(argv, COLUMNS="200", NO_COLOR="1")
    piped = subprocess.run([*ASFOUND, *argv], cwd=ROOT, capture_output=True, env=_env())
    assert piped.returncode == 0 and ESC not in piped.stdout and ESC not in piped.stderr


def test_quiet_and_verbose(tmp_path):
    run = lambda *a: subprocess.run([*ASFOUND, *a], cwd=ROOT, capture_output=True, env=_env())  # noqa: E731
    normal = run("assess", SURVEY).stdout.decode()
    quiet = run("assess", SURVEY, "--quiet").stdout.decode()
    verbose = run("assess", SURVEY, "-v").stdout.decode()
    assert "Survey notes and warnings" in normal and "Survey notes and warnings" not in quiet
    assert "CAUTION" in quiet  # the caution is never quietened
    assert verbose.count("keep watching ·") > normal.count("keep watching ·")  # every flag
    folder = tmp_path / "in"
    folder.mkdir()
    (folder / "a.json").write_bytes(Path(SURVEY).read_bytes())
    r = run("report", str(folder), "-o", str(tmp_path / "out"), "-q")
    assert r.returncode == 0 and r.stdout == b"" and r.stderr == b""
    assert (tmp_path / "out" / "a.pdf").exists()
    both = run("assess", SURVEY, "-q", "-v")
    assert both.returncode == 2 and b"not allowed with" in both.stderr


def test_exit_codes_as_documented():
    """README: 0 done, 1 problems found, 2 bad input; each line of the table is true."""
    readme = (ROOT / "README.md").read_text(encoding="utf-8")
    for code in ("| 0 |", "| 1 |", "| 2 |", "| 130 |", "| 141 |"):
        assert code in readme
    run = lambda *a: subprocess.run([*ASFOUND, *a], cwd=ROOT, capture_output=True, env=_env())  # noqa: E731
    assert run("validate", SURVEY).returncode == 0
    assert run("validate", str(SAMPLES / "mistakes.json")).returncode == 1
    bad = run("assess", str(SAMPLES / "mistakes.json"))
    assert bad.returncode == 2 and b"Traceback" not in bad.stderr
    assert run("assess", SURVEY, "--rating-level", "nonsense").returncode == 2


def test_the_assess_table_names_rivet_lines_in_words_and_marks_what_does_not_apply(capsys):
    """The table names the girder template's rivet lines in words (core.names), both lines
    of a cover together, and a limit state with no as-found value because the section falls
    into pieces at that station says "n/a" with the legend under the table (the through
    girder sample is perforated through the web at its first station)."""
    from core.cli import main

    main(["assess", str(SAMPLES / "through-girder-us.json")])
    out = capsys.readouterr().out
    assert "rivets, bottom line through the web" in out
    assert "rivets, left and right lines through the bottom cover" in out
    assert "line web_bottom" not in out and "cover_top_l" not in out
    first = [ln for ln in out.splitlines() if ln.startswith("N1 ") and "rivets," in ln]
    assert first and all(ln.rstrip().endswith("n/a") for ln in first)
    assert "n/a: the limit state does not apply at that station as found" in out
