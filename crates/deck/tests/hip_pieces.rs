//! Pieces on a hip end are cut along the hips and their cantilevers are taken where they are largest
//! in the course band. Worked by hand below.

use approx::assert_relative_eq;
use deckhold_deck::layout::{
    layout_deck, FramingInput, PanelInput, PlaneGeometry, Stagger, ZoneRegion, SLIVER_M,
};

#[test]
fn a_hip_end_piece_follows_the_hip_and_its_cantilever_is_the_worst_sliver() {
    // Hip end in plan: eave along x = 0 from y = 0 to 8, hips to the apex (4, 4), 45 deg, walls
    // 0..12 x 0..8. Jack rafters run along x at y = 0.61 k (the corner line at y = 0 touches the
    // plane at a point and is dropped); each ends on the hip y = x (or y = 8 - x).
    // Up the slope: 1 m in plan is sqrt(2) m on the slope (45 deg); across, level (factor 1).
    // Course 0: 0..1.22 m up the slope = x 0..0.8627 m in plan. Its first panel runs from the deck
    // edge at y = 0 to the farthest line within 2.44 m, y = 2.44.
    //   Outline: the rectangle x 0..0.8627, y 0..2.44 cut by the hip y = x:
    //   (0, 0), (0.8627, 0.8627), (0.8627, 2.44), (0, 2.44).
    //   Start end: at height x the deck starts on the hip at y = x; the first line there is y = 0.61
    //   while x <= 0.61 (the jack ends on the hip), then y = 1.22. The gap to it is 0.61 - x: a span
    //   onto the hip rafter while it is 100 mm or more, a sliver carried by the jack as a cantilever
    //   once under 100 mm, i.e. for 0.51 < x < 0.61. The largest is just under 100 mm, at x = 0.51,
    //   0.51 sqrt(2) = 0.7212 m up the slope. Past x = 0.61 the first line is y = 1.22, 0.36 m or
    //   more from the hip: no cantilever.
    //   End: y = 2.44 is a line: no cantilever.
    let plane = PlaneGeometry {
        polygon_m: vec![[0.0, 0.0], [4.0, 4.0], [0.0, 8.0]],
        slope_deg: 45.0,
        downslope_m: [-1.0, 0.0],
    };
    let corners = [[0.0, 0.0], [12.0, 0.0], [12.0, 8.0], [0.0, 8.0]];
    let framing = FramingInput {
        spacing_mm: 610.0,
        lines_along: None,
        walls_m: (0..4).map(|i| [corners[i], corners[(i + 1) % 4]]).collect(),
    };
    let panel = PanelInput::whole_panels(2440.0, 1220.0, Stagger::Half, 600.0);
    let zones = vec![ZoneRegion {
        zone_index: 0,
        polygons_m: vec![plane.polygon_m.clone()],
    }];
    let layout = layout_deck(&[plane], &zones, &[1], &framing, &panel).expect("valid");
    let piece = &layout.pieces[0];
    assert_eq!((piece.course, piece.start_m, piece.end_m), (0, 0.0, 2.44));
    let top = 1.22 / 2f64.sqrt();
    let expected = [[0.0, 0.0], [top, top], [top, 2.44], [0.0, 2.44]];
    assert_eq!(piece.outline_m.len(), 4, "{:?}", piece.outline_m);
    for corner in expected {
        assert!(
            piece
                .outline_m
                .iter()
                .any(|p| (p[0] - corner[0]).abs() < 1e-9 && (p[1] - corner[1]).abs() < 1e-9),
            "{corner:?} not in {:?}",
            piece.outline_m
        );
    }
    assert!(piece.start_cut && !piece.end_cut);
    assert_relative_eq!(piece.cantilever_start_m, SLIVER_M, max_relative = 1e-5);
    assert!(piece.cantilever_start_m < SLIVER_M);
    assert_relative_eq!(
        piece.cantilever_at_m,
        0.51 * 2f64.sqrt(),
        max_relative = 1e-5
    );
    assert_eq!(piece.cantilever_end_m, 0.0);
    // The top course is 8 / 2 = 4 m of plan x up to the apex: 4 sqrt(2) = 5.657 m on the slope, so
    // courses 0..4 (1.22 m each) and a 0.777 m top course. Its band x 4.3135/sqrt2.. is near the
    // apex: only pieces that reach the deck there are laid, none beyond the hips.
    for piece in layout.pieces.iter().filter(|p| p.course == 4) {
        assert!(piece.outline_m.len() >= 3);
        assert!(piece
            .outline_m
            .iter()
            .all(|p| p[1] >= p[0] - 1e-9 && p[1] <= 8.0 - p[0] + 1e-9));
    }
}
