"""Build the condition report PDF: cover and cautions, one part per member, assumptions,
edit history and the review block. The output path is checked first (never an input, a
store or a survey file: :mod:`core.outputs`); the PDF is written to a temporary file and
renamed into place, so a failed build never leaves a partial PDF."""

from __future__ import annotations

import argparse
from dataclasses import dataclass, replace
from pathlib import Path

from reportlab.platypus import PageBreak, Paragraph

from core.assess import Assessment, AssessOptions, assess, options_from_dict
from core.assess.tomeasure import left_to_measure
from core.checks.flags import Level
from core.choices import options_for
from core.errors import InputError
from core.outputs import atomic_output, check_output
from core.report import cover, member, notes, notmeasured
from core.report.page import PageInfo, canvas_maker, document
from core.report.source import Source, read_source
from core.report.styles import MARGIN, Styles, esc, page_size
from core.survey import Problem, Survey


@dataclass(frozen=True)
class Report:
    """A written report: where, how many pages, the overall flag level, and where figures landed."""

    path: Path
    pages: int
    level: Level
    checksum: str
    figures: tuple[tuple[str, int, tuple[float, float, float, float]], ...]
    assessment: Assessment


def story(
    survey: Survey,
    a: Assessment,
    problems: list[Problem],
    src: Source,
    system: str,
    width: float,
    info: PageInfo,
) -> list:
    st = Styles()
    out = cover.cover(st, survey, a, src, system, width)
    other = [p for p in problems if not any(f"member {m.member!r}" in p.where for m in a.members)]
    if other:
        out.append(Paragraph("Other problems found by the survey's validation", st.h2))
        out += [Paragraph(f"<b>{esc(p.level)}</b>: {esc(p.message)}", st.small) for p in other]
    left = left_to_measure(survey, a.family.key if a.family else None)
    for m in a.members:
        out.append(PageBreak())
        out += member.member_pages(
            st, m, survey.member(m.member), problems, src.path, system, width, info, a.family
        )
        items = left.of(m.member, whole=True)
        out += notmeasured.section(st, items, len(m.stations), system, width)
    out.append(PageBreak())
    out += notes.assumptions(st, a, system, width)
    out += notes.history(st, src, system, width)
    out.append(notes.review_block(st, width))
    return out


def render(
    survey: Survey,
    a: Assessment,
    problems: list[Problem],
    src: Source,
    out: str | Path,
    system: str,
    *,
    force: bool = False,
) -> Report:
    """Write the report of an assessment to ``out`` (atomically; ``force``: see
    :func:`core.outputs.check_output`).

    Raises:
        OutputError: ``out`` is the input, a store, a survey file or (without ``force``)
        a file asfound did not write.
    """
    out = check_output(out, [src.path], "pdf", force=force)
    size = page_size(system)
    info = PageInfo(a.survey_id, a.title, src.checksum, a.family.short if a.family else "")
    with atomic_output(out) as tmp:
        doc = document(str(tmp), size, info)
        flow = story(survey, a, problems, src, system, size[0] - 2 * MARGIN, info)
        doc.build(flow, canvasmaker=canvas_maker(info))
    return Report(out, info.pages, a.level, src.checksum, tuple(info.figures), a)


def build_report(
    path: str | Path,
    out: str | Path,
    *,
    units: str | None = None,
    standard: str | None = None,
    options: AssessOptions | None = None,
    args: argparse.Namespace | None = None,
    force: bool = False,
) -> Report:
    """Validate and assess the survey at ``path`` and write its condition report to ``out``.

    The engineer's choices are those ``asfound assess`` takes: ``args`` (the command line's
    flags and options file, merged over the survey's own options), else ``options``, else the
    survey's options; ``standard`` overrides the family of any of them.

    Args:
        path: survey file (JSON) or field store.
        out: the PDF to write (replaced only when the new one is complete).
        units: "si" or "us"; None takes the survey's unit system.
        standard: a family key (``"aashto"``, ``"aisc"``, ``"en1993"``); None keeps the choice.
        options: assessment options (used when ``args`` is None).
        args: parsed command line of ``asfound report`` (see :mod:`core.choices`).
        force: replace an existing file that asfound did not write (never an input, a
            store or a survey file; see :func:`core.outputs.check_output`).

    Raises:
        OutputError: the output path is refused (checked before any work);
        SchemaError: the survey fails validation (no PDF is written); InputError: a bad
        option or file; any error of the assessment, with its place.
    """
    if units not in (None, "si", "us"):
        raise InputError(f"unit system {units!r} is not 'si' or 'us'")
    check_output(out, [path], "pdf", force=force)
    survey, problems, src = read_source(path)
    if args is not None:
        opts = options_for(args, survey)
    elif options is not None:
        opts = options
    else:
        opts = options_from_dict(survey.survey.options or {}, "survey / options")
    if standard is not None:
        opts = replace(opts, standard=standard)
    a = assess(survey, opts, tuple(problems))
    system = units or survey.survey.unit_system
    return render(survey, a, problems, src, out, system, force=force)
