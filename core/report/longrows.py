"""A table of thousands of rows laid out a page at a time.

reportlab splits a table at a page end into the part that fits and a new table of all the
rows left, whose construction and styling go over every one of them again (and, in
reportlab 5.1, measures every one of them: its LongTable stops measuring at the page end
only in a table with spanned cells): a table of R rows over P pages costs about R x P / 2
rows, which for the flag list of a 1,000-station
survey (some 13,000 rows, 400 pages) was most of the report's time. :class:`LongRows` hands
reportlab a table of one block of rows at a time (enough to fill the page), lets it split
that, and keeps the rest as its own rows; each page then costs one block, whatever the
length. The parts drawn are the parts reportlab would have drawn from the whole table: the
same header repeated on each page, the same rules, the same cells (the rules of the last
row, and any style command placed on a numbered row, are applied as the whole table
applies them).
"""

from __future__ import annotations

from reportlab.platypus import Flowable, LongTable

#: rows in the first block tried for a page (then a quarter more than the page before
#: held; doubled while a block fits in what is left); also the fewest rows a table needs
#: to be laid out this way
BLOCK = 48


def _shifted(cmd: tuple, start: int, stop: int, n_rows: int) -> tuple | None:
    """A style command of the whole table (rows: 0 the header, 1.. the data rows, or
    negative from the end) for the block of data rows ``start:stop`` (of ``n_rows``);
    None when it touches none of the block's rows."""
    name, (c0, r0), (c1, r1), *rest = cmd
    last = stop < n_rows  # the block ends before the table does

    def place(r: int) -> int:
        return r if r >= 0 else n_rows + 1 + r  # the whole table's row number

    a, b = place(r0), place(r1)
    if a == 0 and b == 0:
        return cmd  # the header, repeated on every block
    lo, hi = max(a, start + 1), min(b, stop)
    if lo > hi:
        return None
    if last and r1 < 0 and b == n_rows and a == n_rows:
        return None  # the table's last row is not in this block
    top = 0 if a == 0 else lo - start
    return (name, (c0, top), (c1, hi - start), *rest)


class LongRows(Flowable):
    """``header`` and ``rows`` (lists of cells) as one table, built a block of rows at a
    time; ``style`` is the whole table's list of style commands, ``widths`` its columns."""

    def __init__(
        self,
        header: list,
        rows: list,
        widths: list[float],
        style: list,
        start: int = 0,
        hint: int = BLOCK,
    ) -> None:
        super().__init__()
        self.header, self.rows, self.widths, self.style = header, rows, widths, style
        self.start, self.hint = start, hint
        self.hAlign = "LEFT"
        self._t: LongTable | None = None
        self._fit: tuple | None = None

    def _table(self, stop: int) -> LongTable:
        n = len(self.rows)
        cmds = [c for c in (_shifted(c, self.start, stop, n) for c in self.style) if c]
        t = LongTable(
            [self.header, *self.rows[self.start : stop]],
            colWidths=self.widths,
            repeatRows=1,
            hAlign="LEFT",
            style=cmds,
        )
        return t

    def _fitting(self, aw: float, ah: float) -> tuple[LongTable, float, float]:
        """A table of enough of the rows left to overfill ``ah`` (or all of them); the
        same one for the same room (a frame asks for the size, then for the split)."""
        if self._fit is not None and self._fit[0] == (aw, ah):
            return self._fit[1]
        size = max(8, self.hint + self.hint // 4 + 2)
        while True:
            stop = min(self.start + size, len(self.rows))
            t = self._table(stop)
            w, h = t.wrap(aw, ah)
            if h > ah or stop == len(self.rows):
                break
            size *= 2
        self._fit = ((aw, ah), (t, w, h))
        return t, w, h

    def wrap(self, availWidth: float, availHeight: float) -> tuple[float, float]:
        self._t, w, h = self._fitting(availWidth, availHeight)
        self.width, self.height = w, h
        return w, h

    def split(self, availWidth: float, availHeight: float) -> list:
        t, _w, _h = self._fitting(availWidth, availHeight)
        parts = t.split(availWidth, availHeight)
        if len(parts) < 2:
            return parts
        used = len(parts[0]._cellvalues) - 1  # its data rows (the header repeats)
        if used <= 0:
            return []
        start = self.start + used
        if start >= len(self.rows):
            return [parts[0]]
        return [parts[0], LongRows(self.header, self.rows, self.widths, self.style, start, used)]

    def drawOn(self, canvas, x: float, y: float, _sW: float = 0) -> None:
        assert self._t is not None, "drawn before it was wrapped"
        self._t.drawOn(canvas, x, y, _sW)
