"""First-order propagation through the section engine against closed forms, and the
normal approximation's numbers."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as hs

from core.bands.options import Z95
from core.bands.propagate import Band, beyond_one, first_order, monte_carlo, normal_cdf
from core.definition import PartThickness, SectionDefinition, StationLoss
from core.errors import InputError
from core.parts import Plate
from core.section import analyse

B, T, SIGMA = 300.0, 20.0, 0.4  # mm: one horizontal plate, thickness t ~ N(T, SIGMA^2)
PLATE = SectionDefinition((Plate("p", B, T, 0.0, 0.0),), name="plate")


def plate_props(deltas) -> dict[str, float]:
    """A and Ix of the plate from the engine, its thickness moved by deltas["p"] (mm); the
    plate is taken at T - 1 mm as found so that a move up stays below nominal."""
    t = T - 1.0 + deltas.get("p", 0.0)
    g = analyse(PLATE, StationLoss((PartThickness("p", t),))).gross.props
    return {"A": g.A, "I": g.Ix}


def test_plate_area_and_inertia_by_the_delta_method():
    """A = b t: sd(A) = b sigma exactly (linear); I = b t^3 / 12: var(I) ~ (b t^2 / 4)^2
    sigma^2 (the delta method, any probability text, e.g. Casella & Berger, Statistical
    Inference, 2nd ed., 5.5.4, from memory). The finite-difference step 0.01 mm on t = 19 mm makes the secant
    slope of t^3 differ from 3 t^2 by about 0.01 / 19 relative: tolerance 1e-3."""
    t = T - 1.0
    bands, runs = first_order(plate_props, {"p": SIGMA}, {"A": None, "I": None})
    assert runs == 2  # the base and one move of the one region
    assert bands["A"].value == pytest.approx(B * t, rel=1e-12)
    assert bands["A"].sd == pytest.approx(B * SIGMA, rel=1e-9)
    assert bands["I"].value == pytest.approx(B * t**3 / 12.0, rel=1e-12)
    assert bands["I"].sd == pytest.approx(B * t**2 / 4.0 * SIGMA, rel=1e-3)
    # the 5 % and 95 % values of the normal approximation: mean -+ 1.6449 sd
    assert bands["A"].p95 - bands["A"].value == pytest.approx(1.6448536 * B * SIGMA, rel=1e-6)


def test_plate_monte_carlo_against_the_closed_form():
    """2000 draws of a normal thickness: the sample sd of A is b sigma within the sampling
    error of a standard deviation (relative sd about 1 / sqrt(2 n) = 1.6 %; 5 % allowed)."""
    bands, runs = monte_carlo(plate_props, {"p": SIGMA}, {"A": None}, 2000, seed=7)
    assert runs == 2001
    assert bands["A"].sd == pytest.approx(B * SIGMA, rel=0.05)
    # the 5 % value of a normal A: mean - 1.645 sd (within the sampling error)
    assert bands["A"].p5 == pytest.approx(B * (T - 1) - Z95 * B * SIGMA, rel=0.005)


def test_monte_carlo_is_the_same_every_run():
    a, _ = monte_carlo(plate_props, {"p": SIGMA}, {"A": None}, 50, seed=3)
    b, _ = monte_carlo(plate_props, {"p": SIGMA}, {"A": None}, 50, seed=3)
    assert a == b


def test_normal_cdf_and_probability_beyond_one():
    """Phi(1.6449) = 0.95, Phi(0) = 0.5 (standard normal table, any statistics text)."""
    assert normal_cdf(1.6448536269514722) == pytest.approx(0.95, abs=1e-12)
    assert normal_cdf(0.0) == 0.5
    # RF 0.97 with sd 0.055: P(RF < 1) = Phi(0.03 / 0.055) = Phi(0.5455) = 0.7073
    assert beyond_one(0.97, 0.055, True) == pytest.approx(0.70729, abs=1e-4)
    # a utilisation 0.97 with the same sd: P(U > 1) = 1 - 0.7073
    assert beyond_one(0.97, 0.055, False) == pytest.approx(1 - 0.70729, abs=1e-4)
    assert beyond_one(0.97, 0.0, True) == 1.0 and beyond_one(1.2, 0.0, True) == 0.0


def test_a_band_is_validated():
    with pytest.raises(InputError, match="not finite"):
        Band("q", math.nan, 0.0, 0.0, 0.0, None, "first_order")
    with pytest.raises(InputError, match="not ordered"):
        Band("q", 1.0, 0.1, 1.2, 0.8, None, "first_order")
    assert Band("q", 0.97, 0.05, 0.88, 1.06, 0.7, "first_order").straddles(1.0)
    assert not np.isnan(Band("q", 1.0, 0.0, 1.0, 1.0, 0.0, "first_order").width)


@settings(max_examples=30, deadline=None)
@given(
    b=hs.floats(50.0, 800.0),
    t=hs.floats(5.0, 40.0),
    sigma=hs.floats(0.0, 1.0),
)
def test_delta_method_on_any_plate(b, t, sigma):
    """Any plate: sd(A) = b sigma and sd(I) = b t^2 / 4 sigma to the finite-difference
    error (step 0.01 mm: relative 0.01 / t <= 0.2 %; the delta method, as above)."""
    defn = SectionDefinition((Plate("p", b, t + 1.0, 0.0, 0.0),), name="plate")

    def f(d):
        g = analyse(defn, StationLoss((PartThickness("p", t + d.get("p", 0.0)),))).gross.props
        return {"A": g.A, "I": g.Ix}

    bands, _ = first_order(f, {"p": sigma}, {"A": None, "I": None})
    assert bands["A"].sd == pytest.approx(b * sigma, rel=1e-6, abs=1e-9)
    assert bands["I"].sd == pytest.approx(b * t**2 / 4.0 * sigma, rel=2e-3, abs=1e-9)
