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
        ..PdfOptions::default()
    }
}

/// The text of the PDF at `path`, by `pdftotext -layout` (pages end with a form feed).
fn layout_text(path: &std::path::Path) -> String {
    let output = tool("pdftotext")
        .args(["-layout"])
        .arg(path)
        .arg("-")
        .output()
        .expect("pdftotext runs");
    assert!(output.status.success());
    String::from_utf8_lossy(&output.stdout).into_owned()
}

/// The text of each page, by `pdftotext -layout`.
fn page_texts(bytes: &[u8]) -> Vec<String> {
    let folder = tempfile::tempdir().expect("temp dir");
    let path = folder.path().join("schedule.pdf");
    std::fs::write(&path, bytes).expect("write");
    let text = layout_text(&path);
    let mut pages: Vec<String> = text.split('\u{c}').map(str::to_string).collect();
    if pages.last().is_some_and(|page| page.trim().is_empty()) {
        pages.pop();
    }
    pages
}

/// Issue 13's "done means": with one crew page asked for, the demo's whole nailing pattern (every line,
/// grouped with the lines nailed alike) is on page 1 under the plan; without it, the pattern has a page
/// of its own. Common practice, no source: a crew takes one sheet onto the roof.
#[test]
fn the_demo_crew_sheet_fits_one_page_with_every_line() {
    let schedule = demo_schedule();
    let one = PdfOptions {
        crew_pages: Some(1),
        ..options(&schedule)
    };
    assert_eq!(deckhold_schedule::crew_sheet_pages(&schedule, &one), 1);
    assert_eq!(
        deckhold_schedule::crew_sheet_pages(&schedule, &options(&schedule)),
        2
    );
    let pages = page_texts(&schedule_pdf(&schedule, &one).expect("PDF"));
    let crew: Vec<&String> = pages
        .iter()
        .filter(|page| page.contains("Crew sheet"))
        .collect();
    assert_eq!(crew.len(), 1, "one crew page");
    assert!(pages[0].contains("Crew sheet"));
    let page_one = &pages[0];
    assert!(page_one.contains("NAILING ALONG EACH TRUSS LINE (62 lines"));
    // Every line number appears in the pattern's "lines" column (as a run or one by one).
    let listed: Vec<u32> = page_one
        .lines()
        .filter_map(|line| {
            let cell = line.trim_start().split("  ").next()?;
            cell.chars()
                .all(|c| c.is_ascii_digit() || c == ',' || c == '-' || c == ' ')
                .then_some(cell.to_string())
        })
        .flat_map(|cell| {
            cell.split(", ")
                .map(|part| part.trim().trim_end_matches(','))
                .filter_map(|part| match part.split_once('-') {
                    Some((a, b)) => Some((a.parse::<u32>().ok()?..=b.parse().ok()?).collect()),
                    None => part.parse().ok().map(|n| vec![n]),
                })
                .flatten()
                .collect::<Vec<u32>>()
        })
        .collect();
    for line in &schedule.lines {
        assert!(
            listed.contains(&line.number),
            "line {} is missing",
            line.number
        );
    }
    let default_pages = page_texts(&schedule_pdf(&schedule, &options(&schedule)).expect("PDF"));
    assert_eq!(default_pages.len(), pages.len() + 1);
    // The pattern and the engineer's table list lines grouped by nailing (line_groups), so no page
    // may say they go line by line (it did after the grouping landed).
    assert!(default_pages[1].contains("Crew sheet, lines nailed alike grouped"));
    for page in &default_pages {
        let flat = page.to_lowercase().replace('-', " ");
        assert!(
            !flat.contains("line by line"),
            "a page says 'line by line':\n{page}"
        );
    }
}

fn tool(name: &str) -> Command {
    assert!(
        Command::new(name).arg("-v").output().is_ok(),
        "`{name}` is missing: install poppler-utils (apt-get install poppler-utils)"
    );
    Command::new(name)
}

/// Column of `word` in `line` where it stands alone (not part of `OVERHANG-CORNER` when looking for `CORNER`).
fn whole_word(line: &str, word: &str) -> Option<usize> {
    line.match_indices(word).map(|(at, _)| at).find(|&at| {
        let before = line[..at].chars().next_back();
        let after = line[at + word.len()..].chars().next();
        before.is_none_or(char::is_whitespace) && after.is_none_or(char::is_whitespace)
    })
}

/// True when `text` starts in `line` within a few columns of `column` (the zone's label is centred over
/// its spacings, so they start a little left of it).
fn near_column(line: &str, text: &str, column: usize) -> bool {
    line.match_indices(text)
        .any(|(at, _)| at.abs_diff(column) <= 12)
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

    let text = layout_text(&path);
    let words: String = text.split_whitespace().collect::<Vec<_>>().join(" ");
    // On the crew sheet's plan each zone's name is followed, within the six lines under it and in the same
    // column, by its two spacings. The corner's intermediate 75 mm is the hand calculation of
    // tests/demo_hand_check.rs; the others are the schedule's own (regression values, in the goldens).
    let page_one = text.split('\u{c}').next().unwrap_or_default();
    let lines: Vec<&str> = page_one.lines().collect();
    let spacing_of = |label: &str, role: &str| {
        schedule
            .zones
            .iter()
            .find(|zone| zone.label.as_str() == label && zone.support_role.as_str() == role)
            .and_then(|zone| zone.spacing_mm)
            .unwrap_or_else(|| panic!("{label} {role}: the demo works in every zone"))
    };
    assert_eq!(spacing_of("corner", "intermediate"), 75.0);
    for label in [
        "corner",
        "edge",
        "interior",
        "overhang-corner",
        "overhang-edge",
    ] {
        let name = label.to_uppercase();
        let (row, column) = lines
            .iter()
            .enumerate()
            .find_map(|(row, line)| whole_word(line, &name).map(|column| (row, column)))
            .unwrap_or_else(|| panic!("{name} is not on the plan:\n{page_one}"));
        for (role, words) in [
            ("panel-edge", "panel edges"),
            ("intermediate", "intermediate"),
        ] {
            // The overhang corner lies in the rake overhang, past the end-wall member: the deck
            // cantilevers there, so it has no member and no panel-edge row.
            if (label, role) == ("overhang-corner", "panel-edge") {
                assert!(
                    !schedule
                        .zones
                        .iter()
                        .any(|zone| zone.label.as_str() == label
                            && zone.support_role.as_str() == role)
                );
                continue;
            }
            let wanted = format!("{words} {:.0} mm", spacing_of(label, role));
            assert!(
                lines[row + 1..(row + 7).min(lines.len())]
                    .iter()
                    .any(|line| near_column(line, &wanted, column)),
                "{name}: '{wanted}' is not under the zone's name"
            );
        }
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
