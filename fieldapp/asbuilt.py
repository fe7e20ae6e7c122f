"""The as-built values of a member and of its survey, as rows to edit on site (no kivy).

Each :class:`Row` says where its value lives (``key``), what it is, and how it is typed
(the pad, a text line, or a tap through a short list of choices). :func:`apply` turns the
typed text into a change of the member or the survey header and hands it to core's
field store (``update_member`` / ``update_header``), which validates it, refuses a bad
value with its own message and keeps the history. Nothing is computed here: the steel's
consequence (:func:`material_words`) is core's own :func:`core.families.material.resolve_material`.

Keys:
  ``("member", field)``    label, span, do, condition, structure_type
  ``("header", field)``    standard, year_built, Fy, Fu
  ``("girder", field)``    a value of the girder template (see :data:`GIRDER_MORE`)
  ``("bottom_angle", i)``  h, v, t (i = 0, 1, 2) of the bottom angles when they differ
  ``("cover", side, i, j)`` width (j = 0) or thickness (j = 1) of cover plate i of a flange
  ``("stiffener", i, field)`` a value of stiffener i (see :data:`STIFFENER_FIELDS`)
  ``("bracing", side, field)`` kind or points of the top or bottom flange's bracing
  ``("load", field)``      dc, dw (simple span), distribution (live load per girder)
"""

from __future__ import annotations

from dataclasses import dataclass

from core.errors import InputError
from core.families.material import resolve_material
from core.survey.model import STRUCTURE_TYPES as MODEL_STRUCTURE_TYPES
from core.survey.store import Saved
from core.units import show
from fieldapp import templates
from fieldapp.session import Session, parse_number

NOT_SET = "not set"
STANDARDS = ("aashto", "aisc", "en1993")
CONDITIONS = (NOT_SET, "good", "fair", "poor")
STRUCTURE_TYPES = (NOT_SET, *MODEL_STRUCTURE_TYPES)
BRACING_KINDS = ("none", "continuous", "discrete", "u_frames")
LOAD_UNIT = {"us": "kip/ft", "si": "kN/m"}
STRESS_UNIT = {"us": "ksi", "si": "MPa"}

#: further girder template values (key, label, optional: an empty value removes it)
GIRDER_MORE = (
    ("web_recess", "Web recess above the angle backs", True),
    ("rivet_hole", "Rivet hole diameter", True),
    ("gauge_web", "Gauge, web rivets", True),
    ("gauge_cover", "Gauge, cover rivets", True),
)
BOTTOM_ANGLE = ("horizontal leg", "vertical leg", "thickness")
#: stiffener values (field, label, kind, choices)
STIFFENER_FIELDS = (
    ("position", "position", "number", ()),
    ("role", "role", "choice", ("intermediate", "bearing")),
    ("kind", "made of", "choice", ("plates", "angles")),
    ("b", "outstanding width", "number", ()),
    ("t", "thickness", "number", ()),
    ("b_conn", "connected leg", "number", ()),
    ("per_side", "pieces per side", "choice", ("1", "2")),
    ("sides", "sides of the web", "choice", ("2", "1")),
    ("t_fill", "filler thickness", "number", ()),
    ("clip", "corner clip", "number", ()),
    ("connection", "connection", "choice", ("riveted", "welded")),
)


@dataclass(frozen=True)
class Row:
    """One value shown and edited: ``kind`` is "number" (the pad), "text" or "choice"
    (a tap takes the next of ``choices``)."""

    key: tuple
    label: str
    text: str
    unit: str = ""
    kind: str = "number"
    choices: tuple[str, ...] = ()
    optional: bool = False


def _n(v) -> str:
    return "" if v is None else f"{v:g}"


def _stored(s: Session) -> dict:
    """The member as stored (a document object, without its stations)."""
    data = s.member().model_dump(mode="json")
    data.pop("stations", None)
    return data


def groups(s: Session) -> list[tuple[str, list[Row]]]:
    """The headed groups of rows of the current member and its survey."""
    m, h = _stored(s), s.header
    lu, pu, sysu = s.length_unit, s.position_unit, h.get("unit_system", "si")
    out = [("Member", _member_rows(m, lu)), ("Steel and standard", _steel_rows(h, sysu))]
    g = (m.get("section") or {}).get("girder")
    if g is not None:
        out.append(("Section, further values", _girder_rows(g, lu)))
        for side in ("top", "bottom"):
            out.append((f"Cover plates, {side} flange", _cover_rows(g, side, lu)))
    for i, st in enumerate(m.get("stiffeners") or []):
        rows = [Row(("stiffener", i, f), lab, _stiff_text(st.get(f)),
                    pu if f == "position" else ("" if kind == "choice" else lu), kind, ch,
                    optional=f == "b_conn")
                for f, lab, kind, ch in STIFFENER_FIELDS]  # fmt: skip
        out.append((f"Stiffener {st['id']}", rows))
    out.append(("Bracing", _bracing_rows(m.get("bracing") or {}, pu)))
    out.append(("Loads", _load_rows(m, sysu)))
    return out


def _stiff_text(v) -> str:
    return _n(v) if isinstance(v, float) else ("" if v is None else str(v))


def _member_rows(m: dict, lu: str) -> list[Row]:
    span, do = m["span"], m.get("do")
    return [
        Row(("member", "label"), "Name shown", m.get("label") or "", kind="text"),
        Row(("member", "span"), "Span", _n(span["value"]), span["unit"]),
        Row(
            ("member", "do"),
            "Stiffener spacing do",
            _n(do and do["value"]),
            (do or {}).get("unit", lu),
            optional=True,
        ),
        Row(
            ("member", "condition"),
            "Condition",
            m.get("condition") or NOT_SET,
            kind="choice",
            choices=CONDITIONS,
        ),
        Row(
            ("member", "structure_type"),
            "Structure type",
            m.get("structure_type") or NOT_SET,
            kind="choice",
            choices=STRUCTURE_TYPES,
        ),
    ]


def _steel_rows(h: dict, sysu: str) -> list[Row]:
    mat = h.get("material") or {}
    su = STRESS_UNIT[sysu]
    fy, fu = mat.get("Fy") or {}, mat.get("Fu") or {}
    return [
        Row(
            ("header", "standard"),
            "Standard family",
            h.get("standard", "aashto"),
            kind="choice",
            choices=STANDARDS,
        ),
        Row(("header", "year_built"), "Year built", _n(h.get("year_built")), optional=True),
        Row(
            ("header", "Fy"),
            "Yield strength Fy (empty: assumed)",
            _n(fy.get("value")),
            fy.get("unit", su),
            optional=True,
        ),
        Row(
            ("header", "Fu"),
            "Tensile strength Fu (empty: assumed)",
            _n(fu.get("value")),
            fu.get("unit", su),
            optional=True,
        ),
    ]


def _girder_rows(g: dict, lu: str) -> list[Row]:
    rows = [Row(("girder", k), lab, _n(g.get(k)), lu, optional=opt) for k, lab, opt in GIRDER_MORE]
    bottom = g.get("angle_bottom")
    for i, lab in enumerate(BOTTOM_ANGLE):
        v = bottom[i] if bottom else None
        rows.append(Row(("bottom_angle", i), f"Bottom angles, {lab} (empty: as top)",
                        _n(v), lu, optional=True))  # fmt: skip
    return rows


def covers_of(g: dict, side: str) -> list[list[float]]:
    """The cover plates of a flange, from the angles outwards (bottom: the top's when not
    given apart, as in core's template)."""
    covers = g.get(f"covers_{side}")
    if covers is None and side == "bottom":
        covers = g.get("covers_top")
    return [list(c) for c in covers or []]


def _cover_rows(g: dict, side: str, lu: str) -> list[Row]:
    rows = []
    for i, (b, t) in enumerate(covers_of(g, side)):
        rows.append(Row(("cover", side, i, 0), f"Plate {i + 1} width", _n(b), lu))
        rows.append(Row(("cover", side, i, 1), f"Plate {i + 1} thickness", _n(t), lu))
    return rows


def _bracing_rows(b: dict, pu: str) -> list[Row]:
    rows = []
    for side in ("top", "bottom"):
        f = b.get(side) or {}
        rows.append(Row(("bracing", side, "kind"), f"{side.title()} flange bracing",
                        f.get("kind", "none"), kind="choice", choices=BRACING_KINDS))  # fmt: skip
        pts = f.get("points") or ((f.get("u_frames") or {}).get("positions") or [])
        rows.append(Row(("bracing", side, "points"), f"{side.title()} braced at ({pu}, a, b, ...)",
                        ", ".join(_n(p) for p in pts), kind="text"))  # fmt: skip
    return rows


def _load_rows(m: dict, sysu: str) -> list[Row]:
    ss = m.get("simple_span") or {}
    live = m.get("live_load") or {}
    lu = LOAD_UNIT[sysu]
    return [
        Row(
            ("load", "dc"),
            "Dead load DC per girder",
            _n((ss.get("dc") or {}).get("value")),
            (ss.get("dc") or {}).get("unit", lu),
            optional=True,
        ),
        Row(
            ("load", "dw"),
            "Wearing surface DW per girder",
            _n((ss.get("dw") or {}).get("value")),
            (ss.get("dw") or {}).get("unit", lu),
            optional=True,
        ),
        Row(
            ("load", "distribution"),
            "Live load lanes per girder",
            _n(live.get("distribution")),
            optional=True,
        ),
    ]


def next_choice(row: Row) -> str:
    ch = row.choices
    return ch[(ch.index(row.text) + 1) % len(ch)] if row.text in ch else ch[0]


def _num(row: Row, text: str) -> float | None:
    if not (text or "").strip():
        if row.optional:
            return None
        raise InputError(f"{row.label}: a value is needed here")
    return parse_number(text, row.label)


def apply(s: Session, row: Row, text: str) -> Saved:
    """Store ``text`` typed for ``row`` through core's field store.

    Raises:
        InputError: not a number, or core refuses the value (its message names it).
    """
    kind = row.key[0]
    if row.key == ("member", "label"):  # one way to rename: the same checks as Rename
        from fieldapp.members import rename_member

        return rename_member(s, text)
    if kind == "header":
        return s.store.update_header(_header_change(s.header, row, text), s.who)
    m = _stored(s)
    if kind == "member":
        _member_change(m, row, text)
    elif kind in ("girder", "bottom_angle", "cover"):
        m["section"] = {**m["section"], "girder": _girder_change(m["section"]["girder"], row, text)}
    elif kind == "stiffener":
        _, i, f = row.key
        sts = [dict(x) for x in m["stiffeners"]]
        kind_ = dict((k, c) for k, _l, c, _ch in STIFFENER_FIELDS)[f]
        if kind_ == "choice":
            sts[i][f] = int(text) if f in ("per_side", "sides") else text
        else:
            sts[i][f] = _num(row, text)
        m["stiffeners"] = sts
    elif kind == "bracing":
        m["bracing"] = _bracing_change(m.get("bracing") or {}, row, text)
    elif kind == "load":
        _load_change(m, row, text, s.header.get("unit_system", "si"))
    if row.key == ("member", "span"):  # the rivet runs follow the span in the same change
        m["rivets"] = _runs(s, m)
    return s.store.update_member(s.member_id, _changes(s, m), s.who)


def _changes(s: Session, m: dict) -> dict:
    old = _stored(s)
    return {k: v for k, v in m.items() if old.get(k) != v}


def _member_change(m: dict, row: Row, text: str) -> None:
    f = row.key[1]
    if f == "label":
        m["label"] = " ".join(text.split())
    elif f == "span":
        m["span"] = {"value": _num(row, text), "unit": row.unit}
    elif f == "do":
        v = _num(row, text)
        m["do"] = None if v is None else {"value": v, "unit": row.unit}
    else:
        m[f] = None if text == NOT_SET else text


def _header_change(h: dict, row: Row, text: str) -> dict:
    f = row.key[1]
    if f == "standard":
        return {"standard": text}
    if f == "year_built":
        v = _num(row, text)
        if v is not None and not float(v).is_integer():
            raise InputError(f"year built = {text!r} is not a whole year", where="survey")
        return {"year_built": None if v is None else int(v)}
    mat = dict(h.get("material") or {})
    v = _num(row, text)
    if v is None:
        mat.pop(f, None)
    else:
        mat[f] = {"value": v, "unit": row.unit}
    if f == "Fy" and v is None:
        mat = {}  # without Fy there is no given steel: core assumes it (said on screen)
    if mat and "Fy" not in mat:
        raise InputError("Fu alone cannot be given: type Fy first", where="survey / material")
    return {"material": mat or None}


def _girder_change(g: dict, row: Row, text: str) -> dict:
    g = dict(g)
    v = _num(row, text)
    if row.key[0] == "girder":
        if v is None:
            g.pop(row.key[1], None)
        else:
            g[row.key[1]] = v
    elif row.key[0] == "bottom_angle":
        cur = list(g.get("angle_bottom") or [g["angle_h"], g["angle_v"], g["angle_t"]])
        if v is None:
            g.pop("angle_bottom", None)
        else:
            cur[row.key[1]] = v
            g["angle_bottom"] = cur
    else:
        _, side, i, j = row.key
        covers = covers_of(g, side)
        covers[i][j] = v
        g[f"covers_{side}"] = covers
    return g


def _bracing_change(b: dict, row: Row, text: str) -> dict:
    _, side, f = row.key
    b = {k: (dict(v) if v else v) for k, v in b.items()}
    cur = dict(b.get(side) or {"kind": "none", "points": [], "u_frames": None})
    if f == "kind":
        cur["kind"] = text
    else:
        pts = [parse_number(p, row.label) for p in text.replace(";", ",").split(",") if p.strip()]
        if cur.get("kind") == "u_frames" and cur.get("u_frames"):
            cur["u_frames"] = {**cur["u_frames"], "positions": pts}
        else:
            cur["points"] = pts
    if cur["kind"] == "u_frames" and not cur.get("u_frames"):
        cur["u_frames"] = {"positions": cur.get("points") or []}
    b[side] = cur
    return b


def _load_change(m: dict, row: Row, text: str, sysu: str) -> None:
    f = row.key[1]
    v = _num(row, text)
    if f == "distribution":
        m["live_load"] = {**(m.get("live_load") or {}), "distribution": v}
        return
    ss = dict(m.get("simple_span") or {})
    if v is None:
        ss.pop(f, None)
    else:
        ss[f] = {"value": v, "unit": row.unit or LOAD_UNIT[sysu]}
    if ss and "dc" not in ss:
        raise InputError("DW alone cannot be given: type DC first", where="member / loads")
    m["simple_span"] = ss or None


# ---------------------------------------------------------------------- list actions
def add_cover(s: Session, side: str, b: str, t: str) -> Saved:
    """A cover plate added outside the others of a flange (typed width and thickness)."""
    m = _stored(s)
    g = dict(m["section"]["girder"])
    covers = covers_of(g, side)
    n = len(covers) + 1
    covers.append(
        [
            parse_number(b, f"width of {side} cover plate {n}, member {s.member_id}"),
            parse_number(t, f"thickness of {side} cover plate {n}, member {s.member_id}"),
        ]
    )
    g[f"covers_{side}"] = covers
    return s.store.update_member(s.member_id, {"section": {**m["section"], "girder": g}}, s.who)


def remove_cover(s: Session, side: str, i: int) -> Saved:
    m = _stored(s)
    g = dict(m["section"]["girder"])
    covers = covers_of(g, side)
    del covers[i]
    g[f"covers_{side}"] = covers
    return s.store.update_member(s.member_id, {"section": {**m["section"], "girder": g}}, s.who)


def add_stiffener(s: Session, position: str) -> Saved:
    """A stiffener at ``position`` (position unit) like the last one (or plates 1/10 of the
    web depth wide and as thick as the web: a start to edit, not a design)."""
    m = _stored(s)
    sts = list(m.get("stiffeners") or [])
    used = {x["id"] for x in sts}
    n = len(sts) + 1
    while f"T{n}" in used:
        n += 1
    g = (m["section"] or {}).get("girder") or {}
    like = dict(sts[-1]) if sts else {"b": g.get("D", 1.0) / 10, "t": g.get("tw", 1.0)}
    for k in ("readings", "bands", "note"):
        like.pop(k, None)
    like.update({"id": f"T{n}", "position": parse_number(position, "stiffener position")})
    return s.store.update_member(s.member_id, {"stiffeners": [*sts, like]}, s.who)


def remove_stiffener(s: Session, i: int) -> Saved:
    sts = list(_stored(s).get("stiffeners") or [])
    del sts[i]
    return s.store.update_member(s.member_id, {"stiffeners": sts}, s.who)


def relay_rivets(s: Session) -> Saved:
    """Rivet runs along the whole span at the section's nominal pitch (the runs are made
    again from the pitch and span; recorded rivet states on a line that stays are kept)."""
    return s.store.update_member(s.member_id, {"rivets": _runs(s, _stored(s))}, s.who)


def _runs(s: Session, m: dict) -> list[dict]:
    from core.units import from_internal

    scale = from_internal(1.0, "length", s.position_unit)
    runs = templates.rivet_runs(s.definition(), m["span"]["value"], scale)
    kept = {r["line"]: r.get("states") or [] for r in m.get("rivets") or []}
    for r in runs:
        r["states"] = kept.get(r["line"], [])
    return runs


def material_words(s: Session) -> str:
    """The steel the assessment will use, in words, with core's source (never computed here)."""
    survey = s.store.to_survey()
    family = s.header.get("standard", "aashto")
    mat, choices, assumed = resolve_material(survey, family)
    sysu = s.header.get("unit_system", "si")
    fy = show(mat.Fy, "stress", sysu)
    year = survey.survey.year_built
    if not assumed:
        return f"Fy {fy.value:.3g} {fy.symbol} as given (engineer's value)."
    if family == "aashto" and year is not None:
        why = f"from year built {year}"
    elif family == "aashto":
        why = "(the lowest default: neither the steel nor the year built is given; type either)"
    else:
        why = "as no steel is given" + (
            f" (year built {year} is not used in this standard family)" if year else ""
        )
    src = choices[0].source if choices else ""
    return f"Fy {fy.value:.3g} {fy.symbol} assumed {why} ({src})."
