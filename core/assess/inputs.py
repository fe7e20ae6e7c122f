"""What an assessment takes from a survey: material, web and flange geometry, load effects."""

from __future__ import annotations

from dataclasses import dataclass

from core.assess.results import Assumption
from core.checks.material import Material, material_for_year
from core.checks.rating import simple_span_effects
from core.checks.results import ENGINEER
from core.definition import SectionDefinition
from core.errors import GeometryError, InputError
from core.parts import Plate
from core.survey.model import Member, Station, Survey


def resolve_material(survey: Survey) -> tuple[Material, list[Assumption]]:
    """Steel of the survey: the engineer's values, else the defaults by year built, else the
    lowest default (before 1905), flagged as an assumption to confirm.

    Raises:
        InputError / UnitError: values out of range or in a wrong unit.
    """
    h = survey.survey
    year = h.year_built
    by_year = material_for_year(year) if year is not None else None
    if h.material is not None:
        m = h.material
        Fy = m.Fy.to("stress", "survey / material / Fy")
        if m.Fu is not None:
            Fu, fu_src = m.Fu.to("stress", "survey / material / Fu"), ENGINEER
        elif by_year is not None:
            Fu, fu_src = by_year.Fu, by_year.source
        else:
            Fu, fu_src = 1.5 * Fy, "Fu = 1.5 Fy assumed (our assumption, engineer to confirm)"
        E = m.E.to("stress", "survey / material / E") if m.E is not None else None
        mat = Material(Fy=Fy, Fu=Fu, **({"E": E} if E else {}), source=ENGINEER)
        notes = [
            Assumption("Fy", f"{mat.Fy:.4g} MPa", ENGINEER),
            Assumption("Fu", f"{mat.Fu:.4g} MPa", fu_src),
            Assumption("E", f"{mat.E:.6g} MPa", ENGINEER if E else "29 000 ksi (common practice)"),
        ]
        return mat, notes
    if by_year is not None:
        return by_year, [
            Assumption(
                "steel by year built",
                f"Fy {by_year.Fy:.4g} MPa, Fu {by_year.Fu:.4g} MPa, E {by_year.E:.6g} MPa",
                by_year.source,
            )
        ]
    low = material_for_year(1900)
    return low, [
        Assumption(
            "steel (no material and no year built given)",
            f"Fy {low.Fy:.4g} MPa, Fu {low.Fu:.4g} MPa: the lowest default (before 1905)",
            "conservative choice of asfound; " + low.source,
        )
    ]


@dataclass(frozen=True)
class WebGeometry:
    """Web depth by basis and the flange proportions used by the shear checks (mm)."""

    web_id: str
    D_web: float
    D_lines: float | None
    d_overall: float
    top_parts: tuple[str, ...]
    bottom_parts: tuple[str, ...]


def web_geometry(defn: SectionDefinition) -> WebGeometry:
    """Find the web (the vertical plate with role "web", or id "web") and the flange parts.

    Raises:
        GeometryError: no vertical web plate in the section.
    """
    webs = [
        p
        for p in defn.parts
        if isinstance(p, Plate)
        and p.orientation == "vertical"
        and (p.role == "web" or p.id == "web")
    ]
    if not webs:
        raise GeometryError(
            "no web plate (a vertical plate with role 'web') in the section", where=defn.name
        )
    web = webs[0]
    lines = sorted(
        ln.position for ln in defn.rivet_lines if ln.axis == "horizontal" and web.id in ln.parts
    )
    D_lines = lines[-1] - lines[0] if len(lines) >= 2 else None
    mid = web.y + web.b / 2
    others = [p for p in defn.parts if p.id != web.id]
    top = tuple(p.id for p in others if (p.bounds[1] + p.bounds[3]) / 2 > mid)
    bot = tuple(p.id for p in others if (p.bounds[1] + p.bounds[3]) / 2 <= mid)
    ys = [b for p in defn.parts for b in (p.bounds[1], p.bounds[3])]
    return WebGeometry(web.id, web.b, D_lines, max(ys) - min(ys), top, bot)


def flange_proportions(
    defn: SectionDefinition, ids: tuple[str, ...], area: dict[str, float]
) -> tuple[float, float]:
    """(bf, tf) of a built-up flange: the widest part, and the thickness that gives the
    flange's area over that width (mm). ``area`` gives each part's remaining area."""
    if not ids:
        return 0.0, 0.0
    bf = max(defn.part(i).bounds[2] - defn.part(i).bounds[0] for i in ids)
    return bf, sum(area[i] for i in ids) / bf


@dataclass(frozen=True)
class Effects:
    """Unfactored load effects at a station (magnitudes): shear N, moment N*mm."""

    V_DC: float = 0.0
    V_DW: float = 0.0
    V_LL: float = 0.0
    M_DC: float = 0.0
    M_DW: float = 0.0
    M_LL: float = 0.0
    source: str = ""

    @property
    def has_shear(self) -> bool:
        return self.V_LL > 0.0

    @property
    def has_moment(self) -> bool:
        return self.M_LL > 0.0


def station_effects(member: Member, station: Station, x: float) -> Effects | None:
    """Load effects at ``station`` (x in mm from the member's start), from the station's own
    loads or from the member's simple-span loads; None when neither is given.

    Raises:
        InputError / UnitError: loads of the wrong unit or sign.
    """
    place = member.place(station.id)
    if station.loads is not None:
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
            # dead loads must agree in sense; LL+IM is an envelope value, taken as a
            # magnitude in the sense of the dead load
            signs = {(v > 0) for n, (v, _) in signed.items() if v != 0.0 and n != "LL"}
            if len(signs) > 1:
                shown = ", ".join(
                    f"{n if n != 'LL' else 'LL+IM'} {key} = {q.value:g} {q.unit}"
                    for n, (v, q) in signed.items()
                    if q is not None
                )
                raise InputError(
                    f"load effects of opposite sign ({shown}); give the dead and live load "
                    "effects of one sense (the live load envelope value that adds to the dead "
                    "load)",
                    where=place,
                )
            for name, (v, _) in signed.items():
                vals[f"{key}_{name}"] = abs(v)
        return Effects(**vals, source="engineer's input (station loads)")
    ss = member.simple_span
    if ss is None:
        return None
    span = member.span_mm()
    w_dc = ss.dc.to("force_per_length", f"{member.place()} / simple_span / dc")
    w_dw = ss.dw.to("force_per_length", f"{member.place()} / simple_span / dw") if ss.dw else 0.0
    axles = [a.load.to("force", f"{member.place()} / simple_span / axles") for a in ss.axles]
    spacing = [
        a.spacing.to("length", f"{member.place()} / simple_span / axles") for a in ss.axles[1:]
    ]
    if not axles:
        raise InputError("the simple-span loads need at least one axle", where=member.place())
    x = min(max(x, 0.0), span)
    dc = simple_span_effects(
        L=span, x=x, axles=axles, spacings=spacing, w=w_dc, IM=ss.im, where=place
    )
    dw = simple_span_effects(
        L=span, x=x, axles=axles, spacings=spacing, w=w_dw, IM=ss.im, where=place
    )
    g = ss.distribution
    return Effects(
        V_DC=abs(dc.V_dead),
        V_DW=abs(dw.V_dead),
        V_LL=g * dc.V_live_im,
        M_DC=abs(dc.M_dead),
        M_DW=abs(dw.M_dead),
        M_LL=g * dc.M_live_im,
        source="simple span influence lines, uniform dead loads and the axle train "
        "(engineer's input)",
    )
