"""Member: the as-built section (main dimensions of the girder template, with a drawing
that follows the typing), the member's stations, and new stations."""

from __future__ import annotations

from functools import partial

from kivy.app import App
from kivy.clock import Clock
from kivy.factory import Factory
from kivy.uix.boxlayout import BoxLayout
from kivy.uix.screenmanager import Screen

from core.errors import AsfoundError
from core.section import analyse
from core.sectionfile import definition_from_dict
from core.units import show
from fieldapp import present, templates
from fieldapp.session import parse_number


class MemberScreen(Screen):
    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self.fields: dict = {}
        self._stored: dict = {}
        self._preview_soon = Clock.create_trigger(self.preview, 0)

    def on_kv_post(self, _base) -> None:
        for key, label in templates.GIRDER_FIELDS:
            row = BoxLayout(size_hint_y=None, height=self.ids.form.row_height, spacing=8)
            lab = Factory.Body(text=label, size_hint_x=0.64)
            f = Factory.Field(input_filter="float", size_hint_x=0.36)
            f.bind(text=self._typed, on_text_validate=self._commit)
            f.bind(focus=self._focus)
            row.add_widget(lab)
            row.add_widget(f)
            self.ids.form.add_widget(row)
            self.fields[key] = (lab, f, label)

    # ------------------------------------------------------------------ show
    def refresh(self) -> None:
        s = App.get_running_app().session
        if s is None or not s.member_id:
            return
        m = s.member()
        unit = s.length_unit
        girder = m.section.get("girder")
        self.ids.title.text = f"Member {m.id}" + (f" - {m.label}" if m.label else "")
        self.ids.span.text = f"span {m.span.value:g} {m.span.unit}"
        self._stored = templates.girder_values(girder) if girder else {}
        for key, (lab, f, label) in self.fields.items():
            lab.text = f"{label} ({unit})"
            v = self._stored.get(key)
            f.text = "" if v is None else f"{v:g}"
            f.disabled = girder is None
        self.ids.message.level = "info" if girder else "warn"
        self.ids.message.text = (
            "" if girder else "This section is not from the girder template; edit it in the office."
        )
        self._members(s)
        self._stations(s)
        self.preview()

    def _members(self, s) -> None:
        box = self.ids.members
        box.clear_widgets()
        ids = s.member_ids()
        for mid in ids if len(ids) > 1 else []:
            b = Factory.Big(text=mid, chosen=mid == s.member_id)
            b.bind(on_press=partial(self._pick_member, mid))
            box.add_widget(b)

    def _stations(self, s) -> None:
        box = self.ids.stations
        box.clear_widgets()
        m = s.store.to_survey().member(s.member_id)
        for st in m.stations:
            b = Factory.Big(
                text=f"{st.id}  at {st.position:g} {s.position_unit}", chosen=st.id == s.station_id
            )
            b.bind(on_press=partial(self._pick_station, st.id))
            box.add_widget(b)
        self.ids.new_pos_label.text = f"position ({s.position_unit})"

    def values(self) -> dict:
        out = {}
        for key, (_lab, f, label) in self.fields.items():
            out[key] = parse_number(f.text, label) if f.text.strip() else None
        return out

    def preview(self, *_a) -> None:
        """Redraw the section from the values as typed (core builds it; nothing is stored)."""
        app = App.get_running_app()
        s = app.session
        if s is None or not s.member_id:
            return
        try:
            sec = dict(s.member().section)
            if sec.get("girder") is not None:
                sec["girder"] = templates.with_values(sec["girder"], self.values())
            built = analyse(definition_from_dict(sec, s.length_unit))
        except (AsfoundError, ValueError) as e:
            self.ids.check.level = "error"
            self.ids.check.text = str(e)
            return
        p = built.gross.props
        sys_ = s.header.get("unit_system", "si")
        a, i = show(p.A, "area", sys_), show(p.Ix, "inertia", sys_)
        self.ids.check.level = "info"
        self.ids.check.text = (
            f"A = {present.big(a.value)} {a.symbol}    Ix = {present.big(i.value)} {i.symbol}"
        )
        self.ids.drawing.built = built.gross.pieces
        self.ids.drawing.found = built.gross.pieces

    # ------------------------------------------------------------------ entries
    def _typed(self, *_a) -> None:
        self._preview_soon()

    def _focus(self, field, focused: bool) -> None:
        if not focused:
            self._commit(field)

    def _commit(self, *_a) -> None:
        """Store the dimensions when they differ from the stored ones."""
        app = App.get_running_app()
        try:
            vals = self.values()
        except AsfoundError as e:
            app.tell(str(e), "error")
            return
        if app.session is None or not self._stored or vals == self._stored:
            return
        saved = app.guard(lambda: app.session.update_girder(vals))
        if saved is not None:
            self._stored = vals
            app.entry_done("section dimensions", saved.warnings)

    def _pick_member(self, mid: str, *_a) -> None:
        app = App.get_running_app()
        app.session.select(member=mid)
        self.refresh()
        app.refresh_results()

    def _pick_station(self, sid: str, *_a) -> None:
        app = App.get_running_app()
        app.session.select(station=sid)
        app.go("station")
        app.refresh_results()

    def add_station(self) -> None:
        app = App.get_running_app()
        saved = app.guard(
            lambda: app.session.add_station(self.ids.new_id.text, self.ids.new_pos.text)
        )
        if saved is not None:
            self.ids.new_id.text = self.ids.new_pos.text = ""
            app.entry_done(f"station {saved.id}", saved.warnings)
            app.go("station")
