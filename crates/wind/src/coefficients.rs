//! Coefficient tables (data/*.json, one file per edition) and effective-area interpolation.

use std::sync::OnceLock;

use serde::{Deserialize, Serialize};

use crate::error::WindError;
use crate::types::CurvePoint;
use crate::zone_maps::{CoefficientStatus, FigureData};
use crate::zones::Region;

#[derive(Debug, Clone, PartialEq, Deserialize)]
pub(crate) struct Constant {
    pub name: String,
    pub value: f64,
    pub source: String,
    pub confidence: String,
}

#[derive(Debug, Clone, PartialEq, Deserialize)]
pub(crate) struct PointData {
    pub area_m2: f64,
    pub coefficient: f64,
}

#[derive(Debug, Clone, PartialEq, Deserialize)]
pub(crate) struct SoffitData {
    pub figure: String,
    pub confidence: String,
    pub points: Vec<PointData>,
}

#[derive(Debug, Clone, PartialEq, Deserialize)]
pub(crate) struct CurveData {
    pub set: String,
    pub region: String,
    pub code_zone: String,
    pub figure: String,
    pub status: CoefficientStatus,
    pub confidence: String,
    pub points: Vec<PointData>,
}

/// One edition's tables.
#[derive(Debug, Clone, PartialEq, Deserialize)]
pub(crate) struct Table {
    pub edition: String,
    pub constants: Vec<Constant>,
    pub soffit: SoffitData,
    /// One entry per figure and slope band, with its zone map.
    pub figures: Vec<FigureData>,
    pub curves: Vec<CurveData>,
}

/// Which built-in table.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum Edition {
    Nbc2020,
    Asce722,
}

const NBC_FILE: &str = "data/nbc2020.json";
const ASCE_FILE: &str = "data/asce7-22.json";

fn parse(file: &str, text: &str) -> Result<Table, WindError> {
    let table: Table = serde_json::from_str(text).map_err(|error| WindError::Data {
        file: file.to_string(),
        detail: error.to_string(),
    })?;
    for curve in &table.curves {
        check_points(
            &curve
                .points
                .iter()
                .map(|p| CurvePoint {
                    area_m2: p.area_m2,
                    coefficient: p.coefficient,
                })
                .collect::<Vec<_>>(),
        )
        .map_err(|detail| WindError::Data {
            file: file.to_string(),
            detail: format!("curve {} {}: {detail}", curve.set, curve.code_zone),
        })?;
    }
    Ok(table)
}

/// The table of an edition, parsed once.
pub(crate) fn table(edition: Edition) -> Result<&'static Table, WindError> {
    static NBC: OnceLock<Result<Table, WindError>> = OnceLock::new();
    static ASCE: OnceLock<Result<Table, WindError>> = OnceLock::new();
    let loaded = match edition {
        Edition::Nbc2020 => {
            NBC.get_or_init(|| parse(NBC_FILE, include_str!("../data/nbc2020.json")))
        }
        Edition::Asce722 => {
            ASCE.get_or_init(|| parse(ASCE_FILE, include_str!("../data/asce7-22.json")))
        }
    };
    loaded.as_ref().map_err(Clone::clone)
}

impl Table {
    /// A named constant with its source and confidence, as a report line.
    pub(crate) fn constant(&self, name: &str) -> Result<(f64, String), WindError> {
        self.constants
            .iter()
            .find(|c| c.name == name)
            .map(|c| (c.value, format!("{} ({})", c.source, c.confidence)))
            .ok_or_else(|| WindError::Data {
                file: self.edition.clone(),
                detail: format!("constant {name} is missing"),
            })
    }

    /// The curve for a region in a slope set, without overhang adjustment.
    pub(crate) fn curve(&self, set: &str, region: Region) -> Result<&CurveData, WindError> {
        let wanted = region.as_str();
        self.curves
            .iter()
            .find(|c| c.set == set && c.region == wanted)
            .ok_or_else(|| WindError::Data {
                file: self.edition.clone(),
                detail: format!("no {wanted} curve in set {set}"),
            })
    }
}

/// One built-in coefficient row, for listings (`deckhold catalog coefficients`).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CoefficientRow {
    pub edition: String,
    pub set: String,
    pub figure: String,
    pub code_zone: String,
    pub region: String,
    pub points: Vec<CurvePoint>,
    pub status: CoefficientStatus,
    pub source: String,
}

/// Every built-in coefficient row of both editions, in data order.
pub fn coefficient_rows() -> Result<Vec<CoefficientRow>, WindError> {
    let mut rows = Vec::new();
    for edition in [Edition::Nbc2020, Edition::Asce722] {
        let data = table(edition)?;
        for curve in &data.curves {
            rows.push(CoefficientRow {
                edition: data.edition.clone(),
                set: curve.set.clone(),
                figure: curve.figure.clone(),
                code_zone: curve.code_zone.clone(),
                region: curve.region.clone(),
                points: curve
                    .points
                    .iter()
                    .map(|p| CurvePoint {
                        area_m2: p.area_m2,
                        coefficient: p.coefficient,
                    })
                    .collect(),
                status: curve.status,
                source: curve.confidence.clone(),
            });
        }
    }
    Ok(rows)
}

/// External coefficient of one zone as a function of effective area; overhangs add the soffit curve.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ZoneCurve {
    pub points: Vec<CurvePoint>,
    /// Positive soffit coefficients pushing up under an overhang; subtracted from `points`.
    pub soffit: Option<Vec<CurvePoint>>,
    pub source: String,
    /// The figure and slope band the curve comes from (or the user's file).
    pub figure: String,
    pub status: CoefficientStatus,
}

impl ZoneCurve {
    pub(crate) fn from_data(curve: &CurveData, soffit: Option<&SoffitData>) -> Self {
        let convert = |points: &[PointData]| {
            points
                .iter()
                .map(|p| CurvePoint {
                    area_m2: p.area_m2,
                    coefficient: p.coefficient,
                })
                .collect::<Vec<_>>()
        };
        let mut source = format!(
            "{} zone {} ({})",
            curve.figure, curve.code_zone, curve.confidence
        );
        if let Some(soffit) = soffit {
            source.push_str(&format!(
                " plus soffit from {} ({})",
                soffit.figure, soffit.confidence
            ));
        }
        Self {
            points: convert(&curve.points),
            soffit: soffit.map(|s| convert(&s.points)),
            source,
            figure: curve.figure.clone(),
            status: curve.status,
        }
    }

    /// The curve of a user's row (the soffit, for overhangs, stays built-in and is named).
    pub(crate) fn from_user(
        row: &crate::types::TableRow,
        user: &crate::types::CoefficientTable,
        soffit: Option<&SoffitData>,
    ) -> Self {
        let mut source = format!(
            "{} zone {} from the user's table {} (stated source: {})",
            row.figure, row.code_zone, user.file, user.source
        );
        if let Some(soffit) = soffit {
            source.push_str(&format!(
                " plus soffit from {} ({})",
                soffit.figure, soffit.confidence
            ));
        }
        Self {
            points: row.points.clone(),
            soffit: soffit.map(|s| {
                s.points
                    .iter()
                    .map(|p| CurvePoint {
                        area_m2: p.area_m2,
                        coefficient: p.coefficient,
                    })
                    .collect()
            }),
            source,
            figure: format!("{} (user's table {})", row.figure, user.file),
            status: CoefficientStatus::UserSupplied,
        }
    }

    /// True when the curve uses no built-in row: a user's row with no built-in soffit added.
    pub fn all_user_supplied(&self) -> bool {
        self.status == CoefficientStatus::UserSupplied && self.soffit.is_none()
    }

    /// Coefficient at an effective area, m².
    pub fn coefficient_at(&self, area_m2: f64) -> f64 {
        let roof = interpolate(&self.points, area_m2);
        match &self.soffit {
            Some(soffit) => roof - interpolate(soffit, area_m2),
            None => roof,
        }
    }
}

/// The curve `(1 - fraction) · low + fraction · high`, exact: both curves are linear in log(area)
/// between the union of their breakpoints, so the blend is too. Used where a standard interpolates
/// by roof slope between two figures (ASCE 7-22 hip roofs between 27 and 45 deg).
pub(crate) fn blend(low: &[CurvePoint], high: &[CurvePoint], fraction: f64) -> Vec<CurvePoint> {
    let mut areas: Vec<f64> = low.iter().chain(high).map(|p| p.area_m2).collect();
    areas.sort_by(f64::total_cmp);
    areas.dedup_by(|a, b| (*a - *b).abs() <= 1e-12 * b.abs());
    areas
        .into_iter()
        .map(|area_m2| CurvePoint {
            area_m2,
            coefficient: (1.0 - fraction) * interpolate(low, area_m2)
                + fraction * interpolate(high, area_m2),
        })
        .collect()
}

/// Checks a curve: at least one point, finite, areas positive and strictly increasing.
pub(crate) fn check_points(points: &[CurvePoint]) -> Result<(), String> {
    if points.is_empty() {
        return Err("needs at least one point".to_string());
    }
    for (index, point) in points.iter().enumerate() {
        if !point.area_m2.is_finite() || point.area_m2 <= 0.0 || !point.coefficient.is_finite() {
            return Err(format!(
                "point {index}: area must be finite and over 0 m², coefficient finite"
            ));
        }
        if index > 0 && point.area_m2 <= points[index - 1].area_m2 {
            return Err(format!("point {index}: areas must increase"));
        }
        if point.coefficient.abs() > 20.0 {
            return Err(format!(
                "point {index}: coefficient {} is outside -20..20",
                point.coefficient
            ));
        }
    }
    Ok(())
}

/// Plateau below the first area, last value above the last, linear in log(area) between.
pub(crate) fn interpolate(points: &[CurvePoint], area_m2: f64) -> f64 {
    let Some(first) = points.first() else {
        return 0.0;
    };
    if area_m2 <= first.area_m2 {
        return first.coefficient;
    }
    for pair in points.windows(2) {
        let (low, high) = (&pair[0], &pair[1]);
        if area_m2 <= high.area_m2 {
            let t = (area_m2.ln() - low.area_m2.ln()) / (high.area_m2.ln() - low.area_m2.ln());
            return low.coefficient + t * (high.coefficient - low.coefficient);
        }
    }
    points
        .last()
        .map_or(first.coefficient, |last| last.coefficient)
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn curve() -> Vec<CurvePoint> {
        vec![
            CurvePoint {
                area_m2: 1.0,
                coefficient: -2.0,
            },
            CurvePoint {
                area_m2: 10.0,
                coefficient: -1.0,
            },
        ]
    }

    #[test]
    fn interpolation_exact_at_breakpoints_and_plateaus() {
        let points = curve();
        assert_relative_eq!(interpolate(&points, 1.0), -2.0);
        assert_relative_eq!(interpolate(&points, 10.0), -1.0);
        assert_relative_eq!(interpolate(&points, 0.1), -2.0);
        assert_relative_eq!(interpolate(&points, 100.0), -1.0);
        // log-linear: the geometric mean of the breakpoints is halfway.
        assert_relative_eq!(
            interpolate(&points, 10f64.sqrt()),
            -1.5,
            max_relative = 1e-12
        );
    }

    #[test]
    fn built_in_tables_load_and_are_monotone() {
        for edition in [Edition::Nbc2020, Edition::Asce722] {
            let table = table(edition).expect("built-in table parses");
            assert!(!table.curves.is_empty());
            for data in &table.curves {
                assert!(
                    data.confidence.starts_with(data.status.as_str()),
                    "{}",
                    data.confidence
                );
                assert_ne!(data.status, CoefficientStatus::UserSupplied);
                let points: Vec<f64> = data.points.iter().map(|p| p.coefficient.abs()).collect();
                assert!(
                    points.windows(2).all(|w| w[1] <= w[0]),
                    "{} {} grows",
                    data.set,
                    data.code_zone
                );
            }
        }
    }

    #[test]
    fn asce_breakpoint_is_ten_square_feet() {
        // ASCE 7-22 Figure 30.3-2A, from memory: zone 3 GC_p = -3.2 at 10 ft² (0.929 m²).
        let table = table(Edition::Asce722).expect("table");
        let corner = table.curve("slope-0-7", Region::Corner).expect("corner");
        assert_relative_eq!(corner.points[0].area_m2, 0.929_030_4, max_relative = 1e-6);
        assert_relative_eq!(corner.points[0].coefficient, -3.2);
    }

    #[test]
    fn blend_is_exact_between_breakpoints() {
        let low = curve();
        let high = vec![
            CurvePoint {
                area_m2: 2.0,
                coefficient: -3.0,
            },
            CurvePoint {
                area_m2: 20.0,
                coefficient: -1.0,
            },
        ];
        let mixed = blend(&low, &high, 0.25);
        assert_eq!(mixed.len(), 4);
        for area in [0.5, 1.0, 1.5, 2.0, 5.0, 10.0, 15.0, 20.0, 40.0] {
            let expected = 0.75 * interpolate(&low, area) + 0.25 * interpolate(&high, area);
            assert_relative_eq!(interpolate(&mixed, area), expected, max_relative = 1e-12);
        }
    }

    #[test]
    fn listing_counts_rows_by_status() {
        // Regression counts of the built-in data (docs/sources.md): 20 from memory, 26 severe-of-two
        // (10 before the monoslope figures: 8 ASCE 7-22 and 8 NBC 2020 monoslope rows added).
        let rows = coefficient_rows().expect("rows");
        let count = |status| rows.iter().filter(|r| r.status == status).count();
        assert_eq!(count(CoefficientStatus::FromMemory), 20);
        assert_eq!(count(CoefficientStatus::SevereOfTwo), 26);
        assert_eq!(count(CoefficientStatus::Checked), 0);
    }

    #[test]
    fn bad_points_are_refused() {
        assert!(check_points(&[]).is_err());
        let descending = vec![
            CurvePoint {
                area_m2: 10.0,
                coefficient: -1.0,
            },
            CurvePoint {
                area_m2: 1.0,
                coefficient: -2.0,
            },
        ];
        assert!(check_points(&descending).is_err());
    }
}
