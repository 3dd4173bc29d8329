"""Place every template cell on its sheet and register it, before anything is written.

Placing first and rendering second lets a formula refer to any cell of any sheet,
wherever it is laid out.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

from latbook.spec.limits import FieldLimits, field_limits
from latbook.workbook.context import Context
from latbook.workbook.formula import TemplateError, ctx_fields, substitute_ctx
from latbook.workbook.registry import Entry, Registry, TablePos
from latbook.workbook.templates import Block, Column, Row, SheetTemplate

# Scalar blocks: description | symbol | value | unit | equation | clause
COL_LABEL, COL_SYMBOL, COL_VALUE, COL_UNIT, COL_EQUATION, COL_CLAUSE = range(6)
FIRST_BLOCK_ROW = 3  # rows 0-2: sheet title, caution line, blank
TABLE_HEADER_ROWS = 4  # header, unit, clause, equation


@dataclass
class Cell:
    """One cell to write: literal text, an input value, or a formula pattern."""

    row: int
    col: int
    style: str
    text: str | None = None
    value: Any = None
    formula: str | None = None
    qid: str | None = None
    ctx: dict[str, Any] = field(default_factory=dict)
    table: str | None = None
    fmt: str | None = None
    limits: FieldLimits | None = None  # an input's allowed range or values
    symbol: str = ""  # a value cell's symbol (a table cell's: its column's)
    equation: str | None = None  # a calculation row's template `equation` text
    parts: tuple[Any, ...] | None = None  # an equation cell's parts (equation_text)


@dataclass
class SheetPlan:
    name: str
    title: str
    template: SheetTemplate
    ctx: dict[str, Any]
    cells: list[Cell] = field(default_factory=list)
    widths: dict[int, float] = field(default_factory=dict)
    header_rows: list[tuple[int, int]] = field(default_factory=list)
    charts: list[dict[str, Any]] = field(default_factory=list)
    last_row: int = 0
    last_col: int = COL_CLAUSE
    # a table column's header equation, placed once every name is registered
    column_equations: list[ColumnEquation] = field(default_factory=list)


@dataclass(frozen=True)
class ColumnEquation:
    """Where a table column's equation goes in its header, and what it is made from."""

    row: int
    col: int
    table: str
    field: str
    formula: str | None  # the column's default formula pattern, row context substituted
    equation: str | None  # the template's `equation` text for the column


def plan_sheets(
    templates: tuple[SheetTemplate, ...], context: Context, registry: Registry
) -> list[SheetPlan]:
    """Lay out every sheet the context asks for; fills `registry`."""
    plans: list[SheetPlan] = []
    for tpl in templates:
        if not context.holds(tpl.when):
            continue
        instances = context.collections[tpl.repeat] if tpl.repeat else [{}]
        for sheet_ctx in instances:
            name = substitute_ctx(tpl.name, sheet_ctx)
            plan = SheetPlan(name, substitute_ctx(tpl.title, sheet_ctx), tpl, dict(sheet_ctx))
            if tpl.value_width:
                plan.widths[COL_VALUE] = tpl.value_width
            _place_blocks(plan, context, registry)
            plans.append(plan)
    return plans


def _place_blocks(plan: SheetPlan, context: Context, registry: Registry) -> None:
    row = FIRST_BLOCK_ROW
    for block in plan.template.blocks:
        if not context.holds(block.when):
            continue
        if block.skip_empty and not context.collections[substitute_ctx(block.over or "", plan.ctx)]:
            continue
        if block.kind == "scalars":
            row = _place_scalars(plan, block, context, registry, row)
        elif block.kind == "table":
            row = _place_table(plan, block, context, registry, row)
        elif block.kind == "note":
            row = _place_note(plan, block, row)
        elif block.kind == "chart":
            row = _place_chart(plan, block, context, row)
        else:
            raise ValueError(f"{plan.template.source}: unknown block kind '{block.kind}'")
        row += 1
    plan.last_row = row


CHART_ROWS = 16  # rows a chart covers (xlsxwriter's default chart is 288 px, 15 rows of 20 px)


def _place_chart(plan: SheetPlan, block: Block, context: Context, row: int) -> int:
    """Reserve rows for a chart fed from a table's columns; the builder draws it.

    `[blocks.chart]` keys: `table` (a table name, <ctx> allowed; it may be laid out anywhere),
    `x` (field of the x values), `series` (list of {field, name, when}; a series whose `when`
    fails is left out), optional `type` ("scatter" or "line"), `subtype` (scatter lines:
    "straight", the default, or "smooth"),
    `x_title`, `y_title`, `rows` (height in rows, default CHART_ROWS). The chart's title is the
    block's title. Series are live: they point at the table's formula cells.
    """
    spec = dict(block.chart or {})
    ctx = plan.ctx
    series = [
        {"field": s["field"], "name": substitute_ctx(s.get("name", s["field"]), ctx)}
        for s in spec.get("series", [])
        if context.holds(s.get("when"))
    ]
    rows = int(spec.get("rows", CHART_ROWS))
    plan.charts.append(
        {
            "row": row,
            "rows": rows,
            "type": spec.get("type", "scatter"),
            "subtype": spec.get("subtype", "straight"),
            "table": substitute_ctx(spec["table"], ctx),
            "x": spec["x"],
            "series": series,
            "title": substitute_ctx(block.title, ctx),
            "x_title": substitute_ctx(spec.get("x_title", ""), ctx),
            "y_title": substitute_ctx(spec.get("y_title", ""), ctx),
        }
    )
    return row + rows


def _place_note(plan: SheetPlan, block: Block, row: int) -> int:
    if block.title:
        plan.cells.append(Cell(row, 0, "heading", text=block.title))
        row += 1
    for line in substitute_ctx(block.text, plan.ctx).strip().splitlines():
        plan.cells.append(Cell(row, 0, "note", text=line.strip()))
        row += 1
    return row


def _place_scalars(
    plan: SheetPlan, block: Block, context: Context, registry: Registry, row: int
) -> int:
    if block.title:
        plan.cells.append(Cell(row, 0, "heading", text=substitute_ctx(block.title, plan.ctx)))
        row += 1
    for spec_row in block.rows:
        if not context.holds(spec_row.when):
            continue
        _place_scalar_row(plan, spec_row, context, registry, row)
        row += 1
    return row


def _place_scalar_row(
    plan: SheetPlan, r: Row, context: Context, registry: Registry, row: int
) -> None:
    ctx = plan.ctx
    label = substitute_ctx(r.label, ctx)
    plan.cells += [
        Cell(row, COL_LABEL, "label_key" if r.key else "label", text=label),
        Cell(row, COL_SYMBOL, "symbol", text=r.symbol),
        Cell(row, COL_UNIT, "unit", text=r.unit),
        Cell(row, COL_CLAUSE, "clause", text=substitute_ctx(r.clause, ctx)),
    ]
    qid = substitute_ctx(r.id, ctx) if r.id else None
    name = substitute_ctx(r.name, ctx) if r.name else None
    symbol = substitute_ctx(r.symbol, ctx)
    value_cell = Cell(row, COL_VALUE, "calc", qid=qid, ctx=dict(ctx), fmt=r.fmt, symbol=symbol)
    if r.input is not None:
        path = substitute_ctx(r.input, ctx)
        value_cell.style = "input"
        value_cell.value = spec_value(context.spec_data, path)
        value_cell.limits = field_limits(path)
        _register_input(registry, qid, plan.name, row, COL_VALUE, label, r, name, path)
    elif r.formula is not None:
        value_cell.style = "result" if r.key else "calc"
        value_cell.formula = r.formula
        value_cell.equation = substitute_ctx(r.equation, ctx) if r.equation else None
        _register_calc(registry, qid, plan.name, row, COL_VALUE, label, r.unit, r.clause, name)
    elif r.text is not None:
        value_cell.style = "text"
        value_cell.text = substitute_ctx(r.text, ctx)
    plan.cells.append(value_cell)


def _place_table(
    plan: SheetPlan, block: Block, context: Context, registry: Registry, row: int
) -> int:
    columns = [c for c in block.columns if context.holds(c.when)]
    rows = context.collections[substitute_ctx(block.over or "", plan.ctx)]
    if block.title:
        plan.cells.append(Cell(row, 0, "heading", text=substitute_ctx(block.title, plan.ctx)))
        row += 1
    header_top = row
    for c, col in enumerate(columns):
        plan.cells += [
            Cell(row, c, "th", text=col.header),
            Cell(row + 1, c, "th_unit", text=col.unit),
            Cell(row + 2, c, "th_clause", text=substitute_ctx(col.clause, plan.ctx)),
        ]
        if col.width:
            plan.widths[c] = max(plan.widths.get(c, 0), col.width)
    plan.header_rows.append((header_top, header_top + TABLE_HEADER_ROWS - 1))
    plan.last_col = max(plan.last_col, len(columns) - 1)
    first = row + TABLE_HEADER_ROWS
    name = substitute_ctx(block.table or "", plan.ctx)
    for c, col in enumerate(columns):
        if col.formula is not None or col.equation:
            pattern = col.formula if isinstance(col.formula, str) else (col.formula or {})
            default = pattern if isinstance(pattern, str) else pattern.get("default")
            plan.column_equations.append(
                ColumnEquation(
                    header_top + 3,
                    c,
                    name,
                    col.field,
                    _ctx_or_none(default, plan.ctx),
                    substitute_ctx(col.equation, plan.ctx) if col.equation else None,
                )
            )
    tpos = TablePos(name=name, sheet=plan.name, key=block.key or "key", first_row=first)
    tpos.cols = {col.field: c for c, col in enumerate(columns)}
    tpos.patterns = {col.field: col.id for col in columns if col.id}
    used = sorted({f for pattern in tpos.patterns.values() for f in ctx_fields(pattern)})
    for i, row_ctx in enumerate(rows):
        merged = {**plan.ctx, **row_ctx, "row_index": i}
        tpos.rows[str(merged[tpos.key])] = first + i
        tpos.bindings[str(merged[tpos.key])] = {f: str(merged[f]) for f in used}
        for c, col in enumerate(columns):
            plan.cells.append(_table_cell(plan, col, merged, name, first + i, c, context, registry))
    registry.add_table(tpos)
    return first + len(rows)


def _table_cell(
    plan: SheetPlan,
    col: Column,
    ctx: dict[str, Any],
    table: str,
    row: int,
    c: int,
    context: Context,
    registry: Registry,
) -> Cell:
    qid = substitute_ctx(col.id, ctx) if col.id else None
    cell = Cell(row, c, "calc", qid=qid, ctx=ctx, table=table, fmt=col.fmt, symbol=col.header)
    label = f"{col.header} [{ctx.get('row_label', row + 1)}]"
    if col.input is not None:
        path = substitute_ctx(col.input, ctx)
        cell.style = "input"
        cell.value = spec_value(context.spec_data, path)
        cell.limits = field_limits(path)
        _register_input(registry, qid, plan.name, row, c, label, col, None, path, table)
    elif col.formula is not None:
        cell.formula = pick_variant(col.formula, ctx)
        _register_calc(registry, qid, plan.name, row, c, label, col.unit, col.clause, None, table)
    elif col.text is not None:
        cell.style = "text"
        cell.text = substitute_ctx(col.text, ctx)
    return cell


def _ctx_or_none(pattern: str | None, ctx: dict[str, Any]) -> str | None:
    """`pattern` with the sheet's context; None where it needs a row's own context."""
    if pattern is None:
        return None
    try:
        return substitute_ctx(pattern, ctx)
    except TemplateError:
        return None


def pick_variant(formula: str | dict[str, str], ctx: dict[str, Any]) -> str:
    """A column's formula for this row: the first of the row's variants it defines."""
    if isinstance(formula, str):
        return formula
    for variant in ctx.get("variants", ()):
        if variant in formula:
            return formula[variant]
    return formula["default"]


def _register_calc(registry, qid, sheet, row, col, label, unit, clause, name, table=None) -> None:
    if qid is None:
        raise ValueError(f"a formula cell on {sheet} has no quantity id ('{label}')")
    registry.add(Entry(qid, sheet, row, col, "calc", label, unit, clause, name, table=table))


def _register_input(registry, qid, sheet, row, col, label, tpl, name, path, table=None) -> None:
    if qid is None:
        raise ValueError(f"an input cell on {sheet} has no quantity id ('{label}')")
    registry.add(
        Entry(
            qid,
            sheet,
            row,
            col,
            "input",
            label,
            tpl.unit,
            tpl.clause,
            name,
            path,
            table=table,
            limits=field_limits(path),
        )
    )


def spec_value(data: Any, path: str) -> Any:
    """Value at a dotted spec path such as `building.levels[2].elevation_ft`."""
    node = data
    for part in path.replace("]", "").replace("[", ".").split("."):
        node = node[int(part)] if isinstance(node, list) else node[part]
    return node
