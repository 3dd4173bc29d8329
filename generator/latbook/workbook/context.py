"""What the templates iterate over: flags and row collections derived from the spec.

This is layout information only (which rows exist, in which order); no engineering
numbers are computed here.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

from latbook.analysis.combinations import combination_uses
from latbook.analysis.wind import torsional_cases_apply
from latbook.spec.models import Spec
from latbook.spec.schedule_rows import schedule_collections
from latbook.workbook.diaphragm_context import diaphragm_collections, wall_input_collections
from latbook.workbook.plan_context import plan_collections
from latbook.workbook.regularity_context import regularity_collections
from latbook.workbook.wall_collections import wall_collections
from latbook.workbook.weights_context import weight_collections, weight_flags


@dataclass
class Context:
    flags: set[str]
    collections: dict[str, list[dict[str, Any]]]
    spec_data: dict[str, Any]
    extra: dict[str, Any] = field(default_factory=dict)

    def holds(self, when: str | None) -> bool:
        """True when every term of `when` ("a and !b") holds."""
        if not when:
            return True
        for term in when.split(" and "):
            term = term.strip()
            negate = term.startswith("!")
            if (term.lstrip("!") in self.flags) == negate:
                return False
        return True


def build_context(spec: Spec) -> Context:
    """Flags and collections for `spec`; collection builders register themselves below."""
    flags: set[str] = {f"method_{spec.design_method}"}
    if spec.seismic is not None:
        flags.add("seismic")
        flags.add(f"motion_{spec.seismic.ground_motion.method}")
        if spec.seismic.T_computed_s is not None:
            flags.add("T_computed")
        flags.add(f"rho_{spec.seismic.rho_method}")
        if spec.seismic.limit_Ss_for_Cs:
            flags.add("Ss_cap")
        if spec.wall_lines:
            flags.add("regularity")
    flags |= weight_flags(spec)
    if spec.wind is not None:
        flags.add("wind")
        if torsional_cases_apply(spec):
            flags.add("wind_torsion")
    if spec.wall_lines:
        flags.add("walls")
    ctx = Context(
        flags=flags,
        collections={},
        spec_data=spec.model_dump(mode="json", by_alias=True, exclude={"schema_ref"}),
    )
    for builder in COLLECTION_BUILDERS:
        ctx.collections.update(builder(spec))
    return ctx


def levels_collections(spec: Spec) -> dict[str, list[dict[str, Any]]]:
    """Levels top-down (roof first), each with its spec index and the level below."""
    indexed = sorted(enumerate(spec.building.levels), key=lambda p: -p[1].elevation_ft)
    rows: list[dict[str, Any]] = []
    for n, (index, level) in enumerate(indexed):
        below = indexed[n + 1][1].id if n + 1 < len(indexed) else None
        rows.append(
            {
                "level": level.id,
                "level_name": level.name or level.id,
                "row_label": f"level {level.id}",
                "index": index,
                "below": below,
                "variants": [
                    v
                    for v, on in (
                        ("top", n == 0),
                        ("lowest", below is None),
                        ("takeoff", level.weight_takeoff is not None),
                    )
                    if on
                ],
            }
        )
    return {"levels_top_down": rows}


def wind_collections(spec: Spec) -> dict[str, list[dict[str, Any]]]:
    """Wind directions (one Wind_<dir> sheet each): the axis along and across the wind."""
    if spec.wind is None:
        return {}
    return {
        "wind_directions": [
            {"dir": "x", "along": "x", "across": "y"},
            {"dir": "y", "along": "y", "across": "x"},
        ]
    }


def combination_use_collections(spec: Spec) -> dict[str, list[dict[str, Any]]]:
    """Rows of the Combos sheet's "which combination each check applies" table."""
    return {"combination_uses": combination_uses(spec)}


COLLECTION_BUILDERS = [
    levels_collections,
    wind_collections,
    combination_use_collections,
    wall_input_collections,
    diaphragm_collections,
    wall_collections,
    weight_collections,
    regularity_collections,
    schedule_collections,
    plan_collections,
]
