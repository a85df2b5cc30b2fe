//! `deckhold zones`: the roof's wind zones and their net design uplift at one effective wind area.

use anyhow::{bail, Context, Result};
use serde_json::json;

use super::{caution_lines, load_project};
use crate::args::ZonesArgs;
use crate::table::Table;
use crate::Outcome;
use deckhold_project::units::M_PER_FT;
use deckhold_project::BasisStandards;

/// A nail holds well under a square metre; 0.1 m² is on the figures' small-area plateau.
const DEFAULT_AREA_M2: f64 = 0.1;

pub fn run(args: &ZonesArgs) -> Result<Outcome> {
    let project = load_project(args.project.as_deref())?;
    let area_m2 = match (args.area_m2, args.area_ft2) {
        (Some(area_m2), _) => area_m2,
        (None, Some(area_ft2)) => area_ft2 * M_PER_FT * M_PER_FT,
        (None, None) => DEFAULT_AREA_M2,
    };
    if !(area_m2.is_finite() && area_m2 > 0.0 && area_m2 <= 10_000.0) {
        bail!("--area-m2 / --area-ft2: {area_m2} m² is outside 0..10000 m²");
    }
    let wind =
        deckhold_wind::analyze(&project.wind).context("the wind zones could not be computed")?;
    let mut rows = Vec::with_capacity(wind.zones.len());
    for (index, zone) in wind.zones.iter().enumerate() {
        let uplift = wind.uplift(index, area_m2)?;
        rows.push((zone, uplift));
    }
    if args.json {
        let zones: Vec<serde_json::Value> = rows
            .iter()
            .map(|(zone, uplift)| {
                json!({
                    "label": zone.label.as_str(),
                    "code_zone": zone.code_zone,
                    "area_m2": zone.area_m2,
                    "cp_ext": uplift.cp_ext,
                    "cp_int": uplift.cp_int,
                    "external_kpa": uplift.external_kpa,
                    "internal_kpa": uplift.internal_kpa,
                    "dead_counteracting_kpa": uplift.dead_counteracting_kpa,
                    "net_uplift_kpa": uplift.net_uplift_kpa,
                    "source": uplift.source,
                    "polygons_m": zone.polygons_m,
                })
            })
            .collect();
        let value = json!({
            "basis": project.basis.as_str(),
            "effective_area_m2": area_m2,
            "edge_width_m": wind.edge_width_m,
            "q_kpa": wind.q_kpa,
            "mean_roof_height_m": wind.mean_roof_height_m,
            "zones": zones,
            "warnings": wind.warnings,
            "cautions": deckhold_schedule::standard_cautions(),
        });
        println!("{}", serde_json::to_string_pretty(&value)?);
        return Ok(Outcome::Works);
    }
    println!(
        "{}\nEdge / end-zone width {:.2} m, velocity pressure {:.3} kPa, mean roof height {:.2} m, effective area {area_m2:.3} m²\n",
        project.basis.info().title,
        wind.edge_width_m,
        wind.q_kpa,
        wind.mean_roof_height_m
    );
    let mut table = Table::new(&[
        "zone",
        "code",
        "area m2",
        "cp ext",
        "cp int",
        "wind kPa",
        "dead kPa",
        "net uplift kPa",
    ]);
    for (zone, uplift) in &rows {
        table.row(vec![
            zone.label.as_str().to_string(),
            zone.code_zone.clone(),
            format!("{:.2}", zone.area_m2),
            format!("{:.2}", uplift.cp_ext),
            format!("{:.2}", uplift.cp_int),
            format!("{:.3}", uplift.wind_factored_kpa),
            format!("{:.3}", uplift.dead_counteracting_kpa),
            format!("{:.3}", uplift.net_uplift_kpa),
        ]);
    }
    print!("{}", table.render());
    println!("\nFactors:");
    for factor in &wind.factors {
        println!(
            "  {} = {:.4}  ({})",
            factor.name, factor.value, factor.source
        );
    }
    for warning in &wind.warnings {
        println!("Warning: {warning}");
    }
    print!("{}", caution_lines());
    Ok(Outcome::Works)
}
