//! Checks of a laid-out deck that any correct layout passes, whatever the roof's outline: shared by
//! the rectangle properties (`tests/framing_properties.rs`) and the L/T/U/Z polygon properties
//! (`tests/polygon_deck_properties.rs`). No outside source: these are properties of any layout.
//!
//! - [`check_pieces`]: every point of a plane lies in exactly one piece (pieces cut along the hips and
//!   valleys, none outside the plane); every panel end with deck beyond it lies on a framing line of
//!   that plane that runs the whole end; every cut edge lies on a hip or valley rafter; no piece is
//!   narrower than the minimum unless its course says so; the courses tile each plane up the slope.
//! - [`check_piece_equilibrium`]: the reactions of each piece add up to its load.

use crate::outlines::{distance_to_boundary, distance_to_segment, inside, Point};
use deckhold_deck::beam::strip_reactions;
use deckhold_deck::layout::{
    Axis, DeckLayout, DeckPiece, LayoutChange, LayoutLine, LineKind, PanelStrip,
};
use deckhold_wind::WindAnalysis;
use proptest::prop_assert;
use proptest::test_runner::TestCaseError;

/// A point this close to a line is on it, m (the layout works to about 1e-9 m).
const ON_M: f64 = 1e-6;

/// Relative error allowed between a piece's load and the reactions that hold it.
pub const EQUILIBRIUM_RELATIVE: f64 = 1e-9;

/// Deck past a strip's outermost support that the strip may leave out: none. Until 2026-12-03 the
/// layout dropped up to 1 mm there (its `MIN_PIECE_M`), found by these checks on an L hip roof and by
/// `framing_properties` on a monoslope with a 0.9 mm rake overhang; it is now a cantilever however
/// short, so only the layout's own precision ([`ON_M`]) is allowed.
pub const DROPPED_M: f64 = 0.0;

/// Plan bounding box of a polygon.
fn bounds(polygon: &[Point]) -> (Point, Point) {
    let mut lo = [f64::INFINITY; 2];
    let mut hi = [f64::NEG_INFINITY; 2];
    for p in polygon {
        for k in 0..2 {
            lo[k] = lo[k].min(p[k]);
            hi[k] = hi[k].max(p[k]);
        }
    }
    (lo, hi)
}

/// Plan coordinate index across the framing lines of plane `plane_index` (the one the panel ends
/// are set out along), or None for a plane with no line.
fn cross_index(layout: &DeckLayout, plane_index: usize) -> Option<usize> {
    layout
        .lines
        .iter()
        .find(|l| l.plane_index == plane_index && l.kind != LineKind::Blocking)
        .map(|l| match l.axis {
            Axis::X => 1,
            Axis::Y => 0,
        })
}

/// Coverage, panel ends, cuts, narrow pieces and course tiling on every plane (see the module doc).
pub fn check_pieces(
    wind: &WindAnalysis,
    layout: &DeckLayout,
    min_piece_mm: f64,
) -> Result<(), TestCaseError> {
    let cuts: Vec<(Point, Point)> = layout
        .framing
        .iter()
        .filter(|l| matches!(l.kind, LineKind::Hip | LineKind::Valley))
        .map(|l| (l.start_m, l.end_m))
        .collect();
    for (plane_index, plane) in wind.planes.iter().enumerate() {
        let pieces: Vec<_> = layout
            .pieces
            .iter()
            .filter(|p| p.plane_index == plane_index)
            .collect();
        prop_assert!(!pieces.is_empty(), "plane {plane_index} has no deck");
        let (lo, hi) = bounds(&plane.polygon_m);
        // A 13 x 11 grid at odd offsets, so no sample falls on a joint or course line by design;
        // inside the plane a point is in one piece, outside it in none.
        for i in 0..13 {
            for j in 0..11 {
                let p = [
                    lo[0] + (hi[0] - lo[0]) * (f64::from(i) + 0.3719) / 13.0,
                    lo[1] + (hi[1] - lo[1]) * (f64::from(j) + 0.6173) / 11.0,
                ];
                // Within the layout's millimetre of the plane's edge a course may lay no piece (a
                // band meeting the plane by a hair there is none).
                if distance_to_boundary(&plane.polygon_m, p) < 1e-3 {
                    continue;
                }
                let covering = pieces
                    .iter()
                    .filter(|piece| {
                        inside(&piece.outline_m, p)
                            && distance_to_boundary(&piece.outline_m, p) > 1e-7
                    })
                    .count();
                let on_an_edge = pieces
                    .iter()
                    .any(|piece| distance_to_boundary(&piece.outline_m, p) <= 1e-7);
                let wanted = usize::from(inside(&plane.polygon_m, p));
                prop_assert!(
                    covering == wanted || (covering + 1 == wanted && on_an_edge),
                    "plane {plane_index}: point {p:?} is covered by {covering} pieces (wanted {wanted})"
                );
            }
        }
        let Some(k) = cross_index(layout, plane_index) else {
            continue;
        };
        for piece in &pieces {
            check_piece_edges(layout, &cuts, plane, piece, k)?;
            let reported = layout.courses.iter().any(|c| {
                c.plane_index == plane_index
                    && c.index == piece.course
                    && c.changes
                        .iter()
                        .any(|change| matches!(change, LayoutChange::NarrowPiece { .. }))
            });
            prop_assert!(
                piece.length_m * 1000.0 >= min_piece_mm - 1e-6 || reported,
                "piece of {:.0} mm under the minimum {min_piece_mm} mm (course {}) and not reported",
                piece.length_m * 1000.0,
                piece.course
            );
        }
    }
    // Courses tile each plane up the slope.
    for plane_index in 0..wind.planes.len() {
        let courses: Vec<_> = layout
            .courses
            .iter()
            .filter(|c| c.plane_index == plane_index)
            .collect();
        prop_assert!(!courses.is_empty(), "plane {plane_index} has no course");
        prop_assert!(courses[0].from_m == 0.0);
        for pair in courses.windows(2) {
            prop_assert!(pair[0].to_m == pair[1].from_m);
        }
    }
    Ok(())
}

/// The two ends of a piece (panel edges across the framing) and its oblique edges (cuts).
fn check_piece_edges(
    layout: &DeckLayout,
    cuts: &[(Point, Point)],
    plane: &deckhold_wind::RoofPlane,
    piece: &DeckPiece,
    k: usize,
) -> Result<(), TestCaseError> {
    let r = 1 - k;
    let ends = [
        (piece.start_m, -1.0, piece.start_line),
        (piece.end_m, 1.0, piece.end_line),
    ];
    for (end_m, outward, line) in ends {
        let on_end: Vec<Point> = piece
            .outline_m
            .iter()
            .copied()
            .filter(|q| (q[k] - end_m).abs() < 1e-9)
            .collect();
        if on_end.len() < 2 {
            continue; // cut along a hip or valley before the end: no panel edge there
        }
        let low = on_end
            .iter()
            .copied()
            .fold(on_end[0], |a, b| if b[r] < a[r] { b } else { a });
        let high = on_end
            .iter()
            .copied()
            .fold(on_end[0], |a, b| if b[r] > a[r] { b } else { a });
        let mut beyond = [0.5 * (low[0] + high[0]), 0.5 * (low[1] + high[1])];
        beyond[k] += outward * 1e-5;
        if !inside(&plane.polygon_m, beyond) {
            continue; // the deck's own edge (eave, rake, overhang)
        }
        // A joint between panels: on a framing line of this plane that runs the whole end.
        let Some(number) = line else {
            return Err(TestCaseError::fail(format!(
                "a panel end at {end_m} with deck beyond it is off the framing (plane {})",
                piece.plane_index
            )));
        };
        let carrier = layout.lines.iter().find(|l| l.number == number);
        prop_assert!(
            carrier.is_some_and(|l| l.plane_index == piece.plane_index
                && l.kind != LineKind::Blocking
                && (l.position_m - end_m).abs() < 1e-9
                && [low, high].iter().all(|q| distance_to_segment(
                    *q,
                    l.plan_start_m,
                    l.plan_end_m
                ) < ON_M)),
            "the panel end {low:?}..{high:?} is not on line {number} of plane {}",
            piece.plane_index
        );
    }
    // Every oblique edge of the outline lies on a hip or valley rafter.
    let n = piece.outline_m.len();
    for i in 0..n {
        let (a, b) = (piece.outline_m[i], piece.outline_m[(i + 1) % n]);
        if (a[0] - b[0]).abs() < 1e-9 || (a[1] - b[1]).abs() < 1e-9 {
            continue;
        }
        prop_assert!(
            cuts.iter().any(|(p, q)| {
                distance_to_segment(a, *p, *q) < ON_M && distance_to_segment(b, *p, *q) < ON_M
            }),
            "a cut {a:?}..{b:?} of plane {} on no hip or valley rafter",
            piece.plane_index
        );
    }
    Ok(())
}

/// Run coordinate of a line's strip in a bearing: the plan point where the strip was taken.
fn strip_point(line: &LayoutLine, strip_at_m: f64) -> Point {
    let length_m = line.intervals_m.last().map_or(0.0, |i| i[1]);
    let t = if length_m > 0.0 {
        strip_at_m / length_m
    } else {
        0.0
    };
    [
        line.plan_start_m[0] + t * (line.plan_end_m[0] - line.plan_start_m[0]),
        line.plan_start_m[1] + t * (line.plan_end_m[1] - line.plan_start_m[1]),
    ]
}

/// The stretch across the framing (coordinate `k`) of `polygon` at run coordinate `at` that holds
/// `position`, if any.
fn stretch_at(polygon: &[Point], k: usize, at: f64, position: f64) -> Option<(f64, f64)> {
    let r = 1 - k;
    let mut hits: Vec<f64> = Vec::new();
    for (i, a) in polygon.iter().enumerate() {
        let b = polygon[(i + 1) % polygon.len()];
        if (a[r] > at) != (b[r] > at) {
            hits.push(a[k] + (at - a[r]) / (b[r] - a[r]) * (b[k] - a[k]));
        }
    }
    hits.sort_by(f64::total_cmp);
    hits.chunks_exact(2)
        .map(|pair| (pair[0], pair[1]))
        .find(|(lo, hi)| *lo - ON_M <= position && position <= *hi + ON_M)
}

/// Plan extent across the framing of a strip bearing on a line at `position_m`, m.
fn strip_extent(strip: &PanelStrip, position_m: f64, cross_factor: f64) -> (f64, f64) {
    let before: f64 = strip.spans_m[..strip.support_index].iter().sum();
    let after: f64 = strip.spans_m[strip.support_index..].iter().sum();
    (
        position_m - (before + strip.overhang_start_m) / cross_factor,
        position_m + (after + strip.overhang_end_m) / cross_factor,
    )
}

/// The reactions of each piece add up to its load (unit pressure, so the load of a strip is its
/// width across the framing on the slope):
/// - every strip a line reports under a piece is the piece's deck at that height: its spans and
///   cantilevers run from one side of the piece's outline there to the other, its supports are the
///   lines of the plane there or the cut ends (hip and valley rafters), its reactions (the one on
///   this line as reported, the others solved again) add up to the deck's width there, and every
///   line strictly inside the piece reports one;
/// - on a piece that is a whole rectangle (no cut), every line sees the same strip, so the
///   reactions reported on the lines under it add up to the piece's length, as on a rectangle roof.
///
/// Returns the number of strips checked.
pub fn check_piece_equilibrium(layout: &DeckLayout) -> Result<usize, TestCaseError> {
    let mut checked = 0;
    for piece in &layout.pieces {
        let Some(k) = cross_index(layout, piece.plane_index) else {
            continue;
        };
        let r = 1 - k;
        let across_m = piece.end_m - piece.start_m;
        prop_assert!(across_m > 0.0, "a piece of no length: {piece:?}");
        let cross_factor = piece.length_m / across_m;
        let whole = is_whole(piece, k);
        let mut whole_sum_mm = 0.0;
        let lines = layout.lines.iter().filter(|l| {
            l.plane_index == piece.plane_index
                && l.kind != LineKind::Blocking
                && l.position_m >= piece.start_m - ON_M
                && l.position_m <= piece.end_m + ON_M
        });
        for line in lines {
            let strictly_inside =
                line.position_m > piece.start_m + ON_M && line.position_m < piece.end_m - ON_M;
            for bearing in line
                .bearings
                .iter()
                .filter(|b| b.course_index == piece.course)
            {
                let at = strip_point(line, bearing.strip_at_m);
                let mine: Vec<&PanelStrip> = bearing
                    .strips
                    .iter()
                    .filter(|s| {
                        let (lo, hi) = strip_extent(s, line.position_m, cross_factor);
                        lo >= piece.start_m - ON_M && hi <= piece.end_m + ON_M
                    })
                    .collect();
                prop_assert!(
                    mine.len() <= 1 && (!strictly_inside || mine.len() == 1),
                    "line {} carries {} strips of the piece {}..{} in course {}",
                    line.number,
                    mine.len(),
                    piece.start_m,
                    piece.end_m,
                    piece.course
                );
                for strip in mine {
                    let (deck_lo, deck_hi) =
                        stretch_at(&piece.outline_m, k, at[r], line.position_m).ok_or_else(
                            || {
                                TestCaseError::fail(format!(
                                    "line {} bears on the piece {:?} at {at:?}, off its outline",
                                    line.number, piece.outline_m
                                ))
                            },
                        )?;
                    check_strip(layout, piece, line, strip, (deck_lo, deck_hi), cross_factor)?;
                    whole_sum_mm += strip.reaction_width_mm;
                    checked += 1;
                }
            }
        }
        if whole {
            let load_mm = piece.length_m * 1000.0;
            prop_assert!(
                ((whole_sum_mm - load_mm) / load_mm).abs() < EQUILIBRIUM_RELATIVE,
                "whole piece {}..{} (plane {}, course {}): reactions {whole_sum_mm} mm, load {load_mm} mm",
                piece.start_m,
                piece.end_m,
                piece.plane_index,
                piece.course
            );
        }
    }
    Ok(checked)
}

/// One strip of a piece: it spans the piece's deck `deck` at its height, bears on lines or cut ends,
/// and its reactions add up to the deck's width there.
fn check_strip(
    layout: &DeckLayout,
    piece: &DeckPiece,
    line: &LayoutLine,
    strip: &PanelStrip,
    (deck_lo, deck_hi): (f64, f64),
    cross_factor: f64,
) -> Result<(), TestCaseError> {
    // The strip is the piece's deck there, to the layout's own precision (1e-6 m): it may stop
    // [`DROPPED_M`] short of the deck past its outermost support (none), never run past it.
    let (lo, hi) = strip_extent(strip, line.position_m, cross_factor);
    let short = |gap_m: f64| gap_m > -ON_M && gap_m < DROPPED_M + ON_M;
    prop_assert!(
        short(lo - deck_lo) && short(deck_hi - hi),
        "line {} (plane {}, course {}): its strip runs {lo}..{hi}, the piece's deck {deck_lo}..{deck_hi} \
         (piece {:?}, strip {strip:?})",
        line.number,
        piece.plane_index,
        piece.course,
        piece.outline_m
    );
    // The layout solves each strip on its geometry rounded to 0.1 nm (strips equal but for noise share
    // one solution); so is it solved here, and its load is that strip's.
    let round = |length_m: f64| (length_m * 1e10).round() * 1e-10;
    let spans_m: Vec<f64> = strip.spans_m.iter().map(|s| round(*s)).collect();
    let (start_m, end_m) = (round(strip.overhang_start_m), round(strip.overhang_end_m));
    let load_m = spans_m.iter().sum::<f64>() + start_m + end_m;
    let reactions = strip_reactions(&spans_m, start_m, end_m, 1.0)
        .map_err(|error| TestCaseError::fail(format!("line {}: {error}", line.number)))?;
    let reported_m = strip.reaction_width_mm / 1000.0;
    let solved_m = reactions[strip.support_index];
    prop_assert!(
        (reported_m - solved_m).abs() < EQUILIBRIUM_RELATIVE * load_m,
        "line {}: reaction {reported_m} m reported, {solved_m} m solved",
        line.number
    );
    let total_m = reported_m + reactions.iter().sum::<f64>() - solved_m;
    prop_assert!(
        ((total_m - load_m) / load_m).abs() < EQUILIBRIUM_RELATIVE,
        "line {} (plane {}, course {}): reactions {total_m} m hold a strip of {load_m} m",
        line.number,
        piece.plane_index,
        piece.course
    );
    // Supports: lines of the plane, or the deck's cut ends.
    let mut support_m =
        line.position_m - strip.spans_m[..strip.support_index].iter().sum::<f64>() / cross_factor;
    let supports = std::iter::once(support_m).chain(strip.spans_m.iter().map(|span| {
        support_m += span / cross_factor;
        support_m
    }));
    for at in supports.collect::<Vec<_>>() {
        let on_line = layout.lines.iter().any(|l| {
            l.plane_index == piece.plane_index
                && l.kind != LineKind::Blocking
                && (l.position_m - at).abs() < ON_M
        });
        let at_cut = (at - deck_lo).abs() < ON_M || (at - deck_hi).abs() < ON_M;
        prop_assert!(
            on_line || at_cut,
            "line {}: a support of its strip at {at} is no line and no cut end",
            line.number
        );
    }
    Ok(())
}

/// True when the piece is a whole rectangle across its two ends (no cut, no notch).
fn is_whole(piece: &DeckPiece, k: usize) -> bool {
    let outline = &piece.outline_m;
    let n = outline.len();
    n == 4
        && (0..n).all(|i| {
            let (a, b) = (outline[i], outline[(i + 1) % n]);
            (a[0] - b[0]).abs() < 1e-9 || (a[1] - b[1]).abs() < 1e-9
        })
        && outline.iter().any(|q| (q[k] - piece.start_m).abs() < 1e-9)
        && outline.iter().any(|q| (q[k] - piece.end_m).abs() < 1e-9)
}
