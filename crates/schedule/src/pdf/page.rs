//! Paper sizes and what every page carries: the frame, the cautions and the title block.

use super::canvas::{Align, Area, Canvas};
use super::text::{fit, line_height_mm, wrap, Font};
use crate::Units;

/// Distance from the paper edge to the frame, mm.
const MARGIN_MM: f64 = 8.0;
/// Width of the title block at the right of the footer, mm.
const TITLE_BLOCK_W_MM: f64 = 86.0;
/// Smallest footer height (the title block's own height), mm.
const FOOTER_MIN_H_MM: f64 = 25.0;
/// Type size of the cautions, pt.
const CAUTION_PT: f64 = 7.0;
/// Gap between the frame and the body, mm.
const BODY_PAD_MM: f64 = 4.0;

/// A sheet of paper in one orientation.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Paper {
    pub width_mm: f64,
    pub height_mm: f64,
    pub name: &'static str,
}

impl Paper {
    /// A4 for SI reports, US Letter for imperial ones.
    pub(crate) fn for_units(units: Units, landscape: bool) -> Paper {
        let (short, long, name) = match units {
            Units::Si => (210.0, 297.0, "A4"),
            Units::Imperial => (215.9, 279.4, "Letter"),
        };
        if landscape {
            Paper {
                width_mm: long,
                height_mm: short,
                name,
            }
        } else {
            Paper {
                width_mm: short,
                height_mm: long,
                name,
            }
        }
    }
}

/// What the title block says about the document.
#[derive(Debug, Clone)]
pub(crate) struct TitleInfo {
    pub project: String,
    pub site: String,
    pub date: String,
    pub basis_id: String,
    /// What kind of document this is ("Roof sheathing nailing schedule", "Plan-check report"), printed
    /// in the title block so a page on its own says which document it belongs to.
    pub kind: String,
}

/// The frame of one paper size, with its cautions wrapped once.
#[derive(Debug, Clone)]
pub(crate) struct Frame {
    pub paper: Paper,
    caution_lines: Vec<String>,
    footer_h_mm: f64,
}

impl Frame {
    pub(crate) fn new(paper: Paper, cautions: &[String]) -> Frame {
        let frame_w = paper.width_mm - 2.0 * MARGIN_MM;
        let caution_w = frame_w - TITLE_BLOCK_W_MM - 6.0;
        let caution_lines: Vec<String> = cautions
            .iter()
            .flat_map(|caution| {
                let mut lines = wrap(caution, Font::Regular, CAUTION_PT, caution_w - 3.0);
                if let Some(first) = lines.first_mut() {
                    *first = format!("\u{2022} {first}");
                }
                lines
            })
            .collect();
        let needed = 7.5 + caution_lines.len() as f64 * line_height_mm(CAUTION_PT) + 2.0;
        Frame {
            paper,
            caution_lines,
            footer_h_mm: needed.max(FOOTER_MIN_H_MM),
        }
    }

    fn outer(&self) -> Area {
        Area {
            x: MARGIN_MM,
            y: MARGIN_MM,
            w: self.paper.width_mm - 2.0 * MARGIN_MM,
            h: self.paper.height_mm - 2.0 * MARGIN_MM,
        }
    }

    fn footer(&self) -> Area {
        let outer = self.outer();
        Area {
            x: outer.x,
            y: outer.y,
            w: outer.w,
            h: self.footer_h_mm,
        }
    }

    /// Where a page's content goes: inside the frame, above the footer.
    pub(crate) fn body(&self) -> Area {
        let outer = self.outer();
        let footer = self.footer();
        Area {
            x: outer.x + BODY_PAD_MM,
            y: footer.top() + BODY_PAD_MM,
            w: outer.w - 2.0 * BODY_PAD_MM,
            h: outer.top() - footer.top() - 2.0 * BODY_PAD_MM,
        }
    }

    /// Draws the frame, the cautions and the title block of page `page_number` of `page_count`.
    pub(crate) fn draw(
        &self,
        canvas: &mut Canvas,
        title: &TitleInfo,
        sheet: &str,
        page_number: usize,
        page_count: usize,
    ) {
        let outer = self.outer();
        let footer = self.footer();
        canvas.stroke_area(outer, 0.5, 0.0);
        canvas.line(
            [footer.x, footer.top()],
            [footer.right(), footer.top()],
            0.35,
            0.0,
            super::canvas::Stroke::Solid,
        );

        // Cautions, left of the title block.
        let mut y = footer.top() - 4.5;
        canvas.text(footer.x + 2.5, y, "CAUTIONS", Font::Bold, 7.5, Align::Left);
        y -= line_height_mm(CAUTION_PT) + 0.6;
        for line in &self.caution_lines {
            let indent = if line.starts_with('\u{2022}') {
                2.5
            } else {
                4.7
            };
            canvas.text(
                footer.x + indent,
                y,
                line,
                Font::Regular,
                CAUTION_PT,
                Align::Left,
            );
            y -= line_height_mm(CAUTION_PT);
        }

        // Title block.
        let block = Area {
            x: footer.right() - TITLE_BLOCK_W_MM,
            y: footer.y,
            w: TITLE_BLOCK_W_MM,
            h: footer.h,
        };
        canvas.line(
            [block.x, block.y],
            [block.x, block.top()],
            0.35,
            0.0,
            super::canvas::Stroke::Solid,
        );
        let left = block.x + 2.5;
        let inner_w = block.w - 5.0;
        let mut y = block.top() - 5.0;
        canvas.text(
            left,
            y,
            &fit(&title.project, Font::Bold, 10.0, inner_w),
            Font::Bold,
            10.0,
            Align::Left,
        );
        y -= 4.0;
        canvas.text(
            left,
            y,
            &fit(&title.site, Font::Regular, 7.5, inner_w),
            Font::Regular,
            7.5,
            Align::Left,
        );
        y -= 4.4;
        canvas.text(
            left,
            y,
            &fit(&title.kind, Font::Regular, 7.5, inner_w),
            Font::Regular,
            7.5,
            Align::Left,
        );
        y -= 3.6;
        canvas.text(
            left,
            y,
            &fit(sheet, Font::Bold, 8.5, inner_w),
            Font::Bold,
            8.5,
            Align::Left,
        );
        let bottom = block.y + 2.8;
        let date = format!("date {}   basis {}", title.date, title.basis_id);
        canvas.text(
            left,
            bottom,
            &fit(&date, Font::Regular, 7.5, inner_w - 24.0),
            Font::Regular,
            7.5,
            Align::Left,
        );
        canvas.text(
            block.right() - 2.5,
            bottom,
            &format!("page {page_number} of {page_count}"),
            Font::Bold,
            8.5,
            Align::Right,
        );
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::standard_cautions;

    #[test]
    fn papers_follow_the_units() {
        let a4 = Paper::for_units(Units::Si, true);
        assert_eq!((a4.width_mm, a4.height_mm, a4.name), (297.0, 210.0, "A4"));
        let letter = Paper::for_units(Units::Imperial, false);
        assert_eq!(
            (letter.width_mm, letter.height_mm, letter.name),
            (215.9, 279.4, "Letter")
        );
    }

    #[test]
    fn the_body_sits_inside_the_paper_above_the_footer() {
        for landscape in [true, false] {
            let frame = Frame::new(Paper::for_units(Units::Si, landscape), &standard_cautions());
            let body = frame.body();
            assert!(body.x > 0.0 && body.y > frame.footer().top());
            assert!(body.right() < frame.paper.width_mm && body.top() < frame.paper.height_mm);
            assert!(body.h > 100.0, "room left for content: {body:?}");
        }
    }

    #[test]
    fn many_cautions_make_the_footer_taller() {
        let paper = Paper::for_units(Units::Si, false);
        let few = Frame::new(paper, &standard_cautions());
        let mut cautions = standard_cautions();
        cautions.extend(standard_cautions());
        cautions.extend(standard_cautions());
        let many = Frame::new(paper, &cautions);
        assert!(many.footer().h > few.footer().h);
    }
}
