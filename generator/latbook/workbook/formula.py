"""Render a template's formula pattern into an Excel formula for one cell.

Two passes. First `<field>` is replaced by the row's context value (a level id, a
direction). Then each `{reference}` becomes a cell or range:

  {field}              this table, this row, column `field`
  {tbl.field}          table `tbl`, the row whose key equals this row's context value
                       for tbl's key; `{tbl.field@ctxname}` takes the key from ctx[ctxname]
  {prev:field}         this table, the row above ({next:field}: the row below)
  {col:field}          this table, every data row of the column (also {col:tbl.field})
  {upto:field}         this table, first data row down to this row
  {first:tbl.field}    first / last data row of a column ({last:...})
  {q:quantity.id}      the cell of a registered quantity

Defined names (S_DS, I_e, ...) are written in the pattern as they are.
"""

from __future__ import annotations

import re
from collections.abc import Mapping
from typing import Any

from latbook.workbook.registry import Registry, TablePos, a1

_CTX = re.compile(r"<([A-Za-z_][A-Za-z0-9_]*)>")
_REF = FORMULA_REF = re.compile(r"\{([^{}]+)\}")  # a reference: {field}, {q:id}...


class TemplateError(ValueError):
    """A template refers to something that does not exist: a developer error."""


def ctx_fields(pattern: str) -> list[str]:
    """The `<field>` names a pattern uses, in order of appearance."""
    return _CTX.findall(pattern)


def substitute_ctx(pattern: str, ctx: Mapping[str, Any]) -> str:
    """Replace every `<field>` by str(ctx[field])."""

    def repl(match: re.Match[str]) -> str:
        key = match.group(1)
        if key not in ctx:
            raise TemplateError(f"'<{key}>' has no value in this row's context: {pattern}")
        return str(ctx[key])

    return _CTX.sub(repl, pattern)


def render(
    pattern: str,
    *,
    registry: Registry,
    sheet: str,
    ctx: Mapping[str, Any],
    table: TablePos | None = None,
    row: int | None = None,
) -> str:
    """The Excel formula for one cell of `sheet` (row `row` of `table`, if any; a table's
    row is counted in its first column chunk, see TablePos.offsets)."""
    text = substitute_ctx(pattern, ctx)

    def ref(table_pos: TablePos, r: int, field: str) -> str:
        c = _col(table_pos, field)
        return _qualify(table_pos.sheet_of(field), sheet, a1(table_pos.row_of(field, r), c))

    def span(table_pos: TablePos, r0: int, r1: int, field: str) -> str:
        c = _col(table_pos, field)
        r0, r1 = table_pos.row_of(field, r0), table_pos.row_of(field, r1)
        return _qualify(table_pos.sheet_of(field), sheet, f"{a1(r0, c, True)}:{a1(r1, c, True)}")

    def lookup(spec: str) -> tuple[TablePos, str, str | None]:
        target, _, key_from = spec.partition("@")
        if "." in target:
            name, field = target.split(".", 1)
            return _table(registry, name), field, key_from or None
        if table is None:
            raise TemplateError(f"'{{{spec}}}' outside a table in: {pattern}")
        return table, target, key_from or None

    def repl(match: re.Match[str]) -> str:
        body = match.group(1)
        op, sep, rest = body.partition(":")
        if not sep:
            op, rest = "", body
        if op == "q":
            entry = registry.entries.get(rest)
            if entry is None:
                raise TemplateError(f"no quantity '{rest}' for: {pattern}")
            return _qualify(entry.sheet, sheet, a1(entry.row, entry.col, True))
        tpos, field, key_from = lookup(rest)

        def this_row() -> int:
            """This row in `tpos`: the same row, or the row with this row's key."""
            if tpos is table and key_from is None:
                return _need_row(row, body)
            key = ctx.get(key_from or tpos.key)
            if key is None or str(key) not in tpos.rows:
                raise TemplateError(f"table '{tpos.name}' has no row '{key}' for: {pattern}")
            return tpos.rows[str(key)]

        if op == "":
            return ref(tpos, this_row(), field)
        if op == "prev":
            r = this_row() - 1
            if r < tpos.first_row:
                raise TemplateError(f"'{{{body}}}' on the first row of '{tpos.name}'")
            return ref(tpos, r, field)
        if op == "next":
            r = this_row() + 1
            if r > tpos.last_row:
                raise TemplateError(f"'{{{body}}}' on the last row of '{tpos.name}'")
            return ref(tpos, r, field)
        if op == "col":
            return span(tpos, tpos.first_row, tpos.last_row, field)
        if op == "upto":
            return span(tpos, tpos.first_row, this_row(), field)
        if op == "first":
            return ref(tpos, tpos.first_row, field)
        if op == "last":
            return ref(tpos, tpos.last_row, field)
        raise TemplateError(f"unknown reference '{{{body}}}' in: {pattern}")

    return _REF.sub(repl, text)


def _need_row(row: int | None, body: str) -> int:
    if row is None:
        raise TemplateError(f"'{{{body}}}' needs a table row")
    return row


def _table(registry: Registry, name: str) -> TablePos:
    try:
        return registry.tables[name]
    except KeyError:
        raise TemplateError(f"no table named '{name}'") from None


def _col(tpos: TablePos, field: str) -> int:
    try:
        return tpos.cols[field]
    except KeyError:
        raise TemplateError(f"table '{tpos.name}' has no column '{field}'") from None


_PLAIN_SHEET = re.compile(r"^[A-Za-z_][A-Za-z0-9_]*$")


def _qualify(target_sheet: str, current_sheet: str, ref: str) -> str:
    """`ref` prefixed with its sheet when on another sheet; quoted when the name needs it
    (a level id may hold '-', e.g. sheet Dia_L-2_x)."""
    if target_sheet == current_sheet:
        return ref
    name = target_sheet if _PLAIN_SHEET.match(target_sheet) else f"'{target_sheet}'"
    return f"{name}!{ref}"
