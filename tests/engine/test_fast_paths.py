"""Fast paths of the section engine give what the plain computation gives.

Each check here is a property that must hold by construction (no source needed): a shortcut
taken for speed must not change a result. The plain computations are written out in the
tests so that the shortcut is compared with something independent of it.
"""

from __future__ import annotations

import copy
import dataclasses
import pickle

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from core.definition import (
    LossBand,
    PartThickness,
    Perforation,
    RivetLine,
    SectionDefinition,
    StationLoss,
    riveted_girder,
)
from core.geometry import (
    GRID,
    Pieces,
    _cuts_overlap,
    _plan,
    build_pieces,
    hole_rects,
    net_pieces,
)
from core.parts import Plate
from core.properties import (
    Edges,
    gross_and_net_properties,
    part_areas,
    pieces_part_areas,
    pieces_properties_and_width,
    properties_and_width,
)
from core.section import Section, analyse
from core.shear import WidthProfile

girders = st.builds(
    lambda D, tw, leg, at, covers, ncov_b, rec, d: riveted_girder(
        D=D,
        tw=tw,
        angle_h=leg,
        angle_v=leg,
        angle_t=at,
        covers_top=covers,
        covers_bottom=covers[:ncov_b],
        web_recess=rec,
        rivet_d=d,
    ),
    D=st.floats(400, 3000),
    tw=st.floats(6, 20),
    leg=st.floats(80, 200),
    at=st.floats(8, 20),
    covers=st.lists(st.tuples(st.floats(200, 600), st.floats(8, 30)), max_size=3).map(tuple),
    ncov_b=st.integers(0, 3),
    rec=st.floats(0, 10),
    d=st.sampled_from([16.0, 19.0, 22.0, 25.0]),
)


@st.composite
def girder_and_loss(draw):
    defn = draw(girders)
    web = defn.part("web")
    thick = [PartThickness("web", web.t * draw(st.floats(0.3, 1.0)))]
    leg = draw(st.sampled_from([None, "h", "v"]))
    thick.append(
        PartThickness("angle_bl", defn.part("angle_bl").t * draw(st.floats(0.3, 1.0)), leg)
    )
    bands = []
    for _ in range(draw(st.integers(0, 3))):
        lo = web.y + draw(st.floats(0.0, 0.9)) * web.b
        f = draw(st.sampled_from([0.0, 0.5, draw(st.floats(0.05, 1.0))]))
        bands.append(LossBand("web", lo, lo + draw(st.floats(0.01, 0.1)) * web.b, web.t * f))
    covers = [p for p in defn.parts if p.id.startswith("cover_")]
    if covers and draw(st.booleans()):
        c = draw(st.sampled_from(covers))
        lo = c.x + draw(st.floats(0.0, 0.6)) * c.b
        bands.append(LossBand(c.id, lo, lo + 0.3 * c.b, c.t * draw(st.floats(0.0, 1.0))))
        thick.append(PartThickness(c.id, c.t * draw(st.floats(0.4, 1.0))))
    perfs = []
    if draw(st.booleans()):
        lo = web.y + draw(st.floats(0.0, 0.9)) * web.b
        perfs.append(Perforation("web", lo, lo + 0.05 * web.b))
    return defn, StationLoss(tuple(thick), tuple(bands), tuple(perfs))


@settings(max_examples=60, deadline=None)
@given(girder_and_loss())
def test_skipped_overlap_check_would_have_found_nothing(case) -> None:
    # When the definition's pre-check rules out overlapping hole cuts, the per-station
    # check (skipped) finds none either, and the cuts as negative areas give the properties
    # of the pieces cut exactly.
    defn, loss = case
    gross = build_pieces(defn, loss)
    net = net_pieces(defn, gross)
    if not _plan(defn).cuts_may_overlap:
        assert net.has_cuts
        assert not _cuts_overlap(net.cuts)
    fast = Section.from_pieces(net).props
    cut = Section.from_pieces(net_pieces(defn, gross, exact=True)).props
    for k in ("A", "yc", "Ix", "Iy", "Zx"):
        assert getattr(fast, k) == pytest.approx(getattr(cut, k), rel=1e-10), k


@settings(max_examples=60, deadline=None)
@given(girder_and_loss())
def test_cuts_are_each_piece_against_each_hole(case) -> None:
    # The cuts are the intersections of every piece with every hole of a line through the
    # piece's part, written out pair by pair.
    defn, loss = case
    gross = build_pieces(defn, loss)
    net = net_pieces(defn, gross)
    if not net.has_cuts:
        return
    holes = hole_rects(defn)
    expected, owners = [], []
    for r, o in zip(gross.rects, gross.owner, strict=True):
        for line, h in zip(defn.rivet_lines, holes, strict=True):
            if gross.part_ids[o] not in line.parts:
                continue
            c = (max(r[0], h[0]), max(r[1], h[1]), min(r[2], h[2]), min(r[3], h[3]))
            if c[2] - c[0] > GRID and c[3] - c[1] > GRID:
                expected.append(c)
                owners.append(o)
    assert np.array_equal(net.cuts, np.array(expected).reshape(-1, 4))
    assert np.array_equal(net.cut_owner, np.array(owners, dtype=int))


def test_crossing_holes_in_one_plate_cut_the_pieces() -> None:
    # A horizontal and a vertical line cross inside plate p: their cuts overlap, so the
    # pieces are cut instead. Hand calculation: p loses 300x12 + 12x40 - 12x12 = 3936 mm²,
    # q loses 12x20 = 240 mm²; kept as two negative areas p would lose 4080 mm².
    defn = SectionDefinition(
        (Plate("p", 300, 40, -150, 0), Plate("q", 300, 20, -150, 40)),
        (
            RivetLine("h", "horizontal", 20, 10, 12, 100, ("p",)),
            RivetLine("v", "vertical", 0, 10, 12, 100, ("p", "q")),
        ),
        "crossing lines",
    )
    assert _plan(defn).cuts_may_overlap
    st_ = analyse(defn)
    assert not st_.net.pieces.has_cuts
    assert pytest.approx(300 * 40 + 300 * 20 - 3936 - 240, rel=1e-12) == st_.net.props.A


def _components_by_flood_fill(p: Pieces) -> list[tuple[str, ...]]:
    """Connected groups by a plain flood fill over the same contact rule (shared edge of
    positive length, or overlap)."""
    r = p.rects.tolist()
    n = len(r)

    def touch(a, b) -> bool:
        ox = min(a[2], b[2]) - max(a[0], b[0])
        oy = min(a[3], b[3]) - max(a[1], b[1])
        return (ox > 1e-6 and oy >= -1e-6) or (oy > 1e-6 and ox >= -1e-6)

    seen = [False] * n
    groups = []
    for s in range(n):
        if seen[s]:
            continue
        stack, members = [s], []
        seen[s] = True
        while stack:
            k = stack.pop()
            members.append(k)
            for m in range(n):
                if not seen[m] and touch(r[k], r[m]):
                    seen[m] = True
                    stack.append(m)
        area = sum((r[k][2] - r[k][0]) * (r[k][3] - r[k][1]) for k in sorted(members))
        ids = {p.part_ids[p.owner[k]] for k in members}
        groups.append((area, tuple(q for q in p.part_ids if q in ids)))
    groups.sort(key=lambda g: -g[0])
    return [g for _, g in groups]


@settings(max_examples=200, deadline=None)
@given(
    st.lists(
        st.tuples(st.integers(0, 12), st.integers(0, 12), st.integers(1, 4), st.integers(1, 4)),
        min_size=1,
        max_size=30,
    ),
    st.integers(1, 5),
)
def test_components_equal_flood_fill(boxes, n_parts) -> None:
    # Rectangles on an integer grid touch along edges, at corners, or not at all.
    rects = np.array([(x, y, x + w, y + h) for x, y, w, h in boxes], dtype=float)
    owner = np.arange(len(rects)) % n_parts
    p = Pieces(rects, owner, tuple(f"p{k}" for k in range(n_parts)))
    # both list groups of equal area in the order of their first piece
    assert p.components() == _components_by_flood_fill(p)


def test_components_of_a_chain_longer_than_a_power_of_two() -> None:
    # 33 squares in a row, touching edge to edge: one group (the reachability closure must
    # cover a path of 32 steps); cutting the chain in the middle gives two.
    row = np.array([(k, 0.0, k + 1.0, 1.0) for k in range(33)])
    one = Pieces(row, np.zeros(33, dtype=int), ("a",))
    assert one.components() == [("a",)]
    split = np.concatenate([row[:16], row[17:] + np.array([0.5, 0.0, 0.5, 0.0])])
    two = Pieces(split, np.array([0] * 16 + [1] * 16), ("a", "b"))
    assert sorted(two.components()) == [("a",), ("b",)]


def test_definition_copies_carry_no_plan_and_analyse_alike() -> None:
    # The plan kept on a definition is derived data: copies and pickles rebuild it, compare
    # equal to the original, and give the same results.
    defn = riveted_girder(D=900, tw=10, angle_h=100, angle_v=100, angle_t=10, rivet_d=20)
    loss = StationLoss((PartThickness("web", 8.0),))
    a = analyse(defn, loss)
    for other in (pickle.loads(pickle.dumps(defn)), copy.deepcopy(defn), copy.copy(defn)):
        assert other == defn
        assert analyse(other, loss).net.props == a.net.props
    assert hash(pickle.loads(pickle.dumps(defn))) == hash(defn)


PROPS = ("A", "xc", "yc", "Ix", "Iy", "Ixy", "y_top", "y_bot", "S_top", "S_bot", "Zx", "y_pna")


def _same_props(a, b, depth: float) -> None:
    for k in PROPS:
        x, y = getattr(a, k), getattr(b, k)
        if k in ("xc", "yc", "y_top", "y_bot", "y_pna"):
            assert x == pytest.approx(y, abs=1e-12 * depth), k
        elif k == "Ixy":
            assert x == pytest.approx(y, abs=1e-12 * abs(a.Ix) + 1e-12 * abs(a.Iy)), k
        else:
            assert x == pytest.approx(y, rel=1e-12), k


def _same_width(a: WidthProfile, b: WidthProfile) -> None:
    assert np.allclose(a.y_breaks, b.y_breaks, rtol=0, atol=1e-9)
    assert len(a.U) == len(b.U)
    scale = float(np.abs(b.a).max())
    assert np.allclose(a.a, b.a, rtol=0, atol=1e-12 * scale)
    assert np.allclose(a.b, b.b, rtol=0, atol=1e-12)
    for x, y in ((a.A_above, b.A_above), (a.M_above, b.M_above)):
        assert np.allclose(x, y, rtol=0, atol=1e-12 * float(np.abs(y).max()))


@settings(max_examples=60, deadline=None)
@given(girder_and_loss())
def test_rectangle_sums_equal_greens_theorem_on_the_edges(case) -> None:
    # The closed-form rectangle sums are Green's theorem on each rectangle's four edges;
    # the net section (cuts negative) and the gross section, computed in one pass or apart.
    defn, loss = case
    gross = build_pieces(defn, loss)
    net = net_pieces(defn, gross)
    (gp, gw), (np_, nw) = gross_and_net_properties(gross, net)
    for pieces, props, width in ((gross, gp, gw), (net, np_, nw)):
        ref_props, ref_width = properties_and_width(Edges.from_pieces(pieces))
        depth = ref_props.y_top - ref_props.y_bot
        _same_props(props, ref_props, depth)
        _same_width(width, ref_width)
        alone_props, alone_width = pieces_properties_and_width(pieces)
        _same_props(alone_props, ref_props, depth)
        _same_width(alone_width, ref_width)


def test_width_from_rectangles_equals_width_from_edges_with_a_cut() -> None:
    # Two stacked plates and a hole cut through the joint (negative), about a height inside.
    rects = np.array([(0.0, 0.0, 200.0, 20.0), (50.0, 20.0, 150.0, 320.0)])
    cut = np.array([(90.0, 10.0, 110.0, 40.0)])
    pieces = Pieces(rects, np.array([0, 1]), ("flange", "web"), cut, np.array([1]))
    e = Edges.from_pieces(pieces)
    rows = np.concatenate([rects, cut])
    w = WidthProfile.from_rects(rows, 100.0, np.array([1.0, 1.0, -1.0]))
    _same_width(w, WidthProfile.from_edges(e, 100.0))
    # hand values: width 200 - 20 from 10 to 20, 100 - 20 from 20 to 40, 100 above
    assert w.width([5.0, 15.0, 30.0, 100.0]).tolist() == [200.0, 180.0, 80.0, 100.0]


@pytest.mark.parametrize("t_leg", [4e-10, 1.5e-6, 3.0])
def test_pieces_that_snap_to_nothing_are_dropped(t_leg) -> None:
    # An angle leg thinner than the snapping grid leaves no piece; every piece kept has a
    # positive size, and the areas add up to the hand sum of the legs.
    defn = riveted_girder(D=900, tw=10, angle_h=100, angle_v=100, angle_t=10)
    st_ = analyse(defn, StationLoss((PartThickness("angle_bl", t_leg, "h"),)))
    r = st_.gross.pieces.rects
    assert ((r[:, 2] - r[:, 0] > GRID) & (r[:, 3] - r[:, 1] > GRID)).all()
    legs = st_.gross.pieces.of("angle_bl")
    assert len(legs) == (1 if t_leg < GRID else 2)
    # hand sum: horizontal leg 100 x t_leg (if any) and vertical leg 10 x (100 - t_leg)
    area = ((legs[:, 2] - legs[:, 0]) * (legs[:, 3] - legs[:, 1])).sum()
    expected = (100 * t_leg if t_leg >= GRID else 0.0) + 10 * (100 - t_leg)
    assert area == pytest.approx(expected, rel=1e-9)


EDGE_FIELDS = ("x0", "y0", "x1", "y1", "owner")


@settings(max_examples=30, deadline=None)
@given(girder_and_loss())
def test_deferred_edges_and_part_sums_equal_the_edge_sums(case) -> None:
    # A section's edges are gathered on first read and equal Edges.from_pieces; the per-part
    # area and first moment from the rectangles equal Green's theorem on those edges.
    defn, loss = case
    st_ = analyse(defn, loss)
    for sec in (st_.gross, st_.net):
        eager = Edges.from_pieces(sec.pieces)
        for k in EDGE_FIELDS:
            assert np.array_equal(getattr(sec.edges, k), getattr(eager, k)), k
        assert sec.edges.n_parts == eager.n_parts
        A, Sx = pieces_part_areas(sec.pieces)
        A_ref, Sx_ref = part_areas(eager)
        assert np.allclose(A, A_ref, rtol=1e-12, atol=1e-9)
        depth = sec.props.y_top - sec.props.y_bot
        assert np.allclose(Sx, Sx_ref, rtol=1e-12, atol=1e-12 * sec.props.A * depth)


def test_deferred_edges_copy_pickle_and_replace() -> None:
    # Deferred edges behave as plain Edges when copied, pickled or rebuilt field by field.
    defn = riveted_girder(D=900, tw=10, angle_h=100, angle_v=100, angle_t=10, rivet_d=20)
    net = analyse(defn).net
    eager = Edges.from_pieces(net.pieces)
    for e in (
        pickle.loads(pickle.dumps(net.edges)),
        copy.deepcopy(net.edges),
        Edges.deferred(net.pieces),
    ):
        assert isinstance(e, Edges)
        for k in EDGE_FIELDS:
            assert np.array_equal(getattr(e, k), getattr(eager, k)), k
    moved = dataclasses.replace(net.edges, x0=net.edges.x0 + 1.0)
    assert np.array_equal(moved.x0, eager.x0 + 1.0) and np.array_equal(moved.y1, eager.y1)
    with pytest.raises(AttributeError):
        _ = net.edges.not_a_field


def test_hand_made_pieces_get_the_full_checks() -> None:
    # The shortcuts hold for pieces built by build_pieces / net_pieces only. Hand-made gross
    # pieces with two overlapping rectangles under one hole get the overlap check (and the
    # pieces cut exactly); hand-made cuts beyond the material are not shared with the gross.
    defn = SectionDefinition(
        (Plate("p", 200, 20, -100, 0), Plate("q", 200, 20, -100, 20)),
        (RivetLine("v", "vertical", 0, 10, 12, 100, ("p", "q")),),
        "two plates",
    )
    assert not _plan(defn).cuts_may_overlap
    made = Pieces(
        np.array([(-100.0, 0.0, 100.0, 20.0), (-100.0, 10.0, 100.0, 40.0)]),
        np.array([0, 1]),
        ("p", "q"),
    )
    assert not net_pieces(defn, made).has_cuts
    built = build_pieces(defn)
    assert net_pieces(defn, built).has_cuts
    # cuts below the material: the gross section must not see them
    outside = Pieces(
        built.rects,
        built.owner,
        built.part_ids,
        np.array([(-6.0, -30.0, 6.0, -10.0)]),
        np.array([0]),
    )
    g, n = Section.gross_and_net(built, outside)
    assert g.props == Section.from_pieces(built).props
    assert n.props == Section.from_pieces(outside).props
    assert g.props.y_bot == 0.0 and n.props.y_bot == -30.0
