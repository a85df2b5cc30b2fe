//! Page 1, for the crew on the roof: the plan with its zones, the nail in large type, the spacing per
//! zone and support, and a bold warning when a zone has no working spacing.

use super::canvas::{Align, Area, Canvas, Stroke};
use super::crew_pattern::{pattern_table, PatternRow};
use super::drawing::{draw_plan, role_words, roof_line_style, swatch, zone_style, PlanNotes};
use super::flow::Flow;
use super::page::Frame;
use super::text::{line_height_mm, wrap, Font};
use crate::format::{center_word, mass_label, on_center, small_length_label, spacing_label};
use crate::{EdgeKind, Schedule, SupportRole, Units, ZoneKind, ZoneRow};

/// Share of the body width given to the drawing.
const DRAWING_SHARE: f64 = 0.6;
/// Height of the sheet heading, mm.
const HEADING_H_MM: f64 = 13.0;

fn capitalized(word: &str) -> String {
    let mut chars = word.chars();
    match chars.next() {
        Some(first) => first.to_uppercase().chain(chars).collect(),
        None => String::new(),
    }
}

/// `2nd`, `5th`, `21st`: how the numbering step reads.
fn ordinal(n: u32) -> String {
    let suffix = match (n % 10, n % 100) {
        (_, 11..=13) => "th",
        (1, _) => "st",
        (2, _) => "nd",
        (3, _) => "rd",
        _ => "th",
    };
    format!("{n}{suffix}")
}

/// One zone of the crew's table: its kind and rows by support role.
struct ZoneLine<'a> {
    label: ZoneKind,
    panel_edge: Option<&'a ZoneRow>,
    intermediate: Option<&'a ZoneRow>,
    nail_count: u64,
}

fn zone_lines(schedule: &Schedule) -> Vec<ZoneLine<'_>> {
    let mut lines: Vec<ZoneLine> = Vec::new();
    for row in &schedule.zones {
        let position = match lines.iter().position(|line| line.label == row.label) {
            Some(position) => position,
            None => {
                lines.push(ZoneLine {
                    label: row.label,
                    panel_edge: None,
                    intermediate: None,
                    nail_count: 0,
                });
                lines.len() - 1
            }
        };
        let line = &mut lines[position];
        line.nail_count += row.nail_count;
        match row.support_role {
            SupportRole::PanelEdge => line.panel_edge = line.panel_edge.or(Some(row)),
            SupportRole::Intermediate => line.intermediate = line.intermediate.or(Some(row)),
        }
    }
    lines
}

/// How the crew sheet is laid out: the rows of the nailing pattern, how many pages the crew asked for,
/// and how many design-basis pages come between the crew sheet and the engineer's line table.
pub(crate) struct CrewLayout<'a> {
    pub pattern: &'a [PatternRow],
    /// `Some(1)`: the pattern goes under the plan on page 1. None: on the crew sheet's own next page.
    pub crew_pages: Option<u32>,
    pub basis_pages: usize,
}

/// Share of the plan's column the pattern table may take on a one-page crew sheet: the plan keeps at
/// least the rest, so it stays readable.
const PATTERN_SHARE_MAX: f64 = 0.55;

/// The crew sheet's pages: page 1 (plan, nail, spacing per zone and role, notes, sign-off), then the
/// nailing pattern line group by line group, under the plan when one page was asked for and it fits,
/// else on pages of its own.
pub(crate) fn crew_sheet(schedule: &Schedule, frame: &Frame, layout: &CrewLayout) -> Vec<Canvas> {
    let mut canvas = Canvas::new();
    let body = frame.body();
    let imperial = schedule.basis.units == Units::Imperial;

    // Heading.
    canvas.text(
        body.x,
        body.top() - 5.5,
        "ROOF SHEATHING NAILING \u{2014} CREW SHEET",
        Font::Bold,
        15.0,
        Align::Left,
    );
    let framing = spacing_label(Some(schedule.framing_spacing_mm), imperial);
    let subtitle = format!(
        "{} at {} {}   \u{00B7}   {}   \u{00B7}   edge zones {} wide",
        capitalized(&crate::format::plural(&schedule.framing_member)),
        framing,
        on_center(imperial),
        schedule.deck_description,
        crate::format::plan_length_label(schedule.edge_width_m, imperial)
    );
    let subtitle = super::text::fit(&subtitle, Font::Regular, 8.5, body.w);
    canvas.text(
        body.x,
        body.top() - 10.5,
        &subtitle,
        Font::Regular,
        8.5,
        Align::Left,
    );

    let left = Area {
        x: body.x,
        y: body.y,
        w: body.w * DRAWING_SHARE,
        h: body.h - HEADING_H_MM,
    };
    let column = Area {
        x: left.right() + 5.0,
        y: body.y,
        w: body.right() - left.right() - 5.0,
        h: body.h - HEADING_H_MM,
    };
    let one_page = layout.crew_pages == Some(1);
    // How the lines are numbered and where laying starts go in the right-hand column when they fit
    // there (a trial run of the column says), else with the pattern table under the plan.
    let in_column = !one_page || {
        let trial_refs = PageRefs {
            pattern: "under the plan".to_string(),
            plan_notes: true,
            one_page,
            line_table: 2 + layout.basis_pages,
        };
        let trial_notes = PlanNotes {
            scale_denominator: None,
            numbered_every: 1,
        };
        right_column(
            &mut Canvas::new(),
            schedule,
            column,
            &trial_notes,
            &trial_refs,
        )
    };
    let with_notes = !in_column;
    let (drawing, mut pages) = if one_page {
        let table_h = pattern_height_mm(schedule, frame, left, layout.pattern, with_notes)
            .min(left.h * PATTERN_SHARE_MAX);
        let drawing = Area {
            y: left.y + table_h,
            h: left.h - table_h,
            ..left
        };
        let mut flow = Flow::within(frame, Area { h: table_h, ..left });
        pattern_table(&mut flow, schedule, layout.pattern, with_notes);
        let mut pages = flow.finish();
        if !pages.is_empty() {
            canvas.append(pages.remove(0));
        }
        (drawing, pages)
    } else {
        let mut flow = Flow::new(frame);
        pattern_table(&mut flow, schedule, layout.pattern, true);
        (left, flow.finish())
    };
    let notes = draw_plan(&mut canvas, drawing, schedule, &frame.paper);
    let refs = PageRefs {
        pattern: match (one_page, pages.is_empty()) {
            (true, true) => "under the plan",
            (true, false) => "under the plan, continued on page 2",
            (false, _) => "on page 2",
        }
        .to_string(),
        plan_notes: in_column,
        one_page,
        line_table: 2 + pages.len() + layout.basis_pages,
    };
    right_column(&mut canvas, schedule, column, &notes, &refs);
    pages.insert(0, canvas);
    pages
}

/// The right-hand column: nail, spacing per zone and role, legend, notes, sign-off. True when the
/// numbering and laying notes (asked for by `refs.plan_notes`) found room.
fn right_column(
    canvas: &mut Canvas,
    schedule: &Schedule,
    column: Area,
    notes: &PlanNotes,
    refs: &PageRefs,
) -> bool {
    let imperial = schedule.basis.units == Units::Imperial;
    let mut y = column.top();
    y = nail_block(canvas, schedule, column, y, imperial);
    if !schedule.feasible || schedule.zones.iter().any(|row| row.spacing_mm.is_none()) {
        y = infeasible_box(canvas, schedule, column, y);
    }
    // The sign-off block is always drawn: the notes above give way to it, never the other way round.
    let above_sign_off = Area {
        y: column.y + SIGN_OFF_H_MM + 1.0,
        h: column.h - SIGN_OFF_H_MM - 1.0,
        ..column
    };
    y = spacing_table(canvas, schedule, above_sign_off, y, imperial);
    y = line_legend(canvas, schedule, above_sign_off, y, notes);
    let placed = footnotes(canvas, schedule, above_sign_off, y, notes, refs);
    sign_off(canvas, schedule, column);
    placed
}

/// Where the crew finds the rest: the pattern by line group, and the engineer's table of the same groups.
struct PageRefs {
    pattern: String,
    /// The numbering and laying notes belong in this column (else they head the pattern table).
    plan_notes: bool,
    /// The pattern is under the plan (`--crew-pages 1`).
    one_page: bool,
    line_table: usize,
}

/// Height the pattern table takes at the foot of `left`, mm; more than `left` holds when it would run
/// onto a second page.
fn pattern_height_mm(
    schedule: &Schedule,
    frame: &Frame,
    left: Area,
    rows: &[PatternRow],
    with_notes: bool,
) -> f64 {
    let mut trial = Flow::within(frame, left);
    pattern_table(&mut trial, schedule, rows, with_notes);
    let (pages, y) = trial.position();
    if pages > 1 {
        f64::INFINITY
    } else {
        left.top() - y + 1.0
    }
}

/// Height of the sign-off block, mm.
const SIGN_OFF_H_MM: f64 = 17.0;

/// Who prepared the schedule, and blanks for the reviewer's name, seal and date, at the foot of the
/// column: a schedule goes to the roof only after that review where the law requires one. The column's
/// other blocks stop above it, so it is on every crew sheet.
fn sign_off(canvas: &mut Canvas, schedule: &Schedule, column: Area) {
    let rule = |canvas: &mut Canvas, from_x: f64, baseline: f64| {
        canvas.line(
            [from_x, baseline - 0.8],
            [column.right(), baseline - 0.8],
            0.2,
            0.0,
            super::canvas::Stroke::Solid,
        );
    };
    let mut baseline = column.y + SIGN_OFF_H_MM - 4.0;
    let prepared = if schedule.project.prepared_by.is_empty() {
        "Prepared by:".to_string()
    } else {
        format!("Prepared by: {}", schedule.project.prepared_by)
    };
    canvas.text(
        column.x,
        baseline,
        &super::text::fit(&prepared, Font::Regular, 7.5, column.w),
        Font::Regular,
        7.5,
        Align::Left,
    );
    baseline -= 5.5;
    let label = "Reviewed and sealed by (where the law requires):";
    canvas.text(column.x, baseline, label, Font::Regular, 7.5, Align::Left);
    rule(
        canvas,
        column.x + super::text::width_mm(label, Font::Regular, 7.5) + 1.5,
        baseline,
    );
    baseline -= 5.5;
    canvas.text(column.x, baseline, "Date:", Font::Regular, 7.5, Align::Left);
    rule(
        canvas,
        column.x + super::text::width_mm("Date:", Font::Regular, 7.5) + 1.5,
        baseline,
    );
}

fn nail_block(
    canvas: &mut Canvas,
    schedule: &Schedule,
    column: Area,
    mut y: f64,
    imperial: bool,
) -> f64 {
    let nail = &schedule.nail;
    canvas.text_grey(
        column.x,
        y - 2.8,
        "NAIL TO USE",
        Font::Bold,
        8.0,
        Align::Left,
        0.3,
    );
    y -= 4.2;
    let (size, lines) = [18.0, 16.0, 14.0, 12.0]
        .into_iter()
        .map(|size| (size, wrap(&nail.description, Font::Bold, size, column.w)))
        .find(|(_, lines)| lines.len() <= 2)
        .unwrap_or_else(|| (12.0, wrap(&nail.description, Font::Bold, 12.0, column.w)));
    for line in lines.iter().take(3) {
        y -= line_height_mm(size) * 0.85;
        canvas.text(column.x, y, line, Font::Bold, size, Align::Left);
        y -= line_height_mm(size) * 0.2;
    }
    let material = match nail.material.as_str() {
        "carbon" => "carbon steel".to_string(),
        "stainless" => "stainless steel".to_string(),
        other => other.to_string(),
    };
    let spec = format!(
        "{} long  \u{00B7}  {} {} shank  \u{00B7}  {} head  \u{00B7}  {}",
        small_length_label(nail.length_mm, imperial),
        small_length_label(nail.shank_diameter_mm, imperial),
        nail.shank,
        small_length_label(nail.head_diameter_mm, imperial),
        material
    );
    y -= 1.0;
    for line in wrap(&spec, Font::Regular, 9.5, column.w) {
        y -= line_height_mm(9.5);
        canvas.text(column.x, y + 1.0, &line, Font::Regular, 9.5, Align::Left);
    }
    y -= line_height_mm(7.5);
    canvas.text_grey(
        column.x,
        y + 1.0,
        &format!("nail id {}", nail.id),
        Font::Regular,
        7.5,
        Align::Left,
        0.3,
    );
    y - 3.0
}

fn infeasible_box(canvas: &mut Canvas, schedule: &Schedule, column: Area, y: f64) -> f64 {
    let failing: Vec<String> = schedule
        .zones
        .iter()
        .filter(|row| row.spacing_mm.is_none())
        .map(|row| format!("{} ({})", row.label, role_words(row.support_role)))
        .collect();
    let zones = if failing.is_empty() {
        "one or more zones".to_string()
    } else {
        failing.join(", ")
    };
    let plural = if failing.len() > 1 { "zones" } else { "zone" };
    let message = format!(
        "NO WORKING SPACING in {plural} {zones} with nail {} \u{2014} see alternatives",
        schedule.nail.id
    );
    let inner_w = column.w - 5.0;
    let heading = wrap(&message, Font::Bold, 11.0, inner_w);
    let mut alternatives: Vec<Vec<String>> = schedule
        .alternatives
        .iter()
        .map(|alt| {
            wrap(
                &format!("\u{2022} {alt}"),
                Font::Regular,
                8.5,
                inner_w - 2.0,
            )
        })
        .collect();
    if alternatives.is_empty() {
        alternatives.push(wrap(
            "\u{2022} No alternative was found: refer to the designer.",
            Font::Regular,
            8.5,
            inner_w - 2.0,
        ));
    }
    // Keep the box to about a third of the column; the design basis lists every alternative.
    let budget = column.h / 3.0;
    let mut shown: Vec<Vec<String>> = Vec::new();
    let mut used = heading.len() as f64 * line_height_mm(11.0) + 5.5;
    let mut cut = false;
    for alternative in alternatives {
        let h = alternative.len() as f64 * line_height_mm(8.5);
        if used + h > budget && !shown.is_empty() {
            cut = true;
            break;
        }
        used += h;
        shown.push(alternative);
    }
    if cut {
        shown.push(vec!["(all alternatives: design basis page)".to_string()]);
        used += line_height_mm(8.5);
    }
    let area = Area {
        x: column.x,
        y: y - used,
        w: column.w,
        h: used,
    };
    canvas.fill_area(area, 1.0);
    canvas.stroke_area(area, 0.9, 0.0);
    let mut baseline = y - 2.0 - line_height_mm(11.0) * 0.8;
    for line in &heading {
        canvas.text(
            column.x + 2.5,
            baseline,
            line,
            Font::Bold,
            11.0,
            Align::Left,
        );
        baseline -= line_height_mm(11.0);
    }
    baseline -= 0.8;
    for (i, line) in shown.iter().flatten().enumerate() {
        let indent = if line.starts_with('\u{2022}') || i == 0 {
            2.5
        } else {
            4.6
        };
        canvas.text(
            column.x + indent,
            baseline,
            line,
            Font::Regular,
            8.5,
            Align::Left,
        );
        baseline -= line_height_mm(8.5);
    }
    y - used - 3.0
}

/// A spacing cell in bold, in the report's units.
fn spacing_cell(canvas: &mut Canvas, x: f64, top: f64, row: Option<&ZoneRow>, imperial: bool) {
    let Some(row) = row else {
        canvas.text(x, top - 4.5, "\u{2013}", Font::Regular, 11.0, Align::Left);
        return;
    };
    match row.spacing_mm {
        None => canvas.text(x, top - 4.5, "NONE", Font::Bold, 11.0, Align::Left),
        Some(mm) => canvas.text(
            x,
            top - 4.5,
            &spacing_label(Some(mm), imperial),
            Font::Bold,
            11.0,
            Align::Left,
        ),
    }
}

fn spacing_table(
    canvas: &mut Canvas,
    schedule: &Schedule,
    column: Area,
    mut y: f64,
    imperial: bool,
) -> f64 {
    canvas.text_grey(
        column.x,
        y - 2.8,
        &format!(
            "SPACING ALONG EACH SUPPORT, {} TO {}",
            center_word(imperial).to_uppercase(),
            center_word(imperial).to_uppercase()
        ),
        Font::Bold,
        8.0,
        Align::Left,
        0.3,
    );
    y -= 4.5;
    let swatch_w = 9.0;
    let zone_x = column.x + swatch_w + 2.0;
    let edge_x = column.x + column.w * 0.42;
    let intermediate_x = column.x + column.w * 0.64;
    let nails_x = column.right();
    let header_base = y - 3.0;
    canvas.text(zone_x, header_base, "zone", Font::Bold, 8.0, Align::Left);
    canvas.text(
        edge_x,
        header_base,
        "panel edges",
        Font::Bold,
        8.0,
        Align::Left,
    );
    canvas.text(
        intermediate_x,
        header_base,
        "intermediate",
        Font::Bold,
        8.0,
        Align::Left,
    );
    canvas.text(nails_x, header_base, "nails", Font::Bold, 8.0, Align::Right);
    y -= 4.4;
    canvas.line([column.x, y], [column.right(), y], 0.35, 0.0, Stroke::Solid);
    let row_h = 7.0;
    for line in zone_lines(schedule) {
        let top = y;
        let style = zone_style(line.label);
        swatch(
            canvas,
            Area {
                x: column.x,
                y: top - row_h + 1.2,
                w: swatch_w,
                h: row_h - 2.4,
            },
            style,
        );
        // One line per row: a long zone word (overhang-high-corner) is set smaller to fit, since a
        // second line would run into the next row.
        let room = edge_x - zone_x - 1.5;
        let word = line.label.as_str();
        let natural = super::text::width_mm(word, Font::Bold, 9.0);
        let size = if natural > room {
            (9.0 * room / natural).max(6.0)
        } else {
            9.0
        };
        canvas.text(zone_x, top - 4.3, word, Font::Bold, size, Align::Left);
        spacing_cell(canvas, edge_x, top, line.panel_edge, imperial);
        spacing_cell(canvas, intermediate_x, top, line.intermediate, imperial);
        canvas.text(
            nails_x,
            top - 4.5,
            &line.nail_count.to_string(),
            Font::Regular,
            9.0,
            Align::Right,
        );
        y -= row_h;
        canvas.line([column.x, y], [column.right(), y], 0.12, 0.5, Stroke::Solid);
    }
    let mass = mass_label(schedule.total_nail_mass_kg, imperial);
    y -= 3.6;
    canvas.text(
        column.right(),
        y,
        &format!("total {} nails, about {mass}", schedule.total_nail_count),
        Font::Regular,
        8.0,
        Align::Right,
    );
    y - 3.5
}

/// A legend row for one kind of roof line, shown when the plan has one.
fn roof_line_item(
    plan: &crate::PlanView,
    kind: EdgeKind,
    label: &str,
) -> (bool, f64, f64, Stroke, String) {
    let (width, grey, stroke) = roof_line_style(kind);
    let present = plan.roof_lines.iter().any(|line| line.kind == kind);
    (present, width, grey, stroke, label.to_string())
}

fn line_legend(
    canvas: &mut Canvas,
    schedule: &Schedule,
    column: Area,
    mut y: f64,
    notes: &PlanNotes,
) -> f64 {
    let plan = &schedule.plan;
    let member = &schedule.framing_member;
    let numbered = match notes.numbered_every {
        1 => format!("{member} lines, numbered"),
        n => format!("{member} lines, every {} numbered", ordinal(n)),
    };
    let items: Vec<(bool, f64, f64, Stroke, String)> = vec![
        (
            !plan.roof_outline_m.is_empty(),
            0.6,
            0.0,
            Stroke::Solid,
            "roof edge".to_string(),
        ),
        (
            !plan.building_outline_m.is_empty(),
            0.35,
            0.0,
            Stroke::Dashed,
            "wall line".to_string(),
        ),
        (
            plan.roof_lines.is_empty() && !plan.ridge_lines_m.is_empty(),
            0.4,
            0.0,
            Stroke::DashDot,
            "ridge or hip".to_string(),
        ),
        roof_line_item(plan, EdgeKind::Ridge, "ridge"),
        roof_line_item(plan, EdgeKind::Hip, "hip"),
        roof_line_item(plan, EdgeKind::Valley, "valley"),
        (
            !plan.rafter_lines.is_empty(),
            0.15,
            0.3,
            Stroke::Solid,
            numbered,
        ),
        (
            !plan.panel_joints_m.is_empty(),
            0.45,
            0.0,
            Stroke::Solid,
            "panel end joint".to_string(),
        ),
        (
            !plan.course_lines_m.is_empty(),
            0.2,
            0.3,
            Stroke::Dotted,
            "long panel edge".to_string(),
        ),
    ];
    let items: Vec<_> = items.into_iter().filter(|item| item.0).collect();
    let rows = items.len().div_ceil(2);
    let row_h = 4.2;
    if items.is_empty() || y - rows as f64 * row_h - 4.0 < column.y {
        return y;
    }
    canvas.text_grey(
        column.x,
        y - 2.8,
        "LINES ON THE PLAN",
        Font::Bold,
        8.0,
        Align::Left,
        0.3,
    );
    y -= 4.0;
    let half = column.w / 2.0;
    for (i, (_, width, level, stroke, text)) in items.iter().enumerate() {
        let x = column.x + if i % 2 == 0 { 0.0 } else { half };
        let row_top = y - (i / 2) as f64 * row_h;
        let mid = row_top - row_h / 2.0;
        if text == "panel end joint" {
            canvas.line(
                [x + 4.0, mid - 1.5],
                [x + 4.0, mid + 1.5],
                *width,
                *level,
                *stroke,
            );
        } else {
            canvas.line([x, mid], [x + 8.0, mid], *width, *level, *stroke);
        }
        canvas.text(x + 10.0, mid - 1.0, text, Font::Regular, 7.5, Align::Left);
    }
    y - rows as f64 * row_h - 2.5
}

/// Size of the crew sheet's notes, pt.
const NOTE_PT: f64 = 7.0;

/// The notes under the legend; true when the numbering and laying notes, if asked for, were placed.
fn footnotes(
    canvas: &mut Canvas,
    schedule: &Schedule,
    column: Area,
    mut y: f64,
    notes: &PlanNotes,
    refs: &PageRefs,
) -> bool {
    let member = &schedule.framing_member;
    let first = schedule
        .plan
        .rafter_lines
        .iter()
        .map(|line| line.number)
        .min()
        .unwrap_or(1);
    let numbering = match notes.numbered_every {
        1 => format!("Every {member} line is numbered on the plan."),
        n => format!(
            "{} lines are numbered every {} line, starting at {first}.",
            capitalized(member),
            ordinal(n)
        ),
    };
    let members = crate::format::plural(member);
    // Most important first: a full column drops notes that do not fit, never the sign-off block below.
    // The pointer to the pattern matters less when the pattern is right under the plan.
    let pointer = (
        format!(
            "The nailing along each {member} line, lines nailed alike grouped, is {}; the engineer's \
             table of the same groups starts on page {}.",
            refs.pattern, refs.line_table
        ),
        Font::Regular,
        false,
    );
    let mut text: Vec<(String, Font, bool)> = Vec::new();
    if let Some(warning) = super::crew_notes::closer_intermediate_warning(schedule) {
        text.push((warning, Font::Bold, false));
    }
    if !refs.one_page {
        text.push(pointer.clone());
    }
    if refs.plan_notes {
        if let Some(sentence) = super::crew_notes::numbering_sentence(schedule) {
            text.push((sentence, Font::Regular, true));
        }
        text.push((
            super::crew_notes::laying_sentence(schedule),
            Font::Regular,
            true,
        ));
    }
    if refs.one_page {
        text.push(pointer);
    }
    text.extend([
        (
            format!(
                "Panel edges: where two panels end on one {member}. Intermediate: the other {members} under a panel."
            ),
            Font::Regular,
            false,
        ),
        (numbering, Font::Regular, false),
    ]);
    let mut placed = true;
    for (paragraph, font, needed) in text {
        let lines = wrap(&paragraph, font, NOTE_PT, column.w);
        let h = lines.len() as f64 * line_height_mm(NOTE_PT);
        // A note that does not fit gives way; a shorter one after it may still fit.
        if y - h < column.y {
            placed &= !needed;
            continue;
        }
        for line in lines {
            y -= line_height_mm(NOTE_PT);
            canvas.text(column.x, y + 0.8, &line, font, NOTE_PT, Align::Left);
        }
        y -= 1.0;
    }
    placed
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ordinals_read_as_english() {
        assert_eq!(ordinal(2), "2nd");
        assert_eq!(ordinal(5), "5th");
        assert_eq!(ordinal(12), "12th");
        assert_eq!(ordinal(21), "21st");
    }

    #[test]
    fn zone_lines_merge_the_two_roles_of_a_zone() {
        let schedule = crate::sample::sample_schedule();
        let lines = zone_lines(&schedule);
        assert_eq!(lines.len(), 5);
        assert_eq!(lines[0].label, ZoneKind::Interior);
        assert_eq!(
            lines[0].panel_edge.and_then(|row| row.spacing_mm),
            Some(150.0)
        );
        assert_eq!(
            lines[0].intermediate.and_then(|row| row.spacing_mm),
            Some(300.0)
        );
        assert_eq!(
            lines[0].nail_count,
            schedule.zones[0].nail_count + schedule.zones[1].nail_count
        );
    }
}
