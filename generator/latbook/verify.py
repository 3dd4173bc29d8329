"""Check a workbook that may have been edited in a spreadsheet program.

Compares, per calculated cell, the formula text with what the generator writes for the
workbook's current inputs, and the value the file stores with a fresh engine run on those
inputs; checks every input against its allowed range or list; lists the inputs that differ
from the embedded spec (an edit, not a finding: the Cover's live check shows their count,
which is compared like any result). No formula evaluator runs
here: the stored values are those of the program that last saved the file (Excel and
LibreOffice recalculate on save); `recalc=True` recalculates a copy in LibreOffice first.
"""

from __future__ import annotations

import math
import re
import tempfile
from dataclasses import asdict, dataclass, field
from pathlib import Path
from typing import Any

from latbook import __version__
from latbook.analysis import compute_results
from latbook.analysis.build_check import INPUTS_EDITED_ID, STATUS_ID, status_text
from latbook.problems import SpecError
from latbook.readback import InputReading, ReadBack, built_spec, locate, read_inputs
from latbook.spec.load import parse_spec
from latbook.workbook.builder import layout
from latbook.workbook.input_check import counts_as_edited
from latbook.workbook.rendered import expected_formulas
from latbook.workbook_file import WorkbookCells, read_workbook

REL_TOL = 1e-9
ABS_TOL = 1e-9
ERROR_VALUES = frozenset({"#NULL!", "#DIV/0!", "#VALUE!", "#REF!", "#NAME?", "#NUM!", "#N/A"})

# What each kind of finding means, for the report and for --json consumers.
FINDING_KINDS = {
    "spec_tampered": "the embedded spec does not match its SHA-256",
    "layout_mismatch": "the sheets are not laid out as this generator lays out the spec",
    "formula_replaced": "a calculated cell holds a constant instead of its formula",
    "formula_altered": "a calculated cell's formula differs from the generator's",
    "input_out_of_range": "an input lies outside its allowed range",
    "input_not_allowed": "an input is not one of its allowed values",
    "input_invalid": "the inputs do not form a valid spec",
    "error_value": "a formula evaluates to an error value",
    "result_differs": "a stored result differs from the engine run on the current inputs",
    "no_stored_values": "the file stores no calculated values",
    "engine_failed": "the engine cannot run on the current inputs",
}

_STRING_LITERAL = re.compile(r'"(?:[^"]|"")*"')
# A number literal (not part of a name or a cell ref): LibreOffice writes 1E-9 as 0.000000001.
_NUMBER = re.compile(r"(?<![\w.$])(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?(?![\w.(])")


@dataclass(frozen=True)
class Finding:
    kind: str
    message: str
    address: str = ""  # Sheet!C5; empty for a finding about the whole file
    quantity: str = ""  # registered quantity id
    label: str = ""  # the quantity's name as the workbook shows it

    def __str__(self) -> str:
        where = f"{self.address}  " if self.address else ""
        name = f"{self.label} [{self.quantity}]: " if self.quantity else ""
        return f"{where}{name}{self.message}"


@dataclass(frozen=True)
class InputChange:
    """An input cell whose value differs from the spec the workbook was built from."""

    address: str  # Sheet!C5
    spec_path: str  # $.building.levels[0].seismic_weight_kip
    quantity: str
    label: str
    built: Any
    current: Any

    def __str__(self) -> str:
        return f"{self.address}  {self.spec_path}: {self.built!r} -> {self.current!r}"


@dataclass
class VerifyReport:
    path: Path
    spec_sha256: str
    generator_version: str
    recalculated: bool
    stored_values: bool = True
    findings: list[Finding] = field(default_factory=list)
    notes: list[str] = field(default_factory=list)
    cells_checked: int = 0
    inputs_changed: list[InputChange] = field(default_factory=list)

    @property
    def intact(self) -> bool:
        return not self.findings

    def as_dict(self) -> dict[str, Any]:
        return {
            "path": str(self.path),
            "intact": self.intact,
            "spec_sha256": self.spec_sha256,
            "generator_version": self.generator_version,
            "recalculated": self.recalculated,
            "stored_values": self.stored_values,
            "cells_checked": self.cells_checked,
            "findings": [asdict(f) for f in self.findings],
            "inputs_as_built": not self.inputs_changed,
            "inputs_changed": [asdict(c) for c in self.inputs_changed],
            "notes": self.notes,
        }

    def text(self) -> str:
        lines = [
            f"latbook verify {self.path}",
            f"  built by latbook {self.generator_version} from spec SHA-256 "
            f"{self.spec_sha256[:12]}; {self.cells_checked} calculated cells checked"
            + ("; recalculated in LibreOffice" if self.recalculated else ""),
        ]
        lines += [f"  note: {n}" for n in self.notes]
        if self.inputs_changed:
            lines.append(f"  inputs changed since the build ({len(self.inputs_changed)}):")
            lines += [f"    {c}" for c in self.inputs_changed]
        else:
            lines.append("  inputs as built: every input cell holds the embedded spec's value")
        if self.intact:
            lines.append("  intact: every formula is the generator's and every result matches")
            return "\n".join(lines)
        lines.append(f"  {len(self.findings)} finding(s):")
        lines += [f"    {f.kind}: {f}" for f in self.findings]
        return "\n".join(lines)


def verify_workbook(path: Path, *, recalc: bool = False) -> VerifyReport:
    """Every finding for the workbook at `path`; raises UnreadableWorkbook."""
    cells = read_workbook(Path(path))
    built, _ = built_spec(cells)  # raises UnreadableWorkbook for an embedded spec refused
    report = VerifyReport(
        Path(path), cells.spec.sha256_stored, cells.spec.generator_version, recalc
    )
    if cells.spec.generator_version != __version__:
        report.notes.append(
            f"built by latbook {cells.spec.generator_version}, checked with {__version__}: "
            "formula differences may come from the generator itself"
        )
    if not cells.spec.intact:
        report.findings.append(Finding("spec_tampered", FINDING_KINDS["spec_tampered"]))

    moved = _layout_findings(cells, built)
    if moved:
        report.findings.append(moved)
        return report
    back = read_inputs(cells)
    report.inputs_changed = [_change(r) for r in back.readings if r.changed]
    report.findings += _input_findings(back)
    current = _current_spec(back, report)
    spec = current or built
    results = _engine(current, report) if current is not None else None
    if results is not None:  # the Cover counts the edits the way the spreadsheet compares
        edited = sum(counts_as_edited(r.built_value, r.cell_value) for r in back.readings)
        results[INPUTS_EDITED_ID] = edited
        results[STATUS_ID] = status_text(edited)
    values = _recalculated(cells) if recalc else cells
    _check_calcs(cells, values, spec, results, report)
    return report


def _layout_findings(cells: WorkbookCells, built) -> Finding | None:
    """One finding when the file's labels are not where this generator puts them (edited
    labels, inserted rows, or a workbook from other templates): its cells cannot be read."""
    plans, _ = layout(built)
    moved = []
    for plan in plans:
        for cell in plan.cells:
            if cell.text is None or cell.formula is not None or cell.style == "input":
                continue
            found = cells.formulas.get((plan.name, cell.row, cell.col))
            if (found or None) != (cell.text or None):
                moved.append(f"{plan.name}!{_a1(cell.row, cell.col)}")
    if not moved:
        return None
    shown = ", ".join(moved[:5]) + (" ..." if len(moved) > 5 else "")
    return Finding(
        "layout_mismatch",
        f"{len(moved)} label cell(s) differ from the generator's layout ({shown}); rows were "
        "inserted, deleted or relabelled, or the templates changed since the build: "
        "inputs cannot be read reliably, rebuild from the spec",
    )


def _change(reading: InputReading) -> InputChange:
    e = reading.entry
    path = f"$.{e.spec_path}"
    return InputChange(e.address, path, e.id, e.label, reading.built_value, reading.cell_value)


def _input_findings(back: ReadBack) -> list[Finding]:
    found = [f for r in back.readings if (f := _range_finding(r)) is not None]
    found += [Finding("input_invalid", p.message, address=p.path) for p in back.problems]
    return found


def _range_finding(reading: InputReading) -> Finding | None:
    e, v = reading.entry, reading.cell_value
    if v is None or v == "" or e.limits is None:
        return None  # blank: allowed for an optional field, else the spec check reports it
    if e.limits.allows(v):
        return None
    where = {"address": e.address, "quantity": e.id, "label": e.label}
    allowed = e.limits.describe()
    if e.limits.choices is not None:
        return Finding("input_not_allowed", f"{v!r} is not {allowed}", **where)
    if isinstance(v, bool) or not isinstance(v, int | float):
        return Finding("input_out_of_range", f"{v!r} is not a number", **where)
    return Finding("input_out_of_range", f"{v!r} is outside the range: {allowed}", **where)


def _current_spec(back: ReadBack, report: VerifyReport):
    """The spec of the current inputs, or None (with findings) when they are not valid."""
    if back.problems:
        return None
    try:
        return parse_spec(back.data)
    except SpecError as exc:
        flagged = {f.address for f in report.findings}
        for problem in exc.problems:
            p = locate(problem, back)
            if p.path.split(" ")[0] not in flagged:
                report.findings.append(Finding("input_invalid", p.message, address=p.path))
        return None


def _engine(spec, report: VerifyReport) -> dict[str, Any] | None:
    try:
        return compute_results(spec)
    except Exception as exc:  # the engine refuses a case the inputs now describe
        report.findings.append(Finding("engine_failed", f"{FINDING_KINDS['engine_failed']}: {exc}"))
        return None


def _recalculated(cells: WorkbookCells) -> WorkbookCells:
    from latbook.recalc import recalculate_with_libreoffice

    with tempfile.TemporaryDirectory(prefix="latbook-verify-") as tmp:
        return read_workbook(recalculate_with_libreoffice(cells.path, Path(tmp)))


def _check_calcs(cells, values, spec, results, report: VerifyReport) -> None:
    formulas, helpers, registry = expected_formulas(spec)
    _check_helpers(cells, helpers, report)
    calcs = registry.calcs()
    report.cells_checked = len(calcs)
    keys = {(e.sheet, e.row, e.col): e for e in calcs}
    stored = any(values.values.get(k) is not None for k in keys if cells.is_formula(k))
    report.stored_values = stored or not any(cells.is_formula(k) for k in keys)
    if not report.stored_values:
        report.findings.append(
            Finding(
                "no_stored_values",
                "the file stores no calculated values (saved by a program that does not "
                "recalculate); results were not compared: use --recalc",
            )
        )
    for key, e in keys.items():
        where = {"address": e.address, "quantity": e.id, "label": e.label}
        text = cells.formulas.get(key)
        if not cells.is_formula(key):
            what = "is empty" if text is None else f"holds the constant {text!r}"
            msg = f"{what} instead of {formulas[e.id]}"
            report.findings.append(Finding("formula_replaced", msg, **where))
        elif normalized(text) != normalized(formulas[e.id]):
            msg = f"holds {text} instead of {formulas[e.id]}"
            report.findings.append(Finding("formula_altered", msg, **where))
        value = values.values.get(key)
        if value in ERROR_VALUES:
            report.findings.append(Finding("error_value", f"evaluates to {value}", **where))
        elif results is not None and report.stored_values and not same(results[e.id], value):
            msg = f"stores {value!r}; the engine gives {results[e.id]!r}"
            report.findings.append(Finding("result_differs", msg, **where))
    for key, value in sorted(values.values.items()):
        if key not in keys and value in ERROR_VALUES and cells.is_formula(key):
            address = f"{key[0]}!{_a1(key[1], key[2])}"
            report.findings.append(Finding("error_value", f"evaluates to {value}", address))


def _check_helpers(cells, helpers, report: VerifyReport) -> None:
    """The formula text of the input check's helper cells on SpecData (their error values
    are found with every other cell's; their sum on the Cover is compared as a result)."""
    for key, expected in helpers.items():
        address = f"{key[0]}!{_a1(key[1], key[2])}"
        text = cells.formulas.get(key)
        if not cells.is_formula(key):
            what = "is empty" if text is None else f"holds the constant {text!r}"
            report.findings.append(
                Finding("formula_replaced", f"{what} instead of {expected}", address)
            )
        elif normalized(text) != normalized(expected):
            report.findings.append(
                Finding("formula_altered", f"holds {text} instead of {expected}", address)
            )


def normalized(formula: str) -> str:
    """Formula text without the differences spreadsheet programs make when they save it:
    spaces, letter case and the spelling of numbers outside string literals, and the
    `_xlfn.` storage prefix."""
    parts, last = [], 0
    for m in _STRING_LITERAL.finditer(formula):
        parts.append(_code(formula[last : m.start()]))
        parts.append(m.group(0))
        last = m.end()
    parts.append(_code(formula[last:]))
    return "".join(parts)


def _code(text: str) -> str:
    text = _NUMBER.sub(lambda m: repr(float(m.group(0))), re.sub(r"\s+", "", text))
    return text.upper().replace("_XLFN.", "")


def same(expected: Any, got: Any) -> bool:
    """Engine value vs stored value: text exactly, numbers within 1e-9 (rel and abs)."""
    if isinstance(expected, bool):
        return got is expected or (isinstance(got, str) and got.upper() == str(expected).upper())
    if isinstance(expected, str):
        return got == expected
    if isinstance(got, bool) or not isinstance(got, int | float):
        return False
    return math.isclose(float(got), float(expected), rel_tol=REL_TOL, abs_tol=ABS_TOL)


def _a1(row: int, col: int) -> str:
    from latbook.workbook.registry import a1

    return a1(row, col)
