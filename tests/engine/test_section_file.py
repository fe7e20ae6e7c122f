"""Section description files: every malformed or out-of-range file is an asfound error with
its place (the crash kinds the fuzz of issue 9 found: IndexError, KeyError, TypeError and
ValueError in the reader, OverflowError on huge integers, ZeroDivisionError inside pint)."""

from __future__ import annotations

import copy
import json
from pathlib import Path

import pytest

from core import limits
from core.cli import main
from core.errors import AsfoundError, SchemaError
from core.sectionfile import load_section_file

ROOT = Path(__file__).resolve().parents[2]
DEMO = json.loads((ROOT / "survey_samples" / "section-demo-si.json").read_text(encoding="utf-8"))


def _line(**kw) -> dict:
    """A rivet line of the section description (mm), changed by ``kw``."""
    line = {"id": "l1", "axis": "horizontal", "position": 50, "d": 20, "d_hole": 21}
    return line | {"pitch": 100, "parts": ["web"]} | kw


def _doc(**changes) -> dict:
    d = copy.deepcopy(DEMO)
    for path, v in changes.items():
        node = d
        keys = path.split("__")
        for k in keys[:-1]:
            node = node[k]
        node[keys[-1]] = v
    return d


@pytest.mark.parametrize(
    ("changes", "expect"),
    [
        ({"section__girder__covers_top": [[0]]}, "girder / covers_top[0]: expected a list of 2"),
        ({"section__girder__covers_top": [[]]}, "girder / covers_top[0]: expected a list of 2"),
        ({"section__girder__covers_top": 5}, "cover plates must be a list"),
        ({"section__girder__covers_top": [7]}, "covers_top[0]: expected a list of 2 numbers"),
        ({"section__girder__angle_bottom": []}, "angle_bottom: expected a list of 3 numbers"),
        ({"section__girder": [1, 2]}, "girder: expected an object, found list"),
        ({"section__girder__D": 10**400}, "girder / D: 1000"),
        ({"section__girder__D": True}, "girder / D: True is not a number"),
        ({"section__girder__tw": 0.001}, "tw = 0.001 mm is outside the allowed range (0.01"),
        ({"section__parts": {"a": 1}}, "parts must be a list, found dict"),
        ({"section__parts": [7]}, "parts[0]: expected an object, found int"),
        (
            {"section__parts": [{"kind": "angle", "id": "a9", "b_h": 50, "b_v": 50, "t": 5}]},
            "parts[0]: missing required key 'x'",
        ),
        (
            {
                "section__parts": [
                    {
                        "kind": "angle",
                        "id": "a9",
                        "b_h": 50,
                        "b_v": 50,
                        "t": 5,
                        "x": 900,
                        "y": 0,
                        "dir_x": "a",
                    }
                ]
            },
            "dir_x = 'a' is not a whole number",
        ),
        (
            {"section__rivet_lines": [_line(parts=3)]},
            "rivet_lines[0] / parts: part ids must be a list, found int",
        ),
        (
            {"section__rivet_lines": [_line(shear_planes=1e30)]},
            "shear_planes = 1e+30 is not a whole number from -1000 to 1000",
        ),
        ({"section": [1]}, "'section' must be an object, found list"),
        (
            {
                "section__parts": [
                    {
                        "kind": "plate",
                        "id": "p1",
                        "b": 100,
                        "t": 10,
                        "x": 900,
                        "y": 0,
                        "orientation": "diagonal",
                    }
                ]
            },
            "section / parts[0]: part 'p1': orientation 'diagonal' is not",
        ),
        ({"loss__thickness": 3}, "thickness must be a list, found int"),
        ({"loss__bands": [{"part": "web", "lo": 1, "hi": 2}]}, "bands[0]: missing required key"),
        ({"shear__unit": "1/0"}, "unit '1/0' holds a number"),
        ({"shear__unit": "kN/0"}, "unit 'kN/0' holds a number"),
        ({"shear__V": 2e9}, "V = 2e+12 N is outside the allowed range"),
        ({"version": True}, "version True is not supported"),
        ({"length_unit": "10**10**10*mm"}, "holds a number"),
    ],
)
def test_malformed_section_files_are_asfound_errors_with_the_place(tmp_path, changes, expect):
    path = tmp_path / "s.json"
    path.write_text(json.dumps(_doc(**changes)), encoding="utf-8")
    with pytest.raises(AsfoundError) as ei:
        load_section_file(path)
    assert expect in str(ei.value) and str(path) in str(ei.value)


def test_the_command_exits_2_with_one_line(tmp_path, capsys):
    path = tmp_path / "s.json"
    path.write_text(json.dumps(_doc(section__girder__covers_top=[[0]])), encoding="utf-8")
    assert main(["section", str(path)]) == 2
    err = capsys.readouterr().err
    assert err.startswith("asfound: error: ") and "covers_top[0]" in err


def test_deep_nesting_and_oversized_files_are_refused(tmp_path):
    deep = tmp_path / "deep.json"
    deep.write_text("[" * 100_000 + "]" * 100_000, encoding="utf-8")
    with pytest.raises(SchemaError, match="nested too deeply"):
        load_section_file(deep)
    big = tmp_path / "big.json"
    with big.open("wb") as f:  # a sparse file one byte over the limit
        f.truncate(limits.MAX_FILE_BYTES + 1)
    with pytest.raises(SchemaError, match="larger than the limit of 33,554,432 bytes"):
        load_section_file(big)


def test_the_demo_file_still_reads():
    defn, loss, V, _doc = load_section_file(ROOT / "survey_samples" / "section-demo-si.json")
    assert pytest.approx(650e3) == V  # 650 kN in N (the file's own value)
    assert {p.id for p in defn.parts} >= {"web", "angle_tl", "cover_top_1"}
    assert not loss.is_empty
