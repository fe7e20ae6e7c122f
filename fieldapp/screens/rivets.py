"""Rivets: the rivet line map along the member; tap a rivet to change its state
(sound -> loose -> missing -> headless -> sound), stored at once through core."""

from __future__ import annotations

import math
from collections import Counter

from kivy.app import App
from kivy.metrics import dp
from kivy.properties import NumericProperty
from kivy.uix.screenmanager import Screen

from core.units import from_internal
from fieldapp import theme
from fieldapp.rivetmap import DOT_DP, LINE_LABEL_DP, RivetRow

GAP_DP = 14  # at least this much between neighbouring rivets on screen


def summary(states: list[str]) -> str:
    """Counts of the rivets that are not sound, by letter (e.g. 'M 2  L 3')."""
    c = Counter(states)
    parts = [f"{theme.RIVET_LOOK[k][0]} {c[k]}" for k in ("missing", "loose", "headless") if c[k]]
    return "  ".join(parts) if parts else "all sound"


class RivetsScreen(Screen):
    start = NumericProperty(0.0)
    width_shown = NumericProperty(1.0)
    span = NumericProperty(1.0)
    station_at = NumericProperty(-1.0)

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self.rows: list[RivetRow] = []
        self._centred_on = None

    def on_size(self, *_a) -> None:
        if self.manager is not None and self.manager.current == self.name:
            self.refresh()

    def refresh(self) -> None:
        s = App.get_running_app().session
        if s is None or not s.member_id:
            return
        m, pu = s.member(), s.position_unit
        defn = m.definition()
        self.span = from_internal(m.span_mm(), "length", pu)
        st = s.station() if s.station_id else None
        self.station_at = st.position if st is not None else -1.0
        pitch = min((ln.pitch for ln in defn.rivet_lines), default=100.0)
        usable = max(self.width - dp(16 + LINE_LABEL_DP + DOT_DP), dp(DOT_DP))
        ncols = max(math.floor(usable / dp(DOT_DP + GAP_DP)), 2)
        self.width_shown = min(ncols * from_internal(pitch, "length", pu), self.span)
        here = (s.path, s.member_id, s.station_id, self.width_shown)
        if self._centred_on != here:
            self._centred_on = here
            self.go_to(max(self.station_at, 0.0))
        self.ids.title.text = f"{m.id}: rivet lines along the member ({pu})"
        self.ids.overview.unit = pu
        box = self.ids.map
        box.clear_widgets()
        self.rows = []
        marks = []
        for ln in defn.rivet_lines:
            rivets = s.rivet_line_states(ln.id)
            row = RivetRow(rivets, self.tap, line=ln.id, summary=summary([x for _, x in rivets]))
            for d in row.dots:
                d.line = ln.id
            row.start, row.width_shown = self.start, self.width_shown
            box.add_widget(row)
            self.rows.append(row)
            marks += [(p, x) for p, x in rivets if x != "sound"]
        self.ids.overview.marks = marks
        if not defn.rivet_lines:
            self.ids.title.text = f"{m.id}: this section has no rivet lines"

    def go_to(self, centre: float) -> None:
        """Show the stretch centred on ``centre`` (position unit), kept inside the member."""
        self.start = min(
            max(centre - self.width_shown / 2, 0.0), max(self.span - self.width_shown, 0.0)
        )
        for r in self.rows:
            r.start = self.start

    def shift(self, direction: int) -> None:
        self.go_to(self.start + self.width_shown / 2 + direction * 0.8 * self.width_shown)

    def to_station(self) -> None:
        self.go_to(max(self.station_at, 0.0))

    def tap(self, dot) -> None:
        """Store the next state of the tapped rivet; the dot shows it once stored."""
        app = App.get_running_app()
        new = app.guard(lambda: app.session.cycle_rivet(dot.line, dot.position, dot.state_name))
        if new is None:
            return
        dot.state_name = new
        app.entry_done(f"rivet {dot.line} at {dot.position:g} {app.session.position_unit}: {new}")
        for r in self.rows:
            if r.line == dot.line:
                r.summary = summary([d.state_name for d in r.dots])
        self.ids.overview.marks = [
            (d.position, d.state_name) for r in self.rows for d in r.dots if d.state_name != "sound"
        ]
