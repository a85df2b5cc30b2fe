//! `deckhold compare`: several nails on one deck: capacity per nail, spacing per zone, nail count, mass,
//! and whether the nail meets the prescriptive minimum length. Sorted by total nail count.

use anyhow::{Context, Result};
use serde_json::json;

use super::{caution_lines, load_project, spacing_text};
use crate::args::CompareArgs;
use crate::table::Table;
use crate::Outcome;
use deckhold_deck::layout::SupportRole;
use deckhold_fasten::CatalogBasis;
use deckhold_project::rules::prescriptive_minimum_length;
use deckhold_project::{run_job_with_nails, BasisStandards, NailOutcome, Project};
use deckhold_schedule::format::{force_label, mass_label, small_length_label, KG_PER_LB};
use deckhold_schedule::Units;

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

pub fn run(args: &CompareArgs, units: Option<Units>) -> Result<Outcome> {
    let project = load_project(args.project.as_deref(), units)?;
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
    let us = project.units.is_us();
    let zone_names: Vec<String> = job
        .wind
        .zones
        .iter()
        .map(|zone| zone.label.as_str().to_string())
        .collect();
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
    let rule = prescriptive_minimum_length(project.basis, project.deck.thickness_mm);

    if args.json {
        let nails: Vec<serde_json::Value> = order
            .iter()
            .map(|candidate| {
                let (resistance_n, mode) = match &candidate.resistance {
                    Ok(resistance) => (
                        Some(resistance.governing_n),
                        Some(resistance.governing_mode.as_str()),
                    ),
                    Err(_) => (None, None),
                };
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
                let mass_kg = candidate.plan.as_ref().map(|plan| plan.total_nail_mass_kg);
                json!({
                    "nail": candidate.nail.id,
                    "description": candidate.nail.description,
                    "penetration_mm": candidate.penetration_mm,
                    "resistance_n": resistance_n,
                    "governing_mode": mode,
                    "refused": candidate.resistance.as_ref().err(),
                    "feasible": candidate.feasible,
                    "meets_prescriptive_minimum": meets_prescriptive(&project, candidate),
                    "zones": zones,
                    "total_nail_count": candidate.plan.as_ref().map(|plan| plan.total_nail_count),
                    "total_nail_mass_kg": mass_kg,
                    "total_nail_mass_lb": mass_kg.map(|kg| kg / KG_PER_LB),
                })
            })
            .collect();
        let value = json!({
            "basis": project.basis.as_str(),
            "prescriptive_minimum": rule.map(|(length_mm, source)| json!({ "length_mm": length_mm, "source": source })),
            "nails": nails,
            "cautions": deckhold_schedule::standard_cautions(),
        });
        outln!("{}", serde_json::to_string_pretty(&value)?);
        return Ok(Outcome::Works);
    }

    let mut header = vec![
        "nail".to_string(),
        "per nail".to_string(),
        "mode".to_string(),
    ];
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
    header.extend([
        "nails".to_string(),
        "mass".to_string(),
        "prescr.".to_string(),
        "works".to_string(),
    ]);
    let header_refs: Vec<&str> = header.iter().map(String::as_str).collect();
    let mut table = Table::new(&header_refs);
    for candidate in &order {
        let mut cells = vec![candidate.nail.id.clone()];
        match &candidate.resistance {
            Ok(resistance) => {
                cells.push(force_label(resistance.governing_n, us));
                cells.push(resistance.governing_mode.as_str().to_string());
            }
            Err(reason) => {
                cells.push("-".to_string());
                cells.push(format!("refused: {reason}"));
            }
        }
        for (zone_index, role) in &keys {
            let spacing = candidate
                .plan
                .as_ref()
                .and_then(|plan| plan.zone_role(*zone_index, *role))
                .map(|result| spacing_text(result.spacing_mm, project.units))
                .unwrap_or_else(|| "-".to_string());
            cells.push(spacing.replace(" o.c.", ""));
        }
        match &candidate.plan {
            Some(plan) => {
                cells.push(plan.total_nail_count.to_string());
                cells.push(mass_label(plan.total_nail_mass_kg, us));
            }
            None => {
                cells.push("-".to_string());
                cells.push("-".to_string());
            }
        }
        cells.push(match meets_prescriptive(&project, candidate) {
            Some(true) => "yes".to_string(),
            Some(false) => "too short".to_string(),
            None => "-".to_string(),
        });
        cells.push(if candidate.feasible { "yes" } else { "no" }.to_string());
        table.row(cells);
    }
    outln!(
        "{}: nails compared on one deck ({})\n",
        project.basis.info().title,
        deckhold_project::report::deck_text(&project, project.units)
    );
    out!("{}", table.render());
    if let Some((length_mm, source)) = rule {
        outln!(
            "\nprescr.: at least {} long per {source}.",
            small_length_label(length_mm, us)
        );
    }
    out!("{}", caution_lines());
    Ok(Outcome::Works)
}
