//! Wings of a gabled house: which walls are gable ends, and the outline the roof planes are built on.
//!
//! How wings are found: a wall whose two corners are both outside (convex) corners ends a wing when
//! the wing behind it is longer than the wall is wide: push the wall straight into the building
//! across its own width; if it travels further than its own length before it meets another wall,
//! the wall is the narrow end of a wing and carries a gable. A square wing (travel equal to the
//! width) is decided by `roof.ridge_along`: ridge along the length (plan x) puts the gables on the
//! walls across x. Anything else the user states with `roof.gable_walls`.
//!
//! How the planes follow: a gable end is a wall that does not slope; the roof over its wing is the
//! same as if the wing ran on past the wall. So the eave outline is extended past each gable wall by
//! more than half the wing's width, its hip roof is built, and the planes are cut at the rake line.
//! Every eave keeps the same height and slope, each wing gets a ridge along its length that runs out
//! to the gable, and valleys come out at the inside corners where wings meet.

use crate::geometry::Point;

use super::skeleton::SAME_M;

/// Inward unit normal of edge `index` of a counter-clockwise polygon.
pub(crate) fn inward_normal(polygon: &[Point], index: usize) -> Point {
    let a = polygon[index];
    let b = polygon[(index + 1) % polygon.len()];
    let length = (b[0] - a[0]).hypot(b[1] - a[1]);
    [-(b[1] - a[1]) / length, (b[0] - a[0]) / length]
}

/// Whether vertex `index` of a counter-clockwise polygon is an outside (convex) corner.
pub(crate) fn is_convex(polygon: &[Point], index: usize) -> bool {
    let count = polygon.len();
    let prev = polygon[(index + count - 1) % count];
    let here = polygon[index];
    let next = polygon[(index + 1) % count];
    (here[0] - prev[0]) * (next[1] - here[1]) - (here[1] - prev[1]) * (next[0] - here[0]) > 0.0
}

/// Moves every edge of a counter-clockwise rectilinear polygon outward by its own distance, m.
/// Adjacent edges are perpendicular, so each new corner is where the two moved lines cross.
/// `Err(index)` names a wall whose moved edge would fold back on itself (a short step next to a
/// wider overhang), where the roof outline is not an offset of the walls any more.
pub(crate) fn offset_edges(polygon: &[Point], distances_m: &[f64]) -> Result<Vec<Point>, usize> {
    let count = polygon.len();
    let moved: Vec<Point> = (0..count)
        .map(|index| {
            let before = (index + count - 1) % count;
            let n_before = inward_normal(polygon, before);
            let n_after = inward_normal(polygon, index);
            let p = polygon[index];
            [
                p[0] - distances_m[before] * n_before[0] - distances_m[index] * n_after[0],
                p[1] - distances_m[before] * n_before[1] - distances_m[index] * n_after[1],
            ]
        })
        .collect();
    for index in 0..count {
        let (a, b) = (polygon[index], polygon[(index + 1) % count]);
        let (p, q) = (moved[index], moved[(index + 1) % count]);
        let same_way = (b[0] - a[0]) * (q[0] - p[0]) + (b[1] - a[1]) * (q[1] - p[1]);
        if same_way <= 1e-9 {
            return Err(index);
        }
    }
    Ok(moved)
}

/// How far wall `index` can be pushed into the building, across its own width, before it meets
/// another wall, m.
fn push_depth_m(polygon: &[Point], index: usize) -> f64 {
    let count = polygon.len();
    let a = polygon[index];
    let b = polygon[(index + 1) % count];
    let normal = inward_normal(polygon, index);
    let along = if (b[0] - a[0]).abs() > (b[1] - a[1]).abs() {
        0
    } else {
        1
    };
    let (low, high) = (a[along].min(b[along]), a[along].max(b[along]));
    let depth = |p: Point| (p[0] - a[0]) * normal[0] + (p[1] - a[1]) * normal[1];
    let mut best = f64::INFINITY;
    for other in 0..count {
        if other == index {
            continue;
        }
        let p = polygon[other];
        let q = polygon[(other + 1) % count];
        // The part of the other wall inside the open strip in front of this wall.
        let (p_along, q_along) = (p[along], q[along]);
        let lo = p_along.min(q_along).max(low);
        let hi = p_along.max(q_along).min(high);
        if hi - lo <= SAME_M
            && !((p_along - q_along).abs() <= SAME_M
                && p_along > low + SAME_M
                && p_along < high - SAME_M)
        {
            continue;
        }
        let distance = depth(p).min(depth(q));
        if distance > SAME_M {
            best = best.min(distance);
        }
    }
    best
}

/// Gable walls found from the outline (see the module note). `ridge_along_x`: the tie-break for a
/// square wing.
pub(crate) fn detect_gable_walls(polygon: &[Point], ridge_along_x: bool) -> Vec<bool> {
    let count = polygon.len();
    (0..count)
        .map(|index| {
            if !is_convex(polygon, index) || !is_convex(polygon, (index + 1) % count) {
                return false;
            }
            let a = polygon[index];
            let b = polygon[(index + 1) % count];
            let width = (b[0] - a[0]).hypot(b[1] - a[1]);
            let depth = push_depth_m(polygon, index);
            let across_x = (b[0] - a[0]).abs() < (b[1] - a[1]).abs();
            if (depth - width).abs() <= 1e-6 * width.max(1.0) {
                across_x == ridge_along_x
            } else {
                depth > width
            }
        })
        .collect()
}

/// The eave outline extended past each gable wall by half the wall's width plus `extra_m`: the
/// hips of the extension's far end then meet its ridge `extra_m` past the wall, beyond the rake cut.
pub(crate) fn extend_past_gables(
    eave_outline: &[Point],
    gables: &[bool],
    extra_m: f64,
) -> Result<Vec<Point>, String> {
    let count = eave_outline.len();
    let mut points = Vec::with_capacity(count + 2 * gables.len());
    for index in 0..count {
        let a = eave_outline[index];
        let b = eave_outline[(index + 1) % count];
        points.push(a);
        if gables[index] {
            let width = (b[0] - a[0]).hypot(b[1] - a[1]);
            let reach = width / 2.0 + extra_m;
            let normal = inward_normal(eave_outline, index);
            points.push([a[0] - reach * normal[0], a[1] - reach * normal[1]]);
            points.push([b[0] - reach * normal[0], b[1] - reach * normal[1]]);
        }
    }
    let points = super::merge::simplify(&points);
    if super::first_touch(&points).is_some() {
        return Err(
            "a gable wall faces another part of the building too closely for its wing's roof to end in a gable there; name the gable walls in roof.gable_walls or use a hip roof"
                .to_string(),
        );
    }
    Ok(points)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::geometry::rectangle;

    #[test]
    fn rectangle_gables_on_the_short_walls() {
        let flags = detect_gable_walls(&rectangle(0.0, 0.0, 12.0, 8.0), true);
        assert_eq!(flags, [false, true, false, true]);
        // A square follows ridge_along.
        let flags = detect_gable_walls(&rectangle(0.0, 0.0, 8.0, 8.0), false);
        assert_eq!(flags, [true, false, true, false]);
    }

    #[test]
    fn l_shape_gables_at_the_two_wing_ends() {
        let flags = detect_gable_walls(&crate::roof::tests::l_shape(), true);
        assert_eq!(flags, [false, true, false, false, true, false]);
    }

    #[test]
    fn t_shape_gables_at_the_three_ends() {
        let flags = detect_gable_walls(&crate::roof::tests::t_shape(), true);
        assert_eq!(flags, [false, true, false, false, true, false, false, true]);
    }

    #[test]
    fn offset_moves_each_wall_by_its_own_distance() {
        let outline = offset_edges(&rectangle(0.0, 0.0, 12.0, 8.0), &[0.6, 0.3, 0.6, 0.3]);
        assert_eq!(outline, Ok(rectangle(-0.3, -0.6, 12.3, 8.6)));
        // A 0.2 m step between a 0.6 m eave and a gable with no rake overhang folds.
        let step = vec![
            [0.0, 0.0],
            [4.0, 0.0],
            [4.0, 6.2],
            [2.0, 6.2],
            [2.0, 6.0],
            [0.0, 6.0],
        ];
        assert_eq!(offset_edges(&step, &[0.6, 0.6, 0.0, 0.6, 0.6, 0.6]), Err(3));
    }
}
