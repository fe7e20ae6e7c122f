"""Load effects at a station: dead loads and the envelope of every live load case.

Sources of the effects, in order: the station's own loads (the engineer's numbers), else the
member's simple-span dead loads and the family's live load cases moved over the span by
influence lines (:mod:`core.loads`). Live effects are magnitudes in the sense of the
resistance: the sagging moment, and the shear of the dead-load shear's sense (the larger of
the two senses where the dead shear is zero). Units N, N*mm.
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field

from core.errors import InputError
from core.loads.influence import favourable_area
from core.loads.models import EnvelopeValue, LiveEnvelope, Part
from core.survey.model import Member, Station


@dataclass(frozen=True)
class LiveCase:
    """One live load case of a member: a model moved over the span, times ``g``.

    Attributes:
        key: stable id (``"hl93"``, ``"vehicle:Type 3"``, ``"lm71"``, ``"station"``).
        title: in words. role: ``"design"``, ``"legal"``, ``"permit"`` or ``"other"``.
        model: an object with ``envelope(L, x)`` and ``envelopes(L, xs)``, or None for the
            station loads.
        g: distribution factor applied. weight: gross weight (N) of a vehicle, for posting.
    """

    key: str
    title: str
    role: str
    model: object | None
    g: float = 1.0
    weight: float | None = None


@dataclass(frozen=True)
class StationEffects:
    """Unfactored effects at a station: dead (signed shear) and live envelopes per case."""

    x: float
    M_DC: float
    V_DC: float
    M_DW: float
    V_DW: float
    live: Mapping[str, LiveEnvelope] = field(default_factory=dict)
    source: str = ""

    def dead(self, effect: str) -> tuple[float, float]:
        """(DC, DW) magnitudes of the moment (``"M"``) or the shear (``"V"``)."""
        if effect == "M":
            return abs(self.M_DC), abs(self.M_DW)
        return abs(self.V_DC), abs(self.V_DW)

    def live_value(self, case: str, effect: str) -> float:
        """Live effect of ``case`` (>= 0): sagging moment, or the shear of the dead-load sense."""
        env = self.live.get(case)
        if env is None:
            return 0.0
        if effect == "M":
            return max(env.M.value, 0.0)
        return self.live_shear(env).value

    def live_shear(self, env: LiveEnvelope) -> EnvelopeValue:
        """The shear envelope value of the dead-load sense (as a magnitude)."""
        V_dead = self.V_DC + self.V_DW
        pos, neg = env.V_pos, env.V_neg
        if V_dead > 0.0 or (V_dead == 0.0 and pos.value >= -neg.value):
            return pos
        return EnvelopeValue(-neg.value, tuple(Part(p.what, -p.value, p.at) for p in neg.parts))

    def placement(self, case: str, effect: str) -> str:
        env = self.live.get(case)
        if env is None:
            return ""
        return env.M.at if effect == "M" else self.live_shear(env).at


def station_loads(member: Member, station: Station) -> StationEffects | None:
    """Effects from the station's own loads (None when it has none).

    Raises:
        InputError / UnitError: loads of the wrong unit, or dead loads of opposite sense.
    """
    if station.loads is None:
        return None
    place = member.place(station.id)
    L = station.loads
    vals: dict[str, float] = {}
    for key, kind in (("V", "force"), ("M", "moment")):
        signed = {}
        for name, eff in (("DC", L.DC), ("DW", L.DW), ("LL", L.LL_IM)):
            q = getattr(eff, key) if eff is not None else None
            signed[name] = (
                0.0 if q is None else q.to(kind, f"{place} / loads / {name} / {key}"),
                q,
            )
        signs = {(v > 0) for n, (v, _) in signed.items() if v != 0.0 and n != "LL"}
        if len(signs) > 1:
            shown = ", ".join(
                f"{n} {key} = {q.value:g} {q.unit}" for n, (v, q) in signed.items() if q is not None
            )
            raise InputError(
                f"load effects of opposite sign ({shown}); give the dead load effects of one "
                "sense and the live load envelope value that adds to them",
                where=place,
            )
        for name, (v, _) in signed.items():
            vals[f"{key}_{name}"] = v
    sense = 1.0 if vals["V_DC"] + vals["V_DW"] >= 0.0 else -1.0
    VL, ML = abs(vals["V_LL"]), abs(vals["M_LL"])
    words = "as given at the station"
    env = LiveEnvelope(
        "station",
        station.position,
        EnvelopeValue(ML, (Part("station live load with dynamic allowance", ML, words),)),
        EnvelopeValue(VL if sense > 0 else 0.0, (Part("station live load", VL, words),)),
        EnvelopeValue(-VL if sense < 0 else 0.0, (Part("station live load", -VL, words),)),
    )
    return StationEffects(
        x=0.0,
        M_DC=vals["M_DC"],
        V_DC=vals["V_DC"],
        M_DW=vals["M_DW"],
        V_DW=vals["V_DW"],
        live={"station": env},
        source="engineer's input (station loads)",
    )


def dead_loads(member: Member, span: float, x: float) -> tuple[float, float, float, float]:
    """(M_DC, V_DC, M_DW, V_DW) of the member's uniform dead loads at x (zeros without any)."""
    ss = member.simple_span
    if ss is None:
        return 0.0, 0.0, 0.0, 0.0
    w_dc = ss.dc.to("force_per_length", f"{member.place()} / simple_span / dc")
    w_dw = ss.dw.to("force_per_length", f"{member.place()} / simple_span / dw") if ss.dw else 0.0
    if w_dc < 0.0 or w_dw < 0.0:
        raise InputError(
            "uniform dead loads must be 0 or more (downward)",
            where=f"{member.place()} / simple_span",
        )
    M = favourable_area("M", span, x)
    V = span / 2.0 - x
    return w_dc * M, w_dc * V, w_dw * M, w_dw * V


#: live envelopes of the cases at many positions, found at once: x -> case key -> envelope
#: (the distribution factor applied)
LiveTable = Mapping[float, Mapping[str, LiveEnvelope]]


def live_table(cases: list[LiveCase], span: float, xs: Sequence[float]) -> LiveTable:
    """The live envelope of every moving case at every position of ``xs`` (mm), each model
    moved over all of them in one pass (:meth:`envelopes`); the same values as one
    position at a time. A position outside the span is left out (found alone, where its
    error is raised in its turn)."""
    xs = [x for x in dict.fromkeys(xs) if 0.0 <= x <= span]
    out: dict[float, dict[str, LiveEnvelope]] = {x: {} for x in xs}
    for c in cases:
        if c.model is None:
            continue
        for x, env in zip(xs, c.model.envelopes(span, xs), strict=True):  # type: ignore[attr-defined]
            out[x][c.key] = env.scaled(c.g)
    return out


def _live(c: LiveCase, span: float, x: float, table: LiveTable | None) -> LiveEnvelope:
    row = table.get(x) if table is not None else None
    if row is not None and c.key in row:
        return row[c.key]
    return c.model.envelope(span, x).scaled(c.g)  # type: ignore[attr-defined]


def station_effects(
    member: Member,
    station: Station,
    x: float,
    span: float,
    cases: list[LiveCase],
    table: LiveTable | None = None,
) -> StationEffects | None:
    """Effects at ``station`` (x mm from the member's start): its own loads, else the
    member's dead loads and its live cases; None when there is nothing to rate with.
    ``table``: the live envelopes already found at once (:func:`live_table`).

    Raises:
        InputError / UnitError: unusable loads, with their place.
    """
    own = station_loads(member, station)
    if own is not None:
        moving = {
            c.key: _live(c, span, x, table)
            for c in cases
            if c.model is not None and c.role != "design"
        }
        return StationEffects(
            x, own.M_DC, own.V_DC, own.M_DW, own.V_DW, {**own.live, **moving}, own.source
        )
    return effects_at(member, x, span, cases, table)


def effects_at(
    member: Member,
    x: float,
    span: float,
    cases: list[LiveCase],
    table: LiveTable | None = None,
) -> StationEffects | None:
    """Effects at ``x`` (mm) from the member's uniform dead loads and its live cases moved
    over the simple span (None when there are neither): the support reactions at the ends,
    the moment diagram between the stations.

    Raises:
        InputError / UnitError: unusable loads, with their place.
    """
    if member.simple_span is None and not cases:
        return None
    M_DC, V_DC, M_DW, V_DW = dead_loads(member, span, x)
    live = {c.key: _live(c, span, x, table) for c in cases if c.model is not None}
    return StationEffects(
        x, M_DC, V_DC, M_DW, V_DW, live, "simple span: uniform dead loads and influence lines"
    )
