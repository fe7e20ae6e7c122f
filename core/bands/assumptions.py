"""The assumptions of the bands, each with its source, for the JSON and the report."""

from __future__ import annotations

from core.assess.results import Assumption
from core.bands.options import STEP_MM, BandOptions
from core.bands.station import FLOOR

NO_SOURCE = "common practice, no source"
AID = (
    "The bands show how far the readings alone settle each as-found value; they are an aid "
    "for the engineer and not a reliability rating (no uncertainty of the model, the loads, "
    "the material or the drawings is in them)."
)


def band_assumptions(opts: BandOptions) -> list[Assumption]:
    """Every assumption the bands rest on, in words, with its source."""
    tol = ", ".join(f"{k} +-{v:g} mm" for k, v in opts.tolerance_mm.items())
    method = (
        "first order: one thinning step of each part region through the engine "
        f"({STEP_MM:g} mm), variances added, normal approximation for the 5 % and 95 % "
        "values and the probability beyond 1"
        if opts.method == "first_order"
        else f"Monte Carlo: {opts.samples} draws through the engine, numpy default_rng seed "
        f"{opts.seed}; 5 % and 95 % sample quantiles"
    )
    return [
        Assumption("bands: what they are", AID, NO_SOURCE),
        Assumption(
            "bands: instrument tolerance",
            f"{tol}; a reading with no instrument recorded: {opts.default_instrument}; "
            "editable per instrument",
            NO_SOURCE,
        ),
        Assumption(
            "bands: tolerance as a standard deviation",
            f"the tolerance is {opts.tolerance_sigmas:g} standard deviations (a normal error), "
            "and systematic: it does not shrink with more readings (conservative)",
            NO_SOURCE,
        ),
        Assumption(
            "bands: scatter of a region",
            "the standard error of the readings' mean s / sqrt(n) (s the sample standard "
            "deviation); the same sigma is used under the minimum-thickness basis",
            "any statistics text",
        ),
        Assumption(
            "bands: one reading",
            f"a coefficient of variation of {100 * opts.cov_single:g} % of the reading",
            NO_SOURCE,
        ),
        Assumption(
            "bands: independence",
            "the part regions' thicknesses are independent; a moved region keeps at least "
            f"{100 * FLOOR:g} % of nominal and is capped at nominal; the web's panel "
            "thickness moves with this station's web readings only; a member-wide as-found "
            "value (a U-frame chord at the weakest station) is held",
            NO_SOURCE,
        ),
        Assumption("bands: propagation", method, "the delta method (any probability text)"),
        Assumption(
            "bands: where to measure next",
            f"regions ranked by their share (dC/dt sigma)^2 of the governing band's variance; "
            f"{opts.more} more readings of the same scatter shrink the standard error only",
            NO_SOURCE,
        ),
    ]
