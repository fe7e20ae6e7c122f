"""Hooks for tests and benchmarks, switched on by environment variables (off otherwise).

``ASFOUND_FIELD_FEED=N``: once the app shows its first screen, enter N readings on the
current station through the same path as the pad (value typed, then Enter), one after
the result of the previous one is shown. Prints ``ready <s>`` at the first screen,
``ack <reading id>`` as soon as the store has the reading, then ``result <ms> drawn <ms>
entry <ms> core <ms>``: from the Enter key to the new result handed to the screen, and to
the first frame drawn with it; the store write and screen update; core's assessment.
``done`` at the end. The values are near the median of the part's readings (never held by
the reading guard).
``ASFOUND_FIELD_UNDO=1``: after every second reading, press Undo and answer "Undo it" (the
app's own undo path); prints ``undone <reading id>`` once the store has the undo.
``ASFOUND_FIELD_EXIT=1`` stops the app when done (or right after ``ready``).
"""

from __future__ import annotations

import os
import statistics
import sys
import time

from kivy.clock import Clock
from kivy.core.window import Window

from core.units import from_internal

T0 = time.perf_counter()


def say(*words) -> None:
    print(*words, flush=True)
    sys.stdout.flush()


def install(app) -> None:
    """Attach the hooks named by the environment to ``app`` (nothing when unset)."""
    feed = int(os.environ.get("ASFOUND_FIELD_FEED", "0") or 0)
    leave = os.environ.get("ASFOUND_FIELD_EXIT") == "1"
    undo = os.environ.get("ASFOUND_FIELD_UNDO") == "1"
    if not feed and not leave:
        return

    def started(*_a) -> None:  # returns None: a true value would stop on_start
        Clock.schedule_once(lambda _dt: _ready(app, feed, leave, undo), 0)

    app.bind(on_start=started)


def _ready(app, feed: int, leave: bool, undo: bool = False) -> None:
    say(f"ready {time.perf_counter() - T0:.3f}")
    if feed:
        app.feeder = Feeder(app, feed, leave, undo)  # the Clock keeps only weak references
        app.feeder.next()
    elif leave:
        app.stop()


class Feeder:
    """Enters readings one by one on the station screen, as a person at the pad would."""

    def __init__(self, app, n: int, leave: bool, undo: bool = False) -> None:
        self.app, self.n, self.leave, self.i, self.undo = app, n, leave, 0, undo
        self.pressed = 0.0
        self.station = app.screen_of("station")
        if app.screen != "station":
            app.go("station")
        if not self.station.part:
            self.station.choose_part(app.session.definition().parts[0].id)

    def value(self) -> str:
        """A value within 3 % of the median of the part's readings (80 % of nominal when
        there are none): a plausible reading the guard does not hold."""
        s = self.app.session
        part = self.station.part
        mine = [r.mm() for r in s.station().readings if r.part == part and not r.region]
        base = statistics.median(mine) if mine else 0.8 * s.definition().part(part).t
        v = base * (0.97 + 0.006 * (self.i % 10))
        return f"{from_internal(v, 'length', s.length_unit):.3f}"

    def next(self, *_a) -> None:
        """Type the next value (drawn in the frames that follow), then press Enter."""
        if self.i >= self.n:
            say("done")
            if self.leave:
                self.app.stop()
            return
        self.station.ids.pad.text = self.value()
        Clock.schedule_once(self.enter, 0.1)

    def enter(self, *_a) -> None:
        pad = self.station.ids.pad
        seq = self.app.seq
        self.pressed = time.perf_counter()
        pad.commit()
        self.committed = time.perf_counter()
        if self.station.last_saved and self.app.seq > seq:
            say(f"ack {self.station.last_saved}")
        self.i += 1
        self.want = self.app.seq
        Window.bind(on_flip=self._drawn)
        self.late = Clock.schedule_once(self._timeout, 5.0)

    def _answered(self) -> bool:
        app = self.app
        if app.seq != self.want or app.shown_at < self.pressed:
            return False
        return (app.result is not None and app.result.seq == self.want) or bool(app.result_error)

    def _drawn(self, *_a) -> None:
        """Each frame drawn after Enter: the first one showing the new result is reported."""
        if not self._answered():
            return
        Window.unbind(on_flip=self._drawn)
        self.late.cancel()
        now, app, r = time.perf_counter(), self.app, self.app.result
        core = 1000 * r.seconds if r is not None else 0.0
        say(
            f"result {1000 * (app.shown_at - self.pressed):.1f} "
            f"drawn {1000 * (now - self.pressed):.1f} "
            f"entry {1000 * (self.committed - self.pressed):.1f} core {core:.1f}"
        )
        if self.undo and self.i % 2 == 0:
            self.undo_last()
        Clock.schedule_once(self.next, 0)

    def undo_last(self) -> None:
        """Undo through the app: the question, then "Undo it"."""
        app = self.app
        plan, _what = app.session.undo_plan()
        app.undo()
        if app.confirm.is_open and app.confirm.yes_text:
            app.confirm.answer(True)
            if app.status.startswith("undone"):
                say(f"undone {plan.rows[0].entity}")

    def _timeout(self, _dt) -> None:
        Window.unbind(on_flip=self._drawn)
        say("result timeout")
        Clock.schedule_once(self.next, 0)
