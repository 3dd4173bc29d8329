"""Measure a workbook's LibreOffice printout: word heights per page (pdftotext -bbox) and
the sheet each page belongs to (its page header names the sheet)."""

from __future__ import annotations

import html
import re
import shutil
import subprocess
from dataclasses import dataclass, field
from pathlib import Path

from latbook.recalc import convert_to_pdf

_PAGE = re.compile(r"<page width=\"([0-9.]+)\" height=\"([0-9.]+)\">(.*?)</page>", re.S)
_WORD = re.compile(
    r'<word xMin="([0-9.]+)" yMin="([0-9.]+)" xMax="([0-9.]+)" yMax="([0-9.]+)">(.*?)</word>'
)


@dataclass
class PrintedPage:
    width_pt: float
    height_pt: float
    words: list[tuple[float, str]] = field(default_factory=list)  # (height pt, text)
    boxes: list[tuple[float, float, float, float]] = field(default_factory=list)

    @property
    def text(self) -> str:
        return " ".join(w for _, w in self.words)


def print_pdf(xlsx: Path, out_dir: Path) -> Path:
    return convert_to_pdf(xlsx, out_dir)


def read_pages(pdf: Path) -> list[PrintedPage]:
    """Every page of `pdf` with its words' heights (yMax - yMin) and boxes."""
    bbox = pdf.with_suffix(".bbox.html")
    subprocess.run(
        [shutil.which("pdftotext") or "pdftotext", "-bbox", str(pdf), str(bbox)],
        check=True,
        timeout=120,
    )
    pages = []
    for w, h, body in _PAGE.findall(bbox.read_text(encoding="utf-8")):
        page = PrintedPage(float(w), float(h))
        for x0, y0, x1, y1, text in _WORD.findall(body):
            page.words.append((float(y1) - float(y0), html.unescape(text)))
            page.boxes.append((float(x0), float(y0), float(x1), float(y1)))
        pages.append(page)
    return pages


def page_sheet(page: PrintedPage, sheet_names: list[str]) -> str | None:
    """The sheet a page belongs to: the sheet name its page header prints at the top
    centre (the highest words of the page)."""
    if not page.words:
        return None
    top = min(b[1] for b in page.boxes)
    header = {t for (_, t), b in zip(page.words, page.boxes, strict=True) if b[1] < top + 4}
    found = [n for n in sheet_names if n in header]
    return found[0] if found else None
