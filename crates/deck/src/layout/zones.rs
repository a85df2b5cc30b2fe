//! Which wind zone governs each stretch of a framing line.
//!
//! The nails on a line hold the deck strip that bears on it, and that strip reaches half a framing
//! spacing to either side of the line. So a stretch of line takes the worst zone (highest caller rank)
//! that the strip touches there, not only the zone under the line itself. This is conservative near
//! zone boundaries that run parallel to the lines, by at most half a spacing.

use super::geometry::{
    bounds, crossings, section_into, sort_total, BoxSection, SectionScratch, MIN_PIECE_M,
    SAME_POSITION_M,
};
use super::zone_merge::joined_convex;
use super::{Axis, ZoneRegion};
use crate::error::SpacingError;

/// A stretch of a line in one zone, in plan coordinates along the line.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct PlanZonePiece {
    pub from_m: f64,
    pub to_m: f64,
    pub zone_index: usize,
    /// The zone's rank (higher = worse).
    pub rank: u32,
}

/// The framing line being split: where it is and how wide a strip it holds.
#[derive(Debug, Clone, Copy)]
pub(crate) struct LineStrip<'a> {
    pub number: u32,
    pub plane_polygon_m: &'a [[f64; 2]],
    pub run: Axis,
    pub position_m: f64,
    pub half_width_m: f64,
}

/// One zone polygon with its plan bounds and its zone's rank.
#[derive(Debug, Clone, Copy)]
struct ZoneShape<'a> {
    zone_index: usize,
    rank: u32,
    polygon: &'a [[f64; 2]],
    bounds: [[f64; 2]; 2],
    /// Set for an axis-parallel rectangle: its sections are read off its bounds.
    /// An axis-parallel rectangle: its bounds are its shape.
    rectangle: bool,
}

/// Each zone's polygons with the convex pieces that share an edge joined (see `zone_merge`), made
/// once per layout: the shapes the lines are split against borrow from here. A zone that comes as
/// axis-parallel rectangles only (a rectangle roof's, joined row by row already) is taken as it
/// comes: joining the few left cost as much as the lines gained.
#[derive(Debug, Clone)]
pub(crate) struct JoinedZones {
    zones: Vec<(usize, Vec<Vec<[f64; 2]>>)>,
}

impl JoinedZones {
    pub(crate) fn new(zones: &[ZoneRegion]) -> Self {
        Self {
            zones: zones
                .iter()
                .map(|zone| {
                    let rectangles = zone
                        .polygons_m
                        .iter()
                        .all(|polygon| BoxSection::of(polygon).is_some());
                    let polygons = if rectangles {
                        zone.polygons_m.clone()
                    } else {
                        joined_convex(&zone.polygons_m)
                    };
                    (zone.zone_index, polygons)
                })
                .collect(),
        }
    }
}

/// Every zone polygon with its bounds, worked out once per layout rather than once per line, worst
/// zone first: once a stretch has found a zone its strip touches, no lower-ranked polygon can govern
/// it, and the search stops there.
#[derive(Debug, Clone)]
pub(crate) struct ZoneShapes<'a> {
    shapes: Vec<ZoneShape<'a>>,
}

impl<'a> ZoneShapes<'a> {
    /// `zone_rank[zone_index]` orders the zones, higher = worse.
    pub(crate) fn new(zones: &'a JoinedZones, zone_rank: &[u32]) -> Self {
        let mut shapes: Vec<ZoneShape<'a>> = zones
            .zones
            .iter()
            .flat_map(|(zone_index, polygons)| {
                let rank = zone_rank.get(*zone_index).copied().unwrap_or(0);
                polygons.iter().map(move |polygon| ZoneShape {
                    zone_index: *zone_index,
                    rank,
                    polygon: polygon.as_slice(),
                    bounds: bounds(polygon),
                    rectangle: BoxSection::of(polygon).is_some(),
                })
            })
            .collect();
        shapes.sort_by_key(|shape| std::cmp::Reverse(shape.rank));
        Self { shapes }
    }

    /// The shapes whose bounds come within `margin_m` of the box `[lo, hi]`, in the same order: the
    /// lines of one plane meet only those (a hip roof has some 250 shapes over its four planes, and
    /// every line scanned them all).
    pub(crate) fn near(&self, [lo, hi]: [[f64; 2]; 2], margin_m: f64) -> ZoneShapes<'a> {
        let shapes = self
            .shapes
            .iter()
            .filter(|shape| {
                let [shape_lo, shape_hi] = shape.bounds;
                (0..2).all(|axis| {
                    shape_lo[axis] <= hi[axis] + margin_m && shape_hi[axis] >= lo[axis] - margin_m
                })
            })
            .copied()
            .collect();
        ZoneShapes { shapes }
    }
}

/// Buffers for [`zone_pieces_with`], kept across the lines of a layout (a roof splits some sixty
/// lines; fresh vectors for each were a sixth of the split's time).
#[derive(Debug, Default)]
pub(crate) struct ZoneWork {
    /// Indices into the shapes of the ones the strip can meet.
    candidates: Vec<usize>,
    breaks: Vec<f64>,
    keys: Vec<i64>,
    kept: Vec<f64>,
    window: Vec<[f64; 2]>,
    scratch: SectionScratch,
    /// The result of the last [`zone_pieces_with`].
    pub pieces: Vec<PlanZonePiece>,
    /// The last split's [`PlainSplit`] (when `last_was_plain`: `pieces` hold its result).
    last_plain: PlainSplit,
    last_was_plain: bool,
    /// This split's, filled in when it is plain.
    plain: PlainSplit,
}

/// What decides a plain line's split: a line on an axis-parallel rectangular plane whose strip meets
/// only axis-parallel rectangles, none with a side inside the strip. Every rectangle it meets then
/// spans the strip: the breakpoints are the rectangles' ends along the line and each stretch's zone
/// is the worst rectangle over it, whatever the line's position. So a plain line with the same
/// interval, plane and rectangles as the last one has the last one's split (most lines of a gable).
#[derive(Debug, Clone, Default, PartialEq)]
struct PlainSplit {
    along_m: [f64; 2],
    plane: [[f64; 2]; 2],
    /// Each rectangle's bounds, zone and rank, in the split's order.
    shapes: Vec<([[f64; 2]; 2], usize, u32)>,
}

/// Splits the plan interval `along_m` of a line into pieces by governing zone.
pub(crate) fn zone_pieces(
    line: LineStrip<'_>,
    along_m: [f64; 2],
    zones: &ZoneShapes<'_>,
) -> Result<Vec<PlanZonePiece>, SpacingError> {
    let mut work = ZoneWork::default();
    zone_pieces_with(line, along_m, zones, &mut work)?;
    Ok(work.pieces)
}

/// [`zone_pieces`] into `work.pieces`, reusing the buffers.
///
/// Breakpoints are where any zone or the plane's edge changes inside the strip: polygon vertices
/// within the strip and crossings of the strip's two sides. Between breakpoints the touched set is
/// constant and is found by sectioning across the strip at the middle. Breakpoints within a
/// micrometre are one (a vertex met twice, a few bits apart); a stretch left shorter than
/// [`MIN_PIECE_M`] goes to the worse of its neighbours ([`absorb_slivers`]), so the millimetre the
/// layout works to never shortens the more severe zone at a change, and a cut inside a
/// zone (the pieces one zone comes in) changes nothing.
pub(crate) fn zone_pieces_with(
    line: LineStrip<'_>,
    along_m: [f64; 2],
    zones: &ZoneShapes<'_>,
    work: &mut ZoneWork,
) -> Result<(), SpacingError> {
    let ZoneWork {
        candidates,
        breaks,
        keys,
        kept,
        window,
        scratch,
        pieces,
        last_plain,
        last_was_plain,
        plain,
    } = work;
    let strip = [
        line.position_m - line.half_width_m,
        line.position_m + line.half_width_m,
    ];
    let r = line.run.index();
    let k = line.run.other().index();
    let overlaps = |[lo, hi]: [[f64; 2]; 2]| {
        lo[k] <= strip[1] && hi[k] >= strip[0] && lo[r] <= along_m[1] && hi[r] >= along_m[0]
    };
    candidates.clear();
    candidates.extend(
        zones
            .shapes
            .iter()
            .enumerate()
            .filter(|(_, shape)| overlaps(shape.bounds))
            .map(|(index, _)| index),
    );
    let shape = |index: &usize| &zones.shapes[*index];

    // A plain line (see `PlainSplit`) like the last one: the pieces are already there.
    // The plane's bounds when it is an axis-parallel rectangle.
    let plane_rectangle = BoxSection::of(line.plane_polygon_m).map(|plane| plane.bounds());
    let inside_strip = |c: f64| strip[0] <= c && c <= strip[1];
    let spans_strip = |[lo, hi]: [[f64; 2]; 2]| !inside_strip(lo[k]) && !inside_strip(hi[k]);
    let is_plain = plane_rectangle.is_some_and(spans_strip)
        && candidates
            .iter()
            .map(shape)
            .all(|shape| shape.rectangle && spans_strip(shape.bounds));
    let was_plain = std::mem::take(last_was_plain);
    if let (true, Some(plane_bounds)) = (is_plain, plane_rectangle) {
        plain.along_m = along_m;
        plain.plane = plane_bounds;
        plain.shapes.clear();
        plain.shapes.extend(
            candidates
                .iter()
                .map(shape)
                .map(|s| (s.bounds, s.zone_index, s.rank)),
        );
        if was_plain && last_plain == plain {
            *last_was_plain = true;
            return Ok(());
        }
    }

    // Every vertex within the strip and every edge's crossing of either side of it: where a polygon
    // starts or stops touching the strip. A vertex outside the strip changes nothing inside it.
    breaks.clear();
    breaks.extend(along_m);
    // A rectangle that reaches the strip starts and stops touching it at its two ends along the line:
    // its corners in the strip and its sides' crossings of the strip's sides are those ends.
    let rectangles = candidates
        .iter()
        .map(shape)
        .filter(|shape| shape.rectangle)
        .map(|shape| shape.bounds)
        .chain(plane_rectangle);
    for [lo, hi] in rectangles {
        breaks.extend([lo[r], hi[r]]);
    }
    let others = candidates
        .iter()
        .map(shape)
        .filter(|shape| !shape.rectangle)
        .map(|shape| shape.polygon)
        .chain(plane_rectangle.is_none().then_some(line.plane_polygon_m));
    for polygon in others {
        breaks.extend(
            polygon
                .iter()
                .filter(|p| strip[0] <= p[k] && p[k] <= strip[1])
                .map(|p| p[r]),
        );
        for side in strip {
            breaks.extend(crossings(polygon, line.run, side));
        }
    }
    breaks.retain(|b| *b >= along_m[0] && *b <= along_m[1]);
    sort_total(breaks, keys);
    kept.clear();
    for b in breaks.iter().copied() {
        if kept.last().is_none_or(|last| b - last >= SAME_POSITION_M) {
            kept.push(b);
        }
    }
    // The interval's own end always closes the last piece.
    if let Some(last) = kept.last_mut() {
        *last = along_m[1];
    }

    pieces.clear();
    let across = line.run.other();
    for pair in kept.windows(2) {
        let middle = 0.5 * (pair[0] + pair[1]);
        section_into(line.plane_polygon_m, across, middle, scratch);
        window.clear();
        window.extend(
            scratch
                .stretches
                .iter()
                .map(|s| [s.lo.max(strip[0]), s.hi.min(strip[1])])
                .filter(|w| w[1] > w[0]),
        );
        let mut worst: Option<(u32, bool, usize)> = None;
        for shape in candidates.iter().map(shape) {
            // Worst zone first: a lower rank than the one found cannot govern.
            if worst.is_some_and(|(best_rank, _, _)| shape.rank < best_rank) {
                break;
            }
            // A polygon that does not reach `middle` along the line has an empty section there: skip
            // the sectioning (the same test as the section's own crossing rule).
            let [lo, hi] = shape.bounds;
            if !(lo[r] < middle && middle <= hi[r]) {
                continue;
            }
            section_into(shape.polygon, across, middle, scratch);
            let stretches = &scratch.stretches;
            let touched = stretches.iter().any(|s| {
                window
                    .iter()
                    .any(|w| s.hi.min(w[1]) - s.lo.max(w[0]) > SAME_POSITION_M * 1e-3)
            });
            if !touched {
                continue;
            }
            let on_line = stretches.iter().any(|s| {
                s.lo - SAME_POSITION_M <= line.position_m
                    && line.position_m <= s.hi + SAME_POSITION_M
            });
            let zone_index = shape.zone_index;
            let rank = shape.rank;
            // Highest rank; then the zone under the line itself; then the lowest index.
            let better = match worst {
                None => true,
                Some((best_rank, best_on_line, best_index)) => {
                    (rank, on_line, std::cmp::Reverse(zone_index))
                        > (best_rank, best_on_line, std::cmp::Reverse(best_index))
                }
            };
            if better {
                worst = Some((rank, on_line, zone_index));
            }
        }
        let Some((rank, _, zone_index)) = worst else {
            let point = {
                let mut p = [0.0; 2];
                p[r] = middle;
                p[k] = line.position_m;
                p
            };
            return Err(SpacingError::NoZone {
                line: line.number,
                x_m: point[0],
                y_m: point[1],
            });
        };
        match pieces.last_mut() {
            Some(last) if last.zone_index == zone_index => last.to_m = pair[1],
            _ => pieces.push(PlanZonePiece {
                from_m: pair[0],
                to_m: pair[1],
                zone_index,
                rank,
            }),
        }
    }
    absorb_slivers(pieces);
    if is_plain {
        std::mem::swap(last_plain, plain);
        *last_was_plain = true;
    }
    Ok(())
}

/// Gives each piece shorter than [`MIN_PIECE_M`] to the worse of its neighbours (higher rank; at one
/// rank the lower zone index, as the split itself prefers), and joins neighbours of one zone that
/// meet again. Between a worse and a better zone the change moves toward the better one, by under a
/// millimetre. A sliver worse than both its neighbours (a strip touching a zone for under a
/// millimetre along the line) goes to the worse neighbour too: no stretch is shorter than the layout
/// works to.
fn absorb_slivers(pieces: &mut Vec<PlanZonePiece>) {
    let worse = |a: &PlanZonePiece, b: &PlanZonePiece| {
        (a.rank, std::cmp::Reverse(a.zone_index)) >= (b.rank, std::cmp::Reverse(b.zone_index))
    };
    while pieces.len() > 1 {
        let Some(at) = pieces
            .iter()
            .position(|piece| piece.to_m - piece.from_m < MIN_PIECE_M)
        else {
            break;
        };
        let to_left = match (at.checked_sub(1), pieces.get(at + 1)) {
            (Some(left), Some(right)) => worse(&pieces[left], right),
            (Some(_), None) => true,
            (None, _) => false,
        };
        let sliver = pieces.remove(at);
        // The grown piece's index; the other neighbour now sits next to it.
        let grown = if to_left {
            pieces[at - 1].to_m = sliver.to_m;
            at - 1
        } else {
            pieces[at].from_m = sliver.from_m;
            at
        };
        if grown + 1 < pieces.len() && pieces[grown + 1].zone_index == pieces[grown].zone_index {
            pieces[grown].to_m = pieces[grown + 1].to_m;
            pieces.remove(grown + 1);
        }
        if grown > 0 && pieces[grown - 1].zone_index == pieces[grown].zone_index {
            pieces[grown - 1].to_m = pieces[grown].to_m;
            pieces.remove(grown);
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn rectangle(x0: f64, y0: f64, x1: f64, y1: f64) -> Vec<[f64; 2]> {
        vec![[x0, y0], [x1, y0], [x1, y1], [x0, y1]]
    }

    /// Line `number` along y at `position_m` on `plane`, holding a 610 mm strip.
    fn strip_along_y(plane: &[[f64; 2]], number: u32, position_m: f64) -> LineStrip<'_> {
        LineStrip {
            number,
            plane_polygon_m: plane,
            run: Axis::Y,
            position_m,
            half_width_m: 0.305,
        }
    }

    /// A 10 m x 6 m plane: edge zone 1 m wide along x = 0 (zone 1), interior (zone 0),
    /// corner 1 m x 1 m at the origin (zone 2).
    fn zones() -> Vec<ZoneRegion> {
        vec![
            ZoneRegion {
                zone_index: 0,
                polygons_m: vec![rectangle(1.0, 0.0, 10.0, 6.0)],
            },
            ZoneRegion {
                zone_index: 1,
                polygons_m: vec![rectangle(0.0, 1.0, 1.0, 6.0)],
            },
            ZoneRegion {
                zone_index: 2,
                polygons_m: vec![rectangle(0.0, 0.0, 1.0, 1.0)],
            },
        ]
    }

    /// Line `number` along y at `position_m` on a 10 m x 6 m plane, split over its whole length.
    fn split_on_plane(
        zones: &[ZoneRegion],
        zone_rank: &[u32],
        number: u32,
        position_m: f64,
    ) -> Result<Vec<PlanZonePiece>, SpacingError> {
        let plane = rectangle(0.0, 0.0, 10.0, 6.0);
        let line = strip_along_y(&plane, number, position_m);
        zone_pieces(
            line,
            [0.0, 6.0],
            &ZoneShapes::new(&JoinedZones::new(zones), zone_rank),
        )
    }

    fn pieces_at(position_m: f64) -> Vec<PlanZonePiece> {
        split_on_plane(&zones(), &[1, 2, 3], 1, position_m).expect("zones tile the plane")
    }

    #[test]
    fn the_strip_reaches_into_the_next_zone() {
        // Line at 1.22: its strip 0.915..1.525 reaches into the 1 m edge zone and corner.
        let at = pieces_at(1.22);
        assert_eq!(
            at.iter().map(|p| p.zone_index).collect::<Vec<_>>(),
            vec![2, 1]
        );
        assert!((at[0].to_m - 1.0).abs() < 1e-9);
        // Line at 1.83: strip 1.525..2.135 is all interior.
        let at = pieces_at(1.83);
        assert_eq!(at.len(), 1);
        assert_eq!(at[0].zone_index, 0);
        // Line on the edge: corner then edge.
        let at = pieces_at(0.0);
        assert_eq!(
            at.iter().map(|p| p.zone_index).collect::<Vec<_>>(),
            vec![2, 1]
        );
    }

    #[test]
    fn a_cut_inside_a_zone_does_not_move_the_zone_change() {
        // The interior (zone 0) comes in two pieces cut at y = 2.9995, half a millimetre before the
        // edge zone (zone 1) starts at y = 3: the layout keeps no stretch under 1 mm, so unjoined the
        // cut would take the boundary's place. Joined, the change is at the boundary.
        let zones = vec![
            ZoneRegion {
                zone_index: 0,
                polygons_m: vec![
                    rectangle(0.0, 0.0, 10.0, 2.9995),
                    rectangle(0.0, 2.9995, 10.0, 3.0),
                ],
            },
            ZoneRegion {
                zone_index: 1,
                polygons_m: vec![rectangle(0.0, 3.0, 10.0, 6.0)],
            },
        ];
        let at = split_on_plane(&zones, &[1, 2], 1, 5.0).expect("zones tile the plane");
        assert_eq!(
            at.iter().map(|p| p.zone_index).collect::<Vec<_>>(),
            vec![0, 1]
        );
        assert_eq!(at[0].to_m, 3.0);
    }

    #[test]
    fn a_breakpoint_just_before_a_zone_change_does_not_give_the_milder_zone_more() {
        // The edge zone (rank 2) runs up to y = 3; a second edge piece ends 0.8 mm short of that,
        // inside the line's strip. Unmerged, that end took the change's place: the interior (rank
        // 1) began 0.8 mm early. The change must stay at y = 3 (the edge zone's own end).
        let zones = vec![
            ZoneRegion {
                zone_index: 0,
                polygons_m: vec![rectangle(0.0, 3.0, 10.0, 6.0)],
            },
            ZoneRegion {
                zone_index: 1,
                polygons_m: vec![
                    rectangle(0.0, 0.0, 10.0, 3.0),
                    rectangle(5.2, 0.0, 6.0, 2.9992),
                ],
            },
        ];
        let at = split_on_plane(&zones, &[1, 2], 1, 5.0).expect("zones tile the plane");
        assert_eq!(
            at.iter().map(|p| p.zone_index).collect::<Vec<_>>(),
            vec![1, 0]
        );
        assert_eq!(at[0].to_m, 3.0);
        assert_eq!(at[1].from_m, 3.0);
    }

    #[test]
    fn a_sliver_goes_to_its_worse_neighbour() {
        let piece = |from_m: f64, to_m: f64, zone_index: usize, rank: u32| PlanZonePiece {
            from_m,
            to_m,
            zone_index,
            rank,
        };
        // Interior, a 0.5 mm corner sliver, edge: the sliver goes to the edge (the worse neighbour).
        let mut pieces = vec![
            piece(0.0, 1.0, 0, 1),
            piece(1.0, 1.0005, 2, 3),
            piece(1.0005, 2.0, 1, 2),
        ];
        absorb_slivers(&mut pieces);
        assert_eq!(pieces, vec![piece(0.0, 1.0, 0, 1), piece(1.0, 2.0, 1, 2)]);
        // Edge, a sliver of interior, edge again: one edge piece.
        let mut pieces = vec![
            piece(0.0, 1.0, 1, 2),
            piece(1.0, 1.0005, 0, 1),
            piece(1.0005, 2.0, 1, 2),
        ];
        absorb_slivers(&mut pieces);
        assert_eq!(pieces, vec![piece(0.0, 2.0, 1, 2)]);
        // A sliver at either end goes to its only neighbour; one piece stays as it is however short.
        let mut pieces = vec![piece(0.0, 0.0004, 0, 1), piece(0.0004, 2.0, 1, 2)];
        absorb_slivers(&mut pieces);
        assert_eq!(pieces, vec![piece(0.0, 2.0, 1, 2)]);
        let mut pieces = vec![piece(0.0, 0.0004, 0, 1)];
        absorb_slivers(&mut pieces);
        assert_eq!(pieces.len(), 1);
    }

    #[test]
    fn a_plain_line_reuses_the_last_split_and_gets_what_a_fresh_split_gets() {
        // A 30 m x 6 m plane: 1 m corners, 1 m edge strips along all four sides, interior; lines
        // every 0.61 m, each split on one shared buffer (as the layout does) and on a fresh one.
        let plane = rectangle(0.0, 0.0, 30.0, 6.0);
        let zones = vec![
            ZoneRegion {
                zone_index: 0,
                polygons_m: vec![rectangle(1.0, 1.0, 29.0, 5.0)],
            },
            ZoneRegion {
                zone_index: 1,
                polygons_m: vec![
                    rectangle(1.0, 0.0, 29.0, 1.0),
                    rectangle(1.0, 5.0, 29.0, 6.0),
                    rectangle(0.0, 1.0, 1.0, 5.0),
                    rectangle(29.0, 1.0, 30.0, 5.0),
                ],
            },
            ZoneRegion {
                zone_index: 2,
                polygons_m: vec![
                    rectangle(0.0, 0.0, 1.0, 1.0),
                    rectangle(29.0, 0.0, 30.0, 1.0),
                    rectangle(0.0, 5.0, 1.0, 6.0),
                    rectangle(29.0, 5.0, 30.0, 6.0),
                ],
            },
        ];
        let joined = JoinedZones::new(&zones);
        let shapes = ZoneShapes::new(&joined, &[1, 2, 3]);
        let mut shared = ZoneWork::default();
        let mut reused = 0;
        for step in 0..=49 {
            let line = strip_along_y(&plane, step + 1, f64::from(step) * 0.61);
            let was_plain = shared.last_was_plain;
            zone_pieces_with(line, [0.0, 6.0], &shapes, &mut shared).expect("tiled");
            let fresh = zone_pieces(line, [0.0, 6.0], &shapes).expect("tiled");
            assert_eq!(shared.pieces, fresh, "line at {} m", line.position_m);
            if was_plain && shared.last_was_plain {
                reused += 1;
            }
        }
        // Lines 3 to 46 (1.22 m to 28.06 m) have strips clear of every zone side.
        assert!(reused > 40, "{reused} lines reused the split");
    }

    #[test]
    fn a_line_with_a_zone_side_in_its_strip_is_split_afresh() {
        // Two zones of one rank side by side at x = 15: the same rectangles reach the strips of the
        // lines at 14.8 m and 15.2 m, but each line takes the zone under it.
        let plane = rectangle(0.0, 0.0, 30.0, 6.0);
        let zones = vec![
            ZoneRegion {
                zone_index: 0,
                polygons_m: vec![rectangle(0.0, 0.0, 15.0, 6.0)],
            },
            ZoneRegion {
                zone_index: 1,
                polygons_m: vec![rectangle(15.0, 0.0, 30.0, 6.0)],
            },
        ];
        let joined = JoinedZones::new(&zones);
        let shapes = ZoneShapes::new(&joined, &[1, 1]);
        let mut shared = ZoneWork::default();
        for (position_m, zone_index) in [(14.4, 0), (14.8, 0), (15.2, 1), (15.6, 1)] {
            let line = strip_along_y(&plane, 1, position_m);
            zone_pieces_with(line, [0.0, 6.0], &shapes, &mut shared).expect("tiled");
            assert_eq!(
                shared
                    .pieces
                    .iter()
                    .map(|p| p.zone_index)
                    .collect::<Vec<_>>(),
                vec![zone_index],
                "line at {position_m} m"
            );
        }
    }

    #[test]
    fn a_gap_in_the_zones_is_an_error() {
        let only_edge = vec![ZoneRegion {
            zone_index: 0,
            polygons_m: vec![rectangle(0.0, 0.0, 10.0, 3.0)],
        }];
        let error = split_on_plane(&only_edge, &[1], 7, 5.0).expect_err("gap");
        assert!(error.to_string().contains("rafter line 7"), "{error}");
    }
}
