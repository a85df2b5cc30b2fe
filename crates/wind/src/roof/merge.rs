//! Union of non-overlapping convex pieces into polygons: the pieces of one roof plane become the
//! plane's outline.
//!
//! Edge cancellation: every piece edge is split at every piece vertex lying on it, an edge met in
//! both directions is inside the union and dropped, and what is left is chained into closed loops.
//! Exact for pieces that tile a region, which is what the skeleton sweep produces.

use std::collections::HashMap;

use crate::geometry::{drop_collinear, signed_area_m2, Point};

/// Points closer than this are one point, m.
const SNAP_M: f64 = 1e-7;

type Key = (i64, i64);

fn key(point: Point) -> Key {
    (
        (point[0] / SNAP_M).round() as i64,
        (point[1] / SNAP_M).round() as i64,
    )
}

/// Distance from `p` to the segment `a`–`b`, and the parameter of its projection.
fn projection(p: Point, a: Point, b: Point) -> (f64, f64) {
    let (dx, dy) = (b[0] - a[0], b[1] - a[1]);
    let length2 = dx * dx + dy * dy;
    if length2 == 0.0 {
        return ((p[0] - a[0]).hypot(p[1] - a[1]), 0.0);
    }
    let t = ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / length2;
    let q = [a[0] + t * dx, a[1] + t * dy];
    ((p[0] - q[0]).hypot(p[1] - q[1]), t)
}

/// Removes repeated vertices and vertices on a straight run, to the snapping tolerance.
pub(crate) fn simplify(polygon: &[Point]) -> Vec<Point> {
    drop_collinear(polygon, SNAP_M)
}

/// The union of `pieces` as counter-clockwise outer loops (holes, if any, come out clockwise).
pub(crate) fn union(pieces: &[Vec<Point>]) -> Vec<Vec<Point>> {
    let vertices: Vec<Point> = pieces.iter().flatten().copied().collect();
    let mut position: HashMap<Key, Point> = HashMap::new();
    for v in &vertices {
        position.entry(key(*v)).or_insert(*v);
    }
    // Directed elementary edges with multiplicity (a→b counts +1, b→a cancels it).
    let mut count: HashMap<(Key, Key), i32> = HashMap::new();
    for piece in pieces {
        for index in 0..piece.len() {
            let a = piece[index];
            let b = piece[(index + 1) % piece.len()];
            let mut cuts: Vec<(f64, Point)> = vertices
                .iter()
                .filter_map(|v| {
                    let (distance, t) = projection(*v, a, b);
                    (distance < SNAP_M && t > 1e-12 && t < 1.0 - 1e-12).then_some((t, *v))
                })
                .collect();
            cuts.sort_by(|p, q| p.0.total_cmp(&q.0));
            let mut chain = vec![key(a)];
            chain.extend(cuts.iter().map(|(_, v)| key(*v)));
            chain.push(key(b));
            chain.dedup();
            for pair in chain.windows(2) {
                let (from, to) = (pair[0], pair[1]);
                if from == to {
                    continue;
                }
                if let Some(reverse) = count.get_mut(&(to, from)) {
                    if *reverse > 0 {
                        *reverse -= 1;
                        continue;
                    }
                }
                *count.entry((from, to)).or_insert(0) += 1;
            }
        }
    }
    let mut outgoing: HashMap<Key, Vec<Key>> = HashMap::new();
    let mut remaining = 0usize;
    for ((from, to), n) in &count {
        for _ in 0..*n {
            outgoing.entry(*from).or_default().push(*to);
            remaining += 1;
        }
    }
    for targets in outgoing.values_mut() {
        targets.sort_unstable();
    }
    let point = |k: &Key| position.get(k).copied().unwrap_or([0.0, 0.0]);
    let mut loops = Vec::new();
    let mut starts: Vec<Key> = outgoing.keys().copied().collect();
    starts.sort_unstable();
    for start in starts {
        while outgoing.get(&start).is_some_and(|t| !t.is_empty()) && remaining > 0 {
            let mut ring = vec![start];
            let mut previous = start;
            let mut current = match outgoing.get_mut(&start).and_then(|t| t.pop()) {
                Some(next) => next,
                None => break,
            };
            remaining -= 1;
            while current != start {
                ring.push(current);
                let Some(targets) = outgoing.get_mut(&current) else {
                    break;
                };
                if targets.is_empty() {
                    break;
                }
                // Where loops touch at a vertex, take the leftmost turn: each counter-clockwise loop stays simple.
                let incoming = {
                    let (p, c) = (point(&previous), point(&current));
                    [c[0] - p[0], c[1] - p[1]]
                };
                let choice = (0..targets.len())
                    .max_by(|i, j| {
                        let turn = |k: &Key| {
                            let (c, n) = (point(&current), point(k));
                            let out = [n[0] - c[0], n[1] - c[1]];
                            let cross = incoming[0] * out[1] - incoming[1] * out[0];
                            let dot = incoming[0] * out[0] + incoming[1] * out[1];
                            cross.atan2(dot)
                        };
                        turn(&targets[*i]).total_cmp(&turn(&targets[*j]))
                    })
                    .unwrap_or(0);
                let next = targets.swap_remove(choice);
                remaining -= 1;
                previous = current;
                current = next;
            }
            let polygon = simplify(&ring.iter().map(point).collect::<Vec<_>>());
            if polygon.len() >= 3 && signed_area_m2(&polygon).abs() > 1e-12 {
                loops.push(polygon);
            }
        }
    }
    loops
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::geometry::{area_m2, rectangle};
    use approx::assert_relative_eq;

    #[test]
    fn two_squares_and_a_t_junction_make_one_rectangle() {
        let pieces = vec![
            rectangle(0.0, 0.0, 2.0, 1.0),
            rectangle(0.0, 1.0, 1.0, 2.0),
            rectangle(1.0, 1.0, 2.0, 2.0),
        ];
        let loops = union(&pieces);
        assert_eq!(loops.len(), 1);
        assert_eq!(loops[0].len(), 4);
        assert_relative_eq!(area_m2(&loops[0]), 4.0);
    }

    #[test]
    fn separate_pieces_stay_separate() {
        let pieces = vec![rectangle(0.0, 0.0, 1.0, 1.0), rectangle(3.0, 0.0, 4.0, 1.0)];
        assert_eq!(union(&pieces).len(), 2);
    }

    #[test]
    fn l_from_pieces_keeps_its_reflex_corner() {
        let pieces = vec![rectangle(0.0, 0.0, 4.0, 1.0), rectangle(0.0, 1.0, 1.0, 4.0)];
        let loops = union(&pieces);
        assert_eq!(loops.len(), 1);
        assert_eq!(loops[0].len(), 6);
        assert!(signed_area_m2(&loops[0]) > 0.0);
    }
}
