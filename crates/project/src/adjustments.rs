//! The layout's changes (minimum piece, hip and valley slivers, a narrow top course) as warnings in
//! the reader's units: one line per plane and kind of change, with the courses it applies to; the
//! slivers of a plane in one line, with the lines that carry them and the range of their widths.

use deckhold_deck::layout::{Course, LayoutChange, LengthWords, SLIVER_M};
use deckhold_model::format::feet_inches;
use deckhold_model::{plane_name, Units};

/// Every change of every course in the reader's units, one each ("P1 course 2: ..."), as `run --json`
/// lists them in `deck.adjustments`.
pub fn each_adjustment(courses: &[Course], min_piece_m: f64, units: Units) -> Vec<String> {
    let (position, size) = length_words(units);
    let words = LengthWords {
        position: &position,
        size: &size,
        key_unit: if units.is_us() { "in" } else { "mm" },
    };
    courses
        .iter()
        .flat_map(|course| {
            course.changes.iter().map(|change| {
                format!(
                    "{} course {}: {}",
                    plane_name(course.plane_index),
                    course.index + 1,
                    change.words(min_piece_m, &words)
                )
            })
        })
        .collect()
}

/// Plan positions and piece sizes: SI in m to the millimetre and in mm, US in feet-inches.
fn length_words(units: Units) -> (impl Fn(f64) -> String, impl Fn(f64) -> String) {
    let us = units.is_us();
    let position = move |m: f64| {
        if us {
            feet_inches(m)
        } else {
            format!("{m:.3} m")
        }
    };
    let size = move |m: f64| {
        if us {
            feet_inches(m)
        } else {
            format!("{:.0} mm", m * 1000.0)
        }
    };
    (position, size)
}

/// The warnings for the courses' changes; `min_piece_m` is the minimum the layout was held to.
pub fn layout_adjustments(courses: &[Course], min_piece_m: f64, units: Units) -> Vec<String> {
    let (position, size) = length_words(units);
    let words = LengthWords {
        position: &position,
        size: &size,
        key_unit: if units.is_us() { "in" } else { "mm" },
    };
    let mut grouped: Vec<(usize, String, Vec<usize>)> = Vec::new();
    let mut slivers: Vec<(usize, Vec<u32>, f64, f64)> = Vec::new();
    for course in courses {
        for change in &course.changes {
            if let LayoutChange::Sliver { line, width_m } = *change {
                match slivers.iter_mut().find(|s| s.0 == course.plane_index) {
                    Some((_, lines, narrowest, widest)) => {
                        lines.push(line);
                        *narrowest = narrowest.min(width_m);
                        *widest = widest.max(width_m);
                    }
                    None => slivers.push((course.plane_index, vec![line], width_m, width_m)),
                }
                continue;
            }
            let what = change.words(min_piece_m, &words);
            match grouped
                .iter_mut()
                .find(|(plane, text, _)| *plane == course.plane_index && *text == what)
            {
                Some((_, _, list)) => list.push(course.index + 1),
                None => grouped.push((course.plane_index, what, vec![course.index + 1])),
            }
        }
    }
    let sliver_lines = slivers
        .into_iter()
        .map(|(plane, mut lines, narrowest, widest)| {
            lines.sort_unstable();
            lines.dedup();
            let lines: Vec<String> = lines.iter().map(ToString::to_string).collect();
            format!(
                "Deck layout, {}: slivers of {} to {} between hip or valley cuts and lines {} are \
                 carried by those lines as short cantilevers (under {}: not spanned to the hip or \
                 valley rafter); run --json deck.adjustments lists each",
                plane_name(plane),
                size(narrowest),
                size(widest),
                lines.join(", "),
                size(SLIVER_M)
            )
        });
    // The same change on the same courses of several planes (a top course on every plane of a hip
    // roof) is said once, naming the planes.
    let mut merged: Vec<(Vec<usize>, String, Vec<usize>)> = Vec::new();
    for (plane, what, list) in grouped {
        match merged
            .iter_mut()
            .find(|(_, text, courses)| *text == what && *courses == list)
        {
            Some((planes, _, _)) => planes.push(plane),
            None => merged.push((vec![plane], what, list)),
        }
    }
    merged
        .into_iter()
        .map(|(planes, what, list)| {
            let numbers: Vec<String> = list.iter().map(ToString::to_string).collect();
            let names: Vec<String> = planes.iter().map(|&plane| plane_name(plane)).collect();
            let word = if list.len() == 1 { "course" } else { "courses" };
            format!(
                "Deck layout, {} {word} {}: {what}",
                names.join(", "),
                numbers.join(", ")
            )
        })
        .chain(sliver_lines)
        .collect()
}
