"""The section description document (JSON of our own design, ``asfound.section`` version 1).

A section description gives the as-built parts (directly or through the riveted girder
template), the rivet lines, optionally the loss found at one station, and optionally a
shear force for the stress profile. The survey file embeds the same ``section`` and
``loss`` objects. All lengths are in ``length_unit`` ("mm" or "in", or any pint length).

Example (lengths in mm)::

    {
      "format": "asfound.section", "version": 1, "name": "demo girder",
      "length_unit": "mm",
      "section": {
        "girder": {"D": 1200, "tw": 10, "angle_h": 150, "angle_v": 150, "angle_t": 12,
                   "covers_top": [[360, 12]], "rivet_d": 22, "pitch_web": 100},
        "parts": [], "rivet_lines": []
      },
      "loss": {"thickness": [{"part": "web", "t": 8.5}],
               "bands": [{"part": "web", "lo": 150, "hi": 230, "t": 5.0}],
               "perforations": [{"part": "web", "lo": 170, "hi": 190}]},
      "shear": {"V": 400, "unit": "kN"}
    }

``section.girder`` takes the keyword arguments of :func:`core.definition.riveted_girder`;
``section.parts`` lists extra (or, without a girder, all) parts: ``{"kind": "plate", "id",
"b", "t", "x", "y", "orientation", "kept_face", "role"}`` or ``{"kind": "angle", "id",
"b_h", "b_v", "t", "x", "y", "dir_x", "dir_y", "role"}``; ``section.rivet_lines`` lists
``{"id", "axis", "position", "d", "d_hole", "pitch", "parts", "shear_planes", "outside",
"n_lines"}`` (added to, or replacing by id, the template's lines).
"""

from __future__ import annotations

import json
import math
from collections.abc import Iterator
from contextlib import contextmanager
from pathlib import Path
from typing import Any

from core import limits
from core.definition import (
    LossBand,
    PartThickness,
    Perforation,
    RivetLine,
    SectionDefinition,
    StationLoss,
    riveted_girder,
)
from core.errors import GeometryError, SchemaError
from core.jsonfile import read_json
from core.parts import Angle, Plate
from core.units import to_internal

FORMAT = "asfound.section"
VERSION = 1

#: girder template keys that are sizes (positive lengths) and the one that may be zero
_GIRDER_SIZES = {
    "D",
    "tw",
    "angle_h",
    "angle_v",
    "angle_t",
    "rivet_d",
    "rivet_hole",
    "pitch_web",
    "pitch_cover",
    "gauge_web",
    "gauge_cover",
}
_GIRDER_ZERO_OK = {"web_recess"}
_PLATE_SIZES, _PLATE_COORDS = ("b", "t"), ("x", "y")
_ANGLE_SIZES, _ANGLE_COORDS = ("b_h", "b_v", "t"), ("x", "y")
_LINE_SIZES, _LINE_COORDS = ("d", "d_hole", "pitch"), ("position",)


@contextmanager
def _at(where: str) -> Iterator[None]:
    """Give an engine object's error (a part, a rivet line: they know only their own name)
    the place in the file."""
    try:
        yield
    except GeometryError as e:
        if where and not str(e).startswith(where):
            raise GeometryError(str(e), where=where) from None
        raise


def _need(d: Any, key: str, where: str) -> Any:
    if not isinstance(d, dict):
        raise SchemaError(f"expected an object, found {type(d).__name__}", where=where)
    if key not in d:
        raise SchemaError(f"missing required key {key!r}", where=where)
    return d[key]


def _items(v: Any, limit: int, what: str, where: str) -> list:
    """A list (None or absent: empty) of at most ``limit`` items."""
    if v is None:
        return []
    if not isinstance(v, list):
        raise SchemaError(f"{what} must be a list, found {type(v).__name__}", where=where)
    limits.count(len(v), limit, what, where)
    return v


def _text(v: Any, name: str, where: str) -> str:
    if not isinstance(v, str) or not v:
        raise SchemaError(f"{name} must be a non-empty text, found {v!r:.40}", where=where)
    limits.count(len(v), limits.MAX_TEXT, f"characters of {name}", where)
    return v


def _int(v: Any, name: str, where: str) -> int:
    """A small whole number (a direction, a count of shear planes or lines)."""
    ok = isinstance(v, int | float) and not isinstance(v, bool)
    if not ok or not math.isfinite(v) or abs(v) > 1000 or v != int(v):
        raise SchemaError(
            f"{name} = {v!r:.40} is not a whole number from -1000 to 1000", where=where
        )
    return int(v)


def _len(v: Any, unit: str, where: str) -> float:
    return to_internal(v, unit, "length", where=where)


def _size(v: Any, unit: str, where: str, *, allow_zero: bool = False) -> float:
    """A size (thickness, width, pitch) in mm, within the physical range of core.limits."""
    name = where.rsplit(" / ", 1)[-1]
    return limits.size(_len(v, unit, where), name, where, allow_zero=allow_zero)


def _coord(v: Any, unit: str, where: str) -> float:
    name = where.rsplit(" / ", 1)[-1]
    return limits.coord(_len(v, unit, where), name, where)


def _sizes(v: Any, n: int, unit: str, where: str) -> tuple[float, ...]:
    """A list of exactly ``n`` sizes (a cover plate's width and thickness, an angle's legs)."""
    if not isinstance(v, list | tuple) or len(v) != n:
        raise SchemaError(f"expected a list of {n} numbers, found {v!r:.60}", where=where)
    return tuple(_size(x, unit, where) for x in v)


def definition_from_dict(sec: dict, length_unit: str = "mm", where: str = "") -> SectionDefinition:
    """Build a :class:`SectionDefinition` (mm) from a ``section`` object.

    Sizes must lie within 0.01 mm to 1 km and coordinates within +/- 1 km
    (:mod:`core.limits`); a section has at most :data:`core.limits.MAX_PARTS` parts and
    rivet lines (each).

    Raises:
        SchemaError: missing keys or wrong types; InputError: values out of range;
        GeometryError: invalid dimensions.
    """
    if not isinstance(sec, dict):
        raise SchemaError("'section' must be an object", where=where)
    name = str(sec.get("name", "section"))[: limits.MAX_TEXT]
    parts: list = []
    lines: list[RivetLine] = []
    if sec.get("girder") is not None:
        w = f"{where} / girder" if where else "girder"
        g = sec["girder"]
        if not isinstance(g, dict):
            raise SchemaError(f"expected an object, found {type(g).__name__}", where=w)
        kw: dict[str, Any] = {"name": name}
        for k, v in g.items():
            wk = f"{w} / {k}"
            if v is None and k in (_GIRDER_SIZES | _GIRDER_ZERO_OK | {"angle_bottom"}):
                kw[k] = None
            elif k in _GIRDER_SIZES:
                kw[k] = _size(v, length_unit, wk)
            elif k in _GIRDER_ZERO_OK:
                kw[k] = _size(v, length_unit, wk, allow_zero=True)
            elif k in ("covers_top", "covers_bottom"):
                covers = _items(v, limits.MAX_PARTS, "cover plates", wk)
                kw[k] = (
                    None
                    if v is None
                    else tuple(
                        _sizes(c, 2, length_unit, f"{wk}[{i}]") for i, c in enumerate(covers)
                    )
                )
            elif k == "angle_bottom":
                kw[k] = _sizes(v, 3, length_unit, wk)
            else:
                raise SchemaError(f"unknown girder key {k!r}", where=w)
        try:
            with _at(w):
                base = riveted_girder(**kw)
        except TypeError as e:
            raise SchemaError(f"girder template: {e}", where=w) from None
        parts.extend(base.parts)
        lines.extend(base.rivet_lines)
    for i, p in enumerate(_items(sec.get("parts"), limits.MAX_PARTS, "parts", where)):
        w = f"{where} / parts[{i}]"
        kind = _need(p, "kind", w)
        if kind == "plate":
            vals = {k: _size(_need(p, k, w), length_unit, f"{w} / {k}") for k in _PLATE_SIZES}
            vals |= {k: _coord(_need(p, k, w), length_unit, f"{w} / {k}") for k in _PLATE_COORDS}
            pid = _text(_need(p, "id", w), "id", w)
            with _at(w):
                plate = Plate(
                    pid,
                    orientation=p.get("orientation", "horizontal"),
                    kept_face=p.get("kept_face", "centre"),
                    role=str(p.get("role", "plate")),
                    **vals,
                )
            parts.append(plate)
        elif kind == "angle":
            vals = {k: _size(_need(p, k, w), length_unit, f"{w} / {k}") for k in _ANGLE_SIZES}
            vals |= {k: _coord(_need(p, k, w), length_unit, f"{w} / {k}") for k in _ANGLE_COORDS}
            pid = _text(_need(p, "id", w), "id", w)
            dirs = {k: _int(p.get(k, 1), k, w) for k in ("dir_x", "dir_y")}
            with _at(w):
                angle = Angle(pid, role=str(p.get("role", "angle")), **dirs, **vals)
            parts.append(angle)
        else:
            raise SchemaError(f"part kind {kind!r:.40} is not 'plate' or 'angle'", where=w)
    for i, r in enumerate(_items(sec.get("rivet_lines"), limits.MAX_PARTS, "rivet lines", where)):
        w = f"{where} / rivet_lines[{i}]"
        vals = {k: _size(_need(r, k, w), length_unit, f"{w} / {k}") for k in _LINE_SIZES}
        vals |= {k: _coord(_need(r, k, w), length_unit, f"{w} / {k}") for k in _LINE_COORDS}
        kw = {
            "parts": _ids(_need(r, "parts", w), f"{w} / parts"),
            "shear_planes": _int(r.get("shear_planes", 1), "shear_planes", w),
            "outside": _ids(r.get("outside", []), f"{w} / outside"),
            "n_lines": _int(r.get("n_lines", 1), "n_lines", w),
        }
        with _at(w):
            line = RivetLine(_text(_need(r, "id", w), "id", w), _need(r, "axis", w), **kw, **vals)
        lines = [x for x in lines if x.id != line.id] + [line]
    with _at(where):
        return SectionDefinition(tuple(parts), tuple(lines), name)


def _ids(v: Any, where: str) -> tuple[str, ...]:
    return tuple(_text(x, "part id", where) for x in _items(v, limits.MAX_PARTS, "part ids", where))


def loss_from_dict(loss: dict | None, length_unit: str = "mm", where: str = "") -> StationLoss:
    """Build a :class:`StationLoss` (mm) from a ``loss`` object (``None`` means no loss).

    Raises:
        SchemaError: wrong types or too many entries; InputError / GeometryError: values
        out of range.
    """
    if loss is None:
        return StationLoss(where=where)
    if not isinstance(loss, dict):
        raise SchemaError("'loss' must be an object", where=where)
    th = []
    for i, e in enumerate(_items(loss.get("thickness"), limits.MAX_READINGS, "thickness", where)):
        w = f"{where} / thickness[{i}]"
        part, t = (
            _text(_need(e, "part", w), "part", w),
            _size(_need(e, "t", w), length_unit, f"{w} / t"),
        )
        with _at(w):
            th.append(PartThickness(part, t, e.get("leg")))
    bands = []
    for i, e in enumerate(_items(loss.get("bands"), limits.MAX_CUTS, "bands", where)):
        w = f"{where} / bands[{i}]"
        part = _text(_need(e, "part", w), "part", w)
        lo = _coord(_need(e, "lo", w), length_unit, f"{w} / lo")
        hi = _coord(_need(e, "hi", w), length_unit, f"{w} / hi")
        t = _size(_need(e, "t", w), length_unit, f"{w} / t", allow_zero=True)
        with _at(w):
            bands.append(LossBand(part, lo, hi, t, e.get("leg")))
    perfs = []
    for i, e in enumerate(_items(loss.get("perforations"), limits.MAX_CUTS, "perforations", where)):
        w = f"{where} / perforations[{i}]"
        part = _text(_need(e, "part", w), "part", w)
        lo = _coord(_need(e, "lo", w), length_unit, f"{w} / lo")
        hi = _coord(_need(e, "hi", w), length_unit, f"{w} / hi")
        with _at(w):
            perfs.append(Perforation(part, lo, hi))
    return StationLoss(tuple(th), tuple(bands), tuple(perfs), where=where)


def load_section_file(
    path: str | Path,
) -> tuple[SectionDefinition, StationLoss, float | None, dict]:
    """Read a section description file.

    Returns:
        (definition, loss, V in N or None, the raw document).

    Raises:
        SchemaError: unreadable, malformed JSON, wrong format name, a newer version, or a
        malformed section; InputError: a value out of range (the message names the place).
    """
    p = Path(path)
    where = str(p)
    doc = read_json(p, "section description")
    if not isinstance(doc, dict) or doc.get("format") != FORMAT:
        raise SchemaError(
            f"not an asfound section description (expected format {FORMAT!r})", where=where
        )
    ver = doc.get("version")
    if not isinstance(ver, int) or isinstance(ver, bool) or ver < 1 or ver > VERSION:
        raise SchemaError(
            f"version {ver!r} is not supported (this asfound reads version 1 to {VERSION})",
            where=where,
        )
    unit = str(doc.get("length_unit", "mm"))
    sec = _need(doc, "section", where)
    if not isinstance(sec, dict):
        raise SchemaError(f"'section' must be an object, found {type(sec).__name__}", where=where)
    sec = dict(sec)
    sec.setdefault("name", doc.get("name", p.stem))
    defn = definition_from_dict(sec, unit, f"{where} / section")
    loss = loss_from_dict(doc.get("loss"), unit, f"{where} / loss")
    V = None
    if doc.get("shear") is not None:
        s = doc["shear"]
        w = f"{where} / shear / V"
        V = to_internal(
            _need(s, "V", f"{where} / shear"), str(s.get("unit", "N")), "force", where=w
        )
        limits.within(V, -limits.MAX_FORCE_N, limits.MAX_FORCE_N, "V", "N", w)
    return defn, loss, V, doc


#: section definitions already built, by the text of their section object (the definition is
#: frozen, so one object serves every caller; a section that fails is never kept)
_DEFINITIONS: dict[tuple[str, str, str], SectionDefinition] = {}
_MAX_DEFINITIONS = 256


def built_definition(sec: dict[str, Any], unit: str, place: str) -> SectionDefinition:
    """:func:`definition_from_dict` of ``sec``, built once per distinct section object (its
    JSON text, unit and place): every station of a member shares one frozen definition.

    Raises:
        SchemaError / GeometryError / UnitError: as :func:`definition_from_dict`.
    """
    try:
        key = (json.dumps(sec, allow_nan=True), unit, place)
    except (TypeError, ValueError, RecursionError):  # not plain JSON data: build it each time
        return definition_from_dict(sec, unit, place)
    found = _DEFINITIONS.get(key)
    if found is None:
        found = definition_from_dict(sec, unit, place)
        if len(_DEFINITIONS) >= _MAX_DEFINITIONS:
            _DEFINITIONS.clear()
        _DEFINITIONS[key] = found
    return found
