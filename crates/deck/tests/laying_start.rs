//! Where panel laying starts: the start corner, a ripped first course and a cut first panel are
//! honoured by the layout, and every shift, trim or conflict of the minimum-piece rule is reported.

use approx::assert_relative_eq;
use deckhold_deck::layout::{
    layout_deck, DeckLayout, FramingInput, LayoutChange, PanelInput, PlaneGeometry, Stagger,
    StartCorner, ZoneRegion,
};

fn rectangle(x0: f64, y0: f64, x1: f64, y1: f64) -> Vec<[f64; 2]> {
    vec![[x0, y0], [x1, y0], [x1, y1], [x0, y1]]
}

fn panel() -> PanelInput {
    PanelInput::whole_panels(2440.0, 1220.0, Stagger::Half, 600.0)
}

/// A flat-framed plane 0..`length_m` by 0..4 m (rafters along y at 610 mm, level across), walls on
/// its outline, one zone.
fn lay_out(length_m: f64, panel: &PanelInput) -> DeckLayout {
    let polygon = rectangle(0.0, 0.0, length_m, 4.0);
    let plane = PlaneGeometry {
        polygon_m: polygon.clone(),
        slope_deg: 20.0,
        downslope_m: [0.0, -1.0],
    };
    let walls = (0..4).map(|i| [polygon[i], polygon[(i + 1) % 4]]).collect();
    let framing = FramingInput {
        spacing_mm: 610.0,
        lines_along: None,
        walls_m: walls,
    };
    let zones = vec![ZoneRegion {
        zone_index: 0,
        polygons_m: vec![polygon],
    }];
    layout_deck(&[plane], &zones, &[1], &framing, panel).expect("valid")
}

#[test]
fn laying_from_the_larger_coordinate_mirrors_the_joints() {
    // 9.15 m = 15 bays of 610 mm. From x = 0: joints 2.44, 4.88, 7.32, then 1.83 m to 9.15.
    // From x = 9.15: 9.15 - 2.44 = 6.71, 4.27, 1.83, then 1.83 m to 0: the mirror image.
    let from_low = lay_out(9.15, &panel());
    let from_high = lay_out(
        9.15,
        &PanelInput {
            start: StartCorner::LargerCoordinate,
            ..panel()
        },
    );
    let low = &from_low.courses[0].joints_m;
    let high = &from_high.courses[0].joints_m;
    assert_eq!(low.len(), high.len());
    for (a, b) in low.iter().zip(high.iter().rev()) {
        assert_relative_eq!(*a, 9.15 - b, epsilon = 1e-9);
    }
    assert_relative_eq!(high[high.len() - 2], 6.71, epsilon = 1e-9);
    assert_eq!(from_high.laying_starts[0].corner_m, [9.15, 0.0]);
    assert_eq!(from_low.laying_starts[0].corner_m, [0.0, 0.0]);
}

#[test]
fn a_cut_first_panel_and_a_ripped_first_course_are_laid() {
    let cut = PanelInput {
        first_panel_length_mm: 1830.0,
        first_course_width_mm: 900.0,
        ..panel()
    };
    let layout = lay_out(9.15, &cut);
    // The first panel reaches 1.83 m (a line): joints 1.83, 4.27, 6.71, 9.15.
    assert_relative_eq!(layout.courses[0].joints_m[1], 1.83, epsilon = 1e-9);
    // Course 1 (half stagger) has its first joint 1.22 m before 1.83: 0.61 m, a 610 mm first piece
    // (at least the 600 mm minimum).
    assert_relative_eq!(layout.courses[1].joints_m[1], 0.61, epsilon = 1e-9);
    // Courses: 0..0.9, then 1.22 m each up 4 / cos 20 = 4.2567 m: 0.9, 2.12, 3.34, 4.2567.
    assert_relative_eq!(layout.courses[0].to_m, 0.9, epsilon = 1e-12);
    assert_relative_eq!(layout.courses[1].to_m, 2.12, epsilon = 1e-12);
    assert_eq!(layout.courses.len(), 4);
    assert_relative_eq!(layout.laying_starts[0].first_course_width_m, 0.9);
    assert_relative_eq!(layout.laying_starts[0].first_panel_length_m, 1.83);
}

#[test]
fn a_narrow_piece_no_line_avoids_is_reported_and_so_is_a_moved_joint() {
    // 3.0 m with a 2.44 m first panel cut to 2.44: joints 2.44, then 0.56 m to 3.0 -> too narrow;
    // moving the joint back to 2.44 - 0.61 = 1.83 leaves 1.17 and 1.83, both over 600 mm.
    let layout = lay_out(3.0, &panel());
    let course = &layout.courses[0];
    assert_relative_eq!(course.joints_m[1], 1.83, epsilon = 1e-9);
    assert!(matches!(
        course.changes[..],
        [LayoutChange::LastJointMoved { to_m }] if (to_m - 1.83).abs() < 1e-9
    ));
    assert_eq!(
        course.adjustments,
        vec!["course 1: last end joint moved back to the line at 1.830 m so the last piece is at least 600 mm"]
    );
    // 1.0 m long: one piece of 1.0 m, fine; with a 950 mm minimum and a 0.9 m deck no line can help.
    let narrow = lay_out(
        0.9,
        &PanelInput {
            min_piece_mm: 950.0,
            ..panel()
        },
    );
    assert!(narrow.courses[0].changes.iter().any(
        |c| matches!(c, LayoutChange::NarrowPiece { length_m, .. } if (length_m - 0.9).abs() < 1e-9)
    ));
    // A narrow top course is reported: 4 / cos 20 = 4.2567 m = 3 x 1.22 + 0.5967 m.
    let top = narrow.courses.last().expect("courses");
    assert!(top
        .changes
        .iter()
        .any(|c| matches!(c, LayoutChange::NarrowTopCourse { width_m } if (width_m - 0.5967).abs() < 1e-3)));
}
