//! `deckhold compare`: several nails on one deck: capacity per nail, spacing per zone, nail count, mass.

use anyhow::{Context, Result};
use serde_json::json;

use super::{caution_lines, load_project, spacing_text};
use crate::args::CompareArgs;
use crate::table::Table;
use crate::Outcome;
use deckhold_fasten::layout::SupportRole;
use deckhold_project::run_job_with_nails;

pub fn run(args: &CompareArgs) -> Result<Outcome> {
    let project = load_project(args.project.as_deref())?;
    let nail_ids: Vec<String> = if args.nails.is_empty() {
        project.nails.clone()
    } else {
        args.nails.iter().map(|id| id.trim().to_string()).collect()
    };
    let job = run_job_with_nails(&project, &nail_ids).context("the nails could not be compared")?;
    let us = project.basis.is_us();
    // The zones in the order the wind analysis gives them, each with both support roles.
    let zone_names: Vec<String> = job
        .wind
        .zones
        .iter()
        .map(|zone| zone.label.as_str().to_string())
        .collect();

    if args.json {
        let nails: Vec<serde_json::Value> = job
            .candidates
            .iter()
            .map(|candidate| {
                let (resistance_n, mode) = match &candidate.resistance {
                    Ok(resistance) => (Some(resistance.governing_n), Some(resistance.governing_mode.as_str())),
                    Err(_) => (None, None),
                };
                let zones: Vec<serde_json::Value> = candidate
                    .plan
                    .iter()
                    .flat_map(|plan| &plan.zone_roles)
                    .map(|role| {
                        json!({
                            "label": zone_names.get(role.zone_index),
                            "support_role": deckhold_fasten::spacing::role_name(role.support_role),
                            "spacing_mm": role.spacing_mm,
                            "utilization": role.utilization,
                            "nail_count": role.nail_count,
                        })
                    })
                    .collect();
                json!({
                    "nail": candidate.nail.id,
                    "description": candidate.nail.description,
                    "penetration_mm": candidate.penetration_mm,
                    "resistance_n": resistance_n,
                    "governing_mode": mode,
                    "refused": candidate.resistance.as_ref().err(),
                    "feasible": candidate.feasible,
                    "zones": zones,
                    "total_nail_count": candidate.plan.as_ref().map(|plan| plan.total_nail_count),
                    "total_nail_mass_kg": candidate.plan.as_ref().map(|plan| plan.total_nail_mass_kg),
                })
            })
            .collect();
        let value = json!({
            "basis": project.basis.id(),
            "nails": nails,
            "cautions": deckhold_schedule::standard_cautions(),
        });
        println!("{}", serde_json::to_string_pretty(&value)?);
        return Ok(Outcome::Works);
    }

    let mut header = vec![
        "nail".to_string(),
        "N per nail".to_string(),
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
    header.extend(["nails".to_string(), "kg".to_string(), "works".to_string()]);
    let header_refs: Vec<&str> = header.iter().map(String::as_str).collect();
    let mut table = Table::new(&header_refs);
    for candidate in &job.candidates {
        let mut cells = vec![candidate.nail.id.clone()];
        match &candidate.resistance {
            Ok(resistance) => {
                cells.push(format!("{:.0}", resistance.governing_n));
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
                .map(|result| spacing_text(result.spacing_mm, us))
                .unwrap_or_else(|| "-".to_string());
            cells.push(spacing);
        }
        match &candidate.plan {
            Some(plan) => {
                cells.push(plan.total_nail_count.to_string());
                cells.push(format!("{:.1}", plan.total_nail_mass_kg));
            }
            None => {
                cells.push("-".to_string());
                cells.push("-".to_string());
            }
        }
        cells.push(if candidate.feasible { "yes" } else { "no" }.to_string());
        table.row(cells);
    }
    println!(
        "{}: nails compared on one deck\n",
        project.basis.info().title
    );
    print!("{}", table.render());
    print!("{}", caution_lines());
    Ok(Outcome::Works)
}
