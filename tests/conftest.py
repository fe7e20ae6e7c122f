"""Settings for the whole suite: asfound's per-user data folder (where the device id is
kept) goes to a temporary folder, so tests never write into the user's home."""

from __future__ import annotations

import os
import tempfile

os.environ.setdefault("ASFOUND_DATA_DIR", tempfile.mkdtemp(prefix="asfound-data-"))
