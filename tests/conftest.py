"""Shared pytest fixtures. Each fixture group lives in its own section below."""

from __future__ import annotations

import os

import pytest

from latbook.recalc import find_soffice
from tests.helpers import evaluator


def pytest_configure(config: pytest.Config) -> None:
    config.addinivalue_line(
        "markers", "libreoffice: recomputes a workbook with LibreOffice headless (soffice)"
    )


# --- Real spreadsheet engines (LibreOffice) ---------------------------------------------

SOFFICE_MISSING_REASON = "LibreOffice (soffice) not installed: real-engine tests skipped"


@pytest.fixture(scope="session")
def soffice() -> str:
    """Path of soffice. Skips when it is missing, except on CI (CI=true), where it fails."""
    path = find_soffice()
    if path is None:
        if os.environ.get("CI") == "true":
            pytest.fail(f"{SOFFICE_MISSING_REASON} -- CI must run them")
        pytest.skip(SOFFICE_MISSING_REASON)
    return path


# --- The `formulas` package's results, once per workbook and test run --------------------


@pytest.fixture(scope="session", autouse=True)
def formulas_results_cache(tmp_path_factory: pytest.TempPathFactory):
    """A folder shared by every worker of this run (pytest-xdist workers' temp folders sit in
    the run's folder), where tests/helpers/evaluator.py keeps each workbook's results."""
    base = tmp_path_factory.getbasetemp()
    run_folder = base.parent if os.environ.get("PYTEST_XDIST_WORKER") else base
    evaluator.use_cache(run_folder / "formulas-results")
    yield
    evaluator.use_cache(None)
