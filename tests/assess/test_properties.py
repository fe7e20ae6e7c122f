"""Properties the assessment must have (facts of mechanics, common practice, no source):
zero loss gives ratio 1; loss never raises a capacity of a symmetric girder whose loss lies
in the web and the bottom flange; more missing rivets never raise a rivet line's capacity."""

from __future__ import annotations

import copy
import itertools

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from core.assess import AssessOptions, assess
from tests.assess.helpers import sample_doc, survey, without_loss


@pytest.mark.parametrize("name", ["deck-girder-si.json", "through-girder-us.json"])
def test_zero_loss_gives_ratio_one(name) -> None:
    a = assess(survey(without_loss(sample_doc(name))))
    for m in a.members:
        for s in m.stations:
            assert s.found.shear_applicable
            for ls in s.limit_states:
                assert ls.ratio == pytest.approx(1.0, rel=1e-12), (s.station, ls.key)


def _symmetric_doc() -> dict:
    d = without_loss(sample_doc())
    m = d["members"][0]
    g = m["section"]["girder"]
    g["covers_bottom"] = g["covers_top"]
    m["stations"] = m["stations"][:3]
    return d


BASE = _symmetric_doc()


@settings(max_examples=15, deadline=None)
@given(
    web=st.floats(0.45, 1.0),
    angle=st.floats(0.45, 1.0),
    cover=st.floats(0.45, 1.0),
    band=st.floats(0.05, 1.0),
)
def test_loss_never_raises_capacity(web, angle, cover, band) -> None:
    d = copy.deepcopy(BASE)
    m = d["members"][0]
    g = m["section"]["girder"]
    for s in m["stations"]:
        s["readings"] = [
            {"id": f"r{k}", "part": part, "value": t, "unit": "mm"}
            for k, (part, t) in enumerate(
                [
                    ("web", g["tw"] * web),
                    ("angle_bl", g["angle_t"] * angle),
                    ("angle_br", g["angle_t"] * angle),
                    ("cover_bottom_1", g["covers_bottom"][0][1] * cover),
                ]
            )
        ]
        lo = g["web_recess"] + g["angle_v"]
        s["bands"] = [
            {"id": "b", "part": "web", "lo": lo, "hi": lo + 60, "t": g["tw"] * web * band}
        ]
    a = assess(survey(d))
    for st_ in a.members[0].stations:
        for ls in st_.limit_states:
            if ls.ratio is not None:
                assert ls.ratio <= 1.0 + 1e-9, (st_.station, ls.key, ls.ratio)


@settings(max_examples=15, deadline=None)
@given(st.lists(st.integers(0, 59), min_size=1, max_size=12, unique=True))
def test_more_missing_rivets_never_raise_rivet_capacity(missing) -> None:
    d = copy.deepcopy(BASE)
    m = d["members"][0]
    m["rivets"] = [
        {
            "line": "web_bottom",
            "run": {"start": 0.05, "end": 5.95, "pitch": 0.1, "state": "sound"},
            "states": [],
        }
    ]
    caps = []
    for k in range(len(missing) + 1):
        m["rivets"][0]["states"] = [
            {"position": round(0.05 + 0.1 * i, 2), "state": "missing"} for i in missing[:k]
        ]
        a = assess(survey(d))
        caps.append([s.limit_state("rivets:web_bottom").C_found for s in a.members[0].stations])
    for before, after in itertools.pairwise(caps):
        for b, f in zip(before, after, strict=True):
            assert f <= b + 1e-9


def test_loose_rivets_counted_when_the_engineer_says_so() -> None:
    d = copy.deepcopy(BASE)
    m = d["members"][0]
    m["rivets"] = [
        {
            "line": "web_bottom",
            "run": {"start": 0.05, "end": 5.95, "pitch": 0.1, "state": "loose"},
            "states": [],
        }
    ]
    strict_ = assess(survey(d)).members[0].stations[0].limit_state("rivets:web_bottom")
    lenient = assess(survey(d), AssessOptions(effective_states=("sound", "loose")))
    assert strict_.C_found == 0.0
    assert lenient.members[0].stations[0].limit_state("rivets:web_bottom").ratio == pytest.approx(
        1.0
    )


def test_perforated_web_local_check_never_exceeds_as_built() -> None:
    # A hole through a thinned band: the local check is the plastic shear of the net web
    # (VQ/It is not applicable across a cut-through web); it cannot exceed as-built, and the
    # panel keeps its buckling check with the panel-representative thickness.
    d = copy.deepcopy(BASE)
    m = d["members"][0]
    m["section"]["girder"]["tw"] = 12
    for s in m["stations"]:
        s["bands"] = [{"id": "b", "part": "web", "lo": 250, "hi": 400, "t": 6}]
        s["perforations"] = [{"id": "p", "part": "web", "lo": 300, "hi": 340}]
    for st_ in assess(survey(d)).members[0].stations:
        assert not st_.found.shear_applicable
        local = st_.limit_state("web_local")
        assert local.ratio < 1.0
        assert "plastic shear of the net vertical section" in local.note
        assert not local.found.has("V_el") and local.built.has("V_el")
        assert st_.limit_state("web_shear").ratio == pytest.approx(1.0)  # no whole-web loss


def test_assumptions_name_the_web_methods_with_their_sources() -> None:
    # Every method is listed with its basis for the engineer to judge.
    a = assess(survey(sample_doc()))
    items = {x.item: x for x in a.assumptions}
    assert (
        "panel-representative web thickness" in items["web shear, panel (buckling and yield)"].value
    )
    local = items["web shear, local (bands, perforations, thinning)"]
    assert "thinnest cut" in local.value and "net vertical section" in local.value
    assert "from memory" in items["factor gamma_M1"].source
    assert items["standard family"].value.startswith("EN 1993")
