"""Scale benchmark: build synthetic buildings at three sizes and compare with bare xlsxwriter.

    python benchmarks/bench.py                 # print the table
    python benchmarks/bench.py --profile       # and cProfile the largest build
    python benchmarks/bench.py --write-results # and record benchmarks/RESULTS.md

Per size it prints: formula cells, build time (validate + engine + layout + write), the
floor (a fresh xlsxwriter workbook replaying exactly the cell writes and formats the build
made: same sheets, same formula strings with cached values, same text and numbers, same
formats), build / floor, file size, the `formulas` recompute time (smallest size only)
and the LibreOffice recalculation time where soffice is installed.

Targets: build <= 1.5 x floor; linear growth (cells x16 within time x18); largest
workbook < 2 MB; no volatile functions in any formula.
Buildings are invented (tests/helpers/specgen.py), seeded, so runs are comparable.
"""

from __future__ import annotations

import argparse
import cProfile
import io
import platform
import pstats
import random
import sys
import tempfile
import time
from collections.abc import Callable
from contextlib import contextmanager
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))

import xlsxwriter  # noqa: E402
import xlsxwriter.workbook  # noqa: E402
import xlsxwriter.worksheet  # noqa: E402

from latbook import __version__  # noqa: E402
from latbook.build import build_workbook  # noqa: E402
from latbook.recalc import find_soffice, recalculate_with_libreoffice  # noqa: E402
from latbook.spec.models import MAX_LEVELS, MAX_WALL_LINES  # noqa: E402
from latbook.workbook.builder import WORKBOOK_OPTIONS  # noqa: E402
from latbook.workbook_functions import functions_used  # noqa: E402
from tests.helpers.specgen import make_spec  # noqa: E402

# (levels, wall lines per direction): 3 x 8, 6 x 24 and 12 x 60 wall lines in all.
SIZES = [(3, 4), (6, 12), (12, 30)]
SEED = 2026
REPEATS = 3
LONG_BUILD_S = 10.0  # builds longer than this are timed once
TARGET_RATIO = 1.5
TARGET_GROWTH = 18 / 16  # time growth / cell growth
TARGET_MAX_BYTES = 2 * 1024 * 1024
VOLATILE = {"NOW", "TODAY", "RAND", "RANDBETWEEN", "RANDARRAY", "OFFSET", "INDIRECT", "CELL",
            "INFO"}  # fmt: skip
CELL_WRITES = ("write_formula", "write_string", "write_number", "write_boolean", "write_blank")


@dataclass
class WriteLog:
    """Every sheet, format and cell write one build made, in order, for replay."""

    sheets: list[str] = field(default_factory=list)
    formats: dict[int, dict[str, Any]] = field(default_factory=dict)
    calls: list[tuple[str, str, tuple, dict]] = field(default_factory=list)

    @property
    def formulas(self) -> list[str]:
        return [args[2] for method, _, args, _ in self.calls if method == "write_formula"]


@contextmanager
def recording(log: WriteLog):
    """Patch xlsxwriter so every add_worksheet / add_format / cell write lands in `log`."""
    wb_cls, ws_cls = xlsxwriter.workbook.Workbook, xlsxwriter.worksheet.Worksheet
    saved = {"add_worksheet": wb_cls.add_worksheet, "add_format": wb_cls.add_format}
    saved.update({name: getattr(ws_cls, name) for name in CELL_WRITES})

    def add_worksheet(self, name=None, *a, **k):
        log.sheets.append(name)
        return saved["add_worksheet"](self, name, *a, **k)

    def add_format(self, props=None):
        fmt = saved["add_format"](self, props)
        if "xf_index" not in (props or {}):  # not the workbook's own default formats
            log.formats[id(fmt)] = dict(props or {})
        return fmt

    def recorder(method: str) -> Callable:
        def call(self, *args, **kwargs):
            log.calls.append((method, self.name, args, kwargs))
            return saved[method](self, *args, **kwargs)

        return call

    wb_cls.add_worksheet, wb_cls.add_format = add_worksheet, add_format
    for name in CELL_WRITES:
        setattr(ws_cls, name, recorder(name))
    try:
        yield log
    finally:
        wb_cls.add_worksheet, wb_cls.add_format = saved["add_worksheet"], saved["add_format"]
        for name in CELL_WRITES:
            setattr(ws_cls, name, saved[name])


def replay(log: WriteLog, path: Path) -> None:
    """The floor: bare xlsxwriter writing the same sheets, formats and cells, with the
    workbook options the build used."""
    wb = xlsxwriter.Workbook(str(path), WORKBOOK_OPTIONS)
    formats = {key: wb.add_format(props) for key, props in log.formats.items()}
    sheets = {name: wb.add_worksheet(name) for name in log.sheets}
    for method, sheet, args, kwargs in log.calls:
        args = tuple(formats.get(id(a)) if _is_format(a) else a for a in args)
        getattr(sheets[sheet], method)(*args, **kwargs)
    wb.close()


def _is_format(value: Any) -> bool:
    return isinstance(value, xlsxwriter.format.Format)


def best_of(repeats: int, fn: Callable[[], Any]) -> float:
    """Shortest wall time of `repeats` calls, s (the least disturbed run)."""
    times = []
    for _ in range(repeats):
        t0 = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t0)
    return min(times)


@dataclass
class Row:
    levels: int
    lines: int
    formula_cells: int
    cells: int
    index_cells: int
    build_s: float
    floor_s: float
    bytes: int
    evaluator_s: float | None = None
    libreoffice_s: float | None = None
    volatile: set[str] = field(default_factory=set)

    @property
    def ratio(self) -> float:
        return self.build_s / self.floor_s


def measure(
    n_levels: int, n_lines_per_dir: int, folder: Path, *, evaluate: bool, soffice: bool
) -> Row:
    spec = bench_spec(n_levels, n_lines_per_dir)
    out = folder / f"bench_{n_levels}x{2 * n_lines_per_dir}.xlsx"
    log = WriteLog()
    t0 = time.perf_counter()
    with recording(log):
        result = build_workbook(spec, out)
    repeats = REPEATS if time.perf_counter() - t0 < LONG_BUILD_S else 1
    build_s = best_of(repeats, lambda: build_workbook(spec, out))
    floor_path = folder / "floor.xlsx"
    floor_s = best_of(repeats, lambda: replay(log, floor_path))
    volatile = set().union(*(functions_used(f) for f in log.formulas)) & VOLATILE
    row = Row(
        levels=n_levels,
        lines=2 * n_lines_per_dir,
        formula_cells=len(result.registry.calcs()),
        cells=len(log.calls),
        index_cells=sum(1 for _, sheet, _, _ in log.calls if sheet == "Index"),
        build_s=build_s,
        floor_s=floor_s,
        bytes=out.stat().st_size,
        volatile=volatile,
    )
    if evaluate:
        from tests.helpers.evaluator import evaluate_workbook

        row.evaluator_s = best_of(1, lambda: evaluate_workbook(out))
    if soffice:
        recalc_dir = folder / "recalc"
        recalc_dir.mkdir(exist_ok=True)
        row.libreoffice_s = best_of(1, lambda: recalculate_with_libreoffice(out, recalc_dir))
    return row


def bench_spec(n_levels: int, n_lines_per_dir: int) -> dict[str, Any]:
    """The benchmark building: seismic (site class) and wind, ASD, sizes clamped to the spec."""
    n_levels = min(n_levels, MAX_LEVELS)
    n_lines_per_dir = min(n_lines_per_dir, MAX_WALL_LINES // 2)
    return make_spec(
        random.Random(SEED),
        n_levels,
        n_lines_per_dir,
        design_method="ASD",
        seismic="site_class",
        wind=True,
        level_order="bottom_up",
    )


def profile_build(n_levels: int, n_lines_per_dir: int, folder: Path, top: int = 30) -> str:
    spec = bench_spec(n_levels, n_lines_per_dir)
    profiler = cProfile.Profile()
    profiler.enable()
    build_workbook(spec, folder / "profile.xlsx")
    profiler.disable()
    text = io.StringIO()
    pstats.Stats(profiler, stream=text).sort_stats("cumulative").print_stats(top)
    return text.getvalue()


# --- report ----------------------------------------------------------------------------------

HEADER = (
    "| building | formula cells | cells written (Index sheet) | build s | floor s | build/floor "
    "| file KB | formulas recompute s | LibreOffice recalc s |"
)


def _fmt(x: float | None, digits: int = 3) -> str:
    return "-" if x is None else f"{x:.{digits}f}"


def table(rows: list[Row]) -> str:
    lines = [HEADER, "|" + "---|" * 9]
    for r in rows:
        lines.append(
            f"| {r.levels} levels x {r.lines} lines | {r.formula_cells} "
            f"| {r.cells} ({r.index_cells}) "
            f"| {r.build_s:.3f} | {r.floor_s:.3f} | {r.ratio:.2f} | {r.bytes / 1024:.0f} "
            f"| {_fmt(r.evaluator_s, 2)} | {_fmt(r.libreoffice_s, 2)} |"
        )
    return "\n".join(lines)


def verdicts(rows: list[Row]) -> list[tuple[str, bool, str]]:
    small, large = rows[0], rows[-1]
    # Formula cells carry the cost (rendering, cached value, xlsxwriter's formula parsing);
    # text cells written beside them are cheap, so growth is measured in formula cells.
    cell_growth = large.formula_cells / small.formula_cells
    written_growth = large.cells / small.cells
    time_growth = large.build_s / small.build_s
    worst = max(rows, key=lambda r: r.ratio)
    volatile = set().union(*(r.volatile for r in rows))
    return [
        (
            f"build <= {TARGET_RATIO} x floor",
            worst.ratio <= TARGET_RATIO,
            f"worst {worst.ratio:.2f} ({worst.levels} x {worst.lines})",
        ),
        (
            "linear growth (time growth <= 18/16 x formula-cell growth)",
            time_growth <= TARGET_GROWTH * cell_growth,
            f"formula cells x{cell_growth:.1f} (cells written x{written_growth:.1f}), "
            f"build time x{time_growth:.1f}",
        ),
        (
            "largest workbook < 2 MB",
            large.bytes < TARGET_MAX_BYTES,
            f"{large.bytes / 1024 / 1024:.2f} MB",
        ),
        ("no volatile functions", not volatile, ", ".join(sorted(volatile)) or "none found"),
    ]


def report(rows: list[Row]) -> str:
    lines = [table(rows), ""]
    for name, ok, detail in verdicts(rows):
        lines.append(f"- {'PASS' if ok else 'MISS'} {name}: {detail}")
    large = rows[-1]
    lines += [
        "",
        f"The Index sheet (scalars, table-column patterns, packed table rows) is "
        f"{100 * large.index_cells / large.cells:.0f} % of the cells written for the largest "
        "building.",
    ]
    return "\n".join(lines)


def environment(soffice: bool) -> str:
    return (
        f"latbook {__version__}, Python {platform.python_version()}, "
        f"xlsxwriter {xlsxwriter.__version__}, {platform.machine()} {platform.system()}; "
        f"LibreOffice recalc: {'measured' if soffice else 'not measured'}; "
        f"best of {REPEATS} runs (1 run for builds over {LONG_BUILD_S:g} s); "
        f"seed {SEED}."
    )


def write_results(text: str, soffice: bool, path: Path) -> None:
    path.write_text(
        "# Scale benchmark results\n\n"
        "Produced by `python benchmarks/bench.py --write-results`; numbers depend on the "
        "machine, ratios much less. Buildings are invented (tests/helpers/specgen.py): "
        "seismic by site class and wind, ASD, every level with a diaphragm and wall lines "
        "continuous to the base. The floor is bare xlsxwriter replaying exactly the sheets, "
        "formats and cell writes of the build (formula strings with their cached values).\n\n"
        f"{environment(soffice)}\n\n{text}\n",
        encoding="utf-8",
    )


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    parser.add_argument("--profile", action="store_true", help="cProfile the largest build")
    parser.add_argument("--no-libreoffice", action="store_true", help="skip soffice recalc")
    parser.add_argument("--write-results", action="store_true", help="record RESULTS.md")
    args = parser.parse_args(argv)
    soffice = find_soffice() is not None and not args.no_libreoffice
    rows = []
    with tempfile.TemporaryDirectory() as tmp:
        folder = Path(tmp)
        for i, (n_levels, n_lines) in enumerate(SIZES):
            rows.append(measure(n_levels, n_lines, folder, evaluate=i == 0, soffice=soffice))
            print(f"measured {n_levels} levels x {2 * n_lines} lines", file=sys.stderr)
        text = report(rows)
        print(environment(soffice))
        print(text)
        if args.profile:
            print(profile_build(*SIZES[-1], folder))
    if args.write_results:
        write_results(text, soffice, ROOT / "benchmarks" / "RESULTS.md")
    misses = [name for name, ok, _ in verdicts(rows) if not ok]
    return 1 if misses else 0


if __name__ == "__main__":
    raise SystemExit(main())
