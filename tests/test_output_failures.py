"""When the environment fails or the user stops a command: a clean message, the exit code
the README gives (3 environment, 130 Ctrl-C, 143 SIGTERM), no partial or temp file left, an
existing output untouched. Signals and file-size limits are real (POSIX `setrlimit`,
`kill`) in a child process; the subprocess timeouts are only hang guards.
"""

from __future__ import annotations

import json
import os
import random
import re
import signal
import subprocess
import sys
import time
from pathlib import Path

import pytest
import xlsxwriter.exceptions
import xlsxwriter.workbook

from latbook.atomic_file import remove_stale_temps
from latbook.build import build_workbook
from latbook.cli import main
from latbook.exit_codes import (
    EXIT_BAD_INPUT,
    EXIT_ENVIRONMENT,
    EXIT_FAILED,
    EXIT_INTERRUPTED,
    EXIT_OK,
    EXIT_TERMINATED,
)
from tests.helpers.specgen import make_spec

ROOT = Path(__file__).resolve().parents[1]
SENTINEL = b"an existing output that must survive\n"
posix_only = pytest.mark.skipif(os.name != "posix", reason="POSIX signals and rlimits")


def spec_file(folder: Path, levels: int = 1, lines: int = 2) -> Path:
    path = folder / "spec.json"
    spec = make_spec(random.Random(8), levels, lines, seismic="site_class", wind=True)
    path.write_text(json.dumps(spec), encoding="utf-8")
    return path


def temps(folder: Path) -> list[str]:
    return sorted(p.name for p in folder.iterdir() if p.name.endswith(".tmp"))


def _child_env() -> dict[str, str]:
    return {**os.environ, "PYTHONPATH": os.pathsep.join([str(ROOT / "generator"), str(ROOT)])}


# --- environment failures: exit 3 -----------------------------------------------------------


def test_output_name_longer_than_the_file_system_allows(tmp_path, capsys):
    out = tmp_path / ("n" * 300 + ".xlsx")
    rc = main(["build", str(spec_file(tmp_path)), "-o", str(out)])
    err = capsys.readouterr().err
    assert rc == EXIT_ENVIRONMENT
    assert "cannot write" in err and "File name too long" in err and "Traceback" not in err
    assert sorted(os.listdir(tmp_path)) == ["spec.json"]


@posix_only
def test_file_size_limit_hit_while_writing(tmp_path):
    """A real partial write: the process may write at most 20 kB (RLIMIT_FSIZE)."""
    import resource

    spec = spec_file(tmp_path)
    out = tmp_path / "calc.xlsx"
    out.write_bytes(SENTINEL)

    def limit():
        resource.setrlimit(resource.RLIMIT_FSIZE, (20_000, 20_000))

    proc = subprocess.run(
        [sys.executable, "-m", "latbook", "build", str(spec), "-o", str(out)],
        capture_output=True,
        text=True,
        timeout=300,
        preexec_fn=limit,
        env=_child_env(),
    )
    assert proc.returncode == EXIT_ENVIRONMENT, proc.stderr
    assert "cannot write" in proc.stderr and "Traceback" not in proc.stderr
    assert out.read_bytes() == SENTINEL
    assert sorted(os.listdir(tmp_path)) == ["calc.xlsx", "spec.json"]


def test_writer_failing_partway_is_an_environment_failure(tmp_path, monkeypatch, capsys):
    def fail(self):
        Path(self.filename).write_bytes(b"PK\x03\x04 part of a zip")
        raise xlsxwriter.exceptions.FileCreateError(OSError(28, "No space left on device"))

    monkeypatch.setattr(xlsxwriter.workbook.Workbook, "close", fail)
    out = tmp_path / "calc.xlsx"
    out.write_bytes(SENTINEL)
    rc = main(["build", str(spec_file(tmp_path)), "-o", str(out)])
    err = capsys.readouterr().err
    assert rc == EXIT_ENVIRONMENT
    assert "No space left on device" in err and "Traceback" not in err
    assert out.read_bytes() == SENTINEL and temps(tmp_path) == []


@pytest.fixture(scope="module")
def book(tmp_path_factory) -> Path:
    out = tmp_path_factory.mktemp("book") / "calc.xlsx"
    build_workbook(make_spec(random.Random(8), 1, 2, seismic="site_class", wind=True), out)
    return out


def test_read_back_into_an_existing_folder_is_refused(book, tmp_path, capsys):
    (tmp_path / "spec.json").mkdir()
    rc = main(["read-back", str(book), "-o", str(tmp_path / "spec.json")])
    err = capsys.readouterr().err
    assert rc == EXIT_BAD_INPUT and "is a folder" in err and "Traceback" not in err


def test_read_back_that_cannot_write_is_an_environment_failure(book, tmp_path, monkeypatch, capsys):
    """Unwritable folder (permission denied on creating the temp file)."""

    def denied(*args, **kwargs):
        raise PermissionError(13, "Permission denied")

    monkeypatch.setattr("tempfile.mkstemp", denied)
    rc = main(["read-back", str(book), "-o", str(tmp_path / "spec.json")])
    err = capsys.readouterr().err
    assert rc == EXIT_ENVIRONMENT and "Permission denied" in err and "Traceback" not in err
    assert os.listdir(tmp_path) == []


@pytest.mark.skipif(os.name != "posix" or os.geteuid() == 0, reason="root ignores modes")
def test_read_back_into_a_read_only_folder(book, tmp_path, capsys):
    folder = tmp_path / "ro"
    folder.mkdir()
    folder.chmod(0o500)
    try:
        rc = main(["read-back", str(book), "-o", str(folder / "spec.json")])
    finally:
        folder.chmod(0o700)
    assert rc == EXIT_ENVIRONMENT and "Traceback" not in capsys.readouterr().err


def test_read_back_failing_partway_leaves_the_old_spec(book, tmp_path, monkeypatch, capsys):
    target = tmp_path / "spec.json"
    target.write_bytes(SENTINEL)
    real = Path.write_text

    def half(self, text, *args, **kwargs):
        real(self, text[: len(text) // 2], *args, **kwargs)
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(Path, "write_text", half)
    rc = main(["read-back", str(book), "-o", str(target)])
    err = capsys.readouterr().err
    assert rc == EXIT_ENVIRONMENT and "No space left" in err
    assert target.read_bytes() == SENTINEL and temps(tmp_path) == []


# --- signals ---------------------------------------------------------------------------------


def _start_build(folder: Path) -> tuple[subprocess.Popen, Path]:
    spec = spec_file(folder, levels=4, lines=6)  # a few seconds of work
    out = folder / "calc.xlsx"
    out.write_bytes(SENTINEL)
    proc = subprocess.Popen(
        [sys.executable, "-m", "latbook", "build", str(spec), "-o", str(out)],
        stdout=subprocess.PIPE,
        stderr=subprocess.PIPE,
        text=True,
        env=_child_env(),
    )
    return proc, out


def _wait_for_temp(proc: subprocess.Popen, folder: Path) -> bool:
    """True once the build's temp file exists (the write has begun); False if it ended."""
    deadline = time.monotonic() + 120  # hang guard only
    while time.monotonic() < deadline:
        if temps(folder):
            return True
        if proc.poll() is not None:
            return False
        time.sleep(0.005)
    return False


@posix_only
@pytest.mark.parametrize(
    ("sig", "code", "word"),
    [
        (signal.SIGTERM, EXIT_TERMINATED, "terminated"),
        (signal.SIGINT, EXIT_INTERRUPTED, "interrupted"),
    ],
    ids=["SIGTERM", "SIGINT"],
)
def test_signal_during_write_cleans_up_and_exits_quietly(sig, code, word, tmp_path):
    proc, out = _start_build(tmp_path)
    assert _wait_for_temp(proc, tmp_path), "the build ended before its temp file was seen"
    proc.send_signal(sig)
    _, err = proc.communicate(timeout=120)
    assert proc.returncode == code, err
    assert word in err and "Traceback" not in err and "KeyboardInterrupt" not in err
    assert out.read_bytes() == SENTINEL
    assert temps(tmp_path) == []


@posix_only
def test_temp_file_of_a_killed_build_is_removed_by_the_next(tmp_path):
    proc, out = _start_build(tmp_path)
    assert _wait_for_temp(proc, tmp_path)
    proc.kill()  # SIGKILL: nothing can clean up
    proc.communicate(timeout=120)
    left = temps(tmp_path)
    assert len(left) == 1 and re.fullmatch(r"\.calc\.xlsx\.\d+-\w+\.tmp", left[0])
    assert out.read_bytes() == SENTINEL
    rc = main(["build", str(tmp_path / "spec.json"), "-o", str(out)])
    assert rc == EXIT_OK
    assert temps(tmp_path) == []


def test_only_temp_files_of_gone_processes_are_removed(tmp_path):
    target = tmp_path / "calc.xlsx"
    dead = tmp_path / ".calc.xlsx.999999999-abc12345.tmp"  # above any Linux pid_max
    live = tmp_path / f".calc.xlsx.{os.getpid()}-abc12345.tmp"
    old_style = tmp_path / ".calc.xlsx.k3j4h5g6.tmp"
    fresh_old_style = tmp_path / ".calc.xlsx.a1b2c3d4.tmp"
    other_target = tmp_path / ".other.xlsx.999999999-abc12345.tmp"
    for p in (dead, live, old_style, fresh_old_style, other_target):
        p.write_bytes(b"x")
    hour_ago = time.time() - 3600
    os.utime(old_style, (hour_ago, hour_ago))
    removed = remove_stale_temps(target)
    assert sorted(p.name for p in removed) == sorted([dead.name, old_style.name])
    assert sorted(temps(tmp_path)) == sorted([live.name, fresh_old_style.name, other_target.name])


# --- the README states the codes ------------------------------------------------------------


def test_readme_states_every_exit_code():
    readme = (ROOT / "README.md").read_text(encoding="utf-8")
    stated = re.search(r"Exit codes:(.*?)\n\n", readme, re.S)
    assert stated, "README has no 'Exit codes:' paragraph"
    text = stated.group(1)
    for code in (
        EXIT_OK,
        EXIT_FAILED,
        EXIT_BAD_INPUT,
        EXIT_ENVIRONMENT,
        EXIT_INTERRUPTED,
        EXIT_TERMINATED,
    ):
        assert re.search(rf"\b{code}\b", text), code
