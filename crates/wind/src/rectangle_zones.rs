//! The zone layout of a rectangle roof: the outline cut on a grid at every zone boundary along and
//! across the ridge, the two sides of each hip's edge band cut only into the cells where they bound a
//! zone, and the whole cells of one region joined into rectangles.
//!
//! Cutting the whole outline by every line, as a polygon footprint is cut, gave a 14 m x 11 m hip roof
//! some 240 pieces: each hip's lines ran on across the roof, cutting cells where they bound nothing,
//! and the deck then joined the pieces again. The grid gives every point the region the full cut
//! gives it (see the test against it below) in a fraction of the pieces. Cells are joined up to the
//! ridge line, never over it, so that the pieces of a gable still lie each on one plane (the plan's
//! zone labels point at them); a hip's pieces may run over a hip line, which bounds no zone.

use crate::geometry::{area_m2, centroid, rectangle, Point};
use crate::outline::{bounds, LocalRoof};
use crate::zones::{cut_all, Piece, Region, Strips, SLIVER_M2};

/// Slack on the test of which quarter of the roof a cell reaches, m: a cell on the centre line takes
/// the lines of both quarters (an extra cut is harmless, a missing one would not be).
const QUARTER_SLACK_M: f64 = 1e-9;

/// Cuts the rectangle roof's outline into classified pieces (local frame: u along the ridge, v
/// across it, walls from 0 to `lu` and `lv`).
pub(crate) fn rectangle_layout(lu: f64, lv: f64, local: &LocalRoof, strips: Strips) -> Vec<Piece> {
    let a = strips.edge_width_m;
    let (u_cuts, v_cuts) = axis_cuts(lu, lv, strips);
    let hips = if strips.hips {
        hip_bands(lu, lv, a)
    } else {
        Vec::new()
    };
    let (low, high) = bounds(&local.outline_m);
    let grid = Grid {
        u_m: grid_positions(low[0], high[0], &u_cuts),
        v_m: grid_positions(low[1], high[1], &v_cuts),
    };
    let classify = |polygon: &[Point]| {
        let [u, v] = centroid(polygon);
        classify_rectangle(u, v, lu, lv, strips)
    };

    let mut whole: Vec<Option<(Region, bool)>> = vec![None; grid.columns() * grid.rows()];
    let mut pieces = Vec::new();
    let mut lines: Vec<(Point, f64)> = Vec::new();
    for row in 0..grid.rows() {
        for column in 0..grid.columns() {
            let [u0, u1] = [grid.u_m[column], grid.u_m[column + 1]];
            let [v0, v1] = [grid.v_m[row], grid.v_m[row + 1]];
            let corners = [[u0, v0], [u1, v0], [u1, v1], [u0, v1]];
            if area_m2(&corners) <= SLIVER_M2 {
                continue;
            }
            lines.clear();
            // A cell along a wall is edge or corner throughout: no band changes its region.
            let off_the_walls = u0 >= a && u1 <= lu - a && v0 >= a && v1 <= lv - a;
            if off_the_walls {
                lines.extend(
                    hips.iter()
                        .filter(|band| band.reaches([u0, u1], [v0, v1], lu, lv))
                        .flat_map(|band| band.sides),
                );
            }
            let parts = if lines.is_empty() {
                Vec::new()
            } else {
                cut_all(vec![corners.to_vec()], &lines)
            };
            // No line crosses the cell (or one only touches a corner): it is whole.
            if lines.is_empty() || matches!(parts.as_slice(), [part] if part.as_slice() == corners)
            {
                whole[row * grid.columns() + column] = Some(classify(&corners));
                continue;
            }
            pieces.extend(parts.into_iter().map(|polygon_m| {
                let (region, overhang) = classify(&polygon_m);
                Piece {
                    region,
                    overhang,
                    polygon_m,
                }
            }));
        }
    }
    let mut joined = grid.join_cells(&whole, lv / 2.0);
    joined.append(&mut pieces);
    joined
}

/// Where a zone boundary runs along v (at these u, m) or along u (at these v, m): the strips along
/// the walls, the ridge and its strips, a hip's band ends, a monoslope's high-eave corners.
fn axis_cuts(lu: f64, lv: f64, strips: Strips) -> (Vec<f64>, Vec<f64>) {
    let a = strips.edge_width_m;
    let mut u_cuts = vec![0.0, a, lu - a, lu];
    let mut v_cuts = vec![0.0, a, lv - a, lv, lv / 2.0];
    if strips.ridge || strips.hips {
        v_cuts.extend([lv / 2.0 - a, lv / 2.0 + a]);
    }
    if let Some(high) = strips.high_eave {
        u_cuts.extend([high.corner_along_m, lu - high.corner_along_m]);
        v_cuts.push(lv - high.corner_across_m);
    }
    if strips.hips {
        u_cuts.extend([
            lv / 2.0 - a,
            lv / 2.0 + a,
            lu - lv / 2.0 - a,
            lu - lv / 2.0 + a,
        ]);
    }
    (u_cuts, v_cuts)
}

/// The grid's lines, m: the outline's two ends and every cut strictly between them, in order, each
/// once.
fn grid_positions(low_m: f64, high_m: f64, cuts: &[f64]) -> Vec<f64> {
    let mut positions: Vec<f64> = std::iter::once(low_m)
        .chain(cuts.iter().copied().filter(|c| *c > low_m && *c < high_m))
        .chain(std::iter::once(high_m))
        .collect();
    positions.sort_by(f64::total_cmp);
    positions.dedup();
    positions
}

/// One hip's edge band: its two sides, `a` either side of the hip line, and the eave corner the hip
/// starts from (the quarter of the roof where the sides bound a zone).
#[derive(Debug, Clone, Copy)]
struct HipBand {
    /// Lines as (normal, offset): normal · p = offset.
    sides: [(Point, f64); 2],
    /// The hip's eave corner is at u = 0 (else u = lu), at v = 0 (else v = lv).
    at_low_u: bool,
    at_low_v: bool,
}

impl HipBand {
    /// Whether the cell `[u0, u1] x [v0, v1]` reaches into this hip's quarter of the roof, where
    /// the distances to the nearer eaves are measured from the hip's corner.
    fn reaches(&self, [u0, u1]: [f64; 2], [v0, v1]: [f64; 2], lu: f64, lv: f64) -> bool {
        let in_u = if self.at_low_u {
            u0 <= lu / 2.0 + QUARTER_SLACK_M
        } else {
            u1 >= lu / 2.0 - QUARTER_SLACK_M
        };
        let in_v = if self.at_low_v {
            v0 <= lv / 2.0 + QUARTER_SLACK_M
        } else {
            v1 >= lv / 2.0 - QUARTER_SLACK_M
        };
        in_u && in_v
    }
}

/// The four hips' bands: within `a` of the hip line either side (a shift of a·√2 along u for lines
/// at 45°).
fn hip_bands(lu: f64, lv: f64, a: f64) -> Vec<HipBand> {
    let shift = a * std::f64::consts::SQRT_2;
    let band = |normal: Point, base: f64, at_low_u: bool, at_low_v: bool| HipBand {
        sides: [-shift, shift].map(|delta| (normal, base + delta)),
        at_low_u,
        at_low_v,
    };
    vec![
        // u - v = 0 from the corner (0, 0); u - v = lu - lv from (lu, lv).
        band([1.0, -1.0], 0.0, true, true),
        band([1.0, -1.0], lu - lv, false, false),
        // u + v = lu from (lu, 0); u + v = lv from (0, lv).
        band([1.0, 1.0], lu, false, true),
        band([1.0, 1.0], lv, true, false),
    ]
}

/// The cut grid: column lines along u, row lines along v, m.
struct Grid {
    u_m: Vec<f64>,
    v_m: Vec<f64>,
}

impl Grid {
    fn columns(&self) -> usize {
        self.u_m.len() - 1
    }

    fn rows(&self) -> usize {
        self.v_m.len() - 1
    }

    /// The whole cells (`whole[row * columns + column]`, None for a cut or dropped cell) joined into
    /// rectangles: side by side cells of one region in a row make a run, and runs over the same
    /// columns with the same region in consecutive rows make one rectangle, except over the row line
    /// at `ridge_v_m`.
    fn join_cells(&self, whole: &[Option<(Region, bool)>], ridge_v_m: f64) -> Vec<Piece> {
        /// A rectangle still growing up the rows: its columns, region and first row.
        struct Open {
            columns: [usize; 2],
            class: (Region, bool),
            first_row: usize,
        }
        let mut done = Vec::new();
        let mut open: Vec<Open> = Vec::new();
        let mut runs: Vec<([usize; 2], (Region, bool))> = Vec::new();
        let close = |rectangle_of: Open, end_row: usize| {
            let [c0, c1] = rectangle_of.columns;
            Piece {
                region: rectangle_of.class.0,
                overhang: rectangle_of.class.1,
                polygon_m: rectangle(
                    self.u_m[c0],
                    self.v_m[rectangle_of.first_row],
                    self.u_m[c1],
                    self.v_m[end_row],
                ),
            }
        };
        for row in 0..self.rows() {
            if self.v_m[row] == ridge_v_m {
                done.extend(open.drain(..).map(|growing| close(growing, row)));
            }
            runs.clear();
            let cells = &whole[row * self.columns()..(row + 1) * self.columns()];
            let mut column = 0;
            while column < cells.len() {
                let Some(class) = cells[column] else {
                    column += 1;
                    continue;
                };
                let start = column;
                while column < cells.len() && cells[column] == Some(class) {
                    column += 1;
                }
                runs.push(([start, column], class));
            }
            let mut still_open = Vec::with_capacity(open.len());
            for growing in open.drain(..) {
                match runs
                    .iter()
                    .position(|run| *run == (growing.columns, growing.class))
                {
                    Some(at) => {
                        runs.remove(at);
                        still_open.push(growing);
                    }
                    None => done.push(close(growing, row)),
                }
            }
            still_open.extend(runs.iter().map(|&(columns, class)| Open {
                columns,
                class,
                first_row: row,
            }));
            open = still_open;
        }
        done.extend(open.into_iter().map(|growing| close(growing, self.rows())));
        done
    }
}

/// Region of a point in the local rectangle frame; overhang points take the region of the
/// nearest point of the wall line.
pub(crate) fn classify_rectangle(
    u: f64,
    v: f64,
    lu: f64,
    lv: f64,
    strips: Strips,
) -> (Region, bool) {
    let a = strips.edge_width_m;
    let qu = u.clamp(0.0, lu);
    let qv = v.clamp(0.0, lv);
    let overhang = (qu - u).abs() > 1e-9 || (qv - v).abs() > 1e-9;
    let du = qu.min(lu - qu);
    let dv = qv.min(lv - qv);
    let near_ridge = (qv - lv / 2.0).abs() < a;
    let near_wall = du < a || dv < a;
    // Eave corners, and for gables the ends of the ridge strip at the rakes.
    let corner = (du < a && dv < a) || (strips.ridge && near_ridge && du < a);
    let ridge_strip = strips.ridge && near_ridge;
    let hip_ridge = strips.hips && near_ridge && du > lv / 2.0 - a;
    let hip_band = strips.hips
        && (du - dv).abs() / std::f64::consts::SQRT_2 < a
        && du < lv / 2.0 + a
        && dv < lv / 2.0 + a;
    let region = if corner || (near_wall && strips.wall_region == Region::Corner) {
        Region::Corner
    } else if near_wall || ridge_strip || hip_ridge || hip_band {
        Region::Edge
    } else {
        Region::Interior
    };
    let region = match strips.high_eave {
        Some(high) => high_eave_region(high, region, du, lv - qv, a),
        None => region,
    };
    (region, overhang)
}

/// The region of a monoslope point `from_high_m` down the slope from the high eave and `du` from the
/// nearer rake: the high-eave corner (its own extent each way), the high-eave strip, or `region`.
fn high_eave_region(
    high: crate::zones::HighEave,
    region: Region,
    du: f64,
    from_high_m: f64,
    a: f64,
) -> Region {
    if du < high.corner_along_m && from_high_m < high.corner_across_m {
        high.corner
    } else if from_high_m < a && region != Region::Corner {
        high.strip
    } else {
        region
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::geometry::contains;
    use crate::outline::{local_roof, validate_footprint};
    use crate::types::{Footprint, RidgeAlong, Roof, RoofShape};
    use crate::zones::HighEave;
    use proptest::prelude::*;

    /// The layout as it was made before the grid: the whole outline cut by every line, each piece
    /// classified at its centroid. The grid must give every point the same region.
    fn full_cut_layout(lu: f64, lv: f64, local: &LocalRoof, strips: Strips) -> Vec<Piece> {
        let (u_cuts, v_cuts) = axis_cuts(lu, lv, strips);
        let mut lines: Vec<(Point, f64)> = Vec::new();
        if strips.hips {
            // Each band's two sides and the hip line between them.
            for band in hip_bands(lu, lv, strips.edge_width_m) {
                let (normal, low) = band.sides[0];
                let high = band.sides[1].1;
                lines.extend([low, 0.5 * (low + high), high].map(|offset| (normal, offset)));
            }
        }
        lines.extend(u_cuts.iter().map(|u| ([1.0, 0.0], *u)));
        lines.extend(v_cuts.iter().map(|v| ([0.0, 1.0], *v)));
        cut_all(vec![local.outline_m.clone()], &lines)
            .into_iter()
            .map(|polygon_m| {
                let [u, v] = centroid(&polygon_m);
                let (region, overhang) = classify_rectangle(u, v, lu, lv, strips);
                Piece {
                    region,
                    overhang,
                    polygon_m,
                }
            })
            .collect()
    }

    /// The one region and overhang flag of the pieces containing `point`; None on a boundary (in two
    /// pieces or none).
    fn class_at(pieces: &[Piece], point: Point) -> Option<(Region, bool)> {
        let mut found = pieces
            .iter()
            .filter(|piece| contains(&piece.polygon_m, point))
            .map(|piece| (piece.region, piece.overhang));
        let first = found.next()?;
        found.next().is_none().then_some(first)
    }

    struct Case {
        shape: RoofShape,
        length_m: f64,
        width_m: f64,
        eave_mm: f64,
        rake_mm: f64,
        strips: Strips,
    }

    /// Both layouts of one roof: (grid, full cut), after checking that the grid's pieces tile the
    /// outline.
    fn both(case: &Case) -> (Vec<Piece>, Vec<Piece>) {
        let roof = Roof {
            shape: case.shape,
            slope_deg: 20.0,
            ridge_along: RidgeAlong::Length,
            eave_overhang_mm: case.eave_mm,
            rake_overhang_mm: case.rake_mm,
            dead_load_kpa: 0.5,
            gable_walls: Vec::new(),
        };
        let footprint = Footprint::Rectangle {
            length_m: case.length_m,
            width_m: case.width_m,
        };
        let plan = validate_footprint(&footprint, RidgeAlong::Length).expect("plan");
        let local = local_roof(&plan, &roof).expect("roof");
        let (lu, lv) = (case.length_m, case.width_m);
        let grid = rectangle_layout(lu, lv, &local, case.strips);
        let total: f64 = grid.iter().map(|p| area_m2(&p.polygon_m)).sum();
        assert!(
            (total - area_m2(&local.outline_m)).abs() <= 1e-9 * total,
            "the grid's pieces tile the outline: {total} m2"
        );
        (grid, full_cut_layout(lu, lv, &local, case.strips))
    }

    /// Compares the two layouts' regions at a lattice of points over the outline (steps that are no
    /// round fraction of the roof, so that few points fall on a boundary) and their areas by region.
    fn assert_same_regions(case: &Case) {
        let (grid, full) = both(case);
        let (low, high) = bounds(
            &full
                .iter()
                .flat_map(|p| p.polygon_m.clone())
                .collect::<Vec<_>>(),
        );
        let mut compared = 0;
        for i in 0..=113 {
            for j in 0..=101 {
                let point = [
                    low[0] + (high[0] - low[0]) * (f64::from(i) + 0.371) / 114.0,
                    low[1] + (high[1] - low[1]) * (f64::from(j) + 0.619) / 102.0,
                ];
                let (Some(in_grid), Some(in_full)) =
                    (class_at(&grid, point), class_at(&full, point))
                else {
                    continue;
                };
                assert_eq!(in_grid, in_full, "at {point:?}");
                compared += 1;
            }
        }
        assert!(compared > 10_000, "only {compared} points compared");
        for region in Region::ALL {
            for overhang in [false, true] {
                let area = |pieces: &[Piece]| -> f64 {
                    pieces
                        .iter()
                        .filter(|p| p.region == region && p.overhang == overhang)
                        .map(|p| area_m2(&p.polygon_m))
                        .sum()
                };
                assert!(
                    (area(&grid) - area(&full)).abs() <= 1e-9 * area(&full).max(1.0),
                    "{region:?} overhang {overhang}: {} against {}",
                    area(&grid),
                    area(&full)
                );
            }
        }
    }

    fn strips(a: f64, ridge: bool, hips: bool) -> Strips {
        Strips {
            edge_width_m: a,
            ridge,
            hips,
            wall_region: Region::Edge,
            high_eave: None,
        }
    }

    #[test]
    fn the_grid_gives_every_point_the_region_the_full_cut_gives() {
        let mut cases = vec![
            // Gable with ridge strips, and a low gable without.
            (
                RoofShape::Gable,
                12.0,
                8.0,
                600.0,
                300.0,
                strips(1.0, true, false),
            ),
            (
                RoofShape::Gable,
                19.6,
                6.1,
                400.0,
                0.0,
                strips(0.9, false, false),
            ),
            // Hips: long, nearly square, square (no ridge), narrow with wide strips.
            (
                RoofShape::Hip,
                14.4,
                10.8,
                600.0,
                600.0,
                strips(1.08, false, true),
            ),
            (
                RoofShape::Hip,
                10.0,
                9.7,
                450.0,
                450.0,
                strips(0.97, false, true),
            ),
            (RoofShape::Hip, 9.0, 9.0, 0.0, 0.0, strips(0.9, false, true)),
            (
                RoofShape::Hip,
                16.0,
                5.0,
                300.0,
                300.0,
                strips(2.0, false, true),
            ),
            (
                RoofShape::Flat,
                30.0,
                20.0,
                0.0,
                0.0,
                strips(2.0, false, false),
            ),
        ];
        let mut corner_eaves = strips(1.0, false, true);
        corner_eaves.wall_region = Region::Corner;
        cases.push((RoofShape::Hip, 13.0, 8.0, 500.0, 500.0, corner_eaves));
        let mut high = strips(1.0, false, false);
        high.high_eave = Some(HighEave {
            strip: Region::HighEdge,
            corner: Region::HighCorner,
            corner_along_m: 4.0,
            corner_across_m: 1.0,
        });
        cases.push((RoofShape::Monoslope, 12.0, 8.0, 600.0, 300.0, high));
        for (shape, length_m, width_m, eave_mm, rake_mm, strips) in cases {
            assert_same_regions(&Case {
                shape,
                length_m,
                width_m,
                eave_mm,
                rake_mm,
                strips,
            });
        }
    }

    #[test]
    fn a_hip_roof_comes_in_far_fewer_pieces() {
        // 82 pieces against 242 when written: a regression figure for the speed-up, counted from the two
        // layouts (not an outside value).
        let (grid, full) = both(&Case {
            shape: RoofShape::Hip,
            length_m: 14.4,
            width_m: 10.8,
            eave_mm: 600.0,
            rake_mm: 600.0,
            strips: strips(1.08, false, true),
        });
        assert!(
            grid.len() * 2 < full.len(),
            "{} pieces against {}",
            grid.len(),
            full.len()
        );
    }

    proptest! {
        #![proptest_config(ProptestConfig::with_cases(24))]
        #[test]
        fn any_rectangle_roof_is_zoned_as_the_full_cut_zones_it(
            width_m in 4.0f64..20.0,
            extra_m in 0.0f64..25.0,
            a_fraction in 0.04f64..0.2,
            eave_mm in 0.0f64..900.0,
            rake_mm in 0.0f64..900.0,
            shape in 0usize..3,
        ) {
            let length_m = width_m + extra_m;
            let a = (a_fraction * width_m).max(0.9);
            let (shape, strips) = match shape {
                0 => (RoofShape::Gable, strips(a, true, false)),
                1 => (RoofShape::Hip, strips(a, false, true)),
                _ => (RoofShape::Flat, strips(a, false, false)),
            };
            assert_same_regions(&Case { shape, length_m, width_m, eave_mm, rake_mm, strips });
        }
    }
}
