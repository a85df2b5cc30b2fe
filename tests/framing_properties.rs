//! Invariants of the framing and deck model on random rectangle roofs (gable, hip, monoslope, flat):
//! length and width 3-40 m, slopes 0-45 deg (within each shape's range), framing 300-1220 mm,
//! overhangs 0-900 mm. No outside source: these are properties any correct layout has.
//! 1. every wall parallel to the framing carries a line; every line lies in its plane and ends on the
//!    plane's boundary (eave, rake, ridge, hip or valley);
//! 2. in two dimensions: every sampled point of every plane is covered by exactly one piece (pieces
//!    cut along the hips), every panel end with deck beyond it lies on a line, the courses tile the
//!    plane up the slope, and no piece is narrower than the minimum unless its course reports it;
//! 3. each course's strips hold exactly the deck of the course (reactions sum to the load);
//! 4. each piece's strips hold exactly its deck, on hip roofs too (reactions sum to the load);
//! 5. any spacing at or below either overhang is laid out (never refused).

use deckhold_deck::layout::{DeckLayout, LineKind};
use deckhold_project::job::deck_layout;
use deckhold_project::{parse_project, DEMO_PROJECT_JSON};
use deckhold_tests::deck_checks::{check_piece_equilibrium, check_pieces};
use deckhold_tests::outlines::{distance_to_segment, inside};
use deckhold_wind::{RoofPlane, WindAnalysis};
use proptest::prelude::*;
use serde_json::{json, Value};

fn cases(default: u32) -> u32 {
    std::env::var("PROPTEST_CASES")
        .ok()
        .and_then(|text| text.parse().ok())
        .unwrap_or(default)
}

#[derive(Debug, Clone)]
struct Roof {
    shape: &'static str,
    length_m: f64,
    width_m: f64,
    slope_deg: f64,
    spacing_mm: f64,
    eave_mm: f64,
    rake_mm: f64,
}

fn roofs() -> impl Strategy<Value = Roof> {
    (
        prop_oneof![Just("gable"), Just("hip"), Just("monoslope"), Just("flat")],
        3.0f64..40.0,
        3.0f64..40.0,
        0.0f64..1.0,
        300.0f64..1220.0,
        0.0f64..900.0,
        0.0f64..900.0,
    )
        .prop_map(|(shape, a, b, slope, spacing_mm, eave_mm, rake_mm)| {
            // A hip's ridge runs along the longer side.
            let (length_m, width_m) = if shape == "hip" {
                (a.max(b), a.min(b))
            } else {
                (a, b)
            };
            let slope_deg = match shape {
                "gable" | "hip" => 45.0 * slope,
                "monoslope" => 3.0 * slope,
                _ => 7.0 * slope,
            };
            Roof {
                shape,
                length_m,
                width_m,
                slope_deg,
                spacing_mm,
                eave_mm,
                rake_mm,
            }
        })
}

/// The roof laid out; None when the wind method itself refuses the building (a mean roof height
/// over the least plan dimension), which is outside what these properties are about.
fn lay_out(roof: &Roof) -> Option<(WindAnalysis, DeckLayout, f64)> {
    let mut value: Value = serde_json::from_str(DEMO_PROJECT_JSON).expect("demo JSON");
    value["building"]["footprint"]["rectangle"] =
        json!({ "length_m": roof.length_m, "width_m": roof.width_m });
    value["roof"] = json!({
        "shape": roof.shape,
        "slope_deg": roof.slope_deg,
        "ridge_along": "length",
        "eave_overhang_mm": roof.eave_mm,
        "rake_overhang_mm": roof.rake_mm,
        "dead_load_kpa": 0.3
    });
    value["building"]["eave_height_m"] = json!(2.4);
    value["framing"]["spacing_mm"] = json!(roof.spacing_mm);
    let project = parse_project(&value.to_string()).expect("the roof parses");
    let wind = deckhold_wind::analyze(&project.wind).ok()?;
    let layout = deck_layout(&project, &wind).expect("laid out, never refused");
    Some((wind, layout, project.deck.min_piece_mm))
}

fn on_boundary(plane: &RoofPlane, p: [f64; 2]) -> bool {
    plane
        .edges
        .iter()
        .any(|edge| distance_to_segment(p, edge.from_m, edge.to_m) < 1e-5)
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(cases(24)))]

    #[test]
    fn walls_carry_members_and_lines_end_on_the_plane_boundary(roof in roofs()) {
        let Some((wind, layout, _)) = lay_out(&roof) else {
            return Err(TestCaseError::reject("the wind method refuses this building"));
        };
        for line in &layout.lines {
            let plane = &wind.planes[line.plane_index];
            prop_assert!(on_boundary(plane, line.plan_start_m), "line {} starts off the boundary", line.number);
            prop_assert!(on_boundary(plane, line.plan_end_m), "line {} ends off the boundary", line.number);
            let middle = [
                0.5 * (line.plan_start_m[0] + line.plan_end_m[0]),
                0.5 * (line.plan_start_m[1] + line.plan_end_m[1]),
            ];
            let nudged = [middle[0] + 1e-7, middle[1] + 1e-7];
            prop_assert!(inside(&plane.polygon_m, middle) || inside(&plane.polygon_m, nudged));
        }
        // Gable, monoslope and flat: both walls parallel to the framing carry an end-wall member on
        // every plane (the framing runs along y here: across the ridge, or the short way for a flat roof
        // whose y side is the shorter one).
        if roof.shape != "hip" {
            for (plane_index, _) in wind.planes.iter().enumerate() {
                let lines: Vec<_> = layout.lines.iter().filter(|l| l.plane_index == plane_index).collect();
                let along_y = lines.first().is_some_and(|l| l.plan_start_m[0] == l.plan_end_m[0]);
                let walls = if along_y { [0.0, roof.length_m] } else { [0.0, roof.width_m] };
                for wall in walls {
                    prop_assert!(
                        lines.iter().any(|l| l.kind == LineKind::EndWall && (l.position_m - wall).abs() < 1e-9),
                        "no member on the wall at {wall} m (plane {plane_index})"
                    );
                }
                // Nothing in the rake overhang.
                prop_assert!(lines.iter().all(|l| l.position_m >= -1e-9 && l.position_m <= walls[1] + 1e-9));
            }
        }
    }

    #[test]
    fn pieces_cover_the_deck_once_end_on_lines_and_are_narrow_only_when_said(roof in roofs()) {
        // Check 2 in two dimensions, on every plane (hip ends and side trapezoids included): see
        // `deck_checks::check_pieces`, shared with the L/T/U/Z roofs.
        let Some((wind, layout, min_piece_mm)) = lay_out(&roof) else {
            return Err(TestCaseError::reject("the wind method refuses this building"));
        };
        check_pieces(&wind, &layout, min_piece_mm)?;
    }

    #[test]
    fn each_course_strips_hold_exactly_its_deck(roof in roofs()) {
        // On the rectangular planes (not hip) every line crosses every course, so the reactions of a
        // course's strips add up to the deck's length across the framing (unit load, widths in mm).
        prop_assume!(roof.shape != "hip");
        let Some((_, layout, _)) = lay_out(&roof) else {
            return Err(TestCaseError::reject("the wind method refuses this building"));
        };
        for course in &layout.courses {
            let total_mm: f64 = layout
                .lines
                .iter()
                .filter(|l| l.plane_index == course.plane_index)
                .flat_map(|l| l.bearings.iter().filter(|b| b.course_index == course.index))
                .flat_map(|b| b.strips.iter().map(|s| s.reaction_width_mm))
                .sum();
            let pieces_mm: f64 = layout
                .pieces
                .iter()
                .filter(|p| p.plane_index == course.plane_index && p.course == course.index)
                .map(|p| p.length_m * 1000.0)
                .sum();
            prop_assert!(((total_mm - pieces_mm) / pieces_mm).abs() < 1e-9, "{total_mm} vs {pieces_mm}");
        }
    }

    #[test]
    fn each_piece_holds_its_load_on_every_shape_hip_ends_included(roof in roofs()) {
        // Check 4, per piece (hip end triangles and side trapezoids included, which check 3 leaves
        // out): see `deck_checks::check_piece_equilibrium`, shared with the L/T/U/Z roofs.
        let Some((_, layout, _)) = lay_out(&roof) else {
            return Err(TestCaseError::reject("the wind method refuses this building"));
        };
        prop_assert!(check_piece_equilibrium(&layout)? > 0);
    }

    #[test]
    fn a_spacing_at_or_below_either_overhang_is_laid_out(
        shape in prop_oneof![Just("gable"), Just("flat")],
        overhang_mm in 300.0f64..900.0,
        below in 0.0f64..1.0,
    ) {
        let spacing_mm = 300.0 + below * (overhang_mm - 300.0);
        let roof = Roof {
            shape,
            length_m: 12.0,
            width_m: 8.0,
            slope_deg: if shape == "gable" { 20.0 } else { 0.0 },
            spacing_mm,
            eave_mm: overhang_mm,
            rake_mm: overhang_mm,
        };
        let Some((_, layout, _)) = lay_out(&roof) else {
            return Err(TestCaseError::reject("the wind method refuses this building"));
        };
        prop_assert!(!layout.lines.is_empty());
    }
}
