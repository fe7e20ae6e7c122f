"""One exception root for asfound.

Every error asfound raises derives from :class:`AsfoundError`; each concrete kind also
derives from the builtin that fits, so callers may catch either.
"""

from __future__ import annotations


class AsfoundError(Exception):
    """Root of every error raised by asfound."""


class InputError(ValueError, AsfoundError):
    """A value given to asfound is out of range, malformed or inconsistent.

    The message names the value, the allowed range and where it came from
    (file, member, station, part) whenever that is known.
    """

    def __init__(self, message: str, *, where: str = "") -> None:
        self.where = where
        super().__init__(f"{where}: {message}" if where else message)


class UnitError(InputError):
    """A quantity has a unit of the wrong kind or an unknown unit."""


class GeometryError(InputError):
    """Parts overlap, a loss removes a whole part, a hole lies outside its plate, or similar."""


class SchemaError(InputError):
    """A document does not follow the asfound file format (or is of a newer version)."""


class OutputError(InputError):
    """An output path that would destroy an input, a field store or a file of another kind
    (see :mod:`core.outputs`)."""


class StoreError(OSError, AsfoundError):
    """The field store cannot be opened, is damaged or is locked."""


def where(*parts: str | None) -> str:
    """Join the non-empty location parts ``file``, ``member``, ``station``, ``part`` with ' / '."""
    return " / ".join(p for p in parts if p)
