"""Undo in the field store: the last change of one person on one device, and never another's.

Mixed into :class:`core.survey.store.FieldStore`. The rules:

* :meth:`UndoOps.undo_last` reverts the newest change (add, update or delete) that ``who``
  made on this handle's device and that is not undone yet. A change made by anyone else,
  or by the same person on another device, is never a candidate. A person whose name was
  corrected gives the earlier names (``formerly``): changes under them are still their own.
* It is refused (:class:`UndoRefusedError`, nothing changed) when somebody else has changed,
  since, what the change touched: the same entry; for a member, anything of that member;
  for a station, anything at it; for a loss band, the readings at its station (they may be
  read on the band); for the survey header, anything. Reverting would silently undo or
  hide their work.
* It is refused when the survey would be left without a member (``keep_last_member``) or
  with an error (e.g. a band without thickness once its only reading is gone).
* The undo is a change of its own: its rows have action ``undo``, the person and device of
  the undo, and ``undoes`` = the change reverted, which is marked ``undone``.

:meth:`UndoOps.undo_plan` says what :meth:`UndoOps.undo_last` would do, or why it would be
refused, without changing anything (the same work in a transaction that is rolled back).
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING

from core.errors import InputError, StoreError
from core.survey.device import short

if TYPE_CHECKING:
    from core.survey.store import HistoryEntry

UNDOABLE = ("add", "update", "delete")


class UndoRefusedError(InputError):
    """An undo that would revert or hide another person's work, remove the last member of
    the survey, or leave the survey with an error. Nothing was changed."""


@dataclass(frozen=True)
class UndoPlan:
    """What an undo would revert: the change, its history rows, and why it would be refused
    (empty when it can be done). ``change`` is None when there is nothing to undo."""

    change: int | None
    rows: tuple[HistoryEntry, ...] = ()
    refused: str = ""

    @property
    def possible(self) -> bool:
        return self.change is not None and not self.refused


class _DryRunError(Exception):
    pass


def touches(mine: HistoryEntry, other: HistoryEntry) -> bool:
    """Whether the later history row ``other`` concerns what row ``mine`` changed."""
    if mine.kind == "survey":
        return True
    if mine.kind == "member":
        return other.member == mine.entity
    if other.member != mine.member:
        return False
    if mine.kind == "station":
        return other.station == mine.entity or (
            other.kind == "station" and other.entity == mine.entity
        )
    if other.station != mine.station:
        return False
    if mine.kind == "band" and other.kind == "reading":
        return True
    return (other.kind, other.entity) == (mine.kind, mine.entity)


class UndoOps:
    """Undo of the field store (see the module docstring)."""

    def _last_own(self, names: tuple[str, ...]) -> int | None:
        marks = ", ".join("?" * len(names))
        return self._conn.execute(
            f"SELECT MAX(change) FROM history WHERE who IN ({marks}) AND device = ?"
            " AND undone = 0 AND action IN (?, ?, ?)",
            (*names, self.device, *UNDOABLE),
        ).fetchone()[0]

    def undo_plan(
        self, who: str, *, keep_last_member: bool = True, formerly: tuple[str, ...] = ()
    ) -> UndoPlan:
        """What :meth:`undo_last` would revert for ``who`` on this device, or why not
        (``formerly``: as in :meth:`undo_last`)."""
        names = (who, *formerly)
        with self._lock:
            self._no_batch()
            c = self._last_own(names)
            if c is None:
                return UndoPlan(None)
            rows = tuple(h for h in self.history(c) if h.change == c)
            try:
                with self._txn(who):
                    self._revert(c, rows, names, keep_last_member)
                    raise _DryRunError
            except _DryRunError:
                return UndoPlan(c, rows)
            except UndoRefusedError as e:
                return UndoPlan(c, rows, str(e))

    def undo_last(
        self,
        who: str,
        *,
        change: int | None = None,
        keep_last_member: bool = True,
        formerly: tuple[str, ...] = (),
    ) -> list[HistoryEntry]:
        """Revert the last change of ``who`` on this device (see the module docstring) and
        return its history rows ([] when there is none). ``change``: the change the caller
        showed the user; refused if that is no longer the last one. ``formerly``: the names
        the same person entered under earlier on this device (a corrected name): their
        changes are this person's own; the undo is recorded under ``who``.

        Raises:
            UndoRefusedError: another person changed it since, the survey would be left without
            a member or invalid, or ``change`` is not the last change any more.
        """
        with self._lock:
            self._no_batch()
            names = (who, *formerly)
            c = self._last_own(names)
            if c is None:
                if change is not None:
                    raise UndoRefusedError(
                        f"change {change} is no longer yours to undo on this device; "
                        "nothing was undone"
                    )
                return []
            if change is not None and change != c:
                raise UndoRefusedError(
                    f"your last change on this device is now change {c}, not change {change}; "
                    "nothing was undone"
                )
            rows = tuple(h for h in self.history(c) if h.change == c)
            with self._txn(who):
                self._revert(c, rows, names, keep_last_member)
            return list(rows)

    def _no_batch(self) -> None:
        if self._change is not None:
            raise StoreError("undo is not possible inside a batch of entries")

    def _revert(self, c: int, rows, names: tuple[str, ...], keep_last_member: bool) -> None:
        later = [
            h
            for h in self.history(c + 1)
            if h.action in UNDOABLE
            and not h.undone
            and not (h.who in names and h.device == self.device)
        ]
        for mine in rows:
            hit = next((o for o in later if touches(mine, o)), None)
            if hit is not None:
                what = " ".join(x for x in (hit.kind, hit.entity) if x)
                where = " / ".join(x for x in (hit.member, hit.station) if x)
                raise UndoRefusedError(
                    f"undo refused: {what}{f' at {where}' if where else ''} was changed since "
                    f"by {hit.who or 'someone'} on device {short(hit.device)} ({hit.at}); "
                    "their work is never undone: correct the entry instead"
                )
        before = self._live_members()
        touched = sorted({h.entity if h.kind == "member" else h.member for h in rows} - {""})
        known = {mid: self._member_errors(mid) for mid in touched if mid in before}
        self._undoes = c
        for h in reversed(rows):
            key = (h.kind, h.member, h.station, h.entity)
            if h.action == "add":
                self._set_deleted(*key, 1)
            elif h.action == "delete":
                self._set_deleted(*key, 0)
            else:
                data = self._load(*key)
                data[h.field] = h.old
                self._save(*key, data)
            self._history("undo", *key, h.field, h.new, h.old)
        self._conn.execute("UPDATE history SET undone = 1 WHERE change = ?", (c,))
        self._defs.clear()
        after = self._live_members()
        if keep_last_member and before and not after:
            raise UndoRefusedError(
                f"undo refused: it would remove the last member of the survey ({before[0]!r})"
            )
        try:
            if any(h.kind == "survey" for h in rows):
                self._check_header()
            for mid in touched:
                if mid in after:
                    self._check_with_stations(mid, known=known.get(mid, ()))
        except InputError as e:
            raise UndoRefusedError(
                f"undo refused: the survey would be left with an error: {e}"
            ) from None

    def _live_members(self) -> list[str]:
        return [
            r[0]
            for r in self._conn.execute(
                "SELECT id FROM entity WHERE kind = 'member' AND deleted = 0 ORDER BY seq"
            )
        ]

    def _check_header(self) -> None:
        from core.survey.model import SurveyHeader
        from core.survey.storeops import _validated

        _validated(SurveyHeader, self.header(), "survey header", "survey")
