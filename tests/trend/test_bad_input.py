"""Surveys that cannot be put in one trend: a clear error naming the file, member and
station, and nothing written."""

from __future__ import annotations

import json

import pytest

from core.cli import main
from core.survey.model import Survey
from core.trend import TrendError, trend
from core.trend.match import match_surveys
from tests.trend.helpers import doc, shifted


def _pair(tmp_path, a: dict, b: dict):
    pa, pb = tmp_path / "a.json", tmp_path / "b.json"
    pa.write_text(json.dumps(a), encoding="utf-8")
    pb.write_text(json.dumps(b), encoding="utf-8")
    return [str(pa), str(pb)], [Survey.model_validate(a), Survey.model_validate(b)]


def _match(tmp_path, a, b):
    paths, surveys = _pair(tmp_path, a, b)
    return paths, lambda: match_surveys(paths, surveys)


def test_different_structures(tmp_path):
    a = shifted(doc(), "2019-01-10", 0.3)
    a["survey"]["structure"] = "Another Bridge (invented)"
    paths, go = _match(tmp_path, a, doc())
    with pytest.raises(TrendError, match="different structures") as e:
        go()
    assert paths[0] in str(e.value)


def test_dates_out_of_order_and_equal(tmp_path):
    late = shifted(doc(), "2030-01-10", 0.3)
    _paths, go = _match(tmp_path, late, doc())
    with pytest.raises(TrendError, match=r"out of order.*oldest first"):
        go()
    same = shifted(doc(), "2025-09-17", 0.3)  # the sample's latest date
    _paths, go = _match(tmp_path, same, doc())
    with pytest.raises(TrendError, match="same date"):
        go()


def test_missing_date(tmp_path):
    a = shifted(doc(), "2019-01-10", 0.3)
    a["survey"]["dates"] = []
    paths, go = _match(tmp_path, a, doc())
    with pytest.raises(TrendError, match="no date") as e:
        go()
    assert paths[0] in str(e.value)


def test_station_that_cannot_be_matched_names_file_member_station(tmp_path):
    a = shifted(doc(), "2019-01-10", 0.3)
    st = a["members"][0]["stations"][2]
    sid = st["id"]
    st["position"] += 1.0  # 1 m away (position unit m)
    paths, go = _match(tmp_path, a, doc())
    with pytest.raises(TrendError) as e:
        go()
    msg = str(e.value)
    assert paths[0] in msg and "member 'G1'" in msg and f"station {sid!r}" in msg
    assert "within 50 mm" in msg


def test_different_nominal_thickness(tmp_path):
    a = shifted(doc(), "2019-01-10", 0.3)
    sec = a["members"][0]["section"]
    g = sec.get("girder")
    if g is None or "tw" not in g:
        pytest.skip("the sample's section is not the girder template")
    g["tw"] = g["tw"] + 1.0
    paths, surveys = _pair(tmp_path, a, doc())
    with pytest.raises(TrendError, match="different sections"):
        match_surveys(paths, surveys)


def test_one_survey_and_bad_options(tmp_path):
    with pytest.raises(TrendError, match="two or more"):
        trend([str(tmp_path / "x.json")])
    paths, surveys = _pair(tmp_path, shifted(doc(), "2019-01-10", 0.3), doc())
    with pytest.raises(TrendError, match="horizon"):
        trend(paths, surveys=surveys, horizon=0.0)
    with pytest.raises(TrendError, match="model"):
        trend(paths, surveys=surveys, model="cubic")


def test_cli_error_writes_nothing(tmp_path, capsys):
    a = shifted(doc(), "2019-01-10", 0.3)
    a["survey"]["structure"] = "Another Bridge (invented)"
    paths, _ = _pair(tmp_path, a, doc())
    out = tmp_path / "t.pdf"
    assert main(["trend", *paths, "-o", str(out)]) == 2
    err = capsys.readouterr().err
    assert "different structures" in err and paths[0] in err
    assert not out.exists()
    assert sorted(p.name for p in tmp_path.iterdir()) == ["a.json", "b.json"]


def test_cli_never_writes_over_an_input(tmp_path, capsys):
    paths, _ = _pair(tmp_path, shifted(doc(), "2019-01-10", 0.3), doc())
    before = (tmp_path / "a.json").read_bytes()
    assert main(["trend", *paths, "-o", paths[0]]) == 2
    assert "refusing" in capsys.readouterr().err
    assert (tmp_path / "a.json").read_bytes() == before


def test_power_law_needs_the_year_corrosion_began(tmp_path):
    a, b = shifted(doc(), "2019-01-10", 0.3), doc()
    for d in (a, b):
        d["survey"]["year_built"] = None
    paths, surveys = _pair(tmp_path, a, b)
    with pytest.raises(TrendError, match="--since") as e:
        trend(paths, surveys=surveys, model="power")
    assert paths[1] in str(e.value)
    with pytest.raises(TrendError, match="before the first survey"):
        trend(paths, surveys=surveys, model="power", since=2020.0)


def test_exponent_only_with_the_power_law(tmp_path, capsys):
    paths, _ = _pair(tmp_path, shifted(doc(), "2019-01-10", 0.3), doc())
    assert main(["trend", *paths, "--exponent", "0.5"]) == 2
    assert "--exponent applies to --model power only" in capsys.readouterr().err
    assert main(["trend", *paths, "--tolerance", "two metres"]) == 2
    assert "--tolerance" in capsys.readouterr().err
