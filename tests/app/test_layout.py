"""Every screen at every tablet size: nothing cut, shortened, overlapping or off the window.

Walks each screen (and the pad's states: a held value, the band and perforation forms, the pad
over the Member screen, the undo question; the as-built form down its length, the member
actions' sheet and question, History and the inspector's sheets and question) at 800x1280 (portrait), 1024x768, 1280x800,
1366x768 and 1920x1080, writes a screenshot of each to tests/_artifacts/screens/ and fails
on every problem found by tests/app/layout.py, and on any word of another vocabulary on
screen (the glossary's forbidden words, issue 15).
"""

from __future__ import annotations

import pytest

from core.glossary import forbidden_in
from fieldapp.session import Session
from tests.app.conftest import SAMPLES
from tests.app.layout import problems

pytestmark = pytest.mark.gui

SIZES = ((800, 1280), (1024, 768), (1280, 800), (1366, 768), (1920, 1080))


def nav(d, name):
    bar = d.app.root.children[-1]
    return next(b for b in bar.children if getattr(b, "screen", None) == name)


def states(d, tmp_path):
    """Bring the app into each state to check; yields the state's name."""
    app = d.app
    yield "surveys-empty"
    app.set_session(Session.from_sample(tmp_path, app.book, SAMPLES / "deck-girder-si.json"))
    d.results_settled()
    d.tap(nav(d, "member"))
    yield "member"
    member = d.screen("member")
    d.tap(member.fields["tw"][1])
    yield "member-pad"
    app.sheet.dismiss()
    yield from asbuilt_states(d, member)
    d.tap(nav(d, "station"))
    d.until(lambda: app.result is not None and app.result.seq == app.seq, timeout=10)
    yield "station"
    station = d.screen("station")
    station.choose_part("angle_bl")
    d.pump(0.1)
    yield "station-part"
    station.ids.pad.text = "140"
    station.ids.pad.commit()
    yield "station-held"
    station.pad_choice("no")
    station.choose_part("web")
    station.set_mode("band")
    station.form = {"lo": "40", "hi": "160"}
    station.pick_field("t")
    yield "station-band"
    station.set_mode("hole")
    yield "station-hole"
    station.set_mode("notes")
    yield "station-notes"
    station.set_mode("list")
    yield "station-list"
    d.tap(nav(d, "rivets"))
    yield "rivets"
    d.tap(nav(d, "results"))
    d.until(lambda: app.result is not None and app.result.seq == app.seq, timeout=10)
    yield "results"
    from kivy.uix.scrollview import ScrollView

    view = next(w for w in d.screen("results").walk() if isinstance(w, ScrollView))
    view.scroll_y = 0  # the flags under the table: each with its level once, shape and words
    d.pump(0.2)
    yield "results-flags"
    view.scroll_y = 1
    station.choose_part("web")
    station.commit_reading("6.8")
    d.pump(0.4)
    d.tap(app.root.ids.undo)
    yield "undo-question"
    app.confirm.answer(False)
    yield from history_states(d)
    d.tap(nav(d, "surveys"))
    yield "surveys"
    app.set_session(Session.from_sample(tmp_path, app.book, SAMPLES / "through-girder-us.json"))
    d.tap(nav(d, "station"))
    d.until(lambda: app.result is not None and app.result.seq == app.seq, timeout=10)
    station.choose_part("cover_top_1")
    yield "station-us"
    d.tap(nav(d, "results"))
    d.until(lambda: app.result is not None and app.result.seq == app.seq, timeout=10)
    yield "results-us"


def asbuilt_states(d, member):
    """The as-built form down its length, a value on the pad over it, the member actions
    with their sheet and question, two members in the list."""
    app = d.app
    view = member.ids.form.parent
    for i, y in enumerate((0.75, 0.5, 0.25, 0.0)):
        view.scroll_y = y
        d.pump(0.15)
        yield f"asbuilt-{i + 1}"
    row = member.rows[("header", "year_built")]
    view.scroll_to(row, animate=False)
    d.pump(0.1)
    d.tap(row)
    assert app.sheet.is_open
    yield "asbuilt-year-pad"
    app.sheet.dismiss()
    view.scroll_y = 1
    first = app.session.member_id
    d.tap(member.acts["New member"])
    yield "member-new-sheet"
    d.tap(app.text_sheet.ids.save)
    yield "members-two"
    d.tap(member.acts["Withdraw"])
    yield "member-withdraw-question"
    app.confirm.answer(False)
    member._pick_member(first)  # back to the sample's member (as its button does)


def history_states(d):
    """History, and the inspector's name sheet and question over it."""
    app = d.app
    d.tap(nav(d, "history"))
    yield "history"
    hist = d.screen("history")
    d.tap(hist.ids.correct_name)
    yield "inspector-sheet"
    app.text_sheet.inputs[0].text = "Robin Testwell-Marsh (invented)"
    d.tap(app.text_sheet.ids.save)
    assert app.confirm.is_open
    yield "inspector-question"
    app.confirm.answer(False)  # Keep it: the sheet again, with what was typed
    app.text_sheet.close()
    d.tap(hist.ids.hand_over)
    yield "inspector-hand-over-sheet"
    app.text_sheet.close()


@pytest.mark.parametrize("size", SIZES, ids=[f"{w}x{h}" for w, h in SIZES])
def test_every_screen_fits_at_every_tablet_size(field, tmp_path, size):
    from kivy.core.window import Window

    d = field()
    Window.size = size
    d.pump(0.2)
    assert tuple(Window.size) == size
    found = []
    for state in states(d, tmp_path):
        d.pump(0.15)
        d.shot(f"{size[0]}x{size[1]}-{state}", window=True)
        found += [f"{state}: {p}" for p in problems(list(Window.children))]
        found += [f"{state}: {p}" for p in off_glossary(list(Window.children))]
    assert found == [], "\n".join(found)


def off_glossary(roots) -> list[str]:
    """Words of another vocabulary on screen (core.glossary.FORBIDDEN), in any label."""
    from kivy.uix.label import Label

    out = []
    for root in roots:
        for w in root.walk():
            if isinstance(w, Label) and w.text:
                for words, _rule, instead in forbidden_in(w.text):
                    out.append(f"{words!r} on screen (say: {instead})")
    return out
