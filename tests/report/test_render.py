"""Pages rendered to pixels (poppler's pdftoppm): not blank, ink where the section is drawn,
and the loss tint inside the enlarged flange detail."""

from __future__ import annotations

import shutil
import subprocess

import pytest
from PIL import Image

from core.report import build_report
from core.report.styles import LOSS

from .helpers import SI_SAMPLE

DPI = 72  # one pixel per point keeps the box arithmetic exact

pytestmark = pytest.mark.skipif(
    shutil.which("pdftoppm") is None, reason="pdftoppm (Debian poppler-utils) is not installed"
)


@pytest.fixture(scope="module")
def rendered(tmp_path_factory):
    d = tmp_path_factory.mktemp("png")
    rep = build_report(SI_SAMPLE, d / "si.pdf")
    _kind, page, _box = next(f for f in rep.figures if f[0] == "section-found")
    subprocess.run(
        [
            "pdftoppm",
            "-png",
            "-r",
            str(DPI),
            "-f",
            str(page),
            "-l",
            str(page),
            str(rep.path),
            str(d / "p"),
        ],
        check=True,
    )
    png = next(d.glob("p-*.png"))
    return rep, page, Image.open(png).convert("RGB")


def _crop(img: Image.Image, box, page_h: float) -> Image.Image:
    x0, y0, x1, y1 = box
    k = DPI / 72.0
    return img.crop((int(x0 * k), int((page_h - y1) * k), int(x1 * k), int((page_h - y0) * k)))


def _dark_fraction(img: Image.Image, level: int = 200) -> float:
    g = img.convert("L")
    px = list(g.getdata())
    return sum(1 for p in px if p < level) / len(px)


def test_page_is_not_blank(rendered):
    _rep, _page, img = rendered
    assert _dark_fraction(img) > 0.01


def test_section_drawing_has_ink_where_the_section_is(rendered):
    rep, page, img = rendered
    h = img.size[1] * 72.0 / DPI
    _, _, box = next(f for f in rep.figures if f[0] == "section-found" and f[1] == page)
    x0, y0, x1, y1 = box
    # the web of the girder runs down the middle of the drawing box
    mid = _crop(
        img,
        (x0 + 0.3 * (x1 - x0), y0 + 0.2 * (y1 - y0), x0 + 0.7 * (x1 - x0), y0 + 0.8 * (y1 - y0)),
        h,
    )
    assert _dark_fraction(mid, 160) > 0.01
    # and the margin of the page beside the drawing stays white
    margin = _crop(img, (2, y0, 30, y1), h)
    assert _dark_fraction(margin) == 0.0


def test_loss_is_tinted_in_the_bottom_flange_detail(rendered):
    rep, page, img = rendered
    h = img.size[1] * 72.0 / DPI
    det = [f for f in rep.figures if f[0] == "detail-bottom" and f[1] == page]
    assert det, "the governing station has an enlarged bottom flange"
    crop = _crop(img, det[0][2], h)
    r, g, b = (int(255 * c) for c in (LOSS.red, LOSS.green, LOSS.blue))
    near = [p for p in crop.getdata() if abs(p[0] - r) + abs(p[1] - g) + abs(p[2] - b) < 40]
    assert len(near) > 20


def test_the_girder_end_shows_the_stiffener_loss(tmp_path):
    rep = build_report(SI_SAMPLE, tmp_path / "si.pdf")
    _, page, box = next(f for f in rep.figures if f[0] == "girder-end-B")
    subprocess.run(
        ["pdftoppm", "-png", "-r", str(DPI), "-f", str(page), "-l", str(page), str(rep.path),
         str(tmp_path / "g")],
        check=True,
    )  # fmt: skip
    img = Image.open(next(tmp_path.glob("g-*.png"))).convert("RGB")
    crop = _crop(img, box, img.size[1] * 72.0 / DPI)
    r, g, b = (int(255 * c) for c in (LOSS.red, LOSS.green, LOSS.blue))
    near = [p for p in crop.getdata() if abs(p[0] - r) + abs(p[1] - g) + abs(p[2] - b) < 40]
    assert len(near) > 20  # the stiffener's loss band and the web's, tinted
