"""Live results: core.assess on a snapshot, off the UI thread (no kivy here).

The UI thread takes a :class:`fieldapp.session.Snapshot` (numbered by a sequence number)
after each entry and hands it to :class:`ResultsWorker`. One worker thread assesses only
the newest snapshot waiting (older ones are skipped) and calls ``post(seq, result, error)``
from the worker thread; the app forwards that to the UI thread (``Clock.schedule_once``)
and discards any result whose number is not the newest it asked for.
"""

from __future__ import annotations

import threading
import time
from collections.abc import Callable
from dataclasses import dataclass

from core.assess import AssessOptions, StationResult, assess, options_from_dict
from fieldapp.session import Snapshot


@dataclass(frozen=True)
class LiveResult:
    """core's result for the station of a snapshot, and how long core took (s)."""

    seq: int
    member: str
    station: str
    station_result: StationResult
    unit_system: str
    standard_title: str
    seconds: float
    measure_symbol: str = "RF"


Post = Callable[[int, LiveResult | None, str], None]


class ResultsWorker:
    """A daemon thread running core.assess on the newest snapshot handed to it."""

    def __init__(self, post: Post, options: AssessOptions | None = None) -> None:
        self._post = post
        self._options = options  # None: the survey's own options
        self._cv = threading.Condition()
        self._pending: Snapshot | None = None
        self._stopped = False
        self._thread = threading.Thread(target=self._run, name="asfound-results", daemon=True)
        self._thread.start()

    def submit(self, snap: Snapshot) -> None:
        """Queue ``snap``, replacing any snapshot still waiting."""
        with self._cv:
            self._pending = snap
            self._cv.notify()

    def stop(self) -> None:
        with self._cv:
            self._stopped = True
            self._cv.notify()
        self._thread.join(timeout=2.0)

    def _run(self) -> None:
        while True:
            with self._cv:
                while self._pending is None and not self._stopped:
                    self._cv.wait()
                if self._stopped:
                    return
                snap, self._pending = self._pending, None
            self._assess(snap)

    def _assess(self, snap: Snapshot) -> None:
        t0 = time.perf_counter()
        try:
            opts = self._options or options_from_dict(snap.survey.survey.options or {})
            a = assess(snap.survey, opts)
            sr = a.members[0].stations[0]
        except Exception as e:  # any error of the survey is shown, never raised in a thread
            self._post(snap.seq, None, str(e))
            return
        res = LiveResult(
            snap.seq,
            snap.member,
            snap.station,
            sr,
            a.unit_system,
            a.standard_title,
            time.perf_counter() - t0,
            a.family.measure.symbol,
        )
        self._post(snap.seq, res, "")
