//! A plain report PDF (headings, paragraphs, bullet lists, tables) in the schedule's frame: cautions and
//! title block on every page. Used for the plan-check report, whose first page a reviewer signs off.

use super::bar_chart::BarChart;
use super::canvas::Align;
use super::flow::{Column, Flow, Row, TableLook};
use super::page::{Frame, Paper, TitleInfo};
use super::{document_bytes, DocumentInfo, PdfOptions, Sheet};
use crate::{standard_cautions, ScheduleError, Units};

/// One block of a report page.
#[derive(Debug, Clone, PartialEq)]
pub enum Block {
    Heading(String),
    Paragraph(String),
    /// A paragraph in bold (a verdict).
    Strong(String),
    Bullets(Vec<String>),
    /// Column titles with their shares of the width, then the rows.
    Table {
        columns: Vec<(String, f64)>,
        rows: Vec<Vec<String>>,
    },
    /// Bars per candidate, one panel per measure.
    Chart(BarChart),
}

/// One part of the report: starts on a new page, its pages titled `sheet`.
#[derive(Debug, Clone, PartialEq)]
pub struct Part {
    pub sheet: String,
    pub blocks: Vec<Block>,
}

/// The whole report.
#[derive(Debug, Clone, PartialEq)]
pub struct Report {
    /// The document title (PDF metadata and first heading).
    pub title: String,
    /// The kind of document ("Plan-check report"), printed in every page's title block.
    pub kind: String,
    pub project: String,
    pub site: String,
    pub date: String,
    pub basis_id: String,
    pub prepared_by: String,
    pub units: Units,
    /// Printed on every page; the standard ones when empty.
    pub cautions: Vec<String>,
    pub parts: Vec<Part>,
}

const BODY_PT: f64 = 9.0;
const TABLE_PT: f64 = 8.0;

/// The report as PDF bytes.
pub fn report_pdf(report: &Report, options: &PdfOptions) -> Result<Vec<u8>, ScheduleError> {
    let cautions = if report.cautions.is_empty() {
        standard_cautions()
    } else {
        report.cautions.clone()
    };
    let frame = Frame::new(Paper::for_units(report.units, false), &cautions);
    let mut sheets = Vec::new();
    for part in &report.parts {
        let mut flow = Flow::new(&frame);
        for block in &part.blocks {
            match block {
                Block::Heading(text) => flow.heading(text),
                Block::Paragraph(text) => flow.paragraph(text, BODY_PT),
                Block::Strong(text) => flow.bold_paragraph(text, BODY_PT + 1.0),
                Block::Bullets(items) => flow.bullets(items, BODY_PT),
                Block::Chart(chart) => {
                    flow.figure(chart.height_mm(), |canvas, area| chart.draw(canvas, area))
                }
                Block::Table { columns, rows } => {
                    let columns: Vec<Column> = columns
                        .iter()
                        .map(|(title, share)| Column::new(title, *share, Align::Left))
                        .collect();
                    let groups: Vec<Vec<Row>> = rows
                        .iter()
                        .map(|cells| vec![Row::new(cells.clone())])
                        .collect();
                    flow.table(
                        &columns,
                        &groups,
                        TABLE_PT,
                        TableLook {
                            zebra: true,
                            header: true,
                        },
                    );
                }
            }
        }
        for body in flow.finish() {
            sheets.push(Sheet {
                frame: &frame,
                title: part.sheet.clone(),
                body,
            });
        }
    }
    let title = TitleInfo {
        project: report.project.clone(),
        site: report.site.clone(),
        date: report.date.clone(),
        basis_id: report.basis_id.clone(),
        kind: report.kind.clone(),
    };
    let about = DocumentInfo {
        title: report.title.clone(),
        author: report.prepared_by.clone(),
        subject: format!("{}; {}", report.site, report.basis_id),
    };
    document_bytes(sheets, &title, &about, options)
}
