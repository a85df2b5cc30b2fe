//! Unit conversions: SI inside, US customary at the edges. One constant per conversion, each with its source.

/// Millimetres per inch: exact, by the international yard and pound agreement (1959), 1 in = 25.4 mm.
pub const MM_PER_IN: f64 = 25.4;
/// Metres per foot: exact, by the same agreement (1 ft = 12 in = 0.3048 m).
pub const M_PER_FT: f64 = 0.3048;
/// Millimetres per foot: exact, from [`M_PER_FT`].
pub const MM_PER_FT: f64 = M_PER_FT * 1000.0;
/// Newtons per pound-force: exact by definition, 1 lbf = 0.45359237 kg x 9.80665 m/s² (standard gravity,
/// 3rd CGPM 1901; the avoirdupois pound, 1959 agreement).
pub const N_PER_LBF: f64 = 4.448_221_615_260_5;
/// Kilopascals per pound-force per square foot, derived: 1 psf = N_PER_LBF / M_PER_FT² Pa = 47.880259 Pa.
pub const KPA_PER_PSF: f64 = N_PER_LBF / (M_PER_FT * M_PER_FT) / 1000.0;
/// Kilograms per avoirdupois pound: exact, by the 1959 agreement (1 lb = 0.45359237 kg).
pub const KG_PER_LB: f64 = 0.453_592_37;
/// Newtons per millimetre per pound-force per inch (an NDS withdrawal value per inch of penetration).
pub const N_PER_MM_PER_LBF_PER_IN: f64 = N_PER_LBF / MM_PER_IN;

pub fn in_from_mm(value_mm: f64) -> f64 {
    value_mm / MM_PER_IN
}

pub fn mm_from_in(value_in: f64) -> f64 {
    value_in * MM_PER_IN
}

pub fn ft_from_m(value_m: f64) -> f64 {
    value_m / M_PER_FT
}

pub fn m_from_ft(value_ft: f64) -> f64 {
    value_ft * M_PER_FT
}

pub fn lbf_from_n(value_n: f64) -> f64 {
    value_n / N_PER_LBF
}

pub fn n_from_lbf(value_lbf: f64) -> f64 {
    value_lbf * N_PER_LBF
}

pub fn psf_from_kpa(value_kpa: f64) -> f64 {
    value_kpa / KPA_PER_PSF
}

pub fn kpa_from_psf(value_psf: f64) -> f64 {
    value_psf * KPA_PER_PSF
}

pub fn n_per_mm_from_lbf_per_in(value_lbf_per_in: f64) -> f64 {
    value_lbf_per_in * N_PER_MM_PER_LBF_PER_IN
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn conversions_round_trip() {
        assert_relative_eq!(mm_from_in(in_from_mm(63.5)), 63.5);
        assert_relative_eq!(lbf_from_n(n_from_lbf(66.0)), 66.0);
        assert_relative_eq!(kpa_from_psf(psf_from_kpa(1.2)), 1.2);
        assert_relative_eq!(m_from_ft(ft_from_m(7.5)), 7.5);
    }

    #[test]
    fn one_psf_is_47_880259_pa() {
        // NIST SP 811 (2008) Appendix B.8: 1 lbf/ft² = 47.88026 Pa.
        assert_relative_eq!(KPA_PER_PSF * 1000.0, 47.880_26, max_relative = 1e-6);
    }

    #[test]
    fn one_lb_per_inch_is_0_175_n_per_mm() {
        // 4.448222 N / 25.4 mm = 0.1751268 (definition of the units).
        assert_relative_eq!(
            n_per_mm_from_lbf_per_in(1.0),
            0.175_126_8,
            max_relative = 1e-6
        );
    }
}
