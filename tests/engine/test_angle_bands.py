"""Loss bands on angle legs: knife-edge loss at a toe, pack rust along a leg.

Checks: the remaining material is the as-built section less the strip the band takes off the
leg's inner face (built independently here with shapely, a general-purpose geometry library
from PyPI); the area by hand, A = A_built - (hi - lo)(t - t_band); A, centroid and I against
the finite-element section library of tests/engine/test_oracle.py; the rivet ply across a
band bears on the band's thickness. The rule that a band lies beyond the other leg's
thickness (the shared corner is not banded) is asfound's own.
"""

from __future__ import annotations

import pytest
import shapely
from hypothesis import given
from hypothesis import strategies as st

from core.assess.rivetlines import plies
from core.definition import LossBand, StationLoss, riveted_girder
from core.errors import GeometryError
from core.section import analyse

DEFN = riveted_girder(
    D=1000,
    tw=10,
    angle_h=125,
    angle_v=100,
    angle_t=12,
    covers_top=((320, 12),),
    covers_bottom=((320, 12),),
    web_recess=6,
    rivet_d=20,
    pitch_web=90,
)


def _removed(angle, leg: str, lo: float, hi: float, t_band: float):
    """The strip a band takes off the inner face of a leg (shapely box)."""
    t = angle.t
    if leg == "v":
        a, b = sorted((angle.x + angle.dir_x * t_band, angle.x + angle.dir_x * t))
        return shapely.box(a, lo, b, hi)
    a, b = sorted((angle.y + angle.dir_y * t_band, angle.y + angle.dir_y * t))
    return shapely.box(lo, a, hi, b)


def _shape(pieces):
    return shapely.union_all(shapely.box(*pieces.rects.T))


@pytest.mark.parametrize(
    ("part", "leg", "frac"),
    [("angle_bl", "v", (0.7, 1.0)), ("angle_br", "h", (0.5, 1.0)), ("angle_tl", "v", (0.2, 0.4))],
)
def test_band_takes_the_strip_off_the_inner_face(part: str, leg: str, frac) -> None:
    angle = DEFN.part(part)
    a, b = angle.leg_range(leg)
    lo, hi = a + frac[0] * (b - a), a + frac[1] * (b - a)
    t_band = 4.0
    built = analyse(DEFN).gross
    found = analyse(DEFN, StationLoss((), (LossBand(part, lo, hi, t_band, leg),))).gross
    expected = _shape(built.pieces).difference(_removed(angle, leg, lo, hi, t_band))
    assert _shape(found.pieces).symmetric_difference(expected).area < 1e-6
    # by hand: the strip (hi - lo) x (t - t_band) is gone
    assert pytest.approx(built.props.A - (hi - lo) * (12.0 - t_band), rel=1e-12) == found.props.A


def test_knife_edge_through_at_the_toe_shortens_the_leg() -> None:
    angle = DEFN.part("angle_bl")
    _a, b = angle.leg_range("v")
    found = analyse(DEFN, StationLoss((), (LossBand("angle_bl", b - 15.0, b, 0.0, "v"),))).gross
    built = analyse(DEFN).gross
    assert pytest.approx(built.props.A - 15.0 * 12.0, rel=1e-12) == found.props.A
    assert found.props.Ix < built.props.Ix


def test_against_the_finite_element_library() -> None:
    pytest.importorskip("sectionproperties")
    from tests.engine.test_oracle import _oracle

    angle = DEFN.part("angle_bl")
    _a, b = angle.leg_range("v")
    loss = StationLoss(
        (),
        (
            LossBand("angle_bl", b - 40.0, b, 5.0, "v"),
            LossBand("angle_br", *DEFN.part("angle_br").leg_range("h"), 9.0, "h"),
            LossBand("web", 131.0, 200.0, 4.0),
        ),
    )
    g = analyse(DEFN, loss).gross
    A, _cx, cy, ixx = _oracle(g.pieces)
    assert pytest.approx(A, rel=1e-6) == g.props.A
    assert g.props.yc == pytest.approx(cy, rel=1e-6)
    assert g.props.Ix == pytest.approx(ixx, rel=1e-6)


@given(
    f0=st.floats(min_value=0.0, max_value=0.9),
    w=st.floats(min_value=0.05, max_value=1.0),
    t_band=st.floats(min_value=0.0, max_value=12.0),
)
def test_a_band_never_adds_material_and_a_deeper_one_takes_more(f0, w, t_band) -> None:
    """Properties: A with a band is at most A as built; a thinner band never leaves more."""
    angle = DEFN.part("angle_bl")
    a, b = angle.leg_range("v")
    lo = a + f0 * (b - a)
    hi = min(lo + w * (b - a), b)
    if hi - lo < 0.5:
        return
    A0 = analyse(DEFN).gross.props.A
    A1 = analyse(DEFN, StationLoss((), (LossBand("angle_bl", lo, hi, t_band, "v"),))).gross.props.A
    A2 = analyse(DEFN, StationLoss((), (LossBand("angle_bl", lo, hi, t_band / 2, "v"),))).gross
    assert A1 <= A0 * (1 + 1e-12) and A2.props.A <= A1 * (1 + 1e-12)


def test_bands_on_angles_are_refused_at_the_corner_or_without_a_leg() -> None:
    a, _b = DEFN.part("angle_bl").leg_range("v")
    with pytest.raises(GeometryError, match="outside the vertical leg"):
        analyse(DEFN, StationLoss((), (LossBand("angle_bl", a - 5.0, a + 20.0, 5.0, "v"),)))
    with pytest.raises(GeometryError, match="needs its leg"):
        analyse(DEFN, StationLoss((), (LossBand("angle_bl", a, a + 20.0, 5.0),)))
    with pytest.raises(GeometryError, match="has no leg"):
        analyse(DEFN, StationLoss((), (LossBand("web", 100.0, 200.0, 5.0, "v"),)))


def test_the_rivet_ply_across_a_leg_band_bears_on_the_band() -> None:
    """A horizontal line through the web and the vertical legs (the bottom web line): a band
    on the vertical leg across the line is the ply there; one clear of it changes nothing."""
    line = next(ln for ln in DEFN.rivet_lines if ln.id == "web_bottom")
    a, b = DEFN.part("angle_bl").leg_range("v")
    y = line.position
    assert a < y < b
    near = StationLoss((), (LossBand("angle_bl", y - 10.0, y + 10.0, 6.0, "v"),))
    clear = StationLoss((), (LossBand("angle_bl", b - 5.0, b, 6.0, "v"),))
    t_near = {p.name: p.t for p in plies(DEFN, line, near, 400.0)}
    t_clear = {p.name: p.t for p in plies(DEFN, line, clear, 400.0)}
    assert t_near["angle_bl"] == 6.0 and t_near["web"] == 10.0
    assert t_clear["angle_bl"] == 12.0
