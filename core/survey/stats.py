"""Exact sample statistics of a few floats, without the cost of ``fractions``.

The standard library's ``statistics.stdev`` computes the sum of squared deviations exactly
with ``Fraction`` objects and returns the correctly rounded square root; that is exact but
slow (most of the time of a reading's statistics). Here the same exact value is found with
plain integers: every finite float is m / 2**k, so over a common power of two the sums are
integers, the sample variance is one integer ratio and its square root is rounded once,
correctly. The result is the same float as ``statistics.stdev`` (a test compares them on
random data); ``fmean`` is the standard library's (already float arithmetic).
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from statistics import fmean

__all__ = ["fmean", "stdev"]


def _sqrt_of_frac(n: int, m: int) -> float:
    """sqrt(n / m), correctly rounded (n >= 0, m > 0 integers)."""
    if n == 0:
        return 0.0
    # scale so that the integer root has at least 60 bits (53 + guard bits), shift even
    shift = max(0, 122 - (n.bit_length() - m.bit_length()))
    shift += shift & 1
    big = n << shift
    a = math.isqrt(big // m)
    a |= a * a * m != big  # round to odd: the sticky bit says the root was not exact
    return math.ldexp(float(a), -(shift // 2))


def stdev(values: Sequence[float]) -> float:
    """Sample standard deviation (divisor n - 1) of finite floats, exactly as
    ``statistics.stdev`` gives it.

    Raises:
        ValueError: fewer than two values or a value that is not finite.
    """
    n = len(values)
    if n < 2:
        raise ValueError("stdev needs at least two values")
    ratios = [float(v).as_integer_ratio() for v in values]  # denominators are powers of 2
    d = max(q for _, q in ratios)
    ms = [p * (d // q) for p, q in ratios]
    s1 = sum(ms)
    s2 = sum(x * x for x in ms)
    # sum of squared deviations / (n - 1) = (n s2 - s1**2) / (n (n - 1) d**2), exactly
    return _sqrt_of_frac(n * s2 - s1 * s1, n * (n - 1) * d * d)
