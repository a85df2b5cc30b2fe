//! Random house outlines for the property tests: rectilinear polygons of 4 to 12 corners (L, T, U, Z
//! and stepped shapes), and the project files that put a pitched roof on them.

use proptest::prelude::*;

/// A plan point, m.
pub type Point = [f64; 2];

/// A random x-monotone rectilinear outline, counter-clockwise: one to three columns side by side, each
/// spanning its own height range (one column: a rectangle; two: an L, a T or a Z; three: a U, a T, a
/// cross or steps), turned a right angle half the time, sizes on a 0.5 m grid half the time (so
/// walls line up exactly and ridges meet at one point); 4 to 12 corners. Walls are at least 4 m
/// long so that overhangs up to 0.9 m never fold the outline back on itself.
pub fn rectilinear_outline() -> impl Strategy<Value = Vec<Point>> {
    let column = (4.0f64..12.0, 0.0f64..8.0, 4.0f64..14.0);
    (
        prop::collection::vec(column, 1..=3),
        any::<bool>(),
        any::<bool>(),
    )
        .prop_filter_map(
            "neighbouring columns share at least 4 m",
            |(columns, turn, snap)| {
                let round = |v: f64| if snap { (v * 2.0).round() / 2.0 } else { v };
                let mut x = 0.0;
                let mut cells = Vec::new();
                for (width, bottom, height) in columns {
                    let (w, b, h) = (round(width), round(bottom), round(height));
                    cells.push((x, x + w, b, b + h));
                    x += w;
                }
                for pair in cells.windows(2) {
                    let (a, b) = (pair[0], pair[1]);
                    let shared = a.3.min(b.3) - a.2.max(b.2);
                    // Steps between neighbours are 0 or at least 1 m (no sliver walls).
                    let step = |p: f64, q: f64| (p - q).abs() < 1e-9 || (p - q).abs() >= 1.0;
                    if shared < 4.0 || !step(a.2, b.2) || !step(a.3, b.3) {
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
                let mut corners = without_straight_points(&points);
                if turn {
                    // (x, y) -> (-y, x): a quarter turn keeps the walk counter-clockwise.
                    corners = corners.iter().map(|p| [-p[1], p[0]]).collect();
                }
                (corners.len() >= 4 && corners.len() <= 12).then_some(corners)
            },
        )
}

/// Drops repeated points and points where the walk runs straight on.
fn without_straight_points(points: &[Point]) -> Vec<Point> {
    let mut kept: Vec<Point> = Vec::new();
    for p in points {
        if kept.last().is_some_and(|q| same(*q, *p)) {
            continue;
        }
        kept.push(*p);
    }
    if kept.len() > 1 && same(kept[0], kept[kept.len() - 1]) {
        kept.pop();
    }
    loop {
        let n = kept.len();
        let straight = (0..n).find(|&i| {
            let (a, b, c) = (kept[(i + n - 1) % n], kept[i], kept[(i + 1) % n]);
            ((b[0] - a[0]) * (c[1] - b[1]) - (b[1] - a[1]) * (c[0] - b[0])).abs() < 1e-9
        });
        match straight {
            Some(i) if n > 3 => {
                kept.remove(i);
            }
            _ => return kept,
        }
    }
}

fn same(p: Point, q: Point) -> bool {
    (p[0] - q[0]).abs() + (p[1] - q[1]).abs() < 1e-9
}

/// True when corner `index` of a counter-clockwise polygon turns left (an outside corner).
pub fn is_convex(polygon: &[Point], index: usize) -> bool {
    let n = polygon.len();
    let (a, b, c) = (
        polygon[(index + n - 1) % n],
        polygon[index],
        polygon[(index + 1) % n],
    );
    (b[0] - a[0]) * (c[1] - b[1]) - (b[1] - a[1]) * (c[0] - b[0]) > 0.0
}

/// Distance from `p` to the segment `a`-`b`, m.
pub fn distance_to_segment(p: Point, a: Point, b: Point) -> f64 {
    let (dx, dy) = (b[0] - a[0], b[1] - a[1]);
    let length2 = dx * dx + dy * dy;
    if length2 == 0.0 {
        return (p[0] - a[0]).hypot(p[1] - a[1]);
    }
    let t = (((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / length2).clamp(0.0, 1.0);
    (p[0] - a[0] - t * dx).hypot(p[1] - a[1] - t * dy)
}

/// Distance from `p` to the boundary of `polygon`, m.
pub fn distance_to_boundary(polygon: &[Point], p: Point) -> f64 {
    (0..polygon.len())
        .map(|i| distance_to_segment(p, polygon[i], polygon[(i + 1) % polygon.len()]))
        .fold(f64::INFINITY, f64::min)
}

/// True when `p` is inside `polygon` or within `tolerance_m` of its boundary.
pub fn inside_or_on(polygon: &[Point], p: Point, tolerance_m: f64) -> bool {
    distance_to_boundary(polygon, p) <= tolerance_m || inside(polygon, p)
}

/// True when `p` is inside `polygon` (crossing parity; a point on the boundary may go either way).
pub fn inside(polygon: &[Point], p: Point) -> bool {
    let mut crossings = 0;
    for (i, a) in polygon.iter().enumerate() {
        let b = polygon[(i + 1) % polygon.len()];
        if (a[1] > p[1]) != (b[1] > p[1]) {
            let x = a[0] + (p[1] - a[1]) / (b[1] - a[1]) * (b[0] - a[0]);
            if x > p[0] {
                crossings += 1;
            }
        }
    }
    crossings % 2 == 1
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn straight_points_and_repeats_go() {
        let walk = [
            [0.0, 0.0],
            [2.0, 0.0],
            [4.0, 0.0],
            [4.0, 3.0],
            [4.0, 3.0],
            [0.0, 3.0],
        ];
        assert_eq!(
            without_straight_points(&walk),
            vec![[0.0, 0.0], [4.0, 0.0], [4.0, 3.0], [0.0, 3.0]]
        );
    }

    #[test]
    fn an_l_has_one_inside_corner() {
        let l = [
            [0.0, 0.0],
            [6.0, 0.0],
            [6.0, 4.0],
            [4.0, 4.0],
            [4.0, 8.0],
            [0.0, 8.0],
        ];
        let convex: Vec<bool> = (0..6).map(|i| is_convex(&l, i)).collect();
        assert_eq!(convex, [true, true, true, false, true, true]);
    }
}
