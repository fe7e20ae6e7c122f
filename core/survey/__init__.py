"""The survey record: model, readings statistics, validation, field store and file.

Public API::

    from core.survey import (Survey, Member, Station, Reading, FieldStore, Problem,
                             check_document, check_file, load_survey,
                             export_survey, import_survey, region_stats, station_stats)
"""

from core.survey.device import this_device
from core.survey.document import (
    check_file,
    export_document,
    export_survey,
    import_survey,
    is_store_file,
    load_survey,
    read_document,
)
from core.survey.model import (
    FORMAT,
    VERSION,
    Band,
    Member,
    Perforation,
    Quantity,
    Reading,
    RivetLineStates,
    SimpleSpan,
    Station,
    StationLoads,
    Survey,
    SurveyHeader,
)
from core.survey.problems import Problem, errors
from core.survey.readings import RegionStats, region_stats, station_loss, station_stats
from core.survey.store import FieldStore, HistoryEntry, Saved
from core.survey.undo import UndoPlan, UndoRefusedError
from core.survey.validate import check_document, check_survey

__all__ = [
    "FORMAT",
    "VERSION",
    "Band",
    "FieldStore",
    "HistoryEntry",
    "Member",
    "Perforation",
    "Problem",
    "Quantity",
    "Reading",
    "RegionStats",
    "RivetLineStates",
    "Saved",
    "SimpleSpan",
    "Station",
    "StationLoads",
    "Survey",
    "SurveyHeader",
    "UndoPlan",
    "UndoRefusedError",
    "check_document",
    "check_file",
    "check_survey",
    "errors",
    "export_document",
    "export_survey",
    "import_survey",
    "is_store_file",
    "load_survey",
    "read_document",
    "region_stats",
    "station_loss",
    "station_stats",
    "this_device",
]
