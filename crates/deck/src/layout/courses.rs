//! Panel courses: where the panel ends fall, and which panel strips bear on a line in each course.
//!
//! Panels lie with their long side across the framing, in courses stacked up the slope from the low
//! edge. In each course the panels start at the plane's edge (a staggered course starts with a part
//! panel ending on the framing line nearest the stagger) and every panel ends on the farthest framing
//! line it reaches; the last one is cut at the far edge. A panel is a strip continuous over the lines
//! it crosses, so the reaction on a line comes from solving that strip as a continuous beam.

use std::collections::hash_map::Entry;
use std::collections::HashMap;
use std::sync::Arc;

use smallvec::SmallVec;

use crate::fast_hash::BuildFastHasher;

use super::changes::LayoutChange;
use super::geometry::{round_i64, section_into, SectionScratch, MIN_PIECE_M, SAME_POSITION_M};
use super::lines::{GridLine, PlaneFrame};
use super::{PanelInput, PanelStrip, Stagger, StartCorner, SupportRole};
use crate::beam::strip_reactions;
use crate::error::SpacingError;

/// Reactions of strips already solved, keyed by their geometry rounded to 0.1 nm: strips equal but
/// for floating-point noise share one solution, and the rounding (at most 0.05 nm a length) keeps
/// each strip's reactions equal to its load to better than 1e-9.
#[derive(Debug, Default)]
pub(crate) struct StripCache {
    /// Each solved strip's place in `solved`, by its rounded geometry.
    solved_at: HashMap<Vec<i64>, usize, BuildFastHasher>,
    solved: Vec<Vec<f64>>,
    /// The key being looked up, kept to save an allocation per strip.
    key: Vec<i64>,
}

fn to_key(length_m: f64) -> i64 {
    // Lengths are at most a few tens of metres here; 0.1 nm steps fit easily in an i64.
    round_i64(length_m * 1e10)
}

fn from_key(key: i64) -> f64 {
    key as f64 * 1e-10
}

impl StripCache {
    /// Unit-load reactions (tributary widths, m) of the strip; the geometry is rounded to 0.1 nm so
    /// that strips equal in practice share one solution. One hash lookup for a strip solved before
    /// (a lookup, then a second to hand back the reactions, cost half as much again).
    fn reactions(
        &mut self,
        spans_m: &[f64],
        overhang_start_m: f64,
        overhang_end_m: f64,
    ) -> Result<&[f64], SpacingError> {
        let key = &mut self.key;
        key.clear();
        key.extend(spans_m.iter().map(|s| to_key(*s)));
        key.push(to_key(overhang_start_m));
        key.push(to_key(overhang_end_m));
        if let Some(&at) = self.solved_at.get(key.as_slice()) {
            return Ok(&self.solved[at]);
        }
        let spans: Vec<f64> = key[..spans_m.len()].iter().map(|k| from_key(*k)).collect();
        let start = from_key(key[spans_m.len()]);
        let end = from_key(key[spans_m.len() + 1]);
        let reactions = strip_reactions(&spans, start, end, 1.0)?;
        self.solved_at.insert(key.clone(), self.solved.len());
        self.solved.push(reactions);
        Ok(&self.solved[self.solved.len() - 1])
    }
}

/// What [`bearing_at`] keeps from one call to the next: the strips solved so far, the buffers of
/// the plane's section (a roof takes hundreds of bearings; fresh buffers for each were a fifth of
/// their cost), and what the current plane's panels bear on ([`PanelStrips`]).
#[derive(Debug, Default)]
pub(crate) struct BearingWork {
    strips: StripCache,
    section: SectionScratch,
    /// Positions of the lines under one panel.
    supports: Vec<f64>,
    panels: PanelStrips,
}

/// The plane whose panel strips [`PanelStrips`] holds: its polygon's and grid's addresses and
/// lengths, and its scale across the lines. One layout lays every plane with one [`BearingWork`] and
/// keeps every plane's polygon and grid, unchanged, until it is done, so within it an address is
/// one plane's.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
struct PlaneTag {
    polygon: (usize, usize),
    grid: (usize, usize),
    cross_factor_bits: u64,
}

impl PlaneTag {
    fn of(polygon_m: &[[f64; 2]], grid: &[GridLine], frame: &PlaneFrame) -> Self {
        Self {
            polygon: (polygon_m.as_ptr() as usize, polygon_m.len()),
            grid: (grid.as_ptr() as usize, grid.len()),
            cross_factor_bits: frame.cross_factor.to_bits(),
        }
    }
}

/// One panel side across the lines at one section: the side's ends and the section's coordinate
/// (their bits), and whether each end is cut on a hip or valley (1: the start, 2: the end).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
struct SideKey {
    from_bits: u64,
    to_bits: u64,
    along_bits: u64,
    cut_ends: u8,
}

/// A panel strip as every line under it sees it: all but which support the line is and its reaction.
#[derive(Debug, Clone)]
struct SideStrip {
    /// Cross positions of the strip's supports, plan m (a cut end's support included).
    supports_m: Vec<f64>,
    spans_m: Arc<[f64]>,
    overhang_start_m: f64,
    overhang_end_m: f64,
    /// Slivers at a cut end, on the slope, m.
    slivers_m: Vec<f64>,
    /// Unit-load reactions at the supports, m.
    reactions_m: Vec<f64>,
}

/// The strips of the current plane's panels, by panel side and section. Every line under one panel
/// in one course asks for the same strip (on a rectangle plane every line of a course is sectioned at
/// one coordinate): finding its supports, spans and reactions again for each line was most of a
/// bearing's cost. Exact: a strip is kept only where it is the same for every line under it (every
/// line it reaches carries deck at the section, so which line asks picks no support), and the key
/// holds, bit for bit, all else it is made from within one plane; a new plane starts afresh.
#[derive(Debug, Default)]
struct PanelStrips {
    plane: Option<PlaneTag>,
    by_side: HashMap<SideKey, SideStrip, BuildFastHasher>,
}

impl PanelStrips {
    /// Starts afresh when `tag` is another plane than the one held.
    fn for_plane(&mut self, tag: PlaneTag) {
        if self.plane != Some(tag) {
            self.plane = Some(tag);
            self.by_side.clear();
        }
    }
}

/// The panel ends of one course and what was changed to avoid narrow pieces.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct LaidCourse {
    /// Plan positions across the lines, both deck edges included, increasing.
    pub joints_m: Vec<f64>,
    pub changes: Vec<LayoutChange>,
    /// The first end joint in laying order, in laying coordinates (see [`CourseLayer::joints`]).
    pub first_joint_m: Option<f64>,
}

/// The course bands of a plane up the slope from the eave, m: the first course `first_width_m` wide
/// (a ripped first course), the others `width_m`; a remainder under 1 mm is measuring noise, not a
/// course, and the last course takes it (panels are laid with gaps of a few millimetres anyway).
pub(crate) fn course_bands(slope_length_m: f64, width_m: f64, first_width_m: f64) -> Vec<[f64; 2]> {
    let mut bands = Vec::new();
    let mut from = 0.0;
    let mut to = first_width_m.min(width_m);
    loop {
        if to >= slope_length_m - MIN_PIECE_M {
            bands.push([from, slope_length_m]);
            return bands;
        }
        bands.push([from, to]);
        from = to;
        to = from + width_m;
    }
}

/// What the courses of one plane are laid on.
pub(crate) struct CourseLayer<'a> {
    pub plane_index: usize,
    pub frame: &'a PlaneFrame,
    pub grid: &'a [GridLine],
    pub panel: &'a PanelInput,
    pub framing_spacing_mm: f64,
}

impl CourseLayer<'_> {
    fn to_plan(&self, length_mm: f64) -> f64 {
        length_mm / 1000.0 / self.frame.cross_factor
    }

    /// Laying coordinates: plan positions across the lines measured from the start corner, so the
    /// same rules lay from either end (negated when laying starts at the larger coordinate).
    fn laying(&self, plan_m: f64) -> f64 {
        match self.panel.start {
            StartCorner::SmallerCoordinate => plan_m,
            StartCorner::LargerCoordinate => -plan_m,
        }
    }

    /// The panel ends of course `course_index`. Every course starts at the deck edge at the start
    /// corner; each panel ends on the farthest line it reaches (the first panel of an unstaggered
    /// course reaches only the first panel length). A staggered course has its first end joint the
    /// stagger away from the first end joint of course 0 (`first_joint_m`, laying coordinates), on
    /// the nearest line, so the joints of alternate courses are the stagger apart whatever the rake
    /// overhang. No piece is narrower than the minimum where a line allows it: the joint before a
    /// narrow last piece moves back a line, a narrow first piece moves its joint on a line; where no
    /// line allows it, the narrow piece is laid and the adjustment says so.
    pub(crate) fn joints(
        &self,
        course_index: usize,
        first_joint_m: Option<f64>,
    ) -> Result<LaidCourse, SpacingError> {
        let [a, b] = self.frame.cross_range_m.map(|p| self.laying(p));
        let (min, max) = (a.min(b), a.max(b));
        let panel_m = self.to_plan(self.panel.length_mm);
        let first_panel_m =
            self.to_plan(self.panel.first_panel_length_mm.min(self.panel.length_mm));
        let min_piece_m = self.to_plan(self.panel.min_piece_mm);
        let stagger_mm = match (course_index % 2, &self.panel.stagger) {
            (0, _) | (_, Stagger::None) => 0.0,
            (_, Stagger::Half) => self.panel.length_mm / 2.0,
            (_, Stagger::OffsetMm(offset_mm)) => *offset_mm,
        };
        let mut positions: Vec<f64> = self
            .grid
            .iter()
            .map(|g| self.laying(g.position_m))
            .collect();
        positions.sort_by(f64::total_cmp);
        let shown = |p: f64| self.laying(p);
        let mut changes = Vec::new();
        let mut joints = vec![min];
        let mut previous = min;
        let mut reach_m = first_panel_m;
        if let (true, Some(first)) = (stagger_mm > 0.0, first_joint_m) {
            reach_m = panel_m;
            let stagger_m = self.to_plan(stagger_mm);
            let target = if first - stagger_m >= min + min_piece_m - SAME_POSITION_M {
                first - stagger_m
            } else {
                first + stagger_m
            };
            let reachable = |p: &f64| {
                *p > min + SAME_POSITION_M
                    && *p <= min + panel_m + SAME_POSITION_M
                    && *p < max - SAME_POSITION_M
            };
            let nearest = positions
                .iter()
                .copied()
                .filter(reachable)
                .min_by(|a, b| (a - target).abs().total_cmp(&(b - target).abs()));
            let wide_enough = positions
                .iter()
                .copied()
                .filter(|p| reachable(p) && *p - min >= min_piece_m - SAME_POSITION_M)
                .min_by(|a, b| (a - target).abs().total_cmp(&(b - target).abs()));
            if let Some(position) = wide_enough {
                if nearest.is_some_and(|n| (n - position).abs() > SAME_POSITION_M) {
                    changes.push(LayoutChange::FirstJointMoved {
                        to_m: shown(position),
                    });
                }
                joints.push(position);
                previous = position;
            }
        }
        while previous < max - SAME_POSITION_M {
            if previous + reach_m >= max - SAME_POSITION_M {
                joints.push(max);
                break;
            }
            let reach = previous + reach_m + SAME_POSITION_M;
            // The farthest line the panel reaches (positions increase: bisect, not scan).
            let within = positions.partition_point(|p| *p <= reach);
            let next = within
                .checked_sub(1)
                .map(|last| positions[last])
                .filter(|p| *p > previous + SAME_POSITION_M)
                .ok_or(SpacingError::PanelTooShort {
                    plane_index: self.plane_index,
                    length_mm: self.panel.length_mm,
                    spacing_mm: self.framing_spacing_mm,
                    from_m: shown(previous),
                })?;
            joints.push(next);
            previous = next;
            reach_m = panel_m;
        }
        self.widen_last_piece(&positions, &mut joints, &mut changes);
        for pair in joints.windows(2) {
            let piece_mm = (pair[1] - pair[0]) * self.frame.cross_factor * 1000.0;
            if piece_mm < self.panel.min_piece_mm - 1e-3 {
                changes.push(LayoutChange::NarrowPiece {
                    from_m: shown(pair[0]).min(shown(pair[1])),
                    to_m: shown(pair[0]).max(shown(pair[1])),
                    length_m: piece_mm / 1000.0,
                });
            }
        }
        let first_joint_m = joints.get(1).copied();
        let mut joints_m: Vec<f64> = joints.into_iter().map(shown).collect();
        joints_m.sort_by(f64::total_cmp);
        Ok(LaidCourse {
            joints_m,
            changes,
            first_joint_m,
        })
    }

    /// Moves the joint before a narrow last piece back to an earlier line, if one leaves both the
    /// last piece and the one before it at least the minimum (laying coordinates).
    fn widen_last_piece(
        &self,
        positions: &[f64],
        joints: &mut [f64],
        changes: &mut Vec<LayoutChange>,
    ) {
        let count = joints.len();
        if count < 3 {
            return;
        }
        let min_piece_m = self.to_plan(self.panel.min_piece_mm);
        let max = joints[count - 1];
        let before = joints[count - 3];
        if max - joints[count - 2] >= min_piece_m - SAME_POSITION_M {
            return;
        }
        let moved = positions.iter().rev().copied().find(|p| {
            max - p >= min_piece_m - SAME_POSITION_M && p - before >= min_piece_m - SAME_POSITION_M
        });
        if let Some(position) = moved {
            changes.push(LayoutChange::LastJointMoved {
                to_m: self.laying(position),
            });
            joints[count - 2] = position;
        }
    }
}

/// The lines of `grid` (in increasing position, as [`super::lines::grid_lines`] sets them out) with
/// `lo <= position <= hi`, found by bisection: a big roof has hundreds of lines and thousands of panel
/// pieces and bearings, and scanning every line for each made the layout grow with the square of the
/// roof's length.
pub(crate) fn grid_between(grid: &[GridLine], lo: f64, hi: f64) -> &[GridLine] {
    let start = grid.partition_point(|g| g.position_m < lo);
    let end = grid.partition_point(|g| g.position_m <= hi);
    &grid[start..end.max(start)]
}

/// A strip of deck narrower than this between a hip or valley cut and the nearest line is a sliver:
/// the line carries it as a short cantilever rather than as a span onto the hip or valley rafter.
/// Taken as a span, a 25 mm bay next to a 610 mm one pries the line to three times its share
/// (continuous-beam solution), which the two-way panel near the cut does not do. Common practice,
/// no source.
pub const SLIVER_M: f64 = 0.1;

/// What bears on a line in one course: its role, the panel strips, and the slivers at a hip or valley
/// cut that the line carries as short cantilevers (their widths on the slope, m).
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct LineBearing {
    pub role: SupportRole,
    pub strips: SmallVec<[PanelStrip; 2]>,
    pub slivers_m: Vec<f64>,
}

/// One side of a line inside one panel: the panel's extent across the lines at this course.
struct PanelSide {
    from_m: f64,
    to_m: f64,
}

/// The role of grid line `line` in a course and the panel strips that bear on it there, found on
/// the section across the plane at plan coordinate `along_m` (the middle of the line's piece in the
/// course).
///
/// Where the deck ends on an oblique edge (a hip or valley) the cut panel edge bears on the hip or
/// valley member, taken as a simple support on that edge; where it ends on an edge parallel to the
/// lines with no line on it (framing set in from the edge), the deck is a cantilever.
pub(crate) fn bearing_at(
    polygon_m: &[[f64; 2]],
    frame: &PlaneFrame,
    grid: &[GridLine],
    joints_m: &[f64],
    line: usize,
    along_m: f64,
    work: &mut BearingWork,
) -> Result<LineBearing, SpacingError> {
    let position = grid[line].position_m;
    let near = |a: f64, b: f64| (a - b).abs() <= SAME_POSITION_M;
    work.panels.for_plane(PlaneTag::of(polygon_m, grid, frame));
    section_into(polygon_m, frame.run.other(), along_m, &mut work.section);
    let deck = work
        .section
        .stretches
        .iter()
        .find(|s| s.lo - SAME_POSITION_M <= position && position <= s.hi + SAME_POSITION_M)
        .copied()
        .ok_or_else(|| SpacingError::Invalid {
            field: "planes.polygon_m".to_string(),
            reason: format!(
                "the section at {along_m:.4} m does not reach the framing line at {position:.4} m"
            ),
        })?;

    // The joints increase across the course: bisect for the first one near the line.
    let first_near = joints_m.partition_point(|j| *j < position - SAME_POSITION_M);
    let joint =
        (first_near < joints_m.len() && near(joints_m[first_near], position)).then_some(first_near);
    // At most two panels: the one ending on the line and the one starting there, or the one across it.
    let panels: [Option<(f64, f64)>; 2] = match joint {
        Some(j) => [
            (j > 0).then(|| (joints_m[j - 1], position)),
            (j + 1 < joints_m.len()).then(|| (position, joints_m[j + 1])),
        ],
        None => {
            // The one panel whose ends are either side of the line: the first joint past it and the
            // one before.
            let next = joints_m.partition_point(|j| *j <= position);
            let across = next > 0 && next < joints_m.len() && joints_m[next - 1] < position;
            [across.then(|| (joints_m[next - 1], joints_m[next])), None]
        }
    };
    let sides: [Option<PanelSide>; 2] = panels.map(|panel| {
        panel
            .map(|(from, to)| PanelSide {
                from_m: from.max(deck.lo),
                to_m: to.min(deck.hi),
            })
            .filter(|side| {
                side.to_m - side.from_m >= MIN_PIECE_M
                    && side.from_m <= position + SAME_POSITION_M
                    && side.to_m >= position - SAME_POSITION_M
                    && !(near(side.from_m, position) && near(side.to_m, position))
            })
    });
    let side_count = sides.iter().flatten().count();
    if side_count == 0 {
        return Err(SpacingError::Invalid {
            field: "planes.polygon_m".to_string(),
            reason: format!(
                "no panel bears on the framing line at {position:.4} m at {along_m:.4} m"
            ),
        });
    }
    let at_deck_edge = near(position, deck.lo) || near(position, deck.hi);
    let role = if joint.is_some() || at_deck_edge {
        SupportRole::PanelEdge
    } else {
        SupportRole::Intermediate
    };

    let mut strips = SmallVec::new();
    let mut slivers_m = Vec::new();
    let BearingWork {
        strips: solved,
        supports,
        panels,
        ..
    } = work;
    for side in sides.into_iter().flatten() {
        let cut_start = deck.lo_oblique && near(side.from_m, deck.lo);
        let cut_end = deck.hi_oblique && near(side.to_m, deck.hi);
        let key = SideKey {
            from_bits: side.from_m.to_bits(),
            to_bits: side.to_m.to_bits(),
            along_bits: along_m.to_bits(),
            cut_ends: u8::from(cut_start) | (u8::from(cut_end) << 1),
        };
        let for_this_line_only;
        let strip: &SideStrip = match panels.by_side.entry(key) {
            Entry::Occupied(kept) => kept.into_mut(),
            Entry::Vacant(place) => {
                let on = PanelSideOn {
                    frame,
                    grid,
                    position,
                    along_m,
                    cut_start,
                    cut_end,
                };
                let (strip, same_for_every_line) = on.strip(&side, supports, solved)?;
                if same_for_every_line {
                    place.insert(strip)
                } else {
                    for_this_line_only = strip;
                    &for_this_line_only
                }
            }
        };
        slivers_m.extend_from_slice(&strip.slivers_m);
        let no_support = || {
            SpacingError::Invalid {
            field: "planes.polygon_m".to_string(),
            reason: format!(
                "the panel over the framing line at {position:.4} m at {along_m:.4} m does not bear on it"
            ),
        }
        };
        let support_index = strip
            .supports_m
            .iter()
            .position(|s| near(*s, position))
            .ok_or_else(no_support)?;
        let reaction_width_mm = strip
            .reactions_m
            .get(support_index)
            .copied()
            .ok_or_else(no_support)?
            * 1000.0;
        strips.push(PanelStrip {
            spans_m: Arc::clone(&strip.spans_m),
            overhang_start_m: strip.overhang_start_m,
            overhang_end_m: strip.overhang_end_m,
            support_index,
            reaction_width_mm,
        });
    }
    Ok(LineBearing {
        role,
        strips,
        slivers_m,
    })
}

/// What one panel side's strip is found on: the plane, the line asking for it (`position`), the
/// section and whether the side's ends are cut on a hip or valley.
struct PanelSideOn<'a> {
    frame: &'a PlaneFrame,
    grid: &'a [GridLine],
    position: f64,
    along_m: f64,
    cut_start: bool,
    cut_end: bool,
}

impl PanelSideOn<'_> {
    /// The strip of `side`, and whether it is the same whichever line under it asks: every line it
    /// reaches carries deck at the section (a line that does not is a support only for itself).
    fn strip(
        &self,
        side: &PanelSide,
        supports: &mut Vec<f64>,
        solved: &mut StripCache,
    ) -> Result<(SideStrip, bool), SpacingError> {
        let near = |a: f64, b: f64| (a - b).abs() <= SAME_POSITION_M;
        let cross_factor = self.frame.cross_factor;
        let reached = grid_between(
            self.grid,
            side.from_m - SAME_POSITION_M,
            side.to_m + SAME_POSITION_M,
        );
        supports.clear();
        let mut all_carry = !reached.is_empty();
        for line in reached {
            let carries = line.is_present_at(self.along_m);
            all_carry &= carries;
            if carries || near(line.position_m, self.position) {
                supports.push(line.position_m);
            }
        }
        let mut slivers_m = Vec::new();
        let mut overhang_start_m = 0.0;
        let mut overhang_end_m = 0.0;
        let first = supports.first().copied().unwrap_or(self.position);
        // Any deck beyond the outermost support is carried as a cantilever, however short: the
        // piece's load and its reactions must balance (a sub-millimetre rake overhang once went
        // missing here). Only slivers of a millimetre or more are worth a word in the output.
        if first - side.from_m > SAME_POSITION_M {
            if self.cut_start && (first - side.from_m) * cross_factor >= SLIVER_M {
                supports.insert(0, side.from_m);
            } else {
                overhang_start_m = first - side.from_m;
                if self.cut_start && overhang_start_m > MIN_PIECE_M {
                    slivers_m.push(overhang_start_m * cross_factor);
                }
            }
        }
        let last = supports.last().copied().unwrap_or(self.position);
        if side.to_m - last > SAME_POSITION_M {
            if self.cut_end && (side.to_m - last) * cross_factor >= SLIVER_M {
                supports.push(side.to_m);
            } else {
                overhang_end_m = side.to_m - last;
                if self.cut_end && overhang_end_m > MIN_PIECE_M {
                    slivers_m.push(overhang_end_m * cross_factor);
                }
            }
        }
        let spans_m: Vec<f64> = supports
            .windows(2)
            .map(|w| (w[1] - w[0]) * cross_factor)
            .collect();
        overhang_start_m *= cross_factor;
        overhang_end_m *= cross_factor;
        let reactions_m = solved
            .reactions(&spans_m, overhang_start_m, overhang_end_m)?
            .to_vec();
        let strip = SideStrip {
            supports_m: supports.clone(),
            spans_m: spans_m.into(),
            overhang_start_m,
            overhang_end_m,
            slivers_m,
            reactions_m,
        };
        Ok((strip, all_carry))
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::layout::lines::{grid_lines, plane_frame};
    use crate::layout::{EdgeBlocking, FramingInput, PlaneGeometry};

    #[test]
    fn a_strip_kept_for_its_panel_is_the_strip_each_line_would_find() {
        // A hip side (its end lines cut by the hips), a hip end (every jack cut) and a gable
        // plane, staggered panels; every line's bearing in every course, found with one work kept
        // over all three planes as the layout keeps it, and with a fresh one for each: the same,
        // bit for bit.
        let walls: Vec<[[f64; 2]; 2]> = {
            let corners = [[0.0, 0.0], [12.0, 0.0], [12.0, 6.0], [0.0, 6.0]];
            (0..4).map(|i| [corners[i], corners[(i + 1) % 4]]).collect()
        };
        let framing = FramingInput {
            spacing_mm: 610.0,
            lines_along: None,
            walls_m: walls,
        };
        let panel = PanelInput {
            length_mm: 2440.0,
            width_mm: 1220.0,
            stagger: Stagger::Half,
            min_piece_mm: 600.0,
            blocking: EdgeBlocking::None,
            start: StartCorner::SmallerCoordinate,
            first_course_width_mm: 1220.0,
            first_panel_length_mm: 2440.0,
        };
        let planes = [
            PlaneGeometry {
                polygon_m: vec![[0.0, 0.0], [12.0, 0.0], [9.0, 3.0], [3.0, 3.0]],
                slope_deg: 30.0,
                downslope_m: [0.0, -1.0],
            },
            PlaneGeometry {
                polygon_m: vec![[0.0, 0.0], [3.0, 3.0], [0.0, 6.0]],
                slope_deg: 30.0,
                downslope_m: [-1.0, 0.0],
            },
            PlaneGeometry {
                polygon_m: vec![[0.0, 3.0], [12.0, 3.0], [12.0, 6.0], [0.0, 6.0]],
                slope_deg: 30.0,
                downslope_m: [0.0, 1.0],
            },
        ];
        let mut kept = BearingWork::default();
        let (mut bearings, mut cut, mut strips_found, mut strips_kept) = (0, 0, 0, 0);
        for (plane_index, plane) in planes.iter().enumerate() {
            let frame = plane_frame(plane_index, plane, &framing).expect("valid plane");
            let grid = grid_lines(plane, &frame, &framing).expect("valid grid");
            let layer = CourseLayer {
                plane_index,
                frame: &frame,
                grid: &grid,
                panel: &panel,
                framing_spacing_mm: 610.0,
            };
            let first = layer.joints(0, None).expect("laid");
            let bands = course_bands(frame.slope_length_m(), 1.22, 1.22);
            let courses: Vec<Vec<f64>> = (0..bands.len())
                .map(|index| {
                    let laid = if index == 0 {
                        first.clone()
                    } else {
                        layer.joints(index, first.first_joint_m).expect("laid")
                    };
                    laid.joints_m
                })
                .collect();
            for (line, grid_line) in grid.iter().enumerate() {
                for interval in &grid_line.intervals_m {
                    let a = frame.slope_from_low_edge_m(interval[0]);
                    let b = frame.slope_from_low_edge_m(interval[1]);
                    for (band, joints_m) in bands.iter().zip(&courses) {
                        let from = a.min(b).max(band[0]);
                        let to = a.max(b).min(band[1]);
                        if to - from < MIN_PIECE_M {
                            continue;
                        }
                        let along_m = frame.along_at_m(0.5 * (from + to));
                        let polygon = &plane.polygon_m;
                        let with_kept =
                            bearing_at(polygon, &frame, &grid, joints_m, line, along_m, &mut kept);
                        let alone = bearing_at(
                            polygon,
                            &frame,
                            &grid,
                            joints_m,
                            line,
                            along_m,
                            &mut BearingWork::default(),
                        );
                        assert_eq!(with_kept, alone, "plane {plane_index} line {line}");
                        bearings += 1;
                        let strips = alone.expect("bears").strips;
                        cut += usize::from(strips.iter().any(|s| s.overhang_start_m > 0.0));
                        strips_found += strips.len();
                    }
                }
            }
            // Each plane starts afresh: what is kept at its end was kept for it.
            strips_kept += kept.panels.by_side.len();
        }
        // The planes are what the test says: many bearings, strips that end in cantilevers, and
        // most strips taken from the kept ones.
        assert!(bearings > 100, "{bearings}");
        assert!(cut > 0);
        assert!(
            2 * strips_kept < strips_found,
            "{strips_kept} kept for {strips_found}"
        );
    }

    #[test]
    fn a_strip_that_depends_on_the_line_asking_is_not_kept() {
        // A 4.88 m wide plane, lines every 0.61 m, one panel 2.44 m long over five of them; the
        // line at 1.22 m stops short of the section at 1.5 m (a gap in it, as at an opening): it
        // supports the panel only for itself. Whichever line asks first, each gets what it would
        // find alone.
        let corners = [[0.0, 0.0], [4.88, 0.0], [4.88, 3.0], [0.0, 3.0]];
        let plane = PlaneGeometry {
            polygon_m: corners.to_vec(),
            slope_deg: 30.0,
            downslope_m: [0.0, -1.0],
        };
        let framing = FramingInput {
            spacing_mm: 610.0,
            lines_along: None,
            walls_m: (0..4).map(|i| [corners[i], corners[(i + 1) % 4]]).collect(),
        };
        let frame = plane_frame(0, &plane, &framing).expect("valid plane");
        assert_eq!(frame.run, super::super::Axis::Y);
        let grid: Vec<GridLine> = (0..=8)
            .map(|i| GridLine {
                position_m: f64::from(i) * 0.61,
                intervals_m: if i == 2 {
                    vec![[0.0, 1.0], [2.0, 3.0]]
                } else {
                    vec![[0.0, 3.0]]
                },
                kind: crate::layout::LineKind::Common,
            })
            .collect();
        let joints_m = [0.0, 2.44, 4.88];
        for order in [[2, 1, 3, 0, 4], [1, 3, 0, 4, 2]] {
            let mut kept = BearingWork::default();
            for line in order {
                let find = |work: &mut BearingWork| {
                    bearing_at(&plane.polygon_m, &frame, &grid, &joints_m, line, 1.5, work)
                };
                let alone = find(&mut BearingWork::default());
                assert_eq!(find(&mut kept), alone, "line {line} of {order:?}");
                // The line with the gap is a support of its own strip only.
                let strip = &alone.expect("bears").strips[0];
                assert_eq!(strip.spans_m.len(), if line == 2 { 4 } else { 3 });
            }
        }
    }

    #[test]
    fn bisecting_the_grid_finds_what_a_scan_finds() {
        // Lines at 0, 0.4, 0.8, ... 8.0 m (and one doubled end-wall member at 8.0 m).
        let mut grid: Vec<GridLine> = (0..=20)
            .map(|i| GridLine {
                position_m: f64::from(i) * 0.4,
                intervals_m: vec![[0.0, 5.0]],
                kind: crate::layout::LineKind::Common,
            })
            .collect();
        grid.push(grid[20].clone());
        for (lo, hi) in [
            (-1.0, 0.0),
            (0.0, 0.4),
            (0.39, 1.21),
            (7.99, 9.0),
            (3.3, 3.35),
            (9.0, 10.0),
        ] {
            let scanned: Vec<f64> = grid
                .iter()
                .map(|g| g.position_m)
                .filter(|p| *p >= lo && *p <= hi)
                .collect();
            let bisected: Vec<f64> = grid_between(&grid, lo, hi)
                .iter()
                .map(|g| g.position_m)
                .collect();
            assert_eq!(bisected, scanned, "{lo}..{hi}");
        }
    }
}
