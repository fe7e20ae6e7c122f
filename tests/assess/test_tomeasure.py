"""What is left to measure (core.assess.tomeasure): each item holds against what the engine
does with the record (a part listed as not read really is at nominal in the as-found
section; a support listed without a station really is left out of the girder end checks).

Sources: the minimum of three readings per region is common practice, no source (as in
core.survey.readings); the rest are properties of the record and of asfound's own rules."""

from __future__ import annotations

import copy

import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.assess.details import member_details
from core.assess.inputs import web_geometry
from core.assess.run import attach_supports
from core.assess.tomeasure import KINDS, Checklist, ToMeasure, left_to_measure
from core.errors import InputError
from core.parts import Angle
from core.survey.readings import MIN_READINGS, station_loss
from tests.assess.helpers import sample_doc, survey

DECK = "deck-girder-si.json"
THROUGH = "through-girder-us.json"


def _full(doc: dict) -> dict:
    """Every part of every station read over its whole (three readings at nominal), every
    rivet line walked, every bearing stiffener read, the steel and the loads given."""
    d = copy.deepcopy(doc)
    m = d["members"][0]
    defn = survey(d).members[0].definition()
    unit = survey(d).members[0].length_unit
    for s in m["stations"]:
        keep = [r for r in s["readings"] if any(r.get("region") == b["id"] for b in s["bands"])]
        for p in defn.parts:
            for k in range(MIN_READINGS):
                t = p.t / (25.4 if unit == "in" else 1.0)
                keep.append(
                    {"id": f"f-{s['id']}-{p.id}-{k}", "part": p.id, "value": t, "unit": unit}
                )
        s["readings"] = keep
    return d


def _items(doc: dict, kind: str | None = None) -> list[ToMeasure]:
    cl = left_to_measure(survey(doc))
    return [i for i in cl if kind is None or i.kind == kind]


def test_kinds_are_checked() -> None:
    with pytest.raises(InputError, match="kind 'nonsense'"):
        ToMeasure("nonsense", "G1", None, "web", "x", "member 'G1'")
    with pytest.raises(InputError, match="below want"):
        ToMeasure("few_readings", "G1", "S1", "web", "x", "member 'G1'", 3, 3)


def test_unread_parts_are_those_the_engine_keeps_at_nominal() -> None:
    """Every part listed as not read at a station gets no thickness of its own in the
    station's loss (so the engine keeps it as built), and every part with no thickness and
    no band is listed."""
    for name in (DECK, THROUGH):
        s = survey(sample_doc(name))
        m = s.members[0]
        defn = m.definition()
        cl = left_to_measure(s)
        for st_rec in m.stations:
            loss = station_loss(st_rec, m)
            thick = {(t.part, t.leg) for t in loss.thickness}
            listed = {(i.part, i.region) for i in cl.of(m.id, st_rec.id) if i.kind == "unread_part"}
            expected = set()
            for p in defn.parts:
                if isinstance(p, Angle):
                    whole = (p.id, None) in thick
                    legs = [g for g in ("h", "v") if (p.id, g) not in thick and not whole]
                    if len(legs) == 2:
                        expected.add((p.id, None))
                    elif legs:
                        expected.add((p.id, legs[0]))
                elif (p.id, None) not in thick:
                    expected.add((p.id, None))
            assert listed == expected, (name, st_rec.id)


def test_samples_name_the_unread_parts_in_words() -> None:
    items = _items(sample_doc(DECK), "unread_part")
    assert {i.subject for i in items} == {
        "top-right flange angle",
        "top cover plate 2",
        "bottom cover plate 2",
    }
    assert all(i.have == 0 and i.want == MIN_READINGS for i in items)
    assert "nominal thickness" in items[0].words


def test_a_fully_read_station_has_nothing_left() -> None:
    d = _full(sample_doc(DECK))
    per_station = [i for i in _items(d) if i.station is not None]
    assert per_station == []


def test_one_leg_read_lists_the_other() -> None:
    d = _full(sample_doc(DECK))
    s = d["members"][0]["stations"][0]
    s["readings"] = [r for r in s["readings"] if r["part"] != "angle_tl"]
    for k in range(3):
        s["readings"].append(
            {"id": f"h{k}", "part": "angle_tl", "region": "h", "value": 10.0, "unit": "mm"}
        )
    got = [(i.part, i.region, i.subject) for i in _items(d, "unread_part")]
    assert got == [("angle_tl", "v", "top-left flange angle, vertical leg")]


def test_station_without_readings_is_one_item() -> None:
    d = _full(sample_doc(DECK))
    d["members"][0]["stations"][2]["readings"] = []
    d["members"][0]["stations"][2]["bands"] = []
    sid = d["members"][0]["stations"][2]["id"]
    got = [i for i in _items(d) if i.station is not None]
    assert [(i.kind, i.station) for i in got] == [("unread_station", sid)]


@given(n=st.integers(min_value=1, max_value=6))
def test_few_readings_counts(n: int) -> None:
    d = _full(sample_doc(DECK))
    s = d["members"][0]["stations"][1]
    web = [r for r in s["readings"] if r["part"] == "web" and r.get("region") is None]
    others = [r for r in s["readings"] if not (r["part"] == "web" and r.get("region") is None)]
    s["readings"] = others + [dict(web[0], id=f"w{k}") for k in range(n)]
    few = [i for i in _items(d, "few_readings") if i.part == "web" and i.region is None]
    if n < MIN_READINGS:
        assert [(i.station, i.have, i.want) for i in few] == [(s["id"], n, MIN_READINGS)]
    else:
        assert few == []


def test_stations_in_position_order() -> None:
    d = sample_doc(DECK)
    d["members"][0]["stations"].reverse()
    m = survey(d).members[0]
    order = [i.station for i in left_to_measure(survey(d)) if i.station]
    pos = {s.id: s.position for s in m.stations}
    assert [pos[s] for s in order] == sorted(pos[s] for s in order)


def test_typed_band_without_readings() -> None:
    d = _full(sample_doc(DECK))
    s = d["members"][0]["stations"][0]
    b = s["bands"][0]
    s["readings"] = [r for r in s["readings"] if r.get("region") != b["id"]]
    b["t"] = 8.0
    got = _items(d, "typed_band")
    assert [(i.station, i.part, i.region) for i in got] == [(s["id"], b["part"], b["id"])]


def test_unwalked_lines_and_unread_bearing_stiffeners() -> None:
    d = _full(sample_doc(DECK))
    m = d["members"][0]
    m["rivets"] = [r for r in m["rivets"] if r["line"] != "web_top"]
    bs = next(s for s in m["stiffeners"] if s["role"] == "bearing")
    bs["readings"], bs["bands"] = [], []
    lines = _items(d, "unwalked_line")
    assert [i.subject for i in lines] == ["top line through the web"]
    stiff = _items(d, "unread_stiffener")
    assert [i.subject for i in stiff] == [f"bearing stiffener {bs['id']}"]


@given(shift=st.floats(min_value=0.0, max_value=3.0))
def test_ends_without_station_agree_with_the_assessment(shift: float) -> None:
    """The supports listed are exactly those the assessment leaves without girder end checks
    (core.assess.run.attach_supports with the web depth)."""
    d = sample_doc(DECK)
    m = d["members"][0]
    for s in m["stations"]:
        s["position"] = min(max(s["position"], shift), 18.0 - shift)
    rec = survey(d).members[0]
    depth = web_geometry(rec.definition()).D_web
    det = member_details(rec, rec.span_mm(), "mean", depth)
    xs = {s.id: s.position * 1000.0 for s in rec.stations}
    _, alone = attach_supports(det, xs, depth)
    listed = [i.place for i in _items(d, "end_without_station")]
    assert listed == [f"member 'G1' / support {s.id!r}" for s in alone]


def test_defaults_named() -> None:
    d = _full(sample_doc(THROUGH))
    steel = [i for i in _items(d, "defaulted") if i.subject.startswith("steel")]
    assert len(steel) == 1 and "year built" in steel[0].consequence  # survey has no material
    d["survey"]["material"] = {"Fy": {"value": 33.0, "unit": "ksi"}}
    assert not [i for i in _items(d, "defaulted") if i.subject.startswith("steel")]
    d["members"][0]["supports"] = []
    sup = [i for i in _items(d, "defaulted") if i.subject == "supports"]
    assert len(sup) == 1 and "not checked" in sup[0].consequence
    d["members"][0]["bracing"] = None
    assert [i for i in _items(d, "defaulted") if i.subject.startswith("bracing")]


def test_checklist_views() -> None:
    cl = left_to_measure(survey(sample_doc(DECK)))
    assert isinstance(cl, Checklist) and len(cl) == sum(cl.counts().values())
    assert set(cl.counts()) <= set(KINDS)
    assert cl.of("G1", whole=True) == list(cl)
    assert all(i.station == "S1" for i in cl.of("G1", "S1"))
