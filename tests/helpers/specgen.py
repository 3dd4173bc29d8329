"""Random valid latbook specs, for property-based tests and the scale benchmark.

`make_spec(rng, n_levels, n_lines_per_dir, ...)` returns plain JSON data (a dict) that
passes `latbook.spec.load.parse_spec`: every pydantic field rule of spec/models.py and
every cross-field rule of spec/rules.py. The hypothesis strategy `specs()` draws the
options and a seed, so a failing example shrinks to few levels and lines.

What a generated building looks like (invented data, for tests and demos only):
- one rectangular plan shared by every level, at a random origin;
- levels listed bottom-up or top-down, elevations strictly following the order;
- every level has a diaphragm assembly; several shear-wall assemblies;
- per direction `n_lines_per_dir` wall lines at distinct positions inside the plan; the
  first two run the full height (so every level has two lines each way), the others stop
  at a random level and are continuous from there down to the base;
- per line 1-4 segments stacked at the same places in every story, 0-3 openings per
  story in the gaps between them;
- seismic weight typed, or taken off (areas, walls, partitions, snow, storage, equipment)
  for some levels; site classes A-E with S1 on both sides of 0.2 g and 0.6 g (Site E at
  S1 >= 0.2 g only where T <= Ts, §11.4.8 exception 3); rho typed, by the removal test or by
  perimeter bays; now and then §12.8.1.3 (kept only where its conditions hold).
New choices come from side streams seeded by earlier draws, so the main stream of a seed
draws the same numbers as before.

`extreme=True` stretches a valid spec to the edges of what the spec allows: seismic weights
spread log-uniformly from 1e-9 to 1e6 kip, every float nudged up by a few units in the last
place so it needs 17 significant digits, and level ids that equal parts of sheet names
('x', 'Dia', 'Walls'...). `risky_spec` then breaks rules the way real specs do (every wall
of a line past the aspect limit, two lines at one position, a stacked hold-down with nothing
below, a level id that names a sheet twice): it may or may not be valid.
"""

from __future__ import annotations

import math
import random
import string
from typing import Any

from hypothesis import strategies as st

from latbook.spec.models import MAX_LEVELS, MAX_WALL_LINES

MAX_LINES_PER_DIR = MAX_WALL_LINES // 2
SITE_CLASSES = ("A", "B", "C", "D", "E")
STORY_HEIGHT_RANGE_FT = (8.0, 14.0)
PLAN_SIDE_RANGE_FT = (30.0, 240.0)
MAX_SEGMENTS_PER_LINE = 4
MAX_OPENINGS_PER_STORY = 3
ID_LENGTH_MAX = 12  # spec Identifier max_length
# Segment aspect ratio h/b <= 3.5 at the tallest story (AWC SDPWS-2015 Table 4.3.4).
MIN_SEGMENT_FT = STORY_HEIGHT_RANGE_FT[1] / 3.5


def make_spec(
    rng: random.Random,
    n_levels: int,
    n_lines_per_dir: int,
    *,
    design_method: str | None = None,
    seismic: str | None = "random",
    wind: bool | None = None,
    level_order: str | None = None,
    long_ids: bool = False,
    text: str | None = None,
    extreme: bool = False,
    site: dict[str, Any] | None = None,
    rho_method: str | None = None,
    takeoff: str | None = None,
    limit_Ss_for_Cs: bool | None = None,
) -> dict[str, Any]:
    """A valid spec as JSON data.

    seismic: "site_class", "direct", None (no seismic block) or "random".
    site: ground-motion fields to force (site_class, Ss_g, S1_g, site_class_basis).
    rho_method: "typed", "removal_test", "perimeter_bays" or None (random).
    takeoff: "all", "some", "none" or None (random per level) weight takeoffs.
    limit_Ss_for_Cs: force the §12.8.1.3 option (True must then be valid) or None (random).
    wind: True / False / None (random; forced on when seismic is None).
    long_ids: every id 12 characters (the Identifier maximum), to stress sheet names.
    text: when given, every free-text field of the project holds it.
    """
    if not 1 <= n_levels <= MAX_LEVELS:
        raise ValueError(f"n_levels must be 1..{MAX_LEVELS}")
    if not 2 <= n_lines_per_dir <= MAX_LINES_PER_DIR:
        raise ValueError(f"n_lines_per_dir must be 2..{MAX_LINES_PER_DIR}")
    if seismic == "random":
        seismic = rng.choice(("site_class", "direct", None))
    if wind is None:
        wind = rng.random() < 0.6
    if seismic is None:
        wind = True
    ids = _IdMaker(rng, long_ids)

    plan = _plan(rng)
    levels = _levels(rng, n_levels, plan, ids)
    _weight_takeoffs(levels, plan, takeoff)
    order = level_order or rng.choice(("bottom_up", "top_down"))
    assemblies = _assemblies(rng, ids)
    dia_ids = [a["id"] for a in assemblies["diaphragms"]]
    for level in levels:
        level["diaphragm_assembly"] = rng.choice(dia_ids)
    wall_ids = [a["id"] for a in assemblies["shear_walls"]]
    lines = [
        line
        for direction in ("x", "y")
        for line in _wall_lines(rng, direction, n_lines_per_dir, levels, plan, wall_ids, ids)
    ]
    top_ft = levels[-1]["elevation_ft"]

    spec: dict[str, Any] = {
        "project": _project(rng, text),
        "design_method": design_method or rng.choice(("ASD", "LRFD")),
        "building": {
            "level_order": order,
            "risk_category": rng.choice(("I", "II", "III", "IV")),
            "levels": levels if order == "bottom_up" else levels[::-1],
        },
        "assemblies": assemblies,
        "wall_lines": lines,
        "drift": {
            "seismic_row": rng.choice(
                ("four_story_drift_tolerant", "masonry_cantilever", "other_masonry", "all_other")
            ),
            "wind_ratio": rng.choice((240, 360, 400, 500, 600)),
        },
    }
    side = random.Random(f"options|{top_ft}|{n_levels}")
    if side.random() < 0.3:
        spec["shear_walls"] = {"line_distribution": "capacity"}
    if side.random() < 0.4:
        spec["drift"]["wind_serviceability_factor"] = side.choice((0.42, 0.7, 1.0))
    if seismic is not None:
        spec["seismic"] = _seismic(rng, seismic)
        _seismic_basis(spec, site, rho_method, limit_Ss_for_Cs)
    if wind:
        spec["wind"] = _wind(rng, top_ft)
    if extreme:
        _stretch(random.Random(rng.random()), spec)
    return spec


# --- extremes and broken rules ---------------------------------------------------------------

WEIGHT_RANGE_KIP = (1e-9, 1e6)
# Level ids equal to parts of sheet names; all valid ('in' is not: Walls_in is a sheet).
SHEET_PART_IDS = ("x", "y", "Dia", "Walls", "Wind", "Inputs", "Lines", "Summary", "Index")
# rho: a choice of 1.0 or 1.3, not a measure; Omega0: 2.5 or 3.0, where note g's reduction
# needs at least 2.5 (nudged down it would break that rule)
_NOT_NUDGED = {"rho", "Omega0"}
_NUDGED_DOWN = {"Omega0", "wind_serviceability_factor"}  # drawn up to their upper limits


def _stretch(rng: random.Random, spec: dict[str, Any]) -> None:
    """Extreme weights, 17-digit floats and sheet-name level ids, keeping the spec valid."""
    lo, hi = (math.log10(w) for w in WEIGHT_RANGE_KIP)
    for level in spec["building"]["levels"]:
        level.pop("weight_takeoff", None)  # a typed weight replaces any takeoff
        level["seismic_weight_kip"] = 10 ** rng.uniform(lo, hi)
    if "seismic" in spec:
        # weights that far apart make a mass irregularity: §12.8.1.3 no longer applies
        spec["seismic"].pop("limit_Ss_for_Cs", None)
    _nudge_floats(rng, spec)
    ids = rng.sample(SHEET_PART_IDS, k=min(len(SHEET_PART_IDS), len(spec["building"]["levels"])))
    for level, new in zip(list(spec["building"]["levels"]), ids, strict=False):
        if rng.random() < 0.7:
            rename_level(spec, level["id"], new)


def _nudge_floats(rng: random.Random, node: Any) -> None:
    """Every float moved by 1-7 units in the last place, away from the limit it may sit on
    (up, except fields drawn up to their upper limit), so the spec stays valid."""
    items = node.items() if isinstance(node, dict) else enumerate(node)
    for key, value in list(items):
        if isinstance(value, float) and key not in _NOT_NUDGED and value != 0.0:
            toward = -math.inf if key in _NUDGED_DOWN else math.inf
            for _ in range(rng.randint(1, 7)):
                value = math.nextafter(value, toward)
            node[key] = value
        elif isinstance(value, dict | list):
            _nudge_floats(rng, value)


def rename_level(spec: dict[str, Any], old: str, new: str) -> None:
    """Give a level a new id, everywhere it is referenced."""
    for level in spec["building"]["levels"]:
        if level["id"] == old:
            level["id"] = new
    for line in spec.get("wall_lines", []):
        for story in line["stories"]:
            if story["level"] == old:
                story["level"] = new


def risky_spec(rng: random.Random, n_levels: int, n_lines: int) -> dict[str, Any]:
    """An extreme spec with `n_lines` wall lines in all (0 to 2 x MAX_LINES_PER_DIR) and,
    at random, rules broken as real specs break them; valid or not."""
    spec = make_spec(rng, n_levels, max(2, (n_lines + 1) // 2), extreme=True)
    lines = spec["wall_lines"]
    if n_lines == 0:
        del spec["wall_lines"]
    else:
        xs = [ln for ln in lines if ln["direction"] == "x"]
        ys = [ln for ln in lines if ln["direction"] == "y"]
        spec["wall_lines"] = xs[: max(1, n_lines // 2)] + ys[: max(1, n_lines - n_lines // 2)]
    for breaker in RULE_BREAKERS:
        if rng.random() < 0.25:
            breaker(rng, spec)
    return spec


def _line_past_aspect_limit(rng: random.Random, spec: dict[str, Any]) -> None:
    """Every segment of one line story taller than 3.5 x its length (SDPWS Table 4.3.4)."""
    if not spec.get("wall_lines"):
        return
    story = rng.choice(rng.choice(spec["wall_lines"])["stories"])
    for seg in story["segments"]:
        seg["height_ft"] = min(2000.0, 3.6 * seg["length_ft"])


def _two_lines_at_one_position(rng: random.Random, spec: dict[str, Any]) -> None:
    lines = [ln for ln in spec.get("wall_lines", []) if ln["direction"] == "x"]
    if len(lines) >= 2:
        a, b = rng.sample(lines, 2)
        b["position_ft"] = a["position_ft"]


def _stack_onto_nothing(rng: random.Random, spec: dict[str, Any]) -> None:
    """A stacked hold-down whose segment below got another id."""
    for line in spec.get("wall_lines", []):
        if len(line["stories"]) >= 2:
            upper, lower = line["stories"][0], line["stories"][1]  # stories are listed top-down
            upper["segments"][0]["hold_down_continues_below"] = True
            lower["segments"][0]["id"] = "renamed"
            return


def _level_named_in(rng: random.Random, spec: dict[str, Any]) -> None:
    """Level id 'in' (or 'IN'): its sheet Walls_in is the wall-input sheet's name."""
    level = rng.choice(spec["building"]["levels"])
    rename_level(spec, level["id"], rng.choice(("in", "IN")))


RULE_BREAKERS = (
    _line_past_aspect_limit,
    _two_lines_at_one_position,
    _stack_onto_nothing,
    _level_named_in,
)


# --- ids -----------------------------------------------------------------------------------


class _IdMaker:
    """Unique spec Identifiers; with `long_ids` every one is exactly 12 characters and
    holds a '-' (allowed in ids, but a sheet name with it must be quoted in formulas)."""

    _TAIL = string.ascii_letters + string.digits + "_-"

    def __init__(self, rng: random.Random, long_ids: bool):
        self._rng = rng
        self._long = long_ids
        self._used: set[str] = set()

    def make(self, prefix: str, n: int) -> str:
        base = f"{prefix}{n}"
        if not self._long:
            return base
        while True:
            pad = "".join(self._rng.choice(self._TAIL) for _ in range(ID_LENGTH_MAX))
            candidate = (base + "-" + pad)[:ID_LENGTH_MAX]  # '-' needs quoting in sheet refs
            if candidate not in self._used:
                self._used.add(candidate)
                return candidate


# --- building ------------------------------------------------------------------------------


def _r(x: float, digits: int = 2) -> float:
    return round(x, digits)


def _plan(rng: random.Random) -> dict[str, float]:
    x0 = _r(rng.choice((0.0, rng.uniform(-200, 200))), 1)
    y0 = _r(rng.choice((0.0, rng.uniform(-200, 200))), 1)
    return {
        "x_min_ft": x0,
        "x_max_ft": _r(x0 + rng.uniform(*PLAN_SIDE_RANGE_FT), 1),
        "y_min_ft": y0,
        "y_max_ft": _r(y0 + rng.uniform(*PLAN_SIDE_RANGE_FT), 1),
    }


def _levels(rng, n_levels, plan, ids: _IdMaker) -> list[dict[str, Any]]:
    """Levels bottom-up, elevations strictly increasing."""
    levels = []
    elevation_ft = 0.0
    for i in range(n_levels):
        elevation_ft = _r(elevation_ft + rng.uniform(*STORY_HEIGHT_RANGE_FT))
        level = {
            "id": ids.make("RF" if i == n_levels - 1 else "L", i + 2),
            "elevation_ft": elevation_ft,
            "seismic_weight_kip": _r(rng.uniform(20, 900), 1),
            "plan": dict(plan),
        }
        if rng.random() < 0.5:
            level["name"] = f"Level {i + 2}"
        side = random.Random(f"wall height|{elevation_ft}|{i}")
        if side.random() < 0.4:
            story_ft = elevation_ft - (levels[-1]["elevation_ft"] if levels else 0.0)
            level["wall_height_ft"] = _r(story_ft - side.uniform(0.5, 1.5))
        levels.append(level)
    return levels


def _assemblies(rng, ids: _IdMaker) -> dict[str, list[dict[str, Any]]]:
    diaphragms = []
    for i in range(rng.randint(1, 3)):
        vs = _r(rng.uniform(200, 1500), 0)
        diaphragms.append(
            {
                "id": ids.make("D", i + 1),
                "description": f"invented diaphragm assembly {i + 1}",
                "vs_nominal_plf": vs,
                "vw_nominal_plf": _r(vs * 1.4, 0),
            }
        )
        if rng.random() < 0.5:
            diaphragms[-1]["chord_capacity_lb"] = _r(rng.uniform(4000, 40000), 0)
            diaphragms[-1]["collector_capacity_lb"] = _r(rng.uniform(4000, 40000), 0)
        _deflection_inputs(random.Random(vs * 7919 + i), diaphragms[-1])
    walls = []
    for i in range(rng.randint(1, 4)):
        vs = _r(rng.uniform(300, 2500), 0)
        wall = {
            "id": ids.make("SW", i + 1),
            "description": f"invented shear-wall assembly {i + 1}",
            "vs_nominal_plf": vs,
            "vw_nominal_plf": _r(vs * 1.4, 0),
            "Ga_seismic_kips_per_in": _r(rng.uniform(8, 40), 1),
            "end_post_E_psi": rng.choice((1.2e6, 1.4e6, 1.6e6)),
            "end_post_A_in2": rng.choice((12.25, 16.5, 30.25, 49.5)),
            "hold_down_delta_in": _r(rng.uniform(0.05, 0.25), 3),
        }
        if rng.random() < 0.5:
            wall["Ga_wind_kips_per_in"] = _r(rng.uniform(8, 40), 1)
        _sheathing(random.Random(f"sheathing|{vs}|{i}"), wall)
        walls.append(wall)
    return {"diaphragms": diaphragms, "shear_walls": walls}


FACE_1_SHEATHING = ("wsp_blocked", "structural_fiberboard")  # both 3.5:1 (Table 4.3.4)
FACE_2_SHEATHING = (
    "wsp_blocked",
    "gypsum_board_blocked",
    "gypsum_board_unblocked",
    "wsp_unblocked",
)


def _deflection_inputs(side: random.Random, diaphragm: dict[str, Any]) -> None:
    """Invented SDPWS-2015 Eq. 4.2-1 inputs on about half the assemblies (a separate stream,
    seeded from values already drawn, so the rest of a generated spec is unchanged); now and
    then one input is left out (the deflection is then "not computed")."""
    if side.random() < 0.5:
        return
    values = {
        "Ga_kips_per_in": _r(side.uniform(6, 40), 1),
        "chord_E_psi": side.choice((1.2e6, 1.4e6, 1.6e6, 1.8e6)),
        "chord_A_in2": side.choice((10.5, 16.5, 24.75, 33.0)),
        "chord_splice_slip_in": side.choice((0.0, 0.02, 0.03, _r(side.uniform(0, 0.1), 3))),
        "chord_splice_spacing_ft": _r(side.uniform(8, 40), 1),
    }
    if side.random() < 0.2:
        del values[side.choice(sorted(values))]
    diaphragm.update(values)


def _sheathing(side: random.Random, wall: dict[str, Any]) -> None:
    """A side stream (existing seeds keep their specs): face 1 sheathing with the 3.5:1 limit
    the segment lengths assume, sometimes a second face, sometimes a rated hold-down."""
    if side.random() < 0.3:
        wall["sheathing"] = side.choice(FACE_1_SHEATHING)
    if side.random() < 0.35:
        wall["face2_sheathing"] = side.choice(FACE_2_SHEATHING)
        wall["face2_vs_nominal_plf"] = _r(side.uniform(150, 700), 0)
        wall["face2_vw_nominal_plf"] = _r(wall["face2_vs_nominal_plf"] * 1.4, 0)
        wall["face2_Ga_kips_per_in"] = _r(side.uniform(4, 20), 1)


def _wall_lines(rng, direction, n_lines, levels, plan, wall_ids, ids: _IdMaker) -> list[dict]:
    """`n_lines` lines of one direction at distinct positions, continuous to the base."""
    lo, hi = (
        (plan["y_min_ft"], plan["y_max_ft"])
        if direction == "x"
        else (plan["x_min_ft"], plan["x_max_ft"])
    )
    along_ft = (
        plan["x_max_ft"] - plan["x_min_ft"]
        if direction == "x"
        else plan["y_max_ft"] - plan["y_min_ft"]
    )
    step = (hi - lo) / (n_lines - 1)
    positions = [_r(lo + i * step, 3) for i in range(n_lines)]
    positions[-1] = hi  # exactly on the plan edge, not past it by rounding
    # A side stream (existing seeds keep their specs): some diaphragms overhang an outer line.
    side = random.Random(f"overhang|{direction}|{lo}|{hi}|{n_lines}")
    if side.random() < 0.3:
        positions[0] = _r(lo + side.uniform(0.05, 0.3) * step, 3)
    if side.random() < 0.3:
        positions[-1] = _r(hi - side.uniform(0.05, 0.3) * step, 3)
    prefix = "X" if direction == "x" else "Y"
    lines = []
    for i, position_ft in enumerate(positions):
        top = len(levels) - 1 if i < 2 else rng.randrange(len(levels))
        story_levels = [levels[k] for k in range(top, -1, -1)]  # from the line's top down
        lines.append(
            {
                "id": ids.make(prefix, i + 1),
                "direction": direction,
                "position_ft": position_ft,
                "stories": _stories(rng, story_levels, along_ft, wall_ids, ids),
            }
        )
    return lines


def _stories(rng, story_levels, along_ft, wall_ids, ids: _IdMaker) -> list[dict[str, Any]]:
    """Stories top-down; the same segment places in every story, openings in the gaps."""
    # Each segment or gap takes one slot; a segment fills 45-70 % of its slot, so a slot
    # must be long enough for the shortest segment allowed.
    max_slots = max(1, int(along_ft * 0.45 / MIN_SEGMENT_FT))
    n_seg = rng.randint(1, min(MAX_SEGMENTS_PER_LINE, max_slots))
    n_gap = rng.randint(0, min(MAX_OPENINGS_PER_STORY, max_slots - n_seg))
    n_slot = n_seg + n_gap
    slot_ft = along_ft / n_slot
    kinds = ["segment"] * n_seg + ["gap"] * n_gap
    rng.shuffle(kinds)
    margin_ft = 0.05 * slot_ft
    places = []
    for k, kind in enumerate(kinds):
        start = k * slot_ft + margin_ft + rng.uniform(0, 0.2) * slot_ft
        length = rng.uniform(0.45, 0.7) * slot_ft
        places.append((kind, _r(start, 3), _r(length, 3)))
    seg_ids = [ids.make("S", n + 1) for n in range(n_seg)]
    stories = []
    for depth, level in enumerate(story_levels):
        has_story_below = depth + 1 < len(story_levels)
        segments = []
        openings = []
        for kind, start, length in places:
            if kind == "segment":
                segments.append(
                    _segment(rng, seg_ids[len(segments)], start, length, wall_ids, has_story_below)
                )
            elif rng.random() < 0.4:
                opening = {"start_ft": start, "length_ft": length}
                if rng.random() < 0.5:
                    opening["label"] = rng.choice(("window", "door", "storefront"))
                openings.append(opening)
        story: dict[str, Any] = {"level": level["id"], "segments": segments}
        if openings:
            story["openings"] = openings
        stories.append(story)
    return stories


def _segment(rng, seg_id, start_ft, length_ft, wall_ids, has_story_below) -> dict[str, Any]:
    segment = {
        "id": seg_id,
        "start_ft": start_ft,
        "length_ft": length_ft,
        "assembly": rng.choice(wall_ids),
        "dead_load_plf": _r(rng.uniform(0, 800), 0),
        "hold_down_offset_ft": _r(min(rng.uniform(0.15, 0.5), 0.2 * length_ft), 3),
        "hold_down_continues_below": has_story_below and rng.random() < 0.7,
    }
    if rng.random() < 0.2:
        segment["point_load_start_lb"] = _r(rng.uniform(0, 5000), 0)
        segment["point_load_end_lb"] = _r(rng.uniform(0, 5000), 0)
    # A side stream, so that the specs of existing seeds stay as they were.
    side = random.Random(f"{seg_id}|{start_ft}|{length_ft}|{segment['dead_load_plf']}")
    if side.random() < 0.4:
        segment["hold_down_capacity_lb"] = _r(side.uniform(1500, 20000), 0)
    if side.random() < 0.3:
        segment["roof_bearing_width_ft"] = _r(side.choice((0.0, side.uniform(1, 30))), 2)
    # a further side stream: rated hold-down slip, shrinkage, post loads, sill anchors
    more = random.Random(f"anchorage|{seg_id}|{start_ft}|{length_ft}")
    if more.random() < 0.5:
        segment["hold_down_elongation_in"] = _r(more.uniform(0.03, 0.2), 3)
        segment["hold_down_rated_load_lb"] = _r(more.uniform(2000, 15000), 0)
    if more.random() < 0.3:
        segment["shrinkage_in"] = _r(more.uniform(0.0, 0.15), 3)
        segment["crushing_in"] = _r(more.uniform(0.0, 0.04), 3)
    if more.random() < 0.3:
        for key in more.sample(("post_D_lb", "post_L_lb", "post_Lr_lb", "post_S_lb"), 2):
            segment[key] = _r(more.uniform(0, 6000), 0)
    if more.random() < 0.4:
        segment["sill_anchor_capacity_lb"] = _r(more.uniform(600, 3000), 0)
    return segment


def _weight_takeoffs(levels: list[dict[str, Any]], plan: dict[str, float], mode) -> None:
    """Replace the typed weight of some levels by a takeoff (§12.7.2), from side streams."""
    area = (plan["x_max_ft"] - plan["x_min_ft"]) * (plan["y_max_ft"] - plan["y_min_ft"])
    perimeter = 2 * (plan["x_max_ft"] - plan["x_min_ft"] + plan["y_max_ft"] - plan["y_min_ft"])
    for i, level in enumerate(levels):
        side = random.Random(f"takeoff|{level['id']}|{level['elevation_ft']}")
        on = {"all": True, "none": False, "some": i % 2 == 0}.get(mode, side.random() < 0.35)
        if not on:
            continue
        top = i == len(levels) - 1
        t: dict[str, Any] = {
            "areas": [
                {
                    "name": "roof" if top else "floor",
                    "dead_psf": _r(side.uniform(8, 25), 1),
                    "area_sf": _r(area, 1),
                }
            ],
            "walls": [
                {
                    "name": "exterior walls",
                    "kind": "exterior",
                    "dead_psf": _r(side.uniform(8, 18), 1),
                    "length_ft": _r(perimeter, 1),
                }
            ],
        }
        if side.random() < 0.5:
            t["areas"].append(
                {"name": "ceiling", "dead_psf": _r(side.uniform(2, 6), 1), "area_sf": _r(area, 1)}
            )
        if side.random() < 0.5:
            t["walls"].append(
                {
                    "name": "interior walls",
                    "kind": "interior",
                    "dead_psf": _r(side.uniform(6, 10), 1),
                    "length_ft": _r(side.uniform(0.3, 1.0) * perimeter, 1),
                }
            )
        if top and side.random() < 0.4:
            t["walls"][0]["parapet_height_ft"] = _r(side.uniform(1.0, 4.0), 2)
        if not top and side.random() < 0.5:
            t["partitions"] = {"actual_psf": _r(side.uniform(0, 15), 1), "area_sf": _r(area, 1)}
        if top and side.random() < 0.5:
            t["snow"] = {"pf_psf": _r(side.uniform(15, 60), 1), "area_sf": _r(area, 1)}
        if side.random() < 0.15:
            t["storage"] = {"live_psf": 125.0, "area_sf": _r(side.uniform(0.05, 0.3) * area, 1)}
        if side.random() < 0.2:
            t["equipment"] = [{"name": "unit", "weight_kip": _r(side.uniform(1, 20), 2)}]
        del level["seismic_weight_kip"]
        level["weight_takeoff"] = t


def _seismic_basis(spec, site, rho_method, limit_Ss_for_Cs) -> None:
    """Site class basis, rho method, declarations and §12.8.1.3 from a side stream; Site E at
    S1 >= 0.2 g kept only where §11.4.8 exception 3 holds (T <= Ts)."""
    s = spec["seismic"]
    gm = s["ground_motion"]
    side = random.Random(f"basis|{sorted(gm.items())}|{s['TL_s']}")
    if gm["method"] == "site_class":
        if gm["site_class"] == "D" and side.random() < 0.3:
            gm["site_class_basis"] = "default_D"
        if gm["site_class"] == "B" and side.random() < 0.3:
            gm["site_class_basis"] = "B_unmeasured_vs"
        gm.update(site or {})
    method = rho_method or side.choice(("typed", "typed", "removal_test", "perimeter_bays"))
    if method != "typed":
        s["rho_method"] = method
        del s["rho"]
    if side.random() < 0.15:
        s["declared_irregularities"] = {
            "diaphragm_discontinuity_3": side.random() < 0.5,
            "vertical_geometric_3": side.random() < 0.5,
        }
    exc3 = gm["method"] == "site_class" and gm["site_class"] == "E" and gm["S1_g"] >= 0.2
    if exc3 and not _exception_3_holds(spec):
        gm["S1_g"] = 0.19
    want = limit_Ss_for_Cs if limit_Ss_for_Cs is not None else side.random() < 0.2
    if want and gm["method"] == "site_class" and gm["site_class"] != "E":
        s["limit_Ss_for_Cs"] = True
        spec["building"]["risk_category"] = side.choice(("I", "II"))
        if "rho" in s:
            s["rho"] = 1.0
        if limit_Ss_for_Cs is None and not _valid(spec):
            del s["limit_Ss_for_Cs"]


def _exception_3_holds(spec) -> bool:
    from latbook.problems import SpecError
    from latbook.spec.load import parse_spec

    try:
        parse_spec(spec)
    except SpecError as exc:
        return not any("exception 3 needs T <= Ts" in p.message for p in exc.problems)
    return True


def _valid(spec) -> bool:
    from latbook.problems import SpecError
    from latbook.spec.load import parse_spec

    try:
        parse_spec(spec)
    except SpecError:
        return False
    return True


# --- loads and project ---------------------------------------------------------------------


def _seismic(rng, method: str) -> dict[str, Any]:
    if method == "site_class":
        site_class = rng.choice(SITE_CLASSES)
        s1_max, ss_max = 0.8, 2.5  # Site E at S1 >= 0.2 g is checked in _seismic_basis
        motion = {
            "method": "site_class",
            "Ss_g": _r(rng.uniform(0.05, ss_max), 3),
            "S1_g": _r(rng.uniform(0.02, s1_max), 3),
            "site_class": site_class,
        }
    else:
        motion = {
            "method": "direct",
            "SDS_g": _r(rng.uniform(0.05, 2.0), 3),
            "SD1_g": _r(rng.uniform(0.03, 1.2), 3),
            "S1_g": _r(rng.uniform(0.0, 0.9), 3),
        }
    seismic: dict[str, Any] = {
        "ground_motion": motion,
        "system": {
            "label": "Light-frame wood walls with wood structural panels (invented)",
            "R": rng.choice((2.0, 6.5, 7.0)),
            "Cd": rng.choice((2.0, 4.0)),
            "Omega0": rng.choice((2.5, 3.0)),
        },
        "structure_type": rng.choice(
            ("steel_moment_frame", "concrete_moment_frame", "steel_eccentric_braced_frame")
            + ("all_other",) * 3
        ),
        "TL_s": rng.choice((4.0, 6.0, 8.0, 12.0)),
        "rho": rng.choice((1.0, 1.3)),
        "collector_light_frame_exception": rng.random() < 0.5,
    }
    if rng.random() < 0.25:
        seismic["T_computed_s"] = _r(rng.uniform(0.05, 2.0), 3)
    # A side stream (existing seeds keep their specs): the Table 12.2-1 entry, the collector
    # exception left to it, and note g.
    side = random.Random(f"seismic|{motion}|{seismic['rho']}")
    seismic["system"]["table_12_2_1_entry"] = side.choice(("A.15", "B.22", "A.18", "other"))
    if side.random() < 0.4:
        del seismic["collector_light_frame_exception"]
    if side.random() < 0.3 and seismic["system"]["Omega0"] >= 3.0:
        # (Ω0 = 3: a perturbed 17-digit value stays clear of note g's 2.5 threshold)
        seismic["omega0_flexible_diaphragm_reduction"] = True
    return seismic


def _wind(rng, top_ft: float) -> dict[str, Any]:
    wind = {
        "V_mph": rng.choice((95, 105, 110, 115, 130, 150, 180)),
        "exposure": rng.choice(("B", "C", "D")),
        "Kzt": rng.choice((1.0, 1.0, 1.15)),
        "Kd": 0.85,
        "ground_elevation_ft": _r(rng.uniform(0, 6000), 0),
        "use_Ke": rng.random() < 0.5,
        "G": 0.85,
        "enclosure": rng.choice(("enclosed", "partially_enclosed")),
        "mean_roof_height_ft": _r(top_ft + rng.uniform(0, 4)),
        "parapet_height_ft": rng.choice((0.0, 0.0, 2.5, 4.0)),
    }
    # A side stream (existing seeds keep their specs): every enclosure class, the torsional
    # load cases and a roof projection for the minimum case.
    side = random.Random(f"wind|{wind['mean_roof_height_ft']}|{wind['ground_elevation_ft']}")
    wind["enclosure"] = side.choice(("enclosed", "partially_enclosed", "partially_open"))
    wind["torsional_load_cases"] = side.choice(("by_appendix_d", "by_appendix_d", "all_cases"))
    if side.random() < 0.3:
        wind["roof_projection_above_h_ft"] = _r(side.uniform(0.5, 6.0), 2)
    return wind


def _project(rng, text: str | None) -> dict[str, str]:
    project = {
        "name": text or f"Generated building {rng.randrange(10**6):06d}",
        "number": text or f"G-{rng.randrange(10**4):04d}",
        "date": "2026-12-02",
        "revision": text or rng.choice(("0", "A", "B")),
    }
    if text is not None:
        for key in ("location", "client", "engineer", "checker", "notes"):
            project[key] = text
    return project


# --- hypothesis ----------------------------------------------------------------------------


@st.composite
def specs(
    draw,
    min_levels: int = 1,
    max_levels: int = MAX_LEVELS,
    max_lines_per_dir: int = 30,
    long_ids: bool | None = False,
    extreme: bool | None = False,
) -> dict[str, Any]:
    """A hypothesis strategy of valid specs; options are drawn, so they shrink first."""
    n_levels = draw(st.integers(min_levels, max_levels))
    n_lines = draw(st.integers(2, min(max_lines_per_dir, MAX_LINES_PER_DIR)))
    seismic = draw(st.sampled_from(("site_class", "direct", None)))
    wind = True if seismic is None else draw(st.booleans())
    seed = draw(st.integers(0, 2**32 - 1))
    return make_spec(
        random.Random(seed),
        n_levels,
        n_lines,
        design_method=draw(st.sampled_from(("ASD", "LRFD"))),
        seismic=seismic,
        wind=wind,
        level_order=draw(st.sampled_from(("bottom_up", "top_down"))),
        long_ids=draw(st.booleans()) if long_ids is None else long_ids,
        extreme=draw(st.booleans()) if extreme is None else extreme,
    )
