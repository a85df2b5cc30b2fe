//! `deckhold zones`: the roof's wind zones and their net design uplift at one effective wind area.

use anyhow::{bail, Context, Result};
use deckhold_schedule::format::fixed;
use serde_json::json;

use super::{caution_lines, load_project};
use crate::args::ZonesArgs;
use crate::table::Table;
use crate::Outcome;
use deckhold_project::units::M_PER_FT;
use deckhold_project::BasisStandards;
use deckhold_schedule::format::{plan_length_label, pressure_label, pressure_value, sig3};
use deckhold_schedule::Units;

/// A nail holds well under a square metre; 0.1 m² is on the figures' small-area plateau.
const DEFAULT_AREA_M2: f64 = 0.1;

pub fn run(
    args: &ZonesArgs,
    units: Option<Units>,
    table: Option<&std::path::Path>,
) -> Result<Outcome> {
    let project = load_project(args.project.as_deref(), units, table)?;
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
            "cautions": deckhold_schedule::cautions_for(wind.built_in_rows_used()),
        });
        outln!("{}", serde_json::to_string_pretty(&value)?);
        return Ok(Outcome::Works);
    }
    let us = project.units.is_us();
    let area = |m2: f64| {
        if us {
            format!("{} ft²", sig3(m2 / (M_PER_FT * M_PER_FT)))
        } else {
            format!("{} m²", sig3(m2))
        }
    };
    outln!(
        "{}\nEdge / end-zone width {}, velocity pressure {}, mean roof height {}, effective area {}\n",
        project.basis.info().title,
        plan_length_label(wind.edge_width_m, us),
        pressure_label(wind.q_kpa, us),
        plan_length_label(wind.mean_roof_height_m, us),
        area(area_m2)
    );
    let pressure_unit = if us { "psf" } else { "kPa" };
    let (area_head, wind_head, dead_head, net_head) = (
        if us { "area ft2" } else { "area m2" },
        format!("wind {pressure_unit}"),
        format!("dead {pressure_unit}"),
        format!("net uplift {pressure_unit}"),
    );
    let mut table = Table::new(&[
        "zone", "code", area_head, "cp ext", "cp int", &wind_head, &dead_head, &net_head,
    ]);
    for (zone, uplift) in &rows {
        let zone_area = if us {
            zone.area_m2 / (M_PER_FT * M_PER_FT)
        } else {
            zone.area_m2
        };
        table.row(vec![
            zone.label.as_str().to_string(),
            zone.code_zone.clone(),
            fixed(zone_area, 1),
            fixed(uplift.cp_ext, 2),
            fixed(uplift.cp_int, 2),
            pressure_value(uplift.wind_factored_kpa, us),
            pressure_value(uplift.dead_counteracting_kpa, us),
            pressure_value(uplift.net_uplift_kpa, us),
        ]);
    }
    out!("{}", table.render());
    outln!("\nFactors:");
    for factor in &wind.factors {
        outln!(
            "  {} = {}  ({})",
            factor.name,
            fixed(factor.value, 4),
            factor.source
        );
    }
    for warning in &wind.warnings {
        outln!("Warning: {warning}");
    }
    out!("{}", caution_lines(wind.built_in_rows_used()));
    Ok(Outcome::Works)
}
