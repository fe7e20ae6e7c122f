"""The assessment as plain data (JSON): stable keys, every value with its unit."""

from __future__ import annotations

from typing import Any

from core import CAUTION
from core.assess.results import Assessment, LimitState, StationResult
from core.units import display_unit, from_internal

FORMAT = "asfound.assessment"
VERSION = 1


def _q(value: float | None, kind: str, system: str) -> dict[str, Any] | None:
    if value is None:
        return None
    unit = display_unit(kind, system)
    return {"value": from_internal(value, kind, unit), "unit": unit}


def limit_state_dict(ls: LimitState, system: str) -> dict[str, Any]:
    return {
        "key": ls.key,
        "name": ls.name,
        "as_built": _q(ls.C_built, ls.kind, system),
        "as_found": _q(ls.C_found, ls.kind, system),
        "ratio": ls.ratio,
        "demand": _q(ls.demand, ls.kind, system),
        "rating_factor": ls.RF,
        "reference": ls.found.reference if ls.found is not None else None,
        "note": ls.note,
    }


def station_dict(s: StationResult, system: str) -> dict[str, Any]:
    g = s.governing
    found = s.found
    tau = None
    if found.shear_applicable and s.V_demand:
        t, y = found.gross.profile.tau_max(s.V_demand)
        tau = {"tau_max": _q(t, "stress", system), "at_height": _q(y, "length", system)}
    return {
        "station": s.station,
        "x": _q(s.x, "position", system),
        "panel": s.panel,
        "D_used": _q(s.D_used, "length", system),
        "tw_found": _q(s.tw_found, "length", system),
        "V_demand": _q(s.V_demand, "force", system),
        "shear_applicable": found.shear_applicable,
        "finding": found.finding,
        "properties": {
            state: {sym: _q(v, kind, system) for sym, _, v, kind in sec.gross.props.rows()}
            for state, sec in (("as_built", s.built), ("as_found", s.found))
        },
        "tau_at_demand": tau,
        "part_loss_percent": s.part_loss,
        "limit_states": [limit_state_dict(ls, system) for ls in s.limit_states],
        "governing": g.key if g else None,
        "level": s.level.label,
        "flags": [
            {
                "level": f.level.label,
                "subject": f.subject,
                "message": f.message,
                "value": f.value,
                "threshold": f.threshold,
            }
            for f in s.flags
        ],
    }


def assessment_dict(a: Assessment, system: str | None = None) -> dict[str, Any]:
    """Plain-data form of ``a`` in the display units of ``system`` (default: the survey's)."""
    system = system or a.unit_system
    return {
        "format": FORMAT,
        "version": VERSION,
        "survey": a.survey_id,
        "title": a.title,
        "standard": a.standard,
        "standard_title": a.standard_title,
        "unit_system": system,
        "level": a.level.label,
        "caution": CAUTION,
        "members": [
            {
                "member": m.member,
                "label": m.label,
                "span": _q(m.span, "position", system),
                "level": m.level.label,
                "rivet_lines": [
                    {
                        "line": ln.line,
                        "rivets": ln.n_rivets,
                        "ineffective": ln.n_ineffective,
                        "longest_gap": _q(ln.longest_gap, "length", system),
                        "pitch": _q(ln.pitch, "length", system),
                        "states": ln.counts,
                    }
                    for ln in m.lines
                ],
                "flags": [
                    {"level": f.level.label, "subject": f.subject, "message": f.message}
                    for f in m.flags
                ],
                "stations": [station_dict(s, system) for s in m.stations],
            }
            for m in a.members
        ],
        "assumptions": [
            {"item": x.item, "value": x.value, "source": x.source} for x in a.assumptions
        ],
        "problems": [
            {"level": p.level, "message": p.message, "where": p.where} for p in a.problems
        ],
    }
