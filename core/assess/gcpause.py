"""The cyclic garbage collector held off while an assessment runs, and put back after.

An assessment makes many small objects that all live until its result is returned (the
results keep them), so the collector's passes over the growing heap find nothing to free
and cost a fifth of the time of a large survey. Reference counting still frees everything
else at once; the collector runs again as soon as the last assessment in the process ends.

No setting is left behind: the collector's state before the first assessment that paused
it is restored when the last one ends (a counter under a lock, so assessments in two
threads, the app's worker and a test, neither restore too early nor leave it off).
"""

from __future__ import annotations

import gc
import threading
from collections.abc import Iterator
from contextlib import contextmanager

_lock = threading.Lock()
_depth = 0
_was_enabled = False


@contextmanager
def collector_paused() -> Iterator[None]:
    """Hold off the cyclic collector for the block; restore its state after the last one."""
    global _depth, _was_enabled
    with _lock:
        if _depth == 0:
            _was_enabled = gc.isenabled()
            gc.disable()
        _depth += 1
    try:
        yield
    finally:
        with _lock:
            _depth -= 1
            if _depth == 0 and _was_enabled:
                gc.enable()
