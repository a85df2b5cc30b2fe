//! Deck panels: what head pull-through needs from the side member the nail head bears on.

use crate::catalog::SourcedValue;
use crate::error::FastenError;
use serde::{Deserialize, Serialize};

/// One panel kind of the catalog.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Panel {
    pub id: String,
    pub name: String,
    /// Specific gravity NDS 2018 12.2.5 uses for a wood structural panel side member.
    pub nds_specific_gravity: SourcedValue,
}

/// The deck layer a nail passes through: its panel kind and thickness.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct DeckLayer<'a> {
    pub panel: &'a Panel,
    pub thickness_mm: f64,
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct PanelFile {
    #[serde(rename = "_about")]
    _about: Option<String>,
    panels: Vec<Panel>,
}

/// Parses and checks a panel catalog.
pub fn parse_panels(json: &str, file: &'static str) -> Result<Vec<Panel>, FastenError> {
    let parsed: PanelFile = serde_json::from_str(json).map_err(|error| FastenError::Catalog {
        file,
        message: error.to_string(),
    })?;
    for (index, panel) in parsed.panels.iter().enumerate() {
        if parsed.panels[..index]
            .iter()
            .any(|other| other.id == panel.id)
        {
            return Err(FastenError::Catalog {
                file,
                message: format!("panel id `{}` appears twice", panel.id),
            });
        }
        let gravity = panel.nds_specific_gravity.value;
        if !(gravity.is_finite() && gravity > 0.0 && gravity < 1.0) {
            return Err(FastenError::Catalog {
                file,
                message: format!(
                    "panel `{}`: nds_specific_gravity = {gravity} is outside 0 < G < 1",
                    panel.id
                ),
            });
        }
    }
    Ok(parsed.panels)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn duplicate_panels_are_refused() {
        let one = r#"{"id": "osb", "name": "OSB",
            "nds_specific_gravity": {"value": 0.5, "source": "s", "confidence": "from memory"}}"#;
        let json = format!(r#"{{"panels": [{one}, {one}]}}"#);
        assert!(parse_panels(&json, "test.json").is_err());
    }

    #[test]
    fn a_zero_gravity_is_refused() {
        let json = r#"{"panels": [{"id": "osb", "name": "OSB",
            "nds_specific_gravity": {"value": 0.0, "source": "s", "confidence": "from memory"}}]}"#;
        assert!(parse_panels(json, "test.json").is_err());
    }
}
