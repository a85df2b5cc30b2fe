//! Footprint validation and the plan geometry of the roof: wall line, roof outline with overhangs,
//! roof planes and ridge/hip lines.
//!
//! Rectangles are worked in a local frame (u along the ridge, v across it, building on
//! [0, lu] × [0, lv]); `swap` maps it back to plan (u, v) → (v, u) when the ridge runs along the width,
//! then `origin` moves it into place. A polygon footprint with four corners is a rectangle and takes
//! the rectangle's path, so the two ways of writing one give the same schedule. Other polygons are
//! worked in plan directly; gable and hip roofs on them come from [`crate::roof`].

use crate::error::WindError;
use crate::geometry::{drop_collinear, make_ccw, rectangle, segments_touch, signed_area_m2, Point};
use crate::roof::wings::{detect_gable_walls, is_convex};
use crate::roof::{pitched_roof, PitchedRoof};
use crate::types::{Footprint, RidgeAlong, Roof, RoofShape};
use deckhold_core::limits;

/// The validated plan the zone layout works on.
#[derive(Debug, Clone, PartialEq)]
pub(crate) enum Plan {
    Rectangle {
        along_ridge_m: f64,
        across_ridge_m: f64,
        swap: bool,
        /// Plan position of the local origin (the building's lowest x and y corner).
        origin: Point,
    },
    Polygon {
        building_m: Vec<Point>,
        /// The walls as the user wrote them (corner i to corner i + 1), for `roof.gable_walls`.
        user_walls_m: Vec<[Point; 2]>,
    },
}

impl Plan {
    /// Least horizontal dimension, m (for polygons: the smaller side of the bounding box).
    pub(crate) fn least_dimension_m(&self) -> f64 {
        match self {
            Plan::Rectangle {
                along_ridge_m,
                across_ridge_m,
                ..
            } => along_ridge_m.min(*across_ridge_m),
            Plan::Polygon { building_m, .. } => {
                let (min, max) = bounds(building_m);
                (max[0] - min[0]).min(max[1] - min[1])
            }
        }
    }

    /// Maps a local point to plan coordinates.
    pub(crate) fn to_plan(&self, point: Point) -> Point {
        match self {
            Plan::Rectangle { origin, .. } => {
                let [x, y] = self.vector_to_plan(point);
                [x + origin[0], y + origin[1]]
            }
            Plan::Polygon { .. } => point,
        }
    }

    /// Maps a plan point back to the local frame.
    pub(crate) fn to_local(&self, point: Point) -> Point {
        match self {
            Plan::Rectangle { origin, .. } => {
                self.vector_to_plan([point[0] - origin[0], point[1] - origin[1]])
            }
            Plan::Polygon { .. } => point,
        }
    }

    /// Maps a local direction to plan (turned, not moved).
    pub(crate) fn vector_to_plan(&self, vector: Point) -> Point {
        match self {
            Plan::Rectangle { swap: true, .. } => [vector[1], vector[0]],
            _ => vector,
        }
    }

    /// Maps a local polygon to plan, counter-clockwise.
    pub(crate) fn polygon_to_plan(&self, polygon: &[Point]) -> Vec<Point> {
        make_ccw(polygon.iter().map(|p| self.to_plan(*p)).collect())
    }
}

/// Plan geometry in the local frame.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct LocalRoof {
    pub building_m: Vec<Point>,
    pub outline_m: Vec<Point>,
    pub ridge_lines_m: Vec<[Point; 2]>,
    /// (polygon, downslope unit vector) per roof plane.
    pub planes: Vec<(Vec<Point>, Point)>,
    /// Gable and hip roofs on a polygon footprint: planes, ridges, hips and valleys.
    pub pitched: Option<PitchedRoof>,
}

pub(crate) fn bounds(polygon: &[Point]) -> (Point, Point) {
    let mut min = [f64::INFINITY, f64::INFINITY];
    let mut max = [f64::NEG_INFINITY, f64::NEG_INFINITY];
    for p in polygon {
        min = [min[0].min(p[0]), min[1].min(p[1])];
        max = [max[0].max(p[0]), max[1].max(p[1])];
    }
    (min, max)
}

/// Checks the footprint and returns the plan in its working frame.
pub(crate) fn validate_footprint(
    footprint: &Footprint,
    ridge_along: RidgeAlong,
) -> Result<Plan, WindError> {
    match footprint {
        Footprint::Rectangle { length_m, width_m } => {
            limits::PLAN_SIZE_M.check("building.footprint.length_m", *length_m)?;
            limits::PLAN_SIZE_M.check("building.footprint.width_m", *width_m)?;
            Ok(rectangle_plan(*length_m, *width_m, ridge_along, [0.0, 0.0]))
        }
        Footprint::Polygon { vertices_m } => {
            let building_m = validate_polygon(vertices_m)?;
            if building_m.len() == 4 {
                let (min, max) = bounds(&building_m);
                return Ok(rectangle_plan(
                    max[0] - min[0],
                    max[1] - min[1],
                    ridge_along,
                    min,
                ));
            }
            let count = vertices_m.len();
            Ok(Plan::Polygon {
                building_m,
                user_walls_m: (0..count)
                    .map(|i| [vertices_m[i], vertices_m[(i + 1) % count]])
                    .collect(),
            })
        }
    }
}

fn rectangle_plan(length_m: f64, width_m: f64, ridge_along: RidgeAlong, origin: Point) -> Plan {
    match ridge_along {
        RidgeAlong::Length => Plan::Rectangle {
            along_ridge_m: length_m,
            across_ridge_m: width_m,
            swap: false,
            origin,
        },
        RidgeAlong::Width => Plan::Rectangle {
            along_ridge_m: width_m,
            across_ridge_m: length_m,
            swap: true,
            origin,
        },
    }
}

const POLYGON_FIELD: &str = "building.footprint.polygon_m";

/// A simple rectilinear polygon, counter-clockwise, collinear vertices removed.
fn validate_polygon(vertices: &[Point]) -> Result<Vec<Point>, WindError> {
    let coordinate = limits::OUTLINE_COORDINATE_M;
    if vertices
        .iter()
        .any(|p| !coordinate.contains(p[0]) || !coordinate.contains(p[1]))
    {
        return Err(WindError::range(
            POLYGON_FIELD,
            format!("every coordinate must be finite and within {coordinate}"),
        ));
    }
    let mut points: Vec<Point> = Vec::with_capacity(vertices.len());
    for p in vertices {
        if points.last().is_none_or(|last| last != p) {
            points.push(*p);
        }
    }
    if points.len() > 1 && points.first() == points.last() {
        points.pop();
    }
    // Remove vertices that lie on a straight run.
    let points = drop_collinear(&points, 1e-9);
    if points.len() < 4 {
        return Err(WindError::range(
            POLYGON_FIELD,
            "needs at least 4 corners enclosing an area".to_string(),
        ));
    }
    let count = points.len();
    for index in 0..count {
        let a = points[index];
        let b = points[(index + 1) % count];
        let dx = (b[0] - a[0]).abs();
        let dy = (b[1] - a[1]).abs();
        if dx > 1e-9 && dy > 1e-9 {
            return Err(WindError::unsupported(
                POLYGON_FIELD,
                format!("edge {index} is not parallel to x or y; only rectilinear outlines are supported"),
            ));
        }
    }
    for i in 0..count {
        for j in (i + 1)..count {
            let adjacent = j == i + 1 || (i == 0 && j == count - 1);
            if adjacent {
                continue;
            }
            if segments_touch(
                points[i],
                points[(i + 1) % count],
                points[j],
                points[(j + 1) % count],
            ) {
                return Err(WindError::range(
                    POLYGON_FIELD,
                    format!(
                        "edges {i} and {j} cross or touch; the outline must be a simple polygon"
                    ),
                ));
            }
        }
    }
    let points = make_ccw(points);
    if signed_area_m2(&points) < 0.25 {
        return Err(WindError::range(
            POLYGON_FIELD,
            "encloses no usable area (under 0.25 m²)".to_string(),
        ));
    }
    let (min, max) = bounds(&points);
    if (max[0] - min[0]) < 0.5 || (max[1] - min[1]) < 0.5 {
        return Err(WindError::range(
            POLYGON_FIELD,
            "is narrower than 0.5 m".to_string(),
        ));
    }
    Ok(points)
}

/// Offsets a counter-clockwise rectilinear polygon outward by `distance_m`.
fn offset_rectilinear(polygon: &[Point], distance_m: f64) -> Vec<Point> {
    let count = polygon.len();
    let normal = |index: usize| {
        let a = polygon[index % count];
        let b = polygon[(index + 1) % count];
        let length = ((b[0] - a[0]).powi(2) + (b[1] - a[1]).powi(2)).sqrt();
        [(b[1] - a[1]) / length, -(b[0] - a[0]) / length]
    };
    (0..count)
        .map(|index| {
            let before = normal(index + count - 1);
            let after = normal(index);
            [
                polygon[index][0] + distance_m * (before[0] + after[0]),
                polygon[index][1] + distance_m * (before[1] + after[1]),
            ]
        })
        .collect()
}

/// Builds the wall line, roof outline, planes and ridge lines in the local frame.
pub(crate) fn local_roof(plan: &Plan, roof: &Roof) -> Result<LocalRoof, WindError> {
    let eave_m = roof.eave_overhang_mm / 1000.0;
    let rake_m = roof.rake_overhang_mm / 1000.0;
    match plan {
        Plan::Rectangle {
            along_ridge_m: lu,
            across_ridge_m: lv,
            ..
        } => {
            let (lu, lv) = (*lu, *lv);
            // Hip roofs have eaves on all four sides.
            let end_m = if roof.shape == RoofShape::Hip {
                eave_m
            } else {
                rake_m
            };
            let building_m = rectangle(0.0, 0.0, lu, lv);
            let outline_m = rectangle(-end_m, -eave_m, lu + end_m, lv + eave_m);
            let sloped = roof.slope_deg > 0.0;
            let (planes, ridge_lines_m) = match roof.shape {
                RoofShape::Gable => (
                    vec![
                        (
                            rectangle(-end_m, -eave_m, lu + end_m, lv / 2.0),
                            [0.0, -1.0],
                        ),
                        (
                            rectangle(-end_m, lv / 2.0, lu + end_m, lv + eave_m),
                            [0.0, 1.0],
                        ),
                    ],
                    vec![[[-end_m, lv / 2.0], [lu + end_m, lv / 2.0]]],
                ),
                RoofShape::Hip => {
                    if lu + 1e-9 < lv {
                        return Err(WindError::unsupported(
                            "roof.ridge_along",
                            format!(
                                "a hip ridge along the {lu} m side is shorter than the {lv} m side it spans; set the ridge along the longer side"
                            ),
                        ));
                    }
                    let e = eave_m;
                    let left = [lv / 2.0, lv / 2.0];
                    let right = [lu - lv / 2.0, lv / 2.0];
                    let mut ridges = vec![
                        [[-e, -e], left],
                        [[-e, lv + e], left],
                        [[lu + e, -e], right],
                        [[lu + e, lv + e], right],
                    ];
                    if right[0] - left[0] > 1e-9 {
                        ridges.insert(0, [left, right]);
                    }
                    (
                        vec![
                            (vec![[-e, -e], [lu + e, -e], right, left], [0.0, -1.0]),
                            (
                                vec![[lu + e, lv + e], [-e, lv + e], left, right],
                                [0.0, 1.0],
                            ),
                            (vec![[-e, -e], left, [-e, lv + e]], [-1.0, 0.0]),
                            (vec![[lu + e, -e], [lu + e, lv + e], right], [1.0, 0.0]),
                        ],
                        ridges,
                    )
                }
                // Monoslope and sloped flat roofs fall toward local -v (plan -y for a ridge along the length).
                RoofShape::Monoslope | RoofShape::Flat => (
                    vec![(
                        outline_m.clone(),
                        if sloped { [0.0, -1.0] } else { [0.0, 0.0] },
                    )],
                    Vec::new(),
                ),
            };
            let planes = planes
                .into_iter()
                .map(|(polygon, down)| (make_ccw(polygon), down))
                .filter(|(polygon, _)| signed_area_m2(polygon) > 1e-12)
                .collect();
            Ok(LocalRoof {
                building_m,
                outline_m,
                ridge_lines_m,
                planes,
                pitched: None,
            })
        }
        Plan::Polygon {
            building_m,
            user_walls_m,
        } => {
            match roof.shape {
                RoofShape::Flat => {}
                RoofShape::Monoslope => return Err(WindError::unsupported(
                    "roof.shape",
                    "a monoslope roof needs a rectangle footprint (or a polygon with four corners)",
                )),
                RoofShape::Gable | RoofShape::Hip => {
                    return pitched_local_roof(building_m, user_walls_m, roof)
                }
            }
            let outline_m = if eave_m > 0.0 {
                let outline = make_ccw(offset_rectilinear(building_m, eave_m));
                validate_polygon(&outline).map_err(|_| {
                    WindError::range(
                        "roof.eave_overhang_mm",
                        format!(
                            "{} mm overhang folds the roof outline onto itself",
                            roof.eave_overhang_mm
                        ),
                    )
                })?
            } else {
                building_m.clone()
            };
            let down = if roof.slope_deg > 0.0 {
                [0.0, -1.0]
            } else {
                [0.0, 0.0]
            };
            Ok(LocalRoof {
                building_m: building_m.clone(),
                outline_m: outline_m.clone(),
                ridge_lines_m: Vec::new(),
                planes: vec![(outline_m, down)],
                pitched: None,
            })
        }
    }
}

/// Most corners of a footprint under a gable or hip roof (the skeleton's cost grows as n⁵).
const MAX_PITCHED_CORNERS: usize = 40;

/// Gable or hip roof on a polygon footprint.
fn pitched_local_roof(
    building_m: &[Point],
    user_walls_m: &[[Point; 2]],
    roof: &Roof,
) -> Result<LocalRoof, WindError> {
    if building_m.len() > MAX_PITCHED_CORNERS {
        return Err(WindError::unsupported(
            POLYGON_FIELD,
            format!(
                "a gable or hip roof accepts footprints of 4..{MAX_PITCHED_CORNERS} corners; this one has {}",
                building_m.len()
            ),
        ));
    }
    let gables = match roof.shape {
        RoofShape::Gable if roof.gable_walls.is_empty() => {
            let found = detect_gable_walls(building_m, roof.ridge_along == RidgeAlong::Length);
            if !found.contains(&true) {
                return Err(WindError::unsupported(
                    "roof.shape",
                    "gable: no wall of this outline ends a wing; name the gable walls in roof.gable_walls or use a hip roof",
                ));
            }
            found
        }
        RoofShape::Gable => user_gable_walls(building_m, user_walls_m, &roof.gable_walls)?,
        _ => {
            if !roof.gable_walls.is_empty() {
                return Err(WindError::range(
                    "roof.gable_walls",
                    "applies to gable roofs only; a hip roof has eaves on every wall",
                ));
            }
            vec![false; building_m.len()]
        }
    };
    let pitched = pitched_roof(
        building_m,
        &gables,
        roof.eave_overhang_mm / 1000.0,
        roof.rake_overhang_mm / 1000.0,
    )
    .map_err(|refusal| WindError::unsupported(refusal.field, refusal.detail))?;
    Ok(LocalRoof {
        building_m: building_m.to_vec(),
        outline_m: pitched.outline_m.clone(),
        ridge_lines_m: pitched
            .lines
            .iter()
            .map(|line| [line.from_m, line.to_m])
            .collect(),
        planes: pitched
            .planes
            .iter()
            .map(|plane| (plane.polygon_m.clone(), plane.downslope))
            .collect(),
        pitched: Some(pitched),
    })
}

/// The user's gable walls (indices into the corners as written) as flags on the cleaned outline.
fn user_gable_walls(
    building_m: &[Point],
    user_walls_m: &[[Point; 2]],
    indices: &[usize],
) -> Result<Vec<bool>, WindError> {
    let count = building_m.len();
    let mut flags = vec![false; count];
    for (k, index) in indices.iter().enumerate() {
        let field = format!("roof.gable_walls[{k}]");
        let Some([a, b]) = user_walls_m.get(*index) else {
            return Err(WindError::range(
                field,
                format!(
                    "wall {index} does not exist: the footprint has walls 0..{} (wall i runs from corner i to corner i + 1)",
                    user_walls_m.len().saturating_sub(1)
                ),
            ));
        };
        let mid = [(a[0] + b[0]) / 2.0, (a[1] + b[1]) / 2.0];
        let wall = (0..count).find(|i| {
            let (p, q) = (building_m[*i], building_m[(i + 1) % count]);
            segments_touch(p, q, mid, mid)
        });
        match wall {
            Some(i) if is_convex(building_m, i) && is_convex(building_m, (i + 1) % count) => {
                flags[i] = true;
            }
            _ => {
                return Err(WindError::range(
                    field,
                    format!("wall {index} does not end a wing: a gable wall needs an outside corner at both ends"),
                ))
            }
        }
    }
    Ok(flags)
}

/// The walls a gable roof on a polygon has its gables on, numbered as the user wrote the corners.
pub(crate) fn gable_wall_numbers(plan: &Plan, local: &LocalRoof) -> Vec<usize> {
    let (Plan::Polygon { user_walls_m, .. }, Some(pitched)) = (plan, &local.pitched) else {
        return Vec::new();
    };
    user_walls_m
        .iter()
        .enumerate()
        .filter(|(_, [a, b])| {
            let mid = [(a[0] + b[0]) / 2.0, (a[1] + b[1]) / 2.0];
            pitched
                .gable_walls_m
                .iter()
                .any(|[p, q]| segments_touch(*p, *q, mid, mid))
        })
        .map(|(i, _)| i)
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::geometry::area_m2;
    use approx::assert_relative_eq;

    fn roof(shape: RoofShape) -> Roof {
        Roof {
            shape,
            slope_deg: 20.0,
            ridge_along: RidgeAlong::Length,
            eave_overhang_mm: 600.0,
            rake_overhang_mm: 300.0,
            dead_load_kpa: 0.5,
            gable_walls: Vec::new(),
        }
    }

    #[test]
    fn gable_outline_uses_eave_and_rake_overhangs() {
        let plan = validate_footprint(
            &Footprint::Rectangle {
                length_m: 12.0,
                width_m: 8.0,
            },
            RidgeAlong::Length,
        )
        .expect("valid");
        let local = local_roof(&plan, &roof(RoofShape::Gable)).expect("gable");
        assert_relative_eq!(area_m2(&local.outline_m), 12.6 * 9.2, max_relative = 1e-12);
        let planes: f64 = local.planes.iter().map(|(p, _)| area_m2(p)).sum();
        assert_relative_eq!(planes, 12.6 * 9.2, max_relative = 1e-12);
    }

    #[test]
    fn hip_planes_tile_outline() {
        let plan = validate_footprint(
            &Footprint::Rectangle {
                length_m: 12.0,
                width_m: 8.0,
            },
            RidgeAlong::Length,
        )
        .expect("valid");
        let local = local_roof(&plan, &roof(RoofShape::Hip)).expect("hip");
        assert_eq!(local.planes.len(), 4);
        let planes: f64 = local.planes.iter().map(|(p, _)| area_m2(p)).sum();
        assert_relative_eq!(planes, 13.2 * 9.2, max_relative = 1e-12);
        assert_eq!(local.ridge_lines_m.len(), 5);
    }

    #[test]
    fn l_shape_is_accepted_and_offset() {
        let l_shape = vec![
            [0.0, 0.0],
            [10.0, 0.0],
            [10.0, 4.0],
            [4.0, 4.0],
            [4.0, 10.0],
            [0.0, 10.0],
        ];
        let plan = validate_footprint(
            &Footprint::Polygon {
                vertices_m: l_shape,
            },
            RidgeAlong::Length,
        )
        .expect("L");
        let mut flat = roof(RoofShape::Flat);
        flat.eave_overhang_mm = 500.0;
        let local = local_roof(&plan, &flat).expect("flat");
        // 64 m² + perimeter 40 m × 0.5 m + 4 convex corners (5 convex, 1 reflex) × 0.25 m².
        assert_relative_eq!(
            area_m2(&local.outline_m),
            64.0 + 20.0 + 4.0 * 0.25,
            max_relative = 1e-12
        );
    }

    #[test]
    fn non_rectilinear_and_crossing_polygons_are_refused() {
        let slanted = vec![[0.0, 0.0], [10.0, 0.0], [8.0, 5.0], [0.0, 5.0]];
        let error = validate_footprint(
            &Footprint::Polygon {
                vertices_m: slanted,
            },
            RidgeAlong::Length,
        )
        .expect_err("slanted");
        assert!(error
            .to_string()
            .starts_with("building.footprint.polygon_m"));
        let bow_tie = vec![
            [0.0, 0.0],
            [4.0, 0.0],
            [4.0, 2.0],
            [2.0, 2.0],
            [2.0, -2.0],
            [0.0, -2.0],
        ];
        let error = validate_footprint(
            &Footprint::Polygon {
                vertices_m: bow_tie,
            },
            RidgeAlong::Length,
        )
        .expect_err("crossing");
        assert!(error.to_string().contains("simple polygon"));
    }

    #[test]
    fn zero_size_is_refused() {
        let error = validate_footprint(
            &Footprint::Rectangle {
                length_m: 0.0,
                width_m: 8.0,
            },
            RidgeAlong::Length,
        )
        .expect_err("zero");
        assert!(error.to_string().starts_with("building.footprint.length_m"));
    }
}
