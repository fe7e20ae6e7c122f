"""Stiffener sections from the section engine against hand sums of rectangles, and the
bearing area of the projecting elements.

Source: closed forms of rectangles (b h³/12 and the parallel-axis theorem; common practice,
no source needed) and the bearing-area definition of AASHTO LRFD 9th ed. 6.10.11.2.3
(projecting elements beyond the web-to-flange junction, not beyond the flange edge; from
memory).
"""

import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.checks.stiffener_section import (
    EndLoss,
    Stiffener,
    bearing_area,
    one_side,
    remaining,
    stiffener_section,
)
from core.errors import InputError

PLATES = Stiffener("plates", b=150, t=16, name="S1")
ANGLES = Stiffener("angles", b=127, t=12.7, b_conn=89, per_side=2, t_fill=12.7, name="S2")


def test_plate_pair_with_web_strip():
    # A = 2 * 150 * 16 + 196 * 10 = 6760 mm²
    # I about the web mid-plane: 16 (310³ - 10³)/12 + 196 * 10³/12 = 39 720 000 + 16 333.3
    s = stiffener_section(PLATES, tw=10, strip=196)
    assert pytest.approx(6760.0, rel=1e-12) == s.A
    assert s.I_web == pytest.approx(39_736_333.33, rel=1e-9)
    assert s.props.yc == pytest.approx(0.0, abs=1e-9)
    assert s.r == pytest.approx(s.r_web)


def test_one_sided_plate_about_web_face_and_centroid():
    # one plate 150 x 16 from y = 5 to 155: I about its centroid 16 * 150³/12 = 4 500 000;
    # about the web face y = 5: + 2400 * 75² = 18 000 000 mm⁴
    s = stiffener_section(one_side(PLATES), tw=10)
    assert s.props.Ix == pytest.approx(4_500_000.0, rel=1e-9)
    assert s.I_about(5.0) == pytest.approx(18_000_000.0, rel=1e-9)


def test_angle_pairs_with_fillers_set_out_and_loss():
    # four angles 127 x 89 x 12.7 on fillers 12.7 (fillers carry no load), tw = 9.5:
    # back of the angles at 4.75 + 12.7 = 17.45 mm from the web mid-plane.
    # As found: outstanding legs t = 9, connected legs 10, 7 mm lost at the toes:
    # each angle = connected leg 89 x 10 + outstanding beyond it (120 - 10) x 9 = 890 + 990
    # A = 4 * 1880 = 7520 mm². I about the web mid-plane (per side, two angles):
    # connected legs 2 * 89 * (27.45³ - 17.45³)/3, outstanding 2 * 9 * (137.45³ - 27.45³)/3
    loss = EndLoss(150, t=9, t_conn=10, b_lost=7)
    s = stiffener_section(ANGLES, tw=9.5, loss=loss)
    per_side = 2 * 89 * (27.45**3 - 17.45**3) / 3 + 2 * 9 * (137.45**3 - 27.45**3) / 3
    assert pytest.approx(7520.0, rel=1e-9) == s.A
    assert s.I_web == pytest.approx(2 * per_side, rel=1e-9)


def test_fillers_counted_when_asked():
    # fillers 2 * 89 = 178 wide, 12.7 thick, each side: + 2 * 178 * 12.7 = 4521.2 mm²
    with_f = Stiffener("angles", 127, 12.7, 89, per_side=2, t_fill=12.7, fillers_carry_load=True)
    a = stiffener_section(with_f, tw=9.5).A - stiffener_section(ANGLES, tw=9.5).A
    assert a == pytest.approx(4521.2, rel=1e-9)


def test_width_limit_trims_the_outstand():
    # b_max = 100: each plate counts 100 x 16: A = 3200 mm²
    assert pytest.approx(3200.0) == stiffener_section(PLATES, tw=10, b_max=100).A


def test_bearing_area_plates_clip_and_flange_edge():
    # plates from the web face (5 mm) to 155 mm; clip 25 -> width 125; Apn = 125 * 16 * 2
    b = bearing_area(PLATES, tw=10, clip=25, bf=400)
    assert b.Apn == pytest.approx(4000.0) and not b.flange_limited
    # flange 280 wide: edge at 140 mm -> width 140 - 30 = 110
    b = bearing_area(PLATES, tw=10, clip=25, bf=280)
    assert b.width == pytest.approx(110.0) and b.flange_limited


def test_bearing_area_angles_beyond_the_connected_leg():
    # outstanding legs from 17.45 + 12.7 = 30.15 mm to 144.45 mm: width 114.3;
    # Apn = 114.3 * 12.7 * 4 = 5806.44 mm²
    b = bearing_area(ANGLES, tw=9.5, bf=313.5)
    assert b.width == pytest.approx(114.3) and b.n == 4
    assert b.Apn == pytest.approx(5806.44, rel=1e-9)


def test_bad_input_named():
    with pytest.raises(InputError, match="kind = 'tee'"):
        Stiffener("tee", 100, 10)
    with pytest.raises(InputError, match="must be less than both legs"):
        Stiffener("angles", 100, 12, 10)
    with pytest.raises(InputError, match="no connected leg, filler"):
        Stiffener("plates", 100, 10, t_fill=10)
    with pytest.raises(InputError, match="sides = 3"):
        Stiffener("plates", 100, 10, sides=3)
    with pytest.raises(InputError, match="above the nominal 16"):
        remaining(PLATES, EndLoss(100, t=17))
    with pytest.raises(InputError, match="the element is gone"):
        remaining(ANGLES, EndLoss(100, b_lost=120))
    with pytest.raises(InputError, match="height = -5"):
        EndLoss(-5)


@given(st.floats(2, 16), st.floats(2, 16), st.floats(0, 100), st.floats(0, 100))
def test_more_loss_never_raises_area_or_inertia(t1, t2, b1, b2):
    # a property of any section (no source needed): less material, less A and I
    t_lo, t_hi = sorted((t1, t2))
    b_lo, b_hi = sorted((b1, b2))
    more = stiffener_section(PLATES, tw=10, strip=100, loss=EndLoss(150, t=t_lo, b_lost=b_hi))
    less = stiffener_section(PLATES, tw=10, strip=100, loss=EndLoss(150, t=t_hi, b_lost=b_lo))
    assert more.A <= less.A * (1 + 1e-12)
    assert more.I_web <= less.I_web * (1 + 1e-12)
