//! One module per subcommand, plus what they share (reading the project file, the caution lines).

pub mod batch;
pub mod capacity;
pub mod catalog;
pub mod check;
pub mod check_report;
pub mod compare;
pub mod compare_report;
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
/// `--units`) replaces the basis's customary units for every output; `table` (from `--coefficients`)
/// is read in place of the project file's `coefficients` (a path relative to the project file).
pub fn load_project(
    path: Option<&Path>,
    units: Option<Units>,
    table: Option<&Path>,
) -> Result<Project> {
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
    let table_path = match (table, &project.coefficients_file) {
        (Some(table), _) => Some(table.to_path_buf()),
        (None, Some(file)) => Some(
            path.and_then(Path::parent)
                .unwrap_or_else(|| Path::new(""))
                .join(file),
        ),
        (None, None) => None,
    };
    if let Some(table_path) = table_path {
        let text = read_bounded_as(&table_path, "coefficient table")?;
        let name = table_path.display().to_string();
        let table = deckhold_wind::parse_coefficient_table(&name, &text)?;
        project.coefficients_file = Some(name);
        project.wind.table = Some(table);
    }
    Ok(project)
}

/// Reads a project file as text, stopping at the file-size limit: a huge file or an endless stream
/// (`/dev/zero`) is refused at once instead of filling memory.
pub fn read_bounded(path: &Path) -> Result<String> {
    read_bounded_as(path, "project file")
}

/// Reads a file the user named (`what` says which, in messages) as text, stopping at the file-size
/// limit.
pub fn read_bounded_as(path: &Path, what: &str) -> Result<String> {
    use std::io::Read;
    let limit = deckhold_core::limits::FILE_SIZE;
    let max_bytes = limit.max_count();
    let file = std::fs::File::open(path)
        .with_context(|| format!("cannot read the {what} {}", path.display()))?;
    let mut bytes = Vec::new();
    file.take(max_bytes as u64 + 1)
        .read_to_end(&mut bytes)
        .with_context(|| format!("cannot read the {what} {}", path.display()))?;
    if bytes.len() > max_bytes {
        anyhow::bail!(
            "the {what} {} is larger than {max_bytes} bytes, the limit for a file ({})",
            path.display(),
            limit.reason
        );
    }
    String::from_utf8(bytes).map_err(|error| {
        anyhow::anyhow!(
            "the {what} {} is not UTF-8 text (invalid byte at offset {})",
            path.display(),
            error.utf8_error().valid_up_to()
        )
    })
}

/// A report PDF of the project (`kind`: "Plan-check report", "Nail comparison"), with the cautions on
/// every page; `built_in_coefficients`: some zone uses a built-in coefficient row
/// (`WindAnalysis::built_in_rows_used`), so the 'from memory' caution stays, as on the schedule.
pub fn project_report(
    project: &Project,
    kind: &str,
    parts: Vec<deckhold_schedule::Part>,
    built_in_coefficients: bool,
) -> deckhold_schedule::Report {
    use deckhold_project::BasisStandards;
    deckhold_schedule::Report {
        title: format!("{kind}: {}", project.info.name),
        kind: kind.to_string(),
        project: project.info.name.clone(),
        site: project.info.site.clone(),
        date: project.info.date.clone(),
        basis_id: project.basis.info().id.clone(),
        prepared_by: project.info.prepared_by.clone(),
        units: project.units,
        cautions: deckhold_schedule::cautions_for(built_in_coefficients),
        parts,
    }
}

/// Draws `report` and writes it with `csv` as the two-file output set `set` (its names: the CSV, then
/// the PDF), dated as the report; says what it wrote on standard error.
pub fn write_csv_and_pdf(
    folder: &Path,
    set: crate::output::OutputSet,
    csv: Vec<u8>,
    report: &deckhold_schedule::Report,
) -> Result<()> {
    let options = deckhold_schedule::PdfOptions {
        creation_date: report.date.clone(),
        document_id: format!("deckhold-{}", set.key()),
        crew_pages: None,
    };
    let pdf = deckhold_schedule::report_pdf(report, &options)
        .with_context(|| format!("the {} PDF could not be drawn", report.kind))?;
    let [csv_name, pdf_name] = [set.names()[0], set.names()[1]];
    let files = [(csv_name, csv), (pdf_name, pdf)];
    for path in crate::output::write_all_atomically(folder, set, &files)? {
        errln!("wrote {}", path.display());
    }
    Ok(())
}

/// The cautions printed under every table; `built_in_coefficients`: some zone uses a built-in
/// coefficient row (`WindAnalysis::built_in_rows_used`), so the 'from memory' caution stays.
pub fn caution_lines(built_in_coefficients: bool) -> String {
    caution_lines_of(&deckhold_schedule::cautions_for(built_in_coefficients))
}

/// The cautions of a schedule, as printed under its table.
pub fn caution_lines_of(cautions: &[String]) -> String {
    let mut text = String::from("\nCautions:\n");
    for caution in cautions {
        text.push_str("  - ");
        text.push_str(caution);
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
