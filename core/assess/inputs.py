"""What an assessment takes from a section: the web, its depth by basis, the flanges."""

from __future__ import annotations

from dataclasses import dataclass

from core.definition import SectionDefinition
from core.errors import GeometryError
from core.parts import Plate

DEPTH_WORDS = {
    "clear": "clear depth between the flange angles' toes",
    "rivet_lines": "distance between the web-to-flange rivet lines",
    "web": "web plate depth",
}


@dataclass(frozen=True)
class WebGeometry:
    """The web and what bounds it (heights y in mm).

    Attributes:
        web_id: the web plate. D_web: its depth; y_web: (bottom, top) of the plate.
        y_toes: (highest point of the bottom flange parts, lowest point of the top flange
            parts) within the web: the clear depth between the flange angles' toes.
        y_lines: (bottom, top) web-to-flange rivet lines, or None with fewer than two.
        d_overall: overall depth of the section. top_parts, bottom_parts: the flanges.
    """

    web_id: str
    D_web: float
    D_lines: float | None
    d_overall: float
    top_parts: tuple[str, ...]
    bottom_parts: tuple[str, ...]
    y_web: tuple[float, float] = (0.0, 0.0)
    y_toes: tuple[float, float] = (0.0, 0.0)
    y_lines: tuple[float, float] | None = None

    @property
    def D_clear(self) -> float:
        return self.y_toes[1] - self.y_toes[0]

    def depth(self, basis: str) -> tuple[float, tuple[float, float], str]:
        """(D, (y_lo, y_hi), words) of a depth basis (``clear``, ``rivet_lines``, ``web``);
        rivet lines fall back to the clear depth where the section has none."""
        if basis == "rivet_lines" and self.y_lines is not None:
            return self.D_lines or 0.0, self.y_lines, DEPTH_WORDS["rivet_lines"]
        if basis == "web":
            return self.D_web, self.y_web, DEPTH_WORDS["web"]
        words = DEPTH_WORDS["clear"]
        if basis == "rivet_lines":
            words += " (no pair of web rivet lines in the section)"
        return self.D_clear, self.y_toes, words


def web_geometry(defn: SectionDefinition) -> WebGeometry:
    """Find the web (the vertical plate with role "web", or id "web") and the flange parts.

    Raises:
        GeometryError: no vertical web plate in the section.
    """
    webs = [
        p
        for p in defn.parts
        if isinstance(p, Plate)
        and p.orientation == "vertical"
        and (p.role == "web" or p.id == "web")
    ]
    if not webs:
        raise GeometryError(
            "no web plate (a vertical plate with role 'web') in the section", where=defn.name
        )
    web = webs[0]
    lines = sorted(
        ln.position for ln in defn.rivet_lines if ln.axis == "horizontal" and web.id in ln.parts
    )
    D_lines = lines[-1] - lines[0] if len(lines) >= 2 else None
    y0, y1 = web.y, web.y + web.b
    mid = 0.5 * (y0 + y1)
    others = [p for p in defn.parts if p.id != web.id]
    top = tuple(p.id for p in others if (p.bounds[1] + p.bounds[3]) / 2 > mid)
    bot = tuple(p.id for p in others if (p.bounds[1] + p.bounds[3]) / 2 <= mid)
    toe_top = min([defn.part(i).bounds[1] for i in top] + [y1])
    toe_bot = max([defn.part(i).bounds[3] for i in bot] + [y0])
    toe_top, toe_bot = min(max(toe_top, y0), y1), max(min(toe_bot, y1), y0)
    if toe_top <= toe_bot:
        toe_bot, toe_top = y0, y1
    ys = [b for p in defn.parts for b in (p.bounds[1], p.bounds[3])]
    return WebGeometry(
        web.id,
        web.b,
        D_lines,
        max(ys) - min(ys),
        top,
        bot,
        (y0, y1),
        (toe_bot, toe_top),
        (lines[0], lines[-1]) if len(lines) >= 2 else None,
    )


def flange_proportions(
    defn: SectionDefinition, ids: tuple[str, ...], area: dict[str, float]
) -> tuple[float, float]:
    """(bf, tf) of a built-up flange: the widest part, and the thickness that gives the
    flange's area over that width (mm). ``area`` gives each part's remaining area."""
    if not ids:
        return 0.0, 0.0
    bf = max(defn.part(i).bounds[2] - defn.part(i).bounds[0] for i in ids)
    return bf, sum(area[i] for i in ids) / bf
