"""asfound core engine: exact sections of built-up steel members with section loss.

Pure Python (numpy, shapely, pint, reportlab); never imports kivy.
Internal units are N, mm and MPa (N/mm^2); pint is used only at the edges.
"""

__version__ = "0.1.0"

CAUTION = (
    "Results are an aid to a licensed professional engineer and must be reviewed by one. "
    "Defer to local codes and to the owner's procedures. These results are not, by "
    "themselves, a load rating or a posting decision."
)
