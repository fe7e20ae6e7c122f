"""``python -m fieldapp``: start the field app."""

import sys

from fieldapp.main import main

sys.exit(main())
