"""The Summary sheet: each element family's governing demand/capacity ratio and a status
that reads without colour ("FAILS" with a marker, or "ok")."""

from __future__ import annotations

from typing import Any

from latbook.spec.models import Spec
from latbook.spec.summary_items import SummaryItem, summary_items

NO_CAPACITY = "no capacity in spec: choose one for the demand"
NOT_GIVEN = "not given"
FAILS, OK, MARKER = "FAILS", "ok", "<<<"
DRIFT_BASIS = {
    "seis": "strength-level E (QE), Cd δxe / Ie",
    "wind": "strength-level W (conservative for serviceability)",
}


def combination_text(item: SummaryItem, out: dict[str, Any]) -> str:
    """The load combination a row's check uses, named on the Combos sheet (ASCE 7-16 §2.3,
    §2.4, §12.4); unit shear with D adding, hold-downs with D resisting."""
    if item.kind == "diaph":
        return f"see Dia_{item.level}_{item.dir}"
    if item.kind in ("chord", "collector"):
        return out[f"diaph.{item.level}.{item.dir}.{item.kind}_source"]
    if item.kind == "drift":
        return DRIFT_BASIS[item.source]
    name = "seismic" if item.source == "seis" else "wind"
    role = "resisting" if item.kind == "hold_down" else "additive"
    return out[f"combo.{name}_{role}"]


def _element_and_values(item: SummaryItem, out: dict[str, Any]) -> tuple[str, Any, Any]:
    """(element text, demand, DCR) for one row."""
    if item.kind == "diaph":
        return f"level {item.level}, load in {item.dir}", "-", out[f"diaph.{item.key[6:]}.dcr_max"]
    if item.kind == "wall":
        lv, src = item.level, item.source
        return out[f"walls.{lv}.dcr_{src}_gov"], "-", out[f"walls.{lv}.dcr_{src}_max"]
    if item.kind in ("chord", "collector"):
        base, kind = f"diaph.{item.level}.{item.dir}", item.kind
        element = f"level {item.level} {kind}s, load in {item.dir}"
        return element, out[f"{base}.{kind}_max_lb"], out[f"{base}.{kind}_dcr_max"]
    if item.kind == "hold_down":
        return _hold_down_row(item.level, item.source, out)
    return out[f"drift.gov_{item.source}"], "-", out[f"drift.dcr_{item.source}_max"]


def _hold_down_row(lv: str, src: str, out: dict[str, Any]) -> tuple[str, Any, Any]:
    """The largest hold-down DCR of the story (AWC SDPWS-2015 §4.3.6.4.2), or "not given"
    while a segment with uplift has no capacity and no given one fails."""
    dcr_max = out[f"walls.{lv}.T_dcr_{src}_max"]
    missing = out[f"walls.{lv}.T_dcr_{src}_missing"]
    dcr = NOT_GIVEN if missing > 0 and dcr_max <= 1 else dcr_max
    gov = out[f"walls.{lv}.T_{src}_gov" if isinstance(dcr, str) else f"walls.{lv}.T_dcr_{src}_gov"]
    return gov, out[f"walls.{lv}.T_{src}_max"], dcr


def summary_results(spec: Spec, out: dict[str, Any]) -> None:
    """Every Summary quantity; nothing when the spec has no wall lines."""
    items = summary_items(spec)
    if not items:
        return
    dcrs: list[float] = []
    for item in items:
        element, demand, dcr = _element_and_values(item, out)
        if isinstance(dcr, str):
            status = NO_CAPACITY
        else:
            status = FAILS if dcr > 1 else OK
            dcrs.append(dcr)
        base = f"summary.{item.key}"
        out[f"{base}.element"] = element
        out[f"{base}.combination"] = combination_text(item, out)
        out[f"{base}.demand"] = demand
        out[f"{base}.dcr"] = dcr
        out[f"{base}.status"] = status
        out[f"{base}.marker"] = MARKER if status == FAILS else "-"
    out["summary.dcr_max"] = max(dcrs)
    out["summary.overall"] = (
        "FAILS: see the rows marked <<<" if max(dcrs) > 1 else "ok: every DCR is 1.0 or less"
    )
