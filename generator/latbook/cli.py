"""Command line: parse options, call the library, print problems, set the exit code.

Exit codes: 0 done; 1 the workbook or check failed (verify); 2 bad input or usage.
"""

from __future__ import annotations

import argparse
import json
import sys
from collections.abc import Sequence
from pathlib import Path

from latbook import __version__
from latbook.cli_workbook import WORKBOOK_COMMANDS, add_workbook_commands
from latbook.problems import Problem, SpecError
from latbook.workbook.cautions import CAUTION_SHORT

EXIT_OK, EXIT_FAILED, EXIT_BAD_INPUT = 0, 1, 2


def _parser() -> argparse.ArgumentParser:
    p = argparse.ArgumentParser(
        prog="latbook",
        description="Lateral-force calc workbooks with live formulas from a JSON spec. "
        + CAUTION_SHORT,
    )
    p.add_argument("--version", action="version", version=f"latbook {__version__}")
    sub = p.add_subparsers(dest="command", required=True)

    b = sub.add_parser("build", help="validate a spec and write its workbook")
    b.add_argument("spec", type=Path)
    b.add_argument("-o", "--output", type=Path, required=True, help="the .xlsx to write")
    b.add_argument("--no-protect", action="store_true", help="leave sheets unprotected")

    v = sub.add_parser("validate", help="check a spec and list every problem")
    v.add_argument("spec", type=Path)

    sub.add_parser("schema", help="print the spec's JSON Schema")

    r = sub.add_parser("results", help="the engine's quantities for a spec, by id")
    r.add_argument("spec", type=Path)
    r.add_argument("--json", action="store_true", help="JSON output (default: id = value)")
    add_workbook_commands(sub)
    return p


def main(argv: Sequence[str] | None = None) -> int:
    args = _parser().parse_args(argv)
    try:
        return COMMANDS[args.command](args)
    except SpecError as exc:
        _print_problems(exc.problems)
        return EXIT_BAD_INPUT


def _print_problems(problems: Sequence[Problem]) -> None:
    print(
        f"latbook: the spec has {len(problems)} problem(s); nothing was written:", file=sys.stderr
    )
    for problem in problems:
        print(f"  {problem}", file=sys.stderr)


def _cmd_build(args: argparse.Namespace) -> int:
    from latbook.build import build_workbook
    from latbook.spec.load import load_json

    out: Path = args.output
    if out.suffix.lower() != ".xlsx":
        raise SpecError([Problem("-o", "output", "the output file must end in .xlsx")])
    if not out.parent.exists():
        raise SpecError([Problem("-o", "output", f"folder {out.parent} does not exist")])
    if out.is_dir():
        raise SpecError([Problem("-o", "output", f"{out} is a folder, not a file")])
    data = load_json(args.spec)
    try:
        result = build_workbook(data, out, protect=not args.no_protect)
    except OSError as exc:
        print(f"latbook: cannot write {out}: {exc.strerror or exc}", file=sys.stderr)
        return EXIT_FAILED
    n_calc = len(result.registry.calcs())
    print(f"wrote {out} ({n_calc} calculated cells, spec SHA-256 {result.spec_sha256[:12]})")
    print(f"caution: {CAUTION_SHORT}")
    return EXIT_OK


def _cmd_validate(args: argparse.Namespace) -> int:
    from latbook.spec.load import load_spec

    load_spec(args.spec)
    print(f"{args.spec}: valid")
    return EXIT_OK


def _cmd_schema(args: argparse.Namespace) -> int:
    from latbook.spec.schema import schema_text

    sys.stdout.write(schema_text())
    return EXIT_OK


def _cmd_results(args: argparse.Namespace) -> int:
    from latbook.analysis import compute_results
    from latbook.spec.load import load_spec

    results = compute_results(load_spec(args.spec))
    if args.json:
        print(json.dumps(results, indent=2, sort_keys=True))
    else:
        for key in sorted(results):
            print(f"{key} = {results[key]}")
    return EXIT_OK


COMMANDS = {
    "build": _cmd_build,
    "validate": _cmd_validate,
    "schema": _cmd_schema,
    "results": _cmd_results,
    **WORKBOOK_COMMANDS,
}

if __name__ == "__main__":
    raise SystemExit(main())
