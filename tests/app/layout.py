"""Layout checks of a drawn screen: text that is cut, widgets that overlap or leave the window.

A label's text is cut when, laid out again at its own font and wrap width with no height
limit, it needs more room than its box (wider, or taller), or when kivy shortened it. Two
widgets overlap when the boxes of two visible leaves (labels, buttons, fields, drawings)
share more than a hair; what a scroll view hides is clipped to it. Common practice, no
source: these are the checks a reviewer makes by eye, made exact.
"""

from __future__ import annotations

from kivy.core.text import Label as CoreLabel
from kivy.core.window import Window
from kivy.uix.label import Label
from kivy.uix.scrollview import ScrollView
from kivy.uix.textinput import TextInput
from kivy.uix.widget import Widget

from fieldapp.drawing import SectionView
from fieldapp.rivetmap import Overview, StretchAxis

DRAWN = (Label, TextInput, SectionView, Overview, StretchAxis)
HAIR = 1.0  # px


def _visible(w) -> bool:
    while w is not None and w is not Window:
        if getattr(w, "opacity", 1) <= 0.01:
            return False
        w = w.parent
    return True


def _box(w):
    x, y = w.to_window(w.x, w.y)
    return [x, y, x + w.width, y + w.height]


def _clip(w, box):
    p = w.parent
    while p is not None and p is not Window:
        if isinstance(p, ScrollView):
            c = _box(p)
            box = [max(box[0], c[0]), max(box[1], c[1]), min(box[2], c[2]), min(box[3], c[3])]
        p = p.parent
    return box


def leaves(root) -> list[tuple[Widget, list[float]]]:
    """The visible drawn widgets under ``root`` with their (clipped) window boxes."""
    out = []
    for w in root.walk(restrict=True):
        if not isinstance(w, DRAWN) or not _visible(w) or w.width < 1 or w.height < 1:
            continue
        if isinstance(w, Label) and not w.text.strip() and not hasattr(w, "state"):
            continue  # an empty label draws nothing
        box = _clip(w, _box(w))
        if box[2] - box[0] < HAIR or box[3] - box[1] < HAIR:
            continue  # scrolled out of view
        out.append((w, box))
    return out


def needed(lbl: Label) -> tuple[float, float]:
    """The size the label's text needs at its font and wrap width (no height limit)."""
    opts = dict(lbl._label.options)
    tw = lbl.text_size[0]
    opts["text_size"] = (tw, None)
    opts["shorten"] = False
    opts.pop("text", None)
    if lbl.markup:  # measured as drawn: the tags take no room, a [font] span its own face
        from kivy.core.text.markup import MarkupLabel

        probe = MarkupLabel(text=lbl.text, **opts)
    else:
        probe = CoreLabel(text=lbl.text, **opts)
    probe.refresh()
    return probe.texture.size if probe.texture is not None else (0, 0)


def name(w) -> str:
    t = getattr(w, "text", "")
    t = t.replace("\n", " / ")[:60]
    return f"{type(w).__name__}({t!r})"


def cut_labels(found) -> list[str]:
    out = []
    for w, _box in found:
        if not isinstance(w, Label) or isinstance(w, TextInput) or not w.text.strip():
            continue
        if w.shorten and w.is_shortened:
            out.append(f"{name(w)} is shortened")
            continue
        nw, nh = needed(w)
        if nw > w.width + HAIR:
            out.append(f"{name(w)} needs {nw:.0f} px wide, has {w.width:.0f}")
        elif nh > w.height + HAIR:
            out.append(f"{name(w)} needs {nh:.0f} px high, has {w.height:.0f}")
    return out


def overlaps(found) -> list[str]:
    out = []
    for i, (a, ba) in enumerate(found):
        for b, bb in found[i + 1 :]:
            dx = min(ba[2], bb[2]) - max(ba[0], bb[0])
            dy = min(ba[3], bb[3]) - max(ba[1], bb[1])
            if dx > HAIR and dy > HAIR:
                out.append(f"{name(a)} overlaps {name(b)} by {dx:.0f} x {dy:.0f} px")
    return out


def outside(found, width: float, height: float) -> list[str]:
    return [
        f"{name(w)} leaves the window ({b[0]:.0f}, {b[1]:.0f}, {b[2]:.0f}, {b[3]:.0f})"
        for w, b in found
        if b[0] < -HAIR or b[1] < -HAIR or b[2] > width + HAIR or b[3] > height + HAIR
    ]


def problems(roots) -> list[str]:
    """Every layout problem of the widget trees ``roots`` (each checked on its own: an open
    sheet covers what is under it)."""
    out = []
    for root in roots:
        found = leaves(root)
        out += cut_labels(found) + overlaps(found) + outside(found, Window.width, Window.height)
    return out
