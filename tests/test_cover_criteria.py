"""The Cover: live design criteria, revision block, seal block, the 'PRELIMINARY' mark and the
print width.

Criteria values are formulas of the calc cells they show; their cached values must equal the
engine's (rel 1e-12), and after LibreOffice recalculates an edited workbook the Cover's V
must follow the edit (an independent engine; expected value from latbook's engine on the
edited spec, the ratio checked by hand: V = Cs W with Cs unchanged, ASCE 7-16 Eq. 12.8-1).
The demo buildings are invented.
"""

from __future__ import annotations

import copy
import json
from pathlib import Path

import openpyxl
import pytest

from latbook.analysis import compute_results
from latbook.analysis.criteria import NO_SEISMIC, NO_WIND, criteria_rows
from latbook.build import build_workbook
from latbook.recalc import recalculate_with_libreoffice
from latbook.spec.load import parse_spec
from latbook.workbook.cautions import PRELIMINARY_MARK, REVIEW_CAUTION
from latbook.workbook.cover import COVER_SHEET, COVER_WIDTHS, SEAL_ROWS, cover_width_px
from latbook.workbook.registry import a1

EXAMPLES = Path(__file__).resolve().parents[1] / "out_examples"
EXAMPLE_NAMES = sorted(p.name for p in EXAMPLES.iterdir() if (p / "spec.json").exists())
DEMO = EXAMPLES / "maple_terrace" / "spec.json"
REL = 1e-12
LETTER_PRINTABLE_IN = 7.5  # 8.5 in paper less two 0.5 in margins
PX_PER_IN = 96


def _data(name: str = "maple_terrace") -> dict:
    return json.loads((EXAMPLES / name / "spec.json").read_text(encoding="utf-8"))


def _cover_cells(path: Path, data_only: bool) -> dict[str, object]:
    wb = openpyxl.load_workbook(path, data_only=data_only, read_only=True)
    try:
        ws = wb[COVER_SHEET]
        return {c.coordinate: c.value for row in ws.iter_rows() for c in row if c.value is not None}
    finally:
        wb.close()


def _value(path: Path, entry, data_only: bool):
    wb = openpyxl.load_workbook(path, data_only=data_only, read_only=True)
    try:
        return wb[entry.sheet].cell(entry.row + 1, entry.col + 1).value
    finally:
        wb.close()


@pytest.fixture(scope="module", params=EXAMPLE_NAMES)
def example(request, tmp_path_factory):
    out = tmp_path_factory.mktemp("cover") / f"{request.param}.xlsx"
    return build_workbook(_data(request.param), out)


def test_criteria_are_formulas_of_the_calc_cells_with_engine_values(example):
    live = [r for r in criteria_rows(example.spec) if r.qid]
    assert live, "every example has live criteria"
    formulas = openpyxl.load_workbook(example.path)[COVER_SHEET]
    cached = openpyxl.load_workbook(example.path, data_only=True)[COVER_SHEET]
    for row in live:
        entry = example.registry.entries[row.qid]
        assert entry.sheet == COVER_SHEET
        source = example.registry.entries[row.source]
        formula = formulas.cell(entry.row + 1, entry.col + 1).value
        if source.name:
            assert formula == f"={source.name}", (row.qid, formula)
        else:
            assert formula == f"={source.sheet}!{a1(source.row, source.col, True)}", row.qid
        value = cached.cell(entry.row + 1, entry.col + 1).value
        expected = example.results[row.source]
        if isinstance(expected, str):
            assert value == expected, row.qid
        else:
            assert value == pytest.approx(expected, rel=REL), row.qid
        assert example.results[row.qid] == expected  # the engine's Cover quantity


def test_seismic_and_wind_criteria_present_or_stated_absent(example):
    spec = example.spec
    keys = {r.qid for r in criteria_rows(spec) if r.qid}
    texts = {r.text for r in criteria_rows(spec) if r.text}
    if spec.seismic is not None:
        for q in ("seismic.V", "seismic.Cs", "seismic.rho", "seismic.SDC", "seismic.Ie"):
            assert f"cover.{q}" in keys
        for q in ("seismic.R", "seismic.Cd", "seismic.Omega0"):
            assert f"cover.{q}" in keys
        # V = Cs W (ASCE 7-16 Eq. 12.8-1), read back from the Cover's own cached values
        r = example.results
        assert r["cover.seismic.V"] == pytest.approx(r["cover.seismic.Cs"] * r["cover.seismic.W"])
    else:
        assert NO_SEISMIC in texts
    if spec.wind is not None:
        for q in ("wind.V", "wind.exposure", "wind.Kd", "wind.enclosure"):
            assert f"cover.{q}" in keys
    else:
        assert NO_WIND in texts
    values = set(_cover_cells(example.path, True).values())
    assert {"ASCE 7-16", "AWC SDPWS-2015", spec.design_method} <= values


def test_per_direction_rho_shown_for_the_removal_test():
    # cedar_row sets rho by the §12.3.4.2 (a) removal test: rho for x and y, and the larger
    spec = parse_spec(_data("cedar_row"))
    assert spec.seismic.rho_method == "removal_test"
    keys = [r.qid for r in criteria_rows(spec) if r.qid]
    assert {"cover.seismic.rho_x", "cover.seismic.rho_y", "cover.seismic.rho"} <= set(keys)
    out = compute_results(spec)
    assert out["cover.seismic.rho"] == max(out["cover.seismic.rho_x"], out["cover.seismic.rho_y"])


@pytest.mark.libreoffice
def test_cover_base_shear_follows_an_edit_after_recalculation(tmp_path, soffice):
    data = _data()
    built = build_workbook(data, tmp_path / "calc.xlsx")
    weight = built.registry.entries["level.L2.seismic_weight_kip"]
    old_kip = data["building"]["levels"][0]["seismic_weight_kip"]
    new_kip = old_kip + 50.0  # invented edit inside the input's range
    wb = openpyxl.load_workbook(built.path)
    wb[weight.sheet].cell(weight.row + 1, weight.col + 1).value = new_kip
    edited = tmp_path / "edited.xlsx"
    wb.save(edited)
    recalculated = recalculate_with_libreoffice(edited, tmp_path / "lo")

    changed = copy.deepcopy(data)
    changed["building"]["levels"][0]["seismic_weight_kip"] = new_kip
    expected = compute_results(parse_spec(changed))
    v_entry = built.registry.entries["cover.seismic.V"]
    v_new = _value(recalculated, v_entry, True)
    assert v_new == pytest.approx(expected["seismic.V"], rel=1e-9)
    # hand check: W grows by the edit, Cs is unchanged (T depends on height only)
    assert expected["seismic.Cs"] == pytest.approx(built.results["seismic.Cs"], rel=1e-12)
    delta_kip = expected["seismic.Cs"] * 50.0
    assert v_new - built.results["seismic.V"] == pytest.approx(delta_kip, rel=1e-9)
    assert _value(recalculated, built.registry.entries["cover.seismic.W"], True) == pytest.approx(
        built.results["seismic.W"] + 50.0, rel=1e-12
    )


REVISIONS = [
    {"revision": "A", "date": "2026-10-01", "description": "=1+2 issued for review", "by": "CE"},
    {"revision": "B", "date": "2026-12-02", "description": "Issued for permit", "by": "+A1"},
]


def test_revisions_from_the_spec_are_text(tmp_path):
    data = _data("harbor_workshop")
    data["project"] = {
        k: v for k, v in data["project"].items() if k not in ("revision", "date")
    } | {"revisions": REVISIONS}
    built = build_workbook(data, tmp_path / "calc.xlsx")
    ws = openpyxl.load_workbook(built.path)[COVER_SHEET]
    cells = {c.value: c for row in ws.iter_rows() for c in row if isinstance(c.value, str)}
    for rev in REVISIONS:
        for field in ("revision", "date", "description", "by"):
            assert cells[rev[field]].data_type == "s", (field, rev[field])
    rows = [cells[rev["revision"]].row for rev in REVISIONS]
    assert rows[1] == rows[0] + 1  # oldest first, one row each
    for rev in REVISIONS:
        r = cells[rev["revision"]].row
        assert [ws.cell(r, c).value for c in (1, 2, 3, 5)] == [
            rev["revision"],
            rev["date"],
            rev["description"],
            rev["by"],
        ]
    # the project block shows the current (last) revision and its date
    labels: dict[str, object] = {}
    for c in ws["A"]:  # the project block comes first
        labels.setdefault(c.value, ws.cell(c.row, 2).value)
    assert labels["Revision"] == "B" and labels["Date"] == "2026-12-02"


def test_archived_spec_without_the_new_fields_builds(tmp_path):
    # the examples' specs predate project.revisions and project.preliminary
    data = _data("harbor_workshop")
    assert "revisions" not in data["project"] and "preliminary" not in data["project"]
    built = build_workbook(data, tmp_path / "calc.xlsx")
    ws = openpyxl.load_workbook(built.path)[COVER_SHEET]
    header = next(
        c.row for c in ws["A"] if c.value == "Revision" and ws.cell(c.row, 2).value == "Date"
    )
    assert [ws.cell(header + 1, c).value for c in (1, 2)] == [
        data["project"]["revision"],
        data["project"]["date"],
    ]
    # an archived revision longer than a listed one may be, or empty, still builds
    for revision in ("", "R" * 40):
        data["project"]["revision"] = revision
        build_workbook(data, tmp_path / f"calc{len(revision)}.xlsx")


def _sheet_strings(path: Path) -> dict[str, list[str]]:
    wb = openpyxl.load_workbook(path)
    try:
        return {
            ws.title: [c.value for row in ws.iter_rows() for c in row if isinstance(c.value, str)]
            for ws in wb.worksheets
            if ws.sheet_state == "visible"
        }
    finally:
        wb.close()


def test_preliminary_only_where_marked(tmp_path):
    data = _data("harbor_workshop")
    plain = build_workbook(data, tmp_path / "plain.xlsx")
    for sheet, strings in _sheet_strings(plain.path).items():
        assert not [s for s in strings if "preliminary" in s.lower()], sheet
        if sheet != "Tables":
            assert REVIEW_CAUTION in strings, sheet
    data["project"]["preliminary"] = True
    marked = build_workbook(data, tmp_path / "marked.xlsx")
    for sheet, strings in _sheet_strings(marked.path).items():
        if sheet == "Tables":
            continue
        assert any(s.startswith(PRELIMINARY_MARK) for s in strings), sheet
    wb = openpyxl.load_workbook(marked.path)
    assert wb[COVER_SHEET]["A2"].value.startswith(PRELIMINARY_MARK)
    assert wb.properties.description.startswith(PRELIMINARY_MARK)


def test_cover_prints_on_letter_within_its_columns(example):
    # five columns within 7.5 in; fonts of 8 pt or more; wrapped cells in rows of set height
    assert len(COVER_WIDTHS) == 5
    assert cover_width_px() <= LETTER_PRINTABLE_IN * PX_PER_IN
    wb = openpyxl.load_workbook(example.path)
    ws = wb[COVER_SHEET]
    widths = {
        col: dim.width
        for dim in ws.column_dimensions.values()
        for col in range(dim.min, dim.max + 1)
    }
    for col, width in enumerate(COVER_WIDTHS, start=1):
        assert widths[col] == pytest.approx(width, abs=0.72)  # xlsxwriter adds padding
    assert ws.page_setup.orientation == "landscape"
    assert "$A$1:$E$" in ws.print_area  # all five columns print
    span = {(m.min_row, m.min_col): (m.min_col, m.max_col) for m in ws.merged_cells.ranges}
    cached = openpyxl.load_workbook(example.path, data_only=True)[COVER_SHEET]
    for row in ws.iter_rows():
        for cell in row:
            text = cached.cell(cell.row, cell.column).value
            if text is None:
                continue
            size_pt = cell.font.sz or 11
            assert size_pt >= 8, cell.coordinate
            first, last = span.get((cell.row, cell.column), (cell.column, cell.column))
            width_px = sum(int(widths[c] * 7 + 0.5) + 5 for c in range(first, last + 1))
            # Arial mixed text: about 0.5 em a character on average; 0.55 for a margin
            chars = width_px / (size_pt * 96 / 72 * 0.55)
            wraps = cell.alignment.wrap_text and isinstance(text, str)  # numbers: formatted
            lines = -(-len(text) // int(chars)) if wraps else 1
            height_pt = ws.row_dimensions[cell.row].height or 15.0  # 15: the default row
            assert height_pt >= lines * size_pt * 1.1, (cell.coordinate, text, height_pt)
    merged = {str(m) for m in ws.merged_cells.ranges}
    # the seal: a framed area beside lines for signature, name, license number and date
    heading = next(c.row for c in ws["A"] if c.value and "seal and signature" in c.value)
    labels = [c.row for c in ws["A"] if c.value in SEAL_ROWS and c.row > heading]
    assert labels == list(range(heading + 1, heading + 1 + len(SEAL_ROWS)))
    assert f"D{labels[0]}:E{labels[-1]}" in merged
