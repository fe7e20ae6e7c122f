"""Invariants of the section engine (property-based, hypothesis).

Each property is a fact of mechanics (common practice, no source needed): properties about
the centroid do not depend on where the section sits; Q is zero at the extreme fibres and
largest at the neutral axis; removing material never increases A, nor I about the centroid
(I about the centroid is the minimum over parallel axes, and a subset has a smaller integral
about any axis); a station with no loss is the as-built section.
"""

from __future__ import annotations

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from core.definition import LossBand, PartThickness, Perforation, StationLoss, riveted_girder
from core.section import analyse

girders = st.builds(
    lambda D, tw, leg, at, cw, ct, ncov, rec: riveted_girder(
        D=D,
        tw=tw,
        angle_h=leg,
        angle_v=leg,
        angle_t=at,
        covers_top=((cw, ct),) * ncov,
        web_recess=rec,
        rivet_d=19.0,
    ),
    D=st.floats(400, 3000),
    tw=st.floats(6, 20),
    leg=st.floats(80, 200),
    at=st.floats(8, 20),
    cw=st.floats(200, 600),
    ct=st.floats(8, 30),
    ncov=st.integers(0, 2),
    rec=st.floats(0, 10),
)


@settings(max_examples=40, deadline=None)
@given(girders, st.floats(-5000, 5000), st.floats(-5000, 5000))
def test_translation_invariance(defn, dx, dy) -> None:
    from dataclasses import replace

    moved = replace(
        defn, parts=tuple(replace(p, x=p.x + dx, y=p.y + dy) for p in defn.parts), rivet_lines=()
    )
    a = analyse(replace(defn, rivet_lines=())).gross.props
    b = analyse(moved).gross.props
    for k in ("A", "Ix", "Iy", "Zx", "S_top", "S_bot"):
        assert getattr(b, k) == pytest.approx(getattr(a, k), rel=1e-9)
    assert b.yc - dy == pytest.approx(a.yc, abs=1e-7 * max(1.0, abs(a.yc)))


@settings(max_examples=40, deadline=None)
@given(girders)
def test_q_zero_at_fibres_and_largest_at_neutral_axis(defn) -> None:
    g = analyse(defn).gross
    prof, p = g.profile, g.props
    scale = p.A * (p.y_top - p.y_bot)
    assert abs(prof.Q(p.y_top)[0]) <= 1e-9 * scale
    assert abs(prof.Q(p.y_bot)[0]) <= 1e-9 * scale
    y = np.linspace(p.y_bot, p.y_top, 301)
    assert prof.Q(p.yc)[0] >= prof.Q(y).max() - 1e-9 * scale
    assert prof.Q(y).min() >= -1e-9 * scale


@settings(max_examples=40, deadline=None)
@given(
    girders,
    st.floats(0.3, 1.0),
    st.floats(0.0, 1.0),
    st.floats(0.05, 0.95),
    st.floats(0.0, 1.0),
)
def test_loss_never_adds_area_or_inertia(defn, f_web, f_band, pos, f_angle) -> None:
    web = defn.part("web")
    lo = web.y + pos * web.b * 0.9
    loss = StationLoss(
        (
            PartThickness("web", web.t * f_web),
            PartThickness("angle_bl", defn.part("angle_bl").t * max(f_angle, 0.2)),
        ),
        (LossBand("web", lo, lo + 0.05 * web.b, web.t * f_web * f_band),),
    )
    built, found = analyse(defn), analyse(defn, loss)
    for a, b in ((built.gross, found.gross), (built.net, found.net)):
        assert b.props.A <= a.props.A * (1 + 1e-12)
        assert b.props.Ix <= a.props.Ix * (1 + 1e-12)
        assert b.props.Iy <= a.props.Iy * (1 + 1e-12)


@settings(max_examples=25, deadline=None)
@given(girders)
def test_zero_loss_is_as_built(defn) -> None:
    nominal = StationLoss(tuple(PartThickness(p.id, p.t) for p in defn.parts))
    a, b = analyse(defn), analyse(defn, nominal)
    assert a.gross.props == b.gross.props
    assert a.net.props == b.net.props


@settings(max_examples=25, deadline=None)
@given(girders, st.floats(1e3, 2e6))
def test_jump_ratio_is_inverse_width_ratio(defn, V) -> None:
    # At a width change Q and I are the same on both sides, so tau_above/tau_below equals
    # t_below/t_above (common practice, no source).
    for j in analyse(defn).gross.profile.jumps(V):
        if j.t_below > 0 and j.t_above > 0:
            assert j.tau_above * j.t_above == pytest.approx(j.tau_below * j.t_below, rel=1e-9)


def test_perforated_web_is_not_applicable() -> None:
    defn = riveted_girder(D=1000, tw=10, angle_h=125, angle_v=125, angle_t=12, rivet_d=20)
    st_ = analyse(defn, StationLoss(perforations=(Perforation("web", 140, 190),), where="S3"))
    assert not st_.shear_applicable
    assert (
        "not applicable" in st_.finding and "'web'" in st_.finding and "perforated" in st_.finding
    )
    # the net and gross properties still exist (flexure may still be checked)
    assert st_.gross.props.A > 0
    with pytest.raises(ValueError, match="not applicable"):
        st_.shear_flow("web_top", 1e5)
    worn = analyse(defn, StationLoss(bands=(LossBand("web", 140, 190, 0.0),)))
    assert not worn.shear_applicable and "worn through" in worn.finding


def test_uniform_web_reading_keeps_the_gripped_web() -> None:
    # A gauge reading thins the exposed faces only; the web gripped between the flange
    # angles keeps its faying faces, so the section stays in one piece (common practice).
    defn = riveted_girder(D=1000, tw=10, angle_h=125, angle_v=125, angle_t=12)
    st_ = analyse(defn, StationLoss((PartThickness("web", 7.0),)))
    assert st_.shear_applicable
    t_mid = st_.gross.profile.t(500.0)[0]
    t_grip = st_.gross.profile.t(60.0)[0]
    assert t_mid == pytest.approx(7.0)
    assert t_grip == pytest.approx(10.0 + 2 * 12.0)


def test_net_section_deducts_hole_areas() -> None:
    # Hand calculation: each horizontal line removes d_hole x (2 angle legs + web) and each
    # vertical line removes d_hole x (angle leg + cover plates).
    defn = riveted_girder(
        D=1000,
        tw=10,
        angle_h=125,
        angle_v=125,
        angle_t=12,
        covers_top=((320, 12),),
        rivet_d=20,
        rivet_hole=21.5,
    )
    st_ = analyse(defn)
    removed = 2 * 21.5 * (12 + 10 + 12) + 4 * 21.5 * (12 + 12)
    assert pytest.approx(removed, rel=1e-12) == st_.gross.props.A - st_.net.props.A


def test_shear_flow_by_hand() -> None:
    # q = V Q / I with Q of the top flange parts about the neutral axis (hand calculation
    # with the parallel-axis sums of the parts).
    defn = riveted_girder(
        D=800, tw=10, angle_h=100, angle_v=100, angle_t=10, covers_top=((250, 10),), rivet_d=20
    )
    st_ = analyse(defn)
    p = st_.gross.props
    Q = 0.0
    for pid in ("angle_tl", "angle_tr", "cover_top_1"):
        part = st_.gross.pieces.of(pid)
        a = (part[:, 2] - part[:, 0]) * (part[:, 3] - part[:, 1])
        yc = 0.5 * (part[:, 1] + part[:, 3])
        Q += float((a * (yc - p.yc)).sum())
    V = 300e3
    assert st_.shear_flow("web_top", V) == pytest.approx(V * Q / p.Ix, rel=1e-12)
    assert st_.shear_flow("web_top", V) == pytest.approx(st_.shear_flow("web_bottom", V), rel=1e-9)
