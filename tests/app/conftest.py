"""Drive the real field app without a screen (kivy's offscreen SDL driver, or Xvfb).

The environment is set here, before kivy is imported anywhere: kivy's home, caches and
logs go to a temporary folder, kivy leaves the command line alone, and SDL renders
offscreen (EGL, Mesa) when no display is set.
"""

from __future__ import annotations

import os
import tempfile
from pathlib import Path

_TMP = Path(tempfile.mkdtemp(prefix="asfound-kivy-"))
os.environ.setdefault("KIVY_HOME", str(_TMP / "kivy"))
os.environ["KIVY_NO_ARGS"] = "1"
os.environ["KIVY_NO_CONSOLELOG"] = "1"
os.environ["KIVY_NO_FILELOG"] = "1"
os.environ["KIVY_WINDOW"] = "sdl2"
os.environ.setdefault("XDG_CACHE_HOME", str(_TMP / "cache"))
if not os.environ.get("DISPLAY"):
    os.environ["SDL_VIDEODRIVER"] = "offscreen"
(_TMP / "kivy").mkdir(exist_ok=True)

import time  # noqa: E402

import pytest  # noqa: E402

from fieldapp.main import configure_kivy  # noqa: E402

configure_kivy()

ROOT = Path(__file__).resolve().parents[2]
SAMPLES = ROOT / "survey_samples"
SHOTS = ROOT / "tests" / "_artifacts" / "screens"


class Driver:
    """A running FieldApp advanced frame by frame, with touch helpers."""

    def __init__(self, app) -> None:
        self.app = app

    @property
    def ids(self):
        return self.app.root.ids

    def pump(self, seconds: float = 0.05) -> None:
        from kivy.base import EventLoop

        end = time.perf_counter() + seconds
        while True:
            EventLoop.idle()
            if time.perf_counter() >= end:
                return

    def until(self, cond, timeout: float = 5.0) -> None:
        from kivy.base import EventLoop

        end = time.perf_counter() + timeout
        while not cond():
            if time.perf_counter() > end:
                raise AssertionError("the app did not get there in time")
            EventLoop.idle()

    def tap(self, widget) -> None:
        """A finger down and up on the centre of ``widget`` (window coordinates)."""
        from kivy.tests import UnitTestTouch

        x, y = widget.to_window(*widget.center)
        t = UnitTestTouch(x, y)
        t.touch_down()
        self.pump(0.04)  # a button needs ~35 ms before it lets go
        t.touch_up()
        self.pump(0.01)

    def tap_at(self, x: float, y: float) -> None:
        from kivy.tests import UnitTestTouch

        t = UnitTestTouch(x, y)
        t.touch_down()
        self.pump(0.04)
        t.touch_up()
        self.pump(0.01)

    def screen(self, name: str):
        return self.app.screen_of(name)

    def results_settled(self) -> None:
        app = self.app
        self.until(lambda: app.result is not None or bool(app.result_error), timeout=10.0)

    def shot(self, name: str, window: bool = False) -> Path:
        """Write the app (or, with ``window``, everything on the window, sheets included)
        to tests/_artifacts/screens/<name>.png."""
        from kivy.core.window import Window

        SHOTS.mkdir(parents=True, exist_ok=True)
        self.pump(0.1)
        path = SHOTS / f"{name}.png"
        if window:  # the app and the sheets over it, composed bottom first
            from PIL import Image

            canvas = Image.new("RGBA", (int(Window.width), int(Window.height)), "white")
            for i, w in enumerate(reversed(Window.children)):
                part = path.with_name(f".{path.stem}-{i}.png")
                w.export_to_png(str(part))
                layer = Image.open(part).convert("RGBA")
                canvas.alpha_composite(layer, (0, int(Window.height) - layer.height))
                part.unlink()
            canvas.convert("RGB").save(path)
        else:
            self.app.root.export_to_png(str(path))
        return path


@pytest.fixture
def field(tmp_path):
    """Start the app on an empty survey folder; yields a :class:`Driver`; stops it after."""
    from kivy.base import EventLoop
    from kivy.core.window import Window

    from fieldapp import identity
    from fieldapp.app import FieldApp

    if identity.load() is None:  # asked once per device: this test device has its inspector
        identity.save("Robin Testwell (invented)", "RT")
    EventLoop.ensure_window()
    Window.size = (1280, 800)
    apps = []

    def start(folder: Path | None = None, survey: Path | None = None) -> Driver:
        app = FieldApp(folder or tmp_path, survey)
        app._run_prepare()
        apps.append(app)
        d = Driver(app)
        d.pump(0.1)
        return d

    yield start
    for app in apps:
        stop(app)


def stop(app) -> None:
    """Stop an app started by the fixture without closing kivy's event loop."""
    from kivy.app import App
    from kivy.core.window import Window

    app.dispatch("on_stop")
    if app.root is not None and app.root.parent is not None:
        Window.remove_widget(app.root)
    App._running_app = None
