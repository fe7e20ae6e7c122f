"""The results stay what they were: every output of the golden cases equals its stored copy,
to the last digit printed (copies made before the speed work; see ``golden_cases``).

This is a regression property, not a check against an outside source: the sources of each
number are in the tests of its clause.
"""

from __future__ import annotations

import difflib

import pytest

from tests.assess.golden_cases import GOLDEN, cases, outputs

NAMES = sorted(
    [*cases(), *(f"readings-{s}-{p}.txt" for s in ("deck-girder-si", "through-girder-us")
                 for p in ("mean", "minimum"))]
)  # fmt: skip


@pytest.fixture(scope="module")
def produced() -> dict[str, str]:
    return outputs()


def test_every_copy_is_a_case() -> None:
    assert sorted(p.name for p in GOLDEN.iterdir()) == NAMES


@pytest.mark.parametrize("name", NAMES)
def test_golden(produced: dict[str, str], name: str) -> None:
    want = (GOLDEN / name).read_text(encoding="utf-8")
    got = produced[name]
    if got != want:
        diff = difflib.unified_diff(
            want.splitlines(), got.splitlines(), "stored", "now", n=1, lineterm=""
        )
        pytest.fail(f"{name} differs from its golden copy:\n" + "\n".join(list(diff)[:60]))
