//! The framing model worked by hand: a gable whose length is not a multiple of the spacing, and a small
//! hip roof with its hip and jack rafters.

use approx::assert_relative_eq;
use deckhold_deck::beam::strip_reactions;
use deckhold_deck::layout::{DeckLayout, LayoutLine, LineKind};
use deckhold_project::job::deck_layout;
use deckhold_project::{parse_project, DEMO_PROJECT_JSON};
use serde_json::{json, Value};

/// The demo with some keys replaced, laid out.
fn layout_of(edit: impl Fn(&mut Value)) -> DeckLayout {
    let mut value: Value = serde_json::from_str(DEMO_PROJECT_JSON).expect("demo JSON");
    edit(&mut value);
    let project = parse_project(&value.to_string()).expect("the edited demo parses");
    let wind = deckhold_wind::analyze(&project.wind).expect("wind");
    deck_layout(&project, &wind).expect("layout")
}

fn line_at(layout: &DeckLayout, plane_index: usize, position_m: f64) -> &LayoutLine {
    layout
        .lines
        .iter()
        .find(|line| line.plane_index == plane_index && (line.position_m - position_m).abs() < 1e-6)
        .unwrap_or_else(|| panic!("no line at {position_m} m on plane {plane_index}"))
}

#[test]
fn a_gable_of_17_79_m_closes_on_its_far_end_wall() {
    // Demo with length 17.79 m (not a multiple of 610 mm), 300 mm rake overhang, 2440 mm panels.
    // Lines from the wall at x = 0: 0, 0.61, ... 29 x 0.61 = 17.69 m (30 x 0.61 = 18.30 is past the
    // wall), then the end-wall member on the far wall at 17.79 m: the last bay is 0.10 m. Nothing in
    // the rake overhang (17.79..18.09 m).
    let layout = layout_of(|v| v["building"]["footprint"]["rectangle"]["length_m"] = json!(17.79));
    let south: Vec<&LayoutLine> = layout.lines.iter().filter(|l| l.plane_index == 0).collect();
    assert_eq!(south.len(), 31);
    let last = &south[south.len() - 3..];
    assert_relative_eq!(last[0].position_m, 17.08, max_relative = 1e-12);
    assert_relative_eq!(last[1].position_m, 17.69, max_relative = 1e-12);
    assert_eq!(last[2].position_m, 17.79);
    assert_eq!(last[2].kind, LineKind::EndWall);
    assert_eq!(south[0].kind, LineKind::EndWall);
    assert_eq!(south[0].position_m, 0.0);

    // Course 0 starts at the rake edge, x = -0.30: the first panel ends on the farthest line within
    // 2.44 m, 1.83 m; then every 2.44 m: 4.27, 6.71, 9.15, 11.59, 14.03, 16.47; the last piece runs
    // from 16.47 m to the rake edge at 18.09 m (1.62 m, over the minimum 600 mm).
    //
    // That piece is a strip continuous over supports A 16.47, B 17.08, C 17.69, D 17.79 (spans 0.61,
    // 0.61, 0.10 m; the rafters run down the slope, so the spans are level) with 0.30 m cantilevered
    // past D. Unit load w = 1 (reactions are widths of deck, m). Three-moment equation
    // M(i-1) L(i) + 2 M(i) (L(i) + L(i+1)) + M(i+1) L(i+1) = -w/4 (L(i)^3 + L(i+1)^3), hogging negative,
    // M_A = 0, M_D = -w 0.30^2 / 2 = -0.045:
    //   at B: 2.44 M_B + 0.61 M_C = -0.25 (0.226981 + 0.226981) = -0.1134905
    //   at C: 0.61 M_B + 1.42 M_C = -0.25 (0.226981 + 0.001) + 0.0045 = -0.05249525
    //   -> M_C = -0.0190317, M_B = -0.0417546.
    // End shears V_left = w L / 2 + (M_right - M_left) / L:
    //   AB: V_A = 0.305 - 0.0684501 = 0.2365499, V_B,left = 0.3734501
    //   BC: V_B,right = 0.305 + 0.0372507 = 0.3422507, V_C,left = 0.2677493
    //   CD: V_C,right = 0.05 - 0.2596834 = -0.2096834, V_D,left = 0.3096834; cantilever 0.30
    // Reactions: A 0.23655, B 0.71570, C 0.05807, D 0.60968; sum 1.62000 = 0.61 + 0.61 + 0.10 + 0.30.
    // Against the equal-span coefficients (Hicks, Civil Engineering Formulas, Table 2.1: end support
    // of a 3-span beam 0.4 w L = 244 mm at 610 mm) the end wall carries 2.5 times as much: the short
    // bay and the cantilever load it, which the old grid (no member on the far wall) missed.
    let course = &layout.courses[0];
    assert_relative_eq!(course.joints_m[1], 1.83, max_relative = 1e-12);
    assert_relative_eq!(course.joints_m[7], 16.47, max_relative = 1e-12);
    assert_relative_eq!(course.joints_m[8], 18.09, max_relative = 1e-12);
    let width = |position_m: f64, strip: usize| {
        let bearing = &line_at(&layout, 0, position_m).bearings[0];
        assert_eq!(bearing.course_index, 0);
        bearing.strips[strip].reaction_width_mm
    };
    assert_relative_eq!(width(16.47, 1), 236.5499, max_relative = 1e-5);
    assert_relative_eq!(width(17.08, 0), 715.7008, max_relative = 1e-5);
    assert_relative_eq!(width(17.69, 0), 58.0659, max_relative = 1e-4);
    assert_relative_eq!(width(17.79, 0), 609.6834, max_relative = 1e-5);
    let piece = layout
        .pieces
        .iter()
        .find(|p| p.plane_index == 0 && p.course == 0 && (p.start_m - 16.47).abs() < 1e-9)
        .expect("the last piece of course 0");
    assert_eq!(piece.end_line, None, "its far end is the rake edge");
    assert_relative_eq!(piece.cantilever_end_m, 0.30, max_relative = 1e-9);
    // Equilibrium of that strip (the beam solver's own sum).
    let reactions = strip_reactions(&[0.61, 0.61, 0.10], 0.0, 0.30, 1.0).expect("solves");
    assert_relative_eq!(reactions.iter().sum::<f64>(), 1.62, max_relative = 1e-12);
}

#[test]
fn a_small_hip_roof_has_its_hips_and_jacks() {
    // 8 m x 6 m hip roof, 30 deg, no overhang, framing at 600 mm. The hips run in plan from each
    // corner to the ridge ends (3, 3) and (5, 3): 3 sqrt 2 = 4.2426 m; they rise with the roof over the
    // 3 m run: tan 30 x 3 = 1.7321 m; on the slope sqrt(18 + 3) = sqrt 21 = 4.5826 m.
    // A jack on the long side at x = 0.6 m runs from the eave (y = 0) to the hip (y = 0.6 m):
    // 0.6 / cos 30 = 0.6928 m on the slope; at x = 1.2 m: 1.3856 m.
    let layout = layout_of(|v| {
        v["building"]["footprint"]["rectangle"] = json!({ "length_m": 8.0, "width_m": 6.0 });
        v["roof"] = json!({
            "shape": "hip",
            "slope_deg": 30.0,
            "ridge_along": "length",
            "eave_overhang_mm": 0,
            "rake_overhang_mm": 0,
            "dead_load_kpa": 0.3
        });
        v["framing"]["spacing_mm"] = json!(600);
    });
    let hips: Vec<_> = layout
        .framing
        .iter()
        .filter(|l| l.kind == LineKind::Hip)
        .collect();
    assert_eq!(hips.len(), 4);
    for hip in &hips {
        assert_relative_eq!(hip.length_on_slope_m, 21f64.sqrt(), max_relative = 1e-9);
    }
    let cos = 30f64.to_radians().cos();
    let jack = line_at(&layout, 0, 0.6);
    assert_eq!(jack.kind, LineKind::Jack);
    // (The line is sectioned 0.1 um either side of its position: 1e-6 relative.)
    assert_relative_eq!(jack.length_m, 0.6 / cos, max_relative = 1e-6);
    assert_relative_eq!(
        line_at(&layout, 0, 1.2).length_m,
        1.2 / cos,
        max_relative = 1e-6
    );
    // Under the ridge (3 < x < 5) the lines are commons, full run 3 m: 3 / cos 30 = 3.4641 m.
    let common = line_at(&layout, 0, 4.2);
    assert_eq!(common.kind, LineKind::Common);
    assert_relative_eq!(common.length_m, 3.0 / cos, max_relative = 1e-6);
    // No line at the corners (x = 0 and 8 carry no deck over the building on the long planes), and no
    // end-wall member on a hip roof: every wall is an eave.
    assert!(layout.lines.iter().all(|l| l.kind != LineKind::EndWall));
    // The jack's deck ends on the hip: its strips bear on the hip rafter (a support at the cut edge),
    // never a cantilever past it.
    for bearing in &jack.bearings {
        for strip in &bearing.strips {
            assert!(strip.overhang_start_m < 1e-9 && strip.overhang_end_m < 1e-9);
        }
    }
}
