"""The collector is held off during an assessment and its state put back after (a property
that must hold: no global setting left behind)."""

from __future__ import annotations

import gc
import threading

import pytest

from core.assess.gcpause import collector_paused


@pytest.mark.parametrize("before", [True, False])
def test_state_restored(before: bool) -> None:
    was = gc.isenabled()
    try:
        (gc.enable if before else gc.disable)()
        with collector_paused():
            assert not gc.isenabled()
            with collector_paused():
                assert not gc.isenabled()
            assert not gc.isenabled()  # the outer one still runs
        assert gc.isenabled() is before
    finally:
        (gc.enable if was else gc.disable)()


def test_restored_after_an_error() -> None:
    assert gc.isenabled()
    with pytest.raises(ZeroDivisionError), collector_paused():
        1 / 0  # noqa: B018
    assert gc.isenabled()


def test_overlapping_threads_restore_once_both_end() -> None:
    assert gc.isenabled()
    inside, release = threading.Event(), threading.Event()

    def other() -> None:
        with collector_paused():
            inside.set()
            release.wait(5)

    t = threading.Thread(target=other)
    with collector_paused():
        t.start()
        inside.wait(5)
    assert not gc.isenabled()  # the other thread's assessment still runs
    release.set()
    t.join(5)
    assert gc.isenabled()
