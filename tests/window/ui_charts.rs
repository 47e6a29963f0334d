//! The live charts and the coil drawing: the sweep cache, physics sanity of the curves, and
//! the widgets driven through egui_kittest in a tiny harness app.

use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use tankwright::model::{Coil, Conditions, Tank, evaluate_coil};
use tankwright::recipe::Recipe;
use tankwright::ui::charts::{
    ChartCache, ChartView, SPACING_CHART_LABEL, SpacingAxis, TRIMMER_CHART_LABEL, hover,
    spacing_chart, ticks, trimmer_chart,
};
use tankwright::ui::coil_view::{HANDLE_LABEL, coil_view};
use tankwright::ui::units::LengthUnit;

fn demo() -> (Coil, Tank, Conditions) {
    let r = Recipe::demo();
    let coil = Coil::from_winding(&r.winding).expect("the demo coil is valid");
    (coil, r.tank, r.conditions)
}

#[test]
fn refresh_recomputes_only_when_the_inputs_change() {
    let (coil, tank, conditions) = demo();
    let mut cache = ChartCache::default();
    assert!(
        cache.refresh(&coil, &tank, &conditions),
        "first call computes"
    );
    assert!(
        !cache.refresh(&coil, &tank, &conditions),
        "identical call keeps"
    );
    let longer = coil.with_length(coil.length() * 1.1).unwrap();
    assert!(
        cache.refresh(&longer, &tank, &conditions),
        "a new length recomputes"
    );
    assert!(!cache.refresh(&longer, &tank, &conditions));
    let turned = Tank {
        trimmer_setting: 0.8,
        ..tank
    };
    assert!(
        cache.refresh(&longer, &turned, &conditions),
        "a new setting recomputes"
    );
}

#[test]
fn sweep_covers_touching_to_past_the_present_length() {
    let (coil, tank, conditions) = demo();
    let mut cache = ChartCache::default();
    cache.refresh(&coil, &tank, &conditions);
    let (lo, hi) = cache.length_range_swept();
    approx::assert_relative_eq!(lo, coil.shortest_length(), max_relative = 1e-12);
    assert!(
        hi >= 1.5 * coil.length() - 1e-12,
        "{hi} vs {}",
        coil.length()
    );
    assert_eq!(cache.spacing_curves().len(), 5);
    for curve in cache.spacing_curves() {
        assert!(curve.points.len() >= 100);
        approx::assert_relative_eq!(curve.points[0][0], lo, max_relative = 1e-12);
    }
}

/// LC resonance f = 1/(2π√(LC)); Nagaoka: L falls as the coil lengthens, so f rises with
/// stretch; more trimmer capacitance lowers f at every length.
#[test]
fn curves_rise_with_stretch_and_fall_with_trimmer() {
    let (coil, tank, conditions) = demo();
    let mut cache = ChartCache::default();
    cache.refresh(&coil, &tank, &conditions);
    let curves = cache.spacing_curves();
    for curve in curves {
        for w in curve.points.windows(2) {
            assert!(w[1][0] > w[0][0]);
            assert!(
                w[1][1] > w[0][1],
                "trimmer {}: f falls from {} to {} Hz between {} and {} m",
                curve.setting,
                w[0][1],
                w[1][1],
                w[0][0],
                w[1][0]
            );
        }
    }
    for pair in curves.windows(2) {
        assert!(pair[1].setting > pair[0].setting);
        for (a, b) in pair[0].points.iter().zip(&pair[1].points) {
            assert!(b[1] < a[1], "more C must lower f at {} m", a[0]);
        }
    }
    let trimmer = cache.trimmer_curve();
    assert!(trimmer.len() >= 100);
    for w in trimmer.windows(2) {
        assert!(w[1][1] < w[0][1], "f must fall as the trimmer adds C");
    }
}

struct CoilState {
    coil: Coil,
    touching: f64,
    last: Option<f64>,
    calls: usize,
}

fn coil_harness() -> Harness<'static, CoilState> {
    let (coil, _, _) = demo();
    let state = CoilState {
        coil,
        touching: coil.shortest_length(),
        last: None,
        calls: 0,
    };
    Harness::builder()
        .with_size(egui::vec2(640.0, 360.0))
        .build_ui_state(
            move |ui, s: &mut CoilState| {
                if let Some(l) = coil_view(ui, &s.coil, LengthUnit::Millimetres) {
                    s.last = Some(l);
                    s.calls += 1;
                    s.coil = s.coil.with_length(l).unwrap();
                }
            },
            state,
        )
}

/// Drag the free-end handle by `dx` points in steps, returning the last length reported.
fn drag_handle(harness: &mut Harness<'_, CoilState>, dx: f32) -> Option<f64> {
    let start = harness.get_by_label(HANDLE_LABEL).rect().center();
    harness.hover_at(start);
    harness.run();
    harness.drag_at(start);
    harness.run();
    for i in 1..=5 {
        harness.hover_at(start + egui::vec2(dx * i as f32 / 5.0, 0.0));
        harness.run();
    }
    let last = harness.state().last;
    harness.drop_at(start + egui::vec2(dx, 0.0));
    harness.run();
    last
}

#[test]
fn dragging_the_free_end_right_stretches() {
    let mut harness = coil_harness();
    harness.run();
    let before = harness.state().coil.length();
    let after = drag_handle(&mut harness, 60.0).expect("the drag reports a length");
    assert!(after > before, "{after} should exceed {before}");
    // To scale: 60 points of drag is some fraction of the coil, not orders of magnitude off.
    assert!(after < 3.0 * before);
}

#[test]
fn dragging_the_free_end_left_stops_at_touching() {
    let mut harness = coil_harness();
    harness.run();
    let touching = harness.state().touching;
    let before = harness.state().coil.length();
    let after = drag_handle(&mut harness, -600.0).expect("the drag reports a length");
    assert!(after < before);
    assert!(
        after >= touching,
        "{after} went below the touching length {touching}"
    );
    approx::assert_relative_eq!(after, touching, max_relative = 1e-9);
    assert!(harness.state().calls >= 2, "reports while dragging");
}

#[test]
fn coil_view_returns_nothing_without_a_drag() {
    let mut harness = coil_harness();
    harness.run();
    let centre = harness.get_by_label(HANDLE_LABEL).rect().center();
    harness.hover_at(centre);
    harness.run();
    assert_eq!(harness.state().last, None);
}

struct ChartState {
    coil: Coil,
    tank: Tank,
    conditions: Conditions,
    cache: ChartCache,
    axis: SpacingAxis,
    spacing: Option<f64>,
    setting: Option<f64>,
}

fn chart_harness(axis: SpacingAxis) -> Harness<'static, ChartState> {
    let (coil, tank, conditions) = demo();
    let state = ChartState {
        coil,
        tank,
        conditions,
        cache: ChartCache::default(),
        axis,
        spacing: None,
        setting: None,
    };
    Harness::builder()
        .with_size(egui::vec2(800.0, 700.0))
        .build_ui_state(
            |ui, s: &mut ChartState| {
                s.cache.refresh(&s.coil, &s.tank, &s.conditions);
                let analysis = evaluate_coil(&s.coil, s.tank.external_capacitance(), &s.conditions);
                let view = ChartView {
                    uncalibrated: None,
                    classical: None,
                    readings: &[],
                    cache: &s.cache,
                    coil: &s.coil,
                    tank: &s.tank,
                    target_hz: 98.7e6,
                    channel_width_hz: 200e3,
                    resonance_hz: analysis.resonance,
                    axis: s.axis,
                    unit: LengthUnit::Millimetres,
                    overlays: &[],
                    operating: None,
                };
                let (spacing, setting) = ui
                    .vertical(|ui| {
                        let a = ui
                            .allocate_ui(egui::vec2(ui.available_width(), 320.0), |ui| {
                                spacing_chart(ui, &view)
                            })
                            .inner;
                        let b = ui
                            .allocate_ui(egui::vec2(ui.available_width(), 320.0), |ui| {
                                trimmer_chart(ui, &view)
                            })
                            .inner;
                        (a, b)
                    })
                    .inner;
                // Applied the way the window does, so that the next frame draws the new coil.
                if let Some(l) = spacing {
                    s.spacing = Some(l);
                    s.coil = s.coil.with_length(l).unwrap();
                }
                if let Some(t) = setting {
                    s.setting = Some(t);
                    s.tank.trimmer_setting = t;
                }
            },
            state,
        )
}

#[test]
fn clicking_the_spacing_chart_returns_a_length_in_range() {
    for axis in [SpacingAxis::Length, SpacingAxis::Gap] {
        let mut harness = chart_harness(axis);
        harness.run();
        let (lo, hi) = harness.state().cache.length_range_swept();
        assert_eq!(harness.state().spacing, None);
        harness.get_by_label(SPACING_CHART_LABEL).click();
        harness.run();
        let length = harness.state().spacing.expect("a click picks a length");
        assert!(
            (lo..=hi).contains(&length),
            "{axis:?}: {length} outside {lo}–{hi}"
        );
        // The centre of the chart is well inside the range, not clamped to an end.
        assert!(length > lo && length < hi);
        assert_eq!(
            harness.state().setting,
            None,
            "the trimmer chart was not touched"
        );
    }
}

#[test]
fn clicking_the_spacing_chart_further_right_picks_a_longer_coil() {
    let mut harness = chart_harness(SpacingAxis::Length);
    harness.run();
    let rect = harness.get_by_label(SPACING_CHART_LABEL).rect();
    let mut picked = Vec::new();
    for fraction in [0.3, 0.7] {
        let pos = egui::pos2(rect.left() + fraction * rect.width(), rect.center().y);
        harness.hover_at(pos);
        harness.run();
        harness.drag_at(pos);
        harness.drop_at(pos);
        harness.run();
        picked.push(harness.state().spacing.expect("a click picks a length"));
    }
    assert!(picked[1] > picked[0], "{picked:?}");
}

#[test]
fn clicking_the_trimmer_chart_returns_a_setting() {
    let mut harness = chart_harness(SpacingAxis::Length);
    harness.run();
    harness.get_by_label(TRIMMER_CHART_LABEL).click();
    harness.run();
    let setting = harness.state().setting.expect("a click picks a setting");
    assert!((0.0..=1.0).contains(&setting));
    assert!(
        (0.2..0.8).contains(&setting),
        "centre click near 50 %: {setting}"
    );
    assert_eq!(harness.state().spacing, None);
}

#[test]
fn charts_draw_before_the_first_refresh() {
    let (coil, tank, _) = demo();
    let cache = ChartCache::default();
    let mut harness = Harness::builder()
        .with_size(egui::vec2(600.0, 400.0))
        .build_ui(move |ui| {
            let view = ChartView {
                uncalibrated: None,
                classical: None,
                readings: &[],
                cache: &cache,
                coil: &coil,
                tank: &tank,
                target_hz: f64::NAN,
                channel_width_hz: 0.0,
                resonance_hz: f64::NAN,
                axis: SpacingAxis::Gap,
                unit: LengthUnit::Inches,
                overlays: &[],
                operating: None,
            };
            ui.columns(2, |c| {
                let _ = spacing_chart(&mut c[0], &view);
                let _ = trimmer_chart(&mut c[1], &view);
            });
        });
    harness.run();
    harness.get_by_label(SPACING_CHART_LABEL);
    harness.get_by_label(TRIMMER_CHART_LABEL);
}

/// Dragging stretches the sweep past the present length; the axis must hold still under the
/// pointer for the drag, or holding the pointer near the right edge would stretch for ever.
#[test]
fn dragging_the_spacing_chart_holds_the_axis_under_the_pointer() {
    let mut harness = chart_harness(SpacingAxis::Length);
    harness.run();
    let rect = harness.get_by_label(SPACING_CHART_LABEL).rect();
    let start = rect.center();
    let edge = egui::pos2(rect.left() + 0.97 * rect.width(), start.y);
    harness.hover_at(start);
    harness.run();
    harness.drag_at(start);
    harness.run();
    harness.hover_at(edge);
    harness.run();
    let first = harness.state().spacing.expect("the drag picks a length");
    let mut seen = vec![first];
    for i in 0..6 {
        // Tiny moves keep the drag alive frame after frame at (nearly) the same place.
        let jiggle = if i % 2 == 0 { 0.5 } else { 0.0 };
        harness.hover_at(edge + egui::vec2(jiggle, 0.0));
        harness.run();
        seen.push(harness.state().spacing.expect("still dragging"));
    }
    harness.drop_at(edge);
    harness.run();
    let (min, max) = seen
        .iter()
        .fold((f64::MAX, f64::MIN), |(a, b), &x| (a.min(x), b.max(x)));
    assert!(
        max <= min * 1.01,
        "the length ran away while the pointer held still: {seen:?}"
    );
    assert!(first > harness.state().cache.length_range_swept().0);
}

#[test]
fn the_free_end_steps_from_the_keyboard_and_a_screen_reader() {
    let mut harness = coil_harness();
    harness.run();
    let before = harness.state().coil.length();

    harness.get_by_label(HANDLE_LABEL).increment_accesskit();
    harness.run();
    let stepped = harness.state().last.expect("an increment reports a length");
    approx::assert_relative_eq!(stepped, before + 0.1e-3, max_relative = 1e-9);

    harness.get_by_label(HANDLE_LABEL).set_value_accesskit(6.5);
    harness.run();
    approx::assert_relative_eq!(harness.state().coil.length(), 6.5e-3, max_relative = 1e-9);

    harness.get_by_label(HANDLE_LABEL).focus();
    harness.run();
    harness.key_press(egui::Key::ArrowRight);
    harness.run();
    approx::assert_relative_eq!(harness.state().coil.length(), 6.6e-3, max_relative = 1e-9);

    // Squeezing by screen reader stops at the touching limit too.
    let touching = harness.state().touching;
    harness.get_by_label(HANDLE_LABEL).set_value_accesskit(0.0);
    harness.run();
    approx::assert_relative_eq!(harness.state().coil.length(), touching, max_relative = 1e-9);
}

/// Every grid mark of an axis from `lo` to `lo + span` on `width` points, with labels at
/// least `room` points apart (as the charts ask): (labelled step, labelled marks).
fn labelled(lo: f64, span: f64, width: f64, room: f32) -> (f64, Vec<egui_plot::GridMark>) {
    let input = egui_plot::GridInput {
        bounds: (lo, lo + span),
        base_step_size: span / width * f64::from(ticks::GRID_MIN_POINTS),
    };
    let marks = ticks::marks(&input, room);
    let step = marks.iter().map(|m| m.step_size).fold(0.0, f64::max);
    let labelled = marks.into_iter().filter(|m| m.step_size == step).collect();
    (step, labelled)
}

/// Axis ticks step by 1, 2 or 5 × 10^k (the usual steps of a chart scale: common practice),
/// the smallest such step that leaves room for a label, at every zoom and unit. The two axes
/// the issue saw fail ("0" alone on a 0–0.6 mm gap axis, "1" alone on an inch axis) get
/// several distinct labels.
#[test]
fn axis_ticks_fall_on_1_2_5_steps_with_room_for_distinct_labels_at_every_zoom() {
    let room = ticks::X_LABEL_FADE.1;
    for span in [
        0.03, 0.3, 0.62, 1.0, 2.5, 7.0, 13.0, 40.0, 104.0, 250.0, 3000.0,
    ] {
        for lo in [-0.02 * span, 0.0, 0.17, 88.3] {
            for width in [160.0, 200.0, 250.0, 400.0, 800.0, 1600.0] {
                let (step, marks) = labelled(lo, span, width, room);
                let mantissa = step / 10f64.powf(step.log10().floor());
                assert!(
                    [1.0, 2.0, 5.0].iter().any(|m| (mantissa - m).abs() < 1e-9),
                    "step {step} for span {span} on {width} points"
                );
                let points = step * width / span;
                // Room for the label, and never more than one step of the series too coarse.
                assert!(
                    points >= f64::from(room) - 1e-6 && points < 2.5 * f64::from(room) + 1e-6,
                    "labels {points} points apart (span {span}, width {width})"
                );
                if width >= 2.5 * 2.0 * f64::from(room) {
                    assert!(
                        marks.len() >= 2,
                        "{} labels (span {span}, width {width})",
                        marks.len()
                    );
                }
                let texts: Vec<String> = marks.iter().map(|m| ticks::label(*m)).collect();
                for (m, t) in marks.iter().zip(&texts) {
                    let read: f64 = t.parse().expect("a number");
                    assert!(
                        (read - m.value).abs() <= 1e-6 * step.max(1.0),
                        "{t} for {}",
                        m.value
                    );
                    assert_ne!(t, "-0", "negative zero");
                }
                let mut distinct = texts.clone();
                distinct.dedup();
                assert_eq!(distinct, texts, "repeated labels");
            }
        }
    }
    // The axes, as drawn at 1280×720 (about 190 points of plot).
    let gap: Vec<String> = labelled(-0.024, 0.624, 190.0, room)
        .1
        .into_iter()
        .map(ticks::label)
        .collect();
    assert_eq!(gap, ["0.0", "0.2", "0.4", "0.6"]);
    let inches: Vec<String> = labelled(0.2, 0.4, 190.0, room)
        .1
        .into_iter()
        .map(ticks::label)
        .collect();
    assert_eq!(inches, ["0.2", "0.4", "0.6"]);
}

/// Hover text reads each curve at the pointer's length (interpolated along the sweep), not
/// the pointer's height: at the present coil the curve for the present trimmer setting gives
/// the engine's own resonance, to within the display's 1 kHz plus the interpolation error
/// (bounded by an eighth of the sweep's largest second difference).
#[test]
fn hover_reads_the_curves_at_the_pointers_length() {
    let (coil, tank, conditions) = demo();
    let mut cache = ChartCache::default();
    cache.refresh(&coil, &tank, &conditions);
    let exact = evaluate_coil(&coil, tank.external_capacitance(), &conditions).resonance;
    let present = cache
        .spacing_curves()
        .iter()
        .find(|c| (c.setting - tank.trimmer_setting).abs() < 1e-12)
        .expect("a curve at the demo's 50 %");
    let bend = present
        .points
        .windows(3)
        .map(|w| (w[2][1] - 2.0 * w[1][1] + w[0][1]).abs())
        .fold(0.0, f64::max);
    let allowed_khz = 0.5 + bend / 8.0 * 1e-3 + 1e-9;
    for (axis, unit) in [
        (SpacingAxis::Length, LengthUnit::Millimetres),
        (SpacingAxis::Gap, LengthUnit::Millimetres),
        (SpacingAxis::Length, LengthUnit::Inches),
    ] {
        let view = ChartView {
            uncalibrated: None,
            classical: None,
            readings: &[],
            cache: &cache,
            coil: &coil,
            tank: &tank,
            target_hz: 98.7e6,
            channel_width_hz: 200e3,
            resonance_hz: exact,
            axis,
            unit,
            overlays: &[],
            operating: None,
        };
        let x = view.x_of_length(coil.length());
        let text = hover::spacing_text(&view, x);
        let line = text
            .lines()
            .find(|l| l.starts_with("trimmer 50 %: "))
            .unwrap_or_else(|| panic!("no 50 % curve in {text:?}"));
        let shown: f64 = line
            .trim_start_matches("trimmer 50 %: ")
            .trim_end_matches(" MHz")
            .parse()
            .expect("MHz");
        assert!(
            (shown * 1e3 - exact * 1e-3).abs() <= allowed_khz,
            "{axis:?}/{unit:?}: {shown} MHz against {exact} Hz"
        );
        // Every curve is read, the higher settings lower.
        assert_eq!(
            text.lines().filter(|l| l.starts_with("trimmer ")).count(),
            5
        );
        // Left of the touching limit there is no coil to read.
        let left = view.x_of_length(coil.shortest_length()) - 0.1;
        assert!(hover::spacing_text(&view, left).contains("turns touching"));
        // The trimmer chart reads its curve at the pointer's setting.
        let t = hover::trimmer_text(&view, tank.trimmer_setting * 100.0);
        let shown: f64 = t
            .lines()
            .nth(1)
            .expect("a resonance line")
            .trim_start_matches("resonance ")
            .trim_end_matches(" MHz")
            .parse()
            .expect("MHz");
        assert!((shown * 1e3 - exact * 1e-3).abs() <= 1.0, "{t}");
    }
}
