//! Deck layout: framing lines clipped to each roof plane, split by governing wind zone, and the
//! panel courses that decide, line by line, where panel ends fall and what each support carries.
//!
//! Plain data in, plain data out: the roof planes and zone polygons come from the caller (in plan,
//! metres), the zone order from a rank the caller gives (higher = worse), so this module knows
//! nothing of pressures.

mod blocking;
mod changes;
mod courses;
mod framing;
mod geometry;
mod lines;
mod pieces;
mod zone_merge;
mod zones;

use std::sync::Arc;

use serde::{Deserialize, Serialize};
use smallvec::SmallVec;

use crate::error::{check_positive, check_range, SpacingError};
pub use blocking::EdgeBlocking;
use blocking::{blocking_lines, BlockingPlane};
pub use changes::{si_words, LayoutChange, LengthWords};
pub use courses::SLIVER_M;
use courses::{bearing_at, course_bands, BearingWork, CourseLayer};
use deckhold_core::limits;
use framing::framing_lines;
use geometry::{bounds, validate_polygon, MIN_PIECE_M};
use lines::{grid_lines, plane_frame, GridLine, PlaneFrame};
use pieces::PieceCutter;
use zones::{zone_pieces_with, JoinedZones, LineStrip, ZoneShapes, ZoneWork};

/// One roof plane in plan.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct PlaneGeometry {
    /// Outline of the plane in plan, overhangs included, m.
    pub polygon_m: Vec<[f64; 2]>,
    /// Slope of the plane, degrees (0..60).
    pub slope_deg: f64,
    /// Unit plan vector pointing down the slope; `[0, 0]` for a flat plane.
    pub downslope_m: [f64; 2],
}

/// The plan area of one wind zone (the zones together tile the roof).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct ZoneRegion {
    /// The caller's zone number; also the index into `zone_rank` and the uplift function's argument.
    pub zone_index: usize,
    pub polygons_m: Vec<Vec<[f64; 2]>>,
}

/// A plan axis.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum Axis {
    X,
    Y,
}

/// How the roof is framed.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct FramingInput {
    /// Framing spacing on centre, mm (200..1220).
    pub spacing_mm: f64,
    /// Direction the framing lines run in. Default: down each plane's slope; for a flat plane,
    /// parallel to its shorter plan dimension (the joists span the short way).
    pub lines_along: Option<Axis>,
    /// The wall lines under the roof, m (segments in plan). Every wall parallel to the framing carries
    /// a member, and the other lines are set out from the first such wall at `spacing_mm`.
    pub walls_m: Vec<[[f64; 2]; 2]>,
}

/// The deck panels.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct PanelInput {
    /// Panel length, laid across the framing, mm (600..3700).
    pub length_mm: f64,
    /// Panel width, laid along the framing, mm (300..1250).
    pub width_mm: f64,
    pub stagger: Stagger,
    /// Narrowest cut piece laid, across the framing, mm: where a piece would be narrower the panel
    /// ends are shifted to another line, the way a framer lays out a course.
    pub min_piece_mm: f64,
    /// Blocking under the panel edges, where the user asks for it.
    pub blocking: EdgeBlocking,
    /// The eave corner each plane's courses start from.
    pub start: StartCorner,
    /// Width of the first course at the eave, mm (a ripped first course; the panel width: a full one).
    pub first_course_width_mm: f64,
    /// Length of the first panel of each unstaggered course, mm (the panel length: a full panel).
    pub first_panel_length_mm: f64,
}

impl PanelInput {
    /// Whole panels laid from the smaller coordinate, no blocking: the defaults of every setting but
    /// the panel, its stagger and the narrowest piece.
    pub fn whole_panels(
        length_mm: f64,
        width_mm: f64,
        stagger: Stagger,
        min_piece_mm: f64,
    ) -> Self {
        PanelInput {
            length_mm,
            width_mm,
            stagger,
            min_piece_mm,
            blocking: EdgeBlocking::None,
            start: StartCorner::SmallerCoordinate,
            first_course_width_mm: width_mm,
            first_panel_length_mm: length_mm,
        }
    }
}

/// The eave corner each plane's panel laying starts from, across the framing.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum StartCorner {
    /// At the plane's smaller plan coordinate across the framing (x for rafters running along y).
    #[default]
    SmallerCoordinate,
    /// At the plane's larger plan coordinate across the framing.
    LargerCoordinate,
}

/// Offset of the panel end joints in alternate courses.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum Stagger {
    /// Every other course starts with half a panel (snapped to a framing line).
    Half,
    /// All courses start with a full panel.
    None,
    /// Every other course starts with a part panel of this length, mm (snapped to a framing line).
    OffsetMm(f64),
}

/// What a framing line is to the panels of one course (the shared vocabulary).
pub use deckhold_core::{LineKind, SupportRole};

/// One panel strip bearing on a line: a continuous beam over the lines it crosses.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct PanelStrip {
    /// Spans between the supports the strip crosses, on the slope, m. Shared by the bearings of every
    /// line under the panel (one strip, seen from each of its supports).
    pub spans_m: Arc<[f64]>,
    /// Deck running past the first and last support as a cantilever, on the slope, m.
    pub overhang_start_m: f64,
    pub overhang_end_m: f64,
    /// Which of the strip's supports is this line.
    pub support_index: usize,
    /// The strip's reaction on this line per unit pressure: the width of deck the line's row of
    /// nails holds, mm on the slope. Negative when the deck presses down on the line.
    pub reaction_width_mm: f64,
}

/// One stretch of a line within one panel course.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Bearing {
    pub course_index: usize,
    /// Along the slope from the line's start (low end), m.
    pub from_m: f64,
    pub to_m: f64,
    pub support_role: SupportRole,
    /// One strip for an intermediate support or a deck edge, two at a panel end joint: held inline (a
    /// roof has some 250 bearings, and a vector each was a fifth of the layout's allocations).
    pub strips: SmallVec<[PanelStrip; 2]>,
    /// Where along the line the strips were taken, m from the line's start: the middle of the
    /// line's stretch in the course.
    pub strip_at_m: f64,
}

/// One stretch of a line in one governing zone.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct ZonePiece {
    /// Along the slope from the line's start (low end), m.
    pub from_m: f64,
    pub to_m: f64,
    pub zone_index: usize,
}

/// A framing line (rafter, truss chord, joist) with its zones and panel bearings.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct LayoutLine {
    /// 1..N over the roof, by plane then by position.
    pub number: u32,
    pub plane_index: usize,
    pub kind: LineKind,
    /// Direction the line runs in.
    pub axis: Axis,
    /// The line's constant plan coordinate (x for a line along y), m.
    pub position_m: f64,
    /// Length of deck the line carries, on the slope, m.
    pub length_m: f64,
    /// Plan points of the line's low and high ends.
    pub plan_start_m: [f64; 2],
    pub plan_end_m: [f64; 2],
    /// Where the line is inside the plane, along the slope from its start, m (several for a line
    /// crossing a notch).
    pub intervals_m: Vec<[f64; 2]>,
    pub zones: Vec<ZonePiece>,
    pub bearings: Vec<Bearing>,
}

/// One course of panels on one plane.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Course {
    pub plane_index: usize,
    /// 0 at the low edge.
    pub index: usize,
    /// Along the slope from the plane's low edge, m.
    pub from_m: f64,
    pub to_m: f64,
    /// Plan positions across the lines of the panel ends in this course, both deck edges included, m.
    pub joints_m: Vec<f64>,
    /// How the course was shifted or trimmed (minimum piece, slivers at hip and valley cuts, a
    /// narrow top course), in SI words starting "course N: " (the same as `changes`; empty when laid
    /// out with [`LayoutDetail::ForSpacing`]).
    pub adjustments: Vec<String>,
    /// The same changes as data, for writers in other units.
    pub changes: Vec<LayoutChange>,
}

/// Every member the deck lands on, for drawings and checks: the numbered lines and the hip and
/// valley rafters along the planes' oblique edges.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct FramingLine {
    /// The line's number in [`DeckLayout::lines`]; None for a hip or valley rafter.
    pub number: Option<u32>,
    pub kind: LineKind,
    /// Plan points of the two ends, m.
    pub start_m: [f64; 2],
    pub end_m: [f64; 2],
    /// Length along the member on the slope, m.
    pub length_on_slope_m: f64,
}

/// One piece of deck (a panel or a cut panel) in one course.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct DeckPiece {
    pub plane_index: usize,
    pub course: usize,
    /// Plan positions across the framing of the piece's two ends, m.
    pub start_m: f64,
    pub end_m: f64,
    /// Along the slope from the plane's low edge, m.
    pub from_slope_m: f64,
    pub to_slope_m: f64,
    /// Across the framing, on the slope, m.
    pub length_m: f64,
    /// Up the slope, m.
    pub width_m: f64,
    /// Numbers of the lines under the piece's two ends; None where the end is a deck edge past the
    /// last member (a cantilever) or a cut along a hip or valley.
    pub start_line: Option<u32>,
    pub end_line: Option<u32>,
    /// Deck past the outermost member under the piece, on the slope, m (0: no cantilever): the
    /// largest within the course band (see `cantilever_at_m`).
    pub cantilever_start_m: f64,
    pub cantilever_end_m: f64,
    /// Where in the band the cantilevers were taken: up the slope from the plane's low edge, m (the
    /// conservative strip: the height with the largest cantilever).
    pub cantilever_at_m: f64,
    /// The piece's end is cut along a hip or valley (somewhere in its band).
    pub start_cut: bool,
    pub end_cut: bool,
    /// The piece's outline in plan, cut along the hips and valleys, m.
    pub outline_m: Vec<[f64; 2]>,
}

/// Where and how panel laying starts on one plane.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct LayingStart {
    pub plane_index: usize,
    /// Plan point of the corner the first panel goes in: the low (eave) edge at the start corner's
    /// end across the framing, m.
    pub corner_m: [f64; 2],
    /// Distance of the first course's low edge from the eave edge, up the slope, m (always 0: the
    /// first course is laid flush with the eave edge and ripped to `first_course_width_m`).
    pub first_course_offset_m: f64,
    /// Width of the first course up the slope, m (a full panel width unless ripped).
    pub first_course_width_m: f64,
    /// Length of the first panel of the first course across the framing, m (a full panel unless cut).
    pub first_panel_length_m: f64,
}

/// The laid-out deck.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct DeckLayout {
    pub lines: Vec<LayoutLine>,
    pub courses: Vec<Course>,
    pub framing: Vec<FramingLine>,
    /// Empty when laid out with [`LayoutDetail::ForSpacing`].
    pub pieces: Vec<DeckPiece>,
    pub laying_starts: Vec<LayingStart>,
    /// The zone order the layout was made with (`zone_rank[zone_index]`, higher = worse): the plan
    /// keeps it too, within each family of `zone_family` (a worse zone is never nailed wider than a
    /// milder one of its family).
    pub zone_rank: Vec<u32>,
    /// Which zones are compared for that order, by zone index: all one family (0) as laid out; a
    /// caller whose zones carry the deck differently (overhangs, as cantilevers) sets them apart.
    pub zone_family: Vec<u32>,
}

/// How much of the deck a layout works out.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum LayoutDetail {
    /// Everything: lines, bearings, courses with their adjustments in words, framing, deck pieces.
    Full,
    /// What the nail spacing reads: lines, zones, bearings, courses and their changes as data. No deck
    /// pieces (they are for drawings, the JSON output and checks) and no adjustments in words: a
    /// batch summary needs neither, and the pieces were an eighth of a roof's work.
    ForSpacing,
}

/// Lays out the framing lines and panel courses of every plane, in full ([`LayoutDetail::Full`]).
///
/// `zone_rank[zone_index]` orders the zones, higher = worse (corner > edge > interior, overhang zones
/// by their pressure). A stretch of line takes the worst zone its deck strip (half a spacing either
/// side) touches.
pub fn layout_deck(
    planes: &[PlaneGeometry],
    zones: &[ZoneRegion],
    zone_rank: &[u32],
    framing: &FramingInput,
    panel: &PanelInput,
) -> Result<DeckLayout, SpacingError> {
    layout_deck_with(planes, zones, zone_rank, framing, panel, LayoutDetail::Full)
}

/// [`layout_deck`] to the given detail: the lines, bearings and courses are the same at either.
pub fn layout_deck_with(
    planes: &[PlaneGeometry],
    zones: &[ZoneRegion],
    zone_rank: &[u32],
    framing: &FramingInput,
    panel: &PanelInput,
    detail: LayoutDetail,
) -> Result<DeckLayout, SpacingError> {
    validate(planes, zones, zone_rank, framing, panel)?;
    let mut cache = BearingWork::default();
    let mut zone_work = ZoneWork::default();
    let joined_zones = JoinedZones::new(zones);
    let zone_shapes = ZoneShapes::new(&joined_zones, zone_rank);
    let mut lines = Vec::new();
    let mut courses = Vec::new();
    let mut pieces = Vec::new();
    let mut laying_starts = Vec::new();
    let mut number = 0u32;
    let mut framed: Vec<(PlaneFrame, Vec<GridLine>)> = Vec::with_capacity(planes.len());
    for (plane_index, plane) in planes.iter().enumerate() {
        let frame = plane_frame(plane_index, plane, framing)?;
        let grid = grid_lines(plane, &frame, framing)?;
        let bands = course_bands(
            frame.slope_length_m(),
            panel.width_mm / 1000.0,
            panel.first_course_width_mm / 1000.0,
        );
        let layer = CourseLayer {
            plane_index,
            frame: &frame,
            grid: &grid,
            panel,
            framing_spacing_mm: framing.spacing_mm,
        };
        let first = layer.joints(0, None)?;
        let mut plane_courses = Vec::with_capacity(bands.len());
        for (index, band) in bands.iter().enumerate() {
            let mut laid = if index == 0 {
                first.clone()
            } else {
                layer.joints(index, first.first_joint_m)?
            };
            let top_m = band[1] - band[0];
            if index > 0 && index + 1 == bands.len() && top_m * 1000.0 < panel.min_piece_mm - 1e-3 {
                laid.changes
                    .push(LayoutChange::NarrowTopCourse { width_m: top_m });
            }
            plane_courses.push(Course {
                plane_index,
                index,
                from_m: band[0],
                to_m: band[1],
                joints_m: laid.joints_m,
                adjustments: Vec::new(),
                changes: laid.changes,
            });
        }
        let first_number = number + 1;
        // Slivers at hip and valley cuts, by course, said once each.
        let mut notes: Vec<(usize, LayoutChange)> = Vec::new();
        // A line's strip stays within half a spacing of the plane (the margin's extra millimetre
        // covers a line set a hair off the plane's edge), so only these shapes can meet it.
        let plane_zones = zone_shapes.near(
            bounds(&plane.polygon_m),
            framing.spacing_mm / 2000.0 + MIN_PIECE_M,
        );
        lines.reserve(grid.len());
        for line in 0..grid.len() {
            number += 1;
            let context = PlaneContext {
                plane,
                frame: &frame,
                grid: &grid,
                courses: &plane_courses,
            };
            lines.push(lay_out_line(
                &context,
                line,
                number,
                plane_index,
                framing,
                &plane_zones,
                &mut cache,
                &mut zone_work,
                &mut notes,
            )?);
        }
        for (course_index, sliver) in notes {
            if let Some(course) = plane_courses.get_mut(course_index) {
                if !course.changes.contains(&sliver) {
                    course.changes.push(sliver);
                }
            }
        }
        if detail == LayoutDetail::Full {
            for course in &mut plane_courses {
                course.adjustments = course
                    .changes
                    .iter()
                    .map(|change| si_words(change, course.index, panel.min_piece_mm / 1000.0))
                    .collect();
            }
            let cutter = PieceCutter {
                polygon_m: &plane.polygon_m,
                frame: &frame,
                grid: &grid,
                first_number,
            };
            pieces.extend(cutter.pieces(&plane_courses));
        }
        let low_along_m = frame.along_at_m(0.0);
        let corner_cross_m = match panel.start {
            StartCorner::SmallerCoordinate => frame.cross_range_m[0],
            StartCorner::LargerCoordinate => frame.cross_range_m[1],
        };
        laying_starts.push(LayingStart {
            plane_index,
            corner_m: frame.plan_point(corner_cross_m, low_along_m),
            first_course_offset_m: 0.0,
            first_course_width_m: bands[0][1] - bands[0][0],
            first_panel_length_m: panel.first_panel_length_mm / 1000.0,
        });
        courses.extend(plane_courses);
        framed.push((frame, grid));
    }
    // Blocking is numbered after every framing line, so asking for it renumbers nothing.
    if panel.blocking == EdgeBlocking::CourseJoints {
        for (plane_index, (plane, (frame, grid))) in planes.iter().zip(&framed).enumerate() {
            let plane_courses: Vec<Course> = courses
                .iter()
                .filter(|c| c.plane_index == plane_index)
                .cloned()
                .collect();
            let on = BlockingPlane {
                plane_index,
                plane,
                frame,
                grid,
                courses: &plane_courses,
                panel_width_m: panel.width_mm / 1000.0,
            };
            lines.extend(blocking_lines(&on, &zone_shapes, &mut number)?);
        }
    }
    let framing_lines = framing_lines(planes, &lines);
    Ok(DeckLayout {
        lines,
        courses,
        framing: framing_lines,
        pieces,
        laying_starts,
        zone_rank: zone_rank.to_vec(),
        zone_family: vec![0; zone_rank.len()],
    })
}

struct PlaneContext<'a> {
    plane: &'a PlaneGeometry,
    frame: &'a PlaneFrame,
    grid: &'a [GridLine],
    courses: &'a [Course],
}

#[allow(clippy::too_many_arguments)]
fn lay_out_line(
    context: &PlaneContext<'_>,
    line: usize,
    number: u32,
    plane_index: usize,
    framing: &FramingInput,
    zones: &ZoneShapes<'_>,
    cache: &mut BearingWork,
    zone_work: &mut ZoneWork,
    notes: &mut Vec<(usize, LayoutChange)>,
) -> Result<LayoutLine, SpacingError> {
    let frame = context.frame;
    let grid_line = &context.grid[line];
    // Slope coordinates from the plane's low edge, increasing up the slope.
    let mut slope_intervals: Vec<[f64; 2]> = grid_line
        .intervals_m
        .iter()
        .map(|i| {
            let a = frame.slope_from_low_edge_m(i[0]);
            let b = frame.slope_from_low_edge_m(i[1]);
            [a.min(b), a.max(b)]
        })
        .collect();
    slope_intervals.sort_by(|p, q| p[0].total_cmp(&q[0]));
    let start_m = slope_intervals.first().map_or(0.0, |i| i[0]);
    let end_m = slope_intervals.last().map_or(0.0, |i| i[1]);

    let strip = LineStrip {
        number,
        plane_polygon_m: &context.plane.polygon_m,
        run: frame.run,
        position_m: grid_line.position_m,
        half_width_m: framing.spacing_mm / 2000.0,
    };
    // Sized as they are filled (a push at a time regrew these vectors some thirty times a roof).
    let mut zone_list = Vec::new();
    for interval in &grid_line.intervals_m {
        zone_pieces_with(strip, *interval, zones, zone_work)?;
        zone_list.reserve_exact(zone_work.pieces.len());
        for piece in &zone_work.pieces {
            let a = frame.slope_from_low_edge_m(piece.from_m) - start_m;
            let b = frame.slope_from_low_edge_m(piece.to_m) - start_m;
            zone_list.push(ZonePiece {
                from_m: a.min(b),
                to_m: a.max(b),
                zone_index: piece.zone_index,
            });
        }
    }
    zone_list.sort_by(|p, q| p.from_m.total_cmp(&q.from_m));

    let mut bearings = Vec::with_capacity(slope_intervals.len() * context.courses.len());
    for interval in &slope_intervals {
        for course in context.courses {
            let from = interval[0].max(course.from_m);
            let to = interval[1].min(course.to_m);
            if to - from < MIN_PIECE_M {
                continue;
            }
            // The strip is taken at the middle of the line's stretch in the course. Taking the
            // most loading of 5, 50 and 95 % on planes cut along a hip was tried: near the cut it
            // meets spans just over the sliver limit next to full bays, and the continuous strip pries
            // the line (the L hip fixture's corner went to "none works"), which the two-way panel
            // near the cut does not do; the pieces' cantilevers are taken at their worst instead.
            let strip_at_m = 0.5 * (from + to);
            let bearing = bearing_at(
                &context.plane.polygon_m,
                frame,
                context.grid,
                &course.joints_m,
                line,
                frame.along_at_m(strip_at_m),
                cache,
            )?;
            for width_m in &bearing.slivers_m {
                let sliver = LayoutChange::Sliver {
                    line: number,
                    width_m: *width_m,
                };
                notes.push((course.index, sliver));
            }
            bearings.push(Bearing {
                course_index: course.index,
                from_m: from - start_m,
                to_m: to - start_m,
                support_role: bearing.role,
                strips: bearing.strips,
                strip_at_m: strip_at_m - start_m,
            });
        }
    }

    Ok(LayoutLine {
        number,
        plane_index,
        kind: grid_line.kind,
        axis: frame.run,
        position_m: grid_line.position_m,
        length_m: slope_intervals.iter().map(|i| i[1] - i[0]).sum(),
        plan_start_m: frame.plan_point(grid_line.position_m, frame.along_at_m(start_m)),
        plan_end_m: frame.plan_point(grid_line.position_m, frame.along_at_m(end_m)),
        intervals_m: slope_intervals
            .iter()
            .map(|i| [i[0] - start_m, i[1] - start_m])
            .collect(),
        zones: zone_list,
        bearings,
    })
}

fn validate(
    planes: &[PlaneGeometry],
    zones: &[ZoneRegion],
    zone_rank: &[u32],
    framing: &FramingInput,
    panel: &PanelInput,
) -> Result<(), SpacingError> {
    if planes.is_empty() {
        return Err(SpacingError::Invalid {
            field: "planes".to_string(),
            reason: "needs at least one roof plane".to_string(),
        });
    }
    for (i, plane) in planes.iter().enumerate() {
        validate_polygon(|| format!("planes[{i}].polygon_m"), &plane.polygon_m, true)?;
        limits::SLOPE_DEG.check(&format!("planes[{i}].slope_deg"), plane.slope_deg)?;
        let [ux, uy] = plane.downslope_m;
        let field = || format!("planes[{i}].downslope_m");
        if !(ux.is_finite() && uy.is_finite()) {
            return Err(SpacingError::Invalid {
                field: field(),
                reason: format!("[{ux}, {uy}] is not a finite vector"),
            });
        }
        let norm = ux.hypot(uy);
        if norm == 0.0 && plane.slope_deg > 0.0 {
            return Err(SpacingError::Invalid {
                field: field(),
                reason: format!("[0, 0] (flat) but slope_deg is {}", plane.slope_deg),
            });
        }
        if norm != 0.0 && (norm - 1.0).abs() > 1e-6 {
            return Err(SpacingError::Invalid {
                field: field(),
                reason: format!("[{ux}, {uy}] is not a unit vector (length {norm})"),
            });
        }
    }
    if zones.is_empty() {
        return Err(SpacingError::Invalid {
            field: "zones".to_string(),
            reason: "needs at least one zone".to_string(),
        });
    }
    for (i, zone) in zones.iter().enumerate() {
        if zone.zone_index >= zone_rank.len() {
            return Err(SpacingError::Invalid {
                field: format!("zones[{i}].zone_index"),
                reason: format!(
                    "{} has no entry in zone_rank ({} entries)",
                    zone.zone_index,
                    zone_rank.len()
                ),
            });
        }
        for (j, polygon) in zone.polygons_m.iter().enumerate() {
            validate_polygon(|| format!("zones[{i}].polygons_m[{j}]"), polygon, false)?;
        }
    }
    limits::FRAMING_SPACING_MM.check("framing.spacing_mm", framing.spacing_mm)?;
    for (i, wall) in framing.walls_m.iter().enumerate() {
        if wall.iter().flatten().any(|c| !c.is_finite()) {
            return Err(SpacingError::Invalid {
                field: format!("framing.walls_m[{i}]"),
                reason: "is not a pair of finite points".to_string(),
            });
        }
    }
    limits::PANEL_LENGTH_MM.check("panel.length_mm", panel.length_mm)?;
    limits::PANEL_WIDTH_MM.check("panel.width_mm", panel.width_mm)?;
    check_range(
        || "panel.min_piece_mm".to_string(),
        panel.min_piece_mm,
        0.0,
        panel.length_mm,
    )?;
    check_range(
        || "panel.first_course_width_mm".to_string(),
        panel.first_course_width_mm,
        50.0,
        panel.width_mm,
    )?;
    check_range(
        || "panel.first_panel_length_mm".to_string(),
        panel.first_panel_length_mm,
        50.0,
        panel.length_mm,
    )?;
    if let Stagger::OffsetMm(offset_mm) = panel.stagger {
        check_positive(|| "panel.stagger.offset_mm".to_string(), offset_mm)?;
        if offset_mm >= panel.length_mm {
            return Err(SpacingError::OutOfRange {
                field: "panel.stagger.offset_mm".to_string(),
                value: offset_mm,
                allowed: format!("0..{} (less than panel.length_mm)", panel.length_mm),
            });
        }
    }
    if panel.length_mm < framing.spacing_mm {
        return Err(SpacingError::OutOfRange {
            // Named by the project file's keys: this is the refusal the user sees.
            field: "deck.panel_length_mm".to_string(),
            value: panel.length_mm,
            allowed: format!("at least framing.spacing_mm ({} mm)", framing.spacing_mm),
        });
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    pub(crate) fn rectangle(x0: f64, y0: f64, x1: f64, y1: f64) -> Vec<[f64; 2]> {
        vec![[x0, y0], [x1, y0], [x1, y1], [x0, y1]]
    }

    /// A 4:12 gable, 30 m along x, 12 m along y, ridge at y = 6, one zone covering everything.
    fn gable() -> (Vec<PlaneGeometry>, Vec<ZoneRegion>) {
        let slope_deg = (4.0f64 / 12.0).atan().to_degrees();
        let planes = vec![
            PlaneGeometry {
                polygon_m: rectangle(0.0, 0.0, 30.0, 6.0),
                slope_deg,
                downslope_m: [0.0, -1.0],
            },
            PlaneGeometry {
                polygon_m: rectangle(0.0, 6.0, 30.0, 12.0),
                slope_deg,
                downslope_m: [0.0, 1.0],
            },
        ];
        let zones = vec![ZoneRegion {
            zone_index: 0,
            polygons_m: vec![rectangle(0.0, 0.0, 30.0, 12.0)],
        }];
        (planes, zones)
    }

    /// The four sides of a rectangle as wall lines.
    pub(crate) fn walls(x0: f64, y0: f64, x1: f64, y1: f64) -> Vec<[[f64; 2]; 2]> {
        let corners = rectangle(x0, y0, x1, y1);
        (0..4).map(|i| [corners[i], corners[(i + 1) % 4]]).collect()
    }

    /// Framing on the 30 m × 12 m gable's walls.
    fn framing(spacing_mm: f64) -> FramingInput {
        FramingInput {
            spacing_mm,
            lines_along: None,
            walls_m: walls(0.0, 0.0, 30.0, 12.0),
        }
    }

    fn panel(stagger: Stagger) -> PanelInput {
        PanelInput {
            length_mm: 2440.0,
            width_mm: 1220.0,
            stagger,
            min_piece_mm: 600.0,
            blocking: EdgeBlocking::None,
            start: StartCorner::SmallerCoordinate,
            first_course_width_mm: 1220.0,
            first_panel_length_mm: 2440.0,
        }
    }

    fn gable_layout(spacing_mm: f64, stagger: Stagger) -> DeckLayout {
        let (planes, zones) = gable();
        layout_deck(&planes, &zones, &[1], &framing(spacing_mm), &panel(stagger))
            .expect("valid gable")
    }

    fn line_at(layout: &DeckLayout, plane_index: usize, position_m: f64) -> &LayoutLine {
        layout
            .lines
            .iter()
            .find(|l| l.plane_index == plane_index && (l.position_m - position_m).abs() < 1e-9)
            .expect("a line at that position")
    }

    #[test]
    fn gable_lines_are_numbered_by_plane_then_position() {
        let layout = gable_layout(610.0, Stagger::Half);
        assert_eq!(
            layout.lines.len(),
            102,
            "51 lines per plane: 0..29.89 at 610 plus a closing line"
        );
        for (i, line) in layout.lines.iter().enumerate() {
            assert_eq!(line.number as usize, i + 1);
            assert_eq!(line.axis, Axis::Y);
        }
        assert_eq!(layout.lines[51].plane_index, 1);
        let cos = (4.0f64 / 12.0).atan().cos();
        let first = &layout.lines[0];
        assert_relative_eq!(first.length_m, 6.0 / cos, max_relative = 1e-12);
        assert_eq!(first.plan_start_m, [0.0, 0.0]);
        assert_relative_eq!(first.plan_end_m[1], 6.0, max_relative = 1e-12);
        // The north plane's lines start at its eave, y = 12.
        assert_relative_eq!(layout.lines[51].plan_start_m[1], 12.0, max_relative = 1e-12);
        // Courses: 6 / cos = 6.32 m on the slope -> five full courses of 1.22 m and a part course.
        assert_eq!(
            layout.courses.iter().filter(|c| c.plane_index == 0).count(),
            6
        );
    }

    #[test]
    fn half_stagger_alternates_end_joints_and_intermediate_supports() {
        let layout = gable_layout(610.0, Stagger::Half);
        let course0 = &layout.courses[0];
        assert_eq!(course0.joints_m.len(), 14, "0, 2.44, ... 29.28, 30");
        let course1 = &layout.courses[1];
        assert_relative_eq!(course1.joints_m[1], 1.22, max_relative = 1e-12);
        let at_1_22 = line_at(&layout, 0, 1.22);
        assert_eq!(at_1_22.bearings[0].support_role, SupportRole::Intermediate);
        assert_eq!(at_1_22.bearings[1].support_role, SupportRole::PanelEdge);
        assert_eq!(at_1_22.bearings[1].strips.len(), 2);
        let at_0_61 = line_at(&layout, 0, 0.61);
        assert!(at_0_61
            .bearings
            .iter()
            .all(|b| b.support_role == SupportRole::Intermediate));
        let at_edge = line_at(&layout, 0, 0.0);
        assert!(at_edge
            .bearings
            .iter()
            .all(|b| b.support_role == SupportRole::PanelEdge && b.strips.len() == 1));
    }

    #[test]
    fn reaction_widths_follow_the_four_span_strip() {
        // 2440 mm panels at 610 mm: continuous over 4 equal spans. Hicks, Civil Engineering Formulas,
        // Table 2.1 (checked): 11/28, 32/28, 26/28 of the span.
        let layout = gable_layout(610.0, Stagger::Half);
        let width = |position: f64, course: usize| -> Vec<f64> {
            line_at(&layout, 0, position).bearings[course]
                .strips
                .iter()
                .map(|s| s.reaction_width_mm)
                .collect()
        };
        assert_relative_eq!(width(0.61, 0)[0], 610.0 * 32.0 / 28.0, max_relative = 1e-6);
        assert_relative_eq!(width(1.22, 0)[0], 610.0 * 26.0 / 28.0, max_relative = 1e-6);
        let joint = width(2.44, 0);
        assert_eq!(joint.len(), 2);
        assert_relative_eq!(joint[0], 610.0 * 11.0 / 28.0, max_relative = 1e-6);
        assert_relative_eq!(joint[1], 610.0 * 11.0 / 28.0, max_relative = 1e-6);
        // Course 1 starts with a half panel over 2 spans: 3/8 at its end (Hicks Table 2.1).
        assert_relative_eq!(width(0.0, 1)[0], 610.0 * 3.0 / 8.0, max_relative = 1e-6);
        // 16 in framing: 2440 / 406.4 -> 6 spans of 406.4 (2438.4 mm), 41/104 at the end (Table 2.1).
        let layout = gable_layout(406.4, Stagger::None);
        let edge = &line_at(&layout, 0, 0.0).bearings[0].strips[0];
        assert_eq!(edge.spans_m.len(), 6);
        assert_relative_eq!(
            edge.reaction_width_mm,
            406.4 * 41.0 / 104.0,
            max_relative = 1e-6
        );
    }

    #[test]
    fn panel_reactions_balance_the_deck_in_every_course() {
        // Equilibrium: the reactions of all strips in one course add up to the deck's width across
        // the lines (30 m), whatever the stagger and the closing bay.
        for (spacing_mm, stagger) in [
            (610.0, Stagger::Half),
            (406.4, Stagger::Half),
            (600.0, Stagger::OffsetMm(900.0)),
            (500.0, Stagger::None),
        ] {
            let layout = gable_layout(spacing_mm, stagger);
            for course in 0..6 {
                let total_mm: f64 = layout
                    .lines
                    .iter()
                    .filter(|l| l.plane_index == 0)
                    .flat_map(|l| l.bearings.iter().filter(|b| b.course_index == course))
                    .flat_map(|b| b.strips.iter().map(|s| s.reaction_width_mm))
                    .sum();
                assert_relative_eq!(total_mm, 30_000.0, max_relative = 1e-9);
            }
        }
    }

    #[test]
    fn the_rake_overhang_is_a_cantilever_past_the_end_wall_member() {
        // Walls 0..30 m, 300 mm rake overhang each end: the planes run -0.3..30.3 m.
        let (mut planes, zones) = gable();
        for plane in &mut planes {
            for point in &mut plane.polygon_m {
                point[0] = if point[0] < 1.0 { -0.3 } else { 30.3 };
            }
        }
        let layout = layout_deck(
            &planes,
            &zones,
            &[1],
            &framing(610.0),
            &panel(Stagger::None),
        )
        .expect("valid");
        let first = &layout.lines[0];
        assert_eq!(first.position_m, 0.0);
        assert_eq!(first.kind, LineKind::EndWall);
        assert_eq!(first.bearings[0].support_role, SupportRole::Intermediate);
        assert_relative_eq!(
            first.bearings[0].strips[0].overhang_start_m,
            0.3,
            max_relative = 1e-9
        );
        let piece = &layout.pieces[0];
        assert_eq!(piece.start_line, None);
        assert_relative_eq!(piece.cantilever_start_m, 0.3, max_relative = 1e-9);
        assert_eq!(layout.lines[50].kind, LineKind::EndWall);
        assert_eq!(layout.lines[50].position_m, 30.0);
    }

    #[test]
    fn laying_out_for_spacing_drops_only_the_pieces_and_the_words() {
        // A hip end with a corner zone and a min piece that shifts joints, so that the courses have
        // changes in words and the deck has cut pieces.
        let plane = PlaneGeometry {
            polygon_m: vec![[0.0, 0.0], [6.0, 6.0], [0.0, 12.0]],
            slope_deg: 45.0,
            downslope_m: [-1.0, 0.0],
        };
        let zones = vec![
            ZoneRegion {
                zone_index: 0,
                polygons_m: vec![vec![[1.0, 1.0], [6.0, 6.0], [0.0, 12.0], [0.0, 1.0]]],
            },
            ZoneRegion {
                zone_index: 1,
                polygons_m: vec![vec![[0.0, 0.0], [1.0, 1.0], [0.0, 1.0]]],
            },
        ];
        let framing = FramingInput {
            walls_m: walls(0.0, 0.0, 20.0, 12.0),
            ..framing(610.0)
        };
        let lay = |detail| {
            layout_deck_with(
                std::slice::from_ref(&plane),
                &zones,
                &[1, 2],
                &framing,
                &panel(Stagger::Half),
                detail,
            )
            .expect("valid")
        };
        let full = lay(LayoutDetail::Full);
        let for_spacing = lay(LayoutDetail::ForSpacing);
        assert!(!full.pieces.is_empty());
        assert!(full.courses.iter().any(|c| !c.adjustments.is_empty()));
        assert!(for_spacing.pieces.is_empty());
        assert!(for_spacing.courses.iter().all(|c| c.adjustments.is_empty()));
        let without_words = |layout: &DeckLayout| {
            let mut layout = layout.clone();
            layout.pieces.clear();
            for course in &mut layout.courses {
                course.adjustments.clear();
            }
            layout
        };
        assert_eq!(without_words(&full), for_spacing);
    }

    #[test]
    fn hip_end_lines_shorten_and_bear_on_the_hips() {
        // A hip end in plan: eave along x = 0 from y = 0 to 12, hips meeting at (6, 6), 45 deg slope.
        let plane = PlaneGeometry {
            polygon_m: vec![[0.0, 0.0], [6.0, 6.0], [0.0, 12.0]],
            slope_deg: 45.0,
            downslope_m: [-1.0, 0.0],
        };
        let zones = vec![ZoneRegion {
            zone_index: 0,
            polygons_m: vec![plane.polygon_m.clone()],
        }];
        let framing = FramingInput {
            walls_m: walls(0.0, 0.0, 20.0, 12.0),
            ..framing(610.0)
        };
        let layout =
            layout_deck(&[plane], &zones, &[1], &framing, &panel(Stagger::Half)).expect("valid");
        assert_eq!(layout.lines[0].axis, Axis::X);
        assert_eq!(layout.lines[0].kind, LineKind::Jack);
        assert_eq!(
            layout
                .framing
                .iter()
                .filter(|l| l.kind == LineKind::Hip)
                .count(),
            2
        );
        // The corner line at y = 0 touches the plane at a point only and is dropped.
        assert_relative_eq!(layout.lines[0].position_m, 0.61, max_relative = 1e-12);
        let cos = 45f64.to_radians().cos();
        assert_relative_eq!(layout.lines[0].length_m, 0.61 / cos, max_relative = 1e-6);
        // The first jack's strip starts on the hip: an extra support, no cantilever.
        let strip = &layout.lines[0].bearings[0].strips[0];
        assert_relative_eq!(strip.overhang_start_m, 0.0);
        assert_eq!(strip.support_index, 1);
    }

    #[test]
    fn inputs_outside_the_method_are_refused() {
        let (planes, zones) = gable();
        let error = layout_deck(
            &planes,
            &zones,
            &[1],
            &framing(150.0),
            &panel(Stagger::Half),
        )
        .expect_err("spacing");
        assert_eq!(
            error.to_string(),
            "framing.spacing_mm: 150 mm is outside 200..1220 mm"
        );
        let mut steep = planes.clone();
        steep[1].slope_deg = 75.0;
        let error = layout_deck(&steep, &zones, &[1], &framing(610.0), &panel(Stagger::Half))
            .expect_err("slope");
        assert_eq!(
            error.to_string(),
            "planes[1].slope_deg: 75 deg is outside 0..45 deg"
        );
        let error = layout_deck(&planes, &zones, &[], &framing(610.0), &panel(Stagger::Half))
            .expect_err("rank");
        assert!(
            error.to_string().starts_with("zones[0].zone_index"),
            "{error}"
        );
        let odd = PanelInput {
            stagger: Stagger::OffsetMm(3000.0),
            ..panel(Stagger::Half)
        };
        assert!(layout_deck(&planes, &zones, &[1], &framing(610.0), &odd).is_err());
    }
}
