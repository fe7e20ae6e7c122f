"""Material by year built: Fy from memory of the AASHTO Manual for Bridge Evaluation table
(26 / 30 / 33 / 36 ksi); Fu defaults are our assumption (52 / 60 / 60 / 58 ksi); E = 29 000
ksi. Conversion 1 ksi = 6.894757 MPa (NIST SP 811)."""

import pytest

from core.checks.material import Material, material_for_year
from core.errors import InputError, UnitError

KSI = 6.894757


@pytest.mark.parametrize(
    ("year", "fy", "fu"),
    [
        (1890, 26, 52),
        (1904, 26, 52),
        (1905, 30, 60),
        (1936, 30, 60),
        (1937, 33, 60),
        (1963, 33, 60),
        (1964, 36, 58),
        (2001, 36, 58),
    ],
)
def test_by_year(year, fy, fu):
    m = material_for_year(year)
    assert m.Fy == pytest.approx(fy * KSI, rel=1e-6)
    assert m.Fu == pytest.approx(fu * KSI, rel=1e-6)
    assert pytest.approx(29_000 * KSI, rel=1e-6) == m.E
    assert "from memory" in m.source and "assumed" in m.source


def test_units_and_validation():
    m = Material(Fy="36 ksi", Fu="58 ksi")
    assert m.Fy == pytest.approx(248.211, rel=1e-5)
    assert Material(Fy=250, Fu=400, E=200_000).E == 200_000
    with pytest.raises(InputError, match="Fy = 100 MPa is outside the allowed range"):
        Material(Fy=100, Fu=400)
    with pytest.raises(InputError, match="Fu = 300 MPa must exceed Fy = 350"):
        Material(Fy=350, Fu=300)
    with pytest.raises(InputError, match="E = 29000"):
        Material(Fy=250, Fu=400, E=29000)
    with pytest.raises(UnitError):
        Material(Fy="36 in", Fu=400)
    with pytest.raises(InputError, match="year built = 1700"):
        material_for_year(1700)
    with pytest.raises(InputError, match=r"year built = 1950\.5"):
        material_for_year(1950.5)
