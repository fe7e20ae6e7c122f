"""The member along its span, to scale: supports, stiffeners and stations; a tap opens the
nearest station (within a finger's width).

Positions are in the survey's position unit, as stored; the strip computes nothing about the
member. Station names are written above their marks where there is room (a name that would
run into the one before it is left out, never drawn over it; its mark is always drawn, and
the stations' buttons below the strip name every one).
"""

from __future__ import annotations

from kivy.clock import Clock
from kivy.core.text import Label as CoreLabel
from kivy.graphics import Color, Ellipse, Line, Rectangle, Triangle
from kivy.metrics import dp, sp
from kivy.properties import ListProperty, NumericProperty, StringProperty
from kivy.uix.widget import Widget

from fieldapp import theme

REACH_DP = 28  # a tap this close to a station's mark opens it
MARK_DP = 9  # radius of a station's mark


class SpanStrip(Widget):
    """``span`` (position unit), ``supports`` and ``stiffeners`` (positions), ``stations``
    (``(id, position)`` pairs) and the ``selected`` station id; fires
    ``on_station(station_id)``."""

    span = NumericProperty(0.0)
    supports = ListProperty([])
    stiffeners = ListProperty([])
    stations = ListProperty([])
    selected = StringProperty("")
    unit = StringProperty("m")

    __events__ = ("on_station",)

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self._textures: dict = {}
        # one drawing per frame, after every change of that frame (never a stale layout)
        self._soon = Clock.create_trigger(self._redraw, -1)
        for name in ("pos", "size", "span", "supports", "stiffeners", "stations", "selected"):
            self.bind(**{name: self._soon})

    def on_station(self, station_id: str) -> None:
        pass

    # ------------------------------------------------------------------ geometry
    def x_of(self, position: float) -> float:
        """Window x of a position along the member."""
        m = dp(24)
        span = self.span if self.span > 0 else 1.0
        return self.x + m + (self.width - 2 * m) * min(max(position / span, 0.0), 1.0)

    @property
    def axis_y(self) -> float:
        return self.y + self.height * 0.42

    def station_at(self, x: float, y: float) -> str:
        """The station whose mark is nearest to window point (x, y) within
        :data:`REACH_DP`, or ''."""
        best, best_d = "", dp(REACH_DP)
        for sid, pos in self.stations:
            d = ((self.x_of(pos) - x) ** 2 + (self.axis_y - y) ** 2) ** 0.5
            if d < best_d:
                best, best_d = sid, d
        return best

    def on_touch_down(self, touch) -> bool:
        if not self.collide_point(*touch.pos):
            return super().on_touch_down(touch)
        sid = self.station_at(*touch.pos)
        if sid:
            self.dispatch("on_station", sid)
            return True
        return super().on_touch_down(touch)

    # ------------------------------------------------------------------ drawing
    def _redraw(self, *_a) -> None:
        self.canvas.clear()
        with self.canvas:
            Color(*theme.FIELD)
            Rectangle(pos=self.pos, size=self.size)
            Color(*theme.RULE)
            Line(rectangle=(self.x, self.y, self.width, self.height), width=1)
        if self.span <= 0:
            return
        y = self.axis_y
        left, right = self.x_of(0.0), self.x_of(self.span)
        with self.canvas:
            Color(*theme.RULE)
            for p in self.stiffeners:
                x = self.x_of(p)
                Line(points=[x, y - dp(12), x, y + dp(12)], width=1)
            Color(*theme.INK)
            Line(points=[left, y, right, y], width=dp(2))
            for p in self.supports:
                x = self.x_of(p)
                h = dp(12)
                Triangle(
                    points=[x, y - dp(2), x - h * 0.7, y - h - dp(2), x + h * 0.7, y - h - dp(2)]
                )
        r = dp(MARK_DP)
        marks = sorted(self.stations, key=lambda s: (s[1], s[0]))
        for sid, p in marks:
            x = self.x_of(p)
            chosen = sid == self.selected
            with self.canvas:
                Color(*(theme.CHOSEN if chosen else theme.STEEL))
                Ellipse(pos=(x - r, y - r), size=(2 * r, 2 * r))
                if chosen:
                    Color(*theme.INK)
                    Line(circle=(x, y, r + dp(3)), width=2)
        # names: the chosen station's first, then the others where they meet no name
        taken: list[tuple[float, float]] = []
        order = [m for m in marks if m[0] == self.selected] + [
            m for m in marks if m[0] != self.selected
        ]
        for sid, p in order:
            tex = self._texture(sid)
            w, h = tex.size
            lo = min(max(self.x_of(p) - w / 2, self.x + dp(2)), self.right - w - dp(2))
            if any(lo < b + dp(4) and lo + w + dp(4) > a for a, b in taken):
                continue
            taken.append((lo, lo + w))
            with self.canvas:
                Color(*(theme.INK if sid == self.selected else theme.MUTED))
                Rectangle(texture=tex, pos=(lo, y + r + dp(4)), size=(w, h))
        end = self._texture(f"{self.span:g} {self.unit}")
        zero = self._texture(f"0 {self.unit}")
        with self.canvas:
            Color(*theme.MUTED)
            Rectangle(texture=end, pos=(right - end.size[0], self.y + dp(2)), size=end.size)
            Rectangle(texture=zero, pos=(left, self.y + dp(2)), size=zero.size)

    def _texture(self, text: str):
        tex = self._textures.get(text)
        if tex is None:
            lab = CoreLabel(text=text, font_size=sp(theme.SMALL_SP), bold=True)
            lab.refresh()
            tex = self._textures[text] = lab.texture
            if len(self._textures) > 128:
                self._textures.pop(next(iter(self._textures)))
        return tex
