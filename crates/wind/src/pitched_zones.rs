//! Zones on gable and hip roofs over polygon footprints (L, T, U houses), plane by plane.
//!
//! Each plane's convex pieces are cut by every zone boundary and each cut piece is classified at its
//! centre, so a zone never straddles a ridge, hip or valley. The readings taken (the figures of the
//! basis are drawn for rectangles; see docs/wind-method.md):
//! - corner zones at every outside corner of the walls, as on a rectangle;
//! - corner zones also at every inside (reentrant) corner: the figures draw none there; the tool
//!   takes the more severe reading (a square of side a at each inside corner);
//! - edge strips of width a along every wall (eaves and gable walls);
//! - when the basis draws edge strips along ridges and hips (pitched over 7°), the same strips along
//!   every ridge, hip and valley, a each side; valleys have no strip in the figures, the tool takes
//!   the more severe reading;
//! - on gables, corner zones where a ridge meets a gable wall, as on a rectangle gable.
//!
//! Overhang parts take the zone of the nearest point of the wall line, as on rectangles.

use crate::edges::EdgeKind;
use crate::geometry::{centroid, nearest_on_segment, signed_area_m2, Point};
use crate::roof::merge::union;
use crate::roof::wings::is_convex;
use crate::roof::{BoundLine, PitchedRoof};
use crate::zones::{
    classify_polygon, cut_all, in_corner_square, nearest_on_boundary, Piece, Region, Strips,
};

/// Cuts every plane of `roof` into classified pieces, one polygon per plane, zone and overhang.
pub(crate) fn layout(building: &[Point], roof: &PitchedRoof, strips: Strips) -> Vec<Piece> {
    let a = strips.edge_width_m;
    let banded = strips.ridge || strips.hips;
    let inside_corners: Vec<Point> = (0..building.len())
        .filter(|i| !is_convex(building, *i))
        .map(|i| building[i])
        .collect();
    let ridge_ends = if strips.ridge {
        ridge_ends_on_gables(roof)
    } else {
        Vec::new()
    };
    let mut lines: Vec<(Point, f64)> = Vec::new();
    for p in building.iter().chain(&ridge_ends) {
        for d in [-a, 0.0, a] {
            lines.push(([1.0, 0.0], p[0] + d));
            lines.push(([0.0, 1.0], p[1] + d));
        }
    }
    let banded_lines: Vec<&BoundLine> = if banded {
        roof.lines.iter().collect()
    } else {
        Vec::new()
    };
    for line in &banded_lines {
        let (normal, offset) = unit_normal(line);
        for d in [-a, 0.0, a] {
            lines.push((normal, offset + d));
        }
    }
    let context = Context {
        building,
        a,
        inside_corners: &inside_corners,
        ridge_ends: &ridge_ends,
        banded_lines: &banded_lines,
        wall_region: strips.wall_region,
    };
    let mut result = Vec::new();
    for plane in &roof.planes {
        let mut groups: Vec<(ZoneClass, Vec<Vec<Point>>)> = Vec::new();
        for piece in cut_all(plane.pieces_m.clone(), &lines) {
            let class = context.classify(centroid(&piece));
            match groups.iter_mut().find(|(key, _)| *key == class) {
                Some((_, members)) => members.push(piece),
                None => groups.push((class, vec![piece])),
            }
        }
        for ((region, overhang), members) in groups {
            // Joined where the union has no holes (an edge strip ringing an interior keeps its pieces).
            let joined = union(&members);
            let polygons = if joined.iter().all(|p| signed_area_m2(p) > 0.0) {
                joined
            } else {
                members
            };
            for polygon_m in polygons {
                result.push(Piece {
                    region,
                    overhang,
                    polygon_m,
                });
            }
        }
    }
    result
}

/// Region and whether the piece is overhang.
type ZoneClass = (Region, bool);

struct Context<'a> {
    building: &'a [Point],
    a: f64,
    inside_corners: &'a [Point],
    ridge_ends: &'a [Point],
    banded_lines: &'a [&'a BoundLine],
    /// The region of the strips along the walls (corner where the figure's map says so).
    wall_region: Region,
}

impl Context<'_> {
    fn classify(&self, point: Point) -> ZoneClass {
        let (region, overhang) = classify_polygon(point, self.building, self.a);
        let on_walls = if overhang {
            nearest_on_boundary(point, self.building)
        } else {
            point
        };
        let near = |corner: &Point| in_corner_square(on_walls, *corner, self.a);
        let along_wall = region == Region::Edge;
        let region = if self.inside_corners.iter().any(near)
            || self.ridge_ends.iter().any(near)
            || (along_wall && self.wall_region == Region::Corner)
        {
            Region::Corner
        } else if region == Region::Interior
            && self
                .banded_lines
                .iter()
                .any(|line| distance_to_segment(point, line) < self.a)
        {
            Region::Edge
        } else {
            region
        };
        (region, overhang)
    }
}

/// Unit normal and offset of the line through `line` (normal · p = offset).
fn unit_normal(line: &BoundLine) -> (Point, f64) {
    let length = line.length_m();
    let d = [
        (line.to_m[0] - line.from_m[0]) / length,
        (line.to_m[1] - line.from_m[1]) / length,
    ];
    let normal = [-d[1], d[0]];
    (
        normal,
        normal[0] * line.from_m[0] + normal[1] * line.from_m[1],
    )
}

fn distance_to_segment(point: Point, line: &BoundLine) -> f64 {
    let foot = nearest_on_segment(point, line.from_m, line.to_m);
    (foot[0] - point[0]).hypot(foot[1] - point[1])
}

/// Where ridges reach a gable wall: each ridge end lying on a rake, moved onto the wall under it.
fn ridge_ends_on_gables(roof: &PitchedRoof) -> Vec<Point> {
    let mut ends = Vec::new();
    for line in roof.lines.iter().filter(|l| l.kind == EdgeKind::Ridge) {
        for end in [line.from_m, line.to_m] {
            let on_rake = roof
                .planes
                .iter()
                .flat_map(|p| &p.bounds)
                .any(|b| b.kind == EdgeKind::Rake && distance_to_segment(end, b) < 1e-6);
            if !on_rake {
                continue;
            }
            for [p, q] in &roof.gable_walls_m {
                let wall = BoundLine {
                    kind: EdgeKind::Rake,
                    from_m: *p,
                    to_m: *q,
                };
                let (normal, offset) = unit_normal(&wall);
                let off = normal[0] * end[0] + normal[1] * end[1] - offset;
                let foot = [end[0] - off * normal[0], end[1] - off * normal[1]];
                if distance_to_segment(foot, &wall) < 1e-6 && off.abs() < 3.0 + 1e-6 {
                    ends.push(foot);
                }
            }
        }
    }
    ends
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::geometry::area_m2;
    use crate::roof::pitched_roof;
    use crate::roof::tests::{l_shape, t_shape};
    use crate::roof::wings::detect_gable_walls;
    use crate::zones::tests::area_of;
    use approx::assert_relative_eq;

    #[test]
    fn hip_l_zones_tile_and_count_every_corner() {
        // L of two 4 m wings, no overhang, a = 1 m, hip bands on. Corners: five outside corners
        // (1 m² each) and the inside corner at (4, 4) (three quarters of a 2 × 2 m square inside
        // the walls: 3 m²): 8 m².
        let roof = pitched_roof(&l_shape(), &[false; 6], 0.0, 0.0).expect("roof");
        let strips = Strips {
            edge_width_m: 1.0,
            ridge: false,
            hips: true,
            wall_region: Region::Edge,
            high_eave: None,
        };
        let pieces = layout(&l_shape(), &roof, strips);
        let total: f64 = pieces.iter().map(|p| area_m2(&p.polygon_m)).sum();
        assert_relative_eq!(total, 64.0, max_relative = 1e-9);
        assert_relative_eq!(
            area_of(&pieces, Region::Corner, false),
            8.0,
            max_relative = 1e-9
        );
        // Interior: only what lies 1 m clear of walls, hips, valley and ridges.
        assert!(area_of(&pieces, Region::Interior, false) < 64.0 - 8.0 - 20.0);
    }

    #[test]
    fn cross_gable_t_has_ridge_end_corners_at_its_three_gables() {
        let gables = detect_gable_walls(&t_shape(), true);
        let roof = pitched_roof(&t_shape(), &gables, 0.0, 0.0).expect("roof");
        assert_eq!(ridge_ends_on_gables(&roof).len(), 3);
        let strips = Strips {
            edge_width_m: 1.0,
            ridge: true,
            hips: false,
            wall_region: Region::Edge,
            high_eave: None,
        };
        let pieces = layout(&t_shape(), &roof, strips);
        let total: f64 = pieces.iter().map(|p| area_m2(&p.polygon_m)).sum();
        assert_relative_eq!(total, 240.0, max_relative = 1e-9);
        // Six outside corners (1 m² each), two inside corners (3 m² each), three ridge ends on the
        // gable walls (2 × 1 m each, straddling the ridge): 6 + 6 + 6 = 18 m².
        assert_relative_eq!(
            area_of(&pieces, Region::Corner, false),
            18.0,
            max_relative = 1e-9
        );
    }
}
