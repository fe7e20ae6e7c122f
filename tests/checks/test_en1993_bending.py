"""EN 1993 bending: Mc,Rd (EN 1993-1-1:2005 6.2.5) and holes in the tension flange
(6.2.5(4), Eq. 6.16); from memory; hand calculations from the clauses. The class and the
effective widths are tested in ``test_en1993_class``."""

import pytest

from core.checks.en1993_bending import bending_resistance, tension_flange_holes


def test_bending_resistance_by_class():
    # Mc,Rd = W fy / gamma_M0 with Wpl (class 1, 2), Wel,min (3), Weff,min (4)
    kw = dict(W_pl=1.2e7, W_el_min=1.0e7, W_eff_min=0.9e7, fy=235, gamma_M0=1.0)
    assert bending_resistance(section_class=2, **kw).Rr == pytest.approx(1.2e7 * 235)
    assert bending_resistance(section_class=3, **kw).Rr == pytest.approx(1.0e7 * 235)
    r4 = bending_resistance(section_class=4, **kw)
    assert r4.Rr == pytest.approx(0.9e7 * 235) and "4.4" in r4.clause
    assert bending_resistance(section_class=3, **{**kw, "gamma_M0": 1.1}).phi == pytest.approx(
        1 / 1.1
    )


def test_tension_flange_eq_6_16():
    # Af = 10 000, Af,net = 8 000, fu = 360, fy = 235, gamma_M2 = 1.25:
    # 0.9 * 0.8 * 360 / 1.25 = 207.36 MPa < 235 -> holes govern: W_t * 207.36
    r = tension_flange_holes(
        Af_net=8000, Af=10000, fy=235, fu=360, W_t=1e7, gamma_M0=1.0, gamma_M2=1.25
    )
    assert r.Rr == pytest.approx(1e7 * 207.36)
    assert "not met" in r.notes[0]
    ok = tension_flange_holes(
        Af_net=9500, Af=10000, fy=235, fu=360, W_t=1e7, gamma_M0=1.0, gamma_M2=1.25
    )
    # 0.9 * 0.95 * 360 / 1.25 = 246.24 >= 235: the holes may be ignored
    assert ok.Rr == pytest.approx(1e7 * 235) and "met" in ok.notes[0]
