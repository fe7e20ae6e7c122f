"""The AASHTO family's girder limit states: flange yield with Rb, lateral-torsional and
flange local buckling of the compression flange, web bend-buckling, the flexure as the least
of them and the tension flange at its holes, the girder ends (bearing stiffeners, or the web
at the bearing), intermediate stiffeners for the panels, and fatigue of the riveted details.

AASHTO LRFD Bridge Design Specifications 9th ed. (2020) and the Manual for Bridge
Evaluation 3rd ed. (2018); every value from memory, listed on the assumptions page:

- 6.10.8.1.1, 6.10.8.3 flange yield Rb Rh Fyf; 6.10.1.10.2 Rb; 6.10.8.2.3 lateral-torsional
  buckling with Cb from the moment diagram (6.10.8.2.3-7), U-frames by the method of
  6.14.2.9 (by analogy); 6.10.8.2.2 flange local buckling of each riveted outstand;
  6.10.1.9.1 web bend-buckling (a service and constructibility limit: shown, not rated).
- 6.10.11.2.3 and 6.10.11.2.4 bearing stiffeners (phi_b 1.00, phi_c 0.95, 6.5.4.2); without
  an effective stiffener, Appendix D6.5.2 and D6.5.3 (phi_b 1.00, phi_w 0.80).
- 6.10.11.1 intermediate stiffeners for the tension field of 6.10.9.3.2.
- Fatigue: LRFD 3.6.1.4.1 fatigue truck (8, 32, 32 kip at 14 and 30 ft), 15 % dynamic
  allowance (Table 3.6.2.1-1), no multiple presence (3.6.1.1.2); Category D at the net
  section of the tension flange's riveted detail (Table 6.6.1.2.3-1); MBE 7.2 infinite life
  and remaining life with Rs and Rr of 1.0.
"""

from __future__ import annotations

from core.assess.results import LimitState
from core.checks import aashto_fatigue, aashto_stiffener, intermediate_stiffener
from core.checks.aashto_flange import flange_local_buckling, web_bend_buckling, web_load_shedding
from core.checks.aashto_ltb import lateral_torsional_buckling, moment_gradient_Cb
from core.checks.flexure import flange_yield
from core.checks.riveted_flange import flange_elements
from core.families.base import Choice, Factor
from core.families.common import moment_state
from core.families.context import StationContext, capped, model_moment
from core.families.fatigue import fatigue_state
from core.families.girder import (
    bottom_flange,
    bracing,
    chord_column,
    chord_words,
    flange_of,
    girder_ends,
    least_flexure,
    segment,
    segment_moments,
    web_at_bearing,
)
from core.loads.models import KIP, AxleTrain
from core.units import to_internal

FT = to_internal(1.0, "ft", "length")
FLEXURAL_KEYS = (
    "flange_yield",
    "lateral_torsional_buckling",
    "flange_local_buckling",
    "tension_flange_at_holes",
)


def _lrfd(clause: str) -> str:
    return f"AASHTO LRFD 9th ed. (2020), {clause} (from memory)"


def _mbe(clause: str) -> str:
    return f"AASHTO MBE 3rd ed. (2018), {clause} (from memory)"


def girder_factors() -> dict[str, Factor]:
    """The factors of the girder limit states, with their sources."""
    return {
        "phi_bs": Factor(
            "phi_bs", 1.00, "resistance factor, stiffener bearing on milled ends", _lrfd("6.5.4.2")
        ),
        "phi_ax": Factor(
            "phi_ax",
            0.95,
            "resistance factor, axial compression (stiffener column)",
            _lrfd("6.5.4.2"),
        ),
        "phi_wy": Factor(
            "phi_wy", 1.00, "resistance factor, web local yielding", _lrfd("6.5.4.2, D6.5.2")
        ),
        "phi_w": Factor(
            "phi_w", 0.80, "resistance factor, web crippling", _lrfd("6.5.4.2, D6.5.3")
        ),
        "IM_fat": Factor(
            "IM_fat", 0.15, "dynamic load allowance on the fatigue truck", _lrfd("Table 3.6.2.1-1")
        ),
        "Rs": Factor(
            "Rs",
            1.0,
            "partial load factor on the fatigue stress range",
            _mbe("Table 7.2.2.1-1") + "; engineer's input",
        ),
        "Rr": Factor(
            "Rr",
            1.0,
            "resistance factor for the fatigue life sought (minimum expected life)",
            _mbe("Table 7.2.5.2-1"),
        ),
    }


RANGES = {
    "phi_bs": (0.0, 1.0),
    "phi_ax": (0.0, 1.0),
    "phi_wy": (0.0, 1.0),
    "phi_w": (0.0, 1.0),
    "IM_fat": (-1e-9, 1.0),
    "Rs": (0.0, 3.0),
    "Rr": (0.0, 5.0),
}


def _Rb(ctx: StationContext, label: str, tw: float):
    cf = flange_of(ctx, label)
    m = ctx.material
    return web_load_shedding(
        Dc=cf.Dc, tw=tw, Afc=cf.Afc, E=m.E, Fyc=m.Fy, where=f"{ctx.where} / Rb ({label})"
    )


def _tw(ctx: StationContext, label: str) -> float:
    return ctx.tw_nominal if label == "built" else ctx.tw_panel


def flange_yield_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Flange yield Fn = Rb Rh Fyf on the gross section (6.10.8.1.1, 6.10.8.3, 6.10.1.10.2)."""
    m = ctx.material
    res = {}
    for label in ("built", "found"):
        cf = flange_of(ctx, label)
        Rb, vals = _Rb(ctx, label, _tw(ctx, label))
        res[label] = flange_yield(
            Fyc=m.Fy,
            Fyt=m.Fy,
            S_c=cf.Sxc,
            S_t=cf.Sxt,
            Rb=Rb,
            phi_f=ctx.f("phi_f"),
            extra=tuple(vals),
            where=f"{ctx.where} / flange yield ({label})",
        )
    note = (
        f"first yield of the gross section, Fn = Rb Rh Fyf (6.10.8), {ctx.compression} flange "
        "in compression; holes only in the tension flange check"
    )
    return [moment_state("flange_yield", "flange yield", res["built"], res["found"], note)]


def ltb_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Lateral-torsional buckling of the compression flange (6.10.8.2.3) with the bracing."""
    m = ctx.material
    br = bracing(ctx)
    res, words = {}, ""
    for label in ("built", "found"):
        cf = flange_of(ctx, label)
        Rb, _ = _Rb(ctx, label, _tw(ctx, label))
        Cb = 1.0
        if br is not None and br.kind == "continuous":
            Lb, words = 0.0, "compression flange braced continuously: Lb = 0"
        elif br is not None and br.kind == "u_frames":
            col, _, sid = chord_column(ctx, label)
            Lb = col.Le
            words = (
                f"U-frames: Lb = Le of the chord on the frames ({chord_words(sid, 'found')} "
                "as found), Cb = 1 (6.14.2.9 by analogy)"
            )
        else:
            a, b, bw = segment(ctx)
            Lb = b - a
            mom = segment_moments(ctx, a, b, 2)
            if mom is not None and max(mom) > 0:
                Cb, _ = moment_gradient_Cb(
                    mom[0] / cf.Sxc, mom[1] / cf.Sxc, mom[2] / cf.Sxc, where=ctx.where
                )
            words = f"unbraced segment {a / 1000:.4g} to {b / 1000:.4g} m ({bw}); Cb " + (
                "from the design moment diagram" if mom else "1.0 (no member loads)"
            )
        res[label] = lateral_torsional_buckling(
            Fyc=m.Fy,
            Fyw=m.Fy,
            E=m.E,
            rt=cf.rt,
            Lb=Lb,
            Sxc=cf.Sxc,
            Cb=Cb,
            Rb=Rb,
            Fyt=m.Fy,
            Sxt=cf.Sxt,
            phi_f=ctx.f("phi_f"),
            where=f"{ctx.where} / lateral-torsional buckling ({label})",
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


def flb_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Flange local buckling of each outstand of the riveted compression flange (6.10.8.2.2)."""
    m = ctx.material
    res = {}
    for label in ("built", "found"):
        cf = flange_of(ctx, label)
        Rb, _ = _Rb(ctx, label, _tw(ctx, label))
        loss = None if label == "built" else ctx.found.loss
        els = flange_elements(ctx.defn, loss, compression=ctx.compression, web=ctx.web.web_id)
        res[label] = flange_local_buckling(
            els,
            Fyc=m.Fy,
            Fyw=m.Fy,
            E=m.E,
            Sxc=cf.Sxc,
            Rb=Rb,
            Fyt=m.Fy,
            Sxt=cf.Sxt,
            phi_f=ctx.f("phi_f"),
            where=f"{ctx.where} / flange local buckling ({label})",
        )
    note = (
        "each outstand of the compression flange (angle legs, cover plate edges) with its thickness"
    )
    return [
        moment_state(
            "flange_local_buckling", "flange local buckling", res["built"], res["found"], note
        )
    ]


def web_bend_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Web bend-buckling Fcrw (6.10.1.9.1) as the moment Fcrw Sxc: a service and
    constructibility limit (6.10.4.2.2, 6.10.3.2), shown and not rated; the strength
    limit states carry the web's slenderness through Rb."""
    m = ctx.material
    res = {}
    for label in ("built", "found"):
        cf = flange_of(ctx, label)
        res[label] = web_bend_buckling(
            D=ctx.D,
            Dc=min(cf.Dc, ctx.D),
            tw=_tw(ctx, label),
            E=m.E,
            Fyc=m.Fy,
            Fyw=m.Fy,
            where=f"{ctx.where} / web bend-buckling ({label})",
        )
    b, f = res["built"], res["found"]
    Cb = b.Rr * flange_of(ctx, "built").Sxc
    Cf = f.Rr * flange_of(ctx, "found").Sxc
    ls = LimitState(
        "web_bend_buckling",
        "web bend-buckling (service, not rated)",
        "moment",
        b,
        f,
        Cb,
        Cf,
        note="Fcrw Sxc: the moment at which the compression flange stress reaches Fcrw",
    )
    return [capped(ls)]


def flexure_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """The flexural resistance: the least of flange yield, LTB, FLB and the tension flange."""
    return least_flexure(ctx, done, FLEXURAL_KEYS, "6.10.8")


def _bearing(ctx: StationContext, st, loss, tw: float, where: str):
    return aashto_stiffener.bearing_resistance(
        st.engine,
        Fys=ctx.material.Fy,
        tw=tw,
        bf=bottom_flange(ctx, "built")[0],
        clip=st.clip,
        loss=loss,
        phi_b=ctx.f("phi_bs"),
        where=where,
    )


def _column(ctx: StationContext, st, loss, tw: float, where: str):
    return aashto_stiffener.axial_resistance(
        st.engine,
        Fys=ctx.material.Fy,
        E=ctx.material.E,
        D=ctx.D,
        tw=tw,
        connection=st.record.connection,
        loss=loss,
        phi_c=ctx.f("phi_ax"),
        where=where,
    )


def _web(ctx: StationContext, sup, had: bool) -> list[LimitState]:
    return web_at_bearing(ctx, sup, "aashto", ctx.f("phi_wy"), ctx.f("phi_w"), had)


def girder_end_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Bearing stiffeners (6.10.11.2.3, 6.10.11.2.4) at the supports this station takes;
    without an effective stiffener, web local yielding and crippling (D6.5.2, D6.5.3)."""
    return girder_ends(ctx, _bearing, _column, _web)


def stiffener_check(defn, web, D: float, material):
    """6.10.11.1 for the intermediate stiffeners of a member (see :mod:`core.assess.panels`)."""
    bf = max(
        defn.part(i).bounds[2] - defn.part(i).bounds[0] for i in web.top_parts + web.bottom_parts
    )

    def check(st, loss, tw, do, state):
        return intermediate_stiffener.aashto(
            st.engine,
            Fyw=material.Fy,
            Fys=material.Fy,
            E=material.E,
            D=D,
            tw=tw,
            do=do,
            bf=bf,
            loss=loss,
            where=f"stiffener {st.id!r} ({state})",
        )

    return check


#: the fatigue truck of LRFD 3.6.1.4.1 (from memory): 8, 32, 32 kip at 14 ft and 30 ft
FATIGUE_P = (8.0 * KIP, 32.0 * KIP, 32.0 * KIP)
FATIGUE_X = (0.0, 14.0 * FT, 44.0 * FT)


def fatigue_states(ctx: StationContext, done: tuple = ()) -> list[LimitState]:
    """Fatigue of the riveted detail at the net section of the tension flange (Category D,
    MBE 7.2), where the member's truck traffic and the year built are recorded."""
    s = ctx.setup
    if s is None or s.details.ADTT_SL is None or s.age is None:
        return []
    truck = AxleTrain(
        "fatigue truck", "other", FATIGUE_P, FATIGUE_X, ctx.f("IM_fat"), unit="ft", scale=FT
    )
    g = ctx.member["g"].value / s.multiple_presence
    M = model_moment(ctx, "fatigue truck", truck) * g
    n = aashto_fatigue.cycles_per_truck(ctx.span, where=ctx.where)

    def life(label, df):
        return aashto_fatigue.remaining_life(
            delta_f=df,
            ADTT_SL=s.details.ADTT_SL,
            age=s.age,
            n=n,
            Rs=ctx.f("Rs"),
            Rr=ctx.f("Rr"),
            where=f"{ctx.where} / fatigue ({label})",
        )

    words = (
        f"fatigue truck (8, 32, 32 kip at 14 and 30 ft) x (1 + {ctx.f('IM_fat'):g}) x g "
        f"{g:.3g} (no multiple presence); (ADTT)SL {s.details.ADTT_SL:g}, {n:g} cycle(s) a "
        f"truck, age {s.age:.0f} years"
    )
    Rs = ctx.f("Rs")
    return fatigue_state(ctx, M, life, lambda df: Rs * df, words)


def girder_notes() -> list[Choice]:
    """The AASHTO family's own bases of its girder limit states, for the assumptions page."""
    return [
        Choice(
            "lateral-torsional buckling with U-frames",
            "Lb = the chord's effective length pi sqrt(E I / Ncr) on the frames, Cb = 1",
            _lrfd("6.14.2.9, by analogy (the half-through truss chord)"),
        ),
        Choice(
            "web bend-buckling",
            "Fcrw shown as the moment Fcrw Sxc; a service and constructibility limit, not rated; "
            "the strength limit states take the web through Rb",
            _lrfd("6.10.1.9.1, 6.10.4.2.2"),
        ),
        Choice(
            "bearing stiffeners riveted to the web",
            "the stiffener elements only, no web strip",
            _lrfd("6.10.11.2.4b"),
        ),
        Choice(
            "fatigue",
            "fatigue truck 8, 32, 32 kip at 14 and 30 ft with its dynamic allowance, the "
            "distribution without multiple presence; Category D at the net section of the "
            "tension flange; infinite life where 2.0 (Delta f)eff <= (Delta F)TH, else the "
            "remaining life; not checked without (ADTT)SL and the year built",
            _lrfd("3.6.1.4, 3.6.1.1.2, Table 6.6.1.2.3-1") + "; " + _mbe("7.2"),
        ),
    ]
