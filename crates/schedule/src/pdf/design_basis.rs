//! Pages from 2, for the designer and the reviewer: who and where, the basis and its editions, every
//! input, the wind factors, the pressure on each zone, how the nail's resistance was derived, the checks
//! per zone, and where every value came from.

use super::canvas::Align;
use super::canvas::Canvas;
use super::flow::{Column, Flow, Row, TableLook};
use super::page::Frame;
use crate::format::{
    fixed, force_label, places, plan_length_label, pressure_label, small_length_label,
    spacing_label, trimmed,
};
use crate::{Schedule, Units};

/// Type size of the design basis tables, pt.
const TABLE_PT: f64 = 8.0;
/// Tables with column titles and shaded alternate rows.
const LISTING: TableLook = TableLook {
    zebra: true,
    header: true,
};

fn key_value_table(flow: &mut Flow, rows: Vec<(&str, String)>) {
    let columns = [
        Column::new("item", 0.3, Align::Left),
        Column::new("value", 0.7, Align::Left),
    ];
    let groups: Vec<Vec<Row>> = rows
        .into_iter()
        .map(|(key, value)| vec![Row::new(vec![key.to_string(), value])])
        .collect();
    flow.table(
        &columns,
        &groups,
        TABLE_PT,
        TableLook {
            zebra: false,
            header: false,
        },
    );
}

/// A coefficient or factor as given: enough places to show it, no trailing zeros.
fn factor_value(value: f64) -> String {
    trimmed(value, 4)
}

/// Lays out the design basis pages.
pub(crate) fn design_basis(schedule: &Schedule, frame: &Frame) -> Vec<Canvas> {
    let imperial = schedule.basis.units == Units::Imperial;
    let mut flow = Flow::new(frame);
    flow.title("DESIGN BASIS");
    if !schedule.feasible {
        flow.bold_paragraph(
            "This schedule is NOT complete: at least one zone has no working spacing with the chosen nail. \
             See the alternatives below.",
            10.0,
        );
    }

    flow.heading("Project");
    let project = &schedule.project;
    let mut rows = vec![
        ("project", project.name.clone()),
        ("site", project.site.clone()),
        ("owner", project.owner.clone()),
        ("prepared by", project.prepared_by.clone()),
        ("date", project.date.clone()),
    ];
    if !project.notes.is_empty() {
        rows.push(("notes", project.notes.clone()));
    }
    key_value_table(&mut flow, rows);

    flow.heading("Basis and editions");
    let basis = &schedule.basis;
    let units = match basis.units {
        Units::Si => "SI (mm, kPa, N)",
        Units::Imperial => "US customary first (in, psf, lbf), SI in brackets",
    };
    key_value_table(
        &mut flow,
        vec![
            ("basis", format!("{} ({})", basis.title, basis.id)),
            ("wind", basis.wind_standard.clone()),
            ("fasteners", basis.fastener_standard.clone()),
            ("units", units.to_string()),
        ],
    );

    flow.heading("Roof, framing and deck");
    key_value_table(
        &mut flow,
        vec![
            (
                "building length",
                plan_length_label(schedule.building_length_m, imperial),
            ),
            (
                "building width",
                plan_length_label(schedule.building_width_m, imperial),
            ),
            (
                "framing",
                format!(
                    "{} at {} on centre",
                    crate::format::plural(&schedule.framing_member),
                    spacing_label(Some(schedule.framing_spacing_mm), imperial)
                ),
            ),
            ("deck", schedule.deck_description.clone()),
            ("panel laying", schedule.panel_laying.clone()),
            (
                "edge zone width",
                plan_length_label(schedule.edge_width_m, imperial),
            ),
            (
                "nails in total",
                format!(
                    "{} ({} kg)",
                    schedule.total_nail_count,
                    fixed(schedule.total_nail_mass_kg, places::MASS_KG)
                ),
            ),
        ],
    );

    flow.heading("Inputs as given");
    let columns = [
        Column::new("key", 0.4, Align::Left),
        Column::new("value", 0.6, Align::Left),
    ];
    let groups: Vec<Vec<Row>> = schedule
        .inputs
        .iter()
        .map(|input| vec![Row::new(vec![input.key.clone(), input.value.clone()])])
        .collect();
    if groups.is_empty() {
        flow.paragraph("(none recorded)", 8.5);
    } else {
        flow.table(&columns, &groups, TABLE_PT, LISTING);
    }

    flow.heading("Wind factors");
    factor_table(&mut flow, &schedule.wind_factors);

    flow.heading("Pressure on each zone (at the effective wind area of one nail)");
    let columns = [
        Column::new("zone", 0.17, Align::Left),
        Column::new("area m\u{00B2}", 0.08, Align::Right),
        Column::new("eff. area m\u{00B2}", 0.09, Align::Right),
        Column::new("Cp ext.", 0.08, Align::Right),
        Column::new("Cp int.", 0.08, Align::Right),
        Column::new("external", 0.125, Align::Right),
        Column::new("internal", 0.125, Align::Right),
        Column::new("dead load counted", 0.125, Align::Right),
        Column::new("net uplift", 0.125, Align::Right),
    ];
    let groups: Vec<Vec<Row>> = schedule
        .zone_pressures
        .iter()
        .map(|row| {
            vec![Row {
                cells: vec![
                    format!("{} ({})", row.label, row.code_zone),
                    fixed(row.area_m2, places::AREA_M2),
                    fixed(row.effective_area_m2, places::AREA_M2),
                    fixed(row.cp_ext, places::COEFFICIENT),
                    fixed(row.cp_int, places::COEFFICIENT),
                    pressure_label(row.external_kpa, imperial),
                    pressure_label(row.internal_kpa, imperial),
                    pressure_label(row.dead_counteracting_kpa, imperial),
                    pressure_label(row.net_uplift_kpa, imperial),
                ],
                bold: false,
                note: Some(format!(
                    "{} ({}); source: {}",
                    row.figure, row.coefficient_status, row.source
                )),
            }]
        })
        .collect();
    flow.table(&columns, &groups, 7.5, LISTING);

    flow.heading("The nail and its resistance");
    let nail = &schedule.nail;
    let resistance = &schedule.resistance;
    let pull_through = match resistance.pull_through_n {
        Some(n) if resistance.pull_through_is_advisory => {
            format!("{} (advisory check)", force_label(n, imperial))
        }
        Some(n) => force_label(n, imperial),
        None => "not checked".to_string(),
    };
    key_value_table(
        &mut flow,
        vec![
            ("nail", format!("{} ({})", nail.description, nail.id)),
            (
                "dimensions",
                format!(
                    "length {}, shank {} {}, head {}, {}",
                    small_length_label(nail.length_mm, imperial),
                    small_length_label(nail.shank_diameter_mm, imperial),
                    nail.shank,
                    small_length_label(nail.head_diameter_mm, imperial),
                    nail.material
                ),
            ),
            ("nail source", nail.source.clone()),
            (
                "penetration into the framing",
                small_length_label(resistance.penetration_mm, imperial),
            ),
            ("withdrawal", force_label(resistance.withdrawal_n, imperial)),
            ("head pull-through", pull_through),
            (
                "governing resistance",
                format!(
                    "{} ({})",
                    force_label(resistance.governing_n, imperial),
                    resistance.governing_mode
                ),
            ),
        ],
    );
    factor_table(&mut flow, &resistance.factors);

    flow.heading("Checks per zone and support");
    let columns = [
        Column::new("zone", 0.16, Align::Left),
        Column::new("support", 0.11, Align::Left),
        Column::new("spacing", 0.1, Align::Right),
        Column::new("net uplift", 0.12, Align::Right),
        Column::new("demand per nail", 0.12, Align::Right),
        Column::new("resistance per nail", 0.12, Align::Right),
        Column::new("util.", 0.06, Align::Right),
        Column::new("governs", 0.14, Align::Left),
        Column::new("line", 0.07, Align::Right),
    ];
    let groups: Vec<Vec<Row>> = schedule
        .zones
        .iter()
        .map(|row| {
            vec![Row {
                cells: vec![
                    format!("{} ({})", row.label, row.code_zone),
                    row.support_role.to_string(),
                    spacing_label(row.spacing_mm, imperial),
                    pressure_label(row.net_uplift_kpa, imperial),
                    force_label(row.demand_n, imperial),
                    force_label(row.resistance_n, imperial),
                    fixed(row.utilization, places::UTILIZATION),
                    format!("{}; {}", row.governing_check, row.governing_mode),
                    row.governing_line.to_string(),
                ],
                bold: row.spacing_mm.is_none(),
                note: None,
            }]
        })
        .collect();
    flow.table(&columns, &groups, 7.5, LISTING);

    if !schedule.feasible || !schedule.alternatives.is_empty() {
        flow.heading("Alternatives");
        if schedule.alternatives.is_empty() {
            flow.paragraph("No alternative was found: refer to the designer.", 8.5);
        } else {
            flow.bullets(&schedule.alternatives, 8.5);
        }
    }

    flow.heading("Where the values come from");
    if schedule.provenance.is_empty() {
        flow.paragraph("(none recorded)", 8.5);
    } else {
        flow.bullets(&schedule.provenance, 8.0);
    }

    flow.heading("Warnings");
    if schedule.warnings.is_empty() {
        flow.paragraph("None.", 8.5);
    } else {
        flow.bullets(&schedule.warnings, 8.5);
    }
    flow.finish()
}

fn factor_table(flow: &mut Flow, factors: &[crate::FactorRow]) {
    if factors.is_empty() {
        flow.paragraph("(none recorded)", 8.5);
        return;
    }
    let columns = [
        Column::new("factor", 0.36, Align::Left),
        Column::new("value", 0.12, Align::Right),
        Column::new("source", 0.52, Align::Left),
    ];
    let groups: Vec<Vec<Row>> = factors
        .iter()
        .map(|factor| {
            vec![Row::new(vec![
                factor.name.clone(),
                factor_value(factor.value),
                factor.source.clone(),
            ])]
        })
        .collect();
    flow.table(&columns, &groups, TABLE_PT, LISTING);
}
