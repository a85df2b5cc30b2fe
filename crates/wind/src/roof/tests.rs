//! Pitched-roof geometry: hand-worked shapes and properties on random rectilinear outlines.

use super::*;
use crate::geometry::{make_ccw, rectangle, signed_area_m2};
use approx::assert_relative_eq;
use proptest::prelude::*;

fn total_length(roof: &PitchedRoof, kind: EdgeKind) -> f64 {
    roof.lines
        .iter()
        .filter(|l| l.kind == kind)
        .map(BoundLine::length_m)
        .sum()
}

fn plan_area(roof: &PitchedRoof) -> f64 {
    roof.planes.iter().map(|p| area_m2(&p.polygon_m)).sum()
}

/// Two 4 m wings, 10 m long, meeting at a corner (shared by the roof module's tests).
pub(crate) fn l_shape() -> Vec<Point> {
    vec![
        [0.0, 0.0],
        [10.0, 0.0],
        [10.0, 4.0],
        [4.0, 4.0],
        [4.0, 10.0],
        [0.0, 10.0],
    ]
}

/// A 20 × 8 m main wing with an 8 × 10 m stem at its middle.
pub(crate) fn t_shape() -> Vec<Point> {
    vec![
        [0.0, 0.0],
        [20.0, 0.0],
        [20.0, 8.0],
        [14.0, 8.0],
        [14.0, 18.0],
        [6.0, 18.0],
        [6.0, 8.0],
        [0.0, 8.0],
    ]
}

#[test]
fn hip_rectangle_by_hand() {
    // 12 × 8 m, no overhang: four hips from the corners, each the diagonal of a 4 m square
    // (4√2 = 5.657 m in plan), a 4 m ridge between x = 4 and x = 8.
    let roof = pitched_roof(&rectangle(0.0, 0.0, 12.0, 8.0), &[false; 4], 0.0, 0.0).expect("roof");
    assert_eq!(roof.planes.len(), 4);
    assert_relative_eq!(
        total_length(&roof, EdgeKind::Hip),
        4.0 * 4.0 * 2f64.sqrt(),
        max_relative = 1e-9
    );
    assert_relative_eq!(
        total_length(&roof, EdgeKind::Ridge),
        4.0,
        max_relative = 1e-9
    );
    assert_relative_eq!(total_length(&roof, EdgeKind::Valley), 0.0);
    assert_relative_eq!(roof.wall_to_top_run_m, 4.0);
}

#[test]
fn hip_l_shape_by_hand() {
    // L of two 4 m wide wings, 10 m long each, 0.5 m eave overhang all round. Eave outline:
    // (-0.5,-0.5)-(10.5,-0.5)-(10.5,4.5)-(4.5,4.5)-(4.5,10.5)-(-0.5,10.5); each wing is 5 m wide
    // at the eave, so hips and the valley rise 2.5 m in plan to ridges at 2.5 m run.
    // Hips: five convex corners. The three end corners (10.5,-0.5), (10.5,4.5), (4.5,10.5),
    // (-0.5,10.5) each rise 2.5 m: 2.5√2 each. The outer corner (-0.5,-0.5) rises to (2,2):
    // 2.5√2. The valley from (4.5,4.5) runs to (2,2): 2.5√2. Ridges: (2,2)-(8,2) and (2,2)-(2,8),
    // 6 m each. Plan area: 64 + 0.5 × 40 (perimeter) + 4 × 0.25 (convex less reflex corners) = 85 m².
    let roof = pitched_roof(&l_shape(), &[false; 6], 0.5, 0.0).expect("roof");
    let r = 2.5 * 2f64.sqrt();
    assert_relative_eq!(
        total_length(&roof, EdgeKind::Hip),
        5.0 * r,
        max_relative = 1e-9
    );
    assert_relative_eq!(
        total_length(&roof, EdgeKind::Valley),
        r,
        max_relative = 1e-9
    );
    assert_relative_eq!(
        total_length(&roof, EdgeKind::Ridge),
        12.0,
        max_relative = 1e-9
    );
    assert_relative_eq!(plan_area(&roof), 85.0, max_relative = 1e-12);
    assert_relative_eq!(area_m2(&roof.outline_m), 85.0, max_relative = 1e-12);
    assert_eq!(roof.planes.len(), 6);
    assert_relative_eq!(roof.wall_to_top_run_m, 2.0);
}

#[test]
fn cross_gable_t_by_hand() {
    // T: main wing 20 × 8 m (ridge along x, gables at x = 0 and x = 20), stem 8 × 10 m (ridge
    // along y, gable at y = 18). Equal widths: both ridges at 4 m run, meeting at (10, 4). Valleys
    // from the inside corners (6,8) and (14,8) to (10,4): 4√2 each. No hips. Ridges: 20 m along
    // the main wing, 14 m of stem ridge from y = 18 to y = 4. No overhangs.
    let gables = wings::detect_gable_walls(&t_shape(), true);
    let roof = pitched_roof(&t_shape(), &gables, 0.0, 0.0).expect("roof");
    assert_relative_eq!(total_length(&roof, EdgeKind::Hip), 0.0);
    assert_relative_eq!(
        total_length(&roof, EdgeKind::Valley),
        8.0 * 2f64.sqrt(),
        max_relative = 1e-9
    );
    assert_relative_eq!(
        total_length(&roof, EdgeKind::Ridge),
        34.0,
        max_relative = 1e-9
    );
    assert_relative_eq!(plan_area(&roof), 240.0, max_relative = 1e-12);
    assert_eq!(roof.gable_walls_m.len(), 3);
    // Front plane 20 × 4, two back planes (6 × 4 each less the valley triangles), two stem planes.
    assert_eq!(roof.planes.len(), 5);
}

#[test]
fn gable_rectangle_matches_the_two_plane_gable() {
    // 12 × 8 m, eave 0.6 m, rake 0.3 m: two planes 12.6 × 4.6 m, ridge 12.6 m.
    let roof = pitched_roof(
        &rectangle(0.0, 0.0, 12.0, 8.0),
        &[false, true, false, true],
        0.6,
        0.3,
    )
    .expect("roof");
    assert_eq!(roof.planes.len(), 2);
    for plane in &roof.planes {
        assert_relative_eq!(area_m2(&plane.polygon_m), 12.6 * 4.6, max_relative = 1e-12);
    }
    assert_relative_eq!(
        total_length(&roof, EdgeKind::Ridge),
        12.6,
        max_relative = 1e-12
    );
    let rakes = roof
        .planes
        .iter()
        .flat_map(|p| &p.bounds)
        .filter(|b| b.kind == EdgeKind::Rake)
        .count();
    assert_eq!(rakes, 4);
}

#[test]
fn merge_keeps_pinched_loops_apart() {
    let pieces = vec![rectangle(0.0, 0.0, 1.0, 1.0), rectangle(1.0, 1.0, 2.0, 2.0)];
    let loops = merge::union(&pieces);
    assert_eq!(loops.len(), 2);
}

/// A random x-monotone rectilinear outline: up to three columns, each spanning its own height
/// range (L, T, U, Z, steps), transposed half the time; 4 to 12 corners.
fn outline() -> impl Strategy<Value = Vec<Point>> {
    let column = (2.0f64..12.0, 0.0f64..6.0, 3.0f64..14.0);
    (
        prop::collection::vec(column, 1..=3),
        any::<bool>(),
        any::<bool>(),
    )
        .prop_filter_map("columns must overlap", |(columns, transpose, snap)| {
            let round = |v: f64| if snap { (v * 2.0).round() / 2.0 } else { v };
            let mut x = 0.0;
            let mut cells = Vec::new();
            for (width, bottom, height) in columns {
                let (w, b, h) = (round(width).max(1.0), round(bottom), round(height).max(1.0));
                cells.push((x, x + w, b, b + h));
                x += w;
            }
            for pair in cells.windows(2) {
                let overlap = pair[0].3.min(pair[1].3) - pair[0].2.max(pair[1].2);
                if overlap < 1.0 {
                    return None;
                }
            }
            // Walk the bottom left to right, then the top right to left.
            let mut points: Vec<Point> = Vec::new();
            for (x0, x1, b, _) in &cells {
                points.push([*x0, *b]);
                points.push([*x1, *b]);
            }
            for (x0, x1, _, t) in cells.iter().rev() {
                points.push([*x1, *t]);
                points.push([*x0, *t]);
            }
            let points = merge::simplify(&points);
            let points: Vec<Point> = if transpose {
                points.iter().map(|p| [p[1], p[0]]).collect()
            } else {
                points
            };
            let points = make_ccw(points);
            (points.len() >= 4 && points.len() <= 12).then_some(points)
        })
}

fn is_corner(outline: &[Point], p: Point) -> Option<usize> {
    outline
        .iter()
        .position(|q| (q[0] - p[0]).abs() + (q[1] - p[1]).abs() < 1e-6)
}

fn on_outline(outline: &[Point], p: Point) -> bool {
    let n = outline.len();
    (0..n).any(|i| {
        let a = outline[i];
        let b = outline[(i + 1) % n];
        let within = p[0] >= a[0].min(b[0]) - 1e-6
            && p[0] <= a[0].max(b[0]) + 1e-6
            && p[1] >= a[1].min(b[1]) - 1e-6
            && p[1] <= a[1].max(b[1]) + 1e-6;
        within && ((b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0])).abs() < 1e-6
    })
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(64))]

    #[test]
    fn planes_tile_the_outline_and_lines_start_at_the_right_corners(
        building in outline(),
        rise_in_12 in 2.0f64..12.0,
        eave_mm in 0.0f64..900.0,
        rake_mm in 0.0f64..900.0,
        gable in any::<bool>(),
    ) {
        let gables = if gable {
            wings::detect_gable_walls(&building, true)
        } else {
            vec![false; building.len()]
        };
        let Ok(roof) = pitched_roof(&building, &gables, eave_mm / 1000.0, rake_mm / 1000.0) else {
            // Only a gable running into another wing may be refused.
            prop_assume!(false);
            unreachable!();
        };
        // Areas on the slope add up to the plan area over cos(slope).
        let cos = (rise_in_12 / 12.0).atan().cos();
        let on_slope: f64 = roof.planes.iter().map(|p| area_m2(&p.polygon_m) / cos).sum();
        let outline_area = area_m2(&roof.outline_m);
        prop_assert!((on_slope - outline_area / cos).abs() <= 1e-9 * outline_area / cos,
            "{} vs {}", on_slope * cos, outline_area);
        for plane in &roof.planes {
            prop_assert!(signed_area_m2(&plane.polygon_m) > 1e-9);
        }
        // Every hip or valley that reaches the outline reaches it at a corner: a hip at an
        // outside corner, a valley at an inside corner.
        let outline = &roof.outline_m;
        for line in roof.lines.iter().filter(|l| matches!(l.kind, EdgeKind::Hip | EdgeKind::Valley)) {
            for end in [line.from_m, line.to_m] {
                if !on_outline(outline, end) {
                    continue;
                }
                let corner = is_corner(outline, end);
                prop_assert!(corner.is_some(), "{:?} ends on an outline edge at {:?}", line.kind, end);
                if let Some(index) = corner {
                    let convex = wings::is_convex(outline, index);
                    prop_assert_eq!(convex, line.kind == EdgeKind::Hip, "{:?} at {:?}", line.kind, end);
                }
            }
        }
        // On a hip roof every outside corner has a hip and every inside corner a valley.
        if !gable {
            for (index, corner) in outline.iter().enumerate() {
                let kind = if wings::is_convex(outline, index) { EdgeKind::Hip } else { EdgeKind::Valley };
                let found = roof.lines.iter().any(|l| l.kind == kind && is_corner(&[*corner], l.from_m).is_some());
                prop_assert!(found, "no {:?} from corner {:?}", kind, corner);
            }
        }
    }
}
