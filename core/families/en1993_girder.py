"""The EN 1993 family's girder limit states: lateral-torsional buckling (EN 1993-1-1 6.3.2
with Mcr of the section as found, or the U-frame chord of EN 1993-2 6.3.4.2), the flexure as
the least of the bending resistance (its class and effective widths carry the local
buckling of the flange and web, Table 5.2 and EN 1993-1-5 4.4), lateral-torsional buckling,
the tension flange at its holes and bending with shear; bearing stiffeners (EN 1993-1-5 9.4)
or the web under the bearing (EN 1993-1-5 Section 6); intermediate stiffeners (9.3.3); and
fatigue of the riveted details (EN 1993-1-9, EN 1993-2 9.5.3).

From memory (listed on the assumptions page): Mcr by the ENV 1993-1-1 Annex F formula with
C1 = 1 and the load at the shear centre (zg = 0), G = E / 2.6; curve d for riveted sections;
fatigue: LM71 with alpha 1 and Phi2 as the fatigue load, the damage equivalent factor
lambda (default its upper bound 1.4, EN 1993-2 9.5.3), detail category 71 for riveted
details (not a value of EN 1993-1-9's tables), gamma_Mf 1.35, gamma_Ff 1.0, the damage
equivalent range taken as 2 x 10^6 cycles over a 100-year design life for the remaining life.
"""

from __future__ import annotations

from dataclasses import replace

from core.assess.results import LimitState
from core.checks import en1993_fatigue, en1993_patch, en1993_stiffener, intermediate_stiffener
from core.checks.en1993_buckling import epsilon
from core.checks.en1993_ltb import buckling_resistance, elastic_critical_moment
from core.checks.en1993_uframe import compression_chord
from core.errors import InputError
from core.families.base import Choice, Factor
from core.families.common import moment_state
from core.families.context import StationContext, model_moment
from core.families.fatigue import fatigue_state
from core.families.girder import (
    bottom_flange,
    bracing,
    chord_column,
    chord_words,
    end_state,
    flange_of,
    girder_ends,
    knife_line,
    least_flexure,
    segment,
)
from core.loads.models import LM71

FLEXURAL_KEYS = (
    "bending",
    "lateral_torsional_buckling",
    "tension_flange_at_holes",
    "bending_and_shear",
)
MEM = " (from memory)"
#: design life over which the damage equivalent range stands for 2 x 10^6 cycles, years
DESIGN_LIFE = 100.0
#: Poisson's ratio of steel, EN 1993-1-1 3.2.6 (from memory): G = E / (2 (1 + nu))
NU = 0.3


def girder_factors(use: str | None) -> dict[str, Factor]:
    out = {
        "gamma_Mf": Factor(
            "gamma_Mf",
            en1993_fatigue.GAMMA_MF,
            "partial factor, fatigue strength (safe life, high consequence)",
            "EN 1993-1-9:2005 Table 3.1" + MEM + "; the National Annex may differ",
        ),
        "gamma_Ff": Factor(
            "gamma_Ff",
            en1993_fatigue.GAMMA_FF,
            "partial factor, fatigue loads",
            "EN 1993-2:2006 9.3(1)" + MEM,
        ),
    }
    if use != "highway":
        out["lambda_fat"] = Factor(
            "lambda_fat",
            1.4,
            "damage equivalent factor lambda = lambda1 lambda2 lambda3 lambda4, its upper "
            "bound taken (conservative; give the line's value)",
            "EN 1993-2:2006 9.5.3" + MEM,
        )
    return out


RANGES = {"gamma_Mf": (0.5, 2.0), "gamma_Ff": (0.5, 2.0), "lambda_fat": (0.1, 3.0)}


def _W(res) -> float:
    """The section modulus the bending resistance used (Wpl, Wel,min or Weff,min)."""
    for sym in ("Weff,min", "Wel,min", "Wpl"):
        if res.has(sym):
            return res.value(sym).value
    raise KeyError("no section modulus in the bending result")


def ltb_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Mb,Rd (6.3.2.2) over the unbraced segment, or the U-frame chord (EN 1993-2 6.3.4.2)."""
    br = bracing(ctx)
    if br is not None and br.kind == "continuous":
        return []
    bend = next((ls for ls in done if ls.key == "bending"), None)
    if bend is None or bend.built is None or bend.found is None:
        return []
    fy, E = ctx.material.Fy, ctx.material.E
    u_frames = br is not None and br.kind == "u_frames"
    a, bb, bw = (0.0, 0.0, "") if u_frames else segment(ctx)

    def resistance(label: str, Wy: float):
        cf = flange_of(ctx, label)
        w = f"{ctx.where} / lateral-torsional buckling ({label})"
        if u_frames:
            col, chord, _sid = chord_column(ctx, label)
            return compression_chord(
                A_chord=chord.A_rt,
                I_chord=chord.Iy_rt,
                fy=fy,
                Wy=Wy,
                span=ctx.setup.details.span_b - ctx.setup.details.span_a,
                frames=(),
                E=E,
                gamma_M1=ctx.f("gamma_M1"),
                column=col,
                where=w,
            )
        t = cf.thin
        Mcr, vals = elastic_critical_moment(
            Iz=t.Iy,
            It=t.J,
            Iw=t.Iw,
            L=bb - a,
            zj=t.beta_x / 2.0,
            E=E,
            G=E / (2.0 * (1.0 + NU)),
            where=w,
        )
        return buckling_resistance(
            Wy=Wy, fy=fy, Mcr=Mcr, gamma_M1=ctx.f("gamma_M1"), mcr_values=vals, where=w
        )

    res = {}
    for label, b in (("built", bend.built), ("found", bend.found)):
        Wy = _W(b)
        if label == "built":
            # the as-built chord is the member's: one result per sense, segment and modulus
            key = ("ltb built", ctx.compression, u_frames, bb - a, Wy)
            if key not in ctx.cache:
                ctx.cache[key] = resistance(label, Wy)
            res[label] = ctx.cache[key]
        else:
            res[label] = resistance(label, Wy)
    if u_frames:
        _col, _chord, sid = chord_column(ctx, "found")
        words = (
            "U-frame compression chord on its frames (EN 1993-2 6.3.4.2), "
            f"{chord_words(sid, 'found')} as found"
        )
    else:
        words = (
            f"unbraced segment {a / 1000:.4g} to {bb / 1000:.4g} m ({bw}); Mcr with C1 = 1, "
            "load at the shear centre; Wy of the class"
        )
    return [
        moment_state(
            "lateral_torsional_buckling",
            "lateral-torsional buckling",
            res["built"],
            res["found"],
            words,
        )
    ]


def flexure_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    return least_flexure(ctx, done, FLEXURAL_KEYS, "EN 1993-1-1 6.2.5, 6.3.2, EN 1993-1-5 7.1")


def _strip(ctx: StationContext, st, tw: float) -> float | None:
    """Web available beside a stiffener at a girder end: the overhang beyond it."""
    sup = next((s for s in ctx.supports if s.stiffener is st), None)
    if sup is None or not (st.x <= 1e-6 or st.x >= ctx.span - 1e-6):
        return None
    eps = epsilon(ctx.material.Fy)
    foot = st.engine.t * st.engine.per_side
    return 15.0 * eps * tw + foot + max(sup.overhang - 0.5 * foot, 0.0)


def _bearing(ctx: StationContext, st, loss, tw: float, where: str):
    return en1993_stiffener.end_resistance(
        st.engine,
        fy=ctx.material.Fy,
        tw=tw,
        E=ctx.material.E,
        clip=st.clip,
        loss=loss,
        strip_available=_strip(ctx, st, tw),
        gamma_M0=ctx.f("gamma_M0"),
        where=where,
    )


def _column(ctx: StationContext, st, loss, tw: float, where: str):
    return en1993_stiffener.buckling_resistance(
        st.engine,
        fy=ctx.material.Fy,
        tw=tw,
        hw=ctx.D,
        E=ctx.material.E,
        loss=loss,
        strip_available=_strip(ctx, st, tw),
        gamma_M1=ctx.f("gamma_M1"),
        where=where,
    )


def _web(ctx: StationContext, sup, had: bool) -> list[LimitState]:
    """EN 1993-1-5 Section 6 under the bearing: type (c) at a girder end, (a) elsewhere."""
    tw_k, tw_words, perf = knife_line(ctx)
    at_end = sup.x <= 1e-6 or sup.x >= ctx.span - 1e-6
    why = (
        "the bearing stiffener is not effective as found"
        if had
        else "no bearing stiffener recorded"
    )
    note = (
        f"{why}; web at the knife line: {tw_words}; ss = N = {sup.N:.4g} mm; load type "
        f"({'c' if at_end else 'a'}); tf: the bottom flange's horizontal material"
    )

    def run(label: str):
        if label == "found" and perf:
            raise InputError("the web at the bearing is perforated", where=ctx.where)
        tw = ctx.tw_nominal if label == "built" else tw_k
        bf, tf = bottom_flange(ctx, label)
        _, do = ctx.panel_of(label)
        return en1993_patch.transverse_force_resistance(
            fyw=ctx.material.Fy,
            hw=ctx.D,
            tw=tw,
            ss=sup.N,
            bf=bf,
            tf=tf,
            load_type="c" if at_end else "a",
            a=do,
            c=max(sup.overhang - 0.5 * sup.N, 0.0),
            E=ctx.material.E,
            gamma_M1=ctx.f("gamma_M1"),
            where=f"{ctx.where} / support {sup.id} / web under the bearing ({label})",
        )

    return [
        end_state(
            ctx,
            sup,
            "web_patch",
            f"web under the bearing (support {sup.id})",
            lambda: run("built"),
            lambda: run("found"),
            note,
            gone="the web at the bearing is perforated" if perf else "",
        )
    ]


def girder_end_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Bearing stiffeners (EN 1993-1-5 9.4: end section and buckling) at the supports;
    without an effective stiffener, the web under the bearing (Section 6)."""
    return girder_ends(ctx, _bearing, _column, _web)


def stiffener_check(defn, web, D: float, material):
    """9.3.3 and 9.2.1(8) for the intermediate stiffeners (see :mod:`core.assess.panels`)."""

    def check(st, loss, tw, do, state):
        return intermediate_stiffener.en1993(
            st.engine,
            fy=material.Fy,
            hw=D,
            tw=tw,
            a=do,
            E=material.E,
            loss=loss,
            where=f"stiffener {st.id!r} ({state})",
        )

    check.tension_field = False  # type: ignore[attr-defined]
    return check


def fatigue_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Fatigue of the riveted detail at the net section of the tension flange (railway
    girders: LM71 with alpha 1 and Phi2, times lambda; EN 1993-2 9.5.3 and EN 1993-1-9)."""
    s = ctx.setup
    if s is None or s.age is None or "lambda_fat" not in ctx.family.factors:
        return []
    if ctx.family.rules.model_key(ctx.opts) != "lm71":
        return []
    lam = ctx.f("lambda_fat")
    M = model_moment(ctx, "fatigue lm71", LM71(1.0, "careful")) * ctx.member["g"].value * lam
    gMf, gFf = ctx.f("gamma_Mf"), ctx.f("gamma_Ff")

    def life(label, ds):
        return en1993_fatigue.remaining_life(
            spectrum=[(ds, en1993_fatigue.N_C / DESIGN_LIFE)],
            age=s.age,
            gamma_Mf=gMf,
            gamma_Ff=gFf,
            where=f"{ctx.where} / fatigue ({label})",
        )

    words = (
        f"Delta sigma_E,2 = lambda {lam:g} x Delta sigma(LM71, alpha 1, Phi2) x g "
        f"{ctx.member['g'].value:.3g}, taken as 2 x 10^6 cycles over {DESIGN_LIFE:g} years; age "
        f"{s.age:.0f} years"
    )
    out = fatigue_state(ctx, M, life, lambda ds: gFf * ds, words)
    ls = out[0]
    u = gFf * ls.extra["stress_range_found_MPa"] * gMf / en1993_fatigue.DELTA_SIGMA_C_RIVETED
    eq = f"; Eq. 8.2: gamma_Ff Delta sigma_E,2 gamma_Mf / Delta sigma_C = {u:.3g}"
    return [replace(ls, note=ls.note + eq)]


def girder_notes() -> list[Choice]:
    """The EN 1993 family's own bases of its girder limit states."""
    return [
        Choice(
            "elastic critical moment Mcr",
            "of the section as found (St Venant and warping constants of its plates), C1 = 1 "
            "(uniform moment, the least for the usual diagrams), load at the shear centre, "
            "G = E / 2.6; buckling curve d for riveted sections",
            "ENV 1993-1-1:1992 Annex F, Eq. F.2; EN 1993-1-1:2005 6.3.2.2, Table 6.4" + MEM,
        ),
        Choice(
            "U-frames",
            "the compression chord on the frames' springs",
            "EN 1993-2:2006 6.3.4.2 and Annex D.2.4" + MEM,
        ),
        Choice(
            "web under a bearing without an effective stiffener",
            "EN 1993-1-5 Section 6, type (c) at a girder end, (a) elsewhere; m2 = 0 (the clause's "
            "step at lambda_F = 0.5 could rate a thinner web higher: conservative)",
            "EN 1993-1-5:2006 6.1-6.5" + MEM,
        ),
        Choice(
            "fatigue",
            "railway girders: Delta sigma_E,2 = lambda Delta sigma(LM71, alpha 1, Phi2) at the "
            "net section of the tension flange; detail category 71 for riveted details (not a "
            f"value of EN 1993-1-9's tables); taken as 2 x 10^6 cycles over {DESIGN_LIFE:g} "
            "years for the remaining life; road girders: not checked (FLM3 not implemented)",
            "EN 1993-2:2006 9.5.3, EN 1993-1-9:2005 7.1, 8(2), Annex A" + MEM,
        ),
    ]
