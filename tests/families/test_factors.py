"""Each family's factors and measure against hand calculations from its clauses.

Sources (all from memory, as the families say): EN 1993-2:2006 Table 6.1 (gamma_M0 1.00,
gamma_M1 1.10, gamma_M2 1.25 for bridges); EN 1993-1-5:2006 5.1(2) (eta 1.2 only for S235 to
S460); EN 1990 Annex A2 Table A2.4(B) (gamma_G 1.35; gamma_Q 1.45 rail, 1.35 road); AASHTO
MBE 3rd ed. (2018) Table 6A.4.2.4-1 (system factors by structure type), Table 6A.4.2.3-1
(condition factors), Table 6A.4.2.2-1 and the legal / permit tables (live load factors),
6A.4.2.1 (RF equation, phi_c phi_s >= 0.85), 6A.4.2.4 (phi_s on flexural and axial effects
only), 6A.8.3 (posting W / 0.7 (RF - 0.3)); AASHTO LRFD 9th ed. (2020) 6.5.4.2 (phi_v 1.00,
phi_f 1.00, phi_bb 0.80); AISC 360-22 G1 and F1 (phi 0.90); ASCE/SEI 7-22 2.3.1 (1.2 D + 1.6 L).
"""

from __future__ import annotations

import copy

import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.assess.options import AssessOptions
from core.errors import InputError
from core.families import aashto, build_family
from core.families.base import Factor
from core.families.measures import DemandCapacity, RatingFactor, Utilisation
from tests.assess.helpers import sample_doc, survey

US = survey(sample_doc("through-girder-us.json"))
SI = survey(sample_doc("deck-girder-si.json"))


def test_en1993_bridge_partial_factors():
    f = build_family("en1993", AssessOptions(), SI)
    assert (f.factor("gamma_M0"), f.factor("gamma_M1"), f.factor("gamma_M2")) == (1.00, 1.10, 1.25)
    assert f.factor("eta") == 1.0  # early steel: not the 1.2 of S235-S460
    assert f.factor("gamma_G") == 1.35 and f.factor("gamma_Q") == 1.45  # railway sample
    assert "EN 1993-2" in f.f("gamma_M1").source and "from memory" in f.f("gamma_M1").source
    road = copy.deepcopy(sample_doc("deck-girder-si.json"))
    road["survey"]["use"] = "highway"
    assert build_family("en1993", AssessOptions(), survey(road)).factor("gamma_Q") == 1.35


def test_en1993_takes_lm1_for_a_highway_girder():
    # use: highway -> LM1 (EN 1991-2 4.3.2) and gamma_Q 1.35 (EN 1990 Table A2.4(B))
    from core.assess import assess

    road = copy.deepcopy(sample_doc("deck-girder-si.json"))
    road["survey"]["use"] = "highway"
    a = assess(survey(road))
    assert a.family.factor("gamma_Q") == 1.35
    assert {r.case for r in a.members[0].summary} == {"Eq. 6.10: LM1"}
    ls = a.members[0].stations[4].limit_state("bending")
    assert ls.rating.symbol == "U" and "LM1" in ls.rating.load


def test_engineer_overrides_are_named_and_checked():
    f = build_family("en1993", AssessOptions(factors={"gamma_M1": 1.0, "eta": 1.2}), SI)
    assert f.factor("gamma_M1") == 1.0 and f.f("gamma_M1").source.startswith("engineer's input")
    with pytest.raises(InputError, match="'phi_v' is not a factor of the EN 1993 family"):
        build_family("en1993", AssessOptions(factors={"phi_v": 0.9}), SI)
    with pytest.raises(InputError, match=r"gamma_M1 = 3 is outside"):
        build_family("en1993", AssessOptions(factors={"gamma_M1": 3.0}), SI)
    with pytest.raises(InputError, match="unknown standard family 'bs5400'"):
        build_family("bs5400", AssessOptions(), SI)


@pytest.mark.parametrize(
    "stype,phi_s",
    [
        ("welded_two_girder", 0.85),
        ("riveted_two_girder", 0.90),
        ("eyebar_truss", 0.90),
        ("three_girder", 0.85),
        ("four_girder", 0.95),
        ("multi_girder", 1.00),
        ("floorbeam", 0.85),
        ("stringer", 1.00),
    ],
)
def test_mbe_system_factor_by_structure_type(stype, phi_s):
    f = build_family("aashto", AssessOptions(structure_type=stype), US)
    mf = f.rules.member_factors(US.members[0], AssessOptions(structure_type=stype))
    assert mf["phi_s"].value == phi_s
    assert "Table 6A.4.2.4-1" in mf["phi_s"].source


def test_unrecorded_condition_and_structure_are_conservative():
    doc = copy.deepcopy(sample_doc("through-girder-us.json"))
    doc["members"][0]["condition"] = None
    doc["members"][0]["structure_type"] = None
    s = survey(doc)
    mf = build_family("aashto", AssessOptions(), s).rules.member_factors(
        s.members[0], AssessOptions()
    )
    assert mf["phi_c"].value == 0.85 and "not recorded" in mf["phi_c"].description
    assert mf["phi_s"].value == 0.85 and "not recorded" in mf["phi_s"].description


@pytest.mark.parametrize("cond,phi_c", [("good", 1.00), ("fair", 0.95), ("poor", 0.85)])
def test_condition_factor(cond, phi_c):
    mf = build_family("aashto", AssessOptions(), US).rules.member_factors(
        US.members[0], AssessOptions(condition=cond)
    )
    assert mf["phi_c"].value == phi_c


@pytest.mark.parametrize(
    "level,gLL", [("inventory", 1.75), ("operating", 1.35), ("legal", 1.80), ("permit", 1.80)]
)
def test_rating_levels_live_load_factors(level, gLL):
    f = build_family("aashto", AssessOptions(level=level), US)
    assert f.measure.gLL.value == gLL and f.measure.level == level
    assert f.factor("gDC") == 1.25 and f.factor("gDW") == 1.50
    assert (f.factor("phi_v"), f.factor("phi_f"), f.factor("phi_bb")) == (1.0, 1.0, 0.8)


def _F(s, v):
    return Factor(s, v, s, "test")


MEMBER = {"phi_c": _F("phi_c", 0.95), "phi_s": _F("phi_s", 0.90)}


def test_rating_factor_system_factor_on_flexure_only():
    m = RatingFactor("inventory", _F("gDC", 1.25), _F("gDW", 1.5), _F("gLL", 1.75))
    kw = dict(capacity=1000.0, kind="moment", DC=200.0, DW=50.0, LL=300.0, load="x", member=MEMBER)
    # flexure: phi_c phi_s = 0.95 * 0.90 = 0.855 (above the 0.85 floor): C = 855;
    # RF = (855 - 250 - 75) / (1.75 * 300) = 530 / 525 = 1.009524
    assert m.rate(flexural=True, **kw).value == pytest.approx(530 / 525)
    # shear: phi_s = 1.0: C = 950: RF = 625 / 525 = 1.190476
    assert m.rate(flexural=False, **kw).value == pytest.approx(625 / 525)
    # poor * riveted two-girder: 0.85 * 0.90 = 0.765 -> the 0.85 floor: C = 850 -> 1.0
    poor = {"phi_c": _F("phi_c", 0.85), "phi_s": _F("phi_s", 0.90)}
    r = m.rate(flexural=True, **{**kw, "member": poor})
    assert r.value == pytest.approx(1.0) and any("floor" in n for n in r.notes)


def test_capacity_below_the_dead_load_gives_zero_not_a_negative_rf():
    # C = 0.95 * 100 = 95 < 1.25 * 200: RF = 0 with the reason (a negative RF would rise with
    # a heavier live load)
    m = RatingFactor("inventory", _F("gDC", 1.25), _F("gDW", 1.5), _F("gLL", 1.75))
    r = m.rate(
        capacity=100.0,
        kind="force",
        flexural=False,
        DC=200.0,
        DW=0.0,
        LL=50.0,
        load="x",
        member=MEMBER,
    )
    assert r.value == 0.0 and any("dead load alone exceeds" in n for n in r.notes)


def test_demand_capacity_and_utilisation():
    dc = DemandCapacity(_F("LF_D", 1.2), _F("LF_L", 1.6))
    # (1.2 * (200 + 50) + 1.6 * 300) / 1000 = 0.78
    r = dc.rate(
        capacity=1000.0, kind="force", flexural=False, DC=200, DW=50, LL=300, load="x", member={}
    )
    assert r.value == pytest.approx(0.78) and not r.higher_is_better
    u = Utilisation(_F("gamma_G", 1.35), _F("gamma_Q", 1.45))
    # (1.35 * 250 + 1.45 * 300) / 1000 = 0.7725; reserve 0.2275
    r = u.rate(
        capacity=1000.0, kind="force", flexural=False, DC=200, DW=50, LL=300, load="x", member={}
    )
    assert r.value == pytest.approx(0.7725) and r.notes[0] == "reserve 1 - U = 0.228"


def test_posting_from_a_legal_rating():
    rules = build_family("aashto", AssessOptions(level="legal"), US).rules
    W = 50.0 * 4448.2216  # 50 kip = 25 tons
    # RF 0.65: 25 / 0.7 * (0.65 - 0.3) = 12.5 tons (MBE 6A.8.3)
    assert "= 12.5 tons" in rules.posting(0.65, W, "us")
    assert "no posting" in rules.posting(1.05, W, "us")
    assert "closing" in rules.posting(0.2, W, "us")


@given(st.floats(0.1, 5.0), st.floats(1.0, 2.0))
def test_heavier_live_load_never_raises_a_rating(LL, k):
    # property of every measure: more live load never improves the rating
    m = RatingFactor("inventory", _F("gDC", 1.25), _F("gDW", 1.5), _F("gLL", 1.75))
    u = Utilisation(_F("gamma_G", 1.35), _F("gamma_Q", 1.45))
    d = DemandCapacity(_F("LF_D", 1.2), _F("LF_L", 1.6))
    kw = dict(capacity=10.0, kind="force", flexural=True, DC=1.0, DW=0.5, load="x", member=MEMBER)
    for meas in (m, u, d):
        a, b = meas.rate(LL=LL, **kw), meas.rate(LL=LL * k, **kw)
        assert b.badness <= a.badness + 1e-12


def test_aashto_defaults_documented():
    # the module's tables are the ones the family uses
    assert aashto.CONDITION_FACTOR["fair"][0] == 0.95
    assert aashto.SYSTEM_FACTOR["riveted_two_girder"][0] == 0.90
