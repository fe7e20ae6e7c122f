"""Station: the drawn section at the station, tap a part, enter readings on the pad; loss
bands, holes, notes and photo file names; the list of entries to correct; the live result.

The pad's place and size never change (see :mod:`fieldapp.pad`); what is typed, held,
stored or refused is said in the pad's slot and in the fixed boxes on the left.
"""

from __future__ import annotations

from functools import partial

from kivy.app import App
from kivy.clock import Clock
from kivy.factory import Factory
from kivy.metrics import dp
from kivy.properties import StringProperty
from kivy.uix.screenmanager import Screen

from core.errors import AsfoundError
from core.parts import Angle
from core.section import analyse
from core.survey import station_stats
from core.survey.readings import MIN_READINGS
from core.units import from_internal
from fieldapp import present
from fieldapp.names import LEG_NAMES, part_name, place_name
from fieldapp.present import left_here
from fieldapp.screens.entries import EntriesMixin
from fieldapp.screens.stationentry import EntryMixin
from fieldapp.theme import TOUCH_DP

ESCAPE, ENTER, PAD_ENTER, BACKSPACE = 27, 13, 271, 8
PAD_MODES = ("reading", "band", "hole")
CHIP_TALL_DP = 66  # a part's chip in portrait: name on two lines and its loss


class StationScreen(EntryMixin, EntriesMixin, Screen):
    part = StringProperty("")
    region = StringProperty("")
    mode = StringProperty("reading")
    last_saved = StringProperty("")

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self._built_key = None
        self._here = None
        self._awaiting, self._sent = False, ""
        self._note_soon = Clock.create_trigger(self.keep_note, 1.0)
        self.held: list = []
        self.form: dict[str, str] = {}
        self.field = ""
        self.edit = None

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
            if self.mode == "list":
                self.show_entries()
            return
        here = (s.path, m.id, st.id)
        if here != self._here:  # another survey or station: nothing typed or said carries over
            self._here = here
            self.edit, self.form = None, {}
            self.unhold()
            self.ids.pad.text = ""
            self.ids.pad.say("")
        self.ids.title.text = f"{m.id}  ·  station {st.id} at {st.position:g} {s.position_unit}"
        key = (m.id, repr(m.section), s.length_unit)
        if key != self._built_key:
            self.ids.drawing.built = analyse(defn).gross.pieces
            self._built_key = key
        if self.part and self.part not in [p.id for p in defn.parts]:
            self.part = ""
        self._chips(defn)
        self._regions(defn, st)
        self.ids.drawing.labels = {}
        self.ids.pad.unit = s.length_unit
        self._part_info(s, st, m, defn)
        self.ids.notes.text = st.notes
        self.ids.photos.text = (
            "Photos: " + ", ".join(st.photos) if st.photos else "no photos listed"
        )
        self.set_mode(self.mode)
        self.show_result(app, app.result)

    def _chips(self, defn) -> None:
        box = self.ids.chips
        box.clear_widgets()
        tall = App.get_running_app().portrait  # narrow chips: three lines of 18 sp
        for p in defn.parts:
            b = Factory.Big(text=part_name(p.id), chosen=p.id == self.part, font_size="18sp")
            b.height = dp(CHIP_TALL_DP if tall else TOUCH_DP)
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
            name = "whole" if not k else LEG_NAMES.get(k, f"band {k}")
            b = Factory.Big(text=name, chosen=k == self.region, font_size="18sp")
            b.bind(on_press=partial(self._pick_region, k))
            box.add_widget(b)

    def _part_info(self, s, st, m, defn) -> None:
        ids = self.ids
        if not self.part:
            left = left_here(m, st, most=2)
            ids.stats.text = (
                ("Tap a part. " + left) if left else "Tap a part on the drawing or a name below it."
            )
            self.pad_title()
            return
        part = defn.part(self.part)
        lu = s.length_unit
        if self.mode in ("band", "hole"):
            lo, hi = getattr(part, "long_range", (None, None))
            ids.stats.text = (
                f"{part_name(self.part)} spans {from_internal(lo, 'length', lu):.4g} to "
                f"{from_internal(hi, 'length', lu):.4g} {lu} "
                + ("(heights above the back of the bottom angles)" if part.kind == "plate"
                   and getattr(part, "orientation", "") == "vertical" else "(across the member)")
                if lo is not None
                else f"{part_name(self.part)} is an angle: bands and holes go on plates"
            )  # fmt: skip
            self.pad_title()
            return
        try:
            stats = [
                x
                for x in station_stats(st, m)
                if x.part == self.part and (x.region or "") == self.region
            ]
        except AsfoundError as e:
            ids.stats.text = str(e)
            return
        if stats:
            x = stats[0]
            cov = "" if x.cov is None else f", COV {100 * x.cov:.1f} %"
            t_min = from_internal(x.t_min, "length", lu)
            t_mean = from_internal(x.t_mean, "length", lu)
            more = f" ({MIN_READINGS} expected)" if x.n < MIN_READINGS else ""
            ids.stats.text = (
                f"{place_name(self.part, self.region or None)}: {x.n} reading(s){more}, "
                f"min {t_min:.4g}, mean {t_mean:.4g} {lu}{cov}"
            )
        else:
            ids.stats.text = (
                f"{place_name(self.part, self.region or None)}: no readings yet "
                f"({MIN_READINGS} expected)"
            )
        self.pad_title()

    def show_result(self, app, result) -> None:
        """Show core's result of this station (or say it is on its way)."""
        s = app.session
        strip = self.ids.result
        if s is None:
            return
        if app.result_error:
            strip.level, strip.text = "error", "results: " + present.esc(app.result_error)
            return
        ok = result is not None and (result.member, result.station) == (s.member_id, s.station_id)
        if not ok:
            strip.level, strip.text = "info", "results: working ..."
            return
        sr = result.station_result
        flag = present.worst_flag(sr)
        strip.level = f"l{int(flag.level) if flag else 0}"
        strip.text = present.flag_head(flag) + "\n" + present.esc(present.governing_line(sr))
        self.ids.drawing.found = sr.found.gross.pieces
        self.ids.drawing.labels = {self.part: present.loss_text(sr, self.part)} if self.part else {}
        for chip in self.ids.chips.children:
            loss = present.loss_text(sr, chip.part_id)
            name = part_name(chip.part_id)
            chip.text = f"{name} {loss}" if loss else name  # the loss wraps with the name

    # ------------------------------------------------------------------ choosing
    def choose_part(self, part_id: str) -> None:
        self.edit = None
        self.part = part_id
        self.region = ""
        if self.mode not in PAD_MODES:
            self.mode = "reading"
        self.ids.drawing.selected = part_id
        self.unhold()
        self.ids.pad.clear()
        self.form = {}
        self.refresh()

    def _chip(self, part_id: str, *_a) -> None:
        self.choose_part(part_id)

    def _pick_region(self, key: str, *_a) -> None:
        self.region = key
        self.unhold()
        self.refresh()

    def set_mode(self, mode: str) -> None:
        """Reading, band and hole use the pad; notes and the list of entries replace it."""
        if mode != self.mode:
            self.unhold()
            self.ids.pad.clear()
            self.form, self.edit = {}, None
        self.mode = mode
        self.ids.modes.current = "pad" if mode in PAD_MODES else mode
        self.build_form()
        app = App.get_running_app()
        if app is not None and app.session is not None and app.session.station_id:
            s = app.session
            st, m = s.station(), s.member()
            self._part_info(s, st, m, m.definition())
            if mode == "list":
                self.show_entries()

    def step(self, delta: int) -> None:
        """Go to the previous (-1) or next (+1) station of the member."""
        app = App.get_running_app()
        ids = app.session.station_ids()
        i = ids.index(app.session.station_id) if app.session.station_id in ids else 0
        app.session.select(station=ids[(i + delta) % len(ids)])
        self.unhold()
        self.refresh()
        app.refresh_results()

    def close_pad(self) -> None:
        self.edit = None
        self.part = ""
        self.ids.drawing.selected = ""
        self.unhold()
        self.ids.pad.clear()
        self.form = {}
        self.refresh()

    # ------------------------------------------------------------------ keyboard
    def key(self, key: int, codepoint: str) -> bool:
        """Keys for the pad: digits, point, Backspace, Enter commits, Escape closes."""
        if key == ESCAPE:
            self.close_pad()
            return True
        if self.mode not in PAD_MODES or not self.part:
            return False
        from fieldapp.app import pad_keys

        return pad_keys(self.ids.pad, key, codepoint, self.close_pad)
