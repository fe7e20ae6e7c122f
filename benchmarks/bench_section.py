"""Benchmark of the section engine (run on demand: ``python -m benchmarks.bench_section``).

Measures, as the median of repeats on this machine:
- building and computing the properties (gross and net, connectivity) of a 12-part riveted
  girder with 42 plate holes in the section and 3 loss bands (target < 0.5 ms), for a
  definition already analysed once (what a definition shares between stations is worked
  out on its first analysis);
- the tau profile at 2,000 heights (target < 1 ms);
- the same geometric properties from a general finite-element section library
  (sectionproperties, when installed), as a speed ratio (target: ours >= 30x faster) and the
  largest relative difference of A, centroid and Ix.
"""

from __future__ import annotations

import numpy as np

from benchmarks.common import median_seconds, table
from core.definition import (
    LossBand,
    PartThickness,
    RivetLine,
    SectionDefinition,
    StationLoss,
    riveted_girder,
)
from core.geometry import net_pieces
from core.section import analyse


def girder_12_parts_40_holes() -> tuple[SectionDefinition, StationLoss]:
    """Web, four angles, three cover plates on top and four below (12 parts), with 42 plate
    holes in the section (a hole through one plate or angle leg counts once): two lines
    through the angles and the web (6 holes) and two lines a side through the angle and the
    covers of each flange (16 holes on top, 20 below)."""
    base = riveted_girder(
        D=1800,
        tw=12,
        angle_h=150,
        angle_v=150,
        angle_t=16,
        covers_top=((450, 14), (450, 14), (400, 12)),
        covers_bottom=((450, 14), (450, 14), (420, 12), (380, 10)),
        web_recess=6,
        rivet_d=22,
        rivet_hole=23.5,
    )
    lines = [ln for ln in base.rivet_lines if ln.axis == "horizontal"]
    top = tuple(p.id for p in base.parts if p.id.startswith("cover_top"))
    bot = tuple(p.id for p in base.parts if p.id.startswith("cover_bottom"))
    for lab, ids, (left, right) in (
        ("t", top, ("angle_tl", "angle_tr")),
        ("b", bot, ("angle_bl", "angle_br")),
    ):
        for g in (51.0, 116.0):
            for side, ang in ((-1, left), (1, right)):
                lines.append(
                    RivetLine(
                        f"c{lab}{side * g:+.0f}",
                        "vertical",
                        side * g,
                        22,
                        23.5,
                        100,
                        (ang, *ids),
                        1,
                        ids,
                        4,
                    )
                )
    defn = SectionDefinition(base.parts, tuple(lines), "benchmark girder")
    loss = StationLoss(
        (
            PartThickness("web", 9.5),
            PartThickness("angle_bl", 13.0),
            PartThickness("cover_bottom_4", 8.0),
        ),
        (
            LossBand("web", 156, 260, 6.0),
            LossBand("web", 300, 340, 8.0),
            LossBand("cover_bottom_4", -150, -60, 5.0),
        ),
    )
    return defn, loss


def plate_holes(defn: SectionDefinition) -> int:
    return sum(len(ln.parts) for ln in defn.rivet_lines)


def run() -> str:
    defn, loss = girder_12_parts_40_holes()
    assert len(defn.parts) == 12 and plate_holes(defn) >= 40
    st = analyse(defn, loss)
    t_build = median_seconds(lambda: analyse(defn, loss))
    prof = st.gross.profile
    y = np.linspace(st.gross.props.y_bot, st.gross.props.y_top, 2000)
    V = 800e3
    t_tau = median_seconds(lambda: prof.tau(y, V))
    # build the profile and evaluate it, from the section's edges
    from core.shear import ShearProfile, WidthProfile

    t_tau_cold = median_seconds(
        lambda: ShearProfile(
            WidthProfile.from_edges(st.gross.edges, st.gross.props.yc), st.gross.props.Ix
        ).tau(y, V)
    )
    rows = [
        (
            f"build + properties, 12 parts, {plate_holes(defn)} holes, 3 bands",
            f"{t_build * 1e3:.3f} ms",
            "< 0.5 ms",
            "yes" if t_build < 0.5e-3 else "no",
        ),
        (
            "tau at 2,000 heights (profile built)",
            f"{t_tau * 1e3:.3f} ms",
            "< 1 ms",
            "yes" if t_tau < 1e-3 else "no",
        ),
        (
            "tau at 2,000 heights (profile from edges)",
            f"{t_tau_cold * 1e3:.3f} ms",
            "< 1 ms",
            "yes" if t_tau_cold < 1e-3 else "no",
        ),
    ]
    try:
        import shapely
        from sectionproperties.analysis.section import Section as FESection
        from sectionproperties.pre.geometry import Geometry
    except ImportError:
        rows.append(("finite-element library", "not installed", ">= 30x slower", "-"))
        return table(rows)
    pieces = net_pieces(defn, st.gross.pieces, exact=True)
    merged = shapely.set_precision(shapely.union_all(shapely.box(*pieces.rects.T)), 1e-6)
    geoms = list(getattr(merged, "geoms", [merged]))

    def fe():
        g = None
        for poly in geoms:
            gg = Geometry(poly)
            g = gg if g is None else g + gg
        g.create_mesh(mesh_sizes=[500.0])
        sec = FESection(g)
        sec.calculate_geometric_properties()
        return sec

    sec = fe()
    t_fe = median_seconds(fe, repeat=5, min_time=0.2)
    p = st.net.props
    _, cy = sec.get_c()
    diff = max(abs(p.A / sec.get_area() - 1), abs(p.yc / cy - 1), abs(p.Ix / sec.get_ic()[0] - 1))
    ratio = t_fe / t_build
    rows.append(("finite-element library, same net section", f"{t_fe * 1e3:.1f} ms", "-", "-"))
    rows.append(
        ("speed ratio (FE / ours)", f"{ratio:.0f}x", ">= 30x", "yes" if ratio >= 30 else "no")
    )
    rows.append(
        (
            "largest relative difference A, yc, Ix",
            f"{diff:.1e}",
            "<= 1e-6",
            "yes" if diff <= 1e-6 else "no",
        )
    )
    return table(rows)


if __name__ == "__main__":
    print(run())
