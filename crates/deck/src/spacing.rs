//! Nail spacing along each rafter line, from the deck reactions and the per-nail resistance.
//!
//! For each stretch of a line with one zone and one support role, the row of nails must hold the
//! reaction of the panel strip on that line: per nail, `p(zone, A) × w × s ≤ R`, with `p` the net
//! factored uplift at the nail's effective wind area `A = s × w` (the area one nail holds), `w` the
//! reaction width of the strip (from the continuous-beam solution), `s` the spacing and `R` the
//! resistance of one nail. The widest practical increment that satisfies it, within the basis's
//! prescriptive maximum for the support role and not below its splitting minimum, is the answer.
//! The crew nails one spacing per zone and role: the closest one any stretch of that zone needs.

use serde::Serialize;
use std::collections::HashMap;

pub use crate::error::SpacingError;
use crate::error::{check_positive, check_range};
use crate::fast_hash::BuildFastHasher;
use crate::layout::{Axis, Bearing, DeckLayout, LineKind, SupportRole, ZonePiece};

/// Spacing limits a basis imposes on roof sheathing nails.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SpacingRules {
    /// Practical spacings, mm, in any order.
    pub increments_mm: Vec<f64>,
    /// Prescriptive maximum along panel edges (end joints and deck edges), mm.
    pub max_panel_edge_mm: f64,
    /// Prescriptive maximum along intermediate supports, mm.
    pub max_intermediate_mm: f64,
    /// Closest spacing the nail and member allow (splitting), mm.
    pub min_mm: f64,
    /// Floor on the effective wind area of one nail, m² (0: the nail's own tributary area).
    pub min_effective_area_m2: f64,
}

/// The increments allowed for one support role, widest first; never empty (by construction).
#[derive(Debug, Clone, PartialEq)]
struct Allowed {
    widest_first_mm: Vec<f64>,
}

impl Allowed {
    fn widest_mm(&self) -> f64 {
        self.widest_first_mm[0]
    }

    fn closest_mm(&self) -> f64 {
        self.widest_first_mm[self.widest_first_mm.len() - 1]
    }
}

impl SpacingRules {
    /// The increments allowed for one support role; an error when none lies between the limits.
    fn allowed_for(&self, role: SupportRole) -> Result<Allowed, SpacingError> {
        let max_mm = match role {
            SupportRole::PanelEdge => self.max_panel_edge_mm,
            SupportRole::Intermediate => self.max_intermediate_mm,
        };
        let mut allowed: Vec<f64> = self
            .increments_mm
            .iter()
            .copied()
            .filter(|s| {
                s.is_finite() && *s > 0.0 && *s <= max_mm + 1e-9 && *s >= self.min_mm - 1e-9
            })
            .collect();
        allowed.sort_by(|a, b| b.total_cmp(a));
        allowed.dedup();
        if allowed.is_empty() {
            return Err(SpacingError::NoIncrement {
                role: role.to_string(),
                min_mm: self.min_mm,
                max_mm,
            });
        }
        Ok(Allowed {
            widest_first_mm: allowed,
        })
    }

    fn validate(&self) -> Result<(), SpacingError> {
        for (index, s) in self.increments_mm.iter().enumerate() {
            check_positive(|| format!("rules.increments_mm[{index}]"), *s)?;
        }
        check_positive(
            || "rules.max_panel_edge_mm".to_string(),
            self.max_panel_edge_mm,
        )?;
        check_positive(
            || "rules.max_intermediate_mm".to_string(),
            self.max_intermediate_mm,
        )?;
        check_range(|| "rules.min_mm".to_string(), self.min_mm, 0.0, 10_000.0)?;
        check_range(
            || "rules.min_effective_area_m2".to_string(),
            self.min_effective_area_m2,
            0.0,
            100.0,
        )
    }
}

/// The nail being planned.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct NailOption {
    pub id: String,
    /// Factored (limit states) or allowable (ASD) resistance of one nail, N: the governing mode.
    pub resistance_n: f64,
    /// Mass of one nail, g (for the order quantity).
    pub mass_g: f64,
}

/// What sets a spacing.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum SpacingLimit {
    /// Uplift: the next wider increment would overload the nail.
    Strength,
    /// The basis's prescriptive maximum for the support role.
    PrescriptiveMaximum,
    /// Even the closest allowed increment overloads the nail.
    NoPracticalSpacing,
    /// A given pattern being checked, not sized.
    Given,
    /// A zone with more uplift is nailed no wider than a milder zone for the same support role: its
    /// own stretches would allow wider.
    ZoneOrder,
}

impl SpacingLimit {
    pub fn as_str(self) -> &'static str {
        match self {
            SpacingLimit::Strength => "strength",
            SpacingLimit::PrescriptiveMaximum => "prescriptive maximum",
            SpacingLimit::NoPracticalSpacing => "no practical spacing",
            SpacingLimit::Given => "as given",
            SpacingLimit::ZoneOrder => "zone order (no wider than a milder zone)",
        }
    }
}

/// One stretch of a rafter line in one zone and one course.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Segment {
    /// Along the slope from the line's low end, m.
    pub from_m: f64,
    pub to_m: f64,
    pub zone_index: usize,
    pub support_role: SupportRole,
    /// Rows of nails on the line here: 2 where two panel ends meet, else 1.
    pub rows: u32,
    /// Reaction width of the worst-loaded row, mm on the slope (negative: the deck bears down).
    pub reaction_width_mm: f64,
    /// The widest spacing this stretch alone allows (None: none works).
    pub required_spacing_mm: Option<f64>,
    /// The spacing the crew nails here: the zone and role's pattern (None: none works).
    pub spacing_mm: Option<f64>,
    /// Net factored uplift at the pattern's effective area, kPa.
    pub net_uplift_kpa: f64,
    pub effective_area_m2: f64,
    /// Load on one nail at the pattern spacing, N.
    pub demand_n: f64,
    pub resistance_n: f64,
    /// demand / resistance at the pattern spacing (at the closest increment when none works).
    pub utilization: f64,
    pub nail_count: u64,
}

/// A framing line with its segments.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct RafterLine {
    pub number: u32,
    pub plane_index: usize,
    /// What the member is (common, end-wall, jack, ...), from the layout.
    pub kind: LineKind,
    pub axis: Axis,
    pub position_m: f64,
    /// Length along the slope, m.
    pub length_m: f64,
    pub plan_start_m: [f64; 2],
    pub plan_end_m: [f64; 2],
    pub segments: Vec<Segment>,
}

/// The governing spacing of one zone and support role.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ZoneRoleResult {
    pub zone_index: usize,
    pub support_role: SupportRole,
    /// None: no practical spacing works with this nail in this zone.
    pub spacing_mm: Option<f64>,
    /// Line where the closest spacing (or the highest utilization) is needed.
    pub governing_line: u32,
    pub net_uplift_kpa: f64,
    pub demand_n: f64,
    pub resistance_n: f64,
    pub utilization: f64,
    pub nail_count: u64,
    pub limited_by: SpacingLimit,
}

/// The planned deck for one nail.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct DeckPlan {
    pub nail_id: String,
    pub lines: Vec<RafterLine>,
    pub zone_roles: Vec<ZoneRoleResult>,
    pub total_nail_count: u64,
    pub total_nail_mass_kg: f64,
}

impl DeckPlan {
    /// Every zone and role has a working spacing.
    pub fn feasible(&self) -> bool {
        self.zone_roles.iter().all(|role| role.spacing_mm.is_some())
    }

    /// The result for one zone and role, if the deck has that combination.
    pub fn zone_role(&self, zone_index: usize, role: SupportRole) -> Option<&ZoneRoleResult> {
        self.zone_roles
            .iter()
            .find(|result| result.zone_index == zone_index && result.support_role == role)
    }
}

/// The uplift function the caller gives: net factored uplift (kPa, positive away from the roof) of zone
/// `zone_index` at effective wind area `area_m2`.
pub type UpliftFn<'a> = dyn Fn(usize, f64) -> Result<f64, String> + 'a;

/// Per-nail check of one stretch at one spacing.
#[derive(Debug, Clone, Copy)]
struct NailLoad {
    net_uplift_kpa: f64,
    effective_area_m2: f64,
    demand_n: f64,
}

fn nail_load(
    uplift: &UpliftFn<'_>,
    rules: &SpacingRules,
    zone_index: usize,
    reaction_width_mm: f64,
    spacing_mm: f64,
) -> Result<NailLoad, SpacingError> {
    let effective_area_m2 = (spacing_mm * reaction_width_mm.abs() / 1e6)
        .max(rules.min_effective_area_m2)
        .max(1e-4);
    let net_uplift_kpa =
        uplift(zone_index, effective_area_m2).map_err(|message| SpacingError::Uplift {
            zone_index,
            effective_area_m2,
            message,
        })?;
    if !net_uplift_kpa.is_finite() {
        return Err(SpacingError::Uplift {
            zone_index,
            effective_area_m2,
            message: format!("uplift {net_uplift_kpa} is not a finite number"),
        });
    }
    // kPa × mm × mm = 1e-6 kN = 1e-3 N. Only a net uplift on a row that holds the deck loads the nail.
    let demand_n = (net_uplift_kpa * reaction_width_mm * spacing_mm / 1000.0).max(0.0);
    Ok(NailLoad {
        net_uplift_kpa,
        effective_area_m2,
        demand_n,
    })
}

/// One kind of sized stretch: a zone, a reaction width and a support role, with the widest allowed
/// increment that holds there (None: none does). A roof has hundreds of stretches but a few dozen
/// kinds, and all a plan works out for a stretch but its nail count depends on its kind alone.
#[derive(Debug, Clone, Copy)]
struct StretchKind {
    zone_index: usize,
    reaction_width_mm: f64,
    role: SupportRole,
    widest_mm: Option<f64>,
}

/// The kinds of stretch met so far for one nail (the role picks the increments; one nail, one
/// resistance), and the loads on blocking rows. The uplift function is pure, so each kind is worked
/// out once: the same numbers, without walking the increments again for every stretch.
struct LoadCache<'u> {
    uplift: &'u UpliftFn<'u>,
    rules: &'u SpacingRules,
    kinds: Vec<StretchKind>,
    /// Each kind's place in `kinds`, by zone, reaction width (its bits) and role.
    kind_at: HashMap<(usize, u64, SupportRole), usize, BuildFastHasher>,
    /// Loads on blocking rows (not sized, so no kind), by zone, reaction width and spacing.
    loads: HashMap<(usize, u64, u64), NailLoad, BuildFastHasher>,
}

impl<'u> LoadCache<'u> {
    fn new(uplift: &'u UpliftFn<'u>, rules: &'u SpacingRules) -> Self {
        Self {
            uplift,
            rules,
            kinds: Vec::new(),
            kind_at: HashMap::default(),
            loads: HashMap::default(),
        }
    }

    fn load(
        &mut self,
        zone_index: usize,
        reaction_width_mm: f64,
        spacing_mm: f64,
    ) -> Result<NailLoad, SpacingError> {
        let key = (
            zone_index,
            reaction_width_mm.to_bits(),
            spacing_mm.to_bits(),
        );
        if let Some(load) = self.loads.get(&key) {
            return Ok(*load);
        }
        let load = nail_load(
            self.uplift,
            self.rules,
            zone_index,
            reaction_width_mm,
            spacing_mm,
        )?;
        self.loads.insert(key, load);
        Ok(load)
    }

    /// The place in `kinds` of the stretch kind (`zone_index`, `reaction_width_mm`, `role`), worked out
    /// when first met: the widest increment of `allowed` (widest first) that holds. `allowed` and
    /// `resistance_n` must be the same for every call with one role.
    #[inline]
    fn kind(
        &mut self,
        role: SupportRole,
        allowed: &[f64],
        zone_index: usize,
        reaction_width_mm: f64,
        resistance_n: f64,
    ) -> Result<usize, SpacingError> {
        let key = (zone_index, reaction_width_mm.to_bits(), role);
        match self.kind_at.get(&key) {
            Some(at) => Ok(*at),
            None => self.new_kind(key, allowed, reaction_width_mm, resistance_n),
        }
    }

    /// [`LoadCache::kind`] for a kind met for the first time (out of line: the lookup above is
    /// what nearly every stretch takes, and inlined it saves a call per stretch).
    #[inline(never)]
    fn new_kind(
        &mut self,
        key: (usize, u64, SupportRole),
        allowed: &[f64],
        reaction_width_mm: f64,
        resistance_n: f64,
    ) -> Result<usize, SpacingError> {
        let (zone_index, _, role) = key;
        let mut widest_mm = None;
        for &spacing_mm in allowed {
            let load = nail_load(
                self.uplift,
                self.rules,
                zone_index,
                reaction_width_mm,
                spacing_mm,
            )?;
            if load.demand_n <= resistance_n * (1.0 + 1e-12) {
                widest_mm = Some(spacing_mm);
                break;
            }
        }
        let at = self.kinds.len();
        self.kinds.push(StretchKind {
            zone_index,
            reaction_width_mm,
            role,
            widest_mm,
        });
        self.kind_at.insert(key, at);
        Ok(at)
    }
}

/// Nails in one row over `length_m` at `spacing_mm`: one at each end of the stretch and at each spacing
/// between, counting the shared end once (so a stretch holds ceil(L/s) nails, at least 1).
fn nails_in_row(length_m: f64, spacing_mm: f64) -> u64 {
    let rows = length_m * 1000.0 / spacing_mm - 1e-9;
    // Below 2^52 (any stretch of a roof) the ceiling is the whole part, plus one if a fraction is
    // left: exact, and without the library call `ceil` is on baseline x86-64 (no rounding
    // instruction), made once per segment. Anything else (none, negative, huge, not a number) as
    // the ceiling always was.
    if rows > 0.0 && rows < 4.0e15 {
        let whole = rows as u64;
        return if (whole as f64) < rows {
            whole + 1
        } else {
            whole
        };
    }
    let count = rows.ceil();
    if count.is_finite() && count >= 1.0 {
        count as u64
    } else {
        1
    }
}

/// The spacing a checked pattern gives a zone and support role, mm; None when the pattern has no
/// spacing for that zone (an error, never a default).
pub type PatternFn<'a> = dyn Fn(usize, SupportRole) -> Option<f64> + 'a;

/// Sizes the nail spacing of every line, zone and support role of a laid-out deck for one nail.
/// The layout does not depend on the nail: build it once with [`crate::layout::layout_deck`] and plan every
/// candidate on it.
pub fn plan_on_layout(
    layout: &DeckLayout,
    uplift: &UpliftFn<'_>,
    nail: &NailOption,
    rules: &SpacingRules,
) -> Result<DeckPlan, SpacingError> {
    plan_or_check(layout, uplift, nail, rules, None)
}

/// Checks a given pattern on a laid-out deck: every segment at `pattern(zone, role)`, its utilization
/// reported (over 1.0 fails); `required_spacing_mm` still says what would be needed.
pub fn check_on_layout(
    layout: &DeckLayout,
    uplift: &UpliftFn<'_>,
    nail: &NailOption,
    rules: &SpacingRules,
    pattern: &PatternFn<'_>,
) -> Result<DeckPlan, SpacingError> {
    plan_or_check(layout, uplift, nail, rules, Some(pattern))
}

/// Whether the nail holds at some allowed spacing on every stretch a plan sizes: the plan's
/// [`DeckPlan::feasible`], without building the plan. It stops at the first stretch that no spacing
/// holds (a batch tries its candidate nails in order and plans only the first that holds, so for a
/// nail before it this answer is all it reads), and it meets the same errors as the plan's sizing
/// pass up to where it stops.
pub fn holds_on_layout(
    layout: &DeckLayout,
    uplift: &UpliftFn<'_>,
    nail: &NailOption,
    rules: &SpacingRules,
) -> Result<bool, SpacingError> {
    let increments = RoleIncrements::new(nail, rules)?;
    let mut cache = LoadCache::new(uplift, rules);
    holds_with(layout, nail, &increments, &mut cache, &mut Vec::new())
}

/// The plan of [`plan_on_layout`] when the nail holds everywhere ([`holds_on_layout`]), None when it
/// does not: the plan reuses what the check worked out (each stretch's kind, in order), so a nail
/// that holds is walked once for the check and once cheaply for its plan.
pub fn plan_if_it_holds(
    layout: &DeckLayout,
    uplift: &UpliftFn<'_>,
    nail: &NailOption,
    rules: &SpacingRules,
) -> Result<Option<DeckPlan>, SpacingError> {
    let increments = RoleIncrements::new(nail, rules)?;
    let mut cache = LoadCache::new(uplift, rules);
    let mut walked = Vec::new();
    if !holds_with(layout, nail, &increments, &mut cache, &mut walked)? {
        return Ok(None);
    }
    plan_with(layout, nail, &increments, &mut cache, &walked, None).map(Some)
}

/// [`holds_on_layout`] with the caller's increments and cache. The kind of each stretch walked is
/// pushed onto `walked`, in the order [`plan_with`] meets them: when the nail holds, every sized
/// stretch of the plan.
fn holds_with(
    layout: &DeckLayout,
    nail: &NailOption,
    increments: &RoleIncrements,
    cache: &mut LoadCache<'_>,
    walked: &mut Vec<usize>,
) -> Result<bool, SpacingError> {
    // Blocking is not sized (it takes its zone's panel-edge pattern): it cannot fail a plan.
    for line in layout.lines.iter().filter(|l| l.kind != LineKind::Blocking) {
        for bearing in &line.bearings {
            let reaction_width_mm = bearing_reaction_mm(line.number, bearing)?;
            for piece in &line.zones {
                if overlap_m(piece, bearing).is_none() {
                    continue;
                }
                let role = bearing.support_role;
                let at = cache.kind(
                    role,
                    &increments.for_role(role).widest_first_mm,
                    piece.zone_index,
                    reaction_width_mm,
                    nail.resistance_n,
                )?;
                walked.push(at);
                if cache.kinds[at].widest_mm.is_none() {
                    return Ok(false);
                }
            }
        }
    }
    Ok(true)
}

/// The increments each support role allows, found after checking the rules and the nail: what every
/// plan, check and [`holds_on_layout`] starts with.
struct RoleIncrements {
    panel_edge: Allowed,
    intermediate: Allowed,
}

impl RoleIncrements {
    fn new(nail: &NailOption, rules: &SpacingRules) -> Result<Self, SpacingError> {
        rules.validate()?;
        check_positive(|| "nail.resistance_n".to_string(), nail.resistance_n)?;
        check_range(|| "nail.mass_g".to_string(), nail.mass_g, 0.0, 1000.0)?;
        Ok(Self {
            panel_edge: rules.allowed_for(SupportRole::PanelEdge)?,
            intermediate: rules.allowed_for(SupportRole::Intermediate)?,
        })
    }

    fn for_role(&self, role: SupportRole) -> &Allowed {
        match role {
            SupportRole::PanelEdge => &self.panel_edge,
            SupportRole::Intermediate => &self.intermediate,
        }
    }
}

/// The width of deck a bearing's row of nails holds: the largest of its strips' reactions, mm.
fn bearing_reaction_mm(line_number: u32, bearing: &Bearing) -> Result<f64, SpacingError> {
    // A match, not `ok_or`: the error built and dropped for every bearing cost a call each.
    match bearing
        .strips
        .iter()
        .map(|strip| strip.reaction_width_mm)
        .reduce(f64::max)
    {
        Some(width_mm) => Ok(width_mm),
        None => Err(SpacingError::NoStrip {
            line: line_number,
            course: bearing.course_index,
        }),
    }
}

/// Where a zone piece and a bearing of one line overlap, m along the line; None under 1 mm.
fn overlap_m(piece: &ZonePiece, bearing: &Bearing) -> Option<(f64, f64)> {
    let from_m = piece.from_m.max(bearing.from_m);
    let to_m = piece.to_m.min(bearing.to_m);
    if to_m - from_m < 1e-3 {
        None
    } else {
        Some((from_m, to_m))
    }
}

fn plan_or_check(
    layout: &DeckLayout,
    uplift: &UpliftFn<'_>,
    nail: &NailOption,
    rules: &SpacingRules,
    given: Option<&PatternFn<'_>>,
) -> Result<DeckPlan, SpacingError> {
    let increments = RoleIncrements::new(nail, rules)?;
    let mut cache = LoadCache::new(uplift, rules);
    plan_with(layout, nail, &increments, &mut cache, &[], given)
}

/// [`plan_or_check`] with the caller's increments and cache (the cache is a pure memo: a filled one
/// gives the same plan as an empty one). `walked` holds the kinds [`holds_with`] found, in the order
/// pass 1 meets the sized stretches (empty when no check ran first): each one found there is not
/// looked up again.
fn plan_with(
    layout: &DeckLayout,
    nail: &NailOption,
    increments: &RoleIncrements,
    cache: &mut LoadCache<'_>,
    walked: &[usize],
    given: Option<&PatternFn<'_>>,
) -> Result<DeckPlan, SpacingError> {
    let allowed = |role: SupportRole| increments.for_role(role);

    // Pass 1: the segments and what each alone needs, with the kind of each sized one (None:
    // blocking), in the order of the segments.
    let mut walked = walked.iter().copied();
    let mut segment_kinds: Vec<Option<usize>> = Vec::new();
    let mut line_kinds: Vec<Option<usize>> = Vec::new();
    let mut lines = Vec::with_capacity(layout.lines.len());
    for line in &layout.lines {
        // The bearings and the zone pieces each run up the line without overlapping, so they make
        // at most one segment fewer than there are of both (more only grows the vector). Room for
        // one per bearing and piece, as once, was a block of kilobytes a line, past the allocator's
        // small sizes.
        let mut segments = Vec::with_capacity(line.bearings.len() + line.zones.len());
        line_kinds.clear();
        // Blocking: two rows (the panel edges on both sides of the course joint), not sized by the
        // strip model (reaction 0: it gives the blocking no share of the uplift); pass 3 gives it
        // the zone's panel-edge pattern.
        let is_blocking = line.kind == LineKind::Blocking;
        for bearing in &line.bearings {
            let rows = if is_blocking {
                2
            } else {
                bearing.strips.len().max(1) as u32
            };
            let reaction_width_mm = if is_blocking {
                0.0
            } else {
                bearing_reaction_mm(line.number, bearing)?
            };
            for piece in &line.zones {
                let Some((from_m, to_m)) = overlap_m(piece, bearing) else {
                    continue;
                };
                let role = bearing.support_role;
                let kind = if is_blocking {
                    None
                } else if let Some(at) = walked.next() {
                    Some(at)
                } else {
                    Some(cache.kind(
                        role,
                        &allowed(role).widest_first_mm,
                        piece.zone_index,
                        reaction_width_mm,
                        nail.resistance_n,
                    )?)
                };
                debug_assert!(kind.is_none_or(|at| {
                    let kind = &cache.kinds[at];
                    (kind.zone_index, kind.reaction_width_mm.to_bits(), kind.role)
                        == (piece.zone_index, reaction_width_mm.to_bits(), role)
                }));
                line_kinds.push(kind);
                segments.push(Segment {
                    from_m,
                    to_m,
                    zone_index: piece.zone_index,
                    support_role: role,
                    rows,
                    reaction_width_mm,
                    required_spacing_mm: kind.and_then(|at| cache.kinds[at].widest_mm),
                    spacing_mm: None,
                    net_uplift_kpa: 0.0,
                    effective_area_m2: 0.0,
                    demand_n: 0.0,
                    resistance_n: nail.resistance_n,
                    utilization: 0.0,
                    nail_count: 0,
                });
            }
        }
        // The bearings run up the line and the pieces are in order, so the segments nearly always
        // are too; only when not are they sorted, stably as ever, their kinds with them.
        if !segments.is_sorted_by(|a, b| a.from_m.total_cmp(&b.from_m).is_le()) {
            let mut order: Vec<usize> = (0..segments.len()).collect();
            order.sort_by(|&a, &b| segments[a].from_m.total_cmp(&segments[b].from_m));
            segments = order.iter().map(|&at| segments[at].clone()).collect();
            segment_kinds.extend(order.iter().map(|&at| line_kinds[at]));
        } else {
            segment_kinds.extend_from_slice(&line_kinds);
        }
        lines.push(RafterLine {
            number: line.number,
            plane_index: line.plane_index,
            kind: line.kind,
            axis: line.axis,
            position_m: line.position_m,
            length_m: line.length_m,
            plan_start_m: line.plan_start_m,
            plan_end_m: line.plan_end_m,
            segments,
        });
    }

    // Pass 2: one pattern per zone and role, the closest spacing any of its stretches needs.
    // Blocking is not sized (it takes its zone's panel-edge pattern): it sets no pattern.
    let mut used = vec![false; cache.kinds.len()];
    for at in segment_kinds.iter().flatten() {
        used[*at] = true;
    }
    let used_kinds = || {
        cache
            .kinds
            .iter()
            .zip(&used)
            .filter(|(_, used)| **used)
            .map(|(kind, _)| kind)
    };
    let mut keys: Vec<(usize, SupportRole)> = used_kinds()
        .map(|kind| (kind.zone_index, kind.role))
        .collect();
    keys.sort();
    keys.dedup();
    let mut patterns: Vec<((usize, SupportRole), Option<f64>)> = Vec::with_capacity(keys.len());
    for key in &keys {
        if let Some(given) = given {
            let spacing_mm = given(key.0, key.1).ok_or(SpacingError::NoPattern {
                zone_index: key.0,
                role: key.1.to_string(),
            })?;
            check_range(
                || format!("pattern spacing for zone {} ({})", key.0, key.1),
                spacing_mm,
                10.0,
                2000.0,
            )?;
            patterns.push((*key, Some(spacing_mm)));
            continue;
        }
        patterns.push((*key, Some(allowed(key.1).widest_mm())));
    }
    // Each kind's place in `keys` (and `patterns`), looked up once.
    let kind_key_at: Vec<Option<usize>> = cache
        .kinds
        .iter()
        .map(|kind| keys.binary_search(&(kind.zone_index, kind.role)).ok())
        .collect();
    // A segment's place in `keys`: its kind's; a blocking segment's, if its zone and role has one.
    let key_at = |segment: &Segment, kind: Option<usize>| match kind {
        Some(at) => kind_key_at[at],
        None => keys
            .binary_search(&(segment.zone_index, segment.support_role))
            .ok(),
    };
    if given.is_none() {
        // Each kind a segment has narrows its zone and role's pattern (the closest of the
        // segments' needs is the closest of their kinds').
        for (at, kind) in cache.kinds.iter().enumerate() {
            if !used[at] {
                continue;
            }
            if let Some(key) = kind_key_at[at] {
                let pattern = &mut patterns[key].1;
                *pattern = match (*pattern, kind.widest_mm) {
                    (Some(current), Some(required)) => Some(current.min(required)),
                    _ => None,
                };
            }
        }
    }
    // What each zone and role's own stretches need, before the zone order below.
    let own_patterns: Vec<Option<f64>> = patterns.iter().map(|(_, pattern)| *pattern).collect();
    if given.is_none() {
        keep_zone_order(&mut patterns, &layout.zone_rank, &layout.zone_family);
    }
    let pattern_for = |key: (usize, SupportRole)| -> Option<f64> {
        patterns
            .binary_search_by(|(k, _)| k.cmp(&key))
            .ok()
            .and_then(|at| patterns[at].1)
    };
    let pattern_at = |at: Option<usize>| at.and_then(|at| patterns[at].1);
    // Blocking in a zone with no panel edge on the framing takes the closest panel-edge pattern of the
    // roof (the severe reading); none when any panel-edge pattern has no working spacing.
    let closest_edge: Option<f64> = patterns
        .iter()
        .filter(|((_, role), _)| *role == SupportRole::PanelEdge)
        .map(|(_, p)| *p)
        .try_fold(f64::INFINITY, |closest, p| p.map(|p| closest.min(p)))
        .filter(|closest| closest.is_finite());
    let blocking_pattern = |zone_index: usize| -> Option<f64> {
        if let Some(given) = given {
            return given(zone_index, SupportRole::PanelEdge);
        }
        if patterns
            .iter()
            .any(|(k, _)| *k == (zone_index, SupportRole::PanelEdge))
        {
            pattern_for((zone_index, SupportRole::PanelEdge))
        } else {
            closest_edge
        }
    };

    // Pass 3: each segment at its pattern: load, utilization, nail count. A sized segment's load
    // depends on its kind alone (its zone, width and role, and so its pattern): worked out once a kind.
    let mut kind_loads: Vec<Option<NailLoad>> = vec![None; cache.kinds.len()];
    let mut total_nail_count = 0u64;
    let mut kind_of = segment_kinds.iter().copied();
    for line in &mut lines {
        let is_blocking = line.kind == LineKind::Blocking;
        for segment in &mut line.segments {
            let kind = kind_of.next().flatten();
            let pattern = if is_blocking {
                blocking_pattern(segment.zone_index)
            } else {
                pattern_at(key_at(segment, kind))
            };
            // No working spacing: report the load at the closest allowed increment.
            let checked_at_mm = pattern.unwrap_or(allowed(segment.support_role).closest_mm());
            let load = match kind {
                Some(at) => match kind_loads[at] {
                    Some(load) => load,
                    None => {
                        let load = nail_load(
                            cache.uplift,
                            cache.rules,
                            segment.zone_index,
                            segment.reaction_width_mm,
                            checked_at_mm,
                        )?;
                        kind_loads[at] = Some(load);
                        load
                    }
                },
                None => cache.load(segment.zone_index, segment.reaction_width_mm, checked_at_mm)?,
            };
            segment.spacing_mm = pattern;
            segment.net_uplift_kpa = load.net_uplift_kpa;
            segment.effective_area_m2 = load.effective_area_m2;
            segment.demand_n = load.demand_n;
            segment.utilization = load.demand_n / nail.resistance_n;
            segment.nail_count = u64::from(segment.rows)
                * nails_in_row(segment.to_m - segment.from_m, checked_at_mm);
            total_nail_count += segment.nail_count;
        }
    }

    // Per zone and role: the governing segment (highest utilization, then the lowest line number) and
    // the nail count, in one pass over the segments.
    struct Tally<'s> {
        governing: Option<(u32, &'s Segment)>,
        nail_count: u64,
    }
    let mut tallies: Vec<Tally<'_>> = keys
        .iter()
        .map(|_| Tally {
            governing: None,
            nail_count: 0,
        })
        .collect();
    let mut kind_of = segment_kinds.iter().copied();
    for line in &lines {
        for segment in &line.segments {
            let Some(at) = key_at(segment, kind_of.next().flatten()) else {
                continue;
            };
            let tally = &mut tallies[at];
            tally.nail_count += segment.nail_count;
            // `max_by` keeps the last of equals; with the line number reversed in the order, that is
            // the lowest-numbered line among the highest utilizations.
            let replace = match tally.governing {
                None => true,
                Some((number, held)) => held
                    .utilization
                    .total_cmp(&segment.utilization)
                    .then(line.number.cmp(&number))
                    .is_le(),
            };
            if replace {
                tally.governing = Some((line.number, segment));
            }
        }
    }
    let mut zone_roles = Vec::with_capacity(keys.len());
    for ((key, tally), own) in keys.iter().copied().zip(&tallies).zip(&own_patterns) {
        let pattern = pattern_for(key);
        let Some((governing_line, governing)) = tally.governing else {
            continue;
        };
        let widest = Some(allowed(key.1).widest_mm());
        let limited_by = match pattern {
            _ if given.is_some() => SpacingLimit::Given,
            None => SpacingLimit::NoPracticalSpacing,
            Some(_) if pattern != *own => SpacingLimit::ZoneOrder,
            Some(spacing) if Some(spacing) == widest => SpacingLimit::PrescriptiveMaximum,
            Some(_) => SpacingLimit::Strength,
        };
        zone_roles.push(ZoneRoleResult {
            zone_index: key.0,
            support_role: key.1,
            spacing_mm: pattern,
            governing_line,
            net_uplift_kpa: governing.net_uplift_kpa,
            demand_n: governing.demand_n,
            resistance_n: nail.resistance_n,
            utilization: governing.utilization,
            nail_count: tally.nail_count,
            limited_by,
        });
    }

    Ok(DeckPlan {
        nail_id: nail.id.clone(),
        lines,
        zone_roles,
        total_nail_count,
        total_nail_mass_kg: total_nail_count as f64 * nail.mass_g / 1000.0,
    })
}

/// Keeps the zones in order: for each support role and family, a zone with more uplift (a higher
/// `zone_rank`) is nailed no wider than any milder zone, and has no working spacing where a milder
/// one has none. The crew nails by zone, and a corner nailed wider than its edge (its own lines
/// happening to carry less than an edge line next to a short bay) reads as a mistake and is the
/// milder reading.
fn keep_zone_order(
    patterns: &mut [((usize, SupportRole), Option<f64>)],
    zone_rank: &[u32],
    zone_family: &[u32],
) {
    let rank = |zone_index: usize| zone_rank.get(zone_index).copied().unwrap_or(0);
    let family = |zone_index: usize| zone_family.get(zone_index).copied().unwrap_or(0);
    let mut order: Vec<usize> = (0..patterns.len()).collect();
    order.sort_by_key(|&at| {
        let ((zone_index, role), _) = patterns[at];
        (role, family(zone_index), rank(zone_index), zone_index)
    });
    let mut closest: Option<((SupportRole, u32), Option<f64>)> = None;
    for at in order {
        let ((zone_index, role), own) = patterns[at];
        let group = (role, family(zone_index));
        let milder = match closest {
            Some((closest_group, milder)) if closest_group == group => milder,
            _ => Some(f64::INFINITY),
        };
        let kept = match (milder, own) {
            (Some(milder), Some(own)) => Some(milder.min(own)),
            _ => None,
        };
        patterns[at].1 = kept;
        closest = Some((group, kept));
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::layout::{
        layout_deck, FramingInput, PanelInput, PlaneGeometry, Stagger, ZoneRegion,
    };
    use approx::assert_relative_eq;
    use proptest::prelude::*;

    fn rectangle(x0: f64, y0: f64, x1: f64, y1: f64) -> Vec<[f64; 2]> {
        vec![[x0, y0], [x1, y0], [x1, y1], [x0, y1]]
    }

    /// The walls along the edges of `corners`.
    fn walls_around(corners: Vec<[f64; 2]>) -> Vec<[[f64; 2]; 2]> {
        corners
            .iter()
            .zip(corners.iter().cycle().skip(1))
            .map(|(a, b)| [*a, *b])
            .collect()
    }

    /// One flat plane 9.76 m × 4.88 m (16 bays of 610 mm), a single zone.
    fn flat_deck() -> (
        Vec<PlaneGeometry>,
        Vec<ZoneRegion>,
        FramingInput,
        PanelInput,
    ) {
        let planes = vec![PlaneGeometry {
            polygon_m: rectangle(0.0, 0.0, 9.76, 4.88),
            slope_deg: 0.0,
            downslope_m: [0.0, 0.0],
        }];
        let zones = vec![ZoneRegion {
            zone_index: 0,
            polygons_m: vec![rectangle(0.0, 0.0, 9.76, 4.88)],
        }];
        let framing = FramingInput {
            spacing_mm: 610.0,
            lines_along: Some(Axis::Y),
            walls_m: walls_around(rectangle(0.0, 0.0, 9.76, 4.88)),
        };
        let panel = PanelInput {
            length_mm: 2440.0,
            width_mm: 1220.0,
            stagger: Stagger::None,
            min_piece_mm: 600.0,
            blocking: crate::layout::EdgeBlocking::None,
            start: crate::layout::StartCorner::SmallerCoordinate,
            first_course_width_mm: 1220.0,
            first_panel_length_mm: 2440.0,
        };
        (planes, zones, framing, panel)
    }

    /// A nail of the given resistance, 5 g.
    fn test_nail(resistance_n: f64) -> NailOption {
        NailOption {
            id: "test".to_string(),
            resistance_n,
            mass_g: 5.0,
        }
    }

    fn si_rules() -> SpacingRules {
        SpacingRules {
            increments_mm: vec![300.0, 250.0, 200.0, 150.0, 125.0, 100.0, 75.0, 50.0],
            max_panel_edge_mm: 150.0,
            max_intermediate_mm: 300.0,
            min_mm: 57.0,
            min_effective_area_m2: 0.0,
        }
    }

    /// The flat deck laid out once.
    fn flat_layout() -> DeckLayout {
        let (planes, zones, framing, panel) = flat_deck();
        layout_deck(&planes, &zones, &[0], &framing, &panel).expect("valid deck")
    }

    fn plan(pressure_kpa: f64, resistance_n: f64) -> DeckPlan {
        let uplift = move |_: usize, _: f64| -> Result<f64, String> { Ok(pressure_kpa) };
        let nail = test_nail(resistance_n);
        plan_on_layout(&flat_layout(), &uplift, &nail, &si_rules()).expect("valid deck")
    }

    #[test]
    fn a_worse_zone_is_never_nailed_wider_than_a_milder_one() {
        // The worse zone (rank 1, 10 % more uplift) holds only the line at 1.22 m, whose strip reaction
        // is 26/28 of the 610 mm span; the milder zone holds lines at 32/28 (Hicks, Civil Engineering
        // Formulas, Table 2.1: four equal spans). At 190 N the milder zone needs 250 mm
        // (1.0 kPa x 697 mm x 300 mm = 209 N), the worse zone alone 300 mm (1.1 x 566 x 300 = 187 N):
        // it is held to 250 mm, and says why.
        let (planes, _, framing, panel) = flat_deck();
        let zones = vec![
            ZoneRegion {
                zone_index: 0,
                polygons_m: vec![
                    rectangle(0.0, 0.0, 1.0, 4.88),
                    rectangle(1.4, 0.0, 9.76, 4.88),
                ],
            },
            ZoneRegion {
                zone_index: 1,
                polygons_m: vec![rectangle(1.0, 0.0, 1.4, 4.88)],
            },
        ];
        let layout = layout_deck(&planes, &zones, &[0, 1], &framing, &panel).expect("valid deck");
        let uplift = |zone_index: usize, _: f64| -> Result<f64, String> {
            Ok(if zone_index == 1 { 1.1 } else { 1.0 })
        };
        let plan = plan_on_layout(&layout, &uplift, &test_nail(190.0), &si_rules()).expect("plan");
        let milder = plan
            .zone_role(0, SupportRole::Intermediate)
            .expect("milder");
        let worse = plan.zone_role(1, SupportRole::Intermediate).expect("worse");
        assert_eq!(milder.spacing_mm, Some(250.0));
        assert_eq!(milder.limited_by, SpacingLimit::Strength);
        assert_eq!(worse.spacing_mm, Some(250.0));
        assert_eq!(worse.limited_by, SpacingLimit::ZoneOrder);
        // A checked pattern is checked as given, in any order.
        let given =
            |zone_index: usize, _: SupportRole| Some(if zone_index == 1 { 300.0 } else { 250.0 });
        let checked = check_on_layout(&layout, &uplift, &test_nail(190.0), &si_rules(), &given)
            .expect("check");
        assert_eq!(
            checked
                .zone_role(1, SupportRole::Intermediate)
                .expect("worse")
                .spacing_mm,
            Some(300.0)
        );
    }

    #[test]
    fn zone_order_takes_the_closest_milder_pattern_and_none_where_a_milder_has_none() {
        use SupportRole::{Intermediate as I, PanelEdge as E};
        let mut patterns = vec![
            ((0, E), Some(150.0)),
            ((0, I), Some(200.0)),
            ((1, E), Some(150.0)),
            ((1, I), Some(300.0)),
            ((2, I), Some(250.0)),
            ((3, I), None),
            ((4, I), Some(100.0)),
        ];
        // Ranks: zone 2 mildest, then 0, 1, 3, 4; one family.
        keep_zone_order(&mut patterns, &[1, 2, 0, 3, 4], &[0; 5]);
        assert_eq!(
            patterns.iter().map(|(_, p)| *p).collect::<Vec<_>>(),
            vec![
                Some(150.0),
                Some(200.0),
                Some(150.0),
                Some(200.0),
                Some(250.0),
                None,
                None
            ]
        );
    }

    #[test]
    fn nails_in_a_row_are_the_ceiling_of_length_over_spacing() {
        // The whole-part shortcut against the library's ceiling, at and around whole numbers of
        // spacings, tiny, huge and odd lengths.
        let by_ceil = |length_m: f64, spacing_mm: f64| {
            let count = (length_m * 1000.0 / spacing_mm - 1e-9).ceil();
            if count.is_finite() && count >= 1.0 {
                count as u64
            } else {
                1
            }
        };
        let mut lengths_m = vec![
            0.0,
            -1.0,
            1e-12,
            1e-6,
            0.15,
            0.3,
            4.88,
            1e12,
            1e20,
            f64::NAN,
        ];
        lengths_m.extend((0..3000).map(|i| f64::from(i) * 0.0125));
        lengths_m.extend((1..3000).map(|i| f64::from(i) * 0.15 + 1e-12));
        lengths_m.push(f64::INFINITY);
        for length_m in lengths_m {
            for spacing_mm in [50.0, 75.0, 100.0, 125.0, 150.0, 152.4, 300.0, 304.8] {
                assert_eq!(
                    nails_in_row(length_m, spacing_mm),
                    by_ceil(length_m, spacing_mm),
                    "{length_m} m at {spacing_mm} mm"
                );
            }
        }
    }

    #[test]
    fn demand_is_pressure_times_reaction_width_times_spacing() {
        // Hand check: first interior support of a 4-span strip carries 32/28 of the 610 mm span
        // (Hicks, Civil Engineering Formulas, Table 2.1, checked). At 2 kPa and 300 mm:
        // 2 kPa × 0.6971 m × 0.300 m = 0.4183 kN = 418.3 N per nail.
        let plan = plan(2.0, 1000.0);
        let segment = plan.lines[1].segments.first().expect("a segment");
        assert_eq!(segment.support_role, SupportRole::Intermediate);
        assert_relative_eq!(
            segment.reaction_width_mm,
            610.0 * 32.0 / 28.0,
            max_relative = 1e-6
        );
        assert_eq!(segment.spacing_mm, Some(300.0));
        assert_relative_eq!(
            segment.demand_n,
            2.0 * 0.61 * 32.0 / 28.0 * 0.3 * 1000.0,
            max_relative = 1e-6
        );
    }

    #[test]
    fn blocking_takes_the_panel_edge_pattern_and_sets_none() {
        // The flat deck, 4.88 m of joists = four 1.22 m courses: three course joints blocked, each
        // 9.76 m long. At 3 kPa and R = 400 N the panel-edge pattern is 150 mm (prescriptive
        // maximum); two rows of ceil(9760 / 150) = 66 nails on each blocking line.
        let (planes, zones, framing, mut panel) = flat_deck();
        panel.blocking = crate::layout::EdgeBlocking::CourseJoints;
        let layout = layout_deck(&planes, &zones, &[0], &framing, &panel).expect("valid");
        let uplift = |_: usize, _: f64| -> Result<f64, String> { Ok(3.0) };
        let blocked =
            plan_on_layout(&layout, &uplift, &test_nail(400.0), &si_rules()).expect("valid deck");
        let unblocked = plan(3.0, 400.0);
        let blocking: Vec<_> = blocked
            .lines
            .iter()
            .filter(|l| l.kind == LineKind::Blocking)
            .collect();
        assert_eq!(blocking.len(), 3);
        for line in &blocking {
            assert_eq!(line.segments.len(), 1);
            let segment = &line.segments[0];
            assert_eq!(segment.spacing_mm, Some(150.0));
            assert_eq!(segment.rows, 2);
            assert_eq!(segment.nail_count, 2 * 66);
            assert_eq!(segment.utilization, 0.0);
        }
        // The framing's patterns and nails are those of the unblocked deck; the blocking adds its own.
        assert_eq!(blocked.zone_roles.len(), unblocked.zone_roles.len());
        for (a, b) in blocked.zone_roles.iter().zip(&unblocked.zone_roles) {
            assert_eq!(a.spacing_mm, b.spacing_mm);
            assert_eq!(a.governing_line, b.governing_line);
        }
        assert_eq!(
            blocked.total_nail_count,
            unblocked.total_nail_count + 3 * 2 * 66
        );
    }

    #[test]
    fn the_widest_increment_that_holds_is_chosen() {
        // Intermediate, w = 697.1 mm, 3 kPa: 2.091 N/mm; R = 400 N -> s ≤ 191 mm -> 150 mm.
        let plan = plan(3.0, 400.0);
        let intermediate = plan
            .zone_role(0, SupportRole::Intermediate)
            .expect("intermediate");
        assert_eq!(intermediate.spacing_mm, Some(150.0));
        assert_eq!(intermediate.limited_by, SpacingLimit::Strength);
        assert!(intermediate.utilization <= 1.0 && intermediate.utilization > 0.5);
        let edge = plan.zone_role(0, SupportRole::PanelEdge).expect("edge");
        assert_eq!(edge.spacing_mm, Some(150.0));
        assert_eq!(edge.limited_by, SpacingLimit::PrescriptiveMaximum);
    }

    #[test]
    fn no_practical_spacing_is_reported_not_guessed() {
        let plan = plan(20.0, 100.0);
        assert!(!plan.feasible());
        let role = plan
            .zone_role(0, SupportRole::Intermediate)
            .expect("intermediate");
        assert_eq!(role.spacing_mm, None);
        assert_eq!(role.limited_by, SpacingLimit::NoPracticalSpacing);
        assert!(role.utilization > 1.0);
    }

    #[test]
    fn nail_count_and_mass_add_up() {
        let plan = plan(0.5, 2000.0);
        let sum: u64 = plan.zone_roles.iter().map(|r| r.nail_count).sum();
        assert_eq!(sum, plan.total_nail_count);
        assert_relative_eq!(
            plan.total_nail_mass_kg,
            plan.total_nail_count as f64 * 0.005,
            max_relative = 1e-12
        );
        // 17 lines × 4.88 m: 15 intermediate-only lines at 300 mm (17 nails each); 2 end lines at 150 mm
        // (33 each); the lines at panel ends (every 4th) carry two rows at 150 mm.
        assert!(plan.total_nail_count > 17 * 16);
    }

    #[test]
    fn no_increment_between_minimum_and_maximum_is_an_error() {
        let uplift = |_: usize, _: f64| -> Result<f64, String> { Ok(1.0) };
        let nail = test_nail(500.0);
        let rules = SpacingRules {
            min_mm: 200.0,
            ..si_rules()
        };
        let error = plan_on_layout(&flat_layout(), &uplift, &nail, &rules).expect_err("none");
        assert!(
            error.to_string().starts_with("rules.increments_mm"),
            "{error}"
        );
    }

    #[test]
    fn an_uplift_error_names_the_zone() {
        let uplift = |_: usize, _: f64| -> Result<f64, String> { Err("no curve".to_string()) };
        let nail = test_nail(500.0);
        let error =
            plan_on_layout(&flat_layout(), &uplift, &nail, &si_rules()).expect_err("uplift");
        assert!(
            error.to_string().starts_with("uplift for zone 0"),
            "{error}"
        );
    }

    #[test]
    fn a_checked_pattern_reports_its_utilization() {
        let uplift = |_: usize, _: f64| -> Result<f64, String> { Ok(3.0) };
        let nail = test_nail(400.0);
        let pattern = |_: usize, role: SupportRole| {
            Some(match role {
                SupportRole::PanelEdge => 150.0,
                SupportRole::Intermediate => 300.0,
            })
        };
        let checked =
            check_on_layout(&flat_layout(), &uplift, &nail, &si_rules(), &pattern).expect("valid");
        let intermediate = checked
            .zone_role(0, SupportRole::Intermediate)
            .expect("intermediate");
        // 3 kPa × 0.6971 m × 0.300 m = 627 N on a 400 N nail: 1.57 (hand check, as above).
        assert_relative_eq!(
            intermediate.utilization,
            3.0 * 0.61 * 32.0 / 28.0 * 0.3 * 1000.0 / 400.0,
            max_relative = 1e-6
        );
        assert_eq!(intermediate.limited_by, SpacingLimit::Given);
        assert_eq!(intermediate.spacing_mm, Some(300.0));
        assert_eq!(
            checked.lines[1].segments[0].required_spacing_mm,
            Some(150.0)
        );
    }

    /// A hip side 12 m along the eave, hips up to a 6 m ridge 3 m up, staggered panels and blocked
    /// course joints, three zones (the hip corners, an eave strip, the rest): lines cut by the hips,
    /// pieces in two zones, bearings of both roles, strips of many widths.
    fn hip_side_layout() -> DeckLayout {
        let planes = vec![PlaneGeometry {
            polygon_m: vec![[0.0, 0.0], [12.0, 0.0], [9.0, 3.0], [3.0, 3.0]],
            slope_deg: 30.0,
            downslope_m: [0.0, -1.0],
        }];
        let zones = vec![
            ZoneRegion {
                zone_index: 0,
                polygons_m: vec![rectangle(2.0, 1.0, 10.0, 3.0)],
            },
            ZoneRegion {
                zone_index: 1,
                polygons_m: vec![rectangle(2.0, 0.0, 10.0, 1.0)],
            },
            ZoneRegion {
                zone_index: 2,
                polygons_m: vec![
                    rectangle(0.0, 0.0, 2.0, 3.0),
                    rectangle(10.0, 0.0, 12.0, 3.0),
                ],
            },
        ];
        let (_, _, mut framing, mut panel) = flat_deck();
        framing.walls_m = walls_around(rectangle(0.0, 0.0, 12.0, 3.0));
        panel.stagger = Stagger::Half;
        panel.blocking = crate::layout::EdgeBlocking::CourseJoints;
        layout_deck(&planes, &zones, &[0, 1, 2], &framing, &panel).expect("valid hip side")
    }

    /// An uplift that differs by zone and falls with the area, as the standards' curves do.
    fn zoned_uplift(zone_index: usize, area_m2: f64) -> Result<f64, String> {
        Ok(1.2 + 0.9 * zone_index as f64 + 0.4 / (area_m2 + 0.2))
    }

    #[test]
    fn each_stretch_gets_what_working_it_out_alone_gives() {
        // The plan works out each kind of stretch (zone, reaction width, role) once and hands the
        // answer to every stretch of that kind; here every stretch is worked out on its own again.
        let layout = hip_side_layout();
        let rules = si_rules();
        let mut feasible = Vec::new();
        for resistance_n in [150.0, 400.0, 900.0] {
            let nail = test_nail(resistance_n);
            let plan = plan_on_layout(&layout, &zoned_uplift, &nail, &rules).expect("valid");
            let increments = RoleIncrements::new(&nail, &rules).expect("valid");
            let mut kinds = std::collections::HashSet::new();
            let mut roles = std::collections::HashSet::new();
            for line in plan.lines.iter().filter(|l| l.kind != LineKind::Blocking) {
                for segment in &line.segments {
                    kinds.insert((
                        segment.zone_index,
                        segment.reaction_width_mm.to_bits(),
                        segment.support_role,
                    ));
                    roles.insert(segment.support_role);
                    let allowed = &increments.for_role(segment.support_role).widest_first_mm;
                    let alone = |spacing_mm: f64| {
                        nail_load(
                            &zoned_uplift,
                            &rules,
                            segment.zone_index,
                            segment.reaction_width_mm,
                            spacing_mm,
                        )
                        .expect("valid")
                    };
                    let required = allowed
                        .iter()
                        .copied()
                        .find(|s| alone(*s).demand_n <= resistance_n * (1.0 + 1e-12));
                    assert_eq!(segment.required_spacing_mm, required);
                    let pattern = plan
                        .zone_role(segment.zone_index, segment.support_role)
                        .expect("a pattern")
                        .spacing_mm;
                    assert_eq!(segment.spacing_mm, pattern);
                    let checked_at_mm = pattern.unwrap_or(allowed[allowed.len() - 1]);
                    let load = alone(checked_at_mm);
                    assert_eq!(segment.demand_n.to_bits(), load.demand_n.to_bits());
                    assert_eq!(
                        segment.net_uplift_kpa.to_bits(),
                        load.net_uplift_kpa.to_bits()
                    );
                    assert_eq!(
                        segment.effective_area_m2.to_bits(),
                        load.effective_area_m2.to_bits()
                    );
                }
            }
            // The layout is what the test says it is: many kinds of stretch, both roles, and
            // blocking lines (sized by no kind).
            assert!(kinds.len() > 10, "{} kinds", kinds.len());
            assert_eq!(roles.len(), 2);
            assert!(plan.lines.iter().any(|l| l.kind == LineKind::Blocking));
            // The plan after the check (kinds handed over in order) is the plan without it.
            let after_check =
                plan_if_it_holds(&layout, &zoned_uplift, &nail, &rules).expect("valid");
            assert_eq!(after_check.is_some(), plan.feasible(), "{resistance_n} N");
            if let Some(after_check) = after_check {
                assert_eq!(after_check, plan);
            }
            feasible.push(plan.feasible());
        }
        // Both answers met: a nail that holds and one that does not somewhere.
        assert_eq!(feasible, [false, true, true]);
    }

    proptest! {
        #![proptest_config(ProptestConfig::with_cases(24))]
        // More wind never allows a wider spacing (the method's monotonicity; no outside source needed).
        #[test]
        fn more_uplift_never_widens_any_spacing(p in 0.2f64..6.0, extra in 0.0f64..4.0, r in 150.0f64..1500.0) {
            let low = plan(p, r);
            let high = plan(p + extra, r);
            for role in &low.zone_roles {
                let other = high.zone_role(role.zone_index, role.support_role).expect("same roles");
                // None (no spacing works) is the closest of all.
                match (role.spacing_mm, other.spacing_mm) {
                    (Some(low_s), Some(high_s)) => prop_assert!(high_s <= low_s),
                    (None, high_s) => prop_assert!(high_s.is_none()),
                    (Some(_), None) => {}
                }
            }
        }
    }
}
