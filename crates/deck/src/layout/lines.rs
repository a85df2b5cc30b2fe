//! Framing lines of one roof plane: their direction, positions and extent on the slope.

use super::geometry::{bounds, line_intervals, MIN_PIECE_M, SAME_POSITION_M};
use super::{Axis, FramingInput, PlaneGeometry};
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
}

impl GridLine {
    /// The line carries deck at plan coordinate `along_m`.
    pub(crate) fn is_present_at(&self, along_m: f64) -> bool {
        self.intervals_m
            .iter()
            .any(|i| along_m >= i[0] - SAME_POSITION_M && along_m <= i[1] + SAME_POSITION_M)
    }
}

/// Framing lines of a plane, in increasing cross position.
///
/// Lines sit at `min + offset + k · spacing`. With no offset the first line is on the plane's edge and
/// a closing line is added on the far edge when the spacing does not land on it (the last bay is then
/// shorter), so both deck edges bear on framing; with an offset the caller has placed the framing and
/// the deck past the outer lines is carried as a cantilever.
pub(crate) fn grid_lines(
    plane: &PlaneGeometry,
    frame: &PlaneFrame,
    framing: &FramingInput,
) -> Vec<GridLine> {
    let [min, max] = frame.cross_range_m;
    let spacing_m = framing.spacing_mm / 1000.0;
    let offset_m = framing.first_line_offset_mm / 1000.0;
    let mut positions = Vec::new();
    let mut k = 0u32;
    loop {
        let position = min + offset_m + f64::from(k) * spacing_m;
        if position > max + SAME_POSITION_M {
            break;
        }
        positions.push(position.min(max));
        k += 1;
    }
    if offset_m == 0.0
        && positions
            .last()
            .is_some_and(|last| max - last > MIN_PIECE_M)
    {
        positions.push(max);
    }
    positions
        .into_iter()
        .filter_map(|position_m| {
            let intervals_m = line_intervals(&plane.polygon_m, frame.run, position_m);
            (!intervals_m.is_empty()).then_some(GridLine {
                position_m,
                intervals_m,
            })
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn framing(spacing_mm: f64) -> FramingInput {
        FramingInput {
            spacing_mm,
            lines_along: None,
            first_line_offset_mm: 0.0,
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
    fn lines_start_on_the_edge_and_close_on_the_far_edge() {
        // 30 m at 610 mm: 0, 0.61, ... 29.89 (50 lines) plus a closing line at 30.0.
        let south = plane(
            vec![[0.0, 0.0], [30.0, 0.0], [30.0, 6.0], [0.0, 6.0]],
            20.0,
            [0.0, -1.0],
        );
        let frame = plane_frame(0, &south, &framing(610.0)).expect("valid plane");
        let lines = grid_lines(&south, &frame, &framing(610.0));
        assert_eq!(lines.len(), 51);
        assert_relative_eq!(lines[49].position_m, 29.89, max_relative = 1e-12);
        assert_relative_eq!(lines[50].position_m, 30.0);
        assert_eq!(lines[50].intervals_m, vec![[0.0, 6.0]]);
        let offset = FramingInput {
            first_line_offset_mm: 300.0,
            ..framing(610.0)
        };
        let lines = grid_lines(&south, &frame, &offset);
        assert_relative_eq!(lines[0].position_m, 0.3, max_relative = 1e-12);
        // 0.3 + 48 x 0.61 = 29.58 is the last; 30.19 is off the plane and no closing line is added.
        assert_eq!(lines.len(), 49);
    }
}
