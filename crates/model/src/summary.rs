//! One roof's line of a batch summary: how the roof ended and its spacing grid, in SI.

use crate::schedule::{SupportRole, ZoneKind, ZoneRow};
use serde::Serialize;

/// The zones a schedule can carry, in the crew sheet's order (worst first).
pub const SUMMARY_ZONES: [ZoneKind; 6] = [
    ZoneKind::Corner,
    ZoneKind::Edge,
    ZoneKind::Interior,
    ZoneKind::OverhangCorner,
    ZoneKind::OverhangEdge,
    ZoneKind::OverhangInterior,
];

/// The support roles of a zone, in the crew sheet's order.
pub const SUMMARY_ROLES: [SupportRole; 2] = [SupportRole::PanelEdge, SupportRole::Intermediate];

/// How one roof of a batch ended.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum RoofStatus {
    /// Every zone has a working spacing.
    Ok,
    /// The roof was worked, but no practical spacing works in some zone with any candidate nail.
    Fails,
    /// The row was refused (bad value, outside the method): nothing was worked.
    Refused,
}

impl RoofStatus {
    pub fn as_str(self) -> &'static str {
        match self {
            RoofStatus::Ok => "ok",
            RoofStatus::Fails => "fails",
            RoofStatus::Refused => "refused",
        }
    }
}

/// One cell of the spacing grid: a zone and support role of one roof.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct SpacingCell {
    /// None: no practical spacing works there.
    pub spacing_mm: Option<f64>,
}

/// One roof's line of the batch summary.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct RoofSummary {
    pub id: String,
    pub status: RoofStatus,
    /// Why the roof was refused or fails (naming the row and column for a refusal); empty when ok.
    pub message: String,
    /// The nail the schedule uses (empty when refused).
    pub nail_id: String,
    /// `[zone][role]` in the order of [`SUMMARY_ZONES`] and [`SUMMARY_ROLES`]; None where the roof has
    /// no such zone.
    pub spacings: [[Option<SpacingCell>; 2]; 6],
    pub total_nail_count: u64,
    pub total_nail_mass_kg: f64,
    /// The largest utilization of any zone and role (None when refused).
    pub largest_utilization: Option<f64>,
}

impl RoofSummary {
    /// A refused row: only its id and the message.
    pub fn refused(id: &str, message: String) -> Self {
        RoofSummary {
            id: id.to_string(),
            status: RoofStatus::Refused,
            message,
            nail_id: String::new(),
            spacings: [[None; 2]; 6],
            total_nail_count: 0,
            total_nail_mass_kg: 0.0,
            largest_utilization: None,
        }
    }

    /// The spacing grid from a schedule's zone rows. Where several rows share a zone label and role (a
    /// standard with more than one edge zone), the closest spacing is kept, and "none works" wins over
    /// any spacing: the summary shows the most severe reading.
    pub fn spacing_grid(zones: &[ZoneRow]) -> [[Option<SpacingCell>; 2]; 6] {
        let mut grid = [[None; 2]; 6];
        for row in zones {
            // High-eave zones go in their edge or corner column (the closer spacing wins below).
            let zone = SUMMARY_ZONES
                .iter()
                .position(|label| *label == row.label.base());
            let role = SUMMARY_ROLES
                .iter()
                .position(|role| *role == row.support_role);
            let (Some(zone), Some(role)) = (zone, role) else {
                continue;
            };
            let cell: &mut Option<SpacingCell> = &mut grid[zone][role];
            let merged = match (*cell, row.spacing_mm) {
                (None, spacing_mm) => spacing_mm,
                (Some(SpacingCell { spacing_mm: None }), _) | (Some(_), None) => None,
                (
                    Some(SpacingCell {
                        spacing_mm: Some(held),
                    }),
                    Some(new),
                ) => Some(held.min(new)),
            };
            *cell = Some(SpacingCell { spacing_mm: merged });
        }
        grid
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn zone(label: ZoneKind, role: SupportRole, spacing_mm: Option<f64>) -> ZoneRow {
        ZoneRow {
            label,
            code_zone: String::new(),
            support_role: role,
            nail_id: "n".to_string(),
            nail_description: String::new(),
            spacing_mm,
            net_uplift_kpa: 1.0,
            demand_n: 1.0,
            resistance_n: 1.0,
            governing_mode: "withdrawal".to_string(),
            utilization: 0.5,
            nail_count: 1,
            governing_check: "strength".to_string(),
            governing_line: 1,
        }
    }

    #[test]
    fn high_eave_zones_fold_into_their_edge_and_corner_columns() {
        // A monoslope's zone 3' (high-corner) needing 100 mm beside zone 3 at 150 mm: the corner column
        // shows 100 mm; an overhang high edge goes in the overhang-edge column.
        let grid = RoofSummary::spacing_grid(&[
            zone(ZoneKind::Corner, SupportRole::Intermediate, Some(150.0)),
            zone(ZoneKind::HighCorner, SupportRole::Intermediate, Some(100.0)),
            zone(
                ZoneKind::OverhangHighEdge,
                SupportRole::PanelEdge,
                Some(125.0),
            ),
        ]);
        assert_eq!(
            grid[0][1],
            Some(SpacingCell {
                spacing_mm: Some(100.0)
            })
        );
        assert_eq!(
            grid[4][0],
            Some(SpacingCell {
                spacing_mm: Some(125.0)
            })
        );
    }

    #[test]
    fn the_grid_keeps_the_most_severe_reading_of_a_zone_and_role() {
        let grid = RoofSummary::spacing_grid(&[
            zone(ZoneKind::Edge, SupportRole::PanelEdge, Some(150.0)),
            zone(ZoneKind::Edge, SupportRole::PanelEdge, Some(100.0)),
            zone(ZoneKind::Edge, SupportRole::Intermediate, Some(150.0)),
            zone(ZoneKind::Edge, SupportRole::Intermediate, None),
            zone(ZoneKind::Edge, SupportRole::Intermediate, Some(300.0)),
        ]);
        assert_eq!(
            grid[1][0],
            Some(SpacingCell {
                spacing_mm: Some(100.0)
            })
        );
        assert_eq!(grid[1][1], Some(SpacingCell { spacing_mm: None }));
        assert_eq!(grid[0][0], None, "no corner zone given");
    }
}
