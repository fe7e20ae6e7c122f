"""Result objects of the capacity checks: values with units, sources and descriptions.

Every number a check reports is a :class:`CheckValue` carrying its symbol, its quantity
kind (a key of :data:`core.units.INTERNAL`, so the report converts it for display), a
description, and where it comes from (standard and clause, "from memory",
"engineer's input" or "common practice, no source"). :meth:`CapacityResult.rows` turns
a result into table rows.
"""

from __future__ import annotations

import math
from collections.abc import Iterator
from dataclasses import dataclass

from core.errors import InputError
from core.units import INTERNAL

Row = tuple[str, str, float, str, str]  # (symbol, description, value, kind, source)

ENGINEER = "engineer's input"
FROM_MEMORY = "from memory"
PRACTICE = "common practice, no source"


@dataclass(frozen=True)
class CheckValue:
    """One reported number of a check.

    Attributes:
        symbol: the standard's symbol (``"Vp"``, ``"C"``, ``"k"``).
        value: the value in the internal unit of ``kind`` (N, mm, MPa, ...).
        kind: a key of :data:`core.units.INTERNAL` (``"force"``, ``"stress"``, ...).
        description: what the value is, in words.
        source: standard and clause, ``"from memory"``, ``"engineer's input"`` or
            ``"common practice, no source"``.

    Raises:
        InputError: unknown kind, empty symbol or a value that is not a finite number.
    """

    symbol: str
    value: float
    kind: str
    description: str
    source: str

    def __post_init__(self) -> None:
        if not isinstance(self.symbol, str) or not self.symbol.strip():
            raise InputError(f"check value symbol {self.symbol!r} must be a non-empty string")
        if self.kind not in INTERNAL:
            raise InputError(
                f"check value {self.symbol!r}: unknown kind {self.kind!r}; known: {sorted(INTERNAL)}"
            )
        v = float(self.value)
        if not math.isfinite(v):
            raise InputError(f"check value {self.symbol!r} = {self.value!r} is not finite")
        object.__setattr__(self, "value", v)

    @property
    def unit(self) -> str:
        """Internal unit of the value."""
        return INTERNAL[self.kind]

    def row(self) -> Row:
        """``(symbol, description, value, kind, source)``."""
        return (self.symbol, self.description, self.value, self.kind, self.source)


@dataclass(frozen=True)
class CapacityResult:
    """Nominal and factored resistance of one limit state, with its working.

    Attributes:
        limit_state: what is checked, in words (``"web shear"``, ``"rivet"``, ``"yield moment"``).
        standard: the standard's name.
        edition: the edition followed.
        clause: article / section / equation the result comes from.
        Rn: nominal resistance in the internal unit of ``kind``.
        phi: resistance factor (for EN 1993: 1/gamma_M).
        kind: quantity kind of ``Rn`` (``"force"``, ``"moment"``, ``"stress"``).
        values: the intermediate values, in the order of the working.
        notes: assumptions and remarks the report lists.
    """

    limit_state: str
    standard: str
    edition: str
    clause: str
    Rn: float
    phi: float
    kind: str = "force"
    values: tuple[CheckValue, ...] = ()
    notes: tuple[str, ...] = ()

    def __post_init__(self) -> None:
        object.__setattr__(self, "values", tuple(self.values))
        object.__setattr__(self, "notes", tuple(self.notes))
        if self.kind not in INTERNAL:
            raise InputError(f"{self.limit_state}: unknown kind {self.kind!r}")
        rn = float(self.Rn)
        if not math.isfinite(rn) or rn < 0.0:
            raise InputError(f"{self.limit_state}: Rn = {self.Rn!r} must be finite and >= 0")
        phi = float(self.phi)
        if not 0.0 < phi <= 1.5:
            raise InputError(f"{self.limit_state}: phi = {self.phi!r} is outside (0, 1.5]")
        object.__setattr__(self, "Rn", rn)
        object.__setattr__(self, "phi", phi)

    @property
    def Rr(self) -> float:
        """Factored resistance phi Rn (for EN 1993: the design resistance)."""
        return self.phi * self.Rn

    @property
    def reference(self) -> str:
        """``standard, edition, clause`` for a table caption."""
        return f"{self.standard}, {self.edition}, {self.clause}"

    def value(self, symbol: str) -> CheckValue:
        """The intermediate value named ``symbol``.

        Raises:
            KeyError: no such symbol (the message lists the known ones).
        """
        for v in self.values:
            if v.symbol == symbol:
                return v
        raise KeyError(f"{symbol!r} not among {[v.symbol for v in self.values]}")

    def has(self, symbol: str) -> bool:
        return any(v.symbol == symbol for v in self.values)

    def rows(self) -> Iterator[Row]:
        """Table rows: the intermediate values, then Rn, phi and phi Rn."""
        for v in self.values:
            yield v.row()
        src = self.reference
        yield ("Rn", f"nominal resistance, {self.limit_state}", self.Rn, self.kind, src)
        yield ("phi", "resistance factor", self.phi, "dimensionless", src)
        yield ("phi Rn", f"factored resistance, {self.limit_state}", self.Rr, self.kind, src)


@dataclass(frozen=True)
class ShearResult(CapacityResult):
    """Web shear resistance of one panel.

    Adds:
        panel: ``"unstiffened"``, ``"interior"`` or ``"end"``.
        tension_field: whether post-buckling tension field action was counted.
        depth_used: the web depth the check used (D, h or hw), mm: an assumption to report.
    """

    panel: str = "unstiffened"
    tension_field: bool = False
    depth_used: float = 0.0

    @property
    def Vn(self) -> float:
        """Nominal shear resistance, N."""
        return self.Rn

    @property
    def phi_v(self) -> float:
        return self.phi

    @property
    def Vr(self) -> float:
        """Factored shear resistance phi_v Vn, N."""
        return self.Rr
