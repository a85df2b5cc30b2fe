//! Where a catalog value comes from: the source text and how sure we are of it.

use serde::{Deserialize, Serialize};

/// How a value was obtained (house rule: every table value says which).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum Confidence {
    /// Compared with a named printed or public source that was actually looked at.
    #[serde(rename = "checked")]
    Checked,
    /// Recalled; the source text names the edition.
    #[serde(rename = "from memory")]
    FromMemory,
    /// Stated by the user in the project file with its source (for example a maker's evaluation
    /// report); deckhold has not checked it.
    #[serde(rename = "stated by the user")]
    StatedByUser,
}

impl Confidence {
    pub fn as_str(self) -> &'static str {
        match self {
            Confidence::Checked => "checked",
            Confidence::FromMemory => "from memory",
            Confidence::StatedByUser => "stated by the user",
        }
    }

    /// `source (confidence)`, the form the report prints; a source that already says its confidence
    /// (a catalog row noting "from memory, B111-1974") is not told twice. Built for every nail of every
    /// roof of a batch, so joined without the formatting machinery.
    pub fn provenance(self, source: &str) -> String {
        if source.contains(self.as_str()) {
            source.to_string()
        } else {
            [source, " (", self.as_str(), ")"].concat()
        }
    }
}

/// A number with its source, as stored in the catalog files.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SourcedValue {
    pub value: f64,
    pub source: String,
    pub confidence: Confidence,
}

impl SourcedValue {
    /// `source (confidence)`, the form the report prints.
    pub fn provenance(&self) -> String {
        self.confidence.provenance(&self.source)
    }
}

/// Which design basis a catalog entry is usually used with (informational: the methods do not refuse
/// an entry from the other country's catalog).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum CatalogBasis {
    Ca,
    Us,
    Both,
}

impl CatalogBasis {
    pub fn as_str(self) -> &'static str {
        match self {
            CatalogBasis::Ca => "ca",
            CatalogBasis::Us => "us",
            CatalogBasis::Both => "both",
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn confidence_reads_the_house_spelling() {
        let value: SourcedValue = serde_json::from_str(
            r#"{"value": 0.5, "source": "NDS 2018 Table 12.3.3A", "confidence": "from memory"}"#,
        )
        .expect("parses");
        assert_eq!(value.confidence, Confidence::FromMemory);
        assert_eq!(value.provenance(), "NDS 2018 Table 12.3.3A (from memory)");
    }

    #[test]
    fn confidence_is_said_once() {
        let said = "wire nails (from memory, B111-1974); head from F1667 (from memory)";
        assert_eq!(Confidence::FromMemory.provenance(said), said);
        assert_eq!(
            Confidence::Checked.provenance("NDS 2018 Table L4"),
            "NDS 2018 Table L4 (checked)"
        );
    }

    #[test]
    fn unknown_confidence_is_refused() {
        let parsed: Result<SourcedValue, _> =
            serde_json::from_str(r#"{"value": 0.5, "source": "x", "confidence": "guessed"}"#);
        assert!(parsed.is_err());
    }
}
