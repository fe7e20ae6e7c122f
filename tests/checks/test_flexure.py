"""Flexure of the AASHTO family: flange yield Fn = Rb Rh Fyf (AASHTO LRFD 9th ed. 2020,
6.10.8.1.1 and 6.10.8.3; Rb in test_aashto_flange) and the tension
flange at holes, 6.10.1.8-1 ft <= 0.84 (An/Ag) Fu <= Fyt; all from memory; hand
calculations from the clauses."""

import pytest

from core.checks.flexure import flange_yield, net_area_ratio, tension_flange_net_section
from core.errors import InputError


def test_flange_yield_smaller_fibre_governs():
    # Mn,c = 1 * 1 * 250 * 4.0e6 = 1.0e9 N·mm; Mn,t = 250 * 3.2e6 = 8.0e8 N·mm -> tension
    r = flange_yield(Fyc=250, Fyt=250, S_c=4.0e6, S_t=3.2e6, phi_f=1.0)
    assert r.value("Mn,c").value == pytest.approx(1.0e9)
    assert r.Rn == pytest.approx(8.0e8) and r.kind == "moment"
    assert "tension" in r.notes[0]
    # with Rb = 0.9 the compression flange: 0.9 * 1.0e9 = 9.0e8 > 8.0e8, tension still governs
    assert flange_yield(Fyc=250, Fyt=250, S_c=4.0e6, S_t=3.2e6, Rb=0.9, phi_f=1.0).Rn == 8.0e8


def test_as_built_and_as_found_are_two_calls():
    built = flange_yield(Fyc="36 ksi", Fyt="36 ksi", S_c="504 in**3", S_t="504 in**3", phi_f=1.0)
    found = flange_yield(Fyc="36 ksi", Fyt="36 ksi", S_c="504 in**3", S_t="430 in**3", phi_f=1.0)
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
    with pytest.raises(InputError, match="S_t = 0"):
        flange_yield(Fyc=250, Fyt=250, S_c=1e6, S_t=0, phi_f=1.0)
    with pytest.raises(InputError, match="Fu = 200 MPa is below Fyt"):
        tension_flange_net_section(An=8000, Ag=10000, Fu=200, Fyt=250)
