"""The steel of a survey, as each family takes it.

- The engineer's values (survey material) always win.
- AASHTO: without a material, the steel by year built of the bridge evaluation manual
  (:func:`core.checks.material.material_for_year`; from memory). E = 29 000 ksi (AASHTO
  LRFD 6.4.1).
- AISC and EN 1993 have no table of early steels: without a material, asfound assumes
  fy = 180 MPa and fu = 300 MPa (its conservative assumption for steel of unknown grade and
  date, no source) and flags it for the engineer (coupon tests). E = 29 000 ksi (AISC 360-22
  B3 / Table of material properties, from memory) or 210 000 MPa (EN 1993-1-1 3.2.6).
- Fu not given with Fy given: by year for AASHTO when the year is known, else 1.2 Fy
  (asfound's conservative assumption).
"""

from __future__ import annotations

from core.checks.material import E_STEEL, Material, material_for_year
from core.checks.results import ENGINEER
from core.families.base import Choice
from core.survey.model import Survey

E_EN = 210_000.0
E_SOURCE = {
    "aashto": "29 000 ksi, AASHTO LRFD 9th ed. (2020), 6.4.1 (from memory)",
    "aisc": "29 000 ksi, AISC 360-22 (from memory)",
    "en1993": "210 000 MPa, EN 1993-1-1:2005 3.2.6 (from memory)",
}
UNKNOWN = (180.0, 300.0)
UNKNOWN_SOURCE = (
    "asfound's conservative assumption for steel of unknown grade and date (no source in this "
    "family): fy 180 MPa, fu 300 MPa; determine the steel by coupon tests"
)


def resolve_material(survey: Survey, family: str) -> tuple[Material, list[Choice], bool]:
    """(material, its assumptions, True when the steel itself is assumed).

    Raises:
        InputError / UnitError: values out of range or in a wrong unit.
    """
    h = survey.survey
    E_default = E_STEEL if family != "en1993" else E_EN
    by_year = (
        material_for_year(h.year_built) if family == "aashto" and h.year_built is not None else None
    )
    if h.material is not None:
        m = h.material
        Fy = m.Fy.to("stress", "survey / material / Fy")
        if m.Fu is not None:
            Fu, fu_src = m.Fu.to("stress", "survey / material / Fu"), ENGINEER
        elif by_year is not None:
            Fu, fu_src = by_year.Fu, by_year.source
        else:
            Fu, fu_src = (
                1.2 * Fy,
                "Fu = 1.2 Fy assumed (asfound's conservative assumption; give Fu)",
            )
        E = m.E.to("stress", "survey / material / E") if m.E is not None else E_default
        mat = Material(Fy=Fy, Fu=Fu, E=E, source=ENGINEER)
        return (
            mat,
            [
                Choice("Fy", f"{mat.Fy:.4g} MPa", ENGINEER),
                Choice("Fu", f"{mat.Fu:.4g} MPa", fu_src),
                Choice("E", f"{mat.E:.6g} MPa", ENGINEER if m.E is not None else E_SOURCE[family]),
            ],
            False,
        )
    if by_year is not None:
        return (
            by_year,
            [
                Choice(
                    "steel by year built",
                    f"Fy {by_year.Fy:.4g} MPa, Fu {by_year.Fu:.4g} MPa, E {by_year.E:.6g} MPa",
                    by_year.source,
                )
            ],
            True,
        )
    if family == "aashto":
        low = material_for_year(1900)
        return (
            low,
            [
                Choice(
                    "steel (no material and no year built given)",
                    f"Fy {low.Fy:.4g} MPa, Fu {low.Fu:.4g} MPa: the lowest default (before 1905)",
                    "conservative choice of asfound; " + low.source,
                )
            ],
            True,
        )
    fy, fu = UNKNOWN
    mat = Material(Fy=fy, Fu=fu, E=E_default, source=UNKNOWN_SOURCE)
    return (
        mat,
        [
            Choice("steel (no material given)", f"fy {fy:g} MPa, fu {fu:g} MPa", UNKNOWN_SOURCE),
            Choice("E", f"{E_default:.6g} MPa", E_SOURCE[family]),
        ],
        True,
    )
