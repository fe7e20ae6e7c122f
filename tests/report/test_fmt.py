"""Numbers as the report prints them: unit conversion and significant digits."""

from __future__ import annotations

import math

from hypothesis import given
from hypothesis import strategies as st

from core.report.fmt import num, position, prose, ratio, unit_label, value


def test_us_display_units_by_exact_definitions():
    # inch = 25.4 mm exactly, so 1 in^4 = 25.4^4 mm^4 (NIST SP 811, Appendix B.8)
    assert value(25.4**4, "inertia", "us") == "1.000"
    # 1 kip = 4.448 222 kN and 1 ksi = 6.894 757 MPa (NIST SP 811, Appendix B.8)
    assert value(4448.222, "force", "us") == "1.000"
    assert value(6.894757, "stress", "us") == "1.000"
    # 1 kip*ft = 1.355 818 kN*m (NIST SP 811, Appendix B.8), internal N*mm
    assert value(1.355818e6, "moment", "us") == "1.000"


def test_si_section_constants_in_powers_of_ten():
    assert unit_label("inertia", "si") == "10⁶ mm⁴"
    assert value(2.103e10, "inertia", "si") == "21,030"
    assert unit_label("section_modulus", "si") == "10³ mm³"
    assert unit_label("inertia", "us") == "in⁴"


def test_positions_in_metres_and_feet():
    assert position(17750.0, "si") == "17.75"
    assert position(304.8 * 75, "us") == "75"  # 1 ft = 304.8 mm exactly (NIST SP 811)
    assert position(0.0, "si") == "0"


def test_fixed_cases():
    # rounding to significant digits (common practice, no source)
    assert num(0.05815, 3) == "0.0582"
    assert num(1429.92, 3) == "1,430"
    assert num(99.996, 4) == "100.0"
    assert num(None) == "–" and num(float("nan")) == "n/a" and num(0.0) == "0"
    assert ratio(0.17905) == "0.179"


@given(
    st.floats(min_value=1e-6, max_value=1e12), st.integers(min_value=2, max_value=6), st.booleans()
)
def test_num_keeps_the_significant_digits(v, digits, negative):
    v = -v if negative else v
    s = num(v, digits)
    back = float(s.replace(",", ""))
    assert "e" not in s
    assert math.isclose(back, v, rel_tol=0.51 * 10 ** (1 - digits))


def test_prose_shows_si_quantities_in_us_units():
    """Engine prose on a US page in US units. 1 in = 25.4 mm exactly and 1 ksi = 6.894757 MPa
    (NIST SP 811, Appendix B); 127 mm = 5.00 in, 91.44 mm = 3.60 in, 206.8 MPa = 30.0 ksi."""
    s = "projecting width 127 mm > 16 tp = 91.44 mm (6.10.11.1.2-2)"
    assert prose(s, "us") == "projecting width 5.00 in > 16 tp = 3.60 in (6.10.11.1.2-2)"
    assert prose("Fy 206.8 MPa, Fu 413.7 MPa", "us") == "Fy 30.0 ksi, Fu 60.0 ksi"
    assert prose("124.1: nominal shear stress, MPa", "us") == "18.0: nominal shear stress, ksi"
    assert prose("4.448 kN", "us") == "1.00 kip"  # 1 kip = 4.448222 kN (NIST SP 811)


def test_prose_leaves_si_text_clause_numbers_and_si_twins_alone():
    """Property: SI pages and numbers without a unit are never rewritten, and a quantity
    already printed in US units keeps its SI twin in parentheses."""
    s = "projecting width 127 mm > 16 tp (6.10.11.1.2-2), 1.4 Apn Fys"
    assert prose(s, "si") == s
    assert prose("clause 6.10.11.1.2-2, factor 1.4", "us") == "clause 6.10.11.1.2-2, factor 1.4"
    assert prose("60.5 in (1537 mm)", "us") == "60.5 in (1537 mm)"
    assert "mm" not in prose("a 12mm plate and 3 mm² of 9 MPa", "us")
