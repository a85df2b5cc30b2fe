//! Panel courses: where the panel ends fall, and which panel strips bear on a line in each course.
//!
//! Panels lie with their long side across the framing, in courses stacked up the slope from the low
//! edge. In each course the panels start at the plane's edge (a staggered course starts with a part
//! panel ending on the framing line nearest the stagger) and every panel ends on the farthest framing
//! line it reaches; the last one is cut at the far edge. A panel is a strip continuous over the lines
//! it crosses, so the reaction on a line comes from solving that strip as a continuous beam.

use std::collections::HashMap;

use super::geometry::{section, MIN_PIECE_M, SAME_POSITION_M};
use super::lines::{GridLine, PlaneFrame};
use super::{PanelInput, PanelStrip, Stagger, SupportRole};
use crate::beam::strip_reactions;
use crate::error::SpacingError;

/// Reactions of strips already solved, keyed by their geometry rounded to 0.1 µm.
#[derive(Debug, Default)]
pub(crate) struct StripCache {
    solved: HashMap<Vec<i64>, Vec<f64>>,
}

fn to_key(length_m: f64) -> i64 {
    // Lengths are at most a few metres here; 0.1 µm steps fit easily.
    (length_m * 1e7).round() as i64
}

fn from_key(key: i64) -> f64 {
    key as f64 * 1e-7
}

impl StripCache {
    /// Unit-load reactions (tributary widths, m) of the strip; the geometry is rounded to 0.1 µm so
    /// that strips equal in practice share one solution.
    fn reactions(
        &mut self,
        spans_m: &[f64],
        overhang_start_m: f64,
        overhang_end_m: f64,
    ) -> Result<&[f64], SpacingError> {
        let mut key: Vec<i64> = spans_m.iter().map(|s| to_key(*s)).collect();
        key.push(to_key(overhang_start_m));
        key.push(to_key(overhang_end_m));
        if !self.solved.contains_key(&key) {
            let spans: Vec<f64> = key[..spans_m.len()].iter().map(|k| from_key(*k)).collect();
            let start = from_key(key[spans_m.len()]);
            let end = from_key(key[spans_m.len() + 1]);
            let reactions = strip_reactions(&spans, start, end, 1.0)?;
            self.solved.insert(key.clone(), reactions);
        }
        Ok(self.solved.get(&key).map(Vec::as_slice).unwrap_or(&[]))
    }
}

/// Plan positions across the lines of the panel ends in course `course_index`, both deck edges
/// included, in increasing order.
pub(crate) fn course_joints(
    plane_index: usize,
    frame: &PlaneFrame,
    grid: &[GridLine],
    panel: &PanelInput,
    framing_spacing_mm: f64,
    course_index: usize,
) -> Result<Vec<f64>, SpacingError> {
    let [min, max] = frame.cross_range_m;
    let panel_m = panel.length_mm / 1000.0 / frame.cross_factor;
    let stagger_mm = match (course_index % 2, &panel.stagger) {
        (0, _) | (_, Stagger::None) => 0.0,
        (_, Stagger::Half) => panel.length_mm / 2.0,
        (_, Stagger::OffsetMm(offset_mm)) => *offset_mm,
    };
    let mut joints = vec![min];
    let mut previous = min;
    if stagger_mm > 0.0 {
        // The part panel ends on the line nearest the stagger, if that is nearer than the edge.
        let target = min + stagger_mm / 1000.0 / frame.cross_factor;
        let nearest = grid
            .iter()
            .map(|g| g.position_m)
            .filter(|p| *p > min + SAME_POSITION_M && *p <= min + panel_m + SAME_POSITION_M)
            .min_by(|a, b| (a - target).abs().total_cmp(&(b - target).abs()));
        if let Some(position) =
            nearest.filter(|p| (p - target).abs() < target - min && *p < max - SAME_POSITION_M)
        {
            joints.push(position);
            previous = position;
        }
    }
    while previous < max - SAME_POSITION_M {
        if previous + panel_m >= max - SAME_POSITION_M {
            joints.push(max);
            break;
        }
        let reach = previous + panel_m + SAME_POSITION_M;
        let next = grid
            .iter()
            .rev()
            .map(|g| g.position_m)
            .find(|p| *p > previous + SAME_POSITION_M && *p <= reach)
            .ok_or(SpacingError::PanelTooShort {
                plane_index,
                length_mm: panel.length_mm,
                spacing_mm: framing_spacing_mm,
                from_m: previous,
            })?;
        joints.push(next);
        previous = next;
    }
    Ok(joints)
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
    cache: &mut StripCache,
) -> Result<(SupportRole, Vec<PanelStrip>), SpacingError> {
    let position = grid[line].position_m;
    let near = |a: f64, b: f64| (a - b).abs() <= SAME_POSITION_M;
    let stretches = section(polygon_m, frame.run.other(), along_m);
    let deck = stretches
        .iter()
        .find(|s| s.lo - SAME_POSITION_M <= position && position <= s.hi + SAME_POSITION_M)
        .copied()
        .ok_or_else(|| SpacingError::Invalid {
            field: "planes.polygon_m".to_string(),
            reason: format!(
                "the section at {along_m:.4} m does not reach the framing line at {position:.4} m"
            ),
        })?;

    let joint = joints_m.iter().position(|j| near(*j, position));
    let panels: Vec<(f64, f64)> = match joint {
        Some(j) => {
            let mut both = Vec::with_capacity(2);
            if j > 0 {
                both.push((joints_m[j - 1], position));
            }
            if j + 1 < joints_m.len() {
                both.push((position, joints_m[j + 1]));
            }
            both
        }
        None => joints_m
            .windows(2)
            .find(|w| w[0] < position && position < w[1])
            .map(|w| vec![(w[0], w[1])])
            .unwrap_or_default(),
    };
    let sides: Vec<PanelSide> = panels
        .into_iter()
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
        .collect();
    if sides.is_empty() {
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

    let mut strips = Vec::with_capacity(sides.len());
    for side in sides {
        let mut supports: Vec<f64> = grid
            .iter()
            .filter(|g| {
                g.position_m >= side.from_m - SAME_POSITION_M
                    && g.position_m <= side.to_m + SAME_POSITION_M
                    && (near(g.position_m, position) || g.is_present_at(along_m))
            })
            .map(|g| g.position_m)
            .collect();
        let mut overhang_start_m = 0.0;
        let mut overhang_end_m = 0.0;
        let first = supports.first().copied().unwrap_or(position);
        if first - side.from_m > MIN_PIECE_M {
            if deck.lo_oblique && near(side.from_m, deck.lo) {
                supports.insert(0, side.from_m);
            } else {
                overhang_start_m = first - side.from_m;
            }
        }
        let last = supports.last().copied().unwrap_or(position);
        if side.to_m - last > MIN_PIECE_M {
            if deck.hi_oblique && near(side.to_m, deck.hi) {
                supports.push(side.to_m);
            } else {
                overhang_end_m = side.to_m - last;
            }
        }
        let no_support = || {
            SpacingError::Invalid {
            field: "planes.polygon_m".to_string(),
            reason: format!(
                "the panel over the framing line at {position:.4} m at {along_m:.4} m does not bear on it"
            ),
        }
        };
        let support_index = supports
            .iter()
            .position(|s| near(*s, position))
            .ok_or_else(no_support)?;
        let spans_m: Vec<f64> = supports
            .windows(2)
            .map(|w| (w[1] - w[0]) * frame.cross_factor)
            .collect();
        overhang_start_m *= frame.cross_factor;
        overhang_end_m *= frame.cross_factor;
        let reactions = cache.reactions(&spans_m, overhang_start_m, overhang_end_m)?;
        let reaction_width_mm = reactions
            .get(support_index)
            .copied()
            .ok_or_else(no_support)?
            * 1000.0;
        strips.push(PanelStrip {
            spans_m,
            overhang_start_m,
            overhang_end_m,
            support_index,
            reaction_width_mm,
        });
    }
    Ok((role, strips))
}
