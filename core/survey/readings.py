"""From thickness readings to the thickness of each part region.

For each part region (a whole plate, one leg of an angle, or a loss band) the readings give
count n, minimum, mean and the coefficient of variation COV = s / mean, where s is the
**sample** standard deviation (divisor n - 1). The value used for A, I and Q is the mean by
default (the engineer may choose the minimum: ``policy="minimum"``); the minimum is kept for
local checks. Both are capped at the nominal thickness, the mean reading by reading (a
reading above nominal counts as nominal, so it never raises the value used).

Notes and warnings (objects, not exceptions):
    * COV above 10 % suggests a thickness profile rather than one value (practice borrowed
      from API 579-1 Part 4, general metal loss).
    * fewer than 3 readings in a region (common practice, no source).
    * a reading above nominal: "measurement or drawing error"; the value used is capped.
    * a reading that looks like the wrong unit (0.4 entered as mm on a 10 mm plate reads as
      0.4 in; 12 entered as in on a 1/2 in plate reads as 12 mm).
"""

from __future__ import annotations

import math
from collections.abc import Iterable, Sequence
from dataclasses import dataclass, replace
from typing import TYPE_CHECKING

from core.definition import LossBand, PartThickness, Perforation, SectionDefinition, StationLoss
from core.errors import InputError
from core.errors import where as join
from core.parts import Angle
from core.survey.problems import Problem
from core.survey.stats import fmean, stdev
from core.units import from_internal, scale, to_internal

if TYPE_CHECKING:
    from core.survey.model import Member, Station

COV_LIMIT = 0.10  # practice borrowed from API 579-1 Part 4, general metal loss
MIN_READINGS = 3  # common practice, no source
_ALT_UNITS = ("mm", "in")
_NAMES = {"mm": "millimetres", "in": "inches"}


@dataclass(frozen=True)
class RegionStats:
    """Statistics of the readings of one part region (all thicknesses in mm).

    ``cov`` uses the sample standard deviation (divisor n - 1) and is None when n < 2.
    ``t_used`` is the value for A, I, Q (mean or minimum by ``policy``, capped at nominal);
    ``t_local`` the minimum for local checks (capped at nominal); ``t_mean_capped`` the mean
    of the readings each capped at nominal first (the value used by the mean policy: a
    reading above nominal never raises it), while ``t_mean`` is the mean as read.
    """

    part: str
    region: str | None
    n: int
    t_nominal: float
    t_min: float
    t_mean: float
    cov: float | None
    t_used: float
    t_local: float
    policy: str
    reading_ids: tuple[str, ...] = ()
    notes: tuple[Problem, ...] = ()
    t_mean_capped: float = math.nan

    @property
    def loss_pct(self) -> float:
        """Loss of the value used against nominal, per cent."""
        return 100.0 * (1.0 - self.t_used / self.t_nominal)


def region_stats(
    values_mm: Sequence[float],
    t_nominal: float,
    *,
    part: str,
    region: str | None = None,
    policy: str = "mean",
    reading_ids: Sequence[str] = (),
    where: str = "",
) -> RegionStats:
    """Statistics of readings ``values_mm`` (mm) of a region with nominal ``t_nominal`` (mm).

    Raises:
        InputError: no readings, a non-finite or non-positive value, or an unknown policy.
    """
    if policy not in ("mean", "minimum"):
        raise InputError(f"policy {policy!r} is not 'mean' or 'minimum'", where=where)
    vals = [float(v) for v in values_mm]
    if not vals:
        raise InputError("no readings in this region", where=where)
    for v in vals:
        if not math.isfinite(v) or v <= 0.0:
            raise InputError(f"thickness {v!r} mm is outside the allowed range (> 0)", where=where)
    n = len(vals)
    t_min, t_mean = min(vals), fmean(vals)
    cov = stdev(vals) / t_mean if n >= 2 else None
    # each reading capped at nominal before the mean used: one above nominal (a slip or
    # the mill's tolerance) never raises the thickness used, the conservative reading
    t_mean_capped = fmean([min(v, t_nominal) for v in vals])
    notes: list[Problem] = []
    if n < MIN_READINGS:
        notes.append(
            Problem(
                "note",
                f"only {n} reading(s); at least {MIN_READINGS} per region are expected "
                "(common practice, no source)",
                where,
            )
        )
    if cov is not None and cov > COV_LIMIT:
        notes.append(
            Problem(
                "note",
                f"coefficient of variation {100 * cov:.1f} % exceeds {100 * COV_LIMIT:.0f} %: "
                "the thickness varies; consider a thickness profile rather than one value "
                "(practice borrowed from API 579-1 Part 4, general metal loss)",
                where,
            )
        )
    chosen = t_mean_capped if policy == "mean" else t_min
    return RegionStats(
        part,
        region,
        n,
        t_nominal,
        t_min,
        t_mean,
        cov,
        min(chosen, t_nominal),
        min(t_min, t_nominal),
        policy,
        tuple(reading_ids),
        tuple(notes),
        t_mean_capped,
    )


def cov_clearly_within(values_mm: Sequence[float]) -> bool:
    """True when :func:`region_stats` of these (finite, positive) readings would have no
    note: at least :data:`MIN_READINGS` and a COV below :data:`COV_LIMIT` by more than any
    rounding of plain float arithmetic (1e-9; the float COV is off by about 1e-15). False
    does not mean a note: only that :func:`region_stats` must decide, exactly."""
    n = len(values_mm)
    if n < MIN_READINGS:
        return False
    mean = math.fsum(values_mm) / n
    if not mean > 0.0:
        return False
    var = math.fsum((x - mean) ** 2 for x in values_mm) / (n - 1)
    return math.sqrt(var) / mean < COV_LIMIT - 1e-9


def plausibility(value: float, unit: str, t_nominal: float, where: str = "") -> list[Problem]:
    """Warnings for one reading (``value`` in ``unit``) on a region of nominal ``t_nominal`` mm:
    above nominal, or looking like a unit slip (the other of mm / in fits the nominal)."""
    out: list[Problem] = []
    v = to_internal(value, unit, "length", where=where)
    r = v / t_nominal
    if r < 0.2 or r > 1.5:
        for alt in _ALT_UNITS:
            if scale(alt, unit) == 1.0:
                continue
            a = to_internal(value, alt, "length", where=where)
            if 0.3 <= a / t_nominal <= 1.1:
                out.append(
                    Problem(
                        "warning",
                        f"{value:g} {unit} is {100 * r:.0f} % of the nominal "
                        f"{from_internal(t_nominal, 'length', unit):.4g} {unit}; "
                        f"it looks like a value in {_NAMES[alt]} entered as {unit} (unit slip?)",
                        where,
                    )
                )
                return out
    if v > t_nominal:
        nom = from_internal(t_nominal, "length", unit)
        out.append(
            Problem(
                "warning",
                f"{value:g} {unit} is above the nominal thickness {nom:.4g} {unit}: "
                "measurement or drawing error; it counts as nominal in the value used",
                where,
            )
        )
    return out


def nominal_of(defn: SectionDefinition, part_id: str, where: str = "") -> float:
    """Nominal thickness of a part, mm (raises GeometryError for an unknown part id)."""
    return defn.part(part_id).t


def _groups(station: Station) -> dict[tuple[str, str | None], list]:
    out: dict[tuple[str, str | None], list] = {}
    for r in station.readings:
        out.setdefault((r.part, r.region), []).append(r)
    return out


def station_stats(station: Station, member: Member, policy: str = "mean") -> list[RegionStats]:
    """Statistics of every part region read at ``station``, in reading order.

    Raises:
        InputError / GeometryError / UnitError: unknown parts or unusable values.
    """
    defn = member.definition()
    out = []
    for (part, region), rs in _groups(station).items():
        w = join(member.place(station.id), f"part {part!r}", f"region {region!r}" if region else "")
        vals = [r.mm(join(w, f"reading {r.id!r}")) for r in rs]
        st = region_stats(
            vals,
            nominal_of(defn, part, w),
            part=part,
            region=region,
            policy=policy,
            reading_ids=[r.id for r in rs],
            where=w,
        )
        warns: list[Problem] = []
        for r in rs:
            warns += plausibility(r.value, r.unit, st.t_nominal, join(w, f"reading {r.id!r}"))
        out.append(_with_notes(st, warns))
    return out


def _with_notes(st: RegionStats, more: Iterable[Problem]) -> RegionStats:
    return replace(st, notes=(*more, *st.notes))


def stats_as(stats: Sequence[RegionStats], policy: str) -> list[RegionStats]:
    """The same statistics with the value used by ``policy`` ("mean" or "minimum"): what
    :func:`station_stats` gives with that policy, without reading again."""
    out = []
    for s in stats:
        if s.policy != policy:
            chosen = s.t_mean_capped if policy == "mean" else s.t_min
            s = replace(s, t_used=min(chosen, s.t_nominal), policy=policy)
        out.append(s)
    return out


def station_loss(
    station: Station,
    member: Member,
    policy: str = "mean",
    stats: Sequence[RegionStats] | None = None,
) -> StationLoss:
    """The :class:`StationLoss` (mm) of ``station`` for the engine (see module docstring);
    ``stats``: its :func:`station_stats` when already found (any policy)."""
    defn = member.definition()
    lu = member.length_unit
    place = member.place(station.id)
    stats = station_stats(station, member, policy) if stats is None else stats_as(stats, policy)
    band_ids = {b.id for b in station.bands}
    by_region = {(s.part, s.region): s for s in stats}
    thick: list[PartThickness] = []
    for s in stats:
        if s.region in band_ids:
            continue
        part = defn.part(s.part)
        if s.region is None:
            legs_read = [k[1] for k in by_region if k[0] == s.part and k[1] in ("h", "v")]
            if isinstance(part, Angle) and legs_read:
                for leg in ("h", "v"):
                    if leg not in legs_read:
                        thick.append(PartThickness(s.part, s.t_used, leg))
                continue
            thick.append(PartThickness(s.part, s.t_used))
        elif s.region in ("h", "v") and isinstance(part, Angle):
            thick.append(PartThickness(s.part, s.t_used, s.region))
        else:
            raise InputError(
                f"region {s.region!r} is not a leg ('h', 'v') of an angle nor a band id at this "
                f"station (bands: {sorted(band_ids)})",
                where=join(place, f"part {s.part!r}"),
            )
    bands = []
    for b in station.bands:
        w = join(place, f"band {b.id!r}")
        if b.t is not None:
            t = to_internal(b.t, lu, "length", where=w)
        elif (b.part, b.id) in by_region:
            t = by_region[(b.part, b.id)].t_used
        else:
            raise InputError(
                "the band has neither a thickness t nor readings with region = its id", where=w
            )
        bands.append(
            LossBand(
                b.part,
                to_internal(b.lo, lu, "length", where=w),
                to_internal(b.hi, lu, "length", where=w),
                min(t, nominal_of(defn, b.part, w)),
                b.leg,
            )
        )
    perfs = [
        Perforation(
            p.part,
            to_internal(p.lo, lu, "length", where=join(place, f"perforation {p.id!r}")),
            to_internal(p.hi, lu, "length", where=join(place, f"perforation {p.id!r}")),
        )
        for p in station.perforations
    ]
    return StationLoss(tuple(thick), tuple(bands), tuple(perfs), where=place)
