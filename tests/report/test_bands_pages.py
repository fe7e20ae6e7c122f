"""The member's first page holds the span plot, the bands and the advice; the assumptions
page names the bands' assumptions (both invented samples, both unit systems)."""

from __future__ import annotations

import pytest

from core.report import build_report
from core.report.bandpages import member_governing
from core.report.spanplot import MAX_PANELS, member_series

from .helpers import SI_SAMPLE, US_SAMPLE, pdf_pages


@pytest.fixture(scope="module", params=[SI_SAMPLE, US_SAMPLE], ids=["si", "us"])
def report(request, tmp_path_factory):
    out = tmp_path_factory.mktemp("bands") / "r.pdf"
    rep = build_report(request.param, out)
    return rep, pdf_pages(rep.path)


def test_span_plot_and_bands_on_the_members_first_page(report):
    rep, pages = report
    for m in rep.assessment.members:
        first = next(i for i, t in enumerate(pages, 1) if f"Member {m.member} ·" in t)
        plots = [f for f in rep.figures if f[0] == "span-plot" and f[1] == first]
        assert len(plots) == 1
        text = pages[first - 1]
        assert "The whole span" in text and "Where to measure next" in text
        mb = rep.bands.member(m.member)
        assert mb.advice and mb.advice[0].split(" would ")[0] in text
        gov = member_governing(m)
        assert gov is not None and f"at station {gov[0]}" in text


def test_span_plot_stays_inside_the_text_frame(report):
    """The drawing's box (x0, y0, x1, y1 in points) lies within the page's margins (A4 is
    595 x 842 pt, US letter 612 x 792 pt; 1 pt slack)."""
    rep, _ = report
    W, H = (595.3, 841.9) if rep.assessment.unit_system == "si" else (612.0, 792.0)
    for kind, _page, (x0, y0, x1, y1) in rep.figures:
        if kind == "span-plot":
            assert x0 >= 20 and x1 <= W - 20 and y0 >= 20 and y1 <= H - 20
            assert x1 - x0 > 300 and y1 - y0 > 100


def test_assumptions_page_names_the_bands(report):
    _, pages = report
    text = next(t for t in pages if "Assumptions and sources" in t)
    later = " ".join(pages[pages.index(text) :])
    for item in ("bands: what they are", "bands: instrument tolerance", "bands: one reading"):
        assert item in later
    assert "not a reliability rating" in later


def test_the_plotted_band_brackets_the_as_found_capacity(report):
    rep, _ = report
    m = rep.assessment.members[0]
    series = member_series(m, rep.bands.member(m.member), rep.assessment.unit_system)
    assert 1 <= len(series[:MAX_PANELS]) <= MAX_PANELS
    for s in series:
        for f, lo, hi in zip(s.found, s.lo, s.hi, strict=True):
            if f is not None and lo is not None:
                assert lo <= f * (1 + 1e-12) + 1e-12 and f <= hi * (1 + 1e-12) + 1e-12
