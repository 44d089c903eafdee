//! JSON Schema (draft-07) of the job file, generated from the definitions
//! the reader uses — every bay criterion ([`crate::criteria::CRITERIA`]),
//! every kind of load and opening ([`crate::items::ITEMS`]) and the `[job]`
//! keys ([`crate::job::JOB_KEYS`]) — so TOML-aware editors check and
//! complete a job file as it is typed. Each key carries its description,
//! the kind of quantity it takes, its default and its range.

use serde_json::{Value, json};

use crate::criteria::{CRITERIA, Criterion, Form};
use crate::items::{ITEMS, PartForm};

/// The schema of one criterion.
fn criterion(c: &Criterion) -> Value {
    let mut description = format!("{} — {}", c.help, c.allowed());
    if !c.default.is_empty() {
        description.push_str(&format!("; default {}", c.default));
    }
    let mut v = match c.form {
        Form::Quantity { q, range } => json!({
            "type": "string",
            "x-unit-kind": q.name(),
            "x-range": [range.lo, range.hi, range.unit],
        }),
        Form::Number { range } => json!({
            "type": "number", "minimum": range.lo, "maximum": range.hi,
        }),
        Form::Count { lo, hi } => json!({ "type": "integer", "minimum": lo, "maximum": hi }),
        Form::Choice(choices) => json!({ "type": "string", "enum": choices }),
        Form::Flag => json!({ "type": "boolean" }),
        Form::Rating => json!({ "type": ["string", "number"] }),
        Form::QuantityList { q, range } => json!({
            "type": "array",
            "items": { "type": "string" },
            "x-unit-kind": q.name(),
            "x-range": [range.lo, range.hi, range.unit],
        }),
        Form::ChoiceList(choices) => json!({
            "anyOf": [
                { "type": "string", "enum": ["all"] },
                { "type": "array", "items": { "type": "string", "enum": choices } },
            ]
        }),
        Form::Text => json!({ "type": "string" }),
        Form::ChoiceOrQuantity { choices, q, range } => json!({
            "type": "string",
            "x-choices": choices,
            "x-unit-kind": q.name(),
            "x-range": [range.lo, range.hi, range.unit],
        }),
    };
    v["description"] = Value::String(description);
    if !c.default.is_empty() {
        v["default"] = match c.form {
            Form::Number { .. } => c.default.parse::<f64>().map_or(Value::String(c.default.into()), |x| json!(x)),
            Form::Flag => json!(c.default == "true"),
            _ => Value::String(c.default.into()),
        };
    }
    v
}

/// The schema of the bay keys (all criteria for a `[[bay]]`, the inherited
/// ones for `[defaults]`), with the loads and openings for a bay.
fn bay_properties(defaults: bool) -> serde_json::Map<String, Value> {
    let mut p = serde_json::Map::new();
    for c in CRITERIA.iter().filter(|c| !defaults || c.inherit) {
        p.insert(c.key.into(), criterion(c));
    }
    if !defaults {
        for k in ITEMS {
            let mut parts = serde_json::Map::new();
            let mut required = Vec::new();
            for part in k.parts {
                let mut d = json!({ "type": "string", "description": part.help });
                match part.form {
                    PartForm::Quantity(q, r) => {
                        d["x-unit-kind"] = json!(q.name());
                        d["x-range"] = json!([r.lo, r.hi, r.unit]);
                    }
                    PartForm::Along => d["x-unit-kind"] = json!("a length along the member"),
                    PartForm::Kind => d["enum"] = json!(["dead", "live", "roof-live", "snow"]),
                }
                if part.default.is_empty() {
                    required.push(part.key);
                } else {
                    d["default"] = json!(part.default);
                }
                parts.insert(part.key.into(), d);
            }
            p.insert(
                k.key.into(),
                json!({
                    "description": format!("{} (a list; each part a quoted string, e.g. {})", k.help, k.example()),
                    "type": "array",
                    "items": { "type": "object", "additionalProperties": false, "properties": parts, "required": required },
                }),
            );
        }
        p.insert(
            "marked".into(),
            json!({ "description": "entries marked for the shortlist (labels \"section / pattern [+ topping]\"), kept by the UI", "type": "array", "items": { "type": "string" } }),
        );
    }
    p
}

/// The job file's schema.
pub fn job() -> Value {
    let mut meta = serde_json::Map::new();
    for (key, kind, help) in crate::job::JOB_KEYS {
        let t = match *kind {
            "list" => json!({ "type": "array", "items": { "type": "string" } }),
            "boolean" => json!({ "type": "boolean" }),
            "units" => json!({ "type": "string", "enum": ["us", "si"] }),
            _ => json!({ "type": "string" }),
        };
        let mut t = t;
        t["description"] = json!(help);
        meta.insert((*key).into(), t);
    }
    json!({
        "$schema": "http://json-schema.org/draft-07/schema#",
        "$id": "plankwise-job.schema.json",
        "title": "plankwise job file",
        "description": "A project and its bays for plankwise. Every dimensional value is a string with its unit (\"30 ft 6 in\", \"2.4 kPa\"). A preliminary selection only: the supplier's engineer and the engineer of record make the final design.",
        "type": "object",
        "additionalProperties": false,
        "required": ["job", "bay"],
        "properties": {
            "job": { "type": "object", "additionalProperties": false, "required": ["project"], "properties": meta },
            "defaults": {
                "description": "criteria every bay inherits unless it gives its own",
                "type": "object", "additionalProperties": false, "properties": bay_properties(true)
            },
            "bay": {
                "type": "array",
                "items": { "type": "object", "additionalProperties": false, "required": ["name"], "properties": bay_properties(false) }
            }
        }
    })
}
