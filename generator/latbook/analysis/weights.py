"""Effective seismic weight by level (ASCE 7-16 §12.7.2): typed, or summed from a takeoff.

Ids: `weights.level.<level>.<part>` per level with a takeoff (areas, walls, partitions, snow,
storage, equipment, w_x), `weights.level.<level>.h_below / h_above / h_trib` for every level,
and one id per takeoff item (`weights.<kind>.<level>.<n>.<field>`).
"""

from __future__ import annotations

from typing import Any

from latbook.engine.asce7_16 import seismic_weight as sw
from latbook.spec.models import Level, Spec

PARTS = ("areas", "walls", "partitions", "snow", "storage", "equipment")


def levels_top_down(spec: Spec) -> list[Level]:
    return sorted(spec.building.levels, key=lambda lv: -lv.elevation_ft)


def story_heights_ft(spec: Spec) -> dict[str, tuple[float, float]]:
    """Level id -> (story below, story above) heights, ft (base at 0; 0 above the roof)."""
    levels = levels_top_down(spec)
    out: dict[str, tuple[float, float]] = {}
    for i, lv in enumerate(levels):
        below = lv.elevation_ft - (levels[i + 1].elevation_ft if i + 1 < len(levels) else 0.0)
        above = levels[i - 1].elevation_ft - lv.elevation_ft if i > 0 else 0.0
        out[lv.id] = (below, above)
    return out


def takeoff_parts_kip(spec: Spec, level: Level, out: dict[str, Any] | None = None) -> dict:
    """The takeoff's parts (kip) for one level; with `out`, every item's ids are written."""
    t = level.weight_takeoff
    assert t is not None
    sink: dict[str, Any] = out if out is not None else {}
    lv = level.id
    below, above = story_heights_ft(spec)[lv]
    h_trib = sw.tributary_height_ft(below, above)
    parts = dict.fromkeys(PARTS, 0.0)
    for n, a in enumerate(t.areas):
        w = sw.area_weight_kip(a.dead_psf, a.area_sf)
        sink[f"weights.area.{lv}.{n}.w_kip"] = w
        parts["areas"] += w
    for n, wall in enumerate(t.walls):
        h = h_trib + wall.parapet_height_ft
        w = sw.wall_weight_kip(wall.dead_psf, h, wall.length_ft)
        sink[f"weights.wall.{lv}.{n}.h_ft"] = h
        sink[f"weights.wall.{lv}.{n}.w_kip"] = w
        parts["walls"] += w
    if t.partitions is not None:
        psf = sw.partition_psf(t.partitions.actual_psf)
        sink[f"weights.partitions.{lv}.psf_used"] = psf
        parts["partitions"] = sink[f"weights.partitions.{lv}.w_kip"] = sw.area_weight_kip(
            psf, t.partitions.area_sf
        )
    if t.snow is not None:
        psf = sw.snow_psf(t.snow.pf_psf)
        sink[f"weights.snow.{lv}.psf_used"] = psf
        parts["snow"] = sink[f"weights.snow.{lv}.w_kip"] = sw.area_weight_kip(psf, t.snow.area_sf)
    if t.storage is not None:
        psf = sw.storage_psf(t.storage.live_psf)
        sink[f"weights.storage.{lv}.psf_used"] = psf
        parts["storage"] = sink[f"weights.storage.{lv}.w_kip"] = sw.area_weight_kip(
            psf, t.storage.area_sf
        )
    for n, e in enumerate(t.equipment):
        sink[f"weights.equipment.{lv}.{n}.w_kip"] = e.weight_kip
        parts["equipment"] += e.weight_kip
    return parts


def level_weights_kip(spec: Spec) -> dict[str, float]:
    """Level id -> w_x (kip): the typed value, or the takeoff's sum."""
    out: dict[str, float] = {}
    for lv in spec.building.levels:
        if lv.weight_takeoff is not None:
            out[lv.id] = sum(takeoff_parts_kip(spec, lv).values())
        else:
            assert lv.seismic_weight_kip is not None
            out[lv.id] = lv.seismic_weight_kip
    return out


def weight_results(spec: Spec, out: dict[str, Any]) -> None:
    """Every Weights-sheet quantity; nothing when no level has a takeoff."""
    if not any(lv.weight_takeoff is not None for lv in spec.building.levels):
        return
    elevation = {lv.id: lv.elevation_ft for lv in spec.building.levels}
    for lv_id, (below, above) in story_heights_ft(spec).items():
        base = f"weights.level.{lv_id}"
        out[f"{base}.hx"] = elevation[lv_id]
        out[f"{base}.h_below"] = below
        out[f"{base}.h_above"] = above
        out[f"{base}.h_trib"] = sw.tributary_height_ft(below, above)
    for level in levels_top_down(spec):
        if level.weight_takeoff is None:
            continue
        parts = takeoff_parts_kip(spec, level, out)
        _input_values(level, out)
        base = f"weights.level.{level.id}"
        for key, value in parts.items():
            out[f"{base}.{key}"] = value
        out[f"{base}.w_x"] = sum(parts.values())


def _input_values(level: Level, out: dict[str, Any]) -> None:
    """The Weights sheet's input cells, by id (so every id resolves to a value)."""
    t = level.weight_takeoff
    assert t is not None
    lv = level.id
    for kind, items in (("area", t.areas), ("wall", t.walls), ("equipment", t.equipment)):
        for n, item in enumerate(items):
            for field, value in item.model_dump().items():
                if field not in ("name", "kind"):
                    out[f"weights.{kind}.{lv}.{n}.{field}"] = value
    for kind in ("partitions", "snow", "storage"):
        item = getattr(t, kind)
        if item is not None:
            for field, value in item.model_dump().items():
                out[f"weights.{kind}.{lv}.{field}"] = value
