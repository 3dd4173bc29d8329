"""The printout is the calc package: each example's LibreOffice PDF at US letter is legible
on every page, prints each sheet on the pages the layout counts, and shows long labels and
the footer's caution in full.

References: LibreOffice Calc (headless PDF export) and poppler's `pdftotext -bbox`, both
independent of latbook; a word's printed height is its box's yMax - yMin. The limits
(no word under 7 pt, a median of 8 pt or more per page) are the project's legibility rule
(common practice for calc packages read on paper).
"""

from __future__ import annotations

import json
import re
import statistics
from collections import Counter
from pathlib import Path

import openpyxl
import pytest

from latbook.build import build_workbook, check_spec
from latbook.recalc import find_soffice
from latbook.workbook.builder import layout, page_counts, plan_pages, printed_values
from latbook.workbook.cautions import FOOTER_REVIEW, caution_line
from latbook.workbook.layout import SheetPlan
from latbook.workbook.print_grid import GRID_COLS
from tests.helpers.printout import page_sheet, print_pdf, read_pages

pytestmark = [
    pytest.mark.libreoffice,
    pytest.mark.skipif(find_soffice() is None, reason="LibreOffice (soffice) is not installed"),
]

EXAMPLES = sorted(Path(__file__).resolve().parents[1].glob("out_examples/*/spec.json"))
MIN_WORD_PT = 7.0
MIN_MEDIAN_PT = 8.0


@pytest.fixture(scope="module", params=[p.parent.name for p in EXAMPLES], ids=str)
def printed(request, tmp_path_factory):
    """(spec, engine results, the PDF's pages) of one example, converted once."""
    data = json.loads(
        (
            Path(__file__).resolve().parents[1] / "out_examples" / request.param / "spec.json"
        ).read_text(encoding="utf-8")
    )
    out = tmp_path_factory.mktemp(request.param)
    build_workbook(data, out / "calc.xlsx")
    spec, results = check_spec(data)
    pages = read_pages(print_pdf(out / "calc.xlsx", out / "pdf"))
    return spec, results, pages, _contents(out / "calc.xlsx")


def _contents(xlsx: Path) -> dict[str, str]:
    """The Cover's table of contents as written: sheet -> its pages ("5" or "5–7")."""
    ws = openpyxl.load_workbook(xlsx, read_only=True)["Cover"]
    rows = [tuple(c.value for c in r[:5]) for r in ws.iter_rows()]
    start = next(i for i, r in enumerate(rows) if r[0] == "Sheet" and r[4] == "Pages")
    return {r[0]: r[4] for r in rows[start + 1 :] if r[0] and r[4]}


def test_every_page_is_legible(printed):
    _, _, pages, _ = printed
    small = []
    for n, page in enumerate(pages, start=1):
        heights = [h for h, _ in page.words]
        assert heights, f"page {n} is empty"
        assert (page.width_pt, page.height_pt) == (792.0, 612.0), n  # letter, landscape
        if min(heights) < MIN_WORD_PT or statistics.median(heights) < MIN_MEDIAN_PT:
            small.append((n, min(heights), statistics.median(heights)))
    assert not small, small[:10]


def test_each_sheet_prints_on_the_pages_the_layout_counts(printed):
    spec, results, pages, _ = printed
    expected = page_counts(spec, results)
    found = Counter(page_sheet(page, list(expected)) for page in pages)
    assert None not in found, "a page without a sheet name in its header"
    assert dict(found) == expected
    assert list(dict.fromkeys(page_sheet(p, list(expected)) for p in pages)) == list(expected)


def test_the_contents_give_each_sheets_printed_pages(printed):
    """The Cover's contents list every printed sheet with the page numbers it prints on
    (the printout numbers its pages on from sheet to sheet; each page's header names its
    sheet), and the footer prints those numbers."""
    spec, results, pages, contents = printed
    names = list(page_counts(spec, results))
    assert list(contents) == names
    for sheet, text in contents.items():
        first, _, last = text.partition("\u2013")
        numbers = range(int(first), int(last or first) + 1)
        assert [page_sheet(pages[n - 1], names) for n in numbers] == [sheet] * len(numbers)
        assert f"Page {numbers[0]} of {len(pages)}" in pages[numbers[0] - 1].text
    assert int(contents["Tables"].split("\u2013")[-1]) == len(pages)


def test_long_labels_and_the_footer_print_in_full(printed):
    """The words of each sheet's longest labels and headers are all on that sheet's pages
    (a clipped cell loses its last words; words are compared split at hyphens, where a
    wrapped line may break); every page carries the footer's caution."""
    spec, _, pages, _ = printed
    plans, _ = layout(spec)
    names = [p.name for p in plans if isinstance(p, SheetPlan)]
    words_by_sheet: dict[str, Counter] = {}
    for page in pages:
        sheet = page_sheet(page, [*names, "Cover", "Tables"])
        words_by_sheet.setdefault(sheet, Counter()).update(_tokens(page.text))
        assert FOOTER_REVIEW in page.text, "footer caution cut"
    for plan in plans:
        if not isinstance(plan, SheetPlan):
            continue
        texts = sorted(
            {c.text for c in plan.cells if c.text and c.style in ("label", "th", "label_key")},
            key=len,
        )[-5:]
        printed_words = words_by_sheet[plan.name]
        for text in texts:
            missing = Counter(_tokens(text)) - printed_words
            assert not missing, (plan.name, text, missing)


def _tokens(text: str) -> list[str]:
    return [t for t in re.split(r"[\s-]+", text) if t]


def test_every_page_of_a_table_prints_that_tables_header_at_the_top(printed):
    """Each printed page that shows data rows of a table chunk carries that chunk's own
    header rows: the longest word of every column heading of the chunk, on a page the chunk
    continues onto in the page's upper half, above its data (pages found by the sheet name
    in their header and their order; rows and column bands of each page from the layout,
    whose page counts the test above compares)."""
    spec, results, pages, _ = printed
    plans, _ = layout(spec, results)
    sheets = [p for p in plans if isinstance(p, SheetPlan)]
    names = [*(p.name for p in sheets), "Cover", "Tables"]
    by_sheet: dict[str, list] = {}
    for page in pages:
        by_sheet.setdefault(page_sheet(page, names), []).append(page)
    values = printed_values(sheets, results)
    checked, missing = 0, []
    for plan in sheets:
        layout_pages = plan_pages(plan, values, caution_line(spec))
        starts = [0, *layout_pages.breaks]
        ends = [*layout_pages.breaks, layout_pages.last_row + 1]
        printed_pages = iter(by_sheet[plan.name])
        for band in range(plan.bands):
            cols = range(band * GRID_COLS, (band + 1) * GRID_COLS)
            for first, end in zip(starts, ends, strict=True):
                page = next(printed_pages)
                for block in plan.blocks:
                    if block.header is None or block.last_row < max(first, block.header[1] + 1):
                        continue
                    if block.header[1] + 1 >= end:
                        continue  # no data row of the block on this page
                    heads = {
                        max(_words(c.text), key=len)
                        for c in plan.cells
                        if c.style == "th"
                        and c.text
                        and c.col in cols
                        and block.header[0] <= c.row <= block.header[1]
                    }
                    continued = block.first_row < first
                    shown = {
                        w
                        for (_, t), box in zip(page.words, page.boxes, strict=True)
                        if not continued or box[1] < page.height_pt / 2
                        for w in _words(t)
                    }
                    checked += continued
                    lost = heads - shown
                    if lost:
                        missing.append((plan.name, band, first, block.first_row, sorted(lost)))
    assert checked > 5  # continuation pages seen
    assert not missing, missing[:5]


def _words(text: str) -> list[str]:
    """Words without the punctuation around them."""
    return [w for t in _tokens(text) if (w := t.strip("()[]{}:;,.'\"")) and w != "="] or [""]
