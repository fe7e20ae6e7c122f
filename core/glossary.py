"""The one vocabulary of asfound: every name the app, the command line, the JSON and the report
show for a flag level, a rivet state, a limit state, a part kind and an angle leg (pure Python).

Each thing has one name, one plain description and, for flag levels and rivet states, one
shape and one colour. The shapes carry the meaning on their own (a grey-scale print, a
colour-blind reader, sun glare); the colour only repeats it. The shapes are asfound's own
choice: rivets are round things, so the rivet states are circles filled, half-filled, open
(the empty hole), with a filled square for a rivet without its head; the flag levels rise
from an open diamond to a heavy cross. The two sets share no shape.

``FORBIDDEN`` lists words that other vocabularies use for the same things; the glossary
test (``tests/cli/test_glossary.py``) fails when one of them reaches a user-facing string.
"""

from __future__ import annotations

import re
from dataclasses import dataclass


@dataclass(frozen=True)
class Term:
    """One thing and its one name.

    Attributes:
        key: the id in files, JSON and code (snake case of ``name`` for limit states).
        name: the words shown everywhere.
        description: one plain sentence for a legend or a help text.
        shape: the shape in words ("open circle"); empty where the thing has no mark.
        glyph: the shape as one character (DejaVu Sans has them all), for text lines.
        letter: the letter drawn with a rivet mark.
        colour: the mark's colour, "#rrggbb" (never alone: shape and words come with it).
        tint: a light ground in the level's colour (app notices).
    """

    key: str
    name: str
    description: str
    shape: str = ""
    glyph: str = ""
    letter: str = ""
    colour: str = ""
    tint: str = ""

    def __post_init__(self) -> None:
        if not self.key or not self.name or not self.description:
            raise ValueError(f"glossary term {self!r} needs a key, a name and a description")
        if self.colour and not re.fullmatch(r"#[0-9a-f]{6}", self.colour):
            raise ValueError(f"glossary colour {self.colour!r} of {self.key} is not #rrggbb")


def snake(name: str) -> str:
    """A printed name in snake case: "lateral-torsional buckling" -> "lateral_torsional_buckling"."""
    return re.sub(r"[^a-z0-9]+", "_", name.lower()).strip("_")


def rgba(colour: str, alpha: float = 1.0) -> tuple[float, float, float, float]:
    """``"#rrggbb"`` as an RGBA tuple in 0..1 (kivy's colours)."""
    return (*(int(colour[i : i + 2], 16) / 255 for i in (1, 3, 5)), alpha)


#: flag levels, in rising order (index = ``core.checks.flags.Level``)
LEVELS: tuple[Term, ...] = (
    Term(
        "within_limits",
        "within limits",
        "no threshold crossed; nothing to do beyond the usual inspection cycle",
        "open diamond",
        "◇",
        colour="#3b7a57",
        tint="#d6f0d6",
    ),
    Term(
        "keep_watching",
        "keep watching",
        "the first threshold crossed; measure again at the next inspection",
        "filled diamond",
        "◆",
        colour="#8a6d00",
        tint="#fff2b3",
    ),
    Term(
        "engineer_to_review",
        "engineer to review",
        "a licensed engineer reviews this finding before the member is rated",
        "filled triangle",
        "▲",
        colour="#c0561b",
        tint="#ffd199",
    ),
    Term(
        "needs_immediate_attention",
        "needs immediate attention",
        "the owner is told at once; the engineer decides on restrictions",
        "heavy cross",
        "✖",
        colour="#a11d2e",
        tint="#ffb8b8",
    ),
)

#: the level of a whole station, member or survey (the highest of its flags)
OVERALL_LEVEL = "overall flag level"

#: rivet states, as in the survey file
RIVET_STATES: dict[str, Term] = {
    t.key: t
    for t in (
        Term(
            "sound",
            "sound",
            "head and shank in place, tight under a hammer tap",
            "filled circle",
            "●",
            "S",
            "#2f6b35",
        ),
        Term(
            "loose",
            "loose",
            "in place but moves or rings loose under a hammer tap",
            "half-filled circle",
            "◐",
            "L",
            "#b87400",
        ),
        Term(
            "missing",
            "missing",
            "gone: an empty rivet hole",
            "open circle",
            "○",
            "M",
            "#b51a1a",
        ),
        Term(
            "headless",
            "headless",
            "shank in the hole but a head corroded or broken off",
            "filled square",
            "■",
            "H",
            "#6b2f8f",
        ),
    )
}

#: limit states: key (snake case of the name) -> the name printed in every output
LIMIT_STATES: dict[str, Term] = {
    t.key: t
    for t in (
        Term("web_shear", "web shear", "shear resistance of a web panel, with web buckling"),
        Term(
            "local_web_shear",
            "local web shear",
            "shear on the thinnest web at the station (a loss band), no tension field",
        ),
        Term("flange_yield", "flange yield", "yield moment at the flanges"),
        Term(
            "lateral_torsional_buckling",
            "lateral-torsional buckling",
            "the compression flange buckling sideways between its braces",
        ),
        Term(
            "flange_local_buckling",
            "flange local buckling",
            "the outstanding parts of the compression flange buckling locally",
        ),
        Term(
            "web_bend_buckling",
            "web bend-buckling",
            "the web buckling under bending stress (service; not rated)",
        ),
        Term(
            "tension_flange_at_holes",
            "tension flange at holes",
            "the tension flange at its rivet holes (net section)",
        ),
        Term("bending", "bending", "bending resistance of the cross-section"),
        Term("bending_and_shear", "bending and shear", "bending and shear together"),
        Term("flexure", "flexure", "the least of the flexural limit states above"),
        Term(
            "stiffener_bearing",
            "stiffener bearing",
            "bearing of a bearing stiffener's ends on the flange",
        ),
        Term(
            "stiffener_column",
            "stiffener column",
            "a bearing stiffener with a strip of web as a column",
        ),
        Term("rivets", "rivets", "shear and bearing of the rivets of a rivet line"),
        Term("fatigue", "fatigue", "fatigue of a riveted detail under the traffic given"),
    )
}

#: part kinds of a built-up section
PART_KINDS: dict[str, Term] = {
    t.key: t
    for t in (
        Term("web", "web", "the vertical plate between the flanges"),
        Term(
            "flange_angle",
            "flange angle",
            "one of the four angles riveted to the web that, with any cover plates, make a flange",
        ),
        Term("cover_plate", "cover plate", "a plate riveted across the flange angles"),
        Term("plate", "plate", "any other plate of the section"),
        Term("angle", "angle", "any other angle of the section"),
    )
}

#: the legs of an angle, as in the survey file (region "h" or "v")
LEGS: dict[str, Term] = {
    "h": Term("h", "horizontal leg", "the leg that lies along the flange, across the web"),
    "v": Term("v", "vertical leg", "the leg that lies against the web"),
}

#: other nouns that must mean one thing
NOUNS: dict[str, Term] = {
    t.key: t
    for t in (
        Term(
            "perforation",
            "perforation",
            "a hole corroded through a plate (a rivet hole is never called a perforation)",
        ),
        Term(
            "loss_band",
            "loss band",
            "a height range of a plate with one remaining thickness",
        ),
        Term(
            "field_store",
            "field store",
            "the SQLite file of a survey that the app and the command line edit "
            "(extension .sqlite; every entry committed as it is made)",
        ),
        Term(
            "survey_file",
            "survey file",
            "the JSON interchange file of a survey (asfound.survey; extension .json)",
        ),
        Term(
            "rating_level",
            "rating level",
            "the load rating level: inventory, operating, legal or permit (not a flag level)",
        ),
        Term(
            "flag",
            "flag",
            "a result graded by a flag level, naming the number that drove it",
        ),
        Term(
            "problem",
            "problem",
            "an error, warning or note that validation found in a survey file or field store",
        ),
        Term(
            "ratio",
            "ratio",
            "as-found capacity divided by as-built capacity",
        ),
    )
}

#: the field store's file extension (any name opens; this is what the app and import suggest)
STORE_SUFFIX = ".sqlite"

#: words other vocabularies use for our things: regex -> what to say instead. Matched
#: case-insensitively against user-facing text (kv files, app strings, CLI output, report).
FORBIDDEN: dict[str, str] = {
    r"(?<!rivet )(?<!rivet-)\bhole\b": "perforation (a rivet hole says 'rivet hole')",
    r"\bflat leg\b": "horizontal leg",
    r"\bupright leg\b": "vertical leg",
    r"\bleg,? on (?:the )?web\b": "vertical leg",
    r"\bverdict\b": OVERALL_LEVEL,
    r"\[(?:OK|WATCH|REVIEW|URGENT)\]": "the level's shape and words",
    r"\bfound / built\b": "ratio",
    r"\bsurvey store\b": "field store",
    r"\bstore file\b": "field store",
    r"--level\b": "--rating-level",
    r"\bfindings?\b": "flag (a graded result) or problem (from validation)",
}


def level(index: int) -> Term:
    """The glossary term of flag level ``index`` (0 within limits .. 3 needs immediate attention)."""
    return LEVELS[int(index)]


def forbidden_in(text: str) -> list[tuple[str, str, str]]:
    """Every forbidden word in ``text``: (the words found, the rule, what to say instead)."""
    out = []
    for rule, instead in FORBIDDEN.items():
        for m in re.finditer(rule, text, flags=re.IGNORECASE):
            out.append((m.group(0), rule, instead))
    return out
