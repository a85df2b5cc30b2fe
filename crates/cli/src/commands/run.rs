//! `deckhold run`: the whole job, printed as the crew's per-zone schedule and written as CSV + PDF.

use anyhow::{Context, Result};
use serde_json::json;
use std::time::Instant;

use super::{caution_lines, load_project, spacing_text};
use crate::args::RunArgs;
use crate::output::write_all_atomically;
use crate::table::Table;
use crate::Outcome;
use deckhold_project::{run_job, schedule_for};
use deckhold_schedule::{rafter_lines_csv, schedule_csv, schedule_pdf, PdfOptions, Schedule};

pub fn run(args: &RunArgs) -> Result<Outcome> {
    let mut stages: Vec<(&str, f64)> = Vec::new();
    let mut clock = Instant::now();
    let mut lap = |name: &'static str| {
        stages.push((name, clock.elapsed().as_secs_f64() * 1000.0));
        clock = Instant::now();
    };
    let project = load_project(args.project.as_deref())?;
    lap("parse");
    let job = run_job(&project).context("the job could not be run")?;
    lap("wind + resistance + spacing");
    let schedule = schedule_for(&project, &job);
    lap("report data");

    if let Some(folder) = &args.out {
        let mut files = vec![
            ("schedule.csv", schedule_csv(&schedule)?),
            ("rafter-lines.csv", rafter_lines_csv(&schedule)?),
        ];
        lap("CSV");
        let options = PdfOptions {
            creation_date: schedule.project.date.clone(),
            document_id: format!("deckhold-{}", schedule.project.date),
        };
        files.push(("schedule.pdf", schedule_pdf(&schedule, &options)?));
        lap("PDF");
        if args.json {
            files.push(("schedule.json", serde_json::to_vec_pretty(&schedule)?));
        }
        let written = write_all_atomically(folder, &files)?;
        lap("write files");
        for path in written {
            eprintln!("wrote {}", path.display());
        }
    }

    if args.json {
        println!(
            "{}",
            serde_json::to_string_pretty(&summary_json(&schedule))?
        );
    } else {
        print!("{}", summary_text(&schedule));
    }
    if args.timings {
        let total: f64 = stages.iter().map(|(_, ms)| ms).sum();
        for (name, ms) in &stages {
            eprintln!("timing: {name:<28} {ms:8.2} ms");
        }
        eprintln!("timing: {:<28} {total:8.2} ms", "total");
    }
    Ok(if schedule.feasible {
        Outcome::Works
    } else {
        Outcome::DoesNotWork
    })
}

/// The machine-readable summary: the per-zone schedule and totals.
fn summary_json(schedule: &Schedule) -> serde_json::Value {
    let zones: Vec<serde_json::Value> = schedule
        .zones
        .iter()
        .map(|zone| {
            json!({
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
            })
        })
        .collect();
    json!({
        "basis": schedule.basis.id,
        "nail": schedule.nail.id,
        "feasible": schedule.feasible,
        "edge_width_m": schedule.edge_width_m,
        "zones": zones,
        "total_nail_count": schedule.total_nail_count,
        "total_nail_mass_kg": schedule.total_nail_mass_kg,
        "alternatives": schedule.alternatives,
        "warnings": schedule.warnings,
        "cautions": schedule.cautions,
    })
}

fn summary_text(schedule: &Schedule) -> String {
    let us = schedule.basis.units == deckhold_schedule::Units::Imperial;
    let title = if schedule.project.name.is_empty() {
        "Roof sheathing nailing schedule"
    } else {
        &schedule.project.name
    };
    let nail_line = if schedule.resistance.governing_n > 0.0 {
        format!(
            "Nail: {} ({}), {:.0} N per nail ({})",
            schedule.nail.id,
            schedule.nail.description,
            schedule.resistance.governing_n,
            schedule.resistance.governing_mode,
        )
    } else {
        format!(
            "Nail: {} cannot be used (see the warnings below)",
            schedule.nail.id
        )
    };
    let mut text = format!("{title}\n{}\n{nail_line}\n\n", schedule.basis.title);
    let mut table = Table::new(&[
        "zone",
        "code",
        "support",
        "spacing",
        "uplift kPa",
        "demand N",
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
            spacing_text(zone.spacing_mm, us),
            format!("{:.2}", zone.net_uplift_kpa),
            format!("{:.0}", zone.demand_n),
            format!("{:.2}", zone.utilization),
            zone.nail_count.to_string(),
            zone.governing_check.clone(),
            zone.governing_line.to_string(),
        ]);
    }
    text.push_str(&table.render());
    text.push_str(&format!(
        "\nTotal: {} nails, {:.1} kg\n",
        schedule.total_nail_count, schedule.total_nail_mass_kg
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
    text.push_str(&caution_lines());
    text
}
