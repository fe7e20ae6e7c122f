"""A region's thickness uncertainty: the instrument term and the standard error."""

from __future__ import annotations

import math

import pytest

from core.bands.options import BandOptions
from core.bands.sigma import region_sigma
from core.errors import InputError
from core.survey.readings import region_stats


def test_sigma_combines_tolerance_and_standard_error():
    """sigma^2 = (tol / 2)^2 + s^2 / n (tolerance as 2 sigma, common practice, no source;
    the standard error of the mean s / sqrt(n), any statistics text). Readings 6.2, 6.9,
    6.6 mm: mean 6.5667, s = 0.35119 (by hand: deviations -0.3667, 0.3333, 0.0333)."""
    st = region_stats([6.2, 6.9, 6.6], 10.0, part="web")
    rs = region_sigma(st, ["ultrasonic gauge"] * 3, BandOptions())
    assert rs.tol == 0.1 and rs.sigma_instr == pytest.approx(0.05)
    assert rs.s == pytest.approx(0.351188, rel=1e-5)
    assert rs.se == pytest.approx(0.351188 / math.sqrt(3), rel=1e-5)
    assert rs.sigma == pytest.approx(math.sqrt(0.05**2 + 0.351188**2 / 3), rel=1e-5)
    # three more readings of the same scatter: only the standard error shrinks
    assert rs.sigma_with(3) == pytest.approx(math.sqrt(0.05**2 + 0.351188**2 / 6), rel=1e-5)


def test_caliper_single_reading_and_options():
    st = region_stats([8.0], 10.0, part="cover")
    rs = region_sigma(st, ["Vernier caliper"], BandOptions())
    assert rs.tol == 0.05 and rs.instrument == "caliper"
    # one reading: the default COV 10 % of the reading (common practice, no source)
    assert rs.s_assumed and rs.s == pytest.approx(0.8) and rs.se == pytest.approx(0.8)
    own = BandOptions(tolerance_mm={"ultrasonic": 0.1, "caliper": 0.05, "UT-7": 0.02})
    assert region_sigma(st, ["ut-7"], own).tol == 0.02
    assert region_sigma(st, [""], BandOptions()).tol == 0.1  # none recorded: ultrasonic


@pytest.mark.parametrize(
    ("kw", "match"),
    [
        ({"method": "guess"}, "method"),
        ({"samples": 5}, "20 to 100000"),
        ({"tolerance_mm": {"ultrasonic": -1.0}}, "0 to 5 mm"),
        ({"cov_single": 2.0}, "0 to 1"),
        ({"default_instrument": "laser"}, "no tolerance"),
        ({"more": 0}, "1 to 100"),
    ],
)
def test_bad_options_are_named(kw, match):
    with pytest.raises(InputError, match=match):
        BandOptions(**kw)
