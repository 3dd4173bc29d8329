"""Values at the edge of what JSON can say: every one gets a clean refusal (exit 2, the JSON
path, no traceback) or builds a workbook that reads back as it was written.

References: Python refuses to convert integers longer than 4300 digits (CPython
`sys.int_info.default_max_str_digits`, from memory); JSON `true` is not a number (RFC 8259
§3); XML 1.0 §2.2 `Char` excludes U+FFFE, U+FFFF, surrogates and most C0 controls, which an
.xlsx writer must therefore escape (ECMA-376 Part 1 §22.4.2.4 `_xHHHH_`).
"""

from __future__ import annotations

import copy
import json
import random
import re

import pytest

from latbook.build import build_workbook
from latbook.cli import EXIT_BAD_INPUT, MAX_PROBLEMS_LISTED, main
from latbook.problems import SpecError
from latbook.spec.load import parse_spec
from latbook.verify import verify_workbook
from tests.helpers.specgen import make_spec

WEIGHT = "$.building.levels[0].seismic_weight_kip"


def small_spec() -> dict:
    """One level, two lines each way, rho typed (an input cell the tests edit)."""
    return make_spec(random.Random(8), 1, 2, seismic="site_class", wind=True, rho_method="typed")


def run(tmp_path, capsys, command: str, raw: str) -> tuple[int, str]:
    spec_path = tmp_path / "spec.json"
    spec_path.write_text(raw, encoding="utf-8")
    args = [command, str(spec_path)]
    if command == "build":
        args += ["-o", str(tmp_path / "calc.xlsx")]
    rc = main(args)
    err = capsys.readouterr().err
    assert "Traceback" not in err
    return rc, err


def _with_weight(literal: str) -> str:
    """The spec's JSON text with the first level's weight written as `literal`."""
    spec = small_spec()
    spec["building"]["levels"][0]["seismic_weight_kip"] = "@@W@@"
    return json.dumps(spec).replace('"@@W@@"', literal)


@pytest.mark.parametrize("command", ["build", "validate", "results"])
def test_integer_longer_than_python_converts_is_refused_at_its_path(command, tmp_path, capsys):
    rc, err = run(tmp_path, capsys, command, _with_weight("9" * 5000))
    assert rc == EXIT_BAD_INPUT
    assert f"{WEIGHT}: not a finite number" in err
    assert not (tmp_path / "calc.xlsx").exists()


@pytest.mark.parametrize("literal", ["NaN", "Infinity", "-Infinity", "1e999"])
def test_non_finite_number_is_named_as_such(literal, tmp_path, capsys):
    rc, err = run(tmp_path, capsys, "validate", _with_weight(literal))
    assert rc == EXIT_BAD_INPUT
    assert f"{WEIGHT}: not a finite number" in err
    assert "less than or equal" not in err


def _numeric_leaves(node, path="$"):
    items = node.items() if isinstance(node, dict) else enumerate(node)
    for key, value in items:
        child = f"{path}.{key}" if isinstance(node, dict) else f"{path}[{key}]"
        if isinstance(value, int | float) and not isinstance(value, bool):
            yield child, node, key
        elif isinstance(value, dict | list):
            yield from _numeric_leaves(value, child)


def test_true_is_refused_for_every_number_of_the_spec():
    base = make_spec(random.Random(7), 2, 2, seismic="site_class", wind=True, rho_method="typed")
    leaves = list(_numeric_leaves(base))
    assert "$.seismic.rho" in [p for p, _, _ in leaves]
    for path, _, _ in leaves:
        spec = copy.deepcopy(base)
        node, key = next((n, k) for p, n, k in _numeric_leaves(spec) if p == path)
        node[key] = True
        with pytest.raises(SpecError) as caught:
            parse_spec(spec)
        assert path in [p.path for p in caught.value.problems], path


@pytest.mark.parametrize("char", ["\x01", "\x1b", "\r", "\ufffe", "\uffff", "\ud800"], ids=repr)
def test_text_a_workbook_cannot_store_is_refused(char, tmp_path, capsys):
    spec = small_spec()
    spec["project"]["name"] = f"Name {char} here"
    spec["seismic"]["system"]["label"] = f"label{char}"
    raw = json.dumps(spec)  # ASCII escapes: the file itself is valid UTF-8
    rc, err = run(tmp_path, capsys, "build", raw)
    assert rc == EXIT_BAD_INPUT
    assert f"U+{ord(char):04X}" in err or (char == "\ud800" and "U+D800 to U+DFFF" in err)
    assert "$.project.name:" in err and "$.seismic.system.label:" in err
    assert not (tmp_path / "calc.xlsx").exists()


@pytest.mark.parametrize(
    "text", ["tab\there\nline", "_x0041_ literal", "\ufdd0 \U0001f600 \x7f \x85", "=1+2"]
)
def test_text_that_is_stored_reads_back_and_verifies_intact(text, tmp_path):
    spec = small_spec()
    for key in ("name", "notes", "engineer"):
        spec["project"][key] = text
    spec["seismic"]["system"]["label"] = text
    out = tmp_path / "calc.xlsx"
    build_workbook(spec, out)
    report = verify_workbook(out)
    assert report.intact, [str(f) for f in report.findings]


def test_listing_of_a_huge_number_of_problems_is_capped(tmp_path, capsys):
    spec = small_spec()
    n_unknown = 200_000
    spec["project"].update({f"typo{i}": 1 for i in range(n_unknown)})
    rc, err = run(tmp_path, capsys, "validate", json.dumps(spec))
    assert rc == EXIT_BAD_INPUT
    listed = re.findall(r"^  \$\S*: ", err, re.MULTILINE)
    assert len(listed) == MAX_PROBLEMS_LISTED
    assert f"the spec has {n_unknown} problem(s)" in err
    assert f"and {n_unknown - MAX_PROBLEMS_LISTED} more problem(s) not listed" in err
    assert len(err) < 20_000


def test_read_back_of_true_typed_into_a_number_cell_is_refused(tmp_path, capsys):
    import openpyxl

    out = tmp_path / "calc.xlsx"
    result = build_workbook(small_spec(), out)
    entry = result.registry.entries["seismic.rho"]
    wb = openpyxl.load_workbook(out)
    wb[entry.sheet].cell(entry.row + 1, entry.col + 1).value = True
    wb.save(out)
    rc = main(["read-back", str(out), "-o", str(tmp_path / "back.json")])
    err = capsys.readouterr().err
    assert rc == EXIT_BAD_INPUT
    assert f"{entry.address} ($.seismic.rho): expected a number" in err
    assert not (tmp_path / "back.json").exists()
