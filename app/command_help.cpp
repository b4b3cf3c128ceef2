#include "app/command_help.hpp"

#include <algorithm>
#include <cctype>

#include <fmt/format.h>

#include "input/toml_fields.hpp"

namespace tf::app {
namespace {

std::string joined(const std::vector<std::string>& words) {
  std::string out;
  for (const std::string& w : words) out += (out.empty() ? "" : ", ") + w;
  return out;
}

std::vector<std::string> command_names(const CLI::App& cli) {
  std::vector<std::string> names;
  for (const CLI::App* sub : cli.get_subcommands([](const CLI::App*) { return true; })) names.push_back(sub->get_name());
  return names;
}

/// "--fineness", "-j", ... of one command, help and version included.
std::vector<std::string> option_names(const CLI::App& command) {
  std::vector<std::string> names;
  for (const CLI::Option* o : command.get_options()) {
    for (const std::string& l : o->get_lnames()) names.push_back("--" + l);
    for (const std::string& s : o->get_snames()) names.push_back("-" + s);
  }
  return names;
}

std::string unknown_word(const std::string& what, const std::string& word, const std::vector<std::string>& valid) {
  const std::string guess = input::nearest(word, valid);
  if (!guess.empty()) return fmt::format("'{}' is no {}; did you mean '{}'?\n", word, what, guess);
  return fmt::format("'{}' is no {}; expected one of: {}\n", word, what, joined(valid));
}

}  // namespace

std::string study_kinds_help() {
  return R"(Study kinds ([study] kind in the case file):
  phase_angles   the currents advance through one electrical period in `steps` steps, rotor at rest:
                 the air-gap field, its rotation (magnitude and speed ripple), harmonics and torque.
                 Linear iron: solved once per phase and superposed; a B-H curve: step by step (Newton).
  synchronous    the rotor turns with the field, `load_angle_deg` behind it: torque by three methods,
                 flux linkages, d-q quantities, back-EMF, inductances, iron loss; step by step.
  cogging        no current; the rotor turns over `rotor_span_deg`: the cogging torque of the magnets.
  rotor_sweep    currents held at `current_angle_deg`; the rotor turns over `rotor_span_deg`.
  eddy_currents  time-harmonic with eddy currents, one solution per rotor speed (`rotor_speeds`):
                 torque, rotor loss, current or EMF against speed (a smooth rotor by the motion term,
                 a rotor with bars by the slip-frequency method).
Every run writes summary.json, report.html, CSV tables and VTU field files in the output folder.
)";
}

std::string did_you_mean(const CLI::App& cli, const std::vector<std::string>& args) {
  const auto first = std::find_if(args.begin(), args.end(), [](const std::string& a) { return a.empty() || a[0] != '-'; });
  if (first == args.end()) return {};
  const std::vector<std::string> commands = command_names(cli);
  if (std::find(commands.begin(), commands.end(), *first) == commands.end())
    return unknown_word("command", *first, commands);
  const CLI::App& command = *cli.get_subcommand(*first);
  const std::vector<std::string> options = option_names(command);
  std::string out;
  for (auto it = first + 1; it != args.end(); ++it) {
    if (it->size() < 2 || (*it)[0] != '-' || *it == "--") continue;
    if (std::isdigit(static_cast<unsigned char>((*it)[1])) || (*it)[1] == '.') continue;  // a negative number
    const std::string word = it->substr(0, it->find('='));
    if (std::find(options.begin(), options.end(), word) == options.end())
      out += unknown_word("option of '" + *first + "'", word, options);
  }
  return out;
}

}  // namespace tf::app
