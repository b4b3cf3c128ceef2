// What the case report shows beyond the gap field: back-EMF with its rms and THD, flux linkages
// and dq inductances of a turning rotor, iron loss per region, the eddy-current curves against
// slip; round-off printed as 0, angle axes that end at 360°, inputs that wrap and apply.

#include <doctest/doctest.h>

#include <cmath>
#include <numbers>
#include <regex>
#include <string>
#include <vector>

#include "post/case_report.hpp"
#include "post/flux_quantities.hpp"
#include "post/report_parts.hpp"
#include "post/svg_plot.hpp"
#include "post/waveform.hpp"

using namespace tf;
namespace svg = tf::post::svg;

namespace {

constexpr double kPi = std::numbers::pi;

/// Number of points of each class="data" path of an SVG.
std::vector<std::size_t> path_sizes(const std::string& s) {
  std::vector<std::size_t> out;
  const std::regex path(R"re(<path class="data"[^>]*\bd="([^"]*)")re");
  for (auto it = std::sregex_iterator(s.begin(), s.end(), path); it != std::sregex_iterator(); ++it) {
    const std::string d = (*it)[1];
    out.push_back(static_cast<std::size_t>(std::count(d.begin(), d.end(), 'M') + std::count(d.begin(), d.end(), 'L')));
  }
  return out;
}

const post::Figure* figure(const post::Page& p, const std::string& name) {
  for (const auto& f : p.figures)
    if (f.name == name) return &f;
  return nullptr;
}

const post::Table* table(const post::Page& p, const std::string& heading) {
  for (const auto& t : p.tables)
    if (t.heading == heading) return &t;
  return nullptr;
}

std::string row_value(const post::Page& p, const std::string& key) {
  for (const auto& s : p.sections)
    for (const auto& r : s.rows)
      if (r.key == key) return r.value;
  return "(none)";
}

/// The classic inductance matrix of a salient three-phase machine with the d axis at theta_e
/// (P. C. Krause, O. Wasynczuk, S. D. Sudhoff, Analysis of Electric Machinery and Drive Systems,
/// 2nd ed., Wiley 2002, ch. 5, from memory): L_kk = L_l + L_A + L_B cos 2(theta - k 120°),
/// L_kj = -L_A / 2 + L_B cos(2 theta - (k + j) 120°); then L_d = L_l + 3/2 (L_A + L_B) and
/// L_q = L_l + 3/2 (L_A - L_B).
Eigen::MatrixXd salient_inductances(double theta, double l_leak, double l_a, double l_b) {
  Eigen::MatrixXd l(3, 3);
  const double delta = 2 * kPi / 3;
  for (int k = 0; k < 3; ++k)
    for (int j = 0; j < 3; ++j)
      l(k, j) = k == j ? l_leak + l_a + l_b * std::cos(2 * (theta - k * delta))
                       : -l_a / 2 + l_b * std::cos(2 * theta - (k + j) * delta);
  return l;
}

/// A rotor-motion result over one electrical period (p = 2: 180° mech.) in 36 steps: each phase's
/// EMF 10 sin + 2 sin 5th + 1 sin 7th [V], flux linkage 0.1 cos [Wb], the salient matrix above.
post::MotionResult constructed_motion() {
  post::MotionResult r;
  const int n = 36, p = 2;
  for (int k = 0; k < n; ++k) {
    post::PositionStep s;
    s.rotor_angle = kPi * k / n;
    const double e = p * s.rotor_angle;  // electrical angle, d axis on phase A at step 0
    for (int ph = 0; ph < 3; ++ph) {
      const double a = e - ph * 2 * kPi / 3;
      s.back_emf.push_back(10 * std::sin(a) + 2 * std::sin(5 * a) + 1 * std::sin(7 * a));
      s.flux_linkage.push_back(0.1 * std::cos(a));
    }
    s.inductance_frozen = s.inductance_incremental = salient_inductances(e, 1e-3, 4e-3, 1e-3);
    s.inductance_dq_apparent = s.inductance_dq_incremental = post::dq_inductances(s.inductance_frozen, e);
    r.steps.push_back(s);
  }
  r.speed = 50.0;
  r.iron_loss = {{"stator_iron", 12.0}, {"rotor_iron", 3.0}};
  return r;
}

}  // namespace

TEST_CASE("THD of a waveform with known harmonics, by the IEEE 519 definition, and its rms") {
  // THD = sqrt(sum_{h>=2} X_h^2) / X_1 (IEEE Std 519-2014 and IEC 61000-2-2, from memory):
  // 10 sin + 2 sin 5th + 1 sin 7th has THD sqrt(4 + 1) / 10 exactly. A mean of 0.5 and a wave at
  // half the fundamental's frequency (an interharmonic over two periods) are no harmonics.
  std::vector<double> e;
  const int n = 144, periods = 2;
  for (int j = 0; j < n; ++j) {
    const double a = 2 * kPi * periods * j / n;
    e.push_back(0.5 + 10 * std::sin(a) + 2 * std::sin(5 * a + 0.3) + std::sin(7 * a) + 3 * std::cos(a / 2));
  }
  CHECK(post::total_harmonic_distortion(e, periods) == doctest::Approx(std::sqrt(5.0) / 10).epsilon(1e-12).scale(0));
  // rms of orthogonal parts: sqrt(0.5^2 + (10^2 + 2^2 + 1^2 + 3^2) / 2) (Parseval).
  CHECK(post::rms(e) == doctest::Approx(std::sqrt(0.25 + 114.0 / 2)).epsilon(1e-12).scale(0));
  // 144 samples over 2 periods resolve orders up to 35; IEEE 519 counts up to the 50th.
  CHECK(post::highest_harmonic(n, periods) == 35);
  CHECK(post::highest_harmonic(400, 1) == 50);
  CHECK(std::isnan(post::total_harmonic_distortion(std::vector<double>(36, 0.0), 1)));
}

TEST_CASE("dq inductances of the classic salient three-phase matrix are L_l + 3/2 (L_A +- L_B)") {
  for (double theta : {0.0, 0.4, 2.0, -1.3}) {
    const post::DqPair l = post::dq_inductances(salient_inductances(theta, 1e-3, 4e-3, 1e-3), theta);
    CHECK(l.d == doctest::Approx(1e-3 + 1.5 * 5e-3).epsilon(1e-12).scale(0));
    CHECK(l.q == doctest::Approx(1e-3 + 1.5 * 3e-3).epsilon(1e-12).scale(0));
  }
}

TEST_CASE("the report of a turning rotor draws back-EMF and flux per phase, tabulates rms, THD and iron loss") {
  const post::MotionResult motion = constructed_motion();
  post::RunRecord r;
  r.motion = &motion;
  r.rotor_turns = true;
  const post::ReportContext x{"motion", "synchronous", "the whole cross-section", "{}", 2, 0.93, {}};
  const post::Page page = post::study_page(x, r);
  for (const char* name : {"back_emf", "flux_linkage", "dq_inductance"}) {
    INFO(name);
    const post::Figure* f = figure(page, name);
    REQUIRE(f != nullptr);
    const auto sizes = path_sizes(f->svg);
    REQUIRE(sizes.size() >= 2);
    for (std::size_t k : sizes) CHECK(k == 36);  // every step drawn
  }
  const post::Table* emf = table(page, "Back-EMF per phase");
  REQUIRE(emf != nullptr);
  REQUIRE(emf->rows.size() == 3);
  // rms sqrt((100 + 4 + 1) / 2) = 7.2457 V and THD sqrt(5)/10 = 22.36 % for every phase (Parseval; IEEE 519).
  for (const auto& row : emf->rows) {
    CHECK(std::stod(row[1].text) == doctest::Approx(std::sqrt(52.5)).epsilon(1e-4).scale(0));
    CHECK(std::stod(row[3].text) == doctest::Approx(100 * std::sqrt(5.0) / 10).epsilon(1e-3).scale(0));
  }
  CHECK(std::stod(row_value(page, "L_d, apparent (mean over steps)")) == doctest::Approx(8.5).epsilon(1e-4).scale(0));
  CHECK(std::stod(row_value(page, "L_q, apparent (mean over steps)")) == doctest::Approx(5.5).epsilon(1e-4).scale(0));
  const post::Table* loss = table(page, "Iron loss per region");
  REQUIRE(loss != nullptr);
  REQUIRE(loss->rows.size() == 3);
  CHECK(loss->rows[0][0].text == "stator_iron");
  CHECK(loss->rows[0][2].text == "80");  // 12 of 15 W
  CHECK(loss->rows[2][1].text == "15");
}

TEST_CASE("an eddy-current report draws torque, EMF and rotor loss against a log slip axis and torque against rpm") {
  std::vector<post::SpeedResult> rows;
  for (double s : {1.0, 0.3, 0.1, 0.03, 0.01, 0.003}) {
    post::SpeedResult r;
    r.slip = s, r.rotor_speed = (1 - s) * 50 * kPi;
    r.torque = 2 * s / (s * s + 0.01), r.torque_lorentz = r.torque;  // a Kloss-like curve peaking at s = 0.1
    r.rotor_loss = r.torque * s * 50 * kPi, r.rotor_loss_balance = r.rotor_loss;
    r.emf_rms = {30 + 10 * (1 - s), 30 + 10 * (1 - s), 30 + 10 * (1 - s)};
    rows.push_back(r);
  }
  post::EddyResult eddy;
  eddy.rows = rows;
  post::RunRecord record;
  record.eddy = &eddy;
  const post::Page page = post::study_page({"cage", "eddy_currents", "the whole cross-section", "{}", 2, 0.93, {}}, record);
  const post::Figure* torque = figure(page, "torque_slip");
  REQUIRE(torque != nullptr);
  CHECK(torque->svg.find("slip s (log scale)") != std::string::npos);
  // On a log axis the six slips, a factor of about 3 apart, are spread over the whole plot width:
  // pixel x = left + (log10 s - log10 0.002) / (log10 1 - log10 0.002) (right - left), ticks 0.002 .. 1.
  const std::regex first(R"re(<path class="data"[^>]*\bd="M([0-9.]+) [0-9.]+L([0-9.]+))re");
  std::smatch m;
  REQUIRE(std::regex_search(torque->svg, m, first));
  const double span = svg::kPlotRight - svg::kPlotLeft, decades = std::log10(1 / 0.002);
  CHECK(std::stod(m[1]) == doctest::Approx(svg::kPlotRight).epsilon(1e-3).scale(0));  // s = 1 at the right end
  CHECK(std::stod(m[2]) ==
        doctest::Approx(svg::kPlotLeft + (std::log10(0.3) - std::log10(0.002)) / decades * span).epsilon(1e-3).scale(0));
  for (const char* name : {"torque_speed", "emf_slip", "rotor_loss"}) {
    INFO(name);
    REQUIRE(figure(page, name) != nullptr);
    for (std::size_t k : path_sizes(figure(page, name)->svg)) CHECK(k == 6);
  }
  CHECK(figure(page, "torque_speed")->svg.find("rotor speed [rpm]") != std::string::npos);
}

TEST_CASE("log ticks: 1, 2, 5 per decade around the data") {
  CHECK(svg::log_ticks(0.003, 1.0) == std::vector<double>{0.002, 0.005, 0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1.0});
  CHECK(svg::log_ticks(1e-6, 1.0) == std::vector<double>{1e-6, 1e-5, 1e-4, 1e-3, 1e-2, 0.1, 1.0});
}

TEST_CASE("round-off prints as 0 against the largest value shown, and angle axes end at 360 degrees") {
  // A ripple of 5.81e-13 beside a fundamental of 1 is round-off (|x| < 1e-9 of the largest): 0.
  CHECK(svg::format_number_against(5.81e-13 * 100, 100) == "0");
  CHECK(svg::format_number_against(-3e-10, 1.0) == "0");
  CHECK(svg::format_number_against(2e-9, 1.0) == "2e-09");  // above the threshold it keeps its digits
  CHECK(svg::format_number_against(0.25, 1.0) == "0.25");
  CHECK(post::column_text({1.2e-12, 3.5, -2.0}, 4) == std::vector<std::string>{"0", "3.5", "-2"});
  // A whole turn sampled every 5 degrees (0 .. 355) ends at 360 in steps of 45 (common practice for angle axes).
  CHECK(svg::angle_ticks(0, 355) == std::vector<double>{0, 45, 90, 135, 180, 225, 270, 315, 360});
  CHECK(svg::angle_ticks(0, 175) == std::vector<double>{0, 30, 60, 90, 120, 150, 180});
  CHECK(svg::angle_ticks(0, 14.6).back() == 16);
  svg::Series wave{"B_r", {}, {}};
  for (int k = 0; k < 72; ++k) wave.x.push_back(5.0 * k), wave.y.push_back(std::sin(kPi * k / 36));
  const std::string s = svg::line_chart({"wave", {"angle θ", "°"}, {"B_r", "T"}, {wave}, {}});
  CHECK(s.find(">360</text>") != std::string::npos);
  CHECK(s.find(">400</text>") == std::string::npos);
}

TEST_CASE("inputs: long arrays wrap as comma-separated values, and only the inputs that apply are listed") {
  std::string h = "[", b = "[";
  for (int k = 0; k < 22; ++k) h += (k ? "," : "") + std::to_string(1000 * k), b += (k ? "," : "") + std::to_string(0.1 * k);
  const std::string json = R"({"rotor": {"kind": "slotted", "sleeve_thickness_m": 0.0},
    "study": {"kind": "phase_angles", "rotor_speeds_rad_per_s": [], "steps": 12, "load_angle_deg": 0},
    "materials": {"magnet_remanence_T": 1.2, "bar_conductivity_S_per_m": 3e7, "sleeve_relative_permeability": 1,
                  "stator_iron_conductivity_S_per_m": 0, "rotor_iron_bh_curve": null,
                  "stator_iron_bh_curve": {"h": )" + h + "], \"b\": " + b + "]}}}";
  const post::Section s = post::inputs_section(json);
  std::vector<std::string> keys;
  for (const auto& r : s.rows) keys.push_back(r.key);
  // An iron (cage) rotor has no magnets or sleeve; a magnetostatic study no conductivities or speeds.
  CHECK(keys == std::vector<std::string>{"materials.stator_iron_bh_curve.b",
                                         "materials.stator_iron_bh_curve.h", "rotor.kind", "study.kind", "study.steps"});
  // 22 values separated by ", ": a browser breaks the line at the spaces; no word is longer than a number.
  const std::string& table = s.rows[1].value;
  CHECK(std::count(table.begin(), table.end(), ',') == 21);
  CHECK(table.find(", ") != std::string::npos);
  CHECK(table.find(' ') != std::string::npos);
  std::size_t longest = 0, run = 0;
  for (char ch : table) run = ch == ' ' ? 0 : run + 1, longest = std::max(longest, run);
  CHECK(longest <= 7);  // "21000," is the longest
}
