//! A user's coefficient table (`--coefficients FILE`, or `coefficients` in the project file): it changes
//! exactly the rows it covers, the reports name it and its stated source, and a malformed table is
//! refused naming the row and the column. The values in the tables below are test inputs, not claims
//! about the standard; the comparisons are between two runs of our own (regression, not outside checks).

use serde_json::Value;
use std::path::Path;

mod support;
use support::{deckhold, fixture};

/// The template for ASCE 7-22 with only the hip 20-27 deg zone 3 row kept, its values replaced and a
/// source stated.
fn one_row_table(folder: &Path) -> std::path::PathBuf {
    let output = deckhold()
        .args(["catalog", "coefficients", "--template", "asce7-22"])
        .output()
        .expect("runs");
    assert!(output.status.success());
    let mut template: Value = serde_json::from_slice(&output.stdout).expect("JSON template");
    let rows = template["curves"].as_array_mut().expect("curves");
    rows.retain(|row| row["set"] == "hip-20-27" && row["region"] == "corner");
    assert_eq!(rows.len(), 1);
    rows[0]["points"] = serde_json::json!([
        { "area_m2": 0.9290304, "coefficient": -3.1 },
        { "area_m2": 9.290304, "coefficient": -2.1 }
    ]);
    template["source"] = Value::String("test copy of Figure 30.3-2F (invented values)".to_string());
    let path = folder.join("my-table.json");
    std::fs::write(
        &path,
        serde_json::to_string_pretty(&template).expect("text"),
    )
    .expect("writes");
    path
}

fn zones_json(extra: &[&str]) -> Value {
    let mut command = deckhold();
    command.args([
        "zones",
        fixture("us-hip.json").to_str().expect("path"),
        "--json",
    ]);
    command.args(extra);
    let output = command.output().expect("runs");
    assert!(
        output.status.success(),
        "{}",
        String::from_utf8_lossy(&output.stderr)
    );
    serde_json::from_slice(&output.stdout).expect("JSON")
}

#[test]
fn a_table_changes_exactly_the_rows_it_covers_and_is_named() {
    let folder = tempfile::tempdir().expect("temp dir");
    let table = one_row_table(folder.path());
    let built_in = zones_json(&[]);
    let with_table = zones_json(&["--coefficients", table.to_str().expect("path")]);
    let before = built_in["zones"].as_array().expect("zones");
    let after = with_table["zones"].as_array().expect("zones");
    assert_eq!(before.len(), after.len());
    let mut changed = Vec::new();
    for (old, new) in before.iter().zip(after) {
        assert_eq!(old["code_zone"], new["code_zone"]);
        if old == new {
            continue;
        }
        changed.push(new["code_zone"].as_str().expect("code").to_string());
        assert!(
            new["source"]
                .as_str()
                .expect("source")
                .contains("my-table.json"),
            "{new}"
        );
    }
    // The us-hip roof (6:12, 26.6 deg) takes the hip 20-27 deg figure: zone 3 and its overhang part.
    changed.sort();
    assert_eq!(changed, ["3", "3-oh"]);
    let three = after
        .iter()
        .find(|zone| zone["code_zone"] == "3")
        .expect("zone 3");
    assert!((three["cp_ext"].as_f64().expect("cp") - -3.1).abs() < 1e-9);
    let warnings = with_table["warnings"].to_string();
    assert!(warnings.contains("my-table.json"), "{warnings}");
    assert!(warnings.contains("invented values"), "{warnings}");
    // Zones 1 and 2 still use built-in rows: the 'from memory' caution stays.
    assert!(with_table["cautions"].to_string().contains("from memory"));
}

#[test]
fn run_names_the_table_on_the_console_and_the_design_basis_page() {
    let folder = tempfile::tempdir().expect("temp dir");
    let table = one_row_table(folder.path());
    let out = folder.path().join("out");
    let output = deckhold()
        .args([
            "run",
            fixture("us-hip.json").to_str().expect("path"),
            "--coefficients",
            table.to_str().expect("path"),
            "--out",
            out.to_str().expect("path"),
        ])
        .output()
        .expect("runs");
    let console = String::from_utf8_lossy(&output.stdout);
    assert!(console.contains("my-table.json"), "{console}");
    assert!(
        console.contains("stated source: test copy of Figure 30.3-2F"),
        "{console}"
    );
    // schedule.csv names each row's coefficient status and figure: zone 3 from the user's table.
    let csv = std::fs::read_to_string(out.join("schedule.csv")).expect("schedule.csv");
    let zone_three: Vec<&str> = csv
        .lines()
        .filter(|line| line.starts_with("corner,3,"))
        .collect();
    assert!(!zone_three.is_empty(), "{csv}");
    for line in zone_three {
        assert!(line.contains(",user-supplied,"), "{line}");
        assert!(line.contains("my-table.json"), "{line}");
    }
    let text = std::process::Command::new("pdftotext")
        .args([
            "-layout",
            out.join("schedule.pdf").to_str().expect("path"),
            "-",
        ])
        .output()
        .expect("pdftotext runs");
    let pdf = String::from_utf8_lossy(&text.stdout).replace(char::is_whitespace, "");
    assert!(
        pdf.contains("user-supplied"),
        "design basis page names the status"
    );
    assert!(
        pdf.contains("my-table.json"),
        "design basis page names the file"
    );
}

#[test]
fn the_project_file_key_reads_the_table_beside_the_project() {
    let folder = tempfile::tempdir().expect("temp dir");
    let table = one_row_table(folder.path());
    let mut project: Value =
        serde_json::from_str(&std::fs::read_to_string(fixture("us-hip.json")).expect("fixture"))
            .expect("JSON");
    project["coefficients"] = Value::String("my-table.json".to_string());
    let project_path = folder.path().join("project.json");
    std::fs::write(&project_path, project.to_string()).expect("writes");
    let by_key = deckhold()
        .args(["zones", project_path.to_str().expect("path"), "--json"])
        .output()
        .expect("runs");
    assert!(
        by_key.status.success(),
        "{}",
        String::from_utf8_lossy(&by_key.stderr)
    );
    let by_key: Value = serde_json::from_slice(&by_key.stdout).expect("JSON");
    let by_flag = zones_json(&["--coefficients", table.to_str().expect("path")]);
    assert_eq!(
        by_key["zones"].as_array().map(Vec::len),
        by_flag["zones"].as_array().map(Vec::len)
    );
    for (a, b) in by_key["zones"]
        .as_array()
        .expect("zones")
        .iter()
        .zip(by_flag["zones"].as_array().expect("zones"))
    {
        assert_eq!(a["cp_ext"], b["cp_ext"]);
    }
    // batch does not read tables: a base naming one is refused, never run on the built-in rows.
    let roofs = folder.path().join("roofs.csv");
    std::fs::write(&roofs, "id,roof.slope\na,6:12\n").expect("writes");
    let batch = deckhold()
        .args([
            "batch",
            roofs.to_str().expect("path"),
            "--base",
            project_path.to_str().expect("path"),
        ])
        .output()
        .expect("runs");
    assert_ne!(batch.status.code(), Some(0));
    let said = format!(
        "{}{}",
        String::from_utf8_lossy(&batch.stdout),
        String::from_utf8_lossy(&batch.stderr)
    );
    assert!(said.contains("coefficients"), "{said}");
}

/// `zones` on the US hip fixture with a table, expected to be refused.
fn zones_refusal(table: &Path) -> std::process::Output {
    deckhold()
        .args([
            "zones",
            fixture("us-hip.json").to_str().expect("path"),
            "--coefficients",
            table.to_str().expect("path"),
        ])
        .output()
        .expect("runs")
}

#[test]
fn malformed_tables_are_refused_naming_row_and_column() {
    let folder = tempfile::tempdir().expect("temp dir");
    let table = one_row_table(folder.path());
    let text = std::fs::read_to_string(&table).expect("reads");
    for (bad, expected) in [
        (
            text.replace("-3.1", "\"x\""),
            "curves[0].points[0].coefficient",
        ),
        (
            text.replace("9.290304", "0.5"),
            "curves[0].points: point 1: areas must increase",
        ),
        (text.replace("ASCE 7-22\"", "NBC 2020\""), "curves[0].set"),
    ] {
        std::fs::write(&table, bad).expect("writes");
        let output = zones_refusal(&table);
        assert_eq!(output.status.code(), Some(2), "{expected}");
        let stderr = String::from_utf8_lossy(&output.stderr);
        assert!(stderr.contains(expected), "{expected} not in {stderr}");
    }
    // A table for the other edition is refused on the project's basis.
    let nbc = deckhold()
        .args(["catalog", "coefficients", "--template", "nbc2020"])
        .output()
        .expect("runs");
    let mut nbc: Value = serde_json::from_slice(&nbc.stdout).expect("JSON");
    nbc["source"] = Value::String("test".to_string());
    std::fs::write(&table, nbc.to_string()).expect("writes");
    let output = zones_refusal(&table);
    assert_eq!(output.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&output.stderr).contains("is for NBC 2020"));
}

/// The whole NBC 2020 template as a user's table (its values are the built-in rows, copied as test
/// inputs), with a source stated.
fn whole_nbc_table(folder: &Path) -> std::path::PathBuf {
    let output = deckhold()
        .args(["catalog", "coefficients", "--template", "nbc2020"])
        .output()
        .expect("runs");
    assert!(output.status.success());
    let mut template: Value = serde_json::from_slice(&output.stdout).expect("JSON template");
    template["source"] = Value::String("test copy of the template".to_string());
    let path = folder.join("whole-table.json");
    std::fs::write(&path, template.to_string()).expect("writes");
    path
}

/// The text of a PDF with its whitespace removed (captions wrap differently per page size).
fn pdf_words(path: &Path) -> String {
    let text = std::process::Command::new("pdftotext")
        .args(["-layout", path.to_str().expect("path"), "-"])
        .output()
        .expect("pdftotext runs");
    String::from_utf8_lossy(&text.stdout).replace(char::is_whitespace, "")
}

/// check.pdf and compare.pdf carry the schedule's coefficient caution: 'from memory' while any zone
/// uses a built-in row (the soffit of an overhang zone is always built-in), the user's-table caution
/// when every zone's curve comes from the table (a roof without overhangs). Before, both reports kept
/// the 'from memory' caution whatever the table covered.
#[test]
fn check_and_compare_reports_follow_the_schedules_coefficient_caution() {
    let folder = tempfile::tempdir().expect("temp dir");
    let table = whole_nbc_table(folder.path());
    let mut project: Value = serde_json::from_str(
        &std::fs::read_to_string(fixture("ca-existing-pattern.json")).expect("fixture"),
    )
    .expect("fixture JSON");
    let from_memory = "Coefficientsmarked'frommemory'mustbechecked".to_string();
    let users = "Everywindcoefficientisfromtheuser'stable".to_string();
    for (overhang_mm, built_in) in [(450, true), (0, false)] {
        project["roof"]["eave_overhang_mm"] = Value::from(overhang_mm);
        project["roof"]["rake_overhang_mm"] = Value::from(overhang_mm.min(300));
        let case = folder.path().join(format!("roof-{overhang_mm}"));
        std::fs::create_dir_all(&case).expect("folder");
        let project_path = case.join("project.json");
        std::fs::write(&project_path, project.to_string()).expect("writes");
        for command in ["check", "compare"] {
            let output = deckhold()
                .args([
                    command,
                    project_path.to_str().expect("path"),
                    "--coefficients",
                    table.to_str().expect("path"),
                    "--out",
                    case.to_str().expect("path"),
                ])
                .output()
                .expect("runs");
            let console = String::from_utf8_lossy(&output.stdout);
            assert_eq!(console.contains("from memory' must"), built_in, "{console}");
            let pdf = pdf_words(&case.join(format!("{command}.pdf")));
            let (kept, dropped) = if built_in {
                (&from_memory, &users)
            } else {
                (&users, &from_memory)
            };
            assert!(
                pdf.contains(kept.as_str()) && !pdf.contains(dropped.as_str()),
                "{command}.pdf, overhang {overhang_mm} mm: expected '{kept}' only"
            );
            let json = deckhold()
                .args([
                    command,
                    project_path.to_str().expect("path"),
                    "--coefficients",
                    table.to_str().expect("path"),
                    "--json",
                ])
                .output()
                .expect("runs");
            let value: Value = serde_json::from_slice(&json.stdout).expect("JSON");
            assert_eq!(
                value["cautions"].to_string().contains("from memory"),
                built_in,
                "{command} --json cautions, overhang {overhang_mm} mm"
            );
        }
    }
}
