"""Tidefield from a notebook, with Python's standard library only (urllib, json, csv).

Start a run of a stored scenario, wait for it, read its result document and its white-dwarf
mass table as ECSV. Create an API token with the "run" scope on the "API tokens" page first (it acts for you in
your department), then in a notebook cell or a shell:

    TIDEFIELD_URL=http://127.0.0.1:3000 TIDEFIELD_TOKEN=tfk_... \
    TIDEFIELD_SCENARIO=<scenario id> python3 tidefield_example.py

In a notebook, import the functions instead and call them one by one:

    from tidefield_example import Tidefield, parse_ecsv
    tf = Tidefield("http://127.0.0.1:3000", "tfk_...")
    run_id = tf.start_run("<scenario id>", systems=100_000)
    tf.wait(run_id)
    result = tf.result(run_id)
    columns, rows = parse_ecsv(tf.table(run_id, "wd-mass"))

The ECSV text can also go straight to astropy where it is installed:
astropy.table.Table.read(text, format="ascii.ecsv") gives the same columns with units.
"""
import csv
import io
import json
import os
import sys
import time
import urllib.error
import urllib.parse
import urllib.request


class TidefieldError(Exception):
    """An API error: the HTTP status and the server's message (it names the field and the allowed range)."""


class Tidefield:
    def __init__(self, url, token):
        self.url = url.rstrip("/")
        self.token = token

    def _request(self, method, path, body=None, accept="application/json"):
        data = None if body is None else json.dumps(body).encode("utf-8")
        req = urllib.request.Request(self.url + path, data=data, method=method)
        req.add_header("Authorization", "Bearer " + self.token)
        req.add_header("Accept", accept)
        if data is not None:
            req.add_header("Content-Type", "application/json")
        try:
            with urllib.request.urlopen(req, timeout=60) as res:
                return res.read().decode("utf-8")
        except urllib.error.HTTPError as error:
            detail = error.read().decode("utf-8", "replace")
            try:
                detail = json.loads(detail)["error"]["message"]
            except (ValueError, KeyError, TypeError):
                pass
            raise TidefieldError(f"{method} {path}: HTTP {error.code}: {detail}") from None

    def _json(self, method, path, body=None):
        return json.loads(self._request(method, path, body))

    def start_run(self, scenario_id, systems=None, seed=None):
        """Queues a run of a stored scenario; returns the run's id."""
        body = {"scenarioId": scenario_id}
        if systems is not None:
            body["systems"] = systems
        if seed is not None:
            body["seed"] = seed
        return self._json("POST", "/api/runs", body)["id"]

    def wait(self, run_id, timeout_seconds=600, poll_seconds=0.5):
        """Polls the run until it has succeeded (or raises if it failed, was cancelled or took too long)."""
        deadline = time.monotonic() + timeout_seconds
        while True:
            run = self._json("GET", f"/api/runs/{urllib.parse.quote(run_id)}")
            if run["status"] == "succeeded":
                return run
            if run["status"] in ("failed", "cancelled"):
                raise TidefieldError(f"run {run_id} {run['status']}: {run.get('error')}")
            if time.monotonic() > deadline:
                raise TidefieldError(f"run {run_id} still {run['status']} after {timeout_seconds} s")
            time.sleep(poll_seconds)

    def result(self, run_id):
        """The result document: counts, fractions with Monte Carlo errors, histograms, methods."""
        return self._json("GET", f"/api/runs/{urllib.parse.quote(run_id)}/result")

    def tables(self, run_id):
        """The run's exportable tables, each with its columns and units."""
        return self._json("GET", f"/api/runs/{urllib.parse.quote(run_id)}/export")["tables"]

    def table(self, run_id, name, fmt="ecsv"):
        """One table as ECSV (or fmt="votable") text."""
        query = urllib.parse.urlencode({"format": fmt, "table": name})
        return self._request("GET", f"/api/runs/{urllib.parse.quote(run_id)}/export?{query}", accept="*/*")


def parse_ecsv(text):
    """A small ECSV reader for the standard library: the column names, units and types from the
    header's "datatype" list (a YAML block; only the simple "- name:/unit:/datatype:" form that
    Tidefield writes is read here), then the CSV rows typed accordingly.
    Returns (columns, rows): columns is a list of {"name", "unit", "datatype"}, rows a list of lists."""
    lines = text.splitlines()
    if not lines or not lines[0].startswith("# %ECSV"):
        raise ValueError("not an ECSV file (no '# %ECSV' first line)")
    header = [line[2:] for line in lines if line.startswith("# ")]
    body = [line for line in lines if not line.startswith("#")]
    columns, current, in_datatype = [], None, False
    for line in header:
        if line.startswith("datatype:"):
            in_datatype = True
            continue
        if in_datatype and not line.startswith(" "):
            break
        stripped = line.strip()
        if stripped.startswith("- name:"):
            current = {"name": stripped[len("- name:"):].strip(), "unit": None, "datatype": "string"}
            columns.append(current)
        elif current is not None and ":" in stripped:
            key, value = stripped.split(":", 1)
            if key in ("unit", "datatype"):
                current[key] = value.strip().strip('"')
    reader = csv.reader(io.StringIO("\n".join(body)))
    names = next(reader)
    if names != [c["name"] for c in columns]:
        raise ValueError(f"column line {names} does not match the header's columns")
    convert = {"int64": int, "float64": float}
    rows = [[None if cell == "" else convert.get(c["datatype"], str)(cell) for c, cell in zip(columns, row)] for row in reader]
    return columns, rows


def main():
    url = os.environ.get("TIDEFIELD_URL", "http://127.0.0.1:3000")
    token = os.environ["TIDEFIELD_TOKEN"]
    scenario = os.environ["TIDEFIELD_SCENARIO"]
    systems = int(os.environ["TIDEFIELD_SYSTEMS"]) if os.environ.get("TIDEFIELD_SYSTEMS") else None
    tf = Tidefield(url, token)

    run_id = tf.start_run(scenario, systems=systems)
    print(f"queued run {run_id}", file=sys.stderr)
    tf.wait(run_id)
    result = tf.result(run_id)
    fraction = result["fraction"]
    print(f"magnetic fraction {fraction['value']} ± {fraction['se']} ({fraction['k']} of {fraction['n']})", file=sys.stderr)

    columns, rows = parse_ecsv(tf.table(run_id, "wd-mass"))
    by_name = {c["name"]: i for i, c in enumerate(columns)}
    summary = {
        "runId": run_id,
        "fraction": fraction,
        "tables": [t["name"] for t in tf.tables(run_id)],
        "wdMass": {
            "units": {c["name"]: c["unit"] for c in columns},
            "massLo": [r[by_name["mass_lo"]] for r in rows],
            "magnetic": [r[by_name["magnetic"]] for r in rows],
            "nonMagnetic": [r[by_name["non_magnetic"]] for r in rows],
        },
    }
    json.dump(summary, sys.stdout)
    print()


if __name__ == "__main__":
    main()
