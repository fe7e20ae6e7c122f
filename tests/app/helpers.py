"""Touch helpers shared by the GUI tests (the real app, real touches)."""

from __future__ import annotations


def nav(d, name):
    bar = d.app.root.children[-1]
    return next(b for b in bar.children if getattr(b, "screen", None) == name)


def station(d):
    return d.screen("station")


def key(d, label, pad=None):
    """A key of the station's pad (or of ``pad``)."""
    pad = pad if pad is not None else station(d).ids.pad
    return pad.ids.numpad.key_at(label)


def type_on(d, text, pad=None):
    for ch in text:
        d.tap(key(d, ch, pad))


def tap_part(d, part_id):
    """Tap the middle of a part on the station drawing."""
    view = station(d).ids.drawing
    i = view.built.part_ids.index(part_id)
    rect = view.built.rects[view.built.owner == i][0]
    x, y, w, h = view._px(rect)
    d.tap_at(*view.to_window(x + w / 2, y + h / 2))


def new_survey(d, name="Test girders"):
    surveys = d.screen("surveys")
    surveys.ids.new_id.text = name
    d.tap(surveys.ids.start)
    d.results_settled()


def enter_reading(d, text):
    """Type a value on the pad and press Enter; wait until it is acknowledged."""
    st = station(d)
    type_on(d, text)
    d.tap(key(d, "Enter"))
    if not st.ids.pad.held:
        d.until(lambda: st.ids.pad.text == "")


def set_dimension(d, key_name, text):
    """Tap a dimension on the Member screen, type it on the pad over the screen, Enter."""
    app = d.app
    member = d.screen("member")
    d.tap(member.fields[key_name][1])
    assert app.sheet.is_open
    panel = app.sheet.panel
    d.tap(panel.ids.clear_btn)
    type_on(d, text, panel)
    d.tap(key(d, "Enter", panel))


def answer(d, yes=True):
    """Tap an answer of the question over the screen."""
    c = d.app.confirm
    assert c.is_open, "no question is shown"
    d.tap(c.ids.yes if yes else c.ids.no)
