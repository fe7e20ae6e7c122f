"""The results stay what they were: every output of the golden cases equals its stored copy
(copies made before the speed work; see ``golden_cases``): every character outside numbers
alike, and every number alike to 12 significant digits.

Why not to the last digit printed: the last bit of a float result depends on the machine
(numpy picks its vector kernels by the CPU, and a sum taken in another order rounds
differently). Measured: the copies made on one machine differed on another, with the same
code and the same numpy 2.4.6, in 6 of 21 cases, each time in the 16th or 17th significant
digit only (1.207502448929139 against 1.2075024489291393). Twelve digits keep every change
of engineering that matters (the report prints four) and no noise of the hardware; the
speed work was also checked to the last bit on one machine, before and after each change.

This is a regression property, not a check against an outside source: the sources of each
number are in the tests of its clause.
"""

from __future__ import annotations

import difflib
import math
import re

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


#: a number as the JSON and the tables print it
_NUMBER = re.compile(r"-?\d+(?:\.\d+)?(?:[eE][-+]?\d+)?")
#: significant digits to which two printed numbers must agree
DIGITS = 12


def same_output(want: str, got: str, digits: int = DIGITS) -> bool:
    """Both texts alike outside their numbers, and number by number alike to ``digits``
    significant digits (a number printed with fewer digits must match as printed)."""
    if want == got:
        return True
    if _NUMBER.split(want) != _NUMBER.split(got):
        return False
    a, b = _NUMBER.findall(want), _NUMBER.findall(got)
    if len(a) != len(b):
        return False
    tol = 10.0**-digits
    return all(
        x == y or math.isclose(float(x), float(y), rel_tol=tol) for x, y in zip(a, b, strict=True)
    )


def test_the_comparison_allows_hardware_noise_and_nothing_more() -> None:
    """The numbers of the comparison itself (common practice, no source): the last two
    digits of a 17-digit float may differ; a change in the 11th digit, a sign, a word or a
    dropped number may not."""
    assert same_output('{"value": 1.207502448929139}', '{"value": 1.2075024489291393}')
    assert not same_output('{"value": 1.207502448929139}', '{"value": 1.207502448939139}')
    assert not same_output('{"value": 1.5}', '{"value": -1.5}')
    assert not same_output("RF 0.97 kN", "RF 0.97 kip")
    assert not same_output("a 1 2", "a 1")
    assert not same_output("x 4664", "x 4665")


@pytest.mark.parametrize("name", NAMES)
def test_golden(produced: dict[str, str], name: str) -> None:
    want = (GOLDEN / name).read_text(encoding="utf-8")
    got = produced[name]
    if not same_output(want, got):
        diff = difflib.unified_diff(
            want.splitlines(), got.splitlines(), "stored", "now", n=1, lineterm=""
        )
        pytest.fail(f"{name} differs from its golden copy:\n" + "\n".join(list(diff)[:60]))
