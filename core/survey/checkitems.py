"""Checks of single entries: a reading, a loss band, a perforation.

Shared by the whole-survey validation (:mod:`core.survey.validate`) and by the field store,
which checks each entry as it is made.
"""

from __future__ import annotations

import math

from core import limits
from core.definition import SectionDefinition
from core.errors import AsfoundError
from core.errors import where as join
from core.parts import Angle
from core.survey.model import Member, Reading, Station
from core.survey.problems import Problem
from core.survey.readings import plausibility
from core.units import to_internal

ABSURD_MM = 500.0  # no plate of a riveted or bolted member is half a metre thick


def _kind(value: float, unit: str, kind: str, w: str, probs: list[Problem]) -> float | None:
    try:
        return to_internal(value, unit, kind, where=w)
    except AsfoundError as e:
        probs.append(Problem("error", str(e).removeprefix(f"{w}: "), w))
        return None


def check_cut(m, defn, kind: str, b, w: str, lu: str, good) -> list[Problem]:
    """Problems of a band or perforation ``b`` on its plate, or of a band on an angle's leg
    (``lu``: the length unit; ``good``: the (part, region) groups that have usable
    readings)."""
    probs: list[Problem] = []
    wb = join(w, f"{kind} {b.id!r}")
    try:
        part = defn.part(b.part)
    except AsfoundError:
        known = [p.id for p in defn.parts]
        return [Problem("error", f"unknown part id {b.part!r}; known parts: {known}", wb)]
    leg = getattr(b, "leg", None)
    if isinstance(part, Angle):
        if kind == "perforation":
            return [
                Problem(
                    "error",
                    f"part {b.part!r} is an angle; a perforation must lie on a plate (a leg "
                    "cut through is a band of t = 0 on that leg)",
                    wb,
                )
            ]
        if leg not in ("h", "v"):
            return [
                Problem(
                    "error",
                    f"part {b.part!r} is an angle: a band on it names its leg, 'h' "
                    "(horizontal) or 'v' (vertical)",
                    wb,
                )
            ]
    elif leg is not None:
        return [Problem("error", f"leg {leg!r} given for plate {b.part!r}; legs are of angles", wb)]
    lo = _kind(b.lo, lu, "length", join(wb, "lo"), probs)
    hi = _kind(b.hi, lu, "length", join(wb, "hi"), probs)
    if lo is None or hi is None:
        return probs
    a0, a1 = part.leg_range(leg) if isinstance(part, Angle) else part.long_range
    f = to_internal(1.0, lu, "length")
    rng = f"{a0 / f:g} to {a1 / f:g} {lu}"
    if not hi > lo:
        probs.append(Problem("error", f"hi = {b.hi:g} {lu} must be above lo = {b.lo:g} {lu}", wb))
    elif lo < a0 - 1e-6 or hi > a1 + 1e-6:
        what = (
            "perforation outside its plate"
            if kind == "perforation"
            else "band outside its plate"
            if leg is None
            else "band outside its leg (beyond the other leg's thickness, to the toe)"
        )
        probs.append(
            Problem(
                "error",
                f"{what}: {b.lo:g} to {b.hi:g} {lu} is not within part {b.part!r} ({rng})",
                wb,
            )
        )
    covers = lo <= a0 + 1e-6 and hi >= a1 - 1e-6
    if kind == "perforation" and covers:
        probs.append(Problem("error", f"the perforation removes the whole part {b.part!r}", wb))
    if kind == "band":
        if b.t is None and (b.part, b.id) not in good:
            probs.append(
                Problem(
                    "error",
                    "the band has neither a thickness t nor readings with region = its id",
                    wb,
                )
            )
        if b.t is not None:
            t = _kind(b.t, lu, "length", join(wb, "t"), probs)
            if t is not None and (t < 0 or t > ABSURD_MM):
                probs.append(
                    Problem("error", f"t = {b.t:g} {lu} is outside 0 to {part.t / f:g} {lu}", wb)
                )
            elif t is not None and t > part.t:
                probs.append(
                    Problem(
                        "warning",
                        f"t = {b.t:g} {lu} is above the nominal "
                        f"{part.t / f:g} {lu}: measurement or drawing error",
                        wb,
                    )
                )
            elif t == 0 and covers:
                probs.append(Problem("error", f"the band removes the whole part {b.part!r}", wb))
    return probs


class ReadingChecks:
    """The checks of the readings of one station, with what they share found once (the
    station's place, the parts by id, the bands): ``checks(r)`` gives the problems of reading
    ``r`` and its value in mm (None when it cannot be used)."""

    def __init__(self, m: Member, defn: SectionDefinition, st: Station, where: str = "") -> None:
        self.base = join(where, m.place(st.id))
        self.parts = {p.id: p for p in defn.parts}
        self.known = [p.id for p in defn.parts]
        self.bands = {b.id: b for b in st.bands}
        self.factors: dict[str, float | None] = {}

    def _factor(self, unit: str) -> float | None:
        """mm per ``unit``, None when the unit is not a usable length (the long way says why)."""
        if unit not in self.factors:
            try:
                self.factors[unit] = to_internal(1.0, unit, "length")
            except AsfoundError:
                self.factors[unit] = None
        return self.factors[unit]

    def _plain(self, r: Reading) -> float | None:
        """The value in mm of a reading that has nothing to say (known part and region, a
        length unit, within range, 20 % to 100 % of nominal: no error, no warning), else
        None. The same tests as the long way, without building a place for a message."""
        part = self.parts.get(r.part)
        if part is None or type(r.unit) is not str:
            return None
        reg = r.region
        if reg is not None:
            if reg in ("h", "v"):
                if not isinstance(part, Angle):
                    return None
            elif reg not in self.bands or self.bands[reg].part != r.part:
                return None
        f = self._factor(r.unit)
        if f is None:
            return None
        v = float(r.value) * f
        t = part.t
        ok = limits.MIN_LENGTH_MM <= v <= ABSURD_MM and 0.2 <= v / t <= 1.5 and v <= t
        return v if ok else None

    def __call__(self, r: Reading) -> tuple[list[Problem], float | None]:
        v0 = self._plain(r)
        if v0 is not None:
            return [], v0
        probs: list[Problem] = []
        w = join(self.base, f"reading {r.id!r}")
        part = self.parts.get(r.part)
        if part is None:
            msg = f"unknown part id {r.part!r}; known parts: {self.known}"
            return [Problem("error", msg, w)], None
        bands = self.bands
        if r.region is not None:
            if r.region in ("h", "v"):
                if not isinstance(part, Angle):
                    probs.append(
                        Problem(
                            "error",
                            f"region {r.region!r} is an angle leg, but part {r.part!r} is a plate",
                            w,
                        )
                    )
            elif r.region not in bands:
                probs.append(
                    Problem(
                        "error",
                        f"region {r.region!r} is not 'h', 'v' nor a band id at "
                        f"this station (bands: {sorted(bands)})",
                        w,
                    )
                )
            elif bands[r.region].part != r.part:
                probs.append(
                    Problem(
                        "error",
                        f"band {r.region!r} lies on part {bands[r.region].part!r}, "
                        f"not on {r.part!r}",
                        w,
                    )
                )
        try:
            v: float | None = to_internal(r.value, r.unit, "length")
        except AsfoundError:  # again, for the message with its place
            v = _kind(r.value, r.unit, "length", join(w, "unit"), probs)
        if v is None:
            return probs, None
        if not math.isfinite(v) or v < limits.MIN_LENGTH_MM or v > ABSURD_MM:
            probs.append(
                Problem(
                    "error",
                    f"thickness {r.value:g} {r.unit} is outside the allowed range "
                    f"({limits.MIN_LENGTH_MM:g} to {ABSURD_MM:g} mm; nominal {part.t:g} mm)",
                    w,
                )
            )
            return probs, None
        probs += plausibility(r.value, r.unit, part.t, w)
        return probs, (None if any(p.level == "error" for p in probs) else v)


def check_reading(
    m: Member, defn: SectionDefinition, st: Station, r: Reading, where: str = ""
) -> list[Problem]:
    """Problems of one reading: part and region known, unit a length, value in range,
    plausibility warnings (above nominal, unit slip)."""
    return ReadingChecks(m, defn, st, where)(r)[0]
