"""The assessment as plain data (JSON): stable keys, every value with its unit."""

from __future__ import annotations

from typing import Any

from core import CAUTION
from core.assess.detailsout import details_dict
from core.assess.results import Assessment, LimitState, StationResult
from core.units import display_unit, from_internal

FORMAT = "asfound.assessment"
#: 3: limit-state keys are their printed names in snake case (e.g. "ltb" became
#: "lateral_torsional_buckling"); 2: one standard family per assessment
VERSION = 3


def _q(value: float | None, kind: str, system: str) -> dict[str, Any] | None:
    if value is None:
        return None
    unit = display_unit(kind, system)
    return {"value": from_internal(value, kind, unit), "unit": unit}


def limit_state_dict(ls: LimitState, system: str) -> dict[str, Any]:
    r = ls.rating
    return {
        "key": ls.key,
        "name": ls.name,
        "as_built": _q(ls.C_built, ls.kind, system),
        "as_found": _q(ls.C_found, ls.kind, system),
        "ratio": ls.ratio,
        "demand": _q(ls.demand, ls.kind, system),
        "rating_factor": ls.RF,
        "measure": None
        if r is None
        else {"name": r.measure, "symbol": r.symbol, "value": r.value, "load": r.load},
        "reference": ls.reference,
        "note": ls.note,
        "part_of": ls.part_of,
        "least_of": list(ls.least_of),
        **({"details": dict(ls.extra)} if ls.extra else {}),
    }


def family_dict(a: Assessment) -> dict[str, Any]:
    """The family followed: documents, every factor with its source, the measure."""
    f = a.family
    if f is None:
        return {}
    return {
        "key": f.key,
        "name": f.name,
        "documents": [
            {"title": d.title, "edition": d.edition, "role": d.role, "points_to": d.pointer}
            for d in f.documents
        ],
        "factors": [
            {"symbol": x.symbol, "value": x.value, "description": x.description, "source": x.source}
            for x in f.factors.values()
        ],
        "measure": {"name": f.measure.name, "symbol": f.measure.symbol},
        "depth_basis": f.depth_basis,
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
        "family": family_dict(a),
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
                "factors": [
                    {
                        "symbol": x.symbol,
                        "value": x.value,
                        "description": x.description,
                        "source": x.source,
                    }
                    for x in m.factors
                ],
                "summary": [
                    {
                        "case": r.case,
                        "load": r.load,
                        "factor": r.factor,
                        "symbol": r.symbol,
                        "value": r.value,
                        "station": r.station,
                        "limit_state": r.limit_state,
                        "consequence": r.consequence,
                    }
                    for r in m.summary
                ],
                "live_load_envelopes": [
                    {
                        "station": e.station,
                        "case": e.case,
                        "M": _q(e.M, "moment", system),
                        "V": _q(e.V, "force", system),
                        "M_at": e.M_at,
                        "V_at": e.V_at,
                    }
                    for e in m.envelopes
                ],
                "girder": details_dict(m, system),
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
        "flags": [
            {"level": f.level.label, "subject": f.subject, "message": f.message} for f in a.flags
        ],
    }
