//! A page's drawing, in millimetres from the page's lower-left corner.
//!
//! Shapes and text in the built-in fonts are written straight into the page's content stream
//! ([`Content`]). Text in the embedded face stays a list of printpdf operations, because printpdf
//! encodes it with the glyph ids of the subset it embeds and collects those glyphs from the operations;
//! it is drawn after the rest of the page (such text is a name or an address in another script, set on
//! the white of a title block or a table cell, so nothing drawn later would have covered it). Every call sets the state it needs (colour, width, dash), so the order of calls never leaks
//! style from one shape to the next.

use printpdf::{Color, Greyscale, Op, PdfFontHandle, Pt, TextItem, TextMatrix};

use super::content::Content;
use super::embedded::EmbeddedChars;
use super::text::{needs_embedded, printable, width_mm, winansi_code, Font, PT_PER_MM};

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
    /// Dash and gap lengths, mm.
    fn pattern_mm(self) -> &'static [f64] {
        match self {
            Stroke::Solid => &[],
            Stroke::Dashed => &[3.0, 1.6],
            Stroke::DashDot => &[6.0, 1.2, 0.9, 1.2],
            Stroke::DashDotDot => &[4.0, 1.0, 0.7, 1.0, 0.7, 1.0],
            Stroke::Dotted => &[0.5, 1.0],
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

/// How a closed path is painted.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Paint {
    Fill,
    Stroke,
    Clip,
}

/// The drawing of one page, and the boxes of the text set on its plan drawing (kept so that a check
/// can see that no two of them overlap; they draw nothing).
#[derive(Debug, Default)]
pub(crate) struct Canvas {
    content: Content,
    /// Text in the embedded face, drawn after `content`.
    embedded_text: Vec<Op>,
    /// Characters shown in the embedded face, so the document embeds just those glyphs.
    embedded: EmbeddedChars,
    /// Built-in faces shown on the page: regular, bold.
    builtin_used: [bool; 2],
    plan_labels: Vec<(String, Area)>,
}

/// What the document needs of a finished page.
#[derive(Debug)]
pub(crate) struct PageParts {
    /// The content stream of shapes and built-in text.
    pub content: Vec<u8>,
    /// printpdf operations: a font selection for each built-in face used (so the document lists it
    /// among its fonts) and the text in the embedded face.
    pub ops: Vec<Op>,
}

fn mm_to_pt(mm: f64) -> f64 {
    mm * PT_PER_MM
}

impl Canvas {
    pub(crate) fn new() -> Canvas {
        Canvas::default()
    }

    pub(crate) fn into_parts(self) -> PageParts {
        let mut ops: Vec<Op> = [Font::Regular, Font::Bold]
            .into_iter()
            .zip(self.builtin_used)
            .filter(|(_, used)| *used)
            .map(|(font, _)| Op::SetFont {
                font: PdfFontHandle::Builtin(font.builtin()),
                size: Pt(1.0),
            })
            .collect();
        ops.extend(self.embedded_text);
        PageParts {
            content: self.content.into_bytes(),
            ops,
        }
    }

    /// Draws `other`'s marks on top of this page's.
    pub(crate) fn append(&mut self, other: Canvas) {
        self.content.append(&other.content);
        self.embedded_text.extend(other.embedded_text);
        self.embedded.merge(&other.embedded);
        for (mine, theirs) in self.builtin_used.iter_mut().zip(other.builtin_used) {
            *mine |= theirs;
        }
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
        let c = &mut self.content;
        c.level(level);
        c.op("G");
        c.pt(mm_to_pt(width_mm));
        c.op("w");
        let pattern_mm = stroke.pattern_mm();
        let mut pattern_pt = [0.0; 6];
        for (dash_pt, dash_mm) in pattern_pt.iter_mut().zip(pattern_mm) {
            *dash_pt = mm_to_pt(*dash_mm);
        }
        c.pt_array(&pattern_pt[..pattern_mm.len().min(pattern_pt.len())]);
        c.pt(0.0);
        c.op("d");
        c.op("0 J");
    }

    /// The path through `points`, closed when `closed`.
    fn path(&mut self, points: &[[f64; 2]], closed: bool) {
        let c = &mut self.content;
        for (index, p) in points.iter().enumerate() {
            c.pt(mm_to_pt(p[0]));
            c.pt(mm_to_pt(p[1]));
            c.op(if index == 0 { "m" } else { "l" });
        }
        if closed {
            c.op("h");
        }
    }

    fn polygon(&mut self, points: &[[f64; 2]], paint: Paint) {
        if points.len() < 2 {
            return;
        }
        self.path(points, true);
        self.content.op(match paint {
            Paint::Fill => "f",
            Paint::Stroke => "S",
            Paint::Clip => "W n",
        });
    }

    /// Fills a closed polygon with a grey level (0 black, 1 white).
    pub(crate) fn fill_polygon(&mut self, points: &[[f64; 2]], level: f64) {
        self.content.level(level);
        self.content.op("g");
        self.polygon(points, Paint::Fill);
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
        self.polygon(points, Paint::Stroke);
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
        self.path(points, false);
        self.content.op("S");
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

    /// Fills every rectangle of `areas` in one grey, as one path (a field of dots, say).
    pub(crate) fn fill_areas(&mut self, areas: &[Area], level: f64) {
        if areas.is_empty() {
            return;
        }
        let c = &mut self.content;
        c.level(level);
        c.op("g");
        for area in areas {
            c.pt(mm_to_pt(area.x));
            c.pt(mm_to_pt(area.y));
            c.pt(mm_to_pt(area.w));
            c.pt(mm_to_pt(area.h));
            c.op("re");
        }
        c.op("f");
    }

    /// Draws every segment of `segments` in one style, as one path (a hatch, say).
    pub(crate) fn segments(
        &mut self,
        segments: &[[[f64; 2]; 2]],
        width_mm: f64,
        level: f64,
        stroke: Stroke,
    ) {
        if segments.is_empty() {
            return;
        }
        self.stroke_state(width_mm, level, stroke);
        for segment in segments {
            self.path(segment, false);
        }
        self.content.op("S");
    }

    pub(crate) fn fill_area(&mut self, area: Area, level: f64) {
        self.fill_polygon(&area.corners(), level);
    }

    pub(crate) fn stroke_area(&mut self, area: Area, width_mm: f64, level: f64) {
        self.stroke_polygon(&area.corners(), width_mm, level, Stroke::Solid);
    }

    /// Saves the graphics state; pair with [`Canvas::restore`].
    pub(crate) fn save(&mut self) {
        self.content.op("q");
    }

    pub(crate) fn restore(&mut self) {
        self.content.op("Q");
    }

    /// Limits drawing to the inside of `points` until the next [`Canvas::restore`].
    pub(crate) fn clip(&mut self, points: &[[f64; 2]]) {
        self.polygon(points, Paint::Clip);
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
        let left = match align {
            Align::Left => x,
            Align::Center => x - width_mm(&text, font, size_pt) / 2.0,
            Align::Right => x - width_mm(&text, font, size_pt),
        };
        self.show(
            &text,
            font,
            size_pt,
            level,
            [1.0, 0.0, 0.0, 1.0, mm_to_pt(left), mm_to_pt(y)],
        );
    }

    /// One line of text turned a quarter turn counter-clockwise, centred on (`x`, `y`) along its length,
    /// baseline at `x`.
    pub(crate) fn text_vertical(&mut self, x: f64, y: f64, text: &str, font: Font, size_pt: f64) {
        let text = printable(text);
        let width = width_mm(&text, font, size_pt);
        let start_y = y - width / 2.0;
        self.show(
            &text,
            font,
            size_pt,
            0.0,
            [0.0, 1.0, -1.0, 0.0, mm_to_pt(x), mm_to_pt(start_y)],
        );
    }

    /// `text` (already printable) with the text matrix `matrix` (its last two entries in points).
    fn show(&mut self, text: &str, font: Font, size_pt: f64, level: f64, matrix: [f64; 6]) {
        if needs_embedded(text) {
            self.embedded.record(font, text);
            self.embedded_text.extend([
                Op::StartTextSection,
                Op::SetFillColor {
                    col: Color::Greyscale(Greyscale::new(level.clamp(0.0, 1.0) as f32, None)),
                },
                Op::SetFont {
                    font: PdfFontHandle::External(font.embedded_id()),
                    size: Pt(size_pt as f32),
                },
                Op::SetTextMatrix {
                    matrix: TextMatrix::Raw(matrix.map(|value| value as f32)),
                },
                Op::ShowText {
                    items: vec![TextItem::Text(text.to_string())],
                },
                Op::EndTextSection,
            ]);
            return;
        }
        self.builtin_used[usize::from(font == Font::Bold)] = true;
        let c = &mut self.content;
        c.op("BT");
        c.level(level);
        c.op("g");
        c.name(font.builtin().get_pdf_id());
        c.pt(size_pt);
        c.op("Tf");
        for value in matrix {
            c.pt(value);
        }
        c.op("Tm");
        if text.is_ascii() {
            // ASCII is its own WinAnsi code.
            c.string(text.bytes());
        } else {
            c.string(text.chars().map(|ch| winansi_code(ch).unwrap_or(b'?')));
        }
        c.op("Tj");
        c.op("ET");
    }

    /// Whether the page shows `text` in a built-in font (for tests).
    #[cfg(test)]
    pub(crate) fn shows_text(&self, text: &str) -> bool {
        let mut wanted = Content::default();
        wanted.string(text.chars().map(|ch| winansi_code(ch).unwrap_or(b'?')));
        let wanted = wanted.into_bytes();
        let shown = self.content.as_bytes();
        shown.windows(wanted.len()).any(|window| window == wanted)
    }
}
