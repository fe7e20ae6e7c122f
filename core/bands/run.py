"""Bands and advice for a whole survey, with one assessment (see :mod:`core.bands`)."""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass

from core.assess import Assessment, AssessOptions, assess
from core.assess.probe import StationRun
from core.bands.advice import RegionRank, rank_regions
from core.bands.options import BandOptions
from core.bands.propagate import Band, first_order, monte_carlo
from core.bands.sigma import RegionSigma, region_sigma
from core.bands.station import StationEvaluator, governing, quantity_keys
from core.names import readable
from core.survey.model import Survey


@dataclass(frozen=True)
class StationBands:
    """The bands at one station.

    Attributes:
        member, station, x: where (x in mm along the member).
        sigmas: each part region's thickness uncertainty.
        bands: per quantity (``"<limit state key>|C"`` the as-found factored capacity in
            the internal unit of its kind, ``"|m"`` the measure), its band.
        names, kinds, symbols: per limit state key, its name, quantity kind, measure symbol.
        governing: the governing limit state's key (None: nothing to govern).
        ranking: the regions, most worth measuring again first (governing quantity).
        runs: engine evaluations spent here.
    """

    member: str
    station: str
    x: float
    sigmas: tuple[RegionSigma, ...]
    bands: Mapping[str, Band]
    names: Mapping[str, str]
    kinds: Mapping[str, str]
    symbols: Mapping[str, str]
    governing: str | None
    ranking: tuple[RegionRank, ...]
    runs: int

    def band(self, key: str, what: str = "m") -> Band | None:
        """The band of a limit state's measure (``"m"``) or capacity (``"C"``)."""
        return self.bands.get(f"{key}|{what}")

    @property
    def governing_band(self) -> Band | None:
        """The governing limit state's measure band, else its capacity band."""
        if self.governing is None:
            return None
        return self.band(self.governing, "m") or self.band(self.governing, "C")

    def what(self, key: str) -> str:
        """A limit state's governing band in words ("web shear RF")."""
        sym = self.symbols.get(key)
        name = readable(self.names[key])
        return f"{name} {sym}" if sym else f"{name} capacity"

    def sentence(self, key: str) -> str:
        """ "RF 0.97, band 0.88-1.06: not settled by the readings" (or settled above / below
        1; a capacity band without a rating says its range only)."""
        b = self.band(key, "m")
        if b is None:
            return ""
        sym = self.symbols[key]
        head = f"{sym} {b.value:.2f}, band {b.p5:.2f}-{b.p95:.2f}"
        if b.straddles(1.0):
            return head + ": not settled by the readings"
        if sym == "RF":
            return head + (
                ": above 1 across the band" if b.p5 >= 1.0 else ": below 1 across the band"
            )
        return head + (": below 1 across the band" if b.p95 <= 1.0 else ": above 1 across the band")


@dataclass(frozen=True)
class MemberBands:
    """The bands of a member's stations and the member's top advice (plain sentences)."""

    member: str
    stations: tuple[StationBands, ...]
    top: tuple[RegionRank, ...]
    advice: tuple[str, ...]


@dataclass(frozen=True)
class SurveyBands:
    """Every member's bands, the options used and the engine evaluations spent."""

    options: BandOptions
    members: tuple[MemberBands, ...]
    runs: int

    def member(self, member_id: str) -> MemberBands:
        for m in self.members:
            if m.member == member_id:
                return m
        raise KeyError(member_id)


def _instruments(run: StationRun) -> dict[tuple[str, str | None], list[str]]:
    out: dict[tuple[str, str | None], list[str]] = {}
    for r in run.station.readings:
        out.setdefault((r.part, r.region), []).append(r.instrument)
    return out


def station_bands(run: StationRun, opts: BandOptions, *, zero: bool = False) -> StationBands:
    """The bands of one assessed station (``zero``: no uncertainty, for checks)."""
    ev = StationEvaluator(run)
    inst = _instruments(run)
    sigmas = tuple(region_sigma(s, inst.get((s.part, s.region), []), opts, zero=zero)
                   for s in run.stats)  # fmt: skip
    sd = {s.key: s.sigma for s in sigmas}
    bands, runs = first_order(ev.evaluate, sd, ev.higher, base=ev.base)
    gov = governing(run.states)
    ranking: tuple[RegionRank, ...] = ()
    if gov is not None:
        c, m = quantity_keys(gov)
        q = m if m in bands else c
        if q in bands:
            ranking = rank_regions(run.station.id, bands[q].grads, sigmas, opts.more)
    if opts.method == "monte_carlo":
        bands, more = monte_carlo(ev.evaluate, sd, ev.higher, opts.samples, opts.seed, ev.base)
        runs += more
    return StationBands(
        run.member.id,
        run.station.id,
        run.ctx.x,
        sigmas,
        bands,
        {ls.key: ls.name for ls in run.states},
        {ls.key: ls.kind for ls in run.states},
        {ls.key: ls.rating.symbol for ls in run.states if ls.rating is not None},
        None if gov is None else gov.key,
        ranking,
        runs,
    )


def member_advice(stations: tuple[StationBands, ...], top: int = 3) -> tuple[RegionRank, ...]:
    """The member's ``top`` regions to measure again: stations whose governing band holds 1
    first, then by the standard deviation the readings would remove (relative to the value);
    a region that narrows nothing is left out."""
    cand = []
    for sb in stations:
        b = sb.governing_band
        if b is None or not sb.ranking:
            continue
        scale = abs(b.value) or 1.0
        for r in sb.ranking:
            if r.narrowing >= 0.005:
                cand.append(((0 if b.straddles(1.0) else 1), -r.sd_gain / scale, r))
    cand.sort(key=lambda t: t[:2])
    return tuple(r for *_, r in cand[:top])


def assess_with_bands(
    survey: Survey,
    opts: AssessOptions | None = None,
    problems: tuple = (),
    band_opts: BandOptions | None = None,
    *,
    zero: bool = False,
) -> tuple[Assessment, SurveyBands]:
    """One assessment of ``survey`` and the bands of every station (the assessment is the
    same as :func:`core.assess.assess` gives)."""
    bo = band_opts or BandOptions()
    by_member: dict[str, list[StationBands]] = {}
    order: list[str] = []

    def take(run: StationRun) -> None:
        if run.member.id not in by_member:
            order.append(run.member.id)
            by_member[run.member.id] = []
        by_member[run.member.id].append(station_bands(run, bo, zero=zero))

    a = assess(survey, opts, problems, on_station=take)
    members = []
    for mid in order:
        sts = tuple(by_member[mid])
        top = member_advice(sts)
        words = tuple(
            r.advice(next(s for s in sts if s.station == r.station).what(
                next(s for s in sts if s.station == r.station).governing or ""))
            for r in top
        )  # fmt: skip
        members.append(MemberBands(mid, sts, top, words))
    runs = sum(s.runs for m in members for s in m.stations)
    return a, SurveyBands(bo, tuple(members), runs)
