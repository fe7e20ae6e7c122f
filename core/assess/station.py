"""The checks at one station, as-built against as-found."""

from __future__ import annotations

from dataclasses import dataclass, replace

from core.assess.inputs import Effects, WebGeometry, flange_proportions
from core.assess.options import AssessOptions
from core.assess.results import LimitState, LineSummary
from core.assess.rivetlines import local_gap, rivet_capacity
from core.checks import web_shear
from core.checks.flags import (
    Flag,
    flag_capacity_ratio,
    flag_not_applicable,
    flag_rating_factor,
    flag_section_loss,
)
from core.checks.flexure import tension_flange_net_section, yield_moment
from core.checks.material import Material
from core.checks.rating import rating_factor
from core.definition import SectionDefinition, StationLoss
from core.section import StationSection


@dataclass(frozen=True)
class StationInput:
    """What the checks of one station need (mm, N, MPa)."""

    defn: SectionDefinition
    built: StationSection
    found: StationSection
    loss_local: StationLoss
    web: WebGeometry
    material: Material
    standard: str
    panel: str
    do: float | None
    x: float
    span: float
    effects: Effects | None
    where: str


def depth_used(web: WebGeometry, standard: str, basis: str) -> tuple[float, str]:
    """The web depth the shear check uses and why (an assumption the report shows)."""
    use_lines = basis == "rivet_lines" or (basis == "auto" and standard == "aisc")
    if use_lines and web.D_lines is not None:
        return web.D_lines, "distance between the web-to-flange rivet lines"
    return web.D_web, "web plate depth"


def web_thickness(si: StationInput) -> tuple[float, str]:
    """As-found web thickness for the panel's shear check: the web's remaining (mean)
    thickness at the station. Loss bands are checked separately by the thinnest cut
    (:func:`local_shear_limit_state`)."""
    web = si.defn.part(si.web.web_id)
    for th in si.found.loss.thickness:
        if th.part == web.id and th.leg is None:
            return th.t, "mean of the web readings"
    return web.t, "nominal (no web reading at this station)"


def local_shear_limit_state(si: StationInput, panel: LimitState) -> LimitState | None:
    """Shear at the thinnest cut of the web, asfound's own method (no source): a loss band
    raises the peak average shear stress tau = V Q / (I t) from k_built V to k_found V; the
    as-built panel resistance is reduced by k_built / k_found. None when the section is
    split (VQ/It is not applicable) or nothing was found."""
    if not si.found.shear_applicable or panel.C_built is None:
        return None
    k_b = si.built.gross.profile.tau_max(1.0)
    k_f = si.found.gross.profile.tau_max(1.0)
    if k_f[0] <= 0:
        return None
    factor = min(k_b[0] / k_f[0], 1.0)
    return LimitState(
        "web_local",
        "web shear at the thinnest cut",
        "force",
        panel.built,
        panel.found,
        panel.C_built,
        panel.C_built * factor,
        note=(
            f"as-built resistance times tau_max,built / tau_max,found = {factor:.3g} "
            f"(peak VQ/It at {k_f[1]:.0f} mm as-found; asfound method, no source: "
            "for the engineer to review)"
        ),
    )


def _rate(
    ls: LimitState,
    res,
    Rn_found: float,
    dc: float,
    dw: float,
    ll: float,
    kind: str,
    opts: AssessOptions,
    where: str,
) -> LimitState:
    if ll <= 0.0 or res is None:
        return ls
    r = rating_factor(
        phi=res.phi,
        Rn=Rn_found,
        DC=dc,
        DW=dw,
        LL_IM=ll,
        factors=opts.rating,
        kind=kind,
        where=where,
    )
    f = opts.rating
    demand = f.gDC * dc + f.gDW * dw + f.gLL * ll
    return LimitState(
        ls.key, ls.name, ls.kind, ls.built, ls.found, ls.C_built, ls.C_found, demand, r, ls.note
    )


def shear_limit_state(si: StationInput, opts: AssessOptions) -> tuple[LimitState, str, float]:
    """Web shear with buckling per the chosen standard, as-built and as-found."""
    D, why_D = depth_used(si.web, si.standard, opts.depth_basis)
    tw, why_t = web_thickness(si)
    if not si.found.shear_applicable:
        # the thinnest-cut check cannot run on a split section: the thinnest band governs
        bands = [b for b in si.found.loss.bands if b.part == si.web.web_id and 0.0 < b.t < tw]
        if bands:
            b = min(bands, key=lambda b: b.t)
            tw, why_t = b.t, f"loss band {b.lo:g} to {b.hi:g} mm governs the cut-through panel"
    kw = {"d": si.web.d_overall} if si.standard == "aisc" else {}
    sides = {}
    for label, st, t in (
        ("built", si.built, si.defn.part(si.web.web_id).t),
        ("found", si.found, tw),
    ):
        bfc, tfc = flange_proportions(si.defn, si.web.top_parts, st.gross.part_area)
        bft, tft = flange_proportions(si.defn, si.web.bottom_parts, st.gross.part_area)
        res = web_shear(
            si.standard,
            Fy=si.material.Fy,
            E=si.material.E,
            D=D,
            tw=t,
            panel=si.panel,
            do=si.do,
            bfc=bfc or None,
            tfc=tfc or None,
            bft=bft or None,
            tft=tft or None,
            where=f"{si.where} / web shear ({label})",
            **kw,
        )
        if label == "found" and not st.shear_applicable:
            # the web is cut through: keep the buckling of the full panel, credit only the
            # remaining depth (a shorter D would wrongly lower the slenderness)
            cut = sum(p.hi - p.lo for p in st.loss.perforations if p.part == si.web.web_id)
            cut += sum(b.hi - b.lo for b in st.loss.bands if b.part == si.web.web_id and b.t == 0)
            share = max(D - cut, 0.0) / D
            res = replace(
                res,
                Rn=res.Rn * share,
                notes=(
                    *res.notes,
                    (
                        f"web cut through over {cut:.0f} mm: resistance of the full panel times the "
                        f"remaining depth share {share:.3f} (asfound estimate, no source)"
                    ),
                ),
            )
        sides[label] = res
    capped = sides["found"].Rn > sides["built"].Rn
    if capped:
        # only loss was applied, yet a branch switch of the standard (e.g. the tension-field
        # proportion limit) gives more: report no more than as-built
        sides["found"] = replace(
            sides["found"],
            Rn=sides["built"].Rn,
            notes=(
                *sides["found"].notes,
                "as-found resistance capped at the as-built value (the standard's branch changed "
                "with the loss)",
            ),
        )
    note = f"D = {why_D}; as-found tw {tw:.3g} mm ({why_t})"
    if capped:
        note += "; as-found capped at as-built (the standard's branch changed with the loss)"
    if not si.found.shear_applicable:
        note += (
            "; web perforated or worn through: as-found resistance is the full panel's times "
            "the remaining depth share, an estimate for the engineer to review"
        )
    ls = LimitState(
        "web_shear",
        "web shear",
        "force",
        sides["built"],
        sides["found"],
        sides["built"].Rr,
        sides["found"].Rr,
        note=note,
    )
    e = si.effects
    if e is not None and e.has_shear:
        ls = _rate(
            ls, sides["found"], sides["found"].Rn, e.V_DC, e.V_DW, e.V_LL, "force", opts, si.where
        )
    return ls, why_D, tw


def flexure_limit_states(si: StationInput, opts: AssessOptions) -> list[LimitState]:
    """First-yield moment (gross section) and the tension flange at its rivet holes
    (bottom flange in tension: sagging moment assumed)."""
    res = {}
    for label, st in (("built", si.built), ("found", si.found)):
        p = st.gross.props
        res[label] = yield_moment(
            Fy=si.material.Fy,
            S_top=p.S_top,
            S_bottom=p.S_bot,
            where=f"{si.where} / flexure ({label})",
        )
    my = LimitState(
        "flexure",
        "yield moment",
        "moment",
        res["built"],
        res["found"],
        res["built"].Rr,
        res["found"].Rr,
        note="first yield of the gross section, My = Fy S",
    )
    out = [my]
    tf = {}
    ids = si.web.bottom_parts
    for label, st in (("built", si.built), ("found", si.found)):
        Ag = sum(st.gross.part_area[i] for i in ids)
        An = sum(st.net.part_area[i] for i in ids)
        if Ag <= 0 or An >= Ag:
            return _rate_flexure(out, si, opts)
        r = tension_flange_net_section(
            An=An,
            Ag=Ag,
            Fu=si.material.Fu,
            Fyt=si.material.Fy,
            where=f"{si.where} / tension flange ({label})",
        )
        tf[label] = (r, r.Rr * st.gross.props.S_bot, r.Rn * st.gross.props.S_bot)
    out.append(
        LimitState(
            "tension_flange",
            "tension flange at holes",
            "moment",
            tf["built"][0],
            tf["found"][0],
            tf["built"][1],
            tf["found"][1],
            note="gross-section stress limit at the rivet holes times the gross modulus to the "
            "bottom fibre (bottom flange in tension)",
        )
    )
    return _rate_flexure(out, si, opts, tf.get("found"))


def _rate_flexure(
    out: list[LimitState], si: StationInput, opts: AssessOptions, tf_found=None
) -> list[LimitState]:
    e = si.effects
    if e is None or not e.has_moment:
        return out
    rated = []
    for ls in out:
        if ls.key == "flexure":
            rated.append(
                _rate(ls, ls.found, ls.found.Rn, e.M_DC, e.M_DW, e.M_LL, "moment", opts, si.where)
            )
        elif tf_found is not None:
            rated.append(
                _rate(ls, ls.found, tf_found[2], e.M_DC, e.M_DW, e.M_LL, "moment", opts, si.where)
            )
        else:
            rated.append(ls)
    return rated


def rivet_limit_states(
    si: StationInput, lines: dict[str, LineSummary], opts: AssessOptions
) -> list[LimitState]:
    """Each rivet line that carries shear flow: its shear flow resistance
    q_r = n_lines phi Rn / gap (N/mm), as-built with the nominal pitch and thicknesses,
    as-found with the local longest effective gap and the measured plies. The demand is the
    factored shear flow q = Vu Q_out / I; the rating uses the shear force the line can
    transfer, V = q_r I / Q_out, so that the change of I and Q with the loss counts."""
    out = []
    window = opts.gap_window or si.web.D_web
    for line in si.defn.rivet_lines:
        if not line.outside:
            continue
        w = f"{si.where} / rivet line {line.id!r}"
        rb = rivet_capacity(si.defn, line, None, si.material.Fu, w)
        rf = rivet_capacity(si.defn, line, si.loss_local, si.material.Fu, w)
        C_b = line.n_lines * rb.Rr / line.pitch
        gap, why = local_gap(lines[line.id], opts.effective_states, si.x, window, si.span)
        C_f = None
        I_over_Q = None
        if not si.found.shear_applicable:
            why = "not applicable: " + si.found.finding.removeprefix("not applicable: ")
        elif gap is None or gap <= 0:
            C_f = 0.0
            why = "no effective rivet on the line: no load path"
        else:
            C_f = line.n_lines * rf.Rr / gap
        if si.found.shear_applicable:
            I_over_Q = si.found.gross.props.Ix / abs(si.found.gross.Q_of(line.outside))
        ls = LimitState(
            f"rivets:{line.id}",
            f"rivet line {line.id}",
            "force_per_length",
            rb,
            rf,
            C_b,
            C_f,
            note=f"shear flow resistance n phi Rn / gap; {why}",
        )
        e = si.effects
        if e is not None and e.has_shear and C_f is not None and I_over_Q is not None:
            f = opts.rating
            Rn_V = (C_f / rf.phi) * I_over_Q
            r = rating_factor(
                phi=rf.phi,
                Rn=Rn_V,
                DC=e.V_DC,
                DW=e.V_DW,
                LL_IM=e.V_LL,
                factors=f,
                kind="force",
                where=w,
            )
            q_u = (f.gDC * e.V_DC + f.gDW * e.V_DW + f.gLL * e.V_LL) / I_over_Q
            ls = LimitState(ls.key, ls.name, ls.kind, rb, rf, C_b, C_f, q_u, r, ls.note)
        out.append(ls)
    return out


def station_flags(
    si: StationInput,
    limit_states: list[LimitState],
    part_loss: dict[str, float],
    opts: AssessOptions,
) -> list[Flag]:
    """Flags of a station: section loss per part, capacity ratio and rating factor per limit
    state, and any check that cannot be made."""
    th = opts.thresholds
    flags = []
    for pid, pct in part_loss.items():
        if pct > 0.05:
            flags.append(flag_section_loss(f"{si.where} / part {pid!r}", min(pct, 100.0), th))
    if not si.found.shear_applicable:
        reason = si.found.finding.removeprefix("not applicable: ")
        flags.append(flag_not_applicable(f"{si.where} / shear stress VQ/It", reason))
    for ls in limit_states:
        subj = f"{si.where} / {ls.name}"
        if ls.ratio is not None:
            flags.append(flag_capacity_ratio(subj, ls.ratio, th))
        if ls.RF is not None:
            flags.append(flag_rating_factor(subj, ls.RF, th))
    return flags


def part_loss_percent(built: StationSection, found: StationSection) -> dict[str, float]:
    """Section loss of each part: 100 (1 - A as-found / A as-built) on the gross section."""
    out = {}
    for pid, a in built.gross.part_area.items():
        out[pid] = 100.0 * (1.0 - found.gross.part_area.get(pid, 0.0) / a) if a > 0 else 0.0
    return out


def checks_at(
    si: StationInput, lines: dict[str, LineSummary], opts: AssessOptions
) -> tuple[list[LimitState], list[Flag], dict[str, float], float, float]:
    """All limit states and flags of one station; (limit states, flags, part loss %, D, tw)."""
    shear, _, tw = shear_limit_state(si, opts)
    D, _ = depth_used(si.web, si.standard, opts.depth_basis)
    local = local_shear_limit_state(si, shear)
    e = si.effects
    if local is not None and e is not None and e.has_shear:
        Rn = local.C_found / shear.built.phi
        local = _rate(local, shear.built, Rn, e.V_DC, e.V_DW, e.V_LL, "force", opts, si.where)
    states = [
        shear,
        *([local] if local else []),
        *flexure_limit_states(si, opts),
        *rivet_limit_states(si, lines, opts),
    ]
    loss = part_loss_percent(si.built, si.found)
    flags = station_flags(si, states, loss, opts)
    return states, flags, loss, D, tw
