"""Live load models on a simple span: their envelopes at a station and what they assume.

- :class:`HL93` (AASHTO LRFD 3.6.1.2 and 3.6.1.3, 9th edition 2020; values from memory):
  design truck 8, 32, 32 kip at 14 ft and a rear spacing variable from 14 to 30 ft; design
  tandem 25 + 25 kip at 4 ft; design lane load 0.64 kip/ft over the favourable stretch. The
  larger of truck and tandem, times (1 + IM) with IM = 33 % (3.6.2.1, on the truck and the
  tandem only), plus the lane load.
- :class:`AxleTrain`: a vehicle given by the engineer (legal, permit, crane, other) as axles
  and spacings, with its own dynamic allowance.
- :class:`LM71` (EN 1991-2:2003 6.3.2 and 6.4.5.2; from memory): four 250 kN axles at 1.6 m
  and 80 kN/m beyond 0.8 m from the outer axles wherever unfavourable, times the
  classification factor alpha and the dynamic factor Phi2 (carefully maintained track) or
  Phi3 (standard maintenance).
- :class:`LM1` (EN 1991-2:2003 4.3.2; from memory): tandem system of two axles 1.2 m apart
  (300, 200, 100 kN per axle in lanes 1, 2, 3) and uniform load 9 kN/m² on lane 1, 2.5 kN/m²
  on the others, notional lanes 3 m wide; dynamic amplification is included in its values.

The distribution factor (the share of one lane, track or vehicle that the girder carries) is
applied by the caller, except for LM1 with explicit lane shares. Units N, mm (N/mm).
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass, field
from typing import Literal

from core.errors import InputError
from core.loads.influence import (
    EFFECTS,
    Effect,
    Extreme,
    Placement,
    Train,
    envelope_many,
    envelope_variable_many,
    favourable_area,
)
from core.units import to_internal

KIP = to_internal(1.0, "kip", "force")
FT = to_internal(1.0, "ft", "length")
KIP_PER_FT = to_internal(1.0, "kip/ft", "force_per_length")
KN = 1000.0
M = 1000.0

VehicleKind = Literal["legal", "permit", "crane", "other"]
VEHICLE_KINDS: tuple[str, ...] = ("legal", "permit", "crane", "other")


@dataclass(frozen=True)
class Part:
    """One component of an envelope value: what it is, its value (N or N*mm, factors
    included) and where it stands."""

    what: str
    value: float
    at: str


@dataclass(frozen=True)
class EnvelopeValue:
    """One envelope value of a model at a station, with its parts."""

    value: float
    parts: tuple[Part, ...]

    @property
    def at(self) -> str:
        """Where the loads stand, in words."""
        return "; ".join(f"{p.what}: {p.at}" for p in self.parts if p.at)


@dataclass(frozen=True)
class LiveEnvelope:
    """Envelope of one load model at station ``x``: sagging moment (N*mm), largest positive
    and most negative shear (N), each with its parts and placement; dynamic factors
    included, distribution not."""

    model: str
    x: float
    M: EnvelopeValue
    V_pos: EnvelopeValue
    V_neg: EnvelopeValue

    def of(self, effect: Effect) -> EnvelopeValue:
        return {"M": self.M, "V+": self.V_pos, "V-": self.V_neg}[effect]

    def scaled(self, g: float) -> LiveEnvelope:
        """The same envelope times ``g`` (the distribution factor)."""

        def sc(e: EnvelopeValue) -> EnvelopeValue:
            return EnvelopeValue(
                g * e.value, tuple(Part(p.what, g * p.value, p.at) for p in e.parts)
            )

        return LiveEnvelope(self.model, self.x, sc(self.M), sc(self.V_pos), sc(self.V_neg))


def _combine(key: str, xs: Sequence[float], cols: list[list[EnvelopeValue]]) -> list[LiveEnvelope]:
    """The envelopes of the stations ``xs`` from the columns M, V+ and V- (one value each)."""
    return [LiveEnvelope(key, x, m, vp, vn) for x, m, vp, vn in zip(xs, *cols, strict=True)]


def _where(e: Extreme, unit: str, scale: float) -> str:
    return "no load on the span" if e.at is None else e.at.words(unit, scale)


def _lane_at(effect: Effect) -> str:
    return {
        "M": "over the whole span",
        "V+": "from the station to the right support",
        "V-": "from the left support to the station",
    }[effect]


@dataclass(frozen=True)
class AssumptionLine:
    """One line for the assumptions page: item, value, source."""

    item: str
    value: str
    source: str


@dataclass(frozen=True)
class HL93:
    """The HL-93 design live load (AASHTO LRFD 3.6.1.2, 3.6.1.3; IM 3.6.2.1)."""

    IM: float = 0.33
    key: str = "hl93"
    unit: str = "ft"

    title = "HL-93 design live load"
    SOURCE = "AASHTO LRFD 9th edition (2020), 3.6.1.2 and 3.6.1.3 (from memory)"

    def __post_init__(self) -> None:
        if not 0.0 <= self.IM <= 1.0:
            raise InputError(f"IM = {self.IM!r} is outside 0 to 1")

    truck_P = (8.0 * KIP, 32.0 * KIP, 32.0 * KIP)
    truck_offsets = (0.0, 14.0 * FT, 28.0 * FT)
    tandem_P = (25.0 * KIP, 25.0 * KIP)
    tandem_offsets = (0.0, 4.0 * FT)
    lane_w = 0.64 * KIP_PER_FT

    def _many(self, effect: Effect, L: float, xs: Sequence[float]) -> list[EnvelopeValue]:
        trucks = envelope_variable_many(
            effect, L, xs, self.truck_P, self.truck_offsets, 2, 14.0 * FT, 30.0 * FT
        )
        tandems = envelope_many(effect, L, xs, Train(self.tandem_P, self.tandem_offsets))
        sign = -1.0 if effect == "V-" else 1.0
        f = 1.0 + self.IM
        out = []
        for x, truck, tandem in zip(xs, trucks, tandems, strict=True):
            use, name = (
                (truck, "design truck")
                if sign * truck.value >= sign * tandem.value
                else (
                    tandem,
                    "design tandem",
                )
            )
            lane = self.lane_w * favourable_area(effect, L, x)
            parts = (
                Part(f"{name} x (1 + IM) = {f:.2f}", f * use.value, _where(use, self.unit, FT)),
                Part("design lane load 0.64 kip/ft (no IM)", lane, _lane_at(effect)),
            )
            out.append(EnvelopeValue(f * use.value + lane, parts))
        return out

    def envelopes(self, L: float, xs: Sequence[float]) -> list[LiveEnvelope]:
        """:meth:`envelope` at every station of ``xs`` at once."""
        return _combine(self.key, xs, [self._many(e, L, xs) for e in EFFECTS])

    def envelope(self, L: float, x: float) -> LiveEnvelope:
        return self.envelopes(L, [x])[0]

    def assumptions(self) -> list[AssumptionLine]:
        return [
            AssumptionLine(
                "live load model",
                "HL-93: design truck 8 + 32 + 32 kip, 14 ft and a rear spacing from 14 to "
                "30 ft (the spacing that gives the extreme); design tandem 25 + 25 kip at 4 ft; "
                "design lane load 0.64 kip/ft over the favourable part of each influence line",
                self.SOURCE,
            ),
            AssumptionLine(
                "dynamic load allowance IM",
                f"{100 * self.IM:g} % on the design truck and tandem only, not on the lane load",
                "AASHTO LRFD 9th edition (2020), 3.6.2.1 (from memory)"
                if self.IM == 0.33
                else "engineer's input",
            ),
        ]


@dataclass(frozen=True)
class AxleTrain:
    """A vehicle given as axle loads (N) and offsets from the first axle (mm)."""

    name: str
    kind: VehicleKind
    P: tuple[float, ...]
    offsets: tuple[float, ...]
    IM: float = 0.0
    unit: str = "m"
    scale: float = M
    key: str = field(default="vehicle")

    def __post_init__(self) -> None:
        if self.kind not in VEHICLE_KINDS:
            raise InputError(f"vehicle kind {self.kind!r} is not one of {list(VEHICLE_KINDS)}")
        if not 0.0 <= self.IM <= 1.0:
            raise InputError(f"dynamic allowance {self.IM!r} of {self.name!r} is outside 0 to 1")
        Train(self.P, self.offsets)  # validates

    @property
    def title(self) -> str:
        return self.name

    @property
    def weight(self) -> float:
        """Gross weight, N."""
        return sum(self.P)

    def moments(self, L: float, xs: Sequence[float]) -> list[float]:
        """The sagging moment of :meth:`envelope` alone (N*mm) at every station of ``xs``:
        ``envelope(L, x).M.value`` without the shears (what fatigue needs)."""
        t = Train(self.P, self.offsets)
        return [(1.0 + self.IM) * e.value for e in envelope_many("M", L, xs, t)]

    def moment(self, L: float, x: float) -> float:
        """:meth:`moments` at one station."""
        return self.moments(L, [x])[0]

    def envelopes(self, L: float, xs: Sequence[float]) -> list[LiveEnvelope]:
        """:meth:`envelope` at every station of ``xs`` at once."""
        t = Train(self.P, self.offsets)
        f = 1.0 + self.IM
        what = f"{self.name} x (1 + {self.IM:g})" if self.IM else self.name
        cols = []
        for e in EFFECTS:
            cols.append(
                [
                    EnvelopeValue(
                        f * ex.value, (Part(what, f * ex.value, _where(ex, self.unit, self.scale)),)
                    )
                    for ex in envelope_many(e, L, xs, t)
                ]
            )
        return _combine(self.key, xs, cols)

    def envelope(self, L: float, x: float) -> LiveEnvelope:
        return self.envelopes(L, [x])[0]

    def assumptions(self) -> list[AssumptionLine]:
        axles = ", ".join(f"{p / (KIP if self.unit == 'ft' else KN):.4g}" for p in self.P)
        u = "kip" if self.unit == "ft" else "kN"
        sp = ", ".join(
            f"{(b - a) / self.scale:.4g}"
            for a, b in zip(self.offsets, self.offsets[1:], strict=False)
        )
        return [
            AssumptionLine(
                f"vehicle '{self.name}' ({self.kind})",
                f"axles {axles} {u}; spacings {sp or '-'} {self.unit}; dynamic allowance "
                f"{100 * self.IM:g} %",
                "engineer's input",
            )
        ]


def phi_dynamic(L_phi: float, maintenance: Literal["careful", "standard"]) -> tuple[float, str]:
    """Dynamic factor of EN 1991-2 6.4.5.2 for a determinant length ``L_phi`` (mm).

    Phi2 = 1.44 / (sqrt(L_phi) - 0.2) + 0.82, 1.00 <= Phi2 <= 1.67 (carefully maintained track);
    Phi3 = 2.16 / (sqrt(L_phi) - 0.2) + 0.73, 1.00 <= Phi3 <= 2.00 (standard maintenance);
    L_phi in m (EN 1991-2:2003 Eq. 6.4 and 6.5, from memory).

    Raises:
        InputError: L_phi not positive or an unknown maintenance standard.
    """
    if not L_phi > 0.0:
        raise InputError(f"determinant length L_phi = {L_phi:g} mm must be positive")
    Lm = L_phi / M
    root = math.sqrt(Lm) - 0.2
    if maintenance == "careful":
        raw = 1.44 / root + 0.82 if root > 0 else 1.67
        return min(max(raw, 1.0), 1.67), "Phi2"
    if maintenance == "standard":
        raw = 2.16 / root + 0.73 if root > 0 else 2.0
        return min(max(raw, 1.0), 2.0), "Phi3"
    raise InputError(f"track maintenance {maintenance!r} is not 'careful' or 'standard'")


@dataclass(frozen=True)
class LM71:
    """EN 1991-2 Load Model 71 on one track, times alpha and Phi.

    Attributes:
        alpha: classification factor (6.3.2(3): 0.75 to 1.46).
        maintenance: ``"careful"`` (Phi2) or ``"standard"`` (Phi3, the larger).
        L_phi: determinant length, mm (Table 6.2: the span for a simply supported main
            girder); ``None`` takes the span.
    """

    alpha: float = 1.0
    maintenance: Literal["careful", "standard"] = "standard"
    L_phi: float | None = None
    key: str = "lm71"

    title = "EN 1991-2 Load Model 71"
    SOURCE = "EN 1991-2:2003 6.3.2 (from memory)"
    ALPHAS = (0.75, 0.83, 0.91, 1.00, 1.10, 1.21, 1.33, 1.46)

    def __post_init__(self) -> None:
        if not 0.75 - 1e-9 <= self.alpha <= 1.46 + 1e-9:
            raise InputError(f"alpha = {self.alpha!r} is outside 0.75 to 1.46 (EN 1991-2 6.3.2(3))")
        phi_dynamic(1.0, self.maintenance)

    def phi(self, L: float) -> tuple[float, str]:
        return phi_dynamic(self.L_phi or L, self.maintenance)

    @staticmethod
    def train() -> Train:
        """Four 250 kN axles at 1.6 m, 80 kN/m beyond 0.8 m on either side."""
        return Train(
            (250.0 * KN,) * 4,
            (0.0, 1.6 * M, 3.2 * M, 4.8 * M),
            q_around=80.0 * KN / M,
            gap_before=0.8 * M,
            gap_after=0.8 * M,
        )

    def moments(self, L: float, xs: Sequence[float]) -> list[float]:
        """The sagging moment of :meth:`envelope` alone (N*mm) at every station of ``xs``:
        ``envelope(L, x).M.value`` without the shears (what fatigue needs)."""
        Phi, _name = self.phi(L)
        return [self.alpha * Phi * e.value for e in envelope_many("M", L, xs, self.train())]

    def moment(self, L: float, x: float) -> float:
        """:meth:`moments` at one station."""
        return self.moments(L, [x])[0]

    def envelopes(self, L: float, xs: Sequence[float]) -> list[LiveEnvelope]:
        """:meth:`envelope` at every station of ``xs`` at once."""
        Phi, name = self.phi(L)
        t = self.train()
        f = self.alpha * Phi
        what = f"LM71 x alpha {self.alpha:g} x {name} {Phi:.3f}"
        cols = []
        for e in EFFECTS:
            cols.append(
                [
                    EnvelopeValue(
                        f * ex.value,
                        (
                            Part(
                                what,
                                f * ex.value,
                                _where(ex, "m", M) + "; 80 kN/m where unfavourable beyond 0.8 m",
                            ),
                        ),
                    )
                    for ex in envelope_many(e, L, xs, t)
                ]
            )
        return _combine(self.key, xs, cols)

    def envelope(self, L: float, x: float) -> LiveEnvelope:
        return self.envelopes(L, [x])[0]

    def assumptions(self, L: float) -> list[AssumptionLine]:
        Phi, name = self.phi(L)
        Lp = (self.L_phi or L) / M
        eq = "6.4" if name == "Phi2" else "6.5"
        return [
            AssumptionLine(
                "live load model",
                "LM71 on one track: four 250 kN axles at 1.6 m, 80 kN/m wherever unfavourable "
                "beyond 0.8 m from the outer axles; axles as point loads (no distribution by rails "
                "and sleepers, 6.3.6: conservative)",
                self.SOURCE,
            ),
            AssumptionLine(
                "classification factor alpha",
                f"{self.alpha:g}",
                "EN 1991-2:2003 6.3.2(3) (from memory); value for the line: owner / engineer to "
                "confirm",
            ),
            AssumptionLine(
                f"dynamic factor {name}",
                f"{Phi:.3f} for L_phi = {Lp:.4g} m ("
                + ("carefully maintained track" if name == "Phi2" else "standard maintenance")
                + ")",
                f"EN 1991-2:2003 6.4.5.2, Eq. {eq}; L_phi per Table 6.2 (from memory)",
            ),
        ]


@dataclass(frozen=True)
class LM1:
    """EN 1991-2 Load Model 1 on notional lanes; ``lane_shares`` are the girder's share of
    each lane (lane 1 first); ``None``: lane 1 only, with the distribution applied by the
    caller."""

    lane_shares: tuple[float, ...] | None = None
    alpha_Q: float = 1.0
    alpha_q: float = 1.0
    key: str = "lm1"

    title = "EN 1991-2 Load Model 1"
    SOURCE = "EN 1991-2:2003 4.3.2, Table 4.2 (from memory)"
    Q = (300.0 * KN, 200.0 * KN, 100.0 * KN)
    q = (9.0e-3 * 3.0 * M, 2.5e-3 * 3.0 * M)  # N/mm: 9 kN/m² and 2.5 kN/m² over 3 m

    def __post_init__(self) -> None:
        shares = self.lane_shares
        if shares is not None and (
            not 1 <= len(shares) <= 6 or any(not 0.0 <= s <= 2.0 for s in shares)
        ):
            raise InputError(f"lane shares {self.lane_shares} must be 1 to 6 values in 0 to 2")

    def envelopes(self, L: float, xs: Sequence[float]) -> list[LiveEnvelope]:
        """:meth:`envelope` at every station of ``xs`` at once."""
        shares = self.lane_shares or (1.0,)
        ts = Train((1.0, 1.0), (0.0, 1.2 * M))
        kQ = sum(s * (self.Q[i] if i < 3 else 0.0) for i, s in enumerate(shares)) * self.alpha_Q
        kq = sum(s * (self.q[0] if i == 0 else self.q[1]) for i, s in enumerate(shares))
        kq *= self.alpha_q
        cols = []
        for e in EFFECTS:
            col = []
            for x, ex in zip(xs, envelope_many(e, L, xs, ts), strict=True):
                udl = kq * favourable_area(e, L, x)
                col.append(
                    EnvelopeValue(
                        kQ * ex.value + udl,
                        (
                            Part("LM1 tandem systems", kQ * ex.value, _where(ex, "m", M)),
                            Part("LM1 uniform loads", udl, _lane_at(e)),
                        ),
                    )
                )
            cols.append(col)
        return _combine(self.key, xs, cols)

    def envelope(self, L: float, x: float) -> LiveEnvelope:
        return self.envelopes(L, [x])[0]

    def assumptions(self) -> list[AssumptionLine]:
        shares = self.lane_shares
        return [
            AssumptionLine(
                "live load model",
                "LM1: tandem systems 2 axles 1.2 m apart (300 / 200 / 100 kN per axle in lanes "
                "1 / 2 / 3), uniform loads 9 kN/m² on lane 1 and 2.5 kN/m² elsewhere, lanes 3 m "
                "wide; dynamic amplification included in the values",
                self.SOURCE,
            ),
            AssumptionLine(
                "adjustment factors alpha_Q, alpha_q",
                f"{self.alpha_Q:g}, {self.alpha_q:g}",
                "EN 1991-2:2003 4.3.2(3) (from memory); National Annex may differ",
            ),
            AssumptionLine(
                "lanes reaching the girder",
                "lane 1 only, times the distribution factor"
                if shares is None
                else "shares per lane " + ", ".join(f"{s:g}" for s in shares),
                "engineer's input",
            ),
        ]


def placement_words(p: Placement | None, unit: str, scale: float) -> str:
    """Words for a placement (``no load on the span`` for None)."""
    return "no load on the span" if p is None else p.words(unit, scale)
