//! One module per subcommand, plus what they share (reading the project file, the caution lines).

pub mod batch;
pub mod capacity;
pub mod catalog;
pub mod check;
pub mod check_report;
pub mod compare;
pub mod init;
pub mod limits;
pub mod pdf_text;
pub mod retrofit;
pub mod run;
pub mod zones;

use anyhow::{Context, Result};
use deckhold_project::{parse_project, Project, DEMO_PROJECT_JSON};
use deckhold_schedule::format::spacing_label;
use deckhold_schedule::Units;
use std::path::Path;

/// Reads and validates the project file, or the built-in demo when none is given; `units` (from
/// `--units`) replaces the basis's customary units for every output.
pub fn load_project(path: Option<&Path>, units: Option<Units>) -> Result<Project> {
    let mut project = match path {
        None => parse_project(DEMO_PROJECT_JSON).context("the built-in demo project")?,
        Some(path) => {
            let text = read_bounded(path)?;
            parse_project(&text).with_context(|| format!("in {}", path.display()))?
        }
    };
    if let Some(units) = units {
        project.units = units;
    }
    Ok(project)
}

/// Reads a project file as text, stopping at the file-size limit: a huge file or an endless stream
/// (`/dev/zero`) is refused at once instead of filling memory.
pub fn read_bounded(path: &Path) -> Result<String> {
    use std::io::Read;
    let limit = deckhold_core::limits::FILE_SIZE;
    let max_bytes = limit.max_count();
    let file = std::fs::File::open(path)
        .with_context(|| format!("cannot read the project file {}", path.display()))?;
    let mut bytes = Vec::new();
    file.take(max_bytes as u64 + 1)
        .read_to_end(&mut bytes)
        .with_context(|| format!("cannot read the project file {}", path.display()))?;
    if bytes.len() > max_bytes {
        anyhow::bail!(
            "the project file {} is larger than {max_bytes} bytes, the limit for a project file ({})",
            path.display(),
            limit.reason
        );
    }
    String::from_utf8(bytes).map_err(|error| {
        anyhow::anyhow!(
            "the project file {} is not UTF-8 text (invalid byte at offset {})",
            path.display(),
            error.utf8_error().valid_up_to()
        )
    })
}

/// The cautions printed under every table.
pub fn caution_lines() -> String {
    let mut text = String::from("\nCautions:\n");
    for caution in deckhold_schedule::standard_cautions() {
        text.push_str("  - ");
        text.push_str(&caution);
        text.push('\n');
    }
    text
}

/// A spacing for people: "150 mm o.c." or "6 in o.c."; "none works" for None.
pub fn spacing_text(spacing_mm: Option<f64>, units: Units) -> String {
    match spacing_mm {
        None => "none works".to_string(),
        Some(spacing_mm) => format!("{} o.c.", spacing_label(Some(spacing_mm), units.is_us())),
    }
}

/// A spacing in inches for the JSON twins, rounded to 0.001 in.
pub fn inches(spacing_mm: f64) -> f64 {
    (spacing_mm / deckhold_project::units::MM_PER_IN * 1000.0).round() / 1000.0
}
