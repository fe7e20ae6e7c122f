"""``asfound section FILE [--json] [--units si|us]``: properties and shear of one section file.

Prints the as-built and the as-found properties of the gross section (shear) and the net
section (flexure), the shear stress profile for the file's shear force (or 1 kN / 1 kip when
none is given), the jumps at width changes, and the shear flow at every rivet line.
"""

from __future__ import annotations

import json
import sys

from core import CAUTION
from core.section import StationSection, analyse
from core.sectionfile import load_section_file
from core.textable import render
from core.units import display_unit as du
from core.units import from_internal, show, symbol

JSON_FORMAT = "asfound.section-result"
JSON_VERSION = 1


def register(sub) -> None:
    p = sub.add_parser(
        "section",
        help="properties and shear stress of a section description file",
        description=__doc__.splitlines()[0],
    )
    p.add_argument("file", help="section description (JSON, format asfound.section)")
    p.add_argument("--json", action="store_true", help="machine-readable output")
    p.add_argument("--units", choices=("si", "us"), help="unit system of the output")
    p.set_defaults(func=run)


def _state(st: StationSection, V: float, system: str) -> dict:
    """JSON-ready result of one state, values in the display units of ``system``."""

    def conv(v: float, kind: str) -> float:
        return from_internal(v, kind, du(kind, system))

    out: dict = {"gross": {}, "net": {}}
    for key, sec in (("gross", st.gross), ("net", st.net)):
        for sym, desc, val, kind in sec.props.rows():
            out[key][sym] = {
                "value": conv(val, kind),
                "unit": du(kind, system),
                "description": desc,
            }
    out["shear_applicable"] = st.shear_applicable
    out["finding"] = st.finding
    if st.shear_applicable:
        prof = st.gross.profile
        tmax, ymax = prof.tau_max(V)
        out["tau_max"] = {
            "value": conv(tmax, "stress"),
            "unit": du("stress", system),
            "at_height": conv(ymax, "length"),
            "height_unit": du("length", system),
        }
        out["jumps"] = [
            {
                "height": conv(j.y, "length"),
                "t_below": conv(j.t_below, "length"),
                "t_above": conv(j.t_above, "length"),
                "Q": conv(j.Q, "first_moment"),
                "tau_below": conv(j.tau_below, "stress"),
                "tau_above": conv(j.tau_above, "stress"),
                "units": {
                    "height": du("length", system),
                    "t": du("length", system),
                    "Q": du("first_moment", system),
                    "tau": du("stress", system),
                },
            }
            for j in prof.jumps(V)
        ]
        out["shear_flow"] = [
            {
                "line": ln.id,
                "q_interface": conv(st.shear_flow(ln.id, V), "force_per_length"),
                "q_per_line": conv(st.shear_flow(ln.id, V) / ln.n_lines, "force_per_length"),
                "unit": du("force_per_length", system),
            }
            for ln in st.definition.rivet_lines
            if ln.outside
        ]
    return out


def run(args) -> int:
    defn, loss, V, doc = load_section_file(args.file)
    system = args.units or ("us" if str(doc.get("length_unit", "mm")) in ("in", "inch") else "si")
    if V is None:
        V = 1000.0 if system == "si" else 4448.2216152605
    built = analyse(defn)
    found = analyse(defn, loss)
    Vshow = show(V, "force", system)
    if args.json:
        res = {
            "format": JSON_FORMAT,
            "version": JSON_VERSION,
            "file": str(args.file),
            "section": defn.name,
            "unit_system": system,
            "V": {"value": Vshow.value, "unit": Vshow.unit},
            "as_built": _state(built, V, system),
            "as_found": _state(found, V, system),
            "caution": CAUTION,
        }
        json.dump(res, sys.stdout, indent=2, ensure_ascii=False)
        sys.stdout.write("\n")
        return 0
    print(f"Section: {defn.name}   ({args.file})   units: {system.upper()}")
    print(f"CAUTION: {CAUTION}\n")
    rows = []
    for (sym, desc, vb, kind), (_, _, vf, _) in zip(
        built.gross.props.rows(), found.gross.props.rows(), strict=True
    ):
        sb, sf = show(vb, kind, system), show(vf, kind, system)
        ratio = vf / vb if vb else float("nan")
        rows.append(
            (sym, desc, sb.value, sf.value, ratio if kind != "length" else None, symbol(sb.unit))
        )
    nb, nf = built.net.props, found.net.props
    for sym in ("A", "Ix", "S_top", "S_bot"):
        kind = nb.META[sym][0]
        vb, vf = getattr(nb, sym), getattr(nf, sym)
        rows.append(
            (
                f"{sym} net",
                "net section (rivet holes deducted)",
                show(vb, kind, system).value,
                show(vf, kind, system).value,
                vf / vb,
                symbol(du(kind, system)),
            )
        )
    print(
        render(
            ("symbol", "description", "as-built", "as-found", "ratio", "unit"),
            rows,
            "Properties (gross section for shear; net section for flexure)",
        )
    )
    print()
    print(f"Shear stress tau = V Q / (I t) for V = {Vshow.value:.4g} {symbol(Vshow.unit)}")
    for label, st in (("as-built", built), ("as-found", found)):
        if not st.shear_applicable:
            print(f"  {label}: {st.finding}")
            continue
        tmax, ymax = st.gross.profile.tau_max(V)
        print(
            f"  {label}: tau max {show(tmax, 'stress', system).value:.4g} "
            f"{symbol(du('stress', system))} at height {show(ymax, 'length', system).value:.4g} "
            f"{symbol(du('length', system))}"
        )
    for label, st in (("as-built", built), ("as-found", found)):
        if not st.shear_applicable:
            continue
        L, S = symbol(du("length", system)), symbol(du("stress", system))
        jrows = [
            (
                show(j.y, "length", system).value,
                show(j.t_below, "length", system).value,
                show(j.t_above, "length", system).value,
                show(j.tau_below, "stress", system).value,
                show(j.tau_above, "stress", system).value,
            )
            for j in st.gross.profile.jumps(V)
        ]
        print()
        print(
            render(
                (f"height {L}", f"t below {L}", f"t above {L}", f"tau below {S}", f"tau above {S}"),
                jrows,
                f"Width changes, {label}",
            )
        )
        qrows = [
            (
                ln.id,
                ", ".join(ln.outside),
                ln.n_lines,
                show(st.shear_flow(ln.id, V) / ln.n_lines, "force_per_length", system).value,
            )
            for ln in st.definition.rivet_lines
            if ln.outside
        ]
        if qrows:
            print()
            q = symbol(du("force_per_length", system))
            print(
                render(
                    ("rivet line", "parts outside the interface", "lines", f"q per line {q}"),
                    qrows,
                    f"Shear flow q = V Q / I, {label}",
                )
            )
    return 0
