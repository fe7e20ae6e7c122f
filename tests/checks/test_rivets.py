"""Rivets: resistance, force per rivet, and gaps between effective rivets.

Sources: AISC 360-22 Appendix 5 Table A-5.3.1 (A502 Grade 1, Fnv = 25 ksi, phi = 0.75; from
memory) with J3.7 Rn = Fnv Ab per plane; AASHTO LRFD 6.13.2.9 bearing Rn = 2.4 d t Fu (from
memory); hand calculation from those clauses. Force per rivet: closed form of the shear flow
q = VQ/I in a beam of two stacked rectangles (mechanics of materials; no textbook example's
numbers are used because none is recalled reliably).
"""

import math

import pytest
from hypothesis import given
from hypothesis import strategies as st

from core.checks.rivets import (
    A502_GRADE_1,
    Ply,
    line_gaps,
    rivet_force,
    rivet_resistance,
    shear_flow_resistance,
)
from core.errors import InputError
from core.units import from_internal


def test_A502_default():
    # Table A-5.3.1 (from memory): Fnv = 25 ksi = 172.369 MPa, Fnt = 45 ksi, phi = 0.75
    assert A502_GRADE_1.Fnv == pytest.approx(172.369, rel=1e-5)
    assert from_internal(A502_GRADE_1.Fnt, "stress", "ksi") == pytest.approx(45.0)
    assert A502_GRADE_1.phi == 0.75


def test_seven_eighths_inch_rivet_single_shear_in_kips():
    # Ab = pi 0.875²/4 = 0.601320 in²; Rn = 25 * 0.601320 = 15.033 kip; phi Rn = 11.275 kip
    r = rivet_resistance(d="0.875 in", m=1, plies=[Ply("web", "0.5 in", "60 ksi")])
    assert from_internal(r.Rn, "force", "kip") == pytest.approx(15.033, rel=1e-4)
    assert from_internal(r.Rr, "force", "kip") == pytest.approx(11.275, rel=1e-4)
    assert r.limit_state == "rivet (shear)"


def test_double_shear_and_bearing_governs():
    # d = 22 mm, m = 2: Rn,shear = 2 * (pi 22²/4) * 172.369 = 131 046 N
    # bearing on a 6 mm web, Fu = 400: 2.4 * 22 * 6 * 400 = 126 720 N -> governs (same phi)
    r = rivet_resistance(d=22, m=2, plies=[Ply("web", 6, 400), Ply("angle", 12, 400, 0.5)])
    assert r.value("Rn,shear").value == pytest.approx(2 * math.pi * 22**2 / 4 * 172.369, rel=1e-5)
    assert r.value("Rn,bearing web").value == pytest.approx(126_720.0)
    # the outer angle bears half the rivet force: 2.4*22*12*400 / 0.5 = 506 880 N
    assert r.value("Rn,bearing angle").value == pytest.approx(506_880.0)
    assert r.Rn == pytest.approx(126_720.0) and "bearing on web" in r.limit_state


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
    with pytest.raises(InputError, match="m = 5"):
        rivet_resistance(d=22, m=5, plies=[Ply("web", 10, 400)])
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
