"""Loss rates of one part region (checked by hand; ordinary least squares as in any
statistics text, e.g. the slope b = Sxy / Sxx and SE(b) = sqrt(SSE / (n - 2) / Sxx))."""

from __future__ import annotations

import itertools
import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from core.checks.flags import FlagThresholds
from core.trend.crossing import ALREADY, BEYOND, CROSSES, ENDED, first_crossing, targets
from core.trend.errors import TrendError
from core.trend.rates import Rate, fit_linear, fit_power


def test_least_squares_rate_and_standard_error_by_hand():
    # years 2010, 2015, 2020; t = 10.0, 9.5, 9.2 mm. By hand: ybar = 2015, Sxx = 50,
    # Sxy = (-5)(0) + 0(-0.5) + 5(-0.8) = -4 (differences from the first thickness),
    # b = -0.08 mm/year, so r = 0.08 mm/year. Residuals 1/30, -2/30, 1/30 mm,
    # SSE = 6/900 = 0.0066667, SE = sqrt(0.0066667 / 1 / 50) = 0.0115470 mm/year.
    r = fit_linear([2010.0, 2015.0, 2020.0], [10.0, 9.5, 9.2])
    assert r.method == "least squares" and r.n == 3
    assert r.r == pytest.approx(0.08, rel=1e-12)
    assert r.se == pytest.approx(0.0115470, rel=1e-5)
    assert r.has_band
    # 10 years on: 0.8 mm further loss; one SE faster: 10 (0.08 + 0.011547) = 0.91547 mm
    assert r.loss(10.0) == pytest.approx(0.8)
    assert r.loss(10.0, "fast") == pytest.approx(0.91547, rel=1e-5)
    assert r.loss(10.0, "slow") == pytest.approx(0.68453, rel=1e-5)


def test_two_surveys_give_the_difference_quotient():
    # (10.0 - 9.4) mm / (2019.5 - 2013.5) years = 0.1 mm/year, no standard error
    r = fit_linear([2013.5, 2019.5], [10.0, 9.4])
    assert r.method == "difference quotient"
    assert r.r == pytest.approx(0.1, rel=1e-12)
    assert r.se is None and not r.has_band
    assert "difference over the interval" in r.note
    assert r.loss(5.0, "fast") == r.loss(5.0) == pytest.approx(0.5)


def test_thickening_projects_no_further_loss():
    r = fit_linear([2010.0, 2016.0], [9.0, 9.3])
    assert r.r == pytest.approx(-0.05)
    assert r.loss(20.0) == 0.0
    assert "thickening" in r.note


def test_power_law_gives_back_A_with_B_fixed():
    # d = 0.3 tau^0.5 mm from 1920: at 1996 (tau 76) d = 2.6153, at 2020 (tau 100) d = 3.0
    years, y0, A, B = [1996.0, 2020.0], 1920.0, 0.3, 0.5
    t = [12.0 - A * (y - y0) ** B for y in years]
    r = fit_power(years, t, 12.0, y0=y0, B=B)
    assert pytest.approx(A, rel=1e-12) == r.A and r.se_A == pytest.approx(0.0, abs=1e-12)
    # rate at 2020: dd/dt = A B tau^(B-1) = 0.3 * 0.5 / 10 = 0.015 mm/year
    assert r.r == pytest.approx(0.015, rel=1e-12)
    # 21 years on: 0.3 (sqrt(121) - sqrt(100)) = 0.3 mm
    assert r.loss(21.0) == pytest.approx(0.3, rel=1e-12)


def test_bad_values_raise_trend_errors():
    with pytest.raises(TrendError, match="rise strictly"):
        fit_linear([2015.0, 2015.0], [9.0, 8.9])
    with pytest.raises(TrendError, match="not finite"):
        fit_linear([2015.0, math.nan], [9.0, 8.9])
    with pytest.raises(TrendError, match="exponent"):
        fit_power([2015.0, 2020.0], [9.0, 8.9], 10.0, y0=1900.0, B=0.0)
    with pytest.raises(TrendError, match="before the first survey"):
        fit_power([2015.0, 2020.0], [9.0, 8.9], 10.0, y0=2016.0)
    with pytest.raises(TrendError, match="years ahead"):
        Rate("linear", "least squares", 3, 2020.0, 0.1, 0.01).loss(-1.0)


def test_crossing_interpolated_between_engine_runs_by_hand():
    # RF 1.3, 1.1, 0.9 at 0, 5, 10 years: RF = 1 at 5 + (1 - 1.1) / (0.9 - 1.1) * 5 = 7.5
    status, dt = first_crossing([0, 5, 10], [1.3, 1.1, 0.9], 1.0, True)
    assert status == CROSSES and dt == pytest.approx(7.5, rel=1e-12)
    # a utilisation 0.6, 0.8, 1.2: U = 1 at 5 + (1 - 0.8) / 0.4 * 5 = 7.5
    status, dt = first_crossing([0, 5, 10], [0.6, 0.8, 1.2], 1.0, False)
    assert status == CROSSES and dt == pytest.approx(7.5, rel=1e-12)
    assert first_crossing([0, 5], [0.9, 0.8], 1.0, True) == (ALREADY, 0.0)
    assert first_crossing([0, 5], [1.3, 1.2], 1.0, True) == (BEYOND, None)
    assert first_crossing([0, 5], [1.3, None], 1.0, True) == (ENDED, 0)
    assert first_crossing([0, 5], [1.3, 1.2], 1.0, True, ended=True) == (ENDED, 5)


def test_targets_are_one_and_the_flag_thresholds():
    th = FlagThresholds()  # asfound defaults: RF watch 1.2, review 1.0, urgent 0.7
    rf = targets("RF", th)
    assert [t.value for t in rf] == [1.2, 1.0, 0.7]
    assert "RF = 1" in rf[1].label and "engineer to review" in rf[1].label
    u = targets("U", th)  # utilisation watch 0.75, review 0.9, urgent 1.0
    assert [t.value for t in u] == [0.75, 0.9, 1.0]


years_st = (
    st.lists(st.floats(1900.0, 2100.0, allow_nan=False), min_size=2, max_size=8, unique=True)
    .map(sorted)
    .filter(lambda ys: min(b - a for a, b in itertools.pairwise(ys)) > 0.01)
)


@given(years_st, st.floats(0.5, 60.0, allow_nan=False))
@settings(max_examples=200, deadline=None)
def test_no_further_loss_gives_rate_zero_and_no_crossing(years, t):
    """Property: the same thickness at every date gives rate 0 (exactly), no standard error
    of any size, no further loss, and a constant measure never crosses a target."""
    r = fit_linear(years, [t] * len(years))
    assert r.r == 0.0
    assert r.se in (None, 0.0)
    assert r.loss(100.0) == 0.0 and r.loss(100.0, "fast") == 0.0
    dts = [0.0, 5.0, 10.0]
    assert first_crossing(dts, [1.5] * 3, 1.0, True) == (BEYOND, None)
    assert first_crossing(dts, [0.5] * 3, 1.0, False) == (BEYOND, None)


def test_a_value_at_its_threshold_counts_as_the_flags_count_it():
    """The trend's crossings agree with the flag grading (core.checks.flags._grade: a
    utilisation at or above a threshold is flagged, a rating factor only below it), so a
    station already flagged at the latest survey reads "already" (property, no source)."""
    assert first_crossing([0, 5], [1.0, 1.1], 1.0, False) == (ALREADY, 0.0)
    assert first_crossing([0, 5], [1.0, 1.1], 1.0, True)[0] == BEYOND


def test_the_band_is_named_when_only_the_fast_rate_crosses():
    """A central projection that stays within the horizon while the fast rate (one standard
    error faster) crosses must not read as safe: the earliest year is given too."""
    from types import SimpleNamespace

    from core.trend.crossing import Crossing, Target
    from core.trend.export import crossing_words

    r = SimpleNamespace(y_last=2025.0, horizon=50.0)
    t = Target(1.0, "RF = 1")
    c = Crossing(t, BEYOND, None, dt_early=36.0, status_early=CROSSES)
    assert crossing_words(r, c) == "after 2075 (earliest 2061.0)"
    c = Crossing(t, ENDED, 20.0, dt_early=0.0, status_early=ALREADY)
    assert crossing_words(r, c) == "not before 2045 (earliest: already)"
    assert crossing_words(r, Crossing(t, BEYOND, None, status_early=BEYOND)) == "after 2075"
