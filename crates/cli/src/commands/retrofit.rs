//! `deckhold check PROJECT --add FASTENER`: what to add between the existing fasteners, per zone and
//! support role. Exit 1 when some zone cannot be made to work with the added fastener.

use anyhow::{Context, Result};
use deckhold_schedule::format::fixed;
use serde_json::json;

use super::{caution_lines, spacing_text};
use crate::table::Table;
use crate::Outcome;
use deckhold_project::{plan_retrofit, ExistingPattern, Project, Retrofit, COMBINATION_RULE};
use deckhold_schedule::format::{
    force_label, lengths_for_reader, message_for_reader, spacing_label,
};
use deckhold_wind::WindAnalysis;

pub fn run(
    project: &Project,
    wind: &WindAnalysis,
    pattern: &ExistingPattern,
    added_id: &str,
    as_json: bool,
    out: Option<&std::path::Path>,
) -> Result<Outcome> {
    let retrofit = plan_retrofit(project, wind, pattern, added_id)
        .with_context(|| format!("the retrofit with `{added_id}` could not be sized"))?;
    if let Some(folder) = out {
        let report = super::check_report::CheckReport::new(
            project,
            pattern,
            super::check_report::Checked::Retrofit(&retrofit),
            wind.built_in_rows_used(),
        );
        super::check_report::write_report(&report, folder)?;
    }
    if as_json {
        outln!(
            "{}",
            serde_json::to_string_pretty(&to_json(project, &retrofit, wind.built_in_rows_used()))?
        );
    } else {
        out!("{}", console_text(project, &retrofit));
        out!("{}", caution_lines(wind.built_in_rows_used()));
    }
    Ok(if retrofit.passes() {
        Outcome::Works
    } else {
        Outcome::DoesNotWork
    })
}

/// The JSON form: per zone and role the existing and added spacing, combined utilization and pass;
/// `built_in_coefficients` keeps the 'from memory' caution (`WindAnalysis::built_in_rows_used`).
pub fn to_json(
    project: &Project,
    retrofit: &Retrofit,
    built_in_coefficients: bool,
) -> serde_json::Value {
    let is_us = project.units.is_us();
    let rows: Vec<serde_json::Value> = retrofit
        .rows
        .iter()
        .map(|row| {
            json!({
                "label": row.label,
                "code_zone": row.code_zone,
                "support_role": row.support_role,
                "existing_spacing_mm": row.existing_spacing_mm,
                "added_spacing_mm": row.added_spacing_mm,
                "added": row.placement.map(|placement| placement.describe(|mm| spacing_label(Some(mm), is_us))),
                "utilization": row.utilization,
                "governing_line": row.governing_line,
                "pass": row.passes,
                "notes": row.notes,
            })
        })
        .collect();
    json!({
        "basis": project.basis.as_str(),
        "existing": retrofit.existing.id,
        "existing_resistance_n": retrofit.existing_resistance.governing_n,
        "credit": retrofit.credit,
        "added": retrofit.added.id,
        "added_resistance_n": retrofit.added_resistance.governing_n,
        "added_governing_mode": retrofit.added_resistance.governing_mode.as_str(),
        "min_neighbour_spacing_mm": retrofit.min_neighbour_mm,
        "combination": COMBINATION_RULE,
        "pass": retrofit.passes(),
        "zones": rows,
        "cautions": deckhold_schedule::cautions_for(built_in_coefficients),
    })
}

/// The console table.
pub fn console_text(project: &Project, retrofit: &Retrofit) -> String {
    let units = project.units;
    let is_us = units.is_us();
    let mut text = format!(
        "Retrofit: existing {} ({}), {} per fastener, credit {}: {} counted\n\
         Added: {} ({}), {} per fastener ({})\n\
         Closest spacing between any two fasteners: {}\n\
         Combination: {COMBINATION_RULE}\n\n",
        retrofit.existing.id,
        lengths_for_reader(&retrofit.existing.description, is_us),
        force_label(retrofit.existing_resistance.governing_n, is_us),
        fixed(retrofit.credit, 2),
        force_label(
            retrofit.existing_resistance.governing_n * retrofit.credit,
            is_us
        ),
        retrofit.added.id,
        lengths_for_reader(&retrofit.added.description, is_us),
        force_label(retrofit.added_resistance.governing_n, is_us),
        retrofit.added_resistance.governing_mode.as_str(),
        spacing_label(Some(retrofit.min_neighbour_mm), is_us),
    );
    let mut table = Table::new(&[
        "zone",
        "code",
        "support",
        "existing",
        "added",
        "util.",
        "line",
        "result",
        "what to add",
    ]);
    for row in &retrofit.rows {
        table.row(vec![
            row.label.to_string(),
            row.code_zone.clone(),
            row.support_role.to_string(),
            spacing_text(Some(row.existing_spacing_mm), units),
            row.added_spacing_mm
                .map(|mm| spacing_text(Some(mm), units))
                .unwrap_or_else(|| "-".to_string()),
            fixed(row.utilization, 2),
            row.governing_line.to_string(),
            if row.passes {
                "ok".to_string()
            } else {
                format!(
                    "FAILS: {}",
                    message_for_reader(&row.notes.join("; "), is_us)
                )
            },
            match row.placement {
                Some(placement) => placement.describe(|mm| spacing_label(Some(mm), is_us)),
                None if row.passes => "nothing".to_string(),
                None => String::new(),
            },
        ]);
    }
    text.push_str(&table.render());
    text.push_str(if retrofit.passes() {
        "\nExisting plus added fasteners carry the uplift in every zone.\n"
    } else {
        "\nThe retrofit FAILS in some zone.\n"
    });
    for warning in retrofit
        .existing_resistance
        .warnings
        .iter()
        .chain(&retrofit.added_resistance.warnings)
    {
        text.push_str(&format!("  - {}\n", message_for_reader(warning, is_us)));
    }
    text
}
