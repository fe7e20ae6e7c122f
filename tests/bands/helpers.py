"""Station runs of the invented sample surveys, for the band tests."""

from __future__ import annotations

import copy

from core.assess import AssessOptions, assess
from core.assess.probe import StationRun
from tests.assess.helpers import sample_doc, survey


def runs_of(doc: dict, standard: str | None = None) -> dict[str, StationRun]:
    """Every station's run of a survey document, by station id."""
    got: list[StationRun] = []
    assess(survey(doc), AssessOptions(standard=standard), on_station=got.append)
    return {r.station.id: r for r in got}


def flattened(doc: dict, keep: tuple[str, str | None] | None = None) -> dict:
    """The survey with every region's readings set to the region's first reading (no
    scatter), except the region ``keep`` (part, region), whose readings stay."""
    d = copy.deepcopy(doc)
    for m in d["members"]:
        for s in m["stations"]:
            first: dict = {}
            for r in s["readings"]:
                k = (r["part"], r.get("region"))
                if k == keep:
                    continue
                r["value"] = first.setdefault(k, r["value"])
    return d


DECK = sample_doc("deck-girder-si.json")
