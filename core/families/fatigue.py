"""The fatigue limit state row every family with a fatigue clause shares: the stress range
at the riveted detail of the tension flange (net section, holes out) from the family's
fatigue load, as-built and as-found, the family's life check, and its flag.

Fatigue is not rated with the family's strength measure: the row shows the stress range the
detail takes for an infinite life against the effective (or design) stress range found, and
the flag says whether the life is infinite, and else the estimated remaining life.
"""

from __future__ import annotations

from collections.abc import Callable

from core.assess.results import LimitState
from core.checks.fatigue import FatigueResult
from core.checks.flags import Flag, Level
from core.families.context import StationContext

Life = Callable[[str, float], FatigueResult]


def fatigue_state(
    ctx: StationContext,
    M: float,
    life: Life,
    demand: Callable[[float], float],
    words: str,
) -> list[LimitState]:
    """The fatigue row of a station.

    Args:
        M: the fatigue load's moment range at the station (N mm, with its distribution).
        life: ``life(label, stress range)`` the family's check for one state.
        demand: the stress range compared with the result's resistance, from the range
            (the effective range Rs Delta f, or gamma_Ff Delta sigma_E,2).
        words: what the load and the traffic are, for the note.
    """
    out = {}
    for label, st in (("built", ctx.built), ("found", ctx.found)):
        p = st.net.props
        S = p.S_bot if ctx.compression == "top" else p.S_top
        ds = M / S
        out[label] = (ds, life(label, ds))
    (db, rb), (dfound, rf) = out["built"], out["found"]
    dem = demand(dfound)
    ratio = dem / rf.Rr if rf.Rr > 0 else float("inf")
    subj = f"{ctx.where} / fatigue (riveted detail)"
    if rf.infinite_life:
        flag = Flag(
            Level.OK,
            subj,
            f"{Level.OK.label}: stress range / infinite-life limit {ratio:.3g} is at or below 1: "
            "infinite fatigue life",
            ratio,
            1.0,
        )
        life_words = "infinite life"
    else:
        rem = rf.remaining_life or 0.0
        lv = Level.URGENT if rem <= 0.0 else Level.REVIEW
        left = (
            f"remaining {rem:.0f} years"
            if rem > 0
            else "the estimated life is spent: inspect the riveted details for cracks and "
            "refine the traffic data"
        )
        flag = Flag(
            lv,
            subj,
            f"{lv.label}: stress range / infinite-life limit {ratio:.3g} is above 1: finite "
            f"fatigue life, estimated total {rf.total_life:.0f} years, {left}",
            rem,
            0.0,
        )
        life_words = f"finite life: total {rf.total_life:.0f} years, {left}"
    extra = {
        "infinite_life": rf.infinite_life,
        "total_life_years": rf.total_life,
        "remaining_life_years": rf.remaining_life,
        "stress_range_built_MPa": db,
        "stress_range_found_MPa": dfound,
        "infinite_life_as_built": rb.infinite_life,
    }
    ls = LimitState(
        "fatigue",
        "fatigue (riveted detail)",
        "stress",
        rb,
        rf,
        rb.Rr,
        rf.Rr,
        demand=dem,
        note=f"net section of the tension flange at its rivets; {words}; {life_words}",
        flags=(flag,),
        extra=extra,
    )
    return [ls]
