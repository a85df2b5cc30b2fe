//! The crew sheet's words that answer what a crew would otherwise ask: how the framing lines are
//! numbered, where panel laying starts, and where the intermediate supports need closer nailing than
//! the panel edges (crews expect the opposite and would "fix" it).

use crate::format::spacing_label;
use crate::{Schedule, SupportRole};

/// The outline's bounding box: min x, max x, min y, max y (empty outline: reversed infinities).
fn extent(outline: &[[f64; 2]]) -> (f64, f64, f64, f64) {
    let (mut min_x, mut max_x, mut min_y, mut max_y) = (f64::MAX, f64::MIN, f64::MAX, f64::MIN);
    for p in outline {
        min_x = min_x.min(p[0]);
        max_x = max_x.max(p[0]);
        min_y = min_y.min(p[1]);
        max_y = max_y.max(p[1]);
    }
    (min_x, max_x, min_y, max_y)
}

/// Where a plan point sits on the drawing, in words: the plan's x runs left to right, y bottom to top.
fn side_of(point: [f64; 2], outline: &[[f64; 2]]) -> &'static str {
    if outline.is_empty() {
        return "first";
    }
    let (min_x, max_x, min_y, max_y) = extent(outline);
    let distances = [
        (point[1] - min_y, "bottom"),
        (max_y - point[1], "top"),
        (point[0] - min_x, "left"),
        (max_x - point[0], "right"),
    ];
    distances
        .iter()
        .min_by(|a, b| a.0.abs().total_cmp(&b.0.abs()))
        .map_or("first", |(_, side)| side)
}

/// How one framing line leads to the next on the drawing, in words.
fn direction(from: [f64; 2], to: [f64; 2]) -> &'static str {
    let (dx, dy) = (to[0] - from[0], to[1] - from[1]);
    match (dx.abs() >= dy.abs(), dx >= 0.0, dy >= 0.0) {
        (true, true, _) => "left to right",
        (true, false, _) => "right to left",
        (false, _, true) => "bottom to top",
        (false, _, false) => "top to bottom",
    }
}

/// "Line 1 is the first truss at the bottom wall of the plan; numbering runs left to right ...".
pub(crate) fn numbering_sentence(schedule: &Schedule) -> Option<String> {
    let mut lines: Vec<_> = schedule.plan.rafter_lines.iter().collect();
    lines.sort_by_key(|line| line.number);
    let first = lines.first()?;
    let second = lines.get(1)?;
    let member = &schedule.framing_member;
    let side = side_of(first.start_m, &schedule.plan.building_outline_m);
    Some(format!(
        "One numbering for the whole roof: line {} is the first {member} at the {side} wall of the plan; \
         numbering runs {} across the plan, then on to the next roof plane. Each number sits at the \
         line's eave end; marks along a line are measured up the slope from that eave end.",
        first.number,
        direction(first.start_m, second.start_m),
    ))
}

/// Which corner of the plan a point is nearest, in words: "bottom-left", "top-right", ...
fn corner_of(point: [f64; 2], outline: &[[f64; 2]]) -> String {
    let (min_x, max_x, min_y, max_y) = extent(outline);
    let vertical = if point[1] < (min_y + max_y) / 2.0 {
        "bottom"
    } else {
        "top"
    };
    let horizontal = if point[0] < (min_x + max_x) / 2.0 {
        "left"
    } else {
        "right"
    };
    format!("{vertical}-{horizontal}")
}

/// Where panel laying starts on each plane (corner of the plan and line, from the deck layout) and how
/// the courses are staggered.
pub(crate) fn laying_sentence(schedule: &Schedule) -> String {
    let imperial = schedule.basis.units.is_us();
    let stagger = schedule
        .deck_description
        .rsplit(", ")
        .next()
        .unwrap_or("as specified");
    let members = crate::format::plural(&schedule.framing_member);
    let outline = &schedule.plan.roof_outline_m;
    let starts: Vec<String> = schedule
        .laying_starts
        .iter()
        .map(|start| {
            let line = start
                .first_line
                .map_or(String::new(), |number| format!(" on line {number}"));
            let offset = if start.first_course_offset_m.abs() < 0.0005 {
                String::new()
            } else {
                format!(
                    ", first course {} up from the eave edge",
                    crate::format::plan_length_label(start.first_course_offset_m, imperial)
                )
            };
            format!(
                "{} at its {} eave corner{line}{offset}",
                start.plane,
                corner_of(start.corner_m, outline)
            )
        })
        .collect();
    let flush = if schedule
        .laying_starts
        .iter()
        .all(|start| start.first_course_offset_m.abs() < 0.0005)
    {
        ", the first course flush with the eave edge"
    } else {
        ""
    };
    let starts = if starts.is_empty() {
        "each plane at its eave corner on its lowest-numbered line".to_string()
    } else {
        starts.join("; ")
    };
    format!(
        "Panel laying starts: {starts}. Lay from the eave up, long side across the {members}{flush}; \
         stagger: {stagger}, panel ends only on framing."
    )
}

/// The zones where the intermediate supports take closer nailing than the panel edges, as one warning.
pub(crate) fn closer_intermediate_warning(schedule: &Schedule) -> Option<String> {
    let imperial = schedule.basis.units.is_us();
    let mut zones = Vec::new();
    for edge in schedule
        .zones
        .iter()
        .filter(|row| row.support_role == SupportRole::PanelEdge)
    {
        let intermediate = schedule
            .zones
            .iter()
            .find(|row| row.label == edge.label && row.support_role == SupportRole::Intermediate);
        if let (Some(edge_mm), Some(Some(intermediate_mm))) =
            (edge.spacing_mm, intermediate.map(|row| row.spacing_mm))
        {
            if intermediate_mm < edge_mm - 0.5 {
                zones.push(format!(
                    "{} ({} at intermediate supports, {} at panel edges)",
                    edge.label,
                    spacing_label(Some(intermediate_mm), imperial),
                    spacing_label(Some(edge_mm), imperial)
                ));
            }
        }
    }
    (!zones.is_empty()).then(|| {
        format!(
            "CLOSER AT INTERMEDIATE SUPPORTS, AS DESIGNED: {}. The middle supports of a panel carry more \
             of the uplift than its edges; do not change this.",
            zones.join("; ")
        )
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn directions_read_as_the_plan_is_drawn() {
        assert_eq!(direction([0.0, 0.0], [0.6, 0.0]), "left to right");
        assert_eq!(direction([0.0, 5.0], [0.0, 4.4]), "top to bottom");
        let outline = [[0.0, 0.0], [10.0, 0.0], [10.0, 8.0], [0.0, 8.0]];
        assert_eq!(side_of([3.0, 0.0], &outline), "bottom");
        assert_eq!(side_of([10.0, 4.0], &outline), "right");
        assert_eq!(corner_of([-0.5, 8.5], &outline), "top-left");
        assert_eq!(corner_of([10.5, -0.5], &outline), "bottom-right");
    }

    #[test]
    fn laying_names_each_plane_its_corner_and_line() {
        let schedule = crate::sample::sample_schedule();
        let sentence = laying_sentence(&schedule);
        assert!(
            sentence
                .starts_with("Panel laying starts: P1 at its bottom-left eave corner on line 1."),
            "{sentence}"
        );
        assert!(sentence.contains("flush with the eave edge"), "{sentence}");
        assert!(sentence.contains("stagger: half stagger"), "{sentence}");
    }

    #[test]
    fn a_closer_intermediate_spacing_is_called_out() {
        let schedule = crate::sample::sample_schedule();
        let closer = schedule.zones.iter().any(|row| {
            row.support_role == SupportRole::Intermediate
                && schedule.zones.iter().any(|edge| {
                    edge.label == row.label
                        && edge.support_role == SupportRole::PanelEdge
                        && row
                            .spacing_mm
                            .zip(edge.spacing_mm)
                            .is_some_and(|(i, e)| i < e - 0.5)
                })
        });
        assert_eq!(closer_intermediate_warning(&schedule).is_some(), closer);
        let mut changed = schedule.clone();
        for row in &mut changed.zones {
            row.spacing_mm = Some(if row.support_role == SupportRole::PanelEdge {
                150.0
            } else {
                100.0
            });
        }
        let warning = closer_intermediate_warning(&changed).expect("every zone is closer");
        assert!(warning.contains("100 mm at intermediate supports, 150 mm at panel edges"));
    }
}
