"""Validation of a member's girder details (:mod:`core.survey.details`): every problem, each
naming the value, the allowed range and the place (member / stiffener / reading, support,
bracing)."""

from __future__ import annotations

from core.errors import where as join
from core.survey.checkitems import _kind
from core.survey.model import Member
from core.survey.problems import Problem


def _dupes(ids: list[str], what: str, w: str) -> list[Problem]:
    d = sorted({i for i in ids if ids.count(i) > 1})
    return [Problem("error", f"duplicate {what} ids {d}", w)] if d else []


def _position(m: Member, p: float, L: float | None, w: str, probs: list[Problem]) -> None:
    x = _kind(p, m.position_unit, "length", w, probs)
    if x is not None and L is not None and not -1e-6 <= x <= L + 1e-6:
        f = _kind(1.0, m.position_unit, "length", w, []) or 1.0
        probs.append(
            Problem(
                "error",
                f"position {p:g} {m.position_unit} is outside the member (0 to {L / f:g} "
                f"{m.position_unit})",
                w,
            )
        )


def check_details(m: Member, L: float | None, where: str = "") -> list[Problem]:
    """Problems of a member's stiffeners, supports, bracing and fatigue data (``L`` the span
    in mm, None when it is unusable)."""
    probs: list[Problem] = []
    w = join(where, m.place())
    lu = m.length_unit
    probs += _dupes([s.id for s in m.stiffeners], "stiffener", w)
    ids = {s.id: s for s in m.stiffeners}
    for s in m.stiffeners:
        ws = join(w, f"stiffener {s.id!r}")
        _position(m, s.position, L, join(ws, "position"), probs)
        _kind(1.0, lu, "length", ws, probs)
        if s.kind == "angles" and s.b_conn is None:
            probs.append(Problem("error", "an angle stiffener needs its connected leg b_conn", ws))
        if s.kind == "plates" and (s.b_conn or s.t_fill or s.per_side != 1):
            probs.append(
                Problem(
                    "error",
                    "a plate stiffener has no connected leg, filler or second plate per face "
                    f"(b_conn {s.b_conn!r}, t_fill {s.t_fill:g}, per_side {s.per_side}); give "
                    "kind 'angles' for angles",
                    ws,
                )
            )
        legs = [s.b] + ([s.b_conn] if s.kind == "angles" and s.b_conn else [])
        if s.t >= min(legs):
            probs.append(
                Problem(
                    "error",
                    f"t = {s.t:g} {lu} must be less than the projecting width b = {s.b:g} {lu}"
                    + (f" and the connected leg {s.b_conn:g} {lu}" if s.kind == "angles" else ""),
                    ws,
                )
            )
        probs += _dupes([b.id for b in s.bands], "band", ws)
        probs += _dupes([r.id for r in s.readings], "reading", ws)
        bands = {b.id for b in s.bands}
        for b in s.bands:
            wb = join(ws, f"band {b.id!r}")
            if not b.hi > b.lo:
                probs.append(
                    Problem("error", f"hi = {b.hi:g} {lu} must be above lo = {b.lo:g} {lu}", wb)
                )
            for name in ("t", "t_conn"):
                v = getattr(b, name)
                if v is not None and v > s.t:
                    probs.append(
                        Problem(
                            "warning",
                            f"{name} = {v:g} {lu} is above the nominal {s.t:g} {lu}: capped at "
                            "nominal",
                            wb,
                        )
                    )
            if b.t_conn is not None and s.kind == "plates":
                probs.append(Problem("error", "t_conn applies to angle stiffeners only", wb))
            if b.b_lost >= s.b:
                probs.append(
                    Problem(
                        "error",
                        f"b_lost = {b.b_lost:g} {lu} takes the whole projecting width "
                        f"{s.b:g} {lu} (allowed: 0 up to less than b)",
                        wb,
                    )
                )
        t_mm = _kind(s.t, lu, "length", ws, []) or 0.0
        for r in s.readings:
            wr = join(ws, f"reading {r.id!r}")
            v = _kind(r.value, r.unit, "length", wr, probs)
            if r.band is not None and r.band not in bands:
                probs.append(
                    Problem(
                        "error",
                        f"band {r.band!r} is not a band of the stiffener; its bands: "
                        f"{sorted(bands)}",
                        wr,
                    )
                )
            if r.element == "connected" and s.kind == "plates":
                probs.append(
                    Problem("error", "readings of connected legs apply to angles only", wr)
                )
            if v is not None and not v > 0.0:
                probs.append(Problem("error", f"reading {r.value:g} {r.unit} must be above 0", wr))
            elif v is not None and v > t_mm * (1.0 + 1e-9):
                probs.append(
                    Problem(
                        "warning",
                        f"{r.value:g} {r.unit} is above the nominal thickness {s.t:g} {lu}: "
                        "measurement or drawing error; it counts as nominal in the value used",
                        wr,
                    )
                )
    probs += _dupes([s.id for s in m.supports], "support", w)
    for s in m.supports:
        wp = join(w, f"support {s.id!r}")
        _position(m, s.position, L, join(wp, "position"), probs)
        N = _kind(s.N.value, s.N.unit, "length", join(wp, "N"), probs)
        if N is not None and not 0.0 <= N <= 5000.0:
            probs.append(Problem("error", f"N = {s.N.value:g} {s.N.unit} is outside 0 to 5 m", wp))
        if s.overhang is not None:
            o = _kind(s.overhang.value, s.overhang.unit, "length", join(wp, "overhang"), probs)
            if o is not None and not 0.0 <= o <= 10_000.0:
                probs.append(
                    Problem(
                        "error",
                        f"overhang {s.overhang.value:g} {s.overhang.unit} is outside 0 to 10 m",
                        wp,
                    )
                )
        if s.stiffener is not None:
            st = ids.get(s.stiffener)
            if st is None:
                probs.append(
                    Problem(
                        "error",
                        f"stiffener {s.stiffener!r} is not a stiffener of the member; known: "
                        f"{sorted(ids)}",
                        wp,
                    )
                )
            elif st.role != "bearing":
                probs.append(
                    Problem(
                        "warning",
                        f"stiffener {s.stiffener!r} over the support is not a bearing stiffener",
                        wp,
                    )
                )
    if m.bracing is not None:
        for name in ("top", "bottom"):
            fb = getattr(m.bracing, name)
            if fb is None:
                continue
            wb = join(w, "bracing", name)
            for p in fb.points:
                _position(m, p, L, wb, probs)
            if fb.kind == "discrete" and not fb.points:
                probs.append(Problem("warning", "discrete bracing without brace points", wb))
            if fb.kind == "u_frames":
                uf = fb.u_frames
                if uf is None:
                    probs.append(
                        Problem("error", "bracing kind 'u_frames' needs its u_frames data", wb)
                    )
                    continue
                wu = join(wb, "u_frames")
                for p in uf.positions:
                    _position(m, p, L, wu, probs)
                for name_, kind in (
                    ("Cd", "force_per_length"),
                    ("Iv", "inertia"),
                    ("hv", "length"),
                    ("Iq", "inertia"),
                    ("bq", "length"),
                    ("Cj", "moment"),
                ):
                    q = getattr(uf, name_)
                    if q is not None:
                        v = _kind(q.value, q.unit, kind, join(wu, name_), probs)
                        if v is not None and not v > 0.0:
                            probs.append(
                                Problem(
                                    "error", f"{name_} = {q.value:g} {q.unit} must be above 0", wu
                                )
                            )
                if uf.vertical is not None and uf.vertical not in ids:
                    probs.append(
                        Problem(
                            "error",
                            f"vertical {uf.vertical!r} is not a stiffener of the member; known: "
                            f"{sorted(ids)}",
                            wu,
                        )
                    )
                if uf.Cd is None and (
                    uf.hv is None
                    or uf.Iq is None
                    or uf.bq is None
                    or (uf.Iv is None and uf.vertical is None)
                ):
                    probs.append(
                        Problem(
                            "error",
                            "U-frames need their stiffness Cd, or hv, Iq, bq and the vertical (a "
                            "stiffener id or Iv)",
                            wu,
                        )
                    )
    return probs
