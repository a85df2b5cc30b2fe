//! Plane polygon helpers for the drawing: area, centroid, point inside, and a label anchor that is
//! always inside the polygon (the centroid of an L-shaped zone is not).

/// Signed area by the shoelace formula (positive when counter-clockwise), in the units of the points squared.
pub(crate) fn signed_area(points: &[[f64; 2]]) -> f64 {
    let n = points.len();
    if n < 3 {
        return 0.0;
    }
    (0..n)
        .map(|i| {
            let (a, b) = (points[i], points[(i + 1) % n]);
            a[0] * b[1] - b[0] * a[1]
        })
        .sum::<f64>()
        / 2.0
}

pub(crate) fn area(points: &[[f64; 2]]) -> f64 {
    signed_area(points).abs()
}

fn vertex_mean(points: &[[f64; 2]]) -> [f64; 2] {
    let n = points.len().max(1) as f64;
    let sum = points
        .iter()
        .fold([0.0, 0.0], |acc, p| [acc[0] + p[0], acc[1] + p[1]]);
    [sum[0] / n, sum[1] / n]
}

/// Area centroid; the mean of the vertices when the polygon has no area.
pub(crate) fn centroid(points: &[[f64; 2]]) -> [f64; 2] {
    let signed = signed_area(points);
    if signed.abs() < 1e-12 {
        return vertex_mean(points);
    }
    let n = points.len();
    let mut cx = 0.0;
    let mut cy = 0.0;
    for i in 0..n {
        let (a, b) = (points[i], points[(i + 1) % n]);
        let cross = a[0] * b[1] - b[0] * a[1];
        cx += (a[0] + b[0]) * cross;
        cy += (a[1] + b[1]) * cross;
    }
    [cx / (6.0 * signed), cy / (6.0 * signed)]
}

/// Even-odd ray test.
pub(crate) fn contains(points: &[[f64; 2]], p: [f64; 2]) -> bool {
    let n = points.len();
    let mut inside = false;
    for i in 0..n {
        let (a, b) = (points[i], points[(i + n - 1) % n]);
        if (a[1] > p[1]) != (b[1] > p[1]) {
            let x_at = a[0] + (p[1] - a[1]) * (b[0] - a[0]) / (b[1] - a[1]);
            if p[0] < x_at {
                inside = !inside;
            }
        }
    }
    inside
}

/// A point well inside the polygon for its label: the centroid when it is inside, else the middle of the
/// longest horizontal chord through the centroid's height.
pub(crate) fn label_anchor(points: &[[f64; 2]]) -> [f64; 2] {
    let center = centroid(points);
    if contains(points, center) {
        return center;
    }
    let y = center[1];
    let n = points.len();
    let mut crossings: Vec<f64> = (0..n)
        .filter_map(|i| {
            let (a, b) = (points[i], points[(i + 1) % n]);
            ((a[1] > y) != (b[1] > y)).then(|| a[0] + (y - a[1]) * (b[0] - a[0]) / (b[1] - a[1]))
        })
        .collect();
    crossings.sort_by(f64::total_cmp);
    crossings
        .chunks_exact(2)
        .max_by(|p, q| (p[1] - p[0]).total_cmp(&(q[1] - q[0])))
        .map(|pair| [(pair[0] + pair[1]) / 2.0, y])
        .unwrap_or_else(|| vertex_mean(points))
}

/// Smallest and largest x and y of all points, or None when there are none.
pub(crate) fn bounds<'a>(points: impl IntoIterator<Item = &'a [f64; 2]>) -> Option<[f64; 4]> {
    points.into_iter().fold(None, |acc, p| {
        Some(match acc {
            None => [p[0], p[1], p[0], p[1]],
            Some([x0, y0, x1, y1]) => [x0.min(p[0]), y0.min(p[1]), x1.max(p[0]), y1.max(p[1])],
        })
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    const L_SHAPE: [[f64; 2]; 6] = [
        [0.0, 0.0],
        [4.0, 0.0],
        [4.0, 1.0],
        [1.0, 1.0],
        [1.0, 4.0],
        [0.0, 4.0],
    ];

    #[test]
    fn area_and_centroid_of_a_rectangle() {
        let rectangle = [[0.0, 0.0], [4.0, 0.0], [4.0, 2.0], [0.0, 2.0]];
        assert_relative_eq!(area(&rectangle), 8.0);
        let c = centroid(&rectangle);
        assert_relative_eq!(c[0], 2.0);
        assert_relative_eq!(c[1], 1.0);
    }

    #[test]
    fn the_anchor_of_an_l_shape_is_inside_it() {
        // The centroid of this L is (1.36, 1.36): outside the shape.
        assert!(!contains(&L_SHAPE, centroid(&L_SHAPE)));
        assert!(contains(&L_SHAPE, label_anchor(&L_SHAPE)));
    }

    #[test]
    fn bounds_span_every_point() {
        assert_eq!(bounds(L_SHAPE.iter()), Some([0.0, 0.0, 4.0, 4.0]));
        assert_eq!(bounds(std::iter::empty()), None);
    }
}
