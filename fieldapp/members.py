"""Members of the open survey: add one from the girder template, copy one (its as-built
values, without the stations and readings), rename it, withdraw it. No kivy; every change
goes through core's field store (one change each in the history, undone with Undo)."""

from __future__ import annotations

from core.errors import InputError
from core.survey.store import Saved
from fieldapp import templates
from fieldapp.session import Session


def next_member_id(s: Session) -> str:
    """The first free member name ``G<n>`` (withdrawn ones stay taken)."""
    used = s.store.used_member_ids()
    n = len(used) + 1
    while f"G{n}" in used:
        n += 1
    return f"G{n}"


def _check_id(s: Session, member_id: str) -> str:
    mid = member_id.strip()
    if not mid:
        raise InputError("member name: no name typed")
    if mid in s.store.used_member_ids():
        raise InputError(f"member id {mid!r} is already used (ids are never reused)")
    return mid


def add_member(s: Session, member_id: str = "") -> Saved:
    """A new member from the girder template of the survey's unit system; it becomes the
    current member."""
    mid = _check_id(s, member_id or next_member_id(s))
    data = templates.girder_member(mid, s.header.get("unit_system", "si"))
    saved = s.store.add_member(data, s.who)
    s.select(member=saved.id)
    return saved


def copy_member(s: Session, member_id: str = "") -> Saved:
    """A copy of the current member's as-built values under a new id. Nothing found on the
    member is copied: no stations, stiffener readings or bands, rivet states or condition
    (those are measured on the new member)."""
    mid = _check_id(s, member_id or next_member_id(s))
    data = s.member().model_dump(mode="json")
    data.pop("stations", None)
    for st in data.get("stiffeners") or []:
        st["readings"], st["bands"] = [], []
    for run in data.get("rivets") or []:
        run["states"] = []  # rivets found loose or missing are the other member's
    data["condition"] = None  # a condition state is found on each member, never copied
    data["id"] = mid
    src = s.member_id
    data["label"] = f"copy of {data.get('label') or src}"
    saved = s.store.add_member(data, s.who)
    s.select(member=saved.id)
    return saved


def rename_member(s: Session, label: str) -> Saved:
    """A new name shown for the current member (its id stays: the history and merges know
    the member by it)."""
    new = " ".join(label.split())
    survey = s.store.to_survey()
    for m in survey.members:
        if m.id == s.member_id or not new:
            continue
        if new.casefold() in (m.id.casefold(), (m.label or "").casefold()):
            raise InputError(
                f"name {new!r} for member {s.member_id!r} is already member {m.id!r}'s "
                f"{'id' if new.casefold() == m.id.casefold() else 'name'}: each member needs "
                "a name of its own, so that nobody measures the wrong one",
                where=f"member {s.member_id!r}",
            )
    return s.store.update_member(s.member_id, {"label": new}, s.who)


def delete_member(s: Session) -> str:
    """Withdraw the current member (soft); the member shown next is the first left."""
    mid = s.member_id
    if len(s.member_ids()) <= 1:
        raise InputError(f"member {mid!r} is the only member: add another one first")
    s.store.delete_member(mid, s.who)
    s.after_removal()
    return mid
