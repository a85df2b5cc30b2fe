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
/// Polygons with a coordinate this far from the origin or farther are not joined, m.
const FARTHEST_M: f64 = 1e6;
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

/// The most vertices a joined piece keeps; a join that would make more is not made (the pieces stay
/// as they are, which is only slower). Fixed, so that pieces and joins allocate nothing.
const MOST_VERTICES: usize = 32;

/// Every vertex of the zone's pieces, once each as a piece gave it: the pieces hold indices.
#[derive(Debug, Default)]
struct Vertices {
    points: Vec<Point>,
    keys: Vec<Key>,
}

/// A piece as indices into [`Vertices`], in ring order.
#[derive(Debug, Clone, Copy)]
struct Piece {
    len: usize,
    at: [u32; MOST_VERTICES],
}

impl Piece {
    /// The polygon's vertices added to `vertices`, each run that snaps to one point kept as its first:
    /// the cuts leave repeated vertices (a point met twice, a few bits apart), and every edge here
    /// needs two distinct ends. None for a polygon of more than [`MOST_VERTICES`] points.
    fn new(polygon: &[Point], vertices: &mut Vertices) -> Option<Self> {
        if polygon.len() > MOST_VERTICES {
            return None;
        }
        let mut piece = Piece {
            len: 0,
            at: [0; MOST_VERTICES],
        };
        let mut last: Option<Key> = None;
        for point in polygon {
            let k = key(*point);
            if last != Some(k) {
                piece.at[piece.len] = vertices.points.len() as u32;
                piece.len += 1;
                vertices.points.push(*point);
                vertices.keys.push(k);
                last = Some(k);
            }
        }
        while piece.len > 1 && last == Some(vertices.keys[piece.at[0] as usize]) {
            piece.len -= 1;
            last = Some(vertices.keys[piece.at[piece.len - 1] as usize]);
        }
        Some(piece)
    }

    /// Index of vertex `i`, counted round the ring once at most (`i < 2 * len`): a subtraction, not
    /// a division, as every caller steps at most a ring ahead.
    fn vertex(&self, i: usize) -> usize {
        debug_assert!(i < 2 * self.len);
        let i = if i >= self.len { i - self.len } else { i };
        self.at[i] as usize
    }
}

/// The zone's polygons with every convex join made. Non-convex polygons and polygons of the other
/// orientation are kept as given, and so is every polygon joined to none.
pub(crate) fn joined_convex(polygons: &[Vec<Point>]) -> Vec<Vec<Point>> {
    // Keys tell points apart to a nanometre only within the range of an i64 (9e9 m); a roof lies well
    // inside 1,000 km of its origin, and anything else is given back as it came.
    if polygons
        .iter()
        .flatten()
        .any(|p| !(p[0].abs() < FARTHEST_M && p[1].abs() < FARTHEST_M))
    {
        return polygons.to_vec();
    }
    let mut vertices = Vertices::default();
    let vertex_count = polygons.iter().map(Vec::len).sum();
    vertices.points.reserve(vertex_count);
    vertices.keys.reserve(vertex_count);
    let mut pieces: Vec<Option<Piece>> = polygons
        .iter()
        .map(|p| Piece::new(p, &mut vertices))
        .collect();
    // Orientation of each convex piece: +1 counter-clockwise, -1 clockwise, 0 not joinable.
    let turn: Vec<i8> = pieces
        .iter()
        .map(|p| p.as_ref().map_or(0, |p| convex_turn(p, &vertices)))
        .collect();
    let mut fate = vec![Fate::AsGiven; pieces.len()];
    let mut edges: EdgeMap = HashMap::with_capacity_and_hasher(vertex_count, Default::default());
    let edge_of = |piece: &Piece, i: usize| {
        edge_id(
            vertices.keys[piece.vertex(i)],
            vertices.keys[piece.vertex(i + 1)],
        )
    };
    for (index, piece) in pieces.iter().enumerate() {
        if let (Some(piece), true) = (piece, turn[index] != 0) {
            for i in 0..piece.len {
                edges.insert(edge_of(piece, i), index);
            }
        }
    }
    for index in 0..pieces.len() {
        if turn[index] == 0 {
            continue;
        }
        while let Some((other, union)) = next_join(&pieces, &vertices, &turn, &edges, index) {
            for i in 0..union.len {
                edges.insert(edge_of(&union, i), index);
            }
            pieces[index] = Some(union);
            pieces[other] = None;
            fate[index] = Fate::Joined;
            fate[other] = Fate::Absorbed;
        }
    }
    pieces
        .iter()
        .zip(polygons)
        .zip(fate)
        .filter_map(|((piece, original), fate)| match (fate, piece) {
            (Fate::Joined, Some(piece)) => Some(
                (0..piece.len)
                    .map(|i| vertices.points[piece.vertex(i)])
                    .collect(),
            ),
            (Fate::Absorbed, _) => None,
            _ => Some(original.clone()),
        })
        .collect()
}

/// What became of a piece: given back as it came (joined to none, or not joinable), grown by joins,
/// or taken into another.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Fate {
    AsGiven,
    Joined,
    Absorbed,
}

/// The first neighbour of piece `index` that joins it convexly, and the joined piece.
fn next_join(
    pieces: &[Option<Piece>],
    vertices: &Vertices,
    turn: &[i8],
    edges: &EdgeMap,
    index: usize,
) -> Option<(usize, Piece)> {
    let piece = pieces[index].as_ref()?;
    let key_of = |piece: &Piece, i: usize| vertices.keys[piece.vertex(i)];
    (0..piece.len).find_map(|at_a| {
        let (a, b) = (key_of(piece, at_a), key_of(piece, at_a + 1));
        let other = *edges.get(&edge_id(b, a))?;
        if other == index || turn[other] != turn[index] {
            return None;
        }
        let neighbour = pieces[other].as_ref()?;
        let at_b_there = (0..neighbour.len)
            .find(|&i| key_of(neighbour, i) == b && key_of(neighbour, i + 1) == a)?;
        join(piece, at_a, neighbour, at_b_there, vertices, turn[index]).map(|union| (other, union))
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

/// +1 for a convex counter-clockwise piece, -1 for a convex clockwise one, 0 otherwise (turns both
/// ways, no turn at all, or fewer than three points).
fn convex_turn(piece: &Piece, vertices: &Vertices) -> i8 {
    let count = piece.len;
    if count < 3 {
        return 0;
    }
    let point = |i: usize| vertices.points[piece.vertex(i)];
    let (mut left, mut right) = (false, false);
    for i in 0..count {
        match turn_at(point(i), point(i + 1), point(i + 2), 1) {
            Some(true) => {}
            Some(false) => left = true,
            None => right = true,
        }
    }
    match (left, right) {
        (true, false) => 1,
        (false, true) => -1,
        _ => 0,
    }
}

/// The union of `piece` and `neighbour`, which share the edge from vertex `at_a` of `piece` (`a`
/// to `b`) met from vertex `at_b_there` of `neighbour` (`b` to `a`), when it is convex. Both are
/// convex with the same orientation, so only the turns at `a` and `b` can spoil it; either is dropped
/// where the join runs straight through it. The neighbour's vertices are spliced in where the shared
/// edge was.
fn join(
    piece: &Piece,
    at_a: usize,
    neighbour: &Piece,
    at_b_there: usize,
    vertices: &Vertices,
    turn: i8,
) -> Option<Piece> {
    let (count, other_count) = (piece.len, neighbour.len);
    if count + other_count - 2 > MOST_VERTICES {
        return None;
    }
    let point = |of: &Piece, i: usize| vertices.points[of.vertex(i)];
    let straight_at_a = turn_at(
        point(piece, at_a + count - 1),
        point(piece, at_a),
        point(neighbour, at_b_there + 2),
        turn,
    )?;
    let straight_at_b = turn_at(
        point(neighbour, at_b_there + other_count - 1),
        point(piece, at_a + 1),
        point(piece, at_a + 2),
        turn,
    )?;
    let mut union = Piece {
        len: 0,
        at: [0; MOST_VERTICES],
    };
    let mut push = |from: &Piece, i: usize| {
        union.at[union.len] = from.vertex(i) as u32;
        union.len += 1;
    };
    let wraps = at_a + 1 == count;
    // The piece up to before a (for the last edge, from past b: b is its first vertex), a, the
    // neighbour from past a round to before b, b, and the rest of the piece.
    let before_a = if wraps { 1..at_a } else { 0..at_a };
    for i in before_a {
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
    (union.len >= 3 && convex_turn(&union, vertices) == turn).then_some(union)
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

    fn turn_of(polygon: &[Point]) -> i8 {
        let mut vertices = Vertices::default();
        Piece::new(polygon, &mut vertices).map_or(0, |piece| convex_turn(&piece, &vertices))
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
        assert!(joined.iter().all(|p| turn_of(p) == 1));
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
        assert!(joined.iter().all(|p| turn_of(p) == 1));
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
    fn a_piece_of_more_vertices_than_a_join_keeps_is_given_back_as_it_came() {
        // Half a 40-gon standing on the x axis from -1 to 1, and a square under it.
        let mut half_circle: Vec<Point> = (0..=39)
            .map(|i| {
                let angle = std::f64::consts::PI * f64::from(i) / 39.0;
                [angle.cos(), angle.sin()]
            })
            .collect();
        half_circle[0] = [1.0, 0.0];
        half_circle[39] = [-1.0, 0.0];
        let square = vec![[-1.0, -2.0], [1.0, -2.0], [1.0, 0.0], [-1.0, 0.0]];
        let joined = joined_convex(&[half_circle.clone(), square.clone()]);
        assert_eq!(joined, vec![half_circle, square]);
    }

    #[test]
    fn pieces_far_from_the_origin_are_given_back_as_they_came() {
        let far = |x: f64| vec![[x, 0.0], [x + 1.0, 0.0], [x + 1.0, 1.0], [x, 1.0]];
        let pieces = vec![far(2e6), far(2e6 + 1.0), far(1e300), far(f64::MAX / 4.0)];
        assert_eq!(joined_convex(&pieces), pieces);
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
