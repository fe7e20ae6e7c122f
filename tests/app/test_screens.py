"""Every screen drawn from a real survey, written to tests/_artifacts/screens/ for review."""

from __future__ import annotations

import shutil

import pytest

from fieldapp.session import Session
from tests.app.conftest import SAMPLES

pytestmark = pytest.mark.gui


def test_every_screen_is_drawn_and_written(field, tmp_path):
    d = field()
    app = d.app
    assert app.screen == "surveys"
    assert d.shot("1-surveys").stat().st_size > 10_000
    s = Session.from_sample(tmp_path, app.book, SAMPLES / "deck-girder-si.json")
    app.set_session(s)
    d.results_settled()
    for i, name in enumerate(("member", "station", "rivets", "results"), start=2):
        d.tap(next(w for w in d.ids.values() if False) if False else _nav(d, name))
        assert app.screen == name
        d.results_settled()
        assert d.shot(f"{i}-{name}").stat().st_size > 10_000
    station = d.screen("station")
    station.choose_part("web")
    station.ids.pad.text = "0.4"
    d.pump(0.1)
    d.tap(_nav(d, "station"))
    assert d.shot("6-station-warning").stat().st_size > 10_000
    shutil.rmtree(tmp_path / "exports", ignore_errors=True)


def _nav(d, name):
    bar = d.app.root.children[-1]
    return next(b for b in bar.children if getattr(b, "screen", None) == name)
