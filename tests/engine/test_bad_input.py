"""Bad input gets a clear error naming the value, the allowed range and the place."""

from __future__ import annotations

import json
import math

import pytest

from core.definition import (
    LossBand,
    PartThickness,
    Perforation,
    SectionDefinition,
    StationLoss,
    riveted_girder,
)
from core.errors import AsfoundError, GeometryError, InputError, SchemaError
from core.parts import Plate
from core.section import analyse
from core.sectionfile import load_section_file

G = riveted_girder(D=1000, tw=10, angle_h=125, angle_v=125, angle_t=12, rivet_d=20)


@pytest.mark.parametrize("t", [-3.0, 0.0, math.nan, math.inf, 1e9])
def test_bad_plate_thickness(t) -> None:
    with pytest.raises(GeometryError, match=r"thickness t = .* outside the allowed range") as e:
        Plate("web", 1000, t, 0, 0, "vertical")
    assert "part 'web'" in str(e.value)
    assert isinstance(e.value, ValueError) and isinstance(e.value, AsfoundError)


@pytest.mark.parametrize("t", [-1.0, 0.0, math.nan])
def test_bad_remaining_thickness(t) -> None:
    with pytest.raises(InputError, match="remaining thickness"):
        PartThickness("web", t)


def test_remaining_thickness_above_nominal() -> None:
    with pytest.raises(GeometryError, match=r"12 mm is above the nominal 10 mm") as e:
        analyse(G, StationLoss((PartThickness("web", 12.0),), where="file.json / S2"))
    assert "S2" in str(e.value) and "'web'" in str(e.value)


def test_loss_removing_whole_part() -> None:
    with pytest.raises(GeometryError, match="removes the whole part"):
        analyse(G, StationLoss(perforations=(Perforation("web", 0, 1000),)))
    with pytest.raises(GeometryError, match="band remaining thickness 11 mm is above"):
        analyse(G, StationLoss(bands=(LossBand("web", 100, 200, 11.0),)))


def test_perforation_outside_plate() -> None:
    with pytest.raises(GeometryError, match=r"perforation 990 to 1100 mm lies outside the plate"):
        analyse(G, StationLoss(perforations=(Perforation("web", 990, 1100),)))


def test_unknown_part() -> None:
    with pytest.raises(GeometryError, match=r"unknown part 'webb'.*known parts"):
        analyse(G, StationLoss((PartThickness("webb", 8.0),)))


def test_overlapping_parts() -> None:
    defn = SectionDefinition(
        (Plate("a", 100, 10, 0, 0), Plate("b", 100, 10, 50, 5)), name="two plates"
    )
    with pytest.raises(GeometryError, match=r"parts 'a' and 'b' overlap by 250 mm²"):
        analyse(defn)


def test_band_upside_down() -> None:
    with pytest.raises(GeometryError, match="must be above lower edge"):
        LossBand("web", 300, 200, 5.0)


def test_section_files(tmp_path) -> None:
    bad = tmp_path / "bad.json"
    bad.write_text('{"format": "asfound.section", "version": 1, "section": {"girder": {"D": ')
    with pytest.raises(SchemaError, match="not valid JSON"):
        load_section_file(bad)
    newer = tmp_path / "newer.json"
    newer.write_text(json.dumps({"format": "asfound.section", "version": 99, "section": {}}))
    with pytest.raises(SchemaError, match="version 99 is not supported"):
        load_section_file(newer)
    unit = tmp_path / "unit.json"
    unit.write_text(
        json.dumps(
            {
                "format": "asfound.section",
                "version": 1,
                "length_unit": "kg",
                "section": {
                    "parts": [{"kind": "plate", "id": "p", "b": 1, "t": 1, "x": 0, "y": 0}]
                },
            }
        )
    )
    with pytest.raises(InputError, match="'kg' is not a length unit"):
        load_section_file(unit)
