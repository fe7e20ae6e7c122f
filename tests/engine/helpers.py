"""Small builders shared by the engine tests."""

from __future__ import annotations

from core.definition import SectionDefinition
from core.parts import Plate
from core.section import StationSection, analyse


def rect(b: float, h: float, x: float = 0.0, y: float = 0.0, pid: str = "r") -> Plate:
    """A b x h rectangle (b across, h up) as a horizontal plate with lower-left corner (x, y)."""
    return Plate(pid, b, h, x, y, "horizontal")


def wide_flange(d: float, bf: float, tf: float, tw: float) -> SectionDefinition:
    """Three-rectangle wide flange (no fillets), bottom at y = 0, centred on x = 0."""
    return SectionDefinition(
        (
            Plate("bottom", bf, tf, -bf / 2, 0.0, "horizontal"),
            Plate("web", d - 2 * tf, tw, -tw / 2, tf, "vertical"),
            Plate("top", bf, tf, -bf / 2, d - tf, "horizontal"),
        ),
        name="wide flange",
    )


def single(*parts) -> StationSection:
    return analyse(SectionDefinition(tuple(parts)))
