//! Issue 21's hand-out charts: a fixed tank's chart and sheet, a reading taken with a
//! capacitor clipped on drawn apart, the PNG's curves smoothed and its legend in a column of
//! its own. The files are read back as a person's viewer would: the PNG decoded by `image`,
//! the SVG as text.
//!
//! Sources: the resonance of an LC tank, f = 1/(2π√(LC)) (Thomson's formula): with no
//! variable capacitance a tank has one resonance per coil length, so a fixed tank has one
//! curve and no trimmer chart. Anti-aliasing by supersampling: F. C. Crow, "The aliasing
//! problem in computer-generated shaded images", Communications of the ACM 20(11), 1977: a
//! pixel's colour is the mean over its area, so an edge crossing a pixel leaves a colour
//! between the two sides'.

use image::GenericImageView;
use std::path::Path;
use tankwright::handout::{
    CHART_SIZE, ChartKind, chart_bytes, chart_data, chart_file_layout, sheet,
};
use tankwright::recipe::{BenchEntry, Footing, Recipe, figures, store};
use tankwright::tuning::sweep::FIXED_CURVE_LABEL;

fn shipped(name: &str) -> Recipe {
    let path = Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("assets/recipes")
        .join(name);
    store::load(&path).unwrap_or_else(|e| panic!("{name}: {e}"))
}

/// The shipped apprentice exercise is a fixed tank (trimmer 0–0 pF).
const FIXED: &str = "apprentice_enamel_exercise.ron";

#[test]
fn a_fixed_tank_has_one_curve_no_trimmer_chart_and_a_sheet_on_length_only() {
    let recipe = shipped(FIXED);
    assert!(recipe.tank.is_fixed());
    let e = chart_bytes(
        &recipe,
        ChartKind::Trimmer,
        Path::new("x.png"),
        Footing::FieldSolution,
    )
    .expect_err("no trimmer chart for a fixed tank");
    assert!(e.contains("fixed tank"), "{e}");
    let f = figures(&recipe).expect("valid");
    let data = chart_data(ChartKind::Spacing, &recipe, &f);
    assert_eq!(data.curves.len(), 1);
    assert_eq!(data.curves[0].label, FIXED_CURVE_LABEL);
    assert!(data.fixed_tank);

    let s = sheet(&recipe, Footing::FieldSolution).expect("sheet");
    let trimmer = s
        .tank
        .iter()
        .find(|r| r.0 == "trimmer")
        .expect("a trimmer row");
    assert!(trimmer.1.starts_with("none"), "{:?}", trimmer.1);
    assert!(s.target.iter().all(|r| !r.0.contains("trimmer")));
    for step in &s.steps {
        assert!(!step.contains("trimmer"), "{step}");
    }
    assert!(s.steps.iter().any(|l| l.contains("only adjustment")));
    let same = tankwright::tuning::digits::mhz_range(f.target.resonance, f.target.resonance);
    for line in s.verdict.iter().chain(&s.expect) {
        assert!(!line.contains(&same), "{line}");
        assert!(!line.contains("trimmer's travel"), "{line}");
    }
}

/// A demo reading at the present length taken with 10 pF clipped across the tank.
fn demo_with_a_clipped_reading() -> Recipe {
    let mut recipe = Recipe::demo();
    let f = figures(&recipe).expect("demo is valid");
    let entry = |measured: f64, added: f64| BenchEntry {
        include_anyway: false,
        measured,
        length: f.coil.length(),
        trimmer_setting: recipe.tank.trimmer_setting,
        added_capacitance: added,
        instrument: "club counter".to_owned(),
        error_ppm: None,
        note: String::new(),
        added_tolerance: None,
    };
    let plain = entry(f.target.resonance - 0.8e6, 0.0);
    let clipped = entry(f.target.resonance - 9.0e6, 10e-12);
    recipe.bench_log.push(plain);
    recipe.bench_log.push(clipped);
    recipe
}

#[test]
fn a_clipped_on_reading_is_drawn_apart_in_the_exported_charts() {
    let recipe = demo_with_a_clipped_reading();
    let f = figures(&recipe).expect("valid");
    for kind in ChartKind::ALL {
        let data = chart_data(kind, &recipe, &f);
        assert_eq!(data.readings.len(), 1, "{kind:?}");
        assert_eq!(data.clipped.len(), 1, "{kind:?}");
        assert!((data.clipped[0].2 - 10.0).abs() < 1e-9);
        let svg =
            chart_bytes(&recipe, kind, Path::new("x.svg"), Footing::FieldSolution).expect("drawn");
        let text = String::from_utf8(svg).expect("UTF-8");
        assert!(
            text.contains("+10.0 pF"),
            "{kind:?}: no label on the clipped reading"
        );
        assert!(
            text.contains("capacitor clipped on"),
            "{kind:?}: no legend entry"
        );
    }
}

fn rgb(img: &image::DynamicImage, x: u32, y: u32) -> [f64; 3] {
    let p = img.get_pixel(x, y).0;
    [f64::from(p[0]), f64::from(p[1]), f64::from(p[2])]
}

/// How far `p` lies between white (0) and `ink` (1), if it lies on that line within 6 levels.
fn blend_of(p: [f64; 3], ink: [f64; 3]) -> Option<f64> {
    let w = 255.0;
    let d: Vec<f64> = (0..3).map(|i| w - ink[i]).collect();
    let t = (0..3).map(|i| (w - p[i]) * d[i]).sum::<f64>() / d.iter().map(|v| v * v).sum::<f64>();
    let off = (0..3)
        .map(|i| (w - t * d[i] - p[i]).abs())
        .fold(0.0, f64::max);
    (off <= 6.0).then_some(t)
}

/// The 2 m buffer's spacing chart as a PNG: the size promised, its amber 100 % curve edged
/// with pixels part amber and part white (the supersampled edge, Crow 1977) where a
/// whole-pixel polygon fill leaves none, and the legend kept to its column: no pixel of the
/// curves' amber right of the swatches, where only the legend's names are.
#[test]
fn the_png_chart_is_smooth_and_its_legend_keeps_to_its_column() {
    let recipe = shipped("lantern_hill_two_metre_buffer.ron");
    let png = chart_bytes(
        &recipe,
        ChartKind::Spacing,
        Path::new("x.png"),
        Footing::FieldSolution,
    )
    .expect("drawn");
    let img = image::load_from_memory_with_format(&png, image::ImageFormat::Png).expect("PNG");
    assert_eq!(img.dimensions(), CHART_SIZE);
    let layout = chart_file_layout();
    assert!(layout.legend_left < CHART_SIZE.0 && layout.legend_text_left > layout.legend_left);
    let amber = [f64::from(0xd9u8), f64::from(0x74u8), f64::from(0x1cu8)];
    let (mut edge, mut solid) = (0, 0);
    for y in layout.title_height..CHART_SIZE.1 {
        for x in 0..layout.legend_left {
            match blend_of(rgb(&img, x, y), amber) {
                Some(t) if (0.2..0.8).contains(&t) => edge += 1,
                Some(t) if t >= 0.95 => solid += 1,
                _ => {}
            }
        }
    }
    assert!(
        solid > 300,
        "the 100 % curve is drawn: {solid} amber pixels"
    );
    assert!(
        edge * 4 > solid,
        "a smooth edge: {edge} part-amber pixels beside {solid} amber ones"
    );
    let mut in_names = 0;
    let mut dark = 0;
    for y in layout.title_height..CHART_SIZE.1 {
        for x in layout.legend_text_left..CHART_SIZE.0 {
            let p = rgb(&img, x, y);
            if blend_of(p, amber).is_some_and(|t| t > 0.5) {
                in_names += 1;
            }
            if p.iter().all(|v| *v < 100.0) {
                dark += 1;
            }
        }
    }
    assert_eq!(in_names, 0, "curve colour among the legend's names");
    assert!(
        dark > 200,
        "the legend's names are written in the column: {dark} dark pixels"
    );
}
