"""Members, the as-built form and the inspector, driven through the real app with touches.

What must hold (our own rules, no outside source needed): each change reaches core's store
only after its button or Enter, a withdrawal only after its question, a refused value names
itself, its range and its place and leaves the store and the typed text as they were, and
Undo reaches the inspector's own entries (earlier names of the same person included) and
never another person's. Fy by year built: AASHTO Manual for Bridge Evaluation, steel by year
built (from memory; core.checks.material), before 1905 Fy = 26 ksi (179 MPa).
"""

from __future__ import annotations

import pytest

from fieldapp import identity
from tests.app.helpers import answer, enter_reading, key, nav, new_survey, tap_part, type_on

pytestmark = pytest.mark.gui


def sheet_save(d, *texts):
    """Type ``texts`` into the text sheet's fields and tap Save."""
    ts = d.app.text_sheet
    assert ts.is_open, "no text sheet is shown"
    for f, t in zip(ts.inputs, texts, strict=True):
        f.text = t  # the keyboard's work; the test taps the sheet's own button
    d.tap(ts.ids.save)


def reveal_tap(d, w):
    """Scroll the form until ``w`` is in view (as a finger would), then tap it."""
    from kivy.uix.scrollview import ScrollView

    p = w.parent
    while p is not None and not isinstance(p, ScrollView):
        p = p.parent
    if p is not None:
        p.scroll_to(w, padding=20, animate=False)
        d.pump(0.1)
    d.tap(w)


def pad_enter(d, text):
    app = d.app
    assert app.sheet.is_open
    panel = app.sheet.panel
    d.tap(panel.ids.clear_btn)
    type_on(d, text, panel)
    d.tap(key(d, "Enter", panel))


def live_ids(app):
    return [m.id for m in app.session.store.to_survey().members]


def test_members_added_copied_renamed_and_withdrawn_with_a_question(field):
    d = field()
    app = d.app
    new_survey(d)
    member = d.screen("member")
    d.tap(member.acts["New member"])
    sheet_save(d, "")  # empty: the next free id
    assert live_ids(app) == ["G1", "G2"] and app.session.member_id == "G2"
    assert "saved member G2" in app.status

    d.tap(member.acts["Copy"])
    sheet_save(d, "G1")  # a used id is refused, the sheet stays with what was typed
    ts = app.text_sheet
    assert ts.is_open and "'G1' is already used" in ts.message and ts.inputs[0].text == "G1"
    sheet_save(d, "NG")
    assert live_ids(app) == ["G1", "G2", "NG"]
    copied = app.session.member()
    assert copied.label == "copy of G2" and copied.stations == []

    d.tap(member.acts["Rename"])
    sheet_save(d, "g1")  # another member's id (any case) as its name: refused, named
    assert ts.is_open and "already member 'G1'" in ts.message
    assert app.session.member().label == "copy of G2"
    sheet_save(d, "  North   girder ")
    assert not ts.is_open and app.session.member().label == "North girder"
    assert "North girder" in member.ids.title.text

    # withdraw: the question first; Keep it changes nothing; Withdraw does; Undo brings it back
    d.tap(member.acts["Withdraw"])
    assert "Withdraw member NG" in app.confirm.text
    answer(d, yes=False)
    assert live_ids(app) == ["G1", "G2", "NG"]
    d.tap(member.acts["Withdraw"])
    answer(d, yes=True)
    assert live_ids(app) == ["G1", "G2"] and app.session.member_id == "G1"
    assert app.session.store.used_member_ids() == {"G1", "G2", "NG"}
    d.tap(app.root.ids.undo)
    answer(d, yes=True)
    assert live_ids(app) == ["G1", "G2", "NG"]
    d.shot("members-after-undo")


def test_asbuilt_cover_plate_and_year_built_with_the_consequence(field):
    d = field()
    app = d.app
    new_survey(d)
    member = d.screen("member")

    def cover_t():
        return app.session.member().section["girder"]["covers_top"][0][1]

    before = cover_t()
    reveal_tap(d, member.rows[("cover", "top", 0, 1)])
    pad_enter(d, "0")  # refused by core, named with its range; the pad keeps it
    panel = app.sheet.panel
    assert app.sheet.is_open and "covers_top[0] = 0 mm" in panel.message
    assert "0.01" in panel.message and cover_t() == before
    pad_enter(d, "14")
    assert not app.sheet.is_open and cover_t() == 14.0
    assert member.rows[("cover", "top", 0, 1)].value == "14"

    def words():
        return next(
            w.text for w in member.more.children if getattr(w, "text", "").startswith("Fy ")
        )

    assert "lowest default" in words() and "Fy 179 MPa" in words()  # 26 ksi, SI survey
    reveal_tap(d, member.rows[("header", "year_built")])
    pad_enter(d, "18")
    assert "year_built = 18" in panel.message and "1800 to" in panel.message
    assert app.session.header.get("year_built") is None
    pad_enter(d, "1898")
    assert not app.sheet.is_open and app.session.header["year_built"] == 1898
    assert words().startswith("Fy 179 MPa assumed from year built 1898")
    reveal_tap(d, member.rows[("header", "Fy")])
    pad_enter(d, "5000")
    assert "Fy = 5000 MPa is outside 100 to 1000 MPa" in panel.message
    assert app.session.header.get("material") is None
    d.tap(panel.ids.close_btn)
    assert not app.sheet.is_open and app.session.header["year_built"] == 1898

    # the standard family: one tap asks first (the whole survey follows it)
    reveal_tap(d, member.rows[("header", "standard")])
    assert "instead of aashto" in app.confirm.text
    answer(d, yes=False)
    assert app.session.header["standard"] == "aashto"
    reveal_tap(d, member.rows[("header", "standard")])
    answer(d, yes=True)
    assert app.session.header["standard"] == "aisc"
    assert "year built 1898 is not used" in words()

    # a stiffener added on the pad; its Remove button names it as it is (ids keep their case)
    n = len(app.session.member().stiffeners)
    reveal_tap(d, member.rows[("action", "Add a stiffener at ...")])
    pad_enter(d, "5")
    sts = app.session.member().stiffeners
    assert len(sts) == n + 1 and sts[-1].position == 5.0
    removes = [k[1] for k in member.rows if k[0] == "action" and k[1].startswith("Remove st")]
    assert removes == [f"Remove stiffener {x.id}" for x in sts]
    d.shot("asbuilt-after-year", window=True)


def test_inspector_once_corrected_handed_over_undo_is_per_person(field, tmp_path, monkeypatch):
    monkeypatch.setenv("ASFOUND_DATA_DIR", str(tmp_path / "device"))
    (tmp_path / "surveys").mkdir()
    d = field(tmp_path / "surveys")
    app = d.app
    ts = app.text_sheet
    assert ts.is_open and not ts.can_close  # asked once, cannot be skipped
    sheet_save(d, "Ann Smyth (invented)", "AS")
    assert not ts.is_open and identity.load().who == "Ann Smyth (invented) (AS)"
    new_survey(d)
    d.tap(nav(d, "station"))
    tap_part(d, "web")
    enter_reading(d, "8.5")

    # the same person corrects her name: asked, then kept; Undo still reaches her reading
    d.tap(nav(d, "history"))
    hist = d.screen("history")
    d.tap(hist.ids.correct_name)
    assert ts.inputs[0].text == "Ann Smyth (invented)"
    sheet_save(d, "Ann Smith (invented)", "AS")
    assert "instead of Ann Smyth (invented) (AS)" in app.confirm.text
    answer(d, yes=True)
    assert app.session.who == "Ann Smith (invented) (AS)"
    assert app.session.formerly == ("Ann Smyth (invented) (AS)",)
    assert "You are entering as Ann Smith (invented) (AS)" in hist.ids.head.text
    d.tap(nav(d, "station"))
    enter_reading(d, "8.4")
    d.tap(app.root.ids.undo)
    answer(d, yes=True)
    d.tap(app.root.ids.undo)  # the reading made under her earlier name
    answer(d, yes=True)
    assert app.session.station().readings == []

    # another person takes the device: Keep it gives the typed text back, nothing changes
    enter_reading(d, "8.3")
    d.tap(nav(d, "history"))
    d.tap(hist.ids.hand_over)
    assert ts.inputs[0].text == ""
    sheet_save(d, "Ann Smyth (invented)", "AS")  # her own earlier name: not another person
    answer(d, yes=True)
    assert ts.is_open and "that is the same person" in ts.message
    assert app.session.who == "Ann Smith (invented) (AS)"
    sheet_save(d, "Bo Lund (invented)", "BL")
    answer(d, yes=False)
    assert ts.is_open and ts.inputs[0].text == "Bo Lund (invented)"
    sheet_save(d, "Bo Lund (invented)", "BL")
    answer(d, yes=True)
    assert app.session.who == "Bo Lund (invented) (BL)" and app.session.formerly == ()
    d.tap(app.root.ids.undo)  # Ann's reading is not Bo's to undo
    assert not app.confirm.is_open and "nothing of yours to undo" in app.status
    assert [r.value for r in app.session.station().readings] == [8.3]
    d.tap(nav(d, "station"))
    enter_reading(d, "8.2")
    d.tap(app.root.ids.undo)  # his own, yes
    assert "8.2" in app.confirm.text
    answer(d, yes=True)
    assert [r.value for r in app.session.station().readings] == [8.3]

    # History says who made each change
    d.tap(nav(d, "history"))
    texts = [w.text for w in hist.ids.rows.children]
    assert any("8.3" in t and "Ann Smith (invented) (AS)" in t for t in texts)
    assert any("Ann Smyth (invented) (AS)" in t for t in texts)
    d.shot("history-two-inspectors")
