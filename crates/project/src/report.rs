//! From a worked [`Job`] to the report data the writers print ([`Schedule`]).
//!
//! Only gathering and naming here: every number is one the wind, resistance or spacing step computed.

use crate::basis::BasisStandards;
use crate::job::{Job, NailOutcome};
use crate::project::{EdgeBlocking, Project, StaggerChoice, StartCorner};
use crate::rules::spacing_rule_sources;
use deckhold_deck::layout::{Course, DeckLayout, LineKind, SupportRole};
use deckhold_deck::spacing::{DeckPlan, RafterLine};
use deckhold_model::format::{
    feet_inches, fixed, lengths_for_reader, m_to_ft, message_for_reader, thickness_label, trimmed,
};
use deckhold_model::Units;
use deckhold_model::{
    cautions_for, plane_name, BasisInfo, FactorRow, LayingRow, LineRow, NailInfo, PlanEdge,
    PlanLine, PlanPlane, PlanView, PlanZone, ResistanceInfo, Schedule, SegmentRow, ZonePressureRow,
    ZoneRow,
};
use deckhold_wind::{Footprint, PlaneEdge, RoofPlane, WindAnalysis};

/// The report for the job's chosen nail.
pub fn schedule_for(project: &Project, job: &Job) -> Schedule {
    let outcome = job.chosen();
    let wind = &job.wind;
    let plan = outcome.plan.as_ref();
    let nail = &outcome.nail;
    let (building_length_m, building_width_m) = plan_size_m(&project.wind.building.footprint);

    let resistance = match &outcome.resistance {
        Ok(resistance) => ResistanceInfo {
            withdrawal_n: resistance.withdrawal_n,
            pull_through_n: resistance.pull_through_n,
            pull_through_is_advisory: resistance.pull_through_is_advisory,
            governing_n: resistance.governing_n,
            governing_mode: resistance.governing_mode.as_str().to_string(),
            penetration_mm: outcome.penetration_mm,
            factors: resistance
                .factors
                .iter()
                .map(|factor| FactorRow {
                    name: if factor.unit.is_empty() {
                        factor.name.clone()
                    } else {
                        format!("{} ({})", factor.name, factor.unit)
                    },
                    value: factor.value,
                    source: factor.source.replace('`', ""),
                })
                .collect(),
        },
        Err(_) => ResistanceInfo {
            withdrawal_n: 0.0,
            pull_through_n: None,
            pull_through_is_advisory: false,
            governing_n: 0.0,
            governing_mode: "none".to_string(),
            penetration_mm: outcome.penetration_mm,
            factors: Vec::new(),
        },
    };

    let zone_pressures = zone_pressures(wind, plan);
    let zones = zone_rows_of(job);
    let lines = plan.map(|plan| line_rows(wind, plan)).unwrap_or_default();

    let mut warnings = wind.warnings.clone();
    if let Ok(resistance) = &outcome.resistance {
        warnings.extend(resistance.warnings.iter().cloned());
    }
    for (index, candidate) in job.candidates.iter().enumerate() {
        let Some(reason) = candidate.shortfall(wind) else {
            continue;
        };
        if index < job.chosen {
            warnings.push(format!(
                "{} (preferred) is not used: {reason}; the schedule uses {}",
                candidate.nail.id, nail.id
            ));
        } else if index == job.chosen || !job.feasible() {
            warnings.push(format!("{}: {reason}", candidate.nail.id));
        }
    }

    if project.deck.blocking == EdgeBlocking::CourseJoints {
        warnings.push(BLOCKING_MODEL.to_string());
    }
    warnings.extend(crate::adjustments::layout_adjustments(
        &job.layout.courses,
        project.deck.min_piece_mm / 1000.0,
        project.units,
    ));

    let mut provenance = vec![format!("Nail {}: {}", nail.id, nail.provenance())];
    provenance.extend(
        wind.factors
            .iter()
            .map(|factor| format!("{}: {}", factor.name, factor.source)),
    );
    provenance.push(format!("Zone map: {}", wind.zone_map));
    provenance.extend(zone_pressures.iter().map(|row| {
        format!(
            "Zone {} ({}) coefficient, {} ({}): {}",
            row.label, row.code_zone, row.figure, row.coefficient_status, row.source
        )
    }));
    provenance.extend(spacing_rule_sources(project.basis));
    provenance.dedup();
    // The catalogs write ids in backticks for the docs; the report is plain text.
    let plain = |text: &String| text.replace('`', "");
    let provenance = provenance.iter().map(plain).collect();
    let us = project.units.is_us();
    let warnings = warnings
        .iter()
        .map(|warning| message_for_reader(warning, us))
        .collect();

    Schedule {
        project: project.info.clone(),
        basis: BasisInfo {
            units: project.units,
            ..project.basis.info()
        },
        plan: plan_view(wind, &job.layout.courses, plan),
        building_length_m,
        building_width_m,
        framing_spacing_mm: project.framing.spacing_mm,
        framing_member: project.framing.member.as_str().to_string(),
        deck_description: deck_text(project, project.units),
        panel_laying: laying_text(project, &job.layout, project.units),
        laying_starts: laying_rows(&job.layout, project.deck.start_corner),
        nail: NailInfo {
            id: nail.id.clone(),
            description: lengths_for_reader(&nail.description, project.units.is_us()),
            length_mm: nail.length_mm,
            shank_diameter_mm: nail.shank_diameter_mm,
            head_diameter_mm: nail.head_diameter_mm,
            shank: nail.shank.as_str().to_string(),
            material: nail.material.as_str().to_string(),
            source: nail.provenance(),
        },
        resistance,
        wind_factors: wind
            .factors
            .iter()
            .map(|factor| FactorRow {
                name: factor.name.clone(),
                value: factor.value,
                source: factor.source.replace('`', ""),
            })
            .collect(),
        edge_width_m: wind.edge_width_m,
        zone_pressures,
        zones,
        lines,
        total_nail_count: plan.map_or(0, |plan| plan.total_nail_count),
        total_nail_mass_kg: plan.map_or(0.0, |plan| plan.total_nail_mass_kg),
        inputs: project.as_written.rows(),
        derived: crate::inputs::derived_rows(project),
        provenance,
        warnings,
        feasible: outcome.feasible,
        alternatives: alternatives(job),
        cautions: cautions_for(wind.built_in_rows_used()),
    }
}

/// What the output says whenever blocking is asked for: how the model treats it.
pub const BLOCKING_MODEL: &str = "Blocking under the course joints (deck.blocking): two rows of nails, \
one for each panel edge, at the panel-edge spacing of the zone. The panels are still solved as strips \
spanning across the framing, so the blocking's relief to the rafters is ignored (conservative for the \
rafter nails) and the blocking nails are not sized by that model (utilization shown 0).";

/// Length (along x) and width (along y) of the wall line's bounding box, m.
fn plan_size_m(footprint: &Footprint) -> (f64, f64) {
    match footprint {
        Footprint::Rectangle { length_m, width_m } => (*length_m, *width_m),
        Footprint::Polygon { vertices_m } => {
            // Parsing guarantees at least four finite points, so the spans are finite.
            let span = |axis: usize| {
                let values = vertices_m.iter().map(|point| point[axis]);
                values.clone().fold(f64::NEG_INFINITY, f64::max)
                    - values.fold(f64::INFINITY, f64::min)
            };
            (span(0), span(1))
        }
    }
}

/// Where panel laying starts, in one line for the crew, in the chosen units: the first plane's start
/// corner, the first-course offset and the narrowest cut piece.
fn laying_text(project: &Project, layout: &DeckLayout, units: Units) -> String {
    let Some(start) = layout.laying_starts.first() else {
        return "no deck laid".to_string();
    };
    let us = units.is_us();
    let length = |value_m: f64| {
        if us {
            feet_inches(value_m)
        } else {
            format!("{} m", fixed(value_m, 2))
        }
    };
    let deck = &project.deck;
    let mut offset = "first course flush with the eave edge".to_string();
    if deck.first_course_width_mm < deck.panel_width_mm - 1e-6 {
        offset.push_str(&format!(
            ", ripped to {} wide",
            length(start.first_course_width_m)
        ));
    }
    if deck.first_panel_length_mm < deck.panel_length_mm - 1e-6 {
        offset.push_str(&format!(
            "; first panel cut to {}",
            length(start.first_panel_length_m)
        ));
    }
    let end = match deck.start_corner {
        StartCorner::SmallerCoordinate => "smaller",
        StartCorner::LargerCoordinate => "larger",
    };
    format!(
        "each plane from its eave at the end with the {end} coordinate (first plane: x {}, y {}); {offset}; panel ends only on framing; no cut piece under {}",
        length(start.corner_m[0]),
        length(start.corner_m[1]),
        if us {
            feet_inches(project.deck.min_piece_mm / 1000.0)
        } else {
            format!("{} mm", fixed(project.deck.min_piece_mm, 0))
        }
    )
}

/// Where the first panel goes on each plane, with the plane's framing line nearest the start corner
/// (lines are numbered from the smaller coordinate: the lowest number, or the highest when laying
/// starts at the larger coordinate; blocking is not a framing line here).
fn laying_rows(layout: &DeckLayout, start_corner: StartCorner) -> Vec<LayingRow> {
    layout
        .laying_starts
        .iter()
        .map(|start| LayingRow {
            plane: plane_name(start.plane_index),
            corner_m: start.corner_m,
            first_line: {
                let numbers = layout
                    .lines
                    .iter()
                    .filter(|line| {
                        line.plane_index == start.plane_index && line.kind != LineKind::Blocking
                    })
                    .map(|line| line.number);
                match start_corner {
                    StartCorner::SmallerCoordinate => numbers.min(),
                    StartCorner::LargerCoordinate => numbers.max(),
                }
            },
            first_course_offset_m: start.first_course_offset_m,
        })
        .collect()
}

/// The deck in one line, in the chosen units: "Plywood 19/32 in, 4 x 8 ft panels, half stagger" or
/// "Oriented strand board 11.1 mm, 1220 x 2440 mm panels, half stagger".
pub fn deck_text(project: &Project, units: Units) -> String {
    let deck = &project.deck;
    let us = units.is_us();
    let panel = deckhold_fasten::panel(&deck.panel_id)
        .map(|panel| panel.name.clone())
        .unwrap_or_else(|_| deck.panel_id.clone());
    let stagger = match deck.stagger {
        StaggerChoice::Half => "half stagger".to_string(),
        StaggerChoice::None => "no stagger".to_string(),
        StaggerChoice::OffsetMm(offset_mm) => format!(
            "end joints offset {}",
            if us {
                feet_inches(offset_mm / 1000.0)
            } else {
                format!("{} mm", fixed(offset_mm, 0))
            }
        ),
    };
    let size = if us {
        format!(
            "{} x {} ft panels",
            trimmed(m_to_ft(deck.panel_width_mm / 1000.0), 2),
            trimmed(m_to_ft(deck.panel_length_mm / 1000.0), 2)
        )
    } else {
        format!(
            "{} x {} mm panels",
            fixed(deck.panel_width_mm, 0),
            fixed(deck.panel_length_mm, 0)
        )
    };
    format!(
        "{panel} {}, {size}, {stagger}",
        thickness_label(deck.thickness_mm, us)
    )
}

/// The pressure on each zone at the effective area of the nail that governs it (the panel-edge role, the
/// closer spacing); at a nail-sized 0.1 m² when the zone has no planned nail.
fn zone_pressures(wind: &WindAnalysis, plan: Option<&DeckPlan>) -> Vec<ZonePressureRow> {
    wind.zones
        .iter()
        .enumerate()
        .filter_map(|(zone_index, zone)| {
            let effective_area_m2 = plan
                .and_then(|plan| {
                    plan.lines
                        .iter()
                        .flat_map(|line| &line.segments)
                        .filter(|segment| segment.zone_index == zone_index)
                        .map(|segment| segment.effective_area_m2)
                        .fold(None, |least: Option<f64>, area| {
                            Some(least.map_or(area, |l| l.min(area)))
                        })
                })
                .unwrap_or(0.1);
            let uplift = wind.uplift(zone_index, effective_area_m2).ok()?;
            let curve = wind.curves.get(zone_index)?;
            Some(ZonePressureRow {
                label: zone.label,
                code_zone: zone.code_zone.clone(),
                area_m2: zone.area_m2,
                effective_area_m2,
                cp_ext: uplift.cp_ext,
                cp_int: uplift.cp_int,
                external_kpa: uplift.external_kpa,
                internal_kpa: uplift.internal_kpa,
                dead_counteracting_kpa: uplift.dead_counteracting_kpa,
                net_uplift_kpa: uplift.net_uplift_kpa,
                source: uplift.source,
                figure: curve.figure.clone(),
                coefficient_status: curve.status.to_string(),
            })
        })
        .collect()
}

/// The crew's per-zone rows of the job's chosen nail, worst zones first (empty when it was not planned).
pub fn zone_rows_of(job: &Job) -> Vec<ZoneRow> {
    let outcome = job.chosen();
    outcome
        .plan
        .as_ref()
        .map(|plan| zone_rows(&job.wind, plan, outcome))
        .unwrap_or_default()
}

fn zone_rows(wind: &WindAnalysis, plan: &DeckPlan, outcome: &NailOutcome) -> Vec<ZoneRow> {
    let governing_mode = outcome
        .resistance
        .as_ref()
        .map(|r| r.governing_mode.as_str())
        .unwrap_or("none");
    let mut rows: Vec<(u32, ZoneRow)> = plan
        .zone_roles
        .iter()
        .filter_map(|role| {
            let zone = wind.zones.get(role.zone_index)?;
            let order = zone.label.sheet_rank() * 2
                + u32::from(role.support_role == SupportRole::Intermediate);
            Some((
                order,
                ZoneRow {
                    label: zone.label,
                    code_zone: zone.code_zone.clone(),
                    support_role: role.support_role,
                    nail_id: outcome.nail.id.clone(),
                    nail_description: outcome.nail.description.clone(),
                    spacing_mm: role.spacing_mm,
                    net_uplift_kpa: role.net_uplift_kpa,
                    demand_n: role.demand_n,
                    resistance_n: role.resistance_n,
                    governing_mode: governing_mode.to_string(),
                    utilization: role.utilization,
                    nail_count: role.nail_count,
                    governing_check: role.limited_by.as_str().to_string(),
                    governing_line: role.governing_line,
                },
            ))
        })
        .collect();
    rows.sort_by_key(|(order, _)| *order);
    rows.into_iter().map(|(_, row)| row).collect()
}

fn line_rows(wind: &WindAnalysis, plan: &DeckPlan) -> Vec<LineRow> {
    plan.lines
        .iter()
        .map(|line| LineRow {
            number: line.number,
            plane: plane_name(line.plane_index),
            kind: line.kind,
            position_m: line.position_m,
            length_m: line.length_m,
            segments: line
                .segments
                .iter()
                // The deck plan's zone indices come from these zones (the deck crate checks them).
                .filter_map(|segment| {
                    Some(SegmentRow {
                        from_m: segment.from_m,
                        to_m: segment.to_m,
                        zone_label: wind.zones.get(segment.zone_index)?.label,
                        support_role: segment.support_role,
                        spacing_mm: segment.spacing_mm,
                        utilization: segment.utilization,
                    })
                })
                .collect(),
        })
        .collect()
}

/// The planes as the outputs show them: named, measured on the slope, with their bounding lines.
fn plan_planes(wind: &WindAnalysis) -> Vec<PlanPlane> {
    wind.planes
        .iter()
        .enumerate()
        .map(|(index, plane)| {
            let area_plan_m2 = polygon_area_m2(&plane.polygon_m);
            PlanPlane {
                name: plane_name(index),
                polygon_m: plane.polygon_m.clone(),
                slope_deg: plane.slope_deg,
                downslope_m: plane.downslope_m,
                area_plan_m2,
                area_on_slope_m2: area_plan_m2 / plane.slope_deg.to_radians().cos(),
                edges: plane
                    .edges
                    .iter()
                    .map(|edge| plan_edge(edge, plane))
                    .collect(),
            }
        })
        .collect()
}

/// One side of `plane` with its plan and true lengths: the rise between the ends is the slope times
/// their plan distance measured down the plane's slope.
fn plan_edge(edge: &PlaneEdge, plane: &RoofPlane) -> PlanEdge {
    let d = [edge.to_m[0] - edge.from_m[0], edge.to_m[1] - edge.from_m[1]];
    let length_m = d[0].hypot(d[1]);
    let down = plane.downslope_m;
    let rise_m = plane.slope_deg.to_radians().tan() * (d[0] * down[0] + d[1] * down[1]).abs();
    PlanEdge {
        kind: edge.kind,
        from_m: edge.from_m,
        to_m: edge.to_m,
        length_m,
        length_on_slope_m: length_m.hypot(rise_m),
    }
}

/// Ridges, hips and valleys, each shared edge once (a stretch two planes share appears in both).
fn roof_lines(wind: &WindAnalysis) -> Vec<PlanEdge> {
    let same = |p: [f64; 2], q: [f64; 2]| (p[0] - q[0]).abs() + (p[1] - q[1]).abs() < 1e-6;
    let mut lines: Vec<PlanEdge> = Vec::new();
    for (plane, edge) in wind
        .planes
        .iter()
        .flat_map(|p| p.edges.iter().map(move |e| (p, e)))
    {
        if edge.kind.is_outer() {
            continue;
        }
        let seen = lines.iter().any(|l| {
            (same(l.from_m, edge.from_m) && same(l.to_m, edge.to_m))
                || (same(l.from_m, edge.to_m) && same(l.to_m, edge.from_m))
        });
        if !seen {
            lines.push(plan_edge(edge, plane));
        }
    }
    lines
}

/// Shoelace area of a plan polygon, m².
fn polygon_area_m2(polygon: &[[f64; 2]]) -> f64 {
    let count = polygon.len();
    let twice: f64 = (0..count)
        .map(|i| {
            let (a, b) = (polygon[i], polygon[(i + 1) % count]);
            a[0] * b[1] - b[0] * a[1]
        })
        .sum();
    twice.abs() / 2.0
}

fn plan_view(wind: &WindAnalysis, courses: &[Course], plan: Option<&DeckPlan>) -> PlanView {
    let mut view = PlanView {
        building_outline_m: wind.building_outline_m.clone(),
        roof_outline_m: wind.roof_outline_m.clone(),
        ridge_lines_m: wind.ridge_lines_m.clone(),
        zones: wind
            .zones
            .iter()
            .map(|zone| PlanZone {
                label: zone.label,
                code_zone: zone.code_zone.clone(),
                polygons_m: zone.polygons_m.clone(),
            })
            .collect(),
        planes: plan_planes(wind),
        roof_lines: roof_lines(wind),
        ..PlanView::default()
    };
    let Some(plan) = plan else {
        return view;
    };
    for line in &plan.lines {
        view.rafter_lines.push(PlanLine {
            number: line.number,
            start_m: line.plan_start_m,
            end_m: line.plan_end_m,
        });
        // Panel end joints: where two panels meet on the line (two rows of nails).
        for segment in &line.segments {
            if segment.support_role == SupportRole::PanelEdge && segment.rows == 2 {
                view.panel_joints_m.push([
                    plan_point(line, segment.from_m),
                    plan_point(line, segment.to_m),
                ]);
            }
        }
    }
    // Course lines (long panel edges) across each plane, drawn between the plane's outer lines.
    for course in courses {
        if course.index == 0 {
            continue;
        }
        let plane_lines: Vec<_> = plan
            .lines
            .iter()
            .filter(|line| line.plane_index == course.plane_index)
            .collect();
        let (Some(first), Some(last)) = (plane_lines.first(), plane_lines.last()) else {
            continue;
        };
        let point_on = |line: &RafterLine| -> Option<[f64; 2]> {
            (course.from_m <= line.length_m && line.length_m > 0.0)
                .then(|| plan_point(line, course.from_m))
        };
        if let (Some(a), Some(b)) = (point_on(first), point_on(last)) {
            view.course_lines_m.push([a, b]);
        }
    }
    view
}

/// The plan point `along_m` up the slope from the line's low end (the line is straight in plan).
fn plan_point(line: &RafterLine, along_m: f64) -> [f64; 2] {
    let fraction = if line.length_m > 0.0 {
        along_m / line.length_m
    } else {
        0.0
    };
    [
        line.plan_start_m[0] + (line.plan_end_m[0] - line.plan_start_m[0]) * fraction,
        line.plan_start_m[1] + (line.plan_end_m[1] - line.plan_start_m[1]) * fraction,
    ]
}

/// When the chosen nail does not work everywhere: the candidates that do, or what to change.
fn alternatives(job: &Job) -> Vec<String> {
    if job.feasible() {
        return Vec::new();
    }
    let mut lines: Vec<String> = job
        .candidates
        .iter()
        .filter(|candidate| candidate.feasible)
        .map(|candidate| format!("{} works in every zone", candidate.nail.id))
        .collect();
    if lines.is_empty() {
        lines.push("No candidate nail works in every zone. Consider a ring-shank or screw-shank nail, a longer nail, closer framing, or an engineered fastener.".to_string());
    }
    lines
}
