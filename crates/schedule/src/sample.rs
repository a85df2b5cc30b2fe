//! An invented schedule for tests and examples: a plain gable roof with overhangs, built by hand.
//!
//! Every number here is made up to look like a schedule; none is an engineering value and none may be
//! used for a design. The lead's cross-crate tests reuse these builders, so they stay public but hidden.

use crate::model::*;

/// Framing spacing of the sample, mm.
const SAMPLE_FRAMING_MM: f64 = 610.0;
/// Plan width of the sample building (across the ridge), m.
const SAMPLE_WIDTH_M: f64 = 8.0;
/// Overhang beyond the wall line on every side, m.
const SAMPLE_OVERHANG_M: f64 = 0.6;
/// Cosine of the sample's 4:12 slope (18.43 deg).
const SAMPLE_SLOPE_COS: f64 = 0.948_683;

/// One zone of the sample: label, code zone, invented net uplift (kPa) and spacings (mm) for panel edges
/// and intermediate supports.
struct SampleZone {
    label: ZoneKind,
    code_zone: &'static str,
    net_uplift_kpa: f64,
    edge_spacing_mm: f64,
    intermediate_spacing_mm: f64,
}

const SAMPLE_ZONES: [SampleZone; 5] = [
    SampleZone {
        label: ZoneKind::Interior,
        code_zone: "r",
        net_uplift_kpa: 1.10,
        edge_spacing_mm: 150.0,
        intermediate_spacing_mm: 300.0,
    },
    SampleZone {
        label: ZoneKind::Edge,
        code_zone: "s",
        net_uplift_kpa: 1.85,
        edge_spacing_mm: 100.0,
        intermediate_spacing_mm: 150.0,
    },
    SampleZone {
        label: ZoneKind::Corner,
        code_zone: "c",
        net_uplift_kpa: 2.70,
        edge_spacing_mm: 75.0,
        intermediate_spacing_mm: 100.0,
    },
    SampleZone {
        label: ZoneKind::OverhangEdge,
        code_zone: "oh-s",
        net_uplift_kpa: 2.60,
        edge_spacing_mm: 75.0,
        intermediate_spacing_mm: 100.0,
    },
    SampleZone {
        label: ZoneKind::OverhangCorner,
        code_zone: "oh-c",
        net_uplift_kpa: 3.60,
        edge_spacing_mm: 50.0,
        intermediate_spacing_mm: 75.0,
    },
];

/// The SI sample with 20 rafter lines, every zone feasible.
#[doc(hidden)]
pub fn sample_schedule() -> Schedule {
    sample_schedule_with_lines(20, Units::Si)
}

/// The sample with the overhang corners' panel edges having no working spacing.
#[doc(hidden)]
pub fn sample_infeasible_schedule() -> Schedule {
    let mut schedule = sample_schedule();
    for row in schedule.zones.iter_mut() {
        if row.label == ZoneKind::OverhangCorner && row.support_role == SupportRole::PanelEdge {
            row.spacing_mm = None;
            row.utilization = 1.24;
            row.governing_check = "strength at the splitting minimum".to_string();
        }
    }
    for line in schedule.lines.iter_mut() {
        for segment in line.segments.iter_mut() {
            if segment.zone_label == ZoneKind::OverhangCorner
                && segment.support_role == SupportRole::PanelEdge
            {
                segment.spacing_mm = None;
                segment.utilization = 1.24;
            }
        }
    }
    schedule.feasible = false;
    schedule.alternatives = vec![
        "sample-nail-b (3.8 mm ring shank, 76 mm) at 75 mm in overhang-corner panel edges, utilization 0.91"
            .to_string(),
        "framing at 406 mm on centre with the same nail: 50 mm works, utilization 0.83".to_string(),
    ];
    schedule
}

/// The sample with `line_count` rafter lines (at least 4) at 610 mm: the building grows in length.
#[doc(hidden)]
pub fn sample_schedule_with_lines(line_count: u32, units: Units) -> Schedule {
    let line_count = line_count.max(4);
    let framing_m = SAMPLE_FRAMING_MM / 1000.0;
    let length_m = f64::from(line_count - 1) * framing_m;
    let width_m = SAMPLE_WIDTH_M;
    let overhang_m = SAMPLE_OVERHANG_M;
    let edge_m = (length_m / 4.0).min(1.0);
    let imperial = units == Units::Imperial;
    let zone_spacing = |mm: f64| {
        if imperial {
            (mm / crate::format::MM_PER_IN).round() * crate::format::MM_PER_IN
        } else {
            mm
        }
    };

    let zones = SAMPLE_ZONES
        .iter()
        .flat_map(|zone| {
            [
                (SupportRole::PanelEdge, zone.edge_spacing_mm),
                (SupportRole::Intermediate, zone.intermediate_spacing_mm),
            ]
            .map(|(role, spacing_mm)| {
                let spacing_mm = zone_spacing(spacing_mm);
                let reaction_width_m = if role == SupportRole::PanelEdge {
                    0.305
                } else {
                    0.695
                };
                let demand_n = zone.net_uplift_kpa * reaction_width_m * spacing_mm;
                ZoneRow {
                    label: zone.label,
                    code_zone: zone.code_zone.to_string(),
                    support_role: role,
                    nail_id: "sample-nail-a".to_string(),
                    nail_description: "Sample ring-shank nail 3.3 x 63 mm".to_string(),
                    spacing_mm: Some(spacing_mm),
                    net_uplift_kpa: zone.net_uplift_kpa,
                    demand_n,
                    resistance_n: 400.0,
                    governing_mode: "withdrawal".to_string(),
                    utilization: demand_n / 400.0,
                    nail_count: (spacing_mm as u64 % 7 + 3) * 40,
                    governing_check: "strength".to_string(),
                    governing_line: 1,
                }
            })
        })
        .collect::<Vec<_>>();

    let spacing_of = |label: ZoneKind, role: SupportRole| {
        zones
            .iter()
            .find(|row| row.label == label && row.support_role == role)
            .map(|row| (row.spacing_mm, row.utilization))
            .unwrap_or((None, 0.0))
    };

    let mut lines = Vec::new();
    let mut plan_lines = Vec::new();
    for number in 1..=line_count {
        let x_m = f64::from(number - 1) * framing_m;
        let near_end = x_m < edge_m - 1e-9 || x_m > length_m - edge_m + 1e-9;
        let role = if number % 4 == 1 {
            SupportRole::PanelEdge
        } else {
            SupportRole::Intermediate
        };
        let bands = [
            (
                -overhang_m,
                0.0,
                if near_end {
                    ZoneKind::OverhangCorner
                } else {
                    ZoneKind::OverhangEdge
                },
            ),
            (
                0.0,
                edge_m,
                if near_end {
                    ZoneKind::Corner
                } else {
                    ZoneKind::Edge
                },
            ),
            (
                edge_m,
                width_m - edge_m,
                if near_end {
                    ZoneKind::Edge
                } else {
                    ZoneKind::Interior
                },
            ),
            (
                width_m - edge_m,
                width_m,
                if near_end {
                    ZoneKind::Corner
                } else {
                    ZoneKind::Edge
                },
            ),
            (
                width_m,
                width_m + overhang_m,
                if near_end {
                    ZoneKind::OverhangCorner
                } else {
                    ZoneKind::OverhangEdge
                },
            ),
        ];
        let segments = bands
            .iter()
            .map(|&(from_y, to_y, zone)| {
                let (spacing_mm, utilization) = spacing_of(zone, role);
                SegmentRow {
                    from_m: (from_y + overhang_m) / SAMPLE_SLOPE_COS,
                    to_m: (to_y + overhang_m) / SAMPLE_SLOPE_COS,
                    zone_label: zone,
                    support_role: role,
                    spacing_mm,
                    utilization,
                }
            })
            .collect();
        lines.push(LineRow {
            plane: crate::model::plane_name(0),
            kind: if number == 1 || number == line_count {
                LineKind::EndWall
            } else {
                LineKind::Common
            },
            number,
            position_m: x_m,
            length_m: (width_m + 2.0 * overhang_m) / SAMPLE_SLOPE_COS,
            segments,
        });
        plan_lines.push(PlanLine {
            number,
            start_m: [x_m, -overhang_m],
            end_m: [x_m, width_m + overhang_m],
        });
    }

    let plan = PlanView {
        building_outline_m: rectangle(0.0, 0.0, length_m, width_m),
        roof_outline_m: rectangle(
            -overhang_m,
            -overhang_m,
            length_m + overhang_m,
            width_m + overhang_m,
        ),
        ridge_lines_m: vec![[
            [-overhang_m, width_m / 2.0],
            [length_m + overhang_m, width_m / 2.0],
        ]],
        zones: plan_zones(length_m, width_m, overhang_m, edge_m),
        rafter_lines: plan_lines,
        panel_joints_m: panel_joints(line_count, framing_m, width_m, overhang_m),
        course_lines_m: course_lines(length_m, width_m, overhang_m),
        planes: Vec::new(),
        roof_lines: vec![crate::model::PlanEdge {
            kind: crate::model::EdgeKind::Ridge,
            from_m: [-overhang_m, width_m / 2.0],
            to_m: [length_m + overhang_m, width_m / 2.0],
            length_m: length_m + 2.0 * overhang_m,
            length_on_slope_m: length_m + 2.0 * overhang_m,
        }],
    };

    let zone_pressures = SAMPLE_ZONES
        .iter()
        .map(|zone| ZonePressureRow {
            label: zone.label,
            code_zone: zone.code_zone.to_string(),
            area_m2: 10.0,
            effective_area_m2: 0.09,
            cp_ext: -zone.net_uplift_kpa / 0.6,
            cp_int: 0.3,
            external_kpa: -zone.net_uplift_kpa * 0.9,
            internal_kpa: 0.18,
            dead_counteracting_kpa: 0.07,
            net_uplift_kpa: zone.net_uplift_kpa,
            source: "sample table, invented for tests (from memory: none)".to_string(),
            figure: "sample figure, invented for tests".to_string(),
            coefficient_status: "from memory".to_string(),
        })
        .collect();

    let total_nail_count = zones.iter().map(|row| row.nail_count).sum();
    Schedule {
        project: ProjectInfo {
            name: "Sample workshop roof".to_string(),
            site: "Sample site, lot 7".to_string(),
            owner: "Sample owner".to_string(),
            prepared_by: "deckhold test sample".to_string(),
            date: "2026-01-01".to_string(),
            notes: "Invented data for the writer tests; not a design.".to_string(),
        },
        basis: BasisInfo {
            id: "sample-basis".to_string(),
            title: "Sample basis: invented wind and withdrawal values".to_string(),
            wind_standard: "sample wind standard (none)".to_string(),
            fastener_standard: "sample fastener standard (none)".to_string(),
            units,
        },
        plan,
        building_length_m: length_m,
        building_width_m: width_m,
        framing_spacing_mm: SAMPLE_FRAMING_MM,
        framing_member: "rafter".to_string(),
        deck_description: "OSB 15 mm, 1220 x 2440 mm panels, half stagger".to_string(),
        panel_laying:
            "start at the eave corner at x -0.30 m, y -0.45 m; first course flush with the eave"
                .to_string(),
        laying_starts: vec![LayingRow {
            plane: crate::model::plane_name(0),
            corner_m: [-0.3, -0.45],
            first_line: Some(1),
            first_course_offset_m: 0.0,
        }],
        nail: NailInfo {
            id: "sample-nail-a".to_string(),
            description: "Sample ring-shank nail 3.3 x 63 mm".to_string(),
            length_mm: 63.5,
            shank_diameter_mm: 3.33,
            head_diameter_mm: 7.14,
            shank: "ring".to_string(),
            material: "carbon".to_string(),
            source: "sample catalogue line (invented)".to_string(),
        },
        resistance: ResistanceInfo {
            withdrawal_n: 400.0,
            pull_through_n: Some(910.0),
            pull_through_is_advisory: true,
            governing_n: 400.0,
            governing_mode: "withdrawal".to_string(),
            penetration_mm: 47.5,
            factors: vec![
                factor("unit withdrawal, N/mm", 4.2, "sample equation (invented)"),
                factor("penetration, mm", 47.5, "nail length minus panel thickness"),
                factor("resistance factor", 0.6, "sample clause (invented)"),
                factor("load duration factor", 1.15, "sample table (invented)"),
            ],
        },
        wind_factors: vec![
            factor(
                "reference velocity pressure q, kPa",
                0.45,
                "sample climate table (invented)",
            ),
            factor("importance factor", 1.0, "sample table (invented)"),
            factor("exposure factor", 0.9, "sample clause (invented)"),
        ],
        edge_width_m: edge_m,
        zone_pressures,
        zones,
        lines,
        total_nail_count,
        total_nail_mass_kg: total_nail_count as f64 * 0.0046,
        derived: vec![InputRow {
            key: "framing spacing".to_string(),
            value: "610 mm o.c.".to_string(),
        }],
        inputs: vec![
            InputRow {
                key: "building.length_m".to_string(),
                value: format!("{length_m:.3} m"),
            },
            InputRow {
                key: "building.width_m".to_string(),
                value: format!("{width_m:.3} m"),
            },
            InputRow {
                key: "roof.slope".to_string(),
                value: "4:12 (18.4 deg)".to_string(),
            },
            InputRow {
                key: "roof.overhang_m".to_string(),
                value: format!("{overhang_m:.3} m"),
            },
            InputRow {
                key: "framing.spacing_mm".to_string(),
                value: "610 mm".to_string(),
            },
            InputRow {
                key: "nail".to_string(),
                value: "sample-nail-a".to_string(),
            },
        ],
        provenance: vec![
            "zone pressures: sample table (invented, not a standard)".to_string(),
            "nail dimensions: sample catalogue line (invented)".to_string(),
        ],
        warnings: vec!["This is invented sample data: do not build from it.".to_string()],
        feasible: true,
        alternatives: Vec::new(),
        cautions: standard_cautions(),
    }
}

fn factor(name: &str, value: f64, source: &str) -> FactorRow {
    FactorRow {
        name: name.to_string(),
        value,
        source: source.to_string(),
    }
}

fn rectangle(x0: f64, y0: f64, x1: f64, y1: f64) -> Vec<[f64; 2]> {
    vec![[x0, y0], [x1, y0], [x1, y1], [x0, y1]]
}

/// Corner zones at the four corners, edge strips between them, the interior, and the overhang ring split
/// into corner and edge parts.
fn plan_zones(length_m: f64, width_m: f64, overhang_m: f64, edge_m: f64) -> Vec<PlanZone> {
    let (l, w, o, a) = (length_m, width_m, overhang_m, edge_m);
    let zone = |label: ZoneKind, code_zone: &str, polygons_m: Vec<Vec<[f64; 2]>>| PlanZone {
        label,
        code_zone: code_zone.to_string(),
        polygons_m,
    };
    vec![
        zone(ZoneKind::Interior, "r", vec![rectangle(a, a, l - a, w - a)]),
        zone(
            ZoneKind::Edge,
            "s",
            vec![
                rectangle(a, 0.0, l - a, a),
                rectangle(a, w - a, l - a, w),
                rectangle(0.0, a, a, w - a),
                rectangle(l - a, a, l, w - a),
            ],
        ),
        zone(
            ZoneKind::Corner,
            "c",
            vec![
                rectangle(0.0, 0.0, a, a),
                rectangle(l - a, 0.0, l, a),
                rectangle(0.0, w - a, a, w),
                rectangle(l - a, w - a, l, w),
            ],
        ),
        zone(
            ZoneKind::OverhangEdge,
            "oh-s",
            vec![
                rectangle(a, -o, l - a, 0.0),
                rectangle(a, w, l - a, w + o),
                rectangle(-o, a, 0.0, w - a),
                rectangle(l, a, l + o, w - a),
            ],
        ),
        zone(
            ZoneKind::OverhangCorner,
            "oh-c",
            vec![
                vec![[-o, -o], [a, -o], [a, 0.0], [0.0, 0.0], [0.0, a], [-o, a]],
                vec![
                    [l - a, -o],
                    [l + o, -o],
                    [l + o, a],
                    [l, a],
                    [l, 0.0],
                    [l - a, 0.0],
                ],
                vec![
                    [l + o, w - a],
                    [l + o, w + o],
                    [l - a, w + o],
                    [l - a, w],
                    [l, w],
                    [l, w - a],
                ],
                vec![
                    [-o, w - a],
                    [0.0, w - a],
                    [0.0, w],
                    [a, w],
                    [a, w + o],
                    [-o, w + o],
                ],
            ],
        ),
    ]
}

/// Long panel edges every 1220 mm up from each eave, stopping short of the ridge.
fn course_lines(length_m: f64, width_m: f64, overhang_m: f64) -> Vec<[[f64; 2]; 2]> {
    let mut lines = Vec::new();
    let ridge_m = width_m / 2.0;
    let mut offset_m = 1.22;
    while -overhang_m + offset_m < ridge_m - 0.1 {
        for y_m in [-overhang_m + offset_m, width_m + overhang_m - offset_m] {
            lines.push([[-overhang_m, y_m], [length_m + overhang_m, y_m]]);
        }
        offset_m += 1.22;
    }
    lines
}

/// Panel end joints on every 4th rafter, shifted two rafters from course to course (half stagger).
fn panel_joints(
    line_count: u32,
    framing_m: f64,
    width_m: f64,
    overhang_m: f64,
) -> Vec<[[f64; 2]; 2]> {
    let ridge_m = width_m / 2.0;
    let mut joints = Vec::new();
    let mut course = 0u32;
    loop {
        let y0 = -overhang_m + 1.22 * f64::from(course);
        if y0 >= ridge_m {
            break;
        }
        let y1 = (y0 + 1.22).min(ridge_m);
        for number in 1..=line_count {
            if (number - 1 + 2 * (course % 2)).is_multiple_of(4) {
                let x_m = f64::from(number - 1) * framing_m;
                joints.push([[x_m, y0], [x_m, y1]]);
                let top = width_m + overhang_m;
                joints.push([
                    [x_m, top - (y0 + overhang_m)],
                    [x_m, top - (y1 + overhang_m)],
                ]);
            }
        }
        course += 1;
    }
    joints
}
