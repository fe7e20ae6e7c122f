"""A band on an angle leg from the record to the result: stored in a field store, read back
with its leg, and assessed (knife-edge loss at the toe of a bottom angle's vertical leg).
Properties of asfound's own record; the geometry is checked in tests/engine."""

from __future__ import annotations

import copy

from core.assess import assess
from core.survey import FieldStore, import_survey
from tests.assess.helpers import SAMPLES, sample_doc, survey


def _with_toe_band(doc: dict) -> tuple[dict, str]:
    d = copy.deepcopy(doc)
    m = d["members"][0]
    rec = survey(d).members[0]
    _a, b = rec.definition().part("angle_bl").leg_range("v")
    unit = rec.length_unit
    f = 25.4 if unit == "in" else 1.0
    st = m["stations"][3]
    st["bands"].append(
        {"id": "k1", "part": "angle_bl", "leg": "v", "lo": (b - 30.0) / f, "hi": b / f}
    )
    for k, v in enumerate((5.1, 4.8, 5.3)):
        st["readings"].append(
            {"id": f"k1-{k}", "part": "angle_bl", "region": "k1", "value": v / f, "unit": unit}
        )
    return d, st["id"]


def test_a_leg_band_lowers_the_as_found_section_and_names_its_leg():
    d, sid = _with_toe_band(sample_doc())
    before = assess(survey(sample_doc())).members[0]
    after = assess(survey(d)).members[0]
    sb = next(s for s in before.stations if s.station == sid)
    sa = next(s for s in after.stations if s.station == sid)
    assert sa.found.gross.props.A < sb.found.gross.props.A
    assert sa.found.gross.props.Ix < sb.found.gross.props.Ix
    others = [(s.station, s.found.gross.props.A) for s in after.stations if s.station != sid]
    assert others == [
        (s.station, s.found.gross.props.A) for s in before.stations if s.station != sid
    ]


def test_a_leg_band_goes_through_the_field_store(tmp_path):
    store_path = tmp_path / "s.sqlite"
    import_survey(SAMPLES / "deck-girder-si.json", store_path, who="test")
    store = FieldStore.open(store_path)
    rec = store.member("G1")
    _a, b = rec.definition().part("angle_bl").leg_range("v")
    sid = store.to_survey().members[0].stations[0].id
    store.add_band(
        "G1",
        sid,
        {"id": "k2", "part": "angle_bl", "leg": "v", "lo": b - 20.0, "hi": b, "t": 4.0},
        "test",
    )
    band = next(x for x in store.station("G1", sid).bands if x.id == "k2")
    assert band.leg == "v"
    assess(store.to_survey())  # the store's survey assesses with the band on the leg
    store.close()
