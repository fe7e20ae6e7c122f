"""The one numeric pad of the app, and the panel around it: it never moves.

:class:`NumPad` places its keys itself, at fixed offsets inside a box of fixed height, in
every state: a held value only disables keys, and a pad without a minus key leaves that
cell empty. Keys are :data:`KEY_DP` high with :data:`GAP_DP` between them (a gloved finger:
at least 56 dp and 12 dp). The layout, four columns::

    7  8  9  Back
    4  5  6  Enter
    1  2  3  Enter
    .  0  -  Enter

:class:`PadPanel` stacks, at fixed heights: a header (what is typed, and Close), the value
(and Clear), a slot of fixed size for messages and the two large choices of a held value
(or a small form), and the keys. Close and Clear are never next to a digit.
:class:`PadSheet` shows a panel over the screen at the same place for any other numeric field.
"""

from __future__ import annotations

from kivy.core.window import Window
from kivy.factory import Factory
from kivy.metrics import dp, sp
from kivy.properties import BooleanProperty, NumericProperty, ObjectProperty, StringProperty
from kivy.uix.boxlayout import BoxLayout
from kivy.uix.label import Label
from kivy.uix.widget import Widget

from fieldapp import theme
from fieldapp.sheets import Overlay

KEY_DP = 60  # key height (>= 56 dp for a gloved finger)
GAP_DP = 12  # between keys (>= 12 dp)
ROW_DP = 56  # header row
DISPLAY_DP = 64  # the value typed
SLOT_DP = 124  # messages and the choices of a held value
CHOICE_DP = 210  # width of the column of choices in the slot
PAD_DP = 4 * KEY_DP + 3 * GAP_DP
PANEL_DP = ROW_DP + DISPLAY_DP + SLOT_DP + PAD_DP + 3 * GAP_DP
MAX_CHARS = 10

#: (label, column, row, rows spanned); row 0 at the top
KEYS = (
    ("7", 0, 0, 1), ("8", 1, 0, 1), ("9", 2, 0, 1), ("Back", 3, 0, 1),
    ("4", 0, 1, 1), ("5", 1, 1, 1), ("6", 2, 1, 1), ("Enter", 3, 1, 3),
    ("1", 0, 2, 1), ("2", 1, 2, 1), ("3", 2, 2, 1),
    (".", 0, 3, 1), ("0", 1, 3, 1), ("-", 2, 3, 1),
)  # fmt: skip


class NumPad(Widget):
    """The keys; fires ``on_key(label)``. ``allow_minus`` shows the minus key; ``held``
    disables every key (the choices of a held value must be taken first)."""

    allow_minus = BooleanProperty(False)
    held = BooleanProperty(False)

    __events__ = ("on_key",)

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self.size_hint_y = None
        self.height = dp(PAD_DP)
        self.keys: dict[str, Widget] = {}
        for label, _c, _r, _n in KEYS:
            k = Factory.Key(text=label)
            if label in ("Back", "Enter"):
                k.font_size = sp(24)
            k.bind(on_press=lambda w: self.dispatch("on_key", w.text))
            self.keys[label] = k
            self.add_widget(k)
        self.bind(pos=self._place, size=self._place, allow_minus=self._place, held=self._place)
        self._place()

    def on_key(self, label: str) -> None:
        pass

    def _place(self, *_a) -> None:
        gap, kh = dp(GAP_DP), dp(KEY_DP)
        kw = (self.width - 3 * gap) / 4
        for label, c, r, n in KEYS:
            k = self.keys[label]
            k.size_hint = (None, None)
            k.size = (kw, n * kh + (n - 1) * gap)
            k.pos = (self.x + c * (kw + gap), self.top - (r + n) * kh - (r + n - 1) * gap)
            shown = label != "-" or self.allow_minus
            k.opacity = 1 if shown else 0
            k.disabled = self.held or not shown

    def key_at(self, label: str) -> Widget:
        return self.keys[label]


class FitLabel(Label):
    """A label of fixed size whose text wraps and, when it would not fit, gets smaller down
    to :data:`theme.MIN_SP` (never cut while it fits at that size)."""

    base_sp = NumericProperty(theme.BODY_SP)

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self.bind(size=self._fit, text=self._fit, base_sp=self._fit)

    def _fit(self, *_a) -> None:
        pad = dp(8)
        self.padding = (pad, pad / 2)
        self.text_size = (max(self.width - 2 * pad, 1), None)
        size = self.base_sp
        while True:
            self.font_size = sp(size)
            self.texture_update()
            if self.texture_size[1] <= self.height or size <= theme.MIN_SP:
                return
            size -= 1


class PadPanel(BoxLayout):
    """Header, value, slot and keys at fixed heights (layout in ``kv/pad.kv``).

    Events: ``on_commit(text)`` (Enter), ``on_close``, ``on_choice(which)`` ("yes" or
    "no": the two large choices shown while ``held``), ``on_text`` as typed.
    """

    text = StringProperty("")
    unit = StringProperty("mm")
    title = StringProperty("")
    message = StringProperty("")
    level = StringProperty("info")
    held = BooleanProperty(False)
    allow_minus = BooleanProperty(False)
    yes_text = StringProperty("Store as read")
    no_text = StringProperty("Fix")
    action_text = StringProperty("")  # a button in the choices column when not held

    __events__ = ("on_commit", "on_close", "on_choice", "on_action")

    def on_commit(self, text: str) -> None:
        pass

    def on_close(self) -> None:
        pass

    def on_choice(self, which: str) -> None:
        pass

    def on_action(self) -> None:
        pass

    def key(self, label: str) -> None:
        """A key of the pad (or of the keyboard)."""
        if self.held:
            return
        if label == "Back":
            self.back()
        elif label == "Enter":
            self.commit()
        elif label == "-":
            if self.allow_minus:
                self.text = self.text[1:] if self.text.startswith("-") else "-" + self.text
        else:
            self.press(label)

    def press(self, ch: str) -> None:
        """Append a digit or the decimal point (one point at most)."""
        if self.held or len(self.text) >= MAX_CHARS:
            return
        if ch == "." and "." in self.text:
            return
        if ch == "." and self.text in ("", "-"):
            ch = "0."
        self.text += ch

    def back(self) -> None:
        if not self.held:
            self.text = self.text[:-1]

    def clear(self) -> None:
        """Clear the value (while held: the same as "fix")."""
        if self.held:
            self.dispatch("on_choice", "no")
            return
        self.text = ""

    def commit(self) -> None:
        if not self.held:
            self.dispatch("on_commit", self.text)

    def close(self) -> None:
        self.dispatch("on_close")

    def say(self, text: str, level: str = "info") -> None:
        self.message, self.level = text, level


class PadSheet(Overlay):
    """A pad panel over the screen at the pad's place (see :func:`pad_box`), for a number
    that is not a reading; touches outside it do nothing. ``done(text)`` is called on Enter
    and returns an error text to show (empty: close)."""

    panel = ObjectProperty(None)

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self.done = None
        self.typed = None
        self.panel = Factory.PadPanel()
        self.panel.size_hint = (None, None)
        self.panel.bind(on_commit=self._commit, on_close=lambda *_a: self.dismiss())
        self.panel.bind(text=lambda _p, t: self.typed(t) if self.typed else None)
        self.add_widget(self.panel)
        self.bind(size=self._place, pos=self._place)

    def show(
        self,
        title: str,
        text: str,
        unit: str,
        done,
        *,
        minus: bool = False,
        typed=None,
        hint: str = "",
    ) -> None:
        """Open with ``text`` typed; ``done(text)`` on Enter, ``typed(text)`` as typed."""
        p = self.panel
        self.typed = None
        p.title, p.text, p.unit, p.allow_minus, p.held = title, text, unit, minus, False
        p.say(hint or "Enter keeps the value; Close leaves it as it was.")
        self.done, self.typed = done, typed
        self.show_over()
        self._place()

    def _place(self, *_a) -> None:
        x, y, w, h = pad_box(Window.width, Window.height)
        self.panel.pos, self.panel.size = (x, y), (w, h)

    def _commit(self, _panel, text: str) -> None:
        err = self.done(text) if self.done is not None else ""
        if err:
            self.panel.say(err, "error")
        else:
            self.dismiss()

    def dismiss(self) -> None:
        was = self.is_open
        super().dismiss()
        if was and self.typed is not None:
            self.typed(None)  # closed: show what is stored
        self.typed = None


def portrait(width: float, height: float) -> bool:
    return width < height


def pad_width(width: float, height: float) -> float:
    """The width of the pad's column: the right column in landscape, the whole width
    (less the margins) in portrait."""
    if portrait(width, height):
        return width - dp(16)
    return min(max(0.44 * width, dp(440)), dp(620))


def pad_box(width: float, height: float) -> tuple[float, float, float, float]:
    """(x, y, w, h) of the pad panel in the window: bottom right, above the margin."""
    w = pad_width(width, height)
    return width - w - dp(8), dp(8), w, dp(PANEL_DP)
