"""Place every template cell on its sheet and register it, before anything is written.

Placing first and rendering second lets a formula refer to any cell of any sheet,
wherever it is laid out.
"""

from __future__ import annotations

from collections.abc import Iterable
from dataclasses import dataclass, field
from typing import Any

from latbook.spec.limits import FieldLimits, field_limits
from latbook.workbook.context import Context
from latbook.workbook.formula import TemplateError, ctx_fields, substitute_ctx
from latbook.workbook.plan_chart import plan_frame
from latbook.workbook.print_grid import GRID_COLS
from latbook.workbook.registry import Entry, Registry, TablePos
from latbook.workbook.table_chunks import ChunkColumn, chunk_columns
from latbook.workbook.templates import Block, Column, Row, SheetTemplate

# Scalar blocks: description | symbol | value | unit | equation with values | clause.
# The equation and the clause span several grid columns (print_grid.GRID_WIDTHS).
COL_LABEL, COL_SYMBOL, COL_VALUE, COL_UNIT, COL_EQUATION = range(5)
COL_CLAUSE = 7
SCALAR_SPANS = {COL_EQUATION: COL_CLAUSE - COL_EQUATION, COL_CLAUSE: GRID_COLS - COL_CLAUSE}
LAST_GRID_COL = GRID_COLS - 1
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
    span: int = 1  # grid columns the cell covers (merged when > 1)
    table_row: int | None = None  # a table cell: its row in the table's first column chunk
    rendered: str | None = None  # its formula as written, once rendered (builder.layout)


@dataclass(frozen=True)
class PrintBlock:
    """Rows printed together (a heading with its scalars, one column chunk of a table, a
    note, a chart): kept on one page when they fit. `header` is a table chunk's header
    rows (first, last), repeated on the pages it continues onto if it is the sheet's
    repeat range (pagination.py)."""

    first_row: int
    last_row: int
    header: tuple[int, int] | None = None
    table: str | None = None  # a table chunk's table
    chunk: int = 0  # ... and its chunk


@dataclass
class SheetPlan:
    name: str
    title: str
    template: SheetTemplate
    ctx: dict[str, Any]
    cells: list[Cell] = field(default_factory=list)
    header_rows: list[tuple[int, int]] = field(default_factory=list)
    charts: list[dict[str, Any]] = field(default_factory=list)
    blocks: list[PrintBlock] = field(default_factory=list)
    last_row: int = 0
    last_col: int = LAST_GRID_COL
    bands: int = 1  # column bands of GRID_COLS, side by side (a companion sheet)
    companion_of: str = ""  # a companion sheet: its calc sheet
    # tables printed on companion sheets: name -> groups of chunk indices, a sheet each
    apart: dict[str, list[list[int]]] = field(default_factory=dict)
    companions: list[SheetPlan] = field(default_factory=list)
    taken: set[str] = field(default_factory=set)  # sheet names in use (lower case)
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
    span: int = 1  # grid columns the header cell covers


def plan_sheets(
    templates: tuple[SheetTemplate, ...],
    context: Context,
    registry: Registry,
    apart: dict[str, list[list[int]]] | None = None,
    reserved: Iterable[str] = (),
) -> list[SheetPlan]:
    """Lay out every sheet the context asks for; fills `registry`. A table named in
    `apart` prints on companion sheets (one per group of its chunk indices) that follow
    its calc sheet, named apart from every calc sheet and the `reserved` names."""
    plans: list[SheetPlan] = []
    sheets = [
        (tpl, sheet_ctx)
        for tpl in templates
        if context.holds(tpl.when)
        for sheet_ctx in (context.collections[tpl.repeat] if tpl.repeat else [{}])
    ]
    taken = {n.lower() for n in reserved} | {
        substitute_ctx(tpl.name, ctx).lower() for tpl, ctx in sheets
    }
    for tpl, sheet_ctx in sheets:
        name = substitute_ctx(tpl.name, sheet_ctx)
        plan = SheetPlan(name, substitute_ctx(tpl.title, sheet_ctx), tpl, dict(sheet_ctx))
        plan.apart, plan.taken = apart or {}, taken
        _place_blocks(plan, context, registry)
        plans += [plan, *plan.companions]
    return plans


def _place_blocks(plan: SheetPlan, context: Context, registry: Registry) -> None:
    row = FIRST_BLOCK_ROW
    for block in plan.template.blocks:
        if not context.holds(block.when):
            continue
        if block.skip_empty and not context.collections[substitute_ctx(block.over or "", plan.ctx)]:
            continue
        start = row
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
        if block.kind != "table" and row > start:
            plan.blocks.append(PrintBlock(start, row - 1))
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
        plan.cells.append(_heading(row, block.title))
        row += 1
    for line in substitute_ctx(block.text, plan.ctx).strip().splitlines():
        plan.cells.append(Cell(row, 0, "note", text=line.strip(), span=GRID_COLS))
        row += 1
    return row


def _heading(row: int, title: str) -> Cell:
    """A block's title across the whole grid (wrapped when long)."""
    return Cell(row, 0, "heading", text=title, span=GRID_COLS)


def _place_scalars(
    plan: SheetPlan, block: Block, context: Context, registry: Registry, row: int
) -> int:
    if block.title:
        plan.cells.append(_heading(row, substitute_ctx(block.title, plan.ctx)))
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
        Cell(row, COL_EQUATION, "equation", text="", span=SCALAR_SPANS[COL_EQUATION]),
        Cell(
            row,
            COL_CLAUSE,
            "clause",
            text=substitute_ctx(r.clause, ctx),
            span=SCALAR_SPANS[COL_CLAUSE],
        ),
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
    """Lay out a table as stacked column chunks that fit the print grid (table_chunks.py):
    chunk k holds its columns for every data row; chunks after the first repeat the key
    column. The registry maps each field to its sheet, column and chunk's row offset.
    A table in `plan.apart` (taller than a page, companions.py) prints on companion sheets
    instead, its chunks side by side; the calc sheet says where."""
    columns = [c for c in block.columns if context.holds(c.when)]
    rows = context.collections[substitute_ctx(block.over or "", plan.ctx)]
    chunks = chunk_columns([c.width for c in columns])
    title = substitute_ctx(block.title, plan.ctx) if block.title else ""
    name = substitute_ctx(block.table or "", plan.ctx)
    tpos = TablePos(name=name, sheet=plan.name, key=block.key or "key", first_row=0)
    tpos.patterns = {col.field: col.id for col in columns if col.id}
    used = sorted({f for pattern in tpos.patterns.values() for f in ctx_fields(pattern)})
    contexts = [{**plan.ctx, **row_ctx, "row_index": i} for i, row_ctx in enumerate(rows)]
    table = _TableParts(name, title, columns, chunks, contexts, tpos)
    groups = plan.apart.get(name, [])
    places = _companion_places(plan, table, groups)
    moved = sorted(places)
    for k in range(len(chunks)):
        if k in moved[1:]:
            continue
        if k > 0:
            row += 1  # a blank row between the parts
        if k in moved:
            row = _place_pointer(plan, table, places, row)
            continue
        places[k] = _ChunkPlace(plan, row, 0, row + bool(title) + TABLE_HEADER_ROWS)
        last_data = places[k].first_data + len(rows) - 1
        plan.blocks.append(
            PrintBlock(
                row,
                max(last_data, places[k].first_data - 1),
                (places[k].first_data - TABLE_HEADER_ROWS, places[k].first_data - 1),
                name,
                k,
            )
        )
        row = last_data + 1
    places = dict(sorted(places.items()))
    for k, place in places.items():
        _place_chunk_head(place, table, k)
    tpos.first_row = places[0].first_data if places else row
    if places:
        tpos.sheet = places[0].plan.name
    for i, merged in enumerate(contexts):
        key = str(merged[tpos.key])
        tpos.rows[key] = tpos.first_row + i
        tpos.bindings[key] = {f: str(merged[f]) for f in used}
    for k, place in places.items():
        for pc in chunks[k]:
            fld = columns[pc.index].field
            tpos.cols[fld] = place.col0 + pc.grid_col
            tpos.offsets[fld] = place.first_data - tpos.first_row
            if place.plan.name != tpos.sheet:
                tpos.sheets[fld] = place.plan.name
    for k, place in places.items():
        _place_chunk_rows(place, table, k, context, registry)
    registry.add_table(tpos)
    return row


@dataclass(frozen=True)
class _TableParts:
    """A table being laid out: its columns cut into chunks, and its rows' contexts."""

    name: str
    title: str
    columns: list[Column]
    chunks: list[list[ChunkColumn]]
    contexts: list[dict[str, Any]]
    tpos: TablePos


@dataclass(frozen=True)
class _ChunkPlace:
    """Where a column chunk goes: its sheet, its heading row, its first grid column (a
    multiple of GRID_COLS on a companion sheet) and its first data row."""

    plan: SheetPlan
    heading: int
    col0: int
    first_data: int

    @property
    def first_header(self) -> int:
        return self.first_data - TABLE_HEADER_ROWS


def _companion_places(
    plan: SheetPlan, table: _TableParts, groups: list[list[int]]
) -> dict[int, _ChunkPlace]:
    """A companion sheet for each group of chunks, its chunks side by side (band b at grid
    columns GRID_COLS*b...), all on the same rows: the heading on FIRST_BLOCK_ROW, then
    the header rows, then the data. One print block; its heading and header rows repeat
    on every page (pagination.py)."""
    places: dict[int, _ChunkPlace] = {}
    heading = FIRST_BLOCK_ROW
    first_data = heading + 1 + TABLE_HEADER_ROWS
    last = first_data + len(table.contexts) - 1
    for group in groups:
        companion = SheetPlan(
            companion_name(plan.name, len(plan.companions) + 1, plan.taken),
            f"{plan.title} (continued from sheet {plan.name})",
            plan.template,
            dict(plan.ctx),
            bands=len(group),
            companion_of=plan.name,
        )
        companion.last_col = GRID_COLS * len(group) - 1
        companion.blocks.append(
            PrintBlock(heading, max(last, first_data - 1), (heading, first_data - 1), table.name)
        )
        companion.last_row = last + 1
        plan.companions.append(companion)
        for band, k in enumerate(group):
            places[k] = _ChunkPlace(companion, heading, GRID_COLS * band, first_data)
    return dict(sorted(places.items()))


def companion_name(sheet: str, n: int, taken: set[str]) -> str:
    """A companion sheet of calc sheet `sheet` (tables taller than a page), its n-th or the
    next whose name no sheet has (ignoring case); the name joins `taken`."""
    while True:
        name = f"{sheet}_tab" if n == 1 else f"{sheet}_tab{n}"
        if name.lower() not in taken:
            taken.add(name.lower())
            return name
        n += 1


def _place_pointer(
    plan: SheetPlan, table: _TableParts, places: dict[int, _ChunkPlace], row: int
) -> int:
    """On the calc sheet, where a table's first moved chunk would be: the table's title and
    which of its parts print on which companion sheet."""
    n = len(table.chunks)
    sheets: dict[str, list[int]] = {}
    for k, place in sorted(places.items()):
        if place.plan is not plan:
            sheets.setdefault(place.plan.name, []).append(k + 1)
    where = "; ".join(
        (
            f"part{'s' if len(parts) > 1 else ''} {', '.join(map(str, parts))} of {n}, "
            if n > 1
            else ""
        )
        + f"on sheet {sheet}"
        for sheet, parts in sheets.items()
    )
    text = (
        f"Taller than a page, printed {where} (parts side by side, each with its header rows "
        "at the top of every page)."
    )
    plan.cells.append(_heading(row, table.title or table.name))
    plan.cells.append(Cell(row + 1, 0, "note", text=text, span=GRID_COLS))
    plan.blocks.append(PrintBlock(row, row + 1))
    return row + 2


def _place_chunk_head(place: _ChunkPlace, table: _TableParts, k: int) -> None:
    """Chunk k's heading ("part k of n") and its header rows: header, unit, clause and the
    column equation (equation_layout.py)."""
    plan, c0, row = place.plan, place.col0, place.first_header
    chunks, columns = table.chunks, table.columns
    if table.title:
        part = f" (part {k + 1} of {len(chunks)})" if len(chunks) > 1 else ""
        plan.cells.append(
            Cell(place.heading, c0, "heading", text=table.title + part, span=GRID_COLS)
        )
    chunk = chunks[k]
    placed = chunk if k == 0 else [ChunkColumn(0, 0, 1), *chunk]
    for pc in placed:
        col = columns[pc.index]
        at = c0 + pc.grid_col
        plan.cells += [
            Cell(row, at, "th", text=col.header, span=pc.span),
            Cell(row + 1, at, "th_unit", text=col.unit, span=pc.span),
            Cell(row + 2, at, "th_clause", text=substitute_ctx(col.clause, plan.ctx), span=pc.span),
        ]
        if pc in chunk and (col.formula is not None or col.equation):
            shifted = ChunkColumn(pc.index, at, pc.span)
            plan.column_equations.append(_column_equation(plan, col, table.name, row + 3, shifted))
    plan.header_rows.append((row, row + TABLE_HEADER_ROWS - 1))


def _place_chunk_rows(
    place: _ChunkPlace, table: _TableParts, k: int, context: Context, registry: Registry
) -> None:
    """Chunk k's data cells (and the repeated key column of a later chunk)."""
    plan, c0, first = place.plan, place.col0, place.first_data
    tpos, columns = table.tpos, table.columns
    for i, merged in enumerate(table.contexts):
        if k > 0:
            plan.cells.append(_key_copy(columns[0], merged, first + i, tpos.key, c0))
        for pc in table.chunks[k]:
            cell = _table_cell(
                plan,
                columns[pc.index],
                merged,
                table.name,
                first + i,
                c0 + pc.grid_col,
                context,
                registry,
            )
            cell.span = pc.span
            cell.table_row = tpos.first_row + i
            plan.cells.append(cell)


def _column_equation(
    plan: SheetPlan, col: Column, table: str, row: int, pc: ChunkColumn
) -> ColumnEquation:
    """Where and from what a table column's header equation is made (equation_layout.py)."""
    pattern = col.formula if isinstance(col.formula, str) else (col.formula or {})
    default = pattern if isinstance(pattern, str) else pattern.get("default")
    return ColumnEquation(
        row,
        pc.grid_col,
        table,
        col.field,
        _ctx_or_none(default, plan.ctx),
        substitute_ctx(col.equation, plan.ctx) if col.equation else None,
        pc.span,
    )


def _key_copy(key_column: Column, ctx: dict[str, Any], row: int, key: str, col: int = 0) -> Cell:
    """The key column repeated in a later chunk, as text: the key column's text (a level,
    line or segment id), else the row's key."""
    text = substitute_ctx(key_column.text, ctx) if key_column.text is not None else ctx[key]
    return Cell(row, col, "text", text=str(text))


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
