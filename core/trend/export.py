"""The trend as plain data (``asfound trend --json``) and in words (its statements).

Thicknesses are in mm and rates in mm/year (the engine's units), whatever the surveys'
unit system; years are decimal calendar years.
"""

from __future__ import annotations

from typing import Any

from core import CAUTION
from core.trend.crossing import ALREADY, BEYOND, CROSSES, Crossing
from core.trend.project import T_FLOOR
from core.trend.rates import B_RANGE
from core.trend.run import TrendResult

FORMAT = "asfound.trend"
VERSION = 1


def model_statement(r: TrendResult) -> str:
    """The corrosion model in one paragraph of words."""
    if r.model == "linear":
        return (
            "Corrosion model: linear, thickness t(y) = a + b y fitted by least squares to the "
            "thickness at each survey date; loss rate r = -b in mm/year with its standard "
            "error from three or more surveys; from two surveys the difference over the "
            "interval (no standard error, no band)."
        )
    return (
        f"Corrosion model: power law, loss d = A tau^B with tau the years since "
        f"{r.y0:g} (the year corrosion is taken to begin), B = {r.B:g} chosen by the "
        f"engineer (B is typically about {B_RANGE[0]:g} to {B_RANGE[1]:g} in atmospheric "
        "corrosion-loss studies, from memory), A fitted by least squares with its standard "
        "error."
    )


def method_statement(r: TrendResult) -> list[str]:
    """How the projection was made, sentence by sentence."""
    out = [
        "Thickness of a part region at a date: the value the assessment uses for A, I and Q "
        f"(the {r.options.thickness_policy} of its readings, capped at nominal).",
        "Projection: from the thickness found at the latest survey plus the model's further "
        "loss; every reading of a region is shifted by the same amount (its scatter kept). "
        "Loss bands and perforations keep their extent, rivet states and loads are those of "
        "the latest survey.",
        f"Each projected survey is assessed by the same engine and family every "
        f"{r.step:g} years up to {r.horizon:g} years ahead; the year a measure crosses a "
        "threshold is interpolated linearly between two such runs.",
        f"Where a projected reading would fall below {T_FLOOR:g} mm the region would be "
        "lost: its station's limit states end there (the region is held at that floor, or "
        "as found where it was found thinner, e.g. a band at t = 0, for what neighbouring "
        "stations share with it, such as a web panel).",
        "Band: the crossing with every rate one standard error faster and slower "
        "(about two chances in three for normal scatter).",
        f"Stations are matched by position within {r.series.tolerance:g} mm, parts by id.",
        "A region read in the latest survey only: rate from the loss since built (nominal "
        "less the thickness found, over the years since the year built), no standard error; "
        "where the year built is not known it has no rate and is held as found (flagged "
        "NO RATE in the notes: the projection there takes no further loss).",
    ]
    if not any(rt.has_band for rt in r.rates):
        out[4] = "No band: no rate has a standard error (two surveys, linear model)."
    return out


def year(r: TrendResult, dt: float | None) -> float | None:
    return None if dt is None else r.y_last + dt


def crossing_words(r: TrendResult, c: Crossing) -> str:
    """A crossing in words: ``2034.8 (2031.2 to 2040.5)``, ``already``, ``after 2075``."""
    if c.status == ALREADY:
        return "already"
    if c.status != CROSSES:
        if c.status == BEYOND:
            out = f"after {r.y_last + r.horizon:.0f}"
        else:
            out = f"not before {year(r, c.dt):.0f}" if c.dt is not None else "not projected"
        if c.status_early == ALREADY:  # the central rate does not cross, the fast one does
            return out + " (earliest: already)"
        if c.status_early == CROSSES and c.dt_early is not None:
            return out + f" (earliest {r.y_last + c.dt_early:.1f})"
        return out
    out = f"{year(r, c.dt):.1f}"
    if c.status_early or c.status_late:
        lo = "already" if c.status_early == ALREADY else _yr(r, c.dt_early, c.status_early)
        hi = _yr(r, c.dt_late, c.status_late)
        out += f" ({lo} to {hi})"
    return out


def _yr(r: TrendResult, dt: float | None, status: str) -> str:
    if status == CROSSES and dt is not None:
        return f"{r.y_last + dt:.1f}"
    if status == BEYOND:
        return f"after {r.y_last + r.horizon:.0f}"
    if dt is not None:
        return f"not before {r.y_last + dt:.0f}"
    return "?"


def _crossing(r: TrendResult, c: Crossing) -> dict[str, Any]:
    return {
        "target": c.target.value,
        "meaning": c.target.label,
        "status": c.status,
        "year": year(r, c.dt),
        "year_early": year(r, c.dt_early),
        "year_late": year(r, c.dt_late),
        "status_early": c.status_early or None,
        "status_late": c.status_late or None,
        "words": crossing_words(r, c),
    }


def trend_dict(r: TrendResult) -> dict[str, Any]:
    """The whole trend as plain JSON types."""
    s = r.series
    return {
        "format": FORMAT,
        "version": VERSION,
        "caution": CAUTION,
        "structure": s.structure,
        "surveys": [
            {"file": f, "id": sv.survey.id, "date": d.isoformat(), "year": round(y, 4)}
            for f, sv, d, y in zip(s.files, s.surveys, s.dates, s.years, strict=True)
        ],
        "family": r.family,
        "measure": {"name": r.measure, "symbol": r.symbol},
        "model": {
            "name": r.model,
            "B": r.B,
            "since": r.y0,
            "statement": model_statement(r),
        },
        "method": method_statement(r),
        "horizon_years": r.horizon,
        "step_years": r.step,
        "tolerance_mm": s.tolerance,
        "targets": [{"value": t.value, "meaning": t.label} for t in r.targets],
        "regions": [
            {
                "member": rs.member,
                "station": rs.station,
                "part": rs.part,
                "region": rs.region,
                "t_nominal_mm": rs.t_nominal,
                "years": [round(y, 4) for y in rs.years],
                "t_mm": list(rs.t),
                "has_rate": rt.has_rate,
                "rate_mm_per_year": rt.r if rt.has_rate else None,
                "se_mm_per_year": rt.se,
                "method": rt.method,
                "A": rt.A,
                "se_A": rt.se_A,
                "note": rt.note,
                "projected": [
                    {"year": round(r.y_last + dt, 4), "t_mm": r.projected_t(rs, dt)} for dt in r.dts
                ],
            }
            for rs, rt in zip(s.regions, r.rates, strict=True)
        ],
        "limit_states": [
            {
                "member": t.member,
                "station": t.station,
                "key": t.key,
                "name": t.name,
                "symbol": t.symbol,
                "at_dates": list(t.at_dates),
                "projected": [
                    {"year": round(r.y_last + dt, 4), "value": v}
                    for dt, v in zip(r.dts, t.projected, strict=True)
                ],
                "crossings": [_crossing(r, c) for c in t.crossings],
                "ended": t.ended or None,
            }
            for t in r.tracked
        ],
        "regions_without_rate": [
            {"member": rs.member, "station": rs.station, "part": rs.part, "region": rs.region}
            for rs, rt in zip(s.regions, r.rates, strict=True)
            if not rt.has_rate
        ],
        "notes": list(r.notes),
    }
