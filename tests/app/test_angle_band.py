"""A loss band on an angle leg entered on the Station screen (the real app, real touches):
the leg is the one tapped above the pad; without a leg the app says what to tap and keeps
what was typed. Properties of the app's own rules; the geometry is checked in tests/engine."""

from __future__ import annotations

import pytest

from tests.app.helpers import key, nav, new_survey, station, tap_part, type_on

pytestmark = pytest.mark.gui


def _tap_text(d, box, text):
    d.tap(next(b for b in box.children if b.text == text))


def _enter(d, text):
    type_on(d, text)
    d.tap(key(d, "Enter"))


def test_a_band_on_the_vertical_leg_of_a_bottom_angle(field):
    d = field()
    app = d.app
    new_survey(d, "Leg band")
    d.tap(nav(d, "station"))
    st = station(d)
    tap_part(d, "angle_bl")
    d.tap(next(b for b in st.ids.tabs.children if b.text == "Band"))
    assert st.mode == "band"
    assert "tap the leg the band lies on" in st.ids.stats.text
    lo, hi = app.session.definition().part("angle_bl").leg_range("v")
    # without a leg: nothing stored, the status line says what to tap, the form is kept
    _enter(d, f"{hi - 30:g}")
    _enter(d, f"{hi:g}")
    _enter(d, "5")
    assert app.session.station().bands == []
    assert "lies on one leg" in app.status and st.form.get("lo") == f"{hi - 30:g}"
    _tap_text(d, st.ids.regions, "vertical leg")
    assert f"a band lies from {lo:.4g} to {hi:.4g} mm" in st.ids.stats.text
    st.pick_field("t")
    d.tap(st.ids.pad.ids.clear_btn)
    _enter(d, "5")
    bands = app.session.station().bands
    assert [(b.part, b.leg, b.lo, b.hi, b.t) for b in bands] == [
        ("angle_bl", "v", hi - 30, hi, 5.0)
    ]
    d.shot("station-leg-band")
