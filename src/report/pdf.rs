//! The PDF writer every printable output shares (shortlist, capacity
//! table, calculation sheet): pages of monospaced text and vector charts,
//! a running head, the cautions and the page number on every page.
//!
//! Generated in-process with `krilla`; the text is set in DejaVu Sans Mono
//! (embedded as a subset; its licence, Bitstream Vera with DejaVu changes
//! in the public domain, allows it: `src/report/fonts/LICENSE-DejaVu.txt`),
//! with DejaVu Sans for the few characters the monospaced face lacks (ℓ).
//! The writer lays out what it is given; it computes nothing.

use std::sync::OnceLock;

use krilla::Document;
use krilla::color::rgb;
use krilla::geom::{PathBuilder, Point, Rect, Transform};
use krilla::metadata::Metadata;
use krilla::num::NormalizedF32;
use krilla::page::PageSettings;
use krilla::paint::{Fill, Stroke, StrokeDash};
use krilla::surface::Surface;
use krilla::text::{Font, TextDirection};

static MONO: &[u8] = include_bytes!("fonts/DejaVuSansMono.ttf");
static MONO_BOLD: &[u8] = include_bytes!("fonts/DejaVuSansMono-Bold.ttf");
static SANS: &[u8] = include_bytes!("fonts/DejaVuSans.ttf");

/// Paper: US Letter for US customary output, ISO A4 for SI (the sheets
/// each group of users files; common practice, no source).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Paper {
    /// 8½ × 11 in.
    Letter,
    /// 210 × 297 mm.
    A4,
}

impl Paper {
    /// The paper of a unit system.
    pub fn of(sys: crate::units::System) -> Paper {
        match sys {
            crate::units::System::Us => Paper::Letter,
            crate::units::System::Si => Paper::A4,
        }
    }
    /// Width and height, pt.
    fn size(self) -> (f32, f32) {
        match self {
            Paper::Letter => (612.0, 792.0),
            Paper::A4 => (595.28, 841.89),
        }
    }
}

/// A chart: one curve of y against x, broken where y is absent, and a
/// marked point. Values are in the display units the labels name.
#[derive(Debug, Clone, PartialEq)]
pub struct Chart {
    /// Title above the plot.
    pub title: String,
    /// Label of the x axis, with its unit.
    pub x_label: String,
    /// Label of the y axis, with its unit.
    pub y_label: String,
    /// The curve: (x, y); `None` breaks it.
    pub curve: Vec<(f64, Option<f64>)>,
    /// A marked point and its label.
    pub point: Option<(f64, f64, String)>,
}

/// What goes on the pages, in order.
#[derive(Debug, Clone, PartialEq)]
pub enum Block {
    /// Lines of monospaced text (long lines wrap).
    Lines(Vec<String>),
    /// A bold heading line.
    Heading(String),
    /// Charts, two side by side.
    Charts(Vec<Chart>),
    /// Start a new page.
    Break,
    /// The signature block: one line for each role.
    Signatures(Vec<String>),
}

/// A document.
#[derive(Debug, Clone, PartialEq)]
pub struct Doc {
    /// Title, for the running head and the file's metadata.
    pub title: String,
    /// Right side of the running head (project, date).
    pub head_right: String,
    /// The paper.
    pub paper: Paper,
    /// The content.
    pub blocks: Vec<Block>,
}

/// Body text size and leading, pt.
const SIZE: f32 = 8.2;
const LEAD: f32 = 10.2;
/// Advance of one monospaced character, em (DejaVu Sans Mono: 1233/2048).
const ADVANCE_EM: f32 = 1233.0 / 2048.0;
const MARGIN: f32 = 42.0;
const HEAD: f32 = 50.0;
/// Room kept at the foot for the cautions and the page number, pt.
const FOOT: f32 = 62.0;
const CHART_H: f32 = 170.0;

/// Characters per line at the body size.
pub fn columns(paper: Paper) -> usize {
    let (w, _) = paper.size();
    ((w - 2.0 * MARGIN) / (SIZE * ADVANCE_EM)).floor() as usize
}

/// One laid-out item on a page, at its top y (from the page top), pt.
enum Item {
    Line { y: f32, text: String, bold: bool },
    Charts { y: f32, charts: Vec<Chart> },
    Rule { y: f32 },
}

/// Split a line longer than `cols` characters, continuing indented.
fn wrap(line: &str, cols: usize) -> Vec<String> {
    let chars: Vec<char> = line.chars().collect();
    if chars.len() <= cols {
        return vec![line.to_string()];
    }
    let indent = chars.iter().take_while(|c| **c == ' ').count().min(cols / 2) + 4;
    let mut out = Vec::new();
    let mut rest: &[char] = &chars;
    let mut width = cols;
    while rest.len() > width {
        // break at the last space that keeps the line within the width
        let cut = rest[..=width].iter().rposition(|c| *c == ' ').filter(|&k| k > 0).unwrap_or(width);
        out.push(rest[..cut].iter().collect::<String>());
        rest = &rest[cut..];
        while rest.first() == Some(&' ') {
            rest = &rest[1..];
        }
        width = cols - indent;
    }
    out.push(rest.iter().collect());
    for l in out.iter_mut().skip(1) {
        *l = format!("{}{l}", " ".repeat(indent));
    }
    out
}

/// Lay the blocks out on pages.
fn layout(doc: &Doc) -> Vec<Vec<Item>> {
    let (_, h) = doc.paper.size();
    let top = HEAD;
    let bottom = h - FOOT;
    let cols = columns(doc.paper);
    let mut pages: Vec<Vec<Item>> = vec![Vec::new()];
    let mut y = top;
    let new_page = |pages: &mut Vec<Vec<Item>>, y: &mut f32| {
        pages.push(Vec::new());
        *y = top;
    };
    for b in &doc.blocks {
        match b {
            Block::Lines(lines) => {
                for l in lines {
                    for part in wrap(l, cols) {
                        if y + LEAD > bottom {
                            new_page(&mut pages, &mut y);
                        }
                        pages.last_mut().expect("a page").push(Item::Line {
                            y,
                            text: part,
                            bold: false,
                        });
                        y += LEAD;
                    }
                }
            }
            Block::Heading(t) => {
                // a heading never ends a page
                if y + 4.0 * LEAD > bottom {
                    new_page(&mut pages, &mut y);
                }
                for part in wrap(t, cols) {
                    pages.last_mut().expect("a page").push(Item::Line { y, text: part, bold: true });
                    y += LEAD;
                }
            }
            Block::Charts(charts) => {
                for pair in charts.chunks(2) {
                    if y + CHART_H > bottom {
                        new_page(&mut pages, &mut y);
                    }
                    pages.last_mut().expect("a page").push(Item::Charts { y, charts: pair.to_vec() });
                    y += CHART_H + LEAD;
                }
            }
            Block::Break => {
                if y > top {
                    new_page(&mut pages, &mut y);
                }
            }
            Block::Signatures(roles) => {
                let need = (roles.len() as f32) * 3.0 * LEAD + 2.0 * LEAD;
                if y + need > bottom {
                    new_page(&mut pages, &mut y);
                }
                y += LEAD;
                for r in roles {
                    y += 1.6 * LEAD;
                    pages.last_mut().expect("a page").push(Item::Rule { y });
                    pages.last_mut().expect("a page").push(Item::Line {
                        y: y + 2.0,
                        text: format!("{r:<40}signature                    date"),
                        bold: false,
                    });
                    y += 1.4 * LEAD;
                }
            }
        }
    }
    pages
}

struct Fonts {
    mono: Font,
    bold: Font,
    sans: Font,
    /// Which characters the monospaced face has.
    face: ttf_parser::Face<'static>,
    /// The fallback face, for its advances.
    sans_face: ttf_parser::Face<'static>,
}

fn fonts() -> &'static Fonts {
    static F: OnceLock<Fonts> = OnceLock::new();
    F.get_or_init(|| Fonts {
        mono: Font::new(MONO.into(), 0).expect("the embedded monospaced font"),
        bold: Font::new(MONO_BOLD.into(), 0).expect("the embedded bold font"),
        sans: Font::new(SANS.into(), 0).expect("the embedded fallback font"),
        face: ttf_parser::Face::parse(MONO, 0).expect("the embedded monospaced font"),
        sans_face: ttf_parser::Face::parse(SANS, 0).expect("the embedded fallback font"),
    })
}

fn black() -> rgb::Color {
    rgb::Color::new(0, 0, 0)
}

fn fill(c: rgb::Color) -> Fill {
    Fill {
        paint: c.into(),
        opacity: NormalizedF32::ONE,
        rule: Default::default(),
    }
}

fn stroke(c: rgb::Color, width: f32, dashed: bool) -> Stroke {
    Stroke {
        paint: c.into(),
        width,
        dash: dashed.then(|| StrokeDash {
            array: vec![2.0, 2.0],
            offset: 0.0,
        }),
        ..Default::default()
    }
}

/// Text on the monospaced grid from (x, baseline y), the characters the
/// monospaced face lacks set in the fallback face in their own cells.
fn text(s: &mut Surface, x: f32, y: f32, t: &str, size: f32, bold: bool) {
    let f = fonts();
    let face = if bold { &f.bold } else { &f.mono };
    let cell = size * ADVANCE_EM;
    let mut run = String::new();
    let mut run_at = 0usize;
    let flush = |s: &mut Surface, run: &mut String, at: usize| {
        if !run.trim().is_empty() {
            s.set_fill(Some(fill(black())));
            s.draw_text(
                Point::from_xy(x + at as f32 * cell, y),
                face.clone(),
                size,
                run,
                false,
                TextDirection::LeftToRight,
            );
        }
        run.clear();
    };
    for (i, c) in t.chars().enumerate() {
        if f.face.glyph_index(c).is_some() || c == ' ' {
            if run.is_empty() {
                run_at = i;
            }
            run.push(c);
        } else {
            flush(s, &mut run, run_at);
            // squeezed or stretched to the cell, so the grid (and a reader's
            // idea of where words end) is kept
            let adv = f
                .sans_face
                .glyph_index(c)
                .and_then(|g| f.sans_face.glyph_hor_advance(g))
                .map_or(ADVANCE_EM, |a| a as f32 / f.sans_face.units_per_em() as f32);
            let sx = ADVANCE_EM / adv.max(0.1);
            s.push_transform(&Transform::from_row(sx, 0.0, 0.0, 1.0, x + i as f32 * cell, y));
            s.set_fill(Some(fill(black())));
            s.draw_text(
                Point::from_xy(0.0, 0.0),
                f.sans.clone(),
                size,
                &c.to_string(),
                false,
                TextDirection::LeftToRight,
            );
            s.pop();
        }
    }
    flush(s, &mut run, run_at);
}

fn line(s: &mut Surface, pts: &[(f32, f32)], width: f32, dashed: bool) {
    if pts.len() < 2 {
        return;
    }
    let mut pb = PathBuilder::new();
    pb.move_to(pts[0].0, pts[0].1);
    for p in &pts[1..] {
        pb.line_to(p.0, p.1);
    }
    if let Some(path) = pb.finish() {
        s.set_fill(None);
        s.set_stroke(Some(stroke(black(), width, dashed)));
        s.draw_path(&path);
        s.set_stroke(None);
    }
}

/// Round, readable tick values covering lo..hi: about five.
pub fn ticks(lo: f64, hi: f64) -> Vec<f64> {
    if hi.partial_cmp(&lo) != Some(std::cmp::Ordering::Greater) {
        return vec![lo];
    }
    let raw = (hi - lo) / 5.0;
    let mag = 10f64.powf(raw.log10().floor());
    let step = [1.0, 2.0, 2.5, 5.0, 10.0]
        .iter()
        .map(|m| m * mag)
        .find(|s| *s >= raw)
        .unwrap_or(10.0 * mag);
    let first = (lo / step).ceil() * step;
    let mut v = Vec::new();
    let mut t = first;
    while t <= hi + 1e-9 * step {
        v.push(if t.abs() < 1e-12 * step { 0.0 } else { t });
        t += step;
    }
    v
}

fn label(v: f64) -> String {
    let s = format!("{v:.2}");
    s.trim_end_matches('0').trim_end_matches('.').to_string()
}

/// One chart in the box (x, y from the page top, w, h).
fn chart(s: &mut Surface, c: &Chart, x0: f32, y0: f32, w: f32, h: f32) {
    let small = 6.5;
    text(s, x0, y0 + 8.0, &c.title, 7.2, true);
    // the plot's frame, leaving room for the tick labels
    let (px, py, pw, ph) = (x0 + 34.0, y0 + 24.0, w - 42.0, h - 52.0);
    let xs: Vec<f64> = c.curve.iter().map(|p| p.0).chain(c.point.iter().map(|p| p.0)).collect();
    let ys: Vec<f64> = c.curve.iter().filter_map(|p| p.1).chain(c.point.iter().map(|p| p.1)).collect();
    let (xlo, xhi) = xs.iter().fold((f64::INFINITY, f64::NEG_INFINITY), |a, &v| (a.0.min(v), a.1.max(v)));
    let yhi = ys.iter().fold(0.0f64, |a, &v| a.max(v)).max(1e-9) * 1.08;
    let (xlo, xhi) = if xhi > xlo { (xlo, xhi) } else { (xlo - 1.0, xlo + 1.0) };
    let sx = |v: f64| px + ((v - xlo) / (xhi - xlo)) as f32 * pw;
    let sy = |v: f64| py + ph - (v / yhi) as f32 * ph;
    line(
        s,
        &[(px, py), (px + pw, py), (px + pw, py + ph), (px, py + ph), (px, py)],
        0.5,
        false,
    );
    for t in ticks(xlo, xhi) {
        let x = sx(t);
        line(s, &[(x, py + ph), (x, py + ph + 3.0)], 0.5, false);
        line(s, &[(x, py), (x, py + ph)], 0.2, true);
        let l = label(t);
        text(
            s,
            x - l.chars().count() as f32 * small * ADVANCE_EM / 2.0,
            py + ph + 10.0,
            &l,
            small,
            false,
        );
    }
    for t in ticks(0.0, yhi) {
        let y = sy(t);
        line(s, &[(px - 3.0, y), (px, y)], 0.5, false);
        line(s, &[(px, y), (px + pw, y)], 0.2, true);
        let l = label(t);
        text(
            s,
            px - 4.0 - l.chars().count() as f32 * small * ADVANCE_EM,
            y + 2.2,
            &l,
            small,
            false,
        );
    }
    text(s, px, py + ph + 19.0, &format!("{} →", c.x_label), small, false);
    text(s, px - 30.0, py - 3.0, &format!("↑ {}", c.y_label), small, false);
    // the curve, broken where the member fails without the load
    let mut run: Vec<(f32, f32)> = Vec::new();
    for &(x, y) in &c.curve {
        match y {
            Some(y) => run.push((sx(x), sy(y))),
            None => {
                line(s, &run, 1.2, false);
                run.clear();
            }
        }
    }
    line(s, &run, 1.2, false);
    if let Some((x, y, l)) = &c.point {
        let (cx, cy) = (sx(*x), sy(*y));
        let mut pb = PathBuilder::new();
        if let Some(r) = Rect::from_xywh(cx - 2.5, cy - 2.5, 5.0, 5.0) {
            pb.push_rect(r);
        }
        if let Some(p) = pb.finish() {
            s.set_stroke(None);
            s.set_fill(Some(fill(black())));
            s.draw_path(&p);
        }
        let lx = if cx + 6.0 + l.chars().count() as f32 * small * ADVANCE_EM > px + pw {
            cx - 6.0 - l.chars().count() as f32 * small * ADVANCE_EM
        } else {
            cx + 6.0
        };
        // the label on the side of the marker away from the curve: below
        // it when the curve passes above (the usual case of a point that
        // works), above it otherwise
        let curve_y = c
            .curve
            .windows(2)
            .find(|w| w[0].0 <= *x && *x <= w[1].0)
            .and_then(|w| match (w[0].1, w[1].1) {
                (Some(a), Some(b)) if w[1].0 > w[0].0 => Some(a + (b - a) * (x - w[0].0) / (w[1].0 - w[0].0)),
                _ => None,
            });
        let below = curve_y.is_none_or(|yc| yc >= *y);
        let ly = if below {
            (cy + 10.0).min(py + ph - 2.0)
        } else {
            (cy - 5.0).max(py + 7.0)
        };
        text(s, lx, ly, l, small, false);
    }
}

/// The PDF of a document.
pub fn render(doc: &Doc) -> Result<Vec<u8>, String> {
    let pages = layout(doc);
    let (w, h) = doc.paper.size();
    let n = pages.len();
    let mut d = Document::new();
    d.set_metadata(
        Metadata::new()
            .title(doc.title.clone())
            .creator(format!("plankwise {}", env!("CARGO_PKG_VERSION"))),
    );
    for (i, items) in pages.iter().enumerate() {
        let mut page = d.start_page_with(PageSettings::from_wh(w, h).ok_or("paper size")?);
        let mut s = page.surface();
        // running head
        text(&mut s, MARGIN, HEAD - 22.0, &doc.title, 8.0, true);
        // the right side of the head, shortened to the room the title leaves
        let cw = 7.0 * ADVANCE_EM;
        let room = ((w - 2.0 * MARGIN - doc.title.chars().count() as f32 * 8.0 * ADVANCE_EM - 14.0) / cw).max(8.0) as usize;
        let right: String = if doc.head_right.chars().count() > room {
            doc.head_right.chars().take(room - 1).chain(std::iter::once('…')).collect()
        } else {
            doc.head_right.clone()
        };
        text(
            &mut s,
            w - MARGIN - right.chars().count() as f32 * cw,
            HEAD - 22.0,
            &right,
            7.0,
            false,
        );
        line(&mut s, &[(MARGIN, HEAD - 16.0), (w - MARGIN, HEAD - 16.0)], 0.6, false);
        for it in items {
            match it {
                Item::Line { y, text: t, bold } => text(&mut s, MARGIN, y + SIZE, t, SIZE, *bold),
                Item::Rule { y } => line(&mut s, &[(MARGIN, *y), (w - MARGIN, *y)], 0.5, false),
                Item::Charts { y, charts } => {
                    let cw = (w - 2.0 * MARGIN - 14.0) / 2.0;
                    for (k, c) in charts.iter().enumerate() {
                        chart(&mut s, c, MARGIN + k as f32 * (cw + 14.0), *y, cw, CHART_H);
                    }
                }
            }
        }
        // foot: the cautions and the page number on every page
        let fy = h - FOOT + 14.0;
        line(&mut s, &[(MARGIN, fy - 8.0), (w - MARGIN, fy - 8.0)], 0.6, false);
        for (k, c) in super::CAUTIONS.iter().enumerate() {
            text(&mut s, MARGIN, fy + k as f32 * 8.5, &format!("! {c}"), 6.8, k == 0);
        }
        let num = format!("page {} of {n}", i + 1);
        text(
            &mut s,
            w - MARGIN - num.chars().count() as f32 * 6.8 * ADVANCE_EM,
            fy + 2.0 * 8.5,
            &num,
            6.8,
            false,
        );
        s.finish();
        page.finish();
    }
    d.finish().map_err(|e| format!("{e:?}"))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn long_lines_wrap_at_spaces_and_indent() {
        let w = wrap("  one two three four five six", 12);
        assert_eq!(w[0], "  one two");
        assert!(w.iter().all(|l| l.chars().count() <= 12), "{w:?}");
        assert!(w[1].starts_with("      "), "{w:?}");
        assert_eq!(wrap("short", 12), vec!["short"]);
    }

    #[test]
    fn ticks_are_round() {
        assert_eq!(ticks(0.0, 100.0), vec![0.0, 20.0, 40.0, 60.0, 80.0, 100.0]);
        assert_eq!(ticks(12.0, 36.0), vec![15.0, 20.0, 25.0, 30.0, 35.0]);
    }

    #[test]
    fn every_page_has_a_number_and_the_paper_follows_the_units() {
        let doc = Doc {
            title: "t".into(),
            head_right: "r".into(),
            paper: Paper::A4,
            blocks: vec![Block::Lines(vec!["x".into(); 200])],
        };
        assert_eq!(layout(&doc).len(), 3);
        let pdf = render(&doc).unwrap();
        assert!(pdf.starts_with(b"%PDF-"));
        assert_eq!(Paper::of(crate::units::System::Us), Paper::Letter);
    }
}
