//! The roof plan to scale: zones in grey tones with hatches (so a black-and-white copy still tells them
//! apart), wall and roof lines, ridges and hips, framing lines with their numbers, panel joints, the
//! building's overall dimensions and a scale bar; then the names of the planes, a label per zone, the
//! table of roof lines and a monoslope's high and low eave marks, none of them over another.

use super::canvas::{Align, Area, Canvas, Stroke};
use super::eave_marks::eave_labels;
use super::geometry::{area, bounds, label_anchor};
use super::labels::{place_labels, LabelStyle, PlanLabel, Taken};
use super::page::Paper;
use super::plan_marks::{plane_name_labels, roof_line_rows};
use super::text::{width_mm, Font};
use crate::format::{plan_length_label, spacing_label, MM_PER_FT};
use crate::{EdgeKind, Schedule, SupportRole, Units, ZoneKind};

/// How a zone's fill is marked besides its grey tone.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum Hatch {
    Plain,
    Diagonal,
    Cross,
    Horizontal,
    Dots,
    Grid,
    AntiDiagonal,
    CrossBar,
    Vertical,
    GridDiagonal,
}

/// The look of one zone: grey level of the fill (0 black, 1 white) and its hatch.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct ZoneStyle {
    pub fill: f64,
    pub hatch: Hatch,
}

/// The style of a zone by its label: lighter and plainer where the uplift is lower. The hatch tells
/// the zones apart (each kind has its own); the grey only adds the order of severity, and stays light
/// (no fill darker than [`DARKEST_FILL`]) so that a black-and-white copy, which turns greys into a
/// halftone, does not drown the hatch.
pub(crate) fn zone_style(kind: ZoneKind) -> ZoneStyle {
    match kind {
        ZoneKind::Interior => ZoneStyle {
            fill: 1.0,
            hatch: Hatch::Plain,
        },
        ZoneKind::Edge => ZoneStyle {
            fill: 0.9,
            hatch: Hatch::Diagonal,
        },
        ZoneKind::Corner => ZoneStyle {
            fill: 0.72,
            hatch: Hatch::Cross,
        },
        ZoneKind::OverhangInterior => ZoneStyle {
            fill: 0.95,
            hatch: Hatch::Horizontal,
        },
        ZoneKind::OverhangEdge => ZoneStyle {
            fill: 0.81,
            hatch: Hatch::Dots,
        },
        ZoneKind::OverhangCorner => ZoneStyle {
            fill: 0.675,
            hatch: Hatch::Grid,
        },
        // Monoslope high-eave zones: darker than their low-eave kin, hatched the other way.
        ZoneKind::HighEdge => ZoneStyle {
            fill: 0.765,
            hatch: Hatch::AntiDiagonal,
        },
        ZoneKind::HighCorner => ZoneStyle {
            fill: 0.63,
            hatch: Hatch::CrossBar,
        },
        ZoneKind::OverhangHighEdge => ZoneStyle {
            fill: 0.855,
            hatch: Hatch::Vertical,
        },
        ZoneKind::OverhangHighCorner => ZoneStyle {
            fill: 0.585,
            hatch: Hatch::GridDiagonal,
        },
    }
}

/// The darkest zone fill (0 black, 1 white).
pub(crate) const DARKEST_FILL: f64 = 0.58;

/// Hatch line spacing, width and grey, mm.
const HATCH_STEP_MM: f64 = 2.4;
const HATCH_WIDTH_MM: f64 = 0.2;
const HATCH_GREY: f64 = 0.0;

/// Lines of a family `a·x + b·y = c` (a, b in {-1, 0, 1}) across `box` = [x0, y0, x1, y1], spaced `step`.
fn hatch_lines(canvas: &mut Canvas, bbox: [f64; 4], direction: [f64; 2], step: f64) {
    let [x0, y0, x1, y1] = bbox;
    let [a, b] = direction;
    let norm = (a * a + b * b).sqrt();
    let corners = [[x0, y0], [x1, y0], [x1, y1], [x0, y1]];
    let values: Vec<f64> = corners
        .iter()
        .map(|p| (a * p[0] + b * p[1]) / norm)
        .collect();
    let (c_min, c_max) = values
        .iter()
        .fold((f64::MAX, f64::MIN), |(lo, hi), v| (lo.min(*v), hi.max(*v)));
    let mut c = (c_min / step).floor() * step;
    // Lines run along the direction perpendicular to (a, b).
    let along = [-b / norm, a / norm];
    let reach = (x1 - x0).abs() + (y1 - y0).abs() + 1.0;
    let center = [(x0 + x1) / 2.0, (y0 + y1) / 2.0];
    let center_c = (a * center[0] + b * center[1]) / norm;
    let mut segments = Vec::new();
    while c <= c_max + 1e-9 {
        let shift = c - center_c;
        let base = [center[0] + a / norm * shift, center[1] + b / norm * shift];
        let from = [base[0] - along[0] * reach, base[1] - along[1] * reach];
        let to = [base[0] + along[0] * reach, base[1] + along[1] * reach];
        segments.push([from, to]);
        c += step;
    }
    canvas.segments(&segments, HATCH_WIDTH_MM, HATCH_GREY, Stroke::Solid);
}

fn dots(canvas: &mut Canvas, bbox: [f64; 4], step: f64) {
    let [x0, y0, x1, y1] = bbox;
    let half = 0.3;
    let mut y = (y0 / step).floor() * step;
    let mut row = 0u32;
    let mut squares = Vec::new();
    while y <= y1 + 1e-9 {
        let shift = if row.is_multiple_of(2) {
            0.0
        } else {
            step / 2.0
        };
        let mut x = (x0 / step).floor() * step - shift;
        while x <= x1 + 1e-9 {
            squares.push(Area {
                x: x - half,
                y: y - half,
                w: 2.0 * half,
                h: 2.0 * half,
            });
            x += step;
        }
        y += step;
        row += 1;
    }
    canvas.fill_areas(&squares, HATCH_GREY);
}

/// Fills `points` (page mm) in the style's grey and draws its hatch, clipped to the polygon.
pub(crate) fn fill_zone(canvas: &mut Canvas, points: &[[f64; 2]], style: ZoneStyle) {
    if points.len() < 3 {
        return;
    }
    canvas.fill_polygon(points, style.fill.max(DARKEST_FILL));
    let Some(bbox) = bounds(points.iter()) else {
        return;
    };
    if style.hatch == Hatch::Plain {
        return;
    }
    canvas.save();
    canvas.clip(points);
    let step = HATCH_STEP_MM;
    match style.hatch {
        Hatch::Plain => {}
        Hatch::Diagonal => hatch_lines(canvas, bbox, [1.0, -1.0], step),
        Hatch::Cross => {
            hatch_lines(canvas, bbox, [1.0, -1.0], step);
            hatch_lines(canvas, bbox, [1.0, 1.0], step);
        }
        Hatch::Horizontal => hatch_lines(canvas, bbox, [0.0, 1.0], step * 0.8),
        Hatch::Dots => dots(canvas, bbox, step * 0.75),
        Hatch::Grid => {
            hatch_lines(canvas, bbox, [0.0, 1.0], step * 0.8);
            hatch_lines(canvas, bbox, [1.0, 0.0], step * 0.8);
        }
        Hatch::AntiDiagonal => hatch_lines(canvas, bbox, [1.0, 1.0], step),
        Hatch::CrossBar => {
            hatch_lines(canvas, bbox, [1.0, -1.0], step);
            hatch_lines(canvas, bbox, [1.0, 1.0], step);
            hatch_lines(canvas, bbox, [1.0, 0.0], step);
        }
        Hatch::Vertical => hatch_lines(canvas, bbox, [1.0, 0.0], step * 0.8),
        Hatch::GridDiagonal => {
            hatch_lines(canvas, bbox, [0.0, 1.0], step * 0.8);
            hatch_lines(canvas, bbox, [1.0, 0.0], step * 0.8);
            hatch_lines(canvas, bbox, [1.0, -1.0], step);
        }
    }
    canvas.restore();
}

/// How a ridge, hip or valley is drawn: (width mm, grey, stroke). Ridges and hips dash-dot (hips
/// lighter), valleys dotted and heavier, so a framer tells the three apart at a glance.
pub(crate) fn roof_line_style(kind: EdgeKind) -> (f64, f64, Stroke) {
    match kind {
        EdgeKind::Ridge => (0.5, 0.0, Stroke::DashDot),
        EdgeKind::Hip => (0.45, 0.0, Stroke::DashDotDot),
        EdgeKind::Valley => (0.6, 0.0, Stroke::Dotted),
        EdgeKind::Eave | EdgeKind::Rake => (0.6, 0.0, Stroke::Solid),
    }
}

/// A legend swatch: the zone's fill and hatch in a small framed box.
pub(crate) fn swatch(canvas: &mut Canvas, area: Area, style: ZoneStyle) {
    fill_zone(canvas, &area.corners(), style);
    canvas.stroke_area(area, 0.25, 0.0);
}

/// Drawing scales a person can set a scale rule to, as 1:n.
const NICE_SCALES: [f64; 19] = [
    20.0, 25.0, 50.0, 75.0, 100.0, 125.0, 150.0, 200.0, 250.0, 300.0, 400.0, 500.0, 750.0, 1000.0,
    1250.0, 1500.0, 2000.0, 2500.0, 5000.0,
];

/// What the crew sheet says about the drawing.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct PlanNotes {
    /// The n of "1:n" when printed on the report's paper; None when there was nothing to draw.
    pub scale_denominator: Option<f64>,
    /// Every how many framing lines carry a number (1: all).
    pub numbered_every: u32,
}

/// Maps plan metres to page millimetres.
struct Transform {
    mm_per_m: f64,
    plan_min: [f64; 2],
    page_origin: [f64; 2],
}

impl Transform {
    fn page(&self, p: [f64; 2]) -> [f64; 2] {
        [
            self.page_origin[0] + (p[0] - self.plan_min[0]) * self.mm_per_m,
            self.page_origin[1] + (p[1] - self.plan_min[1]) * self.mm_per_m,
        ]
    }

    fn polygon(&self, points: &[[f64; 2]]) -> Vec<[f64; 2]> {
        points.iter().map(|p| self.page(*p)).collect()
    }
}

/// Type size of framing line numbers, pt.
const NUMBER_PT: f64 = 6.0;
/// Space below the plan for numbers, dimension and scale bar, and left of it, mm.
const NUMBER_BAND_MM: f64 = 4.0;
const DIMENSION_BAND_MM: f64 = 9.0;
const SCALE_BAND_MM: f64 = 10.0;

/// Draws the plan of `schedule` into `area` and says at what scale and how the lines are numbered.
pub(crate) fn draw_plan(
    canvas: &mut Canvas,
    area: Area,
    schedule: &Schedule,
    paper: &Paper,
) -> PlanNotes {
    let plan = &schedule.plan;
    let imperial = schedule.basis.units == Units::Imperial;
    let all_points = plan
        .roof_outline_m
        .iter()
        .chain(&plan.building_outline_m)
        .chain(
            plan.zones
                .iter()
                .flat_map(|zone| zone.polygons_m.iter().flatten()),
        )
        .chain(
            plan.rafter_lines
                .iter()
                .flat_map(|line| [&line.start_m, &line.end_m]),
        )
        .chain(plan.ridge_lines_m.iter().flatten());
    let Some([x0, y0, x1, y1]) = bounds(all_points) else {
        canvas.text(
            area.x + area.w / 2.0,
            area.y + area.h / 2.0,
            "The schedule carries no plan geometry.",
            Font::Regular,
            10.0,
            Align::Center,
        );
        return PlanNotes {
            scale_denominator: None,
            numbered_every: 1,
        };
    };

    let vertical_lines = plan
        .rafter_lines
        .iter()
        .filter(|line| {
            (line.end_m[1] - line.start_m[1]).abs() >= (line.end_m[0] - line.start_m[0]).abs()
        })
        .count()
        * 2
        >= plan.rafter_lines.len();
    let max_number = plan
        .rafter_lines
        .iter()
        .map(|line| line.number)
        .max()
        .unwrap_or(0);
    let number_w = width_mm(&max_number.to_string(), Font::Regular, NUMBER_PT);
    // Each line is numbered beside one of its ends (see `label_side`); leave room on each side that
    // carries numbers.
    let sides: Vec<LabelSide> = plan.rafter_lines.iter().map(label_side).collect();
    let band = |side: LabelSide, size: f64| if sides.contains(&side) { size } else { 0.0 };
    let bottom_numbers = band(LabelSide::Below, NUMBER_BAND_MM);
    let top_numbers = band(LabelSide::Above, NUMBER_BAND_MM);
    let left_numbers = band(LabelSide::Left, number_w + 2.0);
    let right_numbers = band(LabelSide::Right, number_w + 2.0);
    let plot = Area {
        x: area.x + left_numbers + DIMENSION_BAND_MM,
        y: area.y + SCALE_BAND_MM + DIMENSION_BAND_MM + bottom_numbers,
        w: area.w - left_numbers - right_numbers - DIMENSION_BAND_MM - 2.0,
        h: area.h - SCALE_BAND_MM - DIMENSION_BAND_MM - bottom_numbers - top_numbers - 2.0,
    };
    let span = [(x1 - x0).max(1e-3), (y1 - y0).max(1e-3)];
    let needed = (span[0] * 1000.0 / plot.w).max(span[1] * 1000.0 / plot.h);
    let denominator = NICE_SCALES
        .iter()
        .copied()
        .find(|n| *n >= needed)
        .unwrap_or(needed.ceil());
    let mm_per_m = 1000.0 / denominator;
    let transform = Transform {
        mm_per_m,
        plan_min: [x0, y0],
        page_origin: [
            plot.x + (plot.w - span[0] * mm_per_m) / 2.0,
            plot.y + (plot.h - span[1] * mm_per_m) / 2.0,
        ],
    };

    for zone in &plan.zones {
        let style = zone_style(zone.label);
        for polygon in &zone.polygons_m {
            fill_zone(canvas, &transform.polygon(polygon), style);
        }
    }
    for [from, to] in &plan.course_lines_m {
        canvas.line(
            transform.page(*from),
            transform.page(*to),
            0.2,
            0.3,
            Stroke::Dotted,
        );
    }
    for line in &plan.rafter_lines {
        canvas.line(
            transform.page(line.start_m),
            transform.page(line.end_m),
            0.15,
            0.3,
            Stroke::Solid,
        );
    }
    for [from, to] in &plan.panel_joints_m {
        canvas.line(
            transform.page(*from),
            transform.page(*to),
            0.45,
            0.0,
            Stroke::Solid,
        );
    }
    if plan.roof_lines.is_empty() {
        for [from, to] in &plan.ridge_lines_m {
            let (width, grey, stroke) = roof_line_style(EdgeKind::Ridge);
            canvas.line(
                transform.page(*from),
                transform.page(*to),
                width,
                grey,
                stroke,
            );
        }
    }
    for line in &plan.roof_lines {
        let (width, grey, stroke) = roof_line_style(line.kind);
        // A white underlay keeps the pattern readable over the zone hatches.
        canvas.line(
            transform.page(line.from_m),
            transform.page(line.to_m),
            width + 0.6,
            1.0,
            Stroke::Solid,
        );
        canvas.line(
            transform.page(line.from_m),
            transform.page(line.to_m),
            width,
            grey,
            stroke,
        );
    }
    if plan.building_outline_m.len() >= 3 {
        canvas.stroke_polygon(
            &transform.polygon(&plan.building_outline_m),
            0.35,
            0.0,
            Stroke::Dashed,
        );
    }
    if plan.roof_outline_m.len() >= 3 {
        canvas.stroke_polygon(
            &transform.polygon(&plan.roof_outline_m),
            0.6,
            0.0,
            Stroke::Solid,
        );
    }

    let drawn = {
        let low = transform.page([x0, y0]);
        let high = transform.page([x1, y1]);
        [low[0], low[1], high[0], high[1]]
    };
    let mut obstacles = Vec::new();
    let numbered_every =
        draw_line_numbers(canvas, schedule, &transform, vertical_lines, &mut obstacles);
    let lowest = draw_dimensions(
        canvas,
        schedule,
        &transform,
        drawn,
        bottom_numbers,
        left_numbers,
        imperial,
        &mut obstacles,
    );
    // The scale bar sits under the dimensions when there is room, else at the foot of the drawing.
    let bar_y = (lowest - 7.0).max(area.y + 2.2);
    let bar_band = Area {
        x: area.x,
        y: bar_y - 1.0,
        w: area.w,
        h: 6.5,
    };
    canvas.note_plan_label("scale bar and note", bar_band);
    obstacles.push(bar_band);
    draw_scale_bar(
        canvas,
        area,
        plot.x,
        bar_y,
        mm_per_m,
        denominator,
        paper,
        imperial,
    );
    let bounds = Area {
        x: area.x,
        y: bar_y + 6.0,
        w: area.w,
        h: area.top() - bar_y - 6.0,
    };
    // The roof-line table first, in a corner (its lengths are nowhere else on the sheet), then the
    // zone labels (their spacings are also in the table beside the plan), then the planes' names.
    let mut taken = Taken {
        boxes: obstacles,
        leaders: Vec::new(),
    };
    draw_roof_line_table(canvas, schedule, &transform, bounds, &mut taken);
    // A monoslope's eave marks before the zone labels: they must sit beside their eaves, where a zone
    // label can move away on a leader.
    let regions = [planes_on_page(schedule, &transform)];
    let eaves = eave_labels(&schedule.plan.planes, &schedule.plan.zones, |p| {
        transform.page(p)
    });
    place_labels(canvas, &eaves, &regions, bounds, &mut taken);
    draw_zone_labels(canvas, schedule, &transform, bounds, &mut taken, imperial);
    draw_plane_names(canvas, schedule, &transform, bounds, &mut taken);
    PlanNotes {
        scale_denominator: Some(denominator),
        numbered_every,
    }
}

/// Numbers at the low (vertical lines) or left (horizontal lines) end of the framing lines: every line
/// when there is room, else every 2nd, 5th, 10th ... counted from the first.
/// Where a line's number goes.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum LabelSide {
    Below,
    Above,
    Left,
    Right,
}

/// A line is numbered beyond its eave end (its start: the low end of a sloped line), as the crew sheet
/// says: the numbers of the two planes of a gable sit at their own eaves, and a line that runs down to
/// a valley is numbered there, not at the ridge where it would sit among the next plane's lines.
fn label_side(line: &crate::PlanLine) -> LabelSide {
    let along_y =
        (line.end_m[1] - line.start_m[1]).abs() >= (line.end_m[0] - line.start_m[0]).abs();
    let axis = usize::from(along_y);
    let start_is_high = line.start_m[axis] > line.end_m[axis] + 1e-9;
    match (along_y, start_is_high) {
        (true, false) => LabelSide::Below,
        (true, true) => LabelSide::Above,
        (false, false) => LabelSide::Left,
        (false, true) => LabelSide::Right,
    }
}

fn draw_line_numbers(
    canvas: &mut Canvas,
    schedule: &Schedule,
    transform: &Transform,
    vertical_lines: bool,
    obstacles: &mut Vec<Area>,
) -> u32 {
    let mut lines: Vec<_> = schedule.plan.rafter_lines.iter().collect();
    if lines.is_empty() {
        return 1;
    }
    lines.sort_by_key(|line| line.number);
    let midpoint = |line: &crate::PlanLine| {
        let (a, b) = (transform.page(line.start_m), transform.page(line.end_m));
        [(a[0] + b[0]) / 2.0, (a[1] + b[1]) / 2.0]
    };
    let mut gaps: Vec<f64> = lines
        .windows(2)
        .map(|pair| {
            let (a, b) = (midpoint(pair[0]), midpoint(pair[1]));
            if vertical_lines {
                (b[0] - a[0]).abs()
            } else {
                (b[1] - a[1]).abs()
            }
        })
        .filter(|gap| *gap > 1e-6)
        .collect();
    gaps.sort_by(f64::total_cmp);
    let typical_gap = gaps.get(gaps.len() / 2).copied().unwrap_or(f64::MAX);
    let max_w = lines
        .iter()
        .map(|line| width_mm(&line.number.to_string(), Font::Regular, NUMBER_PT))
        .fold(0.0, f64::max);
    let needed = if vertical_lines { max_w + 1.0 } else { 2.6 };
    let first = lines[0].number;
    let final_number = lines[lines.len() - 1].number;
    // The numbers drawn every `step` lines (and the last line's when there is room for it).
    let numbered = |step: u32| -> Vec<NumberPlace> {
        let previous_labelled = final_number - (final_number - first) % step;
        let label_final = f64::from(final_number - previous_labelled) * typical_gap >= needed;
        lines
            .iter()
            .filter(|line| {
                (line.number - first).is_multiple_of(step)
                    || (line.number == final_number && label_final)
            })
            .map(|line| number_place(line, transform))
            .collect()
    };
    // The first step that leaves room by the typical gap, made coarser while two numbers would still
    // share a place (lines of two planes ending side by side, as at an inside corner).
    let steps = [1u32, 2, 5, 10, 20, 50, 100, 200, 500, 1000];
    let start = steps
        .iter()
        .position(|step| f64::from(*step) * typical_gap >= needed)
        .unwrap_or(steps.len() - 1);
    let mut step = steps[steps.len() - 1];
    let mut places = Vec::new();
    for candidate in &steps[start..] {
        let tried = numbered(*candidate);
        let clear = tried.iter().enumerate().all(|(i, p)| {
            tried[i + 1..]
                .iter()
                .all(|q| !p.area.overlaps(&q.area, 0.0))
        });
        step = *candidate;
        places = tried;
        if clear {
            break;
        }
    }
    for place in places {
        // Never one number over another, even when no step clears them all.
        if obstacles
            .iter()
            .any(|other| place.area.overlaps(other, 0.0))
        {
            continue;
        }
        canvas.text(
            place.at[0],
            place.at[1],
            &place.text,
            Font::Regular,
            NUMBER_PT,
            place.align,
        );
        canvas.note_plan_label(&place.text, place.area);
        obstacles.push(place.area);
    }
    step
}

/// Where a line's number is set: the baseline point, its alignment and the box it takes.
struct NumberPlace {
    text: String,
    at: [f64; 2],
    align: Align,
    area: Area,
}

fn number_place(line: &crate::PlanLine, transform: &Transform) -> NumberPlace {
    let (a, b) = (transform.page(line.start_m), transform.page(line.end_m));
    let text = line.number.to_string();
    let w = width_mm(&text, Font::Regular, NUMBER_PT);
    let side = label_side(line);
    // Baseline point, alignment and the box the number takes.
    let (at, align, area) = match side {
        LabelSide::Above => {
            let high = if a[1] >= b[1] { a } else { b };
            let baseline = high[1] + 1.0;
            let area = Area {
                x: high[0] - w / 2.0,
                y: baseline - 0.4,
                w,
                h: 2.6,
            };
            ([high[0], baseline], Align::Center, area)
        }
        LabelSide::Right => {
            let right = if a[0] >= b[0] { a } else { b };
            let area = Area {
                x: right[0] + 1.2,
                y: right[1] - 1.2,
                w,
                h: 2.6,
            };
            ([right[0] + 1.2, right[1] - 0.75], Align::Left, area)
        }
        LabelSide::Below => {
            let low = if a[1] <= b[1] { a } else { b };
            let baseline = low[1] - 3.0;
            let area = Area {
                x: low[0] - w / 2.0,
                y: baseline - 0.4,
                w,
                h: 2.6,
            };
            ([low[0], baseline], Align::Center, area)
        }
        LabelSide::Left => {
            let left = if a[0] <= b[0] { a } else { b };
            let area = Area {
                x: left[0] - 1.2 - w,
                y: left[1] - 1.2,
                w,
                h: 2.6,
            };
            ([left[0] - 1.2, left[1] - 0.75], Align::Right, area)
        }
    };
    NumberPlace {
        text,
        at,
        align,
        area,
    }
}

/// Overall length (along x) and width (along y) of the building, on its wall line; returns the lowest
/// page height it drew at.
#[allow(clippy::too_many_arguments)]
fn draw_dimensions(
    canvas: &mut Canvas,
    schedule: &Schedule,
    transform: &Transform,
    drawn: [f64; 4],
    bottom_numbers: f64,
    left_numbers: f64,
    imperial: bool,
    obstacles: &mut Vec<Area>,
) -> f64 {
    let plan = &schedule.plan;
    let outline = if plan.building_outline_m.is_empty() {
        &plan.roof_outline_m
    } else {
        &plan.building_outline_m
    };
    let Some([bx0, by0, bx1, by1]) = bounds(outline.iter()) else {
        return drawn[1] - bottom_numbers;
    };
    let low = transform.page([bx0, by0]);
    let high = transform.page([bx1, by1]);
    let tick = |canvas: &mut Canvas, p: [f64; 2]| {
        canvas.line(
            [p[0] - 1.0, p[1] - 1.0],
            [p[0] + 1.0, p[1] + 1.0],
            0.35,
            0.0,
            Stroke::Solid,
        );
    };

    // Length, below the plan.
    let y_dim = drawn[1] - bottom_numbers - 3.5;
    let extension_top = drawn[1] - bottom_numbers - 0.5;
    for x in [low[0], high[0]] {
        canvas.line(
            [x, extension_top],
            [x, y_dim - 1.2],
            0.13,
            0.0,
            Stroke::Solid,
        );
        tick(canvas, [x, y_dim]);
    }
    canvas.line([low[0], y_dim], [high[0], y_dim], 0.2, 0.0, Stroke::Solid);
    obstacles.push(Area {
        x: low[0] - 1.0,
        y: y_dim - 1.0,
        w: high[0] - low[0] + 2.0,
        h: 2.0,
    });
    let length = plan_length_label(schedule.building_length_m, imperial);
    let text_y = y_dim - 3.4;
    canvas.text(
        (low[0] + high[0]) / 2.0,
        text_y,
        &length,
        Font::Bold,
        7.5,
        Align::Center,
    );
    let w = width_mm(&length, Font::Bold, 7.5);
    let length_box = Area {
        x: (low[0] + high[0] - w) / 2.0,
        y: text_y - 0.6,
        w,
        h: 3.4,
    };
    canvas.note_plan_label(&length, length_box);
    obstacles.push(length_box);

    // Width, left of the plan.
    let x_dim = drawn[0] - left_numbers - 3.5;
    let extension_right = drawn[0] - left_numbers - 0.5;
    for y in [low[1], high[1]] {
        canvas.line(
            [extension_right, y],
            [x_dim - 1.2, y],
            0.13,
            0.0,
            Stroke::Solid,
        );
        tick(canvas, [x_dim, y]);
    }
    canvas.line([x_dim, low[1]], [x_dim, high[1]], 0.2, 0.0, Stroke::Solid);
    let width = plan_length_label(schedule.building_width_m, imperial);
    let text_len = width_mm(&width, Font::Bold, 7.5);
    obstacles.push(Area {
        x: x_dim - 4.0,
        y: low[1] - 1.0,
        w: 5.0,
        h: high[1] - low[1] + 2.0,
    });
    if text_len + 2.0 <= high[1] - low[1] {
        canvas.text_vertical(
            x_dim - 1.0,
            (low[1] + high[1]) / 2.0,
            &width,
            Font::Bold,
            7.5,
        );
        let width_box = Area {
            x: x_dim - 4.0,
            y: (low[1] + high[1] - text_len) / 2.0,
            w: 4.0,
            h: text_len,
        };
        canvas.note_plan_label(&width, width_box);
        obstacles.push(width_box);
    } else {
        // A plan too shallow for the text along the line: set it level, above the line's top end.
        let baseline = high[1] + 2.0;
        canvas.text(x_dim - 2.0, baseline, &width, Font::Bold, 7.5, Align::Left);
        let width_box = Area {
            x: x_dim - 2.0,
            y: baseline - 0.6,
            w: text_len,
            h: 3.4,
        };
        canvas.note_plan_label(&width, width_box);
        obstacles.push(width_box);
    }
    text_y - 0.6
}

/// A support role in the crew's words.
pub(crate) fn role_words(role: SupportRole) -> &'static str {
    match role {
        SupportRole::PanelEdge => "panel edges",
        SupportRole::Intermediate => "intermediate",
    }
}

/// The planes' outlines on the page, in plane order.
fn planes_on_page(schedule: &Schedule, transform: &Transform) -> Vec<Vec<[f64; 2]>> {
    schedule
        .plan
        .planes
        .iter()
        .map(|plane| transform.polygon(&plane.polygon_m))
        .collect()
}

/// Each plane's name, inside the plane where it fits.
fn draw_plane_names(
    canvas: &mut Canvas,
    schedule: &Schedule,
    transform: &Transform,
    bounds: Area,
    taken: &mut Taken,
) {
    let planes_page = planes_on_page(schedule, transform);
    let names: Vec<String> = schedule
        .plan
        .planes
        .iter()
        .map(|plane| plane.name.clone())
        .collect();
    let plane_regions: Vec<Vec<Vec<[f64; 2]>>> = planes_page
        .iter()
        .map(|polygon| vec![polygon.clone()])
        .collect();
    place_labels(
        canvas,
        &plane_name_labels(&names, &planes_page),
        &plane_regions,
        bounds,
        taken,
    );
}

/// For a roof with hips or valleys, the table of roof-line lengths, off the roof where there is room
/// (the drawing's corners are tried first).
fn draw_roof_line_table(
    canvas: &mut Canvas,
    schedule: &Schedule,
    transform: &Transform,
    bounds: Area,
    taken: &mut Taken,
) {
    let imperial = schedule.basis.units == Units::Imperial;
    let Some(rows) = roof_line_rows(&schedule.plan.roof_lines, imperial) else {
        return;
    };
    let regions = [planes_on_page(schedule, transform)];
    // Where the whole table finds no free place, the hips and valleys alone (the ridges are level:
    // their lengths are plain from the drawing's dimensions).
    let hips_and_valleys: Vec<String> = rows
        .iter()
        .filter(|row| !row.starts_with("ridge"))
        .cloned()
        .collect();
    for lines in [rows, hips_and_valleys] {
        let table = PlanLabel {
            lines,
            region: None,
            style: LabelStyle::Table,
            anchors: vec![
                [bounds.right(), bounds.top()],
                [bounds.right(), bounds.y],
                [bounds.x, bounds.top()],
                [bounds.x, bounds.y],
            ],
        };
        if place_labels(canvas, &[table], &regions, bounds, taken) == 0 {
            return;
        }
    }
}

/// A label for every zone on the plan, with its spacings, placed within `bounds`.
fn draw_zone_labels(
    canvas: &mut Canvas,
    schedule: &Schedule,
    transform: &Transform,
    bounds: Area,
    taken: &mut Taken,
    imperial: bool,
) {
    let page_zones: Vec<Vec<Vec<[f64; 2]>>> = schedule
        .plan
        .zones
        .iter()
        .map(|zone| {
            zone.polygons_m
                .iter()
                .map(|p| transform.polygon(p))
                .collect()
        })
        .collect();
    let mut labels: Vec<(f64, PlanLabel)> = schedule
        .plan
        .zones
        .iter()
        .enumerate()
        .filter(|(_, zone)| !zone.polygons_m.is_empty())
        .map(|(index, zone)| {
            let mut polygons: Vec<Vec<[f64; 2]>> = zone
                .polygons_m
                .iter()
                .map(|p| transform.polygon(p))
                .collect();
            polygons.sort_by(|a, b| area(b).total_cmp(&area(a)));
            let largest = polygons.first().map(|p| area(p)).unwrap_or(0.0);
            let mut lines = vec![zone.label.as_str().to_uppercase()];
            let emphasis = schedule
                .zones
                .iter()
                .any(|row| row.label == zone.label && row.spacing_mm.is_none());
            for row in schedule.zones.iter().filter(|row| row.label == zone.label) {
                lines.push(format!(
                    "{} {}",
                    role_words(row.support_role),
                    spacing_label(row.spacing_mm, imperial)
                ));
            }
            let anchors = polygons.iter().take(4).map(|p| label_anchor(p)).collect();
            (
                largest,
                PlanLabel {
                    lines,
                    region: Some(index),
                    style: LabelStyle::Zone { emphasis },
                    anchors,
                },
            )
        })
        .collect();
    // Small zones first: they have the fewest good places.
    labels.sort_by(|a, b| a.0.total_cmp(&b.0));
    let labels: Vec<PlanLabel> = labels.into_iter().map(|(_, label)| label).collect();
    place_labels(canvas, &labels, &page_zones, bounds, taken);
}

/// A bar of alternating black and white parts, with its ends labelled, under the plan.
#[allow(clippy::too_many_arguments)]
fn draw_scale_bar(
    canvas: &mut Canvas,
    area: Area,
    left: f64,
    y: f64,
    mm_per_m: f64,
    denominator: f64,
    paper: &Paper,
    imperial: bool,
) {
    let (unit, metres_per_unit, candidates): (&str, f64, &[f64]) = if imperial {
        (
            "ft",
            MM_PER_FT / 1000.0,
            &[
                1.0, 2.0, 5.0, 10.0, 20.0, 50.0, 100.0, 200.0, 500.0, 1000.0, 2000.0,
            ],
        )
    } else {
        (
            "m",
            1.0,
            &[
                0.5, 1.0, 2.0, 5.0, 10.0, 20.0, 50.0, 100.0, 200.0, 500.0, 1000.0,
            ],
        )
    };
    let max_mm = 60.0_f64.min(area.w * 0.4);
    let Some(length) = candidates
        .iter()
        .rev()
        .copied()
        .find(|len| len * metres_per_unit * mm_per_m <= max_mm)
    else {
        return;
    };
    let bar_mm = length * metres_per_unit * mm_per_m;
    // 2, 20, 200 ... divide into quarters; 1, 5, 10, 50 ... into fifths.
    let parts = if [2.0, 20.0, 200.0, 2000.0].contains(&length) {
        4
    } else {
        5
    };
    let part_mm = bar_mm / f64::from(parts);
    let h = 1.6;
    for i in 0..parts {
        let x = left + f64::from(i) * part_mm;
        let level = if i % 2 == 0 { 0.0 } else { 1.0 };
        canvas.fill_area(
            Area {
                x,
                y,
                w: part_mm,
                h,
            },
            level,
        );
    }
    canvas.stroke_area(
        Area {
            x: left,
            y,
            w: bar_mm,
            h,
        },
        0.2,
        0.0,
    );
    let label = |value: f64| crate::format::trimmed(value, 2);
    canvas.text(left, y + h + 1.2, "0", Font::Regular, 6.5, Align::Center);
    canvas.text(
        left + bar_mm,
        y + h + 1.2,
        &format!("{} {unit}", label(length)),
        Font::Regular,
        6.5,
        Align::Center,
    );
    if part_mm * 2.0 > 6.0 {
        let mid = length / 2.0;
        canvas.text(
            left + bar_mm / 2.0,
            y + h + 1.2,
            &label(mid),
            Font::Regular,
            6.5,
            Align::Center,
        );
    }
    let note = format!(
        "scale 1:{} on {} paper; use the bar when the print is enlarged or reduced",
        crate::format::fixed(denominator, 0),
        paper.name
    );
    canvas.text(
        left + bar_mm + 8.0,
        y + 0.2,
        &note,
        Font::Regular,
        7.0,
        Align::Left,
    );
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_named_zone_has_its_own_grey_and_hatch() {
        let styles: Vec<ZoneStyle> = ZoneKind::ALL.iter().map(|kind| zone_style(*kind)).collect();
        for (i, a) in styles.iter().enumerate() {
            for b in &styles[i + 1..] {
                assert!((a.fill - b.fill).abs() >= 0.04, "{a:?} vs {b:?}");
                assert_ne!(a.hatch, b.hatch);
            }
        }
        // Light enough that a black-and-white copy keeps the hatch readable (common practice, no
        // source; looked at with `pdftoppm -mono`).
        assert!(styles.iter().all(|style| style.fill >= DARKEST_FILL));
    }

    #[test]
    fn the_scale_is_a_nice_one_that_fits() {
        let schedule = crate::sample::sample_schedule();
        let mut canvas = Canvas::new();
        let area = Area {
            x: 10.0,
            y: 10.0,
            w: 160.0,
            h: 140.0,
        };
        let notes = draw_plan(
            &mut canvas,
            area,
            &schedule,
            &Paper::for_units(Units::Si, true),
        );
        // 12.8 m x 9.2 m roof into about 149 x 119 mm: 1:100.
        assert_eq!(notes.scale_denominator, Some(100.0));
        assert_eq!(notes.numbered_every, 1);
    }

    #[test]
    fn crowded_lines_are_numbered_in_steps() {
        let schedule = crate::sample::sample_schedule_with_lines(200, Units::Si);
        let mut canvas = Canvas::new();
        let area = Area {
            x: 10.0,
            y: 10.0,
            w: 160.0,
            h: 140.0,
        };
        let notes = draw_plan(
            &mut canvas,
            area,
            &schedule,
            &Paper::for_units(Units::Si, true),
        );
        assert!(notes.numbered_every >= 5, "{notes:?}");
    }

    #[test]
    fn no_geometry_draws_a_note_and_no_scale() {
        let mut schedule = crate::sample::sample_schedule();
        schedule.plan = crate::PlanView::default();
        let mut canvas = Canvas::new();
        let area = Area {
            x: 10.0,
            y: 10.0,
            w: 160.0,
            h: 140.0,
        };
        let notes = draw_plan(
            &mut canvas,
            area,
            &schedule,
            &Paper::for_units(Units::Si, true),
        );
        assert_eq!(notes.scale_denominator, None);
    }
}

#[cfg(test)]
mod label_side_tests {
    use super::*;
    use crate::PlanLine;

    fn line(start_m: [f64; 2], end_m: [f64; 2]) -> PlanLine {
        PlanLine {
            number: 1,
            start_m,
            end_m,
        }
    }

    #[test]
    fn each_gable_plane_is_numbered_at_its_own_eave() {
        // A 10 m deep gable, ridge at y = 5: the south rafter runs 0 -> 5, the north one 10 -> 5.
        assert_eq!(label_side(&line([2.0, 0.0], [2.0, 5.0])), LabelSide::Below);
        assert_eq!(label_side(&line([2.0, 10.0], [2.0, 5.0])), LabelSide::Above);
        // Hip-end jacks run along x: numbered at their eave, left or right.
        assert_eq!(label_side(&line([0.0, 3.0], [2.0, 3.0])), LabelSide::Left);
        assert_eq!(
            label_side(&line([18.0, 3.0], [16.0, 3.0])),
            LabelSide::Right
        );
        // A rafter of a T's main wing that runs down to a valley under the rear wing, from y = 20 to
        // the ridge at y = 13: numbered at the valley, above, not at the ridge among the next
        // plane's lines (farther from the middle of the plan, which is what used to decide).
        assert_eq!(
            label_side(&line([12.0, 20.0], [12.0, 13.0])),
            LabelSide::Above
        );
        // A joist across a flat roof: numbered at its start, below.
        assert_eq!(label_side(&line([2.0, 0.0], [2.0, 10.0])), LabelSide::Below);
    }
}
