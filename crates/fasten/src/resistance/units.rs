//! Imperial units at the edge: NDS equations are written in lb and inches, deckhold works in N and mm.

/// Millimetres per inch (exact).
pub const MM_PER_IN: f64 = 25.4;
/// Newtons per pound-force (exact, from the definition of the pound and standard gravity).
pub const N_PER_LBF: f64 = 4.448_221_615_260_5;
/// N/mm per lb/in: converts an NDS withdrawal value per inch of penetration.
pub const N_PER_MM_PER_LBF_PER_IN: f64 = N_PER_LBF / MM_PER_IN;

pub fn in_from_mm(value_mm: f64) -> f64 {
    value_mm / MM_PER_IN
}

pub fn mm_from_in(value_in: f64) -> f64 {
    value_in * MM_PER_IN
}

pub fn lbf_from_n(value_n: f64) -> f64 {
    value_n / N_PER_LBF
}

pub fn n_from_lbf(value_lbf: f64) -> f64 {
    value_lbf * N_PER_LBF
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
