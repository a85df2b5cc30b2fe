//! The list of every member the deck lands on: the numbered lines, plus the hip and valley rafters
//! found on the planes' oblique edges.
//!
//! An oblique edge of a sloped plane is a hip when crossing it outward goes up the slope (the plane
//! falls away from it) and a valley when crossing it outward goes down (the plane falls toward it).

use super::{FramingLine, LayoutLine, LineKind, PlaneGeometry};

/// Ends closer than this are the same point, m.
const SAME_POINT_M: f64 = 1e-6;

/// Every member: the layout's lines in order, then each hip and valley rafter once.
pub(crate) fn framing_lines(planes: &[PlaneGeometry], lines: &[LayoutLine]) -> Vec<FramingLine> {
    let mut all: Vec<FramingLine> = lines
        .iter()
        .map(|line| FramingLine {
            number: Some(line.number),
            kind: line.kind,
            start_m: line.plan_start_m,
            end_m: line.plan_end_m,
            length_on_slope_m: line.intervals_m.last().map_or(0.0, |i| i[1]),
        })
        .collect();
    let mut rafters: Vec<FramingLine> = Vec::new();
    for plane in planes {
        for rafter in oblique_rafters(plane) {
            let same = |other: &FramingLine| {
                (close(other.start_m, rafter.start_m) && close(other.end_m, rafter.end_m))
                    || (close(other.start_m, rafter.end_m) && close(other.end_m, rafter.start_m))
            };
            if !rafters.iter().any(same) {
                rafters.push(rafter);
            }
        }
    }
    all.extend(rafters);
    all
}

fn close(a: [f64; 2], b: [f64; 2]) -> bool {
    (a[0] - b[0]).hypot(a[1] - b[1]) < SAME_POINT_M
}

/// The hip and valley rafters along the oblique edges of one sloped plane.
fn oblique_rafters(plane: &PlaneGeometry) -> Vec<FramingLine> {
    let down = plane.downslope_m;
    if down == [0.0, 0.0] {
        return Vec::new();
    }
    let tan = plane.slope_deg.to_radians().tan();
    let polygon = &plane.polygon_m;
    let orientation: f64 = polygon
        .iter()
        .enumerate()
        .map(|(i, a)| {
            let b = polygon[(i + 1) % polygon.len()];
            a[0] * b[1] - b[0] * a[1]
        })
        .sum::<f64>()
        .signum();
    let mut rafters = Vec::new();
    for (i, a) in polygon.iter().enumerate() {
        let b = polygon[(i + 1) % polygon.len()];
        let (dx, dy) = (b[0] - a[0], b[1] - a[1]);
        let plan_length_m = dx.hypot(dy);
        if plan_length_m < SAME_POINT_M
            || dx.abs() < 1e-9 * plan_length_m
            || dy.abs() < 1e-9 * plan_length_m
        {
            continue;
        }
        // Outward normal of a counter-clockwise polygon is (dy, -dx).
        let outward = [orientation * dy, -orientation * dx];
        let going_down = outward[0] * down[0] + outward[1] * down[1];
        let kind = if going_down < 0.0 {
            LineKind::Hip
        } else {
            LineKind::Valley
        };
        // Rise between the ends: the slope times their plan distance measured down the slope.
        let rise_m = tan * (dx * down[0] + dy * down[1]).abs();
        // Start at the low end.
        let a_is_low = a[0] * down[0] + a[1] * down[1] > b[0] * down[0] + b[1] * down[1];
        let (start_m, end_m) = if a_is_low { (*a, b) } else { (b, *a) };
        rafters.push(FramingLine {
            number: None,
            kind,
            start_m,
            end_m,
            length_on_slope_m: plan_length_m.hypot(rise_m),
        });
    }
    rafters
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn a_hip_end_has_two_hips_of_the_length_geometry_gives() {
        // Hip end: eave along x = 0 from y = 0 to 8, apex at (4, 4), 30 deg. Each hip runs 4 m across
        // and 4 m along in plan: 5.657 m; it rises tan 30 x 4 m (its distance up the slope) = 2.309 m;
        // on the slope sqrt(5.657² + 2.309²) = 6.110 m.
        let plane = PlaneGeometry {
            polygon_m: vec![[0.0, 0.0], [4.0, 4.0], [0.0, 8.0]],
            slope_deg: 30.0,
            downslope_m: [-1.0, 0.0],
        };
        let rafters = oblique_rafters(&plane);
        assert_eq!(rafters.len(), 2);
        for rafter in &rafters {
            assert_eq!(rafter.kind, LineKind::Hip);
            assert_relative_eq!(rafter.end_m[0], 4.0);
            let expected = (32.0f64 + (30f64.to_radians().tan() * 4.0).powi(2)).sqrt();
            assert_relative_eq!(rafter.length_on_slope_m, expected, max_relative = 1e-12);
        }
    }

    #[test]
    fn an_edge_the_plane_falls_toward_is_a_valley() {
        // A plane falling toward -y whose oblique edge has the plane above it: outward is down-slope.
        let plane = PlaneGeometry {
            polygon_m: vec![[0.0, 0.0], [4.0, 0.0], [4.0, 4.0], [2.0, 4.0]],
            slope_deg: 30.0,
            downslope_m: [0.0, 1.0],
        };
        let rafters = oblique_rafters(&plane);
        assert_eq!(rafters.len(), 1);
        assert_eq!(rafters[0].kind, LineKind::Valley);
    }
}
