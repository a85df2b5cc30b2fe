//! The PDF report: crew sheet (page 1), design basis (page 2 on), rafter-line table (after), with the
//! cautions and the title block on every page.
//!
//! Built with printpdf's page operations and the built-in Helvetica faces; a subset of the shipped DejaVu
//! Sans is embedded only when a text needs a character Helvetica lacks ([`embedded`]). No font file is
//! read at run time. Deterministic: the dates come from [`PdfOptions`], and the document id that printpdf
//! draws from its own counter is replaced with the one from the options.

mod bar_chart;
mod canvas;
mod content;
mod crew_notes;
mod crew_pattern;
mod crew_sheet;
mod deflate;
mod design_basis;
mod drawing;
mod eave_marks;
mod embedded;
mod flow;
mod geometry;
mod labels;
mod line_table;
mod page;
mod plan_marks;
mod report;
mod text;

pub use bar_chart::{BarChart, ChartColumn, ChartPanel, ChartRow};
pub use report::{report_pdf, Block, Part, Report};
pub use text::unshowable_chars;

use printpdf::date::{Date, Offset, OffsetDateTime, Time};
use printpdf::{Mm, PdfDocument, PdfPage, PdfParseErrorSeverity, PdfSaveOptions};

use crate::{finite, standard_cautions, Schedule, ScheduleError};
use canvas::Canvas;
use page::{Frame, Paper, TitleInfo};

/// What the PDF needs beyond the schedule; both fixed by the caller so the bytes repeat.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct PdfOptions {
    /// Creation and modification date of the document, `YYYY-MM-DD` (from the project).
    pub creation_date: String,
    /// The document's permanent id, e.g. a hash of the input: 1..=64 printable ASCII characters.
    pub document_id: String,
    /// Pages the crew sheet may take (`--crew-pages`): `Some(1)` puts the nailing pattern, lines nailed
    /// alike grouped, under the plan on page 1; None gives the pattern pages of its own after page 1.
    /// See [`crew_sheet_pages`] for what a schedule needs.
    pub crew_pages: Option<u32>,
}

impl Default for PdfOptions {
    fn default() -> Self {
        PdfOptions {
            creation_date: "2026-01-01".to_string(),
            document_id: "deckhold-schedule".to_string(),
            crew_pages: None,
        }
    }
}

fn is_leap(year: i32) -> bool {
    (year % 4 == 0 && year % 100 != 0) || year % 400 == 0
}

/// `YYYY-MM-DD` as a date at midnight UTC.
fn parse_date(value: &str) -> Result<OffsetDateTime, ScheduleError> {
    let refuse = || ScheduleError::CreationDate {
        value: value.to_string(),
    };
    let bytes = value.as_bytes();
    if bytes.len() != 10 || bytes[4] != b'-' || bytes[7] != b'-' {
        return Err(refuse());
    }
    let number = |range: std::ops::Range<usize>| -> Result<u32, ScheduleError> {
        let part = &value[range];
        if !part.bytes().all(|b| b.is_ascii_digit()) {
            return Err(refuse());
        }
        part.parse().map_err(|_| refuse())
    };
    let (year, month, day) = (number(0..4)?, number(5..7)?, number(8..10)?);
    let year = i32::try_from(year).map_err(|_| refuse())?;
    let days = match month {
        1 | 3 | 5 | 7 | 8 | 10 | 12 => 31,
        4 | 6 | 9 | 11 => 30,
        2 if is_leap(year) => 29,
        2 => 28,
        _ => return Err(refuse()),
    };
    if !(1900..=9999).contains(&year) || day == 0 || day > days {
        return Err(refuse());
    }
    Ok(OffsetDateTime::new_in_offset(
        Date {
            year,
            month: month as u8,
            day: day as u8,
        },
        Time {
            hour: 0,
            minute: 0,
            second: 0,
            millisecond: 0,
        },
        Offset {
            hours: 0,
            minutes: 0,
            seconds: 0,
            milliseconds: 0,
        },
    ))
}

fn check_document_id(value: &str) -> Result<(), ScheduleError> {
    let fine = (1..=64).contains(&value.len()) && value.bytes().all(|b| b.is_ascii_graphic());
    if fine {
        Ok(())
    } else {
        Err(ScheduleError::DocumentId {
            value: value.to_string(),
        })
    }
}

/// Replaces the trailer's `/ID [...]` (printpdf fills it from a process-wide counter) with `id`, twice,
/// as hex strings. The trailer follows the cross-reference table, so no offset moves.
fn set_trailer_id(mut bytes: Vec<u8>, id: &str) -> Result<Vec<u8>, ScheduleError> {
    let missing = || ScheduleError::Pdf("the trailer has no /ID entry".to_string());
    let find =
        |haystack: &[u8], needle: &[u8]| haystack.windows(needle.len()).rposition(|w| w == needle);
    let trailer = find(&bytes, b"trailer").ok_or_else(missing)?;
    let id_start = trailer + find(&bytes[trailer..], b"/ID").ok_or_else(missing)?;
    let open = id_start
        + bytes[id_start..]
            .iter()
            .position(|&b| b == b'[')
            .ok_or_else(missing)?;
    let close = open
        + bytes[open..]
            .iter()
            .position(|&b| b == b']')
            .ok_or_else(missing)?;
    let hex: String = id.bytes().map(|b| format!("{b:02X}")).collect();
    let replacement = format!("[<{hex}><{hex}>]");
    bytes.splice(open..=close, replacement.into_bytes());
    Ok(bytes)
}

/// One finished page body before the frame goes on.
struct Sheet<'f> {
    frame: &'f Frame,
    title: String,
    body: Canvas,
}

/// Every page carries the cautions; a schedule without any still gets the standard ones.
fn cautions_of(schedule: &Schedule) -> Vec<String> {
    if schedule.cautions.is_empty() {
        standard_cautions()
    } else {
        schedule.cautions.clone()
    }
}

/// The PDF report of `schedule`.
pub fn schedule_pdf(schedule: &Schedule, options: &PdfOptions) -> Result<Vec<u8>, ScheduleError> {
    finite::check_all(schedule)?;
    parse_date(&options.creation_date)?;
    check_document_id(&options.document_id)?;

    let cautions = cautions_of(schedule);
    let units = schedule.basis.units;
    let landscape = Frame::new(Paper::for_units(units, true), &cautions);
    let portrait = Frame::new(Paper::for_units(units, false), &cautions);

    let basis_pages = design_basis::design_basis(schedule, &portrait);
    let table_pages = line_table::line_table(schedule, &portrait);
    let pattern = crew_pattern::pattern_rows(schedule);
    let crew = crew_sheet::crew_sheet(
        schedule,
        &landscape,
        &crew_sheet::CrewLayout {
            pattern: &pattern,
            crew_pages: options.crew_pages,
            basis_pages: basis_pages.len(),
        },
    );

    let mut sheets: Vec<Sheet> = crew
        .into_iter()
        .enumerate()
        .map(|(index, body)| Sheet {
            frame: &landscape,
            title: if index == 0 {
                "Crew sheet".to_string()
            } else {
                "Crew sheet, lines nailed alike grouped".to_string()
            },
            body,
        })
        .collect();
    sheets.extend(basis_pages.into_iter().map(|body| Sheet {
        frame: &portrait,
        title: "Design basis".to_string(),
        body,
    }));
    sheets.extend(table_pages.into_iter().map(|body| Sheet {
        frame: &portrait,
        title: "Rafter-line table".to_string(),
        body,
    }));

    let title = TitleInfo {
        project: schedule.project.name.clone(),
        site: schedule.project.site.clone(),
        date: schedule.project.date.clone(),
        basis_id: schedule.basis.id.clone(),
        kind: SCHEDULE_KIND.to_string(),
    };
    document_bytes(
        sheets,
        &title,
        &DocumentInfo {
            title: format!("{SCHEDULE_KIND}: {}", schedule.project.name),
            author: schedule.project.prepared_by.clone(),
            subject: format!("{}; {}", schedule.project.site, schedule.basis.title),
        },
        options,
    )
}

/// The schedule's kind of document, in its title block and metadata title.
const SCHEDULE_KIND: &str = "Roof sheathing nailing schedule";

/// How many pages the crew sheet of `schedule` takes with `options` (page 1 and the nailing pattern):
/// the caller warns when this is more than `options.crew_pages` asked for. The pattern is never cut
/// short to fit.
pub fn crew_sheet_pages(schedule: &Schedule, options: &PdfOptions) -> usize {
    crew_sheet_alone(schedule, options).len()
}

/// The crew sheet's pages on their own, laid out as `options` ask.
fn crew_sheet_alone(schedule: &Schedule, options: &PdfOptions) -> Vec<Canvas> {
    let landscape = Frame::new(
        Paper::for_units(schedule.basis.units, true),
        &cautions_of(schedule),
    );
    let pattern = crew_pattern::pattern_rows(schedule);
    crew_sheet::crew_sheet(
        schedule,
        &landscape,
        &crew_sheet::CrewLayout {
            pattern: &pattern,
            crew_pages: options.crew_pages,
            basis_pages: 0,
        },
    )
}

/// One piece of text set on the crew sheet's plan drawing and the box it takes, mm from the page's
/// lower-left corner.
#[derive(Debug, Clone, PartialEq)]
pub struct PlanLabelBox {
    /// The text (a label's lines joined by " / ").
    pub text: String,
    pub x_mm: f64,
    pub y_mm: f64,
    pub w_mm: f64,
    pub h_mm: f64,
}

/// Every label on the crew sheet's plan (line numbers, dimensions, the scale bar, plane names, zone
/// labels and the roof-line table) with its box, as `options` lay the sheet out: for checks that no
/// two of them overlap.
pub fn plan_label_boxes(schedule: &Schedule, options: &PdfOptions) -> Vec<PlanLabelBox> {
    let pages = crew_sheet_alone(schedule, options);
    pages
        .first()
        .map(|page| {
            page.plan_labels()
                .iter()
                .map(|(text, area)| PlanLabelBox {
                    text: text.clone(),
                    x_mm: area.x,
                    y_mm: area.y,
                    w_mm: area.w,
                    h_mm: area.h,
                })
                .collect()
        })
        .unwrap_or_default()
}

/// The document's metadata.
struct DocumentInfo {
    title: String,
    author: String,
    subject: String,
}

/// Frames every sheet (cautions, title block, page n of N) and writes the document, dated and with
/// the id from `options` so the same input gives the same bytes.
fn document_bytes(
    sheets: Vec<Sheet>,
    title: &TitleInfo,
    document: &DocumentInfo,
    options: &PdfOptions,
) -> Result<Vec<u8>, ScheduleError> {
    let about = document;
    let date = parse_date(&options.creation_date)?;
    check_document_id(&options.document_id)?;
    let page_count = sheets.len();
    let mut embedded_chars = embedded::EmbeddedChars::default();
    let mut contents: Vec<Vec<u8>> = Vec::with_capacity(page_count);
    let pages: Vec<PdfPage> = sheets
        .into_iter()
        .enumerate()
        .map(|(index, sheet)| {
            let mut canvas = sheet.body;
            sheet
                .frame
                .draw(&mut canvas, title, &sheet.title, index + 1, page_count);
            let paper = sheet.frame.paper;
            embedded_chars.merge(canvas.embedded_chars());
            let parts = canvas.into_parts();
            contents.push(parts.content);
            PdfPage::new(
                Mm(paper.width_mm as f32),
                Mm(paper.height_mm as f32),
                parts.ops,
            )
        })
        .collect();

    let mut document = PdfDocument::new(&about.title);
    let info = &mut document.metadata.info;
    info.creation_date = date;
    info.modification_date = date;
    info.metadata_date = date;
    info.author = about.author.clone();
    info.creator = "deckhold".to_string();
    info.producer = "deckhold-schedule with printpdf".to_string();
    info.subject = about.subject.clone();
    info.identifier = options.document_id.clone();
    document.with_pages(pages);
    embedded::add_subsets(&mut document, &embedded_chars)?;

    // `optimize: false`: printpdf would deflate every stream at the best (slowest) level, most of
    // the writer's time; [`deflate::compress_streams`] does it at a fast level instead.
    let save_options = PdfSaveOptions {
        optimize: false,
        subset_fonts: false,
        secure: true,
        image_optimization: None,
    };
    let mut warnings = Vec::new();
    let mut lo_document = document.to_lopdf_document(&save_options, &mut warnings);
    if let Some(error) = warnings
        .iter()
        .find(|w| w.severity == PdfParseErrorSeverity::Error)
    {
        return Err(ScheduleError::Pdf(error.msg.clone()));
    }
    put_contents(&mut lo_document, contents)?;
    deflate::compress_streams(&mut lo_document)?;
    let mut bytes = Vec::new();
    lo_document
        .save_to(&mut bytes)
        .map_err(|error| ScheduleError::Pdf(error.to_string()))?;
    set_trailer_id(bytes, &options.document_id)
}

/// Puts each page's own content stream (shapes and built-in text, [`canvas::PageParts`]) in front of
/// what printpdf wrote for the page (its font selections and the embedded-face text), in page order.
fn put_contents(
    document: &mut lopdf::Document,
    contents: Vec<Vec<u8>>,
) -> Result<(), ScheduleError> {
    let fail = |what: &str| ScheduleError::Pdf(format!("page content: {what}"));
    let pages = document.get_pages();
    if pages.len() != contents.len() {
        return Err(fail("the document has a different number of pages"));
    }
    for (page_id, mut content) in pages.into_values().zip(contents) {
        let stream_id = document
            .get_dictionary(page_id)
            .and_then(|page| page.get(b"Contents"))
            .and_then(lopdf::Object::as_reference)
            .map_err(|_| fail("a page has no content stream"))?;
        let stream = document
            .get_object_mut(stream_id)
            .and_then(lopdf::Object::as_stream_mut)
            .map_err(|_| fail("a page's content is not a stream"))?;
        content.extend_from_slice(&stream.content);
        stream.set_content(content);
    }
    Ok(())
}

#[cfg(test)]
mod tests;
