"""Section properties against exact closed forms.

Sources: closed forms for the rectangle (A = b h, I = b h^3/12, S = b h^2/6, Z = b h^2/4;
any mechanics of materials text, e.g. Gere & Goodno, Mechanics of Materials, 7th ed.,
Appendix D, Case 1) and the parallel-axis theorem (ibid., section 12.5). Target accuracy
1e-9 relative (design target for exact properties).
"""

from __future__ import annotations

import math

import numpy as np
import pytest
import shapely

from core.properties import Edges, section_properties
from tests.engine.helpers import rect, single, wide_flange

REL = 1e-9


@pytest.mark.parametrize(("b", "h"), [(100.0, 200.0), (13.7, 911.3), (400.0, 8.0)])
def test_rectangle(b: float, h: float) -> None:
    p = single(rect(b, h, 37.0, -12.5)).gross.props
    assert pytest.approx(b * h, rel=REL) == p.A
    assert p.xc == pytest.approx(37.0 + b / 2, rel=REL)
    assert p.yc == pytest.approx(-12.5 + h / 2, rel=REL)
    assert p.Ix == pytest.approx(b * h**3 / 12, rel=REL)
    assert p.Iy == pytest.approx(h * b**3 / 12, rel=REL)
    assert abs(p.Ixy) <= REL * p.Ix
    assert p.S_top == pytest.approx(b * h**2 / 6, rel=REL)
    assert p.S_bot == pytest.approx(b * h**2 / 6, rel=REL)
    assert p.Zx == pytest.approx(b * h**2 / 4, rel=REL)
    assert p.rx == pytest.approx(h / math.sqrt(12), rel=REL)


def test_rectangle_shear_stress() -> None:
    # Closed form for a rectangle: tau = 1.5 V / A at mid-depth, zero at top and bottom
    # (Gere & Goodno, 7th ed., eq. 5-39 and 5-40).
    b, h, V = 120.0, 300.0, 250e3
    st = single(rect(b, h))
    prof = st.gross.profile
    assert prof.tau_max(V)[0] == pytest.approx(1.5 * V / (b * h), rel=REL)
    assert prof.tau_max(V)[1] == pytest.approx(h / 2, rel=REL)
    assert prof.tau(0.0, V)[0] == pytest.approx(0.0, abs=1e-12)
    assert prof.tau(h, V, "below")[0] == pytest.approx(0.0, abs=1e-12)
    # the parabola: tau(y) = V/(2I) (h^2/4 - (y - h/2)^2)
    y = np.linspace(0, h, 57)
    I = b * h**3 / 12
    expect = V / (2 * I) * (h**2 / 4 - (y - h / 2) ** 2)
    np.testing.assert_allclose(prof.tau(y, V, "below"), expect, rtol=1e-9, atol=1e-12)


def test_parallel_axis_two_rectangles() -> None:
    # Parallel-axis theorem: I = sum(I_i + A_i d_i^2) about the common centroid.
    a = rect(200.0, 20.0, 0.0, 0.0, "a")
    b = rect(20.0, 300.0, 90.0, 20.0, "b")
    p = single(a, b).gross.props
    A1, y1, I1 = 200 * 20, 10.0, 200 * 20**3 / 12
    A2, y2, I2 = 20 * 300, 170.0, 20 * 300**3 / 12
    yc = (A1 * y1 + A2 * y2) / (A1 + A2)
    assert p.yc == pytest.approx(yc, rel=REL)
    assert p.Ix == pytest.approx(I1 + A1 * (y1 - yc) ** 2 + I2 + A2 * (y2 - yc) ** 2, rel=REL)


def test_symmetric_i_section() -> None:
    # Closed form for a doubly symmetric I: I = b d^3/12 - (b - tw)(d - 2 tf)^3/12;
    # Z = b tf (d - tf) + tw (d - 2 tf)^2 / 4.
    d, bf, tf, tw = 600.0, 250.0, 20.0, 12.0
    p = analyse_wf(d, bf, tf, tw)
    assert pytest.approx(2 * bf * tf + (d - 2 * tf) * tw, rel=REL) == p.A
    assert p.Ix == pytest.approx(bf * d**3 / 12 - (bf - tw) * (d - 2 * tf) ** 3 / 12, rel=REL)
    assert p.Zx == pytest.approx(bf * tf * (d - tf) + tw * (d - 2 * tf) ** 2 / 4, rel=REL)
    assert p.yc == pytest.approx(d / 2, rel=REL)
    assert p.y_pna == pytest.approx(d / 2, rel=REL)


def analyse_wf(d, bf, tf, tw):
    from core.section import analyse

    return analyse(wide_flange(d, bf, tf, tw)).gross.props


def test_green_theorem_with_hole_and_clockwise_exterior() -> None:
    # Hollow rectangle B x H with a centred b x h hole: I = (B H^3 - b h^3)/12 (closed form).
    # The exterior is given clockwise on purpose: rings are oriented before summing.
    outer = [(0, 0), (0, 300), (200, 300), (200, 0)]
    hole = [(50, 60), (150, 60), (150, 240), (50, 240)]
    poly = shapely.Polygon(outer, [hole])
    p = section_properties(Edges.from_polygons([poly]))
    assert pytest.approx(200 * 300 - 100 * 180, rel=REL) == p.A
    assert p.Ix == pytest.approx((200 * 300**3 - 100 * 180**3) / 12, rel=REL)
    assert p.Iy == pytest.approx((300 * 200**3 - 180 * 100**3) / 12, rel=REL)


def test_triangle_polygon() -> None:
    # Right triangle with legs b (x) and h (y): A = b h/2, centroid (b/3, h/3),
    # Ix = b h^3/36, Iy = h b^3/36, Ixy = -b^2 h^2/72 (Gere & Goodno, Appendix D, Case 6).
    b, h = 90.0, 150.0
    p = section_properties(Edges.from_polygons([shapely.Polygon([(0, 0), (b, 0), (0, h)])]))
    assert pytest.approx(b * h / 2, rel=REL) == p.A
    assert (p.xc, p.yc) == pytest.approx((b / 3, h / 3), rel=REL)
    assert p.Ix == pytest.approx(b * h**3 / 36, rel=REL)
    assert p.Iy == pytest.approx(h * b**3 / 36, rel=REL)
    assert p.Ixy == pytest.approx(-(b**2) * h**2 / 72, rel=REL)
