"""Load and resistance factor rating (LRFR) and load effects on a simple span.

RF = (C - gDC DC - gDW DW) / (gLL (LL + IM)), C = phi_c phi_s phi Rn, with
phi_c phi_s >= 0.85. Default factors are from memory of the AASHTO Manual for Bridge
Evaluation; they are defaults the engineer confirms and the report lists as such:
condition factor phi_c 1.00 / 0.95 / 0.85 (good / fair / poor); system factor phi_s 1.00
(riveted multi-girder superstructure); gDC = 1.25, gDW = 1.50; gLL = 1.75 (inventory),
1.35 (operating). Dynamic load allowance IM = 0.33 (AASHTO LRFD 3.6.2.1, from memory).

Load effects on a simply supported span come from influence lines: a uniform dead load w,
and a user axle train moved across the span in both directions.
"""

from __future__ import annotations

import itertools
from collections.abc import Iterator, Sequence
from dataclasses import dataclass
from typing import Literal

from core.checks._inputs import Number, internal, length
from core.checks.results import ENGINEER, CheckValue, Row
from core.errors import InputError

MBE = "AASHTO Manual for Bridge Evaluation (from memory; defaults the engineer confirms)"
CONDITION_FACTOR: dict[str, float] = {"good": 1.00, "fair": 0.95, "poor": 0.85}
LIVE_LOAD_FACTOR: dict[str, float] = {"inventory": 1.75, "operating": 1.35}
PHI_CS_FLOOR = 0.85
IM_DEFAULT = 0.33


def _factor(x: float, name: str, low: float, high: float) -> float:
    return internal(x, "dimensionless", name, where="rating factors", low=low, high=high)


@dataclass(frozen=True)
class RatingFactors:
    """Factors of the rating equation; ``None`` takes the default for level / condition.

    Raises:
        InputError: unknown level or condition, or a factor outside its range
            (phi_c and phi_s in (0, 1]; load factors in (0, 3]).
    """

    level: Literal["inventory", "operating"] = "inventory"
    condition: Literal["good", "fair", "poor"] = "good"
    phi_c: float | None = None
    phi_s: float = 1.00
    gDC: float = 1.25
    gDW: float = 1.50
    gLL: float | None = None

    def __post_init__(self) -> None:
        if self.level not in LIVE_LOAD_FACTOR:
            raise InputError(f"rating level {self.level!r} is not one of {list(LIVE_LOAD_FACTOR)}")
        if self.condition not in CONDITION_FACTOR:
            raise InputError(f"condition {self.condition!r} is not one of {list(CONDITION_FACTOR)}")
        phi_c = CONDITION_FACTOR[self.condition] if self.phi_c is None else self.phi_c
        gLL = LIVE_LOAD_FACTOR[self.level] if self.gLL is None else self.gLL
        object.__setattr__(self, "phi_c", _factor(phi_c, "phi_c", 0.0, 1.0))
        object.__setattr__(self, "phi_s", _factor(self.phi_s, "phi_s", 0.0, 1.0))
        object.__setattr__(self, "gDC", _factor(self.gDC, "gDC", 0.0, 3.0))
        object.__setattr__(self, "gDW", _factor(self.gDW, "gDW", 0.0, 3.0))
        object.__setattr__(self, "gLL", _factor(gLL, "gLL", 0.0, 3.0))

    @property
    def phi_cs(self) -> float:
        """phi_c phi_s with the 0.85 floor."""
        assert self.phi_c is not None
        return max(self.phi_c * self.phi_s, PHI_CS_FLOOR)


@dataclass(frozen=True)
class RatingResult:
    """A rating factor with its working. ``RF`` is dimensionless; ``C`` in ``kind`` units."""

    RF: float
    C: float
    kind: str
    level: str
    values: tuple[CheckValue, ...]
    notes: tuple[str, ...]

    def rows(self) -> Iterator[Row]:
        for v in self.values:
            yield v.row()
        yield ("RF", f"rating factor, {self.level}", self.RF, "dimensionless", MBE)


def rating_factor(
    *,
    phi: float,
    Rn: Number,
    DC: Number,
    LL_IM: Number,
    DW: Number = 0.0,
    factors: RatingFactors | None = None,
    kind: Literal["force", "moment"] = "force",
    where: str = "",
) -> RatingResult:
    """LRFR rating factor of one limit state at one station.

    Args:
        phi: resistance factor of the limit state. Rn: nominal resistance (N or N·mm).
        DC, DW: dead load effects of components and of wearing surface, same unit, >= 0.
        LL_IM: live load effect including the dynamic load allowance, > 0.
        factors: rating factors (default: inventory, good condition).
        kind: ``"force"`` (shear) or ``"moment"``.
        where: location for error messages.

    Raises:
        InputError: a negative load effect, LL+IM not positive, or phi / Rn out of range;
            the message names which.
    """
    if kind not in ("force", "moment"):
        raise InputError(f"kind {kind!r} is not 'force' or 'moment'", where=where)
    f = factors or RatingFactors()
    phi = internal(phi, "dimensionless", "phi", where=where, low=0.0, high=1.5)
    Rn = internal(Rn, kind, "Rn", where=where, low=0.0, low_inclusive=True)
    loads = {}
    for name, val in (("DC", DC), ("DW", DW), ("LL+IM", LL_IM)):
        v = internal(val, kind, name, where=where)
        if v < 0.0 or (name == "LL+IM" and v == 0.0):
            need = "greater than 0" if name == "LL+IM" else "0 or more"
            raise InputError(
                f"load effect {name} = {v:g} {'N' if kind == 'force' else 'N*mm'} must be "
                f"{need} (give magnitudes of the same sense as the resistance)",
                where=where,
            )
        loads[name] = v
    C = f.phi_cs * phi * Rn
    RF = (C - f.gDC * loads["DC"] - f.gDW * loads["DW"]) / (f.gLL * loads["LL+IM"])
    vals = (
        CheckValue(
            "phi_c", f.phi_c or 0.0, "dimensionless", f"condition factor ({f.condition})", MBE
        ),
        CheckValue("phi_s", f.phi_s, "dimensionless", "system factor", MBE),
        CheckValue("phi", phi, "dimensionless", "resistance factor", ENGINEER),
        CheckValue("Rn", Rn, kind, "nominal resistance", ENGINEER),
        CheckValue("C", C, kind, "capacity phi_c phi_s phi Rn", MBE),
        CheckValue("gDC", f.gDC, "dimensionless", "dead load factor, components", MBE),
        CheckValue("DC", loads["DC"], kind, "dead load effect, components", ENGINEER),
        CheckValue("gDW", f.gDW, "dimensionless", "dead load factor, wearing surface", MBE),
        CheckValue("DW", loads["DW"], kind, "dead load effect, wearing surface", ENGINEER),
        CheckValue("gLL", f.gLL or 0.0, "dimensionless", f"live load factor ({f.level})", MBE),
        CheckValue("LL+IM", loads["LL+IM"], kind, "live load effect with impact", ENGINEER),
    )
    notes = ["rating factors are defaults from memory of the evaluation manual; confirm them"]
    assert f.phi_c is not None
    if f.phi_c * f.phi_s < PHI_CS_FLOOR:
        notes.append(f"phi_c phi_s = {f.phi_c * f.phi_s:.3g} raised to the {PHI_CS_FLOOR} floor")
    return RatingResult(RF=RF, C=C, kind=kind, level=f.level, values=vals, notes=tuple(notes))


@dataclass(frozen=True)
class SpanEffects:
    """Load effects at station ``x`` of a simple span (N, N·mm). Shears are signed
    (positive: left part pushed up); ``V_live`` is the live shear of the dead-load sense."""

    L: float
    x: float
    M_dead: float
    V_dead: float
    M_live: float
    V_live_pos: float
    V_live_neg: float
    IM: float

    @property
    def V_live(self) -> float:
        """Magnitude of the live shear with the sense of the dead-load shear (larger if 0)."""
        if self.V_dead > 0.0:
            return self.V_live_pos
        if self.V_dead < 0.0:
            return -self.V_live_neg
        return max(self.V_live_pos, -self.V_live_neg)

    @property
    def M_live_im(self) -> float:
        return (1.0 + self.IM) * self.M_live

    @property
    def V_live_im(self) -> float:
        return (1.0 + self.IM) * self.V_live


def _effects(L: float, x: float, loads: Sequence[tuple[float, float]]) -> tuple[float, ...]:
    """(M, V with a load at x on the right, V with a load at x on the left)."""
    M = Vr = Vl = 0.0
    for a, P in loads:
        if a < 0.0 or a > L:
            continue
        M += P * (a * (L - x) / L if a <= x else x * (L - a) / L)
        Vr += P * (-a / L if a < x else (L - a) / L)
        Vl += P * (-a / L if a <= x else (L - a) / L)
    return M, Vr, Vl


def simple_span_effects(
    *,
    L: Number,
    x: Number,
    axles: Sequence[Number],
    spacings: Sequence[Number] = (),
    w: Number = 0.0,
    IM: float = IM_DEFAULT,
    where: str = "",
) -> SpanEffects:
    """Dead and live load effects at station ``x`` of a simply supported span.

    The train is placed with each axle at the station, and at each support, moving in
    either direction; the effects are piecewise linear in the train position, so these
    placements give the exact envelope.

    Args:
        L: span, mm. x: station from the left support, mm (0 to L).
        axles: axle loads, N. spacings: distances between consecutive axles, mm.
        w: uniform dead load, N/mm (>= 0). IM: dynamic load allowance (0 to 1).

    Raises:
        InputError: a value out of range or spacings not one fewer than the axles.
    """
    L = internal(L, "length", "L", where=where, low=0.0, high=500_000.0)
    x = internal(x, "length", "x", where=where, low=0.0, high=L, low_inclusive=True)
    w = internal(w, "force_per_length", "w", where=where, low=0.0, low_inclusive=True)
    IM = internal(IM, "dimensionless", "IM", where=where, low=0.0, high=1.0, low_inclusive=True)
    P = [internal(p, "force", f"axle {i + 1}", where=where, low=0.0) for i, p in enumerate(axles)]
    if not P:
        raise InputError("the axle train needs at least one axle", where=where)
    s = [length(v, f"spacing {i + 1}", where=where) for i, v in enumerate(spacings)]
    if len(s) != len(P) - 1:
        raise InputError(f"{len(P)} axles need {len(P) - 1} spacings, got {len(s)}", where=where)
    offs = [0.0, *itertools.accumulate(s)]
    M = Vp = Vn = 0.0
    for j, target, d in itertools.product(range(len(P)), (x, 0.0, L), (1.0, -1.0)):
        loads = [(target + d * (o - offs[j]), p) for o, p in zip(offs, P, strict=True)]
        m, vr, vl = _effects(L, x, loads)
        M, Vp, Vn = max(M, m), max(Vp, vr, vl), min(Vn, vr, vl)
    return SpanEffects(
        L=L,
        x=x,
        M_dead=w * x * (L - x) / 2.0,
        V_dead=w * (L / 2.0 - x),
        M_live=M,
        V_live_pos=Vp,
        V_live_neg=Vn,
        IM=IM,
    )
