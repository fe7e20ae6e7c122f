"""Rivets: resistance per family, force per rivet, and gaps between effective rivets.

Sources, each check names its own: AASHTO MBE 3rd ed. (2018) 6A.6.12.5.1 (rivet shear,
phi 0.80; Table 6A.6.12.5.1-1, lowest values recalled: 18 ksi before 1936 / unknown, 27 ksi
from 1936) and AASHTO LRFD 9th ed. (2020) 6.13.2.9 (bearing 2.4 d t Fu, else 1.2 Lc t Fu,
phi_bb 0.80); AISC 360-22 Appendix 5 (A502 Grade 1, Fnv = 25 ksi, phi 0.75) and J3.10
(1.2 lc t Fu <= 2.4 d t Fu); EN 1993-1-8:2005 Table 3.4 (Fv,Rd = 0.6 f_ur A0 / gamma_M2,
Fb,Rd = k1 alpha_b fu d t / gamma_M2) with gamma_M2 = 1.25 (EN 1993-2 Table 6.1); all from
memory; hand calculations from those clauses. Force per rivet: closed form of the shear flow
q = VQ/I in a beam of two stacked rectangles (mechanics of materials).
"""

import math

import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.checks import aashto_rivets, aisc_rivets, en1993_rivets
from core.checks.rivets import (
    Ply,
    line_gaps,
    rivet_force,
    shear_flow_resistance,
)
from core.errors import InputError
from core.units import from_internal


def test_aisc_A502_default_single_shear_in_kips():
    # Ab = pi 0.875²/4 = 0.601320 in²; Rn = 25 * 0.601320 = 15.033 kip; phi Rn = 11.275 kip
    assert from_internal(aisc_rivets.FNV_A502_1, "stress", "ksi") == pytest.approx(25.0)
    r = aisc_rivets.rivet_resistance(
        d="0.875 in", d0="0.9375 in", m=1, pitch="6 in", plies=[Ply("web", "0.5 in", "60 ksi")]
    )
    assert from_internal(r.Rn, "force", "kip") == pytest.approx(15.033, rel=1e-4)
    assert from_internal(r.Rr, "force", "kip") == pytest.approx(11.275, rel=1e-4)
    assert r.limit_state == "rivet (shear)" and r.phi == 0.75


def test_aisc_tearout_below_bearing():
    # d = 22, d0 = 23.5, pitch 50: lc = 26.5 mm; 1.2 lc t Fu = 1.2*26.5*10*400 = 127 200 N
    # < 2.4 d t Fu = 211 200 N (J3.10, from memory)
    r = aisc_rivets.rivet_resistance(d=22, d0=23.5, m=1, pitch=50, plies=[Ply("pl", 10, 400)])
    assert r.value("Rn,bearing pl").value == pytest.approx(127_200.0)


def test_aashto_double_shear_and_bearing_governs():
    # Fnv 18 ksi = 124.106 MPa (MBE table, unknown / before 1936, lowest recalled)
    Fnv, why = aashto_rivets.rivet_Fnv(1910)
    assert from_internal(Fnv, "stress", "ksi") == pytest.approx(18.0) and "before 1936" in why
    assert from_internal(aashto_rivets.rivet_Fnv(1950)[0], "stress", "ksi") == pytest.approx(27.0)
    assert aashto_rivets.rivet_Fnv(None)[0] == Fnv
    # d = 22, m = 2: shear 2 (pi 22²/4) 124.106 = 94 354 N, phi 0.80 -> 75 483 N
    # bearing on a 6 mm web, Fu = 400, Lc = 100 - 23.5 >= 2d: 2.4*22*6*400 = 126 720 N,
    # phi_bb 0.80 -> 101 376 N: shear governs
    r = aashto_rivets.rivet_resistance(
        d=22,
        d0=23.5,
        m=2,
        pitch=100,
        plies=[Ply("web", 6, 400), Ply("angle", 12, 400, 0.5)],
        Fnv=Fnv,
    )
    assert r.value("Rn,shear").value == pytest.approx(2 * math.pi * 22**2 / 4 * Fnv, rel=1e-9)
    assert r.value("Rn,bearing web").value == pytest.approx(126_720.0)
    assert r.limit_state == "rivet (shear)" and r.phi == 0.80
    # a 2 mm web: 2.4*22*2*400 = 42 240 N governs (phi_bb 0.80)
    r = aashto_rivets.rivet_resistance(
        d=22, d0=23.5, m=2, pitch=100, plies=[Ply("web", 2, 400)], Fnv=Fnv
    )
    assert r.Rn == pytest.approx(42_240.0) and "bearing on web" in r.limit_state
    # a close pitch: Lc = 60 - 23.5 = 36.5 < 2d = 44: 1.2 Lc t Fu = 1.2*36.5*6*400 = 105 120 N
    r = aashto_rivets.rivet_resistance(
        d=22, d0=23.5, m=1, pitch=60, plies=[Ply("web", 6, 400)], Fnv=Fnv
    )
    assert r.value("Rn,bearing web").value == pytest.approx(105_120.0)


def test_en1993_rivet_shear_and_bearing_table_3_4():
    # d = 22, d0 = 23.5, m = 2, f_ur = 330: Fv,Rk = 2 x 0.6 x 330 x (pi 23.5²/4) = 171 737 N;
    # /gamma_M2 1.25 = 137 390 N
    A0 = math.pi * 23.5**2 / 4
    web = Ply("web", 8, 360, 1.0, e2=60.0)
    r = en1993_rivets.rivet_resistance(d=22, d0=23.5, m=2, pitch=100, plies=[web])
    assert r.value("Fv,Rk").value == pytest.approx(2 * 0.6 * 330 * A0, rel=1e-12)
    # bearing: alpha_d = 100/(3*23.5) - 0.25 = 1.16844 -> alpha_b = min(1.168, 330/360, 1)
    # = 0.916667; k1 = min(2.8*60/23.5 - 1.7, 2.5) = 2.5; Fb,Rk = 2.5*0.916667*360*22*8
    # = 145 200 N; /1.25 = 116 160 N -> bearing governs
    assert r.value("Fb,Rk web").value == pytest.approx(2.5 * (330 / 360) * 360 * 22 * 8)
    assert r.Rr == pytest.approx(2.5 * (330 / 360) * 360 * 22 * 8 / 1.25)
    assert r.phi == pytest.approx(1 / 1.25)
    # edge distance 30 mm: k1 = 2.8*30/23.5 - 1.7 = 1.874468
    near = Ply("web", 8, 360, 1.0, e2=30.0)
    r = en1993_rivets.rivet_resistance(d=22, d0=23.5, m=2, pitch=100, plies=[near])
    k1 = 2.8 * 30 / 23.5 - 1.7
    assert r.value("Fb,Rk web").value == pytest.approx(k1 * (330 / 360) * 360 * 22 * 8)


def test_force_per_rivet_closed_form():
    # two stacked b x h rectangles: Q = b h (h/2), I = b (2h)³/12 -> q = VQ/I = 3V/(4h)
    # V = 100 kN, h = 150 mm: q = 500 N/mm; pitch 120 mm, one line: F = 60 000 N
    V, b, h = 100_000.0, 200.0, 150.0
    q = V * (b * h * h / 2) / (b * (2 * h) ** 3 / 12)
    assert q == pytest.approx(3 * V / (4 * h))
    assert rivet_force(q, 120.0).value == pytest.approx(60_000.0)
    assert rivet_force(q, 120.0, 2).value == pytest.approx(30_000.0)


def test_line_gaps_default_only_sound():
    g = line_gaps([400, 0, 100, 200, 300], ["loose", "sound", "missing", "headless", "sound"])
    assert g.positions == (0, 100, 200, 300, 400)
    assert g.effective_positions == (0.0, 300.0)
    assert (g.longest_gap, g.gap_from, g.gap_to) == (300.0, 0.0, 300.0)
    assert g.n_ineffective == 3 and g.has_load_path
    # stretches served: rivet at 0 -> [0, 150]; rivet at 300 -> [150, 400] (end lost): 250
    assert g.longest_tributary == 250.0 and g.governing_length == 300.0


def test_lost_end_rivet_shortens_the_gap_but_not_the_governing_length():
    # sound at 0, 200, 300 (gap 200); losing the rivet at 0 leaves gap 100 between 200 and
    # 300, but the rivet at 200 now serves the stretch 0..250 = 250 mm (closed form)
    before = line_gaps([0, 100, 200, 300], ["sound", "loose", "sound", "sound"])
    after = line_gaps([0, 100, 200, 300], ["missing", "loose", "sound", "sound"])
    assert after.longest_gap < before.longest_gap
    assert after.governing_length == 250.0 >= before.governing_length == 200.0


def test_line_gaps_engineer_counts_loose():
    g = line_gaps(
        [0, 100, 200, 300, 400],
        ["sound", "missing", "sound", "loose", "sound"],
        effective=("sound", "loose"),
    )
    assert g.longest_gap == 200.0 and (g.gap_from, g.gap_to) == (0.0, 200.0)


def test_no_load_path_is_a_finding_not_a_crash():
    g = line_gaps([0, 100, 200], ["missing", "sound", "headless"])
    assert g.longest_gap is None and not g.has_load_path
    assert "no effective load path" in g.finding
    assert shear_flow_resistance(50_000.0, g).value == 0.0


def test_shear_flow_resistance():
    # q_r = n_lines Rr / gap = 2 * 50 000 / 250 = 400 N/mm
    g = line_gaps([0, 125, 250], ["sound", "missing", "sound"])
    assert shear_flow_resistance(50_000.0, g, 2).value == pytest.approx(400.0)


def test_bad_input_named():
    with pytest.raises(InputError, match="unknown rivet state 'gone'"):
        line_gaps([0, 100], ["sound", "gone"])
    with pytest.raises(InputError, match="2 positions but 1 states"):
        line_gaps([0, 100], ["sound"])
    with pytest.raises(InputError, match="same position 100"):
        line_gaps([100, 100], ["sound", "sound"])
    for mod in (aashto_rivets, aisc_rivets):
        with pytest.raises(InputError, match="m = 5"):
            mod.rivet_resistance(
                d=22, d0=23.5, m=5, pitch=100, plies=[Ply("web", 10, 400)], Fnv=100
            )
    with pytest.raises(InputError, match="d0 = 20 mm is below d = 22"):
        en1993_rivets.rivet_resistance(d=22, d0=20, m=1, pitch=100, plies=[Ply("web", 10, 400)])
    with pytest.raises(InputError, match="q = -5"):
        rivet_force(-5, 100)


STATES = st.sampled_from(["sound", "loose", "missing", "headless"])


@given(st.lists(STATES, min_size=2, max_size=40), st.data())
def test_more_missing_never_shortens_gap_nor_raises_capacity(states, data):
    # property (common practice, no source): losing a rivet never shortens the governing
    # length (longest gap or stretch served by one rivet) nor raises the line's capacity
    pos = [100.0 * i for i in range(len(states))]
    before = line_gaps(pos, states)
    i = data.draw(st.integers(0, len(states) - 1))
    after_states = list(states)
    after_states[i] = "missing"
    after = line_gaps(pos, after_states)
    inf = math.inf
    assert (after.governing_length or inf) >= (before.governing_length or inf)
    assert (after.longest_tributary or inf) >= (before.longest_tributary or inf)
    assert shear_flow_resistance(1e5, after).value <= shear_flow_resistance(1e5, before).value
