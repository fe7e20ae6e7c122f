"""Local web shear: (a) first yield of the cut-average stress tau = VQ/(I t) at the thinnest
cut (EN 1993-1-1:2005 6.2.6(4) states the elastic criterion; the shear yield stresses are
0.58 Fyw of AASHTO LRFD 6.10.9.2, 0.6 Fy of AISC 360-22 G2.1 and fy/sqrt(3) of EN 1993-1-1
6.2.6(2), from memory) and (b) plastic shear of the net vertical section. Closed form of a
rectangle (mechanics of materials): tau_max = 1.5 V / A at mid-depth."""

import pytest

from core.checks.web_local_shear import local_web_shear

KW = dict(
    tau_y_words="0.58 Fyw", tau_y_source="clause", phi=1.0, standard="s", edition="e", clause="c"
)


def test_rectangle_elastic_governs():
    # web alone 1000 x 10: max Q/(I t) = 1.5 / A = 1.5e-4 per N; tau_y = 0.58 * 250 = 145 MPa
    # V_el = 145 / 1.5e-4 = 966 667 N; plastic net 145 * 9000 = 1 305 000 N -> V_el governs
    r = local_web_shear(tau_y=145.0, tau_per_V=1.5 / 10_000, cut_height=500.0, A_v_net=9000.0, **KW)
    assert r.Rn == pytest.approx(145 * 10_000 / 1.5)
    assert r.value("V_pl,net").value == pytest.approx(1_305_000.0)
    assert "thinnest cut" in r.notes[0]


def test_perforated_web_uses_the_net_plastic_shear():
    # a cut-through web: VQ/It not applicable, only (b): 145 * 9000 = 1 305 000 N
    r = local_web_shear(tau_y=145.0, tau_per_V=None, cut_height=None, A_v_net=9000.0, **KW)
    assert r.Rn == pytest.approx(1_305_000.0) and not r.has("V_el")
    assert any("only the net plastic shear" in n for n in r.notes)
