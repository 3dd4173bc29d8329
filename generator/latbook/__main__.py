"""`python -m latbook` runs the command line."""

from latbook.cli import main

raise SystemExit(main())
