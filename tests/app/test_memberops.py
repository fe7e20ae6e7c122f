"""Members and as-built values changed without the screen (fieldapp.members, fieldapp.asbuilt).

Our own rules, no outside source needed: a copy carries the as-built values and nothing
found on the original; a refused value changes nothing; the steel's consequence is core's
(AASHTO Manual for Bridge Evaluation, steel by year built, from memory: before 1905
Fy = 26 ksi)."""

from __future__ import annotations

import pytest

from core.errors import InputError
from fieldapp import asbuilt, members
from fieldapp.places import PlaceBook
from fieldapp.session import Session
from tests.app.conftest import SAMPLES


@pytest.fixture
def us(tmp_path):
    s = Session.from_sample(tmp_path, PlaceBook(tmp_path), SAMPLES / "through-girder-us.json")
    yield s
    s.close()


def row(s, key):
    return next(r for _h, rows in asbuilt.groups(s) for r in rows if r.key == key)


def test_copy_carries_the_as_built_values_and_nothing_found(us):
    src = us.member()
    assert any(r.states for r in src.rivets) or src.condition is not None
    members.copy_member(us, "G9")
    new = us.member()
    assert new.id == "G9" and new.section == src.section and new.span == src.span
    assert new.stations == [] and all(r.states == [] for r in new.rivets)
    assert new.condition is None
    assert all(not x.readings and not x.bands for x in new.stiffeners)


def test_year_built_consequence_and_refusals_in_us_units(us):
    asbuilt.apply(us, row(us, ("header", "Fy")), "")  # no steel given: assumed
    asbuilt.apply(us, row(us, ("header", "year_built")), "1898")
    assert asbuilt.material_words(us).startswith("Fy 26 ksi assumed from year built 1898")
    before = us.header
    with pytest.raises(InputError, match=r"year_built = 1700 .*1800 to"):
        asbuilt.apply(us, row(us, ("header", "year_built")), "1700")
    with pytest.raises(InputError, match="not a whole year"):
        asbuilt.apply(us, row(us, ("header", "year_built")), "1898.5")
    with pytest.raises(InputError, match="thickness of top cover plate"):
        asbuilt.add_cover(us, "top", "14", "x")
    assert us.header == before
