"""Reads a table file with astropy (the general astronomy table library) and prints what it
found as JSON: per column its unit as astropy understood it and its values; the table meta.

usage: read-table.py FILE ecsv|votable
"""
import json
import sys
import warnings

from astropy.table import Table

path, kind = sys.argv[1], sys.argv[2]
with warnings.catch_warnings():
    # VOUnit lists "G" (and so "MG") as deprecated though valid; astropy warns and keeps the unit.
    warnings.simplefilter("ignore")
    table = Table.read(path, format="ascii.ecsv" if kind == "ecsv" else "votable")


def plain(value):
    if hasattr(value, "tolist"):
        value = value.tolist()
    if isinstance(value, float) and value != value:
        return None
    return value


columns = {}
for name in table.colnames:
    column = table[name]
    columns[name] = {
        "unit": None if column.unit is None else column.unit.to_string(),
        "physical_type": None if column.unit is None else str(column.unit.physical_type),
        "dtype": str(column.dtype),
        "values": [plain(v) for v in column.tolist()],
    }
print(json.dumps({"rows": len(table), "columns": columns, "meta": {k: (v if isinstance(v, (str, int, float, list, dict)) else str(v)) for k, v in table.meta.items()}}, default=str))
