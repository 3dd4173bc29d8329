"""Print each example's workbook to PDF with LibreOffice and report its legibility: pages,
smallest and median word height (pdftotext -bbox, yMax - yMin) and the share of words
under 7 pt, plus the pages per sheet against the layout's count.

    PYTHONPATH=generator python3 scripts/measure_printout.py [out_examples/NAME ...]
"""

from __future__ import annotations

import json
import statistics
import sys
import tempfile
from collections import Counter
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))

from latbook.build import build_workbook, check_spec  # noqa: E402
from latbook.workbook.builder import page_counts  # noqa: E402
from tests.helpers.printout import page_sheet, print_pdf, read_pages  # noqa: E402


def measure(example: Path) -> None:
    data = json.loads((example / "spec.json").read_text(encoding="utf-8"))
    with tempfile.TemporaryDirectory() as tmp:
        xlsx = Path(tmp) / "calc.xlsx"
        build_workbook(data, xlsx)
        pages = read_pages(print_pdf(xlsx, Path(tmp)))
    heights = [h for page in pages for h, _ in page.words]
    expected = page_counts(*check_spec(data))
    found = Counter(page_sheet(page, list(expected)) for page in pages)
    differ = {k: (v, found.get(k, 0)) for k, v in expected.items() if found.get(k, 0) != v}
    worst = min(statistics.median(h for h, _ in page.words) for page in pages if page.words)
    print(
        f"{example.name}: {len(pages)} pages, min {min(heights):.1f} pt, median "
        f"{statistics.median(heights):.1f} pt (lowest page median {worst:.1f}), "
        f"{100 * sum(h < 7 for h in heights) / len(heights):.2f} % under 7 pt; "
        f"pages per sheet {differ or 'as counted'}"
    )


def main() -> None:
    examples = [Path(a) for a in sys.argv[1:]] or sorted(
        p.parent for p in ROOT.glob("out_examples/*/spec.json")
    )
    for example in examples:
        measure(example)


if __name__ == "__main__":
    main()
