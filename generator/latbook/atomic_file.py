"""Write an output file atomically: a temp file beside the target, renamed over it only when
complete, so a failed or interrupted write never leaves a partial file or changes the old one.

Temp files are named `.<target name>.<pid>-<random>.tmp`. A process killed outright (SIGKILL,
power loss) cannot remove its own; the next write of the same target removes those whose
process is gone (and, from earlier versions without a pid in the name, those older than
`STALE_UNKNOWN_S`).
"""

from __future__ import annotations

import contextlib
import os
import re
import tempfile
import time
from collections.abc import Iterator
from pathlib import Path

NAME_PART_MAX = 100
"""Characters of the target's name kept in the temp name (file names are <= 255 bytes)."""
STALE_UNKNOWN_S = 600.0
"""Age after which a temp file of the old naming (no pid) counts as abandoned."""


def temp_prefix(target: Path) -> str:
    return f".{target.name[:NAME_PART_MAX]}."


@contextlib.contextmanager
def atomic_output(target: Path) -> Iterator[Path]:
    """Yield a temp path beside `target`; on a normal exit rename it over `target`, on any
    exception (interrupts included) remove it and re-raise."""
    target = Path(target)
    folder = target.parent
    remove_stale_temps(target)
    fd, name = tempfile.mkstemp(
        prefix=f"{temp_prefix(target)}{os.getpid()}-", suffix=".tmp", dir=folder
    )
    os.close(fd)
    tmp = Path(name)
    try:
        os.chmod(tmp, new_file_mode())  # mkstemp makes 0600; outputs are shared documents
        yield tmp
        os.replace(tmp, target)
    except BaseException:
        tmp.unlink(missing_ok=True)
        raise


def write_text_atomically(target: Path, text: str) -> None:
    """Write UTF-8 `text` to `target` atomically."""
    with atomic_output(target) as tmp:
        tmp.write_text(text, encoding="utf-8")


def new_file_mode() -> int:
    """0666 less the process umask: the mode open() would give a new file."""
    umask = os.umask(0)
    os.umask(umask)
    return 0o666 & ~umask


def remove_stale_temps(target: Path) -> list[Path]:
    """Remove temp files an earlier, killed write of `target` left; return them."""
    prefix = temp_prefix(Path(target))
    ours = re.compile(re.escape(prefix) + r"(\d+)-[A-Za-z0-9_]+\.tmp")
    older = re.compile(re.escape(prefix) + r"[A-Za-z0-9_]{8}\.tmp")
    removed: list[Path] = []
    try:
        candidates = [p for p in Path(target).parent.iterdir() if p.name.startswith(prefix)]
    except OSError:
        return removed
    for path in candidates:
        m = ours.fullmatch(path.name)
        if m is not None:
            stale = not _process_alive(int(m.group(1)))
        else:
            stale = older.fullmatch(path.name) is not None and _age_s(path) > STALE_UNKNOWN_S
        if stale:
            with contextlib.suppress(OSError):
                path.unlink()
                removed.append(path)
    return removed


def _process_alive(pid: int) -> bool:
    if pid == os.getpid():
        return True
    if os.name != "posix":
        return True  # no safe probe: leave it
    try:
        os.kill(pid, 0)
    except ProcessLookupError:
        return False
    except OSError:
        return True  # exists, owned by another user
    return True


def _age_s(path: Path) -> float:
    try:
        return time.time() - path.stat().st_mtime
    except OSError:
        return 0.0
