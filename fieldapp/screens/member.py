"""Member: the as-built section (main dimensions of the girder template, typed on the pad,
with a drawing that follows the typing), the member's stations, and new stations."""

from __future__ import annotations

from functools import partial

from kivy.app import App
from kivy.factory import Factory
from kivy.metrics import dp
from kivy.properties import StringProperty
from kivy.uix.boxlayout import BoxLayout
from kivy.uix.screenmanager import Screen

from core.errors import AsfoundError
from core.section import analyse
from core.sectionfile import definition_from_dict
from core.units import from_internal, show
from fieldapp import present, templates
from fieldapp.session import parse_number
from fieldapp.theme import TOUCH_DP


class MemberScreen(Screen):
    next_id = StringProperty("name (or S2)")
    position_unit = StringProperty("m")
    current = StringProperty("")

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self.fields: dict = {}
        self._stored: dict = {}

    def on_kv_post(self, _base) -> None:
        for key, label in templates.GIRDER_FIELDS:
            row = BoxLayout(size_hint_y=None, height=dp(TOUCH_DP), spacing=dp(8))
            lab = Factory.Body(text=label)
            f = Factory.NumberField(size_hint_x=None, width=dp(150))
            f.bind(on_press=partial(self.ask_value, key))
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
        label = f"  ·  {m.label}" if m.label else ""
        self.ids.title.text = f"Member {m.id}{label}  ·  span {m.span.value:g} {m.span.unit}"
        self._stored = templates.girder_values(girder) if girder else {}
        for key, (lab, f, label) in self.fields.items():
            lab.text = f"{label} ({unit})"
            v = self._stored.get(key)
            f.value, f.unit = ("" if v is None else f"{v:g}"), unit
            f.disabled = girder is None
        self.ids.message.level = "info" if girder else "warn"
        self.ids.message.text = (
            "Tap a value to type it on the pad; it is stored when you press Enter."
            if girder
            else "This section is not from the girder template; edit it in the office."
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
        for st in sorted(m.stations, key=lambda st: (st.position, st.id)):  # along the span
            b = Factory.Big(
                text=f"{st.id} at {st.position:g} {s.position_unit}",
                chosen=st.id == s.station_id,
                font_size="18sp",
            )
            b.bind(on_press=partial(self._pick_station, st.id))
            box.add_widget(b)
        self.position_unit = s.position_unit
        self.next_id = f"name (or {s.next_station_id()})"
        self.current = s.station_id
        strip = self.ids.strip
        pu = s.position_unit
        strip.unit = pu
        strip.span = from_internal(m.span_mm(), "length", pu)
        strip.supports = [x.position for x in m.supports]
        strip.stiffeners = [x.position for x in m.stiffeners]
        strip.stations = [(x.id, x.position) for x in m.stations]
        strip.selected = s.station_id

    def values(self, key: str | None = None, text: str | None = None) -> dict:
        """The stored values, with ``key`` set to the number typed as ``text``."""
        out = dict(self._stored)
        if key is not None and text is not None:
            label = dict(templates.GIRDER_FIELDS)[key]
            out[key] = parse_number(text, label) if text.strip() else None
        return out

    def preview(self, values: dict | None = None) -> None:
        """Draw the section of ``values`` (default: as stored); core builds it."""
        app = App.get_running_app()
        s = app.session
        if s is None or not s.member_id:
            return
        try:
            sec = dict(s.member().section)
            if sec.get("girder") is not None and values is not None:
                sec["girder"] = templates.with_values(sec["girder"], values)
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
    def ask_value(self, key: str, *_a) -> None:
        """The pad for one dimension; the drawing follows the typing."""
        app = App.get_running_app()
        _lab, f, label = self.fields[key]
        unit = app.session.length_unit

        def typed(text):
            try:
                self.preview(self.values(key, text) if text is not None else None)
            except AsfoundError as e:
                self.ids.check.level, self.ids.check.text = "error", str(e)

        app.ask_number(
            f"{label} ({unit}) of member {app.session.member_id}",
            f.value,
            unit,
            partial(self.store_value, key),
            typed=typed,
        )

    def store_value(self, key: str, text: str) -> str:
        """Store one dimension; an error sentence, or "" when stored."""
        app = App.get_running_app()
        try:
            vals = self.values(key, text)
            if vals == self._stored:
                return ""
            saved = app.session.update_girder(vals)
        except AsfoundError as e:
            return str(e)
        self._stored = vals
        label = dict(templates.GIRDER_FIELDS)[key]
        app.entry_done(f"{label.lower()} {text} {app.session.length_unit}", saved.warnings)
        self.refresh()
        return ""

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

    def ask_position(self) -> None:
        """The pad for the position of a new station; Enter adds it."""
        app = App.get_running_app()
        s = app.session
        span = s.member().span
        name = self.ids.new_id.text.strip() or s.next_station_id()
        app.ask_number(
            f"Position of new station {name} ({s.position_unit} from the member's start)",
            "",
            s.position_unit,
            partial(self.add_station, name),
            hint=f"The member is {span.value:g} {span.unit} long.",
        )

    def ask_offset(self) -> None:
        """The pad for the distance of a new station from the current one; Enter adds it."""
        app = App.get_running_app()
        s = app.session
        here = s.station()
        name = self.ids.new_id.text.strip() or s.next_station_id()
        app.ask_number(
            f"New station {name}: distance from {here.id} at {here.position:g} {s.position_unit}",
            "",
            s.position_unit,
            partial(self._add_after, name),
            minus=True,
            hint="Along the member: minus goes towards its start.",
        )

    def _add_after(self, name: str, offset: str) -> str:
        app = App.get_running_app()
        try:
            saved = app.session.add_station_after(offset, name)
        except AsfoundError as e:
            return str(e)
        self.ids.new_id.text = ""
        app.entry_done(f"station {saved.id}", saved.warnings)
        app.go("station")
        return ""

    def ask_move(self) -> None:
        """The pad with the current station's position; Enter moves it there."""
        app = App.get_running_app()
        s = app.session
        here = s.station()
        app.ask_number(
            f"Move station {here.id} to ({s.position_unit} from the member's start)",
            f"{here.position:g}",
            s.position_unit,
            self._move,
            hint=f"The member is {s.member().span.value:g} {s.member().span.unit} long.",
        )

    def _move(self, position: str) -> str:
        app = App.get_running_app()
        s = app.session
        try:
            before = s.station().position
            saved = s.move_station(position)
        except AsfoundError as e:
            return str(e)
        after = s.station().position
        if after != before:
            app.entry_done(
                f"station {saved.id} moved from {before:g} to {after:g} {s.position_unit}",
                saved.warnings,
            )
        self.refresh()
        return ""

    def ask_withdraw(self) -> None:
        """Ask before withdrawing the current station with everything entered at it."""
        app = App.get_running_app()
        s = app.session
        st = s.station()
        parts = [f"{len(st.readings)} reading(s)"]
        if st.bands:
            parts.append(f"{len(st.bands)} band(s)")
        if st.perforations:
            parts.append(f"{len(st.perforations)} perforation(s)")
        app.confirm.ask(
            f"Withdraw station {st.id} at {st.position:g} {s.position_unit} with its "
            + ", ".join(parts)
            + "? It stays in the history and can be undone.",
            "Withdraw",
            self._withdraw_now,
            "Keep it",
        )

    def _withdraw_now(self) -> None:
        app = App.get_running_app()
        sid = app.guard(app.session.withdraw_station)
        if sid:
            app.tell(f"withdrew station {sid} (Undo brings it back)", "ok")
            self.refresh()
            app.refresh_results()

    def add_station(self, name: str, position: str) -> str:
        app = App.get_running_app()
        try:
            saved = app.session.add_station(name, position)
        except AsfoundError as e:
            return str(e)
        self.ids.new_id.text = ""
        app.entry_done(f"station {saved.id}", saved.warnings)
        app.go("station")
        return ""
