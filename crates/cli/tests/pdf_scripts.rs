//! Names in other scripts in the PDF: Cyrillic and Greek print as written (an embedded DejaVu Sans
//! subset), CJK prints as code points with a warning naming the field, an ordinary schedule embeds
//! nothing, and the bytes repeat.

mod support;

use std::path::Path;
use std::process::Command;
use support::{deckhold, fixture};

/// The demo project with its name and site replaced, written to `dir/project.json`.
fn project_named(dir: &Path, name: &str, site: &str) -> std::path::PathBuf {
    let text = std::fs::read_to_string(fixture("demo-ca-gable.json")).expect("demo reads");
    let mut project: serde_json::Value = serde_json::from_str(&text).expect("demo parses");
    project["project"]["name"] = serde_json::Value::from(name);
    project["project"]["site"] = serde_json::Value::from(site);
    let path = dir.join("project.json");
    std::fs::write(&path, serde_json::to_vec(&project).expect("json")).expect("write project");
    path
}

/// Runs `run --out dir/out`, returning (stderr, PDF bytes, PDF text of page 1).
fn run_pdf(dir: &Path, project: &Path) -> (String, Vec<u8>, String) {
    let out = dir.join("out");
    let output = deckhold()
        .arg("run")
        .arg(project)
        .arg("--out")
        .arg(&out)
        .output()
        .expect("deckhold runs");
    assert_eq!(output.status.code(), Some(0), "{output:?}");
    let pdf_path = out.join("schedule.pdf");
    let text = Command::new("pdftotext")
        .args(["-f", "1", "-l", "1"])
        .arg(&pdf_path)
        .arg("-")
        .output()
        .expect("`pdftotext` is missing: install poppler-utils");
    (
        String::from_utf8_lossy(&output.stderr).into_owned(),
        std::fs::read(&pdf_path).expect("pdf reads"),
        String::from_utf8(text.stdout).expect("utf8 text"),
    )
}

fn embeds_a_font(pdf: &[u8]) -> bool {
    pdf.windows(b"/FontFile".len()).any(|w| w == b"/FontFile")
}

#[test]
fn cyrillic_and_greek_names_round_trip_into_the_pdf_text() {
    let dir = tempfile::tempdir().expect("tempdir");
    let name = "\u{0414}\u{043E}\u{043C} \u{041F}\u{0435}\u{0442}\u{0440}\u{043E}\u{0432}\u{044B}\u{0445} \u{2014} \u{03A3}\u{03C0}\u{03AF}\u{03C4}\u{03B9}";
    let site = "\u{0443}\u{043B}. \u{041B}\u{0435}\u{0441}\u{043D}\u{0430}\u{044F} 5, \u{0391}\u{03B8}\u{03AE}\u{03BD}\u{03B1}";
    let project = project_named(dir.path(), name, site);
    let (stderr, pdf, text) = run_pdf(dir.path(), &project);
    assert!(
        text.contains(name),
        "name missing from the PDF text:\n{text}"
    );
    assert!(
        text.contains(site),
        "site missing from the PDF text:\n{text}"
    );
    assert!(!stderr.contains("warning: project."), "{stderr}");
    assert!(
        embeds_a_font(&pdf),
        "the other scripts need the embedded face"
    );
    // Subset, not the whole face: the two DejaVu faces are 1.4 MB together.
    assert!(pdf.len() < 200_000, "PDF is {} bytes", pdf.len());

    let again = tempfile::tempdir().expect("tempdir");
    let project_again = project_named(again.path(), name, site);
    let (_, pdf_again, _) = run_pdf(again.path(), &project_again);
    assert!(pdf == pdf_again, "the same input gives the same bytes");
}

#[test]
fn a_cjk_name_warns_naming_the_field_and_prints_code_points() {
    let dir = tempfile::tempdir().expect("tempdir");
    let project = project_named(dir.path(), "\u{4E2D}\u{6587} house", "Port Aubrey");
    let (stderr, pdf, text) = run_pdf(dir.path(), &project);
    assert!(
        stderr.contains("warning: project.name:") && stderr.contains("U+4E2D U+6587"),
        "{stderr}"
    );
    assert!(text.contains("[U+4E2D][U+6587] house"), "{text}");
    assert!(!text.contains("?? house"), "never a silent question mark");
    assert!(!embeds_a_font(&pdf), "code points need no embedded face");
}

#[test]
fn an_ordinary_schedule_embeds_no_font() {
    let dir = tempfile::tempdir().expect("tempdir");
    let (stderr, pdf, _) = run_pdf(dir.path(), &fixture("demo-ca-gable.json"));
    assert!(!stderr.contains("warning"), "{stderr}");
    assert!(!embeds_a_font(&pdf));
}
