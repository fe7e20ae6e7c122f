"""Versions of the survey document and the upgrade from each to the next (plain dicts).

Version 1 kept a member's live load in ``simple_span`` as one axle train (``axles``, ``im``,
``distribution``), rated as if it were the design load. Version 2 keeps only the dead loads
there and moves the live load to the member's ``live_load``: the axle train becomes a vehicle
of kind ``"other"`` (named so the report says where it came from) and the distribution its
``distribution``; version 2 also adds ``survey.use``, ``survey.options``, and a member's
``condition`` and ``structure_type`` (all optional). The family's own live load model
(HL-93, LM71, LM1) now gives the design load; the old train stays available as a vehicle.

:func:`upgrade` never changes its argument; it returns a new document.
"""

from __future__ import annotations

import copy
from typing import Any

V1_TRAIN = "axle train of the version 1 file"


def upgrade_member(member: dict[str, Any]) -> dict[str, Any]:
    """A member dict with a version 1 ``simple_span`` moved to version 2 (idempotent; a
    version 2 member comes back unchanged)."""
    ss = member.get("simple_span")
    if not isinstance(ss, dict) or not ({"axles", "im", "distribution"} & set(ss)):
        return member
    m = copy.deepcopy(member)
    ss = m["simple_span"]
    axles = ss.pop("axles", []) or []
    im = ss.pop("im", 0.0)
    g = ss.pop("distribution", None)
    live = m.get("live_load") or {}
    if axles:
        live.setdefault("vehicles", []).append(
            {"name": V1_TRAIN, "kind": "other", "axles": axles, "im": im}
        )
    if g is not None and "distribution" not in live:
        live["distribution"] = g
        live.setdefault("distribution_basis", "as given in the version 1 file")
    if live:
        m["live_load"] = live
    return m


def trains_moved(doc: dict[str, Any]) -> list[str]:
    """Ids of the members of a version 1 document whose axle train the upgrade moves."""
    out = []
    for m in doc.get("members") or []:
        ss = m.get("simple_span") if isinstance(m, dict) else None
        if isinstance(ss, dict) and ss.get("axles"):
            out.append(str(m.get("id")))
    return out


def upgrade(doc: dict[str, Any]) -> dict[str, Any]:
    """A version 1 survey document as version 2 (a new dict; other versions unchanged)."""
    if not isinstance(doc, dict) or doc.get("version") != 1:
        return doc
    out = copy.deepcopy(doc)
    out["version"] = 2
    members = out.get("members")
    if isinstance(members, list):
        out["members"] = [upgrade_member(m) if isinstance(m, dict) else m for m in members]
    return out
