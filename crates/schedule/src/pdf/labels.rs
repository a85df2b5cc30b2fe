//! Labels on the plan: boxed blocks of text near their anchors (a zone's spacings, a plane's name, the
//! table of roof lines), moved off each other and off everything already set, and tied back to a zone
//! with a leader when a zone label had to move. No label is ever set over another: one that finds no
//! free place is left off (its content is in the tables beside the plan).

use super::canvas::{Align, Area, Canvas, Stroke};
use super::geometry::{bounds, contains};
use super::text::{line_height_mm, width_mm, Font};

/// Type size of zone labels, pt.
const LABEL_PT: f64 = 7.5;
/// Type size of plane names and the roof-line table, pt.
const SMALL_PT: f64 = 6.5;
/// Clear gap kept between labels and other obstacles, mm.
const GAP_MM: f64 = 0.8;
/// Leaders longer than this cost more the longer they are, mm.
const LONG_LEADER_MM: f64 = 15.0;
/// Step of the search over the whole drawing when no place near the anchors is free, mm.
const SCAN_STEP_MM: f64 = 2.0;

/// What a label is, which sets its type, frame and whether it may have a leader.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum LabelStyle {
    /// A zone's spacings, centred; a heavy frame when the zone has no working spacing.
    Zone { emphasis: bool },
    /// A plane's name, small and bold, kept inside its plane where it fits (never a leader).
    Plane,
    /// A small table, left-aligned, kept off the roof where there is room.
    Table,
    /// A mark beside a roof edge ("HIGH EAVE"), small and bold, off the roof, with no leader and only
    /// near its anchors: far from its edge it would mark the wrong one, so it is left off instead.
    Eave,
}

impl LabelStyle {
    fn size_pt(self) -> f64 {
        match self {
            LabelStyle::Zone { .. } => LABEL_PT,
            LabelStyle::Plane | LabelStyle::Table | LabelStyle::Eave => SMALL_PT,
        }
    }
}

/// One label to place: its lines (the first set bold), the region it belongs to (an index into the
/// regions given to [`place_labels`]; None: it belongs to no region and prefers to sit off all of them)
/// and the points it may point at, best first.
#[derive(Debug, Clone)]
pub(crate) struct PlanLabel {
    pub lines: Vec<String>,
    pub region: Option<usize>,
    pub style: LabelStyle,
    pub anchors: Vec<[f64; 2]>,
}

/// The width and height of a label's box, mm.
pub(crate) fn box_size(lines: &[String], style: LabelStyle) -> (f64, f64) {
    let size = style.size_pt();
    let width = lines
        .iter()
        .enumerate()
        .map(|(i, line)| width_mm(line, if i == 0 { Font::Bold } else { Font::Regular }, size))
        .fold(0.0, f64::max);
    let pad = if matches!(style, LabelStyle::Plane | LabelStyle::Eave) {
        1.2
    } else {
        2.4
    };
    (
        width + pad,
        lines.len() as f64 * line_height_mm(size) + pad * 0.6,
    )
}

/// Offsets tried around an anchor, nearest first, in multiples of the box size.
fn offsets() -> Vec<[f64; 2]> {
    let mut offsets = vec![[0.0, 0.0]];
    for k in 1..=10 {
        let k = f64::from(k) * 0.5;
        for [dx, dy] in [
            [0.0, 1.0],
            [0.0, -1.0],
            [1.0, 0.0],
            [-1.0, 0.0],
            [1.0, 1.0],
            [-1.0, 1.0],
            [1.0, -1.0],
            [-1.0, -1.0],
        ] {
            offsets.push([dx * k, dy * k]);
        }
    }
    offsets
}

fn centered(center: [f64; 2], w: f64, h: f64) -> Area {
    Area {
        x: center[0] - w / 2.0,
        y: center[1] - h / 2.0,
        w,
        h,
    }
}

/// Zone polygons on the page with their bounding boxes, for quick "which zone is here" questions.
/// A zone's index, one of its polygons and that polygon's bounding box.
type ZonePolygon<'a> = (usize, &'a [[f64; 2]], [f64; 4]);

struct ZoneMap<'a> {
    polygons: Vec<ZonePolygon<'a>>,
}

impl<'a> ZoneMap<'a> {
    fn new(zones: &'a [Vec<Vec<[f64; 2]>>]) -> ZoneMap<'a> {
        let polygons = zones
            .iter()
            .enumerate()
            .flat_map(|(zone, polygons)| polygons.iter().map(move |p| (zone, p.as_slice())))
            .filter_map(|(zone, p)| bounds(p.iter()).map(|b| (zone, p, b)))
            .collect();
        ZoneMap { polygons }
    }

    /// Share of the box that covers regions other than `own` (outside every region counts as free;
    /// with no `own`, every region is foreign).
    fn foreign_share(&self, area: &Area, own: Option<usize>) -> f64 {
        self.share(area, own, |on_any, on_own| on_any && !on_own)
    }

    /// Share of the box outside region `own`.
    fn outside_share(&self, area: &Area, own: Option<usize>) -> f64 {
        self.share(area, own, |_, on_own| !on_own)
    }

    /// Share of sample points over the box for which `bad(on any region, on region own)` says yes.
    fn share(&self, area: &Area, own: Option<usize>, bad: impl Fn(bool, bool) -> bool) -> f64 {
        const NX: usize = 5;
        const NY: usize = 3;
        let mut count = 0;
        for i in 0..NX {
            for j in 0..NY {
                let p = [
                    area.x + area.w * (i as f64 + 0.5) / NX as f64,
                    area.y + area.h * (j as f64 + 0.5) / NY as f64,
                ];
                let (mut on_any, mut on_own) = (false, false);
                for (zone, _, _) in self.polygons.iter().filter(|(_, polygon, b)| {
                    p[0] >= b[0]
                        && p[0] <= b[2]
                        && p[1] >= b[1]
                        && p[1] <= b[3]
                        && contains(polygon, p)
                }) {
                    on_any = true;
                    on_own |= Some(*zone) == own;
                }
                if bad(on_any, on_own) {
                    count += 1;
                }
            }
        }
        count as f64 / (NX * NY) as f64
    }
}

/// What is already set on the drawing: boxes no label may overlap, and zone leaders no label may sit on.
#[derive(Debug, Default)]
pub(crate) struct Taken {
    pub boxes: Vec<Area>,
    pub leaders: Vec<[[f64; 2]; 2]>,
}

/// The leader from `anchor` to the nearest point of `area`, or None when the anchor is inside.
fn leader(area: &Area, anchor: [f64; 2]) -> Option<[[f64; 2]; 2]> {
    (!area.contains_point(anchor)).then(|| {
        [
            anchor,
            [
                anchor[0].clamp(area.x, area.right()),
                anchor[1].clamp(area.y, area.top()),
            ],
        ]
    })
}

/// Whether the segment passes through `area` (sampled; leaders are short).
fn crosses(segment: [[f64; 2]; 2], area: &Area) -> bool {
    (1..12).any(|i| {
        let t = f64::from(i) / 12.0;
        let p = [
            segment[0][0] + (segment[1][0] - segment[0][0]) * t,
            segment[0][1] + (segment[1][1] - segment[0][1]) * t,
        ];
        p[0] > area.x && p[0] < area.right() && p[1] > area.y && p[1] < area.top()
    })
}

/// The parts of a place's badness that need no zone sampling: its leader and its distance.
#[derive(Debug, Clone, Copy)]
struct PlaceCost {
    leader: Option<[[f64; 2]; 2]>,
    /// Whether the leader crosses a label already set; false until [`PlaceCost::with_crossing`].
    crossing: bool,
    leader_mm: f64,
    distance_mm: f64,
}

impl PlaceCost {
    /// The cost of `area` for `label` at `anchor`, its leader not yet checked against other labels.
    fn of(area: &Area, anchor: [f64; 2], label: &PlanLabel) -> PlaceCost {
        let leader = match label.style {
            LabelStyle::Zone { .. } => leader(area, anchor),
            LabelStyle::Plane | LabelStyle::Table | LabelStyle::Eave => None,
        };
        let center = [area.x + area.w / 2.0, area.y + area.h / 2.0];
        PlaceCost {
            leader,
            crossing: false,
            // A long leader is hard to follow across the drawing.
            leader_mm: leader.map_or(0.0, |[a, b]| (b[0] - a[0]).hypot(b[1] - a[1])),
            distance_mm: ((center[0] - anchor[0]).powi(2) + (center[1] - anchor[1]).powi(2)).sqrt(),
        }
    }

    fn with_crossing(mut self, taken: &Taken) -> PlaceCost {
        self.crossing = self
            .leader
            .is_some_and(|segment| taken.boxes.iter().any(|other| crosses(segment, other)));
        self
    }

    /// The badness with no region covered (and, before [`PlaceCost::with_crossing`], no crossing):
    /// no place with this cost scores lower, since each term only adds.
    fn least_badness(&self) -> f64 {
        badness(0.0, self)
    }

    /// Whether no place with this cost can beat `best` (the margin keeps rounding from deciding).
    fn cannot_beat(&self, best: Option<f64>) -> bool {
        best.is_some_and(|best| self.least_badness() > best - 1e-9 + 1e-12)
    }
}

/// How poor a place is: covering other regions (`misplaced`, the share of the box; for a plane's name:
/// anything outside its plane) costs most, then leaders crossing labels, then needing a leader at all,
/// then distance.
fn badness(misplaced: f64, cost: &PlaceCost) -> f64 {
    misplaced * 4.0
        + if cost.crossing { 2.0 } else { 0.0 }
        + if cost.leader.is_some() { 1.0 } else { 0.0 }
        + (cost.leader_mm - LONG_LEADER_MM).max(0.0) / LONG_LEADER_MM
        + cost.distance_mm / 40.0
}

/// Share of `area` that a label may not cover: outside its plane for a plane's name, over other
/// regions for the rest (a zone label may sit off the roof).
fn misplaced_share(area: &Area, label: &PlanLabel, zones: &ZoneMap) -> f64 {
    match label.style {
        LabelStyle::Plane => zones.outside_share(area, label.region),
        LabelStyle::Zone { .. } | LabelStyle::Table | LabelStyle::Eave => {
            zones.foreign_share(area, label.region)
        }
    }
}

/// Places and draws `labels` inside `bounds`, clear of everything `taken` (each placed label and its
/// leader are added to it), preferring places over the label's own region, or off the roof, to places
/// over other regions. Returns how many labels found no free place and were left off.
pub(crate) fn place_labels(
    canvas: &mut Canvas,
    labels: &[PlanLabel],
    regions: &[Vec<Vec<[f64; 2]>>],
    bounds: Area,
    taken: &mut Taken,
) -> usize {
    let zone_map = ZoneMap::new(regions);
    let offsets = offsets();
    let mut left_off = 0;
    for label in labels {
        if label.anchors.is_empty() {
            continue;
        }
        let (w, h) = box_size(&label.lines, label.style);
        let search = Search {
            label,
            size: (w, h),
            bounds,
            taken,
            zones: &zone_map,
        };
        let near = label.anchors.iter().flat_map(|anchor| {
            offsets.iter().map(move |offset| {
                (
                    *anchor,
                    [anchor[0] + offset[0] * w, anchor[1] + offset[1] * h],
                )
            })
        });
        let near_only = label.style == LabelStyle::Eave;
        let best = search.best(near).or_else(|| {
            if near_only {
                return None;
            }
            // Nothing free near the anchors: every place on the drawing, on a grid.
            let columns = ((bounds.w - w) / SCAN_STEP_MM).max(0.0) as usize;
            let rows = ((bounds.h - h) / SCAN_STEP_MM).max(0.0) as usize;
            let anchor = label.anchors[0];
            search.best((0..=rows).flat_map(|row| {
                (0..=columns).map(move |column| {
                    (
                        anchor,
                        [
                            bounds.x + w / 2.0 + column as f64 * SCAN_STEP_MM,
                            bounds.y + h / 2.0 + row as f64 * SCAN_STEP_MM,
                        ],
                    )
                })
            }))
        });
        let Some((anchor, area)) = best else {
            left_off += 1;
            continue;
        };
        draw_label(canvas, label, area, anchor);
        if matches!(label.style, LabelStyle::Zone { .. }) {
            taken.leaders.extend(leader(&area, anchor));
        }
        taken.boxes.push(area);
    }
    left_off
}

/// One label's search for the best free place.
struct Search<'a> {
    label: &'a PlanLabel,
    size: (f64, f64),
    bounds: Area,
    taken: &'a Taken,
    zones: &'a ZoneMap<'a>,
}

impl Search<'_> {
    /// The least bad free place among `candidates` (anchor, box centre): its anchor and box. A place
    /// is free when it is inside the bounds, clear of every box and on no leader.
    fn best(
        &self,
        candidates: impl Iterator<Item = ([f64; 2], [f64; 2])>,
    ) -> Option<([f64; 2], Area)> {
        let (w, h) = self.size;
        let mut best: Option<(f64, [f64; 2], Area)> = None;
        for (anchor, center) in candidates {
            let area = centered(center, w, h);
            if !self.bounds.contains_area(&area) {
                continue;
            }
            // Checking a place against every label set and sampling the zones under it is most of the
            // work: skip both where even a free place over nothing it may not cover would not win.
            let best_score = best.as_ref().map(|(score, _, _)| *score);
            let cost = PlaceCost::of(&area, anchor, self.label);
            if cost.cannot_beat(best_score)
                || self
                    .taken
                    .boxes
                    .iter()
                    .any(|other| area.overlaps(other, GAP_MM))
                || self
                    .taken
                    .leaders
                    .iter()
                    .any(|segment| crosses(*segment, &area))
            {
                continue;
            }
            let cost = cost.with_crossing(self.taken);
            if cost.cannot_beat(best_score) {
                continue;
            }
            let score = badness(misplaced_share(&area, self.label, self.zones), &cost);
            if best
                .as_ref()
                .is_none_or(|(best_score, _, _)| score < *best_score - 1e-9)
            {
                best = Some((score, anchor, area));
            }
        }
        best.map(|(_, anchor, area)| (anchor, area))
    }
}

fn draw_label(canvas: &mut Canvas, label: &PlanLabel, area: Area, anchor: [f64; 2]) {
    let lines = &label.lines;
    if matches!(label.style, LabelStyle::Zone { .. }) {
        if let Some([anchor, nearest]) = leader(&area, anchor) {
            canvas.line(anchor, nearest, 0.25, 0.0, Stroke::Solid);
            let dot = 0.5;
            canvas.fill_area(
                Area {
                    x: anchor[0] - dot,
                    y: anchor[1] - dot,
                    w: 2.0 * dot,
                    h: 2.0 * dot,
                },
                0.0,
            );
        }
    }
    canvas.fill_area(area, 1.0);
    let frame_mm = match label.style {
        LabelStyle::Zone { emphasis: true } => 0.8,
        LabelStyle::Zone { emphasis: false } | LabelStyle::Table => 0.25,
        LabelStyle::Plane | LabelStyle::Eave => 0.15,
    };
    canvas.stroke_area(area, frame_mm, 0.0);
    let size = label.style.size_pt();
    let line_h = line_height_mm(size);
    let pad = (area.h - lines.len() as f64 * line_h) / 2.0;
    let mut baseline = area.top() - pad - line_h * 0.78;
    let (x, align) = if label.style == LabelStyle::Table {
        (area.x + 1.2, Align::Left)
    } else {
        (area.x + area.w / 2.0, Align::Center)
    };
    for (i, line) in lines.iter().enumerate() {
        let font = if i == 0 { Font::Bold } else { Font::Regular };
        canvas.text(x, baseline, line, font, size, align);
        baseline -= line_h;
    }
    canvas.note_plan_label(&lines.join(" / "), area);
}
