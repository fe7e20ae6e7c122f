"""The report's pages of a member's girder details: the girder ends (drawings and their
limit states), the intermediate stiffeners and web panels, and the fatigue lives."""

from __future__ import annotations

from reportlab.platypus import CondPageBreak, KeepTogether, Paragraph, Table, TableStyle

from core.assess.detailsout import life_words
from core.assess.results import MemberResult
from core.report.fmt import position, position_label, prose, ratio, rf, unit_label, value
from core.report.girderend import elevation, stiffener_plan
from core.report.page import PageInfo, Tracked
from core.report.styles import Styles, esc, level_markup
from core.report.tables import caption, grid, limit_level


def _knife(s) -> tuple[float, float] | None:
    """Height range of the station's web loss bands in the web's lower half, mm."""
    defn = s.built.definition
    web = max(defn.parts, key=lambda p: p.bounds[3] - p.bounds[1])
    _, y0, _, y1 = web.bounds
    bands = [b for b in s.found.loss.bands if b.part == web.id and b.lo < 0.5 * (y0 + y1)]
    if not bands:
        return None
    return min(b.lo for b in bands), max(b.hi for b in bands)


def girder_ends(
    st: Styles, m: MemberResult, system: str, width: float, info: PageInfo, sym: str
) -> list:
    """Per support: the girder end drawn, and its limit states at the station that takes it."""
    d = m.details
    if d is None or not d.supports:
        return []
    from core.assess.inputs import web_geometry

    out: list = []
    head = [Paragraph("Girder ends", st.h2)]
    defn = m.stations[0].built.definition if m.stations else None
    if defn is None:
        return []
    web = web_geometry(defn)
    for sup in d.supports:
        s = next(
            (s for s in m.stations if any(ls.key.endswith(f":{sup.id}") for ls in s.limit_states)),
            None,
        )
        w_el = width * 0.62 if sup.stiffener is not None else width
        el = Tracked(
            elevation(sup, defn, web, m.span, system, w_el, 190, _knife(s) if s else None),
            f"girder-end-{sup.id}",
            info,
        )
        cells = [el]
        widths = [w_el]
        if sup.stiffener is not None:
            plan = stiffener_plan(sup.stiffener, defn.part(web.web_id).t, system, width - w_el, 190)
            if plan is not None:
                cells.append(Tracked(plan, f"stiffener-{sup.stiffener.id}", info))
                widths.append(width - w_el)
        row = Table([cells], colWidths=widths)
        row.setStyle(
            TableStyle(
                [("LEFTPADDING", (0, 0), (-1, -1), 0), ("RIGHTPADDING", (0, 0), (-1, -1), 0)]
            )
        )
        words = (
            f"Support {esc(sup.id)} at {position(sup.x, system)} {position_label(system)}: "
            f"bearing length N = {value(sup.N, 'length', system)} {unit_label('length', system)}, "
            f"{esc(sup.stiffener_words)}"
        )
        if sup.stiffener is not None:
            words += f"; end loss: {esc(sup.stiffener.loss_words)}"
        block = [*head, Paragraph(words, st.body), row]
        head = []
        if s is None:
            block.append(
                Paragraph(
                    "No station within one web depth of this support: its girder end is not "
                    "checked (see the flags).",
                    st.small,
                )
            )
        else:
            u = unit_label("force", system)
            rows = []
            for ls in s.limit_states:
                if not ls.key.endswith(f":{sup.id}"):
                    continue
                rows.append(
                    [
                        ls.name,
                        value(ls.C_built, "force", system),
                        value(ls.C_found, "force", system),
                        ratio(ls.ratio),
                        value(ls.demand, "force", system),
                        rf(ls.measure),
                        level_markup(limit_level(s, ls), bold=False),
                    ]
                )
            h = [
                "limit state",
                f"factored as-built ({u})",
                f"factored as-found ({u})",
                "ratio",
                f"factored reaction ({u})",
                sym,
                "level",
            ]
            cw = [0.3, 0.12, 0.12, 0.08, 0.12, 0.08, 0.18]
            block.append(
                caption(
                    st,
                    f"Girder end limit states at support {sup.id}, checked with the web of station "
                    f"{s.station} (x = {position(s.x, system)} {position_label(system)})",
                    system,
                )
            )
            block.append(grid(st, h, rows, [width * x for x in cw], range(1, 6)))
        out.append(KeepTogether(block))
    out.append(
        Paragraph(
            "Elevation: steel grey, the bearing stiffener outlined with its loss bands tinted "
            "(lighter where the whole stiffener reads thinner), the bearing under the bottom flange with its length N, the girder's end "
            "beyond the bearing's centre line. Plan: the stiffener cut through its bottom end, "
            "as found over its as-built outline (loss tinted), with a strip of the web.",
            st.caption,
        )
    )
    return out


def stiffener_tables(st: Styles, m: MemberResult, system: str, width: float) -> list:
    """The intermediate stiffeners (what each may count) and the web panels as found."""
    p = m.panels
    if p is None:
        return []
    out = []
    pu = position_label(system)
    if p.checks:
        by: dict[str, dict] = {}
        for c in p.checks:
            by.setdefault(c.stiffener.id, {"st": c.stiffener})[c.state] = c.result

        def yn(r) -> str:
            if r is None:
                return "–"
            if not r.stiffened:
                return "does not bound a panel"
            return (
                "panel, tension field" if p.tension_field and r.tension_field else "bounds a panel"
            )

        rows = []
        for v in by.values():
            f = v.get("found")
            rows.append(
                [
                    v["st"].id,
                    position(v["st"].x, system),
                    yn(v.get("built")),
                    yn(f),
                    prose("; ".join(f.reasons), system) if f is not None and f.reasons else "–",
                    v["st"].loss_words,
                ]
            )
        out += [
            CondPageBreak(150),
            Paragraph("Intermediate stiffeners and web panels", st.h2),
            caption(
                st,
                "What each intermediate stiffener may count by the family's requirements, "
                "as-built and with its measured loss",
                system,
            ),
            grid(
                st,
                ["stiffener", f"x ({pu})", "as-built", "as-found", "why not (as found)", "loss"],
                rows,
                [width * x for x in (0.09, 0.07, 0.14, 0.14, 0.33, 0.23)],
                (1,),
            ),
        ]
    rows = [[position(x.a, system), position(x.b, system), x.kind, x.words] for x in p.found]
    out += [
        caption(st, "Web panels as found: their bounds and whether tension field counts", system),
        grid(
            st,
            [f"from ({pu})", f"to ({pu})", "panel", "why"],
            rows,
            [width * x for x in (0.1, 0.1, 0.12, 0.68)],
            (0, 1),
        ),
    ]
    return out


def fatigue_lives(st: Styles, m: MemberResult, system: str, width: float) -> list:
    """The fatigue life of the riveted detail at each station."""
    rows = []
    u = unit_label("stress", system)
    for s in m.stations:
        for ls in s.limit_states:
            if ls.key != "fatigue":
                continue
            e = ls.extra
            rows.append(
                [
                    s.station,
                    position(s.x, system),
                    value(e["stress_range_built_MPa"], "stress", system),
                    value(e["stress_range_found_MPa"], "stress", system),
                    value(ls.demand, "stress", system),
                    value(ls.C_found, "stress", system),
                    life_words(e),
                ]
            )
    if not rows:
        return []
    h = [
        "station",
        f"x ({position_label(system)})",
        f"stress range as-built ({u})",
        f"stress range as-found ({u})",
        f"design range ({u})",
        f"infinite-life limit ({u})",
        "fatigue life",
    ]
    return [
        caption(
            st,
            "Fatigue of the riveted detail at the net section of the tension flange: the stress "
            "ranges from the family's fatigue load and the estimated life (y: years)",
            system,
        ),
        grid(
            st, h, rows, [width * x for x in (0.08, 0.07, 0.14, 0.14, 0.13, 0.14, 0.3)], range(1, 6)
        ),
    ]
