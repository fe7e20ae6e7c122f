"""Validation of a survey: every problem at once, each with its place.

Two stages. The structure of the document is checked against the published JSON Schema of
its version (``core/schema/survey-2.schema.json``; a version 1 file against
``survey-1.schema.json``, then upgraded, :mod:`core.survey.docversions`) and the model; an item that fails (a reading with a
text value, say) is reported and set aside so that the rest can still be checked. Then the
meaning is checked: part ids, positions within the member, perforations within their plate,
thickness ranges, units, and the plausibility warnings of :mod:`core.survey.readings`.
"""

from __future__ import annotations

import copy
import datetime as _dt
import json
from collections import Counter
from functools import lru_cache
from pathlib import Path
from typing import Any

import jsonschema
from pydantic import ValidationError

from core import limits
from core.definition import SectionDefinition
from core.errors import AsfoundError, InputError
from core.errors import where as join
from core.survey import docversions, fastschema
from core.survey.checkdetails import check_details
from core.survey.checkitems import ReadingChecks, _kind, check_cut
from core.survey.model import FORMAT, VERSION, Member, Station, Survey
from core.survey.problems import Problem
from core.survey.readings import cov_clearly_within, region_stats
from core.units import to_internal

SCHEMA_DIR = Path(__file__).resolve().parent.parent / "schema"
SCHEMA_PATH = SCHEMA_DIR / f"survey-{VERSION}.schema.json"

_MAX_SPAN_MM = 300_000.0


@lru_cache(maxsize=4)
def schema(version: int = VERSION) -> dict:
    """The JSON Schema (draft 2020-12) of the survey document of ``version`` (1 or 2)."""
    return json.loads((SCHEMA_DIR / f"survey-{version}.schema.json").read_text(encoding="utf-8"))


def place_of(doc: Any, path: tuple | list) -> str:
    """Translate a path in the document into a place: ``member 'G1' / station 'S3' / ...``."""
    out: list[str] = []
    node = doc
    names = {"members": "member", "stations": "station", "readings": "reading", "bands": "band"}
    names |= {"perforations": "perforation", "rivets": "rivet line", "axles": "axle"}
    names |= {"stiffeners": "stiffener", "supports": "support"}
    key: Any = None
    for step in path:
        try:
            child = node[step]
        except (KeyError, IndexError, TypeError):
            out.append(str(step))
            break
        if isinstance(step, int) and key in names:
            ident = (
                child.get("line" if key == "rivets" else "id") if isinstance(child, dict) else None
            )
            out.append(
                f"{names[key]} {ident!r}" if ident is not None else f"{names[key]} #{step + 1}"
            )
        elif isinstance(step, str) and step not in names:
            out.append(step)
        key, node = step, child
    return join(*out)


def _prune(doc: dict, paths: list[tuple]) -> bool:
    """Remove from ``doc`` the innermost list item on each path; False if one has none."""
    cuts: set[tuple] = set()
    for p in paths:
        idx = [i for i, s in enumerate(p) if isinstance(s, int)]
        if not idx:
            return False
        cuts.add(tuple(p[: idx[-1] + 1]))
    for cut in sorted(cuts, key=lambda c: (len(c), c[-1]), reverse=True):
        node: Any = doc
        for s in cut[:-1]:
            node = node[s]
        if isinstance(node, list) and cut[-1] < len(node):
            del node[cut[-1]]
    return True


def check_document(doc: Any, where: str = "") -> tuple[Survey | None, list[Problem]]:
    """Check a survey document (parsed JSON). Returns the model (None if it cannot be built)
    and every problem found."""
    probs: list[Problem] = []
    if not isinstance(doc, dict) or doc.get("format") != FORMAT:
        return None, [
            Problem("error", f"not an asfound survey (expected format {FORMAT!r})", where)
        ]
    ver = doc.get("version")
    if not isinstance(ver, int) or isinstance(ver, bool) or ver < 1:
        return None, [Problem("error", f"version {ver!r} is not a version number", where)]
    if ver > VERSION:
        msg = f"version {ver} is newer than this asfound reads (1 to {VERSION}); update asfound"
        return None, [Problem("error", msg, where)]
    # the document is copied only when items must be set aside (``_prune``); it is never
    # changed, and the model may share the section object's plain values with it
    work = doc
    errs = []
    if not fastschema.known_valid(doc, ver):
        validator = jsonschema.Draft202012Validator(schema(ver))
        errs = sorted(validator.iter_errors(doc), key=lambda e: list(map(str, e.absolute_path)))
    for e in errs:
        path = tuple(e.absolute_path)
        probs.append(Problem("error", _schema_message(e), join(where, place_of(doc, path))))
    if errs:
        work = copy.deepcopy(doc)
    model: Survey | None = None
    if not errs or _prune(work, [tuple(e.absolute_path) for e in errs]):
        if ver < VERSION:
            moved = docversions.trains_moved(work)
            work = docversions.upgrade(work)
            msg = f"a version {ver} file, read as version {VERSION}"
            if moved:
                msg += (
                    f"; the axle train of member(s) {', '.join(map(repr, moved))} is now a "
                    f"vehicle ({docversions.V1_TRAIN!r}) of the member's live load, and the "
                    "family's own live load model gives the design load"
                )
            probs.append(Problem("note", msg, where))
        for _ in range(10):
            try:
                model = Survey.model_validate(work)
                break
            except ValidationError as ve:
                locs = [tuple(x["loc"]) for x in ve.errors()]
                for x in ve.errors():
                    msg = x["msg"] if len(x["msg"]) <= 300 else x["msg"][:300] + "..."
                    probs.append(Problem("error", msg, join(where, place_of(work, x["loc"]))))
                if work is doc:
                    work = copy.deepcopy(doc)
                if not _prune(work, locs):
                    break
    if model is None:
        probs.append(Problem("note", "the meaning of the survey was not checked", where))
        return None, probs
    return model, probs + check_survey(model, where)


def _schema_message(e: jsonschema.ValidationError) -> str:
    """The schema's message, with a size limit said in words (not the whole list or text)."""
    if e.validator in ("maxItems", "maxLength"):
        what = "items" if e.validator == "maxItems" else "characters"
        return f"{len(e.instance):,} {what} is more than the limit of {e.validator_value:,}"
    msg = e.message
    return msg if len(msg) <= 300 else f"{msg[:300]}... ({len(msg):,} characters)"


def _range(v: float | None, lo: float, hi: float, name: str, unit: str, w: str, probs) -> None:
    if v is not None and not lo <= v <= hi:
        probs.append(
            Problem("error", f"{name} = {v:g} {unit} is outside {lo:g} to {hi:g} {unit}", w)
        )


def _dupes(ids: list[str], what: str, w: str) -> list[Problem]:
    if len(set(ids)) == len(ids):
        return []
    d = sorted(i for i, k in Counter(ids).items() if k > 1)
    return [Problem("error", f"duplicate {what} ids {d}", w)] if d else []


def check_survey(s: Survey, where: str = "") -> list[Problem]:
    """Every problem of meaning in a survey model (the structure is already valid)."""
    h = s.survey
    probs: list[Problem] = []
    w = join(where, "survey")
    _kind(1.0, h.length_unit, "length", join(w, "length_unit"), probs)
    _kind(1.0, h.position_unit, "length", join(w, "position_unit"), probs)
    for d in h.dates:
        try:
            _dt.date.fromisoformat(d)
        except ValueError:
            probs.append(Problem("error", f"date {d!r} is not YYYY-MM-DD", join(w, "dates")))
    if h.material is not None:
        m = h.material
        fy = _kind(m.Fy.value, m.Fy.unit, "stress", join(w, "material", "Fy"), probs)
        _range(fy, 100.0, 1000.0, "Fy", "MPa", join(w, "material", "Fy"), probs)
        if m.Fu is not None:
            fu = _kind(m.Fu.value, m.Fu.unit, "stress", join(w, "material", "Fu"), probs)
            _range(
                fu, fy or 100.0, 2000.0, "Fu", "MPa (Fy up to)", join(w, "material", "Fu"), probs
            )
        if m.E is not None:
            e = _kind(m.E.value, m.E.unit, "stress", join(w, "material", "E"), probs)
            _range(e, 150_000.0, 250_000.0, "E", "MPa", join(w, "material", "E"), probs)
    if h.year_built is not None:
        _range(
            h.year_built,
            1800,
            _dt.date.today().year,
            "year_built",
            "",
            join(w, "year_built"),
            probs,
        )
    if h.options is not None:
        from core.assess.options import options_from_dict

        try:
            options_from_dict(h.options)
        except AsfoundError as e:
            probs.append(Problem("error", f"options: {e}", join(w, "options")))
    if h.material is None and h.year_built is None:
        probs.append(
            Problem("warning", "neither material nor year built given: set Fy before assessment", w)
        )
    n = sum(len(m.stations) for m in s.members)
    if n > limits.MAX_STATIONS_PER_SURVEY:
        probs.append(
            Problem(
                "error",
                f"{n:,} stations in one survey is more than the limit of "
                f"{limits.MAX_STATIONS_PER_SURVEY:,}",
                where,
            )
        )
    probs += _dupes([m.id for m in s.members], "member", where)
    for m in s.members:
        probs += check_member(m, where)
    return probs


def check_member(m: Member, where: str = "") -> list[Problem]:
    """Problems of one member: span, section, rivet states, loads, and every station."""
    probs: list[Problem] = []
    w = join(where, m.place())
    L = _kind(m.span.value, m.span.unit, "length", join(w, "span"), probs)
    _range(L, 1.0, _MAX_SPAN_MM, "span", "mm", join(w, "span"), probs)
    if m.do is not None:
        do = _kind(m.do.value, m.do.unit, "length", join(w, "do"), probs)
        _range(
            do,
            1.0,
            L or _MAX_SPAN_MM,
            "stiffener spacing do",
            "mm (up to the span)",
            join(w, "do"),
            probs,
        )
    defn: SectionDefinition | None = None
    try:
        defn = m.definition()
    except AsfoundError as e:
        probs.append(Problem("error", f"section: {e}", w))
    pos_unit = m.position_unit
    f = _kind(1.0, pos_unit, "length", w, [])  # mm per position unit (its errors: header)
    total = 0
    for r in m.rivets:
        wl = join(w, f"rivet line {r.line!r}")
        if defn is not None and r.line not in {x.id for x in defn.rivet_lines}:
            known = [x.id for x in defn.rivet_lines]
            probs.append(Problem("error", f"unknown rivet line {r.line!r}; known: {known}", wl))
        try:
            total += r.count()
        except InputError as e:  # counted from the numbers: nothing was expanded
            probs.append(Problem("error", str(e), join(wl, "run") if r.run else wl))
            continue
        if r.run is not None and r.run.end < r.run.start:
            probs.append(
                Problem("error", f"run end {r.run.end:g} is before start {r.run.start:g}", wl)
            )
        line = next((x for x in defn.rivet_lines if x.id == r.line), None) if defn else None
        if r.run is not None:
            recorded = _kind(r.run.pitch, pos_unit, "length", wl, probs)
            lo, hi = limits.MIN_LENGTH_MM, limits.MAX_LENGTH_MM
            _range(recorded, lo, hi, "run pitch", "mm", wl, probs)
            if line is not None and recorded is not None and abs(recorded / line.pitch - 1) > 0.05:
                probs.append(
                    Problem(
                        "warning",
                        f"recorded rivet pitch {r.run.pitch:g} {pos_unit} "
                        f"({recorded:.4g} mm) differs from the drawing's pitch "
                        f"{line.pitch:.4g} mm by more than 5 %: the as-built section uses the "
                        "drawing's pitch, the as-found one the recorded rivets",
                        wl,
                    )
                )
        if L is None or f is None:
            continue
        beyond = [p for p, _state in r.expanded() if not -1e-6 <= p * f <= L + 1e-6]
        if beyond:
            more = f" (and {len(beyond) - 1:,} more on the line)" if len(beyond) > 1 else ""
            probs.append(
                Problem(
                    "error",
                    f"rivet at {beyond[0]:g} {pos_unit} is beyond the member (0 to "
                    f"{L / f:g} {pos_unit}){more}",
                    wl,
                )
            )
    if total > limits.MAX_RIVETS_PER_MEMBER:
        probs.append(
            Problem(
                "error",
                f"{total:,} rivets on the member's lines is more than the limit of "
                f"{limits.MAX_RIVETS_PER_MEMBER:,} rivets on one member",
                join(w, "rivets"),
            )
        )
    if m.simple_span is not None:
        ss, ws = m.simple_span, join(w, "simple_span")
        for name, q in (("dc", ss.dc), ("dw", ss.dw)):
            if q is not None:
                wq = join(ws, name)
                v = _kind(q.value, q.unit, "force_per_length", wq, probs)
                _range(v, 0.0, limits.MAX_FORCE_PER_LENGTH, name, "N/mm", wq, probs)
    if m.live_load is not None:
        probs += check_live_load(m, w)
    probs += check_details(m, L, where)
    probs += _dupes([s.id for s in m.stations], "station", w)
    for st in m.stations:
        probs += check_station(m, defn, st, L, where)
    return probs


def check_live_load(m: Member, w: str) -> list[Problem]:
    """Units and ranges of a member's live load data (vehicles, lever rule, L_phi)."""
    probs: list[Problem] = []
    ll, wl = m.live_load, join(w, "live_load")
    assert ll is not None
    for v in ll.vehicles:
        wv = join(wl, f"vehicle {v.name!r}")
        for i, a in enumerate(v.axles, start=1):
            wa = join(wv, f"axle #{i}")
            _range(
                _kind(a.load.value, a.load.unit, "force", wa, probs),
                0.0,
                1e7,
                "load",
                "N",
                wa,
                probs,
            )
            sp = _kind(a.spacing.value, a.spacing.unit, "length", wa, probs)
            _range(sp if i > 1 else None, 0.0, 1e5, "spacing", "mm", wa, probs)
    if ll.lever_rule is not None:
        lr = ll.lever_rule
        S = _kind(lr.spacing.value, lr.spacing.unit, "length", join(wl, "lever_rule"), probs)
        _range(S, 100.0, 1e5, "girder spacing", "mm", join(wl, "lever_rule"), probs)
        for ld in lr.loads:
            _kind(ld.offset.value, ld.offset.unit, "length", join(wl, "lever_rule"), probs)
    if ll.L_phi is not None:
        Lp = _kind(ll.L_phi.value, ll.L_phi.unit, "length", join(wl, "L_phi"), probs)
        _range(Lp, 100.0, _MAX_SPAN_MM, "L_phi", "mm", join(wl, "L_phi"), probs)
    return probs


def check_station(
    m: Member, defn: SectionDefinition | None, st: Station, L: float | None, where: str = ""
) -> list[Problem]:
    """Problems of one station: position, loads, readings, bands, perforations."""
    probs: list[Problem] = []
    w = join(where, m.place(st.id))
    x = _kind(st.position, m.position_unit, "length", join(w, "position"), probs)
    if x is not None and L is not None and not -1e-6 <= x <= L + 1e-6:
        Lp = L / to_internal(1.0, m.position_unit, "length")
        probs.append(
            Problem(
                "error",
                f"station position {st.position:g} {m.position_unit} is outside the member "
                f"(0 to {Lp:g} {m.position_unit})",
                join(w, "position"),
            )
        )
    if st.loads is not None:
        for name in ("DC", "DW", "LL_IM"):
            eff = getattr(st.loads, name)
            if eff is None:
                continue
            for sym, kind, top, unit in (
                ("V", "force", limits.MAX_FORCE_N, "N"),
                ("M", "moment", limits.MAX_MOMENT_NMM, "N mm"),
            ):
                q = getattr(eff, sym)
                if q is not None:
                    wq = join(w, "loads", name, sym)
                    _range(_kind(q.value, q.unit, kind, wq, probs), -top, top, sym, unit, wq, probs)
    probs += _dupes([r.id for r in st.readings], "reading", w)
    probs += _dupes([b.id for b in st.bands], "band", w)
    probs += _dupes([p.id for p in st.perforations], "perforation", w)
    if defn is None:
        return probs
    bands = {b.id: b for b in st.bands}
    good: dict[tuple[str, str | None], list[float]] = {}
    checks = ReadingChecks(m, defn, st, where)
    for r in st.readings:
        rp, v = checks(r)
        probs += rp
        if v is not None:
            good.setdefault((r.part, r.region), []).append(v)
    for (part, region), vals in good.items():
        if cov_clearly_within(vals):
            continue  # region_stats would have no note
        wr = join(w, f"part {part!r}", f"region {region!r}" if region else None)
        probs += region_stats(vals, defn.part(part).t, part=part, region=region, where=wr).notes
    lu = m.length_unit
    for kind, items in (("band", st.bands), ("perforation", st.perforations)):
        for b in items:
            probs += check_cut(m, defn, kind, b, w, lu, good)
    for b in bands.values():
        if b.id in ("h", "v"):
            probs.append(
                Problem(
                    "error",
                    "a band id may not be 'h' or 'v' (angle legs)",
                    join(w, f"band {b.id!r}"),
                )
            )
    return probs
