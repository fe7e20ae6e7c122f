"""The EN 1993 family for bridges: EN 1993-1-1, 1-5 and 1-8 with the partial factors of
EN 1993-2, loads from EN 1991-2 combined per EN 1990 Annex A2; the measure is the
utilisation (design effect / design resistance) and its reserve.

From memory (each listed on the assumptions page as such; the National Annex may differ):
- EN 1993-2 Table 6.1: gamma_M0 = 1.00, gamma_M1 = 1.10, gamma_M2 = 1.25.
- EN 1993-1-5 5.1(2): eta = 1.20 only for steels S235 to S460; asfound takes eta = 1.0 for
  steel of unknown or early grade (the engineer may set 1.2 where the steel is known to be
  equivalent).
- EN 1990 Annex A2, Table A2.4(B), Eq. 6.10: gamma_G = 1.35 on permanent actions;
  gamma_Q = 1.45 for rail traffic (LM71), 1.35 for road traffic (LM1); one variable action,
  so no combination factor psi_0 enters.
- Loads: LM71 with alpha and Phi2 / Phi3 for railway girders, LM1 for highway girders
  (EN 1991-2), or the station loads.
- Rivets: EN 1993-1-8 Table 3.4 with f_ur = 330 MPa for rivet steel of unknown grade
  (asfound's conservative assumption).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace

from core.assess.effects import LiveCase
from core.assess.options import AssessOptions
from core.assess.results import LimitState
from core.checks import en1993_rivets, en1993_shear
from core.checks.en1993_bending import tension_flange_holes
from core.checks.en1993_buckling import epsilon
from core.checks.en1993_interaction import SRC_71, bending_shear, flange_contribution
from core.checks.flags import Flag, Level
from core.checks.results import ENGINEER, CapacityResult, CheckValue
from core.families import en1993_girder as girder
from core.families.base import Choice, Document, Factor, Family, LimitStateSpec, override
from core.families.common import (
    RulesBase,
    line_rivet,
    local_shear,
    moment_state,
    panel_shear,
    rivet_groups,
    tension_flange,
)
from core.families.context import StationContext, flange_area
from core.families.en1993_section import bending, flange_plate, flanges_moment
from core.families.liveload import distribution
from core.families.measures import Utilisation
from core.loads.models import LM1, LM71
from core.survey.model import Member, Survey

MEM = " (from memory)"

DOCUMENTS = (
    Document(
        "EN 1993-1-1 Design of steel structures: general rules",
        "2005",
        "cross-section class, bending, shear yield",
    ),
    Document(
        "EN 1993-1-5 Design of steel structures: plated structural elements",
        "2006",
        "shear buckling with the flange contribution, effective widths, bending and shear",
    ),
    Document(
        "EN 1993-1-8 Design of steel structures: design of joints", "2005", "rivets (Table 3.4)"
    ),
    Document(
        "EN 1993-2 Design of steel structures: steel bridges", "2006", "partial factors (Table 6.1)"
    ),
    Document(
        "EN 1991-2 Actions on structures: traffic loads on bridges",
        "2003",
        "LM71 and dynamic factor (railways), LM1 (roads)",
    ),
    Document(
        "EN 1990 Basis of structural design, Annex A2 (bridges)",
        "2002 with A1:2005",
        "combination of actions, Table A2.4(B)",
    ),
)

TOKENS = (
    "EN 199",
    "gamma_M",
    "gamma_G",
    "gamma_Q",
    "chi_w",
    "lambda_w",
    "k_tau",
    "LM71",
    "LM1",
    "Phi2",
    "Phi3",
    "Vbf",
    "Vbw",
    "eta3",
    "Mf,Rd",
    "Mpl,Rd",
    "Mc,Rd",
    "utilisation",
    "fyw",
    "chi_LT",
    "Mb,Rd",
    "Mcr",
    "Delta sigma",
    "lambda_fat",
)

RANGES = {
    "gamma_M0": (0.5, 2.0),
    "gamma_M1": (0.5, 2.0),
    "gamma_M2": (0.5, 2.0),
    "eta": (0.999, 1.2),
    "gamma_G": (0.5, 2.0),
    "gamma_Q": (0.5, 2.0),
    "f_ur": (100.0, 1000.0),
    "alpha_Q": (0.0, 2.0),
    "alpha_q": (0.0, 2.0),
    **girder.RANGES,
}


def default_factors(use: str | None) -> dict[str, Factor]:
    t61 = "EN 1993-2:2006 Table 6.1" + MEM + "; the National Annex may differ"
    rail = use != "highway"
    return {
        "gamma_M0": Factor("gamma_M0", 1.00, "partial factor, resistance of cross-sections", t61),
        "gamma_M1": Factor("gamma_M1", 1.10, "partial factor, stability (bridges)", t61),
        "gamma_M2": Factor("gamma_M2", 1.25, "partial factor, rivets, net sections", t61),
        "eta": Factor(
            "eta",
            1.0,
            "shear area factor: 1.0 for steel of unknown or early grade (1.2 only for S235 to S460)",
            "EN 1993-1-5:2006 5.1(2)" + MEM + "; asfound's conservative choice",
        ),
        "gamma_G": Factor(
            "gamma_G", 1.35, "partial factor, permanent actions", "EN 1990 Table A2.4(B)" + MEM
        ),
        "gamma_Q": Factor(
            "gamma_Q",
            1.45 if rail else 1.35,
            "partial factor, rail traffic (LM71)" if rail else "partial factor, road traffic (LM1)",
            "EN 1990 Table A2.4(B)"
            + MEM
            + ("" if use else "; use not recorded: the rail value, the higher"),
        ),
        "f_ur": Factor(
            "f_ur",
            en1993_rivets.F_UR_DEFAULT,
            "ultimate tensile strength of the rivets, MPa",
            en1993_rivets.F_UR_SOURCE,
        ),
        "alpha_Q": Factor(
            "alpha_Q",
            1.0,
            "LM1 adjustment factor, tandem systems",
            "EN 1991-2:2003 4.3.2(3)" + MEM + "; National Annex may differ",
        ),
        "alpha_q": Factor(
            "alpha_q",
            1.0,
            "LM1 adjustment factor, uniform loads",
            "EN 1991-2:2003 4.3.2(3)" + MEM + "; National Annex may differ",
        ),
    }


def shear_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Web shear, EN 1993-1-5 5.2-5.4: Vb,Rd = Vbw,Rd + Vbf,Rd <= eta fyw hw t / (sqrt(3) gamma_M1)."""
    fy = ctx.material.Fy
    M_Ed = ctx.design.get("M")

    def check(st, tw, label):
        Vbf, vals, note = 0.0, (), ""
        panel, do = ctx.panel_of(label)
        if do is not None and M_Ed is not None:
            Mf, _ = flanges_moment(ctx, st)
            cands = []
            for ids in (ctx.web.top_parts, ctx.web.bottom_parts):
                bf, tf = flange_plate(ctx, st, ids)
                if bf > 0 and tf > 0:
                    cands.append((flange_area(st, ids), bf, tf))
            if cands:
                _, bf, tf = min(cands)
                fc = flange_contribution(
                    bf=bf,
                    tf=tf,
                    fyf=fy,
                    t=tw,
                    hw=ctx.D,
                    fyw=fy,
                    a=do,
                    eps=epsilon(fy),
                    M_Ed=M_Ed,
                    Mf_Rd=Mf,
                    gamma_M1=ctx.f("gamma_M1"),
                    where=ctx.where,
                )
                Vbf, vals, note = fc.Vbf_Rd, fc.values, fc.note
        r = en1993_shear.web_shear(
            fyw=fy,
            hw=ctx.D,
            t=tw,
            panel=panel,
            a=do,
            eta=ctx.f("eta"),
            gamma_M1=ctx.f("gamma_M1"),
            Vbf_Rd=Vbf,
            Vbf_values=vals,
            E=ctx.material.E,
            where=f"{ctx.where} / web shear ({label})",
        )
        if note and Vbf == 0.0:
            r = replace(r, notes=(*r.notes, note))
        if Vbf > 0.0:
            r = replace(
                r,
                notes=(
                    *r.notes,
                    "Vbf,Rd with the flange's plates as separate plates (tf = sqrt(sum b t² / bf)),"
                    " no composite action: conservative",
                ),
            )
        elif do is None:
            r = replace(r, notes=(*r.notes, "no transverse stiffeners: Vbf,Rd not counted"))
        elif M_Ed is None:
            r = replace(r, notes=(*r.notes, "no design moment at the station: Vbf,Rd not counted"))
        return r

    return [panel_shear(ctx, check)]


def local_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Local web shear, fy / sqrt(3) (EN 1993-1-1 6.2.6(2) and (4))."""
    return local_shear(
        ctx,
        tau_y=lambda fy: fy / math.sqrt(3.0),
        tau_y_words="shear yield stress fy / sqrt(3)",
        tau_y_source="EN 1993-1-1:2005 6.2.6(2) and 6.2.6(4)" + MEM,
        phi=1.0 / ctx.f("gamma_M0"),
        standard="EN 1993-1-1 Design of steel structures: general rules",
        edition="2005",
        clause="6.2.6(4)-(5) elastic check tau = V S / (I t) at the thinnest cut; 6.2.6(2) Vpl on the net web"
        + MEM,
    )


def bending_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Mc,Rd with the cross-section class of each state (6.2.5; 1-5 4.4 in class 4)."""
    key = ("bending built", ctx.compression)  # the same at every station of the member
    if key not in ctx.cache:
        ctx.cache[key] = bending(ctx, ctx.built, ctx.tw_nominal, "as-built", ctx.compression)
    b = ctx.cache[key]
    f = bending(ctx, ctx.found, ctx.tw_panel, "as-found", ctx.compression)
    cb, cf = int(b.value("class").value), int(f.value("class").value)
    note = (
        f"class {cb} as-built, class {cf} as-found (thickness found), {ctx.compression} flange "
        "in compression; the class and effective widths carry local buckling"
    )
    if cf != cb:
        note += ": the loss changed the class"
    return [moment_state("bending", "bending", b, f, note)]


def tension_flange_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Holes in the tension (bottom) flange, EN 1993-1-1 6.2.5(4)."""

    def check(st, An, Ag, w):
        r = tension_flange_holes(
            Af_net=An,
            Af=Ag,
            fy=ctx.material.Fy,
            fu=ctx.material.Fu,
            W_t=st.gross.props.S_bot if ctx.compression == "top" else st.gross.props.S_top,
            gamma_M0=ctx.f("gamma_M0"),
            gamma_M2=ctx.f("gamma_M2"),
            where=w,
        )
        return r, r.Rr

    return tension_flange(ctx, check, "Eq. 6.16 on the tension flange")


def interaction_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Bending and shear, EN 1993-1-5 7.1, where the station has design effects: the moment
    resistance for the design shear, and never more than the bending resistance Mc,Rd."""
    V_Ed = ctx.design.get("V")
    if V_Ed is None or "M" not in ctx.design:
        return []
    shear = next((ls for ls in done if ls.key == "web_shear"), None) or shear_states(ctx)[0]
    bend = next((ls for ls in done if ls.key == "bending"), None) or bending_states(ctx)[0]
    out = {}
    for label, st, res, Mc in (
        ("built", ctx.built, shear.built, bend.C_built),
        ("found", ctx.found, shear.found, bend.C_found),
    ):
        if not isinstance(res, CapacityResult) or not res.has("Vbw,Rd") or Mc is None:
            return []
        Mf, _ = flanges_moment(ctx, st)
        Mpl = st.gross.props.Zx * ctx.material.Fy / ctx.f("gamma_M0")
        it = bending_shear(
            V_Ed=V_Ed, Vbw_Rd=res.value("Vbw,Rd").value, Mpl_Rd=Mpl, Mf_Rd=min(Mf, Mpl)
        )
        M = min(it.M_Rd, Mc)
        out[label] = CapacityResult(
            limit_state="bending and shear",
            standard="EN 1993-1-5 Design of steel structures: plated structural elements",
            edition="2006",
            clause="7.1, Eq. 7.1" + MEM,
            Rn=M,
            phi=1.0,
            kind="moment",
            values=(
                *it.values,
                CheckValue("M_Rd,7.1", it.M_Rd, "moment", "moment resistance for V_Ed", SRC_71),
                CheckValue("Mc,Rd", Mc, "moment", "bending resistance", "EN 1993-1-1 6.2.5"),
                CheckValue("V_Ed", V_Ed, "force", "design shear at the station", "load model"),
            ),
            notes=(it.branch, "M_Rd = min(Eq. 7.1 for V_Ed, Mc,Rd)"),
        )
    b, f = out["built"], out["found"]
    note = (
        f"min(Eq. 7.1 for V_Ed, Mc,Rd): {f.notes[0]}; Mpl,Rd of the gross section, Mf,Rd of "
        "the flanges alone"
    )
    return [moment_state("bending_and_shear", "bending and shear", b, f, note, (b.Rn, f.Rn))]


def rivet_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Rivet lines per interface, EN 1993-1-8 Table 3.4."""
    fur = ctx.family.f("f_ur")

    def check(ctx, line, plies, w):
        return en1993_rivets.rivet_resistance(
            **line_rivet(line),
            plies=plies,
            f_ur=fur.value,
            f_ur_source=fur.source,
            gamma_M2=ctx.f("gamma_M2"),
            where=w,
        )

    return rivet_groups(ctx, check)


LIMIT_STATES = (
    LimitStateSpec("web_shear", "web shear (EN 1993-1-5 5.2-5.4)", shear_states),
    LimitStateSpec("local_web_shear", "local web shear (EN 1993-1-1 6.2.6)", local_states),
    LimitStateSpec("bending", "bending (EN 1993-1-1 6.2.5, 1-5 4.4)", bending_states),
    LimitStateSpec(
        "lateral_torsional_buckling",
        "lateral-torsional buckling (EN 1993-1-1 6.3.2, EN 1993-2 6.3.4.2)",
        girder.ltb_states,
    ),
    LimitStateSpec(
        "tension_flange_at_holes",
        "tension flange at holes (EN 1993-1-1 6.2.5(4))",
        tension_flange_states,
    ),
    LimitStateSpec("bending_and_shear", "bending and shear (EN 1993-1-5 7.1)", interaction_states),
    LimitStateSpec("flexure", "flexure, the least of the above", girder.flexure_states),
    LimitStateSpec(
        "girder_end", "girder ends (EN 1993-1-5 9.4, Section 6)", girder.girder_end_states
    ),
    LimitStateSpec("rivets", "rivet lines (EN 1993-1-8 Table 3.4)", rivet_states),
    LimitStateSpec(
        "fatigue", "fatigue (riveted details; EN 1993-1-9, EN 1993-2 9.5.3)", girder.fatigue_states
    ),
)


@dataclass(frozen=True)
class Rules(RulesBase):
    factors: dict
    use: str | None
    key = "en1993"

    def model_key(self, opts: AssessOptions) -> str:
        if opts.live_load:
            return opts.live_load
        return {"railway": "lm71", "highway": "lm1"}.get(self.use or "", "none")

    def stiffener_check(self, defn, web, D: float, material):
        return girder.stiffener_check(defn, web, D, material)

    def girder_notes(self) -> list[Choice]:
        return girder.girder_notes()

    def member_factors(self, member: Member, opts: AssessOptions) -> dict[str, Factor]:
        out = {"g": distribution(member, opts)}
        ll = member.live_load
        a = ll.alpha if ll and ll.alpha is not None else None
        out["alpha"] = Factor(
            "alpha",
            a if a is not None else 1.0,
            "LM71 classification factor",
            "engineer's input, member record"
            if a is not None
            else "EN 1991-2:2003 6.3.2(3)" + MEM + ": 1.0 assumed, owner to confirm for the line",
        )
        return out

    def live_cases(self, member: Member, survey: Survey, opts: AssessOptions) -> list[LiveCase]:
        key = self.model_key(opts)
        mf = self.member_factors(member, opts)
        g = mf["g"].value
        ll = member.live_load
        if key == "lm71":
            track = (ll.track if ll else None) or "standard"
            Lphi = (
                ll.L_phi.to("length", f"{member.place()} / live_load / L_phi")
                if ll and ll.L_phi
                else None
            )
            return [LiveCase("lm71", "LM71", "design", LM71(mf["alpha"].value, track, Lphi), g)]
        if key == "lm1":
            shares = tuple(ll.lane_shares) if ll and ll.lane_shares else None
            f = self.factors
            model = LM1(shares, f["alpha_Q"].value, f["alpha_q"].value)
            return [LiveCase("lm1", "LM1", "design", model, 1.0 if shares else g)]
        return []

    def summary_cases(self, cases: list[LiveCase], opts: AssessOptions):
        m = Utilisation(self.factors["gamma_G"], self.factors["gamma_Q"])
        return [(f"Eq. 6.10: {c.title}", m, [c.key], None) for c in cases if c.role == "design"]

    def posting(self, value: float, weight: float | None, system: str) -> str:
        return f"reserve 1 - U = {1.0 - value:.3g}" + (" (overloaded)" if value > 1.0 else "")

    def flags(self, survey: Survey) -> list[Flag]:
        use = survey.survey.use
        if use in ("building", "industrial"):
            return [
                Flag(
                    Level.REVIEW,
                    "survey / use",
                    f"engineer to review: the structure is recorded as {use}; this family's partial factors and loads are for bridges",
                )
            ]
        return []


def build(opts: AssessOptions, survey: Survey) -> Family:
    use = survey.survey.use
    defaults = {**default_factors(use), **girder.girder_factors(use)}
    key = Rules(defaults, use).model_key(opts)
    if key != "lm1":  # the LM1 adjustment factors are used with LM1 only
        defaults = {k: v for k, v in defaults.items() if k not in ("alpha_Q", "alpha_q")}
    factors = override(defaults, opts.factors, "EN 1993", RANGES)
    rules = Rules(factors, use)
    words = {
        "lm71": "LM71 (railway)",
        "lm1": "LM1 (road)",
        "station": "the station loads only",
        "none": "none (use not recorded)",
    }
    return Family(
        key="en1993",
        name="EN 1993 (1-1, 1-5, 1-8) with EN 1993-2 partial factors, EN 1991-2 loads and EN 1990 Annex A2; utilisation",
        documents=DOCUMENTS,
        factors=factors,
        limit_states=LIMIT_STATES,
        measure=Utilisation(factors["gamma_G"], factors["gamma_Q"]),
        depth_basis=opts.depth_basis or "clear",
        choices=(
            Choice(
                "live load model",
                words.get(key, key),
                ENGINEER if opts.live_load else f"by the structure's use ({use or 'not recorded'})",
            ),
        ),
        tokens=TOKENS,
        rules=rules,
        short_name="EN 1993-1-1, -1-5, -1-8, EN 1993-2; EN 1991-2; EN 1990 A2: utilisation",
    )
