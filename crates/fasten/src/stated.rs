//! Fasteners the user states in the project file (dimensions and, optionally, a withdrawal value from a
//! maker's evaluation report), checked like catalog entries and then used like them.

use crate::catalog::{CatalogBasis, Confidence, SourcedValue};
use crate::error::FastenError;
use crate::nail::{steel_shank_mass_g, MassBasis, Material, Nail, NdsNailType, ShankKind};

/// What the user says the fastener is.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum StatedKind {
    Nail,
    Screw,
}

/// The shank of a stated nail (a screw has a thread instead).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum StatedShank {
    Smooth,
    Ring,
    Spiral,
}

/// A fastener as stated in the project, millimetres and N/mm.
#[derive(Debug, Clone, PartialEq)]
pub struct StatedFastener {
    pub id: String,
    pub kind: StatedKind,
    /// Nails only.
    pub shank: Option<StatedShank>,
    pub diameter_mm: f64,
    pub length_mm: f64,
    pub head_diameter_mm: f64,
    /// Screws: the thread length from the point.
    pub thread_length_mm: Option<f64>,
    /// Reference (NDS W) or basic (O86 y_w) withdrawal per mm of penetration, before the basis's factors.
    pub withdrawal_n_per_mm: Option<f64>,
    /// Where the dimensions and the withdrawal value come from.
    pub source: String,
}

/// Turns a stated fastener into a [`Nail`] the resistance methods take. A deformed nail shank without a
/// stated withdrawal value is credited as smooth by both standards (they have no equation for a generic
/// deformed shank), so its thread length is taken as the full length: it only matters for a value that
/// is not used.
pub fn stated_fastener(stated: &StatedFastener) -> Result<Nail, FastenError> {
    let bad = |message: String| FastenError::NailNotCovered {
        nail: stated.id.clone(),
        reason: message,
    };
    if stated.head_diameter_mm <= stated.diameter_mm {
        return Err(bad(
            "the head diameter must exceed the shank diameter".to_string()
        ));
    }
    if stated.source.trim().is_empty() {
        return Err(bad("a stated fastener names its source".to_string()));
    }
    let (shank, threaded_length_mm, nds_type) = match (stated.kind, stated.shank) {
        (StatedKind::Screw, _) => {
            let thread_mm = stated.thread_length_mm.ok_or_else(|| {
                bad("a screw needs its thread length (thread_length_mm)".to_string())
            })?;
            if thread_mm > stated.length_mm {
                return Err(bad("the thread is longer than the screw".to_string()));
            }
            (ShankKind::Screw, Some(thread_mm), NdsNailType::WoodScrew)
        }
        (StatedKind::Nail, Some(StatedShank::Smooth) | None) => {
            (ShankKind::Smooth, None, NdsNailType::Wire)
        }
        (StatedKind::Nail, Some(StatedShank::Ring)) => {
            (ShankKind::Ring, Some(stated.length_mm), NdsNailType::Wire)
        }
        (StatedKind::Nail, Some(StatedShank::Spiral)) => {
            (ShankKind::Spiral, Some(stated.length_mm), NdsNailType::Wire)
        }
    };
    let kind_word = match stated.kind {
        StatedKind::Nail => "nail",
        StatedKind::Screw => "screw",
    };
    Ok(Nail {
        id: stated.id.clone(),
        description: format!(
            "{} stated in the project, {:.1} mm x {:.2} mm, head {:.2} mm",
            // A screw's shank word is "screw" already: say it once.
            if shank.as_str() == kind_word {
                kind_word.to_string()
            } else {
                format!("{} {kind_word}", shank.as_str())
            },
            stated.length_mm,
            stated.diameter_mm,
            stated.head_diameter_mm
        ),
        length_mm: stated.length_mm,
        shank_diameter_mm: stated.diameter_mm,
        head_diameter_mm: stated.head_diameter_mm,
        shank,
        threaded_length_mm,
        material: Material::Carbon,
        basis: CatalogBasis::Both,
        nds_type,
        mass_g: steel_shank_mass_g(stated.diameter_mm, stated.length_mm),
        mass_basis: MassBasis::ComputedFromSteelDensity,
        source: stated.source.clone(),
        confidence: Confidence::StatedByUser,
        stated_withdrawal_n_per_mm: stated.withdrawal_n_per_mm.map(|value| SourcedValue {
            value,
            source: stated.source.clone(),
            confidence: Confidence::StatedByUser,
        }),
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn screw() -> StatedFastener {
        StatedFastener {
            id: "my-screw".to_string(),
            kind: StatedKind::Screw,
            shank: None,
            diameter_mm: 4.2,
            length_mm: 63.5,
            head_diameter_mm: 8.5,
            thread_length_mm: Some(40.0),
            withdrawal_n_per_mm: None,
            source: "invented test fastener".to_string(),
        }
    }

    #[test]
    fn a_screw_becomes_a_wood_screw_on_its_thread() {
        let nail = stated_fastener(&screw()).expect("valid");
        assert!(nail.is_wood_screw());
        assert_eq!(nail.threaded_length_mm, Some(40.0));
        assert_eq!(nail.confidence, Confidence::StatedByUser);
    }

    #[test]
    fn a_screw_without_thread_length_is_refused() {
        let mut stated = screw();
        stated.thread_length_mm = None;
        let message = stated_fastener(&stated).expect_err("refused").to_string();
        assert!(message.contains("my-screw") && message.contains("thread_length_mm"));
    }

    #[test]
    fn a_stated_withdrawal_value_carries_its_source() {
        let mut stated = screw();
        stated.withdrawal_n_per_mm = Some(20.0);
        let nail = stated_fastener(&stated).expect("valid");
        let value = nail.stated_withdrawal_n_per_mm.expect("stated");
        assert_eq!(value.value, 20.0);
        assert_eq!(value.source, "invented test fastener");
    }
}
