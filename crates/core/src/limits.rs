//! The one table of limits for the whole program: how big an input may be and the physical range of every
//! quantity, each with its reason or source. The project reader refuses values outside these ranges with
//! the key the user wrote; the method crates check the same constants, so the two can never disagree.
//!
//! Ranges are inclusive at both ends. Counts (bytes, characters, list entries) use the same type, with
//! whole numbers.

use std::fmt;

/// One limit: a key as the project file names it (SI variant), an inclusive range and why.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Limit {
    /// Where it applies, as the project file names it (`roof.slope_deg`), or what it counts.
    pub key: &'static str,
    pub min: f64,
    pub max: f64,
    /// Unit as printed (`deg`, `m`, `kPa`, `bytes`); empty for a plain number.
    pub unit: &'static str,
    /// Why this range: the standard's validity, a physical bound, or a bound on work (and saying which).
    pub reason: &'static str,
}

/// A value outside its limit; the message names the key, the value and the range, in the unit written.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
#[error("{key}: {value} is outside {range}")]
pub struct OutOfRange {
    pub key: String,
    pub value: String,
    pub range: String,
}

impl Limit {
    /// True when `value` is finite and inside `min..=max`.
    pub fn contains(&self, value: f64) -> bool {
        value.is_finite() && value >= self.min && value <= self.max
    }

    /// The largest count this limit allows (for counts only).
    pub fn max_count(&self) -> usize {
        self.max as usize
    }

    /// Refuses `value` (in the table's unit) outside the range, naming `key` (the key the user wrote).
    pub fn check(&self, key: &str, value: f64) -> Result<(), OutOfRange> {
        self.check_scaled(key, value, 1.0, self.unit)
    }

    /// Refuses a value the user wrote in another unit: `value_written * table_per_written` is compared
    /// with the range, and the message shows the value and the range in `unit_written`.
    pub fn check_scaled(
        &self,
        key: &str,
        value_written: f64,
        table_per_written: f64,
        unit_written: &str,
    ) -> Result<(), OutOfRange> {
        self.check_scaled_named(
            || key.to_string(),
            value_written,
            table_per_written,
            unit_written,
        )
    }

    /// [`Limit::check_scaled`] with the key spelt by `key`, called only for a refusal: a reader that
    /// builds key paths for messages only (a batch reads a project per row) asks for nothing else.
    pub fn check_scaled_named(
        &self,
        key: impl FnOnce() -> String,
        value_written: f64,
        table_per_written: f64,
        unit_written: &str,
    ) -> Result<(), OutOfRange> {
        if self.contains(value_written * table_per_written) {
            return Ok(());
        }
        let unit_text = if unit_written.is_empty() {
            String::new()
        } else {
            format!(" {unit_written}")
        };
        Err(OutOfRange {
            key: key(),
            value: format!("{}{unit_text}", number_for_message(value_written)),
            range: format!(
                "{}..{}{unit_text}",
                number_for_message(self.min / table_per_written),
                number_for_message(self.max / table_per_written)
            ),
        })
    }

    /// Refuses a count (bytes, characters, entries) above the maximum or below the minimum.
    pub fn check_count(&self, key: &str, count: usize) -> Result<(), OutOfRange> {
        self.check(key, count as f64)
    }
}

impl fmt::Display for Limit {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let unit = if self.unit.is_empty() {
            String::new()
        } else {
            format!(" {}", self.unit)
        };
        write!(
            f,
            "{}..{}{unit}",
            number_for_message(self.min),
            number_for_message(self.max)
        )
    }
}

/// Up to three decimals, no trailing zeros, never `-0`: messages read "outside 0..45", not "0.000..45.000".
pub fn number_for_message(value: f64) -> String {
    if !value.is_finite() {
        return format!("{value}");
    }
    let text = format!("{value:.3}");
    let text = text.trim_end_matches('0').trim_end_matches('.');
    if text == "-0" {
        "0".to_string()
    } else {
        text.to_string()
    }
}

const fn limit(
    key: &'static str,
    min: f64,
    max: f64,
    unit: &'static str,
    reason: &'static str,
) -> Limit {
    Limit {
        key,
        min,
        max,
        unit,
        reason,
    }
}

// ---- Sizes: bounds on work and memory (common practice, no source; chosen well above any real roof).

pub const FILE_SIZE: Limit = limit(
    "project file",
    0.0,
    1_048_576.0,
    "bytes",
    "bound on memory and time; the largest fixture is under 4 kB (common practice, no source)",
);
pub const TEXT_CHARS: Limit = limit(
    "project.name, .site, .owner, .prepared_by",
    0.0,
    200.0,
    "characters",
    "must fit the title block of every page (common practice, no source)",
);
pub const NOTES_CHARS: Limit = limit(
    "project.notes",
    0.0,
    2000.0,
    "characters",
    "a paragraph on the design-basis page (common practice, no source)",
);
pub const ID_CHARS: Limit = limit(
    "ids (basis, nails, species, panel, code_zone)",
    1.0,
    64.0,
    "characters",
    "catalog ids are under 40 characters; anything longer is not an id (common practice, no source)",
);
pub const SOURCE_CHARS: Limit = limit(
    "coefficient_overrides[].source",
    1.0,
    500.0,
    "characters",
    "one citation, printed on the design-basis page (common practice, no source)",
);
pub const NAILS_COUNT: Limit = limit(
    "nails",
    1.0,
    20.0,
    "entries",
    "each candidate nail is a full spacing run; 20 bounds the run time (common practice, no source)",
);
pub const OVERRIDES_COUNT: Limit = limit(
    "coefficient_overrides",
    0.0,
    24.0,
    "entries",
    "one per code zone of the largest zone set, with room to spare (common practice, no source)",
);
pub const CURVE_POINTS: Limit = limit(
    "coefficient_overrides[].points",
    1.0,
    20.0,
    "entries",
    "the standards' curves have 2 to 4 points (common practice, no source)",
);
pub const OUTLINE_CORNERS: Limit = limit(
    "building.footprint.polygon_m",
    4.0,
    200.0,
    "points",
    "a rectilinear house outline has 4 to a few dozen corners; bounds the zoning work (common practice, no source)",
);

pub const BATCH_ROWS: Limit = limit(
    "batch file rows",
    0.0,
    1_000_000.0,
    "rows",
    "bounds the duplicate-id check's memory (about 40 bytes a row); a larger portfolio is split into \
     several files (common practice, no source)",
);
pub const BATCH_COLUMNS: Limit = limit(
    "batch file columns",
    1.0,
    200.0,
    "columns",
    "an id and one column per project-file key; the file has fewer keys (common practice, no source)",
);
pub const BATCH_FIELD_CHARS: Limit = limit(
    "batch file field",
    0.0,
    2000.0,
    "characters",
    "the longest project-file value (project.notes) fits (common practice, no source)",
);
pub const ROOF_ID_CHARS: Limit = limit(
    "batch file id",
    1.0,
    64.0,
    "characters",
    "names the roof's output folder (common practice, no source)",
);

// ---- Building and roof geometry.

pub const PLAN_SIZE_M: Limit = limit(
    "building.footprint.rectangle.length_m, .width_m",
    1.0,
    300.0,
    "m",
    "low-rise buildings the C&C methods cover; beyond this the zone widths lose meaning (common practice, no source)",
);
pub const OUTLINE_COORDINATE_M: Limit = limit(
    "building.footprint.polygon_m[][]",
    -1000.0,
    1000.0,
    "m",
    "plan coordinates near the origin keep the geometry well conditioned (common practice, no source)",
);
pub const EAVE_HEIGHT_M: Limit = limit(
    "building.eave_height_m",
    1.0,
    100.0,
    "m",
    "physical bound; the methods' own height limits (NBC 20 m, ASCE 60 ft) are checked by the wind crate",
);
pub const SLOPE_DEG: Limit = limit(
    "roof.slope_deg",
    0.0,
    45.0,
    "deg",
    "NBC 2020 Figure 4.1.7.6.-C and ASCE 7-22 Figure 30.3-2 cover gable and hip roofs up to 45 deg",
);
pub const FLAT_SLOPE_DEG: Limit = limit(
    "roof.slope_deg (flat roof)",
    0.0,
    7.0,
    "deg",
    "NBC 2020 Figure 4.1.7.6.-B and ASCE 7-22 Figure 30.3-2A: the flat-roof figures apply up to 7 deg",
);
pub const MONOSLOPE_SLOPE_DEG: Limit = limit(
    "roof.slope_deg (monoslope roof)",
    0.0,
    30.0,
    "deg",
    "up to 3 deg the low-slope figures apply; 3 to 30 deg the monoslope figures (ASCE 7-22 Figures 30.3-5A and 5B, NBC 2020 Figure 4.1.7.6.-G per 4.1.7.6.(8)); they stop at 30 deg",
);
pub const OVERHANG_MM: Limit = limit(
    "roof.overhang_mm, .eave_overhang_mm, .rake_overhang_mm",
    0.0,
    1500.0,
    "mm",
    "a sheathed overhang longer than 1.5 m is a framed roof of its own (common practice, no source)",
);
pub const DEAD_LOAD_KPA: Limit = limit(
    "roof.dead_load_kpa",
    0.0,
    5.0,
    "kPa",
    "heaviest roofing (tile, ballast) is under 2 kPa; dead load counteracts uplift so a large value is unsafe if wrong (common practice, no source)",
);

// ---- Site wind.

pub const Q50_KPA: Limit = limit(
    "wind.q50_kpa",
    0.1,
    3.0,
    "kPa",
    "NBC 2020 Table C-2 lists 1-in-50 pressures from about 0.2 to 1.8 kPa (from memory)",
);
pub const TOPOGRAPHIC_FACTOR: Limit = limit(
    "wind.topographic_factor",
    1.0,
    4.0,
    "",
    "C_t is 1 on flat ground and grows on hills (NBC 2020 4.1.7.4, from memory)",
);
pub const INTERNAL_CATEGORY: Limit = limit(
    "wind.internal_category",
    1.0,
    3.0,
    "",
    "NBC 2020 4.1.7.7 defines categories 1, 2 and 3",
);
pub const SPEED_MPH: Limit = limit(
    "wind.speed_mph",
    60.0,
    300.0,
    "mph",
    "ASCE 7-22 Figures 26.5-1 (strength level) start near 90 mph; 300 mph is past any mapped value (from memory)",
);
pub const KZT: Limit = limit(
    "wind.kzt",
    1.0,
    4.0,
    "",
    "K_zt is 1 on flat ground and grows on hills (ASCE 7-22 26.8, from memory)",
);
pub const GROUND_ELEVATION_M: Limit = limit(
    "wind.ground_elevation_m",
    -91.44,
    3500.0,
    "m",
    "-300 ft to 3500 m: the range over which the K_e expression of ASCE 7-22 Table 26.9-1 is used here (from memory)",
);
pub const OVERRIDE_AREA_M2: Limit = limit(
    "coefficient_overrides[].points[].area_m2",
    0.01,
    10_000.0,
    "m2",
    "the standards' curves run from about 0.1 m² to 100 m²; wider accepted, held flat beyond (common practice, no source)",
);
pub const OVERRIDE_COEFFICIENT: Limit = limit(
    "coefficient_overrides[].points[].coefficient",
    -20.0,
    20.0,
    "",
    "published C&C coefficients lie within about -8..+2 (from memory)",
);

// ---- Framing and deck.

pub const FRAMING_SPACING_MM: Limit = limit(
    "framing.spacing_mm",
    200.0,
    1220.0,
    "mm",
    "roof framing is set out at 300 to 1220 mm (12 to 48 in) o.c. (common practice, no source)",
);
pub const MEMBER_WIDTH_MM: Limit = limit(
    "framing.member_width_mm",
    19.0,
    400.0,
    "mm",
    "from a 1x board to a glulam beam face (common practice, no source)",
);
pub const MEMBER_DEPTH_MM: Limit = limit(
    "framing.member_depth_mm",
    19.0,
    1200.0,
    "mm",
    "from a 1x board to a deep glulam (common practice, no source)",
);
pub const DECK_THICKNESS_MM: Limit = limit(
    "deck.thickness_mm",
    6.0,
    40.0,
    "mm",
    "structural roof panels are 7.5 to 28.5 mm (CSA O325, PS 2 span ratings, from memory)",
);
pub const PANEL_LENGTH_MM: Limit = limit(
    "deck.panel_length_mm",
    600.0,
    3700.0,
    "mm",
    "panels are made up to 12 ft (3658 mm); shorter pieces must span two supports (common practice, no source)",
);
pub const PANEL_WIDTH_MM: Limit = limit(
    "deck.panel_width_mm",
    300.0,
    1250.0,
    "mm",
    "panels are made 1220 mm (48 in) wide; ripped strips narrower than 300 mm are avoided (common practice, no source)",
);
pub const BETWEEN_MM: Limit = limit(
    "deck.between_mm",
    0.0,
    100.0,
    "mm",
    "material between deck and framing (insulation, battens) the nail passes through (common practice, no source)",
);
pub const PATTERN_SPACING_MM: Limit = limit(
    "existing.edge_spacing_mm, .intermediate_spacing_mm",
    10.0,
    1000.0,
    "mm",
    "an existing nail pattern as measured on site (common practice, no source)",
);

pub const EXISTING_CREDIT: Limit = limit(
    "existing.credit",
    0.0,
    1.0,
    "",
    "share of the existing fasteners' resistance counted: 1 sound, 0 unknown or corroded (a fraction)",
);

// ---- Fasteners stated in the project file (common practice, no source: the span of roof sheathing
// nails and screws, well beyond what is sold for the job).

pub const FASTENER_DIAMETER_MM: Limit = limit(
    "fasteners[].diameter_mm",
    1.5,
    10.0,
    "mm",
    "shank diameter of a sheathing nail or screw (common practice, no source)",
);
pub const FASTENER_LENGTH_MM: Limit = limit(
    "fasteners[].length_mm",
    20.0,
    200.0,
    "mm",
    "length of a sheathing nail or screw (common practice, no source)",
);
pub const FASTENER_HEAD_MM: Limit = limit(
    "fasteners[].head_diameter_mm",
    3.0,
    30.0,
    "mm",
    "head diameter of a sheathing nail or screw (common practice, no source)",
);
pub const FASTENER_THREAD_MM: Limit = limit(
    "fasteners[].thread_length_mm",
    5.0,
    200.0,
    "mm",
    "thread length of a screw, never more than its length (common practice, no source)",
);
pub const FASTENER_WITHDRAWAL_N_PER_MM: Limit = limit(
    "fasteners[].withdrawal_n_per_mm",
    0.5,
    500.0,
    "N/mm",
    "withdrawal per mm of penetration stated from an evaluation report (common practice, no source)",
);

/// Every limit, in the order `deckhold limits` prints them.
pub const ALL: &[Limit] = &[
    FILE_SIZE,
    TEXT_CHARS,
    NOTES_CHARS,
    ID_CHARS,
    SOURCE_CHARS,
    NAILS_COUNT,
    OVERRIDES_COUNT,
    CURVE_POINTS,
    OUTLINE_CORNERS,
    BATCH_ROWS,
    BATCH_COLUMNS,
    BATCH_FIELD_CHARS,
    ROOF_ID_CHARS,
    PLAN_SIZE_M,
    OUTLINE_COORDINATE_M,
    EAVE_HEIGHT_M,
    SLOPE_DEG,
    FLAT_SLOPE_DEG,
    MONOSLOPE_SLOPE_DEG,
    OVERHANG_MM,
    DEAD_LOAD_KPA,
    Q50_KPA,
    TOPOGRAPHIC_FACTOR,
    INTERNAL_CATEGORY,
    SPEED_MPH,
    KZT,
    GROUND_ELEVATION_M,
    OVERRIDE_AREA_M2,
    OVERRIDE_COEFFICIENT,
    FRAMING_SPACING_MM,
    MEMBER_WIDTH_MM,
    MEMBER_DEPTH_MM,
    DECK_THICKNESS_MM,
    PANEL_LENGTH_MM,
    PANEL_WIDTH_MM,
    BETWEEN_MM,
    PATTERN_SPACING_MM,
    EXISTING_CREDIT,
    FASTENER_DIAMETER_MM,
    FASTENER_LENGTH_MM,
    FASTENER_HEAD_MM,
    FASTENER_THREAD_MM,
    FASTENER_WITHDRAWAL_N_PER_MM,
];

/// The table as Markdown: what `deckhold limits` prints and docs/project-format.md carries.
pub fn markdown_table() -> String {
    let mut text = String::from("| applies to | range | reason or source |\n|---|---|---|\n");
    for limit in ALL {
        text.push_str(&format!(
            "| `{}` | {limit} | {} |\n",
            limit.key,
            limit.reason.replace('|', "/")
        ));
    }
    text
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn message_names_key_value_and_range() {
        let error = SLOPE_DEG
            .check("roof.slope_deg", 75.0)
            .expect_err("75 is out");
        assert_eq!(
            error.to_string(),
            "roof.slope_deg: 75 deg is outside 0..45 deg"
        );
    }

    #[test]
    fn a_value_written_in_another_unit_is_reported_in_that_unit() {
        let error = FRAMING_SPACING_MM
            .check_scaled("framing.spacing_in", 60.0, 25.4, "in")
            .expect_err("too wide");
        assert_eq!(
            error.to_string(),
            "framing.spacing_in: 60 in is outside 7.874..48.031 in"
        );
    }

    #[test]
    fn the_ends_are_inside_and_nan_is_outside() {
        for limit in ALL {
            assert!(limit.contains(limit.min), "{}", limit.key);
            assert!(limit.contains(limit.max), "{}", limit.key);
            assert!(!limit.contains(f64::NAN), "{}", limit.key);
            assert!(limit.min < limit.max, "{}", limit.key);
            assert!(!limit.reason.is_empty(), "{}", limit.key);
        }
    }

    #[test]
    fn no_negative_zero_in_messages() {
        assert_eq!(number_for_message(-0.0001), "0");
        assert_eq!(number_for_message(2.5), "2.5");
    }
}
