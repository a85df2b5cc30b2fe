//! The rafter-line table: every framing line, stretch by stretch, with its zone, support role and
//! spacing, on as many pages as it takes.

use super::canvas::{Align, Canvas};
use super::flow::{Column, Flow, Row, TableLook};
use super::page::Frame;
use crate::format::{feet_inches, fixed, places, spacing_label};
use crate::{Schedule, Units};

/// A plan or slope length in the report's units: feet-inches, or metres.
fn length(m: f64, imperial: bool) -> String {
    if imperial {
        feet_inches(m)
    } else {
        fixed(m, places::LENGTH_M)
    }
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
             largest spacing of the nails along that stretch. Position: the line's plan coordinate."
        ),
        8.5,
    );
    let columns = [
        Column::new("line", 0.07, Align::Right),
        Column::new(&format!("position {unit}"), 0.12, Align::Right),
        Column::new(&format!("length {unit}"), 0.12, Align::Right),
        Column::new(&format!("from {unit}"), 0.11, Align::Right),
        Column::new(&format!("to {unit}"), 0.11, Align::Right),
        Column::new("zone", 0.16, Align::Left),
        Column::new("support", 0.11, Align::Left),
        Column::new("spacing", 0.12, Align::Right),
        Column::new("util.", 0.08, Align::Right),
    ];
    let groups: Vec<Vec<Row>> = schedule
        .lines
        .iter()
        .map(|line| {
            let mut rows: Vec<Row> = line
                .segments
                .iter()
                .enumerate()
                .map(|(i, segment)| {
                    let first = i == 0;
                    Row {
                        cells: vec![
                            if first {
                                line.number.to_string()
                            } else {
                                String::new()
                            },
                            if first {
                                length(line.position_m, imperial)
                            } else {
                                String::new()
                            },
                            if first {
                                length(line.length_m, imperial)
                            } else {
                                String::new()
                            },
                            length(segment.from_m, imperial),
                            length(segment.to_m, imperial),
                            segment.zone_label.to_string(),
                            segment.support_role.to_string(),
                            spacing_label(segment.spacing_mm, imperial),
                            fixed(segment.utilization, places::UTILIZATION),
                        ],
                        bold: segment.spacing_mm.is_none(),
                        note: None,
                    }
                })
                .collect();
            if rows.is_empty() {
                rows.push(Row::new(vec![
                    line.number.to_string(),
                    length(line.position_m, imperial),
                    length(line.length_m, imperial),
                    String::new(),
                    String::new(),
                    "(no segments)".to_string(),
                ]));
            }
            rows
        })
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
