//! JSON Schemas (draft-07) of the catalog file, generated from its key
//! table ([`crate::catalog::keys`]), and of the job file, generated from the definitions
//! the reader uses — every bay criterion ([`crate::criteria::CRITERIA`]),
//! every kind of load and opening ([`crate::items::ITEMS`]) and the `[job]`
//! keys ([`crate::job::JOB_KEYS`]) — so TOML-aware editors check and
//! complete a job file as it is typed. Each key carries its description,
//! the kind of quantity it takes, its default and its range.

use serde_json::{Value, json};

use crate::catalog::keys;
use crate::criteria::{CRITERIA, Criterion, Form};
use crate::items::{ITEMS, PartForm};
use crate::units::trim_number;

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

/// The schema of one catalog key's value.
fn catalog_value(k: &keys::Key) -> Value {
    use keys::Value as V;
    let mut described = String::from(k.help);
    let mut v = match k.value {
        V::Quantity {
            kind,
            units,
            also,
            range,
            positive,
        } => {
            described.push_str(&format!(" — {kind} with its unit"));
            let mut v = json!({ "type": "string", "x-unit-kind": kind, "x-units": spellings(units, also) });
            if let Some(r) = range {
                described.push_str(&format!(
                    ", plausible {} to {} {}",
                    trim_number(r.lo, 6),
                    trim_number(r.hi, 6),
                    r.unit
                ));
                v["x-range"] = json!([r.lo, r.hi, r.unit]);
            } else if positive {
                described.push_str(", greater than zero");
            }
            v
        }
        V::Count(lo, hi) => {
            described.push_str(&format!(" — a whole number from {lo} to {hi}"));
            json!({ "type": "integer", "minimum": lo, "maximum": hi })
        }
        V::Number(r) => {
            described.push_str(&format!(" — a number from {} to {}", trim_number(r.lo, 6), trim_number(r.hi, 6)));
            json!({ "type": "number", "minimum": r.lo, "maximum": r.hi })
        }
        V::Choice(c) => {
            described.push_str(&format!(" — one of: {}", c.join(", ")));
            json!({ "type": "string", "enum": c })
        }
        V::ChoiceOrQuantity {
            choices,
            kind,
            units,
            range,
        } => {
            described.push_str(&format!(
                " — one of: {}; or {kind} with its unit, plausible {} to {} {}",
                choices.join(", "),
                trim_number(range.lo, 6),
                trim_number(range.hi, 6),
                range.unit
            ));
            json!({
                "type": "string",
                "x-choices": choices,
                "x-unit-kind": kind,
                "x-units": spellings(units, &[]),
                "x-range": [range.lo, range.hi, range.unit],
            })
        }
        V::Text => json!({ "type": "string" }),
        V::TextList => json!({ "type": "array", "items": { "type": "string" } }),
        V::LengthList => {
            described.push_str(" — lengths with their units");
            json!({ "type": "array", "items": { "type": "string" }, "x-unit-kind": <crate::units::LengthK as crate::units::Kind>::NAME })
        }
        V::Point => {
            described.push_str(" — two lengths with their units");
            point()
        }
        V::Points(n) => {
            described.push_str(&format!(" — at least {n} points, each two lengths with their units"));
            json!({ "type": "array", "minItems": n, "items": point() })
        }
        V::Table(t) => catalog_table(t),
        V::Tables(t) => json!({ "type": "array", "items": catalog_table(t) }),
    };
    if !k.default.is_empty() {
        described.push_str(&format!("; default {}", k.default));
        // a default a user would write as a value of the key
        let literal = match k.value {
            V::Number(_) => k.default.parse::<f64>().ok().map(|x| json!(x)),
            V::Count(..) => k.default.parse::<i64>().ok().map(|x| json!(x)),
            V::Choice(c) | V::ChoiceOrQuantity { choices: c, .. } => c.contains(&k.default).then(|| json!(k.default)),
            // "28500 ksi" is a value; "mid-depth" or "the section's" is not
            V::Quantity { units, .. } => {
                let mut words = k.default.split_whitespace();
                let number = words.next().is_some_and(|w| w.parse::<f64>().is_ok());
                let unit = words.next().is_some_and(|w| units.iter().any(|u| u.0.eq_ignore_ascii_case(w)));
                (number && unit).then(|| json!(k.default))
            }
            _ => None,
        };
        if let Some(d) = literal {
            v["default"] = d;
        }
    }
    v["description"] = Value::String(described);
    v
}

/// The unit spellings a quantity key accepts.
fn spellings(units: &'static [(&'static str, f64)], also: &'static [(&'static str, f64)]) -> Vec<&'static str> {
    let mut s: Vec<&'static str> = Vec::new();
    for u in units.iter().chain(also) {
        if !s.contains(&u.0) {
            s.push(u.0);
        }
    }
    s
}

/// A point: two length strings.
fn point() -> Value {
    json!({ "type": "array", "minItems": 2, "maxItems": 2, "items": { "type": "string" }, "x-unit-kind": <crate::units::LengthK as crate::units::Kind>::NAME })
}

/// The schema of one catalog table.
fn catalog_table(t: &keys::Table) -> Value {
    let mut props = serde_json::Map::new();
    for k in t.keys {
        props.insert(k.name.into(), catalog_value(k));
    }
    let required: Vec<&str> = t.keys.iter().filter(|k| k.required).map(|k| k.name).collect();
    let mut v = json!({
        "description": t.help,
        "type": "object",
        "additionalProperties": false,
        "properties": props,
        "required": required,
    });
    if !t.exactly_one.is_empty() {
        v["oneOf"] = t.exactly_one.iter().map(|k| json!({ "required": [k] })).collect();
    }
    v
}

/// The catalog file's schema, generated from [`keys`] (the definitions
/// the catalog reader takes its names and ranges from).
pub fn catalog() -> Value {
    let mut v = catalog_table(&keys::FILE);
    let body = v.as_object_mut().expect("an object");
    let mut out = serde_json::Map::new();
    out.insert("$schema".into(), json!("http://json-schema.org/draft-07/schema#"));
    out.insert("$id".into(), json!("plankwise-catalog.schema.json"));
    out.insert("title".into(), json!("plankwise catalog file"));
    out.insert(
        "description".into(),
        json!("Precast prestressed floor and roof members for plankwise: mixes, strand kinds, sections and their strand patterns. Every dimensional value is a string with its unit (\"8 in\", \"5000 psi\", \"203 mm\"); x-range gives the plausible range the reader enforces. A preliminary selection only: the supplier's engineer and the engineer of record make the final design."),
    );
    for (k, x) in std::mem::take(body) {
        if k != "description" {
            out.insert(k, x);
        }
    }
    Value::Object(out)
}
