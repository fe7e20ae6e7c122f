"""Starting points for a new survey: the riveted girder template of core, with our own
starting dimensions (an invented, typical-looking girder the inspector edits on the
Member screen), and copies of the sample surveys in ``survey_samples/``.

The girder dimensions are the keyword arguments of :func:`core.definition.riveted_girder`
in the survey's length unit; the rivet runs along the member follow the nominal pitch.
"""

from __future__ import annotations

import datetime as _dt
import json
import math
from pathlib import Path

from core.definition import SectionDefinition
from core.sectionfile import definition_from_dict

#: starting dimensions per unit system (invented, edit on site): length unit, position unit
GIRDER_START: dict[str, dict] = {
    "si": {
        "length_unit": "mm",
        "position_unit": "m",
        "span": {"value": 15.0, "unit": "m"},
        "girder": {
            "D": 1200.0,
            "tw": 10.0,
            "angle_h": 150.0,
            "angle_v": 150.0,
            "angle_t": 14.0,
            "covers_top": [[380.0, 12.0]],
            "covers_bottom": [[380.0, 12.0]],
            "rivet_d": 22.0,
            "pitch_web": 100.0,
            "pitch_cover": 120.0,
        },
    },
    "us": {
        "length_unit": "in",
        "position_unit": "ft",
        "span": {"value": 50.0, "unit": "ft"},
        "girder": {
            "D": 48.0,
            "tw": 0.375,
            "angle_h": 6.0,
            "angle_v": 6.0,
            "angle_t": 0.5,
            "covers_top": [[14.0, 0.5]],
            "covers_bottom": [[14.0, 0.5]],
            "rivet_d": 0.875,
            "pitch_web": 4.0,
            "pitch_cover": 6.0,
        },
    },
}

#: the editable main dimensions of the girder template: (key, label)
GIRDER_FIELDS: tuple[tuple[str, str], ...] = (
    ("D", "Web depth"),
    ("tw", "Web thickness"),
    ("angle_h", "Angle, horizontal leg"),
    ("angle_v", "Angle, vertical leg"),
    ("angle_t", "Angle thickness"),
    ("cover_top_b", "Top cover width"),
    ("cover_top_t", "Top cover thick"),
    ("cover_bottom_b", "Bottom cover width"),
    ("cover_bottom_t", "Bottom cover thick"),
    ("rivet_d", "Rivet diameter"),
    ("pitch_web", "Pitch, web rivets"),
    ("pitch_cover", "Pitch, cover rivets"),
)


def header(survey_id: str, system: str, inspector: str = "") -> dict:
    """A survey header for a new survey in unit system ``system`` ("si" or "us")."""
    start = GIRDER_START[system]
    return {
        "id": survey_id,
        "title": "",
        "inspector": inspector,
        "dates": [_dt.date.today().isoformat()],
        "unit_system": system,
        "standard": "aashto",
        "length_unit": start["length_unit"],
        "position_unit": start["position_unit"],
    }


def rivet_runs(defn: SectionDefinition, span: float, pitch_scale: float) -> list[dict]:
    """A run of sound rivets for every rivet line of ``defn``: first rivet half a pitch from
    the end, at the nominal pitch. ``span`` in the position unit; ``pitch_scale`` converts
    mm to the position unit."""
    out = []
    for ln in defn.rivet_lines:
        p = ln.pitch * pitch_scale
        n = max(math.floor((span - p) / p + 1e-9), 0)
        out.append(
            {
                "line": ln.id,
                "run": {"start": p / 2, "end": p / 2 + n * p, "pitch": p, "state": "sound"},
                "states": [],
            }
        )
    return out


def girder_member(member_id: str, system: str) -> dict:
    """A member from the girder template with the starting dimensions of ``system``."""
    from core.units import from_internal

    start = GIRDER_START[system]
    section = {"name": f"member {member_id}", "girder": dict(start["girder"])}
    defn = definition_from_dict(section, start["length_unit"])
    scale = from_internal(1.0, "length", start["position_unit"])
    return {
        "id": member_id,
        "label": "",
        "span": dict(start["span"]),
        "section": section,
        "rivets": rivet_runs(defn, start["span"]["value"], scale),
    }


def girder_values(girder: dict) -> dict[str, float | None]:
    """The editable fields (see :data:`GIRDER_FIELDS`) of a ``section.girder`` object."""
    out: dict[str, float | None] = {k: girder.get(k) for k, _ in GIRDER_FIELDS}
    for side in ("top", "bottom"):
        covers = girder.get(f"covers_{side}")
        if covers is None and side == "bottom":
            covers = girder.get("covers_top")
        first = covers[0] if covers else (None, None)
        out[f"cover_{side}_b"], out[f"cover_{side}_t"] = first[0], first[1]
    return out


def with_values(girder: dict, values: dict[str, float | None]) -> dict:
    """A copy of ``girder`` with the editable fields set (an empty cover width or thickness
    removes the first cover plate of that flange; further cover plates are kept)."""
    g = dict(girder)
    for k, _ in GIRDER_FIELDS:
        if k.startswith("cover_"):
            continue
        if values.get(k) is not None:
            g[k] = values[k]
    for side in ("top", "bottom"):
        covers = g.get(f"covers_{side}")
        if covers is None and side == "bottom":
            covers = g.get("covers_top")
        rest = [list(c) for c in (covers or [])[1:]]
        b, t = values.get(f"cover_{side}_b"), values.get(f"cover_{side}_t")
        g[f"covers_{side}"] = ([[b, t]] if b and t else []) + rest
    return g


def sample_files(folder: Path) -> list[Path]:
    """Survey documents (format ``asfound.survey``) in a samples folder that core accepts
    (a sample of deliberate mistakes is left out)."""
    from core.errors import AsfoundError
    from core.survey import check_file, errors

    out = []
    for p in sorted(folder.glob("*.json")) if folder.is_dir() else []:
        try:
            head = json.loads(p.read_text(encoding="utf-8"))
            if not (isinstance(head, dict) and head.get("format") == "asfound.survey"):
                continue
            model, problems = check_file(p)
        except (OSError, ValueError, AsfoundError):
            continue
        if model is not None and not errors(problems):
            out.append(p)
    return out


def samples_folder() -> Path:
    """The ``survey_samples`` folder of the source tree."""
    return Path(__file__).resolve().parent.parent / "survey_samples"
