"""Irregularity screening (ASCE 7-16 Tables 12.3-1, 12.3-2) and the redundancy factor rho
(§12.3.4), by story and direction, from the shear walls' geometry and nominal capacities.

Story strength in a direction: sum of k L v_s (k of SDPWS-2015 §4.3.3.4.1, nominal seismic
unit shear); stiffness: sum of segment stiffness from the bending and shear terms of SDPWS
Eq. 4.3-1 (anchorage slip left out of this screen). Both come from the spec, not from forces,
so nothing here depends on the base shear (no circular reference through §12.8.1.3).
Ids: `reg.seg.<level>.<line>.<seg>.*`, `reg.<level>.<dir>.*`, `reg.mass.<level>.*`,
`irr.<type>.*`, `irr.*`, `rho.*`.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from latbook.engine.asce7_16 import irregularity as irr
from latbook.engine.asce7_16 import redundancy as red
from latbook.engine.sdpws import sheathing
from latbook.spec.models import Spec
from latbook.spec.wall_heights import segment_height_ft, story_height_ft
from latbook.spec.wall_stories import SegmentPlace, StoryPlace, wall_stories

EPS_FT = 1e-6
DIRS = ("x", "y")
PRESENT, NONE = "present", "none"
CHECKED, DECLARED = "checked by this workbook", "declared by the designer"
NOT_REQUIRED = "not required"
OK, FAILS = "ok", "FAILS"
MET, NOT_MET = "met", "not met"

COLLECTOR_25 = (
    "§12.3.3.4 (SDC D-F): collector forces from §12.10.1.1 +25 %, applied on the diaphragm sheets"
)
IRREGULARITIES: tuple[tuple[str, str, str, str], ...] = (
    ("H1a", "Torsional", "declared", COLLECTOR_25),
    (
        "H1b",
        "Extreme torsional",
        "declared",
        COLLECTOR_25 + "; rho = 1.3 in SDC D (§12.3.4.2); not permitted in SDC E, F (§12.3.3.1)",
    ),
    ("H2", "Reentrant corner", "checked", COLLECTOR_25),
    ("H3", "Diaphragm discontinuity", "declared", COLLECTOR_25),
    ("H4", "Out-of-plane offset", "checked", COLLECTOR_25 + "; §12.3.3.3 supports with Ω0"),
    ("H5", "Nonparallel system", "checked", "§12.5.3 orthogonal combination (designer)"),
    ("V1a", "Soft story", "checked", "§12.8.1.3 not available"),
    ("V1b", "Extreme soft story", "checked", "not permitted in SDC E, F (§12.3.3.1)"),
    ("V2", "Weight (mass)", "checked", "§12.8.1.3 not available"),
    ("V3", "Vertical geometric", "declared", "§12.8.1.3 not available"),
    (
        "V4",
        "In-plane discontinuity",
        "checked",
        COLLECTOR_25 + "; §12.3.3.3 elements supporting the wall with Ω0 (designer)",
    ),
    ("V5a", "Weak story", "checked", "§12.8.1.3 not available"),
    (
        "V5b",
        "Extreme weak story",
        "checked",
        "not permitted in SDC E, F (§12.3.3.1); §12.3.3.2 height limit (designer)",
    ),
)
"""(type, name, basis, what follows when present) in Table 12.3-1 / 12.3-2 order."""

DECLARATION_FIELD = {
    "H1a": "torsional_1a",
    "H1b": "extreme_torsional_1b",
    "H3": "diaphragm_discontinuity_3",
    "V3": "vertical_geometric_3",
}
STATIC_DETAIL = {
    "H2": "every level's plan is a rectangle",
    "H4": "each wall line keeps its plan position and continues to the base (spec rule)",
    "H5": "every wall line is parallel to x or y",
}
COLLECTOR_TYPES = ("H1a", "H1b", "H2", "H3", "H4", "V4")
HORIZONTAL_TYPES = ("H1a", "H1b", "H2", "H3", "H4", "H5")


@dataclass(frozen=True)
class StoryDir:
    """One story (below `level`) in one direction, with its segments."""

    story: StoryPlace
    dir: str
    segments: tuple[SegmentPlace, ...]
    above: str | None
    above3: tuple[str, ...]

    @property
    def key(self) -> str:
        return f"{self.story.level.id}.{self.dir}"


def story_dirs(spec: Spec) -> list[StoryDir]:
    """Every wall story and direction, roof first, x before y."""
    stories = wall_stories(spec)
    ids = [s.level.id for s in stories]
    out = []
    for i, story in enumerate(stories):
        for d in DIRS:
            segs = tuple(s for s in story.segments if s.line.direction == d)
            out.append(
                StoryDir(
                    story,
                    d,
                    segs,
                    ids[i - 1] if i > 0 else None,
                    tuple(ids[max(0, i - 3) : i][::-1]) if i >= 3 else (),
                )
            )
    return out


def perimeter_side(spec: Spec, seg: SegmentPlace) -> str:
    """'lo' / 'hi' where the segment's line lies on the plan edge, else 'interior'."""
    level = next(lv for lv in spec.building.levels if lv.id == seg.level)
    lo, hi = (
        (level.plan.y_min_ft, level.plan.y_max_ft)
        if seg.line.direction == "x"
        else (level.plan.x_min_ft, level.plan.x_max_ft)
    )
    if abs(seg.line.position_ft - lo) <= EPS_FT:
        return "lo"
    if abs(seg.line.position_ft - hi) <= EPS_FT:
        return "hi"
    return "interior"


def _spanning_count(seg: SegmentPlace, story: StoryPlace) -> int | str:
    """How many segments on the same line in the story below span the whole segment (within
    EPS_FT); '-' in the lowest story."""
    if story.below is None:
        return "-"
    s0, s1 = seg.segment.start_ft, seg.segment.start_ft + seg.segment.length_ft
    return sum(
        other.start_ft <= s0 + EPS_FT and other.start_ft + other.length_ft >= s1 - EPS_FT
        for st in seg.line.stories
        if st.level == story.below.id
        for other in st.segments
    )


def _supported(n_span: int | str) -> str:
    """'base' in the lowest story; else 'yes' where a segment in the story below spans the
    whole segment, 'no' otherwise (in-plane discontinuity, Table 12.3-2 Type 4)."""
    if isinstance(n_span, str):
        return "base"
    return "yes" if n_span > 0 else "no"


def regularity_results(
    spec: Spec,
    sdc: str,
    share_by_level: dict[str, float],
    w_by_level: dict[str, float],
    out: dict[str, Any],
) -> float:
    """Screen the irregularities and determine rho; returns rho used (typed or determined)."""
    s = spec.seismic
    assert s is not None
    if not spec.wall_lines:
        return s.rho if s.rho_method == "typed" else red.RHO_REDUNDANT
    walls = {a.id: a for a in spec.assemblies.shear_walls}
    rows = story_dirs(spec)
    sd_out: dict[str, dict[str, Any]] = {}
    unsupported = 0
    for sd in rows:
        lv = sd.story.level.id
        hsx = story_height_ft(sd.story.level, sd.story.below)
        segs = []
        for seg in sd.segments:
            a = walls[seg.segment.assembly]
            # the walls sheets' sheathed height and capacity-basis k (SDPWS-2015 §4.3.4)
            h = segment_height_ft(sd.story.level, sd.story.below, seg.segment)
            L = seg.segment.length_ft
            k = sheathing.wall_aspect_factor(h / L, a.sheathing, "capacity")
            stiff = (
                irr.segment_stiffness_lb_per_in(
                    h, L, a.end_post_E_psi, a.end_post_A_in2, a.Ga_seismic_kips_per_in
                )
                if k > 0
                else 0.0
            )
            n_span = _spanning_count(seg, sd.story)
            supported = _supported(n_span)
            unsupported += supported == "no"
            segs.append(
                {
                    "h": h,
                    "L": L,
                    "ar": h / L,
                    "strength": k * L * a.vs_nominal_plf,
                    "stiff": stiff,
                    "side": perimeter_side(spec, seg),
                    "bays": red.light_frame_bays(L, hsx) if k > 0 else 0.0,
                    "x0": seg.segment.start_ft,
                    "x1": seg.segment.start_ft + L,
                    "n_span": n_span,
                    "supported": supported,
                    "key": seg.key,
                }
            )
        strength = sum(g["strength"] for g in segs)
        cum = 0.0
        for n, g in enumerate(segs):
            g["removable"] = "yes" if red.wall_is_removable(g["ar"]) else "no"
            g["share"] = (
                red.strength_reduction(g["strength"], strength) if g["removable"] == "yes" else 0.0
            )
            cum = g["share"] if n == 0 else max(cum, g["share"])
            g["cum_share"] = cum
            base = f"reg.seg.{lv}.{g['key']}"
            for key in (
                "h",
                "L",
                "ar",
                "strength",
                "stiff",
                "removable",
                "share",
                "cum_share",
                "side",
                "bays",
                "x0",
                "x1",
                "n_span",
                "supported",
            ):
                out[f"{base}.{key}"] = g[key]
        share = share_by_level[lv]
        significant = red.story_is_significant(share)
        bays_lo = sum(g["bays"] for g in segs if g["side"] == "lo")
        bays_hi = sum(g["bays"] for g in segs if g["side"] == "hi")
        q = {
            "hsx": hsx,
            "strength": strength,
            "stiff": sum(g["stiff"] for g in segs),
            "share": share,
            "significant": "yes" if significant else "no",
            "removal_max": cum,
            "removal": (OK if red.removal_test_ok(cum) else FAILS) if significant else NOT_REQUIRED,
            "bays_lo": bays_lo,
            "bays_hi": bays_hi,
            "perimeter": (
                (OK if red.perimeter_ok(bays_lo, bays_hi) else FAILS)
                if significant
                else NOT_REQUIRED
            ),
        }
        sd_out[sd.key] = q
    for sd in rows:
        q = sd_out[sd.key]
        if sd.above is None:
            q["weak_ratio"], q["soft_ratio"], q["soft_ratio3"] = "-", "-", "-"
            q["weak"], q["soft"] = NONE, NONE
        else:
            up = sd_out[f"{sd.above}.{sd.dir}"]
            q["weak_ratio"] = q["strength"] / up["strength"]
            q["soft_ratio"] = q["stiff"] / up["stiff"]
            if sd.above3:
                avg = sum(sd_out[f"{a}.{sd.dir}"]["stiff"] for a in sd.above3) / 3.0
                q["soft_ratio3"] = q["stiff"] / avg
            else:
                q["soft_ratio3"] = "-"
            q["weak"] = irr.weak_story(q["weak_ratio"])
            r3 = q["soft_ratio3"] if sd.above3 else None
            q["soft"] = irr.soft_story(q["soft_ratio"], r3)
        for key, value in q.items():
            out[f"reg.{sd.key}.{key}"] = value

    mass_count = _mass_results(spec, w_by_level, out)
    stories = [sd_out[sd.key] for sd in rows]
    outcome = {
        "H2": NONE,
        "H4": NONE,
        "H5": NONE,
        "V1a": PRESENT if any(q["soft"] in ("1a", "1b") for q in stories) else NONE,
        "V1b": PRESENT if any(q["soft"] == "1b" for q in stories) else NONE,
        "V2": PRESENT if mass_count > 0 else NONE,
        "V4": PRESENT if unsupported > 0 else NONE,
        "V5a": PRESENT if any(q["weak"] in ("5a", "5b") for q in stories) else NONE,
        "V5b": PRESENT if any(q["weak"] == "5b" for q in stories) else NONE,
    }
    decl = s.declared_irregularities
    for typ, field in DECLARATION_FIELD.items():
        outcome[typ] = PRESENT if getattr(decl, field) else NONE
        out[f"irr.{typ}.declared"] = getattr(decl, field)
    for typ, _name, _basis, consequence in IRREGULARITIES:
        out[f"irr.{typ}.outcome"] = outcome[typ]
        out[f"irr.{typ}.consequence"] = consequence if outcome[typ] == PRESENT else "-"
    out["irr.unsupported_segments"] = unsupported
    out["irr.mass_levels"] = mass_count
    any_present = any(v == PRESENT for v in outcome.values())
    plan_regular = not any(outcome[t] == PRESENT for t in HORIZONTAL_TYPES)
    coll = sdc in ("D", "E", "F") and any(outcome[t] == PRESENT for t in COLLECTOR_TYPES)
    out["irr.any"] = "yes" if any_present else "no"
    out["irr.plan_regular"] = "yes" if plan_regular else "no"
    out["irr.collector_25"] = "yes" if coll else "no"
    out["irr.collector_factor"] = 1.25 if coll else 1.0
    return _rho_results(spec, sdc, rows, sd_out, outcome, plan_regular, out)


def _mass_results(spec: Spec, w: dict[str, float], out: dict[str, Any]) -> int:
    levels = sorted(spec.building.levels, key=lambda lv: -lv.elevation_ft)
    count = 0
    for i, lv in enumerate(levels):
        above = levels[i - 1].id if i > 0 else None
        below = levels[i + 1].id if i + 1 < len(levels) else None
        r_above = w[lv.id] / w[above] if above else "-"
        r_below = w[lv.id] / w[below] if below else "-"
        flag = irr.mass_irregular(
            w[lv.id], w[above] if above else None, w[below] if below else None, above_is_roof=i == 1
        )
        count += flag
        out[f"reg.mass.{lv.id}.w"] = w[lv.id]
        out[f"reg.mass.{lv.id}.r_above"] = r_above
        out[f"reg.mass.{lv.id}.r_below"] = r_below
        out[f"reg.mass.{lv.id}.outcome"] = PRESENT if flag else NONE
    return count


def _rho_results(spec, sdc, rows, sd_out, outcome, plan_regular, out) -> float:
    s = spec.seismic
    torsion_1b = outcome["H1b"] == PRESENT
    per_dir = {}
    for d in DIRS:
        ok = all(sd_out[sd.key]["removal"] != FAILS for sd in rows if sd.dir == d)
        out[f"rho.cond_a_{d}"] = MET if ok else NOT_MET
        per_dir[d] = red.rho(sdc, ok, torsion_1b)
        out[f"rho.a_{d}"] = per_dir[d]
    out["rho.a"] = max(per_dir.values())
    ok_b = plan_regular and all(sd_out[sd.key]["perimeter"] != FAILS for sd in rows)
    out["rho.cond_b"] = MET if ok_b else NOT_MET
    out["rho.b"] = red.rho(sdc, ok_b, torsion_1b)
    if s.rho_method == "removal_test":
        return out["rho.a"]
    if s.rho_method == "perimeter_bays":
        return out["rho.b"]
    return s.rho
