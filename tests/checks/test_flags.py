"""Flags: levels, thresholds and messages. The default thresholds are asfound's own choices
(common practice, no source); the tests check the grading logic and that each message names
the number and the threshold that drove it."""

import pytest

from core.checks.flags import (
    FlagThresholds,
    Level,
    flag_capacity_ratio,
    flag_not_applicable,
    flag_rating_factor,
    flag_rivet_line,
    flag_section_loss,
    flag_utilisation,
    worst,
)
from core.errors import InputError


def test_levels_ordered_with_labels():
    assert Level.OK < Level.WATCH < Level.REVIEW < Level.URGENT
    assert Level.URGENT.label == "needs immediate attention"
    assert Level.OK.label == "within limits"


@pytest.mark.parametrize(
    ("loss", "level", "threshold"),
    [(5, Level.OK, 10), (10, Level.WATCH, 10), (30, Level.REVIEW, 25), (60, Level.URGENT, 50)],
)
def test_section_loss(loss, level, threshold):
    f = flag_section_loss("web at station 3", loss)
    assert f.level == level and f.threshold == threshold and f.value == loss
    assert f"{loss:g} %" in f.message and f"{threshold:g} %" in f.message


def test_capacity_ratio_and_rf_fall():
    assert flag_capacity_ratio("shear", 0.99).level == Level.OK
    f = flag_capacity_ratio("shear", 0.8)
    assert f.level == Level.REVIEW and "0.8" in f.message and "0.85" in f.message
    assert flag_capacity_ratio("shear", 0.5).level == Level.URGENT
    f = flag_rating_factor("girder G2", 0.95)
    assert f.level == Level.REVIEW and "0.95" in f.message and "threshold 1" in f.message
    assert flag_rating_factor("girder G2", 1.1).level == Level.WATCH


def test_engineer_thresholds():
    th = FlagThresholds(loss_watch=5, loss_review=15, loss_urgent=30)
    assert flag_section_loss("web", 20, th).level == Level.REVIEW
    with pytest.raises(InputError, match="watch 30, review 15, urgent 40"):
        FlagThresholds(loss_watch=30, loss_review=15, loss_urgent=40)
    with pytest.raises(InputError, match=r"ratio: watch 0\.8, review 0\.85"):
        FlagThresholds(ratio_watch=0.8)


def test_rivet_line_flags():
    flags = flag_rivet_line("top web line", n_ineffective=4, longest_gap=300, pitch=100)
    assert [f.level for f in flags] == [Level.REVIEW, Level.REVIEW]
    assert "ineffective rivets 4" in flags[0].message
    assert "longest gap / pitch 3" in flags[1].message and "2.5" in flags[1].message
    flags = flag_rivet_line("top web line", n_ineffective=9, longest_gap=None, pitch=100)
    assert worst(flags) == Level.URGENT and "no effective load path" in flags[-1].message


def test_utilisation_and_not_applicable():
    # demand / capacity: above 1.0 urgent, above 0.9 review, above 0.75 watch (asfound
    # defaults, common practice, no source); exactly 1.0 is not above the limit
    assert flag_utilisation("rivet", 1.2).level == Level.URGENT
    assert flag_utilisation("rivet", 1.0).level == Level.REVIEW
    assert flag_utilisation("rivet", 0.8).level == Level.WATCH
    assert flag_utilisation("rivet", 0.5).level == Level.OK
    f = flag_utilisation("rivet", 1.05, what="demand / capacity")
    assert (
        "demand / capacity 1.05 is above the 'needs immediate attention' threshold 1" in f.message
    )
    f = flag_not_applicable("station 7", "web perforated")
    assert f.level == Level.REVIEW and "web perforated" in f.message
    assert worst([]) == Level.OK


def test_bad_values():
    with pytest.raises(InputError, match="section loss 120 %"):
        flag_section_loss("web", 120)
    with pytest.raises(InputError, match="rating factor = nan"):
        flag_rating_factor("g", float("nan"))
