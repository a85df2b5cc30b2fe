//! The crew's nailing pattern along the framing lines: one row per group of lines nailed alike
//! ([`crate::line_groups`]), with the member's kind and the marks up the slope where the spacing
//! changes, in the report's units. It goes under the plan on the crew sheet (`--crew-pages 1`) or on the
//! crew sheet's own next page.

use super::canvas::Align;
use super::flow::{Column, Flow, Row, TableLook};
use crate::format::{feet_inches, fixed, inches_fraction, mm_to_in, places};
use crate::line_groups::{group_lines, runs_text};
use crate::{LineKind, Schedule, SegmentRow};

/// Type size of the pattern table, pt.
pub(crate) const PATTERN_PT: f64 = 7.0;

/// One row of the crew's pattern: the lines, what they are, and the spacing up to each mark.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct PatternRow {
    pub numbers: Vec<u32>,
    pub kind: LineKind,
    pub marks: String,
}

/// The spacing along one line, up to each mark where it changes, measured up the slope from the line's
/// eave end: "75 to 1.57, 150 to 2.44, ... 75 to 5.80 (top)" (the units are in the column title: mm o.c.
/// and m, or in o.c. and feet-inches). Stretches with the same spacing are one (the crew only sees the
/// spacing change); a stretch where the line has no deck reads "no deck to ...". A mark is where the
/// nailing changes, so the crew sets out the spacing there.
pub(crate) fn marks_text(stretches: &[SegmentRow], imperial: bool) -> String {
    let mut runs: Vec<(Option<f64>, f64, f64)> = Vec::new();
    for stretch in stretches {
        if let Some(last) = runs.last_mut() {
            let touching = (stretch.from_m - last.2).abs() < 0.0005;
            if touching && last.0 == stretch.spacing_mm {
                last.2 = stretch.to_m;
                continue;
            }
        }
        runs.push((stretch.spacing_mm, stretch.from_m, stretch.to_m));
    }
    let mark = |m: f64| {
        if imperial {
            feet_inches(m)
        } else {
            fixed(m, 2)
        }
    };
    let mut parts: Vec<String> = Vec::new();
    let mut reached_m = 0.0;
    for (index, (spacing_mm, from_m, to_m)) in runs.iter().enumerate() {
        if from_m - reached_m > 0.0005 {
            parts.push(format!("no deck to {}", mark(*from_m)));
        }
        let spacing = match spacing_mm {
            Some(mm) if imperial => inches_fraction(mm_to_in(*mm)),
            Some(mm) => fixed(*mm, places::SPACING_MM),
            None => "NO WORKING SPACING".to_string(),
        };
        let end = if index + 1 == runs.len() {
            " (top)"
        } else {
            ""
        };
        parts.push(format!("{spacing} to {}{end}", mark(*to_m)));
        reached_m = *to_m;
    }
    parts.join(", ")
}

/// The crew's rows: lines grouped by pattern; groups the crew cannot tell apart (same kind, same
/// spacings to the same marks, differing only in zone or support role) share a row.
pub(crate) fn pattern_rows(schedule: &Schedule) -> Vec<PatternRow> {
    let imperial = schedule.basis.units.is_us();
    let mut rows: Vec<PatternRow> = Vec::new();
    for group in group_lines(&schedule.lines) {
        let marks = marks_text(&group.stretches, imperial);
        match rows
            .iter_mut()
            .find(|row| row.kind == group.kind && row.marks == marks)
        {
            Some(row) => {
                row.numbers.extend(&group.numbers);
                row.numbers.sort_unstable();
            }
            None => rows.push(PatternRow {
                numbers: group.numbers,
                kind: group.kind,
                marks,
            }),
        }
    }
    rows
}

/// The pattern table into `flow`: a heading, how to read it, and one row per pattern; `with_notes` puts
/// how the lines are numbered and where laying starts above it (when the crew sheet's column has no
/// room for them).
pub(crate) fn pattern_table(
    flow: &mut Flow,
    schedule: &Schedule,
    rows: &[PatternRow],
    with_notes: bool,
) {
    let member = &schedule.framing_member;
    flow.heading(&format!(
        "NAILING ALONG EACH {} LINE ({} lines, {} patterns)",
        member.to_uppercase(),
        schedule.lines.len(),
        rows.len()
    ));
    if with_notes {
        if let Some(numbering) = super::crew_notes::numbering_sentence(schedule) {
            flow.paragraph(&numbering, 7.0);
        }
    }
    flow.paragraph(
        "Lines nailed alike share a row; the spacing holds up to each mark. End-wall: over a wall along \
         the framing; jack: eave to hip or valley.",
        7.0,
    );
    if with_notes {
        flow.paragraph(&super::crew_notes::laying_sentence(schedule), 7.0);
    }
    let marks_title = if schedule.basis.units.is_us() {
        "spacing (in o.c.) up to each mark (ft-in up from the eave end)"
    } else {
        "spacing (mm o.c.) up to each mark (m up from the eave end)"
    };
    let columns = [
        Column::new("lines", 0.36, Align::Left),
        Column::new("kind", 0.09, Align::Left),
        Column::new(marks_title, 0.55, Align::Left),
    ];
    let groups: Vec<Vec<Row>> = rows
        .iter()
        .map(|row| {
            vec![Row {
                cells: vec![
                    runs_text(&row.numbers),
                    row.kind.to_string(),
                    row.marks.clone(),
                ],
                bold: row.marks.contains("NO WORKING SPACING"),
                note: None,
            }]
        })
        .collect();
    flow.table(
        &columns,
        &groups,
        PATTERN_PT,
        TableLook {
            zebra: true,
            header: true,
        },
    );
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::{SupportRole, ZoneKind};

    fn stretch(from_m: f64, to_m: f64, spacing_mm: Option<f64>) -> SegmentRow {
        SegmentRow {
            from_m,
            to_m,
            zone_label: ZoneKind::Edge,
            support_role: SupportRole::Intermediate,
            spacing_mm,
            utilization: 0.5,
        }
    }

    #[test]
    fn marks_join_equal_spacings_and_name_the_top_end() {
        let stretches = [
            stretch(0.0, 0.487, Some(75.0)),
            stretch(0.487, 1.22, Some(75.0)),
            stretch(1.22, 2.44, Some(150.0)),
            stretch(2.44, 5.796, Some(75.0)),
        ];
        assert_eq!(
            marks_text(&stretches, false),
            "75 to 1.22, 150 to 2.44, 75 to 5.80 (top)"
        );
        // 6 in o.c. to 4 ft, 12 in to 8 ft: US marks in feet-inches.
        let us = [
            stretch(0.0, 1.2192, Some(152.4)),
            stretch(1.2192, 2.4384, Some(304.8)),
        ];
        assert_eq!(marks_text(&us, true), "6 to 4'-0\", 12 to 8'-0\" (top)");
    }

    #[test]
    fn a_gap_and_a_missing_spacing_are_said() {
        let stretches = [stretch(0.0, 1.0, Some(100.0)), stretch(2.0, 3.0, None)];
        assert_eq!(
            marks_text(&stretches, false),
            "100 to 1.00, no deck to 2.00, NO WORKING SPACING to 3.00 (top)"
        );
    }

    #[test]
    fn every_line_is_in_exactly_one_row() {
        let schedule = crate::sample::sample_schedule();
        let rows = pattern_rows(&schedule);
        let mut numbers: Vec<u32> = rows.iter().flat_map(|row| row.numbers.clone()).collect();
        numbers.sort_unstable();
        let all: Vec<u32> = schedule.lines.iter().map(|line| line.number).collect();
        assert_eq!(numbers, all);
        assert!(rows.len() < all.len());
    }
}
