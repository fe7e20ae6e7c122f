"""Where the field app keeps its surveys, and where work stopped (no kivy here).

One SQLite field store per survey (``<survey id>.sqlite``) in a folder chosen by, in
order: the ``--dir`` option, the ``ASFOUND_FIELD_DIR`` environment variable, or a
per-user data folder (``%APPDATA%\\asfound\\field`` on Windows, ``~/Library/Application
Support/asfound/field`` on macOS, ``$XDG_DATA_HOME/asfound/field`` or
``~/.local/share/asfound/field`` elsewhere).

The place where work stopped (last survey, member, station and screen) is a small JSON
file in the same folder, written atomically (temporary file, fsync, rename).
"""

from __future__ import annotations

import json
import os
import re
import sys
import tempfile
from dataclasses import asdict, dataclass
from pathlib import Path

from core.glossary import STORE_SUFFIX  # the one documented extension of a field store

ENV_DIR = "ASFOUND_FIELD_DIR"
PLACE_FILE = "fieldapp-place.json"


def default_folder() -> Path:
    """The per-user data folder for surveys (not created here)."""
    if sys.platform.startswith("win"):
        base = Path(os.environ.get("APPDATA") or Path.home() / "AppData" / "Roaming")
    elif sys.platform == "darwin":
        base = Path.home() / "Library" / "Application Support"
    else:
        base = Path(os.environ.get("XDG_DATA_HOME") or Path.home() / ".local" / "share")
    return base / "asfound" / "field"


def survey_folder(option: str | None = None, environ: dict | None = None) -> Path:
    """The folder of the surveys: ``--dir``, else ``ASFOUND_FIELD_DIR``, else the default.

    The folder is created if missing.

    Raises:
        OSError: the folder cannot be created.
    """
    env = os.environ if environ is None else environ
    raw = option or env.get(ENV_DIR) or ""
    folder = Path(raw).expanduser() if raw else default_folder()
    folder.mkdir(parents=True, exist_ok=True)
    return folder.resolve()


def store_files(folder: Path) -> list[Path]:
    """The survey stores in ``folder``, most recently changed first."""
    files = [p for p in folder.glob(f"*{STORE_SUFFIX}") if p.is_file()]
    return sorted(files, key=lambda p: p.stat().st_mtime, reverse=True)


def safe_name(text: str) -> str:
    """A file name stem from a survey id (letters, digits, ``-``, ``_`` and ``.`` kept)."""
    stem = re.sub(r"[^A-Za-z0-9._-]+", "-", text.strip()).strip("-.")
    return stem or "survey"


def new_store_path(folder: Path, survey_id: str) -> Path:
    """A store path for ``survey_id`` in ``folder`` that does not exist yet."""
    stem = safe_name(survey_id)
    p = folder / f"{stem}{STORE_SUFFIX}"
    n = 2
    while p.exists():
        p = folder / f"{stem}-{n}{STORE_SUFFIX}"
        n += 1
    return p


@dataclass(frozen=True)
class Place:
    """Where work stopped in one survey."""

    member: str = ""
    station: str = ""
    screen: str = ""


def write_atomic(path: Path, text: str) -> None:
    """Write ``text`` to ``path`` through a temporary file and a rename (never half written)."""
    fd, tmp = tempfile.mkstemp(prefix=f".{path.name}.", suffix=".tmp", dir=path.parent)
    try:
        with os.fdopen(fd, "w", encoding="utf-8") as f:
            f.write(text)
            f.flush()
            os.fsync(f.fileno())
        os.replace(tmp, path)
    except BaseException:
        Path(tmp).unlink(missing_ok=True)
        raise


class PlaceBook:
    """The last survey opened in a folder and the place in each survey."""

    def __init__(self, folder: Path) -> None:
        self.path = folder / PLACE_FILE
        self._data = self._read()

    def _read(self) -> dict:
        try:
            data = json.loads(self.path.read_text(encoding="utf-8"))
        except (OSError, ValueError):
            return {"last": "", "places": {}}
        if not isinstance(data, dict) or not isinstance(data.get("places"), dict):
            return {"last": "", "places": {}}
        return data

    @property
    def last(self) -> Path | None:
        """The store opened last, if it still exists."""
        name = self._data.get("last") or ""
        p = self.path.parent / name if name else None
        return p if p is not None and p.is_file() else None

    def place(self, store: Path) -> Place:
        raw = self._data["places"].get(store.name) or {}
        try:
            return Place(**{k: str(raw.get(k, "")) for k in ("member", "station", "screen")})
        except TypeError:
            return Place()

    def remember(self, store: Path, place: Place) -> None:
        """Record ``place`` in ``store`` as where work stopped (written at once, atomically)."""
        if self._data.get("last") == store.name and self.place(store) == place:
            return
        self._data["last"] = store.name
        self._data["places"][store.name] = asdict(place)
        write_atomic(self.path, json.dumps(self._data, indent=1, sort_keys=True) + "\n")
