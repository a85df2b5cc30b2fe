//! Straight skeleton of a rectilinear (axis-parallel) outline: the hip roof with every eave at the
//! same height and every plane at the same slope.
//!
//! Why this construction: when every edge of an axis-parallel outline moves inward at the same
//! speed, the moving front at time `t` is exactly the set of points whose axis-aligned square of
//! half-side `t` fits inside the outline (the erosion by that square): every front edge stays
//! axis-parallel and every corner moves along a 45° diagonal, which is what the straight skeleton
//! does for such outlines. Front edges sit at `x_i ± t` and `y_j ± t`, so two of them can only meet
//! when `t` is half the distance between two of the outline's coordinates: those are the only times
//! the front can change shape. Between two such times every front edge sweeps a trapezoid of its
//! own plane, so the planes are built from exact trapezoids, with no event queue to get wrong.
//!
//! Cost: O(n²) times × O(n²) cells × O(n) edges, a few milliseconds for the 40 corners accepted.

use crate::geometry::{area_m2, contains, make_ccw, Point};

/// Coordinates closer than this are the same, m.
pub(crate) const SAME_M: f64 = 1e-9;

/// One line of the outline that eaves lie on: `axis` 0 for an edge along x (a horizontal edge,
/// constant y), 1 for an edge along y; `coordinate_m` its constant coordinate; `inward` the sign of
/// the inward normal along the other axis. Collinear edges facing the same way share one line: their
/// planes are coplanar, so they form one plane where they meet.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct EaveLine {
    pub axis: usize,
    pub coordinate_m: f64,
    pub inward: f64,
}

impl EaveLine {
    /// Unit plan vector pointing into the roof (up the slope).
    pub(crate) fn inward_normal(&self) -> Point {
        if self.axis == 0 {
            [0.0, self.inward]
        } else {
            [self.inward, 0.0]
        }
    }

    /// Horizontal run from the eave line to `point`, measured up the slope, m.
    pub(crate) fn run_m(&self, point: Point) -> f64 {
        let other = 1 - self.axis;
        (point[other] - self.coordinate_m) * self.inward
    }
}

/// The planes of the roof: for each eave line, the convex pieces its plane is made of.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct Skeleton {
    pub lines: Vec<EaveLine>,
    /// `pieces[i]`: counter-clockwise convex pieces of line `i`'s plane, in plan.
    pub pieces: Vec<Vec<Vec<Point>>>,
    /// Largest horizontal run from an eave line to the top of the roof, m.
    pub max_run_m: f64,
}

/// Why a skeleton could not be built; an internal inconsistency, reported rather than panicking.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct SkeletonError(pub String);

/// The eave lines of a counter-clockwise rectilinear polygon, and each edge's line index.
pub(crate) fn eave_lines(polygon: &[Point]) -> (Vec<EaveLine>, Vec<usize>) {
    let mut lines: Vec<EaveLine> = Vec::new();
    let mut of_edge = Vec::with_capacity(polygon.len());
    for index in 0..polygon.len() {
        let a = polygon[index];
        let b = polygon[(index + 1) % polygon.len()];
        let horizontal = (b[1] - a[1]).abs() <= (b[0] - a[0]).abs();
        // Counter-clockwise: the inside is to the left of the direction of travel.
        let line = if horizontal {
            EaveLine {
                axis: 0,
                coordinate_m: a[1],
                inward: (b[0] - a[0]).signum(),
            }
        } else {
            EaveLine {
                axis: 1,
                coordinate_m: a[0],
                inward: -(b[1] - a[1]).signum(),
            }
        };
        let found = lines.iter().position(|l| {
            l.axis == line.axis
                && l.inward == line.inward
                && (l.coordinate_m - line.coordinate_m).abs() < SAME_M
        });
        of_edge.push(match found {
            Some(i) => i,
            None => {
                lines.push(line);
                lines.len() - 1
            }
        });
    }
    (lines, of_edge)
}

/// L∞ distance from `point` to the closed segment `a`–`b` (axis-parallel).
fn chebyshev_to_segment(point: Point, a: Point, b: Point) -> f64 {
    let dx = if point[0] < a[0].min(b[0]) {
        a[0].min(b[0]) - point[0]
    } else if point[0] > a[0].max(b[0]) {
        point[0] - a[0].max(b[0])
    } else {
        0.0
    };
    let dy = if point[1] < a[1].min(b[1]) {
        a[1].min(b[1]) - point[1]
    } else if point[1] > a[1].max(b[1]) {
        point[1] - a[1].max(b[1])
    } else {
        0.0
    };
    dx.max(dy)
}

/// Half-side of the largest axis-aligned square centred at `point` inside `polygon` (0 outside).
fn inscribed_half_side_m(polygon: &[Point], point: Point) -> f64 {
    if !contains(polygon, point) {
        return 0.0;
    }
    (0..polygon.len())
        .map(|i| chebyshev_to_segment(point, polygon[i], polygon[(i + 1) % polygon.len()]))
        .fold(f64::INFINITY, f64::min)
}

fn sorted_unique(mut values: Vec<f64>) -> Vec<f64> {
    values.sort_by(f64::total_cmp);
    values.dedup_by(|a, b| (*a - *b).abs() < SAME_M);
    values
}

/// The times at which the front may change shape: half of every difference of coordinates.
fn event_times(polygon: &[Point]) -> Vec<f64> {
    let mut times = vec![0.0];
    for axis in 0..2 {
        let coordinates = sorted_unique(polygon.iter().map(|p| p[axis]).collect());
        for (i, a) in coordinates.iter().enumerate() {
            for b in &coordinates[i + 1..] {
                times.push((b - a) / 2.0);
            }
        }
    }
    sorted_unique(times)
}

/// The front at time `t` as grid cells: `xs`, `ys` the grid lines, `inside[i][j]` for the cell
/// `[xs[i], xs[i+1]] × [ys[j], ys[j+1]]`.
struct Front {
    xs: Vec<f64>,
    ys: Vec<f64>,
    inside: Vec<Vec<bool>>,
}

impl Front {
    fn at(polygon: &[Point], t: f64) -> Front {
        let grid = |axis: usize| {
            sorted_unique(
                polygon
                    .iter()
                    .flat_map(|p| [p[axis] - t, p[axis] + t])
                    .collect(),
            )
        };
        let xs = grid(0);
        let ys = grid(1);
        let inside = xs
            .windows(2)
            .map(|x| {
                ys.windows(2)
                    .map(|y| {
                        let centre = [(x[0] + x[1]) / 2.0, (y[0] + y[1]) / 2.0];
                        inscribed_half_side_m(polygon, centre) > t
                    })
                    .collect()
            })
            .collect();
        Front { xs, ys, inside }
    }

    fn cell(&self, i: isize, j: isize) -> bool {
        if i < 0 || j < 0 {
            return false;
        }
        self.inside
            .get(i as usize)
            .and_then(|column| column.get(j as usize))
            .copied()
            .unwrap_or(false)
    }

    fn is_empty(&self) -> bool {
        !self.inside.iter().flatten().any(|c| *c)
    }
}

/// One unit edge of the front's boundary: on grid line `at` (index into xs for axis 1, ys for
/// axis 0), from grid index `from` to `from + 1` along `axis`, the front on the `inward` side.
#[derive(Debug, Clone, Copy)]
struct UnitEdge {
    axis: usize,
    at: usize,
    from: usize,
    inward: f64,
}

fn unit_edges(front: &Front) -> Vec<UnitEdge> {
    let mut edges = Vec::new();
    for i in 0..front.xs.len().saturating_sub(1) {
        for j in 0..front.ys.len().saturating_sub(1) {
            if !front.cell(i as isize, j as isize) {
                continue;
            }
            let (ii, jj) = (i as isize, j as isize);
            if !front.cell(ii, jj - 1) {
                edges.push(UnitEdge {
                    axis: 0,
                    at: j,
                    from: i,
                    inward: 1.0,
                });
            }
            if !front.cell(ii, jj + 1) {
                edges.push(UnitEdge {
                    axis: 0,
                    at: j + 1,
                    from: i,
                    inward: -1.0,
                });
            }
            if !front.cell(ii - 1, jj) {
                edges.push(UnitEdge {
                    axis: 1,
                    at: i,
                    from: j,
                    inward: 1.0,
                });
            }
            if !front.cell(ii + 1, jj) {
                edges.push(UnitEdge {
                    axis: 1,
                    at: i + 1,
                    from: j,
                    inward: -1.0,
                });
            }
        }
    }
    edges
}

/// Builds the planes of the hip roof on a counter-clockwise rectilinear polygon.
pub(crate) fn skeleton(polygon: &[Point]) -> Result<Skeleton, SkeletonError> {
    let (lines, _) = eave_lines(polygon);
    let mut pieces: Vec<Vec<Vec<Point>>> = vec![Vec::new(); lines.len()];
    let times = event_times(polygon);
    let mut max_run_m = 0.0_f64;
    for window in times.windows(2) {
        let (t0, t1) = (window[0], window[1]);
        let tm = (t0 + t1) / 2.0;
        let front = Front::at(polygon, tm);
        if front.is_empty() {
            break;
        }
        max_run_m = max_run_m.max(t1);
        sweep(&front, &lines, [t0, tm, t1], &mut pieces)?;
    }
    Ok(Skeleton {
        lines,
        pieces,
        max_run_m,
    })
}

/// Adds the trapezoid each front edge sweeps between `t0` and `t1` (front sampled at `tm`).
fn sweep(
    front: &Front,
    lines: &[EaveLine],
    [t0, tm, t1]: [f64; 3],
    pieces: &mut [Vec<Vec<Point>>],
) -> Result<(), SkeletonError> {
    let edges = unit_edges(front);
    let grid = |axis: usize| if axis == 0 { &front.xs } else { &front.ys };
    // Group unit edges into maximal runs on one grid line facing one way.
    let mut keyed: Vec<(usize, usize, i8, usize)> = edges
        .iter()
        .map(|e| (e.axis, e.at, e.inward as i8, e.from))
        .collect();
    keyed.sort_unstable();
    let mut runs: Vec<(usize, usize, i8, usize, usize)> = Vec::new();
    for (axis, at, inward, from) in keyed {
        match runs.last_mut() {
            Some(run) if run.0 == axis && run.1 == at && run.2 == inward && run.4 == from => {
                run.4 = from + 1;
            }
            _ => runs.push((axis, at, inward, from, from + 1)),
        }
    }
    for (axis, at, inward, from, to) in runs {
        let inward = f64::from(inward);
        let other = 1 - axis;
        let position = grid(other)[at];
        let source = position - inward * tm;
        let line = lines
            .iter()
            .position(|l| {
                l.axis == axis && l.inward == inward && (l.coordinate_m - source).abs() < 1e-7
            })
            .ok_or_else(|| {
                SkeletonError(format!(
                    "front edge at {position} has no eave line at {source}"
                ))
            })?;
        // Each end of the run moves along the run as the perpendicular front edge that meets it.
        let rate = |vertex: usize| -> f64 {
            edges
                .iter()
                .find(|e| e.axis == other && e.at == vertex && (e.from == at || e.from + 1 == at))
                .map_or(0.0, |e| e.inward)
        };
        let (rate_from, rate_to) = (rate(from), rate(to));
        let start = grid(axis)[from];
        let end = grid(axis)[to];
        let point = |along: f64, t: f64| -> Point {
            let across = source + inward * t;
            if axis == 0 {
                [along, across]
            } else {
                [across, along]
            }
        };
        let quad = vec![
            point(start + rate_from * (t0 - tm), t0),
            point(end + rate_to * (t0 - tm), t0),
            point(end + rate_to * (t1 - tm), t1),
            point(start + rate_from * (t1 - tm), t1),
        ];
        let mut polygon: Vec<Point> = Vec::with_capacity(4);
        for p in quad {
            if polygon
                .last()
                .is_none_or(|q: &Point| (q[0] - p[0]).abs() + (q[1] - p[1]).abs() > SAME_M)
            {
                polygon.push(p);
            }
        }
        if polygon.len() > 1 {
            let (first, last) = (polygon[0], polygon[polygon.len() - 1]);
            if (first[0] - last[0]).abs() + (first[1] - last[1]).abs() <= SAME_M {
                polygon.pop();
            }
        }
        if polygon.len() >= 3 && area_m2(&polygon) > 1e-12 {
            pieces[line].push(make_ccw(polygon));
        }
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::geometry::rectangle;
    use approx::assert_relative_eq;

    fn area_of(pieces: &[Vec<Point>]) -> f64 {
        pieces.iter().map(|p| area_m2(p)).sum()
    }

    #[test]
    fn rectangle_gives_two_trapezoids_and_two_triangles() {
        // 12 × 8 hip roof: the hips meet the ridge 4 m in from each end; the long planes are
        // trapezoids (12 + 4) / 2 × 4 = 32 m², the hip ends triangles 8 × 4 / 2 = 16 m².
        let roof = skeleton(&rectangle(0.0, 0.0, 12.0, 8.0)).expect("skeleton");
        let mut areas: Vec<f64> = roof.pieces.iter().map(|p| area_of(p)).collect();
        areas.sort_by(f64::total_cmp);
        for (area, expected) in areas.iter().zip([16.0, 16.0, 32.0, 32.0]) {
            assert_relative_eq!(*area, expected, max_relative = 1e-12);
        }
        assert_relative_eq!(roof.max_run_m, 4.0);
    }

    #[test]
    fn l_shape_planes_tile_the_outline() {
        let roof = skeleton(&crate::roof::tests::l_shape()).expect("skeleton");
        assert_eq!(roof.lines.len(), 6);
        let total: f64 = roof.pieces.iter().map(|p| area_of(p)).sum();
        assert_relative_eq!(total, 64.0, max_relative = 1e-12);
        assert!(roof.pieces.iter().all(|p| area_of(p) > 0.0));
        assert_relative_eq!(roof.max_run_m, 2.0);
    }

    #[test]
    fn inscribed_square_measures_to_the_nearest_wall() {
        let square = rectangle(0.0, 0.0, 4.0, 4.0);
        assert_relative_eq!(inscribed_half_side_m(&square, [1.0, 3.0]), 1.0);
        assert_relative_eq!(inscribed_half_side_m(&square, [5.0, 3.0]), 0.0);
    }
}
