"""Key plans (Plan_<level> sheets), the story-force bar chart and black-and-white chart
styles: chart XML read from the built file, coordinates against hand-derived values, and
coordinate cells that move when a segment input is edited and LibreOffice recalculates."""

from __future__ import annotations

import copy
import json
import posixpath
import re
import zipfile
from pathlib import Path
from xml.etree import ElementTree as ET

import openpyxl
import pytest

from latbook.build import build_workbook
from latbook.recalc import find_soffice, read_cell_values, recalculate_with_libreoffice
from latbook.workbook.registry import a1

ROOT = Path(__file__).resolve().parents[1]
HARBOR = ROOT / "out_examples" / "harbor_workshop" / "spec.json"
MAPLE = ROOT / "out_examples" / "maple_terrace" / "spec.json"
NS = {
    "c": "http://schemas.openxmlformats.org/drawingml/2006/chart",
    "a": "http://schemas.openxmlformats.org/drawingml/2006/main",
}
REL = "{http://schemas.openxmlformats.org/officeDocument/2006/relationships}id"


def _rels(zf: zipfile.ZipFile, part: str) -> dict[str, str]:
    folder, name = posixpath.split(part)
    rels = ET.fromstring(zf.read(f"{folder}/_rels/{name}.rels"))
    return {r.get("Id"): posixpath.normpath(posixpath.join(folder, r.get("Target"))) for r in rels}


def charts_of_sheet(path: Path, sheet: str) -> list[ET.Element]:
    """The chart XML roots drawn on `sheet`, in drawing order."""
    with zipfile.ZipFile(path) as zf:
        book = ET.fromstring(zf.read("xl/workbook.xml"))
        main = "{http://schemas.openxmlformats.org/spreadsheetml/2006/main}"
        rid = next(s.get(REL) for s in book.iter(f"{main}sheet") if s.get("name") == sheet)
        sheet_part = _rels(zf, "xl/workbook.xml")[rid]
        try:
            drawings = [t for t in _rels(zf, sheet_part).values() if "/drawings/" in t]
        except KeyError:
            return []
        charts = [t for d in drawings for t in _rels(zf, d).values() if "/charts/" in t]
        return [ET.fromstring(zf.read(c)) for c in charts]


def _series(chart: ET.Element) -> list[ET.Element]:
    return chart.findall(".//c:ser", NS)


def _ref(ser: ET.Element, tag: str) -> str:
    return ser.find(f"c:{tag}//c:f", NS).text


def _name(ser: ET.Element) -> str:
    return ser.find("c:tx/c:v", NS).text


def _range(entry_sheet: str, first: int, last: int, col: int) -> str:
    return f"{entry_sheet}!{a1(first, col, True)}:{a1(last, col, True)}"


@pytest.fixture(scope="module")
def maple(tmp_path_factory):
    data = json.loads(MAPLE.read_text(encoding="utf-8"))
    return build_workbook(data, tmp_path_factory.mktemp("maple") / "calc.xlsx")


def test_one_key_plan_per_story_with_series_on_the_point_rows(maple):
    """Each story with walls (RF, L3, L2 of the demo) has a Plan sheet with one scatter chart:
    outline, wall lines, one series per assembly used in that story, hold-down marks; each
    series points at its own rows of the points table (derived from the demo spec)."""
    used = {"RF": ["SW1", "SW2"], "L3": ["SW2", "SW3", "SW1"], "L2": ["SW2", "SW3"]}
    for level, assemblies in used.items():
        sheet = f"Plan_{level}"
        charts = charts_of_sheet(maple.path, sheet)
        assert len(charts) == 1
        chart = charts[0]
        assert chart.find(".//c:scatterChart", NS) is not None
        blanks = chart.find(".//c:dispBlanksAs", NS)  # xlsxwriter leaves out the default
        assert blanks is None or blanks.get("val") == "gap"  # blank rows break the line
        names = [_name(s) for s in _series(chart)]
        assert names == [
            f"plan outline, level {level}",
            "x-lines (name at the left end)",
            "y-lines (name at the bottom end)",
            *[f"shear walls, assembly {a}" for a in assemblies],
            "hold-downs (segment ends)",
        ]
        tpos = maple.registry.tables[f"plan_{level}"]
        x_col, y_col = tpos.cols["x_ft"], tpos.cols["y_ft"]
        outline = _series(chart)[0]
        first = tpos.rows["outline.1"]
        assert _ref(outline, "xVal") == _range(sheet, first, first + 4, x_col)
        assert _ref(outline, "yVal") == _range(sheet, first, first + 4, y_col)
        # the hold-down series spans every segment row, markers only
        marks = _series(chart)[-1]
        seg_rows = [r for k, r in tpos.rows.items() if k.startswith("seg.")]
        assert _ref(marks, "xVal") == _range(sheet, min(seg_rows), max(seg_rows), x_col)
        assert marks.find("c:spPr/a:ln/a:noFill", NS) is not None
        assert marks.find("c:marker/c:symbol", NS).get("val") == "square"


def test_assembly_series_takes_its_segments_and_gaps_only(maple):
    """RF: SW1 walls are on lines A, B, C, 1 and 3 (derived from the demo spec); the SW1
    series runs from A.A1's start to 3.3A's end, a blank row between two segments."""
    tpos = maple.registry.tables["plan_RF"]
    chart = charts_of_sheet(maple.path, "Plan_RF")[0]
    sw1 = next(s for s in _series(chart) if _name(s) == "shear walls, assembly SW1")
    first, last = tpos.rows["seg.A.A1.start"], tpos.rows["seg.3.3A.end"]
    assert _ref(sw1, "xVal") == _range("Plan_RF", first, last, tpos.cols["x_ft"])
    ws = openpyxl.load_workbook(maple.path)["Plan_RF"]
    gap = tpos.rows["seg.A.A1.end"] + 1
    assert ws.cell(row=gap + 1, column=tpos.cols["x_ft"] + 1).value is None
    assert ws.cell(row=gap + 2, column=tpos.cols["x_ft"] + 1).value is not None


def _shifted_harbor() -> dict:
    data = json.loads(HARBOR.read_text(encoding="utf-8"))
    plan = data["building"]["levels"][0]["plan"]
    plan["x_min_ft"], plan["y_min_ft"] = -10.0, -5.0
    return data


# Hand-derived (harbor demo with its plan moved to x_min = -10 ft, y_min = -5 ft): segment S2
# of x-line S (y = 0) starts 60 ft along the line from x_min and is 20 ft long; segment M1 of
# y-line M (x = 40) starts 5 ft from y_min and is 12 ft long; line E is the y-line at x = 76.
DERIVED_POINTS = {
    "seg.S.S2.start": (50.0, 0.0),
    "seg.S.S2.end": (70.0, 0.0),
    "seg.M.M1.start": (40.0, 0.0),
    "seg.M.M1.end": (40.0, 12.0),
    "line.E.start": (76.0, -5.0),
    "line.E.end": (76.0, 50.0),
    "outline.3": (84.0, 50.0),
}


def test_coordinates_equal_hand_derived_values(tmp_path):
    built = build_workbook(_shifted_harbor(), tmp_path / "calc.xlsx")
    ws = openpyxl.load_workbook(built.path, data_only=True)["Plan_RF"]
    entries = built.registry.entries
    for pid, (x, y) in DERIVED_POINTS.items():
        for qid, expected in ((f"plan.RF.{pid}.x_ft", x), (f"plan.RF.{pid}.y_ft", y)):
            assert built.results[qid] == pytest.approx(expected, abs=1e-12), qid
            e = entries[qid]
            assert e.sheet == "Plan_RF"
            assert ws.cell(row=e.row + 1, column=e.col + 1).value == pytest.approx(
                expected, abs=1e-12
            ), qid  # cached value
    formulas = openpyxl.load_workbook(built.path)["Plan_RF"]
    e = entries["plan.RF.seg.S.S2.end.x_ft"]
    text = formulas.cell(row=e.row + 1, column=e.col + 1).value
    assert re.fullmatch(
        r"=Inputs!\$?[A-Z]+\$?\d+\+Walls_in!\$?[A-Z]+\$?\d+\+Walls_in!\$?[A-Z]+\$?\d+", text
    )


@pytest.mark.libreoffice
def test_edited_segment_start_moves_the_plan_after_libreoffice_recalc(tmp_path):
    if find_soffice() is None:
        pytest.skip("LibreOffice (soffice) is not installed")
    built = build_workbook(_shifted_harbor(), tmp_path / "calc.xlsx")
    entries = built.registry.entries
    start = entries["segment.S.RF.S2.start_ft"]
    wb = openpyxl.load_workbook(built.path)
    wb[start.sheet].cell(row=start.row + 1, column=start.col + 1).value = 55.0
    edited = tmp_path / "edited.xlsx"
    wb.save(edited)
    out = recalculate_with_libreoffice(edited, tmp_path / "recalc")
    ids = ["plan.RF.seg.S.S2.start.x_ft", "plan.RF.seg.S.S2.end.x_ft", "plan.RF.seg.S.S2.end.y_ft"]
    refs = [(entries[q].sheet, a1(entries[q].row, entries[q].col)) for q in ids]
    values = read_cell_values(out, refs)
    # derived: x_min -10 + 55 = 45; + length 20 = 65; y stays on line S (y = 0)
    assert [values[r] for r in refs] == [pytest.approx(45.0), pytest.approx(65.0), 0.0]


def test_story_force_bars_roof_at_the_top_on_one_scale(maple):
    """Charts sheet: horizontal bars of seismic F_x and both wind directions' F, categories
    from the roof-first level column, the category axis reversed so the roof is on top."""
    bar = next(
        c for c in charts_of_sheet(maple.path, "Charts") if c.find(".//c:barChart", NS) is not None
    )
    assert bar.find(".//c:barDir", NS).get("val") == "bar"
    cat_axis = bar.find(".//c:catAx", NS)
    assert cat_axis.find("c:scaling/c:orientation", NS).get("val") == "maxMin"
    refs = [(_name(s), _ref(s, "val")) for s in _series(bar)]
    assert [n for n, _ in refs] == ["seismic F_x (Q_E)", "wind in x, F (W)", "wind in y, F (W)"]
    reg = maple.registry
    for (_, ref), (table, field) in zip(
        refs, [("elf", "Fx"), ("wind_x", "F_level"), ("wind_y", "F_level")], strict=True
    ):
        t = reg.tables[table]
        top, bottom = t.row_of(field, t.first_row), t.row_of(field, t.last_row)  # its chunk
        assert ref == _range(t.sheet, top, bottom, t.cols[field])
        assert list(t.rows) == ["RF", "L3", "L2"]  # roof first
    title = "".join(x.text for x in bar.find("c:chart/c:title", NS).iter(f"{{{NS['a']}}}t"))
    assert "strength level" in title
    # one value axis for all three series
    assert len(bar.findall(".//c:valAx", NS)) == 1


def _look(ser: ET.Element) -> tuple:
    """What tells a series apart on a black-and-white print (colours left out, except a
    bar's fill tone)."""
    dash = ser.find("c:spPr/a:ln/a:prstDash", NS)
    width = ser.find("c:spPr/a:ln", NS)
    symbol = ser.find("c:marker/c:symbol", NS)
    marker_fill = ser.find("c:marker/c:spPr/a:solidFill/a:srgbClr", NS)
    pattern = ser.find("c:spPr/a:pattFill", NS)
    bar_fill = ser.find("c:spPr/a:solidFill/a:srgbClr", NS)
    return (
        dash.get("val") if dash is not None else "solid",
        width.get("w") if width is not None else None,
        symbol.get("val") if symbol is not None else None,
        marker_fill.get("val") in ("FFFFFF",) if marker_fill is not None else None,
        pattern.get("prst") if pattern is not None else None,
        bar_fill.get("val") if bar_fill is not None else None,
    )


def test_every_chart_series_differs_without_colour(maple):
    sheets = openpyxl.load_workbook(maple.path, read_only=True).sheetnames
    seen = 0
    for sheet in sheets:
        for chart in charts_of_sheet(maple.path, sheet):
            looks = [_look(s) for s in _series(chart)]
            assert len(set(looks)) == len(looks), (sheet, looks)
            seen += 1
    assert seen >= 10  # 3 key plans, 4 charts on Charts, diaphragm charts


def test_plan_chart_has_equal_scales_in_pixels(maple):
    """Inner plot size (chart size x layout fraction) over the axis span is the same in x
    and y (the frame is fixed at build time from the plan extents)."""
    chart = charts_of_sheet(maple.path, "Plan_RF")[0]
    layout = chart.find(".//c:plotArea/c:layout/c:manualLayout", NS)
    assert layout.find("c:layoutTarget", NS).get("val") == "inner"
    w_frac = float(layout.find("c:w", NS).get("val"))
    h_frac = float(layout.find("c:h", NS).get("val"))
    axes = {}
    for ax in chart.findall(".//c:valAx", NS):
        pos = ax.find("c:axPos", NS).get("val")
        axes[pos] = (
            float(ax.find("c:scaling/c:min", NS).get("val")),
            float(ax.find("c:scaling/c:max", NS).get("val")),
        )
    # chart size in px as laid out (the sheet plan keeps it; xlsxwriter anchors it so)
    plan = next(p for p in _plans() if p.name == "Plan_RF")
    frame = plan.charts[0]["frame"]
    px_x = frame["width"] * w_frac / (axes["b"][1] - axes["b"][0])
    px_y = frame["height"] * h_frac / (axes["l"][1] - axes["l"][0])
    assert px_x == pytest.approx(px_y, rel=1e-3)
    assert frame["width"] <= 720  # 7.5 in at 96 px/in: a letter page width at 100 %


def _plans():
    from latbook.spec.load import parse_spec
    from latbook.workbook.builder import layout

    data = json.loads(MAPLE.read_text(encoding="utf-8"))
    placed, _ = layout(parse_spec(data))
    return [p for p in placed if hasattr(p, "charts")]


def test_archived_spec_without_walls_has_no_plan_sheet(tmp_path):
    data = copy.deepcopy(json.loads(HARBOR.read_text(encoding="utf-8")))
    data.pop("wall_lines")
    built = build_workbook(data, tmp_path / "calc.xlsx")
    names = openpyxl.load_workbook(built.path, read_only=True).sheetnames
    assert not [n for n in names if n.startswith("Plan_")]
