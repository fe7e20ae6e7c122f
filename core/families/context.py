"""What a family's limit state functions receive at one station, and helpers they share.

A limit state function takes a :class:`StationContext` and returns a list of
:class:`core.assess.results.LimitState` (empty where it does not apply). Every number it
needs is here: the sections as-built and as-found, the web and its depth, the panel,
material, the family and the member's factors, the load effects with the family's design
values, and the rivet lines.
"""

from __future__ import annotations

from collections.abc import Callable, Mapping
from dataclasses import dataclass, field, replace

import numpy as np

from core.assess.details import MemberDetails, Panel, SupportData
from core.assess.effects import StationEffects
from core.assess.inputs import WebGeometry
from core.assess.options import AssessOptions
from core.assess.panels import PanelLayout
from core.assess.results import LimitState, LineSummary
from core.checks.material import Material
from core.checks.results import CapacityResult
from core.definition import SectionDefinition, StationLoss
from core.families.base import Factor, Family
from core.section import StationSection


@dataclass(frozen=True)
class MemberSetup:
    """What the limit states of every station of a member share, built once per member.

    Attributes:
        details: the girder details (stiffeners, supports, bracing) in mm.
        panels: the web panels as-built and as-found.
        moment: the family's factored design moment at a position x (N mm), None without
            loads: the moment diagram for the moment gradient factors.
        support_effects: the effects at each support (by id), None where the loads are the
            stations' own.
        found: every station's as-found section, by station id (the weakest one serves
            checks made once per member, as the U-frame chord).
        age: years in service at the survey (None: year built not given).
        multiple_presence: the factor inside the lever rule's distribution (1.0 without):
            fatigue takes one vehicle without it.
        xs: every station's position (mm), for what is found for all stations at once.
    """

    details: MemberDetails
    panels: PanelLayout
    moment: Callable[[float], float | None]
    support_effects: Mapping[str, StationEffects | None] = field(default_factory=dict)
    found: Mapping[str, StationSection] = field(default_factory=dict)
    age: float | None = None
    multiple_presence: float = 1.0
    xs: tuple[float, ...] = ()


@dataclass(frozen=True)
class StationContext:
    """One station's inputs for the limit state functions (mm, N, MPa).

    Attributes:
        family: the family followed. member: the member's factors (condition, system,
            distribution), by symbol.
        defn, built, found: the definition and the sections as-built and as-found (the
            as-found with the thickness basis chosen); loss_local: the station's loss with
            the minimum readings (local checks).
        web: the web and its bounds. D, y_depth, depth_words: the web depth for shear by the
            chosen basis, its heights, and its words.
        tw_panel, tw_words: the panel-representative web thickness as-found, and why.
        panel: ``"unstiffened"``, ``"interior"`` or ``"end"``; do: stiffener spacing or None.
        material: the steel. x, span: station position and member span. where: its place.
        effects: unfactored effects, or None. design: the family's design effects at the
            station's level, ``{"M": ..., "V": ...}`` (empty without loads).
        lines: rivet line summaries along the member. opts: the engineer's choices.
        year_built: of the structure, or None.
        cache: results that are the same at every station of the member (the as-built rivet
            of each line), shared by the member's stations.
        setup: what the member's stations share (girder details, panels, moment diagram).
        station: the station's id. compression: the flange in compression here, ``"top"``
            (sagging) or ``"bottom"`` (hogging), from the sign of the dead load moment.
        panel_found: the as-found panel (its stiffeners with their measured loss);
            ``panel`` and ``do`` are the as-built one's kind and spacing.
        panel_built: the as-built panel. supports: the supports whose girder end checks
            are made at this station (the station nearest each, within the web depth).
    """

    family: Family
    member: Mapping[str, Factor]
    defn: SectionDefinition
    built: StationSection
    found: StationSection
    loss_local: StationLoss
    web: WebGeometry
    D: float
    y_depth: tuple[float, float]
    depth_words: str
    tw_panel: float
    tw_words: str
    panel: str
    do: float | None
    material: Material
    x: float
    span: float
    where: str
    effects: StationEffects | None
    design: Mapping[str, float] = field(default_factory=dict)
    lines: Mapping[str, LineSummary] = field(default_factory=dict)
    opts: AssessOptions = field(default_factory=AssessOptions)
    year_built: int | None = None
    cache: dict = field(default_factory=dict, compare=False, repr=False)
    setup: MemberSetup | None = None
    station: str = ""
    compression: str = "top"
    panel_built: Panel | None = None
    panel_found: Panel | None = None
    supports: tuple[SupportData, ...] = ()

    def f(self, symbol: str) -> float:
        """A factor of the family."""
        return self.family.factor(symbol)

    def panel_of(self, label: str) -> tuple[str, float | None]:
        """(kind, spacing) of the panel as-built (``"built"``) or as-found."""
        p = self.panel_built if label == "built" else self.panel_found
        if p is None:
            return self.panel, self.do
        return p.kind, p.do

    @property
    def compression_parts(self) -> tuple[str, ...]:
        return self.web.top_parts if self.compression == "top" else self.web.bottom_parts

    @property
    def tension_parts(self) -> tuple[str, ...]:
        return self.web.bottom_parts if self.compression == "top" else self.web.top_parts

    @property
    def tw_nominal(self) -> float:
        return self.defn.part(self.web.web_id).t

    @property
    def web_has_loss(self) -> bool:
        """True when the web has a band, a perforation or a reading below nominal here."""
        web = self.web.web_id
        lo = self.loss_local
        if any(b.part == web for b in lo.bands) or any(p.part == web for p in lo.perforations):
            return True
        return any(t.part == web and t.t < self.tw_nominal - 1e-9 for t in lo.thickness)


def model_moment(ctx: StationContext, name: str, model) -> float:
    """``model.moment(span, x)`` at the station (N mm), found for every station of the
    member at once (``model.moments``) the first time one asks; cached per run as
    ``(name, x)`` in ``ctx.cache``."""
    key = (name, ctx.x)
    if key not in ctx.cache:
        rest = ctx.setup.xs if ctx.setup is not None else ()
        xs = [x for x in dict.fromkeys((ctx.x, *rest)) if (name, x) not in ctx.cache]
        for x, m in zip(xs, model.moments(ctx.span, xs), strict=True):
            ctx.cache[(name, x)] = m
    return ctx.cache[key]


def flange_area(st: StationSection, ids: tuple[str, ...]) -> float:
    """Remaining gross area of the parts of one flange, mm²."""
    return float(sum(st.gross.part_area[i] for i in ids))


def web_area(st: StationSection, web_id: str, y_lo: float, y_hi: float) -> float:
    """Remaining area of the web plate between heights y_lo and y_hi (gross section), mm²:
    bands at their thickness, perforations removed."""
    r = st.gross.pieces.of(web_id)
    if len(r) == 0:
        return 0.0
    h = np.clip(r[:, 3], y_lo, y_hi) - np.clip(r[:, 1], y_lo, y_hi)
    return float(np.sum((r[:, 2] - r[:, 0]) * np.maximum(h, 0.0)))


def part_thickness(loss: StationLoss, defn: SectionDefinition, part: str, leg: str | None = None):
    """Remaining thickness of a part (or one leg of an angle) at the station, mm."""
    for th in loss.thickness:
        if th.part == part and th.leg == leg:
            return th.t
    if leg is not None:
        for th in loss.thickness:
            if th.part == part and th.leg is None:
                return th.t
    return defn.part(part).t


def capped(ls: LimitState) -> LimitState:
    """The as-found capacity not above the as-built one: only loss was applied, so a higher
    value can only come from a branch switch of the clause (noted)."""
    if ls.C_built is None or ls.C_found is None or ls.C_found <= ls.C_built:
        return ls
    k = ls.C_built / ls.C_found
    found = ls.found
    if isinstance(found, CapacityResult):
        found = replace(
            found,
            Rn=found.Rn * k,
            notes=(
                *found.notes,
                "as-found capped at the as-built value (a branch of the clause changed with the loss)",
            ),
        )
    return replace(
        ls,
        found=found,
        C_found=ls.C_built,
        R_effect=None if ls.R_effect is None else ls.R_effect * k,
        note=ls.note
        + "; as-found capped at as-built (a branch of the clause changed with the loss)",
    )
