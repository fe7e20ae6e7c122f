"""The plate elements of a riveted compression flange from the section definition and loss.

Source: the width rules of AISC 360-22 B4.1a (angle legs: full leg; plates: free edge to the
first row of fasteners; from memory); the riveted girder template's gauges (core.definition,
0.55 of the leg from the web face: common practice, no source); hand arithmetic.
"""

import pytest

from core.checks.riveted_flange import FlangeElement, flange_elements, plate_flange
from core.definition import LossBand, PartThickness, SectionDefinition, StationLoss, riveted_girder
from core.errors import GeometryError
from core.parts import Plate

GIRDER = riveted_girder(
    D=1829,
    tw=9.5,
    angle_h=152,
    angle_v=152,
    angle_t=16,
    covers_top=((356, 13),),
    web_recess=6,
    rivet_d=22,
    rivet_hole=24,
)


def test_elements_as_built():
    # cover lines at +-(4.75 + 0.55 * 152) = +-88.35; outstand 178 - 88.35 = 89.65 each side;
    # between the lines 176.7 (internal); angle legs 152 x 16
    els = {e.name: e for e in flange_elements(GIRDER)}
    assert els["angle_tl horizontal leg"].slenderness == pytest.approx(152 / 16)
    assert els["cover_top_1 outstand left"].b == pytest.approx(89.65)
    assert els["cover_top_1 outstand right"].b == pytest.approx(89.65)
    assert els["cover_top_1 between rivet lines"].kind == "internal"
    assert els["cover_top_1 between rivet lines"].b == pytest.approx(176.7)
    assert len(els) == 5


def test_measured_thickness_and_bands():
    # the leg reading 11 mm; a band of 8 mm over the left cover edge -> that outstand 8 mm
    loss = StationLoss(
        (PartThickness("angle_tl", 11.0, "h"),), (LossBand("cover_top_1", -178, -150, 8.0),)
    )
    els = {e.name: e for e in flange_elements(GIRDER, loss)}
    assert els["angle_tl horizontal leg"].t == 11.0 and els["angle_tr horizontal leg"].t == 16.0
    assert els["cover_top_1 outstand left"].t == 8.0 and els["cover_top_1 outstand right"].t == 13.0


def test_bottom_flange_and_plate_flange():
    names = [e.name for e in flange_elements(GIRDER, compression="bottom")]
    assert "angle_bl horizontal leg" in names and "cover_bottom_1 outstand left" in names
    # a plate flange without rivet lines: outstand from the edge to the web face
    plate = SectionDefinition(
        (
            Plate("bot", 300, 20, -150, 0),
            Plate("web", 1200, 10, -5, 20, "vertical"),
            Plate("top", 400, 25, -200, 1220, role="cover"),
        )
    )
    els = flange_elements(plate)
    assert [e.b for e in els] == pytest.approx([195.0, 195.0])
    assert plate_flange(400, 25)[0].b == 200.0


def test_no_flange_refused():
    with pytest.raises(GeometryError, match="not a vertical web"):
        flange_elements(SectionDefinition((Plate("web", 100, 10, 0, 0),)))
    assert FlangeElement("x", 10, 1).slenderness == 10.0
