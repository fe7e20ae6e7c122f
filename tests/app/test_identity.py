"""The inspector of a device (fieldapp.identity): a stable key per person, corrected names
kept as the same person's, a name never shared by two people on one device. Our own rules,
no outside source needed."""

from __future__ import annotations

import json

import pytest

from core.errors import InputError
from fieldapp import identity


def test_first_name_correction_and_hand_over(tmp_path):
    assert identity.load(tmp_path) is None
    ann = identity.save("Ann Smyth", "AS", tmp_path)
    assert ann.key and ann.formerly == ()
    fixed = identity.correct("Ann  Smith ", "AS", tmp_path)
    assert (fixed.who, fixed.key, fixed.formerly) == (
        "Ann Smith (AS)",
        ann.key,
        ("Ann Smyth (AS)",),
    )
    bo = identity.hand_over("Bo Lund", "BL", tmp_path)
    assert bo.key != ann.key and bo.formerly == ()
    # Bo cannot take a name Ann has used here: the store tells people apart by it
    for name in ("Ann Smith", "Ann Smyth"):
        with pytest.raises(InputError, match="already used on this device by another"):
            identity.correct(name, "AS", tmp_path)
    assert identity.load(tmp_path).who == "Bo Lund (BL)"
    with pytest.raises(InputError, match="same person"):
        identity.hand_over("Bo Lund", "BL", tmp_path)
    # Ann comes back: she is Ann again, with her earlier names
    back = identity.hand_over("Ann Smith", "AS", tmp_path)
    assert back.key == ann.key and back.formerly == ("Ann Smyth (AS)",)


def test_bad_values_and_files(tmp_path):
    with pytest.raises(InputError, match="initials '1A' must be 1 to 5 letters"):
        identity.save("Ann", "1A", tmp_path)
    with pytest.raises(InputError, match="no inspector is named"):
        identity.correct("Ann", "A", tmp_path)
    identity.inspector_path(tmp_path).write_text("{not json", encoding="utf-8")
    assert identity.load(tmp_path) is None
    # a file kept before keys: one person, whose name stays theirs
    identity.inspector_path(tmp_path).write_text(
        json.dumps({"format": identity.INSPECTOR_FORMAT, "name": "Cy Old", "initials": "CO"}),
        encoding="utf-8",
    )
    assert identity.load(tmp_path).who == "Cy Old (CO)"
    new = identity.correct("Cy Olde", "CO", tmp_path)
    assert new.formerly == ("Cy Old (CO)",)
