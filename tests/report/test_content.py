"""The report prints the engine's own numbers, flags, cautions and assumptions.

Each PDF is built once per module; the text is extracted with pypdf and compared with the
assessment's values formatted by the report's own formatters (core.report.fmt).
"""

from __future__ import annotations

import pytest
from pypdf import PdfReader

from core import CAUTION
from core.assess.tomeasure import KIND_WORDS, left_to_measure
from core.checks.flags import Level
from core.names import annotated
from core.report import build_report
from core.report.cover import CAUTIONS
from core.report.fmt import position, ratio, rf, value
from core.report.member import governing_stations, shear_for_plot
from core.report.notes import check_sources
from core.report.notmeasured import grouped
from core.report.styles import LEVEL_MARK
from core.survey.document import load_survey

from .helpers import SI_SAMPLE, US_SAMPLE, flat, pdf_pages


@pytest.fixture(scope="module")
def si(tmp_path_factory):
    out = tmp_path_factory.mktemp("rep") / "si.pdf"
    rep = build_report(SI_SAMPLE, out)
    pages = pdf_pages(out)
    return rep, pages, " ".join(pages)


@pytest.fixture(scope="module")
def us(tmp_path_factory):
    out = tmp_path_factory.mktemp("rep") / "us.pdf"
    rep = build_report(US_SAMPLE, out)
    pages = pdf_pages(out)
    return rep, pages, " ".join(pages)


def test_every_page_has_number_identity_and_checksum(si):
    rep, pages, _ = si
    assert rep.pages == len(pages) >= 5
    a = rep.assessment
    for i, text in enumerate(pages, 1):
        assert f"page {i} of {rep.pages}" in text
        assert a.survey_id in text and a.title in text
        assert f"SHA-256 {rep.checksum}" in text
        assert f"standard family: {a.family.short}" in text


def test_checksum_is_sha256_of_the_input_bytes(si):
    import hashlib

    rep, _, _ = si
    # SHA-256 per FIPS 180-4, computed here with the standard library
    assert rep.checksum == hashlib.sha256(SI_SAMPLE.read_bytes()).hexdigest()[:16]


def test_cover_has_overall_level_and_cautions(si):
    rep, pages, _ = si
    cover = pages[0]
    assert rep.level == max(f.level for f in rep.assessment.all_flags())
    assert f"Overall flag level {LEVEL_MARK[rep.level]} {rep.level.label}" in cover
    assert flat(CAUTION) in cover
    for c in CAUTIONS:
        assert flat(c) in cover
    assert "not, by itself, a load rating or a posting decision" in cover


def test_ratios_and_rating_factors_of_every_limit_state(si):
    rep, _, text = si
    for m in rep.assessment.members:
        for s in m.stations:
            for ls in s.limit_states:
                row = (  # the ids with their words beside them (core.names.annotated)
                    f"{annotated(ls.name)} {value(ls.C_built, ls.kind, 'si')} "
                    f"{value(ls.C_found, ls.kind, 'si')} {ratio(ls.ratio)} "
                    f"{value(ls.demand, ls.kind, 'si')} {rf(ls.measure)}"
                )
                assert row in text, (s.station, row)


def test_properties_by_station_print_area_and_Ix(si):
    rep, _, text = si
    m = rep.assessment.members[0]
    b = m.stations[0].built.gross.props
    for s in m.stations:
        f = s.found.gross.props
        row = (
            f"{s.station} {position(s.x, 'si')} {value(f.A, 'area', 'si')} {ratio(f.A / b.A)} "
            f"{value(f.Ix, 'inertia', 'si')} {ratio(f.Ix / b.Ix)}"
        )
        assert row in text, row
    assert "Ix (10⁶ mm⁴)" in text


def test_governing_stations_print_Ix_and_tau_max(si):
    rep, _, text = si
    m = rep.assessment.members[0]
    gov = governing_stations(m)
    assert 1 <= len(gov) <= 3
    # the worst station of the member is among the ones drawn
    assert max(s.level for s in m.stations) == max(s.level for s in gov)
    for s in gov:
        V, words = shear_for_plot(s, "si")
        assert flat(words) in text
        b, f = s.built.gross.props, s.found.gross.props
        assert f"Ix (10⁶ mm⁴) {value(b.Ix, 'inertia', 'si')} {value(f.Ix, 'inertia', 'si')}" in text
        tb = s.built.gross.profile.tau_max(V)[0]
        if s.found.shear_applicable:
            tf = s.found.gross.profile.tau_max(V)[0]
            row = f"τmax = VQ/(I t) (MPa) {value(tb, 'stress', 'si')} {value(tf, 'stress', 'si')}"
        else:
            row = f"τmax = VQ/(I t) (MPa) {value(tb, 'stress', 'si')} –"
        assert row in text, row


def test_flags_above_within_limits_print_their_messages(si):
    rep, _, text = si
    shown = [f for f in rep.assessment.all_flags() if f.level > Level.OK]
    assert shown, "the sample has findings"
    for f in shown:
        assert flat(f.message) in text, f.message


def test_readings_statistics_and_notes(si):
    rep, _, text = si
    s = rep.assessment.members[0].stations[0]
    for r in s.stats:
        assert (
            f"{r.n} {value(r.t_nominal, 'length', 'si')} {value(r.t_min, 'length', 'si')}" in text
        )
        for p in r.notes:
            assert flat(p.message) in text
    assert "COV %" in text


def test_assumptions_with_sources_and_check_clauses(si):
    rep, _pages, text = si
    a = rep.assessment
    for x in a.assumptions:
        assert flat(f"{x.item} {x.value} {x.source}") in text, x
    for name, ref in check_sources(a):
        assert flat(f"{name} {ref}") in text
    # EN 1993-1-5 is the survey's standard: its clause is named
    assert "EN 1993-1-5" in text


def test_history_says_the_input_was_a_file_and_review_block(si):
    _, pages, text = si
    assert "The input was a survey file" in text
    last = pages[-1]
    for words in (
        "Reviewing engineer",
        "Licence number",
        "Date",
        "Signature",
        "Accepted",
        "Returned for revision",
    ):
        assert words in last


def test_every_table_states_its_unit_system(si):
    _, _, text = si
    # each table caption ends with the unit system
    assert text.count("· SI units") >= 8
    assert "US customary" not in text


def test_page_size_follows_the_unit_system(si, us):
    # ISO 216 A4 is 210 x 297 mm; ANSI Letter 8.5 x 11 in (1 pt = 1/72 in)
    a4 = PdfReader(str(si[0].path)).pages[0].mediabox
    lt = PdfReader(str(us[0].path)).pages[0].mediabox
    assert (round(float(a4.width) * 25.4 / 72), round(float(a4.height) * 25.4 / 72)) == (210, 297)
    assert (float(lt.width) / 72, float(lt.height) / 72) == (8.5, 11.0)


def test_us_report_in_us_units(us):
    rep, _, text = us
    assert "US customary units" in text and "(kip)" in text and "(in⁴)" in text
    m = rep.assessment.members[0]
    s = m.stations[0]
    assert "not applicable" in text and not s.found.shear_applicable
    for ls in s.limit_states:
        assert f"{annotated(ls.name)} {value(ls.C_built, ls.kind, 'us')}" in text


def test_girder_ends_are_drawn_with_their_limit_states_and_inputs(us):
    rep, _, text = us
    kinds = {f[0] for f in rep.figures}
    # one elevation per support and the bearing stiffeners in plan (both have end loss)
    assert {"girder-end-S", "girder-end-N", "stiffener-BS-S", "stiffener-BS-N"} <= kinds
    m = rep.assessment.members[0]
    for sup in m.details.supports:
        assert flat(f"bearing length N = {value(sup.N, 'length', 'us')} in") in text
    n8 = m.stations[-1]
    ls = n8.limit_state("stiffener_bearing:N")
    row = (
        f"{ls.name} {value(ls.C_built, 'force', 'us')} {value(ls.C_found, 'force', 'us')} "
        f"{ratio(ls.ratio)} {value(ls.demand, 'force', 'us')} {rf(ls.measure)}"
    )
    assert row in text
    # the panels, the stiffeners that no longer count and why, and the fatigue lives
    assert "Intermediate stiffeners and web panels" in text
    # the engine words it in mm; a US page prints it in inches (127 mm = 5.00 in exactly)
    assert flat("projecting width 5.00 in > 16 tp") in text
    assert " mm > " not in text
    assert "remaining 36 y" in text


def test_the_assumptions_state_the_girder_bases_and_nothing_is_left_unchecked(us):
    _, _, text = us
    assert "not yet checked" not in text
    for item in ("flexural resistance", "unbraced length and moment diagram", "girder ends",
                 "web at the bearing", "web panels and tension field", "member NG: supports",
                 "member NG: bracing of the top flange"):  # fmt: skip
        assert item in text, item


def test_not_measured_lists_every_item_of_the_checklist(si, us):
    """Every item of core.assess.tomeasure for the member is in its "Not measured" table,
    with its stations (all of them named once when it holds at every station)."""
    for (rep, pages, _), path in ((si, SI_SAMPLE), (us, US_SAMPLE)):
        survey, _ = load_survey(path)
        member = rep.assessment.members[0].member
        items = left_to_measure(survey, rep.assessment.family.key).of(member, whole=True)
        assert items, "the samples leave parts unread"
        page = next(p for p in pages if "Not measured" in p)
        n = len(rep.assessment.members[0].stations)
        for i, stations in grouped(items):
            assert flat(f"{KIND_WORDS[i.kind]} {i.subject}") in page, i
            if len(stations) == n:
                assert f"every station ({n})" in page
        assert "not conservative where it has corroded" in page
