"""The AISC family: AISC 360-22 for buildings and industrial members (crane girders, floor
beams), with Appendix 5 for the evaluation of existing structures; the measure is the
demand / capacity ratio.

From memory (each listed on the assumptions page as such):
- Resistance factors: phi_v = 0.90 (G1), phi_b = 0.90 (F1), phi = 0.75 for rivets in shear
  and bearing (J3.7, J3.10); rivets of unknown grade ASTM A502 Grade 1, Fnv = 25 ksi
  (Appendix 5).
- AISC 360 points to the building code for load combinations: ASCE/SEI 7-22 2.3.1,
  combination 2, 1.2 D + 1.6 L (the dead loads D = DC + DW, the live load L with the impact
  the engineer gives with each vehicle).
- Live loads: the station loads, or the engineer's vehicles of kind ``crane`` or ``other``
  moved over the span (legal and permit vehicles belong to the bridge rating family).
"""

from __future__ import annotations

from dataclasses import dataclass

from core.assess.effects import LiveCase
from core.assess.inputs import flange_proportions
from core.assess.options import AssessOptions
from core.assess.results import LimitState
from core.checks import aisc_rivets, aisc_shear
from core.checks.aisc_holes import tension_flange_holes
from core.checks.flags import Flag, Level
from core.checks.results import ENGINEER
from core.families import aisc_girder as girder
from core.families.base import Choice, Document, Factor, Family, LimitStateSpec, override
from core.families.common import (
    RulesBase,
    line_rivet,
    local_shear,
    panel_shear,
    rivet_groups,
    tension_flange,
)
from core.families.context import StationContext
from core.families.liveload import distribution, vehicle_model
from core.families.measures import DemandCapacity
from core.survey.model import Member, Survey

AISC = "AISC 360-22"
MEM = " (from memory)"

DOCUMENTS = (
    Document(
        "AISC 360-22 Specification for Structural Steel Buildings",
        "2022",
        "clauses of the checks (Chapter G shear, Chapter F flexure F4 / F5 and F13.1, J3 and "
        "Appendix 5 rivets, Appendix 5 evaluation of existing structures)",
    ),
    Document(
        "ASCE/SEI 7-22 Minimum Design Loads and Associated Criteria",
        "2022",
        "load combination 2.3.1 (AISC 360-22 B2 points to it)",
        pointer=True,
    ),
)

TOKENS = (
    "AISC",
    "360-22",
    "ASCE",
    "Chapter G",
    "Cv1",
    "Cv2",
    "kv",
    "Rpg",
    "F13.1",
    "Appendix 5",
    "D/C",
    "Rpc",
    "Rpt",
    "F4.",
    "F5.",
    "J10.",
    "J7",
)

RANGES = {
    "phi_v": (0.0, 1.0),
    "phi_b": (0.0, 1.0),
    "phi_rivet": (0.0, 1.0),
    "Fnv": (0.0, 1000.0),
    "LF_D": (0.0, 3.0),
    "LF_L": (0.0, 3.0),
    **girder.RANGES,
}


def _src(clause: str) -> str:
    return f"{AISC} {clause}{MEM}"


def default_factors() -> dict[str, Factor]:
    return {**_base_factors(), **girder.girder_factors()}


def _base_factors() -> dict[str, Factor]:
    return {
        "phi_v": Factor("phi_v", 0.90, "resistance factor, shear", _src("G1")),
        "phi_b": Factor("phi_b", 0.90, "resistance factor, flexure", _src("F1")),
        "phi_rivet": Factor("phi_rivet", 0.75, "resistance factor, rivets", _src("J3.7, J3.10")),
        "Fnv": Factor(
            "Fnv", aisc_rivets.FNV_A502_1, "nominal rivet shear stress, MPa", aisc_rivets.FNV_SOURCE
        ),
        "LF_D": Factor(
            "LF_D", 1.2, "load factor on dead loads D", "ASCE/SEI 7-22 2.3.1, combination 2" + MEM
        ),
        "LF_L": Factor(
            "LF_L",
            1.6,
            "load factor on the live load L",
            "ASCE/SEI 7-22 2.3.1, combination 2" + MEM,
        ),
    }


def shear_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Web panel shear, AISC 360-22 G2.1 and G2.2 (Aw = d tw with the overall depth)."""
    m = ctx.material

    def check(st, tw, label):
        bfc, tfc = flange_proportions(ctx.defn, ctx.web.top_parts, st.gross.part_area)
        bft, tft = flange_proportions(ctx.defn, ctx.web.bottom_parts, st.gross.part_area)
        panel, do = ctx.panel_of(label)
        return aisc_shear.web_shear(
            Fy=m.Fy,
            E=m.E,
            h=ctx.D,
            tw=tw,
            d=ctx.web.d_overall,
            panel=panel,
            a=do,
            bfc=bfc or None,
            tfc=tfc or None,
            bft=bft or None,
            tft=tft or None,
            phi_v=ctx.f("phi_v"),
            where=f"{ctx.where} / web shear ({label})",
        )

    return [panel_shear(ctx, check)]


def local_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Local web shear at the thinnest cut and on the net web, 0.6 Fy (G2.1)."""
    return local_shear(
        ctx,
        tau_y=lambda Fy: 0.6 * Fy,
        tau_y_words="shear yield stress 0.6 Fy",
        tau_y_source=_src("G2.1, Vn = 0.6 Fy Aw Cv1"),
        phi=ctx.f("phi_v"),
        standard=aisc_shear.STANDARD,
        edition=aisc_shear.EDITION,
        clause="G2.1: 0.6 Fy at the thinnest cut (VQ/It) and on the net web" + MEM,
    )


def tension_flange_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Holes in the tension (bottom) flange, F13.1."""

    def check(st, An, Ag, w):
        r = tension_flange_holes(
            Afn=An,
            Afg=Ag,
            Fy=ctx.material.Fy,
            Fu=ctx.material.Fu,
            S_xt=st.gross.props.S_bot if ctx.compression == "top" else st.gross.props.S_top,
            phi_b=ctx.f("phi_b"),
            where=w,
        )
        return r, r.Rr

    return tension_flange(ctx, check, "tensile rupture of the tension flange at its holes (F13.1)")


def rivet_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Rivet lines per interface: J3.7 shear with the Appendix 5 rivet strength, J3.10 bearing."""
    Fnv = ctx.family.f("Fnv")

    def check(ctx, line, plies, w):
        return aisc_rivets.rivet_resistance(
            **line_rivet(line),
            plies=plies,
            Fnv=Fnv.value,
            Fnv_source=Fnv.source,
            phi=ctx.f("phi_rivet"),
            where=w,
        )

    return rivet_groups(ctx, check)


LIMIT_STATES = (
    LimitStateSpec("web_shear", "web shear (G2)", shear_states),
    LimitStateSpec("local_web_shear", "local web shear (G2.1)", local_states),
    LimitStateSpec("flange_yield", "flange yield (F4 / F5)", girder.flange_yield_states),
    LimitStateSpec(
        "lateral_torsional_buckling", "lateral-torsional buckling (F4.2 / F5.2)", girder.ltb_states
    ),
    LimitStateSpec(
        "flange_local_buckling", "flange local buckling (F4.3 / F5.3)", girder.flb_states
    ),
    LimitStateSpec(
        "tension_flange_at_holes", "tension flange at holes (F13.1)", tension_flange_states
    ),
    LimitStateSpec("flexure", "flexure, the least of the above (F4 / F5)", girder.flexure_states),
    LimitStateSpec("girder_end", "girder ends (J7, J10)", girder.girder_end_states),
    LimitStateSpec("rivets", "rivets (J3, Appendix 5)", rivet_states),
)


@dataclass(frozen=True)
class Rules(RulesBase):
    factors: dict
    key = "aisc"

    def member_factors(self, member: Member, opts: AssessOptions) -> dict[str, Factor]:
        return {"g": distribution(member, opts)}

    def stiffener_check(self, defn, web, D: float, material):
        return girder.stiffener_check(defn, web, D, material)

    def girder_notes(self) -> list[Choice]:
        return girder.girder_notes()

    def live_cases(self, member: Member, survey: Survey, opts: AssessOptions) -> list[LiveCase]:
        model = opts.live_load or "vehicles"
        if model != "vehicles":
            return []
        g = distribution(member, opts).value
        ll = member.live_load
        out = []
        for v in ll.vehicles if ll else ():
            if v.kind in ("crane", "other"):
                tr = vehicle_model(member, v, survey.survey.unit_system)
                out.append(LiveCase(f"vehicle:{v.name}", v.name, "design", tr, g, tr.weight))
        return out

    def summary_cases(self, cases: list[LiveCase], opts: AssessOptions):
        m = DemandCapacity(self.factors["LF_D"], self.factors["LF_L"])
        return [
            (f"1.2 D + 1.6 L: {c.title}", m, [c.key], None) for c in cases if c.role == "design"
        ]

    def posting(self, value: float, weight: float | None, system: str) -> str:
        return f"reserve 1 - D/C = {1.0 - value:.3g}" + (" (overloaded)" if value > 1.0 else "")

    def flags(self, survey: Survey) -> list[Flag]:
        use = survey.survey.use
        if use in ("highway", "railway"):
            return [
                Flag(
                    Level.REVIEW,
                    "survey / use",
                    f"engineer to review: the structure is recorded as a {use} bridge; this "
                    "family's specification is for buildings and industrial members",
                )
            ]
        return []


def build(opts: AssessOptions, survey: Survey) -> Family:
    factors = override(default_factors(), opts.factors, "AISC", RANGES)
    rules = Rules(factors)
    model = opts.live_load or "vehicles"
    return Family(
        key="aisc",
        name="AISC 360-22 Specification for Structural Steel Buildings, with Appendix 5 (existing structures); demand / capacity",
        documents=DOCUMENTS,
        factors=factors,
        limit_states=LIMIT_STATES,
        measure=DemandCapacity(factors["LF_D"], factors["LF_L"]),
        depth_basis=opts.depth_basis or "clear",
        choices=(
            Choice(
                "live load",
                "the member's crane and other vehicles, or the station loads"
                if model == "vehicles"
                else str(model),
                ENGINEER,
            ),
        ),
        tokens=TOKENS,
        rules=rules,
        short_name="AISC 360-22 with Appendix 5: demand / capacity",
    )
