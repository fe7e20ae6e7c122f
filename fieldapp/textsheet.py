"""A line of text (or two) typed over the screen: a name, initials, a list of positions.

``ask(title, fields, done)``: ``fields`` are (label, text) pairs; ``done(*texts)`` stores them
and returns an error sentence (shown, the sheet stays open with what was typed) or "" (the
sheet closes). It sits at the top of the window so that a tablet's keyboard leaves it in view.
Layout in ``kv/text.kv``.
"""

from __future__ import annotations

from kivy.core.window import Window
from kivy.factory import Factory
from kivy.metrics import dp
from kivy.properties import BooleanProperty, StringProperty

from fieldapp.sheets import SHEET_MAX_DP, Overlay

TOP_DP = 8
ROW_DP = 56 + 32 + 8


class TextSheet(Overlay):
    title = StringProperty("")
    message = StringProperty("")
    level = StringProperty("info")
    can_close = BooleanProperty(True)

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self.done = None
        self.inputs: list = []

    def ask(self, title: str, fields, done, *, can_close: bool = True, hint: str = "") -> None:
        self.title, self.done, self.can_close = title, done, can_close
        self.message, self.level = hint, "info"
        box = self.ids.fields
        box.clear_widgets()
        self.inputs = []
        for label, text in fields:
            box.add_widget(Factory.Body(text=label, size_hint_y=None, height=dp(32)))
            f = Factory.Field(text=text)
            f.bind(on_text_validate=lambda *_a: self.save())
            box.add_widget(f)
            self.inputs.append(f)
        self.show_over()
        w = min(Window.width - dp(32), dp(SHEET_MAX_DP))
        n = len(self.inputs)  # each: a label and a field, 8 dp between any two widgets
        h = dp(56 + 56 + 56 + 36) + n * dp(ROW_DP) + max(n - 1, 0) * dp(8)
        self.ids.box.size = (w, h)
        self.ids.box.pos = ((Window.width - w) / 2, Window.height - dp(TOP_DP) - h)
        if self.inputs:
            self.inputs[0].focus = True

    def save(self) -> None:
        err = self.done(*[f.text for f in self.inputs]) if self.done is not None else ""
        if err:
            self.message, self.level = err, "error"
        else:
            self.close()

    def close(self) -> None:
        for f in self.inputs:
            f.focus = False
        self.dismiss()
