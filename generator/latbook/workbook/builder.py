"""Build the workbook: lay out every sheet, then write cells with cached engine values.

The builder owns the xlsxwriter Workbook. It never computes an engineering number:
cached values come from the engine's results, keyed by quantity id.
"""

from __future__ import annotations

import collections
import contextlib
import datetime as dt
import gc
import json
import math
import types
import zipfile
from collections.abc import Iterator, Mapping
from pathlib import Path
from typing import Any

import xlsxwriter
from xlsxwriter.worksheet import Worksheet

from latbook import __version__
from latbook.atomic_file import atomic_output
from latbook.spec.limits import FieldLimits
from latbook.spec.models import Spec
from latbook.spec.revisions import current_revision
from latbook.workbook.cautions import caution_line, footer_caution
from latbook.workbook.chart_styles import series_style
from latbook.workbook.companions import chunks_apart, culprit_tables, fewer_moves
from latbook.workbook.context import Context, build_context
from latbook.workbook.cover import COL_LAST as COVER_LAST_COL
from latbook.workbook.cover import COVER_SHEET, write_contents_pages, write_cover
from latbook.workbook.cover_criteria import plan_cover_criteria
from latbook.workbook.equation_layout import place_equations
from latbook.workbook.equation_text import MAX_FORMULA_CHARS, cached_text
from latbook.workbook.formula import FORMULA_REF, substitute_ctx
from latbook.workbook.index_sheet import INDEX_SHEET, write_index
from latbook.workbook.input_check import HELPER_CACHED, CellGroup, plan_input_check
from latbook.workbook.layout import CHART_ROW_PX, Cell, SheetPlan, plan_sheets
from latbook.workbook.pagination import (
    SheetPages,
    greedy_breaks,
    paginate,
    row_heights,
    title_cells,
)
from latbook.workbook.print_grid import (
    GRID_WIDTHS,
    HEADER_FOOTER_MARGIN_IN,
    MARGIN_BOTTOM_IN,
    MARGIN_SIDE_IN,
    MARGIN_TOP_IN,
    ROW_MIN_PT,
    WIDTH_SAFETY,
    col_width_pt,
    printable_width_pt,
)
from latbook.workbook.registry import Registry, a1
from latbook.workbook.rendered import cell_formula
from latbook.workbook.sheet_names import SPEC_SHEET
from latbook.workbook.styles import Styles
from latbook.workbook.tables_sheet import LAST_COL as TABLES_LAST_COL
from latbook.workbook.tables_sheet import TABLES_SHEET, TABLES_TITLE, write_tables
from latbook.workbook.templates import all_templates, reference_tables

SPEC_CHUNK = 30000
FIXED_TIMESTAMP = dt.datetime(2000, 1, 1, 0, 0, 0)
HEADER_FOOTER_FONT = "&8"
HEADER_TEXT_CHARS = 40
# A chart is anchored to cells by Excel's pixel widths (7 px per unit + 5): it must end inside
# the grid, or LibreOffice draws it past the print area.
CHART_WIDTH_PX = round(0.95 * sum(int(w * 7 + 0.5) + 5 for w in GRID_WIDTHS))
# in_memory: assemble the parts in memory, not in one temp file per part (faster, and
# nothing to clean up if a build is interrupted).
WORKBOOK_OPTIONS = {"strings_to_formulas": False, "strings_to_urls": False, "in_memory": True}


TEXT_RESULT_STYLES = {"calc": "calc_text", "result": "result_text"}


class BuildError(RuntimeError):
    """The generator and the engine disagree about what exists: a developer error."""


def layout(
    spec: Spec, results: Mapping[str, Any] | None = None
) -> tuple[list[SheetPlan | CellGroup], Registry]:
    """Every sheet's plan, then the cells placed on the Cover (the live input check and
    design criteria) and SpecData (the input check), and the registry, without writing
    anything. Table chunks taller than a page, by the row heights the engine's `results`
    give (computed here when not given), print on companion sheets (companions.py): the
    sheets are laid out once to measure them, then again with those chunks moved."""
    context = build_context(spec)
    plans, registry = _placed(context, {})
    if results is None:
        from latbook.analysis import compute_results

        results = compute_results(spec)
    apart = chunks_apart(plans, printed_values(plans, results))
    while apart:
        moved, moved_registry = _placed(context, apart)
        culprits = culprit_tables(_long_formulas(moved, moved_registry), moved) & set(apart)
        if not culprits:
            plans, registry = moved, moved_registry
            break
        apart = fewer_moves(apart, culprits)
    groups = plan_input_check(plans, registry)
    cover = next(g for g in groups if g.name == COVER_SHEET)
    cover.cells += plan_cover_criteria(spec, registry)
    return [*plans, *groups], registry


def _placed(
    context: Context, apart: dict[str, list[list[int]]]
) -> tuple[list[SheetPlan], Registry]:
    """Every calc sheet laid out, its equations placed; `apart`: see companions.py."""
    registry = Registry()
    fixed = (COVER_SHEET, TABLES_SHEET, INDEX_SHEET, SPEC_SHEET)
    plans = plan_sheets(all_templates(), context, registry, apart, fixed)
    place_equations(plans, registry)
    return plans, registry


def _long_formulas(plans: list[SheetPlan], registry: Registry) -> list[tuple[str | None, str]]:
    """(table, formula) of each registered formula over MAX_FORMULA_CHARS characters that
    moving tables to companion sheets may have lengthened (a reference gains a sheet
    name): those on a calc sheet with companions or on a companion, and those elsewhere
    that name a moved table or one of its quantities. Each formula rendered is kept on
    its cell (`Cell.rendered`) for the writer."""
    affected = {p.name for p in plans if p.companions or p.companion_of}
    moved = {t.name for t in registry.tables.values() if t.sheet in affected or t.sheets} - {None}
    found = []
    for plan in plans:
        near = plan.name in affected
        for cell in plan.cells:
            if cell.formula is None or cell.qid is None:
                continue
            if not near and not _names_moved(cell, moved, registry):
                continue
            text = cell.rendered = cell_formula(cell, plan.name, registry)
            if len(text) > MAX_FORMULA_CHARS:
                found.append((cell.table, text))
    return found


def _names_moved(cell: Cell, moved: set[str], registry: Registry) -> bool:
    """Whether a formula reads a table in `moved` (by name or by a quantity id)."""
    if "{" not in (cell.formula or ""):
        return False
    text = substitute_ctx(cell.formula or "", cell.ctx)
    for body in FORMULA_REF.findall(text):
        op, sep, rest = body.partition(":")
        target = rest if sep else body
        if op == "q" and sep:
            entry = registry.entries.get(target)
            if entry is not None and entry.table in moved:
                return True
        elif target.split("@")[0].split(".")[0] in moved:
            return True
    return False


def write_workbook(
    spec: Spec,
    results: Mapping[str, Any],
    path: Path,
    *,
    spec_json: str,
    spec_sha256: str,
    protect: bool = True,
) -> Registry:
    """Write the workbook for `spec` to `path` atomically; returns the registry."""
    with _no_cyclic_gc():
        return _write_workbook(spec, results, path, spec_json, spec_sha256, protect)


@contextlib.contextmanager
def _no_cyclic_gc() -> Iterator[None]:
    """Pause the cyclic garbage collector: a build allocates ~10 objects per cell and frees
    few until the end, so collection passes only add time that grows faster than the cells
    (~17 % of a 12-level, 60-line build). Reference counting still frees memory."""
    was_enabled = gc.isenabled()
    gc.disable()
    try:
        yield
    finally:
        if was_enabled:
            gc.enable()


def _write_workbook(spec, results, path, spec_json, spec_sha256, protect) -> Registry:
    plans, registry = layout(spec, results)
    missing = [e.id for e in registry.calcs() if e.id not in results]
    if missing:
        raise BuildError(f"the engine has no value for {len(missing)} cells, e.g. {missing[:5]}")
    with atomic_output(Path(path)) as tmp:
        _write(spec, results, plans, registry, tmp, spec_json, spec_sha256, protect)
    return registry


def _write(spec, results, placed, registry, tmp, spec_json, spec_sha256, protect) -> None:
    plans = [p for p in placed if isinstance(p, SheetPlan)]
    groups = {g.name: g for g in placed if isinstance(g, CellGroup)}
    wb = xlsxwriter.Workbook(str(tmp), WORKBOOK_OPTIONS)
    wb.set_properties(
        {
            "title": f"Lateral calculation: {spec.project.name}",
            "subject": "Lateral force-resisting system",
            "author": spec.project.engineer,
            "comments": caution_line(spec),
            "created": FIXED_TIMESTAMP,
        }
    )
    wb.set_custom_property("latbook_version", __version__)
    wb.set_custom_property("latbook_spec_sha256", spec_sha256)
    wb.set_calc_mode("auto")
    styles = Styles(wb)
    header = _page_header(spec)

    cover = wb.add_worksheet(COVER_SHEET)
    last, toc_rows = write_cover(cover, spec, spec_sha256, styles, results, contents(plans))
    _write_group(cover, groups[COVER_SHEET], registry, results, styles)
    _fix_row_heights(cover, last)
    scale = _cover_scale(cover)
    breaks = _sheet_breaks(cover, last, scale)
    pages_of = {COVER_SHEET: len(breaks) + 1}
    _finish_sheet(cover, header, SheetPages(breaks=breaks, last_row=last), COVER_LAST_COL, protect)
    if scale < 1.0:
        # cover.py's columns are a little wider than the page where LibreOffice prints with
        # its fallback font (print_grid.col_width_pt): a whole percent that fits the width
        # (about 95 %), with the page breaks counted at that scale (a fit-to-width scale of
        # LibreOffice's own choosing would move them)
        cover.set_print_scale(round(scale * 100))

    sheets = {plan.name: wb.add_worksheet(plan.name) for plan in plans}
    caution = caution_line(spec)
    values = printed_values(plans, results)
    for plan in plans:
        ws = sheets[plan.name]
        pages = plan_pages(plan, values, caution)
        _write_plan(ws, plan, pages, registry, values, styles, caution)
        _write_charts(wb, ws, plan, registry)
        _finish_sheet(ws, header, pages, plan.last_col, protect)
        pages_of[plan.name] = pages.pages

    for name, qid in sorted(registry.names.items()):
        entry = registry.entries[qid]
        wb.define_name(name, f"={entry.sheet}!${_col_letter(entry.col)}${entry.row + 1}")

    tables = wb.add_worksheet(TABLES_SHEET)
    last = write_tables(wb, tables, reference_tables(), styles)
    _finish_sheet(tables, header, SheetPages(last_row=last), TABLES_LAST_COL, protect)
    pages_of[TABLES_SHEET] = _sheet_pages(tables, last)
    write_contents_pages(cover, toc_rows, pages_of, styles)

    index = wb.add_worksheet(INDEX_SHEET)
    last = write_index(index, registry, styles)
    if protect:
        index.protect()
    # Hidden and without a print area (LibreOffice prints hidden sheets that have one).
    index.hide()

    data = wb.add_worksheet(SPEC_SHEET)
    _write_spec_data(data, spec_json, spec_sha256, styles)
    _write_group(data, groups[SPEC_SHEET], registry, results, styles)
    data.hide()
    data.protect()
    try:
        wb.close()
    except BaseException as exc:
        _drop_open_archives(exc)
        raise


def _drop_open_archives(exc: BaseException) -> None:
    """A save that failed part way (disk full, file-size limit) leaves xlsxwriter's zip
    archive open in the failing frames; closing it later, at garbage collection, fails again
    and prints a traceback. Close its file now, ignoring the error already reported."""
    chain: list[BaseException] = []
    while exc is not None and exc not in chain:
        chain.append(exc)
        inner = [a for a in exc.args if isinstance(a, BaseException)]
        exc = exc.__cause__ or exc.__context__ or (inner[0] if inner else None)
    for link in chain:
        tb: types.TracebackType | None = link.__traceback__
        while tb is not None:
            for value in list(tb.tb_frame.f_locals.values()):
                if isinstance(value, zipfile.ZipFile) and value.fp is not None:
                    with contextlib.suppress(OSError):
                        value.fp.close()
                    value.fp = None
            tb = tb.tb_next


def printed_values(plans: list[SheetPlan], results: Mapping[str, Any]) -> Mapping[str, Any]:
    """What the printed equations show: the engine's results and the input cells' values."""
    inputs = {c.qid: c.value for p in plans for c in p.cells if c.style == "input" and c.qid}
    return collections.ChainMap(dict(results), inputs)


def plan_pages(plan: SheetPlan, results: Mapping[str, Any], caution: str) -> SheetPages:
    """Row heights, page breaks and repeated rows of a calc sheet (pagination.py)."""
    return paginate(plan, row_heights(plan, results, title_cells(plan, caution)))


def contents(plans: list[SheetPlan]) -> list[tuple[str, str]]:
    """The printed sheets in print order with what each holds (the Cover's contents)."""
    return [
        (COVER_SHEET, "Project, criteria, revisions, seal, choices and cautions"),
        *((plan.name, plan.title) for plan in plans),
        (TABLES_SHEET, TABLES_TITLE),
    ]


def page_counts(spec: Spec, results: Mapping[str, Any]) -> dict[str, int]:
    """Printed pages of each printed sheet, in print order (Cover, calc sheets, Tables), as
    the layout determines them; for a table of contents with page numbers."""
    plans, registry = layout(spec, results)
    counts: dict[str, int] = {}
    scratch = xlsxwriter.Workbook(None, {"in_memory": True})
    styles = Styles(scratch)
    sheet_plans = [p for p in plans if isinstance(p, SheetPlan)]
    cover = scratch.add_worksheet(COVER_SHEET)
    last, _ = write_cover(cover, spec, "0" * 64, styles, results, contents(sheet_plans))
    _fix_row_heights(cover, last)
    counts[COVER_SHEET] = _sheet_pages(cover, last, _cover_scale(cover))
    values = printed_values(sheet_plans, results)
    for plan in sheet_plans:
        counts[plan.name] = plan_pages(plan, values, caution_line(spec)).pages
    tables = scratch.add_worksheet(TABLES_SHEET)
    last = write_tables(scratch, tables, reference_tables(), styles)
    counts[TABLES_SHEET] = _sheet_pages(tables, last)
    return counts


def _fix_row_heights(ws: Worksheet, last_row: int) -> None:
    """Give every row a height of its own (the writer's, else one line), so that the pages
    LibreOffice prints are the ones counted (_sheet_pages)."""
    for r in range(last_row + 1):
        if r not in ws.row_sizes:
            ws.set_row(r, ROW_MIN_PT)


def _sheet_pages(ws: Worksheet, last_row: int, scale: float = 1.0) -> int:
    return len(_sheet_breaks(ws, last_row, scale)) + 1


def _sheet_breaks(ws: Worksheet, last_row: int, scale: float = 1.0) -> list[int]:
    """Rows that start a page when the rows fill pages one after another at `scale`."""
    # xlsxwriter keeps row heights in pixels
    heights = [
        ws.row_sizes[r][0] * 0.75 if r in ws.row_sizes else ROW_MIN_PT for r in range(last_row + 1)
    ]
    return greedy_breaks([h * scale for h in heights])


def _cover_scale(ws: Worksheet) -> float:
    """The print scale, a whole percent, that fits the Cover's columns (widths set by
    cover.py) to the page."""
    # xlsxwriter keeps widths in pixels (7 px per unit + 5)
    width = sum(col_width_pt((info.width - 5) / 7) for info in ws.col_info.values())
    fit = printable_width_pt() * WIDTH_SAFETY / width if width else 1.0
    return min(1.0, math.floor(fit * 100) / 100)


def _write_plan(
    ws: Worksheet,
    plan: SheetPlan,
    pages: SheetPages,
    registry: Registry,
    results,
    styles,
    caution: str,
) -> None:
    for band in range(plan.bands):  # a companion sheet: the grid repeated side by side
        for col, width in enumerate(GRID_WIDTHS):
            ws.set_column(band * len(GRID_WIDTHS) + col, band * len(GRID_WIDTHS) + col, width)
    for row, height in pages.heights.items():
        ws.set_row(row, height)
    tables = registry.tables
    for cell in [*title_cells(plan, caution), *plan.cells]:
        _write_cell(ws, plan.name, cell, registry, tables, results, styles)


def _write_group(ws: Worksheet, group: CellGroup, registry: Registry, results, styles) -> None:
    """The cells placed on a sheet with a writer of its own: formulas (an unregistered
    helper caches HELPER_CACHED), labels, and values as built."""
    for cell in group.cells:
        fmt = styles.get(cell.style, cell.fmt)
        if cell.formula is not None:
            value = _cached(results[cell.qid]) if cell.qid else HELPER_CACHED
            formula = cell_formula(cell, group.name, registry)
            ws.write_formula(cell.row, cell.col, formula, fmt, value)
        elif cell.text is not None:
            ws.write_string(cell.row, cell.col, cell.text, fmt)
        else:
            _write_value(ws, cell.row, cell.col, cell.value, fmt)


def _write_charts(wb, ws: Worksheet, plan: SheetPlan, registry: Registry) -> None:
    """Draw each chart block of `plan` (see layout._place_chart) from its tables' columns."""
    for spec in plan.charts:
        series = [
            s
            for s in spec["series"]
            if s["table"] in registry.tables and registry.tables[s["table"]].rows
        ]
        if not series:
            continue
        kind = {"type": spec["type"]}
        if spec["type"] == "scatter":
            kind["subtype"] = spec["subtype"]
        chart = wb.add_chart(kind)
        used: dict[str | None, int] = {}  # series drawn so far in each style cycle
        for s in series:
            n = used[s["cycle"]] = used.get(s["cycle"], -1) + 1
            chart.add_series(_series_options(spec["type"], s, n, registry))
        if spec["title"]:
            chart.set_title({"name": spec["title"], "name_font": {"size": 11}})
        fonts = {"name_font": {"size": 10}, "num_font": {"size": 9}}  # >= 7 pt printed
        x_axis = {"name": spec["x_title"], **fonts}
        y_axis = {"name": spec["y_title"], "major_gridlines": {"visible": True}, **fonts}
        frame = spec["frame"]
        if frame is not None:
            grid = {"visible": True, "line": {"color": "#D9D9D9", "width": 0.5}}
            # "crossing": the other axis crosses at the minimum (axes along the plot's edges)
            x_axis |= {**frame["x_axis"], "major_gridlines": grid, "crossing": "min"}
            y_axis |= {**frame["y_axis"], "major_gridlines": grid, "crossing": "min"}
            chart.set_plotarea({"layout": frame["layout"]})
        if spec["type"] == "bar":  # y is the vertical category axis, x the value axis
            x_axis, y_axis = y_axis, x_axis
            x_axis["major_gridlines"] = {"visible": True}
            y_axis.pop("major_gridlines", None)
            if spec["reverse_categories"]:
                y_axis |= {"reverse": True, "crossing": "max"}
        chart.set_x_axis(x_axis)
        chart.set_y_axis(y_axis)
        chart.set_legend({"position": "bottom", "font": {"size": 9}})
        if frame is not None:
            chart.set_size({"width": frame["width"], "height": frame["height"]})
        else:
            chart.set_size({"width": CHART_WIDTH_PX, "height": CHART_ROW_PX * spec["rows"]})
        ws.insert_chart(spec["row"], 0, chart, {"object_position": 1})


def _series_options(chart_type: str, s: dict, n: int, registry: Registry) -> dict[str, Any]:
    """xlsxwriter options of one series: its cell ranges, name, style and point labels."""
    tpos = registry.tables[s["table"]]
    first, last = tpos.first_row, tpos.last_row
    if s["span"] is not None:
        first, last = tpos.first_row + s["span"][0], tpos.first_row + s["span"][1]
    x, y = s["x"], s["field"]
    x_col, y_col = tpos.cols[x], tpos.cols[y]
    # a field's rows are those of its column chunk (TablePos.offsets)
    options: dict[str, Any] = {
        "name": s["name"],
        "categories": [tpos.sheet_of(x), tpos.row_of(x, first), x_col, tpos.row_of(x, last), x_col],
        "values": [tpos.sheet_of(y), tpos.row_of(y, first), y_col, tpos.row_of(y, last), y_col],
        **series_style(chart_type, s["cycle"], n),
        **s["style"],
    }
    if s["labels"] is not None:
        custom = [{"value": text} if text else {"delete": True} for text in s["labels"]]
        options["data_labels"] = {
            "value": True,
            "custom": custom,
            "position": s["label_position"],
        }
    return options


def _write_cell(ws, sheet, cell: Cell, registry, tables, results, styles) -> None:
    fmt = styles.get(cell.style, cell.fmt)
    if cell.span > 1:  # merged first, then the content goes into its first cell
        ws.merge_range(cell.row, cell.col, cell.row, cell.col + cell.span - 1, "", fmt)
    if cell.formula is not None:
        formula = cell_formula(cell, sheet, registry)
        if cell.parts is not None:  # a printed equation: text from the engine's values
            value = cached_text(cell.parts, lambda qid: _value_of(qid, results))
        else:
            value = _cached(results[cell.qid])
        if isinstance(value, str) and cell.style in TEXT_RESULT_STYLES:
            fmt = styles.get(TEXT_RESULT_STYLES[cell.style], cell.fmt)  # text reads from the left
        ws.write_formula(cell.row, cell.col, formula, fmt, value)
    elif cell.style == "input":
        _write_input(ws, cell, fmt)
    elif cell.text is not None:
        ws.write_string(cell.row, cell.col, cell.text, fmt)


def _value_of(qid: str, results) -> Any:
    """A quantity's value: the engine's, or an input's value as built."""
    if qid in results:
        return results[qid]
    raise BuildError(f"an equation prints '{qid}', which has no engine value")


def _cached(value: Any) -> Any:
    if isinstance(value, bool):
        return "TRUE" if value else "FALSE"
    return value


def _write_input(ws: Worksheet, cell: Cell, fmt) -> None:
    _write_value(ws, cell.row, cell.col, cell.value, fmt)
    if cell.limits is not None:
        rule = data_validation(cell.limits, a1(cell.row, cell.col))
        if rule is not None:
            ws.data_validation(cell.row, cell.col, cell.row, cell.col, rule)


def _write_value(ws: Worksheet, row: int, col: int, value: Any, fmt) -> None:
    """A spec value as its own cell type (text as text, never a formula)."""
    if isinstance(value, bool):
        ws.write_boolean(row, col, value, fmt)
    elif isinstance(value, int | float):
        ws.write_number(row, col, value, fmt)
    else:
        ws.write_string(row, col, "" if value is None else str(value), fmt)


def data_validation(limits: FieldLimits, address: str) -> dict[str, Any] | None:
    """The xlsxwriter data-validation rule of an input cell at `address`: the spec's own
    limits (`latbook.spec.limits`), an exclusive bound as a custom formula."""
    if limits.choices is not None:
        rule: dict[str, Any] = {"validate": "list", "source": [str(c) for c in limits.choices]}
    elif limits.minimum is None and limits.maximum is None:
        return None
    elif limits.min_exclusive or limits.max_exclusive:
        tests = [f"ISNUMBER({address})"]
        if limits.minimum is not None:
            tests.append(f"{address}{'>' if limits.min_exclusive else '>='}{limits.minimum!r}")
        if limits.maximum is not None:
            tests.append(f"{address}{'<' if limits.max_exclusive else '<='}{limits.maximum!r}")
        rule = {"validate": "custom", "value": f"=AND({','.join(tests)})"}
    else:
        rule = {
            "validate": "decimal",
            "criteria": "between",
            "minimum": -1e12 if limits.minimum is None else limits.minimum,
            "maximum": 1e12 if limits.maximum is None else limits.maximum,
        }
    rule["error_message"] = f"Allowed: {limits.describe()}."
    return rule


def _page_header(spec: Spec) -> tuple[str, str]:
    """Page header and footer: 8 pt, each part short enough for its third of the page (the
    project name is cut at HEADER_TEXT_CHARS here only; the Cover holds it in full)."""
    p = spec.project
    esc = _escape_header
    f = HEADER_FOOTER_FONT
    project = esc(f"{p.name} {p.number}")
    revision, date = current_revision(p)
    head = f"&L{f}{project}&C{f}&A&R{f}Rev {esc(revision)}  {esc(date)}"
    foot = f"&L{f}latbook {__version__}&C{f}Page &P of &N&R{f}{esc(footer_caution(spec))}"
    return head, foot


def _escape_header(text: str) -> str:
    if len(text) > HEADER_TEXT_CHARS:
        text = text[: HEADER_TEXT_CHARS - 1].rstrip() + "…"
    return text.replace("&", "&&")


def _finish_sheet(ws, header, pages: SheetPages, last_col: int, protect: bool) -> None:
    """Print setup: US letter landscape at 100 %, the sheet's page breaks and repeated
    header rows (pagination.py), page header and footer."""
    head, foot = header
    ws.set_header(head, {"margin": HEADER_FOOTER_MARGIN_IN})
    ws.set_footer(foot, {"margin": HEADER_FOOTER_MARGIN_IN})
    ws.set_landscape()
    ws.set_paper(1)  # US Letter
    ws.set_print_scale(100)
    ws.print_area(0, 0, max(pages.last_row, 1), last_col)
    if pages.breaks:
        ws.set_h_pagebreaks(pages.breaks)
    if pages.bands > 1:  # a page column per band; pages print down, then over
        ws.set_v_pagebreaks([band * len(GRID_WIDTHS) for band in range(1, pages.bands)])
    if pages.repeat is not None:
        ws.repeat_rows(*pages.repeat)
    ws.set_margins(
        left=MARGIN_SIDE_IN, right=MARGIN_SIDE_IN, top=MARGIN_TOP_IN, bottom=MARGIN_BOTTOM_IN
    )
    if protect:
        ws.protect(
            "",
            {
                "select_locked_cells": True,
                "select_unlocked_cells": True,
                "format_columns": True,
                "format_rows": True,
            },
        )


def _write_spec_data(ws: Worksheet, spec_json: str, spec_sha256: str, styles) -> None:
    ws.write_string(0, 0, "latbook_version", styles.get("text"))
    ws.write_string(0, 1, __version__, styles.get("text"))
    ws.write_string(1, 0, "spec_sha256", styles.get("text"))
    ws.write_string(1, 1, spec_sha256, styles.get("text"))
    ws.write_string(2, 0, "spec_json_chunks", styles.get("text"))
    chunks = [spec_json[i : i + SPEC_CHUNK] for i in range(0, len(spec_json), SPEC_CHUNK)]
    ws.write_number(2, 1, len(chunks))
    for i, chunk in enumerate(chunks):
        ws.write_string(3 + i, 1, chunk, styles.get("text"))


def canonical_json(data: Any) -> str:
    """The spec as canonical JSON (sorted keys, no spaces): what the SHA-256 is taken of."""
    return json.dumps(data, sort_keys=True, separators=(",", ":"), ensure_ascii=False)


def _col_letter(col: int) -> str:
    from xlsxwriter.utility import xl_col_to_name

    return xl_col_to_name(col)
