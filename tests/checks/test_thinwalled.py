"""Torsion and warping constants of rectangle sections against closed forms and a
general-purpose finite-element section library.

Sources: Roark's Formulas for Stress and Strain, 7th ed., Table 10.1 case 4 (rectangle J;
from memory); the I-section warping constant Iw = Iz hs²/4 (doubly symmetric) and
Ifc Ift hs²/(Ifc + Ift) (singly symmetric) of thin-walled theory (Timoshenko and Gere, 2nd
ed., Art. 5.10; from memory); Kitipornchai and Trahair (1980) beta_x approximation as quoted
in the AISC 360 Commentary to F4 (from memory); oracle: sectionproperties (PyPI) warping
analysis (FE, mesh 40 mm²), test dependency only.
"""

import numpy as np
import pytest
import shapely

from core.checks.thinwalled import kitipornchai_trahair_beta_x, torsion_constant, warping
from core.errors import GeometryError

# singly symmetric I: top flange 400 x 20, bottom 200 x 20, web 10 x 960 (y up, mm)
MONO = np.array([[-200, 480, 200, 500], [-100, -500, 100, -480], [-5, -480, 5, 480]], float)
# doubly symmetric I: flanges 300 x 20 at +-490, web 10 x 960
DOUBLY = np.array([[-150, 480, 150, 500], [-150, -500, 150, -480], [-5, -480, 5, 480]], float)


def test_rectangle_J_roark():
    # 100 x 10: J = 100 * 10³ (1/3 - 0.21 * 0.1 (1 - 0.1⁴/12)) = 100 000 * 0.31233351
    # = 31 233.35 mm⁴
    assert torsion_constant(np.array([[0, 0, 100, 10]])) == pytest.approx(31_233.35083, rel=1e-9)


def test_doubly_symmetric_I_closed_forms():
    w = warping(DOUBLY)
    # Iz = 2 * 20 * 300³/12 + 960 * 10³/12 = 90 000 000 + 80 000 mm⁴
    assert w.Iy == pytest.approx(90_080_000.0, rel=1e-12)
    assert w.y0 == pytest.approx(0.0, abs=1e-9) and w.beta_x == pytest.approx(0.0, abs=1e-9)
    # Iw = Iz,f hs²/4 with hs = 980: 9.0e7 * 980² / 4 = 2.1609e13 mm⁶; the integral over the
    # flange thickness adds (1 + tf²/(3 hs²)) = 1.000139 and the web a little more
    assert w.Iw == pytest.approx(9.0e7 * 980**2 / 4, rel=5e-4)


def test_singly_symmetric_I_flange_formula_and_kt():
    w = warping(MONO)
    Ifc, Ift, hs = 400**3 * 20 / 12, 200**3 * 20 / 12, 980.0
    # Iw = Ifc Ift hs² / (Ifc + Ift) = 1.13825e13 mm⁶ (flanges only)
    assert w.Iw == pytest.approx(Ifc * Ift * hs**2 / (Ifc + Ift), rel=3e-3)
    # shear centre from the compression flange: hs Ift/(Ifc + Ift) = 108.9 mm -> y = 381.1
    assert w.ys == pytest.approx(490.0 - hs * Ift / (Ifc + Ift), rel=2e-3)
    # beta_x positive with the larger flange in compression, within 5 % of K&T's estimate
    kt = kitipornchai_trahair_beta_x(hs, Ifc, w.Iy, w.Ix)
    assert w.beta_x > 0
    assert w.beta_x == pytest.approx(kt, rel=0.05)


def test_mirror_changes_the_sign_of_beta_x():
    # hogging (bottom flange, the smaller, in compression): beta_x changes sign
    top, bottom = warping(MONO), warping(MONO, compression="bottom")
    assert bottom.beta_x == pytest.approx(-top.beta_x, rel=1e-12)
    assert bottom.ys == pytest.approx(top.ys, rel=1e-12) and bottom.Iw == pytest.approx(top.Iw)


def test_not_symmetric_refused():
    with pytest.raises(GeometryError, match="not symmetric"):
        warping(np.array([[0, 0, 100, 10]]))


def _fe(rects):
    pytest.importorskip("sectionproperties")
    from sectionproperties.analysis.section import Section as FESection
    from sectionproperties.pre.geometry import Geometry

    g = Geometry(shapely.union_all(shapely.box(*rects.T)))
    g.create_mesh(mesh_sizes=[40.0])
    sec = FESection(g)
    sec.calculate_geometric_properties()
    sec.calculate_warping_properties()
    return sec


def test_against_fe_library_singly_symmetric_I():
    # sectionproperties: Iw (gamma), shear centre and beta_x+ of the fused section; our J
    # takes the plates apart, so it is lower (conservative) than the fused section's
    sec = _fe(MONO)
    w = warping(MONO)
    assert w.Iw == pytest.approx(float(sec.get_gamma()), rel=2e-3)
    assert w.ys == pytest.approx(float(sec.get_sc()[1]), rel=2e-3)
    assert w.beta_x == pytest.approx(float(sec.get_beta()[0]), rel=2e-3)
    assert 0.95 * float(sec.get_j()) < w.J <= float(sec.get_j())
