"""Screens drawn from the US sample and the US template (the layout test draws the rest)."""

from __future__ import annotations

import re

import pytest

from fieldapp.session import Session
from tests.app.conftest import SAMPLES
from tests.app.helpers import nav

pytestmark = pytest.mark.gui


def test_template_and_us_survey_screens(field, tmp_path):
    d = field()
    app = d.app
    assert app.screen == "surveys"
    assert d.shot("1-surveys-empty").stat().st_size > 10_000
    app.set_session(Session.from_template(tmp_path, app.book, "Template", "us"))
    d.tap(nav(d, "member"))
    d.results_settled()
    member = d.screen("member")
    assert member.fields["D"][0].text == "Web depth (in)" and member.fields["D"][1].unit == "in"
    d.shot("2-member-template-us")
    app.set_session(Session.from_sample(tmp_path, app.book, SAMPLES / "through-girder-us.json"))
    d.tap(nav(d, "station"))
    d.until(lambda: app.result is not None and app.result.seq == app.seq, timeout=10)
    chips = [c.text for c in reversed(d.screen("station").ids.chips.children)]
    chips = [re.sub(r" -\d+%$", "", c) for c in chips]  # the loss follows the name
    assert chips[:3] == ["web", "top-left flange angle", "top-right flange angle"]  # not ids
    d.shot("3-station-us")
    d.tap(nav(d, "results"))
    assert any("kip" in c.text for c in d.screen("results").ids.table.children)
    d.shot("4-results-us")
    d.tap(nav(d, "surveys"))
    assert len(d.screen("surveys").ids.stores.children) == 2
    d.shot("5-surveys-list")
