"""Place the printed equations: one live text cell beside every scalar calculation row, and
each table column's equation once in its header.

Runs after every sheet is laid out, so an equation may name a quantity of any sheet. The text
is built by `equation_text`; the cells are unregistered formula cells (like the input
check's helpers), so `verify` checks their formula text and the builder caches the text
`equation_text.cached_text` gives from the engine's results.
"""

from __future__ import annotations

from dataclasses import dataclass, field

from latbook.workbook.equation_text import (
    DEFAULT_FORMAT,
    EQUATION_FORMATS,
    MAX_FORMULA_CHARS,
    Operand,
    ValueRef,
    equation_lines,
    formula_pattern,
    parse_override,
    render_arithmetic,
)
from latbook.workbook.formula import render, substitute_ctx
from latbook.workbook.layout import (
    COL_EQUATION,
    COL_VALUE,
    SCALAR_SPANS,
    Cell,
    ColumnEquation,
    SheetPlan,
)
from latbook.workbook.registry import Registry

EQUATION_STYLE = "equation"
HEADER_EQUATION_STYLE = "th_equation"
SHORT_HEADER_CHARS = 12  # a column header longer than this is named by its field


@dataclass
class _Index:
    """What an equation needs to know of every placed value cell."""

    at: dict[tuple[str, int, int], str] = field(default_factory=dict)  # address -> quantity
    symbol: dict[str, str] = field(default_factory=dict)  # quantity -> symbol
    fmt: dict[str, str] = field(default_factory=dict)  # quantity -> number format
    column: dict[tuple[str, str], str] = field(default_factory=dict)  # (table, field) -> symbol


def place_equations(plans: list[SheetPlan], registry: Registry) -> None:
    """Add the equation cells to `plans` (the registry is complete)."""
    index = _index(plans, registry)
    for plan in plans:
        # the layout reserves an empty equation cell on every scalar row; a calculation
        # row's equation takes its place
        reserved = {c.row: i for i, c in enumerate(plan.cells) if _is_reserved(c)}
        for cell in list(plan.cells):
            if _is_scalar_calc(cell):
                eq = _scalar_equation(plan, cell, index, registry)
                if eq is None:
                    continue
                if cell.row in reserved:
                    plan.cells[reserved[cell.row]] = eq
                else:
                    plan.cells.append(eq)
        for spec in plan.column_equations:
            text = column_equation(spec, index, registry)
            if text:
                plan.cells.append(
                    Cell(spec.row, spec.col, HEADER_EQUATION_STYLE, text=text, span=spec.span)
                )


def _is_reserved(cell: Cell) -> bool:
    return cell.col == COL_EQUATION and cell.style == EQUATION_STYLE and cell.text == ""


def _is_scalar_calc(cell: Cell) -> bool:
    """The value cell of a scalar calculation row."""
    return bool(cell.formula and cell.qid and cell.table is None and cell.col == COL_VALUE)


def _index(plans: list[SheetPlan], registry: Registry) -> _Index:
    index = _Index()
    for plan in plans:
        for cell in plan.cells:
            if not cell.qid or cell.qid not in registry.entries:
                continue
            entry = registry.entries[cell.qid]
            index.at[(plan.name, cell.row, cell.col)] = cell.qid
            last = cell.qid.rsplit(".", 1)[-1]
            index.symbol[cell.qid] = _short(cell.symbol, last) or entry.name or last
            fmt = cell.fmt or DEFAULT_FORMAT
            index.fmt[cell.qid] = fmt if fmt in EQUATION_FORMATS else EQUATION_FORMATS[-1]
    for table in registry.tables.values():
        for fld, col in table.cols.items():
            qid = index.at.get((table.sheet_of(fld), table.row_of(fld, table.first_row), col))
            header = index.symbol.get(qid, fld) if qid else fld
            index.column[(table.name, fld)] = _short(header, fld)
    return index


def _short(symbol: str, fallback: str) -> str:
    return symbol if len(symbol) <= SHORT_HEADER_CHARS else fallback


def _scalar_equation(plan: SheetPlan, cell: Cell, index: _Index, registry: Registry) -> Cell | None:
    assert cell.formula is not None and cell.qid is not None
    ctx = cell.ctx

    def resolve(tok: str) -> Operand | None:
        return _resolve(tok, ctx, index, registry, table=None)

    pattern = substitute_ctx(cell.formula, ctx)
    override = parse_override(cell.equation, resolve) if cell.equation else None
    rendering = None if override is not None else render_arithmetic(pattern, resolve)
    result = ValueRef("{q:" + cell.qid + "}", cell.qid, index.fmt[cell.qid])
    head = cell.symbol or (registry.entries[cell.qid].name or "")
    for parts in equation_lines(head, rendering, override, result):
        text = formula_pattern(parts)
        rendered = render(text, registry=registry, sheet=plan.name, ctx=ctx, row=cell.row)
        if len(rendered) <= MAX_FORMULA_CHARS:
            return Cell(
                cell.row,
                COL_EQUATION,
                EQUATION_STYLE,
                formula=text,
                ctx=ctx,
                parts=parts,
                span=SCALAR_SPANS[COL_EQUATION],
            )
    return None


def column_equation(spec: ColumnEquation, index: _Index, registry: Registry) -> str | None:
    """A table column's equation in symbols ("F_x = C_vx·V"), or None. Never starts with
    "=", so no reader takes the text for a formula."""
    head = index.column.get((spec.table, spec.field), spec.field)
    if spec.equation:
        return f"{head} = {spec.equation.lstrip('= ')}"
    if spec.formula is None:
        return None

    def resolve(tok: str) -> Operand | None:
        return _resolve(tok, {}, index, registry, table=spec.table)

    rendering = render_arithmetic(spec.formula, resolve)
    if rendering is None:
        return None
    return f"{head} = {rendering.symbols}"


def _resolve(
    tok: str, ctx: dict, index: _Index, registry: Registry, table: str | None
) -> Operand | None:
    """The symbol and quantity of one reference of a formula pattern."""
    if not tok.startswith("{"):
        qid = registry.names.get(tok)
        return _operand(qid, index)
    body = tok[1:-1]
    op, sep, rest = body.partition(":")
    if not sep:
        op, rest = "", body
    if op == "q":
        return _operand(rest if rest in registry.entries else None, index)
    target, _, key_from = rest.partition("@")
    name, fld = target.split(".", 1) if "." in target else (table, target)
    if name is None or name not in registry.tables:
        return None
    tpos = registry.tables[name]
    if fld not in tpos.cols:
        return None
    symbol = index.column.get((name, fld), fld)
    if table is not None:  # a column's equation: symbols only
        marks = {"prev": "[i-1]", "next": "[i+1]", "first": "[first]", "last": "[last]"}
        return Operand(symbol + marks.get(op, ""), None, DEFAULT_FORMAT)
    if op in ("col", "upto"):
        return Operand(symbol, None, DEFAULT_FORMAT)
    if op == "first":
        row = tpos.first_row
    elif op == "last":
        row = tpos.last_row
    elif op == "":
        key = ctx.get(key_from or tpos.key)
        if key is None or str(key) not in tpos.rows:
            return None
        row = tpos.rows[str(key)]
    else:
        return None
    return _operand(
        index.at.get((tpos.sheet_of(fld), tpos.row_of(fld, row), tpos.cols[fld])), index
    )


def _operand(qid: str | None, index: _Index) -> Operand | None:
    if qid is None or qid not in index.symbol:
        return None
    return Operand(index.symbol[qid], qid, index.fmt[qid])
