//! The marks beside a monoslope's eaves: "HIGH EAVE" and "low eave". A monoslope's zones along its
//! high eave are not those along its low eave (ASCE 7-22 zones 2' and 3'; the NBC map zones the high
//! eave apart too), so the crew must see which eave is which; the zone hatches alone do not say it.
//! Marked only when the zones include high-eave zones (a low-slope "flat" roof has an eave at its top
//! too, but its zones are the same along every eave), and then only planes with an eave at their top
//! (a gable or hip plane has a ridge there).

use super::labels::{box_size, LabelStyle, PlanLabel};
use crate::{EdgeKind, PlanPlane, PlanZone};

/// The mark beside a high eave.
pub(crate) const HIGH_EAVE: &str = "HIGH EAVE";
/// The mark beside a low eave.
pub(crate) const LOW_EAVE: &str = "low eave";

/// Planes flatter than this have no high side to mark, degrees.
const FLAT_DEG: f64 = 0.5;
/// How far an eave's ends may lie from the plane's top or bottom and still count as there, m.
const LEVEL_TOLERANCE_M: f64 = 0.01;
/// Clear gap between an eave and its mark, mm on the page.
const GAP_MM: f64 = 1.0;

fn dot(a: [f64; 2], b: [f64; 2]) -> f64 {
    a[0] * b[0] + a[1] * b[1]
}

/// The eave marks of `planes` in page millimetres through `page`. Each mark's anchors are the centres
/// of a box just outside its eave (at mid-length, then its quarter points), then just past either end
/// on the eave's own line, for when the line numbers crowd the eave's outer side.
pub(crate) fn eave_labels(
    planes: &[PlanPlane],
    zones: &[PlanZone],
    page: impl Fn([f64; 2]) -> [f64; 2],
) -> Vec<PlanLabel> {
    let mut labels = Vec::new();
    if !zones.iter().any(|zone| zone.label.base() != zone.label) {
        return labels;
    }
    for plane in planes.iter().filter(|plane| plane.slope_deg > FLAT_DEG) {
        let down = plane.downslope_m;
        let heights = plane.polygon_m.iter().map(|p| dot(*p, down));
        let top = heights.clone().fold(f64::INFINITY, f64::min);
        let bottom = heights.fold(f64::NEG_INFINITY, f64::max);
        let at = |edge: &crate::PlanEdge, level: f64| {
            [edge.from_m, edge.to_m]
                .iter()
                .all(|p| (dot(*p, down) - level).abs() <= LEVEL_TOLERANCE_M)
        };
        let eaves = || plane.edges.iter().filter(|e| e.kind == EdgeKind::Eave);
        if !eaves().any(|edge| at(edge, top)) {
            continue;
        }
        for edge in eaves() {
            // Outward: up the slope past a high eave, down the slope past a low one.
            let (text, outward) = if at(edge, top) {
                (HIGH_EAVE, [-down[0], -down[1]])
            } else if at(edge, bottom) {
                (LOW_EAVE, down)
            } else {
                continue;
            };
            let lines = vec![text.to_string()];
            let (w, h) = box_size(&lines, LabelStyle::Eave);
            // How far a box centre sits from its anchor line, along unit vector u, to clear it.
            let clear = |u: [f64; 2]| (u[0].abs() * w + u[1].abs() * h) / 2.0 + GAP_MM;
            let from = page(edge.from_m);
            let to = page(edge.to_m);
            let length = (to[0] - from[0]).hypot(to[1] - from[1]);
            if length <= 0.0 {
                continue;
            }
            let along = [(to[0] - from[0]) / length, (to[1] - from[1]) / length];
            let out = clear(outward);
            let mut anchors: Vec<[f64; 2]> = [0.5, 0.25, 0.75]
                .iter()
                .map(|t| {
                    [
                        from[0] + (to[0] - from[0]) * t + outward[0] * out,
                        from[1] + (to[1] - from[1]) * t + outward[1] * out,
                    ]
                })
                .collect();
            let past = clear(along);
            anchors.push([from[0] - along[0] * past, from[1] - along[1] * past]);
            anchors.push([to[0] + along[0] * past, to[1] + along[1] * past]);
            labels.push(PlanLabel {
                lines,
                region: None,
                style: LabelStyle::Eave,
                anchors,
            });
        }
    }
    labels
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::{PlanEdge, ZoneKind};

    fn zones(kinds: &[ZoneKind]) -> Vec<PlanZone> {
        kinds
            .iter()
            .map(|label| PlanZone {
                label: *label,
                code_zone: String::new(),
                polygons_m: Vec::new(),
            })
            .collect()
    }

    fn edge(kind: EdgeKind, from_m: [f64; 2], to_m: [f64; 2]) -> PlanEdge {
        PlanEdge {
            kind,
            from_m,
            to_m,
            length_m: 0.0,
            length_on_slope_m: 0.0,
        }
    }

    /// A 10 x 4 m plane falling toward y = 0 with `top` as its upper side.
    fn plane(top: EdgeKind, slope_deg: f64) -> PlanPlane {
        PlanPlane {
            name: "P1".to_string(),
            polygon_m: vec![[0.0, 0.0], [10.0, 0.0], [10.0, 4.0], [0.0, 4.0]],
            slope_deg,
            downslope_m: [0.0, -1.0],
            area_plan_m2: 40.0,
            area_on_slope_m2: 40.0,
            edges: vec![
                edge(EdgeKind::Eave, [0.0, 0.0], [10.0, 0.0]),
                edge(EdgeKind::Rake, [10.0, 0.0], [10.0, 4.0]),
                edge(top, [10.0, 4.0], [0.0, 4.0]),
                edge(EdgeKind::Rake, [0.0, 4.0], [0.0, 0.0]),
            ],
        }
    }

    #[test]
    fn a_monoslope_gets_a_high_and_a_low_mark_each_outside_its_own_eave() {
        let zoned = zones(&[ZoneKind::Edge, ZoneKind::HighEdge]);
        let labels = eave_labels(&[plane(EdgeKind::Eave, 9.5)], &zoned, |p| p);
        let texts: Vec<&str> = labels.iter().map(|l| l.lines[0].as_str()).collect();
        assert_eq!(texts, [LOW_EAVE, HIGH_EAVE]);
        // The low eave is y = 0 (outside: below), the high eave y = 4 (outside: above); the last two
        // anchors of each are past its ends, on its line.
        assert!(labels[0].anchors[..3].iter().all(|a| a[1] < 0.0));
        assert!(labels[1].anchors[..3].iter().all(|a| a[1] > 4.0));
        assert!(labels[0].anchors[3..]
            .iter()
            .all(|a| a[1] == 0.0 && !(0.0..=10.0).contains(&a[0])));
        assert!(labels[1].anchors[3..]
            .iter()
            .all(|a| a[1] == 4.0 && !(0.0..=10.0).contains(&a[0])));
    }

    #[test]
    fn gable_planes_flat_roofs_and_roofs_without_high_eave_zones_get_no_mark() {
        let zoned = zones(&[ZoneKind::Edge, ZoneKind::HighCorner]);
        assert!(eave_labels(&[plane(EdgeKind::Ridge, 20.0)], &zoned, |p| p).is_empty());
        assert!(eave_labels(&[plane(EdgeKind::Eave, 0.0)], &zoned, |p| p).is_empty());
        // A low-slope roof falls to one eave, but its zones are alike along every eave.
        let alike = zones(&[ZoneKind::Edge, ZoneKind::Corner]);
        assert!(eave_labels(&[plane(EdgeKind::Eave, 1.2)], &alike, |p| p).is_empty());
    }
}
