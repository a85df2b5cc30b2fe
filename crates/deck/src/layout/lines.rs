//! Framing lines of one roof plane: their direction, positions and extent on the slope.

use super::geometry::{
    bounds, line_intervals, line_intervals_with, section_into, SectionScratch, SAME_POSITION_M,
};
use super::{Axis, FramingInput, LineKind, PlaneGeometry};
use crate::error::SpacingError;

/// A downslope component below this is no component (the vector is along the other axis).
const ALIGNED: f64 = 1e-6;

/// How one plane is framed and measured.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct PlaneFrame {
    /// Direction the framing lines run in.
    pub run: Axis,
    /// The low end of the lines is at the plane's largest `run` coordinate.
    pub low_at_max: bool,
    /// Slope length per plan length along the lines (1/cos θ for rafters running downslope).
    pub along_factor: f64,
    /// Slope length per plan length across the lines (1 for rafters running downslope).
    pub cross_factor: f64,
    /// Plan range of the plane along the lines, m.
    pub along_range_m: [f64; 2],
    /// Plan range of the plane across the lines, m.
    pub cross_range_m: [f64; 2],
}

impl PlaneFrame {
    /// Distance along the slope from the plane's low edge to the plan coordinate `along_m`.
    pub(crate) fn slope_from_low_edge_m(&self, along_m: f64) -> f64 {
        let [lo, hi] = self.along_range_m;
        if self.low_at_max {
            (hi - along_m) * self.along_factor
        } else {
            (along_m - lo) * self.along_factor
        }
    }

    /// Plan coordinate along the lines at `slope_m` up the slope from the low edge.
    pub(crate) fn along_at_m(&self, slope_m: f64) -> f64 {
        let [lo, hi] = self.along_range_m;
        if self.low_at_max {
            hi - slope_m / self.along_factor
        } else {
            lo + slope_m / self.along_factor
        }
    }

    /// Length of the plane along the slope of the lines, m.
    pub(crate) fn slope_length_m(&self) -> f64 {
        (self.along_range_m[1] - self.along_range_m[0]) * self.along_factor
    }

    /// Plan point of a line at cross coordinate `position_m` and plan coordinate `along_m`.
    pub(crate) fn plan_point(&self, position_m: f64, along_m: f64) -> [f64; 2] {
        let mut point = [0.0; 2];
        point[self.run.index()] = along_m;
        point[self.run.other().index()] = position_m;
        point
    }
}

/// Direction and measures of a plane's framing. The plane has been validated.
pub(crate) fn plane_frame(
    plane_index: usize,
    plane: &PlaneGeometry,
    framing: &FramingInput,
) -> Result<PlaneFrame, SpacingError> {
    let [lo, hi] = bounds(&plane.polygon_m);
    let downslope = plane.downslope_m;
    let is_flat = downslope == [0.0, 0.0];
    let run = match framing.lines_along {
        Some(axis) => axis,
        None if is_flat => {
            // Joists span the short way: they run parallel to the shorter plan dimension.
            if hi[0] - lo[0] >= hi[1] - lo[1] {
                Axis::Y
            } else {
                Axis::X
            }
        }
        None if downslope[0].abs() < ALIGNED => Axis::Y,
        None if downslope[1].abs() < ALIGNED => Axis::X,
        None => {
            return Err(SpacingError::Invalid {
                field: format!("planes[{plane_index}].downslope_m"),
                reason: format!(
                    "[{}, {}] runs along neither x nor y; give framing.lines_along",
                    downslope[0], downslope[1]
                ),
            })
        }
    };
    let r = run.index();
    let k = run.other().index();
    let tan = plane.slope_deg.to_radians().tan();
    Ok(PlaneFrame {
        run,
        low_at_max: downslope[r] > ALIGNED,
        along_factor: (1.0 + (tan * downslope[r]).powi(2)).sqrt(),
        cross_factor: (1.0 + (tan * downslope[k]).powi(2)).sqrt(),
        along_range_m: [lo[r], hi[r]],
        cross_range_m: [lo[k], hi[k]],
    })
}

/// One framing line of a plane before numbering: its cross position and plan intervals along it.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct GridLine {
    pub position_m: f64,
    /// Plan intervals along the line inside the plane, sorted.
    pub intervals_m: Vec<[f64; 2]>,
    pub kind: LineKind,
}

impl GridLine {
    /// The line carries deck at plan coordinate `along_m`.
    pub(crate) fn is_present_at(&self, along_m: f64) -> bool {
        self.intervals_m
            .iter()
            .any(|i| along_m >= i[0] - SAME_POSITION_M && along_m <= i[1] + SAME_POSITION_M)
    }
}

/// A common rafter closer than this to a wall member is left out: the two would touch (a 38 mm
/// member each), and the wall member carries the deck there. Common practice, no source.
pub(crate) const MIN_BAY_M: f64 = 0.05;

/// Framing lines of a plane, in increasing cross position, set out the way a framer does.
///
/// Every wall parallel to the lines that lies under the plane carries a member (kind end-wall): both
/// gable-end walls whatever the length, and the inside walls of an L- or T-shaped roof. The other
/// lines sit at `first wall + k · spacing` between the outermost walls, so the last bay is whatever is
/// left; none sits in the rake overhang (the deck cantilevers past the end-wall member there). A line
/// whose high end stops on a hip or valley edge of the plane is a jack. A line that would carry no
/// deck over the building (the corner of a hip plane) is left out.
pub(crate) fn grid_lines(
    plane: &PlaneGeometry,
    frame: &PlaneFrame,
    framing: &FramingInput,
) -> Result<Vec<GridLine>, SpacingError> {
    let r = frame.run.index();
    let k = frame.run.other().index();
    let walls = &framing.walls_m;
    if walls.is_empty() {
        return Err(SpacingError::Invalid {
            field: "framing.walls_m".to_string(),
            reason: "needs the wall lines the framing is set out from".to_string(),
        });
    }
    let extent = |axis: usize| {
        let coordinates = walls.iter().flatten().map(|p| p[axis]);
        [
            coordinates.clone().fold(f64::INFINITY, f64::min),
            coordinates.fold(f64::NEG_INFINITY, f64::max),
        ]
    };
    let cross_walls = extent(k);
    let along_walls = extent(r);
    // Walls parallel to the lines with deck above them on this plane carry a member.
    let mut members: Vec<f64> = walls
        .iter()
        .filter(|[a, b]| (a[k] - b[k]).abs() < SAME_POSITION_M)
        .filter(|[a, b]| {
            let (lo, hi) = (a[r].min(b[r]), a[r].max(b[r]));
            line_intervals(&plane.polygon_m, frame.run, a[k])
                .iter()
                .any(|i| i[1].min(hi) - i[0].max(lo) >= MIN_BAY_M)
        })
        .map(|[a, _]| a[k])
        .collect();
    members.sort_by(f64::total_cmp);
    members.dedup_by(|a, b| (*a - *b).abs() < SAME_POSITION_M);

    let spacing_m = framing.spacing_mm / 1000.0;
    let mut positions: Vec<(f64, LineKind)> =
        members.iter().map(|p| (*p, LineKind::EndWall)).collect();
    let mut step = 0u32;
    loop {
        let position = cross_walls[0] + f64::from(step) * spacing_m;
        if position > cross_walls[1] - MIN_BAY_M {
            break;
        }
        if members.iter().all(|m| (m - position).abs() >= MIN_BAY_M) {
            positions.push((position, LineKind::Common));
        }
        step += 1;
    }
    positions.sort_by(|a, b| a.0.total_cmp(&b.0));

    let mut scratch = SectionScratch::default();
    Ok(positions
        .into_iter()
        .filter_map(|(position_m, kind)| {
            let intervals_m =
                line_intervals_with(&plane.polygon_m, frame.run, position_m, &mut scratch);
            let over_building: f64 = intervals_m
                .iter()
                .map(|i| (i[1].min(along_walls[1]) - i[0].max(along_walls[0])).max(0.0))
                .sum();
            if intervals_m.is_empty() || over_building < MIN_BAY_M {
                return None;
            }
            let kind = if kind == LineKind::Common
                && ends_on_oblique_edge(&plane.polygon_m, frame.run, position_m, &mut scratch)
            {
                LineKind::Jack
            } else {
                kind
            };
            Some(GridLine {
                position_m,
                intervals_m,
                kind,
            })
        })
        .collect())
}

/// The line at `position_m` ends on an oblique edge of the polygon (a hip or valley).
fn ends_on_oblique_edge(
    polygon: &[[f64; 2]],
    run: Axis,
    position_m: f64,
    scratch: &mut SectionScratch,
) -> bool {
    section_into(polygon, run, position_m, scratch);
    scratch
        .stretches
        .iter()
        .any(|stretch| stretch.lo_oblique || stretch.hi_oblique)
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn framing(spacing_mm: f64) -> FramingInput {
        FramingInput {
            spacing_mm,
            lines_along: None,
            walls_m: vec![
                [[0.0, 0.0], [30.0, 0.0]],
                [[30.0, 0.0], [30.0, 12.0]],
                [[30.0, 12.0], [0.0, 12.0]],
                [[0.0, 12.0], [0.0, 0.0]],
            ],
        }
    }

    fn plane(polygon_m: Vec<[f64; 2]>, slope_deg: f64, downslope_m: [f64; 2]) -> PlaneGeometry {
        PlaneGeometry {
            polygon_m,
            slope_deg,
            downslope_m,
        }
    }

    #[test]
    fn rafters_run_downslope_and_are_longer_on_the_slope() {
        let south = plane(
            vec![[0.0, 0.0], [30.0, 0.0], [30.0, 6.0], [0.0, 6.0]],
            30.0,
            [0.0, -1.0],
        );
        let frame = plane_frame(0, &south, &framing(610.0)).expect("valid plane");
        assert_eq!(frame.run, Axis::Y);
        assert!(!frame.low_at_max);
        assert_relative_eq!(
            frame.slope_length_m(),
            6.0 / 30f64.to_radians().cos(),
            max_relative = 1e-12
        );
        assert_relative_eq!(frame.cross_factor, 1.0);
        let north = plane(
            vec![[0.0, 6.0], [30.0, 6.0], [30.0, 12.0], [0.0, 12.0]],
            30.0,
            [0.0, 1.0],
        );
        let frame = plane_frame(1, &north, &framing(610.0)).expect("valid plane");
        assert!(frame.low_at_max);
        assert_relative_eq!(frame.slope_from_low_edge_m(12.0), 0.0);
        assert_relative_eq!(
            frame.along_at_m(frame.slope_from_low_edge_m(7.0)),
            7.0,
            max_relative = 1e-12
        );
    }

    #[test]
    fn flat_joists_span_the_short_way_and_overrides_win() {
        let flat = plane(
            vec![[0.0, 0.0], [20.0, 0.0], [20.0, 8.0], [0.0, 8.0]],
            0.0,
            [0.0, 0.0],
        );
        assert_eq!(
            plane_frame(0, &flat, &framing(400.0)).expect("flat").run,
            Axis::Y
        );
        let over = FramingInput {
            lines_along: Some(Axis::X),
            ..framing(400.0)
        };
        assert_eq!(plane_frame(0, &flat, &over).expect("flat").run, Axis::X);
    }

    #[test]
    fn purlins_across_the_slope_measure_the_panels_on_the_slope() {
        let south = plane(
            vec![[0.0, 0.0], [30.0, 0.0], [30.0, 6.0], [0.0, 6.0]],
            30.0,
            [0.0, -1.0],
        );
        let over = FramingInput {
            lines_along: Some(Axis::X),
            ..framing(610.0)
        };
        let frame = plane_frame(0, &south, &over).expect("valid plane");
        assert_relative_eq!(frame.along_factor, 1.0);
        assert_relative_eq!(
            frame.cross_factor,
            1.0 / 30f64.to_radians().cos(),
            max_relative = 1e-12
        );
    }

    #[test]
    fn a_diagonal_downslope_needs_an_axis() {
        let odd = plane(vec![[0.0, 0.0], [3.0, 0.0], [3.0, 3.0]], 20.0, [0.6, 0.8]);
        let error = plane_frame(4, &odd, &framing(610.0)).expect_err("diagonal");
        assert!(
            error.to_string().starts_with("planes[4].downslope_m"),
            "{error}"
        );
    }

    #[test]
    fn lines_start_on_the_first_wall_and_both_end_walls_carry_a_member() {
        // Walls x = 0 and 30, rake overhang 0.4 m: 0 (end wall), 0.61, ... 29.89, 30 (end wall); the
        // last bay is 0.11 m; nothing in the overhang.
        let south = plane(
            vec![[-0.4, 0.0], [30.4, 0.0], [30.4, 6.0], [-0.4, 6.0]],
            20.0,
            [0.0, -1.0],
        );
        let frame = plane_frame(0, &south, &framing(610.0)).expect("valid plane");
        let lines = grid_lines(&south, &frame, &framing(610.0)).expect("lines");
        assert_eq!(lines.len(), 51);
        assert_eq!(lines[0].position_m, 0.0);
        assert_eq!(lines[0].kind, LineKind::EndWall);
        assert_relative_eq!(lines[49].position_m, 29.89, max_relative = 1e-12);
        assert_eq!(lines[49].kind, LineKind::Common);
        assert_eq!(lines[50].position_m, 30.0);
        assert_eq!(lines[50].kind, LineKind::EndWall);
        // Spacing below the overhang is fine: 300 mm with a 400 mm overhang.
        let lines = grid_lines(&south, &frame, &framing(300.0)).expect("lines");
        assert_eq!(lines.len(), 101);
        assert!(lines.iter().all(|l| (0.0..=30.0).contains(&l.position_m)));
    }

    #[test]
    fn a_common_that_would_touch_the_end_wall_member_is_left_out() {
        // 30.03 m: 0.61 x 49 = 29.89 stays (0.14 m bay), and at 300 mm 30.0 falls 30 mm from the
        // wall at 30.03 and is left out.
        let mut short = framing(300.0);
        for wall in &mut short.walls_m {
            for point in wall.iter_mut() {
                if point[0] > 1.0 {
                    point[0] = 30.03;
                }
            }
        }
        let south = plane(
            vec![[0.0, 0.0], [30.03, 0.0], [30.03, 6.0], [0.0, 6.0]],
            20.0,
            [0.0, -1.0],
        );
        let frame = plane_frame(0, &south, &short).expect("valid plane");
        let lines = grid_lines(&south, &frame, &short).expect("lines");
        let last = &lines[lines.len() - 2..];
        assert_relative_eq!(last[0].position_m, 29.7, max_relative = 1e-9);
        assert_relative_eq!(last[1].position_m, 30.03, max_relative = 1e-12);
    }
}
