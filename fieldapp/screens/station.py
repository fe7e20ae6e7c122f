"""Station: the drawn section at the station, tap a part, enter readings on the pad; loss
bands, holes, notes and photo file names; the live result of the station."""

from __future__ import annotations

from functools import partial

from kivy.app import App
from kivy.clock import Clock
from kivy.factory import Factory
from kivy.properties import StringProperty
from kivy.uix.screenmanager import Screen

from core.errors import AsfoundError
from core.parts import Angle
from core.section import analyse
from core.survey import station_stats
from core.units import from_internal
from fieldapp import present

REGION_NAMES = {"": "whole", "h": "flat leg", "v": "upright leg"}
ESCAPE, ENTER, PAD_ENTER, BACKSPACE = 27, 13, 271, 8


class StationScreen(Screen):
    part = StringProperty("")
    region = StringProperty("")
    mode = StringProperty("reading")
    last_saved = StringProperty("")

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self._built_key = None
        self._awaiting, self._sent = False, ""
        self._note_soon = Clock.create_trigger(self.keep_note, 1.0)

    # ------------------------------------------------------------------ show
    def refresh(self, full: bool = True) -> None:
        app = App.get_running_app()
        s = app.session
        if s is None or not s.station_id:
            return
        st, m = s.station(), s.member()
        defn = m.definition()
        if not full:  # after a reading: only what the reading changed
            self._part_info(s, st, m, defn)
            return
        self.ids.title.text = f"{m.id}  {st.id} at {st.position:g} {s.position_unit}"
        key = (m.id, repr(m.section), s.length_unit)
        if key != self._built_key:
            self.ids.drawing.built = analyse(defn).gross.pieces
            self._built_key = key
        if self.part and self.part not in [p.id for p in defn.parts]:
            self.part = ""
        self._chips(defn)
        self._regions(defn, st)
        self.ids.drawing.labels = {}
        self._part_info(s, st, m, defn)
        self.ids.pad.unit = s.length_unit
        self.ids.notes.text = st.notes
        self.ids.photos.text = ", ".join(st.photos) if st.photos else "no photos listed"
        self.show_result(app, app.result)

    def _chips(self, defn) -> None:
        box = self.ids.chips
        box.clear_widgets()
        for p in defn.parts:
            b = Factory.Big(text=p.id, chosen=p.id == self.part, font_size="18sp")
            b.part_id = p.id
            b.bind(on_press=partial(self._chip, p.id))
            box.add_widget(b)

    def _regions(self, defn, st) -> None:
        box = self.ids.regions
        box.clear_widgets()
        keys = []
        if self.part:
            keys = [""]
            if isinstance(defn.part(self.part), Angle):
                keys += ["h", "v"]
            keys += [b.id for b in st.bands if b.part == self.part]
        if self.region not in keys:
            self.region = ""
        for k in keys if len(keys) > 1 else []:
            name = REGION_NAMES.get(k, f"band {k}")
            b = Factory.Big(text=name, chosen=k == self.region, font_size="18sp")
            b.bind(on_press=partial(self._pick_region, k))
            box.add_widget(b)

    def _part_info(self, s, st, m, defn) -> None:
        ids = self.ids
        if not self.part:
            ids.part_title.text = "Tap a part on the drawing (or a name below it)"
            ids.stats.text = ""
            ids.hint.text = ""
            return
        part = defn.part(self.part)
        lu = s.length_unit
        nom = from_internal(part.t, "length", lu)
        region = REGION_NAMES.get(self.region, f"band {self.region}")
        ids.part_title.text = f"{self.part}, {region}\nnominal {nom:.4g} {lu}"
        lo, hi = getattr(part, "long_range", (None, None))
        ids.hint.text = (
            f"{self.part} spans {from_internal(lo, 'length', lu):.4g} to "
            f"{from_internal(hi, 'length', lu):.4g} {lu} (section coordinates)"
            if lo is not None
            else f"{self.part} is an angle: bands and holes go on plates"
        )
        try:
            stats = [
                x
                for x in station_stats(st, m)
                if x.part == self.part and (x.region or "") == self.region
            ]
        except AsfoundError as e:
            ids.stats.text = str(e)
            return
        vals = [r for r in st.readings if r.part == self.part and (r.region or "") == self.region]
        listed = ", ".join(f"{r.value:g}" for r in vals[-8:])
        if stats:
            x = stats[0]
            cov = "" if x.cov is None else f", COV {100 * x.cov:.1f} %"
            t_min = from_internal(x.t_min, "length", lu)
            t_mean = from_internal(x.t_mean, "length", lu)
            ids.stats.text = (
                f"{x.n} reading(s): {listed} {lu}\nmin {t_min:.4g}, mean {t_mean:.4g}{cov}"
            )
        else:
            ids.stats.text = "no readings here yet"

    def show_result(self, app, result) -> None:
        """Show core's result of this station (or say it is on its way)."""
        s = app.session
        strip = self.ids.result
        if s is None:
            return
        if app.result_error:
            strip.level, strip.text = "error", "results: " + app.result_error
            return
        ok = result is not None and (result.member, result.station) == (s.member_id, s.station_id)
        if not ok:
            strip.level, strip.text = "info", "results: working ..."
            return
        sr = result.station_result
        flag = present.worst_flag(sr)
        strip.level = f"l{int(flag.level) if flag else 0}"
        strip.text = present.flag_head(flag) + "\n" + present.governing_line(sr)
        self.ids.drawing.found = sr.found.gross.pieces
        self.ids.drawing.labels = {self.part: present.loss_text(sr, self.part)} if self.part else {}
        for chip in self.ids.chips.children:
            loss = present.loss_text(sr, chip.part_id)
            chip.text = f"{chip.part_id}  {loss}" if loss else chip.part_id

    # ------------------------------------------------------------------ choosing
    def choose_part(self, part_id: str) -> None:
        self.part = part_id
        self.region = ""
        self.mode = "reading" if self.mode == "notes" else self.mode
        self.ids.drawing.selected = part_id
        self.ids.pad.clear()
        self.refresh()

    def _chip(self, part_id: str, *_a) -> None:
        self.choose_part(part_id)

    def _pick_region(self, key: str, *_a) -> None:
        self.region = key
        self.refresh()

    def set_mode(self, mode: str) -> None:
        self.mode = mode
        self.ids.modes.current = mode

    def step(self, delta: int) -> None:
        """Go to the previous (-1) or next (+1) station of the member."""
        app = App.get_running_app()
        ids = app.session.station_ids()
        i = ids.index(app.session.station_id) if app.session.station_id in ids else 0
        app.session.select(station=ids[(i + delta) % len(ids)])
        self.refresh()
        app.refresh_results()

    def close_pad(self) -> None:
        self.part = ""
        self.ids.drawing.selected = ""
        self.ids.pad.clear()
        self.refresh()

    # ------------------------------------------------------------------ entries
    def typed(self) -> None:
        """Plausibility warnings (core's) under the value while it is being typed."""
        app = App.get_running_app()
        if not self.part or app.session is None:
            return
        warns = app.guard(lambda: app.session.reading_warnings(self.part, self.ids.pad.text))
        self.ids.warning.level = "warn" if warns else "info"
        self.ids.warning.text = "\n".join(warns or [])

    def commit_reading(self, text: str) -> str | None:
        """Store the typed reading; its id once the store has it (None on an error)."""
        app = App.get_running_app()
        if not self.part:
            app.tell("tap a part first", "warn")
            return None
        if self._awaiting and text == self.ids.pad.text and text == self._sent:
            return None  # the same value sent twice before the first one was shown
        try:
            saved = app.session.add_reading(self.part, text, self.region or None)
        except AsfoundError as e:
            self.ids.warning.level, self.ids.warning.text = "error", str(e)
            return None
        self.last_saved = saved.id
        self._awaiting, self._sent = True, text
        what = f"reading {saved.id} = {text} {app.session.length_unit} on {self.part}"
        app.entry_done(what, saved.warnings, partial(self._acknowledged, text, saved))
        return saved.id

    def _acknowledged(self, text: str, saved) -> None:
        """The screen after a stored reading (drawn with its new result)."""
        self._awaiting = False
        pad = self.ids.pad
        pad.text = pad.text[len(text) :] if pad.text.startswith(text) else pad.text
        if saved.warnings:
            self.ids.warning.level = "warn"
            self.ids.warning.text = "kept: " + "\n".join(w.message for w in saved.warnings)
        self.refresh(full=False)

    def add_band(self) -> None:
        ids, app = self.ids, App.get_running_app()
        saved = app.guard(
            lambda: app.session.add_band(
                self.part, ids.band_lo.text, ids.band_hi.text, ids.band_t.text
            )
        )
        if saved is not None:
            ids.band_lo.text = ids.band_hi.text = ids.band_t.text = ""
            app.entry_done(f"loss band {saved.id} on {self.part}", saved.warnings)
            self.refresh()

    def add_hole(self) -> None:
        ids, app = self.ids, App.get_running_app()
        saved = app.guard(
            lambda: app.session.add_perforation(self.part, ids.hole_lo.text, ids.hole_hi.text)
        )
        if saved is not None:
            ids.hole_lo.text = ids.hole_hi.text = ""
            app.entry_done(f"hole {saved.id} in {self.part}", saved.warnings)
            self.refresh()

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

    # ------------------------------------------------------------------ keyboard
    def key(self, key: int, codepoint: str) -> bool:
        """Keys for the pad: digits, point, Backspace, Enter commits, Escape closes."""
        if key == ESCAPE:
            self.close_pad()
            return True
        if self.mode != "reading" or not self.part:
            return False
        pad = self.ids.pad
        if key in (ENTER, PAD_ENTER):
            pad.commit()
        elif key == BACKSPACE:
            pad.back()
        elif codepoint and codepoint in "0123456789":
            pad.press(codepoint)
        elif codepoint in (".", ","):
            pad.press(".")
        else:
            return False
        return True
