"""Row collections and flags of the Weights sheet (layout only).

Collections, levels roof first and items in spec order: `wt_trib` (every level: the story
heights its walls take), `wt_levels` (levels with a takeoff), and one per item kind:
`wt_area`, `wt_wall`, `wt_partitions`, `wt_snow`, `wt_storage`, `wt_equipment` (key
"<level>.<n>" or the level). Flag `takeoff` when any level has one, `wt_<kind>` per kind used.
"""

from __future__ import annotations

from typing import Any

from latbook.spec.models import Spec

Rows = list[dict[str, Any]]
KINDS = ("area", "wall", "partitions", "snow", "storage", "equipment")


def _levels(spec: Spec) -> list[tuple[int, Any]]:
    return sorted(enumerate(spec.building.levels), key=lambda p: -p[1].elevation_ft)


def weight_flags(spec: Spec) -> set[str]:
    """'takeoff' and 'wt_<kind>' for each kind some level's takeoff uses."""
    rows = weight_collections(spec)
    if not rows:
        return set()
    return {"takeoff"} | {f"wt_{k}" for k in KINDS if rows[f"wt_{k}"]}


def weight_collections(spec: Spec) -> dict[str, Rows]:
    """The Weights sheet's rows; empty when no level has a takeoff."""
    levels = _levels(spec)
    if not any(lv.weight_takeoff is not None for _, lv in levels):
        return {}
    out: dict[str, Rows] = {f"wt_{k}": [] for k in KINDS}
    out["wt_trib"], out["wt_levels"] = [], []
    for n, (index, lv) in enumerate(levels):
        variants = [v for v, on in (("top", n == 0), ("lowest", n == len(levels) - 1)) if on]
        out["wt_trib"].append(
            {
                "level": lv.id,
                "above": levels[n - 1][1].id if n > 0 else None,
                "below": levels[n + 1][1].id if n + 1 < len(levels) else None,
                "row_label": f"level {lv.id}",
                "variants": variants,
            }
        )
        t = lv.weight_takeoff
        if t is None:
            continue
        path = f"building.levels[{index}].weight_takeoff"
        base = {"level": lv.id, "index": index, "wpath": path}
        out["wt_levels"].append({**base, "row_label": f"level {lv.id}"})
        for kind, items in (("area", t.areas), ("wall", t.walls), ("equipment", t.equipment)):
            field = {"area": "areas", "wall": "walls", "equipment": "equipment"}[kind]
            for i, item in enumerate(items):
                extra = {"wall_kind": item.kind} if kind == "wall" else {}
                out[f"wt_{kind}"].append(
                    {
                        **base,
                        **extra,
                        "n": i,
                        "key": f"{lv.id}.{i}",
                        "item": item.name,
                        "ipath": f"{path}.{field}[{i}]",
                        "row_label": f"{lv.id} {kind} {item.name}",
                    }
                )
        for kind in ("partitions", "snow", "storage"):
            if getattr(t, kind) is not None:
                out[f"wt_{kind}"].append(
                    {**base, "key": lv.id, "ipath": f"{path}.{kind}", "row_label": f"{lv.id}"}
                )
    return out
