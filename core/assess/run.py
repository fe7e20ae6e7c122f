"""Assess a whole survey under one standard family: every member and station, as-built
against as-found, the family's limit states and measure, and the member's rating summary."""

from __future__ import annotations

import datetime as _dt

from core.assess.assumptions import assumptions
from core.assess.details import MemberDetails, SupportData, member_details
from core.assess.effects import LiveCase, effects_at, live_table, station_effects
from core.assess.gcpause import collector_paused
from core.assess.inputs import web_geometry
from core.assess.options import AssessOptions
from core.assess.panels import layout
from core.assess.results import (
    Assessment,
    EnvelopeRow,
    MemberResult,
    StationResult,
    SummaryRow,
)
from core.assess.rivetlines import summarise_line
from core.assess.station import (
    checks,
    design_effects,
    panel_thickness,
    part_loss_percent,
    rate,
    rated,
    station_flags,
    web_readings,
)
from core.checks.flags import Flag, Level, flag_rivet_line
from core.errors import InputError

# the families load with the engine, not inside the first assessment
from core.families import aashto, aisc, build_family, en1993  # noqa: F401
from core.families.base import Family
from core.families.context import MemberSetup, StationContext
from core.families.liveload import NOT_RECORDED
from core.section import analyse
from core.survey.model import Member, Survey
from core.survey.readings import station_loss, station_stats


def assess_member(
    member: Member, survey: Survey, material, family: Family, opts: AssessOptions
) -> MemberResult:
    """Assess every station of one member.

    Raises:
        InputError / GeometryError / UnitError: unusable member data (the message names
            member, station and part).
    """
    rules = family.rules
    defn = member.definition()
    web = web_geometry(defn)
    span = member.span_mm()
    do = member.do_mm()
    built = analyse(defn)
    lines = {ln.id: summarise_line(member, ln, opts.effective_states) for ln in defn.rivet_lines}
    mf = rules.member_factors(member, opts)
    cases: list[LiveCase] = rules.live_cases(member, survey, opts)
    by_key = {c.key: c for c in cases}
    D, y_depth, depth_words = web.depth(family.depth_basis)
    if D <= 0.0:
        raise InputError("the web depth for shear is not positive", where=member.place())
    stations = []
    envelopes = []
    all_effects = {}
    readings = web_readings(member, web.web_id)
    cache: dict = {}
    policy = opts.thickness_policy
    details = member_details(member, span, policy, web.D_web)
    t_nom = defn.part(web.web_id).t
    panels = layout(
        details, span, do, readings, t_nom, policy, rules.stiffener_check(defn, web, D, material)
    )
    xs: dict[str, float] = {}
    for st in member.stations:
        x = st.position_mm(member)
        if not 0.0 <= x <= span:
            raise InputError(
                f"station position {st.position:g} {member.position_unit} is outside the member "
                f"(0 to {member.span.value:g} {member.span.unit})",
                where=member.place(st.id),
            )
        xs[st.id] = x
    stats_all = {st.id: station_stats(st, member, policy) for st in member.stations}
    found_all = {
        st.id: analyse(defn, station_loss(st, member, policy, stats_all[st.id]))
        for st in member.stations
    }
    # the stations of each as-found panel, in station order (found once, not per station)
    panel_of = {sid: panels.at(xx, "found") for sid, xx in xs.items()}
    groups: list[tuple[object, list[str]]] = []
    for sid, p in panel_of.items():
        for q, members_ in groups:
            if q == p:
                members_.append(sid)
                break
        else:
            groups.append((p, [sid]))
    same_of = {sid: ids for _p, ids in groups for sid in ids}
    tw_of_panel: dict[int, tuple[float, str]] = {}
    design = rules.design_keys(cases, opts)
    moments: dict[float, float | None] = {}

    def moment(x: float) -> float | None:
        if x not in moments:
            eff = effects_at(member, x, span, cases)
            moments[x] = design_effects(family, eff, design).get("M")
        return moments[x]

    # every case moved over every station and support at once (the positions are checked)
    table = live_table(cases, span, [*xs.values(), *(s.x for s in details.supports)])
    setup = MemberSetup(
        details,
        panels,
        moment,
        {s.id: effects_at(member, s.x, span, cases, table) for s in details.supports},
        found_all,
        _age(survey),
        xs=tuple(xs.values()),
    )
    at_station, unattached = attach_supports(details, xs, web.D_web)
    for st in member.stations:
        place = member.place(st.id)
        x = xs[st.id]
        found = found_all[st.id]
        effects = station_effects(member, st, x, span, cases, table)
        all_effects[st.id] = effects
        keys = ["station"] if effects is not None and "station" in effects.live else []
        keys = keys or design
        pb, pf = panels.at(x, "built"), panels.at(x, "found")
        same = same_of[st.id]
        shared = pf is not None and pf.kind != "unstiffened"  # then one value per panel
        if shared and id(same) in tw_of_panel:
            tw, tw_words = tw_of_panel[id(same)]
        else:
            tw, tw_words = panel_thickness(st.id, readings, t_nom, pf, policy, same)
            if shared:
                tw_of_panel[id(same)] = (tw, tw_words)
        ctx = StationContext(
            family=family,
            member=mf,
            defn=defn,
            built=built,
            found=found,
            loss_local=station_loss(st, member, "minimum", stats_all[st.id]),
            web=web,
            D=D,
            y_depth=y_depth,
            depth_words=depth_words,
            tw_panel=tw,
            tw_words=tw_words,
            panel=pb.kind,
            do=pb.do,
            material=material,
            x=x,
            span=span,
            where=place,
            effects=effects,
            design=design_effects(family, effects, keys),
            lines=lines,
            opts=opts,
            year_built=survey.survey.year_built,
            cache=cache,
            setup=setup,
            station=st.id,
            compression=compression_of(effects),
            panel_built=pb,
            panel_found=pf,
            supports=at_station.get(st.id, ()),
        )
        states = [
            rated(ls, rate(ls, family.measure, effects, keys, by_key, mf, place))
            for ls in checks(ctx)
        ]
        loss_pct = part_loss_percent(built, found)
        flags = station_flags(ctx, states, loss_pct, opts)
        stations.append(
            StationResult(
                member.id,
                st.id,
                x,
                built,
                found,
                tuple(stats_all[st.id]),
                loss_pct,
                tuple(states),
                tuple(flags),
                pf.kind,
                D,
                tw,
                ctx.design.get("V"),
            )
        )
        if effects is not None:
            for k, env in effects.live.items():
                title = by_key[k].title if k in by_key else "station loads"
                sh = effects.live_shear(env)
                envelopes.append(
                    EnvelopeRow(st.id, x, title, env.M.value, sh.value, env.M.at, sh.at)
                )
    mflags = []
    for ln in defn.rivet_lines:
        s = lines[ln.id]
        if s.n_rivets:
            mflags += flag_rivet_line(
                f"{member.place()} / rivet line {ln.id!r}",
                s.n_ineffective,
                s.longest_gap,
                ln.pitch,
                opts.thresholds,
            )
    mflags += detail_flags(member, details, unattached)
    if cases and mf["g"].source == NOT_RECORDED:
        mflags.append(
            Flag(
                Level.REVIEW,
                f"{member.place()} / live load distribution",
                "engineer to review: no distribution factor recorded; 1.0 used, which is not "
                "necessarily conservative",
            )
        )
    summary = member_summary(
        member, family, stations, all_effects, cases, mf, opts, survey.survey.unit_system
    )
    return MemberResult(
        member.id,
        member.label,
        span,
        tuple(stations),
        tuple(lines.values()),
        tuple(mflags),
        summary,
        tuple(envelopes),
        tuple(mf.values()),
        details,
        panels,
    )


def compression_of(effects) -> str:
    """The flange in compression at a station: the bottom one where the dead load moment
    is hogging (negative), else the top one."""
    if effects is None:
        return "top"
    return "bottom" if effects.M_DC + effects.M_DW < 0.0 else "top"


def _age(survey: Survey) -> float | None:
    """Years in service at the survey (its first date, else today), None without the year
    built."""
    yb = survey.survey.year_built
    if yb is None:
        return None
    year = _dt.date.today().year
    for d in survey.survey.dates:
        try:
            year = _dt.date.fromisoformat(d).year
            break
        except ValueError:
            continue
    return float(max(year - yb, 0))


def attach_supports(
    details: MemberDetails, xs: dict[str, float], depth: float
) -> tuple[dict[str, tuple[SupportData, ...]], list[SupportData]]:
    """The station nearest each support, within ``depth`` (mm) of it, takes its girder end
    checks; the supports with no station that near are returned apart."""
    out: dict[str, list[SupportData]] = {}
    alone = []
    for sup in details.supports:
        near = [(abs(x - sup.x), sid) for sid, x in xs.items() if abs(x - sup.x) <= depth]
        if near:
            out.setdefault(min(near)[1], []).append(sup)
        else:
            alone.append(sup)
    return {k: tuple(v) for k, v in out.items()}, alone


def detail_flags(member: Member, details: MemberDetails, alone: list[SupportData]) -> list[Flag]:
    """Flags about what the girder details leave unchecked or assumed."""
    out = []
    w = member.place()
    if not details.supports:
        out.append(
            Flag(
                Level.REVIEW,
                f"{w} / supports",
                "engineer to review: no supports recorded; the girder ends (bearing "
                "stiffeners, web yielding and crippling at the bearings) are not checked",
            )
        )
    for sup in alone:
        out.append(
            Flag(
                Level.REVIEW,
                f"{w} / support {sup.id!r}",
                "engineer to review: no station within one web depth of the support; its girder "
                "end is not checked (measure the web and the stiffener at the bearing)",
            )
        )
    for name, br in (("top", details.top), ("bottom", details.bottom)):
        if not br.recorded and name == "top":
            out.append(
                Flag(
                    Level.REVIEW,
                    f"{w} / bracing",
                    "engineer to review: the bracing of the top flange is not recorded; it is "
                    "taken as held laterally at the supports only (conservative)",
                )
            )
    for x in details.warnings:
        out.append(Flag(Level.WATCH, f"{w} / stiffeners", f"keep watching: {x}"))
    return out


def member_summary(
    member: Member,
    family: Family,
    stations: list[StationResult],
    effects: dict,
    cases: list[LiveCase],
    mf: dict,
    opts: AssessOptions,
    system: str,
) -> tuple[SummaryRow, ...]:
    """Per load case, the worst value of the family's measure of each limit state over the
    member (the worst first), with where it occurs; the first row of a case says what follows
    (a posting load for a legal vehicle, the reserve)."""
    rules = family.rules
    rows = []
    by_key = {c.key: c for c in cases}
    for words, measure, keys, weight in rules.summary_cases(cases, opts):
        worst: dict[str, tuple] = {}
        for s in stations:
            eff = effects.get(s.station)
            for ls in s.limit_states:
                if ls.part_of is not None:
                    continue
                group = ls.key.split(":")[0]
                r = rate(ls, measure, eff, keys, by_key, mf, member.place(s.station))
                if r is not None and (group not in worst or r.badness < worst[group][0].badness):
                    worst[group] = (r, s.station, ls.name if group != "rivets" else "rivets")
        if not worst:
            continue
        lf = measure.live_factor
        factor = f"{lf.symbol} {lf.value:g}"
        ranked = sorted(worst.values(), key=lambda w: w[0].badness)
        for i, (r, sid, name) in enumerate(ranked):
            # the consequence (posting, reserve) follows from the worst limit state of the case
            conseq = rules.posting(r.value, weight, system) if i == 0 else ""
            rows.append(SummaryRow(words, r.load, factor, r.symbol, r.value, sid, name, conseq))
    return tuple(rows)


def assess(survey: Survey, opts: AssessOptions | None = None, problems: tuple = ()) -> Assessment:
    """Assess every member of ``survey`` under one standard family.

    The family is ``opts.standard``, else the survey's; the survey's own options
    (``survey.options``) are the caller's to merge (see :mod:`core.assess.options`).

    Raises:
        InputError / GeometryError / UnitError: the first unusable value, with its place.
    """
    with collector_paused():
        return _assess(survey, opts or AssessOptions(), problems)


def _assess(survey: Survey, opts: AssessOptions, problems: tuple) -> Assessment:
    key = opts.standard or survey.survey.standard
    family = build_family(key, opts, survey)
    material, mat_notes, assumed = family.rules.material(survey)
    members = [assess_member(m, survey, material, family, opts) for m in survey.members]
    flags = list(family.rules.flags(survey))
    if assumed and key != "aashto":
        flags.append(
            Flag(
                Level.REVIEW,
                "survey / material",
                "engineer to review: no material given; the steel is assumed (see the "
                "assumptions); determine it by coupon tests",
            )
        )
    h = survey.survey
    return Assessment(
        h.id,
        h.title or h.structure,
        key,
        family.name,
        h.unit_system,
        tuple(members),
        tuple(assumptions(survey, mat_notes, family, opts, members)),
        tuple(problems),
        family,
        tuple(flags),
    )
