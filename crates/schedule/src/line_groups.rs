//! Framing lines that are nailed alike, grouped, so that a table shows one row per nailing pattern
//! ("lines 4-11, 14-27") instead of one per line. A typical house has a few patterns and many lines;
//! a big flat roof has hundreds of identical joists. The crew sheet and the engineer's line table both
//! use this, so both say the same thing about which lines are alike.
//!
//! Two lines are alike when they are the same kind of member (common, end-wall, jack, ...) and carry the
//! same stretches from their low end: the same boundaries (within 1 mm of the group's first line: two
//! lines whose zone edge falls at 4.7124 and 4.7126 m are alike), and on each stretch the same zone,
//! support role and spacing. Utilization may differ; the group keeps the highest on each stretch,
//! so a grouped table never shows a line as less loaded than it is. Position and plane are not compared:
//! a pattern measured from the eave is nailed the same way wherever the line stands.
//!
//! ```
//! use deckhold_schedule::line_groups::{group_lines, runs_text};
//! # let lines = deckhold_schedule::sample::sample_schedule().lines;
//! for group in group_lines(&lines) {
//!     println!("lines {}: {} stretches", runs_text(&group.numbers), group.stretches.len());
//! }
//! assert_eq!(runs_text(&[4, 5, 6, 7, 9, 11, 14, 15, 16]), "4-7, 9, 11, 14-16");
//! ```

use std::collections::HashMap;

use crate::model::{LineKind, LineRow, SegmentRow, SupportRole, ZoneKind};

/// A nailing pattern and every line that has it.
#[derive(Debug, Clone)]
pub struct LineGroup {
    /// The lines' numbers, ascending (print them with [`runs_text`]).
    pub numbers: Vec<u32>,
    pub kind: LineKind,
    /// The planes the lines carry, in order of first appearance (`P1`, ...).
    pub planes: Vec<String>,
    /// Length along the slope, m (the longest of the group: they agree to 1 mm).
    pub length_m: f64,
    /// The pattern along the line, low end first; neighbouring segments with the same zone, role and
    /// spacing are joined into one stretch. Boundaries are the first line's (the others agree to 1 mm);
    /// each stretch's utilization is the highest any line of the group has there.
    pub stretches: Vec<SegmentRow>,
}

/// Boundaries closer than this are the same mark, m.
const SAME_MARK_M: f64 = 0.001;

/// Groups `lines` by nailing pattern. A line joins the first group (in input order) whose first line
/// it matches, so the output is the same for the same input whatever the hashing. Groups come in the
/// order of their lowest line number.
pub fn group_lines(lines: &[LineRow]) -> Vec<LineGroup> {
    let mut groups: Vec<LineGroup> = Vec::new();
    // Groups by what must match exactly; the boundaries are then compared within SAME_MARK_M.
    let mut candidates: HashMap<PatternKey, Vec<usize>> = HashMap::new();
    for line in lines {
        let stretches = stretches_of(&line.segments);
        let key = PatternKey::new(line.kind, &stretches);
        let same_marks = |group: &LineGroup| {
            group.stretches.iter().zip(&stretches).all(|(a, b)| {
                (a.from_m - b.from_m).abs() < SAME_MARK_M && (a.to_m - b.to_m).abs() < SAME_MARK_M
            })
        };
        let found = candidates.get(&key).and_then(|indices| {
            indices
                .iter()
                .copied()
                .find(|&index| same_marks(&groups[index]))
        });
        match found {
            Some(index) => groups[index].add(line, &stretches),
            None => {
                candidates.entry(key).or_default().push(groups.len());
                groups.push(LineGroup {
                    numbers: vec![line.number],
                    kind: line.kind,
                    planes: vec![line.plane.clone()],
                    length_m: line.length_m,
                    stretches,
                });
            }
        }
    }
    for group in &mut groups {
        group.numbers.sort_unstable();
        group.numbers.dedup();
    }
    groups.sort_by_key(|group| group.numbers.first().copied());
    groups
}

impl LineGroup {
    fn add(&mut self, line: &LineRow, stretches: &[SegmentRow]) {
        self.numbers.push(line.number);
        if !self.planes.contains(&line.plane) {
            self.planes.push(line.plane.clone());
        }
        self.length_m = self.length_m.max(line.length_m);
        // Equal keys have equally many stretches.
        for (mine, theirs) in self.stretches.iter_mut().zip(stretches) {
            mine.utilization = mine.utilization.max(theirs.utilization);
        }
    }
}

/// The line's segments with neighbours of the same zone, role and spacing joined (the deck plan splits
/// a line at every course edge even where the nailing does not change).
pub fn stretches_of(segments: &[SegmentRow]) -> Vec<SegmentRow> {
    let mut stretches: Vec<SegmentRow> = Vec::with_capacity(segments.len());
    for segment in segments {
        if let Some(last) = stretches.last_mut() {
            let touching = (segment.from_m - last.to_m).abs() < 0.0005;
            if touching
                && last.zone_label == segment.zone_label
                && last.support_role == segment.support_role
                && last.spacing_mm == segment.spacing_mm
            {
                last.to_m = segment.to_m;
                last.utilization = last.utilization.max(segment.utilization);
                continue;
            }
        }
        stretches.push(segment.clone());
    }
    stretches
}

/// Line numbers as runs: consecutive numbers as `4-11` (two as `4, 5`), others one by one, comma
/// separated. Numbers are sorted and repeated ones dropped first. Empty input gives an empty string.
pub fn runs_text(numbers: &[u32]) -> String {
    let mut sorted = numbers.to_vec();
    sorted.sort_unstable();
    sorted.dedup();
    let mut parts: Vec<String> = Vec::new();
    let mut start = 0;
    while start < sorted.len() {
        let mut end = start;
        while end + 1 < sorted.len() && sorted[end + 1] == sorted[end] + 1 {
            end += 1;
        }
        match end - start {
            0 => parts.push(sorted[start].to_string()),
            1 => {
                parts.push(sorted[start].to_string());
                parts.push(sorted[end].to_string());
            }
            _ => parts.push(format!("{}-{}", sorted[start], sorted[end])),
        }
        start = end + 1;
    }
    parts.join(", ")
}

/// What two lines must share exactly to be one group: kind, and per stretch the zone, the role and the
/// spacing to 0.1 mm (the boundaries are compared apart, within [`SAME_MARK_M`]).
#[derive(Debug, PartialEq, Eq, Hash)]
struct PatternKey {
    kind: LineKind,
    stretches: Vec<(ZoneKind, SupportRole, Option<i64>)>,
}

impl PatternKey {
    fn new(kind: LineKind, stretches: &[SegmentRow]) -> Self {
        Self {
            kind,
            stretches: stretches
                .iter()
                .map(|s| {
                    (
                        s.zone_label,
                        s.support_role,
                        // `as` saturates, so even a non-finite value cannot panic here.
                        s.spacing_mm.map(|spacing| (spacing * 10.0).round() as i64),
                    )
                })
                .collect(),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn segment(from_m: f64, to_m: f64, zone: ZoneKind, spacing_mm: f64, u: f64) -> SegmentRow {
        SegmentRow {
            from_m,
            to_m,
            zone_label: zone,
            support_role: SupportRole::Intermediate,
            spacing_mm: Some(spacing_mm),
            utilization: u,
        }
    }

    fn line(number: u32, kind: LineKind, segments: Vec<SegmentRow>) -> LineRow {
        LineRow {
            number,
            plane: if number > 20 { "P2" } else { "P1" }.to_string(),
            kind,
            position_m: f64::from(number) * 0.6,
            length_m: segments.last().map_or(0.0, |s| s.to_m),
            segments,
        }
    }

    /// Edge at 100 mm for the first metre, interior at 150 mm after it, split at a course edge at 1.22 m.
    fn common(number: u32, u: f64) -> LineRow {
        line(
            number,
            LineKind::Common,
            vec![
                segment(0.0, 1.0, ZoneKind::Edge, 100.0, u),
                segment(1.0, 1.22, ZoneKind::Interior, 150.0, 0.5),
                segment(1.22, 4.0, ZoneKind::Interior, 150.0, 0.6),
            ],
        )
    }

    #[test]
    fn runs_join_consecutive_numbers() {
        assert_eq!(runs_text(&[4, 5, 6, 7, 8, 9, 10, 11]), "4-11");
        assert_eq!(runs_text(&[14, 4, 5, 6, 15, 16]), "4-6, 14-16");
        assert_eq!(runs_text(&[4, 5]), "4, 5");
        assert_eq!(runs_text(&[4, 6, 8]), "4, 6, 8");
        assert_eq!(runs_text(&[3, 3, 4, 5]), "3-5");
        assert_eq!(runs_text(&[7]), "7");
        assert_eq!(runs_text(&[]), "");
    }

    #[test]
    fn identical_lines_form_one_group_with_the_worst_utilization() {
        let lines: Vec<LineRow> = (4..=27)
            .map(|n| common(n, 0.5 + f64::from(n) / 100.0))
            .collect();
        let groups = group_lines(&lines);
        assert_eq!(groups.len(), 1);
        assert_eq!(runs_text(&groups[0].numbers), "4-27");
        assert_eq!(groups[0].planes, ["P1", "P2"]);
        // The two interior segments join into one stretch; the edge stretch keeps line 27's 0.77.
        assert_eq!(groups[0].stretches.len(), 2);
        assert!((groups[0].stretches[0].utilization - 0.77).abs() < 1e-12);
        assert!((groups[0].stretches[1].to_m - 4.0).abs() < 1e-12);
        assert!((groups[0].stretches[1].utilization - 0.6).abs() < 1e-12);
    }

    #[test]
    fn a_different_kind_zone_boundary_or_spacing_breaks_the_group() {
        let mut lines: Vec<LineRow> = (4..=27).map(|n| common(n, 0.5)).collect();
        // Line 12: an end-wall member with the same nailing.
        lines[8].kind = LineKind::EndWall;
        // Line 13: the zone boundary 5 mm further up.
        lines[9].segments[0].to_m = 1.005;
        lines[9].segments[1].from_m = 1.005;
        // Line 20: closer nails in the interior.
        lines[16].segments[2].spacing_mm = Some(125.0);
        let groups = group_lines(&lines);
        let texts: Vec<String> = groups.iter().map(|g| runs_text(&g.numbers)).collect();
        assert_eq!(texts, ["4-11, 14-19, 21-27", "12", "13", "20"]);
        assert_eq!(groups[1].kind, LineKind::EndWall);
    }

    #[test]
    fn boundaries_within_a_millimetre_are_the_same() {
        // 4.7124 and 4.7126 m round to different millimetres, yet mark the same place.
        let mut lines = vec![common(1, 0.5), common(2, 0.5), common(3, 0.5)];
        lines[0].segments[0].to_m = 1.0004;
        lines[0].segments[1].from_m = 1.0004;
        lines[1].segments[0].to_m = 1.0006;
        lines[1].segments[1].from_m = 1.0006;
        lines[2].segments[0].to_m = 1.0015;
        lines[2].segments[1].from_m = 1.0015;
        let groups = group_lines(&lines);
        let texts: Vec<String> = groups.iter().map(|g| runs_text(&g.numbers)).collect();
        assert_eq!(texts, ["1, 2", "3"]);
    }

    #[test]
    fn no_spacing_is_its_own_pattern() {
        let mut lines = vec![common(1, 0.5), common(2, 0.5)];
        lines[1].segments[0].spacing_mm = None;
        assert_eq!(group_lines(&lines).len(), 2);
    }

    #[test]
    fn groups_cover_every_line_once_in_order_of_first_line() {
        let lines = crate::sample::sample_schedule().lines;
        let groups = group_lines(&lines);
        let mut all: Vec<u32> = groups.iter().flat_map(|g| g.numbers.clone()).collect();
        let firsts: Vec<u32> = groups.iter().map(|g| g.numbers[0]).collect();
        assert!(firsts.windows(2).all(|w| w[0] < w[1]));
        all.sort_unstable();
        let numbers: Vec<u32> = lines.iter().map(|l| l.number).collect();
        assert_eq!(all, numbers);
        assert!(groups.len() < lines.len());
    }
}
