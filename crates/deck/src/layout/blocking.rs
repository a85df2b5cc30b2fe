//! Blocking under the panel edges along the course joints, where the user asks for it.
//!
//! A course joint is the long edge where two courses of panels meet, running across the framing. With
//! `EdgeBlocking::CourseJoints` a line of blocking runs under every course joint of a plane, between
//! the outermost members at that height (it stops at a hip or valley rafter where the deck is cut
//! along one, and at the end-wall member where the deck runs on into the rake overhang). Both panel
//! edges are nailed to it: two rows, at the panel-edge spacing of the zone the nails are in.
//!
//! The model, stated plainly: the panels are still solved as strips spanning across the framing, so
//! every framing line carries its full reaction as if the blocking were not there. The blocking's
//! relief to the rafters is ignored, which is conservative for the rafter nails; the blocking nails
//! are not sized by the strip model (it gives them no share of the uplift) but take the panel-edge
//! pattern of their zone, the prescriptive reading for a blocked panel edge.

use smallvec::SmallVec;

use super::geometry::{section, MIN_PIECE_M, SAME_POSITION_M};
use super::lines::{GridLine, PlaneFrame};
use super::zones::{zone_pieces, LineStrip, ZoneShapes};
use super::{Bearing, Course, LayoutLine, LineKind, PlaneGeometry, SupportRole, ZonePiece};
use crate::error::SpacingError;

/// Where panel edges are blocked.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, serde::Serialize, serde::Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum EdgeBlocking {
    /// No blocking: the course joints run unsupported between the framing lines.
    #[default]
    None,
    /// Blocking under every course joint (the long panel edges across the framing).
    CourseJoints,
}

/// What the blocking of one plane is laid on.
pub(crate) struct BlockingPlane<'a> {
    pub plane_index: usize,
    pub plane: &'a PlaneGeometry,
    pub frame: &'a PlaneFrame,
    pub grid: &'a [GridLine],
    pub courses: &'a [Course],
    /// Panel width up the slope, m: the blocking's nails hold the panel edges on both sides, so the
    /// zone is the worst one within half a panel width of the joint (conservative).
    pub panel_width_m: f64,
}

/// The blocking lines of one plane, numbered from `next_number`, one per course joint.
pub(crate) fn blocking_lines(
    on: &BlockingPlane<'_>,
    zones: &ZoneShapes<'_>,
    next_number: &mut u32,
) -> Result<Vec<LayoutLine>, SpacingError> {
    let frame = on.frame;
    let across = frame.run.other();
    let mut lines = Vec::new();
    for course in on.courses.iter().filter(|c| c.index > 0) {
        let along_m = frame.along_at_m(course.from_m);
        let stretches: Vec<[f64; 2]> = section(&on.plane.polygon_m, across, along_m)
            .iter()
            .filter_map(|s| {
                // Between the outermost members present at this height; to the edge where that edge
                // is a hip or valley rafter.
                let present: Vec<f64> = on
                    .grid
                    .iter()
                    .filter(|g| {
                        g.position_m >= s.lo - SAME_POSITION_M
                            && g.position_m <= s.hi + SAME_POSITION_M
                            && g.is_present_at(along_m)
                    })
                    .map(|g| g.position_m)
                    .collect();
                let lo = if s.lo_oblique {
                    s.lo
                } else {
                    *present.first()?
                };
                let hi = if s.hi_oblique { s.hi } else { *present.last()? };
                (hi - lo >= MIN_PIECE_M).then_some([lo, hi])
            })
            .collect();
        let (Some(first), Some(last)) = (stretches.first(), stretches.last()) else {
            continue;
        };
        let start = first[0];
        *next_number += 1;
        let number = *next_number;
        let to_slope = |c: f64| (c - start) * frame.cross_factor;
        let strip = LineStrip {
            number,
            plane_polygon_m: &on.plane.polygon_m,
            run: across,
            position_m: along_m,
            half_width_m: 0.5 * on.panel_width_m / frame.along_factor,
        };
        let mut zone_list = Vec::new();
        let mut bearings = Vec::new();
        for stretch in &stretches {
            for piece in zone_pieces(strip, *stretch, zones)? {
                zone_list.push(ZonePiece {
                    from_m: to_slope(piece.from_m),
                    to_m: to_slope(piece.to_m),
                    zone_index: piece.zone_index,
                });
            }
            bearings.push(Bearing {
                course_index: course.index,
                from_m: to_slope(stretch[0]),
                to_m: to_slope(stretch[1]),
                support_role: SupportRole::PanelEdge,
                strips: SmallVec::new(),
                strip_at_m: 0.0,
            });
        }
        lines.push(LayoutLine {
            number,
            plane_index: on.plane_index,
            kind: LineKind::Blocking,
            axis: across,
            position_m: along_m,
            length_m: stretches
                .iter()
                .map(|s| to_slope(s[1]) - to_slope(s[0]))
                .sum(),
            plan_start_m: frame.plan_point(start, along_m),
            plan_end_m: frame.plan_point(last[1], along_m),
            intervals_m: stretches
                .iter()
                .map(|s| [to_slope(s[0]), to_slope(s[1])])
                .collect(),
            zones: zone_list,
            bearings,
        });
    }
    Ok(lines)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::layout::tests::{rectangle, walls};
    use crate::layout::{layout_deck, DeckLayout, FramingInput, PanelInput, Stagger, ZoneRegion};
    use approx::assert_relative_eq;

    fn panel(blocking: EdgeBlocking) -> PanelInput {
        PanelInput {
            length_mm: 2440.0,
            width_mm: 1220.0,
            stagger: Stagger::Half,
            min_piece_mm: 600.0,
            blocking,
            start: crate::layout::StartCorner::SmallerCoordinate,
            first_course_width_mm: 1220.0,
            first_panel_length_mm: 2440.0,
        }
    }

    /// One 30 deg plane over walls 0..10 m x 0..4 m, eave at y = 0, rake overhang 0.3 m each end.
    fn plane_layout(blocking: EdgeBlocking) -> DeckLayout {
        let plane = PlaneGeometry {
            polygon_m: rectangle(-0.3, 0.0, 10.3, 4.0),
            slope_deg: 30.0,
            downslope_m: [0.0, -1.0],
        };
        lay_out(plane, [10.0, 4.0], blocking)
    }

    /// One plane, one zone over it, walls from the origin to `walls_to`, 610 mm framing.
    fn lay_out(plane: PlaneGeometry, walls_to: [f64; 2], blocking: EdgeBlocking) -> DeckLayout {
        let zones = vec![ZoneRegion {
            zone_index: 0,
            polygons_m: vec![plane.polygon_m.clone()],
        }];
        let framing = FramingInput {
            spacing_mm: 610.0,
            lines_along: None,
            walls_m: walls(0.0, 0.0, walls_to[0], walls_to[1]),
        };
        layout_deck(&[plane], &zones, &[1], &framing, &panel(blocking)).expect("valid")
    }

    #[test]
    fn blocking_runs_under_every_course_joint_between_the_end_wall_members() {
        let plain = plane_layout(EdgeBlocking::None);
        let blocked = plane_layout(EdgeBlocking::CourseJoints);
        // 4 m / cos 30 = 4.619 m up the slope: courses at 0, 1.22, 2.44, 3.66 -> three joints.
        let blocking: Vec<_> = blocked
            .lines
            .iter()
            .filter(|l| l.kind == LineKind::Blocking)
            .collect();
        assert_eq!(blocking.len(), 3);
        // Numbered after every framing line: the framing is numbered as without blocking.
        assert_eq!(&blocked.lines[..plain.lines.len()], &plain.lines[..]);
        assert_eq!(blocking[0].number as usize, plain.lines.len() + 1);
        let cos = 30f64.to_radians().cos();
        for (i, line) in blocking.iter().enumerate() {
            // Plan y of the joint: 1.22 k m up the slope is 1.22 k cos 30 m in plan.
            assert_relative_eq!(
                line.position_m,
                1.22 * (i + 1) as f64 * cos,
                max_relative = 1e-12
            );
            // From the end-wall member at x = 0 to the one at x = 10: not into the rake overhang.
            assert_eq!(line.plan_start_m[0], 0.0);
            assert_eq!(line.plan_end_m[0], 10.0);
            assert_relative_eq!(line.length_m, 10.0, max_relative = 1e-12);
            assert_eq!(line.bearings.len(), 1);
            assert_eq!(line.bearings[0].support_role, SupportRole::PanelEdge);
        }
        assert_eq!(
            blocked
                .framing
                .iter()
                .filter(|l| l.kind == LineKind::Blocking)
                .count(),
            3
        );
    }

    #[test]
    fn on_a_hip_end_blocking_runs_from_hip_to_hip() {
        // Hip end: eave along x = 0 from y = 0 to 8, apex at (4, 4), 45 deg. The first joint is
        // 1.22 m up the slope, 1.22 cos 45 = 0.8627 m in plan from the eave; the hips there are at
        // y = 0.8627 and 8 - 0.8627.
        let plane = PlaneGeometry {
            polygon_m: vec![[0.0, 0.0], [4.0, 4.0], [0.0, 8.0]],
            slope_deg: 45.0,
            downslope_m: [-1.0, 0.0],
        };
        let layout = lay_out(plane, [12.0, 8.0], EdgeBlocking::CourseJoints);
        let first = layout
            .lines
            .iter()
            .find(|l| l.kind == LineKind::Blocking)
            .expect("blocking");
        let plan_m = 1.22 * 45f64.to_radians().cos();
        assert_relative_eq!(first.position_m, plan_m, max_relative = 1e-12);
        assert_relative_eq!(first.plan_start_m[1], plan_m, max_relative = 1e-9);
        assert_relative_eq!(first.plan_end_m[1], 8.0 - plan_m, max_relative = 1e-9);
        // Across the lines is level on this plane: the plan length is the length.
        assert_relative_eq!(first.length_m, 8.0 - 2.0 * plan_m, max_relative = 1e-9);
    }
}
