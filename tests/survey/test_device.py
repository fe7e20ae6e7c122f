"""The device id: made once, kept, the same for every store opened on this device."""

from __future__ import annotations

import json
import multiprocessing

import pytest

from core.errors import InputError
from core.survey.device import (
    DEVICE_FILE,
    ENV_DATA,
    ENV_DEVICE,
    _kept,
    data_folder,
    short,
    this_device,
)
from core.survey.store import FieldStore

from .helpers import header


def test_made_once_and_kept(tmp_path):
    _kept.cache_clear()
    first = this_device(tmp_path, {})
    assert len(first) == 32 and int(first, 16) >= 0  # 128 random bits as hex
    data = json.loads((tmp_path / DEVICE_FILE).read_text(encoding="utf-8"))
    assert data["format"] == "asfound.device" and data["device"] == first
    _kept.cache_clear()
    assert this_device(tmp_path, {}) == first  # read back, not made again
    assert this_device(tmp_path / "other", {}) != first  # another folder: another device
    assert short(first) == first[:8]


def test_environment_names_the_device_and_is_checked(tmp_path):
    assert this_device(tmp_path, {ENV_DEVICE: "tablet-07"}) == "tablet-07"
    with pytest.raises(InputError, match="ASFOUND_DEVICE"):
        this_device(tmp_path, {ENV_DEVICE: "two words"})
    assert data_folder({ENV_DATA: str(tmp_path)}) == tmp_path


def test_an_unreadable_device_file_is_kept_aside(tmp_path):
    _kept.cache_clear()
    (tmp_path / DEVICE_FILE).write_text("{broken", encoding="utf-8")
    dev = this_device(tmp_path, {})
    assert len(dev) == 32
    assert (tmp_path / f"{DEVICE_FILE}.unreadable").read_text(encoding="utf-8") == "{broken"


def _device_in_child(folder, out):
    out.put(this_device(folder, {}))


def test_two_processes_starting_at_once_agree(tmp_path):
    methods = multiprocessing.get_all_start_methods()
    ctx = multiprocessing.get_context("fork" if "fork" in methods else "spawn")
    q = ctx.Queue()
    procs = [ctx.Process(target=_device_in_child, args=(tmp_path, q)) for _ in range(3)]
    for p in procs:
        p.start()
    got = {q.get(timeout=60) for _ in procs}
    for p in procs:
        p.join(timeout=60)
    assert len(got) == 1
    _kept.cache_clear()
    assert this_device(tmp_path, {}) in got


def test_stores_record_the_device_of_their_handle(tmp_path):
    s = FieldStore.create(tmp_path / "d.asf", header(), who="ann", device="tablet-A")
    assert s.device == "tablet-A" and s.history()[0].device == "tablet-A"
    s.close()
    with FieldStore.open(tmp_path / "d.asf") as again:  # default: this device
        assert again.device == this_device()
