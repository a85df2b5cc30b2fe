//! `check --out DIR`: the plan-check report a reviewer files: `check.csv` (per zone and support role, then
//! per framing line) and `check.pdf` (a sign-off page, then the detail; cautions on every page).

use deckhold_deck::spacing::DeckPlan;
use deckhold_project::basis::BasisStandards;
use deckhold_project::{ExistingPattern, PatternCheck, Project, Retrofit, COMBINATION_RULE};
use deckhold_schedule::format::{feet_inches, fixed, mm_to_in, places, trimmed};
use deckhold_schedule::format::{
    force_label, lengths_for_reader, message_for_reader, spacing_label,
};
use deckhold_schedule::{Block, Part, Report};

/// One zone and role of the report, whether a plain check or a retrofit.
pub struct ReportRow {
    pub zone: String,
    pub code_zone: String,
    pub role: String,
    pub existing_mm: f64,
    pub added_mm: Option<f64>,
    pub what_to_add: String,
    pub utilization: f64,
    pub line: u32,
    pub passes: bool,
    pub notes: String,
}

/// What the report is about.
pub struct CheckReport<'a> {
    pub project: &'a Project,
    pub pattern: &'a ExistingPattern,
    pub rows: Vec<ReportRow>,
    pub plan: &'a DeckPlan,
    /// Lines describing the fasteners and their resistances.
    pub fastener_lines: Vec<String>,
    pub warnings: Vec<String>,
    pub added_id: Option<String>,
    /// Some zone uses a built-in coefficient row: the 'from memory' caution stays.
    pub built_in_coefficients: bool,
}

/// The check a report is made from: the pattern in place alone, or with a fastener added (`--add`).
pub enum Checked<'a> {
    Pattern(&'a PatternCheck),
    Retrofit(&'a Retrofit),
}

/// One report row from a check row or a retrofit row: both name the zone, role, utilization, line,
/// verdict and notes with the same fields, and differ only in the spacings and what to add.
macro_rules! report_row {
    ($row:expr, $existing_mm:expr, $added_mm:expr, $what_to_add:expr) => {
        ReportRow {
            zone: $row.label.to_string(),
            code_zone: $row.code_zone.clone(),
            role: $row.support_role.to_string(),
            existing_mm: $existing_mm,
            added_mm: $added_mm,
            what_to_add: $what_to_add,
            utilization: $row.utilization,
            line: $row.governing_line,
            passes: $row.passes,
            notes: $row.notes.join("; "),
        }
    };
}

impl<'a> CheckReport<'a> {
    /// The report of a plain plan check or of a retrofit.
    /// `built_in_coefficients`: `WindAnalysis::built_in_rows_used` of the wind the check ran on.
    pub fn new(
        project: &'a Project,
        pattern: &'a ExistingPattern,
        checked: Checked<'a>,
        built_in_coefficients: bool,
    ) -> Self {
        let is_us = project.units.is_us();
        let (rows, plan, fastener_lines, warnings, added_id) = match checked {
            Checked::Pattern(check) => (
                pattern_rows(check),
                &check.plan,
                vec![format!(
                    "Existing: {}, credit {}",
                    fastener_summary(&check.nail, &check.resistance, is_us),
                    fixed(pattern.credit, 2)
                )],
                check.resistance.warnings.clone(),
                None,
            ),
            Checked::Retrofit(retrofit) => (
                retrofit_rows(retrofit, is_us),
                &retrofit.plan,
                retrofit_fastener_lines(retrofit, is_us),
                retrofit
                    .existing_resistance
                    .warnings
                    .iter()
                    .chain(&retrofit.added_resistance.warnings)
                    .cloned()
                    .collect(),
                Some(retrofit.added.id.clone()),
            ),
        };
        // The fasten and project crates write ids in backticks and lengths in mm: a report is plain
        // text in the reader's units.
        let warnings = warnings
            .iter()
            .map(|warning: &String| message_for_reader(warning, is_us))
            .collect();
        let mut rows = rows;
        for row in &mut rows {
            row.notes = message_for_reader(&row.notes, is_us);
        }
        CheckReport {
            project,
            pattern,
            rows,
            plan,
            fastener_lines,
            warnings,
            added_id,
            built_in_coefficients,
        }
    }

    fn passes(&self) -> bool {
        self.rows.iter().all(|row| row.passes)
    }
}

fn pattern_rows(check: &PatternCheck) -> Vec<ReportRow> {
    check
        .rows
        .iter()
        .map(|row| {
            let what_to_add = match row.added_nails_per_gap {
                Some(added) => format!("{added} more {} between each pair", check.nail.id),
                None if row.passes => "nothing".to_string(),
                None => format!(
                    "no spacing of {} works here: check with --add and a stronger fastener",
                    check.nail.id
                ),
            };
            report_row!(row, row.given_spacing_mm, None, what_to_add)
        })
        .collect()
}

fn retrofit_rows(retrofit: &Retrofit, is_us: bool) -> Vec<ReportRow> {
    retrofit
        .rows
        .iter()
        .map(|row| {
            let what_to_add = match row.placement {
                Some(placement) => format!(
                    "{}: {}",
                    retrofit.added.id,
                    placement.describe(|mm| spacing_label(Some(mm), is_us))
                ),
                None if row.passes => "nothing".to_string(),
                None => String::new(),
            };
            report_row!(
                row,
                row.existing_spacing_mm,
                row.added_spacing_mm,
                what_to_add
            )
        })
        .collect()
}

/// "id (description), R per fastener (mode)": one fastener and its governing resistance.
fn fastener_summary(
    nail: &deckhold_fasten::Nail,
    resistance: &deckhold_fasten::Resistance,
    is_us: bool,
) -> String {
    format!(
        "{} ({}), {} per fastener ({})",
        nail.id,
        lengths_for_reader(&nail.description, is_us),
        force_label(resistance.governing_n, is_us),
        resistance.governing_mode.as_str()
    )
}

fn retrofit_fastener_lines(retrofit: &Retrofit, is_us: bool) -> Vec<String> {
    vec![
        format!(
            "Existing: {}, credit {}: {} counted",
            fastener_summary(&retrofit.existing, &retrofit.existing_resistance, is_us),
            fixed(retrofit.credit, 2),
            force_label(
                retrofit.existing_resistance.governing_n * retrofit.credit,
                is_us
            )
        ),
        format!(
            "Added: {}; source: {}",
            fastener_summary(&retrofit.added, &retrofit.added_resistance, is_us),
            retrofit.added.provenance()
        ),
        format!(
            "Closest spacing between any two fasteners: {}",
            spacing_label(Some(retrofit.min_neighbour_mm), is_us)
        ),
        format!("Combination: {COMBINATION_RULE}"),
    ]
}

/// A CSV field, quoted when it holds a comma, quote or line break.
fn field(text: &str) -> String {
    let text = deckhold_schedule::format::escape_controls(text);
    if text.contains([',', '"', '\n']) {
        format!("\"{}\"", text.replace('"', "\"\""))
    } else {
        text.to_string()
    }
}

/// `check.csv`: the zone rows (`section` = zone), then one row per stretch of every framing line
/// (`section` = line) with the pattern that applies there. In the report's units: m and mm, or
/// feet-inches and inches (the headers say which).
pub fn check_csv(report: &CheckReport) -> Vec<u8> {
    let is_us = report.project.units.is_us();
    let small = |mm: f64| {
        if is_us {
            trimmed(mm_to_in(mm), places::SPACING_IN_CSV)
        } else {
            fixed(mm, 1)
        }
    };
    let position = |m: f64| if is_us { feet_inches(m) } else { fixed(m, 3) };
    let mut text = if is_us {
        String::from(
            "section,zone,code_zone,support_role,line,from_ft_in,to_ft_in,reaction_width_in,\
             existing_spacing_in,added_spacing_in,utilization,pass,what_to_add,notes\n",
        )
    } else {
        String::from(
            "section,zone,code_zone,support_role,line,from_m,to_m,reaction_width_mm,\
             existing_spacing_mm,added_spacing_mm,utilization,pass,what_to_add,notes\n",
        )
    };
    for row in &report.rows {
        text.push_str(&format!(
            "zone,{},{},{},{},,,,{},{},{},{},{},{}\n",
            row.zone,
            field(&row.code_zone),
            row.role,
            row.line,
            small(row.existing_mm),
            row.added_mm.map(small).unwrap_or_default(),
            fixed(row.utilization, 3),
            row.passes,
            field(&row.what_to_add),
            field(&row.notes)
        ));
    }
    let zones = &report.project_zones();
    for line in &report.plan.lines {
        for segment in &line.segments {
            let zone = zones.get(segment.zone_index).cloned().unwrap_or_default();
            let role = segment.support_role.to_string();
            let row = report
                .rows
                .iter()
                .find(|row| row.zone == zone && row.role == role);
            text.push_str(&format!(
                "line,{zone},,{role},{},{},{},{},{},{},,,,\n",
                line.number,
                field(&position(segment.from_m)),
                field(&position(segment.to_m)),
                small(segment.reaction_width_mm),
                row.map(|row| small(row.existing_mm)).unwrap_or_default(),
                row.and_then(|row| row.added_mm)
                    .map(small)
                    .unwrap_or_default(),
            ));
        }
    }
    text.into_bytes()
}

impl CheckReport<'_> {
    /// Zone labels by zone index, from the wind analysis of the plan.
    fn project_zones(&self) -> Vec<String> {
        deckhold_wind::analyze(&self.project.wind)
            .map(|wind| {
                wind.zones
                    .iter()
                    .map(|zone| zone.label.to_string())
                    .collect()
            })
            .unwrap_or_default()
    }
}

/// The kind of document, in every page's title block and the PDF's title.
const REPORT_KIND: &str = "Plan-check report";

/// The PDF report: page 1 for sign-off, then the detail.
pub fn check_report(report: &CheckReport) -> Report {
    let project = report.project;
    let is_us = project.units.is_us();
    let spacing = |mm: f64| format!("{} o.c.", spacing_label(Some(mm), is_us));
    let basis = project.basis.info();
    let mut pattern_lines = vec![format!(
        "{}: {} at panel edges, {} at intermediate supports (all zones)",
        report.pattern.nail_id,
        spacing(report.pattern.all_zones.edge_spacing_mm),
        spacing(report.pattern.all_zones.intermediate_spacing_mm)
    )];
    for (zone, zone_spacing) in &report.pattern.by_zone {
        pattern_lines.push(format!(
            "{zone}: {} at panel edges, {} at intermediate supports",
            spacing(zone_spacing.edge_spacing_mm),
            spacing(zone_spacing.intermediate_spacing_mm)
        ));
    }
    pattern_lines.push(format!(
        "credit for the existing fasteners' condition: {}",
        fixed(report.pattern.credit, 2)
    ));
    let verdict = match (&report.added_id, report.passes()) {
        (None, true) => "RESULT: the pattern in place PASSES in every zone.".to_string(),
        (None, false) => "RESULT: the pattern in place FAILS: see the zones marked FAILS.".to_string(),
        (Some(added), true) => format!(
            "RESULT: with {added} added as listed, existing plus added fasteners PASS in every zone."
        ),
        (Some(added), false) => {
            format!("RESULT: even with {added} added, some zone FAILS: see below.")
        }
    };
    let zone_rows: Vec<Vec<String>> = report
        .rows
        .iter()
        .map(|row| {
            vec![
                format!("{} ({})", row.zone, row.code_zone),
                row.role.clone(),
                spacing(row.existing_mm),
                row.added_mm.map(spacing).unwrap_or_else(|| "-".to_string()),
                fixed(row.utilization, 2),
                if row.passes { "pass" } else { "FAILS" }.to_string(),
                row.what_to_add.clone(),
            ]
        })
        .collect();
    let sign_off = Part {
        sheet: "Plan check: sign-off".to_string(),
        blocks: vec![
            Block::Heading(format!("Plan check of the roof sheathing fastening: {}", project.info.name)),
            Block::Paragraph(format!(
                "Site: {}. Owner: {}. Prepared by: {}. Date: {}.",
                project.info.site, project.info.owner, project.info.prepared_by, project.info.date
            )),
            Block::Paragraph(format!("Design basis: {} ({}).", basis.title, basis.id)),
            Block::Heading("Pattern given".to_string()),
            Block::Bullets(pattern_lines),
            Block::Bullets(report.fastener_lines.clone()),
            Block::Strong(verdict),
            Block::Table {
                columns: vec![
                    ("zone".to_string(), 0.17),
                    ("support".to_string(), 0.12),
                    ("existing".to_string(), 0.11),
                    ("added".to_string(), 0.1),
                    ("util.".to_string(), 0.07),
                    ("result".to_string(), 0.08),
                    ("what to add, where".to_string(), 0.35),
                ],
                rows: zone_rows,
            },
            Block::Heading("Review".to_string()),
            Block::Paragraph(
                "Reviewed by: ______________________   Licence / seal: ______________   Date: ___________"
                    .to_string(),
            ),
            Block::Paragraph("Accepted  [ ]     Accepted with comments  [ ]     Not accepted  [ ]".to_string()),
        ],
    };
    let mut detail_blocks = vec![Block::Heading("Why each zone passes or fails".to_string())];
    let notes: Vec<String> = report
        .rows
        .iter()
        .filter(|row| !row.notes.is_empty())
        .map(|row| format!("{} {}: {}", row.zone, row.role, row.notes))
        .collect();
    detail_blocks.push(if notes.is_empty() {
        Block::Paragraph(
            "Every zone and support role works; utilization is at its worst framing line."
                .to_string(),
        )
    } else {
        Block::Bullets(notes)
    });
    if !report.warnings.is_empty() {
        detail_blocks.push(Block::Heading("Warnings from the resistance".to_string()));
        detail_blocks.push(Block::Bullets(report.warnings.clone()));
    }
    detail_blocks.push(Block::Heading(
        "Worst framing line per zone and support".to_string(),
    ));
    detail_blocks.push(Block::Table {
        columns: vec![
            ("zone".to_string(), 0.3),
            ("support".to_string(), 0.2),
            ("line".to_string(), 0.15),
            ("utilization".to_string(), 0.35),
        ],
        rows: report
            .rows
            .iter()
            .map(|row| {
                vec![
                    row.zone.clone(),
                    row.role.clone(),
                    row.line.to_string(),
                    fixed(row.utilization, 2),
                ]
            })
            .collect(),
    });
    detail_blocks.push(Block::Paragraph(
        "check.csv lists every stretch of every framing line with its reaction width and the pattern that \
         applies there."
            .to_string(),
    ));
    super::project_report(
        project,
        REPORT_KIND,
        vec![
            sign_off,
            Part {
                sheet: "Plan check: detail".to_string(),
                blocks: detail_blocks,
            },
        ],
        report.built_in_coefficients,
    )
}

/// Writes check.csv and check.pdf into `folder` as the `check` output set.
pub fn write_report(report: &CheckReport, folder: &std::path::Path) -> anyhow::Result<()> {
    for warning in super::pdf_text::unshowable_warnings(&report.project.info) {
        errln!("warning: {warning}");
    }
    super::write_csv_and_pdf(
        folder,
        crate::output::OutputSet::Check,
        check_csv(report),
        &check_report(report),
    )
}
