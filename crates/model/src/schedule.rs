//! The computed schedule as plain report data.
//!
//! The project crate fills a [`Schedule`] from the wind, withdrawal and spacing results; the writers
//! (`deckhold-schedule`) turn it into CSV and PDF bytes. Nothing here computes engineering values: the writers only format,
//! so a report can never disagree with the numbers that were checked. All quantities are SI; the writers
//! add the US twins where [`Units::Imperial`] asks for them.

pub use deckhold_core::{EdgeKind, LineKind, SupportRole, ZoneKind};
use serde::Serialize;

/// The units every printed output uses: one system per document, so a crew never converts. The basis
/// picks its customary units; `--units` overrides. JSON keeps its SI fields and adds these beside them.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Units {
    /// mm, m, kPa, N (Canadian practice).
    Si,
    /// US customary: inches o.c., feet-inches to 1/8 in, psf, lb, nails by pennyweight.
    Imperial,
}

impl Units {
    /// The word the user types: `si` or `us`.
    pub fn id(self) -> &'static str {
        match self {
            Units::Si => "si",
            Units::Imperial => "us",
        }
    }

    pub fn is_us(self) -> bool {
        self == Units::Imperial
    }
}

/// Who, where and when: the title block of every page.
#[derive(Debug, Clone, Default, Serialize)]
pub struct ProjectInfo {
    pub name: String,
    pub site: String,
    pub owner: String,
    pub prepared_by: String,
    /// Date printed on the report and used as the PDF creation date (ISO 8601, `YYYY-MM-DD`).
    pub date: String,
    pub notes: String,
}

/// The design basis and the editions behind it.
#[derive(Debug, Clone, Serialize)]
pub struct BasisInfo {
    /// The project file's basis id, e.g. `nbc2020-o86`.
    pub id: String,
    /// One line for people, e.g. "NBC 2020 Part 4 wind, CSA O86 limit states withdrawal".
    pub title: String,
    pub wind_standard: String,
    pub fastener_standard: String,
    pub units: Units,
}

/// A name, value and where the value comes from: one line of a derivation.
#[derive(Debug, Clone, Serialize)]
pub struct FactorRow {
    pub name: String,
    pub value: f64,
    /// Clause, table or figure with edition, and `checked` or `from memory`.
    pub source: String,
}

/// One input as the user gave it (after validation), for the design-basis page.
#[derive(Debug, Clone, Serialize)]
pub struct InputRow {
    /// Key path in the project file, e.g. `roof.slope_deg`.
    pub key: String,
    /// Value with its unit, as it should be printed.
    pub value: String,
}

/// Where the first panel of one roof plane goes.
#[derive(Debug, Clone, Serialize)]
pub struct LayingRow {
    /// `P1`, `P2`, ...
    pub plane: String,
    /// Plan point of the eave corner the first panel goes in, m.
    pub corner_m: [f64; 2],
    /// The plane's lowest-numbered framing line, where the first panel's end lands.
    pub first_line: Option<u32>,
    /// The first course's low edge above the eave edge, up the slope, m (0: flush).
    pub first_course_offset_m: f64,
}

/// A roof zone drawn on the plan.
#[derive(Debug, Clone, Serialize)]
pub struct PlanZone {
    pub label: ZoneKind,
    /// The standard's own name for the zone (e.g. `s` or `2e`).
    pub code_zone: String,
    /// Polygons in plan coordinates, m.
    pub polygons_m: Vec<Vec<[f64; 2]>>,
}

/// A framing line drawn on the plan.
#[derive(Debug, Clone, Serialize)]
pub struct PlanLine {
    pub number: u32,
    pub start_m: [f64; 2],
    pub end_m: [f64; 2],
}

/// One side of a roof plane, or one ridge, hip or valley of the roof, in plan.
#[derive(Debug, Clone, Serialize)]
pub struct PlanEdge {
    pub kind: EdgeKind,
    pub from_m: [f64; 2],
    pub to_m: [f64; 2],
    /// Length in plan, m (a hip or valley is longer on the slope).
    pub length_m: f64,
    /// True length along the line, m: the plan length with the rise between its ends (a ridge, eave
    /// or level edge: the plan length). What a framer cuts a hip or valley rafter to, before bevels.
    pub length_on_slope_m: f64,
}

/// One roof plane: where it is, how big and how steep, and the lines that bound it.
#[derive(Debug, Clone, Serialize)]
pub struct PlanPlane {
    /// `P1`, `P2`, ... as the line table and `rafter-lines.csv` name it.
    pub name: String,
    /// Counter-clockwise, overhangs included, m.
    pub polygon_m: Vec<[f64; 2]>,
    pub slope_deg: f64,
    /// Unit plan vector down the slope.
    pub downslope_m: [f64; 2],
    pub area_plan_m2: f64,
    /// The plane's own area, measured on the slope (plan area / cos slope), m².
    pub area_on_slope_m2: f64,
    /// The plane's sides in order, each with what it is on the roof.
    pub edges: Vec<PlanEdge>,
}

/// The name of plane `index` (0-based) in every output.
pub fn plane_name(index: usize) -> String {
    format!("P{}", index + 1)
}

/// Everything needed to draw the roof plan to scale.
#[derive(Debug, Clone, Default, Serialize)]
pub struct PlanView {
    /// The wall line, m.
    pub building_outline_m: Vec<[f64; 2]>,
    /// The roof edge including overhangs, m.
    pub roof_outline_m: Vec<[f64; 2]>,
    /// Ridge and hip lines, m.
    pub ridge_lines_m: Vec<[[f64; 2]; 2]>,
    pub zones: Vec<PlanZone>,
    pub rafter_lines: Vec<PlanLine>,
    /// Panel end joints drawn as short segments, m (may be empty).
    pub panel_joints_m: Vec<[[f64; 2]; 2]>,
    /// Course lines (long panel edges), m (may be empty).
    pub course_lines_m: Vec<[[f64; 2]; 2]>,
    /// The roof planes (may be empty).
    pub planes: Vec<PlanPlane>,
    /// Ridges, hips and valleys, each once, with their kinds (may be empty).
    pub roof_lines: Vec<PlanEdge>,
}

/// The nail the schedule calls for.
#[derive(Debug, Clone, Serialize)]
pub struct NailInfo {
    pub id: String,
    pub description: String,
    pub length_mm: f64,
    pub shank_diameter_mm: f64,
    pub head_diameter_mm: f64,
    /// `smooth`, `spiral`, `ring` or `screw`.
    pub shank: String,
    /// `carbon` or `stainless`.
    pub material: String,
    pub source: String,
}

/// How the per-nail resistance was derived.
#[derive(Debug, Clone, Serialize)]
pub struct ResistanceInfo {
    pub withdrawal_n: f64,
    pub pull_through_n: Option<f64>,
    /// True when the pull-through value is an advisory check outside the standard's resistance.
    pub pull_through_is_advisory: bool,
    pub governing_n: f64,
    /// `withdrawal` or `head-pull-through`.
    pub governing_mode: String,
    pub penetration_mm: f64,
    pub factors: Vec<FactorRow>,
}

/// Pressures on one zone at the effective area of the governing nail.
#[derive(Debug, Clone, Serialize)]
pub struct ZonePressureRow {
    pub label: ZoneKind,
    pub code_zone: String,
    /// Plan area of the zone, m².
    pub area_m2: f64,
    pub effective_area_m2: f64,
    pub cp_ext: f64,
    pub cp_int: f64,
    pub external_kpa: f64,
    pub internal_kpa: f64,
    pub dead_counteracting_kpa: f64,
    pub net_uplift_kpa: f64,
    pub source: String,
    /// Figure and slope band the coefficient comes from (or the user's table).
    pub figure: String,
    /// `checked`, `from memory`, `severe-of-two` or `user-supplied`.
    pub coefficient_status: String,
}

/// One line of the crew's schedule: a zone and a support role.
#[derive(Debug, Clone, Serialize)]
pub struct ZoneRow {
    pub label: ZoneKind,
    pub code_zone: String,
    pub support_role: SupportRole,
    pub nail_id: String,
    pub nail_description: String,
    /// None: no practical spacing works with this nail.
    pub spacing_mm: Option<f64>,
    pub net_uplift_kpa: f64,
    pub demand_n: f64,
    pub resistance_n: f64,
    /// `withdrawal` or `head-pull-through`.
    pub governing_mode: String,
    pub utilization: f64,
    pub nail_count: u64,
    /// What sets the spacing, in words: "strength", "prescriptive maximum", "splitting minimum".
    pub governing_check: String,
    /// Rafter line number where the spacing governs.
    pub governing_line: u32,
}

/// One stretch of a rafter line with one zone and one support role.
#[derive(Debug, Clone, Serialize)]
pub struct SegmentRow {
    /// Along the slope from the line's low end, m.
    pub from_m: f64,
    pub to_m: f64,
    pub zone_label: ZoneKind,
    pub support_role: SupportRole,
    pub spacing_mm: Option<f64>,
    pub utilization: f64,
}

/// A rafter (truss, joist) line and its segments.
#[derive(Debug, Clone, Serialize)]
pub struct LineRow {
    pub number: u32,
    /// The plane the line carries (`P1`, ...).
    pub plane: String,
    /// What the member is: common, end-wall, hip, jack, valley or blocking.
    pub kind: LineKind,
    /// Plan coordinate of the line (x or y, whichever is constant), m.
    pub position_m: f64,
    /// Length along the slope, m.
    pub length_m: f64,
    pub segments: Vec<SegmentRow>,
}

/// The whole schedule for one roof and one nail.
#[derive(Debug, Clone, Serialize)]
pub struct Schedule {
    pub project: ProjectInfo,
    pub basis: BasisInfo,
    pub plan: PlanView,
    /// Plan dimensions of the building (wall line), m: length along x, width along y.
    pub building_length_m: f64,
    pub building_width_m: f64,
    pub framing_spacing_mm: f64,
    /// e.g. "rafter", "truss", "joist".
    pub framing_member: String,
    /// e.g. "OSB 15.5 mm, 1220 x 2440 mm panels, half stagger".
    pub deck_description: String,
    /// Where and how panel laying starts (start corner, first-course offset, narrowest piece).
    pub panel_laying: String,
    /// Where laying starts on each plane, for the crew sheet (may be empty).
    pub laying_starts: Vec<LayingRow>,
    pub nail: NailInfo,
    pub resistance: ResistanceInfo,
    /// Velocity pressure and the wind factors used.
    pub wind_factors: Vec<FactorRow>,
    pub edge_width_m: f64,
    pub zone_pressures: Vec<ZonePressureRow>,
    pub zones: Vec<ZoneRow>,
    pub lines: Vec<LineRow>,
    pub total_nail_count: u64,
    pub total_nail_mass_kg: f64,
    /// The keys the user wrote, with the values as written.
    pub inputs: Vec<InputRow>,
    /// The values the tool used, derived from the inputs, in the report's units.
    pub derived: Vec<InputRow>,
    /// Where every table value came from, one line each.
    pub provenance: Vec<String>,
    /// Things the engineer must look at (values from memory, nails exiting members, ...).
    pub warnings: Vec<String>,
    /// True when every zone has a working spacing.
    pub feasible: bool,
    /// When infeasible: what would work instead (other nails, closer framing).
    pub alternatives: Vec<String>,
    /// Printed on every page and at the foot of every file.
    pub cautions: Vec<String>,
}

/// The cautions every schedule carries. Kept here so that every writer prints the same words.
pub fn standard_cautions() -> Vec<String> {
    cautions_for(true)
}

/// The cautions of a schedule; `built_in_coefficients`: some zone uses a built-in coefficient row, so
/// the 'from memory' caution stays (a user's table that gives every zone's curve drops it).
pub fn cautions_for(built_in_coefficients: bool) -> Vec<String> {
    let last = if built_in_coefficients {
        "Coefficients marked 'from memory' must be checked against the printed standard before use."
    } else {
        "Every wind coefficient is from the user's table: check that it is the edition and figure this roof needs."
    };
    vec![
        "For use by a qualified person: this schedule is a design aid, not a design.".to_string(),
        "Verify against the governing local building code and the nail manufacturer's specification."
            .to_string(),
        "The design must be reviewed, and sealed by a registered professional where the law requires."
            .to_string(),
        last.to_string(),
    ]
}
