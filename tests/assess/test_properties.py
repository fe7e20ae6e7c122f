"""Properties the assessment must have (facts of mechanics, common practice, no source):
zero loss gives ratio 1; loss never raises a capacity of a symmetric girder whose loss lies
in the web and the bottom flange, in every family; switching the family changes the clause
named on every limit state; a heavier live load never raises a rating; more missing rivets
never raise a rivet line's capacity."""

from __future__ import annotations

import copy
import itertools

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from core.assess import AssessOptions, assess
from tests.assess.helpers import sample_doc, survey, without_loss

FAMILIES = ("aashto", "aisc", "en1993")


@pytest.mark.parametrize("family", FAMILIES)
@pytest.mark.parametrize("name", ["deck-girder-si.json", "through-girder-us.json"])
def test_zero_loss_gives_ratio_one(name, family) -> None:
    a = assess(survey(without_loss(sample_doc(name))), AssessOptions(standard=family))
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
    family=st.sampled_from(FAMILIES),
)
def test_loss_never_raises_capacity(web, angle, cover, band, family) -> None:
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
    a = assess(survey(d), AssessOptions(standard=family))
    for st_ in a.members[0].stations:
        for ls in st_.limit_states:
            if ls.ratio is not None:
                assert ls.ratio <= 1.0 + 1e-9, (st_.station, ls.key, ls.ratio)


@pytest.mark.parametrize("name", ["deck-girder-si.json", "through-girder-us.json"])
def test_switching_the_family_changes_the_clause_of_every_limit_state(name) -> None:
    runs = {f: assess(survey(sample_doc(name)), AssessOptions(standard=f)) for f in FAMILIES}
    refs = {
        f: {
            (s.station, ls.key): ls.reference
            for s in a.members[0].stations
            for ls in s.limit_states
        }
        for f, a in runs.items()
    }
    own = {"aashto": "AASHTO", "aisc": "AISC 360-22", "en1993": "EN 1993"}
    for f, r in refs.items():
        for key, ref in r.items():
            assert own[f] in ref, (f, key, ref)
            for g in FAMILIES:
                if g != f:
                    assert own[g] not in ref, (f, key, ref)
                    if key in refs[g]:
                        assert refs[g][key] != ref, (f, g, key)


@settings(max_examples=6, deadline=None)
@given(st.floats(1.0, 1.6), st.sampled_from(["legal", "inventory"]))
def test_a_heavier_live_load_never_raises_a_rating(k, level) -> None:
    # AASHTO: the legal truck's axles (and, with HL-93 for inventory, the distribution
    # factor) times k >= 1; every rating factor at every station can only fall
    d = sample_doc("through-girder-us.json")
    heavy = copy.deepcopy(d)
    for v in heavy["members"][0]["live_load"]["vehicles"]:
        for a in v["axles"]:
            a["load"]["value"] *= k
    opts = AssessOptions(level=level)
    g = assess(survey(d), opts).members[0].factors
    g0 = next(f.value for f in g if f.symbol == "g")
    base = assess(survey(d), AssessOptions(level=level, distribution=g0))
    more = assess(survey(heavy), AssessOptions(level=level, distribution=g0 * k))
    for s0, s1 in zip(base.members[0].stations, more.members[0].stations, strict=True):
        for a, b in zip(s0.limit_states, s1.limit_states, strict=True):
            if a.RF is not None:
                assert b.RF <= a.RF + 1e-9, (s0.station, a.key)


@settings(max_examples=5, deadline=None)
@given(st.floats(0.75, 1.46))
def test_a_heavier_lm71_never_lowers_a_utilisation(alpha) -> None:
    # EN: alpha of LM71 up from 0.75 raises every utilisation (or keeps it)
    d = sample_doc()
    lo, hi = copy.deepcopy(d), copy.deepcopy(d)
    lo["members"][0]["live_load"]["alpha"] = 0.75
    hi["members"][0]["live_load"]["alpha"] = alpha
    a, b = assess(survey(lo)), assess(survey(hi))
    for s0, s1 in zip(a.members[0].stations, b.members[0].stations, strict=True):
        for x, y in zip(s0.limit_states, s1.limit_states, strict=True):
            if x.measure is not None:
                assert y.measure >= x.measure - 1e-9, (s0.station, x.key)


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
        local = st_.limit_state("local_web_shear")
        assert local.ratio < 1.0
        assert "plastic shear of the net vertical section" in local.note
        assert not local.found.has("V_el") and local.built.has("V_el")
        assert st_.limit_state("web_shear").ratio == pytest.approx(1.0)  # no whole-web loss


def test_assumptions_name_the_web_methods_with_their_sources() -> None:
    # Every method is listed with its basis for the engineer to judge.
    a = assess(survey(sample_doc()))
    items = {x.item: x for x in a.assumptions}
    assert "panel-representative web thickness" in items["web shear (buckling and yield)"].value
    local = items["local web shear (bands, perforations, thinning)"]
    assert "thinnest cut" in local.value and "net vertical section" in local.value
    assert "from memory" in items["factor gamma_M1"].source
    assert items["standard family"].value.startswith("EN 1993")


@pytest.mark.parametrize("family", FAMILIES)
def test_cover_plate_lines_add_left_and_right(family) -> None:
    # every other rivet of the left cover line missing: its gap doubles. The two lines of the
    # interface carry Rr / (2 p) + Rr / p = 1.5 Rr / p against 2 Rr / p as-built: ratio 0.75
    # (statics of the shear flow shared by two lines; "twice the weaker" would give 0.5)
    d = copy.deepcopy(BASE)
    m = d["members"][0]
    p = m["section"]["girder"]["pitch_cover"] / 1000.0
    n = int(6.0 / p)
    m["rivets"] = [
        {
            "line": "cover_bottom_l",
            "run": {"start": p / 2, "end": p / 2 + (n - 1) * p, "pitch": p, "state": "sound"},
            "states": [
                {"position": round(p / 2 + k * p, 6), "state": "missing"} for k in range(1, n, 2)
            ],
        }
    ]
    for s in m["stations"]:
        s["position"] = 3.0 if s is m["stations"][0] else s["position"]
    a = assess(survey(d), AssessOptions(standard=family, gap_window=200.0))
    ls = a.members[0].stations[0].limit_state("rivets:cover_bottom_l+cover_bottom_r")
    assert ls.ratio == pytest.approx(0.75, rel=1e-9)
