"""The web depth for shear and the panel-representative web thickness.

Depth (design notes 5 and 13 of the project): the clear depth between the flange angles' toes
by default; the web plate depth and the distance between the rivet lines stay selectable. For
the template girder (hand calculation from its geometry): clear depth = D + 2 recess - 2 angle
legs; rivet lines 0.55 of the leg from the backs of the angles. Panel thickness: the mean of
the whole-web readings of every station in the panel between stiffeners (asfound's stated
basis).
"""

from __future__ import annotations

import copy

import pytest

from core.assess import AssessOptions, assess
from tests.assess.helpers import sample_doc, survey


@pytest.mark.parametrize(
    "basis,D",
    [
        (None, 1500 + 2 * 10 - 2 * 150),  # clear depth between the toes: 1220 mm
        ("rivet_lines", 1500 + 2 * 10 - 2 * 0.55 * 150),  # 1355 mm
        ("web", 1500.0),
    ],
)
def test_depth_basis(basis, D):
    a = assess(survey(sample_doc()), AssessOptions(depth_basis=basis))
    for s in a.members[0].stations:
        assert s.D_used == pytest.approx(D)
        assert s.limit_state("web_shear").found.value("hw").value == pytest.approx(D)
    items = {x.item: x.value for x in a.assumptions}
    assert f"{D:.4g} mm" in items["member G1: web depth for shear"]


def test_clear_depth_is_the_conservative_default_for_the_samples():
    # the plate depth gave more shear resistance in the samples (unconservative)
    for name in ("deck-girder-si.json", "through-girder-us.json"):
        d = survey(sample_doc(name))
        clear = assess(d)
        plate = assess(d, AssessOptions(depth_basis="web"))
        for s0, s1 in zip(clear.members[0].stations, plate.members[0].stations, strict=True):
            assert s0.limit_state("web_shear").C_built <= s1.limit_state("web_shear").C_built


def test_panel_thickness_is_the_mean_of_the_panel_readings():
    d = copy.deepcopy(sample_doc())
    m = d["members"][0]
    m["stations"] = m["stations"][3:5]  # two stations; stiffeners every 1.5 m
    m["stations"][0]["position"], m["stations"][1]["position"] = 3.2, 4.0  # panel 3.0-4.5 m
    for st, vals in zip(m["stations"], ([9.0, 9.2], [8.0, 8.2, 8.4]), strict=True):
        st["readings"] = [r for r in st["readings"] if r["part"] != "web"]
        st["readings"] += [
            {"id": f"w{i}", "part": "web", "value": v, "unit": "mm"} for i, v in enumerate(vals)
        ]
        st["bands"], st["perforations"] = [], []
    a = assess(survey(d))
    mean = (9.0 + 9.2 + 8.0 + 8.2 + 8.4) / 5  # 8.56 mm
    for s in a.members[0].stations:
        assert s.tw_found == pytest.approx(mean)
        assert "mean of 5 web reading(s)" in s.limit_state("web_shear").note
