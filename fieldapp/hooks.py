"""Hooks for tests and benchmarks, switched on by environment variables (off otherwise).

``ASFOUND_FIELD_FEED=N``: once the app shows its first screen, enter N readings on the
current station through the same path as the pad (value typed, then Enter), one after
the result of the previous one is shown. Prints ``ready <s>`` at the first screen,
``ack <reading id>`` as soon as the store has the reading, then ``result <ms> drawn <ms>
entry <ms> core <ms>``: from the Enter key to the new result handed to the screen, and to
the first frame drawn with it; the store write and screen update; core's assessment.
``done`` at the end.
``ASFOUND_FIELD_EXIT=1`` stops the app when done (or right after ``ready``).
"""

from __future__ import annotations

import os
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
    if not feed and not leave:
        return

    def started(*_a) -> None:  # returns None: a true value would stop on_start
        Clock.schedule_once(lambda _dt: _ready(app, feed, leave), 0)

    app.bind(on_start=started)


def _ready(app, feed: int, leave: bool) -> None:
    say(f"ready {time.perf_counter() - T0:.3f}")
    if feed:
        app.feeder = Feeder(app, feed, leave)  # the Clock keeps only weak references
        app.feeder.next()
    elif leave:
        app.stop()


class Feeder:
    """Enters readings one by one on the station screen, as a person at the pad would."""

    def __init__(self, app, n: int, leave: bool) -> None:
        self.app, self.n, self.leave, self.i = app, n, leave, 0
        self.pressed = 0.0
        self.station = app.screen_of("station")
        if app.screen != "station":
            app.go("station")
        if not self.station.part:
            self.station.choose_part(app.session.definition().parts[0].id)

    def value(self) -> str:
        s = self.app.session
        t = s.definition().part(self.station.part).t
        return f"{from_internal(t * (0.70 + 0.02 * (self.i % 10)), 'length', s.length_unit):.3f}"

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
        Clock.schedule_once(self.next, 0)

    def _timeout(self, _dt) -> None:
        Window.unbind(on_flip=self._drawn)
        say("result timeout")
        Clock.schedule_once(self.next, 0)
