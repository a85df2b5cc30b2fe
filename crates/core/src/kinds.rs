//! The kinds every crate names. Writers and checks `match` on these, so a new kind cannot be forgotten: the
//! compiler names every place that must learn it. Each has one word (its `Display`), which is also the word
//! the project file and the output use.

use serde::{Deserialize, Serialize};
use std::fmt;

/// Implements `as_str`, `Display`, `ALL` and `parse` from one table of (variant, word).
macro_rules! words {
    ($kind:ident { $($variant:ident => $word:literal),+ $(,)? }) => {
        impl $kind {
            /// Every kind, in the order of the table.
            pub const ALL: &'static [$kind] = &[$($kind::$variant),+];

            /// The kind's one word, as the project file and the output write it.
            pub fn as_str(self) -> &'static str {
                match self {
                    $($kind::$variant => $word),+
                }
            }

            /// The kind written as `word`, if any.
            pub fn parse(word: &str) -> Option<Self> {
                Self::ALL.iter().copied().find(|kind| kind.as_str() == word)
            }

            /// Every word, in the order of the table.
            pub fn words() -> Vec<&'static str> {
                Self::ALL.iter().map(|kind| kind.as_str()).collect()
            }
        }

        impl fmt::Display for $kind {
            fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
                f.write_str(self.as_str())
            }
        }
    };
}

/// A components-and-cladding roof zone, from the least to the most severe within each group.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize, Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum ZoneKind {
    Interior,
    Edge,
    /// A monoslope's strip along its high eave, where the figure zones it apart from the other edges
    /// (ASCE 7-22 Figure 30.3-5A zone 2').
    HighEdge,
    Corner,
    /// A monoslope's high-eave corner, where the figure zones it apart (ASCE 7-22 Figure 30.3-5A zone 3').
    HighCorner,
    OverhangInterior,
    OverhangEdge,
    OverhangHighEdge,
    OverhangCorner,
    OverhangHighCorner,
}

words!(ZoneKind {
    Interior => "interior",
    Edge => "edge",
    HighEdge => "high-edge",
    Corner => "corner",
    HighCorner => "high-corner",
    OverhangInterior => "overhang-interior",
    OverhangEdge => "overhang-edge",
    OverhangHighEdge => "overhang-high-edge",
    OverhangCorner => "overhang-corner",
    OverhangHighCorner => "overhang-high-corner",
});

impl ZoneKind {
    /// True for the roof overhang zones (both faces loaded: the standards' overhang coefficients).
    pub fn is_overhang(self) -> bool {
        matches!(
            self,
            ZoneKind::OverhangInterior
                | ZoneKind::OverhangEdge
                | ZoneKind::OverhangHighEdge
                | ZoneKind::OverhangCorner
                | ZoneKind::OverhangHighCorner
        )
    }

    /// The kind a high-eave zone belongs with (edge or corner), for tables with one column per kind;
    /// every other kind is its own.
    pub fn base(self) -> ZoneKind {
        match self {
            ZoneKind::HighEdge => ZoneKind::Edge,
            ZoneKind::HighCorner => ZoneKind::Corner,
            ZoneKind::OverhangHighEdge => ZoneKind::OverhangEdge,
            ZoneKind::OverhangHighCorner => ZoneKind::OverhangCorner,
            other => other,
        }
    }

    /// Place on the crew's sheet: worst zones first, the roof before its overhangs.
    pub fn sheet_rank(self) -> u32 {
        match self {
            ZoneKind::HighCorner => 0,
            ZoneKind::Corner => 1,
            ZoneKind::HighEdge => 2,
            ZoneKind::Edge => 3,
            ZoneKind::Interior => 4,
            ZoneKind::OverhangHighCorner => 5,
            ZoneKind::OverhangCorner => 6,
            ZoneKind::OverhangHighEdge => 7,
            ZoneKind::OverhangEdge => 8,
            ZoneKind::OverhangInterior => 9,
        }
    }
}

/// What one edge of a roof plane is on the roof. The framing is set out from these: a rake edge has a
/// gable-end wall under it one rake overhang in, an eave edge the eave wall one eave overhang in, and a
/// hip or valley edge carries a hip or valley rafter.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize, Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum EdgeKind {
    /// A level outer edge where the deck ends over (or past) a wall: the low edge of a sloped plane,
    /// the high edge of a monoslope, every outer edge of a flat roof except its rakes.
    Eave,
    /// An outer edge running up the slope at a gable end (on a flat rectangle: the two ends across
    /// the ridge direction, which take the rake overhang).
    Rake,
    /// The level line where two planes meet at the top.
    Ridge,
    /// A sloping line where two planes meet over an outside corner.
    Hip,
    /// A sloping line where two planes meet over an inside corner.
    Valley,
}

words!(EdgeKind {
    Eave => "eave",
    Rake => "rake",
    Ridge => "ridge",
    Hip => "hip",
    Valley => "valley",
});

impl EdgeKind {
    /// An edge where the roof ends (eave or rake), not a line shared with another plane.
    pub fn is_outer(self) -> bool {
        matches!(self, EdgeKind::Eave | EdgeKind::Rake)
    }
}

/// What a framing line is to the panels of one course.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize, Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum SupportRole {
    /// Panel ends meet on the line (two rows of nails), or the deck ends on it (one row).
    PanelEdge,
    /// The panel runs across the line.
    Intermediate,
}

words!(SupportRole {
    PanelEdge => "panel-edge",
    Intermediate => "intermediate",
});

/// What a framing line is: the member the deck lands on. The crew sheet names it beside the line's
/// number, and identical lines are grouped only within one kind.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize, Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum LineKind {
    /// A common rafter, truss or joist at the framing spacing.
    Common,
    /// The member over a wall parallel to the framing (a gable-end wall, an inside wall of an L).
    EndWall,
    /// A hip rafter, from an outside corner to the ridge.
    Hip,
    /// A valley rafter, from an inside corner to the ridge.
    Valley,
    /// A jack rafter: from the eave wall up to a hip or valley.
    Jack,
    /// Blocking between members where the user asks for it.
    Blocking,
}

words!(LineKind {
    Common => "common",
    EndWall => "end-wall",
    Hip => "hip",
    Valley => "valley",
    Jack => "jack",
    Blocking => "blocking",
});

/// The roof's shape, as the wind standards' figures distinguish it.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum RoofShape {
    Gable,
    Hip,
    Monoslope,
    Flat,
}

words!(RoofShape {
    Gable => "gable",
    Hip => "hip",
    Monoslope => "monoslope",
    Flat => "flat",
});

/// The design bases deckhold implements: a wind standard with a fastener standard.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Basis {
    /// NBC 2020 Part 4 wind (limit states: 1.4W, 0.9D) with CSA O86 nail withdrawal.
    Nbc2020O86,
    /// ASCE 7-22 Chapter 30 wind with NDS 2018 withdrawal, allowable stress design (0.6W, 0.6D).
    Asce722Nds2018Asd,
    /// ASCE 7-22 Chapter 30 wind with NDS 2018 withdrawal, load and resistance factor design (1.0W, 0.9D).
    Asce722Nds2018Lrfd,
}

words!(Basis {
    Nbc2020O86 => "nbc2020-o86",
    Asce722Nds2018Asd => "asce7-22-nds2018-asd",
    Asce722Nds2018Lrfd => "asce7-22-nds2018-lrfd",
});

impl Basis {
    /// True for the US bases (ASCE 7 with NDS): US customary units lead in the output.
    pub fn is_us(self) -> bool {
        !matches!(self, Basis::Nbc2020O86)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_word_parses_back_to_its_kind() {
        for kind in ZoneKind::ALL {
            assert_eq!(ZoneKind::parse(kind.as_str()), Some(*kind));
        }
        for role in SupportRole::ALL {
            assert_eq!(SupportRole::parse(&role.to_string()), Some(*role));
        }
        for basis in Basis::ALL {
            assert_eq!(Basis::parse(basis.as_str()), Some(*basis));
        }
        assert_eq!(RoofShape::parse("gable"), Some(RoofShape::Gable));
        assert_eq!(ZoneKind::parse("edges"), None);
    }

    #[test]
    fn only_the_overhang_kinds_are_overhangs() {
        let overhangs: Vec<_> = ZoneKind::ALL
            .iter()
            .filter(|kind| kind.is_overhang())
            .collect();
        assert_eq!(overhangs.len(), 5);
        assert!(overhangs
            .iter()
            .all(|kind| kind.as_str().starts_with("overhang-")));
    }
}
