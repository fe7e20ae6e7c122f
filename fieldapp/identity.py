"""Who is entering: the inspector's name and initials, asked once per device.

Kept in ``inspector.json`` in the asfound data folder, beside ``device.json``
(:func:`core.survey.device.data_folder`), never taken from the operating system's login.
Every entry of the field store carries :attr:`Inspector.who`, and the edit history shows it.
No kivy here.
"""

from __future__ import annotations

import json
import re
from dataclasses import dataclass
from pathlib import Path

from core.errors import InputError
from core.outputs import write_atomic
from core.survey.device import data_folder

INSPECTOR_FILE = "inspector.json"
INSPECTOR_FORMAT = "asfound.inspector"
NAME_MAX = 60
INITIALS_MAX = 5
_INITIALS = re.compile(r"^[A-Za-z][A-Za-z.\-]{0,4}$")


@dataclass(frozen=True)
class Inspector:
    """The person using this device.

    Raises:
        InputError: an empty or too long name; initials that are not 1 to 5 letters
        (dots and hyphens allowed after the first).
    """

    name: str
    initials: str

    def __post_init__(self) -> None:
        name, ini = " ".join(self.name.split()), self.initials.strip()
        if not name or len(name) > NAME_MAX:
            raise InputError(
                f"inspector name {self.name!r} must be 1 to {NAME_MAX} characters",
                where="inspector",
            )
        if not _INITIALS.match(ini):
            raise InputError(
                f"initials {self.initials!r} must be 1 to {INITIALS_MAX} letters "
                "(dots and hyphens allowed after the first)",
                where="inspector",
            )
        object.__setattr__(self, "name", name)
        object.__setattr__(self, "initials", ini)

    @property
    def who(self) -> str:
        """What each entry records as its author: ``"Name (INI)"``."""
        return f"{self.name} ({self.initials})"


def inspector_path(folder: Path | None = None) -> Path:
    return (folder or data_folder()) / INSPECTOR_FILE


def load(folder: Path | None = None) -> Inspector | None:
    """The inspector kept on this device, or None when not yet asked (or unreadable)."""
    try:
        data = json.loads(inspector_path(folder).read_text(encoding="utf-8"))
        if data.get("format") != INSPECTOR_FORMAT:
            return None
        return Inspector(str(data["name"]), str(data["initials"]))
    except (OSError, ValueError, KeyError, TypeError, AttributeError):
        return None


def save(name: str, initials: str, folder: Path | None = None) -> Inspector:
    """Check and keep the inspector of this device (written atomically).

    Raises:
        InputError: see :class:`Inspector`; OutputError/OSError: the folder cannot be written.
    """
    who = Inspector(name, initials)
    path = inspector_path(folder)
    path.parent.mkdir(parents=True, exist_ok=True)
    text = json.dumps(
        {"format": INSPECTOR_FORMAT, "name": who.name, "initials": who.initials}, indent=1
    )
    write_atomic(path, (text + "\n").encode("utf-8"))
    return who
