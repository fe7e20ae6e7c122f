"""History: every change of the open survey, newest first, with who made it (the inspector's
name and initials asked once per device), when and on which device. Read only: a change is
reverted with Undo; nothing here removes anything."""

from __future__ import annotations

from kivy.app import App
from kivy.factory import Factory
from kivy.uix.screenmanager import Screen

from core.survey.device import short
from fieldapp import describe

#: the changes listed (the newest); the store keeps them all
SHOWN = 150


def history_lines(session) -> list[str]:
    """One line per change, newest first: what, who, when, device (no kivy)."""
    rows = session.store.history()
    by_change: dict[int, list] = {}
    for h in rows:
        by_change.setdefault(h.change, []).append(h)
    out = []
    lu, pu = session.length_unit, session.position_unit
    for change in sorted(by_change, reverse=True)[:SHOWN]:
        hs = by_change[change]
        h = hs[0]
        what = describe.change(hs, lu, pu)
        if h.action == "undo" or h.undoes is not None:
            what = f"undo of change {h.undoes}: {what}"
        mark = "  (undone)" if all(x.undone for x in hs) else ""
        when = (h.at or "").replace("T", " ")[:16]
        dev = f", device {short(h.device)}" if h.device else ""
        out.append(f"{what}{mark}\n{h.who or 'no name'}  ·  {when}{dev}")
    return out


class HistoryScreen(Screen):
    def refresh(self) -> None:
        app = App.get_running_app()
        box = self.ids.rows
        box.clear_widgets()
        if app.session is None:
            return
        lines = history_lines(app.session)
        who = app.session.who
        self.ids.head.text = (
            f"Edit history of {app.session.path.stem}: {len(lines)} change(s) shown, newest "
            f"first. You are entering as {who}."
        )
        for text in lines:
            box.add_widget(Factory.HistoryRow(text=text))
