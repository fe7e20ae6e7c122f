"""The STANDARDS registry and the common web_shear call; hypothesis invariants of the
three standards (properties of the clause formulas: AASHTO LRFD 6.10.9, AISC 360-22 G2,
EN 1993-1-5 5.2-5.3; common practice, no source for the invariants themselves)."""

import pytest
from hypothesis import assume, given
from hypothesis import strategies as st

from core.checks import STANDARDS, aashto_shear, aisc_shear, en1993_shear, web_shear
from core.errors import InputError

BIG = {"bfc": 1000.0, "tfc": 100.0, "bft": 1000.0, "tft": 100.0}


def test_registry_matches_direct_calls():
    kw = {"Fy": 345, "E": 200_000, "D": 1500, "tw": 12, "panel": "interior", "do": 1500}
    fl = {"bfc": 400, "tfc": 25, "bft": 400, "tft": 25}
    a = web_shear("aashto", **kw, **fl)
    assert (
        a.Vn
        == aashto_shear.web_shear(
            Fyw=345, E=200_000, D=1500, tw=12, panel="interior", do=1500, **fl
        ).Vn
    )
    b = web_shear("AISC", **kw, **fl, d=1550)
    assert (
        b.Vn
        == aisc_shear.web_shear(
            Fy=345, E=200_000, h=1500, tw=12, d=1550, panel="interior", a=1500, **fl
        ).Vn
    )
    c = web_shear("en1993", **kw, **fl, end_post="rigid")
    assert (
        c.Vn
        == en1993_shear.web_shear(
            fyw=345, hw=1500, t=12, panel="interior", a=1500, end_post="rigid"
        ).Vn
    )
    assert set(STANDARDS) == {"aashto", "aisc", "en1993"}
    assert "6.10.9" in STANDARDS["aashto"].clause


def test_unknown_standard_lists_known():
    with pytest.raises(InputError, match=r"unknown standard 'bs5400'.*'aashto', 'aisc', 'en1993'"):
        web_shear("bs5400", Fy=345, E=200_000, D=1500, tw=12)


def test_missing_do_through_registry():
    for s in STANDARDS:
        with pytest.raises(InputError, match="required for a 'interior' panel"):
            web_shear(s, Fy=345, E=200_000, D=1500, tw=12, panel="interior", **BIG)


panels = st.sampled_from(["unstiffened", "interior", "end"])


@given(
    st.sampled_from(sorted(STANDARDS)),
    panels,
    st.floats(200, 3000),
    st.floats(4, 30),
    st.floats(4, 30),
    st.floats(0.3, 4.0),
    st.floats(200, 450),
)
def test_Vn_non_decreasing_in_tw(std, panel, D, tw1, tw2, aspect, Fy):
    # with stocky flanges the tension field proportion limits stay met (no branch switch)
    lo, hi = sorted((tw1, tw2))
    kw = {"Fy": Fy, "E": 200_000, "D": D, "panel": panel, "do": aspect * D, **BIG}
    assert web_shear(std, tw=hi, **kw).Vn >= web_shear(std, tw=lo, **kw).Vn * (1 - 1e-12)


@given(
    st.sampled_from(sorted(STANDARDS)),
    panels,
    st.floats(200, 3000),
    st.floats(4, 30),
    st.floats(0.3, 4.0),
    st.floats(200, 690),
    st.floats(200, 690),
)
def test_Vn_non_decreasing_in_Fy(std, panel, D, tw, aspect, F1, F2):
    lo, hi = sorted((F1, F2))
    extra = {"eta": 1.2} if std == "en1993" else {}  # eta fixed: its step at S460 is a jump
    kw = {"E": 200_000, "D": D, "tw": tw, "panel": panel, "do": aspect * D, **BIG, **extra}
    assert web_shear(std, Fy=hi, **kw).Vn >= web_shear(std, Fy=lo, **kw).Vn * (1 - 1e-12)


@given(st.floats(1, 400), st.floats(1, 40), st.floats(200, 700))
def test_C_in_unit_interval(D_tw, k, Fy):
    # AASHTO 6.10.9.3.2-4/-5/-6: 0 < C <= 1
    C, _ = aashto_shear.shear_ratio_C(D_tw, 1.0, k, 200_000, Fy)
    assert 0.0 < C <= 1.0


@given(st.floats(100, 3000), st.floats(4, 30), st.floats(0.3, 3.0))
def test_interior_at_least_end_panel(D, tw, aspect):
    # tension field never lowers the resistance below C Vp (6.10.9.3.2 vs 6.10.9.3.3)
    assume(D / tw < 300)
    kw = {"Fyw": 345, "E": 200_000, "D": D, "tw": tw, "do": aspect * D}
    end = aashto_shear.web_shear(panel="end", **kw)
    inner = aashto_shear.web_shear(panel="interior", **kw, bfc=50, tfc=5, bft=50, tft=5)
    assert inner.Vn >= end.Vn * (1 - 1e-12)
