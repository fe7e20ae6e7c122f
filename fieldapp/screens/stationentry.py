"""Entries on the station screen through its pad: readings (held by core's guard when they
look like a slip), loss bands and holes (a small form in the pad's slot), notes and photos;
corrections of a reading or a band use the same pad."""

from __future__ import annotations

from functools import partial

from kivy.app import App
from kivy.factory import Factory
from kivy.metrics import dp
from kivy.uix.boxlayout import BoxLayout

from core.errors import AsfoundError
from core.parts import Angle
from fieldapp import describe
from fieldapp.names import part_name, place_name
from fieldapp.pad import ROW_DP

#: the fields of the form in the pad's slot: (key, label)
FORMS = {
    "band": (("lo", "from"), ("hi", "to"), ("t", "t left")),
    "hole": (("lo", "from"), ("hi", "to")),
}


def held_text(holds) -> str:
    """What the pad's slot says about a held value."""
    text = "Held, not stored: " + "; ".join(h.message for h in holds)
    return text if text.endswith("?") else text + "."


class EntryMixin:
    """Mixed into :class:`fieldapp.screens.station.StationScreen`."""

    # ------------------------------------------------------------------ the pad's header
    def pad_title(self) -> None:
        pad, app = self.ids.pad, App.get_running_app()
        lu = app.session.length_unit if app and app.session else "mm"
        pad.unit = lu
        if not self.part:
            pad.title, pad.allow_minus = "Tap a part first", False
            if not pad.held:
                pad.say("")
            return
        name = part_name(self.part)
        if self.mode == "reading":
            where = place_name(self.part, self.region or None)
            if self.edit and self.edit[0] == "reading":
                pad.title = f"Correct reading {self.edit[1]} on {where} (was {self.edit[2]} {lu})"
            else:
                nom = self._nominal(app)
                pad.title = f"Thickness on {where} (nominal {nom:.4g} {lu})"
            pad.allow_minus = False
            return
        if self.mode not in FORMS:
            return
        word = "Loss band" if self.mode == "band" else "Perforation"
        label = dict(FORMS[self.mode]).get(self.field, "")
        what = f"Correct {self.edit[1]}" if self.edit else word
        pad.title = f"{what} on {name}: {label} ({lu})"
        part = app.session.definition().part(self.part)
        pad.allow_minus = self.field in ("lo", "hi") and getattr(part, "orientation", "") == (
            "horizontal"
        )  # across the member, x runs from minus to plus

    def _nominal(self, app) -> float:
        from core.units import from_internal

        return from_internal(
            app.session.definition().part(self.part).t, "length", app.session.length_unit
        )

    # ------------------------------------------------------------------ typing
    def typed(self) -> None:
        pad = self.ids.pad
        if self.mode in FORMS and self.field:
            self.form[self.field] = pad.text
            self._show_form()
        elif not pad.held and pad.level != "ok":
            pad.say("")

    def pad_enter(self, text: str) -> None:
        if self.mode == "reading":
            self.commit_reading(text)
        elif self.mode in FORMS:
            keys = [k for k, _ in FORMS[self.mode]]
            i = keys.index(self.field) if self.field in keys else -1
            if i + 1 < len(keys):
                self.pick_field(keys[i + 1])
            else:
                self.pad_action()

    # ------------------------------------------------------------------ readings
    def commit_reading(self, text: str) -> str | None:
        """Store the typed reading, or hold it with core's reasons (nothing stored until
        a choice is made); its id once the store has it (None when held or refused)."""
        app = App.get_running_app()
        pad = self.ids.pad
        if not self.part:
            app.tell("tap a part first", "warn")
            return None
        if self._awaiting and text == pad.text and text == self._sent:
            return None  # the same value sent twice before the first one was shown
        skip = self.edit[1] if self.edit and self.edit[0] == "reading" else ""
        try:
            holds = app.session.holds(self.part, self.region or None, text, skip)
        except AsfoundError as e:
            pad.say(str(e), "error")
            return None
        if holds:
            self.held = holds
            pad.held = True
            pad.say(held_text(holds), "held")
            return None
        return self._store_reading(text, [])

    def pad_choice(self, which: str) -> None:
        """The two choices of a held value: store it as read, or fix it."""
        pad = self.ids.pad
        text, held = pad.text, self.held
        if which == "yes":
            self.unhold()
            self._store_reading(text, held)
        else:
            self.unhold()
            pad.text = ""
            pad.say(f"{text} {pad.unit} was not stored: type the value again.", "warn")

    def unhold(self) -> None:
        self.held = []
        pad = self.ids.pad
        if pad.held:
            pad.held = False
            pad.say("")

    def _store_reading(self, text: str, held: list) -> str | None:
        app = App.get_running_app()
        pad = self.ids.pad
        lu = app.session.length_unit
        if self.edit and self.edit[0] == "reading":
            rid, was = self.edit[1], self.edit[2]
            where = place_name(self.part, self.region or None)
            app.confirm.ask(
                f"Change reading {rid} on {where} at {app.session.station_id} from {was} to "
                f"{text} {lu}?" + (" It is stored as read." if held else ""),
                "Change it",
                partial(self._correct, rid, text, held),
                "Keep it",
            )
            return None
        try:
            saved = app.session.add_reading(self.part, text, self.region or None, held)
        except AsfoundError as e:
            pad.say(str(e), "error")
            return None
        self.last_saved = saved.id
        self._awaiting, self._sent = True, text
        what = f"reading {saved.id} = {text} {lu} on {place_name(self.part, self.region or None)}"
        what += " (stored as read)" if held else ""
        app.entry_done(what, saved.warnings, partial(self._acknowledged, text, what))
        return saved.id

    def _correct(self, rid: str, text: str, held: list) -> None:
        app = App.get_running_app()
        saved = app.guard(lambda: app.session.correct_reading(rid, text, held))
        if saved is not None:
            self.edit = None
            self.ids.pad.text = ""
            self.ids.pad.say(f"reading {rid} is now {text} {app.session.length_unit}", "ok")
            app.entry_done(f"correction of reading {rid}: {text} {app.session.length_unit}")
            self.refresh()

    def _acknowledged(self, text: str, what: str) -> None:
        """The screen after a stored reading (drawn with its new result)."""
        self._awaiting = False
        pad = self.ids.pad
        pad.text = pad.text[len(text) :] if pad.text.startswith(text) else pad.text
        pad.say(f"saved {what}", "ok")
        self.refresh(full=False)

    # ------------------------------------------------------------------ bands and holes
    def build_form(self) -> None:
        """The fields of a band or perforation in the pad's slot (nothing in reading mode)."""
        pad = self.ids.pad
        box = pad.ids.form
        box.clear_widgets()
        self._fields = {}
        if self.mode not in FORMS:
            pad.action_text = ""
            self.field = ""
            return
        keys = [k for k, _ in FORMS[self.mode]]
        if self.field not in keys:
            self.field = keys[0]
        for row in (keys[:2], keys[2:]):
            line = BoxLayout(spacing=pad.spacing, size_hint_y=None, height=dp(ROW_DP))
            for k in row:
                f = Factory.NumberField(label=dict(FORMS[self.mode])[k])
                f.bind(on_press=partial(lambda key, *_a: self.pick_field(key), k))
                self._fields[k] = f
                line.add_widget(f)
            box.add_widget(line)
        noun = "band" if self.mode == "band" else "perforation"
        pad.action_text = f"Save {self.edit[1]}" if self.edit else f"Add {noun}"
        self._show_form()

    def _show_form(self) -> None:
        app = App.get_running_app()
        unit = app.session.length_unit if app and app.session else ""
        for k, f in getattr(self, "_fields", {}).items():
            f.value, f.unit = self.form.get(k, ""), unit
            f.chosen = k == self.field
        if self.mode == "band" and "t" in self._fields and not self.form.get("t"):
            self._fields["t"].value = ""
            self._fields["t"].label = "t left (empty: read it)"

    def pick_field(self, key: str) -> None:
        self.field = key
        self.ids.pad.text = self.form.get(key, "")
        self._show_form()
        self.pad_title()

    def pad_action(self) -> None:
        """Add (or save the correction of) the band or perforation of the form."""
        app, pad, f = App.get_running_app(), self.ids.pad, self.form
        if not self.part:
            return
        kind = "band" if self.mode == "band" else "perforation"
        try:
            if self.edit:
                saved = app.session.correct_cut(
                    kind, self.edit[1], f.get("lo", ""), f.get("hi", ""), f.get("t", "")
                )
            elif kind == "band":
                leg = None
                if isinstance(app.session.definition().part(self.part), Angle):
                    if self.region not in ("h", "v"):
                        app.tell(
                            f"a band on the {part_name(self.part)} lies on one leg: tap "
                            "'horizontal leg' or 'vertical leg' above the pad, then add it "
                            "(what you typed is kept)",
                            "warn",
                        )
                        return
                    leg = self.region
                saved = app.session.add_band(
                    self.part, f.get("lo", ""), f.get("hi", ""), f.get("t", ""), leg
                )
            else:
                saved = app.session.add_perforation(self.part, f.get("lo", ""), f.get("hi", ""))
        except AsfoundError as e:
            pad.say(str(e), "error")
            app.tell(str(e), "error")  # the form covers the pad's message: say it above too
            return
        st = app.session.station()
        item = next(x for x in (*st.bands, *st.perforations) if x.id == saved.id)
        what = describe.cut(kind, item.model_dump(), app.session.length_unit)
        done = "corrected" if self.edit else "saved"
        self.edit, self.form = None, {}
        pad.text = ""
        self.field = ""
        self.build_form()
        pad.say(f"{done} {what}", "warn" if saved.warnings else "ok")
        app.entry_done(what, saved.warnings)
        self.refresh()

    # ------------------------------------------------------------------ notes and photos
    def note_typed(self) -> None:
        self._note_soon()

    def keep_note(self, *_a) -> None:
        app = App.get_running_app()
        if app.session is None or not app.session.station_id:
            return
        saved = app.guard(lambda: app.session.set_note(self.ids.notes.text))
        if saved is not None:
            app.entry_done("note")

    def add_photo(self) -> None:
        app = App.get_running_app()
        saved = app.guard(lambda: app.session.add_photo(self.ids.photo.text))
        if saved is not None:
            self.ids.photo.text = ""
            app.entry_done("photo file name")
            self.refresh()
