"""The identity of this device: a random id made once and kept in the user's asfound folder.

Every change in a field store records who made it and on which device, and undo reverts
only the last change of the same person on the same device. The device id is

* the value of the environment variable ``ASFOUND_DEVICE`` when set (a name an owner
  assigns to a tablet, or a fixed value for scripted runs and tests), else
* the id kept in ``device.json`` in the asfound data folder (``ASFOUND_DATA_DIR``, else
  ``%APPDATA%\\asfound`` on Windows, ``~/Library/Application Support/asfound`` on macOS,
  ``$XDG_DATA_HOME/asfound`` or ``~/.local/share/asfound`` elsewhere), created on first use
  with 128 random bits (``uuid4``, 32 hex digits), so two devices never share one without
  being told to. The field app and the command line of one user on one machine are one
  device (the app keeps its surveys in ``<data folder>/field``).

When the folder cannot be written, a per-process id ``unsaved-<hex>`` is used: undo then
works for the changes of this run only, never for another device's.

A device id is at most :data:`MAX_LEN` characters of letters, digits and ``._:-``; the first
:data:`SHORT` characters are what screens and reports show.
"""

from __future__ import annotations

import datetime as _dt
import json
import os
import re
import sys
import tempfile
import uuid
from functools import lru_cache
from pathlib import Path

from core.errors import InputError

ENV_DEVICE = "ASFOUND_DEVICE"
ENV_DATA = "ASFOUND_DATA_DIR"
DEVICE_FILE = "device.json"
DEVICE_FORMAT = "asfound.device"
MAX_LEN = 64
SHORT = 8
_OK = re.compile(r"^[A-Za-z0-9._:-]{1,64}$")


def data_folder(environ: dict | None = None) -> Path:
    """The per-user asfound data folder (not created here)."""
    env = os.environ if environ is None else environ
    if env.get(ENV_DATA):
        return Path(env[ENV_DATA]).expanduser()
    if sys.platform.startswith("win"):
        base = Path(env.get("APPDATA") or Path.home() / "AppData" / "Roaming")
    elif sys.platform == "darwin":
        base = Path.home() / "Library" / "Application Support"
    else:
        base = Path(env.get("XDG_DATA_HOME") or Path.home() / ".local" / "share")
    return base / "asfound"


def check_device(device: str, where: str = "device id") -> str:
    """``device`` if it is a valid device id.

    Raises:
        InputError: empty, longer than :data:`MAX_LEN` or with other characters.
    """
    if not isinstance(device, str) or not _OK.match(device):
        raise InputError(
            f"device id {device!r} must be 1 to {MAX_LEN} letters, digits or '._:-'",
            where=where,
        )
    return device


def short(device: str) -> str:
    """The part of a device id that screens and reports show."""
    return device[:SHORT]


def _read(path: Path) -> str | None:
    try:
        data = json.loads(path.read_text(encoding="utf-8"))
        return check_device(data["device"]) if data.get("format") == DEVICE_FORMAT else None
    except (OSError, ValueError, KeyError, TypeError, AttributeError, InputError):
        return None


def _create(folder: Path) -> str:
    """Write a new device file; if another process wrote one first, use that one."""
    path = folder / DEVICE_FILE
    device = uuid.uuid4().hex
    text = json.dumps(
        {
            "format": DEVICE_FORMAT,
            "device": device,
            "created": _dt.datetime.now(_dt.UTC).isoformat(timespec="seconds"),
        },
        indent=1,
    )
    folder.mkdir(parents=True, exist_ok=True)
    fd, tmp = tempfile.mkstemp(prefix=".device.", suffix=".tmp", dir=folder)
    try:
        with os.fdopen(fd, "w", encoding="utf-8") as f:
            f.write(text + "\n")
            f.flush()
            os.fsync(f.fileno())
        if path.exists() and _read(path) is None:  # unreadable: kept aside, never lost
            os.replace(path, path.with_name(f"{DEVICE_FILE}.unreadable"))
        try:
            os.link(tmp, path)  # fails if another process made one meanwhile
        except FileExistsError:
            pass
        except OSError:  # a file system without hard links
            if not path.exists():
                os.replace(tmp, path)
    finally:
        Path(tmp).unlink(missing_ok=True)
    return _read(path) or device


@lru_cache(maxsize=8)
def _kept(folder: str) -> str:
    path = Path(folder) / DEVICE_FILE
    found = _read(path)
    if found is not None:
        return found
    try:
        return _create(Path(folder))
    except OSError:
        return f"unsaved-{uuid.uuid4().hex[:24]}"


def this_device(folder: Path | None = None, environ: dict | None = None) -> str:
    """The id of this device (see the module docstring for where it comes from).

    Raises:
        InputError: ``ASFOUND_DEVICE`` is set to something that is not a device id.
    """
    env = os.environ if environ is None else environ
    if env.get(ENV_DEVICE):
        return check_device(env[ENV_DEVICE], f"environment variable {ENV_DEVICE}")
    return _kept(str((folder or data_folder(env)).resolve()))
