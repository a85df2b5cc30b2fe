//! The demo's PDF through poppler-utils (`pdftotext`, `pdftoppm`; `.ci/run` installs them): every zone's
//! spacing and every caution is in the text, page 1 is not blank, and the same input gives the same bytes.

use deckhold_project::{parse_project, run_job, schedule_for, DEMO_PROJECT_JSON};
use deckhold_schedule::{schedule_pdf, PdfOptions, Schedule};
use std::process::Command;

fn demo_schedule() -> Schedule {
    let project = parse_project(DEMO_PROJECT_JSON).expect("the demo parses");
    schedule_for(&project, &run_job(&project).expect("runs"))
}

fn options(schedule: &Schedule) -> PdfOptions {
    PdfOptions {
        creation_date: schedule.project.date.clone(),
        document_id: "deckhold-demo".to_string(),
    }
}

fn tool(name: &str) -> Command {
    assert!(
        Command::new(name).arg("-v").output().is_ok(),
        "`{name}` is missing: install poppler-utils (apt-get install poppler-utils)"
    );
    Command::new(name)
}

#[test]
fn the_demo_pdf_carries_every_spacing_and_caution_and_is_deterministic() {
    let schedule = demo_schedule();
    let bytes = schedule_pdf(&schedule, &options(&schedule)).expect("PDF");
    assert_eq!(
        bytes,
        schedule_pdf(&schedule, &options(&schedule)).expect("PDF"),
        "same input, same bytes"
    );
    let folder = tempfile::tempdir().expect("temp dir");
    let path = folder.path().join("demo.pdf");
    std::fs::write(&path, &bytes).expect("write");

    let output = tool("pdftotext")
        .args(["-layout"])
        .arg(&path)
        .arg("-")
        .output()
        .expect("pdftotext runs");
    assert!(output.status.success());
    let text = String::from_utf8_lossy(&output.stdout);
    let words: String = text.split_whitespace().collect::<Vec<_>>().join(" ");
    for zone in &schedule.zones {
        let spacing = zone
            .spacing_mm
            .map(|s| format!("{s:.0} mm"))
            .expect("the demo works in every zone");
        assert!(
            words.contains(&spacing),
            "{} {}: {spacing}",
            zone.label,
            zone.support_role
        );
    }
    for caution in &schedule.cautions {
        let start: String = caution
            .split_whitespace()
            .take(6)
            .collect::<Vec<_>>()
            .join(" ");
        assert!(words.contains(&start), "caution missing: {caution}");
    }
    assert!(words.contains(&schedule.nail.id));
    // The crew sheet has the sign-off a reviewer fills in (common practice, no source).
    assert!(
        words.contains("Reviewed and sealed by"),
        "sign-off block on the crew sheet"
    );

    // Page 1 as a greyscale raster: not blank, and with mid-grey zone fills present.
    let prefix = folder.path().join("page");
    let status = tool("pdftoppm")
        .args(["-gray", "-r", "40", "-f", "1", "-l", "1"])
        .arg(&path)
        .arg(&prefix)
        .status()
        .expect("pdftoppm runs");
    assert!(status.success());
    let raster = std::fs::read_dir(folder.path())
        .expect("list")
        .filter_map(Result::ok)
        .map(|entry| entry.path())
        .find(|p| p.extension().is_some_and(|e| e == "pgm"))
        .expect("a PGM page");
    let image = std::fs::read(raster).expect("read PGM");
    // A binary PGM: header "P5\n<w> <h>\n255\n", then one byte per pixel.
    let header_end = image
        .iter()
        .enumerate()
        .filter(|(_, b)| **b == b'\n')
        .nth(2)
        .map(|(i, _)| i + 1)
        .expect("PGM header");
    let pixels = &image[header_end..];
    let dark = pixels.iter().filter(|p| **p < 100).count();
    let mid = pixels.iter().filter(|p| (150..235).contains(*p)).count();
    assert!(dark > pixels.len() / 200, "page 1 has ink");
    assert!(mid > pixels.len() / 100, "page 1 has grey zone fills");
}
