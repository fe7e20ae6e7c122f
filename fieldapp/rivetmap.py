"""The rivet line map along the member: one row per rivet line, rivets at their positions.

A stretch of the member is shown at a scale where rivets are a finger apart; an overview
bar shows the whole member with every rivet that is not sound, and the stretch on view.
Each rivet shows its state by letter and shape as well as colour, the glossary's
(``core.glossary.RIVET_STATES``, the same as the report's map): S filled circle, L half-filled
circle, M open circle, H filled square. A legend under the map names them.
"""

from __future__ import annotations

from kivy.graphics import Color, Ellipse, Line, Rectangle, Triangle
from kivy.metrics import dp, sp
from kivy.properties import ListProperty, NumericProperty, StringProperty
from kivy.uix.behaviors import ButtonBehavior
from kivy.uix.label import Label
from kivy.uix.widget import Widget

from fieldapp import theme
from fieldapp.names import line_name

DOT_DP = 52  # a rivet's touch target
LINE_LABEL_DP = 200  # width of the line names (in words, two lines, and the counts)


def draw_mark(state: str, cx: float, cy: float, d: float, ring: float) -> None:
    """Draw the glossary's shape of rivet state ``state`` centred at (cx, cy), ``d`` across,
    on the current canvas (inside a ``with canvas:`` block)."""
    _letter, rgba, shape = theme.RIVET_LOOK[state]
    x, y = cx - d / 2, cy - d / 2
    if shape == "filled square":
        Color(*rgba)
        Rectangle(pos=(x, y), size=(d, d))
        return
    if shape == "filled circle":
        Color(*rgba)
        Ellipse(pos=(x, y), size=(d, d))
        return
    Color(*theme.FIELD)
    Ellipse(pos=(x, y), size=(d, d))
    Color(*rgba)
    if shape == "half-filled circle":
        Ellipse(pos=(x, y), size=(d, d), angle_start=180, angle_end=360)
    Line(circle=(cx, cy, d / 2), width=ring)


class RivetDot(ButtonBehavior, Label):
    """One rivet: tap to change its state (the screen stores it through core)."""

    line = StringProperty("")
    position = NumericProperty(0.0)
    state_name = StringProperty("sound")

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self.bold = True
        self.font_size = sp(theme.BODY_SP)
        self.bind(pos=self._draw, size=self._draw, state_name=self._draw)
        self._draw()

    def _draw(self, *_a) -> None:
        letter, _rgba, shape = theme.RIVET_LOOK[self.state_name]
        self.text = letter
        self.color = theme.PAPER if shape.startswith("filled") else theme.INK
        d = min(self.width, self.height) - dp(8)
        self.canvas.before.clear()
        with self.canvas.before:
            draw_mark(self.state_name, self.center_x, self.center_y, d, dp(2.5))


class RivetLegend(Widget):
    """What each rivet mark means, drawn with the map's own shapes (glossary words)."""

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self.bind(pos=self._draw, size=self._draw)

    def _draw(self, *_a) -> None:
        from kivy.core.text import Label as CoreLabel

        self.canvas.clear()
        n = len(theme.RIVET_LOOK)
        cell = self.width / max(n, 1)
        d = min(dp(30), self.height - dp(6))
        for i, (state, (letter, _c, _shape)) in enumerate(theme.RIVET_LOOK.items()):
            x = self.x + i * cell + dp(4)
            with self.canvas:
                draw_mark(state, x + d / 2, self.center_y, d, dp(2))
            mark = CoreLabel(
                text=letter,
                font_size=sp(theme.SMALL_SP),
                bold=True,
                color=theme.PAPER if _shape.startswith("filled") else theme.INK,
            )
            mark.refresh()
            lab = CoreLabel(text=state, font_size=sp(theme.SMALL_SP), color=theme.INK)
            lab.refresh()
            with self.canvas:
                Color(1, 1, 1, 1)
                mw, mh = mark.texture.size
                Rectangle(
                    texture=mark.texture,
                    pos=(x + d / 2 - mw / 2, self.center_y - mh / 2),
                    size=(mw, mh),
                )
                tw, th = lab.texture.size
                Rectangle(
                    texture=lab.texture, pos=(x + d + dp(6), self.center_y - th / 2), size=(tw, th)
                )


class Overview(Widget):
    """The whole member as a bar: ticks at rivets that are not sound, the stretch on view
    as a frame, the station as a triangle mark. A tap moves the stretch there."""

    span = NumericProperty(1.0)
    start = NumericProperty(0.0)
    width_shown = NumericProperty(1.0)
    station = NumericProperty(-1.0)
    marks = ListProperty([])  # (position, state)

    __events__ = ("on_pick",)

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        for n in ("pos", "size", "span", "start", "width_shown", "station", "marks"):
            self.bind(**{n: self._draw})

    def on_pick(self, position: float) -> None:
        pass

    def _x(self, p: float) -> float:
        return self.x + dp(8) + (self.width - dp(16)) * p / max(self.span, 1e-9)

    def _draw(self, *_a) -> None:
        self.canvas.clear()
        mid = self.center_y
        with self.canvas:
            Color(*theme.BUTTON)
            Rectangle(pos=(self.x, self.y), size=self.size)
            Color(*theme.INK)
            Line(points=[self._x(0), mid, self._x(self.span), mid], width=dp(2))
            for p, state in self.marks:  # the map's shapes, small
                draw_mark(state, self._x(p), mid, dp(14), dp(1.5))
            Color(*theme.INK)
            x0, x1 = self._x(self.start), self._x(self.start + self.width_shown)
            Line(rectangle=(x0, self.y + dp(3), max(x1 - x0, dp(4)), self.height - dp(6)), width=2)
            if 0 <= self.station <= self.span:
                xs = self._x(self.station)
                Line(points=[xs, self.y + dp(2), xs, self.top - dp(2)], width=dp(1.5))

    def on_touch_down(self, touch) -> bool:
        if not self.collide_point(*touch.pos):
            return False
        frac = (touch.x - self.x - dp(8)) / max(self.width - dp(16), 1.0)
        self.dispatch("on_pick", min(max(frac, 0.0), 1.0) * self.span)
        return True


class StretchAxis(Widget):
    """Positions along the stretch on view, with the station marked."""

    start = NumericProperty(0.0)
    width_shown = NumericProperty(1.0)
    unit = StringProperty("m")
    station = NumericProperty(-1.0)

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        for n in ("pos", "size", "start", "width_shown", "unit", "station"):
            self.bind(**{n: self._draw})

    def _draw(self, *_a) -> None:
        from kivy.core.text import Label as CoreLabel

        self.canvas.clear()
        x0 = self.x + dp(LINE_LABEL_DP)
        w = self.width - dp(LINE_LABEL_DP) - dp(DOT_DP) / 2
        right = self.x + self.width
        with self.canvas:
            Color(*theme.INK)
            Line(points=[x0, self.top - dp(4), x0 + w, self.top - dp(4)], width=1.5)
        if self.start <= self.station <= self.start + self.width_shown:
            xs = x0 + w * (self.station - self.start) / max(self.width_shown, 1e-9)
            with self.canvas:
                Color(*theme.CHOSEN)
                Triangle(
                    points=[xs - dp(10), self.top, xs + dp(10), self.top, xs, self.top - dp(16)]
                )
        for k in range(5):
            p = self.start + self.width_shown * k / 4
            x = x0 + w * k / 4
            lab = CoreLabel(text=f"{p:.4g} {self.unit}", font_size=sp(theme.SMALL_SP))
            lab.refresh()
            tw, th = lab.texture.size
            with self.canvas:
                Color(*theme.INK)
                Line(points=[x, self.top - dp(4), x, self.top - dp(14)], width=1.5)
                Rectangle(
                    texture=lab.texture,
                    pos=(min(max(x - tw / 2, self.x), right - tw), self.y + dp(2)),
                    size=(tw, th),
                )


class RivetRow(Widget):
    """One rivet line on the stretch on view: its name, then its rivets at their positions."""

    start = NumericProperty(0.0)
    width_shown = NumericProperty(1.0)
    line = StringProperty("")
    summary = StringProperty("")

    def __init__(self, rivets: list[tuple[float, str]], on_tap, **kw) -> None:
        super().__init__(**kw)
        self.size_hint_y = None
        self.height = dp(DOT_DP + 20)  # three lines of small text beside the rivets
        self.name_label = Label(
            text="", color=theme.INK, font_size=sp(theme.SMALL_SP), halign="left", bold=True
        )
        self.add_widget(self.name_label)
        self.dots: list[RivetDot] = []
        for p, state in rivets:
            d = RivetDot(line=self.line, position=p, state_name=state, size_hint=(None, None))
            d.size = (dp(DOT_DP), dp(DOT_DP))
            d.bind(on_press=on_tap)
            self.dots.append(d)
        for n in ("pos", "size", "start", "width_shown", "summary"):
            self.bind(**{n: self._place})

    def _place(self, *_a) -> None:
        lab = self.name_label
        name = line_name(self.line)
        lab.text = f"{name}\n{self.summary}" if self.summary else name
        lab.pos, lab.size = (self.x + dp(4), self.y), (dp(LINE_LABEL_DP) - dp(8), self.height)
        lab.text_size = lab.size
        lab.valign = "middle"
        x0 = self.x + dp(LINE_LABEL_DP)
        w = self.width - dp(LINE_LABEL_DP) - dp(DOT_DP) / 2
        end = self.start + self.width_shown * (1 + 1e-9)
        for d in self.dots:
            show = self.start - 1e-9 <= d.position <= end
            if show and d.parent is None:
                self.add_widget(d)
            elif not show and d.parent is not None:
                self.remove_widget(d)
            if show:
                x = x0 + w * (d.position - self.start) / max(self.width_shown, 1e-9)
                d.pos = (x - dp(DOT_DP) / 2, self.y + dp(10))
