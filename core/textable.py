"""Plain-text tables for the terminal, generated from rows (no hand-written layouts)."""

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
    """A table with a header line and right-aligned numbers."""
    cells = [[fmt(c) for c in r] for r in rows]
    widths = [len(h) for h in header]
    for r in cells:
        for i, c in enumerate(r):
            widths[i] = max(widths[i], len(c))
    num = [
        all(isinstance(r[i], int | float) for r in rows if r[i] is not None)
        for i in range(len(header))
    ]

    def line(vals: Sequence[str]) -> str:
        return "  ".join(
            v.rjust(widths[i]) if num[i] and rows else v.ljust(widths[i])
            for i, v in enumerate(vals)
        ).rstrip()

    out = []
    if title:
        out.append(title)
    out.append(line(list(header)))
    out.append("  ".join("-" * w for w in widths))
    out.extend(line(r) for r in cells)
    return "\n".join(out)
