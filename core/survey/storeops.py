"""The entries of the field store: add, update, delete, rivet states, notes, undo.

Mixed into :class:`core.survey.store.FieldStore`; every public method is one transaction
and one change in the history (or part of an enclosing :meth:`FieldStore.batch`).
"""

from __future__ import annotations

import datetime as _dt
import json
import uuid
from typing import TYPE_CHECKING, Any

from pydantic import ValidationError

from core.errors import InputError
from core.survey.checkitems import check_cut, check_reading
from core.survey.model import (
    RIVET_STATES,
    Band,
    Perforation,
    Reading,
    RivetLineStates,
    Station,
    Survey,
    SurveyHeader,
)
from core.survey.problems import Problem, raise_errors
from core.survey.validate import check_member, check_station, check_survey

if TYPE_CHECKING:
    from core.survey.store import Saved

_NESTED = ("readings", "bands", "perforations")


def _validated(cls, data: Any, what: str, where: str = ""):
    try:
        return cls.model_validate(data)
    except ValidationError as e:
        probs = [
            Problem(
                "error",
                f"{x['msg']} (value {x.get('input')!r})",
                " / ".join([where, *map(str, x["loc"])]).strip(" /"),
            )
            for x in e.errors()
        ]
        raise_errors(probs, what)


class StoreOps:
    """Entry operations of the field store (see :class:`core.survey.store.FieldStore`)."""

    # ------------------------------------------------------------- low level, in a txn
    def _load(self, kind: str, member: str, station: str, ident: str) -> dict:
        if kind == "survey":
            return json.loads(self._meta("survey"))
        return self._get(kind, member, station, ident)

    def _save(self, kind: str, member: str, station: str, ident: str, data: dict) -> None:
        if kind == "survey":
            self._conn.execute(
                "UPDATE meta SET value = ? WHERE key = 'survey'", (json.dumps(data),)
            )
            return
        self._conn.execute(
            "UPDATE entity SET data = ? WHERE kind = ? AND member = ? AND station = ? AND id = ?",
            (json.dumps(data), kind, member, station, ident),
        )

    def _insert(self, kind: str, member: str, station: str, ident: str, data: dict) -> None:
        row = self._conn.execute(
            "SELECT deleted FROM entity WHERE kind = ? AND member = ? AND station = ? AND id = ?",
            (kind, member, station, ident),
        ).fetchone()
        if row is not None:
            extra = " by a deleted entry (ids are never reused)" if row[0] else ""
            raise InputError(
                f"{kind} id {ident!r} is already used{extra}", where=_place(member, station)
            )
        seq = self._conn.execute("SELECT COALESCE(MAX(seq), 0) + 1 FROM entity").fetchone()[0]
        self._conn.execute(
            "INSERT INTO entity(kind, member, station, id, seq, data, uid)"
            " VALUES (?, ?, ?, ?, ?, ?, ?)",
            (kind, member, station, ident, seq, json.dumps(data), uuid.uuid4().hex),
        )
        self._history("add", kind, member, station, ident, "*", None, data)

    def _update(self, kind: str, member: str, station: str, ident: str, new: dict) -> None:
        data = self._load(kind, member, station, ident)
        for k, v in new.items():
            if data.get(k) != v:
                self._history("update", kind, member, station, ident, k, data.get(k), v)
                data[k] = v
        self._save(kind, member, station, ident, data)

    def _set_deleted(self, kind: str, member: str, station: str, ident: str, flag: int) -> None:
        self._conn.execute(
            "UPDATE entity SET deleted = ? WHERE kind = ? AND member = ? AND station = ? AND id = ?",
            (flag, kind, member, station, ident),
        )

    def _delete(self, kind: str, member: str, station: str, ident: str, who: str) -> None:
        with self._txn(who):
            data = self._get(kind, member, station, ident)
            if station:
                self._check_later(member, station)
            self._set_deleted(kind, member, station, ident, 1)
            self._history("delete", kind, member, station, ident, "*", data, None)

    def _check_later(self, member_id: str, station_id: str) -> None:
        """Check the station when the transaction ends (a batch may withdraw a band's
        readings and then the band): no error that it did not have before."""
        key = (member_id, station_id)
        if key not in self._checks:
            self._checks[key] = self._station_errors(member_id, station_id)

    def _station_errors(self, member_id: str, station_id: str) -> list[Problem]:
        m, defn = self._member_and_definition(member_id)
        st = self.station(member_id, station_id)
        return [p for p in check_station(m, defn, st, m.span_mm()) if p.level == "error"]

    def _check_station(self, member_id: str, station_id: str, known=()) -> None:
        """Raise the errors of a station as stored that are not among ``known`` (e.g. a band
        left without a thickness once its only reading is withdrawn)."""
        new = [p for p in self._station_errors(member_id, station_id) if p not in known]
        raise_errors(new, f"station {station_id!r}")

    def _saved(self, ident: str, probs: list[Problem]) -> Saved:
        from core.survey.store import Saved

        return Saved(ident, tuple(p for p in probs if p.level != "error"))

    # ------------------------------------------------------------- survey and members
    def update_header(self, changes: dict, who: str) -> Saved:
        """Change fields of the survey header (title, inspector, material, standard, ...).

        The new header is checked as a file's would be (:func:`check_survey`: Fy, Fu and E
        in range, the year built between 1800 and this year, the options), so a value the
        assessment would refuse is never stored.

        Raises:
            InputError: a value out of range (the message names it, its range and place).
        """
        with self._txn(who):
            hdr = {**self.header(), **changes}
            model = _validated(SurveyHeader, hdr, "survey header", "survey")
            probs = check_survey(Survey(survey=model))
            raise_errors(probs, "the survey header")
            self._update("survey", "", "", model.id, model.model_dump(mode="json"))
            return self._saved(model.id, probs)

    def add_member(self, member: dict, who: str) -> Saved:
        """Add a member (document object; its ``stations``, if any, are added too).

        Raises:
            InputError: invalid member (section, span, rivet states), or a used id.
        """
        with self._txn(who):
            data = dict(member)
            stations = data.pop("stations", []) or []
            m = self._member_model(data)
            probs = check_member(m)
            raise_errors(probs, f"member {m.id!r}")
            dump = m.model_dump(mode="json")
            dump.pop("stations")
            self._insert("member", m.id, "", m.id, dump)
            for s in stations:
                self.add_station(m.id, s, who)
            return self._saved(m.id, probs)

    def update_member(self, member_id: str, changes: dict, who: str) -> Saved:
        """Change fields of a member (label, span, do, section, rivets, simple_span).

        A new section or span is checked with the member's stations: a change that leaves
        a reading on a part that no longer exists, or a station beyond the member, is refused.
        """
        with self._txn(who):
            current = self._get("member", member_id, "", member_id)
            data = {**current, **changes}
            if data.get("id") != member_id:
                raise InputError("a member id cannot be changed", where=_place(member_id, ""))
            m = self._member_model(data)
            probs = check_member(m)
            raise_errors(probs, f"member {member_id!r}")
            if any(data.get(k) != current.get(k) for k in ("section", "span")):
                self._check_with_stations(member_id, data, self._member_errors(member_id))
            dump = m.model_dump(mode="json")
            dump.pop("stations")
            self._update("member", member_id, "", member_id, dump)
            return self._saved(member_id, probs)

    def _member_model(self, data: dict):
        doc = {"survey": self.header(), "members": [{**data, "stations": []}]}
        return _validated(Survey, doc, "member").members[0]

    def _member_errors(self, member_id: str, data: dict | None = None) -> list[Problem]:
        """The errors of a member (``data``, default: as stored) with its stations."""
        m = data if data is not None else self._get("member", member_id, "", member_id)
        full = self._with_stations({**m, "id": member_id})
        doc = {"survey": self.header(), "members": [full]}
        model = _validated(Survey, doc, f"member {member_id!r}").members[0]
        return [p for p in check_member(model) if p.level == "error"]

    def _check_with_stations(self, member_id: str, data: dict | None = None, known=()) -> None:
        """Raise the errors of a member with its stations that are not among ``known``."""
        new = [p for p in self._member_errors(member_id, data) if p not in known]
        raise_errors(new, f"member {member_id!r}")

    def set_rivet_state(
        self, member_id: str, line: str, position: float, state: str, who: str
    ) -> Saved:
        """Set the state (sound, loose, missing, headless) of the rivet of ``line`` at
        ``position`` (position unit); a rivet of a run within 1 % of the pitch is the same."""
        if state not in RIVET_STATES:
            raise InputError(
                f"rivet state {state!r} is not one of {list(RIVET_STATES)}",
                where=_place(member_id, ""),
            )
        with self._txn(who):
            data = self._get("member", member_id, "", member_id)
            rivets = [dict(r) for r in data.get("rivets", [])]
            entry = next((r for r in rivets if r["line"] == line), None)
            if entry is None:
                entry = {"line": line, "run": None, "states": []}
                rivets.append(entry)
            rl = RivetLineStates.model_validate(entry)
            tol = 0.01 * rl.run.pitch if rl.run is not None else 1e-9
            states = [dict(s) for s in entry.get("states", [])]
            hit = next((s for s in states if abs(s["position"] - position) <= tol), None)
            if hit is None and rl.run is not None:
                near = [p for p, _ in rl.expanded() if abs(p - position) <= tol]
                position = near[0] if near else position
            if hit is not None:
                hit["state"] = state
            else:
                states.append({"position": float(position), "state": state})
            entry["states"] = states
            return self.update_member(member_id, {"rivets": rivets}, who)

    # ------------------------------------------------------------- stations and entries
    def add_station(self, member_id: str, station: dict, who: str) -> Saved:
        """Add a station (document object; nested readings, bands, perforations too)."""
        with self._txn(who):
            m, defn = self._member_and_definition(member_id)
            data = dict(station)
            nested = {k: data.pop(k, []) or [] for k in _NESTED}
            st = _validated(Station, data, "station", _place(member_id, ""))
            probs = check_station(m, defn, st, m.span_mm())
            raise_errors(probs, f"station {st.id!r}")
            dump = st.model_dump(mode="json")
            for k in _NESTED:
                dump.pop(k)
            self._insert("station", member_id, "", st.id, dump)
            for b in nested["bands"]:
                self.add_band(member_id, st.id, b, who)
            for p in nested["perforations"]:
                self.add_perforation(member_id, st.id, p, who)
            for r in nested["readings"]:
                self.add_reading(member_id, st.id, r, who)
            return self._saved(st.id, probs)

    def update_station(self, member_id: str, station_id: str, changes: dict, who: str) -> Saved:
        """Change fields of a station (position, loads, notes, photos)."""
        with self._txn(who):
            m, defn = self._member_and_definition(member_id)
            data = {**self._get("station", member_id, "", station_id), **changes}
            st = _validated(Station, data, "station", _place(member_id, station_id))
            probs = check_station(m, defn, st, m.span_mm())
            raise_errors(probs, f"station {station_id!r}")
            dump = st.model_dump(mode="json")
            for k in _NESTED:
                dump.pop(k)
            self._update("station", member_id, "", station_id, dump)
            return self._saved(station_id, probs)

    def set_note(self, member_id: str, station_id: str, text: str, who: str) -> Saved:
        """Replace the notes of a station (the old text stays in the history)."""
        return self.update_station(member_id, station_id, {"notes": str(text)}, who)

    def delete_member(self, member_id: str, who: str) -> None:
        """Withdraw a member softly, with its stations (they stay in the store and the
        history; undo brings them back)."""
        self._delete("member", member_id, "", member_id, who)

    def delete_station(self, member_id: str, station_id: str, who: str) -> None:
        self._delete("station", member_id, "", station_id, who)

    def add_reading(self, member_id: str, station_id: str, reading: dict, who: str) -> Saved:
        """Add a thickness reading (``id`` optional: the next free ``r<n>``; ``who`` and
        ``time`` default to the person entering and now).

        Raises:
            InputError: unknown member, station, part or region; a value out of range; a
            unit that is not a length. Warnings (above nominal, unit slip) are returned.
        """
        with self._txn(who):
            data = dict(reading)
            if not data.get("id"):
                data["id"] = self._next_id("reading", member_id, station_id, "r")
            data.setdefault("who", who)
            data.setdefault("time", _dt.datetime.now().isoformat(timespec="seconds"))
            m, defn = self._member_and_definition(member_id)
            st = self.station(member_id, station_id)
            r = _validated(Reading, data, "reading", _place(member_id, station_id))
            probs = check_reading(m, defn, st, r)
            raise_errors(probs, f"reading {r.id!r}")
            self._insert("reading", member_id, station_id, r.id, r.model_dump(mode="json"))
            return self._saved(r.id, probs)

    def update_reading(
        self, member_id: str, station_id: str, reading_id: str, changes: dict, who: str
    ) -> Saved:
        """Correct a reading (value, unit, part, region, ...); the old values go to history."""
        with self._txn(who):
            data = {**self._get("reading", member_id, station_id, reading_id), **changes}
            if data["id"] != reading_id:
                raise InputError(
                    "a reading id cannot be changed", where=_place(member_id, station_id)
                )
            m, defn = self._member_and_definition(member_id)
            st = self.station(member_id, station_id)
            r = _validated(Reading, data, "reading", _place(member_id, station_id))
            probs = check_reading(m, defn, st, r)
            raise_errors(probs, f"reading {reading_id!r}")
            self._check_later(member_id, station_id)
            self._update("reading", member_id, station_id, reading_id, r.model_dump(mode="json"))
            return self._saved(reading_id, probs)

    def delete_reading(self, member_id: str, station_id: str, reading_id: str, who: str) -> None:
        """Delete a reading softly (it stays in the store and in the history)."""
        self._delete("reading", member_id, station_id, reading_id, who)

    def add_band(self, member_id: str, station_id: str, band: dict, who: str) -> Saved:
        """Add a loss band (``t`` may follow later as readings with region = the band id)."""
        return self._add_cut("band", Band, member_id, station_id, band, who)

    def add_perforation(self, member_id: str, station_id: str, perf: dict, who: str) -> Saved:
        """Add a perforation (a hole through a plate)."""
        return self._add_cut("perforation", Perforation, member_id, station_id, perf, who)

    def delete_band(self, member_id: str, station_id: str, band_id: str, who: str) -> None:
        self._delete("band", member_id, station_id, band_id, who)

    def delete_perforation(self, member_id: str, station_id: str, perf_id: str, who: str) -> None:
        self._delete("perforation", member_id, station_id, perf_id, who)

    def update_cut(
        self, kind: str, member_id: str, station_id: str, ident: str, changes: dict, who: str
    ) -> Saved:
        """Correct a loss band or a perforation (limits, thickness, part, note); the old
        values go to history. Readings on a band keep their region.

        Raises:
            InputError: unknown entry, a value out of its plate, or ``kind`` unknown.
        """
        cls = {"band": Band, "perforation": Perforation}.get(kind)
        if cls is None:
            raise InputError(f"{kind!r} is not 'band' or 'perforation'")
        with self._txn(who):
            data = {**self._get(kind, member_id, station_id, ident), **changes}
            if data["id"] != ident:
                raise InputError(
                    f"a {kind} id cannot be changed", where=_place(member_id, station_id)
                )
            m, defn = self._member_and_definition(member_id)
            b = _validated(cls, data, kind, _place(member_id, station_id))
            st = self.station(member_id, station_id)
            good = {(r.part, r.region): [1.0] for r in st.readings}
            probs = check_cut(m, defn, kind, b, m.place(station_id), m.length_unit, good)
            raise_errors(probs, f"{kind} {ident!r}")
            self._check_later(member_id, station_id)
            self._update(kind, member_id, station_id, ident, b.model_dump(mode="json"))
            return self._saved(ident, probs)

    def _add_cut(self, kind, cls, member_id, station_id, item, who) -> Saved:
        with self._txn(who):
            data = dict(item)
            if not data.get("id"):
                data["id"] = self._next_id(kind, member_id, station_id, kind[0])
            m, defn = self._member_and_definition(member_id)
            self._get("station", member_id, "", station_id)
            b = _validated(cls, data, kind, _place(member_id, station_id))
            w = m.place(station_id)
            probs = check_cut(m, defn, kind, b, w, m.length_unit, {(b.part, b.id): [1.0]})
            if b.id in ("h", "v"):
                probs.append(Problem("error", "a band id may not be 'h' or 'v' (angle legs)", w))
            raise_errors(probs, f"{kind} {b.id!r}")
            self._insert(kind, member_id, station_id, b.id, b.model_dump(mode="json"))
            return self._saved(b.id, probs)

    def used_ids(self, kind: str, member: str, station: str = "") -> set[str]:
        """Every id of ``kind`` ever used at that place, withdrawn ones included (an id is
        never used twice)."""
        with self._lock:
            return {
                r[0]
                for r in self._conn.execute(
                    "SELECT id FROM entity WHERE kind = ? AND member = ? AND station = ?",
                    (kind, member, station),
                )
            }

    def used_member_ids(self) -> set[str]:
        """Every member id ever used in the store, withdrawn ones included."""
        with self._lock:
            return {r[0] for r in self._conn.execute("SELECT id FROM entity WHERE kind = 'member'")}

    def _next_id(self, kind: str, member: str, station: str, prefix: str) -> str:
        used = self.used_ids(kind, member, station)
        n = len(used) + 1
        while f"{prefix}{n}" in used:
            n += 1
        return f"{prefix}{n}"


def _place(member: str, station: str) -> str:
    return " / ".join(
        x for x in (member and f"member {member!r}", station and f"station {station!r}") if x
    )
