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
from core.survey import FieldStore, Member, Saved, Survey, UndoPlan, import_survey
from core.survey.guard import Hold, as_read_text, hold_reasons
from core.survey.model import RIVET_STATES
from core.survey.readings import nominal_of
from fieldapp import describe, templates
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
        """The member's stations in position order along the span (Next and Prev follow it),
        whatever the order in which they were made."""
        if not self.member_id:
            return []
        survey = self.store.to_survey()
        stations = survey.member(self.member_id).stations
        return [s.id for s in sorted(stations, key=lambda s: (s.position, s.id))]

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

    def holds(self, part: str, region: str | None, text: str, skip: str = "") -> list[Hold]:
        """core's reasons to hold the reading typed as ``text`` on a part region (the other
        readings of the region, less ``skip``, are compared). Raises InputError when the
        text is not a number."""
        v = parse_number(text, "reading")
        if v <= 0:
            return []  # the store refuses it with its own message
        st = self.station()
        others = [
            r.mm()
            for r in st.readings
            if r.part == part and (r.region or None) == (region or None) and r.id != skip
        ]
        t_nom = nominal_of(self.definition(), part)
        return hold_reasons(v, self.length_unit, t_nom, others)

    # ------------------------------------------------------------------ entries
    def add_reading(
        self, part: str, text: str, region: str | None = None, held: list[Hold] = ()
    ) -> Saved:
        """Store a thickness reading typed as ``text`` in the survey's length unit;
        ``held``: the reasons the guard gave when the inspector chose "store as read"."""
        v = parse_number(text, f"reading on {part}")
        entry = {"part": part, "region": region, "value": v, "unit": self.length_unit}
        if held:
            entry["stored_as_read"] = as_read_text(held)
        return self.store.add_reading(self.member_id, self.station_id, entry, self.who)

    def correct_reading(self, reading_id: str, text: str, held: list[Hold] = ()) -> Saved:
        """A new value for a stored reading (the old one stays in the history)."""
        v = parse_number(text, f"reading {reading_id}")
        changes = {"value": v, "unit": self.length_unit, "stored_as_read": as_read_text(held)}
        return self.store.update_reading(
            self.member_id, self.station_id, reading_id, changes, self.who
        )

    def withdraw(self, kind: str, ident: str) -> None:
        """Withdraw an entry of the station (soft: it stays in the store and the history).
        A loss band goes with the readings taken on it, in one change."""
        m, s, who = self.member_id, self.station_id, self.who
        store = self.store
        if kind == "reading":
            store.delete_reading(m, s, ident, who)
        elif kind == "band":
            with store.batch(who):
                for r in self.station().readings:
                    if r.region == ident:
                        store.delete_reading(m, s, r.id, who)
                store.delete_band(m, s, ident, who)
        elif kind == "perforation":
            store.delete_perforation(m, s, ident, who)
        elif kind == "photo":
            photos = [p for p in self.station().photos if p != ident]
            store.update_station(m, s, {"photos": photos}, who)
        elif kind == "note":
            store.set_note(m, s, "", who)
        else:
            raise InputError(f"an entry of kind {kind!r} cannot be withdrawn here")

    def correct_cut(self, kind: str, ident: str, lo: str, hi: str, t: str = "") -> Saved:
        """New limits (and for a band the thickness) of a loss band or a perforation."""
        changes = {"lo": parse_number(lo, "from"), "hi": parse_number(hi, "to")}
        if kind == "band":
            changes["t"] = parse_number(t, "band thickness") if t.strip() else None
        return self.store.update_cut(
            kind, self.member_id, self.station_id, ident, changes, self.who
        )

    def add_band(self, part: str, lo: str, hi: str, t: str) -> Saved:
        band = {
            "part": part,
            "lo": parse_number(lo, "band from"),
            "hi": parse_number(hi, "band to"),
            "t": parse_number(t, "band thickness") if t.strip() else None,
        }
        return self.store.add_band(self.member_id, self.station_id, band, self.who)

    def add_perforation(self, part: str, lo: str, hi: str) -> Saved:
        perf = {
            "part": part,
            "lo": parse_number(lo, "perforation from"),
            "hi": parse_number(hi, "to"),
        }
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

    def next_station_id(self) -> str:
        """The first free station name ``S<n>`` of the member (deleted ones stay taken)."""
        used = set(self.station_ids()) | self.store.used_ids("station", self.member_id)
        n = len(used) + 1
        while f"S{n}" in used:
            n += 1
        return f"S{n}"

    def add_station(self, station_id: str, position: str) -> Saved:
        sid = station_id.strip() or self.next_station_id()
        st = {"id": sid, "position": parse_number(position, f"position of station {sid!r}")}
        saved = self.store.add_station(self.member_id, st, self.who)
        self.select(station=saved.id)
        return saved

    def add_station_after(self, offset: str, station_id: str = "") -> Saved:
        """A new station ``offset`` (position unit, typed) beyond the current one (before it
        when negative), named ``station_id`` or the next free name."""
        here = self.station()
        dx = parse_number(offset, f"distance from station {here.id}")
        if dx == 0.0:
            raise InputError(
                f"distance 0 {self.position_unit} from station {here.id!r}: a new station "
                "needs a place of its own (any distance other than 0 along the member)"
            )
        return self.add_station(station_id, f"{here.position + dx:.10g}")

    def move_station(self, position: str) -> Saved:
        """Move the current station to ``position`` (position unit, typed); core refuses a
        place outside the member, naming the limits."""
        sid = self.station_id
        x = parse_number(position, f"position of station {sid!r}")
        return self.store.update_station(self.member_id, sid, {"position": x}, self.who)

    def withdraw_station(self) -> str:
        """Withdraw the current station with its readings, bands and perforations (soft: all
        stay in the store and the history, and Undo brings them back); the id withdrawn."""
        sid = self.station_id
        self.store.delete_station(self.member_id, sid, self.who)
        self.after_removal()
        return sid

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

    def undo_plan(self) -> tuple[UndoPlan, str]:
        """What Undo would revert (core's plan) and the sentence that says so."""
        plan = self.store.undo_plan(self.who)
        return plan, describe.change(plan.rows, self.length_unit, self.position_unit)

    def undo(self, change: int | None = None) -> str:
        """Undo the last change of this person on this device (``change``: the one shown);
        a sentence saying what was undone. Raises UndoRefusedError with core's reason."""
        rows = self.store.undo_last(self.who, change=change)
        if not rows:
            return "nothing of yours to undo on this device"
        what = describe.change(rows, self.length_unit, self.position_unit)
        self.after_removal()
        return f"undone: {what}"

    def after_removal(self) -> None:
        """Keep the place valid when an undo or a withdrawal removed it: the first member
        and station left (the Member screen can always add a station)."""
        members = self.member_ids()
        if self.member_id not in members:
            self.member_id = members[0] if members else ""
            self.station_id = ""
        stations = self.station_ids()
        if self.station_id not in stations:
            self.station_id = stations[0] if stations else ""
        self.remember()


def _user() -> str:
    try:
        return getpass.getuser()
    except (KeyError, OSError):
        return "field"
