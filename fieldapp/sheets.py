"""A question over the screen with two large answers, at a fixed place below the status
line (layout in ``kv/sheets.kv``): confirm a withdrawal, an undo, or read why not."""

from __future__ import annotations

from kivy.core.window import Window
from kivy.metrics import dp
from kivy.properties import StringProperty
from kivy.uix.floatlayout import FloatLayout

#: below the navigation bar and the status line
TOP_DP = 64 + 56 + 8
SHEET_DP = 196
SHEET_MAX_DP = 760


class Overlay(FloatLayout):
    """A layer over the whole window that takes every touch (a touch outside its content
    does nothing: no accidental dismissal with a glove)."""

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self.is_open = False

    def show_over(self) -> None:
        if not self.is_open:
            Window.add_widget(self)
            self.is_open = True
        self.size, self.pos = Window.size, (0, 0)

    def dismiss(self) -> None:
        if self.is_open:
            Window.remove_widget(self)
            self.is_open = False

    def on_touch_down(self, touch) -> bool:
        super().on_touch_down(touch)
        return True

    def on_touch_move(self, touch) -> bool:
        super().on_touch_move(touch)
        return True

    def on_touch_up(self, touch) -> bool:
        super().on_touch_up(touch)
        return True


class ConfirmSheet(Overlay):
    """``ask(text, yes, on_yes)``: the sentence and two answers; ``tell(text)``: the sentence
    and one answer."""

    text = StringProperty("")
    yes_text = StringProperty("Yes")
    no_text = StringProperty("Keep it")

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self._yes = None
        self._no = None

    def ask(self, text: str, yes_text: str, on_yes, no_text: str = "Keep it", on_no=None) -> None:
        self.text, self.yes_text, self.no_text = text, yes_text, no_text
        self._yes, self._no = on_yes, on_no
        self._open()

    def tell(self, text: str, ok_text: str = "OK") -> None:
        self.ask(text, "", None, ok_text)

    def _open(self) -> None:
        self.show_over()
        box = self.ids.box
        w = min(Window.width - dp(32), dp(SHEET_MAX_DP))
        box.size = (w, dp(SHEET_DP))
        box.pos = ((Window.width - w) / 2, Window.height - dp(TOP_DP) - dp(SHEET_DP))

    def answer(self, yes: bool) -> None:
        """Close, then run the chosen answer."""
        fn = self._yes if yes else self._no
        self.dismiss()
        if fn is not None:
            fn()
