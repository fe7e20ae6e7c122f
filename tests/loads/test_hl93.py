"""HL-93 on simple spans against an independent brute-force sweep written here.

Sources: the HL-93 loads themselves are AASHTO LRFD 9th edition (2020) 3.6.1.2.2 (design
truck 8, 32, 32 kip; 14 ft; rear spacing 14 to 30 ft), 3.6.1.2.3 (design tandem 25 + 25 kip
at 4 ft), 3.6.1.2.4 (design lane 0.64 kip/ft) and 3.6.2.1 (IM 33 % on truck and tandem only),
all from memory. The brute force below uses only statics of a simply supported beam (reaction
R_A = sum P (L - a) / L; M(x) = R_A x - sum over loads left of x of P (x - a)), on a grid that
contains every exact extreme (stations, spans and spacings on a half-foot grid). The design
truck's absolute maximum moment on a 100 ft span is checked against the closed form of the
absolute-maximum-moment theorem (R. C. Hibbeler, Structural Analysis, section "absolute
maximum shear and moment") and the HS20 table value 1524.0 kip-ft per lane (AASHTO Standard
Specifications for Highway Bridges, 17th ed. 2002, Appendix A; from memory).
"""

from __future__ import annotations

import numpy as np
import pytest

from core.loads.models import FT, HL93, KIP, KIP_PER_FT

STEP = 0.5  # ft


def statics(L: float, x: float, pos: np.ndarray, P: np.ndarray) -> tuple:
    """(M, V just right of x, V just left of x) for loads P at positions pos (ft, kip);
    pos has shape (n_cases, n_axles). Loads off the span carry nothing."""
    on = (pos >= 0.0) & (pos <= L)
    Pm = np.where(on, P, 0.0)
    RA = np.sum(Pm * (L - pos) / L, axis=1)
    left = pos < x
    M = RA * x - np.sum(np.where(left, Pm * (x - pos), 0.0), axis=1)
    V_right = RA - np.sum(np.where(pos <= x, Pm, 0.0), axis=1)
    V_left = RA - np.sum(np.where(left, Pm, 0.0), axis=1)
    return M, V_right, V_left


def brute_train(L: float, x: float, P, gaps) -> tuple[float, float, float]:
    """Max M, max V, min V of axles P (kip) with gaps (ft) given as lists of candidates."""
    firsts = np.arange(-70.0, L + 70.0 + 1e-9, STEP)
    best = [0.0, 0.0, 0.0]
    for g in gaps:
        offs = np.concatenate([[0.0], np.cumsum(g)])
        for d in (1.0, -1.0):
            pos = firsts[:, None] + d * offs[None, :]
            M, Vr, Vl = statics(L, x, pos, np.asarray(P, float)[None, :])
            best[0] = max(best[0], M.max())
            best[1] = max(best[1], Vr.max(), Vl.max())
            best[2] = min(best[2], Vr.min(), Vl.min())
    return tuple(best)


def brute_lane(L: float, x: float, w: float) -> tuple[float, float, float]:
    """Lane load w (kip/ft) as many point loads (midpoint rule; exact for the linear pieces
    of the influence lines, x lying on a grid line), on the stretch that is unfavourable."""
    n = round(L / (STEP / 16))  # x lies on a grid line
    h = L / n
    a = (np.arange(n) + 0.5) * h
    M, Vr, _ = statics(L, x, a[:, None], np.array([[w * h]]))
    return M.sum(), Vr[Vr > 0].sum(), Vr[Vr < 0].sum()


def brute_hl93(L: float, x: float, IM: float = 0.33) -> tuple[float, float, float]:
    spacings = np.arange(14.0, 30.0 + 1e-9, STEP)
    truck = brute_train(L, x, [8.0, 32.0, 32.0], [[14.0, s] for s in spacings])
    tandem = brute_train(L, x, [25.0, 25.0], [[4.0]])
    lane = brute_lane(L, x, 0.64)
    M = (1 + IM) * max(truck[0], tandem[0]) + lane[0]
    Vp = (1 + IM) * max(truck[1], tandem[1]) + lane[1]
    Vn = (1 + IM) * min(truck[2], tandem[2]) + lane[2]
    return M, Vp, Vn


@pytest.mark.parametrize("L", [30.0, 75.0, 140.0])
@pytest.mark.parametrize("frac", [0.0, 0.1, 0.25, 0.4, 0.5])
def test_hl93_matches_brute_force(L, frac):
    x = round(frac * L / STEP) * STEP
    env = HL93().envelope(L * FT, x * FT)
    M, Vp, Vn = brute_hl93(L, x)
    assert env.M.value / (KIP * FT) == pytest.approx(M, rel=1e-6, abs=1e-6)
    assert env.V_pos.value / KIP == pytest.approx(Vp, rel=1e-6, abs=1e-6)
    assert env.V_neg.value / KIP == pytest.approx(Vn, rel=1e-6, abs=1e-6)


def test_parts_truck_tandem_lane_and_im_on_truck_only():
    # 30 ft span, mid-span moment (statics, hand calculation): the tandem with one axle at
    # mid-span gives 25 x 7.5 + 25 x (15 - 4) / 2 = 325 kip-ft; the design truck at most
    # 32 x 7.5 + 8 x 0.5 + 32 x 0.5 = 260 kip-ft; the lane w L^2 / 8 = 72 kip-ft takes no IM
    L = 30.0
    env = HL93().envelope(L * FT, 15.0 * FT)
    parts = env.M.parts
    assert "tandem" in parts[0].what and "lane" in parts[1].what
    assert parts[0].value / (KIP * FT) == pytest.approx(1.33 * 325.0, rel=1e-9)
    assert parts[1].value / (KIP * FT) == pytest.approx(0.64 * L**2 / 8.0, rel=1e-9)
    assert HL93.lane_w == pytest.approx(0.64 * KIP_PER_FT)


def test_design_truck_absolute_maximum_moment_100ft():
    # resultant 72 kip lies 4.667 ft behind the middle axle; the middle axle stands 2.333 ft
    # from mid-span: M = 72 (L/2 - 2.333)^2 / L - 8 x 14 (Hibbeler, absolute maximum moment)
    L = 100.0
    e = 28.0 / 6.0  # 4.667 ft
    x = L / 2 - e / 2
    closed = 72.0 * (L / 2 - e / 2) ** 2 / L - 8.0 * 14.0
    env = HL93(IM=0.0).envelope(L * FT, x * FT)
    truck = env.M.parts[0].value / (KIP * FT)
    assert truck == pytest.approx(closed, rel=1e-9)
    assert truck == pytest.approx(1524.0, abs=0.2)  # HS20 table, 100 ft (from memory)
    assert "variable spacing 14 ft" in env.M.parts[0].at
