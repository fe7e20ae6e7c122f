"""What is left to measure, on the Station screen, and stations in position order (the real
app, real touches). The count of three readings per region is common practice, no source
(core.survey.readings.MIN_READINGS)."""

from __future__ import annotations

import pytest

from core.survey.readings import MIN_READINGS
from tests.app.helpers import enter_reading, nav, new_survey, station, tap_part

pytestmark = pytest.mark.gui


def test_the_station_says_what_is_left_and_counts_down(field):
    d = field()
    new_survey(d, "Left to do")
    d.tap(nav(d, "station"))
    st = station(d)
    assert "Left to measure here: no part read yet." in st.ids.stats.text
    tap_part(d, "web")
    assert f"web: no readings yet ({MIN_READINGS} expected)" in st.ids.stats.text
    enter_reading(d, "9.5")
    enter_reading(d, "9.4")
    assert f"web: 2 reading(s) ({MIN_READINGS} expected)" in st.ids.stats.text
    enter_reading(d, "9.6")
    assert "expected" not in st.ids.stats.text and "web: 3 reading(s)" in st.ids.stats.text
    st.close_pad()
    d.pump(0.1)
    text = st.ids.stats.text
    assert text.startswith("Tap a part. Left to measure here: ")
    assert "web (" not in text  # the web has its readings
    assert "(not read)" in text and "more." in text
    d.shot("station-left-to-measure")


def test_next_follows_the_stations_along_the_span(field):
    d = field()
    new_survey(d, "Order")
    s = d.app.session
    first = s.station_id
    x0 = s.station().position
    s.add_station("far", str(x0 + 4.0))
    s.add_station("near", str(x0 + 1.0))
    s.select(station=first)
    d.tap(nav(d, "station"))
    st = station(d)
    seen = []
    for _ in range(3):
        d.tap(st.ids.next)
        seen.append(s.station_id)
    assert seen == ["near", "far", first]  # along the span, then back to the start
    assert s.station_ids() == [first, "near", "far"]
    d.tap(nav(d, "member"))
    d.pump(0.1)
    buttons = list(reversed(d.screen("member").ids.stations.children))
    assert [b.text.split(" at ")[0] for b in buttons] == [first, "near", "far"]
