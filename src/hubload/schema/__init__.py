"""The load-case file format, defined once as data (``fileformat.FORMAT``).

The validator (``hubload.casefile.validate``), the reference page in docs/,
``hubload schema`` (JSON Schema) and ``hubload template`` are generated from it.
"""

from hubload.schema.spec import Choice, Field, Table
from hubload.schema.fileformat import FORMAT

__all__ = ["Choice", "Field", "Table", "FORMAT"]
