"""One open survey in the field app: every entry goes straight to core's field store.

No kivy here, and no engineering: values are parsed from what was typed and handed to
:class:`core.survey.FieldStore`, which validates, commits and keeps the history. Errors of
input come back as :class:`core.errors.InputError` with core's message.
"""

from __future__ import annotations

import getpass
import math
from dataclasses import dataclass
from pathlib import Path

from core.definition import SectionDefinition
from core.errors import InputError
from core.survey import FieldStore, Member, Saved, Survey, import_survey
from core.survey.model import RIVET_STATES
from core.survey.readings import nominal_of, plausibility
from fieldapp import templates
from fieldapp.places import Place, PlaceBook, new_store_path

#: the next state when a rivet is tapped
NEXT_STATE = {s: RIVET_STATES[(i + 1) % len(RIVET_STATES)] for i, s in enumerate(RIVET_STATES)}


def parse_number(text: str, what: str) -> float:
    """A finite number from typed text (a comma is read as a decimal point).

    Raises:
        InputError: empty or not a number.
    """
    raw = (text or "").strip().replace(",", ".")
    if not raw:
        raise InputError(f"{what}: no value typed")
    try:
        v = float(raw)
    except ValueError:
        raise InputError(f"{what}: {text!r} is not a number") from None
    if not math.isfinite(v):
        raise InputError(f"{what}: {text!r} is not a finite number")
    return v


@dataclass(frozen=True)
class Snapshot:
    """What the results worker assesses: a survey of the current member with only the
    current station (the rivet lines of the whole member are kept)."""

    seq: int
    survey: Survey
    member: str
    station: str


class Session:
    """An open field store plus where the inspector is (member, station)."""

    def __init__(self, store: FieldStore, book: PlaceBook, who: str = "") -> None:
        self.store = store
        self.book = book
        self.who = who or _user()
        place = book.place(store.path)
        self.member_id = ""
        self.station_id = ""
        self.screen = place.screen
        ids = self.member_ids()
        if place.member in ids:
            self.member_id = place.member
        elif ids:
            self.member_id = ids[0]
        stations = self.station_ids()
        if place.station in stations:
            self.station_id = place.station
        elif stations:
            self.station_id = stations[0]
        self.remember()

    # ------------------------------------------------------------------ open / create
    @classmethod
    def open(cls, path: Path, book: PlaceBook, who: str = "") -> Session:
        """Open an existing store (raises StoreError when it cannot be opened)."""
        return cls(FieldStore.open(path), book, who)

    @classmethod
    def from_template(cls, folder: Path, book: PlaceBook, survey_id: str, system: str) -> Session:
        """A new store with one member from the girder template and one station at mid-span."""
        who = _user()
        path = new_store_path(folder, survey_id)
        store = FieldStore.create(path, templates.header(survey_id, system, who), who=who)
        member = templates.girder_member("G1", system)
        store.add_member(member, who)
        store.add_station("G1", {"id": "S1", "position": member["span"]["value"] / 2}, who)
        return cls(store, book, who)

    @classmethod
    def from_sample(cls, folder: Path, book: PlaceBook, sample: Path) -> Session:
        """A new store holding a copy of a sample survey file (the file is checked first)."""
        path = new_store_path(folder, sample.stem)
        import_survey(sample, path, who=_user())
        return cls.open(path, book)

    def close(self) -> None:
        self.store.close()

    @property
    def path(self) -> Path:
        return self.store.path

    def remember(self) -> None:
        self.book.remember(self.path, Place(self.member_id, self.station_id, self.screen))

    # ------------------------------------------------------------------ reading
    @property
    def header(self) -> dict:
        return self.store.header()

    @property
    def length_unit(self) -> str:
        return self.header.get("length_unit", "mm")

    @property
    def position_unit(self) -> str:
        return self.header.get("position_unit", "m")

    def member_ids(self) -> list[str]:
        return [m.id for m in self.store.to_survey().members]

    def station_ids(self) -> list[str]:
        if not self.member_id:
            return []
        survey = self.store.to_survey()
        return [s.id for s in survey.member(self.member_id).stations]

    def member(self) -> Member:
        return self.store.member(self.member_id)

    def definition(self) -> SectionDefinition:
        return self.member().definition()

    def station(self):
        return self.store.station(self.member_id, self.station_id)

    def select(self, member: str | None = None, station: str | None = None) -> None:
        if member is not None and member != self.member_id:
            self.member_id = member
            self.station_id = ""
        if station is not None:
            self.station_id = station
        self.remember()

    def snapshot(self, seq: int) -> Snapshot | None:
        """The current member with only the current station, for the results worker."""
        if not (self.member_id and self.station_id):
            return None
        m = self.member().model_dump(mode="json")
        m["stations"] = [self.station().model_dump(mode="json")]
        doc = {"survey": self.header, "members": [m]}
        return Snapshot(seq, Survey.model_validate(doc), self.member_id, self.station_id)

    def reading_warnings(self, part: str, text: str) -> list[str]:
        """core's plausibility warnings for a value being typed (empty while incomplete)."""
        try:
            v = parse_number(text, "reading")
        except InputError:
            return []
        if v <= 0:
            return []
        t_nom = nominal_of(self.definition(), part)
        return [p.message for p in plausibility(v, self.length_unit, t_nom)]

    # ------------------------------------------------------------------ entries
    def add_reading(self, part: str, text: str, region: str | None = None) -> Saved:
        """Store a thickness reading typed as ``text`` in the survey's length unit."""
        v = parse_number(text, f"reading on {part}")
        entry = {"part": part, "region": region, "value": v, "unit": self.length_unit}
        return self.store.add_reading(self.member_id, self.station_id, entry, self.who)

    def delete_reading(self, reading_id: str) -> None:
        self.store.delete_reading(self.member_id, self.station_id, reading_id, self.who)

    def add_band(self, part: str, lo: str, hi: str, t: str) -> Saved:
        band = {
            "part": part,
            "lo": parse_number(lo, "band from"),
            "hi": parse_number(hi, "band to"),
            "t": parse_number(t, "band thickness") if t.strip() else None,
        }
        return self.store.add_band(self.member_id, self.station_id, band, self.who)

    def add_perforation(self, part: str, lo: str, hi: str) -> Saved:
        perf = {"part": part, "lo": parse_number(lo, "hole from"), "hi": parse_number(hi, "to")}
        return self.store.add_perforation(self.member_id, self.station_id, perf, self.who)

    def set_note(self, text: str) -> Saved | None:
        if text == self.station().notes:
            return None
        return self.store.set_note(self.member_id, self.station_id, text, self.who)

    def add_photo(self, name: str) -> Saved:
        name = Path(name.strip()).name
        if not name:
            raise InputError("photo: no file name typed")
        photos = [*self.station().photos, name]
        return self.store.update_station(
            self.member_id, self.station_id, {"photos": photos}, self.who
        )

    def add_station(self, station_id: str, position: str) -> Saved:
        sid = station_id.strip()
        if not sid:
            raise InputError("station: no name typed")
        st = {"id": sid, "position": parse_number(position, f"position of station {sid!r}")}
        saved = self.store.add_station(self.member_id, st, self.who)
        self.select(station=saved.id)
        return saved

    def update_girder(self, values: dict[str, float | None]) -> Saved:
        """Store new main dimensions of the member's girder template."""
        section = dict(self.member().section)
        section["girder"] = templates.with_values(section.get("girder") or {}, values)
        return self.store.update_member(self.member_id, {"section": section}, self.who)

    def rivet_line_states(self, line: str) -> list[tuple[float, str]]:
        """Every rivet of ``line`` as (position in the position unit, state)."""
        out: list[tuple[float, str]] = []
        for r in self.member().rivets:
            if r.line == line:
                out += r.expanded()
        return sorted(out)

    def cycle_rivet(self, line: str, position: float, state: str) -> str:
        """Set the rivet at ``position`` to the state after ``state``; returns the new state."""
        new = NEXT_STATE[state]
        self.store.set_rivet_state(self.member_id, line, position, new, self.who)
        return new

    def undo(self) -> str:
        """Undo the last change; a sentence saying what was undone."""
        rows = self.store.undo_last(self.who)
        if not rows:
            return "nothing to undo"
        h = rows[0]
        what = {"add": "added", "update": "changed", "delete": "deleted"}.get(h.action, h.action)
        if self.member_id and self.member_id not in self.member_ids():
            self.member_id = ""
        if self.station_id and self.station_id not in self.station_ids():
            self.station_id = ""
        self.remember()
        return f"undone: {h.kind} {h.entity!r} {what}"


def _user() -> str:
    try:
        return getpass.getuser()
    except (KeyError, OSError):
        return "field"
