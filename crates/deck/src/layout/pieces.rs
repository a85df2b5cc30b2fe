//! The pieces of deck: each panel or cut panel of a course, its outline in plan (cut along a hip or
//! valley where the plane is), the lines under its ends, and the cantilevers past its outermost
//! members, taken where they are largest within the piece's course band.
//!
//! On a hip end triangle or a side trapezoid the deck edge runs along the hip, so across one course
//! band the distance from the cut to the nearest line changes with the height. A piece is checked at
//! the band's low and high edges (a hair inside), its middle and the plane corners inside the band, and
//! the largest cantilever found is the one given, with the height it was found at: the conservative
//! strip within the band. A cut edge bears on the hip or valley rafter (no cantilever) unless the strip
//! between it and the nearest line is a sliver under [`SLIVER_M`], which the line carries as a short
//! cantilever, as the bearings do.

use super::courses::{grid_between, SLIVER_M};
use super::geometry::{edges, section_into, SectionScratch, MIN_PIECE_M, SAME_POSITION_M};
use super::lines::{GridLine, PlaneFrame};
use super::{Course, DeckPiece};

/// A hair inside a course band, m on the slope: the section exactly on a course joint is the next
/// course's too.
const INSIDE_BAND_M: f64 = 1e-6;

/// The plane and its lines, for cutting pieces.
pub(crate) struct PieceCutter<'a> {
    pub polygon_m: &'a [[f64; 2]],
    pub frame: &'a PlaneFrame,
    pub grid: &'a [GridLine],
    /// Number of the plane's first grid line.
    pub first_number: u32,
}

/// The deck of one piece at one height: its stretch across the lines and its two cantilevers.
#[derive(Debug, Clone, Copy, PartialEq)]
struct PieceSection {
    cantilever_start_m: f64,
    cantilever_end_m: f64,
    start_cut: bool,
    end_cut: bool,
}

impl PieceCutter<'_> {
    /// The pieces of every course; a piece that lies wholly outside the plane (a corner of a hip end
    /// beyond the hips) is not laid.
    pub(crate) fn pieces(&self, courses: &[Course]) -> Vec<DeckPiece> {
        let mut pieces = Vec::new();
        let mut scratch = SectionScratch::default();
        for course in courses {
            for pair in course.joints_m.windows(2) {
                if let Some(piece) = self.piece(course, pair[0], pair[1], &mut scratch) {
                    pieces.push(piece);
                }
            }
        }
        pieces
    }

    fn line_at(&self, position: f64) -> Option<u32> {
        let index = self
            .grid
            .partition_point(|g| g.position_m < position - SAME_POSITION_M);
        self.grid
            .get(index)
            .filter(|g| (g.position_m - position).abs() <= SAME_POSITION_M)
            .map(|_| self.first_number + index as u32)
    }

    fn piece(
        &self,
        course: &Course,
        start_m: f64,
        end_m: f64,
        scratch: &mut SectionScratch,
    ) -> Option<DeckPiece> {
        let frame = self.frame;
        let outline_m = self.outline(course, start_m, end_m);
        if outline_m.len() < 3 {
            return None;
        }
        let r = frame.run.index();
        // Deck less than the layout's millimetre up the slope is no piece: a course band that meets
        // the plane only by a hair (the plane's top edge a few hundredths of a millimetre above the
        // band's foot over part of its width), where the lines bear on no stretch that short either.
        let (low_m, high_m) = outline_m
            .iter()
            .map(|p| frame.slope_from_low_edge_m(p[r]))
            .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), h| {
                (lo.min(h), hi.max(h))
            });
        if high_m - low_m < MIN_PIECE_M {
            return None;
        }
        // Heights to look at: the band's edges (a hair inside), its middle, the outline's corners.
        let mut heights = vec![
            course.from_m + INSIDE_BAND_M,
            0.5 * (course.from_m + course.to_m),
            course.to_m - INSIDE_BAND_M,
        ];
        heights.extend(
            outline_m
                .iter()
                .map(|p| frame.slope_from_low_edge_m(p[r]))
                .map(|h| h.clamp(course.from_m + INSIDE_BAND_M, course.to_m - INSIDE_BAND_M)),
        );
        heights
            .extend(self.sliver_heights(start_m, end_m).filter(|h| {
                *h > course.from_m + INSIDE_BAND_M && *h < course.to_m - INSIDE_BAND_M
            }));
        let mut worst: Option<(f64, PieceSection)> = None;
        let mut start_cut = false;
        let mut end_cut = false;
        for (index, &height) in heights.iter().enumerate() {
            // A corner on the band's edge clamps to the very height the edge gave: looking there
            // again finds the same section, which neither replaces the worst (it must be larger) nor
            // adds a cut, so it is skipped (about half the heights of a rectangular piece).
            if heights[..index]
                .iter()
                .any(|seen| seen.to_bits() == height.to_bits())
            {
                continue;
            }
            let Some(at) = self.section_at(height, start_m, end_m, scratch) else {
                continue;
            };
            start_cut |= at.start_cut;
            end_cut |= at.end_cut;
            let larger = worst.is_none_or(|(_, w)| {
                at.cantilever_start_m.max(at.cantilever_end_m)
                    > w.cantilever_start_m.max(w.cantilever_end_m) + 1e-12
            });
            if larger {
                worst = Some((height, at));
            }
        }
        let (cantilever_at_m, at) = worst?;
        Some(DeckPiece {
            plane_index: course.plane_index,
            course: course.index,
            start_m,
            end_m,
            from_slope_m: course.from_m,
            to_slope_m: course.to_m,
            length_m: (end_m - start_m) * frame.cross_factor,
            width_m: course.to_m - course.from_m,
            start_line: self.line_at(start_m),
            end_line: self.line_at(end_m),
            cantilever_start_m: at.cantilever_start_m,
            cantilever_end_m: at.cantilever_end_m,
            cantilever_at_m,
            start_cut,
            end_cut,
            outline_m,
        })
    }

    /// Heights (m up the slope) where a hip or valley cut comes just within [`SLIVER_M`] of a line
    /// under the piece: there the line carries the largest sliver as a cantilever.
    fn sliver_heights(&self, start_m: f64, end_m: f64) -> impl Iterator<Item = f64> + '_ {
        let frame = self.frame;
        let r = frame.run.index();
        let k = frame.run.other().index();
        let reach_m = SLIVER_M / frame.cross_factor * (1.0 - 1e-6);
        let lines = grid_between(
            self.grid,
            start_m - SAME_POSITION_M,
            end_m + SAME_POSITION_M,
        );
        let polygon = self.polygon_m;
        edges(polygon).flat_map(move |(a, b)| {
            let oblique = (a[0] - b[0]).abs() > 1e-9 && (a[1] - b[1]).abs() > 1e-9;
            lines
                .iter()
                .filter(move |_| oblique)
                .flat_map(move |g| [g.position_m - reach_m, g.position_m + reach_m])
                .filter_map(move |cross| {
                    let t = (cross - a[k]) / (b[k] - a[k]);
                    (0.0..=1.0)
                        .contains(&t)
                        .then(|| frame.slope_from_low_edge_m(a[r] + t * (b[r] - a[r])))
                })
        })
    }

    /// The piece at `height` (m up the slope): where its deck runs and how far it cantilevers.
    fn section_at(
        &self,
        height: f64,
        start_m: f64,
        end_m: f64,
        scratch: &mut SectionScratch,
    ) -> Option<PieceSection> {
        let frame = self.frame;
        let along_m = frame.along_at_m(height);
        section_into(self.polygon_m, frame.run.other(), along_m, scratch);
        let stretch = scratch
            .stretches
            .iter()
            .copied()
            .find(|s| s.hi > start_m + SAME_POSITION_M && s.lo < end_m - SAME_POSITION_M)?;
        let lo = stretch.lo.max(start_m);
        let hi = stretch.hi.min(end_m);
        // The deck's own edge (not the panel's end) bounds the piece here, and it is a hip or valley.
        let start_cut = stretch.lo_oblique && stretch.lo >= start_m - SAME_POSITION_M;
        let end_cut = stretch.hi_oblique && stretch.hi <= end_m + SAME_POSITION_M;
        // Only the outermost lines under the piece set its cantilevers.
        let mut supports = grid_between(self.grid, lo - SAME_POSITION_M, hi + SAME_POSITION_M)
            .iter()
            .filter(|g| g.is_present_at(along_m))
            .map(|g| g.position_m);
        let first = supports.next();
        let last = supports.next_back().or(first);
        let cf = frame.cross_factor;
        // A cut bears on its hip or valley rafter unless the strip to the line is a sliver.
        let cantilever = |gap_m: f64, cut: bool| {
            let gap = gap_m.max(0.0) * cf;
            if gap <= SAME_POSITION_M || (cut && gap >= SLIVER_M) {
                0.0
            } else {
                gap
            }
        };
        let (first, last) = match (first, last) {
            (Some(first), Some(last)) => (first, last),
            // No line under the piece at this height: it rests on the cuts alone, or on nothing.
            _ => {
                let width = (hi - lo) * cf;
                let on_cuts = start_cut && end_cut;
                return Some(PieceSection {
                    cantilever_start_m: if on_cuts { 0.0 } else { width },
                    cantilever_end_m: 0.0,
                    start_cut,
                    end_cut,
                });
            }
        };
        Some(PieceSection {
            cantilever_start_m: cantilever(first - lo, start_cut),
            cantilever_end_m: cantilever(hi - last, end_cut),
            start_cut,
            end_cut,
        })
    }

    /// The piece's outline in plan: the panel's rectangle clipped to the plane (Sutherland-Hodgman
    /// against the rectangle, which is convex), counter-clockwise as the plane's outline runs.
    fn outline(&self, course: &Course, start_m: f64, end_m: f64) -> Vec<[f64; 2]> {
        let frame = self.frame;
        let a = frame.along_at_m(course.from_m);
        let b = frame.along_at_m(course.to_m);
        let r = frame.run.index();
        let k = frame.run.other().index();
        let mut lo = [0.0; 2];
        let mut hi = [0.0; 2];
        lo[r] = a.min(b);
        hi[r] = a.max(b);
        lo[k] = start_m;
        hi[k] = end_m;
        clip_to_box(self.polygon_m, lo, hi)
    }
}

/// `polygon` clipped to the axis-parallel box `lo..hi` (Sutherland-Hodgman, one box side at a time).
/// Points closer than 1 µm to the one before are merged.
pub(crate) fn clip_to_box(polygon: &[[f64; 2]], lo: [f64; 2], hi: [f64; 2]) -> Vec<[f64; 2]> {
    let mut points = polygon.to_vec();
    // Two buffers in turn: a piece is clipped four times, and a roof has hundreds of pieces.
    let mut clipped = Vec::with_capacity(points.len() + 4);
    for axis in 0..2 {
        for (bound, keep_below) in [(lo[axis], false), (hi[axis], true)] {
            let inside = |p: &[f64; 2]| {
                if keep_below {
                    p[axis] <= bound
                } else {
                    p[axis] >= bound
                }
            };
            clipped.clear();
            for (p, q) in edges(&points) {
                let (p_in, q_in) = (inside(&p), inside(&q));
                if p_in {
                    clipped.push(p);
                }
                if p_in != q_in {
                    let t = (bound - p[axis]) / (q[axis] - p[axis]);
                    let mut cut = [p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])];
                    cut[axis] = bound;
                    clipped.push(cut);
                }
            }
            std::mem::swap(&mut points, &mut clipped);
            if points.is_empty() {
                return points;
            }
        }
    }
    let mut merged: Vec<[f64; 2]> = Vec::with_capacity(points.len());
    for p in points {
        if merged
            .last()
            .is_none_or(|m| (m[0] - p[0]).hypot(m[1] - p[1]) > SAME_POSITION_M)
        {
            merged.push(p);
        }
    }
    while merged.len() > 1 {
        let (first, last) = (merged[0], merged[merged.len() - 1]);
        if (first[0] - last[0]).hypot(first[1] - last[1]) > SAME_POSITION_M {
            break;
        }
        merged.pop();
    }
    merged
}
