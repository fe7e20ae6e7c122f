"""Every value an assessment used that the engineer should confirm, with its source: the
family and its documents, every factor, the member's factors and load models, and the
methods (all in the family's own words; no other family's clause appears)."""

from __future__ import annotations

from core.assess.girder_assumptions import GENERAL, member_rows
from core.assess.inputs import DEPTH_WORDS, web_geometry
from core.assess.options import AssessOptions
from core.assess.results import Assumption, MemberResult
from core.checks.results import ENGINEER, PRACTICE
from core.families.base import Choice, Family
from core.survey.model import Survey
from core.units import show


def _len(mm: float, system: str) -> str:
    """A length in the survey's display unit (and mm where that is not mm)."""
    v = show(mm, "length", system)
    return f"{v.value:.4g} {v.symbol}" + ("" if v.unit == "mm" else f" ({mm:.4g} mm)")


def _a(c: Choice) -> Assumption:
    return Assumption(c.item, c.value, c.source)


def assumptions(
    survey: Survey,
    material_notes: list[Choice],
    family: Family,
    opts: AssessOptions,
    members: list[MemberResult],
) -> list[Assumption]:
    """The assumptions page's rows, in order: family, documents, factors, choices, member
    factors and loads, methods."""
    std_src = ENGINEER if (opts.standard or survey.survey.standard) else PRACTICE
    out = [Assumption("standard family", family.name, std_src)]
    for d in family.documents:
        src = "the family points to this document" if d.pointer else "document of the family"
        out.append(Assumption(f"document: {d.title}", f"{d.edition}: {d.role}", src))
    for f in family.factors.values():
        out.append(Assumption(f"factor {f.symbol}", f"{f.value:.4g}: {f.description}", f.source))
    out += [_a(c) for c in family.choices]
    out += [_a(c) for c in material_notes]
    seen: set[str] = set()
    for m, rec in zip(members, survey.members, strict=True):
        out += member_rows(m, survey.survey.unit_system)
        for f in m.factors:
            out.append(
                Assumption(
                    f"member {m.member}: {f.symbol}", f"{f.value:.4g}: {f.description}", f.source
                )
            )
        cases = family.rules.live_cases(rec, survey, opts)
        for c in cases:
            model = c.model
            lines = model.assumptions(rec.span_mm()) if c.key == "lm71" else model.assumptions()
            for ln in lines:
                key = f"{ln.item}|{ln.value}"
                if key not in seen:
                    seen.add(key)
                    out.append(Assumption(ln.item, ln.value, ln.source))
        if not cases and not any(s.loads for s in rec.stations):
            out.append(
                Assumption(f"member {m.member}: live load", "none: capacity ratios only", ENGINEER)
            )
        if m.stations:
            web = web_geometry(m.stations[0].built.definition)
            D, _, words = web.depth(family.depth_basis)
            system = survey.survey.unit_system
            others = [
                f"{DEPTH_WORDS[b]} {_len(web.depth(b)[0], system)}"
                for b in ("clear", "rivet_lines", "web")
                if b != family.depth_basis and (b != "rivet_lines" or web.y_lines)
            ]
            out.append(
                Assumption(
                    f"member {m.member}: web depth for shear",
                    f"{_len(D, system)} ({words}); selectable: " + "; ".join(others),
                    ENGINEER
                    + f" (depth basis '{family.depth_basis}'"
                    + (
                        ", the default: the safe choice for a riveted web)"
                        if family.depth_basis == "clear"
                        else ")"
                    ),
                )
            )
    out += [
        Assumption(
            "thickness used for A, I, Q",
            f"{opts.thickness_policy} of the readings per part region, each reading capped at "
            "nominal first (one above nominal never raises the value used)",
            ENGINEER + " (default: mean)",
        ),
        Assumption(
            "part with no reading at a station",
            "taken at its nominal thickness there, with no loss counted (not conservative "
            "where it has corroded); flagged for review and listed under 'Not measured'",
            "asfound's rule; engineer to confirm",
        ),
        Assumption(
            "thickness used for rivet bearing", "minimum of the readings per part region", PRACTICE
        ),
        Assumption(
            "uniform thickness reading",
            "thins the exposed faces only; faying faces (e.g. the web gripped between the "
            "flange angles) keep their place",
            PRACTICE,
        ),
        Assumption(
            "web shear (buckling and yield)",
            "the panel-representative web thickness: the "
            + ("least" if opts.thickness_policy == "minimum" else "mean")
            + " of the whole-web readings of every station in the panel between stiffeners "
            "(of the station alone for an unstiffened web); bands are left to the local check",
            ENGINEER + " (basis stated by asfound; the family's clause for the panel)",
        ),
        Assumption(
            "local web shear (bands, perforations, thinning)",
            "at every station whose web has loss: (a) the cut-average shear stress VQ/(I t) at "
            "the thinnest cut of the as-found section reaching the family's shear yield "
            "stress (elastic, no redistribution: conservative; not applicable where the web is "
            "cut through) and (b) the plastic shear of the net vertical section of the web over "
            "the depth used for shear; the lower governs, both are shown",
            "the family's shear yield clause (see the clauses of the checks); asfound's basis "
            "for a local loss",
        ),
        Assumption(
            "effective rivets",
            ", ".join(opts.effective_states)
            + " (missing, loose or headless rivets otherwise carry nothing)",
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
            "rivet lines of one interface",
            "lines sharing the same outside parts (the left and right cover plate lines of a "
            "flange) add their resistances, left plus right, each with its own local gap",
            "mechanics of built-up beams (q = VQ/I), common practice",
        ),
        Assumption(
            "rivet bearing plies",
            "in double shear the middle ply bears the whole rivet force, each outer ply half; "
            "each ply at its minimum measured thickness",
            PRACTICE,
        ),
        Assumption(
            "flexure",
            "first yield (or the family's class-based resistance) on the gross section (rivet "
            "holes filled); the net section with its holes enters only the tension flange check",
            PRACTICE,
        ),
        Assumption(
            "shear stress and shear flow",
            "gross section (rivet holes filled); VQ/It not applicable where the loss splits it",
            PRACTICE,
        ),
        Assumption(
            "tension flange",
            "the bottom flange in sagging, the top one in hogging; its holes at their nominal "
            "diameter",
            PRACTICE,
        ),
        Assumption(
            "panel kind",
            "unstiffened without stiffeners between the ends; the end panel next to each member "
            "end; interior otherwise (tension field as the web panels row says)",
            PRACTICE,
        ),
        Assumption(
            "load effects",
            "the station's own loads where given; else the member's uniform dead loads and the "
            "family's live load cases moved over the simple span by influence lines, each "
            "envelope with the load position that gives it; live shear of the dead-load sense",
            "statics of a simply supported span (common practice)",
        ),
    ]
    out += list(GENERAL)
    out += [_a(c) for c in family.rules.girder_notes()]
    return out
