"""Archive-grade output: reproducible bytes, the spec embedded and shown, protection without
a password, print setup on every sheet, and a printout by LibreOffice Calc 7.4 (an
independent spreadsheet program) that holds every sheet. Demo data is invented.
"""

from __future__ import annotations

import hashlib
import json
import re
import shutil
import subprocess
import time
import zipfile
from pathlib import Path

import openpyxl
import pytest
from xlsxwriter.utility import xl_col_to_name

from latbook import __version__
from latbook.build import build_workbook, check_spec, spec_digest
from latbook.cli import main
from latbook.recalc import convert_to_pdf, pdf_page_count
from latbook.workbook.builder import SPEC_SHEET, page_counts
from latbook.workbook.layout import TABLE_HEADER_ROWS

DEMO = Path(__file__).resolve().parents[1] / "out_examples/maple_terrace/spec.json"


def _demo_data() -> dict:
    return json.loads(DEMO.read_text(encoding="utf-8"))


@pytest.fixture(scope="module")
def demo(tmp_path_factory):
    return build_workbook(_demo_data(), tmp_path_factory.mktemp("archive") / "demo.xlsx")


@pytest.fixture(scope="module")
def book(demo):
    wb = openpyxl.load_workbook(demo.path)
    yield wb
    wb.close()


def _printed_sheets(book) -> list:
    return [ws for ws in book.worksheets if ws.sheet_state == "visible"]


def test_two_builds_are_byte_identical(demo, tmp_path):
    # zip entry times have 2 s resolution: wait past one so a clock-dependent stamp shows
    time.sleep(2.1)
    again = build_workbook(_demo_data(), tmp_path / "elsewhere.xlsx")
    digest = [hashlib.sha256(p.read_bytes()).hexdigest() for p in (demo.path, again.path)]
    assert digest[0] == digest[1]


def test_spec_version_and_digest_are_embedded_and_shown(demo, book):
    text, sha = spec_digest(_demo_data())
    data = book[SPEC_SHEET]
    assert data.sheet_state == "hidden"
    assert data.protection.sheet is True
    chunks = int(data["B3"].value)
    assert "".join(data.cell(4 + i, 2).value for i in range(chunks)) == text
    props = {p.name: p.value for p in book.custom_doc_props.props}
    assert props == {"latbook_version": __version__, "latbook_spec_sha256": sha}
    cover = [c.value for row in book["Cover"].iter_rows() for c in row]
    assert sha in cover and f"latbook {__version__}" in cover


def test_sheets_protected_without_password_formulas_locked_inputs_unlocked(demo, book):
    for ws in book.worksheets:
        assert ws.protection.sheet is True, ws.title
        assert not ws.protection.password, ws.title
    for e in demo.registry.entries.values():
        cell = book[e.sheet].cell(e.row + 1, e.col + 1)
        assert cell.protection.locked is (e.kind == "calc"), e.address


def test_no_protect_option_leaves_sheets_unprotected(tmp_path):
    out = tmp_path / "open.xlsx"
    assert main(["build", str(DEMO), "-o", str(out), "--no-protect"]) == 0
    wb = openpyxl.load_workbook(out)
    try:
        visible = [ws for ws in wb.worksheets if ws.title != SPEC_SHEET]
        assert [ws.title for ws in visible if ws.protection.sheet] == []
        assert wb[SPEC_SHEET].protection.sheet is True  # the record of the build stays locked
    finally:
        wb.close()


def test_print_setup_on_every_sheet(demo, book):
    project = _demo_data()["project"]
    for ws in _printed_sheets(book):
        assert ws.print_area, ws.title
        assert ws.page_setup.orientation == "landscape", ws.title
        if ws.title != "Cover":  # cover.py's columns may need fitting to the page width
            assert not ws.sheet_properties.pageSetUpPr.fitToPage, ws.title
            assert ws.page_setup.scale in (None, 100), ws.title
        header = ws.oddHeader
        assert project["name"][:20] in header.left.text, ws.title
        assert header.center.text == "&A", ws.title
        assert project["revision"] in header.right.text and project["date"] in header.right.text
        assert "Page &P of &N" in ws.oddFooter.center.text, ws.title
    # A repeated range is one table chunk's four header rows: header, unit, clause, equation;
    # on a companion sheet (its chunks side by side) the "(part k of n)" heading above them.
    for ws in _printed_sheets(book):
        if ws.print_title_rows:
            top, bottom = (int(x) for x in ws.print_title_rows.replace("$", "").split(":"))
            heading = 1 if ws.title.endswith(("_tab", "_tab2", "_tab3")) else 0
            assert bottom - top == TABLE_HEADER_ROWS - 1 + heading, ws.title


def _chart_value_refs(path: Path) -> set[str]:
    with zipfile.ZipFile(path) as z:
        xml = "".join(z.read(n).decode() for n in z.namelist() if n.startswith("xl/charts/"))
    return set(re.findall(r"<c:val><c:numRef><c:f>([^<]+)</c:f>", xml))


def _column_range(demo, table: str, field: str) -> str:
    t = demo.registry.tables[table]
    col = xl_col_to_name(t.cols[field])
    top, bottom = t.row_of(field, t.first_row) + 1, t.row_of(field, t.last_row) + 1
    return f"{t.sheet}!${col}${top}:${col}${bottom}"


CHARTED = {"elf": ("Fx", "Vx"), "wind_x": ("F_level", "V_story"), "wind_y": ("F_level", "V_story")}


def test_story_force_and_shear_charts_read_the_formula_cells(demo):
    # the demo has seismic and wind: one chart per load source and direction
    expected = {_column_range(demo, t, f) for t, fields in CHARTED.items() for f in fields}
    assert expected <= _chart_value_refs(demo.path)
    kind = {(e.sheet, e.row, e.col): e.kind for e in demo.registry.entries.values()}
    for table, fields in CHARTED.items():
        t = demo.registry.tables[table]
        for field in fields:
            assert {kind[(t.sheet, *t.cell(key, field))] for key in t.rows} == {"calc"}


def test_every_chart_series_reads_registered_formula_cells(demo):
    """Charts of fields printed in a later column chunk read that chunk's rows."""
    kind = {(e.sheet, e.row, e.col): e.kind for e in demo.registry.entries.values()}
    refs = _chart_value_refs(demo.path)
    assert refs
    for ref in refs:
        sheet, rng = ref.replace("'", "").split("!")
        for cell in rng.replace("$", "").split(":"):
            letters = "".join(ch for ch in cell if ch.isalpha())
            row = int(cell[len(letters) :]) - 1
            col = openpyxl.utils.column_index_from_string(letters) - 1
            assert kind.get((sheet, row, col)) == "calc", ref


@pytest.fixture(scope="session")
def pdftotext() -> str:
    path = shutil.which("pdftotext")
    if path is None:
        import os

        if os.environ.get("CI") == "true":
            pytest.fail("pdftotext (poppler-utils) not installed -- CI must run the PDF test")
        pytest.skip("pdftotext (poppler-utils) not installed")
    return path


@pytest.mark.libreoffice
def test_pdf_printout_holds_every_sheet(demo, book, soffice, pdftotext, tmp_path):
    pdf = convert_to_pdf(demo.path, tmp_path)
    sheets = _printed_sheets(book)
    pages = pdf_page_count(pdf)
    # every sheet prints at 100 %, on the pages the layout counts (builder.page_counts)
    assert pages == sum(page_counts(*check_spec(_demo_data())).values())
    text = subprocess.run(
        [pdftotext, "-layout", str(pdf), "-"], capture_output=True, text=True, check=True
    ).stdout
    flat = " ".join(text.split())
    for ws in sheets:
        title = str(ws["A1"].value)
        assert " ".join(title.split()) in flat, f"sheet {ws.title}: title not printed"
    # LibreOffice numbers the whole printout: the footer of the last page says so
    assert f"Page {pages} of {pages}" in flat
    assert SPEC_SHEET not in flat
