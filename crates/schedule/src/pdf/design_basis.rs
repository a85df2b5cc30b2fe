//! Pages from 2, for the designer and the reviewer: who and where, the basis and its editions, every
//! input, the wind factors, the pressure on each zone, how the nail's resistance was derived, the checks
//! per zone, and where every value came from.

use super::canvas::Align;
use super::canvas::Canvas;
use super::flow::{Column, Flow, Row, TableLook};
use super::page::Frame;
use crate::format::{
    fixed, force_label, mass_label, on_center, places, plan_length_label, pressure_label, sig3,
    small_length_label, spacing_label, KPA_PER_PSF, MM_PER_FT, MM_PER_IN, N_PER_LBF,
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

/// A factor's name and value in the report's units: a unit-suffixed name (`edge_width_m`, `q_h_psf`,
/// `D (mm)`) is shown with the unit in words and the value converted; three significant figures.
fn factor_display(name: &str, value: f64, imperial: bool) -> (String, String) {
    // (suffix in the name, SI or US, factor to the other system, the other system's suffix)
    const SUFFIXES: [(&str, &str, f64, &str); 10] = [
        ("_m", "m", 1000.0 / MM_PER_FT, "ft"),
        ("_ft", "ft", MM_PER_FT / 1000.0, "m"),
        ("_mm", "mm", 1.0 / MM_PER_IN, "in"),
        ("_kpa", "kPa", 1.0 / KPA_PER_PSF, "psf"),
        ("_psf", "psf", KPA_PER_PSF, "kPa"),
        (" (mm)", "mm", 1.0 / MM_PER_IN, "in"),
        (" (N)", "N", 1.0 / N_PER_LBF, "lb"),
        (" (N/mm)", "N/mm", MM_PER_IN / N_PER_LBF, "lb/in"),
        (" (in)", "in", MM_PER_IN, "mm"),
        (" (lbf)", "lb", N_PER_LBF, "N"),
    ];
    let us_units = ["ft", "psf", "in", "lb"];
    for (suffix, unit, to_other, other) in SUFFIXES {
        if let Some(stem) = name.strip_suffix(suffix) {
            let is_us_unit = us_units.contains(&unit);
            let (shown_unit, shown_value) = if is_us_unit == imperial {
                (unit, value)
            } else {
                (other, value * to_other)
            };
            return (format!("{stem} ({shown_unit})"), sig3(shown_value));
        }
    }
    (name.to_string(), sig3(value))
}

/// A reaction width in the report's units, three significant figures: `697 mm` or `27.4 in`.
fn width_label(mm: f64, imperial: bool) -> String {
    if imperial {
        format!("{} in", sig3(mm / MM_PER_IN))
    } else {
        format!("{} mm", sig3(mm))
    }
}

/// The standard's symbols for the external and internal coefficients.
fn coefficient_symbols(basis_id: &str) -> (&'static str, &'static str) {
    if basis_id.starts_with("nbc") {
        ("C_pC_g", "C_piC_gi")
    } else {
        ("(GC_p)", "(GC_pi)")
    }
}

/// An area in the report's units, three significant figures.
fn area_label(m2: f64, imperial: bool) -> String {
    if imperial {
        let m_per_ft = MM_PER_FT / 1000.0;
        format!("{} ft\u{00B2}", sig3(m2 / (m_per_ft * m_per_ft)))
    } else {
        format!("{} m\u{00B2}", sig3(m2))
    }
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
        Units::Si => "SI (mm, m, kPa, N)",
        Units::Imperial => "US customary (in, ft-in, psf, lb)",
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
                    "{} at {} {}",
                    crate::format::plural(&schedule.framing_member),
                    spacing_label(Some(schedule.framing_spacing_mm), imperial),
                    on_center(imperial)
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
                    "{} ({})",
                    schedule.total_nail_count,
                    mass_label(schedule.total_nail_mass_kg, imperial)
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
    if !schedule.derived.is_empty() {
        flow.heading("Values used (derived from the inputs)");
        let groups: Vec<Vec<Row>> = schedule
            .derived
            .iter()
            .map(|input| vec![Row::new(vec![input.key.clone(), input.value.clone()])])
            .collect();
        flow.table(&columns, &groups, TABLE_PT, LISTING);
    }

    flow.heading("Wind factors");
    factor_table(&mut flow, &schedule.wind_factors, imperial);

    flow.heading("Pressure on each zone (at the effective wind area of one nail)");
    let (external_symbol, internal_symbol) = coefficient_symbols(&schedule.basis.id);
    let external_head = format!("{external_symbol} external peak coefficient");
    let internal_head = format!("{internal_symbol} internal coefficient");
    let columns = [
        Column::new("zone", 0.15, Align::Left),
        Column::new("zone area", 0.09, Align::Right),
        Column::new("A, effective wind area", 0.1, Align::Right),
        Column::new(&external_head, 0.11, Align::Right),
        Column::new(&internal_head, 0.1, Align::Right),
        Column::new("p_e, external (unfactored)", 0.115, Align::Right),
        Column::new("p_i, internal (unfactored)", 0.115, Align::Right),
        Column::new("p_D, dead load counted", 0.11, Align::Right),
        Column::new("p_net, net uplift (factored)", 0.11, Align::Right),
    ];
    let groups: Vec<Vec<Row>> = schedule
        .zone_pressures
        .iter()
        .map(|row| {
            vec![Row::new(vec![
                format!("{} ({})", row.label, row.code_zone),
                area_label(row.area_m2, imperial),
                area_label(row.effective_area_m2, imperial),
                sig3(row.cp_ext),
                sig3(row.cp_int),
                pressure_label(row.external_kpa, imperial),
                pressure_label(row.internal_kpa, imperial),
                pressure_label(row.dead_counteracting_kpa, imperial),
                pressure_label(row.net_uplift_kpa, imperial),
            ])]
        })
        .collect();
    flow.table(&columns, &groups, 7.5, LISTING);
    equations(&mut flow, schedule, imperial);
    let mut sources: Vec<String> = schedule
        .zone_pressures
        .iter()
        .map(|row| {
            format!(
                "{} ({}): {} ({}); source: {}",
                row.label, row.code_zone, row.figure, row.coefficient_status, row.source
            )
        })
        .collect();
    sources.dedup();
    flow.heading("Notes on the coefficients");
    flow.paragraph(
        "Coefficients marked 'from memory' must be checked against the printed standard before use; \
         a project can override any zone's curve from the printed figure.",
        8.0,
    );
    flow.bullets(&sources, 7.5);

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
    factor_table(&mut flow, &resistance.factors, imperial);

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

/// The net-uplift and per-nail demand equations with the numbers put in, for the line that governs each
/// zone's intermediate supports (the role the strength check usually sets) and panel edges.
fn equations(flow: &mut Flow, schedule: &Schedule, imperial: bool) {
    let wind_factor = schedule
        .wind_factors
        .iter()
        .find(|factor| factor.name == "wind_load_factor")
        .map(|factor| factor.value);
    let mut lines = Vec::new();
    for pressure in &schedule.zone_pressures {
        if let Some(gamma) = wind_factor {
            lines.push(format!(
                "{} ({}): p_net = \u{03B3}_W (p_e + p_i) \u{2212} p_D = {} \u{00D7} ({} + {}) \u{2212} {} = {}",
                pressure.label,
                pressure.code_zone,
                sig3(gamma),
                pressure_label(pressure.external_kpa, imperial),
                pressure_label(pressure.internal_kpa, imperial),
                pressure_label(pressure.dead_counteracting_kpa, imperial),
                pressure_label(pressure.net_uplift_kpa, imperial),
            ));
        }
        for row in schedule
            .zones
            .iter()
            .filter(|row| row.label == pressure.label)
        {
            let Some(spacing_mm) = row.spacing_mm else {
                continue;
            };
            // The reaction width the spacing check used, recovered from its own demand: F = p w s.
            let width_m = row.demand_n / (row.net_uplift_kpa * spacing_mm);
            let width_mm = width_m * 1000.0;
            lines.push(format!(
                "    {} on line {}: F = p_net \u{00D7} w \u{00D7} s = {} \u{00D7} {} \u{00D7} {} = {} \u{2264} R = {} (utilization {})",
                row.support_role,
                row.governing_line,
                pressure_label(row.net_uplift_kpa, imperial),
                width_label(width_mm, imperial),
                spacing_label(Some(spacing_mm), imperial),
                force_label(row.demand_n, imperial),
                force_label(row.resistance_n, imperial),
                fixed(row.utilization, 2),
            ));
        }
    }
    if lines.is_empty() {
        return;
    }
    flow.heading("Net uplift and demand per nail, numbers put in (governing line of each zone)");
    flow.paragraph(
        "w is the reaction width of the support (from the deck solved as a continuous strip over the \
         framing), s the nail spacing along it, R the resistance per nail.",
        8.0,
    );
    for line in lines {
        flow.paragraph(&line, 7.5);
    }
}

fn factor_table(flow: &mut Flow, factors: &[crate::FactorRow], imperial: bool) {
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
            let (name, value) = factor_display(&factor.name, factor.value, imperial);
            vec![Row::new(vec![name, value, factor.source.clone()])]
        })
        .collect();
    flow.table(&columns, &groups, TABLE_PT, LISTING);
}
