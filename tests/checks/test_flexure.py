"""Flexure: My = Fy S (first yield, elastic beam theory, common practice) and the tension
flange at holes, AASHTO LRFD 6.10.1.8-1 ft <= 0.84 (An/Ag) Fu <= Fyt (from memory);
hand calculation from the clause."""

import pytest

from core.checks.flexure import net_area_ratio, tension_flange_net_section, yield_moment
from core.errors import InputError


def test_yield_moment_smaller_fibre_governs():
    # My,top = 250 * 4.0e6 = 1.0e9 N·mm; My,bottom = 250 * 3.2e6 = 8.0e8 N·mm -> bottom
    r = yield_moment(Fy=250, S_top=4.0e6, S_bottom=3.2e6)
    assert r.value("My,top").value == pytest.approx(1.0e9)
    assert r.Rn == pytest.approx(8.0e8) and r.kind == "moment"
    assert "bottom" in r.notes[0]


def test_as_built_and_as_found_are_two_calls():
    built = yield_moment(Fy="36 ksi", S_top="504 in**3", S_bottom="504 in**3")
    found = yield_moment(Fy="36 ksi", S_top="504 in**3", S_bottom="430 in**3")
    # 36 ksi * 504 in³ = 18 144 kip·in; ratio 430/504 (hand calculation)
    assert built.Rn == pytest.approx(18_144 * 112_984.829, rel=1e-6)
    assert found.Rn / built.Rn == pytest.approx(430 / 504)


def test_net_section_fracture_governs():
    # An/Ag = 0.7: 0.84 * 0.7 * 400 = 235.2 MPa < Fyt = 250 -> limit 235.2 MPa
    r = tension_flange_net_section(An=7000, Ag=10000, Fu=400, Fyt=250, ft=200)
    assert r.Rn == pytest.approx(235.2)
    assert r.value("ft/limit").value == pytest.approx(200 / 235.2)
    # fracture does not govern above An/Ag = 250 / (0.84 * 400) = 0.744048
    assert r.value("Fyt/(0.84 Fu)").value == pytest.approx(0.744048, rel=1e-5)


def test_yield_governs_with_few_holes():
    # An/Ag = 0.8: 0.84 * 0.8 * 400 = 268.8 > 250 -> limit Fyt = 250 MPa
    assert tension_flange_net_section(An=8000, Ag=10000, Fu=400, Fyt=250).Rn == 250.0


def test_bad_input():
    with pytest.raises(InputError, match="exceeds gross area"):
        net_area_ratio(11000, 10000)
    with pytest.raises(InputError, match="S_bottom = 0"):
        yield_moment(Fy=250, S_top=1e6, S_bottom=0)
    with pytest.raises(InputError, match="Fu = 200 MPa is below Fyt"):
        tension_flange_net_section(An=8000, Ag=10000, Fu=200, Fyt=250)
