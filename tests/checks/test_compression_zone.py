"""The compression flange's buckling properties from the engine against the plate-flange
formulas.

Sources: AASHTO LRFD 9th ed. 6.10.8.2.3-9, rt = bfc / sqrt(12 (1 + Dc tw / (3 bfc tfc)))
(from memory), which neglects the web strip's own lateral inertia; closed forms of
rectangles (common practice, no source needed).
"""

import math

import pytest

from core.checks.compression_zone import compression_flange
from core.definition import PartThickness, SectionDefinition, StationLoss, riveted_girder
from core.errors import GeometryError
from core.parts import Plate
from core.section import analyse

GIRDER = SectionDefinition(
    (
        Plate("bot", 300, 20, -150, 0),
        Plate("web", 1200, 10, -5, 20, "vertical", role="web"),
        Plate("top", 400, 25, -200, 1220),
    )
)


def test_plate_girder_rt_matches_the_formula():
    st = analyse(GIRDER)
    cf = compression_flange(st.gross, y_limit=1220)
    # yc = (300*20*10 + 12000*620 + 10000*1232.5)/28000 = 708.036; Dc = 1220 - 708.036
    assert cf.Dc == pytest.approx(1220 - 708.0357, rel=1e-6)
    # exactly: flange plus Dc/3 of web, A = 10000 + 10 Dc/3, Iy = 25 * 400³/12 + (Dc/3) 10³/12
    A, Iy = 10_000 + 10 * cf.Dc / 3, 25 * 400**3 / 12 + cf.Dc / 3 * 10**3 / 12
    assert cf.rt == pytest.approx(math.sqrt(Iy / A), rel=1e-9)
    # the formula of 6.10.8.2.3-9 leaves out the web strip's own lateral inertia
    rt = 400 / math.sqrt(12 * (1 + cf.Dc * 10 / (3 * 400 * 25)))
    assert cf.rt == pytest.approx(rt, rel=5e-4)
    assert cf.rt > rt
    assert cf.Afc == pytest.approx(10_000.0) and cf.bfc == 400.0 and cf.tfc == 25.0
    assert cf.Iyc == pytest.approx(25 * 400**3 / 12) and cf.Iyt == pytest.approx(20 * 300**3 / 12)
    assert cf.h0 == pytest.approx(1232.5 - 10.0)
    assert cf.flange_parts == ("top",) and cf.tension_parts == ("bot",)
    assert cf.Sxc == st.gross.props.S_top


def test_hogging_is_the_mirror():
    st = analyse(GIRDER)
    cf = compression_flange(st.gross, y_limit=20, compression="bottom")
    assert cf.Dc == pytest.approx(708.0357 - 20, rel=1e-6)
    rt = 300 / math.sqrt(12 * (1 + cf.Dc * 10 / (3 * 300 * 20)))
    assert cf.rt == pytest.approx(rt, rel=5e-4)
    assert cf.Sxc == st.gross.props.S_bot and cf.thin.beta_x < 0


def test_riveted_flange_and_measured_loss():
    g = riveted_girder(
        D=1829, tw=9.5, angle_h=152, angle_v=152, angle_t=16, covers_top=((356, 13),), web_recess=6
    )
    built = compression_flange(analyse(g).gross, y_limit=1829 + 12 - 152)
    assert built.flange_parts == ("angle_tl", "angle_tr", "cover_top_1")
    loss = StationLoss((PartThickness("angle_tl", 11.0), PartThickness("angle_tr", 11.0)))
    found = compression_flange(analyse(g, loss).gross, y_limit=1829 + 12 - 152)
    assert found.Afc < built.Afc and found.Iyc < built.Iyc and found.Sxc < built.Sxc
    # the neutral axis drops with the top flange's loss, so more web is in compression
    assert found.Dc > built.Dc


def test_bad_limit():
    with pytest.raises(GeometryError, match="tension side"):
        compression_flange(analyse(GIRDER).gross, y_limit=100)
