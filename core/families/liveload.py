"""A member's live load data as the families use it: the distribution factor and vehicles."""

from __future__ import annotations

import itertools

from core.assess.options import AssessOptions
from core.families.base import Factor
from core.loads.distribution import lever_rule
from core.loads.models import AxleTrain
from core.survey.model import Member, Vehicle
from core.units import to_internal

NOT_RECORDED = (
    "not recorded: 1.0 assumed, which is not necessarily conservative (the lever rule with a "
    "multiple presence factor can exceed 1): engineer to set"
)


def distribution(member: Member, opts: AssessOptions, *, lever_allowed: bool = True) -> Factor:
    """The share g of one lane, track or vehicle carried by the member, with its source:
    the engineer's option, the member's record, its lever rule, or 1.0 (flagged).

    Raises:
        InputError / UnitError: a lever rule that cannot be used (named).
    """
    what = "distribution factor g: share of one lane / track / vehicle carried by the member"
    if opts.distribution is not None:
        return Factor("g", opts.distribution, what, "engineer's input (option)")
    ll = member.live_load
    if ll is not None and ll.distribution is not None:
        basis = f" ({ll.distribution_basis})" if ll.distribution_basis else ""
        return Factor("g", ll.distribution, what, f"engineer's input, member record{basis}")
    if ll is not None and ll.lever_rule is not None and lever_allowed:
        lr = ll.lever_rule
        w = f"{member.place()} / live_load / lever_rule"
        S = lr.spacing.to("length", w)
        loads = [(ld.offset.to("length", w), ld.fraction) for ld in lr.loads]
        r = lever_rule(S, loads, lr.multiple_presence)
        unit = lr.spacing.unit
        return Factor(
            "g",
            r.g,
            what,
            r.words(unit, to_internal(1.0, unit, "length"))
            + " (statics; spacing, loads and multiple presence as recorded)",
        )
    return Factor("g", 1.0, what, NOT_RECORDED)


def vehicle_model(member: Member, v: Vehicle, system: str) -> AxleTrain:
    """An engineer's vehicle as an axle train in N and mm (first spacing ignored).

    Raises:
        UnitError: an axle or spacing in a wrong unit (named).
    """
    w = f"{member.place()} / live_load / vehicle {v.name!r}"
    P = tuple(a.load.to("force", w) for a in v.axles)
    gaps = [a.spacing.to("length", w) for a in v.axles[1:]]
    offs = (0.0, *itertools.accumulate(gaps))
    unit, scale = ("ft", to_internal(1.0, "ft", "length")) if system == "us" else ("m", 1000.0)
    return AxleTrain(v.name, v.kind, P, tuple(offs), v.im, unit, scale, key=f"vehicle:{v.name}")
