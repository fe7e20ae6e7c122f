"""The exact sample standard deviation in integers (``core.survey.stats``) is the very float
the standard library's ``statistics.stdev`` gives (reference: Python's statistics module,
which computes it with exact fractions and one correct rounding), and the quick COV test of
validation never skips a region that ``region_stats`` would note."""

from __future__ import annotations

import statistics

from hypothesis import given
from hypothesis import strategies as st

from core.survey.readings import COV_LIMIT, MIN_READINGS, cov_clearly_within, region_stats
from core.survey.stats import stdev

readings = st.lists(
    st.one_of(
        st.floats(min_value=0.01, max_value=500.0),
        st.sampled_from([6.2, 6.9, 7.2, 9.7, 10.0, 0.1, 0.3]),
        st.integers(1, 500).map(lambda k: k / 10.0),
    ),
    min_size=2,
    max_size=12,
)


@given(readings)
def test_stdev_is_the_standard_librarys_to_the_last_bit(vals: list[float]) -> None:
    assert stdev(vals) == statistics.stdev(vals)


@given(st.floats(min_value=1e-300, max_value=1e300), st.integers(2, 9))
def test_stdev_of_equal_values_is_zero(v: float, n: int) -> None:
    assert stdev([v] * n) == 0.0 == statistics.stdev([v] * n)


def test_stdev_worked_example() -> None:
    # Python's statistics.stdev documentation example: 1.0810874155219827
    assert stdev([1.5, 2.5, 2.5, 2.75, 3.25, 4.75]) == 1.0810874155219827


@given(readings)
def test_quick_cov_test_never_hides_a_note(vals: list[float]) -> None:
    if cov_clearly_within(vals):
        r = region_stats(vals, 500.0, part="web")
        assert r.n >= MIN_READINGS and r.cov is not None and r.cov <= COV_LIMIT
        assert r.notes == ()
