//! The bounding edges of each roof plane, each with what it is on the roof (eave, rake, ridge, hip,
//! valley), and the wall lines under the roof.
//!
//! The framing model (crate `deck`) sets its members out from these: a rake edge has a gable-end wall
//! under it one rake overhang in, an eave edge has the eave wall one eave overhang in, and hip and
//! valley edges carry a hip or valley rafter. Plain data so that any roof shape (rectangles here,
//! L/T/U roofs elsewhere) can produce it.

use serde::{Deserialize, Serialize};

use crate::geometry::Point;

/// What one edge of a roof plane is: the shared vocabulary, re-exported here beside [`PlaneEdge`].
pub use deckhold_core::EdgeKind;

/// One straight edge of a roof plane in plan, m. The edges of a plane go round its polygon in
/// order, counter-clockwise, `to_m` of one edge being `from_m` of the next.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct PlaneEdge {
    pub from_m: [f64; 2],
    pub to_m: [f64; 2],
    pub kind: EdgeKind,
}

/// Which edges a rectangle roof's plane has, worked in the local frame (u along the ridge, v across
/// it, building on [0, lu] × [0, lv]).
#[derive(Debug, Clone, Copy)]
pub(crate) struct RectangleEdges {
    /// The roof has hips (eaves on all four sides).
    pub hip: bool,
    /// v of the ridge line (gable and hip), None for monoslope and flat.
    pub ridge_v_m: Option<f64>,
}

impl RectangleEdges {
    /// The kind of the edge from `a` to `b` of one plane polygon in the local frame.
    pub(crate) fn kind(self, a: Point, b: Point) -> EdgeKind {
        let level = (a[1] - b[1]).abs() < 1e-9;
        let across = (a[0] - b[0]).abs() < 1e-9;
        match (level, across) {
            (true, _) => match self.ridge_v_m {
                Some(ridge) if (a[1] - ridge).abs() < 1e-9 => EdgeKind::Ridge,
                _ => EdgeKind::Eave,
            },
            (false, true) if self.hip => EdgeKind::Eave,
            (false, true) => EdgeKind::Rake,
            (false, false) => EdgeKind::Hip,
        }
    }
}

/// The edges of a plan polygon in its own order, each classified by `kind`; zero-length edges are
/// dropped.
pub(crate) fn polygon_edges(
    polygon: &[Point],
    kind: impl Fn(Point, Point) -> EdgeKind,
) -> Vec<PlaneEdge> {
    let count = polygon.len();
    (0..count)
        .filter_map(|index| {
            let a = polygon[index];
            let b = polygon[(index + 1) % count];
            if (a[0] - b[0]).hypot(a[1] - b[1]) < 1e-9 {
                return None;
            }
            Some(PlaneEdge {
                from_m: a,
                to_m: b,
                kind: kind(a, b),
            })
        })
        .collect()
}

/// The wall lines of a building outline (closed polygon), one segment per side, m.
pub(crate) fn wall_lines(outline: &[Point]) -> Vec<[Point; 2]> {
    let count = outline.len();
    (0..count)
        .map(|index| [outline[index], outline[(index + 1) % count]])
        .filter(|[a, b]| (a[0] - b[0]).hypot(a[1] - b[1]) >= 1e-9)
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn kinds_read_as_kebab_case_words() {
        assert_eq!(EdgeKind::Valley.to_string(), "valley");
        assert_eq!(
            serde_json::to_string(&EdgeKind::Rake).expect("json"),
            "\"rake\""
        );
        assert!(EdgeKind::Eave.is_outer() && !EdgeKind::Hip.is_outer());
    }

    #[test]
    fn a_gable_plane_has_eave_ridge_and_two_rakes() {
        let classify = RectangleEdges {
            hip: false,
            ridge_v_m: Some(4.0),
        };
        let polygon = [[-0.3, -0.6], [12.3, -0.6], [12.3, 4.0], [-0.3, 4.0]];
        let kinds: Vec<EdgeKind> = polygon_edges(&polygon, |a, b| classify.kind(a, b))
            .iter()
            .map(|e| e.kind)
            .collect();
        assert_eq!(
            kinds,
            [
                EdgeKind::Eave,
                EdgeKind::Rake,
                EdgeKind::Ridge,
                EdgeKind::Rake
            ]
        );
    }
}
