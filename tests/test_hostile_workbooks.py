"""Workbooks built to make a reader hang or crash: `verify` and `read-back` refuse each
quickly with exit 2 and a message, never a traceback. Each runs in its own process with a
generous timeout that is only a hang guard (no timing is asserted).

The attacks follow common practice for archive and parser hardening: a 'zip bomb' (a small
archive that unpacks to hundreds of MB), a count cell that claims a billion parts, a
dimension record claiming the whole sheet, and JSON nested 100,000 deep.
"""

from __future__ import annotations

import os
import random
import re
import subprocess
import sys
import zipfile
from pathlib import Path

import openpyxl
import pytest

from latbook.build import build_workbook
from latbook.exit_codes import EXIT_BAD_INPUT
from latbook.workbook.builder import SPEC_CHUNK, SPEC_SHEET
from latbook.workbook_file import MAX_MEMBER_BYTES
from tests.helpers.specgen import make_spec

ROOT = Path(__file__).resolve().parents[1]


@pytest.fixture(scope="module")
def book(tmp_path_factory) -> Path:
    out = tmp_path_factory.mktemp("hostile") / "calc.xlsx"
    build_workbook(make_spec(random.Random(8), 1, 2, seismic="site_class", wind=True), out)
    return out


def both_commands(
    path: Path, tmp_path: Path, written: bool = False
) -> list[subprocess.CompletedProcess]:
    env = {**os.environ, "PYTHONPATH": os.pathsep.join([str(ROOT / "generator"), str(ROOT)])}
    runs = []
    for args in (["verify", str(path)], ["read-back", str(path), "-o", str(tmp_path / "s.json")]):
        runs.append(
            subprocess.run(
                [sys.executable, "-m", "latbook", *args],
                capture_output=True,
                text=True,
                timeout=120,  # hang guard only
                env=env,
            )
        )
    assert (tmp_path / "s.json").exists() == written
    return runs


def assert_refused(path: Path, tmp_path: Path, words: str) -> None:
    for proc in both_commands(path, tmp_path):
        assert proc.returncode == EXIT_BAD_INPUT, proc.stderr
        assert "Traceback" not in proc.stderr
        assert re.search(words, proc.stderr), proc.stderr


def _edit_spec_sheet(book: Path, out: Path, cells: dict[str, object]) -> Path:
    wb = openpyxl.load_workbook(book)
    ws = wb[SPEC_SHEET]
    for ref, value in cells.items():
        ws[ref] = value
    wb.save(out)
    return out


def test_chunk_count_of_a_billion(book, tmp_path):
    bad = _edit_spec_sheet(book, tmp_path / "count.xlsx", {"B3": 1_000_000_000})
    assert_refused(bad, tmp_path, r"embedded spec is damaged \(it claims 1000000000 parts")


def test_embedded_spec_nested_100000_deep(book, tmp_path):
    text = "[" * 100_000 + "]" * 100_000
    chunks = [text[i : i + SPEC_CHUNK] for i in range(0, len(text), SPEC_CHUNK)]
    cells: dict[str, object] = {"B3": len(chunks)}
    cells.update({f"B{4 + i}": chunk for i, chunk in enumerate(chunks)})
    bad = _edit_spec_sheet(book, tmp_path / "deep.xlsx", cells)
    assert_refused(bad, tmp_path, r"nested more than \d+ deep")


def _rewrite_member(book: Path, out: Path, name: str, new: bytes | None, padding: int = 0) -> Path:
    """A copy of `book` with member `name` replaced (streamed: `padding` spaces are written
    inside its sheetData without holding them in memory)."""
    with zipfile.ZipFile(book) as src, zipfile.ZipFile(out, "w", zipfile.ZIP_DEFLATED) as dst:
        for info in src.infolist():
            data = src.read(info.filename) if new is None or info.filename != name else new
            if info.filename != name or not padding:
                dst.writestr(info.filename, data)
                continue
            head, tail = data.split(b"<sheetData>", 1)
            member = zipfile.ZipInfo(name)
            member.compress_type = zipfile.ZIP_DEFLATED
            with dst.open(member, "w", force_zip64=True) as fh:
                fh.write(head + b"<sheetData>")
                block = b" " * 2**20
                for _ in range(padding // len(block)):
                    fh.write(block)
                fh.write(tail)
    return out


def test_sheet_that_unpacks_past_the_bound(book, tmp_path):
    """~0.5 MB on disk, a sheet of more than MAX_MEMBER_BYTES once unpacked."""
    bad = _rewrite_member(
        book, tmp_path / "bomb.xlsx", "xl/worksheets/sheet1.xml", None, MAX_MEMBER_BYTES + 2**20
    )
    assert bad.stat().st_size < 2 * 2**20
    assert_refused(bad, tmp_path, r"unpacks to more than|compressed \d+:1")


def test_dimension_claiming_the_whole_sheet(book, tmp_path):
    with zipfile.ZipFile(book) as src:
        xml = src.read("xl/worksheets/sheet1.xml")
    xml = re.sub(rb'<dimension ref="[^"]*"/>', b'<dimension ref="A1:XFD1048576"/>', xml)
    bad = _rewrite_member(book, tmp_path / "dim.xlsx", "xl/worksheets/sheet1.xml", xml)
    verify, read_back = both_commands(bad, tmp_path, written=True)  # the dimension is ignored
    assert verify.returncode == 0 and "intact" in verify.stdout, verify.stderr
    assert read_back.returncode == 0, read_back.stderr
