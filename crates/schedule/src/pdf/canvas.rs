//! A page's drawing operations, in millimetres from the page's lower-left corner.
//!
//! A thin layer over printpdf's `Op` list: every call sets the state it needs (colour, width, dash), so
//! the order of calls never leaks style from one shape to the next.

use printpdf::{
    Color, Greyscale, Line, LineCapStyle, LineDashPattern, LinePoint, Op, PaintMode, PdfFontHandle,
    Point, Polygon, PolygonRing, Pt, TextItem, TextMatrix, WindingOrder,
};

use super::embedded::EmbeddedChars;
use super::text::{needs_embedded, printable, width_mm, Font, PT_PER_MM};

/// A rectangle on the page, mm, lower-left corner at (`x`, `y`).
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Area {
    pub x: f64,
    pub y: f64,
    pub w: f64,
    pub h: f64,
}

impl Area {
    pub(crate) fn top(&self) -> f64 {
        self.y + self.h
    }

    pub(crate) fn right(&self) -> f64 {
        self.x + self.w
    }

    pub(crate) fn corners(&self) -> [[f64; 2]; 4] {
        [
            [self.x, self.y],
            [self.right(), self.y],
            [self.right(), self.top()],
            [self.x, self.top()],
        ]
    }

    pub(crate) fn contains_area(&self, other: &Area) -> bool {
        other.x >= self.x - 1e-9
            && other.y >= self.y - 1e-9
            && other.right() <= self.right() + 1e-9
            && other.top() <= self.top() + 1e-9
    }

    pub(crate) fn overlaps(&self, other: &Area, gap_mm: f64) -> bool {
        self.x < other.right() + gap_mm
            && other.x < self.right() + gap_mm
            && self.y < other.top() + gap_mm
            && other.y < self.top() + gap_mm
    }

    pub(crate) fn contains_point(&self, point: [f64; 2]) -> bool {
        point[0] >= self.x
            && point[0] <= self.right()
            && point[1] >= self.y
            && point[1] <= self.top()
    }
}

/// How a line is drawn.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum Stroke {
    Solid,
    Dashed,
    DashDot,
    /// A long dash and two dots: hips on the plan, apart from ridges (dash-dot) in black and white.
    DashDotDot,
    Dotted,
}

impl Stroke {
    fn pattern(self) -> LineDashPattern {
        let mm = |values: &[f64]| {
            values
                .iter()
                .map(|v| (v * PT_PER_MM) as f32)
                .collect::<Vec<f32>>()
        };
        match self {
            Stroke::Solid => LineDashPattern::solid(),
            Stroke::Dashed => LineDashPattern::new(0.0, &mm(&[3.0, 1.6])),
            Stroke::DashDot => LineDashPattern::new(0.0, &mm(&[6.0, 1.2, 0.9, 1.2])),
            Stroke::DashDotDot => LineDashPattern::new(0.0, &mm(&[4.0, 1.0, 0.7, 1.0, 0.7, 1.0])),
            Stroke::Dotted => LineDashPattern::new(0.0, &mm(&[0.5, 1.0])),
        }
    }
}

/// Horizontal placement of text relative to its anchor.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum Align {
    Left,
    Center,
    Right,
}

fn pt(mm: f64) -> Pt {
    Pt((mm * PT_PER_MM) as f32)
}

fn point(p: [f64; 2]) -> LinePoint {
    LinePoint {
        p: Point {
            x: pt(p[0]),
            y: pt(p[1]),
        },
        bezier: false,
    }
}

fn grey(level: f64) -> Color {
    Color::Greyscale(Greyscale::new(level.clamp(0.0, 1.0) as f32, None))
}

/// The operations of one page, and the boxes of the text set on its plan drawing (kept so that a
/// check can see that no two of them overlap; they draw nothing).
#[derive(Debug, Default)]
pub(crate) struct Canvas {
    ops: Vec<Op>,
    /// Characters shown in the embedded face, so the document embeds just those glyphs.
    embedded: EmbeddedChars,
    plan_labels: Vec<(String, Area)>,
}

impl Canvas {
    pub(crate) fn new() -> Canvas {
        Canvas::default()
    }

    pub(crate) fn into_ops(self) -> Vec<Op> {
        self.ops
    }

    /// Draws `other`'s operations on top of this page's.
    pub(crate) fn append(&mut self, other: Canvas) {
        self.ops.extend(other.ops);
        self.embedded.merge(&other.embedded);
        self.plan_labels.extend(other.plan_labels);
    }

    pub(crate) fn embedded_chars(&self) -> &EmbeddedChars {
        &self.embedded
    }

    /// Notes that `text` was set in `area` on the plan drawing.
    pub(crate) fn note_plan_label(&mut self, text: &str, area: Area) {
        self.plan_labels.push((text.to_string(), area));
    }

    /// The boxes noted with [`Canvas::note_plan_label`], in drawing order.
    pub(crate) fn plan_labels(&self) -> &[(String, Area)] {
        &self.plan_labels
    }

    fn stroke_state(&mut self, width_mm: f64, level: f64, stroke: Stroke) {
        self.ops.push(Op::SetOutlineColor { col: grey(level) });
        self.ops.push(Op::SetOutlineThickness { pt: pt(width_mm) });
        self.ops.push(Op::SetLineDashPattern {
            dash: stroke.pattern(),
        });
        self.ops.push(Op::SetLineCapStyle {
            cap: LineCapStyle::Butt,
        });
    }

    fn polygon(&mut self, points: &[[f64; 2]], mode: PaintMode) {
        if points.len() < 2 {
            return;
        }
        self.ops.push(Op::DrawPolygon {
            polygon: Polygon {
                rings: vec![PolygonRing {
                    points: points.iter().copied().map(point).collect(),
                }],
                mode,
                winding_order: WindingOrder::NonZero,
            },
        });
    }

    /// Fills a closed polygon with a grey level (0 black, 1 white).
    pub(crate) fn fill_polygon(&mut self, points: &[[f64; 2]], level: f64) {
        self.ops.push(Op::SetFillColor { col: grey(level) });
        self.polygon(points, PaintMode::Fill);
    }

    /// Draws the outline of a closed polygon.
    pub(crate) fn stroke_polygon(
        &mut self,
        points: &[[f64; 2]],
        width_mm: f64,
        level: f64,
        stroke: Stroke,
    ) {
        self.stroke_state(width_mm, level, stroke);
        self.polygon(points, PaintMode::Stroke);
    }

    /// Draws an open line through `points`.
    pub(crate) fn polyline(
        &mut self,
        points: &[[f64; 2]],
        width_mm: f64,
        level: f64,
        stroke: Stroke,
    ) {
        if points.len() < 2 {
            return;
        }
        self.stroke_state(width_mm, level, stroke);
        self.ops.push(Op::DrawLine {
            line: Line {
                points: points.iter().copied().map(point).collect(),
                is_closed: false,
            },
        });
    }

    pub(crate) fn line(
        &mut self,
        from: [f64; 2],
        to: [f64; 2],
        width_mm: f64,
        level: f64,
        stroke: Stroke,
    ) {
        self.polyline(&[from, to], width_mm, level, stroke);
    }

    pub(crate) fn fill_area(&mut self, area: Area, level: f64) {
        self.fill_polygon(&area.corners(), level);
    }

    pub(crate) fn stroke_area(&mut self, area: Area, width_mm: f64, level: f64) {
        self.stroke_polygon(&area.corners(), width_mm, level, Stroke::Solid);
    }

    /// Saves the graphics state; pair with [`Canvas::restore`].
    pub(crate) fn save(&mut self) {
        self.ops.push(Op::SaveGraphicsState);
    }

    pub(crate) fn restore(&mut self) {
        self.ops.push(Op::RestoreGraphicsState);
    }

    /// Limits drawing to the inside of `points` until the next [`Canvas::restore`].
    pub(crate) fn clip(&mut self, points: &[[f64; 2]]) {
        self.polygon(points, PaintMode::Clip);
    }

    /// One line of text with its baseline at `y`, black.
    pub(crate) fn text(
        &mut self,
        x: f64,
        y: f64,
        text: &str,
        font: Font,
        size_pt: f64,
        align: Align,
    ) {
        self.text_grey(x, y, text, font, size_pt, align, 0.0);
    }

    /// One line of text with its baseline at `y`, in a grey level.
    #[allow(clippy::too_many_arguments)]
    pub(crate) fn text_grey(
        &mut self,
        x: f64,
        y: f64,
        text: &str,
        font: Font,
        size_pt: f64,
        align: Align,
        level: f64,
    ) {
        let text = printable(text);
        if text.is_empty() {
            return;
        }
        let width = width_mm(&text, font, size_pt);
        let left = match align {
            Align::Left => x,
            Align::Center => x - width / 2.0,
            Align::Right => x - width,
        };
        self.show(
            text,
            font,
            size_pt,
            level,
            TextMatrix::Translate(pt(left), pt(y)),
        );
    }

    /// One line of text turned a quarter turn counter-clockwise, centred on (`x`, `y`) along its length,
    /// baseline at `x`.
    pub(crate) fn text_vertical(&mut self, x: f64, y: f64, text: &str, font: Font, size_pt: f64) {
        let text = printable(text);
        let width = width_mm(&text, font, size_pt);
        let start_y = y - width / 2.0;
        self.show(
            text,
            font,
            size_pt,
            0.0,
            TextMatrix::Raw([0.0, 1.0, -1.0, 0.0, pt(x).0, pt(start_y).0]),
        );
    }

    fn show(&mut self, text: String, font: Font, size_pt: f64, level: f64, matrix: TextMatrix) {
        self.ops.push(Op::StartTextSection);
        self.ops.push(Op::SetFillColor { col: grey(level) });
        let handle = if needs_embedded(&text) {
            self.embedded.record(font, &text);
            PdfFontHandle::External(font.embedded_id())
        } else {
            PdfFontHandle::Builtin(font.builtin())
        };
        self.ops.push(Op::SetFont {
            font: handle,
            size: Pt(size_pt as f32),
        });
        self.ops.push(Op::SetTextMatrix { matrix });
        self.ops.push(Op::ShowText {
            items: vec![TextItem::Text(text)],
        });
        self.ops.push(Op::EndTextSection);
    }
}
