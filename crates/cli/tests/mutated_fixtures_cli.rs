//! Every fixture, mutated, through the binary itself (`deckhold run`, as a user runs it): each of a
//! fixed, spread-out choice of keys is renamed (a typo), has its value replaced by a wrong kind or an
//! extreme number, and (numbers) scaled threefold. The run always ends 0, 1 or 2, never panics, and a
//! refusal (2) names a key.
//! (tests/mutated_fixtures.rs drives the library with many more random cases.)

mod support;

use serde_json::{json, Value};
use std::path::{Path, PathBuf};
use support::{deckhold, fixture};

/// Keys mutated per fixture; with two mutations each this bounds the test to a few hundred runs.
const KEYS_PER_FIXTURE: usize = 8;

fn fixtures() -> Vec<PathBuf> {
    let mut paths: Vec<PathBuf> = std::fs::read_dir(fixture(""))
        .expect("fixtures/")
        .map(|entry| entry.expect("entry").path())
        .filter(|path| path.extension().is_some_and(|ext| ext == "json"))
        .collect();
    paths.sort();
    paths
}

/// Every (JSON pointer of an object, key) in document order.
fn keys(value: &Value, pointer: &str, out: &mut Vec<(String, String)>) {
    match value {
        Value::Object(map) => {
            for (key, child) in map {
                out.push((pointer.to_string(), key.clone()));
                keys(child, &format!("{pointer}/{key}"), out);
            }
        }
        Value::Array(items) => {
            for (index, child) in items.iter().enumerate() {
                keys(child, &format!("{pointer}/{index}"), out);
            }
        }
        _ => {}
    }
}

/// Wrong values in turn: a wrong kind, a huge or negative number, an empty list, text.
fn wrong_value(turn: usize) -> Value {
    match turn % 6 {
        0 => json!(-1.0e9),
        1 => json!("not-a-value"),
        2 => json!(null),
        3 => json!([]),
        4 => json!({"x": 1}),
        _ => json!(1.0e300),
    }
}

/// Runs `deckhold run` on `project`; returns the exit status and standard error.
fn run(dir: &Path, project: &Value, name: &str) -> (Option<i32>, String) {
    let path = dir.join(name);
    std::fs::write(&path, project.to_string()).expect("write");
    let output = deckhold().arg("run").arg(&path).output().expect("runs");
    (
        output.status.code(),
        String::from_utf8_lossy(&output.stderr).into_owned(),
    )
}

/// True when the message names a key: the mutated one, or a key path of the project file.
fn names_a_key(message: &str, key: &str, top_keys: &[String]) -> bool {
    message.contains(key)
        || top_keys.iter().any(|top| {
            message.contains(&format!("{top}."))
                || message.contains(&format!("{top}:"))
                || message.contains(&format!("{top}["))
        })
}

#[test]
fn every_fixture_mutated_ends_0_1_or_2_and_a_refusal_names_a_key() {
    let dir = tempfile::tempdir().expect("tempdir");
    let mut runs = 0;
    let mut refused = 0;
    let mut worked = 0;
    let mut problems = Vec::new();
    for path in fixtures() {
        let original: Value =
            serde_json::from_str(&std::fs::read_to_string(&path).expect("reads")).expect("json");
        let top_keys: Vec<String> = original
            .as_object()
            .map(|map| map.keys().cloned().collect())
            .unwrap_or_default();
        let mut all = Vec::new();
        keys(&original, "", &mut all);
        let step = (all.len() / KEYS_PER_FIXTURE).max(1);
        for (turn, (pointer, key)) in all.iter().step_by(step).take(KEYS_PER_FIXTURE).enumerate() {
            let typo = format!("{}x", &key[..key.len().saturating_sub(1)]);
            let mut renamed = original.clone();
            if let Some(Value::Object(map)) = renamed.pointer_mut(pointer) {
                let value = map.remove(key).expect("key present");
                map.insert(typo.clone(), value);
            }
            let mut replaced = original.clone();
            if let Some(Value::Object(map)) = replaced.pointer_mut(pointer) {
                map.insert(key.clone(), wrong_value(turn));
            }
            // A number scaled up threefold: often still valid, so the job runs (exit 0 or 1).
            let mut scaled = original.clone();
            if let Some(Value::Object(map)) = scaled.pointer_mut(pointer) {
                if let Some(number) = map.get(key).and_then(Value::as_f64) {
                    map.insert(key.clone(), json!(number * 3.0));
                }
            }
            let mut cases = vec![("renamed", &renamed, &typo), ("replaced", &replaced, key)];
            if scaled != original {
                cases.push(("scaled", &scaled, key));
            }
            for (what, project, named) in cases {
                let (status, stderr) = run(dir.path(), project, "mutated.json");
                runs += 1;
                let case = format!("{} {pointer}/{key} {what}", path.display());
                if stderr.contains("panicked") {
                    problems.push(format!("{case}: panic: {stderr}"));
                }
                match status {
                    Some(0 | 1) => worked += 1,
                    Some(2) => {
                        refused += 1;
                        if !names_a_key(&stderr, named, &top_keys)
                            && !names_a_key(&stderr, key, &top_keys)
                        {
                            problems.push(format!("{case}: refusal names no key: {stderr}"));
                        }
                    }
                    other => problems.push(format!("{case}: exit {other:?}: {stderr}")),
                }
            }
        }
    }
    eprintln!(
        "{runs} mutated runs of the binary: {worked} ran the job (exit 0 or 1), {refused} refused"
    );
    assert!(worked > 0, "no mutation reached the job");
    assert!(runs >= 150, "only {runs} runs");
    assert!(problems.is_empty(), "{}", problems.join("\n"));
}
