//! Framing on pitched roofs of any rectilinear outline, and on rectangles of every shape: where each
//! framing line (`framing.lines[]`) lies and ends, and where the hips and valleys run from.
//! No outside source: these are properties any correct roof framing has (issue 12).
//!
//! 1. every framing line lies inside the roof outline (overhangs included) and each of its ends lies on
//!    the outline (an eave or rake edge, overhang included), a hip, a valley or a ridge;
//! 2. every numbered line lies in its own plane and ends on that plane's boundary;
//! 3. a hip rafter that reaches the outline does so at an outside corner, a valley rafter at an inside
//!    corner; a rafter that does not reach it starts where other hips, valleys or ridges meet;
//! 4. on a hip roof every outside corner of the outline carries a hip rafter, every inside corner a
//!    valley rafter.
//!
//! Case counts are modest for CI (a debug build runs them in seconds); `PROPTEST_CASES=N` raises them.

use deckhold_deck::layout::{FramingLine, LineKind};
use deckhold_schedule::EdgeKind;
use deckhold_tests::outlines::{
    distance_to_boundary, distance_to_segment, inside_or_on, is_convex, Point,
};
use deckhold_tests::reach::{cases, run_counted, REACHED};
use deckhold_tests::roofs::{lay_out, polygon_roofs, slope_for, LaidOut, Roof};
use deckhold_wind::WindAnalysis;
use proptest::prelude::*;
use proptest::test_runner::TestCaseError;
use serde_json::json;

/// A point this close to a line is on it, m (the layout works to about 1e-9 m).
const ON_M: f64 = 1e-6;

fn rectangle_roofs() -> impl Strategy<Value = Roof> {
    (
        4.0f64..30.0,
        4.0f64..30.0,
        prop_oneof![Just("hip"), Just("gable"), Just("monoslope"), Just("flat")],
        0.0f64..1.0,
        300.0f64..1220.0,
        0.0f64..900.0,
        0.0f64..900.0,
    )
        .prop_map(|(a, b, shape, unit, spacing_mm, eave_mm, rake_mm)| Roof {
            footprint: json!({ "rectangle": { "length_m": a.max(b), "width_m": a.min(b) } }),
            shape,
            slope_deg: slope_for(shape, unit),
            spacing_mm,
            eave_mm,
            rake_mm,
        })
}

/// The ridges, hips and valleys of the roof: every plane edge of those kinds.
fn roof_lines(wind: &WindAnalysis) -> Vec<(EdgeKind, Point, Point)> {
    wind.planes
        .iter()
        .flat_map(|plane| &plane.edges)
        .filter(|edge| {
            matches!(
                edge.kind,
                EdgeKind::Ridge | EdgeKind::Hip | EdgeKind::Valley
            )
        })
        .map(|edge| (edge.kind, edge.from_m, edge.to_m))
        .collect()
}

/// What a framing line's end lands on: "outline", or the kind of roof line it touches.
fn landing(wind: &WindAnalysis, lines: &[(EdgeKind, Point, Point)], p: Point) -> Option<String> {
    if distance_to_boundary(&wind.roof_outline_m, p) < ON_M {
        return Some("outline".to_string());
    }
    lines
        .iter()
        .find(|(_, a, b)| distance_to_segment(p, *a, *b) < ON_M)
        .map(|(kind, _, _)| kind.to_string())
}

fn along(line: &FramingLine, t: f64) -> Point {
    [
        line.start_m[0] + t * (line.end_m[0] - line.start_m[0]),
        line.start_m[1] + t * (line.end_m[1] - line.start_m[1]),
    ]
}

fn corner_index(polygon: &[Point], p: Point) -> Option<usize> {
    polygon
        .iter()
        .position(|q| (q[0] - p[0]).hypot(q[1] - p[1]) < ON_M)
}

/// Checks 1 to 4 on one roof; Ok(false) when the roof was refused before the framing.
fn check_framing(roof: &Roof) -> Result<bool, TestCaseError> {
    let Some(LaidOut { wind, layout, .. }) = lay_out(roof) else {
        return Ok(false);
    };
    let outline = &wind.roof_outline_m;
    let lines = roof_lines(&wind);
    prop_assert!(!layout.framing.is_empty());
    // 1. Inside the roof; both ends land on the outline or a ridge, hip or valley.
    for line in &layout.framing {
        for step in 0..=16 {
            let p = along(line, f64::from(step) / 16.0);
            prop_assert!(
                inside_or_on(outline, p, ON_M),
                "{} line {:?} leaves the roof at {p:?}",
                line.kind,
                line.number
            );
        }
        for end in [line.start_m, line.end_m] {
            prop_assert!(
                landing(&wind, &lines, end).is_some(),
                "{} line {:?} ends at {end:?}, on no eave, rake, ridge, hip or valley",
                line.kind,
                line.number
            );
        }
    }
    // 2. Numbered lines: in their own plane, ends on its boundary.
    for line in &layout.lines {
        let plane = &wind.planes[line.plane_index];
        for end in [line.plan_start_m, line.plan_end_m] {
            prop_assert!(
                distance_to_boundary(&plane.polygon_m, end) < ON_M,
                "line {} ends off its plane's boundary at {end:?}",
                line.number
            );
        }
        prop_assert_eq!(
            line.intervals_m.len(),
            1,
            "line {} leaves its plane",
            line.number
        );
        for step in 0..=16 {
            let t = f64::from(step) / 16.0;
            let p = [
                line.plan_start_m[0] + t * (line.plan_end_m[0] - line.plan_start_m[0]),
                line.plan_start_m[1] + t * (line.plan_end_m[1] - line.plan_start_m[1]),
            ];
            prop_assert!(
                inside_or_on(&plane.polygon_m, p, ON_M),
                "line {} leaves plane {} at {p:?}",
                line.number,
                line.plane_index
            );
        }
    }
    // 3. Hips and valleys: from the right corners, or from where roof lines meet.
    for rafter in layout
        .framing
        .iter()
        .filter(|l| matches!(l.kind, LineKind::Hip | LineKind::Valley))
    {
        let hip = rafter.kind == LineKind::Hip;
        for end in [rafter.start_m, rafter.end_m] {
            if distance_to_boundary(outline, end) >= ON_M {
                continue;
            }
            let corner = corner_index(outline, end);
            prop_assert!(
                corner.is_some(),
                "{} rafter meets the outline at {end:?}, off a corner",
                rafter.kind
            );
            if let Some(index) = corner {
                prop_assert_eq!(
                    is_convex(outline, index),
                    hip,
                    "{} rafter from corner {:?}",
                    rafter.kind,
                    end
                );
            }
        }
        if distance_to_boundary(outline, rafter.start_m) >= ON_M {
            let meeting = lines
                .iter()
                .filter(|(_, a, b)| {
                    let touches = |p: Point| {
                        (p[0] - rafter.start_m[0]).hypot(p[1] - rafter.start_m[1]) < ON_M
                    };
                    touches(*a) || touches(*b)
                })
                .count();
            prop_assert!(
                meeting >= 3,
                "{} rafter starts at {:?}, off the outline, where only {meeting} plane edges meet",
                rafter.kind,
                rafter.start_m
            );
        }
    }
    // 4. A hip roof: a hip from every outside corner, a valley from every inside corner.
    if roof.shape == "hip" {
        for (index, corner) in outline.iter().enumerate() {
            let kind = if is_convex(outline, index) {
                LineKind::Hip
            } else {
                LineKind::Valley
            };
            let found = layout.framing.iter().any(|l| {
                l.kind == kind && (l.start_m[0] - corner[0]).hypot(l.start_m[1] - corner[1]) < ON_M
            });
            prop_assert!(found, "no {kind} rafter from corner {corner:?}");
        }
    }
    Ok(true)
}

#[test]
fn framing_on_random_l_t_u_z_roofs_ends_on_roof_lines_and_hips_and_valleys_start_at_the_right_corners(
) {
    run_counted(
        "polygon framing",
        cases(32),
        REACHED,
        polygon_roofs(),
        |roof| check_framing(&roof),
    );
}

#[test]
fn framing_on_random_rectangles_of_every_shape_ends_on_roof_lines() {
    run_counted(
        "rectangle framing",
        cases(24),
        REACHED,
        rectangle_roofs(),
        |roof| check_framing(&roof),
    );
}
