"""``asfound merge``: two devices' stores into a new one from the command line."""

from __future__ import annotations

import contextlib

from core.cli import main
from core.survey.store import FieldStore
from tests.survey.helpers import header
from tests.survey.merge_helpers import DEVICES, common_start


def test_merge_prints_the_conflicts_and_writes_a_new_store(tmp_path, capsys):
    a, b = common_start(tmp_path)
    for path, dev, who, v in ((a, DEVICES[0], "ann", 8.0), (b, DEVICES[1], "bob", 8.2)):
        with FieldStore.open(path, device=dev) as s:
            s.update_reading("G1", "S1", "r1", {"value": v}, who)
            s.add_station("G1", {"id": "S4", "position": 2.0 + v / 10}, who)
    out = tmp_path / "c.asf"
    assert main(["merge", str(a), str(b), "-o", str(out)]) == 0
    text = capsys.readouterr().out
    assert "value: member G1 / station S1 / reading r1 / value: both devices changed it" in text
    assert "renamed: member G1 / station S4: both devices made station 'S4'" in text
    assert "is now 'S4-2'" in text
    assert f"into {out}: 5 entries in both, 1 only in {a}, 1 only in {b}" in text
    assert "2 conflict(s)" in text
    with FieldStore.open(out) as s:
        assert sorted(x.id for x in s.to_survey().members[0].stations) == ["S1", "S4", "S4-2"]
    # an existing output is never replaced, by a second merge either
    before = out.read_bytes()
    assert main(["merge", str(a), str(b), "-o", str(out)]) == 2
    err = capsys.readouterr().err
    assert err.startswith("asfound: error: ") and "a new store never replaces a file" in err
    assert out.read_bytes() == before


def test_merge_of_stores_of_two_surveys_fails_naming_both(tmp_path, capsys):
    a, _b = common_start(tmp_path)
    other = tmp_path / "other.asf"
    FieldStore.create(other, header(id="T-9"), device=DEVICES[1]).close()
    out = tmp_path / "c.asf"
    assert main(["merge", str(a), str(other), "-o", str(out)]) == 2
    err = capsys.readouterr().err
    assert str(a) in err and str(other) in err and "different surveys" in err
    assert not out.exists()


def test_merge_is_in_the_help(capsys):
    with contextlib.suppress(SystemExit):
        main(["--help"])
    assert "merge" in capsys.readouterr().out
