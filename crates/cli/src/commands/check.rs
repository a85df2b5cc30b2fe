//! `deckhold check`: plan-check an existing or proposed pattern. Exit 1 when any zone fails.

use anyhow::{anyhow, Context, Result};
use deckhold_schedule::format::fixed;
use serde_json::json;

use super::{caution_lines, load_project, spacing_text};
use crate::args::CheckArgs;
use crate::table::Table;
use crate::Outcome;
use deckhold_project::units::MM_PER_IN;
use deckhold_project::{check_pattern, ExistingPattern, PatternSpacing};
use deckhold_schedule::format::{force_label, lengths_for_reader};
use deckhold_schedule::Units;

pub fn run(
    args: &CheckArgs,
    units: Option<Units>,
    table: Option<&std::path::Path>,
) -> Result<Outcome> {
    let project = load_project(Some(&args.project), units, table)?;
    let pattern = pattern_from(args, project.existing.as_ref())?;
    let wind =
        deckhold_wind::analyze(&project.wind).context("the wind zones could not be computed")?;
    if let Some(added_id) = &args.add {
        return super::retrofit::run(
            &project,
            &wind,
            &pattern,
            added_id,
            args.json,
            args.out.as_deref(),
        );
    }
    let checked =
        check_pattern(&project, &wind, &pattern).context("the pattern could not be checked")?;
    let units = project.units;
    let passes = checked.passes();
    if let Some(folder) = &args.out {
        let report = super::check_report::CheckReport::new(
            &project,
            &pattern,
            super::check_report::Checked::Pattern(&checked),
            wind.built_in_rows_used(),
        );
        super::check_report::write_report(&report, folder)?;
    }
    if args.json {
        let rows: Vec<serde_json::Value> = checked
            .rows
            .iter()
            .map(|row| {
                json!({
                    "label": row.label,
                    "code_zone": row.code_zone,
                    "support_role": row.support_role,
                    "given_spacing_mm": row.given_spacing_mm,
                    "given_spacing_in": super::inches(row.given_spacing_mm),
                    "required_spacing_mm": row.required_spacing_mm,
                    "required_spacing_in": row.required_spacing_mm.map(super::inches),
                    "utilization": row.utilization,
                    "governing_line": row.governing_line,
                    "demand_n": row.demand_n,
                    "resistance_n": checked.resistance.governing_n,
                    "pass": row.passes,
                    "notes": row.notes,
                    "added_nails_per_gap": row.added_nails_per_gap,
                })
            })
            .collect();
        let value = json!({
            "basis": project.basis.as_str(),
            "nail": checked.nail.id,
            "resistance_n": checked.resistance.governing_n,
            "credit": pattern.credit,
            "governing_mode": checked.resistance.governing_mode.as_str(),
            "pass": passes,
            "zones": rows,
            "cautions": deckhold_schedule::cautions_for(wind.built_in_rows_used()),
        });
        outln!("{}", serde_json::to_string_pretty(&value)?);
    } else {
        outln!(
            "Plan check: {} ({}), {} per nail ({}){}\n",
            checked.nail.id,
            lengths_for_reader(&checked.nail.description, units.is_us()),
            force_label(checked.resistance.governing_n, units.is_us()),
            checked.resistance.governing_mode.as_str(),
            if pattern.credit < 1.0 {
                format!(
                    ", credit {} for their condition: {} counted",
                    fixed(pattern.credit, 2),
                    force_label(
                        checked.resistance.governing_n * pattern.credit,
                        units.is_us()
                    )
                )
            } else {
                String::new()
            }
        );
        let mut table = Table::new(&[
            "zone", "code", "support", "given", "needed", "util.", "line", "result", "retrofit",
        ]);
        for row in &checked.rows {
            table.row(vec![
                row.label.to_string(),
                row.code_zone.clone(),
                row.support_role.to_string(),
                spacing_text(Some(row.given_spacing_mm), units),
                spacing_text(row.required_spacing_mm, units),
                fixed(row.utilization, 2),
                row.governing_line.to_string(),
                if row.passes {
                    "ok".to_string()
                } else {
                    format!("FAILS: {}", row.notes.join("; "))
                },
                row.added_nails_per_gap
                    .map(|added| format!("add {added} between each pair"))
                    .unwrap_or_default(),
            ]);
        }
        out!("{}", table.render());
        outln!(
            "\n{}",
            if passes {
                "The pattern passes in every zone."
            } else {
                "The pattern FAILS."
            }
        );
        out!("{}", caution_lines(wind.built_in_rows_used()));
    }
    Ok(if passes {
        Outcome::Works
    } else {
        Outcome::DoesNotWork
    })
}

/// The pattern from the options, else from the project's `existing` block.
fn pattern_from(args: &CheckArgs, existing: Option<&ExistingPattern>) -> Result<ExistingPattern> {
    let from_options = match (
        args.edge_mm,
        args.intermediate_mm,
        args.edge_in,
        args.intermediate_in,
    ) {
        (Some(edge_mm), Some(intermediate_mm), _, _) => Some((edge_mm, intermediate_mm, "mm")),
        (_, _, Some(edge_in), Some(intermediate_in)) => {
            Some((edge_in * MM_PER_IN, intermediate_in * MM_PER_IN, "in"))
        }
        _ => None,
    };
    if let Some((edge_spacing_mm, intermediate_spacing_mm, unit)) = from_options {
        for (name, value) in [
            ("edge", edge_spacing_mm),
            ("intermediate", intermediate_spacing_mm),
        ] {
            if !(value.is_finite() && (10.0..=2000.0).contains(&value)) {
                return Err(anyhow!(
                    "--{name}-{unit}: {value:.1} mm is outside 10..2000 mm"
                ));
            }
        }
        let nail_id = args
            .nail
            .clone()
            .or_else(|| existing.map(|pattern| pattern.nail_id.clone()))
            .ok_or_else(|| {
                anyhow!(
                    "--nail: give the nail of the pattern (or an `existing` block in the project)"
                )
            })?;
        return Ok(ExistingPattern {
            nail_id,
            all_zones: PatternSpacing {
                edge_spacing_mm,
                intermediate_spacing_mm,
            },
            by_zone: Vec::new(),
            // A pattern given on the command line is a proposed one, nailed new: full credit.
            credit: 1.0,
        });
    }
    let mut pattern = existing.cloned().ok_or_else(|| {
        anyhow!("no pattern to check: give --nail with --edge-mm and --intermediate-mm, or an `existing` block in the project")
    })?;
    if let Some(nail) = &args.nail {
        pattern.nail_id = nail.clone();
    }
    Ok(pattern)
}
