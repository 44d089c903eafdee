//! The PDFs, read back with an outside reader (poppler's pdftoppm and
//! pdftotext, from Debian's poppler-utils, which `.ci/run` installs):
//! every page renders, every page carries the cautions and its number, and
//! the key values are those of the text outputs. Skipped loudly where
//! poppler is missing, except under CI (`CI` set), where that fails.

use std::path::{Path, PathBuf};
use std::process::Command;

fn plankwise(args: &[&str]) -> (i32, String, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_plankwise"))
        .args(args)
        .output()
        .expect("plankwise runs");
    (
        out.status.code().unwrap_or(-1),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

fn have_poppler() -> bool {
    let ok = ["pdftoppm", "pdftotext", "pdfinfo"]
        .iter()
        .all(|t| Command::new(t).arg("-v").output().is_ok());
    if !ok && std::env::var_os("CI").is_some() {
        panic!("poppler-utils (pdftoppm, pdftotext, pdfinfo) is needed for the PDF tests under CI");
    }
    if !ok {
        use std::io::Write;
        let _ = writeln!(
            std::io::stderr(),
            "\n*** poppler-utils not found: this PDF test is SKIPPED — install poppler-utils to run tests/pdf.rs ***\n"
        );
    }
    ok
}

fn scratch(tag: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("plankwise-pdf-{tag}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap();
    d
}

/// Page count and size line, from pdfinfo.
fn info(pdf: &Path) -> (usize, String) {
    let out = Command::new("pdfinfo").arg(pdf).output().unwrap();
    let text = String::from_utf8_lossy(&out.stdout).into_owned();
    let field = |k: &str| {
        text.lines()
            .find(|l| l.starts_with(k))
            .map(|l| l[k.len()..].trim().to_string())
            .unwrap_or_default()
    };
    (field("Pages:").parse().unwrap(), field("Page size:"))
}

/// Render every page with pdftoppm and check each image is there and not blank.
fn renders(pdf: &Path, pages: usize) {
    let dir = pdf.with_extension("png.d");
    std::fs::create_dir_all(&dir).unwrap();
    let st = Command::new("pdftoppm")
        .args(["-r", "40", "-png"])
        .arg(pdf)
        .arg(dir.join("p"))
        .status()
        .unwrap();
    assert!(st.success(), "pdftoppm failed on {}", pdf.display());
    let pngs: Vec<_> = std::fs::read_dir(&dir).unwrap().map(|e| e.unwrap().path()).collect();
    assert_eq!(pngs.len(), pages, "{} pages rendered of {pages}", pngs.len());
    for p in pngs {
        // a blank page compresses to a few hundred bytes
        assert!(std::fs::metadata(&p).unwrap().len() > 2000, "{} looks blank", p.display());
    }
}

/// The text of each page as pdftotext lays it out.
fn raw_pages(pdf: &Path) -> Vec<String> {
    let out = Command::new("pdftotext").arg("-layout").arg(pdf).arg("-").output().unwrap();
    assert!(out.status.success());
    let text = String::from_utf8_lossy(&out.stdout).into_owned();
    let mut pages: Vec<String> = text.split('\x0c').map(str::to_string).collect();
    if pages.last().is_some_and(|p| p.trim().is_empty()) {
        pages.pop();
    }
    pages
}

/// The text of each page, whitespace runs made single.
fn pages_text(pdf: &Path) -> Vec<String> {
    raw_pages(pdf).iter().map(|p| squash(p)).collect()
}

/// The body of every page run together (running head, cautions and page
/// number left out), so a line wrapped over a page break reads whole.
fn body_text(pdf: &Path) -> String {
    let bodies: Vec<String> = raw_pages(pdf)
        .iter()
        .map(|p| {
            let lines: Vec<&str> = p.lines().filter(|l| !l.trim().is_empty()).collect();
            let end = lines.len().saturating_sub(3);
            squash(&lines[1.min(end)..end].join("\n"))
        })
        .collect();
    bodies.join(" ")
}

fn squash(s: &str) -> String {
    s.split_whitespace().collect::<Vec<_>>().join(" ")
}

/// What every page must carry.
fn every_page_has_cautions_and_number(pages: &[String]) {
    let n = pages.len();
    for (i, p) in pages.iter().enumerate() {
        for c in plankwise::report::CAUTIONS {
            assert!(p.contains(c), "page {} lacks the caution '{c}'", i + 1);
        }
        assert!(p.contains(&format!("page {} of {n}", i + 1)), "page {} lacks its number", i + 1);
    }
}

#[test]
fn the_shortlist_pdf_carries_the_text_shortlists_values_on_numbered_pages() {
    if !have_poppler() {
        return;
    }
    let d = scratch("shortlist");
    let (pdf, txt) = (d.join("s.pdf"), d.join("s.txt"));
    let (code, _, err) = plankwise(&["shortlist", "--job", "demo", "-o", pdf.to_str().unwrap()]);
    // the demo job has a bay nothing carries (exit 1), on purpose
    assert_eq!(code, 1, "{err}");
    plankwise(&["shortlist", "--job", "demo", "-o", txt.to_str().unwrap()]);
    let (n, size) = info(&pdf);
    assert!(size.contains("612 x 792"), "US output on Letter: {size}");
    renders(&pdf, n);
    let pages = pages_text(&pdf);
    assert_eq!(pages.len(), n);
    every_page_has_cautions_and_number(&pages);
    let all = body_text(&pdf);
    let text = std::fs::read_to_string(&txt).unwrap();
    // the header block, the bays, every listed member and its figures as the text has them
    for l in text.lines() {
        let key = l.starts_with("Project")
            || l.starts_with("Engineer")
            || l.starts_with("Date")
            || l.starts_with("Basis")
            || l.starts_with("Units")
            || l.starts_with("Bay ")
            || l.trim_start().starts_with('[')
            || l.trim_start().starts_with("governs:")
            || l.trim_start().starts_with("camber at erection");
        if key {
            assert!(all.contains(&squash(l)), "the PDF lacks: {l}");
        }
    }
    let cat = plankwise::catalog::Catalog::from_str(plankwise::catalog::DEMO_US, "demo-us.toml").unwrap();
    assert!(all.contains(&cat.hash), "the catalog's content hash");
    // a capacity chart with the design point for every listed member
    let listed = text.lines().filter(|l| l.trim_start().starts_with('[')).count();
    assert!(listed >= 10, "{listed}");
    let labels = all.matches("design point").count() - all.matches("the bay's design point").count();
    assert_eq!(labels, listed, "one chart per listed member");
    for role in ["Prepared by", "Reviewed by (supplier's engineer)", "Engineer of record"] {
        assert!(pages.last().unwrap().contains(role), "signature block: {role}");
    }
}

#[test]
fn an_si_shortlist_pdf_is_on_a4_in_si_units() {
    if !have_poppler() {
        return;
    }
    let d = scratch("si");
    let pdf = d.join("s.pdf");
    let si = concat!(env!("CARGO_MANIFEST_DIR"), "/catalog/demo-si.toml");
    let (code, _, err) = plankwise(&["shortlist", si, "--job", "demo", "--format", "pdf", "-o", pdf.to_str().unwrap()]);
    assert!(code == 0 || code == 1, "{err}");
    let (n, size) = info(&pdf);
    assert!(size.contains("595.28 x 841.89"), "SI output on A4: {size}");
    let pages = pages_text(&pdf);
    every_page_has_cautions_and_number(&pages);
    let all = pages.join(" ");
    assert!(all.contains("kPa") && all.contains("span, m"), "SI units");
    for us in [" psf", " kip-ft", " ft,", " in,", " psi"] {
        assert!(!all.contains(us), "a US unit in the SI PDF: '{us}'");
    }
    assert_eq!(pages.len(), n);
}

#[test]
fn the_capacity_pdf_has_every_cell_of_the_text_table() {
    if !have_poppler() {
        return;
    }
    let d = scratch("capacity");
    let pdf = d.join("c.pdf");
    let args = [
        "capacity",
        "--spans",
        "12 ft..40 ft",
        "--step",
        "1 ft",
        "--loads",
        "40 psf, 100 psf",
    ];
    let (code, _, err) = plankwise(&[&args[..], &["-o", pdf.to_str().unwrap()]].concat());
    assert_eq!(code, 0, "{err}");
    let (_, text, _) = plankwise(&[&args[..], &["--format", "csv"]].concat());
    let (n, _) = info(&pdf);
    renders(&pdf, n);
    let pages = pages_text(&pdf);
    every_page_has_cautions_and_number(&pages);
    let all = body_text(&pdf);
    let mut cells = 0;
    // every entry and load level: the longest span (as the text table
    // prints it) and the check that ends it
    for l in text.lines().skip(1) {
        let f: Vec<&str> = l.rsplitn(3, ',').collect();
        let (stopped, span) = (f[0], f[1]);
        if let Ok(s) = span.parse::<f64>() {
            let shown = plankwise::units::display::span(s * 12.0, plankwise::units::System::Us);
            assert!(
                all.contains(&format!("{shown} {stopped}").trim().to_string()),
                "the PDF lacks {shown} {stopped} ({l})"
            );
            cells += 1;
        }
    }
    assert!(cells > 40, "{cells}");
}

#[test]
fn the_calculation_sheet_pdf_has_every_number_of_the_text_sheet() {
    if !have_poppler() {
        return;
    }
    let d = scratch("sheet");
    let pdf = d.join("sheet.pdf");
    let args = [
        "check",
        "--section",
        "tee-24in-10ft",
        "--pattern",
        "8-depressed",
        "--span",
        "40 ft",
        "--live",
        "60 psf",
    ];
    let (code, _, err) = plankwise(&[&args[..], &["--sheet", "-o", pdf.to_str().unwrap()]].concat());
    assert_eq!(code, 0, "{err}");
    let (_, text, _) = plankwise(&[&args[..], &["--sheet"]].concat());
    let (n, _) = info(&pdf);
    renders(&pdf, n);
    let pages = pages_text(&pdf);
    every_page_has_cautions_and_number(&pages);
    let all = body_text(&pdf);
    let mut keyed = 0;
    // every line of the text sheet that carries a JSON key, value and key alike
    for l in text.lines().filter(|l| l.trim_end().ends_with(']') && l.contains(" [")) {
        assert!(all.contains(&squash(l)), "the PDF lacks: {l}");
        keyed += 1;
    }
    assert!(keyed > 60, "{keyed}");
    // ℓ is not in the monospaced face: set in the fallback face, read back as ℓ
    assert!(all.contains('ℓ'), "ℓ lost");
}

#[test]
fn a_pdf_needs_a_file() {
    let (code, _, err) = plankwise(&[
        "check",
        "--section",
        "plank-8in-4ft",
        "--pattern",
        "6x1/2",
        "--span",
        "24 ft",
        "--sheet",
        "pdf",
    ]);
    assert_eq!(code, 2);
    assert!(err.contains("-o FILE.pdf"), "{err}");
}
