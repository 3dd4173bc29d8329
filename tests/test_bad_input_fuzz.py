"""Bad and hostile input: refused cleanly, never half-written, never turned into formulas.

Invalid specs are mutations of valid generated ones (tests/helpers/specgen.py). Every one
must be refused by `latbook build` with exit code 2, a message naming a JSON path, no
traceback, no file written and an existing output left byte for byte as it was.

External references: the sheet-name rules (at most 31 characters, none of [ ] : * ? / \\,
unique ignoring case) and the `_xHHHH_` escape of control characters in cell text are
from ECMA-376 Part 1 (Office Open XML) §18.2.20 (sheet) and §22.4.2.4 (ST_Xstring); the
leading-character formula convention (=, +, -, @) is common practice for CSV/formula
injection. Size limits are the ones spec/models.py states in the schema.
"""

from __future__ import annotations

import copy
import json
import os
import random
import re
import subprocess
import sys
from collections.abc import Callable
from pathlib import Path

import openpyxl
import pytest
import xlsxwriter.workbook
import xlsxwriter.worksheet
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from latbook.build import build_workbook
from latbook.cli import EXIT_BAD_INPUT, EXIT_ENVIRONMENT, main
from latbook.spec import models
from latbook.spec.schema import schema_text
from tests.helpers.specgen import make_spec, specs

REPEATABLE = settings(
    derandomize=True,
    deadline=None,
    database=None,
    suppress_health_check=[HealthCheck.too_slow, HealthCheck.function_scoped_fixture],
)
SENTINEL = b"an existing workbook that must survive a refused build\n"
PROBLEM_LINE = re.compile(r"^  (\$\S*): ", re.MULTILINE)


def base_spec(seed: int = 7) -> dict:
    """Three levels, three lines each way, seismic and wind: every block present."""
    return make_spec(random.Random(seed), 3, 3, seismic="site_class", wind=True)


def small_spec(seed: int = 8) -> dict:
    """One level, two lines each way, seismic and wind: quick to build."""
    return make_spec(random.Random(seed), 1, 2, seismic="site_class", wind=True)


# --- the refusal contract ------------------------------------------------------------------


def refuse(folder: Path, capsys, *, data=None, raw: bytes | None = None) -> list[str]:
    """Run `latbook build` on bad input twice (no output yet; an existing output); check the
    contract both times; return the JSON paths of the problems printed."""
    spec_path = folder / "spec.json"
    if raw is None:
        raw = json.dumps(data).encode("utf-8")
    spec_path.write_bytes(raw)
    out = folder / "calc.xlsx"
    paths: list[str] = []
    for existing in (False, True):
        if existing:
            out.write_bytes(SENTINEL)
        before = sorted(os.listdir(folder))
        rc = main(["build", str(spec_path), "-o", str(out)])
        captured = capsys.readouterr()
        assert rc == EXIT_BAD_INPUT, captured.out + captured.err
        assert "Traceback" not in captured.err
        assert "nothing was written" in captured.err
        assert sorted(os.listdir(folder)) == before, "a file was written (or a temp file left)"
        if existing:
            assert out.read_bytes() == SENTINEL
        paths = PROBLEM_LINE.findall(captured.err)
        assert paths, captured.err
    out.unlink()
    return paths


def under(path: str, reported: list[str]) -> bool:
    """True when a reported problem path is `path` or one of its ancestors (not the root)."""
    return any(
        p != "$" and (path == p or path.startswith(p + ".") or path.startswith(p + "["))
        for p in reported
    )


# --- mutations: (name, mutate(spec) -> the JSON path that must be reported) ---------------


def _seg(spec, story=0, seg=0) -> dict:
    return spec["wall_lines"][0]["stories"][story]["segments"][seg]


def _line0_length_ft(spec) -> float:
    plan = spec["building"]["levels"][0]["plan"]
    return plan["x_max_ft"] - plan["x_min_ft"]  # wall_lines[0] is an x-line


SEG0 = "$.wall_lines[0].stories[0].segments[0]"
LV0 = "$.building.levels[0]"


def _set(node: Callable[[dict], dict], key: str, value, expected: str):
    def mutate(spec):
        node(spec)[key] = value
        return expected

    return mutate


def _delete(parent: Callable[[dict], dict], key: str, expected: str):
    def mutate(spec):
        del parent(spec)[key]
        return expected

    return mutate


def _level0(spec):
    return spec["building"]["levels"][0]


def _plan0(spec):
    return _level0(spec)["plan"]


def _root(spec):
    return spec


def _stories0(spec):
    return spec["wall_lines"][0]["stories"][0]


def _duplicate_level_id(spec):
    levels = spec["building"]["levels"]
    levels[1]["id"] = levels[0]["id"]
    return "$.building.levels[1].id"


def _duplicate_line_id(spec):
    spec["wall_lines"][1]["id"] = spec["wall_lines"][0]["id"]
    return "$.wall_lines[1].id"


def _duplicate_segment_id(spec):
    story = spec["wall_lines"][0]["stories"][0]
    story["segments"].append(copy.deepcopy(story["segments"][0]))
    return f"$.wall_lines[0].stories[0].segments[{len(story['segments']) - 1}].id"


def _duplicate_assembly_id(spec):
    walls = spec["assemblies"]["shear_walls"]
    walls.append(copy.deepcopy(walls[0]))
    return f"$.assemblies.shear_walls[{len(walls) - 1}].id"


def _segment_outside_line(spec):
    seg = _seg(spec)
    seg["start_ft"] = round(_line0_length_ft(spec) + 1.0, 3)
    return SEG0 + ".length_ft"


def _opening_outside_line(spec):
    story = _stories0(spec)
    story["openings"] = [{"start_ft": round(_line0_length_ft(spec) - 0.5, 3), "length_ft": 3.0}]
    return "$.wall_lines[0].stories[0].openings[0].length_ft"


def _opening_over_segment(spec):
    seg = _seg(spec)
    story = spec["wall_lines"][0]["stories"][0]
    story["openings"] = [{"start_ft": seg["start_ft"], "length_ft": seg["length_ft"] / 2}]
    return "$.wall_lines[0].stories[0].openings[0].start_ft"


def _elevations_out_of_order(spec):
    levels = spec["building"]["levels"]
    levels[0]["elevation_ft"], levels[1]["elevation_ft"] = (
        levels[1]["elevation_ft"],
        levels[0]["elevation_ft"],
    )
    return "$.building.levels[1].elevation_ft"


def _equal_elevations(spec):
    levels = spec["building"]["levels"]
    levels[1]["elevation_ft"] = levels[0]["elevation_ft"]
    return "$.building.levels[1].elevation_ft"


def _story_gap(spec):
    del spec["wall_lines"][0]["stories"][1]  # line 0 runs full height: now a story is missing
    return "$.wall_lines[0].stories"


def _unknown_level(spec):
    spec["wall_lines"][0]["stories"][0]["level"] = "NOPE"
    return "$.wall_lines[0].stories[0].level"


def _unknown_assembly(spec):
    _seg(spec)["assembly"] = "NOPE"
    return SEG0 + ".assembly"


def _line_outside_plan(spec):
    plan = _level0(spec)["plan"]
    spec["wall_lines"][0]["position_ft"] = plan["y_max_ft"] + 10
    return "$.wall_lines[0].position_ft"


def _hold_down_offset_too_big(spec):
    seg = _seg(spec)
    seg["hold_down_offset_ft"] = min(5.0, round(seg["length_ft"] / 2 + 0.01, 3))
    if seg["hold_down_offset_ft"] * 2 < seg["length_ft"]:
        seg["length_ft"] = 9.0  # a segment too long for the 5 ft offset maximum
    return SEG0 + ".hold_down_offset_ft"


def _plan_inverted(spec):
    plan = _plan0(spec)
    plan["x_max_ft"] = plan["x_min_ft"] - 1
    return LV0 + ".plan"


def _no_loads(spec):
    del spec["seismic"]
    del spec["wind"]
    return "$"


def _too_many(parent: Callable[[dict], list], limit: int, expected: str):
    def mutate(spec):
        items = parent(spec)
        while len(items) <= limit:
            items.append(copy.deepcopy(items[0]))
        return expected

    return mutate


def _long_text(spec):
    spec["project"]["notes"] = "x" * (models.MAX_TEXT + 1)
    return "$.project.notes"


def _long_id(spec):
    _level0(spec)["id"] = "L" * 13
    return "$.building.levels[0].id"


def _bad_id_characters(spec):
    _level0(spec)["id"] = "L 2!"
    return "$.building.levels[0].id"


MUTATIONS: list[tuple[str, Callable[[dict], str]]] = [
    # wrong types (JSON types as written: no "10" -> 10.0, true -> 1.0, "yes" -> True)
    ("elevation_text", _set(_level0, "elevation_ft", "ten", LV0 + ".elevation_ft")),
    ("elevation_numeric_text", _set(_level0, "elevation_ft", "10.5", LV0 + ".elevation_ft")),
    ("elevation_bool", _set(_level0, "elevation_ft", True, LV0 + ".elevation_ft")),
    ("elevation_null", _set(_level0, "elevation_ft", None, LV0 + ".elevation_ft")),
    ("levels_object", _set(lambda s: s["building"], "levels", {"a": 1}, "$.building.levels")),
    ("plan_list", _set(_level0, "plan", [1, 2], LV0 + ".plan")),
    (
        "bool_text",
        _set(_seg, "hold_down_continues_below", "yes", SEG0 + ".hold_down_continues_below"),
    ),
    ("name_number", _set(lambda s: s["project"], "name", 42, "$.project.name")),
    ("method_unknown", _set(_root, "design_method", "WSD", "$.design_method")),
    ("exposure_unknown", _set(lambda s: s["wind"], "exposure", "Z", "$.wind.exposure")),
    (
        "motion_unknown",
        _set(lambda s: s["seismic"]["ground_motion"], "method", "guess", "$.seismic.ground_motion"),
    ),
    # negative and impossible numbers
    ("segment_negative_length", _set(_seg, "length_ft", -3.0, SEG0 + ".length_ft")),
    ("segment_zero_length", _set(_seg, "length_ft", 0, SEG0 + ".length_ft")),
    ("segment_negative_start", _set(_seg, "start_ft", -1.0, SEG0 + ".start_ft")),
    ("weight_negative", _set(_level0, "seismic_weight_kip", -100.0, LV0 + ".seismic_weight_kip")),
    ("plan_inverted", _plan_inverted),
    ("wind_speed_negative", _set(lambda s: s["wind"], "V_mph", -110, "$.wind.V_mph")),
    ("nan", _set(_level0, "elevation_ft", float("nan"), LV0 + ".elevation_ft")),
    ("infinity", _set(_plan0, "x_max_ft", float("inf"), LV0 + ".plan.x_max_ft")),
    # geometry
    ("segment_outside_line", _segment_outside_line),
    ("opening_outside_line", _opening_outside_line),
    ("opening_over_segment", _opening_over_segment),
    ("line_outside_plan", _line_outside_plan),
    ("hold_down_offset_too_big", _hold_down_offset_too_big),
    ("elevations_out_of_order", _elevations_out_of_order),
    ("elevations_equal", _equal_elevations),
    ("story_gap", _story_gap),
    # ids and references
    ("duplicate_level_id", _duplicate_level_id),
    ("duplicate_line_id", _duplicate_line_id),
    ("duplicate_segment_id", _duplicate_segment_id),
    ("duplicate_assembly_id", _duplicate_assembly_id),
    ("unknown_level", _unknown_level),
    ("unknown_assembly", _unknown_assembly),
    ("id_too_long", _long_id),
    ("id_bad_characters", _bad_id_characters),
    ("unknown_field", _set(_level0, "elevation", 10.0, LV0 + ".elevation")),
    # missing required blocks
    ("missing_project", _delete(_root, "project", "$.project")),
    ("missing_building", _delete(_root, "building", "$.building")),
    ("missing_method", _delete(_root, "design_method", "$.design_method")),
    ("missing_plan", _delete(_level0, "plan", LV0 + ".plan")),
    ("missing_segment_length", _delete(_seg, "length_ft", SEG0 + ".length_ft")),
    (
        "missing_ground_motion",
        _delete(lambda s: s["seismic"], "ground_motion", "$.seismic.ground_motion"),
    ),
    ("no_loads", _no_loads),
    # absurd sizes
    ("elevation_huge", _set(_level0, "elevation_ft", 1.0e9, LV0 + ".elevation_ft")),
    ("plan_huge", _set(_plan0, "x_max_ft", 1.0e300, LV0 + ".plan.x_max_ft")),
    (
        "too_many_levels",
        _too_many(lambda s: s["building"]["levels"], models.MAX_LEVELS, "$.building.levels"),
    ),
    ("too_many_lines", _too_many(lambda s: s["wall_lines"], models.MAX_WALL_LINES, "$.wall_lines")),
    (
        "too_many_segments",
        _too_many(
            lambda s: s["wall_lines"][0]["stories"][0]["segments"],
            models.MAX_SEGMENTS_PER_STORY,
            "$.wall_lines[0].stories[0].segments",
        ),
    ),
    (
        "too_many_assemblies",
        _too_many(
            lambda s: s["assemblies"]["shear_walls"],
            models.MAX_ASSEMBLIES,
            "$.assemblies.shear_walls",
        ),
    ),
    ("text_too_long", _long_text),
]


@pytest.mark.parametrize(("name", "mutate"), MUTATIONS, ids=[m[0] for m in MUTATIONS])
def test_mutated_spec_is_refused_with_its_path(name, mutate, tmp_path, capsys):
    spec = base_spec()
    expected = mutate(spec)
    reported = refuse(tmp_path, capsys, data=spec)
    if expected == "$":
        assert "$" in reported
    else:
        assert under(expected, reported), f"{name}: wanted {expected}, got {reported}"


@settings(REPEATABLE, max_examples=40)
@given(
    spec=specs(min_levels=3, max_levels=4, max_lines_per_dir=4, long_ids=None),
    mutation=st.sampled_from(MUTATIONS),
)
def test_mutations_of_random_specs_are_refused(spec, mutation, tmp_path_factory, capsys):
    name, mutate = mutation
    spec = copy.deepcopy(spec)
    expected = mutate(spec)
    reported = refuse(tmp_path_factory.mktemp(name), capsys, data=spec)
    assert expected == "$" or under(expected, reported), f"{name}: {expected} not in {reported}"


# Wrong-typed replacement for any leaf: a value no field of that JSON type can accept as it is.
_WRONG = {
    bool: "true",
    int: "12",
    float: [1.5],
    str: 12345,
    dict: ["a list"],
    list: "a string",
}


def _leaves(node, path="$"):
    """(JSON path, parent, key) of every value in the spec, containers included."""
    items = node.items() if isinstance(node, dict) else enumerate(node)
    for key, value in items:
        child = f"{path}.{key}" if isinstance(node, dict) else f"{path}[{key}]"
        yield child, node, key
        if isinstance(value, dict | list) and value:
            yield from _leaves(value, child)


@settings(REPEATABLE, max_examples=60)
@given(spec=specs(max_levels=3, max_lines_per_dir=3), pick=st.integers(0, 10**6))
def test_any_value_of_the_wrong_type_is_refused_at_its_path(spec, pick, tmp_path_factory, capsys):
    leaves = list(_leaves(spec))
    path, parent, key = leaves[pick % len(leaves)]
    number = type(parent[key]) in (int, float)
    # a number gets `true` half the time: JSON true is not a number (`"rho": true` was taken)
    parent[key] = True if number and pick % 2 else _WRONG[type(parent[key])]
    reported = refuse(tmp_path_factory.mktemp("wrongtype"), capsys, data=spec)
    assert under(path, reported), f"{path} not covered by {reported}"


# --- files that are not a spec at all ------------------------------------------------------

BAD_FILES = {
    "not_json": b"{ this is not json",
    "truncated": b'{"project": {"name": "x"',
    "empty": b"",
    "array": b"[1, 2, 3]",
    "number": b"3",
    "string": b'"a spec"',
    "null": b"null",
    "latin1": '{"project": {"name": "Caf\u00e9"}}'.encode("latin-1"),
    "utf16": '{"project": {}}'.encode("utf-16"),
    "binary": bytes(range(256)),
    "deeply_nested": b"[" * 100_000 + b"]" * 100_000,
}


@pytest.mark.parametrize("name", sorted(BAD_FILES))
def test_file_that_is_not_a_spec_is_refused(name, tmp_path, capsys):
    reported = refuse(tmp_path, capsys, raw=BAD_FILES[name])
    assert reported == ["$"]


def test_missing_and_unreadable_spec_files_are_refused(tmp_path, capsys):
    out = tmp_path / "calc.xlsx"
    out.write_bytes(SENTINEL)
    for spec_path in (tmp_path / "absent.json", tmp_path):  # missing; a folder
        rc = main(["build", str(spec_path), "-o", str(out)])
        err = capsys.readouterr().err
        assert rc == EXIT_BAD_INPUT
        assert "Traceback" not in err and "  $: cannot read" in err
    assert out.read_bytes() == SENTINEL
    assert sorted(os.listdir(tmp_path)) == ["calc.xlsx"]


def test_output_that_is_a_folder_is_refused(tmp_path, capsys):
    spec_path = tmp_path / "spec.json"
    spec_path.write_text(json.dumps(base_spec()))
    (tmp_path / "calc.xlsx").mkdir()
    rc = main(["build", str(spec_path), "-o", str(tmp_path / "calc.xlsx")])
    err = capsys.readouterr().err
    assert rc == EXIT_BAD_INPUT and "Traceback" not in err and "is a folder" in err
    assert sorted(os.listdir(tmp_path)) == ["calc.xlsx", "spec.json"]


@pytest.mark.parametrize(
    "raw",
    [json.dumps({**base_spec(), "design_method": 7}).encode(), b"{ not json"],
    ids=["mutated", "not_json"],
)
def test_refusal_from_a_real_process(raw, tmp_path):
    """The installed entry point, in its own process: exit 2, a path, no traceback."""
    spec_path = tmp_path / "spec.json"
    spec_path.write_bytes(raw)
    out = tmp_path / "calc.xlsx"
    out.write_bytes(SENTINEL)
    proc = subprocess.run(
        [sys.executable, "-m", "latbook", "build", str(spec_path), "-o", str(out)],
        capture_output=True,
        text=True,
        timeout=120,
    )
    assert proc.returncode == 2
    assert "Traceback" not in proc.stderr
    assert PROBLEM_LINE.search(proc.stderr)
    assert out.read_bytes() == SENTINEL


# --- size limits ---------------------------------------------------------------------------

LIMITS = [
    ("levels", models.MAX_LEVELS, lambda s: s["building"]["levels"], "$.building.levels"),
    ("wall_lines", models.MAX_WALL_LINES, lambda s: s["wall_lines"], "$.wall_lines"),
    (
        "segments",
        models.MAX_SEGMENTS_PER_STORY,
        lambda s: s["wall_lines"][0]["stories"][0]["segments"],
        "$.wall_lines[0].stories[0].segments",
    ),
    (
        "openings",
        models.MAX_OPENINGS_PER_STORY,
        lambda s: s["wall_lines"][0]["stories"][0].setdefault("openings", []),
        "$.wall_lines[0].stories[0].openings",
    ),
    (
        "assemblies",
        models.MAX_ASSEMBLIES,
        lambda s: s["assemblies"]["diaphragms"],
        "$.assemblies.diaphragms",
    ),
]


@pytest.mark.parametrize(("name", "limit", "items", "path"), LIMITS, ids=[x[0] for x in LIMITS])
def test_size_limit_gives_a_clear_message(name, limit, items, path, tmp_path, capsys):
    spec = base_spec()
    target = items(spec)
    filler = target[0] if target else {"start_ft": 0.0, "length_ft": 0.1}
    while len(target) < limit + 1:
        target.append(copy.deepcopy(filler))
    spec_path = tmp_path / "spec.json"
    spec_path.write_text(json.dumps(spec))
    assert main(["validate", str(spec_path)]) == EXIT_BAD_INPUT
    err = capsys.readouterr().err
    assert f"{path}: List should have at most {limit} items" in err


def test_size_limits_are_stated_in_the_schema():
    schema_defs = json.loads(schema_text())["$defs"]
    stated = {
        ("Building", "levels"): models.MAX_LEVELS,
        ("Spec", "wall_lines"): models.MAX_WALL_LINES,
        ("LineStory", "segments"): models.MAX_SEGMENTS_PER_STORY,
        ("LineStory", "openings"): models.MAX_OPENINGS_PER_STORY,
        ("Assemblies", "shear_walls"): models.MAX_ASSEMBLIES,
    }
    root = json.loads(schema_text())
    for (model, field), limit in stated.items():
        props = (root if model == "Spec" else schema_defs[model])["properties"]
        assert props[field]["maxItems"] == limit, (model, field)


# --- text that looks like a formula, and control characters --------------------------------

HOSTILE_TEXTS = [
    "=1+2",
    '=HYPERLINK("http://example.invalid","x")',
    "+A1",
    "-2+3",
    "@SUM(A1:A9)",
    "=cmd|' /C calc'!A0",
    "tab\there\nnew line",
    "_x0041_ looks like an escape",
    "&P&N page codes & ampersands",
]
_XML_ESCAPE = re.compile(r"_x([0-9A-Fa-f]{4})_")


def _unescape(text: str) -> str:
    """Undo ECMA-376 §22.4.2.4 `_xHHHH_` escapes (openpyxl decodes only `_x005F_`)."""
    return _XML_ESCAPE.sub(lambda m: chr(int(m.group(1), 16)), text)


@pytest.mark.parametrize("text", HOSTILE_TEXTS, ids=range(len(HOSTILE_TEXTS)))
def test_text_fields_land_as_literal_text(text, tmp_path):
    spec = make_spec(random.Random(3), 1, 2, seismic="direct", wind=True, text=text)
    spec["seismic"]["system"]["label"] = text
    out = tmp_path / "calc.xlsx"
    build_workbook(spec, out)
    wb = openpyxl.load_workbook(out, read_only=True)  # values and types; no merged-range binding
    hits = [
        (ws.title, cell.coordinate, cell.data_type)
        for ws in wb.worksheets
        for row in ws.iter_rows()
        for cell in row
        if isinstance(cell.value, str) and text in (cell.value, _unescape(cell.value))
    ]
    # the cover shows the eight free-text project fields; Inputs shows the system label
    assert len([h for h in hits if h[0] == "Cover"]) >= 8
    assert any(h[0] == "Inputs" for h in hits)
    assert {h[2] for h in hits} == {"s"}, hits
    # and no formula anywhere holds the text as a token of its own ("A1" inside "AA137" is a
    # longer cell reference, not the text)
    token = re.compile(rf"(?<![A-Za-z0-9_$]){re.escape(text.strip('=+-@'))}(?![A-Za-z0-9_])")
    for ws in wb.worksheets:
        for row in ws.iter_rows():
            for cell in row:
                if cell.data_type == "f":
                    assert not token.search(str(cell.value))


# --- sheet names built from ids ------------------------------------------------------------

_SHEET_FORBIDDEN = set("[]:*?/\\")


def _assert_valid_sheet_names(names: list[str]) -> None:
    for name in names:
        assert 1 <= len(name) <= 31, name
        assert not set(name) & _SHEET_FORBIDDEN, name
        assert not name.startswith("'") and not name.endswith("'"), name
    lowered = [n.lower() for n in names]
    assert len(set(lowered)) == len(lowered), "sheet names collide ignoring case"


@pytest.mark.parametrize("seed", [21, 22, 23])
def test_sheet_names_from_the_longest_ids_are_valid(seed, tmp_path):
    spec = make_spec(random.Random(seed), 3, 2, seismic="site_class", wind=True, long_ids=True)
    assert all(len(lv["id"]) == 12 for lv in spec["building"]["levels"])
    out = tmp_path / "calc.xlsx"
    build_workbook(spec, out)
    _assert_valid_sheet_names(openpyxl.load_workbook(out, read_only=True).sheetnames)


def _rename_level(spec: dict, old: str, new: str) -> None:
    for level in spec["building"]["levels"]:
        if level["id"] == old:
            level["id"] = new
    for line in spec["wall_lines"]:
        for story in line["stories"]:
            if story["level"] == old:
                story["level"] = new


def test_ids_differing_only_in_case_give_distinct_sheets_or_a_refusal(tmp_path, capsys):
    """Excel sheet names are unique ignoring case; 'lv-a' and 'LV-A' must not collide."""
    spec = make_spec(random.Random(4), 2, 2, seismic="direct", wind=True, level_order="bottom_up")
    low, high = spec["building"]["levels"]
    _rename_level(spec, low["id"], "lv-a")
    _rename_level(spec, high["id"], "LV-A")
    spec_path = tmp_path / "spec.json"
    spec_path.write_text(json.dumps(spec))
    out = tmp_path / "calc.xlsx"
    rc = main(["build", str(spec_path), "-o", str(out)])
    err = capsys.readouterr().err
    assert "Traceback" not in err
    if rc == EXIT_BAD_INPUT:
        assert PROBLEM_LINE.search(err) and not out.exists()
    else:
        assert rc == 0
        _assert_valid_sheet_names(openpyxl.load_workbook(out, read_only=True).sheetnames)


# --- atomic write --------------------------------------------------------------------------


def _spec_file(folder: Path) -> Path:
    path = folder / "spec.json"
    path.write_text(json.dumps(small_spec()))
    return path


def test_failure_while_saving_leaves_no_partial_file(tmp_path, monkeypatch, capsys):
    """The writer dies half-way through saving (disk full): old output intact, no temp file."""

    def close_half_way(self):
        Path(self.filename).write_bytes(b"PK\x03\x04 half a zip")
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(xlsxwriter.workbook.Workbook, "close", close_half_way)
    spec_path = _spec_file(tmp_path)
    out = tmp_path / "calc.xlsx"
    out.write_bytes(SENTINEL)
    rc = main(["build", str(spec_path), "-o", str(out)])
    err = capsys.readouterr().err
    assert rc == EXIT_ENVIRONMENT
    assert "Traceback" not in err and "No space left on device" in err
    assert out.read_bytes() == SENTINEL
    assert sorted(os.listdir(tmp_path)) == ["calc.xlsx", "spec.json"]


@pytest.mark.parametrize("exc", [KeyboardInterrupt, RuntimeError], ids=["interrupt", "error"])
def test_interrupt_while_writing_cells_leaves_no_partial_file(exc, tmp_path, monkeypatch):
    real_write_string = xlsxwriter.worksheet.Worksheet.write_string
    calls = {"n": 0}

    def write_then_die(self, *args, **kwargs):
        calls["n"] += 1
        if calls["n"] == 40:
            raise exc("stopped mid-write")
        return real_write_string(self, *args, **kwargs)

    monkeypatch.setattr(xlsxwriter.worksheet.Worksheet, "write_string", write_then_die)
    out = tmp_path / "calc.xlsx"
    out.write_bytes(SENTINEL)
    with pytest.raises(exc):
        build_workbook(small_spec(), out)
    assert calls["n"] == 40
    assert out.read_bytes() == SENTINEL
    assert os.listdir(tmp_path) == ["calc.xlsx"]


def test_successful_build_replaces_the_output_with_normal_permissions(tmp_path):
    out = tmp_path / "calc.xlsx"
    out.write_bytes(SENTINEL)
    build_workbook(small_spec(), out)
    assert out.read_bytes()[:2] == b"PK"
    assert os.listdir(tmp_path) == ["calc.xlsx"]
    if os.name == "posix":
        umask = os.umask(0)
        os.umask(umask)
        assert out.stat().st_mode & 0o777 == 0o666 & ~umask
