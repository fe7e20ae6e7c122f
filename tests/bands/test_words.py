"""The bands and the advice in words."""

from __future__ import annotations

from core.bands.advice import RegionRank
from core.bands.propagate import Band
from core.bands.run import StationBands


def one(value: float, p5: float, p95: float, sym: str = "RF") -> StationBands:
    b = Band("web_shear|m", value, (p95 - p5) / 3.29, p5, p95, 0.7, "first_order")
    return StationBands(
        "G1", "S1", 0.0, (), {"web_shear|m": b}, {"web_shear": "web shear"},
        {"web_shear": "force"}, {"web_shear": sym}, "web_shear", (), 2,
    )  # fmt: skip


def test_a_band_that_straddles_one_says_so():
    """The issue's own example: RF 0.97, band 0.88-1.06."""
    sb = one(0.97, 0.88, 1.06)
    assert sb.sentence("web_shear") == "RF 0.97, band 0.88-1.06: not settled by the readings"
    assert one(1.2, 1.1, 1.3).sentence("web_shear").endswith("above 1 across the band")
    assert one(0.8, 0.7, 0.9).sentence("web_shear").endswith("below 1 across the band")
    assert one(0.8, 0.7, 0.9, "U").sentence("web_shear") == (
        "U 0.80, band 0.70-0.90: below 1 across the band"
    )
    assert sb.what("web_shear") == "web shear RF"


def test_advice_names_the_region_and_the_station_in_words():
    r = RegionRank("S1", "web", "b1", 0.8, 0.4, 0.01, 3)
    assert r.advice("web shear RF") == (
        "3 more readings on the web band b1 at station S1 would narrow the web shear RF band "
        "by about 40 %"
    )
    r = RegionRank("S2", "angle_bl", "h", 0.0, 0.001, 0.0, 3)
    assert "bottom-left flange angle, horizontal leg at station S2" in r.advice("x")
    assert r.advice("x").endswith("by less than 1 %")
