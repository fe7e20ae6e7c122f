"""Our exact properties against a general-purpose finite-element section library.

Oracle: sectionproperties (PyPI, test dependency only). Its geometric properties of
straight-edged regions come from a triangulation of the region, so A, the centroid and I of
a polygonal section agree with ours to round-off; tolerance 1e-6 relative.
"""

from __future__ import annotations

import pytest
import shapely

pytest.importorskip("sectionproperties")
from sectionproperties.analysis.section import Section as FESection
from sectionproperties.pre.geometry import Geometry

from core.definition import LossBand, PartThickness, StationLoss, riveted_girder
from core.geometry import net_pieces
from core.section import Section, analyse


def _oracle(pieces) -> tuple[float, float, float, float]:
    poly = shapely.union_all(shapely.box(*pieces.rects.T))
    geoms = list(getattr(poly, "geoms", [poly]))
    gsum = None
    for g in geoms:
        geo = Geometry(shapely.set_precision(g, 1e-6))
        gsum = geo if gsum is None else gsum + geo
    gsum.create_mesh(mesh_sizes=[2000.0])
    sec = FESection(gsum)
    sec.calculate_geometric_properties()
    cx, cy = sec.get_c()
    ixx, _, _ = sec.get_ic()
    return float(sec.get_area()), float(cx), float(cy), float(ixx)


def test_riveted_girder_with_holes_and_loss_against_fe_library() -> None:
    defn = riveted_girder(
        D=1000,
        tw=10,
        angle_h=125,
        angle_v=125,
        angle_t=12,
        covers_top=((320, 12),),
        covers_bottom=((320, 12), (280, 10)),
        web_recess=6,
        rivet_d=20,
        pitch_web=90,
    )
    loss = StationLoss(
        (
            PartThickness("web", 8.2),
            PartThickness("angle_bl", 9.5),
            PartThickness("cover_bottom_2", 7.0),
        ),
        (LossBand("web", 131.0, 200.0, 4.0), LossBand("cover_bottom_2", -140.0, -60.0, 3.0)),
    )
    st = analyse(defn, loss)
    exact_net = net_pieces(defn, st.gross.pieces, exact=True)
    for sec, pieces in ((st.gross, st.gross.pieces), (st.net, exact_net)):
        A, cx, cy, ixx = _oracle(pieces)
        p = sec.props
        assert pytest.approx(A, rel=1e-6) == p.A
        assert p.xc == pytest.approx(cx, abs=1e-6 * 1000)
        assert p.yc == pytest.approx(cy, rel=1e-6)
        assert p.Ix == pytest.approx(ixx, rel=1e-6)
    assert st.net.props.A < st.gross.props.A


def test_fast_net_section_equals_cut_pieces() -> None:
    # The net section keeps hole cuts as negative areas; cutting the pieces instead must
    # give the same properties (a property that must hold; no source needed).
    defn = riveted_girder(
        D=1000,
        tw=10,
        angle_h=125,
        angle_v=125,
        angle_t=12,
        covers_top=((320, 12), (300, 10)),
        rivet_d=20,
    )
    st = analyse(defn, StationLoss((PartThickness("web", 7.5),)))
    cut = Section.from_pieces(net_pieces(defn, st.gross.pieces, exact=True)).props
    fast = st.net.props
    for k in ("A", "yc", "Ix", "Iy", "S_top", "S_bot", "Zx", "y_pna"):
        assert getattr(fast, k) == pytest.approx(getattr(cut, k), rel=1e-10), k
