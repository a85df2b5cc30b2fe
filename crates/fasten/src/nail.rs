//! A nail as the catalog describes it: dimensions, shank, material and where the numbers come from.

use crate::catalog::{CatalogBasis, Confidence, SourcedValue};
use crate::error::FastenError;
use serde::{Deserialize, Serialize};

/// Density of carbon steel, kg/m³ (the usual handbook value; common practice, no source). Used only
/// when the catalog gives no sourced mass.
pub const STEEL_DENSITY_KG_PER_M3: f64 = 7850.0;

/// Grams per mm³ of steel.
const STEEL_G_PER_MM3: f64 = STEEL_DENSITY_KG_PER_M3 * 1.0e-6;

/// The shape of the shank. Only smooth shanks and the ASTM F1667 roof-sheathing ring shank have
/// their own withdrawal equation; see docs/withdrawal-method.md.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum ShankKind {
    Smooth,
    Spiral,
    Ring,
    Screw,
}

impl ShankKind {
    pub fn as_str(self) -> &'static str {
        match self {
            ShankKind::Smooth => "smooth",
            ShankKind::Spiral => "spiral",
            ShankKind::Ring => "ring",
            ShankKind::Screw => "screw",
        }
    }

    pub fn is_deformed(self) -> bool {
        self != ShankKind::Smooth
    }
}

/// Nail steel. NDS 2018 has a separate (lower) withdrawal equation for smooth stainless nails.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum Material {
    Carbon,
    Stainless,
}

impl Material {
    pub fn as_str(self) -> &'static str {
        match self {
            Material::Carbon => "carbon",
            Material::Stainless => "stainless",
        }
    }
}

/// Which NDS 2018 withdrawal equation the nail belongs to.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum NdsNailType {
    /// Common, box, sinker and other wire nails: the smooth-shank equation (12.2-3, or 12.2-4 for
    /// stainless). Deformed shanks of this type get no credit for the deformation.
    Wire,
    /// ASTM F1667 roof sheathing ring shank nail: equation 12.2-5 on the ring length.
    Rsrs,
    /// A wood screw (ASME B18.6.1): equation 12.2-2 on the thread length in the member.
    WoodScrew,
}

/// Where `mass_g` comes from.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum MassBasis {
    /// Given in the catalog with a source.
    Sourced,
    /// Steel density times the shank cylinder over the full length (head and point ignored).
    ComputedFromSteelDensity,
}

/// One nail of the catalog. Millimetres and grams.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Nail {
    /// Plain, stable id, e.g. `8d-common`, `common-63x3.25`.
    pub id: String,
    pub description: String,
    pub length_mm: f64,
    pub shank_diameter_mm: f64,
    pub head_diameter_mm: f64,
    pub shank: ShankKind,
    /// Length of the ring, spiral or screw portion measured from the point; None for smooth shanks.
    pub threaded_length_mm: Option<f64>,
    pub material: Material,
    pub basis: CatalogBasis,
    pub nds_type: NdsNailType,
    pub mass_g: f64,
    pub mass_basis: MassBasis,
    /// Standard and table, with edition.
    pub source: String,
    pub confidence: Confidence,
    /// A withdrawal value per mm of penetration stated by the user with its source (a maker's evaluation
    /// report): the reference value W of the NDS or the basic y_w of CSA O86, before the basis's
    /// adjustment factors. None: the standard's equation for the fastener applies.
    pub stated_withdrawal_n_per_mm: Option<SourcedValue>,
}

impl Nail {
    /// The catalog's provenance line: `source (confidence)`.
    pub fn provenance(&self) -> String {
        self.confidence.provenance(&self.source)
    }

    /// A wood screw rather than a nail.
    pub fn is_wood_screw(&self) -> bool {
        self.nds_type == NdsNailType::WoodScrew
    }

    /// `screw` or `nail`, for messages.
    pub fn kind_word(&self) -> &'static str {
        if self.is_wood_screw() {
            "screw"
        } else {
            "nail"
        }
    }
}

/// Mass of a steel shank cylinder `diameter_mm` × `length_mm`, g.
pub fn steel_shank_mass_g(shank_diameter_mm: f64, length_mm: f64) -> f64 {
    std::f64::consts::PI / 4.0 * shank_diameter_mm.powi(2) * length_mm * STEEL_G_PER_MM3
}

/// A nail as written in `data/nails.json`.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct NailRecord {
    id: String,
    description: String,
    length_mm: f64,
    shank_diameter_mm: f64,
    head_diameter_mm: f64,
    shank: ShankKind,
    threaded_length_mm: Option<f64>,
    material: Material,
    basis: CatalogBasis,
    nds_type: NdsNailType,
    mass_g: Option<f64>,
    source: String,
    confidence: Confidence,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct NailFile {
    #[serde(rename = "_about")]
    _about: Option<String>,
    nails: Vec<NailRecord>,
}

/// Parses and checks a nail catalog (the built-in one or a user's override file).
pub fn parse_nails(json: &str, file: &'static str) -> Result<Vec<Nail>, FastenError> {
    let parsed: NailFile = serde_json::from_str(json).map_err(|error| FastenError::Catalog {
        file,
        message: error.to_string(),
    })?;
    let mut nails = Vec::with_capacity(parsed.nails.len());
    for record in parsed.nails {
        let nail = check_record(record, file)?;
        if nails.iter().any(|other: &Nail| other.id == nail.id) {
            return Err(FastenError::Catalog {
                file,
                message: format!("nail id `{}` appears twice", nail.id),
            });
        }
        nails.push(nail);
    }
    Ok(nails)
}

fn check_record(record: NailRecord, file: &'static str) -> Result<Nail, FastenError> {
    let bad = |message: String| FastenError::Catalog {
        file,
        message: format!("nail `{}`: {message}", record.id),
    };
    let positive = |name: &str, value: f64| {
        if value.is_finite() && value > 0.0 {
            Ok(())
        } else {
            Err(bad(format!("{name} = {value} must be a positive number")))
        }
    };
    positive("length_mm", record.length_mm)?;
    positive("shank_diameter_mm", record.shank_diameter_mm)?;
    positive("head_diameter_mm", record.head_diameter_mm)?;
    if record.head_diameter_mm <= record.shank_diameter_mm {
        return Err(bad(
            "head_diameter_mm must exceed shank_diameter_mm".to_string()
        ));
    }
    if record.id.trim().is_empty() || record.id.contains(char::is_whitespace) {
        return Err(bad("id must be a non-empty word without spaces".to_string()));
    }
    match (record.shank.is_deformed(), record.threaded_length_mm) {
        (true, None) => return Err(bad("a deformed shank needs threaded_length_mm".to_string())),
        (false, Some(_)) => {
            return Err(bad("a smooth shank has no threaded_length_mm".to_string()))
        }
        (true, Some(threaded_mm)) => {
            positive("threaded_length_mm", threaded_mm)?;
            if threaded_mm > record.length_mm {
                return Err(bad("threaded_length_mm exceeds length_mm".to_string()));
            }
        }
        (false, None) => {}
    }
    if record.nds_type == NdsNailType::Rsrs && record.shank != ShankKind::Ring {
        return Err(bad("nds_type `rsrs` needs a ring shank".to_string()));
    }
    if record.nds_type == NdsNailType::WoodScrew && record.shank != ShankKind::Screw {
        return Err(bad(
            "nds_type `wood-screw` needs shank `screw` and its thread length".to_string(),
        ));
    }
    let (mass_g, mass_basis) = match record.mass_g {
        Some(mass_g) => {
            positive("mass_g", mass_g)?;
            (mass_g, MassBasis::Sourced)
        }
        None => (
            steel_shank_mass_g(record.shank_diameter_mm, record.length_mm),
            MassBasis::ComputedFromSteelDensity,
        ),
    };
    Ok(Nail {
        id: record.id,
        description: record.description,
        length_mm: record.length_mm,
        shank_diameter_mm: record.shank_diameter_mm,
        head_diameter_mm: record.head_diameter_mm,
        shank: record.shank,
        threaded_length_mm: record.threaded_length_mm,
        material: record.material,
        basis: record.basis,
        nds_type: record.nds_type,
        mass_g,
        mass_basis,
        source: record.source,
        confidence: record.confidence,
        stated_withdrawal_n_per_mm: None,
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn one_nail(body: &str) -> Result<Vec<Nail>, FastenError> {
        parse_nails(&format!(r#"{{"nails": [{body}]}}"#), "test.json")
    }

    const SMOOTH: &str = r#"{"id": "x", "description": "d", "length_mm": 63.5, "shank_diameter_mm": 3.3274,
        "head_diameter_mm": 7.1374, "shank": "smooth", "threaded_length_mm": null, "material": "carbon",
        "basis": "us", "nds_type": "wire", "mass_g": null, "source": "s", "confidence": "from memory"}"#;

    #[test]
    fn computed_mass_is_the_steel_cylinder() {
        let nails = one_nail(SMOOTH).expect("valid");
        // π/4 · 3.3274² · 63.5 mm³ · 7.85e-3 g/mm³ = 4.34 g
        assert_relative_eq!(nails[0].mass_g, 4.3383, max_relative = 1e-3);
        assert_eq!(nails[0].mass_basis, MassBasis::ComputedFromSteelDensity);
    }

    #[test]
    fn computed_8d_mass_is_near_the_trade_count_per_pound() {
        // About 106 8d common nails per lb, i.e. 4.3 g each (common practice, no source); the cylinder
        // estimate must land within 10 %.
        let mass_g = steel_shank_mass_g(0.131 * 25.4, 2.5 * 25.4);
        assert_relative_eq!(mass_g, 453.6 / 106.0, max_relative = 0.10);
    }

    #[test]
    fn a_head_smaller_than_the_shank_is_refused() {
        let body = SMOOTH.replace("7.1374", "2.0");
        assert!(matches!(one_nail(&body), Err(FastenError::Catalog { .. })));
    }

    #[test]
    fn a_deformed_shank_without_thread_length_is_refused() {
        let body = SMOOTH.replace(r#""smooth""#, r#""ring""#);
        assert!(one_nail(&body).is_err());
    }

    #[test]
    fn rsrs_must_be_ring_shank() {
        let body = SMOOTH.replace(r#""wire""#, r#""rsrs""#);
        assert!(one_nail(&body).is_err());
    }

    #[test]
    fn an_unknown_key_is_refused() {
        let body = SMOOTH.replace(r#""mass_g": null"#, r#""mass_gram": null"#);
        assert!(one_nail(&body).is_err());
    }

    #[test]
    fn duplicate_ids_are_refused() {
        let result = one_nail(&format!("{SMOOTH}, {SMOOTH}"));
        assert!(matches!(result, Err(FastenError::Catalog { .. })));
    }
}
