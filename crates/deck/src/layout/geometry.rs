//! Sections of plan polygons by axis-parallel lines.
//!
//! Everything the layout needs from geometry: where a line at a constant coordinate runs inside a
//! polygon (convex or not), and whether the polygon edge that ends a stretch is oblique (a hip or
//! valley) or parallel to the framing.

use super::Axis;
use crate::error::SpacingError;

/// Positions closer than this are the same position, m.
pub(crate) const SAME_POSITION_M: f64 = 1e-6;
/// Stretches and pieces shorter than this are dropped, m (1 mm).
pub(crate) const MIN_PIECE_M: f64 = 1e-3;
/// A line lying on a polygon edge is sectioned this far to either side, m.
const SIDE_NUDGE_M: f64 = 1e-7;

impl Axis {
    /// Coordinate index of the axis: x = 0, y = 1.
    pub(crate) fn index(self) -> usize {
        match self {
            Axis::X => 0,
            Axis::Y => 1,
        }
    }

    /// The perpendicular axis.
    pub(crate) fn other(self) -> Axis {
        match self {
            Axis::X => Axis::Y,
            Axis::Y => Axis::X,
        }
    }
}

/// One stretch of a section line inside a polygon.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Stretch {
    pub lo: f64,
    pub hi: f64,
    /// The polygon edge at `lo` is oblique to the section line's normal (a hip, a valley).
    pub lo_oblique: bool,
    pub hi_oblique: bool,
}

/// Section of `polygon` by the line that runs along `run` at the constant other coordinate `at`.
///
/// Even-odd rule with half-open edges, so a vertex on the line is counted once. Returns the
/// stretches along `run`, sorted.
pub(crate) fn section(polygon: &[[f64; 2]], run: Axis, at: f64) -> Vec<Stretch> {
    let mut scratch = SectionScratch::default();
    section_into(polygon, run, at, &mut scratch);
    scratch.stretches
}

/// Buffers for [`section_into`], kept by a caller that sections many times (a big roof sections its
/// zones hundreds of thousands of times; a fresh vector each time was most of the layout's time).
#[derive(Debug, Default)]
pub(crate) struct SectionScratch {
    hits: Vec<(f64, bool)>,
    /// The result of the last [`section_into`].
    pub stretches: Vec<Stretch>,
}

/// [`section`] into `scratch.stretches`, reusing its buffers.
pub(crate) fn section_into(polygon: &[[f64; 2]], run: Axis, at: f64, scratch: &mut SectionScratch) {
    // A gable's planes and most zone pieces are axis-parallel rectangles: their bounds are their
    // section (the test fails at the first oblique edge of any other polygon).
    if let Some(rectangle) = BoxSection::of(polygon) {
        return rectangle.section_into(run, at, scratch);
    }
    section_by_edges(polygon, run, at, scratch);
}

/// [`section_into`] by walking the polygon's edges.
fn section_by_edges(polygon: &[[f64; 2]], run: Axis, at: f64, scratch: &mut SectionScratch) {
    // One copy per axis, the coordinate indices constants: the layout sections polygons some
    // thousand times a roof, and indexing by a variable cost about a tenth of its instructions.
    match run {
        Axis::X => section_along::<0, 1>(polygon, at, scratch),
        Axis::Y => section_along::<1, 0>(polygon, at, scratch),
    }
}

/// [`section_into`] for a line along coordinate `R` at the constant coordinate `K` = `at`.
fn section_along<const R: usize, const K: usize>(
    polygon: &[[f64; 2]],
    at: f64,
    scratch: &mut SectionScratch,
) {
    let hits = &mut scratch.hits;
    hits.clear();
    // Every edge crosses at most once: room for all of them, no growing on the way.
    hits.reserve(polygon.len());
    for (a, b) in edges(polygon) {
        if (a[K] < at) != (b[K] < at) {
            let t = (at - a[K]) / (b[K] - a[K]);
            let along = a[R] + t * (b[R] - a[R]);
            hits.push((along, is_oblique(b[R] - a[R], b[K] - a[K])));
        }
    }
    // Two hits (any convex polygon) need at most a swap; the stable sort for more gives the same
    // order and costs a tenth of the sectioning on its own.
    if let [first, second] = hits.as_mut_slice() {
        if second.0.total_cmp(&first.0).is_lt() {
            std::mem::swap(first, second);
        }
    } else {
        hits.sort_by(|p, q| p.0.total_cmp(&q.0));
    }
    // Pushed one by one: `extend` here went through a call that cost a fifth of the section.
    let stretches = &mut scratch.stretches;
    stretches.clear();
    for pair in hits.chunks_exact(2) {
        stretches.push(Stretch {
            lo: pair[0].0,
            hi: pair[1].0,
            lo_oblique: pair[0].1,
            hi_oblique: pair[1].1,
        });
    }
}

/// A polygon that is an axis-parallel rectangle (four corners, every edge along x or along y), with
/// its bounds: its section is read off the bounds ([`BoxSection::section_into`]). Most wind zone
/// pieces of a rectangle roof are such rectangles, and sectioning them was a sixth of the layout.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct BoxSection {
    bounds: [[f64; 2]; 2],
}

impl BoxSection {
    /// The rectangle's section; None for any other polygon.
    pub(crate) fn of(polygon: &[[f64; 2]]) -> Option<Self> {
        let is_box =
            polygon.len() == 4 && edges(polygon).all(|(a, b)| a[0] == b[0] || a[1] == b[1]);
        is_box.then(|| BoxSection {
            bounds: bounds(polygon),
        })
    }

    /// The rectangle's plan bounds `[min, max]`.
    pub(crate) fn bounds(&self) -> [[f64; 2]; 2] {
        self.bounds
    }

    /// [`section_into`] of the rectangle, exactly: an edge along `run`'s other axis crosses the line at
    /// its own coordinate (the interpolation adds `t * 0`), under the same half-open rule, and no such
    /// edge is oblique.
    pub(crate) fn section_into(&self, run: Axis, at: f64, scratch: &mut SectionScratch) {
        let r = run.index();
        let k = run.other().index();
        let [lo, hi] = self.bounds;
        scratch.stretches.clear();
        if lo[k] < at && at <= hi[k] {
            scratch.stretches.push(Stretch {
                lo: lo[r],
                hi: hi[r],
                lo_oblique: false,
                hi_oblique: false,
            });
        }
    }
}

/// An edge running `along_m` with the section line and `across_m` across it is oblique (a hip or a
/// valley) when its run along the line is more than a billionth of its length. Compared squared: a
/// `hypot` for the length was about 5 % of the layout's instructions, and the test only ever meets edges whose
/// ratio is 0 (parallel to the framing) or of order 1 (a hip), never near the threshold.
fn is_oblique(along_m: f64, across_m: f64) -> bool {
    along_m * along_m > 1e-18 * (along_m * along_m + across_m * across_m)
}

/// Where a framing line running along `run` at `at` lies inside `polygon`: the union of the sections
/// just either side of it, so a line on an outer edge or along an inner edge keeps the deck it
/// carries. Intervals shorter than [`MIN_PIECE_M`] are dropped.
pub(crate) fn line_intervals(polygon: &[[f64; 2]], run: Axis, at: f64) -> Vec<[f64; 2]> {
    line_intervals_with(polygon, run, at, &mut SectionScratch::default())
}

/// [`line_intervals`] with the caller's section buffers (the lines of a plane are set out one after
/// another).
pub(crate) fn line_intervals_with(
    polygon: &[[f64; 2]],
    run: Axis,
    at: f64,
    scratch: &mut SectionScratch,
) -> Vec<[f64; 2]> {
    let mut all: Vec<[f64; 2]> = Vec::with_capacity(4);
    for side in [at - SIDE_NUDGE_M, at + SIDE_NUDGE_M] {
        section_into(polygon, run, side, scratch);
        all.extend(scratch.stretches.iter().map(|s| [s.lo, s.hi]));
    }
    all.sort_by(|p, q| p[0].total_cmp(&q[0]));
    // Merged in place: `merged` intervals are kept at the front.
    let mut merged = 0;
    for i in 0..all.len() {
        let interval = all[i];
        if merged > 0 && interval[0] <= all[merged - 1][1] + SAME_POSITION_M {
            all[merged - 1][1] = all[merged - 1][1].max(interval[1]);
        } else {
            all[merged] = interval;
            merged += 1;
        }
    }
    all.truncate(merged);
    all.retain(|i| i[1] - i[0] >= MIN_PIECE_M);
    all
}

/// Along-`run` coordinates where the edges of `polygon` cross the line along `run` at `at`.
pub(crate) fn crossings(
    polygon: &[[f64; 2]],
    run: Axis,
    at: f64,
) -> impl Iterator<Item = f64> + '_ {
    let r = run.index();
    let k = run.other().index();
    edges(polygon)
        .filter(move |(a, b)| (a[k] < at) != (b[k] < at))
        .map(move |(a, b)| a[r] + (at - a[k]) / (b[k] - a[k]) * (b[r] - a[r]))
}

/// The polygon's edges in order, each from a vertex to the next and the last back to the first: the
/// same edges as indexing `(i + 1) % len`, without a division per edge (the layout walks polygon
/// edges millions of times a batch).
pub(crate) fn edges(polygon: &[[f64; 2]]) -> impl Iterator<Item = ([f64; 2], [f64; 2])> + '_ {
    let count = polygon.len();
    (0..count).map(move |i| {
        let next = if i + 1 == count { 0 } else { i + 1 };
        (polygon[i], polygon[next])
    })
}

/// Sorts `values` into `f64::total_cmp`'s order, comparing integers: the key is the one `total_cmp`
/// itself compares (the bits, with all but the sign flipped for a negative number), so the order is
/// the same, at about half the cost of sorting with the closure. A line on a hip roof sorts a few
/// hundred breakpoints, and that sort was a sixth of the zone split's time. `keys` is a buffer.
pub(crate) fn sort_total(values: &mut [f64], keys: &mut Vec<i64>) {
    // The same transform as `f64::total_cmp`; applied twice it gives the bits back.
    let flip = |bits: i64| bits ^ (((bits >> 63) as u64) >> 1) as i64;
    keys.clear();
    keys.extend(values.iter().map(|v| flip(v.to_bits() as i64)));
    keys.sort_unstable();
    for (value, key) in values.iter_mut().zip(keys.iter()) {
        *value = f64::from_bits(flip(*key) as u64);
    }
}

/// `value.round() as i64` without `round`'s library call (a roof rounds thousands of lengths into
/// cache keys): the truncation is one instruction, and the fraction left is exact below 2^52. For
/// values of any size the layout meets (keys of lengths in 0.1 nm steps reach 1e12).
pub(crate) fn round_i64(value: f64) -> i64 {
    // Larger, infinite or NaN: the library call (no fraction is left to round above 2^52 anyway).
    if value.is_nan() || value.abs() >= 4.0e15 {
        return value.round() as i64;
    }
    let whole = value as i64;
    let fraction = value - whole as f64;
    if fraction >= 0.5 {
        whole + 1
    } else if fraction <= -0.5 {
        whole - 1
    } else {
        whole
    }
}

/// Plan bounding box `[min, max]` of a polygon.
pub(crate) fn bounds(polygon: &[[f64; 2]]) -> [[f64; 2]; 2] {
    let mut lo = [f64::INFINITY; 2];
    let mut hi = [f64::NEG_INFINITY; 2];
    for p in polygon {
        for k in 0..2 {
            lo[k] = lo[k].min(p[k]);
            hi[k] = hi[k].max(p[k]);
        }
    }
    [lo, hi]
}

/// Twice the signed area (shoelace), m².
fn doubled_area_m2(polygon: &[[f64; 2]]) -> f64 {
    edges(polygon).map(|(a, b)| a[0] * b[1] - b[0] * a[1]).sum()
}

/// A polygon needs three finite points and, when `needs_area`, a non-zero area. The field's name is
/// written only for a message: a hip roof's zones come in some 250 polygons, each named
/// `zones[i].polygons_m[j]`, and formatting every name cost 2 % of a roof's layout.
pub(crate) fn validate_polygon(
    field: impl Fn() -> String,
    polygon: &[[f64; 2]],
    needs_area: bool,
) -> Result<(), SpacingError> {
    if polygon.len() < 3 {
        return Err(SpacingError::Invalid {
            field: field(),
            reason: format!("has {} points, needs at least 3", polygon.len()),
        });
    }
    if let Some((i, p)) = polygon
        .iter()
        .enumerate()
        .find(|(_, p)| !(p[0].is_finite() && p[1].is_finite()))
    {
        return Err(SpacingError::Invalid {
            field: format!("{}[{i}]", field()),
            reason: format!("[{}, {}] is not a finite point", p[0], p[1]),
        });
    }
    if needs_area && doubled_area_m2(polygon).abs() < 1e-9 {
        return Err(SpacingError::Invalid {
            field: field(),
            reason: "encloses no area".to_string(),
        });
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    const RECTANGLE: [[f64; 2]; 4] = [[0.0, 0.0], [4.0, 0.0], [4.0, 2.0], [0.0, 2.0]];

    #[test]
    fn a_rectangle_is_sectioned_from_its_bounds_exactly_as_by_its_edges() {
        // Rectangles given from each corner and both ways round, cut at their edges, inside and
        // outside, along both axes: the same stretches, bit for bit.
        let corners = [[-1.3, 0.7], [2.9, 0.7], [2.9, 3.1], [-1.3, 3.1]];
        let mut polygons = Vec::new();
        for start in 0..4 {
            let mut turned: Vec<[f64; 2]> = (0..4).map(|i| corners[(start + i) % 4]).collect();
            polygons.push(turned.clone());
            turned.reverse();
            polygons.push(turned);
        }
        for polygon in &polygons {
            let shortcut = BoxSection::of(polygon).expect("a rectangle");
            for run in [Axis::X, Axis::Y] {
                for at in [-2.0, -1.3, -0.1, 0.7, 1.0, 2.9, 3.1, 3.5, 1.0 / 3.0] {
                    let mut by_edges = SectionScratch::default();
                    section_by_edges(polygon, run, at, &mut by_edges);
                    let mut by_bounds = SectionScratch::default();
                    shortcut.section_into(run, at, &mut by_bounds);
                    assert_eq!(by_bounds.stretches, by_edges.stretches, "{run:?} at {at}");
                }
            }
        }
        assert!(BoxSection::of(&[[0.0, 0.0], [4.0, 0.0], [4.0, 2.0]]).is_none());
        assert!(BoxSection::of(&[[0.0, 0.0], [4.0, 0.0], [4.0, 2.0], [0.1, 2.0]]).is_none());
    }

    #[test]
    fn round_i64_rounds_as_round_does() {
        let just_under_half = 0.5 - f64::EPSILON / 4.0;
        for value in [
            0.0,
            -0.0,
            just_under_half,
            -just_under_half,
            0.5,
            -0.5,
            1.5,
            2.5,
            -2.5,
            1e12 + 0.5,
            -1e12 - 0.5,
            123_456_789.499_999_99,
            4_503_599_627_370_495.5,
            1e20,
            -1e20,
            f64::NAN,
        ] {
            assert_eq!(round_i64(value), value.round() as i64, "{value}");
        }
        for i in 0..20_000 {
            let value = (f64::from(i) - 10_000.0) * 0.173_205_080_756_887_7 * 1e6;
            assert_eq!(round_i64(value), value.round() as i64, "{value}");
        }
    }

    #[test]
    fn sort_total_gives_total_cmps_order() {
        let mut values = vec![
            3.5,
            -0.0,
            0.0,
            -2.25,
            1e-300,
            -1e-300,
            3.5,
            f64::MAX,
            f64::MIN,
        ];
        let mut expected = values.clone();
        expected.sort_by(f64::total_cmp);
        sort_total(&mut values, &mut Vec::new());
        let bits = |v: &[f64]| v.iter().map(|x| x.to_bits()).collect::<Vec<_>>();
        assert_eq!(bits(&values), bits(&expected));
    }

    #[test]
    fn a_line_on_either_outer_edge_keeps_the_edge() {
        assert_eq!(line_intervals(&RECTANGLE, Axis::Y, 0.0), vec![[0.0, 2.0]]);
        assert_eq!(line_intervals(&RECTANGLE, Axis::Y, 4.0), vec![[0.0, 2.0]]);
        assert_eq!(line_intervals(&RECTANGLE, Axis::X, 2.0), vec![[0.0, 4.0]]);
        assert!(line_intervals(&RECTANGLE, Axis::Y, 4.5).is_empty());
    }

    #[test]
    fn a_triangle_is_cut_where_its_sides_are() {
        // Hip end in plan: eave along x = 0, apex at (3, 3).
        let triangle = [[0.0, 0.0], [3.0, 3.0], [0.0, 6.0]];
        let at_one = line_intervals(&triangle, Axis::X, 1.0);
        assert_eq!(at_one.len(), 1);
        assert_relative_eq!(at_one[0][0], 0.0, epsilon = 1e-6);
        assert_relative_eq!(at_one[0][1], 1.0, epsilon = 1e-6);
        // The line through the corner at y = 0 touches the triangle only at a point.
        assert!(line_intervals(&triangle, Axis::X, 0.0).is_empty());
        let stretches = section(&triangle, Axis::Y, 1.0);
        assert_eq!(stretches.len(), 1);
        assert!(stretches[0].lo_oblique && stretches[0].hi_oblique);
        let square = section(&RECTANGLE, Axis::Y, 1.0);
        assert!(!square[0].lo_oblique && !square[0].hi_oblique);
    }

    #[test]
    fn a_u_shape_gives_two_intervals_and_an_inner_edge_keeps_the_longer_side() {
        // U open at the top: arms x 0..1 and 3..4, base y 0..1, height 3.
        let u = [
            [0.0, 0.0],
            [4.0, 0.0],
            [4.0, 3.0],
            [3.0, 3.0],
            [3.0, 1.0],
            [1.0, 1.0],
            [1.0, 3.0],
            [0.0, 3.0],
        ];
        assert_eq!(
            line_intervals(&u, Axis::X, 2.0),
            vec![[0.0, 1.0], [3.0, 4.0]]
        );
        assert_eq!(line_intervals(&u, Axis::Y, 1.0), vec![[0.0, 3.0]]);
        assert_eq!(line_intervals(&u, Axis::Y, 2.0), vec![[0.0, 1.0]]);
    }

    #[test]
    fn polygons_are_validated() {
        assert!(validate_polygon(|| "p".to_string(), &RECTANGLE, true).is_ok());
        assert!(validate_polygon(|| "p".to_string(), &RECTANGLE[..2], true).is_err());
        assert!(validate_polygon(
            || "p".to_string(),
            &[[0.0, 0.0], [1.0, 1.0], [2.0, 2.0]],
            true
        )
        .is_err());
        let error = validate_polygon(
            || "p".to_string(),
            &[[0.0, 0.0], [1.0, f64::NAN], [2.0, 0.0]],
            true,
        )
        .expect_err("nan");
        assert!(error.to_string().starts_with("p[1]"), "{error}");
    }
}
