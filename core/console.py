"""The command line's terminal: tables and progress through ``rich``, colour only on a
terminal, ``NO_COLOR`` honoured, and how loud a command is (``--quiet``, ``--verbose``).

A console is made for each command run (never at import), so that it writes to the
``sys.stdout`` / ``sys.stderr`` of that moment. Output that is not a terminal (a pipe, a
file) has no colour, no control codes and no line wrapping: a table keeps its natural width
so that ``grep`` and ``cut`` see whole rows.
"""

from __future__ import annotations

import os
import sys
from collections.abc import Sequence
from dataclasses import dataclass

from rich import box
from rich.console import Console
from rich.progress import BarColumn, MofNCompleteColumn, Progress, TextColumn
from rich.table import Table
from rich.text import Text

from core.glossary import LEVELS

#: exit codes of every ``asfound`` command (documented in the README)
EXIT_OK = 0
EXIT_PROBLEMS = 1  # the command ran and found errors (validate) or some surveys failed (report DIR)
EXIT_INPUT = 2  # bad input or usage: nothing was written
EXIT_INTERRUPTED = 130  # Ctrl-C
EXIT_PIPE = 141  # the reader of the output went away (``| head``): the shell's 128 + SIGPIPE

#: width of output that is not a terminal: wide enough never to wrap a table row
PIPE_WIDTH = 10_000


def colour_wanted(stream) -> bool:
    """Colour only on a terminal, and never when ``NO_COLOR`` is set (no-color.org)."""
    if os.environ.get("NO_COLOR", ""):
        return False
    try:
        return bool(stream.isatty())
    except (AttributeError, ValueError):
        return False


def make_console(stderr: bool = False) -> Console:
    """A console on the current ``sys.stdout`` (or ``sys.stderr``)."""
    stream = sys.stderr if stderr else sys.stdout
    tty = colour_wanted(stream)
    return Console(
        file=stream,
        color_system="auto" if tty else None,
        force_terminal=tty,
        no_color=not tty,
        highlight=False,
        markup=False,
        emoji=False,
        width=None if tty else PIPE_WIDTH,
        soft_wrap=not tty,
    )


def emit(con: Console, renderable: object = "") -> None:
    """Print ``renderable`` (text or a table) on ``con``; off a terminal each line without the
    blanks rich pads it with, so that a pipe gets clean rows."""
    if con.is_terminal:
        con.print(renderable)
        return
    with con.capture() as cap:
        con.print(renderable)
    lines = cap.get().rstrip("\n").split("\n")
    con.file.write("\n".join(line.rstrip() for line in lines) + "\n")


@dataclass(frozen=True)
class Voice:
    """How much a command says: ``quiet`` keeps only the results asked for and the errors;
    ``verbose`` adds what each step did."""

    quiet: bool = False
    verbose: bool = False

    @classmethod
    def of(cls, args) -> Voice:
        return cls(bool(getattr(args, "quiet", False)), bool(getattr(args, "verbose", False)))


def level_style(label: str) -> str:
    """The rich style of a flag level's words (the glossary's colour), else no style."""
    for t in LEVELS:
        if t.name == label:
            return f"bold {t.colour}"
    return ""


def _num(v: object) -> bool:
    return isinstance(v, int | float) and not isinstance(v, bool)


def table(
    header: Sequence[str],
    rows: Sequence[Sequence[object]],
    title: str = "",
    styles: dict[int, str] | None = None,
) -> Table:
    """A rich table: a header line, numbers right-aligned (see :func:`core.textable.fmt`);
    ``styles`` maps a column index to "level" (each cell coloured as its flag level)."""
    from core.textable import fmt

    t = Table(
        title=title or None,
        title_justify="left",
        title_style="bold",
        box=box.SIMPLE_HEAD,
        show_edge=False,
        pad_edge=False,
        header_style="bold",
        expand=False,
    )
    for i, h in enumerate(header):
        numeric = bool(rows) and all(_num(r[i]) for r in rows if r[i] is not None)
        t.add_column(h, justify="right" if numeric else "left", no_wrap=True)
    styles = styles or {}
    for r in rows:
        cells = []
        for i, c in enumerate(r):
            s = fmt(c)
            style = level_style(s) if styles.get(i) == "level" else ""
            cells.append(Text(s, style=style))
        t.add_row(*cells)
    return t


class Steps:
    """Progress over ``n`` items on stderr: a rich bar on a terminal, one line per item
    elsewhere (a log keeps them), nothing when quiet."""

    def __init__(self, n: int, voice: Voice) -> None:
        self.n, self.voice = n, voice
        self.err = make_console(stderr=True)
        self._bar: Progress | None = None
        self._task = None
        if not voice.quiet and self.err.is_terminal:
            self._bar = Progress(
                TextColumn("reports"),
                BarColumn(),
                MofNCompleteColumn(),
                TextColumn("{task.description}"),
                console=self.err,
                transient=False,
            )
            self._bar.start()
            self._task = self._bar.add_task("", total=n)

    def step(self, i: int, name: str) -> None:
        """Item ``i`` (0-based) named ``name`` starts."""
        if self.voice.quiet:
            return
        if self._bar is not None:
            self._bar.update(self._task, completed=i, description=name)
        else:
            self.err.print(f"[{i + 1}/{self.n}] {name}")

    def ended(self, k: int, name: str) -> None:
        """``k`` items have ended, the last of them named ``name`` (items running side by
        side end in any order)."""
        if self.voice.quiet:
            return
        if self._bar is not None:
            self._bar.update(self._task, completed=k, description=name)
        else:
            self.err.print(f"[{k}/{self.n}] {name}")

    def done(self) -> None:
        if self._bar is not None:
            self._bar.update(self._task, completed=self.n, description="done")
            self._bar.stop()
