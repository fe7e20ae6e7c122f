"""The assumptions page's rows of the girder limit states: what each member's girder details
were (supports, bracing, stiffeners, U-frames, fatigue traffic) and the bases the
assessment took, in words no family owns; each family adds its own (``rules.girder_notes``).
"""

from __future__ import annotations

from core.assess.results import Assumption, MemberResult
from core.checks.results import ENGINEER, PRACTICE
from core.units import show

RECORD = "survey record (" + ENGINEER + ")"


def _len(mm: float, system: str) -> str:
    v = show(mm, "length", system)
    return f"{v.value:.4g} {v.symbol}"


def _pos(mm: float, system: str) -> str:
    v = show(mm, "position", system)
    return f"{v.value:.4g} {v.symbol}"


def member_rows(m: MemberResult, system: str) -> list[Assumption]:
    """The girder details of one member as the assessment used them."""
    d = m.details
    if d is None:
        return []
    out = []
    w = f"member {m.member}"
    if d.supports:
        txt = "; ".join(
            f"{s.id} at {_pos(s.x, system)}: N = {_len(s.N, system)}, overhang "
            f"{_len(s.overhang, system)}, {s.stiffener_words}"
            for s in d.supports
        )
        out.append(Assumption(f"{w}: supports", txt, RECORD))
    else:
        out.append(
            Assumption(
                f"{w}: supports",
                "not recorded: the girder ends are not checked",
                PRACTICE,
            )
        )
    for name, br in (("top", d.top), ("bottom", d.bottom)):
        pts = ", ".join(_pos(x, system) for x in br.points)
        txt = f"{br.words}; brace points {pts}"
        if br.frames is not None:
            fr = br.frames
            at = ", ".join(_pos(x + d.span_a, system) for x in fr.x)
            txt += f"; U-frames at {at}: " + (
                "stiffness Cd as entered"
                if fr.Cd is not None
                else "Cd = 1 / (hv³/(3 E Iv) + hv² bq/(2 E Iq)"
                + (" + hv²/Cj" if fr.Cj else "")
                + f") with hv {_len(fr.hv or 0.0, system)}, bq {_len(fr.bq or 0.0, system)}, "
                + (
                    f"the vertical stiffener {fr.vertical.id} (alone, as built and as found)"
                    if fr.vertical is not None
                    else "Iv as entered"
                )
            )
        src = RECORD if br.recorded else PRACTICE + " (not recorded: conservative)"
        out.append(Assumption(f"{w}: bracing of the {name} flange", txt, src))
    if d.stiffeners:
        nb = sum(1 for s in d.stiffeners if s.role == "bearing")
        lossy = [s.id for s in d.stiffeners if s.column_loss is not None]
        out.append(
            Assumption(
                f"{w}: stiffeners",
                f"{nb} bearing and {len(d.stiffeners) - nb} intermediate stiffener(s) recorded; "
                + (f"measured loss on {', '.join(lossy)}" if lossy else "no measured loss"),
                RECORD,
            )
        )
    if d.ADTT_SL is not None:
        out.append(
            Assumption(
                f"{w}: fatigue traffic",
                f"{d.ADTT_SL:g} trucks a day in one lane (average over the life)",
                RECORD,
            )
        )
    return out


GENERAL = (
    Assumption(
        "flexural resistance",
        "the least of the family's flexural limit states at each station (flange yielding, "
        "lateral-torsional and flange local buckling, the tension flange at its holes, and "
        "bending with shear where the family has it): each is shown and flagged with its "
        "measure; the least is the member's flexure in the rating summary",
        "the family's clauses; asfound's basis",
    ),
    Assumption(
        "compression flange",
        "the top flange in sagging, the bottom one in hogging, from the sign of the dead load "
        "moment at the station (station loads may be hogging; the simple spans sag)",
        PRACTICE,
    ),
    Assumption(
        "unbraced length and moment diagram",
        "between brace points, the supports always among them; not recorded: held at the "
        "supports only (conservative). The moment gradient from the family's factored design "
        "moment envelope at the segment's ends, quarter points and middle (an envelope's end "
        "values are never below one load position's: conservative); 1.0 with station loads "
        "only",
        PRACTICE,
    ),
    Assumption(
        "U-frames",
        "the chord (compression flange with a third of the compressed web) as a column on the "
        "frames' springs, held laterally at the supports; its critical force found once per "
        "member by finite elements, as built with the nominal chord and as found with the "
        "weakest station's chord over the whole length (conservative)",
        "Timoshenko and Gere, Theory of Elastic Stability, 2nd ed., Arts. 2.1, 2.9-2.10 "
        "(mechanics); the family's clause for the resistance",
    ),
    Assumption(
        "girder ends",
        "checked at the station nearest each support within one web depth (no station that "
        "near: not checked, flagged). The bearing stiffener in bearing (with its measured loss "
        "at the bottom end) and as a column (the weakest loss applied over its whole length, "
        "conservative); where no stiffener is recorded or none of it bears as found, the web "
        "at the bearing; rated against the support reaction from the load model",
        PRACTICE,
    ),
    Assumption(
        "web at the bearing",
        "the least of the station's whole-web readings and of the loss bands in the web's "
        "lower half (the knife line above the bottom angles); a perforation there: no "
        "resistance counted. The flange's k and tf: its horizontal material only (cover plates "
        "and the angles' horizontal legs), the least spread (conservative)",
        PRACTICE,
    ),
    Assumption(
        "stiffener loss",
        "from the stiffener's readings (by the thickness basis, capped at nominal) and its "
        "loss bands (thickness and width lost at the toes); the bearing takes the loss at the "
        "bottom end, the column and the intermediate stiffener requirement the weakest",
        PRACTICE,
    ),
    Assumption(
        "web panels and tension field",
        "panels between the recorded stiffeners; an intermediate stiffener that fails the "
        "family's requirement with its measured loss does not bound a panel (its two panels "
        "become one); tension field only in an interior panel whose two stiffeners meet the "
        "family's requirement for it, else the panel is checked without and its note says why; "
        "with only the spacing recorded, the web counts as stiffened but without tension field",
        PRACTICE + " (the family's clauses for the requirements)",
    ),
)
