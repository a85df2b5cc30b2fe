//! Content that runs from page to page: headings, paragraphs, bullet lists and tables whose header
//! repeats on every page and whose row groups stay together when they can.

use super::canvas::{Align, Area, Canvas, Stroke};
use super::page::Frame;
use super::text::{line_height_mm, wrap, Font};

/// Padding inside a table cell, mm.
const CELL_PAD_MM: f64 = 1.2;

/// A table column: its title, its share of the body width and how its cells align.
#[derive(Debug, Clone)]
pub(crate) struct Column {
    pub title: String,
    pub share: f64,
    pub align: Align,
}

impl Column {
    pub(crate) fn new(title: &str, share: f64, align: Align) -> Column {
        Column {
            title: title.to_string(),
            share,
            align,
        }
    }
}

/// A table row: one text per column, optionally bold, optionally followed by a full-width note.
#[derive(Debug, Clone, Default)]
pub(crate) struct Row {
    pub cells: Vec<String>,
    pub bold: bool,
    pub note: Option<String>,
}

impl Row {
    pub(crate) fn new(cells: Vec<String>) -> Row {
        Row {
            cells,
            bold: false,
            note: None,
        }
    }
}

/// A row laid out: its wrapped cell lines, note lines and height.
struct LaidRow {
    cells: Vec<Vec<String>>,
    note: Vec<String>,
    bold: bool,
    height: f64,
}

/// The pages of one part of the report, filled top to bottom.
#[derive(Debug)]
pub(crate) struct Flow<'f> {
    frame: &'f Frame,
    /// Where the first page's content goes when it shares the page with other content (the crew sheet's
    /// pattern table under the plan); None: the frame's whole body. Later pages always use the body.
    first_area: Option<Area>,
    pages: Vec<Canvas>,
    /// Top of the free space on the current page, mm from the paper's bottom.
    y: f64,
    /// A heading waiting for what follows it, so the two start on the same page.
    pending_heading: Option<String>,
}

/// How a table looks.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) struct TableLook {
    /// Shade every other row group.
    pub zebra: bool,
    /// Print the column titles (and repeat them on every page).
    pub header: bool,
}

impl<'f> Flow<'f> {
    pub(crate) fn new(frame: &'f Frame) -> Flow<'f> {
        Flow {
            frame,
            first_area: None,
            pages: vec![Canvas::new()],
            y: frame.body().top(),
            pending_heading: None,
        }
    }

    /// A flow that starts in `area` of a page drawn by someone else, and goes on over whole pages.
    pub(crate) fn within(frame: &'f Frame, area: Area) -> Flow<'f> {
        Flow {
            first_area: Some(area),
            y: area.top(),
            ..Flow::new(frame)
        }
    }

    fn body(&self) -> Area {
        match self.first_area {
            Some(area) if self.pages.len() <= 1 => area,
            _ => self.frame.body(),
        }
    }

    /// Pages begun so far, and the top of the free space on the last one (mm from the paper's bottom).
    pub(crate) fn position(&self) -> (usize, f64) {
        (self.pages.len(), self.y)
    }

    fn canvas(&mut self) -> &mut Canvas {
        if self.pages.is_empty() {
            self.pages.push(Canvas::new());
        }
        let last = self.pages.len() - 1;
        &mut self.pages[last]
    }

    fn at_top(&self) -> bool {
        (self.y - self.body().top()).abs() < 1e-9
    }

    fn room(&self) -> f64 {
        self.y - self.body().y
    }

    pub(crate) fn new_page(&mut self) {
        self.pages.push(Canvas::new());
        self.y = self.body().top();
    }

    /// Starts a new page unless `height_mm` still fits on this one.
    fn ensure(&mut self, height_mm: f64) {
        if self.room() < height_mm && !self.at_top() {
            self.new_page();
        }
    }

    pub(crate) fn gap(&mut self, height_mm: f64) {
        self.y -= height_mm;
    }

    /// Lines of text at the left of the body, wrapped to its width.
    fn lines(&mut self, lines: &[String], font: Font, size_pt: f64, indent_mm: f64, level: f64) {
        let line_h = line_height_mm(size_pt);
        let x = self.body().x + indent_mm;
        for line in lines {
            self.ensure(line_h);
            let baseline = self.y - line_h * 0.8;
            self.canvas()
                .text_grey(x, baseline, line, font, size_pt, Align::Left, level);
            self.y -= line_h;
        }
    }

    /// The large title of a part.
    pub(crate) fn title(&mut self, text: &str) {
        let width = self.body().w;
        let lines = wrap(text, Font::Bold, 14.0, width);
        self.ensure(line_height_mm(14.0) * lines.len() as f64 + 20.0);
        self.lines(&lines, Font::Bold, 14.0, 0.0, 0.0);
        self.gap(1.5);
    }

    /// A section heading; it is drawn with the start of what follows, on the same page.
    pub(crate) fn heading(&mut self, text: &str) {
        self.flush_heading(0.0);
        self.pending_heading = Some(text.to_string());
    }

    /// Draws a waiting heading, first moving to a new page unless it and `next_mm` of content fit here.
    fn flush_heading(&mut self, next_mm: f64) {
        let Some(text) = self.pending_heading.take() else {
            return;
        };
        let width = self.body().w;
        let lines = wrap(&text, Font::Bold, 10.5, width);
        let heading_h = 2.5 + line_height_mm(10.5) * lines.len() as f64 + 2.0;
        self.ensure(heading_h + next_mm);
        if !self.at_top() {
            self.gap(2.5);
        }
        self.lines(&lines, Font::Bold, 10.5, 0.0, 0.0);
        let y = self.y - 0.6;
        let body = self.body();
        self.canvas()
            .line([body.x, y], [body.right(), y], 0.3, 0.0, Stroke::Solid);
        self.gap(2.0);
    }

    pub(crate) fn paragraph(&mut self, text: &str, size_pt: f64) {
        let lines = wrap(text, Font::Regular, size_pt, self.body().w);
        self.flush_heading(line_height_mm(size_pt) * lines.len().min(3) as f64);
        self.lines(&lines, Font::Regular, size_pt, 0.0, 0.0);
        self.gap(1.0);
    }

    pub(crate) fn bold_paragraph(&mut self, text: &str, size_pt: f64) {
        let lines = wrap(text, Font::Bold, size_pt, self.body().w);
        self.flush_heading(line_height_mm(size_pt) * lines.len().min(3) as f64);
        self.lines(&lines, Font::Bold, size_pt, 0.0, 0.0);
        self.gap(1.0);
    }

    pub(crate) fn bullets(&mut self, items: &[String], size_pt: f64) {
        let width = self.body().w - 4.0;
        self.flush_heading(line_height_mm(size_pt) * 2.0);
        for item in items {
            let mut lines = wrap(item, Font::Regular, size_pt, width);
            if lines.is_empty() {
                continue;
            }
            let rest = lines.split_off(1);
            self.lines(
                &[format!("\u{2022}  {}", lines[0])],
                Font::Regular,
                size_pt,
                0.0,
                0.0,
            );
            self.lines(&rest, Font::Regular, size_pt, 3.2, 0.0);
            self.gap(0.4);
        }
        self.gap(0.6);
    }

    fn layout(&self, columns: &[Column], row: &Row, size_pt: f64) -> LaidRow {
        let body = self.body();
        let font = if row.bold { Font::Bold } else { Font::Regular };
        let cells: Vec<Vec<String>> = columns
            .iter()
            .enumerate()
            .map(|(i, column)| {
                let text = row.cells.get(i).map(String::as_str).unwrap_or("");
                wrap(
                    text,
                    font,
                    size_pt,
                    column.share * body.w - 3.0 * CELL_PAD_MM,
                )
            })
            .collect();
        let note_pt = size_pt - 1.0;
        let note = row
            .note
            .as_deref()
            .map(|text| {
                wrap(
                    text,
                    Font::Regular,
                    note_pt,
                    body.w - 2.0 * CELL_PAD_MM - 4.0,
                )
            })
            .unwrap_or_default();
        let line_count = cells.iter().map(Vec::len).max().unwrap_or(0).max(1);
        let height = line_count as f64 * line_height_mm(size_pt)
            + note.len() as f64 * line_height_mm(note_pt)
            + 2.0 * CELL_PAD_MM * 0.8;
        LaidRow {
            cells,
            note,
            bold: row.bold,
            height,
        }
    }

    fn draw_row(&mut self, columns: &[Column], row: &LaidRow, size_pt: f64, shade: Option<f64>) {
        let body = self.body();
        let top = self.y;
        if let Some(level) = shade {
            self.canvas().fill_area(
                Area {
                    x: body.x,
                    y: top - row.height,
                    w: body.w,
                    h: row.height,
                },
                level,
            );
        }
        let font = if row.bold { Font::Bold } else { Font::Regular };
        let line_h = line_height_mm(size_pt);
        let mut x = body.x;
        for (column, lines) in columns.iter().zip(&row.cells) {
            let w = column.share * body.w;
            let anchor = match column.align {
                Align::Left => x + 2.0 * CELL_PAD_MM,
                Align::Center => x + w / 2.0,
                Align::Right => x + w - CELL_PAD_MM,
            };
            let mut baseline = top - CELL_PAD_MM * 0.8 - line_h * 0.8;
            for line in lines {
                self.canvas()
                    .text(anchor, baseline, line, font, size_pt, column.align);
                baseline -= line_h;
            }
            x += w;
        }
        let note_pt = size_pt - 1.0;
        let cells_h = row.cells.iter().map(Vec::len).max().unwrap_or(0).max(1) as f64 * line_h;
        let mut baseline = top - CELL_PAD_MM * 0.8 - cells_h - line_height_mm(note_pt) * 0.8;
        for line in &row.note {
            self.canvas().text_grey(
                body.x + CELL_PAD_MM + 4.0,
                baseline,
                line,
                Font::Regular,
                note_pt,
                Align::Left,
                0.3,
            );
            baseline -= line_height_mm(note_pt);
        }
        self.y -= row.height;
    }

    fn draw_header(&mut self, columns: &[Column], size_pt: f64) {
        let header = Row {
            cells: columns.iter().map(|c| c.title.clone()).collect(),
            bold: true,
            note: None,
        };
        let laid = self.layout(columns, &header, size_pt);
        self.draw_row(columns, &laid, size_pt, Some(0.88));
        let body = self.body();
        let y = self.y;
        self.canvas()
            .line([body.x, y], [body.right(), y], 0.35, 0.0, Stroke::Solid);
    }

    /// A table of row groups; a group moves whole to the next page when it fits on one, and the header
    /// (when shown) repeats at the top of every page the table reaches.
    pub(crate) fn table(
        &mut self,
        columns: &[Column],
        groups: &[Vec<Row>],
        size_pt: f64,
        look: TableLook,
    ) {
        let header = Row {
            cells: columns.iter().map(|c| c.title.clone()).collect(),
            bold: true,
            note: None,
        };
        let header_h = if look.header {
            self.layout(columns, &header, size_pt).height
        } else {
            0.0
        };
        let full_page = self.body().h;
        let first_group_h: f64 = groups
            .first()
            .map(|group| {
                group
                    .iter()
                    .map(|row| self.layout(columns, row, size_pt).height)
                    .sum()
            })
            .unwrap_or(0.0);
        let start_h = header_h + first_group_h.min(full_page / 2.0);
        if self.pending_heading.is_some() {
            self.flush_heading(start_h);
        } else {
            self.ensure(start_h);
        }
        let new_page = |flow: &mut Flow| {
            flow.new_page();
            if look.header {
                flow.draw_header(columns, size_pt);
            }
        };
        if look.header {
            self.draw_header(columns, size_pt);
        }
        for (index, group) in groups.iter().enumerate() {
            let laid: Vec<LaidRow> = group
                .iter()
                .map(|row| self.layout(columns, row, size_pt))
                .collect();
            let group_h: f64 = laid.iter().map(|row| row.height).sum();
            if group_h > self.room() && group_h <= full_page - header_h {
                new_page(self);
            }
            let shade = (look.zebra && index % 2 == 1).then_some(0.95);
            for row in &laid {
                if row.height > self.room() {
                    new_page(self);
                }
                self.draw_row(columns, row, size_pt, shade);
            }
            let body = self.body();
            let y = self.y;
            self.canvas()
                .line([body.x, y], [body.right(), y], 0.12, 0.55, Stroke::Solid);
        }
        self.gap(1.5);
    }

    /// A drawing `height_mm` tall across the body (on the next page unless it fits here, together with a
    /// waiting heading); `draw` gets the area to fill.
    pub(crate) fn figure(&mut self, height_mm: f64, draw: impl FnOnce(&mut Canvas, Area)) {
        self.flush_heading(height_mm);
        self.ensure(height_mm);
        let body = self.body();
        let area = Area {
            x: body.x,
            y: self.y - height_mm,
            w: body.w,
            h: height_mm,
        };
        draw(self.canvas(), area);
        self.gap(height_mm + 1.5);
    }

    pub(crate) fn finish(mut self) -> Vec<Canvas> {
        self.flush_heading(0.0);
        self.pages
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::pdf::page::Paper;
    use crate::{standard_cautions, Units};

    fn frame() -> Frame {
        Frame::new(Paper::for_units(Units::Si, false), &standard_cautions())
    }

    #[test]
    fn a_long_table_runs_onto_more_pages() {
        let frame = frame();
        let columns = [
            Column::new("a", 0.5, Align::Left),
            Column::new("b", 0.5, Align::Right),
        ];
        let groups: Vec<Vec<Row>> = (0..300)
            .map(|i| vec![Row::new(vec![format!("row {i}"), "x".to_string()])])
            .collect();
        let mut flow = Flow::new(&frame);
        flow.table(
            &columns,
            &groups,
            8.0,
            TableLook {
                zebra: true,
                header: true,
            },
        );
        assert!(flow.finish().len() >= 5);
    }

    /// True when the page draws `text`.
    fn page_shows(page: Canvas, text: &str) -> bool {
        page.shows_text(text)
    }

    #[test]
    fn a_heading_never_ends_a_page() {
        let frame = frame();
        let mut flow = Flow::new(&frame);
        flow.paragraph("filler", 9.0);
        // Leave room for the heading alone (its height as flush_heading reckons it, plus 1 mm) but not for
        // the heading and the table's header and first row: kept with what follows, it moves to page 2.
        let heading_mm = 2.5 + line_height_mm(10.5) + 2.0;
        let room_mm = flow.room();
        flow.gap(room_mm - (heading_mm + 1.0));
        flow.heading("A heading");
        let columns = [Column::new("a", 1.0, Align::Left)];
        flow.table(
            &columns,
            &[vec![Row::new(vec!["row".to_string()])]],
            8.0,
            TableLook {
                zebra: false,
                header: true,
            },
        );
        let mut pages = flow.finish();
        assert_eq!(pages.len(), 2);
        let second = pages.pop().expect("page 2");
        let first = pages.pop().expect("page 1");
        assert!(page_shows(second, "A heading"), "the heading is on page 2");
        assert!(
            !page_shows(first, "A heading"),
            "page 1 does not end with it"
        );
    }

    #[test]
    fn a_short_paragraph_stays_on_one_page() {
        let frame = frame();
        let mut flow = Flow::new(&frame);
        flow.title("Design basis");
        flow.paragraph("One short paragraph.", 9.0);
        assert_eq!(flow.finish().len(), 1);
    }
}
