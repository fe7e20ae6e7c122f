"""The app's palette and sizes: dark ink on a light ground, for reading in sunlight.

Constants only (tuples, never changed at run time). Colours are RGBA in 0..1. Every state
shown in colour is also shown by a letter or a shape (the glossary's: see the rivet map and
the flag marks).
"""

from __future__ import annotations

from core.glossary import LEVELS, RIVET_STATES, rgba

PAPER = (0.98, 0.98, 0.96, 1.0)  # screen ground
INK = (0.05, 0.05, 0.07, 1.0)  # text and outlines
MUTED = (0.30, 0.30, 0.34, 1.0)  # secondary text, still dark enough in glare
BUTTON = (0.85, 0.88, 0.91, 1.0)  # button face
BUTTON_DOWN = (1.0, 0.80, 0.10, 1.0)  # pressed or chosen: amber
FIELD = (1.0, 1.0, 1.0, 1.0)  # text fields
RULE = (0.55, 0.56, 0.60, 1.0)  # thin lines, as-built outline
STEEL = (0.18, 0.26, 0.42, 1.0)  # as-found material
CHOSEN = (0.95, 0.55, 0.0, 1.0)  # the selected part
WARN_BG = (1.0, 0.93, 0.70, 1.0)  # behind a warning
ERROR_BG = (1.0, 0.84, 0.84, 1.0)  # behind an error
OK_BG = (0.86, 0.95, 0.86, 1.0)  # behind an acknowledgement
HELD_BG = (1.0, 0.80, 0.55, 1.0)  # behind a held value and its reasons
HELD_YES = (1.0, 0.90, 0.75, 1.0)  # the "store as read" choice

#: flag levels 0..3 (within limits .. needs immediate attention): ground colour, from the
#: glossary like their shapes and words (core.glossary.LEVELS)
LEVEL_BG = tuple(rgba(t.tint) for t in LEVELS)
#: flag levels 0..3: the colour of the level's shape
LEVEL_INK = tuple(rgba(t.colour) for t in LEVELS)

#: rivet states: (letter, colour, shape) from the glossary -- letter and shape as well as colour
RIVET_LOOK = {k: (t.letter, rgba(t.colour), t.shape) for k, t in RIVET_STATES.items()}
#: the font that has the glossary's shapes as glyphs (shipped with kivy)
MARK_FONT = "DejaVuSans"

BODY_SP = 20  # body text, sp
SMALL_SP = 18  # small text, sp
MIN_SP = 16  # a fixed slot shrinks its text down to this size before it would cut it
TITLE_SP = 26
TOUCH_DP = 56  # height of buttons and fields (>= 48 dp)
