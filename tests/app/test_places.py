"""Where surveys live and where work stopped (no kivy needed)."""

from __future__ import annotations

import json

from fieldapp.places import ENV_DIR, Place, PlaceBook, new_store_path, safe_name, survey_folder
from fieldapp.session import NEXT_STATE, parse_number


def test_folder_option_wins_over_environment_over_default(tmp_path, monkeypatch):
    opt, env = tmp_path / "opt", tmp_path / "env"
    assert survey_folder(str(opt), {ENV_DIR: str(env)}) == opt.resolve()
    assert survey_folder(None, {ENV_DIR: str(env)}) == env.resolve()
    monkeypatch.setenv("XDG_DATA_HOME", str(tmp_path / "xdg"))
    monkeypatch.setattr("sys.platform", "linux")
    assert survey_folder(None, {}) == (tmp_path / "xdg" / "asfound" / "field").resolve()
    assert opt.is_dir() and env.is_dir()


def test_place_is_remembered_atomically_and_survives_a_damaged_file(tmp_path):
    store = tmp_path / "a.sqlite"
    store.write_bytes(b"")
    book = PlaceBook(tmp_path)
    assert book.last is None
    book.remember(store, Place("G1", "S2", "rivets"))
    again = PlaceBook(tmp_path)
    assert again.last == store
    assert again.place(store) == Place("G1", "S2", "rivets")
    assert not [p for p in tmp_path.iterdir() if p.name.endswith(".tmp")]
    (tmp_path / "fieldapp-place.json").write_text("{not json", encoding="utf-8")
    assert PlaceBook(tmp_path).last is None  # a damaged file means: start afresh
    data = json.loads(json.dumps({"last": "gone.sqlite", "places": {}}))
    (tmp_path / "fieldapp-place.json").write_text(json.dumps(data), encoding="utf-8")
    assert PlaceBook(tmp_path).last is None  # a store that no longer exists is not offered


def test_store_names_never_overwrite(tmp_path):
    assert safe_name("  River Lane / G1 ") == "River-Lane-G1"
    first = new_store_path(tmp_path, "x")
    first.write_bytes(b"")
    assert new_store_path(tmp_path, "x").name == "x-2.sqlite"


def test_rivet_states_cycle_through_all_four_and_back():
    seen, state = [], "sound"
    for _ in range(4):
        state = NEXT_STATE[state]
        seen.append(state)
    assert seen == ["loose", "missing", "headless", "sound"]


def test_typed_numbers():
    assert parse_number(" 7,5 ", "r") == 7.5
    for bad in ("", "abc", "nan", "inf"):
        try:
            parse_number(bad, "r")
        except ValueError as e:
            assert "r:" in str(e)
        else:
            raise AssertionError(bad)


def test_only_samples_core_accepts_are_offered():
    from fieldapp.templates import sample_files, samples_folder

    names = [p.name for p in sample_files(samples_folder())]
    assert "deck-girder-si.json" in names and "through-girder-us.json" in names
    assert "mistakes.json" not in names  # deliberate errors: core refuses it
    assert "section-demo-si.json" not in names  # a section file, not a survey


def test_names_the_inspector_reads():
    from fieldapp.names import line_name, part_name, place_name, readable

    assert [part_name(p) for p in ("web", "angle_tl", "angle_br", "cover_bottom_1")] == [
        "web",
        "top-left flange angle",
        "bottom-right flange angle",
        "bottom cover plate 1",
    ]
    assert place_name("web", "b1") == "web band b1"
    assert place_name("angle_bl", "h") == "bottom-left flange angle, horizontal leg"
    assert line_name("cover_top_l") == "left line through the top cover"
    assert line_name("my_line") == "my line"
    assert (
        readable("rivet line web_bottom at angle_bl")
        == "bottom line through the web at bottom-left flange angle"
    )
