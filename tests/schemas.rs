//! The generated JSON Schemas, checked with an outside validator (the
//! `jsonschema` crate, draft-07): they accept every demo and test file
//! plankwise reads, and refuse broken copies a schema can catch — an
//! unknown key, a wrong type, a count or fraction out of range, a wrong
//! choice, two geometries. (`tests/reference/check_schemas.py` does the
//! same with the PyPI library jsonschema, a second implementation.)

use serde_json::{Value, json};

fn root() -> std::path::PathBuf {
    std::path::Path::new(env!("CARGO_MANIFEST_DIR")).to_path_buf()
}

/// A TOML file as the JSON value a schema validates.
fn doc(path: &str) -> Value {
    let text = std::fs::read_to_string(root().join(path)).unwrap();
    let t: toml::Table = toml::from_str(&text).unwrap();
    serde_json::to_value(t).unwrap()
}

fn validator(schema: &Value) -> jsonschema::Validator {
    jsonschema::draft7::new(schema).unwrap_or_else(|e| panic!("not a draft-07 schema: {e}"))
}

fn errors(v: &jsonschema::Validator, d: &Value) -> Vec<String> {
    v.iter_errors(d).map(|e| format!("{}: {e}", e.instance_path())).collect()
}

/// A way to break a file.
type Edit = Box<dyn Fn(&mut Value)>;

#[test]
fn the_catalog_schema_accepts_every_catalog_and_refuses_broken_copies() {
    let v = validator(&plankwise::schema::catalog());
    let mut files = vec!["catalog/demo-us.toml".to_string(), "catalog/demo-si.toml".to_string()];
    for e in std::fs::read_dir(root().join("tests/good")).unwrap() {
        files.push(format!("tests/good/{}", e.unwrap().file_name().to_string_lossy()));
    }
    for f in &files {
        let d = doc(f);
        assert!(errors(&v, &d).is_empty(), "{f}: {:?}", errors(&v, &d));
        // and plankwise reads it
        plankwise::catalog::Catalog::load(&root().join(f)).unwrap_or_else(|e| panic!("{f}: {e}"));
    }
    let demo = doc("catalog/demo-us.toml");
    let tee = demo["section"]
        .as_array()
        .unwrap()
        .iter()
        .find(|s| s.get("double_tee").is_some())
        .unwrap()["double_tee"]
        .clone();
    let broken: Vec<(&str, Edit)> = vec![
        ("an unknown section key", Box::new(|d| d["section"][0]["colour"] = json!("red"))),
        ("an unknown top-level key", Box::new(|d| d["plant"] = json!({ "name": "x" }))),
        (
            "a misspelt core key",
            Box::new(|d| d["section"][0]["hollow_core"]["cores"]["diamter"] = json!("4 in")),
        ),
        (
            "a number where a quantity string goes",
            Box::new(|d| d["mix"][0]["fc"] = json!(5000)),
        ),
        (
            "a string where a count goes",
            Box::new(|d| d["section"][0]["hollow_core"]["cores"]["count"] = json!("7")),
        ),
        (
            "a core count out of range",
            Box::new(|d| d["section"][0]["hollow_core"]["cores"]["count"] = json!(0)),
        ),
        (
            "a jacking fraction out of range",
            Box::new(|d| d["section"][0]["pattern"][0]["jacking"] = json!(0.95)),
        ),
        (
            "a strand count out of range",
            Box::new(|d| d["section"][0]["pattern"][0]["row"][0]["count"] = json!(101)),
        ),
        ("an unknown aggregate", Box::new(|d| d["mix"][0]["aggregate"] = json!("granite"))),
        ("two geometries", Box::new(move |d| d["section"][0]["double_tee"] = tee.clone())),
        (
            "no geometry",
            Box::new(|d| _ = d["section"][0].as_object_mut().unwrap().remove("hollow_core")),
        ),
        (
            "no patterns",
            Box::new(|d| _ = d["section"][0].as_object_mut().unwrap().remove("pattern")),
        ),
        ("no name", Box::new(|d| _ = d["catalog"].as_object_mut().unwrap().remove("name"))),
    ];
    for (what, edit) in &broken {
        let mut d = demo.clone();
        edit(&mut d);
        assert!(!v.is_valid(&d), "a catalog with {what} passed");
        // plankwise refuses it too
        let text = toml::to_string(&serde_json::from_value::<toml::Table>(d).unwrap()).unwrap();
        assert!(
            plankwise::catalog::Catalog::from_str(&text, "broken.toml").is_err(),
            "plankwise read a catalog with {what}"
        );
    }
}

#[test]
fn the_job_schema_accepts_the_demo_jobs_and_refuses_broken_copies() {
    let v = validator(&plankwise::schema::job());
    for f in ["catalog/demo-job.toml", "catalog/demo-job-si.toml"] {
        let d = doc(f);
        assert!(errors(&v, &d).is_empty(), "{f}: {:?}", errors(&v, &d));
        let mut bad = d.clone();
        bad["bay"][0]["mystery"] = json!(1);
        assert!(!v.is_valid(&bad), "{f} with an unknown bay key passed");
        let mut bad = d.clone();
        bad["bay"][0]["class"] = json!("Z");
        assert!(!v.is_valid(&bad), "{f} with class Z passed");
        let mut bad = d.clone();
        bad["job"]["hide_failing"] = json!("yes");
        assert!(!v.is_valid(&bad), "{f} with a string for a flag passed");
    }
}
