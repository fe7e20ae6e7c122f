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
from core.parts import Angle, Plate
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
    """Problems of a band or perforation ``b`` on its plate (``lu``: the length unit;
    ``good``: the (part, region) groups that have usable readings)."""
    probs: list[Problem] = []
    wb = join(w, f"{kind} {b.id!r}")
    try:
        part = defn.part(b.part)
    except AsfoundError:
        known = [p.id for p in defn.parts]
        return [Problem("error", f"unknown part id {b.part!r}; known parts: {known}", wb)]
    if not isinstance(part, Plate):
        return [Problem("error", f"part {b.part!r} is an angle; a {kind} must lie on a plate", wb)]
    lo = _kind(b.lo, lu, "length", join(wb, "lo"), probs)
    hi = _kind(b.hi, lu, "length", join(wb, "hi"), probs)
    if lo is None or hi is None:
        return probs
    a0, a1 = part.long_range
    f = to_internal(1.0, lu, "length")
    rng = f"{a0 / f:g} to {a1 / f:g} {lu}"
    if not hi > lo:
        probs.append(Problem("error", f"hi = {b.hi:g} {lu} must be above lo = {b.lo:g} {lu}", wb))
    elif lo < a0 - 1e-6 or hi > a1 + 1e-6:
        what = (
            "perforation outside its plate" if kind == "perforation" else "band outside its plate"
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


def check_reading(
    m: Member, defn: SectionDefinition, st: Station, r: Reading, where: str = ""
) -> list[Problem]:
    """Problems of one reading: part and region known, unit a length, value in range,
    plausibility warnings (above nominal, unit slip)."""
    probs: list[Problem] = []
    w = join(where, m.place(st.id), f"reading {r.id!r}")
    known = [p.id for p in defn.parts]
    if r.part not in known:
        return [Problem("error", f"unknown part id {r.part!r}; known parts: {known}", w)]
    part = defn.part(r.part)
    bands = {b.id: b for b in st.bands}
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
                    f"band {r.region!r} lies on part {bands[r.region].part!r}, not on {r.part!r}",
                    w,
                )
            )
    v = _kind(r.value, r.unit, "length", join(w, "unit"), probs)
    if v is None:
        return probs
    if not math.isfinite(v) or v < limits.MIN_LENGTH_MM or v > ABSURD_MM:
        probs.append(
            Problem(
                "error",
                f"thickness {r.value:g} {r.unit} is outside the allowed range "
                f"({limits.MIN_LENGTH_MM:g} to {ABSURD_MM:g} mm; nominal {part.t:g} mm)",
                w,
            )
        )
        return probs
    return probs + plausibility(r.value, r.unit, part.t, w)
