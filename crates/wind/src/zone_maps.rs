//! Per-figure zone maps and slope bands, read from the coefficient data: which zones a figure has, how
//! wide they are and where they sit on a gable, hip or low-slope roof. The rectangle layout in
//! `zones.rs` draws what the map says; the map, not the code, decides which strips exist.

use serde::{Deserialize, Serialize};

use crate::error::WindError;
use crate::types::RoofShape;
use crate::zones::{HighEave, Region, Strips};

/// How sure the data is of a row (house rule: every table value says which).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum CoefficientStatus {
    /// Confirmed against a named published source.
    #[serde(rename = "checked")]
    Checked,
    /// Recalled; the row names the edition.
    #[serde(rename = "from memory")]
    FromMemory,
    /// Two readings differ and neither is confirmed: the more severe is used, both are named.
    #[serde(rename = "severe-of-two")]
    SevereOfTwo,
    /// From the user's own table (`--coefficients` or `coefficient_overrides`).
    #[serde(rename = "user-supplied")]
    UserSupplied,
}

impl CoefficientStatus {
    pub fn as_str(self) -> &'static str {
        match self {
            CoefficientStatus::Checked => "checked",
            CoefficientStatus::FromMemory => "from memory",
            CoefficientStatus::SevereOfTwo => "severe-of-two",
            CoefficientStatus::UserSupplied => "user-supplied",
        }
    }
}

impl std::fmt::Display for CoefficientStatus {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(self.as_str())
    }
}

/// Which region the strips along the walls belong to.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Deserialize)]
#[serde(rename_all = "lowercase")]
pub(crate) enum WallStrips {
    Edge,
    Corner,
}

/// Which region a monoslope's high-eave strip or corner is.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Deserialize)]
#[serde(rename_all = "kebab-case")]
pub(crate) enum HighEaveRegion {
    Edge,
    Corner,
    HighEdge,
    HighCorner,
}

impl HighEaveRegion {
    fn region(self) -> Region {
        match self {
            HighEaveRegion::Edge => Region::Edge,
            HighEaveRegion::Corner => Region::Corner,
            HighEaveRegion::HighEdge => Region::HighEdge,
            HighEaveRegion::HighCorner => Region::HighCorner,
        }
    }
}

/// A monoslope figure's high eave: the strip of width a along it, and its corners, whose extent the
/// figure gives in multiples of a.
#[derive(Debug, Clone, PartialEq, Deserialize)]
#[serde(deny_unknown_fields)]
pub(crate) struct HighEaveData {
    pub strip: HighEaveRegion,
    pub corner: HighEaveRegion,
    pub corner_along_a: f64,
    pub corner_across_a: f64,
}

/// A figure's zone map.
#[derive(Debug, Clone, PartialEq, Deserialize)]
#[serde(deny_unknown_fields)]
pub(crate) struct ZoneMapData {
    /// The standard's zone names, interior first.
    pub zones: Vec<String>,
    pub wall_strips: WallStrips,
    /// Strips each side of the ridge, corners where they meet the rakes.
    pub ridge_strips: bool,
    /// Bands each side of the hips and along the ridge.
    pub hip_strips: bool,
    /// Monoslope figures only: what the high eave carries.
    #[serde(default)]
    pub high_eave: Option<HighEaveData>,
    pub placement: String,
    pub status: CoefficientStatus,
    pub readings: String,
}

/// One figure and slope band of a standard.
#[derive(Debug, Clone, PartialEq, Deserialize)]
#[serde(deny_unknown_fields)]
pub(crate) struct FigureData {
    /// The coefficient set its curves belong to.
    pub set: String,
    pub figure: String,
    pub roof: String,
    /// The band is `above_deg < slope <= up_to_deg` (`0 <= slope` for the first band).
    pub above_deg: f64,
    pub up_to_deg: f64,
    pub boundary_rule: String,
    pub width: String,
    pub zone_map: ZoneMapData,
}

impl FigureData {
    /// The strips this figure's map draws on a roof of `shape`, for an edge width in metres (a figure
    /// for gabled or hipped roofs draws ridge strips on gables and hip bands on hips).
    pub(crate) fn strips(&self, shape: RoofShape, edge_width_m: f64) -> Strips {
        Strips {
            edge_width_m,
            ridge: self.zone_map.ridge_strips && shape == RoofShape::Gable,
            hips: self.zone_map.hip_strips && shape == RoofShape::Hip,
            wall_region: match self.zone_map.wall_strips {
                WallStrips::Edge => Region::Edge,
                WallStrips::Corner => Region::Corner,
            },
            high_eave: match (&self.zone_map.high_eave, shape) {
                (Some(high), RoofShape::Monoslope) => Some(HighEave {
                    strip: high.strip.region(),
                    corner: high.corner.region(),
                    corner_along_m: high.corner_along_a * edge_width_m,
                    corner_across_m: high.corner_across_a * edge_width_m,
                }),
                _ => None,
            },
        }
    }

    /// Whether a slope falls in this figure's band (the standard's rule: upper bound included).
    pub(crate) fn covers(&self, slope_deg: f64) -> bool {
        let above = if self.above_deg <= 0.0 {
            slope_deg >= 0.0
        } else {
            slope_deg > self.above_deg
        };
        above && slope_deg <= self.up_to_deg
    }

    /// One line for reports: figure, band, map and its status.
    pub(crate) fn summary(&self) -> String {
        format!(
            "{} ({}): {}; width {}; zone map {} ({})",
            self.figure,
            self.roof,
            self.zone_map.placement,
            self.width,
            self.zone_map.status,
            self.zone_map.readings
        )
    }
}

/// The figure whose set name starts with `prefix` and whose slope band holds `slope_deg`.
pub(crate) fn figure_for_slope<'a>(
    figures: &'a [FigureData],
    prefix: &str,
    slope_deg: f64,
    edition: &str,
) -> Result<&'a FigureData, WindError> {
    figures
        .iter()
        .find(|figure| figure.set.starts_with(prefix) && figure.covers(slope_deg))
        .ok_or_else(|| WindError::Data {
            file: edition.to_string(),
            detail: format!("no {prefix} figure covers {slope_deg:.1} deg"),
        })
}

/// The figure of a coefficient set.
pub(crate) fn figure<'a>(
    figures: &'a [FigureData],
    set: &str,
    edition: &str,
) -> Result<&'a FigureData, WindError> {
    figures
        .iter()
        .find(|figure| figure.set == set)
        .ok_or_else(|| WindError::Data {
            file: edition.to_string(),
            detail: format!("no figure for coefficient set {set}"),
        })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::coefficients::{table, Edition};

    fn figures(edition: Edition) -> &'static [FigureData] {
        &table(edition).expect("table").figures
    }

    #[test]
    fn every_curve_set_has_a_figure_and_every_figure_its_curves() {
        for edition in [Edition::Nbc2020, Edition::Asce722] {
            let data = table(edition).expect("table");
            for figure in &data.figures {
                for zone in &figure.zone_map.zones {
                    assert!(
                        data.curves
                            .iter()
                            .any(|c| c.set == figure.set && &c.code_zone == zone),
                        "{} zone {zone}",
                        figure.figure
                    );
                }
            }
            for curve in &data.curves {
                assert!(
                    data.figures.iter().any(|f| f.set == curve.set),
                    "{}",
                    curve.set
                );
            }
        }
    }

    #[test]
    fn slope_band_boundaries_follow_the_standard() {
        // ASCE 7-22 Figures 30.3-2A..2G (from memory): theta <= 7, 7 < theta <= 20, 20 < theta <= 27,
        // 27 < theta <= 45; the upper bound belongs to the lower band.
        let asce = figures(Edition::Asce722);
        let band = |set: &str| figure(asce, set, "ASCE").expect("figure");
        assert!(band("slope-0-7").covers(7.0));
        assert!(!band("gable-7-20").covers(7.0));
        assert!(band("gable-7-20").covers(7.01));
        assert!(band("gable-7-20").covers(20.0));
        assert!(!band("gable-20-27").covers(20.0));
        assert!(band("gable-20-27").covers(27.0));
        assert!(!band("gable-27-45").covers(27.0));
        assert!(band("gable-27-45").covers(45.0));
        assert!(!band("gable-27-45").covers(45.01));
        // NBC 2020 4.1.7.6.(4) and (6) (checked, codeindex.ca): <= 7 deg on -C, > 7 deg on -E.
        let nbc = figures(Edition::Nbc2020);
        assert!(figure(nbc, "slope-0-7", "NBC").expect("c").covers(7.0));
        assert!(!figure(nbc, "gable-hip-7-27", "NBC").expect("e").covers(7.0));
        assert!(figure(nbc, "gable-hip-7-27", "NBC")
            .expect("e")
            .covers(27.0));
        assert!(!figure(nbc, "gable-hip-27-45", "NBC")
            .expect("e")
            .covers(27.0));
    }

    #[test]
    fn zone_maps_per_figure() {
        // ASCE 7-22 gable figures 30.3-2B..D (severe-of-two, docs/sources.md): eave, rake and ridge strips,
        // corners at eave corners and ridge ends. Hip figures 30.3-2E..G (severe-of-two): zone 3 along every
        // eave, zone 2 bands along hips and ridge. Low slope 30.3-2A (from memory): wall strips only.
        let asce = figures(Edition::Asce722);
        for set in ["gable-7-20", "gable-20-27", "gable-27-45"] {
            let strips = figure(asce, set, "ASCE")
                .expect("gable")
                .strips(RoofShape::Gable, 1.0);
            assert!(strips.ridge && !strips.hips, "{set}");
            assert_eq!(strips.wall_region, Region::Edge, "{set}");
        }
        for set in ["hip-7-20", "hip-20-27", "hip-45"] {
            let map = figure(asce, set, "ASCE").expect("hip");
            let strips = map.strips(RoofShape::Hip, 1.0);
            assert!(strips.hips && !strips.ridge, "{set}");
            assert_eq!(strips.wall_region, Region::Corner, "{set}");
            assert_eq!(map.zone_map.status, CoefficientStatus::SevereOfTwo);
        }
        let low = figure(asce, "slope-0-7", "ASCE")
            .expect("low")
            .strips(RoofShape::Gable, 1.0);
        assert!(!low.ridge && !low.hips);
        assert_eq!(low.wall_region, Region::Edge);
        // NBC 2020 Figure 4.1.7.6.-E (from memory): zones r / s / c, strips along ridge and hips.
        let nbc = figures(Edition::Nbc2020);
        let sloped = figure(nbc, "gable-hip-7-27", "NBC").expect("e");
        assert_eq!(sloped.zone_map.zones, ["r", "s", "c"]);
        assert_eq!(sloped.zone_map.status, CoefficientStatus::FromMemory);
    }
}
