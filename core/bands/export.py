"""The bands as plain data (the ``bands`` key of ``asfound assess --json``)."""

from __future__ import annotations

from typing import Any

from core.bands.assumptions import band_assumptions
from core.bands.propagate import Band
from core.bands.run import StationBands, SurveyBands
from core.names import place_name
from core.units import display_unit, from_internal


def _scaled(b: Band, kind: str, system: str) -> dict[str, Any]:
    unit = display_unit(kind, system)

    def c(v: float) -> float:
        return from_internal(v, kind, unit)

    sd = abs(c(b.sd) - c(0.0))
    return {"value": c(b.value), "sd": sd, "p5": c(b.p5), "p95": c(b.p95), "unit": unit}


def station_bands_dict(sb: StationBands, system: str) -> dict[str, Any]:
    L = display_unit("length", system)
    states = []
    for key, name in sb.names.items():
        bc, bm = sb.band(key, "C"), sb.band(key, "m")
        if bc is None and bm is None:
            continue
        sym = sb.symbols.get(key)
        states.append(
            {
                "key": key,
                "name": name,
                "capacity": None if bc is None else _scaled(bc, sb.kinds[key], system),
                "measure": None
                if bm is None
                else {
                    "symbol": sym,
                    "value": bm.value,
                    "sd": bm.sd,
                    "p5": bm.p5,
                    "p95": bm.p95,
                    "p_beyond": bm.p_beyond,
                    "beyond": f"P({sym} < 1)" if sym == "RF" else f"P({sym} > 1)",
                    "statement": sb.sentence(key),
                },
            }
        )
    return {
        "station": sb.station,
        "x": {
            "value": from_internal(sb.x, "position", display_unit("position", system)),
            "unit": display_unit("position", system),
        },
        "governing": sb.governing,
        "statement": sb.sentence(sb.governing) if sb.governing else "",
        "engine_evaluations": sb.runs,
        "regions": [
            {
                "part": s.part,
                "region": s.region,
                "place": place_name(s.part, s.region),
                "n": s.n,
                "instrument": s.instrument,
                "tolerance": {"value": from_internal(s.tol, "length", L), "unit": L},
                "scatter_assumed": s.s_assumed,
                "sigma": {"value": from_internal(s.sigma, "length", L), "unit": L},
            }
            for s in sb.sigmas
        ],
        "limit_states": states,
        "ranking": [
            {
                "part": r.part,
                "region": r.region,
                "place": r.place,
                "share": r.share,
                "narrowing": r.narrowing,
                "more_readings": r.more,
            }
            for r in sb.ranking
        ],
    }


def bands_dict(b: SurveyBands, system: str) -> dict[str, Any]:
    """Plain data of the bands in the display units of ``system``."""
    o = b.options
    return {
        "method": o.method,
        "samples": o.samples if o.method == "monte_carlo" else None,
        "seed": o.seed if o.method == "monte_carlo" else None,
        "engine_evaluations": b.runs,
        "assumptions": [
            {"item": x.item, "value": x.value, "source": x.source} for x in band_assumptions(o)
        ],
        "members": [
            {
                "member": m.member,
                "advice": list(m.advice),
                "stations": [station_bands_dict(s, system) for s in m.stations],
            }
            for m in b.members
        ],
    }
