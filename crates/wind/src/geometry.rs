//! Plan-polygon helpers: area, centroid, orientation, convex splitting, containment.

/// A plan point, metres.
pub type Point = [f64; 2];

/// Shoelace signed area, m²: positive for counter-clockwise polygons.
pub fn signed_area_m2(polygon: &[Point]) -> f64 {
    let count = polygon.len();
    let mut twice = 0.0;
    for index in 0..count {
        let [x0, y0] = polygon[index];
        let [x1, y1] = polygon[(index + 1) % count];
        twice += x0 * y1 - x1 * y0;
    }
    twice / 2.0
}

pub fn area_m2(polygon: &[Point]) -> f64 {
    signed_area_m2(polygon).abs()
}

/// Returns the polygon in counter-clockwise order.
pub fn make_ccw(mut polygon: Vec<Point>) -> Vec<Point> {
    if signed_area_m2(&polygon) < 0.0 {
        polygon.reverse();
    }
    polygon
}

/// Area centroid; the vertex mean for a degenerate polygon.
pub fn centroid(polygon: &[Point]) -> Point {
    let count = polygon.len();
    let area = signed_area_m2(polygon);
    if count == 0 {
        return [0.0, 0.0];
    }
    if area.abs() < 1e-12 {
        let sum = polygon
            .iter()
            .fold([0.0, 0.0], |acc, p| [acc[0] + p[0], acc[1] + p[1]]);
        return [sum[0] / count as f64, sum[1] / count as f64];
    }
    let (mut cx, mut cy) = (0.0, 0.0);
    for index in 0..count {
        let [x0, y0] = polygon[index];
        let [x1, y1] = polygon[(index + 1) % count];
        let cross = x0 * y1 - x1 * y0;
        cx += (x0 + x1) * cross;
        cy += (y0 + y1) * cross;
    }
    [cx / (6.0 * area), cy / (6.0 * area)]
}

/// Where `point` lies from the line `normal · p = offset`: negative below, positive above.
fn side_of_line(point: &Point, normal: Point, offset: f64) -> f64 {
    normal[0] * point[0] + normal[1] * point[1] - offset
}

/// Every vertex lies strictly on the same side of the line `normal · p = offset`: splitting the
/// polygon there gives the polygon itself and nothing (the common case when a zone layout cuts many
/// pieces by each of its lines, which a caller can then skip).
pub fn wholly_on_one_side(polygon: &[Point], normal: Point, offset: f64) -> bool {
    // One pass: every side strictly negative, or every side strictly positive (a NaN is neither).
    let (mut all_below, mut all_above) = (true, true);
    for p in polygon {
        let side = side_of_line(p, normal, offset);
        all_below &= side < 0.0;
        all_above &= side > 0.0;
        if !(all_below || all_above) {
            return false;
        }
    }
    true
}

/// Splits a convex polygon by the line `normal · p = offset` into (below, above) parts.
/// Either part may be empty.
pub fn split_by_line(polygon: &[Point], normal: Point, offset: f64) -> (Vec<Point>, Vec<Point>) {
    let side = |p: &Point| side_of_line(p, normal, offset);
    // A convex polygon gains at most two crossing points on either side.
    let mut below = Vec::with_capacity(polygon.len() + 2);
    let mut above = Vec::with_capacity(polygon.len() + 2);
    let count = polygon.len();
    for index in 0..count {
        let current = polygon[index];
        let next = polygon[(index + 1) % count];
        let s0 = side(&current);
        let s1 = side(&next);
        if s0 <= 0.0 {
            below.push(current);
        }
        if s0 >= 0.0 {
            above.push(current);
        }
        if (s0 < 0.0 && s1 > 0.0) || (s0 > 0.0 && s1 < 0.0) {
            let t = s0 / (s0 - s1);
            let crossing = [
                current[0] + t * (next[0] - current[0]),
                current[1] + t * (next[1] - current[1]),
            ];
            below.push(crossing);
            above.push(crossing);
        }
    }
    (below, above)
}

/// Even-odd ray test; points on the boundary may fall either way.
pub fn contains(polygon: &[Point], point: Point) -> bool {
    let count = polygon.len();
    let mut inside = false;
    for index in 0..count {
        let [x0, y0] = polygon[index];
        let [x1, y1] = polygon[(index + 1) % count];
        if (y0 > point[1]) != (y1 > point[1]) {
            let x_cross = x0 + (point[1] - y0) / (y1 - y0) * (x1 - x0);
            if point[0] < x_cross {
                inside = !inside;
            }
        }
    }
    inside
}

/// Removes repeated vertices and vertices lying on the straight line through their neighbours
/// (within `tolerance_m`).
pub fn drop_collinear(polygon: &[Point], tolerance_m: f64) -> Vec<Point> {
    let mut points: Vec<Point> = polygon.to_vec();
    let mut changed = true;
    while changed && points.len() >= 3 {
        changed = false;
        let count = points.len();
        for index in 0..count {
            let prev = points[(index + count - 1) % count];
            let here = points[index];
            let next = points[(index + 1) % count];
            let (dx, dy) = (next[0] - prev[0], next[1] - prev[1]);
            let length = dx.hypot(dy);
            let off_line = if length == 0.0 {
                (here[0] - prev[0]).hypot(here[1] - prev[1])
            } else {
                ((here[0] - prev[0]) * dy - (here[1] - prev[1]) * dx).abs() / length
            };
            let repeated = (here[0] - prev[0]).hypot(here[1] - prev[1]) < tolerance_m;
            if repeated || off_line < tolerance_m {
                points.remove(index);
                changed = true;
                break;
            }
        }
    }
    points
}

/// Axis-aligned rectangle, counter-clockwise.
/// The point of the segment `start`-`end` nearest to `point`.
pub fn nearest_on_segment(point: Point, start: Point, end: Point) -> Point {
    let (dx, dy) = (end[0] - start[0], end[1] - start[1]);
    let t = (((point[0] - start[0]) * dx + (point[1] - start[1]) * dy) / (dx * dx + dy * dy))
        .clamp(0.0, 1.0);
    [start[0] + t * dx, start[1] + t * dy]
}

pub fn rectangle(x0: f64, y0: f64, x1: f64, y1: f64) -> Vec<Point> {
    vec![[x0, y0], [x1, y0], [x1, y1], [x0, y1]]
}

/// Whether two closed segments share a point.
pub fn segments_touch(a0: Point, a1: Point, b0: Point, b1: Point) -> bool {
    let orient = |p: Point, q: Point, r: Point| {
        let value = (q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0]);
        if value.abs() < 1e-12 {
            0
        } else if value > 0.0 {
            1
        } else {
            -1
        }
    };
    let on_segment = |p: Point, q: Point, r: Point| {
        r[0] >= p[0].min(q[0]) - 1e-12
            && r[0] <= p[0].max(q[0]) + 1e-12
            && r[1] >= p[1].min(q[1]) - 1e-12
            && r[1] <= p[1].max(q[1]) + 1e-12
    };
    let o1 = orient(a0, a1, b0);
    let o2 = orient(a0, a1, b1);
    let o3 = orient(b0, b1, a0);
    let o4 = orient(b0, b1, a1);
    if o1 != o2 && o3 != o4 && o1 != 0 && o2 != 0 && o3 != 0 && o4 != 0 {
        return true;
    }
    (o1 == 0 && on_segment(a0, a1, b0))
        || (o2 == 0 && on_segment(a0, a1, b1))
        || (o3 == 0 && on_segment(b0, b1, a0))
        || (o4 == 0 && on_segment(b0, b1, a1))
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn rectangle_area_and_centroid() {
        let square = rectangle(0.0, 0.0, 2.0, 3.0);
        assert_relative_eq!(signed_area_m2(&square), 6.0);
        let [cx, cy] = centroid(&square);
        assert_relative_eq!(cx, 1.0);
        assert_relative_eq!(cy, 1.5);
    }

    #[test]
    fn split_conserves_area() {
        let square = rectangle(0.0, 0.0, 2.0, 2.0);
        let (below, above) = split_by_line(&square, [1.0, 1.0], 1.0);
        assert_relative_eq!(area_m2(&below), 0.5);
        assert_relative_eq!(area_m2(&above), 3.5);
    }

    #[test]
    fn orientation_is_fixed() {
        let clockwise = vec![[0.0, 0.0], [0.0, 1.0], [1.0, 1.0], [1.0, 0.0]];
        assert!(signed_area_m2(&make_ccw(clockwise)) > 0.0);
    }

    #[test]
    fn containment_and_crossing() {
        let square = rectangle(0.0, 0.0, 1.0, 1.0);
        assert!(contains(&square, [0.5, 0.5]));
        assert!(!contains(&square, [1.5, 0.5]));
        assert!(segments_touch(
            [0.0, 0.0],
            [1.0, 1.0],
            [0.0, 1.0],
            [1.0, 0.0]
        ));
        assert!(!segments_touch(
            [0.0, 0.0],
            [1.0, 0.0],
            [0.0, 1.0],
            [1.0, 1.0]
        ));
    }
}
