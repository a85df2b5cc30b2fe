//! No output ever prints a negative zero (`-0`, `-0.0`, `-0.00`, `-0'-0"`, ...): every fixture in both
//! unit systems, plus inputs written to produce tiny negatives (`-0.0` overhangs, dead load and layers, a
//! polygon outline on negative-zero coordinates), through the console, both CSVs and the PDF text.

mod support;

use std::path::{Path, PathBuf};
use std::process::Command;
use support::{deckhold, fixture};

/// The negative zeros in `text`: a `-` not preceded by a letter, digit or foot mark, then a number (with an
/// optional feet-inches tail `'-0"` or a fraction) whose every digit is 0.
fn negative_zeros(text: &str) -> Vec<String> {
    let chars: Vec<char> = text.chars().collect();
    let mut found = Vec::new();
    for (index, c) in chars.iter().enumerate() {
        if *c != '-' || chars.get(index + 1) != Some(&'0') {
            continue;
        }
        // A letter or digit before it: a date or an id; a foot mark: the inches of `2'-0"`.
        if index > 0
            && (chars[index - 1].is_alphanumeric() || ['.', '\''].contains(&chars[index - 1]))
        {
            continue;
        }
        let mut end = index + 1;
        while end < chars.len()
            && (chars[end].is_ascii_digit()
                || chars[end] == '.'
                || chars[end] == '\''
                || chars[end] == '"'
                || chars[end] == '/'
                || (chars[end] == '-' && end > 0 && chars[end - 1] == '\''))
        {
            end += 1;
        }
        let number: String = chars[index..end].iter().collect();
        if number
            .chars()
            .filter(char::is_ascii_digit)
            .all(|d| d == '0')
        {
            let from = index.saturating_sub(30);
            let to = (end + 10).min(chars.len());
            found.push(chars[from..to].iter().collect());
        }
    }
    found
}

#[test]
fn the_scanner_finds_every_form_of_negative_zero_and_nothing_else() {
    for bad in [
        "x -0 y",
        "-0.0",
        "(-0.00)",
        "p = -0.000 kPa",
        "-0'-0\"",
        ",-0,",
        "=-0.0",
    ] {
        assert_eq!(negative_zeros(bad).len(), 1, "{bad}");
    }
    for good in [
        "2026-01-01",
        "nbc2020-o86",
        "DEMO-ER-0417",
        "-0.05",
        "-0'-6\"",
        "0.00",
        "-10",
        "-0.001",
        "common-51x2.84",
    ] {
        assert!(negative_zeros(good).is_empty(), "{good}");
    }
}

/// Every project fixture (not the deliberately broken ones).
fn fixtures() -> Vec<PathBuf> {
    let mut paths: Vec<PathBuf> = std::fs::read_dir(fixture(""))
        .expect("fixtures/ reads")
        .map(|entry| entry.expect("entry").path())
        .filter(|path| path.extension().is_some_and(|ext| ext == "json"))
        .collect();
    paths.sort();
    paths
}

/// Runs one command and returns everything it printed and wrote, as text, with where it came from.
fn outputs(args: &[&str], project: &Path, out: &Path) -> Vec<(String, String)> {
    let output = deckhold()
        .args(args)
        .arg(project)
        .arg("--out")
        .arg(out)
        .output()
        .expect("deckhold runs");
    let status = output.status.code();
    assert!(
        matches!(status, Some(0..=2)),
        "{args:?} {}: {output:?}",
        project.display()
    );
    let name = format!("{} {}", args.join(" "), project.display());
    let mut texts = vec![
        (
            format!("{name}: stdout"),
            String::from_utf8_lossy(&output.stdout).into_owned(),
        ),
        (
            format!("{name}: stderr"),
            String::from_utf8_lossy(&output.stderr).into_owned(),
        ),
    ];
    let Ok(entries) = std::fs::read_dir(out) else {
        return texts;
    };
    let mut files: Vec<PathBuf> = entries.map(|e| e.expect("entry").path()).collect();
    files.sort();
    for file in files {
        let text = match file.extension().and_then(|ext| ext.to_str()) {
            Some("csv") => std::fs::read_to_string(&file).expect("csv reads"),
            Some("pdf") => {
                let text = Command::new("pdftotext")
                    .arg(&file)
                    .arg("-")
                    .output()
                    .expect("`pdftotext` is missing: install poppler-utils");
                String::from_utf8_lossy(&text.stdout).into_owned()
            }
            _ => continue,
        };
        texts.push((format!("{name}: {}", file.display()), text));
    }
    texts
}

fn assert_no_negative_zero(texts: &[(String, String)]) {
    let mut problems = Vec::new();
    for (source, text) in texts {
        for hit in negative_zeros(text) {
            problems.push(format!("{source}: ...{hit}..."));
        }
    }
    assert!(
        problems.is_empty(),
        "negative zeros:\n{}",
        problems.join("\n")
    );
}

#[test]
fn no_fixture_prints_a_negative_zero_in_either_unit_system() {
    let dir = tempfile::tempdir().expect("tempdir");
    let mut texts = Vec::new();
    let mut runs = 0;
    for (index, project) in fixtures().iter().enumerate() {
        for units in ["si", "us"] {
            let out = dir.path().join(format!("{index}-{units}"));
            texts.extend(outputs(&["--units", units, "run"], project, &out));
            runs += 1;
        }
        let text = std::fs::read_to_string(project).expect("fixture reads");
        if text.contains("\"existing\"") {
            let out = dir.path().join(format!("{index}-check"));
            texts.extend(outputs(&["check"], project, &out));
            runs += 1;
        }
        let zones = deckhold()
            .arg("zones")
            .arg(project)
            .output()
            .expect("zones");
        texts.push((
            format!("zones {}", project.display()),
            String::from_utf8_lossy(&zones.stdout).into_owned(),
        ));
    }
    assert!(runs >= 20, "only {runs} runs: fixtures missing?");
    assert_no_negative_zero(&texts);
}

#[test]
fn inputs_built_to_give_tiny_negatives_print_no_negative_zero() {
    let dir = tempfile::tempdir().expect("tempdir");
    let demo = std::fs::read_to_string(fixture("demo-ca-gable.json")).expect("demo");
    let l_hip = std::fs::read_to_string(fixture("ca-l-hip-bungalow.json")).expect("L");
    let cases = [
        demo.replace("\"eave_overhang_mm\": 450", "\"eave_overhang_mm\": -0.0")
            .replace("\"rake_overhang_mm\": 300", "\"rake_overhang_mm\": -0.0"),
        demo.replace("\"dead_load_kpa\": 0.3", "\"dead_load_kpa\": -0.0")
            .replace("\"between_mm\": 0", "\"between_mm\": -0.0"),
        l_hip
            .replace("[[0, 0], [14, 0]", "[[-0.0, -0.0], [14, -0.0]")
            .replace("[0, 14]", "[-0.0, 14]"),
    ];
    let mut texts = Vec::new();
    for (index, case) in cases.iter().enumerate() {
        assert!(
            case.contains("-0.0"),
            "case {index} did not change its fixture"
        );
        let project = dir.path().join(format!("tiny-{index}.json"));
        std::fs::write(&project, case).expect("write");
        for units in ["si", "us"] {
            let out = dir.path().join(format!("tiny-{index}-{units}"));
            texts.extend(outputs(&["--units", units, "run"], &project, &out));
        }
    }
    assert_no_negative_zero(&texts);
}
