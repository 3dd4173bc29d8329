"""Recalculate a workbook with LibreOffice headless and read back its stored values.

LibreOffice keeps the cached values of an .xlsx on load unless its profile says otherwise,
so every call here runs soffice with a private, throw-away profile whose
registrymodifications.xcu sets Calc's OOXML recalc mode to "always". The private profile
also lets two processes convert at the same time without sharing one LibreOffice instance.
The source file is copied first and never touched.
"""

from __future__ import annotations

import contextlib
import os
import re
import shutil
import signal
import subprocess
import tempfile
from pathlib import Path

import openpyxl

__all__ = [
    "RecalcError",
    "convert_to_pdf",
    "find_soffice",
    "pdf_page_count",
    "read_cell_values",
    "read_defined_name_values",
    "recalculate_with_libreoffice",
]

# Calc option /org.openoffice.Office.Calc/Formula/Load OOXMLRecalcMode:
# 0 = always recalculate, 1 = never, 2 = ask (a headless run cannot answer, so it keeps values).
_ALWAYS_RECALC_PROFILE_XCU = """<?xml version="1.0" encoding="UTF-8"?>
<oor:items xmlns:oor="http://openoffice.org/2001/registry"
 xmlns:xs="http://www.w3.org/2001/XMLSchema"
 xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance">
<item oor:path="/org.openoffice.Office.Calc/Formula/Load">\
<prop oor:name="OOXMLRecalcMode" oor:op="fuse"><value>0</value></prop></item>
<item oor:path="/org.openoffice.Office.Calc/Formula/Load">\
<prop oor:name="ODFRecalcMode" oor:op="fuse"><value>0</value></prop></item>
</oor:items>
"""

_SOFFICE_NAMES = ("soffice", "libreoffice")
_SOFFICE_FALLBACK_PATHS = (
    "/usr/bin/soffice",
    "/usr/lib/libreoffice/program/soffice",
    "/opt/libreoffice/program/soffice",
    "/Applications/LibreOffice.app/Contents/MacOS/soffice",
)


class RecalcError(RuntimeError):
    """LibreOffice is missing, timed out, or produced no output file."""


def find_soffice() -> str | None:
    """Path of the LibreOffice ``soffice`` executable, or None when it is not installed.

    The environment variable LATBOOK_SOFFICE, when set, names the executable to use.
    """
    override = os.environ.get("LATBOOK_SOFFICE")
    if override:
        return override if Path(override).is_file() else None
    for name in _SOFFICE_NAMES:
        found = shutil.which(name)
        if found:
            return found
    for candidate in _SOFFICE_FALLBACK_PATHS:
        if Path(candidate).is_file():
            return candidate
    return None


def recalculate_with_libreoffice(src: Path, out_dir: Path, timeout_s: float = 180) -> Path:
    """Open ``src`` in LibreOffice, recalculate every formula, save as .xlsx in ``out_dir``.

    Returns the path of the recalculated copy (``out_dir / src.name``). ``src`` is never
    modified; ``out_dir`` must therefore not be the folder that holds ``src``.
    """
    return _convert(Path(src), Path(out_dir), "xlsx", timeout_s)


def convert_to_pdf(src: Path, out_dir: Path, timeout_s: float = 180) -> Path:
    """Recalculate ``src`` in LibreOffice and print it to ``out_dir / (src.stem + '.pdf')``."""
    return _convert(Path(src), Path(out_dir), "pdf", timeout_s)


def read_cell_values(path: Path, refs: list[tuple[str, str]]) -> dict[tuple[str, str], object]:
    """Stored (cached) values of the given (sheet name, cell such as "C5" or "$C$5") pairs.

    Keys of the result are the refs exactly as passed in.
    """
    workbook = openpyxl.load_workbook(Path(path), data_only=True)
    try:
        values: dict[tuple[str, str], object] = {}
        for sheet_name, cell_ref in refs:
            if sheet_name not in workbook.sheetnames:
                raise KeyError(f"sheet {sheet_name!r} not in {Path(path).name}")
            values[(sheet_name, cell_ref)] = workbook[sheet_name][cell_ref.replace("$", "")].value
        return values
    finally:
        workbook.close()


def read_defined_name_values(path: Path) -> dict[str, object]:
    """Stored value of every workbook-scope defined name that points at one single cell.

    Names that point at ranges, hold constants or formulas, or are sheet-scoped are left out.
    """
    workbook = openpyxl.load_workbook(Path(path), data_only=True)
    try:
        values: dict[str, object] = {}
        for name, defined_name in workbook.defined_names.items():
            if defined_name.type != "RANGE" or name.startswith("_xlnm."):
                continue
            destinations = list(defined_name.destinations)
            if len(destinations) != 1:
                continue
            sheet_name, cell_ref = destinations[0]
            # openpyxl strips the outer quotes of 'It''s'!$A$1 but leaves the doubled quote.
            sheet_name = sheet_name.replace("''", "'")
            if ":" in cell_ref or sheet_name not in workbook.sheetnames:
                continue
            values[name] = workbook[sheet_name][cell_ref.replace("$", "")].value
        return values
    finally:
        workbook.close()


def pdf_page_count(pdf: Path) -> int:
    """Number of pages in ``pdf``: from poppler's ``pdfinfo`` if installed, else by counting
    ``/Type /Page`` objects (not ``/Pages``) in the file (enough for LibreOffice's PDFs)."""
    pdf = Path(pdf)
    pdfinfo = shutil.which("pdfinfo")
    if pdfinfo:
        result = subprocess.run(
            [pdfinfo, str(pdf)], capture_output=True, text=True, timeout=60, check=False
        )
        match = re.search(r"^Pages:\s+(\d+)", result.stdout, flags=re.MULTILINE)
        if result.returncode == 0 and match:
            return int(match.group(1))
    return len(re.findall(rb"/Type\s*/Page\b", pdf.read_bytes()))


def _convert(src: Path, out_dir: Path, target_ext: str, timeout_s: float) -> Path:
    if not src.is_file():
        raise FileNotFoundError(src)
    final_path = out_dir / f"{src.stem}.{target_ext}"
    if final_path.resolve() == src.resolve():
        raise ValueError(f"out_dir {out_dir} holds {src.name}; converting there would overwrite it")
    soffice = find_soffice()
    if soffice is None:
        raise RecalcError("LibreOffice (soffice) not found: install libreoffice-calc-nogui")
    out_dir.mkdir(parents=True, exist_ok=True)

    with tempfile.TemporaryDirectory(prefix="latbook-soffice-") as scratch_name:
        scratch = Path(scratch_name)
        profile_dir, in_dir, convert_dir = scratch / "profile", scratch / "in", scratch / "out"
        (profile_dir / "user").mkdir(parents=True)
        (profile_dir / "user" / "registrymodifications.xcu").write_text(
            _ALWAYS_RECALC_PROFILE_XCU, encoding="utf-8"
        )
        in_dir.mkdir()
        src_copy = in_dir / src.name
        shutil.copyfile(src, src_copy)

        command = [
            soffice,
            f"-env:UserInstallation={profile_dir.as_uri()}",
            "--headless",
            "--norestore",
            "--nologo",
            "--nodefault",
            "--convert-to",
            target_ext,
            "--outdir",
            str(convert_dir),
            str(src_copy),
        ]
        stdout, stderr = _run_in_own_process_group(command, timeout_s)
        produced = convert_dir / f"{src.stem}.{target_ext}"
        if not produced.is_file():
            raise RecalcError(
                f"LibreOffice produced no {target_ext} for {src.name}.\n"
                f"command: {' '.join(command)}\nstdout: {stdout.strip()}\nstderr: {stderr.strip()}"
            )
        shutil.move(produced, final_path)
    return final_path


def _run_in_own_process_group(command: list[str], timeout_s: float) -> tuple[str, str]:
    """Run ``command``; on timeout kill the whole process group it started, then raise."""
    process = subprocess.Popen(
        command,
        stdout=subprocess.PIPE,
        stderr=subprocess.PIPE,
        stdin=subprocess.DEVNULL,
        text=True,
        start_new_session=True,
    )
    try:
        stdout, stderr = process.communicate(timeout=timeout_s)
    except subprocess.TimeoutExpired as exc:
        with contextlib.suppress(ProcessLookupError):
            os.killpg(process.pid, signal.SIGKILL)
        process.communicate()
        raise RecalcError(
            f"LibreOffice did not finish within {timeout_s:g} s: {' '.join(command)}"
        ) from exc
    return stdout, stderr
