"""Tables for the terminal, generated from rows: numbers as text (:func:`fmt`) and a table as
plain text (:func:`render`), laid out by ``rich`` (see :mod:`core.console`)."""

from __future__ import annotations

from collections.abc import Sequence


def fmt(v: object, digits: int = 4) -> str:
    """A number with ``digits`` significant digits (thousands kept whole), or str(v)."""
    if isinstance(v, bool) or v is None:
        return "" if v is None else str(v)
    if isinstance(v, int):
        return f"{v:d}"
    if isinstance(v, float):
        if v != v:
            return "n/a"
        if v == 0.0:
            return "0"
        if abs(v) >= 10**digits:
            return f"{v:,.0f}"
        return f"{v:.{digits}g}"
    return str(v)


def render(header: Sequence[str], rows: Sequence[Sequence[object]], title: str = "") -> str:
    """A table as plain text (rich's layout, no colour): a header line, numbers right-aligned."""
    import io

    from rich.console import Console

    from core.console import PIPE_WIDTH, table

    buf = io.StringIO()
    con = Console(file=buf, width=PIPE_WIDTH, color_system=None, no_color=True, soft_wrap=True)
    con.print(table(header, rows, title))
    return "\n".join(line.rstrip() for line in buf.getvalue().rstrip("\n").splitlines())
