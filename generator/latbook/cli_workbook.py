"""Subcommands that read a workbook back: `verify` and `read-back` (parse, call, exit code).

Exit codes as in `latbook.cli`: 0 intact / written; 1 findings; 2 unreadable file or usage.
"""

from __future__ import annotations

import argparse
import json
import sys
from pathlib import Path

EXIT_OK, EXIT_FAILED, EXIT_BAD_INPUT = 0, 1, 2


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
        return EXIT_BAD_INPUT
    print(json.dumps(report.as_dict(), indent=2) if args.json else report.text())
    return EXIT_OK if report.intact else EXIT_FAILED


def cmd_read_back(args: argparse.Namespace) -> int:
    from latbook.readback import read_back_spec
    from latbook.workbook_file import UnreadableWorkbook, read_workbook

    out: Path = args.output
    if not out.parent.exists():
        print(f"latbook read-back: folder {out.parent} does not exist", file=sys.stderr)
        return EXIT_BAD_INPUT
    try:
        data = read_back_spec(read_workbook(args.workbook))
    except UnreadableWorkbook as exc:
        print(f"latbook read-back: {exc}", file=sys.stderr)
        return EXIT_BAD_INPUT
    out.write_text(json.dumps(data, indent=2, ensure_ascii=False) + "\n", encoding="utf-8")
    print(f"wrote {out} (the inputs of {args.workbook})")
    return EXIT_OK


WORKBOOK_COMMANDS = {"verify": cmd_verify, "read-back": cmd_read_back}
