"""One station evaluated again through the engine with its regions' thicknesses moved.

A region's readings move together by a delta (mm): its mean, minimum, the value used for
A, I, Q and the local minimum all move, each still capped at nominal and kept above 5 % of
nominal (a thinner draw would be a perforation, which readings do not describe). The web's
whole-part readings also move the panel's representative web thickness (the other
stations' readings of a stiffened panel stay). The as-found section, the local loss and the
station's limit states are found again by the engine, rated with the station's own loads and
factors. The per-run cache keeps what is as-built or member-wide (a U-frame chord taken at the
member's weakest as-found station is held); what it holds for this station as found is
found again.
"""

from __future__ import annotations

from collections.abc import Hashable, Mapping
from dataclasses import replace

from core.assess.probe import StationRun
from core.assess.results import LimitState
from core.assess.station import panel_thickness
from core.section import analyse
from core.survey.readings import station_loss

FLOOR = 0.05  # of nominal: the least thickness a moved region keeps


def quantity_keys(ls: LimitState) -> tuple[str, str]:
    """The names of a limit state's capacity and measure quantities."""
    return f"{ls.key}|C", f"{ls.key}|m"


def quantities(states: tuple[LimitState, ...] | list[LimitState]) -> dict[str, float]:
    """Every as-found factored capacity (unit of its kind) and measure of the limit states."""
    out = {}
    for ls in states:
        c, m = quantity_keys(ls)
        if ls.C_found is not None:
            out[c] = float(ls.C_found)
        if ls.rating is not None:
            out[m] = float(ls.rating.value)
    return out


def higher_is_better(states) -> dict[str, bool | None]:
    """For each quantity: a measure's good side (True: up), None for a capacity."""
    out: dict[str, bool | None] = {}
    for ls in states:
        c, m = quantity_keys(ls)
        out[c] = None
        if ls.rating is not None:
            out[m] = ls.rating.higher_is_better
    return out


def governing(states) -> LimitState | None:
    """The governing limit state, as :attr:`StationResult.governing` finds it."""
    whole = [ls for ls in states if ls.part_of is None]
    rated = [ls for ls in whole if ls.rating is not None]
    if rated:
        return min(rated, key=lambda ls: ls.rating.badness)
    ratioed = [ls for ls in whole if ls.ratio is not None]
    return min(ratioed, key=lambda ls: ls.ratio) if ratioed else None


class StationEvaluator:
    """``evaluate(deltas)`` of one assessed station (see the module docstring); counts its
    engine evaluations in ``runs``."""

    def __init__(self, run: StationRun) -> None:
        self.run = run
        ctx = run.ctx
        sid = ctx.station
        # what the run cached for this station as found is found again each time
        self._cache = {
            k: v
            for k, v in ctx.cache.items()
            if not (isinstance(k, tuple) and len(k) > 1 and k[1] == sid)
        }
        self._by_key = {(s.part, s.region): s for s in run.stats}
        self.base = quantities(run.states)
        self.higher = higher_is_better(run.states)
        self.runs = 0

    def regions(self) -> list[tuple[str, str | None]]:
        """The part regions read at the station."""
        return list(self._by_key)

    def evaluate(self, deltas: Mapping[Hashable, float]) -> dict[str, float]:
        """The quantities with each region ``deltas[(part, region)]`` mm thicker."""
        run = self.run
        ctx = run.ctx
        self.runs += 1
        if not deltas:
            return dict(self.base)
        stats = []
        for s in run.stats:
            d = deltas.get((s.part, s.region), 0.0)
            if d:
                lo = FLOOR * s.t_nominal
                # the mean used is of the readings each capped at nominal (see
                # core.survey.readings): moved from it, so that d = 0 gives today's value
                used, mn = max(s.t_mean_capped + d, lo), max(s.t_min + d, lo)
                chosen = used if s.policy == "mean" else mn
                s = replace(
                    s,
                    t_mean=max(s.t_mean + d, lo),
                    t_mean_capped=used,
                    t_min=mn,
                    t_used=min(chosen, s.t_nominal),
                    t_local=min(mn, s.t_nominal),
                )
            stats.append(s)
        st, m = run.station, run.member
        loss = station_loss(st, m, run.policy, stats)
        local = station_loss(st, m, "minimum", stats)
        tw, words = ctx.tw_panel, ctx.tw_words
        d_web = deltas.get((ctx.web.web_id, None), 0.0)
        if d_web and run.web_readings.get(st.id, (0, []))[1]:
            moved = dict(run.web_readings)
            x, own = moved[st.id]
            lo = FLOOR * run.t_web_nominal
            moved[st.id] = (x, [max(v + d_web, lo) for v in own])
            tw, words = panel_thickness(
                st.id, moved, run.t_web_nominal, run.panel, run.policy, run.same_panel
            )
        again = replace(
            ctx,
            found=analyse(ctx.defn, loss),
            loss_local=local,
            tw_panel=tw,
            tw_words=words,
            cache=dict(self._cache),
        )
        return quantities(run.rerate(again))
