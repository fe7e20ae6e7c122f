"""Invariants of the three web shear clauses (properties of the formulas of AASHTO LRFD
6.10.9, AISC 360-22 G2 and EN 1993-1-5 5.2-5.3; common practice, no source for the
invariants themselves), each clause called with its family's factor: phi_v = 1.00 (AASHTO
LRFD 6.5.4.2), phi_v = 0.90 (AISC 360-22 G1), gamma_M1 = 1.10 (EN 1993-2 Table 6.1), all
from memory."""

import pytest
from hypothesis import assume, given
from hypothesis import strategies as st

from core.checks import aashto_shear, aisc_shear, en1993_shear
from core.errors import InputError

BIG = {"bfc": 1000.0, "tfc": 100.0, "bft": 1000.0, "tft": 100.0}


def web_shear(std, *, Fy, E, D, tw, panel="unstiffened", do=None, eta=1.0, **fl):
    """One call over the three clauses (as the families call them)."""
    if std == "aashto":
        return aashto_shear.web_shear(Fyw=Fy, E=E, D=D, tw=tw, panel=panel, do=do, phi_v=1.0, **fl)
    if std == "aisc":
        return aisc_shear.web_shear(Fy=Fy, E=E, h=D, tw=tw, panel=panel, a=do, phi_v=0.9, **fl)
    return en1993_shear.web_shear(fyw=Fy, hw=D, t=tw, panel=panel, a=do, eta=eta, gamma_M1=1.1, E=E)


STDS = ["aashto", "aisc", "en1993"]


def test_missing_do_named():
    for s in STDS:
        with pytest.raises(InputError, match="required for a 'interior' panel"):
            web_shear(s, Fy=345, E=200_000, D=1500, tw=12, panel="interior", **BIG)


panels = st.sampled_from(["unstiffened", "interior", "end"])


@given(
    st.sampled_from(STDS),
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
    st.sampled_from(STDS),
    panels,
    st.floats(200, 3000),
    st.floats(4, 30),
    st.floats(0.3, 4.0),
    st.floats(200, 690),
    st.floats(200, 690),
)
def test_Vn_non_decreasing_in_Fy(std, panel, D, tw, aspect, F1, F2):
    lo, hi = sorted((F1, F2))
    kw = {"E": 200_000, "D": D, "tw": tw, "panel": panel, "do": aspect * D, **BIG}
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
    end = aashto_shear.web_shear(panel="end", **kw, phi_v=1.0)
    inner = aashto_shear.web_shear(panel="interior", **kw, bfc=50, tfc=5, bft=50, tft=5, phi_v=1.0)
    assert inner.Vn >= end.Vn * (1 - 1e-12)
