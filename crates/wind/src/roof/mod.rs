//! Pitched roofs on any rectilinear outline: hip roofs from the straight skeleton of the eave
//! outline, gabled wings (cross gables) from the same skeleton with each gable wall held still.
//! Pure geometry in plan, metres; every plane has the roof's one slope.

pub(crate) mod merge;
pub(crate) mod skeleton;
pub(crate) mod wings;

use crate::edges::{EdgeKind, PlaneEdge};
use crate::geometry::{area_m2, centroid, contains, segments_touch, split_by_line, Point};
use skeleton::{skeleton, EaveLine, SAME_M};
use wings::{extend_past_gables, offset_edges};

/// One straight piece of a plane's boundary, in plan.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct BoundLine {
    pub kind: EdgeKind,
    pub from_m: Point,
    pub to_m: Point,
}

impl BoundLine {
    pub(crate) fn length_m(&self) -> f64 {
        (self.to_m[0] - self.from_m[0]).hypot(self.to_m[1] - self.from_m[1])
    }
}

/// One plane of a pitched roof.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct PitchedPlane {
    /// Counter-clockwise outline in plan, overhang included.
    pub polygon_m: Vec<Point>,
    /// Convex pieces that tile the plane (the zone layout cuts these).
    pub pieces_m: Vec<Vec<Point>>,
    /// Unit plan vector down the slope (perpendicular to the plane's eave).
    pub downslope: Point,
    /// The plane's boundary, edge by edge, counter-clockwise.
    pub bounds: Vec<BoundLine>,
}

impl PitchedPlane {
    /// The plane's sides in polygon order (counter-clockwise), each with its kind.
    pub(crate) fn edges(&self) -> Vec<PlaneEdge> {
        let count = self.polygon_m.len();
        self.bounds
            .iter()
            .enumerate()
            .map(|(index, bound)| PlaneEdge {
                from_m: self.polygon_m[index],
                to_m: self.polygon_m[(index + 1) % count],
                kind: bound.kind,
            })
            .collect()
    }
}

/// A pitched roof in plan.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct PitchedRoof {
    /// Roof outline: walls moved out by the eave overhang, gable walls by the rake overhang.
    pub outline_m: Vec<Point>,
    pub planes: Vec<PitchedPlane>,
    /// Ridges, hips and valleys, each once; hips and valleys run from their low end.
    pub lines: Vec<BoundLine>,
    /// Wall segments of the building that are gable ends.
    pub gable_walls_m: Vec<[Point; 2]>,
    /// Largest horizontal run from the wall line to the top of the roof, m.
    pub wall_to_top_run_m: f64,
}

/// Why a pitched roof cannot be built on the outline, with the project key it comes from.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct Refusal {
    pub field: &'static str,
    pub detail: String,
}

fn refuse(field: &'static str, detail: String) -> Refusal {
    Refusal { field, detail }
}

/// Builds the roof on `building` (counter-clockwise, rectilinear, no repeated or collinear
/// corners); `gables[i]` marks wall `i` (corner i to i+1) as a gable end.
pub(crate) fn pitched_roof(
    building: &[Point],
    gables: &[bool],
    eave_m: f64,
    rake_m: f64,
) -> Result<PitchedRoof, Refusal> {
    let count = building.len();
    if gables.len() != count {
        return Err(refuse(
            "roof.gable_walls",
            format!("{} gable flags for {count} walls", gables.len()),
        ));
    }
    let fold = |wall: usize| {
        refuse(
            "roof.eave_overhang_mm",
            format!(
                "the overhangs fold the roof outline back on itself at wall {wall} (a wall shorter than the overhang beside it); reduce the overhang or give the walls explicitly"
            ),
        )
    };
    let eave_outline = offset_edges(building, &vec![eave_m; count]).map_err(fold)?;
    let distances: Vec<f64> = gables
        .iter()
        .map(|g| if *g { rake_m } else { eave_m })
        .collect();
    let outline_m = offset_edges(building, &distances).map_err(fold)?;
    for polygon in [&eave_outline, &outline_m] {
        if let Some((i, j)) = first_touch(polygon) {
            return Err(refuse(
                "roof.eave_overhang_mm",
                format!("the overhangs make the roof outline touch itself (edges {i} and {j}); two walls face each other closer than twice the overhang"),
            ));
        }
    }
    let extended = extend_past_gables(&eave_outline, gables, rake_m + 0.5)
        .map_err(|detail| refuse("roof.gable_walls", detail))?;
    let roof = skeleton(&extended).map_err(|e| refuse("roof.shape", e.0))?;
    // Cut each plane at the rake lines: the part past a gable wall, in front of it, goes.
    let mut cuts: Vec<(Point, f64, usize, [f64; 2])> = Vec::new();
    let mut gable_walls_m = Vec::new();
    for index in (0..count).filter(|i| gables[*i]) {
        let a = building[index];
        let b = building[(index + 1) % count];
        gable_walls_m.push([a, b]);
        let inward = wings::inward_normal(building, index);
        let outward = [-inward[0], -inward[1]];
        let offset = outward[0] * a[0] + outward[1] * a[1] + rake_m;
        let along = usize::from(outward[0] != 0.0);
        let (ea, eb) = (
            eave_outline[index][along],
            eave_outline[(index + 1) % count][along],
        );
        cuts.push((outward, offset, along, [ea.min(eb), ea.max(eb)]));
    }
    let mut planes = Vec::new();
    for (line, pieces) in roof.lines.iter().zip(&roof.pieces) {
        let mut kept: Vec<Vec<Point>> = pieces.clone();
        for (outward, offset, along, range) in &cuts {
            let mut next = Vec::with_capacity(kept.len());
            for piece in kept {
                let (near, past) = split_by_line(&piece, *outward, *offset);
                if near.len() >= 3 && area_m2(&near) > 1e-12 {
                    next.push(near);
                }
                if past.len() >= 3 && area_m2(&past) > 1e-12 {
                    let c = centroid(&past)[*along];
                    if c < range[0] - SAME_M || c > range[1] + SAME_M {
                        next.push(past);
                    }
                }
            }
            kept = next;
        }
        if kept.is_empty() {
            continue;
        }
        for polygon_m in merge::union(&kept) {
            if crate::geometry::signed_area_m2(&polygon_m) <= 0.0 {
                return Err(refuse(
                    "roof.shape",
                    "a roof plane came out with a hole; this outline is not supported".to_string(),
                ));
            }
            let pieces_m: Vec<Vec<Point>> = kept
                .iter()
                .filter(|p| contains(&polygon_m, centroid(p)))
                .cloned()
                .collect();
            let bounds = bounding_lines(&polygon_m, line);
            let n = line.inward_normal();
            planes.push(PitchedPlane {
                polygon_m,
                pieces_m,
                downslope: [-n[0], -n[1]],
                bounds,
            });
        }
    }
    let lines = roof_lines(&planes);
    Ok(PitchedRoof {
        outline_m,
        planes,
        lines,
        gable_walls_m,
        wall_to_top_run_m: roof.max_run_m - eave_m,
    })
}

/// The first pair of non-adjacent edges of a closed polygon that share a point.
pub(crate) fn first_touch(polygon: &[Point]) -> Option<(usize, usize)> {
    let n = polygon.len();
    for i in 0..n {
        for j in (i + 1)..n {
            if j == i + 1 || (i == 0 && j == n - 1) {
                continue;
            }
            if segments_touch(
                polygon[i],
                polygon[(i + 1) % n],
                polygon[j],
                polygon[(j + 1) % n],
            ) {
                return Some((i, j));
            }
        }
    }
    None
}

/// Classifies each edge of a plane: eave (on its own eave line), ridge (parallel to the eave, up
/// the roof), rake (across the eave: a gable cut), hip or valley (diagonal; a hip where the roof is
/// convex, water running away from the line, a valley where it is concave).
fn bounding_lines(polygon: &[Point], line: &EaveLine) -> Vec<BoundLine> {
    let n = line.inward_normal();
    let count = polygon.len();
    (0..count)
        .map(|index| {
            let a = polygon[index];
            let b = polygon[(index + 1) % count];
            let d = [b[0] - a[0], b[1] - a[1]];
            let length = d[0].hypot(d[1]);
            let along_normal = (d[0] * n[0] + d[1] * n[1]) / length;
            let mid = [(a[0] + b[0]) / 2.0, (a[1] + b[1]) / 2.0];
            let kind = if along_normal.abs() < 1e-9 {
                if line.run_m(mid).abs() < 1e-7 {
                    EdgeKind::Eave
                } else {
                    EdgeKind::Ridge
                }
            } else if (along_normal.abs() - 1.0).abs() < 1e-9 {
                EdgeKind::Rake
            } else {
                // The neighbour's normal m is n turned a right angle, the one with (n - m)·d = 0.
                let turned = [[-n[1], n[0]], [n[1], -n[0]]];
                let m = turned
                    .into_iter()
                    .min_by(|p, q| {
                        let f = |m: &Point| ((n[0] - m[0]) * d[0] + (n[1] - m[1]) * d[1]).abs();
                        f(p).total_cmp(&f(q))
                    })
                    .unwrap_or(turned[0]);
                // Into this plane from the line (counter-clockwise: the inside is on the left).
                let w = [-d[1], d[0]];
                if (n[0] - m[0]) * w[0] + (n[1] - m[1]) * w[1] < 0.0 {
                    EdgeKind::Hip
                } else {
                    EdgeKind::Valley
                }
            };
            let (from_m, to_m) = match kind {
                EdgeKind::Hip | EdgeKind::Valley if line.run_m(a) > line.run_m(b) => (b, a),
                _ => (a, b),
            };
            BoundLine { kind, from_m, to_m }
        })
        .collect()
}

/// Ridges, hips and valleys over all planes, each shared stretch once: plane edges are split where
/// another plane's corner lies on them (a ridge with one plane on one side and two on the other),
/// counted once, and joined again where a straight line runs on through a point nothing else meets.
fn roof_lines(planes: &[PitchedPlane]) -> Vec<BoundLine> {
    let corners: Vec<Point> = planes.iter().flat_map(|p| p.polygon_m.clone()).collect();
    let same = |p: Point, q: Point| (p[0] - q[0]).abs() + (p[1] - q[1]).abs() < 1e-6;
    let mut pieces: Vec<BoundLine> = Vec::new();
    for bound in planes.iter().flat_map(|p| &p.bounds) {
        if matches!(bound.kind, EdgeKind::Eave | EdgeKind::Rake) {
            continue;
        }
        let (a, b) = (bound.from_m, bound.to_m);
        let d = [b[0] - a[0], b[1] - a[1]];
        let length2 = d[0] * d[0] + d[1] * d[1];
        let mut cuts: Vec<(f64, Point)> = corners
            .iter()
            .filter_map(|c| {
                let t = ((c[0] - a[0]) * d[0] + (c[1] - a[1]) * d[1]) / length2;
                let q = [a[0] + t * d[0], a[1] + t * d[1]];
                (t > 1e-9 && t < 1.0 - 1e-9 && same(q, *c)).then_some((t, *c))
            })
            .collect();
        cuts.sort_by(|p, q| p.0.total_cmp(&q.0));
        let mut points = vec![a];
        points.extend(cuts.into_iter().map(|(_, c)| c));
        points.push(b);
        for pair in points.windows(2) {
            // Ridges run from their lower-left end, hips and valleys from their low end.
            let flip = bound.kind == EdgeKind::Ridge
                && (pair[1][0], pair[1][1]) < (pair[0][0], pair[0][1]);
            let piece = BoundLine {
                kind: bound.kind,
                from_m: if flip { pair[1] } else { pair[0] },
                to_m: if flip { pair[0] } else { pair[1] },
            };
            let seen = pieces.iter().any(|l| {
                (same(l.from_m, piece.from_m) && same(l.to_m, piece.to_m))
                    || (same(l.from_m, piece.to_m) && same(l.to_m, piece.from_m))
            });
            if !seen && piece.length_m() > 1e-6 {
                pieces.push(piece);
            }
        }
    }
    // Join collinear pieces of one kind through points where only they meet.
    loop {
        let mut joined = false;
        'search: for i in 0..pieces.len() {
            for j in 0..pieces.len() {
                if i == j
                    || pieces[i].kind != pieces[j].kind
                    || !same(pieces[i].to_m, pieces[j].from_m)
                {
                    continue;
                }
                let (a, m, b) = (pieces[i].from_m, pieces[i].to_m, pieces[j].to_m);
                let cross = (m[0] - a[0]) * (b[1] - m[1]) - (m[1] - a[1]) * (b[0] - m[0]);
                let meeting = pieces
                    .iter()
                    .filter(|l| same(l.from_m, m) || same(l.to_m, m))
                    .count();
                if cross.abs() > 1e-9 || meeting != 2 {
                    continue;
                }
                pieces[i].to_m = b;
                pieces.remove(j);
                joined = true;
                break 'search;
            }
        }
        if !joined {
            return pieces;
        }
    }
}

#[cfg(test)]
pub(crate) mod tests;
