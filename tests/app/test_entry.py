"""Entry a gloved finger cannot get wrong: the reading guard, a pad that never moves, every
entry correctable with its history kept, and an undo that says what it will undo.

The guard's limits are our own rule (core/survey/guard.py); the geometry limits (keys of at
least 56 dp with at least 12 dp between them) are the issue's, common practice, no source.
"""

from __future__ import annotations

import itertools

import pytest

from core.survey import FieldStore
from tests.app.helpers import (
    answer,
    enter_reading,
    key,
    nav,
    new_survey,
    set_dimension,
    station,
    tap_part,
    type_on,
)

pytestmark = pytest.mark.gui


def web_survey(d, name="Guard"):
    """A new survey whose web is 12 mm thick, on the Station screen with the web chosen."""
    new_survey(d, name)
    set_dimension(d, "tw", "12")
    assert d.app.session.member().section["girder"]["tw"] == 12.0
    d.tap(nav(d, "station"))
    tap_part(d, "web")
    return station(d)


def stored(d):
    return [(r.id, r.value) for r in d.app.session.station().readings]


def test_120_on_a_12_mm_web_is_held_until_a_choice_is_made(field, tmp_path):
    d = field()
    app = d.app
    st = web_survey(d)
    history = len(app.session.store.history())
    type_on(d, "120")
    d.tap(key(d, "Enter"))
    pad = st.ids.pad
    assert pad.held and pad.level == "held"
    assert "120 mm is above the nominal 12 mm (1000 %)" in pad.message
    assert "did you mean 12 mm?" in pad.message
    assert stored(d) == [] and len(app.session.store.history()) == history  # nothing stored
    d.tap(key(d, "Enter"))  # a second tap on Enter does not choose
    d.tap(key(d, "5"))  # nor does a digit
    assert stored(d) == [] and pad.held and pad.text == "120"
    d.tap(pad.ids.yes)  # "Store as read"
    d.until(lambda: pad.text == "")
    (r,) = app.session.station().readings
    assert r.value == 120.0 and "above the nominal 12 mm" in r.stored_as_read
    assert "(stored as read)" in app.status


def test_0_95_on_a_9_5_mm_mean_is_held_and_fix_stores_nothing(field, tmp_path):
    d = field()
    app = d.app
    st = web_survey(d, "Slip")
    for v in ("9.4", "9.5", "9.6"):
        enter_reading(d, v)
    assert [v for _, v in stored(d)] == [9.4, 9.5, 9.6]
    type_on(d, "0.95")
    d.tap(key(d, "Enter"))
    pad = st.ids.pad
    assert pad.held and "below 20 %" in pad.message and "did you mean 9.5 mm?" in pad.message
    assert len(stored(d)) == 3
    d.tap(pad.ids.no)  # "Fix"
    assert not pad.held and pad.text == "" and "was not stored" in pad.message
    assert len(stored(d)) == 3
    enter_reading(d, "9.5")  # the right value goes straight in
    assert [v for _, v in stored(d)] == [9.4, 9.5, 9.6, 9.5]
    # far from the other readings (modified z-score above 3.5) is held too
    type_on(d, "6.1")
    d.tap(key(d, "Enter"))
    assert pad.held and "far from the other 4 readings" in pad.message
    d.tap(pad.ids.no)
    assert len(stored(d)) == 4 and app.session.station().readings[-1].stored_as_read == ""


def key_boxes(pad):
    """Window position and size of every key of a pad."""
    out = {}
    for label, k in pad.ids.numpad.keys.items():
        x, y = k.to_window(k.x, k.y)
        out[label] = (round(x, 3), round(y, 3), round(k.width, 3), round(k.height, 3))
    return out


@pytest.mark.parametrize("system", ["si", "us"])
def test_every_key_keeps_its_place_in_every_state(field, tmp_path, system):
    from kivy.metrics import dp

    d = field()
    app = d.app
    surveys = d.screen("surveys")
    surveys.set_system(system)
    new_survey(d, f"Keys {system}")
    d.tap(nav(d, "station"))
    st = station(d)
    tap_part(d, "web")
    pad = st.ids.pad
    first = key_boxes(pad)
    for label, (_x, _y, w, h) in first.items():
        assert w >= dp(56) and h >= dp(56), label
    # at least 12 dp between neighbouring keys
    xs = sorted({b[0] for b in first.values()})
    ys = sorted({b[1] for b in first.values()})
    w, h = first["7"][2], first["7"][3]
    assert all(b - a >= w + dp(12) - 1e-6 for a, b in itertools.pairwise(xs))
    assert all(b - a >= h + dp(12) - 1e-6 for a, b in itertools.pairwise(ys))

    seen = {}
    # the first digit: 3 in on a 3/8 in web, or 1 mm on a 10 mm web, is held at Enter
    type_on(d, "3" if system == "us" else "1")
    seen["first digit"] = key_boxes(pad)
    d.tap(key(d, "Enter"))
    assert pad.held
    seen["held"] = key_boxes(pad)
    d.tap(pad.ids.no)
    seen["after fix"] = key_boxes(pad)
    d.tap(key(d, "Enter"))  # nothing typed: an error in the slot
    assert pad.level == "error"
    seen["error"] = key_boxes(pad)
    enter_reading(d, "0.3" if system == "us" else "8.1")
    seen["saved"] = key_boxes(pad)
    for mode in ("band", "hole", "reading"):
        st.set_mode(mode)
        d.pump(0.05)
        seen[mode] = key_boxes(pad)
    for state, boxes in seen.items():
        for label in first:
            if label == "-":
                continue  # the minus key shows only where negative makes sense
            assert boxes[label] == first[label], (state, label)
    # the pad over the Member screen sits at the same place with the same keys
    d.tap(nav(d, "member"))
    d.tap(d.screen("member").fields["D"][1])
    over = key_boxes(app.sheet.panel)
    assert {k: v for k, v in over.items() if k != "-"} == {
        k: v for k, v in first.items() if k != "-"
    }
    app.sheet.dismiss()


def test_minus_only_where_negative_makes_sense(field, tmp_path):
    d = field()
    new_survey(d, "Minus")
    d.tap(nav(d, "station"))
    st = station(d)
    tap_part(d, "web")
    minus = st.ids.pad.ids.numpad.keys["-"]
    assert minus.opacity == 0 and minus.disabled  # a thickness is never negative
    st.set_mode("band")
    assert minus.opacity == 0  # heights on the web: 0 at the back of the bottom angles
    st.choose_part("cover_bottom_1")
    st.set_mode("hole")
    assert minus.opacity == 1 and not minus.disabled  # across the member: x from - to +
    d.tap(minus)
    type_on(d, "120")
    assert st.ids.pad.text == "-120"


def test_correct_and_withdraw_keep_the_history_and_change_the_result(field, tmp_path):
    d = field()
    app = d.app
    st = web_survey(d, "Fixes")
    for v in ("9.0", "9.2", "9.1"):
        enter_reading(d, v)
    d.until(lambda: app.result is not None and app.result.seq == app.seq, timeout=10)
    loss_before = app.result.station_result.part_loss["web"]
    st.set_mode("list")
    d.pump(0.1)
    rows = list(reversed(st.ids.entries.children))
    assert [r.text.split(" =")[0] for r in rows] == ["r1", "r2", "r3"]
    d.tap(rows[1].ids.edit)  # r2: one tap opens it on the pad with its value
    pad = st.ids.pad
    assert st.mode == "reading" and pad.text == "9.2" and "Correct reading r2" in pad.title
    d.tap(pad.ids.clear_btn)
    type_on(d, "6")
    d.tap(key(d, "Enter"))
    assert app.confirm.text == "Change reading r2 on web at S1 from 9.2 to 6 mm?"
    assert [v for _, v in stored(d)] == [9.0, 9.2, 9.1]  # asked first
    answer(d)
    assert [v for _, v in stored(d)] == [9.0, 6.0, 9.1]
    d.until(lambda: app.result is not None and app.result.seq == app.seq, timeout=10)
    loss_fixed = app.result.station_result.part_loss["web"]
    assert loss_fixed > loss_before  # the mean went down: more loss
    st.set_mode("list")
    d.pump(0.1)
    rows = list(reversed(st.ids.entries.children))
    d.tap(rows[0].ids.withdraw)  # r1
    assert app.confirm.text.startswith("Withdraw r1 = 9 mm, web at station S1?")
    answer(d)
    assert [r for r, _ in stored(d)] == ["r2", "r3"]
    d.until(lambda: app.result is not None and app.result.seq == app.seq, timeout=10)
    assert app.result.station_result.part_loss["web"] != loss_fixed
    h = [e for e in app.session.store.history() if e.kind == "reading" and e.action != "add"]
    assert [
        (e.action, e.entity, e.field, e.old if e.field != "*" else e.old["value"]) for e in h
    ] == [
        ("update", "r2", "value", 9.2),
        ("delete", "r1", "*", 9.0),
    ]
    assert all(e.who == app.session.who and e.device == app.session.store.device for e in h)
    assert h[0].new == 6.0 and h[0].at


def test_a_band_goes_with_its_readings_and_comes_back_with_undo(field, tmp_path):
    d = field()
    app = d.app
    st = web_survey(d, "Band")
    s = app.session
    s.add_band("web", "100", "200", "")
    st.refresh()
    st.region = "b1"
    enter_reading(d, "7.5")
    assert [(r.region, r.value) for r in s.station().readings] == [("b1", 7.5)]
    st.set_mode("list")
    d.pump(0.1)
    band_row = next(r for r in st.ids.entries.children if r.text.startswith("loss band b1"))
    d.tap(band_row.ids.withdraw)
    assert "and the 1 reading(s) taken on it" in app.confirm.text
    answer(d)
    assert s.station().bands == [] and s.station().readings == []
    d.tap(app.root.ids.undo)
    assert app.confirm.text.startswith("Undo the withdrawal of reading r1 = 7.5 mm on web band b1")
    answer(d)
    assert [b.id for b in s.station().bands] == ["b1"] and len(s.station().readings) == 1


def test_undo_never_leaves_a_survey_without_a_member_or_a_screen_without_work(field, tmp_path):
    d = field()
    app = d.app
    new_survey(d, "Undo all")
    d.tap(nav(d, "station"))
    d.tap(app.root.ids.undo)
    assert app.confirm.text == "Undo station S1 at 7.5 m?"
    answer(d)
    # the station is gone: the app is on the Member screen, where a station can be added
    assert app.session.station_ids() == [] and app.screen == "member"
    assert not d.screen("member").ids.add_station.disabled
    d.tap(app.root.ids.undo)
    assert app.confirm.text.startswith("Cannot undo member G1")
    assert "last member of the survey" in app.confirm.text and app.confirm.yes_text == ""
    answer(d, yes=False)  # "OK"
    assert [m.id for m in app.session.store.to_survey().members] == ["G1"]
    d.tap(nav(d, "station"))
    assert app.screen == "member"  # no station: the Member screen, never an empty one


def test_undo_on_this_tablet_never_touches_another_tablets_entry(field, tmp_path):
    d = field()
    app = d.app
    st = web_survey(d, "Two tablets")
    enter_reading(d, "9.3")  # r1 by this app
    other = FieldStore.open(app.session.path, device="tablet-B")
    other.add_reading("G1", "S1", {"part": "web", "value": 9.1, "unit": "mm"}, "bea")  # r2
    d.tap(app.root.ids.undo)
    assert app.confirm.text == "Undo reading r1 = 9.3 mm on web at S1?"  # not bea's r2
    answer(d)
    assert stored(d) == [("r2", 9.1)]
    # bea corrects this app's next reading: undoing it would undo her work: refused
    enter_reading(d, "9.4")  # r3
    other.update_reading("G1", "S1", "r3", {"value": 9.0}, "bea")
    d.tap(app.root.ids.undo)
    assert "changed since by bea on device tablet-B" in app.confirm.text
    answer(d, yes=False)
    assert stored(d) == [("r2", 9.1), ("r3", 9.0)]
    other.close()
    assert st.part == "web"


def test_the_report_shows_values_stored_as_read_and_every_correction(tmp_path):
    """Through the session (no screen needed) into the PDF report's text."""
    from pypdf import PdfReader

    from core.cli import main as cli
    from fieldapp.places import PlaceBook
    from fieldapp.session import Session

    s = Session.from_template(tmp_path, PlaceBook(tmp_path), "Report", "si")
    s.select(station="S1")
    for v in ("8.0", "8.2", "8.1"):
        s.add_reading("web", v)
    held = s.holds("web", None, "80")
    s.add_reading("web", "80", held=held)
    s.correct_reading("r2", "7.9")
    s.withdraw("reading", "r3")
    path = s.path
    s.close()
    out = tmp_path / "r.pdf"
    assert cli(["report", str(path), "-o", str(out)]) == 0
    text = " ".join(p.extract_text() for p in PdfReader(out).pages)
    text = " ".join(text.split())
    assert "Readings stored as read although the entry check held them" in text
    assert "reading r4 = 80 mm" in text and "above the nominal 10 mm" in text
    assert "Corrections, withdrawals and undos of entries" in text
    assert "reading / G1 / S1 / r2 / value" in text and "8.2 → 7.9" in text
