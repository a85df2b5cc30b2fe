//! Every fixture (not only the demo) with one key renamed or one value replaced: the reader and the job
//! never panic, and a refusal names a key path. The CLI maps a refusal to exit 2 and a job that does not
//! work to 1 (crates/cli/tests); here the library is driven directly so many cases run quickly.

use proptest::prelude::*;
use serde_json::{json, Value};
use std::path::PathBuf;

fn fixtures() -> Vec<(String, Value)> {
    let folder = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("fixtures");
    let mut found: Vec<(String, Value)> = std::fs::read_dir(&folder)
        .expect("fixtures folder")
        .filter_map(Result::ok)
        .map(|entry| entry.path())
        .filter(|path| path.extension().is_some_and(|ext| ext == "json"))
        .map(|path| {
            let text = std::fs::read_to_string(&path).expect("fixture");
            let name = path
                .file_name()
                .expect("name")
                .to_string_lossy()
                .to_string();
            (name, serde_json::from_str(&text).expect("fixture JSON"))
        })
        .collect();
    found.sort_by(|a, b| a.0.cmp(&b.0));
    found
}

/// Every (path to an object, key) in the value, in document order.
fn object_keys(value: &Value, path: &mut Vec<Value>, out: &mut Vec<(Vec<Value>, String)>) {
    match value {
        Value::Object(map) => {
            for (key, child) in map {
                out.push((path.clone(), key.clone()));
                path.push(json!(key));
                object_keys(child, path, out);
                path.pop();
            }
        }
        Value::Array(items) => {
            for (index, child) in items.iter().enumerate() {
                path.push(json!(index));
                object_keys(child, path, out);
                path.pop();
            }
        }
        _ => {}
    }
}

fn at<'a>(value: &'a mut Value, path: &[Value]) -> &'a mut Value {
    path.iter().fold(value, |node, step| match step {
        Value::String(key) => &mut node[key.as_str()],
        Value::Number(index) => &mut node[index.as_u64().unwrap_or(0) as usize],
        _ => node,
    })
}

fn replacement(choice: u8, number: f64, word: &str) -> Value {
    match choice % 8 {
        0 => json!(number),
        1 => json!(-number),
        2 => json!(word),
        3 => json!(null),
        4 => json!(true),
        5 => json!([]),
        6 => json!({}),
        _ => json!(number * 1e12),
    }
}

/// Runs one mutated project through the reader and, if accepted, the job: never a panic.
fn check(project: &Value) -> Result<(), TestCaseError> {
    match deckhold_project::parse_project(&project.to_string()) {
        Ok(parsed) => {
            let _ = deckhold_project::run_job(&parsed);
        }
        Err(error) => {
            let message = error.to_string();
            // The message opens with the key path (`roof.slope_deg: ...`, `nails[2]: ...`).
            let first = message.split([':', ' ']).next().unwrap_or("");
            prop_assert!(
                !first.is_empty() && message.contains(':'),
                "a refusal names a key path: {message}"
            );
        }
    }
    Ok(())
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 256, ..ProptestConfig::default() })]

    #[test]
    fn a_renamed_key_in_any_fixture_is_refused_naming_a_key(
        fixture in any::<prop::sample::Index>(),
        key in any::<prop::sample::Index>(),
        edit in "[a-z_]{0,3}",
        cut in 0usize..4,
    ) {
        let all = fixtures();
        let (_, original) = &all[fixture.index(all.len())];
        let mut keys = Vec::new();
        object_keys(original, &mut Vec::new(), &mut keys);
        let (path, name) = &keys[key.index(keys.len())];
        let renamed = format!("{}{edit}", &name[..name.len().saturating_sub(cut)]);
        let mut project = original.clone();
        let object = at(&mut project, path).as_object_mut().expect("object");
        if let Some(value) = object.remove(name) {
            object.insert(renamed, value);
        }
        check(&project)?;
    }

    #[test]
    fn a_replaced_value_in_any_fixture_never_panics(
        fixture in any::<prop::sample::Index>(),
        key in any::<prop::sample::Index>(),
        choice in any::<u8>(),
        number in -1e6f64..1e6,
        word in "\\PC{0,12}",
    ) {
        let all = fixtures();
        let (_, original) = &all[fixture.index(all.len())];
        let mut keys = Vec::new();
        object_keys(original, &mut Vec::new(), &mut keys);
        let (path, name) = &keys[key.index(keys.len())];
        let mut project = original.clone();
        at(&mut project, path)[name.as_str()] = replacement(choice, number, &word);
        check(&project)?;
    }
}
