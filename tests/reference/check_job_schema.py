#!/usr/bin/env python3
"""Validate the demo job files against catalog/job.schema.json with the
PyPI library jsonschema (an outside implementation of JSON Schema draft-07):
the schema plankwise generates accepts the jobs plankwise reads, and refuses
a job with an unknown key or a wrong choice."""

import importlib.metadata
import json
import pathlib
import sys
import tomllib

import jsonschema

root = pathlib.Path(__file__).resolve().parents[2]
schema = json.loads((root / "catalog/job.schema.json").read_text())
jsonschema.Draft7Validator.check_schema(schema)
v = jsonschema.Draft7Validator(schema)
n = 0
for name in ["catalog/demo-job.toml", "catalog/demo-job-si.toml"]:
    job = tomllib.loads((root / name).read_text())
    errors = list(v.iter_errors(job))
    if errors:
        sys.exit(f"check_job_schema: {name}: " + "; ".join(e.message for e in errors))
    n += 1
    bad = json.loads(json.dumps(job))
    bad["bay"][0]["mystery"] = 1
    if v.is_valid(bad):
        sys.exit(f"check_job_schema: {name} with an unknown bay key passed")
    bad = json.loads(json.dumps(job))
    bad["bay"][0]["class"] = "Z"
    if v.is_valid(bad):
        sys.exit(f"check_job_schema: {name} with class Z passed")
print(f"check_job_schema: ok: {n} demo jobs valid against catalog/job.schema.json (jsonschema {importlib.metadata.version('jsonschema')}), broken copies refused")
