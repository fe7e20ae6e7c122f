"""A member's girder details and their checks as plain data (JSON) and as text tables (the
``asfound assess`` table): stiffeners with the family's requirements as-built and as-found,
the web panels and why a panel counts tension field or not, the supports, the bracing, and
the fatigue of each station."""

from __future__ import annotations

from typing import Any

from core.assess.results import MemberResult
from core.textable import render
from core.units import display_unit, from_internal, symbol


def _q(value: float | None, kind: str, system: str) -> dict[str, Any] | None:
    if value is None:
        return None
    unit = display_unit(kind, system)
    return {"value": round(from_internal(value, kind, unit), 9), "unit": unit}


def _yn(r, tfa: bool = True) -> str:
    if r is None:
        return "-"
    if not r.stiffened:
        return "no"
    return "panel + tension field" if tfa and r.tension_field else "panel"


def life_words(e: dict) -> str:
    """The fatigue life of a fatigue row's details in words."""
    if e.get("infinite_life"):
        return "infinite"
    rem = e["remaining_life_years"]
    tot = e["total_life_years"]
    return f"total {tot:.0f} y, " + (f"remaining {rem:.0f} y" if rem > 0 else "spent")


def details_dict(m: MemberResult, system: str) -> dict[str, Any]:
    """The member's girder details and checks (empty without them)."""
    d, p = m.details, m.panels
    if d is None or p is None:
        return {}
    checks: dict[str, dict[str, Any]] = {}
    for c in p.checks:
        checks.setdefault(c.stiffener.id, {})[c.state] = {
            "stiffened": c.result.stiffened,
            "tension_field": c.result.tension_field,
            "reasons": list(c.result.reasons),
            "clause": c.result.reference,
        }
    return {
        "stiffeners": [
            {
                "id": s.id,
                "position": _q(s.x, "position", system),
                "role": s.role,
                "loss": s.loss_words,
                "requirement": checks.get(s.id),
            }
            for s in d.stiffeners
        ],
        "panels": {
            state: [
                {
                    "from": _q(x.a, "position", system),
                    "to": _q(x.b, "position", system),
                    "kind": x.kind,
                    "why": x.words,
                }
                for x in panels
            ]
            for state, panels in (("as_built", p.built), ("as_found", p.found))
        },
        "supports": [
            {
                "id": s.id,
                "position": _q(s.x, "position", system),
                "N": _q(s.N, "length", system),
                "overhang": _q(s.overhang, "length", system),
                "stiffener": s.stiffener.id if s.stiffener else None,
            }
            for s in d.supports
        ],
        "bracing": {
            name: {
                "kind": br.kind,
                "recorded": br.recorded,
                "points": [_q(x, "position", system) for x in br.points],
                "words": br.words,
            }
            for name, br in (("top", d.top), ("bottom", d.bottom))
        },
    }


def girder_tables(m: MemberResult, system: str) -> list[str]:
    """The text tables of a member's stiffeners and panels, and of its fatigue rows."""
    out = []
    P = display_unit("position", system)
    if m.panels is not None and m.panels.checks:
        by: dict[str, dict] = {}
        for c in m.panels.checks:
            by.setdefault(c.stiffener.id, {"st": c.stiffener})[c.state] = c.result
        rows = []
        for v in by.values():
            f = v.get("found")
            rows.append(
                (
                    v["st"].id,
                    round(from_internal(v["st"].x, "position", P), 9),
                    _yn(v.get("built"), m.panels.tension_field),
                    _yn(f, m.panels.tension_field),
                    "; ".join(f.reasons) if f is not None and f.reasons else "",
                )
            )
        out.append(
            render(
                ("stiffener", f"x {symbol(P)}", "as-built", "as-found", "why not (as found)"),
                rows,
                f"Member {m.member}: intermediate stiffeners, what each may count (the family's "
                "requirements)",
            )
        )
    if m.panels is not None:
        rows = [
            (
                from_internal(x.a, "position", P),
                from_internal(x.b, "position", P),
                x.kind,
                x.words,
            )
            for x in m.panels.found
        ]
        out.append(
            render(
                (f"from {symbol(P)}", f"to {symbol(P)}", "panel", "why"),
                rows,
                f"Member {m.member}: web panels as found",
            )
        )
    S = display_unit("stress", system)
    rows = []
    for s in m.stations:
        for ls in s.limit_states:
            if ls.key != "fatigue":
                continue
            e = ls.extra
            life = life_words(e)
            rows.append(
                (
                    s.station,
                    from_internal(s.x, "position", P),
                    from_internal(e["stress_range_built_MPa"], "stress", S),
                    from_internal(e["stress_range_found_MPa"], "stress", S),
                    from_internal(ls.demand or 0.0, "stress", S),
                    from_internal(ls.C_found or 0.0, "stress", S),
                    life,
                )
            )
    if rows:
        out.append(
            render(
                (
                    "station",
                    f"x {symbol(P)}",
                    "range as-built",
                    "range as-found",
                    "design range",
                    "infinite-life limit",
                    "fatigue life",
                ),
                rows,
                f"Member {m.member}: fatigue of the riveted detail ({symbol(S)})",
            )
        )
    return out
