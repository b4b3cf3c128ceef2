// The help the command line gives: the nearest command or option to a mistyped one, every study
// kind in `run --help`, and the derived geometry `check` prints.

#include <doctest/doctest.h>

#include <string>

#include "input/study_plan.hpp"
#include "support/cli_run.hpp"

using tf::testing::turnfield;

namespace {

const std::string source_dir = TF_SOURCE_DIR;

bool contains(const std::string& text, const std::string& part) { return text.find(part) != std::string::npos; }

}  // namespace

TEST_CASE("a mistyped command or option gets the nearest valid one; exit 2") {
  const auto command = turnfield("rnu " + source_dir + "/cases/pump24_three_phase.toml");
  CHECK(command.status == 2);
  CHECK(contains(command.output, "'rnu' is no command; did you mean 'run'?"));
  const auto option = turnfield("run --fineess 2 " + source_dir + "/cases/pump24_three_phase.toml");
  CHECK(option.status == 2);
  CHECK(contains(option.output, "'--fineess' is no option of 'run'; did you mean '--fineness'?"));
  // Nothing close: the valid options are listed instead.
  const auto far = turnfield("check --jobs 2 " + source_dir + "/cases/pump24_three_phase.toml");
  CHECK(far.status == 2);
  CHECK(contains(far.output, "'--jobs' is no option of 'check'; expected one of: --help"));
}

TEST_CASE("run --help describes every study kind a case file may ask for") {
  const auto help = turnfield("run --help");
  CHECK(help.status == 0);
  using tf::input::StudyKind;
  for (StudyKind k : {StudyKind::phase_angles, StudyKind::eddy_currents, StudyKind::synchronous, StudyKind::cogging,
                      StudyKind::rotor_sweep})
    CHECK(contains(help.output, std::string("  ") + tf::input::study_kind_name(k) + " "));
}

TEST_CASE("check prints the derived geometry: hand-worked values of cases/pump24_three_phase.toml") {
  const auto check = turnfield("check " + source_dir + "/cases/pump24_three_phase.toml");
  REQUIRE(check.status == 0);
  CAPTURE(check.output);
  // Bore 50 mm, rotor 49.6 mm; 24 slots 7 mm wide: coil area 7 mm x (16 - 0.8 - 0.7) mm; Carter's
  // factor as worked by hand in tests/input/test_derived_geometry.cpp; 60 f / p = 1500 rpm.
  for (const char* part : {"air gap                         0.40 mm", "slot pitch at the bore          13.09 mm (15.00°)",
                           "101.5 mm² for 24 conductors", "Carter's factor                 1.120",
                           "q (slots per pole and phase)    2\n", "1/4 of the machine (6 slot pitches), anti-periodic",
                           "1500 rpm at 50 Hz"})
    CHECK(contains(check.output, part));
}
