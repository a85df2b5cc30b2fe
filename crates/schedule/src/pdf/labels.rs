//! Zone labels on the plan: a boxed block of text near each zone's anchor, moved off its neighbours and
//! tied back to the zone with a leader when it had to move.

use super::canvas::{Align, Area, Canvas, Stroke};
use super::geometry::{bounds, contains};
use super::text::{line_height_mm, width_mm, Font};

/// Type size of zone labels, pt.
const LABEL_PT: f64 = 7.5;
/// Clear gap kept between labels and other obstacles, mm.
const GAP_MM: f64 = 0.8;

/// One label to place: its lines (the first set bold), the zone it names (an index into the zone
/// polygons given to [`place_labels`]) and the points it may point at, best first.
#[derive(Debug, Clone)]
pub(crate) struct ZoneLabel {
    pub lines: Vec<String>,
    pub zone: usize,
    /// Drawn with a heavy frame: the zone has no working spacing.
    pub emphasis: bool,
    pub anchors: Vec<[f64; 2]>,
}

fn box_size(lines: &[String]) -> (f64, f64) {
    let width = lines
        .iter()
        .enumerate()
        .map(|(i, line)| {
            width_mm(
                line,
                if i == 0 { Font::Bold } else { Font::Regular },
                LABEL_PT,
            )
        })
        .fold(0.0, f64::max);
    (
        width + 2.4,
        lines.len() as f64 * line_height_mm(LABEL_PT) + 1.4,
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

    /// Share of the box that covers zones other than `own` (outside the roof counts as free).
    fn foreign_share(&self, area: &Area, own: usize) -> f64 {
        const NX: usize = 5;
        const NY: usize = 3;
        let mut foreign = 0;
        for i in 0..NX {
            for j in 0..NY {
                let p = [
                    area.x + area.w * (i as f64 + 0.5) / NX as f64,
                    area.y + area.h * (j as f64 + 0.5) / NY as f64,
                ];
                let mut here = self
                    .polygons
                    .iter()
                    .filter(|(_, _, b)| {
                        p[0] >= b[0] && p[0] <= b[2] && p[1] >= b[1] && p[1] <= b[3]
                    })
                    .filter(|(_, polygon, _)| contains(polygon, p))
                    .map(|(zone, _, _)| *zone);
                let first = here.next();
                let mut all_own = first.is_none_or(|zone| zone == own);
                for zone in here {
                    all_own |= zone == own;
                }
                if !all_own {
                    foreign += 1;
                }
            }
        }
        foreign as f64 / (NX * NY) as f64
    }
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

/// How poor a place is: covering other zones costs most, then leaders crossing labels, then needing a
/// leader at all, then distance.
fn badness(
    area: &Area,
    anchor: [f64; 2],
    own: usize,
    zones: &ZoneMap,
    placed: &[Area],
    leaders: &[[[f64; 2]; 2]],
) -> f64 {
    let own_leader = leader(area, anchor);
    let center = [area.x + area.w / 2.0, area.y + area.h / 2.0];
    let distance = ((center[0] - anchor[0]).powi(2) + (center[1] - anchor[1]).powi(2)).sqrt();
    let crossing = own_leader
        .is_some_and(|segment| placed.iter().any(|other| crosses(segment, other)))
        || leaders.iter().any(|segment| crosses(*segment, area));
    zones.foreign_share(area, own) * 4.0
        + if crossing { 2.0 } else { 0.0 }
        + if own_leader.is_some() { 1.0 } else { 0.0 }
        + distance / 40.0
}

/// Places and draws `labels` inside `bounds`, keeping clear of `obstacles` and of each other, preferring
/// places over the label's own zone or off the roof (with a leader) to places over other zones.
pub(crate) fn place_labels(
    canvas: &mut Canvas,
    labels: &[ZoneLabel],
    zones: &[Vec<Vec<[f64; 2]>>],
    bounds: Area,
    obstacles: &[Area],
) {
    let zone_map = ZoneMap::new(zones);
    let mut taken: Vec<Area> = obstacles.to_vec();
    let mut placed: Vec<Area> = Vec::new();
    let mut leaders: Vec<[[f64; 2]; 2]> = Vec::new();
    let offsets = offsets();
    for label in labels {
        let Some(&first_anchor) = label.anchors.first() else {
            continue;
        };
        let (w, h) = box_size(&label.lines);
        let mut best: Option<(f64, [f64; 2], Area)> = None;
        for anchor in &label.anchors {
            for offset in &offsets {
                let area = centered([anchor[0] + offset[0] * w, anchor[1] + offset[1] * h], w, h);
                if !bounds.contains_area(&area)
                    || taken.iter().any(|other| area.overlaps(other, GAP_MM))
                {
                    continue;
                }
                let score = badness(&area, *anchor, label.zone, &zone_map, &placed, &leaders);
                if best
                    .as_ref()
                    .is_none_or(|(best_score, _, _)| score < *best_score - 1e-9)
                {
                    best = Some((score, *anchor, area));
                }
            }
        }
        let (anchor, area) = match best {
            Some((_, anchor, area)) => (anchor, area),
            None => {
                // Nowhere free: sit on the best anchor, kept inside the drawing.
                let mut area = centered(first_anchor, w, h);
                area.x = area.x.clamp(bounds.x, (bounds.right() - w).max(bounds.x));
                area.y = area.y.clamp(bounds.y, (bounds.top() - h).max(bounds.y));
                (first_anchor, area)
            }
        };
        draw_label(canvas, label, area, anchor);
        leaders.extend(leader(&area, anchor));
        taken.push(area);
        placed.push(area);
    }
}

fn draw_label(canvas: &mut Canvas, label: &ZoneLabel, area: Area, anchor: [f64; 2]) {
    let lines = &label.lines;
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
    canvas.fill_area(area, 1.0);
    canvas.stroke_area(area, if label.emphasis { 0.8 } else { 0.25 }, 0.0);
    let line_h = line_height_mm(LABEL_PT);
    let mut baseline = area.top() - 0.7 - line_h * 0.78;
    for (i, line) in lines.iter().enumerate() {
        let font = if i == 0 { Font::Bold } else { Font::Regular };
        canvas.text(
            area.x + area.w / 2.0,
            baseline,
            line,
            font,
            LABEL_PT,
            Align::Center,
        );
        baseline -= line_h;
    }
}
