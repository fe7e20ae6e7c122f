"""The member along its span on the Member screen: a tap on a station's mark opens it; a new
station at a distance from the current one; a station moved; a station withdrawn only after
a question, and brought back by Undo (the real app, real touches). Properties of the app's
own rules; no outside source applies."""

from __future__ import annotations

import pytest

from tests.app.helpers import answer, key, nav, new_survey, type_on

pytestmark = pytest.mark.gui


def _pad_enter(d, text):
    panel = d.app.sheet.panel
    d.tap(panel.ids.clear_btn)
    type_on(d, text, panel)
    d.tap(key(d, "Enter", panel))


def _member(d):
    d.tap(nav(d, "member"))
    d.pump(0.1)
    return d.screen("member")


def test_the_strip_draws_the_span_and_a_tap_opens_a_station(field):
    d = field()
    new_survey(d, "Strip")
    s = d.app.session
    first = s.station_id
    x0 = s.station().position
    s.add_station("east", f"{x0 + 3.0:g}")
    s.select(station=first)
    member = _member(d)
    strip = member.ids.strip
    span = s.member().span
    assert strip.span == pytest.approx(span.value) and span.unit == s.position_unit
    assert sorted(strip.stations) == sorted([(first, x0), ("east", x0 + 3.0)])
    assert strip.selected == first
    d.shot("member-strip")
    d.tap_at(*strip.to_window(strip.x_of(x0 + 3.0), strip.axis_y))
    assert d.app.screen == "station" and s.station_id == "east"
    # a tap on the strip away from every station opens nothing
    member = _member(d)
    d.tap_at(*strip.to_window(strip.x_of(0.0) + 1, strip.axis_y + strip.height * 0.5))
    assert d.app.screen == "member"


def test_new_station_at_a_distance_from_the_current_one(field):
    d = field()
    new_survey(d, "Plus x")
    s = d.app.session
    x0 = s.station().position
    member = _member(d)
    d.tap(member.ids.add_after)
    assert d.app.sheet.is_open and "distance from S1" in d.app.sheet.panel.title
    _pad_enter(d, "-2.5")
    assert d.app.screen == "station" and s.station_id == "S2"
    assert s.station().position == pytest.approx(x0 - 2.5)
    assert s.station_ids() == ["S2", "S1"]
    # zero is refused with a sentence that says why; nothing is added
    member = _member(d)
    d.tap(member.ids.add_after)
    _pad_enter(d, "0")
    panel = d.app.sheet.panel
    assert d.app.sheet.is_open and panel.level == "error" and "distance 0" in panel.message
    d.tap(panel.ids.close_btn)
    assert s.station_ids() == ["S2", "S1"]


def test_move_keeps_everything_and_refuses_a_place_off_the_member(field):
    d = field()
    new_survey(d, "Move")
    s = d.app.session
    member = _member(d)
    d.tap(member.ids.move_station)
    panel = d.app.sheet.panel
    assert panel.ids is not None and "Move station S1" in panel.title
    _pad_enter(d, "999")
    assert d.app.sheet.is_open and panel.level == "error"
    assert s.station().position != 999.0  # refused: the stored place is unchanged
    _pad_enter(d, "2")
    assert not d.app.sheet.is_open and s.station().position == 2.0
    hist = [e for e in s.store.history() if e.kind == "station" and e.action == "update"]
    assert [(e.field, e.new) for e in hist] == [("position", 2.0)]


def test_withdraw_asks_first_and_undo_brings_the_station_back(field):
    d = field()
    new_survey(d, "Withdraw")
    s = d.app.session
    s.add_station("S2", "3")
    s.select(station="S2")
    member = _member(d)
    d.tap(member.ids.withdraw_station)
    assert d.app.confirm.is_open and d.app.confirm.text.startswith("Withdraw station S2 at 3 m")
    answer(d, yes=False)
    assert "S2" in s.station_ids()
    d.tap(member.ids.withdraw_station)
    answer(d, yes=True)
    assert "S2" not in s.station_ids() and s.station_id in s.station_ids()
    d.tap(d.app.root.ids.undo)
    answer(d, yes=True)
    assert "S2" in s.station_ids()
