//! `deckhold compare`: several nails on one deck: per nail both resistances (withdrawal, head
//! pull-through) and which governs, spacing per zone, nail count, mass, whether the nail meets the
//! prescriptive minimum length, and the wind up to which its schedule stays at the prescriptive spacings.
//! Sorted by total nail count. `--out DIR` writes compare.csv and compare.pdf (see compare_report.rs).

use anyhow::{Context, Result};
use serde_json::json;

use super::compare_report::{CompareRow, Comparison};
use super::{caution_lines, load_project, spacing_text};
use crate::args::CompareArgs;
use crate::table::Table;
use crate::Outcome;
use deckhold_deck::layout::SupportRole;
use deckhold_fasten::CatalogBasis;
use deckhold_project::reach::{prescriptive_reach, PrescriptiveReach, ReachBase};
use deckhold_project::rules::prescriptive_minimum_length;
use deckhold_project::{run_job_with_nails, BasisStandards, Job, NailOutcome, Project};
use deckhold_schedule::format::{
    force_label, lengths_for_reader, mass_label, small_length_label, KG_PER_LB,
};
use deckhold_schedule::Units;
use std::collections::HashMap;

/// Every catalog nail of the project's basis that reaches the minimum penetration through the deck.
fn fitting_nails(project: &Project) -> Vec<String> {
    let us = project.basis.is_us();
    deckhold_fasten::nails()
        .iter()
        .filter(|nail| match nail.basis {
            CatalogBasis::Both => true,
            CatalogBasis::Us => us,
            CatalogBasis::Ca => !us,
        })
        .filter(|nail| {
            let penetration_mm = deckhold_project::job::penetration_for(project, nail);
            let minimum =
                deckhold_fasten::minimum_penetration(project.basis.fastener_method(), nail);
            penetration_mm >= minimum.min_mm
        })
        .map(|nail| nail.id.clone())
        .collect()
}

/// Whether the nail is at least as long as the prescriptive table asks for this deck (None: no table row).
fn meets_prescriptive(project: &Project, candidate: &NailOutcome) -> Option<bool> {
    prescriptive_minimum_length(project.basis, project.deck.thickness_mm)
        .map(|(length_mm, _)| candidate.nail.length_mm + 0.05 >= length_mm)
}

/// The reach depends on the nail only through its governing resistance and its shank diameter (the
/// spacing rules), so candidates alike in both share one bisection.
type ReachCache = HashMap<(u64, u64), PrescriptiveReach>;

/// One candidate as every output shows it, with its prescriptive wind reach found by bisection.
fn compare_row(
    base: &ReachBase,
    cache: &mut ReachCache,
    candidate: &NailOutcome,
) -> Result<CompareRow> {
    let project = base.project;
    let resistance = candidate.resistance.as_ref().ok();
    let reach = match resistance {
        Some(resistance) => {
            let key = (
                resistance.governing_n.to_bits(),
                candidate.nail.shank_diameter_mm.to_bits(),
            );
            let reach = match cache.get(&key) {
                Some(reach) => *reach,
                None => prescriptive_reach(base, &candidate.nail, resistance.governing_n)
                    .with_context(|| {
                        format!(
                            "the prescriptive wind reach of `{}` could not be found",
                            candidate.nail.id
                        )
                    })?,
            };
            cache.insert(key, reach);
            Some(reach)
        }
        None => None,
    };
    Ok(CompareRow {
        nail_id: candidate.nail.id.clone(),
        description: lengths_for_reader(&candidate.nail.description, project.units.is_us()),
        penetration_mm: candidate.penetration_mm,
        withdrawal_n: resistance.map(|resistance| resistance.withdrawal_n),
        pull_through_n: resistance.and_then(|resistance| resistance.pull_through_n),
        governing_n: resistance.map(|resistance| resistance.governing_n),
        governing_mode: resistance.map(|resistance| resistance.governing_mode.as_str()),
        refused: candidate.resistance.as_ref().err().cloned(),
        total_nail_count: candidate.plan.as_ref().map(|plan| plan.total_nail_count),
        total_nail_mass_kg: candidate.plan.as_ref().map(|plan| plan.total_nail_mass_kg),
        meets_prescriptive_minimum: meets_prescriptive(project, candidate),
        feasible: candidate.feasible,
        reach,
    })
}

pub fn run(
    args: &CompareArgs,
    units: Option<Units>,
    table: Option<&std::path::Path>,
) -> Result<Outcome> {
    let project = load_project(args.project.as_deref(), units, table)?;
    let nail_ids: Vec<String> = if args.nails.is_empty() {
        fitting_nails(&project)
    } else {
        args.nails.iter().map(|id| id.trim().to_string()).collect()
    };
    if nail_ids.is_empty() {
        anyhow::bail!(
            "no catalog nail of this basis reaches the minimum penetration through {:.1} mm of deck and {:.1} mm between; \
             name nails with --nails",
            project.deck.thickness_mm,
            project.deck.between_mm
        );
    }
    let job = run_job_with_nails(&project, &nail_ids).context("the nails could not be compared")?;
    let mut order: Vec<&NailOutcome> = job.candidates.iter().collect();
    // Working nails first, fewest nails first; refused nails last.
    order.sort_by_key(|candidate| {
        (
            !candidate.feasible,
            candidate
                .plan
                .as_ref()
                .map_or(u64::MAX, |plan| plan.total_nail_count),
        )
    });
    let base = ReachBase {
        project: &project,
        wind: &job.wind,
        layout: &job.layout,
    };
    let mut cache = ReachCache::new();
    let comparison = Comparison {
        project: &project,
        rows: order
            .iter()
            .map(|candidate| compare_row(&base, &mut cache, candidate))
            .collect::<Result<_>>()?,
        built_in_coefficients: job.wind.built_in_rows_used(),
    };
    if let Some(folder) = &args.out {
        super::compare_report::write_report(&comparison, folder)?;
    }
    if args.json {
        outln!(
            "{}",
            serde_json::to_string_pretty(&to_json(&job, &order, &comparison))?
        );
    } else {
        out!("{}", console_text(&job, &order, &comparison));
        out!("{}", caution_lines(job.wind.built_in_rows_used()));
    }
    Ok(Outcome::Works)
}

fn zone_names(job: &Job) -> Vec<String> {
    job.wind
        .zones
        .iter()
        .map(|zone| zone.label.as_str().to_string())
        .collect()
}

fn to_json(job: &Job, order: &[&NailOutcome], comparison: &Comparison) -> serde_json::Value {
    let project = comparison.project;
    let zone_names = zone_names(job);
    let nails: Vec<serde_json::Value> = order
        .iter()
        .zip(&comparison.rows)
        .map(|(candidate, row)| {
            let zones: Vec<serde_json::Value> = candidate
                .plan
                .iter()
                .flat_map(|plan| &plan.zone_roles)
                .map(|role| {
                    json!({
                        "label": zone_names.get(role.zone_index),
                        "support_role": role.support_role.as_str(),
                        "spacing_mm": role.spacing_mm,
                        "utilization": role.utilization,
                        "nail_count": role.nail_count,
                    })
                })
                .collect();
            let reach = row.reach.map(|reach| {
                json!({
                    "input": reach.measure.key(),
                    "unit": reach.measure.unit(),
                    "status": reach.status(),
                    "value": reach.value(reach.measure.decimals() + 1),
                    "tolerance": reach.measure.tolerance(),
                    "given": reach.given,
                })
            });
            json!({
                "nail": row.nail_id,
                "description": row.description,
                "penetration_mm": row.penetration_mm,
                "withdrawal_n": row.withdrawal_n,
                "pull_through_n": row.pull_through_n,
                "resistance_n": row.governing_n,
                "governing_mode": row.governing_mode,
                "refused": row.refused,
                "feasible": row.feasible,
                "meets_prescriptive_minimum": row.meets_prescriptive_minimum,
                "prescriptive_reach": reach,
                "zones": zones,
                "total_nail_count": row.total_nail_count,
                "total_nail_mass_kg": row.total_nail_mass_kg,
                "total_nail_mass_lb": row.total_nail_mass_kg.map(|kg| kg / KG_PER_LB),
            })
        })
        .collect();
    let rule = prescriptive_minimum_length(project.basis, project.deck.thickness_mm);
    json!({
        "basis": project.basis.as_str(),
        "prescriptive_minimum": rule.map(|(length_mm, source)| json!({ "length_mm": length_mm, "source": source })),
        "prescriptive_reach_method": comparison.reach_method(),
        "nails": nails,
        "cautions": deckhold_schedule::cautions_for(comparison.built_in_coefficients),
    })
}

fn console_text(job: &Job, order: &[&NailOutcome], comparison: &Comparison) -> String {
    let project = comparison.project;
    let us = project.units.is_us();
    let zone_names = zone_names(job);
    let mut header: Vec<String> = ["nail", "withdrawal", "pull-thr.", "governs"]
        .map(str::to_string)
        .to_vec();
    let mut keys = Vec::new();
    for (zone_index, name) in zone_names.iter().enumerate() {
        for (role, short) in [
            (SupportRole::PanelEdge, "edge"),
            (SupportRole::Intermediate, "int."),
        ] {
            let present = job
                .candidates
                .iter()
                .filter_map(|candidate| candidate.plan.as_ref())
                .any(|plan| plan.zone_role(zone_index, role).is_some());
            if present {
                header.push(format!("{name} {short}"));
                keys.push((zone_index, role));
            }
        }
    }
    header.extend(["nails", "mass", "prescr.", "prescr. to", "works"].map(str::to_string));
    let header_refs: Vec<&str> = header.iter().map(String::as_str).collect();
    let mut table = Table::new(&header_refs);
    let dash = || "-".to_string();
    for (candidate, row) in order.iter().zip(&comparison.rows) {
        let mut cells = vec![row.nail_id.clone()];
        match &row.refused {
            None => {
                cells.push(
                    row.withdrawal_n
                        .map(|n| force_label(n, us))
                        .unwrap_or_else(dash),
                );
                cells.push(
                    row.pull_through_n
                        .map(|n| force_label(n, us))
                        .unwrap_or_else(dash),
                );
                cells.push(row.governing_mode.unwrap_or_default().to_string());
            }
            Some(reason) => {
                cells.extend([dash(), dash(), format!("refused: {reason}")]);
            }
        }
        for (zone_index, role) in &keys {
            let spacing = candidate
                .plan
                .as_ref()
                .and_then(|plan| plan.zone_role(*zone_index, *role))
                .map(|result| spacing_text(result.spacing_mm, project.units))
                .unwrap_or_else(dash);
            cells.push(spacing.replace(" o.c.", ""));
        }
        cells.push(
            row.total_nail_count
                .map(|count| count.to_string())
                .unwrap_or_else(dash),
        );
        cells.push(
            row.total_nail_mass_kg
                .map(|kg| mass_label(kg, us))
                .unwrap_or_else(dash),
        );
        cells.push(match row.meets_prescriptive_minimum {
            Some(true) => "yes".to_string(),
            Some(false) => "too short".to_string(),
            None => dash(),
        });
        cells.push(row.reach.map(|reach| reach.label()).unwrap_or_else(dash));
        cells.push(if row.feasible { "yes" } else { "no" }.to_string());
        table.row(cells);
    }
    let mut text = format!(
        "{}: nails compared on one deck ({})\n\n",
        project.basis.info().title,
        deckhold_project::report::deck_text(project, project.units)
    );
    text.push_str(&table.render());
    text.push('\n');
    if let Some((length_mm, source)) =
        prescriptive_minimum_length(project.basis, project.deck.thickness_mm)
    {
        text.push_str(&format!(
            "prescr.: at least {} long per {source}.\n",
            small_length_label(length_mm, us)
        ));
    }
    if let Some(method) = comparison.reach_method() {
        text.push_str(&format!("prescr. to: {method}\n"));
    }
    text
}
