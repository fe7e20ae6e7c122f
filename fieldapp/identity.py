"""Who is entering: the inspector's name and initials, asked once per device.

Kept in ``inspector.json`` in the asfound data folder, beside ``device.json``
(:func:`core.survey.device.data_folder`), never taken from the operating system's login.
Every entry of the field store carries :attr:`Inspector.who`, and the edit history shows it.

Undo is per person and device (core's store); the person is known by a stable ``key`` made
when they are first named here, not by the name shown: :func:`correct` changes the name of
the same person (the earlier names stay theirs, ``formerly``, so Undo still reaches their
entries), :func:`hand_over` names another person (a new key; the earlier inspector's entries
are out of this person's reach). A name once used on this device by one person is refused
for another, since the store tells people apart by the name recorded. No kivy here.
"""

from __future__ import annotations

import contextlib
import json
import re
import uuid
from dataclasses import dataclass
from pathlib import Path

from core.errors import AsfoundError, InputError
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
    key: str = ""
    formerly: tuple[str, ...] = ()

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


def _read(folder: Path | None) -> dict:
    try:
        data = json.loads(inspector_path(folder).read_text(encoding="utf-8"))
    except (OSError, ValueError):
        return {}
    return data if isinstance(data, dict) and data.get("format") == INSPECTOR_FORMAT else {}


def load(folder: Path | None = None) -> Inspector | None:
    """The inspector kept on this device, or None when not yet asked (or unreadable)."""
    data = _read(folder)
    try:
        key = str(data.get("key") or "")
        people = data.get("people") or {}
        formerly = tuple(str(n) for n in people.get(key, []) if isinstance(n, str))
        who = Inspector(str(data["name"]), str(data["initials"]), key)
        return Inspector(who.name, who.initials, key, tuple(n for n in formerly if n != who.who))
    except (KeyError, TypeError, AttributeError, ValueError):
        return None


def _write(folder: Path | None, who: Inspector, people: dict[str, list[str]]) -> Inspector:
    path = inspector_path(folder)
    path.parent.mkdir(parents=True, exist_ok=True)
    doc = {
        "format": INSPECTOR_FORMAT,
        "name": who.name,
        "initials": who.initials,
        "key": who.key,
        "people": people,
    }
    write_atomic(path, (json.dumps(doc, indent=1) + "\n").encode("utf-8"))
    return load(folder) or who


def _people(data: dict) -> dict[str, list[str]]:
    people = {str(k): [str(n) for n in v] for k, v in (data.get("people") or {}).items()}
    if data.get("name") and not data.get("key"):  # kept before keys were kept: one person
        with contextlib.suppress(AsfoundError, KeyError, TypeError):
            people.setdefault("", []).append(Inspector(data["name"], data["initials"]).who)
    return people


def _owner(people: dict[str, list[str]], who: str) -> str | None:
    return next((k for k, names in people.items() if who in names), None)


def _taken(who: str) -> InputError:
    return InputError(
        f"{who!r} was already used on this device by another inspector; add a middle "
        "initial or a number so that the history tells you apart",
        where="inspector",
    )


def save(name: str, initials: str, folder: Path | None = None) -> Inspector:
    """Name the inspector of this device: the same person as now when nobody is named yet
    or the name is theirs, else :func:`hand_over` (kept atomically).

    Raises:
        InputError: see :class:`Inspector`; OutputError/OSError: the folder cannot be written.
    """
    now = load(folder)
    if now is None:
        return hand_over(name, initials, folder)
    return correct(name, initials, folder)


def correct(name: str, initials: str, folder: Path | None = None) -> Inspector:
    """The same person's name or initials corrected: their key stays, the earlier name is
    kept as theirs (Undo still reaches what they entered under it).

    Raises:
        InputError: a bad name or initials, a name another person used on this device, or
        nobody named yet.
    """
    data = _read(folder)
    now = load(folder)
    if now is None:
        raise InputError("no inspector is named on this device yet", where="inspector")
    new = Inspector(name, initials, now.key)
    people = _people(data)
    owner = _owner(people, new.who)
    if owner is not None and owner != now.key:
        raise _taken(new.who)
    names = people.setdefault(now.key, [])
    for n in (now.who, new.who):
        if n not in names:
            names.append(n)
    return _write(folder, new, people)


def hand_over(name: str, initials: str, folder: Path | None = None) -> Inspector:
    """Another person takes the device from now on: a new key (the earlier inspector's
    entries are out of their Undo). A name this device already knows as an earlier
    inspector's is that person again (their entries are theirs to undo).

    Raises:
        InputError: a bad name or initials, or a name of the inspector who has the device
        now; OutputError/OSError: not written.
    """
    data = _read(folder)
    new = Inspector(name, initials)
    people = _people(data)
    key = _owner(people, new.who)
    now = load(folder)
    if now is not None and key == now.key:
        raise InputError(
            f"{new.who!r} is a name of {now.who}, who has this device now: that is the same "
            "person (correct the name instead)",
            where="inspector",
        )
    if key is None:
        key = uuid.uuid4().hex
        people[key] = [new.who]
    return _write(folder, Inspector(new.name, new.initials, key), people)
