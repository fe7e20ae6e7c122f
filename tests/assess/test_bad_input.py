"""Bad input to the assessment gets a clear error naming value, range and place."""

from __future__ import annotations

import copy
import json

import pytest

from core.assess import AssessOptions, assess
from core.cli import main
from core.errors import InputError, UnitError
from tests.assess.helpers import sample_doc, survey


def test_unknown_standard() -> None:
    with pytest.raises(InputError, match=r"standard family 'bs5400' is not one of \['aashto'"):
        AssessOptions(standard="bs5400")


def test_unknown_standard_on_the_command_line(capsys) -> None:
    with pytest.raises(SystemExit):
        main(["assess", "survey_samples/deck-girder-si.json", "--standard", "bs5400"])
    assert "invalid choice: 'bs5400'" in capsys.readouterr().err


def _loads(V_dc=104.0, V_dw=29.2, V_ll=520.5) -> dict:
    """Station loads (the engineer's numbers; invented)."""
    q = lambda v, u: {"value": v, "unit": u}  # noqa: E731
    return {
        "DC": {"V": q(V_dc, "kN"), "M": q(310.0, "kN*m")},
        "DW": {"V": q(V_dw, "kN"), "M": q(87.2, "kN*m")},
        "LL_IM": {"V": q(V_ll, "kN"), "M": q(1511.2, "kN*m")},
    }


def test_dead_loads_of_opposite_sign() -> None:
    d = copy.deepcopy(sample_doc())
    st = d["members"][0]["stations"][2]
    st["loads"] = _loads(120.0, -30.0)
    with pytest.raises(
        InputError, match=r"station 'S3'.*opposite sign.*DC V = 120 kN, DW V = -30 kN"
    ):
        assess(survey(d))


def test_load_in_the_wrong_unit() -> None:
    d = copy.deepcopy(sample_doc())
    d["members"][0]["stations"][1]["loads"] = _loads()
    d["members"][0]["stations"][1]["loads"]["LL_IM"]["V"] = {"value": 500.0, "unit": "kN*m"}
    with pytest.raises(
        UnitError, match=r"station 'S2' / loads / LL / V.*'kN\*m' is not a force unit"
    ):
        assess(survey(d))


def test_material_out_of_range() -> None:
    d = copy.deepcopy(sample_doc())
    d["survey"]["material"]["Fy"] = {"value": 2200, "unit": "MPa"}
    with pytest.raises(InputError, match=r"Fy = 2200.* outside the allowed range"):
        assess(survey(d))


def test_bad_thresholds_and_states() -> None:
    with pytest.raises(InputError, match="effective rivet states"):
        AssessOptions(effective_states=("rusty",))
    with pytest.raises(InputError, match="depth basis"):
        AssessOptions(depth_basis="flange")


def test_assess_json_is_stable(tmp_path, capsys) -> None:
    assert main(["assess", "survey_samples/through-girder-us.json", "--json"]) == 0
    doc = json.loads(capsys.readouterr().out)
    assert doc["format"] == "asfound.assessment" and doc["version"] == 3
    assert doc["family"]["key"] == "aashto" and doc["family"]["measure"]["symbol"] == "RF"
    syms = {f["symbol"] for f in doc["family"]["factors"]}
    assert {"phi_v", "phi_f", "gDC", "gDW", "gLL", "IM"} <= syms
    assert doc["unit_system"] == "us"
    s = doc["members"][0]["stations"][0]
    assert set(s) >= {"station", "x", "limit_states", "governing", "level", "flags", "properties"}
    ls = s["limit_states"][0]
    assert ls["as_built"]["unit"] == "kip" and ls["key"] == "web_shear"
    assert "caution" in doc and "licensed" in doc["caution"]


def test_assess_table_prints_every_station(capsys) -> None:
    assert main(["assess", "survey_samples/deck-girder-si.json", "--standard", "aashto"]) == 0
    out = capsys.readouterr().out
    for sid in ("S1", "S4", "S8"):
        assert f"\n{sid} " in out
    assert "AASHTO LRFD" in out and "CAUTION" in out
