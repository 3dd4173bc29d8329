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
from latbook.workbook.plan_chart import plan_frame
from latbook.workbook.registry import Entry, Registry, TablePos
from latbook.workbook.templates import Block, Column, Row, SheetTemplate

# Scalar blocks: description | symbol | value | unit | clause
COL_LABEL, COL_SYMBOL, COL_VALUE, COL_UNIT, COL_CLAUSE = range(5)
FIRST_BLOCK_ROW = 3  # rows 0-2: sheet title, caution line, blank


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


CHART_ROWS = 16  # rows a chart covers, CHART_ROW_PX each
CHART_ROW_PX = 22  # rows under a chart get this height (16.5 pt) explicitly: LibreOffice sizes
# a chart by the rows it spans, and its default row height (17 px) is not Excel's (20 px)


def _place_chart(plan: SheetPlan, block: Block, context: Context, row: int) -> int:
    """Reserve rows for a chart fed from table columns; the builder draws it.

    `[blocks.chart]` keys (<ctx> allowed in names and titles):
    - `table`: the table the series read (laid out anywhere); `x`: field of the x values or
      categories. A series may name its own `table` and `x` (one chart over several tables
      with the same rows, e.g. seismic and wind forces by level).
    - `type`: "scatter" (default), "line", "column" or "bar" (horizontal bars; the category
      axis is vertical); `subtype` (scatter lines: "straight", the default, or "smooth").
    - `series`: list of {field, name, when, table, x, rows, cycle, line, marker, labels}. A
      series whose `when` fails is left out. `rows` takes only the rows of the chart's `over`
      collection whose `groups` hold that name (their span, first to last); `rows = "p:*"`
      makes one series per distinct group starting with "p:", `<group>` in its name being
      the rest of the group. A blank cell in the span (a gap row) breaks the line.
      Style: `line` / `marker` (xlsxwriter options) as given; otherwise the next style of
      the `cycle` named (chart_styles.CYCLES: "line", "walls", "bar"; default by type), so
      series differ by dash, marker or fill pattern, not colour alone. `labels`: a field of
      the `over` rows whose text labels each point (blank: no label), placed at
      `label_position` (xlsxwriter: "left", "below", ...; default "left").
    - `reverse_categories`: true puts the first category at the top of a bar chart (levels
      are roof first, so the roof is drawn at the top).
    - `scale = "plan"`: equal x and y scales from the plan of the sheet's `<level>`, fixed at
      build time (plan_chart.plan_frame gives axes, size and plot layout).
    - `x_title`, `y_title`, `rows` (height in rows, default CHART_ROWS). The chart's title is
      the block's title. Series are live: they point at the tables' formula cells.
    """
    spec = dict(block.chart or {})
    ctx = plan.ctx
    over = context.collections[substitute_ctx(spec["over"], ctx)] if "over" in spec else []
    series = []
    for s in spec.get("series", []):
        if context.holds(s.get("when")):
            series += _chart_series(s, spec, over, ctx)
    rows = int(spec.get("rows", CHART_ROWS))
    frame = None
    if spec.get("scale") == "plan":
        levels = context.spec_data["building"]["levels"]
        level_plan = next(lv["plan"] for lv in levels if lv["id"] == ctx["level"])
        frame = plan_frame(level_plan, len(series))
        rows = -(-frame["height"] // CHART_ROW_PX) + 1
    plan.charts.append(
        {
            "row": row,
            "rows": rows,
            "type": spec.get("type", "scatter"),
            "subtype": spec.get("subtype", "straight"),
            "series": series,
            "title": substitute_ctx(block.title, ctx),
            "x_title": substitute_ctx(spec.get("x_title", ""), ctx),
            "y_title": substitute_ctx(spec.get("y_title", ""), ctx),
            "reverse_categories": bool(spec.get("reverse_categories", False)),
            "frame": frame,
        }
    )
    return row + rows


def _chart_series(
    s: dict[str, Any], spec: dict[str, Any], over: list[dict[str, Any]], ctx: dict[str, Any]
) -> list[dict[str, Any]]:
    """One template series resolved: table, fields, row span (indices into the table's rows)
    and style; a `rows = "p:*"` series expands to one per group."""
    base = {
        "table": substitute_ctx(s.get("table", spec.get("table", "")), ctx),
        "x": s.get("x", spec.get("x")),
        "field": s["field"],
        "cycle": s.get("cycle"),
        "style": {k: s[k] for k in ("line", "marker") if k in s},
        "span": None,
        "labels": None,
        "label_position": s.get("label_position", "left"),
    }
    name = s.get("name", s["field"])
    selector = s.get("rows")
    if selector is None:
        return [{**base, "name": substitute_ctx(name, ctx)}]
    if selector.endswith("*"):
        prefix = selector[:-1]
        groups = list(dict.fromkeys(g for r in over for g in r["groups"] if g.startswith(prefix)))
    else:
        groups = [selector]
    out = []
    for group in groups:
        hits = [i for i, r in enumerate(over) if group in r["groups"]]
        if not hits:
            continue
        span = (hits[0], hits[-1])
        if len(hits) != span[1] - span[0] + 1:
            raise TemplateError(f"chart rows '{group}' are not one run of rows in '{spec['over']}'")
        labels = None
        if "labels" in s:
            labels = [str(r.get(s["labels"], "")) for r in over[span[0] : span[1] + 1]]
        shown = group[len(selector) - 1 :] if selector.endswith("*") else group
        label = substitute_ctx(name, {**ctx, "group": shown})
        out.append({**base, "name": label, "span": span, "labels": labels})
    return out


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
    value_cell = Cell(row, COL_VALUE, "calc", qid=qid, ctx=dict(ctx), fmt=r.fmt)
    if r.input is not None:
        path = substitute_ctx(r.input, ctx)
        value_cell.style = "input"
        value_cell.value = spec_value(context.spec_data, path)
        value_cell.limits = field_limits(path)
        _register_input(registry, qid, plan.name, row, COL_VALUE, label, r, name, path)
    elif r.formula is not None:
        value_cell.style = "result" if r.key else "calc"
        value_cell.formula = r.formula
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
    plan.header_rows.append((header_top, header_top + 2))
    plan.last_col = max(plan.last_col, len(columns) - 1)
    first = row + 3
    name = substitute_ctx(block.table or "", plan.ctx)
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
    cell = Cell(row, c, "calc", qid=qid, ctx=ctx, table=table, fmt=col.fmt)
    label = f"{col.header} [{ctx.get('row_label', row + 1)}]"
    if col.input is not None:
        path = substitute_ctx(col.input, ctx)
        cell.style = "input"
        cell.value = spec_value(context.spec_data, path)
        cell.limits = field_limits(path)
        _register_input(registry, qid, plan.name, row, c, label, col, None, path, table)
    elif col.formula is not None:
        formula = pick_variant(col.formula, ctx)
        if formula:  # a variant given as "" leaves the cell blank (a gap in a chart series)
            cell.formula = formula
            _register_calc(
                registry, qid, plan.name, row, c, label, col.unit, col.clause, None, table
            )
    elif col.text is not None:
        cell.style = "text"
        cell.text = substitute_ctx(col.text, ctx)
    return cell


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
