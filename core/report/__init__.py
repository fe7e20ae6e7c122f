"""The condition report: a PDF for the licensed engineer (reportlab, vector graphics).

Public API::

    from core.report import build_report
    rep = build_report("survey.json", "report.pdf", units="si")
    rep.pages, rep.level.label
"""

from core.report.build import Report, build_report, render

__all__ = ["Report", "build_report", "render"]
