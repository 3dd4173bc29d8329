"""Input quantities, keyed by the ids the workbook's input cells carry."""

from __future__ import annotations

from typing import Any

from latbook.spec.models import Spec


def input_results(spec: Spec, out: dict[str, Any]) -> None:
    """Spec values that appear as workbook inputs (so every id resolves to a value)."""
    out["input.design_method"] = spec.design_method
    out["input.risk_category"] = spec.building.risk_category
    for level in spec.building.levels:
        base = f"level.{level.id}"
        out[f"{base}.elevation_ft"] = level.elevation_ft
        out[f"{base}.seismic_weight_kip"] = level.seismic_weight_kip
        out[f"{base}.x_min_ft"] = level.plan.x_min_ft
        out[f"{base}.x_max_ft"] = level.plan.x_max_ft
        out[f"{base}.y_min_ft"] = level.plan.y_min_ft
        out[f"{base}.y_max_ft"] = level.plan.y_max_ft
