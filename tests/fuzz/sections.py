"""Random section descriptions (``asfound.section``) for the fuzz of ``asfound section``.

Dimensions are drawn mostly from plausible ranges and sometimes from extreme ones; parts,
rivet lines and the loss are sometimes left out, sometimes of the wrong shape. The result is
the document's text (UTF-8 bytes).
"""

from __future__ import annotations

import json

from hypothesis import strategies as st

from tests.fuzz.mutate import EXTREME_NUMBERS


def _rare(n: int) -> st.SearchStrategy[bool]:
    """True one time in ``n`` (sampled_from is drawn evenly; integers lean to their ends)."""
    return st.sampled_from((False,) * (n - 1) + (True,))


def _num(lo: float, hi: float) -> st.SearchStrategy:
    """Mostly a number in ``lo`` to ``hi``; one time in thirty an extreme or any float."""
    odd = st.one_of(
        st.sampled_from(EXTREME_NUMBERS), st.floats(allow_nan=False, allow_infinity=False)
    )
    return _rare(30).flatmap(lambda k: odd if k else st.floats(lo, hi))


_PARTS = (
    "web",
    "angle_tl",
    "angle_tr",
    "angle_bl",
    "angle_br",
    "cover_top_1",
    "cover_bottom_1",
    "p1",
    "a1",
    "nope",
)


@st.composite
def girder(draw) -> dict:
    g = {
        "D": draw(_num(50, 3000)),
        "tw": draw(_num(3, 30)),
        "angle_h": draw(_num(40, 250)),
        "angle_v": draw(_num(40, 250)),
        "angle_t": draw(_num(4, 30)),
    }
    for key, lo, hi in (
        ("web_recess", 0, 20),
        ("rivet_d", 10, 30),
        ("rivet_hole", 10, 32),
        ("pitch_web", 0.001, 300),
        ("pitch_cover", 0.001, 300),
        ("gauge_web", 10, 200),
        ("gauge_cover", 10, 300),
    ):
        if draw(st.booleans()):
            g[key] = draw(_num(lo, hi))
    if draw(st.booleans()):
        g["covers_top"] = draw(st.lists(st.lists(_num(1, 600), min_size=0, max_size=3), max_size=4))
    if draw(st.booleans()):
        g["covers_bottom"] = draw(
            st.lists(st.lists(_num(1, 600), min_size=2, max_size=2), max_size=3)
        )
    if draw(st.booleans()):
        g["angle_bottom"] = draw(st.lists(_num(4, 250), min_size=0, max_size=4))
    return g


@st.composite
def part(draw) -> dict:
    kind = draw(st.sampled_from(("plate", "angle", "plate", "tube")))
    p: dict = {"kind": kind, "id": draw(st.sampled_from(_PARTS))}
    keys = ("b", "t", "x", "y") if kind != "angle" else ("b_h", "b_v", "t", "x", "y")
    for k in keys:
        if not draw(_rare(10)):
            p[k] = draw(_num(-500, 500))
    if kind == "plate" and draw(st.booleans()):
        p["orientation"] = draw(st.sampled_from(("horizontal", "vertical", "diagonal", 3)))
    if kind == "angle" and draw(st.booleans()):
        p["dir_x"] = draw(st.sampled_from((1, -1, 0, 2, "1", None, 1e300)))
    return p


@st.composite
def rivet_line(draw) -> dict:
    r: dict = {"id": draw(st.sampled_from(("web_top", "web_bottom", "l1", "l2")))}
    r["axis"] = draw(st.sampled_from(("horizontal", "vertical", "up")))
    for k, lo, hi in (("position", -500, 2000), ("d", 5, 40), ("d_hole", 5, 42), ("pitch", 1, 300)):
        if not draw(_rare(10)):
            r[k] = draw(_num(lo, hi))
    r["parts"] = draw(st.lists(st.sampled_from(_PARTS), max_size=4))
    if draw(st.booleans()):
        r["outside"] = draw(st.lists(st.sampled_from(_PARTS), max_size=3))
    if draw(st.booleans()):
        r["shear_planes"] = draw(st.sampled_from((1, 2, 0, 9, 1.5, "2", 10**30)))
    if draw(st.booleans()):
        r["n_lines"] = draw(st.sampled_from((1, 2, 0, 99, 2.5, None)))
    return r


@st.composite
def loss(draw) -> dict:
    out: dict = {}
    if draw(st.booleans()):
        out["thickness"] = draw(
            st.lists(
                st.fixed_dictionaries(
                    {"part": st.sampled_from(_PARTS), "t": _num(0.01, 30)},
                    optional={"leg": st.sampled_from(("h", "v", "x", None))},
                ),
                max_size=5,
            )
        )
    for key in ("bands", "perforations"):
        if draw(st.booleans()):
            item = {"part": st.sampled_from(_PARTS), "lo": _num(-100, 1500), "hi": _num(-100, 1500)}
            if key == "bands":
                item["t"] = _num(0, 20)
            out[key] = draw(st.lists(st.fixed_dictionaries(item), max_size=4))
    return out


@st.composite
def section_docs(draw) -> bytes:
    """A section description document, as UTF-8 JSON bytes."""
    sec: dict = {}
    if not draw(_rare(6)):
        sec["girder"] = draw(girder())
    if draw(_rare(4)):
        sec["parts"] = draw(st.lists(part(), max_size=5))
    if draw(_rare(4)):
        sec["rivet_lines"] = draw(st.lists(rivet_line(), max_size=4))
    doc: dict = {
        "format": "asfound.section",
        "version": draw(st.sampled_from((1,) * 36 + (2, 0, "1", True))),
        "name": draw(st.sampled_from(("random section (fuzz)", "<b>x</b>", ""))),
        "length_unit": draw(st.sampled_from(("mm",) * 20 + ("in", "m", "kN", "furlong", ""))),
        "section": sec,
    }
    if draw(st.booleans()):
        doc["loss"] = draw(loss())
    if draw(st.booleans()):
        doc["shear"] = {
            "V": draw(_num(0, 5000)),
            "unit": draw(st.sampled_from(("kN", "kip", "N", "mm", "1/0", "kN/0"))),
        }
    return json.dumps(doc).encode("utf-8")
