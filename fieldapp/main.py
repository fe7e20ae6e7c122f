"""Start the field app: ``asfound-field [--dir FOLDER] [--survey STORE]`` or
``python -m fieldapp``.

``--dir`` (or the environment variable ``ASFOUND_FIELD_DIR``) chooses the folder of the
surveys; ``--survey`` opens one store at start. Without ``--survey`` the app resumes the
survey, member, station and screen where work stopped.
"""

from __future__ import annotations

import argparse
import os
import sys
from pathlib import Path

from fieldapp.places import ENV_DIR, survey_folder


def build_parser() -> argparse.ArgumentParser:
    p = argparse.ArgumentParser(
        prog="asfound-field",
        description="asfound field app: record section loss and rivet states on site.",
    )
    p.add_argument(
        "--dir",
        metavar="FOLDER",
        help=f"folder of the surveys (default: ${ENV_DIR} or a per-user data folder)",
    )
    p.add_argument("--survey", metavar="STORE", help="open this field store at start")
    return p


def headless_env(home: Path, **more: str) -> dict[str, str]:
    """Environment for running the app in a child process without a screen (tests and
    benchmarks): kivy's home and Mesa's cache under ``home``, no kivy logs, SDL's offscreen
    driver when there is no display, and this checkout on the path."""
    env = dict(os.environ)
    env.update(
        KIVY_HOME=str(home / "kivy"),
        KIVY_NO_ARGS="1",
        KIVY_NO_CONSOLELOG="1",
        KIVY_NO_FILELOG="1",
        KIVY_WINDOW="sdl2",
        XDG_CACHE_HOME=str(home / "cache"),
        PYTHONPATH=str(Path(__file__).resolve().parents[1]),
        **more,
    )
    if not env.get("DISPLAY"):
        env["SDL_VIDEODRIVER"] = "offscreen"
    (home / "kivy").mkdir(parents=True, exist_ok=True)
    return env


def configure_kivy() -> None:
    """Kivy settings needed before its window exists: our own command line, a tablet-sized
    window, and Escape kept for the pad (it never closes the app)."""
    os.environ.setdefault("KIVY_NO_ARGS", "1")
    os.environ.setdefault("KIVY_CLOCK", "interrupt")  # results from the worker wake the loop
    from kivy.config import Config

    Config.set("kivy", "exit_on_escape", "0")
    Config.set("input", "mouse", "mouse,disable_multitouch")
    Config.set("graphics", "width", os.environ.get("ASFOUND_FIELD_WIDTH", "1280"))
    Config.set("graphics", "height", os.environ.get("ASFOUND_FIELD_HEIGHT", "800"))


def main(argv: list[str] | None = None) -> int:
    args = build_parser().parse_args(argv)
    try:
        folder = survey_folder(args.dir)
    except OSError as e:
        print(f"asfound-field: error: cannot use the folder: {e}", file=sys.stderr)
        return 2
    survey = Path(args.survey).resolve() if args.survey else None
    if survey is not None and not survey.is_file():
        print(f"asfound-field: error: {survey}: no such field store", file=sys.stderr)
        return 2
    configure_kivy()
    from fieldapp.app import FieldApp
    from fieldapp.hooks import install

    app = FieldApp(folder, survey)
    install(app)
    app.run()
    return 0


if __name__ == "__main__":
    sys.exit(main())
