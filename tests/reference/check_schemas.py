#!/usr/bin/env python3
"""Validate plankwise's files against the JSON Schemas it generates, with
the PyPI library jsonschema (an outside implementation of JSON Schema
draft-07): catalog/job.schema.json accepts the demo jobs and
catalog/catalog.schema.json the demo and test catalogs, and each refuses
broken copies a schema can catch — an unknown key, a wrong type, a value
out of range, a wrong choice."""

import copy
import importlib.metadata
import json
import pathlib
import sys
import tomllib

import jsonschema

root = pathlib.Path(__file__).resolve().parents[2]


def validator(name):
    schema = json.loads((root / "catalog" / name).read_text())
    jsonschema.Draft7Validator.check_schema(schema)
    return jsonschema.Draft7Validator(schema)


def must_pass(v, doc, name):
    errors = list(v.iter_errors(doc))
    if errors:
        sys.exit(f"check_schemas: {name}: " + "; ".join(f"{list(e.path)}: {e.message}" for e in errors))


def must_fail(v, doc, name, what):
    if v.is_valid(doc):
        sys.exit(f"check_schemas: {name} with {what} passed")


jobs = validator("job.schema.json")
n_jobs = 0
for name in ["catalog/demo-job.toml", "catalog/demo-job-si.toml"]:
    job = tomllib.loads((root / name).read_text())
    must_pass(jobs, job, name)
    n_jobs += 1
    bad = copy.deepcopy(job)
    bad["bay"][0]["mystery"] = 1
    must_fail(jobs, bad, name, "an unknown bay key")
    bad = copy.deepcopy(job)
    bad["bay"][0]["class"] = "Z"
    must_fail(jobs, bad, name, "class Z")

catalogs = validator("catalog.schema.json")
n_cats = 0
names = ["catalog/demo-us.toml", "catalog/demo-si.toml"] + sorted(
    str(p.relative_to(root)) for p in (root / "tests/good").glob("*.toml")
)
for name in names:
    cat = tomllib.loads((root / name).read_text())
    must_pass(catalogs, cat, name)
    n_cats += 1
demo = tomllib.loads((root / "catalog/demo-us.toml").read_text())
hc = next(s for s in demo["section"] if "hollow_core" in s)
tee = next(s for s in demo["section"] if "double_tee" in s)
broken = []


def breaking(what, edit):
    doc = copy.deepcopy(demo)
    edit(doc)
    broken.append((what, doc))


breaking("an unknown section key", lambda d: d["section"][0].update(colour="red"))
breaking("an unknown top-level key", lambda d: d.update(plant={"name": "x"}))
breaking("a misspelt core key", lambda d: d["section"][0]["hollow_core"]["cores"].update(diamter="4 in"))
breaking("a number where a quantity string goes", lambda d: d["mix"][0].update(fc=5000))
breaking("a string where a count goes", lambda d: d["section"][0]["hollow_core"]["cores"].update(count="7"))
breaking("a core count out of range", lambda d: d["section"][0]["hollow_core"]["cores"].update(count=0))
breaking("a jacking fraction out of range", lambda d: d["section"][0]["pattern"][0].update(jacking=0.95))
breaking("a strand count out of range", lambda d: d["section"][0]["pattern"][0]["row"][0].update(count=101))
breaking("an unknown aggregate", lambda d: d["mix"][0].update(aggregate="granite"))
breaking("two geometries", lambda d: d["section"][0].update(double_tee=copy.deepcopy(tee["double_tee"])))
breaking("no geometry", lambda d: hc and d["section"][0].pop("hollow_core"))
breaking("a section without patterns", lambda d: d["section"][0].pop("pattern"))
breaking("a point of three values", lambda d: d.update(section=[{"id": "g", "mix": d["mix"][0]["id"], "generic": {"outline": [["0 in", "0 in", "1 in"], ["4 in", "0 in"], ["4 in", "4 in"]]}, "pattern": d["section"][0]["pattern"]}]))
for what, doc in broken:
    must_fail(catalogs, doc, "catalog/demo-us.toml", what)

print(
    f"check_schemas: ok: {n_jobs} demo jobs and {n_cats} catalogs valid against catalog/job.schema.json and "
    f"catalog/catalog.schema.json (jsonschema {importlib.metadata.version('jsonschema')}); "
    f"{2 * n_jobs + len(broken)} broken copies refused"
)
