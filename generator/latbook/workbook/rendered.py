"""The formula text the generator writes for each calculated cell, without writing a file.

The builder writes exactly these strings; `latbook verify` compares a workbook's formulas
with them, so both go through `cell_formula`.
"""

from __future__ import annotations

from collections.abc import Sequence

from latbook.spec.models import Spec
from latbook.workbook.formula import render
from latbook.workbook.input_check import CellGroup
from latbook.workbook.layout import Cell, SheetPlan
from latbook.workbook.registry import Registry

Placed = Sequence[SheetPlan | CellGroup]


def cell_formula(cell: Cell, sheet: str, registry: Registry) -> str:
    """The Excel formula ("=...") of one formula cell of `sheet`."""
    if cell.formula is None:
        raise ValueError(f"cell {sheet} row {cell.row} col {cell.col} has no formula")
    if cell.rendered is not None:  # rendered once already, with this layout's registry
        return cell.rendered
    return render(
        cell.formula,
        registry=registry,
        sheet=sheet,
        ctx=cell.ctx,
        table=registry.tables.get(cell.table) if cell.table else None,
        row=cell.row if cell.table_row is None else cell.table_row,
    )


def formulas_by_quantity(plans: Placed, registry: Registry) -> dict[str, str]:
    """Quantity id -> the formula the generator writes in its cell."""
    return {
        cell.qid: cell_formula(cell, plan.name, registry)
        for plan in plans
        for cell in plan.cells
        if cell.formula is not None and cell.qid is not None
    }


def helper_formulas(plans: Placed, registry: Registry) -> dict[tuple[str, int, int], str]:
    """(sheet, row, col) -> formula of each unregistered helper cell (the input check)."""
    return {
        (plan.name, cell.row, cell.col): cell_formula(cell, plan.name, registry)
        for plan in plans
        for cell in plan.cells
        if cell.formula is not None and cell.qid is None
    }


def expected_formulas(
    spec: Spec,
) -> tuple[dict[str, str], dict[tuple[str, int, int], str], Registry]:
    """(quantity id -> formula, helper cell -> formula, registry) for the workbook `spec`
    builds."""
    from latbook.workbook.builder import layout

    plans, registry = layout(spec)
    return formulas_by_quantity(plans, registry), helper_formulas(plans, registry), registry
