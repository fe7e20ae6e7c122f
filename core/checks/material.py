"""Steel material: validated properties, and defaults by year built when the grade is unknown.

Yield strength by year of construction, from memory of the AASHTO Manual for Bridge
Evaluation table of minimum mechanical properties of structural steel by year (flag as
"from memory"): before 1905 Fy = 26 ksi; 1905-1936 30 ksi; 1936-1963 33 ksi; after 1963
36 ksi. The table's year ranges share their end years; a shared year is given the lower
(earlier) value, which is conservative (our choice).

Tensile strength defaults are our assumption (flag as such): 52 ksi before 1905 (2 Fy),
60 ksi for 1905-1963 (the ASTM A7 minimum tensile strength, from memory) and 58 ksi after
1963 (the ASTM A36 minimum, from memory). The evaluation manual's table may list other
values; the engineer confirms. E = 29 000 ksi.
"""

from __future__ import annotations

import datetime
from dataclasses import dataclass

from core.checks._inputs import Number, internal
from core.errors import InputError
from core.units import to_internal

E_STEEL = to_internal(29_000.0, "ksi", "stress")
_FROM_MEMORY = "AASHTO Manual for Bridge Evaluation, steel properties by year built (from memory)"

#: (last year of the range, Fy ksi, Fu ksi, range label)
_BY_YEAR: tuple[tuple[int, float, float, str], ...] = (
    (1904, 26.0, 52.0, "before 1905"),
    (1936, 30.0, 60.0, "1905-1936"),
    (1963, 33.0, 60.0, "1937-1963"),
    (10_000, 36.0, 58.0, "after 1963"),
)


@dataclass(frozen=True)
class Material:
    """Structural steel: Fy, Fu and E in MPa, and where the values come from.

    Inputs may be numbers in MPa or strings with units (``"36 ksi"``).

    Raises:
        InputError: Fy outside 150 to 700 MPa, Fu not above Fy (or above 1000 MPa),
            E outside 150 000 to 220 000 MPa.
    """

    Fy: float
    Fu: float
    E: float = E_STEEL
    source: str = "engineer's input"

    def __post_init__(self) -> None:
        w = f"material ({self.source})"
        fy = internal(self.Fy, "stress", "Fy", where=w, low=150.0, high=700.0, low_inclusive=True)
        fu = internal(self.Fu, "stress", "Fu", where=w, low=0.0, high=1000.0)
        e = internal(
            self.E, "stress", "E", where=w, low=150_000.0, high=220_000.0, low_inclusive=True
        )
        if fu <= fy:
            raise InputError(f"Fu = {fu:g} MPa must exceed Fy = {fy:g} MPa", where=w)
        object.__setattr__(self, "Fy", fy)
        object.__setattr__(self, "Fu", fu)
        object.__setattr__(self, "E", e)


def material_for_year(year: Number) -> Material:
    """Default steel for a structure built in ``year`` when the grade is unknown.

    Raises:
        InputError: year not a whole number between 1850 and the current year.
    """
    now = datetime.date.today().year
    try:
        y = int(year)
    except (TypeError, ValueError):
        raise InputError(f"year built = {year!r} is not a whole number") from None
    fractional = isinstance(year, float) and not year.is_integer()
    if fractional or not 1850 <= y <= now:
        raise InputError(f"year built = {year!r} is outside the allowed range (1850 to {now})")
    for last, fy, fu, label in _BY_YEAR:
        if y <= last:
            return Material(
                Fy=to_internal(fy, "ksi", "stress"),
                Fu=to_internal(fu, "ksi", "stress"),
                E=E_STEEL,
                source=(
                    f"built {y} ({label}): Fy = {fy:g} ksi from the {_FROM_MEMORY}; "
                    f"Fu = {fu:g} ksi assumed (our assumption, engineer to confirm); "
                    "E = 29 000 ksi"
                ),
            )
    raise AssertionError("unreachable: the last range is open-ended")
