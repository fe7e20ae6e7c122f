"""The numeric pad for readings: large keys, the value typed so far, Enter and Escape."""

from __future__ import annotations

from kivy.properties import StringProperty
from kivy.uix.boxlayout import BoxLayout

MAX_CHARS = 9


class NumPad(BoxLayout):
    """Keys 0-9, the decimal point, back, clear and Enter; fires ``on_commit(text)``."""

    text = StringProperty("")
    unit = StringProperty("mm")

    __events__ = ("on_commit", "on_close")

    def on_commit(self, text: str) -> None:
        pass

    def on_close(self) -> None:
        pass

    def press(self, ch: str) -> None:
        """Append a digit or the decimal point (one point at most)."""
        if len(self.text) >= MAX_CHARS:
            return
        if ch == "." and "." in self.text:
            return
        if ch == "." and not self.text:
            ch = "0."
        self.text += ch

    def back(self) -> None:
        self.text = self.text[:-1]

    def clear(self) -> None:
        self.text = ""

    def commit(self) -> None:
        self.dispatch("on_commit", self.text)

    def close(self) -> None:
        self.dispatch("on_close")
