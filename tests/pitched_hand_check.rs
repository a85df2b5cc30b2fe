//! The two pitched polygon fixtures worked by hand: plane areas, hip and valley lengths from the
//! geometry, and one zone's pressure and spacing, compared with the pipeline.
//!
//! Geometry is checked against the construction itself (every eave at one height and one slope, so a
//! hip or valley runs at 45 degrees in plan and each wing's ridge sits half the wing's eave-to-eave
//! width in from its eaves): plain arithmetic, no outside source needed. Pressures and resistances use
//! the same clauses, marked `from memory`, as `tests/demo_hand_check.rs`.

use approx::assert_relative_eq;
use deckhold_project::{parse_project, run_job, schedule_for};
use deckhold_schedule::{EdgeKind, Schedule};
use deckhold_tests::fixture_text;

const M_PER_FT: f64 = 0.3048;

fn schedule(name: &str) -> Schedule {
    let project = parse_project(&fixture_text(name)).expect("parses");
    let job = run_job(&project).expect("runs");
    schedule_for(&project, &job)
}

/// The planes' plan areas (sorted) equal `expected_m2`, and their areas on the slope add up to
/// `total_on_slope_m2`.
fn assert_plane_areas(schedule: &Schedule, expected_m2: &[f64], total_on_slope_m2: f64) {
    let mut areas: Vec<f64> = schedule
        .plan
        .planes
        .iter()
        .map(|p| p.area_plan_m2)
        .collect();
    areas.sort_by(f64::total_cmp);
    assert_eq!(areas.len(), expected_m2.len());
    for (area, hand) in areas.iter().zip(expected_m2) {
        assert_relative_eq!(*area, *hand, max_relative = 1e-9);
    }
    let on_slope: f64 = schedule
        .plan
        .planes
        .iter()
        .map(|p| p.area_on_slope_m2)
        .sum();
    assert_relative_eq!(on_slope, total_on_slope_m2, max_relative = 1e-9);
}

/// The interior zone's net uplift and its intermediate-support schedule row.
fn interior(schedule: &Schedule) -> (f64, &deckhold_schedule::ZoneRow) {
    let pressure = schedule
        .zone_pressures
        .iter()
        .find(|row| row.label.as_str() == "interior")
        .expect("an interior zone");
    let row = schedule
        .zones
        .iter()
        .find(|row| row.label.as_str() == "interior" && row.support_role.as_str() == "intermediate")
        .expect("interior, intermediate");
    (pressure.net_uplift_kpa, row)
}

fn total_length_m(schedule: &Schedule, kind: EdgeKind) -> f64 {
    schedule
        .plan
        .roof_lines
        .iter()
        .filter(|l| l.kind == kind)
        .map(|l| l.length_m)
        .sum()
}

/// fixtures/ca-l-hip-bungalow.json: L of a 14 × 8 m wing and an 8 × 6 m ell (both 8 m wide), hip roof
/// at 5:12 with a 0.6 m overhang on every wall.
///
/// Eave outline: (-0.6,-0.6) (14.6,-0.6) (14.6,8.6) (8.6,8.6) (8.6,14.6) (-0.6,14.6); each wing is
/// 9.2 m eave to eave, so the ridges run 4.6 m in: y = 4.0 from x = 4.0 to 10.0 and x = 4.0 from
/// y = 4.0 to 10.0 (6 m each). Five hips from the outside corners and one valley from the inside
/// corner, each rising 4.6 m in both plan directions: 4.6√2 = 6.505 m in plan each (on the slope
/// √(6.505² + (4.6 × 5/12)²) = 6.782 m).
/// Planes (plan): two long planes (15.2 + 6) / 2 × 4.6 = 48.76 m², two hip ends 9.2 × 4.6 / 2 =
/// 21.16 m², two inside planes between hip, ridge and valley (6 + 6) / 2 × 4.6 = 27.6 m²; total
/// 195.04 m² = 160 m² of building + 56 m of wall × 0.6 + (5 outside − 1 inside corners) × 0.36 m².
/// On the slope each is divided by cos(atan 5/12) = 12/13.
///
/// Interior zone `r`, intermediate support:
/// - h = 3.0 + 4.0 × 5/12 / 2 = 3.83 m, below the 6 m floor: C_e = 0.6^0.2 = 0.9029, q C_e = 0.4063 kPa
///   (NBC 2020 4.1.7.3, from memory).
/// - C_p C_g = -2.5 (interior of a 7..27 deg hip, NBC 2020 Figure 4.1.7.6.-E, the severe reading used by
///   the tool, from memory); C_pi C_gi = 0.3 × 2.0 = 0.6 (NBC 2020 4.1.7.7, from memory).
/// - Wind 1.4 × 0.4063 × 3.1 = 1.7633 kPa; dead 0.9 × 0.5 × 12/13 = 0.4154 kPa; net 1.3479 kPa.
/// - Nail common-63x3.25 in SPF through 12.5 mm plywood: L_p = 50.5 mm, y_w = 16.4 × 3.25^0.82 × 0.42^2.2
///   = 6.394 N/mm, P_rw = 0.6 × 6.394 × 50.5 = 193.7 N (CSA O86:19 12.9.5.2, from memory).
/// - First interior support of the 4-span strip: 32/28 × 610 = 697.1 mm (Hicks, Civil Engineering
///   Formulas, Table 2.1, checked). At 200 mm: 1.3479 × 697.1 × 0.200 = 187.9 N ≤ 193.7 N; at 250 mm
///   234.9 N does not hold: 200 mm o.c., utilization 0.970.
#[test]
fn l_hip_bungalow_by_hand() {
    let schedule = schedule("ca-l-hip-bungalow.json");
    assert_plane_areas(
        &schedule,
        &[21.16, 21.16, 27.6, 27.6, 48.76, 48.76],
        195.04 * 13.0 / 12.0,
    );
    let diagonal = 4.6 * 2f64.sqrt();
    assert_relative_eq!(
        total_length_m(&schedule, EdgeKind::Hip),
        5.0 * diagonal,
        max_relative = 1e-9
    );
    assert_relative_eq!(
        total_length_m(&schedule, EdgeKind::Valley),
        diagonal,
        max_relative = 1e-9
    );
    assert_relative_eq!(
        total_length_m(&schedule, EdgeKind::Ridge),
        12.0,
        max_relative = 1e-9
    );
    // True lengths (the plan's roof-line table): each hip and the valley rise 4.6 × 5/12 m over
    // 4.6√2 m in plan; a ridge is level.
    let on_slope = diagonal.hypot(4.6 * 5.0 / 12.0);
    for line in &schedule.plan.roof_lines {
        let expected = if line.kind == EdgeKind::Ridge {
            6.0
        } else {
            on_slope
        };
        assert_relative_eq!(line.length_on_slope_m, expected, max_relative = 1e-9);
    }

    let net_kpa = 1.4 * 0.45 * 0.6f64.powf(0.2) * (2.5 + 0.6) - 0.9 * 0.5 * 12.0 / 13.0;
    let (interior_kpa, row) = interior(&schedule);
    assert_relative_eq!(interior_kpa, net_kpa, max_relative = 1e-3);
    let resistance_n = 0.6 * 16.4 * 3.25f64.powf(0.82) * 0.42f64.powf(2.2) * (63.0 - 12.5);
    assert_relative_eq!(
        schedule.resistance.governing_n,
        resistance_n,
        max_relative = 1e-3
    );
    assert_eq!(row.spacing_mm, Some(200.0));
    assert_relative_eq!(
        row.demand_n,
        net_kpa * 610.0 * 32.0 / 28.0 * 0.2,
        max_relative = 1e-3
    );
}

/// fixtures/us-t-cross-gable.json: T of a 48 × 26 ft main wing and a 24 × 20 ft rear wing at its
/// middle, gables at both main ends and at the rear wing's end, 6:12, eave overhang 18 in, rake 12 in.
///
/// Main ridge at y = 13 ft (26 / 2), from x = -1 to 49 ft (rakes): 50 ft. Rear wing ridge at x = 24 ft
/// from its gable (y = 46 + 1 = 47 ft) down to where its valleys meet: the valleys start at the eave
/// corners (10.5, 27.5) and (37.5, 27.5) ft and run at 45 degrees to (24, 14): 13.5√2 = 19.09 ft each
/// in plan; ridge 47 − 14 = 33 ft.
/// Planes (plan): front 50 × 14.5 = 725 ft²; each rear-wing plane a trapezoid 13.5 ft wide, 19.5 ft
/// deep at its eave and 33 ft at the ridge: (19.5 + 33) / 2 × 13.5 = 354.375 ft²; the back plane of the
/// main wing 50 × 14.5 less the two valley triangles 13.5² / 2 under the rear wing: 725 − 182.25 =
/// 542.75 ft².
///
/// Interior zone `1`, intermediate support:
/// - q_h = 30.04 psf = 1.4385 kPa (K_z 0.8512 at the 15 ft floor, K_e = exp(-0.0000362 × 1200) = 0.9575,
///   V = 120 mph; ASCE 7-22 Eq. 26.10-1, from memory).
/// - GC_p = -1.5 (zone 1, gable 20..27 deg, the tool's reading of ASCE 7-22 Figure 30.3-2C, from memory),
///   GC_pi = 0.18, K_d = 0.85: wind 0.6 × 1.4385 × 0.85 × 1.68 = 1.2325 kPa; dead 0.6 × 10 psf ×
///   cos(26.57 deg) = 0.2570 kPa (ASCE 7-22 2.4.1 combination 7, from memory); net 0.9755 kPa.
/// - 8d common (2-1/2 in × 0.131 in, the preferred nail) in SPF (G = 0.42) through 7/16 in OSB:
///   W = 1380 × 0.42^2.5 × 0.131 = 20.67 lb/in (NDS 2018 Eq. 12.2-3, from memory), × 2.0625 in ×
///   C_D 1.6 = 68.2 lb = 303.4 N.
/// - First interior support: 32/28 × 609.6 = 696.7 mm. At 12 in (the prescriptive maximum):
///   0.9755 × 696.7 × 0.3048 = 207.2 N ≤ 303.4 N: 12 in o.c., utilization 0.68.
#[test]
fn t_cross_gable_by_hand() {
    let schedule = schedule("us-t-cross-gable.json");
    assert_eq!(schedule.nail.id, "8d-common");
    let ft2 = M_PER_FT * M_PER_FT;
    assert_plane_areas(
        &schedule,
        &[354.375 * ft2, 354.375 * ft2, 542.75 * ft2, 725.0 * ft2],
        1976.5 * ft2 * 5f64.sqrt() / 2.0,
    );
    assert_relative_eq!(total_length_m(&schedule, EdgeKind::Hip), 0.0);
    assert_relative_eq!(
        total_length_m(&schedule, EdgeKind::Valley),
        2.0 * 13.5 * 2f64.sqrt() * M_PER_FT,
        max_relative = 1e-9
    );
    assert_relative_eq!(
        total_length_m(&schedule, EdgeKind::Ridge),
        83.0 * M_PER_FT,
        max_relative = 1e-9
    );

    let q_h_kpa = 0.00256 * 0.8512 * 0.9575 * 120.0f64.powi(2) * 0.047_880_26;
    let net_kpa =
        0.6 * q_h_kpa * 0.85 * (1.5 + 0.18) - 0.6 * 10.0 * 0.047_880_26 * 2.0 / 5f64.sqrt();
    let (interior_kpa, row) = interior(&schedule);
    assert_relative_eq!(interior_kpa, net_kpa, max_relative = 2e-3);
    assert_eq!(row.spacing_mm, Some(304.8));
    assert_relative_eq!(
        row.demand_n,
        net_kpa * 609.6 * 32.0 / 28.0 * 0.3048,
        max_relative = 2e-3
    );
    assert_relative_eq!(
        row.resistance_n,
        1380.0 * 0.42f64.powf(2.5) * 0.131 * 2.0625 * 1.6 * 4.448_222,
        max_relative = 2e-3
    );
}

/// A rectangle written as a four-corner polygon (clockwise, from another corner) gives the same
/// schedule as the same rectangle written as `rectangle`, for a gable, a hip and a monoslope roof: regression against our own output, both ways.
#[test]
fn a_rectangle_as_a_polygon_gives_the_same_schedule() {
    for (name, corners) in [
        (
            "demo-ca-gable.json",
            serde_json::json!({ "polygon_m": [[18.3, 9.8], [18.3, 0], [0, 0], [0, 9.8]] }),
        ),
        (
            "us-hip.json",
            serde_json::json!({ "polygon_ft": [[0, 0], [0, 32], [60, 32], [60, 0]] }),
        ),
        (
            "us-lean-to-addition.json",
            serde_json::json!({ "polygon_ft": [[28, 12], [0, 12], [0, 0], [28, 0]] }),
        ),
    ] {
        let text = fixture_text(name);
        let mut value: serde_json::Value = serde_json::from_str(&text).expect("json");
        value["building"]["footprint"] = corners;
        let as_rectangle = schedule(name);
        let project = parse_project(&value.to_string()).expect("parses");
        let job = run_job(&project).expect("runs");
        let as_polygon = schedule_for(&project, &job);
        let csv = |s: &Schedule| {
            (
                deckhold_schedule::schedule_csv(s).expect("csv"),
                deckhold_schedule::rafter_lines_csv(s).expect("csv"),
            )
        };
        assert!(
            csv(&as_rectangle) == csv(&as_polygon),
            "{name}: the CSVs differ"
        );
        assert_eq!(as_rectangle.plan.planes.len(), as_polygon.plan.planes.len());
        assert_eq!(
            as_rectangle.total_nail_count, as_polygon.total_nail_count,
            "{name}"
        );
    }
}
