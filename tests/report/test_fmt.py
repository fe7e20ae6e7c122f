"""Numbers as the report prints them: unit conversion and significant digits."""

from __future__ import annotations

import math

from hypothesis import given
from hypothesis import strategies as st

from core.report.fmt import num, position, ratio, unit_label, value


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
