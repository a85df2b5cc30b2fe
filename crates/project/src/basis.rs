//! The design basis: which wind standard and which fastener standard, and how they are combined.

use deckhold_fasten::Method;
use deckhold_model::{BasisInfo, Units};
use deckhold_wind::StrengthMethod;

pub use deckhold_core::Basis;

/// What each basis means to the method crates and the report (the basis itself is shared vocabulary).
pub trait BasisStandards {
    /// The fastener method of this basis.
    fn fastener_method(self) -> Method;
    /// The US strength method (None for the Canadian basis).
    fn strength_method(self) -> Option<StrengthMethod>;
    /// Which units the report leads with.
    fn units(self) -> Units;
    /// The basis as the report prints it.
    fn info(self) -> BasisInfo;
}

impl BasisStandards for Basis {
    fn fastener_method(self) -> Method {
        match self {
            Basis::Nbc2020O86 => Method::O86LimitStates,
            Basis::Asce722Nds2018Asd => Method::NdsAsd,
            Basis::Asce722Nds2018Lrfd => Method::NdsLrfd,
        }
    }

    fn strength_method(self) -> Option<StrengthMethod> {
        match self {
            Basis::Nbc2020O86 => None,
            Basis::Asce722Nds2018Asd => Some(StrengthMethod::Asd),
            Basis::Asce722Nds2018Lrfd => Some(StrengthMethod::Lrfd),
        }
    }

    fn units(self) -> Units {
        if self.is_us() {
            Units::Imperial
        } else {
            Units::Si
        }
    }

    fn info(self) -> BasisInfo {
        let (title, wind, fastener) = match self {
            Basis::Nbc2020O86 => (
                "NBC 2020 Part 4 wind (limit states) with CSA O86 nail withdrawal",
                "NBC 2020 Division B, Subsection 4.1.7 (low buildings, 4.1.7.6)",
                "CSA O86:19 clause 12.9 (nails: withdrawal, limit states)",
            ),
            Basis::Asce722Nds2018Asd => (
                "ASCE 7-22 Chapter 30 wind with NDS 2018 withdrawal, ASD",
                "ASCE/SEI 7-22 Chapter 26 and Chapter 30 Part 1 (low-rise)",
                "AWC NDS 2018 clause 12.2 (withdrawal, head pull-through), ASD",
            ),
            Basis::Asce722Nds2018Lrfd => (
                "ASCE 7-22 Chapter 30 wind with NDS 2018 withdrawal, LRFD",
                "ASCE/SEI 7-22 Chapter 26 and Chapter 30 Part 1 (low-rise)",
                "AWC NDS 2018 clause 12.2 and Appendix N (LRFD)",
            ),
        };
        BasisInfo {
            id: self.as_str().to_string(),
            title: title.to_string(),
            wind_standard: wind.to_string(),
            fastener_standard: fastener.to_string(),
            units: self.units(),
        }
    }
}
