//! Unit variants of project-file quantities. SI inside; US keys are converted here, at the edge.

pub use deckhold_core::units::{KPA_PER_PSF, MM_PER_IN, M_PER_FT, N_PER_LBF};

/// A kind of quantity with its SI and US key suffixes.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Quantity {
    /// `_m` or `_ft`.
    LengthM,
    /// `_mm` or `_in`.
    LengthMm,
    /// `_kpa` or `_psf`.
    PressureKpa,
    /// `_m2` or `_ft2`.
    AreaM2,
    /// `_n_per_mm` or `_lb_per_in` (withdrawal per unit penetration).
    ForceNPerMm,
}

impl Quantity {
    pub fn si_suffix(self) -> &'static str {
        match self {
            Quantity::LengthM => "m",
            Quantity::LengthMm => "mm",
            Quantity::PressureKpa => "kpa",
            Quantity::AreaM2 => "m2",
            Quantity::ForceNPerMm => "n_per_mm",
        }
    }

    pub fn us_suffix(self) -> &'static str {
        match self {
            Quantity::LengthM => "ft",
            Quantity::LengthMm => "in",
            Quantity::PressureKpa => "psf",
            Quantity::AreaM2 => "ft2",
            Quantity::ForceNPerMm => "lb_per_in",
        }
    }

    pub fn si_unit(self) -> &'static str {
        match self {
            Quantity::LengthM => "m",
            Quantity::LengthMm => "mm",
            Quantity::PressureKpa => "kPa",
            Quantity::AreaM2 => "m²",
            Quantity::ForceNPerMm => "N/mm",
        }
    }

    pub fn us_unit(self) -> &'static str {
        match self {
            Quantity::LengthM => "ft",
            Quantity::LengthMm => "in",
            Quantity::PressureKpa => "psf",
            Quantity::AreaM2 => "ft²",
            Quantity::ForceNPerMm => "lb/in",
        }
    }

    fn si_per_us(self) -> f64 {
        match self {
            Quantity::LengthM => M_PER_FT,
            Quantity::LengthMm => MM_PER_IN,
            Quantity::PressureKpa => KPA_PER_PSF,
            Quantity::AreaM2 => M_PER_FT * M_PER_FT,
            Quantity::ForceNPerMm => N_PER_LBF / MM_PER_IN,
        }
    }

    pub fn to_si(self, us_value: f64) -> f64 {
        us_value * self.si_per_us()
    }

    pub fn from_si(self, si_value: f64) -> f64 {
        si_value / self.si_per_us()
    }
}

/// `stem_suffix`, a quantity's key in one unit (`eave_height` and `m`), handed to `use_key`; spelt in a
/// buffer on the stack when it fits, so that looking the key up allocates nothing (a batch looks up
/// every quantity of every row).
pub fn with_unit_key<R>(stem: &str, suffix: &str, use_key: impl FnOnce(&str) -> R) -> R {
    let mut buffer = [0u8; 64];
    let length = stem.len() + 1 + suffix.len();
    if length <= buffer.len() {
        buffer[..stem.len()].copy_from_slice(stem.as_bytes());
        buffer[stem.len()] = b'_';
        buffer[stem.len() + 1..length].copy_from_slice(suffix.as_bytes());
        // Two whole UTF-8 strings joined by an ASCII byte are UTF-8.
        if let Ok(key) = std::str::from_utf8(&buffer[..length]) {
            return use_key(key);
        }
    }
    use_key(&format!("{stem}_{suffix}"))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_unit_key_is_the_stem_and_suffix_joined_whatever_its_length() {
        assert_eq!(
            with_unit_key("eave_height", "m", str::to_string),
            "eave_height_m"
        );
        let long_stem = "x".repeat(70);
        assert_eq!(
            with_unit_key(&long_stem, "mm", str::to_string),
            format!("{long_stem}_mm")
        );
    }
}
