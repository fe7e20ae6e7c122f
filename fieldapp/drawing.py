"""The drawn cross-section: core's pieces, scaled to fit, as-built outline behind.

Draws the rectangles of :class:`core.geometry.Pieces` (``rects`` xmin, ymin, xmax, ymax in
mm) as given by core; computes nothing about the section. A tap selects the part whose
as-built pieces are nearest to the finger (within a finger's width), so thin plates can
be chosen with a glove.
"""

from __future__ import annotations

from kivy.core.text import Label as CoreLabel
from kivy.graphics import Color, Line, Rectangle
from kivy.metrics import dp, sp
from kivy.properties import DictProperty, ObjectProperty, StringProperty
from kivy.uix.widget import Widget

from fieldapp import theme

REACH_DP = 32  # a tap this close to a part selects it


class SectionView(Widget):
    """Draws ``built`` (outline) and ``found`` (filled) pieces; fires ``on_part(part_id)``."""

    built = ObjectProperty(None, allownone=True, comparator=lambda a, b: a is b)
    found = ObjectProperty(None, allownone=True, comparator=lambda a, b: a is b)
    selected = StringProperty("")
    labels = DictProperty({})
    caption = StringProperty("")

    __events__ = ("on_part",)

    def __init__(self, **kw) -> None:
        super().__init__(**kw)
        self._frame = (0.0, 0.0, 1.0)  # x0 (px), y0 (px), scale (px/mm)
        self._bounds = (0.0, 0.0, 1.0, 1.0)
        self._textures: dict = {}
        for name in ("pos", "size", "built", "found", "selected", "labels", "caption"):
            self.bind(**{name: self._redraw})

    def on_part(self, part_id: str) -> None:
        pass

    # ------------------------------------------------------------------ geometry
    def _fit(self) -> None:
        rects = self.built.rects
        xmin, ymin = rects[:, 0].min(), rects[:, 1].min()
        xmax, ymax = rects[:, 2].max(), rects[:, 3].max()
        m = dp(16)
        top = dp(38) if self.caption else m
        w, h = max(self.width - 2 * m, 1.0), max(self.height - m - top, 1.0)
        s = min(w / max(xmax - xmin, 1e-9), h / max(ymax - ymin, 1e-9))
        x0 = self.x + m + (w - s * (xmax - xmin)) / 2 - s * xmin
        y0 = self.y + m + (h - s * (ymax - ymin)) / 2 - s * ymin
        self._frame = (x0, y0, s)
        self._bounds = (xmin, ymin, xmax, ymax)

    def _px(self, r) -> tuple[float, float, float, float]:
        x0, y0, s = self._frame
        return x0 + s * r[0], y0 + s * r[1], s * (r[2] - r[0]), s * (r[3] - r[1])

    def part_at(self, x: float, y: float) -> str:
        """The part nearest to window point (x, y) within :data:`REACH_DP`, or ''."""
        if self.built is None:
            return ""
        best, best_d = "", dp(REACH_DP)
        for rect, owner in zip(self.built.rects, self.built.owner, strict=True):
            px, py, pw, ph = self._px(rect)
            dx = max(px - x, 0.0, x - (px + pw))
            dy = max(py - y, 0.0, y - (py + ph))
            d = (dx * dx + dy * dy) ** 0.5
            if d < best_d or (d == best_d == 0.0):
                best, best_d = self.built.part_ids[int(owner)], d
        return best

    def on_touch_down(self, touch) -> bool:
        if not self.collide_point(*touch.pos):
            return super().on_touch_down(touch)
        pid = self.part_at(*touch.pos)
        if pid:
            self.dispatch("on_part", pid)
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
        if self.caption:
            self._text(self.caption, self.x + dp(10), self.top - dp(18), theme.MUTED, anchor="w")
        if self.built is None or len(self.built.rects) == 0:
            return
        self._fit()
        sel = (
            self.built.part_ids.index(self.selected) if self.selected in self.built.part_ids else -1
        )
        with self.canvas:
            Color(*theme.BUTTON)
            for r in self.built.rects:
                Rectangle(pos=self._px(r)[:2], size=self._px(r)[2:])
            if self.found is not None:
                for r, o in zip(self.found.rects, self.found.owner, strict=True):
                    Color(*(theme.CHOSEN if int(o) == sel else theme.STEEL))
                    px = self._px(r)
                    Rectangle(pos=px[:2], size=px[2:])
            Color(*theme.INK)
            for r in self.built.rects:
                Line(rectangle=self._px(r), width=1)
            if sel >= 0:
                Color(*theme.CHOSEN)
                for r, o in zip(self.built.rects, self.built.owner, strict=True):
                    if int(o) == sel:
                        px = self._px(r)
                        Line(rectangle=(px[0] - 4, px[1] - 4, px[2] + 8, px[3] + 8), width=2.5)
        for pid, text in self.labels.items():
            if text and pid in self.built.part_ids:
                self._label_part(pid, text)

    def _label_part(self, pid: str, text: str) -> None:
        """A label beside the section (never over it), level with the part's middle."""
        i = self.built.part_ids.index(pid)
        rs = self.built.rects[self.built.owner == i]
        cy = (rs[:, 1].min() + rs[:, 3].max()) / 2
        x0, y0, s = self._frame
        self._text(text, x0 + s * self._bounds[2] + dp(8), y0 + s * cy, theme.INK, "w", box=True)

    def _texture(self, text: str):
        """The texture of ``text``, made once (each new texture costs a GPU upload)."""
        tex = self._textures.get(text)
        if tex is None:
            lab = CoreLabel(text=text, font_size=sp(theme.SMALL_SP), bold=True)
            lab.refresh()
            tex = self._textures[text] = lab.texture
            if len(self._textures) > 64:
                self._textures.pop(next(iter(self._textures)))
        return tex

    def _text(self, text, x, y, color, anchor="c", box=False) -> None:
        tex = self._texture(text)
        w, h = tex.size
        left = {"w": x, "e": x - w}.get(anchor, x - w / 2)
        with self.canvas:
            if box:
                Color(1, 1, 1, 0.9)
                Rectangle(pos=(left - 3, y - h / 2 - 1), size=(w + 6, h + 2))
            Color(*color)
            Rectangle(texture=tex, pos=(left, y - h / 2), size=(w, h))
