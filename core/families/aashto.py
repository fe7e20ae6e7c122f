"""The AASHTO family: LRFD clauses, the bridge evaluation manual's rating (LRFR), HL-93.

Documents: AASHTO LRFD Bridge Design Specifications, 9th edition (2020) and AASHTO Manual for
Bridge Evaluation (MBE), 3rd edition (2018). Every value below is from memory and is listed
on the assumptions page as such; the engineer confirms or replaces it.

- Resistance factors (LRFD 6.5.4.2): phi_v = 1.00 shear, phi_f = 1.00 flexure,
  phi_bb = 0.80 bearing on material; rivets in shear phi = 0.80 (MBE 6A.6.12.5.1).
- Load factors (MBE Table 6A.4.2.2-1): gDC = 1.25, gDW = 1.50 (1.25 allowed where the wearing
  surface is measured in the field); gLL = 1.75 inventory, 1.35 operating; legal 1.80 and
  permit 1.80 for ADTT of 5000 or more or unknown (the MBE 1st edition's values for
  Table 6A.4.4.2.3a-1 and Table 6A.4.5.4.2a-1 routine permits; later editions lowered them:
  the higher values are kept while the ADTT is not given, conservative).
- Condition factor (Table 6A.4.2.3-1): good or satisfactory 1.00, fair 0.95, poor 0.85;
  not recorded: poor (conservative). System factor (Table 6A.4.2.4-1) by structure type,
  applied to flexural and axial effects only (6A.4.2.4); not recorded: 0.85, the lowest
  (conservative). phi_c phi_s >= 0.85 (6A.4.2.1).
- Live load: HL-93 (LRFD 3.6.1.2, 3.6.1.3) with IM = 33 % on truck and tandem (3.6.2.1) for
  the design rating; the engineer's legal and permit vehicles with their IM for those levels.
- Load posting (MBE 6A.8.3): for a legal vehicle of weight W with 0.3 <= RF < 1.0, posting
  load = W / 0.7 (RF - 0.3); below 0.3 the bridge should be considered for closing.
"""

from __future__ import annotations

from dataclasses import dataclass

from core.assess.effects import LiveCase
from core.assess.inputs import flange_proportions
from core.assess.options import AssessOptions
from core.assess.results import LimitState
from core.checks import aashto_rivets, aashto_shear
from core.checks.flags import Flag, Level
from core.checks.flexure import tension_flange_net_section
from core.checks.results import ENGINEER
from core.families import aashto_girder as girder
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
from core.families.measures import RatingFactor
from core.loads.models import HL93
from core.survey.model import Member, Survey
from core.units import from_internal

LRFD = "AASHTO LRFD 9th ed. (2020)"
MBE = "AASHTO MBE 3rd ed. (2018)"
MEM = " (from memory)"

DOCUMENTS = (
    Document(
        "AASHTO LRFD Bridge Design Specifications",
        "9th edition (2020)",
        "clauses of the checks (6.10.9 shear, 6.10.8 flexure, 6.10.1.8 holes, 6.13.2.9 "
        "bearing), HL-93 live load (3.6.1) and dynamic load allowance (3.6.2)",
    ),
    Document(
        "AASHTO Manual for Bridge Evaluation",
        "3rd edition (2018)",
        "load and resistance factor rating (6A.4), rivets (6A.6.12.5.1), steel by year "
        "built (6A.6.2.1), load posting (6A.8)",
    ),
)

CONDITION_FACTOR: dict[str, tuple[float, str]] = {
    "good": (1.00, "good or satisfactory"),
    "fair": (0.95, "fair"),
    "poor": (0.85, "poor"),
}

SYSTEM_FACTOR: dict[str, tuple[float, str]] = {
    "welded_two_girder": (0.85, "welded members in two-girder, truss or arch bridges"),
    "riveted_two_girder": (0.90, "riveted members in two-girder, truss or arch bridges"),
    "eyebar_truss": (0.90, "multiple eyebar members in truss bridges"),
    "three_girder": (0.85, "three-girder bridges with girder spacing 6 ft or less"),
    "four_girder": (0.95, "four-girder bridges with girder spacing 4 ft or less"),
    "multi_girder": (1.00, "all other girder bridges and slab bridges"),
    "floorbeam": (0.85, "floorbeams with spacing over 12 ft and noncontinuous stringers"),
    "stringer": (1.00, "redundant stringer subsystems between floorbeams"),
}

LIVE_LOAD_FACTOR: dict[str, tuple[float, str, str]] = {
    "inventory": (1.75, "live load factor, design load rating, inventory", "Table 6A.4.2.2-1"),
    "operating": (1.35, "live load factor, design load rating, operating", "Table 6A.4.2.2-1"),
    "legal": (
        1.80,
        "live load factor, legal load rating, ADTT 5000 or more or unknown",
        "Table 6A.4.4.2.3a-1 (1st edition value; later editions lower it: the higher is kept, "
        "conservative)",
    ),
    "permit": (
        1.80,
        "live load factor, routine or annual permit, ADTT 5000 or more or unknown",
        "Table 6A.4.5.4.2a-1 (1st edition value, conservative)",
    ),
}

TOKENS = (
    "AASHTO",
    "LRFD",
    "LRFR",
    "MBE",
    "Manual for Bridge Evaluation",
    "HL-93",
    "6.10.",
    "6A.",
    "phi_c",
    "phi_s",
    "gDC",
    "gDW",
    "gLL",
    "design tandem",
    "design truck",
    "Rb",
    "Fnc",
    "Fcrw",
    "(Delta f)",
    "Category D",
    "fatigue truck",
)

RANGES = {
    "phi_v": (0.0, 1.0),
    "phi_f": (0.0, 1.0),
    "phi_bb": (0.0, 1.0),
    "phi_rivet": (0.0, 1.0),
    "gDC": (0.0, 3.0),
    "gDW": (0.0, 3.0),
    "gLL": (0.0, 3.0),
    "IM": (-1e-9, 1.0),
    "Fnv": (0.0, 1000.0),
    "phi_c": (0.0, 1.0),
    "phi_s": (0.0, 1.0),
    **girder.RANGES,
}


def _lrfd(clause: str) -> str:
    return f"{LRFD}, {clause}{MEM}"


def _mbe(clause: str) -> str:
    return f"{MBE}, {clause}{MEM}"


def default_factors(level: str, year_built: int | None) -> dict[str, Factor]:
    """The family's factors for a rating level, with their sources."""
    gLL, words, table = LIVE_LOAD_FACTOR[level]
    Fnv, fnv_src = aashto_rivets.rivet_Fnv(year_built)
    return {**_base_factors(gLL, words, table, Fnv, fnv_src), **girder.girder_factors()}


def _base_factors(gLL, words, table, Fnv, fnv_src) -> dict[str, Factor]:
    return {
        "phi_v": Factor("phi_v", 1.00, "resistance factor, shear", _lrfd("6.5.4.2")),
        "phi_f": Factor("phi_f", 1.00, "resistance factor, flexure", _lrfd("6.5.4.2")),
        "phi_bb": Factor(
            "phi_bb", 0.80, "resistance factor, bearing on material", _lrfd("6.5.4.2")
        ),
        "phi_rivet": Factor(
            "phi_rivet", 0.80, "resistance factor, rivets in shear", _mbe("6A.6.12.5.1")
        ),
        "Fnv": Factor("Fnv", Fnv, "nominal shear stress of rivets of unknown grade, MPa", fnv_src),
        "gDC": Factor("gDC", 1.25, "dead load factor, components", _mbe("Table 6A.4.2.2-1")),
        "gDW": Factor(
            "gDW",
            1.50,
            "dead load factor, wearing surface (1.25 allowed where measured in the field)",
            _mbe("Table 6A.4.2.2-1"),
        ),
        "gLL": Factor("gLL", gLL, words, _mbe(table)),
        "IM": Factor(
            "IM", 0.33, "dynamic load allowance on design truck and tandem", _lrfd("3.6.2.1")
        ),
    }


def shear_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Web panel shear, AASHTO LRFD 6.10.9."""
    m = ctx.material

    def check(st, tw, label):
        bfc, tfc = flange_proportions(ctx.defn, ctx.web.top_parts, st.gross.part_area)
        bft, tft = flange_proportions(ctx.defn, ctx.web.bottom_parts, st.gross.part_area)
        panel, do = ctx.panel_of(label)
        return aashto_shear.web_shear(
            Fyw=m.Fy,
            E=m.E,
            D=ctx.D,
            tw=tw,
            panel=panel,
            do=do,
            bfc=bfc or None,
            tfc=tfc or None,
            bft=bft or None,
            tft=tft or None,
            phi_v=ctx.f("phi_v"),
            where=f"{ctx.where} / web shear ({label})",
        )

    return [panel_shear(ctx, check)]


def local_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Local web shear at the thinnest cut and on the net web, 0.58 Fyw (6.10.9.2)."""
    return local_shear(
        ctx,
        tau_y=lambda Fy: 0.58 * Fy,
        tau_y_words="shear yield stress 0.58 Fyw",
        tau_y_source=_lrfd("6.10.9.2, Vp = 0.58 Fyw D tw"),
        phi=ctx.f("phi_v"),
        standard=aashto_shear.STANDARD,
        edition=aashto_shear.EDITION,
        clause="6.10.9.2: 0.58 Fyw at the thinnest cut (VQ/It) and on the net web" + MEM,
    )


def tension_flange_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Net section of the bottom (tension) flange at its holes (6.10.1.8) as a moment."""

    def check(st, An, Ag, w):
        r = tension_flange_net_section(
            An=An, Ag=Ag, Fu=ctx.material.Fu, Fyt=ctx.material.Fy, where=w
        )
        p = st.gross.props
        return r, r.Rr * (p.S_bot if ctx.compression == "top" else p.S_top)

    return tension_flange(
        ctx,
        check,
        "gross-area stress limit at the holes times the gross modulus to the tension fibre",
    )


def rivet_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Rivet lines per interface: MBE rivet shear and LRFD bearing."""
    Fnv = ctx.family.f("Fnv")

    def check(ctx, line, plies, w):
        return aashto_rivets.rivet_resistance(
            **line_rivet(line),
            plies=plies,
            Fnv=Fnv.value,
            Fnv_source=Fnv.source,
            phi=ctx.f("phi_rivet"),
            phi_bb=ctx.f("phi_bb"),
            where=w,
        )

    return rivet_groups(ctx, check)


LIMIT_STATES = (
    LimitStateSpec("web_shear", "web shear (6.10.9)", shear_states),
    LimitStateSpec("local_web_shear", "local web shear (6.10.9.2)", local_states),
    LimitStateSpec(
        "flange_yield", "flange yield (6.10.8.1.1, 6.10.8.3)", girder.flange_yield_states
    ),
    LimitStateSpec(
        "lateral_torsional_buckling", "lateral-torsional buckling (6.10.8.2.3)", girder.ltb_states
    ),
    LimitStateSpec(
        "flange_local_buckling", "flange local buckling (6.10.8.2.2)", girder.flb_states
    ),
    LimitStateSpec(
        "web_bend_buckling", "web bend-buckling (6.10.1.9.1), service", girder.web_bend_states
    ),
    LimitStateSpec(
        "tension_flange_at_holes", "tension flange at holes (6.10.1.8)", tension_flange_states
    ),
    LimitStateSpec("flexure", "flexure, the least of the above (6.10.8)", girder.flexure_states),
    LimitStateSpec("girder_end", "girder ends (6.10.11.2, D6.5)", girder.girder_end_states),
    LimitStateSpec("rivets", "rivet lines (MBE 6A.6.12.5.1, LRFD 6.13.2.9)", rivet_states),
    LimitStateSpec(
        "fatigue", "fatigue (riveted details; MBE 7.2, LRFD 6.6.1.2)", girder.fatigue_states
    ),
)


@dataclass(frozen=True)
class Rules(RulesBase):
    """What the AASHTO family decides per survey and member."""

    factors: dict
    level: str
    key = "aashto"

    def stiffener_check(self, defn, web, D: float, material):
        return girder.stiffener_check(defn, web, D, material)

    def girder_notes(self) -> list[Choice]:
        return girder.girder_notes()

    def member_factors(self, member: Member, opts: AssessOptions) -> dict[str, Factor]:
        cond = opts.condition or member.condition
        if cond is None:
            v, words = CONDITION_FACTOR["poor"]
            phi_c = Factor(
                "phi_c",
                v,
                "condition factor: condition not recorded, poor assumed",
                _mbe("Table 6A.4.2.3-1") + "; asfound's conservative choice",
            )
        else:
            v, words = CONDITION_FACTOR[cond]
            src = ENGINEER if opts.condition else "member record"
            phi_c = Factor(
                "phi_c",
                v,
                f"condition factor ({words})",
                f"{_mbe('Table 6A.4.2.3-1')}; condition: {src}",
            )
        st = opts.structure_type or member.structure_type
        if st is None:
            phi_s = Factor(
                "phi_s",
                0.85,
                "system factor: structure type not recorded, the lowest of the table",
                _mbe("Table 6A.4.2.4-1") + "; asfound's conservative choice",
            )
        elif st not in SYSTEM_FACTOR:
            from core.errors import InputError

            raise InputError(f"structure type {st!r} is not one of {sorted(SYSTEM_FACTOR)}")
        else:
            v, words = SYSTEM_FACTOR[st]
            phi_s = Factor(
                "phi_s",
                v,
                f"system factor ({words}), flexural and axial effects only",
                _mbe("Table 6A.4.2.4-1 and 6A.4.2.4"),
            )
        out = {"phi_c": phi_c, "phi_s": phi_s}
        given = {k: v for k, v in opts.factors.items() if k in out}
        out = override(out, given, "AASHTO", RANGES)
        out["g"] = distribution(member, opts, lever_allowed=True)
        return out

    def live_cases(self, member: Member, survey: Survey, opts: AssessOptions) -> list[LiveCase]:
        g = distribution(member, opts, lever_allowed=True).value
        model = opts.live_load or "hl93"
        cases = []
        if model == "hl93":
            cases.append(LiveCase("hl93", "HL-93", "design", HL93(IM=self.factors["IM"].value), g))
        ll = member.live_load
        for v in ll.vehicles if ll else ():
            role = v.kind if v.kind in ("legal", "permit") else "other"
            if model == "vehicles" and role == "other":
                role = "design"
            tr = vehicle_model(member, v, survey.survey.unit_system)
            cases.append(LiveCase(f"vehicle:{v.name}", v.name, role, tr, g, tr.weight))
        return cases

    def design_keys(self, cases: list[LiveCase], opts: AssessOptions) -> list[str]:
        role = {"inventory": "design", "operating": "design"}.get(self.level, self.level)
        return [c.key for c in cases if c.role == role]

    def summary_cases(self, cases: list[LiveCase], opts: AssessOptions):
        """(case words, measure, case keys, posting weight) for the member summary."""
        out = []
        for level in ("inventory", "operating"):
            keys = [c.key for c in cases if c.role == "design"]
            if keys:
                out.append((f"design, {level}", self._measure(level), keys, None))
        for level in ("legal", "permit"):
            for c in cases:
                if c.role == level:
                    out.append(
                        (
                            f"{level}: {c.title}",
                            self._measure(level),
                            [c.key],
                            c.weight if level == "legal" else None,
                        )
                    )
        return out

    def _measure(self, level: str) -> RatingFactor:
        f = self.factors
        gLL = f["gLL"] if level == self.level else default_factors(level, None)["gLL"]
        return RatingFactor(level, f["gDC"], f["gDW"], gLL)

    def posting(self, RF: float, weight: float | None, system: str) -> str:
        """Posting words for a legal load rating factor (MBE 6A.8.3, from memory); nothing
        for the other levels (``weight`` None)."""
        if weight is None:
            return ""
        if RF >= 1.0:
            return "RF >= 1.0: no posting needed for this vehicle (6A.8)"
        if RF < 0.3:
            return "RF < 0.3: the bridge should be considered for closing (6A.8.3)"
        tons = from_internal(weight, "force", "kip") / 2.0
        post = tons / 0.7 * (RF - 0.3)
        return f"posting load W/0.7 (RF - 0.3) = {tons:.4g}/0.7 x ({RF:.3f} - 0.3) = {post:.3g} tons (6A.8.3)"

    def flags(self, survey: Survey) -> list[Flag]:
        if survey.survey.use == "railway":
            return [
                Flag(
                    Level.REVIEW,
                    "survey / use",
                    "engineer to review: the structure is recorded as a railway bridge; the HL-93 "
                    "and LRFR rating of this family are for highway bridges",
                )
            ]
        return []


def build(opts: AssessOptions, survey: Survey) -> Family:
    """The AASHTO family for the engineer's choices."""
    level = opts.level
    given = {k: v for k, v in opts.factors.items() if k not in ("phi_c", "phi_s")}
    factors = override(default_factors(level, survey.survey.year_built), given, "AASHTO", RANGES)
    rules = Rules(factors, level)
    measure = rules._measure(level)
    choices = (
        Choice(
            "rating level",
            level + (" (default)" if level == "inventory" else ""),
            ENGINEER if level != "inventory" else _mbe("6A.4.2"),
        ),
        Choice(
            "live load for the design rating",
            "HL-93" if (opts.live_load or "hl93") == "hl93" else str(opts.live_load),
            _lrfd("3.6.1.3") if (opts.live_load or "hl93") == "hl93" else ENGINEER,
        ),
    )
    return Family(
        key="aashto",
        name="AASHTO: LRFD Bridge Design Specifications 9th ed. (2020) with the Manual for Bridge Evaluation 3rd ed. (2018), LRFR",
        documents=DOCUMENTS,
        factors=factors,
        limit_states=LIMIT_STATES,
        measure=measure,
        depth_basis=opts.depth_basis or "clear",
        choices=choices,
        tokens=TOKENS,
        rules=rules,
        short_name="AASHTO LRFD 9th ed. (2020) with MBE 3rd ed. (2018): LRFR rating factor",
    )
