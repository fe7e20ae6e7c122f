"""Settings for the whole suite: asfound's per-user data folder (where the device id is
kept) goes to a temporary folder, so tests never write into the user's home."""

from __future__ import annotations

import os
import tempfile

os.environ.setdefault("ASFOUND_DATA_DIR", tempfile.mkdtemp(prefix="asfound-data-"))

from hypothesis import settings

# The suite that gates a landing draws the same examples on every run (a failure found once
# is found again on the next run of the same code) and has no per-example deadline (the
# machine is shared; speed is measured in benchmarks/, never in tests). Set
# HYPOTHESIS_PROFILE=explore to draw new random examples when hunting (and more of them where
# a test does not set its own count).
settings.register_profile("gate", derandomize=True, deadline=None, print_blob=True)
settings.register_profile("explore", deadline=None, print_blob=True, max_examples=1000)
settings.load_profile(os.environ.get("HYPOTHESIS_PROFILE", "gate"))
