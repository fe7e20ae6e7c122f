"""``asfound trend`` on the samples: the invented earlier survey of the through girder and
the sample itself give a real trend, as text, JSON and a PDF."""

from __future__ import annotations

import json
import shutil
import subprocess

import pytest

from core import CAUTION
from core.cli import main
from tests.report.helpers import pdf_pages
from tests.trend.helpers import US, US_EARLIER


def test_json_on_the_samples(capsys):
    assert main(["trend", str(US_EARLIER), str(US), "--json", "--horizon", "20"]) == 0
    d = json.loads(capsys.readouterr().out)
    assert d["format"] == "asfound.trend" and d["caution"] == CAUTION
    assert [s["date"] for s in d["surveys"]] == ["2019-05-21", "2025-06-03"]
    regions = d["regions"]
    assert regions and all(r["method"] == "difference quotient" for r in regions)
    # the web band above the bottom angles thins faster than the web away from it
    n1 = {(r["part"], r["region"]): r for r in regions if r["station"] == "N1"}
    assert n1[("web", "b1")]["rate_mm_per_year"] > n1[("web", None)]["rate_mm_per_year"] > 0
    # the difference quotient, checked from the JSON's own thicknesses and years
    w = n1[("web", None)]
    dq = (w["t_mm"][0] - w["t_mm"][1]) / (w["years"][1] - w["years"][0])
    assert w["rate_mm_per_year"] == pytest.approx(dq, rel=1e-3)  # years rounded to 4 places
    assert (
        d["model"]["name"] == "linear" and "difference over the interval" in d["model"]["statement"]
    )
    statuses = {c["status"] for ls in d["limit_states"] for c in ls["crossings"]}
    assert "crosses" in statuses


def test_text_and_pdf_on_the_samples(tmp_path, capsys):
    out = tmp_path / "trend.pdf"
    assert main(["trend", str(US_EARLIER), str(US), "-o", str(out)]) == 0
    assert out.exists()
    pages = pdf_pages(out)
    assert len(pages) >= 3
    assert "Trend of repeat surveys" in pages[0] and "Tollyweather Creek" in pages[0]
    assert "licensed professional engineer" in pages[0]
    for k, p in enumerate(pages, 1):
        assert "an aid to a licensed engineer" in p, f"page {k} lacks the caution"
        assert f"page {k} of {len(pages)}" in p
    text = " ".join(pages)
    assert "Loss rate per part region" in text and "difference quotient" in text
    # an earlier asfound PDF is replaced; the result can be rendered page by page
    assert main(["trend", str(US_EARLIER), str(US), "-o", str(out), "--horizon", "20"]) == 0
    if shutil.which("pdftoppm"):
        subprocess.run(["pdftoppm", "-r", "40", "-png", str(out), str(tmp_path / "p")], check=True)
        assert len(list(tmp_path.glob("p-*.png"))) == len(pdf_pages(out))
