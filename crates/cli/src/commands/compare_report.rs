//! `compare --out DIR`: the comparison a designer keeps on file, `compare.csv` (one line per candidate
//! nail) and a one-page `compare.pdf` (a chart of capacity and nail count per candidate, the table, how the
//! prescriptive wind reach was found, the cautions). Written as the `compare` output set.

use anyhow::Result;
use deckhold_project::reach::PrescriptiveReach;
use deckhold_project::{BasisStandards, Project};
use deckhold_schedule::format::{force_label, mass_label, message_for_reader};
use deckhold_schedule::{BarChart, Block, ChartColumn, ChartPanel, ChartRow, Part, Report};

use crate::output::OutputSet;

/// One candidate nail, as every compare output shows it.
pub struct CompareRow {
    pub nail_id: String,
    pub description: String,
    pub penetration_mm: f64,
    /// Withdrawal and head pull-through resistance per nail, N (None: the nail is refused, or no deck
    /// for pull-through).
    pub withdrawal_n: Option<f64>,
    pub pull_through_n: Option<f64>,
    pub governing_n: Option<f64>,
    pub governing_mode: Option<&'static str>,
    /// Why the nail cannot be used at all.
    pub refused: Option<String>,
    pub total_nail_count: Option<u64>,
    pub total_nail_mass_kg: Option<f64>,
    pub meets_prescriptive_minimum: Option<bool>,
    pub feasible: bool,
    /// The wind up to which the nail's schedule stays at the prescriptive spacings (None: refused).
    pub reach: Option<PrescriptiveReach>,
}

/// Every candidate of one project, in the order shown (working nails first, fewest nails first).
pub struct Comparison<'a> {
    pub project: &'a Project,
    pub rows: Vec<CompareRow>,
    /// Some zone uses a built-in coefficient row: the 'from memory' caution stays.
    pub built_in_coefficients: bool,
}

impl Comparison<'_> {
    fn is_us(&self) -> bool {
        self.project.units.is_us()
    }

    /// How the reach was found, in one sentence (the same for every candidate of the project).
    pub fn reach_method(&self) -> Option<String> {
        let reach = self.rows.iter().find_map(|row| row.reach)?;
        let measure = reach.measure;
        let decimals = measure.decimals() + 1;
        Some(format!(
            "the highest `{}` at which every zone and support role of the \
             nail's schedule is still nailed at the prescriptive maximum spacing (strength governs \
             nowhere), every other input held; found by bisection to within {:.decimals$} {unit} and \
             stated at the low end of the last bracket, rounded down. This project's value: {:.decimals$} {unit}.",
            measure.key(),
            measure.tolerance(),
            reach.given,
            unit = measure.unit(),
        ))
    }
}

/// A CSV field, quoted when it holds a comma, quote or line break.
fn field(text: &str) -> String {
    if text.contains([',', '"', '\n']) {
        format!("\"{}\"", text.replace('"', "\"\""))
    } else {
        text.to_string()
    }
}

fn number(value: Option<f64>, decimals: usize) -> String {
    value
        .map(|value| format!("{value:.decimals$}"))
        .unwrap_or_default()
}

/// `compare.csv`: one line per candidate, quantities in the project's units (the unit in each header);
/// the wind reach in the unit of the basis's wind input.
pub fn compare_csv(comparison: &Comparison) -> Vec<u8> {
    let us = comparison.is_us();
    let (force, length, mass) = if us {
        ("lb", "in", "lb")
    } else {
        ("n", "mm", "kg")
    };
    let mut text = format!(
        "nail,description,penetration_{length},withdrawal_{force},pull_through_{force},governing_mode,\
         resistance_{force},total_nail_count,total_nail_mass_{mass},meets_prescriptive_minimum,works,\
         prescriptive_reach_input,prescriptive_reach,prescriptive_reach_status,prescriptive_reach_tolerance,\
         refused\n"
    );
    let to_force = |n: Option<f64>| {
        number(
            n.map(|n| {
                if us {
                    deckhold_core::units::lbf_from_n(n)
                } else {
                    n
                }
            }),
            1,
        )
    };
    for row in &comparison.rows {
        let penetration = if us {
            format!(
                "{:.3}",
                row.penetration_mm / deckhold_project::units::MM_PER_IN
            )
        } else {
            format!("{:.1}", row.penetration_mm)
        };
        let mass = row.total_nail_mass_kg.map(|kg| {
            if us {
                kg / deckhold_schedule::format::KG_PER_LB
            } else {
                kg
            }
        });
        let (input, reach, status, tolerance) = match row.reach {
            Some(reach) => (
                reach.measure.key().to_string(),
                format!(
                    "{:.prec$}",
                    reach.value(reach.measure.decimals() + 1),
                    prec = reach.measure.decimals() + 1
                ),
                reach.status().to_string(),
                format!("{}", reach.measure.tolerance()),
            ),
            None => Default::default(),
        };
        text.push_str(&format!(
            "{},{},{penetration},{},{},{},{},{},{},{},{},{input},{reach},{status},{tolerance},{}\n",
            field(&row.nail_id),
            field(&row.description),
            to_force(row.withdrawal_n),
            to_force(row.pull_through_n),
            row.governing_mode.unwrap_or_default(),
            to_force(row.governing_n),
            row.total_nail_count
                .map(|count| count.to_string())
                .unwrap_or_default(),
            number(mass, 2),
            row.meets_prescriptive_minimum
                .map(|meets| meets.to_string())
                .unwrap_or_default(),
            row.feasible,
            field(row.refused.as_deref().unwrap_or_default()),
        ));
    }
    text.into_bytes()
}

/// The chart: per candidate its figures, then bars of per-nail capacity and of nails on the roof.
fn chart(comparison: &Comparison) -> BarChart {
    let us = comparison.is_us();
    let dash = || "-".to_string();
    let column = |title: &str, width_mm: f64| ChartColumn {
        title: title.to_string(),
        width_mm,
    };
    BarChart {
        columns: vec![
            column("nail", 31.0),
            column("withdrawal", 16.0),
            column("pull-through", 17.0),
            column("governs", 19.0),
            column("prescr. up to", 19.0),
            column("mass", 14.0),
            column("works", 11.0),
        ],
        panels: vec![
            ChartPanel {
                title: format!("per nail, {}", if us { "lb" } else { "N" }),
                level: 0.45,
            },
            ChartPanel {
                title: "nails on roof".to_string(),
                level: 0.8,
            },
        ],
        rows: comparison
            .rows
            .iter()
            .map(|row| ChartRow {
                cells: vec![
                    row.nail_id.clone(),
                    row.withdrawal_n
                        .map(|n| force_label(n, us))
                        .unwrap_or_else(dash),
                    row.pull_through_n
                        .map(|n| force_label(n, us))
                        .unwrap_or_else(dash),
                    row.governing_mode
                        .map(|mode| mode.replace("head-", ""))
                        .unwrap_or_else(dash),
                    row.reach.map(|reach| reach.label()).unwrap_or_else(dash),
                    row.total_nail_mass_kg
                        .map(|kg| mass_label(kg, us))
                        .unwrap_or_else(dash),
                    match (&row.refused, row.feasible) {
                        (Some(_), _) => "refused".to_string(),
                        (None, true) => "yes".to_string(),
                        (None, false) => "no".to_string(),
                    },
                ],
                values: vec![
                    row.governing_n.map(|n| (n, force_label(n, us))),
                    row.total_nail_count
                        .map(|count| (count as f64, count.to_string())),
                ],
                missing: if row.refused.is_some() {
                    "refused".to_string()
                } else {
                    dash()
                },
            })
            .collect(),
    }
}

/// The one-page PDF report.
pub fn compare_report(comparison: &Comparison) -> Report {
    let project = comparison.project;
    let basis = project.basis.info();
    let mut blocks = vec![
        Block::Heading(format!("Nails compared: {}", project.info.name)),
        Block::Paragraph(format!(
            "Site: {}. Prepared by: {}. Date: {}.",
            project.info.site, project.info.prepared_by, project.info.date
        )),
        Block::Paragraph(format!(
            "Design basis: {} ({}). Deck: {}.",
            basis.title,
            basis.id,
            deckhold_project::report::deck_text(project, project.units)
        )),
        Block::Heading("Capacity and nail count per candidate".to_string()),
        Block::Chart(chart(comparison)),
    ];
    // The report is read on paper: no markdown backticks, lengths in the reader's units.
    let us = comparison.is_us();
    let mut notes = Vec::new();
    if let Some(method) = comparison.reach_method() {
        notes.push(format!(
            "Prescriptive spacing up to: {}",
            message_for_reader(&method, us)
        ));
    }
    for row in &comparison.rows {
        if let Some(reason) = &row.refused {
            notes.push(format!(
                "{}: refused: {}",
                row.nail_id,
                message_for_reader(reason, us)
            ));
        }
    }
    notes.push(
        "Per nail: withdrawal from the framing and head pull-through of the deck; the smaller governs and \
         is the bar. Nails, mass and works: the whole roof at each nail's own schedule (works: every zone \
         has a practical spacing). Sorted: working nails first, fewest nails first."
            .to_string(),
    );
    blocks.push(Block::Bullets(notes));
    super::project_report(
        project,
        COMPARE_KIND,
        vec![Part {
            sheet: "Nails compared".to_string(),
            blocks,
        }],
        comparison.built_in_coefficients,
    )
}

/// The kind of document, in the title block and the PDF's title.
const COMPARE_KIND: &str = "Nail comparison";

/// Writes compare.csv and compare.pdf into `folder` as the `compare` output set.
pub fn write_report(comparison: &Comparison, folder: &std::path::Path) -> Result<()> {
    for warning in super::pdf_text::unshowable_warnings(&comparison.project.info) {
        errln!("warning: {warning}");
    }
    super::write_csv_and_pdf(
        folder,
        OutputSet::Compare,
        compare_csv(comparison),
        &compare_report(comparison),
    )
}
