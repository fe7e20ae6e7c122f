"""Assess a whole survey: every member and station, as-built against as-found."""

from __future__ import annotations

from core.assess.inputs import resolve_material, station_effects, web_geometry
from core.assess.options import AssessOptions
from core.assess.results import Assessment, Assumption, MemberResult, StationResult
from core.assess.rivetlines import summarise_line
from core.assess.station import StationInput, checks_at, depth_used
from core.checks import STANDARDS
from core.checks.flags import flag_rivet_line
from core.checks.results import ENGINEER, FROM_MEMORY, PRACTICE
from core.checks.rivets import A502_GRADE_1
from core.errors import InputError
from core.section import analyse
from core.survey.model import Member, Survey
from core.survey.readings import station_stats


def panel_at(x: float, span: float, do: float | None) -> str:
    """Panel kind at x (mm): unstiffened without stiffeners; an end panel within one
    stiffener spacing of either end; interior otherwise."""
    if do is None:
        return "unstiffened"
    return "end" if x < do or x > span - do else "interior"


def assess_member(
    member: Member, survey: Survey, material, standard: str, opts: AssessOptions
) -> MemberResult:
    """Assess every station of one member.

    Raises:
        InputError / GeometryError / UnitError: unusable member data (the message names
            member, station and part).
    """
    defn = member.definition()
    web = web_geometry(defn)
    span = member.span_mm()
    do = member.do_mm()
    built = analyse(defn)
    lines = {ln.id: summarise_line(member, ln, opts.effective_states) for ln in defn.rivet_lines}
    stations = []
    for st in member.stations:
        place = member.place(st.id)
        x = st.position_mm(member)
        if not 0.0 <= x <= span:
            raise InputError(
                f"station position {st.position:g} {member.position_unit} is outside the member "
                f"(0 to {member.span.value:g} {member.span.unit})",
                where=place,
            )
        loss = st.loss(member, opts.thickness_policy)
        loss_local = st.loss(member, "minimum")
        found = analyse(defn, loss)
        si = StationInput(
            defn,
            built,
            found,
            loss_local,
            web,
            material,
            standard,
            panel_at(x, span, do),
            do,
            x,
            span,
            station_effects(member, st, x),
            place,
        )
        states, flags, part_loss, D, tw = checks_at(si, lines, opts)
        e = si.effects
        stations.append(
            StationResult(
                member.id,
                st.id,
                x,
                built,
                found,
                tuple(station_stats(st, member, opts.thickness_policy)),
                part_loss,
                tuple(states),
                tuple(flags),
                si.panel,
                D,
                tw,
                None
                if e is None or not e.has_shear
                else opts.rating.gDC * e.V_DC + opts.rating.gDW * e.V_DW + opts.rating.gLL * e.V_LL,
            )
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
    return MemberResult(
        member.id, member.label, span, tuple(stations), tuple(lines.values()), tuple(mflags)
    )


def assumptions(
    survey: Survey,
    material_notes: list[Assumption],
    standard: str,
    opts: AssessOptions,
    members: list[MemberResult],
) -> list[Assumption]:
    """Every value the assessment used that the engineer should confirm, with its source."""
    std = STANDARDS[standard]
    out = [
        Assumption(
            "design standard for web shear",
            f"{std.title}, {std.edition}, {std.clause}",
            ENGINEER if (opts.standard or survey.survey.standard) else PRACTICE,
        ),
        *material_notes,
        Assumption(
            "thickness used for A, I, Q",
            f"{opts.thickness_policy} of the readings per part region, capped at nominal",
            ENGINEER + " (default: mean)",
        ),
        Assumption(
            "thickness used for rivet bearing", "minimum of the readings per part region", PRACTICE
        ),
        Assumption(
            "uniform thickness reading",
            "thins the exposed faces only; faying faces "
            "(e.g. the web gripped between the flange angles) keep their place",
            PRACTICE,
        ),
        Assumption(
            "as-found web thickness for panel shear",
            "the mean web reading at the station (buckling and yield of the panel); where the "
            "web is cut through, the thinnest loss band on it",
            PRACTICE,
        ),
        Assumption(
            "loss bands on the web",
            "checked at the thinnest cut: the as-built panel resistance times "
            "min(1, tau_max,built / tau_max,found), tau from VQ/It",
            "asfound method, no source: engineer to review",
        ),
        Assumption(
            "web cut through (perforation or band worn through)",
            "VQ/It not applicable; panel resistance of the full depth times the share of the "
            "depth that remains",
            "asfound estimate, no source: engineer to review",
        ),
        Assumption(
            "effective rivets",
            ", ".join(opts.effective_states) + " (missing, loose or "
            "headless rivets otherwise carry nothing)",
            ENGINEER + " (default: sound only)",
        ),
        Assumption(
            "stretch of a rivet line that governs at a station",
            "plus or minus "
            + (f"{opts.gap_window:g} mm" if opts.gap_window else "the web depth")
            + " around the station",
            PRACTICE,
        ),
        Assumption(
            "rivet material",
            f"{A502_GRADE_1.name}: Fnv {A502_GRADE_1.Fnv:.4g} MPa, phi {A502_GRADE_1.phi:g}",
            A502_GRADE_1.source,
        ),
        Assumption(
            "rivet bearing",
            "Rn = 2.4 d t Fu on each ply; in double shear the middle ply "
            "bears the whole force, each outer ply half",
            "AASHTO LRFD 6.13.2.9 " + FROM_MEMORY,
        ),
        Assumption(
            "shear stress and shear flow",
            "gross section (rivet holes filled); flexure and tension use the net section",
            PRACTICE,
        ),
        Assumption("tension flange", "bottom flange in tension (sagging moment)", PRACTICE),
        Assumption(
            "panel kind",
            "unstiffened without stiffener spacing; end panel within one "
            "spacing of a member end; interior otherwise",
            PRACTICE,
        ),
        Assumption(
            "rating factors",
            f"condition {opts.rating.condition} (phi_c "
            f"{opts.rating.phi_c:g}), phi_s {opts.rating.phi_s:g}, gDC {opts.rating.gDC:g}, "
            f"gDW {opts.rating.gDW:g}, gLL {opts.rating.gLL:g} ({opts.rating.level})",
            "AASHTO Manual for Bridge Evaluation " + FROM_MEMORY + "; engineer confirms",
        ),
    ]
    for m in members:
        if m.stations:
            s = m.stations[0]
            D, why = depth_used(web_geometry(s.built.definition), standard, opts.depth_basis)
            out.append(
                Assumption(
                    f"web depth D used for shear, member {m.member}",
                    f"{D:.4g} mm ({why})",
                    ENGINEER + f" (depth basis '{opts.depth_basis}')",
                )
            )
    return out


def assess(survey: Survey, opts: AssessOptions | None = None, problems: tuple = ()) -> Assessment:
    """Assess every member of ``survey``.

    Raises:
        InputError / GeometryError / UnitError: the first unusable value, with its place.
    """
    opts = opts or AssessOptions()
    standard = opts.standard or survey.survey.standard
    if standard not in STANDARDS:
        raise InputError(f"unknown standard {standard!r}; known standards: {sorted(STANDARDS)}")
    material, mat_notes = resolve_material(survey)
    members = [assess_member(m, survey, material, standard, opts) for m in survey.members]
    h = survey.survey
    return Assessment(
        h.id,
        h.title or h.structure,
        standard,
        STANDARDS[standard].title,
        h.unit_system,
        tuple(members),
        tuple(assumptions(survey, mat_notes, standard, opts, members)),
        tuple(problems),
    )
