"""The ``asfound`` command line: one subcommand per module.

Each subcommand lives in its own module (``core.cmd_<name>``) with a ``register(sub)``
function that adds its parser and sets ``func`` (called with the parsed arguments and
returning the process exit code). Errors of asfound print one clear line and exit 2.
"""

from __future__ import annotations

import argparse
import importlib
import sys

from core import CAUTION, __version__
from core.errors import AsfoundError

#: subcommand modules, in the order shown by --help
COMMANDS = ("section", "validate", "import", "export", "assess", "report", "trend", "merge")


def build_parser() -> argparse.ArgumentParser:
    parser = argparse.ArgumentParser(
        prog="asfound",
        description="Field inspection of corroded built-up steel members. " + CAUTION,
    )
    parser.add_argument("--version", action="version", version=f"asfound {__version__}")
    sub = parser.add_subparsers(dest="command", metavar="COMMAND")
    for name in COMMANDS:
        try:
            mod = importlib.import_module(f"core.cmd_{name}")
        except ModuleNotFoundError as e:
            if e.name == f"core.cmd_{name}":
                continue  # not built yet
            raise
        mod.register(sub)
    return parser


def main(argv: list[str] | None = None) -> int:
    parser = build_parser()
    args = parser.parse_args(argv)
    if not getattr(args, "func", None):
        parser.print_help()
        return 2
    try:
        return int(args.func(args) or 0)
    except AsfoundError as e:
        print(f"asfound: error: {e}", file=sys.stderr)
        return 2
    except KeyboardInterrupt:
        return 130


if __name__ == "__main__":
    sys.exit(main())
