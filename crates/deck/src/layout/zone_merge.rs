//! Joins the convex pieces of one zone that meet along a whole edge, wherever the join is convex.
//!
//! The wind zones come as the pieces of a roof cut by every zone boundary: a hip roof's edge zone
//! alone is a hundred small pieces, and each framing line was split against every one of them near
//! it. What the layout reads from a zone is only where it is, so pieces of one zone that share an
//! edge are one region. Joining them keeps every region exactly (to the snapping tolerance) and
//! takes away the edges inside it, which are no zone boundary. Only convex joins are made: a convex
//! piece is sectioned into one stretch, and a join that would close a ring (an edge strip round the
//! interior) is never attempted.

use std::collections::HashMap;

use super::geometry::round_i64;
use crate::fast_hash::BuildFastHasher;

type Point = [f64; 2];

/// Points closer than this are one point, m (vertices the cuts computed twice differ in the last
/// bits only).
const SNAP_M: f64 = 1e-9;
/// A turn whose sine is below this is straight: the vertex is dropped from a joined piece.
const STRAIGHT_SINE: f64 = 1e-12;

type Key = (i64, i64);

fn key(point: Point) -> Key {
    // Rounding, not truncation: a round figure and the same figure a bit below it fall in one bucket.
    (
        round_i64(point[0] * (1.0 / SNAP_M)),
        round_i64(point[1] * (1.0 / SNAP_M)),
    )
}

/// Which piece has an edge, by the edge's [`edge_id`]. An id two edges share only costs a join
/// (the neighbour found is checked for the edge), never a wrong one.
type EdgeMap = HashMap<u64, usize, BuildFastHasher>;

/// One number for the directed edge `a -> b` (`b -> a` gets another).
fn edge_id(a: Key, b: Key) -> u64 {
    let mix = |v: i64, k: u64| (v as u64).wrapping_mul(k);
    mix(a.0, 0x9e37_79b9_7f4a_7c15)
        ^ mix(a.1, 0xc2b2_ae3d_27d4_eb4f).rotate_left(13)
        ^ mix(b.0, 0x1656_67b1_9e37_79f9).rotate_left(29)
        ^ mix(b.1, 0x27d4_eb2f_1656_67c5).rotate_left(43)
}

/// A piece's vertices with their snapped keys.
#[derive(Debug, Clone)]
struct Piece {
    points: Vec<Point>,
    keys: Vec<Key>,
}

impl Piece {
    /// The polygon with each run of vertices that snap to one point kept as its first: the cuts
    /// leave repeated vertices (a point met twice, a few bits apart), and every edge here needs two
    /// distinct ends.
    fn new(polygon: &[Point]) -> Self {
        let mut piece = Piece {
            points: Vec::with_capacity(polygon.len()),
            keys: Vec::with_capacity(polygon.len()),
        };
        for point in polygon {
            let k = key(*point);
            if piece.keys.last() != Some(&k) {
                piece.points.push(*point);
                piece.keys.push(k);
            }
        }
        while piece.keys.len() > 1 && piece.keys.first() == piece.keys.last() {
            piece.points.pop();
            piece.keys.pop();
        }
        piece
    }

    fn len(&self) -> usize {
        self.points.len()
    }

    /// Vertex `i`, counted round the ring.
    fn at(&self, i: usize) -> Point {
        self.points[i % self.points.len()]
    }

    /// The edges as key pairs, the last back to the first.
    fn edge_keys(&self) -> impl Iterator<Item = (Key, Key)> + '_ {
        let count = self.keys.len();
        (0..count).map(move |i| {
            (
                self.keys[i],
                self.keys[if i + 1 == count { 0 } else { i + 1 }],
            )
        })
    }
}

/// The zone's polygons with every convex join made. Non-convex polygons and polygons of the other
/// orientation are kept as given, and so is every polygon joined to none.
pub(crate) fn joined_convex(polygons: &[Vec<Point>]) -> Vec<Vec<Point>> {
    let mut pieces: Vec<Option<Piece>> = polygons.iter().map(|p| Some(Piece::new(p))).collect();
    // Orientation of each convex piece: +1 counter-clockwise, -1 clockwise, 0 not joinable.
    let turn: Vec<i8> = pieces
        .iter()
        .map(|p| p.as_ref().map_or(0, |p| convex_turn(&p.points)))
        .collect();
    let mut joined = vec![false; pieces.len()];
    let edge_count = pieces.iter().flatten().map(Piece::len).sum();
    let mut edges: EdgeMap = HashMap::with_capacity_and_hasher(edge_count, Default::default());
    for (index, piece) in pieces.iter().enumerate() {
        if let (Some(piece), true) = (piece, turn[index] != 0) {
            for (a, b) in piece.edge_keys() {
                edges.insert(edge_id(a, b), index);
            }
        }
    }
    for index in 0..pieces.len() {
        if turn[index] == 0 {
            continue;
        }
        // Edges before `from` have been tried and cannot join: a join changes only the turns at its
        // own two ends, and the scan goes on from the edge that ends at the first of them.
        let mut from = 0;
        while let Some(found) = next_join(&pieces, &turn, &edges, index, from) {
            for (a, b) in found.union.edge_keys() {
                edges.insert(edge_id(a, b), index);
            }
            pieces[index] = Some(found.union);
            pieces[found.other] = None;
            joined[index] = true;
            from = found.resume_at;
        }
    }
    pieces
        .into_iter()
        .zip(polygons)
        .zip(joined)
        .filter_map(|((piece, original), joined)| {
            piece.map(|piece| {
                if joined {
                    piece.points
                } else {
                    original.clone()
                }
            })
        })
        .collect()
}

/// A join found: the neighbour absorbed, the joined piece, and the first of its edges that may join
/// next.
struct Join {
    other: usize,
    union: Piece,
    resume_at: usize,
}

/// The first neighbour of piece `index`, along its edges from edge `from`, that joins it convexly.
fn next_join(
    pieces: &[Option<Piece>],
    turn: &[i8],
    edges: &EdgeMap,
    index: usize,
    from: usize,
) -> Option<Join> {
    let piece = pieces[index].as_ref()?;
    piece
        .edge_keys()
        .enumerate()
        .skip(from)
        .find_map(|(at_a, (a, b))| {
            let other = *edges.get(&edge_id(b, a))?;
            if other == index || turn[other] != turn[index] {
                return None;
            }
            let neighbour = pieces[other].as_ref()?;
            let at_b_there = (0..neighbour.len()).find(|&i| {
                neighbour.keys[i] == b && neighbour.keys[(i + 1) % neighbour.len()] == a
            })?;
            join(piece, at_a, neighbour, at_b_there, turn[index]).map(|(union, resume_at)| Join {
                other,
                union,
                resume_at,
            })
        })
}

/// How the path `p -> q -> r` turns at `q`: `Some(true)` straight, `Some(false)` the way `turn`
/// goes, `None` the other way. Straight is a turn whose sine is within [`STRAIGHT_SINE`], compared
/// squared.
fn turn_at(p: Point, q: Point, r: Point, turn: i8) -> Option<bool> {
    let u = [q[0] - p[0], q[1] - p[1]];
    let v = [r[0] - q[0], r[1] - q[1]];
    let cross = u[0] * v[1] - u[1] * v[0];
    let lengths2 = (u[0] * u[0] + u[1] * u[1]) * (v[0] * v[0] + v[1] * v[1]);
    if cross * cross <= STRAIGHT_SINE * STRAIGHT_SINE * lengths2 {
        Some(true)
    } else if (cross > 0.0) == (turn > 0) {
        Some(false)
    } else {
        None
    }
}

/// +1 for a convex counter-clockwise polygon, -1 for a convex clockwise one, 0 otherwise (turns both
/// ways, no turn at all, or fewer than three points).
fn convex_turn(polygon: &[Point]) -> i8 {
    let count = polygon.len();
    if count < 3 {
        return 0;
    }
    let (mut left, mut right) = (false, false);
    let (mut p, mut q) = (polygon[count - 2], polygon[count - 1]);
    for &r in polygon {
        match turn_at(p, q, r, 1) {
            Some(true) => {}
            Some(false) => left = true,
            None => right = true,
        }
        (p, q) = (q, r);
    }
    match (left, right) {
        (true, false) => 1,
        (false, true) => -1,
        _ => 0,
    }
}

/// The union of `piece` and `neighbour`, which share the edge from vertex `at_a` of `piece` (`a`
/// to `b`) met from vertex `at_b_there` of `neighbour` (`b` to `a`), when it is convex, and the index
/// of its edge that ends at `a`'s place. Both are convex with the same orientation, so only the turns
/// at `a` and `b` can spoil it; either is dropped where the join runs straight through it. The
/// neighbour's vertices are spliced in where the shared edge was, so the piece's earlier edges keep
/// their places.
fn join(
    piece: &Piece,
    at_a: usize,
    neighbour: &Piece,
    at_b_there: usize,
    turn: i8,
) -> Option<(Piece, usize)> {
    let (count, other_count) = (piece.len(), neighbour.len());
    let a = piece.at(at_a);
    let b = piece.at(at_a + 1);
    let straight_at_a = turn_at(
        piece.at(at_a + count - 1),
        a,
        neighbour.at(at_b_there + 2),
        turn,
    )?;
    let straight_at_b = turn_at(
        neighbour.at(at_b_there + other_count - 1),
        b,
        piece.at(at_a + 2),
        turn,
    )?;
    let mut points: Vec<Point> = Vec::with_capacity(count + other_count - 2);
    let mut keys: Vec<Key> = Vec::with_capacity(count + other_count - 2);
    let mut push = |from: &Piece, i: usize| {
        points.push(from.at(i));
        keys.push(from.keys[i % from.len()]);
    };
    let wraps = at_a + 1 == count;
    // The piece up to before a (for the last edge, from past b: b is its first vertex), a, the
    // neighbour from past a round to before b, b, and the rest of the piece.
    let before_a = if wraps { 1..at_a } else { 0..at_a };
    for i in before_a.clone() {
        push(piece, i);
    }
    if !straight_at_a {
        push(piece, at_a);
    }
    for step in 2..other_count {
        push(neighbour, at_b_there + step);
    }
    if !straight_at_b {
        push(piece, at_a + 1);
    }
    if !wraps {
        for i in at_a + 2..count {
            push(piece, i);
        }
    }
    // The whole ring is checked once more: a repeated vertex the snapping missed would hide a turn.
    let resume_at = before_a.len().saturating_sub(1);
    (points.len() >= 3 && convex_turn(&points) == turn)
        .then_some((Piece { points, keys }, resume_at))
}

#[cfg(test)]
mod tests {
    use super::*;

    fn area(polygon: &[Point]) -> f64 {
        let count = polygon.len();
        0.5 * (0..count)
            .map(|i| {
                let (a, b) = (polygon[i], polygon[(i + 1) % count]);
                a[0] * b[1] - b[0] * a[1]
            })
            .sum::<f64>()
    }

    fn square(x: f64, y: f64) -> Vec<Point> {
        vec![[x, y], [x + 1.0, y], [x + 1.0, y + 1.0], [x, y + 1.0]]
    }

    #[test]
    fn a_row_of_squares_becomes_one_rectangle() {
        let joined = joined_convex(&[square(0.0, 0.0), square(1.0, 0.0), square(2.0, 0.0)]);
        assert_eq!(joined.len(), 1);
        assert_eq!(joined[0].len(), 4);
        assert!((area(&joined[0]) - 3.0).abs() < 1e-12);
    }

    #[test]
    fn an_l_of_squares_stays_two_convex_pieces() {
        let joined = joined_convex(&[square(0.0, 0.0), square(1.0, 0.0), square(0.0, 1.0)]);
        assert_eq!(joined.len(), 2);
        let total: f64 = joined.iter().map(|p| area(p)).sum();
        assert!((total - 3.0).abs() < 1e-12);
        assert!(joined.iter().all(|p| convex_turn(p) == 1));
    }

    #[test]
    fn a_ring_round_a_hole_is_never_closed() {
        // Eight unit squares round the square (1, 1): joined into convex bars only.
        let ring: Vec<Vec<Point>> = [
            (0.0, 0.0),
            (1.0, 0.0),
            (2.0, 0.0),
            (2.0, 1.0),
            (2.0, 2.0),
            (1.0, 2.0),
            (0.0, 2.0),
            (0.0, 1.0),
        ]
        .iter()
        .map(|(x, y)| square(*x, *y))
        .collect();
        let joined = joined_convex(&ring);
        assert!(joined.len() >= 4, "{joined:?}");
        assert!(joined.iter().all(|p| convex_turn(p) == 1));
        let total: f64 = joined.iter().map(|p| area(p)).sum();
        assert!((total - 8.0).abs() < 1e-12);
    }

    #[test]
    fn vertices_off_by_the_last_bits_still_join_and_non_convex_pieces_stay() {
        let mut right = square(1.0, 0.0);
        right[0][0] += 1e-15;
        right[3][1] -= 1e-15;
        let l_shape = vec![
            [5.0, 0.0],
            [7.0, 0.0],
            [7.0, 1.0],
            [6.0, 1.0],
            [6.0, 2.0],
            [5.0, 2.0],
        ];
        let joined = joined_convex(&[square(0.0, 0.0), right, l_shape.clone()]);
        assert_eq!(joined.len(), 2);
        assert!(joined.contains(&l_shape));
    }

    #[test]
    fn triangles_of_a_hip_end_join_into_the_triangle() {
        // A hip end cut by a line from the apex: two triangles, one triangle again.
        let left = vec![[0.0, 0.0], [2.0, 0.0], [2.0, 2.0]];
        let right = vec![[2.0, 0.0], [4.0, 0.0], [2.0, 2.0]];
        let joined = joined_convex(&[left, right]);
        assert_eq!(joined.len(), 1);
        assert_eq!(joined[0].len(), 3);
        assert!((area(&joined[0]) - 4.0).abs() < 1e-12);
    }
}
