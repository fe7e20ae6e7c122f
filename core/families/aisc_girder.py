"""The AISC family's girder limit states: flange yielding, lateral-torsional and flange local
buckling of a built-up I-member (F4 or F5 as the web's slenderness decides), the flexure as
the least of them and the tension flange at its holes (F13.1), bearing stiffeners (J7, J10.8)
or the web at a bearing (J10.2, J10.3), and intermediate stiffeners (G2.3).

AISC 360-22, from memory (listed on the assumptions page): phi_b 0.90 (F1), phi 0.75 for
bearing (J7), phi_c 0.90 (E1), phi 1.00 web local yielding (J10.2), 0.75 web crippling
(J10.3). hc and h to the web's fastener lines (B4.1b for built-up sections). U-frames have
no clause in the specification: a flange held only by them is taken as unbraced between the
supports (conservative, said so). Fatigue (Appendix 3) is not checked.
"""

from __future__ import annotations

from core.assess.results import LimitState
from core.checks import aisc_stiffener, intermediate_stiffener
from core.checks.aisc_flexure import (
    BuiltUpI,
    Cb_quarter_points,
    flange_local_buckling,
    flange_yielding,
    lateral_torsional_buckling,
)
from core.checks.results import PRACTICE
from core.checks.riveted_flange import flange_elements
from core.families.base import Choice, Factor
from core.families.common import moment_state
from core.families.context import StationContext
from core.families.girder import (
    bottom_flange,
    bracing,
    flange_of,
    girder_ends,
    least_flexure,
    segment,
    segment_moments,
    state_of,
    web_at_bearing,
)

FLEXURAL_KEYS = (
    "flange_yield",
    "lateral_torsional_buckling",
    "flange_local_buckling",
    "tension_flange_at_holes",
)


def _src(clause: str) -> str:
    return f"AISC 360-22 {clause} (from memory)"


def girder_factors() -> dict[str, Factor]:
    return {
        "phi_bear": Factor("phi_bear", 0.75, "resistance factor, stiffener bearing", _src("J7")),
        "phi_ax": Factor(
            "phi_ax",
            0.90,
            "resistance factor, axial compression (stiffener column)",
            _src("E1, J4.4"),
        ),
        "phi_yw": Factor("phi_yw", 1.00, "resistance factor, web local yielding", _src("J10.2")),
        "phi_wc": Factor("phi_wc", 0.75, "resistance factor, web crippling", _src("J10.3")),
    }


RANGES = {k: (0.0, 1.0) for k in ("phi_bear", "phi_ax", "phi_yw", "phi_wc")}


def section(ctx: StationContext, label: str) -> BuiltUpI:
    """The built-up I of F4 / F5 at the station in one state (cached)."""
    key = ("builtup", ctx.station, label, ctx.compression)
    if key in ctx.cache:
        return ctx.cache[key]
    cf = flange_of(ctx, label)
    st = state_of(ctx, label)
    p = st.gross.props
    web = ctx.web
    lines = web.y_lines or web.y_toes
    y_c = lines[1] if ctx.compression == "top" else lines[0]
    hc = 2.0 * abs(y_c - p.yc)
    hp = max(2.0 * abs(y_c - p.y_pna), 1e-3)
    h = (lines[1] - lines[0]) if web.y_lines else ctx.D
    tw = ctx.tw_nominal if label == "built" else ctx.tw_panel
    sec = BuiltUpI(
        Fy=ctx.material.Fy,
        E=ctx.material.E,
        Sxc=cf.Sxc,
        Sxt=cf.Sxt,
        Zx=p.Zx,
        rt=cf.rt,
        J=cf.thin.J,
        h0=cf.h0,
        h=h,
        hc=hc,
        hp=hp,
        tw=tw,
        Afc=cf.Afc,
        Iyc=cf.Iyc,
        Iy=cf.Iy,
        where=f"{ctx.where} / built-up section ({label})",
    )
    ctx.cache[key] = sec
    return sec


def flange_yield_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Compression and tension flange yielding (F4.1 / F4.4 or F5.1 / F5.4)."""
    res = {lb: flange_yielding(section(ctx, lb), phi_b=ctx.f("phi_b")) for lb in ("built", "found")}
    note = (
        f"flange yielding on the gross section, {ctx.compression} flange in compression, hc to "
        "the compression flange's rivet line; holes only in the tension flange check"
    )
    return [moment_state("flange_yield", "flange yield", res["built"], res["found"], note)]


def ltb_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Lateral-torsional buckling (F4.2 or F5.2) over the unbraced segment, Cb by F1-1."""
    br = bracing(ctx)
    a, b, bw = segment(ctx)
    Cb = 1.0
    if br is not None and br.kind == "continuous":
        Lb, words = 0.0, "compression flange braced continuously: Lb = 0"
    else:
        Lb = b - a
        mom = segment_moments(ctx, a, b, 4)
        if mom is not None and max(mom) > 0:
            Cb, _ = Cb_quarter_points(max(mom), mom[1], mom[2], mom[3], where=ctx.where)
        words = f"unbraced segment {a / 1000:.4g} to {b / 1000:.4g} m ({bw})"
        if br is not None and br.kind == "u_frames":
            words += (
                "; the U-frames are not counted (no clause of this family for them): held at "
                "the supports only, conservative"
            )
        words += "; Cb " + ("by F1-1 from the design moments" if mom else "1.0 (no member loads)")
    res = {
        lb: lateral_torsional_buckling(section(ctx, lb), Lb=Lb, Cb=Cb, phi_b=ctx.f("phi_b"))
        for lb in ("built", "found")
    }
    return [
        moment_state(
            "lateral_torsional_buckling",
            "lateral-torsional buckling",
            res["built"],
            res["found"],
            words,
        )
    ]


def flb_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Compression flange local buckling (F4.3 or F5.3), the most slender outstand."""
    res = {}
    for lb in ("built", "found"):
        loss = None if lb == "built" else ctx.found.loss
        els = flange_elements(ctx.defn, loss, compression=ctx.compression, web=ctx.web.web_id)
        res[lb] = flange_local_buckling(section(ctx, lb), els, phi_b=ctx.f("phi_b"))
    note = "each outstand of the compression flange (angle legs, cover plate edges) as found"
    return [
        moment_state(
            "flange_local_buckling", "flange local buckling", res["built"], res["found"], note
        )
    ]


def flexure_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    return least_flexure(ctx, done, FLEXURAL_KEYS, "F4 / F5, F13.1")


def _bearing(ctx: StationContext, st, loss, tw: float, where: str):
    return aisc_stiffener.bearing_resistance(
        st.engine,
        Fy=ctx.material.Fy,
        tw=tw,
        bf=bottom_flange(ctx, "built")[0],
        clip=st.clip,
        loss=loss,
        phi=ctx.f("phi_bear"),
        where=where,
    )


def _column(ctx: StationContext, st, loss, tw: float, where: str):
    at_end = st.x <= 1e-6 or st.x >= ctx.span - 1e-6
    return aisc_stiffener.axial_strength(
        st.engine,
        Fy=ctx.material.Fy,
        E=ctx.material.E,
        h=ctx.D,
        tw=tw,
        position="end" if at_end else "interior",
        loss=loss,
        phi_c=ctx.f("phi_ax"),
        where=where,
    )


def _web(ctx: StationContext, sup, had: bool) -> list[LimitState]:
    return web_at_bearing(ctx, sup, "aisc", ctx.f("phi_yw"), ctx.f("phi_wc"), had)


def girder_end_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Bearing stiffeners (J7, J10.8) at the supports; without an effective stiffener, web
    local yielding and crippling (J10.2, J10.3)."""
    return girder_ends(ctx, _bearing, _column, _web)


def stiffener_check(defn, web, D: float, material):
    """G2.3 for the intermediate stiffeners (see :mod:`core.assess.panels`)."""

    def check(st, loss, tw, do, state):
        return intermediate_stiffener.aisc(
            st.engine,
            Fyw=material.Fy,
            Fyst=material.Fy,
            E=material.E,
            h=D,
            tw=tw,
            a=do,
            loss=loss,
            where=f"stiffener {st.id!r} ({state})",
        )

    return check


def girder_notes() -> list[Choice]:
    """The AISC family's own bases of its girder limit states."""
    return [
        Choice(
            "U-frames",
            "not counted (the specification has no clause for them): a flange held only by "
            "U-frames is unbraced between the supports, conservative",
            PRACTICE,
        ),
        Choice(
            "web plastification",
            "Rpc and Rpt as the clauses give them (F4-9, F4-16); Rpg for a slender web (F5-6)",
            _src("F4, F5"),
        ),
        Choice("fatigue", "not checked (Appendix 3 is not implemented)", PRACTICE),
    ]
