//! The engineer's line table: one row group per nailing pattern ("lines 4-11, 14-27"), stretch by
//! stretch, with its zone, support role, spacing and the highest utilization any line of the group has
//! there. Lines nailed alike are grouped by [`crate::line_groups`], the same grouping the crew sheet
//! uses, so a house needs a page or two and a warehouse a few, where one row group per line took
//! hundreds of pages. Every line's own position and stretches stay in `rafter-lines.csv`.

use super::canvas::{Align, Canvas};
use super::flow::{Column, Flow, Row, TableLook};
use super::page::Frame;
use crate::format::{feet_inches, fixed, places, spacing_label};
use crate::line_groups::{group_lines, runs_text, LineGroup};
use crate::{Schedule, Units};

/// A plan or slope length in the report's units: feet-inches, or metres.
fn length(m: f64, imperial: bool) -> String {
    if imperial {
        feet_inches(m)
    } else {
        fixed(m, places::LENGTH_M)
    }
}

/// The rows of one group: the first names the lines, their kind and length; one row per stretch.
fn group_rows(group: &LineGroup, imperial: bool) -> Vec<Row> {
    let head = |first: bool| {
        if first {
            [
                runs_text(&group.numbers),
                group.kind.to_string(),
                length(group.length_m, imperial),
            ]
        } else {
            [String::new(), String::new(), String::new()]
        }
    };
    let mut rows: Vec<Row> = group
        .stretches
        .iter()
        .enumerate()
        .map(|(i, stretch)| {
            let [lines, kind, long] = head(i == 0);
            Row {
                cells: vec![
                    lines,
                    kind,
                    long,
                    length(stretch.from_m, imperial),
                    length(stretch.to_m, imperial),
                    stretch.zone_label.to_string(),
                    stretch.support_role.to_string(),
                    spacing_label(stretch.spacing_mm, imperial),
                    fixed(stretch.utilization, places::UTILIZATION),
                ],
                bold: stretch.spacing_mm.is_none(),
                note: None,
            }
        })
        .collect();
    if rows.is_empty() {
        let [lines, kind, long] = head(true);
        rows.push(Row::new(vec![
            lines,
            kind,
            long,
            String::new(),
            String::new(),
            "(no segments)".to_string(),
        ]));
    }
    rows
}

/// Lays out the line table pages.
pub(crate) fn line_table(schedule: &Schedule, frame: &Frame) -> Vec<Canvas> {
    let imperial = schedule.basis.units == Units::Imperial;
    let unit = if imperial { "ft-in" } else { "m" };
    let member = &schedule.framing_member;
    let mut flow = Flow::new(frame);
    flow.title(&format!("{} LINE TABLE", member.to_uppercase()));
    flow.paragraph(
        &format!(
            "Each {member} line from its low end along the slope: the stretches by zone and support role, and the \
             largest spacing of the nails along that stretch. Lines nailed alike (same kind, and the same \
             stretches with the same zone, support and spacing) share one row group; its utilization is the highest of its \
             lines on that stretch. Each line's position and stretches are in rafter-lines.csv."
        ),
        8.5,
    );
    let columns = [
        Column::new("lines", 0.20, Align::Left),
        Column::new("kind", 0.09, Align::Left),
        Column::new(&format!("length {unit}"), 0.09, Align::Right),
        Column::new(&format!("from {unit}"), 0.09, Align::Right),
        Column::new(&format!("to {unit}"), 0.09, Align::Right),
        Column::new("zone", 0.15, Align::Left),
        Column::new("support", 0.11, Align::Left),
        Column::new("spacing", 0.10, Align::Right),
        Column::new("util.", 0.08, Align::Right),
    ];
    let groups: Vec<Vec<Row>> = group_lines(&schedule.lines)
        .iter()
        .map(|group| group_rows(group, imperial))
        .collect();
    if groups.is_empty() {
        flow.paragraph("The schedule lists no framing lines.", 9.0);
    } else {
        flow.table(
            &columns,
            &groups,
            7.5,
            TableLook {
                zebra: true,
                header: true,
            },
        );
    }
    flow.finish()
}
