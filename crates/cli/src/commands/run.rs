//! `deckhold run`: the whole job, printed as the crew's per-zone schedule and written as CSV + PDF.

use anyhow::{Context, Result};
use deckhold_schedule::format::fixed;
use serde_json::json;
use std::time::Instant;

use super::{caution_lines_of, load_project, spacing_text};
use crate::args::RunArgs;
use crate::output::{write_all_atomically, OutputSet};
use crate::table::Table;
use crate::Outcome;
use deckhold_deck::layout::DeckLayout;
use deckhold_project::{run_job, schedule_for, Job};
use deckhold_schedule::format::{
    force_label, force_value, kpa_to_psf, mass_label, n_to_lbf, pressure_value,
};
use deckhold_schedule::{
    crew_sheet_pages, rafter_lines_csv, schedule_csv, schedule_pdf, PdfOptions, Schedule, Units,
};

/// The files `run --out` writes, in order (schedule.json only with --json).
const FILE_NAMES: [&str; 3] = ["schedule.csv", "rafter-lines.csv", "schedule.pdf"];

pub fn run(
    args: &RunArgs,
    units: Option<Units>,
    table: Option<&std::path::Path>,
) -> Result<Outcome> {
    let mut stages: Vec<(&str, f64)> = Vec::new();
    let mut clock = Instant::now();
    let mut lap = |name: &'static str| {
        stages.push((name, clock.elapsed().as_secs_f64() * 1000.0));
        clock = Instant::now();
    };
    let project = load_project(args.project.as_deref(), units, table)?;
    lap("parse");
    let job = run_job(&project).context("the job could not be run")?;
    lap("wind + resistance + spacing");
    let mut schedule = schedule_for(&project, &job);
    // The schedule holds all that the files need: the wind analysis and every candidate nail's plan
    // (on a 300 m x 200 m roof, three nails over 100,000 stretches) are released before the files are
    // made, which lowers the peak memory; the layout is kept only for `--json`'s summary.
    let Job {
        layout,
        wind,
        candidates,
        ..
    } = job;
    drop((wind, candidates));
    let layout = args.json.then_some(layout);
    lap("report data");

    let mut written = Vec::new();
    if let Some(folder) = &args.out {
        let options = PdfOptions {
            creation_date: schedule.project.date.clone(),
            document_id: format!("deckhold-{}", schedule.project.date),
            crew_pages: args.crew_pages,
        };
        if let Some(warning) = crew_pages_warning(&schedule, &options) {
            schedule.warnings.push(warning);
        }
        let mut files = vec![
            (FILE_NAMES[0], schedule_csv(&schedule)?),
            (FILE_NAMES[1], rafter_lines_csv(&schedule)?),
        ];
        lap("CSV");
        files.push((FILE_NAMES[2], schedule_pdf(&schedule, &options)?));
        lap("PDF");
        for warning in super::pdf_text::unshowable_warnings(&schedule.project) {
            errln!("warning: {warning}");
        }
        if args.json {
            files.push(("schedule.json", serde_json::to_vec_pretty(&schedule)?));
        }
        written = write_all_atomically(folder, OutputSet::Schedule, &files)?;
        lap("write files");
    }

    if args.json {
        outln!(
            "{}",
            serde_json::to_string_pretty(&summary_json(
                &schedule,
                layout.as_ref().context("the layout is kept for --json")?,
                project.deck.min_piece_mm
            ))?
        );
        for path in &written {
            errln!("wrote {}", path.display());
        }
    } else {
        out!("{}", summary_text(&schedule));
        out!("{}", files_text(&written));
    }
    if args.timings {
        let total: f64 = stages.iter().map(|(_, ms)| ms).sum();
        for (name, ms) in &stages {
            errln!("timing: {name:<28} {ms:8.2} ms");
        }
        errln!("timing: {:<28} {total:8.2} ms", "total");
    }
    Ok(if schedule.feasible {
        Outcome::Works
    } else {
        Outcome::DoesNotWork
    })
}

/// The machine-readable summary: the per-zone schedule and totals, and the framing and deck layout
/// (every member with its kind, every piece with the lines under its ends) so that others can check it.
fn summary_json(schedule: &Schedule, layout: &DeckLayout, min_piece_mm: f64) -> serde_json::Value {
    let zones: Vec<serde_json::Value> = schedule
        .zones
        .iter()
        .map(|zone| {
            let mut value = json!({
                "label": zone.label,
                "code_zone": zone.code_zone,
                "support_role": zone.support_role,
                "nail": zone.nail_id,
                "spacing_mm": zone.spacing_mm,
                "spacing_in": zone
                    .spacing_mm
                    .map(super::inches),
                "net_uplift_kpa": zone.net_uplift_kpa,
                "demand_n": zone.demand_n,
                "resistance_n": zone.resistance_n,
                "utilization": zone.utilization,
                "nail_count": zone.nail_count,
                "governing_check": zone.governing_check,
                "governing_line": zone.governing_line,
            });
            // The user's US units beside the SI fields, which stay for pipelines.
            if schedule.basis.units.is_us() {
                value["net_uplift_psf"] = json!(round3(kpa_to_psf(zone.net_uplift_kpa)));
                value["demand_lb"] = json!(round3(n_to_lbf(zone.demand_n)));
                value["resistance_lb"] = json!(round3(n_to_lbf(zone.resistance_n)));
            }
            value
        })
        .collect();
    json!({
        "basis": schedule.basis.id,
        "units": schedule.basis.units.id(),
        "nail": schedule.nail.id,
        "feasible": schedule.feasible,
        "edge_width_m": schedule.edge_width_m,
        "roof": { "planes": schedule.plan.planes, "lines": schedule.plan.roof_lines },
        "zones": zones,
        "total_nail_count": schedule.total_nail_count,
        "total_nail_mass_kg": schedule.total_nail_mass_kg,
        "alternatives": schedule.alternatives,
        "warnings": schedule.warnings,
        "cautions": schedule.cautions,
        "framing": { "lines": layout.framing },
        "deck": {
            "laying_starts": layout.laying_starts,
            "pieces": layout.pieces,
            // In the reader's units, one per change and course ("P1 course 2: ...").
            "adjustments": deckhold_project::adjustments::each_adjustment(
                &layout.courses,
                min_piece_mm / 1000.0,
                schedule.basis.units,
            ),
        },
    })
}

/// The warning when the crew sheet needs more pages than `--crew-pages` allows: the pattern is printed
/// whole on the pages it needs, never cut to fit.
fn crew_pages_warning(schedule: &Schedule, options: &PdfOptions) -> Option<String> {
    let limit = options.crew_pages?;
    let needed = crew_sheet_pages(schedule, options);
    (needed > limit as usize).then(|| {
        format!(
            "--crew-pages {limit}: the nailing pattern of the {} framing lines does not fit; the crew sheet \
             takes {needed} pages (nothing was left out)",
            schedule.lines.len()
        )
    })
}

/// A value rounded to 0.001 for the JSON twins.
fn round3(value: f64) -> f64 {
    (value * 1000.0).round() / 1000.0
}

/// The closing line: where the files went, or that none were written and how to write them.
fn files_text(written: &[std::path::PathBuf]) -> String {
    if written.is_empty() {
        return format!(
            "\nNo files were written. To write {}, {} and {}, add --out FOLDER.\n",
            FILE_NAMES[0], FILE_NAMES[1], FILE_NAMES[2]
        );
    }
    let mut text = String::from("\nFiles written:\n");
    for path in written {
        text.push_str(&format!("  {}\n", path.display()));
    }
    text
}

fn summary_text(schedule: &Schedule) -> String {
    let units = schedule.basis.units;
    let us = units.is_us();
    let title = if schedule.project.name.is_empty() {
        "Roof sheathing nailing schedule".into()
    } else {
        deckhold_schedule::format::escape_controls(&schedule.project.name)
    };
    let nail_line = if schedule.resistance.governing_n > 0.0 {
        format!(
            "Nail: {} ({}), {} per nail ({})",
            schedule.nail.id,
            schedule.nail.description,
            force_label(schedule.resistance.governing_n, us),
            schedule.resistance.governing_mode,
        )
    } else {
        format!(
            "Nail: {} cannot be used (see the warnings below)",
            schedule.nail.id
        )
    };
    let mut text = format!("{title}\n{}\n{nail_line}\n\n", schedule.basis.title);
    let (pressure_head, force_head) = if us {
        ("uplift psf", "demand lb")
    } else {
        ("uplift kPa", "demand N")
    };
    let mut table = Table::new(&[
        "zone",
        "code",
        "support",
        "spacing",
        pressure_head,
        force_head,
        "util.",
        "nails",
        "governed by",
        "line",
    ]);
    for zone in &schedule.zones {
        table.row(vec![
            zone.label.to_string(),
            zone.code_zone.clone(),
            zone.support_role.to_string(),
            spacing_text(zone.spacing_mm, units),
            pressure_value(zone.net_uplift_kpa, us),
            force_value(zone.demand_n, us),
            fixed(zone.utilization, 2),
            zone.nail_count.to_string(),
            zone.governing_check.clone(),
            zone.governing_line.to_string(),
        ]);
    }
    text.push_str(&table.render());
    text.push_str(&format!(
        "\nTotal: {} nails, {}\n",
        schedule.total_nail_count,
        mass_label(schedule.total_nail_mass_kg, us)
    ));
    if !schedule.feasible {
        text.push_str("\nNO PRACTICAL SPACING WORKS in every zone with this nail.\n");
        for alternative in &schedule.alternatives {
            text.push_str(&format!("  - {alternative}\n"));
        }
    }
    if !schedule.warnings.is_empty() {
        text.push_str("\nWarnings:\n");
        for warning in &schedule.warnings {
            text.push_str(&format!("  - {warning}\n"));
        }
    }
    text.push_str(&caution_lines_of(&schedule.cautions));
    text
}
