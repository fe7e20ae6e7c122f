"""Any girder details give a result or an AsfoundError (a property that must hold, no
source): the numbers of the stiffeners, supports, bracing and fatigue traffic of the
invented through girder replaced by arbitrary ones, validated and, when valid, assessed
under each family."""

from __future__ import annotations

import copy
import time

from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from core.assess import AssessOptions, assess
from core.errors import AsfoundError
from core.survey import check_document
from tests.assess.helpers import sample_doc

BASE = sample_doc("through-girder-us.json")
BASE["members"][0]["stations"] = [BASE["members"][0]["stations"][i] for i in (0, 4, 7)]

#: the numeric places of the details a mutation may hit
PLACES = (
    ("stiffeners", 0, "b"),
    ("stiffeners", 0, "t"),
    ("stiffeners", 0, "b_conn"),
    ("stiffeners", 0, "t_fill"),
    ("stiffeners", 0, "clip"),
    ("stiffeners", 1, "position"),
    ("stiffeners", 1, "bands", 0, "hi"),
    ("stiffeners", 1, "bands", 0, "b_lost"),
    ("stiffeners", 1, "readings", 1, "value"),
    ("stiffeners", 4, "t"),
    ("supports", 0, "N", "value"),
    ("supports", 1, "overhang", "value"),
    ("supports", 1, "position"),
    ("bracing", "top", "u_frames", "positions", 0),
    ("bracing", "top", "u_frames", "hv", "value"),
    ("bracing", "top", "u_frames", "Iq", "value"),
    ("bracing", "bottom", "points", 0),
    ("fatigue", "ADTT_SL"),
)
NUMBERS = st.one_of(
    st.floats(allow_nan=False, allow_infinity=False, width=32),
    st.sampled_from([0.0, -1.0, 1e-9, 1e12, 0.25, 5.0, 75.0, 74.999]),
)


def _set(doc: dict, path: tuple, v) -> None:
    node = doc["members"][0]
    for k in path[:-1]:
        node = node[k]
    node[path[-1]] = v


@settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(
    hits=st.lists(st.tuples(st.sampled_from(PLACES), NUMBERS), min_size=1, max_size=4),
    family=st.sampled_from(("aashto", "aisc", "en1993")),
)
def test_any_girder_details_give_a_result_or_an_error(hits, family):
    doc = copy.deepcopy(BASE)
    for path, v in hits:
        _set(doc, path, v)
    t0 = time.monotonic()
    model, probs = check_document(doc, "fuzz.json")
    if model is None or any(p.level == "error" for p in probs):
        return
    try:
        a = assess(model, AssessOptions(standard=family))
    except AsfoundError:
        return
    assert a.members[0].stations
    assert time.monotonic() - t0 < 30.0
