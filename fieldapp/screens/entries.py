"""The list of entries at a station: the readings of the selected part (all of the station's
when none is selected), its loss bands, holes, note and photo file names; each can be
corrected or withdrawn with one tap and a confirm. Nothing is destroyed: the store keeps the
old value in its history (who, when, on which device)."""

from __future__ import annotations

from functools import partial

from kivy.app import App
from kivy.properties import BooleanProperty, StringProperty
from kivy.uix.boxlayout import BoxLayout

from fieldapp import describe
from fieldapp.names import place_name


class EntryRow(BoxLayout):
    """One entry: what it is, and Edit and Withdraw (layout in ``kv/station.kv``)."""

    text = StringProperty("")
    can_edit = BooleanProperty(True)

    __events__ = ("on_edit", "on_withdraw")

    def on_edit(self) -> None:
        pass

    def on_withdraw(self) -> None:
        pass


def _when(r) -> str:
    t = (r.time or "").replace("T", " ")
    return " ".join(x for x in (r.who, t[11:16] if len(t) >= 16 else t) if x)


class EntriesMixin:
    """Mixed into :class:`fieldapp.screens.station.StationScreen`."""

    def entries(self) -> list[tuple[str, str, str, bool]]:
        """(kind, id, text, editable) of every entry listed, in order."""
        app = App.get_running_app()
        s = app.session
        st = s.station()
        lu = s.length_unit
        out = []
        for r in st.readings:
            if self.part and r.part != self.part:
                continue
            mark = "  (stored as read)" if r.stored_as_read else ""
            out.append(
                (
                    "reading",
                    r.id,
                    f"{r.id} = {r.value:g} {r.unit}, {place_name(r.part, r.region)}{mark}\n"
                    f"{_when(r)}",
                    True,
                )
            )
        for kind, items in (("band", st.bands), ("perforation", st.perforations)):
            for b in items:
                out.append((kind, b.id, describe.cut(kind, b.model_dump(), lu), True))
        if st.notes.strip():
            first = st.notes.strip().splitlines()[0]
            out.append(("note", "", f"note: {first[:80]}", True))
        for p in st.photos:
            out.append(("photo", p, f"photo {p}", False))
        return out

    def show_entries(self) -> None:
        from kivy.factory import Factory

        app = App.get_running_app()
        s = app.session
        box = self.ids.entries
        box.clear_widgets()
        which = f"readings on {place_name(self.part, None)}" if self.part else "all readings"
        self.ids.list_head.text = (
            f"Station {s.station_id}: {which}, then bands, holes, note, photos. "
            "You are asked first; old values stay in the history."
        )
        rows = self.entries()
        for kind, ident, text, editable in rows:
            row = Factory.EntryRow(text=text, can_edit=editable)
            row.bind(on_edit=partial(self._edit, kind, ident))
            row.bind(on_withdraw=partial(self._withdraw, kind, ident, text.split("\n")[0]))
            box.add_widget(row)
        if not rows:
            box.add_widget(Factory.Wrap(text="Nothing entered here yet."))

    # ------------------------------------------------------------------ correct
    def _edit(self, kind: str, ident: str, *_a) -> None:
        app = App.get_running_app()
        st = app.session.station()
        if kind == "note":
            self.set_mode("notes")
            return
        if kind == "reading":
            r = next(x for x in st.readings if x.id == ident)
            self.set_mode("reading")
            self._select(r.part, r.region or "")
            self.edit = ("reading", r.id, f"{r.value:g}")
            self.ids.pad.text = f"{r.value:g}"
            self.ids.pad.say(
                f"Type the right value for {r.id} and press Enter; you are asked before it "
                "changes. Close leaves it as it was.",
                "info",
            )
            self.pad_title()
            return
        b = next(x for x in (*st.bands, *st.perforations) if x.id == ident)
        self.set_mode("band" if kind == "band" else "hole")
        self._select(b.part, "")
        self.edit = (kind, b.id)
        self.form = {"lo": f"{b.lo:g}", "hi": f"{b.hi:g}"}
        if kind == "band" and b.t is not None:
            self.form["t"] = f"{b.t:g}"
        self.field = "lo"
        self.build_form()
        self.ids.pad.text = self.form["lo"]
        self.ids.pad.say(f"Correct {b.id}, then press Save {b.id}.", "info")
        self.pad_title()

    def _select(self, part: str, region: str) -> None:
        self.part, self.region = part, region
        self.ids.drawing.selected = part
        app = App.get_running_app()
        s = app.session
        st, m = s.station(), s.member()
        self._chips(m.definition())
        self._regions(m.definition(), st)
        self.region = region

    # ------------------------------------------------------------------ withdraw
    def _withdraw(self, kind: str, ident: str, text: str, *_a) -> None:
        app = App.get_running_app()
        st = app.session.station()
        extra = ""
        if kind == "band":
            n = sum(1 for r in st.readings if r.region == ident)
            extra = f" and the {n} reading(s) taken on it" if n else ""
        app.confirm.ask(
            f"Withdraw {text}{extra} at station {app.session.station_id}? "
            "It stays in the history and can be undone.",
            "Withdraw",
            partial(self._withdraw_now, kind, ident, text),
            "Keep it",
        )

    def _withdraw_now(self, kind: str, ident: str, text: str) -> None:
        app = App.get_running_app()
        done = app.guard(lambda: app.session.withdraw(kind, ident) or True)
        if done:
            if self.edit and self.edit[1] == ident:
                self.edit = None
            app.entry_done(f"withdrawal of {text}")
            self.refresh()
            self.show_entries()
