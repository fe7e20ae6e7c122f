"""Shear flow and fastener force against textbook built-up beam examples.

Source: Gere & Goodno, Mechanics of Materials, 7th ed., section 5.11 (built-up beams and
shear flow, f = VQ/I), Problems 5.11-4 and 5.11-5 with the answers of the book.
"""

from __future__ import annotations

import pytest

from core.checks.rivets import rivet_force
from core.definition import RivetLine, SectionDefinition
from core.parts import Plate
from core.section import analyse
from core.units import Q_


def box(b: float, tf: float, h1: float, tw: float) -> SectionDefinition:
    """A box of a top and a bottom board b x tf and two side boards tw x h1 between them,
    fastened by one line of fasteners through each side board into the top board."""
    parts = (
        Plate("bottom", b, tf, 0.0, 0.0, "horizontal"),
        Plate("left", h1, tw, 0.0, tf, "vertical"),
        Plate("right", h1, tw, b - tw, tf, "vertical"),
        Plate("top", b, tf, 0.0, tf + h1, "horizontal"),
    )
    lines = tuple(
        RivetLine(f"nails_{side}", "vertical", x, 1.0, 1.0, 100.0, ("top", side), 1, ("top",), 2)
        for side, x in (("left", tw / 2), ("right", b - tw / 2))
    )
    return SectionDefinition(parts, lines, "box beam")


def test_box_beam_of_four_boards_screw_spacing() -> None:
    # Gere & Goodno 7th ed., Problem 5.11-5: four 6 in x 1 in boards, V = 1200 lb, screws
    # F = 250 lb each; I = 184 in^4, Q = 21 in^3, s_max = 2 F I / (V Q) = 3.65 in.
    IN = 25.4
    st = analyse(box(6 * IN, 1 * IN, 6 * IN, 1 * IN))
    assert Q_(st.gross.props.Ix, "mm**4").to("in**4").m == pytest.approx(184.0, rel=1e-3)
    assert Q_(st.gross.Q_of(("top",)), "mm**3").to("in**3").m == pytest.approx(21.0, rel=1e-9)
    V = Q_(1200, "lbf").to("N").m
    f = st.shear_flow("nails_left", V)  # both lines of the interface together
    F = Q_(250, "lbf").to("N").m
    s_max = 2 * F / f
    assert Q_(s_max, "mm").to("in").m == pytest.approx(3.65, abs=0.005)
    # the force on one screw at that spacing is the allowable 250 lb
    force = rivet_force(f, s_max, n_lines=2)
    assert force.value == pytest.approx(F, rel=1e-12)


def test_box_beam_of_two_sizes_of_board_allowable_shear() -> None:
    # Gere & Goodno 7th ed., Problem 5.11-4: two 260 x 50 mm and two 260 x 25 mm boards
    # (b = 260, h = 310, h1 = 260), nails at s = 100 mm with F = 1200 N:
    # I = 411.125e6 mm^4, Q = 926.25e3 mm^3, V_max = 10.7 kN.
    st = analyse(box(260.0, 25.0, 260.0, 50.0))
    assert st.gross.props.Ix == pytest.approx(411.125e6, rel=1e-9)
    assert st.gross.Q_of(("top",)) == pytest.approx(926.25e3, rel=1e-9)
    f_allow = 2 * 1200.0 / 100.0
    V_max = f_allow * st.gross.props.Ix / st.gross.Q_of(("top",))
    assert V_max / 1000 == pytest.approx(10.7, abs=0.05)
    # and the engine's shear flow at V_max is the allowable one
    assert st.shear_flow("nails_right", V_max) == pytest.approx(f_allow, rel=1e-12)
