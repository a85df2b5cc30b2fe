//! Zone layout in plan: corner squares, edge strips (eaves, rakes, ridge, hips) and interior, plus the
//! overhang parts of the roof outside the wall line. The pieces are cut from the roof outline, so the
//! zones tile it exactly.

use crate::geometry::{
    area_m2, contains, nearest_on_segment, split_by_line, wholly_on_one_side, Point,
};
use crate::outline::{bounds, LocalRoof, Plan};

/// Which kind of roof area a point lies in, before the standard names it.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord)]
pub(crate) enum Region {
    Interior,
    Edge,
    Corner,
    /// A monoslope's strip along its high eave where the figure names it apart (ASCE 7-22 zone 2').
    HighEdge,
    /// A monoslope's high-eave corner where the figure names it apart (ASCE 7-22 zone 3').
    HighCorner,
}

impl Region {
    /// Every region, in the order zones are listed.
    pub(crate) const ALL: [Region; 5] = [
        Region::Interior,
        Region::Edge,
        Region::Corner,
        Region::HighEdge,
        Region::HighCorner,
    ];

    /// The word the coefficient data uses for the region.
    pub(crate) fn as_str(self) -> &'static str {
        match self {
            Region::Interior => "interior",
            Region::Edge => "edge",
            Region::Corner => "corner",
            Region::HighEdge => "high-edge",
            Region::HighCorner => "high-corner",
        }
    }
}

/// What a monoslope figure draws along the high eave (local v = across-ridge length: the roof falls
/// toward v = 0). The monoslope figures zone the high eave more severely than the low eave.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct HighEave {
    /// The region of the strip of width a along the high eave.
    pub strip: Region,
    /// The region of each high-eave corner.
    pub corner: Region,
    /// How far each high-eave corner reaches along the high eave, m.
    pub corner_along_m: f64,
    /// How far each high-eave corner reaches down the slope, m.
    pub corner_across_m: f64,
}

/// The strips the layout draws besides the wall-line strips.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Strips {
    pub edge_width_m: f64,
    /// Edge strips both sides of the ridge, corners where they meet the rakes (gable > 7°).
    pub ridge: bool,
    /// Edge bands along the hip lines and ridge (hip > 7°).
    pub hips: bool,
    /// The region of the strips along the walls: edge, or corner where a figure's map puts its worst
    /// zone along the whole eave (ASCE 7-22 hip roofs, severe-of-two).
    pub wall_region: Region,
    /// Monoslope figures: the high eave's own strip and corners.
    pub high_eave: Option<HighEave>,
}

/// One classified piece of the roof outline, local frame.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct Piece {
    pub region: Region,
    pub overhang: bool,
    pub polygon_m: Vec<Point>,
}

/// Pieces of this area or less are dropped, m².
pub(crate) const SLIVER_M2: f64 = 1e-10;

/// Cuts the roof outline into classified pieces.
pub(crate) fn layout(plan: &Plan, local: &LocalRoof, strips: Strips) -> Vec<Piece> {
    match plan {
        Plan::Rectangle {
            along_ridge_m,
            across_ridge_m,
            ..
        } => {
            crate::rectangle_zones::rectangle_layout(*along_ridge_m, *across_ridge_m, local, strips)
        }
        Plan::Polygon { building_m, .. } => polygon_layout(building_m, local, strips.edge_width_m),
    }
}

/// Cuts every piece by each line in turn; parts of [`SLIVER_M2`] or less are dropped.
pub(crate) fn cut_all(mut pieces: Vec<Vec<Point>>, lines: &[(Point, f64)]) -> Vec<Vec<Point>> {
    for (line_index, (normal, offset)) in lines.iter().enumerate() {
        let mut next = Vec::with_capacity(pieces.len() * 2);
        for piece in pieces {
            // Most lines miss most pieces: keep such a piece as it is (the split would copy it). Its
            // size was checked when the last line made it; the given pieces are checked at the first.
            if wholly_on_one_side(&piece, *normal, *offset) {
                if line_index > 0 || (piece.len() >= 3 && area_m2(&piece) > SLIVER_M2) {
                    next.push(piece);
                }
                continue;
            }
            let (below, above) = split_by_line(&piece, *normal, *offset);
            for part in [below, above] {
                if part.len() >= 3 && area_m2(&part) > SLIVER_M2 {
                    next.push(part);
                }
            }
        }
        pieces = next;
    }
    pieces
}

fn polygon_layout(building: &[Point], local: &LocalRoof, a: f64) -> Vec<Piece> {
    let mut xs: Vec<f64> = Vec::new();
    let mut ys: Vec<f64> = Vec::new();
    for p in local.outline_m.iter().chain(building.iter()) {
        xs.push(p[0]);
        ys.push(p[1]);
    }
    for p in building {
        xs.extend([p[0] - a, p[0] + a]);
        ys.extend([p[1] - a, p[1] + a]);
    }
    let (min, max) = bounds(&local.outline_m);
    let clean = |mut values: Vec<f64>, low: f64, high: f64| {
        values.retain(|value| *value >= low && *value <= high);
        values.sort_by(f64::total_cmp);
        values.dedup_by(|x, y| (*x - *y).abs() < 1e-9);
        values
    };
    let xs = clean(xs, min[0], max[0]);
    let ys = clean(ys, min[1], max[1]);
    let mut pieces = Vec::new();
    for column in xs.windows(2) {
        for row in ys.windows(2) {
            let center = [(column[0] + column[1]) / 2.0, (row[0] + row[1]) / 2.0];
            if !contains(&local.outline_m, center) {
                continue;
            }
            let polygon_m = crate::geometry::rectangle(column[0], row[0], column[1], row[1]);
            if area_m2(&polygon_m) <= SLIVER_M2 {
                continue;
            }
            let (region, overhang) = classify_polygon(center, building, a);
            pieces.push(Piece {
                region,
                overhang,
                polygon_m,
            });
        }
    }
    pieces
}

/// Region of a point for a counter-clockwise rectilinear wall line.
pub(crate) fn classify_polygon(point: Point, building: &[Point], a: f64) -> (Region, bool) {
    let count = building.len();
    let inside = contains(building, point);
    let q = if inside {
        point
    } else {
        nearest_on_boundary(point, building)
    };
    let corner = (0..count).any(|index| {
        let prev = building[(index + count - 1) % count];
        let here = building[index];
        let next = building[(index + 1) % count];
        let cross =
            (here[0] - prev[0]) * (next[1] - here[1]) - (here[1] - prev[1]) * (next[0] - here[0]);
        cross > 0.0 && in_corner_square(q, here, a)
    });
    let edge = (0..count).any(|index| {
        let start = building[index];
        let end = building[(index + 1) % count];
        let (dx, dy) = (end[0] - start[0], end[1] - start[1]);
        let length = (dx * dx + dy * dy).sqrt();
        let along = ((q[0] - start[0]) * dx + (q[1] - start[1]) * dy) / length;
        // Counter-clockwise: the inside is to the left of each edge.
        let inward = (dx * (q[1] - start[1]) - dy * (q[0] - start[0])) / length;
        along >= -1e-9 && along <= length + 1e-9 && inward >= -1e-9 && inward < a
    });
    let region = if corner {
        Region::Corner
    } else if edge {
        Region::Edge
    } else {
        Region::Interior
    };
    (region, !inside)
}

/// Whether `point` lies in the corner zone of a wall corner: the square of half-side `a` around it
/// (clipped to the roof by the caller's classification), as the figures draw corner zones.
pub(crate) fn in_corner_square(point: Point, corner: Point, a: f64) -> bool {
    (point[0] - corner[0]).abs() < a && (point[1] - corner[1]).abs() < a
}

pub(crate) fn nearest_on_boundary(point: Point, polygon: &[Point]) -> Point {
    let count = polygon.len();
    let mut best = polygon[0];
    let mut best_distance = f64::INFINITY;
    for index in 0..count {
        let candidate = nearest_on_segment(point, polygon[index], polygon[(index + 1) % count]);
        let distance = (candidate[0] - point[0]).hypot(candidate[1] - point[1]);
        if distance < best_distance {
            best_distance = distance;
            best = candidate;
        }
    }
    best
}

#[cfg(test)]
pub(crate) mod tests {
    use super::*;
    use crate::outline::{local_roof, validate_footprint};
    use crate::types::{Footprint, RidgeAlong, Roof, RoofShape};
    use approx::assert_relative_eq;

    /// The zone pieces of a roof of `shape` on `footprint`, checked to tile its outline (their areas
    /// add up to the outline's), as every zone test needs first.
    fn pieces_for(shape: RoofShape, footprint: Footprint, strips: Strips) -> Vec<Piece> {
        let roof = Roof {
            shape,
            slope_deg: 20.0,
            ridge_along: RidgeAlong::Length,
            eave_overhang_mm: 600.0,
            rake_overhang_mm: 300.0,
            dead_load_kpa: 0.5,
            gable_walls: Vec::new(),
        };
        let plan = validate_footprint(&footprint, RidgeAlong::Length).expect("plan");
        let local = local_roof(&plan, &roof).expect("roof");
        let pieces = layout(&plan, &local, strips);
        let total: f64 = pieces.iter().map(|p| area_m2(&p.polygon_m)).sum();
        assert_relative_eq!(total, area_m2(&local.outline_m), max_relative = 1e-9);
        pieces
    }

    pub(crate) fn area_of(pieces: &[Piece], region: Region, overhang: bool) -> f64 {
        pieces
            .iter()
            .filter(|p| p.region == region && p.overhang == overhang)
            .map(|p| area_m2(&p.polygon_m))
            .sum()
    }

    #[test]
    fn gable_corner_and_tiling() {
        let strips = Strips {
            edge_width_m: 1.0,
            ridge: true,
            hips: false,
            wall_region: Region::Edge,
            high_eave: None,
        };
        let pieces = pieces_for(
            RoofShape::Gable,
            Footprint::Rectangle {
                length_m: 12.0,
                width_m: 8.0,
            },
            strips,
        );
        // Four eave corners plus four ridge-end corners, each 1 m × 1 m inside the wall line.
        assert_relative_eq!(
            area_of(&pieces, Region::Corner, false),
            8.0,
            max_relative = 1e-9
        );
        // Interior: (12 - 2) × (8 - 4 strips of 1 m).
        assert_relative_eq!(
            area_of(&pieces, Region::Interior, false),
            40.0,
            max_relative = 1e-9
        );
    }

    #[test]
    fn hip_tiles_outline() {
        let strips = Strips {
            edge_width_m: 1.0,
            ridge: false,
            hips: true,
            wall_region: Region::Edge,
            high_eave: None,
        };
        let pieces = pieces_for(
            RoofShape::Hip,
            Footprint::Rectangle {
                length_m: 14.0,
                width_m: 9.0,
            },
            strips,
        );
        assert_relative_eq!(
            area_of(&pieces, Region::Corner, false),
            4.0,
            max_relative = 1e-9
        );
        assert!(area_of(&pieces, Region::Interior, false) > 0.0);
    }

    #[test]
    fn l_shape_flat_corners_at_convex_vertices_only() {
        let strips = Strips {
            edge_width_m: 1.0,
            ridge: false,
            hips: false,
            wall_region: Region::Edge,
            high_eave: None,
        };
        let l_shape = vec![
            [0.0, 0.0],
            [10.0, 0.0],
            [10.0, 4.0],
            [4.0, 4.0],
            [4.0, 10.0],
            [0.0, 10.0],
        ];
        let pieces = pieces_for(
            RoofShape::Flat,
            Footprint::Polygon {
                vertices_m: l_shape,
            },
            strips,
        );
        assert_relative_eq!(
            area_of(&pieces, Region::Corner, false),
            5.0,
            max_relative = 1e-9
        );
    }

    fn monoslope_pieces(high: HighEave) -> Vec<Piece> {
        let strips = Strips {
            edge_width_m: 1.0,
            ridge: false,
            hips: false,
            wall_region: Region::Edge,
            high_eave: Some(high),
        };
        pieces_for(
            RoofShape::Monoslope,
            Footprint::Rectangle {
                length_m: 12.0,
                width_m: 8.0,
            },
            strips,
        )
    }

    #[test]
    fn monoslope_high_eave_is_zoned_apart_from_the_low_eave() {
        // ASCE 7-22 Figure 30.3-5A map (from memory; zone 3' read as 4a along the high eave, a down the
        // slope): 12 x 8 m, a = 1 m. Inside the walls: 3' = 2 x 4 x 1 = 8 m2, 2' = (12 - 8) x 1 = 4 m2,
        // low corners 3 = 2 m2, zone 2 = low eave 10 + rakes 2 x 6 = 22 m2, interior 10 x 6 = 60 m2.
        let pieces = monoslope_pieces(HighEave {
            strip: Region::HighEdge,
            corner: Region::HighCorner,
            corner_along_m: 4.0,
            corner_across_m: 1.0,
        });
        for (region, expected) in [
            (Region::HighCorner, 8.0),
            (Region::HighEdge, 4.0),
            (Region::Corner, 2.0),
            (Region::Edge, 22.0),
            (Region::Interior, 60.0),
        ] {
            assert_relative_eq!(
                area_of(&pieces, region, false),
                expected,
                max_relative = 1e-9
            );
        }
        // The high eave is at local v = 8 m (the roof falls toward v = 0): every 3' piece touches it.
        for piece in pieces
            .iter()
            .filter(|p| p.region == Region::HighCorner && !p.overhang)
        {
            assert!(piece.polygon_m.iter().any(|p| (p[1] - 8.0).abs() < 1e-9));
        }
    }

    #[test]
    fn monoslope_steep_band_has_larger_corners_at_the_high_eave() {
        // ASCE 7-22 Figure 30.3-5B map (from memory): zone 3 at the high-eave corners 2a x 2a (the
        // larger reading), a x a at the low-eave corners; zone 2 strips along all four sides.
        // Corners: 2 x 4 + 2 x 1 = 10 m2; zone 2: low eave 10 + high eave 8 + rakes 2 x 5 = 28 m2.
        let pieces = monoslope_pieces(HighEave {
            strip: Region::Edge,
            corner: Region::Corner,
            corner_along_m: 2.0,
            corner_across_m: 2.0,
        });
        for (region, expected) in [(Region::Corner, 10.0), (Region::Edge, 28.0)] {
            assert_relative_eq!(
                area_of(&pieces, region, false),
                expected,
                max_relative = 1e-9
            );
        }
        assert_relative_eq!(area_of(&pieces, Region::HighEdge, false), 0.0);
    }
}
