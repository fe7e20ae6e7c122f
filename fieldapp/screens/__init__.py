"""The screens of the field app (their layouts are in ``fieldapp/kv``)."""

from kivy.uix.boxlayout import BoxLayout

from fieldapp.drawing import SectionView
from fieldapp.pad import NumPad
from fieldapp.rivetmap import Overview, StretchAxis
from fieldapp.screens.member import MemberScreen
from fieldapp.screens.results import ResultsScreen
from fieldapp.screens.rivets import RivetsScreen
from fieldapp.screens.station import StationScreen
from fieldapp.screens.surveys import SurveysScreen


class Root(BoxLayout):
    """Navigation bar, status line and the screens."""


__all__ = [
    "MemberScreen",
    "NumPad",
    "Overview",
    "ResultsScreen",
    "RivetsScreen",
    "Root",
    "SectionView",
    "StationScreen",
    "StretchAxis",
    "SurveysScreen",
]
