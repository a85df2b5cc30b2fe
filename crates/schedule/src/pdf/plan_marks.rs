//! What the plan says about the roof itself, beside the zones: each plane's name (`P1`, `P2`, ... as
//! the line tables and `rafter-lines.csv` call them) inside the plane, and a small table of the ridges,
//! hips and valleys with their true lengths, so a framer can check the cut lengths against the drawing.

use super::geometry::label_anchor;
use super::labels::{LabelStyle, PlanLabel};
use crate::format::plan_length_label;
use crate::model::{EdgeKind, PlanEdge};

/// Rows of the roof-line table before lengths of one kind are given as a range.
const MAX_TABLE_ROWS: usize = 8;

/// One name label per plane; `planes_page` are the planes' outlines on the page, in plane order.
pub(crate) fn plane_name_labels(names: &[String], planes_page: &[Vec<[f64; 2]>]) -> Vec<PlanLabel> {
    names
        .iter()
        .zip(planes_page)
        .enumerate()
        .filter(|(_, (_, polygon))| polygon.len() >= 3)
        .map(|(index, (name, polygon))| PlanLabel {
            lines: vec![name.clone()],
            region: Some(index),
            style: LabelStyle::Plane,
            anchors: vec![label_anchor(polygon)],
        })
        .collect()
}

fn kind_words(kind: EdgeKind, count: usize) -> &'static str {
    match (kind, count == 1) {
        (EdgeKind::Ridge, true) => "ridge",
        (EdgeKind::Ridge, false) => "ridges",
        (EdgeKind::Hip, true) => "hip",
        (EdgeKind::Hip, false) => "hips",
        (EdgeKind::Valley, true) => "valley",
        (EdgeKind::Valley, false) => "valleys",
        (_, true) => "edge",
        (_, false) => "edges",
    }
}

/// The lines of the roof-line table, or None for a roof with no hip or valley (a gable's ridge is
/// plain from the dimensions). Lengths are on the slope, in the schedule's units, grouped by kind and
/// printed length: "hips  4 × 6.78 m".
pub(crate) fn roof_line_rows(lines: &[PlanEdge], imperial: bool) -> Option<Vec<String>> {
    if !lines
        .iter()
        .any(|line| matches!(line.kind, EdgeKind::Hip | EdgeKind::Valley))
    {
        return None;
    }
    let mut groups: Vec<(EdgeKind, String, f64, usize)> = Vec::new();
    for kind in [EdgeKind::Hip, EdgeKind::Valley, EdgeKind::Ridge] {
        let mut of_kind: Vec<&PlanEdge> = lines.iter().filter(|l| l.kind == kind).collect();
        of_kind.sort_by(|a, b| b.length_on_slope_m.total_cmp(&a.length_on_slope_m));
        for line in of_kind {
            let label = plan_length_label(line.length_on_slope_m, imperial);
            match groups
                .iter_mut()
                .find(|(k, text, _, _)| *k == kind && *text == label)
            {
                Some(group) => group.3 += 1,
                None => groups.push((kind, label, line.length_on_slope_m, 1)),
            }
        }
    }
    let mut rows = vec!["ROOF LINES, TRUE LENGTH".to_string()];
    if groups.len() <= MAX_TABLE_ROWS {
        rows.extend(groups.iter().map(|(kind, label, _, count)| {
            format!("{} {count} × {label}", kind_words(*kind, *count))
        }));
    } else {
        // Too many lengths for the drawing: the count and range of each kind.
        for kind in [EdgeKind::Hip, EdgeKind::Valley, EdgeKind::Ridge] {
            let of_kind: Vec<&(EdgeKind, String, f64, usize)> =
                groups.iter().filter(|g| g.0 == kind).collect();
            let (Some(longest), Some(shortest)) = (of_kind.first(), of_kind.last()) else {
                continue;
            };
            let count: usize = of_kind.iter().map(|g| g.3).sum();
            rows.push(format!(
                "{} {count}, {} to {}",
                kind_words(kind, count),
                shortest.1,
                longest.1
            ));
        }
    }
    Some(rows)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn edge(kind: EdgeKind, length_on_slope_m: f64) -> PlanEdge {
        PlanEdge {
            kind,
            from_m: [0.0, 0.0],
            to_m: [1.0, 0.0],
            length_m: 1.0,
            length_on_slope_m,
        }
    }

    #[test]
    fn hips_and_valleys_are_grouped_by_printed_length() {
        // The L fixture's roof: five hips and a valley of 6.78 m on the slope, two 6 m ridges.
        let lines = [
            edge(EdgeKind::Hip, 6.7822),
            edge(EdgeKind::Hip, 6.7818),
            edge(EdgeKind::Valley, 6.782),
            edge(EdgeKind::Ridge, 6.0),
            edge(EdgeKind::Ridge, 6.0),
        ];
        assert_eq!(
            roof_line_rows(&lines, false).expect("a table"),
            [
                "ROOF LINES, TRUE LENGTH",
                "hips 2 × 6.78 m",
                "valley 1 × 6.78 m",
                "ridges 2 × 6.00 m"
            ]
        );
    }

    #[test]
    fn a_roof_of_ridges_only_has_no_table() {
        assert!(roof_line_rows(&[edge(EdgeKind::Ridge, 6.0)], false).is_none());
    }

    #[test]
    fn many_lengths_become_ranges() {
        let lines: Vec<PlanEdge> = (0..12)
            .map(|i| edge(EdgeKind::Hip, 2.0 + f64::from(i)))
            .collect();
        let rows = roof_line_rows(&lines, false).expect("a table");
        assert_eq!(rows[1], "hips 12, 2.00 m to 13.00 m");
    }
}
