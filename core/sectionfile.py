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
from pathlib import Path
from typing import Any

from core.definition import (
    LossBand,
    PartThickness,
    Perforation,
    RivetLine,
    SectionDefinition,
    StationLoss,
    riveted_girder,
)
from core.errors import InputError, SchemaError
from core.parts import Angle, Plate
from core.units import to_internal

FORMAT = "asfound.section"
VERSION = 1

_GIRDER_LENGTHS = {
    "D",
    "tw",
    "angle_h",
    "angle_v",
    "angle_t",
    "web_recess",
    "rivet_d",
    "rivet_hole",
    "pitch_web",
    "pitch_cover",
    "gauge_web",
    "gauge_cover",
}
_PLATE_LENGTHS = ("b", "t", "x", "y")
_ANGLE_LENGTHS = ("b_h", "b_v", "t", "x", "y")
_LINE_LENGTHS = ("position", "d", "d_hole", "pitch")


def _need(d: Any, key: str, where: str) -> Any:
    if not isinstance(d, dict):
        raise SchemaError(f"expected an object, found {type(d).__name__}", where=where)
    if key not in d:
        raise SchemaError(f"missing required key {key!r}", where=where)
    return d[key]


def _len(v: Any, unit: str, where: str) -> float:
    return to_internal(v, unit, "length", where=where)


def definition_from_dict(sec: dict, length_unit: str = "mm", where: str = "") -> SectionDefinition:
    """Build a :class:`SectionDefinition` (mm) from a ``section`` object.

    Raises:
        SchemaError: missing keys or wrong types; GeometryError: invalid dimensions.
    """
    if not isinstance(sec, dict):
        raise SchemaError("'section' must be an object", where=where)
    name = str(sec.get("name", "section"))
    parts: list = []
    lines: list[RivetLine] = []
    if sec.get("girder") is not None:
        g = dict(sec["girder"])
        kw: dict[str, Any] = {"name": name}
        w = f"{where} / girder" if where else "girder"
        for k, v in g.items():
            if k in _GIRDER_LENGTHS:
                kw[k] = None if v is None else _len(v, length_unit, f"{w} / {k}")
            elif k in ("covers_top", "covers_bottom"):
                kw[k] = (
                    None
                    if v is None
                    else tuple(
                        (
                            _len(c[0], length_unit, f"{w} / {k}"),
                            _len(c[1], length_unit, f"{w} / {k}"),
                        )
                        for c in v
                    )
                )
            elif k == "angle_bottom":
                kw[k] = None if v is None else tuple(_len(c, length_unit, f"{w} / {k}") for c in v)
            else:
                raise SchemaError(f"unknown girder key {k!r}", where=w)
        try:
            base = riveted_girder(**kw)
        except TypeError as e:
            raise SchemaError(f"girder template: {e}", where=w) from None
        parts.extend(base.parts)
        lines.extend(base.rivet_lines)
    for i, p in enumerate(sec.get("parts", []) or []):
        w = f"{where} / parts[{i}]"
        kind = _need(p, "kind", w)
        if kind == "plate":
            vals = {k: _len(_need(p, k, w), length_unit, f"{w} / {k}") for k in _PLATE_LENGTHS}
            parts.append(
                Plate(
                    str(_need(p, "id", w)),
                    orientation=p.get("orientation", "horizontal"),
                    kept_face=p.get("kept_face", "centre"),
                    role=p.get("role", "plate"),
                    **vals,
                )
            )
        elif kind == "angle":
            vals = {k: _len(_need(p, k, w), length_unit, f"{w} / {k}") for k in _ANGLE_LENGTHS}
            parts.append(
                Angle(
                    str(_need(p, "id", w)),
                    dir_x=int(p.get("dir_x", 1)),
                    dir_y=int(p.get("dir_y", 1)),
                    role=p.get("role", "angle"),
                    **vals,
                )
            )
        else:
            raise SchemaError(f"part kind {kind!r} is not 'plate' or 'angle'", where=w)
    for i, r in enumerate(sec.get("rivet_lines", []) or []):
        w = f"{where} / rivet_lines[{i}]"
        vals = {k: _len(_need(r, k, w), length_unit, f"{w} / {k}") for k in _LINE_LENGTHS}
        line = RivetLine(
            str(_need(r, "id", w)),
            _need(r, "axis", w),
            parts=tuple(_need(r, "parts", w)),
            shear_planes=int(r.get("shear_planes", 1)),
            outside=tuple(r.get("outside", ())),
            n_lines=int(r.get("n_lines", 1)),
            **vals,
        )
        lines = [x for x in lines if x.id != line.id] + [line]
    return SectionDefinition(tuple(parts), tuple(lines), name)


def loss_from_dict(loss: dict | None, length_unit: str = "mm", where: str = "") -> StationLoss:
    """Build a :class:`StationLoss` (mm) from a ``loss`` object (``None`` means no loss)."""
    if loss is None:
        return StationLoss(where=where)
    if not isinstance(loss, dict):
        raise SchemaError("'loss' must be an object", where=where)
    th = []
    for i, e in enumerate(loss.get("thickness", []) or []):
        w = f"{where} / thickness[{i}]"
        th.append(
            PartThickness(
                str(_need(e, "part", w)), _len(_need(e, "t", w), length_unit, w), e.get("leg")
            )
        )
    bands = []
    for i, e in enumerate(loss.get("bands", []) or []):
        w = f"{where} / bands[{i}]"
        bands.append(
            LossBand(
                str(_need(e, "part", w)),
                _len(_need(e, "lo", w), length_unit, w),
                _len(_need(e, "hi", w), length_unit, w),
                _len(_need(e, "t", w), length_unit, w),
            )
        )
    perfs = []
    for i, e in enumerate(loss.get("perforations", []) or []):
        w = f"{where} / perforations[{i}]"
        perfs.append(
            Perforation(
                str(_need(e, "part", w)),
                _len(_need(e, "lo", w), length_unit, w),
                _len(_need(e, "hi", w), length_unit, w),
            )
        )
    return StationLoss(tuple(th), tuple(bands), tuple(perfs), where=where)


def load_section_file(
    path: str | Path,
) -> tuple[SectionDefinition, StationLoss, float | None, dict]:
    """Read a section description file.

    Returns:
        (definition, loss, V in N or None, the raw document).

    Raises:
        SchemaError: unreadable, malformed JSON, wrong format name or a newer version.
    """
    p = Path(path)
    where = str(p)
    try:
        doc = json.loads(p.read_text(encoding="utf-8"))
    except FileNotFoundError:
        raise InputError("file not found", where=where) from None
    except (OSError, UnicodeDecodeError) as e:
        raise SchemaError(f"cannot read the file: {e}", where=where) from None
    except json.JSONDecodeError as e:
        raise SchemaError(
            f"not valid JSON (line {e.lineno}, column {e.colno}: {e.msg})", where=where
        ) from None
    if not isinstance(doc, dict) or doc.get("format") != FORMAT:
        raise SchemaError(
            f"not an asfound section description (expected format {FORMAT!r})", where=where
        )
    ver = doc.get("version")
    if not isinstance(ver, int) or ver < 1 or ver > VERSION:
        raise SchemaError(
            f"version {ver!r} is not supported (this asfound reads version 1 to {VERSION})",
            where=where,
        )
    unit = str(doc.get("length_unit", "mm"))
    sec = dict(_need(doc, "section", where))
    sec.setdefault("name", doc.get("name", p.stem))
    defn = definition_from_dict(sec, unit, f"{where} / section")
    loss = loss_from_dict(doc.get("loss"), unit, f"{where} / loss")
    V = None
    if doc.get("shear") is not None:
        s = doc["shear"]
        V = to_internal(
            _need(s, "V", f"{where} / shear"),
            str(s.get("unit", "N")),
            "force",
            where=f"{where} / shear / V",
        )
    return defn, loss, V, doc
