"""Subcommands that read a workbook back: `verify` and `read-back` (parse, call, exit code).

Exit codes as in `latbook.exit_codes`: 0 intact / written; 1 findings; 2 unreadable file,
embedded spec refused, or usage; 3 environment failure (output not writable, LibreOffice
missing or failing).
"""

from __future__ import annotations

import argparse
import json
import sys
from pathlib import Path

from latbook.exit_codes import EXIT_BAD_INPUT, EXIT_ENVIRONMENT, EXIT_FAILED, EXIT_OK


def add_workbook_commands(sub: argparse._SubParsersAction) -> None:
    """Register `verify` and `read-back` on the main parser's subcommands."""
    v = sub.add_parser(
        "verify", help="check an (edited) workbook: formulas intact, inputs valid, results match"
    )
    v.add_argument("workbook", type=Path)
    v.add_argument("--json", action="store_true", help="machine-readable report")
    v.add_argument(
        "--recalc",
        action="store_true",
        help="recalculate a copy in LibreOffice first (needed for files saved by scripts)",
    )
    r = sub.add_parser("read-back", help="write a workbook's current inputs as a spec")
    r.add_argument("workbook", type=Path)
    r.add_argument("-o", "--output", type=Path, required=True, help="the spec .json to write")


def output_error(exc: BaseException) -> str | None:
    """Why an output could not be written, when `exc` is a failure of the environment
    (OSError, or the xlsx writer's wrapper of one); None for anything else."""
    from xlsxwriter.exceptions import XlsxWriterException

    if isinstance(exc, OSError):
        return exc.strerror or str(exc)
    if isinstance(exc, XlsxWriterException):
        inner = exc.args[0] if exc.args else exc
        return output_error(inner) if isinstance(inner, OSError) else str(exc)
    return None


def cmd_verify(args: argparse.Namespace) -> int:
    from latbook.recalc import RecalcError
    from latbook.verify import verify_workbook
    from latbook.workbook_file import UnreadableWorkbook

    try:
        report = verify_workbook(args.workbook, recalc=args.recalc)
    except (UnreadableWorkbook, RecalcError) as exc:
        if args.json:
            print(json.dumps({"path": str(args.workbook), "intact": False, "error": str(exc)}))
        else:
            print(f"latbook verify: {exc}", file=sys.stderr)
        return EXIT_ENVIRONMENT if isinstance(exc, RecalcError) else EXIT_BAD_INPUT
    print(json.dumps(report.as_dict(), indent=2) if args.json else report.text())
    return EXIT_OK if report.intact else EXIT_FAILED


def cmd_read_back(args: argparse.Namespace) -> int:
    from latbook.atomic_file import write_text_atomically
    from latbook.readback import read_back_spec
    from latbook.workbook_file import UnreadableWorkbook, read_workbook

    out: Path = args.output
    try:
        if not out.parent.is_dir():
            print(f"latbook read-back: folder {out.parent} does not exist", file=sys.stderr)
            return EXIT_BAD_INPUT
        if out.is_dir():
            print(f"latbook read-back: {out} is a folder, not a file", file=sys.stderr)
            return EXIT_BAD_INPUT
        try:
            data = read_back_spec(read_workbook(args.workbook))
        except UnreadableWorkbook as exc:
            print(f"latbook read-back: {exc}", file=sys.stderr)
            return EXIT_BAD_INPUT
        text = json.dumps(data, indent=2, ensure_ascii=False) + "\n"
        write_text_atomically(out, text)
    except OSError as exc:
        reason = exc.strerror or str(exc)
        print(f"latbook read-back: cannot write {out}: {reason}; nothing written", file=sys.stderr)
        return EXIT_ENVIRONMENT
    print(f"wrote {out} (the inputs of {args.workbook})")
    return EXIT_OK


WORKBOOK_COMMANDS = {"verify": cmd_verify, "read-back": cmd_read_back}
