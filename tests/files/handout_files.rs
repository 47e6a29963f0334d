//! The hand-outs as a person sees them. The build sheet (PDF) is read back and rendered by
//! poppler-utils (Debian package `poppler-utils`: `pdfinfo`, `pdftotext`, `pdftoppm`), an
//! outside PDF reader, and must carry the recipe's figures and render as non-blank pages;
//! the charts are read back as SVG (parsed by quick-xml) and PNG (decoded by `image`).

use image::GenericImageView;
use quick_xml::Reader;
use quick_xml::events::Event;
use std::path::{Path, PathBuf};
use std::process::Command;
use tankwright::handout::{
    BENCH_COLUMNS, CHART_SIZE, ChartKind, chart_bytes, chart_data, write_sheet,
};
use tankwright::recipe::{Footing, Recipe, figures};
use tankwright::tuning::buildable::former_drills;
use tankwright::tuning::digits;

/// The path of `program` on PATH; `None` (with a note) where it is missing, except under CI
/// (the `CI` variable), where `.ci/setup` installs it and its absence is a failure.
#[expect(
    clippy::print_stderr,
    reason = "a skipped reference check says so, as tests/cli/window_kill.rs does"
)]
fn tool(program: &str) -> Option<PathBuf> {
    let found = std::env::var_os("PATH").and_then(|paths| {
        std::env::split_paths(&paths)
            .map(|p| p.join(program))
            .find(|p| p.is_file())
    });
    if found.is_none() {
        assert!(
            std::env::var_os("CI").is_none(),
            "{program} is needed under CI (.ci/setup installs poppler-utils)"
        );
        eprintln!("skipped: {program} (poppler-utils) is not installed");
    }
    found
}

fn run(program: &Path, args: &[&str]) -> String {
    let out = Command::new(program).args(args).output().expect("runs");
    assert!(
        out.status.success(),
        "{} {args:?}: {}",
        program.display(),
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8_lossy(&out.stdout).into_owned()
}

/// Runs of white space as one space, so a table row reads "turns 5.00".
fn squeeze(text: &str) -> String {
    text.split_whitespace().collect::<Vec<_>>().join(" ")
}

/// Mean and standard deviation of the luma of an image, 0–255.
fn luma_stats(img: &image::DynamicImage) -> (f64, f64) {
    let luma = img.to_luma8();
    let n = luma.pixels().len() as f64;
    let mean = luma.pixels().map(|p| f64::from(p.0[0])).sum::<f64>() / n;
    let var = luma
        .pixels()
        .map(|p| (f64::from(p.0[0]) - mean).powi(2))
        .sum::<f64>()
        / n;
    (mean, var.sqrt())
}

/// Pixels within `tol` of `rgb` in every channel.
fn pixels_near(img: &image::DynamicImage, rgb: [u8; 3], tol: u8) -> usize {
    img.to_rgb8()
        .pixels()
        .filter(|p| (0..3).all(|i| p.0[i].abs_diff(rgb[i]) <= tol))
        .count()
}

/// The amber end of the charts' trimmer ramp (the 100 % curve) and the present-coil blue:
/// the colours src/handout/chart_draw.rs draws them in.
const AMBER: [u8; 3] = [0xd9, 0x74, 0x1c];
const BLUE: [u8; 3] = [0x2f, 0x86, 0xd6];

fn demo_with_a_reading() -> Recipe {
    let mut recipe = Recipe::demo();
    let f = figures(&recipe).expect("demo is valid");
    // One reading near the model's own figure, so the table and the chart show one.
    recipe.bench_log.push(tankwright::recipe::BenchEntry {
        include_anyway: false,
        measured: f.target.resonance - 0.8e6,
        length: f.coil.length(),
        trimmer_setting: recipe.tank.trimmer_setting,
        added_capacitance: 0.0,
        instrument: "club counter".to_owned(),
        error_ppm: None,
        note: "first light".to_owned(),
        added_tolerance: None,
    });
    recipe
}

#[test]
fn the_build_sheet_reads_back_with_the_recipes_figures_and_renders_non_blank() {
    let (Some(pdfinfo), Some(pdftotext), Some(pdftoppm)) =
        (tool("pdfinfo"), tool("pdftotext"), tool("pdftoppm"))
    else {
        return;
    };
    let dir = tempfile::tempdir().expect("temp dir");
    let pdf = dir.path().join("sheet.pdf");
    let recipe = Recipe::demo();
    write_sheet(&recipe, &pdf, Footing::FieldSolution).expect("the sheet is written");
    let f = figures(&recipe).expect("valid");

    let info = run(&pdfinfo, &[pdf.to_str().expect("utf-8")]);
    assert!(squeeze(&info).contains("Pages: 3"), "{info}");

    let text = squeeze(&run(
        &pdftotext,
        &["-layout", pdf.to_str().expect("utf-8"), "-"],
    ));
    let g = &f.coil;
    let drills = former_drills(g);
    let expected = [
        format!("Build sheet: {}", recipe.name),
        format!("Worksheet: {}", recipe.name),
        format!("turns {}", digits::fixed(g.turns(), 2)),
        format!(
            "{} mm, a gap of {} mm between turns",
            digits::fixed(g.length() * 1e3, 2),
            digits::fixed(g.gap() * 1e3, 2)
        ),
        format!("former {} mm", digits::fixed(g.former_diameter() * 1e3, 3)),
        drills
            .metric
            .expect("a 6 mm former has a metric drill")
            .label,
        format!(
            "{} mm (the helix and both leads)",
            digits::fixed(g.wire_length() * 1e3, 0)
        ),
        format!("{} MHz", digits::channel_mhz(recipe.target.channel)),
        format!("predicted now {}", digits::mhz(f.target.resonance)),
        "Bench readings".to_owned(),
        "resonance (MHz)".to_owned(),
        "trimmer 100 %".to_owned(),
    ];
    for e in expected.iter().map(String::as_str).chain(BENCH_COLUMNS) {
        assert!(
            text.contains(e),
            "'{e}' is not in the extracted text:\n{text}"
        );
    }
    for (heading, _) in tankwright::cautions::NOTE {
        assert!(
            text.contains(heading),
            "caution '{heading}' missing:\n{text}"
        );
    }

    let prefix = dir.path().join("page");
    run(
        &pdftoppm,
        &[
            "-r",
            "50",
            "-png",
            pdf.to_str().expect("utf-8"),
            prefix.to_str().expect("utf-8"),
        ],
    );
    for page in 1..=3 {
        let png = dir.path().join(format!("page-{page}.png"));
        let img = image::open(&png).expect("pdftoppm wrote the page");
        // A4 at 50 dpi: 8.27 × 11.69 in.
        assert_eq!(img.dimensions(), (414, 585), "page {page}");
        let (mean, sigma) = luma_stats(&img);
        // A blank page is all white (mean 255, σ 0); a printed page of text is mostly white
        // with dark strokes.
        assert!(
            mean < 250.0 && sigma > 12.0,
            "page {page} looks blank: {mean} {sigma}"
        );
    }
    // The chart page carries the drawn curves and the present coil.
    let chart = image::open(dir.path().join("page-2.png")).expect("page 2");
    assert!(
        pixels_near(&chart, AMBER, 40) > 30,
        "no 100 % curve on the chart page"
    );
    assert!(
        pixels_near(&chart, BLUE, 40) > 5,
        "no present-coil mark on the chart page"
    );
}

#[test]
fn recorded_readings_fill_the_bench_table() {
    let Some(pdftotext) = tool("pdftotext") else {
        return;
    };
    let dir = tempfile::tempdir().expect("temp dir");
    let pdf = dir.path().join("sheet.pdf");
    let recipe = demo_with_a_reading();
    write_sheet(&recipe, &pdf, Footing::FieldSolution).expect("written");
    let text = squeeze(&run(
        &pdftotext,
        &["-layout", pdf.to_str().expect("utf-8"), "-"],
    ));
    let e = &recipe.bench_log[0];
    for expected in [
        digits::fixed(e.measured * 1e-6, 4),
        "club counter".to_owned(),
        "first light".to_owned(),
        "Calibrated on 1 bench reading".to_owned(),
    ] {
        assert!(text.contains(&expected), "'{expected}' missing:\n{text}");
    }
}

/// The `<polyline>`s of an SVG with at least `min_points` points, as (x, y) lists; also
/// checks the document parses to the end with `<svg>` as its root of the given size.
fn polylines(svg: &str, min_points: usize) -> (Vec<Vec<(f64, f64)>>, String) {
    let mut reader = Reader::from_str(svg);
    let mut lines = Vec::new();
    let mut texts = String::new();
    let mut root = None;
    loop {
        match reader.read_event().expect("the SVG parses") {
            Event::Eof => break,
            Event::Start(e) | Event::Empty(e) => {
                let name = String::from_utf8_lossy(e.name().as_ref()).into_owned();
                let attr = |key: &str| {
                    e.attributes()
                        .filter_map(Result::ok)
                        .find(|a| a.key.as_ref() == key.as_bytes())
                        .map(|a| String::from_utf8_lossy(&a.value).into_owned())
                };
                if root.is_none() {
                    root = Some((name.clone(), attr("width"), attr("height")));
                }
                if name == "polyline" {
                    let points: Vec<(f64, f64)> = attr("points")
                        .unwrap_or_default()
                        .split_whitespace()
                        .filter_map(|p| {
                            let (x, y) = p.split_once(',')?;
                            Some((x.parse().ok()?, y.parse().ok()?))
                        })
                        .collect();
                    if points.len() >= min_points {
                        lines.push(points);
                    }
                }
            }
            Event::Text(t) => {
                texts.push_str(&String::from_utf8_lossy(&t));
                texts.push('\n');
            }
            _ => {}
        }
    }
    let (w, h) = (CHART_SIZE.0.to_string(), CHART_SIZE.1.to_string());
    assert_eq!(root, Some(("svg".to_owned(), Some(w), Some(h))));
    (lines, texts)
}

#[test]
fn the_spacing_chart_svg_holds_every_curve_rising_with_the_length() {
    let recipe = Recipe::demo();
    let svg = String::from_utf8(
        chart_bytes(
            &recipe,
            ChartKind::Spacing,
            Path::new("x.svg"),
            Footing::FieldSolution,
        )
        .expect("drawn"),
    )
    .expect("SVG is text");
    let f = figures(&recipe).expect("valid");
    let data = chart_data(ChartKind::Spacing, &recipe, &f);
    let (lines, texts) = polylines(&svg, 100);
    assert_eq!(
        lines.len(),
        data.curves.len(),
        "one drawn line per trimmer setting"
    );
    for line in &lines {
        // Spreading the same turns lowers the inductance (Nagaoka's coefficient falls as the
        // coil lengthens), so the resonance rises: screen y falls as x grows.
        let (first, last) = (line[0], line[line.len() - 1]);
        assert!(
            last.0 > first.0 + 500.0,
            "the curve spans the chart: {first:?} {last:?}"
        );
        assert!(
            last.1 < first.1,
            "frequency rises with length: {first:?} {last:?}"
        );
    }
    for label in [
        "trimmer 0 %",
        "trimmer 100 %",
        "resonance (MHz)",
        "turns touching",
    ] {
        assert!(texts.contains(label), "'{label}' not in the SVG text");
    }
}

#[test]
fn the_trimmer_chart_svg_holds_one_falling_curve() {
    let recipe = Recipe::demo();
    let svg = String::from_utf8(
        chart_bytes(
            &recipe,
            ChartKind::Trimmer,
            Path::new("x.svg"),
            Footing::FieldSolution,
        )
        .expect("drawn"),
    )
    .expect("text");
    let (lines, texts) = polylines(&svg, 100);
    assert_eq!(lines.len(), 1);
    let line = &lines[0];
    // More trimmer capacitance, lower resonance (f = 1/(2π√(LC))): screen y grows with x.
    assert!(line[line.len() - 1].1 > line[0].1);
    assert!(texts.contains("trimmer setting (%)"));
}

#[test]
fn the_chart_pngs_decode_at_their_size_and_are_not_blank() {
    let recipe = demo_with_a_reading();
    for kind in ChartKind::ALL {
        let png =
            chart_bytes(&recipe, kind, Path::new("x.png"), Footing::FieldSolution).expect("drawn");
        let img =
            image::load_from_memory_with_format(&png, image::ImageFormat::Png).expect("a PNG");
        assert_eq!(img.dimensions(), CHART_SIZE);
        let (mean, sigma) = luma_stats(&img);
        assert!(
            mean < 252.0 && sigma > 10.0,
            "{kind:?} looks blank: {mean} {sigma}"
        );
        assert!(
            pixels_near(&img, BLUE, 30) > 40,
            "{kind:?}: no present mark"
        );
        if kind == ChartKind::Spacing {
            assert!(pixels_near(&img, AMBER, 30) > 500, "no 100 % curve");
        }
    }
}

#[test]
fn other_formats_are_refused_by_name_and_nothing_is_written() {
    let dir = tempfile::tempdir().expect("temp dir");
    let recipe = Recipe::demo();
    let jpg = dir.path().join("chart.jpg");
    let e =
        tankwright::handout::write_chart(&recipe, ChartKind::Spacing, &jpg, Footing::FieldSolution)
            .expect_err("JPEG is not offered");
    assert!(e.contains(".svg or .png"), "{e}");
    let html = dir.path().join("sheet.html");
    let e = write_sheet(&recipe, &html, Footing::FieldSolution).expect_err("only PDF");
    assert!(e.contains(".pdf"), "{e}");
    assert_eq!(std::fs::read_dir(dir.path()).expect("dir").count(), 0);
    // An invalid recipe is refused with the field named, and an earlier file stays.
    let pdf = dir.path().join("sheet.pdf");
    std::fs::write(&pdf, b"earlier").expect("write");
    let mut bad = recipe.clone();
    bad.winding.turns = -1.0;
    let e = write_sheet(&bad, &pdf, Footing::FieldSolution).expect_err("refused");
    assert!(e.contains("invalid recipe") && e.contains("turns"), "{e}");
    assert_eq!(std::fs::read(&pdf).expect("read"), b"earlier");
    assert_eq!(std::fs::read_dir(dir.path()).expect("dir").count(), 1);
}
