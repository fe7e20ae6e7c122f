"""Every screen drawn from real surveys, written to tests/_artifacts/screens/ for review."""

from __future__ import annotations

import pytest

from fieldapp.session import Session
from tests.app.conftest import SAMPLES

pytestmark = pytest.mark.gui


def nav(d, name):
    bar = d.app.root.children[-1]
    return next(b for b in bar.children if getattr(b, "screen", None) == name)


def test_every_screen_is_drawn_and_written(field, tmp_path):
    d = field()
    app = d.app
    assert app.screen == "surveys"
    assert d.shot("1-surveys").stat().st_size > 10_000
    app.set_session(Session.from_sample(tmp_path, app.book, SAMPLES / "deck-girder-si.json"))
    d.results_settled()
    for i, name in enumerate(("member", "station", "rivets", "results"), start=2):
        d.tap(nav(d, name))
        assert app.screen == name
        d.until(lambda: app.result is not None and app.result.seq == app.seq, timeout=10)
        assert d.shot(f"{i}-{name}").stat().st_size > 10_000
    station = d.screen("station")
    d.tap(nav(d, "station"))
    station.choose_part("angle_bl")
    station.ids.pad.text = "0.4"
    d.pump(0.1)
    assert "unit slip" in station.ids.warning.text
    assert d.shot("6-station-warning").stat().st_size > 10_000
    station.choose_part("web")
    station.set_mode("band")
    assert d.shot("6b-station-band").stat().st_size > 10_000
    station.set_mode("notes")
    assert d.shot("6c-station-notes").stat().st_size > 10_000


def test_template_and_us_survey_screens(field, tmp_path):
    d = field()
    app = d.app
    app.set_session(Session.from_template(tmp_path, app.book, "Template", "us"))
    d.tap(nav(d, "member"))
    d.results_settled()
    assert "in)" in d.screen("member").fields["D"][0].text
    d.shot("8-member-template-us")
    app.set_session(Session.from_sample(tmp_path, app.book, SAMPLES / "through-girder-us.json"))
    d.tap(nav(d, "station"))
    d.until(lambda: app.result is not None and app.result.seq == app.seq, timeout=10)
    d.shot("9-station-us")
    d.tap(nav(d, "results"))
    assert any("kip" in c.text for c in d.screen("results").ids.table.children)
    d.shot("10-results-us")
    d.tap(nav(d, "surveys"))
    assert len(d.screen("surveys").ids.stores.children) == 2
    d.shot("11-surveys-list")
